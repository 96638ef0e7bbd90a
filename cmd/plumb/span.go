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
	given := r.low != "" || r.mid != "" || r.high != ""
	switch {
	case given && flagGiven("stat"):
		return nil, nil, usagef("--stat computes ranges from raw rows (--value); with --low --mid --high the ranges are given as they are")
	case given && r.value != "":
		return nil, nil, usagef("give --low --mid --high (ranges as given) or --value (ranges computed from raw rows), not both")
	case given && (r.low == "" || r.mid == "" || r.high == ""):
		return nil, nil, usagef("given ranges need all three of --low, --mid and --high")
	case given && r.where != "":
		return nil, nil, usagef("--mark-where picks rows of raw values (--value); with --low --mid --high, name the column to overlay with --mark")
	case !given && r.mark != "":
		return nil, nil, usagef("--mark names a column of given ranges (--low --mid --high); with raw rows, pick the rows to overlay with --mark-where COL=VALUE")
	case !given && r.value == "":
		return nil, nil, usagef("give the ranges with --low --mid --high, or raw values with --value to compute them (--stat)")
	}
	var (
		ranges []render.Range
		notes  []render.Note
		err    error
	)
	if given {
		ranges, notes, err = r.loadGiven(path, stdin)
	} else {
		ranges, notes, err = r.loadComputed(path, stdin)
	}
	if err != nil {
		return nil, nil, err
	}
	return notes, func(w io.Writer) ([]render.Note, error) { return render.Span(w, ranges, r.opt) }, nil
}

// loadGiven reads one row per category with its low, middle and high, and
// an optional value to overlay.
func (r *spanRun) loadGiven(path string, stdin io.Reader) ([]render.Range, []render.Note, error) {
	cols := []string{r.low, r.mid, r.high}
	if r.mark != "" {
		cols = append(cols, r.mark)
	}
	var want []string
	if r.label != "" {
		want = append([]string{r.label}, cols...)
	}
	t, notes, err := readData(path, r.readOptions(), want, stdin)
	if err != nil {
		return nil, nil, err
	}
	label, err := r.labelColumn(t)
	if err != nil {
		return nil, nil, err
	}
	names := t.Strings(label)
	vals := make([][]float64, len(cols))
	var missing []int
	seenMissing := map[int]bool{}
	for i, c := range cols {
		n, err := t.ReadNumbers(c)
		if err != nil {
			return nil, nil, err
		}
		notes = append(notes, renderNotes(n.Notes)...)
		vals[i] = n.Values
		if i < 3 {
			for _, m := range n.Missing {
				if !seenMissing[m] {
					seenMissing[m] = true
					missing = append(missing, m)
				}
			}
		}
	}
	if len(missing) > 0 {
		notes = append(notes, skippedNote(t, slices.Sorted(slices.Values(missing)), strings.Join(cols[:3], ", ")))
	}
	if r.opt.Unit == "" {
		r.opt.Unit = t.unitOf(cols[:3]...)
	}
	if r.opt.MarkName == "" {
		r.opt.MarkName = r.mark
	}
	r.opt.LabelName = label
	seen := map[string]int{}
	var ranges []render.Range
	for i := range t.Len() {
		if seenMissing[i] {
			continue
		}
		if first, ok := seen[names[i]]; ok {
			return nil, nil, &DataError{File: t.File, Line: t.Line(i), Column: label, Text: names[i], Err: ErrDuplicateLabel,
				Hint: fmt.Sprintf("it is on line %d too; give each category one row, or give raw rows with --value to compute the range", t.Line(first))}
		}
		seen[names[i]] = i
		rg := render.Range{Label: names[i], Low: vals[0][i], Mid: vals[1][i], High: vals[2][i]}
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
	if len(ranges) == 0 {
		return nil, nil, &DataError{File: t.File, Err: ErrEmpty, Hint: "no row has all of its low, middle and high"}
	}
	return ranges, notes, nil
}

// labelColumn is --label, or the first column with a note.
func (r *spanRun) labelColumn(t *Table) (string, error) {
	if t.Len() == 0 {
		return "", &DataError{File: t.File, Err: ErrEmpty, Hint: "the file has a header but no rows"}
	}
	label := r.label
	if label == "" {
		label = t.Header[0]
	}
	if !t.Has(label) {
		return "", t.missingColumn(label, 1)
	}
	return label, nil
}

// loadComputed reads raw rows and computes each category's range; the
// rows --mark-where picks give the overlay.
func (r *spanRun) loadComputed(path string, stdin io.Reader) ([]render.Range, []render.Note, error) {
	var whereCol, whereVal string
	if r.where != "" {
		var ok bool
		whereCol, whereVal, ok = strings.Cut(r.where, "=")
		whereCol = strings.TrimSpace(whereCol)
		if !ok || whereCol == "" {
			return nil, nil, usagef("--mark-where %q: give COL=VALUE, such as year=2025", r.where)
		}
	}
	var extra []string
	if whereCol != "" {
		extra = []string{whereCol}
	}
	g, err := loadGroups(path, r.readOptions(), r.label, r.value, extra, true, stdin)
	if err != nil {
		return nil, nil, err
	}
	ranges, err := render.RangesFromGroups(g.groups, render.SpanStat(r.stat))
	if err != nil {
		return nil, nil, err
	}
	notes := g.notes
	o := &r.opt
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
	t := g.t
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
