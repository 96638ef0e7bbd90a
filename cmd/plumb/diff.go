package main

import (
	"fmt"
	"io"

	"plumb/render"
)

// diffFlags are the flags of plumb diff.
type diffFlags struct {
	xFlags
	a, b    string
	context bool
}

// runDiff is plumb diff.
func runDiff(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	fs := newFlagSet("diff", dataSynopsis, stderr)
	var f diffFlags
	f.xFlags.register(fs)
	fs.StringVar(&f.a, "a", "", "`COLUMN` of the first series (default: the first numeric column after x)")
	fs.StringVar(&f.b, "b", "", "`COLUMN` of the second series, subtracted from a (default: the next numeric column)")
	fs.BoolVar(&f.context, "context", false, "add a panel above with both series on the same x scale")
	path, c, err := parseChart(fs, &f.shared, args)
	if err != nil {
		return exitCode(err, stderr)
	}
	a, b, opt, notes, err := loadDiff(path, &f, stdin)
	if err != nil {
		return exitCode(err, stderr)
	}
	opt.Common = c
	opt.Common.Notes = notes
	return emit("diff", &f.shared, stdout, stderr, notes, func(w io.Writer) ([]render.Note, error) {
		return render.Diff(w, a, b, opt)
	})
}

// loadDiff reads the x, a and b columns, in x order, as the two series.
func loadDiff(path string, f *diffFlags, stdin io.Reader) (a, b render.Series, opt render.DiffOptions, notes []render.Note, err error) {
	var want []string
	if f.x != "" && f.a != "" && f.b != "" {
		want = []string{f.x, f.a, f.b}
	}
	t, notes, err := readData(path, f.readOptions(), want, stdin)
	if err != nil {
		return a, b, opt, nil, err
	}
	if t.Len() == 0 {
		return a, b, opt, nil, &DataError{File: t.File, Err: ErrEmpty, Hint: "the file has a header but no rows"}
	}
	xcol := f.x
	if xcol == "" && len(t.Header) > 0 {
		xcol = t.Header[0]
	}
	if !t.Has(xcol) {
		return a, b, opt, nil, t.missingColumn(xcol, 1)
	}
	acol, bcol := f.a, f.b
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
				return a, b, opt, nil, first // a bad cell in a column that was likely meant
			}
			return a, b, opt, nil, tooFewColumns(t, "a difference needs two numeric columns; name them with --a and --b")
		}
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("drawing %q minus %q over %q (choose with --x, --a and --b)", acol, bcol, xcol)})
	}
	xc, xn, err := readX(t, xcol, f.xFormat)
	if err != nil {
		return a, b, opt, nil, err
	}
	notes = append(notes, xn...)
	av, _, err := t.Numbers(acol)
	if err != nil {
		return a, b, opt, nil, err
	}
	bv, _, err := t.Numbers(bcol)
	if err != nil {
		return a, b, opt, nil, err
	}
	rows, err := orderRows(t, xcol, xc.values, allRows(t.Len()))
	if err != nil {
		return a, b, opt, nil, err
	}
	x := xc.values
	if rows != nil {
		x, av, bv = pick(x, rows), pick(av, rows), pick(bv, rows)
		notes = append(notes, render.Note{Code: "sorted", Text: fmt.Sprintf("sorted the rows by %q: a line joins its points in x order", xcol)})
	}
	notes = append(notes, t.numberNotes(acol, bcol)...)
	opt = render.DiffOptions{Time: xc.time, Context: f.context, Unit: f.unit, XName: f.xName}
	if opt.Unit == "" {
		opt.Unit = t.unitOf(acol, bcol)
	}
	if opt.XName == "" && !xc.time {
		opt.XName = xcol
	}
	return render.Series{Name: acol, X: x, Y: av}, render.Series{Name: bcol, X: x, Y: bv}, opt, notes, nil
}
