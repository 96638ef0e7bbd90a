package stats

import (
	"fmt"
	"math/rand/v2"
	"testing"
)

// BenchmarkWard measures the chain's growth with the number of rows at 20
// columns (issue 11: 1k, 3k and 9k rows); expect about 9× per 3× rows.
func BenchmarkWard(b *testing.B) {
	for _, n := range []int{1000, 3000, 9000} {
		data := structured(rand.New(rand.NewPCG(1, 2)), n, 20)
		b.Run(fmt.Sprintf("rows=%d", n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := Ward(data, n, 20); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkLeafOrder measures the optimal ordering at its limit and the
// heuristic at 9k rows.
func BenchmarkLeafOrder(b *testing.B) {
	for _, n := range []int{300, OptimalOrderLimit, 9000} {
		data := structured(rand.New(rand.NewPCG(1, 2)), n, 20)
		tree, err := Ward(data, n, 20)
		if err != nil {
			b.Fatal(err)
		}
		b.Run(fmt.Sprintf("rows=%d", n), func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				tree.LeafOrder(data, 20)
			}
		})
	}
}
