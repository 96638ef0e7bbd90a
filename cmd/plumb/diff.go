package main

import (
	"fmt"
	"io"

	"plumb/render"
)

// diffRun is one run of plumb diff: the options the builder receives,
// which the flags set directly, and the x column to read.
type diffRun struct {
	shared
	xFlags
	opt  render.DiffOptions
	a, b string // the columns of the two series, which become their names
}

func newDiff() *diffRun {
	r := &diffRun{}
	r.shared = newShared(&r.opt.Common)
	return r
}

func (r *diffRun) base() *shared { return &r.shared }

func (r *diffRun) flags() []flagDef {
	o := &r.opt
	defs := append(r.xFlags.flags(&o.Unit, &o.XName),
		flagDef{name: "a", arg: "COLUMN", usage: "COLUMN of the first series (default: the first numeric column after x)", value: stringValue{&r.a}},
		flagDef{name: "b", arg: "COLUMN", usage: "COLUMN of the second series, subtracted from a (default: the next numeric column)", value: stringValue{&r.b}},
		flagDef{name: "context", sets: []string{"Context"}, usage: "add a panel above with both series on the same x scale", value: boolValue{&o.Context}},
	)
	return append(defs, r.shared.flags()...)
}

func (r *diffRun) load(path string, stdin io.Reader, _ func(string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error) {
	a, b, notes, err := r.read(path, stdin)
	if err != nil {
		return nil, nil, err
	}
	return notes, func(w io.Writer) ([]render.Note, error) { return render.Diff(w, a, b, r.opt) }, nil
}

// read reads the x, a and b columns, in x order, and finishes the options
// from the data: the columns chosen, the x kind, the unit, the x name.
func (r *diffRun) read(path string, stdin io.Reader) (a, b render.Series, notes []render.Note, err error) {
	t, notes, err := r.readTable(path, stdin, nil)
	if err != nil {
		return a, b, nil, err
	}
	a, b, more, err := r.build(t, nil, &r.opt)
	return a, b, append(notes, more...), err
}

// readTable reads the data file, keeping the named columns and those in
// keep (a --by column).
func (r *diffRun) readTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error) {
	var want []string
	if r.x != "" && r.a != "" && r.b != "" {
		want = append([]string{r.x, r.a, r.b}, keep...)
	}
	return readData(path, r.readOptions(), want, stdin)
}

// build makes the two series of the given rows of t (nil: every row), in
// x order, and finishes opt from the data.
func (r *diffRun) build(t *Table, rows []int, opt *render.DiffOptions) (a, b render.Series, notes []render.Note, err error) {
	if t.Len() == 0 {
		return a, b, nil, &DataError{File: t.File, Err: ErrEmpty, Hint: "the file has a header but no rows"}
	}
	if rows == nil {
		rows = allRows(t.Len())
	}
	xcol := r.x
	if xcol == "" && len(t.Header) > 0 {
		xcol = t.Header[0]
	}
	if !t.Has(xcol) {
		return a, b, nil, t.missingColumn(xcol, 1)
	}
	acol, bcol := r.a, r.b
	if acol == "" || bcol == "" {
		nums, first := t.NumericColumns(xcol, []string{acol, bcol}, 2, false)
		if acol == "" && len(nums) > 0 {
			acol, nums = nums[0], nums[1:]
		}
		if bcol == "" && len(nums) > 0 {
			bcol = nums[0]
		}
		if acol == "" || bcol == "" {
			if first != nil {
				return a, b, nil, first // a bad cell in a column that was likely meant
			}
			return a, b, nil, tooFewColumns(t, "a difference needs two numeric columns; name them with --a and --b")
		}
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("drawing %q minus %q over %q (choose with --x, --a and --b)", acol, bcol, xcol)})
	}
	xc, xn, err := readX(t, xcol, r.xFormat)
	if err != nil {
		return a, b, nil, err
	}
	notes = append(notes, xn...)
	av, _, err := t.Numbers(acol)
	if err != nil {
		return a, b, nil, err
	}
	bv, _, err := t.Numbers(bcol)
	if err != nil {
		return a, b, nil, err
	}
	sorted, err := orderRows(t, xcol, xc.values, rows)
	if err != nil {
		return a, b, nil, err
	}
	x := xc.values
	if sorted != nil {
		rows = sorted
		notes = append(notes, render.Note{Code: "sorted", Text: fmt.Sprintf("sorted the rows by %q: a line joins its points in x order", xcol)})
	}
	if sorted != nil || len(rows) != len(x) {
		x, av, bv = pick(x, rows), pick(av, rows), pick(bv, rows)
	}
	notes = append(notes, t.numberNotes(acol, bcol)...)
	opt.Time = xc.time
	if opt.Unit == "" {
		opt.Unit = t.unitOf(acol, bcol)
	}
	if opt.XName == "" && !xc.time {
		opt.XName = xcol
	}
	return render.Series{Name: acol, X: x, Y: av}, render.Series{Name: bcol, X: x, Y: bv}, notes, nil
}

// The panel side of diff (panelChart), for --by and figure files.

func (r *diffRun) panel(t *Table, rows []int, c render.Common, _ func(string) bool) (panelPart, error) {
	o := r.opt // a copy: every panel starts from the flags
	o.Common = c
	a, b, notes, err := r.build(t, rows, &o)
	if err != nil {
		return panelPart{}, err
	}
	d := make([]float64, len(a.Y))
	for i := range d {
		d[i] = a.Y[i] - b.Y[i]
	}
	return panelPart{panel: render.DiffPanel(a, b, o), notes: notes, size: sizeOf(d, false)}, nil
}

// shares: small multiples of differences share both axes.
func (r *diffRun) shares() (x, y bool) { return true, true }
