package render_test

import (
	"bytes"
	"fmt"
	"strings"

	"github.com/paulmach/orb"

	"plumb/render"
)

// A choropleth of three invented districts: rates, not counts, on an
// equal-area projection chosen for their extent; the notes say which
// projection and classes were chosen.
func ExampleMap() {
	square := func(lon, lat float64) orb.MultiPolygon {
		return orb.MultiPolygon{{{{lon, lat}, {lon + 1, lat}, {lon + 1, lat + 1}, {lon, lat + 1}, {lon, lat}}}}
	}
	regions := []render.Region{
		{Name: "Northfold", Shape: square(-8, 61)},
		{Name: "Middlemarsh", Shape: square(-7, 60)},
		{Name: "Southreach", Shape: square(-8, 59)},
	}
	var svg bytes.Buffer
	notes, err := render.Map(&svg, regions, []string{"Northfold", "Middlemarsh", "Southreach"}, []float64{4.2, 9.8, 6.1},
		render.MapOptions{Common: render.Common{Title: "Boardings per resident"}, Classes: 3, ValueName: "boardings per resident"})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(strings.Count(svg.String(), `class="plumb-mark"`), "regions")
	for _, n := range notes {
		if n.Code == "map-projection" {
			fmt.Println(n.Text)
		}
	}
	// Output:
	// 3 regions
	// projection: Albers equal-area conic, standard parallels 59.5° and 61.5°, centred on -7.0°
}
