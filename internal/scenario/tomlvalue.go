package scenario

import (
	"errors"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"
)

// value reads the value that starts at the current position.
func (p *parser) value(inArray bool) (Value, error) {
	line := p.line
	if p.values++; p.values > MaxValues {
		return Value{}, errAt(line, "%w: more than %d values", ErrTooLarge, MaxValues)
	}
	rest := p.src[p.pos:]
	switch {
	case strings.HasPrefix(rest, `"""`), strings.HasPrefix(rest, `'''`):
		return Value{}, errAt(line, "multi-line strings are %w", ErrUnsupported)
	case strings.HasPrefix(rest, `"`):
		s, err := p.basicString()
		return Value{Kind: KindString, Str: s, Line: line}, err
	case strings.HasPrefix(rest, `'`):
		s, err := p.literalString()
		return Value{Kind: KindString, Str: s, Line: line}, err
	case strings.HasPrefix(rest, "{"):
		return Value{}, errAt(line, "inline tables are %w; use a [table] header", ErrUnsupported)
	case strings.HasPrefix(rest, "[") && inArray:
		return Value{}, errAt(line, "nested arrays are %w", ErrUnsupported)
	case strings.HasPrefix(rest, "["):
		return p.array()
	}
	start := p.pos
	for !p.eof() && isTokenChar(p.src[p.pos]) {
		p.pos++
	}
	if p.pos == start {
		return Value{}, errAt(line, "expected a value, found %s", p.found())
	}
	return parseScalar(p.src[start:p.pos], line)
}

// isTokenChar reports whether c may appear in a boolean, number, date or
// time token.
func isTokenChar(c byte) bool {
	return isBareKeyChar(c) || c == '+' || c == '.' || c == ':'
}

// array reads a single- or multi-line array of scalars.
func (p *parser) array() (Value, error) {
	line := p.line
	p.pos++
	v := Value{Kind: KindArray, Line: line}
	for {
		p.skipBlank()
		if p.eof() {
			return Value{}, errAt(p.line, "the array opened on line %d is not closed", line)
		}
		if p.peek() == ']' {
			p.pos++
			return v, nil
		}
		elem, err := p.value(true)
		if err != nil {
			return Value{}, err
		}
		v.Array = append(v.Array, elem)
		p.skipBlank()
		switch p.peek() {
		case ',':
			p.pos++
		case ']':
			p.pos++
			return v, nil
		default:
			if p.eof() {
				return Value{}, errAt(p.line, "the array opened on line %d is not closed", line)
			}
			return Value{}, errAt(p.line, "expected ',' or ']' in the array, found %s", p.found())
		}
	}
}

// basicString reads a "..." string and decodes its escapes.
func (p *parser) basicString() (string, error) {
	p.pos++
	var b strings.Builder
	for {
		if p.eof() || p.src[p.pos] == '\n' || p.src[p.pos] == '\r' {
			return "", errAt(p.line, "unterminated string: expected '\"' before %s", p.found())
		}
		c := p.src[p.pos]
		if c == '"' {
			p.pos++
			return b.String(), nil
		}
		if c != '\\' {
			b.WriteByte(c) // the input is valid UTF-8, so bytes may be copied
			p.pos++
			continue
		}
		p.pos++
		if p.eof() {
			return "", errAt(p.line, "unterminated string: expected '\"' before the end of the file")
		}
		e := p.src[p.pos]
		p.pos++
		switch e {
		case '"', '\\':
			b.WriteByte(e)
		case 'n':
			b.WriteByte('\n')
		case 't':
			b.WriteByte('\t')
		case 'r':
			b.WriteByte('\r')
		case 'u', 'U':
			r, err := p.unicodeEscape(e)
			if err != nil {
				return "", err
			}
			b.WriteRune(r)
		case 'b', 'f', 'e', 'x':
			return "", errAt(p.line, "the escape \\%c is %w; use \\uXXXX", e, ErrUnsupported)
		case '\r', '\n':
			return "", errAt(p.line, "invalid escape: a backslash at the end of the line")
		default:
			r, _ := utf8.DecodeRuneInString(p.src[p.pos-1:])
			return "", errAt(p.line, "invalid escape \\%c in string", r)
		}
	}
}

// unicodeEscape reads the hex digits of \uXXXX (kind 'u') or \UXXXXXXXX.
func (p *parser) unicodeEscape(kind byte) (rune, error) {
	n := 4
	if kind == 'U' {
		n = 8
	}
	hex := p.src[p.pos:min(p.pos+n, len(p.src))]
	if len(hex) < n || strings.IndexFunc(hex, func(r rune) bool { return !isHex(r) }) >= 0 {
		return 0, errAt(p.line, "escape \\%c needs %d hex digits", kind, n)
	}
	p.pos += n
	u, err := strconv.ParseUint(hex, 16, 32)
	if err != nil || !utf8.ValidRune(rune(u)) {
		return 0, errAt(p.line, "escape \\%c%s is not a Unicode scalar value", kind, hex)
	}
	return rune(u), nil
}

// isHex reports whether r is a hexadecimal digit.
func isHex(r rune) bool {
	return r >= '0' && r <= '9' || r >= 'a' && r <= 'f' || r >= 'A' && r <= 'F'
}

// literalString reads a '...' string, which has no escapes.
func (p *parser) literalString() (string, error) {
	p.pos++
	end := strings.IndexAny(p.src[p.pos:], "'\r\n")
	if end < 0 || p.src[p.pos+end] != '\'' {
		if end < 0 {
			p.pos = len(p.src)
		} else {
			p.pos += end
		}
		return "", errAt(p.line, "unterminated string: expected \"'\" before %s", p.found())
	}
	s := p.src[p.pos : p.pos+end]
	p.pos += end + 1
	return s, nil
}

// parseScalar parses a boolean, integer or float token per TOML v1.0.0.
func parseScalar(tok string, line int) (Value, error) {
	switch tok {
	case "true", "false":
		return Value{Kind: KindBool, Bool: tok == "true", Line: line}, nil
	case "inf", "+inf":
		return Value{Kind: KindFloat, Num: math.Inf(1), Line: line}, nil
	case "-inf":
		return Value{Kind: KindFloat, Num: math.Inf(-1), Line: line}, nil
	case "nan", "+nan", "-nan":
		return Value{Kind: KindFloat, Num: math.NaN(), Line: line}, nil
	}
	if isDateTime(tok) {
		return Value{}, errAt(line, "dates and times are %w", ErrUnsupported)
	}
	if len(tok) > 2 && tok[0] == '0' && strings.ContainsRune("xob", rune(tok[1])) {
		return parsePrefixed(tok, line)
	}
	bad := func() (Value, error) {
		if c := tok[0]; c >= 'A' && c <= 'Z' || c >= 'a' && c <= 'z' {
			return Value{}, errAt(line, "invalid value %q (put strings in quotes)", clip(tok))
		}
		return Value{}, errAt(line, "invalid number %q", clip(tok))
	}
	i := 0
	if tok[0] == '+' || tok[0] == '-' {
		i++
	}
	intStart := i
	if !digits(tok, &i) {
		return bad()
	}
	if tok[intStart] == '0' && i-intStart > 1 {
		return Value{}, errAt(line, "invalid number %q: leading zeros are not allowed", clip(tok))
	}
	isFloat := false
	if i < len(tok) && tok[i] == '.' {
		i++
		if !digits(tok, &i) {
			return bad()
		}
		isFloat = true
	}
	if i < len(tok) && (tok[i] == 'e' || tok[i] == 'E') {
		i++
		if i < len(tok) && (tok[i] == '+' || tok[i] == '-') {
			i++
		}
		if !digits(tok, &i) {
			return bad()
		}
		isFloat = true
	}
	if i != len(tok) {
		return bad()
	}
	clean := strings.ReplaceAll(tok, "_", "")
	if !isFloat {
		n, err := strconv.ParseInt(clean, 10, 64)
		if err != nil {
			return Value{}, errAt(line, "integer %q does not fit in 64 bits", clip(tok))
		}
		return Value{Kind: KindInteger, Int: n, Num: float64(n), Line: line}, nil
	}
	f, err := strconv.ParseFloat(clean, 64)
	if err != nil {
		return Value{}, errAt(line, "float %q is out of range", clip(tok))
	}
	return Value{Kind: KindFloat, Num: f, Line: line}, nil
}

// digits advances *i over one or more digits with single underscores
// between them, and reports whether it found such a run.
func digits(s string, i *int) bool {
	start := *i
	for *i < len(s) {
		c := s[*i]
		if c >= '0' && c <= '9' {
			*i++
			continue
		}
		if c == '_' && *i > start && *i+1 < len(s) && s[*i+1] >= '0' && s[*i+1] <= '9' {
			*i++
			continue
		}
		break
	}
	return *i > start && s[*i-1] != '_'
}

// parsePrefixed parses 0x…, 0o… or 0b… integers, which take no sign.
func parsePrefixed(tok string, line int) (Value, error) {
	base := 16
	switch tok[1] {
	case 'o':
		base = 8
	case 'b':
		base = 2
	}
	body := tok[2:]
	ok := body[0] != '_' && body[len(body)-1] != '_' && !strings.Contains(body, "__") && !strings.ContainsAny(body, "+-")
	n, err := strconv.ParseInt(strings.ReplaceAll(body, "_", ""), base, 64)
	if ok && errors.Is(err, strconv.ErrRange) {
		return Value{}, errAt(line, "integer %q does not fit in 64 bits", clip(tok))
	}
	if !ok || err != nil {
		return Value{}, errAt(line, "invalid number %q", clip(tok))
	}
	return Value{Kind: KindInteger, Int: n, Num: float64(n), Line: line}, nil
}

// isDateTime reports whether tok starts like a TOML date (1979-05-27) or
// time (07:32).
func isDateTime(tok string) bool {
	d := func(s string) bool {
		for i := 0; i < len(s); i++ {
			if s[i] < '0' || s[i] > '9' {
				return false
			}
		}
		return true
	}
	if len(tok) >= 10 && d(tok[:4]) && tok[4] == '-' && d(tok[5:7]) && tok[7] == '-' && d(tok[8:10]) {
		return true
	}
	return len(tok) >= 5 && d(tok[:2]) && tok[2] == ':' && d(tok[3:5])
}
