package layout

// Box is an axis-aligned rectangle in canvas pixels: X and Y are its top
// left corner (y grows downwards, as in SVG), W and H its width and height.
type Box struct {
	X, Y, W, H float64
}

// Overlaps reports whether b and o share an area of positive size. Boxes
// that only touch along an edge or at a corner do not overlap, and neither
// do boxes of zero or negative size.
func (b Box) Overlaps(o Box) bool {
	return min(b.X+b.W, o.X+o.W) > max(b.X, o.X) &&
		min(b.Y+b.H, o.Y+o.H) > max(b.Y, o.Y)
}

// Inside reports whether b lies entirely within o. Touching o's edges counts
// as inside.
func (b Box) Inside(o Box) bool {
	return b.X >= o.X && b.Y >= o.Y &&
		b.X+b.W <= o.X+o.W && b.Y+b.H <= o.Y+o.H
}

// Text anchors for TextBox, matching the SVG text-anchor values start,
// middle and end.
const (
	AnchorStart  = 0
	AnchorMiddle = 1
	AnchorEnd    = 2
)

// TextBox returns the box of one line of text set in f at a font size of
// size pixels with its baseline at y, anchored at x: anchor 0 (AnchorStart)
// puts x at the start of the text, 1 (AnchorMiddle) at its middle and 2
// (AnchorEnd) at its end; other values count as the nearest of these. The
// box reaches from the font's ascent above the baseline to its descent
// below, whatever the letters, so that lines of one font line up.
func TextBox(f *Face, text string, size, x, y float64, anchor int) Box {
	w := f.Width(text, size)
	switch {
	case anchor >= AnchorEnd:
		x -= w
	case anchor == AnchorMiddle:
		x -= w / 2
	}
	a := f.Ascent(size)
	return Box{X: x, Y: y - a, W: w, H: a + f.Descent(size)}
}
