package safetext

import (
	"encoding/json"
	"strings"
	"testing"
	"unicode/utf8"
)

// The characters tested are named by the Unicode Standard (general category
// Cc for controls, Cf for format characters such as U+00AD SOFT HYPHEN and
// U+202E RIGHT-TO-LEFT OVERRIDE; U+2028 LINE SEPARATOR) and by ECMA-48 for
// ESC, CSI and OSC sequences; what counts as unsafe is this package's rule.

func TestTerminal(t *testing.T) {
	for in, want := range map[string]string{
		"plain text, χ and M☉":              "plain text, χ and M☉",
		"a\x1b]0;retitled\x07b":             "a]0;retitledb", // OSC: ESC and BEL removed, the rest is inert text
		"\x1b[2Jcleared":                    "[2Jcleared",    // CSI erase display
		"tab\there":                         "tab here",
		"soft\u00adhyphen":                  "softhyphen",
		"bidi \u202eesrever\u202c":          "bidi esrever",
		"isolate \u2066x\u2069":             "isolate x",
		"zero\u200bwidth \ufeffbom":         "zerowidth bom",
		"line\u2028sep\u2029para":           "lineseppara",
		"c1 \u009b31m":                      "c1 31m",
		"bad \xff\xfe utf8":                 "bad  utf8",
		"private \ue000 use":                "private  use",
		"newline\nand\rcarriage":            "newlineandcarriage",
		"emoji 😀 and CJK 雲":                 "emoji 😀 and CJK 雲",
		strings.Repeat("x", 5) + "\x00\x7f": "xxxxx",
	} {
		if got := Terminal(in); got != want {
			t.Errorf("Terminal(%q) = %q, want %q", in, got, want)
		}
	}
}

func TestClipAndLine(t *testing.T) {
	if got := Clip("abcdefghij", 5); got != "abcd…" {
		t.Errorf("Clip = %q, want abcd…", got)
	}
	if got := Clip("χχ\x1b", 5); got != "χχ" {
		t.Errorf("Clip = %q, want χχ", got)
	}
	if got := Line("one\n  two\tthree \x1b[1m"); got != "one two three [1m" {
		t.Errorf("Line = %q", got)
	}
}

// TestJSONKeepsTrueString: escaped JSON decodes to the original string,
// and holds no unsafe rune raw.
func TestJSONKeepsTrueString(t *testing.T) {
	for _, s := range []string{"plain", "a\u202eb", "soft\u00adhyphen", "esc\x1b[31m", "tab\tnl\n", `quote" back\`, "astral \U000E0001 tag", "bad \xff"} {
		lit := AppendJSON(nil, s)
		var back string
		if err := json.Unmarshal(lit, &back); err != nil {
			t.Errorf("AppendJSON(%q) = %s: not JSON: %v", s, lit, err)
			continue
		}
		want := strings.ToValidUTF8(s, "\ufffd")
		if back != want {
			t.Errorf("AppendJSON(%q) decodes to %q, want %q", s, back, want)
		}
		assertNoUnsafe(t, "AppendJSON", lit)
		enc, _ := json.Marshal(map[string]string{"k": s})
		esc := EscapeJSON(enc)
		var m map[string]string
		if err := json.Unmarshal(esc, &m); err != nil || m["k"] != want {
			t.Errorf("EscapeJSON(%s) = %s decodes to %q (%v), want %q", enc, esc, m["k"], err, want)
		}
		assertNoUnsafe(t, "EscapeJSON", esc)
	}
}

func assertNoUnsafe(t *testing.T, fn string, b []byte) {
	t.Helper()
	for _, r := range string(b) {
		if r != '\t' && (Unsafe(r) || r < 0x20) {
			t.Errorf("%s output %q holds raw %U", fn, b, r)
		}
	}
}

func FuzzTerminal(f *testing.F) {
	for _, s := range []string{"", "a\x1b[2J", "\u202e", "\xff", "χ"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		out := Terminal(s)
		if !utf8.ValidString(out) {
			t.Fatalf("Terminal(%q) = %q is not valid UTF-8", s, out)
		}
		for _, r := range out {
			if Unsafe(r) || r == '\t' {
				t.Fatalf("Terminal(%q) = %q keeps %U", s, out, r)
			}
		}
		var back string
		var want string
		enc, _ := json.Marshal(s) // encoding/json's reading of invalid UTF-8: one U+FFFD per bad byte
		json.Unmarshal(enc, &want)
		if err := json.Unmarshal(AppendJSON(nil, s), &back); err != nil || back != want {
			t.Fatalf("AppendJSON(%q) round trip: %q, %v", s, back, err)
		}
	})
}
