package layout

import (
	"math"
	"slices"
)

// Spread moves one-dimensional label positions apart so that neighbouring
// labels are at least gap apart and all lie within [lo, hi], moving them as
// little as possible: the result minimises the total squared displacement
// from want. Labels keep their order (equal wants keep the caller's order),
// and got[i] is the new position of want[i].
//
// Sorted by wanted position, label i at x[i] = z[i] + i·gap is gap clear of
// its neighbours exactly when z is non-decreasing, so the problem is the
// isotonic regression of want[i] − i·gap, clipped to the bounds. It is
// solved exactly, in O(n log n) for the sort and O(n) after, by the
// pool-adjacent-violators algorithm (Ayer et al. 1955): labels that would
// cross are pooled into a block that sits at the mean of its members' wants.
//
// When the labels cannot fit, because (n−1)·gap > hi − lo, Spread returns
// the least-squares placement that ignores lo and hi, with ok false. A
// negative gap counts as zero. Non-finite wants, a NaN gap or bound, or
// lo > hi give a copy of want and ok false.
func Spread(want []float64, gap, lo, hi float64) (got []float64, ok bool) {
	got = slices.Clone(want)
	if got == nil {
		got = []float64{}
	}
	if math.IsNaN(gap) || math.IsInf(gap, 0) || math.IsNaN(lo) || math.IsNaN(hi) || lo > hi {
		return got, false
	}
	for _, w := range want {
		if math.IsNaN(w) || math.IsInf(w, 0) {
			return got, false
		}
	}
	n := len(want)
	if n == 0 {
		return got, true
	}
	gap = max(gap, 0)

	// Sorting (want, index) pairs, with ties broken by index, is about
	// twice as fast as a stable sort of indices through want (1000 labels:
	// roughly 85 against 180 µs on a busy 2-core machine).
	order := make([]label, n)
	for i, w := range want {
		order[i] = label{w, i}
	}
	slices.SortFunc(order, func(a, b label) int {
		switch {
		case a.want < b.want:
			return -1
		case a.want > b.want:
			return 1
		}
		return a.index - b.index
	})

	z := make([]float64, n)
	for k, l := range order {
		z[k] = l.want - float64(k)*gap
	}
	isotonic(z)

	// Clipping the unbounded isotonic fit to the bounds gives the bounded
	// fit (Barlow et al. 1972): with z non-decreasing, z[0] >= lo and
	// z[n-1] <= hi-(n-1)·gap bound every label.
	top := hi - float64(n-1)*gap
	ok = lo <= top
	for k, l := range order {
		v := z[k]
		if ok {
			v = min(max(v, lo), top)
		}
		got[l.index] = v + float64(k)*gap
	}
	return got, ok
}

// label is a wanted position and its index in the caller's slice.
type label struct {
	want  float64
	index int
}

// isotonic replaces y with its least-squares non-decreasing fit, by pooling
// adjacent violators. Blocks keep their mean rather than their sum so that
// large coordinates cannot overflow.
func isotonic(y []float64) {
	type block struct {
		mean  float64
		count int
	}
	blocks := make([]block, 0, len(y))
	for _, v := range y {
		b := block{v, 1}
		// Pool while the previous block's mean exceeds this one's.
		for len(blocks) > 0 {
			p := blocks[len(blocks)-1]
			if p.mean <= b.mean {
				break
			}
			c := p.count + b.count
			b = block{p.mean + (b.mean-p.mean)*float64(b.count)/float64(c), c}
			blocks = blocks[:len(blocks)-1]
		}
		blocks = append(blocks, b)
	}
	k := 0
	for _, b := range blocks {
		for range b.count {
			y[k] = b.mean
			k++
		}
	}
}
