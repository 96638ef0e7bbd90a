package render

import "time"

// Annotations are drawn over a chart's data as layers of its panel: lines
// at reference values, marked instants, shaded periods and short notes
// beside one category. Each one names what it marks with a data- attribute.
type Annotations struct {
	Refs     []Ref
	Events   []Event
	Periods  []Period
	Callouts []Callout
}

// A Ref is a labelled line across the value axis at Value, or at the data's
// mean or median when Stat is "mean" or "median".
type Ref struct {
	Value float64
	Stat  string // "", "mean" or "median"
	Text  string // the label; empty labels the line with its value
}

// An Event marks one x: a number, or an instant when At is set.
type Event struct {
	X    float64
	At   time.Time
	Text string
}

// A Period shades the span of x from From to To behind the data (instants
// when FromAt and ToAt are set).
type Period struct {
	From, To     float64
	FromAt, ToAt time.Time
	Text         string
}

// A Callout is a short note set beside the bar or dot of one category.
type Callout struct {
	Label string
	Text  string
}

// layers are the panel layers that draw the annotations.
func (a Annotations) layers() []panelLayer {
	// Drawn by the annotation layers once they exist; until then a chart
	// with annotations is refused rather than drawn without them.
	return nil
}
