// Package atomicfile writes output files so that nothing at the output
// path is lost or damaged: a regular file (or a new name) is replaced only
// by a complete new file, renamed into place after it was written and
// synced; a device, a named pipe or a socket is written straight through
// and never replaced; a symbolic link is followed to its target, which is
// then treated by the same rules, and the link itself stays. A directory,
// a read-only file, a dangling link and a directory that cannot take a new
// file are refused by Check, before the caller computes anything.
//
// Every message names the path as the caller gave it, never the temporary
// file's name.
package atomicfile

import (
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"syscall"
	"unicode/utf8"

	"cloudwind/internal/safetext"
)

// Sentinel errors wrapped by Check and Write.
var (
	ErrDirectory = errors.New("is a directory")
	ErrReadOnly  = errors.New("is read-only")
	ErrDangling  = errors.New("is a symbolic link to a file that does not exist")
	ErrNoDir     = errors.New("directory does not exist")
)

// kind says how a Target is written.
type kind int

const (
	replace kind = iota // a regular file or a new name: through a temporary file, renamed over it
	stream              // a device, pipe or socket: written straight through
)

// A Target is an output path that Check found writable. Write writes it.
type Target struct {
	name string // as the caller gave it, for messages
	dest string // the path written: name, or a symbolic link's target
	kind kind
	perm fs.FileMode // the permissions the replaced file had, or 0644 for a new one
}

// Name returns the path as the caller gave it.
func (t *Target) Name() string { return t.name }

// Streams reports whether the target is a device, pipe or socket, written
// straight through rather than replaced.
func (t *Target) Streams() bool { return t.kind == stream }

// Exists reports whether something is at path already (a symbolic link
// counts, dangling or not). The explorer asks before overwriting.
func Exists(path string) bool {
	_, err := os.Lstat(path)
	return err == nil
}

// Check inspects path before anything is computed and returns the Target
// to write, or an error naming path: it is a directory (ErrDirectory), a
// read-only file (ErrReadOnly: no write permission bit is set, or the
// process may not write it), a symbolic link to nothing (ErrDangling), or a
// new name in a directory that does not exist (ErrNoDir) or cannot take a
// new file.
func Check(path string) (*Target, error) {
	t := &Target{name: path, dest: path, perm: 0o644}
	fail := func(err error) (*Target, error) {
		return nil, fmt.Errorf("%s: %w", safetext.Terminal(path), err)
	}
	if path == "" {
		return nil, errors.New("no output file given")
	}
	lst, err := os.Lstat(path)
	if err == nil && lst.Mode()&fs.ModeSymlink != 0 {
		dest, err := filepath.EvalSymlinks(path)
		if err != nil {
			if errors.Is(err, fs.ErrNotExist) {
				return fail(ErrDangling)
			}
			return fail(pathErr(err))
		}
		t.dest = dest
	}
	st, err := os.Stat(t.dest)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		dir := filepath.Dir(t.dest)
		dst, derr := os.Stat(dir)
		if derr != nil || !dst.IsDir() {
			return fail(ErrNoDir)
		}
		if syscall.Access(dir, 2|1) != nil { // W_OK|X_OK
			return fail(fmt.Errorf("the directory %s does not let this process create a file", safetext.Terminal(dir)))
		}
		return t, nil
	case err != nil:
		return fail(pathErr(err))
	}
	m := st.Mode()
	switch {
	case m.IsDir():
		return fail(ErrDirectory)
	case m&(fs.ModeDevice|fs.ModeCharDevice|fs.ModeNamedPipe|fs.ModeSocket) != 0:
		t.kind = stream
		return t, nil
	case !m.IsRegular():
		return fail(fmt.Errorf("is neither a regular file nor a device or pipe (%s)", m.Type()))
	}
	if m.Perm()&0o222 == 0 || syscall.Access(t.dest, 2) != nil {
		return fail(ErrReadOnly)
	}
	dir := filepath.Dir(t.dest)
	if syscall.Access(dir, 2|1) != nil {
		return fail(fmt.Errorf("the directory %s does not let this process replace the file", safetext.Terminal(dir)))
	}
	t.perm = m.Perm()
	return t, nil
}

// Write checks path (Check) and writes it with write.
func Write(path string, write func(w io.Writer) error) error {
	t, err := Check(path)
	if err != nil {
		return err
	}
	return t.Write(write)
}

// Write writes the target. A regular file or a new name is written to a
// temporary file beside it, synced, given the permissions of the file it
// replaces (0644 for a new one) and renamed over it; when write fails or
// returns an error, the temporary file is removed and whatever was at the
// path before is untouched. A device, pipe or socket is opened for writing
// and written directly. Errors name the path as the caller gave it.
func (t *Target) Write(write func(w io.Writer) error) (err error) {
	if t.kind == stream {
		f, err := os.OpenFile(t.dest, os.O_WRONLY, 0)
		if err != nil {
			return fmt.Errorf("open %s: %w", safetext.Terminal(t.name), pathErr(err))
		}
		w := &namedWriter{w: f, name: t.name}
		werr := write(w)
		cerr := f.Close()
		if werr != nil {
			return werr
		}
		if cerr != nil {
			return fmt.Errorf("write %s: %w", safetext.Terminal(t.name), pathErr(cerr))
		}
		return nil
	}
	dir := filepath.Dir(t.dest)
	tmp, err := os.CreateTemp(dir, tempPattern(filepath.Base(t.dest)))
	if err != nil {
		return fmt.Errorf("write %s: %w", safetext.Terminal(t.name), pathErr(err))
	}
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmp.Name())
		}
	}()
	if err = write(&namedWriter{w: tmp, name: t.name}); err != nil {
		return err
	}
	if err = tmp.Sync(); err != nil {
		return fmt.Errorf("write %s: %w", safetext.Terminal(t.name), pathErr(err))
	}
	if err = tmp.Close(); err != nil {
		return fmt.Errorf("write %s: %w", safetext.Terminal(t.name), pathErr(err))
	}
	if err = os.Chmod(tmp.Name(), t.perm); err != nil {
		return fmt.Errorf("write %s: %w", safetext.Terminal(t.name), pathErr(err))
	}
	if err = os.Rename(tmp.Name(), t.dest); err != nil {
		return fmt.Errorf("write %s: %w", safetext.Terminal(t.name), pathErr(err))
	}
	return nil
}

// tempPattern returns the os.CreateTemp pattern of the hidden temporary
// file beside a file named base: "." + base + ".tmp-*", with base cut (at a
// rune boundary) so that the whole name stays well under the 255-byte limit
// of common file systems however long base is.
func tempPattern(base string) string {
	const keep = 96
	if len(base) > keep {
		i := keep
		for i > 0 && !utf8.RuneStart(base[i]) {
			i--
		}
		base = base[:i]
	}
	return "." + base + ".tmp-*"
}

// A namedWriter reports write errors with the caller's name for the file,
// not the temporary file's.
type namedWriter struct {
	w    io.Writer
	name string
}

func (n *namedWriter) Write(p []byte) (int, error) {
	k, err := n.w.Write(p)
	if err != nil {
		err = &WriteError{Name: n.name, Err: pathErr(err)}
	}
	return k, err
}

// A WriteError is a failed write to an output file, named as the caller
// named it.
type WriteError struct {
	Name string
	Err  error
}

func (e *WriteError) Error() string {
	return "write " + safetext.Terminal(e.Name) + ": " + e.Err.Error()
}

// Unwrap returns the underlying error.
func (e *WriteError) Unwrap() error { return e.Err }

// pathErr drops the path that *os.PathError and *os.LinkError repeat.
func pathErr(err error) error {
	var pe *os.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	var le *os.LinkError
	if errors.As(err, &le) {
		return le.Err
	}
	return err
}
