package cooling

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"cloudwind/model"
)

// Reading a user table: lines, directives, settings and raw rows. The
// values are validated and converted in table_convert.go.

// maxLambdaColumns bounds the Λ columns and Z values one table may declare
// (common practice, no source).
const maxLambdaColumns = 64

// tableMagic is the first line of a file of cloudwind's own layout.
const tableMagic = "cloudwind-table"

// settings are the merged options and directives.
type settings struct {
	tCol, hheCol, metCol, neCol, nhCol, ntCol int
	lamCols                                   []int
	logT, logL                                *bool
	norm                                      Normalisation
	z                                         []float64
	y                                         float64
	haveY                                     bool
	clip                                      float64
	header                                    bool
	neOverNH                                  func(model.Temperature, float64) float64
	from                                      map[string]int // directive line of each setting a directive gave
}

// directives are the settings found in the header of a cloudwind-table file.
type directives struct {
	line                                      map[string]int // setting key → line
	tCol, hheCol, metCol, neCol, nhCol, ntCol int
	lamCols                                   []int
	logT, logL                                *bool
	norm                                      Normalisation
	z                                         []float64
	y, clip                                   float64
	header                                    bool
}

// rawTable is what readTable returns: the settings and, for every data row,
// its line and the values of the columns the settings name.
type rawTable struct {
	set        settings
	line       []int
	t          []float64
	lam        [][]float64
	hhe, met   []float64
	ne, nh, nt []float64
	names      []string
	warnings   []string
	lastLine   int
}

// readTable reads the lines of r: directives at the top, the optional
// header row, then data rows.
func readTable(r io.Reader, opt TableOptions) (*rawTable, error) {
	if opt.SkipLines < 0 {
		return nil, fmt.Errorf("skip %d lines: %w", opt.SkipLines, ErrSetting)
	}
	lr := &io.LimitedReader{R: r, N: maxTableBytes + 1}
	sc := bufio.NewScanner(lr)
	sc.Buffer(make([]byte, 0, 4096), maxLineBytes)
	raw := &rawTable{}
	dir := &directives{line: map[string]int{}}
	var (
		lineNo            int
		magic, seenText   bool // the magic line; any non-blank line after SkipLines
		merged, seenFirst bool // settings fixed; first content line done
		width             int  // columns of the first data row
		dest              []*[]float64
		cols              []int
	)
	for sc.Scan() {
		lineNo++
		if lr.N <= 0 {
			return nil, &ParseError{Line: lineNo, Err: fmt.Errorf("more than %d bytes: %w", maxTableBytes, ErrTooLarge)}
		}
		line := sc.Text()
		if lineNo == 1 {
			line = strings.TrimPrefix(line, "\uFEFF")
		}
		line = strings.TrimSuffix(line, "\r")
		content, comment, hasComment := strings.Cut(line, "#")
		fields := splitFields(content)
		if lineNo <= opt.SkipLines {
			if len(fields) > 0 && allNumeric(fields) {
				raw.warnings = append(raw.warnings, fmt.Sprintf("line %d skipped as a header line but looks like data", lineNo))
			}
			continue
		}
		if len(fields) == 0 { // blank or comment-only
			comment = strings.TrimSpace(comment)
			switch {
			case !hasComment || comment == "":
			case !seenText && strings.EqualFold(comment, tableMagic):
				magic = true
			case magic && !seenFirst:
				if err := dir.parse(comment, lineNo, &raw.warnings); err != nil {
					return nil, &ParseError{Line: lineNo, Err: err}
				}
			case magic && isDirective(comment):
				raw.warnings = append(raw.warnings, fmt.Sprintf("line %d: directive after the first row ignored", lineNo))
			}
			if hasComment || strings.TrimSpace(content) != "" {
				seenText = true
			}
			continue
		}
		seenText = true
		if !merged {
			s, err := mergeSettings(opt, dir)
			if err != nil {
				return nil, err
			}
			raw.set, merged = s, true
			dest, cols = raw.destinations()
		}
		if !seenFirst {
			seenFirst = true
			if raw.set.header || allNonNumeric(fields) {
				raw.names = make([]string, 0, min(len(fields), maxColumnNumber))
				for _, f := range fields[:min(len(fields), maxColumnNumber)] {
					raw.names = append(raw.names, cleanText(f))
				}
				if raw.set.header && allNumeric(fields) {
					raw.warnings = append(raw.warnings, fmt.Sprintf("line %d taken as the header row but looks like data", lineNo))
				}
				continue
			}
		}
		if width == 0 {
			width = len(fields)
			for _, c := range cols {
				if c > width {
					return nil, &ParseError{Line: lineNo, Err: fmt.Errorf("column %d selected, rows have %d: %w", c, width, ErrColumnCount)}
				}
			}
		} else if len(fields) != width {
			return nil, &ParseError{Line: lineNo, Err: fmt.Errorf("%d columns, earlier rows have %d: %w", len(fields), width, ErrColumnCount)}
		}
		if len(raw.line) >= maxTableRows {
			return nil, &ParseError{Line: lineNo, Err: fmt.Errorf("more than %d rows: %w", maxTableRows, ErrTooLarge)}
		}
		for j, c := range cols {
			v, err := parseValue(fields[c-1])
			if err != nil {
				return nil, &ParseError{Line: lineNo, Err: fmt.Errorf("column %d: %s: %w", c, quoteText(fields[c-1]), err)}
			}
			*dest[j] = append(*dest[j], v)
		}
		raw.line = append(raw.line, lineNo)
	}
	if err := sc.Err(); err != nil {
		if errors.Is(err, bufio.ErrTooLong) {
			return nil, &ParseError{Line: lineNo + 1, Err: fmt.Errorf("line longer than %d bytes: %w", maxLineBytes, ErrTooLarge)}
		}
		return nil, &ParseError{Line: lineNo, Err: fmt.Errorf("read: %w", err)}
	}
	if lr.N <= 0 {
		return nil, &ParseError{Err: fmt.Errorf("more than %d bytes: %w", maxTableBytes, ErrTooLarge)}
	}
	if !merged {
		s, err := mergeSettings(opt, dir)
		if err != nil {
			return nil, err
		}
		raw.set = s
	}
	raw.lastLine = lineNo
	return raw, nil
}

// destinations lists the columns to read and where each one's values go.
func (raw *rawTable) destinations() ([]*[]float64, []int) {
	s := raw.set
	dest, cols := []*[]float64{&raw.t}, []int{s.tCol}
	raw.lam = make([][]float64, len(s.lamCols))
	for j, c := range s.lamCols {
		dest, cols = append(dest, &raw.lam[j]), append(cols, c)
	}
	for _, o := range []struct {
		col int
		d   *[]float64
	}{{s.hheCol, &raw.hhe}, {s.metCol, &raw.met}, {s.neCol, &raw.ne}, {s.nhCol, &raw.nh}, {s.ntCol, &raw.nt}} {
		if o.col > 0 {
			dest, cols = append(dest, o.d), append(cols, o.col)
		}
	}
	return dest, cols
}

// splitFields splits a line at commas when it has one (each field trimmed;
// empty fields kept, so that they are reported), else at white space.
func splitFields(s string) []string {
	if strings.IndexByte(s, ',') < 0 {
		return strings.Fields(s)
	}
	if strings.TrimSpace(s) == "" {
		return nil
	}
	f := strings.Split(s, ",")
	for i := range f {
		f[i] = strings.TrimSpace(f[i])
	}
	return f
}

// parseNumber parses a decimal number; a Fortran exponent (1.0D-22) is
// accepted. Out-of-range values parse to ±Inf or 0 as strconv gives them.
func parseNumber(s string) (float64, bool) {
	v, err := strconv.ParseFloat(s, 64)
	if err == nil || errors.Is(err, strconv.ErrRange) {
		return v, true
	}
	if i := strings.IndexAny(s, "dD"); i > 0 && !strings.ContainsAny(s, "xX") {
		v, err = strconv.ParseFloat(s[:i]+"e"+s[i+1:], 64)
		if err == nil || errors.Is(err, strconv.ErrRange) {
			return v, true
		}
	}
	return 0, false
}

// parseValue parses a table value: a finite number.
func parseValue(s string) (float64, error) {
	v, ok := parseNumber(s)
	switch {
	case !ok:
		return 0, ErrNotNumeric
	case math.IsNaN(v) || math.IsInf(v, 0):
		return 0, ErrNotFinite
	}
	return v, nil
}

func allNumeric(fields []string) bool {
	for _, f := range fields {
		if _, ok := parseNumber(f); !ok {
			return false
		}
	}
	return true
}

func allNonNumeric(fields []string) bool {
	for _, f := range fields {
		if _, ok := parseNumber(f); ok {
			return false
		}
	}
	return len(fields) > 0
}

// cleanText removes control and bidirectional-formatting characters and
// invalid UTF-8 from text read from a file or given as a name, and cuts it
// to 80 runes, so that it can be shown in a terminal.
func cleanText(s string) string {
	s = strings.ToValidUTF8(s, "\uFFFD")
	n := 0
	return strings.Map(func(r rune) rune {
		switch {
		case r < 0x20, r == 0x7f, r >= 0x80 && r < 0xa0,
			r >= 0x200b && r <= 0x200f, r >= 0x202a && r <= 0x202e,
			r >= 0x2066 && r <= 0x2069, r == 0xfeff:
			return -1
		}
		n++
		switch {
		case n > 81:
			return -1
		case n == 81:
			return '…'
		}
		return r
	}, s)
}

// quoteText quotes cleaned text for an error message.
func quoteText(s string) string { return strconv.Quote(cleanText(s)) }
