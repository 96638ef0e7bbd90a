package main

import (
	"encoding/csv"
	"encoding/xml"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"
)

// goldenDesc is the <desc> of a golden figure.
func goldenDesc(t *testing.T, name string) string {
	t.Helper()
	data, err := os.ReadFile(filepath.Join(goldenDir, name+".svg"))
	if err != nil {
		t.Fatal(err)
	}
	var doc struct {
		Desc string `xml:"desc"`
	}
	if err := xml.Unmarshal(data, &doc); err != nil {
		t.Fatal(err)
	}
	if doc.Desc == "" {
		t.Fatalf("%s has no <desc>", name)
	}
	return doc.Desc
}

// demoColumn reads the named columns of a demo data file.
func demoColumns(t *testing.T, file string, cols ...string) [][]string {
	t.Helper()
	f, err := os.Open(filepath.Join("demodata", file))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	recs, err := csv.NewReader(f).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	idx := make([]int, len(cols))
	for i, c := range cols {
		idx[i] = -1
		for j, h := range recs[0] {
			if h == c {
				idx[i] = j
			}
		}
		if idx[i] < 0 {
			t.Fatalf("%s has no column %q", file, c)
		}
	}
	out := make([][]string, len(recs)-1)
	for r, rec := range recs[1:] {
		for _, j := range idx {
			out[r] = append(out[r], rec[j])
		}
	}
	return out
}

func parseNum(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatal(err)
	}
	return v
}

// month writes "2024-08" as a description does: "Aug 2024".
func month(t *testing.T, s string) string {
	t.Helper()
	m, err := time.Parse("2006-01", s)
	if err != nil {
		t.Fatal(err)
	}
	return m.Format("Jan 2006")
}

// TestGoldenDescriptionFacts checks the key facts of each golden figure's
// description against the demo data, computed here independently of
// render: the extremes a reader needs, with their values, dates written
// at the data's own precision, and changes of percentages in points.
func TestGoldenDescriptionFacts(t *testing.T) {
	tests := []struct {
		golden string
		facts  func(t *testing.T) []string // text the description must contain
		never  []string                    // text it must not contain
	}{
		{golden: "bars-sorted", facts: func(t *testing.T) []string {
			rows := demoColumns(t, "routes.csv", "route", "passengers")
			hi, lo := 0, 0
			for i, r := range rows {
				if parseNum(t, r[1]) > parseNum(t, rows[hi][1]) {
					hi = i
				}
				if parseNum(t, r[1]) < parseNum(t, rows[lo][1]) {
					lo = i
				}
			}
			// The largest value written as the value labels write it:
			// thousands with one decimal, as the rest of the column.
			return []string{"Bar chart of passengers by route", "Largest: " + rows[hi][0] + " at " + fmt.Sprintf("%.1fk", parseNum(t, rows[hi][1])/1000), "smallest: " + rows[lo][0]}
		}},
		{golden: "lines-punctuality", facts: func(t *testing.T) []string {
			rows := demoColumns(t, "punctuality.csv", "month", "route", "on_time_pct")
			first, last := map[string]float64{}, map[string]float64{}
			for _, r := range rows {
				if _, ok := first[r[1]]; !ok {
					first[r[1]] = parseNum(t, r[2])
				}
				last[r[1]] = parseNum(t, r[2])
			}
			r := rows[0][1]
			change := last[r] - first[r]
			dir := "up"
			if change < 0 {
				dir = "down"
			}
			return []string{"from " + month(t, rows[0][0]) + " to " + month(t, rows[len(rows)-1][0]),
				fmt.Sprintf("%s: %.1f%% at %s", r, first[r], month(t, rows[0][0])),
				fmt.Sprintf("%s %.1f percentage points", dir, math.Abs(change))}
		}, never: []string{"at 2024,", "at 2025,", "from 2024 "}},
		{golden: "diff-fuel", facts: func(t *testing.T) []string {
			rows := demoColumns(t, "fuel.csv", "month", "vessel_a", "vessel_b")
			hi, above := 0, 0
			for i, r := range rows {
				d := parseNum(t, r[1]) - parseNum(t, r[2])
				if d > parseNum(t, rows[hi][1])-parseNum(t, rows[hi][2]) {
					hi = i
				}
				if d > 0 {
					above++
				}
			}
			gap := parseNum(t, rows[hi][1]) - parseNum(t, rows[hi][2])
			return []string{fmt.Sprintf("vessel_a is above vessel_b at %d of %d points", above, len(rows)),
				fmt.Sprintf("Largest gap with vessel_a above: %.0f t at %s", gap, month(t, rows[hi][0])),
				"from " + month(t, rows[0][0]) + " to " + month(t, rows[len(rows)-1][0])}
		}, never: []string{"at 2024,", "at 2025,"}},
		{golden: "lines-daily", facts: func(t *testing.T) []string {
			rows := demoColumns(t, "daily.csv", "date", "passengers")
			d, err := time.Parse("2006-01-02", rows[0][0])
			if err != nil {
				t.Fatal(err)
			}
			return []string{"from " + d.Format("2 Jan 2006"), rows[0][1] + " at " + d.Format("2 Jan 2006")}
		}},
		{golden: "heat-loads", facts: func(t *testing.T) []string {
			rows := demoColumns(t, "loads.csv", "weekday", "hour", "load_pct")
			hi, lo := 0, 0
			for i, r := range rows {
				if parseNum(t, r[2]) > parseNum(t, rows[hi][2]) {
					hi = i
				}
				if parseNum(t, r[2]) < parseNum(t, rows[lo][2]) {
					lo = i
				}
			}
			return []string{fmt.Sprintf("Largest %s at %s, %s", rows[hi][2], rows[hi][0], rows[hi][1]), fmt.Sprintf("smallest %s at %s, %s", rows[lo][2], rows[lo][0], rows[lo][1])}
		}},
		{golden: "map-boardings", facts: func(t *testing.T) []string {
			rows := demoColumns(t, "districts.csv", "district", "residents", "boardings")
			hi, lo := 0, 0
			rate := func(r []string) float64 { return parseNum(t, r[2]) / parseNum(t, r[1]) }
			for i, r := range rows {
				if rate(r) > rate(rows[hi]) {
					hi = i
				}
				if rate(r) < rate(rows[lo]) {
					lo = i
				}
			}
			return []string{"Highest: " + rows[hi][0], "Lowest: " + rows[lo][0]}
		}},
		{golden: "dots-punctuality", facts: func(t *testing.T) []string {
			rows := demoColumns(t, "routes.csv", "route", "punctuality_pct")
			hi, lo := 0, 0
			for i, r := range rows {
				if parseNum(t, r[1]) > parseNum(t, rows[hi][1]) {
					hi = i
				}
				if parseNum(t, r[1]) < parseNum(t, rows[lo][1]) {
					lo = i
				}
			}
			return []string{"Dot plot of sailings on time by route, 20 dots",
				fmt.Sprintf("Largest: %s at %.1f%%", rows[hi][0], parseNum(t, rows[hi][1])), fmt.Sprintf("smallest: %s at %.1f%%", rows[lo][0], parseNum(t, rows[lo][1]))}
		}},
		{golden: "bars-side", facts: func(t *testing.T) []string {
			rows := demoColumns(t, "fuel.csv", "month", "vessel_a", "vessel_b")
			var out []string
			for s, name := range []string{"vessel_a", "vessel_b"} {
				hi, lo := 0, 0
				for i, r := range rows {
					if parseNum(t, r[s+1]) > parseNum(t, rows[hi][s+1]) {
						hi = i
					}
					if parseNum(t, r[s+1]) < parseNum(t, rows[lo][s+1]) {
						lo = i
					}
				}
				out = append(out, fmt.Sprintf("%s: largest %s at %.0f t, smallest %s at %.0f t", name, month(t, rows[hi][0]), parseNum(t, rows[hi][s+1]), month(t, rows[lo][0]), parseNum(t, rows[lo][s+1])))
			}
			return out
		}},
		{golden: "fixture-bars-sightings", facts: func(t *testing.T) []string {
			return []string{"Total: 2,621."} // the count column of testdata/bars/sightings.csv, summed by hand (awk)
		}},
		{golden: "scatter-fuel-fit", facts: func(t *testing.T) []string {
			return []string{"400 points", "fuel burnt (litres) against crossing (km)", "r = 0."}
		}},
	}
	for _, tt := range tests {
		t.Run(tt.golden, func(t *testing.T) {
			desc := goldenDesc(t, tt.golden)
			for _, f := range tt.facts(t) {
				if !strings.Contains(desc, f) {
					t.Errorf("desc lacks %q:\n%s", f, desc)
				}
			}
			for _, n := range tt.never {
				if strings.Contains(desc, n) {
					t.Errorf("desc has %q:\n%s", n, desc)
				}
			}
		})
	}
}

// TestGoldenDescriptionDates checks every golden of monthly or daily data
// writes its dates at that precision: a bare year after "at" or "from"
// appears only where the x values are years.
func TestGoldenDescriptionDates(t *testing.T) {
	bareYear := regexp.MustCompile(`\b(at|from|to) (19|20)\d\d\b[^ ]`)
	files, _ := filepath.Glob(filepath.Join(goldenDir, "*.svg"))
	for _, path := range files {
		name := strings.TrimSuffix(filepath.Base(path), ".svg")
		if strings.Contains(name, "years") || strings.HasPrefix(name, "palette-") {
			continue // years as x: a year is the precision
		}
		desc := goldenDesc(t, name)
		if m := bareYear.FindString(desc); m != "" {
			t.Errorf("%s: %q writes a date as a bare year:\n%s", name, m, desc)
		}
	}
}
