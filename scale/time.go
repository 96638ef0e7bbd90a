package scale

import (
	"errors"
	"fmt"
	"strings"
	"time"
)

// TimePrecision is the finest calendar field written in a parsed time value.
// Smaller values are coarser: a column whose values mix "2024" and
// "2024-03" has precision PrecisionYear. The zero value, PrecisionNone, means
// "not a time".
type TimePrecision int

// The precisions ParseTime reports, from coarsest to finest.
const (
	PrecisionNone      TimePrecision = iota // not a time value
	PrecisionYear                           // "2024"
	PrecisionMonth                          // "2024-03"
	PrecisionDay                            // "2024-03-17"
	PrecisionMinute                         // "2024-03-17T08:30"
	PrecisionSecond                         // "2024-03-17T08:30:00"
	PrecisionSubsecond                      // "2024-03-17T08:30:00.25"
)

var precisionNames = [...]string{"none", "year", "month", "day", "minute", "second", "subsecond"}

// String returns the lower-case name of the precision, such as "month".
func (p TimePrecision) String() string {
	if p < 0 || int(p) >= len(precisionNames) {
		return fmt.Sprintf("TimePrecision(%d)", int(p))
	}
	return precisionNames[p]
}

// ErrTime is the cause wrapped by every error ParseTime returns, so that
// callers can test for it with errors.Is.
var ErrTime = errors.New("not an ISO 8601 date or time")

// timeExpectedForms lists the accepted forms; it ends every syntax error so that
// the message says what the input should have looked like.
const timeExpectedForms = "expected 2024, 2024-03, 2024-03-17, 2024-03-17T08:30, " +
	"2024-03-17T08:30:00 (optionally with .fraction, Z or ±hh:mm; a space may replace T)"

// timeError builds an error that names the input, the problem and the
// accepted forms, and wraps ErrTime.
func timeError(s, problem string) error {
	return fmt.Errorf("parse time %q: %s: %w; %s", s, problem, ErrTime, timeExpectedForms)
}

// ParseTime parses the ISO 8601 / RFC 3339 calendar forms a data column
// usually holds:
//
//	2024
//	2024-03
//	2024-03-17
//	2024-03-17T08:30
//	2024-03-17T08:30:00
//	2024-03-17T08:30:00.123456789
//
// A space may replace the T. A time of day may carry a zone designator: Z, or
// an offset ±hh:mm (also ±hhmm or ±hh). Values without a designator are UTC.
// The result is always in UTC. Surrounding white space is ignored. Leap
// seconds (second 60) and hour 24 are rejected because time.Time cannot hold
// them without moving the instant. The reported precision is the finest field
// present in s.
func ParseTime(s string) (time.Time, TimePrecision, error) {
	in := s
	s = strings.TrimSpace(s)
	p := timeParser{s: s}
	year, ok := p.digits(4)
	if !ok {
		return time.Time{}, PrecisionNone, timeError(in, "want a four-digit year")
	}
	month, day := 1, 1
	hour, min, sec, nsec := 0, 0, 0, 0
	prec := PrecisionYear
	loc := time.UTC
	if p.done() {
		goto build
	}
	if !p.byte('-') {
		return time.Time{}, PrecisionNone, timeError(in, "want '-' after the year")
	}
	if month, ok = p.digits(2); !ok {
		return time.Time{}, PrecisionNone, timeError(in, "want a two-digit month")
	}
	if month < 1 || month > 12 {
		return time.Time{}, PrecisionNone, timeError(in, fmt.Sprintf("month %02d out of range 01-12", month))
	}
	prec = PrecisionMonth
	if p.done() {
		goto build
	}
	if !p.byte('-') {
		return time.Time{}, PrecisionNone, timeError(in, "want '-' after the month")
	}
	if day, ok = p.digits(2); !ok {
		return time.Time{}, PrecisionNone, timeError(in, "want a two-digit day")
	}
	if n := calendarDays(year, month); day < 1 || day > n {
		return time.Time{}, PrecisionNone, timeError(in,
			fmt.Sprintf("day %02d out of range 01-%02d for %04d-%02d", day, n, year, month))
	}
	prec = PrecisionDay
	if p.done() {
		goto build
	}
	if !p.byte('T') && !p.byte('t') && !p.byte(' ') {
		return time.Time{}, PrecisionNone, timeError(in, "want 'T' or a space before the time of day")
	}
	if hour, ok = p.digits(2); !ok || hour > 23 {
		return time.Time{}, PrecisionNone, timeError(in, "want a two-digit hour 00-23")
	}
	if !p.byte(':') {
		return time.Time{}, PrecisionNone, timeError(in, "want ':' after the hour")
	}
	if min, ok = p.digits(2); !ok || min > 59 {
		return time.Time{}, PrecisionNone, timeError(in, "want two-digit minutes 00-59")
	}
	prec = PrecisionMinute
	if p.byte(':') {
		if sec, ok = p.digits(2); !ok || sec > 59 {
			return time.Time{}, PrecisionNone, timeError(in, "want two-digit seconds 00-59")
		}
		prec = PrecisionSecond
		if p.byte('.') || p.byte(',') {
			n, k := p.fraction()
			if k == 0 {
				return time.Time{}, PrecisionNone, timeError(in, "want digits after the decimal mark")
			}
			if k > 9 {
				return time.Time{}, PrecisionNone, timeError(in, "more than nine fractional digits")
			}
			nsec = n
			prec = PrecisionSubsecond
		}
	}
	if !p.done() {
		var err string
		if loc, err = p.zone(); err != "" {
			return time.Time{}, PrecisionNone, timeError(in, err)
		}
	}
	if !p.done() {
		return time.Time{}, PrecisionNone, timeError(in, fmt.Sprintf("unexpected %q after the time", p.s[p.i:]))
	}
build:
	t := time.Date(year, time.Month(month), day, hour, min, sec, nsec, loc).UTC()
	if y := t.Year(); y < 0 || y > 9999 {
		// Only an offset can push 0000-01-01 or 9999-12-31 out of range; RFC
		// 3339 has no form for the result.
		return time.Time{}, PrecisionNone, timeError(in, "the offset moves the instant outside years 0000-9999")
	}
	return t, prec, nil
}

// calendarDays returns the number of days in the month of the proleptic Gregorian
// calendar.
func calendarDays(year, month int) int {
	switch month {
	case 2:
		if year%4 == 0 && (year%100 != 0 || year%400 == 0) {
			return 29
		}
		return 28
	case 4, 6, 9, 11:
		return 30
	}
	return 31
}

// timeParser walks a string byte by byte; the methods advance only on success.
type timeParser struct {
	s string
	i int
}

func (p *timeParser) done() bool { return p.i >= len(p.s) }

func (p *timeParser) byte(c byte) bool {
	if p.i < len(p.s) && p.s[p.i] == c {
		p.i++
		return true
	}
	return false
}

// digits reads exactly n ASCII digits.
func (p *timeParser) digits(n int) (int, bool) {
	if p.i+n > len(p.s) {
		return 0, false
	}
	v := 0
	for _, c := range []byte(p.s[p.i : p.i+n]) {
		if c < '0' || c > '9' {
			return 0, false
		}
		v = v*10 + int(c-'0')
	}
	p.i += n
	return v, true
}

// fraction reads a run of digits as nanoseconds and reports how many digits
// it read (at most ten are consumed, enough to detect an over-long fraction).
func (p *timeParser) fraction() (nsec, k int) {
	for p.i < len(p.s) && p.s[p.i] >= '0' && p.s[p.i] <= '9' && k < 10 {
		if k < 9 {
			nsec = nsec*10 + int(p.s[p.i]-'0')
		}
		p.i++
		k++
	}
	for j := k; j < 9; j++ {
		nsec *= 10
	}
	return nsec, k
}

// zone reads Z or an offset ±hh[:mm] / ±hhmm and returns a fixed zone.
func (p *timeParser) zone() (*time.Location, string) {
	if p.byte('Z') || p.byte('z') {
		return time.UTC, ""
	}
	sign := 1
	switch {
	case p.byte('+'):
	case p.byte('-'):
		sign = -1
	default:
		return nil, fmt.Sprintf("unexpected %q after the time; want Z or an offset such as +02:00", p.s[p.i:])
	}
	hh, ok := p.digits(2)
	if !ok || hh > 23 {
		return nil, "want a two-digit offset hour 00-23"
	}
	mm := 0
	if !p.done() {
		p.byte(':')
		if mm, ok = p.digits(2); !ok || mm > 59 {
			return nil, "want two-digit offset minutes 00-59"
		}
	}
	off := sign * (hh*3600 + mm*60)
	if off == 0 {
		return time.UTC, ""
	}
	return time.FixedZone("", off), ""
}

// DetectTime reports whether every non-empty sample (after trimming white
// space) parses with ParseTime, and the coarsest precision among them.
//
// A column of bare four-digit numbers ("1999", "2024") is ambiguous: it may
// hold years or plain quantities. DetectTime does not guess: for such a column
// it returns ok == false with p == PrecisionYear, so that a caller treats the
// column as time only when the user asks for it (for example with an explicit
// x format) and can then parse it with ParseTime. A column with no non-empty
// sample is not time.
func DetectTime(samples []string) (ok bool, p TimePrecision) {
	coarsest := PrecisionNone
	seen := false
	for _, s := range samples {
		if strings.TrimSpace(s) == "" {
			continue
		}
		_, q, err := ParseTime(s)
		if err != nil {
			return false, PrecisionNone
		}
		if !seen || q < coarsest {
			coarsest = q
		}
		seen = true
	}
	if !seen {
		return false, PrecisionNone
	}
	if coarsest == PrecisionYear && allYearOnly(samples) {
		return false, PrecisionYear
	}
	return true, coarsest
}

// allYearOnly reports whether every non-empty sample is a bare year.
func allYearOnly(samples []string) bool {
	for _, s := range samples {
		if s = strings.TrimSpace(s); s != "" && len(s) != 4 {
			return false
		}
	}
	return true
}
