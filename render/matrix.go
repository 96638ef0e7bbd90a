package render

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"plumb/internal/stats"
	"plumb/layout"
	"plumb/scale"
)

// A Variable is one column of a scatterplot matrix: its name and one value
// per row (NaN where the row has none).
type Variable struct {
	Name   string
	Values []float64
}

// MatrixOptions configures a scatterplot matrix. Its zero value draws
// every pair of variables on shared scales, with points binned in the
// panels of more than BinAbove rows.
type MatrixOptions struct {
	Common
}

// MaxMatrix is the most variables a scatterplot matrix shows: eight give
// 56 scatter panels, about as many as a page holds at a size where each
// still shows its cloud (common practice).
const MaxMatrix = 8

// Matrix draws a scatterplot matrix of the variables and writes it as SVG
// to w. It returns the notes that record what was decided for the caller.
func Matrix(w io.Writer, vars []Variable, opt MatrixOptions) ([]Note, error) {
	s, err := MatrixScene(vars, opt)
	return writeScene(w, s, err)
}

// MatrixScene builds the scatterplot matrix's scene without writing it:
// k variables give a k × k grid, the panel in row i and column j plotting
// variable i (up) against variable j (across). Every panel of a column
// shares its x scale and every panel of a row its y scale, so that one
// variable is measured alike wherever it appears (Cleveland 1993, the
// scatterplot matrix); the diagonal names the variable and shows its
// distribution as a histogram.
func MatrixScene(vars []Variable, opt MatrixOptions) (*Scene, error) {
	k := len(vars)
	if k < 2 {
		return nil, fmt.Errorf("a scatterplot matrix needs at least 2 variables, got %d", k)
	}
	if k > MaxMatrix {
		return nil, &RefusalError{Reason: fmt.Sprintf("%d variables make %d panels, too small to read", k, k*k),
			Instead: fmt.Sprintf("choose at most %d variables, or draw the pairs that matter as scatter plots", MaxMatrix)}
	}
	n := len(vars[0].Values)
	for _, v := range vars[1:] {
		if len(v.Values) != n {
			return nil, fmt.Errorf("variable %q has %d values and %q has %d: give one value per row in every variable", vars[0].Name, n, v.Name, len(v.Values))
		}
	}
	c := opt.Common
	if c.Width == 0 && (c.Medium == "" || c.Medium == Screen) {
		// A screen figure widens to give each panel about 150 px at
		// 12 px text; print and slide keep their fixed canvas.
		sp, err := c.Medium.spec()
		if err != nil {
			return nil, &OptionError{Option: "Medium", Err: err}
		}
		c.Width = math.Max(sp.width, math.Ceil(float64(k)*sp.text*12.5+sp.text*5))
	}
	f, err := newFrame(c)
	if err != nil {
		return nil, err
	}
	m := &matrixChart{f: f, vars: vars, n: n, bins: &binShades{}}
	res, err := m.draw()
	if err != nil {
		return nil, err
	}
	return f.finish(res.bottom), nil
}

// draw plans and draws the grid, the key and the description; the result
// says where the panels went.
func (m *matrixChart) draw() (gridResult, error) {
	f := m.f
	if err := m.plan(); err != nil {
		return gridResult{}, err
	}
	res, err := f.drawGrid(m.cells, gridOptions{cols: len(m.vars), aspect: 1}, f.plotTop())
	if err != nil {
		return gridResult{}, err
	}
	if m.binned {
		res.bottom = m.drawKey(res.bottom)
	}
	f.scene.Desc, f.scene.Title = m.describe(), firstNonEmpty(f.scene.Title, "Scatterplot matrix of "+strings.Join(m.names(), ", "))
	return res, nil
}

func firstNonEmpty(a, b string) string {
	if a != "" {
		return a
	}
	return b
}

// matrixChart is a scatterplot matrix being planned.
type matrixChart struct {
	f      *frame
	vars   []Variable
	n      int
	bins   *binShades
	binned bool // some panel bins its points
	maxBin int  // points in the fullest panel
	cells  []gridCell
}

func (m *matrixChart) names() []string {
	out := make([]string, len(m.vars))
	for i, v := range m.vars {
		out[i] = v.Name
	}
	return out
}

// plan makes the k × k panels: each variable's domain and tick kind is
// decided once, over all its values, and given to every panel of its row
// and column, with one margin, so that the scales agree.
func (m *matrixChart) plan() error {
	f := m.f
	k := len(m.vars)
	doms := make([]axisDomain, k)
	kinds := make([]valueKind, k)
	missingRows := 0
	for i := range m.n {
		for _, v := range m.vars {
			if !finiteValue(v.Values[i]) {
				missingRows++
				break
			}
		}
	}
	for i, v := range m.vars {
		lo, hi, ok := dataRange(v.Values)
		if !ok {
			return fmt.Errorf("variable %q has no values: every row misses it", v.Name)
		}
		if err := axisRoom(fmt.Sprintf("values of %q", v.Name), lo, hi); err != nil {
			return err
		}
		kinds[i] = plainNumberKind(v.Values)
		doms[i] = axisDomain{kind: domainNumber, lo: lo, hi: hi, integer: kinds[i].integer}
	}
	if missingRows > 0 {
		f.scene.Note("missing", true, fmt.Sprintf("%s miss a value in some variable: each panel leaves out the rows that miss either of its two", groupedCount(missingRows, "row", "rows")))
	}
	margin := 2 * hexRadius(f.spec, true)
	for r := range k {
		for c := range k {
			if r == c {
				d := &diagPlan{name: m.vars[r].Name, values: m.vars[r].Values, fx: doms[r], fy: doms[r], kx: kinds[r], ky: kinds[r], margin: margin}
				m.cells = append(m.cells, gridCell{plan: d})
				continue
			}
			x, y := m.vars[c].Values, m.vars[r].Values
			sub := &frame{c: f.c, spec: f.spec, fonts: f.fonts, th: f.th, width: f.width, slack: f.slack, scene: &Scene{}}
			p, err := newScatterPlan(sub, x, y, ScatterOptions{XName: m.vars[c].Name, YName: m.vars[r].Name})
			if err != nil {
				return fmt.Errorf("%s against %s: %w", m.vars[r].Name, m.vars[c].Name, err)
			}
			p.titles, p.ownKey, p.aspect = false, false, 1
			p.fixed, p.fx, p.fy, p.marginPx = true, doms[c], doms[r], margin
			p.kx, p.ky = kinds[c], kinds[r]
			p.bins = m.bins
			if p.binned {
				m.binned = true
			}
			m.maxBin = max(m.maxBin, len(p.x))
			m.cells = append(m.cells, gridCell{plan: p})
		}
	}
	if m.binned {
		f.scene.Note("binned", true, fmt.Sprintf("panels of more than %s points draw hexagonal bins, darker for more points, one shading for all panels", scale.Format{Group: true}.Format(BinAbove)))
	} else if op := opacityFor(m.maxBin); op > 0 {
		f.scene.Note("translucent", false, fmt.Sprintf("drew the points translucent (opacity %s), so that where they pile up reads darker", strconv.FormatFloat(op, 'f', -1, 64)))
	}
	return nil
}

// drawKey draws the shading's key under the grid and returns the y under it.
func (m *matrixChart) drawKey(bottom float64) float64 {
	f, sp := m.f, m.f.spec
	items := m.bins.keyItems(f, m.bins.max)
	lines := f.flowEntries(items, f.width-sp.pad, sp.pad, bottom+sp.gap, true)
	return bottom + sp.gap + float64(len(lines))*lineHeight(sp.text)
}

// describe names the variables and each pair's correlation, the figure's
// content for a reader who cannot see it.
func (m *matrixChart) describe() string {
	var b strings.Builder
	fmt.Fprintf(&b, "Scatterplot matrix of %d variables (%s) over %s: each pair plotted against each other on shared scales, each variable's distribution on the diagonal.",
		len(m.vars), strings.Join(m.names(), ", "), groupedCount(m.n, "row", "rows"))
	for i := range m.vars {
		for j := i + 1; j < len(m.vars); j++ {
			if l, err := stats.LeastSquares(m.vars[j].Values, m.vars[i].Values); err == nil {
				fmt.Fprintf(&b, " %s and %s: r = %s.", m.vars[i].Name, m.vars[j].Name, fmtFit(l.R))
			}
		}
	}
	return b.String()
}

// diagPlan is a diagonal panel of a scatterplot matrix: the variable's
// name over a histogram of its values, on the scales of its row and
// column, so that the tick labels of the outer panels hold for it too.
type diagPlan struct {
	name   string
	values []float64
	fx, fy axisDomain
	dx, dy axisDomain
	kx, ky valueKind
	margin float64
	nbins  int
}

func (p *diagPlan) domains() (axisDomain, axisDomain) { return p.fx, p.fy }
func (p *diagPlan) share(x, y axisDomain)             { p.dx, p.dy = x, y }

func (p *diagPlan) measure(f *frame, cellW float64, e edges) insets {
	sp := f.spec
	face := f.fonts.Face(false)
	in := insets{top: math.Ceil((face.Ascent(sp.text) + face.Descent(sp.text)) / 2)}
	if e.left {
		in.left = tickLabelWidth(f, p.dy, p.ky, false) + sp.gap
	}
	if e.bottom {
		in.bottom = f.xLabelTop(0) + lineHeight(sp.text)
	}
	in.right = math.Ceil(tickLabelWidth(f, p.dx, p.kx, true)/2) + 1
	return in
}

func (p *diagPlan) height(f *frame, plotW, room float64) (float64, error) {
	if room > 0 {
		return room, nil
	}
	return plotW, nil
}

// sturgesBins is the number of histogram bins for n values: ⌈log₂ n⌉ + 1
// (Sturges 1926), at most 30 and at most one per 4 px of width, so that
// every bar is seen.
func sturgesBins(n int, width float64) int {
	k := int(math.Ceil(math.Log2(float64(max(n, 1))))) + 1
	return max(1, min(k, 30, int(width/4)))
}

func (p *diagPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	sp := f.spec
	ax, ay := fitNumberAxes(f, p.dx, p.dy, p.kx, p.ky, plot.W, plot.H, p.margin)
	xs := scale.Linear{D0: ax.d0, D1: ax.d1, R0: plot.X, R1: plot.X + plot.W}
	ys := scale.Linear{D0: ay.d0, D1: ay.d1, R0: plot.Y + plot.H, R1: plot.Y}
	f.drawNumberAxes(ax, ay, xs, ys, plot, e)
	lh := lineHeight(sp.text)
	asc := f.fonts.Face(true).Ascent(sp.text)
	lines, cut := f.wrap(p.name, sp.text, true, plot.W-2*sp.gap, 1)
	if len(lines) > 0 {
		tip := ""
		if cut {
			tip = p.name
		}
		f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: round2(plot.X + sp.gap), Y: round2(plot.Y + sp.gap + asc), Text: lines[0], Size: sp.text, Bold: true, Fill: f.th.text, Tooltip: tip})
	}
	// The histogram fills the plot under the name, its bins over the
	// data's range on the column's x scale.
	var vals []float64
	for _, v := range p.values {
		if finiteValue(v) {
			vals = append(vals, v)
		}
	}
	lo, hi, _ := dataRange(vals)
	p.nbins = sturgesBins(len(vals), xs.Map(hi)-xs.Map(lo))
	if hi == lo {
		p.nbins = 1
	}
	counts := make([]int, p.nbins)
	for _, v := range vals {
		i := 0
		if hi > lo {
			i = min(p.nbins-1, int((v-lo)/(hi-lo)*float64(p.nbins)))
		}
		counts[i]++
	}
	top := 0
	for _, c := range counts {
		top = max(top, c)
	}
	room := plot.H - lh - sp.gap
	base := plot.Y + plot.H
	for i, c := range counts {
		if c == 0 || room <= 0 {
			continue
		}
		a, b := lo+(hi-lo)*float64(i)/float64(p.nbins), lo+(hi-lo)*float64(i+1)/float64(p.nbins)
		x0, x1 := round2(xs.Map(a)), round2(xs.Map(b))
		if hi == lo {
			x0, x1 = round2(xs.Map(lo)-2), round2(xs.Map(lo)+2)
		}
		if x1-x0 > 3 {
			x1 -= 1 // a hairline between neighbouring bars
		}
		h := round2(room * float64(c) / float64(top))
		f.scene.Add(Mark{Kind: Rect, Class: "plumb-dist", X: x0, Y: round2(base - h), W: round2(x1 - x0), H: h, Fill: f.th.neutral,
			Attrs: []Attr{{"label", dataNumber(a) + "–" + dataNumber(b)}, {"value", strconv.Itoa(c)}}})
	}
	return placed{xs: xs, ys: ys}, nil
}

func (p *diagPlan) describe() (string, string) {
	return fmt.Sprintf("The distribution of %s.", p.name), p.name
}
