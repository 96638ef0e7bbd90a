package render

import "fmt"

// Medium is where a figure will be shown. It fixes the canvas width and the
// type scale, so that text is never smaller than the medium allows once the
// figure is placed at its final size.
type Medium string

// The media plumb knows. The zero Medium is Screen.
const (
	Screen Medium = "screen"
	Print  Medium = "print"
	Slide  Medium = "slide"
)

// mediumSpec is a medium's canvas and type scale, in SVG pixels (1/96 inch).
type mediumSpec struct {
	width, height float64 // height 0: the chart chooses it from its content
	text          float64 // labels, values, ticks: never below the medium's minimum
	small         float64 // source and notes; still at or above the minimum
	title         float64
	pad           float64 // outer margin
	gap           float64 // space between text and marks
}

// spec returns the medium's canvas and type scale. Print is one journal
// column: 89 mm is the common single-column width (common practice), and
// 7 pt is the usual minimum text size at final size (common practice),
// 7 pt = 9.33 px at 96 px per inch. Screen text is at least 12 px and slides
// at least 24 px, as the issue for this chart family asks.
func (m Medium) spec() (mediumSpec, error) {
	switch m {
	case Screen, "":
		return mediumSpec{width: 640, text: 13, small: 12, title: 18, pad: 12, gap: 6}, nil
	case Print:
		return mediumSpec{width: 336, text: 9.5, small: 9.5, title: 11, pad: 6, gap: 4}, nil
	case Slide:
		return mediumSpec{width: 1920, height: 1080, text: 28, small: 24, title: 44, pad: 48, gap: 14}, nil
	}
	return mediumSpec{}, fmt.Errorf("unknown medium %q: use print, screen or slide", string(m))
}
