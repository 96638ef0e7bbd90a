package render

import (
	"bytes"
	"errors"
	"math"
	"math/rand/v2"
	"strconv"
	"strings"
	"testing"

	"plumb/internal/stats"
	"plumb/palette"
)

// structuredMatrix is n rows of d columns drawn from a smooth bump that
// drifts with a hidden row number, in shuffled order (invented values
// shaped like expression profiles).
func structuredMatrix(seed uint64, n, d int) HeatMatrix {
	rng := rand.New(rand.NewPCG(seed, 1))
	m := HeatMatrix{Rows: make([]string, n), Cols: make([]string, d), Values: make([]float64, n*d)}
	for j := range d {
		m.Cols[j] = "s" + strconv.Itoa(j+1)
	}
	perm := rng.Perm(n)
	for i := range n {
		m.Rows[i] = "r" + strconv.Itoa(i+1)
		g := float64(perm[i]) / float64(n) * float64(d)
		for k := range d {
			x := float64(k) - g
			m.Values[i*d+k] = 10*math.Exp(-x*x/8) + rng.NormFloat64()*0.5
		}
	}
	return m
}

// cell is one drawn heat cell read back from the scene.
type cell struct {
	row, col string
	value    float64
	fill     Colour
}

func cellsOf(t *testing.T, s *Scene) []cell {
	t.Helper()
	var out []cell
	for _, mk := range s.Marks {
		if mk.Kind != Rect || mk.Class != "plumb-mark" {
			continue
		}
		c := cell{fill: mk.Fill}
		for _, a := range mk.Attrs {
			switch a.Name {
			case "row":
				c.row = a.Value
			case "col":
				c.col = a.Value
			case "value":
				v, err := strconv.ParseFloat(a.Value, 64)
				if err != nil {
					t.Fatalf("data-value %q", a.Value)
				}
				c.value = v
			}
		}
		out = append(out, c)
	}
	return out
}

// Issue 11: a shuffled 60 × 12 heat map in cluster order is at least 3×
// smoother (sum of distances between neighbouring rows) than the input
// order, measured on the drawn cells.
func TestHeatClusterOrderIsSmoother(t *testing.T) {
	m := structuredMatrix(5, 60, 12)
	s, err := HeatScene(m, HeatOptions{RowOrder: HeatByCluster})
	if err != nil {
		t.Fatal(err)
	}
	cells := cellsOf(t, s)
	if len(cells) != 60*12 {
		t.Fatalf("%d cells drawn, want %d", len(cells), 60*12)
	}
	var drawn []float64
	for _, c := range cells {
		drawn = append(drawn, c.value)
	}
	identity := make([]int, 60)
	order := make([]int, 60)
	for i := range identity {
		identity[i], order[i] = i, i
	}
	in := stats.PathLength(m.Values, 12, identity)
	out := stats.PathLength(drawn, 12, order)
	if out*3 > in {
		t.Errorf("drawn order path %.1f, input %.1f: %.2f× smoother, want ≥ 3×", out, in, in/out)
	}
}

// Colours of heat cells fall in lightness as values rise (sequential), and
// away from the middle (diverging) (DESIGN.md rule 11).
func TestHeatLightnessMonotone(t *testing.T) {
	cases := []struct {
		name string
		m    HeatMatrix
		mid  *float64
		ref  float64 // lightness falls with |value - ref|
	}{
		{"sequential", shifted(structuredMatrix(2, 30, 10), 5), nil, math.Inf(-1)},
		{"diverging at zero", shifted(structuredMatrix(3, 30, 10), -5), nil, 0},
		{"diverging at 4", structuredMatrix(4, 30, 10), ptr(4.0), 4},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			s, err := HeatScene(c.m, HeatOptions{Mid: c.mid})
			if err != nil {
				t.Fatal(err)
			}
			cells := cellsOf(t, s)
			for side := -1.0; side <= 1; side += 2 {
				var pts []cell
				for _, x := range cells {
					if math.IsInf(c.ref, -1) || (x.value-c.ref)*side >= 0 {
						pts = append(pts, x)
					}
				}
				for i := range pts {
					for j := range pts {
						di, dj := math.Abs(pts[i].value-c.ref), math.Abs(pts[j].value-c.ref)
						if math.IsInf(c.ref, -1) {
							di, dj = pts[i].value, pts[j].value
						}
						li := palette.SRGBToLab(pts[i].fill.SRGB()).L
						lj := palette.SRGBToLab(pts[j].fill.SRGB()).L
						if di < dj && li < lj-1e-9 {
							t.Fatalf("value %g (L* %.2f) darker than %g (L* %.2f)", pts[i].value, li, pts[j].value, lj)
						}
					}
				}
			}
		})
	}
}

func shifted(m HeatMatrix, by float64) HeatMatrix {
	for i := range m.Values {
		m.Values[i] += by
	}
	return m
}

func ptr[T any](v T) *T { return &v }

// Above HeatRectLimit cells the cells are one image with a pixel per cell,
// the labels thinned, and both decisions noted.
func TestHeatImageMode(t *testing.T) {
	m := structuredMatrix(9, 500, 12)
	m.Values[7] = math.NaN()
	s, err := HeatScene(m, HeatOptions{RowOrder: HeatByCluster, Tree: true})
	if err != nil {
		t.Fatal(err)
	}
	var img *Mark
	labels := 0
	for i, mk := range s.Marks {
		if mk.Kind == Image && mk.Class == "plumb-mark plumb-cells" {
			img = &s.Marks[i]
		}
		if mk.Kind == Rect && strings.HasPrefix(mk.Class, "plumb-mark") {
			t.Fatal("a rect per cell above the limit")
		}
		if mk.Kind == Text && mk.Class == "plumb-label" && strings.HasPrefix(mk.Text, "r") {
			labels++
		}
	}
	if img == nil || img.Img.Bounds().Dx() != 12 || img.Img.Bounds().Dy() != 500 {
		t.Fatalf("no 12×500 image of cells")
	}
	if labels == 0 || labels >= 500 {
		t.Errorf("%d row labels of 500, want them thinned", labels)
	}
	codes := map[string]bool{}
	for _, n := range s.Notes {
		codes[n.Code] = true
	}
	for _, c := range []string{"heat-image", "heat-thin-rows", "heat-cluster", "heat-missing", "heat-cluster-missing"} {
		if !codes[c] {
			t.Errorf("no %s note in %v", c, s.Notes)
		}
	}
	var buf bytes.Buffer
	if err := WriteSVG(&buf, s); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(buf.String(), "data:image/png;base64,") {
		t.Error("image not embedded as a PNG data URI")
	}
}

func TestHeatErrors(t *testing.T) {
	ok := HeatMatrix{Rows: []string{"a", "b"}, Cols: []string{"x"}, Values: []float64{1, 2}}
	cases := []struct {
		name   string
		m      HeatMatrix
		opt    HeatOptions
		option string // the OptionError's option, "" for a plain error
	}{
		{"no rows", HeatMatrix{Cols: []string{"x"}}, HeatOptions{}, ""},
		{"wrong count", HeatMatrix{Rows: []string{"a"}, Cols: []string{"x"}, Values: []float64{1, 2}}, HeatOptions{}, ""},
		{"all missing", HeatMatrix{Rows: []string{"a"}, Cols: []string{"x"}, Values: []float64{math.NaN()}}, HeatOptions{}, ""},
		{"infinite", HeatMatrix{Rows: []string{"a"}, Cols: []string{"x"}, Values: []float64{math.Inf(1)}}, HeatOptions{}, ""},
		{"bad order", ok, HeatOptions{RowOrder: "size"}, "RowOrder"},
		{"bad column order", ok, HeatOptions{ColOrder: "size"}, "ColOrder"},
		{"tree without clustering", ok, HeatOptions{Tree: true}, "Tree"},
		{"NaN middle", ok, HeatOptions{Mid: ptr(math.NaN())}, "Mid"},
	}
	for _, c := range cases {
		_, err := HeatScene(c.m, c.opt)
		if err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		var oe *OptionError
		if got := errors.As(err, &oe); got != (c.option != "") || (got && oe.Option != c.option) {
			t.Errorf("%s: error %v, want option %q", c.name, err, c.option)
		}
	}
}

// Orders by label (numbers as numbers) and by mean value.
func TestHeatOrders(t *testing.T) {
	m := HeatMatrix{Rows: []string{"10", "9", "100"}, Cols: []string{"b", "a"}, Values: []float64{1, 5, 3, 4, 0, 2}}
	cases := []struct {
		opt  HeatOptions
		rows []string
		cols []string
	}{
		{HeatOptions{}, []string{"10", "9", "100"}, []string{"b", "a"}},
		{HeatOptions{RowOrder: HeatByLabel, ColOrder: HeatByLabel}, []string{"9", "10", "100"}, []string{"a", "b"}},
		{HeatOptions{RowOrder: HeatByValue, ColOrder: HeatByValue}, []string{"9", "10", "100"}, []string{"a", "b"}},
	}
	for _, c := range cases {
		s, err := HeatScene(m, c.opt)
		if err != nil {
			t.Fatal(err)
		}
		cells := cellsOf(t, s)
		for i, r := range c.rows {
			for j, col := range c.cols {
				if got := cells[i*2+j]; got.row != r || got.col != col {
					t.Errorf("%+v: cell %d is %s/%s, want %s/%s", c.opt, i*2+j, got.row, got.col, r, col)
				}
			}
		}
	}
}
