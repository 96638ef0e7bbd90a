// Package suggest finds the name a user most likely meant, so that an error
// about a misspelt column or label can offer the fix.
package suggest

import (
	"math"
	"strings"
	"unicode/utf8"
)

// Closest returns the candidate nearest to s by Levenshtein edit distance,
// compared case-insensitively, and whether it is near enough to suggest:
// fewer edits than half the length of the longer of the two. Empty
// candidates are skipped; ties go to the earlier candidate.
func Closest(s string, candidates []string) (string, bool) {
	ls := []rune(strings.ToLower(s))
	best, bestD := "", math.MaxInt
	for _, c := range candidates {
		if c == "" {
			continue
		}
		if d := Distance(ls, []rune(strings.ToLower(c))); d < bestD {
			best, bestD = c, d
		}
	}
	n := max(len(ls), utf8.RuneCountInString(best))
	if best == "" || bestD*2 >= n {
		return "", false
	}
	return best, true
}

// Distance is the Levenshtein edit distance between a and b: the fewest
// single-rune insertions, deletions and substitutions that turn one into
// the other (Levenshtein 1966), by the two-row dynamic programme.
func Distance(a, b []rune) int {
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(b)]
}
