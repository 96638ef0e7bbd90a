package main

import (
	"errors"
	"fmt"
	"io"

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
	g, err := loadGroups(path, r.readOptions(), r.group, r.value, nil, false, stdin)
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
	o.GroupName = r.group
	return g.notes, func(w io.Writer) ([]render.Note, error) { return render.Box(w, g.groups, r.opt) }, nil
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

// loadGroups reads a value column, split by groupCol when given (else by
// the first column when firstAsGroup, else one group named after the value
// column), skipping rows with no value and rows with no group (with a
// note). extra are further columns the caller will read.
func loadGroups(path string, o readOptions, groupCol, valueCol string, extra []string, firstAsGroup bool, stdin io.Reader) (*grouped, error) {
	var want []string
	if valueCol != "" && (groupCol != "" || !firstAsGroup) {
		want = append([]string{valueCol}, extra...)
		if groupCol != "" {
			want = append(want, groupCol)
		}
	}
	t, notes, err := readData(path, o, want, stdin)
	if err != nil {
		return nil, err
	}
	if t.Len() == 0 {
		return nil, &DataError{File: t.File, Err: ErrEmpty, Hint: "the file has a header but no rows"}
	}
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
		return nil, usagef("--group and --value name the same column %q; give the values another column", valueCol)
	}
	n, err := t.ReadNumbers(valueCol)
	if err != nil {
		return nil, err
	}
	notes = append(notes, renderNotes(n.Notes)...)
	if len(n.Missing) > 0 {
		notes = append(notes, skippedNote(t, n.Missing, valueCol))
	}
	if len(n.Missing) == len(n.Values) {
		return nil, &DataError{File: path, Column: valueCol, Err: ErrEmpty, Hint: "every row lacks a value; check the column name and the file"}
	}
	g := &grouped{valueCol: valueCol, groupCol: groupCol, unit: n.Unit, t: t}
	var names []string
	if groupCol != "" {
		names = t.Strings(groupCol)
	}
	index := map[string]int{}
	var noGroup []int
	for i, v := range n.Values {
		if v != v { // NaN: a missing cell, already noted
			continue
		}
		name := valueCol
		if names != nil {
			name = names[i]
			if name == "" {
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
	if len(noGroup) > 0 {
		notes = append(notes, skippedNote(t, noGroup, groupCol))
	}
	if len(g.groups) == 0 {
		return nil, &DataError{File: path, Column: groupCol, Err: ErrEmpty, Hint: "no row has both a group and a value"}
	}
	g.notes = notes
	return g, nil
}
