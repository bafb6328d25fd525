package chart

import "strings"

// Fitting a legend into the rows a chart can spare. Curve names are
// criterion labels, several of them long ("Turbulent box (Gronke+ 2022;
// George+ 2025)"): when the entries do not fit, the names lose a
// trailing parenthesis first, then are cut with an ellipsis to the
// longest length that fits (not below minLegendText cells), so that every
// curve keeps an entry. Entries marked keep (bands, runs) are not cut.

// minLegendText is the shortest a curve name is cut to.
const minLegendText = 8

// fitLegend packs items into at most rows rows of w cells, shortening the
// names as above when needed; it returns the packed rows and the items as
// shortened. When even the shortest names do not fit it returns the
// packing of the shortest, which drawLegend ends with an ellipsis.
func fitLegend(items []legendItem, w, rows int, ascii bool) ([][]legendItem, []legendItem) {
	packed := packLegend(items, w)
	if len(packed) <= rows {
		return packed, items
	}
	short := append([]legendItem(nil), items...)
	longest := 0
	for i := range short {
		if !short[i].keep {
			short[i].text = dropParenthesis(short[i].text)
			longest = max(longest, len(short[i].text))
		}
	}
	if packed = packLegend(short, w); len(packed) <= rows {
		return packed, short
	}
	cut := make([]legendItem, len(short))
	for n := longest - 1; n >= minLegendText; n-- {
		copy(cut, short)
		for i := range cut {
			if !cut[i].keep {
				cut[i].text = clipRunes(cut[i].text, n, ascii)
			}
		}
		if packed = packLegend(cut, w); len(packed) <= rows {
			return packed, cut
		}
	}
	return packed, cut
}

// dropParenthesis removes a trailing " (…)" from a name that has text
// before it: "Tan, Oh & Gronke 2023 (infall)" → "Tan, Oh & Gronke 2023".
func dropParenthesis(rs []rune) []rune {
	s := string(rs)
	if !strings.HasSuffix(s, ")") {
		return rs
	}
	if i := strings.LastIndex(s, " ("); i > 0 {
		return []rune(s[:i])
	}
	return rs
}

// flatten returns the items of packed rows in order.
func flatten(rows [][]legendItem) []legendItem {
	var out []legendItem
	for _, r := range rows {
		out = append(out, r...)
	}
	return out
}
