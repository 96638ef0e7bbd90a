package render

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"plumb/palette"
)

// TestColorsRedGreen draws two series in a red/green pair: the chart uses
// the colours (the lines are stroked with them) and warns with the
// CIEDE2000 distance that package palette measures under the vision where
// the pair collides.
func TestColorsRedGreen(t *testing.T) {
	red, green := mustColour(t, "#d62728"), mustColour(t, "#2ca02c")
	series := []Series{
		{Name: "north", X: []float64{1, 2, 3, 4}, Y: []float64{3, 5, 4, 6}},
		{Name: "south", X: []float64{1, 2, 3, 4}, Y: []float64{2, 2.5, 3.5, 3}},
	}
	s, err := LinesScene(series, LinesOptions{Common: Common{Colors: []Colour{red, green}}})
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	if err := WriteSVG(&buf, s); err != nil {
		t.Fatal(err)
	}
	for _, hex := range []string{"#d62728", "#2ca02c"} {
		if !strings.Contains(buf.String(), `stroke="`+hex+`"`) {
			t.Errorf("no mark stroked %s", hex)
		}
	}
	d := palette.DeltaE2000(palette.SRGBToLab(palette.Simulate(red.SRGB(), palette.Deutan, 1)), palette.SRGBToLab(palette.Simulate(green.SRGB(), palette.Deutan, 1)))
	if d >= palette.MinPairDistance {
		t.Fatalf("fixture: the pair is %.1f apart under deutan vision, not a collision", d)
	}
	want := fmt.Sprintf("%s for deutan vision", trunc(d, 1))
	var found bool
	for _, n := range s.Notes {
		if n.Code == "colors-cvd" {
			found = true
			if !n.Changed || !strings.Contains(n.Text, want) || !strings.Contains(n.Text, "#d62728") || !strings.Contains(n.Text, "#2ca02c") {
				t.Errorf("colors-cvd note %q: want the pair, %q and Changed", n.Text, want)
			}
		}
	}
	if !found {
		t.Errorf("no colors-cvd note in %v", s.Notes)
	}
}

func mustColour(t *testing.T, hex string) Colour {
	t.Helper()
	c, err := ParseColour(hex)
	if err != nil {
		t.Fatal(err)
	}
	return c
}

// TestColorsApplied checks where each of the caller's colours goes and
// which review notes each list earns.
func TestColorsApplied(t *testing.T) {
	blue, orange, pale := mustColour(t, "#1f5fa8"), mustColour(t, "#c8553d"), mustColour(t, "#f4e9a0")
	tests := []struct {
		name      string
		colors    []Colour
		highlight []string
		fills     []string // fills the bars must carry
		codes     []string // review notes expected
		noCodes   []string // review notes that must not appear
	}{
		{name: "neutral", colors: []Colour{blue}, fills: []string{"#1f5fa8"}, noCodes: []string{"colors-cvd", "colors-contrast"}},
		{name: "accent", colors: []Colour{blue, orange}, highlight: []string{"b"}, fills: []string{"#1f5fa8", "#c8553d"}, noCodes: []string{"colors-cvd", "colors-contrast"}},
		{name: "light", colors: []Colour{pale}, fills: []string{"#f4e9a0"}, codes: []string{"colors-contrast"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			opt := BarsOptions{Common: Common{Colors: tt.colors}}
			opt.Highlight = tt.highlight
			s, err := BarsScene([]string{"a", "b", "c"}, []float64{5, 3, 1}, opt)
			if err != nil {
				t.Fatal(err)
			}
			var buf bytes.Buffer
			if err := WriteSVG(&buf, s); err != nil {
				t.Fatal(err)
			}
			for _, f := range tt.fills {
				if !strings.Contains(buf.String(), `fill="`+f+`"`) {
					t.Errorf("no mark filled %s", f)
				}
			}
			codes := map[string]bool{}
			for _, n := range s.Notes {
				codes[n.Code] = true
			}
			for _, c := range tt.codes {
				if !codes[c] {
					t.Errorf("no %s note in %v", c, s.Notes)
				}
			}
			for _, c := range tt.noCodes {
				if codes[c] {
					t.Errorf("unexpected %s note in %v", c, s.Notes)
				}
			}
		})
	}
}

func TestColorsNotOpaque(t *testing.T) {
	_, err := BarsScene([]string{"a"}, []float64{1}, BarsOptions{Common: Common{Colors: []Colour{{R: 10, A: 128}}}})
	var oe *OptionError
	if !errors.As(err, &oe) || oe.Option != "Colors" {
		t.Fatalf("err = %v, want an OptionError for Colors", err)
	}
}

// TestColorsDiffTints checks a difference chart in the caller's colours:
// the lines take the colours, the areas a tint of each that still carries
// text at 4.5:1 (WCAG 2.x), in the colour's own hue.
func TestColorsDiffTints(t *testing.T) {
	blue, rust := mustColour(t, "#1f5fa8"), mustColour(t, "#c8553d")
	f, err := newFrame(Common{Colors: []Colour{blue, rust}})
	if err != nil {
		t.Fatal(err)
	}
	areaA, areaB, lineA, lineB := f.diffColors()
	if lineA != blue || lineB != rust {
		t.Errorf("lines %s, %s; want the colours given", lineA.Hex(), lineB.Hex())
	}
	for _, p := range [][2]Colour{{areaA, blue}, {areaB, rust}} {
		if c := palette.Contrast(p[0].SRGB(), f.th.text.SRGB()); c < palette.MinTextContrast {
			t.Errorf("area %s: text contrast %.2f, want at least %.1f", p[0].Hex(), c, palette.MinTextContrast)
		}
		hueA := palette.OKLabToOKLCH(palette.SRGBToOKLab(p[0].SRGB())).H
		hueC := palette.OKLabToOKLCH(palette.SRGBToOKLab(p[1].SRGB())).H
		if d := math.Abs(hueA - hueC); math.Min(d, 360-d) > 10 {
			t.Errorf("area %s strays %.0f° from the hue of %s", p[0].Hex(), math.Min(d, 360-d), p[1].Hex())
		}
	}
}

// TestColorsShort checks that fewer colours than series fall back to
// plumb's palette for all of them, with a note, rather than mixing the two.
func TestColorsShort(t *testing.T) {
	x := []float64{1, 2, 3}
	series := []Series{{Name: "a", X: x, Y: []float64{1, 2, 3}}, {Name: "b", X: x, Y: []float64{3, 1, 2}}, {Name: "c", X: x, Y: []float64{2, 3, 1}}}
	s, err := LinesScene(series, LinesOptions{Common: Common{Colors: []Colour{mustColour(t, "#1f5fa8"), mustColour(t, "#c8553d")}}})
	if err != nil {
		t.Fatal(err)
	}
	var note string
	for _, n := range s.Notes {
		if n.Code == "colors-short" {
			note = n.Text
		}
	}
	if !strings.HasPrefix(note, "2 colours were given for 3 series") {
		t.Errorf("colors-short note %q", note)
	}
	want, err := palette.Categorical(3)
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	if err := WriteSVG(&buf, s); err != nil {
		t.Fatal(err)
	}
	for _, c := range want {
		if !strings.Contains(buf.String(), `stroke="`+c.Hex()+`"`) {
			t.Errorf("no line in the palette's %s", c.Hex())
		}
	}
	if strings.Contains(buf.String(), `stroke="#1f5fa8"`) {
		t.Error("a line in a colour given, mixed with the palette's")
	}
}
