package main

import (
	"bytes"
	"path/filepath"
	"testing"
)

// barsFixtures are invented tables shaped like the real ones that misled
// earlier defaults (issue 7): one row per area with medians and one far
// above the rest, rates that differ in the decimal, counts with repeated
// labels, month names under columns, changes on both sides of zero. Each is
// drawn through the CLI, checked like the gallery and pinned byte for byte
// in golden/fixture-bars-*.svg (rewrite with -update and look at the pictures).
var barsFixtures = []struct {
	name string
	args []string
}{
	{"area-medians", []string{"bars", "area_medians.csv", "--unit", "$", "--value-name", "median price"}},
	{"area-medians-top", []string{"bars", "area_medians.csv", "--unit", "$", "--top", "10"}},
	{"region-rates", []string{"bars", "region_rates.csv", "--value-name", "cases per 1,000"}},
	{"region-rates-dots", []string{"dots", "region_rates.csv", "--unit", "‰"}},
	{"sightings", []string{"bars", "sightings.csv"}},
	{"months-vertical", []string{"bars", "months.csv", "--vertical", "--order", "data", "--unit", "mm", "--value-name", "rainfall"}},
	{"months-vertical-print", []string{"bars", "months.csv", "--vertical", "--order", "data", "--unit", "mm", "--for", "print"}},
	{"branch-change-dots", []string{"dots", "branch_change.csv", "--unit", "pts"}},
	{"branch-change-slide", []string{"bars", "branch_change.csv", "--for", "slide", "--unit", " pts", "--value-name", "net change"}},
}

func TestBarsFixtures(t *testing.T) {
	dir := filepath.Join("..", "..", "testdata", "bars")
	for _, fx := range barsFixtures {
		t.Run(fx.name, func(t *testing.T) {
			args := append([]string{fx.args[0], filepath.Join(dir, fx.args[1])}, fx.args[2:]...)
			var out, stderr bytes.Buffer
			if code := run(append(args, "--quiet"), nil, &out, &stderr); code != exitOK {
				t.Fatalf("exit %d: %s", code, stderr.String())
			}
			root := checkFigure(t, out.Bytes())
			if fx.args[0] == "bars" {
				checkBars(t, root)
			}
			matchGolden(t, filepath.Join(goldenDir, "fixture-bars-"+fx.name+".svg"), out.Bytes())
		})
	}
}
