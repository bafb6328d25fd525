// Package suggest finds the word a user probably meant when they typed a
// name that does not exist: a flag, a key of a configuration file, a
// cooling-function name. It is shared by the command line, the
// configuration reader and the interface, so that one typo gets one answer
// everywhere.
package suggest

import (
	"strings"
	"unicode/utf8"
)

// maxWordRunes bounds the words that are compared, so that a long garbage
// token costs nothing.
const maxWordRunes = 64

// Closest returns the candidate nearest to word, compared without regard
// to case, when it is a likely typo: at most one edit away for words of
// fewer than six runes, two for longer ones, and fewer edits than word has
// runes. An edit is an insertion, a deletion, a substitution or a swap of
// neighbours (Distance). Ties go to the candidate first in byte order. The
// candidate is returned as given; "" means none is close.
func Closest(word string, candidates []string) string {
	n := utf8.RuneCountInString(word)
	if n == 0 || n > maxWordRunes {
		return ""
	}
	limit := 1
	if n >= 6 {
		limit = 2
	}
	lw := strings.ToLower(word)
	best, bestD := "", limit+1
	for _, c := range candidates {
		d := Distance(lw, strings.ToLower(c))
		if d < bestD || (d == bestD && c < best) {
			best, bestD = c, d
		}
	}
	if bestD > limit || bestD >= n {
		return ""
	}
	return best
}

// Distance returns the optimal-string-alignment distance of a and b, in
// runes: insertions, deletions, substitutions and swaps of neighbours each
// cost 1, and no substring is edited twice.
func Distance(a, b string) int {
	s, t := []rune(a), []rune(b)
	rows := [3][]int{make([]int, len(t)+1), make([]int, len(t)+1), make([]int, len(t)+1)}
	for j := range rows[1] {
		rows[1][j] = j
	}
	for i := 1; i <= len(s); i++ {
		prev2, prev, cur := rows[0], rows[1], rows[2]
		cur[0] = i
		for j := 1; j <= len(t); j++ {
			cost := 1
			if s[i-1] == t[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
			if i > 1 && j > 1 && s[i-1] == t[j-2] && s[i-2] == t[j-1] {
				cur[j] = min(cur[j], prev2[j-2]+1)
			}
		}
		rows[0], rows[1], rows[2] = prev, cur, prev2
	}
	return rows[1][len(t)]
}
