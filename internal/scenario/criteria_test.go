package scenario

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"os"
	"reflect"
	"strconv"
	"strings"
	"testing"

	"cloudwind/model"
)

// Expected values in this file are format rules of this package (the
// criteria-file format in doc.go) unless a comment names another source.

// exampleCriteriaFile is the example of the package documentation.
const exampleCriteriaFile = `# cloudwind criteria file
[[criterion]]
id = "li-2020"          # an existing built-in id: only the keys given here change
alpha = 5
verified = true
status = "alpha checked against Li et al. 2020, Sec. 4"

[[criterion]]
id = "my-2026"           # a new id: every key down to alpha is required
label = "Me et al. 2026"
authors = "Me, You & Them"
year = 2026
journal = "MNRAS 999, 1" # "" when not known
arxiv = "2601.00001"     # "" when there is none
equation = "12"          # "" when not read from the paper
cooling_time = "mix"     # none | hot | mix | minmix | cold | shocked | grow (t_grow, not a cooling time)
dynamical_time = "t_cc"  # t_cc | t_shear | t_cc,turb (t_cc/(1 + (M_turb/(f_mix M))²)^1/2)
alpha = 1.0
beta = -0.5              # optional, default 0
f_mix = 0.6              # optional, for t_cc,turb; default 0.6
warm_temperature = 1e4   # optional: a colder cloud failing the test is "transformed" when gas at this T passes
uncertainty = 2          # optional: the factor α may be off by; default 2 unverified, 1 verified
verified = false         # optional, default false
status = "from memory — check the paper"
note = "one-line summary"
[criterion.range]        # optional: the calibrated range of the criterion above
chi = [100, 1000]        # [min, max]; omit a key for no limit
mach = [1, 10]
t_cloud = [1e4, 4e4]     # K
mach_turb = [0.25, 0.75] # turbulent Mach number; omitted = calibrated without turbulence
status = "from the paper's Table 1"
`

// load applies src, named test.toml, to the built-in criteria.
func load(t *testing.T, src string) []model.Criterion {
	t.Helper()
	cs, err := LoadCriteria(strings.NewReader(src), "test.toml", model.BuiltinCriteria())
	if err != nil {
		t.Fatalf("LoadCriteria: %v\ninput:\n%s", err, src)
	}
	return cs
}

// byID returns the criterion with the given id from cs.
func byID(t *testing.T, cs []model.Criterion, id string) model.Criterion {
	t.Helper()
	c, ok := model.CriterionByID(cs, id)
	if !ok {
		t.Fatalf("criterion %q missing from the result", id)
	}
	return *c
}

func TestDocExampleMatchesTest(t *testing.T) {
	// The example in doc.go and exampleCriteriaFile must not drift apart.
	var doc strings.Builder
	for _, l := range strings.Split(exampleCriteriaFile, "\n") {
		if l == "" {
			doc.WriteString("//\n")
		} else {
			doc.WriteString("//\t" + l + "\n")
		}
	}
	want := strings.TrimSuffix(doc.String(), "//\n")
	src, err := os.ReadFile("doc.go")
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(src), want) {
		t.Errorf("doc.go does not contain the example of exampleCriteriaFile")
	}
}

func TestLoadCriteriaExample(t *testing.T) {
	cs := load(t, exampleCriteriaFile)
	builtin := model.BuiltinCriteria()
	if len(cs) != len(builtin)+1 {
		t.Fatalf("got %d criteria, want the %d built-ins and one new", len(cs), len(builtin))
	}
	for i := range builtin {
		if cs[i].ID != builtin[i].ID {
			t.Errorf("criterion %d is %q, want %q: built-in order comes first", i, cs[i].ID, builtin[i].ID)
		}
		if cs[i].ID != "li-2020" && !reflect.DeepEqual(cs[i], builtin[i]) {
			t.Errorf("criterion %q changed, but the file does not mention it", cs[i].ID)
		}
	}
	li := byID(t, cs, "li-2020")
	want := byID(t, builtin, "li-2020")
	want.Alpha, want.Verified, want.Status = 5, true, "alpha checked against Li et al. 2020, Sec. 4"
	if !reflect.DeepEqual(li, want) {
		t.Errorf("li-2020 =\n%+v\nwant\n%+v", li, want)
	}
	got := cs[len(cs)-1]
	wantNew := model.Criterion{
		ID: "my-2026", Label: "Me et al. 2026",
		Citation: model.Citation{Authors: "Me, You & Them", Year: 2026, Journal: "MNRAS 999, 1", ArXiv: "2601.00001", Equation: "12"},
		Cool:     model.CoolMix, Dyn: model.DynCloudCrushing, Alpha: 1, Beta: -0.5, FMix: 0.6, WarmTemperature: 1e4, Uncertainty: 2,
		Verified: false, Status: "from memory — check the paper",
		Range: model.Calibration{Chi: model.Interval{Min: 100, Max: 1000}, Mach: model.Interval{Min: 1, Max: 10},
			TCloud: model.Interval{Min: 1e4, Max: 4e4}, MachTurb: model.Interval{Min: 0.25, Max: 0.75}, Status: "from the paper's Table 1"},
		Note: "one-line summary",
	}
	if !reflect.DeepEqual(got, wantNew) {
		t.Errorf("my-2026 =\n%+v\nwant\n%+v", got, wantNew)
	}
}

func TestLoadCriteriaVerification(t *testing.T) {
	cases := []struct {
		name, src    string
		id           string
		wantVerified bool
		wantStatus   string // "" keeps the built-in's
	}{
		{"alpha changed, no verified, no status", "[[criterion]]\nid = \"gronke-oh-2018\"\nalpha = 2\n",
			"gronke-oh-2018", false, "changed by criteria file test.toml: not verified"},
		{"beta changed, status given", "[[criterion]]\nid = \"gronke-oh-2018\"\nbeta = 0.5\nstatus = \"guess\"\n",
			"gronke-oh-2018", false, "changed by criteria file test.toml: guess"},
		{"alpha changed, verified = false", "[[criterion]]\nid = \"gronke-oh-2018\"\nalpha = 2\nverified = false\n",
			"gronke-oh-2018", false, "changed by criteria file test.toml: not verified"},
		{"cooling_time changed", "[[criterion]]\nid = \"gronke-oh-2018\"\ncooling_time = \"hot\"\n",
			"gronke-oh-2018", false, "changed by criteria file test.toml: not verified"},
		{"dynamical_time changed", "[[criterion]]\nid = \"gronke-oh-2018\"\ndynamical_time = \"t_shear\"\n",
			"gronke-oh-2018", false, "changed by criteria file test.toml: not verified"},
		{"alpha changed, verified, no status", "[[criterion]]\nid = \"li-2020\"\nalpha = 3\nverified = true\n",
			"li-2020", true, "changed by criteria file test.toml: marked verified, no status given"},
		// 1 is gronke-oh-2018's built-in α (model/builtin.go), so nothing changes.
		{"alpha set to its value", "[[criterion]]\nid = \"gronke-oh-2018\"\nalpha = 1\n",
			"gronke-oh-2018", true, ""},
		{"only verified", "[[criterion]]\nid = \"li-2020\"\nverified = true\n", "li-2020", true, ""},
		{"only status", "[[criterion]]\nid = \"li-2020\"\nstatus = \"read it\"\n", "li-2020", false, "read it"},
		{"note only", "[[criterion]]\nid = \"gronke-oh-2018\"\nnote = \"n\"\n", "gronke-oh-2018", true, ""},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			got := byID(t, load(t, c.src), c.id)
			want := c.wantStatus
			if want == "" {
				want = byID(t, model.BuiltinCriteria(), c.id).Status
			}
			if got.Verified != c.wantVerified || got.Status != want {
				t.Errorf("Verified, Status = %v, %q; want %v, %q", got.Verified, got.Status, c.wantVerified, want)
			}
		})
	}
}

func TestLoadCriteriaRangeOverride(t *testing.T) {
	src := "[[criterion]]\nid = \"abruzzo-2023\"\n[criterion.range]\nchi = [50, 500]\n"
	got := byID(t, load(t, src), "abruzzo-2023")
	want := byID(t, model.BuiltinCriteria(), "abruzzo-2023")
	want.Range.Chi = model.Interval{Min: 50, Max: 500}
	want.Range.Status = "changed by criteria file test.toml"
	if !reflect.DeepEqual(got, want) {
		t.Errorf("abruzzo-2023 =\n%+v\nwant\n%+v (only χ and the range status change)", got, want)
	}
	got = byID(t, load(t, src+"status = \"Table 1\"\n"), "abruzzo-2023")
	if got.Range.Status != "Table 1" {
		t.Errorf("Range.Status = %q, want the file's %q", got.Range.Status, "Table 1")
	}
	// One-sided ranges: -inf as min or inf as max (format rule of this package).
	got = byID(t, load(t, "[[criterion]]\nid = \"li-2020\"\n[criterion.range]\nmach = [1, inf]\nchi = [-inf, 1e3]\n"), "li-2020")
	if got.Range.Mach != (model.Interval{Min: 1, Max: math.Inf(1)}) || got.Range.Chi != (model.Interval{Min: math.Inf(-1), Max: 1e3}) {
		t.Errorf("one-sided ranges: mach %+v, chi %+v; want [1, +Inf] and [-Inf, 1000]", got.Range.Mach, got.Range.Chi)
	}
}

func TestLoadCriteriaNewDefaults(t *testing.T) {
	src := `[[criterion]]
id = "x-1"
label = "X"
authors = "A"
year = 1999
journal = ""
arxiv = ""
equation = ""
cooling_time = "cold"
dynamical_time = "t_shear"
alpha = 3
`
	cs := load(t, src)
	want := model.Criterion{
		ID: "x-1", Label: "X", Citation: model.Citation{Authors: "A", Year: 1999},
		Cool: model.CoolCold, Dyn: model.DynShear, Alpha: 3,
		Status: "from criteria file test.toml, no status given",
		Range: model.Calibration{Chi: model.Unbounded(), Mach: model.Unbounded(), TCloud: model.Unbounded(),
			Status: "not given in criteria file test.toml"},
	}
	if got := cs[len(cs)-1]; !reflect.DeepEqual(got, want) {
		t.Errorf("x-1 =\n%+v\nwant\n%+v", got, want)
	}
}

func TestLoadCriteriaEmptyAndBase(t *testing.T) {
	base := model.BuiltinCriteria()
	for _, src := range []string{"", "# only a comment\n\n"} {
		cs, err := LoadCriteria(strings.NewReader(src), "e.toml", base)
		if err != nil || !reflect.DeepEqual(cs, model.BuiltinCriteria()) {
			t.Errorf("LoadCriteria(%q) = %v, %v; want the base unchanged", src, cs, err)
		}
	}
	if _, err := LoadCriteria(strings.NewReader(exampleCriteriaFile), "x.toml", base); err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(base, model.BuiltinCriteria()) {
		t.Error("LoadCriteria modified its base argument")
	}
	cs, err := LoadCriteria(strings.NewReader(exampleCriteriaFile[strings.Index(exampleCriteriaFile, "\n\n"):]), "x.toml", nil)
	if err != nil || len(cs) != 1 || cs[0].ID != "my-2026" {
		t.Errorf("with no base: %v, %v; want only my-2026", cs, err)
	}
	if _, err := LoadCriteria(strings.NewReader(exampleCriteriaFile), "x.toml", nil); err == nil {
		t.Error("li-2020 with no base: no error, want the missing-keys error of a new criterion")
	}
}

// tomlString writes s as a TOML basic string; s holds no control characters.
func tomlString(s string) string {
	return `"` + strings.NewReplacer(`\`, `\\`, `"`, `\"`).Replace(s) + `"`
}

// tomlNumber writes x in the shortest form that reads back exactly.
func tomlNumber(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// writeCriterion writes every field of c as a [[criterion]] table. Interval
// sides at ±Inf cannot be written, so such intervals are left out.
func writeCriterion(b *strings.Builder, c model.Criterion) {
	fmt.Fprintf(b, "[[criterion]]\nid = %s\nlabel = %s\nauthors = %s\nyear = %d\n", tomlString(c.ID),
		tomlString(c.Label), tomlString(c.Citation.Authors), c.Citation.Year)
	fmt.Fprintf(b, "journal = %s\narxiv = %s\nequation = %s\n", tomlString(c.Citation.Journal),
		tomlString(c.Citation.ArXiv), tomlString(c.Citation.Equation))
	fmt.Fprintf(b, "cooling_time = %s\ndynamical_time = %s\nalpha = %s\nbeta = %s\n", tomlString(c.Cool.String()),
		tomlString(c.Dyn.String()), tomlNumber(c.Alpha), tomlNumber(c.Beta))
	fmt.Fprintf(b, "f_mix = %s\nwarm_temperature = %s\nuncertainty = %s\n", tomlNumber(c.FMix), tomlNumber(float64(c.WarmTemperature)), tomlNumber(c.Uncertainty))
	fmt.Fprintf(b, "verified = %v\nstatus = %s\nnote = %s\n[criterion.range]\n", c.Verified,
		tomlString(c.Status), tomlString(c.Note))
	for _, iv := range []struct {
		key string
		i   model.Interval
	}{{"chi", c.Range.Chi}, {"mach", c.Range.Mach}, {"t_cloud", c.Range.TCloud}, {"mach_turb", c.Range.MachTurb}} {
		if !math.IsInf(iv.i.Min, 0) && !math.IsInf(iv.i.Max, 0) {
			fmt.Fprintf(b, "%s = [%s, %s]\n", iv.key, tomlNumber(iv.i.Min), tomlNumber(iv.i.Max))
		} else if iv.key == "mach_turb" && iv.i.IsUnbounded() {
			fmt.Fprintf(b, "%s = [-inf, inf]\n", iv.key)
		}
	}
	fmt.Fprintf(b, "status = %s\n\n", tomlString(c.Range.Status))
}

func TestLoadCriteriaRoundTrip(t *testing.T) {
	builtin := model.BuiltinCriteria()
	extra := model.Criterion{
		ID: "round-trip-1", Label: `Quote " and \ backslash`,
		Citation: model.Citation{Authors: "Ä, Ö & Ü", Year: 1, Journal: "J 1, 2", ArXiv: "astro-ph/0511016", Equation: "A.3"},
		Cool:     model.CoolMinMix, Dyn: model.DynShear, Alpha: 1.2345678901234567e-7, Beta: -9.75, Verified: true,
		Status: "st", Range: model.Calibration{Chi: model.Interval{Min: -1e300, Max: 5e-324},
			Mach: model.Interval{Min: 0.1, Max: 0.1}, TCloud: model.Interval{Min: 3, Max: 1e8}, Status: "rs"},
		Note: "n ☉",
	}
	// Overrides that restate every field change nothing, so no Status is rewritten.
	var b strings.Builder
	for _, c := range builtin {
		writeCriterion(&b, c)
	}
	// New criteria: every built-in under a new id, and extra.
	var want []model.Criterion
	want = append(want, builtin...)
	for _, c := range append(builtin, extra) {
		if c.ID != extra.ID {
			c.ID = "copy-" + c.ID
		}
		writeCriterion(&b, c)
		if c.ID == "copy-abruzzo-2023" {
			c.Range.Mach = model.Unbounded() // [1, +Inf] cannot be written; see writeCriterion
		}
		want = append(want, c)
	}
	got := load(t, b.String())
	if !reflect.DeepEqual(got, want) {
		for i := range max(len(got), len(want)) {
			if i >= len(got) || i >= len(want) || !reflect.DeepEqual(got[i], want[i]) {
				t.Errorf("criterion %d differs after the round trip", i)
			}
		}
		t.Logf("file:\n%s", b.String())
	}
}

// badCriteriaCase is a malformed criteria file and the line its error names.
type badCriteriaCase struct {
	name, src string
	line      int
	msg       string // a substring of the message
}

func badCriteriaCases() []badCriteriaCase {
	const li = "[[criterion]]\nid = \"li-2020\"\n" // lines 1–2
	newOK := func(skip string) string {
		var b strings.Builder
		b.WriteString("[[criterion]]\nid = \"new-1\"\n") // lines 1–2
		for _, kv := range []string{"label = \"L\"", "authors = \"A\"", "year = 2000", "journal = \"\"", "arxiv = \"\"",
			"equation = \"\"", "cooling_time = \"mix\"", "dynamical_time = \"t_cc\"", "alpha = 1"} { // lines 3–11
			if !strings.HasPrefix(kv, skip+" ") {
				b.WriteString(kv + "\n")
			}
		}
		return b.String()
	}
	return []badCriteriaCase{
		{"misspelt key", li + "alpah = 5\n", 3, `unknown key "alpah" (did you mean "alpha"?)`},
		{"misspelt key, capitals", li + "\nVerfied = true\n", 4, `(did you mean "verified"?)`},
		{"unknown key", li + "colour = \"red\"\n", 3, "known keys: id, label"},
		{"string for a number", li + "alpha = \"5\"\n", 3, "alpha must be a number, not a string"},
		{"number for a string", li + "equation = 12\n", 3, "equation must be a string, not an integer (put it in quotes)"},
		{"float year", newOK("year") + "year = 2026.0\n", 11, "year must be an integer, not a float"},
		{"year out of range", li + "year = 0\n", 3, "year must be between 1 and 9999"},
		{"string for a boolean", li + "verified = \"yes\"\n", 3, "verified must be true or false, not a string"},
		{"unknown cooling time", li + "cooling_time = \"mixed\"\n", 3, `unknown cooling time "mixed"`},
		{"unknown dynamical time", li + "\n\ndynamical_time = \"tcc\"\n", 5, `unknown dynamical time "tcc"`},
		{"duplicate id", li + "alpha = 3\n\n" + li, 6, `duplicate id "li-2020" (first used on line 2)`},
		{"duplicate new id", newOK("") + "\n" + newOK(""), 14, `duplicate id "new-1"`},
		{"new criterion missing keys", "\n" + newOK("journal"), 2, "needs the missing keys journal"},
		{"misspelt built-in id", "[[criterion]]\nid = \"li-2021\"\nalpha = 5\n", 1, `did you mean "li-2020"?`},
		{"missing id", "[[criterion]]\nalpha = 5\n", 1, "[[criterion]] needs an id"},
		{"id not a string", "[[criterion]]\nid = 7\n", 2, "id must be a string"},
		{"range of one number", li + "[criterion.range]\nchi = [1]\n", 4, "range.chi must be [min, max]"},
		{"range of three numbers", li + "[criterion.range]\nmach = [1, 2, 3]\n", 4, "range.mach must be [min, max]"},
		{"range with a string", li + "[criterion.range]\n\nt_cloud = [1, \"2\"]\n", 5, "range.t_cloud must be [min, max]"},
		{"range not an array", li + "[criterion.range]\nchi = 5\n", 4, "range.chi must be [min, max]"},
		{"multi-line range with -inf as max", li + "[criterion.range]\nmach = [\n  1,\n  -inf,\n]\n", 4, "two numbers"},
		{"range with inf as min", li + "[criterion.range]\nchi = [inf, 1e3]\n", 4, "-inf as min or inf as max"},
		{"nan alpha", li + "alpha = nan\n", 3, "alpha must be a finite number"},
		{"inf beta", li + "beta = -inf\n", 3, "beta must be a finite number"},
		{"negative alpha", li + "verified = true\nalpha = -1\n", 4, "alpha: must be a finite number greater than 0"},
		{"beta too large", li + "beta = 11\n", 3, "beta: must be a finite number between -10 and 10"},
		{"range min above max", li + "[criterion.range]\nmach = [1, 2]\nchi = [1000, 100]\n", 5, "range.chi: must be [min, max] with min ≤ max"},
		{"bad new id", strings.Replace(newOK(""), "new-1", "New 1", 1), 2, "may hold only a–z, 0–9 and '-'"},
		{"validation falls back to the header", "\n[[criterion]]\nid = \"adiabatic\"\ncooling_time = \"mix\"\n", 2, "alpha: must be a finite number greater than 0 (got 0)"},
		{"key outside any table", "\nalpha = 5\n" + li, 2, `key "alpha" is outside any table`},
		{"single table", "[criterion]\nid = \"li-2020\"\n", 1, "write [[criterion]] (an array of tables), not [criterion]"},
		{"unknown table", li + "[criterion.range]\n[criterions]\n", 4, `unknown table [criterions] (did you mean "criterion"?)`},
		{"unknown array of tables", "[[crit]]\n", 1, "unknown table [[crit]]"},
		{"range as array of tables", li + "[[criterion.range]]\n", 3, "write [criterion.range], not [[criterion.range]]"},
		{"unknown sub-table", li + "[criterion.rnge]\n", 3, `unknown table [criterion.rnge] in a criterion (did you mean "range"?)`},
		{"sub-table of range", li + "[criterion.range.x]\n", 3, "[criterion.range] has no sub-tables"},
		{"range key as a sub-table", li + "[criterion.range.chi]\n", 3, "range.chi must be [min, max]"},
		{"range as a key", li + "range = [1, 2]\n", 3, "range must be a table"},
		{"misspelt range key", li + "[criterion.range]\nt-cloud = [1, 2]\n", 4, `(did you mean "t_cloud"?)`},
		{"range status not a string", li + "[criterion.range]\nstatus = 5\n", 4, "range.status must be a string"},
		{"escaped control character", li + "label = \"\\u001b[31mred\"\n", 3, "label contains the control character U+001B"},
		{"C1 control character", li + "note = \"x\u009by\"\n", 3, "note contains the control character U+009B"},
		{"escaped newline", li + "status = \"a\\nb\"\n", 3, "status contains the control character U+000A"},
		{"TOML syntax error", li + "label = \"open\n", 3, "unterminated string"},
		{"inline table for a string", li + "label = { a = 1 }\n", 3, "label must be a string, not a table"},
		{"dotted key under a string key", li + "\nnote.text = \"n\"\n", 4, "note must be a string, not a table"},
		{"array of tables for a string", li + "status = [{ a = 1 }]\n", 3, "status must be a string, not an array"},
		{"id as a table", "[[criterion]]\nid = {}\n", 2, "id must be a string, not a table"},
		{"date for a string", li + "equation = 2020-01-01\n", 3, "equation must be a string, not a local date (put it in quotes)"},
		{"date-time for a number", li + "alpha = 2020-01-01T00:00:00Z\n", 3, "alpha must be a number, not an offset date-time"},
		{"range key as a table", li + "range.chi.min = 1\n", 3, "range.chi must be [min, max]"},
		{"unknown range sub-table", li + "range = {chi = [1, 2], x = {}}\n", 3, "unknown table [criterion.range.x]: [criterion.range] has no sub-tables"},
		{"criterion as a value", "criterion = 5\n", 1, "criterion must be an array of tables, as in [[criterion]], not an integer"},
		{"criterion as an inline table", "criterion = {id = \"li-2020\"}\n", 1, "write [[criterion]] (an array of tables), not [criterion]"},
		{"duplicate key", li + "alpha = 1\nalpha = 2\n", 4, `invalid TOML: duplicate key "alpha" (first defined on line 3)`},
	}
}

func TestLoadCriteriaErrors(t *testing.T) {
	for _, c := range badCriteriaCases() {
		t.Run(c.name, func(t *testing.T) {
			_, err := LoadCriteria(strings.NewReader(c.src), "bad.toml", model.BuiltinCriteria())
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error = %v, want a *ParseError\ninput:\n%s", err, c.src)
			}
			if pe.Line != c.line || pe.File != "bad.toml" {
				t.Errorf("error at %s:%d, want bad.toml:%d (error %q)", pe.File, pe.Line, c.line, err)
			}
			if prefix := fmt.Sprintf("bad.toml:%d: ", c.line); !strings.HasPrefix(err.Error(), prefix) {
				t.Errorf("error %q does not start with %q", err, prefix)
			}
			if !strings.Contains(err.Error(), c.msg) {
				t.Errorf("error %q does not contain %q", err, c.msg)
			}
		})
	}
}

func TestLoadCriteriaFieldError(t *testing.T) {
	_, err := LoadCriteria(strings.NewReader("[[criterion]]\nid = \"li-2020\"\nalpha = -2\n"), "f.toml", model.BuiltinCriteria())
	var fe *model.FieldError
	if !errors.As(err, &fe) || fe.Field != "alpha" || !errors.Is(err, model.ErrOutOfBounds) {
		t.Errorf("error = %v, want it to wrap the *model.FieldError for alpha", err)
	}
}

func TestSuggest(t *testing.T) {
	known := criterionKeys()
	cases := map[string]string{
		"alpah":          "alpha", // swapped neighbours
		"lable":          "label", // swapped neighbours
		"bta":            "beta",  // one deletion
		"ALPHA":          "alpha", // case
		"coolingtime":    "cooling_time",
		"dynamical-time": "dynamical_time",
		"verifed":        "verified",
		"dynamic_time":   "dynamical_time", // two deletions in a long key
		"colour":         "",
		"x":              "",
		"ab":             "",
		"":               "",
	}
	for word, want := range cases {
		got := suggest(word, known)
		if want == "" && got != "" || want != "" && got != fmt.Sprintf(" (did you mean %q?)", want) {
			t.Errorf("suggest(%q) = %q, want %q", word, got, want)
		}
	}
}

func FuzzLoadCriteria(f *testing.F) {
	for _, c := range badCriteriaCases() {
		f.Add([]byte(c.src))
	}
	f.Add([]byte(exampleCriteriaFile))
	var b strings.Builder
	for _, c := range model.BuiltinCriteria() {
		writeCriterion(&b, c)
	}
	f.Add([]byte(b.String()))
	f.Add([]byte(plainCriteria))
	f.Add([]byte("criterion = [{id = \"li-2020\", alpha = 2, range = {chi = [1, 1e3]}}]\n[[criterion]]\nid = \"x\"\nrange.mach = [1, inf]\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		cs, err := LoadCriteria(bytes.NewReader(data), "fuzz.toml", model.BuiltinCriteria())
		if err != nil {
			if errors.Is(err, errInternal) {
				t.Fatalf("go-toml failed: %v", err)
			}
			var pe *ParseError
			if !errors.As(err, &pe) || pe.File != "fuzz.toml" || pe.Line < 0 || pe.Line > countLines(data) {
				t.Fatalf("error %v (%T) is not a *ParseError of fuzz.toml with a line in 0..%d", err, err, countLines(data))
			}
			return
		}
		if len(cs) < len(model.BuiltinCriteria()) {
			t.Fatalf("%d criteria, fewer than the built-ins", len(cs))
		}
		seen := map[string]bool{}
		for i := range cs {
			if err := cs[i].Validate(); err != nil {
				t.Fatalf("criterion %q passed LoadCriteria but not Validate: %v", cs[i].ID, err)
			}
			if seen[cs[i].ID] {
				t.Fatalf("id %q twice in the result", cs[i].ID)
			}
			seen[cs[i].ID] = true
		}
	})
}
