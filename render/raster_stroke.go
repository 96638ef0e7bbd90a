package render

import "math"

// Stroke geometry for the raster backend. A stroke is turned into filled
// polygons: one quadrilateral per segment, one piece per join and per cap.
// Every piece is oriented the same way (positive signed area), so that the
// non-zero fill of their union is the stroke, overlaps drawn once: a
// translucent line that crosses itself is no darker where it does, as in
// SVG. Coordinates are device pixels.

// devPt is a point or direction in device pixels.
type devPt struct{ x, y float64 }

func (a devPt) add(b devPt) devPt            { return devPt{a.x + b.x, a.y + b.y} }
func (a devPt) sub(b devPt) devPt            { return devPt{a.x - b.x, a.y - b.y} }
func (a devPt) mul(k float64) devPt          { return devPt{a.x * k, a.y * k} }
func (a devPt) dot(b devPt) float64          { return a.x*b.x + a.y*b.y }
func (a devPt) cross(b devPt) float64        { return a.x*b.y - a.y*b.x }
func (a devPt) length() float64              { return math.Hypot(a.x, a.y) }
func (a devPt) normal() devPt                { return devPt{-a.y, a.x} }
func (a devPt) unit() devPt                  { return a.mul(1 / a.length()) }
func (a devPt) near(b devPt, e float64) bool { return math.Abs(a.x-b.x) <= e && math.Abs(a.y-b.y) <= e }

// miterLimit is SVG's default stroke-miterlimit: a mitre longer than four
// stroke widths is cut to a bevel (SVG 1.1, section 11.4, 'stroke-miterlimit').
const miterLimit = 4

// flatness is the largest distance in device pixels between a circular arc
// and the polygon that stands for it: a sixtieth of a pixel changes no
// 8-bit coverage by more than about one step.
const flatness = 1.0 / 60

// maxArcSteps is the most chords an arc is cut into: enough for a circle
// of radius 10,000 pixels within flatness.
const maxArcSteps = 4096

// arcSteps is the number of chords that keep an arc of radius r and angle
// sweep within flatness: the sagitta of a chord spanning angle a is
// r(1 - cos(a/2)).
func arcSteps(r, sweep float64) int {
	if r <= flatness {
		return 4
	}
	// Capped for radii far beyond any canvas, whose arcs are off it.
	a := 2 * math.Acos(1-flatness/r)
	n := math.Ceil(math.Abs(sweep) / a)
	if !(n <= maxArcSteps) {
		return maxArcSteps
	}
	return max(int(n), 4)
}

// circlePolygon returns a circle as a polygon fine enough that its edge is
// within flatness of the true circle.
func circlePolygon(c devPt, r float64) []devPt {
	n := arcSteps(r, 2*math.Pi)
	pts := make([]devPt, n)
	for i := range pts {
		a := 2 * math.Pi * float64(i) / float64(n)
		pts[i] = devPt{c.x + r*math.Cos(a), c.y + r*math.Sin(a)}
	}
	return pts
}

// arcPolygon is the pie slice of the circle at c of radius r from the
// direction of p0 to that of p1, turning the short way: a round join or a
// round cap.
func arcPolygon(c, p0, p1 devPt, r float64) []devPt {
	a0 := math.Atan2(p0.y-c.y, p0.x-c.x)
	a1 := math.Atan2(p1.y-c.y, p1.x-c.x)
	sweep := a1 - a0
	for sweep > math.Pi {
		sweep -= 2 * math.Pi
	}
	for sweep < -math.Pi {
		sweep += 2 * math.Pi
	}
	n := arcSteps(r, sweep)
	pts := make([]devPt, 0, n+2)
	pts = append(pts, c, p0)
	for i := 1; i < n; i++ {
		a := a0 + sweep*float64(i)/float64(n)
		pts = append(pts, devPt{c.x + r*math.Cos(a), c.y + r*math.Sin(a)})
	}
	return append(pts, p1)
}

// signedArea is the shoelace area of a polygon, positive for one turning
// sense and negative for the other.
func polygonArea(p []devPt) float64 {
	var a float64
	for i := range p {
		j := (i + 1) % len(p)
		a += p[i].cross(p[j])
	}
	return a / 2
}

// positive returns p turned to positive signed area, reversing it in place
// when needed.
func positiveArea(p []devPt) []devPt {
	if polygonArea(p) < 0 {
		for i, j := 0, len(p)-1; i < j; i, j = i+1, j-1 {
			p[i], p[j] = p[j], p[i]
		}
	}
	return p
}

// strokeStyle is a stroke's width and shape in device pixels.
type strokeStyle struct {
	width float64
	join  LineJoin
	cap   LineCap
	dash  []float64 // already scaled to device pixels; nil is solid
	view  [2]devPt  // the canvas, whose outside dashes are not cut
}

// period is the length of one repeat of a dash pattern.
func period(pattern []float64) float64 {
	var sum float64
	for _, v := range pattern {
		sum += v
	}
	return sum
}

// strokePolygons returns the outline of a stroked polyline as positive
// polygons, dashes applied.
func strokePolygons(line []devPt, closed bool, st strokeStyle) [][]devPt {
	line = dedupePoints(line)
	if closed && len(line) > 1 && line[0].near(line[len(line)-1], 1e-9) {
		line = line[:len(line)-1]
	}
	if len(line) == 0 || !(st.width > 0) {
		return nil
	}
	if pattern := dashPattern(st.dash); pattern != nil && period(pattern) >= minDashPeriod {
		if closed && len(line) > 1 {
			line = append(line[:len(line):len(line)], line[0])
		}
		// Dashes are cut only where they can show: on the canvas, widened
		// by the stroke and its mitres.
		m := st.width*miterLimit + 2
		lo, hi := st.view[0].sub(devPt{m, m}), st.view[1].add(devPt{m, m})
		var out [][]devPt
		for _, piece := range dashPieces(line, pattern, lo, hi) {
			out = append(out, strokeOutline(piece, false, st)...)
		}
		return out
	}
	return strokeOutline(line, closed && len(line) > 2, st)
}

// dedupe drops consecutive repeated points, which have no direction.
func dedupePoints(line []devPt) []devPt {
	out := make([]devPt, 0, len(line))
	for _, p := range line {
		if len(out) == 0 || !p.near(out[len(out)-1], 1e-9) {
			out = append(out, p)
		}
	}
	return out
}

// dashPattern returns the dash array SVG would use: repeated once when its
// length is odd, nil (solid) when it is empty, has a negative or
// non-finite entry, or sums to zero (SVG 1.1, section 11.4,
// 'stroke-dasharray').
func dashPattern(d []float64) []float64 {
	if len(d) == 0 {
		return nil
	}
	var sum float64
	for _, v := range d {
		if !(v >= 0) || math.IsInf(v, 0) {
			return nil
		}
		sum += v
	}
	if !(sum > 0) {
		return nil
	}
	if len(d)%2 == 1 {
		d = append(d[:len(d):len(d)], d...)
	}
	return d
}

// minDashPeriod is the shortest dash pattern, in device pixels, drawn as
// dashes; a finer one is below what pixels can show and is drawn solid,
// which also bounds the number of pieces a line is cut into.
const minDashPeriod = 1.0 / 16

// dashPieces cuts a polyline into its dashes: the pieces under the even
// entries of the pattern, measured along the line from its start. Only the
// parts of segments inside the box (lo, hi) are cut, the pattern's phase
// carried across the rest, so that a line reaching far off the canvas
// costs no more than its visible part.
func dashPieces(line []devPt, pattern []float64, lo, hi devPt) [][]devPt {
	period := period(pattern)
	var out [][]devPt
	k, left, on := 0, pattern[0], true // pattern entry, length left in it, drawing
	var cur []devPt
	// skip moves the phase on by dist without drawing; whole periods are
	// taken at once.
	skip := func(dist float64) {
		if on && len(cur) > 0 {
			out = append(out, cur)
		}
		cur = nil
		// Strictly beyond, as when drawing: a dash of length zero that
		// starts exactly here is still to come.
		if dist > left {
			dist -= left
			k, on = (k+1)%len(pattern), !on
			left = pattern[k]
			dist = math.Mod(dist, period)
			for dist > left {
				dist -= left
				k, on = (k+1)%len(pattern), !on
				left = pattern[k]
			}
		}
		left -= dist
	}
	started := false
	for i := 1; i < len(line); i++ {
		a, b := line[i-1], line[i]
		seg := b.sub(a).length()
		t0, t1, ok := visibleSpan(a, b, lo, hi)
		if !ok || !(seg > 0) {
			skip(seg)
			started = false
			continue
		}
		if t0 > 0 || !started {
			skip(t0 * seg)
			if on {
				cur = []devPt{a.add(b.sub(a).mul(t0))}
			}
		}
		started = true
		end := t1 * seg
		pos := t0 * seg
		for end-pos > left {
			pos += left
			q := a.add(b.sub(a).mul(pos / seg))
			if on {
				out = append(out, append(cur, q))
				cur = nil
			} else {
				cur = []devPt{q}
			}
			on = !on
			k = (k + 1) % len(pattern)
			left = pattern[k]
		}
		left -= end - pos
		if t1 < 1 {
			if on {
				cur = append(cur, a.add(b.sub(a).mul(t1)))
			}
			skip((1 - t1) * seg)
			started = false
			continue
		}
		if on {
			cur = append(cur, b)
		}
	}
	if on && len(cur) > 0 {
		out = append(out, cur)
	}
	return out
}

// outline strokes one dash or one whole polyline.
func strokeOutline(line []devPt, closed bool, st strokeStyle) [][]devPt {
	h := st.width / 2
	line = dedupePoints(line)
	if len(line) == 1 {
		// A zero-length subpath shows only its caps (SVG 1.1, section
		// 11.4, 'stroke-linecap'), taken as pointing along x.
		p := line[0]
		switch st.cap {
		case CapRound:
			return [][]devPt{positiveArea(circlePolygon(p, h))}
		case CapSquare:
			return [][]devPt{positiveArea([]devPt{{p.x - h, p.y - h}, {p.x + h, p.y - h}, {p.x + h, p.y + h}, {p.x - h, p.y + h}})}
		}
		return nil
	}
	var out [][]devPt
	n := len(line)
	segs := n - 1
	if closed {
		segs = n
	}
	for i := range segs {
		a, b := line[i], line[(i+1)%n]
		nv := b.sub(a).unit().normal().mul(h)
		out = append(out, positiveArea([]devPt{a.add(nv), b.add(nv), b.sub(nv), a.sub(nv)}))
	}
	joinAt := func(i int) {
		prev, v, next := line[(i-1+n)%n], line[i], line[(i+1)%n]
		if p := joinPolygon(prev, v, next, h, st.join); p != nil {
			out = append(out, positiveArea(p))
		}
	}
	if closed {
		for i := range n {
			joinAt(i)
		}
		return out
	}
	for i := 1; i < n-1; i++ {
		joinAt(i)
	}
	if c := capPolygon(line[0], line[1], h, st.cap); c != nil {
		out = append(out, positiveArea(c))
	}
	if c := capPolygon(line[n-1], line[n-2], h, st.cap); c != nil {
		out = append(out, positiveArea(c))
	}
	return out
}

// joinPolygon is the piece that fills the outer corner at v between the
// segments prev-v and v-next, for a stroke of half width h; nil when the
// segments continue straight on.
func joinPolygon(prev, v, next devPt, h float64, join LineJoin) []devPt {
	d0, d1 := v.sub(prev).unit(), next.sub(v).unit()
	turn := d0.cross(d1)
	if math.Abs(turn) < 1e-12 && d0.dot(d1) > 0 {
		return nil
	}
	// The outer side is opposite to the turn.
	s := 1.0
	if turn > 0 {
		s = -1
	}
	n0, n1 := d0.normal().mul(s*h), d1.normal().mul(s*h)
	p0, p1 := v.add(n0), v.add(n1)
	switch join {
	case JoinRound:
		return arcPolygon(v, p0, p1, h)
	case JoinMiter:
		// The mitre's length over the stroke width is 1/sin(theta/2) for
		// the angle theta between the segments (SVG 1.1, section 11.4),
		// and sin(theta/2) = |n0+n1|/(2h).
		sum := n0.add(n1)
		if l := sum.length(); l > 0 && 2*h/l <= miterLimit {
			m := v.add(sum.mul(2 * h * h / (l * l)))
			return []devPt{v, p0, m, p1}
		}
	}
	return []devPt{v, p0, p1}
}

// capPolygon is the cap at end, whose segment comes from from, for a
// stroke of half width h; nil for a butt cap.
func capPolygon(end, from devPt, h float64, c LineCap) []devPt {
	d := end.sub(from).unit()
	nv := d.normal().mul(h)
	switch c {
	case CapSquare:
		e := d.mul(h)
		return []devPt{end.add(nv), end.add(nv).add(e), end.sub(nv).add(e), end.sub(nv)}
	case CapRound:
		// Two quarter arcs through the tip, so that the half disc turns
		// the right way round.
		tip := end.add(d.mul(h))
		a := arcPolygon(end, end.add(nv), tip, h)
		b := arcPolygon(end, tip, end.sub(nv), h)
		return append(a, b[2:]...)
	}
	return nil
}
