package scale

import (
	"math"
	"slices"
	"strconv"
	"strings"
)

// Format prints the numbers of one axis or one set of value labels alike.
// The zero value prints integers without separators, suffix or unit.
type Format struct {
	Decimals int     // shared digits after the decimal point
	Divisor  float64 // 1, 1e3, 1e6, 1e9, 1e12, or a power of ten for ×10ⁿ notation (0 treated as 1)
	Suffix   string  // "", "k", "M", "B", "T" or "×10ⁿ": one abbreviation for the whole axis
	Unit     string  // "%" follows with no space, a currency sign leads ("£12.50"), anything else follows a space ("12 kg")
	// Group inserts thousands separators (",") into every value with four or
	// more integer digits. TickFormat and ValueFormat set it only when some
	// value has five or more, so years such as 2024 stay "2024" unless the
	// same axis also shows "12,500", and then all of them are grouped alike.
	Group bool
}

// minusSign is U+2212: a hyphen is too short to read as a minus in most fonts (common practice).
const minusSign = "\u2212"

// maxFormatDecimals bounds Decimals; 330 digits reach the smallest subnormal.
const maxFormatDecimals = 330

// Format returns v divided by the divisor, rounded to Decimals digits, with
// the suffix and unit. Negative values carry U+2212 MINUS SIGN; a value
// that rounds to zero never prints as "-0". An exact zero on an abbreviated
// axis prints as plain "0" ("0", "0.5M", "1.0M"), because "0M" reads as a
// quantity of millions. NaN prints as "NaN" and infinities as "∞".
func (f Format) Format(v float64) string {
	div := f.Divisor
	if !(div > 0) || math.IsInf(div, 0) {
		div = 1
	}
	var b strings.Builder
	switch x := v / div; {
	case math.IsNaN(v):
		b.WriteString("NaN")
	case math.IsInf(x, 0):
		if x < 0 {
			b.WriteString(minusSign)
		}
		b.WriteString("∞")
	case v == 0 && f.Suffix != "":
		if IsCurrency(f.Unit) {
			b.WriteString(f.Unit)
		}
		b.WriteString("0")
	default:
		d := min(max(f.Decimals, 0), maxFormatDecimals)
		s := strconv.FormatFloat(math.Abs(x), 'f', d, 64)
		if x < 0 && strings.ContainsAny(s, "123456789") {
			b.WriteString(minusSign)
		}
		if IsCurrency(f.Unit) {
			b.WriteString(f.Unit)
		}
		if f.Group {
			s = group(s)
		}
		b.WriteString(s)
		b.WriteString(f.Suffix)
	}
	switch {
	case f.Unit == "" || IsCurrency(f.Unit):
	case f.Unit == "%":
		b.WriteString("%")
	default:
		b.WriteString(" ")
		b.WriteString(f.Unit)
	}
	return b.String()
}

// group inserts a comma between each three integer digits of an unsigned
// decimal when there are at least four.
func group(s string) string {
	intLen := strings.IndexByte(s, '.')
	if intLen < 0 {
		intLen = len(s)
	}
	if intLen < 4 {
		return s
	}
	var b strings.Builder
	b.Grow(len(s) + intLen/3)
	for i := 0; i < intLen; i++ {
		if i > 0 && (intLen-i)%3 == 0 {
			b.WriteByte(',')
		}
		b.WriteByte(s[i])
	}
	b.WriteString(s[intLen:])
	return b.String()
}

// Abbreviations, largest first: plain English short-scale initials.
var abbreviations = [...]struct {
	div    float64
	suffix string
}{{1e12, "T"}, {1e9, "B"}, {1e6, "M"}, {1e3, "k"}}

// magnitude picks the divisor and suffix for numbers whose largest absolute
// value is a:
//
//	a < 1e-4        ×10⁻ⁿ, n a multiple of 3 (20×10⁻⁶)
//	1e-4 <= a < 1e4 none (0.00025, 9500)
//	1e4 <= a < 1e6  k    (12.5k)
//	1e6 <= a < 1e9  M, then B below 1e12 and T below 1e15
//	a >= 1e15       ×10ⁿ, n a multiple of 3
func magnitude(a float64) (div float64, suffix string) {
	switch {
	case !(a > 0) || math.IsInf(a, 0) || (a >= 1e-4 && a < 1e4):
		return 1, ""
	case a < 1e-4 || a >= 1e15:
		n := floorLog10(a)
		n -= ((n % 3) + 3) % 3 // floor to a multiple of 3
		return math.Pow10(n), "×10" + superscript(n)
	}
	for _, ab := range abbreviations {
		if a >= ab.div {
			return ab.div, ab.suffix
		}
	}
	return 1, ""
}

// superscript writes n with Unicode superscript digits.
func superscript(n int) string {
	digits := [10]string{"⁰", "¹", "²", "³", "⁴", "⁵", "⁶", "⁷", "⁸", "⁹"}
	var b strings.Builder
	if n < 0 {
		b.WriteString("⁻")
		n = -n
	}
	for _, c := range strconv.Itoa(n) {
		b.WriteString(digits[c-'0'])
	}
	return b.String()
}

// maxTickDecimals bounds the search for exact tick decimals; float64 holds 17
// significant digits, so more never separates two values.
const maxTickDecimals = 17

// TickFormat picks one Format for the ticks of an axis.
//
// Ticks whose largest magnitude is 1e4 or more are abbreviated by the rule of
// magnitude (k, M, B, T) provided the abbreviated labels need at most two
// decimals; otherwise ("1.025M", "10.001k") they are printed in full with
// thousands separators ("1,025,000"), which reads better than three or more
// decimals of an abbreviation. The decimals are the fewest that print every
// tick exactly (to 1e-10 of the largest) and keep distinct ticks distinct,
// the same for all ticks: 0.0, 0.5, 1.0. NaN and infinite ticks are ignored.
func TickFormat(ticks []float64, unit string) Format {
	a := maxAbs(ticks)
	div, suffix := magnitude(a)
	f := Format{Divisor: div, Suffix: suffix, Unit: unit}
	f.Decimals, _ = exactDecimals(ticks, div, maxTickDecimals)
	if div > 1 && div < 1e15 && f.Decimals > 2 {
		f.Divisor, f.Suffix = 1, ""
		f.Decimals, _ = exactDecimals(ticks, 1, maxTickDecimals)
	}
	f.Group = needsGroup(ticks, f)
	return f
}

// ValueFormat picks one Format for data value labels such as those at bar
// ends. It abbreviates by the rule of magnitude (see TickFormat), always,
// since value labels are read one at a time. The decimals show the largest
// magnitude with three significant digits (2.46M, 12.3, 0.0123), or fewer
// when fewer print every value exactly: integers below 1e4 get none. NaN and
// infinite values are ignored.
func ValueFormat(values []float64, unit string) Format {
	a := maxAbs(values)
	div, suffix := magnitude(a)
	f := Format{Divisor: div, Suffix: suffix, Unit: unit}
	if a > 0 && !math.IsInf(a, 0) {
		sig := max(0, 2-floorLog10(a/div))
		if d, exact := exactDecimals(values, div, sig); exact {
			f.Decimals = d
		} else {
			f.Decimals = sig
		}
	}
	// Amounts of money with any fraction show whole cents (common practice).
	if IsCurrency(unit) && f.Decimals == 1 && div == 1 {
		f.Decimals = 2
	}
	f.Group = needsGroup(values, f)
	return f
}

// IsCurrency reports whether a unit is a currency sign, written before the
// number ("£12.50", "−$3") as is usual in English (common practice).
func IsCurrency(unit string) bool {
	switch unit {
	case "$", "£", "€", "¥", "₹", "₩", "US$", "A$", "C$":
		return true
	}
	return false
}

// maxAbs returns the largest finite |v|, or 0.
func maxAbs(vs []float64) float64 {
	a := 0.0
	for _, v := range vs {
		if isFinite(v) {
			a = max(a, math.Abs(v))
		}
	}
	return a
}

// exactDecimals returns the fewest decimals d <= limit that print every
// finite v/div exactly and give distinct values distinct strings, and
// whether such a d exists. Exact means within a tolerance that ignores float
// noise: 1e-10 of the largest |v/div|, or 1e-6 of the smallest gap between
// values if that is finer, but never below a few ulps of the largest. When
// no d is exact it returns the fewest that keeps values distinct, else limit.
func exactDecimals(vs []float64, div float64, limit int) (int, bool) {
	xs := make([]float64, 0, len(vs))
	for _, v := range vs {
		if x := v / div; isFinite(x) {
			xs = append(xs, x)
		}
	}
	slices.Sort(xs)
	a := maxAbs(xs)
	tol := 1e-10 * a
	for i := 1; i < len(xs); i++ {
		if gap := xs[i] - xs[i-1]; gap > 0 {
			tol = min(tol, 1e-6*gap)
		}
	}
	tol = max(tol, 8*(math.Nextafter(a, math.Inf(1))-a))
	strs := make([]string, len(xs))
	distinctAt := -1
	for d := 0; d <= limit; d++ {
		exact, distinct := true, true
		for i, x := range xs {
			strs[i] = strconv.FormatFloat(x, 'f', d, 64)
			if y, _ := strconv.ParseFloat(strs[i], 64); math.Abs(y-x) > tol {
				exact = false
			}
			if i > 0 && x-xs[i-1] > tol && strs[i] == strs[i-1] {
				distinct = false
				break
			}
		}
		if distinct && exact {
			return d, true
		}
		if distinct && distinctAt < 0 {
			distinctAt = d
		}
	}
	if distinctAt >= 0 {
		return distinctAt, false
	}
	return limit, false
}

// needsGroup reports whether any value, as f rounds it, has five or more
// integer digits.
func needsGroup(vs []float64, f Format) bool {
	div := f.Divisor
	if !(div > 0) {
		div = 1
	}
	for _, v := range vs {
		x := math.Abs(v / div)
		if !isFinite(x) {
			continue
		}
		if y, _ := strconv.ParseFloat(strconv.FormatFloat(x, 'f', f.Decimals, 64), 64); y >= 1e4 {
			return true
		}
	}
	return false
}
