package main

import (
	"cmp"
	"errors"
	"fmt"
	"io"
	"maps"
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

// indexValue is --index: a bare --index rebases at the first value, and
// --index=AT at x = AT. It is a switch to the flag package, so that
// "--index data.csv" does not swallow the file name.
type indexValue struct {
	on *bool   // LinesOptions.Index
	at *string // the point, read once the x axis is known
}

func (v indexValue) String() string {
	switch {
	case v.on == nil || !*v.on:
		return "false"
	case *v.at != "":
		return *v.at
	}
	return "true"
}

func (v indexValue) Set(s string) error {
	switch s {
	case "true":
		*v.on, *v.at = true, ""
	case "false":
		*v.on, *v.at = false, ""
	default:
		*v.on, *v.at = true, s
	}
	return nil
}

func (v indexValue) IsBoolFlag() bool { return true }

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

// orderRows is orderRows for lines: with --agg the rows stay as they are,
// for the summary groups them by x itself; without, the refusal of a
// repeated x names --agg.
func (r *linesRun) orderRows(t *Table, col string, x []float64, rows []int) ([]int, error) {
	if r.opt.Agg != "" {
		return nil, nil
	}
	out, err := orderRows(t, col, x, rows)
	var de *DataError
	if errors.As(err, &de) && errors.Is(err, ErrDuplicateX) {
		de.Hint += "; for repeated measurements, --agg mean or --agg median draws a line through the mean or median at each x, with a band for the spread (--spread)"
	}
	return out, err
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

// xFlags are the flags of the charts drawn over an x axis, lines and
// diff, that are the CLI's own: which column is x and how to read it.
type xFlags struct {
	x, xFormat string
}

// flags are the x flags and the flags of the options both charts have.
func (x *xFlags) flags(unit, xName *string) []flagDef {
	x.xFormat = "auto"
	return []flagDef{
		{name: "x", arg: "COLUMN", usage: "column with the x values: numbers or ISO 8601 dates (default: the first column)", value: stringValue{&x.x}},
		{name: "x-format", arg: "PATTERN", def: "auto", usage: "read x as auto, number, time, or dates in a PATTERN of YYYY, MM, DD, MMM, Q, HH, mm, ss such as DD.MM.YYYY", value: stringValue{&x.xFormat}},
		{name: "unit", sets: []string{"Unit"}, arg: "UNIT", usage: "unit of the values, such as % or t", value: stringValue{unit}},
		{name: "x-name", sets: []string{"XName"}, arg: "TEXT", usage: "what x is, for the axis (default: the x column's name unless it is a date)", value: stringValue{xName}},
	}
}

// linesRun is one run of plumb lines: the options the builder receives,
// which the flags set directly, and the columns to read.
type linesRun struct {
	shared
	xFlags
	opt     render.LinesOptions
	series  string
	y       []string
	indexAt string // --index=AT or --index-at, read once the x axis is known
}

func newLines() *linesRun {
	r := &linesRun{}
	r.shared = newShared(&r.opt.Common)
	return r
}

func (r *linesRun) base() *shared { return &r.shared }

func (r *linesRun) flags() []flagDef {
	o := &r.opt
	defs := append(r.xFlags.flags(&o.Unit, &o.XName),
		flagDef{name: "y", arg: "COLUMNS", repeat: true, usage: "value COLUMNS, comma-separated, one line each (default: every numeric column after x)", value: listValue{&r.y}},
		flagDef{name: "series", arg: "COLUMN", usage: "long format: COLUMN naming the series of each row", value: stringValue{&r.series}},
		flagDef{name: "index", sets: []string{"Index"}, arg: "[=AT]", usage: "rebase every series to 100 at its first value; --index=AT rebases at x = AT", value: indexValue{&o.Index, &r.indexAt}},
		flagDef{name: "index-at", sets: []string{"IndexAt"}, arg: "AT", usage: "rebase every series to 100 at x = AT (same as --index=AT)", value: stringValue{&r.indexAt}},
		flagDef{name: "aspect", sets: []string{"Aspect"}, arg: "orientation|W:H", usage: "plot shape: orientation (bank by mean orientation) or W:H; default banks to 45° by median slope", value: stringValue{&o.Aspect}},
		flagDef{name: "together", sets: []string{"Together"}, usage: "keep more than four series on one panel instead of small multiples", value: boolValue{&o.Together}},
		flagDef{name: "y-name", sets: []string{"YName"}, arg: "TEXT", usage: "what the values measure, for the axis", value: stringValue{&o.YName}},
		flagDef{name: "agg", sets: []string{"Agg"}, arg: "mean|median", usage: "repeated x values (repeated measurements): draw one line through the mean or median at each x, with n per x in a note", value: stringValue{&o.Agg}},
		flagDef{name: "spread", sets: []string{"Spread"}, arg: "range|iqr|sd|none", usage: "band around an --agg line: range, iqr (type 7 quartiles), sd (mean ± 1 sd) or none (default: iqr for median, none for mean)", value: stringValue{&o.Spread}},
	)
	return append(defs, r.shared.flags()...)
}

func (r *linesRun) load(path string, stdin io.Reader, _ func(string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error) {
	series, notes, err := r.read(path, stdin)
	if err != nil {
		return nil, nil, err
	}
	if r.series != "" {
		// The note on overlapping bands names the flag that draws one
		// panel per series, which is not an option of the chart.
		r.opt.Names = maps.Clone(r.opt.Names)
		if r.opt.Names == nil {
			r.opt.Names = render.OptionNames{}
		}
		r.opt.Names["By"] = "--by " + r.series
	}
	return notes, func(w io.Writer) ([]render.Note, error) { return render.Lines(w, series, r.opt) }, nil
}

// read reads the table and builds the series, wide or long, and finishes
// the options from the data: the x kind, the unit, the axis names.
func (r *linesRun) read(path string, stdin io.Reader) ([]render.Series, []render.Note, error) {
	t, notes, err := r.readTable(path, stdin, nil)
	if err != nil {
		return nil, nil, err
	}
	series, more, err := r.build(t, nil, &r.opt)
	return series, append(notes, more...), err
}

// readTable reads the data file, keeping the named columns and those in
// keep (a --by column).
func (r *linesRun) readTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error) {
	var want []string
	if r.x != "" && len(r.y) > 0 {
		want = append([]string{r.x}, r.y...)
		if r.series != "" {
			want = append(want, r.series)
		}
		want = append(want, keep...)
	}
	return readData(path, r.readOptions(), want, stdin)
}

// build makes the series of the given rows of t (nil: every row) and
// finishes opt from the data.
func (r *linesRun) build(t *Table, rows []int, opt *render.LinesOptions) ([]render.Series, []render.Note, error) {
	var notes []render.Note
	if len(t.Header) < 2 {
		return nil, nil, tooFewColumns(t, "a line chart needs an x column and a value column")
	}
	xcol := r.x
	if xcol == "" {
		xcol = t.Header[0]
	}
	if !t.Has(xcol) {
		return nil, nil, t.missingColumn(xcol, 1)
	}
	if t.Len() == 0 {
		return nil, nil, &DataError{File: t.File, Err: ErrEmpty, Hint: "the file has a header but no rows"}
	}
	if opt.Agg == "" && opt.Spread != "" && opt.Spread != render.SpreadNone {
		// Said before the rows are read, whose repeated x would be
		// refused for want of the --agg this asks for.
		return nil, nil, usagef("--spread %s: a spread is drawn around a summary line: give --agg mean or median too", opt.Spread)
	}
	if rows == nil {
		rows = allRows(t.Len())
	}
	ycols := []string(r.y)
	if len(ycols) == 0 {
		n := 0
		if r.series != "" {
			n = 1
		}
		var first error
		ycols, first = t.NumericColumns(xcol, []string{r.series}, n, true)
		if len(ycols) == 0 && first != nil {
			// The first candidate's bad cell is the likeliest mistake.
			return nil, nil, first
		}
		if len(ycols) == 0 {
			return nil, nil, tooFewColumns(t, fmt.Sprintf("no column after %q to draw; name the value columns with --y", xcol))
		}
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("using column %q for x and %s for values (choose with --x and --y)", xcol, quoteList(ycols))})
	}
	if r.series != "" && len(ycols) != 1 {
		return nil, nil, usagef("--series takes one value column (--y COL); give several --y columns only in wide format")
	}
	x, xn, err := readX(t, xcol, r.xFormat)
	if err != nil {
		return nil, nil, err
	}
	notes = append(notes, xn...)
	notes = append(notes, t.numberNotes(ycols...)...)
	opt.Time = x.time
	if opt.Unit == "" {
		opt.Unit = t.unitOf(ycols...)
	}
	if opt.XName == "" && !x.time {
		opt.XName = xcol
	}
	if opt.YName == "" && (len(ycols) == 1 || r.series != "") {
		opt.YName = ycols[0]
	}
	if r.indexAt != "" {
		opt.Index = true
		v, err := parseAt(r.indexAt, x.time)
		if err != nil {
			return nil, nil, err
		}
		opt.IndexAt = &v
	}
	var series []render.Series
	if r.series == "" {
		sorted, err := r.orderRows(t, xcol, x.values, rows)
		if err != nil {
			return nil, nil, err
		}
		if sorted != nil {
			rows = sorted
			notes = append(notes, render.Note{Code: "sorted", Text: fmt.Sprintf("sorted the rows by %q: a line joins its points in x order", xcol)})
		}
		xs := x.values
		if len(rows) != len(xs) || sorted != nil {
			xs = pick(x.values, rows)
		}
		for _, col := range ycols {
			ys, _, err := t.Numbers(col)
			if err != nil {
				return nil, nil, err
			}
			if len(rows) != len(ys) || sorted != nil {
				ys = pick(ys, rows)
			}
			series = append(series, render.Series{Name: col, X: xs, Y: ys})
		}
		return series, notes, nil
	}
	names := t.Strings(r.series)
	if names == nil {
		return nil, nil, t.missingColumn(r.series, 1)
	}
	notes = append(notes, shortenNote(table.ShortenLabels(names, 0), "series name")...)
	ys, _, err := t.Numbers(ycols[0])
	if err != nil {
		return nil, nil, err
	}
	var order []string
	groups := map[string][]int{}
	for _, i := range rows {
		n := names[i]
		if _, ok := groups[n]; !ok {
			order = append(order, n)
		}
		groups[n] = append(groups[n], i)
	}
	sortedAny := false
	for _, n := range order {
		rows := groups[n]
		sorted, err := r.orderRows(t, xcol, x.values, rows)
		if err != nil {
			return nil, nil, err
		}
		if sorted != nil {
			rows, sortedAny = sorted, true
		}
		series = append(series, render.Series{Name: n, X: pick(x.values, rows), Y: pick(ys, rows)})
	}
	if sortedAny {
		notes = append(notes, render.Note{Code: "sorted", Text: fmt.Sprintf("sorted each series by %q: a line joins its points in x order", xcol)})
	}
	return series, notes, nil
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

// The panel side of lines (panelChart), for --by and figure files.

func (r *linesRun) panel(t *Table, rows []int, c render.Common, _ func(string) bool) (panelPart, error) {
	o := r.opt // a copy: every panel starts from the flags
	o.Common = c
	series, notes, err := r.build(t, rows, &o)
	if err != nil {
		return panelPart{}, err
	}
	var ys []float64
	for _, s := range series {
		ys = append(ys, s.Y...)
	}
	return panelPart{panel: render.LinesPanel(series, o), notes: notes, size: sizeOf(ys, false)}, nil
}

// shares: small multiples of lines share both the x and the value axis.
func (r *linesRun) shares() (x, y bool) { return true, true }
