package main

import (
	"bytes"
	"fmt"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Invented landings: long (one row per harbour, year and catch; the East
// quay has no 2025 row and West landing two 2026 rows) and wide.
const (
	landingsLong = "harbour,year,catch_t\nNorth harbour,2024,120\nNorth harbour,2025,100\nNorth harbour,2026,90\n" +
		"East quay,2024,80\nEast quay,2026,99\nSouth pier,2024,45\nSouth pier,2025,60\nSouth pier,2026,70\n" +
		"West landing,2024,10\nWest landing,2025,5\nWest landing,2026,9\nWest landing,2026,3\n"
	landingsWide = "harbour,nets,lines,pots,traps\nNorth harbour,50,40,30,1\nEast quay,20,,60,2\nSouth pier,10,15,20,3\n"
)

// runCSV runs plumb on a CSV given on standard input.
func runCSV(t *testing.T, csv string, args ...string) (out, errs string, code int) {
	t.Helper()
	var o, e bytes.Buffer
	code = run(append([]string{args[0], "-", "--format", "csv"}, args[1:]...), strings.NewReader(csv), &o, &e)
	return o.String(), e.String(), code
}

func TestSeriesCLI(t *testing.T) {
	tests := []struct {
		name  string
		csv   string
		args  []string
		marks int    // data marks drawn
		want  string // in the SVG
	}{
		// One dot per category and series: 4 harbours x 3 years, one missing.
		{"dots long", landingsLong, []string{"dots", "--series", "year"}, 11, `data-series="2025"`},
		{"bars long default draws dots", landingsLong, []string{"bars", "--label", "harbour", "--series", "year", "--value", "catch_t"}, 11, "<circle"},
		{"stack long", landingsLong, []string{"bars", "--series", "year", "--stack"}, 11, `data-start=`},
		{"stack percent", landingsLong, []string{"bars", "--series", "year", "--stack", "--percent"}, 11, "Share of row total"},
		{"side wide", landingsWide, []string{"bars", "--value", "nets,lines,pots", "--side"}, 8, `data-series="pots"`},
		{"dots wide", landingsWide, []string{"dots", "--value", "nets,lines,pots,traps"}, 11, `data-series="traps"`},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			out, errs, code := runCSV(t, tc.csv, append(tc.args, "--quiet")...)
			require.Equal(t, exitOK, code, errs)
			root := checkFigure(t, []byte(out))
			n := len(root.all("circle", "plumb-mark")) + len(root.all("rect", "plumb-mark"))
			assert.Equal(t, tc.marks, n)
			assert.Contains(t, out, tc.want)
			if tc.args[0] == "bars" && strings.Contains(out, "<rect") {
				checkBars(t, root)
			}
		})
	}
	// West landing's two 2026 rows are summed, and the note says so.
	_, errs, code := runCSV(t, landingsLong, "dots", "--series", "year", "--agg", "sum")
	require.Equal(t, exitOK, code, errs)
	assert.Contains(t, errs, `"West landing / 2026" (2 rows)`)
}

func TestSeriesCLIErrors(t *testing.T) {
	tests := []struct {
		name string
		csv  string
		args []string
		code int
		want string
	}{
		{"four side by side", landingsWide, []string{"bars", "--value", "nets,lines,pots,traps", "--side"}, exitData, "--side: 4 series side by side"},
		{"percent needs stack", landingsLong, []string{"bars", "--series", "year", "--percent"}, exitUsage, "add --stack"},
		{"stack needs series", landingsLong, []string{"bars", "--stack"}, exitUsage, "--series COLUMN"},
		{"both layouts", landingsLong, []string{"bars", "--series", "year", "--stack", "--side"}, exitUsage, "give one"},
		{"series with two values", landingsWide, []string{"bars", "--series", "harbour", "--value", "nets,lines"}, exitUsage, "one value column"},
		{"missing series column", landingsLong, []string{"bars", "--label", "harbour", "--value", "catch_t", "--series", "yaer"}, exitData, "yaer"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, errs, code := runCSV(t, tc.csv, tc.args...)
			assert.Equal(t, tc.code, code, errs)
			assert.Contains(t, errs, tc.want)
		})
	}
}

// Several series of extreme values give a figure without NaN or Inf
// anywhere, or exit 1 with a message.
func TestSeriesExtremeValues(t *testing.T) {
	tables := []string{
		"label,a,b\nNorth,1.7e308,1.7e308\nSouth,1.7e308,1\nEast,8.5e307,3\n",
		"label,a,b\nNorth,1.7976931348623157e308,1\nSouth,-1.7976931348623157e308,2\nEast,1,3\n",
		"label,a,b\nNorth,1e-300,1e300\nSouth,1e300,1\nEast,1,1e-300\n",
		"label,a,b\nNorth,5e-324,1e-323\nSouth,0,0\nEast,0,5e-324\n",
	}
	for i, data := range tables {
		for _, v := range [][]string{{"dots"}, {"bars"}, {"bars", "--stack"}, {"bars", "--stack", "--percent"}, {"bars", "--side"}} {
			t.Run(fmt.Sprint(i, v), func(t *testing.T) {
				out, errs, code := runCSV(t, data, append(v, "--value", "a,b", "--quiet")...)
				switch code {
				case exitOK:
					checkFigure(t, []byte(out))
					assert.False(t, notFinite.MatchString(out), "a number that is not finite in the figure")
				case exitData:
					assert.NotEmpty(t, errs)
					assert.False(t, notFinite.MatchString(errs), errs)
				default:
					t.Fatalf("exit %d: %s", code, errs)
				}
			})
		}
	}
}

// FuzzSeriesCharts draws random tables as several values per category,
// long and wide, in every layout: a figure without NaN or Inf, or exit 1
// with a message; never a panic or a usage error.
func FuzzSeriesCharts(f *testing.F) {
	for _, seed := range []string{landingsLong, landingsWide, "a,b,c\nx,1,\ny,,2\n", "a,b,c\n\"<i>\",1e308,-1e308\nq,0,0\n", "a,b,c\nx,y,1\nx,y,2\n"} {
		for v := range uint8(6) {
			f.Add(seed, v)
		}
	}
	variants := [][]string{
		{"dots", "--series", "b"},
		{"bars", "--series", "b", "--stack"},
		{"bars", "--series", "b", "--stack", "--percent", "--for", "print"},
		{"bars", "--value", "b,c", "--side", "--for", "slide"},
		{"dots", "--value", "b,c", "--top", "2"},
		{"bars", "--value", "b,c", "--stack", "--top", "2", "--order", "label"},
	}
	f.Fuzz(func(t *testing.T, data string, variant uint8) {
		args := append(variants[int(variant)%len(variants)], "--quiet")
		out, errs, code := runCSV(t, data, args...)
		switch code {
		case exitOK:
			if !notFinite.MatchString(data) {
				checkNoNaN(t, []byte(out))
			}
		case exitData:
			if errs == "" {
				t.Fatalf("%v on %q: exit 1 without a message", args, data)
			}
		default:
			t.Fatalf("%v on %q: exit %d: %s", args, data, code, errs)
		}
	})
}
