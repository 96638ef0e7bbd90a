package render

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"testing"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/geo"
	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/palette"
)

// cellRegion is a region one cell of the graticule: lon..lon+d, lat..lat+d.
func cellRegion(name string, lon, lat, d float64) Region {
	ring := orb.Ring{{lon, lat}, {lon + d, lat}, {lon + d, lat + d}, {lon, lat + d}, {lon, lat}}
	return Region{Name: name, Shape: orb.MultiPolygon{{ring}}}
}

func pathArea(lines [][]Point) float64 {
	a := 0.0
	for _, l := range lines {
		a += ringArea(l)
	}
	return a
}

func regionMarks(s *Scene) []Mark {
	var ms []Mark
	for _, m := range s.Marks {
		if m.Kind == Path && (m.Class == "plumb-mark" || m.Class == "plumb-mark plumb-nodata") {
			ms = append(ms, m)
		}
	}
	return ms
}

// Projected areas are in proportion to true areas across latitudes 50-70°N
// (the check), with one region mark per shape carrying its data.
func TestMapAreasProportional(t *testing.T) {
	var regions []Region
	var names []string
	var values []float64
	for i, lat := range []float64{50, 54, 58, 62, 66, 69} {
		for j, lon := range []float64{-10, 0, 10} {
			n := fmt.Sprintf("r%d-%d", i, j)
			regions = append(regions, cellRegion(n, lon, lat, 1))
			names, values = append(names, n), append(values, float64(i*3+j))
		}
	}
	s, err := MapScene(regions, names, values, MapOptions{})
	require.NoError(t, err)
	ms := regionMarks(s)
	require.Len(t, ms, len(regions))
	lo, hi := math.Inf(1), math.Inf(-1)
	for i, m := range ms {
		assert.Equal(t, regions[i].Name, markAttr(m, "label"))
		assert.Equal(t, strconv.FormatFloat(values[i], 'g', -1, 64), markAttr(m, "value"))
		assert.False(t, m.Fill.IsNone())
		ratio := pathArea(m.Lines) / geo.Area(regions[i].Shape)
		lo, hi = math.Min(lo, ratio), math.Max(hi, ratio)
	}
	// geo.Area measures on a sphere of radius 6378137 m, the projection on
	// the unit sphere: the ratio must be the same for every cell (0.5%).
	assert.Less(t, hi/lo, 1.005, "pixel area per true area ranges %.4g..%.4g", lo, hi)
	assertNoOverlap(t, s)
}

// Darker means more: fill lightness falls strictly as the class rises.
func TestMapLightnessFallsWithValue(t *testing.T) {
	var regions []Region
	var names []string
	var values []float64
	for i := range 10 {
		n := fmt.Sprint("d", i)
		regions = append(regions, cellRegion(n, float64(i), 60, 0.8))
		names, values = append(names, n), append(values, float64(i*i))
	}
	s, err := MapScene(regions, names, values, MapOptions{Classes: 4})
	require.NoError(t, err)
	ms := regionMarks(s)
	prevL, prevV := 101.0, -1.0
	for i, m := range ms {
		l := palette.SRGBToLab(m.Fill.SRGB()).L
		if values[i] > prevV && l != prevL {
			assert.Less(t, l, prevL, "region %s", names[i])
		}
		assert.LessOrEqual(t, l, prevL+1e-9, "lightness never rises with value")
		prevL, prevV = l, values[i]
	}
	assert.Contains(t, sceneNote(s, "map-classes"), "4 classes by natural breaks")
}

func sceneNote(s *Scene, code string) string {
	for _, n := range s.Notes {
		if n.Code == code {
			return n.Text
		}
	}
	return ""
}

// Counts that grow with area get the note that suggests a rate; with Per
// they do not.
func TestMapCountNote(t *testing.T) {
	var regions []Region
	var names []string
	var values []float64
	for i := range 8 {
		d := 0.3 + 0.2*float64(i)
		n := fmt.Sprint("c", i)
		regions = append(regions, cellRegion(n, float64(i)*2, 55, d))
		names, values = append(names, n), append(values, math.Round(1000*d*d))
	}
	s, err := MapScene(regions, names, values, MapOptions{})
	require.NoError(t, err)
	assert.Contains(t, sceneNote(s, "map-counts"), "a map of counts mostly shows size")
	s, err = MapScene(regions, names, values, MapOptions{PerArea: true})
	require.NoError(t, err)
	assert.Empty(t, sceneNote(s, "map-counts"))
	assert.Contains(t, s.Desc, "per km²")
	// Per area divides by each region's area in km².
	for i, m := range regionMarks(s) {
		v, _ := strconv.ParseFloat(markAttr(m, "value"), 64)
		assert.InEpsilon(t, values[i]/(geo.Area(regions[i].Shape)/1e6), v, 1e-9)
	}
}

// Two regions sharing a long wiggly border still meet after
// simplification: the border is simplified once, so their areas add up to
// the area of the whole (a gap or an overlap would change the sum).
func TestSimplifySharedBorders(t *testing.T) {
	var border []Point
	for i := 0; i <= 400; i++ {
		y := float64(i) / 4
		border = append(border, Point{50 + 0.3*math.Sin(float64(i)*0.7) + 2*math.Sin(float64(i)/40), y})
	}
	left := []Point{{0, 0}}
	left = append(left, border...)
	left = append(left, Point{0, 100})
	right := []Point{{100, 100}}
	right = append(right, reversed(border)...)
	right = append(right, Point{100, 0})
	shapes := []projected{{{left}}, {{right}}}
	total := ringArea(left) + ringArea(right)
	before, after := simplifyShared(shapes, 0.5)
	assert.Less(t, after, before/2, "most of the wiggle goes")
	got := ringArea(shapes[0][0][0]) + ringArea(shapes[1][0][0])
	assert.InDelta(t, total, got, 1e-6, "no gap and no overlap")
	assert.InDelta(t, 100*100, got, 1e-6)
}

func TestPoleOfInaccessibility(t *testing.T) {
	// The centre of a square is farthest from its edges (hand computation).
	sq := [][]Point{{{0, 0}, {10, 0}, {10, 10}, {0, 10}}}
	p, d := poleOfInaccessibility(sq, 0.01)
	assert.InDelta(t, 5, p.X, 0.05)
	assert.InDelta(t, 5, p.Y, 0.05)
	assert.InDelta(t, 5, d, 0.02)
	// A 20×4 rectangle with a 2×2 hole at its middle: the pole moves to
	// either side, 2 from the long edges (hand computation: 2 = half height).
	hole := [][]Point{{{0, 0}, {20, 0}, {20, 4}, {0, 4}}, {{9, 1}, {11, 1}, {11, 3}, {9, 3}}}
	p, d = poleOfInaccessibility(hole, 0.01)
	assert.InDelta(t, 2, d, 0.02)
	assert.Greater(t, math.Abs(p.X-10), 2.9)
}

func TestMapErrors(t *testing.T) {
	r := []Region{cellRegion("a", 0, 50, 1)}
	_, err := MapScene(r, []string{"a"}, []float64{1}, MapOptions{Classes: 40})
	var oe *OptionError
	require.True(t, errors.As(err, &oe))
	assert.Equal(t, "Classes", oe.Option)
	_, err = MapScene(r, []string{"a"}, []float64{1}, MapOptions{Breaks: "jenks"})
	require.True(t, errors.As(err, &oe))
	_, err = MapScene(r, []string{"a"}, []float64{math.NaN()}, MapOptions{})
	assert.ErrorContains(t, err, "finite")
	_, err = MapScene(r, []string{"zz"}, []float64{1}, MapOptions{})
	assert.ErrorContains(t, err, "no region has a value")
	_, err = MapScene(r, []string{"a"}, []float64{1}, MapOptions{Projection: "mercator"})
	require.True(t, errors.As(err, &oe))
	assert.Equal(t, "Projection", oe.Option)
}

// A region without a value is drawn in the no-data style the key explains.
func TestMapNoData(t *testing.T) {
	r := []Region{cellRegion("a", 0, 50, 1), cellRegion("b", 1, 50, 1), cellRegion("c", 2, 50, 1)}
	s, err := MapScene(r, []string{"a", "b"}, []float64{1, 5}, MapOptions{})
	require.NoError(t, err)
	assert.Equal(t, 1, classCount(s, "plumb-nodata")-1, "one region and the key's swatch")
	assert.Contains(t, s.Desc, "1 region has no data")
}

// A hole stays open whichever way the file winds its rings.
func TestMapHolesEitherWinding(t *testing.T) {
	outer := orb.Ring{{0, 50}, {4, 50}, {4, 54}, {0, 54}, {0, 50}}
	for _, hole := range []orb.Ring{
		{{1, 51}, {1, 53}, {3, 53}, {3, 51}, {1, 51}}, // opposite to the outer ring
		{{1, 51}, {3, 51}, {3, 53}, {1, 53}, {1, 51}}, // the same way round
	} {
		r := []Region{{Name: "ring", Shape: orb.MultiPolygon{{outer, hole}}}}
		s, err := MapScene(r, []string{"ring"}, []float64{1}, MapOptions{})
		require.NoError(t, err)
		m := regionMarks(s)[0]
		require.Len(t, m.Lines, 2)
		assert.NotEqual(t, signedArea(m.Lines[0]) > 0, signedArea(m.Lines[1]) > 0, "outer and hole wind opposite ways")
	}
}

// A boundary file still in projected metres is refused with the fix.
func TestMapRefusesProjectedCoordinates(t *testing.T) {
	r := []Region{{Name: "metres", Shape: orb.MultiPolygon{{{{500000, 6500000}, {510000, 6500000}, {510000, 6510000}, {500000, 6500000}}}}}}
	_, err := MapScene(r, []string{"metres"}, []float64{1}, MapOptions{})
	assert.ErrorContains(t, err, "projected system's metres")
}

// Shapes too thin or too long for the cell search end at once.
func TestPoleOfInaccessibilityDegenerate(t *testing.T) {
	thin := [][]Point{{{500, 100}, {600, 100}, {600, 100 + 1e-13}, {500, 100 + 1e-13}}}
	_, d := poleOfInaccessibility(thin, 0.5)
	assert.Zero(t, d)
	long := [][]Point{{{0, 0}, {1e6, 0}, {1e6, 1}, {0, 1}}}
	p, d := poleOfInaccessibility(long, 0.5)
	assert.InDelta(t, 0.5, d, 0.1)
	assert.InDelta(t, 0.5, p.Y, 0.1)
}
