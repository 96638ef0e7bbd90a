package render_test

import (
	"bytes"
	"fmt"
	"regexp"

	"plumb/render"
)

// Box plots of crossing times per route: quartiles by Hyndman & Fan type 7,
// whiskers to the most extreme values within 1.5 IQR, the rest as circles.
// The box marks carry their quartiles for CSS, tests and audits.
func ExampleBox() {
	groups := []render.Group{
		{Label: "Harbour to Osk", Values: []float64{2, 4, 4, 5, 6, 7, 8, 9, 11, 30}},
		{Label: "Osk to Holm", Values: []float64{1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 100}},
	}
	var svg bytes.Buffer
	notes, err := render.Box(&svg, groups, render.BoxOptions{Unit: "min", ValueName: "crossing time", GroupName: "route"})
	if err != nil {
		fmt.Println(err)
		return
	}
	box := regexp.MustCompile(`data-label="([^"]+)" data-q1="([^"]+)" data-median="([^"]+)" data-q3="([^"]+)"`)
	for _, m := range box.FindAllStringSubmatch(svg.String(), -1) {
		fmt.Println(m[1], "Q1", m[2], "median", m[3], "Q3", m[4])
	}
	fmt.Println(len(regexp.MustCompile(`class="plumb-outlier"`).FindAllString(svg.String(), -1)), "outliers")
	fmt.Println(notes[len(notes)-1])
	// Output:
	// Harbour to Osk Q1 4.25 median 6.5 Q3 8.75
	// Osk to Holm Q1 3.5 median 6 Q3 8.5
	// 2 outliers
	// boxes span the quartiles (Hyndman & Fan type 7); whiskers reach the most extreme values within 1.5 IQR of the box; 2 values beyond them drawn as circles
}
