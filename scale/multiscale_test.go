package scale

import (
	"math"
	"math/rand/v2"
	"testing"
)

func TestDominantCycles(t *testing.T) {
	const n = 2000
	xs := make([]float64, n)
	for i := range xs {
		xs[i] = float64(i)
	}
	rng := rand.New(rand.NewPCG(1, 2))
	cases := []struct {
		name string
		f    func(i int) float64
		want int
	}{
		{"five slow cycles", func(i int) float64 { return math.Sin(2 * math.Pi * 5 * float64(i) / (n - 1)) }, 5},
		{"slow cycles under fast noise", func(i int) float64 {
			return 10*math.Sin(2*math.Pi*3*float64(i)/(n-1)) + rng.NormFloat64()
		}, 3},
		// methods.md §4: a slow ramp plus a fast sinusoid; the ramp is the
		// straight-line trend, removed first, so the sinusoid is dominant.
		{"ramp plus sinusoid", func(i int) float64 { return float64(i)/10 + math.Sin(2*math.Pi*40*float64(i)/(n-1)) }, 40},
	}
	for _, c := range cases {
		ys := make([]float64, n)
		for i := range ys {
			ys[i] = c.f(i)
		}
		got, ok := DominantCycles(xs, ys)
		if !ok || got != c.want {
			t.Errorf("%s: got %d (ok %v), want %d", c.name, got, ok, c.want)
		}
	}
	if _, ok := DominantCycles(xs[:10], make([]float64, 10)); ok {
		t.Errorf("ten points: want ok false")
	}
	line := make([]float64, n)
	for i := range line {
		line[i] = 3 + 2*float64(i)
	}
	if _, ok := DominantCycles(xs, line); ok {
		t.Errorf("a straight line has no cycles: want ok false")
	}
}

// TestLowPassTrendBanks checks the point of multi-scale banking: a slow
// sinusoid under heavy fast noise banks as a strip at its finest scale,
// and its low-pass trend banks near the clean sinusoid's alpha
// (methods.md §3.4: sin over one period banks at 0.4502 by MS; over three
// periods at a third of that).
func TestLowPassTrendBanks(t *testing.T) {
	const n = 3000
	rng := rand.New(rand.NewPCG(5, 6))
	xs, ys := make([]float64, n), make([]float64, n)
	for i := range xs {
		xs[i] = float64(i)
		ys[i] = math.Sin(2*math.Pi*3*float64(i)/(n-1)) + 0.3*rng.NormFloat64()
		if i%50 == 7 {
			ys[i] = math.NaN()
		}
	}
	ry := 4.0
	raw, _ := BankMedianSlope([]Polyline{{X: xs, Y: ys}}, n-1, ry)
	k, ok := DominantCycles(xs, ys)
	if !ok || k != 3 {
		t.Fatalf("dominant cycles %d (ok %v), want 3", k, ok)
	}
	trend, ok := LowPassTrend(xs, ys, k)
	if !ok {
		t.Fatal("no trend")
	}
	got, _ := BankMedianSlope([]Polyline{trend}, n-1, ry)
	// One period over rx with ry = 2 (sin's range) banks at 0.4502; three
	// periods make every normalised slope 3 times steeper, ry = 4 half as steep.
	want := 0.4502 * ry / 2 / 3
	if math.Abs(got-want)/want > 0.2 {
		t.Errorf("trend banks at %.4f, want about %.4f (raw noise: %.4f)", got, want, raw)
	}
	if raw > got/5 {
		t.Errorf("raw series banks at %.4f: the test needs noise that flattens it", raw)
	}
}

func BenchmarkLowPassTrend(b *testing.B) {
	const n = 1_000_000
	xs, ys := make([]float64, n), make([]float64, n)
	for i := range xs {
		xs[i], ys[i] = float64(i), math.Sin(float64(i)/3e4)+float64(i%7)
	}
	for b.Loop() {
		k, _ := DominantCycles(xs, ys)
		LowPassTrend(xs, ys, 2*k)
	}
}

// FuzzLowPassTrend: any series analyses without panicking, and a trend,
// when there is one, is finite and spans the data's x range.
func FuzzLowPassTrend(f *testing.F) {
	f.Add([]byte{1, 5, 2, 8, 3, 9, 4, 7, 1, 5, 2, 8, 3, 9, 4, 7, 0, 255, 3}, 1.5)
	f.Fuzz(func(t *testing.T, data []byte, step float64) {
		if !(step > 0) || math.IsInf(step, 0) || step > 1e12 {
			return
		}
		xs, ys := make([]float64, len(data)), make([]float64, len(data))
		for i, b := range data {
			xs[i], ys[i] = float64(i)*step, float64(b)
			if b == 255 {
				ys[i] = math.NaN()
			}
		}
		k, ok := DominantCycles(xs, ys)
		if !ok {
			return
		}
		p, ok := LowPassTrend(xs, ys, k)
		if !ok {
			t.Fatal("DominantCycles found a cycle but LowPassTrend no trend")
		}
		for i := range p.X {
			if math.IsNaN(p.Y[i]) || math.IsInf(p.Y[i], 0) {
				t.Fatalf("trend value %d is %v", i, p.Y[i])
			}
		}
	})
}
