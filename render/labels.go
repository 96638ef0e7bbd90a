package render

import (
	"fmt"
	"math"
	"strings"

	"plumb/layout"
	"plumb/palette"
)

// This file is the one label placer. A chart names its marks directly
// where it can (Tufte's direct labels: the name beside the thing named) and
// falls back to a key only when the names cannot be set apart: series names
// at their line ends, region names of a difference chart, annotation text,
// group names of a scatter plot all go through the same three steps:
// measure (measureLabels), spread apart along one axis with the least
// total movement and a leader for every moved label (spreadLabels), or,
// when they do not fit, one key row each (key).

// A label is one name the placer sets beside its mark.
type label struct {
	lines []string // the name wrapped to the label's width
	full  string   // the whole name: the tooltip when shortened, and data-series
	color Colour   // the mark's colour, for a key's swatch
	text  Colour   // the text colour: the mark's hue, darkened until it reads at 4.5:1
	at    float64  // where along the spreading axis the label belongs (a line end's y)
}

// measureLabels wraps each name to at most two lines of maxW and returns
// the labels and the width they need beside the marks, leader room
// included. Each label takes its mark's hue, darkened in OKLCH lightness
// until it meets the 4.5:1 text contrast of WCAG 2.x on the white
// background, so that label and mark read as one.
func (f *frame) measureLabels(names []string, colors []Colour, maxW float64) ([]label, float64) {
	sp := f.spec
	labels := make([]label, len(names))
	width := 0.0
	white := palette.SRGB{R: 1, G: 1, B: 1}
	for i, n := range names {
		lines, cut := f.wrap(n, sp.text, false, maxW, 2)
		if cut {
			f.scene.Note("label-shortened", false, fmt.Sprintf("shortened the label %q to fit; the full text is in its tooltip", n))
		}
		txt := f.th.text
		if dark, ok := palette.DarkenToContrast(colors[i].SRGB(), white, 4.5); ok {
			txt = RGB(dark)
		}
		labels[i] = label{lines: lines, full: n, color: colors[i], text: txt}
		for _, l := range lines {
			width = math.Max(width, f.measure(l, sp.text, false))
		}
	}
	return labels, width + f.labelIndent()
}

// labelIndent is the room between the marks' edge and label text, where
// the leaders run.
func (f *frame) labelIndent() float64 { return f.spec.gap * 3 }

// labelGap is the distance between the centres of neighbouring labels:
// a line per line of the tallest label, and a little air between labels
// of several lines, or two wrapped names read as one.
func (f *frame) labelGap(labels []label) (gap, hang float64) {
	sp := f.spec
	lh := lineHeight(sp.text)
	maxLines := 1
	for _, l := range labels {
		maxLines = max(maxLines, len(l.lines))
	}
	gap = lh * float64(maxLines)
	if maxLines > 1 {
		gap += sp.gap
	}
	// A label of several lines is centred on its place, so its extra lines
	// must stay within the span too.
	return gap, float64(maxLines-1) * lh / 2
}

// labelsFitSpan reports whether the labels can be spread apart within a
// span of the given length.
func (f *frame) labelsFitSpan(labels []label, length float64) bool {
	gap, hang := f.labelGap(labels)
	return float64(len(labels)-1)*gap <= length-2*hang
}

// spreadLabels moves the labels apart vertically with the least total
// displacement (layout.Spread) between top and bottom and draws them right
// of the edge at x = right, each with a leader from where it belongs. It
// returns the text boxes, or false, drawing nothing, when they cannot fit.
// Leaders are thin and in the muted text colour, and run only in the margin
// beyond the edge: in the mark's colour and starting at its end they would
// read as the data going on.
func (f *frame) spreadLabels(labels []label, right, top, bottom float64) ([]layout.Box, bool) {
	sp := f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	want := make([]float64, len(labels))
	for i, l := range labels {
		want[i] = l.at
	}
	gap, hang := f.labelGap(labels)
	got, ok := spreadAlong(want, gap, hang, top, bottom)
	if !ok {
		return nil, false
	}
	x := right + f.labelIndent()
	boxes := make([]layout.Box, 0, len(labels))
	for i, l := range labels {
		y := got[i]
		f.leader(Point{right + sp.gap/2, l.at}, Point{x - sp.gap/2, y}, []Attr{{"series", l.full}})
		tip := ""
		if strings.Join(l.lines, " ") != l.full {
			tip = l.full
		}
		w := 0.0
		for j, t := range l.lines {
			base := y + (asc-desc)/2 + (float64(j)-float64(len(l.lines)-1)/2)*lh
			f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: x, Y: base, Text: t, Size: sp.text, Fill: l.text, Anchor: Start, Tooltip: tip,
				Attrs: []Attr{{"series", l.full}}})
			w = math.Max(w, f.measure(t, sp.text, false))
		}
		n := float64(len(l.lines))
		boxes = append(boxes, layout.Box{X: x, Y: y - (n-1)*lh/2 - asc/2 - desc/2, W: w, H: (n-1)*lh + asc + desc})
	}
	return boxes, true
}

// spreadAlong places labels along one axis (y for labels stacked beside an
// edge, x for labels set in a row), each as near where it wants to be as
// its neighbours allow: centres at least gap apart with the least total
// movement (layout.Spread), every label within [lo, hi] including the
// hang of its text beyond its centre. It reports false when they cannot
// fit. Annotation text and group labels are spread the same way: gap is
// the largest label's extent along the axis plus the air between labels.
func spreadAlong(want []float64, gap, hang, lo, hi float64) ([]float64, bool) {
	if lo+hang > hi-hang {
		return nil, false
	}
	got, ok := layout.Spread(want, gap, lo+hang, hi-hang)
	if !ok {
		return nil, false
	}
	return got, true
}

// leader draws the thin line from a mark (at from) to its moved label (at
// to), in the muted text colour so that it never reads as data. Every
// chart's leaders and the annotations' are drawn here.
func (f *frame) leader(from, to Point, attrs []Attr) {
	f.scene.Add(Mark{Kind: Path, Class: "plumb-leader", Lines: [][]Point{{{round2(from.X), round2(from.Y)}, {round2(to.X), round2(to.Y)}}},
		Stroke: f.th.muted, StrokeWidth: 0.75, Join: JoinRound, Cap: CapRound, Attrs: attrs})
}

// swatchKind is how a key row shows its mark.
type swatchKind uint8

const (
	swatchLine swatchKind = iota // a short stroke in the line's colour
	swatchArea                   // a square of the area's fill
)

// A keyRow is one row of a key: a swatch and what it stands for.
type keyRow struct {
	swatch swatchKind
	color  Colour // the swatch
	text   Colour // the text
	label  string // the text drawn; empty draws the swatch alone
	tip    string // the whole text when label is shortened
	series string // data-series of the text, when the row names a series
}

// keyRows are the key rows of labels that could not be placed directly.
func keyRows(labels []label) []keyRow {
	rows := make([]keyRow, len(labels))
	for i, l := range labels {
		rows[i] = keyRow{swatch: swatchLine, color: l.color, text: l.text, label: l.full, series: l.full}
	}
	return rows
}

// key draws one row per item from y down, starting at left, one gap under
// what is above; it returns the y under it and the text boxes.
func (f *frame) key(rows []keyRow, left, y float64) (float64, []layout.Box) {
	if len(rows) == 0 {
		return y, nil
	}
	sp := f.spec
	lh := lineHeight(sp.text)
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-legend"})
	y += sp.gap
	var boxes []layout.Box
	for _, r := range rows {
		cy := y + lh/2
		sw := sp.text
		switch r.swatch {
		case swatchLine:
			sw = sp.text * 1.5
			f.scene.Add(Mark{Kind: Path, Class: "plumb-swatch", Lines: [][]Point{{{left, round2(cy)}, {left + sw, round2(cy)}}}, Stroke: r.color, StrokeWidth: 2, Join: JoinRound, Cap: CapRound})
		case swatchArea:
			f.scene.Add(Mark{Kind: Rect, Class: "plumb-swatch", X: left, Y: round2(y + (lh-sw)/2), W: sw, H: sw, Fill: r.color})
		}
		if r.label != "" {
			var attrs []Attr
			if r.series != "" {
				attrs = []Attr{{"series", r.series}}
			}
			x := left + sw + sp.gap
			f.scene.Add(Mark{Kind: Text, Class: "plumb-label", X: x, Y: round2(cy + (asc-desc)/2), Text: r.label, Size: sp.text, Fill: r.text, Tooltip: r.tip, Attrs: attrs})
			boxes = append(boxes, layout.Box{X: x, Y: cy - (asc+desc)/2, W: f.measure(r.label, sp.text, false), H: asc + desc})
		}
		y += lh
	}
	f.scene.Add(Mark{Kind: GroupEnd})
	return y, boxes
}

// keyHeight is the height key gives n rows.
func (f *frame) keyHeight(n int) float64 {
	if n == 0 {
		return 0
	}
	return f.spec.gap + float64(n)*lineHeight(f.spec.text)
}

// boxesSince are the boxes of the text and of the data marks added to the
// scene from mark index from on: what a panel drew, for the layers drawn
// over it, which must keep clear of it.
func (f *frame) boxesSince(from int) (text, marks []layout.Box) {
	for _, m := range f.scene.Marks[from:] {
		switch {
		case m.Kind == Text:
			face := f.fonts.Face(m.Bold)
			asc, desc := face.Ascent(m.Size), face.Descent(m.Size)
			w := f.measure(m.Text, m.Size, m.Bold)
			x := m.X
			switch m.Anchor {
			case Middle:
				x -= w / 2
			case End:
				x -= w
			}
			text = append(text, layout.Box{X: x, Y: m.Y - asc, W: w, H: asc + desc})
		case m.Kind == Circle && strings.Contains(m.Class, "plumb-mark"):
			marks = append(marks, layout.Box{X: m.X - m.R, Y: m.Y - m.R, W: 2 * m.R, H: 2 * m.R})
		case m.Kind == Path && strings.Contains(m.Class, "plumb-mark"):
			for _, l := range m.Lines {
				if b, ok := pointsBox(l); ok {
					marks = append(marks, b)
				}
			}
		}
	}
	return text, marks
}

// pointsBox is the smallest box holding the points.
func pointsBox(pts []Point) (layout.Box, bool) {
	if len(pts) == 0 {
		return layout.Box{}, false
	}
	x0, y0, x1, y1 := pts[0].X, pts[0].Y, pts[0].X, pts[0].Y
	for _, p := range pts[1:] {
		x0, y0, x1, y1 = math.Min(x0, p.X), math.Min(y0, p.Y), math.Max(x1, p.X), math.Max(y1, p.Y)
	}
	return layout.Box{X: x0, Y: y0, W: x1 - x0, H: y1 - y0}, true
}
