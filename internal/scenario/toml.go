package scenario

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"strconv"
	"strings"

	"cloudwind/internal/safetext"

	toml "github.com/pelletier/go-toml/v2"
)

// Limits that bound the time and memory any input can take. They are
// checked before go-toml decodes the file: its duplicate-key check scans
// every key seen so far, so decoding takes time quadratic in the number of
// keys and tables (go-toml v2.4.3: 116 000 keys, as many as 1 MiB holds,
// take 25 s; 8192 take 0.16 s on the machine this was measured on).
const (
	MaxInputSize  = 1 << 20 // bytes in one file
	MaxTableDepth = 16      // components of a table's full name ([a.b.c], a.b.c = 1 and inline tables alike), and levels of nested arrays
	MaxTables     = 4096    // tables in one file: implicit ones, inline ones and elements of arrays of tables included
	MaxKeys       = 4096    // key = value pairs in one file, those inside inline tables included
	MaxValues     = 1 << 16 // values in one file, array elements included
)

// Sentinel errors wrapped by ParseError.
var (
	// ErrSyntax marks a file that is not valid TOML, as go-toml reports it:
	// a syntax error, a duplicate key or a table defined twice.
	ErrSyntax = errors.New("invalid TOML")
	// ErrTooLarge marks an input beyond one of the limits above.
	ErrTooLarge = errors.New("input too large")

	// errInternal marks a failure of the TOML library rather than of the
	// file (a recovered panic, or go-toml's parser and decoder reading the
	// file differently); the fuzz tests fail on it.
	errInternal = errors.New("internal error in the TOML reader (please report it with the file)")
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

// Kinds of Value, one for each TOML type.
const (
	KindString ValueKind = iota + 1
	KindInteger
	KindFloat
	KindBool
	KindArray
	KindTable // an inline table inside an array; see Value
	KindOffsetDateTime
	KindLocalDateTime
	KindLocalDate
	KindLocalTime
)

// String returns the name TOML v1.0.0 gives the type, in lower case:
// "string", "integer", "float", "boolean", "array", "table",
// "offset date-time", "local date-time", "local date" or "local time".
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
	case KindTable:
		return "table"
	case KindOffsetDateTime:
		return "offset date-time"
	case KindLocalDateTime:
		return "local date-time"
	case KindLocalDate:
		return "local date"
	case KindLocalTime:
		return "local time"
	}
	return fmt.Sprintf("ValueKind(%d)", int(k))
}

// A Value is a TOML value other than a table that a key holds, or an
// element of an array. Tables that a key holds, written as inline tables or
// arrays of them, are in Table.Tables and Table.Arrays like the tables of
// headers; only an inline table inside an array that also holds other
// values is a Value, of KindTable. Dates and times keep only their kind: no
// key of cloudwind takes one.
type Value struct {
	Kind  ValueKind
	Str   string  // KindString: the decoded string
	Int   int64   // KindInteger: the exact value
	Num   float64 // KindInteger (converted) and KindFloat; may be ±Inf or NaN
	Bool  bool    // KindBool
	Array []Value // KindArray: the elements
	Table *Table  // KindTable: the inline table
	Line  int     // the line the value starts on: for a key's value, the key's line
}

// IsNumber reports whether v is an integer or a float.
func (v Value) IsNumber() bool { return v.Kind == KindInteger || v.Kind == KindFloat }

// A Table is a TOML table: the root, a table defined by a [header], a
// dotted key or an inline table, or an element of an array of tables. Maps
// are nil until something is put in them.
type Table struct {
	Name   string              // dotted name, "" for the root; elements of [[a]] are named "a"; parts that are not bare keys are quoted
	Line   int                 // line of the header, key or "{" that defined or first implied it; 0 for the root
	Keys   []string            // keys of Values, in file order
	Values map[string]Value    // key = value pairs
	Tables map[string]*Table   // sub-tables, by their last name component
	Arrays map[string][]*Table // arrays of tables, by their last name component

	origin origin // how the table came to be, for the notes on duplicates
	depth  int    // components of the full name
}

// A Document is a parsed TOML file.
type Document struct {
	Root *Table // the keys before the first header, and every table under it
}

// ParseTOML reads a TOML document, as described in the package
// documentation. Every error is a *ParseError with the line of the problem.
func ParseTOML(r io.Reader) (*Document, error) {
	data, err := io.ReadAll(io.LimitReader(r, MaxInputSize+1))
	if err != nil {
		return nil, &ParseError{Err: fmt.Errorf("read: %w", err)}
	}
	if len(data) > MaxInputSize {
		return nil, &ParseError{Err: fmt.Errorf("%w: more than %d bytes", ErrTooLarge, MaxInputSize)}
	}
	data = bytes.TrimPrefix(data, []byte("\uFEFF")) // a byte-order mark some editors write
	return parseTOML(data[:len(data):len(data)])
}

// parseTOML reads data in three steps: go-toml's parser builds the tree,
// with lines and file order, and checks the limits; go-toml's decoder then
// checks the whole file and decodes the values; the tree takes the values.
// A panic in go-toml becomes an error.
func parseTOML(data []byte) (doc *Document, err error) {
	defer func() {
		if p := recover(); p != nil {
			doc, err = nil, &ParseError{Err: fmt.Errorf("%w: %s", errInternal, safetext.Clip(fmt.Sprint(p), 200))}
		}
	}()
	b := newBuilder(data)
	parseErr := b.build()
	if errors.Is(parseErr, ErrTooLarge) {
		return nil, parseErr
	}
	var decoded map[string]any
	if err := toml.Unmarshal(data, &decoded); err != nil {
		// The decoder stops at the first problem in file order, which may
		// come before the parser's, as a duplicate key does.
		return nil, b.decodeError(err)
	}
	if parseErr != nil {
		return nil, parseErr
	}
	if err := b.fill(b.root, decoded); err != nil {
		return nil, err
	}
	return &Document{Root: b.root}, nil
}

// decodeError turns an error of go-toml's decoder into a *ParseError on
// the line go-toml gives.
func (b *builder) decodeError(err error) error {
	var de *toml.DecodeError
	if !errors.As(err, &de) {
		return &ParseError{Err: fmt.Errorf("%w: %s", errInternal, safetext.Line(err.Error()))}
	}
	line, _ := de.Position()
	return b.syntaxError(line, strings.TrimPrefix(de.Error(), "toml: "), de.Key())
}

// syntaxError returns a *ParseError wrapping ErrSyntax for a message of
// go-toml at line. The messages about keys and tables defined twice are
// rewritten, naming the key quoted and, when the parser saw it, the line of
// the first definition; go-toml reports a duplicate inside an inline table
// on the line of the key holding the table, so the line is moved to the
// duplicate's. Other messages, already in lower case, are kept, on one
// line and with unsafe characters removed.
func (b *builder) syntaxError(line int, msg string, key []string) error {
	text, dup := rewriteMessage(msg, key)
	if dup {
		if c, ok := b.conflicts[line]; ok {
			line = c.line
			text += fmt.Sprintf(" (first defined on line %d)", c.first)
		}
	}
	return &ParseError{Line: line, Err: fmt.Errorf("%w: %s", ErrSyntax, text)}
}

// rewriteMessage rewrites a go-toml v2.4.3 message about a key or table
// defined twice into the style of this package, and reports whether it was
// one. key is the key or table header go-toml was processing.
func rewriteMessage(msg string, key []string) (string, bool) {
	header := clip(joinKey(key))
	if name, ok := cutAround(msg, "key ", " is already defined"); ok {
		return fmt.Sprintf("duplicate key %q", clip(name)), true
	}
	if _, ok := cutAround(msg, "table ", " already exists as defined by a dotted key"); ok {
		return fmt.Sprintf("table [%s] is already defined by dotted keys", header), true
	}
	if _, ok := cutAround(msg, "table ", " already exists as an array of tables"); ok {
		return fmt.Sprintf("cannot define table [%s]: it is already an array of tables", header), true
	}
	if _, ok := cutAround(msg, "table ", " already exists"); ok {
		return fmt.Sprintf("table [%s] is already defined", header), true
	}
	if rest, ok := cutAround(msg, "key ", ", but should be an array table"); ok {
		if name, kind, ok := strings.Cut(rest, " already exists as a "); ok {
			return fmt.Sprintf("cannot define array of tables [[%s]]: key %q is already %s", header, clip(name), trackerKind(kind)), true
		}
	}
	if rest, ok := strings.CutPrefix(msg, "key "); ok {
		if name, kind, ok := strings.Cut(rest, " should be a table, not a "); ok {
			return fmt.Sprintf("cannot define table [%s]: key %q is already %s", header, clip(name), trackerKind(kind)), true
		}
	}
	if name, ok := cutAround(msg, "key ", " already exists as a value"); ok {
		return fmt.Sprintf("cannot define %s: key %q is already a value", header, clip(name)), true
	}
	switch {
	case msg == "basic strings cannot have new lines":
		return `unterminated string: a "..." string must end on its line (use """...""" for several lines)`, false
	case msg == "literal strings cannot have new lines":
		return `unterminated string: a '...' string must end on its line (use '''...''' for several lines)`, false
	case msg == "unexpected character U+000A at start of value", msg == "unexpected character U+000D at start of value":
		return "expected a value before the end of the line", false
	case strings.HasPrefix(msg, "expected newline but got "):
		return "expected the end of the line, found " + safetext.Line(strings.TrimPrefix(msg, "expected newline but got ")), false
	case strings.HasPrefix(msg, "unable to parse float: ") && strings.HasSuffix(msg, "value out of range"):
		return "float out of range (the largest is about 1.8e308)", false
	case strings.HasPrefix(msg, "unable to parse float: "):
		return "invalid float", false
	}
	return safetext.Line(msg), false
}

// cutAround returns s without prefix and suffix, if it has both.
func cutAround(s, prefix, suffix string) (string, bool) {
	s, ok := strings.CutPrefix(s, prefix)
	if !ok {
		return "", false
	}
	return strings.CutSuffix(s, suffix)
}

// trackerKind describes a kind name of go-toml's duplicate-key tracker.
func trackerKind(kind string) string {
	switch kind {
	case "value":
		return "a value"
	case "kv-table":
		return "a table defined by dotted keys"
	case "table":
		return "a table"
	case "array-table":
		return "an array of tables"
	}
	return safetext.Clip(kind, 20)
}

// joinKey writes a dotted key as TOML would: bare parts as they are, other
// parts quoted.
func joinKey(parts []string) string {
	q := make([]string, len(parts))
	for i, p := range parts {
		q[i] = keyPart(p)
	}
	return strings.Join(q, ".")
}

// keyPart returns p as a bare key if it is one, and quoted otherwise.
func keyPart(p string) string {
	if p == "" || strings.IndexFunc(p, func(r rune) bool { return !isBareKeyRune(r) }) >= 0 {
		return strconv.Quote(p)
	}
	return p
}

// isBareKeyRune reports whether r may appear in a bare key (A-Z, a-z, 0-9,
// '_', '-').
func isBareKeyRune(r rune) bool {
	return r >= 'A' && r <= 'Z' || r >= 'a' && r <= 'z' || r >= '0' && r <= '9' || r == '_' || r == '-'
}

// clip makes s safe to quote in a message and shortens it (safetext.Clip).
func clip(s string) string { return safetext.Clip(s, 40) }
