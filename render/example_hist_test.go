package render_test

import (
	"bytes"
	"fmt"
	"regexp"

	"plumb/render"
)

// A histogram: the Freedman–Diaconis width (4.18 here) rounded to a nice 5,
// edges on its multiples, one bar per bin from zero with its count and
// edges as data attributes; the note says which rule chose the width.
func ExampleHist() {
	delays := []float64{2, 4, 4, 5, 6, 7, 8, 9, 11, 30}
	var svg bytes.Buffer
	notes, err := render.Hist(&svg, delays, render.HistOptions{Unit: "min", ValueName: "delay"})
	if err != nil {
		fmt.Println(err)
		return
	}
	bar := regexp.MustCompile(`data-value="([^"]+)" data-low="([^"]+)" data-high="([^"]+)"`)
	for _, m := range bar.FindAllStringSubmatch(svg.String(), -1) {
		fmt.Printf("%s to %s: %s\n", m[2], m[3], m[1])
	}
	fmt.Println(notes[0])
	// Output:
	// 0 to 5: 3
	// 5 to 10: 5
	// 10 to 15: 1
	// 30 to 35: 1
	// bins of 5 min: the Freedman–Diaconis width 2·IQR·n^(−1/3) = 4.18 min rounded to a nice whole number, as the values are whole; 7 bins from 0 min to 35 min, each holding values from its lower edge up to but not including its upper edge
}

// Histograms of several groups on shared bins, one panel each: the width
// is chosen once from all the values, so a bar in one panel covers the
// same values as the bar under it in the next.
func ExampleHistPanels() {
	groups := []render.Group{
		{Label: "Winter", Values: []float64{2, 4, 4, 5, 6, 7, 8, 9, 11, 30}},
		{Label: "Summer", Values: []float64{1, 1, 2, 2, 3, 3, 3, 4, 5, 8}},
	}
	var svg bytes.Buffer
	notes, err := render.Figure(&svg, render.FigureOptions{Columns: 1, ShareX: true, ShareY: true}, render.HistPanels(groups, render.HistOptions{Unit: "min"})...)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, n := range notes {
		if n.Code == "bins" {
			fmt.Println(n)
		}
	}
	// Output:
	// bins of 5 min: the Freedman–Diaconis width 2·IQR·n^(−1/3) = 3.32 min rounded to a nice whole number, as the values are whole; 7 bins from 0 min to 35 min, each holding values from its lower edge up to but not including its upper edge; the same bins in every panel
}
