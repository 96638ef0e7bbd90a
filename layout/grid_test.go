package layout

import (
	"fmt"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestLayoutGrid(t *testing.T) {
	tests := []struct {
		name       string
		spec       GridSpec
		cols, rows int
	}{
		{"one panel fills the box", GridSpec{N: 1, Box: Box{W: 640, H: 400}}, 1, 1},
		{"four panels on a wide slide go side by side in two rows", GridSpec{N: 4, Box: Box{W: 1600, H: 900}, Aspect: 0.6}, 2, 2},
		{"three wide panels on a tall page stack", GridSpec{N: 3, Box: Box{W: 400, H: 1200}, Aspect: 0.5}, 1, 3},
		{"growing page keeps few columns while the page stays short", GridSpec{N: 2, Box: Box{W: 640}, Aspect: 0.5}, 1, 2},
		// 4 columns: 13 rows of 154 x 92.4 px panels, 1,297 px > 1.5 x 640;
		// 5 columns: 10 rows of 121.6 x 73 px panels, 802 px.
		{"fifty panels on a growing page add columns", GridSpec{N: 50, Box: Box{W: 640}, Aspect: 0.6, GutterX: 8, GutterY: 8, MinW: 60}, 5, 10},
		{"the narrowest readable panel caps the columns", GridSpec{N: 50, Box: Box{W: 640}, Aspect: 0.6, GutterX: 8, GutterY: 8, MinW: 150}, 4, 13},
		{"a fixed column count is kept", GridSpec{N: 5, Box: Box{W: 640}, Cols: 2}, 2, 3},
		{"never more columns than panels", GridSpec{N: 2, Box: Box{W: 640}, Cols: 5}, 2, 1},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			g := LayoutGrid(tt.spec)
			assert.Equal(t, tt.cols, g.Cols, "columns")
			assert.Equal(t, tt.rows, g.Rows, "rows")
			assert.Len(t, g.Cells, tt.spec.N)
		})
	}
}

func TestLayoutGridEmpty(t *testing.T) {
	assert.Empty(t, LayoutGrid(GridSpec{}).Cells)
	assert.Empty(t, LayoutGrid(GridSpec{N: 3}).Cells, "no width, no grid")
}

// Cells never overlap, keep the gutters, stay inside a fixed box and share
// one size, for any panel count and box.
func TestLayoutGridProperties(t *testing.T) {
	r := rand.New(rand.NewPCG(7, 11))
	for trial := range 300 {
		s := GridSpec{
			N:       1 + r.IntN(60),
			Box:     Box{X: r.Float64() * 50, Y: r.Float64() * 50, W: 100 + r.Float64()*1800},
			Aspect:  0.2 + r.Float64()*1.3,
			GutterX: r.Float64() * 20,
			GutterY: r.Float64() * 20,
		}
		if r.IntN(2) == 0 {
			s.Box.H = 100 + r.Float64()*1000
		}
		g := LayoutGrid(s)
		name := fmt.Sprintf("trial %d %+v", trial, s)
		require.Len(t, g.Cells, s.N, name)
		require.GreaterOrEqual(t, g.Cols*g.Rows, s.N, name)
		require.Less(t, (g.Rows-1)*g.Cols, s.N, name+": no empty row")
		for i, a := range g.Cells {
			assert.InDelta(t, g.Cells[0].W, a.W, 1e-9, name)
			assert.InDelta(t, g.Cells[0].H, a.H, 1e-9, name)
			if s.Box.H > 0 {
				assert.True(t, a.Inside(Box{X: s.Box.X - 1e-6, Y: s.Box.Y - 1e-6, W: s.Box.W + 2e-6, H: s.Box.H + 2e-6}), "%s: cell %d %+v leaves the box", name, i, a)
			}
			for j := i + 1; j < len(g.Cells); j++ {
				b := g.Cells[j]
				assert.False(t, a.Overlaps(b), "%s: cells %d and %d overlap", name, i, j)
			}
		}
		if g.Cols > 1 {
			gap := g.Cells[1].X - (g.Cells[0].X + g.Cells[0].W)
			assert.InDelta(t, s.GutterX, gap, 1e-9, name)
		}
	}
}

// On a fixed box, the chosen column count gives the largest panel of the
// preferred shape of all column counts.
func TestLayoutGridFixedBoxIsBest(t *testing.T) {
	s := GridSpec{N: 7, Box: Box{W: 1920, H: 900}, Aspect: 0.5, GutterX: 16, GutterY: 16}
	g := LayoutGrid(s)
	panel := func(g Grid) float64 { return min(g.Cells[0].W, g.Cells[0].H/s.Aspect) }
	for c := 1; c <= s.N; c++ {
		o := s
		o.Cols = c
		assert.LessOrEqual(t, panel(LayoutGrid(o)), panel(g)+1e-9, "columns %d beat the choice %d", c, g.Cols)
	}
}
