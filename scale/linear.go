package scale

import "math"

// Linear maps the domain [D0, D1] linearly onto the range [R0, R1]. Either
// interval may be reversed (R0 > R1 is the usual case for a vertical axis).
//
// The zero value maps every value to 0. A degenerate domain (D0 == D1) maps
// every value to the middle of the range rather than dividing by zero.
type Linear struct{ D0, D1, R0, R1 float64 }

// Map returns the range position of domain value v. D1 maps exactly to R1
// so that an axis end or a zero baseline lands exactly where it should.
func (s Linear) Map(v float64) float64 {
	return lerp(s.D0, s.D1, s.R0, s.R1, v)
}

// Invert returns the domain value at range position px; it is the inverse of
// Map up to rounding.
func (s Linear) Invert(px float64) float64 {
	return lerp(s.R0, s.R1, s.D0, s.D1, px)
}

// lerp maps v from [a0, a1] onto [b0, b1].
func lerp(a0, a1, b0, b1, v float64) float64 {
	if a0 == a1 {
		// Midpoint, not a NaN: a constant series still gets drawn somewhere sensible.
		return b0/2 + b1/2
	}
	if v == a1 {
		return b1
	}
	da, db := a1-a0, b1-b0
	if math.IsInf(da, 0) || math.IsInf(db, 0) {
		// Intervals wider than MaxFloat64: halve everything so the differences stay finite.
		t := (v/2 - a0/2) / (a1/2 - a0/2)
		return b0 + float64(t*(b1/2-b0/2))*2
	}
	t := (v - a0) / da
	return b0 + float64(t*db)
}
