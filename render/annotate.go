package render

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"time"
)

// Annotations are drawn over a chart's data as layers of its panel: lines
// at reference values, marked instants, shaded periods and short notes
// beside one category. Each one names what it marks with a data- attribute.
// An annotation outside the data widens the axis it sits on (with a note
// coded "annotation-domain") rather than disappearing, and its text is
// placed where it overlaps no other text of the panel: wrapped, shortened
// with the whole text as a tooltip, or, when no place is left at all, kept
// as the tooltip of its mark (a note coded "annotation-hidden" says so).
// A period's shade is drawn behind everything its panel drew. A bad
// annotation fails the chart with an *OptionError whose Option is the
// field (Refs, Events, Periods or Callouts) and which wraps ErrAnnotation.
// Common embeds Annotations, so every chart's options take them.
type Annotations struct {
	Refs     []Ref
	Events   []Event
	Periods  []Period
	Callouts []Callout
}

// A Ref is a labelled line across the plot at Value on the value axis, or
// at the data's mean or median when Stat is "mean" or "median". Its mark
// has class plumb-ref and data-value.
type Ref struct {
	Value float64
	Stat  string // "", "mean" or "median"
	Text  string // the label; empty labels the line with its value
}

// An Event marks one x with a line, labelled at the top; its mark has
// class plumb-event and data-x. On a number axis the event is at X; on a
// time axis at At, which must then be set. Setting both (a bare year such
// as 2020 read both ways) lets one event fit either axis.
type Event struct {
	X    float64
	At   time.Time
	Text string // the label; empty labels the line with its x
}

// A Period shades the span of x from From to To behind the data, labelled
// with Text at its top; its mark has class plumb-period, data-from and
// data-to. As with Event, a time axis uses FromAt and ToAt.
type Period struct {
	From, To     float64
	FromAt, ToAt time.Time
	Text         string
}

// A Callout is a short note set beside the bar or dot of one category,
// joined to it by a leader line when it had to move away; its text has
// class plumb-callout and data-label.
type Callout struct {
	Label string // the category, as the chart's labels write it
	Text  string
}

// The statistics a Ref may be drawn at.
const (
	StatMean   = "mean"
	StatMedian = "median"
)

// layers are the panel layers that draw the annotations: one layer for
// the whole set, because their labels are placed together. Every line and
// shade is drawn first, so that no label is placed where a later line
// would cross it; then the labels are placed, callouts first (they belong
// beside one mark), then events (at the top of their line), reference
// lines and periods, whose labels can move along them.
func (a Annotations) layers() []panelLayer {
	if len(a.Refs)+len(a.Events)+len(a.Periods)+len(a.Callouts) == 0 {
		return nil
	}
	return []panelLayer{annotationLayer{a}}
}

// check returns the first bad annotation's OptionError, in the order of
// the fields.
func (a Annotations) check() error {
	for _, r := range a.Refs {
		if err := r.check(); err != nil {
			return err
		}
	}
	for _, e := range a.Events {
		if err := e.check(); err != nil {
			return err
		}
	}
	for _, p := range a.Periods {
		if err := p.check(); err != nil {
			return err
		}
	}
	for _, c := range a.Callouts {
		if err := c.check(); err != nil {
			return err
		}
	}
	return nil
}

// ErrAnnotation is the cause of every OptionError about an annotation, so
// that errors.Is tells them from the other option errors.
var ErrAnnotation = errors.New("bad annotation")

// annotationError is an OptionError about one annotation field.
func annotationError(option, value, format string, a ...any) error {
	return &OptionError{Option: option, Value: value, Err: fmt.Errorf("%w: "+format, append([]any{ErrAnnotation}, a...)...)}
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

func (r Ref) check() error {
	switch r.Stat {
	case StatMean, StatMedian:
		return nil
	case "":
		if !finite(r.Value) {
			return annotationError("Refs", numValue(r.Value), "a reference line needs a finite value, or Stat \"mean\" or \"median\"")
		}
		return nil
	}
	return annotationError("Refs", strconv.Quote(r.Stat), "Stat must be %q, %q or empty (a line at Value)", StatMean, StatMedian)
}

func (e Event) check() error {
	if !finite(e.X) {
		return annotationError("Events", numValue(e.X), "an event needs a finite X, or a date in At")
	}
	return nil
}

func (p Period) check() error {
	value := numValue(p.From) + ".." + numValue(p.To)
	if !finite(p.From) || !finite(p.To) {
		return annotationError("Periods", value, "a period needs finite ends")
	}
	if p.FromAt.IsZero() != p.ToAt.IsZero() {
		return annotationError("Periods", dateText(p.FromAt)+".."+dateText(p.ToAt), "give both ends of a period as dates, or neither")
	}
	if !p.FromAt.IsZero() {
		if !p.FromAt.Before(p.ToAt) {
			return annotationError("Periods", dateText(p.FromAt)+".."+dateText(p.ToAt), "the period's start is not before its end: give the earlier date first")
		}
		// Numbers set beside dates (a span of bare years) must agree too.
		if p.From == 0 && p.To == 0 {
			return nil
		}
	}
	if !(p.From < p.To) {
		return annotationError("Periods", value, "the period's start is not before its end: give the smaller value first")
	}
	return nil
}

func (c Callout) check() error {
	if c.Label == "" {
		return annotationError("Callouts", strconv.Quote(c.Text), "a callout needs the label of the category it belongs to")
	}
	if c.Text == "" {
		return annotationError("Callouts", strconv.Quote(c.Label), "a callout needs a text")
	}
	return nil
}

// dateText writes an instant for messages and data- attributes.
func dateText(t time.Time) string {
	if t.IsZero() {
		return "(none)"
	}
	return t.UTC().Format(time.RFC3339)
}

// seconds is an instant in Unix seconds, as time axes hold them.
func seconds(t time.Time) float64 { return float64(t.Unix()) + float64(t.Nanosecond())/1e9 }

// valueAxis is the domain a reference line sits on: x when the categories
// are rows (horizontal bars and dots), else y when it holds numbers.
func valueAxis(x, y *axisDomain) *axisDomain {
	switch {
	case y.kind == domainCategory && x.kind == domainNumber:
		return x
	case y.kind == domainNumber:
		return y
	}
	return nil
}
