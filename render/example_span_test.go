package render_test

import (
	"bytes"
	"fmt"
	"regexp"

	"plumb/render"
)

// Ranges computed from raw values (minimum, mean, maximum by default), with
// this year's value overlaid as a dot named once, directly.
func ExampleSpan() {
	ranges, err := render.RangesFromGroups([]render.Group{
		{Label: "Jan", Values: []float64{4.1, 5.6, 6.0, 3.2, 5.1}},
		{Label: "Jul", Values: []float64{15.2, 16.8, 14.9, 17.5, 16.0}},
	}, render.StatRange)
	if err != nil {
		fmt.Println(err)
		return
	}
	jan, jul := 6.3, 16.4
	ranges[0].Mark, ranges[1].Mark = &jan, &jul
	var svg bytes.Buffer
	_, err = render.Span(&svg, ranges, render.SpanOptions{Unit: "°C", ValueName: "mean temperature", Stat: render.StatRange, MarkName: "2025", Order: render.ByData})
	if err != nil {
		fmt.Println(err)
		return
	}
	mark := regexp.MustCompile(`data-label="([^"]+)" data-low="([^"]+)" data-mid="([^"]+)" data-high="([^"]+)"`)
	for _, m := range mark.FindAllStringSubmatch(svg.String(), -1) {
		fmt.Println(m[1], m[2], m[3], m[4])
	}
	// Output:
	// Jan 3.2 4.8 6
	// Jul 14.9 16.080000000000002 17.5
}
