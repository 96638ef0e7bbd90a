package render

import (
	"math"
	"testing"
)

// samePolygon reports whether two polygons have the same vertices, starting at the
// same one, in either turning sense, within e.
func samePolygon(a, b []devPt, e float64) bool {
	if len(a) != len(b) {
		return false
	}
	n := len(a)
	for _, dir := range []int{1, -1} {
		for start := range n {
			ok := true
			for i := range n {
				j := ((start+dir*i)%n + n) % n
				if !a[i].near(b[j], e) {
					ok = false
					break
				}
			}
			if ok {
				return true
			}
		}
	}
	return false
}

// TestStrokeOutlines checks the pieces of a stroked corner against outlines
// computed by hand. The polyline goes from (0, 0) right to (10, 0), then
// down to (10, 10) (y grows down), stroked 2 wide: half width 1.
func TestStrokeOutlines(t *testing.T) {
	corner := []devPt{{0, 0}, {10, 0}, {10, 10}}
	for _, tc := range []struct {
		name   string
		join   LineJoin
		cap    LineCap
		pieces [][]devPt
	}{
		{
			// hand computation: the first segment's rectangle spans
			// y -1 to 1, the second's x 9 to 11; the turn is to the
			// right of the direction of travel in y-down coordinates,
			// so the outer corner is up and to the right: the offset
			// points (10, -1) and (11, 0) and the mitre tip (11, -1),
			// whose length sqrt(2) times the width is within the limit 4.
			"mitre, butt", JoinMiter, CapButt, [][]devPt{
				{{0, -1}, {10, -1}, {10, 1}, {0, 1}},
				{{11, 0}, {11, 10}, {9, 10}, {9, 0}},
				{{10, 0}, {10, -1}, {11, -1}, {11, 0}},
			},
		},
		{
			// hand computation: the bevel is the triangle between the
			// corner and the two offset points; square caps extend each
			// end by half the width: x from -1 at the start, y to 11 at
			// the end.
			"bevel, square", JoinBevel, CapSquare, [][]devPt{
				{{0, -1}, {10, -1}, {10, 1}, {0, 1}},
				{{11, 0}, {11, 10}, {9, 10}, {9, 0}},
				{{10, 0}, {10, -1}, {11, 0}},
				{{0, -1}, {-1, -1}, {-1, 1}, {0, 1}},
				{{11, 10}, {11, 11}, {9, 11}, {9, 10}},
			},
		},
	} {
		t.Run(tc.name, func(t *testing.T) {
			got := strokePolygons(corner, false, strokeStyle{width: 2, join: tc.join, cap: tc.cap})
			if len(got) != len(tc.pieces) {
				t.Fatalf("%d pieces, want %d: %v", len(got), len(tc.pieces), got)
			}
			for i, want := range tc.pieces {
				if !samePolygon(got[i], want, 1e-9) {
					t.Errorf("piece %d is %v, want %v", i, got[i], want)
				}
				if polygonArea(got[i]) <= 0 {
					t.Errorf("piece %d turns the wrong way, so the non-zero union would cut it out", i)
				}
			}
		})
	}
}

// TestRoundJoinAndCap: every vertex of a round join and a round cap lies
// on the circle of half the width about the corner or end, and they span
// a quarter turn (the join at a right angle) and a half turn (the cap).
func TestRoundJoinAndCap(t *testing.T) {
	got := strokePolygons([]devPt{{0, 0}, {10, 0}, {10, 10}}, false, strokeStyle{width: 2, join: JoinRound, cap: CapRound})
	if len(got) != 5 {
		t.Fatalf("%d pieces, want 2 segments, 1 join, 2 caps", len(got))
	}
	for _, tc := range []struct {
		name   string
		poly   []devPt
		centre devPt
		sweep  float64
	}{
		{"join", got[2], devPt{10, 0}, math.Pi / 2},
		{"start cap", got[3], devPt{0, 0}, math.Pi},
		{"end cap", got[4], devPt{10, 10}, math.Pi},
	} {
		centres := 0
		for _, p := range tc.poly {
			if p.near(tc.centre, 1e-12) {
				centres++
				continue
			}
			if d := p.sub(tc.centre).length(); math.Abs(d-1) > 1e-12 {
				t.Errorf("%s: vertex %v is %g from the centre, want 1", tc.name, p, d)
			}
		}
		if centres != 1 {
			t.Errorf("%s has its centre %v %d times, want once", tc.name, tc.centre, centres)
		}
		// A pie slice of radius 1 and angle a has area a/2, less what the
		// chords cut off; flatness bounds that loss.
		area := polygonArea(tc.poly)
		if want := tc.sweep / 2; area > want || area < want-tc.sweep*flatness {
			t.Errorf("%s: area %g, want just under %g", tc.name, area, want)
		}
	}
}

func TestMitreLimit(t *testing.T) {
	// hand computation: two segments meeting at angle theta have a mitre
	// of 1/sin(theta/2) widths (SVG 1.1, section 11.4). At 30 degrees that
	// is 3.86, within the limit 4; at 28 degrees it is 4.13, cut to a bevel.
	for _, tc := range []struct {
		deg   float64
		mitre bool
	}{{30, true}, {28, false}, {90, true}} {
		a := tc.deg * math.Pi / 180
		line := []devPt{{0, 0}, {10, 0}, {10 - 10*math.Cos(a), 10 * math.Sin(a)}}
		p := joinPolygon(line[0], line[1], line[2], 1, JoinMiter)
		if got := len(p) == 4; got != tc.mitre {
			t.Errorf("%g degrees: mitre %v, want %v", tc.deg, got, tc.mitre)
		}
		if tc.mitre {
			if l, want := p[2].sub(line[1]).length(), 1/math.Sin(a/2); math.Abs(l-want) > 1e-9 {
				t.Errorf("%g degrees: mitre tip %g from the corner, want %g", tc.deg, l, want)
			}
		}
	}
}

func TestDashPieces(t *testing.T) {
	for _, tc := range []struct {
		name    string
		line    []devPt
		pattern []float64
		want    [][]devPt
	}{
		// hand computation: on 0-2, off 2-5, on 5-7, off 7-10.
		{"straight", []devPt{{0, 0}, {10, 0}}, []float64{2, 3}, [][]devPt{{{0, 0}, {2, 0}}, {{5, 0}, {7, 0}}}},
		// A dash that turns a corner keeps the corner: 0-4 along x then
		// 2 down; off for 3 to (4, 5); on to (4, 6) at the end.
		{"round a corner", []devPt{{0, 0}, {4, 0}, {4, 6}}, []float64{6, 3}, [][]devPt{{{0, 0}, {4, 0}, {4, 2}}, {{4, 5}, {4, 6}}}},
		// An odd pattern is repeated: 1 on, 1 off, 1 on, 1 off...
		{"odd", []devPt{{0, 0}, {4, 0}}, dashPattern([]float64{1}), [][]devPt{{{0, 0}, {1, 0}}, {{2, 0}, {3, 0}}}},
		// A zero-length dash is a point, drawn by its caps.
		{"dots", []devPt{{0, 0}, {9, 0}}, []float64{0, 4}, [][]devPt{{{0, 0}, {0, 0}}, {{4, 0}, {4, 0}}, {{8, 0}, {8, 0}}}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			got := dashPieces(tc.line, tc.pattern, devPt{-100, -100}, devPt{100, 100})
			if len(got) != len(tc.want) {
				t.Fatalf("%d dashes %v, want %v", len(got), got, tc.want)
			}
			for i := range got {
				if len(got[i]) != len(tc.want[i]) {
					t.Fatalf("dash %d is %v, want %v", i, got[i], tc.want[i])
				}
				for j := range got[i] {
					if !got[i][j].near(tc.want[i][j], 1e-9) {
						t.Errorf("dash %d is %v, want %v", i, got[i], tc.want[i])
					}
				}
			}
		})
	}
	// The pattern's phase runs on through the part of a line that is
	// off the box: the dashes inside are the same as when the whole line
	// is cut.
	long := []devPt{{-1003.5, 2}, {-500, 2}, {10, 2}, {10, 40}}
	all := dashPieces(long, []float64{2, 3}, devPt{-2000, -2000}, devPt{2000, 2000})
	seen := dashPieces(long, []float64{2, 3}, devPt{-5, -5}, devPt{20, 20})
	var inside [][]devPt
	for _, d := range all {
		if d[0].x >= -5 && d[len(d)-1].y <= 20 {
			inside = append(inside, d)
		}
	}
	if len(inside) < 5 {
		t.Fatalf("only %d dashes of the whole line in the box", len(inside))
	}
	for _, d := range inside {
		found := false
		for _, g := range seen {
			found = found || (g[0].near(d[0], 1e-6) && g[len(g)-1].near(d[len(d)-1], 1e-6))
		}
		if !found {
			t.Errorf("dash %v of the whole line is not among those cut in the box: %v", d, seen)
		}
	}

	for _, bad := range [][]float64{nil, {0, 0}, {-1, 2}, {math.NaN()}, {math.Inf(1), 1}} {
		if dashPattern(bad) != nil {
			t.Errorf("dash array %v should draw a solid line, as SVG does", bad)
		}
	}
}
