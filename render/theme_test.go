package render

import (
	"math"
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

// TestInsideLabelColours pins the colour of a value label set inside a bar
// of each theme mark colour: the bar's own hue, 4.5:1 against the bar (WCAG
// 2.x SC 1.4.3), never plain white; dark where a dark colour of the hue
// reaches the contrast.
func TestInsideLabelColours(t *testing.T) {
	th := defaultTheme()
	tests := []struct {
		name string
		bar  Colour
		dark bool   // the label is darker than the bar
		want string // pinned: palette/THEME.md and DEVELOPERS.md quote it
	}{
		// #6b7a78 has 4.49:1 on white: only a dark label can reach 4.5:1.
		{"neutral", th.neutral, true, "#010807"},
		// #cf174b has 5.42:1 on white: no dark colour reaches 4.5:1
		// against it, a light tint of its hue does.
		{"accent", th.accent, false, "#ffe4e5"},
	}
	for _, tc := range tests {
		got, ok := insideLabel(tc.bar)
		if !ok {
			t.Fatalf("%s %s: no inside label colour", tc.name, tc.bar)
		}
		if got.Hex() != tc.want {
			t.Errorf("%s: inside label %s, want %s", tc.name, got.Hex(), tc.want)
		}
		bar, lab := tc.bar.SRGB(), got.SRGB()
		if r := palette.Contrast(bar, lab); r < palette.MinTextContrast {
			t.Errorf("%s: label %s on bar %s has %.2f:1, want at least 4.5:1", tc.name, got, tc.bar, r)
		}
		if got.Hex() == "#ffffff" {
			t.Errorf("%s: label %s is plain white, want a colour of the bar's hue", tc.name, got)
		}
		if dark := palette.RelativeLuminance(lab) < palette.RelativeLuminance(bar); dark != tc.dark {
			t.Errorf("%s: label %s darker than the bar = %v, want %v", tc.name, got, dark, tc.dark)
		}
		hb := palette.OKLabToOKLCH(palette.SRGBToOKLab(bar)).H
		hl := palette.OKLabToOKLCH(palette.SRGBToOKLab(lab)).H
		if d := math.Abs(math.Remainder(hb-hl, 360)); d > 15 {
			t.Errorf("%s: label hue %.1f° is %.1f° from the bar's %.1f°", tc.name, hl, d, hb)
		}
	}
}

// TestTypeScale pins each medium's type scale (mediumSpec): text at the
// medium's floor, the subtitle one step and the title two steps above it,
// a step being the medium's ratio; and the ratios of typeRatio.
func TestTypeScale(t *testing.T) {
	tests := []struct {
		m            Medium
		floor, ratio float64
	}{
		// 7 pt at 96 px per inch (common practice for journal figures).
		{Print, 7 * 96.0 / 72, 1.125},
		{Screen, 12, 1.2},
		{Slide, 24, 1.25},
	}
	for _, tc := range tests {
		sp, err := tc.m.spec()
		if err != nil {
			t.Fatal(err)
		}
		near := func(got, want float64) bool { return got >= want && got < want+0.01 }
		if !near(sp.text, tc.floor) || !near(sp.small, tc.floor) {
			t.Errorf("%s: text %g, small %g, want the floor %.2f", tc.m, sp.text, sp.small, tc.floor)
		}
		if !near(sp.subtitle, tc.floor*tc.ratio) || !near(sp.title, tc.floor*tc.ratio*tc.ratio) {
			t.Errorf("%s: subtitle %g, title %g, want %.2f and %.2f (ratio %g)", tc.m, sp.subtitle, sp.title, tc.floor*tc.ratio, tc.floor*tc.ratio*tc.ratio, tc.ratio)
		}
		if r := sp.title / sp.text; r < 1.125*1.125-0.01 {
			t.Errorf("%s: the title is only %.2f times the text", tc.m, r)
		}
	}
}

// TestPrintTitleHoldsALine checks the reason given for print's ratio: the
// title step holds a 40-character title on one line of the 89 mm column,
// in the fallback font's width (frame slack).
func TestPrintTitleHoldsALine(t *testing.T) {
	f, err := newFrame(Common{Medium: Print})
	if err != nil {
		t.Fatal(err)
	}
	title := "Passengers per route and month, 2024-25" // 39 characters, invented
	lines, _ := f.wrap(title+"s", f.spec.title, false, f.width-2*f.spec.pad, 3)
	if len(lines) != 1 {
		t.Errorf("a 40-character title takes %d lines at %g px in print: %q", len(lines), f.spec.title, lines)
	}
}
