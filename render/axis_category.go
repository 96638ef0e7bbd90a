package render

import (
	"math"
	"strings"
)

// A category axis is the one axis (axis.go) over categories: each category
// has a band of equal length, its tick is the band's centre and its label
// is wrapped into lines. Ticks are the indexes 0..n-1 over the domain
// [-0.5, n-0.5], so that thin keeps every k-th category as it keeps every
// k-th number, and the axis is drawn from axisDraw.pos.R0 in bands of
// axis.band by drawTick, as number and time axes are.

// catLabel is one category as a chart gives it to its category axis.
type catLabel struct {
	text string // as drawn: the label, or a short form of it ("Jan")
	full string // the whole label, the tooltip when the lines shorten it
	bold bool   // highlighted
	fill Colour // the label's colour
}

// catTick is one category's label as the axis writes it.
type catTick struct {
	lines []string
	bold  bool
	fill  Colour
	tip   string // the full label when the lines do not say all of it
}

// categoryAxis writes the labels of categories on an axis with bands of
// band px (set it later with the axis's band when the length is not known
// yet): each label wrapped at word boundaries to width in at most maxLines
// lines, the last shortened with an ellipsis when it must be. upright axes
// run down the side of a plot (labels stacked, one category per row);
// others run along its foot (labels side by side). It returns the axis,
// the widest line, the most lines any label takes and which were cut.
func (f *frame) categoryAxis(cats []catLabel, band, width float64, maxLines int, upright bool) (a axis, widest float64, most int, cut []bool) {
	size := f.spec.text
	a = axis{kind: categoryTicks, d0: -0.5, d1: float64(len(cats)) - 0.5, band: band, upright: upright}
	most = 1
	cut = make([]bool, len(cats))
	for i, c := range cats {
		lines, shortened := f.wrap(c.text, size, c.bold, width, maxLines)
		cut[i] = shortened
		tip := ""
		if strings.Join(lines, " ") != c.full {
			tip = c.full
		}
		a.ticks = append(a.ticks, float64(i))
		a.labels = append(a.labels, strings.Join(lines, " "))
		a.cats = append(a.cats, catTick{lines: lines, bold: c.bold, fill: c.fill, tip: tip})
		most = max(most, len(lines))
		for _, l := range lines {
			widest = math.Max(widest, f.measure(l, size, c.bold))
		}
	}
	return a, widest, most, cut
}

// fitCategories is a category axis along a length whose labels keep apart:
// when the labels, wrapped to width, would touch, every k-th category is
// labelled (the smallest k that keeps them apart), as a crowded number
// axis is thinned.
func (f *frame) fitCategories(cats []catLabel, length, width float64, maxLines int, upright bool) axis {
	band := length / math.Max(1, float64(len(cats)))
	a, _, _, _ := f.categoryAxis(cats, band, width, maxLines, upright)
	return f.thinToFit(a, length)
}

// categoriesFit reports whether neighbouring category labels keep apart:
// side by side, a gap between their widest lines; stacked, their lines
// within their bands.
func (f *frame) categoriesFit(a axis) bool {
	sp := f.spec
	if len(a.ticks) < 2 {
		return true
	}
	lh := lineHeight(sp.text)
	step := a.band * (a.ticks[1] - a.ticks[0])
	prev := 0.0
	for i, c := range a.cats {
		if a.upright {
			if float64(len(c.lines))*lh > step {
				return false
			}
			continue
		}
		w := 0.0
		for _, l := range c.lines {
			w = math.Max(w, f.measure(l, sp.text, c.bold))
		}
		if i > 0 && (prev+w)/2+sp.gap > step {
			return false
		}
		prev = w
	}
	return true
}

// catCentre is the position of tick i's band centre on an axis drawn from
// start.
func (a axis) catCentre(start float64, i int) float64 {
	return start + (a.ticks[i]-a.d0)*a.band
}

// drawCategory draws category i's label lines: on an upright axis ending
// at d.labelAt and centred on the band, along the foot of a plot centred
// under it from the baseline d.labelAt down.
func (f *frame) drawCategory(a axis, d axisDraw, i int) {
	if !d.labels {
		return
	}
	sp := f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	c := a.cats[i]
	p := a.catCentre(d.pos.R0, i)
	if a.upright {
		textY := p + (face.Ascent(sp.text)-face.Descent(sp.text))/2
		for j, l := range c.lines {
			y := textY + (float64(j)-float64(len(c.lines)-1)/2)*lh
			f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: d.labelAt, Y: y, Text: l, Size: sp.text, Bold: c.bold, Fill: c.fill, Anchor: End, Tooltip: c.tip})
		}
		return
	}
	for j, l := range c.lines {
		f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: p, Y: d.labelAt + float64(j)*lh, Text: l, Size: sp.text, Bold: c.bold, Fill: c.fill, Anchor: Middle, Tooltip: c.tip})
	}
}
