package report

import (
	"strings"
	"testing"
	"unicode/utf8"
)

// Layout rules of this package (no published source): lines never exceed
// the width, words stay whole unless longer than a line, nothing is lost.

func TestWrap(t *testing.T) {
	text := "the wind's cooling time t_cool,hot is shorter than the planned run: the background would cool catastrophically"
	lines := Wrap(text, 40, "  ! ", "    ")
	for _, l := range lines {
		if n := utf8.RuneCountInString(l); n > 40 {
			t.Errorf("Wrap: line %q has %d runes, want ≤ 40", l, n)
		}
	}
	if !strings.HasPrefix(lines[0], "  ! the") || !strings.HasPrefix(lines[1], "    ") {
		t.Errorf("Wrap prefixes: %q", lines)
	}
	if got := strings.Join(strings.Fields(strings.Join(lines, " ")), " "); got != "! "+text {
		t.Errorf("Wrap lost words: %q", got)
	}
	long := Wrap(strings.Repeat("x", 25), 10, "", "")
	if len(long) != 3 || long[0] != strings.Repeat("x", 10) || long[2] != "xxxxx" {
		t.Errorf("Wrap(25 x, 10) = %q", long)
	}
	if got := Wrap("", 10, "> ", ""); len(got) != 1 || got[0] != "> " {
		t.Errorf("Wrap(empty) = %q", got)
	}
}

func TestTableFitsWidth(t *testing.T) {
	tb := Table{Width: 60, Indent: "  ", Wrap: []bool{false, false, true}}
	tb.Row("α_v", "1", "value from memory — check the paper; the form v_mix ∝ c_s,cl (t_cool/t_sc,cl)^-1/4 is confirmed")
	tb.Row("κ", "4", "short")
	out := tb.String()
	for _, l := range strings.Split(strings.TrimSuffix(out, "\n"), "\n") {
		if n := utf8.RuneCountInString(l); n > 60 {
			t.Errorf("Table line %q has %d runes, want ≤ 60", l, n)
		}
	}
	if !strings.Contains(out, "  κ    4  short\n") {
		t.Errorf("Table columns not aligned:\n%s", out)
	}
	if got := strings.Join(strings.Fields(out), " "); !strings.Contains(got, "^-1/4 is confirmed") {
		t.Errorf("Table lost text:\n%s", out)
	}
}
