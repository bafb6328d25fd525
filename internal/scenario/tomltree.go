package scenario

import (
	"errors"
	"fmt"
	"slices"
	"time"

	"cloudwind/internal/safetext"

	toml "github.com/pelletier/go-toml/v2"
	"github.com/pelletier/go-toml/v2/unstable"
)

// origin says how a table came to be.
type origin int

const (
	originImplied origin = iota // implied by the header of a sub-table, as [a] by [a.b]
	originHeader                // defined by its own [a] or [[a]] header; also the root
	originDotted                // defined by a dotted key, as a by a.b = 1
	originInline                // an inline table, alone or in an array
)

// A conflict is a key or table defined twice as the parser saw it: line is
// the duplicate's, first the first definition's. go-toml's decoder decides
// whether the file is valid; conflicts only add these lines to its message.
type conflict struct{ line, first int }

// A builder builds the tree of a document from go-toml's parser, which
// gives the lines and the file order, and then takes the values from
// go-toml's decoder (fill). It follows TOML's rules for where a header or
// key puts its table, but leaves the checks to the decoder.
type builder struct {
	data     []byte
	newlines []int // offsets of the line feeds, for line numbers
	p        unstable.Parser

	root, cur            *Table // cur: the table of the last header
	tables, keys, values int    // counts for the limits
	exprLine             int    // line of the key of the top-level expression being read
	conflicts            map[int]conflict
}

// newBuilder returns a builder for data.
func newBuilder(data []byte) *builder {
	b := &builder{data: data, root: &Table{origin: originHeader}, conflicts: map[int]conflict{}}
	b.cur = b.root
	for i, c := range data {
		if c == '\n' {
			b.newlines = append(b.newlines, i)
		}
	}
	return b
}

// line returns the line of the byte at offset.
func (b *builder) line(offset int) int {
	n, _ := slices.BinarySearch(b.newlines, offset)
	return n + 1
}

// nodeLine returns the line a node starts on. Arrays carry no position in
// go-toml's tree, so an array takes the line of its first element that
// has one, and fallback when none has.
func (b *builder) nodeLine(n *unstable.Node, fallback int) int {
	for ; n != nil; n = n.Child() {
		if n.Raw.Length > 0 {
			return b.line(int(n.Raw.Offset))
		}
	}
	return fallback
}

// conflict records a duplicate for the current top-level expression.
func (b *builder) conflict(line, first int) {
	if _, ok := b.conflicts[b.exprLine]; !ok {
		b.conflicts[b.exprLine] = conflict{line, first}
	}
}

// build reads every top-level expression into the tree. It returns the
// parser's syntax error, or an error wrapping ErrTooLarge.
func (b *builder) build() error {
	b.p.Reset(b.data)
	for b.p.NextExpression() {
		e := b.p.Expression()
		var err error
		switch e.Kind {
		case unstable.Table, unstable.ArrayTable:
			err = b.header(e)
		case unstable.KeyValue:
			err = b.keyValue(b.cur, e, true)
		}
		if err != nil {
			return err
		}
	}
	err := b.p.Error()
	if err == nil {
		return nil
	}
	var pe *unstable.ParserError
	if !errors.As(err, &pe) {
		return &ParseError{Err: fmt.Errorf("%w: %s", errInternal, safetext.Line(err.Error()))}
	}
	offset := min(max(cap(b.data)-cap(pe.Highlight), 0), len(b.data))
	return b.syntaxError(b.line(offset), pe.Message, pe.Key)
}

// keyParts returns the parts of a key and the line of its first part,
// refusing keys with more parts than any table may nest.
func (b *builder) keyParts(it unstable.Iterator) ([]string, int, error) {
	var parts []string
	line := 0
	for it.Next() {
		n := it.Node()
		if line == 0 {
			line = b.nodeLine(n, 1)
		}
		if parts = append(parts, string(n.Data)); len(parts) > MaxTableDepth+1 {
			return nil, 0, errAt(line, "%w: tables nest more than %d levels", ErrTooLarge, MaxTableDepth)
		}
	}
	if len(parts) == 0 {
		return nil, 0, &ParseError{Line: b.exprLine, Err: fmt.Errorf("%w: a key without parts", errInternal)}
	}
	return parts, line, nil
}

// newTable counts and returns a table named key under parent, refusing more
// than MaxTables tables or deeper nesting than MaxTableDepth.
func (b *builder) newTable(parent *Table, key string, line int, o origin) (*Table, error) {
	if b.tables++; b.tables > MaxTables {
		return nil, errAt(line, "%w: more than %d tables", ErrTooLarge, MaxTables)
	}
	if parent.depth >= MaxTableDepth {
		return nil, errAt(line, "%w: tables nest more than %d levels", ErrTooLarge, MaxTableDepth)
	}
	name := keyPart(key)
	if parent.Name != "" {
		name = parent.Name + "." + name
	}
	return &Table{Name: name, Line: line, origin: o, depth: parent.depth + 1}, nil
}

// addTable adds a new sub-table key to t.
func (b *builder) addTable(t *Table, key string, line int, o origin) (*Table, error) {
	nt, err := b.newTable(t, key, line, o)
	if err != nil {
		return nil, err
	}
	if t.Tables == nil {
		t.Tables = map[string]*Table{}
	}
	t.Tables[key] = nt
	return nt, nil
}

// addArrayTable appends a new element to the array of tables key of t.
func (b *builder) addArrayTable(t *Table, key string, line int, o origin) (*Table, error) {
	nt, err := b.newTable(t, key, line, o)
	if err != nil {
		return nil, err
	}
	if t.Arrays == nil {
		t.Arrays = map[string][]*Table{}
	}
	t.Arrays[key] = append(t.Arrays[key], nt)
	return nt, nil
}

// firstLine returns the line where key of t was first defined, as a value,
// a table or an array of tables, or 0 when it is not defined.
func firstLine(t *Table, key string) int {
	if v, ok := t.Values[key]; ok {
		return v.Line
	}
	if sub := t.Tables[key]; sub != nil {
		return sub.Line
	}
	if arr := t.Arrays[key]; len(arr) > 0 {
		return arr[0].Line
	}
	return 0
}

// header reads a [table] or [[array]] header and makes its table current.
// A header implies its parents; a name that is an array of tables means the
// array's last element (TOML v1.0.0, "Table" and "Array of Tables").
func (b *builder) header(e *unstable.Node) error {
	parts, line, err := b.keyParts(e.Key())
	if err != nil {
		return err
	}
	b.exprLine = line
	t := b.root
	for _, k := range parts[:len(parts)-1] {
		if t, err = b.enterByHeader(t, k, line); err != nil {
			return err
		}
	}
	k := parts[len(parts)-1]
	if e.Kind == unstable.ArrayTable {
		if arr := t.Arrays[k]; len(arr) > 0 && arr[0].origin == originInline || len(arr) == 0 && firstLine(t, k) > 0 {
			b.conflict(line, firstLine(t, k)) // a static array, a table or a value
		}
		b.cur, err = b.addArrayTable(t, k, line, originHeader)
		return err
	}
	if sub := t.Tables[k]; sub != nil {
		if sub.origin != originImplied {
			b.conflict(line, sub.Line)
		} else {
			sub.origin, sub.Line = originHeader, line
		}
		b.cur = sub
		return nil
	}
	if first := firstLine(t, k); first > 0 {
		b.conflict(line, first)
	}
	b.cur, err = b.addTable(t, k, line, originHeader)
	return err
}

// enterByHeader returns the sub-table key of t that a header goes through,
// implying it when it does not exist.
func (b *builder) enterByHeader(t *Table, key string, line int) (*Table, error) {
	if arr := t.Arrays[key]; len(arr) > 0 {
		if arr[0].origin == originInline {
			b.conflict(line, arr[0].Line) // a static array cannot be extended
		}
		return arr[len(arr)-1], nil
	}
	if sub := t.Tables[key]; sub != nil {
		if sub.origin == originInline {
			b.conflict(line, sub.Line) // an inline table cannot be extended
		}
		return sub, nil
	}
	if first := firstLine(t, key); first > 0 {
		b.conflict(line, first)
	}
	return b.addTable(t, key, line, originImplied)
}

// enterByDottedKey returns the sub-table key of t that a dotted key goes
// through, defining it when it does not exist.
func (b *builder) enterByDottedKey(t *Table, key string, line int) (*Table, error) {
	if sub := t.Tables[key]; sub != nil {
		if sub.origin == originHeader || sub.origin == originInline {
			b.conflict(line, sub.Line)
		}
		return sub, nil
	}
	if first := firstLine(t, key); first > 0 {
		b.conflict(line, first)
	}
	return b.addTable(t, key, line, originDotted)
}

// keyValue reads key = value into t; top is true for a top-level
// expression and false inside an inline table. An inline table, and an
// array of nothing but inline tables, become tables of t.
func (b *builder) keyValue(t *Table, e *unstable.Node, top bool) error {
	parts, line, err := b.keyParts(e.Key())
	if err != nil {
		return err
	}
	if top {
		b.exprLine = line
	}
	if b.keys++; b.keys > MaxKeys {
		return errAt(line, "%w: more than %d keys", ErrTooLarge, MaxKeys)
	}
	if b.values++; b.values > MaxValues {
		return errAt(line, "%w: more than %d values", ErrTooLarge, MaxValues)
	}
	for _, k := range parts[:len(parts)-1] {
		if t, err = b.enterByDottedKey(t, k, line); err != nil {
			return err
		}
	}
	k := parts[len(parts)-1]
	if first := firstLine(t, k); first > 0 {
		b.conflict(line, first)
	}
	v := e.Value()
	switch {
	case v.Kind == unstable.InlineTable:
		nt, err := b.addTable(t, k, line, originInline)
		if err != nil {
			return err
		}
		return b.inlineTable(nt, v)
	case isTableArray(v):
		for it := v.Children(); it.Next(); {
			nt, err := b.addArrayTable(t, k, b.nodeLine(it.Node(), line), originInline)
			if err != nil {
				return err
			}
			if err := b.inlineTable(nt, it.Node()); err != nil {
				return err
			}
		}
		return nil
	}
	val, err := b.value(t, k, v, line, 1)
	if err != nil {
		return err
	}
	if t.Values == nil {
		t.Values = map[string]Value{}
	}
	if _, dup := t.Values[k]; !dup {
		t.Keys = append(t.Keys, k)
	}
	t.Values[k] = val
	return nil
}

// isTableArray reports whether n is an array of one or more inline tables
// and nothing else, which TOML reads as an array of tables.
func isTableArray(n *unstable.Node) bool {
	if n.Kind != unstable.Array || n.Child() == nil {
		return false
	}
	for it := n.Children(); it.Next(); {
		if it.Node().Kind != unstable.InlineTable {
			return false
		}
	}
	return true
}

// inlineTable reads the key-values of the inline table n into t.
func (b *builder) inlineTable(t *Table, n *unstable.Node) error {
	for it := n.Children(); it.Next(); {
		if kv := it.Node(); kv.Kind == unstable.KeyValue {
			if err := b.keyValue(t, kv, false); err != nil {
				return err
			}
		}
	}
	return nil
}

// value reads the value n of key in t, on line, nested in level arrays
// (counting n if it is one). Its content comes later, from fill.
func (b *builder) value(t *Table, key string, n *unstable.Node, line, level int) (Value, error) {
	v := Value{Line: line}
	switch n.Kind {
	case unstable.String:
		v.Kind = KindString
	case unstable.Integer:
		v.Kind = KindInteger
	case unstable.Float:
		v.Kind = KindFloat
	case unstable.Bool:
		v.Kind = KindBool
	case unstable.DateTime:
		v.Kind = KindOffsetDateTime
	case unstable.LocalDateTime:
		v.Kind = KindLocalDateTime
	case unstable.LocalDate:
		v.Kind = KindLocalDate
	case unstable.LocalTime:
		v.Kind = KindLocalTime
	case unstable.InlineTable:
		nt, err := b.newTable(t, key, line, originInline)
		if err != nil {
			return Value{}, err
		}
		v.Kind, v.Table = KindTable, nt
		return v, b.inlineTable(nt, n)
	case unstable.Array:
		if level > MaxTableDepth {
			return Value{}, errAt(line, "%w: arrays nest more than %d levels", ErrTooLarge, MaxTableDepth)
		}
		v.Kind = KindArray
		for it := n.Children(); it.Next(); {
			if b.values++; b.values > MaxValues {
				return Value{}, errAt(line, "%w: more than %d values", ErrTooLarge, MaxValues)
			}
			el := it.Node()
			ev, err := b.value(t, key, el, b.nodeLine(el, line), level+1)
			if err != nil {
				return Value{}, err
			}
			v.Array = append(v.Array, ev)
		}
	default:
		return Value{}, &ParseError{Line: line, Err: fmt.Errorf("%w: a value of kind %s", errInternal, n.Kind)}
	}
	return v, nil
}

// fill puts the decoded values of m into t, checking that the decoder and
// the parser read the same tree.
func (b *builder) fill(t *Table, m map[string]any) error {
	if len(m) != len(t.Values)+len(t.Tables)+len(t.Arrays) {
		return mismatch(t.Line)
	}
	for _, k := range t.Keys {
		v := t.Values[k]
		raw, ok := m[k]
		if !ok {
			return mismatch(v.Line)
		}
		if err := b.fillValue(&v, raw); err != nil {
			return err
		}
		t.Values[k] = v
	}
	for k, sub := range t.Tables {
		sm, ok := m[k].(map[string]any)
		if !ok {
			return mismatch(sub.Line)
		}
		if err := b.fill(sub, sm); err != nil {
			return err
		}
	}
	for k, arr := range t.Arrays {
		elems, ok := m[k].([]any)
		if !ok || len(elems) != len(arr) {
			return mismatch(arr[0].Line)
		}
		for i, sub := range arr {
			sm, ok := elems[i].(map[string]any)
			if !ok {
				return mismatch(sub.Line)
			}
			if err := b.fill(sub, sm); err != nil {
				return err
			}
		}
	}
	return nil
}

// fillValue puts the decoded value raw into v, whose kind the parser gave.
func (b *builder) fillValue(v *Value, raw any) error {
	ok := false
	switch x := raw.(type) {
	case string:
		ok, v.Str = v.Kind == KindString, x
	case int64:
		ok, v.Int, v.Num = v.Kind == KindInteger, x, float64(x)
	case float64:
		ok, v.Num = v.Kind == KindFloat, x
	case bool:
		ok, v.Bool = v.Kind == KindBool, x
	case time.Time:
		ok = v.Kind == KindOffsetDateTime
	case toml.LocalDateTime:
		ok = v.Kind == KindLocalDateTime
	case toml.LocalDate:
		ok = v.Kind == KindLocalDate
	case toml.LocalTime:
		ok = v.Kind == KindLocalTime
	case map[string]any:
		if v.Kind == KindTable {
			return b.fill(v.Table, x)
		}
	case []any:
		if ok = v.Kind == KindArray && len(x) == len(v.Array); ok {
			for i := range v.Array {
				if err := b.fillValue(&v.Array[i], x[i]); err != nil {
					return err
				}
			}
		}
	}
	if !ok {
		return mismatch(v.Line)
	}
	return nil
}

// mismatch reports that go-toml's parser and decoder read line differently.
func mismatch(line int) error {
	return &ParseError{Line: line, Err: fmt.Errorf("%w: go-toml's parser and decoder read this line differently", errInternal)}
}
