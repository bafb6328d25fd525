package cli

import (
	"encoding/json"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"cloudwind/model"
)

func TestPlanJSON(t *testing.T) {
	// Derived (N_steps = N_cc χ^{1/2} R (M+1)/(M C)): N_cc = 20, χ = 100, R = 16, M = 1.5, C = 0.3 → 17 778 steps.
	code, out, errs := runCmd(t, "", "plan", "--chi", "100", "--mach", "1.5", "--cells-per-radius", "16", "--cfl", "0.3",
		"--run-tcc", "20", "--box", "60x20x20", "--format", "json")
	if code != 0 {
		t.Fatalf("plan: exit %d: %s", code, errs)
	}
	var doc map[string]any
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"cells", "steps", "cell_updates", "core_hours", "memory_bytes", "dx_pc", "run_myr", "warnings"} {
		if _, ok := doc[k]; !ok {
			t.Errorf("plan JSON lacks %q", k)
		}
	}
	if steps, _ := doc["steps"].(float64); steps != 17778 {
		t.Errorf("steps = %v, want 17778 (derived)", doc["steps"])
	}
	// Cells = 60 × 20 × 20 × 16³ (derived); dx = r_cl/16 with r_cl = 1 pc.
	if cells, _ := doc["cells"].(float64); cells != 60*20*20*16*16*16 {
		t.Errorf("cells = %v, want %d", doc["cells"], 60*20*20*16*16*16)
	}
	if dx, _ := doc["dx_pc"].(float64); math.Abs(dx-1.0/16) > 1e-12 {
		t.Errorf("dx_pc = %v, want 0.0625", doc["dx_pc"])
	}
	if w, _ := doc["warnings"].([]any); len(w) == 0 {
		t.Error("a supersonic plan at 16 cells per radius has no warnings")
	}
	code, out, _ = runCmd(t, "", "plan", "--compare", "--format", "json")
	if code != 0 || !strings.Contains(out, `"comparison"`) || !strings.Contains(out, `"survive"`) {
		t.Errorf("plan --compare: exit %d, output lacks the comparison:\n%.300s", code, out)
	}
	for _, bad := range [][]string{{"--box", "10x20x30"}, {"--box", "10x"}, {"--cfl", "-1"}, {"--question", "fate"}, {"--cells-per-radius", "0.5"}, {"--criterion", "li2020"}} {
		if code, _, errs := runCmd(t, "", append([]string{"plan"}, bad...)...); code != 2 || strings.Count(errs, "\n") != 1 {
			t.Errorf("plan %v: exit %d, stderr %q; want 2 and one line", bad, code, errs)
		}
	}
}

func TestEvolveOutputs(t *testing.T) {
	code, out, errs := runCmd(t, "", "evolve", "--radius", "30pc", "--criterion", "adiabatic", "--format", "json", "--samples", "5")
	if code != 0 {
		t.Fatalf("evolve: exit %d: %s", code, errs)
	}
	var doc struct {
		Trajectories []struct {
			Criterion string   `json:"criterion"`
			TDestroy  *float64 `json:"t_destroy_tcc"`
			Destroyed bool     `json:"destroyed"`
			Samples   []struct {
				M *float64 `json:"m_m0"`
			} `json:"samples"`
		} `json:"trajectories"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	// Destruction branch only with ram drag: m^{1/3} = 1 − t/(3κ) (derived),
	// so m = 1e-3 m0 at t = 2.7 κ t_cc = 10.8 t_cc with κ = 4.
	tr := doc.Trajectories[0]
	if !tr.Destroyed || tr.TDestroy == nil || math.Abs(*tr.TDestroy-10.8) > 1e-3 {
		t.Errorf("adiabatic: destroyed %v at %v t_cc, want 10.8", tr.Destroyed, tr.TDestroy)
	}
	if len(tr.Samples) != 5 {
		t.Errorf("%d samples, want 5", len(tr.Samples))
	}
	for _, bad := range [][]string{{"--kappa", "-1"}, {"--branch", "soft"}, {"--area", "cube"}, {"--mix-cooling", "none"}, {"--samples", "1"}, {"--until", "0"}, {"--format", "xml"}} {
		if code, _, errs := runCmd(t, "", append([]string{"evolve"}, bad...)...); code != 2 || strings.Count(errs, "\n") != 1 {
			t.Errorf("evolve %v: exit %d, stderr %q; want 2 and one line", bad, code, errs)
		}
	}
}

// TestEvolveECSVAstropy reads the evolve ECSV with astropy (an independent
// reader) and checks its columns and metadata.
func TestEvolveECSVAstropy(t *testing.T) {
	py := requireAstropy(t)
	path := filepath.Join(t.TempDir(), "traj.ecsv")
	code, out, errs := runCmd(t, "", "evolve", "--format", "ecsv", "--samples", "11")
	if code != 0 {
		t.Fatalf("evolve: exit %d: %s", code, errs)
	}
	os.WriteFile(path, []byte(out), 0o644)
	script := `import sys
from astropy.table import QTable
t = QTable.read(sys.argv[1], format="ascii.ecsv")
assert t.colnames == ["criterion", "t_tcc", "m_m0", "v_vw", "x_rcl"], t.colnames
assert len(t) == 11 * int(sys.argv[2]), len(t)
assert t.meta["constants"]["kappa"]["value"] == 4.0
assert abs(t["m_m0"][0] - 1) < 1e-12 and t["t_tcc"][0] == 0
print("ok", len(t))`
	b, err := exec.Command(py, "-c", script, path, strconv.Itoa(len(model.BuiltinCriteria()))).CombinedOutput() // 11 samples per criterion
	if err != nil {
		t.Errorf("astropy read of the evolve ECSV: %v\n%s", err, b)
	}
}
