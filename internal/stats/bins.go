package stats

import (
	"errors"
	"fmt"
	"math"

	"plumb/scale"
)

// Rule names how a histogram's bin width was chosen.
type Rule string

// The bin-width rules.
const (
	// FreedmanDiaconis is h = 2·IQR·n^(−1/3) (Freedman & Diaconis 1981): the
	// width that minimises the integrated squared error for smooth
	// densities, and robust to outliers because it rests on the IQR.
	FreedmanDiaconis Rule = "Freedman–Diaconis"
	// Sturges is k = ⌈log₂ n⌉ + 1 bins over the range (Sturges 1926), the
	// fallback when the IQR is zero (more than half the values equal).
	Sturges Rule = "Sturges"
	// BinCount is a bin count the caller asked for, width rounded to a nice number.
	BinCount Rule = "bin count"
	// BinWidth is a bin width the caller gave, used as given.
	BinWidth Rule = "bin width"
	// SingleValue is one bin around data whose values are all equal.
	SingleValue Rule = "single value"
)

// DefaultMaxBins bounds the bins a histogram may have when BinOptions gives
// no bound: past about a thousand, bars are thinner than a pixel on any
// medium plumb draws for, and the counts are noise.
const DefaultMaxBins = 1000

// BinOptions choose a histogram's bins. The zero value uses
// Freedman–Diaconis, Sturges when the IQR is zero.
type BinOptions struct {
	// Bins asks for about this many bins over the data's range; the width
	// is rounded to a nice number, so the count may differ by a few.
	Bins int
	// Width gives the bin width exactly; edges are whole multiples of it.
	// Bins and Width are exclusive.
	Width float64
	// Integer says every value is a whole number: widths chosen by rule are
	// then whole numbers too (1, 2, 5, 10, 20, 25, ...), so that every bin
	// holds the same number of possible values; a width of 2.5 over
	// counts would give bins of three and two values in turn.
	// Every bin, the last too, is then closed on the left only.
	Integer bool
	// MaxBins bounds the count (default DefaultMaxBins); a chosen width
	// that would exceed it is widened to the next nice number that fits,
	// and Histogram.Widened says so. A given Width that exceeds it is an
	// error.
	MaxBins int
}

// Histogram is the result of binning: k bins between k+1 edges, each bin
// [Edges[i], Edges[i+1]) closed on the left, except the last, which is
// closed on both sides, so that a maximum that falls on a nice edge is
// counted in the bin below it rather than in a bin of its own. Whole-number
// data (BinOptions.Integer) is the exception: there every bin is closed on
// the left only and the last edge lies above the maximum, because bins of
// whole widths hold whole numbers, and closing the last would give it one
// more (with width 1, the two largest values would share a bar).
type Histogram struct {
	Edges  []float64
	Counts []int
	N      int     // the number of values binned (the sum of Counts)
	Width  float64 // the bin width, Edges[i+1] − Edges[i]
	Rule   Rule    // how the width was chosen
	// Raw is the width the rule gave before rounding to a nice number
	// (the given width for BinWidth).
	Raw float64
	// Widened is true when the width was widened to keep the count under
	// MaxBins.
	Widened bool

	open bool // the last bin is closed on the left only
}

// LastClosed reports whether the last bin holds its upper edge too (see
// Histogram): true unless the data were binned as whole numbers.
func (h Histogram) LastClosed() bool { return !h.open }

// Density is the height of bin i as a density: count / (n · width), so
// that the bars' areas sum to 1.
func (h Histogram) Density(i int) float64 {
	if h.N == 0 || h.Width <= 0 || i < 0 || i >= len(h.Counts) {
		return math.NaN()
	}
	return float64(h.Counts[i]) / float64(h.N) / h.Width
}

// Errors of binning.
var (
	// ErrBinOptions is a bin count or width that cannot be used.
	ErrBinOptions = errors.New("bin options")
	// ErrTooManyBins is a given width that would make more than MaxBins
	// bins over the data; errors.Is(err, ErrBinOptions) holds too.
	ErrTooManyBins = fmt.Errorf("%w: too many bins", ErrBinOptions)
	// ErrPrecision is data whose bin edges float64 cannot tell apart at
	// the width chosen (values near 1e20 binned half a unit wide).
	ErrPrecision = errors.New("beyond float64 precision")
)

// SturgesBins is Sturges' (1926) bin count ⌈log₂ n⌉ + 1 for n ≥ 1
// (n = 10 gives 5, 100 gives 8, 1000 gives 11; methods.md §8).
func SturgesBins(n int) int {
	if n <= 1 {
		return 1
	}
	// ⌈log₂ n⌉ exactly, by integer arithmetic: math.Log2 of a power of two
	// is exact, but the ceiling of an inexact log of 2^k+1 need not be.
	k := 0
	for v := 1; v < n; v <<= 1 {
		k++
	}
	return k + 1
}

// FreedmanDiaconisWidth is 2·IQR·n^(−1/3) for sorted values, with type 7
// quartiles (Freedman & Diaconis 1981). It is 0 when the IQR is 0 and NaN
// for no values.
func FreedmanDiaconisWidth(sorted []float64) float64 {
	n := len(sorted)
	if n == 0 {
		return math.NaN()
	}
	iqr := Quantile(sorted, 0.75) - Quantile(sorted, 0.25)
	return 2 * iqr / math.Cbrt(float64(n))
}

// BinValues chooses bins for sorted, finite values and counts them.
func BinValues(sorted []float64, o BinOptions) (Histogram, error) {
	n := len(sorted)
	if n == 0 {
		return Histogram{}, ErrEmpty
	}
	lo, hi := sorted[0], sorted[n-1]
	if math.IsNaN(lo) || math.IsInf(lo, 0) || math.IsNaN(hi) || math.IsInf(hi, 0) {
		return Histogram{}, ErrNotFinite
	}
	maxBins := o.MaxBins
	if maxBins <= 0 {
		maxBins = DefaultMaxBins
	}
	switch {
	case o.Bins != 0 && o.Width != 0:
		return Histogram{}, fmt.Errorf("%w: give a bin count or a bin width, not both", ErrBinOptions)
	case o.Bins < 0:
		return Histogram{}, fmt.Errorf("%w: a bin count of %d; give 1 or more", ErrBinOptions, o.Bins)
	case o.Bins > maxBins:
		return Histogram{}, fmt.Errorf("%w: %d bins; give at most %d", ErrBinOptions, o.Bins, maxBins)
	case o.Width != 0 && !(o.Width > 0 && !math.IsInf(o.Width, 0)):
		return Histogram{}, fmt.Errorf("%w: a bin width of %g; give a positive number", ErrBinOptions, o.Width)
	}
	h := Histogram{N: n, open: o.Integer}
	if o.Width > 0 {
		h.Rule, h.Raw, h.Width = BinWidth, o.Width, o.Width
		edge := func(i float64) float64 { return i * o.Width }
		first, k := cover(lo, hi, o.Width, edge, o.Integer)
		if k > float64(maxBins) {
			return Histogram{}, fmt.Errorf("%w: a bin width of %g makes %.0f bins over %g to %g; give a width of at least %.3g", ErrTooManyBins, o.Width, k, lo, hi, (hi-lo)/float64(maxBins)*1.001)
		}
		if err := h.setEdges(first, k, edge, lo, hi); err != nil {
			return Histogram{}, err
		}
		h.count(sorted)
		return h, nil
	}
	switch {
	case lo == hi:
		h.Rule = SingleValue
	case o.Bins > 0:
		h.Rule, h.Raw = BinCount, (hi-lo)/float64(o.Bins)
	default:
		h.Rule, h.Raw = FreedmanDiaconis, FreedmanDiaconisWidth(sorted)
		if !(h.Raw > 0) {
			h.Rule, h.Raw = Sturges, (hi-lo)/float64(SturgesBins(n))
		}
	}
	var w niceWidth
	if h.Rule == SingleValue {
		// One bin holding the value: a nice width a tenth of its size, so
		// the axis reads as the neighbourhood of the value.
		mag := math.Abs(lo) / 10
		if mag == 0 || mag < math.SmallestNonzeroFloat64*1e3 {
			mag = 1
		}
		h.Raw = mag
		w = nearestNice(mag)
	} else {
		w = nearestNice(h.Raw)
	}
	for o.Integer && (w.value() < 1 || w.value() != math.Trunc(w.value())) {
		w = w.next()
	}
	for {
		first, k := cover(lo, hi, w.value(), w.edge, o.Integer)
		if k <= float64(maxBins) || math.IsInf(w.value(), 0) {
			h.Width = w.value()
			if err := h.setEdges(first, k, w.edge, lo, hi); err != nil {
				return Histogram{}, err
			}
			break
		}
		w = w.next()
		for o.Integer && w.value() != math.Trunc(w.value()) {
			w = w.next()
		}
		h.Widened = true
	}
	h.count(sorted)
	return h, nil
}

// cover returns the index of the first edge at or below lo and the number
// of bins of width w from it whose last edge reaches hi: at least one, and
// hi on an edge stays in the bin below. Edges are edge(i), computed, so the
// indices are checked against them, not against lo/w, which may round
// across a whole number.
func cover(lo, hi, w float64, edge func(float64) float64, open bool) (first, k float64) {
	first = math.Floor(lo / w)
	// A few steps at most: beyond the precision of float64 indices a step
	// changes nothing, and setEdges rejects the result.
	for i := 0; i < 4 && edge(first) > lo; i++ {
		first--
	}
	for i := 0; i < 4 && edge(first+1) <= lo; i++ {
		first++
	}
	k = max(math.Ceil(hi/w)-first, 1)
	for i := 0; i < 4 && k > 1 && edge(first+k-1) >= hi; i++ {
		k--
	}
	for i := 0; i < 4 && edge(first+k) < hi; i++ {
		k++
	}
	if open && edge(first+k) == hi {
		k++
	}
	return first, k
}

// setEdges fills Edges from edge(first) to edge(first+k), and counts are
// filled later; values too large for their edges are an error.
func (h *Histogram) setEdges(first, k float64, edge func(float64) float64, lo, hi float64) error {
	if !(k >= 1) || k > float64(math.MaxInt32) || math.IsInf(1/h.Width, 0) {
		return fmt.Errorf("%w: the values %g to %g cannot be binned at width %g", ErrPrecision, lo, hi, h.Width)
	}
	h.Edges = make([]float64, int(k)+1)
	for i := range h.Edges {
		e := edge(first + float64(i))
		if math.IsInf(e, 0) || math.IsNaN(e) || (i > 0 && !(e > h.Edges[i-1])) {
			return fmt.Errorf("the values %g to %g cannot be binned at width %g: the edges are %w", lo, hi, h.Width, ErrPrecision)
		}
		h.Edges[i] = e
	}
	if h.Edges[0] > lo || h.Edges[len(h.Edges)-1] < hi {
		return fmt.Errorf("the values %g to %g cannot be binned at width %g: the edges are %w", lo, hi, h.Width, ErrPrecision)
	}
	return nil
}

// count fills Counts from sorted values; the edges cover them.
func (h *Histogram) count(sorted []float64) {
	k := len(h.Edges) - 1
	h.Counts = make([]int, k)
	// Sorted values fill bins in order: one pass, with each value compared
	// against the edges themselves rather than a computed index, so that
	// the rule the doc states holds exactly at every edge.
	last := k - 1
	if h.open {
		last = k
	}
	b := 0
	for _, x := range sorted {
		for b < last && x >= h.Edges[b+1] {
			b++
		}
		h.Counts[b]++
	}
}

// niceWidth is a bin width m·10^p with m one of 1, 2, 25 or 5 (25 for
// 2.5 one power lower), kept as integers so that edges are exact multiples
// computed with a single rounding.
type niceWidth struct {
	m int
	p int
}

// niceMantissas are the nice widths per decade, ascending: the steps of
// Heckbert's (1990) nice numbers with 2.5 from Talbot et al.'s (2010) Q,
// which keeps edges round (0, 2.5, 5, 7.5) and the ratio between
// neighbouring widths at most 2.
var niceMantissas = [...]float64{1, 2, 2.5, 5}

func (w niceWidth) value() float64 { return scale.MulPow10(float64(w.m), w.p) }

// edge is the i-th multiple of the width: (i·m)·10^p, rounded once.
func (w niceWidth) edge(i float64) float64 { return scale.MulPow10(i*float64(w.m), w.p) }

// next is the next larger nice width.
func (w niceWidth) next() niceWidth {
	switch w.m {
	case 1:
		return niceWidth{2, w.p}
	case 2:
		return niceWidth{25, w.p - 1}
	case 25:
		return niceWidth{5, w.p + 1}
	}
	return niceWidth{1, w.p + 1}
}

// nearestNice is the nice width nearest h by ratio (h > 0, finite).
func nearestNice(h float64) niceWidth {
	e := int(math.Floor(math.Log10(h)))
	best, bestRatio := niceWidth{1, e}, math.Inf(1)
	for _, de := range []int{-1, 0, 1} {
		for _, m := range niceMantissas {
			c := niceWidth{int(m), e + de}
			if m == 2.5 {
				c = niceWidth{25, e + de - 1}
			}
			v := c.value()
			r := math.Abs(math.Log(v / h))
			if r < bestRatio {
				best, bestRatio = c, r
			}
		}
	}
	return best
}
