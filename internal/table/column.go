package table

import (
	"hash/maphash"
	"math"
	"slices"
	"strings"
	"unicode/utf8"
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

// addCell appends one cell to c. It returns false, adding nothing, when
// the cell is not valid UTF-8.
func addCell[T ~string | ~[]byte](t *Table, c *column, s T) bool {
	if c.numeric {
		if v, ok := fastDecimal(s); ok {
			if c.nums == nil {
				c.nums = make([]float64, 0, c.rows)
			}
			c.nums = append(c.nums, v)
			return true
		}
		if m := missingMarker(s); m >= 0 {
			if c.nums == nil {
				c.nums = make([]float64, 0, c.rows)
			}
			c.markers[m]++
			c.nums = append(c.nums, math.NaN())
			return true
		}
		t.toText(c)
	}
	if b, ok := any(s).([]byte); ok {
		return c.text.addBytes(b)
	}
	return c.text.add(string(s))
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
// dictionary, so at every doubling of the row count from 8192 on, a column
// with more distinct texts than half its rows switches to plain text: all
// cells concatenated into one string with the end offset of each.
//
// Neither form holds a pointer per cell. With a []string per column, which
// kept every row's string from the CSV reader alive, the load took 2.9x the
// plain encoding/csv parse, half of it in garbage collection and in growing
// those slices.
type cells struct {
	dict  []string // distinct texts, while dictionary-encoded
	ids   codeTable
	codes []uint32 // per row, while dictionary-encoded
	check int      // row count at which to reconsider the dictionary
	rows  int      // the most cells there can be

	plain bool            // switched to the plain form
	buf   strings.Builder // plain form: cells concatenated, until done
	text  string          // plain form after done
	ends  []int           // plain form: end of each cell in text
}

func newCells(rows int) *cells {
	return &cells{ids: newCodeTable(), check: 8192, codes: make([]uint32, 0, min(rows, 8192)), rows: rows}
}

// add appends a cell; it returns false, adding nothing, when s is not
// valid UTF-8. A label is checked once, when first seen.
func (c *cells) add(s string) bool {
	if c.plain {
		if !utf8.ValidString(s) {
			return false
		}
		c.addPlain(s)
		return true
	}
	h := maphash.String(c.ids.seed, s)
	code, ok := findCode(&c.ids, h, c.dict, s)
	if !ok {
		if !utf8.ValidString(s) {
			return false
		}
		code = c.newCode(strings.Clone(s), h) // the reader's string also holds the other fields of its row
	}
	c.addCode(code)
	return true
}

// addBytes appends a cell given as bytes; a known label costs no copy.
// It returns false, adding nothing, when b is not valid UTF-8.
func (c *cells) addBytes(b []byte) bool {
	if c.plain {
		if !utf8.Valid(b) {
			return false
		}
		if c.buf.Cap()-c.buf.Len() < len(b) {
			c.buf.Grow(max(c.buf.Cap(), len(b), 4096))
		}
		c.buf.Write(b)
		c.ends = append(grow(c.ends), c.buf.Len())
		return true
	}
	h := maphash.Bytes(c.ids.seed, b)
	code, ok := findCode(&c.ids, h, c.dict, b)
	if !ok {
		if !utf8.Valid(b) {
			return false
		}
		code = c.newCode(string(b), h)
	}
	c.addCode(code)
	return true
}

func (c *cells) addPlain(s string) {
	if c.buf.Cap()-c.buf.Len() < len(s) {
		c.buf.Grow(max(c.buf.Cap(), len(s), 4096))
	}
	c.buf.WriteString(s)
	c.ends = append(grow(c.ends), c.buf.Len())
}

func (c *cells) newCode(s string, h uint64) uint32 {
	code := uint32(len(c.dict))
	c.dict = append(c.dict, s)
	c.ids.insert(h, code, c.dict)
	return code
}

// codeTable maps a label's text to its code: open addressing with linear
// probing over maphash values, comparing the bytes with the dictionary.
// It looks a []byte cell up without converting it, and took the bars
// benchmark's dictionary lookups from 21% of the time to about 10%
// compared with a map[string]uint32.
type codeTable struct {
	seed  maphash.Seed
	slots []uint32 // code+1, or 0 for an empty slot
	n     int
}

func newCodeTable() codeTable {
	return codeTable{seed: maphash.MakeSeed(), slots: make([]uint32, 64)}
}

// findCode returns the code of key, whose hash is h.
func findCode[T ~string | ~[]byte](t *codeTable, h uint64, dict []string, key T) (uint32, bool) {
	mask := uint64(len(t.slots) - 1)
	for i := h & mask; ; i = (i + 1) & mask {
		v := t.slots[i]
		if v == 0 {
			return 0, false
		}
		if d := dict[v-1]; len(d) == len(key) && d == string(key) {
			return v - 1, true
		}
	}
}

// insert adds a new code, growing the table past half full.
func (t *codeTable) insert(h uint64, code uint32, dict []string) {
	if (t.n+1)*2 > len(t.slots) {
		old := t.slots
		t.slots = make([]uint32, 2*len(old))
		t.n = 0
		for _, v := range old {
			if v != 0 {
				t.put(maphash.String(t.seed, dict[v-1]), v)
			}
		}
	}
	t.put(h, code+1)
}

func (t *codeTable) put(h uint64, v uint32) {
	mask := uint64(len(t.slots) - 1)
	i := h & mask
	for t.slots[i] != 0 {
		i = (i + 1) & mask
	}
	t.slots[i] = v
	t.n++
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
	c.dict, c.ids, c.codes = nil, codeTable{}, nil
	c.plain = true
}

// done ends adding: the plain text becomes one string, without a copy.
func (c *cells) done() {
	if c.plain {
		c.text = c.buf.String()
		c.buf = strings.Builder{}
	}
	c.ids = codeTable{}
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

// Has reports whether column col was kept, without reading its cells.
func (t *Table) Has(col string) bool { return t.column(col) != nil }
