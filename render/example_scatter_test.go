package render_test

import (
	"fmt"
	"io"
	"math"

	"plumb/render"
)

// A scatter plot with a least-squares line: the notes give the line, r
// and R².
func ExampleScatter() {
	km := []float64{1, 2, 3, 4, 5}
	minutes := []float64{2, 4, 5, 4, 5}
	notes, err := render.Scatter(io.Discard, km, minutes, render.ScatterOptions{Fit: "line", XName: "crossing (km)", YName: "minutes"})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, n := range notes {
		fmt.Println(n)
	}
	// Output:
	// least-squares line: y = 2.2 + 0.6·x; r = 0.77, R² = 0.60 (5 points)
}

// Points in groups are drawn in the categorical colours; each circle
// carries its data.
func ExampleScatterScene() {
	x := []float64{1, 2, 3, 11, 12, 13}
	y := []float64{5, 6, 5, 20, 22, 21}
	groups := []string{"launch", "launch", "launch", "ferry", "ferry", "ferry"}
	s, err := render.ScatterScene(x, y, render.ScatterOptions{Groups: groups})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, m := range s.Marks {
		if m.Kind == render.Circle && m.Class == "plumb-mark" {
			fmt.Println(m.Attrs, m.Fill)
		}
	}
	// Output:
	// [{x 1} {y 5} {group launch}] #5a95ef
	// [{x 2} {y 6} {group launch}] #5a95ef
	// [{x 3} {y 5} {group launch}] #5a95ef
	// [{x 11} {y 20} {group ferry}] #cd7304
	// [{x 12} {y 22} {group ferry}] #cd7304
	// [{x 13} {y 21} {group ferry}] #cd7304
}

// A scatterplot matrix of three variables: nine panels, the diagonal
// naming each variable over its histogram.
func ExampleMatrix() {
	var km, minutes, fuel []float64
	for i := range 40 {
		v := float64(i)
		km = append(km, v)
		minutes = append(minutes, 2*v+5*math.Sin(v))
		fuel = append(fuel, 40*v+30*math.Cos(v/3))
	}
	s, err := render.MatrixScene([]render.Variable{{Name: "km", Values: km}, {Name: "minutes", Values: minutes}, {Name: "fuel", Values: fuel}}, render.MatrixOptions{})
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
	fmt.Println(s.Desc)
	// Output:
	// 9 panels
	// Scatterplot matrix of 3 variables (km, minutes, fuel) over 40 rows: each pair plotted against each other on shared scales, each variable's distribution on the diagonal. km and minutes: r = 0.99. km and fuel: r = 1.00. minutes and fuel: r = 0.99.
}
