package main

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strings"

	"plumb/internal/stats"
	"plumb/render"
)

// ErrDuplicateLabel is the cause of a DataError for a category given on
// two rows where a chart needs one row per category.
var ErrDuplicateLabel = errors.New("category given twice")

// boxRun is one run of plumb box: the options the builder receives and the
// columns to read.
type boxRun struct {
	shared
	opt          render.BoxOptions
	group, value string
}

func newBox() *boxRun {
	r := &boxRun{}
	r.shared = newShared(&r.opt.Common)
	r.opt.Order = render.ByValue
	return r
}

func (r *boxRun) base() *shared { return &r.shared }

func (r *boxRun) flags() []flagDef {
	o := &r.opt
	defs := []flagDef{
		{name: "group", arg: "COLUMN", usage: "column naming each row's group, one box per group (default: one box of all rows)", value: stringValue{&r.group}},
		{name: "value", arg: "COLUMN", usage: "column with the values (default: the first numeric column)", value: stringValue{&r.value}},
		{name: "order", sets: []string{"Order"}, values: orders, def: string(render.ByValue), usage: "order of groups: value (by median, largest first), label, or data (as in the file)",
			value: choiceValue[render.Order]{p: &o.Order, values: orders}},
		{name: "unit", sets: []string{"Unit"}, arg: "UNIT", usage: "unit of the values, such as min or kg (default: the sign the cells carry)", value: stringValue{&o.Unit}},
		{name: "value-name", sets: []string{"ValueName"}, arg: "TEXT", usage: "what the values measure, for the axis (default: the value column's name)", value: stringValue{&o.ValueName}},
		{name: "vertical", sets: []string{"Vertical"}, usage: "stand the boxes up, one column per group (rows read better with long names)", value: boolValue{&o.Vertical}},
	}
	return append(defs, r.shared.flags()...)
}

func (r *boxRun) load(path string, stdin io.Reader, _ func(string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error) {
	t, notes, err := r.readTable(path, stdin, nil)
	if err != nil {
		return nil, nil, err
	}
	part, err := r.plan(t, nil, *r.shared.c)
	if err != nil {
		return nil, nil, err
	}
	return append(notes, part.notes...), func(w io.Writer) ([]render.Note, error) {
		o := part.opt
		o.Common = *r.shared.c // with the notes of loading, set after load
		return render.Box(w, part.groups, o)
	}, nil
}

func (r *boxRun) readTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error) {
	return readGroups(path, r.readOptions(), []string{r.group, r.value}, keep, stdin)
}

// boxPart is a planned panel with what load draws from it.
type boxPart struct {
	panelPart
	groups []render.Group
	opt    render.BoxOptions
}

func (r *boxRun) panel(t *Table, rows []int, c render.Common, _ func(string) bool) (panelPart, error) {
	p, err := r.plan(t, rows, c)
	return p.panelPart, err
}

// plan groups the rows and finishes a copy of the options from the data.
func (r *boxRun) plan(t *Table, rows []int, c render.Common) (boxPart, error) {
	g, err := groupRows(t, rows, r.group, r.value, false)
	if err != nil {
		return boxPart{}, err
	}
	o := r.opt // a copy: every panel starts from the flags
	o.Common = c
	if o.Unit == "" {
		o.Unit = g.unit
	}
	if o.ValueName == "" {
		o.ValueName = g.valueCol
	}
	o.GroupName = r.group
	return boxPart{
		panelPart: panelPart{panel: render.BoxPanel(g.groups, o), notes: g.notes, size: medianOf(g.groups)},
		groups:    g.groups, opt: o,
	}, nil
}

// shares: the value axis and the groups, so that a row (or a column of
// standing boxes) is one group in every panel.
func (r *boxRun) shares() (x, y bool) { return true, true }

// medianOf is the median of every value of the groups, by which --by-order
// value sorts panels of distributions.
func medianOf(groups []render.Group) float64 {
	var all []float64
	for _, g := range groups {
		all = append(all, g.Values...)
	}
	s, err := stats.Sorted(all)
	if err != nil {
		return math.NaN()
	}
	return stats.Quantile(s, 0.5)
}

// grouped is a value column split by a group column, groups in order of
// first appearance.
type grouped struct {
	groups   []render.Group
	valueCol string
	groupCol string // "" for one group of every row
	unit     string
	notes    []render.Note
	t        *Table
	rows     [][]int // each group's row indices in the table
}

// readGroups reads the data file for a chart of distributions, keeping
// the named columns (those given) and keep; with no value column named it
// keeps every column, to choose from.
func readGroups(path string, o readOptions, cols, keep []string, stdin io.Reader) (*Table, []render.Note, error) {
	var want []string
	named := true
	for _, c := range cols {
		if c != "" {
			want = append(want, c)
		} else {
			named = false
		}
	}
	if !named {
		want = nil
	} else {
		want = append(want, keep...)
	}
	t, notes, err := readData(path, o, want, stdin)
	if err != nil {
		return nil, nil, err
	}
	if t.Len() == 0 {
		return nil, nil, &DataError{File: t.File, Err: ErrEmpty, Hint: "the file has a header but no rows"}
	}
	return t, notes, nil
}

// groupRows splits the value column of the given rows of t (nil: every
// row) by groupCol when given (else by the first column when
// firstAsGroup, else one group named after the value column), skipping
// rows with no value and rows with no group, with a note. Groups come in
// order of first appearance.
func groupRows(t *Table, rows []int, groupCol, valueCol string, firstAsGroup bool) (*grouped, error) {
	var notes []render.Note
	if groupCol == "" && firstAsGroup {
		if len(t.Header) < 2 {
			return nil, tooFewColumns(t, "a chart needs a label column and a value column")
		}
		groupCol = t.Header[0]
		if groupCol == valueCol {
			groupCol = t.Header[1]
		}
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("using column %q for labels (choose with --label)", groupCol)})
	}
	if groupCol != "" && !t.Has(groupCol) {
		return nil, t.missingColumn(groupCol, 1)
	}
	if valueCol == "" {
		cols, err := t.NumericColumns(groupCol, nil, 1, false)
		if len(cols) == 0 {
			if err != nil {
				return nil, err
			}
			return nil, tooFewColumns(t, "a distribution needs a column of numbers; name it with --value")
		}
		valueCol = cols[0]
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("using column %q for values (choose with --value)", valueCol)})
	}
	if valueCol == groupCol {
		return nil, usagef("the groups and the values are the same column %q; give the values another column", valueCol)
	}
	n, err := t.ReadNumbers(valueCol)
	if err != nil {
		return nil, err
	}
	notes = append(notes, renderNotes(n.Notes)...)
	if rows == nil {
		rows = allRows(t.Len())
	}
	g := &grouped{valueCol: valueCol, groupCol: groupCol, unit: n.Unit, t: t}
	var names []string
	if groupCol != "" {
		names = t.Strings(groupCol)
	}
	index := map[string]int{}
	var noValue, noGroup []int
	for _, i := range rows {
		v := n.Values[i]
		if v != v { // NaN: a missing cell
			noValue = append(noValue, i)
			continue
		}
		name := valueCol
		if names != nil {
			name = names[i]
			if strings.TrimSpace(name) == "" {
				noGroup = append(noGroup, i)
				continue
			}
		}
		k, ok := index[name]
		if !ok {
			k = len(g.groups)
			index[name] = k
			g.groups = append(g.groups, render.Group{Label: name})
			g.rows = append(g.rows, nil)
		}
		g.groups[k].Values = append(g.groups[k].Values, v)
		g.rows[k] = append(g.rows[k], i)
	}
	if len(noValue) > 0 {
		notes = append(notes, skippedNote(t, noValue, valueCol))
	}
	if len(noGroup) > 0 {
		notes = append(notes, skippedNote(t, noGroup, groupCol))
	}
	if len(g.groups) == 0 {
		hint := "every row lacks a value; check the column name and the file"
		if len(noValue) < len(rows) {
			hint = "no row has both a group and a value"
		}
		return nil, &DataError{File: t.File, Column: valueCol, Err: ErrEmpty, Hint: hint}
	}
	g.notes = notes
	return g, nil
}
