package render_test

import (
	"bytes"
	"fmt"
	"math"
	"strings"

	"plumb/render"
)

// Several values per category: one row per harbour, one dot per year on a
// shared axis, the years named over the first row. A harbour without a
// figure for a year simply has no dot there.
func ExampleSeriesDots() {
	harbours := []string{"North harbour", "East quay", "South pier"}
	years := []render.RowSeries{
		{Name: "2024", Values: []float64{120, 80, 45}},
		{Name: "2025", Values: []float64{100, math.NaN(), 60}},
	}
	var svg bytes.Buffer
	_, err := render.SeriesDots(&svg, harbours, years, render.DotsOptions{
		Common:     render.Common{Title: "Landings by harbour"},
		RowOptions: render.RowOptions{Unit: "t", ValueName: "landings"},
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(strings.Count(svg.String(), `class="plumb-mark"`), "dots")
	fmt.Println(strings.Count(svg.String(), `data-series="2025"`) > 0)
	// Output:
	// 5 dots
	// true
}

// Parts of a whole are stacked, in the order given, with each row's total
// at its end; with Percent every row becomes 100%.
func ExampleSeriesBars() {
	harbours := []string{"North harbour", "East quay", "South pier"}
	gear := []render.RowSeries{
		{Name: "nets", Values: []float64{50, 20, 10}},
		{Name: "pots", Values: []float64{30, 60, 20}},
	}
	var svg bytes.Buffer
	_, err := render.SeriesBars(&svg, harbours, gear, render.BarsOptions{
		Layout:     render.LayoutStack,
		RowOptions: render.RowOptions{Unit: "t"},
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(strings.Count(svg.String(), `class="plumb-mark"`), "segments")
	fmt.Println(strings.Contains(svg.String(), ">80 t<"), "(the largest total, labelled first)")

	// Side by side is for at most three series.
	four := append(gear, render.RowSeries{Name: "lines", Values: []float64{1, 2, 3}}, render.RowSeries{Name: "traps", Values: []float64{4, 5, 6}})
	_, err = render.SeriesBars(&svg, harbours, four, render.BarsOptions{Layout: render.LayoutSide})
	fmt.Println(err)
	// Output:
	// 6 segments
	// true (the largest total, labelled first)
	// Layout side: 4 series side by side make each row a chart of its own; at most 3 compare; draw one dot per series on one axis (the default layout), stack them if they are parts of a whole, or one panel per series
}
