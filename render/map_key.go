package render

import (
	"fmt"
	"math"
	"slices"

	"plumb/layout"
)

// keyTitle names what the colours measure.
func (p *mapPlan) keyTitle() string {
	t := p.opt.ValueName
	if t == "" {
		t = "Value"
	}
	if p.opt.Per != "" {
		t += " " + p.opt.Per
	}
	if p.opt.Unit != "" && !namesUnit(t, p.opt.Unit) {
		t += " (" + p.opt.Unit + ")"
	}
	return t
}

// keyHeight is the room the key takes under the map: a gap, its title,
// the swatches and the limits under them.
func (p *mapPlan) keyHeight(f *frame) float64 {
	lh := lineHeight(f.spec.text)
	return f.spec.gap*2 + lh + lh + f.spec.gap/2 + lh
}

// drawKey draws the colour key under the plot: one swatch per class with
// its count inside and the class limits under the joins (nice numbers from
// the value format), or for an unclassed scale a continuous strip with nice
// ticks; then a "No data" swatch when some regions have none.
func (p *mapPlan) drawKey(f *frame, plot layout.Box, noData bool) {
	sp := f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	asc := face.Ascent(sp.text)
	y := plot.Y + plot.H + sp.gap*2
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-key"})
	f.text(plot.X, y+asc, p.keyTitle(), sp.text, false, f.th.text, "plumb-key-title", Start)
	y += lh
	sh := lh // swatch height: holds a count
	// The first limit is centred under the key's left end: start the
	// key half a label in, so that it stays on the canvas.
	x := plot.X
	if p.edges != nil {
		x += f.measure(p.vfmt.Format(p.edges[0]), sp.text, false) / 2
	}
	labelY := y + sh + sp.gap/2 + asc
	if p.edges == nil {
		w := math.Min(plot.W*0.6, sp.text*24)
		const strips = 64
		for i := range strips {
			v := p.lo + (p.hi-p.lo)*(float64(i)+0.5)/strips
			f.scene.Add(Mark{Kind: Rect, Class: "plumb-key-swatch", X: x + w*float64(i)/strips, Y: y, W: w/strips + 0.05, H: sh, Fill: p.fill(v)})
		}
		ax := f.fitValue(p.lo, p.hi, w, true, valueKind{label: func(v []float64) []string { return formatAll(p.vfmt, v) }})
		for i, t := range ax.ticks {
			if t < p.lo || t > p.hi || ax.labels[i] == "" {
				continue
			}
			tx := x + w*(t-p.lo)/math.Max(p.hi-p.lo, 1e-300)
			f.scene.Add(Mark{Kind: Path, Class: "plumb-tick-mark", Lines: [][]Point{{{tx, y + sh}, {tx, y + sh + 3}}}, Stroke: f.th.muted, StrokeWidth: 1})
			f.text(tx, labelY, ax.labels[i], sp.text, false, f.th.muted, "plumb-tick", Middle)
		}
		x += w
	} else {
		n := len(p.edges) - 1
		labels := formatAll(p.vfmt, p.edges)
		widest := 0.0
		for _, l := range labels {
			widest = math.Max(widest, f.measure(l, sp.text, false))
		}
		w := math.Min(math.Max(sp.text*3.2, widest+sp.gap), (plot.W-sp.text*8)/float64(n))
		// Limits every stride-th join so that neighbours never touch.
		stride := 1
		for stride < n && (widest+sp.gap)/float64(stride) > w {
			stride++
		}
		for i := range n {
			fill := p.fill((p.edges[i] + p.edges[i+1]) / 2)
			f.scene.Add(Mark{Kind: Rect, Class: "plumb-key-swatch", X: x + w*float64(i), Y: y, W: w, H: sh, Fill: fill,
				Attrs: []Attr{{"low", dataNumber(p.edges[i])}, {"high", dataNumber(p.edges[i+1])}, {"count", fmt.Sprint(p.counts[i])}}})
			if tc, ok := insideLabel(fill); ok {
				f.text(x+w*(float64(i)+0.5), y+(sh+asc-face.Descent(sp.text))/2, fmt.Sprintf("n=%d", p.counts[i]), sp.text, false, tc, "plumb-key-count", Middle)
			}
		}
		show := make([]bool, n+1)
		for i := 0; i < n; i += stride {
			show[i] = true
		}
		// The top limit always shows; the thinned one before it gives way
		// when the two would touch.
		if m := (n - 1) / stride * stride; m > 0 && float64(n-m)*w < widest+sp.gap {
			show[m] = false
		}
		show[n] = true
		for i, l := range labels {
			if show[i] {
				f.text(x+w*float64(i), labelY, l, sp.text, false, f.th.muted, "plumb-tick", Middle)
			}
		}
		x += w * float64(n)
	}
	if noData {
		x += sp.text * 2
		w := sp.text * 2
		f.scene.Add(Mark{Kind: Rect, Class: "plumb-key-swatch plumb-nodata", X: x, Y: y, W: w, H: sh, Fill: f.th.grid})
		f.text(x+w+sp.gap, y+(sh+asc-face.Descent(sp.text))/2, "No data", sp.text, false, f.th.muted, "plumb-key-label", Start)
	}
	f.scene.Add(Mark{Kind: GroupEnd})
}

// drawLabels names regions at their pole of inaccessibility (the point of
// the largest polygon farthest from its edge) where the name fits inside
// the shape and clear of names already set, largest regions first. It
// returns the boxes of the names set.
func (p *mapPlan) drawLabels(f *frame) []layout.Box {
	sp := f.spec
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	type cand struct {
		i    int
		poly [][]Point
		area float64
	}
	var cs []cand
	for i := range p.regions {
		best, area := -1, 0.0
		for j, poly := range p.shapes[i] {
			if a := ringArea(poly[0]); a > area {
				best, area = j, a
			}
		}
		if best >= 0 {
			cs = append(cs, cand{i, p.shapes[i][best], area})
		}
	}
	slices.SortStableFunc(cs, func(a, b cand) int { return cmpFloat(b.area, a.area) })
	var boxes []layout.Box
	skipped := 0
	for _, c := range cs {
		name := p.regions[c.i].Name
		w := f.measure(name, sp.text, false)
		h := asc + desc
		if w*h > c.area {
			skipped++
			continue
		}
		pt, d := poleOfInaccessibility(c.poly, 0.5)
		box := layout.Box{X: pt.X - w/2, Y: pt.Y - h/2, W: w, H: h}
		if d < h/2 || !boxInside(box, c.poly) || slices.ContainsFunc(boxes, box.Overlaps) {
			skipped++
			continue
		}
		fill := f.th.grid
		if p.has[c.i] {
			fill = p.fill(p.value[c.i])
		}
		tc, _ := insideLabel(fill)
		f.text(pt.X, pt.Y+(asc-desc)/2, name, sp.text, false, tc, "plumb-label", Middle)
		boxes = append(boxes, box)
	}
	if skipped > 0 {
		f.scene.Note("map-labels", false, fmt.Sprintf("%d of %d region names do not fit inside their shapes and are left out (each region names itself in its tooltip)", skipped, len(cs)))
	}
	return boxes
}

// boxInside reports whether the box's corners and edge midpoints lie
// inside the polygon.
func boxInside(b layout.Box, poly [][]Point) bool {
	for _, fx := range []float64{0, 0.5, 1} {
		for _, fy := range []float64{0, 0.5, 1} {
			if signedDistance(b.X+b.W*fx, b.Y+b.H*fy, poly) <= 0 {
				return false
			}
		}
	}
	return true
}

// ringArea is the area a ring encloses (shoelace, either winding).
func ringArea(r []Point) float64 {
	a := 0.0
	for i := range r {
		j := (i + 1) % len(r)
		a += r[i].X*r[j].Y - r[j].X*r[i].Y
	}
	return math.Abs(a) / 2
}
