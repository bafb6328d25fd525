// Package safetext makes text from outside the program safe to show: file
// contents, file names and flag values pass through Terminal before they
// reach a terminal, and through JSON escaping before they reach a JSON
// document. It is the one sanitiser of cloudwind; every boundary where
// outside text enters uses it.
package safetext

import (
	"strings"
	"unicode"
	"unicode/utf8"
)

// Unsafe reports whether r may act on a terminal or disguise text: C0 and C1
// control characters (ESC, BEL, CSI, …) other than tab, the Unicode format
// characters (category Cf: soft hyphen U+00AD, zero-width and joiner
// characters, the bidirectional embeddings, overrides and isolates
// U+202A–U+202E and U+2066–U+2069), the line and paragraph separators
// U+2028 and U+2029, the replacement character that stands for invalid
// UTF-8, and noncharacters and private-use code points.
func Unsafe(r rune) bool {
	switch {
	case r == '\t':
		return false
	case r == utf8.RuneError:
		return true
	case unicode.IsControl(r), unicode.Is(unicode.Cf, r):
		return true
	case r == 0x2028 || r == 0x2029:
		return true
	case unicode.Is(unicode.Co, r), unicode.Is(unicode.Noncharacter_Code_Point, r):
		return true
	}
	return false
}

// Terminal returns s with every unsafe rune (Unsafe) and every byte of
// invalid UTF-8 removed and tabs turned into spaces, so that the text cannot
// move the cursor, retitle or clear the terminal, reorder what is shown or
// change its width unseen.
func Terminal(s string) string {
	if isClean(s) {
		return s
	}
	var b strings.Builder
	b.Grow(len(s))
	for i := 0; i < len(s); {
		r, n := utf8.DecodeRuneInString(s[i:])
		i += n
		switch {
		case r == '\t':
			b.WriteByte(' ')
		case Unsafe(r):
		default:
			b.WriteRune(r)
		}
	}
	return b.String()
}

// isClean reports whether Terminal would return s unchanged.
func isClean(s string) bool {
	for i := 0; i < len(s); i++ {
		if c := s[i]; c < 0x20 || c >= 0x7f {
			return isCleanSlow(s)
		}
	}
	return true
}

func isCleanSlow(s string) bool {
	for _, r := range s {
		if r == '\t' || Unsafe(r) {
			return false
		}
	}
	return true
}

// Clip returns Terminal(s) shortened to at most n runes, the last being
// "…" when anything was cut. It is meant for text quoted back in messages.
func Clip(s string, n int) string {
	s = Terminal(s)
	if n < 1 {
		n = 1
	}
	if utf8.RuneCountInString(s) <= n {
		return s
	}
	r := []rune(s)
	return string(r[:n-1]) + "…"
}

// Line returns Terminal(s) with every run of whitespace, line breaks
// included, folded into one space, so that a message prints as one line.
func Line(s string) string {
	return strings.Join(strings.Fields(Terminal(strings.ReplaceAll(s, "\n", " "))), " ")
}

// AppendJSON appends s as a JSON string literal that keeps the true text
// but writes every unsafe rune (Unsafe) as a \uXXXX escape (a pair of
// surrogate escapes above U+FFFF), as well as '"', '\\' and the characters
// JSON requires escaped; invalid UTF-8 becomes \ufffd. A reader decodes the
// same string; a terminal showing the raw document is not affected. The
// result is also a valid YAML double-quoted scalar.
func AppendJSON(b []byte, s string) []byte {
	b = append(b, '"')
	for i := 0; i < len(s); {
		r, n := utf8.DecodeRuneInString(s[i:])
		if r == utf8.RuneError && n == 1 {
			b = appendEscape(b, utf8.RuneError)
			i++
			continue
		}
		i += n
		switch {
		case r == '"':
			b = append(b, '\\', '"')
		case r == '\\':
			b = append(b, '\\', '\\')
		case r == '\n':
			b = append(b, '\\', 'n')
		case r == '\r':
			b = append(b, '\\', 'r')
		case r == '\t':
			b = append(b, '\\', 't')
		case r < 0x20 || Unsafe(r):
			b = appendEscape(b, r)
		default:
			b = append(b, s[i-n:i]...)
		}
	}
	return append(b, '"')
}

// EscapeJSON returns the JSON text b with every unsafe rune (Unsafe) that
// encoding/json leaves raw written as a \uXXXX escape (surrogate pairs above
// U+FFFF). In JSON text non-ASCII runes occur only inside strings, so the
// document decodes to the same values; printed raw on a terminal it can no
// longer reorder or hide text. b is returned unchanged when it holds no
// such rune.
func EscapeJSON(b []byte) []byte {
	clean := true
	for i := 0; i < len(b); {
		if b[i] < 0x80 {
			i++
			continue
		}
		r, n := utf8.DecodeRune(b[i:])
		if Unsafe(r) {
			clean = false
			break
		}
		i += n
	}
	if clean {
		return b
	}
	out := make([]byte, 0, len(b)+16)
	for i := 0; i < len(b); {
		if b[i] < 0x80 {
			out = append(out, b[i])
			i++
			continue
		}
		r, n := utf8.DecodeRune(b[i:])
		if Unsafe(r) {
			out = appendEscape(out, r)
		} else {
			out = append(out, b[i:i+n]...)
		}
		i += n
	}
	return out
}

// appendEscape appends r as one \uXXXX escape, or a surrogate pair.
func appendEscape(b []byte, r rune) []byte {
	const hex = "0123456789abcdef"
	one := func(b []byte, r rune) []byte {
		return append(b, '\\', 'u', hex[r>>12&0xf], hex[r>>8&0xf], hex[r>>4&0xf], hex[r&0xf])
	}
	if r > 0xffff {
		r -= 0x10000
		return one(one(b, 0xd800+(r>>10)), 0xdc00+(r&0x3ff))
	}
	return one(b, r)
}
