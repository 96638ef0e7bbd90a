package table

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"slices"
	"strconv"
	"strings"
	"unicode/utf8"
)

// jsonHint says what shape a JSON data file must have.
const jsonHint = `the file must be a JSON array of objects, such as [{"route": "North", "passengers": 120}]`

// readJSON fills the table from an array of objects. encoding/json does not
// report lines, so the whole input is kept and each object's and value's
// byte offset (Decoder.InputOffset, then past white space, commas and
// colons) is turned into a line by counting line feeds incrementally.
func (t *Table) readJSON(data []byte, valid bool, want []string) error {
	// encoding/json would silently replace invalid UTF-8, so check first.
	if !valid {
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
			return t.MissingColumn(w)
		}
	}
	if t.rows == 0 {
		return &DataError{File: t.File, Line: 1, Err: ErrEmpty, Hint: "the array holds no objects; " + jsonHint}
	}
	return t.finish()
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
		c.text.add(p.rowText[slot])
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
		c := newColumn(key, -1, 0, false)
		for range row {
			c.text.add("")
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
	return &DataError{File: p.t.File, Err: ErrSyntax, Hint: OneLine(err.Error())}
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

// addRow records a JSON row's line and, only once some value starts on a
// later line than its object, the line of every cell.
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

// clampLine converts a line number to the stored width.
func clampLine(n int) int32 {
	return int32(min(n, maxLine))
}
