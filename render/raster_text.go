package render

import (
	"fmt"
	"math"

	"golang.org/x/image/font"
	"golang.org/x/image/font/sfnt"
	"golang.org/x/image/math/fixed"

	"plumb/layout"
)

// Text for the raster backend. A Text mark is set with exactly the face
// layout measured it with (Scene.Font.Faces), placedGlyph by placedGlyph: each placedGlyph's
// pen position is the sum, in font units, of the advances and pair kerning
// before it, scaled once, as layout.Face.Width sums them. So the text
// drawn is as wide as the text measured, and an anchored label ends or
// centres where the builder placed it. Outlines are unhinted, as in the
// measurement, and filled with the same rasteriser as every other shape.

// rasterFont is a face's font parsed for drawing.
type rasterFont struct {
	f    *sfnt.Font
	buf  sfnt.Buffer
	upem fixed.Int26_6
}

// rasterFonts holds the faces of one scene, parsed once per encoding.
type rasterFonts struct {
	parsed map[*layout.Face]*rasterFont
}

// get returns the parsed font of face, parsing it on first use. The bytes
// were parsed by layout already, so an error here is unexpected; it is
// still an error, not a panic.
func (fs *rasterFonts) get(face *layout.Face) (f *rasterFont, err error) {
	if f, ok := fs.parsed[face]; ok {
		return f, nil
	}
	defer func() {
		if r := recover(); r != nil {
			f, err = nil, fmt.Errorf("render: font %q does not parse for drawing: %v", face.Family(), r)
		}
	}()
	sf, err := sfnt.Parse(face.Data())
	if err != nil {
		return nil, fmt.Errorf("render: font %q does not parse for drawing: %w", face.Family(), err)
	}
	f = &rasterFont{f: sf, upem: fixed.Int26_6(sf.UnitsPerEm())}
	if fs.parsed == nil {
		fs.parsed = map[*layout.Face]*rasterFont{}
	}
	fs.parsed[face] = f
	return f, nil
}

// placedGlyph is one placedGlyph of a line of text and its pen position in font units.
type placedGlyph struct {
	g   sfnt.GlyphIndex
	pen int64
}

// shape lays out text: the glyphs and their pen positions, and the whole
// advance width, all in font units.
func (f *rasterFont) shape(text string) ([]placedGlyph, int64) {
	var (
		out   []placedGlyph
		pen   int64
		prev  sfnt.GlyphIndex
		first = true
	)
	n := sfnt.GlyphIndex(f.f.NumGlyphs())
	for _, r := range text {
		g, err := f.f.GlyphIndex(&f.buf, r)
		if err != nil || g >= n {
			g = 0 // the missing placedGlyph, as layout measures it
		}
		if !first {
			// Kerning at one font unit per 26.6 step gives font units,
			// as layout reads it; ErrNotFound means the pair is not kerned.
			if k, err := f.f.Kern(&f.buf, prev, g, f.upem, font.HintingNone); err == nil {
				pen += int64(k)
			}
		}
		out = append(out, placedGlyph{g, pen})
		if a, err := f.f.GlyphAdvance(&f.buf, g, f.upem, font.HintingNone); err == nil {
			pen += int64(a)
		}
		prev, first = g, false
	}
	return out, pen
}

// textPath returns the outlines of a Text mark in device pixels: the
// baseline starts at (x, y) for a start anchor, and the text is set at size
// device pixels per em.
func (f *rasterFont) textPath(text string, x, y, size float64, anchor Anchor) vpath {
	if !(size > 0) || text == "" {
		return nil
	}
	glyphs, width := f.shape(text)
	unit := size / float64(f.upem) // device pixels per font unit
	switch anchor {
	case Middle:
		x -= float64(width) * unit / 2
	case End:
		x -= float64(width) * unit
	}
	// Outlines are loaded at the size rounded to 1/64 pixel per em, the
	// resolution the font parser works in.
	ppem := fixed.Int26_6(math.Round(size * 64))
	if ppem <= 0 {
		return nil
	}
	var p vpath
	for _, gl := range glyphs {
		segs, err := f.f.LoadGlyph(&f.buf, gl.g, ppem, nil)
		if err != nil {
			continue // a placedGlyph the font cannot outline is left blank
		}
		ox, oy := x+float64(gl.pen)*unit, y
		pt := func(q fixed.Point26_6) devPt { return devPt{ox + float64(q.X)/64, oy + float64(q.Y)/64} }
		for _, s := range segs {
			switch s.Op {
			case sfnt.SegmentOpMoveTo:
				p = append(p, pathOp{kind: 'M', p: [3]devPt{pt(s.Args[0])}})
			case sfnt.SegmentOpLineTo:
				p = append(p, pathOp{kind: 'L', p: [3]devPt{pt(s.Args[0])}})
			case sfnt.SegmentOpQuadTo:
				p = append(p, pathOp{kind: 'Q', p: [3]devPt{pt(s.Args[0]), pt(s.Args[1])}})
			case sfnt.SegmentOpCubeTo:
				p = append(p, pathOp{kind: 'C', p: [3]devPt{pt(s.Args[0]), pt(s.Args[1]), pt(s.Args[2])}})
			}
		}
	}
	return p
}
