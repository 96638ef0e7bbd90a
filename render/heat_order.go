package render

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strconv"

	"plumb/internal/stats"
)

// heatTree is the row dendrogram as drawn: the merges and each leaf's
// drawing position.
type heatTree struct {
	d   *stats.Dendrogram
	pos []int // data row -> drawing position
}

// order decides the row and column orders and records how.
func (p *heatPlan) order(f *frame) error {
	m := p.m
	nr, nc := len(m.Rows), len(m.Cols)
	var filled []float64 // the matrix with missing cells filled, for clustering
	if p.opt.RowOrder == HeatByCluster || p.opt.ColOrder == HeatByCluster {
		filled = fillMissing(m)
		if p.missing > 0 {
			f.scene.Note("heat-cluster-missing", false, fmt.Sprintf("for clustering, each of the %d missing cells counts as its column's mean", p.missing))
		}
	}
	var err error
	p.rowOrder, err = p.orderAxis(f, "rows", p.opt.RowOrder, m.Rows, nr, nc, filled, func(i int) []float64 { return m.Values[i*nc : i*nc+nc] }, false)
	if err != nil {
		return err
	}
	var filledT []float64
	if filled != nil && p.opt.ColOrder == HeatByCluster {
		filledT = make([]float64, nr*nc)
		for i := range nr {
			for j := range nc {
				filledT[j*nr+i] = filled[i*nc+j]
			}
		}
	}
	col := make([]float64, nr)
	p.colOrder, err = p.orderAxis(f, "columns", p.opt.ColOrder, m.Cols, nc, nr, filledT, func(j int) []float64 {
		for i := range nr {
			col[i] = m.Values[i*nc+j]
		}
		return col
	}, true)
	return err
}

// orderAxis orders n items (rows, or columns when transposed) of d values
// each. data is the filled matrix for clustering (items as rows), vals an
// item's values for ordering by mean.
func (p *heatPlan) orderAxis(f *frame, what string, o HeatOrder, labels []string, n, d int, data []float64, vals func(int) []float64, cols bool) ([]int, error) {
	order := make([]int, n)
	for i := range order {
		order[i] = i
	}
	switch o {
	case HeatByLabel:
		byLabel(order, labels)
	case HeatByValue:
		means := make([]float64, n)
		for i := range n {
			means[i] = meanOf(vals(i))
		}
		slices.SortStableFunc(order, func(a, b int) int { return cmp.Compare(means[b], means[a]) })
		f.scene.Note("heat-order", false, fmt.Sprintf("%s ordered by their mean, largest first", what))
	case HeatByCluster:
		if n < 3 {
			return order, nil
		}
		tree, err := stats.Ward(data, n, d)
		if err != nil {
			return nil, err
		}
		leaves, optimal := tree.LeafOrder(data, d)
		method := "leaves in the optimal order of Bar-Joseph et al. (2001), least total distance between neighbours"
		if !optimal {
			method = fmt.Sprintf("above %d %s, leaves flipped at each merge so that the rows that meet are closest (a fast approximation of the optimal order)", stats.OptimalOrderLimit, what)
		}
		f.scene.Note("heat-cluster", false, fmt.Sprintf("%s in cluster order: Ward linkage on Euclidean distances between the values as given, %s", what, method))
		order = leaves
		if !cols && p.opt.Tree {
			pos := make([]int, n)
			for i, r := range order {
				pos[r] = i
			}
			p.tree = &heatTree{d: tree, pos: pos}
		}
	}
	return order, nil
}

// byLabel sorts by label: numerically when every label is a number, else
// by text.
func byLabel(order []int, labels []string) {
	nums := make([]float64, len(labels))
	numeric := true
	for i, l := range labels {
		v, err := strconv.ParseFloat(l, 64)
		if err != nil {
			numeric = false
			break
		}
		nums[i] = v
	}
	slices.SortStableFunc(order, func(a, b int) int {
		if numeric {
			return cmp.Compare(nums[a], nums[b])
		}
		return cmp.Compare(labels[a], labels[b])
	})
}

// meanOf is the mean of the values that are present; -Inf for none, so
// that empty rows sort last.
func meanOf(v []float64) float64 {
	s, k := 0.0, 0
	for _, x := range v {
		if !math.IsNaN(x) {
			s += x
			k++
		}
	}
	if k == 0 {
		return math.Inf(-1)
	}
	return s / float64(k)
}

// fillMissing copies the matrix with each missing cell replaced by its
// column's mean (0 for a column with no value), so that Ward's distances
// are defined.
func fillMissing(m HeatMatrix) []float64 {
	nc := len(m.Cols)
	out := make([]float64, len(m.Values))
	copy(out, m.Values)
	for j := range nc {
		s, k := 0.0, 0
		for i := j; i < len(out); i += nc {
			if !math.IsNaN(out[i]) {
				s += out[i]
				k++
			}
		}
		mean := 0.0
		if k > 0 {
			mean = s / float64(k)
		}
		for i := j; i < len(out); i += nc {
			if math.IsNaN(out[i]) {
				out[i] = mean
			}
		}
	}
	return out
}
