//go:build linux

package cli

import (
	"os"

	"golang.org/x/sys/unix"
)

// isTTY reports whether f is a terminal (not merely a character device
// such as /dev/null): whether it answers the terminal-attributes ioctl.
func isTTY(f *os.File) bool {
	_, err := unix.IoctlGetTermios(int(f.Fd()), unix.TCGETS)
	return err == nil
}
