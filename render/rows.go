package render

import (
	"cmp"
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"plumb/scale"
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
	// series are the category's value in each series (SeriesBars,
	// SeriesDots), NaN where it has none; value is then the key the
	// categories are ordered and folded by.
	series []float64
	seen   []int // the Other row: how many folded rows had a value in each series
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

// arrange orders bar and dot rows by their values, largest first
// (ByValue), by label, or as given.
func arrange(rows []row, order Order) error {
	return orderBy(rows, order, func(r row) float64 { return r.value }, func(r row) string { return r.label })
}

// orderBy orders the rows of any chart with one row per category: by key,
// largest first (ByValue, ties by label), by label in natural order, or
// as given (ByData).
func orderBy[T any](rows []T, o Order, key func(T) float64, label func(T) string) error {
	switch o {
	case ByValue, "":
		slices.SortStableFunc(rows, func(a, b T) int {
			if c := cmp.Compare(key(b), key(a)); c != 0 {
				return c
			}
			return naturalCompare(label(a), label(b))
		})
	case ByLabel:
		slices.SortStableFunc(rows, func(a, b T) int { return naturalCompare(label(a), label(b)) })
	case ByData:
	default:
		return &OptionError{Option: "Order", Value: string(o), Err: fmt.Errorf("use %s, %s or %s", ByValue, ByLabel, ByData)}
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
		foldSeries(&other, r)
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
	meanSeries(&other, sum)
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

// limitRows applies Top and Other: it folds the rows beyond Top into one
// Other row when that is honest, or leaves them out and says so in a note
// and under the chart, never silently.
func (c *rowChart) limitRows() error {
	f := c.f
	switch c.opt.Other {
	case OtherAuto, OtherNone, OtherMean:
	case OtherSum:
		if c.dots {
			return &OptionError{Option: "Other", Value: string(OtherSum), Err: fmt.Errorf("a dot marks a position, not an amount, so dots are never summed; use %s mean or none, or draw bars", c.opt.name("Other"))}
		}
	default:
		return &OptionError{Option: "Other", Value: strconv.Quote(string(c.opt.Other)), Err: errors.New("use sum, mean or none")}
	}
	top := c.opt.Top
	if top > 0 && top < 2 {
		return &OptionError{Option: "Top", Value: strconv.Itoa(top), Err: errors.New("show at least 2 categories")}
	}
	fold := c.opt.Other == OtherSum || c.opt.Other == OtherMean || (c.opt.Other == OtherAuto && c.additive() && !c.dots)
	canvas := false // the fixed canvas, not the caller, limited the rows
	if top == 0 {
		switch {
		case c.dots:
			top = DefaultDotsTop
		case fold:
			top = DefaultTop
		default:
			top = c.rowsThatFit()
		}
		// A fixed canvas holds only so many rows: the rest go as above
		// rather than refusing the chart.
		if fit := c.rowsThatFit(); fit > 0 && top > fit {
			top, canvas = fit, true
		}
	}
	if top < 0 || len(c.rows) <= top {
		return nil
	}
	if fold {
		var note string
		c.rows, note = combineTail(c.rows, top, c.opt.Other == OtherSum || (c.opt.Other == OtherAuto && !c.opt.Averages))
		if note != "" {
			f.scene.Note("other", true, note+"; show more with "+c.opt.name("Top"))
		}
		return nil
	}
	n := len(c.rows)
	var gone []string
	c.rows, gone = leaveOut(c.rows, top)
	if len(gone) == 0 {
		return nil
	}
	why := "they are not parts of a whole, so a sum would mean nothing"
	if c.dots {
		why = "a dot is a position, so a sum would mean nothing"
	}
	combine := "sum or mean"
	if c.dots {
		combine = "mean" // a dot is never summed
	}
	more := fmt.Sprintf("show them all with %s -1, or combine them with %s %s", c.opt.name("Top"), c.opt.name("Other"), combine)
	if canvas {
		more = fmt.Sprintf("only these fit the canvas; give a taller canvas (%s), or combine the rest with %s mean", c.opt.name("Height"), c.opt.name("Other"))
	}
	f.scene.Note("left-out", true, fmt.Sprintf("drew the %d largest of %d categories and left out %d (not combined into Other; %s): %s; %s",
		len(c.rows), n, len(gone), why, listNames(gone, 6), more))
	f.addNote(fmt.Sprintf("%d of %d categories shown: the %d smallest are left out.", len(c.rows), n, len(gone)))
	return nil
}

// rowsThatFit is how many horizontal rows fit on a canvas of fixed height
// (the frame's note line for the rest included), or -1 when the chart
// grows with its rows. Vertical bars need no limit here: they refuse when
// their columns get too narrow.
func (c *rowChart) rowsThatFit() int {
	f := c.f
	if c.opt.Vertical || f.fixedPlotBottom() == 0 {
		return -1
	}
	sp := f.spec
	lh := lineHeight(sp.text)
	axisH := sp.gap + lh + c.unitLineH(f.width-2*sp.pad)
	// The note line under the chart takes one small line when rows are left out.
	room := f.fixedPlotBottom() - lineHeight(sp.small) - axisH - f.plotTop()
	n := int(room / (lh + sp.gap/2))
	if n >= len(c.rows) {
		return -1
	}
	return max(n, 2)
}

// toShares turns values into percentages of their total.
func (c *rowChart) toShares() error {
	// Values near the largest float64 overflow their total to +Inf (and
	// every share to NaN): then sum them scaled by the largest.
	big, plain := 1.0, 0.0
	for _, r := range c.rows {
		plain += r.value
	}
	if math.IsInf(plain, 0) {
		for _, r := range c.rows {
			big = math.Max(big, math.Abs(r.value))
		}
	}
	total := 0.0
	for _, r := range c.rows {
		if r.value < 0 {
			return &RefusalError{
				Reason:  fmt.Sprintf("cannot show %q as a share of a total: it is negative", r.label),
				Instead: "shares need values of one sign; drop " + c.opt.name("Percent") + " to draw the values themselves",
			}
		}
		total += r.value / big
	}
	if total == 0 {
		return &RefusalError{Reason: "cannot show shares: the values add up to zero", Instead: "drop " + c.opt.name("Percent")}
	}
	for i := range c.rows {
		share := 100 * (c.rows[i].value / big) / total
		if math.IsInf(share, 0) { // 100 * value overflowed
			share = 100 * (c.rows[i].value / big / total)
		}
		c.rows[i].value = share
	}
	total *= big
	c.opt.Unit = "%"
	totalText := scale.ValueFormat([]float64{total}, "").Format(total)
	if math.IsInf(total, 0) {
		totalText = fmt.Sprintf("more than %.1e", math.MaxFloat64)
	}
	c.f.scene.Note("percent", true, fmt.Sprintf("showing each value as a percentage of the total, %s", totalText))
	return nil
}

// domain fixes the value domain: bars always include zero and end on nice
// ticks; dots fit the data. --from and --to may widen, never hide.
func (c *rowChart) domain() error {
	lo, hi := c.valueRange()
	if !c.dots {
		lo, hi = math.Min(lo, 0), math.Max(hi, 0)
		if c.opt.From != nil && *c.opt.From > lo {
			return &OptionError{Option: "From", Value: strconv.FormatFloat(*c.opt.From, 'g', -1, 64), Err: &RefusalError{Reason: "would cut " + c.cutWhat(lo),
				Instead: "a bar's length is its value, so bars start at zero. To compare values far from zero, use a dot plot (plumb dots), which may start anywhere"}}
		}
		if c.opt.To != nil && *c.opt.To < hi {
			return c.domainError("To", *c.opt.To, "would cut bars that reach "+c.numText(hi), "at or beyond the largest value")
		}
	} else {
		if c.opt.From != nil && *c.opt.From > lo {
			return c.domainError("From", *c.opt.From, "would hide values down to "+c.numText(lo), "at or below the smallest value")
		}
		if c.opt.To != nil && *c.opt.To < hi {
			return c.domainError("To", *c.opt.To, "would hide values up to "+c.numText(hi), "at or above the largest value")
		}
	}
	if c.opt.From != nil {
		lo = *c.opt.From
	}
	if c.opt.To != nil {
		hi = *c.opt.To
	}
	c.d0, c.d1 = lo, hi
	c.lo0, c.hi0 = lo, hi
	return nil
}

// domainError refuses a From or To that would hide data: an OptionError
// naming the option, wrapping the refusal.
func (c *rowChart) domainError(option string, v float64, why, where string) error {
	return &OptionError{Option: option, Value: strconv.FormatFloat(v, 'g', -1, 64),
		Err: &RefusalError{Reason: why, Instead: fmt.Sprintf("give %s %s, or leave it out", c.opt.name(option), where)}}
}

func (c *rowChart) cutWhat(lo float64) string {
	if lo < 0 {
		return fmt.Sprintf("the bars down to %s", c.numText(lo))
	}
	return "every bar short of its true length"
}

func (c *rowChart) numText(v float64) string {
	return scale.ValueFormat([]float64{v}, c.opt.Unit).Format(v)
}

// abbreviateCalendar gives month and weekday names their standard short
// forms (Jan, Feb; Mon, Tue) when any category label does not fit width, all
// of them alike, so an axis never mixes "March" with "Jan…". When even the
// three-letter forms do not fit, the one-letter initials are used (J F M;
// M T W), as on printed calendars (common practice).
func (c *rowChart) abbreviateCalendar(width float64) {
	f, size := c.f, c.f.spec.text
	fits := func(s string, bold bool) bool { return f.measure(s, size, bold) <= width }
	short := make([]string, len(c.rows))
	all, over := true, false
	for i, r := range c.rows {
		ab, ok := calendarShort(r.label)
		if !ok {
			all = false
			break
		}
		short[i] = ab
		over = over || !fits(r.label, r.highlight)
	}
	if !all || !over {
		return
	}
	initials := false
	for i, r := range c.rows {
		initials = initials || !fits(short[i], r.highlight)
	}
	again := c.rows[0].short != ""
	for i := range c.rows {
		if initials {
			short[i] = short[i][:1]
		}
		c.rows[i].short = short[i]
	}
	if again {
		return
	}
	f.scene.Note("calendar-abbreviated", false, "wrote the month or weekday names in their standard short forms to fit the columns")
}

// calendarShort returns the standard three-letter form of an English month
// or weekday name, full or already abbreviated ("September", "Sept", "sep").
func calendarShort(label string) (string, bool) {
	l := strings.ToLower(strings.TrimSuffix(strings.TrimSpace(label), "."))
	switch l {
	case "sept":
		return "Sep", true
	case "tues":
		return "Tue", true
	case "thur", "thurs":
		return "Thu", true
	}
	for _, n := range []string{"January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December",
		"Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday", "Sunday"} {
		if ab := n[:3]; l == strings.ToLower(n) || l == strings.ToLower(ab) {
			return ab, true
		}
	}
	return "", false
}
