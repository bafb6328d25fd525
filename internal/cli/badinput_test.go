package cli

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestBadInputCatalogue is the catalogue of bad input a careful user tried:
// each row is a command line (with optional standard input), the exit
// status wanted and a fragment the one-line message must hold. The rules
// (exit 2 for a wrong command line, 1 for a failed run; a message naming
// the flag, field or line; nothing on standard output) are cloudwind's
// own (README, "Exit status").
func TestBadInputCatalogue(t *testing.T) {
	dir := t.TempDir()
	write := func(name, text string, perm os.FileMode) string {
		p := filepath.Join(dir, name)
		if err := os.WriteFile(p, []byte(text), perm); err != nil {
			t.Fatal(err)
		}
		return p
	}
	roFile := write("readonly.csv", "old", 0o444)
	badTable := write("bad.txt", "1e4 1e-22\n1e5 x\n", 0o644)
	notIncreasing := write("dec.txt", "1e5 1e-22\n1e4 1e-22\n", 0o644)
	badScenario := write("bad.toml", "[inputs]\nchi = -3\n", 0o644)
	typoScenario := write("typo.toml", "[inputs]\nradus = 3\n", 0o644)
	badCriteria := write("crit.toml", "[[criterion]]\nid = \"li-2020\"\nalpah = 3\n", 0o644)
	escName := filepath.Join(dir, "x\x1b]0;HACK\x07\x1b[2J.toml")

	rows := []struct {
		args   []string
		stdin  string
		status int
		frag   string
	}{
		// Numbers out of range or not numbers.
		{[]string{"eval", "--chi", "-3"}, "", 2, "--chi: must be greater than 1 (got -3)"},
		{[]string{"eval", "--chi", "0.5"}, "", 2, "--chi: must be greater than 1"},
		{[]string{"eval", "--chi", "abc"}, "", 2, "--chi: invalid value: \"abc\" does not start with a number"},
		{[]string{"eval", "--chi", "1e-400"}, "", 2, "out of range"},
		{[]string{"eval", "--chi", "1e400"}, "", 2, "out of range"},
		{[]string{"eval", "--chi", "10^"}, "", 2, "10^ needs a number"},
		{[]string{"eval", "--chi", "NaN"}, "", 2, "does not start with a number"},
		{[]string{"eval", "--chi", "inf"}, "", 2, "does not start with a number"},
		{[]string{"eval", "--chi", "1e9"}, "", 2, "--chi: must not exceed 1e8"},
		{[]string{"eval", "--mach", "0"}, "", 2, "--mach: must be greater than 0 (got 0)"},
		{[]string{"eval", "--mach", "-1"}, "", 2, "--mach: must be greater than 0"},
		{[]string{"eval", "--pressure", "0"}, "", 2, "--pressure: must be at least"},
		{[]string{"eval", "--pressure", "1e-14 pa"}, "", 2, `did you mean "Pa"?`},
		{[]string{"eval", "--t-cloud", "1 kev"}, "", 2, `did you mean "keV"?`},
		{[]string{"eval", "--t-cloud", "0"}, "", 2, "--t-cloud: must be at least 1 K (got 0 K)"},
		{[]string{"eval", "--radius", "3 parsec"}, "", 2, "unknown unit \"parsec\""},
		{[]string{"eval", "--radius", "-1"}, "", 2, "--radius: must be at least"},
		{[]string{"eval", "--radius", "1 K"}, "", 2, "unknown unit \"K\""},
		{[]string{"eval", "--metallicity", "-0.1"}, "", 2, "--metallicity: must be at least 0"},
		{[]string{"eval", "--metallicity", "1 pc"}, "", 2, "unknown unit"},
		// Conventions given as 0 are used or refused, never replaced.
		{[]string{"eval", "--gamma", "0"}, "", 2, "--gamma: must be greater than 1 (got 0)"},
		{[]string{"eval", "--gamma", "1"}, "", 2, "--gamma: must be greater than 1 (got 1)"},
		{[]string{"eval", "--mu", "0"}, "", 2, "--mu: must be at least 0.1 (got 0)"},
		{[]string{"eval", "--mu-cloud", "0"}, "", 2, "--mu-cloud: must be at least 0.1 (got 0)"},
		{[]string{"eval", "--mu-hot", "0"}, "", 2, "--mu-hot: must be at least 0.1 (got 0)"},
		{[]string{"eval", "--hydrogen-fraction", "0"}, "", 2, "--hydrogen-fraction: must be at least 0.001 (got 0)"},
		{[]string{"eval", "--hydrogen-fraction", "1.5"}, "", 2, "--hydrogen-fraction: must not exceed 1"},
		{[]string{"eval", "--t-floor", "-3"}, "", 2, "--t-floor: must be a finite temperature ≥ 0 K"},
		{[]string{"eval", "--t-floor", "2e4"}, "", 2, "--t-floor: the cooling floor 20000 K is above the cloud temperature 10000 K"},
		{[]string{"eval", "--chi", "1e8", "--t-cloud", "1e4"}, "", 2, "exceeds 1e11 K"},
		// Enumerations.
		{[]string{"eval", "--mixture", "solar"}, "", 2, "--mixture: unknown mixture \"solar\""},
		{[]string{"eval", "--heat-capacity", "isobar"}, "", 2, "--heat-capacity: want isochoric or isobaric"},
		{[]string{"eval", "--density-product", "ne"}, "", 2, "--density-product: want nh2, n2 or neni"},
		{[]string{"eval", "--format", "xml"}, "", 2, "--format"},
		{[]string{"plan", "--question", "why"}, "", 2, "--question"},
		{[]string{"evolve", "--branch", "soft"}, "", 2, "--branch"},
		{[]string{"evolve", "--mix-cooling", "none"}, "", 2, "--mix-cooling: want minmix, cold, mix or hot"},
		{[]string{"evolve", "--criterion", "nope"}, "", 2, "nope"},
		// Flags and commands.
		{[]string{"eval", "--chii", "3"}, "", 2, "unknown flag --chii (did you mean --chi?)"},
		{[]string{"eval", "--chi"}, "", 2, "--chi needs a value"},
		{[]string{"eval", "stray"}, "", 2, "unexpected argument \"stray\""},
		{[]string{"evl"}, "", 2, "unknown command \"evl\" (did you mean \"eval\"?)"},
		{[]string{"version", "x"}, "", 2, "version takes no arguments"},
		{[]string{"help", "nope"}, "", 2, "no help for unknown command"},
		// Whole-number and plain-number flags: our wording, not the flag package's.
		{[]string{"evolve", "--samples", "1e7"}, "", 2, "--samples: must not exceed 100000 (got 1e7)"},
		{[]string{"evolve", "--samples", "2.5"}, "", 2, "--samples: want a whole number (got \"2.5\")"},
		{[]string{"evolve", "--samples", "1"}, "", 2, "--samples: must be at least 2 (got 1)"},
		{[]string{"evolve", "--until", "0"}, "", 2, "--until: must be greater than 0 t_cc (got 0 t_cc)"},
		{[]string{"evolve", "--until", "-1"}, "", 2, "--until: must be greater than 0"},
		{[]string{"evolve", "--kappa", "0"}, "", 2, "--kappa: must be greater than 0 (got 0)"},
		{[]string{"evolve", "--rtol", "1"}, "", 2, "--rtol: must not exceed 0.1 (got 1)"},
		{[]string{"evolve", "--alpha-v", "x"}, "", 2, "--alpha-v: want a number without a unit (got \"x\")"},
		// The outflow's wind and grid.
		{[]string{"outflow", "--sfr", "-2"}, "", 2, "--sfr: must be"},
		{[]string{"outflow", "--sfr", "2 pc"}, "", 2, "--sfr: "},
		{[]string{"outflow", "--mass-loading", "1e3"}, "", 2, "--mass-loading: must not exceed 100"},
		{[]string{"outflow", "--edot", "3e42"}, "", 2, "--edot needs --mdot"},
		{[]string{"outflow", "--edot", "3e42", "--mdot", "2", "--energy-loading", "2"}, "", 2, "not both"},
		{[]string{"outflow", "--pressure", "1e4"}, "", 2, "unknown flag --pressure"},
		{[]string{"outflow", "--r-max", "0.01"}, "", 2, "--r-max (3 pc) must be beyond --r-min (30 pc)"},
		{[]string{"outflow", "--end-radius", "50"}, "", 2, "--end-radius applies to the carried cloud: add --carry"},
		{[]string{"outflow", "--carry", "--launch-radius", "0"}, "", 2, "--launch-radius: must be a positive multiple of R"},
		{[]string{"plan", "--cfl", "5"}, "", 2, "--cfl: must not exceed 1 (got 5)"},
		{[]string{"plan", "--cfl", "0"}, "", 2, "--cfl: must be greater than 0 (got 0)"},
		{[]string{"plan", "--cells-per-radius", "0"}, "", 2, "--cells-per-radius: must be at least 1 (got 0)"},
		{[]string{"plan", "--throughput", "-5"}, "", 2, "--throughput: must be greater than 0"},
		{[]string{"plan", "--box", "10x5x6"}, "", 2, "W and H must be equal"},
		{[]string{"plan", "--box", "axbxc"}, "", 2, "--box"},
		{[]string{"cooling", "--points", "1"}, "", 2, "--points: must be at least 2 (got 1)"},
		{[]string{"cooling", "--tmin", "1e6", "--tmax", "1e4"}, "", 2, "must be above --tmin"},
		// Sweep specifications.
		{[]string{"sweep", "--chi", "log:10:1e4:0"}, "", 2, "N must be at least 2 (got 0)"},
		{[]string{"sweep", "--chi", "log:0:10:5"}, "", 2, "a log range needs A > 0 and B > 0"},
		{[]string{"sweep", "--radius", "log:-1:10:3"}, "", 2, "(got -1 pc and 10 pc)"},
		{[]string{"sweep", "--chi", "lin:1:2"}, "", 2, "want lin:A:B:N"},
		{[]string{"sweep", "--chi", "log:10^1:10^:3"}, "", 2, "10^ needs a number"},
		{[]string{"sweep", "--chi", "10,,20"}, "", 2, "--chi"},
		{[]string{"sweep", "--workers", "0"}, "", 2, "--workers: must be at least 1 (got 0)"},
		{[]string{"sweep", "--chi", "log:10:1e4:5000", "--radius", "log:1:10:5000"}, "", 2, "pass --force"},
		{[]string{"sweep", "--format", "xls"}, "", 2, "--format"},
		{[]string{"sweep", "-o", filepath.Join(dir, "o.ecsv"), "--format", "csv"}, "", 2, "names the ecsv format but --format is csv"},
		// Output targets, refused before anything is computed.
		{[]string{"sweep", "-o", dir}, "", 1, "is a directory"},
		{[]string{"sweep", "-o", roFile}, "", 1, "is read-only"},
		{[]string{"sweep", "-o", filepath.Join(dir, "no", "such", "out.csv")}, "", 1, "directory does not exist"},
		// Cooling specifications and tables.
		{[]string{"eval", "--cooling", "bultin"}, "", 2, `did you mean "builtin"?`},
		{[]string{"eval", "--cooling", "const:-1"}, "", 2, "must be a finite number greater than 0"},
		{[]string{"eval", "--cooling", "powerlaw:1e-22,1e6"}, "", 2, "want three values"},
		{[]string{"eval", "--cooling", "powerlaw:1e-22,1e6,99"}, "", 2, "SLOPE must be a number between -20 and 20"},
		{[]string{"eval", "--cooling", "builtin", "--table", "norm: nH2"}, "", 2, "table settings apply to a table file"},
		{[]string{"eval", "--cooling", badTable, "--table", "norm: nH2"}, "", 1, "bad.txt:2:"},
		{[]string{"eval", "--cooling", badTable}, "", 2, "the table's normalisation is required (never guessed)"},
		{[]string{"eval", "--cooling", notIncreasing, "--table", "norm: nH2"}, "", 1, "dec.txt:2:"},
		{[]string{"eval", "--cooling", filepath.Join(dir, "missing.txt")}, "", 1, "no such file"},
		{[]string{"eval", "--cooling", "-", "--table", "norm: nh3"}, "1e4 1e-22\n1e5 1e-22\n", 2, "norm"},
		// Scenario and criteria files: file and line named.
		{[]string{"eval", "--scenario", badScenario}, "", 1, "bad.toml:2:"},
		{[]string{"eval", "--scenario", typoScenario}, "", 1, `did you mean "radius"?`},
		{[]string{"eval", "--criteria", badCriteria}, "", 1, "crit.toml:3:"},
		{[]string{"eval", "--scenario", "-", "--criteria", "-"}, "", 2, "only one of --scenario, --cooling and --criteria can read standard input"},
		// A file name never reaches the terminal raw.
		{[]string{"eval", "--scenario", escName}, "", 1, "]0;HACK[2J.toml"},
	}
	if len(rows) < 60 {
		t.Fatalf("the catalogue has %d rows; the reliability issue asks for at least 60", len(rows))
	}
	for _, r := range rows {
		code, out, errs := runCmd(t, r.stdin, r.args...)
		line := strings.TrimSuffix(errs, "\n")
		switch {
		case code != r.status:
			t.Errorf("%q: exit %d, want %d (stderr %q)", r.args, code, r.status, errs)
		case out != "":
			t.Errorf("%q: wrote %d bytes to stdout, want none", r.args, len(out))
		case strings.Contains(line, "\n"):
			t.Errorf("%q: message spans lines: %q", r.args, errs)
		case !strings.Contains(line, r.frag):
			t.Errorf("%q: message %q lacks %q", r.args, line, r.frag)
		case strings.ContainsAny(line, "\x1b\x07\u202e\u00ad"):
			t.Errorf("%q: message holds raw control or format characters: %q", r.args, line)
		}
	}
	if got, _ := os.ReadFile(roFile); string(got) != "old" {
		t.Errorf("the read-only file was changed to %q", got)
	}
}
