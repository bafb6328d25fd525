package cli

import (
	"context"
	"fmt"
	"io"
	"os"
	"os/signal"
	"path/filepath"
	"slices"
	"strings"
	"syscall"

	"cloudwind/internal/atomicfile"
)

// openInput opens path for reading; "-" is standard input. The returned
// name is what error messages call the input.
func openInput(e *env, path string) (r io.Reader, name string, closeFn func(), err error) {
	if path == "-" {
		return e.stdin, "<stdin>", func() {}, nil
	}
	f, err := os.Open(path)
	if err != nil {
		return nil, "", nil, fmt.Errorf("open %s: %w", sanitizeArg(path), unwrapPathError(err))
	}
	return f, path, func() { f.Close() }, nil
}

// unwrapPathError drops the path that *os.PathError repeats.
func unwrapPathError(err error) error {
	if pe, ok := err.(*os.PathError); ok {
		return pe.Err
	}
	return err
}

// checkOutput checks an -o path before anything is computed: nil (standard
// output) for "" and "-", else the atomicfile.Target to write.
func checkOutput(path string) (*atomicfile.Target, error) {
	if path == "" || path == "-" {
		return nil, nil
	}
	return atomicfile.Check(path)
}

// writeFileAtomic checks and writes path (atomicfile.Write).
func writeFileAtomic(path string, write func(w io.Writer) error) error {
	return atomicfile.Write(path, write)
}

// interruptContext returns a context cancelled by SIGINT, SIGTERM or SIGHUP
// (an SSH connection dropping), so that a long run stops cleanly and
// leaves no temporary file behind.
func interruptContext() (context.Context, context.CancelFunc) {
	return signal.NotifyContext(context.Background(), os.Interrupt, syscall.SIGTERM, syscall.SIGHUP)
}

// formatFor returns the output format: --format when given, else the one
// the -o file's extension names (".ecsv" → ecsv), else def (the flag's
// default). A --format that contradicts the extension is refused, so that
// out.ecsv never holds CSV. known lists the formats and extensions.
func formatFor(format string, given bool, out, def string, known ...string) (string, error) {
	ext := strings.TrimPrefix(strings.ToLower(filepath.Ext(out)), ".")
	if out == "-" || !slices.Contains(known, ext) {
		ext = ""
	}
	switch {
	case given && ext != "" && format != ext:
		return "", usagef("-o %s names the %s format but --format is %s; give one of them, or make them agree",
			sanitizeArg(out), ext, sanitizeArg(format))
	case given:
		return format, nil
	case ext != "":
		return ext, nil
	}
	return def, nil
}
