package main

import (
	"cmp"
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"plumb/internal/table"
	"plumb/render"
	"plumb/scale"
)

// Causes of a DataError specific to x columns.
var (
	ErrBadTime    = table.ErrBadTime
	ErrDuplicateX = errors.New("two rows share one x value")
)

// indexFlag is --index: a bare --index rebases at the first value, and
// --index=AT at x = AT. It is a boolean flag to the flag package, so that
// "--index data.csv" does not swallow the file name.
type indexFlag struct {
	on bool
	at string
}

func (f *indexFlag) String() string {
	if f == nil || !f.on {
		return "false"
	}
	if f.at != "" {
		return f.at
	}
	return "true"
}

func (f *indexFlag) Set(s string) error {
	switch s {
	case "true":
		f.on, f.at = true, ""
	case "false":
		f.on, f.at = false, ""
	default:
		f.on, f.at = true, s
	}
	return nil
}

func (f *indexFlag) IsBoolFlag() bool { return true }

// xColumn is a parsed x column.
type xColumn struct {
	name   string
	values []float64 // numbers, or Unix seconds for times
	time   bool
}

// readX parses the x column: numbers, or dates and times (Table.Times).
// format is auto (dates when the cells are not all numbers and look like
// dates), number, time, or a date pattern such as DD.MM.YYYY. Every row
// needs an x.
func readX(t *Table, col, format string) (*xColumn, []render.Note, error) {
	pattern := ""
	switch format {
	case "", "auto", "number", "time":
	default:
		if !strings.Contains(format, "YYYY") {
			return nil, nil, usagef("--x-format %q: use auto, number, time or a date pattern such as DD.MM.YYYY or MMM YYYY", format)
		}
		pattern = format
	}
	x := &xColumn{name: col}
	if format != "time" && pattern == "" {
		vals, missing, err := t.Numbers(col)
		if err == nil && len(missing) > 0 {
			return nil, nil, &DataError{File: t.File, Line: t.Line(missing[0]), Column: col, Err: ErrBadNumber,
				Hint: "every row needs an x value; fill it in or delete the row"}
		}
		if err == nil {
			x.values = vals
			return x, nil, nil
		}
		if format == "number" || !t.LooksLikeDates(col) {
			return nil, nil, err
		}
	}
	vals, tn, err := t.Times(col, pattern)
	if err != nil {
		return nil, nil, err
	}
	x.time = true
	x.values = vals
	notes := renderNotes(tn)
	if format != "time" && pattern == "" && len(notes) == 0 {
		notes = append(notes, render.Note{Code: "dates", Text: fmt.Sprintf("read column %q as dates and times (--x-format number to treat it as numbers)", col)})
	}
	return x, notes, nil
}

// orderRows returns the rows in x order and refuses two rows with one x,
// naming both lines. It returns nil when rows are already in order.
func orderRows(t *Table, col string, x []float64, rows []int) ([]int, error) {
	sorted := true
	for i := 1; i < len(rows); i++ {
		if x[rows[i]] < x[rows[i-1]] {
			sorted = false
			break
		}
	}
	out := rows
	if !sorted {
		out = slices.Clone(rows)
		slices.SortStableFunc(out, func(a, b int) int { return cmp.Compare(x[a], x[b]) })
	}
	for i := 1; i < len(out); i++ {
		if x[out[i]] == x[out[i-1]] {
			a, b := t.Line(out[i-1]), t.Line(out[i])
			if a > b {
				a, b = b, a
			}
			return nil, &DataError{File: t.File, Line: b, Column: col, Text: t.Strings(col)[out[i]], Err: ErrDuplicateX,
				Hint: fmt.Sprintf("line %d has the same x; a line needs one value per x (per series): remove or combine one of them", a)}
		}
	}
	if sorted {
		return nil, nil
	}
	return out, nil
}

// allRows is 0..n-1.
func allRows(n int) []int {
	r := make([]int, n)
	for i := range r {
		r[i] = i
	}
	return r
}

// pick returns v at rows.
func pick(v []float64, rows []int) []float64 {
	out := make([]float64, len(rows))
	for i, r := range rows {
		out[i] = v[r]
	}
	return out
}

// xFlags are the flags of the charts drawn over an x axis: lines and diff.
type xFlags struct {
	shared
	x, xFormat, unit, xName string
}

func (x *xFlags) register(fs *flag.FlagSet) {
	x.shared.register(fs)
	fs.StringVar(&x.x, "x", "", "column with the x values: numbers or ISO 8601 dates (default: the first column)")
	fs.StringVar(&x.xFormat, "x-format", "auto", "read x as auto, number, time, or dates in a `PATTERN` of YYYY, MM, DD, MMM, Q, HH, mm, ss such as DD.MM.YYYY")
	fs.StringVar(&x.unit, "unit", "", "unit of the values, such as % or t")
	fs.StringVar(&x.xName, "x-name", "", "what x is, for the axis (default: the x column's name unless it is a date)")
}

// linesFlags are the flags of plumb lines.
type linesFlags struct {
	xFlags
	series, aspect, indexAt, yName string
	y                              listFlag
	index                          indexFlag
	together                       bool
}

func (l *linesFlags) register(fs *flag.FlagSet) {
	l.xFlags.register(fs)
	fs.Var(&l.y, "y", "value `COLUMNS`, comma-separated, one line each (default: every numeric column after x)")
	fs.StringVar(&l.series, "series", "", "long format: `COLUMN` naming the series of each row")
	fs.Var(&l.index, "index", "rebase every series to 100 at its first value; --index=AT rebases at x = AT")
	fs.StringVar(&l.indexAt, "index-at", "", "rebase every series to 100 at x = `AT` (same as --index=AT)")
	fs.StringVar(&l.aspect, "aspect", "", "plot shape: orientation (bank by mean orientation) or W:H; default banks to 45° by median slope")
	fs.BoolVar(&l.together, "together", false, "keep more than four series on one panel instead of small multiples")
	fs.StringVar(&l.yName, "y-name", "", "what the values measure, for the axis")
}

// runLines is plumb lines.
func runLines(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	fs := newFlagSet("lines", dataSynopsis, stderr)
	var f linesFlags
	f.register(fs)
	path, c, err := parseChart(fs, &f.shared, args)
	if err != nil {
		return exitCode(err, stderr)
	}
	series, opt, notes, err := loadLines(path, &f, stdin)
	if err != nil {
		return exitCode(err, stderr)
	}
	opt.Common = c
	opt.Common.Notes = notes
	return emit("lines", &f.shared, stdout, stderr, notes, func(w io.Writer) ([]render.Note, error) {
		return render.Lines(w, series, opt)
	})
}

// loadLines reads the table and builds the series, wide or long.
func loadLines(path string, f *linesFlags, stdin io.Reader) ([]render.Series, render.LinesOptions, []render.Note, error) {
	var opt render.LinesOptions
	var want []string
	if f.x != "" && len(f.y) > 0 {
		want = append([]string{f.x}, f.y...)
		if f.series != "" {
			want = append(want, f.series)
		}
	}
	t, notes, err := readData(path, f.readOptions(), want, stdin)
	if err != nil {
		return nil, opt, nil, err
	}
	if len(t.Header) < 2 {
		return nil, opt, nil, tooFewColumns(t, "a line chart needs an x column and a value column")
	}
	xcol := f.x
	if xcol == "" {
		xcol = t.Header[0]
	}
	if !t.Has(xcol) {
		return nil, opt, nil, t.missingColumn(xcol, 1)
	}
	if t.Len() == 0 {
		return nil, opt, nil, &DataError{File: t.File, Err: ErrEmpty, Hint: "the file has a header but no rows"}
	}
	ycols := []string(f.y)
	if len(ycols) == 0 {
		n := 0
		if f.series != "" {
			n = 1
		}
		var first error
		ycols, first = t.NumericColumns(xcol, []string{f.series}, n, true)
		if len(ycols) == 0 && first != nil {
			// The first candidate's bad cell is the likeliest mistake.
			return nil, opt, nil, first
		}
		if len(ycols) == 0 {
			return nil, opt, nil, tooFewColumns(t, fmt.Sprintf("no column after %q to draw; name the value columns with --y", xcol))
		}
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("using column %q for x and %s for values (choose with --x and --y)", xcol, quoteList(ycols))})
	}
	if f.series != "" && len(ycols) != 1 {
		return nil, opt, nil, usagef("--series takes one value column (--y COL); give several --y columns only in wide format")
	}
	x, xn, err := readX(t, xcol, f.xFormat)
	if err != nil {
		return nil, opt, nil, err
	}
	notes = append(notes, xn...)
	notes = append(notes, t.numberNotes(ycols...)...)
	opt = render.LinesOptions{Time: x.time, Aspect: f.aspect, Together: f.together, Unit: f.unit, XName: f.xName, YName: f.yName}
	if opt.Unit == "" {
		opt.Unit = t.unitOf(ycols...)
	}
	if opt.XName == "" && !x.time {
		opt.XName = xcol
	}
	if opt.YName == "" && len(ycols) == 1 && f.series == "" {
		opt.YName = ycols[0]
	}
	if f.series != "" && opt.YName == "" {
		opt.YName = ycols[0]
	}
	if f.indexAt != "" {
		f.index.on, f.index.at = true, f.indexAt
	}
	if f.index.on {
		opt.Index = true
		if f.index.at != "" {
			v, err := parseAt(f.index.at, x.time)
			if err != nil {
				return nil, opt, nil, err
			}
			opt.IndexAt = &v
		}
	}
	var series []render.Series
	if f.series == "" {
		rows, err := orderRows(t, xcol, x.values, allRows(t.Len()))
		if err != nil {
			return nil, opt, nil, err
		}
		if rows != nil {
			notes = append(notes, render.Note{Code: "sorted", Text: fmt.Sprintf("sorted the rows by %q: a line joins its points in x order", xcol)})
		}
		xs := x.values
		if rows != nil {
			xs = pick(x.values, rows)
		}
		for _, col := range ycols {
			ys, _, err := t.Numbers(col)
			if err != nil {
				return nil, opt, nil, err
			}
			if rows != nil {
				ys = pick(ys, rows)
			}
			series = append(series, render.Series{Name: col, X: xs, Y: ys})
		}
		return series, opt, notes, nil
	}
	names := t.Strings(f.series)
	if names == nil {
		return nil, opt, nil, t.missingColumn(f.series, 1)
	}
	notes = append(notes, shortenNote(table.ShortenLabels(names, 0), "series name")...)
	ys, _, err := t.Numbers(ycols[0])
	if err != nil {
		return nil, opt, nil, err
	}
	var order []string
	groups := map[string][]int{}
	for i, n := range names {
		if _, ok := groups[n]; !ok {
			order = append(order, n)
		}
		groups[n] = append(groups[n], i)
	}
	sortedAny := false
	for _, n := range order {
		rows := groups[n]
		sorted, err := orderRows(t, xcol, x.values, rows)
		if err != nil {
			return nil, opt, nil, err
		}
		if sorted != nil {
			rows, sortedAny = sorted, true
		}
		series = append(series, render.Series{Name: n, X: pick(x.values, rows), Y: pick(ys, rows)})
	}
	if sortedAny {
		notes = append(notes, render.Note{Code: "sorted", Text: fmt.Sprintf("sorted each series by %q: a line joins its points in x order", xcol)})
	}
	return series, opt, notes, nil
}

// parseAt reads an --index point as a number or, on a time axis, a date.
func parseAt(s string, isTime bool) (float64, error) {
	if isTime {
		tm, _, err := scale.ParseTime(s)
		if err != nil {
			return 0, usagef("--index=%s: the x axis holds dates: %v", s, err)
		}
		return float64(tm.Unix()) + float64(tm.Nanosecond())/1e9, nil
	}
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, usagef("--index=%s: give an x value (a number on this axis)", s)
	}
	return v, nil
}

func quoteList(cols []string) string {
	q := make([]string, len(cols))
	for i, c := range cols {
		q[i] = strconv.Quote(c)
	}
	return strings.Join(q, ", ")
}

// looksLikeTime reports whether a column holds dates: most of its first 200
// cells parse as ISO 8601 (scale.DetectTime on those), so that one bad date
// is reported where it is rather than the column read as bad numbers.
func looksLikeTime(cells []string) bool {
	var good []string
	seen := 0
	for _, s := range cells[:min(len(cells), 200)] {
		if strings.TrimSpace(s) == "" {
			continue
		}
		seen++
		if _, _, err := scale.ParseTime(s); err == nil {
			good = append(good, s)
		}
	}
	if seen == 0 || len(good)*5 < seen*4 {
		return false
	}
	ok, _ := scale.DetectTime(good)
	return ok
}

// badTime is the cause of a DataError for a cell that is not a date: it
// reads as one clause and unwraps to ErrBadTime and the parser's error.
type badTime struct {
	text  string
	cause error
}

func (e *badTime) Error() string   { return fmt.Sprintf("cannot read %q as a date or time", e.text) }
func (e *badTime) Unwrap() []error { return []error{ErrBadTime, e.cause} }
