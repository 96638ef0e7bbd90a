package main

import (
	"bytes"
	"embed"
	"fmt"
	"math"
	"math/rand/v2"
)

//go:generate go run ../../testdata/ferrygen -o demodata

// demoFS holds the demo data sets of the invented ferry operator, written by
// testdata/ferrygen from fixed seeds, so that `plumb demo` needs no files.
//
//go:embed demodata/*.csv demodata/*.geojson
var demoFS embed.FS

// demoData is a demo data set by name: one of the generated tables below,
// or a file of demodata/.
func demoData(name string) ([]byte, error) {
	switch name {
	case "sailings.csv":
		return sailings(400, 1), nil
	case "sailings-sample.csv":
		return sailings(150, 3), nil
	case "sailings-year.csv":
		return sailings(20000, 2), nil
	case "crossings-monthly.csv":
		return crossings(1), nil
	}
	return demoFS.ReadFile("demodata/" + name)
}

// vesselClass is one kind of vessel of the invented fleet: its cruising
// speed and its fuel use per kilometre.
type vesselClass struct {
	name         string
	kmh, fuelKm  float64
	seats, share int // seats per sailing; relative number of sailings
}

var fleet = []vesselClass{
	{"Car ferry", 26, 38, 600, 5},
	{"Fast craft", 52, 55, 280, 3},
	{"Island launch", 17, 9, 60, 2},
}

// sailings invents n sailings of the ferry company from a fixed seed, one
// row each: the vessel class, the crossing's length, the minutes it took
// (slower in wind), the passengers carried, the fuel burnt, the wind and
// the delay at departure (growing steeply in strong wind).
// It is generated here rather than in testdata/ferrygen because the
// scatter demos want thousands of rows, which need not sit in the
// repository as a file.
func sailings(n int, seed uint64) []byte {
	r := rand.New(rand.NewPCG(seed, 2026))
	var b bytes.Buffer
	b.WriteString("vessel,crossing_km,minutes,passengers,fuel_l,wind_kn,delay_min\n")
	total := 0
	for _, v := range fleet {
		total += v.share
	}
	for range n {
		k := r.IntN(total)
		v := fleet[0]
		for _, c := range fleet {
			if k < c.share {
				v = c
				break
			}
			k -= c.share
		}
		km := float64(3 + r.IntN(38))
		if v.name == "Island launch" {
			km = float64(2 + r.IntN(14))
		}
		wind := math.Abs(float64(8 + r.NormFloat64()*6))
		minutes := float64(km/v.kmh*60) * float64(1+wind*wind/2000) * float64(1+r.NormFloat64()*0.06)
		load := math.Min(1, math.Max(0.05, float64(0.55+r.NormFloat64()*0.2-wind/80)))
		pax := int(math.Round(float64(v.seats) * load))
		fuel := float64(km*v.fuelKm) * float64(1+wind/60) * float64(1+r.NormFloat64()*0.05)
		delay := float64(r.ExpFloat64()*3) + float64(wind*wind*wind/400)*float64(1+r.NormFloat64()*0.3)
		fmt.Fprintf(&b, "%s,%.0f,%.1f,%d,%.0f,%.1f,%.1f\n", v.name, km, math.Max(1, minutes), pax, fuel, wind, math.Max(0, delay))
	}
	return b.Bytes()
}
