package render_test

import (
	"fmt"
	"io"

	"plumb/render"
)

// A line chart of two series: banked to 45°, each line named at its end.
func ExampleLines() {
	months := []float64{1, 2, 3, 4, 5, 6}
	notes, err := render.Lines(io.Discard, []render.Series{
		{Name: "north", X: months, Y: []float64{12, 14, 13, 17, 19, 18}},
		{Name: "south", X: months, Y: []float64{10, 11, 15, 14, 13, 16}},
	}, render.LinesOptions{XName: "month", YName: "sailings"})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, n := range notes {
		fmt.Println(n)
	}
	// Output:
	// banked to 45° by median absolute slope (Cleveland, McGill & McGill 1988): plot 530 × 636 px
}

// A difference chart: north − south against zero, crossings interpolated.
func ExampleDiff() {
	x := []float64{0, 1, 2, 3, 4}
	notes, err := render.Diff(io.Discard,
		render.Series{Name: "north", X: x, Y: []float64{3, 5, 4, 2, 1}},
		render.Series{Name: "south", X: x, Y: []float64{2, 2, 3, 4, 3}},
		render.DiffOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(len(notes), "note:", notes[0])
	// Output:
	// 1 note: banked to 45° by median absolute slope (Cleveland, McGill & McGill 1988): plot 578 × 361 px
}

// A line chart and a difference chart as two panels of one figure, on one
// x scale: each panel draws into the box the figure's grid gives it.
func ExampleLinesPanel() {
	months := []float64{1, 2, 3, 4, 5, 6}
	north := render.Series{Name: "north", X: months, Y: []float64{12, 14, 13, 17, 19, 18}}
	south := render.Series{Name: "south", X: months, Y: []float64{10, 11, 15, 14, 13, 16}}
	s, err := render.FigureScene(render.FigureOptions{Common: render.Common{Title: "Sailings by month"}, ShareX: true},
		render.LinesPanel([]render.Series{north, south}, render.LinesOptions{Common: render.Common{Title: "Sailings"}, XName: "month"}),
		render.DiffPanel(north, south, render.DiffOptions{Common: render.Common{Title: "North − south"}, XName: "month"}),
	)
	if err != nil {
		fmt.Println(err)
		return
	}
	panels := 0
	for _, m := range s.Marks {
		if m.Kind == render.GroupStart && m.Class == "plumb-panel" {
			panels++
		}
	}
	fmt.Println(panels, "panels")
	// Output:
	// 2 panels
}
