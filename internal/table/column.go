package table

import (
	"math"
	"slices"
	"strings"
)

// column is one kept column. A column of a delimited file starts numeric:
// while every cell is a plain decimal or a missing marker, the cells are
// parsed as they are read (fastDecimal) straight into nums and no text is
// kept. The first other cell turns it into text: the cells before are read
// again from their rows and the column stores text from then on, to be
// read by the full number, label or date reader when asked.
type column struct {
	name    string
	field   int // position of the field in a delimited record
	numeric bool
	nums    []float64
	rows    int // the most cells there can be
	markers [len(missingMarkers)]int
	text    *cells // text form; nil while numeric and not asked for text
	num     *Numbers
	numErr  error
}

func newColumn(name string, field, rows int, numeric bool) *column {
	c := &column{name: name, field: field, numeric: numeric, rows: rows}
	if !numeric {
		c.text = newCells(rows)
	}
	return c
}

// addCell appends one cell to c.
func addCell[T ~string | ~[]byte](t *Table, c *column, s T) {
	if c.numeric {
		if v, ok := fastDecimal(s); ok {
			if c.nums == nil {
				c.nums = make([]float64, 0, c.rows)
			}
			c.nums = append(c.nums, v)
			return
		}
		if m := missingMarker(s); m >= 0 {
			if c.nums == nil {
				c.nums = make([]float64, 0, c.rows)
			}
			c.markers[m]++
			c.nums = append(c.nums, math.NaN())
			return
		}
		t.toText(c)
	}
	if b, ok := any(s).([]byte); ok {
		c.text.addBytes(b)
	} else {
		c.text.add(string(s))
	}
}

// toText gives up the numeric form: the cells read so far are read again
// from their rows.
func (t *Table) toText(c *column) {
	t.ensureText(c)
	c.numeric, c.nums = false, nil
	c.markers = [len(missingMarkers)]int{}
}

// ensureText builds the text form of a numeric column from the rows.
func (t *Table) ensureText(c *column) {
	if c.text != nil {
		return
	}
	c.text = newCells(c.rows)
	for r := range len(c.nums) {
		c.text.add(t.rowField(r, c.field))
	}
	if t.complete {
		c.text.done()
	}
}

func (c *column) len() int {
	if c.numeric {
		return len(c.nums)
	}
	return c.text.len()
}

func (c *column) done() {
	if c.text != nil {
		c.text.done()
	}
}

// cells holds the text of one column. It starts dictionary-encoded (a code
// per row into the distinct texts), which stores a label once and lets the
// number and date readers read each distinct text once. A column whose
// cells are mostly distinct (numbers, dates, ids) gains nothing from a
// dictionary, so at every doubling of the row count from 1024 on, a column
// with more distinct texts than half its rows switches to plain text: all
// cells concatenated into one string with the end offset of each.
//
// Neither form holds a pointer per cell. With a []string per column, which
// kept every row's string from the CSV reader alive, the load took 2.9x the
// plain encoding/csv parse, half of it in garbage collection and in growing
// those slices.
type cells struct {
	dict  []string          // distinct texts, while dictionary-encoded
	ids   map[string]uint32 // text -> code, while dictionary-encoded
	codes []uint32          // per row, while dictionary-encoded
	check int               // row count at which to reconsider the dictionary
	rows  int               // the most cells there can be

	plain bool            // switched to the plain form
	buf   strings.Builder // plain form: cells concatenated, until done
	text  string          // plain form after done
	ends  []int           // plain form: end of each cell in text
}

func newCells(rows int) *cells {
	return &cells{ids: map[string]uint32{}, check: 1024, codes: make([]uint32, 0, min(rows, 1024)), rows: rows}
}

// add appends a cell.
func (c *cells) add(s string) {
	if c.plain {
		c.addPlain(s)
		return
	}
	code, ok := c.ids[s]
	if !ok {
		code = c.newCode(strings.Clone(s)) // the reader's string also holds the other fields of its row
	}
	c.addCode(code)
}

// addBytes appends a cell given as bytes; a known label costs no copy.
func (c *cells) addBytes(b []byte) {
	if c.plain {
		if c.buf.Cap()-c.buf.Len() < len(b) {
			c.buf.Grow(max(c.buf.Cap(), len(b), 4096))
		}
		c.buf.Write(b)
		c.ends = append(grow(c.ends), c.buf.Len())
		return
	}
	code, ok := c.ids[string(b)]
	if !ok {
		code = c.newCode(string(b))
	}
	c.addCode(code)
}

func (c *cells) addPlain(s string) {
	if c.buf.Cap()-c.buf.Len() < len(s) {
		c.buf.Grow(max(c.buf.Cap(), len(s), 4096))
	}
	c.buf.WriteString(s)
	c.ends = append(grow(c.ends), c.buf.Len())
}

func (c *cells) newCode(s string) uint32 {
	code := uint32(len(c.dict))
	c.dict = append(c.dict, s)
	c.ids[s] = code
	return code
}

func (c *cells) addCode(code uint32) {
	c.codes = append(grow(c.codes), code)
	if len(c.codes) == c.check {
		c.check *= 2
		if len(c.dict)*2 > len(c.codes) {
			c.toPlain()
		} else if cap(c.codes) < c.rows {
			// Likely to stay a dictionary: make room for every row at once.
			c.codes = slices.Grow(c.codes, c.rows-len(c.codes))
		}
	}
}

// toPlain switches to the plain form.
func (c *cells) toPlain() {
	n := len(c.codes)
	c.ends = make([]int, 0, max(c.rows, n))
	size := 0
	for _, code := range c.codes {
		size += len(c.dict[code])
	}
	if n > 0 {
		c.buf.Grow(size/n*max(c.rows, n)*5/4 + 4096)
	}
	for _, code := range c.codes {
		c.buf.WriteString(c.dict[code])
		c.ends = append(c.ends, c.buf.Len())
	}
	c.dict, c.ids, c.codes = nil, nil, nil
	c.plain = true
}

// done ends adding: the plain text becomes one string, without a copy.
func (c *cells) done() {
	if c.plain {
		c.text = c.buf.String()
		c.buf = strings.Builder{}
	}
	c.ids = nil
}

func (c *cells) len() int {
	if !c.plain {
		return len(c.codes)
	}
	return len(c.ends)
}

func (c *cells) dictionary() bool { return !c.plain }

// cell returns the text of row i.
func (c *cells) cell(i int) string {
	if c.dictionary() {
		return c.dict[c.codes[i]]
	}
	start := 0
	if i > 0 {
		start = c.ends[i-1]
	}
	return c.text[start:c.ends[i]]
}

// strings returns every cell; substrings of one text or dictionary entries,
// so no cell is copied.
func (c *cells) strings() []string {
	out := make([]string, c.len())
	for i := range out {
		out[i] = c.cell(i)
	}
	return out
}

// grow makes room for one more element by doubling. append alone grows
// large slices by about a quarter at a time, and the copying that caused
// was 15% of a profile of the 1M-row load.
func grow[S ~[]E, E any](s S) S {
	if len(s) < cap(s) {
		return s
	}
	return slices.Grow(s, max(len(s), 256))
}

// text returns the text form of a kept column, or nil.
func (t *Table) column(col string) *column {
	if t == nil {
		return nil
	}
	i, ok := t.index[col]
	if !ok {
		return nil
	}
	return t.cols[i]
}

// Strings returns the cells of column col as text, one per row, or nil when
// the column was not kept. Each call returns a new slice; equal labels
// share one string. Missing JSON values (null) read as "".
func (t *Table) Strings(col string) []string {
	c := t.column(col)
	if c == nil {
		return nil
	}
	t.ensureText(c)
	return c.text.strings()
}

// Codes returns column col dictionary-encoded: the distinct texts in order
// of first appearance and, per row, the index of its text. Aggregation
// works on the codes, so a label is compared and hashed once, not once per
// row. It returns nil, nil when the column was not kept.
func (t *Table) Codes(col string) (dict []string, codes []uint32) {
	c := t.column(col)
	if c == nil {
		return nil, nil
	}
	t.ensureText(c)
	if c.text.dictionary() {
		return c.text.dict, c.text.codes
	}
	ids := map[string]uint32{}
	codes = make([]uint32, c.text.len())
	for i := range codes {
		s := c.text.cell(i)
		code, ok := ids[s]
		if !ok {
			code = uint32(len(dict))
			dict = append(dict, s)
			ids[s] = code
		}
		codes[i] = code
	}
	return dict, codes
}
