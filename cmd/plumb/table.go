package main

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"unicode/utf8"

	"plumb/internal/suggest"
)

// Causes of a DataError, for errors.Is. Each names what is wrong with the
// input; the DataError around it says where and how to fix it.
var (
	ErrBadNumber       = errors.New("not a number")
	ErrMissingColumn   = errors.New("no such column")
	ErrEmpty           = errors.New("no data rows")
	ErrEncoding        = errors.New("not valid UTF-8")
	ErrNotFinite       = errors.New("not a finite number")
	ErrDuplicateHeader = errors.New("duplicate column name")
	ErrFieldCount      = errors.New("wrong number of fields")
	ErrSyntax          = errors.New("cannot be parsed")
	ErrFormat          = errors.New("unknown data format")
)

// DataError points at the input: file, 1-based line in the file (header =
// line 1; for JSON the line where the object or value starts), column name,
// offending text, and a fix. Its message is one line, so that a shell user
// sees the whole story without scrolling.
type DataError struct {
	File   string // as given; "-" shown as "standard input"
	Line   int    // 0 when not about one line
	Column string // "" when not about one column
	Text   string // the offending cell text, "" if none
	Err    error  // one of the Err* causes above, or a read error
	Hint   string // what would fix it, one clause
}

// Error reads as one sentence, for example
// `sales.csv: line 7, column "revenue": cannot read "12,3x" as a number; write digits with "." for decimals, or leave the cell empty to skip the row`.
func (e *DataError) Error() string {
	var b strings.Builder
	b.WriteString(displayName(e.File))
	sep := ": "
	if e.Line > 0 {
		fmt.Fprintf(&b, "%sline %d", sep, e.Line)
		sep = ", "
	}
	if e.Column != "" || errors.Is(e.Err, ErrMissingColumn) {
		fmt.Fprintf(&b, "%scolumn %q", sep, e.Column)
	}
	b.WriteString(": ")
	b.WriteString(e.what())
	if e.Hint != "" {
		b.WriteString("; ")
		b.WriteString(oneLine(e.Hint))
	}
	return b.String()
}

// what says what is wrong, in words built around the offending text.
func (e *DataError) what() string {
	switch {
	case e.Err == nil:
		return "unknown error"
	case errors.Is(e.Err, ErrBadNumber):
		return fmt.Sprintf("cannot read %q as a number", e.Text)
	case errors.Is(e.Err, ErrNotFinite):
		return fmt.Sprintf("%q is not a finite number", e.Text)
	case errors.Is(e.Err, ErrMissingColumn):
		return "there is no such column"
	case errors.Is(e.Err, ErrEmpty):
		return "there are no data rows"
	case errors.Is(e.Err, ErrEncoding):
		if e.Text != "" {
			return fmt.Sprintf("the text %q is not valid UTF-8", e.Text)
		}
		return "the text is not valid UTF-8"
	case errors.Is(e.Err, ErrDuplicateHeader):
		return "the header uses this column name more than once"
	case errors.Is(e.Err, ErrFieldCount):
		return "the row has a different number of fields than the header"
	case errors.Is(e.Err, ErrSyntax):
		if e.Text != "" {
			return fmt.Sprintf("cannot parse the file at %q", e.Text)
		}
		return "cannot parse the file"
	case errors.Is(e.Err, ErrFormat):
		if e.Text != "" {
			return fmt.Sprintf("unknown data format %q", e.Text)
		}
		return "cannot tell the data format from the name"
	}
	return oneLine(e.Err.Error())
}

// Unwrap returns the cause, so that errors.Is(err, ErrBadNumber) works.
func (e *DataError) Unwrap() error { return e.Err }

// displayName is how a file is named in messages.
func displayName(file string) string {
	switch file {
	case "-":
		return "standard input"
	case "":
		return "input"
	}
	return oneLine(file)
}

// oneLine keeps a message on one line even when a name or cause holds a line
// break, so that a message is always exactly one line on a terminal.
func oneLine(s string) string {
	if !strings.ContainsAny(s, "\r\n") {
		return s
	}
	q := strconv.Quote(s)
	return q[1 : len(q)-1]
}

// Table is a data file read into memory: only the columns asked for, as
// text, with each row's line number in the file. Parse a column with Numbers.
type Table struct {
	// File is the name the data was read from, as given to ReadTable.
	File string
	// Header lists every column name of the file: for CSV and TSV in file
	// order, trimmed of surrounding spaces; for JSON every key, in order of
	// first appearance.
	Header []string

	index     map[string]int // kept column name -> position in cols
	cols      []*column      // the kept columns
	lines     []int32        // line where each row starts
	cellLines [][]int32      // per kept column, line of each cell; nil while every cell sits on its row's line
	rows      int
	header    int // line of the header; 0 for JSON
}

// maxLine caps line numbers so that they fit the int32 bookkeeping; files
// beyond two billion lines are reported at the cap rather than wrapping.
const maxLine = math.MaxInt32

// ReadTable reads a data file: CSV (RFC 4180, with a header row), TSV (the
// IANA text/tab-separated-values form: a header row, tab-separated fields,
// no quoting) or JSON (an array of objects whose values are numbers,
// strings, booleans or null). format "" means from the name's extension
// (.csv .tsv .json); for "-" or another name it is an error that asks for
// --format. The input is UTF-8, with or without a byte order mark.
//
// Only the columns named in want are kept; nil keeps them all. Header names
// are matched after trimming surrounding spaces. Every error is a
// *DataError naming the file, the line and what would fix it.
func ReadTable(r io.Reader, file, format string, want []string) (*Table, error) {
	format = strings.ToLower(strings.TrimPrefix(format, "."))
	switch format {
	case "", "csv", "tsv", "json":
	default:
		return nil, &DataError{File: file, Err: ErrFormat, Text: format,
			Hint: "use --format csv, --format tsv or --format json"}
	}
	if format == "" {
		format = strings.ToLower(strings.TrimPrefix(filepath.Ext(file), "."))
		if file == "-" || file == "" {
			return nil, &DataError{File: file, Err: ErrFormat,
				Hint: "say which with --format csv, --format tsv or --format json"}
		}
		if format != "csv" && format != "tsv" && format != "json" {
			return nil, &DataError{File: file, Err: ErrFormat,
				Hint: "name the file .csv, .tsv or .json, or say which with --format csv|tsv|json"}
		}
	}
	// Reading everything first costs a copy but tells how many rows there
	// can be (one per line feed), so every column is allocated once instead
	// of grown, and lets one utf8.Valid pass over the whole input replace
	// a check per cell (which cost 5% of the load in a profile).
	data, err := readAll(r)
	if err != nil {
		return nil, &DataError{File: file, Err: err, Hint: "check that the file can be read"}
	}
	data, err = skipBOM(data, file)
	if err != nil {
		return nil, err
	}
	t := &Table{File: file}
	in := input{data: data, rows: bytes.Count(data, []byte("\n")) + 1, valid: utf8.Valid(data)}
	switch format {
	case "csv":
		cr := csv.NewReader(bytes.NewReader(data))
		cr.ReuseRecord = true
		err = t.readRecords(&csvSource{r: cr}, in, want)
	case "tsv":
		err = t.readRecords(&tsvSource{r: bufio.NewReader(bytes.NewReader(data))}, in, want)
	case "json":
		err = t.readJSON(in, want)
	}
	if err != nil {
		return nil, err
	}
	return t, nil
}

// readAll is io.ReadAll sized up front when the reader knows its length
// (a file, or bytes in memory), as os.ReadFile does.
func readAll(r io.Reader) ([]byte, error) {
	size := 0
	switch v := r.(type) {
	case interface{ Len() int }:
		size = v.Len()
	case interface{ Stat() (fs.FileInfo, error) }:
		if fi, err := v.Stat(); err == nil && fi.Mode().IsRegular() {
			size = int(min(fi.Size(), math.MaxInt32)) // only a hint: larger inputs grow as they are read
		}
	}
	buf := bytes.NewBuffer(make([]byte, 0, size+bytes.MinRead))
	_, err := buf.ReadFrom(r)
	return buf.Bytes(), err
}

// input is a whole data file in memory, with what a first pass learned.
type input struct {
	data  []byte
	rows  int  // at most this many records: one per line feed, plus one
	valid bool // the whole input is valid UTF-8
}

// skipBOM drops a UTF-8 byte order mark and refuses the UTF-16 and UTF-32
// ones, which would otherwise read as garbled header names.
func skipBOM(data []byte, file string) ([]byte, error) {
	switch {
	case bytes.HasPrefix(data, []byte("\xEF\xBB\xBF")):
		return data[3:], nil
	case bytes.HasPrefix(data, []byte("\x00\x00\xFE\xFF")), bytes.HasPrefix(data, []byte("\xFF\xFE\x00\x00")):
		return nil, &DataError{File: file, Line: 1, Err: ErrEncoding, Hint: "the file looks like UTF-32; save it as UTF-8"}
	case bytes.HasPrefix(data, []byte("\xFE\xFF")), bytes.HasPrefix(data, []byte("\xFF\xFE")):
		return nil, &DataError{File: file, Line: 1, Err: ErrEncoding, Hint: "the file looks like UTF-16; save it as UTF-8"}
	}
	return data, nil
}

// Len returns the number of data rows.
func (t *Table) Len() int {
	if t == nil {
		return 0
	}
	return t.rows
}

// Line returns the line in the file where data row row (0-based) starts, or
// 0 when there is no such row.
func (t *Table) Line(row int) int {
	if t == nil || row < 0 || row >= len(t.lines) {
		return 0
	}
	return int(t.lines[row])
}

// Strings returns the cells of column col as text, one per row, or nil when
// the column was not kept. Each call returns a new slice; equal labels
// share one string. Missing JSON values (null) read as "".
func (t *Table) Strings(col string) []string {
	if t == nil {
		return nil
	}
	c, ok := t.index[col]
	if !ok {
		return nil
	}
	return t.cols[c].strings()
}

// Numbers parses column col as numbers, one per row. Missing cells (empty,
// "NA", "NaN", "null" or "N/A" in any case, and JSON null) are not errors:
// their rows are listed in missing, in increasing order, and hold NaN in
// vals so that vals stays aligned with the rows. Numbers are plain decimals
// with an optional sign, fraction and exponent, and surrounding spaces;
// anything else is an ErrBadNumber, and an infinite value (such as "Inf" or
// "1e999") is an ErrNotFinite, each pointing at the cell.
func (t *Table) Numbers(col string) (vals []float64, missing []int, err error) {
	if t == nil {
		return nil, nil, &DataError{Column: col, Err: ErrMissingColumn}
	}
	c, ok := t.index[col]
	if !ok {
		return nil, nil, t.missingColumn(col, t.header)
	}
	cl := t.cols[c]
	vals = make([]float64, cl.len())
	bad := func(i int, kind numberKind) error {
		text := cl.cell(i)
		if kind == numberInfinite {
			return &DataError{File: t.File, Line: t.cellLine(c, i), Column: col, Text: text,
				Err: ErrNotFinite, Hint: "write a finite number, or leave the cell empty to skip the row"}
		}
		return &DataError{File: t.File, Line: t.cellLine(c, i), Column: col, Text: text,
			Err: ErrBadNumber, Hint: numberHint(text)}
	}
	if cl.dict != nil {
		// A dictionary column parses each distinct text once.
		dv := make([]float64, len(cl.dict))
		dk := make([]numberKind, len(cl.dict))
		for j, s := range cl.dict {
			dv[j], dk[j] = parseNumber(s)
		}
		for i, code := range cl.codes {
			switch dk[code] {
			case numberOK:
				vals[i] = dv[code]
			case numberMissing:
				vals[i] = math.NaN()
				missing = append(missing, i)
			default:
				return nil, nil, bad(i, dk[code])
			}
		}
	} else {
		start := 0
		for i, end := range cl.ends {
			v, kind := parseNumber(cl.text[start:end])
			start = end
			switch kind {
			case numberOK:
				vals[i] = v
			case numberMissing:
				vals[i] = math.NaN()
				missing = append(missing, i)
			default:
				return nil, nil, bad(i, kind)
			}
		}
	}
	return vals, missing, nil
}

// cellLine is the line where cell (c, row) starts.
func (t *Table) cellLine(c, row int) int {
	if t.cellLines != nil {
		return int(t.cellLines[c][row])
	}
	return int(t.lines[row])
}

// numberKind classifies one cell.
type numberKind uint8

const (
	numberOK numberKind = iota
	numberMissing
	numberInfinite
	numberBad
)

// parseNumber reads one cell. The fast path checks the bytes before calling
// strconv.ParseFloat, because ParseFloat also takes forms a data file should
// not use silently ("Inf", "0x1p3", "1_000").
func parseNumber(s string) (float64, numberKind) {
	if v, ok := fastDecimal(s); ok {
		return v, numberOK
	}
	if plainNumber(s) {
		v, err := strconv.ParseFloat(s, 64)
		switch {
		case err == nil:
			return v, numberOK
		case math.IsInf(v, 0):
			return 0, numberInfinite
		}
		return 0, numberBad
	}
	trimmed := strings.TrimSpace(s)
	if len(trimmed) != len(s) && plainNumber(trimmed) {
		return parseNumber(trimmed)
	}
	if isMissing(trimmed) {
		return 0, numberMissing
	}
	if isInfinity(trimmed) {
		return 0, numberInfinite
	}
	return 0, numberBad
}

// pow10 holds the powers of ten that a float64 represents exactly.
var pow10 = [...]float64{1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10,
	1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22}

// fastDecimal reads the common cell, a plain decimal such as -1234.56, by
// Clinger's fast path (Clinger 1990): when the digits form an integer of at
// most 2^53 and there are at most 22 decimals, both the integer and the
// power of ten are exact float64 values, so one correctly rounded division
// gives the correctly rounded result, the same as strconv.ParseFloat. It
// declines everything else (exponents, long mantissas), which goes to
// ParseFloat. It took BenchmarkNumbers from 40 ms to 15 ms.
func fastDecimal(s string) (float64, bool) {
	i := 0
	neg := false
	if len(s) > 0 && (s[0] == '-' || s[0] == '+') {
		neg = s[0] == '-'
		i = 1
	}
	var mant uint64
	digits, frac := 0, 0
	dot := false
	for ; i < len(s); i++ {
		c := s[i]
		switch {
		case c >= '0' && c <= '9':
			if digits == 19 {
				return 0, false // mant could overflow uint64
			}
			mant = mant*10 + uint64(c-'0')
			digits++
			if dot {
				frac++
			}
		case c == '.' && !dot:
			dot = true
		default:
			return 0, false
		}
	}
	if digits == 0 || mant > 1<<53 || frac >= len(pow10) {
		return 0, false
	}
	f := float64(mant) / pow10[frac]
	if neg {
		f = -f
	}
	return f, true
}

// plainNumber reports whether s holds only a sign, digits, a point and an
// exponent: the characters of a plain decimal number.
func plainNumber(s string) bool {
	if s == "" {
		return false
	}
	for i := 0; i < len(s); i++ {
		switch c := s[i]; {
		case c >= '0' && c <= '9', c == '.', c == '-', c == '+', c == 'e', c == 'E':
		default:
			return false
		}
	}
	return true
}

// isMissing reports whether a trimmed cell marks a missing value.
func isMissing(s string) bool {
	switch len(s) {
	case 0:
		return true
	case 2:
		return strings.EqualFold(s, "NA")
	case 3:
		return strings.EqualFold(s, "NaN") || strings.EqualFold(s, "N/A")
	case 4:
		return strings.EqualFold(s, "null")
	}
	return false
}

// isInfinity reports whether a trimmed cell spells an infinity.
func isInfinity(s string) bool {
	s = strings.TrimLeft(s, "+-")
	return strings.EqualFold(s, "inf") || strings.EqualFold(s, "infinity") || s == "∞"
}

// numberHint says how to fix a cell that is not a number, recognising the
// usual culprits: digit grouping, a decimal comma, and units or symbols.
func numberHint(s string) string {
	t := strings.TrimSpace(s)
	switch {
	case isGrouped(t):
		return "remove the thousands separators (write 1234567, not 1,234,567)"
	case isDecimalComma(t):
		return `write the decimal point as "." (12.5, not 12,5)`
	}
	if num, sym, ok := splitUnit(t); ok {
		return fmt.Sprintf("write only the number (%s) and say %q in the title or the unit", num, sym)
	}
	return `write digits with "." for decimals, or leave the cell empty to skip the row`
}

// isGrouped matches numbers whose digits are grouped in threes by ",", "_",
// "'" or a space, such as 1,234,567.5.
func isGrouped(s string) bool {
	s = strings.TrimLeft(s, "+-")
	intPart, frac, _ := strings.Cut(s, ".")
	if frac != "" && !allDigits(frac) {
		return false
	}
	for _, sep := range []string{",", "_", "'", " ", "\u00a0", "\u202f"} {
		groups := strings.Split(intPart, sep)
		if len(groups) < 2 || len(groups[0]) == 0 || len(groups[0]) > 3 || !allDigits(groups[0]) {
			continue
		}
		ok := true
		for _, g := range groups[1:] {
			if len(g) != 3 || !allDigits(g) {
				ok = false
				break
			}
		}
		if ok {
			return true
		}
	}
	return false
}

// isDecimalComma matches 12,5 and -0,25: one comma between digits.
func isDecimalComma(s string) bool {
	s = strings.TrimLeft(s, "+-")
	a, b, ok := strings.Cut(s, ",")
	return ok && allDigits(b) && b != "" && (a == "" || allDigits(a))
}

// splitUnit splits "12%" or "$12" into the number and the symbol.
func splitUnit(s string) (num, sym string, ok bool) {
	start := strings.IndexAny(s, "+-.0123456789")
	if start < 0 {
		return "", "", false
	}
	end := start
	for end < len(s) && strings.IndexByte("+-.0123456789eE", s[end]) >= 0 {
		end++
	}
	num = s[start:end]
	sym = strings.TrimSpace(s[:start] + s[end:])
	if sym == "" || strings.ContainsAny(sym, "0123456789.,") || !plainNumber(num) || (start > 0 && end < len(s)) {
		return "", "", false
	}
	if _, err := strconv.ParseFloat(num, 64); err != nil {
		return "", "", false
	}
	return num, sym, true
}

func allDigits(s string) bool {
	for i := 0; i < len(s); i++ {
		if s[i] < '0' || s[i] > '9' {
			return false
		}
	}
	return true
}

// missingColumn builds the error for a column not in the header: it lists
// the columns there are and suggests the closest by edit distance.
func (t *Table) missingColumn(col string, line int) *DataError {
	return &DataError{File: t.File, Line: line, Column: col, Err: ErrMissingColumn,
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

// recordSource yields the records of a delimited text file, one []string
// per row, valid until the next call, and io.EOF after the last.
type recordSource interface {
	next() ([]string, error)
	// fieldLine is the line where field i of the last record starts.
	fieldLine(i int) int
}

// csvSource reads RFC 4180 CSV with encoding/csv, which already tracks the
// line of every field, so that a quoted cell spanning lines keeps the
// following rows' line numbers right.
type csvSource struct{ r *csv.Reader }

func (s *csvSource) next() ([]string, error) { return s.r.Read() }

func (s *csvSource) fieldLine(i int) int {
	line, _ := s.r.FieldPos(i)
	return line
}

// tsvSource reads tab-separated values as registered with IANA
// (text/tab-separated-values): one record per line, fields split at tabs,
// no quoting, so a quote character is just text. Blank lines are skipped,
// as encoding/csv does for CSV.
type tsvSource struct {
	r    *bufio.Reader
	rec  []string
	read int // lines consumed so far
	line int // line of the last record
	err  error
}

func (s *tsvSource) next() ([]string, error) {
	for {
		if s.err != nil {
			return nil, s.err
		}
		text, err := s.r.ReadString('\n')
		if err != nil {
			s.err = err
			if text == "" {
				return nil, err
			}
		}
		s.read++
		text = strings.TrimSuffix(strings.TrimSuffix(text, "\n"), "\r")
		if text == "" {
			continue
		}
		s.line = s.read
		s.rec = s.rec[:0]
		for {
			i := strings.IndexByte(text, '\t')
			if i < 0 {
				break
			}
			s.rec = append(s.rec, text[:i])
			text = text[i+1:]
		}
		s.rec = append(s.rec, text)
		return s.rec, nil
	}
}

func (s *tsvSource) fieldLine(int) int { return s.line }

// column holds the cells of one kept column. It starts dictionary-encoded
// (a code per row into the distinct texts), which stores a label once and
// lets Numbers parse each distinct text once. A column whose cells are
// mostly distinct (numbers, ids) gains nothing from a dictionary, so at every
// doubling of the row count from 1024 on, a column with more distinct texts
// than half its rows switches to plain text: all cells concatenated into one
// string with the end offset of each.
//
// Neither form holds a pointer per cell. With a []string per column, which
// kept every row's string from the CSV reader alive, BenchmarkLoadAggregate
// took 2.9x BenchmarkParseOnly, half of it in garbage collection and in
// growing those slices; this form, with the sizing done in ReadTable, brings
// it to about 1.6x.
type column struct {
	dict  []string          // distinct texts, while dictionary-encoded
	ids   map[string]uint32 // text -> code, while dictionary-encoded
	codes []uint32          // per row, while dictionary-encoded
	check int               // row count at which to reconsider the dictionary
	rows  int               // the most cells there can be

	buf  strings.Builder // plain form: cells concatenated, until done
	text string          // plain form after done
	ends []int           // plain form: end of each cell in text
}

// newColumn starts a column for up to rows cells.
func newColumn(rows int) *column {
	return &column{ids: map[string]uint32{}, check: 1024, codes: make([]uint32, 0, min(rows, 1024)), rows: rows}
}

// add appends a cell.
func (c *column) add(s string) {
	if c.ids == nil {
		if c.buf.Cap()-c.buf.Len() < len(s) {
			c.buf.Grow(max(c.buf.Cap(), len(s), 4096))
		}
		c.buf.WriteString(s)
		c.ends = append(grow(c.ends), c.buf.Len())
		return
	}
	code, ok := c.ids[s]
	if !ok {
		code = uint32(len(c.dict))
		s = strings.Clone(s) // the reader's string also holds the other fields of its row
		c.dict = append(c.dict, s)
		c.ids[s] = code
	}
	c.codes = append(grow(c.codes), code)
	if len(c.codes) == c.check {
		c.check *= 2
		if len(c.dict)*2 > len(c.codes) {
			c.toText()
		} else if cap(c.codes) < c.rows {
			// Likely to stay a dictionary: make room for every row at once.
			c.codes = slices.Grow(c.codes, c.rows-len(c.codes))
		}
	}
}

// toText switches to the plain form.
func (c *column) toText() {
	n := len(c.codes)
	c.ends = make([]int, 0, max(c.rows, n))
	// Size the text from the cells so far, with a margin, so that it is
	// rarely grown.
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
}

// done ends adding: the plain text becomes one string, without a copy.
func (c *column) done() {
	c.ids = nil
	if c.dict == nil {
		c.text = c.buf.String()
		c.buf = strings.Builder{}
	}
}

func (c *column) len() int {
	if c.dict != nil {
		return len(c.codes)
	}
	return len(c.ends)
}

// cell returns the text of row i.
func (c *column) cell(i int) string {
	if c.dict != nil {
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
func (c *column) strings() []string {
	out := make([]string, c.len())
	if c.dict != nil {
		for i, code := range c.codes {
			out[i] = c.dict[code]
		}
		return out
	}
	start := 0
	for i, end := range c.ends {
		out[i] = c.text[start:end]
		start = end
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

// clampLine converts a line number to the stored width.
func clampLine(n int) int32 {
	return int32(min(n, maxLine))
}

// readRecords fills the table from a CSV or TSV source.
func (t *Table) readRecords(src recordSource, in input, want []string) error {
	hdr, err := src.next()
	if err == io.EOF {
		return &DataError{File: t.File, Err: ErrEmpty,
			Hint: "the file is empty; it needs a header row and at least one data row"}
	}
	if err != nil {
		return t.recordError(err, hdr, 0)
	}
	t.header = src.fieldLine(0)
	t.Header = make([]string, len(hdr))
	for i, h := range hdr {
		if !utf8.ValidString(h) {
			return t.encodingError(src.fieldLine(i), "", h)
		}
		t.Header[i] = strings.TrimSpace(h)
	}
	// A record of n fields takes at least n bytes, which bounds the rows
	// of a wide file more tightly than its line feeds do.
	kept, err := t.keepColumns(want, min(in.rows, len(in.data)/max(len(hdr), 1)+1))
	if err != nil {
		return err
	}
	width := len(hdr)
	rowLines := make([]int32, len(kept))
	for {
		rec, err := src.next()
		if err == io.EOF {
			break
		}
		if err != nil {
			return t.recordError(err, rec, width)
		}
		line := src.fieldLine(0)
		if len(rec) != width {
			return t.fieldCountError(line, width, len(rec))
		}
		if !in.valid {
			for i, f := range rec {
				if !utf8.ValidString(f) {
					return t.encodingError(src.fieldLine(i), t.Header[i], f)
				}
			}
		}
		for slot, i := range kept {
			t.cols[slot].add(rec[i])
		}
		// Fields start on non-decreasing lines, so when the last starts on
		// the row's first line, every kept cell does.
		spans := src.fieldLine(len(rec)-1) != line
		if spans || t.cellLines != nil {
			for slot, i := range kept {
				rowLines[slot] = clampLine(src.fieldLine(i))
			}
		}
		t.addRow(clampLine(line), rowLines, spans)
	}
	if t.rows == 0 {
		return &DataError{File: t.File, Err: ErrEmpty,
			Hint: "the file has a header but no data; add rows below the header"}
	}
	for _, c := range t.cols {
		c.done()
	}
	return nil
}

// addRow records a row's line and, only once some cell starts on a later
// line than its row (a quoted CSV cell with a line break, or JSON spread
// over lines), the line of every cell.
func (t *Table) addRow(line int32, cellLines []int32, spans bool) {
	if spans && t.cellLines == nil {
		t.cellLines = make([][]int32, len(t.cols))
		for c := range t.cellLines {
			t.cellLines[c] = append(make([]int32, 0, len(t.lines)+1), t.lines...)
		}
	}
	if t.cellLines != nil {
		for c := range t.cellLines {
			t.cellLines[c] = append(grow(t.cellLines[c]), cellLines[c])
		}
	}
	t.lines = append(grow(t.lines), line)
	t.rows++
}

// keepColumns checks the header for repeated names and maps the wanted
// columns to file positions, in the order asked for. nil want keeps every
// named column.
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
	var kept []int
	for _, w := range want {
		if _, done := t.index[w]; done {
			continue
		}
		i, ok := pos[w]
		if !ok {
			return nil, t.missingColumn(w, t.header)
		}
		t.index[w] = len(kept)
		kept = append(kept, i)
	}
	t.cols = make([]*column, len(kept))
	for i := range t.cols {
		t.cols[i] = newColumn(rows)
	}
	t.lines = make([]int32, 0, rows)
	return kept, nil
}

func (t *Table) encodingError(line int, col, text string) *DataError {
	return &DataError{File: t.File, Line: line, Column: col, Text: text, Err: ErrEncoding,
		Hint: "save the file as UTF-8"}
}

func (t *Table) fieldCountError(line, width, n int) *DataError {
	return &DataError{File: t.File, Line: line, Err: ErrFieldCount,
		Hint: fmt.Sprintf("the header has %d fields and this row %d, so quote any cell that holds the separator", width, n)}
}

// recordError turns a reader's error into a DataError at the right line.
func (t *Table) recordError(err error, rec []string, width int) error {
	var pe *csv.ParseError
	if !errors.As(err, &pe) {
		return &DataError{File: t.File, Err: err, Hint: "check that the file can be read"}
	}
	switch {
	case errors.Is(pe.Err, csv.ErrFieldCount):
		return t.fieldCountError(pe.StartLine, width, len(rec))
	case errors.Is(pe.Err, csv.ErrBareQuote):
		return &DataError{File: t.File, Line: pe.Line, Err: ErrSyntax,
			Hint: `a cell holding a " must be quoted in full, with "" for each " inside`}
	case errors.Is(pe.Err, csv.ErrQuote):
		// The quoted cell started at StartLine; Line may be the end of file.
		return &DataError{File: t.File, Line: pe.StartLine, Err: ErrSyntax,
			Hint: `a quoted cell must end with " before the next comma or line end, with "" for each " inside`}
	}
	return &DataError{File: t.File, Line: pe.StartLine, Err: ErrSyntax, Hint: oneLine(pe.Err.Error())}
}

// jsonHint says what shape a JSON data file must have.
const jsonHint = `the file must be a JSON array of objects, such as [{"route": "North", "passengers": 120}]`

// readJSON fills the table from an array of objects. encoding/json does not
// report lines, so the whole input is kept and each object's and value's
// byte offset (Decoder.InputOffset, then past white space, commas and
// colons) is turned into a line by counting line feeds incrementally.
func (t *Table) readJSON(in input, want []string) error {
	data := in.data
	// encoding/json would silently replace invalid UTF-8, so check first.
	if !in.valid {
		off := firstInvalid(data)
		return t.encodingError(1+bytes.Count(data[:off], []byte("\n")), "", lineAround(data, off))
	}
	p := &jsonReader{t: t, data: data, dec: json.NewDecoder(bytes.NewReader(data)), keys: map[string]int{}}
	p.dec.UseNumber()
	if want != nil {
		p.want = make(map[string]bool, len(want))
		for _, w := range want {
			p.want[w] = true
		}
	}
	t.index = map[string]int{}
	if err := p.read(); err != nil {
		return err
	}
	for _, w := range want {
		if _, ok := t.index[w]; !ok {
			return t.missingColumn(w, 0)
		}
	}
	if t.rows == 0 {
		return &DataError{File: t.File, Line: 1, Err: ErrEmpty, Hint: "the array holds no objects; " + jsonHint}
	}
	for _, c := range t.cols {
		c.done()
	}
	return nil
}

// jsonReader is the state of reading one JSON array of objects.
type jsonReader struct {
	t       *Table
	data    []byte
	dec     *json.Decoder
	want    map[string]bool // nil keeps every key
	keys    map[string]int  // key -> header position
	slots   []int           // header position -> kept column, or -1
	lastRow []int           // header position -> last row that named it, to catch repeats
	rowText []string        // per kept column, the value in the current object
	rowLine []int32         // per kept column, the line of that value
	rowSet  []bool          // per kept column, whether the current object has it
	off     int             // lines are counted up to off
	lines   int             // line feeds before off
}

// lineAt is the 1-based line of byte offset off. Offsets only grow while
// reading, so the count is incremental and linear overall.
func (p *jsonReader) lineAt(off int) int {
	off = min(max(off, 0), len(p.data))
	if off < p.off {
		p.off, p.lines = 0, 0
	}
	p.lines += bytes.Count(p.data[p.off:off], []byte("\n"))
	p.off = off
	return min(p.lines+1, maxLine)
}

// nextStart skips from the decoder's position to the start of the next
// token: past white space and the ',' or ':' that Token consumes lazily.
func (p *jsonReader) nextStart() int {
	off := int(p.dec.InputOffset())
	for off < len(p.data) {
		switch p.data[off] {
		case ' ', '\t', '\r', '\n', ',', ':':
			off++
			continue
		}
		break
	}
	return off
}

func (p *jsonReader) read() error {
	first := p.nextStart()
	tok, err := p.dec.Token()
	if err == io.EOF {
		return &DataError{File: p.t.File, Err: ErrEmpty, Hint: "the file is empty; " + jsonHint}
	}
	if err != nil {
		return p.syntaxError(err)
	}
	if tok != json.Delim('[') {
		return &DataError{File: p.t.File, Line: p.lineAt(first), Text: tokenText(tok), Err: ErrSyntax, Hint: jsonHint}
	}
	for p.dec.More() {
		if err := p.readObject(); err != nil {
			return err
		}
	}
	if _, err := p.dec.Token(); err != nil { // the closing ]
		return p.syntaxError(err)
	}
	if _, err := p.dec.Token(); err != io.EOF {
		at := p.nextStart()
		return &DataError{File: p.t.File, Line: p.lineAt(at), Text: lineAround(p.data, at), Err: ErrSyntax,
			Hint: "remove what follows the closing ]; " + jsonHint}
	}
	return nil
}

func (p *jsonReader) readObject() error {
	t := p.t
	start := p.nextStart()
	line := p.lineAt(start)
	tok, err := p.dec.Token()
	if err != nil {
		return p.syntaxError(err)
	}
	if tok != json.Delim('{') {
		return &DataError{File: t.File, Line: line, Text: tokenText(tok), Err: ErrSyntax,
			Hint: "each element of the array must be an object; " + jsonHint}
	}
	row := t.rows
	clear(p.rowSet)
	for p.dec.More() {
		kt, err := p.dec.Token()
		if err != nil {
			return p.syntaxError(err)
		}
		key, _ := kt.(string)
		vstart := p.nextStart()
		vline := p.lineAt(vstart)
		pos := p.keyPosition(key, row, clampLine(line))
		if p.lastRow[pos] == row {
			return &DataError{File: t.File, Line: vline, Column: key, Text: key, Err: ErrDuplicateHeader,
				Hint: "an object may name each key only once; remove or rename the repeat"}
		}
		p.lastRow[pos] = row
		slot := p.slots[pos]
		if vstart < len(p.data) && (p.data[vstart] == '{' || p.data[vstart] == '[') {
			if slot >= 0 {
				return &DataError{File: t.File, Line: vline, Column: key, Err: ErrSyntax,
					Hint: "a value must be a number, a string, true, false or null, not an object or array"}
			}
			var skip json.RawMessage
			if err := p.dec.Decode(&skip); err != nil {
				return p.syntaxError(err)
			}
			continue
		}
		vt, err := p.dec.Token()
		if err != nil {
			return p.syntaxError(err)
		}
		if slot < 0 {
			continue
		}
		var s string // null stays "", which Numbers reads as missing
		switch v := vt.(type) {
		case json.Number:
			s = string(v)
		case string:
			s = v
		case bool:
			s = strconv.FormatBool(v)
		case nil:
		default: // a delimiter where a value belongs; Token reports most of these itself
			return &DataError{File: t.File, Line: vline, Column: key, Text: tokenText(vt), Err: ErrSyntax, Hint: jsonHint}
		}
		p.rowText[slot], p.rowLine[slot], p.rowSet[slot] = s, clampLine(vline), true
	}
	if _, err := p.dec.Token(); err != nil { // the closing }
		return p.syntaxError(err)
	}
	// A key the object lacks is a missing cell on the object's line.
	for slot, c := range t.cols {
		if !p.rowSet[slot] {
			p.rowText[slot], p.rowLine[slot] = "", clampLine(line)
		}
		c.add(p.rowText[slot])
	}
	t.addRow(clampLine(line), p.rowLine, true)
	return nil
}

// keyPosition returns the header position of key, adding it (and, when it
// is kept, a column of missing cells for the rows before) on first sight.
func (p *jsonReader) keyPosition(key string, row int, line int32) int {
	if pos, ok := p.keys[key]; ok {
		return pos
	}
	t := p.t
	pos := len(t.Header)
	p.keys[key] = pos
	t.Header = append(t.Header, key)
	p.lastRow = append(p.lastRow, -1)
	slot := -1
	if p.want == nil || p.want[key] {
		slot = len(t.cols)
		t.index[key] = slot
		c := newColumn(0)
		for range row {
			c.add("")
		}
		t.cols = append(t.cols, c)
		if t.cellLines != nil {
			t.cellLines = append(t.cellLines, slices.Clone(t.lines))
		}
		p.rowText = append(p.rowText, "")
		p.rowLine = append(p.rowLine, 0)
		p.rowSet = append(p.rowSet, false)
	}
	p.slots = append(p.slots, slot)
	return pos
}

// syntaxError places a decoder error at its line.
func (p *jsonReader) syntaxError(err error) error {
	var se *json.SyntaxError
	switch {
	case errors.As(err, &se):
		off := int(se.Offset)
		// The offset is just past the offending byte.
		at := max(off-1, 0)
		return &DataError{File: p.t.File, Line: p.lineAt(at), Text: lineAround(p.data, at), Err: ErrSyntax,
			Hint: "fix the JSON: " + se.Error()}
	case err == io.EOF || errors.Is(err, io.ErrUnexpectedEOF):
		return &DataError{File: p.t.File, Line: p.lineAt(len(p.data)), Err: ErrSyntax,
			Hint: "the JSON ends early; close every [ and { that is opened"}
	}
	return &DataError{File: p.t.File, Err: ErrSyntax, Hint: oneLine(err.Error())}
}

// tokenText shows a JSON token in a message.
func tokenText(tok json.Token) string {
	switch v := tok.(type) {
	case json.Delim:
		return v.String()
	case nil:
		return "null"
	}
	return fmt.Sprint(tok)
}

// firstInvalid is the offset of the first byte that is not valid UTF-8.
func firstInvalid(data []byte) int {
	for off := 0; off < len(data); {
		r, size := utf8.DecodeRune(data[off:])
		if r == utf8.RuneError && size <= 1 {
			return off
		}
		off += size
	}
	return len(data)
}

// lineAround returns a short piece of the line holding byte off, to show
// the offending text.
func lineAround(data []byte, off int) string {
	off = min(max(off, 0), len(data))
	start := bytes.LastIndexByte(data[:off], '\n') + 1
	end := bytes.IndexByte(data[off:], '\n')
	if end < 0 {
		end = len(data)
	} else {
		end += off
	}
	const maxText = 40
	start = max(start, off-maxText/2)
	end = min(end, start+maxText)
	return strings.TrimSpace(string(data[start:end]))
}
