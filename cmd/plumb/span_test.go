package main

import (
	"fmt"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// monthTable invents monthly temperatures for several years, rows in a
// shuffled order, with one missing reading.
func monthTable(seed uint64) (string, map[string][]float64, map[string]float64) {
	rng := rand.New(rand.NewPCG(seed, 5))
	months := []string{"Jan", "Feb", "Mar", "Apr", "May", "Jun"}
	type row struct {
		month string
		year  int
		v     float64
	}
	var rows []row
	for year := 2001; year <= 2025; year++ {
		for m, name := range months {
			rows = append(rows, row{name, year, float64(int((4+float64(m)*2.5+rng.NormFloat64()*1.5)*10)) / 10})
		}
	}
	rng.Shuffle(len(rows), func(i, j int) { rows[i], rows[j] = rows[j], rows[i] })
	var b strings.Builder
	b.WriteString("month,year,temp\n")
	vals, latest := map[string][]float64{}, map[string]float64{}
	for i, r := range rows {
		if i == 7 {
			fmt.Fprintf(&b, "%s,%d,NA\n", r.month, r.year)
			continue
		}
		fmt.Fprintf(&b, "%s,%d,%g\n", r.month, r.year, r.v)
		vals[r.month] = append(vals[r.month], r.v)
		if r.year == 2025 {
			latest[r.month] = r.v
		}
	}
	return b.String(), vals, latest
}

// TestSpanComputed checks each range's low, mid and high against the
// minimum, mean and maximum of its rows (to 0.01), the quartile and
// percentile forms against type 7, and the overlaid dots against the rows
// --mark-where picks.
func TestSpanComputed(t *testing.T) {
	for seed := range uint64(4) {
		data, vals, latest := monthTable(seed)
		for _, stat := range []string{"range", "quartiles", "p10-p90"} {
			code, out, errs := plumb(t, data, "span", "-", "--label", "month", "--value", "temp", "--stat", stat, "--mark-where", "year=2025")
			require.Equal(t, 0, code, errs)
			root := checkFigure(t, []byte(out))
			marks := root.all("rect", "plumb-range")
			require.Len(t, marks, 6)
			for _, m := range marks {
				v := vals[m.Attr["data-label"]]
				var lo, mid, hi float64
				switch stat {
				case "range":
					sum := 0.0
					for _, x := range v {
						sum += x
					}
					lo, mid, hi = slices.Min(v), sum/float64(len(v)), slices.Max(v)
				case "quartiles":
					lo, mid, hi = type7(v, 0.25), type7(v, 0.5), type7(v, 0.75)
				default:
					lo, mid, hi = type7(v, 0.1), type7(v, 0.5), type7(v, 0.9)
				}
				assert.InDelta(t, lo, m.num(t, "data-low"), 0.01, stat)
				assert.InDelta(t, mid, m.num(t, "data-mid"), 0.01, stat)
				assert.InDelta(t, hi, m.num(t, "data-high"), 0.01, stat)
			}
			dots := root.all("circle", "plumb-overlay")
			got := 0
			for _, d := range dots {
				if want, ok := latest[d.Attr["data-label"]]; ok {
					assert.InDelta(t, want, d.num(t, "data-value"), 1e-9)
					got++
				}
			}
			assert.Equal(t, len(latest), got)
			assert.Equal(t, 1, len(root.all("text", "plumb-direct")), "the overlay is named once, directly")
		}
	}
}

func TestSpanGiven(t *testing.T) {
	data := "site,low,mid,high,now\nHarbour,2,5,9,7\nPier,1,1.5,3,\nHill,4,6,8,9\n"
	code, out, errs := plumb(t, data, "span", "-", "--label", "site", "--low", "low", "--mid", "mid", "--high", "high", "--mark", "now")
	require.Equal(t, 0, code, errs)
	root := checkFigure(t, []byte(out))
	var got []string
	for _, m := range root.all("rect", "plumb-range") {
		got = append(got, m.Attr["data-label"]+" "+m.Attr["data-low"]+" "+m.Attr["data-mid"]+" "+m.Attr["data-high"])
	}
	assert.Equal(t, []string{"Hill 4 6 8", "Harbour 2 5 9", "Pier 1 1.5 3"}, got, "ordered by the middle, largest first")
	assert.Len(t, root.all("circle", "plumb-overlay"), 2, "Pier has no value to overlay")
}

func TestSpanErrors(t *testing.T) {
	dir := t.TempDir()
	p := writeFile(t, dir, "ranges.csv", "site,low,mid,high\nA,1,2,3\nB,5,4,6\nA,1,2,3\n")
	for _, tc := range []struct {
		args []string
		code int
		msg  string
	}{
		{[]string{"--low", "low", "--mid", "mid", "--high", "high"}, 1, `ranges.csv: line 3, column "mid"`},
		{[]string{"--low", "low", "--mid", "mid"}, 2, "all three"},
		{[]string{"--low", "low", "--mid", "mid", "--high", "high", "--value", "low"}, 2, "not both"},
		{[]string{"--value", "low", "--mark", "high"}, 2, "--mark-where"},
		{[]string{"--value", "low", "--mark-where", "site"}, 2, "COL=VALUE"},
		{[]string{"--value", "low", "--label", "site", "--mark-where", "site=Z"}, 1, "no row with a value has site=Z"},
		{[]string{"--value", "low", "--label", "site", "--mark-where", "site=A"}, 1, "line 4"},
		{nil, 2, "--value"},
		{[]string{"--low", "low", "--mid", "mid", "--high", "high", "--stat", "quartiles"}, 2, "--stat computes ranges from raw rows"},
	} {
		code, _, errs := plumb(t, "", append([]string{"span", p}, tc.args...)...)
		assert.Equal(t, tc.code, code, "%v: %s", tc.args, errs)
		assert.Contains(t, errs, tc.msg, tc.args)
	}
	dup := writeFile(t, dir, "dup.csv", "site,low,mid,high\nA,1,2,3\nB,4,5,6\nA,1,2,3\n")
	code, _, errs := plumb(t, "", "span", dup, "--low", "low", "--mid", "mid", "--high", "high")
	assert.Equal(t, 1, code)
	assert.Contains(t, errs, `dup.csv: line 4, column "site"`)
	assert.Contains(t, errs, "line 2 too")
}
