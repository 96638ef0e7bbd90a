package layout

import (
	"math/rand/v2"
	"slices"
	"strings"
	"testing"
	"unicode/utf8"
)

func TestWrap(t *testing.T) {
	f := GoRegular()
	const size = 12
	w := func(s string) float64 { return f.Width(s, size) }
	for _, tc := range []struct {
		name     string
		text     string
		maxWidth float64
		maxLines int
		want     []string
		cut      bool
	}{
		{"fits on one line", "Harbour Loop", 200, 2, []string{"Harbour Loop"}, false},
		{"fits exactly", "Harbour Loop", w("Harbour Loop"), 2, []string{"Harbour Loop"}, false},
		{"wraps to two", "Northern Lighthouse Route", w("Northern Lighthouse"), 2,
			[]string{"Northern Lighthouse", "Route"}, false},
		{"white space collapses", "  Northern \t Lighthouse\nRoute ", w("Northern Lighthouse"), 2,
			[]string{"Northern Lighthouse", "Route"}, false},
		{"no line limit", "a b c d e f", w("a b"), 0, []string{"a b", "c d", "e f"}, false},
		{"breaks after hyphen", "Ferry-Terminal-North", w("Terminal-"), 3,
			[]string{"Ferry-", "Terminal-", "North"}, false},
		{"breaks after slash", "Passengers/day total", w("Passengers/"), 3,
			[]string{"Passengers/", "day total"}, false},
		{"keeps hyphen pairs together", "Terminal-North", w("Terminal-North"), 1,
			[]string{"Terminal-North"}, false},
		{"keeps a minus sign with its number", "-12.5 change", w("change"), 2,
			[]string{"-12.5", "change"}, false},
		{"needs ellipsis", "Saint Brannock to Outer Gull Skerry", w("Saint Brannock"), 2,
			[]string{"Saint Brannock", "to Outer Gull…"}, true},
		{"one line with ellipsis", "Saint Brannock to Outer Gull", w("Saint Bran…"), 1,
			[]string{"Saint Bran…"}, true},
		{"drops the space before the ellipsis", "Saint Brannock", w("Saint …"), 1,
			[]string{"Saint…"}, true},
		{"giant word", "Pneumonoultramicroscopicsilicovolcanoconiosis", w("Pneumono…"), 2,
			[]string{"Pneumono…"}, true},
		{"giant word mid text", "the Pneumonoultramicroscopic route", w("Pneumono…"), 3,
			[]string{"the", "Pneumono…", "route"}, true},
		{"empty", "", 100, 2, nil, false},
		{"blank", " \t\n ", 100, 2, nil, false},
		{"ellipsis does not fit", "Harbour", w("…") / 2, 2, []string{"…"}, true},
		{"zero width", "Harbour", 0, 2, []string{"…"}, true},
		{"only the ellipsis fits", "Harbour", w("…"), 2, []string{"…"}, true},
		{"CJK breaks between ideographs", "港口渡轮航线", w("港口渡"), 2,
			[]string{"港口渡", "轮航线"}, false},
		{"CJK keeps closing punctuation", "港口。渡轮", w("港口"), 3,
			[]string{"港", "口。", "渡轮"}, false},
		{"emoji cut on rune boundaries", "🚢🚢🚢🚢🚢🚢", w("🚢🚢…"), 1,
			[]string{"🚢🚢…"}, true},
		{"combining mark stays with its letter", "Cafe\u0301 Harbour", w("Cafe\u0301…") - 0.01, 1,
			[]string{"Caf…"}, true},
		{"joiner sequence stays whole", "a\u200d🚢bcdefgh", w("a\u200d🚢…") - 0.01, 1,
			[]string{"…"}, true},
	} {
		lines, cut := Wrap(f, tc.text, size, tc.maxWidth, tc.maxLines)
		if !slices.Equal(lines, tc.want) || cut != tc.cut {
			t.Errorf("%s: Wrap(%q) = %q, %v; want %q, %v", tc.name, tc.text, lines, cut, tc.want, tc.cut)
		}
	}
}

// TestWrapShortenIsLongest checks that a shortened line keeps as much text
// as fits: one more character would overflow.
func TestWrapShortenIsLongest(t *testing.T) {
	f := GoRegular()
	text := "Saint Brannock to Outer Gull Skerry via Mallow"
	checked := 0
	for mw := 20.0; mw < 300; mw += 7.3 {
		lines, cut := Wrap(f, text, 12, mw, 1)
		if !cut || len(lines) != 1 {
			continue
		}
		checked++
		kept := strings.TrimSuffix(lines[0], Ellipsis)
		if !strings.HasPrefix(text, kept) {
			t.Fatalf("max %g: %q is not a start of the text", mw, kept)
		}
		longer := text[:len(kept)+1]
		if strings.HasSuffix(longer, " ") {
			continue // the next cut adds only a space, which is trimmed
		}
		if f.Width(strings.TrimRight(longer, " ")+Ellipsis, 12) <= mw {
			t.Errorf("max %g: kept %q, but %q… also fits", mw, kept, longer)
		}
	}
	if checked < 10 {
		t.Errorf("only %d widths gave a shortened line; the check proves little", checked)
	}
}

var wrapWords = []string{
	"Harbour", "Loop", "Saint", "Brannock", "Outer", "Gull", "Skerry", "via", "Mallow",
	"Ferry-Terminal", "north/south", "港口渡轮", "Ωμέγα", "🚢", "Cafe\u0301", "-12.5", "a",
	"Pneumonoultramicroscopicsilicovolcanoconiosis", "Ærøskøbing",
}

// TestWrapProperties checks the promises of Wrap on random labels.
func TestWrapProperties(t *testing.T) {
	f := GoRegular()
	rng := rand.New(rand.NewPCG(1, 2))
	for range 2000 {
		words := make([]string, 1+rng.IntN(8))
		for i := range words {
			words[i] = wrapWords[rng.IntN(len(wrapWords))]
		}
		text := strings.Join(words, " ")
		size := 8 + rng.Float64()*10
		maxWidth := rng.Float64() * 250
		maxLines := rng.IntN(4)
		checkWrap(t, f, text, size, maxWidth, maxLines)
	}
}

// checkWrap fails t when Wrap breaks one of its promises for these inputs.
func checkWrap(t *testing.T, f *Face, text string, size, maxWidth float64, maxLines int) {
	t.Helper()
	lines, cut := Wrap(f, text, size, maxWidth, maxLines)
	if strings.TrimSpace(text) == "" {
		if lines != nil || cut {
			t.Fatalf("Wrap(%q) = %q, %v; want nothing", text, lines, cut)
		}
		return
	}
	if slices.Equal(lines, []string{Ellipsis}) && cut {
		return // allowed whatever the width
	}
	if maxLines > 0 && len(lines) > maxLines {
		t.Fatalf("Wrap(%q, max %d lines) gave %d lines", text, maxLines, len(lines))
	}
	for _, l := range lines {
		if w := f.Width(l, size); w > maxWidth {
			t.Fatalf("Wrap(%q, %g, %g): line %q is %g wide", text, size, maxWidth, l, w)
		}
		if l == "" || strings.TrimSpace(l) != l {
			t.Fatalf("Wrap(%q): line %q is empty or padded", text, l)
		}
		if utf8.ValidString(text) && !utf8.ValidString(l) {
			t.Fatalf("Wrap(%q): line %q cuts a UTF-8 sequence", text, l)
		}
	}
	// Uncut, the lines hold exactly the text's characters other than space.
	squash := func(s string) string { return strings.Join(strings.Fields(s), "") }
	if !cut && squash(strings.Join(lines, " ")) != squash(text) {
		t.Fatalf("Wrap(%q) = %q lost text without reporting a cut", text, lines)
	}
	if cut && !strings.Contains(strings.Join(lines, ""), Ellipsis) {
		t.Fatalf("Wrap(%q) = %q reports a cut but shows no ellipsis", text, lines)
	}
}

func BenchmarkWrap(b *testing.B) {
	f := GoRegular()
	const text = "Saint Brannock to Outer Gull Skerry via Mallow Sound"
	b.ReportAllocs()
	for b.Loop() {
		Wrap(f, text, 12, 120, 2)
	}
}
