package layout_test

import (
	"fmt"

	"plumb/layout"
)

func ExampleFace_Width() {
	f := layout.GoRegular()
	fmt.Printf("%s: %.3f px wide, %.3f up, %.3f down at 12 px\n",
		f.Family(), f.Width("Harbour Loop", 12), f.Ascent(12), f.Descent(12))
	// Output: Go: 73.383 px wide, 11.338 up, 2.531 down at 12 px
}

func ExampleWrap() {
	f := layout.GoRegular()
	lines, cut := layout.Wrap(f, "Saint Brannock to Outer Gull Skerry via Mallow", 12, 110, 2)
	for _, l := range lines {
		fmt.Println(l)
	}
	fmt.Println("cut:", cut)
	// Output:
	// Saint Brannock to
	// Outer Gull Skerry…
	// cut: true
}

func ExampleSpread() {
	// Three series end at nearly the same value; their 12 px tall labels
	// must not overlap and must stay within the 0–200 px plot.
	got, ok := layout.Spread([]float64{100, 96, 104}, 12, 0, 200)
	fmt.Println(got, ok)
	// Output: [100 88 112] true
}

func ExampleTextBox() {
	f := layout.GoRegular()
	a := layout.TextBox(f, "Harbour Loop", 12, 100, 40, layout.AnchorEnd)
	b := layout.TextBox(f, "Outer Gull", 12, 100, 52, layout.AnchorEnd)
	fmt.Printf("%.2f wide; overlap: %v\n", a.W, a.Overlaps(b))
	// Output: 73.38 wide; overlap: true
}
