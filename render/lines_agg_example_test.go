package render_test

import (
	"bytes"
	"fmt"
	"strings"

	"plumb/render"
)

// Repeated measurements: three subjects scored each week, one row per
// subject and week. Agg draws the median per week, with the interquartile
// range as a band behind it, and notes n per week.
func ExampleLinesOptions_agg() {
	week := []float64{1, 1, 1, 2, 2, 2, 3, 3}
	score := []float64{10, 12, 17, 11, 15, 19, 14, 18}
	var svg bytes.Buffer
	notes, err := render.Lines(&svg, []render.Series{{Name: "score", X: week, Y: score}},
		render.LinesOptions{XName: "week", Agg: render.AggMedian})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, n := range notes {
		if n.Code == "agg" {
			fmt.Println(n.Text)
		}
	}
	fmt.Println(strings.Count(svg.String(), `class="plumb-band"`), "band")
	// Output:
	// drew the median of the values at each x (n = 2 to 3 per x); the band is the interquartile range (first to third quartile, type 7 of Hyndman & Fan 1996)
	// 1 band
}

// Without Agg, repeated x values are refused, naming the alternative.
func ExampleLinesOptions_repeatedX() {
	_, err := render.LinesScene([]render.Series{{Name: "score", X: []float64{1, 1, 2}, Y: []float64{10, 12, 11}}}, render.LinesOptions{})
	fmt.Println(err)
	// Output:
	// series "score" has two points at x = 1: a line needs one value per x; combine them first; for repeated measurements draw a summary line through the mean or median at each x, with a band for the spread (Agg mean or median, Spread)
}
