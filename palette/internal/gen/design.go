package main

import (
	"math"

	"plumb/palette"
)

var white = palette.SRGB{R: 1, G: 1, B: 1}

// Design constraints of the categorical palette. Exported as constants in
// the palette package too; they are repeated here because the generator
// decides, and the package tests check.
const (
	catSize        = 8
	catMaxChroma   = 0.15 // OKLCH; the sRGB primaries have 0.26-0.32
	catMinChroma   = 0.07 // below this a colour reads as a grey
	catMinL        = 0.48 // OKLab L; darker colours read as black ink
	catMinContrast = 3.0  // WCAG 2.x SC 1.4.11 on white
)

// candidate is an 8-bit colour with its CIELAB under each vision.
type candidate struct {
	c   palette.SRGB
	lab [4]palette.Lab
}

func newCandidate(c palette.SRGB) candidate {
	k := candidate{c: c}
	for _, v := range palette.Visions {
		k.lab[v] = palette.SRGBToLab(palette.Simulate(c, v, 1))
	}
	return k
}

// categoricalCandidates lists, in a fixed order, the 8-bit colours on a grid
// in OKLCH that meet the categorical constraints.
func categoricalCandidates() []candidate {
	seen := map[palette.SRGB]bool{}
	var cs []candidate
	for li := 0; li <= 12; li++ {
		L := catMinL + 0.02*float64(li)
		for ci := 0; ci <= 4; ci++ {
			C := catMinChroma + 0.02*float64(ci)
			for hi := 0; hi < 60; hi++ {
				H := 6 * float64(hi)
				if palette.GamutMap(palette.OKLCH{L: L, C: C, H: H}).C < C-1e-9 {
					continue
				}
				s := palette.OKLCHToSRGB(palette.OKLCH{L: L, C: C, H: H}).Quantize()
				lch := palette.OKLabToOKLCH(palette.SRGBToOKLab(s))
				if seen[s] || palette.Contrast(s, white) < catMinContrast || lch.C > catMaxChroma || lch.C < catMinChroma {
					continue
				}
				seen[s] = true
				cs = append(cs, newCandidate(s))
			}
		}
	}
	return cs
}

// score is the objective: the worst case over visions of the smallest
// pairwise CIEDE2000, then (to break ties and keep improving once the worst
// pair is fixed) the sum over visions of each vision's smallest distance.
func score(cs []candidate, set []int) (worst, sum float64) {
	worst = math.Inf(1)
	for v := 0; v < 4; v++ {
		m := math.Inf(1)
		for i := range set {
			for j := i + 1; j < len(set); j++ {
				m = math.Min(m, palette.DeltaE2000(cs[set[i]].lab[v], cs[set[j]].lab[v]))
			}
		}
		worst = math.Min(worst, m)
		sum += m
	}
	return worst, sum
}

func better(w, s, bw, bs float64) bool {
	return w > bw+1e-9 || (w > bw-1e-9 && s > bs+1e-9)
}

// designCategorical maximises the worst-case distance of an 8-colour set
// by greedy farthest-point starts followed by single-swap local search
// (first improvement, fixed order), then orders the set so that every prefix
// is as good as the greedy choice allows.
func designCategorical() []palette.SRGB {
	cs := categoricalCandidates()
	var best []int
	bw, bs := -1.0, 0.0
	for start := 0; start < len(cs); start += len(cs)/6 + 1 {
		set := greedy(cs, []int{start}, catSize)
		set = localSearch(cs, set)
		if w, s := score(cs, set); better(w, s, bw, bs) {
			bw, bs, best = w, s, set
		}
	}
	return orderPrefixes(cs, best)
}

// greedy adds, one at a time, the candidate that keeps the set best.
func greedy(cs []candidate, set []int, n int) []int {
	for len(set) < n {
		base := pairMinima(cs, set, -1)
		bi, bw, bs := -1, -1.0, 0.0
		for k := range cs {
			if w, s := withCandidate(cs, set, base, -1, k); better(w, s, bw, bs) {
				bi, bw, bs = k, w, s
			}
		}
		set = append(set, bi)
	}
	return set
}

// pairMinima is each vision's smallest distance over the pairs of set that
// do not involve index skip.
func pairMinima(cs []candidate, set []int, skip int) [4]float64 {
	var m [4]float64
	for v := 0; v < 4; v++ {
		m[v] = math.Inf(1)
		for i := range set {
			for j := i + 1; j < len(set); j++ {
				if i != skip && j != skip {
					m[v] = math.Min(m[v], palette.DeltaE2000(cs[set[i]].lab[v], cs[set[j]].lab[v]))
				}
			}
		}
	}
	return m
}

// withCandidate scores set with candidate k in place of index skip (or
// added, when skip is -1), given pairMinima for the other pairs.
func withCandidate(cs []candidate, set []int, base [4]float64, skip, k int) (worst, sum float64) {
	worst = math.Inf(1)
	for v := 0; v < 4; v++ {
		m := base[v]
		for i, o := range set {
			if i != skip {
				m = math.Min(m, palette.DeltaE2000(cs[k].lab[v], cs[o].lab[v]))
			}
		}
		worst = math.Min(worst, m)
		sum += m
	}
	return worst, sum
}

// localSearch replaces one colour at a time by the candidate that improves
// the score most, until no single swap helps.
func localSearch(cs []candidate, set []int) []int {
	set = append([]int(nil), set...)
	w, s := score(cs, set)
	for {
		improved := false
		for slot := range set {
			base := pairMinima(cs, set, slot)
			old := set[slot]
			bk, bw, bs := old, w, s
			for k := range cs {
				if w2, s2 := withCandidate(cs, set, base, slot, k); better(w2, s2, bw, bs) {
					bk, bw, bs = k, w2, s2
				}
			}
			set[slot] = bk
			if bk != old {
				w, s, improved = bw, bs, true
			}
		}
		if !improved {
			return set
		}
	}
}

// orderPrefixes starts with the pair that is furthest apart in the worst
// case and appends, each time, the colour that keeps the prefix best.
func orderPrefixes(cs []candidate, set []int) []palette.SRGB {
	var order []int
	bi, bj, bw, bs := 0, 1, -1.0, 0.0
	for i := range set {
		for j := i + 1; j < len(set); j++ {
			if w, s := score(cs, []int{set[i], set[j]}); better(w, s, bw, bs) {
				bi, bj, bw, bs = i, j, w, s
			}
		}
	}
	used := map[int]bool{bi: true, bj: true}
	order = append(order, set[bi], set[bj])
	for len(order) < len(set) {
		pick, pw, ps := -1, -1.0, 0.0
		for i := range set {
			if used[i] {
				continue
			}
			if w, s := score(cs, append(order[:len(order):len(order)], set[i])); better(w, s, pw, ps) {
				pick, pw, ps = i, w, s
			}
		}
		used[pick] = true
		order = append(order, set[pick])
	}
	out := make([]palette.SRGB, len(order))
	for i, k := range order {
		out[i] = cs[k].c
	}
	return out
}
