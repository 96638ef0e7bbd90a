package main

import (
	"fmt"
	"io"
	"slices"
	"strings"

	"plumb/internal/table"
	"plumb/render"
)

// labelled is a data file reduced to one value per label.
type labelled struct {
	labels             []string
	values             []float64
	labelCol, valueCol string
	// unit is the unit the value cells carry ("%", "$"), "" for none.
	unit  string
	notes []render.Note
	// repeated lists the labels that occurred on more than one row, with
	// their row counts, in order of first appearance: values that were
	// combined, which decides whether they may be summed further into Other.
	repeated []labelCount
}

// labelCount is a label and how many rows carried it.
type labelCount struct {
	label string
	n     int
}

// countRows is the value name of a chart that counts rows.
const countRows = "count of rows"

// loadLabelled reads a label column and a value column, skips rows with a
// missing value (with a note), and combines repeated labels with agg. With
// agg "count" and no value column it counts the rows of each label, and
// no value column is needed.
func loadLabelled(path string, o readOptions, labelCol, valueCol, agg string, stdin io.Reader) (*labelled, error) {
	t, notes, err := readLabelled(path, o, labelCol, valueCol, agg, nil, stdin)
	if err != nil {
		return nil, err
	}
	return labelledRows(t, notes, labelCol, valueCol, agg, nil)
}

// readLabelled reads the data file of a labelled chart, keeping the label
// and value columns when both are named, and the columns in keep (a --by
// column) besides.
func readLabelled(path string, o readOptions, labelCol, valueCol, agg string, keep []string, stdin io.Reader) (*Table, []render.Note, error) {
	if !containsString(table.Aggregations, agg) {
		return nil, nil, usagef("--agg %q: use sum, mean, median, count, min or max", agg)
	}
	counting := agg == "count" && valueCol == ""
	var want []string
	switch {
	case labelCol != "" && valueCol != "":
		want = []string{labelCol, valueCol}
	case labelCol != "" && counting:
		want = []string{labelCol}
	}
	if want != nil {
		want = append(want, keep...)
	}
	return readData(path, o, want, stdin)
}

// labelledRows reduces the given rows of t (nil: every row) to one value
// per label, as loadLabelled describes.
func labelledRows(t *Table, notes []render.Note, labelCol, valueCol, agg string, rows []int) (*labelled, error) {
	counting := agg == "count" && valueCol == ""
	notes = slices.Clone(notes)
	if labelCol == "" && len(t.Header) > 0 {
		labelCol = t.Header[0]
		if labelCol == valueCol && len(t.Header) > 1 {
			labelCol = t.Header[1]
		}
	}
	if !counting && (len(t.Header) < 2 || labelCol == valueCol) {
		return nil, tooFewColumns(t, "a chart needs a label column and a value column")
	}
	if valueCol == "" && !counting {
		cols, err := t.NumericColumns(labelCol, nil, 1, false)
		if err != nil {
			return nil, err
		}
		if len(cols) == 0 {
			return nil, tooFewColumns(t, "a chart needs a label column and a value column")
		}
		valueCol = cols[0]
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("using column %q for labels and %q for values (choose with --label and --value)", labelCol, valueCol)})
	}
	dict, codes := t.Codes(labelCol)
	if dict == nil {
		return nil, t.missingColumn(labelCol, 1)
	}
	d := &labelled{labelCol: labelCol, valueCol: valueCol}
	var values []float64
	if counting {
		d.valueCol = countRows
		notes = append(notes, render.Note{Code: "count", Text: fmt.Sprintf("counting the rows of each %q", labelCol)})
	} else {
		n, err := t.ReadNumbers(valueCol)
		if err != nil {
			return nil, err
		}
		values, d.unit = n.Values, n.Unit
		notes = append(notes, renderNotes(n.Notes)...)
		missing := n.Missing
		if rows != nil {
			missing = inRows(missing, rows)
		}
		if len(missing) > 0 {
			notes = append(notes, skippedNote(t, missing, valueCol))
		}
		if len(missing) == len(values) || (rows != nil && len(missing) == len(rows)) {
			return nil, &DataError{File: t.File, Column: valueCol, Err: ErrEmpty, Hint: "every row lacks a value; check the column name and the file"}
		}
		if agg == "count" {
			d.valueCol = countRows + " with a " + valueCol
		}
	}
	if rows != nil {
		codes = pickCodes(codes, rows)
		if values != nil {
			values = pick(values, rows)
		}
	}
	g, err := table.AggregateCodes(dict, codes, values, agg)
	if err != nil {
		return nil, err
	}
	notes = append(notes, shortenNote(table.ShortenLabels(g.Labels, 0), "label")...)
	for i, n := range g.Rows {
		if n > 1 {
			d.repeated = append(d.repeated, labelCount{g.Labels[i], n})
		}
	}
	if len(d.repeated) > 0 && !counting {
		notes = append(notes, combinedNote(d.repeated, agg, len(g.Labels)))
	}
	d.labels, d.values, d.notes = g.Labels, g.Values, notes
	return d, nil
}

// inRows keeps the rows of sorted that are also in rows (both increasing).
func inRows(sorted, rows []int) []int {
	var out []int
	j := 0
	for _, r := range sorted {
		for j < len(rows) && rows[j] < r {
			j++
		}
		if j < len(rows) && rows[j] == r {
			out = append(out, r)
		}
	}
	return out
}

// pickCodes returns codes at rows.
func pickCodes(codes []uint32, rows []int) []uint32 {
	out := make([]uint32, len(rows))
	for i, r := range rows {
		out[i] = codes[r]
	}
	return out
}

// shortenNote says how many labels table.ShortenLabels shortened.
func shortenNote(k int, what string) []render.Note {
	if k == 0 {
		return nil
	}
	return []render.Note{{Code: "labels-shortened", Changed: true,
		Text: fmt.Sprintf("shortened %d %s longer than %d characters", k, pluralS(k, what), table.DefaultMaxLabel)}}
}

// skippedNote says which rows were left out for lack of a value.
func skippedNote(t *Table, missing []int, col string) render.Note {
	lines := make([]string, 0, 9)
	for _, m := range missing[:min(len(missing), 8)] {
		lines = append(lines, fmt.Sprint(t.Line(m)))
	}
	if len(missing) > 8 {
		lines = append(lines, "…")
	}
	return render.Note{Code: "rows-skipped", Changed: true, Text: fmt.Sprintf("skipped %d %s with no value in column %q (%s %s)",
		len(missing), pluralS(len(missing), "row"), col, pluralS(len(lines), "line"), strings.Join(lines, ", "))}
}

// maxNamed is how many repeated labels the combined note names before
// "and k more".
const maxNamed = 5

// combinedNote names the labels that were combined and how many rows each
// had: two different places that share a name are summed into one bar,
// and the reader should see which.
func combinedNote(rep []labelCount, agg string, remain int) render.Note {
	rows := 0
	for _, r := range rep {
		rows += r.n
	}
	var b strings.Builder
	fmt.Fprintf(&b, "combined %d rows into %d %s by %s (--agg %s): ", rows, len(rep), pluralS(len(rep), "label"), aggWord(agg), agg)
	for i, r := range rep[:min(len(rep), maxNamed)] {
		if i > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "%q (%d rows)", r.label, r.n)
	}
	if len(rep) > maxNamed {
		fmt.Fprintf(&b, " and %d more", len(rep)-maxNamed)
	}
	fmt.Fprintf(&b, "; %d %s remain", remain, pluralS(remain, "category"))
	return render.Note{Code: "combined", Changed: true, Text: b.String()}
}

func containsString(list []string, s string) bool {
	for _, l := range list {
		if l == s {
			return true
		}
	}
	return false
}

func aggWord(agg string) string {
	switch agg {
	case "sum":
		return "adding them up"
	case "mean":
		return "taking their mean"
	case "median":
		return "taking their median"
	case "count":
		return "counting rows"
	case "min":
		return "keeping the smallest"
	}
	return "keeping the largest"
}

func pluralS(n int, word string) string {
	if n == 1 {
		return word
	}
	if strings.HasSuffix(word, "y") {
		return word[:len(word)-1] + "ies"
	}
	return word + "s"
}

// tooFewColumns says that the data lacks the columns a chart needs, listing
// the ones it has.
func tooFewColumns(t *Table, need string) error {
	return fmt.Errorf("%s: line 1: the data has %d %s (%s); %s",
		table.DisplayName(t.File), len(t.Header), pluralS(len(t.Header), "column"), strings.Join(t.Header, ", "), need)
}
