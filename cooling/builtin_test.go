package cooling

import (
	"bufio"
	"io/fs"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"sync"
	"testing"
	"testing/fstest"

	"cloudwind/assets"
	"cloudwind/model"
)

// biChiantiDir returns the directory of the CHIANTI curves (chiantiDir).
func biChiantiDir(t testing.TB) string {
	t.Helper()
	return chiantiDir(t)
}

// biChiantiCurve is one CHIANTI file: log10 T and log10 Λ_total per n_e n_H.
type biChiantiCurve struct{ x, y []float64 }

// biReadChianti reads the logT and Total columns of a CHIANTI file: '#'
// comments, one column-name row, then 401 rows (the format of the files).
func biReadChianti(t testing.TB, name string) biChiantiCurve {
	t.Helper()
	path := filepath.Join(biChiantiDir(t), name)
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	var c biChiantiCurve
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		fs := strings.Fields(sc.Text())
		if len(fs) < 2 || strings.HasPrefix(fs[0], "#") || fs[0] == "logT" {
			continue
		}
		x, err1 := strconv.ParseFloat(fs[0], 64)
		y, err2 := strconv.ParseFloat(fs[1], 64)
		if err1 != nil || err2 != nil {
			t.Fatalf("%s: bad row %q", path, sc.Text())
		}
		c.x, c.y = append(c.x, x), append(c.y, y)
	}
	if err := sc.Err(); err != nil {
		t.Fatal(err)
	}
	if len(c.x) != 401 || c.x[0] != 4 || c.x[400] != 8 {
		t.Fatalf("%s: %d rows from 10^%g K, want 401 rows from 10^4 to 10^8 K", path, len(c.x), c.x[0])
	}
	return c
}

// biChiantiMetals returns Λ_met = (Λ_z1 − Λ_z0.001)/0.999 and
// Λ_base = Λ_z0.001 − 0.001 Λ_met, linear, per n_e n_H (derived from the
// files; their normalisation per n_e n_H is inferred, see fitmetals).
func biChiantiMetals(t testing.TB) (x, met, base []float64) {
	c1, c0 := biReadChianti(t, "cooling_z1.txt"), biReadChianti(t, "cooling_z0.001.txt")
	met, base = make([]float64, len(c1.x)), make([]float64, len(c1.x))
	for i := range c1.x {
		a, b := math.Pow(10, c1.y[i]), math.Pow(10, c0.y[i])
		met[i] = (a - b) / 0.999
		base[i] = b - 0.001*met[i]
	}
	return c1.x, met, base
}

// biBuiltin builds the Builtin once for all tests.
var biBuiltin = sync.OnceValues(NewBuiltin)

// biMustBuiltin returns the shared Builtin or fails the test.
func biMustBuiltin(t testing.TB) *Builtin {
	t.Helper()
	b, err := biBuiltin()
	if err != nil {
		t.Fatalf("NewBuiltin() error: %v", err)
	}
	return b
}

// biAt10 returns 10^x as a Temperature.
func biAt10(x float64) model.Temperature { return model.Temperature(math.Pow(10, x)) }

// TestBuiltinAgainstChianti checks the built-in total against the CHIANTI
// curves converted to n_H² with the built-in's n_e/n_H, from 10^4.3 to 10^8
// K, at Z = 0.1, 0.316, 1, 3.16 and 10. Target: 20% at every node (the
// project's accuracy requirement for the built-in; common practice, no
// source), no exceptions. Measured largest errors (He+ excitation without
// Cen's factor): Z = 0.1 16.4% high at 10^5.03 K, 0.316 8.4% at 10^5.02 K,
// 1 5.2% at 10^7.94 K, 3.16 6.0% and 10 8.7% at 10^8 K. The effective Z of
// the files labelled z0.5 and z5 are 10^-0.5 and 10^0.5 (measured: least
// squares over 10^5.0–10^5.8 K, see TestChiantiReference).
func TestBuiltinAgainstChianti(t *testing.T) {
	b := biMustBuiltin(t)
	const target = 0.20 // requirement
	for _, tc := range []struct {
		file string
		z    float64 // effective Z in Z☉ (measured)
	}{
		{"cooling_z0.1.txt", 0.1},
		{"cooling_z0.5.txt", math.Pow(10, -0.5)},
		{"cooling_z1.txt", 1},
		{"cooling_z5.txt", math.Pow(10, 0.5)},
		{"cooling_z10.txt", 10}, // beyond the brief's four; passes the same target
	} {
		c := biReadChianti(t, tc.file)
		p, err := b.At(tc.z)
		if err != nil {
			t.Fatalf("At(%g) error: %v", tc.z, err)
		}
		worst, where := 0.0, 0.0
		for i, x := range c.x {
			if x < 4.3-1e-9 {
				continue
			}
			ref := math.Pow(10, c.y[i]) * NeOverNH(biAt10(x), BuiltinHeliumRatio) // file values, n_e n_H → n_H²
			got := float64(p.Lambda(biAt10(x)))
			e := math.Abs(got/ref - 1)
			if e > worst {
				worst, where = e, x
			}
			if e > target {
				t.Errorf("At(%.3g).Lambda(10^%.2f K) = %.4g, want %.4g ± %.0f%% (%s × n_e/n_H)", tc.z, x, got, ref, 100*target, tc.file)
			}
		}
		t.Logf("Z = %.3g (%s): largest error %.1f%% at 10^%.2f K", tc.z, tc.file, 100*worst, where)
	}
}

// TestBuiltinHHeAgainstChianti checks the H+He part alone against the
// Z = 0.001 CHIANTI curve (file values × n_e/n_H) from 1.5×10^4 to 10^8 K.
// Target: 35% at every node (requirement; common practice, no source),
// asserted both against the metal-free part of that curve, Λ_z0.001 −
// 0.001 Λ_met with Λ_met from the files themselves (biChiantiMetals), and
// against the file as it stands, whose 0.001 Z☉ of metals add up to about
// 1% near 10^5 K. Measured: 32.4% high at 10^5.12 K against the
// metal-free part, 30.8% at 10^5.10 K against the file; the cause is the
// KWH96 He+ ionisation fraction (see TestHepExcitationGnatFerland).
func TestBuiltinHHeAgainstChianti(t *testing.T) {
	b := biMustBuiltin(t)
	const target = 0.35 // requirement
	const file = "cooling_z0.001.txt"
	c := biReadChianti(t, file)
	_, _, base := biChiantiMetals(t)
	worst, where := [2]float64{}, [2]float64{}
	for i, x := range c.x {
		if x < math.Log10(1.5e4)-1e-9 {
			continue
		}
		ne := NeOverNH(biAt10(x), BuiltinHeliumRatio)
		got := float64(b.HHe().Lambda(biAt10(x)))
		for k, ref := range [2]float64{base[i] * ne, math.Pow(10, c.y[i]) * ne} { // n_e n_H → n_H²
			e := math.Abs(got/ref - 1)
			if e > worst[k] {
				worst[k], where[k] = e, x
			}
			what := "the metal-free part of " + file
			if k == 1 {
				what = file
			}
			if e > target {
				t.Errorf("HHe().Lambda(10^%.2f K) = %.4g, want %.4g ± %.0f%% (%s × n_e/n_H)", x, got, ref, 100*target, what)
			}
		}
	}
	t.Logf("H+He: largest error %.1f%% at 10^%.2f K against the metal-free part, %.1f%% at 10^%.2f K against the file",
		100*worst[0], where[0], 100*worst[1], where[1])
}

// TestBuiltinHydrogenPeak checks that the built-in H+He curve peaks within
// 0.05 dex (requirement) of the CHIANTI Z = 0.001 hydrogen peak, comparing
// in one normalisation at a time (peaks move under conversion, derived):
// per n_e n_H against the file values (peak at 10^4.22 K), and per n_H²
// against the file converted with n_e/n_H.
func TestBuiltinHydrogenPeak(t *testing.T) {
	b := biMustBuiltin(t)
	c := biReadChianti(t, "cooling_z0.001.txt")
	const tol = 0.05 // dex, requirement
	peak := func(f func(i int) float64) float64 {
		best, at := math.Inf(-1), 0.0
		for i, x := range c.x {
			if x > 4.5 { // the H peak; the He+ peak lies above 10^4.8 K
				break
			}
			if v := f(i); v > best {
				best, at = v, x
			}
		}
		return at
	}
	ne := func(i int) float64 { return NeOverNH(biAt10(c.x[i]), BuiltinHeliumRatio) }
	hhe := func(i int) float64 { return float64(b.HHe().Lambda(biAt10(c.x[i]))) }
	for _, tc := range []struct {
		norm      string
		got, want float64
	}{
		{"n_e n_H", peak(func(i int) float64 { return hhe(i) / ne(i) }), peak(func(i int) float64 { return c.y[i] })},
		{"n_H²", peak(hhe), peak(func(i int) float64 { return math.Pow(10, c.y[i]) * ne(i) })},
	} {
		t.Logf("H peak per %s: HHe() at 10^%.2f K, file at 10^%.2f K", tc.norm, tc.got, tc.want)
		if math.Abs(tc.got-tc.want) > tol {
			t.Errorf("H peak of HHe() per %s at 10^%.2f K, want 10^%.2f K ± %g dex (cooling_z0.001.txt)", tc.norm, tc.got, tc.want, tol)
		}
	}
}

// TestBuiltinAtErrors checks that At rejects metallicities outside its
// domain (Special cases of At).
func TestBuiltinAtErrors(t *testing.T) {
	b := biMustBuiltin(t)
	for _, z := range []float64{-1e-9, -1, math.NaN(), math.Inf(1), math.Inf(-1)} {
		if p, err := b.At(z); err == nil {
			t.Errorf("At(%g) = %v, nil; want an error", z, p)
		}
	}
}

// TestBuiltinLinearInZ checks that Λ(Z) is built from parts linear in Z
// (derived: the definitions in Builtin): on the KI02 nodes below T_cap, Λ =
// Λ_Lyα + Z Λ_fs; on the nodes from T_cap to 10^4 K, the cap Λ_H+He(10^4 K)
// + Z Λ_met(10^4 K); on the CIE nodes, Λ = Λ_H+He + Z Λ_met; At(0) = HHe();
// and the node grid: 0.01 dex from 10 K to 10^8 K plus the cap node.
func TestBuiltinLinearInZ(t *testing.T) {
	b := biMustBuiltin(t)
	const tol = 1e-12 // rounding of the log10 round trip
	xM, yM := b.Metals().Nodes()
	if len(xM) != 401 || xM[0] != 4 || xM[400] != 8 || math.Abs(xM[123]-5.23) > 1e-15 {
		t.Fatalf("Metals().Nodes() has %d nodes from 10^%g to 10^%g K, want 401 from 10^4 to 10^8 K at 0.01 dex", len(xM), xM[0], xM[len(xM)-1])
	}
	h0, h1 := b.HHe(), mustAt(t, b, 0)
	if x0, y0 := h0.Nodes(); !slices.Equal(x0, h1.log10T) || !slices.Equal(y0, h1.log10L) {
		t.Errorf("HHe() differs from At(0)")
	}
	cie := func(j int, z float64) float64 {
		_, c := PrimordialCIE(model.Temperature(math.Pow(10, xM[j])), BuiltinHeliumRatio, PrimordialOptions{})
		return float64(c.Total()) + z*math.Pow(10, yM[j])
	}
	for _, z := range []float64{0, 0.1, 1, 3.16, 30} {
		p := mustAt(t, b, z)
		tc, _ := b.CapTemperature(z)
		xc := math.Log10(float64(tc))
		x, y := p.Nodes()
		if len(x) != 702 || x[0] != 1 || x[len(x)-1] != 8 {
			t.Fatalf("At(%g).Nodes() has %d nodes from 10^%g to 10^%g K, want 702 from 10 K to 10^8 K", z, len(x), x[0], x[len(x)-1])
		}
		off := 0
		for i := range x {
			if math.Abs(x[i]*100-math.Round(x[i]*100)) > 1e-9 {
				off++
				if math.Abs(x[i]-xc) > 1e-12 {
					t.Errorf("At(%g) node %d at 10^%.6f K, off the 0.01-dex grid and not T_cap = 10^%.6f K", z, i, x[i], xc)
				}
			}
			var want float64
			switch {
			case x[i] < xc:
				lya, fs := ki02Terms(math.Pow(10, x[i]))
				want = lya + z*fs
			case x[i] < 4:
				want = cie(0, z) // the cap
			default:
				j := int(math.Round((x[i] - 4) * 100))
				want = cie(j, z)
			}
			if got := math.Pow(10, y[i]); math.Abs(got/want-1) > tol {
				t.Fatalf("At(%g) node %d: Λ(10^%g K) = %.15g, want %.15g", z, i, x[i], got, want)
			}
		}
		if off != 1 {
			t.Errorf("At(%g) has %d nodes off the 0.01-dex grid, want 1 (T_cap)", z, off)
		}
	}
}

// mustAt returns b.At(z) or fails the test.
func mustAt(t *testing.T, b *Builtin, z float64) *PowerLaw {
	t.Helper()
	p, err := b.At(z)
	if err != nil {
		t.Fatalf("At(%g) error: %v", z, err)
	}
	return p
}

// TestBuiltinMeta checks the metadata the UI shows.
func TestBuiltinMeta(t *testing.T) {
	b := biMustBuiltin(t)
	p, err := b.At(0.3)
	if err != nil {
		t.Fatal(err)
	}
	m := p.Meta()
	if m.Metallicity != 0.3 || m.HeliumRatio != BuiltinHeliumRatio || m.Mixture != "Grevesse & Sauval 1998" ||
		m.Normalisation != PerNeNH || m.Historical || len(m.Warnings) != 0 {
		t.Errorf("At(0.3).Meta() = %+v, want Z 0.3, y %g, GS98, nenH, not historical, no warnings", m, BuiltinHeliumRatio)
	}
	for _, want := range []string{"Katz, Weinberg & Hernquist", "Voronov 1997", "Ryden & Pogge 2021", "CC-BY-4.0", "derived work",
		"Black 1981, MNRAS 197, 553", "Koyama & Inutsuka 2002, ApJ 564, L97", "unverified against the paper"} {
		if !strings.Contains(m.Citation, want) {
			t.Errorf("At(0.3).Meta().Citation = %q, want it to contain %q", m.Citation, want)
		}
	}
	caveats := strings.Join(m.Caveats, "\n")
	// The low-temperature part: what it is, what it leaves out, the cap
	// (T_cap(0.3) = 5396 K and the cap 7.9e-27, measured; KI02 536 times
	// CIE at 10^4 K, measured) and the floor.
	for _, want := range []string{"at and above 1e4 K: " + CaveatCIE, "results for T_cl ≥ 1e4 K are as before",
		"metal electrons are neglected", "metal fit reproduces the CHIANTI metal part within",
		"not CIE", "heating rate of 2e-26 erg/s", "no ionising background", "min(KI02, the CIE value at 1e4 K, 7.9e-27 erg cm³ s⁻¹)",
		"so that the CIE curve stays unchanged at and above 1e4 K", "KI02 up to T_cap = 5396 K", "discards KI02 between 5396 K and 1e4 K",
		"536 times CIE at 1e4 K", "ionised by more than collisions, with a heating term not included",
		"fine-structure term (metal cooling) is scaled by Z", "Λ = 0 below T_floor"} {
		if !strings.Contains(caveats, want) {
			t.Errorf("At(0.3).Meta().Caveats = %q, want one containing %q", m.Caveats, want)
		}
	}
	if !strings.Contains(m.Name, "built-in, Z = 0.3 Z☉ (CIE from 1e4 K") || !strings.Contains(m.Name, "KI02 below, capped") {
		t.Errorf("At(0.3).Meta().Name = %q, want CIE and the capped KI02 named", m.Name)
	}
	if mm := strings.Join(b.Metals().Meta().Caveats, "\n"); strings.Contains(mm, "KI02") || !strings.Contains(mm, CaveatCIE) {
		t.Errorf("Metals().Meta().Caveats = %q, want the CIE caveats only", b.Metals().Meta().Caveats)
	}
	// Each call has its own slices.
	first := m.Caveats[0]
	m.Caveats[0] = "changed"
	if q, _ := b.At(0.3); q.Meta().Caveats[0] != first {
		t.Errorf("At(0.3).Meta().Caveats[0] = %q after a caller changed another copy, want %q", q.Meta().Caveats[0], first)
	}
	if q, _ := b.At(0); q.Meta().Normalisation != PerNH2 {
		t.Errorf("At(0).Meta().Normalisation = %v, want nH2 (no tabulated metal part)", q.Meta().Normalisation)
	}
	if q, _ := b.At(12); len(q.Meta().Warnings) != 1 {
		t.Errorf("At(12).Meta().Warnings = %q, want one warning above 10 Z☉", q.Meta().Warnings)
	}
	if m := b.HHe().Meta(); m.Metallicity != 0 || m.Normalisation != PerNH2 {
		t.Errorf("HHe().Meta() = %+v, want Z 0 and nH2", m)
	}
}

// TestNewBuiltinBadAsset checks that a damaged coefficient file gives an
// error, not a panic.
func TestNewBuiltinBadAsset(t *testing.T) {
	good, err := fs.ReadFile(assets.FS, metalFitFile)
	if err != nil {
		t.Fatal(err)
	}
	narrow := strings.Replace(string(good), "valid: log10 T 4.00 to 8.00", "valid: log10 T 4.00 to 7.00", 1)
	for name, fsys := range map[string]fstest.MapFS{
		"missing":   {},
		"empty":     {metalFitFile: {Data: nil}},
		"truncated": {metalFitFile: {Data: good[:len(good)/2]}},
		"narrow":    {metalFitFile: {Data: []byte(narrow)}},
	} {
		if b, err := newBuiltin(fsys, metalFitFile); err == nil {
			t.Errorf("newBuiltin(%s file) = %p, nil; want an error", name, b)
		}
	}
}

// BenchmarkNewBuiltin measures building the built-in curve (requirement:
// at most 20 ms).
func BenchmarkNewBuiltin(b *testing.B) {
	for b.Loop() {
		if _, err := NewBuiltin(); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkBuiltinAt measures one metallicity of a sweep.
func BenchmarkBuiltinAt(b *testing.B) {
	bi, err := NewBuiltin()
	if err != nil {
		b.Fatal(err)
	}
	z := 0.0
	for b.Loop() {
		if _, err := bi.At(z); err != nil {
			b.Fatal(err)
		}
		z += 0.01
	}
}
