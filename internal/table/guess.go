package table

import (
	"slices"
	"unicode/utf8"
)

// NumericColumns is the one column guesser every chart uses. It returns, in
// header order, up to n columns (0 means all) that read as numbers, leaving
// out the key column (labels or x) and the columns in skip; with afterKey
// only columns to the right of the key count. When no column qualifies it
// returns the error of the first candidate that failed (a bad cell in the
// column the user most likely meant), or nil, nil when there was none.
func (t *Table) NumericColumns(key string, skip []string, n int, afterKey bool) ([]string, error) {
	var out []string
	var first error
	keyAt := slices.Index(t.Header, key)
	for i, h := range t.Header {
		if h == "" || h == key || slices.Contains(skip, h) || (afterKey && i < keyAt) || t.column(h) == nil {
			continue
		}
		if _, err := t.ReadNumbers(h); err != nil {
			if first == nil {
				first = err
			}
			continue
		}
		out = append(out, h)
		if n > 0 && len(out) == n {
			break
		}
	}
	if len(out) == 0 {
		return nil, first
	}
	return out, nil
}

// ShortenLabels shortens labels longer than max characters (0 means
// DefaultMaxLabel) to max-1 characters and an ellipsis, in place, and
// returns how many it shortened, so that a runaway cell cannot make a
// figure of hundreds of megabytes.
func ShortenLabels(labels []string, max int) int {
	if max <= 0 {
		max = DefaultMaxLabel
	}
	n := 0
	for i, l := range labels {
		if len(l) <= max || utf8.RuneCountInString(l) <= max {
			continue
		}
		cut, k := 0, 0
		for j := range l {
			if k == max-1 {
				cut = j
				break
			}
			k++
		}
		labels[i] = l[:cut] + "…"
		n++
	}
	return n
}
