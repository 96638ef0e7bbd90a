package render

import (
	"errors"
	"fmt"
	"math"
	"strconv"

	"plumb/layout"
	"plumb/scale"
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

// minPanelChars is the narrowest plot of a panel in a grid, in characters
// of text: room for two or three x tick labels.
const minPanelChars = 7

// lineAxes are the x and y axes of a panel of lines, on a number or time
// x axis: line charts and difference charts measure, fit and draw them
// alike.
type lineAxes struct {
	xk     xKind
	yk     yKind
	x, y   axisDomain // the domains to draw, the grid's when shared
	labelW float64    // room right of the plot for direct labels
	xName  string     // the x axis title, under the tick labels
	// Set by fit.
	left, w float64 // the room left of the plot and the plot's width
	ax      axis    // the x axis fitted to w
}

// yLabelWidth is the room the y tick labels take left of the plot, their
// gap to it included.
func (a *lineAxes) yLabelWidth(f *frame) float64 {
	return math.Ceil(f.yLabelWidth(a.y.lo, a.y.hi, a.yk) + f.spec.gap)
}

// fit places the plot in a cell cellW wide, with yw px of y tick labels
// left of it when it has them. It fits the x ticks to the plot width, then
// narrows the plot until the outer tick labels, centred on their ticks,
// stay in the cell, and returns the room left and right of the plot. The
// width may come out too small to draw, which height checks.
func (a *lineAxes) fit(f *frame, cellW, yw float64, e edges) insets {
	sp := f.spec
	left0 := 0.0
	if e.left {
		left0 = yw
	}
	w := math.Floor(cellW - a.labelW - left0)
	for {
		a.ax = f.fitX(a.x.lo, a.x.hi, a.xk, w)
		lo, ro := 0.0, 0.0
		if e.bottom {
			lo, ro = f.overhang(a.ax, w)
		}
		a.left = math.Max(left0, math.Ceil(lo))
		excess := a.left + w + math.Max(a.labelW, ro) - cellW
		// Each pass narrows the plot, so the loop ends; below a few
		// characters' width no caller draws.
		if excess <= 0 || w < sp.text*4 {
			break
		}
		w -= math.Max(1, math.Ceil(excess))
	}
	a.w = w
	// The grid gives the plot what the cell leaves: floored, the room on
	// the right gives back exactly w.
	return insets{left: a.left, right: math.Max(0, math.Floor(cellW-a.left-w))}
}

// bottom is the room under the plot: the x tick labels and the axis title
// on the grid's bottom edge, else half a line for the lowest y tick label,
// which is centred on the plot's bottom edge.
func (a *lineAxes) bottom(f *frame, e edges) float64 {
	sp := f.spec
	if !e.bottom {
		return halfLine(f)
	}
	b := f.xLabelTop(0) + lineHeight(sp.text)
	if a.xName != "" {
		b += lineHeight(sp.text)
	}
	return b
}

// halfLine is half a line of text, rounded up: the room the outer y tick
// labels, centred on the plot's top and bottom edges, reach beyond them.
func halfLine(f *frame) float64 {
	face := f.fonts.Face(false)
	return math.Ceil((face.Ascent(f.spec.text) + face.Descent(f.spec.text)) / 2)
}

// xAxisFor is the x axis for a plot w px wide: the fitted one, or fitted
// again when the grid gave another width.
func (a *lineAxes) xAxisFor(f *frame, w float64) axis {
	if w != a.w {
		a.ax, a.w = f.fitX(a.x.lo, a.x.hi, a.xk, w), w
	}
	return a.ax
}

// draw draws both axes of the plot, tick labels on the grid's outer edges
// only, and the x axis title; it returns the y under them.
func (a *lineAxes) draw(f *frame, ay axis, ys scale.Linear, plot layout.Box, e edges) float64 {
	sp := f.spec
	f.scene.Add(Mark{Kind: GroupStart, Class: "plumb-axis"})
	f.drawYAxis(ay, ys, plot.X, plot.X+plot.W, e.left)
	bottom := f.drawXAxis(a.ax, plot.X, int(plot.W), plot.Y+plot.H, e.bottom)
	if a.xName != "" && e.bottom {
		f.text(plot.X+plot.W/2, bottom+f.fonts.Face(false).Ascent(sp.text), a.xName, sp.text, false, f.th.muted, "plumb-axis-title", Middle)
		bottom += lineHeight(sp.text)
	}
	f.scene.Add(Mark{Kind: GroupEnd})
	return bottom
}

// xyDomains are the domains of a panel of lines over x in [xlo, xhi] and
// values in [ylo, yhi].
func xyDomains(xlo, xhi, ylo, yhi float64, xk xKind, yk yKind) (x, y axisDomain) {
	x = axisDomain{kind: domainNumber, lo: xlo, hi: xhi, integer: xk.integer}
	if xk.time {
		x.kind = domainTime
	}
	y = axisDomain{kind: domainNumber, lo: ylo, hi: yhi, integer: yk.integer}
	return x, y
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
