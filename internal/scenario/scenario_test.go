package scenario

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"reflect"
	"strings"
	"testing"

	"cloudwind/model"
)

// Expected values in this file are format rules of this package (the
// scenario-file format in doc.go and scenario.go) unless a comment names
// another source.

// docScenarioExample returns the scenario example of doc.go, without the
// comment markers.
func docScenarioExample(t *testing.T) string {
	t.Helper()
	src, err := os.ReadFile("doc.go")
	if err != nil {
		t.Fatal(err)
	}
	_, rest, ok := strings.Cut(string(src), "//\t# cloudwind scenario\n")
	if !ok {
		t.Fatal("doc.go has no scenario example")
	}
	var b strings.Builder
	b.WriteString("# cloudwind scenario\n")
	for _, l := range strings.Split(rest, "\n") {
		if l == "//" {
			b.WriteString("\n")
			continue
		}
		body, ok := strings.CutPrefix(l, "//\t")
		if !ok {
			break
		}
		b.WriteString(body + "\n")
	}
	return b.String()
}

func TestParseScenarioDocExample(t *testing.T) {
	s, err := Parse(strings.NewReader(docScenarioExample(t)), "doc.toml")
	if err != nil {
		t.Fatalf("Parse(doc example): %v", err)
	}
	// The values written in the example of doc.go.
	want := Scenario{
		Name: "Starburst outflow, inner kpc", Description: "free text",
		Params: model.Params{Chi: 300, Mach: 1.5, Pressure: 1e5, TCloud: 1e4, RCloud: 10 * model.Parsec, Metallicity: 1,
			Gamma: 1.6666666666666667, Mu: 0.6, MuCold: 0.6, MuHot: 0.6, Mixture: model.Asplund2009,
			HydrogenFraction: 0.7381, TFloor: 1e4, HeatCapacity: model.Isochoric, DensityProduct: model.NH2, MixCooling: model.CoolMinMix},
		Cooling: "builtin", Table: []string{"norm: nH2", "columns: T=1 lambda=2"},
	}
	if !reflect.DeepEqual(s, want) {
		t.Errorf("Parse(doc example) =\n%+v\nwant\n%+v", s, want)
	}
	// The example spells out the defaults, so it is the fiducial problem's
	// conventions (model.Params.WithDefaults; A09 X = 0.7381 from AAG21 Table 4).
	if got, def := s.Params.WithDefaults(), (model.Params{Chi: 300, Mach: 1.5, Pressure: 1e5, TCloud: 1e4,
		RCloud: 10 * model.Parsec, Metallicity: 1}).WithDefaults(); got != def {
		t.Errorf("doc example conventions %+v differ from the defaults %+v", got, def)
	}
}

func TestParseScenarioDefaults(t *testing.T) {
	// Missing inputs take model.Fiducial(); missing conventions stay zero
	// (the model default); no [cooling] leaves Cooling empty.
	s, err := Parse(strings.NewReader("# nothing\n"), "empty.toml")
	if err != nil {
		t.Fatalf("Parse(empty): %v", err)
	}
	if !reflect.DeepEqual(s, Scenario{Params: model.Fiducial()}) {
		t.Errorf("Parse(empty) = %+v, want the fiducial problem and nothing else", s)
	}
	s, err = Parse(strings.NewReader("[inputs]\nradius = 0.5\nmach = 2\n"), "some.toml")
	if err != nil {
		t.Fatalf("Parse(some inputs): %v", err)
	}
	want := model.Fiducial()
	want.RCloud, want.Mach = 0.5*model.Parsec, 2
	if s.Params != want {
		t.Errorf("Parse(some inputs).Params = %+v, want %+v", s.Params, want)
	}
}

func TestWriteScenarioLayout(t *testing.T) {
	s := Scenario{
		Name: `Demo "χ" \ test`, Demo: true,
		Params: model.Params{Chi: 300, Mach: 1.5, Pressure: 1e5, TCloud: 1e4, RCloud: 10 * model.Parsec, Metallicity: 0.3,
			MuHot: 0.59, HeatCapacity: model.Isobaric, Mixture: model.GrevesseSauval1998},
		Cooling: "tables/cie.dat", Table: []string{"norm: nH2"},
	}
	var b bytes.Buffer
	if err := Write(&b, s); err != nil {
		t.Fatalf("Write: %v", err)
	}
	const want = `# cloudwind scenario
[scenario]
name = "Demo \"χ\" \\ test"
demo = true

[inputs]
chi = 300                # rho_cl/rho_hot
mach = 1.5
pressure = 100000        # P/k_B in K cm^-3
t_cloud = 10000          # K
radius = 10              # pc
metallicity = 0.3        # Z/Z_sun

[conventions]
mu_hot = 0.59
mixture = "GS98"
heat_capacity = "isobaric"

[cooling]
spec = "tables/cie.dat"
table = ["norm: nH2"]
`
	if b.String() != want {
		t.Errorf("Write =\n%s\nwant\n%s", b.String(), want)
	}
}

// randomScenario returns a scenario with random valid inputs, random
// optional conventions and random text.
func randomScenario(r *rand.Rand) Scenario {
	logU := func(lo, hi float64) float64 { return math.Pow(10, lo+(hi-lo)*r.Float64()) }
	maybe := func(v float64) float64 {
		if r.IntN(2) == 0 {
			return 0
		}
		return v
	}
	runes := []rune(`aZ09 _-#=[]{}'"\χ☉⁻³é` + "\u00a0\U0001F600")
	text := func() string {
		rs := make([]rune, r.IntN(12))
		for i := range rs {
			rs[i] = runes[r.IntN(len(runes))]
		}
		return string(rs)
	}
	for {
		p := model.Params{
			Chi: 1 + logU(-3, 5), Mach: logU(-3, 2.9), Pressure: model.Pressure(logU(-5.9, 11.9)),
			TCloud: model.Temperature(logU(0.1, 7.9)), RCloud: model.Length(logU(-8.9, 6.9)) * model.Parsec,
			Metallicity: maybe(logU(-3, 2.9)),
			Gamma:       maybe(1 + 1.9*r.Float64()), Mu: maybe(logU(-0.9, 0.9)), MuCold: maybe(logU(-0.9, 0.9)),
			MuHot: maybe(logU(-0.9, 0.9)), HydrogenFraction: maybe(logU(-2.9, 0)),
			HeatCapacity: model.HeatCapacity(r.IntN(2)), DensityProduct: model.DensityProduct(r.IntN(3)),
		}
		if r.IntN(2) == 0 {
			ms := model.Mixtures()
			p.Mixture = ms[r.IntN(len(ms))]
		}
		p.TFloor = model.Temperature(maybe(float64(p.TCloud) * r.Float64()))
		if p.Validate() != nil {
			continue
		}
		s := Scenario{Name: text(), Description: text(), Demo: r.IntN(2) == 0, Params: p}
		switch r.IntN(4) {
		case 1:
			s.Cooling = "builtin"
		case 2:
			s.Cooling = "const:3.98e-22"
		case 3:
			s.Cooling = "tables/" + text() + "x.dat"
			for range r.IntN(3) {
				s.Table = append(s.Table, "norm: "+text()+"x")
			}
		}
		if r.IntN(3) == 0 { // an outflow, with one μ
			s.Params.MuCold, s.Params.MuHot = 0, 0
			o := &Outflow{Radius: model.Length(logU(-2.9, 5.9)) * model.Parsec}
			if r.IntN(2) == 0 {
				o.SFR = model.MassRate(logU(-5.9, 4.9)) * model.SolarMassPerYear
				o.EnergyLoading, o.MassLoading = logU(-3, 1), logU(-3, 2)
			} else {
				o.EnergyRate, o.MassRate = model.Power(logU(30.1, 49.9)), model.MassRate(logU(-8, 8.4))*model.SolarMassPerYear // written in M☉ yr⁻¹, as a file gives it
			}
			s.Outflow = o
			if s.Params.Validate() != nil {
				continue
			}
			if w, _ := s.Wind(); w.Validate() != nil {
				continue
			}
		}
		return s
	}
}

func TestWriteScenarioRoundTrip(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	for i := range 2000 {
		s := randomScenario(r)
		var b bytes.Buffer
		if err := Write(&b, s); err != nil {
			t.Fatalf("case %d: Write(%+v): %v", i, s, err)
		}
		got, err := Parse(bytes.NewReader(b.Bytes()), "rt.toml")
		if err != nil {
			t.Fatalf("case %d: Parse(Write(s)): %v\nfile:\n%s", i, err, b.String())
		}
		if !reflect.DeepEqual(got, s) {
			t.Fatalf("case %d: Parse(Write(s)) =\n%+v\nwant\n%+v\nfile:\n%s", i, got, s, b.String())
		}
	}
}

// readNumber reads the number s as ParseTOML reads the value of a key.
func readNumber(s string) (float64, error) {
	doc, err := ParseTOML(strings.NewReader("x = " + s))
	if err != nil {
		return 0, err
	}
	if v := doc.Root.Values["x"]; v.IsNumber() {
		return v.Num, nil
	}
	return 0, fmt.Errorf("x = %s is not a number", s)
}

func TestFormatParsecs(t *testing.T) {
	// A radius typed in pc converts back exactly; one typed in cm comes
	// back within one unit in the last place (the pc grid does not cover
	// every float).
	r := rand.New(rand.NewPCG(3, 4))
	for range 2000 {
		pc := math.Pow(10, -9+16*r.Float64())
		rcm := model.Length(pc) * model.Parsec
		s := formatParsecs(rcm)
		v, err := readNumber(s)
		if err != nil || model.Length(v)*model.Parsec != rcm {
			t.Fatalf("formatParsecs(%g cm = %g pc) = %q, which reads back as %g cm (%v)", float64(rcm), pc, s, float64(model.Length(v)*model.Parsec), err)
		}
		cm := math.Pow(10, 10+14*r.Float64())
		v, err = readNumber(formatParsecs(model.Length(cm)))
		if err != nil {
			t.Fatal(err)
		}
		back := float64(model.Length(v) * model.Parsec)
		if back != cm && back != math.Nextafter(cm, 0) && back != math.Nextafter(cm, math.Inf(1)) {
			t.Fatalf("formatParsecs(%g cm) reads back as %g cm, more than one ulp away", cm, back)
		}
	}
}

func TestWriteScenarioRefuses(t *testing.T) {
	ok := Scenario{Params: model.Fiducial()}
	cases := []struct {
		name string
		edit func(*Scenario)
	}{
		{"control character in name", func(s *Scenario) { s.Name = "a\x1b[31m" }},
		{"C1 control in description", func(s *Scenario) { s.Description = "a\u0085b" }},
		{"bidi override in name", func(s *Scenario) { s.Name = "a\u202eb" }},
		{"invalid UTF-8", func(s *Scenario) { s.Description = "a\xffb" }},
		{"table without spec", func(s *Scenario) { s.Table = []string{"norm: nH2"} }},
		{"empty table setting", func(s *Scenario) { s.Cooling, s.Table = "t.dat", []string{" "} }},
		{"blank spec", func(s *Scenario) { s.Cooling = "  " }},
		{"unknown mixture", func(s *Scenario) { s.Params.Mixture = model.Mixture{Name: "mine", X: 0.7} }},
		{"invalid input", func(s *Scenario) { s.Params.Chi = math.NaN() }},
		{"invalid convention", func(s *Scenario) { s.Params.HeatCapacity = 7 }},
	}
	for _, c := range cases {
		s := ok
		c.edit(&s)
		var b bytes.Buffer
		if err := Write(&b, s); err == nil || b.Len() > 0 {
			t.Errorf("%s: Write wrote %d bytes, error %v; want an error and nothing written", c.name, b.Len(), err)
		}
	}
	if err := Write(&bytes.Buffer{}, ok); err != nil {
		t.Errorf("Write(fiducial) = %v, want nil (the cases above must fail for their own reason)", err)
	}
}

type badScenarioCase struct {
	name  string
	src   string
	line  int
	msg   string
	field string // the *model.FieldError field, "" when none is wrapped
}

func badScenarioCases() []badScenarioCase {
	return []badScenarioCase{
		{"misspelt input", "[inputs]\nchi = 3\nmahc = 2\n", 3, `unknown key "mahc" (did you mean "mach"?)`, ""},
		{"unknown key", "[scenario]\ncolour = \"red\"\n", 2, "known keys: name, description, demo", ""},
		{"misspelt convention", "[conventions]\n\nhydrogen-fraction = 0.7\n", 3, `did you mean "hydrogen_fraction"?`, ""},
		{"key in the wrong table", "[conventions]\nchi = 300\n", 2, `key "chi" belongs in [inputs], not [conventions]`, ""},
		{"key outside any table", "\nchi = 300\n", 2, `key "chi" is outside any table`, ""},
		{"unknown table", "[input]\nchi = 3\n", 1, `unknown table [input] (did you mean "inputs"?)`, ""},
		{"array of tables", "[scenario]\n[[inputs]]\n", 2, "write [inputs], not [[inputs]]", ""},
		{"sub-table", "[inputs]\nchi = 3\n[inputs.extra]\n", 3, "[inputs] has no sub-tables", ""},
		{"table twice", "[inputs]\n[cooling]\n[inputs]\n", 3, "invalid TOML: table [inputs] is already defined (first defined on line 1)", ""},
		{"string for a number", "[inputs]\nchi = \"300\"\n", 2, "chi must be a number, not a string", ""},
		{"number for a string", "[scenario]\nname = 5\n", 2, "name must be a string, not an integer (put it in quotes)", ""},
		{"string for a boolean", "[scenario]\ndemo = \"yes\"\n", 2, "demo must be true or false, not a string", ""},
		{"nan", "[inputs]\nmach = nan\n", 2, "mach must be a finite number (got NaN)", ""},
		{"inf", "[inputs]\n\npressure = inf\n", 3, "pressure must be a finite number (got +Inf)", ""},
		{"-inf convention", "[conventions]\nt_floor = -inf\n", 2, "t_floor must be a finite number", ""},
		{"radius overflows", "[inputs]\nradius = 1e300\n", 2, "radius = 1e+300 pc is out of range", ""},
		{"zero convention", "[conventions]\nmu = 0\n", 2, "mu: must be at least 0.1 (got 0)", "mu"},
		{"zero gamma", "[conventions]\ngamma = 0\n", 2, "gamma: must be greater than 1 (got 0)", "gamma"},
		{"negative floor", "[conventions]\nt_floor = -1\n", 2, "t_floor: must be a finite temperature ≥ 0 K, 0 for no floor (got -1)", "t_floor"},
		{"soft hyphen", "[scenario]\nname = \"a\u00adb\"\n", 2, "name contains U+00AD, a format or bidirectional character", ""},
		{"unknown mixture", "[conventions]\nmixture = \"A10\"\n", 2, `unknown mixture "A10" (want one of A09, A09p, AG89, GS98, A21)`, ""},
		{"mixture in lower case", "[conventions]\nmixture = \"gs98\"\n", 2, `unknown mixture "gs98" (want one of A09, A09p, AG89, GS98, A21) (did you mean "GS98"?)`, ""},
		{"unknown heat capacity", "[conventions]\nheat_capacity = \"isothermal\"\n", 2, `unknown heat_capacity "isothermal" (want isochoric or isobaric)`, ""},
		{"outflow without loadings", "[outflow]\nsfr = 10\ninjection_radius = 300\n", 1, "[outflow]: energy_loading: must be greater than 0 (got 0)", "energy_loading"},
		{"outflow with both modes", "[outflow]\nsfr = 10\nenergy_loading = 1\nmass_loading = 1\nenergy_rate = 1e42\nmass_rate = 3\ninjection_radius = 300\n", 2, "give either the injection rates", "sfr"},
		{"negative sfr", "[outflow]\n\nsfr = -1\n", 3, "sfr: must be", "sfr"},
		{"outflow without radius", "[outflow]\nenergy_rate = 1e42\nmass_rate = 2\n", 1, "injection_radius: must be", "injection_radius"},
		{"misspelt outflow key", "[outflow]\nsfrr = 10\n", 2, `unknown key "sfrr" (did you mean "sfr"?)`, ""},
		{"outflow key in inputs", "[inputs]\nsfr = 10\n", 2, `key "sfr" belongs in [outflow], not [inputs]`, ""},
		{"empty outflow", "[outflow]\n", 1, "[outflow]: energy_rate: must be", "energy_rate"},
		{"outflow with two mu", "[conventions]\nmu_cloud = 1.2\n[outflow]\nsfr = 10\nenergy_loading = 1\nmass_loading = 1\ninjection_radius = 300\n", 2, "an outflow has one μ", ""},
		{"outflow colder than clouds", "[inputs]\nt_cloud = 1e6\n[outflow]\nenergy_rate = 1e40\nmass_rate = 100\ninjection_radius = 300\n", 2, "the wind is nowhere hotter than the clouds", "t_cloud"},
		{"unknown density product", "[conventions]\ndensity_product = \"nH2\"\n", 2, `unknown density_product "nH2" (want nh2, n2 or neni) (did you mean "nh2"?)`, ""},
		{"mixture not a string", "[conventions]\nmixture = 1\n", 2, "mixture must be a string", ""},
		{"escaped control character", "[scenario]\nname = \"\\u001b[31mred\"\n", 2, "name contains the control character U+001B", ""},
		{"C1 control character", "[scenario]\ndescription = \"x\u0085y\"\n", 2, "description contains the control character U+0085", ""},
		{"bidi override", "[scenario]\nname = \"abc\u202Edef\"\n", 2, "name contains U+202E", ""},
		{"bidi isolate, escaped", "[scenario]\ndescription = 'a'\nname = \"a\\u2066b\"\n", 3, "name contains U+2066", ""},
		{"line separator", "[cooling]\nspec = \"a\u2028b\"\n", 2, "spec contains U+2028", ""},
		{"empty spec", "[cooling]\nspec = \"\"\n", 2, "spec must not be empty", ""},
		{"table without spec", "[cooling]\n\ntable = [\"norm: nH2\"]\n", 3, "[cooling] needs spec", ""},
		{"table not an array", "[cooling]\nspec = \"t.dat\"\ntable = \"norm: nH2\"\n", 3, "table must be an array of strings, not a string", ""},
		{"table of numbers", "[cooling]\nspec = \"t.dat\"\ntable = [\n  \"norm: nH2\",\n  1,\n]\n", 5, "table must be a string, not an integer", ""},
		{"empty table setting", "[cooling]\nspec = \"t.dat\"\ntable = [\"\"]\n", 3, "table settings must not be empty", ""},
		{"TOML syntax error", "[scenario]\nname = \"open\n", 2, "unterminated string", ""},
		{"inline table for a number", "[inputs]\nchi = { a = 1 }\n", 2, "chi must be a number, not a table", ""},
		{"sub-table for a number", "[inputs]\n[inputs.mach]\n", 2, "mach must be a number, not a table", ""},
		{"dotted key under a number", "[cooling]\nspec.x = 1\n", 2, "spec must be a string, not a table", ""},
		{"array of tables for table", "[cooling]\nspec = \"t.dat\"\ntable = [{ a = 1 }]\n", 3, "table must be a string, not a table", ""},
		{"table in the wrong table", "[conventions]\nchi = {}\n", 2, `key "chi" belongs in [inputs], not [conventions]`, ""},
		{"unknown inline sub-table", "inputs = {extra = {}}\n", 1, "unknown table [inputs.extra]: [inputs] has no sub-tables", ""},
		{"table as a value", "inputs = 5\n", 1, "inputs must be a table, as in [inputs], not an integer", ""},
		{"date for a string", "[scenario]\nname = 1979-05-27\n", 2, "name must be a string, not a local date (put it in quotes)", ""},
		{"time for a number", "[inputs]\n\nchi = 07:32:00\n", 3, "chi must be a number, not a local time", ""},
		{"date-time for a boolean", "[scenario]\ndemo = 1979-05-27 07:32:00\n", 2, "demo must be true or false, not a local date-time", ""},
		{"dates in an array", "[cooling]\nspec = \"t.dat\"\ntable = [\n  1979-05-27T07:32:00-08:00,\n]\n", 4, "table must be a string, not an offset date-time", ""},
		{"backspace escape", "[scenario]\nname = \"a\\bb\"\n", 2, "name contains the control character U+0008", ""},
		{"form feed escape", "[scenario]\ndescription = 'x'\nname = \"a\\fb\"\n", 3, "name contains the control character U+000C", ""},
		{"newline in a multi-line string", "[scenario]\nname = \"\"\"\nab\ncd\"\"\"\n", 2, "name contains the control character U+000A", ""},
		{"duplicate key", "[inputs]\nchi = 300\nmach = 2\nchi = 400\n", 4, `invalid TOML: duplicate key "chi" (first defined on line 2)`, ""},
		{"duplicate dotted key", "inputs.chi = 300\ninputs.chi = 400\n", 2, `invalid TOML: duplicate key "chi" (first defined on line 1)`, ""},
		{"inline table reopened", "inputs = {chi = 300}\n[inputs]\n", 2, `invalid TOML: cannot define table [inputs]: key "inputs" is already a value (first defined on line 1)`, ""},
		// Validate errors (model/params.go) on the line of the key they name.
		{"chi at most 1", "[inputs]\nmach = 1\nchi = 1\n", 3, "chi: must be greater than 1 (got 1)", model.FieldChi},
		{"mach zero", "[inputs]\nmach = 0\n", 2, "mach: must be greater than 0", model.FieldMach},
		{"radius too large", "[inputs]\nchi = 100\n\nradius = 2e7\n", 4, "radius: must not exceed 1e7 pc (got 2e7 pc)", model.FieldRCloud},
		{"negative metallicity", "[inputs]\nmetallicity = -1\n", 2, "metallicity: must be at least 0", model.FieldMetallicity},
		{"pressure too low", "[inputs]\npressure = 1e-9\n", 2, "pressure: must be at least 1e-6 K cm⁻³", model.FieldPressure},
		{"gamma at most 1", "[inputs]\nchi = 10\n[conventions]\ngamma = 1\n", 4, "gamma: must be greater than 1", model.FieldGamma},
		{"hydrogen fraction above 1", "[conventions]\nhydrogen_fraction = 2\n", 2, "hydrogen_fraction: must not exceed 1", model.FieldHydrogenFraction},
		{"mu_cloud out of range", "[conventions]\nmu_cloud = 20\n", 2, "mu_cloud: must not exceed 10", model.FieldMuCold},
		{"floor above the cloud", "[inputs]\nt_cloud = 1e4\n[conventions]\nt_floor = 2e4\n", 4, "t_floor: the cooling floor 20000 K is above the cloud temperature 10000 K", model.FieldTFloor},
		{"wind too hot, on chi", "[inputs]\nt_cloud = 1e5\nchi = 1e7\n", 3, "chi: the wind temperature", model.FieldChi},
		// With chi left out, the wind-temperature check falls on t_cloud.
		{"wind too hot, chi left out", "[inputs]\nt_cloud = 1e8\n[conventions]\nmu_hot = 10\nmu_cloud = 0.1\n", 2, "chi: the wind temperature", model.FieldChi},
		{"wind too hot, on mu_hot", "[conventions]\nmu_cloud = 0.1\nmu_hot = 10\n[inputs]\nt_cloud = 1e8\n", 5, "chi: the wind temperature", model.FieldChi},
	}
}

func TestParseScenarioErrors(t *testing.T) {
	for _, c := range badScenarioCases() {
		t.Run(c.name, func(t *testing.T) {
			_, err := Parse(strings.NewReader(c.src), "bad.toml")
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error = %v, want a *ParseError\ninput:\n%s", err, c.src)
			}
			if pe.Line != c.line || pe.File != "bad.toml" {
				t.Errorf("error at %s:%d, want bad.toml:%d (error %q)", pe.File, pe.Line, c.line, err)
			}
			if !strings.Contains(err.Error(), c.msg) {
				t.Errorf("error %q does not contain %q", err, c.msg)
			}
			var fe *model.FieldError
			if got := errors.As(err, &fe); got != (c.field != "") || got && fe.Field != c.field {
				t.Errorf("error %q: wraps a *model.FieldError: %v (%+v), want field %q", err, got, fe, c.field)
			}
		})
	}
}

func FuzzParseScenario(f *testing.F) {
	for _, c := range badScenarioCases() {
		f.Add([]byte(c.src))
	}
	var b bytes.Buffer
	r := rand.New(rand.NewPCG(5, 6))
	for range 8 {
		b.Reset()
		if err := Write(&b, randomScenario(r)); err != nil {
			f.Fatal(err)
		}
		f.Add(bytes.Clone(b.Bytes()))
	}
	f.Add([]byte("[inputs]\nradius = 3.3\n[conventions]\nmixture = \"AG89\"\ndensity_product = \"n2\"\n[cooling]\nspec = \"x\"\ntable = []\n"))
	f.Add([]byte("inputs = {chi = 300, mach = 1.5}\nscenario.name = 'x'\n[cooling]\nspec = \"\"\"builtin\"\"\"\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		s, err := Parse(bytes.NewReader(data), "fuzz.toml")
		if err != nil {
			if errors.Is(err, errInternal) {
				t.Fatalf("go-toml failed: %v", err)
			}
			var pe *ParseError
			if !errors.As(err, &pe) || pe.File != "fuzz.toml" || pe.Line < 0 || pe.Line > countLines(data) {
				t.Fatalf("error %v (%T) is not a *ParseError of fuzz.toml with a line in 0..%d", err, err, countLines(data))
			}
			if pe.Line == 0 && len(data) <= MaxInputSize {
				t.Fatalf("error %v has no line", err)
			}
			return
		}
		if err := s.Params.Validate(); err != nil {
			t.Fatalf("Parse accepted params that fail Validate: %v", err)
		}
		var out bytes.Buffer
		if err := Write(&out, s); err != nil {
			t.Fatalf("Write(Parse(data)): %v", err)
		}
		back, err := Parse(bytes.NewReader(out.Bytes()), "again.toml")
		if err != nil {
			t.Fatalf("Parse(Write(s)): %v\nfile:\n%s", err, out.String())
		}
		if !reflect.DeepEqual(back, s) {
			t.Fatalf("round trip changed the scenario:\n%+v\nwant\n%+v", back, s)
		}
	})
}

// TestParseScenarioNoFloor: t_floor = 0 asks for no cooling floor, as
// --t-floor 0 does, and survives a write and read (a rule of this package).
func TestParseScenarioNoFloor(t *testing.T) {
	s, err := Parse(strings.NewReader("[conventions]\nt_floor = 0\n"), "nofloor.toml")
	if err != nil {
		t.Fatalf("Parse(t_floor = 0) = %v", err)
	}
	if _, ok := s.Params.Floor(); ok || s.Params.TFloor != model.NoFloor {
		t.Fatalf("t_floor = 0 gave TFloor %g, want model.NoFloor", float64(s.Params.TFloor))
	}
	var b bytes.Buffer
	if err := Write(&b, s); err != nil {
		t.Fatal(err)
	}
	back, err := Parse(&b, "again.toml")
	if err != nil || back.Params.TFloor != model.NoFloor {
		t.Fatalf("round trip: %v, TFloor %g\n%s", err, float64(back.Params.TFloor), b.String())
	}
}

// TestParseScenarioMultiLineDescription: a description may span lines
// (a TOML multi-line string); other strings may not.
func TestParseScenarioMultiLineDescription(t *testing.T) {
	src := "[scenario]\nname = 'x'\ndescription = \"\"\"\nfirst line\nsecond line\"\"\"\n"
	s, err := Parse(strings.NewReader(src), "ml.toml")
	if err != nil || s.Description != "first line\nsecond line" {
		t.Fatalf("Parse = %q, %v", s.Description, err)
	}
	var b bytes.Buffer
	if err := Write(&b, s); err != nil {
		t.Fatal(err)
	}
	if back, err := Parse(&b, "again.toml"); err != nil || back.Description != s.Description {
		t.Fatalf("round trip = %q, %v\n%s", back.Description, err, b.String())
	}
}
