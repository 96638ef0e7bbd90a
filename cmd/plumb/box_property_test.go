package main

import (
	"fmt"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
)

// randomLabel is a category name of any length, with spaces to wrap at.
func randomLabel(rng *rand.Rand, i int) string {
	words := []string{"Harbour", "North", "Saltmarrow", "via", "the", "Narrows", "Point", "Ω", "Isle", "Reach", "of", "Kettlewick-on-Sea"}
	var b strings.Builder
	for range 1 + rng.IntN(7) {
		b.WriteString(words[rng.IntN(len(words))])
		b.WriteByte(' ')
	}
	fmt.Fprintf(&b, "%d", i)
	return b.String()
}

// TestDistributionProperties draws hundreds of random box plots,
// histograms and range charts (labels of every length, values of every
// sign and size, every medium) and checks the invariants of every figure:
// valid, accessible, no text overlapping text or leaving the canvas.
func TestDistributionProperties(t *testing.T) {
	rng := rand.New(rand.NewPCG(21, 4))
	media := []string{"screen", "print", "slide"}
	for trial := range 120 {
		scale := math.Pow(10, float64(rng.IntN(9)-3))
		shift := (rng.Float64() - 0.5) * 4 * scale * float64(rng.IntN(2))
		groups := 1 + rng.IntN(9)
		var b strings.Builder
		b.WriteString("label,value,year\n")
		for g := range groups {
			name := randomLabel(rng, g)
			n := 1 + rng.IntN(40)
			for i := range n {
				v := shift + scale*(rng.NormFloat64()+float64(g)*0.3+rng.ExpFloat64()*float64(rng.IntN(2)))
				fmt.Fprintf(&b, "%q,%g,%d\n", name, v, 2000+i)
			}
		}
		data := b.String()
		medium := media[trial%3]
		var args []string
		switch trial % 3 {
		case 0:
			args = []string{"box", "-", "--group", "label", "--value", "value"}
			if trial%2 == 0 {
				args = append(args, "--vertical")
			}
		case 1:
			args = []string{"hist", "-", "--value", "value"}
			if trial%2 == 0 {
				args = append(args, "--density")
			}
		default:
			args = []string{"span", "-", "--label", "label", "--value", "value", "--mark-where", "year=2000", "--stat", spanStats[trial%len(spanStats)]}
		}
		args = append(args, "--for", medium, "--title", "Trial "+fmt.Sprint(trial))
		code, out, errs := plumb(t, data, args...)
		require.Equal(t, 0, code, "%v: %s\n%s", args, errs, data)
		checkFigure(t, []byte(out))
		if t.Failed() {
			t.Fatalf("trial %d (%v) failed on\n%s", trial, args, data)
		}
	}
}
