package main

import (
	"bytes"
	"fmt"
	"math"
	"math/rand/v2"
)

// crossingRoute is one route of the crossings demo: its timetabled
// minutes, how much a rough sea slows it (share of the time), and how many
// sailings a month it runs in summer.
type crossingRoute struct {
	name     string
	minutes  float64
	exposure float64
	sailings int
}

var crossingRoutes = []crossingRoute{
	{"Kettlewick Harbour to Great Osk", 35, 0.30, 60},
	{"Kettlewick Harbour to Cindergull Bay", 60, 0.18, 40},
}

// crossings invents the minutes every sailing of two routes took in each
// month of 2025, from a fixed seed: many rows per month and route, the
// repeated measurements that plumb lines --agg summarises. Crossings are
// slower and more variable in the winter storms, with a long tail of
// rough days; the Cindergull Bay vessel is in dry dock in February and
// sails once, on a chartered boat, so that the month has n = 1.
// It is generated here rather than in testdata/ferrygen, like sailings,
// because its thousand rows need not sit in the repository as a file.
func crossings(seed uint64) []byte {
	r := rand.New(rand.NewPCG(seed, 2027))
	var b bytes.Buffer
	b.WriteString("month,route,minutes\n")
	// Storminess by month, January first: the share of rough sailings.
	storm := [12]float64{0.7, 0.65, 0.5, 0.3, 0.15, 0.08, 0.06, 0.1, 0.2, 0.4, 0.55, 0.7}
	season := [12]float64{0.6, 0.6, 0.7, 0.8, 1, 1.2, 1.3, 1.3, 1.1, 0.9, 0.7, 0.65}
	for m := range 12 {
		for _, c := range crossingRoutes {
			n := int(math.Round(float64(c.sailings) * season[m]))
			if c.name == crossingRoutes[1].name && m == 1 {
				n = 1
			}
			for range n {
				t := c.minutes * (1 + r.NormFloat64()*0.04)
				if r.Float64() < storm[m] {
					t *= 1 + c.exposure*(0.3+r.ExpFloat64()*0.5)
				}
				fmt.Fprintf(&b, "2025-%02d,%s,%.0f\n", m+1, c.name, math.Max(c.minutes*0.85, t))
			}
		}
	}
	return b.Bytes()
}
