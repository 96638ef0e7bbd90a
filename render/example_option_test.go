package render_test

import (
	"errors"
	"fmt"
	"io"

	"plumb/render"
)

// A Go caller tells a bad option from bad data or a refusal with
// errors.As, and names the option in its own words.
func ExampleOptionError() {
	_, err := render.Bars(io.Discard, []string{"a", "b", "c"}, []float64{3, 2, 1},
		render.BarsOptions{RowOptions: render.RowOptions{Top: 1}})
	var oe *render.OptionError
	if errors.As(err, &oe) {
		fmt.Printf("option %s, value %s: %v\n", oe.Option, oe.Value, oe.Err)
	}
	// Output: option Top, value 1: show at least 2 categories
}

// Common.Names gives options the caller's names in notes and messages:
// here a form field, "rows to show", for Top.
func ExampleOptionNames() {
	s, err := render.BarsScene([]string{"a", "b", "c", "d"}, []float64{4, 3, 2, 1}, render.BarsOptions{
		Common:     render.Common{Names: render.OptionNames{"Top": `"rows to show"`}},
		RowOptions: render.RowOptions{Top: 3},
		Additive:   true,
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(s.Notes[0].Text)
	// Output: combined the 2 smallest of 4 categories into "Other (2)" (summed): "c", "d"; show more with "rows to show"
}
