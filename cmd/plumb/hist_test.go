package main

import (
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// delayTable invents n delays: whole minutes, or tenths when decimals.
func delayTable(seed uint64, n int, decimals bool) string {
	rng := rand.New(rand.NewPCG(seed, 3))
	var b strings.Builder
	b.WriteString("sailing,delay\n")
	for i := range n {
		v := rng.ExpFloat64() * 6
		if rng.Float64() < 0.2 {
			v = 0
		}
		if decimals {
			fmt.Fprintf(&b, "%d,%.1f\n", i, v)
		} else {
			fmt.Fprintf(&b, "%d,%d\n", i, int(math.Round(v)))
		}
	}
	return b.String()
}

// TestHistCountsAndAreas checks every histogram drawn from random tables:
// counts sum to n, bars stand on one baseline with heights proportional to
// their counts (or densities), bins are equally wide and adjacent bars
// share their edges, so that area is proportional to count.
func TestHistCountsAndAreas(t *testing.T) {
	for seed := range uint64(8) {
		n := 50 + int(seed)*150
		data := delayTable(seed, n, seed%2 == 1)
		for _, args := range [][]string{nil, {"--bins", "12"}, {"--width", "2"}, {"--density"}} {
			code, out, errs := plumb(t, data, append([]string{"hist", "-", "--value", "delay"}, args...)...)
			require.Equal(t, 0, code, errs)
			root := checkFigure(t, []byte(out))
			bars := root.all("rect", "plumb-bin")
			require.NotEmpty(t, bars)
			density := len(args) > 0 && args[0] == "--density"
			sum, area := 0.0, 0.0
			ratio := 0.0
			base := bars[0].num(t, "y") + bars[0].num(t, "height")
			binW := bars[0].num(t, "data-high") - bars[0].num(t, "data-low")
			for i, b := range bars {
				v := b.num(t, "data-value")
				count := v
				if density {
					count = b.num(t, "data-count")
					area += v * binW
				}
				sum += count
				assert.InDelta(t, base, b.num(t, "y")+b.num(t, "height"), 0.011, "bars stand on one baseline")
				r := b.num(t, "height") / v
				if i == 0 {
					ratio = r
				}
				assert.InDelta(t, ratio, r, 0.02*ratio+0.01, "height proportional to value (bar %d)", i)
				assert.InDelta(t, binW, b.num(t, "data-high")-b.num(t, "data-low"), 1e-9*binW, "equal bins")
				if i > 0 && bars[i-1].num(t, "data-high") == b.num(t, "data-low") {
					prev := bars[i-1]
					gap := b.num(t, "x") - (prev.num(t, "x") + prev.num(t, "width"))
					assert.InDelta(t, 1, gap, 1.02, "adjacent bars share an edge, a hairline apart at most")
				}
			}
			assert.Equal(t, float64(n), sum, "counts sum to n (%v)", args)
			if density {
				assert.InDelta(t, 1, area, 1e-9)
			}
		}
	}
}

func TestHistNoteSaysRule(t *testing.T) {
	code, _, errs := plumb(t, "v\n2\n4\n4\n5\n6\n7\n8\n9\n11\n30\n", "hist", "-", "--explain")
	require.Equal(t, 0, code, errs)
	// methods.md §8: FD width 4.177430 for these ten values (Freedman &
	// Diaconis 1981, type 7 IQR); rounded to the nice 5.
	assert.Contains(t, errs, "bins of 5: the Freedman–Diaconis width 2·IQR·n^(−1/3) = 4.18 rounded")
	code, _, errs = plumb(t, "v\n3\n3\n3\n3\n3\n3\n3\n1\n9\n", "hist", "-", "--explain")
	require.Equal(t, 0, code, errs)
	assert.Contains(t, errs, "the IQR is 0, so Sturges' rule")
}

func TestHistErrors(t *testing.T) {
	for _, tc := range []struct {
		args []string
		code int
		msg  string
	}{
		{[]string{"--bins", "4", "--width", "2"}, 2, "not both"},
		{[]string{"--width", "0"}, 2, `--width "0": give a positive number`},
		{[]string{"--bins", "-3"}, 2, "--bins -3"},
		{[]string{"--width", "0.0000001"}, 1, "bars narrower than 2 px"},
	} {
		code, _, errs := plumb(t, "v\n1\n2\n30\n", append([]string{"hist", "-"}, tc.args...)...)
		assert.Equal(t, tc.code, code, "%v: %s", tc.args, errs)
		assert.Contains(t, errs, tc.msg, tc.args)
	}
	code, _, errs := plumb(t, "v\n1\nNA\n", "hist", "-")
	assert.Equal(t, 0, code, errs)
	assert.Contains(t, errs, "skipped 1 row with no value")
}
