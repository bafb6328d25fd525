package report

import (
	"math"
	"math/rand/v2"
	"strconv"
	"testing"
)

// checkG9 compares appendG9 with strconv.AppendFloat(v, 'g', 9, 64), the
// reference (the formatting of the sweep's output before appendG9), and
// checks the interval of equal text it returns: it holds v, and its ends
// and the midpoints between them and v have v's text by strconv. It
// reports the first few differences.
func checkG9(t *testing.T, what string, v float64, bad *int) {
	t.Helper()
	var b1, b2 [40]byte
	got, lo, hi := appendG9(b1[:0], v)
	want := strconv.AppendFloat(b2[:0], v, 'g', 9, 64)
	if string(got) != string(want) {
		*bad++
		if *bad <= 10 {
			t.Errorf("%s: appendG9(%v = %#x) = %q, want %q (strconv 'g' 9)", what, v, math.Float64bits(v), got, want)
		}
		return
	}
	if !(lo <= v && v <= hi) {
		*bad++
		if *bad <= 10 {
			t.Errorf("%s: appendG9(%v = %#x): interval [%v, %v] does not hold the value", what, v, math.Float64bits(v), lo, hi)
		}
		return
	}
	if lo == hi {
		return
	}
	for _, w := range []float64{lo, hi, lo + (v-lo)/2, v + (hi-v)/2} {
		if other := strconv.AppendFloat(b2[:0], w, 'g', 9, 64); string(other) != string(got) {
			*bad++
			if *bad <= 10 {
				t.Errorf("%s: appendG9(%v = %#x) = %q with interval [%v, %v], but %v in it is %q", what, v, math.Float64bits(v), got, lo, hi, w, other)
			}
			return
		}
	}
}

// TestAppendG9MatchesStrconv checks appendG9 byte for byte against
// strconv, and its interval of equal text (checkG9), on 10⁷ random values
// and on edge values: every power of ten
// and its neighbours, values a few ulps from a rounding boundary of the
// ninth digit (d.dddddddd5 × 10^k, 9.9999999995 × 10^k, 1.0000000005 × 10^k),
// zero, subnormals,
// the largest and smallest floats, and integers. The values are common
// practice for testing float formatting (no source); the reference is
// strconv, whose %.9g is C's.
func TestAppendG9MatchesStrconv(t *testing.T) {
	bad := 0
	rng := rand.New(rand.NewPCG(1, 2))
	n := 10_000_000
	if testing.Short() {
		n = 200_000
	}
	for i := 0; i < n; i++ {
		var v float64
		switch i % 4 {
		case 0: // any finite bit pattern
			for v = math.Float64frombits(rng.Uint64()); math.IsNaN(v) || math.IsInf(v, 0); v = math.Float64frombits(rng.Uint64()) {
			}
		case 1: // log-uniform over the fast range and a little beyond
			v = math.Pow(10, rng.Float64()*600-300)
		case 2: // sweep-like magnitudes
			v = math.Pow(10, rng.Float64()*24-12)
		case 3: // near a ninth-digit rounding boundary: (m + 1/2) 10^e ± a few ulps
			m := float64(1e8 + rng.Int64N(9e8))
			v = (m + 0.5) * math.Pow(10, float64(rng.IntN(60)-38))
			for range rng.IntN(7) - 3 {
				v = math.Nextafter(v, math.Inf(1))
			}
		}
		if rng.IntN(2) == 0 {
			v = -v
		}
		checkG9(t, "random", v, &bad)
	}
	edge := []float64{0, math.Copysign(0, -1), math.SmallestNonzeroFloat64, 2 * math.SmallestNonzeroFloat64,
		0x1p-1022, math.Nextafter(0x1p-1022, 0), math.MaxFloat64, 1, 1.5, 2.5, 0.5, 123456789, 1234567895, 1234567885,
		999999999, 999999999.5, 9999999995, 0.1, 0.2, 0.3, 1.0 / 3, 2.0 / 3, 1e-5, 1e-4, 9.9999999995e-5, 9.99999999949999e-5,
		9.99999999950001e-5, 0.00099999999950000, 1e21, 1e22, 1e23, 5e-324, 1.7976931348623157e308}
	for e := -324; e <= 308; e++ {
		p := math.Pow(10, float64(e))
		edge = append(edge, p, 9.9999999995*p, 9.99999999949*p, 1.00000000049*p, 1.0000000005*p, 4.999999995*p, 5.0000000005*p)
	}
	for _, v := range edge {
		for _, w := range []float64{v, math.Nextafter(v, 0), math.Nextafter(v, math.Inf(1)),
			math.Nextafter(math.Nextafter(v, 0), 0), math.Nextafter(math.Nextafter(v, math.Inf(1)), math.Inf(1))} {
			checkG9(t, "edge", w, &bad)
			checkG9(t, "edge", -w, &bad)
		}
	}
	for i := int64(-100000); i <= 100000; i++ {
		checkG9(t, "integer", float64(i), &bad)
		checkG9(t, "integer×1e5", float64(i)*1e5, &bad)
	}
	if bad > 0 {
		t.Errorf("%d values formatted differently from strconv", bad)
	}
}

// TestAppendNumberSpecial: NaN and ±Inf as numpy and astropy read them,
// or JSON null (cloudwind's output conventions, no published source).
func TestAppendNumberSpecial(t *testing.T) {
	for _, c := range []struct {
		v        float64
		text, js string
	}{
		{math.NaN(), "nan", "null"},
		{math.Inf(1), "inf", "null"},
		{math.Inf(-1), "-inf", "null"},
		{1e-5, "1e-05", "1e-05"},
		{-0.000123456789, "-0.000123456789", "-0.000123456789"},
	} {
		if got := string(AppendNumber(nil, c.v, false)); got != c.text {
			t.Errorf("AppendNumber(%v, false) = %q, want %q", c.v, got, c.text)
		}
		if got := string(AppendNumber(nil, c.v, true)); got != c.js {
			t.Errorf("AppendNumber(%v, true) = %q, want %q", c.v, got, c.js)
		}
	}
}

// BenchmarkAppendNumber compares appendG9 with strconv on sweep-like
// values (log-uniform over 10^±12).
func BenchmarkAppendNumber(b *testing.B) {
	rng := rand.New(rand.NewPCG(3, 4))
	vs := make([]float64, 4096)
	for i := range vs {
		vs[i] = math.Pow(10, rng.Float64()*24-12)
	}
	buf := make([]byte, 0, 64)
	b.Run("appendG9", func(b *testing.B) {
		i := 0
		for b.Loop() {
			buf = AppendNumber(buf[:0], vs[i&4095], false)
			i++
		}
	})
	b.Run("strconv", func(b *testing.B) {
		i := 0
		for b.Loop() {
			buf = strconv.AppendFloat(buf[:0], vs[i&4095], 'g', 9, 64)
			i++
		}
	})
}
