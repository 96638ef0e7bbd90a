package stats

import (
	"math"
	"slices"

	"plumb/scale"
)

// Class limits for choropleth maps and other classed colour scales. Each
// function returns the k+1 edges of k classes, ascending, from the
// smallest value to the largest; class i holds the values v with
// edges[i] <= v <= edges[i+1] (a value on an inner edge belongs to the
// lower class, as ClassOf says). Fewer classes come back when the values
// have fewer distinct values than k.

// NaturalBreaks partitions the values into k classes so that the sum of
// squared deviations from the class means is smallest: Fisher's (1958)
// exact optimal partition of ordered data ("On grouping for maximum
// homogeneity", JASA 53(284):789-798), by dynamic programming over the
// sorted values in O(k·n²) time and O(k·n) memory. The inner edges are
// the largest value of each class but the last.
func NaturalBreaks(values []float64, k int) []float64 {
	v := finiteSorted(values)
	n := len(v)
	if n == 0 || k < 1 {
		return nil
	}
	k = min(k, distinct(v))
	if k <= 1 {
		return []float64{v[0], v[n-1]}
	}
	// Prefix sums of values and squares, about the median to keep the
	// differences of large numbers exact enough.
	mid := v[n/2]
	s1 := make([]float64, n+1)
	s2 := make([]float64, n+1)
	for i, x := range v {
		d := x - mid
		s1[i+1] = s1[i] + d
		s2[i+1] = s2[i] + d*d
	}
	// ssd(i, j) is the squared deviation of v[i:j] from its mean.
	ssd := func(i, j int) float64 {
		m := float64(j - i)
		s := s1[j] - s1[i]
		return math.Max(0, s2[j]-s2[i]-s*s/m)
	}
	// cost[c][j]: the best cost of the first j values in c+1 classes;
	// from[c][j]: where the last of those classes starts.
	cost := make([][]float64, k)
	from := make([][]int, k)
	for c := range k {
		cost[c] = make([]float64, n+1)
		from[c] = make([]int, n+1)
	}
	for j := 1; j <= n; j++ {
		cost[0][j] = ssd(0, j)
	}
	for c := 1; c < k; c++ {
		for j := c + 1; j <= n; j++ {
			best, at := math.Inf(1), c
			for i := c; i < j; i++ {
				if x := cost[c-1][i] + ssd(i, j); x < best {
					best, at = x, i
				}
			}
			cost[c][j], from[c][j] = best, at
		}
	}
	edges := make([]float64, k+1)
	edges[0], edges[k] = v[0], v[n-1]
	j := n
	for c := k - 1; c > 0; c-- {
		i := from[c][j]
		edges[c] = v[i-1]
		j = i
	}
	return edges
}

// QuantileBreaks gives k classes of about equal counts: inner edges at the
// type 7 quantiles i/k (Hyndman & Fan 1996). Repeated edges, where many
// values are equal, are merged.
func QuantileBreaks(values []float64, k int) []float64 {
	v := finiteSorted(values)
	if len(v) == 0 || k < 1 {
		return nil
	}
	edges := []float64{v[0]}
	for i := 1; i < k; i++ {
		q := Quantile(v, float64(i)/float64(k))
		if q > edges[len(edges)-1] && q < v[len(v)-1] {
			edges = append(edges, q)
		}
	}
	return append(edges, v[len(v)-1])
}

// EqualBreaks gives k classes of equal width between the smallest and the
// largest value.
func EqualBreaks(values []float64, k int) []float64 {
	v := finiteSorted(values)
	if len(v) == 0 || k < 1 {
		return nil
	}
	lo, hi := v[0], v[len(v)-1]
	if lo == hi {
		return []float64{lo, hi}
	}
	edges := make([]float64, k+1)
	for i := range edges {
		edges[i] = lo + (hi-lo)*float64(i)/float64(k)
	}
	edges[k] = hi
	return edges
}

// NiceBreaks gives about k classes whose inner edges are nice numbers
// (NiceTicks over the values' range).
func NiceBreaks(values []float64, k int) []float64 {
	v := finiteSorted(values)
	if len(v) == 0 || k < 1 {
		return nil
	}
	lo, hi := v[0], v[len(v)-1]
	if lo == hi {
		return []float64{lo, hi}
	}
	t := scale.NiceTicks(lo, hi, k+1, scale.TickOptions{})
	edges := []float64{lo}
	for _, x := range t.Values {
		if x > lo && x < hi {
			edges = append(edges, x)
		}
	}
	return append(edges, hi)
}

// ClassOf returns the class of v among the classes edges make: the first
// class whose upper edge is at least v, clamped to the first and last.
func ClassOf(edges []float64, v float64) int {
	n := len(edges) - 1
	if n < 1 {
		return 0
	}
	i, _ := slices.BinarySearch(edges[1:n], v) // first inner edge >= v
	return i
}

func finiteSorted(values []float64) []float64 {
	v := make([]float64, 0, len(values))
	for _, x := range values {
		if !math.IsNaN(x) && !math.IsInf(x, 0) {
			v = append(v, x)
		}
	}
	slices.Sort(v)
	return v
}

func distinct(sorted []float64) int {
	n := 0
	for i, x := range sorted {
		if i == 0 || x != sorted[i-1] {
			n++
		}
	}
	return n
}
