package scale

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
)

func TestLinear(t *testing.T) {
	tests := []struct {
		name  string
		s     Linear
		v, px float64
	}{
		{"zero value maps to 0", Linear{}, 123, 0},
		{"identity", Linear{0, 1, 0, 1}, 0.25, 0.25},
		{"domain to pixels", Linear{0, 100, 50, 450}, 25, 150},
		{"reversed range", Linear{0, 10, 300, 0}, 2.5, 225},
		{"negative domain", Linear{-5, 15, 0, 200}, 0, 50},
		{"end maps exactly", Linear{0.1, 0.30000000000000004, 0, 0.7}, 0.30000000000000004, 0.7},
		{"degenerate domain maps to the middle", Linear{5, 5, 100, 200}, 7, 150},
		{"huge domain", Linear{-math.MaxFloat64, math.MaxFloat64, 0, 100}, 0, 50},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got := tt.s.Map(tt.v)
			assert.InDelta(t, tt.px, got, 1e-9)
			assert.False(t, math.IsNaN(got))
		})
	}
}

func TestLinearInvert(t *testing.T) {
	s := Linear{D0: -3.7, D1: 12.2, R0: 400, R1: 20}
	for _, v := range []float64{-3.7, 0, 1.5, 12.2, 20} {
		assert.InDelta(t, v, s.Invert(s.Map(v)), 1e-12)
	}
	assert.Equal(t, 0.0, Linear{}.Invert(17), "zero value")
	assert.Equal(t, 5.0, Linear{0, 10, 3, 3}.Invert(17), "degenerate range inverts to the middle")
}

func TestLinearMonotone(t *testing.T) {
	s := Linear{D0: 0, D1: 7, R0: 0, R1: 613}
	prev := s.Map(-1)
	for v := -1.0; v <= 8; v += 0.01 {
		got := s.Map(v)
		assert.GreaterOrEqual(t, got, prev, "Map(%g)", v)
		prev = got
	}
}

func BenchmarkLinearMap(b *testing.B) {
	s := Linear{D0: -3.7, D1: 12.2, R0: 400, R1: 20}
	x := 0.0
	for b.Loop() {
		x += s.Map(1.5)
	}
	_ = x
}
