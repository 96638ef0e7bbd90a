package palette_test

import (
	"fmt"

	"plumb/palette"
)

func ExampleDeltaE2000() {
	// Pair 1 of Sharma, Wu & Dalal (2005), Table I: 2.0425.
	d := palette.DeltaE2000(palette.Lab{L: 50, A: 2.6772, B: -79.7751}, palette.Lab{L: 50, A: 0, B: -82.7485})
	fmt.Printf("%.4f\n", d)
	// Output: 2.0425
}

func ExampleContrast() {
	black, _ := palette.ParseHex("#000")
	white, _ := palette.ParseHex("#fff")
	fmt.Println(palette.Contrast(black, white))
	// Output: 21
}

func ExampleSimulate() {
	red, _ := palette.ParseHex("#cc3333")
	green, _ := palette.ParseHex("#339933")
	for _, v := range palette.Visions {
		a := palette.SRGBToLab(palette.Simulate(red, v, 1))
		b := palette.SRGBToLab(palette.Simulate(green, v, 1))
		fmt.Printf("%s %.1f\n", v, palette.DeltaE2000(a, b))
	}
	// Output:
	// normal 68.5
	// protan 22.5
	// deutan 3.6
	// tritan 64.3
}

func ExampleCheck() {
	r := palette.Check([]palette.SRGB{palette.Neutral(), palette.Accent()}, palette.SRGB{R: 1, G: 1, B: 1})
	fmt.Println(r.Safe, len(r.Problems))
	// Output: true 0
}

func ExampleCategorical() {
	p, _ := palette.Categorical(3)
	fmt.Println(p.Hex())
	fmt.Printf("worst case %.1f\n", p.WorstCase())
	// Output:
	// [#5a95ef #cd7304 #744f71]
	// worst case 24.5
}

func ExampleGamutMap() {
	// A chroma sRGB cannot show at this lightness and hue is reduced;
	// lightness and hue are kept.
	c := palette.GamutMap(palette.OKLCH{L: 0.7, C: 0.4, H: 150})
	fmt.Printf("%.2f %.3f %.0f %s\n", c.L, c.C, c.H, palette.OKLCHToSRGB(c).Hex())
	// Output: 0.70 0.193 150 #00be58
}
