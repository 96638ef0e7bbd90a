package main

import (
	"io"
	"math"
	"strconv"
	"strings"

	"errors"

	"plumb/render"
)

// histRun is one run of plumb hist.
type histRun struct {
	shared
	opt   render.HistOptions
	value string
}

func newHist() *histRun {
	r := &histRun{}
	r.shared = newShared(&r.opt.Common)
	return r
}

func (r *histRun) base() *shared { return &r.shared }

func (r *histRun) flags() []flagDef {
	o := &r.opt
	defs := []flagDef{
		{name: "value", arg: "COLUMN", usage: "column with the values (default: the first numeric column)", value: stringValue{&r.value}},
		{name: "bins", sets: []string{"Bins"}, arg: "N", usage: "about N bins over the data, the width rounded to a nice number (default: Freedman–Diaconis, Sturges when the IQR is 0)", value: intValue{&o.Bins}},
		{name: "width", sets: []string{"Width"}, arg: "W", usage: "bins exactly W wide, edges at multiples of W", value: positiveValue{&o.Width}},
		{name: "density", sets: []string{"Density"}, usage: "draw densities (count / (n · width)) instead of counts", value: boolValue{&o.Density}},
		{name: "unit", sets: []string{"Unit"}, arg: "UNIT", usage: "unit of the values, such as min or kg (default: the sign the cells carry)", value: stringValue{&o.Unit}},
		{name: "value-name", sets: []string{"ValueName"}, arg: "TEXT", usage: "what the values measure, for the axis (default: the value column's name)", value: stringValue{&o.ValueName}},
	}
	return append(defs, r.shared.flags()...)
}

func (r *histRun) load(path string, stdin io.Reader, _ func(string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error) {
	t, notes, err := r.readTable(path, stdin, nil)
	if err != nil {
		return nil, nil, err
	}
	values, o, more, err := r.plan(t, nil, *r.shared.c)
	if err != nil {
		return nil, nil, err
	}
	return append(notes, more...), func(w io.Writer) ([]render.Note, error) {
		o.Common = *r.shared.c // with the notes of loading, set after load
		return render.Hist(w, values, o)
	}, nil
}

func (r *histRun) readTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error) {
	return readGroups(path, r.readOptions(), []string{r.value}, keep, stdin)
}

// plan reads the values of the given rows (nil: every row) and finishes a
// copy of the options from the data.
func (r *histRun) plan(t *Table, rows []int, c render.Common) ([]float64, render.HistOptions, []render.Note, error) {
	g, err := groupRows(t, rows, "", r.value, false)
	if err != nil {
		return nil, render.HistOptions{}, nil, err
	}
	o := r.opt // a copy: every panel starts from the flags
	o.Common = c
	if o.Unit == "" {
		o.Unit = g.unit
	}
	if o.ValueName == "" {
		o.ValueName = g.valueCol
	}
	return g.groups[0].Values, o, g.notes, nil
}

// panel plans one histogram of small multiples or of a figure file. The
// bins are chosen from every row of the table, so that the panels of --by
// share them: a bar in one panel covers the values of the bar under it in
// the next.
func (r *histRun) panel(t *Table, rows []int, c render.Common, _ func(string) bool) (panelPart, error) {
	values, o, notes, err := r.plan(t, rows, c)
	if err != nil {
		return panelPart{}, err
	}
	if rows != nil {
		all, _, _, err := r.plan(t, nil, c)
		if err != nil {
			return panelPart{}, err
		}
		o.BinsFrom = all
	}
	return panelPart{panel: render.HistPanel(values, o), notes: notes, size: medianOf([]render.Group{{Values: values}})}, nil
}

// shares: shared bins along x and one count scale along y.
func (r *histRun) shares() (x, y bool) { return true, true }

// positiveValue sets a float64 field to a positive finite number.
type positiveValue struct{ p *float64 }

func (v positiveValue) String() string {
	if v.p == nil || *v.p == 0 {
		return ""
	}
	return strconv.FormatFloat(*v.p, 'g', -1, 64)
}

func (v positiveValue) Set(s string) error {
	f, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil || !(f > 0) || math.IsInf(f, 0) {
		return errors.New("give a positive number")
	}
	*v.p = f
	return nil
}
