package cli

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// scenarioFlagFile writes a scenario file in a subdirectory, naming a
// cooling table beside it by a relative path, and returns its path.
func scenarioFlagFile(t *testing.T) string {
	t.Helper()
	dir := filepath.Join(t.TempDir(), "runs")
	if err := os.Mkdir(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	// A constant Λ = 1e-22 erg cm³ s⁻¹ as a two-row table (common practice, no source).
	table := "1e4 1e-22\n1e8 1e-22\n"
	scen := `[scenario]
name = "run A"
[inputs]
chi = 300
mach = 1.5
radius = 10
[conventions]
heat_capacity = "isobaric"
[cooling]
spec = "flat.txt"
table = ["norm: nH2", "columns: T=1 lambda=2"]
`
	for name, text := range map[string]string{"flat.txt": table, "run.toml": scen} {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(text), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	return filepath.Join(dir, "run.toml")
}

// evalInputs runs eval --format json with args and returns its inputs and
// its cooling description.
func evalInputs(t *testing.T, args ...string) (map[string]any, map[string]any) {
	t.Helper()
	code, out, errs := runCmd(t, "", append([]string{"eval", "--format", "json"}, args...)...)
	if code != 0 {
		t.Fatalf("eval %v: exit %d, stderr %q", args, code, errs)
	}
	var doc struct {
		Inputs  map[string]any `json:"inputs"`
		Cooling map[string]any `json:"cooling"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("eval JSON: %v", err)
	}
	return doc.Inputs, doc.Cooling
}

func TestScenarioFlagBase(t *testing.T) {
	path := scenarioFlagFile(t)
	in, cool := evalInputs(t, "--scenario", path)
	// The file's values, and its defaults for what it leaves out.
	for k, want := range map[string]any{"chi": 300.0, "mach": 1.5, "radius_pc": 10.0, "heat_capacity": "isobaric", "pressure_kcm3": 1000.0} {
		if in[k] != want {
			t.Errorf("inputs.%s = %v, want %v (from the file)", k, in[k], want)
		}
	}
	// The table is found beside the file, not in the working directory.
	if spec, _ := cool["spec"].(string); !strings.HasSuffix(spec, filepath.Join("runs", "flat.txt")) {
		t.Errorf("cooling spec = %q, want the table beside the scenario file", spec)
	}
}

func TestScenarioFlagOverrides(t *testing.T) {
	path := scenarioFlagFile(t)
	in, cool := evalInputs(t, "--scenario", path, "--chi", "100", "--heat-capacity", "isochoric", "--cooling", "const:1e-21")
	for k, want := range map[string]any{"chi": 100.0, "mach": 1.5, "heat_capacity": "isochoric"} {
		if in[k] != want {
			t.Errorf("inputs.%s = %v, want %v", k, in[k], want)
		}
	}
	if cool["spec"] != "const:1e-21" {
		t.Errorf("cooling spec = %v, want the --cooling flag's", cool["spec"])
	}
	// A flag given at its default value still overrides the file.
	if in, _ := evalInputs(t, "--scenario", path, "--chi", "100"); in["chi"] != 100.0 {
		t.Errorf("--chi 100 over chi = 300: got %v", in["chi"])
	}
}

func TestScenarioFlagText(t *testing.T) {
	path := scenarioFlagFile(t)
	code, out, errs := runCmd(t, "", "eval", "--scenario", path)
	if code != 0 {
		t.Fatalf("exit %d, stderr %q", code, errs)
	}
	first, _, _ := strings.Cut(out, "\n")
	if !strings.Contains(first, `"run A"`) || !strings.Contains(first, "run.toml") {
		t.Errorf("first line %q: want the scenario's name and file", first)
	}
}

func TestScenarioFlagCommands(t *testing.T) {
	path := scenarioFlagFile(t)
	for _, args := range [][]string{
		{"evolve", "--scenario", path},
		{"plan", "--scenario", path},
		{"sweep", "--scenario", path, "--mach", "1,2", "--format", "csv"},
	} {
		code, out, errs := runCmd(t, "", args...)
		if code != 0 {
			t.Errorf("%v: exit %d, stderr %q", args, code, errs)
			continue
		}
		if args[0] == "sweep" {
			lines := strings.Split(strings.TrimSpace(out), "\n")
			if len(lines) != 3 || !strings.HasPrefix(lines[1], "300,1,") || !strings.HasPrefix(lines[2], "300,2,") {
				t.Errorf("sweep over the scenario: want χ = 300 from the file and M = 1, 2 from the flag; got\n%s", out)
			}
		} else if !strings.Contains(out, "χ = 300") {
			t.Errorf("%v: output does not show χ = 300 from the file:\n%s", args, out)
		}
	}
}

func TestScenarioFlagErrors(t *testing.T) {
	dir := t.TempDir()
	bad := filepath.Join(dir, "bad.toml")
	if err := os.WriteFile(bad, []byte("[inputs]\nchi = -3\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	esc := filepath.Join(dir, "esc.toml")
	if err := os.WriteFile(esc, []byte("[scenario]\nname = \"run \\u001b[31mA\"\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		args []string
		want []string
	}{
		{[]string{"--scenario", filepath.Join(dir, "missing.toml")}, []string{"--scenario", "missing.toml", "no such file"}},
		{[]string{"--scenario", bad}, []string{"--scenario", "bad.toml:2", "chi"}},
		{[]string{"--scenario", "-", "--cooling", "-"}, []string{"standard input"}},
		{[]string{"--cooling", "-", "--criteria", "-"}, []string{"standard input"}},
		{[]string{"--scenario", "-", "--criteria", "-"}, []string{"standard input"}},
		{[]string{"--scenario", esc}, []string{"esc.toml:2", "control character"}},
	} {
		code, _, errs := runCmd(t, "", append([]string{"eval"}, c.args...)...)
		if code == 0 {
			t.Errorf("%v: exit %d, want an error", c.args, code)
		}
		for _, w := range c.want {
			if !strings.Contains(errs, w) {
				t.Errorf("%v: stderr %q lacks %q", c.args, errs, w)
			}
		}
	}
	// A sweep over a scenario validates the base from the file.
	if code, _, errs := runCmd(t, "", "sweep", "--scenario", bad, "--mach", "1,2"); code == 0 || !strings.Contains(errs, "bad.toml:2") {
		t.Errorf("sweep over a bad scenario: exit %d, stderr %q", code, errs)
	}
}
