package main

import (
	"bytes"
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"plumb/render"
)

// TestChartsProperty draws random bar charts and dot plots (labels of every
// length, values of every sign and magnitude, every medium) and asserts the
// invariants of every figure: no text overlaps other text or leaves the
// canvas, bars have a lie factor of 1 and start on the one baseline.
func TestChartsProperty(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	words := []string{"Harbour", "Osk", "to", "Saltmarrow", "Point", "via", "Little", "Kettlewick", "Isle", "of", "the", "Narrows", "A", "Quay", "North-by-northwest", "<b>&amp;</b>"}
	media := []render.Medium{render.Screen, render.Print, render.Slide}
	for trial := range 150 {
		n := 1 + rng.IntN(25)
		labels := make([]string, n)
		values := make([]float64, n)
		scale := math.Pow(10, float64(rng.IntN(12)-4))
		negative := rng.IntN(3) == 0
		seen := map[string]bool{}
		for i := range n {
			var w []string
			for range 1 + rng.IntN(8) {
				w = append(w, words[rng.IntN(len(words))])
			}
			l := strings.Join(w, " ")
			for seen[l] {
				l += fmt.Sprint(i)
			}
			seen[l] = true
			labels[i] = l
			values[i] = math.Round(rng.Float64()*1000) / 1000 * scale
			if negative && rng.IntN(2) == 0 {
				values[i] = -values[i]
			}
		}
		c := render.Common{Medium: media[rng.IntN(len(media))]}
		if rng.IntN(2) == 0 {
			c.Title = strings.Repeat("A long title that may wrap ", 1+rng.IntN(4))
			c.Subtitle = "Subtitle"
			c.Source = "Somewhere"
		}
		var svg bytes.Buffer
		var err error
		kind := rng.IntN(3)
		switch kind {
		case 0:
			other := []render.OtherMode{render.OtherAuto, render.OtherSum, render.OtherMean, render.OtherNone}[rng.IntN(4)]
			_, err = render.Bars(&svg, labels, values, render.BarsOptions{Common: c, Percent: !negative && rng.IntN(3) == 0,
				RowOptions: render.RowOptions{Top: []int{-1, 0, 0, 2, 3, 5, 8, 12}[rng.IntN(8)], Other: other}, Additive: rng.IntN(2) == 0})
		case 1:
			_, err = render.Bars(&svg, labels, values, render.BarsOptions{Common: c, Vertical: true, RowOptions: render.RowOptions{Top: 6}})
		default:
			_, err = render.Dots(&svg, labels, values, render.DotsOptions{Common: c})
		}
		if err != nil {
			// Only a figure too small for its rows may be declined.
			if !strings.Contains(err.Error(), "fit") && !strings.Contains(err.Error(), "narrow") && !strings.Contains(err.Error(), "short") {
				t.Errorf("trial %d (kind %d, %s): %v", trial, kind, c.Medium, err)
			}
			continue
		}
		t.Run(fmt.Sprintf("trial%d", trial), func(t *testing.T) {
			root := checkFigure(t, svg.Bytes())
			if kind < 2 {
				checkBars(t, root)
			}
			checkValueLabels(t, root)
			checkTickFloor(t, root, kind == 1)
		})
	}
}

// TestLinesProperty draws random line and difference charts (1 to 8 series,
// missing values, names of every length, every medium) and asserts that no
// text overlaps other text or leaves the canvas.
func TestLinesProperty(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 5))
	media := []render.Medium{render.Screen, render.Print, render.Slide}
	names := []string{"a", "North", "Saltmarrow Point to Kettlewick Harbour via Little Osk", "B & <c>", "vessel_b", "Quillhaven"}
	for trial := range 60 {
		n := 5 + rng.IntN(200)
		k := 1 + rng.IntN(8)
		xs := make([]float64, n)
		start := float64(rng.IntN(50)) * 86400 * 365
		step := []float64{1, 3600, 86400, 86400 * 30}[rng.IntN(4)]
		for i := range xs {
			xs[i] = start + float64(i)*step
		}
		series := make([]render.Series, k)
		for s := range series {
			y := make([]float64, n)
			v := rng.NormFloat64() * 100
			for i := range y {
				v += rng.NormFloat64()
				y[i] = v
				if rng.IntN(40) == 0 {
					y[i] = math.NaN()
				}
			}
			series[s] = render.Series{Name: fmt.Sprintf("%s %d", names[rng.IntN(len(names))], s), X: xs, Y: y}
		}
		c := render.Common{Medium: media[rng.IntN(len(media))], Title: "Random walk"}
		isTime := rng.IntN(2) == 0
		var svg bytes.Buffer
		var err error
		if trial%3 == 2 && k >= 2 {
			_, err = render.Diff(&svg, series[0], series[1], render.DiffOptions{Common: c, Time: isTime, Context: rng.IntN(2) == 0})
		} else {
			_, err = render.Lines(&svg, series, render.LinesOptions{Common: c, Time: isTime, Index: rng.IntN(4) == 0})
		}
		if err != nil {
			if !strings.Contains(err.Error(), "narrow") && !strings.Contains(err.Error(), "fit") && !strings.Contains(err.Error(), "index") && !strings.Contains(err.Error(), "100") {
				t.Errorf("trial %d: %v", trial, err)
			}
			continue
		}
		t.Run(fmt.Sprintf("trial%d", trial), func(t *testing.T) { checkFigure(t, svg.Bytes()) })
	}
}
