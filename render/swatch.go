package render

import (
	"fmt"
	"io"
	"math"
	"strings"

	"plumb/layout"
	"plumb/palette"
)

// Sizes of the palette sheet, in pixels.
const (
	sheetMargin   = 20.0
	sheetTitle    = 16.0 // title font size
	sheetText     = 12.0 // labels and distances
	sheetSwatchH  = 28.0
	sheetRowGap   = 6.0
	sheetColGap   = 12.0
	sheetMinColW  = 96.0
	sheetHeaderH  = 24.0
	sheetFooterH  = 40.0
	sheetTitleGap = 18.0
	sheetLineH    = 16.0 // baseline to baseline of the footer lines
	// sheetSlack widens every measured text: a viewer without the Go fonts
	// draws in its own sans serif (often DejaVu Sans), which sets the same
	// string wider than Go Regular.
	sheetSlack = 1.15
)

// PaletteSheet builds a swatch sheet: one row per colour, one column per
// vision (normal, protan, deutan, tritan, simulated at full severity after
// Machado et al. 2009), and under each column the smallest CIEDE2000
// distance between two colours as that reader sees them, with the pair.
// Every swatch is a rect carrying data-label (the colour as given),
// data-value (the colour as seen) and data-series (the vision).
func PaletteSheet(title string, colors []palette.SRGB) *Scene {
	fonts := layout.Fonts{}
	measure := func(s string, size float64, bold bool) float64 {
		return fonts.Face(bold).Width(s, size) * sheetSlack
	}
	p := palette.Palette(colors)
	text, muted := RGB(palette.Text()), RGB(palette.Muted())

	type column struct {
		v    palette.Vision
		min  string
		pair string
		minD float64
	}
	cols := make([]column, len(palette.Visions))
	colW := sheetMinColW
	for k, v := range palette.Visions {
		c := column{v: v, min: "closest: none", minD: math.Inf(1)}
		if i, j, d := p.ClosestPair(v); i >= 0 {
			c.minD = d
			c.min = fmt.Sprintf("closest ΔE %.1f", d)
			c.pair = fmt.Sprintf("%s / %s", colors[i].Hex(), colors[j].Hex())
		}
		cols[k] = c
		colW = math.Max(colW, measure(v.String(), sheetText, true)+sheetColGap)
		for _, s := range []string{c.min, c.pair} {
			colW = math.Max(colW, measure(s, sheetText, false)+sheetColGap)
		}
	}
	labelW := measure("#000000", sheetText, false) + sheetColGap

	s := &Scene{Title: title, Font: Font{Family: fonts.Face(false).Family() + ", sans-serif", Faces: layout.Fonts{Regular: fonts.Face(false), Bold: fonts.Face(true)}}}
	if s.Title == "" {
		s.Title = "Palette"
	}
	titleW := measure(s.Title, sheetTitle, true)
	gridW := labelW + float64(len(cols))*colW
	s.Width = math.Ceil(2*sheetMargin + math.Max(gridW, titleW))
	top := sheetMargin + sheetTitle + sheetTitleGap
	rowsH := float64(len(colors)) * (sheetSwatchH + sheetRowGap)
	s.Height = math.Ceil(top + sheetHeaderH + rowsH + sheetFooterH + sheetMargin)

	s.Add(Mark{Kind: Text, Class: "plumb-title", X: sheetMargin, Y: sheetMargin + sheetTitle,
		Text: s.Title, Size: sheetTitle, Bold: true, Fill: text})
	s.Add(Mark{Kind: GroupStart, Class: "plumb-panel plumb-swatches", DX: sheetMargin, DY: top})
	for k, c := range cols {
		x := labelW + float64(k)*colW
		s.Add(Mark{Kind: Text, Class: "plumb-label plumb-vision", X: x, Y: sheetText,
			Text: c.v.String(), Size: sheetText, Bold: true, Fill: text})
		for r, col := range colors {
			seen := palette.Simulate(col, c.v, 1)
			s.Add(Mark{Kind: Rect, Class: "plumb-mark plumb-swatch",
				X: x, Y: sheetHeaderH + float64(r)*(sheetSwatchH+sheetRowGap),
				W: colW - sheetColGap, H: sheetSwatchH, Fill: RGB(seen),
				Attrs: []Attr{{"label", col.Hex()}, {"value", seen.Hex()}, {"series", c.v.String()}}})
		}
		y := sheetHeaderH + rowsH + sheetText
		s.Add(Mark{Kind: Text, Class: "plumb-value plumb-distance", X: x, Y: y,
			Text: c.min, Size: sheetText, Fill: text,
			Attrs: []Attr{{"series", c.v.String()}, {"value", distanceAttr(c.minD)}}})
		if c.pair != "" {
			s.Add(Mark{Kind: Text, Class: "plumb-note plumb-pair", X: x, Y: y + sheetLineH,
				Text: c.pair, Size: sheetText, Fill: muted})
		}
	}
	for r, col := range colors {
		y := sheetHeaderH + float64(r)*(sheetSwatchH+sheetRowGap) + sheetSwatchH/2 + sheetText*0.35
		s.Add(Mark{Kind: Text, Class: "plumb-label", X: 0, Y: y, Text: col.Hex(), Size: sheetText, Fill: muted})
	}
	s.Add(Mark{Kind: GroupEnd})
	mins := make([]float64, len(cols))
	for k, c := range cols {
		mins[k] = c.minD
	}
	s.Desc = sheetDesc(colors, mins)
	s.Note("cvd-method", false, "colour vision simulated with Machado, Oliveira & Fernandes (2009) at full severity; distances are CIEDE2000")
	return s
}

func distanceAttr(d float64) string {
	if math.IsInf(d, 0) || math.IsNaN(d) {
		return ""
	}
	return fmt.Sprintf("%.2f", d)
}

// sheetDesc says in words what the sheet shows, for readers who cannot see it.
func sheetDesc(colors []palette.SRGB, mins []float64) string {
	var b strings.Builder
	fmt.Fprintf(&b, "%d %s (%s) shown as seen with normal, protan, deutan and tritan colour vision.",
		len(colors), plural(len(colors), "colour", "colours"), strings.Join(palette.Palette(colors).Hex(), ", "))
	if len(colors) < 2 {
		return b.String()
	}
	b.WriteString(" Smallest CIEDE2000 distance between two colours:")
	for k, v := range palette.Visions {
		sep := ","
		if k == len(palette.Visions)-1 {
			sep = "."
		}
		fmt.Fprintf(&b, " %s %.1f%s", v, mins[k], sep)
	}
	return b.String()
}

// WritePaletteSheet writes PaletteSheet as SVG.
func WritePaletteSheet(w io.Writer, title string, colors []palette.SRGB) error {
	return WriteSVG(w, PaletteSheet(title, colors))
}
