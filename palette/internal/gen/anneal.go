package main

import (
	"math"
	"slices"

	"plumb/palette"
)

// The categorical search is simulated annealing (Kirkpatrick, Gelatt &
// Vecchi 1983) over eight colours in OKLCH, restarted from several random
// starts, followed by an exhaustive search for the order.
//
// The objective is the worst case the palette is judged by: the smallest
// CIEDE2000 distance between two of the eight colours over normal, protan,
// deutan and tritan vision (Machado et al. 2009, full severity). Every rule
// of catRules and every colour constraint (categoricalColour) is hard: a
// move that breaks one is refused. Because the smallest distance moves only
// when the closest pair moves, the walk climbs a soft minimum instead,
// -tau*log(sum exp(-d/tau)) over the 28 pairs' worst cases, which rises
// when any near-closest pair moves apart; the best state of each run is the
// one with the highest true worst case (ties: highest soft minimum).
//
// The order is chosen afterwards, among the orders of the best set that
// obey the slot rules (blue first, the lead pair, the third hue), by the
// worst cases of the prefixes compared lexicographically: n = 2 first, then
// n = 3, and so on. So the whole palette is as strong as the search could
// make it, and each prefix is the strongest the set allows given the
// prefixes before it.
//
// Everything is deterministic: a fixed-seed generator (splitmix64, Steele,
// Lea & Flood 2014), no maps, no clocks, and runs compared in index order.

// annealParams are the knobs of the search.
type annealParams struct {
	runs  int     // independent restarts
	steps int     // moves per run
	seed  uint64  // seed of run 0; run k uses seed + k
	t0    float64 // starting temperature, in CIEDE2000 units of the soft minimum
	t1    float64 // final temperature
	tau   float64 // softness of the soft minimum, CIEDE2000 units
	jump  float64 // share of moves that replace a colour by a random one
}

var annealDesign = annealParams{
	runs:  200,
	steps: 20000,
	seed:  0x706c756d62, // "plumb"
	t0:    0.5,
	t1:    0.01,
	tau:   0.3,
	jump:  0.05,
}

// rng is splitmix64: tiny, fast and fully specified, so the search gives the
// same palette on every Go release.
type rng struct{ s uint64 }

func (r *rng) next() uint64 {
	r.s += 0x9e3779b97f4a7c15
	z := r.s
	z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9
	z = (z ^ (z >> 27)) * 0x94d049bb133111eb
	return z ^ (z >> 31)
}

// float returns a uniform number in [0, 1).
func (r *rng) float() float64 { return float64(r.next()>>11) / (1 << 53) }

// normal returns a standard normal deviate (Box-Muller).
func (r *rng) normal() float64 {
	u := 1 - r.float() // (0, 1]
	return math.Sqrt(-2*math.Log(u)) * math.Cos(2*math.Pi*r.float())
}

// annealRun is one run's outcome.
type annealRun struct {
	run   int
	set   []candidate
	worst float64
	soft  float64
}

// randomColour draws a colour that fits slot of set, or false after many
// tries.
func (p annealParams) randomColour(r *rng, rules catRules, set []candidate, slot int) (palette.OKLCH, candidate, bool) {
	for range 10000 {
		lch := palette.OKLCH{
			L: catMinL + (1-catMinL)*r.float(),
			C: catMinChroma + (catMaxChroma-catMinChroma)*r.float(),
			H: 360 * r.float(),
		}
		if slot == 0 {
			lch.H = rules.firstLo + (rules.firstHi-rules.firstLo)*r.float()
		}
		k, ok := categoricalColour(lch)
		if !ok {
			continue
		}
		trial := slices.Clone(set)
		trial[slot] = k
		if rules.fitsPartial(trial, slot) {
			return lch, k, true
		}
	}
	return palette.OKLCH{}, candidate{}, false
}

// fitsPartial checks the rules for the colours up to and including slot.
func (r catRules) fitsPartial(set []candidate, slot int) bool {
	for i := 0; i <= slot; i++ {
		if !r.fitsSlot(set[i], i, set) {
			return false
		}
		for j := range i {
			if r.sameFamily(set[i], set[j]) {
				return false
			}
		}
	}
	return true
}

func softMin(d *[catSize][catSize]float64, tau float64) (hard, soft float64) {
	hard = math.Inf(1)
	for i := range catSize {
		for j := i + 1; j < catSize; j++ {
			hard = math.Min(hard, d[i][j])
		}
	}
	var s float64
	for i := range catSize {
		for j := i + 1; j < catSize; j++ {
			s += math.Exp(-(d[i][j] - hard) / tau)
		}
	}
	return hard, hard - tau*math.Log(s)
}

// anneal performs run number run.
func (p annealParams) anneal(rules catRules, run int) (annealRun, bool) {
	r := &rng{s: p.seed + uint64(run)}
	var lch [catSize]palette.OKLCH
	set := make([]candidate, catSize)
	// A random start that obeys the rules.
	for tries := 0; ; tries++ {
		ok := true
		for slot := range catSize {
			var k candidate
			lch[slot], k, ok = p.randomColour(r, rules, set, slot)
			if !ok {
				break
			}
			set[slot] = k
		}
		if ok && rules.fitsAll(set) {
			break
		}
		if tries > 1000 {
			return annealRun{}, false
		}
	}
	var d [catSize][catSize]float64
	for i := range catSize {
		for j := i + 1; j < catSize; j++ {
			d[i][j] = worstPair(set[i], set[j])
			d[j][i] = d[i][j]
		}
	}
	_, soft := softMin(&d, p.tau)
	soft -= floorWeight * rules.shortfall(&d)
	best := annealRun{run: run, worst: -1}
	trial := make([]candidate, catSize)
	var row [catSize]float64
	for step := range p.steps {
		frac := float64(step) / float64(p.steps)
		temp := p.t0 * math.Pow(p.t1/p.t0, frac)
		scale := math.Max(0.05, math.Sqrt(temp/p.t0))
		slot := int(r.next() % catSize)
		next := lch[slot]
		if r.float() < p.jump {
			next = palette.OKLCH{
				L: catMinL + (1-catMinL)*r.float(),
				C: catMinChroma + (catMaxChroma-catMinChroma)*r.float(),
				H: 360 * r.float(),
			}
		} else {
			next.L += 0.06 * scale * r.normal()
			next.C += 0.03 * scale * r.normal()
			next.H = math.Mod(next.H+40*scale*r.normal()+360, 360)
		}
		k, ok := categoricalColour(next)
		if !ok {
			continue
		}
		copy(trial, set)
		trial[slot] = k
		if !rules.fitsAll(trial) {
			continue
		}
		for j := range catSize {
			if j != slot {
				row[j] = worstPair(k, set[j])
			}
		}
		old := d
		for j := range catSize {
			if j != slot {
				d[slot][j], d[j][slot] = row[j], row[j]
			}
		}
		hard, s := softMin(&d, p.tau)
		short := rules.shortfall(&d)
		s -= floorWeight * short
		if s >= soft || r.float() < math.Exp((s-soft)/temp) {
			lch[slot], set[slot], soft = next, k, s
			if short == 0 && (hard > best.worst || hard == best.worst && s > best.soft) {
				best.worst, best.soft, best.set = hard, s, slices.Clone(set)
			}
		} else {
			d = old
		}
	}
	if best.set == nil {
		return best, false
	}
	return rules.polish(best, p.tau), true
}

// polish is a deterministic local search after the walk: each colour in
// turn is moved by fixed steps in OKLCH lightness, chroma and hue, at three
// scales, and a move is kept when it raises the worst case (or keeps it and
// raises the soft minimum) without breaking a rule or a floor, until no
// move helps.
func (r catRules) polish(best annealRun, tau float64) annealRun {
	set := slices.Clone(best.set)
	lch := make([]palette.OKLCH, len(set))
	for i, c := range set {
		lch[i] = palette.OKLCH{L: c.L, C: c.C, H: c.H}
	}
	var d [catSize][catSize]float64
	for i := range catSize {
		for j := i + 1; j < catSize; j++ {
			d[i][j] = worstPair(set[i], set[j])
			d[j][i] = d[i][j]
		}
	}
	trial := make([]candidate, catSize)
	for improved := true; improved; {
		improved = false
		for slot := range catSize {
			for _, sc := range []float64{4, 2, 1} {
				for _, dir := range [6][3]float64{{1, 0, 0}, {-1, 0, 0}, {0, 1, 0}, {0, -1, 0}, {0, 0, 1}, {0, 0, -1}} {
					next := palette.OKLCH{
						L: lch[slot].L + sc*0.004*dir[0],
						C: lch[slot].C + sc*0.004*dir[1],
						H: math.Mod(lch[slot].H+sc*1*dir[2]+360, 360),
					}
					k, ok := categoricalColour(next)
					if !ok || k.c == set[slot].c {
						continue
					}
					copy(trial, set)
					trial[slot] = k
					if !r.fitsAll(trial) {
						continue
					}
					old := d
					for j := range catSize {
						if j != slot {
							d[slot][j] = worstPair(k, set[j])
							d[j][slot] = d[slot][j]
						}
					}
					hard, s := softMin(&d, tau)
					if r.shortfall(&d) == 0 && (hard > best.worst || hard == best.worst && s > best.soft) {
						lch[slot], set[slot] = next, k
						best.worst, best.soft = hard, s
						improved = true
					} else {
						d = old
					}
				}
			}
		}
	}
	best.set = set
	return best
}

// floorWeight converts a prefix's shortfall below its floor into soft
// minimum units: large, so that the walk first climbs to the floors.
const floorWeight = 10

// shortfall is how far the prefixes of the set in slot order fall below
// their floors, summed, given the pairwise worst cases d; 0 when every
// floor is kept.
func (r catRules) shortfall(d *[catSize][catSize]float64) float64 {
	w, s := math.Inf(1), 0.0
	for k := 1; k < catSize; k++ {
		for j := range k {
			w = math.Min(w, d[k][j])
		}
		s += math.Max(0, r.floor[k+1]-w)
	}
	return s
}

// floorsMet is meetsFloors for the prefix worst cases w (n = 2, 3, ...).
func (r catRules) floorsMet(w []float64) bool {
	for i, x := range w {
		if x < r.floor[i+2] {
			return false
		}
	}
	return true
}

// prefixWorst is the worst case of each prefix n = 2..len(set) of the
// ordering perm of set, given the pairwise worst cases d.
func prefixWorst(d [][]float64, perm []int) []float64 {
	out := make([]float64, 0, len(perm)-1)
	w := math.Inf(1)
	for k := 1; k < len(perm); k++ {
		for j := range k {
			w = math.Min(w, d[perm[k]][perm[j]])
		}
		out = append(out, w)
	}
	return out
}

// order returns set in the order whose prefix worst cases are
// lexicographically largest, among the orders that keep the first colour
// first and obey the rules. Ties go to the first order in lexicographic
// order of the permutation.
func (r catRules) order(set []candidate) []candidate {
	n := len(set)
	d := make([][]float64, n)
	for i := range d {
		d[i] = make([]float64, n)
		for j := range d[i] {
			if i != j {
				d[i][j] = worstPair(set[i], set[j])
			}
		}
	}
	perm := make([]int, n)
	for i := range perm {
		perm[i] = i
	}
	var best, bestW []float64
	var bestPerm []int
	trial := make([]candidate, n)
	for {
		for i, k := range perm {
			trial[i] = set[k]
		}
		if w := prefixWorst(d, perm); r.fitsAll(trial) && r.floorsMet(w) {
			if best == nil || slices.Compare(w, bestW) > 0 {
				best, bestW, bestPerm = w, w, slices.Clone(perm)
			}
		}
		if !nextPermutation(perm[1:]) {
			break
		}
	}
	if bestPerm == nil {
		return nil
	}
	out := make([]candidate, n)
	for i, k := range bestPerm {
		out[i] = set[k]
	}
	return out
}

// search runs the annealing runs listed (all of them when runs is nil) and
// returns the best palette in its order, with the run that found it.
func (p annealParams) search(rules catRules, runs []int) ([]palette.SRGB, int) {
	if runs == nil {
		for k := range p.runs {
			runs = append(runs, k)
		}
	}
	var best annealRun
	found := false
	for _, k := range runs {
		res, ok := p.anneal(rules, k)
		if !ok {
			continue
		}
		if !found || res.worst > best.worst || res.worst == best.worst && res.soft > best.soft {
			best, found = res, true
		}
	}
	if !found {
		return nil, -1
	}
	ordered := rules.order(best.set)
	if ordered == nil {
		return nil, -1
	}
	out := make([]palette.SRGB, len(ordered))
	for i, k := range ordered {
		out[i] = k.c
	}
	return out, best.run
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
