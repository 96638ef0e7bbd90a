package render

import (
	"fmt"
	"math"
)

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
//
// The type scale is modular: every size is the medium's text floor times a
// power of one ratio (step k is floor·ratio^k, rounded up to 0.01 px so
// that no size falls below its step). Sizes fall along the reading order
// until the data is reached, and everything from the data on is set at the
// floor:
//
//	step 2, title:    what the figure is, read first; size alone (it is
//	                  set in the regular weight) puts it first
//	step 1, subtitle: what is measured, as a sentence, read second
//	step 0, text:     everything read with or after the data: category
//	                  and value labels, ticks, the unit line, notes and
//	                  the source
//
// The floor is the smallest size that reads at the medium's distance, so
// the data's own words need no more: every pixel above it would come out
// of the plot. Notes and the source share the floor with the labels and
// are told apart by their colour and place, not by a smaller size that
// the floor forbids. The ratios and their reasons are in typeRatio.
type mediumSpec struct {
	width, height float64 // height 0: the chart chooses it from its content
	floor         float64 // the medium's minimum text size
	ratio         float64 // the type scale's ratio between adjacent steps
	text          float64 // step 0: labels, values, ticks, unit line
	small         float64 // step 0: notes and source, at the floor too
	subtitle      float64 // step 1
	title         float64 // step 2
	pad           float64 // outer margin
	gap           float64 // space between text and marks
}

// Type scale steps (see mediumSpec).
const (
	stepText     = 0
	stepSubtitle = 1
	stepTitle    = 2
)

// typeStep is step k of a scale with this floor and ratio, rounded up to
// 0.01 px: rounding down could set text below the floor.
func typeStep(floor, ratio float64, k int) float64 {
	return math.Ceil(floor*math.Pow(ratio, float64(k))*100-1e-9) / 100
}

// typeRatio is the ratio between adjacent steps of a medium's type scale.
// A step must be seen as a step: the smallest ratio used is 1.125, an
// eighth larger, and the title two steps up is then more than a quarter
// larger than the text. The ratio grows with the distance at which the
// figure is read and with the room the canvas has:
//
//   - print 1.125: an 89 mm column, held at reading distance by a reader
//     who has time; width is scarcest here, and the title step (1.27
//     times the floor, 11.8 px) still holds about 40 characters on one
//     line of the 336 px column.
//   - screen 1.2: read at arm's length on a 640 px canvas; the title is
//     1.44 times the text.
//   - slide 1.25: read from across a room in the seconds a slide is
//     shown, where the hierarchy must be plain at a glance; the title is
//     1.56 times the text, and 1920 px have the room.
func typeRatio(m Medium) float64 {
	switch m {
	case Print:
		return 1.125
	case Slide:
		return 1.25
	}
	return 1.2
}

// spec returns the medium's canvas and type scale. Print is one journal
// column: 89 mm is the common single-column width (common practice), and
// 7 pt is the usual minimum text size at final size (common practice),
// 7 pt = 9.33 px at 96 px per inch. Screen text is at least 12 px and slides
// at least 24 px, plumb's own floors, set when the chart family was
// designed. The floor is the only size given; every other size follows
// from it and the medium's ratio.
func (m Medium) spec() (mediumSpec, error) {
	var sp mediumSpec
	switch m {
	case Screen, "":
		sp = mediumSpec{width: 640, floor: 12, pad: 12, gap: 6}
	case Print:
		sp = mediumSpec{width: 336, floor: 7 * 96.0 / 72, pad: 6, gap: 4}
	case Slide:
		sp = mediumSpec{width: 1920, height: 1080, floor: 24, pad: 48, gap: 14}
	default:
		return mediumSpec{}, fmt.Errorf("unknown medium %q: use print, screen or slide", string(m))
	}
	sp.ratio = typeRatio(m)
	sp.text = typeStep(sp.floor, sp.ratio, stepText)
	sp.small = sp.text
	sp.subtitle = typeStep(sp.floor, sp.ratio, stepSubtitle)
	sp.title = typeStep(sp.floor, sp.ratio, stepTitle)
	return sp, nil
}
