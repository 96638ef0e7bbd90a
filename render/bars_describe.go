package render

import (
	"fmt"
	"math"
	"strings"
	"time"

	"plumb/scale"
)

// The description of bars and dots, for readers who cannot see them.

// describe writes the plain-language <desc>: what is plotted, the extremes,
// and what was combined.
func (c *rowChart) describeText() string {
	kind := "Bar chart"
	switch {
	case c.dots:
		kind = "Dot plot"
	case c.opt.Vertical:
		kind = "Vertical bar chart"
	}
	what := c.opt.ValueName
	if what == "" {
		what = "values"
	}
	if c.opt.Percent {
		what = "share of total " + c.opt.ValueName
	}
	by := c.opt.LabelName
	if by == "" {
		by = "category"
	}
	var b strings.Builder
	// The marks are counted by their name, which a listener pictures
	// ("20 bars"), rather than as rows of a table.
	mark := [2]string{"bar", "bars"}
	switch {
	case c.dots:
		mark = [2]string{"dot", "dots"}
	case c.opt.Vertical:
		mark = [2]string{"column", "columns"}
	}
	fmt.Fprintf(&b, "%s of %s by %s, %d %s", kind, strings.TrimSpace(what), by, len(c.rows), plural(len(c.rows), mark[0], mark[1]))
	switch c.opt.Order {
	case ByValue, "":
		b.WriteString(", largest first")
	case ByLabel:
		b.WriteString(", in label order")
	case ByData:
		b.WriteString(", in the order given")
	}
	b.WriteString(". ")
	hi, lo := 0, 0
	for i, r := range c.rows {
		if r.other > 0 {
			continue
		}
		if r.value > c.rows[hi].value || c.rows[hi].other > 0 {
			hi = i
		}
		if r.value < c.rows[lo].value || c.rows[lo].other > 0 {
			lo = i
		}
	}
	fmt.Fprintf(&b, "Largest: %s at %s; smallest: %s at %s.", spokenLabel(c.rows[hi].label), c.vfmt.Format(c.rows[hi].value), spokenLabel(c.rows[lo].label), c.vfmt.Format(c.rows[lo].value))
	if last := c.rows[len(c.rows)-1]; last.other > 0 {
		fmt.Fprintf(&b, " %d smaller categories are combined in %s at %s.", last.other, last.label, c.vfmt.Format(last.value))
	}
	if t, ok := c.total(); ok {
		fmt.Fprintf(&b, " Total: %s.", scale.Format{Group: true, Unit: c.opt.Unit, Decimals: c.vfmt.Decimals}.Format(t))
	}
	if len(c.opt.Highlight) > 0 {
		fmt.Fprintf(&b, " Highlighted: %s.", strings.Join(c.opt.Highlight, ", "))
	}
	return b.String()
}

// total is the sum of every category, Other included, when the values are
// parts of a whole and none was left out or averaged into Other: only
// then is it the whole the bars divide. Shares always total 100%, which
// says nothing.
func (c *rowChart) total() (float64, bool) {
	if !c.additive() || c.opt.Percent || c.dots || (c.opt.Other != OtherAuto && c.opt.Other != OtherSum) {
		return 0, false
	}
	t := 0.0
	for _, r := range c.rows {
		if math.IsNaN(r.raw) {
			return 0, false
		}
		t += r.raw
	}
	return t, true
}

// spokenLabel writes a category label for a description: an ISO month
// ("2024-08") or day ("2024-08-05") as a date a listener hears as one
// ("Aug 2024", "5 Aug 2024"); any other label as it is.
func spokenLabel(label string) string {
	if t, err := time.Parse("2006-01", label); err == nil {
		return t.Format("Jan 2006")
	}
	if t, err := time.Parse("2006-01-02", label); err == nil {
		return t.Format("2 Jan 2006")
	}
	return label
}
