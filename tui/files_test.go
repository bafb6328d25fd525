package tui

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"cloudwind/internal/report"
)

// The file keys s, x and J, each with its default extension.
var fileKeys = []struct{ key, name string }{{"s", "out.toml"}, {"x", "out.svg"}, {"J", "out.json"}}

// askPath presses a file key and types path into the prompt (the typed
// text replaces the suggestion).
func askPath(a *App, k, path string) {
	press(a, k)
	typeText(a, path)
	press(a, "enter")
}

// TestOverwriteAsks: for s, x and J an existing file is replaced only
// after y, the question shows the absolute path, n keeps the file, and the
// status confirms the write with the absolute path.
func TestOverwriteAsks(t *testing.T) {
	dir := t.TempDir()
	t.Chdir(dir) // a relative path typed: the messages must show it absolute
	for _, fk := range fileKeys {
		a := newTestApp(t, 120, 40)
		abs := filepath.Join(dir, fk.name)
		if err := os.WriteFile(abs, []byte("keep me"), 0o644); err != nil {
			t.Fatal(err)
		}
		askPath(a, fk.key, fk.name)
		if !a.prompt.Open() || !a.prompt.confirm || !strings.Contains(screen(a), abs) {
			t.Fatalf("%s over an existing file: no question naming %s\n%s", fk.key, abs, screen(a))
		}
		press(a, "n")
		if b, _ := os.ReadFile(abs); string(b) != "keep me" || a.status.isErr || !strings.Contains(a.status.text, abs+" is unchanged") {
			t.Errorf("%s, n: file %q, status %+v; want the file kept and said so", fk.key, b, a.status)
		}
		askPath(a, fk.key, fk.name)
		press(a, "y")
		if b, _ := os.ReadFile(abs); string(b) == "keep me" || len(b) == 0 {
			t.Errorf("%s, y: the file was not replaced", fk.key)
		}
		if a.status.isErr || !strings.HasSuffix(a.status.text, " to "+abs) {
			t.Errorf("%s, y: status %+v, want a confirmation with %s", fk.key, a.status, abs)
		}
		// A new file is written without a question.
		fresh := filepath.Join(dir, "new-"+fk.name)
		askPath(a, fk.key, fresh)
		if a.prompt.Open() || a.status.isErr {
			t.Errorf("%s to a new file: prompt open %v, status %+v", fk.key, a.prompt.Open(), a.status)
		}
		if _, err := os.Stat(fresh); err != nil {
			t.Errorf("%s to a new file: %v", fk.key, err)
		}
	}
	entries, _ := os.ReadDir(dir)
	for _, e := range entries {
		if strings.Contains(e.Name(), ".tmp-") {
			t.Errorf("a temporary file was left: %s", e.Name())
		}
	}
}

// TestOutputRefused: a directory, a read-only file and a dangling link are
// refused with the reason in the status line before anything is written;
// a device is written through without a question.
func TestOutputRefused(t *testing.T) {
	dir := t.TempDir()
	for _, fk := range fileKeys {
		ext := filepath.Ext(fk.name)
		sub := filepath.Join(dir, "dir"+ext)
		ro := filepath.Join(dir, "ro"+ext)
		link := filepath.Join(dir, "dangling"+ext)
		os.Mkdir(sub, 0o755)
		os.WriteFile(ro, []byte("old"), 0o444)
		os.Symlink(filepath.Join(dir, "nothing-here"), link)
		cases := []struct{ path, reason string }{
			{sub, "is a directory"},
			{ro, "is read-only"}, // refused by its permission bits, also for root (atomicfile.Check)
			{link, "is a symbolic link to a file that does not exist"},
		}
		for _, c := range cases {
			a := newTestApp(t, 120, 40)
			askPath(a, fk.key, c.path)
			if a.prompt.Open() || !a.status.isErr || !strings.Contains(a.status.text, c.reason) || !strings.Contains(a.status.text, c.path) {
				t.Errorf("%s to %s: prompt open %v, status %+v; want the refusal %q naming the path", fk.key, c.path, a.prompt.Open(), a.status, c.reason)
			}
		}
		if b, _ := os.ReadFile(ro); string(b) != "old" {
			t.Errorf("%s: the read-only file changed to %q", fk.key, b)
		}
	}
	a := newTestApp(t, 120, 40)
	askPath(a, "J", os.DevNull)
	if a.prompt.Open() || a.status.isErr || !strings.Contains(a.status.text, os.DevNull) {
		t.Errorf("J to %s: prompt open %v, status %+v; want it written through without a question", os.DevNull, a.prompt.Open(), a.status)
	}
}

// TestStateExportIsTheJSONWriter: J writes exactly what report.WriteJSON
// writes for the state document.
func TestStateExportIsTheJSONWriter(t *testing.T) {
	a := newTestApp(t, 120, 40)
	path := filepath.Join(t.TempDir(), "s.json")
	var want bytes.Buffer
	if err := report.WriteJSON(&want, report.StateDocument(&a.res, a.cur.cooling, a.cur.cf, a.cfg.Version)); err != nil {
		t.Fatal(err)
	}
	askPath(a, "J", path)
	got, err := os.ReadFile(path)
	if err != nil || !bytes.Equal(got, want.Bytes()) {
		t.Errorf("J wrote %d bytes (%v), want report.WriteJSON's %d bytes", len(got), err, want.Len())
	}
}

// TestExportViews: x on the evolution view writes both panels; on the
// plan view it writes the plan as text with the scenario caption, and
// refuses a figure extension.
func TestExportViews(t *testing.T) {
	dir := t.TempDir()
	a := newTestApp(t, 120, 40)
	press(a, "5")
	svg := filepath.Join(dir, "evolution.svg")
	askPath(a, "x", svg)
	b, err := os.ReadFile(svg)
	if err != nil {
		t.Fatalf("x on the evolution view: %v (status %+v)", err, a.status)
	}
	for _, want := range []string{"cloud mass m/m", "cloud velocity v/v"} {
		if !bytes.Contains(b, []byte(want)) {
			t.Errorf("the evolution figure lacks the panel %q", want)
		}
	}
	press(a, "6")
	if !strings.Contains(screen(a), "x") || a.keys.ExportChart.Help().Desc != "export plan text" {
		t.Errorf("x on the plan view is described as %q, want export plan text", a.keys.ExportChart.Help().Desc)
	}
	askPath(a, "x", filepath.Join(dir, "plan.svg"))
	if !a.status.isErr || !strings.Contains(a.status.text, "want .txt or .md") {
		t.Errorf("x on the plan view to .svg: status %+v, want a refusal", a.status)
	}
	for _, name := range []string{"plan.txt", "plan.md"} {
		askPath(a, "x", filepath.Join(dir, name))
		b, err := os.ReadFile(filepath.Join(dir, name))
		if err != nil || !bytes.Contains(b, []byte("χ = 300")) || !bytes.Contains(b, []byte("core-hours")) {
			t.Errorf("x on the plan view to %s: %v, %d bytes; want the caption and the plan", name, err, len(b))
		}
	}
}
