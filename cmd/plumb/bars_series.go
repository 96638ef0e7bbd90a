package main

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"plumb/internal/table"
	"plumb/render"
)

// seriesData is a table read as several values per category: long (a
// series column names each row's series) or wide (one value column per
// series).
type seriesData struct {
	labels             []string
	series             []render.RowSeries
	labelCol, valueCol string // valueCol: the value column of long input, "" for wide
	unit               string
	notes              []render.Note
	repeated           bool // some category and series had several rows, combined by agg
}

// loadSeries reads a label column and, with seriesCol, one value column
// whose rows belong to the series that column names, or without it
// several value columns, one per series. Rows without a value are skipped
// with a note; repeated category and series pairs are combined with agg.
func loadSeries(path string, o readOptions, labelCol, seriesCol string, valueCols []string, agg string, stdin io.Reader) (*seriesData, error) {
	if !containsString(table.Aggregations, agg) {
		return nil, usagef("--agg %q: use sum, mean, median, count, min or max", agg)
	}
	if seriesCol != "" && len(valueCols) > 1 {
		return nil, usagef("--series takes one value column (--value COL); give several --value columns only in wide format, one per series")
	}
	var want []string
	if labelCol != "" && len(valueCols) > 0 {
		want = append([]string{labelCol}, valueCols...)
		if seriesCol != "" {
			want = append(want, seriesCol)
		}
	}
	t, notes, err := readData(path, o, want, stdin)
	if err != nil {
		return nil, err
	}
	if labelCol == "" && len(t.Header) > 0 {
		labelCol = t.Header[0]
	}
	if len(valueCols) == 0 {
		var skip []string
		if seriesCol != "" {
			skip = []string{seriesCol}
		}
		cols, err := t.NumericColumns(labelCol, skip, 1, false)
		if err != nil {
			return nil, err
		}
		if len(cols) == 0 {
			return nil, tooFewColumns(t, "a chart of series needs a label column, a series column and a value column")
		}
		valueCols = cols[:1]
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("using column %q for labels and %q for values (choose with --label and --value)", labelCol, valueCols[0])})
	}
	dict, codes := t.Codes(labelCol)
	if dict == nil {
		return nil, t.missingColumn(labelCol, 1)
	}
	d := &seriesData{labelCol: labelCol}
	if seriesCol != "" {
		err = d.readLong(t, path, dict, codes, seriesCol, valueCols[0], agg)
	} else {
		err = d.readWide(t, path, dict, codes, valueCols, agg)
	}
	if err != nil {
		return nil, err
	}
	notes = append(notes, d.notes...)
	notes = append(notes, shortenNote(table.ShortenLabels(d.labels, 0), "label")...)
	d.notes = notes
	return d, nil
}

// readLong groups the rows by category and series: categories and series
// in order of first appearance, NaN where a pair has no row.
func (d *seriesData) readLong(t *Table, path string, dict []string, codes []uint32, seriesCol, valueCol string, agg string) error {
	sdict, scodes := t.Codes(seriesCol)
	if sdict == nil {
		return t.missingColumn(seriesCol, 1)
	}
	n, err := t.ReadNumbers(valueCol)
	if err != nil {
		return err
	}
	if len(n.Missing) == len(n.Values) {
		return &DataError{File: path, Column: valueCol, Err: ErrEmpty, Hint: "every row lacks a value; check the column name and the file"}
	}
	d.valueCol, d.unit = valueCol, n.Unit
	d.notes = append(d.notes, renderNotes(n.Notes)...)
	if len(n.Missing) > 0 {
		d.notes = append(d.notes, skippedNote(t, n.Missing, valueCol))
	}
	// One code per (category, series) pair, in order of first appearance.
	pairs := map[uint64]uint32{}
	var pdict []string
	var of [][2]uint32
	pcodes := make([]uint32, len(codes))
	for i := range codes {
		k := uint64(codes[i])<<32 | uint64(scodes[i])
		c, ok := pairs[k]
		if !ok {
			c = uint32(len(pdict))
			pairs[k] = c
			pdict = append(pdict, strconv.Itoa(int(c)))
			of = append(of, [2]uint32{codes[i], scodes[i]})
		}
		pcodes[i] = c
	}
	g, err := table.AggregateCodes(pdict, pcodes, n.Values, agg)
	if err != nil {
		return err
	}
	labelAt, seriesAt := map[uint32]int{}, map[uint32]int{}
	var rep []labelCount
	for j, p := range g.Labels {
		c, _ := strconv.Atoi(p)
		l, s := of[c][0], of[c][1]
		i, ok := labelAt[l]
		if !ok {
			i = len(d.labels)
			labelAt[l] = i
			d.labels = append(d.labels, dict[l])
			for k := range d.series {
				d.series[k].Values = append(d.series[k].Values, math.NaN())
			}
		}
		k, ok := seriesAt[s]
		if !ok {
			k = len(d.series)
			seriesAt[s] = k
			d.series = append(d.series, render.RowSeries{Name: sdict[s], Values: nanSlice(len(d.labels))})
		}
		d.series[k].Values[i] = g.Values[j]
		if g.Rows[j] > 1 {
			rep = append(rep, labelCount{dict[l] + " / " + sdict[s], g.Rows[j]})
		}
	}
	if len(rep) > 0 {
		d.repeated = true
		d.notes = append(d.notes, combinedNote(rep, agg, len(d.labels)))
	}
	return nil
}

// readWide reads one series per value column, each combined by category.
func (d *seriesData) readWide(t *Table, path string, dict []string, codes []uint32, cols []string, agg string) error {
	at := map[string]int{}
	for _, col := range cols {
		n, err := t.ReadNumbers(col)
		if err != nil {
			return err
		}
		d.notes = append(d.notes, renderNotes(n.Notes)...)
		if len(n.Missing) > 0 {
			d.notes = append(d.notes, skippedNote(t, n.Missing, col))
		}
		g, err := table.AggregateCodes(dict, codes, n.Values, agg)
		if err != nil {
			return err
		}
		s := render.RowSeries{Name: col, Values: nanSlice(len(d.labels))}
		for j, l := range g.Labels {
			i, ok := at[l]
			if !ok {
				i = len(d.labels)
				at[l] = i
				d.labels = append(d.labels, l)
				for k := range d.series {
					d.series[k].Values = append(d.series[k].Values, math.NaN())
				}
				s.Values = append(s.Values, math.NaN())
			}
			s.Values[i] = g.Values[j]
			d.repeated = d.repeated || g.Rows[j] > 1
		}
		d.series = append(d.series, s)
	}
	if len(d.labels) == 0 {
		return &DataError{File: path, Column: strings.Join(cols, ","), Err: ErrEmpty, Hint: "every row lacks a value; check the column names and the file"}
	}
	d.unit = t.unitOf(cols...)
	return nil
}

func nanSlice(n int) []float64 {
	v := make([]float64, n)
	for i := range v {
		v[i] = math.NaN()
	}
	return v
}

// layoutValue is --stack or --side: a switch that sets BarsOptions.Layout.
type layoutValue struct {
	p  *render.SeriesLayout
	to render.SeriesLayout
}

func (v layoutValue) String() string {
	if v.p != nil && *v.p == v.to {
		return "true"
	}
	return "false"
}

func (v layoutValue) Set(s string) error {
	on, err := strconv.ParseBool(s)
	if err != nil {
		return errors.New("use true or false")
	}
	switch {
	case !on && *v.p == v.to:
		*v.p = ""
	case on && *v.p != "" && *v.p != v.to:
		return fmt.Errorf("--%s and --%s both lay out the series: give one", *v.p, v.to)
	case on:
		*v.p = v.to
	}
	return nil
}

func (v layoutValue) IsBoolFlag() bool { return true }

// layoutWords names the flag of a Layout error: --stack or --side, the
// one the user gave, rather than the option both set.
func layoutWords(err error, layout render.SeriesLayout) error {
	var oe *render.OptionError
	if !errors.As(err, &oe) || oe.Option != "Layout" || layout == "" {
		return err
	}
	return &render.OptionError{Option: "--" + string(layout), Err: oe.Err}
}
