package render_test

import (
	"fmt"

	"plumb/render"
)

// A reviewer of scenes compares every text's size with the medium's floor.
func ExampleMedium_TextFloor() {
	s := &render.Scene{Marks: []render.Mark{
		{Kind: render.Text, Text: "Tonnes landed", Size: 12},
		{Kind: render.Text, Text: "footnote", Size: 10},
	}}
	floor, err := render.Print.TextFloor()
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, m := range s.Marks {
		fmt.Printf("%s: %g px, print floor %.2f px, small: %v\n", m.Text, m.Size, floor, m.Size < floor)
	}
	floor, _ = render.Screen.TextFloor()
	fmt.Printf("screen floor %g px\n", floor)
	// Output:
	// Tonnes landed: 12 px, print floor 9.33 px, small: false
	// footnote: 10 px, print floor 9.33 px, small: false
	// screen floor 12 px
}
