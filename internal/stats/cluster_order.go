package stats

import (
	"math"
)

// OptimalOrderLimit is the largest number of leaves that LeafOrder orders
// optimally. The optimal ordering keeps two n×n tables (8·n² bytes each, 16
// MB at 1,000 rows) and takes O(n³) time in the worst case (about 0.2 s at
// 1,000 rows on one core, BenchmarkLeafOrder); above the limit LeafOrder
// uses the linear-memory flip heuristic instead.
const OptimalOrderLimit = 1000

// LeafOrder returns an order of the dendrogram's leaves that keeps the
// tree (every cluster's leaves stay together) and puts similar rows next to
// each other, and whether that order is optimal.
//
// Up to OptimalOrderLimit leaves it is the optimal leaf ordering of
// Bar-Joseph, Gifford & Jaakkola (2001): of the 2^(n−1) orders the tree
// allows (flipping the children of any merge), the one with the least sum
// of Euclidean distances between neighbouring rows, by their dynamic
// programme over the best cost M(v, l, r) of subtree v with outer leaves l
// and r. Above the limit, it is a greedy flip heuristic in linear memory:
// going up the tree, each merge puts its two children's orders next to each
// other in the one of the four orientations that makes the two leaves that
// meet closest.
//
// data is the row-major n×d matrix the dendrogram was made from.
func (t *Dendrogram) LeafOrder(data []float64, d int) (order []int, optimal bool) {
	n := t.Leaves
	if n <= 2 {
		order = make([]int, n)
		for i := range order {
			order[i] = i
		}
		return order, true
	}
	if n <= OptimalOrderLimit {
		return t.optimalOrder(data, d), true
	}
	return t.greedyOrder(data, d), false
}

// PathLength is the sum of Euclidean distances between the rows of data
// that order puts next to each other: the quantity leaf ordering minimises.
func PathLength(data []float64, d int, order []int) float64 {
	var s float64
	for i := 1; i < len(order); i++ {
		s += rowDistance(data, d, order[i-1], order[i])
	}
	return s
}

func rowDistance(data []float64, d, a, b int) float64 {
	ra := data[a*d : a*d+d]
	rb := data[b*d : b*d+d]
	var s float64
	for k := range ra {
		t := ra[k] - rb[k]
		s += t * t
	}
	return math.Sqrt(s)
}

// children returns the two children of cluster v (v ≥ Leaves).
func (t *Dendrogram) children(v int) (int, int) {
	m := t.Merges[v-t.Leaves]
	return m.Left, m.Right
}

// greedyOrder is the linear-memory heuristic: each cluster's order is kept
// as its two end leaves and a flip bit per merge, decided bottom-up.
func (t *Dendrogram) greedyOrder(data []float64, d int) []int {
	n := t.Leaves
	total := n + len(t.Merges)
	first := make([]int, total)
	last := make([]int, total)
	flipL := make([]bool, len(t.Merges))
	flipR := make([]bool, len(t.Merges))
	for i := range n {
		first[i], last[i] = i, i
	}
	for i, m := range t.Merges {
		a, b := m.Left, m.Right
		// Which end of a meets which end of b: (last a, first b), then a
		// reversed, b reversed, both reversed; the first least wins.
		cand := [4][2]int{{last[a], first[b]}, {first[a], first[b]}, {last[a], last[b]}, {first[a], last[b]}}
		best, bestD := 0, math.Inf(1)
		for k, p := range cand {
			if dist := rowDistance(data, d, p[0], p[1]); dist < bestD {
				best, bestD = k, dist
			}
		}
		flipL[i] = best == 1 || best == 3
		flipR[i] = best == 2 || best == 3
		v := n + i
		first[v], last[v] = first[a], last[b]
		if flipL[i] {
			first[v] = last[a]
		}
		if flipR[i] {
			last[v] = first[b]
		}
	}
	order := make([]int, 0, n)
	type item struct {
		v   int
		rev bool
	}
	stack := []item{{total - 1, false}}
	for len(stack) > 0 {
		it := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		if it.v < n {
			order = append(order, it.v)
			continue
		}
		i := it.v - n
		l := item{t.Merges[i].Left, it.rev != flipL[i]}
		r := item{t.Merges[i].Right, it.rev != flipR[i]}
		if it.rev {
			l, r = r, l
		}
		// Push the right part first so that the left part comes out first.
		stack = append(stack, r, l)
	}
	return order
}

// optimalOrder is Bar-Joseph et al.'s dynamic programme. Leaves are
// renumbered by their position in a depth-first walk, so that every
// cluster's leaves, and each of its children's, are a contiguous range.
// Each pair of leaves (l, r) has exactly one lowest common ancestor, so one
// n×n table holds M(v, l, r) for every v: the least path length of an order
// of v's leaves that starts at l and ends at r, l and r in different
// children of v. The inner minimum is split in two (first over the leaf m
// that ends the left part, then over the leaf k that starts the right
// part), so a merge of parts of sizes p and q costs O(p·q·(p+q)).
func (t *Dendrogram) optimalOrder(data []float64, d int) []int {
	n := t.Leaves
	w := t.walk()
	dist := make([]float64, n*n)
	for a := range n {
		for b := a + 1; b < n; b++ {
			x := rowDistance(data, d, w.leaf[a], w.leaf[b])
			dist[a*n+b], dist[b*n+a] = x, x
		}
	}
	m := make([]float64, n*n)
	var tmp []float64
	for i := range t.Merges {
		a, b := t.children(n + i)
		tmp = w.join(m, dist, n, a, b, tmp)
	}
	root := n + len(t.Merges) - 1
	ra, rb := t.children(root)
	bl, br, best := -1, -1, math.Inf(1)
	for l := w.start[ra]; l < w.end[ra]; l++ {
		for r := w.start[rb]; r < w.end[rb]; r++ {
			if c := m[l*n+r]; c < best {
				bl, br, best = l, r, c
			}
		}
	}
	pos := w.unfold(make([]int, 0, n), m, dist, n, root, bl, br)
	for i, p := range pos {
		pos[i] = w.leaf[p]
	}
	return pos
}

// treeWalk places every cluster's leaves at a contiguous range of
// positions [start, end), its first child's at [start, mid).
type treeWalk struct {
	t               *Dendrogram
	leaf            []int // the leaf at each position
	start, mid, end []int // per cluster number
}

func (t *Dendrogram) walk() *treeWalk {
	n := t.Leaves
	total := n + len(t.Merges)
	w := &treeWalk{t: t, leaf: make([]int, 0, n), start: make([]int, total), mid: make([]int, total), end: make([]int, total)}
	// Iterative post-order walk: the tree may be n deep.
	type item struct {
		v    int
		done bool
	}
	stack := []item{{total - 1, false}}
	for len(stack) > 0 {
		it := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		v := it.v
		if v < n {
			w.start[v], w.mid[v] = len(w.leaf), len(w.leaf)
			w.leaf = append(w.leaf, v)
			w.end[v] = len(w.leaf)
			continue
		}
		a, b := t.children(v)
		if it.done {
			w.start[v], w.mid[v], w.end[v] = w.start[a], w.start[b], w.end[b]
			continue
		}
		stack = append(stack, item{v, true}, item{b, false}, item{a, false})
	}
	return w
}

// opposite is the range of positions that can end an order of cluster v
// that starts at position p: the other child's leaves (p itself for a
// leaf).
func (w *treeWalk) opposite(v, p int) (int, int) {
	switch {
	case v < w.t.Leaves:
		return p, p + 1
	case p < w.mid[v]:
		return w.mid[v], w.end[v]
	}
	return w.start[v], w.mid[v]
}

// join fills M(v, l, r) for l among a's positions and r among b's (and the
// mirror entries), where v is the merge of a and b.
func (w *treeWalk) join(m, dist []float64, n, a, b int, tmp []float64) []float64 {
	sa, ea, sb, eb := w.start[a], w.end[a], w.start[b], w.end[b]
	q := eb - sb
	if cap(tmp) < (ea-sa)*q {
		tmp = make([]float64, (ea-sa)*q)
	}
	tmp = tmp[:(ea-sa)*q]
	// tmp(l, k) = min over m opposite l in a of M(l, m) + D(m, k).
	for l := sa; l < ea; l++ {
		lo, hi := w.opposite(a, l)
		row := tmp[(l-sa)*q : (l-sa+1)*q]
		for k := sb; k < eb; k++ {
			best := math.Inf(1)
			for mm := lo; mm < hi; mm++ {
				if c := m[l*n+mm] + dist[mm*n+k]; c < best {
					best = c
				}
			}
			row[k-sb] = best
		}
	}
	// M(l, r) = min over k opposite r in b of tmp(l, k) + M(k, r).
	for r := sb; r < eb; r++ {
		lo, hi := w.opposite(b, r)
		for l := sa; l < ea; l++ {
			row := tmp[(l-sa)*q : (l-sa+1)*q]
			best := math.Inf(1)
			for k := lo; k < hi; k++ {
				if c := row[k-sb] + m[k*n+r]; c < best {
					best = c
				}
			}
			m[l*n+r], m[r*n+l] = best, best
		}
	}
	return tmp
}

// unfold appends the positions of cluster v's best order from position x to
// position y (x and y in different children of v, or x = y = v for a leaf).
func (w *treeWalk) unfold(out []int, m, dist []float64, n, v, x, y int) []int {
	if v < w.t.Leaves {
		return append(out, x)
	}
	a, b := w.t.children(v)
	if x >= w.mid[v] { // x lies in the second child
		a, b = b, a
	}
	mlo, mhi := w.opposite(a, x)
	klo, khi := w.opposite(b, y)
	bm, bk, best := -1, -1, math.Inf(1)
	for mm := mlo; mm < mhi; mm++ {
		for k := klo; k < khi; k++ {
			if c := m[x*n+mm] + dist[mm*n+k] + m[k*n+y]; c < best {
				bm, bk, best = mm, k, c
			}
		}
	}
	out = w.unfold(out, m, dist, n, a, x, bm)
	return w.unfold(out, m, dist, n, b, bk, y)
}
