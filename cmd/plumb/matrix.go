package main

import (
	"fmt"
	"io"

	"plumb/render"
)

// matrixRun is one run of plumb matrix: the columns to plot against each
// other.
type matrixRun struct {
	shared
	opt  render.MatrixOptions
	cols []string
	vars []render.Variable
}

func newMatrix() *matrixRun {
	r := &matrixRun{}
	r.shared = newShared(&r.opt.Common)
	return r
}

func (r *matrixRun) base() *shared { return &r.shared }

func (r *matrixRun) flags() []flagDef {
	defs := []flagDef{
		{name: "cols", arg: "COLUMNS", repeat: true, usage: fmt.Sprintf("numeric COLUMNS to plot against each other, 2 to %d (default: every numeric column, up to %d)", render.MaxMatrix, render.MaxMatrix), value: listValue{&r.cols}},
	}
	return append(defs, r.shared.flags()...)
}

func (r *matrixRun) load(path string, stdin io.Reader, _ func(string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error) {
	notes, err := r.read(path, stdin)
	if err != nil {
		return nil, nil, err
	}
	return notes, func(w io.Writer) ([]render.Note, error) { return render.Matrix(w, r.vars, r.opt) }, nil
}

// read reads the columns as numbers. A missing cell stays NaN: each panel
// leaves out only the rows that miss one of its own two values.
func (r *matrixRun) read(path string, stdin io.Reader) ([]render.Note, error) {
	var want []string
	if len(r.cols) > 0 {
		want = r.cols
	}
	t, notes, err := readData(path, r.readOptions(), want, stdin)
	if err != nil {
		return nil, err
	}
	if t.Len() == 0 {
		return nil, &DataError{File: t.File, Err: ErrEmpty, Hint: "the file has a header but no rows"}
	}
	cols := r.cols
	if len(cols) == 0 {
		all, err := t.NumericColumns("", nil, 0, false)
		if err != nil {
			return nil, err
		}
		if len(all) < 2 {
			return nil, tooFewColumns(t, "a scatterplot matrix needs two or more numeric columns; name them with --cols")
		}
		if len(all) > render.MaxMatrix {
			return nil, usagef("%s has %d numeric columns, more than the %d a matrix shows; choose some with --cols", t.File, len(all), render.MaxMatrix)
		}
		cols = all
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("using the numeric columns %s (choose with --cols)", quoteList(cols))})
	}
	seen := map[string]bool{}
	for _, c := range cols {
		if seen[c] {
			return nil, usagef("--cols names %q twice; name each column once", c)
		}
		seen[c] = true
		vals, missing, err := t.Numbers(c)
		if err != nil {
			return nil, err
		}
		notes = append(notes, t.numberNotes(c)...)
		if len(missing) == len(vals) {
			return nil, &DataError{File: t.File, Column: c, Err: ErrEmpty, Hint: "every row lacks a value in this column; check the column name and the file"}
		}
		r.vars = append(r.vars, render.Variable{Name: withUnit(c, t.unitOf(c)), Values: vals})
	}
	return notes, nil
}

// grid says why a matrix takes no --by: it is a grid of panels already.
func (r *matrixRun) grid() string {
	return "a scatterplot matrix is already a grid of panels; draw one scatter plot per group with plumb scatter --by, or one matrix per group"
}
