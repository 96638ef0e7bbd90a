package render

import (
	"math"
	"testing"

	"plumb/palette"
)

// valueLabels pairs every bar with its value label, in drawing order.
func valueLabels(t *testing.T, s *Scene) (bars, labels []Mark) {
	t.Helper()
	for _, m := range s.Marks {
		switch {
		case m.Kind == Rect && m.Class == "plumb-mark":
			bars = append(bars, m)
		case m.Kind == Text && m.Class == "plumb-value":
			labels = append(labels, m)
		}
	}
	if len(bars) != len(labels) {
		t.Fatalf("%d bars but %d value labels", len(bars), len(labels))
	}
	return bars, labels
}

// TestValueLabelsOutsideByDefault: on a chart with room for them, every
// value label sits outside its bar's end, beyond the zero line's far side
// (left of a negative bar), in the text colour.
func TestValueLabelsOutsideByDefault(t *testing.T) {
	// Invented depot tonnages, one negative, one highlighted.
	labels := []string{"North Quay yard", "Old Mill Lane, rear", "Harbour (east)", "St. Brendan's", "Cold store 7"}
	values := []float64{1245.5, 987.25, 1502, -120.75, 640}
	for _, m := range []Medium{Screen, Slide} {
		s, err := BarsScene(labels, values, BarsOptions{Common: Common{Medium: m}, RowOptions: RowOptions{Highlight: []string{"Harbour (east)"}, Unit: "t"}})
		if err != nil {
			t.Fatal(err)
		}
		assertNoOverlap(t, s)
		text := defaultTheme().text
		bars, vals := valueLabels(t, s)
		for i, b := range bars {
			v := vals[i]
			if v.Fill != text {
				t.Errorf("%s: value %q drawn in %s, want the text colour %s", m, v.Text, v.Fill, text)
			}
			negative := v.Anchor == End
			if negative && v.X > b.X || !negative && v.X < b.X+b.W {
				t.Errorf("%s: value %q at x %.2f is inside its bar [%.2f, %.2f]", m, v.Text, v.X, b.X, b.X+b.W)
			}
		}
	}
}

// TestValueLabelsInsideWhenNarrow: on a canvas too narrow for labels
// outside, the longest bars take theirs inside, in a colour of the bar's
// hue at 4.5:1 against it (never white), and the rest stay outside.
func TestValueLabelsInsideWhenNarrow(t *testing.T) {
	labels := []string{"North Quay yard", "Old Mill Lane, rear", "Harbour (east)", "Cold store 7"}
	values := []float64{1245.5, 987.25, 1502123, 640}
	s, err := BarsScene(labels, values, BarsOptions{Common: Common{Width: 300}, RowOptions: RowOptions{Highlight: []string{"Harbour (east)"}, Unit: "t"}})
	if err != nil {
		t.Fatal(err)
	}
	assertNoOverlap(t, s)
	bars, vals := valueLabels(t, s)
	inside := 0
	for i, b := range bars {
		v := vals[i]
		if v.X > b.X+b.W || v.Anchor != End {
			continue
		}
		inside++
		bar, lab := b.Fill.SRGB(), v.Fill.SRGB()
		if r := palette.Contrast(bar, lab); r < palette.MinTextContrast || v.Fill.Hex() == "#ffffff" {
			t.Errorf("inside label %q in %s on %s: %.2f:1", v.Text, v.Fill, b.Fill, r)
		}
	}
	if inside != 1 {
		t.Errorf("%d labels inside, want 1: only the longest bar's label has to move", inside)
	}
}

// TestTitleBlockOrder: the figure reads title, subtitle, unit line, data,
// notes, source, top to bottom; the title is larger than the subtitle,
// which is larger than the rest, and none of them is bold.
func TestTitleBlockOrder(t *testing.T) {
	s, err := BarsScene([]string{"a", "b", "c"}, []float64{3, 2, 1}, BarsOptions{
		Common:     Common{Title: "Title", Subtitle: "Subtitle", Source: "Source", Note: "Note"},
		RowOptions: RowOptions{Top: 2, ValueName: "tonnes"},
	})
	if err != nil {
		t.Fatal(err)
	}
	y := map[string]float64{}
	size := map[string]float64{}
	for _, m := range s.Marks {
		if m.Kind != Text {
			continue
		}
		key := m.Class
		if m.Class == "plumb-note" && m.Text == "Note" {
			key = "note"
		}
		if _, seen := y[key]; !seen || m.Y > y[key] {
			y[key] = m.Y
		}
		size[key] = m.Size
		if m.Bold && (m.Class == "plumb-title" || m.Class == "plumb-subtitle") {
			t.Errorf("%s is bold: size carries the hierarchy", m.Class)
		}
	}
	order := []string{"plumb-title", "plumb-subtitle", "plumb-axis-title", "plumb-value", "note", "plumb-note plumb-source"}
	for i := 1; i < len(order); i++ {
		a, b := order[i-1], order[i]
		if _, ok := y[b]; !ok {
			t.Fatalf("no %s in the figure", b)
		}
		if !(y[a] < y[b]) {
			t.Errorf("%s (y %.1f) is not above %s (y %.1f)", a, y[a], b, y[b])
		}
	}
	if !(size["plumb-title"] > size["plumb-subtitle"] && size["plumb-subtitle"] > size["plumb-value"]) {
		t.Errorf("sizes title %g, subtitle %g, text %g: want falling along the reading order", size["plumb-title"], size["plumb-subtitle"], size["plumb-value"])
	}
	if math.Abs(size["note"]-size["plumb-value"]) > 0.001 {
		t.Errorf("notes at %g, text at %g: both belong at the floor", size["note"], size["plumb-value"])
	}
}
