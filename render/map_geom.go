package render

import (
	"container/heap"
	"math"
	"slices"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/simplify"

	"plumb/scale"
)

// projected is one region's outline on the plane: polygons of rings, the
// first ring of each polygon its outside and the others its holes.
type projected [][][]Point

// mapExtent is the longitude and latitude range of every vertex, the
// longitudes taken the short way round the globe.
func mapExtent(regions []Region) (scale.Extent, bool) {
	var lons []float64
	south, north := math.Inf(1), math.Inf(-1)
	for _, r := range regions {
		for _, poly := range r.Shape {
			for _, ring := range poly {
				for _, p := range ring {
					lons = append(lons, p[0])
					south, north = math.Min(south, p[1]), math.Max(north, p[1])
				}
			}
		}
	}
	w, e, ok := scale.LongitudeExtent(lons)
	if !ok || math.IsInf(south, 0) {
		return scale.Extent{}, false
	}
	return scale.Extent{West: w, South: south, East: e, North: north}, true
}

// project projects every ring. A ring's longitudes are unwrapped around
// its own first vertex and then taken relative to the map's centre, so a
// ring that crosses the antimeridian stays one ring; a ring that reaches
// past the map's edge meridian (lon0 ± 180°) is held at that meridian,
// which clips it along the map's rim instead of drawing a stroke across
// the whole map.
func project(regions []Region, p scale.Projection, lon0 float64) []projected {
	out := make([]projected, len(regions))
	for i, r := range regions {
		for _, poly := range r.Shape {
			var pp [][]Point
			for _, ring := range poly {
				if len(ring) < 3 {
					continue
				}
				pts := make([]Point, 0, len(ring))
				prev := 0.0
				for j, v := range ring {
					d := v[0] - lon0
					if j == 0 {
						d = math.Mod(d+540, 360) - 180
					} else {
						d = prev + (math.Mod(v[0]-ring[j-1][0]+540, 360) - 180)
					}
					prev = d
					x, y := p.Project(lon0+math.Max(-179.9999, math.Min(179.9999, d)), v[1])
					pts = append(pts, Point{x, y})
				}
				// Outer rings one way round and holes the other, whatever
				// the file's winding (RFC 7946 asks for it but readers
				// must not rely on it), so that the non-zero fill rule
				// leaves every hole open.
				if outer := len(pp) == 0; (signedArea(pts) > 0) != outer {
					slices.Reverse(pts)
				}
				pp = append(pp, pts)
			}
			if len(pp) > 0 {
				out[i] = append(out[i], pp)
			}
		}
	}
	return out
}

// fitShapes scales projected outlines uniformly into the box (one scale for
// x and y, or areas would no longer be in proportion), y pointing down,
// centred. It returns the pixels per projected unit.
func fitShapes(shapes []projected, box Point, w, h float64) float64 {
	x0, y0, x1, y1 := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for _, s := range shapes {
		for _, poly := range s {
			for _, ring := range poly {
				for _, p := range ring {
					x0, x1 = math.Min(x0, p.X), math.Max(x1, p.X)
					y0, y1 = math.Min(y0, p.Y), math.Max(y1, p.Y)
				}
			}
		}
	}
	if math.IsInf(x0, 0) {
		return 0
	}
	k := math.Min(w/math.Max(x1-x0, 1e-12), h/math.Max(y1-y0, 1e-12))
	ox := box.X + (w-(x1-x0)*k)/2
	oy := box.Y + (h-(y1-y0)*k)/2
	for _, s := range shapes {
		for _, poly := range s {
			for _, ring := range poly {
				for j, p := range ring {
					ring[j] = Point{ox + (p.X-x0)*k, oy + (y1-p.Y)*k}
				}
			}
		}
	}
	return k
}

// shapesExtent is the height over width of the projected outlines.
func shapesAspect(shapes []projected) float64 {
	x0, y0, x1, y1 := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for _, s := range shapes {
		for _, poly := range s {
			for _, ring := range poly {
				for _, p := range ring {
					x0, x1 = math.Min(x0, p.X), math.Max(x1, p.X)
					y0, y1 = math.Min(y0, p.Y), math.Max(y1, p.Y)
				}
			}
		}
	}
	if !(x1 > x0) || !(y1 > y0) {
		return 1
	}
	return (y1 - y0) / (x1 - x0)
}

// vkey is a vertex quantised to 0.01 px, the precision of the output: two
// rings share a vertex when they share its key.
type vkey [2]int64

func qkey(p Point) vkey { return vkey{int64(math.Round(p.X * 100)), int64(math.Round(p.Y * 100))} }

func keyLess(a, b vkey) bool { return a[0] < b[0] || (a[0] == b[0] && a[1] < b[1]) }

// simplifyShared simplifies every ring for drawing at this size without
// opening gaps between neighbours: rings are cut into arcs where the set
// of rings sharing a vertex changes, each arc is simplified once
// (Visvalingam & Whyatt 1993, by orb's simplifier, dropping vertices whose
// effective triangle is under threshold px²) and every ring that runs
// along it takes the same simplified arc. It returns the vertex counts
// before and after.
func simplifyShared(shapes []projected, threshold float64) (before, after int) {
	type ringID struct{ s, p, r int }
	users := map[vkey][]int{}
	var ids []ringID
	for s, sh := range shapes {
		for p, poly := range sh {
			for r, ring := range poly {
				no := len(ids)
				for _, pt := range ring {
					k := qkey(pt)
					if u := users[k]; len(u) == 0 || u[len(u)-1] != no {
						users[k] = append(u, no)
					}
				}
				ids = append(ids, ringID{s, p, r})
			}
		}
	}
	cache := map[[3]vkey][]Point{}
	vis := simplify.VisvalingamThreshold(threshold)
	for _, id := range ids {
		ring := shapes[id.s][id.p][id.r]
		n := len(ring)
		if n > 1 && qkey(ring[0]) == qkey(ring[n-1]) {
			ring = ring[:n-1]
			n--
		}
		before += n
		if n < 4 {
			after += n
			continue
		}
		// Junctions: vertices whose sharing rings differ from a neighbour's.
		fixed := make([]bool, n)
		start := -1
		for j := range ring {
			u := users[qkey(ring[j])]
			if !slices.Equal(u, users[qkey(ring[(j+n-1)%n])]) || !slices.Equal(u, users[qkey(ring[(j+1)%n])]) {
				fixed[j] = true
				if start < 0 {
					start = j
				}
			}
		}
		var out []Point
		if start < 0 {
			// A ring that shares no border, or shares all of it with one
			// other ring: the lowest vertex (a point both neighbours agree
			// on) is the junction.
			start = 0
			for j := range ring {
				if keyLess(qkey(ring[j]), qkey(ring[start])) {
					start = j
				}
			}
			fixed[start] = true
		}
		j := start
		for {
			arc := []Point{ring[j]}
			k := (j + 1) % n
			for !fixed[k] {
				arc = append(arc, ring[k])
				k = (k + 1) % n
			}
			arc = append(arc, ring[k])
			s := simplifyArc(arc, cache, vis)
			out = append(out, s[:len(s)-1]...)
			j = k
			if j == start {
				break
			}
		}
		if len(out) < 3 {
			out = ring // simplified away: keep the original small ring
		}
		after += len(out)
		shapes[id.s][id.p][id.r] = out
	}
	return before, after
}

// simplifyArc simplifies an arc between two junctions once. The arc is
// taken in a canonical direction (from its smaller end, or for a loop
// from the smaller of its inner ends), so that a border met by two rings
// in opposite directions has one cache key and one simplified form.
func simplifyArc(arc []Point, cache map[[3]vkey][]Point, vis *simplify.VisvalingamSimplifier) []Point {
	n := len(arc)
	if n <= 2 {
		return arc
	}
	a, b := qkey(arc[0]), qkey(arc[n-1])
	rev := keyLess(b, a) || (a == b && keyLess(qkey(arc[n-2]), qkey(arc[1])))
	if rev {
		arc = reversed(arc)
	}
	k := [3]vkey{qkey(arc[0]), qkey(arc[n-1]), qkey(arc[1])}
	s, ok := cache[k]
	if !ok {
		ls := make(orb.LineString, n)
		for i, p := range arc {
			ls[i] = orb.Point{p.X, p.Y}
		}
		var out orb.LineString
		if a == b {
			// A loop closed on itself keeps its ends and two vertices
			// between them at least, so that it keeps an area.
			out = simplify.Visvalingam(vis.Threshold, 4).LineString(ls)
		} else {
			out = vis.LineString(ls)
		}
		s = make([]Point, len(out))
		for i, p := range out {
			s[i] = Point{p[0], p[1]}
		}
		cache[k] = s
	}
	if rev {
		return reversed(s)
	}
	return s
}

func reversed(p []Point) []Point {
	r := make([]Point, len(p))
	for i := range p {
		r[len(p)-1-i] = p[i]
	}
	return r
}

// poleOfInaccessibility finds the point inside a polygon (outer ring and
// holes) farthest from its edges, to within precision px, by the
// cell-subdivision search of Garcia-Castellanos & Lombardo (2007) in the
// best-first form of Agafonkin (2016): square cells queued by the largest
// distance any point of them could have, split until no cell can beat the
// best centre by more than precision. It returns the point and its
// distance to the nearest edge.
func poleOfInaccessibility(poly [][]Point, precision float64) (Point, float64) {
	if len(poly) == 0 || len(poly[0]) < 3 {
		return Point{}, 0
	}
	x0, y0, x1, y1 := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	for _, p := range poly[0] {
		x0, x1 = math.Min(x0, p.X), math.Max(x1, p.X)
		y0, y1 = math.Min(y0, p.Y), math.Max(y1, p.Y)
	}
	w, ht := x1-x0, y1-y0
	size := math.Min(w, ht)
	// A shape thinner than a hundredth of a pixel holds no label; it would
	// also make the cells too small to step across the shape.
	if !(size > precision/100) {
		return Point{(x0 + x1) / 2, (y0 + y1) / 2}, 0
	}
	// Square cells the shape's smaller side wide, but no more than about
	// 4,096 of them for a long thin shape.
	size = math.Max(size, math.Sqrt(w*ht/4096))
	h := size / 2
	var pq poleQueue
	nx, ny := int(math.Ceil(w/size)), int(math.Ceil(ht/size))
	for i := range nx {
		for j := range ny {
			heap.Push(&pq, newPoleCell(x0+float64(i)*size+h, y0+float64(j)*size+h, h, poly))
		}
	}
	best := newPoleCell((x0+x1)/2, (y0+y1)/2, 0, poly)
	if c := centroidPoleCell(poly); c.d > best.d {
		best = c
	}
	// The search visits cells best first, so stopping after a bounded
	// number keeps the best point found, within a few precisions of the
	// pole on any shape a map draws, and bounds the work on absurd ones.
	for visited := 0; pq.Len() > 0 && visited < 20000; visited++ {
		c := heap.Pop(&pq).(poleCell)
		if c.d > best.d {
			best = c
		}
		if c.max-best.d <= precision {
			continue
		}
		h := c.h / 2
		for _, d := range [4][2]float64{{-1, -1}, {1, -1}, {-1, 1}, {1, 1}} {
			heap.Push(&pq, newPoleCell(c.x+d[0]*h, c.y+d[1]*h, h, poly))
		}
	}
	return Point{best.x, best.y}, math.Max(0, best.d)
}

type poleCell struct {
	x, y, h float64 // centre and half size
	d       float64 // signed distance from the centre to the polygon's edge (negative outside)
	max     float64 // the largest distance a point of the poleCell can have
}

func newPoleCell(x, y, h float64, poly [][]Point) poleCell {
	d := signedDistance(x, y, poly)
	return poleCell{x: x, y: y, h: h, d: d, max: d + h*math.Sqrt2}
}

func centroidPoleCell(poly [][]Point) poleCell {
	ring := poly[0]
	var a, cx, cy float64
	for i := range ring {
		p, q := ring[i], ring[(i+1)%len(ring)]
		f := p.X*q.Y - q.X*p.Y
		cx += (p.X + q.X) * f
		cy += (p.Y + q.Y) * f
		a += f * 3
	}
	if a == 0 {
		return newPoleCell(ring[0].X, ring[0].Y, 0, poly)
	}
	return newPoleCell(cx/a, cy/a, 0, poly)
}

// signedDistance is the distance from (x, y) to the nearest edge of the
// polygon, negative outside it (even-odd rule over all rings).
func signedDistance(x, y float64, poly [][]Point) float64 {
	inside := false
	best := math.Inf(1)
	for _, ring := range poly {
		n := len(ring)
		for i, j := 0, n-1; i < n; j, i = i, i+1 {
			a, b := ring[i], ring[j]
			if (a.Y > y) != (b.Y > y) && x < (b.X-a.X)*(y-a.Y)/(b.Y-a.Y)+a.X {
				inside = !inside
			}
			best = math.Min(best, segDist2(x, y, a, b))
		}
	}
	d := math.Sqrt(best)
	if !inside {
		return -d
	}
	return d
}

func segDist2(x, y float64, a, b Point) float64 {
	dx, dy := b.X-a.X, b.Y-a.Y
	t := 0.0
	if l := dx*dx + dy*dy; l > 0 {
		t = math.Max(0, math.Min(1, ((x-a.X)*dx+(y-a.Y)*dy)/l))
	}
	ex, ey := a.X+t*dx-x, a.Y+t*dy-y
	return ex*ex + ey*ey
}

// poleQueue is a max-heap of cells by the distance they could reach.
type poleQueue []poleCell

func (q poleQueue) Len() int           { return len(q) }
func (q poleQueue) Less(i, j int) bool { return q[i].max > q[j].max }
func (q poleQueue) Swap(i, j int)      { q[i], q[j] = q[j], q[i] }
func (q *poleQueue) Push(x any)        { *q = append(*q, x.(poleCell)) }
func (q *poleQueue) Pop() any          { old := *q; c := old[len(old)-1]; *q = old[:len(old)-1]; return c }

// signedArea is the shoelace area of a ring, positive when it runs
// counter-clockwise with y up.
func signedArea(r []Point) float64 {
	a := 0.0
	for i := range r {
		j := (i + 1) % len(r)
		a += r[i].X*r[j].Y - r[j].X*r[i].Y
	}
	return a / 2
}
