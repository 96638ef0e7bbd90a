// Command ferrygen writes plumb's demo data: the made-up island ferry
// operator of the gallery, its routes, passengers, punctuality, fuel use and
// loads. Every island and route is invented. The numbers come from fixed
// seeds of the PCG generator in math/rand/v2, so a run always writes the
// same bytes; cmd/plumb's tests check that the committed files match.
//
// Usage (from cmd/plumb, through its go:generate line):
//
//	go run ../../testdata/ferrygen -o demodata
package main

import (
	"encoding/csv"
	"flag"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strconv"
	"time"
)

func main() {
	out := flag.String("o", "../../cmd/plumb/demodata", "folder to write the CSV files into")
	flag.Parse()
	if err := generate(*out); err != nil {
		fmt.Fprintln(os.Stderr, "ferrygen:", err)
		os.Exit(1)
	}
}

// A data set is a file name and a function that fills its rows. Each gets
// its own random stream, so changing one never changes the others.
var datasets = []struct {
	file string
	make func(rng *rand.Rand) [][]string
}{
	{"routes.csv", routes},
	{"change.csv", change},
	{"punctuality.csv", punctuality},
	{"fuel.csv", fuel},
	{"daily.csv", daily},
	{"loads.csv", loads},
	{"cargo.csv", cargo},
}

// seed is the fixed seed of every stream; the stream number is the second
// PCG word.
const seed = 20250611

func generate(dir string) error {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return err
	}
	for i, ds := range datasets {
		rows := ds.make(rand.New(rand.NewPCG(seed, uint64(i+1))))
		if err := writeCSV(filepath.Join(dir, ds.file), rows); err != nil {
			return err
		}
	}
	for _, ds := range distributionSets {
		if err := writeCSV(filepath.Join(dir, ds.file), ds.make(rand.New(rand.NewPCG(seed, ds.stream)))); err != nil {
			return err
		}
	}
	// The islands' shapes and districts: their own stream, after the CSVs.
	return islandsFiles(dir, rand.New(rand.NewPCG(seed, 1000)))
}

func writeCSV(path string, rows [][]string) error {
	f, err := os.Create(path)
	if err != nil {
		return err
	}
	w := csv.NewWriter(f)
	if err := w.WriteAll(rows); err != nil {
		f.Close()
		return err
	}
	return f.Close()
}

// route is one invented crossing: its name, its length in minutes, how
// busy it is relative to the others, the size of its vessel (fuel per
// minute, litres), and, for a new fast service, the crossing length its
// fare is priced as.
type route struct {
	name       string
	minutes    int
	popularity float64
	burn       float64
	pricedAs   int
}

var network = []route{
	{"Saltmarrow Point to Kettlewick Harbour via Little Osk", 95, 1.00, 14, 0},
	{"Kettlewick Harbour to Great Osk", 35, 0.85, 9, 0},
	{"Great Osk to Little Osk", 15, 0.55, 4, 0},
	{"Saltmarrow Point to Brindle Holm", 50, 0.40, 9, 0},
	{"Cindergull Bay to Tarnwhistle", 25, 0.70, 6, 0},
	{"Tarnwhistle to Pellicorn Isle", 40, 0.32, 6, 0},
	{"Kettlewick Harbour to Cindergull Bay", 60, 0.62, 12, 0},
	{"Lanternquay to Varrowick Sound", 30, 0.48, 6, 0},
	{"Varrowick Sound to Glimmerholm", 45, 0.22, 5, 0},
	{"Glimmerholm to Ember Skerry", 20, 0.09, 3, 0},
	{"Lanternquay to Saltmarrow Point", 70, 0.58, 12, 0},
	{"Marrowfen to Hobbin Reach", 25, 0.15, 4, 0},
	{"Hobbin Reach to Gullstone", 30, 0.11, 4, 0},
	{"Pellicorn Isle to Marrowfen via the Tidewhistle Narrows", 110, 0.19, 10, 0},
	{"Ember Skerry to Quillhaven", 55, 0.07, 5, 0},
	{"Quillhaven to Lanternquay", 65, 0.13, 8, 0},
	{"Brindle Holm to Oskmouth", 20, 0.26, 4, 150}, // the new fast craft
	{"Gullstone to Tarnwhistle", 35, 0.05, 3, 0},
	{"Varrowick Sound to Kettlewick Harbour, night sailing", 150, 0.04, 14, 0},
	{"Little Osk to Cindergull Bay calling at Brindle Holm and Ember Skerry", 180, 0.08, 11, 0},
}

// round rounds to the given number of decimals and formats without a
// trailing exponent, so that the files stay small and read plainly.
func round(x float64, decimals int) string {
	return strconv.FormatFloat(x, 'f', decimals, 64)
}

// noise is a multiplicative factor near 1: exp of a normal with the given
// spread, so it is never negative.
func noise(rng *rand.Rand, spread float64) float64 {
	return math.Exp(float64(rng.NormFloat64() * spread))
}

// routes lists the attributes of every route: a long-tailed passenger
// count (so that a bar chart combines the smallest into Other), and
// attributes that depend on the crossing's length, for scatter plots.
func routes(rng *rand.Rand) [][]string {
	rows := [][]string{{"route", "passengers", "punctuality_pct", "fuel_per_trip", "crossing_minutes", "fare"}}
	for _, r := range network {
		minutes := float64(r.minutes)
		passengers := float64(r.popularity*412000) * noise(rng, 0.08)
		punctual := 97.5 - float64(0.045*minutes) - math.Abs(float64(rng.NormFloat64()*1.5))
		fuel := float64(r.burn*minutes) * noise(rng, 0.05)
		fare := 3.5 + float64(0.115*float64(max(r.minutes, r.pricedAs)))
		rows = append(rows, []string{
			r.name,
			round(math.Round(passengers/10)*10, 0),
			round(punctual, 1),
			round(math.Round(fuel/5)*5, 0),
			strconv.Itoa(r.minutes),
			round(math.Round(fare*20)/20, 2), // fares end in 0 or 5 cents
		})
	}
	return rows
}

// change is the change in passengers against last year for the nine
// busiest routes: a modest rise overall, with some routes falling.
func change(rng *rand.Rand) [][]string {
	rows := [][]string{{"route", "change_pct"}}
	trend := []float64{4.1, -2.6, 7.8, 1.2, -6.4, 3.3, 12.5, -0.8, 5.6}
	for i, r := range network[:9] {
		rows = append(rows, []string{r.name, round(trend[i]+float64(rng.NormFloat64()*1.1), 1)})
	}
	return rows
}

// months returns the months from January 2024 to December 2025.
func months() []time.Time {
	var out []time.Time
	for m := time.Date(2024, 1, 1, 0, 0, 0, 0, time.UTC); m.Year() < 2026; m = m.AddDate(0, 1, 0) {
		out = append(out, m)
	}
	return out
}

// winter is how many points of punctuality the weather costs in each
// month, worst in the winter storms.
var winter = [12]float64{6.5, 5.5, 3.5, 1.5, 0.5, 0, 0.5, 1, 1, 2.5, 4.5, 6}

// punctuality gives the monthly share of sailings on time for three routes
// in long form (month, route, value), for line charts.
func punctuality(rng *rand.Rand) [][]string {
	rows := [][]string{{"month", "route", "on_time_pct"}}
	chosen := []struct {
		r    route
		base float64
	}{{network[0], 93}, {network[1], 96.5}, {network[6], 90}}
	for _, m := range months() {
		for _, c := range chosen {
			v := c.base - winter[m.Month()-1] + float64(rng.NormFloat64()*1.2)
			rows = append(rows, []string{m.Format("2006-01"), c.r.name, round(min(v, 99.6), 1)})
		}
	}
	return rows
}

// summer scales sailings through the year: the timetable adds crossings
// from May to September.
var summer = [12]float64{0.78, 0.76, 0.84, 0.93, 1.04, 1.15, 1.26, 1.28, 1.1, 0.95, 0.84, 0.9}

// fuel gives the monthly fuel use of the two vessels, thousand litres, in
// wide form. The second vessel is in dry dock for most of February 2025.
func fuel(rng *rand.Rand) [][]string {
	rows := [][]string{{"month", "vessel_a", "vessel_b"}}
	for _, m := range months() {
		s := summer[m.Month()-1]
		a := float64(212*s) * noise(rng, 0.04)
		b := float64(148*s) * noise(rng, 0.05)
		if m.Year() == 2025 && m.Month() == time.February {
			b *= 0.18
		}
		rows = append(rows, []string{m.Format("2006-01"), round(a, 1), round(b, 1)})
	}
	return rows
}

// weekday scales passengers by day of the week, Sunday first as in
// time.Weekday: busiest on Fridays and Saturdays.
var weekday = [7]float64{1.06, 0.93, 0.88, 0.9, 0.96, 1.13, 1.2}

// daily gives passengers per day over ten years: growth of about 3.5% a
// year, summer peaks, a weekly cycle, noise, winter storm days with most
// sailings cancelled, and a spring of reduced service while the main
// vessel was refitted.
func daily(rng *rand.Rand) [][]string {
	rows := [][]string{{"date", "passengers"}}
	start := time.Date(2016, 1, 1, 0, 0, 0, 0, time.UTC)
	end := time.Date(2026, 1, 1, 0, 0, 0, 0, time.UTC)
	refitFrom := time.Date(2019, 2, 4, 0, 0, 0, 0, time.UTC)
	refitTo := time.Date(2019, 3, 18, 0, 0, 0, 0, time.UTC)
	for d := start; d.Before(end); d = d.AddDate(0, 0, 1) {
		years := float64(d.Sub(start).Hours()) / (24 * 365.25)
		v := 2650 * math.Pow(1.035, years) * summer[d.Month()-1] * weekday[d.Weekday()] * noise(rng, 0.07)
		if !d.Before(refitFrom) && d.Before(refitTo) {
			v *= 0.68
		}
		stormy := d.Month() <= 3 || d.Month() >= 10
		if stormy && rng.Float64() < 0.02 {
			v *= 0.15 + float64(0.25*rng.Float64())
		}
		rows = append(rows, []string{d.Format("2006-01-02"), strconv.Itoa(int(math.Round(v)))})
	}
	return rows
}

// loads gives the average load of sailings by weekday and hour of
// departure, in percent of capacity: commuter peaks on weekdays, a broad
// midday peak at weekends.
func loads(rng *rand.Rand) [][]string {
	rows := [][]string{{"weekday", "hour", "load_pct"}}
	days := []string{"Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"}
	for i, day := range days {
		weekend := i >= 5
		for hour := 6; hour <= 22; hour++ {
			h := float64(hour)
			var v float64
			if weekend {
				v = 18 + 62*bump(h, 13, 3.2)
			} else {
				v = 15 + 70*bump(h, 7.75, 1) + 58*bump(h, 17.5, 1.2) + 14*bump(h, 12.5, 2)
			}
			if day == "Fri" {
				v += 16 * bump(h, 19, 2)
			}
			v *= noise(rng, 0.05)
			rows = append(rows, []string{day, strconv.Itoa(hour), strconv.Itoa(int(math.Round(min(v, 100))))})
		}
	}
	return rows
}

// bump is a Gaussian bell of height 1 around centre.
func bump(x, centre, width float64) float64 {
	z := (x - centre) / width
	return math.Exp(float64(-z*z) / 2)
}

// cargo is the freight landed at the four main harbours in 2025, in tonnes
// per kind of cargo: five kinds per harbour, so that small multiples by
// harbour draw 4 panels of 5 bars. Each harbour has its own trade (timber
// at Cindergull Bay, livestock at Saltmarrow Point), so the panels differ
// in order as well as in size.
func cargo(rng *rand.Rand) [][]string {
	rows := [][]string{{"harbour", "cargo", "tonnes"}}
	kinds := []string{"grain", "timber", "fuel", "livestock", "post"}
	harbours := []struct {
		name string
		size float64   // overall trade, in tonnes of the base mix
		bias []float64 // multiplier per kind of cargo
	}{
		{"Kettlewick Harbour", 9000, []float64{1.2, 0.8, 1.4, 0.6, 1.0}},
		{"Saltmarrow Point", 5200, []float64{0.9, 0.4, 0.8, 2.2, 0.7}},
		{"Lanternquay", 4100, []float64{1.0, 1.1, 1.6, 0.5, 0.9}},
		{"Cindergull Bay", 2600, []float64{0.5, 2.6, 0.7, 0.8, 0.6}},
	}
	base := []float64{0.30, 0.22, 0.28, 0.15, 0.05} // share of each kind in a typical harbour
	for _, h := range harbours {
		for k, kind := range kinds {
			t := h.size * base[k] * h.bias[k] * noise(rng, 0.12)
			rows = append(rows, []string{h.name, kind, round(t, 0)})
		}
	}
	return rows
}
