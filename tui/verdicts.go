package tui

import "cloudwind/model"

// Verdicts as people read them: a glyph and a word for each of the three
// (survives ✓, transformed ◐, destroyed ✗; [ok], (~) and [x] in ASCII),
// never colour alone, and a question mark when the verdict depends on an
// unverified constant (model.Outcome.DependsOnConstant).

// verdictGlyph is the one-glyph verdict of compact cells.
func verdictGlyph(st *Styles, v model.Verdict) string {
	switch {
	case v == model.Survives:
		return st.T("✓")
	case v == model.Transformed && st.ASCII:
		return "(~)"
	case v == model.Transformed:
		return "◐"
	}
	return st.T("✗")
}

// verdictStyle renders s in the style of verdict v.
func verdictStyle(st *Styles, v model.Verdict, s string) string {
	switch v {
	case model.Survives:
		return st.Survives.Render(s)
	case model.Transformed:
		return st.Transformed.Render(s)
	}
	return st.Destroyed.Render(s)
}

// verdictText is the verdict as glyph and word: short ("✓ grows",
// "◐ transf.", "✗ dest.") or long ("✓ survives", "◐ transformed",
// "✗ destroyed"). When depends is set the verdict rests on the
// unverified constant: "✗? dep." short, "✗? depends on α" long.
func verdictText(st *Styles, v model.Verdict, short, depends bool) string {
	g := verdictGlyph(st, v)
	var word string
	switch {
	case depends && short:
		word = "? dep."
	case depends:
		word = st.T("? depends on α")
	case short:
		word = map[model.Verdict]string{model.Survives: " grows", model.Transformed: " transf.", model.Destroyed: " dest."}[v]
	default:
		word = " " + verdictWord(v)
	}
	return verdictStyle(st, v, g+word)
}

// verdictWord is the verdict in words: "survives", "transformed",
// "destroyed".
func verdictWord(v model.Verdict) string {
	switch v {
	case model.Survives:
		return "survives"
	case model.Transformed:
		return "transformed"
	}
	return "destroyed"
}
