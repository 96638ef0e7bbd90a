package render

import (
	"testing"

	"plumb/palette"
)

// TestThemeContrast pins the contrasts the theme promises on a white
// background (palette/THEME.md): the grid recedes below 1.5:1, context
// marks stay under the 3:1 of data marks, the zero line and the marks
// reach 3:1 (WCAG 2.x SC 1.4.11, graphical objects), and text keeps 4.5:1
// (WCAG 2.x SC 1.4.3).
func TestThemeContrast(t *testing.T) {
	th := defaultTheme()
	white := palette.SRGB{R: 1, G: 1, B: 1}
	tests := []struct {
		name   string
		hex    Colour
		lo, hi float64 // contrast on white
	}{
		{"grid", th.grid, 1.1, 1.5},
		{"context", th.context, 1.5, palette.MinMarkContrast},
		{"baseline", th.baseline, palette.MinMarkContrast, 21},
		{"neutral", th.neutral, palette.MinMarkContrast, 21},
		{"accent", th.accent, palette.MinMarkContrast, 21},
		{"text", th.text, palette.MinTextContrast, 21},
		{"muted", th.muted, palette.MinTextContrast, 21},
	}
	for _, tc := range tests {
		c, err := palette.ParseHex(tc.hex.Hex())
		if err != nil {
			t.Fatalf("theme colour %s %q: %v", tc.name, tc.hex, err)
		}
		if r := palette.Contrast(c, white); r < tc.lo || r >= tc.hi {
			t.Errorf("%s %s has contrast %.2f:1 on white, want %.2f to %.2f", tc.name, tc.hex, r, tc.lo, tc.hi)
		}
	}
}

// TestThemeIsDerived checks that every theme colour but the inside-label
// white is the generated palette colour, so that the theme cannot drift
// from what `go generate ./palette` derives.
func TestThemeIsDerived(t *testing.T) {
	th := defaultTheme()
	tests := []struct {
		name string
		got  Colour
		want palette.SRGB
	}{
		{"neutral", th.neutral, palette.Neutral()},
		{"accent", th.accent, palette.Accent()},
		{"context", th.context, palette.Context()},
		{"grid", th.grid, palette.Grid()},
		{"baseline", th.baseline, palette.Text()},
		{"text", th.text, palette.Text()},
		{"muted", th.muted, palette.Muted()},
	}
	for _, tc := range tests {
		if tc.got.Hex() != tc.want.Hex() {
			t.Errorf("theme %s = %s, want the generated %s", tc.name, tc.got, tc.want.Hex())
		}
	}
}
