package cli

import (
	"bytes"
	"encoding/json"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/parquet-go/parquet-go"
)

// Tests of sweep's --columns and --shard: the selected columns hold the
// values of the full output, and the shards of a grid, headers aside,
// concatenate to the single-process output byte for byte (both rules of
// cloudwind's interface, no published source).

func csvTable(t *testing.T, out string) (head []string, rows [][]string) {
	t.Helper()
	lines := strings.Split(strings.TrimSuffix(out, "\n"), "\n")
	head = strings.Split(lines[0], ",")
	for _, l := range lines[1:] {
		rows = append(rows, strings.Split(l, ","))
	}
	return head, rows
}

func TestSweepColumns(t *testing.T) {
	grid := []string{"sweep", "--chi", "log:10:1e4:7", "--mach", "0.5,2", "--radius", "log:0.1:1e3:9"}
	fullHead, fullRows := csvTable(t, mustRun(t, grid...))
	at := map[string]int{}
	for i, n := range fullHead {
		at[n] = i
	}
	for _, c := range []struct {
		spec string
		want []string // the header wanted; nil: check the count only
		n    int
	}{
		{"chi,radius_pc", []string{"chi", "radius_pc"}, 2},
		{"radius_pc,chi", []string{"radius_pc", "chi"}, 2},
		{"*_radius_crit_pc", nil, 9},
		{"chi, radius_pc ,*_verdict", nil, 11},
		// A twin written before its original: the original's value must not be reused.
		{"sparre_2020_radius_crit_pc,li_2020_ratio,gronke_oh_2018_radius_crit_pc,turbulent_wind_2025_radius_crit_pc", nil, 4},
		{"t_cool_*,mass_cloud_msun", nil, 5},
	} {
		head, rows := csvTable(t, mustRun(t, append(grid, "--columns", c.spec)...))
		if c.want != nil && strings.Join(head, ",") != strings.Join(c.want, ",") {
			t.Errorf("--columns %q: header %v, want %v", c.spec, head, c.want)
		}
		if len(head) != c.n {
			t.Errorf("--columns %q: %d columns %v, want %d", c.spec, len(head), head, c.n)
		}
		if len(rows) != len(fullRows) {
			t.Fatalf("--columns %q: %d rows, want %d", c.spec, len(rows), len(fullRows))
		}
		for i, r := range rows {
			for j, name := range head {
				if want := fullRows[i][at[name]]; r[j] != want {
					t.Fatalf("--columns %q row %d %s = %s, the full output has %s", c.spec, i, name, r[j], want)
				}
			}
		}
	}
	// The selection and the inputs not swept are in the metadata.
	var doc struct {
		Meta struct {
			Columns struct {
				Selection string   `json:"selection"`
				Names     []string `json:"names"`
			} `json:"columns"`
			Fixed map[string]float64 `json:"fixed_inputs"`
		} `json:"meta"`
	}
	out := mustRun(t, append(grid, "--columns", "chi,*_verdict", "--format", "json")...)
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	if doc.Meta.Columns.Selection != "chi,*_verdict" || len(doc.Meta.Columns.Names) != 10 {
		t.Errorf("meta columns = %+v", doc.Meta.Columns)
	}
	for _, swept := range []string{"chi", "mach", "radius_pc"} {
		if _, ok := doc.Meta.Fixed[swept]; ok {
			t.Errorf("fixed_inputs lists the swept input %s: %v", swept, doc.Meta.Fixed)
		}
	}
	for _, fixed := range []string{"pressure_kcm3", "t_cloud_k", "metallicity_zsun"} {
		if _, ok := doc.Meta.Fixed[fixed]; !ok {
			t.Errorf("fixed_inputs lacks %s: %v", fixed, doc.Meta.Fixed)
		}
	}
	ecsv := mustRun(t, append(grid, "--columns", "chi,*_margin", "--format", "ecsv")...)
	if !strings.Contains(ecsv, `# - {"columns": {"selection": "chi,*_margin"`) {
		t.Errorf("ECSV header does not record the selection:\n%s", ecsv[:min(len(ecsv), 3000)])
	}

	for _, c := range []struct{ spec, frag string }{
		{"chi,radius", `unknown column "radius" (did you mean "radius_pc"?)`},
		{"*_radius_crit", `pattern "*_radius_crit" matches no column`},
		{"chi,chi", `column "chi" is selected twice`},
		{"chi,,mach", "empty column name"},
		{"[chi", "invalid pattern"},
		{"*_verdict,gronke_oh_2018_verdict", `column "gronke_oh_2018_verdict" is selected twice`},
	} {
		code, out, errs := runCmd(t, "", append(grid, "--columns", c.spec)...)
		if code != 2 || out != "" || !strings.Contains(errs, "--columns: "+c.frag) {
			t.Errorf("--columns %q: exit %d, stderr %q; want 2 and %q", c.spec, code, errs, c.frag)
		}
	}
}

func TestSweepShards(t *testing.T) {
	grid := []string{"sweep", "--chi", "log:10:1e4:13", "--pressure", "100,1e4", "--radius", "log:0.1:1e3:47", "--workers", "3"}
	for _, format := range []string{"csv", "jsonl", "ecsv"} {
		single := mustRun(t, append(grid, "--format", format)...)
		ns := []int{1, 7}
		if format == "csv" {
			ns = []int{1, 2, 7, 64, 1300} // 1300 > 1222 points: some shards are empty
		}
		for _, n := range ns {
			var merged strings.Builder
			var header string
			for k := range n {
				out := mustRun(t, append(grid, "--format", format, "--shard", itoa(k)+"/"+itoa(n))...)
				h, body := splitHeader(out, format)
				if k == 0 {
					header = h
					merged.WriteString(h)
				} else if format == "csv" && h != header {
					t.Fatalf("%s shard %d/%d: header %q differs from shard 0's %q", format, k, n, h, header)
				}
				merged.WriteString(body)
			}
			if format == "ecsv" {
				// The ECSV header records the shard; compare the rows.
				_, a := splitHeader(single, format)
				_, b := splitHeader(merged.String(), format)
				if a != b {
					t.Errorf("ecsv: the rows of %d shards differ from the single sweep", n)
				}
				continue
			}
			if merged.String() != single {
				t.Errorf("%s: %d shards merged (%d bytes) differ from the single sweep (%d bytes)", format, n, merged.Len(), len(single))
			}
		}
	}
	// The shard is in the metadata.
	var doc struct {
		Meta struct {
			Shard  map[string]int `json:"shard"`
			Points int            `json:"grid_points"`
		} `json:"meta"`
		Rows []json.RawMessage `json:"rows"`
	}
	if err := json.Unmarshal([]byte(mustRun(t, append(grid, "--format", "json", "--shard", "2/5")...)), &doc); err != nil {
		t.Fatal(err)
	}
	// 13 × 2 × 47 = 1222 points; shard 2 of 5 is rows ⌊2·1222/5⌋ = 488 to ⌊3·1222/5⌋ = 733.
	if s := doc.Meta.Shard; s["index"] != 2 || s["count"] != 5 || s["first_row"] != 488 || s["rows"] != 245 || doc.Meta.Points != 1222 || len(doc.Rows) != 245 {
		t.Errorf("shard meta %v, %d points, %d rows", doc.Meta.Shard, doc.Meta.Points, len(doc.Rows))
	}
	for _, c := range []struct{ spec, frag string }{
		{"3", "want K/N"}, {"4/4", "K must be from 0 to N−1 = 3 (got 4)"}, {"-1/4", "K must be from 0"},
		{"a/b", "want K/N"}, {"0/0", "N must be from 1"}, {"1/2/3", "want K/N"}, {"0/1e9", "want K/N"},
	} {
		code, _, errs := runCmd(t, "", append(grid, "--shard", c.spec)...)
		if code != 2 || !strings.Contains(errs, "--shard: "+c.frag) {
			t.Errorf("--shard %q: exit %d, stderr %q; want 2 and %q", c.spec, code, errs, c.frag)
		}
	}
}

func itoa(i int) string { return strconv.Itoa(i) }

// splitHeader splits output into its header and its rows.
func splitHeader(out, format string) (string, string) {
	switch format {
	case "csv":
		i := strings.IndexByte(out, '\n')
		return out[:i+1], out[i+1:]
	case "ecsv":
		lines := strings.SplitAfter(out, "\n")
		n := 0
		for n < len(lines) && strings.HasPrefix(lines[n], "#") {
			n++
		}
		n++ // the names line
		return strings.Join(lines[:n], ""), strings.Join(lines[n:], "")
	}
	return "", out
}

// TestSweepParquet: a Parquet sweep read back by hyparquet, an independent
// JavaScript reader from the npm registry (testdata/parquet), holds the
// CSV sweep's columns and values (to the CSV's nine figures, 1e-8
// relative), and the Parquet shards of a grid hold its rows in order.
func TestSweepParquet(t *testing.T) {
	node, dir := requireHyparquetCLI(t)
	tmp := t.TempDir()
	grid := []string{"sweep", "--chi", "log:10:1e4:13", "--mach", "0.5,2", "--t-cloud", "8e3,1e4", "--radius", "log:0.1:1e3:31"}
	pq, csv := filepath.Join(tmp, "g.parquet"), filepath.Join(tmp, "g.csv")
	mustRun(t, append(grid, "-o", pq)...)
	mustRun(t, append(grid, "-o", csv)...)
	script := filepath.Join("..", "..", "testdata", "parquet", "read_parquet.mjs")
	if out, err := exec.Command(node, script, dir, pq, csv, "1e-8").CombinedOutput(); err != nil {
		t.Fatalf("hyparquet disagrees with the CSV: %v\n%s", err, out)
	}
	// Selected columns, and each of 3 shards against its CSV shard.
	for k := range 3 {
		args := append(grid, "--columns", "chi,radius_pc,*_verdict,gronke_oh_2018_radius_crit_pc", "--shard", strconv.Itoa(k)+"/3")
		pqk, csvk := filepath.Join(tmp, "s.parquet"), filepath.Join(tmp, "s.csv")
		mustRun(t, append(args, "-o", pqk)...)
		mustRun(t, append(args, "-o", csvk)...)
		if out, err := exec.Command(node, script, dir, pqk, csvk, "1e-8").CombinedOutput(); err != nil {
			t.Fatalf("shard %d/3: hyparquet disagrees with the CSV: %v\n%s", k, err, out)
		}
	}
}

// requireHyparquetCLI finds node and the hyparquet package as the report
// package's test does, skipping (failing under CI=true) without them.
func requireHyparquetCLI(t *testing.T) (node, dir string) {
	t.Helper()
	dir = os.Getenv("CLOUDWIND_HYPARQUET_DIR")
	if dir == "" {
		if cache, err := os.UserCacheDir(); err == nil {
			dir = filepath.Join(cache, "cloudwind", "hyparquet")
		}
	}
	node, err := exec.LookPath("node")
	if err == nil {
		_, err = os.Stat(filepath.Join(dir, "src", "node.js"))
	}
	if err != nil {
		msg := "node or the npm package hyparquet is missing (apt-get install -y nodejs; bash testdata/parquet/fetch-hyparquet.sh DIR; CLOUDWIND_HYPARQUET_DIR=DIR/hyparquet)"
		if os.Getenv("CI") == "true" {
			t.Fatal(msg)
		}
		t.Skip(msg)
	}
	return node, dir
}

// TestSweepParquetWorkers: the row groups are encoded on the workers, yet
// the file is the same on 1, 2 and 3 workers: a grid of
// 150,000 rows of all 58 columns makes five row groups (report.GroupRows),
// so groups are encoded concurrently and committed out of the order they
// finish in.
func TestSweepParquetWorkers(t *testing.T) {
	tmp := t.TempDir()
	grid := []string{"sweep", "--chi", "log:10:1e4:50", "--radius", "log:0.1:1e3:3000"}
	var first []byte
	for _, w := range []string{"1", "2", "3"} {
		out := filepath.Join(tmp, "w"+w+".parquet")
		mustRun(t, append(grid, "--workers", w, "-o", out)...)
		data, err := os.ReadFile(out)
		if err != nil {
			t.Fatal(err)
		}
		if first == nil {
			first = data
			continue
		}
		if !bytes.Equal(data, first) {
			t.Errorf("--workers %s wrote %d bytes, --workers 1 %d bytes; want the same file", w, len(data), len(first))
		}
	}
	f, err := parquet.OpenFile(bytes.NewReader(first), int64(len(first)))
	if err != nil {
		t.Fatal(err)
	}
	if n, groups := f.NumRows(), len(f.RowGroups()); n != 150000 || groups != 5 {
		t.Errorf("file has %d rows in %d row groups, want 150000 in 5", n, groups)
	}
}
