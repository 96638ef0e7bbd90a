package stats_test

import (
	"fmt"

	"plumb/internal/stats"
)

// The worked example of methods.md §8: type 7 quartiles, Tukey's fences and
// the one outlier beyond them.
func ExampleTukeyBox() {
	b, err := stats.TukeyBox([]float64{2, 4, 4, 5, 6, 7, 8, 9, 11, 30})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("quartiles:", b.Q1, b.Median, b.Q3)
	fmt.Println("fences:", b.LowFence, b.HighFence)
	fmt.Println("whiskers:", b.LowWhisker, b.HighWhisker, "outliers:", b.Outliers)
	// Output:
	// quartiles: 4.25 6.5 8.75
	// fences: -2.5 15.5
	// whiskers: 2 11 outliers: [30]
}

// Freedman–Diaconis gives 4.18 for these values; the width rounds to the
// nice 5, and the maximum on the last edge stays in the last bin.
func ExampleBinValues() {
	s, _ := stats.Sorted([]float64{2, 4, 4, 5, 6, 7, 8, 9, 11, 30})
	h, err := stats.BinValues(s, stats.BinOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s: %.2f -> %g\n", h.Rule, h.Raw, h.Width)
	fmt.Println(h.Edges, h.Counts)
	// Output:
	// Freedman–Diaconis: 4.18 -> 5
	// [0 5 10 15 20 25 30] [3 5 1 0 0 1]
}
