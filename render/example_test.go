package render_test

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"strings"

	"plumb/render"
)

// A bar chart from plain slices: sorted largest first, starting at zero,
// with the values at the bar ends. The notes say what was decided.
func ExampleBars() {
	regions := []string{"North", "South", "East", "West"}
	revenue := []float64{120, 340, 95, 410}

	var svg bytes.Buffer
	notes, err := render.Bars(&svg, regions, revenue, render.BarsOptions{
		Common:     render.Common{Title: "Revenue by region", Source: "Quarterly report"},
		RowOptions: render.RowOptions{ValueName: "revenue", LabelName: "region"},
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(strings.Count(svg.String(), `class="plumb-mark"`), "bars,", len(notes), "notes")
	// Output: 4 bars, 0 notes
}

// A bar chart that would not start at zero is refused, with the honest
// alternative in the message.
func ExampleBars_refused() {
	from := 80.0
	_, err := render.Bars(os.Stdout, []string{"a", "b"}, []float64{90, 100}, render.BarsOptions{RowOptions: render.RowOptions{From: &from}})
	fmt.Println(errors.Is(err, render.ErrRefused))
	fmt.Println(err)
	// Output:
	// true
	// From 80: would cut every bar short of its true length; a bar's length is its value, so bars start at zero. To compare values far from zero, use a dot plot (plumb dots), which may start anywhere
}

// Many categories: the smallest are combined into one Other bar, placed
// last, and a note lists them.
func ExampleBars_other() {
	labels := []string{"a", "b", "c", "d", "e", "f"}
	values := []float64{60, 50, 40, 3, 2, 1}
	var svg bytes.Buffer
	// Counts are parts of a whole: the smallest may be summed into Other.
	notes, err := render.Bars(&svg, labels, values, render.BarsOptions{RowOptions: render.RowOptions{Top: 4}, Additive: true})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(notes[0])
	// Medians are not: the smallest are left out, and the chart says so.
	notes, err = render.Bars(&svg, labels, values, render.BarsOptions{RowOptions: render.RowOptions{Top: 4}})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(notes[0].Code)
	// Output:
	// combined the 3 smallest of 6 categories into "Other (3)" (summed): "d", "e", "f"; show more with Top
	// left-out
}

// A dot plot places values on a domain fitted to the data: here the axis
// runs from about 85 to 100, not from zero.
func ExampleDots() {
	routes := []string{"Harbour", "Point", "Sound"}
	onTime := []float64{91.5, 88, 96.2}
	s, err := render.DotsScene(routes, onTime, render.DotsOptions{RowOptions: render.RowOptions{Unit: "%", ValueName: "on time"}})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(s.Desc)
	// Output: Dot plot of on time by category, 3 dots, largest first. Largest: Sound at 96.2%; smallest: Point at 88.0%.
}
