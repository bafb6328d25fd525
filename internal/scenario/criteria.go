package scenario

import (
	"cmp"
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strings"
	"unicode"
	"unicode/utf8"

	suggestpkg "cloudwind/internal/suggest"
	"cloudwind/model"
)

// criterionKeys returns the keys of a [[criterion]] table.
func criterionKeys() []string {
	return []string{"id", "label", "authors", "year", "journal", "arxiv", "equation",
		"cooling_time", "dynamical_time", "alpha", "beta", "f_mix", "warm_temperature", "uncertainty",
		"verified", "status", "note"}
}

// requiredNewKeys returns the keys a criterion with a new id must set.
func requiredNewKeys() []string {
	return []string{"label", "authors", "year", "journal", "arxiv", "equation",
		"cooling_time", "dynamical_time", "alpha"}
}

// rangeKeys returns the keys of a [criterion.range] table.
func rangeKeys() []string { return []string{"chi", "mach", "t_cloud", "mach_turb", "status"} }

// LoadCriteria reads a criteria file and applies it to base (normally
// model.BuiltinCriteria()), returning the merged list: base order first
// (with overrides applied), then new criteria in file order. base is not
// modified. name is the file name used in errors and in the Status texts
// the merge writes.
//
// A [[criterion]] whose id is in base changes only the keys it gives; one
// whose id is new must give every key listed in the package documentation.
// When an override changes alpha, beta, cooling_time or dynamical_time and
// does not say verified = true, the criterion becomes unverified and its
// Status becomes "changed by criteria file NAME: " followed by the file's
// status, or "not verified" when it gives none. Every error is a
// *ParseError with the file name and the line of the offending key or
// table header.
func LoadCriteria(r io.Reader, name string, base []model.Criterion) ([]model.Criterion, error) {
	doc, err := ParseTOML(r)
	if err == nil {
		f := &criteriaFile{name: name, base: base, out: slices.Clone(base), seen: map[string]int{}}
		if err = f.apply(doc.Root); err == nil {
			return f.out, nil
		}
	}
	var pe *ParseError
	if errors.As(err, &pe) {
		pe.File = name
	}
	return nil, err
}

// criteriaFile is the state of one LoadCriteria call.
type criteriaFile struct {
	name string
	base []model.Criterion
	out  []model.Criterion
	seen map[string]int // id → line of its id key
}

// label names the file in Status texts.
func (f *criteriaFile) label() string {
	if f.name == "" {
		return "criteria file"
	}
	return "criteria file " + f.name
}

// child is a sub-table or an element of an array of tables.
type child struct {
	key   string
	t     *Table
	array bool
}

// header writes the table header of c, e.g. "[[criterion]]".
func (c child) header() string {
	if c.array {
		return "[[" + clip(c.t.Name) + "]]"
	}
	return "[" + clip(c.t.Name) + "]"
}

// tableValue returns the sub-table or array of tables key of t as a Value
// of KindTable, or KindArray of KindTable, so that a key given a table, in
// any of TOML's ways to write one, gets the error of any other wrong type.
func tableValue(t *Table, key string) Value {
	if sub := t.Tables[key]; sub != nil {
		return Value{Kind: KindTable, Table: sub, Line: sub.Line}
	}
	arr := t.Arrays[key]
	v := Value{Kind: KindArray, Line: arr[0].Line}
	for _, e := range arr {
		v.Array = append(v.Array, Value{Kind: KindTable, Table: e, Line: e.Line})
	}
	return v
}

// children returns the sub-tables and array elements of t in file order.
func children(t *Table) []child {
	var cs []child
	for k, s := range t.Tables {
		cs = append(cs, child{k, s, false})
	}
	for k, arr := range t.Arrays {
		for _, s := range arr {
			cs = append(cs, child{k, s, true})
		}
	}
	slices.SortStableFunc(cs, func(a, b child) int {
		return cmp.Or(cmp.Compare(a.t.Line, b.t.Line), strings.Compare(a.key, b.key))
	})
	return cs
}

// apply checks the root of a criteria file and merges its criteria.
func (f *criteriaFile) apply(root *Table) error {
	if len(root.Keys) > 0 {
		k := root.Keys[0]
		v := root.Values[k]
		if k == "criterion" {
			return errAt(v.Line, "criterion must be an array of tables, as in [[criterion]], not %s", article(v.Kind))
		}
		return errAt(v.Line, "key %q is outside any table; criteria go in [[criterion]] tables", clip(k))
	}
	for _, c := range children(root) {
		switch {
		case c.key == "criterion" && c.array:
			if err := f.criterion(c.t); err != nil {
				return err
			}
		case c.key == "criterion":
			return errAt(c.t.Line, "write [[criterion]] (an array of tables), not [criterion]")
		default:
			return errAt(c.t.Line, "unknown table %s%s", c.header(), suggest(c.key, []string{"criterion"}))
		}
	}
	return nil
}

// criterion merges one [[criterion]] table into f.out.
func (f *criteriaFile) criterion(t *Table) error {
	idv, ok := t.Values["id"]
	if !ok && firstLine(t, "id") > 0 {
		idv, ok = tableValue(t, "id"), true
	}
	if !ok {
		return errAt(t.Line, "[[criterion]] needs an id: a built-in id to change that criterion, or a new one to add a criterion")
	}
	id, err := stringValue("id", idv)
	if err != nil {
		return err
	}
	if first, dup := f.seen[id]; dup {
		return errAt(idv.Line, "duplicate id %q (first used on line %d)", clip(id), first)
	}
	f.seen[id] = idv.Line
	idx := slices.IndexFunc(f.base, func(c model.Criterion) bool { return c.ID == id })
	isNew := idx < 0
	c := model.Criterion{ID: id, Range: model.Calibration{Chi: model.Unbounded(), Mach: model.Unbounded(), TCloud: model.Unbounded()}}
	if !isNew {
		c = f.out[idx]
	}
	old := c
	lines := map[string]int{} // file key, e.g. "alpha" or "range.chi" → line
	for _, k := range t.Keys {
		v := t.Values[k]
		lines[k] = v.Line
		if err := setCriterionKey(&c, k, v); err != nil {
			return err
		}
	}
	rangeChanged := false
	for _, ch := range children(t) {
		switch {
		case ch.key == "range" && !ch.array:
			if rangeChanged, err = setRange(&c, ch.t, lines); err != nil {
				return err
			}
		case ch.key != "range" && slices.Contains(criterionKeys(), ch.key):
			// A known key given a table: the setter reports the type.
			if err := setCriterionKey(&c, ch.key, tableValue(t, ch.key)); err != nil {
				return err
			}
		default:
			return errAt(ch.t.Line, "unknown table %s in a criterion%s", ch.header(), tableHint(ch))
		}
	}
	if isNew {
		var missing []string
		for _, k := range requiredNewKeys() {
			if _, ok := lines[k]; !ok {
				missing = append(missing, k)
			}
		}
		if len(missing) > 0 {
			ids := make([]string, len(f.base))
			for i := range f.base {
				ids[i] = f.base[i].ID
			}
			hint := suggest(id, ids)
			if hint != "" {
				hint = "; to change a built-in criterion use its id" + hint
			}
			return errAt(t.Line, "%q is not a built-in criterion id, so this new criterion needs the missing keys %s%s",
				clip(id), strings.Join(missing, ", "), hint)
		}
	}
	f.settleStatus(&c, old, isNew, lines, rangeChanged)
	if err := c.Validate(); err != nil {
		line := t.Line
		var fe *model.FieldError
		if errors.As(err, &fe) {
			if l, ok := lines[fe.Field]; ok {
				line = l
			}
		}
		return errAt(line, "criterion %q: %w", clip(id), err)
	}
	if isNew {
		f.out = append(f.out, c)
	} else {
		f.out[idx] = c
	}
	return nil
}

// tableHint explains how to write the one sub-table a criterion may have.
func tableHint(ch child) string {
	if ch.key == "range" {
		return "; write [criterion.range], not [[criterion.range]]"
	}
	return suggest(ch.key, []string{"range"})
}

// settleStatus applies the verification rules of LoadCriteria to c, whose
// state before the file was old.
func (f *criteriaFile) settleStatus(c *model.Criterion, old model.Criterion, isNew bool, lines map[string]int, rangeChanged bool) {
	_, hasStatus := lines["status"]
	_, hasVerified := lines["verified"]
	formulaChanged := !isNew && (c.Alpha != old.Alpha || c.Beta != old.Beta || c.Cool != old.Cool || c.Dyn != old.Dyn ||
		c.FMix != old.FMix || c.WarmTemperature != old.WarmTemperature)
	switch {
	case isNew && !hasStatus:
		c.Status = "from " + f.label() + ", no status given"
	case formulaChanged && !(hasVerified && c.Verified):
		c.Verified = false
		s := "not verified"
		if hasStatus {
			s = c.Status
		}
		c.Status = "changed by " + f.label() + ": " + s
	case formulaChanged && !hasStatus:
		c.Status = "changed by " + f.label() + ": marked verified, no status given"
	}
	_, hasRangeStatus := lines["range.status"]
	switch {
	case isNew && !hasRangeStatus:
		c.Range.Status = "not given in " + f.label()
	case rangeChanged && !hasRangeStatus:
		c.Range.Status = "changed by " + f.label()
	}
}

// setCriterionKey sets the field of c that key names.
func setCriterionKey(c *model.Criterion, key string, v Value) error {
	var err error
	switch key {
	case "id":
	case "label":
		c.Label, err = stringValue(key, v)
	case "authors":
		c.Citation.Authors, err = stringValue(key, v)
	case "journal":
		c.Citation.Journal, err = stringValue(key, v)
	case "arxiv":
		c.Citation.ArXiv, err = stringValue(key, v)
	case "equation":
		c.Citation.Equation, err = stringValue(key, v)
	case "status":
		c.Status, err = stringValue(key, v)
	case "note":
		c.Note, err = stringValue(key, v)
	case "year":
		if err = kindError(key, v, "an integer", KindInteger); err == nil && (v.Int < 1 || v.Int > 9999) {
			err = errAt(v.Line, "year must be between 1 and 9999 (got %d)", v.Int)
		}
		c.Citation.Year = int(v.Int)
	case "cooling_time", "dynamical_time":
		var s string
		if s, err = stringValue(key, v); err != nil {
			break
		}
		var perr error
		if key == "cooling_time" {
			c.Cool, perr = model.ParseCoolingTimeKind(s)
		} else {
			c.Dyn, perr = model.ParseDynamicalTimeKind(s)
		}
		if perr != nil {
			err = errAt(v.Line, "%s: %w", key, perr)
		}
	case "alpha":
		c.Alpha, err = numberValue(key, v)
	case "beta":
		c.Beta, err = numberValue(key, v)
	case "f_mix":
		c.FMix, err = numberValue(key, v)
	case "uncertainty":
		c.Uncertainty, err = numberValue(key, v)
	case "warm_temperature":
		var w float64
		w, err = numberValue(key, v)
		c.WarmTemperature = model.Temperature(w)
	case "verified":
		err = kindError(key, v, "true or false", KindBool)
		c.Verified = v.Bool
	case "range":
		err = errAt(v.Line, "range must be a table: write [criterion.range] on its own line after the criterion's keys")
	default:
		err = unknownKey(key, v.Line, "[[criterion]]", criterionKeys())
	}
	return err
}

// setRange applies a [criterion.range] table to c, records its key lines
// as "range.KEY", and reports whether an interval changed.
func setRange(c *model.Criterion, t *Table, lines map[string]int) (bool, error) {
	old := c.Range
	set := func(k string, v Value) error {
		lines["range."+k] = v.Line
		var err error
		switch k {
		case "chi":
			c.Range.Chi, err = intervalValue(k, v)
		case "mach":
			c.Range.Mach, err = intervalValue(k, v)
		case "t_cloud":
			c.Range.TCloud, err = intervalValue(k, v)
		case "mach_turb":
			c.Range.MachTurb, err = intervalValue(k, v)
		case "status":
			c.Range.Status, err = stringValue("range.status", v)
		default:
			err = unknownKey(k, v.Line, "[criterion.range]", rangeKeys())
		}
		return err
	}
	for _, k := range t.Keys {
		if err := set(k, t.Values[k]); err != nil {
			return false, err
		}
	}
	for _, ch := range children(t) {
		if !slices.Contains(rangeKeys(), ch.key) {
			return false, errAt(ch.t.Line, "unknown table %s: [criterion.range] has no sub-tables", ch.header())
		}
		// A known key given a table: the setter reports the type.
		if err := set(ch.key, tableValue(t, ch.key)); err != nil {
			return false, err
		}
	}
	changed := c.Range.Chi != old.Chi || c.Range.Mach != old.Mach || c.Range.TCloud != old.TCloud || c.Range.MachTurb != old.MachTurb
	return changed, nil
}

// kindError reports a value of the wrong kind; want describes the kinds
// accepted, which are kinds.
func kindError(key string, v Value, want string, kinds ...ValueKind) error {
	if slices.Contains(kinds, v.Kind) {
		return nil
	}
	hint := ""
	if slices.Contains(kinds, KindString) && v.Kind != KindArray && v.Kind != KindTable {
		hint = " (put it in quotes)"
	}
	return errAt(v.Line, "%s must be %s, not %s%s", key, want, article(v.Kind), hint)
}

// article returns the kind with its indefinite article, e.g. "an integer".
func article(k ValueKind) string {
	if k == KindInteger || k == KindArray || k == KindOffsetDateTime {
		return "an " + k.String()
	}
	return "a " + k.String()
}

// stringValue returns a string value, refusing control characters so that
// no file can send terminal control sequences to the display.
func stringValue(key string, v Value) (string, error) {
	if err := kindError(key, v, "a string", KindString); err != nil {
		return "", err
	}
	if i := strings.IndexFunc(v.Str, unicode.IsControl); i >= 0 {
		r, _ := utf8.DecodeRuneInString(v.Str[i:])
		return "", errAt(v.Line, "%s contains the control character %U; strings must be printable", key, r)
	}
	return v.Str, nil
}

// numberValue returns a finite integer or float value.
func numberValue(key string, v Value) (float64, error) {
	if err := kindError(key, v, "a number", KindInteger, KindFloat); err != nil {
		return 0, err
	}
	if math.IsNaN(v.Num) || math.IsInf(v.Num, 0) {
		return 0, errAt(v.Line, "%s must be a finite number (got %g)", key, v.Num)
	}
	return v.Num, nil
}

// intervalValue returns a [min, max] array as an Interval. A side may be
// left open with -inf as min or inf as max.
func intervalValue(key string, v Value) (model.Interval, error) {
	bad := errAt(v.Line, "range.%s must be [min, max], an array of two numbers (-inf as min or inf as max leaves a side open)", key)
	if v.Kind != KindArray || len(v.Array) != 2 {
		return model.Interval{}, bad
	}
	var lim [2]float64
	for i, e := range v.Array {
		if !e.IsNumber() || math.IsNaN(e.Num) || math.IsInf(e.Num, 1) && i == 0 || math.IsInf(e.Num, -1) && i == 1 {
			return model.Interval{}, bad
		}
		lim[i] = e.Num
	}
	return model.Interval{Min: lim[0], Max: lim[1]}, nil
}

// unknownKey reports a key that is not in known, suggesting the closest.
func unknownKey(key string, line int, table string, known []string) error {
	if s := suggest(key, known); s != "" {
		return errAt(line, "unknown key %q%s", clip(key), s)
	}
	return errAt(line, "unknown key %q in %s (known keys: %s)", clip(key), table, strings.Join(known, ", "))
}

// suggest returns ` (did you mean "K"?)` for the known K closest to word,
// or "" when none is close (suggest.Closest).
func suggest(word string, known []string) string {
	if k := suggestpkg.Closest(word, known); k != "" {
		return fmt.Sprintf(" (did you mean %q?)", k)
	}
	return ""
}
