package table

import (
	"errors"
	"fmt"
	"strconv"
	"strings"
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
	ErrBadTime         = errors.New("not a date or time")
	// ErrMixedNumbers is a bad number in a column whose other cells are
	// written another way; errors.Is(err, ErrBadNumber) holds too.
	ErrMixedNumbers = fmt.Errorf("%w: numbers written in more than one way", ErrBadNumber)
	// ErrAmbiguousDate is a column of dates whose day/month order no value
	// proves; errors.Is(err, ErrBadTime) holds too.
	ErrAmbiguousDate = fmt.Errorf("%w: ambiguous day and month order", ErrBadTime)
	ErrTooLarge      = errors.New("input too large")
	ErrLineTooLong   = errors.New("line too long")
	ErrBinary        = errors.New("not a text file")
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
	b.WriteString(DisplayName(e.File))
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
		b.WriteString(OneLine(e.Hint))
	}
	return b.String()
}

// what says what is wrong, in words built around the offending text.
func (e *DataError) what() string {
	switch {
	case e.Err == nil:
		return "unknown error"
	case errors.Is(e.Err, ErrAmbiguousDate):
		return fmt.Sprintf("cannot tell the day from the month in dates such as %q", e.Text)
	case errors.Is(e.Err, ErrBadTime):
		return fmt.Sprintf("cannot read %q as a date", e.Text)
	case errors.Is(e.Err, ErrMixedNumbers):
		return fmt.Sprintf("%q is written differently from the numbers above it", e.Text)
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
	case errors.Is(e.Err, ErrTooLarge):
		return "the input is larger than the limit"
	case errors.Is(e.Err, ErrLineTooLong):
		return "a line is longer than the limit"
	case errors.Is(e.Err, ErrBinary):
		return "the input holds NUL bytes, so it is not a text table"
	}
	return OneLine(e.Err.Error())
}

// Unwrap returns the cause, so that errors.Is(err, ErrBadNumber) works.
func (e *DataError) Unwrap() error { return e.Err }

// DisplayName is how a file is named in messages.
func DisplayName(file string) string {
	switch file {
	case "-":
		return "standard input"
	case "":
		return "input"
	}
	return OneLine(file)
}

// OneLine keeps a message on one line even when a name or cause holds a line
// break, so that a message is always exactly one line on a terminal.
func OneLine(s string) string {
	if !strings.ContainsAny(s, "\r\n") {
		return s
	}
	q := strconv.Quote(s)
	return q[1 : len(q)-1]
}

// Note records a decision the reader made for the user: how it read the
// separator, the numbers or the dates, how many cells were missing. Code is
// stable for scripts; Changed says whether the data drawn differs from the
// file's cells (a shortened label, a skipped row), as opposed to a reading
// that keeps every value.
type Note struct {
	Code    string
	Text    string
	Changed bool
}
