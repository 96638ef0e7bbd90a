package main

import (
	"bytes"
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// annotationFigure is one annotation kind on one chart kind, pinned in
// golden/annot-NAME.svg, with the mark the annotation must leave.
type annotationFigure struct {
	figure
	class string // the annotation's mark
	attr  string // its data- attribute (without "data-")
	value string // the attribute's value
}

// annotationGallery is each annotation kind on each chart kind that takes
// it, on the demo data: references on all four, events and periods on the
// charts with an x axis, callouts on the charts with categories, and a
// reference beyond the data, which widens the axis with a note.
var annotationGallery = []annotationFigure{
	{figure{"annot-ref-bars", "routes.csv", []string{"bars", "--label", "route", "--value", "passengers",
		"--ref", "200000=Break-even", "--ref", "mean",
		"--title", "Passengers per route, 2025", "--subtitle", "Annual passengers; break-even and mean marked"}}, "plumb-ref", "value", "200000"},
	{figure{"annot-ref-bars-widened", "routes.csv", []string{"bars", "--label", "route", "--value", "passengers", "--top", "6",
		"--ref", "600000=Capacity of the fleet",
		"--title", "Passengers per route, 2025", "--subtitle", "Five largest routes and the rest, against the fleet's capacity"}}, "plumb-ref", "value", "600000"},
	{figure{"annot-ref-dots", "routes.csv", []string{"dots", "--label", "route", "--value", "punctuality_pct", "--unit", "%",
		"--ref", "90=Target", "--ref", "median",
		"--title", "Punctuality by route", "--subtitle", "Share of sailings on time, 2025; the 90% target and the median"}}, "plumb-ref", "value", "90"},
	{figure{"annot-ref-lines", "fuel.csv", []string{"lines", "--x", "month", "--y", "vessel_a",
		"--ref", "150=Budget",
		"--title", "Fuel use of vessel A", "--subtitle", "Tonnes per month against the monthly budget"}}, "plumb-ref", "value", "150"},
	{figure{"annot-ref-diff", "fuel.csv", []string{"diff", "--x", "month", "--a", "vessel_a", "--b", "vessel_b", "--unit", "t",
		"--ref", "mean",
		"--title", "Vessel A burns more fuel than vessel B", "--subtitle", "Monthly difference A − B in tonnes, and its mean"}}, "plumb-ref", "stat", "mean"},
	{figure{"annot-event-lines", "daily.csv", []string{"lines", "--x", "date", "--y", "passengers",
		"--event", "2020-03-20=Sailings suspended", "--event", "2022-05-01=New timetable",
		"--title", "Ten years of daily passengers", "--subtitle", "All routes"}}, "plumb-event", "x", "2020-03-20T00:00:00Z"},
	{figure{"annot-event-diff", "fuel.csv", []string{"diff", "--x", "month", "--a", "vessel_a", "--b", "vessel_b", "--unit", "t",
		"--event", "2025-03=Vessel B refitted",
		"--title", "Vessel A burns more fuel than vessel B", "--subtitle", "Monthly difference A − B in tonnes"}}, "plumb-event", "x", "2025-03-01T00:00:00Z"},
	{figure{"annot-period-lines", "punctuality.csv", []string{"lines", "--x", "month", "--y", "on_time_pct", "--series", "route", "--unit", "%",
		"--period", "2024-11..2025-02=Winter timetable",
		"--title", "Punctuality of the three busiest routes", "--subtitle", "Share of sailings on time, by month"}}, "plumb-period", "from", "2024-11-01T00:00:00Z"},
	{figure{"annot-period-diff", "fuel.csv", []string{"diff", "--x", "month", "--a", "vessel_a", "--b", "vessel_b", "--unit", "t",
		"--period", "2024-06..2024-08=Summer sailings",
		"--title", "Vessel A burns more fuel than vessel B", "--subtitle", "Monthly difference A − B in tonnes"}}, "plumb-period", "to", "2024-08-01T00:00:00Z"},
	{figure{"annot-callout-bars", "routes.csv", []string{"bars", "--label", "route", "--value", "passengers",
		"--callout", "Great Osk to Little Osk=new pier in May",
		"--title", "Passengers per route, 2025", "--subtitle", "Annual passengers, all sailings"}}, "plumb-callout", "label", "Great Osk to Little Osk"},
	{figure{"annot-callout-dots", "routes.csv", []string{"dots", "--label", "route", "--value", "punctuality_pct", "--unit", "%",
		"--callout", "Kettlewick Harbour to Great Osk=storms in February",
		"--title", "Punctuality by route", "--subtitle", "Share of sailings on time, 2025"}}, "plumb-callout", "label", "Kettlewick Harbour to Great Osk"},
}

func TestAnnotationGolden(t *testing.T) {
	dir := t.TempDir()
	for _, fx := range annotationGallery {
		t.Run(fx.name, func(t *testing.T) {
			out := filepath.Join(dir, fx.name+".svg")
			args := append([]string{fx.args[0], filepath.Join("demodata", fx.data)}, fx.args[1:]...)
			var stderr bytes.Buffer
			code := run(append(args, "-o", out), nil, &bytes.Buffer{}, &stderr)
			require.Equal(t, exitOK, code, stderr.String())
			got, err := os.ReadFile(out)
			require.NoError(t, err)
			root := checkFigure(t, got)
			var found bool
			root.walk(func(n *svgNode) {
				found = found || (hasClass(n, fx.class) && n.Attr["data-"+fx.attr] == fx.value)
			})
			assert.True(t, found, "a %s mark with data-%s=%q", fx.class, fx.attr, fx.value)
			if fx.name == "annot-ref-bars-widened" {
				assert.Contains(t, stderr.String()+string(got), "widened the value axis")
			}
			renderable(t, out)
			matchGolden(t, filepath.Join(goldenDir, fx.name+".svg"), got)
		})
	}
}
