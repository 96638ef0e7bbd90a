package scale

import (
	"bufio"
	"math"
	"math/rand/v2"
	"os"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// extendedRow is one row of testdata/ticks/extended.tsv.
type extendedRow struct {
	dmin, dmax     float64
	m              int
	ticks, loose   []float64
	q              float64
	j, k, z        int
	s, c, d, score float64
}

// readExtendedRows loads the check values copied from methods.md §1.5
// (R labeling::extended 0.4.2 [V]; q, j, k, z and scores from the bit-identical port [P]).
func readExtendedRows(t testing.TB) []extendedRow {
	t.Helper()
	f, err := os.Open("../testdata/ticks/extended.tsv")
	require.NoError(t, err)
	defer f.Close()
	num := func(s string) float64 {
		v, err := strconv.ParseFloat(s, 64)
		require.NoError(t, err, s)
		return v
	}
	list := func(s string) []float64 {
		var out []float64
		for _, f := range strings.Fields(s) {
			out = append(out, num(f))
		}
		return out
	}
	var rows []extendedRow
	sc := bufio.NewScanner(f)
	header := true
	for sc.Scan() {
		line := sc.Text()
		if strings.HasPrefix(line, "#") || line == "" {
			continue
		}
		if header {
			header = false
			continue
		}
		c := strings.Split(line, "\t")
		require.Len(t, c, 13, line)
		rows = append(rows, extendedRow{
			dmin: num(c[0]), dmax: num(c[1]), m: int(num(c[2])),
			ticks: list(c[3]), q: num(c[4]), j: int(num(c[5])), k: int(num(c[6])), z: int(num(c[7])),
			s: num(c[8]), c: num(c[9]), d: num(c[10]), score: num(c[11]), loose: list(c[12]),
		})
	}
	require.NoError(t, sc.Err())
	require.Len(t, rows, 18, "methods.md §1.5 has 18 rows")
	return rows
}

// assertTicks compares tick lists to 1e-9 of a step: R prints decimals, the
// floats carry the noise of lmin + t·step (methods.md §1.4).
func assertTicks(t *testing.T, want, got []float64, step float64, msg string) {
	t.Helper()
	if !assert.Len(t, got, len(want), msg) {
		return
	}
	for i := range want {
		assert.InDelta(t, want[i], got[i], 1e-9*step, "%s: tick %d", msg, i)
	}
}

func TestExtendedReferenceTable(t *testing.T) {
	for _, r := range readExtendedRows(t) {
		name := strconv.FormatFloat(r.dmin, 'g', -1, 64) + "_" + strconv.FormatFloat(r.dmax, 'g', -1, 64) + "_" + strconv.Itoa(r.m)
		t.Run(name, func(t *testing.T) {
			// Talbot, Lin & Hanrahan (2010); R labeling::extended, methods.md §1.5.
			l, ok := search(r.dmin, r.dmax, r.m, false, 0, constraint{})
			require.True(t, ok)
			assert.Equal(t, r.q, l.q, "q")
			assert.Equal(t, r.j, l.j, "j")
			assert.Equal(t, r.k, l.k, "k")
			assert.Equal(t, r.z, l.z, "z")
			// Scores are printed to six decimals in methods.md.
			assert.InDelta(t, r.s, l.s, 5e-7, "simplicity")
			assert.InDelta(t, r.c, l.c, 5e-7, "coverage")
			assert.InDelta(t, r.d, l.d, 5e-7, "density")
			assert.InDelta(t, r.score, l.score, 5e-7, "score")

			got := Extended(r.dmin, r.dmax, r.m, false)
			assertTicks(t, r.ticks, got.Values, got.Step, "default")
			assert.InDelta(t, float64(r.j)*r.q*math.Pow10(r.z), got.Step, 1e-12*got.Step, "step")

			loose := Extended(r.dmin, r.dmax, r.m, true)
			assertTicks(t, r.loose, loose.Values, loose.Step, "only.loose")

			// NiceDomain is the only.loose labelling for ordinary ranges.
			nice := NiceDomain(r.dmin, r.dmax, r.m)
			assertTicks(t, r.loose, nice.Values, nice.Step, "NiceDomain")
		})
	}
}

func TestExtendedHandCheck(t *testing.T) {
	// Hand check of (8.1, 14.1, 4), methods.md §1.5 [D]: S = 1 - 2/5 - 1, C = 1 - 0.5(0.1²+0.1²)/0.6²,
	// D = 2 - 6.1/6, score = 0.25S + 0.2C + 0.5D + 0.05.
	l, ok := search(8.1, 14.1, 4, false, 0, constraint{})
	require.True(t, ok)
	s := 1 - 2.0/5 - 1
	c := 1 - 0.5*(0.01+0.01)/0.36
	d := 2 - 6.1/6
	assert.InDelta(t, s, l.s, 1e-12)
	assert.InDelta(t, c, l.c, 1e-12)
	assert.InDelta(t, d, l.d, 1e-12)
	assert.InDelta(t, 0.25*s+0.2*c+0.5*d+0.05, l.score, 1e-12)
}

func TestExtendedEdgeCases(t *testing.T) {
	tests := []struct {
		name       string
		dmin, dmax float64
		m          int
		want       []float64 // exact bits
	}{
		// R labeling::extended 0.4.2, methods.md §1.4 [V]: bit-level floating-point noise of lmin + t·step.
		{"noise kept as R", 0.1, 0.3, 5, []float64{0.1, 0.15000000000000002, 0.2, 0.25, 0.30000000000000004}},
		// methods.md §1.4 [V]: dmin > dmax are swapped.
		{"swapped", 10, 0, 5, []float64{0, 2.5, 5, 7.5, 10}},
		// methods.md §1.4 [V]: a degenerate range gives seq(dmin, dmax, length.out = m).
		{"degenerate", 5, 5, 5, []float64{5, 5, 5, 5, 5}},
		{"below epsilon", -1e-15, 1e-15, 5, []float64{-1e-15, -5e-16, 0, 5e-16, 1e-15}},
		// methods.md §1.4 [S]: ranges above sqrt(DBL_MAX) take the same fallback.
		{"huge range", -1e300, 1e300, 5, []float64{-1e300, -5e299, 0, 5e299, 1e300}},
		{"m = 1", 0, 1, 1, nil},
		{"NaN", math.NaN(), 1, 5, nil},
		{"Inf", 0, math.Inf(1), 5, nil},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got := Extended(tt.dmin, tt.dmax, tt.m, false)
			assert.Equal(t, tt.want, got.Values)
		})
	}
}

func TestExtendedEmitsAllKTicks(t *testing.T) {
	// R's seq drops the last label here though k = 5 (ratio 3.99999999345), methods.md §1.4 [V].
	l, ok := search(3, 3.0000001, 5, false, 0, constraint{})
	require.True(t, ok)
	assert.Equal(t, 5, l.k)
	got := Extended(3, 3.0000001, 5, false)
	require.Len(t, got.Values, 5)
	assert.Equal(t, 3.0, got.Values[0])
	assert.InDelta(t, 2.5e-8, got.Step, 1e-20)
	for i, v := range got.Values {
		assert.Equal(t, got.Values[0]+float64(i)*got.Step, v, "computed, not accumulated")
	}
}

func TestSqrtMaxFloat(t *testing.T) {
	assert.Equal(t, math.Sqrt(math.MaxFloat64), sqrtMaxFloat)
}

func TestCeilLog10(t *testing.T) {
	// Go's Log10(0.1) = -0.9999999999999999 and Log10(1e15) = 14.999999999999998, methods.md §1.6 [S].
	tests := []struct {
		x    float64
		want int
	}{{0.1, -1}, {1e15, 15}, {1, 0}, {0.11, 0}, {0.09, -1}, {1e-300, -300}, {2.5e7, 8}}
	for _, tt := range tests {
		assert.Equal(t, tt.want, ceilLog10(tt.x), "ceilLog10(%g)", tt.x)
	}
	for e := -307; e <= 308; e++ {
		x := math.Pow10(e)
		assert.Equal(t, e, ceilLog10(x), "ceilLog10(1e%d)", e)
		assert.Equal(t, e, floorLog10(x), "floorLog10(1e%d)", e)
		assert.Equal(t, e, floorLog10(math.Nextafter(x, math.Inf(1))), "floorLog10(1e%d+)", e)
		assert.Equal(t, e-1, floorLog10(math.Nextafter(x, 0)), "floorLog10(1e%d-)", e)
	}
}

func TestExtendedDecimals(t *testing.T) {
	tests := []struct {
		dmin, dmax float64
		m          int
		want       int
	}{
		{0.1, 0.3, 5, 2},           // q = 5, z = -2: max(0, -z), methods.md §1.4
		{0, 100, 5, 0},             // 0 25 50 75 100
		{1, 10, 5, 1},              // q = 2.5, z = 0: max(0, -z + 1), methods.md §1.4
		{0.000123, 0.000987, 5, 5}, // 0.00025
		{0.13, 0.97, 10, 1},        // 0.1 … 1.0
		{35, 65, 4, 0},             // q = 5, j = 2
		{-0.4, 0.4, 5, 1},
		{1e6, 1.1e6, 5, 0},
	}
	for _, tt := range tests {
		got := Extended(tt.dmin, tt.dmax, tt.m, false)
		assert.Equal(t, tt.want, got.Decimals, "Extended(%g, %g, %d) = %v", tt.dmin, tt.dmax, tt.m, got.Values)
	}
	// Fewer digits than the step's exponent suggests when every label is whole:
	// labels 0 1 2 of q = 5, z = -1, j = 2 need none.
	assert.Equal(t, 0, gridDecimals(0, 2, 5, 3, -1))
	assert.Equal(t, 1, gridDecimals(1, 2, 5, 3, -1)) // 0.5 1.5 2.5
}

// checkDomain asserts the NiceDomain contract for [lo, hi].
func checkDomain(t testing.TB, tk Ticks, lo, hi float64, m int) {
	t.Helper()
	lo, hi = min(lo, hi), max(lo, hi)
	v := tk.Values
	if len(v) < 2 {
		t.Fatalf("(%g, %g, %d): %d ticks, want >= 2", lo, hi, m, len(v))
	}
	if len(v) > 2*max(m, 2)+2 {
		t.Errorf("(%g, %g, %d): %d ticks, want about %d", lo, hi, m, len(v), m)
	}
	for i, x := range v {
		if !isFinite(x) {
			t.Fatalf("(%g, %g, %d): tick %d = %g", lo, hi, m, i, x)
		}
		if i > 0 && !(x > v[i-1]) {
			t.Fatalf("(%g, %g, %d): ticks not increasing: %v", lo, hi, m, v)
		}
	}
	if v[0] > lo || v[len(v)-1] < hi {
		t.Fatalf("(%g, %g, %d): ticks %v do not cover the data", lo, hi, m, v)
	}
	if !(tk.Step > 0) || tk.Decimals < 0 {
		t.Fatalf("(%g, %g, %d): step %g, decimals %d", lo, hi, m, tk.Step, tk.Decimals)
	}
}

// randomRange draws ranges of every kind: tiny, huge, negative, degenerate.
func randomRange(r *rand.Rand) (lo, hi float64) {
	mag := math.Pow10(r.IntN(617) - 308)
	lo = (r.Float64()*2 - 1) * mag
	switch r.IntN(5) {
	case 0:
		hi = lo // degenerate
	case 1:
		hi = lo + r.Float64()*mag*1e-6 // narrow relative to the magnitude
	case 2:
		hi = -lo
	default:
		hi = (r.Float64()*2 - 1) * mag
	}
	return lo, hi
}

func TestNiceDomainProperties(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	for range 5000 {
		lo, hi := randomRange(r)
		m := 2 + r.IntN(12)
		checkDomain(t, NiceDomain(lo, hi, m), lo, hi, m)
	}
}

func TestBarDomainProperties(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	for range 5000 {
		lo, hi := randomRange(r)
		m := 2 + r.IntN(12)
		tk := BarDomain(lo, hi, m)
		checkDomain(t, tk, min(lo, hi, 0), max(lo, hi, 0), m)
		if !hasZero(tk.Values) {
			t.Fatalf("BarDomain(%g, %g, %d) = %v: no zero tick", lo, hi, m, tk.Values)
		}
	}
}

func TestNiceDomainCases(t *testing.T) {
	tests := []struct {
		name   string
		lo, hi float64
		m      int
		want   []float64
	}{
		{"zero widens to unit", 0, 0, 5, []float64{0, 0.25, 0.5, 0.75, 1}},
		{"constant widens by a tenth", 100, 100, 5, []float64{90, 95, 100, 105, 110}},
		{"negative constant", -5, -5, 3, []float64{-5.5, -5, -4.5}},
		{"swapped", 14.1, 8.1, 4, []float64{7.5, 10, 12.5, 15}},
		{"tiny", 1e-300, 3e-300, 5, []float64{1e-300, 1.5e-300, 2e-300, 2.5e-300, 3e-300}},
		{"huge", -1e300, 1e300, 5, []float64{-1e300, -5e299, 0, 5e299, 1e300}},
		{"m below 2", 0, 100, 0, []float64{0, 100}},
		{"NaN", math.NaN(), 0, 5, nil},
		{"Inf", 0, math.Inf(-1), 5, nil},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got := NiceDomain(tt.lo, tt.hi, tt.m)
			if tt.want == nil {
				assert.Empty(t, got.Values)
				return
			}
			assertTicks(t, tt.want, got.Values, got.Step, tt.name)
			checkDomain(t, got, tt.lo, tt.hi, tt.m)
		})
	}
}

func TestNiceDomainExtremes(t *testing.T) {
	for _, c := range [][2]float64{
		{-math.MaxFloat64, math.MaxFloat64},
		{math.MaxFloat64, math.MaxFloat64},
		{-math.MaxFloat64, -math.MaxFloat64},
		{math.SmallestNonzeroFloat64, math.SmallestNonzeroFloat64},
		{-math.SmallestNonzeroFloat64, math.SmallestNonzeroFloat64},
		{0, math.SmallestNonzeroFloat64},
		{1, math.Nextafter(1, 2)},
		{1e16, 1e16 + 2},
		{1e-320, 3e-320},
	} {
		for _, m := range []int{2, 5, 10} {
			checkDomain(t, NiceDomain(c[0], c[1], m), c[0], c[1], m)
			b := BarDomain(c[0], c[1], m)
			checkDomain(t, b, min(c[0], 0), max(c[1], 0), m)
			assert.True(t, hasZero(b.Values), "BarDomain(%g, %g) = %v", c[0], c[1], b.Values)
		}
	}
}

func TestBarDomainCases(t *testing.T) {
	tests := []struct {
		name   string
		lo, hi float64
		m      int
		want   []float64
	}{
		{"positive data reach down to zero", 8.1, 14.1, 4, []float64{0, 5, 10, 15}},
		{"negative data reach up to zero", -14.1, -8.1, 4, []float64{-15, -10, -5, 0}},
		{"straddling zero", -3.7, 12.2, 6, []float64{-5, -2.5, 0, 2.5, 5, 7.5, 10, 12.5}},
		{"all zero", 0, 0, 5, []float64{0, 0.25, 0.5, 0.75, 1}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got := BarDomain(tt.lo, tt.hi, tt.m)
			assertTicks(t, tt.want, got.Values, got.Step, tt.name)
		})
	}
	assert.Empty(t, BarDomain(math.NaN(), 1, 5).Values)
}

func TestBarDomainForcesZero(t *testing.T) {
	// Scan many ranges: wherever the search would skip zero, BarDomain must still show it.
	for lo := -50.0; lo <= 50; lo += 0.7 {
		for _, w := range []float64{0.3, 3, 17, 101} {
			for _, m := range []int{2, 3, 4, 5, 7} {
				tk := BarDomain(lo, lo+w, m)
				if !hasZero(tk.Values) {
					t.Fatalf("BarDomain(%g, %g, %d) = %v", lo, lo+w, m, tk.Values)
				}
				checkDomain(t, tk, min(lo, 0), max(lo+w, 0), m)
			}
		}
	}
}

func FuzzNiceDomain(f *testing.F) {
	f.Add(8.1, 14.1, 4)
	f.Add(0.0, 0.0, 5)
	f.Add(1e-300, 2e-300, 5)
	f.Add(-1e300, 1e300, 3)
	f.Add(5.0, 5.0, 1)
	f.Fuzz(func(t *testing.T, lo, hi float64, m int) {
		m = m % 64 // the search visits about m² candidates; keep each input fast
		tk := NiceDomain(lo, hi, m)
		if !isFinite(lo) || !isFinite(hi) {
			if len(tk.Values) != 0 {
				t.Fatalf("non-finite input gave %v", tk.Values)
			}
			return
		}
		checkDomain(t, tk, lo, hi, min(max(m, 2), MaxTicks))
	})
}

func FuzzBarDomain(f *testing.F) {
	f.Add(8.1, 14.1, 4)
	f.Add(-3.7, 12.2, 6)
	f.Add(1e-300, 2e-300, 5)
	f.Add(-1.7e308, -1e308, 3)
	f.Fuzz(func(t *testing.T, lo, hi float64, m int) {
		m = m % 64
		tk := BarDomain(lo, hi, m)
		if !isFinite(lo) || !isFinite(hi) {
			return
		}
		checkDomain(t, tk, min(lo, hi, 0), max(lo, hi, 0), min(max(m, 2), MaxTicks))
		if !hasZero(tk.Values) {
			t.Fatalf("no zero tick in %v", tk.Values)
		}
	})
}

func FuzzExtended(f *testing.F) {
	f.Add(8.1, 14.1, 4, false)
	f.Add(3.0, 3.0000001, 5, true)
	f.Add(10.0, 0.0, 5, false)
	f.Add(-1e308, 7e307, 5, false)
	f.Add(-1e308, 1.4e308, 2, false)                   // the span overflows float64
	f.Add(-math.MaxFloat64, math.MaxFloat64, 5, false) // the widest span there is
	f.Fuzz(func(t *testing.T, dmin, dmax float64, m int, loose bool) {
		m = m % 64
		tk := Extended(dmin, dmax, m, loose)
		for i, v := range tk.Values {
			if math.IsNaN(v) {
				t.Fatalf("NaN tick in %v", tk.Values)
			}
			if math.IsInf(v, 0) || i > 0 && v < tk.Values[i-1] {
				t.Fatalf("Extended(%g, %g, %d): ticks not finite and ascending: %v", dmin, dmax, m, tk.Values)
			}
		}
	})
}

func BenchmarkExtended(b *testing.B) {
	for _, c := range []struct {
		name       string
		dmin, dmax float64
		m          int
	}{{"m=5", -3.7, 12.2, 5}, {"m=10", 0.13, 0.97, 10}, {"m=30", 0, 1234, 30}} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				Extended(c.dmin, c.dmax, c.m, false)
			}
		})
	}
}

func BenchmarkNiceDomain(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		NiceDomain(1e-300, 7e-300, 5)
	}
}
