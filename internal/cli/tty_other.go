//go:build !linux

package cli

import "os"

// isTTY reports whether f is a character device, the nearest test
// without the terminal ioctl of Linux.
func isTTY(f *os.File) bool {
	st, err := f.Stat()
	return err == nil && st.Mode()&os.ModeCharDevice != 0
}
