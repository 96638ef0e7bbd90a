package main

import (
	"errors"
	"fmt"
	"io"
	"slices"
	"strings"

	"plumb/render"
)

// Causes of a DataError specific to ranges.
var (
	ErrRangeOrder = errors.New("the range's low, middle and high are out of order")
	ErrMarkTwice  = errors.New("a second row to overlay for one category")
	ErrNoMatch    = errors.New("no row matches")
)

// spanRun is one run of plumb span: ranges given by --low --mid --high
// columns, or computed from raw rows (--value) by --stat.
type spanRun struct {
	shared
	opt                   render.SpanOptions
	label, low, mid, high string
	value, mark, where    string
	stat                  string
}

func newSpan() *spanRun {
	r := &spanRun{stat: string(render.StatRange)}
	r.shared = newShared(&r.opt.Common)
	r.opt.Order = render.ByValue
	return r
}

func (r *spanRun) base() *shared { return &r.shared }

// spanStats are the values of --stat.
var spanStats = []string{string(render.StatRange), string(render.StatQuartiles), string(render.StatP10P90)}

func (r *spanRun) flags() []flagDef {
	o := &r.opt
	defs := []flagDef{
		{name: "label", arg: "COLUMN", usage: "column with the category labels (default: the first column)", value: stringValue{&r.label}},
		{name: "low", arg: "COLUMN", usage: "given ranges: column with each range's low end", value: stringValue{&r.low}},
		{name: "mid", arg: "COLUMN", usage: "given ranges: column with each range's middle", value: stringValue{&r.mid}},
		{name: "high", arg: "COLUMN", usage: "given ranges: column with each range's high end", value: stringValue{&r.high}},
		{name: "mark", arg: "COLUMN", usage: "given ranges: column with one value per category to overlay as a dot", value: stringValue{&r.mark}},
		{name: "value", arg: "COLUMN", usage: "computed ranges: column of raw values, several rows per category", value: stringValue{&r.value}},
		{name: "stat", sets: []string{"Stat"}, values: spanStats, def: string(render.StatRange), usage: "computed ranges: range (min, mean, max), quartiles (Q1, median, Q3) or p10-p90 (with the median)",
			value: choiceValue[string]{p: &r.stat, values: spanStats}},
		{name: "mark-where", arg: "COL=VALUE", usage: "computed ranges: overlay the value of the row where COL is VALUE (one per category), such as year=2025", value: stringValue{&r.where}},
		{name: "mark-name", sets: []string{"MarkName"}, arg: "TEXT", usage: "the overlay's name, written beside the first dot (default: VALUE of --mark-where, or the --mark column)", value: stringValue{&o.MarkName}},
		{name: "order", sets: []string{"Order"}, values: orders, def: string(render.ByValue), usage: "order of categories: value (by the middle, largest first), label, or data (as in the file)",
			value: choiceValue[render.Order]{p: &o.Order, values: orders}},
		{name: "unit", sets: []string{"Unit"}, arg: "UNIT", usage: "unit of the values, such as °C (default: the sign the cells carry)", value: stringValue{&o.Unit}},
		{name: "value-name", sets: []string{"ValueName"}, arg: "TEXT", usage: "what the values measure, for the axis", value: stringValue{&o.ValueName}},
	}
	return append(defs, r.shared.flags()...)
}

func (r *spanRun) load(path string, stdin io.Reader, flagGiven func(string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error) {
	if err := r.check(flagGiven); err != nil {
		return nil, nil, err
	}
	t, notes, err := r.readTable(path, stdin, nil)
	if err != nil {
		return nil, nil, err
	}
	ranges, o, more, err := r.plan(t, nil, *r.shared.c)
	if err != nil {
		return nil, nil, err
	}
	return append(notes, more...), func(w io.Writer) ([]render.Note, error) {
		o.Common = *r.shared.c // with the notes of loading, set after load
		return render.Span(w, ranges, o)
	}, nil
}

// given reports whether the ranges are given (--low --mid --high) rather
// than computed from raw rows.
func (r *spanRun) given() bool { return r.low != "" || r.mid != "" || r.high != "" }

// check refuses flags of the two forms mixed.
func (r *spanRun) check(flagGiven func(string) bool) error {
	given := r.given()
	switch {
	case given && flagGiven("stat"):
		return usagef("--stat computes ranges from raw rows (--value); with --low --mid --high the ranges are given as they are")
	case given && r.value != "":
		return usagef("give --low --mid --high (ranges as given) or --value (ranges computed from raw rows), not both")
	case given && (r.low == "" || r.mid == "" || r.high == ""):
		return usagef("given ranges need all three of --low, --mid and --high")
	case given && r.where != "":
		return usagef("--mark-where picks rows of raw values (--value); with --low --mid --high, name the column to overlay with --mark")
	case !given && r.mark != "":
		return usagef("--mark names a column of given ranges (--low --mid --high); with raw rows, pick the rows to overlay with --mark-where COL=VALUE")
	case !given && r.value == "":
		return usagef("give the ranges with --low --mid --high, or raw values with --value to compute them (--stat)")
	}
	if _, _, err := r.whereCond(); err != nil {
		return err
	}
	return nil
}

// whereCond splits --mark-where COL=VALUE; both are "" without it.
func (r *spanRun) whereCond() (col, val string, err error) {
	if r.where == "" {
		return "", "", nil
	}
	col, val, ok := strings.Cut(r.where, "=")
	col = strings.TrimSpace(col)
	if !ok || col == "" {
		return "", "", usagef("--mark-where %q: give COL=VALUE, such as year=2025", r.where)
	}
	return col, val, nil
}

func (r *spanRun) readTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error) {
	if r.given() {
		return readGroups(path, r.readOptions(), []string{r.label, r.low, r.mid, r.high, r.mark}[:4+boolInt(r.mark != "")], keep, stdin)
	}
	col, _, _ := r.whereCond()
	if col != "" {
		keep = append(slices.Clone(keep), col)
	}
	return readGroups(path, r.readOptions(), []string{r.label, r.value}, keep, stdin)
}

func boolInt(b bool) int {
	if b {
		return 1
	}
	return 0
}

// plan builds the ranges of the given rows (nil: every row) and a copy of
// the options finished from the data.
func (r *spanRun) plan(t *Table, rows []int, c render.Common) ([]render.Range, render.SpanOptions, []render.Note, error) {
	o := r.opt // a copy: every panel starts from the flags
	o.Common = c
	if rows == nil {
		rows = allRows(t.Len())
	}
	var (
		ranges []render.Range
		notes  []render.Note
		err    error
	)
	if r.given() {
		ranges, notes, err = r.givenRanges(t, rows, &o)
	} else {
		ranges, notes, err = r.computedRanges(t, rows, &o)
	}
	return ranges, o, notes, err
}

func (r *spanRun) panel(t *Table, rows []int, c render.Common, flagGiven func(string) bool) (panelPart, error) {
	if err := r.check(flagGiven); err != nil {
		return panelPart{}, err
	}
	ranges, o, notes, err := r.plan(t, rows, c)
	if err != nil {
		return panelPart{}, err
	}
	mids := make([]float64, len(ranges))
	for i, rg := range ranges {
		mids[i] = rg.Mid
	}
	return panelPart{panel: render.SpanPanel(ranges, o), notes: notes, size: sizeOf(mids, false)}, nil
}

// shares: the value axis along x and the categories, so that a row is one
// category in every panel.
func (r *spanRun) shares() (x, y bool) { return true, true }

// givenRanges reads one row per category with its low, middle and high,
// and an optional value to overlay.
func (r *spanRun) givenRanges(t *Table, rows []int, o *render.SpanOptions) ([]render.Range, []render.Note, error) {
	cols := []string{r.low, r.mid, r.high}
	if r.mark != "" {
		cols = append(cols, r.mark)
	}
	label, notes, err := r.labelColumn(t)
	if err != nil {
		return nil, nil, err
	}
	names := t.Strings(label)
	vals := make([][]float64, len(cols))
	for i, c := range cols {
		n, err := t.ReadNumbers(c)
		if err != nil {
			return nil, nil, err
		}
		notes = append(notes, renderNotes(n.Notes)...)
		vals[i] = n.Values
	}
	if o.Unit == "" {
		o.Unit = t.unitOf(cols[:3]...)
	}
	if o.MarkName == "" {
		o.MarkName = r.mark
	}
	o.LabelName = label
	seen := map[string]int{}
	var ranges []render.Range
	var missing []int
	for _, i := range rows {
		rg := render.Range{Label: names[i], Low: vals[0][i], Mid: vals[1][i], High: vals[2][i]}
		if rg.Low != rg.Low || rg.Mid != rg.Mid || rg.High != rg.High { // NaN: a missing cell
			missing = append(missing, i)
			continue
		}
		if first, ok := seen[names[i]]; ok {
			return nil, nil, &DataError{File: t.File, Line: t.Line(i), Column: label, Text: names[i], Err: ErrDuplicateLabel,
				Hint: fmt.Sprintf("it is on line %d too; give each category one row, or give raw rows with --value to compute the range", t.Line(first))}
		}
		seen[names[i]] = i
		if !(rg.Low <= rg.Mid && rg.Mid <= rg.High) {
			return nil, nil, &DataError{File: t.File, Line: t.Line(i), Column: r.mid, Text: fmt.Sprint(rg.Mid), Err: ErrRangeOrder,
				Hint: fmt.Sprintf("low %g, middle %g, high %g; a range needs low ≤ middle ≤ high (check which columns --low --mid --high name)", rg.Low, rg.Mid, rg.High)}
		}
		if r.mark != "" {
			if m := vals[3][i]; m == m {
				rg.Mark = &m
			}
		}
		ranges = append(ranges, rg)
	}
	if len(missing) > 0 {
		notes = append(notes, skippedNote(t, missing, strings.Join(cols[:3], ", ")))
	}
	if len(ranges) == 0 {
		return nil, nil, &DataError{File: t.File, Err: ErrEmpty, Hint: "no row has all of its low, middle and high"}
	}
	return ranges, notes, nil
}

// labelColumn is --label, or the first column with a note.
func (r *spanRun) labelColumn(t *Table) (string, []render.Note, error) {
	label := r.label
	var notes []render.Note
	if label == "" {
		label = t.Header[0]
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("using column %q for labels (choose with --label)", label)})
	}
	if !t.Has(label) {
		return "", nil, t.missingColumn(label, 1)
	}
	return label, notes, nil
}

// computedRanges computes each category's range from raw rows; the rows
// --mark-where picks give the overlay.
func (r *spanRun) computedRanges(t *Table, rows []int, o *render.SpanOptions) ([]render.Range, []render.Note, error) {
	whereCol, whereVal, err := r.whereCond()
	if err != nil {
		return nil, nil, err
	}
	g, err := groupRows(t, rows, r.label, r.value, true)
	if err != nil {
		return nil, nil, err
	}
	ranges, err := render.RangesFromGroups(g.groups, render.SpanStat(r.stat))
	if err != nil {
		return nil, nil, err
	}
	notes := g.notes
	// A range of one value is a point, and quantiles of a handful are
	// interpolations between two or three of them: say which categories
	// have so few (render.MinBoxN, as for box plots).
	need := render.MinBoxN
	if render.SpanStat(r.stat) == render.StatRange {
		need = 2
	}
	var few []string
	for _, gr := range g.groups {
		if len(gr.Values) < need {
			few = append(few, fmt.Sprintf("%q (n = %d)", gr.Label, len(gr.Values)))
		}
	}
	if k := len(few); k > 0 {
		if k > 5 {
			few = append(few[:5], fmt.Sprintf("and %d more", len(few)-5))
		}
		notes = append(notes, render.Note{Code: "span-few", Changed: false,
			Text: fmt.Sprintf("%d %s computed from fewer than %d values: %s", k, pluralS(k, "range"), need, strings.Join(few, ", "))})
	}
	o.Stat = render.SpanStat(r.stat)
	if o.Unit == "" {
		o.Unit = g.unit
	}
	if o.ValueName == "" {
		o.ValueName = g.valueCol
	}
	o.LabelName = g.groupCol
	if whereCol == "" {
		return ranges, notes, nil
	}
	if !t.Has(whereCol) {
		return nil, nil, t.missingColumn(whereCol, 1)
	}
	if o.MarkName == "" {
		o.MarkName = whereVal
	}
	cells := t.Strings(whereCol)
	vals, _, err := t.Numbers(g.valueCol)
	if err != nil {
		return nil, nil, err
	}
	found := 0
	for k := range g.groups {
		at := -1
		for _, i := range g.rows[k] {
			if strings.TrimSpace(cells[i]) != strings.TrimSpace(whereVal) {
				continue
			}
			if at >= 0 {
				return nil, nil, &DataError{File: t.File, Line: t.Line(i), Column: whereCol, Text: cells[i], Err: ErrMarkTwice,
					Hint: fmt.Sprintf("line %d is %s=%s for %q too; --mark-where must pick one row per category (add a condition to the data, or filter it first)", t.Line(at), whereCol, whereVal, g.groups[k].Label)}
			}
			at = i
		}
		if at >= 0 {
			v := vals[at]
			ranges[k].Mark = &v
			found++
		}
	}
	if found == 0 {
		return nil, nil, &DataError{File: t.File, Column: whereCol, Text: whereVal, Err: ErrNoMatch,
			Hint: fmt.Sprintf("no row with a value has %s=%s; check the value, which must equal the cell's text (--mark-where COL=VALUE)", whereCol, whereVal)}
	}
	notes = append(notes, render.Note{Code: "span-where", Text: fmt.Sprintf("the ranges include the %s=%s rows that the dots mark", whereCol, whereVal)})
	return ranges, notes, nil
}
