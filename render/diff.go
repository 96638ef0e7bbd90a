package render

import (
	"fmt"
	"io"
	"math"
	"slices"
	"strings"

	"plumb/palette"
	"plumb/scale"
)

// DiffOptions configures a difference chart. The zero value draws a − b
// against a zero baseline, banked to 45°, the two signs in two colours
// that stay apart under colour vision deficiency.
type DiffOptions struct {
	Common
	Time bool // x holds instants as Unix seconds (UTC); series made by TimeSeries need no flag
	// Context adds a panel above the difference with both series on the
	// same x scale, so that the reader sees the levels too.
	Context bool
	Unit    string // unit of a and b
	XName   string // what x is

	aName, bName string // the two series' names, set by DiffScene
}

// Diff draws the difference chart of a − b over their x and writes it as SVG
// to w. Readers judge the gap between two curves by their shortest
// distance rather than the vertical one (Cleveland & McGill 1984), so the
// difference itself is plotted. It returns the notes.
func Diff(w io.Writer, a, b Series, opt DiffOptions) ([]Note, error) {
	s, err := DiffScene(a, b, opt)
	return writeScene(w, s, err)
}

// diffColors are the two area colours and the two context line colours:
// the inner and outer classes of the two arms of the default diverging
// scale, matched in lightness and no red/green pair. The areas are light
// enough for text in the Text colour (7:1) and stay over 30 CIEDE2000
// apart under all four visions (checked in diff_test.go).
func diffColors() (areaA, areaB, lineA, lineB Colour) {
	p, err := palette.Diverging(7)
	if err != nil || len(p) != 7 {
		return RGB(palette.Accent()), RGB(palette.Neutral()), RGB(palette.Accent()), RGB(palette.Neutral())
	}
	return RGB(p[4]), RGB(p[2]), RGB(p[5]), RGB(p[1])
}

// DiffScene builds the difference chart's scene without writing it. The
// series' names name the two sides ("" means "a" and "b"). Their x values
// are matched exactly: the difference is drawn at every x that both series
// have, and x values only one of them has are left out with a note. With
// Context, the levels panel and the difference panel are one column of a
// grid sharing the x scale, each banked for its own height.
func DiffScene(a, b Series, opt DiffOptions) (*Scene, error) {
	c, err := newDiffChart(a, b, opt)
	if err != nil {
		return nil, err
	}
	o := gridOptions{cols: 1, shareX: true, ownHeights: true, describe: func() (string, string) { return c.describe(), c.name() }}
	panels := []Panel{c.panel(false)}
	if opt.Context {
		panels = []Panel{c.panel(true), c.panel(false)}
	}
	return figureScene(opt.Common, o, panels)
}

// DiffPanel plans a difference chart for a cell of a figure: the
// difference panel alone, for the levels panel of Context needs the
// column of a figure of its own (DiffScene).
func DiffPanel(a, b Series, opt DiffOptions) Panel {
	return newPanel(opt.Common, func(f *frame) (panelPlan, error) {
		c, err := newDiffChart(a, b, opt)
		if err != nil {
			return nil, err
		}
		c.start(f)
		if opt.Context {
			f.scene.Note("context", false, "drew the difference without its levels panel in this figure: the levels panel needs a figure of its own")
		}
		return &diffPlan{c: c, inFigure: true}, nil
	})
}

// newDiffChart matches the two series and subtracts them.
func newDiffChart(a, b Series, opt DiffOptions) (*diffChart, error) {
	if a.Name == "" {
		a.Name = "a"
	}
	if b.Name == "" {
		b.Name = "b"
	}
	opt.aName, opt.bName = a.Name, b.Name
	var err error
	if opt.Time, err = timeAxis(opt.Time, a, b); err != nil {
		return nil, err
	}
	series, notes, err := cleanSeries([]Series{a, b})
	if err != nil {
		return nil, err
	}
	if len(series) < 2 { // one of them has no values at all
		return nil, fmt.Errorf("no x has both %s and %s: nothing to subtract", opt.aName, opt.bName)
	}
	x, av, bv, onlyA, onlyB := matchX(series[0], series[1])
	d := make([]float64, len(x))
	for i := range x {
		d[i] = av[i] - bv[i] // NaN when either is missing: a gap
		if math.IsInf(d[i], 0) {
			return nil, fmt.Errorf("%s − %s at x = %g is beyond the largest number (%.1e): divide both series by a power of ten first", opt.aName, opt.bName, x[i], math.MaxFloat64)
		}
	}
	if _, _, ok := dataRange(d); !ok {
		return nil, fmt.Errorf("no x has both %s and %s: nothing to subtract", opt.aName, opt.bName)
	}
	if err := firstError(checkSpan("x values", x), checkSpan("values of "+opt.aName+" and "+opt.bName, av, bv)); err != nil {
		return nil, err
	}
	c := &diffChart{opt: opt, x: x, a: av, b: bv, d: d, missing: countMissing([]Series{{Y: d}}), xk: xKindOf([][]float64{x}, opt.Time)}
	c.notes = notes[:min(len(notes), 1)]
	if onlyA+onlyB > 0 {
		c.notes = append(c.notes, Note{Code: "unmatched-x", Changed: true, Text: fmt.Sprintf("drew the difference at the %d x values both series have; left out %d x values only %s has and %d only %s has", len(x), onlyA, opt.aName, onlyB, opt.bName)})
	}
	zero := 0.0
	c.dk = yKind{include: &zero, integer: wholeNumbers(c.d)}
	c.lk = yKind{integer: wholeNumbers(c.a) && wholeNumbers(c.b)}
	return c, nil
}

// start adds the chart's notes to the frame, once.
func (c *diffChart) start(f *frame) {
	if c.started {
		return
	}
	c.started = true
	f.scene.Notes = append(f.scene.Notes, c.notes...)
	if c.opt.Time {
		f.noteMilliseconds(dataRange(c.x))
	}
	if c.xk.years {
		f.scene.Note("years", false, yearsNote)
	}
}

// panel is the Panel of the levels (context) or of the difference.
func (c *diffChart) panel(levels bool) Panel {
	name := "difference"
	if levels {
		name = "levels"
	}
	return Panel{name: name, layers: c.opt.Annotations.layers(), plan: func(f *frame) (panelPlan, error) {
		c.start(f)
		if levels {
			return &levelsPlan{c: c}, nil
		}
		return &diffPlan{c: c}, nil
	}}
}

// name is the accessible name of an untitled chart.
func (c *diffChart) name() string {
	return "Difference between " + c.opt.aName + " and " + c.opt.bName
}

// matchX pairs the values of a and b (each sorted by x, one value per x)
// at the x values both have, and counts the x values only one has.
func matchX(a, b Series) (x, av, bv []float64, onlyA, onlyB int) {
	if slices.Equal(a.X, b.X) {
		return a.X, a.Y, b.Y, 0, 0
	}
	i, j := 0, 0
	for i < len(a.X) && j < len(b.X) {
		switch {
		case a.X[i] < b.X[j]:
			onlyA++
			i++
		case a.X[i] > b.X[j]:
			onlyB++
			j++
		default:
			x, av, bv = append(x, a.X[i]), append(av, a.Y[i]), append(bv, b.Y[j])
			i++
			j++
		}
	}
	return x, av, bv, onlyA + len(a.X) - i, onlyB + len(b.X) - j
}

type diffChart struct {
	opt        DiffOptions
	x, a, b, d []float64
	missing    int // x values where a or b is missing
	xk         xKind
	dk, lk     yKind // the difference's value axis and the levels'
	notes      []Note
	started    bool
	// The panels, and what fit measured once for both.
	diff   *diffPlan
	levels *levelsPlan
	side   *insets // the room left and right of both plots
	w      float64 // the plot width that room leaves
	labels []label // the series names at the levels' line ends
	labelW float64
}

func (c *diffChart) unitSuffix() string {
	unit := strings.TrimSpace(c.opt.Unit)
	if unit == "" {
		return ""
	}
	return " (" + unit + ")"
}

// describe says what is plotted, where each series is above, and the
// largest differences.
func (c *diffChart) describe() string {
	var b strings.Builder
	over := overText(c.opt.XName, c.opt.Time)
	xlo, xhi, _ := dataRange(c.x)
	fmt.Fprintf(&b, "Difference chart of %s minus %s %s, from %s to %s, against a zero line.", c.opt.aName, c.opt.bName, over,
		xValueText(xlo, c.xk), xValueText(xhi, c.xk))
	series := []Series{{Name: c.opt.aName, X: c.x, Y: c.a}, {Name: c.opt.bName, X: c.x, Y: c.b}, {X: c.x, Y: c.d}}
	vf := scale.ValueFormat(shownValues(series), c.opt.Unit)
	_, _, lo, hi := extremes(c.d)
	above, below := c.stretches(1), c.stretches(-1)
	switch {
	case above.points == 0 && below.points == 0:
		fmt.Fprintf(&b, " %s and %s are equal at every point.", c.opt.aName, c.opt.bName)
	case below.points == 0:
		fmt.Fprintf(&b, " %s is above %s at %d of %d points%s, and never below.", c.opt.aName, c.opt.bName, above.points, len(c.d), above.text(c))
	case above.points == 0:
		fmt.Fprintf(&b, " %s is below %s at %d of %d points%s, and never above.", c.opt.aName, c.opt.bName, below.points, len(c.d), below.text(c))
	default:
		fmt.Fprintf(&b, " %s is above %s at %d of %d points%s, and below at %d%s.", c.opt.aName, c.opt.bName,
			above.points, len(c.d), above.text(c), below.points, below.text(c))
	}
	// The gap between two percentages is in percentage points.
	gap := vf.Format
	if vf.Unit == "%" {
		pf := vf
		pf.Unit = ""
		gap = func(v float64) string { return pf.Format(v) + " percentage points" }
	}
	if hi >= 0 && c.d[hi] > 0 {
		fmt.Fprintf(&b, " Largest gap with %s above: %s at %s.", c.opt.aName, gap(c.d[hi]), xValueText(c.x[hi], c.xk))
	}
	if lo >= 0 && c.d[lo] < 0 {
		fmt.Fprintf(&b, " Largest gap with %s above: %s at %s.", c.opt.bName, gap(-c.d[lo]), xValueText(c.x[lo], c.xk))
	}
	for _, s := range series[:2] {
		b.WriteString(" " + describeSeries(s, vf, c.xk))
	}
	return b.String()
}

// signRuns are the stretches of x where the difference has one sign.
type signRuns struct {
	points int      // points with that sign
	runs   [][2]int // first and last index of each stretch
}

// stretches finds where the difference has the given sign (1: a above
// b, -1: b above a); a missing difference ends a stretch.
func (c *diffChart) stretches(sign float64) signRuns {
	var r signRuns
	start := -1
	for i, v := range c.d {
		in := v*sign > 0
		if in {
			r.points++
			if start < 0 {
				start = i
			}
		}
		if !in && start >= 0 {
			r.runs = append(r.runs, [2]int{start, i - 1})
			start = -1
		}
	}
	if start >= 0 {
		r.runs = append(r.runs, [2]int{start, len(c.d) - 1})
	}
	return r
}

// maxStretches is how many stretches a description names: a reader
// listening to the text keeps a few in mind, not a list of twenty.
const maxStretches = 4

// text names the stretches in parentheses ("from Jan 2024 to Jun 2024,
// at Sep 2024"), at most maxStretches of them, the longest first when
// there are more.
func (r signRuns) text(c *diffChart) string {
	if len(r.runs) == 0 {
		return ""
	}
	runs := slices.Clone(r.runs)
	more := 0
	if len(runs) > maxStretches {
		slices.SortStableFunc(runs, func(a, b [2]int) int { return (b[1] - b[0]) - (a[1] - a[0]) })
		more = len(runs) - maxStretches
		runs = runs[:maxStretches]
		slices.SortFunc(runs, func(a, b [2]int) int { return a[0] - b[0] })
	}
	parts := make([]string, 0, len(runs)+1)
	for _, s := range runs {
		if s[0] == s[1] {
			parts = append(parts, "at "+xValueText(c.x[s[0]], c.xk))
			continue
		}
		parts = append(parts, "from "+xValueText(c.x[s[0]], c.xk)+" to "+xValueText(c.x[s[1]], c.xk))
	}
	if more > 0 {
		parts = append(parts, fmt.Sprintf("and %d shorter %s", more, plural(more, "stretch", "stretches")))
	}
	return " (" + strings.Join(parts, ", ") + ")"
}
