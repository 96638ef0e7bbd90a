package render

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"plumb/internal/suggest"
)

// Order says how categories are arranged.
type Order string

// Category orders. The zero Order is ByValue: largest first, which puts the
// comparison the reader wants to make next to each other (common practice).
const (
	ByValue Order = "value" // largest first
	ByLabel Order = "label" // alphabetical, numbers inside labels in numeric order
	ByData  Order = "data"  // as given: time, ranks, ordinal scales
)

// DefaultTop is how many categories a chart of parts of a whole shows
// before combining the smallest into one Other bar. About a dozen labelled
// rows still read at a glance on a page (common practice).
const DefaultTop = 12

// OtherMode says whether and how categories beyond Top are combined into
// one "Other (k)" row.
type OtherMode string

// Other modes. The zero OtherMode is OtherAuto.
const (
	// OtherAuto sums the rest into Other only when the values are parts of
	// a whole (Percent or Additive); otherwise it draws every category, or
	// with an explicit Top the largest ones, saying how many were left out.
	// A sum of medians or rates is no quantity at all, and one such Other
	// bar squashes every real bar.
	OtherAuto OtherMode = ""
	OtherSum  OtherMode = "sum"  // combine the rest by their sum: counts, amounts
	OtherMean OtherMode = "mean" // combine the rest by their mean
	OtherNone OtherMode = "none" // never combine: draw all, or leave the rest out with a note
)

// DefaultDotsTop is the same limit for dot plots. A dot needs one line of
// text, not a bar's thickness, and a dot plot stays readable with a few
// dozen rows (common practice), so fewer categories are folded away.
const DefaultDotsTop = 25

// row is one category as drawn.
type row struct {
	label     string
	value     float64 // the plotted value (a share when drawing percentages)
	raw       float64 // the value as given
	highlight bool
	other     int    // > 0: this row combines that many categories
	short     string // the label as drawn when it takes a standard short form ("Jan")
}

// checkRows validates parallel label and value slices.
func checkRows(labels []string, values []float64) error {
	if len(labels) != len(values) {
		return fmt.Errorf("%d labels but %d values: give one label per value", len(labels), len(values))
	}
	if len(values) == 0 {
		return fmt.Errorf("no values to draw")
	}
	for i, v := range values {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return fmt.Errorf("value %d (%q) is %v: give finite numbers, or leave the row out", i+1, labels[i], v)
		}
	}
	return nil
}

// arrange orders rows and reports a note when it chose the order for the user.
func arrange(rows []row, order Order) error {
	switch order {
	case ByValue, "":
		slices.SortStableFunc(rows, func(a, b row) int {
			if c := cmp.Compare(b.value, a.value); c != 0 {
				return c
			}
			return naturalCompare(a.label, b.label)
		})
	case ByLabel:
		slices.SortStableFunc(rows, func(a, b row) int { return naturalCompare(a.label, b.label) })
	case ByData:
	default:
		return fmt.Errorf("unknown order %q: use value, label or data", string(order))
	}
	return nil
}

// keepLargest returns which rows to keep when only top may be drawn: the
// highlighted rows (what the reader was asked to find) and then the largest.
func keepLargest(rows []row, top int) []bool {
	idx := make([]int, len(rows))
	for i := range idx {
		idx[i] = i
	}
	slices.SortStableFunc(idx, func(a, b int) int {
		if c := cmp.Compare(rows[b].value, rows[a].value); c != 0 {
			return c
		}
		return naturalCompare(rows[a].label, rows[b].label)
	})
	keep := make([]bool, len(rows))
	kept := 0
	for i, r := range rows {
		if r.highlight {
			keep[i] = true
			kept++
		}
	}
	for _, i := range idx {
		if kept >= top {
			break
		}
		if !keep[i] {
			keep[i] = true
			kept++
		}
	}
	return keep
}

// leaveOut keeps the top largest rows (and every highlighted one) in their
// display order and returns them with the labels of the rows left out.
func leaveOut(rows []row, top int) ([]row, []string) {
	if top < 1 || len(rows) <= top {
		return rows, nil
	}
	keep := keepLargest(rows, top)
	var out []row
	var gone []string
	for i, r := range rows {
		if keep[i] {
			out = append(out, r)
		} else {
			gone = append(gone, r.label)
		}
	}
	return out, gone
}

// combineTail keeps the top-1 rows by value and folds the rest into one
// Other row placed last. sum says whether values add up (sums, counts);
// otherwise Other shows the mean of the combined values. Rows must already be
// in display order; the kept rows keep that order.
func combineTail(rows []row, top int, sum bool) ([]row, string) {
	if top < 2 || len(rows) <= top {
		return rows, ""
	}
	// Highlighted rows are what the reader was asked to find: they are never
	// folded away, and take their place among the top-1 kept rows.
	keep := keepLargest(rows, top-1)
	var out []row
	other := row{}
	var names []string
	for i, r := range rows {
		if keep[i] {
			out = append(out, r)
			continue
		}
		other.value += r.value
		other.raw += r.raw
		other.other++
		names = append(names, r.label)
	}
	if other.other == 0 {
		return rows, ""
	}
	how := "summed"
	if !sum {
		other.value /= float64(other.other)
		other.raw /= float64(other.other)
		how = "averaged"
	}
	other.label = fmt.Sprintf("Other (%d)", other.other)
	out = append(out, other)
	return out, fmt.Sprintf("combined the %d smallest of %d categories into %q (%s): %s",
		other.other, len(rows), other.label, how, listNames(names, 6))
}

func listNames(names []string, max int) string {
	q := make([]string, 0, max+1)
	for i, n := range names {
		if i == max {
			q = append(q, fmt.Sprintf("and %d more", len(names)-max))
			break
		}
		q = append(q, strconv.Quote(n))
	}
	return strings.Join(q, ", ")
}

// naturalCompare orders labels as a reader expects: case-insensitively, with
// runs of digits compared by their numeric value ("Route 9" before "Route 10").
func naturalCompare(a, b string) int {
	if c := naturalFold(a, b); c != 0 {
		return c
	}
	return strings.Compare(a, b) // a total order: "a" and "A" still differ
}

func naturalFold(a, b string) int {
	for a != "" && b != "" {
		da, db := digitRun(a), digitRun(b)
		if da > 0 && db > 0 {
			na, nb := strings.TrimLeft(a[:da], "0"), strings.TrimLeft(b[:db], "0")
			if c := cmp.Compare(len(na), len(nb)); c != 0 {
				return c
			}
			if c := strings.Compare(na, nb); c != 0 {
				return c
			}
			a, b = a[da:], b[db:]
			continue
		}
		ra, na := utf8.DecodeRuneInString(a)
		rb, nb := utf8.DecodeRuneInString(b)
		if c := cmp.Compare(unicode.ToLower(ra), unicode.ToLower(rb)); c != 0 {
			return c
		}
		a, b = a[na:], b[nb:]
	}
	if c := cmp.Compare(len(a), len(b)); c != 0 {
		return c
	}
	return strings.Compare(a, b)
}

func digitRun(s string) int {
	n := 0
	for n < len(s) && s[n] >= '0' && s[n] <= '9' {
		n++
	}
	return n
}

// findLabels reports the requested labels that are not among the rows, each
// with the closest existing label, so a typo is caught instead of ignored.
func findLabels(want []string, have []string) error {
	set := make(map[string]bool, len(have))
	for _, h := range have {
		set[h] = true
	}
	for _, w := range want {
		if !set[w] {
			return fmt.Errorf("no category %q to highlight%s", w, closest(w, have))
		}
	}
	return nil
}

// closest suggests the nearest of the candidates, as "; did you mean ...?".
func closest(s string, cands []string) string {
	if best, ok := suggest.Closest(s, cands); ok {
		return fmt.Sprintf("; did you mean %q?", best)
	}
	return ""
}

// dataNumber formats a value for a data-* attribute: the shortest text that
// reads back as the same float64, so audits measure against exact data.
func dataNumber(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
