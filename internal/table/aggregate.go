package table

import (
	"errors"
	"fmt"
	"math"
	"slices"
)

// Aggregations lists the methods Aggregate and AggregateCodes accept.
var Aggregations = []string{"sum", "mean", "median", "count", "min", "max"}

// ErrAggregate is the cause of every Aggregate error.
var ErrAggregate = errors.New("cannot combine repeated labels")

// Aggregate combines the values of repeated labels into one value per
// label, keeping the labels in order of first appearance. how is one of
// sum, mean, median, count, min or max; "" means sum. count ignores the
// values (they may be nil). repeats is how many input rows were folded into
// an earlier row with the same label: 0 means every label was unique.
// A NaN or infinite value is an error: drop missing values first.
func Aggregate(labels []string, values []float64, how string) (outLabels []string, outValues []float64, repeats int, err error) {
	if how == "count" && values == nil {
		values = make([]float64, len(labels))
	}
	if len(values) != len(labels) {
		return nil, nil, 0, fmt.Errorf("%w: %d labels but %d values", ErrAggregate, len(labels), len(values))
	}
	for i, v := range values {
		if v-v != 0 { // NaN or ±Inf, in one comparison
			return nil, nil, 0, fmt.Errorf("%w: value %d for %q is %v; drop missing values first", ErrAggregate, i, labels[i], v)
		}
	}
	ids := make(map[string]uint32, min(len(labels), 1024))
	var dict []string
	codes := make([]uint32, len(labels))
	for i, l := range labels {
		c, ok := ids[l]
		if !ok {
			c = uint32(len(dict))
			ids[l] = c
			dict = append(dict, l)
		}
		codes[i] = c
	}
	g, err := AggregateCodes(dict, codes, values, how)
	if err != nil {
		return nil, nil, 0, err
	}
	return g.Labels, g.Values, len(labels) - len(g.Labels), nil
}

// Groups is the result of AggregateCodes: one value per label.
type Groups struct {
	Labels []string
	Values []float64
	// Rows is how many rows each label combined.
	Rows []int
}

// AggregateCodes combines values per label code: dict holds the distinct
// labels in order of first appearance and codes the label of each row, as
// Table.Codes returns them, so that no label is hashed again. Rows whose
// value is NaN (missing) are left out; with how == "count" values may be
// nil, and every row counts. Labels left with no row are dropped. Sums
// and means use Neumaier's compensated summation (Neumaier 1974), so that
// a large group's total does not drift with the order of its rows; a
// median sorts its group and takes the middle value, or the mean of the two
// middle values for an even count.
func AggregateCodes(dict []string, codes []uint32, values []float64, how string) (*Groups, error) {
	if how == "" {
		how = "sum"
	}
	if !slices.Contains(Aggregations, how) {
		return nil, fmt.Errorf("%w: unknown method %q; use one of sum, mean, median, count, min or max", ErrAggregate, how)
	}
	if values != nil && len(values) != len(codes) {
		return nil, fmt.Errorf("%w: %d labels but %d values", ErrAggregate, len(codes), len(values))
	}
	groups := make([]groupState, len(dict))
	for i := range groups {
		groups[i] = groupState{min: math.Inf(1), max: math.Inf(-1)}
	}
	counting := how == "count"
	for i, c := range codes {
		s := &groups[c]
		if counting {
			s.n++
			continue
		}
		v := values[i]
		if v != v {
			continue
		}
		s.n++
		s.sum.add(v)
		s.min = min(s.min, v)
		s.max = max(s.max, v)
	}
	g := &Groups{}
	keep := make([]int, len(dict)) // code -> output position, or -1
	for c, s := range groups {
		keep[c] = -1
		if s.n == 0 {
			continue
		}
		keep[c] = len(g.Labels)
		g.Labels = append(g.Labels, dict[c])
		g.Rows = append(g.Rows, s.n)
		var v float64
		switch how {
		case "sum":
			v = s.sum.total()
		case "mean":
			v = s.sum.total() / float64(s.n)
		case "count":
			v = float64(s.n)
		case "min":
			v = s.min
		case "max":
			v = s.max
		}
		g.Values = append(g.Values, v)
	}
	if how == "median" {
		medians(codes, values, keep, g.Rows, g.Values)
	}
	return g, nil
}

// medians fills out with each group's median. The groups' values are laid
// out contiguously (a counting sort by group) so that one allocation holds
// them all, then each run is sorted.
func medians(codes []uint32, values []float64, keep, rows []int, out []float64) {
	start := make([]int, len(out)+1)
	for g, n := range rows {
		start[g+1] = start[g] + n
	}
	next := slices.Clone(start[:len(out)])
	sorted := make([]float64, start[len(out)])
	for i, c := range codes {
		v := values[i]
		if v != v {
			continue
		}
		g := keep[c]
		sorted[next[g]] = v
		next[g]++
	}
	for g := range out {
		run := sorted[start[g]:start[g+1]]
		slices.Sort(run)
		n := len(run)
		if n%2 == 1 {
			out[g] = run[n/2]
		} else {
			// Halve each before adding so that two huge values cannot overflow.
			out[g] = run[n/2-1]/2 + run[n/2]/2
		}
	}
}

// groupState is what one pass keeps per label.
type groupState struct {
	sum      neumaier
	n        int
	min, max float64
}

// neumaier is a running sum with Neumaier's improvement of Kahan
// summation: the low-order bits lost by each addition are kept in c.
type neumaier struct{ s, c float64 }

func (n *neumaier) add(v float64) {
	t := n.s + v
	if math.Abs(n.s) >= math.Abs(v) {
		n.c += (n.s - t) + v
	} else {
		n.c += (v - t) + n.s
	}
	n.s = t
}

func (n *neumaier) total() float64 {
	if math.IsInf(n.s, 0) {
		return n.s // the compensation is NaN once the sum overflows
	}
	return n.s + n.c
}
