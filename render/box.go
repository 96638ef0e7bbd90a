package render

import (
	"fmt"
	"io"
	"math"
	"strings"

	"plumb/internal/stats"
	"plumb/layout"
	"plumb/scale"
)

// Group is one category's raw values, for charts that summarise a
// distribution per category (box plots, computed ranges).
type Group struct {
	Label  string
	Values []float64
}

// BoxOptions configures box plots. The zero value draws the honest default:
// one horizontal Tukey box per group, ordered by median (largest first),
// quartiles by Hyndman & Fan (1996) type 7, whiskers to the most extreme
// values within 1.5·IQR of the box, every value beyond drawn as a point,
// and the n of each group beside its row.
type BoxOptions struct {
	Common
	Order     Order  // ByValue (by median, largest first; default), ByLabel or ByData
	Unit      string // unit of the values, said once in the unit line ("min", "°C"); a currency sign leads every tick
	ValueName string // what the values measure, for the unit line and the description
	GroupName string // what the groups are, for the description
	// Vertical stands the boxes up, one column per group, the names
	// under them; rows read better with long names, so it is not the
	// default.
	Vertical bool
}

// MinBoxN is the smallest group drawn as a box: below it the quartiles of
// a handful of values are interpolations between two or three points,
// and a box would claim a spread the data cannot show, so the values
// themselves are drawn (common practice).
const MinBoxN = 5

// Box draws box plots of groups and writes them as SVG to w. It returns the
// notes that record what was decided.
func Box(w io.Writer, groups []Group, opt BoxOptions) ([]Note, error) {
	s, err := BoxScene(groups, opt)
	return writeScene(w, s, err)
}

// BoxScene builds the box plots' scene without writing it.
func BoxScene(groups []Group, opt BoxOptions) (*Scene, error) {
	return chartScene(opt.Common, BoxPanel(groups, opt))
}

// BoxPanel plans box plots for a cell of a figure.
func BoxPanel(groups []Group, opt BoxOptions) Panel {
	return newPanel(opt.Common, func(f *frame) (panelPlan, error) {
		p, err := planBox(f, groups, opt)
		switch {
		case err != nil:
			return nil, err
		case opt.Vertical:
			// Largest median first, on the left, as on vertical bars.
			return &valueColumns{valueRows: p}, nil
		}
		return p, nil
	})
}

// boxRow is one group summarised.
type boxRow struct {
	label  string
	values []float64 // sorted
	box    stats.Box
}

func planBox(f *frame, groups []Group, opt BoxOptions) (*valueRows, error) {
	labels := make([]string, len(groups))
	for i, g := range groups {
		labels[i] = g.Label
	}
	if err := checkLabels("group", labels); err != nil {
		return nil, err
	}
	opt.Unit = strings.TrimSpace(opt.Unit)
	p := &valueRows{unit: opt.Unit, axisTitle: unitTitle(opt.ValueName, opt.Unit)}
	var all [][]float64
	var small []string
	rows := make([]boxRow, len(groups))
	for i, g := range groups {
		s, err := stats.Sorted(g.Values)
		if err != nil {
			return nil, fmt.Errorf("group %q: %w", g.Label, err)
		}
		rows[i] = boxRow{label: g.Label, values: s, box: stats.TukeyBoxSorted(s)}
		all = append(all, s)
		if len(s) < MinBoxN {
			small = append(small, fmt.Sprintf("%q (n = %d)", g.Label, len(s)))
		}
	}
	if err := checkSpan("values", all...); err != nil {
		return nil, err
	}
	p.values = joinValues(all)
	p.integer = scale.IsInteger(p.values)
	p.vfmt = scale.ValueFormat(p.values, opt.Unit)
	for _, r := range rows {
		p.rows = append(p.rows, valueRow{
			label: r.label, key: r.box.Median, lo: r.values[0], hi: r.values[len(r.values)-1],
			right: fmt.Sprintf("n = %s", countText(len(r.values))),
			draw: func(f *frame, pos scale.Linear, c, thick float64, vertical bool) ([]layout.Box, float64) {
				return drawBox(f, r, pos, c, thick, vertical)
			},
		})
	}
	if err := orderRows(p.rows, opt.Order); err != nil {
		return nil, err
	}
	if opt.Order == ByValue || opt.Order == "" {
		f.scene.Note("order", false, fmt.Sprintf("ordered the groups by median, largest first (%s label or data for another order)", opt.name("Order")))
	}
	if len(small) > 0 {
		f.scene.Note("box-small", true, fmt.Sprintf("drew the values instead of a box for %d %s with fewer than %d values: %s; a box of so few values would show a spread the data cannot support",
			len(small), plural(len(small), "group", "groups"), MinBoxN, strings.Join(small[:min(len(small), 5)], ", ")+moreNames(len(small), 5)))
	}
	outliers := 0
	for _, r := range rows {
		if len(r.values) >= MinBoxN {
			outliers += len(r.box.Outliers)
		}
	}
	f.scene.Note("box-method", false, fmt.Sprintf("boxes span the quartiles (Hyndman & Fan type 7); whiskers reach the most extreme values within 1.5 IQR of the box; %d %s beyond them drawn as circles",
		outliers, plural(outliers, "value", "values")))
	p.desc, p.name = describeBox(rows, opt, p.vfmt, outliers)
	return p, nil
}

// drawBox draws one group's box, median, whiskers and outliers, or its
// values when there are too few for a box, across the value axis at
// centre c (a row's y, or a column's x when vertical).
func drawBox(f *frame, r boxRow, pos scale.Linear, c, thick float64, vertical bool) ([]layout.Box, float64) {
	sp := f.spec
	b := r.box
	v := func(x float64) float64 { return round2(pos.Map(x)) }
	c = round2(c)
	// pt and box turn (along the value axis, across it) into the page.
	pt := func(along, across float64) Point {
		if vertical {
			return Point{X: across, Y: along}
		}
		return Point{X: along, Y: across}
	}
	box := func(a0, a1, c0, c1 float64) layout.Box {
		a0, a1 = min(a0, a1), max(a0, a1)
		if vertical {
			return layout.Box{X: c0, Y: a0, W: c1 - c0, H: a1 - a0}
		}
		return layout.Box{X: a0, Y: c0, W: a1 - a0, H: c1 - c0}
	}
	radius := math.Max(2, sp.text*0.28)
	dot := func(x float64) layout.Box { return box(v(x)-radius, v(x)+radius, c-radius, c+radius) }
	var boxes []layout.Box
	end := func(x float64) float64 { // the far end of a mark at x, along the value axis
		if vertical {
			return v(x) - radius
		}
		return v(x) + radius
	}
	if len(r.values) < MinBoxN {
		for _, x := range r.values {
			// Values beyond Tukey's fences keep the outlier class, so
			// that a count of outliers does not depend on n.
			class := "plumb-mark plumb-point"
			if x < b.LowFence || x > b.HighFence {
				class += " plumb-outlier"
			}
			p := pt(v(x), c)
			f.scene.Add(Mark{Kind: Circle, Class: class, X: p.X, Y: p.Y, R: radius, Fill: f.th.neutral,
				Attrs: []Attr{{"label", r.label}, {"value", dataNumber(x)}}})
			boxes = append(boxes, dot(x))
		}
		return boxes, end(r.values[len(r.values)-1])
	}
	lw := math.Max(1.5, 2*sp.text/13)
	whisker := func(from, to float64) {
		f.scene.Add(Mark{Kind: Path, Class: "plumb-whisker", Lines: [][]Point{{pt(v(from), c), pt(v(to), c)}}, Stroke: f.th.neutral, StrokeWidth: lw, Cap: CapRound})
	}
	// A whisker that ends inside the box (see stats.Box) is not drawn.
	if b.LowWhisker < b.Q1 {
		whisker(b.LowWhisker, b.Q1)
	}
	if b.HighWhisker > b.Q3 {
		whisker(b.Q3, b.HighWhisker)
	}
	// A box of zero IQR still shows, as a line 1 px long.
	a1, a3 := v(b.Q1), v(b.Q3)
	if math.Abs(a3-a1) < 1 {
		a3 = a1 + 1
		if vertical {
			a3 = a1 - 1
		}
	}
	c0 := round2(c - thick/2)
	rb := box(a1, a3, c0, round2(c0+thick))
	f.scene.Add(Mark{Kind: Rect, Class: "plumb-mark plumb-box", X: round2(rb.X), Y: round2(rb.Y), W: round2(rb.W), H: round2(rb.H), Fill: f.th.neutral,
		Attrs: []Attr{{"label", r.label}, {"q1", dataNumber(b.Q1)}, {"median", dataNumber(b.Median)}, {"q3", dataNumber(b.Q3)},
			{"low", dataNumber(b.LowWhisker)}, {"high", dataNumber(b.HighWhisker)}, {"n", fmt.Sprint(b.N)}}})
	// The median is a gap of the page's white across the box: it keeps the
	// box one colour, reads at any size, and needs no second ink (common
	// practice).
	m := v(b.Median)
	f.scene.Add(Mark{Kind: Path, Class: "plumb-median", Lines: [][]Point{{pt(m, c0), pt(m, round2(c0+thick))}}, Stroke: pageWhite(), StrokeWidth: math.Max(2, lw)})
	boxes = append(boxes, box(v(b.LowWhisker), v(b.HighWhisker), c0, c0+thick))
	top := max(b.HighWhisker, b.Q3)
	for _, x := range b.Outliers {
		p := pt(v(x), c)
		f.scene.Add(Mark{Kind: Circle, Class: "plumb-outlier", X: p.X, Y: p.Y, R: radius, Stroke: f.th.neutral, StrokeWidth: 1.25,
			Attrs: []Attr{{"label", r.label}, {"value", dataNumber(x)}}})
		boxes = append(boxes, dot(x))
		top = max(top, x)
	}
	return boxes, end(top)
}

// moreNames is ", and k more" when a list of n was cut to max.
func moreNames(n, max int) string {
	if n <= max {
		return ""
	}
	return fmt.Sprintf(", and %d more", n-max)
}

// pageWhite is the page: the median's gap in a box.
func pageWhite() Colour { return Colour{R: 255, G: 255, B: 255, A: 255} }

// describeBox says what the boxes show: how many groups, the medians'
// range, the widest and narrowest spreads, and the outliers.
func describeBox(rows []boxRow, opt BoxOptions, vf scale.Format, outliers int) (desc, name string) {
	what := opt.ValueName
	if what == "" {
		what = "values"
	}
	name = "Box plots of " + what
	if opt.GroupName != "" {
		name += " by " + opt.GroupName
	}
	hiM, loM, wide, narrow := 0, 0, -1, -1
	for i, r := range rows {
		if r.box.Median > rows[hiM].box.Median {
			hiM = i
		}
		if r.box.Median < rows[loM].box.Median {
			loM = i
		}
		if len(r.values) < MinBoxN {
			continue
		}
		if wide < 0 || r.box.IQR > rows[wide].box.IQR {
			wide = i
		}
		if narrow < 0 || r.box.IQR < rows[narrow].box.IQR {
			narrow = i
		}
	}
	var b strings.Builder
	fmt.Fprintf(&b, "%s for %d %s. ", name, len(rows), plural(len(rows), "group", "groups"))
	if len(rows) == 1 {
		fmt.Fprintf(&b, "The median is %s.", vf.Format(rows[0].box.Median))
	} else {
		fmt.Fprintf(&b, "Medians range from %s (%s) to %s (%s).", vf.Format(rows[loM].box.Median), rows[loM].label, vf.Format(rows[hiM].box.Median), rows[hiM].label)
	}
	if wide >= 0 && wide != narrow {
		fmt.Fprintf(&b, " The middle half is widest for %s (%s to %s) and narrowest for %s (%s to %s).",
			rows[wide].label, vf.Format(rows[wide].box.Q1), vf.Format(rows[wide].box.Q3),
			rows[narrow].label, vf.Format(rows[narrow].box.Q1), vf.Format(rows[narrow].box.Q3))
	}
	fmt.Fprintf(&b, " %d %s beyond the whiskers.", outliers, plural(outliers, "value lies", "values lie"))
	return b.String(), name
}

// unitTitle is a unit line: what is measured and its unit, which a
// currency sign does not need (it is on every tick).
func unitTitle(name, unit string) string {
	if unit != "" && name != "" && !scale.IsCurrency(unit) && !namesUnit(name, unit) {
		return name + " (" + unit + ")"
	}
	if name == "" && unit != "" && !scale.IsCurrency(unit) {
		return unit
	}
	return name
}

// joinValues joins slices into one.
func joinValues(vs [][]float64) []float64 {
	n := 0
	for _, v := range vs {
		n += len(v)
	}
	out := make([]float64, 0, n)
	for _, v := range vs {
		out = append(out, v...)
	}
	return out
}

// countText writes a count with thousands separators (1,234).
func countText(n int) string {
	s := fmt.Sprint(n)
	for i := len(s) - 3; i > 0; i -= 3 {
		s = s[:i] + "," + s[i:]
	}
	return s
}
