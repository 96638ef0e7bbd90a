package render

import (
	"image"
	"image/draw"
	"math"

	"golang.org/x/image/vector"
)

// The raster backend's rasterCanvas. Each mark is rasterised into coverage masks
// (one for its fill, one for its stroke) no larger than the mark's bounding
// box, and the masks are composited onto one premultiplied RGBA image. So
// memory is the image plus, at most, a float32 accumulator and two 8-bit
// masks the size of the rasterCanvas, however many marks there are.
//
// Compositing is done on the 8-bit sRGB values, not on linear light, which
// is how SVG renderers paint by default (SVG 1.1, section 11.7.1,
// 'color-interpolation' defaults to sRGB), so that an edge pixel here has
// the value it has there.

// rasterCanvas is the image being drawn and the scratch space for drawing it.
type rasterCanvas struct {
	img   *image.RGBA
	z     vector.Rasterizer
	fill  coverMask
	line  coverMask
	scale float64
}

// coverMask is an 8-bit coverage coverMask placed at r on the rasterCanvas.
type coverMask struct {
	r   image.Rectangle // in rasterCanvas pixels; empty when nothing is covered
	buf []byte
	a   image.Alpha
}

// pathOp is one command of a device-space path: move, line, quadratic or
// cubic Bézier, to the last of its points.
type pathOp struct {
	kind byte // 'M', 'L', 'Q' or 'C'
	p    [3]devPt
}

// vpath is a path in device pixels, filled with the non-zero rule.
type vpath []pathOp

// addPolygon appends a closed polygon.
func (p vpath) addPolygon(pts []devPt) vpath {
	for i, q := range pts {
		k := byte('L')
		if i == 0 {
			k = 'M'
		}
		p = append(p, pathOp{kind: k, p: [3]devPt{q}})
	}
	return p
}

// points is the number of points an op carries.
func (op pathOp) points() int {
	switch op.kind {
	case 'Q':
		return 2
	case 'C':
		return 3
	}
	return 1
}

// bounds returns the rasterCanvas pixels the path may touch: its control points'
// box, which holds every curve, widened to whole pixels and clipped to the
// rasterCanvas.
func (c *rasterCanvas) bounds(p vpath) image.Rectangle {
	minX, minY := math.Inf(1), math.Inf(1)
	maxX, maxY := math.Inf(-1), math.Inf(-1)
	for _, op := range p {
		for _, q := range op.p[:op.points()] {
			minX, maxX = math.Min(minX, q.x), math.Max(maxX, q.x)
			minY, maxY = math.Min(minY, q.y), math.Max(maxY, q.y)
		}
	}
	if !(minX <= maxX && minY <= maxY) {
		return image.Rectangle{}
	}
	// Clamp before converting, so that a coordinate far outside the
	// rasterCanvas (or an infinite one) cannot overflow an int.
	lim := float64(max(c.img.Rect.Dx(), c.img.Rect.Dy())) + 2
	cl := func(v float64) float64 { return math.Max(-1, math.Min(lim, v)) }
	r := image.Rect(int(math.Floor(cl(minX))), int(math.Floor(cl(minY))), int(math.Ceil(cl(maxX))), int(math.Ceil(cl(maxY))))
	return r.Intersect(c.img.Rect)
}

// cover rasterises path p into m: anti-aliased coverage, non-zero winding.
func (c *rasterCanvas) cover(p vpath, m *coverMask) {
	m.r = c.bounds(p)
	if m.r.Empty() {
		m.r = image.Rectangle{}
		return
	}
	w, h := m.r.Dx(), m.r.Dy()
	if cap(m.buf) < w*h {
		m.buf = make([]byte, w*h)
	}
	m.a = image.Alpha{Pix: m.buf[:w*h], Stride: w, Rect: image.Rect(0, 0, w, h)}
	ox, oy := float64(m.r.Min.X), float64(m.r.Min.Y)
	lo, hi := devPt{ox - 1, oy - 1}, devPt{float64(m.r.Max.X) + 1, float64(m.r.Max.Y) + 1}
	if !p.fits(lo.sub(devPt{guard, guard}), hi.add(devPt{guard, guard})) {
		p = p.clipped(lo, hi)
	}
	c.z.Reset(w, h)
	c.z.DrawOp = draw.Src
	f := func(v devPt) (float32, float32) { return float32(v.x - ox), float32(v.y - oy) }
	open := false
	for _, op := range p {
		switch op.kind {
		case 'M':
			if open {
				c.z.ClosePath()
			}
			c.z.MoveTo(f(op.p[0]))
			open = true
		case 'L':
			c.z.LineTo(f(op.p[0]))
		case 'Q':
			x1, y1 := f(op.p[0])
			x2, y2 := f(op.p[1])
			c.z.QuadTo(x1, y1, x2, y2)
		case 'C':
			x1, y1 := f(op.p[0])
			x2, y2 := f(op.p[1])
			x3, y3 := f(op.p[2])
			c.z.CubeTo(x1, y1, x2, y2, x3, y3)
		}
	}
	if open {
		c.z.ClosePath()
	}
	c.z.Draw(&m.a, m.a.Rect, image.Opaque, image.Point{})
}

// at is the coverMask's coverage at rasterCanvas pixel (x, y), 0 outside it.
func (m *coverMask) at(x, y int) uint32 {
	if !(image.Point{x, y}.In(m.r)) {
		return 0
	}
	return uint32(m.a.Pix[(y-m.r.Min.Y)*m.a.Stride+x-m.r.Min.X])
}

// paint composites a mark whose fill covers c.fill and whose stroke covers
// c.line: the stroke over the fill, the pair then at the given group
// opacity over the rasterCanvas, as SVG's 'opacity' property asks (SVG 1.1,
// section 14.5). fill or stroke may be None.
func (c *rasterCanvas) paint(fill, stroke Colour, opacity float64) {
	if fill.IsNone() {
		c.fill.r = image.Rectangle{}
	}
	if stroke.IsNone() {
		c.line.r = image.Rectangle{}
	}
	r := c.fill.r.Union(c.line.r)
	if r.Empty() {
		return
	}
	const k = 1.0 / (255 * 255)
	fa, sa := float64(fill.A)*k, float64(stroke.A)*k
	fr, fg, fb := float64(fill.R)/255, float64(fill.G)/255, float64(fill.B)/255
	sr, sg, sb := float64(stroke.R)/255, float64(stroke.G)/255, float64(stroke.B)/255
	for y := r.Min.Y; y < r.Max.Y; y++ {
		row := c.img.Pix[y*c.img.Stride:]
		for x := r.Min.X; x < r.Max.X; x++ {
			af := fa * float64(c.fill.at(x, y))
			as := sa * float64(c.line.at(x, y))
			if af == 0 && as == 0 {
				continue
			}
			// Premultiplied stroke over premultiplied fill.
			under := af * (1 - as)
			a := as + under
			cr := sr*as + fr*under
			cg := sg*as + fg*under
			cb := sb*as + fb*under
			if opacity != 1 {
				a, cr, cg, cb = a*opacity, cr*opacity, cg*opacity, cb*opacity
			}
			overPixel(row[4*x:4*x+4], cr, cg, cb, a)
		}
	}
}

// over puts premultiplied colour (r, g, b, a), each 0 to 1, over the 8-bit
// premultiplied pixel px.
func overPixel(px []byte, r, g, b, a float64) {
	if a >= 1 {
		px[0], px[1], px[2], px[3] = byte8(r), byte8(g), byte8(b), 255
		return
	}
	keep := (1 - a) / 255
	px[0] = byte8(r + float64(px[0])*keep)
	px[1] = byte8(g + float64(px[1])*keep)
	px[2] = byte8(b + float64(px[2])*keep)
	px[3] = byte8(a + float64(px[3])*keep)
}

// byte8 is v, from 0 to 1, as the nearest 8-bit value.
func byte8(v float64) byte {
	v = math.Round(v * 255)
	switch {
	case v <= 0:
		return 0
	case v >= 255:
		return 255
	}
	return byte(v)
}

// drawImage draws src into the device box (x0, y0)-(x1, y1) by nearest
// neighbour: every canvas pixel takes the source pixel under its centre
// (clamped into the box), so each source pixel stays a crisp square, and
// pixels the box's edges cross are covered in proportion, as the edges of
// any other shape are.
func (c *rasterCanvas) drawImage(src *image.NRGBA, x0, y0, x1, y1, opacity float64) {
	sw, sh := src.Rect.Dx(), src.Rect.Dy()
	if sw == 0 || sh == 0 || !(x1 > x0) || !(y1 > y0) {
		return
	}
	box := c.bounds(vpath{{kind: 'M', p: [3]devPt{{x0, y0}}}, {kind: 'L', p: [3]devPt{{x1, y1}}}})
	// overlap is the length of [a, a+1] inside [lo, hi].
	overlap := func(a, lo, hi float64) float64 { return math.Max(0, math.Min(a+1, hi)-math.Max(a, lo)) }
	sample := func(p, lo, hi float64, n int) int {
		return max(0, min(int((p-lo)/(hi-lo)*float64(n)), n-1))
	}
	for y := box.Min.Y; y < box.Max.Y; y++ {
		fy := float64(y)
		covY := overlap(fy, y0, y1)
		if covY == 0 {
			continue
		}
		sy := sample(math.Max(y0, math.Min(fy+0.5, y1)), y0, y1, sh)
		row := c.img.Pix[y*c.img.Stride:]
		for x := box.Min.X; x < box.Max.X; x++ {
			fx := float64(x)
			cov := covY * overlap(fx, x0, x1)
			if cov == 0 {
				continue
			}
			sx := sample(math.Max(x0, math.Min(fx+0.5, x1)), x0, x1, sw)
			p := src.Pix[sy*src.Stride+4*sx:]
			a := float64(p[3]) / 255 * opacity * cov
			if a == 0 {
				continue
			}
			overPixel(row[4*x:4*x+4], float64(p[0])/255*a, float64(p[1])/255*a, float64(p[2])/255*a, a)
		}
	}
}

// unpremultiply turns the rasterCanvas into straight alpha in place, as PNG
// stores it, and returns it as an NRGBA image sharing the same pixels.
func (c *rasterCanvas) unpremultiply() *image.NRGBA {
	p := c.img.Pix
	for i := 0; i+3 < len(p); i += 4 {
		a := p[i+3]
		if a == 0 || a == 255 {
			if a == 0 {
				p[i], p[i+1], p[i+2] = 0, 0, 0
			}
			continue
		}
		for j := range 3 {
			p[i+j] = byte(min(255, (uint32(p[i+j])*255+uint32(a)/2)/uint32(a)))
		}
	}
	return &image.NRGBA{Pix: p, Stride: c.img.Stride, Rect: c.img.Rect}
}
