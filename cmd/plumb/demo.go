package main

import (
	"bytes"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"slices"
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
	{"lines-punctuality", "punctuality.csv", []string{"lines", "--x", "month", "--y", "on_time_pct", "--series", "route", "--unit", "%",
		"--y-name", "sailings on time", "--title", "Punctuality of the three busiest routes", "--subtitle", "Share of sailings leaving within five minutes of schedule, by month"}},
	{"lines-fuel-index", "fuel.csv", []string{"lines", "--x", "month", "--y", "vessel_a,vessel_b", "--index",
		"--title", "Fuel use of the two vessels, as an index", "--subtitle", "Monthly fuel use, first month = 100"}},
	{"lines-daily", "daily.csv", []string{"lines", "--x", "date", "--y", "passengers", "--y-name", "passengers per day",
		"--title", "Ten years of daily passengers", "--subtitle", "All routes; 3,653 days drawn with M4 reduction to the pixel columns"}},
	{"lines-multiples", "loads.csv", []string{"lines", "--x", "hour", "--y", "load_pct", "--series", "weekday", "--unit", "%",
		"--y-name", "seats taken", "--x-name", "hour of departure", "--title", "Vessel load by hour, one panel per weekday",
		"--subtitle", "Share of seats taken; the range of all days in grey behind each panel"}},
	{"diff-fuel", "fuel.csv", []string{"diff", "--x", "month", "--a", "vessel_a", "--b", "vessel_b", "--context", "--unit", "t",
		"--title", "Vessel A burns more fuel than vessel B every month", "--subtitle", "Monthly fuel use in tonnes (above) and the difference A − B (below)"}},
	{"box-crossings", "crossings.csv", []string{"box", "--group", "route", "--value", "crossing_min", "--unit", "min", "--value-name", "crossing time",
		"--title", "How long the crossings took", "--subtitle", "Every sailing of one November week, per route; the night sailing ran four times",
		"--source", "Lantern Isles Ferry Company (fictional), demo data"}},
	{"hist-delays", "delays.csv", []string{"hist", "--value", "delay_min", "--unit", "min", "--value-name", "departure delay",
		"--title", "Most sailings leave within five minutes", "--subtitle", "Departure delays of 1,400 sailings on one route over a quarter"}},
	{"span-temperatures", "temperatures.csv", []string{"span", "--label", "month", "--value", "temp_c", "--mark-where", "year=2025", "--order", "data",
		"--unit", "°C", "--value-name", "monthly mean temperature",
		"--title", "A warm 2025 on Great Osk", "--subtitle", "Monthly mean air temperature: the range and mean of 2000–2025, and 2025 itself"}},
	{"palette-categorical", "", []string{"palette", "categorical", "--n", "8"}},
	{"palette-sequential", "", []string{"palette", "sequential", "--n", "7", "--hue", "blue"}},
	{"palette-diverging", "", []string{"palette", "diverging", "--n", "9"}},
	{"heat-loads", "loads.csv", []string{"heat", "--row", "weekday", "--col", "hour", "--value", "load_pct", "--order", "cluster", "--tree",
		"--value-name", "load, % of seats", "--title", "Weekend sailings fill later in the day",
		"--subtitle", "Share of seats taken by hour of departure; weekdays in cluster order",
		"--source", "Lantern Isles Ferry Company (fictional), demo data"}},
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
		args := append(slices.Clone(fig.args), "-o", path)
		var data []byte
		if fig.data != "" {
			var err error
			if data, err = demoFS.ReadFile("demodata/" + fig.data); err != nil {
				return exitCode(fmt.Errorf("demo: %w", err), stderr)
			}
			args = append([]string{fig.args[0], "-", "--format", "csv", "--quiet", "-o", path}, fig.args[1:]...)
		}
		var errs bytes.Buffer
		if code := run(args, bytes.NewReader(data), stdout, &errs); code != exitOK {
			fmt.Fprintf(stderr, "plumb: demo %s failed: %s", fig.name, errs.String())
			return code
		}
		fmt.Fprintln(stderr, "wrote", terminalSafe(path))
	}
	return exitOK
}
