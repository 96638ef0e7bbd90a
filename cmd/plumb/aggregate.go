package main

import (
	"errors"
	"fmt"
	"math"
	"slices"
)

// Aggregation methods accepted by Aggregate and --agg.
var aggregations = []string{"sum", "mean", "median", "count", "min", "max"}

// errAggregate is the cause of every Aggregate error.
var errAggregate = errors.New("cannot combine repeated labels")

// Aggregate combines the values of repeated labels into one value per
// label, keeping the labels in order of first appearance. how is one of
// sum, mean, median, count, min or max; "" means sum. Sums and means use
// Neumaier's compensated summation (Neumaier 1974), so a large group's total
// does not drift with the order of its rows. A median sorts its group and
// takes the middle value, or the mean of the two middle values for an even
// count. count ignores the values (they may be nil).
//
// repeats is how many input rows were folded into an earlier row with the
// same label: 0 means every label was already unique.
func Aggregate(labels []string, values []float64, how string) (outLabels []string, outValues []float64, repeats int, err error) {
	if how == "" {
		how = "sum"
	}
	if !slices.Contains(aggregations, how) {
		return nil, nil, 0, fmt.Errorf("%w: unknown method %q; use one of sum, mean, median, count, min or max", errAggregate, how)
	}
	if how == "count" && values == nil {
		values = make([]float64, len(labels))
	}
	if len(values) != len(labels) {
		return nil, nil, 0, fmt.Errorf("%w: %d labels but %d values", errAggregate, len(labels), len(values))
	}
	// One pass looks each label up once and folds its value into the
	// group's running state; only the median keeps the row-to-group map.
	group := make(map[string]int, min(len(labels), 1024))
	outLabels = make([]string, 0, min(len(labels), 1024))
	var groups []groupState
	var of []int
	if how == "median" {
		of = make([]int, len(labels))
	}
	for i, l := range labels {
		g, ok := group[l]
		if !ok {
			g = len(outLabels)
			group[l] = g
			outLabels = append(outLabels, l)
			groups = append(groups, groupState{min: values[i], max: values[i]})
		}
		v := values[i]
		if v-v != 0 { // NaN or ±Inf, in one comparison
			return nil, nil, 0, fmt.Errorf("%w: value %d for %q is %v; drop missing values first", errAggregate, i, l, v)
		}
		s := &groups[g]
		s.n++
		s.sum.add(v)
		s.min = min(s.min, v)
		s.max = max(s.max, v)
		if of != nil {
			of[i] = g
		}
	}
	repeats = len(labels) - len(outLabels)
	outValues = make([]float64, len(outLabels))
	for g, s := range groups {
		switch how {
		case "sum":
			outValues[g] = s.sum.total()
		case "mean":
			outValues[g] = s.sum.total() / float64(s.n)
		case "count":
			outValues[g] = float64(s.n)
		case "min":
			outValues[g] = s.min
		case "max":
			outValues[g] = s.max
		}
	}
	if how == "median" {
		medians(of, values, outValues)
	}
	return outLabels, outValues, repeats, nil
}

// medians fills out with each group's median. The groups' values are laid
// out contiguously (a counting sort by group) so that one allocation holds
// them all, then each run is sorted.
func medians(of []int, values, out []float64) {
	start := make([]int, len(out)+1)
	for _, g := range of {
		start[g+1]++
	}
	for g := range out {
		start[g+1] += start[g]
	}
	next := slices.Clone(start[:len(out)])
	sorted := make([]float64, len(values))
	for i, g := range of {
		sorted[next[g]] = values[i]
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
