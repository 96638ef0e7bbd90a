package stats

import (
	"encoding/binary"
	"math"
	"testing"
)

// FuzzBinQuantile feeds arbitrary values and bin options to Sorted,
// Quantile, TukeyBox and Bin: they must return an error or a result that
// keeps every invariant, and never panic or loop.
func FuzzBinQuantile(f *testing.F) {
	f.Add([]byte{}, 0, 0.0)
	f.Add(floatBytes(2, 4, 4, 5, 6, 7, 8, 9, 11, 30), 0, 0.0)
	f.Add(floatBytes(0.1, 0.2, 0.3), 4, 0.0)
	f.Add(floatBytes(-1e300, 1e300), 0, 0.0)
	f.Add(floatBytes(1, 1, 1), 0, 0.25)
	f.Fuzz(func(t *testing.T, raw []byte, bins int, width float64) {
		var xs []float64
		for len(raw) >= 8 && len(xs) < 2000 {
			xs = append(xs, math.Float64frombits(binary.LittleEndian.Uint64(raw)))
			raw = raw[8:]
		}
		s, err := Sorted(xs)
		if err != nil {
			return
		}
		prev := math.Inf(-1)
		for i := 0; i <= 8; i++ {
			q := Quantile(s, float64(i)/8)
			if q < prev || q < s[0] || q > s[len(s)-1] {
				t.Fatalf("Q(%v) = %v after %v", float64(i)/8, q, prev)
			}
			prev = q
		}
		b := TukeyBoxSorted(s)
		if b.Q1 > b.Median || b.Median > b.Q3 {
			t.Fatalf("box %+v out of order", b)
		}
		h, err := BinValues(s, BinOptions{Bins: bins % 2000, Width: width, Integer: bins%3 == 1})
		if err != nil {
			return
		}
		checkHistogram(t, s, h)
	})
}

func floatBytes(xs ...float64) []byte {
	b := make([]byte, 8*len(xs))
	for i, x := range xs {
		binary.LittleEndian.PutUint64(b[8*i:], math.Float64bits(x))
	}
	return b
}
