package main

import (
	"bufio"
	"bytes"
	"fmt"
	"io"
	"os"
	"strings"

	"plumb/render"
)

// labelled is a data file reduced to one value per label.
type labelled struct {
	labels             []string
	values             []float64
	labelCol, valueCol string
	notes              []render.Note
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

// countRepeats returns the labels that occur more than once, with their
// counts, in order of first appearance.
func countRepeats(labels []string) []labelCount {
	n := make(map[string]int, min(len(labels), 1024))
	for _, l := range labels {
		n[l]++
	}
	var out []labelCount
	for _, l := range labels {
		if c := n[l]; c > 1 {
			out = append(out, labelCount{l, c})
			n[l] = 0
		}
	}
	return out
}

// openData opens a data file, or standard input for "-". For standard input
// without --format it looks at the first bytes to tell JSON, TSV and CSV
// apart, and says so in a note.
func openData(path, format string, stdin io.Reader) (io.Reader, string, func(), []render.Note, error) {
	if path != "-" {
		fh, err := os.Open(path)
		if err != nil {
			return nil, "", nil, nil, fmt.Errorf("cannot read the data: %w", err)
		}
		return fh, format, func() { fh.Close() }, nil, nil
	}
	br := bufio.NewReaderSize(stdin, 64<<10)
	if format != "" {
		return br, format, func() {}, nil, nil
	}
	head, _ := br.Peek(4096)
	format = sniffFormat(head)
	return br, format, func() {}, []render.Note{{Code: "format", Text: fmt.Sprintf("read standard input as %s (say --format csv|tsv|json to choose)", strings.ToUpper(format))}}, nil
}

// sniffFormat guesses the format of data from its first bytes.
func sniffFormat(head []byte) string {
	trimmed := bytes.TrimLeft(bytes.TrimPrefix(head, []byte("\xef\xbb\xbf")), " \t\r\n")
	if len(trimmed) > 0 && trimmed[0] == '[' {
		return "json"
	}
	line, _, _ := bytes.Cut(trimmed, []byte("\n"))
	if bytes.Count(line, []byte("\t")) > 0 && bytes.Count(line, []byte(",")) == 0 {
		return "tsv"
	}
	return "csv"
}

// loadLabelled reads a label column and a value column, skips rows with a
// missing value (with a note), and combines repeated labels with agg.
func loadLabelled(path, format, labelCol, valueCol, agg string, stdin io.Reader) (*labelled, error) {
	switch agg {
	case "sum", "mean", "median", "count", "min", "max":
	default:
		return nil, usagef("--agg %q: use sum, mean, median, count, min or max", agg)
	}
	r, format, done, notes, err := openData(path, format, stdin)
	if err != nil {
		return nil, err
	}
	defer done()
	var want []string
	if labelCol != "" && valueCol != "" {
		want = []string{labelCol, valueCol}
	}
	t, err := ReadTable(r, path, format, want)
	if err != nil {
		return nil, err
	}
	if labelCol == "" || valueCol == "" {
		labelCol, valueCol, err = guessColumns(t, labelCol, valueCol)
		if err != nil {
			return nil, err
		}
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("using column %q for labels and %q for values (choose with --label and --value)", labelCol, valueCol)})
	}
	labels := t.Strings(labelCol)
	if labels == nil {
		return nil, t.missingColumn(labelCol, 1)
	}
	values, missing, err := t.Numbers(valueCol)
	if err != nil {
		return nil, err
	}
	if len(missing) > 0 {
		skip := make(map[int]bool, len(missing))
		lines := make([]string, 0, 8)
		for i, m := range missing {
			skip[m] = true
			if i < 8 {
				lines = append(lines, fmt.Sprint(t.Line(m)))
			}
		}
		if len(missing) > 8 {
			lines = append(lines, "…")
		}
		kl, kv := labels[:0:0], values[:0:0]
		for i := range labels {
			if !skip[i] {
				kl, kv = append(kl, labels[i]), append(kv, values[i])
			}
		}
		labels, values = kl, kv
		notes = append(notes, render.Note{Code: "rows-skipped", Changed: true, Text: fmt.Sprintf("skipped %d %s with no value in column %q (%s %s)",
			len(missing), pluralS(len(missing), "row"), valueCol, pluralS(len(lines), "line"), strings.Join(lines, ", "))})
	}
	if len(values) == 0 {
		return nil, &DataError{File: path, Column: valueCol, Err: ErrEmpty, Hint: "every row lacks a value; check the column name and the file"}
	}
	repeated := countRepeats(labels)
	labels, values, repeats, err := Aggregate(labels, values, agg)
	if err != nil {
		return nil, err
	}
	if repeats > 0 {
		notes = append(notes, render.Note{Code: "combined", Changed: true, Text: fmt.Sprintf("combined %d repeated %s by %s (--agg %s); %d categories remain", repeats, pluralS(repeats, "label"), aggWord(agg), agg, len(labels))})
	}
	return &labelled{labels: labels, values: values, labelCol: labelCol, valueCol: valueCol, notes: notes, repeated: repeated}, nil
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
	return word + "s"
}

// guessColumns picks the first column as labels and the first column after
// it whose cells read as numbers as values, filling whichever is not given.
func guessColumns(t *Table, labelCol, valueCol string) (string, string, error) {
	if len(t.Header) < 2 {
		return "", "", tooFewColumns(t, "a chart needs a label column and a value column")
	}
	if labelCol == "" {
		labelCol = t.Header[0]
		if labelCol == valueCol {
			labelCol = t.Header[1]
		}
	}
	if valueCol == "" {
		// The first column after the labels that reads as numbers; when
		// none does, the first candidate's own error says why (a bad cell
		// in the column the user most likely meant).
		var first error
		for _, h := range t.Header {
			if h == labelCol {
				continue
			}
			_, _, err := t.Numbers(h)
			if err == nil {
				valueCol = h
				break
			}
			if first == nil {
				first = err
			}
		}
		if valueCol == "" {
			return "", "", first
		}
	}
	return labelCol, valueCol, nil
}

// tooFewColumns says that the data lacks the columns a chart needs, listing
// the ones it has.
func tooFewColumns(t *Table, need string) error {
	return fmt.Errorf("%s: line 1: the data has %d %s (%s); %s",
		displayName(t.File), len(t.Header), pluralS(len(t.Header), "column"), strings.Join(t.Header, ", "), need)
}
