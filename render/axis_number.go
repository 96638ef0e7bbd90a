package render

import (
	"fmt"
	"math"
	"plumb/scale"
)

// Number axes for charts whose x and y are both numbers (scatter plots,
// their matrices): the domain checks, tick kinds and the fitting of both
// axes to a plot.

func finiteValue(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// axisRoom refuses values an axis cannot hold, with what would fix them.
func axisRoom(what string, lo, hi float64) error {
	if math.Max(math.Abs(lo), math.Abs(hi)) > maxAxisValue {
		return fmt.Errorf("the %s run from %g to %g, too near the largest number (%.1e) to place on an axis: divide them by a power of ten first", what, lo, hi, math.MaxFloat64)
	}
	return nil
}

// plainNumberKind ticks a number axis that need not reach zero, in whole steps
// for whole-number data.
func plainNumberKind(v []float64) valueKind {
	return valueKind{integer: wholeNumbers(v), label: func(t []float64) []string { return formatAll(scale.TickFormat(t, ""), t) }}
}

// fitNumberAxes chooses the ticks of both axes for a plot of w × h over
// the domains, then widens each axis's ends, beyond its ticks, as far as
// it takes to keep the data margin pixels inside the plot: marks never
// reach past the axes, and no tick is added for the room (an axis of
// kilometres gains no −50).
func fitNumberAxes(f *frame, dx, dy axisDomain, kx, ky valueKind, w, h, margin float64) (axis, axis) {
	fit := func(d axisDomain, length float64, horizontal bool, k valueKind) axis {
		lo, hi := d.lo, d.hi
		if hi == lo {
			a := math.Max(1, math.Abs(lo)*0.1)
			lo, hi = lo-a, hi+a
		}
		a := f.fitValue(lo, hi, length, horizontal, k)
		if length > 4*margin && a.d1 > a.d0 {
			// Solve for the ends that put lo and hi margin px inside.
			d0, d1 := a.d0, a.d1
			for range 3 {
				unit := (d1 - d0) / length
				d0 = math.Min(a.d0, lo-margin*unit)
				d1 = math.Max(a.d1, hi+margin*unit)
			}
			a.d0, a.d1 = d0, d1
		}
		return a
	}
	return fit(dx, w, true, kx), fit(dy, h, false, ky)
}

// tickLabelWidth is the widest tick label an axis over d gives at any of a
// few lengths, for measuring before the length is known.
func tickLabelWidth(f *frame, d axisDomain, k valueKind, horizontal bool) float64 {
	w := 0.0
	for _, l := range []float64{120, 240, 480, 960} {
		a := f.fitValue(d.lo, d.hi, l, horizontal, k)
		for _, s := range a.labels {
			w = math.Max(w, f.measure(s, f.spec.text, false))
		}
	}
	return w
}

// groupedCount is "1 point" or "1,234 points".
func groupedCount(n int, one, many string) string {
	return scale.Format{Group: true}.Format(float64(n)) + " " + plural(n, one, many)
}
