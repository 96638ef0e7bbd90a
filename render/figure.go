package render

import (
	"fmt"
	"io"
	"slices"
	"strings"

	"plumb/layout"
)

// Figures: the frame's words around a grid of panels. A single chart is a
// figure of one untitled panel; a figure file is a figure of many.

// FigureOptions configures a figure of several panels.
type FigureOptions struct {
	Common
	// Columns is the number of panel columns; 0 chooses one from the
	// panel count and the canvas.
	Columns int
	// ShareX and ShareY give every panel whose axis measures the same
	// kind of thing one scale along x or y, so that equal lengths mean
	// equal amounts across the figure.
	ShareX, ShareY bool
}

// Figure draws panels in a grid under one title and writes the figure as
// SVG to w. It returns the notes of every panel.
func Figure(w io.Writer, opt FigureOptions, panels ...Panel) ([]Note, error) {
	s, err := FigureScene(opt, panels...)
	return writeScene(w, s, err)
}

// FigureScene builds the figure's scene without writing it.
func FigureScene(opt FigureOptions, panels ...Panel) (*Scene, error) {
	if opt.Columns < 0 {
		return nil, &OptionError{Option: "Columns", Value: fmt.Sprint(opt.Columns), Err: ErrNegative}
	}
	return figureScene(opt.Common, gridOptions{cols: opt.Columns, shareX: opt.ShareX, shareY: opt.ShareY, independent: true}, panels)
}

// chartScene is the scene of one chart drawn alone: a figure of one
// panel whose options' title is the figure's title, not a heading of the
// panel as well.
func chartScene(c Common, p Panel) (*Scene, error) {
	p.Title = ""
	return figureScene(c, gridOptions{}, []Panel{p})
}

// writeScene writes a chart's scene as SVG and returns its notes: the
// writer function of every chart kind.
func writeScene(w io.Writer, s *Scene, err error) ([]Note, error) {
	if err != nil {
		return nil, err
	}
	return s.Notes, WriteSVG(w, s)
}

// figureScene is every figure: the frame's words around a grid of panels.
// A single chart is a figure of one untitled panel.
func figureScene(c Common, o gridOptions, panels []Panel) (*Scene, error) {
	f, err := newFrame(c)
	if err != nil {
		return nil, err
	}
	cells := make([]gridCell, len(panels))
	for i, p := range panels {
		if p.plan == nil {
			return nil, fmt.Errorf("panel %d: not made by a chart's Panel function", i+1)
		}
		k := len(f.notes)
		// A panel that gives its own colours is planned and drawn in
		// them, checked like the figure's.
		own := len(p.colors) > 0 && !slices.Equal(p.colors, f.c.Colors)
		th := f.th
		if own {
			notes, err := checkColors(p.colors)
			if err != nil {
				return nil, err
			}
			for _, n := range notes {
				text := n.Text
				if p.Title != "" {
					text = p.Title + ": " + text
				}
				f.scene.Note(n.Code, n.Changed, text)
			}
			th = th.withColors(p.colors)
		}
		restore := f.withTheme(th)
		plan, err := p.plan(f)
		restore()
		if own && err == nil {
			plan = themedPlan{plan, th}
		}
		if len(panels) > 1 && p.Title != "" && len(f.notes) > k {
			// A line under a figure of several panels says which one it
			// is about.
			for j := k; j < len(f.notes); j++ {
				f.notes[j] = p.Title + ": " + f.notes[j]
			}
			f.layoutFoot()
		}
		if err != nil {
			if len(panels) > 1 && p.Title != "" {
				return nil, fmt.Errorf("panel %q: %w", p.Title, err)
			}
			return nil, err
		}
		cells[i] = gridCell{title: p.Title, name: p.name, plan: plan, layers: p.layers}
	}
	res, err := f.drawGrid(cells, o, f.plotTop())
	if err != nil {
		return nil, err
	}
	f.describeGrid(cells, o)
	return f.finish(res.bottom), nil
}

// describeGrid writes the figure's description from its panels': a single
// chart's own, or each panel's under its heading.
func (f *frame) describeGrid(cells []gridCell, o gridOptions) {
	if o.describe != nil {
		desc, name := o.describe()
		f.scene.Desc = desc
		if f.scene.Title == "" {
			f.scene.Title = name
		}
		return
	}
	if len(cells) == 1 {
		desc, name := cells[0].plan.describe()
		f.scene.Desc = desc
		if f.scene.Title == "" {
			f.scene.Title = name
		}
		return
	}
	var b strings.Builder
	fmt.Fprintf(&b, "%d panels.", len(cells))
	names := make([]string, 0, len(cells))
	for i, c := range cells {
		desc, name := c.plan.describe()
		head := c.title
		if head == "" {
			head = fmt.Sprintf("Panel %d", i+1)
		}
		fmt.Fprintf(&b, " %s: %s", head, desc)
		names = append(names, name)
	}
	f.scene.Desc = b.String()
	if f.scene.Title == "" {
		if len(names) > 3 {
			names = append(names[:3], "…")
		}
		f.scene.Title = strings.Join(names, "; ")
	}
}

// withTheme sets the frame's theme and returns what restores the old one.
func (f *frame) withTheme(th theme) (restore func()) {
	old := f.th
	f.th = th
	return func() { f.th = old }
}

// themedPlan draws a plan in its own theme: a panel of a figure that gives
// its own colours.
type themedPlan struct {
	panelPlan
	th theme
}

func (p themedPlan) measure(f *frame, cellW float64, e edges) insets {
	defer f.withTheme(p.th)()
	return p.panelPlan.measure(f, cellW, e)
}

func (p themedPlan) height(f *frame, plotW, room float64) (float64, error) {
	defer f.withTheme(p.th)()
	return p.panelPlan.height(f, plotW, room)
}

func (p themedPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	defer f.withTheme(p.th)()
	return p.panelPlan.draw(f, plot, e)
}
