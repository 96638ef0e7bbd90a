package render

import (
	"bytes"
	"fmt"
	"math"
	"testing"

	"github.com/paulmach/orb"
)

// gridRegions is an invented boundary set of rows×cols cells, each edge a
// wiggly line of k segments that the two cells on either side share
// exactly, as real administrative boundaries do.
func gridRegions(rows, cols, k int) []Region {
	const lon0, lat0, d = -20.0, 45.0, 0.5
	at := func(r, c float64) orb.Point {
		// A smooth displacement field keeps shared vertices shared.
		return orb.Point{lon0 + c*d + 0.08*math.Sin(r*1.7+c*0.3), lat0 + r*d*0.6 + 0.05*math.Cos(c*1.3+r*0.4)}
	}
	edge := func(r0, c0, r1, c1 float64) []orb.Point {
		var pts []orb.Point
		for i := range k {
			t := float64(i) / float64(k)
			p := at(r0+(r1-r0)*t, c0+(c1-c0)*t)
			// A wiggle across the edge, a function of the edge's position
			// only, so both neighbours compute the same vertices.
			w := 0.01 * math.Sin(37*t+(r0+r1)*3.1+(c0+c1)*2.3)
			p[0] += w * (r1 - r0)
			p[1] += w * (c1 - c0)
			pts = append(pts, p)
		}
		return pts
	}
	var regions []Region
	for r := range rows {
		for c := range cols {
			fr, fc := float64(r), float64(c)
			var ring orb.Ring
			ring = append(ring, edge(fr, fc, fr, fc+1)...)
			ring = append(ring, edge(fr, fc+1, fr+1, fc+1)...)
			ring = append(ring, reversedPts(edge(fr+1, fc, fr+1, fc+1))...)
			ring = append(ring, reversedPts(edge(fr, fc, fr+1, fc))...)
			ring = append(ring, ring[0])
			regions = append(regions, Region{Name: fmt.Sprintf("R%04d", r*cols+c), Shape: orb.MultiPolygon{{ring}}})
		}
	}
	return regions
}

// reversedPts reverses an edge walked the other way round; its first vertex
// (the shared corner) moves to the end and is replaced by the far corner.
func reversedPts(e []orb.Point) []orb.Point {
	r := make([]orb.Point, len(e))
	for i := range e {
		r[len(e)-1-i] = e[i]
	}
	return r
}

// BenchmarkMap3000 renders 3,000 regions with about 250,000 vertices (about
// 5 MB as GeoJSON): the target is under 2 s and an SVG under 1.5 MB.
func BenchmarkMap3000(b *testing.B) {
	regions := gridRegions(50, 60, 21)
	names := make([]string, len(regions))
	values := make([]float64, len(regions))
	for i, r := range regions {
		names[i], values[i] = r.Name, float64(i%97)+math.Sqrt(float64(i))
	}
	var size int
	for b.Loop() {
		var buf bytes.Buffer
		if _, err := Map(&buf, regions, names, values, MapOptions{}); err != nil {
			b.Fatal(err)
		}
		size = buf.Len()
	}
	b.ReportMetric(float64(size)/1e6, "MB-svg")
}
