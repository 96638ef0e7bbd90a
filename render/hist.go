package render

import (
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strings"

	"plumb/internal/stats"
	"plumb/layout"
	"plumb/scale"
)

// HistOptions configures a histogram. The zero value bins by
// Freedman–Diaconis (Sturges when the IQR is zero), on edges at whole
// multiples of a nice width, and draws counts as bars from zero.
type HistOptions struct {
	Common
	Bins      int     // about this many bins, the width rounded to a nice number; 0 chooses by rule
	Width     float64 // this bin width exactly, edges at its multiples; 0 chooses
	Density   bool    // heights are densities (count / (n · width)), so areas sum to 1
	Unit      string  // unit of the values, for the x axis title
	ValueName string  // what the values measure, for the x axis title and the description
	// BinsFrom, when set, is a pool of values that holds the panel's own
	// (every group of a figure): the bins are chosen from the pool, so
	// that panels drawn with one pool share their bins. HistPanels sets it.
	BinsFrom []float64
}

// Hist draws a histogram of values and writes it as SVG to w. It returns
// the notes that record what was decided (the rule and the width chosen).
func Hist(w io.Writer, values []float64, opt HistOptions) ([]Note, error) {
	s, err := HistScene(values, opt)
	return writeScene(w, s, err)
}

// HistScene builds the histogram's scene without writing it.
func HistScene(values []float64, opt HistOptions) (*Scene, error) {
	return chartScene(opt.Common, HistPanel(values, opt))
}

// HistPanel plans a histogram for a cell of a figure.
func HistPanel(values []float64, opt HistOptions) Panel {
	return newPanel(opt.Common, func(f *frame) (panelPlan, error) {
		return planHist(f, values, opt)
	})
}

// HistPanels plans one histogram per group on shared bins: the width is
// chosen once, from every group's values together (by the rule, Bins or
// Width of opt), and every panel's edges are multiples of it, so that a
// bar in one panel covers exactly the values of the bar above or beside
// it in another. Draw them with Figure and ShareX, so that the bins line
// up too; ShareY gives equal heights one count.
func HistPanels(groups []Group, opt HistOptions) []Panel {
	var pooled []float64
	for _, g := range groups {
		pooled = append(pooled, g.Values...)
	}
	panels := make([]Panel, len(groups))
	for i, g := range groups {
		o := opt
		o.Title = g.Label
		o.BinsFrom = pooled
		panels[i] = HistPanel(g.Values, o)
	}
	return panels
}

// histPlan is a histogram planned: its bins counted, nothing placed.
type histPlan struct {
	opt     HistOptions
	h       stats.Histogram
	sorted  []float64
	heights []float64 // count or density per bin
	xfmt    scale.Format

	dx, dy axisDomain
	xTitle string
	yTitle string
}

// minBarPx is the narrowest a histogram bar may be drawn: below two pixels
// neighbouring bars merge and counts turn to noise, so rules that would
// give more bins than the plot holds at this width are widened (common
// practice).
const minBarPx = 2

func planHist(f *frame, values []float64, opt HistOptions) (*histPlan, error) {
	if len(opt.BinsFrom) > 0 {
		return planSharedHist(f, values, opt)
	}
	s, h, err := chooseBins(f, values, opt)
	if err != nil {
		return nil, err
	}
	p := newHistPlan(s, opt, h)
	f.scene.Note("bins", false, binsNote(h, p.xfmt, opt))
	return p, nil
}

// planSharedHist bins values at the width opt.BinsFrom chooses, on edges
// at its multiples, and notes the rule once for all the panels.
func planSharedHist(f *frame, values []float64, opt HistOptions) (*histPlan, error) {
	all, h, err := chooseBins(f, opt.BinsFrom, opt)
	if err != nil {
		return nil, err
	}
	s, err := stats.Sorted(values)
	switch {
	case errors.Is(err, stats.ErrEmpty):
		return nil, fmt.Errorf("no values to draw")
	case err != nil:
		return nil, err
	}
	own, err := stats.BinValues(s, stats.BinOptions{Width: h.Width, Integer: scale.IsInteger(all), MaxBins: math.MaxInt32})
	if err != nil {
		return nil, err
	}
	own.Rule, own.Raw, own.Widened = h.Rule, h.Raw, h.Widened
	note := binsNote(h, histFormat(h, opt), opt) + "; the same bins in every panel"
	if !slices.ContainsFunc(f.scene.Notes, func(n Note) bool { return n.Code == "bins" && n.Text == note }) {
		f.scene.Note("bins", false, note)
	}
	return newHistPlan(s, opt, own), nil
}

// chooseBins sorts the values and bins them by opt's rule, count or width.
func chooseBins(f *frame, values []float64, opt HistOptions) ([]float64, stats.Histogram, error) {
	if opt.Bins < 0 {
		return nil, stats.Histogram{}, &OptionError{Option: "Bins", Value: fmt.Sprint(opt.Bins), Err: ErrNegative}
	}
	if opt.Bins != 0 && opt.Width != 0 {
		return nil, stats.Histogram{}, &OptionError{Option: "Width", Value: numValue(opt.Width), Err: fmt.Errorf("give %s or %s, not both", opt.name("Bins"), opt.name("Width"))}
	}
	if math.IsNaN(opt.Width) || math.IsInf(opt.Width, 0) || opt.Width < 0 {
		return nil, stats.Histogram{}, &OptionError{Option: "Width", Value: numValue(opt.Width), Err: errors.New("must be a positive number")}
	}
	s, err := stats.Sorted(values)
	switch {
	case errors.Is(err, stats.ErrEmpty):
		return nil, stats.Histogram{}, fmt.Errorf("no values to draw")
	case err != nil:
		return nil, stats.Histogram{}, err
	}
	if err := checkSpan("values", s); err != nil {
		return nil, stats.Histogram{}, err
	}
	maxBins := max(8, int((f.width-2*f.spec.pad)/minBarPx))
	h, err := stats.BinValues(s, stats.BinOptions{Bins: opt.Bins, Width: opt.Width, MaxBins: maxBins, Integer: scale.IsInteger(s)})
	if errors.Is(err, stats.ErrTooManyBins) {
		// The width is usable, but not over this data on this canvas.
		msg := strings.TrimPrefix(err.Error(), stats.ErrTooManyBins.Error()+": ")
		reason, instead, _ := strings.Cut(msg, "; ")
		return nil, h, &OptionError{Option: "Width", Value: numValue(opt.Width), Err: &RefusalError{
			Reason:  fmt.Sprintf("%s, bars narrower than %d px", reason, minBarPx),
			Instead: fmt.Sprintf("%s, give %s N, or leave both out to choose by rule", instead, opt.name("Bins"))}}
	}
	if err != nil && !errors.Is(err, stats.ErrBinOptions) {
		return nil, h, fmt.Errorf("%w; divide the values by a power of ten, or give a wider %s", err, opt.name("Width"))
	}
	if err != nil {
		option := "Bins"
		if opt.Width != 0 {
			option = "Width"
		}
		return nil, h, &OptionError{Option: option, Value: numValue(float64(opt.Bins) + opt.Width), Err: errors.New(strings.TrimPrefix(err.Error(), stats.ErrBinOptions.Error()+": "))}
	}
	return s, h, nil
}

// histFormat is the format of a histogram's edges and width.
func histFormat(h stats.Histogram, opt HistOptions) scale.Format {
	return scale.ValueFormat(append(slices.Clone(h.Edges), h.Width), opt.Unit)
}

// newHistPlan finishes a plan from its sorted values and their bins.
func newHistPlan(s []float64, opt HistOptions, h stats.Histogram) *histPlan {
	p := &histPlan{opt: opt, h: h, sorted: s, heights: make([]float64, len(h.Counts))}
	peak := 0.0
	for i, c := range h.Counts {
		p.heights[i] = float64(c)
		if opt.Density {
			p.heights[i] = h.Density(i)
		}
		peak = math.Max(peak, p.heights[i])
	}
	p.xfmt = histFormat(h, opt)
	p.dx = axisDomain{kind: domainNumber, lo: h.Edges[0], hi: h.Edges[len(h.Edges)-1], integer: scale.IsInteger(h.Edges)}
	p.dy = axisDomain{kind: domainNumber, lo: 0, hi: peak, integer: !opt.Density}
	p.xTitle = unitTitle(opt.ValueName, opt.Unit)
	if opt.Density {
		p.yTitle = "Density (share of values per unit)"
	} else {
		p.yTitle = "Count per bin of " + p.xfmt.Format(h.Width)
	}
	return p
}

// binsNote says how the bins were chosen and where values on an edge go.
func binsNote(h stats.Histogram, vf scale.Format, opt HistOptions) string {
	var b strings.Builder
	w := vf.Format(h.Width)
	nice := "a nice number"
	if !h.LastClosed() {
		nice = "a nice whole number, as the values are whole"
	}
	switch h.Rule {
	case stats.FreedmanDiaconis:
		fmt.Fprintf(&b, "bins of %s: the Freedman–Diaconis width 2·IQR·n^(−1/3) = %s rounded to %s", w, scale.ValueFormat([]float64{h.Raw}, opt.Unit).Format(h.Raw), nice)
	case stats.Sturges:
		fmt.Fprintf(&b, "bins of %s: the IQR is 0, so Sturges' rule (%d bins over the range), the width rounded to %s", w, stats.SturgesBins(h.N), nice)
	case stats.BinCount:
		fmt.Fprintf(&b, "bins of %s: %d bins asked (%s), the width rounded to %s", w, opt.Bins, opt.name("Bins"), nice)
	case stats.BinWidth:
		fmt.Fprintf(&b, "bins of %s as given (%s)", w, opt.name("Width"))
	case stats.SingleValue:
		fmt.Fprintf(&b, "one bin of %s: every value is the same", w)
	}
	if h.Widened {
		b.WriteString(", widened so that no bar is narrower than 2 px")
	}
	k := len(h.Counts)
	fmt.Fprintf(&b, "; %d %s from %s to %s, each holding values from its lower edge up to but not including its upper edge",
		k, plural(k, "bin", "bins"), vf.Format(h.Edges[0]), vf.Format(h.Edges[k]))
	if h.LastClosed() && k > 1 {
		b.WriteString(" (the last includes both)")
	}
	return b.String()
}

func (p *histPlan) domains() (x, y axisDomain) { return p.dx, p.dy }

// share takes the grid's domains. The bins stay the panel's own: shared
// bins across panels are chosen before planning, by giving every panel
// one Width.
func (p *histPlan) share(x, y axisDomain) {
	if x.kind == domainNumber {
		p.dx = x
	}
	if y.kind == domainNumber {
		p.dy = y
	}
}

func (p *histPlan) yKind() valueKind {
	return valueKind{zero: true, integer: !p.opt.Density, label: func(t []float64) []string {
		return formatAll(scale.TickFormat(t, ""), t)
	}}
}

func (p *histPlan) xKind() valueKind {
	return valueKind{from: true, to: true, integer: p.dx.integer, label: func(t []float64) []string {
		u := ""
		if scale.IsCurrency(p.opt.Unit) {
			u = p.opt.Unit
		}
		return formatAll(scale.TickFormat(t, u), t)
	}}
}

func (p *histPlan) measure(f *frame, cellW float64, e edges) insets {
	sp := f.spec
	lh := lineHeight(sp.text)
	var in insets
	// The top tick label is centred on the plot's top edge: half of it
	// stands above, where the unit line or a panel title would be.
	in.top = lh / 2
	if e.top {
		in.top = f.axisTitle(p.yTitle, cellW*0.9).height(lh) + titleLift(f)
	}
	if e.left {
		a := f.fitValue(p.dy.lo, p.dy.hi, math.Max(cellW*0.55, 1), false, p.yKind())
		for _, l := range a.labels {
			in.left = math.Max(in.left, f.measure(l, sp.text, false)+sp.gap)
		}
	}
	a := f.fitValue(p.dx.lo, p.dx.hi, math.Max(cellW*0.8, 1), true, p.xKind())
	if n := len(a.labels); n > 0 {
		in.right = f.measure(a.labels[n-1], sp.text, false) / 2
		in.left = math.Max(in.left, f.measure(a.labels[0], sp.text, false)/2)
	}
	if e.bottom {
		in.bottom = f.xLabelTop(0) + lh
		if p.xTitle != "" {
			in.bottom += sp.gap + lh
		}
	}
	return in
}

// titleLift is the space between the unit line and the plot: a gap, or
// more when the top tick label, centred on the plot's edge, needs it.
func titleLift(f *frame) float64 {
	return math.Max(f.spec.gap, lineHeight(f.spec.text)/2+1)
}

func (p *histPlan) height(f *frame, plotW, room float64) (float64, error) {
	if room > 0 {
		return room, nil
	}
	return math.Max(math.Round(plotW*0.5), minPlotHeight(f.spec, false)), nil
}

func (p *histPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	sp := f.spec
	lh := lineHeight(sp.text)
	asc := f.fonts.Face(false).Ascent(sp.text)
	ay := f.fitValue(p.dy.lo, p.dy.hi, plot.H, false, p.yKind())
	ax := f.fitValue(p.dx.lo, p.dx.hi, plot.W, true, p.xKind())
	bottom := plot.Y + plot.H
	xs := scale.Linear{D0: p.dx.lo, D1: p.dx.hi, R0: plot.X, R1: plot.X + plot.W}
	ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: bottom, R1: plot.Y}
	out := placed{xs: xs, ys: ys}
	if e.top {
		t := f.axisTitle(p.yTitle, plot.W+plot.X)
		top := plot.Y - titleLift(f) - t.height(lh)
		f.drawAxisTitle(t, round2(math.Max(plot.X-f.measure("0", sp.text, false), sp.pad)), top)
	}
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
	yd := axisDraw{vertical: true, pos: ys, from: plot.X, to: plot.X + plot.W, labelAt: plot.X - sp.gap, labels: e.left, baseline: true}
	f.draw(ay, yd)
	top := f.xLabelTop(bottom)
	f.draw(ax, axisDraw{pos: xs, from: bottom, to: bottom + 4, tickMarks: true, labelAt: top + asc, labels: e.bottom})
	f.scene.Add(Mark{Kind: GroupEnd})
	if e.bottom && p.xTitle != "" {
		f.text(round2(plot.X+plot.W/2), round2(top+lh+sp.gap+asc), p.xTitle, sp.text, false, f.th.muted, "plumb-axis-title", Middle)
	}
	h := p.h
	x0 := round2(xs.Map(h.Edges[0]))
	zero := round2(ys.Map(0))
	for i, c := range h.Counts {
		x1 := round2(xs.Map(h.Edges[i+1]))
		// A hairline of the page between bars wide enough to spare it:
		// every bar loses the same width, so areas stay proportional to
		// the counts.
		inset := 0.0
		if x1-x0 >= 4 {
			inset = 0.5
		}
		y := round2(ys.Map(p.heights[i]))
		attrs := []Attr{{"value", dataNumber(p.heights[i])}, {"low", dataNumber(h.Edges[i])}, {"high", dataNumber(h.Edges[i+1])}}
		if p.opt.Density {
			attrs = append(attrs, Attr{"count", fmt.Sprint(c)})
		}
		if c > 0 {
			f.scene.Add(Mark{Kind: Rect, Class: "plumb-mark plumb-bin", X: x0 + inset, Y: y, W: round2(x1 - x0 - 2*inset), H: round2(zero - y), Fill: f.th.neutral, Attrs: attrs,
				Tooltip: fmt.Sprintf("%s to %s: %s", p.xfmt.Format(h.Edges[i]), p.xfmt.Format(h.Edges[i+1]), plural(c, "1 value", fmt.Sprintf("%s values", countText(c))))})
			out.marks = append(out.marks, layout.Box{X: x0, Y: y, W: x1 - x0, H: zero - y})
		}
		x0 = x1
	}
	f.drawBaseline(yd)
	return out, nil
}

func (p *histPlan) describe() (string, string) {
	h, vf := p.h, p.xfmt
	what := p.opt.ValueName
	if what == "" {
		what = "values"
	}
	name := "Histogram of " + what
	k := len(h.Counts)
	peak := 0
	for i, c := range h.Counts {
		if c > h.Counts[peak] {
			peak = i
		}
	}
	med := stats.Quantile(p.sorted, 0.5)
	desc := fmt.Sprintf("%s: %s %s in %d %s of %s from %s to %s. The tallest bin, %s to %s, holds %s (%.0f%%). The median is %s.",
		name, countText(h.N), plural(h.N, "value", "values"), k, plural(k, "bin", "bins"), vf.Format(h.Width), vf.Format(h.Edges[0]), vf.Format(h.Edges[k]),
		vf.Format(h.Edges[peak]), vf.Format(h.Edges[peak+1]), countText(h.Counts[peak]), 100*float64(h.Counts[peak])/float64(h.N), scale.ValueFormat([]float64{med}, p.opt.Unit).Format(med))
	return desc, name
}
