package main

import (
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"plumb/render"
)

// ErrDuplicateCell is the cause of a DataError for a long-form table that
// gives one row and column twice.
var ErrDuplicateCell = errors.New("gives a cell a second value")

// ErrNoRowNames is the cause of a DataError for a wide table whose first
// column, the row names, cannot be read.
var ErrNoRowNames = errors.New("the first column has no name")

// heatRun is one run of plumb heat.
type heatRun struct {
	shared
	opt           render.HeatOptions
	row, col, val string
	// span is the whole table's range of values when --by draws one heat
	// map per group: every panel colours a value alike.
	span *[2]float64
}

func newHeat() *heatRun {
	r := &heatRun{}
	r.shared = newShared(&r.opt.Common)
	return r
}

func (r *heatRun) base() *shared { return &r.shared }

// heatOrders are the values of --order and --col-order.
var heatOrders = []string{string(render.HeatByData), string(render.HeatByCluster), string(render.HeatByLabel), string(render.HeatByValue)}

func (r *heatRun) flags() []flagDef {
	o := &r.opt
	defs := []flagDef{
		{name: "row", arg: "COLUMN", usage: "long form: column naming each cell's row (with --col and --value); default: wide form, the first column names the rows and every numeric column is a column", value: stringValue{&r.row}},
		{name: "col", arg: "COLUMN", usage: "long form: column naming each cell's column", value: stringValue{&r.col}},
		{name: "value", arg: "COLUMN", usage: "long form: column with each cell's value", value: stringValue{&r.val}},
		{name: "order", sets: []string{"RowOrder"}, values: heatOrders, def: string(render.HeatByData), usage: "order of the rows: data (as in the file), cluster (Ward, similar rows together), label, or value (mean, largest first)",
			value: choiceValue[render.HeatOrder]{p: &o.RowOrder, values: heatOrders}},
		{name: "col-order", sets: []string{"ColOrder"}, values: heatOrders, def: string(render.HeatByData), usage: "order of the columns, as --order",
			value: choiceValue[render.HeatOrder]{p: &o.ColOrder, values: heatOrders}},
		{name: "tree", sets: []string{"Tree"}, usage: "draw the row dendrogram beside the rows (with --order cluster)", value: boolValue{&o.Tree}},
		{name: "mid", sets: []string{"Mid"}, arg: "NUMBER", usage: "centre a diverging colour scale on NUMBER (default: 0 when the values have both signs, else a sequential scale)", value: numberValue{&o.Mid}},
		{name: "value-name", sets: []string{"ValueName"}, arg: "TEXT", usage: "what the values measure, for the colour key (default: the value column's name)", value: stringValue{&o.ValueName}},
	}
	return append(defs, r.shared.flags()...)
}

func (r *heatRun) load(path string, stdin io.Reader, given func(string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error) {
	var (
		m     render.HeatMatrix
		notes []render.Note
		name  string
		err   error
	)
	switch {
	case r.row != "" || r.col != "" || r.val != "":
		if r.row == "" || r.col == "" || r.val == "" {
			return nil, nil, usagef("the long form needs --row, --col and --value together")
		}
		m, notes, err = r.loadLong(path, stdin)
		name = r.val
	default:
		m, notes, name, err = r.loadWide(path, stdin)
	}
	if err != nil {
		return nil, nil, err
	}
	if r.opt.ValueName == "" {
		r.opt.ValueName = name
	}
	return notes, func(w io.Writer) ([]render.Note, error) { return render.Heat(w, m, r.opt) }, nil
}

// loadLong reads one cell per line: row, column and value columns. Rows
// and columns keep the order of their first appearance; a cell given
// twice is an error, since a heat map draws one value per cell.
func (r *heatRun) loadLong(path string, stdin io.Reader) (render.HeatMatrix, []render.Note, error) {
	t, notes, err := readData(path, r.readOptions(), []string{r.row, r.col, r.val}, stdin)
	if err != nil {
		return render.HeatMatrix{}, nil, err
	}
	m, more, err := r.longRows(t, nil)
	return m, append(notes, more...), err
}

// longRows builds the matrix of the long form from the given rows of t
// (nil: every row); rows and columns keep the order of their first
// appearance in the whole table, so that panels of --by line up.
func (r *heatRun) longRows(t *Table, only []int) (render.HeatMatrix, []render.Note, error) {
	var m render.HeatMatrix
	var notes []render.Note
	path := t.File
	rdict, rcodes := t.Codes(r.row)
	if rdict == nil {
		return m, nil, t.missingColumn(r.row, 1)
	}
	cdict, ccodes := t.Codes(r.col)
	if cdict == nil {
		return m, nil, t.missingColumn(r.col, 1)
	}
	n, err := t.ReadNumbers(r.val)
	if err != nil {
		return m, nil, err
	}
	notes = append(notes, renderNotes(n.Notes)...)
	if len(n.Missing) > 0 {
		notes = append(notes, skippedNote(t, n.Missing, r.val))
	}
	// Codes number the labels in order of first appearance.
	m.Rows, m.Cols = rdict, cdict
	m.Values = make([]float64, len(rdict)*len(cdict))
	for i := range m.Values {
		m.Values[i] = math.NaN()
	}
	line := make([]int, len(m.Values)) // the row of the table that gave each cell, +1
	var keep []bool
	if only != nil {
		keep = make([]bool, len(n.Values))
		for _, i := range only {
			keep[i] = true
		}
	}
	for i, v := range n.Values {
		if math.IsNaN(v) || (keep != nil && !keep[i]) {
			continue
		}
		k := int(rcodes[i])*len(cdict) + int(ccodes[i])
		if line[k] != 0 {
			return m, nil, &DataError{File: path, Line: t.Line(i), Column: r.val, Text: fmt.Sprintf("%s, %s", rdict[rcodes[i]], cdict[ccodes[i]]), Err: ErrDuplicateCell,
				Hint: fmt.Sprintf("line %d already gives row %q, column %q; keep one line per cell or combine them first", t.Line(line[k]-1), rdict[rcodes[i]], cdict[ccodes[i]])}
		}
		line[k] = i + 1
		m.Values[k] = v
	}
	if r.opt.Unit == "" {
		r.opt.Unit = n.Unit
	}
	return m, notes, nil
}

// loadWide reads the first column as row labels and every numeric column
// after it as a column of the heat map.
func (r *heatRun) loadWide(path string, stdin io.Reader) (render.HeatMatrix, []render.Note, string, error) {
	t, notes, err := readData(path, r.readOptions(), nil, stdin)
	if err != nil {
		return render.HeatMatrix{}, nil, "", err
	}
	m, more, err := r.wideTable(t)
	return m, append(notes, more...), "", err
}

// wideTable builds the matrix of the wide form: the first column names the
// rows, every numeric column after it is a column of the heat map.
func (r *heatRun) wideTable(t *Table) (render.HeatMatrix, []render.Note, error) {
	var m render.HeatMatrix
	var notes []render.Note
	path := t.File
	if len(t.Header) < 2 {
		return m, nil, tooFewColumns(t, "a heat map needs a label column and at least one column of values (or --row, --col and --value)")
	}
	label := t.Header[0]
	cols, err := t.NumericColumns(label, nil, 0, true)
	if err != nil {
		return m, nil, err
	}
	if len(cols) == 0 {
		return m, nil, tooFewColumns(t, "a heat map needs at least one numeric column after the labels")
	}
	m.Rows = t.Strings(label)
	if m.Rows == nil {
		return m, nil, &DataError{File: path, Line: 1, Err: ErrNoRowNames, Hint: "give the first column a name in the header: it names the rows"}
	}
	m.Cols = cols
	nr, nc := len(m.Rows), len(cols)
	m.Values = make([]float64, nr*nc)
	for j, c := range cols {
		n, err := t.ReadNumbers(c)
		if err != nil {
			return m, nil, err
		}
		notes = append(notes, renderNotes(n.Notes)...)
		for i, v := range n.Values[:min(nr, len(n.Values))] {
			m.Values[i*nc+j] = v
		}
		if r.opt.Unit == "" {
			r.opt.Unit = n.Unit
		}
	}
	notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("rows named by %q, %d numeric columns as the heat map's columns (or give the long form with --row, --col and --value)", label, nc)})
	var left []string
	for _, h := range t.Header[1:] {
		if !slices.Contains(cols, h) {
			left = append(left, strconv.Quote(h))
		}
	}
	if len(left) > 0 {
		notes = append(notes, render.Note{Code: "heat-columns-left-out", Changed: true,
			Text: fmt.Sprintf("left out %s, not read as numbers (fix its cells to draw it)", strings.Join(left, ", "))})
	}
	return m, notes, nil
}

// The panel side of heat maps (panelChart): one heat map per value of
// --by, in the long form, on one colour scale; and heat maps in figures.

func (r *heatRun) readTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error) {
	if !r.long() {
		if len(keep) > 0 {
			return nil, nil, usagef("--by needs the long form of a heat map: give --row, --col and --value")
		}
		t, notes, err := readData(path, r.readOptions(), nil, stdin)
		return t, notes, err
	}
	t, notes, err := readData(path, r.readOptions(), append([]string{r.row, r.col, r.val}, keep...), stdin)
	if err != nil {
		return nil, nil, err
	}
	// One colour scale for every panel: the whole table's range.
	if n, err := t.ReadNumbers(r.val); err == nil {
		lo, hi := math.Inf(1), math.Inf(-1)
		for _, v := range n.Values {
			if !math.IsNaN(v) {
				lo, hi = math.Min(lo, v), math.Max(hi, v)
			}
		}
		if lo <= hi && keep != nil {
			r.span = &[2]float64{lo, hi}
		}
	}
	return t, notes, nil
}

// long says whether the run reads the long form (--row --col --value).
func (r *heatRun) long() bool { return r.row != "" || r.col != "" || r.val != "" }

func (r *heatRun) panel(t *Table, rows []int, c render.Common, _ func(string) bool) (panelPart, error) {
	var (
		m     render.HeatMatrix
		notes []render.Note
		err   error
	)
	opt := r.opt // a copy: every panel starts from the flags
	if r.long() {
		if r.row == "" || r.col == "" || r.val == "" {
			return panelPart{}, usagef("the long form needs --row, --col and --value together")
		}
		m, notes, err = r.longRows(t, rows)
		if opt.ValueName == "" {
			opt.ValueName = r.val
		}
	} else {
		m, notes, err = r.wideTable(t)
	}
	if err != nil {
		return panelPart{}, err
	}
	if r.span != nil {
		opt.From, opt.To = &r.span[0], &r.span[1]
	}
	opt.Common = c
	return panelPart{panel: render.HeatPanel(m, opt), notes: notes, size: sizeOf(m.Values, false)}, nil
}

// shares: heat maps share their colour scale (readTable), not an axis.
func (r *heatRun) shares() (x, y bool) { return false, false }
