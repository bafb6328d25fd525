package scenario

import (
	"errors"
	"fmt"
	"path/filepath"

	"cloudwind/cooling"
	"cloudwind/internal/safetext"
)

// CoolingSpec returns the cooling spec of a scenario file that lies in
// dir: a relative table path is taken relative to dir; names, formulas,
// absolute paths and "" are returned unchanged, and so is every spec when
// dir is "" (a file read from standard input).
func CoolingSpec(spec, dir string) string {
	if spec == "" || dir == "" || !cooling.IsFileSpec(spec) || filepath.IsAbs(spec) {
		return spec
	}
	return filepath.Join(dir, spec)
}

// SavedCoolingSpec returns the cooling spec as a scenario file at path must
// name it, the inverse of CoolingSpec: a table path relative to the
// file's directory (absolute where no relative path exists). A table read
// from standard input cannot be named, and is an error.
func SavedCoolingSpec(spec, path string) (string, error) {
	if spec == "" || !cooling.IsFileSpec(spec) {
		return spec, nil
	}
	if spec == "-" {
		return "", errors.New("the cooling table was read from standard input, which a scenario file cannot name: give the cooling input (a: more inputs) a file first")
	}
	abs, err := filepath.Abs(spec)
	if err != nil {
		return "", fmt.Errorf("cooling table %s: %w", safetext.Terminal(spec), err)
	}
	dir, err := filepath.Abs(filepath.Dir(path))
	if err != nil {
		return abs, nil
	}
	if rel, err := filepath.Rel(dir, abs); err == nil {
		return rel, nil
	}
	return abs, nil
}
