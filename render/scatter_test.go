package render

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/scale"
)

// cloud invents n points in g groups, each group a tilted ellipse of its
// own, shaped like measurements of routes.
func scatterCloud(seed uint64, n, g int) (x, y []float64, groups []string) {
	r := rand.New(rand.NewPCG(seed, 7))
	for i := range n {
		k := i % max(1, g)
		cx := 10 + 30*float64(k)
		v := cx + r.NormFloat64()*6
		x = append(x, math.Round(v*10)/10)
		y = append(y, math.Round((3+0.4*v+float64(k)*8+r.NormFloat64()*2)*100)/100)
		groups = append(groups, fmt.Sprintf("Vessel class %c", 'A'+k))
	}
	return x, y, groups
}

func scatterMarks(s *Scene, kind Kind, class string) []Mark {
	var out []Mark
	for _, m := range s.Marks {
		if m.Kind == kind && strings.Contains(" "+m.Class+" ", " "+class+" ") {
			out = append(out, m)
		}
	}
	return out
}

func scatterAttr(m Mark, name string) (string, bool) {
	for _, a := range m.Attrs {
		if a.Name == name {
			return a.Value, true
		}
	}
	return "", false
}

func scatterNoteCodes(s *Scene) []string {
	var out []string
	for _, n := range s.Notes {
		out = append(out, n.Code)
	}
	return out
}

// Sixty points give sixty circles, each carrying its data, in its group's
// colour.
func TestScatterOneMarkPerPoint(t *testing.T) {
	x, y, groups := scatterCloud(1, 60, 3)
	for _, g := range [][]string{nil, groups} {
		s, err := ScatterScene(x, y, ScatterOptions{Common: Common{Title: "Sixty"}, Groups: g, XName: "km", YName: "minutes"})
		require.NoError(t, err)
		marks := scatterMarks(s, Circle, "plumb-mark")
		require.Len(t, marks, 60)
		colours := map[Colour]bool{}
		for i, m := range marks {
			dx, _ := scatterAttr(m, "x")
			dy, _ := scatterAttr(m, "y")
			assert.Equal(t, dataNumber(x[i]), dx)
			assert.Equal(t, dataNumber(y[i]), dy)
			colours[m.Fill] = true
			if g != nil {
				dg, _ := scatterAttr(m, "group")
				assert.Equal(t, g[i], dg)
			}
			assert.Zero(t, m.Opacity, "60 points are drawn opaque")
		}
		assert.Len(t, colours, max(1, len(g)/20), "one colour per group")
		assertNoOverlap(t, s)
		assert.NotContains(t, scatterNoteCodes(s), "binned")
	}
}

// Points map to their data linearly on both axes, and stay inside the
// plot: the y axis need not include zero.
func TestScatterPositionsAreLinear(t *testing.T) {
	x := []float64{1000, 1010, 1020, 1030}
	y := []float64{50.5, 51, 52.5, 50}
	s, err := ScatterScene(x, y, ScatterOptions{})
	require.NoError(t, err)
	marks := scatterMarks(s, Circle, "plumb-mark")
	require.Len(t, marks, 4)
	kx := (marks[1].X - marks[0].X) / (x[1] - x[0])
	ky := (marks[1].Y - marks[0].Y) / (y[1] - y[0])
	for i, m := range marks {
		assert.InDelta(t, marks[0].X+kx*(x[i]-x[0]), m.X, 0.02)
		assert.InDelta(t, marks[0].Y+ky*(y[i]-y[0]), m.Y, 0.02)
	}
	assert.Negative(t, ky, "up is more")
	// The y ticks stay near the data: zero is far below 50 and not shown.
	for _, m := range scatterMarks(s, Text, "plumb-tick") {
		assert.NotEqual(t, "0", m.Text)
	}
}

// Above BinAbove points a scatter plot draws bins: the figure stays small
// whatever the count, says so, and counts every point.
func TestScatterBinsAboveThreshold(t *testing.T) {
	for _, n := range []int{BinAbove, BinAbove + 1, 200_000} {
		r := rand.New(rand.NewPCG(uint64(n), 3))
		x, y := make([]float64, n), make([]float64, n)
		for i := range x {
			x[i] = r.NormFloat64() * 10
			y[i] = x[i]*0.5 + r.NormFloat64()*4
		}
		s, err := ScatterScene(x, y, ScatterOptions{Fit: "line"})
		require.NoError(t, err)
		var buf bytes.Buffer
		require.NoError(t, WriteSVG(&buf, s))
		circles, bins := scatterMarks(s, Circle, "plumb-mark"), scatterMarks(s, Path, "plumb-bin")
		if n <= BinAbove {
			assert.Len(t, circles, n)
			assert.Empty(t, bins)
			assert.Contains(t, scatterNoteCodes(s), "translucent")
			continue
		}
		assert.Empty(t, circles)
		total := 0
		for _, b := range bins {
			c, _ := scatterAttr(b, "count")
			var k int
			fmt.Sscan(c, &k)
			total += k
		}
		assert.Equal(t, n, total, "every point is in a bin")
		assert.Less(t, len(s.Marks), 20_000, "n = %d", n)
		assert.Less(t, buf.Len(), 2<<20, "n = %d", n)
		assert.Contains(t, scatterNoteCodes(s), "binned")
		assert.NotEmpty(t, scatterMarks(s, Path, "plumb-swatch"), "a colour key")
		assertNoOverlap(t, s)
	}
}

// The shades of the bins darken with the count and their classes cover
// every count from 1 to the fullest cell.
func TestBinShades(t *testing.T) {
	for _, top := range []int{1, 2, 5, 6, 7, 100, 27_171} {
		s := shadesFor(top)
		assert.Equal(t, 1, s.lows[0])
		for i := 1; i < len(s.lows); i++ {
			assert.Greater(t, s.lows[i], s.lows[i-1])
			assert.LessOrEqual(t, s.lows[i], top)
			l0 := s.colours[i-1].SRGB()
			l1 := s.colours[i].SRGB()
			assert.Greater(t, l0.R+l0.G+l0.B, l1.R+l1.G+l1.B, "more is darker")
		}
		assert.Equal(t, s.colours[len(s.colours)-1], s.colour(top))
		assert.Equal(t, s.colours[0], s.colour(1))
	}
}

func TestScatterFits(t *testing.T) {
	// Hand computation (see internal/stats): y = 2.2 + 0.6x, r = 0.77.
	x, y := []float64{1, 2, 3, 4, 5}, []float64{2, 4, 5, 4, 5}
	s, err := ScatterScene(x, y, ScatterOptions{Fit: "line"})
	require.NoError(t, err)
	fit := scatterMarks(s, Path, "plumb-fit")
	require.Len(t, fit, 1)
	require.Len(t, fit[0].Lines[0], 2, "a line from the least x to the greatest")
	found := false
	for _, n := range s.Notes {
		if n.Code == "fit" {
			found = true
			assert.Contains(t, n.Text, "y = 2.2 + 0.6·x")
			assert.Contains(t, n.Text, "r = 0.77")
			assert.Contains(t, n.Text, "R² = 0.60")
		}
	}
	assert.True(t, found)

	x, y, _ = scatterCloud(4, 200, 1)
	s, err = ScatterScene(x, y, ScatterOptions{Fit: "loess"})
	require.NoError(t, err)
	fit = scatterMarks(s, Path, "plumb-fit")
	require.Len(t, fit, 1)
	assert.Len(t, fit[0].Lines[0], loessPoints)
}

func TestScatterErrors(t *testing.T) {
	var oe *OptionError
	_, err := ScatterScene([]float64{1, 2}, []float64{1, 2}, ScatterOptions{Fit: "cubic"})
	require.ErrorAs(t, err, &oe)
	assert.Equal(t, "Fit", oe.Option)
	_, err = ScatterScene([]float64{1, 2}, []float64{1}, ScatterOptions{})
	assert.ErrorContains(t, err, "one y per x")
	_, err = ScatterScene([]float64{math.NaN()}, []float64{1}, ScatterOptions{})
	assert.ErrorContains(t, err, "no points")
	_, err = ScatterScene([]float64{3, 3, 3}, []float64{1, 2, 3}, ScatterOptions{Fit: "line"})
	assert.ErrorContains(t, err, "Fit line: cannot fit a line to these points: every x value is the same")
	_, err = ScatterScene([]float64{1, 2, 3}, []float64{1, 2, 3}, ScatterOptions{Fit: "loess"})
	assert.ErrorContains(t, err, "Fit loess: cannot fit a curve to 3 points")
	x, y, _ := scatterCloud(2, 40, 1)
	g := make([]string, 40)
	for i := range g {
		g[i] = fmt.Sprint("group ", i%9)
	}
	_, err = ScatterScene(x, y, ScatterOptions{Groups: g})
	assert.True(t, errors.Is(err, ErrRefused), "%v", err)
	// Missing values are left out with a note.
	s, err := ScatterScene([]float64{1, 2, math.NaN(), 4}, []float64{1, 2, 3, math.Inf(1)}, ScatterOptions{})
	require.NoError(t, err)
	assert.Len(t, scatterMarks(s, Circle, "plumb-mark"), 2)
	assert.Contains(t, scatterNoteCodes(s), "missing")
}

// Whatever the data, groups, medium and canvas, text stays on the canvas
// and apart: group labels where they are unambiguous, else a legend.
func TestScatterTextInsideAndApart(t *testing.T) {
	r := rand.New(rand.NewPCG(11, 12))
	media := []Medium{Screen, Print, Slide}
	for trial := range 40 {
		n := 5 + r.IntN(400)
		g := r.IntN(6)
		x, y, groups := scatterCloud(uint64(trial), n, max(g, 1))
		if g == 0 {
			groups = nil
		}
		scaleY := math.Pow(10, float64(r.IntN(7)-2))
		for i := range y {
			y[i] *= scaleY
		}
		c := Common{Title: "Trial", Medium: media[r.IntN(3)]}
		if r.IntN(3) == 0 && c.Medium != Print {
			c.Width = 400 + float64(r.IntN(900))
		}
		opt := ScatterOptions{Common: c, Groups: groups, XName: "crossing length in kilometres", YName: "minutes from quay to quay"}
		if r.IntN(2) == 0 {
			opt.Fit = "loess"
		}
		s, err := ScatterScene(x, y, opt)
		require.NoError(t, err, "trial %d", trial)
		t.Run(fmt.Sprint(trial), func(t *testing.T) { assertNoOverlap(t, s) })
		labels := 0
		for _, m := range scatterMarks(s, Text, "plumb-label") {
			if m.Text != "" {
				labels++
			}
		}
		if g > 1 {
			assert.Equal(t, g, labels, "trial %d: each group named once, beside its points or in the legend", trial)
		}
	}
}

// Well separated groups are named beside their points, not in a legend.
func TestScatterDirectLabels(t *testing.T) {
	x, y, groups := scatterCloud(5, 90, 3)
	s, err := ScatterScene(x, y, ScatterOptions{Groups: groups})
	require.NoError(t, err)
	assert.NotContains(t, scatterNoteCodes(s), "legend")
	assert.Empty(t, scatterMarks(s, Circle, "plumb-swatch"))
	assert.Len(t, scatterMarks(s, Text, "plumb-label"), 3)
}

// newMatrixChart lays out a matrix as MatrixScene does, keeping the grid's
// result for the test.
func drawMatrix(t *testing.T, vars []Variable, c Common) (*Scene, gridResult) {
	t.Helper()
	f, err := newFrame(c)
	require.NoError(t, err)
	m := &matrixChart{f: f, vars: vars, n: len(vars[0].Values), bins: &binShades{}}
	res, err := m.draw()
	require.NoError(t, err)
	return f.finish(res.bottom), res
}

func matrixVars(seed uint64, n int) []Variable {
	r := rand.New(rand.NewPCG(seed, 1))
	vars := []Variable{{Name: "crossing_km"}, {Name: "minutes"}, {Name: "fuel_l"}, {Name: "wind_kn"}}
	for range n {
		km := 3 + r.Float64()*40
		wind := math.Abs(r.NormFloat64() * 8)
		vars[0].Values = append(vars[0].Values, math.Round(km))
		vars[1].Values = append(vars[1].Values, km*2.2+r.NormFloat64()*3)
		vars[2].Values = append(vars[2].Values, km*40+r.NormFloat64()*50)
		vars[3].Values = append(vars[3].Values, wind)
	}
	return vars
}

// Every panel of a column has one x scale and every panel of a row one y
// scale: one pixel per unit and one origin, whatever the panel's own data.
func TestMatrixSharesScalesAlongRowsAndColumns(t *testing.T) {
	for _, n := range []int{60, BinAbove + 500} {
		vars := matrixVars(uint64(n), n)
		// A missing value in one variable must not change any scale.
		vars[2].Values[0] = math.NaN()
		s, res := drawMatrix(t, vars, Common{Width: 900})
		k := len(vars)
		require.Len(t, res.placed, k*k)
		perUnit := func(l scale.Linear) float64 { return (l.R1 - l.R0) / (l.D1 - l.D0) }
		for i, p := range res.placed {
			r, c := i/k, i%k
			col, row := res.placed[c], res.placed[r*k]
			assert.InDelta(t, perUnit(col.xs), perUnit(p.xs), 1e-9, "panel %d,%d x", r, c)
			assert.InDelta(t, perUnit(row.ys), perUnit(p.ys), 1e-9, "panel %d,%d y", r, c)
			assert.InDelta(t, col.xs.D0, p.xs.D0, 1e-9)
			assert.InDelta(t, row.ys.D0, p.ys.D0, 1e-9)
			assert.InDelta(t, res.cells[c].X, res.cells[i].X, 1e-9, "columns line up")
			assert.InDelta(t, res.cells[r*k].Y, res.cells[i].Y, 1e-9, "rows line up")
		}
		assert.Equal(t, k*k, classCount(s, "plumb-panel"))
		assert.Positive(t, classCount(s, "plumb-dist"), "histograms on the diagonal")
		assertNoOverlap(t, s)
		if n > BinAbove {
			assert.Positive(t, classCount(s, "plumb-bin"))
			assert.Zero(t, len(scatterMarks(s, Circle, "plumb-mark")))
		} else {
			assert.Len(t, scatterMarks(s, Circle, "plumb-mark"), k*(k-1)*n-2*(k-1), "one circle per point and panel, less the missing value's")
		}
	}
}

func TestMatrixErrors(t *testing.T) {
	_, err := MatrixScene([]Variable{{Name: "a", Values: []float64{1}}}, MatrixOptions{})
	assert.ErrorContains(t, err, "at least 2")
	_, err = MatrixScene([]Variable{{Name: "a", Values: []float64{1, 2}}, {Name: "b", Values: []float64{1}}}, MatrixOptions{})
	assert.ErrorContains(t, err, "one value per row")
	_, err = MatrixScene([]Variable{{Name: "a", Values: []float64{1, 2}}, {Name: "b", Values: []float64{math.NaN(), math.NaN()}}}, MatrixOptions{})
	assert.ErrorContains(t, err, `"b" has no values`)
	vars := make([]Variable, MaxMatrix+1)
	for i := range vars {
		vars[i] = Variable{Name: fmt.Sprint(i), Values: []float64{1, 2}}
	}
	_, err = MatrixScene(vars, MatrixOptions{})
	assert.True(t, errors.Is(err, ErrRefused))
}

// A matrix of four variables renders at every medium with its text apart.
func TestMatrixMedia(t *testing.T) {
	vars := matrixVars(3, 120)
	for _, m := range []Medium{Screen, Slide} {
		s, err := MatrixScene(vars, MatrixOptions{Common: Common{Title: "Four", Medium: m}})
		require.NoError(t, err, m)
		assert.Equal(t, 16, classCount(s, "plumb-panel"))
		assertNoOverlap(t, s)
		assert.Contains(t, s.Desc, "r = ")
	}
}

func BenchmarkScatter200k(b *testing.B) {
	r := rand.New(rand.NewPCG(200, 0))
	x, y := make([]float64, 200_000), make([]float64, 200_000)
	for i := range x {
		x[i] = r.ExpFloat64() * 20
		y[i] = 10 + 2.2*x[i] + r.NormFloat64()*8
	}
	var size, elems int
	for b.Loop() {
		s, err := ScatterScene(x, y, ScatterOptions{Fit: "loess"})
		if err != nil {
			b.Fatal(err)
		}
		var buf bytes.Buffer
		if err := WriteSVG(&buf, s); err != nil {
			b.Fatal(err)
		}
		size, elems = buf.Len(), len(s.Marks)
	}
	b.ReportMetric(float64(size), "bytes")
	b.ReportMetric(float64(elems), "marks")
}

func BenchmarkMatrix6x100k(b *testing.B) {
	r := rand.New(rand.NewPCG(6, 100))
	vars := make([]Variable, 6)
	for i := range vars {
		vars[i].Name = fmt.Sprint("measure ", i+1)
		vars[i].Values = make([]float64, 100_000)
	}
	for j := range 100_000 {
		base := r.NormFloat64()
		for i := range vars {
			vars[i].Values[j] = base*float64(i) + r.NormFloat64()*float64(i+1)
		}
	}
	var size, elems int
	for b.Loop() {
		s, err := MatrixScene(vars, MatrixOptions{})
		if err != nil {
			b.Fatal(err)
		}
		var buf bytes.Buffer
		if err := WriteSVG(&buf, s); err != nil {
			b.Fatal(err)
		}
		size, elems = buf.Len(), len(s.Marks)
	}
	b.ReportMetric(float64(size), "bytes")
	b.ReportMetric(float64(elems), "marks")
}

// Scatter panels join a figure as plans: with shared scales every panel
// draws one pixel per unit, whatever its own points.
func TestScatterPanelsShareScalesInAFigure(t *testing.T) {
	f, err := newFrame(Common{Width: 900})
	require.NoError(t, err)
	var cells []gridCell
	for i := range 4 {
		x, y, _ := scatterCloud(uint64(i), 30+i*20, 1)
		for j := range y {
			y[j] *= float64(i + 1)
		}
		p := ScatterPanel(x, y, ScatterOptions{Common: Common{Title: fmt.Sprint("Route ", i+1)}, YName: "minutes"})
		plan, err := p.plan(f)
		require.NoError(t, err)
		cells = append(cells, gridCell{title: p.Title, plan: plan})
	}
	res, err := f.drawGrid(cells, gridOptions{shareX: true, shareY: true}, f.plotTop())
	require.NoError(t, err)
	perUnit := func(l scale.Linear) float64 { return (l.R1 - l.R0) / (l.D1 - l.D0) }
	for i, p := range res.placed {
		assert.InDelta(t, perUnit(res.placed[0].xs), perUnit(p.xs), 1e-9, "panel %d x", i)
		assert.InDelta(t, perUnit(res.placed[0].ys), perUnit(p.ys), 1e-9, "panel %d y", i)
	}
	s := f.finish(res.bottom)
	assertNoOverlap(t, s)
	assert.Equal(t, 4, classCount(s, "plumb-panel"))
}
