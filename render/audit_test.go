package render

import (
	"testing"
)

func TestTextFloor(t *testing.T) {
	tests := []struct {
		m    Medium
		want float64
	}{
		{Screen, 12},
		{"", 12},
		{Print, 7 * 96.0 / 72}, // 7 pt at 96 px per inch, as README's type scale says
		{Slide, 24},
	}
	for _, tc := range tests {
		got, err := tc.m.TextFloor()
		if err != nil || got != tc.want {
			t.Errorf("%q.TextFloor() = %v, %v; want %v", tc.m, got, err, tc.want)
		}
	}
	if _, err := Medium("poster").TextFloor(); err == nil {
		t.Error("an unknown medium has a floor")
	}
}
