package cli

import (
	"fmt"
	"io"
	"os"

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

// writeFileAtomic writes path atomically; see atomicfile.Write.
func writeFileAtomic(path string, write func(w io.Writer) error) error {
	return atomicfile.Write(path, write)
}
