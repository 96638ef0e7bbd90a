package render

import (
	"strings"
	"testing"
	"time"
)

// months are the first days of n months from January 2024.
func months(n int) []time.Time {
	out := make([]time.Time, n)
	for i := range out {
		out[i] = time.Date(2024, time.Month(1+i), 1, 0, 0, 0, 0, time.UTC)
	}
	return out
}

// TestDescriptions checks the facts each description gives a listener,
// in the words it must use, and the words it must not.
func TestDescriptions(t *testing.T) {
	x := []float64{1, 2, 3, 4, 5, 6}
	tests := []struct {
		name  string
		scene func() (*Scene, error)
		want  []string
		never []string
	}{
		{name: "monthly lines in percent",
			scene: func() (*Scene, error) {
				return LinesScene([]Series{TimeSeries("on time", months(4), []float64{84, 88, 91, 87.6})}, LinesOptions{Unit: "%"})
			},
			// 84% to 87.6% is 3.6 points, a relative change of 4%: the
			// points are what a reader of percentages means.
			want:  []string{"from Jan 2024 to Apr 2024", "84.0% at Jan 2024", "up 3.6 percentage points", "highest 91.0% at Mar 2024", "lowest 84.0% at Jan 2024"},
			never: []string{"at 2024", "(+4%)"}},
		{name: "amounts change relatively",
			scene: func() (*Scene, error) {
				return LinesScene([]Series{TimeSeries("riders", months(3), []float64{200, 150, 250})}, LinesOptions{})
			},
			want: []string{"up 50 (+25%)", "lowest 150 at Feb 2024"}},
		{name: "daily lines",
			scene: func() (*Scene, error) {
				d := []time.Time{time.Date(2024, 1, 1, 0, 0, 0, 0, time.UTC), time.Date(2024, 1, 2, 0, 0, 0, 0, time.UTC), time.Date(2024, 1, 3, 0, 0, 0, 0, time.UTC)}
				return LinesScene([]Series{TimeSeries("riders", d, []float64{5, 7, 6})}, LinesOptions{})
			},
			want: []string{"from 1 Jan 2024 to 3 Jan 2024"}},
		{name: "difference stretches and gaps",
			scene: func() (*Scene, error) {
				return DiffScene(Series{Name: "north", X: x, Y: []float64{5, 6, 2, 1, 7, 9}}, Series{Name: "south", X: x, Y: []float64{4, 4, 4, 4, 4, 4}}, DiffOptions{})
			},
			want: []string{"north is above south at 4 of 6 points (from 1 to 2, from 5 to 6), and below at 2 (from 3 to 4)", "Largest gap with north above: 5 at 6", "Largest gap with south above: 3 at 4"}},
		{name: "difference never below",
			scene: func() (*Scene, error) {
				return DiffScene(Series{Name: "a", X: x, Y: []float64{5, 6, 7, 8, 9, 10}}, Series{Name: "b", X: x, Y: []float64{1, 1, 1, 1, 1, 1}}, DiffOptions{Unit: "%"})
			},
			want: []string{"a is above b at 6 of 6 points (from 1 to 6), and never below", "Largest gap with a above: 9 percentage points at 6"}},
		{name: "additive bars",
			scene: func() (*Scene, error) {
				return BarsScene([]string{"grain", "fuel", "post"}, []float64{300, 500, 20}, BarsOptions{Additive: true, Common: Common{}, RowOptions: RowOptions{ValueName: "tonnes", LabelName: "cargo"}})
			},
			want: []string{"Bar chart of tonnes by cargo, 3 bars", "Largest: fuel at 500; smallest: post at 20", "Total: 820."}},
		{name: "values that do not add up have no total",
			scene: func() (*Scene, error) {
				return BarsScene([]string{"a", "b"}, []float64{3, 4}, BarsOptions{})
			},
			never: []string{"Total"}},
		{name: "month labels spoken as dates",
			scene: func() (*Scene, error) {
				return BarsScene([]string{"2024-01", "2024-02"}, []float64{3, 4}, BarsOptions{})
			},
			want: []string{"Largest: Feb 2024 at 4; smallest: Jan 2024 at 3"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			s, err := tt.scene()
			if err != nil {
				t.Fatal(err)
			}
			for _, w := range tt.want {
				if !strings.Contains(s.Desc, w) {
					t.Errorf("desc lacks %q:\n%s", w, s.Desc)
				}
			}
			for _, n := range tt.never {
				if strings.Contains(s.Desc, n) {
					t.Errorf("desc has %q:\n%s", n, s.Desc)
				}
			}
		})
	}
}
