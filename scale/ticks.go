package scale

import (
	"math"
	"strconv"
)

// Ticks is a labelling of an axis. Values are len(Values) numbers
// Values[0] + i·Step, each computed directly (never accumulated), so the
// error of one value does not carry into the next.
type Ticks struct {
	Values   []float64
	Step     float64
	Decimals int // digits after the point needed to print every value exactly and alike
}

// MaxTicks bounds the requested tick count m. The search visits about m²
// candidates, so an unbounded m would let a caller's typo stall a render.
const MaxTicks = 1000

// niceQ lists the nice step mantissas, most preferred first
// (Talbot, Lin & Hanrahan 2010; R labeling::extended default Q).
var niceQ = [...]float64{1, 5, 2, 2.5, 4, 3}

// Weights of simplicity, coverage, density and legibility
// (Talbot, Lin & Hanrahan 2010; R labeling::extended default w, methods.md §1.2).
const (
	wSimplicity  = 0.25
	wCoverage    = 0.2
	wDensity     = 0.5
	wLegibility  = 0.05
	legibility   = 1                           // R fixes legibility at 1 (methods.md §1.2)
	rangeEpsilon = 100 * 2.220446049250313e-16 // R's 100*.Machine$double.eps, an absolute tolerance
	sqrtMaxFloat = 1.3407807929942596e+154     // sqrt(DBL_MAX); R's huge-range guard (labeling 0.4.2)
)

// labelling is one candidate of the search: labels (start + t·j)·q·10^z for
// t = 0..k-1, with the component scores kept for tests.
type labelling struct {
	q          float64
	j, k, z    int
	start      float64 // integer-valued
	lmin, step float64
	s, c, d    float64
	score      float64
}

// Extended returns about m ticks for the data range [dmin, dmax] chosen by the
// extended Wilkinson algorithm (Talbot, Lin & Hanrahan 2010), transcribed from
// R's labeling::extended with its defaults: Q = 1, 5, 2, 2.5, 4, 3;
// weights .25, .2, .5, .05; legibility fixed at 1. With onlyLoose the first
// tick is <= dmin and the last >= dmax.
//
// As in R, dmin > dmax are swapped, and a range narrower than 2.22e-14 or
// wider than sqrt(MaxFloat64) gives m evenly spaced values from dmin to dmax
// (use NiceDomain for a renderer's axis; it widens such ranges). Unlike R,
// exactly k values are returned where R's seq may drop the last one, zero is
// recognised as a label by integer arithmetic rather than an absolute
// tolerance, and m above MaxTicks is treated as MaxTicks. NaN or infinite
// bounds and m < 2 give an empty Ticks: no labelling exists.
func Extended(dmin, dmax float64, m int, onlyLoose bool) Ticks {
	if !isFinite(dmin) || !isFinite(dmax) || m < 2 {
		return Ticks{}
	}
	m = min(m, MaxTicks)
	if dmin > dmax {
		dmin, dmax = dmax, dmin
	}
	if r := dmax - dmin; r < rangeEpsilon || r > sqrtMaxFloat {
		return evenTicks(dmin, dmax, m)
	}
	l, ok := search(dmin, dmax, m, onlyLoose, 0, constraint{})
	if !ok {
		return Ticks{}
	}
	return l.ticks()
}

// ticks expands a labelling with R's arithmetic: lmin + t·step.
func (l labelling) ticks() Ticks {
	v := make([]float64, l.k)
	for t := range v {
		v[t] = l.lmin + float64(float64(t)*l.step)
	}
	return Ticks{Values: v, Step: l.step, Decimals: gridDecimals(l.start, l.j, l.q, l.k, l.z)}
}

// search runs the extended Wilkinson search (methods.md §1.3). Products are
// wrapped in float64(...) so that the compiler cannot fuse them into FMAs;
// fused and unfused scores differ in the last bit and change tie-breaks
// against R (methods.md §1.6). A loose labelling may miss the data by slack
// (0 in R); NiceDomain allows rounding noise there and then snaps the ends.
//
// A constraint removes candidates without changing any score, so the bounds
// that end the search early stay valid; the zero constraint leaves R's
// results unchanged.
func search(dmin, dmax float64, m int, onlyLoose bool, slack float64, con constraint) (labelling, bool) {
	best := labelling{score: -2}
	found := false
	spansZero := con.zero && dmin < 0 && dmax > 0
	for j := 1; ; j++ {
		for qi, q := range niceQ {
			sm := simplicityMax(qi, j)
			if float64(wSimplicity*sm)+wCoverage+wDensity+wLegibility < best.score {
				return best, found
			}
			for k := max(2, con.minK); ; k++ {
				dm := densityMax(k, m)
				if float64(wSimplicity*sm)+wCoverage+float64(wDensity*dm)+wLegibility < best.score {
					break
				}
				delta := (dmax - dmin) / float64(k+1) / float64(j) / q
				for z := ceilLog10(delta); ; z++ {
					step := float64(float64(j)*q) * math.Pow10(z)
					cm := coverageMax(dmin, dmax, float64(step*float64(k-1)))
					if float64(wSimplicity*sm)+float64(wCoverage*cm)+float64(wDensity*dm)+wLegibility < best.score {
						break
					}
					// Labels fall on multiples of q·10^z: whole numbers when it is one.
					if u := float64(q * math.Pow10(z)); con.integer && (u < 1 || u != math.Floor(u)) {
						continue
					}
					minStart := float64(math.Floor(dmax/step)*float64(j)) - float64(float64(k-1)*float64(j))
					maxStart := float64(math.Ceil(dmin/step) * float64(j))
					// R's minStart:maxStart; counting with an integer cannot stall
					// when start is too large for start+1 to differ from start.
					for i, n := 0, maxStart-minStart; float64(i) <= n; i++ {
						start := minStart + float64(i)
						lmin := start * (step / float64(j))
						lmax := lmin + float64(step*float64(k-1))
						if spansZero && !(math.Mod(start, float64(j)) == 0 && lmin <= 0 && lmax >= 0) {
							continue
						}
						s := simplicity(qi, j, start, lmin, lmax)
						c := coverage(dmin, dmax, lmin, lmax)
						g := density(k, m, dmin, dmax, lmin, lmax)
						score := float64(wSimplicity*s) + float64(wCoverage*c) + float64(wDensity*g) + float64(wLegibility*legibility)
						if score > best.score && (!onlyLoose || (lmin <= dmin+slack && lmax >= dmax-slack)) {
							best = labelling{q: q, j: j, k: k, z: z, start: start, lmin: lmin, step: step, s: s, c: c, d: g, score: score}
							found = true
						}
					}
				}
			}
		}
	}
}

// simplicity is 1 - (i-1)/(n-1) - j + v, v = 1 when zero is a label.
// R tests zero with an absolute tolerance on lmin mod step, which misfires
// when step is below about 1e-13; zero is a label exactly when start is a
// multiple of j (methods.md §1.4), and that test needs no tolerance. (The
// sign convention of the modulo does not matter for a test against zero.)
func simplicity(qi, j int, start, lmin, lmax float64) float64 {
	v := 0.0
	if math.Mod(start, float64(j)) == 0 && lmin <= 0 && lmax >= 0 {
		v = 1
	}
	return 1 - float64(qi)/float64(len(niceQ)-1) - float64(j) + v
}

func simplicityMax(qi, j int) float64 {
	return 1 - float64(qi)/float64(len(niceQ)-1) - float64(j) + 1
}

func coverage(dmin, dmax, lmin, lmax float64) float64 {
	r := dmax - dmin
	a, b := dmax-lmax, dmin-lmin
	den := float64(0.1 * r)
	return 1 - float64(0.5*(float64(a*a)+float64(b*b)))/float64(den*den)
}

func coverageMax(dmin, dmax, span float64) float64 {
	r := dmax - dmin
	if span <= r {
		return 1
	}
	half := (span - r) / 2
	den := float64(0.1 * r)
	return 1 - float64(half*half)/float64(den*den)
}

func density(k, m int, dmin, dmax, lmin, lmax float64) float64 {
	r := float64(k-1) / (lmax - lmin)
	rt := float64(m-1) / (math.Max(lmax, dmax) - math.Min(dmin, lmin))
	return 2 - math.Max(r/rt, rt/r)
}

func densityMax(k, m int) float64 {
	if k >= m {
		return 2 - float64(k-1)/float64(m-1)
	}
	return 1
}

// ceilLog10 returns ceil(log10(x)) for x > 0. Go's math.Log10 is inexact at
// some powers of ten (Log10(0.1) = -0.9999999999999999, methods.md §1.6)
// where R's is exact, so an exact power of ten is corrected downwards.
func ceilLog10(x float64) int {
	z := int(math.Ceil(math.Log10(x)))
	if math.Pow10(z-1) >= x {
		z--
	}
	return z
}

// floorLog10 returns floor(log10(x)) for finite x > 0, checked against the
// neighbouring powers of ten for the same reason as ceilLog10.
func floorLog10(x float64) int {
	e := int(math.Floor(math.Log10(x)))
	if math.Pow10(e) > x {
		e--
	} else if math.Pow10(e+1) <= x {
		e++
	}
	return e
}

// evenTicks is R's seq(dmin, dmax, length.out = m): the fallback for ranges
// the search cannot handle. The last value is dmax itself, as in R.
func evenTicks(dmin, dmax float64, m int) Ticks {
	v := make([]float64, m)
	n1 := float64(m - 1)
	by := (dmax - dmin) / n1
	if math.IsInf(by, 0) {
		// The span overflows float64, where R gives Inf. Finite ticks serve
		// callers better: weigh the two ends, each term finite, since
		// dmin + i·step may overflow on the way.
		for i := range v {
			t := float64(i) / n1
			v[i] = float64(dmin*(1-t)) + float64(dmax*t)
		}
		by = dmax/n1 - dmin/n1
		if math.IsInf(by, 0) {
			by = math.MaxFloat64
		}
	} else {
		for i := range v {
			v[i] = dmin + float64(float64(i)*by)
		}
	}
	v[m-1] = dmax
	return Ticks{Values: v, Step: by, Decimals: shortestDecimals(v)}
}

// gridDecimals returns the fewest digits after the point that print every
// label (start + t·j)·q·10^e exactly. It works on integer mantissas, so the
// float noise of a value such as 0.15000000000000002 does not count.
func gridDecimals(start float64, j int, q float64, k, e int) int {
	q10 := int64(math.Round(q * 10)) // q·10 is an integer for every nice q, also 2.5
	last := start + float64((k-1)*j)
	if math.Abs(start) >= 1<<53 || math.Abs(last) >= 1<<53 {
		// Mantissas too large to hold exactly; the labels cannot be exact
		// either, so fall back to the step's own digits (methods.md §1.4).
		d := -e
		if q10%10 != 0 {
			d++
		}
		return max(0, d)
	}
	n0 := int64(start)
	tz := -1 // fewest trailing decimal zeros of a nonzero mantissa
	for t := 0; t < k; t++ {
		mant := (n0 + int64(t*j)) * q10
		if mant == 0 {
			continue
		}
		z := 0
		for mant%10 == 0 {
			mant /= 10
			z++
		}
		if tz < 0 || z < tz {
			tz = z
		}
	}
	if tz < 0 {
		return 0
	}
	return max(0, 1-e-tz)
}

// shortestDecimals returns the digits after the point of the shortest
// decimal that reads back as each value, the most over all values.
func shortestDecimals(v []float64) int {
	d := 0
	var buf []byte
	for _, x := range v {
		buf = strconv.AppendFloat(buf[:0], x, 'f', -1, 64)
		for i, c := range buf {
			if c == '.' {
				d = max(d, len(buf)-i-1)
				break
			}
		}
	}
	return d
}

func isFinite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// grid describes labels (start + t·j)·q·10^e in the caller's units.
type grid struct {
	start float64
	j     int
	q     float64
	e     int
}

// NiceDomain returns loose ticks for the data range [lo, hi]: about m nice
// values, the first <= lo and the last >= hi, chosen by Extended with
// onlyLoose. It accepts every finite input:
//
//   - lo > hi are swapped; m below 2 is treated as 2, above MaxTicks as MaxTicks;
//   - a degenerate range (lo == hi, or a spread below 1e-12 of the magnitude,
//     which is rounding noise) is widened to ±10% around its middle, and
//     [0, 0] to [0, 1], so a constant series still gets a readable axis;
//   - ranges below 1e-9 or above 1e100 are labelled in units of a power of
//     ten, so tiny (1e-300) and huge (1e300) magnitudes get nice ticks too;
//   - a tick within 1e-9 steps of zero is set to exactly zero, and an end
//     tick that misses its bound by rounding noise (under 1e-6 of a step) is
//     set to the bound, so Values[0] + i·Step holds to that accuracy.
//
// The result has at least two strictly increasing finite values. When no
// nice labelling is representable (near MaxFloat64 or among subnormals) the
// ticks are the bounds themselves. NaN or infinite bounds give an empty
// Ticks; callers validate their data before this point.
func NiceDomain(lo, hi float64, m int) Ticks {
	t, _, _ := niceDomain(lo, hi, m, constraint{})
	return t
}

// BarDomain is NiceDomain after extending [lo, hi] to include zero, because a
// bar's length is its value (Cleveland & McGill 1984; methods.md §11). The
// first tick is <= min(lo, 0), the last >= max(hi, 0), and 0 is one of the
// ticks. NaN or infinite bounds give an empty Ticks.
func BarDomain(lo, hi float64, m int) Ticks {
	if !isFinite(lo) || !isFinite(hi) {
		return Ticks{}
	}
	a, b := min(lo, hi, 0), max(lo, hi, 0)
	t, g, ok := niceDomain(a, b, m, constraint{})
	if hasZero(t.Values) {
		return t
	}
	if ok {
		// The search preferred a labelling that skips zero (j > 1 and an
		// odd start); take every label of the same step instead.
		i0, i1 := math.Floor(a/t.Step), math.Ceil(b/t.Step)
		if n := i1 - i0 + 1; n <= 4*MaxTicks {
			v := make([]float64, int(n))
			first := i0 * t.Step
			for i := range v {
				v[i] = first + float64(float64(i)*t.Step) // i = -i0 gives exactly 0
			}
			g.start = i0 * float64(g.j)
			if v, ok := cover(v, a, b, t.Step); ok && hasZero(v) {
				return Ticks{Values: v, Step: t.Step, Decimals: gridDecimals(g.start, g.j, g.q, len(v), g.e)}
			}
		}
	}
	// Fallback ticks are the bounds; put zero between them.
	v := make([]float64, 0, len(t.Values)+1)
	for _, x := range t.Values {
		if len(v) > 0 && v[len(v)-1] < 0 && x > 0 {
			v = append(v, 0)
		}
		v = append(v, x)
	}
	return Ticks{Values: v, Step: t.Step, Decimals: shortestDecimals(v)}
}

func hasZero(v []float64) bool {
	for _, x := range v {
		if x == 0 {
			return true
		}
	}
	return false
}

// niceDomain does the work of NiceDomain and also reports the label grid
// (ok is false for the bounds-only fallback).
func niceDomain(lo, hi float64, m int, con constraint) (Ticks, grid, bool) {
	if !isFinite(lo) || !isFinite(hi) {
		return Ticks{}, grid{}, false
	}
	if lo > hi {
		lo, hi = hi, lo
	}
	m = min(max(m, 2), MaxTicks)
	if hi-lo <= 1e-12*math.Max(math.Abs(lo), math.Abs(hi)) {
		lo, hi = widen(lo/2 + hi/2)
	}
	if t, g, ok := niceTicks(lo, hi, m, con); ok {
		return t, g, true
	}
	if con != (constraint{}) {
		// The search found no labelling that meets the constraint and scores
		// above its floor (three whole-number ticks for counts of 0 and 1
		// cover the data poorly): step through the range instead, and else
		// drop the constraint, since any ticks beat none.
		if t, ok := steppedTicks(lo, hi, con); ok {
			return t, grid{}, false
		}
		if t, g, ok := niceTicks(lo, hi, m, constraint{}); ok {
			return t, g, true
		}
	}
	step := hi - lo
	if math.IsInf(step, 0) {
		step = math.MaxFloat64
	}
	v := []float64{lo, hi}
	return Ticks{Values: v, Step: step, Decimals: shortestDecimals(v)}, grid{}, false
}

// widen turns a single value into a range around it.
func widen(v float64) (lo, hi float64) {
	if v == 0 {
		return 0, 1
	}
	h := math.Abs(v) / 10
	lo, hi = max(v-h, -math.MaxFloat64), min(v+h, math.MaxFloat64)
	if !(lo < hi) {
		// Subnormal v: a tenth of it is not representable.
		return min(v, 0), max(v, 0)
	}
	return lo, hi
}

// niceTicks runs the loose search, in units of a power of ten when the range
// is too small or too large for the search's absolute tolerances and
// squared terms, and checks the result.
func niceTicks(lo, hi float64, m int, con constraint) (Ticks, grid, bool) {
	r := hi - lo
	var (
		t Ticks
		g grid
	)
	if r >= 1e-9 && r <= 1e100 {
		l, ok := search(lo, hi, m, true, 1e-10*r, con)
		if !ok {
			return Ticks{}, grid{}, false
		}
		t = l.ticks()
		g = grid{start: l.start, j: l.j, q: l.q, e: l.z}
	} else {
		var lr float64
		if math.IsInf(r, 0) {
			lr = math.Log10(hi/2-lo/2) + math.Log10(2)
		} else {
			lr = math.Log10(r)
		}
		p := int(math.Floor(lr))
		slo, shi := MulPow10(lo, -p), MulPow10(hi, -p)
		// The scaled bounds carry rounding noise of a few ulps; the slack
		// keeps it from rejecting the labelling that fits the true bounds.
		// Whole-number steps mean nothing in power-of-ten units.
		sc := con
		sc.integer = false
		l, ok := search(slo, shi, m, true, 1e-10*(shi-slo), sc)
		if !ok {
			return Ticks{}, grid{}, false
		}
		g = grid{start: l.start, j: l.j, q: l.q, e: l.z + p}
		first := MulPow10(l.start*l.q, g.e)
		step := MulPow10(float64(l.j)*l.q, g.e)
		v := make([]float64, l.k)
		for i := range v {
			v[i] = first + float64(float64(i)*step)
		}
		t = Ticks{Values: v, Step: step, Decimals: gridDecimals(g.start, g.j, g.q, l.k, g.e)}
	}
	for i, x := range t.Values {
		if math.Abs(x) <= 1e-9*t.Step {
			t.Values[i] = 0 // lmin + t·step misses zero by an ulp when step/j is inexact
		}
	}
	v, ok := cover(t.Values, lo, hi, t.Step)
	if !ok {
		return Ticks{}, grid{}, false
	}
	if len(v) > len(t.Values) && v[0] < t.Values[0] {
		g.start -= float64(g.j)
	}
	t.Values = v
	t.Decimals = gridDecimals(g.start, g.j, g.q, len(v), g.e)
	return t, g, true
}

// cover makes ticks v cover [lo, hi] despite the search's slack and the
// rounding of the conversion back from power-of-ten units: an end that misses by under 1e-6 of a step is set
// to the bound, one that misses by more gets one more tick. It reports
// whether the result is finite, strictly increasing and covering.
func cover(v []float64, lo, hi, step float64) ([]float64, bool) {
	if len(v) < 2 || !(step > 0) || math.IsInf(step, 0) {
		return v, false
	}
	if v[0] > lo {
		if v[0]-lo <= 1e-6*step {
			v[0] = lo
		} else {
			v = append([]float64{v[0] - step}, v...)
		}
	}
	if n := len(v) - 1; v[n] < hi {
		if hi-v[n] <= 1e-6*step {
			v[n] = hi
		} else {
			v = append(v, v[n]+step)
		}
	}
	if v[0] > lo || v[len(v)-1] < hi {
		return v, false
	}
	for i, x := range v {
		if !isFinite(x) || (i > 0 && !(x > v[i-1])) {
			return v, false
		}
	}
	return v, true
}

// MulPow10 returns x·10^n, in steps so that 10^n itself never overflows or
// underflows, for any code that builds nice numbers from a mantissa and a
// power of ten. Dividing by an exact power of ten rounds once, where
// multiplying by its inexact reciprocal would round twice.
func MulPow10(x float64, n int) float64 {
	n = min(max(n, -700), 700) // beyond, every finite x gives 0 or ±Inf anyway
	for n > 300 {
		x *= 1e300
		n -= 300
	}
	for n < -300 {
		x /= 1e300
		n += 300
	}
	if n >= 0 {
		return x * math.Pow10(n)
	}
	return x / math.Pow10(-n)
}

// constraint narrows the tick search; its zero value is R's search.
type constraint struct {
	minK    int  // at least this many labels
	integer bool // only whole-number steps of at least 1
	zero    bool // a range that spans zero labels zero
}

// TickOptions constrain NiceTicks beyond its target count. The zero value
// gives NiceDomain's ticks.
type TickOptions struct {
	// Min is the fewest ticks to return; MinTicks gives the floor for an
	// axis length. A target below it is raised to it.
	Min int
	// Integer allows only whole-number steps of at least 1, for data that
	// is counted or names whole units (counts, years): 2018.25 is not a
	// year. IsInteger tells whether data qualifies.
	Integer bool
	// Zero labels zero whenever it lies inside the range, because zero is
	// the value readers look for first on an axis that crosses it (common
	// practice). IncludeZero does the same for ticks already chosen.
	Zero bool
}

// Tick spacing at screen size: one labelled tick per about 75 px of axis
// for 13 px text, the middle of the 50-100 px readers find neither sparse
// nor crowded (common practice); the spacing grows with the text.
const (
	tickSpacing  = 75.0
	tickTextSize = 13.0
	// floorLength is the axis length beyond which an axis carries at least
	// three labelled ticks: two labels give a range but no sense of the
	// scale between them (common practice).
	floorLength = 150.0
)

// TickTarget is the tick count to ask for on an axis length pixels long
// whose labels are set in text px type: about one tick per 75 px at 13 px
// text, scaled with the text size, and never below MinTicks(length). Give
// it as m to NiceTicks, NiceDomain or Extended. Non-finite or non-positive
// inputs give 2.
func TickTarget(length, text float64) int {
	if !(length > 0) || !(text > 0) || math.IsInf(length, 0) || math.IsInf(text, 0) {
		return 2
	}
	per := tickSpacing * text / tickTextSize
	n := math.Round(length/per) + 1
	if n > MaxTicks {
		return MaxTicks
	}
	return max(int(n), MinTicks(length))
}

// MinTicks is the fewest labelled ticks an axis of this length in pixels
// may carry: 3 beyond 150 px, else 2.
func MinTicks(length float64) int {
	if length > floorLength {
		return 3
	}
	return 2
}

// IsInteger reports whether every finite value is a whole number, so that
// its axis should step by whole numbers (TickOptions.Integer). Empty input
// or only non-finite values give false.
func IsInteger(values []float64) bool {
	any := false
	for _, v := range values {
		if !isFinite(v) {
			continue
		}
		if v != math.Trunc(v) {
			return false
		}
		any = true
	}
	return any
}

// NiceTicks is NiceDomain with constraints: loose ticks for [lo, hi], the
// first <= lo and the last >= hi, about m of them (at least o.Min), with
// whole-number steps when o.Integer and zero labelled when o.Zero and zero
// lies inside. When no labelling meets Integer (a range under one, say) it
// is dropped rather than returning no ticks; Zero and Min always hold when
// the range permits. NaN or infinite bounds give an empty Ticks.
func NiceTicks(lo, hi float64, m int, o TickOptions) Ticks {
	if !isFinite(lo) || !isFinite(hi) {
		return Ticks{}
	}
	m = max(m, o.Min)
	con := constraint{minK: min(o.Min, MaxTicks), integer: o.Integer, zero: o.Zero}
	t, _, _ := niceDomain(lo, hi, m, con)
	if o.Zero {
		t = IncludeZero(t)
	}
	return t
}

// IncludeZero returns t with zero among its values when zero lies strictly
// between its first and last value. It keeps the step and takes every
// multiple of it from the first to the last value, widened to whole steps
// (so the ends may move out by less than a step); when that would take more
// than 4·MaxTicks values, zero is inserted in place. Ticks that already
// label zero, or do not straddle it, are returned unchanged.
func IncludeZero(t Ticks) Ticks {
	v := t.Values
	if len(v) < 2 || !(v[0] < 0 && v[len(v)-1] > 0) || hasZero(v) {
		return t
	}
	step := t.Step
	if step > 0 && isFinite(step) {
		i0, i1 := math.Floor(v[0]/step), math.Ceil(v[len(v)-1]/step)
		if n := i1 - i0 + 1; n >= 2 && n <= 4*MaxTicks {
			w := make([]float64, int(n))
			for i := range w {
				w[i] = (i0 + float64(i)) * step // i = -i0 gives exactly 0
			}
			if hasZero(w) {
				d, _ := exactDecimals(w, 1, maxTickDecimals)
				return Ticks{Values: w, Step: step, Decimals: max(t.Decimals, d)}
			}
		}
	}
	w := make([]float64, 0, len(v)+1)
	for _, x := range v {
		if len(w) > 0 && w[len(w)-1] < 0 && x > 0 {
			w = append(w, 0)
		}
		w = append(w, x)
	}
	return Ticks{Values: w, Step: step, Decimals: t.Decimals}
}

// steppedTicks covers [lo, hi] with the largest step of 1, 2 or 5 times a
// power of ten (whole when con.integer) that gives at least con.minK ticks,
// adding ticks above hi when the range is too short for that many. The
// ticks start at a multiple of the step, so zero is one of them whenever it
// lies inside.
func steppedTicks(lo, hi float64, con constraint) (Ticks, bool) {
	k := max(con.minK, 2)
	r := hi - lo
	if !(r > 0) || math.IsInf(r, 0) {
		return Ticks{}, false
	}
	want := r / float64(k-1)
	e := floorLog10(want)
	step := 0.0
	for _, q := range [...]float64{5, 2, 1} {
		if s := q * math.Pow10(e); s <= want {
			step = s
			break
		}
	}
	if con.integer && step < 1 {
		step = 1
	}
	i0, i1 := math.Floor(lo/step), math.Ceil(hi/step)
	n := max(i1-i0+1, float64(k))
	if !(n <= 4*MaxTicks) {
		return Ticks{}, false
	}
	v := make([]float64, int(n))
	for i := range v {
		v[i] = (i0 + float64(i)) * step
		if !isFinite(v[i]) { // the next step beyond ±1.8e308 overflows
			return Ticks{}, false
		}
	}
	d, _ := exactDecimals(v, 1, maxTickDecimals)
	return Ticks{Values: v, Step: step, Decimals: d}, true
}
