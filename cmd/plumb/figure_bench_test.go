package main

import (
	"bytes"
	"path/filepath"
	"testing"
)

// BenchmarkFigureSlide renders the 4-panel slide figure file of
// testdata/figure from the file to SVG bytes; issue 10 asks for well under
// a second.
func BenchmarkFigureSlide(b *testing.B) {
	file := filepath.Join(figureDir, "slide.json")
	for b.Loop() {
		var out, errs bytes.Buffer
		if code := run([]string{"figure", file, "--quiet"}, nil, &out, &errs); code != exitOK {
			b.Fatal(errs.String())
		}
	}
}

// BenchmarkByBars draws bars --by with 4 panels of 5 bars.
func BenchmarkByBars(b *testing.B) {
	file := filepath.Join(figureDir, "crops.csv")
	for b.Loop() {
		var out, errs bytes.Buffer
		if code := run([]string{"bars", file, "--label", "crop", "--value", "tonnes", "--by", "region", "--quiet"}, nil, &out, &errs); code != exitOK {
			b.Fatal(errs.String())
		}
	}
}
