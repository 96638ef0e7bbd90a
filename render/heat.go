package render

import (
	"fmt"
	"io"
	"math"
	"strings"

	"plumb/layout"
	"plumb/scale"
)

// HeatMatrix is the table a heat map draws: one value per row and column,
// row-major (Values[i*len(Cols)+j] is row i, column j), NaN for a missing
// cell.
type HeatMatrix struct {
	Rows, Cols []string
	Values     []float64
}

// HeatOrder is how the rows or the columns of a heat map are ordered.
type HeatOrder string

// The orders of a heat map's rows and columns.
const (
	// HeatByData keeps the order of the data (the zero value).
	HeatByData HeatOrder = "data"
	// HeatByCluster orders by Ward clustering, neighbours most alike.
	HeatByCluster HeatOrder = "cluster"
	// HeatByLabel orders by label, numbers by value.
	HeatByLabel HeatOrder = "label"
	// HeatByValue orders by the mean of the row (or column), largest
	// first.
	HeatByValue HeatOrder = "value"
)

// HeatOptions configures a heat map. The zero value draws the rows and
// columns in the order given, in a sequential scale (darker = more), or a
// diverging one centred on zero when the values have both signs.
type HeatOptions struct {
	Common
	// RowOrder and ColOrder order the rows and the columns; "" is
	// HeatByData.
	RowOrder, ColOrder HeatOrder
	// Tree draws the dendrogram of the row clustering beside the rows
	// (RowOrder must be HeatByCluster).
	Tree bool
	// Mid, when set, is the middle of a diverging scale: values above and
	// below it take the two hues, darker further from it.
	Mid *float64
	// ValueName says what the values measure, for the colour key.
	ValueName string
	// Unit is appended to the key's tick labels ("%" only is written as a
	// sign; others are left to ValueName).
	Unit string
	// From and To widen the colour scale to reach them: heat maps side by
	// side (small multiples) given one range colour a value alike. A
	// value beyond them still widens the scale; nothing is clipped.
	From, To *float64
}

// HeatRectLimit is the most cells a heat map draws as one <rect> each.
// Above it the cells become one raster image (a pixel per cell, drawn
// crisp) under vector labels and key: 4,000 rects are about 500 kB of SVG,
// and a 9,000 × 20 matrix as rects would be over 20 MB.
const HeatRectLimit = 4000

// Heat draws a heat map and writes it as SVG to w.
func Heat(w io.Writer, m HeatMatrix, opt HeatOptions) ([]Note, error) {
	s, err := HeatScene(m, opt)
	return writeScene(w, s, err)
}

// HeatScene builds a heat map's scene without writing it.
func HeatScene(m HeatMatrix, opt HeatOptions) (*Scene, error) {
	return chartScene(opt.Common, HeatPanel(m, opt))
}

// HeatPanel plans a heat map for a cell of a figure.
func HeatPanel(m HeatMatrix, opt HeatOptions) Panel {
	return newPanel(opt.Common, func(f *frame) (panelPlan, error) {
		f.rampColors("heat maps colour values")
		return planHeat(f, m, opt)
	})
}

// heatPlan is a heat map planned: rows and columns ordered, the colour
// scale chosen.
type heatPlan struct {
	opt      HeatOptions
	m        HeatMatrix
	rowOrder []int // drawing position -> data row
	colOrder []int
	tree     *heatTree // the row dendrogram, when drawn
	colours  heatScale
	missing  int
	key      axis // the colour key's ticks

	labelW               float64 // the row labels' width, set by measure
	rowStride, colStride int     // labels on every k-th row and column, set by draw
}

func checkOrder(name string, o HeatOrder) error {
	switch o {
	case "", HeatByData, HeatByCluster, HeatByLabel, HeatByValue:
		return nil
	}
	return &OptionError{Option: name, Value: string(o), Err: fmt.Errorf("use %s, %s, %s or %s", HeatByCluster, HeatByData, HeatByLabel, HeatByValue)}
}

func planHeat(f *frame, m HeatMatrix, opt HeatOptions) (*heatPlan, error) {
	nr, nc := len(m.Rows), len(m.Cols)
	if nr == 0 || nc == 0 {
		return nil, fmt.Errorf("a heat map needs at least one row and one column; got %d × %d", nr, nc)
	}
	if len(m.Values) != nr*nc {
		return nil, fmt.Errorf("a heat map of %d rows and %d columns needs %d values; got %d", nr, nc, nr*nc, len(m.Values))
	}
	if err := checkOrder("RowOrder", opt.RowOrder); err != nil {
		return nil, err
	}
	if err := checkOrder("ColOrder", opt.ColOrder); err != nil {
		return nil, err
	}
	if err := firstError(checkFinite("Mid", opt.Mid), checkFinite("From", opt.From), checkFinite("To", opt.To)); err != nil {
		return nil, err
	}
	if opt.Tree && opt.RowOrder != HeatByCluster {
		return nil, &OptionError{Option: "Tree", Value: "true", Err: fmt.Errorf("a dendrogram needs the rows in cluster order; add %s cluster", opt.name("RowOrder"))}
	}
	p := &heatPlan{opt: opt, m: m}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, v := range m.Values {
		switch {
		case math.IsNaN(v):
			p.missing++
		case math.IsInf(v, 0):
			return nil, fmt.Errorf("a heat map cell is %v: values must be finite", v)
		default:
			lo, hi = math.Min(lo, v), math.Max(hi, v)
		}
	}
	if p.missing == len(m.Values) {
		return nil, fmt.Errorf("every cell of the %d × %d heat map is missing: nothing to draw", nr, nc)
	}
	if err := p.order(f); err != nil {
		return nil, err
	}
	if opt.From != nil {
		lo = math.Min(lo, *opt.From)
	}
	if opt.To != nil {
		hi = math.Max(hi, *opt.To)
	}
	p.colours = newHeatScale(lo, hi, opt.Mid)
	vf := scale.ValueFormat([]float64{lo, hi}, "")
	switch {
	case opt.Mid != nil:
		f.scene.Note("heat-scale", false, fmt.Sprintf("colours diverge about %s as asked, values from %s to %s", vf.Format(*opt.Mid), vf.Format(lo), vf.Format(hi)))
	case p.colours.diverging:
		f.scene.Note("heat-scale", false, fmt.Sprintf("the values have both signs (%s to %s): colours diverge about zero, darker away from it on either side", vf.Format(lo), vf.Format(hi)))
	default:
		f.scene.Note("heat-scale", false, fmt.Sprintf("one sequential ramp, darker for more, from %s to %s", vf.Format(lo), vf.Format(hi)))
	}
	if p.missing > 0 {
		f.scene.Note("heat-missing", false, fmt.Sprintf("%d of %d cells have no value: drawn in the grey of the key's \"no data\"", p.missing, len(m.Values)))
	}
	return p, nil
}

func (p *heatPlan) domains() (x, y axisDomain) {
	return axisDomain{kind: domainCategory, labels: p.labels(p.m.Cols, p.colOrder)},
		axisDomain{kind: domainCategory, labels: p.labels(p.m.Rows, p.rowOrder)}
}

func (p *heatPlan) labels(all []string, order []int) []string {
	out := make([]string, len(order))
	for i, k := range order {
		out[i] = all[k]
	}
	return out
}

// share keeps the heat map's own rows and columns: their order is the
// clustering's, which a grid cannot merge.
func (p *heatPlan) share(x, y axisDomain) {}

// lh is a line of text at the medium's text size.
func (p *heatPlan) lh(f *frame) float64 { return lineHeight(f.spec.text) }

// rowLabelWidth is the widest row label, at most 40% of the cell.
func (p *heatPlan) rowLabelWidth(f *frame, cellW float64) float64 {
	// At least an ellipsis wide: layout.Wrap gives up below that.
	w := f.measure(layout.Ellipsis, f.spec.text, false)
	for _, r := range p.m.Rows {
		w = math.Max(w, f.measure(r, f.spec.text, false))
	}
	return math.Ceil(math.Min(w, 0.4*cellW))
}

func (p *heatPlan) treeWidth(f *frame) float64 {
	if p.tree == nil {
		return 0
	}
	return 4 * f.spec.text
}

func (p *heatPlan) measure(f *frame, cellW float64, e edges) insets {
	sp := f.spec
	p.labelW = p.rowLabelWidth(f, cellW)
	in := insets{left: p.labelW + 1.5*sp.gap}
	in.right = p.rightW(f)
	in.bottom = p.footHeight(f)
	return in
}

// footHeight is the room under the cells: the column labels, then the
// colour key (its title, the ramp, its tick labels).
func (p *heatPlan) footHeight(f *frame) float64 {
	sp := f.spec
	lh := p.lh(f)
	return sp.gap + lh + f.blockGap() + lh + sp.gap + p.rampHeight(f) + f.xLabelTop(0) + lh
}

func (p *heatPlan) rampHeight(f *frame) float64 { return math.Round(f.spec.text * 0.9) }

// height gives each row at least a line of text when that fits a figure
// about as tall as it is wide, at most two lines, and about a square
// cell in between; more rows share the tallest such figure, and their
// labels are thinned.
func (p *heatPlan) height(f *frame, plotW, room float64) (float64, error) {
	nr := float64(len(p.rowOrder))
	if room > 0 {
		if room < nr && len(p.rowOrder)*len(p.colOrder) <= HeatRectLimit {
			return 0, fmt.Errorf("%d rows do not fit in %g px as cells of at least 1 px; give a taller canvas (%s)", len(p.rowOrder), room, f.c.name("Height"))
		}
		return room, nil
	}
	lh := p.lh(f)
	cell := math.Min(math.Max(plotW/float64(len(p.colOrder)), lh), 2*lh)
	maxH := math.Max(plotW*1.25, 20*lh)
	return math.Round(math.Min(nr*cell, maxH)), nil
}

func (p *heatPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	var pl placed
	p.drawCells(f, plot, &pl)
	p.drawRowLabels(f, plot, &pl)
	bottom := p.drawColLabels(f, plot, &pl)
	if p.tree != nil {
		p.drawTree(f, plot)
	}
	p.drawKey(f, plot, bottom+f.blockGap(), &pl)
	return pl, nil
}

func (p *heatPlan) describe() (string, string) {
	m := p.m
	nc := len(m.Cols)
	hi, lo := -1, -1
	for i, v := range m.Values {
		if math.IsNaN(v) {
			continue
		}
		if hi < 0 || v > m.Values[hi] {
			hi = i
		}
		if lo < 0 || v < m.Values[lo] {
			lo = i
		}
	}
	name := p.opt.ValueName
	if name == "" {
		name = "values"
	}
	f := scale.ValueFormat([]float64{m.Values[lo], m.Values[hi]}, p.opt.Unit)
	var b strings.Builder
	fmt.Fprintf(&b, "Heat map of %s: %d rows by %d columns, darker for more. ", name, len(m.Rows), nc)
	fmt.Fprintf(&b, "Largest %s at %s, %s; smallest %s at %s, %s. ", f.Format(m.Values[hi]), m.Rows[hi/nc], m.Cols[hi%nc], f.Format(m.Values[lo]), m.Rows[lo/nc], m.Cols[lo%nc])
	fmt.Fprintf(&b, "Rows %s; columns %s.", orderWords(p.opt.RowOrder), orderWords(p.opt.ColOrder))
	if p.missing > 0 {
		fmt.Fprintf(&b, " %d cells have no value.", p.missing)
	}
	return b.String(), "Heat map of " + name
}

func orderWords(o HeatOrder) string {
	switch o {
	case HeatByCluster:
		return "in cluster order (Ward), similar ones together"
	case HeatByLabel:
		return "in order of label"
	case HeatByValue:
		return "by mean value, largest first"
	}
	return "in the order of the data"
}
