package render

import (
	"io"
	"math"
	"testing"
)

// BenchmarkPNGSlide draws 1920x1080 slide figures to PNG: issue 13 asks
// for under 300 ms.
func BenchmarkPNGSlide(b *testing.B) {
	x := make([]float64, 120)
	north, south := make([]float64, len(x)), make([]float64, len(x))
	for i := range x {
		x[i] = 2014 + float64(i)/12
		north[i] = 100 + 20*math.Sin(float64(i)/9) + float64(i)/4
		south[i] = 90 + 15*math.Cos(float64(i)/7)
	}
	lines, err := LinesScene([]Series{{Name: "North", X: x, Y: north}, {Name: "South", X: x, Y: south}},
		LinesOptions{Common: Common{Medium: Slide, Title: "Freight, monthly", Source: "Invented figures"}})
	if err != nil {
		b.Fatal(err)
	}
	labels := []string{"Harbour", "Old town", "Station", "Riverside", "Hill", "Market", "Airport", "Depot"}
	bars, err := BarsScene(labels, []float64{412, 288.5, 197, 150, 96.25, 31, 250, 75}, BarsOptions{Common: Common{Medium: Slide, Title: "Visitors per day"}})
	if err != nil {
		b.Fatal(err)
	}
	for _, bc := range []struct {
		name string
		s    *Scene
	}{{"lines", lines}, {"bars", bars}} {
		b.Run(bc.name, func(b *testing.B) {
			if w, h, _ := PNGSize(bc.s, 1); w != 1920 || h != 1080 {
				b.Fatalf("slide is %dx%d", w, h)
			}
			b.ReportAllocs()
			for b.Loop() {
				if err := WritePNG(io.Discard, bc.s); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
