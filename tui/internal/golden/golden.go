// Package golden compares test output with golden files, for the
// explorer's view and chart tests: testdata/<Test>/<name>.golden, with
// SGR escape sequences removed, rewritten by `go test -update`.
package golden

import (
	"flag"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// The -update flag rewrites golden files. It is registered here unless a
// test file of the package under test has registered it already.
func init() {
	if flag.Lookup("update") == nil {
		flag.Bool("update", false, "rewrite golden files")
	}
}

// updating reports whether -update was given.
func updating() bool {
	f := flag.Lookup("update")
	if f == nil {
		return false
	}
	g, ok := f.Value.(flag.Getter)
	if !ok {
		return false
	}
	b, _ := g.Get().(bool)
	return b
}

// SGR matches the SGR escape sequences lipgloss writes.
var SGR = regexp.MustCompile("\x1b\\[[0-9;]*m")

// Check compares got, SGR sequences removed, with
// testdata/<test>/<name>.golden, or rewrites the file under -update. A
// difference fails the test with the first differing line.
func Check(t *testing.T, test, name, got string) {
	t.Helper()
	got = SGR.ReplaceAllString(got, "")
	path := filepath.Join("testdata", test, name+".golden")
	if updating() {
		if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, []byte(got+"\n"), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test -run %s -update in this package)", err, test)
	}
	wl, gl := strings.Split(strings.TrimSuffix(string(want), "\n"), "\n"), strings.Split(got, "\n")
	for i := 0; i < max(len(wl), len(gl)); i++ {
		var w, g string
		if i < len(wl) {
			w = wl[i]
		}
		if i < len(gl) {
			g = gl[i]
		}
		if w != g {
			t.Fatalf("%s line %d:\n got %q\nwant %q\nfull output:\n%s", path, i+1, g, w, got)
		}
	}
}
