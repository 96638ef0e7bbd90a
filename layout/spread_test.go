package layout

import (
	"cmp"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

func TestSpread(t *testing.T) {
	inf := math.Inf(1)
	for _, tc := range []struct {
		name        string
		want        []float64
		gap, lo, hi float64
		got         []float64
		ok          bool
	}{
		// Three labels at one spot fan out around it, each block at the
		// mean of its wants: 10−4, 10, 10+4.
		{"three at one spot", []float64{10, 10, 10}, 4, -inf, inf, []float64{6, 10, 14}, true},
		{"three at one spot, bounded", []float64{10, 10, 10}, 4, 0, 100, []float64{6, 10, 14}, true},
		{"already apart", []float64{0, 10, 20}, 4, 0, 20, []float64{0, 10, 20}, true},
		{"exactly gap apart", []float64{0, 4, 8}, 4, 0, 8, []float64{0, 4, 8}, true},
		// The pair would centre on 0 at −2 and 2; the bound pins the first
		// at 0 and the gap pushes the second to 4 (cost 16, the least).
		{"clamped at lo", []float64{0, 0}, 4, 0, 100, []float64{0, 4}, true},
		{"clamped at hi", []float64{100, 100}, 4, 0, 100, []float64{96, 100}, true},
		{"outside the bounds", []float64{-5, 120}, 1, 0, 100, []float64{0, 100}, true},
		// Sorted: 2, 10, 14; 10 and 14 pool into a block centred on their
		// mean 12 (9.5 and 14.5); 2 is clear. Returned in the caller's order.
		{"caller order", []float64{14, 2, 10}, 5, -inf, inf, []float64{14.5, 2, 9.5}, true},
		{"ties keep caller order", []float64{5, 5}, 2, -inf, inf, []float64{4, 6}, true},
		// Pools chain: 0,1 pool to −1.5,1.5 (gap 3), which then crowds 2.
		{"chained pools", []float64{0, 1, 2}, 3, -inf, inf, []float64{-2, 1, 4}, true},
		{"fills the range exactly", []float64{3, 3, 3}, 5, 0, 10, []float64{0, 5, 10}, true},
		{"does not fit", []float64{0, 0, 0}, 10, 0, 15, []float64{-10, 0, 10}, false},
		{"single label", []float64{7}, 4, 0, 10, []float64{7}, true},
		{"single label clamped", []float64{-3}, 4, 0, 10, []float64{0}, true},
		{"zero gap", []float64{3, 1, 2}, 0, 0, 10, []float64{3, 1, 2}, true},
		{"negative gap counts as zero", []float64{3, 1}, -4, 0, 10, []float64{3, 1}, true},
		{"empty", []float64{}, 4, 0, 10, []float64{}, true},
		{"nil", nil, 4, 0, 10, []float64{}, true},
		{"lo above hi", []float64{1, 2}, 1, 10, 0, []float64{1, 2}, false},
		{"NaN want", []float64{1, math.NaN()}, 1, 0, 10, []float64{1, math.NaN()}, false},
		{"infinite want", []float64{1, inf}, 1, 0, 10, []float64{1, inf}, false},
		{"NaN gap", []float64{1, 2}, math.NaN(), 0, 10, []float64{1, 2}, false},
		{"NaN bound", []float64{1, 2}, 1, math.NaN(), 10, []float64{1, 2}, false},
	} {
		got, ok := Spread(tc.want, tc.gap, tc.lo, tc.hi)
		if ok != tc.ok || !slices.EqualFunc(got, tc.got, sameFloat) {
			t.Errorf("%s: Spread(%v, %g, %g, %g) = %v, %v; want %v, %v",
				tc.name, tc.want, tc.gap, tc.lo, tc.hi, got, ok, tc.got, tc.ok)
		}
	}
}

func sameFloat(a, b float64) bool {
	return a == b || math.Abs(a-b) < 1e-9 || (math.IsNaN(a) && math.IsNaN(b))
}

func TestSpreadDoesNotModifyInput(t *testing.T) {
	want := []float64{10, 10, 10}
	Spread(want, 4, 0, 100)
	if !slices.Equal(want, []float64{10, 10, 10}) {
		t.Errorf("Spread changed its input to %v", want)
	}
}

// spreadCost is the total squared displacement Spread minimises.
func spreadCost(want, got []float64) float64 {
	var c float64
	for i := range want {
		d := got[i] - want[i]
		c += d * d
	}
	return c
}

// sortedByWant returns the indices of want in the order Spread keeps.
func sortedByWant(want []float64) []int {
	order := make([]int, len(want))
	for i := range order {
		order[i] = i
	}
	slices.SortStableFunc(order, func(a, b int) int { return cmp.Compare(want[a], want[b]) })
	return order
}

// kktViolation returns "" when got is a first-order optimum of the placement
// problem, which for this convex problem makes it the global optimum, and
// otherwise a move that lowers the cost. The
// directions a feasible solution can move in are generated, block by block
// (a block being a run of labels exactly gap apart), by shifting the whole
// block up or down and by shifting any tail of the block up or any head of
// it down, each unless a bound blocks it. The cost may not decrease along
// any of them: the directional derivative of the cost, 2·Σ(x−w) over the
// moved labels, times the direction's sign, must be non-negative.
func kktViolation(want, got []float64, gap, lo, hi float64) string {
	const tol = 1e-7
	order := sortedByWant(want)
	n := len(order)
	if n == 0 {
		return ""
	}
	x := make([]float64, n)
	g := make([]float64, n) // gradient of the cost
	for k, i := range order {
		x[k], g[k] = got[i], 2*(got[i]-want[i])
	}
	scale := 1 + slices.MaxFunc(x, func(a, b float64) int { return cmp.Compare(math.Abs(a), math.Abs(b)) })
	touching := func(k int) bool { return x[k+1]-x[k] <= gap+1e-9*math.Abs(scale) }
	atLo := func(k int) bool { return x[k] <= lo+1e-9*math.Abs(scale) }
	atHi := func(k int) bool { return x[k] >= hi-1e-9*math.Abs(scale) }
	sum := func(a, b int) (s float64) {
		for k := a; k <= b; k++ {
			s += g[k]
		}
		return s
	}
	for s := 0; s < n; {
		e := s
		for e+1 < n && touching(e) {
			e++
		}
		for m := s; m <= e; m++ {
			// Tail m..e up (m == s: the whole block up).
			if !atHi(e) && sum(m, e) < -tol {
				return fmt.Sprintf("moving labels %d..%d up lowers the cost", m, e)
			}
			// Head s..m down (m == e: the whole block down).
			if !atLo(s) && -sum(s, m) < -tol {
				return fmt.Sprintf("moving labels %d..%d down lowers the cost", s, m)
			}
		}
		s = e + 1
	}
	return ""
}

// bruteSpread solves the placement problem without pooling: it tries every
// set of active constraints (which neighbours touch, whether the first label
// sits on lo and the last on hi), solves each equality-constrained least
// squares problem in closed form, and keeps the cheapest feasible solution.
// The optimum of a convex quadratic programme is the solution for its own
// active set, so this finds it. Exponential; for small n only.
func bruteSpread(want []float64, gap, lo, hi float64) (best []float64) {
	order := sortedByWant(want)
	n := len(order)
	w := make([]float64, n)
	for k, i := range order {
		w[k] = want[i]
	}
	bestCost := math.Inf(1)
	for mask := 0; mask < 1<<(n+1); mask++ {
		pinLo, pinHi := mask&1 != 0, mask&2 != 0
		x := make([]float64, n)
		feasible := true
		for s := 0; s < n && feasible; {
			e := s
			for e+1 < n && mask&(4<<e) != 0 {
				e++
			}
			// Block s..e at offsets (k−s)·gap from its first label p.
			var p float64
			for k := s; k <= e; k++ {
				p += w[k] - float64(k-s)*gap
			}
			p /= float64(e - s + 1)
			switch {
			case s == 0 && pinLo && e == n-1 && pinHi:
				if math.Abs(lo+float64(e-s)*gap-hi) > 1e-9 {
					feasible = false
				}
				p = lo
			case s == 0 && pinLo:
				p = lo
			case e == n-1 && pinHi:
				p = hi - float64(e-s)*gap
			}
			for k := s; k <= e; k++ {
				x[k] = p + float64(k-s)*gap
			}
			s = e + 1
		}
		for k := range x {
			feasible = feasible && x[k] >= lo-1e-9 && x[k] <= hi+1e-9 &&
				(k == 0 || x[k]-x[k-1] >= gap-1e-9)
		}
		if !feasible {
			continue
		}
		got := make([]float64, n)
		for k, i := range order {
			got[i] = x[k]
		}
		if c := spreadCost(want, got); c < bestCost {
			best, bestCost = got, c
		}
	}
	return best
}

func TestSpreadProperties(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	for trial := range 3000 {
		n := 1 + rng.IntN(7)
		if trial%10 == 0 {
			n = 1 + rng.IntN(200)
		}
		want := make([]float64, n)
		for i := range want {
			want[i] = math.Round(rng.Float64()*100*4) / 4 // quarter steps make ties common
		}
		gap := rng.Float64() * 20
		lo := -10 + rng.Float64()*30
		hi := lo + rng.Float64()*120
		got, ok := Spread(want, gap, lo, hi)
		fits := float64(n-1)*gap <= hi-lo
		if ok != fits {
			t.Fatalf("Spread(%v, %g, %g, %g) ok = %v, but fitting is %v", want, gap, lo, hi, ok, fits)
		}
		if !ok {
			lo, hi = math.Inf(-1), math.Inf(1) // the fallback ignores the bounds
		}
		order := sortedByWant(want)
		for k := 1; k < n; k++ {
			if d := got[order[k]] - got[order[k-1]]; d < gap-1e-9 {
				t.Fatalf("Spread(%v, %g): labels %d and %d are %g apart (order or gap broken)",
					want, gap, order[k-1], order[k], d)
			}
		}
		for _, x := range got {
			if x < lo-1e-9 || x > hi+1e-9 {
				t.Fatalf("Spread(%v, %g, %g, %g) = %v leaves the bounds", want, gap, lo, hi, got)
			}
		}
		if v := kktViolation(want, got, gap, lo, hi); v != "" {
			t.Fatalf("Spread(%v, %g, %g, %g) = %v is not optimal: %s", want, gap, lo, hi, got, v)
		}
		if n <= 7 {
			best := bruteSpread(want, gap, lo, hi)
			if c, bc := spreadCost(want, got), spreadCost(want, best); c > bc+1e-9*(1+bc) {
				t.Fatalf("Spread(%v, %g, %g, %g) = %v costs %g; brute force %v costs %g",
					want, gap, lo, hi, got, c, best, bc)
			}
		}
	}
}

// TestSpreadKKTRejectsSuboptimal makes sure the optimality check can fail:
// spreading symmetric labels off-centre is feasible but not optimal.
func TestSpreadKKTRejectsSuboptimal(t *testing.T) {
	want := []float64{10, 10, 10}
	worse := []float64{7, 11, 15} // feasible, shifted by 1 from the optimum
	if kktViolation(want, worse, 4, 0, 100) == "" {
		t.Error("checkKKT accepted a placement one unit off the optimum")
	}
	if c := spreadCost(want, bruteSpread(want, 4, 0, 100)); c != 32 {
		t.Errorf("brute force cost = %g, want 32 (4² + 0 + 4²)", c)
	}
}

func BenchmarkSpread1000(b *testing.B) {
	rng := rand.New(rand.NewPCG(5, 6))
	want := make([]float64, 1000)
	for i := range want {
		want[i] = rng.Float64() * 4000
	}
	b.ReportAllocs()
	for b.Loop() {
		Spread(want, 12, 0, 20000)
	}
}
