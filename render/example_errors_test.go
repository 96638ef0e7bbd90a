package render_test

import (
	"errors"
	"fmt"
	"io"
	"math"
	"time"

	"plumb/render"
)

// A refused bar chart falls back to a dot plot with the same options: the
// refusal carries its reason and the honest alternative as separate fields.
func ExampleRefusalError() {
	labels, values := []string{"North", "South", "East"}, []float64{92, 95, 97}
	from := 90.0
	opt := render.BarsOptions{RowOptions: render.RowOptions{From: &from, ValueName: "on time (%)"}}
	_, err := render.Bars(io.Discard, labels, values, opt)
	var r *render.RefusalError
	if errors.As(err, &r) {
		fmt.Println("refused:", r.Reason)
		_, err = render.Dots(io.Discard, labels, values, render.DotsOptions{RowOptions: opt.RowOptions})
	}
	fmt.Println("dots:", err)
	// Output:
	// refused: would cut every bar short of its true length
	// dots: <nil>
}

// An option whose value cannot be drawn is an *OptionError that names the
// options field, so that a front end can point at its own control for it.
func ExampleOptionError_size() {
	_, err := render.BarsScene([]string{"a"}, []float64{1},
		render.BarsOptions{Common: render.Common{Width: math.Inf(1)}})
	var oe *render.OptionError
	if errors.As(err, &oe) {
		fmt.Println(oe.Option, oe.Value, "-", oe.Err)
	}
	fmt.Println(errors.Is(err, render.ErrNotFinite))
	// Output:
	// Width +Inf - must be a finite number
	// true
}

// Times pass as time.Time: the x axis gets calendar ticks with no flag.
func ExampleTimeSeries() {
	var t []time.Time
	for m := range 12 {
		t = append(t, time.Date(2024, time.Month(m+1), 1, 0, 0, 0, 0, time.UTC))
	}
	riders := render.TimeSeries("riders", t, []float64{310, 295, 330, 360, 420, 480, 530, 515, 450, 390, 340, 320})
	s, err := render.LinesScene([]render.Series{riders}, render.LinesOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(s.Desc)
	// Output:
	// Line chart of values over time, 1 series, from Jan 2024 to Dec 2024. riders: 310 at Jan 2024, 320 at Dec 2024, up 10 (+3%); highest 530 at Jul 2024, lowest 295 at Feb 2024.
}
