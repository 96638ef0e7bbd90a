package table

import (
	"fmt"
	"strings"
	"time"

	"plumb/scale"
)

// dateToken is one element of a date pattern.
type dateToken struct {
	kind string // "YYYY", "MM", "DD", "MMM", "Q", "HH", "mm", "ss", or "" for literal text
	lit  string
}

// patternTokens are the words of the pattern vocabulary, longest first so
// that MMMM is read before MMM and MM.
var patternTokens = []string{"YYYY", "MMMM", "MMM", "MM", "M", "DD", "D", "HH", "mm", "ss", "Q"}

// parsePattern reads a date pattern in plumb's vocabulary: YYYY a
// four-digit year; MM or M a month number; DD or D a day; MMM or MMMM an
// English month name, full or abbreviated; Q a quarter (1-4, with or
// without a leading Q); HH, mm and ss hours, minutes and seconds. Anything
// else stands for itself: "DD.MM.YYYY", "MMM YYYY", "YYYY-Q".
func parsePattern(p string) ([]dateToken, error) {
	var out []dateToken
	for i := 0; i < len(p); {
		matched := false
		for _, w := range patternTokens {
			if strings.HasPrefix(p[i:], w) {
				k := w
				switch w {
				case "MMMM":
					k = "MMM"
				case "M":
					k = "MM"
				case "D":
					k = "DD"
				}
				out = append(out, dateToken{kind: k})
				i += len(w)
				matched = true
				break
			}
		}
		if !matched {
			if n := len(out); n > 0 && out[n-1].kind == "" {
				out[n-1].lit += p[i : i+1]
			} else {
				out = append(out, dateToken{lit: p[i : i+1]})
			}
			i++
		}
	}
	hasYear := false
	for _, t := range out {
		hasYear = hasYear || t.kind == "YYYY"
	}
	if !hasYear {
		return nil, fmt.Errorf("the pattern %q has no year (YYYY); use YYYY, MM, DD, MMM, Q, HH, mm and ss, such as DD.MM.YYYY", p)
	}
	return out, nil
}

var monthNames = []string{"january", "february", "march", "april", "may", "june", "july",
	"august", "september", "october", "november", "december"}

// monthName reads an English month name, full or abbreviated to three
// letters (also "Sept"), at the start of s; it returns the month and the
// bytes used.
func monthName(s string) (int, int) {
	for m, name := range monthNames {
		if len(s) >= len(name) && strings.EqualFold(s[:len(name)], name) {
			return m + 1, len(name)
		}
	}
	if len(s) >= 4 && strings.EqualFold(s[:4], "sept") {
		return 9, 4
	}
	for m, name := range monthNames {
		if len(s) >= 3 && strings.EqualFold(s[:3], name[:3]) {
			n := 3
			if len(s) > 3 && s[3] == '.' {
				n = 4
			}
			return m + 1, n
		}
	}
	return 0, 0
}

// matchPattern reads s with a pattern and returns the instant in Unix
// seconds (UTC).
func matchPattern(s string, pat []dateToken) (float64, bool) {
	s = strings.TrimSpace(s)
	year, month, day, hour, minute, sec := -1, 1, 1, 0, 0, 0
	digits := func(minN, maxN int) (int, bool) {
		n, v := 0, 0
		for n < maxN && n < len(s) && s[n] >= '0' && s[n] <= '9' {
			v = v*10 + int(s[n]-'0')
			n++
		}
		if n < minN {
			return 0, false
		}
		s = s[n:]
		return v, true
	}
	var ok bool
	for _, t := range pat {
		switch t.kind {
		case "":
			lit := t.lit
			for lit != "" {
				if lit[0] == ' ' {
					lit = strings.TrimLeft(lit, " ")
					if len(s) > 0 && s[0] != ' ' && s[0] != ',' {
						return 0, false
					}
					s = strings.TrimLeft(s, " ")
					continue
				}
				if len(s) == 0 || !strings.EqualFold(s[:1], lit[:1]) {
					return 0, false
				}
				s, lit = s[1:], lit[1:]
			}
		case "YYYY":
			if year, ok = digits(4, 4); !ok {
				return 0, false
			}
		case "MM":
			if month, ok = digits(1, 2); !ok {
				return 0, false
			}
		case "DD":
			if day, ok = digits(1, 2); !ok {
				return 0, false
			}
		case "MMM":
			m, n := monthName(s)
			if n == 0 {
				return 0, false
			}
			month, s = m, s[n:]
		case "Q":
			if len(s) > 0 && (s[0] == 'Q' || s[0] == 'q') {
				s = s[1:]
			}
			q, ok := digits(1, 1)
			if !ok || q < 1 || q > 4 {
				return 0, false
			}
			month = 3*q - 2
		case "HH":
			if hour, ok = digits(2, 2); !ok || hour > 23 {
				return 0, false
			}
		case "mm":
			if minute, ok = digits(2, 2); !ok || minute > 59 {
				return 0, false
			}
		case "ss":
			if sec, ok = digits(2, 2); !ok || sec > 59 {
				return 0, false
			}
		}
	}
	if s != "" || year < 0 || month < 1 || month > 12 || day < 1 || day > daysIn(year, month) {
		return 0, false
	}
	return float64(time.Date(year, time.Month(month), day, hour, minute, sec, 0, time.UTC).Unix()), true
}

func daysIn(year, month int) int {
	return time.Date(year, time.Month(month)+1, 0, 0, 0, 0, 0, time.UTC).Day()
}

// dateForm is one way of writing dates that Times recognises by itself.
type dateForm struct {
	name string // the pattern, as the user would give it
	pat  []dateToken
	iso  bool
}

// autoForms are the forms detected without a pattern, in order of
// preference: ISO 8601 first, then quarters, month names, year-first
// numbers, and the two orders of day and month that only a value above 12
// tells apart.
var autoForms = func() []dateForm {
	forms := []dateForm{{name: "ISO 8601", iso: true}}
	for _, p := range []string{
		"YYYY-Q", "YYYY Q", "YYYYQ", "Q YYYY", "Q-YYYY",
		"MMM YYYY", "MMM-YYYY", "D MMM YYYY", "D-MMM-YYYY", "MMM D, YYYY", "MMM D YYYY", "YYYY MMM",
		"YYYY/MM/DD", "YYYY/MM", "YYYY.MM.DD",
		"DD/MM/YYYY", "MM/DD/YYYY", "DD.MM.YYYY", "MM.DD.YYYY", "DD-MM-YYYY", "MM-DD-YYYY",
		"DD/MM/YYYY HH:mm", "MM/DD/YYYY HH:mm", "DD/MM/YYYY HH:mm:ss", "MM/DD/YYYY HH:mm:ss",
	} {
		pat, _ := parsePattern(p)
		forms = append(forms, dateForm{name: p, pat: pat})
	}
	return forms
}()

func (f dateForm) read(s string) (float64, bool) {
	if f.iso {
		tm, _, err := scale.ParseTime(s)
		if err != nil {
			return 0, false
		}
		return float64(tm.Unix()) + float64(tm.Nanosecond())/1e9, true
	}
	return matchPattern(s, f.pat)
}

// dayMonthPair tells whether two forms differ only in the order of day and
// month, such as DD/MM/YYYY and MM/DD/YYYY.
func dayMonthPair(a, b string) bool {
	swap := strings.NewReplacer("DD", "MM", "MM", "DD").Replace(a)
	return swap == b
}

// looksLikeDate reports whether a cell reads as a date in any known form.
func looksLikeDate(s string) bool {
	s = strings.TrimSpace(s)
	if len(s) < 6 { // a bare year or a number is not taken for a date
		return false
	}
	for _, f := range autoForms {
		if _, ok := f.read(s); ok {
			return true
		}
	}
	return false
}

// LooksLikeDates reports whether column col holds dates: at least four
// in five of its first 200 non-empty cells read as dates (bare years do
// not count), so that one bad date is reported as a date rather than the
// column read as bad numbers.
func (t *Table) LooksLikeDates(col string) bool {
	cells := t.Strings(col)
	seen, good := 0, 0
	for _, s := range cells {
		if seen == 200 {
			break
		}
		if strings.TrimSpace(s) == "" {
			continue
		}
		seen++
		if looksLikeDate(s) {
			good++
		}
	}
	return seen > 0 && good*5 >= seen*4
}

// Times reads column col as dates and times, in Unix seconds (UTC). With
// pattern "" it detects the form from the cells: ISO 8601 (2024, 2024-03,
// 2024-03-17, 2024-03-17T08:30Z), quarters (2021-Q1, Q1 2021), English
// month names (Jan 2021, January 2021, 1 Jan 2021, Jan 1, 2021), and
// day/month/year numbers with "/", "." or "-". Day-first and month-first
// are told apart only by a value that proves the order (a field above
// 12); without one the column is refused as ambiguous, with the pattern to
// give. Every cell must be written the same way; the first that is not
// stops the reading with a *DataError about dates.
func (t *Table) Times(col, pattern string) ([]float64, []Note, error) {
	c := t.column(col)
	if c == nil {
		return nil, nil, t.MissingColumn(col)
	}
	slot := t.index[col]
	cells := t.Strings(col)
	at := func(row int, err error, hint string) error {
		return &DataError{File: t.File, Line: t.cellLine(slot, row), Column: col, Text: cells[row], Err: err, Hint: hint}
	}
	vals := make([]float64, len(cells))
	if pattern != "" {
		pat, err := parsePattern(pattern)
		if err != nil {
			return nil, nil, &DataError{File: t.File, Column: col, Err: ErrBadTime, Text: pattern, Hint: err.Error()}
		}
		for i, s := range cells {
			v, ok := matchPattern(s, pat)
			if !ok {
				return nil, nil, at(i, ErrBadTime, fmt.Sprintf("the dates should follow --x-format %s; fix the cell, or give the pattern the column uses", pattern))
			}
			vals[i] = v
		}
		return vals, nil, nil
	}
	// Keep the forms that read every cell so far; the first cell that no
	// remaining form reads is the one to name.
	alive := make([]bool, len(autoForms))
	diedAt := make([]int, len(autoForms)) // row where a form first failed
	first := -1
	for i, s := range cells {
		if strings.TrimSpace(s) == "" {
			return nil, nil, at(i, ErrBadTime, "every row needs an x value; fill it in or delete the row")
		}
		if first < 0 {
			first = i
			for k, f := range autoForms {
				_, alive[k] = f.read(s)
			}
		}
		any := false
		for k, f := range autoForms {
			if !alive[k] {
				continue
			}
			if _, ok := f.read(s); !ok {
				alive[k], diedAt[k] = false, i
				continue
			}
			any = true
		}
		if !any {
			return nil, nil, at(i, ErrBadTime, dateHint(cells[first], s))
		}
	}
	var use []int
	for k := range autoForms {
		if alive[k] {
			use = append(use, k)
		}
	}
	form := autoForms[use[0]]
	if len(use) > 1 && dayMonthPair(autoForms[use[0]].name, autoForms[use[1]].name) {
		a, b := autoForms[use[0]].name, autoForms[use[1]].name
		return nil, nil, at(first, ErrAmbiguousDate,
			fmt.Sprintf("no day is above 12, so the order is not shown; say --x-format %s (day first) or --x-format %s (month first)", a, b))
	}
	for i, s := range cells {
		vals[i], _ = form.read(s)
	}
	var notes []Note
	if !form.iso {
		why := ""
		for k, f := range autoForms {
			if dayMonthPair(form.name, f.name) && !alive[k] && diedAt[k] > first {
				why = fmt.Sprintf(", as %q on line %d shows", cells[diedAt[k]], t.cellLine(slot, diedAt[k]))
			}
		}
		notes = append(notes, Note{Code: "dates", Text: fmt.Sprintf("read column %q as dates written %s%s (say --x-format to choose)", col, form.name, why)})
	}
	return vals, notes, nil
}

// dateHint says how to write a date that does not match the column.
func dateHint(first, bad string) string {
	if first != bad {
		return fmt.Sprintf("the column's dates are written like %q; write every date the same way, or give the pattern with --x-format (such as DD.MM.YYYY)", first)
	}
	return "write dates as 2024-03-17 (ISO 8601), 17/03/2024, Mar 2024 or 2024-Q1, or give the pattern with --x-format (such as DD.MM.YYYY)"
}
