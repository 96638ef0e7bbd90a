package render

import (
	"errors"
	"fmt"
	"math"
	"strconv"
)

// A RefusalError is a chart plumb will not draw because it would mislead,
// with the reason and the honest alternative. It unwraps to ErrRefused, so
// that errors.Is(err, ErrRefused) tells a refusal from bad input, and
// errors.As gives a caller the two parts to show separately.
type RefusalError struct {
	Reason  string // what is wrong with the request, with the numbers involved
	Instead string // what to draw or ask for instead
}

func (r *RefusalError) Error() string { return r.Reason + "; " + r.Instead }

// Unwrap returns ErrRefused.
func (r *RefusalError) Unwrap() error { return ErrRefused }

// ErrNotFinite is the cause of an OptionError for a NaN or infinite number.
var ErrNotFinite = errors.New("must be a finite number")

// ErrNegative is the cause of an OptionError for a negative size.
var ErrNegative = errors.New("must not be negative")

// ErrTooLarge is the cause of an OptionError for a size beyond MaxSize.
var ErrTooLarge = fmt.Errorf("must be at most %d px", MaxSize)

// MaxSize is the largest canvas side in pixels, the limit the command line
// has always set on --size: beyond any screen, and a metre-wide poster at
// 300 dpi (11,811 px) still fits.
const MaxSize = 20000

// checkSize validates a size in pixels where 0 means "choose".
func checkSize(name string, v float64) error {
	switch {
	case math.IsNaN(v) || math.IsInf(v, 0):
		return &OptionError{Option: name, Value: numValue(v), Err: ErrNotFinite}
	case v < 0:
		return &OptionError{Option: name, Value: numValue(v), Err: ErrNegative}
	case v > MaxSize:
		return &OptionError{Option: name, Value: numValue(v), Err: ErrTooLarge}
	}
	return nil
}

// checkFinite validates an optional number such as a domain bound.
func checkFinite(name string, v *float64) error {
	if v != nil && (math.IsNaN(*v) || math.IsInf(*v, 0)) {
		return &OptionError{Option: name, Value: numValue(*v), Err: ErrNotFinite}
	}
	return nil
}

// bounds lists the bounds that are set, for checkSpan.
func bounds(b ...*float64) []float64 {
	var out []float64
	for _, v := range b {
		if v != nil {
			out = append(out, *v)
		}
	}
	return out
}

// firstError returns the first error that is not nil, so that validation
// reports one option at a time, in the order the options are documented.
func firstError(errs ...error) error {
	for _, err := range errs {
		if err != nil {
			return err
		}
	}
	return nil
}

// checkSpan refuses data whose range is wider than the largest float64:
// such an axis has no finite length per unit, and every position on it
// would be NaN or infinite. what names the values ("y values of the
// series").
func checkSpan(what string, vs ...[]float64) error {
	if lo, hi, ok := dataRange(vs...); ok && math.IsInf(hi-lo, 0) {
		return fmt.Errorf("the %s run from %g to %g, a range wider than the largest number (%.1e): divide them by a power of ten first", what, lo, hi, math.MaxFloat64)
	}
	return nil
}

// numValue is an option's number as an OptionError quotes it.
func numValue(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
