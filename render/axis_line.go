package render

import (
	"errors"
	"fmt"
	"math"
	"strconv"
)

// Aspect ratio limits of a banked plot, as plot height over plot width. A
// banked ratio below 0.15 draws a strip too thin to read a value from; above
// 1.5 a tall column where a long series' detail is lost in the width
// (common practice: Cleveland 1993 banks within roughly these proportions).
// The limits are applied after banking, then the medium's minimum plot
// height (minPlotHeight), and the note says at what angle the median
// segment is then drawn.
const (
	MinAspect = 0.15
	MaxAspect = 1.5
)

// parseAspect reads an Aspect option.
func parseAspect(s string) (method string, forced float64, err error) {
	switch s {
	case "", "slope":
		return "", 0, nil
	case "orientation":
		return "orientation", 0, nil
	}
	var w, h float64
	if _, e := fmt.Sscanf(s, "%g:%g", &w, &h); e != nil || !(w > 0) || !(h > 0) || math.IsInf(w, 0) || math.IsInf(h, 0) {
		return "", 0, &OptionError{Option: "Aspect", Value: strconv.Quote(s), Err: errors.New("use orientation, or width:height such as 16:9")}
	}
	if a := h / w; a > 0 && !math.IsInf(a, 0) {
		return "W:H", a, nil
	}
	return "", 0, &OptionError{Option: "Aspect", Value: strconv.Quote(s), Err: errors.New("the ratio is out of range; use width:height such as 16:9")}
}

// fitPanelsX places cols plots of one width side by side, from left0 to
// the right edge less labelW (room for end labels beside the last plot). It
// fits the x ticks to the plot width, then narrows the plots until the
// outer tick labels, centred on their ticks, stay on the canvas and keep one
// text height clear of the labels of the neighbouring plot, widening the
// gutter between plots (at least gap0) as they need. It returns the first
// plot's left edge, the plot width, the gutter and the axis; the width may
// come out too small to draw, which callers check.
func (f *frame) fitPanelsX(left0, labelW float64, cols int, gap0, xlo, xhi float64, k xKind) (left, w, gap float64, ax axis) {
	sp := f.spec
	cols = max(cols, 1)
	n := float64(cols)
	right := f.width - sp.pad
	w = math.Floor((right - labelW - left0 - (n-1)*gap0) / n)
	for {
		ax = f.fitX(xlo, xhi, k, w)
		lo, ro := f.overhang(ax, w)
		left, gap = math.Max(left0, math.Ceil(sp.pad+lo)), gap0
		if cols > 1 {
			gap = math.Max(gap0, math.Ceil(lo+ro+sp.text))
		}
		excess := left + n*w + (n-1)*gap + math.Max(labelW, ro) - right
		// Each pass narrows the plots, so the loop ends; below a few
		// characters' width no caller draws.
		if excess <= 0 || w < sp.text*4 {
			return left, w, gap, ax
		}
		w -= math.Max(1, math.Ceil(excess/n))
	}
}

// axisTitleText is an axis or panel title wrapped to its width.
type axisTitleText struct {
	lines []string
	tip   string // the full text when it was shortened
}

// axisTitle wraps an axis title to at most two lines of width, shortening
// the second with an ellipsis; the full text then goes in the tooltip.
func (f *frame) axisTitle(text string, width float64) axisTitleText {
	lines, cut := f.wrap(text, f.spec.text, false, width, 2)
	t := axisTitleText{lines: lines}
	if cut {
		t.tip = text
	}
	return t
}

// height is the title's height in lines of height lh.
func (t axisTitleText) height(lh float64) float64 { return float64(len(t.lines)) * lh }

// drawAxisTitle draws the title's lines from top, starting at x.
func (f *frame) drawAxisTitle(t axisTitleText, x, top float64) {
	sp := f.spec
	asc, lh := f.fonts.Face(false).Ascent(sp.text), lineHeight(sp.text)
	for i, l := range t.lines {
		f.scene.Add(Mark{Kind: Text, Class: "plumb-axis-title", X: x, Y: top + asc + float64(i)*lh, Text: l, Size: sp.text, Fill: f.th.muted, Anchor: Start, Tooltip: t.tip})
	}
}
