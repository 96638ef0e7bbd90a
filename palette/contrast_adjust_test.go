package palette

import (
	"fmt"
	"math"
	"testing"
)

func TestDarkenToContrast(t *testing.T) {
	white := SRGB{R: 1, G: 1, B: 1}
	cases := []struct {
		name string
		in   string
		bg   SRGB
		min  float64
		ok   bool
	}{
		// WCAG 2.x: 4.5:1 for text (success criterion 1.4.3).
		{"light orange darkens", "#e69f00", white, 4.5, true},
		{"sky blue darkens", "#56b4e9", white, 4.5, true},
		{"yellow darkens", "#f0e442", white, 4.5, true},
		{"dark blue is kept", "#0072b2", white, 4.5, true},
		{"black on black cannot", "#333333", SRGB{}, 4.5, false},
	}
	for _, c := range cases {
		in, err := ParseHex(c.in)
		if err != nil {
			t.Fatal(err)
		}
		got, ok := DarkenToContrast(in, c.bg, c.min)
		if ok != c.ok {
			t.Errorf("%s: ok = %v, want %v", c.name, ok, c.ok)
			continue
		}
		if !ok {
			continue
		}
		if r := Contrast(got, c.bg); r < c.min {
			t.Errorf("%s: %s has contrast %.3f, want at least %g", c.name, got.Hex(), r, c.min)
		}
		if Contrast(in, c.bg) >= c.min && got.Hex() != in.Hex() {
			t.Errorf("%s: %s already met %g but became %s", c.name, c.in, c.min, got.Hex())
		}
		// The hue is kept: within a few degrees in OKLCH for chromatic colours.
		a, b := OKLabToOKLCH(SRGBToOKLab(in)), OKLabToOKLCH(SRGBToOKLab(got))
		if d := math.Abs(math.Mod(a.H-b.H+540, 360) - 180); a.C > 0.05 && d > 6 {
			t.Errorf("%s: hue moved %.1f° (%s → %s)", c.name, d, c.in, got.Hex())
		}
		// Only as dark as needed: a step lighter would fail (no overshoot).
		if Contrast(in, c.bg) < c.min {
			l := OKLabToOKLCH(SRGBToOKLab(got))
			lighter := OKLCHToSRGB(OKLCH{L: l.L + 0.03, C: a.C, H: a.H}).Quantize()
			if Contrast(lighter, c.bg) >= c.min {
				t.Errorf("%s: %s is darker than needed: %s also meets %g", c.name, got.Hex(), lighter.Hex(), c.min)
			}
		}
	}
}

func ExampleDarkenToContrast() {
	orange, _ := ParseHex("#e69f00")
	label, _ := DarkenToContrast(orange, SRGB{R: 1, G: 1, B: 1}, 4.5)
	fmt.Println(label.Hex(), Contrast(label, SRGB{R: 1, G: 1, B: 1}) >= 4.5)
	// Output: #9f6d00 true
}
