package scenario

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"reflect"
	"strings"
	"testing"
	"testing/iotest"

	"cloudwind/model"
)

// Sources of the expected values in this file: "TOML v1.0.0" is the
// specification, https://toml.io/en/v1.0.0, and most inputs are its
// examples; the rest, marked "format rule", are rules of this package
// (doc.go, toml.go): the lines, the messages, the limits and the tree.

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
	// Lines, file order and table names: format rule. Values: TOML v1.0.0.
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
	if items[1].Line != 22 || items[1].Tables["range"].Line != 24 || items[1].Tables["range"].Name != "item.range" {
		t.Errorf("second item on lines %d/%d, want 22/24", items[1].Line, items[1].Tables["range"].Line)
	}
	imp := root.Tables["implied"]
	if imp == nil || imp.Line != 27 || imp.Values["k"].Str != "v" || imp.Tables["child"].Line != 26 {
		t.Errorf("[implied] = %+v, want it defined on line 27 after its child on 26", imp)
	}
}

// TestParseTOMLForms checks TOML that cloudwind's own reader used to refuse:
// the values are those TOML v1.0.0 gives; where they land in the tree and
// their lines are format rules.
func TestParseTOMLForms(t *testing.T) {
	src := "" +
		"fruit.apple.color = 'red'\n" + // 1: dotted key (TOML v1.0.0, "Keys")
		"\"quoted key\" = 1\n" + // 2: quoted keys
		"'literal.key' = 2\n" + // 3
		"point = { x = 1, y = 2 }\n" + // 4: inline table
		"nested = [ [1, 2], ['a'], [] ]\n" + // 5: nested and mixed arrays
		"points = [ { x = 1 },\n" + // 6: an array of inline tables is an array of tables
		"  { x = 2 } ]\n" + // 7
		"mixed = [ 1, { y = 3 } ]\n" + // 8
		"ml = \"\"\"\n" + // 9: multi-line basic string; the first newline is trimmed
		"Roses \\\n" + // 10: a line-ending backslash trims the break and the white space after it
		"    are red\"\"\"\n" + // 11
		"lit = '''\n" + // 12: multi-line literal string
		"a\\b\n" + // 13
		"c'''\n" + // 14
		"esc = \"\\b\\f\"\n" + // 15: the escapes \b and \f
		"[fruit.banana]\n" + // 16: a sub-table of a table defined by dotted keys
		"ripe = true\n" + // 17
		"[dog.\"tater.man\"]\n" + // 18: a quoted part in a header
		"type.name = \"pug\"\n" // 19: a dotted key inside a table
	root := mustParse(t, src).Root

	fruit := root.Tables["fruit"]
	if fruit == nil || fruit.Line != 1 || fruit.Tables["apple"] == nil || fruit.Tables["apple"].Values["color"].Str != "red" ||
		fruit.Tables["apple"].Name != "fruit.apple" || fruit.Tables["apple"].Values["color"].Line != 1 {
		t.Errorf("fruit = %+v, want fruit.apple.color = \"red\" on line 1", fruit)
	}
	if b := fruit.Tables["banana"]; b == nil || b.Line != 16 || !b.Values["ripe"].Bool {
		t.Errorf("[fruit.banana] = %+v, want ripe = true, on line 16", b)
	}
	if v := root.Values["quoted key"]; v.Int != 1 || v.Line != 2 {
		t.Errorf(`"quoted key" = %+v, want 1 on line 2`, v)
	}
	if v := root.Values["literal.key"]; v.Int != 2 || v.Line != 3 {
		t.Errorf(`'literal.key' = %+v, want 2 on line 3 (a dot inside quotes is part of the key)`, v)
	}
	if want := []string{"quoted key", "literal.key", "nested", "mixed", "ml", "lit", "esc"}; !reflect.DeepEqual(root.Keys, want) {
		t.Errorf("root keys = %q, want %q (tables are not keys of Values)", root.Keys, want)
	}
	p := root.Tables["point"]
	if p == nil || p.Line != 4 || p.Values["x"].Int != 1 || p.Values["y"].Int != 2 || p.Values["y"].Line != 4 {
		t.Errorf("point = %+v, want the table {x = 1, y = 2} on line 4", p)
	}
	nested := root.Values["nested"]
	if nested.Kind != KindArray || len(nested.Array) != 3 || nested.Array[0].Array[1].Int != 2 ||
		nested.Array[1].Array[0].Str != "a" || nested.Array[2].Kind != KindArray || len(nested.Array[2].Array) != 0 {
		t.Errorf("nested = %+v, want [[1, 2], ['a'], []]", nested)
	}
	pts := root.Arrays["points"]
	if len(pts) != 2 || pts[0].Values["x"].Int != 1 || pts[1].Values["x"].Int != 2 || pts[0].Line != 6 || pts[1].Line != 7 {
		t.Errorf("points = %+v, want two tables, x = 1 on line 6 and x = 2 on line 7", pts)
	}
	mixed := root.Values["mixed"]
	if len(mixed.Array) != 2 || mixed.Array[1].Kind != KindTable || mixed.Array[1].Table.Values["y"].Int != 3 {
		t.Errorf("mixed = %+v, want [1, a table with y = 3]", mixed)
	}
	if v := root.Values["ml"]; v.Str != "Roses are red" || v.Line != 9 {
		t.Errorf("ml = %+v, want \"Roses are red\" on line 9", v)
	}
	if v := root.Values["lit"]; v.Str != "a\\b\nc" {
		t.Errorf("lit = %q, want %q", v.Str, "a\\b\nc")
	}
	if v := root.Values["esc"]; v.Str != "\b\f" {
		t.Errorf("esc = %q, want U+0008 U+000C", v.Str)
	}
	tater := root.Tables["dog"].Tables["tater.man"]
	if tater == nil || tater.Name != `dog."tater.man"` || tater.Tables["type"].Values["name"].Str != "pug" {
		t.Errorf(`[dog."tater.man"] = %+v, want type.name = "pug"`, tater)
	}
}

func TestParseTOMLNumbers(t *testing.T) {
	// TOML v1.0.0, "Integer" and "Float" (most are its examples).
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

func TestParseTOMLDates(t *testing.T) {
	// TOML v1.0.0, "Offset Date-Time", "Local Date-Time", "Local Date",
	// "Local Time": valid values, read with their kind (format rule).
	cases := map[string]ValueKind{
		"1979-05-27T07:32:00Z":             KindOffsetDateTime,
		"1979-05-27T00:32:00.999999-07:00": KindOffsetDateTime,
		"1979-05-27 07:32:00Z":             KindOffsetDateTime,
		"1979-05-27T07:32:00":              KindLocalDateTime,
		"1979-05-27":                       KindLocalDate,
		"00:32:00.999999":                  KindLocalTime,
	}
	for tok, kind := range cases {
		if v := mustParse(t, "\nd = "+tok+"\n").Root.Values["d"]; v.Kind != kind || v.Line != 2 {
			t.Errorf("d = %s: got %+v, want a %v on line 2", tok, v, kind)
		}
	}
}

// badTOMLCase is a malformed input and the line its error must name.
type badTOMLCase struct {
	name   string
	src    string
	line   int
	syntax bool   // the error wraps ErrSyntax (else ErrTooLarge)
	msg    string // a substring of the message
}

// badTOMLCases are invalid TOML (TOML v1.0.0) and inputs beyond the
// limits; the lines and messages are format rules.
func badTOMLCases() []badTOMLCase {
	deep := "a" + strings.Repeat(".a", MaxTableDepth) // MaxTableDepth+1 parts
	return []badTOMLCase{
		{"invalid UTF-8", "a = 1\nb = \"\xff\"\n", 2, true, "invalid UTF-8"},
		{"control character", "a = 1\n\nb = \"x\x01\"\n", 3, true, "control characters"},
		{"NUL in comment", "# ok\n# bad \x00\n", 2, true, "control characters are not allowed in comments"},
		{"DEL", "a = 'x\x7f'\n", 1, true, "control characters"},
		{"lone carriage return", "a = 1\rb = 2\n", 1, true, "expected the end of the line, found U+000D"},
		{"BOM not at the start", "a = 1\n\uFEFFb = 2\n", 2, true, "invalid character at start of key"},
		{"invalid escape", "\ns = \"a\\qb\"\n", 2, true, `invalid escape character U+0071 'q'`},
		{"backslash before line end", "s = \"abc\\\r\ndef\"\n", 1, true, "invalid escape character"},
		{"short \\u", `s = "\u12"`, 1, true, "unicode escape sequence is too short"},
		{"surrogate \\u", `s = "\uD800"`, 1, true, "not a valid unicode code point"},
		{"too big \\U", `s = "\U00110000"`, 1, true, "not a valid unicode code point"},
		{"unterminated basic string", "a = 1\ns = \"abc\nt = 2\n", 2, true, "unterminated string"},
		{"unterminated literal string", "s = 'abc", 1, true, "unterminated literal string"},
		{"unterminated multi-line string", "a = 1\ns = \"\"\"abc\n\n", 3, true, `multiline basic string not terminated by """`},
		{"backslash at end of file", `s = "abc\`, 1, true, `need a character after \`},
		{"duplicate key", "[t]\na = 1\nb = 2\na = 3\n", 4, true, `duplicate key "a" (first defined on line 2)`},
		{"duplicate dotted key", "a.b = 1\nc = 2\na.b = 3\n", 3, true, `duplicate key "b" (first defined on line 1)`},
		{"duplicate in an inline table", "\nt = { a = 1, a = 2 }\n", 2, true, `duplicate key "a" (first defined on line 2)`},
		{"duplicate quoted key", "a = 1\n\"a\" = 2\n", 2, true, `duplicate key "a" (first defined on line 1)`},
		{"duplicate key with an escape character", "\"\\u001b\" = 1\n\"\\u001b\" = 2\n", 2, true, `duplicate key "" (first defined on line 1)`}, // ESC removed (safetext.Clip)
		{"duplicate table", "[t]\na = 1\n[u]\n[t]\n", 4, true, "table [t] is already defined (first defined on line 1)"},
		{"implied table defined twice", "[a.b]\n[a]\n[a]\n", 3, true, "table [a] is already defined (first defined on line 2)"},
		{"table then array of tables", "[t]\n[[t]]\n", 2, true, "cannot define array of tables [[t]]"},
		{"array of tables then table", "[[t]]\n[t]\n", 2, true, "cannot define table [t]: it is already an array of tables"},
		{"static array then array of tables", "t = [{}]\n[[t]]\n", 2, true, "cannot define array of tables [[t]]"},
		{"key then table", "a = 1\n[a]\n", 2, true, `cannot define table [a]: key "a" is already a value (first defined on line 1)`},
		{"key then sub-table", "[t]\na = 1\n[t.a.b]\n", 3, true, `key "a" is already a value (first defined on line 2)`},
		{"key then dotted key", "a = 1\na.b = 2\n", 2, true, `duplicate key "a" (first defined on line 1)`},
		{"key over implied table", "[t.u]\n[t]\nu = 1\n", 3, true, `duplicate key "u" (first defined on line 1)`},
		{"key over array of tables", "[[t.u]]\n[t]\nu = 1\n", 3, true, `duplicate key "u"`},
		{"header over dotted keys", "[a]\nb.c = 1\n[a.b]\n", 3, true, "table [a.b] is already defined by dotted keys (first defined on line 2)"},
		{"dotted key into an inline table", "a = {b = 1}\na.c = 2\n", 2, true, `duplicate key "a" (first defined on line 1)`},
		{"missing value", "a =\nb = 1\n", 1, true, "expected a value before the end of the line"},
		{"value at end of file", "a = ", 1, true, "expected value, not end of input"},
		{"missing equals", "\na 1\n", 2, true, "expected '=' after key"},
		{"garbage after value", "a = 1 2\n", 1, true, "expected the end of the line, found U+0032 '2'"},
		{"garbage after header", "[t] x\n", 1, true, "expected the end of the line, found U+0078 'x'"},
		{"bare word value", "a = yes\n", 1, true, "unexpected character U+0079 'y' at start of value"},
		{"unquoted string after a number", "a = 20s\n", 1, true, "strings must be quoted"},
		{"leading zero", "a = 007\n", 1, true, "leading zeroes"},
		{"leading zero float", "a = 01.5\n", 1, true, "leading zeroes"},
		{"trailing underscore", "a = 1_\n", 1, true, "at least one digit between underscores"},
		{"leading underscore", "a = _1\n", 1, true, "unexpected character U+005F '_'"},
		{"double underscore", "a = 1__0\n", 1, true, "at least one digit between underscores"},
		{"leading dot", "a = .5\n", 1, true, "unexpected character U+002E '.'"},
		{"trailing dot", "a = 5.\n", 1, true, "decimal point must be followed by a digit"},
		{"empty exponent", "a = 1e\n", 1, true, "exponent must contain at least one digit"},
		{"signed hex", "a = -0x1\n", 1, true, "sign is not allowed on numbers with a radix prefix"},
		{"bad hex digit", "a = 0xg\n", 1, true, "radix prefix must be followed by at least one digit"},
		{"integer overflow", "a = 9223372036854775808\n", 1, true, "too large to fit in a 64-bit signed integer"},
		{"hex overflow", "a = 0xffffffffffffffff\n", 1, true, "too large to fit in a 64-bit signed integer"},
		{"float overflow", "\na = 1e400\n", 2, true, "float out of range"},
		{"capitalised inf", "a = Inf\n", 1, true, "unexpected character U+0049 'I'"},
		{"capitalised true", "a = True\n", 1, true, "unexpected character U+0054 'T'"},
		{"impossible date", "\nd = 1979-02-30\n", 2, true, "impossible date"},
		{"unclosed array", "a = [1,\n2\n", 2, true, "array is incomplete"},
		{"array missing comma", "a = [1\n 2]\n", 2, true, "expected ',' or ']' after array value"},
		{"array leading comma", "a = [,1]\n", 1, true, "expected value but got U+002C ','"},
		{"unclosed inline table", "a = {b = 1\n", 1, true, "inline table is incomplete"},
		{"unclosed header", "\n[t\n", 2, true, "expected ']' to close table name"},
		{"half-closed array header", "[[t]\n", 1, true, "expected ']]' to close array table name"},
		{"empty header", "[]\n", 1, true, "invalid character at start of key"},
		{"header trailing dot", "[a.]\n", 1, true, "invalid character at start of key"},
		{"space inside [[", "[ [t]]\n", 1, true, "invalid character at start of key"},
		{"key starting with '='", "= 1\n", 1, true, "invalid character at start of key: U+003D '='"},
		{"header too deep", "[" + deep + "]\n", 1, false, "tables nest more than 16 levels"},
		{"dotted key too deep", "\n" + deep + ".a = 1\n", 2, false, "tables nest more than 16 levels"},
		{"inline tables too deep", strings.Repeat("a = {", MaxTableDepth+1) + strings.Repeat("}", MaxTableDepth+1) + "\n", 1, false, "tables nest more than 16 levels"},
		{"arrays too deep", "a = " + strings.Repeat("[", MaxTableDepth+1) + strings.Repeat("]", MaxTableDepth+1) + "\n", 1, false, "arrays nest more than 16 levels"},
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
			if errors.Is(err, ErrSyntax) != c.syntax || errors.Is(err, ErrTooLarge) == c.syntax {
				t.Errorf("error %q: wraps ErrSyntax %v, ErrTooLarge %v; want %v, %v", err, !c.syntax, c.syntax, c.syntax, !c.syntax)
			}
			msg := err.Error()
			if !strings.Contains(msg, c.msg) {
				t.Errorf("error %q does not contain %q", msg, c.msg)
			}
			// One line, none of go-toml's own prefix or context, nothing unsafe.
			if strings.ContainsAny(msg, "\n\r\x1b") || strings.Contains(msg, "toml:") || strings.Contains(msg, "strconv") {
				t.Errorf("error %q is not a clean one-line message", msg)
			}
		})
	}
}

func TestParseTOMLLimits(t *testing.T) {
	// Format rules: the limits of toml.go, on the line where they are hit.
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
	inline := "a = [" + strings.Repeat("{},", MaxTables) + "{}]\n"
	if _, err = ParseTOML(strings.NewReader(inline)); !errors.As(err, &pe) || pe.Line != 1 || !errors.Is(err, ErrTooLarge) {
		t.Errorf("%d inline tables: error %v, want ErrTooLarge on line 1", MaxTables+1, err)
	}

	var keys strings.Builder
	for i := range MaxKeys {
		fmt.Fprintf(&keys, "k%d = %d\n", i, i)
	}
	if _, err := ParseTOML(strings.NewReader(keys.String())); err != nil {
		t.Errorf("%d keys: %v, want no error", MaxKeys, err)
	}
	keys.WriteString("one_more = 1\n")
	_, err = ParseTOML(strings.NewReader(keys.String()))
	if !errors.As(err, &pe) || pe.Line != MaxKeys+1 || !errors.Is(err, ErrTooLarge) {
		t.Errorf("%d keys: error %v, want ErrTooLarge on line %d", MaxKeys+1, err, MaxKeys+1)
	}

	values := "a = [" + strings.Repeat("1,", MaxValues) + "]\n" // with a's own value, one too many
	_, err = ParseTOML(strings.NewReader(values))
	if !errors.As(err, &pe) || pe.Line != 1 || !errors.Is(err, ErrTooLarge) {
		t.Errorf("%d values: error %v, want ErrTooLarge on line 1", MaxValues+1, err)
	}
	ok := "a = [" + strings.Repeat("1,", MaxValues-1) + "]\n"
	if _, err := ParseTOML(strings.NewReader(ok)); err != nil {
		t.Errorf("%d values: %v, want no error", MaxValues, err)
	}
	deepOK := "[" + "a" + strings.Repeat(".a", MaxTableDepth-1) + "]\nx = [" + strings.Repeat("[", MaxTableDepth-1) + strings.Repeat("]", MaxTableDepth-1) + "]\n"
	if _, err := ParseTOML(strings.NewReader(deepOK)); err != nil {
		t.Errorf("tables and arrays nested %d levels: %v, want no error", MaxTableDepth, err)
	}
}

func TestFillMismatch(t *testing.T) {
	// Format rule: if go-toml's decoder gives a tree other than its parser's,
	// the error is an internal one on the line concerned, never a panic.
	b := newBuilder([]byte("a = 1\nb = [2]\n"))
	if err := b.build(); err != nil {
		t.Fatal(err)
	}
	for _, m := range []map[string]any{
		{"a": "one", "b": []any{int64(2)}},
		{"a": int64(1), "b": []any{}},
		{"a": int64(1)},
	} {
		err := b.fill(b.root, m)
		var pe *ParseError
		if !errors.As(err, &pe) || !errors.Is(err, errInternal) {
			t.Errorf("fill(%v) = %v, want an internal *ParseError", m, err)
		}
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
	// Format rule: "FILE:LINE: msg", leaving out what is not known.
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
	// The type names of TOML v1.0.0, in lower case.
	want := map[ValueKind]string{KindString: "string", KindInteger: "integer", KindFloat: "float",
		KindBool: "boolean", KindArray: "array", KindTable: "table", KindOffsetDateTime: "offset date-time",
		KindLocalDateTime: "local date-time", KindLocalDate: "local date", KindLocalTime: "local time", 0: "ValueKind(0)"}
	for k, w := range want {
		if k.String() != w {
			t.Errorf("ValueKind(%d).String() = %q, want %q", int(k), k.String(), w)
		}
	}
}

// plainScenario is a scenario file in the layout Write uses.
const plainScenario = `[scenario]
name = "Starburst outflow, inner kpc"
description = "free text"

[inputs]
chi = 300
mach = 1.5
radius = 10

[conventions]
mu = 0.6

[cooling]
spec = "builtin"
table = ["norm: nH2"]
`

// TestParseScenarioTOMLForms checks that the forms TOML v1.0.0 gives for the
// same tables and keys read as the plain file does.
func TestParseScenarioTOMLForms(t *testing.T) {
	want, err := Parse(strings.NewReader(plainScenario), "plain.toml")
	if err != nil {
		t.Fatalf("Parse(plain): %v", err)
	}
	forms := map[string]string{
		"inline tables": `scenario = { name = "Starburst outflow, inner kpc", description = "free text" }
inputs = { chi = 300, mach = 1.5, radius = 10 }
conventions = { mu = 0.6 }
cooling = { spec = "builtin", table = ["norm: nH2"] }
`,
		"dotted keys": `scenario.name = "Starburst outflow, inner kpc"
scenario.description = "free text"
inputs.chi = 300
inputs.mach = 1.5
inputs.radius = 10
conventions.mu = 0.6
cooling.spec = "builtin"
cooling.table = ["norm: nH2"]
`,
		"dotted keys, inline tables and headers": `scenario = { name = "Starburst outflow, inner kpc", description = "free text" }
inputs.chi = 300
inputs.mach = 1.5
inputs.radius = 10
[cooling]
spec = "builtin"
table = ["norm: nH2"]
[conventions]
mu = 0.6
`,
		"quoted keys": `["scenario"]
"name" = "Starburst outflow, inner kpc"
'description' = "free text"
[ 'inputs' ]
"chi" = 300
'mach' = 1.5
"radius" = 10
["conventions"]
"mu" = 0.6
["cooling"]
"spec" = 'builtin'
'table' = ['norm: nH2']
`,
		"multi-line strings": `[scenario]
name = """
Starburst outflow, \
    inner kpc"""
description = '''free text'''
[inputs]
chi = 300
mach = 1.5
radius = 10
[conventions]
mu = 0.6
[cooling]
spec = """builtin"""
table = [
  '''norm: nH2''',
]
`,
		"escapes": `[scenario]
name = "Starburst outflow, \u0069nner kpc"
description = "free\U00000020text"
[inputs]
chi = 3e2
mach = 1.5
radius = 1_0
[conventions]
mu = 6e-1
[cooling]
spec = "builtin"
table = ["norm: nH2"]
`,
		"CRLF and byte-order mark": "\uFEFF" + strings.ReplaceAll(plainScenario, "\n", "\r\n"),
	}
	for name, src := range forms {
		got, err := Parse(strings.NewReader(src), "form.toml")
		if err != nil {
			t.Errorf("%s: Parse: %v\ninput:\n%s", name, err, src)
			continue
		}
		if !reflect.DeepEqual(got, want) {
			t.Errorf("%s: Parse =\n%+v\nwant\n%+v", name, got, want)
		}
	}
}

// plainCriteria is a criteria file in the layout of the package
// documentation.
const plainCriteria = `[[criterion]]
id = "li-2020"
alpha = 5
verified = true
status = "checked"
[criterion.range]
chi = [100, 1000]
status = "from the paper"
`

// TestLoadCriteriaTOMLForms checks that the forms TOML v1.0.0 gives for an
// array of tables and a sub-table read as the plain file does.
func TestLoadCriteriaTOMLForms(t *testing.T) {
	want, err := LoadCriteria(strings.NewReader(plainCriteria), "c.toml", model.BuiltinCriteria())
	if err != nil {
		t.Fatalf("LoadCriteria(plain): %v", err)
	}
	forms := map[string]string{
		"array of inline tables": `criterion = [
  { id = "li-2020", alpha = 5, verified = true, status = "checked", range = { chi = [100, 1000], status = "from the paper" } },
]
`,
		"inline range": `[[criterion]]
id = "li-2020"
alpha = 5
verified = true
status = "checked"
range = { chi = [100, 1000], status = "from the paper" }
`,
		"dotted range keys": `[[criterion]]
range.chi = [100, 1000]
id = "li-2020"
alpha = 5
verified = true
range.status = "from the paper"
status = "checked"
`,
	}
	for name, src := range forms {
		got, err := LoadCriteria(strings.NewReader(src), "c.toml", model.BuiltinCriteria())
		if err != nil {
			t.Errorf("%s: LoadCriteria: %v\ninput:\n%s", name, err, src)
			continue
		}
		if !reflect.DeepEqual(got, want) {
			t.Errorf("%s: LoadCriteria differs from the plain file", name)
		}
	}
}

// TestParseErrorClasses shows one error of each class as the user sees it:
// file, line and message (format rules).
func TestParseErrorClasses(t *testing.T) {
	cases := []struct{ class, src, want string }{
		{"syntax", "[inputs]\nchi = 300\nmach = 1.5 2\n",
			"bad.toml:3: invalid TOML: expected the end of the line, found U+0032 '2'"},
		{"wrong type", "[inputs]\nchi = \"300\"\n",
			"bad.toml:2: chi must be a number, not a string"},
		{"unknown key", "[inputs]\nchi = 300\nmahc = 2\n",
			`bad.toml:3: unknown key "mahc" (did you mean "mach"?)`},
		{"unknown table", "[input]\nchi = 3\n",
			`bad.toml:1: unknown table [input] (did you mean "inputs"?)`},
		{"duplicate key", "[inputs]\nchi = 300\nmach = 2\nchi = 400\n",
			`bad.toml:4: invalid TOML: duplicate key "chi" (first defined on line 2)`},
		// Inline tables over several lines are TOML v1.1.0, which go-toml
		// reads; it names the line of "inputs", this package the duplicate's.
		{"duplicate key, multi-line inline table", "inputs = {\n  chi = 300,\n  chi = 400,\n}\n",
			`bad.toml:3: invalid TOML: duplicate key "chi" (first defined on line 2)`},
		{"table defined twice", "[inputs]\nchi = 300\n[cooling]\n[inputs]\n",
			"bad.toml:4: invalid TOML: table [inputs] is already defined (first defined on line 1)"},
		{"size limit", strings.Repeat("#", MaxInputSize) + "\n",
			"bad.toml: input too large: more than 1048576 bytes"},
		{"date value", "[scenario]\nname = 1979-05-27\n",
			"bad.toml:2: name must be a string, not a local date (put it in quotes)"},
		{"date-time value", "[inputs]\n\nchi = 1979-05-27T07:32:00Z\n",
			"bad.toml:3: chi must be a number, not an offset date-time"},
		{"semantic check", "[conventions]\nchi = 300\n",
			`bad.toml:2: key "chi" belongs in [inputs], not [conventions]`},
		{"validate", "[inputs]\nmach = 1\nchi = 1\n",
			"bad.toml:3: chi: must be greater than 1 (got 1)"},
	}
	for _, c := range cases {
		_, err := Parse(strings.NewReader(c.src), "bad.toml")
		if err == nil || err.Error() != c.want {
			t.Errorf("%s: error %v, want %q", c.class, err, c.want)
		}
	}
}

// countLines returns the number of lines in data, counting a final line
// without a line ending.
func countLines(data []byte) int { return bytes.Count(data, []byte("\n")) + 1 }

// fuzzSeeds returns inputs in every form the reader handles.
func fuzzSeeds() []string {
	seeds := []string{
		exampleCriteriaFile,
		plainScenario,
		plainCriteria,
		"[a]\nx = [1, 'b', \"c\", true, 1.5e3, 0x1f, inf, [2, [3]], {y = 4}]\n[[a.b]]\n[a.b.c]\n",
		"a.b.c = 1\na.b.d = {e = [{f = 1}, {f = 2}]}\n[a.x]\n'q.k' = \"\"\"\nml\\\n  x\"\"\"\n",
		"d = 1979-05-27T07:32:00Z\nt = 07:32\nl = '''\nx'''\n",
		"t = {\n a = 1,\n b = {c = 2},\n}\n",
	}
	for _, c := range badTOMLCases() {
		seeds = append(seeds, c.src)
	}
	for _, c := range badCriteriaCases() {
		seeds = append(seeds, c.src)
	}
	return seeds
}

func FuzzParseTOML(f *testing.F) {
	for _, s := range fuzzSeeds() {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		doc, err := ParseTOML(bytes.NewReader(data))
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %v (%T) is not a *ParseError", err, err)
			}
			if errors.Is(err, errInternal) {
				t.Fatalf("go-toml failed: %v", err)
			}
			if pe.Line < 0 || pe.Line > countLines(data) || pe.Line == 0 && len(data) <= MaxInputSize {
				t.Fatalf("error line %d outside 1..%d: %v", pe.Line, countLines(data), err)
			}
			if msg := err.Error(); strings.ContainsAny(msg, "\n\r\x1b") {
				t.Fatalf("error %q is not one safe line", msg)
			}
			return
		}
		if doc == nil || doc.Root == nil {
			t.Fatal("no error and no document")
		}
		checkLines(t, doc.Root, countLines(data))
	})
}

// checkLines asserts that every line number in tab lies in 1..n.
func checkLines(t *testing.T, tab *Table, n int) {
	t.Helper()
	var check func(k string, v Value)
	check = func(k string, v Value) {
		if v.Line < 1 || v.Line > n {
			t.Fatalf("value %q on line %d, outside 1..%d", k, v.Line, n)
		}
		for _, e := range v.Array {
			check(k, e)
		}
		if v.Kind == KindTable {
			checkLines(t, v.Table, n)
		}
	}
	for k, v := range tab.Values {
		check(k, v)
	}
	if len(tab.Keys) != len(tab.Values) {
		t.Fatalf("table %q: %d keys but %d values", tab.Name, len(tab.Keys), len(tab.Values))
	}
	for _, s := range tab.Tables {
		if s.Line < 1 || s.Line > n {
			t.Fatalf("table %q on line %d, outside 1..%d", s.Name, s.Line, n)
		}
		checkLines(t, s, n)
	}
	for _, arr := range tab.Arrays {
		for _, s := range arr {
			checkLines(t, s, n)
		}
	}
}
