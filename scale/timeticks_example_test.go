package scale_test

import (
	"fmt"
	"math"
	"time"

	"plumb/scale"
)

func ExampleParseTime() {
	t, p, err := scale.ParseTime("2024-03-17T08:30:00+02:00")
	fmt.Println(t, p, err)
	_, _, err = scale.ParseTime("2023-02-29")
	fmt.Println(err)
	// Output:
	// 2024-03-17 06:30:00 +0000 UTC second <nil>
	// parse time "2023-02-29": day 29 out of range 01-28 for 2023-02: not an ISO 8601 date or time; expected 2024, 2024-03, 2024-03-17, 2024-03-17T08:30, 2024-03-17T08:30:00 (optionally with .fraction, Z or ±hh:mm; a space may replace T)
}

func ExampleDetectTime() {
	fmt.Println(scale.DetectTime([]string{"2024-01", "2024-02", ""}))
	fmt.Println(scale.DetectTime([]string{"1999", "2000"})) // years, or plain numbers?
	// Output:
	// true month
	// false year
}

func ExampleTimeTicks() {
	lo := time.Date(2024, 1, 1, 0, 0, 0, 0, time.UTC)
	hi := time.Date(2025, 1, 1, 0, 0, 0, 0, time.UTC)
	labels := func(ticks []scale.TimeTick) (s []string) {
		for _, t := range ticks {
			s = append(s, t.Label)
		}
		return s
	}
	fmt.Printf("%q\n", labels(scale.TimeTicks(lo, hi, 5, nil)))
	lo = time.Date(2024, 3, 17, 17, 0, 0, 0, time.UTC)
	fmt.Printf("%q\n", labels(scale.TimeTicks(lo, lo.Add(12*time.Hour), 5, nil)))
	// Output:
	// ["Jan 2024" "Apr" "Jul" "Oct" "Jan 2025"]
	// ["Mar 17, 2024 18:00" "21:00" "Mar 18" "03:00"]
}

func ExampleBankMedianSlope() {
	// y = sin x on [0, 2π], drawn on the domain [0, 2π] x [-1, 1].
	var line scale.Polyline
	for k := 0; k <= 1000; k++ {
		x := 2 * math.Pi * float64(k) / 1000
		line.X = append(line.X, x)
		line.Y = append(line.Y, math.Sin(x))
	}
	alpha, ok := scale.BankMedianSlope([]scale.Polyline{line}, 2*math.Pi, 2)
	fmt.Printf("height/width %.4f %v\n", alpha, ok)
	alpha, ok = scale.BankWeightedOrientation([]scale.Polyline{line}, 2*math.Pi, 2)
	fmt.Printf("height/width %.4f %v\n", alpha, ok)
	// Output:
	// height/width 0.4502 true
	// height/width 0.5041 true
}

func ExampleM4() {
	xs := []float64{0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11}
	ys := []float64{5, 7, 2, 9, 4, 6, 3, 3, 8, 1, 6, 4}
	// Two pixel columns over [0, 12): keep first, min, max and last of each.
	keep := scale.M4(nil, xs, ys, 0, 12, 2)
	for _, i := range keep {
		fmt.Printf("(%g,%g)", xs[i], ys[i])
	}
	fmt.Println()
	// Output:
	// (0,5)(2,2)(3,9)(5,6)(6,3)(8,8)(9,1)(11,4)
}
