package scale_test

import (
	"fmt"
	"strings"

	"plumb/scale"
)

func labels(t scale.Ticks, unit string) string {
	f := scale.TickFormat(t.Values, unit)
	out := make([]string, len(t.Values))
	for i, v := range t.Values {
		out[i] = f.Format(v)
	}
	return strings.Join(out, " ")
}

func ExampleExtended() {
	// The data run from 8.1 to 14.1 and about four ticks are wanted.
	fmt.Println(labels(scale.Extended(8.1, 14.1, 4, false), ""))
	// Loose ticks enclose the data.
	fmt.Println(labels(scale.Extended(8.1, 14.1, 4, true), ""))
	// Output:
	// 8 10 12 14
	// 7.5 10.0 12.5 15.0
}

func ExampleNiceDomain() {
	t := scale.NiceDomain(-3.7, 12.2, 6)
	fmt.Println(labels(t, ""), "step", t.Step)
	// A constant series still gets an axis.
	fmt.Println(labels(scale.NiceDomain(100, 100, 5), "kg"))
	// Output:
	// −5.0 −2.5 0.0 2.5 5.0 7.5 10.0 12.5 step 2.5
	// 90 kg 95 kg 100 kg 105 kg 110 kg
}

func ExampleBarDomain() {
	// Bars start at zero, so the domain reaches down to it.
	fmt.Println(labels(scale.BarDomain(8.1, 14.1, 4), ""))
	// Output:
	// 0 5 10 15
}

func ExampleTickFormat() {
	ticks := []float64{0, 0.5e6, 1e6, 1.5e6, 2e6, 2.5e6}
	f := scale.TickFormat(ticks, "")
	for _, v := range ticks {
		fmt.Print(f.Format(v), ";")
	}
	fmt.Println()
	fmt.Println(scale.TickFormat([]float64{0, 20, 40}, "%").Format(40))
	// Output:
	// 0;0.5M;1.0M;1.5M;2.0M;2.5M;
	// 40%
}

func ExampleValueFormat() {
	// Millions would print 12,000 as "−0.01M": one significant digit. The
	// values are printed in full instead, grouped in thousands.
	values := []float64{2461234, 980500, -12000}
	f := scale.ValueFormat(values, "")
	for _, v := range values {
		fmt.Println(f.Format(v))
	}
	// Abbreviations that keep three digits of every value are used.
	g := scale.ValueFormat([]float64{118750, 95000}, "$")
	fmt.Println(g.Format(118750), g.Format(95000))
	// Output:
	// 2,461,234
	// 980,500
	// −12,000
	// $119k $95k
}

func ExampleLinear() {
	// Map the domain 0..100 onto pixels 400 (bottom) up to 20 (top).
	y := scale.Linear{D0: 0, D1: 100, R0: 400, R1: 20}
	fmt.Println(y.Map(0), y.Map(50), y.Map(100), y.Invert(210))
	// Output:
	// 400 210 20 50
}

// The Albers conic of Snyder's worked example (Map Projections: A Working
// Manual, 1987, pp. 291-292), on the unit sphere.
func ExampleAlbersEqualArea() {
	p := scale.AlbersEqualArea{Lat0: 23, Lon0: -96, Lat1: 29.5, Lat2: 45.5}
	x, y := p.Project(-75, 35)
	fmt.Printf("%.7f %.7f\n", x, y)
	// Output: 0.2952720 0.2416774
}
