package scenario

import (
	"errors"
	"fmt"
	"io"
	"strings"
	"unicode/utf8"
)

// Limits that bound the memory any input can take.
const (
	MaxInputSize  = 1 << 20 // bytes in one file
	MaxTableDepth = 16      // components of one table header, as in [a.b.c]
	MaxTables     = 4096    // tables in one file, implicit ones included
	MaxValues     = 1 << 16 // values in one file, array elements included
)

// Sentinel errors wrapped by ParseError.
var (
	// ErrUnsupported marks valid TOML that cloudwind's reader refuses.
	ErrUnsupported = errors.New("not supported by cloudwind's TOML reader")
	// ErrTooLarge marks an input beyond one of the limits above.
	ErrTooLarge = errors.New("input too large")
)

// A ParseError reports a problem in a file, with its line (1-based; 0 when
// the problem has no line, as for a read error or an oversized file).
type ParseError struct {
	File string // the file name; "" when unknown
	Line int
	Err  error
}

// Error formats the error as "FILE:LINE: msg", or "line LINE: msg" when File
// is "", leaving out the parts that are not known.
func (e *ParseError) Error() string {
	msg := "unknown error"
	if e.Err != nil {
		msg = e.Err.Error()
	}
	switch {
	case e.File != "" && e.Line > 0:
		return fmt.Sprintf("%s:%d: %s", e.File, e.Line, msg)
	case e.File != "":
		return e.File + ": " + msg
	case e.Line > 0:
		return fmt.Sprintf("line %d: %s", e.Line, msg)
	}
	return msg
}

// Unwrap returns the underlying error.
func (e *ParseError) Unwrap() error { return e.Err }

// errAt returns a *ParseError at line whose message is formatted by
// fmt.Errorf, so %w wraps.
func errAt(line int, format string, args ...any) *ParseError {
	return &ParseError{Line: line, Err: fmt.Errorf(format, args...)}
}

// ValueKind is the type of a Value.
type ValueKind int

// Kinds of Value.
const (
	KindString ValueKind = iota + 1
	KindInteger
	KindFloat
	KindBool
	KindArray
)

// String returns "string", "integer", "float", "boolean" or "array".
func (k ValueKind) String() string {
	switch k {
	case KindString:
		return "string"
	case KindInteger:
		return "integer"
	case KindFloat:
		return "float"
	case KindBool:
		return "boolean"
	case KindArray:
		return "array"
	}
	return fmt.Sprintf("ValueKind(%d)", int(k))
}

// A Value is a TOML value: a scalar or an array of scalars.
type Value struct {
	Kind  ValueKind
	Str   string  // KindString: the decoded string
	Int   int64   // KindInteger: the exact value
	Num   float64 // KindInteger (converted) and KindFloat; may be ±Inf or NaN
	Bool  bool    // KindBool
	Array []Value // KindArray: the elements, each a scalar
	Line  int     // the line the value starts on: for a key's value, the key's line
}

// IsNumber reports whether v is an integer or a float.
func (v Value) IsNumber() bool { return v.Kind == KindInteger || v.Kind == KindFloat }

// A Table is a TOML table: the root, a [table] or an element of an
// [[array]]. Maps are nil until something is put in them.
type Table struct {
	Name   string              // dotted name, "" for the root; elements of [[a]] are named "a"
	Line   int                 // line of the header that defined or first implied it; 0 for the root
	Keys   []string            // keys of Values, in file order
	Values map[string]Value    // key = value pairs
	Tables map[string]*Table   // sub-tables, by their last name component
	Arrays map[string][]*Table // arrays of tables, by their last name component

	explicit bool // defined by its own header (or the root), not only implied
}

// A Document is a parsed TOML file.
type Document struct {
	Root *Table // the keys before the first header, and every table under it
}

// ParseTOML reads a TOML document of the subset described in the package
// documentation. Every error is a *ParseError with the line of the problem.
func ParseTOML(r io.Reader) (*Document, error) {
	data, err := io.ReadAll(io.LimitReader(r, MaxInputSize+1))
	if err != nil {
		return nil, &ParseError{Err: fmt.Errorf("read: %w", err)}
	}
	if len(data) > MaxInputSize {
		return nil, &ParseError{Err: fmt.Errorf("%w: more than %d bytes", ErrTooLarge, MaxInputSize)}
	}
	src := strings.TrimPrefix(string(data), "\uFEFF") // a byte-order mark some editors write
	if err := checkText(src); err != nil {
		return nil, err
	}
	p := &parser{src: src, line: 1, root: &Table{explicit: true}}
	p.cur = p.root
	if err := p.parse(); err != nil {
		return nil, err
	}
	return &Document{Root: p.root}, nil
}

// checkText rejects invalid UTF-8, control characters other than tab and
// line feed (TOML v1.0.0 forbids them everywhere), and a carriage return
// that does not start a CRLF line ending.
func checkText(s string) error {
	line := 1
	for i := 0; i < len(s); {
		c := s[i]
		if c >= utf8.RuneSelf {
			r, n := utf8.DecodeRuneInString(s[i:])
			if r == utf8.RuneError && n == 1 {
				return errAt(line, "invalid UTF-8")
			}
			i += n
			continue
		}
		switch {
		case c == '\n':
			line++
		case c == '\r':
			if i+1 >= len(s) || s[i+1] != '\n' {
				return errAt(line, "carriage return not followed by a line feed")
			}
		case c == '\t':
		case c < 0x20 || c == 0x7f:
			return errAt(line, "control character %U is not allowed", rune(c))
		}
		i++
	}
	return nil
}

// parser holds the state of one ParseTOML call.
type parser struct {
	src            string
	pos, line      int
	root, cur      *Table
	tables, values int
}

// eof reports whether the whole input has been read.
func (p *parser) eof() bool { return p.pos >= len(p.src) }

// peek returns the next byte, or 0 at the end of the input.
func (p *parser) peek() byte {
	if p.eof() {
		return 0
	}
	return p.src[p.pos]
}

// found describes the next character for an error message.
func (p *parser) found() string {
	if p.eof() {
		return "the end of the file"
	}
	if c := p.src[p.pos]; c == '\n' || c == '\r' {
		return "the end of the line"
	}
	r, _ := utf8.DecodeRuneInString(p.src[p.pos:])
	return fmt.Sprintf("%q", r)
}

// skipSpace consumes spaces and tabs.
func (p *parser) skipSpace() {
	for !p.eof() && (p.src[p.pos] == ' ' || p.src[p.pos] == '\t') {
		p.pos++
	}
}

// newline consumes a line ending if there is one.
func (p *parser) newline() bool {
	switch {
	case strings.HasPrefix(p.src[p.pos:], "\n"):
		p.pos++
	case strings.HasPrefix(p.src[p.pos:], "\r\n"):
		p.pos += 2
	default:
		return false
	}
	p.line++
	return true
}

// skipComment consumes a comment up to, not including, the line ending.
func (p *parser) skipComment() {
	if p.peek() != '#' {
		return
	}
	if i := strings.IndexAny(p.src[p.pos:], "\r\n"); i >= 0 {
		p.pos += i
	} else {
		p.pos = len(p.src)
	}
}

// skipBlank consumes white space, comments and line endings.
func (p *parser) skipBlank() {
	for {
		p.skipSpace()
		p.skipComment()
		if !p.newline() {
			return
		}
	}
}

// endOfLine consumes optional white space and a comment, then the line
// ending or the end of the input.
func (p *parser) endOfLine(after string) error {
	p.skipSpace()
	p.skipComment()
	if p.eof() || p.newline() {
		return nil
	}
	return errAt(p.line, "expected the end of the line after the %s, found %s", after, p.found())
}

// parse reads the whole document, line by line.
func (p *parser) parse() error {
	for {
		p.skipBlank()
		if p.eof() {
			return nil
		}
		var err error
		if p.peek() == '[' {
			err = p.header()
		} else {
			err = p.keyValue()
		}
		if err != nil {
			return err
		}
	}
}

// isBareKeyChar reports whether c may appear in a bare key.
func isBareKeyChar(c byte) bool {
	return c >= 'A' && c <= 'Z' || c >= 'a' && c <= 'z' || c >= '0' && c <= '9' || c == '_' || c == '-'
}

// bareKey reads a bare key; what names it in error messages.
func (p *parser) bareKey(what string) (string, error) {
	if c := p.peek(); c == '"' || c == '\'' {
		return "", errAt(p.line, "quoted keys are %w; use a bare key of A-Z, a-z, 0-9, '_' and '-'", ErrUnsupported)
	}
	start := p.pos
	for !p.eof() && isBareKeyChar(p.src[p.pos]) {
		p.pos++
	}
	if p.pos == start {
		return "", errAt(p.line, "expected a %s, found %s", what, p.found())
	}
	return p.src[start:p.pos], nil
}

// header reads a [table] or [[array]] header and makes it current.
func (p *parser) header() error {
	line := p.line
	p.pos++
	array := p.peek() == '['
	if array {
		p.pos++
	}
	var parts []string
	for {
		p.skipSpace()
		k, err := p.bareKey("table name")
		if err != nil {
			return err
		}
		if parts = append(parts, k); len(parts) > MaxTableDepth {
			return errAt(line, "%w: table header nests more than %d levels", ErrTooLarge, MaxTableDepth)
		}
		p.skipSpace()
		if p.peek() != '.' {
			break
		}
		p.pos++
	}
	closing := "]"
	if array {
		closing = "]]"
	}
	if !strings.HasPrefix(p.src[p.pos:], closing) {
		return errAt(line, "expected %q to close the table header, found %s", closing, p.found())
	}
	p.pos += len(closing)
	if err := p.define(parts, array, line); err != nil {
		return err
	}
	return p.endOfLine("table header")
}

// newTable counts and returns a new table, refusing more than MaxTables.
func (p *parser) newTable(name string, line int, explicit bool) (*Table, error) {
	if p.tables++; p.tables > MaxTables {
		return nil, errAt(line, "%w: more than %d tables", ErrTooLarge, MaxTables)
	}
	return &Table{Name: name, Line: line, explicit: explicit}, nil
}

// define finds or creates the table a header names, following TOML v1.0.0:
// a header may imply its parents, a name inside an array of tables means its
// last element, and no table may be defined twice.
func (p *parser) define(parts []string, array bool, line int) error {
	t := p.root
	for i, k := range parts {
		name := strings.Join(parts[:i+1], ".")
		if v, ok := t.Values[k]; ok {
			return errAt(line, "cannot define table [%s]: key %q was set on line %d", clip(name), clip(k), v.Line)
		}
		last := i == len(parts)-1
		arr, isArray := t.Arrays[k]
		sub, isTable := t.Tables[k]
		switch {
		case !last && isArray:
			t = arr[len(arr)-1]
		case !last && isTable:
			t = sub
		case array && isTable:
			return errAt(line, "cannot define array of tables [[%s]]: it is a table defined on line %d", clip(name), sub.Line)
		case !array && isArray:
			return errAt(line, "cannot define table [%s]: it is an array of tables defined on line %d", clip(name), arr[0].Line)
		case last && isTable && sub.explicit:
			return errAt(line, "table [%s] is already defined on line %d", clip(name), sub.Line)
		case last && isTable:
			sub.explicit, sub.Line = true, line
			p.cur = sub
		default:
			nt, err := p.newTable(name, line, last)
			if err != nil {
				return err
			}
			if last && array {
				if t.Arrays == nil {
					t.Arrays = map[string][]*Table{}
				}
				t.Arrays[k] = append(t.Arrays[k], nt)
			} else {
				if t.Tables == nil {
					t.Tables = map[string]*Table{}
				}
				t.Tables[k] = nt
			}
			t = nt
			p.cur = nt
		}
	}
	return nil
}

// keyValue reads key = value into the current table.
func (p *parser) keyValue() error {
	line := p.line
	key, err := p.bareKey("key")
	if err != nil {
		return err
	}
	p.skipSpace()
	if p.peek() == '.' {
		return errAt(line, "dotted keys are %w; use a [table] header", ErrUnsupported)
	}
	if p.peek() != '=' {
		return errAt(line, "expected '=' after key %q, found %s", clip(key), p.found())
	}
	t := p.cur
	if old, ok := t.Values[key]; ok {
		return errAt(line, "duplicate key %q (first set on line %d)", clip(key), old.Line)
	}
	if sub, ok := t.Tables[key]; ok {
		return errAt(line, "key %q is already a table defined on line %d", clip(key), sub.Line)
	}
	if arr, ok := t.Arrays[key]; ok {
		return errAt(line, "key %q is already an array of tables defined on line %d", clip(key), arr[0].Line)
	}
	p.pos++
	p.skipSpace()
	v, err := p.value(false)
	if err != nil {
		return err
	}
	if t.Values == nil {
		t.Values = map[string]Value{}
	}
	t.Values[key] = v
	t.Keys = append(t.Keys, key)
	return p.endOfLine("value")
}

// clip shortens s for an error message.
func clip(s string) string {
	const max = 40
	if len(s) <= max {
		return s
	}
	i := max
	for i > 0 && !utf8.RuneStart(s[i]) {
		i--
	}
	return s[:i] + "…"
}
