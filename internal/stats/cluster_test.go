package stats

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

// The worked examples of methods.md section 9 (reference folder, copied
// here): Ward heights as SciPy 1.10.1 linkage('ward') and R hclust
// ward.D2 report them, and optimal leaf ordering path lengths checked by
// brute force over all flips.
var workedExamples = []struct {
	name    string
	d       int
	data    []float64
	heights []float64
	olo     float64 // least path length over all orders the tree allows
}{
	{
		name:    "1-D points 4, 10, 0, 12, 1",
		d:       1,
		data:    []float64{4, 10, 0, 12, 1},
		heights: []float64{1, 2, 4.041452, 14.459138},
		olo:     12,
	},
	{
		name:    "2-D points (0,0) (0,1) (4,0) (4,1.5) (9,0) (9,2)",
		d:       2,
		data:    []float64{0, 0, 0, 1, 4, 0, 4, 1.5, 9, 0, 9, 2},
		heights: []float64{1, 1.5, 2, 5.667892, 11.447343},
		olo:     13.524938,
	},
}

func TestWardWorkedExamples(t *testing.T) {
	for _, c := range workedExamples {
		t.Run(c.name, func(t *testing.T) {
			n := len(c.data) / c.d
			tree, err := Ward(c.data, n, c.d)
			if err != nil {
				t.Fatal(err)
			}
			if len(tree.Merges) != n-1 {
				t.Fatalf("%d merges, want %d", len(tree.Merges), n-1)
			}
			for i, m := range tree.Merges {
				if math.Abs(m.Height-c.heights[i]) > 1e-6 {
					t.Errorf("merge %d height %.6f, want %.6f", i, m.Height, c.heights[i])
				}
			}
			order, optimal := tree.LeafOrder(c.data, c.d)
			if !optimal {
				t.Error("small tree not ordered optimally")
			}
			if got := PathLength(c.data, c.d, order); math.Abs(got-c.olo) > 1e-6 {
				t.Errorf("OLO path length %.6f (order %v), want %.6f", got, order, c.olo)
			}
		})
	}
}

// Example 1's merges in full: {0,1}, then {10,12} (leaves 1 and 3), then
// leaf 0 (value 4) with the first merge, then everything; methods.md
// section 9.
func TestWardExampleStructure(t *testing.T) {
	tree, err := Ward([]float64{4, 10, 0, 12, 1}, 5, 1)
	if err != nil {
		t.Fatal(err)
	}
	want := []Merge{{2, 4, 1, 2}, {1, 3, 2, 2}, {0, 5, 0, 3}, {6, 7, 0, 5}}
	for i, m := range tree.Merges {
		if m.Left != want[i].Left || m.Right != want[i].Right || m.Size != want[i].Size {
			t.Errorf("merge %d = %+v, want children %d, %d and size %d", i, m, want[i].Left, want[i].Right, want[i].Size)
		}
	}
}

// naiveWard is the textbook greedy agglomeration on a full matrix of
// squared distances with the Lance–Williams update for Ward (Lance &
// Williams 1967; coefficients in methods.md section 9): the reference the
// chain must agree with.
func naiveWard(data []float64, n, d int) []float64 {
	dd := make([][]float64, n)
	size := make([]float64, n)
	live := make([]bool, n)
	for i := range n {
		dd[i] = make([]float64, n)
		size[i], live[i] = 1, true
		for j := range n {
			var s float64
			for k := range d {
				t := data[i*d+k] - data[j*d+k]
				s += t * t
			}
			dd[i][j] = s
		}
	}
	var heights []float64
	for range n - 1 {
		bi, bj, best := -1, -1, math.Inf(1)
		for i := range n {
			for j := i + 1; j < n; j++ {
				if live[i] && live[j] && dd[i][j] < best {
					bi, bj, best = i, j, dd[i][j]
				}
			}
		}
		// Ward on squared Euclidean distances: the merge cost is half
		// the Lance–Williams value, the height its square root.
		heights = append(heights, math.Sqrt(best))
		for k := range n {
			if !live[k] || k == bi || k == bj {
				continue
			}
			nn := size[bi] + size[bj] + size[k]
			v := ((size[bi]+size[k])*dd[k][bi] + (size[bj]+size[k])*dd[k][bj] - size[k]*dd[bi][bj]) / nn
			dd[k][bi], dd[bi][k] = v, v
		}
		size[bi] += size[bj]
		live[bj] = false
	}
	return heights
}

// bruteOrder is the least path length over every flip of every merge.
func bruteOrder(tree *Dendrogram, data []float64, d int) float64 {
	k := len(tree.Merges)
	best := math.Inf(1)
	for mask := 0; mask < 1<<k; mask++ {
		var order []int
		var emit func(v int)
		emit = func(v int) {
			if v < tree.Leaves {
				order = append(order, v)
				return
			}
			m := tree.Merges[v-tree.Leaves]
			a, b := m.Left, m.Right
			if mask&(1<<(v-tree.Leaves)) != 0 {
				a, b = b, a
			}
			emit(a)
			emit(b)
		}
		emit(tree.Leaves + k - 1)
		best = min(best, PathLength(data, d, order))
	}
	return best
}

func TestWardAgainstBruteForce(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 7))
	for trial := range 200 {
		n := 2 + rng.IntN(8)
		d := 1 + rng.IntN(3)
		if trial%2 == 1 {
			d = 2*screenAxes + 1 + rng.IntN(8) // wide rows
		}
		data := make([]float64, n*d)
		for i := range data {
			data[i] = rng.NormFloat64() * 5 // no ties: with ties the hierarchy is not unique
		}
		tree, err := Ward(data, n, d)
		if err != nil {
			t.Fatal(err)
		}
		want := naiveWard(data, n, d)
		slices.Sort(want)
		for i, m := range tree.Merges {
			if math.Abs(m.Height-want[i]) > 1e-9*(1+want[i]) {
				t.Fatalf("trial %d (%v): merge %d height %g, want %g", trial, data, i, m.Height, want[i])
			}
		}
		checkTree(t, tree)
		order, _ := tree.LeafOrder(data, d)
		checkPermutation(t, order, n)
		if got, want := PathLength(data, d, order), bruteOrder(tree, data, d); math.Abs(got-want) > 1e-9*(1+want) {
			t.Fatalf("trial %d: OLO path %g, brute force %g", trial, got, want)
		}
		greedy := tree.greedyOrder(data, d)
		checkPermutation(t, greedy, n)
		if PathLength(data, d, greedy) < PathLength(data, d, order)-1e-9 {
			t.Fatalf("trial %d: the heuristic beat the optimum", trial)
		}
	}
}

// checkTree checks the merge list's invariants: children before parents,
// sizes adding up, heights never falling.
func checkTree(t *testing.T, tree *Dendrogram) {
	t.Helper()
	n := tree.Leaves
	used := make([]bool, n+len(tree.Merges))
	sizeOf := func(v int) int {
		if v < n {
			return 1
		}
		return tree.Merges[v-n].Size
	}
	for i, m := range tree.Merges {
		for _, c := range []int{m.Left, m.Right} {
			if c >= n+i || used[c] {
				t.Fatalf("merge %d uses cluster %d out of order or twice", i, c)
			}
			used[c] = true
			if c >= n && tree.Merges[c-n].Height > m.Height {
				t.Fatalf("merge %d lower than its child %d", i, c)
			}
		}
		if m.Size != sizeOf(m.Left)+sizeOf(m.Right) {
			t.Fatalf("merge %d size %d", i, m.Size)
		}
	}
}

func checkPermutation(t *testing.T, order []int, n int) {
	t.Helper()
	seen := make([]bool, n)
	if len(order) != n {
		t.Fatalf("order has %d leaves, want %d", len(order), n)
	}
	for _, v := range order {
		if v < 0 || v >= n || seen[v] {
			t.Fatalf("order %v is not a permutation", order)
		}
		seen[v] = true
	}
}

// structured makes n rows of d columns from a few smooth profiles (a bump
// at a different place per group, as in expression data) with noise, in
// shuffled order.
func structured(rng *rand.Rand, n, d int) []float64 {
	data := make([]float64, n*d)
	perm := rng.Perm(n)
	for i := range n {
		g := float64(perm[i]) / float64(n) * float64(d) // the bump drifts with the hidden row number
		for k := range d {
			x := float64(k) - g
			data[i*d+k] = 10*math.Exp(-x*x/8) + rng.NormFloat64()*0.5
		}
	}
	return data
}

// Issue 11: on shuffled structured data the cluster order must be at least
// three times smoother (sum of neighbour distances) than the input order.
func TestClusterOrderSmoother(t *testing.T) {
	cases := []struct {
		name string
		n, d int
		ord  func(*Dendrogram, []float64, int) []int
	}{
		{"optimal 60×12", 60, 12, func(tr *Dendrogram, x []float64, d int) []int { o, _ := tr.LeafOrder(x, d); return o }},
		{"optimal 300×20", 300, 20, func(tr *Dendrogram, x []float64, d int) []int { o, _ := tr.LeafOrder(x, d); return o }},
		{"heuristic 60×12", 60, 12, (*Dendrogram).greedyOrder},
		{"heuristic 2000×20", 2000, 20, (*Dendrogram).greedyOrder},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			rng := rand.New(rand.NewPCG(11, uint64(c.n)))
			data := structured(rng, c.n, c.d)
			tree, err := Ward(data, c.n, c.d)
			if err != nil {
				t.Fatal(err)
			}
			identity := make([]int, c.n)
			for i := range identity {
				identity[i] = i
			}
			order := c.ord(tree, data, c.d)
			checkPermutation(t, order, c.n)
			in, out := PathLength(data, c.d, identity), PathLength(data, c.d, order)
			if out*3 > in {
				t.Errorf("cluster order path %.1f, input order %.1f: only %.2f× smoother", out, in, in/out)
			}
		})
	}
}

func TestWardErrors(t *testing.T) {
	cases := []struct {
		name    string
		data    []float64
		n, d    int
		wantErr bool
	}{
		{"one row", []float64{1, 2}, 1, 2, false},
		{"no rows", nil, 0, 2, true},
		{"wrong length", []float64{1, 2, 3}, 2, 2, true},
		{"NaN", []float64{1, math.NaN()}, 2, 1, true},
		{"infinity", []float64{1, math.Inf(1)}, 1, 2, true},
	}
	for _, c := range cases {
		tree, err := Ward(c.data, c.n, c.d)
		if (err != nil) != c.wantErr {
			t.Errorf("%s: error %v, want error %v", c.name, err, c.wantErr)
		}
		if err == nil {
			order, _ := tree.LeafOrder(c.data, c.d)
			checkPermutation(t, order, c.n)
		}
	}
}

// Identical rows: every cost is zero, and the chain must still end (the
// tie rule keeps it from cycling).
func TestWardAllEqual(t *testing.T) {
	for _, d := range []int{3, 20} {
		data := make([]float64, 50*d)
		tree, err := Ward(data, 50, d)
		if err != nil {
			t.Fatal(err)
		}
		checkTree(t, tree)
		for _, m := range tree.Merges {
			if m.Height != 0 {
				t.Fatalf("height %g for identical rows", m.Height)
			}
		}
	}
}

// With the screening projection on (more than screenRows rows, wide rows),
// the heights still match the textbook agglomeration.
func TestWardScreenedAgainstNaive(t *testing.T) {
	rng := rand.New(rand.NewPCG(99, 1))
	for _, d := range []int{9, 16, 30} {
		n := screenRows + 40
		data := make([]float64, n*d)
		for i := range data {
			data[i] = rng.NormFloat64() * 3
		}
		tree, err := Ward(data, n, d)
		if err != nil {
			t.Fatal(err)
		}
		want := naiveWard(data, n, d)
		slices.Sort(want)
		for i, m := range tree.Merges {
			if math.Abs(m.Height-want[i]) > 1e-9*(1+want[i]) {
				t.Fatalf("%d×%d: merge %d height %g, want %g", n, d, i, m.Height, want[i])
			}
		}
	}
}
