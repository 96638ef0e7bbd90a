package main

import (
	"bytes"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"slices"
	"strings"
)

// figure is one entry of the demo gallery: a command line run on one of the
// built-in data sets. The gallery doubles as the golden test set, so every
// chart variant worth pinning appears here.
type figure struct {
	name string   // output file name without extension
	data string   // file in demodata/, or "" for a command that reads none
	args []string // the command line after "plumb", without data and -o
}

// gallery lists the demo figures in the order the README shows them.
var gallery = []figure{
	{"bars-sorted", "routes.csv", []string{"bars", "--label", "route", "--value", "passengers",
		"--title", "Passengers per route, 2025", "--subtitle", "Annual passengers, all sailings",
		"--source", "Lantern Isles Ferry Company (fictional), demo data"}},
	{"bars-negative", "change.csv", []string{"bars", "--label", "route", "--value", "change_pct", "--unit", "%",
		"--value-name", "change in passengers",
		"--title", "Change in passengers from 2024 to 2025", "--subtitle", "Percent change per route; four routes lost riders"}},
	{"bars-highlight", "routes.csv", []string{"bars", "--label", "route", "--value", "fare", "--top", "8", "--other", "mean", "--agg", "mean", "--unit", "£",
		"--highlight", "Brindle Holm to Oskmouth",
		"--title", "Adult single fare", "--subtitle", "Seven dearest routes and the mean of the rest; Brindle Holm to Oskmouth highlighted"}},
	{"bars-vertical", "loads.csv", []string{"bars", "--label", "weekday", "--value", "load_pct", "--agg", "mean", "--order", "data",
		"--vertical", "--unit", "%", "--value-name", "mean load",
		"--title", "Mean vessel load by weekday", "--subtitle", "Share of seats taken, averaged over all hours"}},
	{"bars-percent", "routes.csv", []string{"bars", "--label", "route", "--value", "passengers", "--percent", "--top", "6",
		"--title", "Where the passengers travel", "--subtitle", "Share of annual passengers, five largest routes and the rest"}},
	{"bars-print", "change.csv", []string{"bars", "--label", "route", "--value", "change_pct", "--unit", "%", "--for", "print",
		"--value-name", "change in passengers",
		"--title", "Change in passengers, 2024 to 2025", "--note", "Print size: one journal column, 7 pt text"}},
	{"dots-punctuality", "routes.csv", []string{"dots", "--label", "route", "--value", "punctuality_pct", "--unit", "%",
		"--value-name", "sailings on time",
		"--title", "Punctuality by route", "--subtitle", "Share of sailings leaving within five minutes of schedule, 2025"}},
	{"dots-series", "punctuality.csv", []string{"dots", "--label", "month", "--series", "route", "--value", "on_time_pct", "--order", "data", "--unit", "%",
		"--value-name", "sailings on time",
		"--title", "Punctuality of the three busiest routes, month by month", "--subtitle", "Share of sailings leaving within five minutes of schedule; one dot per route"}},
	{"bars-stack", "fuel.csv", []string{"bars", "--label", "month", "--value", "vessel_a,vessel_b", "--stack", "--order", "data", "--top", "-1", "--unit", "t",
		"--value-name", "fuel burned",
		"--title", "Fuel burned by the two vessels", "--subtitle", "Tonnes per month, vessel A and vessel B stacked; the fleet's total at the end of each bar"}},
	{"bars-side", "fuel.csv", []string{"bars", "--label", "month", "--value", "vessel_a,vessel_b", "--side", "--order", "data", "--top", "-1", "--unit", "t",
		"--value-name", "fuel burned",
		"--title", "Fuel burned per vessel", "--subtitle", "Tonnes per month, the two vessels side by side"}},
	{"lines-punctuality", "punctuality.csv", []string{"lines", "--x", "month", "--y", "on_time_pct", "--series", "route", "--unit", "%",
		"--y-name", "sailings on time", "--title", "Punctuality of the three busiest routes", "--subtitle", "Share of sailings leaving within five minutes of schedule, by month"}},
	{"lines-fuel-index", "fuel.csv", []string{"lines", "--x", "month", "--y", "vessel_a,vessel_b", "--index",
		"--title", "Fuel use of the two vessels, as an index", "--subtitle", "Monthly fuel use, first month = 100"}},
	{"lines-daily", "daily.csv", []string{"lines", "--x", "date", "--y", "passengers", "--y-name", "passengers per day",
		"--title", "Ten years of daily passengers", "--subtitle", "All routes; 3,653 days drawn with M4 reduction to the pixel columns"}},
	{"lines-multiples", "loads.csv", []string{"lines", "--x", "hour", "--y", "load_pct", "--series", "weekday", "--unit", "%",
		"--y-name", "seats taken", "--x-name", "hour of departure", "--title", "Vessel load by hour, one panel per weekday",
		"--subtitle", "Share of seats taken; the range of all days in grey behind each panel"}},
	{"lines-agg", "crossings-monthly.csv", []string{"lines", "--x", "month", "--y", "minutes", "--series", "route", "--agg", "median",
		"--y-name", "crossing time", "--unit", "min", "--title", "Winter crossings take longer, and vary more",
		"--subtitle", "Median minutes per sailing by month, the middle half of the sailings as a band; one February sailing to Cindergull Bay"}},
	{"by-bars", "cargo.csv", []string{"bars", "--label", "cargo", "--value", "tonnes", "--by", "harbour",
		"--title", "Cargo landed at the four main harbours, 2025", "--subtitle", "Tonnes per kind of cargo; one scale for every harbour",
		"--source", "Lantern Isles Ferry Company (fictional), demo data"}},
	{"by-lines", "punctuality.csv", []string{"lines", "--x", "month", "--y", "on_time_pct", "--by", "route", "--unit", "%",
		"--y-name", "sailings on time", "--title", "Punctuality of the three busiest routes, one panel each", "--subtitle", "Share of sailings leaving within five minutes of schedule, by month"}},
	{"diff-fuel", "fuel.csv", []string{"diff", "--x", "month", "--a", "vessel_a", "--b", "vessel_b", "--context", "--unit", "t",
		"--title", "Vessel A burns more fuel than vessel B every month", "--subtitle", "Monthly fuel use in tonnes (above) and the difference A − B (below)"}},
	{"figure-slide", "", []string{"figure", "slide.json"}},
	{"scatter-crossings", "sailings.csv", []string{"scatter", "--x", "crossing_km", "--y", "minutes", "--group", "vessel",
		"--x-name", "crossing (km)", "--y-name", "minutes from quay to quay",
		"--title", "The fast craft halves the crossing time", "--subtitle", "400 sailings by length of crossing and vessel class"}},
	{"scatter-wind", "sailings-year.csv", []string{"scatter", "--x", "wind_kn", "--y", "delay_min", "--fit", "loess",
		"--x-name", "wind (knots)", "--y-name", "delay at departure (minutes)",
		"--title", "Delays grow steeply in strong wind", "--subtitle", "20,000 sailings of a year, binned; a LOESS curve through all of them"}},
	{"scatter-fuel-fit", "sailings.csv", []string{"scatter", "--x", "crossing_km", "--y", "fuel_l", "--fit", "line",
		"--x-name", "crossing (km)", "--y-name", "fuel burnt (litres)",
		"--title", "Fuel grows with the length of the crossing", "--subtitle", "400 sailings with a least-squares line"}},
	{"matrix-sailings", "sailings-sample.csv", []string{"matrix", "--cols", "crossing_km,minutes,fuel_l,wind_kn,delay_min",
		"--title", "How the sailings' measures relate", "--subtitle", "150 sailings; each pair on shared scales, each measure's distribution on the diagonal"}},
	{"map-boardings", "districts.csv", []string{"map", "--region", "district", "--value", "boardings", "--per", "residents", "--shapes", "{islands.geojson}", "--labels",
		"--value-name", "ferry boardings", "--title", "Outer districts travel less by ferry", "--subtitle", "Ferry boardings per resident, 2025, by district of the Lantern Isles",
		"--source", "Lantern Isles Ferry Company (fictional), demo data; invented islands"}},
	{"box-crossings", "crossings.csv", []string{"box", "--group", "route", "--value", "crossing_min", "--unit", "min", "--value-name", "crossing time",
		"--title", "How long the crossings took", "--subtitle", "Every sailing of one November week, per route; the night sailing ran four times",
		"--source", "Lantern Isles Ferry Company (fictional), demo data"}},
	{"hist-delays", "delays.csv", []string{"hist", "--value", "delay_min", "--unit", "min", "--value-name", "departure delay",
		"--title", "Most sailings leave within five minutes", "--subtitle", "Departure delays of 1,400 sailings on one route over a quarter"}},
	{"span-temperatures", "temperatures.csv", []string{"span", "--label", "month", "--value", "temp_c", "--mark-where", "year=2025", "--order", "data",
		"--unit", "°C", "--value-name", "monthly mean temperature",
		"--title", "A warm 2025 on Great Osk", "--subtitle", "Monthly mean air temperature: the range and mean of 2000–2025, and 2025 itself"}},
	{"audit-aspect-before", "", []string{"figure", "audit-aspect-before.json"}},
	{"audit-aspect-after", "", []string{"figure", "audit-aspect-after.json"}},
	{"audit-series-before", "", []string{"figure", "audit-series-before.json"}},
	{"audit-categories-before", "", []string{"figure", "audit-categories-before.json"}},
	{"audit-categories-after", "", []string{"figure", "audit-categories-after.json"}},
	{"audit-magnitudes-before", "", []string{"figure", "audit-magnitudes-before.json"}},
	{"audit-magnitudes-after", "", []string{"figure", "audit-magnitudes-after.json"}},
	{"audit-narrow-before", "", []string{"figure", "audit-narrow-before.json"}},
	{"audit-narrow-after", "", []string{"figure", "audit-narrow-after.json"}},
	{"audit-override-before", "", []string{"figure", "audit-override-before.json"}},
	{"audit-override-after", "", []string{"figure", "audit-override-after.json"}},
	{"audit-colours-before", "", []string{"figure", "audit-colours-before.json"}},
	{"audit-colours-after", "", []string{"figure", "audit-colours-after.json"}},
	{"audit-contrast-before", "", []string{"figure", "audit-contrast-before.json"}},
	{"audit-contrast-after", "", []string{"figure", "audit-contrast-after.json"}},
	{"palette-categorical", "", []string{"palette", "categorical", "--n", "8"}},
	{"palette-sequential", "", []string{"palette", "sequential", "--n", "7", "--hue", "blue"}},
	{"palette-diverging", "", []string{"palette", "diverging", "--n", "9"}},
	{"heat-loads", "loads.csv", []string{"heat", "--row", "weekday", "--col", "hour", "--value", "load_pct", "--order", "cluster", "--tree",
		"--value-name", "load, % of seats", "--title", "Weekend sailings fill later in the day",
		"--subtitle", "Share of seats taken by hour of departure; weekdays in cluster order",
		"--source", "Lantern Isles Ferry Company (fictional), demo data"}},
}

// demoFigures are the figure files of the gallery, by name; their data
// paths name files in demodata/.
var demoFigures = map[string]string{
	"slide.json": `{
  "for": "slide",
  "title": "The ferry year at a glance",
  "subtitle": "Four views of the 2025 season",
  "source": "Lantern Isles Ferry Company (fictional), demo data",
  "panels": [
    {"chart": "bars", "data": "routes.csv", "label": "route", "value": "passengers", "top": 3, "title": "Busiest routes"},
    {"chart": "dots", "data": "routes.csv", "label": "route", "value": "punctuality_pct", "unit": "%", "top": 3, "title": "Most punctual routes"},
    {"chart": "bars", "data": "cargo.csv", "label": "cargo", "value": "tonnes", "title": "Cargo landed, all harbours"},
    {"chart": "bars", "data": "loads.csv", "label": "weekday", "value": "load_pct", "agg": "mean", "order": "data", "vertical": true, "unit": "%", "title": "Mean load by weekday"}
  ]
}
`,
	// The audit pairs (README "Audit"): each before breaks one rule of
	// plumb audit, its after is the honest twin.
	"audit-aspect-before.json": `{"title": "Fuel burnt by vessel A", "panels": [
  {"chart": "lines", "data": "fuel.csv", "x": "month", "y": "vessel_a", "unit": "t", "aspect": "1:1"}]}
`,
	"audit-aspect-after.json": `{"title": "Fuel burnt by vessel A", "panels": [
  {"chart": "lines", "data": "fuel.csv", "x": "month", "y": "vessel_a", "unit": "t"}]}
`,
	"audit-series-before.json": `{"title": "Vessel load by hour, seven weekdays", "panels": [
  {"chart": "lines", "data": "loads.csv", "x": "hour", "y": "load_pct", "series": "weekday", "unit": "%"}]}
`,
	"audit-categories-before.json": `{"title": "Boardings at thirty stops", "panels": [
  {"chart": "bars", "data": "stops.csv", "label": "stop", "value": "boardings", "top": -1}]}
`,
	"audit-categories-after.json": `{"title": "Boardings at the twelve busiest stops", "panels": [
  {"chart": "bars", "data": "stops.csv", "label": "stop", "value": "boardings", "top": 12}]}
`,
	"audit-magnitudes-before.json": `{"title": "Freight landed, mainland and islands", "panels": [
  {"chart": "lines", "data": "freight.csv", "x": "month", "y": ["mainland_t", "island_t"]}]}
`,
	"audit-magnitudes-after.json": `{"title": "Freight landed, mainland and islands", "panels": [
  {"chart": "lines", "data": "freight.csv", "x": "month", "y": ["mainland_t", "island_t"], "index": true}]}
`,
	"audit-narrow-before.json": `{"title": "Punctuality of the three most punctual routes", "panels": [
  {"chart": "dots", "data": "routes.csv", "label": "route", "value": "punctuality_pct", "unit": "%", "top": 3}]}
`,
	"audit-narrow-after.json": `{"title": "Punctuality of the three most punctual routes", "panels": [
  {"chart": "dots", "data": "routes.csv", "label": "route", "value": "punctuality_pct", "unit": "%", "top": 3, "from": 0, "to": 100}]}
`,
	"audit-override-before.json": `{"title": "Passengers per route, 2025", "panels": [
  {"chart": "bars", "data": "routes.csv", "label": "route", "value": "passengers", "top": 8, "to": 2000000}]}
`,
	"audit-override-after.json": `{"title": "Passengers per route, 2025", "panels": [
  {"chart": "bars", "data": "routes.csv", "label": "route", "value": "passengers", "top": 8}]}
`,
	"audit-colours-before.json": `{"title": "Punctuality of the three busiest routes", "panels": [
  {"chart": "lines", "data": "punctuality.csv", "x": "month", "y": "on_time_pct", "series": "route", "unit": "%", "colors": "#d62728,#2ca02c,#1f77b4"}]}
`,
	"audit-colours-after.json": `{"title": "Punctuality of the three busiest routes", "panels": [
  {"chart": "lines", "data": "punctuality.csv", "x": "month", "y": "on_time_pct", "series": "route", "unit": "%"}]}
`,
	"audit-contrast-before.json": `{"title": "Passengers per route, 2025", "panels": [
  {"chart": "bars", "data": "routes.csv", "label": "route", "value": "passengers", "top": 8, "colors": "#e3eef8"}]}
`,
	"audit-contrast-after.json": `{"title": "Passengers per route, 2025", "panels": [
  {"chart": "bars", "data": "routes.csv", "label": "route", "value": "passengers", "top": 8, "colors": "#1f5fa8"}]}
`,
}

// demoSynopsis is the usage line of plumb demo.
const demoSynopsis = "[-o DIR]"

// runDemo renders the gallery from the data built into the binary.
func runDemo(args []string, stdout, stderr io.Writer) int {
	out := new(string)
	*out = "plumb-demo"
	fs := newTableFlagSet("demo", demoSynopsis, []flagDef{
		{name: "o", arg: "DIR", def: "plumb-demo", usage: "write the gallery into DIR", value: stringValue{out}},
	}, stderr)
	pos, err := parse(fs, args)
	if err != nil {
		return exitCode(err, stderr)
	}
	if len(pos) > 0 {
		return exitCode(usagef("demo takes no data file; it uses its own (-o DIR for the output folder)"), stderr)
	}
	if err := os.MkdirAll(*out, 0o755); err != nil {
		return exitCode(fmt.Errorf("demo: %w", err), stderr)
	}
	for _, fig := range gallery {
		path := filepath.Join(*out, fig.name+".svg")
		if code := renderDemo(fig, path, stdout, stderr); code != exitOK {
			return code
		}
		fmt.Fprintln(stderr, "wrote", terminalSafe(path))
	}
	return exitOK
}

// renderDemo renders one gallery figure to path (.svg or .png) from the
// data built into the binary.
func renderDemo(fig figure, path string, stdout, stderr io.Writer) int {
	if fig.args[0] == "figure" {
		return demoFigure(fig, path, stdout, stderr)
	}
	// Files a figure names besides its data ({islands.geojson}) are
	// written to a temporary folder for the run.
	side, err := os.MkdirTemp("", "plumb-demo-")
	if err != nil {
		return exitCode(fmt.Errorf("demo: %w", err), stderr)
	}
	defer os.RemoveAll(side)
	fig.args = slices.Clone(fig.args)
	for i, a := range fig.args {
		if name, ok := strings.CutPrefix(a, "{"); ok && strings.HasSuffix(name, "}") {
			name = strings.TrimSuffix(name, "}")
			b, err := demoFS.ReadFile("demodata/" + name)
			if err != nil {
				return exitCode(fmt.Errorf("demo: %w", err), stderr)
			}
			fig.args[i] = filepath.Join(side, name)
			if err := os.WriteFile(fig.args[i], b, 0o644); err != nil {
				return exitCode(fmt.Errorf("demo: %w", err), stderr)
			}
		}
	}
	args := append(slices.Clone(fig.args), "-o", path)
	var data []byte
	if fig.data != "" {
		if data, err = demoData(fig.data); err != nil {
			return exitCode(fmt.Errorf("demo: %w", err), stderr)
		}
		args = append([]string{fig.args[0], "-", "--format", "csv", "--quiet", "-o", path}, fig.args[1:]...)
	}
	var errs bytes.Buffer
	if code := run(args, bytes.NewReader(data), stdout, &errs); code != exitOK {
		fmt.Fprintf(stderr, "plumb: demo %s failed: %s", fig.name, errs.String())
		return code
	}
	return exitOK
}

// demoFigure renders a gallery figure file from the demo data.
func demoFigure(fig figure, path string, stdout, stderr io.Writer) int {
	dir, err := writeDemoFigure(fig.args[1])
	if err != nil {
		return exitCode(fmt.Errorf("demo: %w", err), stderr)
	}
	defer os.RemoveAll(dir)
	var errs bytes.Buffer
	if code := run([]string{"figure", filepath.Join(dir, fig.args[1]), "--quiet", "-o", path}, nil, stdout, &errs); code != exitOK {
		fmt.Fprintf(stderr, "plumb: demo %s failed: %s", fig.name, errs.String())
		return code
	}
	return exitOK
}

// writeDemoFigure writes a gallery figure file and the demo data it reads
// into a new temporary folder, which the caller removes.
func writeDemoFigure(name string) (string, error) {
	text, ok := demoFigures[name]
	if !ok {
		return "", fmt.Errorf("no demo figure file %q", name)
	}
	dir, err := os.MkdirTemp("", "plumb-demo-")
	if err != nil {
		return "", err
	}
	files, err := demoFS.ReadDir("demodata")
	if err != nil {
		os.RemoveAll(dir)
		return "", err
	}
	for _, f := range files {
		data, err := demoFS.ReadFile("demodata/" + f.Name())
		if err == nil {
			err = os.WriteFile(filepath.Join(dir, f.Name()), data, 0o644)
		}
		if err != nil {
			os.RemoveAll(dir)
			return "", err
		}
	}
	for f, data := range auditDemoData {
		if err := os.WriteFile(filepath.Join(dir, f), []byte(data), 0o644); err != nil {
			os.RemoveAll(dir)
			return "", err
		}
	}
	if err := os.WriteFile(filepath.Join(dir, name), []byte(text), 0o644); err != nil {
		os.RemoveAll(dir)
		return "", err
	}
	return dir, nil
}
