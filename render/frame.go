package render

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"plumb/layout"
)

// Common holds what every chart shares: the words around the plot, the
// medium and the fonts. Its zero value draws an untitled screen figure set in
// the Go fonts.
type Common struct {
	Title    string // above everything: what the figure is
	Subtitle string // under the title: what is measured, as a sentence
	Source   string // last line of the figure: where the numbers come from
	Note     string // under the plot, before the source: what else the reader must know

	Medium        Medium  // print, screen (default) or slide
	Width, Height float64 // canvas size in pixels; 0 takes the medium's

	Fonts     layout.Fonts // faces to measure and name; zero value: Go fonts
	EmbedFont bool         // embed the regular face so viewers draw what was measured

	// Names says how errors and notes name options; nil names the fields.
	Names OptionNames

	// Annotations are drawn over the data: reference lines, events,
	// periods and callouts. Embedded, so that their fields (Refs, Events,
	// Periods, Callouts) are options of every chart by those names.
	Annotations

	// Colors are the caller's own data colours (a brand palette), in
	// order: the first is the colour of single-series marks, the second
	// the accent of highlighted marks, and all of them colour series and
	// groups in order. Text, grid and baseline keep their own colours;
	// heat maps, maps and binned points keep their ramps. Each pair that collides under
	// a colour vision deficiency and each colour below 3:1 contrast on the
	// page is a note ("colors-cvd", "colors-contrast"); the chart is still
	// drawn with them. Nil takes plumb's palette.
	Colors []Colour

	// Notes are decisions the caller made before drawing, such as which
	// columns it read and how; they open the scene's notes, so that the
	// figure's metadata records them with the chart's own.
	Notes []Note
}

// ErrRefused is wrapped by every error that declines to draw a misleading
// chart, so that callers can tell a refusal from bad input with errors.Is.
var ErrRefused = errors.New("refused")

// frame lays out the parts every chart has: title and subtitle above,
// source and note below, the plot in between.
type frame struct {
	c     Common
	spec  mediumSpec
	fonts layout.Fonts
	th    theme
	scene *Scene
	width float64

	// slack widens every measured text width when the viewer may draw with
	// another font than the one measured: DejaVu Sans, the usual fallback
	// sans-serif on Linux, sets text 8-15% wider than Go Regular (measured
	// on chart labels), so 1.15 keeps the layout intact there and in
	// narrower faces. An embedded font is drawn as measured: slack 1.
	slack float64

	head  []textLine // title and subtitle lines, relative to the top pad
	foot  []textLine // note and source lines, relative to the footer top
	notes []string   // notes the chart added under the plot (addNote)
	headH float64
	footH float64
}

// textLine is one measured line of text waiting for its final position.
type textLine struct {
	text    string
	size    float64
	bold    bool
	fill    Colour
	class   string
	y       float64 // baseline, relative to its block
	tooltip string
}

func newFrame(c Common) (*frame, error) {
	spec, err := c.Medium.spec()
	if err != nil {
		return nil, &OptionError{Option: "Medium", Err: err}
	}
	if err := checkSize("Width", c.Width); err != nil {
		return nil, err
	}
	if err := checkSize("Height", c.Height); err != nil {
		return nil, err
	}
	if c.Width > 0 {
		spec.width = c.Width
	}
	if c.Height > 0 {
		spec.height = c.Height
	}
	colorNotes, err := checkColors(c.Colors)
	if err != nil {
		return nil, err
	}
	f := &frame{c: c, spec: spec, fonts: c.Fonts, th: defaultTheme().withColors(c.Colors), width: spec.width, slack: fallbackSlack}
	if c.EmbedFont || c.Fonts.Regular != nil {
		f.slack = 1
	}
	f.scene = &Scene{Width: spec.width, Title: c.Title, Notes: slices.Clone(c.Notes)}
	for _, n := range colorNotes {
		f.scene.Note(n.Code, n.Changed, n.Text)
	}
	reg := f.fonts.Face(false)
	f.scene.Font.Family = reg.Family() + ", sans-serif"
	f.scene.Font.Faces = layout.Fonts{Regular: reg, Bold: f.fonts.Face(true)}
	if c.EmbedFont {
		f.scene.Font.Data = reg.Data()
		f.scene.Font.Format = reg.Format()
	}
	inner := spec.width - 2*spec.pad
	if inner < 4*spec.text {
		return nil, fmt.Errorf("width %g is too narrow for text of %g px", spec.width, spec.text)
	}
	// The title block follows the order in which a figure is read: what
	// it is (the title), what is measured (the subtitle, then the unit
	// line the chart sets above its plot), the data, and last what
	// qualifies it and where it comes from (notes, then the source). See
	// "Theme" in DEVELOPERS.md for each choice and its reason.
	y := 0.0
	y = f.block(&f.head, y, c.Title, spec.title, false, f.th.text, "plumb-title", inner, 3)
	y = f.block(&f.head, y, c.Subtitle, spec.subtitle, false, f.th.text, "plumb-subtitle", inner, 3)
	if y > 0 {
		y += f.blockGap()
	}
	f.headH = y
	f.layoutFoot()
	return f, nil
}

// blockGap is the space between the title block, the plot and the footer:
// one em of the text step, more than any space inside a block (the 0.25 em
// between lines, the gap between a label and its mark), so that by
// proximity the three read as separate groups with no rule drawn.
func (f *frame) blockGap() float64 { return f.spec.text }

// layoutFoot lays out the footer: the caller's note and the notes the chart
// adds (what the reader cannot see in the plot) come first, next to the
// data they qualify; the source ends the figure, as a citation ends a quote.
func (f *frame) layoutFoot() {
	sp := f.spec
	inner := f.width - 2*sp.pad
	f.foot = f.foot[:0]
	y := f.block(&f.foot, 0, f.c.Note, sp.small, false, f.th.muted, "plumb-note", inner, 4)
	for _, n := range f.notes {
		y = f.block(&f.foot, y, n, sp.small, false, f.th.muted, "plumb-note", inner, 2)
	}
	if f.c.Source != "" {
		y = f.block(&f.foot, y, "Source: "+f.c.Source, sp.small, false, f.th.muted, "plumb-note plumb-source", inner, 3)
	}
	f.footH = y
}

// block wraps text into lines below y and returns the y under the last line.
func (f *frame) block(dst *[]textLine, y float64, text string, size float64, bold bool, fill Colour, class string, width float64, maxLines int) float64 {
	if text == "" {
		return y
	}
	face := f.fonts.Face(bold)
	lines, cut := f.wrap(text, size, bold, width, maxLines)
	tip := ""
	if cut {
		tip = text
	}
	lh := lineHeight(size)
	for _, l := range lines {
		*dst = append(*dst, textLine{text: l, size: size, bold: bold, fill: fill, class: class, y: y + face.Ascent(size), tooltip: tip})
		y += lh
	}
	return y
}

// lineHeight is the baseline-to-baseline distance for text of this size.
func lineHeight(size float64) float64 { return math.Round(size*1.25*100) / 100 }

// finish fixes the canvas height, places the header and footer, and returns
// the scene. plotBottom is where the chart's own content ends.
func (f *frame) finish(plotBottom float64) *Scene {
	s := f.spec
	for _, l := range f.head {
		f.scene.Add(f.textMark(s.pad, s.pad+l.y, l, Start))
	}
	top := plotBottom + f.blockGap()
	for _, l := range f.foot {
		f.scene.Add(f.textMark(s.pad, top+l.y, l, Start))
	}
	h := top + f.footH + s.pad
	if f.spec.height > h {
		h = f.spec.height
	}
	f.scene.Height = math.Ceil(h)
	return f.scene
}

// plotTop is where the chart's own content starts.
func (f *frame) plotTop() float64 { return f.spec.pad + f.headH }

// fixedPlotBottom is the lowest y the chart may use when the canvas height is
// fixed by the medium or the caller, or 0 when the chart chooses its height.
func (f *frame) fixedPlotBottom() float64 {
	if f.spec.height == 0 {
		return 0
	}
	return f.spec.height - f.spec.pad - f.footH - f.blockGap()
}
func (f *frame) textMark(x, y float64, l textLine, a Anchor) Mark {
	return Mark{Kind: Text, Class: l.class, X: x, Y: y, Text: l.text, Size: l.size, Bold: l.bold, Fill: l.fill, Anchor: a, Tooltip: l.tooltip}
}

// text adds one line of text to the scene.
func (f *frame) text(x, y float64, s string, size float64, bold bool, fill Colour, class string, a Anchor) {
	f.scene.Add(Mark{Kind: Text, Class: class, X: x, Y: y, Text: s, Size: size, Bold: bold, Fill: fill, Anchor: a})
}

// fallbackSlack is the frame's slack for a font that is named but not embedded.
const fallbackSlack = 1.15

// measure is the width to reserve for s: its width in the chart's face,
// widened by the slack for fallback fonts.
func (f *frame) measure(s string, size float64, bold bool) float64 {
	return f.fonts.Face(bold).Width(s, size) * f.slack
}

// wrap breaks text into lines that fit width even when drawn in a fallback font.
func (f *frame) wrap(text string, size float64, bold bool, width float64, maxLines int) ([]string, bool) {
	return layout.Wrap(f.fonts.Face(bold), text, size, width/f.slack, maxLines)
}

// addNote adds a line under the chart, after the note and before the source, for what
// the reader cannot see in the plot (categories left out). Call it before
// laying out the plot: on a fixed canvas the plot's height depends on it.
func (f *frame) addNote(text string) {
	f.notes = append(f.notes, text)
	f.layoutFoot()
}
