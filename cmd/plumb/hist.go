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
	g, err := loadGroups(path, r.readOptions(), "", r.value, nil, false, stdin)
	if err != nil {
		return nil, nil, err
	}
	o := &r.opt
	if o.Unit == "" {
		o.Unit = g.unit
	}
	if o.ValueName == "" {
		o.ValueName = g.valueCol
	}
	return g.notes, func(w io.Writer) ([]render.Note, error) { return render.Hist(w, g.groups[0].Values, r.opt) }, nil
}

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
