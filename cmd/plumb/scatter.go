package main

import (
	"fmt"
	"io"

	"plumb/render"
)

// scatterRun is one run of plumb scatter: the options the builder
// receives, which the flags set directly, and the columns to read.
type scatterRun struct {
	shared
	opt      render.ScatterOptions
	x, y     string
	group    string
	xs, ys   []float64
	fitValue string
}

func newScatter() *scatterRun {
	r := &scatterRun{}
	r.shared = newShared(&r.opt.Common)
	return r
}

func (r *scatterRun) base() *shared { return &r.shared }

// fitChoices are the values of --fit.
var fitChoices = []string{"line", "loess"}

func (r *scatterRun) flags() []flagDef {
	o := &r.opt
	defs := []flagDef{
		{name: "x", arg: "COLUMN", usage: "column with the x values (default: the first numeric column)", value: stringValue{&r.x}},
		{name: "y", arg: "COLUMN", usage: "column with the y values (default: the next numeric column)", value: stringValue{&r.y}},
		{name: "group", sets: []string{"Groups"}, arg: "COLUMN", usage: "COLUMN naming each point's group, drawn in its own colour (at most 8)", value: stringValue{&r.group}},
		{name: "fit", sets: []string{"Fit"}, values: fitChoices, usage: "draw a trend: a least-squares line (r and R² in the notes) or a LOESS curve", value: choiceValue[string]{p: &o.Fit, values: fitChoices}},
		{name: "x-name", sets: []string{"XName"}, arg: "TEXT", usage: "what x measures, for the axis (default: the x column's name)", value: stringValue{&o.XName}},
		{name: "y-name", sets: []string{"YName"}, arg: "TEXT", usage: "what y measures, for the axis (default: the y column's name)", value: stringValue{&o.YName}},
	}
	return append(defs, r.shared.flags()...)
}

func (r *scatterRun) load(path string, stdin io.Reader, _ func(string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error) {
	notes, err := r.read(path, stdin)
	if err != nil {
		return nil, nil, err
	}
	return notes, func(w io.Writer) ([]render.Note, error) { return render.Scatter(w, r.xs, r.ys, r.opt) }, nil
}

// read reads the x, y and group columns, leaves out rows missing x or y
// (with a note naming their lines) and names the axes after the columns.
func (r *scatterRun) read(path string, stdin io.Reader) ([]render.Note, error) {
	t, notes, err := r.readTable(path, stdin, nil)
	if err != nil {
		return nil, err
	}
	d, err := r.rows(t, nil)
	if err != nil {
		return nil, err
	}
	r.xs, r.ys, r.opt = d.xs, d.ys, d.opt
	return append(notes, d.notes...), nil
}

// readTable reads the data file with the x, y and group columns and the
// columns in keep (the --by column).
func (r *scatterRun) readTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error) {
	var want []string
	if r.x != "" && r.y != "" {
		want = []string{r.x, r.y}
		if r.group != "" {
			want = append(want, r.group)
		}
		want = append(want, keep...)
	}
	t, notes, err := readData(path, r.readOptions(), want, stdin)
	if err != nil {
		return nil, nil, err
	}
	if t.Len() == 0 {
		return nil, nil, &DataError{File: t.File, Err: ErrEmpty, Hint: "the file has a header but no rows"}
	}
	return t, notes, nil
}

// scatterData is what one scatter plot draws: its points, and the options
// finished from the data.
type scatterData struct {
	xs, ys []float64
	opt    render.ScatterOptions
	notes  []render.Note
}

// rows reads the points of the given rows of t (nil: every row) into a
// copy of the options, so that every panel of --by starts from the flags.
func (r *scatterRun) rows(t *Table, only []int) (scatterData, error) {
	d := scatterData{opt: r.opt}
	cols, more, err := numericPair(t, r.x, r.y, r.group)
	if err != nil {
		return d, err
	}
	d.notes = append(d.notes, more...)
	var groups []string
	if r.group != "" {
		if groups = t.Strings(r.group); groups == nil {
			return d, t.missingColumn(r.group, 1)
		}
	}
	vals, rows, more, err := readColumns(t, cols)
	if err != nil {
		return d, err
	}
	d.notes = append(d.notes, more...)
	d.xs, d.ys = vals[0], vals[1]
	if only != nil {
		want := make(map[int]bool, len(only))
		for _, i := range only {
			want[i] = true
		}
		var keep, kept []int
		for k, row := range rows {
			if want[row] {
				keep, kept = append(keep, k), append(kept, row)
			}
		}
		d.xs, d.ys, rows = pick(d.xs, keep), pick(d.ys, keep), kept
	}
	if groups != nil {
		// The groups' colour order is the whole table's, so that every
		// panel of --by colours a group alike.
		if d.opt.GroupOrder == nil {
			seen := map[string]bool{}
			for _, g := range groups {
				if !seen[g] {
					seen[g] = true
					d.opt.GroupOrder = append(d.opt.GroupOrder, g)
				}
			}
		}
		d.opt.Groups = make([]string, len(rows))
		for i, row := range rows {
			d.opt.Groups[i] = groups[row]
		}
	}
	if d.opt.XName == "" {
		d.opt.XName = withUnit(cols[0], t.unitOf(cols[0]))
	}
	if d.opt.YName == "" {
		d.opt.YName = withUnit(cols[1], t.unitOf(cols[1]))
	}
	return d, nil
}

// panel plans one scatter panel of the given rows (panelChart), for --by
// and figure files.
func (r *scatterRun) panel(t *Table, rows []int, c render.Common, _ func(string) bool) (panelPart, error) {
	d, err := r.rows(t, rows)
	if err != nil {
		return panelPart{}, err
	}
	if len(d.xs) == 0 {
		return panelPart{}, &DataError{File: t.File, Err: ErrEmpty, Hint: "no row of this panel has both an x and a y value"}
	}
	d.opt.Common = c
	return panelPart{panel: render.ScatterPanel(d.xs, d.ys, d.opt), notes: d.notes, size: sizeOf(d.ys, false)}, nil
}

// shares: small multiples of a scatter plot compare on both axes.
func (r *scatterRun) shares() (x, y bool) { return true, true }

// numericPair is the x and y columns: the ones named, or else the first
// numeric columns not taken, with a note saying which.
func numericPair(t *Table, x, y, group string) ([]string, []render.Note, error) {
	if x != "" && y != "" {
		return []string{x, y}, nil, nil
	}
	taken := []string{group, x, y}
	free, err := t.NumericColumns("", taken, 2, false)
	if err != nil {
		return nil, nil, err
	}
	cols := []string{x, y}
	for i := range cols {
		if cols[i] == "" && len(free) > 0 {
			cols[i], free = free[0], free[1:]
		}
	}
	if cols[0] == "" || cols[1] == "" {
		return nil, nil, tooFewColumns(t, "a scatter plot needs two numeric columns; name them with --x and --y")
	}
	return cols, []render.Note{{Code: "columns", Text: fmt.Sprintf("using column %q for x and %q for y (choose with --x and --y)", cols[0], cols[1])}}, nil
}

// readColumns reads columns as numbers and keeps the rows where every one
// has a value; the rows left out are noted with their lines. It returns the
// kept values per column and the kept rows' indexes.
func readColumns(t *Table, cols []string) ([][]float64, []int, []render.Note, error) {
	var notes []render.Note
	all := make([][]float64, len(cols))
	skip := make([]bool, t.Len())
	for i, c := range cols {
		vals, missing, err := t.Numbers(c)
		if err != nil {
			return nil, nil, nil, err
		}
		notes = append(notes, t.numberNotes(c)...)
		if len(missing) > 0 {
			notes = append(notes, skippedNote(t, missing, c))
		}
		for _, m := range missing {
			skip[m] = true
		}
		all[i] = vals
	}
	var rows []int
	for i, s := range skip {
		if !s {
			rows = append(rows, i)
		}
	}
	if len(rows) == 0 {
		return nil, nil, nil, &DataError{File: t.File, Column: cols[0], Err: ErrEmpty, Hint: fmt.Sprintf("no row has a value in every one of the columns %s; check the column names and the file", quoteList(cols))}
	}
	out := make([][]float64, len(cols))
	for i := range cols {
		if len(rows) == t.Len() {
			out[i] = all[i]
			continue
		}
		out[i] = pick(all[i], rows)
	}
	return out, rows, notes, nil
}

// withUnit is a column's name with the unit its cells carry: "fare (£)".
func withUnit(name, unit string) string {
	if unit == "" {
		return name
	}
	return name + " (" + unit + ")"
}
