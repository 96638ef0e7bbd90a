package table

import (
	"bytes"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"strings"
	"unicode/utf8"

	"plumb/internal/suggest"
)

// readDelimited fills the table from separated text. The header is read
// with the RFC 4180 reader (it is often quoted); then the rows go through
// the fast path, one byte-level scan that splits each line at the
// separator and hands the kept cells to their columns, until a line holds
// a quote: from there on encoding/csv reads the rest, so quoting follows
// RFC 4180 exactly. Both paths give the same table (TestFastSlowAgree).
//
// Text is checked to be UTF-8 cell by cell, and only in the kept columns
// (a label once per distinct text): a pass over the whole input cost 4% of
// the bars benchmark.
func (t *Table) readDelimited(data []byte, want []string, slow bool) error {
	if len(data) > math.MaxUint32 {
		return tooLarge(t.File, math.MaxUint32)
	}
	t.data = data
	t.quoteFrom = len(data) + 1
	hdr, body, line, err := t.readHeader()
	if err != nil {
		return err
	}
	t.header = line
	t.bodyStart = body
	t.Header = make([]string, len(hdr))
	for i, h := range hdr {
		if !utf8.ValidString(h) {
			return t.encodingError(line, "", h)
		}
		t.Header[i] = strings.TrimSpace(h)
	}
	rows := estimateRows(data[body:])
	slots, err := t.keepColumns(want, rows)
	if err != nil {
		return err
	}
	t.starts = make([]uint32, 0, rows)
	sep := byte(t.Comma)
	width := len(hdr)
	off := body
	// One search for the first quote replaces one per line: the lines
	// before it take the fast path.
	quote := len(data)
	if t.quotes {
		if q := bytes.IndexByte(data[body:], '"'); q >= 0 {
			quote = body + q
		}
	}
	for off < len(data) {
		end, next := len(data), len(data)
		if nl := bytes.IndexByte(data[off:], '\n'); nl >= 0 {
			end, next = off+nl, off+nl+1
		}
		line := data[off:end]
		if len(line) > 0 && line[len(line)-1] == '\r' {
			line = line[:len(line)-1]
		}
		if len(line) == 0 {
			off = next
			continue
		}
		if t.quotes && (slow || quote < next) {
			if err := t.readQuoted(off, slots, width); err != nil {
				return err
			}
			break
		}
		t.starts = append(t.starts, uint32(off))
		f, bad := 0, -1
		var badText []byte
		for {
			var c *column
			if f < width && slots[f] >= 0 {
				c = t.cols[slots[f]]
			}
			// A numeric column's cell is parsed in the same pass that
			// finds its end; anything else is cut at the separator.
			if c != nil && c.numeric {
				if v, n, ok := scanDecimal(line, sep); ok {
					if c.nums == nil {
						c.nums = make([]float64, 0, c.rows)
					}
					c.nums = append(c.nums, v)
					line = line[n:]
					f++
					if len(line) == 0 {
						break
					}
					line = line[1:]
					continue
				}
			}
			i := bytes.IndexByte(line, sep)
			cell := line
			if i >= 0 {
				cell = line[:i]
			}
			if c != nil && !addCell(t, c, cell) && bad < 0 {
				bad, badText = f, cell // reported after the field count, as encoding/csv's path does
			}
			f++
			if i < 0 {
				break
			}
			line = line[i+1:]
		}
		if f != width {
			return t.fieldCountError(t.lineAt(off), width, f)
		}
		if bad >= 0 {
			return t.encodingError(t.lineAt(off), t.Header[bad], string(badText))
		}
		t.rows++
		off = next
	}
	return t.finish()
}

// estimateRows bounds the rows of a body from the line feeds in its first
// 64 KiB, with a margin, so that columns are allocated once; a guess that
// falls short only means a column grows. Counting every line feed cost 4%
// of the bars benchmark.
func estimateRows(body []byte) int {
	sample := body[:min(len(body), 64<<10)]
	n := bytes.Count(sample, []byte("\n")) + 1
	if len(sample) == len(body) {
		return n
	}
	return int(float64(len(body))/float64(len(sample))*float64(n)*1.05) + 16
}

// readHeader reads the first record. It returns the header fields, the
// offset just past them, and the header's line.
func (t *Table) readHeader() ([]string, int, int, error) {
	if t.quotes {
		cr := t.csvReader(0)
		rec, err := cr.Read()
		if err == io.EOF {
			return nil, 0, 0, t.empty("the file is empty; it needs a header row and at least one data row")
		}
		if err != nil {
			return nil, 0, 0, t.recordError(err, rec, 0, 1)
		}
		line, _ := cr.FieldPos(0)
		return append([]string(nil), rec...), int(cr.InputOffset()), line, nil
	}
	off, line := 0, 1
	for off < len(t.data) {
		end, next := len(t.data), len(t.data)
		if nl := bytes.IndexByte(t.data[off:], '\n'); nl >= 0 {
			end, next = off+nl, off+nl+1
		}
		text := strings.TrimSuffix(string(t.data[off:end]), "\r")
		if text != "" {
			return strings.Split(text, string(t.Comma)), next, line, nil
		}
		off, line = next, line+1
	}
	return nil, 0, 0, t.empty("the file is empty; it needs a header row and at least one data row")
}

func (t *Table) empty(hint string) error {
	return &DataError{File: t.File, Err: ErrEmpty, Hint: hint}
}

// readQuoted reads the rows from off to the end with encoding/csv.
func (t *Table) readQuoted(off int, slots []int, width int) error {
	t.quoteFrom = off
	base := t.lineAt(off)
	cr := t.csvReader(off)
	for {
		start := off + int(cr.InputOffset())
		rec, err := cr.Read()
		if err == io.EOF {
			return nil
		}
		if err != nil {
			return t.recordError(err, rec, width, base)
		}
		if len(rec) != width {
			l, _ := cr.FieldPos(0)
			return t.fieldCountError(base+l-1, width, len(rec))
		}
		t.starts = append(t.starts, uint32(start))
		for i, s := range slots {
			if s >= 0 && !addCell(t, t.cols[s], rec[i]) {
				l, _ := cr.FieldPos(i)
				return t.encodingError(base+l-1, t.Header[i], rec[i])
			}
		}
		t.rows++
	}
}

// finish checks that there were rows and closes the columns.
func (t *Table) finish() error {
	if t.rows == 0 {
		return t.empty("the file has a header but no data; add rows below the header")
	}
	for _, c := range t.cols {
		c.done()
	}
	t.complete = true
	return nil
}

// rowField returns field f of data row r of a delimited file, read again
// from the row's start.
func (t *Table) rowField(r, f int) string {
	off := int(t.starts[r])
	if off >= t.quoteFrom {
		cr := t.csvReader(off)
		rec, err := cr.Read()
		if err != nil || f >= len(rec) {
			return ""
		}
		return rec[f]
	}
	line := t.data[off:]
	if nl := bytes.IndexByte(line, '\n'); nl >= 0 {
		line = line[:nl]
	}
	if len(line) > 0 && line[len(line)-1] == '\r' {
		line = line[:len(line)-1]
	}
	sep := byte(t.Comma)
	for ; f > 0; f-- {
		i := bytes.IndexByte(line, sep)
		if i < 0 {
			return ""
		}
		line = line[i+1:]
	}
	if i := bytes.IndexByte(line, sep); i >= 0 {
		line = line[:i]
	}
	return string(line)
}

// keepColumns checks the header for repeated names and maps the wanted
// columns to file positions. It returns, per field of the file, the kept
// column's index or -1. nil want keeps every named column.
func (t *Table) keepColumns(want []string, rows int) ([]int, error) {
	pos := make(map[string]int, len(t.Header))
	for i, h := range t.Header {
		if h == "" {
			continue // unnamed columns cannot be asked for, so a repeat is harmless
		}
		if j, dup := pos[h]; dup {
			return nil, &DataError{File: t.File, Line: t.header, Column: h, Text: h, Err: ErrDuplicateHeader,
				Hint: fmt.Sprintf("columns %d and %d share the name; rename one of them", j+1, i+1)}
		}
		pos[h] = i
	}
	if want == nil {
		for _, h := range t.Header {
			if h != "" {
				want = append(want, h)
			}
		}
	}
	t.index = make(map[string]int, len(want))
	slots := make([]int, len(t.Header))
	for i := range slots {
		slots[i] = -1
	}
	for _, w := range want {
		if _, done := t.index[w]; done {
			continue
		}
		i, ok := pos[w]
		if !ok {
			return nil, t.MissingColumn(w)
		}
		t.index[w] = len(t.cols)
		slots[i] = len(t.cols)
		t.cols = append(t.cols, newColumn(w, i, rows, t.decimal != ','))
	}
	return slots, nil
}

func (t *Table) encodingError(line int, col, text string) *DataError {
	return &DataError{File: t.File, Line: line, Column: col, Text: text, Err: ErrEncoding,
		Hint: "save the file as UTF-8"}
}

func (t *Table) fieldCountError(line, width, n int) *DataError {
	hint := fmt.Sprintf("the header has %d %s and this row %d, separated by %s", width, plural(width, "field"), n, commaName(t.Comma))
	if other := sniffComma(t.data, t.quotes, t.Comma); other != t.Comma {
		// The separator was given, and the file looks separated otherwise:
		// quoting is not the fix.
		return &DataError{File: t.File, Line: line, Err: ErrFieldCount,
			Hint: hint + fmt.Sprintf("; the file looks separated by %s: say --format %s", commaName(other), formatName(other))}
	}
	if t.quotes {
		hint += `; quote any cell that holds the separator, as "a` + string(t.Comma) + `b"`
	} else {
		hint += "; a cell may not hold the separator"
	}
	return &DataError{File: t.File, Line: line, Err: ErrFieldCount, Hint: hint}
}

// formatName is the --format value of a separator.
func formatName(c rune) string {
	switch c {
	case ';':
		return "semicolon"
	case '\t':
		return "tsv"
	case '|':
		return "pipe"
	}
	return "csv"
}

func plural(n int, word string) string {
	if n == 1 {
		return word
	}
	return word + "s"
}

// recordError turns encoding/csv's error into a DataError at the right
// line; base is the file's line where the reader started.
func (t *Table) recordError(err error, rec []string, width, base int) error {
	var pe *csv.ParseError
	if !errors.As(err, &pe) {
		return &DataError{File: t.File, Err: err, Hint: "check that the file can be read"}
	}
	start, line := base+pe.StartLine-1, base+pe.Line-1
	switch {
	case errors.Is(pe.Err, csv.ErrFieldCount):
		return t.fieldCountError(start, width, len(rec))
	case errors.Is(pe.Err, csv.ErrBareQuote):
		return &DataError{File: t.File, Line: line, Err: ErrSyntax,
			Hint: `a cell holding a " must be quoted in full, with "" for each " inside`}
	case errors.Is(pe.Err, csv.ErrQuote):
		// The quoted cell started at StartLine; Line may be the end of file.
		return &DataError{File: t.File, Line: start, Err: ErrSyntax,
			Hint: `a quoted cell must end with " before the next separator or line end, with "" for each " inside`}
	}
	return &DataError{File: t.File, Line: start, Err: ErrSyntax, Hint: OneLine(pe.Err.Error())}
}

// MissingColumn builds the error for a column not in the header: it lists
// the columns there are and suggests the closest by edit distance.
func (t *Table) MissingColumn(col string) *DataError {
	return &DataError{File: t.File, Line: t.header, Column: col, Err: ErrMissingColumn,
		Hint: columnHint(col, t.Header)}
}

// maxListed bounds how many column names a hint lists, to keep it one
// readable line for very wide files.
const maxListed = 12

func columnHint(col string, header []string) string {
	var b strings.Builder
	if best, ok := suggest.Closest(col, header); ok {
		fmt.Fprintf(&b, "did you mean %q? ", best)
	}
	names := 0
	for _, h := range header {
		if h != "" {
			names++
		}
	}
	if names == 0 {
		b.WriteString("the header names no columns")
		return b.String()
	}
	b.WriteString("the columns are ")
	listed := 0
	for _, h := range header {
		if h == "" {
			continue
		}
		if listed == maxListed {
			fmt.Fprintf(&b, " and %d more", names-listed)
			break
		}
		if listed > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "%q", h)
		listed++
	}
	return b.String()
}
