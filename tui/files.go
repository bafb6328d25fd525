package tui

import (
	"errors"
	"fmt"
	"io"
	"path/filepath"
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"cloudwind/internal/atomicfile"
	"cloudwind/internal/chartspec"
	"cloudwind/internal/figure"
	"cloudwind/internal/quantity"
	"cloudwind/internal/report"
	"cloudwind/internal/scenario"
)

// Files the explorer writes (s, x, J). Every output goes the same way:
// the path typed is made absolute and checked (atomicfile.Check) in a
// command, so that a directory, a read-only file or a dangling link is
// refused with the reason before anything is written; an existing file is
// replaced only after a yes to a question that shows its absolute path
// (a device or a pipe is written through without asking); the file is
// written atomically, and the status line confirms with the absolute path.
// Messages name the path, never a temporary file.

// An output is a file about to be written: what it holds, for messages,
// the path as typed, and how to write it. The content is captured when the
// path is accepted, so that later changes do not alter what is written.
type output struct {
	what  string                              // "scenario", "chart", "state", "plan"
	path  string                              // as typed
	write func(abs string, w io.Writer) error // abs: the absolute path, for paths written relative to it
}

// outputCheckedMsg carries the result of checking an output's path.
type outputCheckedMsg struct {
	out    output
	abs    string
	target *atomicfile.Target
	exists bool // a regular file (or a link to one) is there: ask before replacing it
	err    error
}

// checkOutput makes out's path absolute and checks it off the update loop.
func checkOutput(out output) tea.Cmd {
	return func() tea.Msg {
		abs, err := filepath.Abs(out.path)
		if err != nil {
			return outputCheckedMsg{out: out, err: fmt.Errorf("%s: %w", quantity.Sanitize(out.path), err)}
		}
		t, err := atomicfile.Check(abs)
		if err != nil {
			return outputCheckedMsg{out: out, abs: abs, err: err}
		}
		return outputCheckedMsg{out: out, abs: abs, target: t, exists: atomicfile.Exists(abs) && !t.Streams()}
	}
}

// writeOutput writes a checked output and reports in the status line.
func writeOutput(out output, abs string, t *atomicfile.Target) tea.Cmd {
	return func() tea.Msg {
		if err := t.Write(func(w io.Writer) error { return out.write(abs, w) }); err != nil {
			return statusMsg{"not written: " + oneLine(err.Error()), true}
		}
		verb := map[string]string{"scenario": "saved the scenario to ", "chart": "exported the chart to ",
			"state": "exported the state to ", "plan": "exported the plan to "}[out.what]
		return statusMsg{verb + quantity.Sanitize(abs), false}
	}
}

// applyChecked goes on with a checked output: the reason in the status
// line when it was refused, the overwrite question when a file is there,
// else the write.
func (a *App) applyChecked(m outputCheckedMsg) tea.Cmd {
	switch {
	case m.err != nil:
		a.setStatus("not written: "+oneLine(m.err.Error()), true)
		return nil
	case m.exists:
		a.prompt.Confirm("overwrite the existing file?", []string{m.abs},
			func() tea.Cmd { return writeOutput(m.out, m.abs, m.target) },
			func() tea.Cmd {
				a.setStatus("not written: "+m.abs+" is unchanged", false)
				return nil
			})
		return nil
	}
	return writeOutput(m.out, m.abs, m.target)
}

// askOutput opens the path prompt for an output; on enter the path is
// checked (checkOutput), unless prepare refuses it at once (an empty path,
// a figure format the extension does not name).
func (a *App) askOutput(question, suggestion string, prepare func(path string) (output, error)) {
	a.prompt.AskPath(question, suggestion, func(path string) tea.Cmd {
		if path == "" {
			a.setStatus("no file name given", true)
			return nil
		}
		out, err := prepare(path)
		if err != nil {
			a.setStatus("not written: "+oneLine(err.Error()), true)
			return nil
		}
		return checkOutput(out)
	})
}

// saveScenarioOutput is the current state as a scenario file; a table
// path is written relative to the file's directory.
func saveScenarioOutput(path string, sc scenario.Scenario) output {
	return output{what: "scenario", path: path, write: func(abs string, w io.Writer) error {
		var err error
		if sc.Cooling, err = scenario.SavedCoolingSpec(sc.Cooling, abs); err != nil {
			return err
		}
		return scenario.Write(w, sc)
	}}
}

// stateOutput is the evaluated state as JSON (the schema of cloudwind
// eval --format json) through the one JSON writer.
func stateOutput(path string, doc map[string]any) output {
	return output{what: "state", path: path, write: func(_ string, w io.Writer) error { return report.WriteJSON(w, doc) }}
}

// chartOutput is the chart on screen: a figure (SVG or PNG, by the
// extension; both panels of the evolution view), or for the plan view its
// text (.txt, or .md with the text in a code block).
func chartOutput(path string, c chartState, caption string) (output, error) {
	if c.text != nil {
		return planOutput(path, c.text, caption)
	}
	f, err := figure.FormatOf(path)
	if err != nil {
		return output{}, err
	}
	var enc func(w io.Writer) error
	switch {
	case c.line2 != nil:
		enc = func(w io.Writer) error { return figure.EncodePanels(w, f, []*chartspec.LineChart{c.line, c.line2}) }
	case c.line != nil:
		enc = func(w io.Writer) error { return figure.EncodeLineChart(w, f, c.line) }
	case c.regime != nil:
		enc = func(w io.Writer) error { return figure.EncodeRegimeMap(w, f, c.regime) }
	default:
		return output{}, errors.New("no chart yet: wait until it is drawn")
	}
	return output{what: "chart", path: path, write: func(_ string, w io.Writer) error { return enc(w) }}, nil
}

// planOutput is the plan view's text under a caption line naming the
// scenario: plain text for .txt, a heading and a code block for .md.
func planOutput(path string, text []string, caption string) (output, error) {
	ext := strings.ToLower(filepath.Ext(path))
	if ext != ".txt" && ext != ".md" {
		return output{}, fmt.Errorf("%s: the plan is text: want .txt or .md (got %q)", quantity.Sanitize(path), quantity.Sanitize(ext))
	}
	body := strings.Join(text, "\n") + "\n"
	return output{what: "plan", path: path, write: func(_ string, w io.Writer) error {
		var s string
		if ext == ".md" {
			s = "# Simulation plan\n\n" + caption + "\n\n```\n" + body + "```\n"
		} else {
			s = caption + "\n\n" + body
		}
		_, err := io.WriteString(w, s)
		return err
	}}, nil
}
