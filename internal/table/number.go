package table

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"
)

// missingMarkers are the cells read as a missing value, compared without
// regard to case after trimming spaces: empty, NA, N/A, NaN, null, a
// hyphen, an en dash, and the "." and ".." that statistics offices print
// for "not available" (common practice).
var missingMarkers = [...]string{"", "NA", "N/A", "NaN", "null", "-", "–", ".", ".."}

// missingMarker returns the index in missingMarkers of a cell, or -1.
func missingMarker[T ~string | ~[]byte](s T) int {
	i, j := 0, len(s)
	for i < j && (s[i] == ' ' || s[i] == '\t') {
		i++
	}
	for j > i && (s[j-1] == ' ' || s[j-1] == '\t') {
		j--
	}
	if j-i > 4 {
		return -1
	}
	for m, w := range missingMarkers {
		if j-i == len(w) && foldEqual(s[i:j], w) {
			return m
		}
	}
	return -1
}

// foldEqual compares ASCII letters without regard to case.
func foldEqual[T ~string | ~[]byte](s T, w string) bool {
	for k := range len(w) {
		a, b := s[k], w[k]
		if 'A' <= a && a <= 'Z' {
			a += 'a' - 'A'
		}
		if 'A' <= b && b <= 'Z' {
			b += 'a' - 'A'
		}
		if a != b {
			return false
		}
	}
	return true
}

// pow10 holds the powers of ten that a float64 represents exactly.
var pow10 = [...]float64{1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10,
	1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22}

// fastDecimal reads the common cell, a plain decimal such as -1234.56, by
// Clinger's fast path (Clinger 1990): when the digits form an integer of at
// most 2^53 and there are at most 22 decimals, both the integer and the
// power of ten are exact float64 values, so one correctly rounded division
// gives the correctly rounded result, the same as strconv.ParseFloat. It
// declines everything else (exponents, long mantissas, grouping, signs of
// currency), which goes to the full reader. It took the parse of a
// million-cell column from 40 ms to 15 ms.
func fastDecimal[T ~string | ~[]byte](s T) (float64, bool) {
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

// scanDecimal is fastDecimal fused with the search for the field's end:
// it reads a plain decimal from the start of b up to sep or the end of b
// and returns the value and the bytes read. It accepts exactly what
// fastDecimal accepts (FuzzScanDecimal), and declines everything else,
// which then goes the general way.
func scanDecimal(b []byte, sep byte) (float64, int, bool) {
	i := 0
	neg := false
	if len(b) > 0 && (b[0] == '-' || b[0] == '+') {
		neg = b[0] == '-'
		i = 1
	}
	var mant uint64
	start := i
	for ; i < len(b); i++ {
		c := b[i] - '0'
		if c > 9 {
			break
		}
		mant = mant*10 + uint64(c)
	}
	digits, frac := i-start, 0
	if i < len(b) && b[i] == '.' {
		i++
		fs := i
		for ; i < len(b); i++ {
			c := b[i] - '0'
			if c > 9 {
				break
			}
			mant = mant*10 + uint64(c)
		}
		frac = i - fs
		digits += frac
	}
	if i < len(b) && b[i] != sep || digits == 0 || digits > 19 || mant > 1<<53 || frac >= len(pow10) {
		return 0, 0, false
	}
	f := float64(mant) / pow10[frac]
	if neg {
		f = -f
	}
	return f, i, true
}

// currencies are the signs read as a currency unit before or after the
// number; the unit of the column is the sign itself.
var currencies = []string{"US$", "A$", "C$", "$", "£", "€", "¥", "₹", "₩", "₽", "₺", "₪", "₫", "฿", "₴", "₦", "₱"}

// cellParts is a number cell taken apart: sign, unit and the digits.
type cellParts struct {
	neg, paren bool
	unit       string
	body       string
}

// splitCell takes the sign (-, + or U+2212 MINUS SIGN, or accounting
// parentheses), a currency sign before or after, and a percent sign off a
// trimmed cell, leaving the digits with their separators.
func splitCell(s string) (cellParts, bool) {
	var p cellParts
	s = strings.TrimFunc(s, unicode.IsSpace)
	if len(s) >= 2 && s[0] == '(' && s[len(s)-1] == ')' {
		p.paren, p.neg = true, true
		s = strings.TrimFunc(s[1:len(s)-1], unicode.IsSpace)
	}
	sign := func() bool {
		for _, m := range []string{"-", "+", "−"} {
			if strings.HasPrefix(s, m) {
				if p.paren || p.neg {
					return false // a second sign
				}
				p.neg = m != "+"
				s = s[len(m):]
				return true
			}
		}
		return true
	}
	if !sign() {
		return p, false
	}
	for _, c := range currencies {
		if strings.HasPrefix(s, c) {
			p.unit = c
			s = strings.TrimFunc(s[len(c):], unicode.IsSpace)
			if !sign() {
				return p, false
			}
			break
		}
	}
	if strings.HasSuffix(s, "%") {
		if p.unit != "" {
			return p, false
		}
		p.unit = "%"
		s = strings.TrimFunc(s[:len(s)-1], unicode.IsSpace)
	} else if p.unit == "" {
		for _, c := range currencies {
			if strings.HasSuffix(s, c) {
				p.unit = c
				s = strings.TrimFunc(s[:len(s)-len(c)], unicode.IsSpace)
				break
			}
		}
	}
	p.body = s
	return p, s != ""
}

// groupMarks are the characters that group digits in threes: comma, point,
// apostrophe (ASCII and typographic), space, no-break space, thin space and
// narrow no-break space.
const groupMarks = ",.'’ \u00a0\u2009\u202f"

// parseBody reads the digits of a number with the decimal mark dec. Digits
// before the mark may be grouped in threes by one of groupMarks other than
// dec, the first group holding one to three digits; an exponent is allowed
// only without grouping. It returns the value, whether grouping was used,
// and false when body is not a number written that way.
func parseBody(body string, dec byte) (v float64, grouped, ok bool) {
	var b strings.Builder
	i := 0
	var mark rune
	group := 0 // digits in the current group
	for i < len(body) {
		r, size := utf8.DecodeRuneInString(body[i:])
		switch {
		case r >= '0' && r <= '9':
			b.WriteByte(byte(r))
			group++
		case r < utf8.RuneSelf && byte(r) == dec:
			goto fraction
		case strings.ContainsRune(groupMarks, r):
			if group == 0 || (mark != 0 && (r != mark || group != 3)) || (mark == 0 && (group > 3 || b.String()[0] == '0')) {
				return 0, false, false // a first group of "0" is a decimal, not a thousand
			}
			mark, group = r, 0
		default:
			goto fraction
		}
		i += size
	}
fraction:
	if mark != 0 && group != 3 {
		return 0, false, false
	}
	digits := b.Len()
	if i < len(body) && body[i] == dec {
		b.WriteByte('.')
		i++
		for i < len(body) && body[i] >= '0' && body[i] <= '9' {
			b.WriteByte(body[i])
			digits++
			i++
		}
	}
	if digits == 0 {
		return 0, false, false
	}
	if i < len(body) && (body[i] == 'e' || body[i] == 'E') && mark == 0 {
		b.WriteByte('e')
		i++
		if i < len(body) && (body[i] == '+' || body[i] == '-') {
			b.WriteByte(body[i])
			i++
		}
		n := 0
		for i < len(body) && body[i] >= '0' && body[i] <= '9' {
			b.WriteByte(body[i])
			i++
			n++
		}
		if n == 0 {
			return 0, false, false
		}
	}
	if i != len(body) {
		return 0, false, false
	}
	v, err := strconv.ParseFloat(b.String(), 64)
	if err != nil && !math.IsInf(v, 0) {
		return 0, false, false
	}
	return v, mark != 0, true
}

// Numbers is a column read as numbers.
type Numbers struct {
	// Values holds one number per row, NaN where the cell is missing. It
	// is shared by every caller: copy it before changing it.
	Values []float64
	// Missing lists the rows with a missing cell, in increasing order.
	Missing []int
	// Unit is the unit written in the cells: "%" or a currency sign.
	Unit string
	// Notes say how the column was read when it was not plain decimals.
	Notes []Note
}

// Numbers reads column col as numbers, one per row; see ReadNumbers for
// the forms read. Missing cells are not errors: their rows are listed in
// missing and hold NaN in vals. The result is computed once per column and
// shared.
func (t *Table) Numbers(col string) (vals []float64, missing []int, err error) {
	n, err := t.ReadNumbers(col)
	if err != nil {
		return nil, nil, err
	}
	return n.Values, n.Missing, nil
}

// ReadNumbers reads column col as numbers, deciding once for the whole
// column how they are written, and only when every cell agrees:
//
//   - the decimal mark: Reader.Decimal, or else the one every cell allows.
//     A cell such as "12,5", "0,25" or "1.234,5" proves a decimal comma;
//     "1,234,567" or "12.5" a decimal point. When every cell reads either
//     way ("1,234" grouped, or a decimal comma), the separator decides: in
//     a semicolon-separated file the comma is the decimal mark, in a
//     comma-separated file (where such a cell must be quoted) it groups
//     thousands, and otherwise the column is refused as ambiguous with the
//     advice to say --decimal. A column whose cells only show "1.234" keeps
//     the point as the decimal mark;
//   - digit grouping in threes by comma, point, apostrophe or a space
//     (also no-break and thin spaces);
//   - a percent sign after, or a currency sign before or after, the same
//     for every cell: it becomes Unit;
//   - a minus as "-", U+2212, or accounting parentheses: "(5)" is -5.
//
// Missing cells are those of missingMarkers. The first cell written
// another way stops the reading with a *DataError naming it.
func (t *Table) ReadNumbers(col string) (*Numbers, error) {
	c := t.column(col)
	if c == nil {
		if t == nil {
			return nil, &DataError{Column: col, Err: ErrMissingColumn}
		}
		return nil, t.MissingColumn(col)
	}
	if c.num != nil || c.numErr != nil {
		return c.num, c.numErr
	}
	if c.numeric {
		n := &Numbers{Values: c.nums}
		if c.markers != ([len(missingMarkers)]int{}) {
			for i, v := range c.nums {
				if v != v {
					n.Missing = append(n.Missing, i)
				}
			}
		}
		n.Notes = markerNote(col, c.markers)
		c.num = n
		return n, nil
	}
	c.num, c.numErr = t.readNumbers(c)
	return c.num, c.numErr
}

// markerNote counts the missing cells by how they were written.
func markerNote(col string, markers [len(missingMarkers)]int) []Note {
	total := 0
	var parts []string
	for m, n := range markers {
		if n == 0 {
			continue
		}
		total += n
		if missingMarkers[m] == "" {
			parts = append(parts, fmt.Sprintf("%d empty", n))
		} else {
			parts = append(parts, fmt.Sprintf("%d %q", n, missingMarkers[m]))
		}
	}
	if total == 0 {
		return nil
	}
	return []Note{{Code: "missing", Text: fmt.Sprintf("column %q has %d missing %s (%s)", col, total, plural(total, "value"), strings.Join(parts, ", "))}}
}

// cellReading is what the number reader learned about one distinct text.
type cellReading struct {
	text    string
	marker  int // missing marker, or -1
	parts   cellParts
	split   bool // splitCell accepted it
	dot     bool // parseBody accepts it with a decimal point
	comma   bool // ... with a decimal comma
	inf     bool
	value   float64
	grouped bool
}

func (t *Table) readNumbers(c *column) (*Numbers, error) {
	cl := c.text
	// Each distinct text is examined once: the dictionary's entries, or
	// every cell of a plain column.
	var distinct []string
	if cl.dictionary() {
		distinct = cl.dict
	} else {
		distinct = cl.strings()
	}
	code := func(row int) int {
		if cl.dictionary() {
			return int(cl.codes[row])
		}
		return row
	}
	rd := make([]cellReading, len(distinct))
	for i, s := range distinct {
		r := &rd[i]
		r.text, r.marker = s, missingMarker(s)
		if r.marker >= 0 {
			continue
		}
		r.parts, r.split = splitCell(s)
		if !r.split {
			continue
		}
		_, _, r.dot = parseBody(r.parts.body, '.')
		_, _, r.comma = parseBody(r.parts.body, ',')
	}
	rows := cl.len()
	// The unit and the decimal mark follow the first cell that shows them.
	unit, unitSet := "", false
	dec := byte(t.decimal)
	decided := dec != 0
	allDot, allComma, anyComma, firstAmbiguous := true, true, false, -1
	for row := range rows {
		r := &rd[code(row)]
		if r.marker >= 0 || !r.split {
			continue
		}
		if !unitSet {
			unit, unitSet = r.parts.unit, true
		}
		allDot = allDot && r.dot
		allComma = allComma && r.comma
		if strings.ContainsRune(r.parts.body, ',') {
			anyComma = true
			if r.dot && r.comma && firstAmbiguous < 0 {
				firstAmbiguous = row
			}
		}
		if !decided && r.dot != r.comma {
			dec, decided = '.', true
			if r.comma {
				dec = ','
			}
		}
	}
	if t.decimal == 0 {
		switch {
		case allDot && allComma && anyComma:
			switch t.Comma {
			case ';':
				dec = ','
			case ',':
				dec = '.'
			default:
				text := rd[code(firstAmbiguous)].text
				return nil, &DataError{File: t.File, Line: t.cellLine(t.index[c.name], firstAmbiguous), Column: c.name, Text: text, Err: ErrMixedNumbers,
					Hint: fmt.Sprintf("cannot tell whether %q groups thousands or has a decimal comma; say --decimal , or --decimal .", text)}
			}
		case allDot && allComma, !decided:
			dec = '.'
		}
	}
	// Now every distinct text gets its value, then every row.
	grouped, paren := "", false
	for i := range rd {
		r := &rd[i]
		if r.marker >= 0 || !r.split {
			continue
		}
		if (dec == '.' && !r.dot) || (dec == ',' && !r.comma) {
			continue
		}
		r.value, r.grouped, _ = parseBody(r.parts.body, dec)
		r.inf = math.IsInf(r.value, 0)
		if r.parts.neg {
			r.value = -r.value
		}
	}
	n := &Numbers{Values: make([]float64, rows), Unit: unit}
	var markers [len(missingMarkers)]int
	slot := t.index[c.name]
	for row := range rows {
		r := &rd[code(row)]
		if r.marker >= 0 {
			markers[r.marker]++
			n.Values[row] = math.NaN()
			n.Missing = append(n.Missing, row)
			continue
		}
		at := func(err error, hint string) error {
			return &DataError{File: t.File, Line: t.cellLine(slot, row), Column: c.name, Text: r.text, Err: err, Hint: hint}
		}
		ok := r.split && ((dec == '.' && r.dot) || (dec == ',' && r.comma))
		switch {
		case !r.split || !(r.dot || r.comma):
			if isInfinity(strings.TrimSpace(r.text)) {
				return nil, at(ErrNotFinite, "write a finite number, or leave the cell empty to skip the row")
			}
			return nil, at(ErrBadNumber, numberHint(r.text))
		case r.parts.unit != unit:
			return nil, at(ErrMixedNumbers, unitHint(unit, r.parts.unit))
		case !ok:
			return nil, at(ErrMixedNumbers, fmt.Sprintf("the column reads %s, but this cell only as %s; write every number the same way", decName(dec), decName(otherDec(dec))))
		case r.inf:
			return nil, at(ErrNotFinite, "write a finite number, or leave the cell empty to skip the row")
		}
		n.Values[row] = r.value
		if r.grouped && grouped == "" {
			grouped = r.text
		}
		paren = paren || r.parts.paren
	}
	n.Notes = append(n.Notes, markerNote(c.name, markers)...)
	if dec == ',' && t.decimal == 0 {
		n.Notes = append(n.Notes, Note{Code: "decimal-comma", Text: fmt.Sprintf("read column %q with a decimal comma (12,5 is 12.5); say --decimal . if the commas group thousands", c.name)})
	}
	if grouped != "" {
		n.Notes = append(n.Notes, Note{Code: "grouping", Text: fmt.Sprintf("read column %q with digits grouped in threes, such as %q", c.name, strings.TrimSpace(grouped))})
	}
	if paren {
		n.Notes = append(n.Notes, Note{Code: "accounting", Text: fmt.Sprintf("read numbers in parentheses in column %q as negative: (5) is −5", c.name)})
	}
	switch {
	case unit == "%":
		n.Notes = append(n.Notes, Note{Code: "unit", Text: fmt.Sprintf("read column %q as percentages (12%% is 12, unit %%)", c.name)})
	case unit != "":
		n.Notes = append(n.Notes, Note{Code: "unit", Text: fmt.Sprintf("read column %q as amounts in %s (the sign in the cells)", c.name, unit)})
	}
	return n, nil
}

func decName(dec byte) string {
	if dec == ',' {
		return "with a decimal comma"
	}
	return "with a decimal point"
}

func otherDec(dec byte) byte {
	if dec == ',' {
		return '.'
	}
	return ','
}

func unitHint(want, got string) string {
	switch {
	case want == "":
		return fmt.Sprintf("the cells above have no unit and this one %q; write every number with the same sign, or none", got)
	case got == "":
		return fmt.Sprintf("the cells above are in %q and this one has no unit; write every number with the same sign", want)
	}
	return fmt.Sprintf("the cells above are in %q and this one in %q; chart one unit per column", want, got)
}

// isInfinity reports whether a trimmed cell spells an infinity.
func isInfinity(s string) bool {
	s = strings.TrimLeft(s, "+-")
	return strings.EqualFold(s, "inf") || strings.EqualFold(s, "infinity") || s == "∞"
}

// numberHint says how to fix a cell that is not a number.
func numberHint(s string) string {
	t := strings.TrimSpace(s)
	if looksLikeDate(t) {
		return "this looks like a date; dates belong in the x column of a line chart (--x), not among the values"
	}
	if num, sym, ok := splitUnit(t); ok {
		return fmt.Sprintf("write only the number (%s) and say %q in the title or with --unit", num, sym)
	}
	return `write digits, with "." or "," for decimals, or leave the cell empty to skip the row`
}

// splitUnit splits "12 kg" or "kg12" into the number and the unit word.
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
	if sym == "" || strings.ContainsAny(sym, "0123456789.,") || (start > 0 && end < len(s)) {
		return "", "", false
	}
	if _, err := strconv.ParseFloat(num, 64); err != nil {
		return "", "", false
	}
	return num, sym, true
}
