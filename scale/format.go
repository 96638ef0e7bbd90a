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
	// Short ignores Divisor, Suffix and Group and prints each value with
	// three significant digits and its own abbreviation, Decimals bounding
	// the digits after the point of values below 1,000 (see
	// ShortValueFormat).
	Short bool
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
	case f.Short:
		s := short(math.Abs(v), f.Decimals)
		if v < 0 && s != "0" {
			b.WriteString(minusSign)
		}
		if IsCurrency(f.Unit) {
			b.WriteString(f.Unit)
		}
		b.WriteString(s)
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
// ends, where each label is read as a number on its own.
//
// The decimals are the fewest that give the largest value three
// significant digits (2.46M, 12.3, 0.0123) and print any two values that
// differ at three significant digits differently (17.4 and 17.0, not 17
// and 17), but never more than the data itself shows: integers below 1e4
// get none, and 17.4 beside 17 gives "17.4" and "17.0".
//
// Values are abbreviated by the rule of magnitude (see TickFormat) only when
// the abbreviation keeps at least three significant digits of every nonzero
// value, or prints it exactly, with at most two decimals: 118,750 among
// millions prints "118,750", never "0.12M", and the whole set is then
// printed in full with thousands separators. NaN and infinite values are
// ignored.
func ValueFormat(values []float64, unit string) Format {
	div, suffix := magnitude(maxAbs(values))
	if div != 1 {
		if f, ok := valueFormatAt(values, unit, div, suffix); ok {
			return f
		}
	}
	f, _ := valueFormatAt(values, unit, 1, "")
	return f
}

// ShortValueFormat is a Format for labels that must be narrow, such as
// values above thin columns: each value is rounded to three significant
// digits and abbreviated on its own from 1,000 on ("$3.23M", "$119k",
// "$95.0k"). Values below 1,000 show no more decimals than the data itself
// does (17.4 and 17.0, but 12 and 7). Values that differ at three
// significant digits still print differently; the abbreviation may differ
// from label to label, which suits labels read one at a time but not an
// axis. NaN and infinite values are ignored.
func ShortValueFormat(values []float64, unit string) Format {
	own, _ := exactDecimals(values, 1, maxTickDecimals)
	return Format{Unit: unit, Short: true, Decimals: max(own, distinctDecimals(values, 1))}
}

// short prints |v| rounded to three significant digits with its own
// abbreviation, without sign or unit, and at most own decimals when not
// abbreviated.
func short(a float64, own int) string {
	x := round3(a)
	if x == 0 {
		return "0"
	}
	div, suffix := magnitude(x)
	if div == 1 && x >= 1e3 {
		div, suffix = 1e3, "k"
	}
	y := x / div
	d := max(0, 2-floorLog10(y))
	if div == 1 {
		d = min(d, max(own, 0))
	}
	return strconv.FormatFloat(y, 'f', d, 64) + suffix
}

// valueFormatAt chooses the decimals for values divided by div and reports
// whether an abbreviation (div != 1) keeps three significant digits of
// every value as ValueFormat requires.
func valueFormatAt(values []float64, unit string, div float64, suffix string) (Format, bool) {
	f := decimalsAt(values, unit, div, suffix)
	if div == 1 || div < 1 || div >= 1e15 {
		// ×10ⁿ notation has no plain alternative worth reading.
		return f, true
	}
	if f.Decimals > 2 {
		return f, false
	}
	for _, v := range values {
		x := v / div
		if !isFinite(x) || x == 0 {
			continue
		}
		s := strconv.FormatFloat(math.Abs(x), 'f', f.Decimals, 64)
		if y, _ := strconv.ParseFloat(s, 64); math.Abs(y-math.Abs(x)) <= 1e-9*math.Abs(x) {
			continue // printed exactly: 95k is 95,000
		}
		if significantDigits(s) < 3 {
			return f, false
		}
	}
	return f, true
}

// decimalsAt is the Format of values divided by div with ValueFormat's
// decimals: three significant digits for the largest, distinct text for
// values that differ at three significant digits, at most the data's own.
func decimalsAt(values []float64, unit string, div float64, suffix string) Format {
	f := Format{Divisor: div, Suffix: suffix, Unit: unit}
	a := maxAbs(values) / div
	if a > 0 && isFinite(a) {
		own, _ := exactDecimals(values, div, maxTickDecimals)
		// Distinct text wins over the data's own decimals, whose tolerance
		// calls 0.000002 beside 95,999 "exact" at none.
		f.Decimals = max(min(own, max(0, 2-floorLog10(a))), distinctDecimals(values, div))
	}
	// Amounts of money with any fraction show whole cents (common practice).
	if IsCurrency(unit) && f.Decimals == 1 && div == 1 {
		f.Decimals = 2
	}
	f.Group = needsGroup(values, f)
	return f
}

// distinctDecimals is the fewest decimals that print any two finite values
// (divided by div) differently when they differ at three significant
// digits. Checking neighbours in sorted order suffices: rounding is
// monotonic, so two values that print alike take every value between them
// along.
func distinctDecimals(values []float64, div float64) int {
	xs := make([]float64, 0, len(values))
	for _, v := range values {
		if isFinite(v) && isFinite(v/div) {
			xs = append(xs, v)
		}
	}
	slices.Sort(xs)
	// A coarser d may separate a pair that a finer one joins (0.47 and
	// 0.52 are "0" and "1" but "0.5" and "0.5"), so each d checks all pairs.
	for d := 0; d < maxTickDecimals; d++ {
		ok := true
		for i := 1; i < len(xs) && ok; i++ {
			a, b := xs[i-1], xs[i]
			ok = round3(a) == round3(b) || fixed(a/div, d) != fixed(b/div, d)
		}
		if ok {
			return d
		}
	}
	return maxTickDecimals
}

// fixed prints x with d decimals as Format does: no sign on a zero.
func fixed(x float64, d int) string {
	s := strconv.FormatFloat(x, 'f', d, 64)
	if !strings.ContainsAny(s, "123456789") {
		return strings.TrimPrefix(s, "-")
	}
	return s
}

// round3 rounds v to three significant digits (-0 equals 0).
func round3(v float64) float64 {
	x, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'g', 3, 64), 64)
	return x
}

// significantDigits counts the significant digits of an unsigned decimal:
// its digits less the leading zeros ("0.12" has 2, "12.0" has 3).
func significantDigits(s string) int {
	n, lead := 0, true
	for _, c := range s {
		if c < '0' || c > '9' {
			continue
		}
		if lead && c == '0' {
			continue
		}
		lead = false
		n++
	}
	return n
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
