package render_test

import (
	"fmt"
	"io"
	"math"

	"plumb/render"
)

// A heat map of a small table in cluster order: rows alike are drawn
// together, with their dendrogram; the missing cell is drawn as "no data".
func ExampleHeat() {
	m := render.HeatMatrix{
		Rows: []string{"Harbour", "Quay", "Point", "Sands"},
		Cols: []string{"Mon", "Tue", "Wed", "Thu", "Fri"},
		Values: []float64{
			62, 60, 64, 61, 80,
			21, 25, 22, math.NaN(), 40,
			60, 59, 66, 63, 78,
			24, 20, 23, 22, 41,
		},
	}
	notes, err := render.Heat(io.Discard, m, render.HeatOptions{
		Common:    render.Common{Title: "Load by stop and weekday"},
		RowOrder:  render.HeatByCluster,
		Tree:      true,
		ValueName: "load, % of seats",
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, n := range notes {
		fmt.Println(n.Code)
	}
	// Output:
	// heat-cluster-missing
	// heat-cluster
	// heat-scale
	// heat-missing
}
