package palette

import (
	"strings"
	"testing"
)

func TestCheck(t *testing.T) {
	red, green := hex24(0xcc3333), hex24(0x339933)
	tests := []struct {
		name     string
		colors   []SRGB
		bg       SRGB
		safe     bool
		problems []string // substrings, in order
	}{
		{"empty", nil, whiteBG, true, nil},
		{"one dark colour", []SRGB{hex24(0x333333)}, whiteBG, true, nil},
		// A red/green pair: far apart for normal vision, confused by deutan
		// readers (Machado et al. 2009).
		{"red and green", []SRGB{red, green}, whiteBG, false, []string{"#cc3333 and #339933 are only 3.6 apart for deutan vision"}},
		// #FFF000 is 1.2:1 on white (WCAG Understanding 1.4.11).
		{"yellow on white", []SRGB{hex24(0xfff000)}, whiteBG, false, []string{"#fff000 has contrast 1.18:1 on #ffffff"}},
		{"yellow on black", []SRGB{hex24(0xfff000)}, SRGB{}, true, nil},
		{"duplicate", []SRGB{red, red}, whiteBG, false, []string{"normal", "protan", "deutan", "tritan"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			r := Check(tc.colors, tc.bg)
			if r.Safe != tc.safe {
				t.Errorf("Safe = %v, problems %q", r.Safe, r.Problems)
			}
			if r.Problems == nil || r.Pairs == nil {
				t.Error("nil slices would encode as null")
			}
			if len(r.Problems) != len(tc.problems) {
				t.Fatalf("problems %q, want %d", r.Problems, len(tc.problems))
			}
			for i, p := range tc.problems {
				if !strings.Contains(r.Problems[i], p) {
					t.Errorf("problem %d = %q, want it to mention %q", i, r.Problems[i], p)
				}
			}
			if n := len(tc.colors); len(r.Pairs) != n*(n-1)/2 || len(r.Contrast) != n {
				t.Errorf("%d pairs, %d contrasts for %d colours", len(r.Pairs), len(r.Contrast), n)
			}
		})
	}
	r := Check([]SRGB{red, green}, whiteBG)
	p := r.Pairs[0]
	if p.Distance[Normal] != DeltaE2000(SRGBToLab(red), SRGBToLab(green)) {
		t.Error("normal distance is not the plain CIEDE2000")
	}
	if d, v := p.Min(); v != Deutan || d >= MinPairDistance {
		t.Errorf("closest vision %v at %.2f", v, d)
	}
}

func TestCheckOurPalettesAreSafe(t *testing.T) {
	cat, _ := Categorical(MaxCategorical)
	for name, cs := range map[string][]SRGB{
		"categorical":    cat,
		"neutral-accent": {Neutral(), Accent()},
	} {
		if r := Check(cs, whiteBG); !r.Safe {
			t.Errorf("%s: %q", name, r.Problems)
		}
	}
}

func TestFmtNumTruncates(t *testing.T) {
	// WCAG 2.x: 2.999:1 does not meet 3:1, so it must not print as 3.00.
	if got := fmtNum(2.999, 2); got != "2.99" {
		t.Errorf("fmtNum(2.999, 2) = %q", got)
	}
}
