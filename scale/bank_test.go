package scale

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

// bankSine samples y = sin x at n equal segments over [0, 2π].
func bankSine(n int) Polyline {
	p := Polyline{X: make([]float64, n+1), Y: make([]float64, n+1)}
	for k := range n + 1 {
		x := 2 * math.Pi * float64(k) / float64(n)
		p.X[k], p.Y[k] = x, math.Sin(x)
	}
	return p
}

func bankPts(xy ...float64) Polyline {
	var p Polyline
	for i := 0; i+1 < len(xy); i += 2 {
		p.X = append(p.X, xy[i])
		p.Y = append(p.Y, xy[i+1])
	}
	return p
}

// bankExtent returns max-min of v, ignoring NaN.
func bankExtent(v []float64) float64 {
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, x := range v {
		if !math.IsNaN(x) {
			lo, hi = min(lo, x), max(hi, x)
		}
	}
	return hi - lo
}

func TestBankingPublishedExamples(t *testing.T) {
	// Every row of methods.md §3.4 (worked examples, derived there and solved
	// with python3 bisection [D]; rows for the two-segment case and the sine
	// follow from Cleveland, McGill & McGill 1988 and Cleveland 1993).
	cases := []struct {
		name         string
		line         Polyline
		ms, ao, awo  float64
		tol          float64 // relative
		rxOverride   float64
		ryOverride   float64
		useOverrides bool
	}{
		// methods.md §3.4 row 1: any straight line banks to 1 under every method.
		{name: "straight line", line: bankPts(0, 7, 2, 13, 5, 22, 10, 37), ms: 1, ao: 1, awo: 1, tol: 1e-9},
		// methods.md §3.4 row 2: symmetric zigzag, every |v/u| = 4, alpha = 1/4.
		{name: "zigzag", line: bankPts(0, 0, 1, 1, 2, 0, 3, 1, 4, 0), ms: 0.25, ao: 0.25, awo: 0.25, tol: 1e-9},
		// methods.md §3.4 row 3: (0,0),(1,1),(2,4); AO = 2/√3 = 1.1547005, AWO = 1.002661.
		{name: "two segments", line: bankPts(0, 0, 1, 1, 2, 4), ms: 1, ao: 2 / math.Sqrt(3), awo: 1.002661, tol: 1e-6},
		// methods.md §3.4 row 5: sin, N = 100: MS 0.450232, AO 0.576922, AWO 0.504103.
		{name: "sine N=100", line: bankSine(100), ms: 0.450232, ao: 0.576922, awo: 0.504103, tol: 2e-6,
			rxOverride: 2 * math.Pi, ryOverride: 2, useOverrides: true},
		// methods.md §3.4 row 6: sin, N = 1000: MS 0.450161, AO 0.577088, AWO 0.504135.
		{name: "sine N=1000", line: bankSine(1000), ms: 0.450161, ao: 0.577088, awo: 0.504135, tol: 2e-6,
			rxOverride: 2 * math.Pi, ryOverride: 2, useOverrides: true},
	}
	methods := []struct {
		name string
		f    func([]Polyline, float64, float64) (float64, bool)
		want func(c int) float64
	}{
		{"MS", BankMedianSlope, func(c int) float64 { return cases[c].ms }},
		{"AO", BankOrientation, func(c int) float64 { return cases[c].ao }},
		{"AWO", BankWeightedOrientation, func(c int) float64 { return cases[c].awo }},
	}
	for ci, c := range cases {
		rx, ry := bankExtent(c.line.X), bankExtent(c.line.Y)
		if c.useOverrides {
			// The sine's domain is exactly [0, 2π] x [-1, 1].
			rx, ry = c.rxOverride, c.ryOverride
		}
		for _, m := range methods {
			got, ok := m.f([]Polyline{c.line}, rx, ry)
			want := m.want(ci)
			if !ok || math.Abs(got-want) > c.tol*want {
				t.Errorf("%s %s = %.9f, %v; want %.9f (rel tol %g)", m.name, c.name, got, ok, want, c.tol)
			}
		}
	}
}

func TestBankSineContinuousLimit(t *testing.T) {
	// methods.md §3.4 row 4, continuous limit: MS √2/π = 0.4501582,
	// AO 0.577090, AWO 0.504135; N = 1000 must be within 1%.
	line := []Polyline{bankSine(1000)}
	for _, c := range []struct {
		name string
		f    func([]Polyline, float64, float64) (float64, bool)
		want float64
	}{
		{"MS", BankMedianSlope, math.Sqrt2 / math.Pi},
		{"AO", BankOrientation, 0.577090},
		{"AWO", BankWeightedOrientation, 0.504135},
	} {
		got, ok := c.f(line, 2*math.Pi, 2)
		if !ok || math.Abs(got-c.want) > 0.01*c.want {
			t.Errorf("%s = %g, %v; want %g within 1%%", c.name, got, ok, c.want)
		}
	}
}

func TestBankEdgeCases(t *testing.T) {
	nan := math.NaN()
	type result struct {
		alpha float64
		ok    bool
	}
	cases := []struct {
		name        string
		lines       []Polyline
		rx, ry      float64
		ms, ao, awo result
	}{
		// methods.md §3.3: Ry = 0 (constant series): banking undefined.
		{name: "constant series", lines: []Polyline{bankPts(0, 3, 1, 3, 2, 3)}, rx: 2, ry: 0},
		// A constant series on a padded domain: every segment flat, no root.
		{name: "flat segments only", lines: []Polyline{bankPts(0, 3, 1, 3, 2, 3)}, rx: 2, ry: 1},
		{name: "no lines", rx: 1, ry: 1},
		{name: "single point", lines: []Polyline{bankPts(1, 1)}, rx: 1, ry: 1},
		{name: "duplicate points only", lines: []Polyline{bankPts(1, 1, 1, 1)}, rx: 1, ry: 1},
		{name: "bad extent", lines: []Polyline{bankPts(0, 0, 1, 1)}, rx: math.Inf(1), ry: 1},
		{name: "negative extent", lines: []Polyline{bankPts(0, 0, 1, 1)}, rx: -1, ry: 1},
		// methods.md §3.3: vertical segments excluded from MS, 90° in AO/AWO.
		// Segments: rise 1 over 1 (slope 1), vertical 1, rise 1 over 1.
		// AO: 2·atan(a) + π/2 = 3π/4 → a = tan(π/8) = √2−1.
		// AWO: weights √(1+a²) twice and a: 2·atan(a)·√(1+a²) + (π/2)·a = (π/4)(2√(1+a²)+a), derived here.
		{name: "vertical segment", lines: []Polyline{bankPts(0, 0, 1, 1, 1, 2, 2, 3)}, rx: 2, ry: 3,
			// MS: median |v/u| = (1/3)/(1/2) = 2/3 → alpha = 3/2.
			// AO: 2·atan(2a/3) + π/2 = 3π/4 → a = (3/2)·tan(π/8) = 1.5(√2−1).
			// AWO: checked against its defining equation below.
			ms: result{1.5, true}, ao: result{1.5 * (math.Sqrt2 - 1), true}, awo: result{0, true}},
		// methods.md §3.3: half the segments flat: the MS median would be 0 (alpha ∞);
		// culling zero slopes leaves the rising ones.
		{name: "half flat", lines: []Polyline{bankPts(0, 0, 1, 1, 2, 1, 3, 2, 4, 2)}, rx: 4, ry: 2,
			ms: result{0.5, true}, ao: result{0, false}, awo: result{0, true}},
		// Only vertical segments: no alpha tilts them.
		{name: "vertical only", lines: []Polyline{bankPts(1, 0, 1, 1, 1, 3)}, rx: 1, ry: 3},
		// NaN breaks the line: the segments touching it are not drawn, so the
		// zigzag around the gap still banks to 1/4 (methods.md §3.4 row 2).
		{name: "gap", lines: []Polyline{bankPts(0, 0, 1, 1, 2, 0, 2.5, nan, 3, 1, 4, 0)}, rx: 4, ry: 1,
			ms: result{0.25, true}, ao: result{0.25, true}, awo: result{0.25, true}},
	}
	for _, c := range cases {
		check := func(method string, got float64, ok bool, want result) {
			t.Helper()
			if ok != want.ok || (want.ok && want.alpha != 0 && math.Abs(got-want.alpha) > 1e-9*want.alpha) {
				t.Errorf("%s %s = %.12g, %v; want %.12g, %v", method, c.name, got, ok, want.alpha, want.ok)
			}
			if !ok && got != 0 {
				t.Errorf("%s %s: alpha %g with ok=false; want 0", method, c.name, got)
			}
		}
		a, ok := BankMedianSlope(c.lines, c.rx, c.ry)
		check("MS", a, ok, c.ms)
		a, ok = BankOrientation(c.lines, c.rx, c.ry)
		check("AO", a, ok, c.ao)
		a, ok = BankWeightedOrientation(c.lines, c.rx, c.ry)
		check("AWO", a, ok, c.awo)
		if ok {
			// Every AWO result must satisfy the defining equation (methods.md
			// §3.3: Σ θ_i ℓ_i / Σ ℓ_i = π/4), evaluated here independently.
			if m := weightedOrientation(c.lines, c.rx, c.ry, a); math.Abs(m-math.Pi/4) > 1e-9 {
				t.Errorf("AWO %s: weighted mean orientation %g at alpha %g, want π/4", c.name, m, a)
			}
		}
	}
}

// weightedOrientation recomputes the AWO objective from the raw points, in
// degrees-free radians, without the package's helpers.
func weightedOrientation(lines []Polyline, rx, ry, alpha float64) float64 {
	var num, den float64
	for _, l := range lines {
		for i := 1; i < len(l.X); i++ {
			dx := math.Abs(l.X[i]-l.X[i-1]) / rx
			dy := alpha * math.Abs(l.Y[i]-l.Y[i-1]) / ry
			if math.IsNaN(dx) || math.IsNaN(dy) || dx == 0 && dy == 0 {
				continue
			}
			theta := math.Pi / 2
			if dx > 0 {
				theta = math.Atan(dy / dx)
			}
			ell := math.Sqrt(dx*dx + dy*dy)
			num += theta * ell
			den += ell
		}
	}
	return num / den
}

func TestBankPoolsLines(t *testing.T) {
	// Pooling (methods.md §3.3): two lines are banked on all their segments,
	// so splitting a zigzag into two polylines changes nothing.
	whole, _ := BankWeightedOrientation([]Polyline{bankPts(0, 0, 1, 1, 2, 0, 3, 1, 4, 0)}, 4, 1)
	split, _ := BankWeightedOrientation([]Polyline{bankPts(0, 0, 1, 1, 2, 0), bankPts(2, 0, 3, 1, 4, 0)}, 4, 1)
	if math.Abs(whole-split) > 1e-12 {
		t.Errorf("pooled %g != whole %g", split, whole)
	}
}

func TestBankScaleInvariance(t *testing.T) {
	// alpha depends only on normalised deltas: scaling the data and its
	// domain together must not change it.
	r := rand.New(rand.NewPCG(1, 2))
	for trial := range 50 {
		n := 2 + r.IntN(200)
		p := Polyline{X: make([]float64, n), Y: make([]float64, n)}
		y := 0.0
		for i := range n {
			y += r.NormFloat64()
			p.X[i], p.Y[i] = float64(i), y
		}
		rx, ry := bankExtent(p.X), bankExtent(p.Y)
		sx, sy := math.Exp(r.NormFloat64()*5), math.Exp(r.NormFloat64()*5)
		q := Polyline{X: make([]float64, n), Y: make([]float64, n)}
		for i := range n {
			q.X[i], q.Y[i] = p.X[i]*sx, p.Y[i]*sy
		}
		for _, f := range []func([]Polyline, float64, float64) (float64, bool){BankMedianSlope, BankOrientation, BankWeightedOrientation} {
			a, ok1 := f([]Polyline{p}, rx, ry)
			b, ok2 := f([]Polyline{q}, rx*sx, ry*sy)
			if ok1 != ok2 || math.Abs(a-b) > 1e-8*a {
				t.Fatalf("trial %d: %g,%v vs scaled %g,%v", trial, a, ok1, b, ok2)
			}
		}
	}
}

func TestBankMedian(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	for n := 1; n < 200; n++ {
		xs := make([]float64, n)
		for i := range xs {
			xs[i] = float64(r.IntN(10)) // many ties
		}
		s := slices.Clone(xs)
		slices.Sort(s)
		want := s[n/2]
		if n%2 == 0 {
			want = (s[n/2-1] + s[n/2]) / 2
		}
		if got := bankMedian(xs); got != want {
			t.Fatalf("n=%d: median %g, want %g", n, got, want)
		}
	}
}

// benchWalk is a random walk of n segments from a fixed seed.
func benchWalk(n int) Polyline {
	r := rand.New(rand.NewPCG(5, 6))
	p := Polyline{X: make([]float64, n+1), Y: make([]float64, n+1)}
	y := 0.0
	for i := range n + 1 {
		y += r.NormFloat64()
		p.X[i], p.Y[i] = float64(i), y
	}
	return p
}

func BenchmarkBankMedianSlope(b *testing.B) {
	p := benchWalk(1_000_000)
	lines := []Polyline{p}
	rx, ry := bankExtent(p.X), bankExtent(p.Y)
	b.ReportAllocs()
	for b.Loop() {
		if _, ok := BankMedianSlope(lines, rx, ry); !ok {
			b.Fatal("not ok")
		}
	}
}

func BenchmarkBankWeightedOrientation(b *testing.B) {
	p := benchWalk(100_000)
	lines := []Polyline{p}
	rx, ry := bankExtent(p.X), bankExtent(p.Y)
	b.ReportAllocs()
	for b.Loop() {
		if _, ok := BankWeightedOrientation(lines, rx, ry); !ok {
			b.Fatal("not ok")
		}
	}
}

func FuzzBank(f *testing.F) {
	f.Add(int64(1), 10, 1.0, 1.0, uint8(0))
	f.Add(int64(2), 3, 1e-300, 1e300, uint8(3))
	f.Add(int64(3), 50, 0.0, 1.0, uint8(1))
	f.Fuzz(func(t *testing.T, seed int64, n int, rx, ry float64, flags uint8) {
		n = min(max(n, 0), 2000)
		r := rand.New(rand.NewPCG(uint64(seed), 9))
		p := Polyline{X: make([]float64, n), Y: make([]float64, n)}
		for i := range n {
			p.X[i] = float64(i)
			if flags&1 != 0 && r.IntN(3) == 0 {
				p.X[i] = float64(max(i-1, 0)) // vertical segments
			}
			p.Y[i] = math.Round(r.NormFloat64() * 3)
			if flags&2 != 0 && r.IntN(10) == 0 {
				p.Y[i] = math.NaN()
			}
		}
		lines := []Polyline{p}
		for _, fn := range []func([]Polyline, float64, float64) (float64, bool){BankMedianSlope, BankOrientation, BankWeightedOrientation} {
			a, ok := fn(lines, rx, ry)
			if ok != (a > 0 && !math.IsInf(a, 0)) || !ok && a != 0 {
				t.Fatalf("alpha %g, ok %v", a, ok)
			}
		}
		if a, ok := BankWeightedOrientation(lines, rx, ry); ok && a > 1e-100 && a < 1e100 {
			if m := weightedOrientation(lines, rx, ry, a); math.Abs(m-math.Pi/4) > 1e-6 {
				t.Fatalf("AWO alpha %g gives mean orientation %g", a, m)
			}
		}
	})
}
