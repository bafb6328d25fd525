package cli

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"cloudwind/internal/scenario"
	"cloudwind/model"
)

// TestREADMEExamples runs every example of the README as a user would: each
// command line that starts with "cloudwind " (in code blocks and in inline
// code), each TOML file shown (scenario and criteria files), and the Python
// snippet (with Debian's astropy, when installed). Synopsis lines (with
// [optional] parts or …) and the explorer (which needs a terminal) are not
// commands. Files the examples name are provided: the Sutherland & Dopita
// 1993 tables from Debian's python3-pydl, the CHIANTI-based curves of Ryden
// & Pogge 2021 in testdata/cie-cooling-chianti, and small files of our own
// for the rest. Under CI=true a missing external table fails the test
// instead of skipping its command.
func TestREADMEExamples(t *testing.T) {
	text, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	blocks, inline := readmeCode(string(text))
	dir := t.TempDir()
	fixtures := readmeFixtures(t, dir)

	// TOML files.
	nTOML := 0
	for _, b := range blocks {
		if b.lang != "toml" {
			continue
		}
		nTOML++
		switch {
		case strings.Contains(b.text, "[[criterion]]"):
			if _, err := scenario.LoadCriteria(strings.NewReader(b.text), "README.toml", model.BuiltinCriteria()); err != nil {
				t.Errorf("README criteria file (line %d) is refused: %v", b.line, err)
			}
		default:
			if _, err := scenario.Parse(strings.NewReader(b.text), "README.toml"); err != nil {
				t.Errorf("README scenario file (line %d) is refused: %v", b.line, err)
			}
		}
	}
	if nTOML == 0 {
		t.Error("found no TOML example in the README")
	}

	// Command lines, in README order (a sweep writes the grid the Python
	// snippet reads).
	var cmds []readmeLine
	for _, b := range blocks {
		if b.lang == "toml" || b.lang == "python" {
			continue
		}
		cmds = append(cmds, commandLines(b)...)
	}
	for _, l := range inline {
		cmds = append(cmds, commandLines(codeBlock{text: l.text, line: l.line})...)
	}
	if len(cmds) < 5 {
		t.Fatalf("found %d command examples in the README, want several", len(cmds))
	}
	t.Logf("%d command examples, %d TOML files", len(cmds), nTOML)
	t.Chdir(dir)
	for _, c := range cmds {
		args := shellWords(c.text)
		if missing := missingFixture(args, fixtures); missing != "" {
			if os.Getenv("CI") == "true" {
				t.Errorf("README line %d: %s needs %s, which is not installed", c.line, c.text, missing)
			} else {
				t.Logf("README line %d: skipped (no %s here)", c.line, missing)
			}
			continue
		}
		code, out, errs := runCmd(t, "", args[1:]...)
		if code != 0 {
			t.Errorf("README line %d: %s: exit %d: %s", c.line, c.text, code, errs)
		} else if out == "" && !strings.Contains(c.text, " -o ") {
			t.Errorf("README line %d: %s printed nothing", c.line, c.text)
		}
	}

	// The Python snippet, against the grid a README sweep wrote.
	for _, b := range blocks {
		if b.lang != "python" {
			continue
		}
		py := "/usr/bin/python3"
		if exec.Command(py, "-c", "import astropy").Run() != nil {
			if os.Getenv("CI") == "true" {
				t.Errorf("README Python example (line %d): Debian's astropy is not installed", b.line)
			}
			continue
		}
		if _, err := os.Stat("grid.ecsv"); err != nil {
			t.Errorf("README Python example (line %d): no README command wrote grid.ecsv", b.line)
			continue
		}
		cmd := exec.Command(py, "-")
		cmd.Stdin = strings.NewReader(b.text)
		if out, err := cmd.CombinedOutput(); err != nil {
			t.Errorf("README Python example (line %d) failed: %v\n%s", b.line, err, out)
		}
	}
}

type codeBlock struct {
	lang, text string
	line       int // README line of the first line of text
}

type readmeLine struct {
	text string
	line int
}

// readmeCode returns the fenced code blocks and the inline code spans of a
// Markdown text (a span may continue on the next line).
func readmeCode(md string) (blocks []codeBlock, inline []readmeLine) {
	lines := strings.Split(md, "\n")
	var prose strings.Builder // the text outside code blocks, a '\n' per line
	lineOf := []int{}         // README line of each byte of prose
	for i := 0; i < len(lines); i++ {
		l := lines[i]
		if lang, ok := strings.CutPrefix(l, "```"); ok {
			start := i + 1
			var body []string
			for i++; i < len(lines) && !strings.HasPrefix(lines[i], "```"); i++ {
				body = append(body, lines[i])
			}
			blocks = append(blocks, codeBlock{lang: strings.TrimSpace(lang), text: strings.Join(body, "\n") + "\n", line: start + 1})
			continue
		}
		prose.WriteString(l + "\n")
		for range len(l) + 1 {
			lineOf = append(lineOf, i+1)
		}
	}
	p := prose.String()
	for i := 0; i < len(p); i++ {
		if p[i] != '`' {
			continue
		}
		j := strings.IndexByte(p[i+1:], '`')
		if j < 0 {
			break
		}
		span := strings.ReplaceAll(p[i+1:i+1+j], "\n", " ")
		inline = append(inline, readmeLine{span, lineOf[i]})
		i += j + 1
	}
	return blocks, inline
}

// commandLines returns the cloudwind commands of a block: lines (or "$ "
// prompts) starting with "cloudwind " that are not synopses, the part
// before a pipe or redirection, without the explorer.
func commandLines(b codeBlock) []readmeLine {
	var out []readmeLine
	lines := strings.Split(b.text, "\n")
	for k := 0; k < len(lines); k++ {
		l, first := lines[k], k
		for strings.HasSuffix(l, "\\") && k+1 < len(lines) { // a continued line
			k++
			l = strings.TrimSuffix(l, "\\") + " " + strings.TrimSpace(lines[k])
		}
		if strings.Contains(l, "$SLURM") || strings.Contains(l, "${SLURM") {
			continue // runs inside a job array: .ci/slurm-array.sh runs one
		}
		l = strings.TrimSpace(strings.TrimPrefix(strings.TrimSpace(l), "$ "))
		if i := strings.IndexAny(l, "|>#"); i >= 0 && !inQuotes(l, i) {
			l = strings.TrimSpace(l[:i])
		}
		if !strings.HasPrefix(l, "cloudwind ") || strings.ContainsAny(l, "[…") || strings.Contains(l, "...") {
			continue
		}
		args := shellWords(l)
		if len(args) < 2 || args[1] == "explore" || strings.HasPrefix(args[1], "-") || strings.ToUpper(args[1]) == args[1] {
			continue // the explorer, or a placeholder such as COMMAND
		}
		out = append(out, readmeLine{l, b.line + first})
	}
	return out
}

// inQuotes reports whether byte i of s lies inside single or double quotes.
func inQuotes(s string, i int) bool {
	var q byte
	for j := 0; j < i; j++ {
		switch {
		case q == 0 && (s[j] == '\'' || s[j] == '"'):
			q = s[j]
		case q != 0 && s[j] == q:
			q = 0
		}
	}
	return q != 0
}

// shellWords splits a command line as a POSIX shell would for these
// examples: words separated by spaces, with '…' and "…" quoting.
func shellWords(s string) []string {
	var words []string
	var w strings.Builder
	var q byte
	in := false
	for i := 0; i < len(s); i++ {
		c := s[i]
		switch {
		case q != 0 && c == q:
			q = 0
		case q != 0:
			w.WriteByte(c)
		case c == '\'' || c == '"':
			q, in = c, true
		case c == ' ' || c == '\t':
			if in {
				words = append(words, w.String())
				w.Reset()
				in = false
			}
		default:
			w.WriteByte(c)
			in = true
		}
	}
	if in {
		words = append(words, w.String())
	}
	return words
}

// readmeFixtures writes the files the README's examples name into dir and
// returns which of the external ones are there.
func readmeFixtures(t *testing.T, dir string) map[string]bool {
	t.Helper()
	have := map[string]bool{}
	put := func(name string, data []byte) {
		if err := os.WriteFile(filepath.Join(dir, name), data, 0o644); err != nil {
			t.Fatal(err)
		}
		have[name] = true
	}
	// Scenario files of our own (fictional settings).
	sc := []byte("[scenario]\nname = \"README example (fictional)\"\n[inputs]\nchi = 300\nmach = 1.5\nradius = 10\n")
	put("run.toml", sc)
	put("my-run.toml", sc)
	// A Wiersma-style table of our own (invented values, linear T; columns
	// T, H+He, an unused column, metals), per n_H².
	var z bytes.Buffer
	for _, row := range [][4]float64{{1e4, 1e-23, 0, 1e-22}, {1e5, 3e-23, 0, 5e-22}, {1e6, 1e-23, 0, 1e-22}, {1e7, 2e-23, 0, 2e-23}, {1e8, 4e-23, 0, 1e-23}} {
		z.WriteString(strings.Join([]string{ftoa(row[0]), ftoa(row[1]), ftoa(row[2]), ftoa(row[3])}, " ") + "\n")
	}
	put("z_collis.txt", z.Bytes())
	// Sutherland & Dopita 1993 from Debian's python3-pydl (installed in the
	// package's pydlutils/data/cooling/ folder).
	if out, err := exec.Command("/usr/bin/python3", "-c", "import pydl, os; print(os.path.dirname(pydl.__file__))").Output(); err == nil {
		cdir := filepath.Join(strings.TrimSpace(string(out)), "pydlutils", "data", "cooling")
		for _, f := range []string{"m-00.cie", "mzero.cie"} {
			if b, err := os.ReadFile(filepath.Join(cdir, f)); err == nil {
				put(f, b)
			}
		}
	}
	// The CHIANTI-based curves (Ryden & Pogge 2021 companion data, CC-BY-4.0).
	for _, d := range []string{filepath.Join("..", "..", "testdata", "cie-cooling-chianti"), filepath.Join("..", "..", "..", "shared", "reference", "cie-cooling-chianti")} {
		if b, err := os.ReadFile(filepath.Join(d, "cooling_z1.txt")); err == nil {
			put("cooling_z1.txt", b)
			break
		}
	}
	return have
}

// missingFixture returns the first file an example names that is not
// provided ("" when none): names with a table or scenario extension.
func missingFixture(args []string, have map[string]bool) string {
	for i, a := range args {
		if i > 0 && args[i-1] == "-o" {
			continue // an output
		}
		ext := filepath.Ext(a)
		if (ext == ".cie" || ext == ".txt" || ext == ".toml") && !strings.Contains(a, ":") && !have[a] {
			return a
		}
	}
	return ""
}

func ftoa(v float64) string { return model.FormatNumber(v, 6) }
