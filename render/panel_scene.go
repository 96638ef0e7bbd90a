package render

import "plumb/layout"

// scenePlan joins a grid with a chart kind that builds a whole scene rather
// than a plan: the chart is built at the cell's width (and height, on a
// fixed canvas) without its title block and its marks are copied into the
// cell. It shares no scales and reports no room of its own; chart kinds
// move from it to their own plans, which can do both.
type scenePlan struct {
	build func(c Common) (*Scene, error)
	s     *Scene
}

// scenePanel makes a Panel from a scene builder; c gives the panel's own
// options, of which the title becomes the panel's heading.
func scenePanel(c Common, build func(c Common) (*Scene, error)) Panel {
	return newPanel(c, func(f *frame) (panelPlan, error) {
		return &scenePlan{build: func(w Common) (*Scene, error) {
			// The figure decides the medium and the fonts; the panel
			// keeps its own notes, which the frame cannot place.
			w.Notes = c.Notes
			w.Names = f.c.Names
			return build(w)
		}}, nil
	})
}

func (p *scenePlan) domains() (x, y axisDomain) { return }
func (p *scenePlan) share(x, y axisDomain)      {}
func (p *scenePlan) measure(f *frame, cellW float64, e edges) insets {
	return insets{}
}

func (p *scenePlan) height(f *frame, plotW, room float64) (float64, error) {
	c := Common{Medium: f.c.Medium, Fonts: f.c.Fonts, Width: plotW, Height: room}
	if c.Medium == "" {
		c.Medium = Screen
	}
	s, err := p.build(c)
	if err != nil {
		return 0, err
	}
	p.s = s
	return s.Height, nil
}

func (p *scenePlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	f.scene.Add(Mark{Kind: GroupStart, DX: round2(plot.X), DY: round2(plot.Y)})
	f.scene.Add(p.s.Marks...)
	f.scene.Add(Mark{Kind: GroupEnd})
	for _, n := range p.s.Notes {
		f.scene.Note(n.Code, n.Changed, n.Text)
	}
	return placed{}, nil
}

func (p *scenePlan) describe() (string, string) { return p.s.Desc, p.s.Title }

// BarsPanel plans a bar chart for a cell of a figure.
func BarsPanel(labels []string, values []float64, opt BarsOptions) Panel {
	return scenePanel(opt.Common, func(c Common) (*Scene, error) {
		o := opt
		o.Common = c
		return BarsScene(labels, values, o)
	})
}

// DotsPanel plans a dot plot for a cell of a figure.
func DotsPanel(labels []string, values []float64, opt DotsOptions) Panel {
	return scenePanel(opt.Common, func(c Common) (*Scene, error) {
		o := opt
		o.Common = c
		return DotsScene(labels, values, o)
	})
}
