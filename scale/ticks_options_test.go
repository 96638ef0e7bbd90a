package scale

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
)

func TestTickTarget(t *testing.T) {
	for _, tc := range []struct {
		length, text float64
		want         int
	}{
		{0, 13, 2},
		{math.NaN(), 13, 2},
		{100, 13, 2},   // 100/75 rounds to 1, +1
		{151, 13, 3},   // the floor: 3 labelled ticks beyond 150 px
		{300, 13, 5},   // one per 75 px at screen size (common practice)
		{600, 13, 9},   // 8 intervals
		{600, 26, 5},   // twice the text, half the ticks
		{1600, 28, 11}, // a slide axis
	} {
		assert.Equal(t, tc.want, TickTarget(tc.length, tc.text), "TickTarget(%g, %g)", tc.length, tc.text)
	}
	assert.Equal(t, 2, MinTicks(150))
	assert.Equal(t, 3, MinTicks(150.5))
}

func TestIsInteger(t *testing.T) {
	assert.True(t, IsInteger([]float64{2018, 2019, math.NaN(), -3}))
	assert.False(t, IsInteger([]float64{2018, 2018.5}))
	assert.False(t, IsInteger(nil))
	assert.False(t, IsInteger([]float64{math.Inf(1)}))
}

func TestNiceTicksCases(t *testing.T) {
	for _, tc := range []struct {
		lo, hi float64
		m      int
		o      TickOptions
		want   []float64
	}{
		// Years: whole-number steps only, never 2018.5.
		{2018, 2021, 8, TickOptions{Integer: true}, []float64{2018, 2019, 2020, 2021}},
		// Counts of 0 and 1 on a long axis: at least three ticks, all whole.
		{0, 1, 2, TickOptions{Integer: true, Min: 3}, []float64{0, 1, 2}},
		// A range across zero labels zero.
		{-500, 2000, 3, TickOptions{Zero: true, Min: 3}, []float64{-1000, 0, 1000, 2000}},
		// Too narrow for more than one whole step: the nearest whole numbers.
		{0.1, 0.4, 4, TickOptions{Integer: true}, []float64{0, 1}},
	} {
		got := NiceTicks(tc.lo, tc.hi, tc.m, tc.o)
		assert.InDeltaSlice(t, tc.want, got.Values, 1e-9, "NiceTicks(%g, %g, %d, %+v) = %v", tc.lo, tc.hi, tc.m, tc.o, got.Values)
	}
}

// TestNiceTicksProperties checks the promises of TickOptions on random
// ranges and axis lengths: the floor for the axis length, zero when inside,
// whole numbers for whole-number data, and the loose cover.
func TestNiceTicksProperties(t *testing.T) {
	r := rand.New(rand.NewPCG(7, 8))
	for range 3000 {
		var lo, hi float64
		integer := r.IntN(2) == 0
		if integer {
			lo = float64(r.IntN(4000) - 2000)
			hi = lo + float64(r.IntN(5000))
		} else {
			lo, hi = randomRange(r)
		}
		length := 20 + r.Float64()*1500
		text := 9 + r.Float64()*20
		o := TickOptions{Min: MinTicks(length), Integer: integer, Zero: true}
		tk := NiceTicks(lo, hi, TickTarget(length, text), o)
		msg := fmt.Sprintf("NiceTicks(%g, %g) on %g px: %v", lo, hi, length, tk.Values)
		if !assert.GreaterOrEqual(t, len(tk.Values), MinTicks(length), msg) {
			continue
		}
		a, b := min(lo, hi), max(lo, hi)
		assert.LessOrEqual(t, tk.Values[0], a, msg)
		assert.GreaterOrEqual(t, tk.Values[len(tk.Values)-1], b, msg)
		if a < 0 && b > 0 {
			assert.Contains(t, tk.Values, 0.0, msg)
		}
		if integer && hi-lo >= 1 {
			for _, v := range tk.Values {
				assert.Equal(t, math.Trunc(v), v, msg)
			}
		}
	}
}

func TestIncludeZero(t *testing.T) {
	got := IncludeZero(Ticks{Values: []float64{-500, 1000, 2500}, Step: 1500})
	assert.Equal(t, []float64{-1500, 0, 1500, 3000}, got.Values)
	same := Ticks{Values: []float64{1, 2, 3}, Step: 1}
	assert.Equal(t, same, IncludeZero(same))
	got = IncludeZero(Ticks{Values: []float64{-0.3, 0.3}, Step: 0.6})
	assert.Equal(t, []float64{-0.6, 0, 0.6}, got.Values)
	assert.Equal(t, 1, got.Decimals)
}

func ExampleNiceTicks() {
	// An axis 400 px long with 13 px labels, for counts from 0 to 7.
	t := NiceTicks(0, 7, TickTarget(400, 13), TickOptions{Min: MinTicks(400), Integer: true, Zero: true})
	fmt.Println(t.Values)
	// Output: [0 1 2 3 4 5 6 7]
}

func BenchmarkNiceTicks(b *testing.B) {
	o := TickOptions{Min: 3, Integer: true, Zero: true}
	for b.Loop() {
		NiceTicks(-517, 2043, 9, o)
	}
}

func FuzzNiceTicks(f *testing.F) {
	f.Add(-500.0, 2000.0, 3, 3, true, true)
	f.Add(0.0, 1.0, 2, 3, true, false)
	f.Add(1e-300, 1e300, 5, 3, false, true)
	f.Fuzz(func(t *testing.T, lo, hi float64, m, floor int, integer, zero bool) {
		if !isFinite(lo) || !isFinite(hi) {
			return
		}
		floor = min(max(floor, 0), 12)
		tk := NiceTicks(lo, hi, m%50, TickOptions{Min: floor, Integer: integer, Zero: zero})
		if len(tk.Values) < max(floor, 2) {
			t.Fatalf("NiceTicks(%g, %g, %d, min %d) = %v: fewer than the floor", lo, hi, m, floor, tk.Values)
		}
		a, b := min(lo, hi), max(lo, hi)
		if tk.Values[0] > a || tk.Values[len(tk.Values)-1] < b {
			t.Fatalf("NiceTicks(%g, %g) = %v does not cover", lo, hi, tk.Values)
		}
		if zero && a < 0 && b > 0 {
			if !hasZero(tk.Values) {
				t.Fatalf("NiceTicks(%g, %g) = %v: no zero", lo, hi, tk.Values)
			}
		}
	})
}
