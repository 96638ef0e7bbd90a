package render_test

import (
	"bytes"
	"fmt"
	"strings"

	"plumb/render"
)

// Small multiples: one bar chart per harbour, planned as panels and drawn
// together by Figure. ShareX gives every panel one value scale along x,
// so a bar of 100 t has one length in every panel; each panel's title is
// its heading in the grid.
func ExampleFigure() {
	kinds := []string{"grain", "timber", "fuel"}
	tonnes := map[string][]float64{
		"Kettlewick":  {3196, 1799, 3954},
		"Saltmarrow":  {1214, 392, 1115},
		"Lanternquay": {1207, 1157, 2273},
		"Cindergull":  {385, 1422, 555},
	}
	var panels []render.Panel
	for _, harbour := range []string{"Kettlewick", "Saltmarrow", "Lanternquay", "Cindergull"} {
		panels = append(panels, render.BarsPanel(kinds, tonnes[harbour], render.BarsOptions{
			Common:     render.Common{Title: harbour},
			RowOptions: render.RowOptions{ValueName: "tonnes"},
		}))
	}
	var svg bytes.Buffer
	_, err := render.Figure(&svg, render.FigureOptions{
		Common: render.Common{Title: "Cargo landed, 2025", Source: "Invented figures"},
		ShareX: true,
	}, panels...)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(strings.Count(svg.String(), `class="plumb-panel"`), "panels,", strings.Count(svg.String(), `class="plumb-mark"`), "bars")
	// Output: 4 panels, 12 bars
}
