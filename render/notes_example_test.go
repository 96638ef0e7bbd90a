package render_test

import (
	"fmt"

	"plumb/render"
)

// A caller matches notes by code, and looks a code up in NoteCodes for what
// it means; Changed says the drawing differs from the data given.
func ExampleNoteCodes() {
	labels := []string{"Ash", "Birch", "Cedar", "Damson", "Elm"}
	values := []float64{50, 40, 30, 20, 10}
	opt := render.BarsOptions{Additive: true}
	opt.Top = 3
	s, err := render.BarsScene(labels, values, opt)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, n := range s.Notes {
		for _, c := range render.NoteCodes {
			if c.Code == n.Code && n.Changed {
				fmt.Printf("%s (%s): %s\n", n.Code, c.Meaning, n.Text)
			}
		}
	}
	fmt.Println(s.Desc)
	// Output:
	// other (the smallest categories combined into Other (summed or averaged), with the names): combined the 3 smallest of 5 categories into "Other (3)" (summed): "Cedar", "Damson", "Elm"; show more with Top
	// Bar chart of values by category, 3 bars, largest first. Largest: Ash at 50; smallest: Birch at 40. 3 smaller categories are combined in Other (3) at 60. Total: 150.
}
