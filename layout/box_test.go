package layout

import (
	"math"
	"testing"
)

func TestBoxOverlaps(t *testing.T) {
	a := Box{X: 0, Y: 0, W: 10, H: 10}
	for _, tc := range []struct {
		name string
		o    Box
		want bool
	}{
		{"same box", a, true},
		{"contained", Box{2, 2, 3, 3}, true},
		{"containing", Box{-5, -5, 30, 30}, true},
		{"corner overlap", Box{9, 9, 5, 5}, true},
		{"touching right edge", Box{10, 0, 5, 10}, false},
		{"touching bottom edge", Box{0, 10, 10, 5}, false},
		{"touching corner", Box{10, 10, 5, 5}, false},
		{"apart horizontally", Box{20, 0, 5, 10}, false},
		{"apart vertically", Box{0, -20, 10, 5}, false},
		{"overlap in x only", Box{5, 11, 10, 10}, false},
		{"zero width inside", Box{5, 5, 0, 3}, false},
		{"zero height inside", Box{5, 5, 3, 0}, false},
		{"negative size", Box{5, 5, -3, -3}, false},
		{"sliver", Box{9.999, 0, 1, 10}, true},
		{"NaN", Box{math.NaN(), 0, 5, 5}, false},
	} {
		if got := a.Overlaps(tc.o); got != tc.want {
			t.Errorf("%s: Overlaps = %v, want %v", tc.name, got, tc.want)
		}
		if got := tc.o.Overlaps(a); got != tc.want {
			t.Errorf("%s: Overlaps is not symmetric", tc.name)
		}
	}
}

func TestBoxInside(t *testing.T) {
	canvas := Box{X: 0, Y: 0, W: 100, H: 50}
	for _, tc := range []struct {
		name string
		b    Box
		want bool
	}{
		{"same box", canvas, true},
		{"well inside", Box{10, 10, 20, 20}, true},
		{"touching corner inside", Box{80, 30, 20, 20}, true},
		{"past right edge", Box{90, 10, 20, 10}, false},
		{"above top", Box{10, -1, 10, 10}, false},
		{"below bottom", Box{10, 45, 10, 10}, false},
		{"left of canvas", Box{-5, 10, 10, 10}, false},
		{"larger", Box{-1, -1, 102, 52}, false},
	} {
		if got := tc.b.Inside(canvas); got != tc.want {
			t.Errorf("%s: Inside = %v, want %v", tc.name, got, tc.want)
		}
	}
}

func TestTextBox(t *testing.T) {
	f := GoRegular()
	const text, size, x, y = "Harbour Loop", 12.0, 100.0, 50.0
	w, a, d := f.Width(text, size), f.Ascent(size), f.Descent(size)
	for _, tc := range []struct {
		anchor int
		left   float64
	}{
		{AnchorStart, x},
		{AnchorMiddle, x - w/2},
		{AnchorEnd, x - w},
		{-1, x},    // below start counts as start
		{7, x - w}, // past end counts as end
	} {
		got := TextBox(f, text, size, x, y, tc.anchor)
		want := Box{X: tc.left, Y: y - a, W: w, H: a + d}
		if got != want {
			t.Errorf("anchor %d: TextBox = %+v, want %+v", tc.anchor, got, want)
		}
	}
	// Two lines set one line height apart do not overlap; the same line
	// shifted by half a line does.
	lh := a + d
	l1 := TextBox(f, "Outer Gull", size, x, y, AnchorStart)
	l2 := TextBox(f, "Skerry", size, x, y+lh, AnchorStart)
	l3 := TextBox(f, "Skerry", size, x, y+lh/2, AnchorStart)
	if l1.Overlaps(l2) || !l1.Overlaps(l3) {
		t.Errorf("line boxes: %+v %+v %+v", l1, l2, l3)
	}
	if b := TextBox(nil, text, size, x, y, AnchorStart); b != TextBox(f, text, size, x, y, AnchorStart) {
		t.Errorf("TextBox with a nil face = %+v, want the Go Regular box", b)
	}
}
