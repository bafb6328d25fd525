// Package cli is cloudwind's command line: one file per command (eval,
// sweep, evolve, plan, outflow, cooling, explore), the shared flag handling, and the
// one place where errors become exit statuses. Only explore.go imports the
// explorer (package tui); the batch commands reach the physics, the
// cooling functions, the file formats and the reports through the shared
// packages below the interface.
package cli

import (
	"errors"
	"fmt"
	"io"
	"os"
	"runtime/debug"
	"strings"

	"cloudwind/internal/safetext"
	"cloudwind/internal/suggest"
)

// version is the program version; release builds may set it with
// -ldflags "-X cloudwind/internal/cli.version=…".
var version = "0.1.0-dev"

// Exit statuses.
const (
	exitOK      = 0
	exitFailure = 1 // the command ran and failed
	exitUsage   = 2 // the command line was wrong
)

// A usageError is a mistake on the command line: exit status 2.
type usageError struct{ msg string }

func (e *usageError) Error() string { return e.msg }

func usagef(format string, args ...any) error {
	return &usageError{fmt.Sprintf(format, args...)}
}

// env is what a command may touch of the outside world.
type env struct {
	args   []string
	stdin  io.Reader
	stdout io.Writer
	stderr io.Writer
	getenv func(string) string
}

// A command is one sub-command of cloudwind.
type command struct {
	name    string
	summary string
	run     func(e *env) error
}

func commands() []command {
	return []command{
		{"explore", "open the explorer (the default without a command)", runExplore},
		{"eval", "evaluate one scenario: derived quantities and every criterion", runEval},
		{"cooling", "sample a cooling function Λ(T) and compare it with another", runCooling},
		{"sweep", "evaluate every criterion over a grid of inputs, to CSV, ECSV or JSON", runSweep},
		{"evolve", "integrate the cloud's mass, velocity and position against t/t_cc", runEvolve},
		{"plan", "plan a simulation that can tell the criteria apart: box, resolution, cost", runPlan},
		{"outflow", "every criterion along a galactic outflow, and a cloud carried by it", runOutflow},
		{"version", "print the version", runVersion},
		{"help", "show help for cloudwind or a command", runHelp},
	}
}

// Main runs the command line args (without the program name) with the
// process's standard streams and environment and returns the exit status:
// 0 on success, 1 when the command failed, 2 when the command line was
// wrong.
func Main(args []string) int {
	return run(&env{args: args, stdin: os.Stdin, stdout: os.Stdout, stderr: os.Stderr, getenv: os.Getenv})
}

// run dispatches the command line and returns the exit status. It is the
// only place that turns errors into statuses.
func run(e *env) int {
	out := &checkedWriter{w: e.stdout}
	e2 := *e
	e2.stdout = out
	status := dispatch(&e2)
	if status == exitOK && out.err != nil {
		// Output that did not arrive is a failure, even when the command
		// itself succeeded (a full disk, a closed pipe).
		fmt.Fprintf(e.stderr, "cloudwind: write standard output: %s\n", safetext.Line(pathErrText(out.err)))
		return exitFailure
	}
	return status
}

// dispatch runs the command named by the first argument.
func dispatch(e *env) int {
	if len(e.args) == 0 {
		return exitStatus(e, "explore", runExplore(e))
	}
	name := e.args[0]
	if name == "-h" || name == "--help" || name == "-help" {
		printTopHelp(e.stdout)
		return exitOK
	}
	if name == "--version" || name == "-version" {
		name = "version"
	}
	for _, c := range commands() {
		if c.name == name {
			sub := *e
			sub.args = e.args[1:]
			return exitStatus(e, name, c.run(&sub))
		}
	}
	if strings.HasPrefix(name, "-") { // flags without a command: the explorer's
		return exitStatus(e, "explore", runExplore(e))
	}
	msg := fmt.Sprintf("unknown command %q", sanitizeArg(name))
	if s := suggest.Closest(name, commandNames()); s != "" {
		msg += fmt.Sprintf(" (did you mean %q?)", s)
	}
	fmt.Fprintf(e.stderr, "cloudwind: %s; run 'cloudwind help' for the list\n", msg)
	return exitUsage
}

// exitStatus prints err, if any, as one line and returns the exit status.
func exitStatus(e *env, cmd string, err error) int {
	if err == nil {
		return exitOK
	}
	if errors.Is(err, errHelpShown) {
		return exitOK
	}
	// Messages may quote file names and file contents: they pass through
	// the one sanitiser on their way to the terminal.
	fmt.Fprintf(e.stderr, "cloudwind %s: %s\n", cmd, safetext.Line(err.Error()))
	var ue *usageError
	if errors.As(err, &ue) {
		return exitUsage
	}
	return exitFailure
}

// errHelpShown ends a command after it printed its help.
var errHelpShown = errors.New("help shown")

func commandNames() []string {
	var n []string
	for _, c := range commands() {
		n = append(n, c.name)
	}
	return n
}

func printTopHelp(w io.Writer) {
	fmt.Fprint(w, `cloudwind — does a cold cloud survive and grow in a hot wind, or is it destroyed?

Usage:
  cloudwind COMMAND [flags]

Commands:
`)
	for _, c := range commands() {
		fmt.Fprintf(w, "  %-9s %s\n", c.name, c.summary)
	}
	fmt.Fprint(w, `
Run 'cloudwind help COMMAND' or 'cloudwind COMMAND --help' for a command's flags.

Examples:
  cloudwind eval --chi 300 --mach 1.5 --radius "10 pc"
  cloudwind eval --format json | python3 -m json.tool
`)
}

func runVersion(e *env) error {
	if len(e.args) > 0 {
		return usagef("version takes no arguments (got %q)", sanitizeArg(e.args[0]))
	}
	fmt.Fprintf(e.stdout, "cloudwind %s\n", versionString())
	return nil
}

// versionString is the version plus the VCS revision when the build has it.
func versionString() string {
	v := version
	if bi, ok := debug.ReadBuildInfo(); ok {
		var rev, dirty string
		for _, s := range bi.Settings {
			switch s.Key {
			case "vcs.revision":
				rev = s.Value
			case "vcs.modified":
				if s.Value == "true" {
					dirty = "+dirty"
				}
			}
		}
		if len(rev) > 12 {
			rev = rev[:12]
		}
		if rev != "" {
			v += " (" + rev + dirty + ")"
		}
	}
	return v
}

func runHelp(e *env) error {
	if len(e.args) == 0 {
		printTopHelp(e.stdout)
		return nil
	}
	for _, c := range commands() {
		if c.name == e.args[0] && c.name != "help" {
			sub := *e
			sub.args = []string{"--help"}
			return c.run(&sub)
		}
	}
	return usagef("no help for unknown command %q", sanitizeArg(e.args[0]))
}

// A checkedWriter remembers the first write error of standard output, so
// that run can exit non-zero when output was lost.
type checkedWriter struct {
	w   io.Writer
	err error
}

func (c *checkedWriter) Write(p []byte) (int, error) {
	if c.err != nil {
		return 0, c.err
	}
	n, err := c.w.Write(p)
	if err != nil {
		c.err = err
	}
	return n, err
}

// pathErrText is the message of err without the path that *os.PathError
// repeats (standard output's is "/dev/stdout").
func pathErrText(err error) string {
	var pe *os.PathError
	if errors.As(err, &pe) {
		return pe.Err.Error()
	}
	return err.Error()
}
