package cooling

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"cloudwind/model"
)

// Directives of a cloudwind-table file and their merge with TableOptions.

// directiveKeys are the keys of "# key: value" lines (lower case).
var directiveKeys = [...]string{"norm", "columns", "log", "z", "y", "clip-below", "header"}

// columnNames maps the names of "# columns:" to setting keys.
var columnNames = [...][2]string{
	{"t", "T"}, {"lambda", "lambda"}, {"hhe", "HHe"}, {"metals", "metals"},
	{"ne", "ne"}, {"nh", "nH"}, {"nt", "nt"},
}

// splitDirective splits "key: value"; ok is false for free text (no colon,
// or white space inside the key).
func splitDirective(comment string) (key, value string, ok bool) {
	key, value, ok = strings.Cut(comment, ":")
	key = strings.TrimSpace(key)
	if !ok || key == "" || strings.ContainsAny(key, " \t") {
		return "", "", false
	}
	return strings.ToLower(key), strings.TrimSpace(value), true
}

// isDirective reports whether a comment is a known directive.
func isDirective(comment string) bool {
	key, _, ok := splitDirective(comment)
	return ok && slices.Contains(directiveKeys[:], key)
}

// set records that the directive on line gives setting key; a key given
// twice is an error.
func (d *directives) set(key string, line int) error {
	if l, dup := d.line[key]; dup {
		return fmt.Errorf("%s given again (first on line %d): %w", key, l, ErrDirective)
	}
	d.line[key] = line
	return nil
}

// parse reads one comment line of the directive block. Unknown keys draw a
// warning; free text is ignored.
func (d *directives) parse(comment string, line int, warnings *[]string) error {
	key, value, ok := splitDirective(comment)
	if !ok {
		return nil
	}
	bad := func(what string) error {
		return fmt.Errorf("%s: %s: %w", key, quoteText(what), ErrDirective)
	}
	switch key {
	case "norm":
		n, err := ParseNormalisation(value)
		if err != nil {
			return bad(value)
		}
		d.norm = n
		return d.set("norm", line)
	case "columns":
		for _, f := range strings.Fields(value) {
			name, list, _ := strings.Cut(f, "=")
			k := ""
			for _, c := range columnNames {
				if strings.EqualFold(name, c[0]) {
					k = c[1]
				}
			}
			if k == "" || list == "" {
				return bad(f)
			}
			var nums []int
			for _, s := range strings.Split(list, ",") {
				c, err := strconv.Atoi(s)
				if err != nil || c < 1 || c > maxColumnNumber || len(nums) >= maxLambdaColumns {
					return bad(f)
				}
				nums = append(nums, c)
			}
			if k != "lambda" && len(nums) != 1 {
				return bad(f)
			}
			if err := d.set(k, line); err != nil {
				return err
			}
			switch k {
			case "T":
				d.tCol = nums[0]
			case "lambda":
				d.lamCols = nums
			case "HHe":
				d.hheCol = nums[0]
			case "metals":
				d.metCol = nums[0]
			case "ne":
				d.neCol = nums[0]
			case "nH":
				d.nhCol = nums[0]
			case "nt":
				d.ntCol = nums[0]
			}
		}
		return nil
	case "log":
		for _, f := range strings.Fields(value) {
			name, v, _ := strings.Cut(f, "=")
			var k string
			var dst **bool
			switch strings.ToLower(name) {
			case "t":
				k, dst = "logT", &d.logT
			case "lambda":
				k, dst = "logLambda", &d.logL
			default:
				return bad(f)
			}
			b, auto, ok := parseYesNo(v)
			if !ok {
				return bad(f)
			}
			if auto {
				continue
			}
			if err := d.set(k, line); err != nil {
				return err
			}
			*dst = &b
		}
		return nil
	case "z":
		for _, f := range strings.Fields(strings.ReplaceAll(value, ",", " ")) {
			z, ok := parseNumber(f)
			if !ok || len(d.z) >= maxLambdaColumns {
				return bad(f)
			}
			d.z = append(d.z, z)
		}
		return d.set("Z", line)
	case "y", "clip-below":
		v, ok := parseNumber(value)
		if !ok {
			return bad(value)
		}
		if key == "y" {
			d.y = v
			return d.set("y", line)
		}
		d.clip = v
		return d.set("clip-below", line)
	case "header":
		b, auto, ok := parseYesNo(value)
		if !ok || auto {
			return bad(value)
		}
		d.header = b
		return d.set("header", line)
	}
	*warnings = append(*warnings, fmt.Sprintf("line %d: unknown directive %s ignored", line, quoteText(key)))
	return nil
}

// parseYesNo parses yes/no/true/false/auto (case-insensitive).
func parseYesNo(s string) (v, auto, ok bool) {
	switch strings.ToLower(s) {
	case "yes", "true":
		return true, false, true
	case "no", "false":
		return false, false, true
	case "auto":
		return false, true, true
	}
	return false, false, false
}

// mergeSettings combines the caller's options with the directives; both
// may give a setting only if they agree. It then checks the settings.
func mergeSettings(opt TableOptions, d *directives) (settings, error) {
	s := settings{from: map[string]int{}}
	var err error
	conflict := func(key string, o, dv any) error {
		return &ParseError{Line: d.line[key], Err: fmt.Errorf("%s: option %v, directive %v: %w", key, o, dv, ErrConflict)}
	}
	// pick returns whether the directive gave key, after checking agreement.
	pick := func(key string, optGiven, agree bool, o, dv any) bool {
		_, has := d.line[key]
		if has && optGiven && !agree && err == nil {
			err = conflict(key, o, dv)
		}
		if has && !optGiven {
			s.from[key] = d.line[key]
			return true
		}
		return false
	}
	ints := []struct {
		key string
		opt int
		dir int
		dst *int
	}{
		{"T", opt.TColumn, d.tCol, &s.tCol}, {"HHe", opt.HHeColumn, d.hheCol, &s.hheCol},
		{"metals", opt.MetalsColumn, d.metCol, &s.metCol}, {"ne", opt.NeColumn, d.neCol, &s.neCol},
		{"nH", opt.NHColumn, d.nhCol, &s.nhCol}, {"nt", opt.NtColumn, d.ntCol, &s.ntCol},
	}
	for _, c := range ints {
		*c.dst = c.opt
		if pick(c.key, c.opt != 0, c.opt == c.dir, c.opt, c.dir) {
			*c.dst = c.dir
		}
	}
	s.lamCols = opt.LambdaColumns
	if pick("lambda", opt.LambdaColumns != nil, slices.Equal(opt.LambdaColumns, d.lamCols), opt.LambdaColumns, d.lamCols) {
		s.lamCols = d.lamCols
	}
	s.logT, s.logL = opt.LogT, opt.LogLambda
	if pick("logT", opt.LogT != nil, opt.LogT != nil && d.logT != nil && *opt.LogT == *d.logT, fmtBool(opt.LogT), fmtBool(d.logT)) {
		s.logT = d.logT
	}
	if pick("logLambda", opt.LogLambda != nil, opt.LogLambda != nil && d.logL != nil && *opt.LogLambda == *d.logL, fmtBool(opt.LogLambda), fmtBool(d.logL)) {
		s.logL = d.logL
	}
	haveNorm := opt.Norm != nil
	if haveNorm {
		s.norm = *opt.Norm
	}
	if pick("norm", haveNorm, haveNorm && *opt.Norm == d.norm, fmtNorm(opt.Norm), d.norm) {
		s.norm, haveNorm = d.norm, true
	}
	s.z = opt.Z
	if pick("Z", opt.Z != nil, slices.Equal(opt.Z, d.z), opt.Z, d.z) {
		s.z = d.z
	}
	if opt.HeliumRatio != nil {
		s.y, s.haveY = *opt.HeliumRatio, true
	}
	if pick("y", opt.HeliumRatio != nil, opt.HeliumRatio != nil && *opt.HeliumRatio == d.y, fmtFloat(opt.HeliumRatio), d.y) {
		s.y, s.haveY = d.y, true
	}
	s.clip = float64(opt.ClipBelow)
	if pick("clip-below", opt.ClipBelow != 0, float64(opt.ClipBelow) == d.clip, float64(opt.ClipBelow), d.clip) {
		s.clip = d.clip
	}
	s.header = opt.HeaderRow
	if pick("header", opt.HeaderRow, opt.HeaderRow == d.header, opt.HeaderRow, d.header) {
		s.header = d.header
	}
	if err != nil {
		return s, err
	}
	s.neOverNH = opt.NeOverNH
	for _, k := range []string{"T", "lambda", "HHe", "metals", "ne", "nH", "nt"} {
		if l, ok := s.from[k]; ok {
			s.from["columns"] = l
			break
		}
	}
	if !haveNorm {
		return s, &ParseError{Err: ErrNoNormalisation}
	}
	return s, s.check()
}

func fmtBool(b *bool) any {
	if b == nil {
		return "auto"
	}
	return *b
}

func fmtNorm(n *Normalisation) any {
	if n == nil {
		return "none"
	}
	return *n
}

func fmtFloat(v *float64) any {
	if v == nil {
		return "none"
	}
	return *v
}

// check validates merged settings and fills in the column defaults.
func (s *settings) check() error {
	at := func(key string, err error) error { return &ParseError{Line: s.from[key], Err: err} }
	if s.norm < PerNH2 || s.norm > PerN2 {
		return at("norm", fmt.Errorf("normalisation %v: %w", s.norm, ErrSetting))
	}
	if s.tCol == 0 {
		s.tCol = 1
	}
	if s.lamCols == nil && s.hheCol == 0 && s.metCol == 0 {
		s.lamCols = []int{2}
	}
	switch {
	case (s.hheCol == 0) != (s.metCol == 0):
		return at("HHe", fmt.Errorf("HHe and metals columns go together: %w", ErrColumnSpec))
	case s.hheCol != 0 && len(s.lamCols) > 0:
		return at("lambda", fmt.Errorf("lambda columns and HHe/metals columns exclude each other: %w", ErrColumnSpec))
	case len(s.lamCols) > maxLambdaColumns:
		return at("lambda", fmt.Errorf("%d lambda columns, at most %d: %w", len(s.lamCols), maxLambdaColumns, ErrColumnSpec))
	}
	for _, c := range s.lamCols {
		if c < 1 {
			return at("lambda", fmt.Errorf("lambda column %d: %w", c, ErrColumnSpec))
		}
	}
	all := append([]int{s.tCol, s.hheCol, s.metCol, s.neCol, s.nhCol, s.ntCol}, s.lamCols...)
	seen := map[int]bool{}
	for _, c := range all {
		switch {
		case c < 0 || c > maxColumnNumber:
			return at("columns", fmt.Errorf("column %d outside 1…%d: %w", c, maxColumnNumber, ErrColumnSpec))
		case c > 0 && seen[c]:
			return at("columns", fmt.Errorf("column %d selected twice: %w", c, ErrColumnSpec))
		}
		seen[c] = true
	}
	if s.nhCol != 0 && s.neCol == 0 && s.ntCol == 0 {
		return at("nH", fmt.Errorf("an nH column needs an ne or nt column: %w", ErrColumnSpec))
	}
	switch {
	case s.hheCol != 0 && len(s.z) > 0:
		return at("Z", fmt.Errorf("Z given for an HHe+metals table (Z is chosen at use): %w", ErrZCount))
	case len(s.z) > 0 && len(s.z) != len(s.lamCols), len(s.z) == 0 && len(s.lamCols) > 1:
		return at("Z", fmt.Errorf("%d Z values for %d lambda columns: %w", len(s.z), len(s.lamCols), ErrZCount))
	}
	for i, z := range s.z {
		if !(z >= 0) || math.IsInf(z, 1) || (i > 0 && !(z > s.z[i-1])) {
			return at("Z", fmt.Errorf("Z = %v: %w", s.z, ErrZOrder))
		}
	}
	if s.haveY && (!(s.y >= 0) || math.IsInf(s.y, 1)) {
		return at("y", fmt.Errorf("y = %s, want finite and ≥ 0: %w", num(s.y), ErrSetting))
	}
	if !(s.clip >= 0) || math.IsInf(s.clip, 1) {
		return at("clip-below", fmt.Errorf("clip below %s K, want finite and ≥ 0: %w", num(s.clip), ErrSetting))
	}
	return nil
}

// Apply sets options from one directive, "key: value", in the words of the
// directive lines of a cloudwind-table file (norm, columns, log, Z, y,
// clip-below, header), plus "skip: N" for SkipLines. A command line can so
// describe any table with the same words a file would use. A setting that
// o already holds is an error (ErrConflict).
func (o *TableOptions) Apply(directive string) error {
	key, value, ok := splitDirective(directive)
	if !ok {
		return fmt.Errorf("%s is not \"key: value\": %w", quoteText(directive), ErrDirective)
	}
	if key == "skip" {
		n, err := strconv.Atoi(value)
		if err != nil || n < 0 || n > maxTableRows {
			return fmt.Errorf("skip: %s is not a line count: %w", quoteText(value), ErrDirective)
		}
		if o.SkipLines != 0 {
			return fmt.Errorf("skip given twice: %w", ErrConflict)
		}
		o.SkipLines = n
		return nil
	}
	if !slices.Contains(directiveKeys[:], key) {
		return fmt.Errorf("unknown setting %s (want skip, %s): %w", quoteText(key), strings.Join(directiveKeys[:], ", "), ErrDirective)
	}
	d := directives{line: map[string]int{}}
	var warnings []string
	if err := d.parse(directive, 0, &warnings); err != nil {
		return err
	}
	twice := func(k string) error { return fmt.Errorf("%s given twice: %w", k, ErrConflict) }
	for k := range d.line {
		switch k {
		case "norm":
			if o.Norm != nil {
				return twice(k)
			}
			n := d.norm
			o.Norm = &n
		case "T", "HHe", "metals", "ne", "nH", "nt":
			dst := map[string]*int{"T": &o.TColumn, "HHe": &o.HHeColumn, "metals": &o.MetalsColumn,
				"ne": &o.NeColumn, "nH": &o.NHColumn, "nt": &o.NtColumn}[k]
			src := map[string]int{"T": d.tCol, "HHe": d.hheCol, "metals": d.metCol,
				"ne": d.neCol, "nH": d.nhCol, "nt": d.ntCol}[k]
			if *dst != 0 {
				return twice(k + " column")
			}
			*dst = src
		case "lambda":
			if o.LambdaColumns != nil {
				return twice("lambda columns")
			}
			o.LambdaColumns = d.lamCols
		case "logT":
			if o.LogT != nil {
				return twice("log T")
			}
			o.LogT = d.logT
		case "logLambda":
			if o.LogLambda != nil {
				return twice("log lambda")
			}
			o.LogLambda = d.logL
		case "Z":
			if o.Z != nil {
				return twice("Z")
			}
			o.Z = d.z
		case "y":
			if o.HeliumRatio != nil {
				return twice("y")
			}
			y := d.y
			o.HeliumRatio = &y
		case "clip-below":
			if o.ClipBelow != 0 {
				return twice("clip-below")
			}
			o.ClipBelow = model.Temperature(d.clip)
		case "header":
			o.HeaderRow = d.header
		}
	}
	return nil
}
