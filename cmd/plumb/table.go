package main

import (
	"fmt"
	"io"
	"os"
	"strings"

	"plumb/internal/table"
	"plumb/render"
)

// The reading lives in internal/table; these names keep the charts' code
// short.
type DataError = table.DataError

var (
	ErrBadNumber     = table.ErrBadNumber
	ErrMissingColumn = table.ErrMissingColumn
	ErrEmpty         = table.ErrEmpty
)

// Table is a data file read for one chart.
type Table struct{ *table.Table }

// missingColumn is the error for a column the header lacks.
func (t *Table) missingColumn(col string, _ int) error { return t.MissingColumn(col) }

// numberNotes are the notes of reading the given columns as numbers.
func (t *Table) numberNotes(cols ...string) []render.Note {
	var out []render.Note
	for _, c := range cols {
		if n, err := t.ReadNumbers(c); err == nil {
			out = append(out, renderNotes(n.Notes)...)
		}
	}
	return out
}

// unitOf is the unit the cells of every given column carry ("%", "$"), or
// "" when they carry none or differ.
func (t *Table) unitOf(cols ...string) string {
	unit := ""
	for i, c := range cols {
		n, err := t.ReadNumbers(c)
		if err != nil || (i > 0 && n.Unit != unit) {
			return ""
		}
		unit = n.Unit
	}
	return unit
}

// renderNotes converts the reader's notes into the figure's.
func renderNotes(in []table.Note) []render.Note {
	out := make([]render.Note, len(in))
	for i, n := range in {
		out[i] = render.Note{Code: n.Code, Text: n.Text, Changed: n.Changed}
	}
	return out
}

// readOptions are the reading flags every chart shares.
type readOptions struct {
	format, decimal, maxInput string
}

func (sh *shared) readOptions() readOptions {
	return readOptions{format: sh.format, decimal: sh.decimal, maxInput: sh.maxInput}
}

// reader turns the flags into a table.Reader.
func (o readOptions) reader(want []string) (*table.Reader, error) {
	r := &table.Reader{Format: o.format, Columns: want}
	switch strings.TrimSpace(o.decimal) {
	case "":
	case ".", "point":
		r.Decimal = '.'
	case ",", "comma":
		r.Decimal = ','
	default:
		return nil, usagef("--decimal %q: use . or ,", o.decimal)
	}
	if o.maxInput != "" {
		n, err := table.ParseSize(o.maxInput)
		if err != nil {
			return nil, usagef("--max-input: %v", err)
		}
		r.MaxInput = n
	}
	return r, nil
}

// readData reads a data file, or standard input for "-", keeping the
// columns in want (nil keeps all).
func readData(path string, o readOptions, want []string, stdin io.Reader) (*Table, []render.Note, error) {
	rd, err := o.reader(want)
	if err != nil {
		return nil, nil, err
	}
	in := stdin
	if path != "-" {
		fh, err := os.Open(path)
		if err != nil {
			return nil, nil, fmt.Errorf("cannot read the data: %w", err)
		}
		defer fh.Close()
		in = fh
	}
	t, err := rd.Read(in, path)
	if err != nil {
		return nil, nil, err
	}
	return &Table{t}, renderNotes(t.Notes), nil
}

// ReadTable reads a data file with the default options, for tests.
func ReadTable(r io.Reader, file, format string, want []string) (*Table, error) {
	t, err := (&table.Reader{Format: format, Columns: want}).Read(r, file)
	if err != nil {
		return nil, err
	}
	return &Table{t}, nil
}
