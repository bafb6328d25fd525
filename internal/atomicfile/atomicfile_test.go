package atomicfile

import (
	"errors"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// The expectations here are the rules of this package (its doc comment):
// common practice for output files, no published source.

func writeString(s string) func(io.Writer) error {
	return func(w io.Writer) error { _, err := io.WriteString(w, s); return err }
}

func readFile(t *testing.T, path string) string {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

// noTemp fails when a temporary file was left in dir.
func noTemp(t *testing.T, dir string) {
	t.Helper()
	es, _ := os.ReadDir(dir)
	for _, e := range es {
		if strings.Contains(e.Name(), ".tmp-") {
			t.Errorf("temporary file %s left in %s", e.Name(), dir)
		}
	}
}

func TestWriteRegularAndNew(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "out.csv")
	if err := Write(p, writeString("one")); err != nil {
		t.Fatalf("Write(new) = %v", err)
	}
	if st, _ := os.Stat(p); st.Mode().Perm() != 0o644 {
		t.Errorf("new file mode %v, want 0644", st.Mode().Perm())
	}
	os.Chmod(p, 0o600)
	if err := Write(p, writeString("two")); err != nil {
		t.Fatalf("Write(existing) = %v", err)
	}
	if got := readFile(t, p); got != "two" {
		t.Errorf("content %q, want %q", got, "two")
	}
	if st, _ := os.Stat(p); st.Mode().Perm() != 0o600 {
		t.Errorf("replaced file mode %v, want the old 0600", st.Mode().Perm())
	}
	noTemp(t, dir)
}

func TestWriteFailureKeepsOriginal(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "keep.txt")
	os.WriteFile(p, []byte("original"), 0o644)
	boom := errors.New("computation failed")
	err := Write(p, func(w io.Writer) error { io.WriteString(w, "partial"); return boom })
	if !errors.Is(err, boom) {
		t.Errorf("Write = %v, want the callback's error", err)
	}
	if got := readFile(t, p); got != "original" {
		t.Errorf("after a failed write the file holds %q, want the original", got)
	}
	noTemp(t, dir)
}

func TestCheckRefuses(t *testing.T) {
	dir := t.TempDir()
	ro := filepath.Join(dir, "ro.txt")
	os.WriteFile(ro, []byte("x"), 0o444)
	dangling := filepath.Join(dir, "dangling")
	os.Symlink(filepath.Join(dir, "nothing-here"), dangling)
	for _, c := range []struct {
		path string
		want error
	}{
		{dir, ErrDirectory},
		{ro, ErrReadOnly}, // refused even for root, by its permission bits
		{dangling, ErrDangling},
		{filepath.Join(dir, "no", "such", "dir", "f.csv"), ErrNoDir},
	} {
		_, err := Check(c.path)
		if !errors.Is(err, c.want) {
			t.Errorf("Check(%s) = %v, want %v", c.path, err, c.want)
			continue
		}
		if !strings.Contains(err.Error(), c.path) {
			t.Errorf("Check(%s) = %q does not name the path", c.path, err)
		}
	}
	if got := readFile(t, ro); got != "x" {
		t.Errorf("read-only file changed to %q", got)
	}
}

func TestWriteFollowsSymlink(t *testing.T) {
	dir := t.TempDir()
	target := filepath.Join(dir, "target.csv")
	os.WriteFile(target, []byte("old"), 0o640)
	link := filepath.Join(dir, "link.csv")
	if err := os.Symlink("target.csv", link); err != nil {
		t.Skip("no symlinks here:", err)
	}
	if err := Write(link, writeString("new")); err != nil {
		t.Fatalf("Write(link) = %v", err)
	}
	if st, _ := os.Lstat(link); st.Mode()&fs.ModeSymlink == 0 {
		t.Errorf("the link was replaced by a %v", st.Mode())
	}
	if got := readFile(t, target); got != "new" {
		t.Errorf("target holds %q, want %q", got, "new")
	}
	if st, _ := os.Stat(target); st.Mode().Perm() != 0o640 {
		t.Errorf("target mode %v, want 0640 kept", st.Mode().Perm())
	}
	noTemp(t, dir)
}

func TestWriteDeviceStraightThrough(t *testing.T) {
	before, err := os.Stat(os.DevNull)
	if err != nil {
		t.Skip("no", os.DevNull)
	}
	tg, err := Check(os.DevNull)
	if err != nil {
		t.Fatalf("Check(%s) = %v", os.DevNull, err)
	}
	if !tg.Streams() {
		t.Fatalf("Check(%s) would replace the device", os.DevNull)
	}
	if err := tg.Write(writeString("discarded")); err != nil {
		t.Fatalf("Write(%s) = %v", os.DevNull, err)
	}
	after, err := os.Stat(os.DevNull)
	if err != nil || after.Mode() != before.Mode() || !os.SameFile(before, after) {
		t.Fatalf("%s changed: before %v, after %v (%v)", os.DevNull, before.Mode(), after.Mode(), err)
	}
}

func TestWriteNamedPipe(t *testing.T) {
	dir := t.TempDir()
	fifo := filepath.Join(dir, "pipe")
	if err := syscall.Mkfifo(fifo, 0o644); err != nil {
		t.Skip("no named pipes here:", err)
	}
	got := make(chan string)
	go func() {
		f, err := os.Open(fifo)
		if err != nil {
			got <- "open: " + err.Error()
			return
		}
		b, _ := io.ReadAll(f)
		f.Close()
		got <- string(b)
	}()
	if err := Write(fifo, writeString("through the pipe")); err != nil {
		t.Fatalf("Write(fifo) = %v", err)
	}
	if s := <-got; s != "through the pipe" {
		t.Errorf("reader got %q", s)
	}
	if st, _ := os.Lstat(fifo); st.Mode()&fs.ModeNamedPipe == 0 {
		t.Errorf("the pipe was replaced by a %v", st.Mode())
	}
}

func TestWriteLongName(t *testing.T) {
	dir := t.TempDir()
	name := strings.Repeat("é", 100) + strings.Repeat("x", 40) + ".csv" // 244 bytes: a temp suffix would pass 255
	p := filepath.Join(dir, name)
	if err := Write(p, writeString("ok")); err != nil {
		t.Fatalf("Write(%d-byte name) = %v", len(name), err)
	}
	if got := readFile(t, p); got != "ok" {
		t.Errorf("content %q", got)
	}
	if pat := tempPattern(name); len(pat) > 120 || !strings.HasSuffix(pat, ".tmp-*") {
		t.Errorf("tempPattern = %q (%d bytes)", pat, len(pat))
	}
}

// TestWriteErrorNamesOriginal: a write error names the output as the
// caller gave it, never the temporary file.
func TestWriteErrorNamesOriginal(t *testing.T) {
	if _, err := os.Stat("/dev/full"); err != nil {
		t.Skip("no /dev/full")
	}
	dir := t.TempDir()
	link := filepath.Join(dir, "full.out")
	os.Symlink("/dev/full", link)
	err := Write(link, writeString("x"))
	var we *WriteError
	if !errors.As(err, &we) || we.Name != link || strings.Contains(err.Error(), ".tmp-") {
		t.Errorf("Write(→/dev/full) = %v, want a WriteError naming %s", err, link)
	}
}
