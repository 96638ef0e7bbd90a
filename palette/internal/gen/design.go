package main

import (
	"math"
	"slices"

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

// catParams are the knobs of the categorical search. The search is
// lexicographic: first every reader must be able to tell the colours apart
// (the worst case over normal, protan, deutan and tritan vision of the
// smallest pairwise CIEDE2000 must reach floor); then no two colours may be
// named alike (sameFamily); then the hues should be spread evenly; the
// worst case beyond the floor only breaks ties.
type catParams struct {
	floor      float64              // worst-case CIEDE2000 the full palette must keep
	sameHue    float64              // OKLCH hue gap (degrees) below which two colours share a family...
	lightPair  float64              // ...unless their OKLab lightness differs by this much
	evenW      float64              // weight of hue evenness, in CIEDE2000 units, above the floor
	tieW       float64              // weight of the worst case above the floor
	starts     int                  // greedy starts of the set search
	firstLo    float64              // OKLCH hue range of the first colour
	firstHi    float64              //
	lead       int                  // the first colours, the most used...
	leadMinL   float64              // ...are no darker than this (OKLab L; darker warm hues read as browns)...
	leadMinC   float64              // ...and no greyer than this (OKLCH C), so their hue names itself
	leadW      float64              // weight of the lead colours' worst case above the floor
	aim        [catSize + 1]float64 // worst case that earns full credit for each prefix size
	aimCap     float64              // credit for a prefix's worst case stops at this multiple of aim
	orderEvenW float64              // weight of a prefix's hue evenness against its worst case
}

// catDesign are the settings that made categoricalTable.
var catDesign = catParams{
	floor:     12,
	sameHue:   25,
	lightPair: 0.15,
	evenW:     10,
	tieW:      0.1,
	starts:    8,
	// Blue first: it is the hue that protan and deutan readers see as
	// strongly as everyone else, and it stays clear of Accent (a warm hue).
	firstLo:    235,
	firstHi:    265,
	lead:       2,
	leadMinL:   0.56,
	leadMinC:   0.09,
	leadW:      1,
	aim:        [catSize + 1]float64{0, 0, 30, 20, 17, 15, 14, 13, 12},
	aimCap:     1.5,
	orderEvenW: 1,
}

// candidate is an 8-bit colour with its CIELAB under each vision and its
// OKLCH lightness and hue.
type candidate struct {
	c       palette.SRGB
	lab     [4]palette.Lab
	L, C, H float64
}

func newCandidate(c palette.SRGB) candidate {
	k := candidate{c: c}
	for _, v := range palette.Visions {
		k.lab[v] = palette.SRGBToLab(palette.Simulate(c, v, 1))
	}
	lch := palette.OKLabToOKLCH(palette.SRGBToOKLab(c))
	k.L, k.C, k.H = lch.L, lch.C, lch.H
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
			for hi := 0; hi < 72; hi++ {
				H := 5 * float64(hi)
				if palette.GamutMap(palette.OKLCH{L: L, C: C, H: H}).C < C-1e-9 {
					continue
				}
				s := palette.OKLCHToSRGB(palette.OKLCH{L: L, C: C, H: H}).Quantize()
				lch := palette.OKLabToOKLCH(palette.SRGBToOKLab(s))
				if seen[s] || atGamutEdge(s) || palette.Contrast(s, white) < catMinContrast || lch.C > catMaxChroma || lch.C < catMinChroma {
					continue
				}
				seen[s] = true
				cs = append(cs, newCandidate(s))
			}
		}
	}
	return cs
}

// atGamutEdge reports a channel at 0 or 1, the mark of a colour pushed to
// the edge of sRGB: such colours look loud beside the others.
func atGamutEdge(c palette.SRGB) bool {
	for _, v := range []float64{c.R, c.G, c.B} {
		if v == 0 || v == 1 {
			return true
		}
	}
	return false
}

// hueGap is the angle between two hues, 0 to 180 degrees.
func hueGap(a, b float64) float64 {
	d := math.Abs(a - b)
	if d > 180 {
		d = 360 - d
	}
	return d
}

// sameFamily reports whether two colours would be named alike: close in
// hue and not set apart by lightness.
func (p catParams) sameFamily(a, b candidate) bool {
	return hueGap(a.H, b.H) < p.sameHue && math.Abs(a.L-b.L) < p.lightPair
}

// evenness is how evenly the hues of set are spread around the hue circle:
// the smallest gap between neighbouring hues over the gap of a perfectly
// even spread (360/len(set)), at most 1.
func evenness(cs []candidate, set []int) float64 {
	hs := make([]float64, len(set))
	for i, k := range set {
		hs[i] = cs[k].H
	}
	slices.Sort(hs)
	gap := hs[0] + 360 - hs[len(hs)-1]
	for i := 1; i < len(hs); i++ {
		gap = math.Min(gap, hs[i]-hs[i-1])
	}
	return math.Min(1, gap/(360/float64(len(hs))))
}

// setScore is lexScore of set with candidate k in place of index skip (or
// added, when skip is -1), given pairMinima for the other pairs. ok is
// false when k repeats a colour or shares a hue family with one.
func (p catParams) setScore(cs []candidate, set []int, base [4]float64, skip, k int) (score float64, ok bool) {
	mins := base
	for i, o := range set {
		if i == skip {
			continue
		}
		if o == k || p.sameFamily(cs[k], cs[o]) {
			return 0, false
		}
		for v := range 4 {
			mins[v] = math.Min(mins[v], palette.DeltaE2000(cs[k].lab[v], cs[o].lab[v]))
		}
	}
	worst := min(mins[0], mins[1], mins[2], mins[3])
	trial := slices.Clone(set)
	if skip >= 0 {
		trial[skip] = k
	} else {
		trial = append(trial, k)
	}
	return p.lexScore(worst, evenness(cs, trial), worstCase(cs, trial[:min(p.lead, len(trial))])), true
}

// worstCase is the smallest pairwise CIEDE2000 of set over the four visions.
func worstCase(cs []candidate, set []int) float64 {
	w := math.Inf(1)
	for i := range set {
		for j := i + 1; j < len(set); j++ {
			for v := range 4 {
				w = math.Min(w, palette.DeltaE2000(cs[set[i]].lab[v], cs[set[j]].lab[v]))
			}
		}
	}
	return w
}

// lexScore ranks sets lexicographically: below the floor only the worst
// case counts; above it, the evenness of the hues and the worst case among
// the lead colours (up to its aim) first, and the worst case second.
func (p catParams) lexScore(worst, even, lead float64) float64 {
	f := p.floor
	if worst < f {
		return worst
	}
	return f + p.evenW*even + p.leadW*math.Min(lead, p.aim[p.lead]) + p.tieW*(worst-f)
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

func (p catParams) isFirst(c candidate) bool {
	return c.H >= p.firstLo && c.H <= p.firstHi && p.fitsSlot(c, 0)
}

// fitsSlot reports whether c may take position slot of the palette.
func (p catParams) fitsSlot(c candidate, slot int) bool {
	return slot >= p.lead || c.L >= p.leadMinL && c.C >= p.leadMinC
}

// greedySet grows a set from one first colour, each time adding the
// candidate that scores best.
func (p catParams) greedySet(cs []candidate, first int) ([]int, bool) {
	set := []int{first}
	for len(set) < catSize {
		base := pairMinima(cs, set, -1)
		bk, bs := -1, math.Inf(-1)
		for k := range cs {
			if !p.fitsSlot(cs[k], len(set)) {
				continue
			}
			if s, ok := p.setScore(cs, set, base, -1, k); ok && s > bs+1e-9 {
				bk, bs = k, s
			}
		}
		if bk < 0 {
			return nil, false
		}
		set = append(set, bk)
	}
	return set, true
}

// improveSet replaces one colour at a time by the candidate that improves
// the score most (the first slot only by another first colour), until no
// single swap helps.
func (p catParams) improveSet(cs []candidate, set []int) (score float64) {
	base := pairMinima(cs, set[1:], -1)
	score, _ = p.setScore(cs, set[1:], base, -1, set[0])
	for {
		improved := false
		for slot := range set {
			base := pairMinima(cs, set, slot)
			for k := range cs {
				if slot == 0 && !p.isFirst(cs[k]) || !p.fitsSlot(cs[k], slot) {
					continue
				}
				if s, ok := p.setScore(cs, set, base, slot, k); ok && s > score+1e-9 {
					set[slot], score, improved = k, s, true
				}
			}
		}
		if !improved {
			return score
		}
	}
}

// search finds the categorical palette among the candidates cs in two
// steps. The set: greedy growth from evenly spaced first colours, each
// followed by single-swap local search (first improvement, fixed order), all
// under lexScore. The order: see order. It returns nil if no start meets the
// family rule.
func (p catParams) search(cs []candidate) []palette.SRGB {
	var firsts []int
	for k, c := range cs {
		if p.isFirst(c) {
			firsts = append(firsts, k)
		}
	}
	var best []int
	bs := math.Inf(-1)
	for i := 0; i < len(firsts); i += len(firsts)/p.starts + 1 {
		set, ok := p.greedySet(cs, firsts[i])
		if !ok {
			continue
		}
		if s := p.improveSet(cs, set); s > bs+1e-9 {
			bs, best = s, set
		}
	}
	if best == nil {
		return nil
	}
	best = p.order(cs, best)
	out := make([]palette.SRGB, catSize)
	for i, k := range best {
		out[i] = cs[k].c
	}
	return out
}

// designCategorical searches for the categorical palette with the settings
// catDesign.
func designCategorical() []palette.SRGB {
	return catDesign.search(categoricalCandidates())
}

// order returns set reordered so that its prefixes make good palettes: the
// first colour stays first, and of the 7! orderings of the others it takes
// the one with the highest sum over prefixes of the worst case relative to
// the aim for that size (capped, so that one very distinct pair cannot buy
// a poor prefix elsewhere) and of the evenness of the hues. Ties go to the
// first ordering in lexicographic order.
func (p catParams) order(cs []candidate, set []int) []int {
	n := len(set)
	d := make([][]float64, n)
	for i := range d {
		d[i] = make([]float64, n)
		for j := range d[i] {
			if i != j {
				d[i][j] = math.Inf(1)
				for v := range 4 {
					d[i][j] = math.Min(d[i][j], palette.DeltaE2000(cs[set[i]].lab[v], cs[set[j]].lab[v]))
				}
			}
		}
	}
	perm := make([]int, n)
	for i := range perm {
		perm[i] = i
	}
	best, bs := slices.Clone(perm), math.Inf(-1)
	for {
		if s := p.orderScore(cs, set, d, perm); s > bs+1e-9 && p.fitsOrder(cs, set, perm) {
			bs = s
			copy(best, perm)
		}
		if !nextPermutation(perm[1:]) {
			break
		}
	}
	out := make([]int, n)
	for i, k := range best {
		out[i] = set[k]
	}
	return out
}

func (p catParams) orderScore(cs []candidate, set []int, d [][]float64, perm []int) float64 {
	var s float64
	worst := math.Inf(1)
	trial := make([]int, 0, len(perm))
	trial = append(trial, set[perm[0]])
	for k := 1; k < len(perm); k++ {
		for j := 0; j < k; j++ {
			worst = math.Min(worst, d[perm[k]][perm[j]])
		}
		trial = append(trial, set[perm[k]])
		s += math.Min(p.aimCap, worst/p.aim[k+1]) + p.orderEvenW*evenness(cs, trial)
	}
	return s
}

func (p catParams) fitsOrder(cs []candidate, set, perm []int) bool {
	for i, k := range perm {
		if !p.fitsSlot(cs[set[k]], i) {
			return false
		}
	}
	return true
}

// nextPermutation rearranges a into the next permutation in lexicographic
// order, reporting false after the last.
func nextPermutation(a []int) bool {
	i := len(a) - 2
	for i >= 0 && a[i] >= a[i+1] {
		i--
	}
	if i < 0 {
		return false
	}
	j := len(a) - 1
	for a[j] <= a[i] {
		j--
	}
	a[i], a[j] = a[j], a[i]
	slices.Reverse(a[i+1:])
	return true
}
