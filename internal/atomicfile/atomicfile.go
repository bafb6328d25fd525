// Package atomicfile writes output files so that a failed or interrupted
// write never leaves a truncated or half-overwritten file.
package atomicfile

import (
	"cloudwind/internal/safetext"
	"fmt"
	"io"
	"os"
	"path/filepath"
)

// Write writes path through a temporary file in the same
// directory, synced and then renamed over path, so that a failed or
// interrupted write never leaves a truncated or half-overwritten file.
// write receives the temporary file.
func Write(path string, write func(w io.Writer) error) (err error) {
	dir := filepath.Dir(path)
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".tmp-*")
	if err != nil {
		return fmt.Errorf("write %s: %w", safetext.Terminal(path), pathErr(err))
	}
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmp.Name())
		}
	}()
	if err = write(tmp); err != nil {
		return err
	}
	if err = tmp.Sync(); err != nil {
		return fmt.Errorf("write %s: %w", safetext.Terminal(path), err)
	}
	if err = tmp.Close(); err != nil {
		return fmt.Errorf("write %s: %w", safetext.Terminal(path), err)
	}
	// Keep the permissions a new file would get (CreateTemp uses 0600).
	if st, statErr := os.Stat(path); statErr == nil {
		os.Chmod(tmp.Name(), st.Mode().Perm())
	} else {
		os.Chmod(tmp.Name(), 0o644)
	}
	if err = os.Rename(tmp.Name(), path); err != nil {
		return fmt.Errorf("write %s: %w", safetext.Terminal(path), pathErr(err))
	}
	return nil
}

// pathErr drops the path that *os.PathError repeats.
func pathErr(err error) error {
	if pe, ok := err.(*os.PathError); ok {
		return pe.Err
	}
	return err
}
