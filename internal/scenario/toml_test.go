package scenario

import (
	"bytes"
	"errors"
	"math"
	"strings"
	"testing"
	"testing/iotest"
)

// Every expected value in this file is a format rule of this package, which
// follows TOML v1.0.0 (https://toml.io/en/v1.0.0) where it says so.

// mustParse parses src or fails the test.
func mustParse(t *testing.T, src string) *Document {
	t.Helper()
	doc, err := ParseTOML(strings.NewReader(src))
	if err != nil {
		t.Fatalf("ParseTOML: %v\ninput:\n%s", err, src)
	}
	return doc
}

func TestParseTOMLDocument(t *testing.T) {
	src := "\uFEFF# leading comment\r\n" + // 1: BOM and CRLF
		"top = 'root key'\r\n" + // 2
		"\n" + // 3
		"[server]  # trailing comment\n" + // 4
		"name = \"a\\\"b\\\\c\\n\\t\\r\\u00e9\\U0001F600\"\n" + // 5
		"lit = 'C:\\path\\\"x\"'\n" + // 6
		"empty = \"\"\n" + // 7
		"on = true\n" + // 8
		"off = false\n" + // 9
		"list = [\n" + // 10
		"  1, # one\n" + // 11
		"\n" + // 12
		"  2.5, 'three',\n" + // 13
		"]\n" + // 14
		"none = []\n" + // 15
		"[server.sub]\n" + // 16
		"x = -7\n" + // 17
		"[[item]]\n" + // 18
		"n = 1\n" + // 19
		"[item.range]\n" + // 20
		"r = 10\n" + // 21
		"[[item]]\n" + // 22
		"n = 2\n" + // 23
		"[item.range]\n" + // 24
		"r = 20\n" + // 25
		"[implied.child]\n" + // 26
		"[implied]\n" + // 27
		"k = 'v'" // 28, no final line ending
	root := mustParse(t, src).Root
	if got := root.Values["top"]; got.Kind != KindString || got.Str != "root key" || got.Line != 2 {
		t.Errorf("top = %+v, want the string \"root key\" on line 2", got)
	}
	srv := root.Tables["server"]
	if srv == nil || srv.Line != 4 || srv.Name != "server" {
		t.Fatalf("[server] = %+v, want a table named server on line 4", srv)
	}
	if want := []string{"name", "lit", "empty", "on", "off", "list", "none"}; strings.Join(srv.Keys, ",") != strings.Join(want, ",") {
		t.Errorf("server keys = %v, want %v in file order", srv.Keys, want)
	}
	if got, want := srv.Values["name"].Str, "a\"b\\c\n\t\ré😀"; got != want {
		t.Errorf("name = %q, want %q", got, want)
	}
	if got, want := srv.Values["lit"].Str, `C:\path\"x"`; got != want {
		t.Errorf("lit = %q, want %q (literal strings have no escapes)", got, want)
	}
	if v := srv.Values["empty"]; v.Kind != KindString || v.Str != "" || v.Line != 7 {
		t.Errorf("empty = %+v, want the empty string on line 7", v)
	}
	if !srv.Values["on"].Bool || srv.Values["off"].Bool || srv.Values["off"].Kind != KindBool {
		t.Errorf("on, off = %+v, %+v, want true, false", srv.Values["on"], srv.Values["off"])
	}
	list := srv.Values["list"]
	if list.Kind != KindArray || list.Line != 10 || len(list.Array) != 3 {
		t.Fatalf("list = %+v, want a 3-element array on line 10", list)
	}
	if e := list.Array; e[0].Int != 1 || e[0].Kind != KindInteger || e[0].Line != 11 ||
		e[1].Num != 2.5 || e[1].Kind != KindFloat || e[1].Line != 13 || e[2].Str != "three" || e[2].Line != 13 {
		t.Errorf("list elements = %+v, want 1 (line 11), 2.5 and 'three' (line 13)", e)
	}
	if v := srv.Values["none"]; v.Kind != KindArray || len(v.Array) != 0 {
		t.Errorf("none = %+v, want an empty array", v)
	}
	if sub := srv.Tables["sub"]; sub == nil || sub.Name != "server.sub" || sub.Values["x"].Int != -7 {
		t.Errorf("[server.sub] = %+v, want x = -7", sub)
	}
	items := root.Arrays["item"]
	if len(items) != 2 {
		t.Fatalf("[[item]] has %d elements, want 2", len(items))
	}
	for i, it := range items {
		wantN, wantR := int64(i+1), int64(10*(i+1))
		if it.Values["n"].Int != wantN || it.Tables["range"] == nil || it.Tables["range"].Values["r"].Int != wantR {
			t.Errorf("item %d = %+v, want n = %d and [item.range] r = %d", i, it, wantN, wantR)
		}
	}
	if items[1].Line != 22 || items[1].Tables["range"].Line != 24 {
		t.Errorf("second item on lines %d/%d, want 22/24", items[1].Line, items[1].Tables["range"].Line)
	}
	imp := root.Tables["implied"]
	if imp == nil || imp.Line != 27 || imp.Values["k"].Str != "v" || imp.Tables["child"].Line != 26 {
		t.Errorf("[implied] = %+v, want it defined on line 27 after its child on 26", imp)
	}
}

func TestParseTOMLNumbers(t *testing.T) {
	cases := []struct {
		tok   string
		kind  ValueKind
		num   float64
		exact int64
	}{
		{"0", KindInteger, 0, 0},
		{"+99", KindInteger, 99, 99},
		{"-17", KindInteger, -17, -17},
		{"1_000", KindInteger, 1000, 1000},
		{"5_349_221", KindInteger, 5349221, 5349221},
		{"9223372036854775807", KindInteger, math.MaxInt64, math.MaxInt64},
		{"-9223372036854775808", KindInteger, math.MinInt64, math.MinInt64},
		{"0xDEAD_beef", KindInteger, 0xdeadbeef, 0xdeadbeef},
		{"0o755", KindInteger, 0o755, 0o755},
		{"0b1101", KindInteger, 13, 13},
		{"1.0", KindFloat, 1, 0},
		{"-0.01", KindFloat, -0.01, 0},
		{"5e+22", KindFloat, 5e22, 0},
		{"1e06", KindFloat, 1e6, 0},
		{"-2E-2", KindFloat, -0.02, 0},
		{"6.626e-34", KindFloat, 6.626e-34, 0},
		{"224_617.445_991", KindFloat, 224617.445991, 0},
		{"0.5", KindFloat, 0.5, 0},
		{"1e-400", KindFloat, 0, 0}, // underflows to zero, as IEEE 754 rounding does
		{"inf", KindFloat, math.Inf(1), 0},
		{"+inf", KindFloat, math.Inf(1), 0},
		{"-inf", KindFloat, math.Inf(-1), 0},
	}
	for _, c := range cases {
		v := mustParse(t, "x = "+c.tok).Root.Values["x"]
		if v.Kind != c.kind || v.Num != c.num || (c.kind == KindInteger && v.Int != c.exact) {
			t.Errorf("%s: got %v %v (int %d), want %v %v (int %d)", c.tok, v.Kind, v.Num, v.Int, c.kind, c.num, c.exact)
		}
	}
	for _, tok := range []string{"nan", "+nan", "-nan"} {
		if v := mustParse(t, "x = "+tok).Root.Values["x"]; v.Kind != KindFloat || !math.IsNaN(v.Num) {
			t.Errorf("%s: got %+v, want a NaN float", tok, v)
		}
	}
}

// badTOMLCase is a malformed input and the line its error must name.
type badTOMLCase struct {
	name        string
	src         string
	line        int
	unsupported bool   // the error wraps ErrUnsupported
	msg         string // a substring of the message
}

func badTOMLCases() []badTOMLCase {
	return []badTOMLCase{
		{"invalid UTF-8", "a = 1\nb = \"\xff\"\n", 2, false, "invalid UTF-8"},
		{"control character", "a = 1\n\nb = \"x\x01\"\n", 3, false, "control character U+0001"},
		{"NUL in comment", "# ok\n# bad \x00\n", 2, false, "U+0000"},
		{"DEL", "a = 'x\x7f'\n", 1, false, "U+007F"},
		{"lone carriage return", "a = 1\rb = 2\n", 1, false, "carriage return"},
		{"quoted key", "\"a\" = 1\n", 1, true, "quoted keys"},
		{"literal quoted key", "\n'a' = 1\n", 2, true, "quoted keys"},
		{"dotted key", "a.b = 1\n", 1, true, "dotted keys"},
		{"inline table", "[t]\nx = { a = 1 }\n", 2, true, "inline tables"},
		{"multi-line basic string", "x = \"\"\"\nhi\"\"\"\n", 1, true, "multi-line strings"},
		{"multi-line literal string", "\nx = '''hi'''\n", 2, true, "multi-line strings"},
		{"offset date-time", "d = 1979-05-27T07:32:00Z\n", 1, true, "dates and times"},
		{"local date", "\n\nd = 1979-05-27\n", 3, true, "dates and times"},
		{"local time", "t = 07:32:00\n", 1, true, "dates and times"},
		{"nested array", "a = [\n1,\n[2]]\n", 3, true, "nested arrays"},
		{"escape \\b", `s = "a\bc"`, 1, true, `\b`},
		{"escape \\x", `s = "\x41"`, 1, true, `\x`},
		{"invalid escape", "\ns = \"a\\qb\"\n", 2, false, `invalid escape \q in string`},
		{"backslash before line end", "s = \"abc\\\r\ndef\"\n", 1, false, "backslash at the end of the line"},
		{"short \\u", `s = "\u12"`, 1, false, "4 hex digits"},
		{"surrogate \\u", `s = "\uD800"`, 1, false, "not a Unicode scalar value"},
		{"too big \\U", `s = "\U00110000"`, 1, false, "not a Unicode scalar value"},
		{"unterminated basic string", "a = 1\ns = \"abc\nt = 2\n", 2, false, "unterminated string"},
		{"unterminated literal string", "s = 'abc", 1, false, "unterminated string"},
		{"backslash at end of file", `s = "abc\`, 1, false, "unterminated string"},
		{"duplicate key", "[t]\na = 1\nb = 2\na = 3\n", 4, false, "duplicate key \"a\" (first set on line 2)"},
		{"duplicate table", "[t]\na = 1\n[u]\n[t]\n", 4, false, "already defined on line 1"},
		{"table then array of tables", "[t]\n[[t]]\n", 2, false, "cannot define array of tables"},
		{"array of tables then table", "[[t]]\n[t]\n", 2, false, "array of tables"},
		{"key then table", "a = 1\n[a]\n", 2, false, "key \"a\" was set on line 1"},
		{"key then sub-table", "[t]\na = 1\n[t.a.b]\n", 3, false, "key \"a\" was set on line 2"},
		{"key over implied table", "[t.u]\n[t]\nu = 1\n", 3, false, "already a table"},
		{"key over array of tables", "[[t.u]]\n[t]\nu = 1\n", 3, false, "already an array of tables"},
		{"missing value", "a =\nb = 1\n", 1, false, "expected a value, found the end of the line"},
		{"value at end of file", "a = ", 1, false, "found the end of the file"},
		{"missing equals", "\na 1\n", 2, false, "expected '='"},
		{"garbage after value", "a = 1 2\n", 1, false, "expected the end of the line"},
		{"garbage after header", "[t] x\n", 1, false, "expected the end of the line"},
		{"bare word value", "a = yes\n", 1, false, "put strings in quotes"},
		{"leading zero", "a = 007\n", 1, false, "leading zeros"},
		{"leading zero float", "a = 01.5\n", 1, false, "leading zeros"},
		{"trailing underscore", "a = 1_\n", 1, false, "invalid number"},
		{"leading underscore", "a = _1\n", 1, false, "invalid number"},
		{"underscore after sign", "a = -_1\n", 1, false, "invalid number"},
		{"implied table defined twice", "[a.b]\n[a]\n[a]\n", 3, false, "already defined on line 2"},
		{"double underscore", "a = 1__0\n", 1, false, "invalid number"},
		{"leading dot", "a = .5\n", 1, false, "invalid number"},
		{"trailing dot", "a = 5.\n", 1, false, "invalid number"},
		{"underscore by dot", "a = 1_.5\n", 1, false, "invalid number"},
		{"empty exponent", "a = 1e\n", 1, false, "invalid number"},
		{"signed hex", "a = -0x1\n", 1, false, "invalid number"},
		{"bad hex digit", "a = 0xg\n", 1, false, "invalid number"},
		{"hex underscore first", "a = 0x_1\n", 1, false, "invalid number"},
		{"integer overflow", "a = 9223372036854775808\n", 1, false, "does not fit in 64 bits"},
		{"hex overflow", "a = 0xffffffffffffffff\n", 1, false, "does not fit in 64 bits"},
		{"float overflow", "a = 1e400\n", 1, false, "out of range"},
		{"capitalised inf", "a = Inf\n", 1, false, "put strings in quotes"},
		{"capitalised true", "a = True\n", 1, false, "put strings in quotes"},
		{"unclosed array", "a = [1,\n2\n", 3, false, "the array opened on line 1 is not closed"},
		{"array missing comma", "a = [1\n 2]\n", 2, false, "expected ',' or ']'"},
		{"array leading comma", "a = [,1]\n", 1, false, "expected a value, found ','"},
		{"array double comma", "a = [1,,2]\n", 1, false, "expected a value"},
		{"unclosed header", "\n[t\n", 2, false, "expected \"]\""},
		{"half-closed array header", "[[t]\n", 1, false, "expected \"]]\""},
		{"empty header", "[]\n", 1, false, "expected a table name"},
		{"header trailing dot", "[a.]\n", 1, false, "expected a table name"},
		{"quoted header key", "[\"a\"]\n", 1, true, "quoted keys"},
		{"space inside [[", "[ [t]]\n", 1, false, "expected a table name"},
		{"key starting with '='", "= 1\n", 1, false, "expected a key"},
		{"header too deep", "[a.b.c.d.e.f.g.h.i.j.k.l.m.n.o.p.q]\n", 1, false, "more than 16 levels"},
	}
}

func TestParseTOMLErrors(t *testing.T) {
	for _, c := range badTOMLCases() {
		t.Run(c.name, func(t *testing.T) {
			_, err := ParseTOML(strings.NewReader(c.src))
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error = %v, want a *ParseError", err)
			}
			if pe.Line != c.line {
				t.Errorf("line = %d, want %d (error %q)", pe.Line, c.line, err)
			}
			if errors.Is(err, ErrUnsupported) != c.unsupported {
				t.Errorf("errors.Is(ErrUnsupported) = %v, want %v (error %q)", !c.unsupported, c.unsupported, err)
			}
			if c.unsupported && !strings.Contains(err.Error(), "not supported by cloudwind's TOML reader") {
				t.Errorf("error %q does not say it is not supported by cloudwind's TOML reader", err)
			}
			if !strings.Contains(err.Error(), c.msg) {
				t.Errorf("error %q does not contain %q", err, c.msg)
			}
		})
	}
}

func TestParseTOMLLimits(t *testing.T) {
	big := strings.Repeat("#", MaxInputSize)
	if _, err := ParseTOML(strings.NewReader(big)); err != nil {
		t.Errorf("a comment of exactly MaxInputSize bytes: %v, want no error", err)
	}
	_, err := ParseTOML(strings.NewReader(big + "\n"))
	var pe *ParseError
	if !errors.As(err, &pe) || pe.Line != 0 || !errors.Is(err, ErrTooLarge) {
		t.Errorf("MaxInputSize+1 bytes: error %v, want a line-0 *ParseError wrapping ErrTooLarge", err)
	}

	var tables strings.Builder
	for i := 0; i <= MaxTables; i++ {
		tables.WriteString("[[t]]\n")
	}
	_, err = ParseTOML(strings.NewReader(tables.String()))
	if !errors.As(err, &pe) || pe.Line != MaxTables+1 || !errors.Is(err, ErrTooLarge) {
		t.Errorf("%d tables: error %v, want ErrTooLarge on line %d", MaxTables+1, err, MaxTables+1)
	}

	values := "a = [" + strings.Repeat("1,", MaxValues) + "]\n"
	_, err = ParseTOML(strings.NewReader(values))
	if !errors.As(err, &pe) || pe.Line != 1 || !errors.Is(err, ErrTooLarge) {
		t.Errorf("%d values: error %v, want ErrTooLarge on line 1", MaxValues+1, err)
	}
	ok := "a = [" + strings.Repeat("1,", MaxValues-1) + "]\n"
	if _, err := ParseTOML(strings.NewReader(ok)); err != nil {
		t.Errorf("%d values: %v, want no error", MaxValues, err)
	}
}

func TestParseTOMLReadError(t *testing.T) {
	boom := errors.New("disk on fire")
	_, err := ParseTOML(iotest.ErrReader(boom))
	var pe *ParseError
	if !errors.As(err, &pe) || pe.Line != 0 || !errors.Is(err, boom) {
		t.Errorf("error = %v, want a line-0 *ParseError wrapping the read error", err)
	}
	if _, err := ParseTOML(iotest.OneByteReader(strings.NewReader("a = 1\n"))); err != nil {
		t.Errorf("one-byte reads: %v, want no error", err)
	}
}

func TestParseErrorString(t *testing.T) {
	e := errors.New("bad thing")
	cases := []struct {
		pe   ParseError
		want string
	}{
		{ParseError{File: "f.toml", Line: 3, Err: e}, "f.toml:3: bad thing"},
		{ParseError{Line: 3, Err: e}, "line 3: bad thing"},
		{ParseError{File: "f.toml", Err: e}, "f.toml: bad thing"},
		{ParseError{Err: e}, "bad thing"},
		{ParseError{Line: 1}, "line 1: unknown error"},
	}
	for _, c := range cases {
		if got := c.pe.Error(); got != c.want {
			t.Errorf("Error() = %q, want %q", got, c.want)
		}
	}
}

func TestValueKindString(t *testing.T) {
	want := map[ValueKind]string{KindString: "string", KindInteger: "integer", KindFloat: "float",
		KindBool: "boolean", KindArray: "array", 0: "ValueKind(0)"}
	for k, w := range want {
		if k.String() != w {
			t.Errorf("ValueKind(%d).String() = %q, want %q", int(k), k.String(), w)
		}
	}
}

// countLines returns the number of lines in data, counting a final line
// without a line ending.
func countLines(data []byte) int { return bytes.Count(data, []byte("\n")) + 1 }

func FuzzParseTOML(f *testing.F) {
	for _, c := range badTOMLCases() {
		f.Add([]byte(c.src))
	}
	for _, c := range badCriteriaCases() {
		f.Add([]byte(c.src))
	}
	f.Add([]byte(exampleCriteriaFile))
	f.Add([]byte("[a]\nx = [1, 'b', \"c\", true, 1.5e3, 0x1f, inf]\n[[a.b]]\n[a.b.c]\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		doc, err := ParseTOML(bytes.NewReader(data))
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %v (%T) is not a *ParseError", err, err)
			}
			if pe.Line < 0 || pe.Line > countLines(data) {
				t.Fatalf("error line %d outside 0..%d: %v", pe.Line, countLines(data), err)
			}
			return
		}
		if doc == nil || doc.Root == nil {
			t.Fatal("no error and no document")
		}
		checkLines(t, doc.Root, countLines(data))
	})
}

// checkLines asserts that every line number in t lies in 1..n.
func checkLines(t *testing.T, tab *Table, n int) {
	t.Helper()
	for k, v := range tab.Values {
		for _, e := range append([]Value{v}, v.Array...) {
			if e.Line < 1 || e.Line > n {
				t.Fatalf("value %q on line %d, outside 1..%d", k, e.Line, n)
			}
		}
	}
	if len(tab.Keys) != len(tab.Values) {
		t.Fatalf("table %q: %d keys but %d values", tab.Name, len(tab.Keys), len(tab.Values))
	}
	for _, s := range tab.Tables {
		checkLines(t, s, n)
	}
	for _, arr := range tab.Arrays {
		for _, s := range arr {
			checkLines(t, s, n)
		}
	}
}
