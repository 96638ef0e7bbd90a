package render

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/palette"
	"plumb/scale"
)

func TestDiffColoursSurviveCVD(t *testing.T) {
	// The two signs must stay apart for every reader: CIEDE2000 at least 10
	// between the area colours (and the line colours) under normal, protan,
	// deutan and tritan vision (Machado, Oliveira & Fernandes 2009, full
	// severity), and the labels on the areas keep 4.5:1 (WCAG 2.x).
	areaA, areaB, lineA, lineB := diffColors()
	for _, pair := range [][2]Colour{{areaA, areaB}, {lineA, lineB}} {
		a, err := palette.ParseHex(pair[0].Hex())
		require.NoError(t, err)
		b, err := palette.ParseHex(pair[1].Hex())
		require.NoError(t, err)
		for _, v := range palette.Visions {
			d := palette.DeltaE2000(palette.SRGBToLab(palette.Simulate(a, v, 1)), palette.SRGBToLab(palette.Simulate(b, v, 1)))
			assert.GreaterOrEqual(t, d, 10.0, "%s vs %s under %v", pair[0], pair[1], v)
		}
	}
	text := palette.Text()
	for _, h := range []Colour{areaA, areaB} {
		c, _ := palette.ParseHex(h.Hex())
		assert.GreaterOrEqual(t, palette.Contrast(text, c), 4.5, "label text on %s", h)
	}
}

func TestDiffCrossings(t *testing.T) {
	p := scale.Polyline{
		X: []float64{0, 1, 2, 3, 4, 5, 6},
		Y: []float64{-1, 3, 2, 0, 2, math.NaN(), -4},
	}
	runs := crossings(p)
	require.Len(t, runs, 2)
	// −1 → 3 crosses at x = 0.25; the touch at x = 3 is a vertex already.
	assert.Equal(t, []xy{{0, -1}, {0.25, 0}, {1, 3}, {2, 2}, {3, 0}, {4, 2}}, runs[0])
	assert.Equal(t, []xy{{6, -4}}, runs[1])
	parts := splitSigns(runs[0])
	require.Len(t, parts, 3)
	assert.Equal(t, -1, parts[0].sign)
	assert.Equal(t, 1, parts[1].sign)
	assert.Equal(t, 1, parts[2].sign)
	assert.Equal(t, xy{0.25, 0}, parts[1].pts[0])
	assert.Equal(t, xy{3, 0}, parts[1].pts[len(parts[1].pts)-1])
}

func TestDiffScene(t *testing.T) {
	x := []float64{0, 1, 2, 3, 4, 5}
	a := []float64{1, 3, 5, 1, 0, 2}
	b := []float64{2, 1, 1, 3, 4, 1}
	for _, ctx := range []bool{false, true} {
		s, err := DiffScene(Series{Name: "north", X: x, Y: a}, Series{Name: "south", X: x, Y: b}, DiffOptions{Context: ctx})
		require.NoError(t, err)
		assertNoOverlap(t, s)
		assert.Equal(t, 1, classCount(s, "plumb-area-a"))
		assert.Equal(t, 1, classCount(s, "plumb-area-b"))
		assert.Equal(t, 1, classCount(s, "plumb-baseline"))
		assert.Contains(t, s.Desc, "north is above south at 3 of 6 points")
		if ctx {
			assert.Equal(t, 2, classCount(s, "plumb-panel"))
		}
	}
	_, err := DiffScene(Series{X: x, Y: a[:2]}, Series{X: x, Y: b}, DiffOptions{})
	assert.Error(t, err)
	_, err = DiffScene(Series{X: []float64{1, 2}, Y: []float64{math.NaN(), 1}}, Series{X: []float64{1, 2}, Y: []float64{1, math.NaN()}}, DiffOptions{})
	assert.Error(t, err)
}

func TestDiffLongNamesFit(t *testing.T) {
	// Long series names: the panel titles wrap, the region labels shorten
	// with the full text in a tooltip, and nothing leaves the canvas or
	// covers the tick labels.
	long := "Saltmarrow Point to Kettlewick Harbour via Little Osk"
	x := make([]float64, 40)
	a, b := make([]float64, 40), make([]float64, 40)
	for i := range x {
		x[i] = float64(i)
		a[i] = 50 + 40*math.Sin(float64(i)/6)
		b[i] = 50
	}
	for _, c := range []Common{{Medium: Screen, Width: 336}, {Medium: Print}, {Medium: Slide}} {
		for _, ctx := range []bool{false, true} {
			s, err := DiffScene(Series{Name: long + " east", X: x, Y: a}, Series{Name: long + " west", X: x, Y: b}, DiffOptions{Common: c, Context: ctx})
			require.NoError(t, err)
			assertNoOverlap(t, s)
			labels := 0
			for _, mk := range s.Marks {
				if mk.Kind == Text && mk.Class == "plumb-label" && strings.Contains(mk.Text+mk.Tooltip, " above ") {
					labels++
					assert.Contains(t, mk.Text, " above ", "the shortened label still says which is above")
				}
			}
			assert.Equal(t, 2, labels, "%v context=%v: both regions named", c.Medium, ctx)
		}
	}
}
