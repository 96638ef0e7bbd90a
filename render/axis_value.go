package render

import (
	"math"

	"plumb/scale"
)

// valueKind says how the value axis of bars and dots is ticked.
type valueKind struct {
	zero     bool // the domain includes zero: bars grow from it
	from, to bool // an end set by the user: kept, the ticks fall inside it
	integer  bool // whole-number data: whole-number steps
	label    func([]float64) []string
}

// fitValue chooses the ticks of a bar or dot chart's value axis of the
// given length over the data [lo, hi]: about one per 75 px at screen size
// (scale.TickTarget), fewer when their labels would touch, but never fewer
// than scale.MinTicks (three beyond 150 px), zero labelled when inside,
// whole numbers for whole-number data. Labels stacked up a vertical axis
// need only a line apart, so it takes more ticks and no label test. The
// axis's domain is the one its ticks give (see axis.extent).
func (f *frame) fitValue(lo, hi, length float64, horizontal bool, k valueKind) axis {
	sp := f.spec
	target := scale.TickTarget(length, sp.text)
	if !horizontal {
		target = scale.TickTarget(length*1.4, sp.text)
	}
	floor := f.minTicks(length)
	a := valueTicks(lo, hi, target, floor, k)
	for m := target - 1; horizontal && m >= floor && len(a.ticks) >= 2 && !f.labelsFit(a, length); m-- {
		a = valueTicks(lo, hi, m, floor, k)
	}
	if !horizontal {
		return a
	}
	// The tick search keeps zero and nice steps, so on a very short axis
	// its fewest ticks may still be too many to label.
	return f.thinToFit(a, length)
}

// valueTicks computes ticks with about m values (at least floor) over
// [lo, hi], widened to zero for bars. An end set by the user is kept and
// the ticks fall inside it; the other end extends to its outer tick.
func valueTicks(lo, hi float64, m, floor int, k valueKind) axis {
	if k.zero {
		lo, hi = math.Min(lo, 0), math.Max(hi, 0)
	}
	t := scale.NiceTicks(lo, hi, m, scale.TickOptions{Min: floor, Zero: true, Integer: k.integer})
	vals := t.Values
	if k.from || k.to {
		eps := 1e-9 * math.Abs(hi-lo)
		vals = nil
		for _, v := range t.Values {
			if (!k.from || v >= lo-eps) && (!k.to || v <= hi+eps) {
				vals = append(vals, v)
			}
		}
	}
	extent := func(ts []float64) (float64, float64) {
		d0, d1 := lo, hi
		if n := len(ts); n > 0 {
			if !k.from {
				d0 = math.Min(d0, ts[0])
			}
			if !k.to {
				d1 = math.Max(d1, ts[n-1])
			}
		}
		return d0, d1
	}
	a := axis{ticks: vals, labels: k.label(vals), label: k.label, extent: extent}
	a.d0, a.d1 = extent(vals)
	return a
}
