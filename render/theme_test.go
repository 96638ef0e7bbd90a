package render

import (
	"testing"

	"plumb/palette"
)

// TestThemeContrast pins the contrasts the theme's comments promise on a
// white background: the grid recedes (about 1.2:1), the zero line reads as
// a reference (about 11:1, and at least the 3:1 of WCAG 2.x SC 1.4.11 for
// graphical objects), and text keeps 4.5:1 (WCAG 2.x SC 1.4.3).
func TestThemeContrast(t *testing.T) {
	th := defaultTheme()
	white := palette.SRGB{R: 1, G: 1, B: 1}
	ratio := func(hex string) float64 {
		t.Helper()
		c, err := palette.ParseHex(hex)
		if err != nil {
			t.Fatalf("theme colour %q: %v", hex, err)
		}
		return palette.Contrast(c, white)
	}
	if r := ratio(th.grid); r < 1.1 || r > 1.5 {
		t.Errorf("grid %s has contrast %.2f:1 on white, want about 1.2:1", th.grid, r)
	}
	if r := ratio(th.baseline); r < 10 || r > 12.5 {
		t.Errorf("baseline %s has contrast %.2f:1 on white, want about 11:1", th.baseline, r)
	}
	for name, hex := range map[string]string{"text": th.text, "muted": th.muted} {
		if r := ratio(hex); r < 4.5 {
			t.Errorf("%s %s has contrast %.2f:1 on white, want at least 4.5:1", name, hex, r)
		}
	}
	if r := ratio(th.neutral); r < 3 {
		t.Errorf("neutral %s has contrast %.2f:1 on white, want at least 3:1", th.neutral, r)
	}
}
