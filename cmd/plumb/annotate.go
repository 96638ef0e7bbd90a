package main

import (
	"encoding/csv"
	"errors"
	"math"
	"strconv"
	"strings"
	"time"

	"plumb/internal/table"
	"plumb/render"
)

// The annotation flags every chart shares: --ref, --event, --period and
// --callout, each repeatable, each adding one annotation to the chart's
// render.Annotations. Each value is read when its flag is parsed, so that
// a mistake is reported as "--ref abc: ..." with what would work.

// annotationFlags are the shared flags bound to c.Annotations.
func annotationFlags(c *render.Common) []flagDef {
	a := &c.Annotations
	return []flagDef{
		{name: "ref", sets: []string{"Refs"}, arg: "VALUE[=TEXT]", repeat: true, usage: "a labelled reference line across the value axis at VALUE: a number, mean or median (of the data); repeat the flag for more",
			value: annotationValue{set: func(s string) error { return addRef(a, s) }}},
		{name: "event", sets: []string{"Events"}, arg: "X=TEXT", repeat: true, usage: "a line marking one x, a number or a date written as the x column writes it, labelled TEXT; repeat the flag for more",
			value: annotationValue{set: func(s string) error { return addEvent(a, s) }}},
		{name: "period", sets: []string{"Periods"}, arg: "FROM..TO=TEXT", repeat: true, usage: "shade the span of x from FROM to TO behind the data, labelled TEXT; repeat the flag for more",
			value: annotationValue{set: func(s string) error { return addPeriod(a, s) }}},
		{name: "callout", sets: []string{"Callouts"}, arg: "LABEL=TEXT", repeat: true, usage: "a short note TEXT beside the bar or dot of the category LABEL; repeat the flag for more",
			value: annotationValue{set: func(s string) error { return addCallout(a, s) }}},
	}
}

// annotationValue is a repeatable flag that adds one annotation per use.
type annotationValue struct{ set func(string) error }

func (v annotationValue) String() string     { return "" }
func (v annotationValue) Set(s string) error { return v.set(s) }

// cutText splits "HEAD=TEXT" at its first "=": the text may hold "=",
// the head (a value, a date, a label) does not.
func cutText(s string) (head, text string, ok bool) {
	head, text, ok = strings.Cut(s, "=")
	return strings.TrimSpace(head), strings.TrimSpace(text), ok
}

// addRef reads --ref VALUE[=TEXT].
func addRef(a *render.Annotations, s string) error {
	head, text, _ := cutText(s)
	r := render.Ref{Text: text}
	switch strings.ToLower(head) {
	case render.StatMean, render.StatMedian:
		r.Stat = strings.ToLower(head)
	default:
		v, ok := plainNumber(head)
		if !ok {
			return errors.New("give the line's value as a number, mean or median, then =TEXT for its label (--ref 100=Target)")
		}
		r.Value = v
	}
	a.Refs = append(a.Refs, r)
	return nil
}

// addEvent reads --event X=TEXT.
func addEvent(a *render.Annotations, s string) error {
	head, text, _ := cutText(s)
	x, at, err := annotationX(head)
	if err != nil {
		return err
	}
	a.Events = append(a.Events, render.Event{X: x, At: at, Text: text})
	return nil
}

// addPeriod reads --period FROM..TO=TEXT. Both ends must read the same
// way, as numbers or as dates; bare years read as both.
func addPeriod(a *render.Annotations, s string) error {
	head, text, _ := cutText(s)
	from, to, ok := strings.Cut(head, "..")
	if !ok {
		return errors.New("give the span as FROM..TO=TEXT, such as 2021-03..2021-06=Harbour works")
	}
	x0, at0, err := annotationX(strings.TrimSpace(from))
	if err != nil {
		return err
	}
	x1, at1, err := annotationX(strings.TrimSpace(to))
	if err != nil {
		return err
	}
	p := render.Period{Text: text}
	numbers := !isDateOnly(x0, at0) && !isDateOnly(x1, at1)
	dates := !at0.IsZero() && !at1.IsZero()
	if numbers {
		p.From, p.To = x0, x1
	}
	if dates {
		p.FromAt, p.ToAt = at0, at1
	}
	switch {
	case !numbers && !dates:
		return errors.New("give both ends as numbers, or both as dates")
	case numbers && !(p.From < p.To), dates && !p.FromAt.Before(p.ToAt):
		return errors.New("the span's start is not before its end: give the earlier end first, FROM..TO")
	}
	a.Periods = append(a.Periods, p)
	return nil
}

// isDateOnly reports an x read as a date and not as a number.
func isDateOnly(x float64, at time.Time) bool { return !at.IsZero() && x == 0 }

// addCallout reads --callout LABEL=TEXT.
func addCallout(a *render.Annotations, s string) error {
	label, text, ok := cutText(s)
	if !ok || label == "" || text == "" {
		return errors.New("give the category's label and the note as LABEL=TEXT, such as --callout \"Great Osk=new pier\"")
	}
	a.Callouts = append(a.Callouts, render.Callout{Label: label, Text: text})
	return nil
}

// annotationX reads an x value of an event or a period end: a number, a date as
// data files write them (ISO 8601, quarters, month names, day and month
// numbers when the order is clear), or both for a bare year such as 2020,
// which fits a number axis of years and a date axis alike.
func annotationX(s string) (float64, time.Time, error) {
	v, num := plainNumber(s)
	at, date := readDate(s)
	switch {
	case num && date && isYear(s):
		return v, at, nil
	case num:
		return v, time.Time{}, nil
	case date:
		return 0, at, nil
	}
	return 0, time.Time{}, errors.New("give x as a number or a date such as 2024-03-17, Mar 2024 or 2024-Q1 (with =TEXT for the label)")
}

// isYear reports a bare four-digit year.
func isYear(s string) bool {
	if len(s) != 4 {
		return false
	}
	for _, r := range s {
		if r < '0' || r > '9' {
			return false
		}
	}
	return true
}

// plainNumber reads a finite number; NaN and infinities are not values.
func plainNumber(s string) (float64, bool) {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, false
	}
	return v, true
}

// readDate reads a date the way a data file's date column is read, by the
// same reader, so that --event takes any date the x column could hold. A
// form it cannot tell apart (03/04/2024: day or month first?) is not a
// date here; the message suggests ISO 8601.
func readDate(s string) (time.Time, bool) {
	if strings.TrimSpace(s) == "" {
		return time.Time{}, false
	}
	var b strings.Builder
	w := csv.NewWriter(&b)
	if w.Write([]string{"x"}) != nil || w.Write([]string{s}) != nil {
		return time.Time{}, false
	}
	w.Flush()
	t, err := (&table.Reader{Format: "csv"}).Read(strings.NewReader(b.String()), "--event")
	if err != nil {
		return time.Time{}, false
	}
	vs, _, err := t.Times("x", "")
	if err != nil || len(vs) != 1 {
		return time.Time{}, false
	}
	sec := math.Floor(vs[0])
	return time.Unix(int64(sec), int64(math.Round((vs[0]-sec)*1e9))).UTC(), true
}
