// Package table reads the tables people have: delimited text (comma,
// semicolon, tab or pipe separated, RFC 4180 quoting) and JSON arrays of
// objects, in the manner of encoding/csv. A Reader holds the options as
// fields whose zero value is the common case; Read returns a Table whose
// columns are read as numbers, labels or dates on demand, each once.
//
// Numbers are read per column and only when the whole column agrees on how
// they are written: a decimal point or comma, digit grouping, a percent or
// currency sign, accounting negatives (see Table.Numbers). Dates are read
// per column too, the day/month order decided by a value that proves it
// (see Table.Times). Every error is a *DataError that names the file, the
// line, the column, the offending text and what would fix it.
//
// Reading is bounded: the input may not pass MaxInput bytes, nor a line
// MaxLine bytes without a line break, and a file holding NUL bytes is
// refused at once, so that /dev/zero or a binary file stops quickly.
package table

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"io"
	"io/fs"
	"math"
	"path/filepath"
	"runtime/debug"
	"strings"
	"unicode/utf8"
)

// Limits that apply when a Reader leaves the field zero.
const (
	// DefaultMaxInput is the largest input read: 1 GiB, about 50 million
	// rows of two short columns, far past what a chart can show.
	DefaultMaxInput = 1 << 30
	// DefaultMaxLine is the longest run of bytes without a line break in a
	// delimited file: 4 MiB, thousands of times a real row.
	DefaultMaxLine = 4 << 20
	// DefaultMaxLabel is the longest label kept whole, in characters;
	// longer ones are shortened with an ellipsis (see ShortenLabels).
	DefaultMaxLabel = 200
)

// Reader reads a table. Set its fields before calling Read; the zero value
// sniffs the separator, decides the decimal mark per column, keeps every
// column and applies the default limits.
type Reader struct {
	// Format is "csv", "tsv" or "json"; "" takes it from the file name's
	// extension, or for standard input ("-") from the first bytes.
	// "semicolon" and "pipe" name CSV with that separator.
	Format string
	// Comma is the field separator of a delimited file. 0 sniffs it from
	// the header and the first rows among comma, semicolon, tab and pipe,
	// when the format was not given explicitly.
	Comma rune
	// Decimal is the decimal mark: '.' or ','. 0 decides per column from
	// the cells and the separator (see Table.Numbers).
	Decimal rune
	// Columns lists the columns to keep; nil keeps them all. Columns not
	// kept are skipped while reading and never stored.
	Columns []string
	// MaxInput bounds the input in bytes; 0 means DefaultMaxInput.
	MaxInput int64
	// MaxLine bounds a line of a delimited file in bytes; 0 means
	// DefaultMaxLine.
	MaxLine int

	// slow turns the unquoted fast path off, so that a test can show that
	// both paths read every input alike.
	slow bool
}

// Table is a data file read into memory: the kept columns, each read as
// numbers, labels or dates when asked, and each row's place in the file.
type Table struct {
	// File is the name the data was read from, as given to Read.
	File string
	// Header lists every column name of the file: for delimited files in
	// file order, trimmed of surrounding spaces; for JSON every key, in
	// order of first appearance.
	Header []string
	// Format is the format read: "csv", "tsv" or "json".
	Format string
	// Comma is the separator of a delimited file, 0 for JSON.
	Comma rune
	// Notes are the decisions made while reading the file as a whole (the
	// separator, the format of standard input).
	Notes []Note

	decimal  rune
	data     []byte
	index    map[string]int // kept column name -> position in cols
	cols     []*column
	rows     int
	header   int  // line of the header; 0 for JSON
	complete bool // reading has finished

	// Delimited files keep where each row starts; a cell is read again
	// from there when a column that looked numeric turns out not to be.
	starts    []uint32
	bodyStart int  // offset of the first byte after the header
	quoteFrom int  // offset from which rows were read by the RFC 4180 reader
	quotes    bool // RFC 4180 quoting applies (csv); tsv has none
	lineOff   int  // lineAt's cache: offset ...
	lineN     int  // ... and line feeds before it

	// JSON keeps the line of each row and, once some value sits on a
	// later line than its object, of each cell.
	lines     []int32
	cellLines [][]int32
}

// maxLine caps line numbers so that they fit the int32 bookkeeping.
const maxLine = math.MaxInt32

// Read reads the whole input. file names it in messages and, unless Format
// is set, gives the format by its extension. Every error is a *DataError.
func (r *Reader) Read(in io.Reader, file string) (tab *Table, err error) {
	format := strings.ToLower(strings.TrimPrefix(r.Format, "."))
	comma := r.Comma
	explicit := format != ""
	switch format {
	case "semicolon":
		format, comma = "csv", ';'
	case "pipe":
		format, comma = "csv", '|'
	case "", "csv", "tsv", "json":
	default:
		return nil, &DataError{File: file, Err: ErrFormat, Text: format,
			Hint: "use --format csv, tsv, json, semicolon or pipe"}
	}
	switch r.Decimal {
	case 0, '.', ',':
	default:
		return nil, &DataError{File: file, Err: ErrFormat, Text: string(r.Decimal), Hint: `the decimal mark is "." or ","`}
	}
	if format == "" && file != "-" && file != "" {
		format = strings.ToLower(strings.TrimPrefix(filepath.Ext(file), "."))
		if format != "csv" && format != "tsv" && format != "json" && format != "txt" {
			return nil, &DataError{File: file, Err: ErrFormat,
				Hint: "name the file .csv, .tsv or .json, or say which with --format csv|tsv|json"}
		}
		if format == "txt" {
			format = "csv"
		}
	}
	limit := r.MaxInput
	if limit <= 0 {
		limit = DefaultMaxInput
	}
	data := mapFile(in, limit)
	mapped := data
	if data != nil {
		// A mapped file cut short by another program faults on access;
		// that is reported as an error, not a crash.
		defer debug.SetPanicOnFault(debug.SetPanicOnFault(true))
		defer func() {
			if p := recover(); p != nil {
				if _, fault := p.(interface{ Addr() uintptr }); !fault {
					panic(p)
				}
				tab, err = nil, &DataError{File: file, Err: ErrSyntax, Hint: "the file changed while it was read; read it again"}
			}
		}()
		err = r.checkMapped(data, file, format)
	} else {
		data, err = r.readAll(in, file, format)
	}
	if err != nil {
		releaseNow(mapped)
		return nil, err
	}
	data, err = skipBOM(data, file)
	if err != nil {
		return nil, err
	}
	t := &Table{File: file, decimal: r.Decimal}
	if mapped != nil {
		releaseMap(t, mapped)
	}
	sniffed := format == ""
	if sniffed {
		format = sniffFormat(data)
		if format == "json" {
			t.Notes = append(t.Notes, Note{Code: "format", Text: "read standard input as JSON (say --format csv|tsv|json to choose)"})
		}
	}
	t.Format = format
	if format == "json" {
		err = t.readJSON(data, utf8.Valid(data), r.Columns)
	} else {
		data = bareCR(data, mapped != nil)
		t.quotes = format == "csv"
		if comma == 0 {
			def := ','
			if format == "tsv" {
				def = '\t'
			}
			comma = def
			if !explicit {
				comma = sniffComma(data, t.quotes, def)
				switch {
				case sniffed:
					t.Notes = append(t.Notes, Note{Code: "format", Text: fmt.Sprintf("read standard input as CSV separated by %s (say --format csv, semicolon, tsv, pipe or json to choose)", commaName(comma))})
				case comma != def:
					t.Notes = append(t.Notes, Note{Code: "separator", Text: fmt.Sprintf("read %s as separated by %s (say --format csv, semicolon, tsv or pipe to choose)", DisplayName(file), commaName(comma))})
				}
			}
		}
		t.Comma = comma
		err = t.readDelimited(data, r.Columns, r.slow)
	}
	if err != nil {
		return nil, err
	}
	return t, nil
}

func commaName(c rune) string {
	switch c {
	case ',':
		return "commas"
	case ';':
		return "semicolons"
	case '\t':
		return "tabs"
	case '|':
		return "pipes"
	}
	return fmt.Sprintf("%q", c)
}

// readAll reads the input within the limits: the size, a NUL byte in the
// first block (a binary file or a device such as /dev/zero), and for a
// delimited file a line longer than MaxLine.
func (r *Reader) readAll(in io.Reader, file, format string) ([]byte, error) {
	limit := r.MaxInput
	if limit <= 0 {
		limit = DefaultMaxInput
	}
	maxLine := r.MaxLine
	if maxLine <= 0 {
		maxLine = DefaultMaxLine
	}
	size := 0
	switch v := in.(type) {
	case interface{ Len() int }:
		size = v.Len()
	case interface{ Stat() (fs.FileInfo, error) }:
		if fi, err := v.Stat(); err == nil && fi.Mode().IsRegular() {
			if fi.Size() > limit {
				return nil, tooLarge(file, limit)
			}
			size = int(fi.Size()) // only a hint: the reading below enforces the limit
		}
	}
	if int64(size) > limit {
		return nil, tooLarge(file, limit)
	}
	buf := make([]byte, 0, size+bytes.MinRead)
	lineStart := 0 // offset where the current line began
	first := true
	checkLines := format != "json"
	for {
		if len(buf) == cap(buf) {
			buf = append(buf, 0)[:len(buf)]
		}
		n, err := in.Read(buf[len(buf):min(cap(buf), len(buf)+1<<20)])
		chunk := buf[len(buf) : len(buf)+n]
		if first && n > 0 {
			first = false
			if bytes.IndexByte(chunk, 0) >= 0 && !utf16BOM(chunk) {
				return nil, &DataError{File: file, Err: ErrBinary, Hint: "give a text file: CSV, TSV or JSON saved as UTF-8"}
			}
			if format == "" {
				checkLines = sniffFormat(chunk) != "json"
			}
		}
		if checkLines {
			if i := bytes.LastIndexAny(chunk, "\n\r"); i >= 0 {
				lineStart = len(buf) + i + 1
			}
			if len(buf)+n-lineStart > maxLine {
				line := 1 + bytes.Count(buf[:lineStart], []byte("\n"))
				return nil, &DataError{File: file, Line: line, Err: ErrLineTooLong,
					Hint: fmt.Sprintf("a line may hold at most %s without a line break; check that this is a table with one row per line", byteSize(int64(maxLine)))}
			}
		}
		buf = buf[:len(buf)+n]
		if int64(len(buf)) > limit {
			return nil, tooLarge(file, limit)
		}
		if err == io.EOF {
			return buf, nil
		}
		if err != nil {
			return nil, &DataError{File: file, Err: err, Hint: "check that the file can be read"}
		}
	}
}

// checkMapped applies readAll's checks to a file mapped whole: NUL bytes in
// the first block, and for a delimited file a line past MaxLine.
func (r *Reader) checkMapped(data []byte, file, format string) error {
	maxLine := r.MaxLine
	if maxLine <= 0 {
		maxLine = DefaultMaxLine
	}
	first := data[:min(len(data), 1<<20)]
	if bytes.IndexByte(first, 0) >= 0 && !utf16BOM(first) {
		return &DataError{File: file, Err: ErrBinary, Hint: "give a text file: CSV, TSV or JSON saved as UTF-8"}
	}
	if format == "json" || (format == "" && sniffFormat(first) == "json") {
		return nil
	}
	// Each window of maxLine+1 bytes from the last line break must hold
	// another; the last break in it is found from its end, in a few bytes.
	for off := 0; len(data)-off > maxLine; {
		w := data[off : off+maxLine+1]
		n := bytes.LastIndexByte(w, '\n')
		if n < 0 {
			n = bytes.LastIndexByte(w, '\r')
		}
		if n < 0 {
			line := 1 + bytes.Count(data[:off], []byte("\n"))
			return &DataError{File: file, Line: line, Err: ErrLineTooLong,
				Hint: fmt.Sprintf("a line may hold at most %s without a line break; check that this is a table with one row per line", byteSize(int64(maxLine)))}
		}
		off += n + 1
	}
	return nil
}

func utf16BOM(b []byte) bool {
	return bytes.HasPrefix(b, []byte("\xFE\xFF")) || bytes.HasPrefix(b, []byte("\xFF\xFE")) ||
		bytes.HasPrefix(b, []byte("\x00\x00\xFE\xFF"))
}

func tooLarge(file string, limit int64) error {
	return &DataError{File: file, Err: ErrTooLarge,
		Hint: fmt.Sprintf("plumb reads at most %s; raise the limit with --max-input (such as --max-input 4GB) or chart a summary of the data", byteSize(limit))}
}

// byteSize writes a size the way --max-input reads it.
func byteSize(n int64) string {
	switch {
	case n >= 1<<30 && n%(1<<30) == 0:
		return fmt.Sprintf("%dGB", n>>30)
	case n >= 1<<20 && n%(1<<20) == 0:
		return fmt.Sprintf("%dMB", n>>20)
	case n >= 1<<10 && n%(1<<10) == 0:
		return fmt.Sprintf("%dKB", n>>10)
	}
	return fmt.Sprintf("%d bytes", n)
}

// ParseSize reads a size such as 1GB, 512MB, 64KB or 1000000 (bytes), in
// binary multiples, for --max-input.
func ParseSize(s string) (int64, error) {
	t := strings.ToUpper(strings.TrimSpace(s))
	mult := int64(1)
	for _, u := range []struct {
		suffix string
		mult   int64
	}{{"GIB", 1 << 30}, {"MIB", 1 << 20}, {"KIB", 1 << 10}, {"GB", 1 << 30}, {"MB", 1 << 20}, {"KB", 1 << 10}, {"G", 1 << 30}, {"M", 1 << 20}, {"K", 1 << 10}, {"B", 1}} {
		if strings.HasSuffix(t, u.suffix) {
			t, mult = strings.TrimSpace(strings.TrimSuffix(t, u.suffix)), u.mult
			break
		}
	}
	var n int64
	if t == "" {
		return 0, fmt.Errorf("%q is not a size; write such as 1GB or 200MB", s)
	}
	for _, c := range t {
		if c < '0' || c > '9' || n > math.MaxInt64/10/mult {
			return 0, fmt.Errorf("%q is not a size; write such as 1GB or 200MB", s)
		}
		n = n*10 + int64(c-'0')
	}
	if n == 0 {
		return 0, fmt.Errorf("%q: the size must be more than 0", s)
	}
	return n * mult, nil
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

// bareCR turns carriage returns that no line feed follows into line feeds,
// so that files with classic Mac line ends read as lines: in place, or in
// a copy when data is read-only (a mapped file). CRLF is left alone: both
// readers drop the CR before LF.
func bareCR(data []byte, readOnly bool) []byte {
	i := bytes.IndexByte(data, '\r')
	for i >= 0 {
		if i+1 == len(data) || data[i+1] != '\n' {
			if readOnly {
				data, readOnly = bytes.Clone(data), false
			}
			data[i] = '\n'
		}
		j := bytes.IndexByte(data[i+1:], '\r')
		if j < 0 {
			break
		}
		i += 1 + j
	}
	return data
}

// sniffFormat guesses the format of data from its first bytes: JSON when
// it opens with [, otherwise CSV (whose separator is sniffed next).
func sniffFormat(head []byte) string {
	trimmed := bytes.TrimLeft(head[:min(len(head), 4096)], " \t\r\n")
	if len(trimmed) > 0 && trimmed[0] == '[' {
		return "json"
	}
	return "csv"
}

// sniffComma picks the separator from the header and up to 20 further
// records in the first 64 KiB: among comma, semicolon, tab and pipe, the
// ones that split every sampled record into the header's number of fields
// (at least two), the one giving the most fields; a tie goes to def, then
// to the order listed. When none is consistent, the one whose header
// splits into two or more fields and that most records agree with wins, so
// that the field-count error that follows names the row that disagrees
// under the separator the file evidently uses; with none at all, def.
func sniffComma(data []byte, quotes bool, def rune) rune {
	sample := data[:min(len(data), 64<<10)]
	best, bestN := def, 1
	loose, looseAgree := rune(0), 0
	for _, c := range []rune{def, ',', ';', '\t', '|'} {
		n, agree, all := fieldCounts(sample, byte(c), quotes, len(sample) < len(data))
		if n < 2 {
			continue
		}
		if agree == all && n > bestN {
			best, bestN = c, n
		}
		if agree > looseAgree {
			loose, looseAgree = c, agree
		}
	}
	if bestN == 1 && loose != 0 {
		return loose
	}
	return best
}

// fieldCounts splits the sampled records at sep and returns the header's
// number of fields, how many later records have as many, and how many
// later records there were.
func fieldCounts(sample []byte, sep byte, quotes, truncated bool) (header, agree, records int) {
	header, fields := -1, 1
	inQuote, empty := false, true
	end := func() {
		if header < 0 {
			header = fields
		} else {
			records++
			if fields == header {
				agree++
			}
		}
	}
	for i := 0; i < len(sample) && records < 20; i++ {
		c := sample[i]
		switch {
		case quotes && c == '"':
			inQuote = !inQuote
			empty = false
		case inQuote:
		case c == sep:
			fields++
			empty = false
		case c == '\n':
			if !empty {
				end()
			}
			fields, empty = 1, true
		case c != '\r':
			empty = false
		}
	}
	if !empty && !inQuote && !truncated && records < 20 {
		end()
	}
	return max(header, 0), agree, records
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
	if t == nil || row < 0 || row >= t.rows {
		return 0
	}
	if t.lines != nil {
		return int(t.lines[row])
	}
	return t.lineAt(int(t.starts[row]))
}

// lineAt is the 1-based line of a byte offset in a delimited file. Blank
// lines before a record are skipped, so the offset is moved to the
// record's first byte. Offsets asked for usually grow, so the count of
// line feeds is kept and extended.
func (t *Table) lineAt(off int) int {
	for off < len(t.data) && (t.data[off] == '\n' || t.data[off] == '\r') {
		off++
	}
	return t.rawLineAt(off)
}

// rawLineAt is the 1-based line of a byte offset.
func (t *Table) rawLineAt(off int) int {
	if off < t.lineOff {
		t.lineOff, t.lineN = 0, 0
	}
	t.lineN += bytes.Count(t.data[t.lineOff:off], []byte("\n"))
	t.lineOff = off
	return min(t.lineN+1, maxLine)
}

// cellLine is the line where cell (c, row) starts.
func (t *Table) cellLine(c, row int) int {
	if t.lines != nil {
		if t.cellLines != nil {
			return int(t.cellLines[c][row])
		}
		return int(t.lines[row])
	}
	line := t.Line(row)
	if int(t.starts[row]) < t.quoteFrom {
		return line
	}
	// A quoted cell may span lines: ask the RFC 4180 reader where the
	// field starts, counting from where it starts reading.
	cr := t.csvReader(int(t.starts[row]))
	if _, err := cr.Read(); err != nil {
		return line
	}
	l, _ := cr.FieldPos(t.cols[c].field)
	return t.rawLineAt(int(t.starts[row])) + l - 1
}

// csvReader is an RFC 4180 reader over the data from off.
func (t *Table) csvReader(off int) *csv.Reader {
	cr := csv.NewReader(bytes.NewReader(t.data[off:]))
	cr.Comma = t.Comma
	cr.FieldsPerRecord = -1
	cr.ReuseRecord = true
	return cr
}
