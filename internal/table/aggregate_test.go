package table

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"testing"
)

func TestAggregate(t *testing.T) {
	labels := []string{"a", "b", "a", "c", "b", "a"}
	values := []float64{1, 2, 3, 4, 5, 6}
	tests := []struct {
		how  string
		want []float64
	}{
		{"sum", []float64{10, 7, 4}},
		{"", []float64{10, 7, 4}}, // the zero value sums
		{"mean", []float64{10.0 / 3, 3.5, 4}},
		{"median", []float64{3, 3.5, 4}},
		{"count", []float64{3, 2, 1}},
		{"min", []float64{1, 2, 4}},
		{"max", []float64{6, 5, 4}},
	}
	for _, tc := range tests {
		t.Run(tc.how, func(t *testing.T) {
			gotLabels, got, repeats, err := Aggregate(labels, values, tc.how)
			if err != nil {
				t.Fatal(err)
			}
			if !slices.Equal(gotLabels, []string{"a", "b", "c"}) {
				t.Errorf("labels = %q, want first-appearance order a b c", gotLabels)
			}
			if !slices.Equal(got, tc.want) {
				t.Errorf("values = %v, want %v", got, tc.want)
			}
			if repeats != 3 {
				t.Errorf("repeats = %d, want 3", repeats)
			}
		})
	}
}

func TestAggregateCases(t *testing.T) {
	tests := []struct {
		name    string
		labels  []string
		values  []float64
		how     string
		want    []float64
		repeats int
	}{
		{"no repeats keep their order", []string{"z", "y", "x"}, []float64{1, 2, 3}, "sum", []float64{1, 2, 3}, 0},
		{"empty", nil, nil, "median", []float64{}, 0},
		{"median of an even count is the mean of the middle two", []string{"a", "a", "a", "a"}, []float64{10, 1, 3, 2}, "median", []float64{2.5}, 3},
		{"median of an odd count is the middle", []string{"a", "a", "a"}, []float64{-5, 9, 0}, "median", []float64{0}, 2},
		{"median of huge values does not overflow", []string{"a", "a"}, []float64{math.MaxFloat64, math.MaxFloat64}, "median", []float64{math.MaxFloat64}, 1},
		{"min and max of negatives", []string{"a", "a"}, []float64{-1, -7}, "min", []float64{-7}, 1},
		{"count without values", []string{"a", "b", "a"}, nil, "count", []float64{2, 1}, 1},
		// Naive summation gives 0 here; compensated summation keeps the 2
		// (Neumaier 1974; the sequence 1, 1e100, 1, -1e100 is the usual
		// illustration, from memory).
		{"compensated sum", []string{"a", "a", "a", "a"}, []float64{1, 1e100, 1, -1e100}, "sum", []float64{2}, 3},
		{"overflowing sum is infinite, not NaN", []string{"a", "a"}, []float64{math.MaxFloat64, math.MaxFloat64}, "sum", []float64{math.Inf(1)}, 1},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, got, repeats, err := Aggregate(tc.labels, tc.values, tc.how)
			if err != nil {
				t.Fatal(err)
			}
			if !slices.Equal(got, tc.want) || repeats != tc.repeats {
				t.Errorf("got %v, %d repeats; want %v, %d", got, repeats, tc.want, tc.repeats)
			}
		})
	}
}

func TestAggregateErrors(t *testing.T) {
	tests := []struct {
		name   string
		labels []string
		values []float64
		how    string
	}{
		{"unknown method", []string{"a"}, []float64{1}, "average"},
		{"lengths differ", []string{"a", "b"}, []float64{1}, "sum"},
		{"NaN value", []string{"a"}, []float64{math.NaN()}, "mean"},
		{"infinite value", []string{"a"}, []float64{math.Inf(-1)}, "max"},
	}
	for _, tc := range tests {
		if _, _, _, err := Aggregate(tc.labels, tc.values, tc.how); !errors.Is(err, ErrAggregate) {
			t.Errorf("%s: error = %v, want ErrAggregate", tc.name, err)
		}
	}
}

// TestAggregateDeterministic checks that the output does not depend on map
// iteration order: many labels, many runs, one answer.
func TestAggregateDeterministic(t *testing.T) {
	var labels []string
	var values []float64
	for i := range 2000 {
		labels = append(labels, fmt.Sprint("L", (i*7919)%311))
		values = append(values, float64(i%13)*0.1)
	}
	for _, how := range Aggregations {
		l0, v0, _, _ := Aggregate(labels, values, how)
		for range 5 {
			l, v, _, _ := Aggregate(labels, values, how)
			if !slices.Equal(l, l0) || !slices.Equal(v, v0) {
				t.Fatalf("%s: output changed between runs", how)
			}
		}
	}
}

func ExampleAggregate() {
	labels := []string{"North", "South", "North", "East", "South"}
	values := []float64{120, 80, 30, 55, 20}
	l, v, repeats, _ := Aggregate(labels, values, "sum")
	fmt.Println(l, v, repeats)
	l, v, _, _ = Aggregate(labels, values, "median")
	fmt.Println(l, v)
	// Output:
	// [North South East] [150 100 55] 2
	// [North South East] [75 50 55]
}
