package main

import (
	"fmt"
	"io"

	"plumb/internal/table"
	"plumb/render"
)

// rowsRun is one run of plumb bars or plumb dots: the options the builder
// receives, which the flags set directly, and the columns to read.
type rowsRun struct {
	shared
	dots bool
	bars render.BarsOptions
	dot  render.DotsOptions
	row  *render.RowOptions // the RowOptions of bars or dot, whichever is drawn

	label, value, agg string
}

func newRows(dots bool) *rowsRun {
	r := &rowsRun{dots: dots, agg: "sum"}
	c, row := &r.bars.Common, &r.bars.RowOptions
	if dots {
		c, row, r.agg = &r.dot.Common, &r.dot.RowOptions, "mean"
	}
	r.shared, r.row = newShared(c), row
	row.Order = render.ByValue
	return r
}

func (r *rowsRun) base() *shared { return &r.shared }

// orders are the values of --order.
var orders = []string{string(render.ByValue), string(render.ByLabel), string(render.ByData)}

func (r *rowsRun) flags() []flagDef {
	o := r.row
	defs := []flagDef{
		{name: "label", arg: "COLUMN", usage: "column with the category labels (default: the first column)", value: stringValue{&r.label}},
		{name: "value", arg: "COLUMN", usage: "column with the values (default: the first numeric column after the labels)", value: stringValue{&r.value}},
		{name: "order", sets: []string{"Order"}, values: orders, def: string(render.ByValue), usage: "order of categories: value (largest first), label, or data (as in the file)",
			value: choiceValue[render.Order]{p: &o.Order, values: orders}},
	}
	if r.dots {
		defs = append(defs,
			flagDef{name: "top", sets: []string{"Top"}, arg: "N", usage: fmt.Sprintf("show at most N categories, the largest; the rest are left out with a note (default %d; -1 shows all)", render.DefaultDotsTop),
				value: intValue{&o.Top}},
			flagDef{name: "other", sets: []string{"Other"}, values: []string{"none", "mean"}, usage: "what becomes of categories beyond --top: none (left out, the default) or mean (one Other dot)",
				value: choiceValue[render.OtherMode]{p: &o.Other, values: []string{"none", "mean"}, refused: map[string]string{
					"sum": "a dot marks a position, not an amount, so dots are never summed; use --other mean or none, or draw bars"}}})
	} else {
		defs = append(defs,
			flagDef{name: "top", sets: []string{"Top"}, arg: "N", usage: fmt.Sprintf("show at most N categories (default: all, or %d with the rest summed into Other when the values are parts of a whole; -1 shows all)", render.DefaultTop),
				value: intValue{&o.Top}},
			flagDef{name: "other", sets: []string{"Other"}, values: []string{"sum", "mean", "none"}, usage: "combine categories beyond --top into Other by sum or mean, or none (leave them out with a note); default: sum for parts of a whole, else none",
				value: choiceValue[render.OtherMode]{p: &o.Other, values: []string{"sum", "mean", "none"}}})
	}
	defs = append(defs,
		flagDef{name: "highlight", sets: []string{"Highlight"}, arg: "LABELS", repeat: true, usage: "draw these LABELS (comma-separated) in the accent colour", value: listValue{&o.Highlight}},
		flagDef{name: "from", sets: []string{"From"}, arg: "NUMBER", usage: "start of the value axis (may widen it, never hide data)", value: numberValue{&o.From}},
		flagDef{name: "to", sets: []string{"To"}, arg: "NUMBER", usage: "end of the value axis (may widen it, never hide data)", value: numberValue{&o.To}},
		flagDef{name: "unit", sets: []string{"Unit"}, arg: "UNIT", usage: "unit appended to values, such as % or kg (default: the sign the cells carry)", value: stringValue{&o.Unit}},
		flagDef{name: "value-name", sets: []string{"ValueName"}, arg: "TEXT", usage: "what the values measure, for the axis (default: the value column's name)", value: stringValue{&o.ValueName}},
		flagDef{name: "agg", values: table.Aggregations, def: r.agg, usage: "combine repeated labels", value: choiceValue[string]{p: &r.agg, values: table.Aggregations}},
	)
	if !r.dots {
		defs = append(defs,
			flagDef{name: "vertical", sets: []string{"Vertical"}, usage: "stand the bars up (horizontal bars read better with long labels)", value: boolValue{&r.bars.Vertical}},
			flagDef{name: "percent", sets: []string{"Percent"}, usage: "show each value as a percentage of the total", value: boolValue{&r.bars.Percent}})
	}
	return append(defs, r.shared.flags()...)
}

func (r *rowsRun) load(path string, stdin io.Reader, given func(string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error) {
	d, err := loadLabelled(path, r.readOptions(), r.label, r.value, r.agg, stdin)
	if err != nil {
		return nil, nil, err
	}
	r.finish(d, r.row, &r.bars, given)
	return d.notes, func(w io.Writer) ([]render.Note, error) {
		if r.dots {
			return render.Dots(w, d.labels, d.values, r.dot)
		}
		return render.Bars(w, d.labels, d.values, r.bars)
	}, nil
}

// finish completes the row options o (and bars, for bars) from the data.
func (r *rowsRun) finish(d *labelled, o *render.RowOptions, bars *render.BarsOptions, given func(string) bool) {
	if o.Unit == "" {
		o.Unit = d.unit // the sign the cells carry, such as % or $
	}
	if o.ValueName == "" {
		o.ValueName = d.valueCol
	}
	o.LabelName = d.labelCol
	o.Averages = r.agg != "sum" && r.agg != "count"
	// Values are parts of a whole when they are shares, when the user said
	// they sum or count, or when repeated labels really were summed; a
	// single value per label may be a median or a rate, which never adds.
	bars.Additive = bars.Percent || (given("agg") && !o.Averages) || (r.agg == "sum" && len(d.repeated) > 0)
}

// The panel side of bars and dots (panelChart), for --by and figure files.

func (r *rowsRun) readTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error) {
	return readLabelled(path, r.readOptions(), r.label, r.value, r.agg, keep, stdin)
}

func (r *rowsRun) panel(t *Table, rows []int, c render.Common, given func(string) bool) (panelPart, error) {
	d, err := labelledRows(t, nil, r.label, r.value, r.agg, rows)
	if err != nil {
		return panelPart{}, err
	}
	bars, dots := r.bars, r.dot // copies: every panel starts from the flags
	o := &bars.RowOptions
	if r.dots {
		o = &dots.RowOptions
	}
	r.finish(d, o, &bars, given)
	part := panelPart{notes: d.notes, size: sizeOf(d.values, !o.Averages), total: !o.Averages}
	if r.dots {
		dots.Common = c
		part.panel = render.DotsPanel(d.labels, d.values, dots)
	} else {
		bars.Common = c
		part.panel = render.BarsPanel(d.labels, d.values, bars)
	}
	return part, nil
}

// shares: the value axis runs along x, or along y for standing bars.
func (r *rowsRun) shares() (x, y bool) {
	if !r.dots && r.bars.Vertical {
		return false, true
	}
	return true, false
}
