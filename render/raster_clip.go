package render

import "math"

// Clipping for the raster backend. The rasteriser walks every pixel row a
// path spans, the rows above the canvas included, and works in fixed point
// that overflows a few million pixels out; a path that leaves the canvas by
// far (no builder makes one, but a Scene is data) is therefore cut to the
// canvas first. Each closed polygon is clipped on its own, which keeps
// every winding number inside the clip box (Sutherland & Hodgman 1974), so
// the non-zero fill inside is unchanged.

// guard is how far outside its mask a path may reach and still go to the
// rasteriser uncut: a few thousand rows of skipped work at most.
const guard = 4096

// farCoord bounds the coordinates clipping works with, so that infinities
// become numbers and differences of them stay finite.
const farCoord = 1e15

// fits reports whether every point of p lies in the box (lo, hi).
func (p vpath) fits(lo, hi devPt) bool {
	for _, op := range p {
		for _, q := range op.p[:op.points()] {
			if !(q.x >= lo.x && q.x <= hi.x && q.y >= lo.y && q.y <= hi.y) {
				return false
			}
		}
	}
	return true
}

// clipped returns p as polygons cut to the box (lo, hi): curves flattened
// into chords, points that are not numbers dropped, infinite ones brought
// to farCoord.
func (p vpath) clipped(lo, hi devPt) vpath {
	var out vpath
	var poly []devPt
	flush := func() {
		if c := clipPolygon(poly, lo, hi); len(c) > 2 {
			out = out.addPolygon(c)
		}
		poly = poly[:0]
	}
	tame := func(q devPt) (devPt, bool) {
		if math.IsNaN(q.x) || math.IsNaN(q.y) {
			return q, false
		}
		return devPt{math.Max(-farCoord, math.Min(farCoord, q.x)), math.Max(-farCoord, math.Min(farCoord, q.y))}, true
	}
	var pen devPt
	for _, op := range p {
		var pts [3]devPt
		ok := true
		for i, q := range op.p[:op.points()] {
			var good bool
			pts[i], good = tame(q)
			ok = ok && good
		}
		if !ok {
			continue
		}
		switch op.kind {
		case 'M':
			flush()
			poly = append(poly, pts[0])
		case 'L':
			poly = append(poly, pts[0])
		case 'Q':
			// Far-off text only: a fixed number of chords is enough
			// for glyphs that are mostly off the canvas.
			for i := 1; i <= 8; i++ {
				t := float64(i) / 8
				u := 1 - t
				poly = append(poly, pen.mul(u*u).add(pts[0].mul(2*u*t)).add(pts[1].mul(t*t)))
			}
		case 'C':
			for i := 1; i <= 12; i++ {
				t := float64(i) / 12
				u := 1 - t
				poly = append(poly, pen.mul(u*u*u).add(pts[0].mul(3*u*u*t)).add(pts[1].mul(3*u*t*t)).add(pts[2].mul(t*t*t)))
			}
		}
		pen = pts[op.points()-1]
	}
	flush()
	return out
}

// clipPolygon cuts a closed polygon to the box (lo, hi), one edge of the
// box at a time (Sutherland & Hodgman 1974).
func clipPolygon(poly []devPt, lo, hi devPt) []devPt {
	in := append([]devPt(nil), poly...)
	for edge := range 4 {
		if len(in) == 0 {
			return nil
		}
		inside := func(q devPt) bool {
			switch edge {
			case 0:
				return q.x >= lo.x
			case 1:
				return q.x <= hi.x
			case 2:
				return q.y >= lo.y
			}
			return q.y <= hi.y
		}
		cross := func(a, b devPt) devPt {
			var t float64
			switch edge {
			case 0:
				t = (lo.x - a.x) / (b.x - a.x)
			case 1:
				t = (hi.x - a.x) / (b.x - a.x)
			case 2:
				t = (lo.y - a.y) / (b.y - a.y)
			default:
				t = (hi.y - a.y) / (b.y - a.y)
			}
			q := a.add(b.sub(a).mul(t))
			// Pin the cut exactly onto the edge, whatever the rounding.
			switch edge {
			case 0:
				q.x = lo.x
			case 1:
				q.x = hi.x
			case 2:
				q.y = lo.y
			default:
				q.y = hi.y
			}
			return q
		}
		var out []devPt
		for i, cur := range in {
			prev := in[(i+len(in)-1)%len(in)]
			switch {
			case inside(cur) && inside(prev):
				out = append(out, cur)
			case inside(cur):
				out = append(out, cross(prev, cur), cur)
			case inside(prev):
				out = append(out, cross(prev, cur))
			}
		}
		in = out
	}
	return in
}

// visibleSpan returns the part of segment a-b, as parameters 0 <= t0 <= t1
// <= 1, that lies in the box (lo, hi) (Liang & Barsky 1984); ok is false
// when none does.
func visibleSpan(a, b, lo, hi devPt) (t0, t1 float64, ok bool) {
	t0, t1 = 0, 1
	d := b.sub(a)
	for _, e := range [4][2]float64{{-d.x, a.x - lo.x}, {d.x, hi.x - a.x}, {-d.y, a.y - lo.y}, {d.y, hi.y - a.y}} {
		p, q := e[0], e[1]
		if p == 0 {
			if q < 0 {
				return 0, 0, false
			}
			continue
		}
		r := q / p
		if p < 0 {
			t0 = math.Max(t0, r)
		} else {
			t1 = math.Min(t1, r)
		}
	}
	return t0, t1, t0 <= t1
}
