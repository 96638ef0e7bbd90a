package main

import (
	"cmp"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"plumb/internal/table"
	"plumb/render"
)

// Small multiples (--by COL): one panel per value of a column, every panel
// planned by the chart from its own rows of one table, laid out by
// render.Figure on one value scale unless --own-scales frees them.

// maxByPanels bounds --by. Past about five dozen panels a reader can no
// longer compare them and each is too small to read (common practice);
// the figure would also grow without end on a canvas whose height the
// chart chooses.
const maxByPanels = 60

// byGroup is the rows of one value of the --by column.
type byGroup struct {
	value string
	rows  []int // in file order
	first int   // the group's place in the file, for --by-order data
}

// splitRows groups the rows of t by their value in col, in order of first
// appearance, and returns the rows whose cell is empty apart.
func splitRows(t *Table, col string) (groups []byGroup, blank []int) {
	dict, codes := t.Codes(col)
	at := make([]int, len(dict)) // code -> position in groups, or -1
	for i := range at {
		at[i] = -1
	}
	for row, c := range codes {
		v := dict[c]
		if strings.TrimSpace(v) == "" {
			blank = append(blank, row)
			continue
		}
		if at[c] < 0 {
			at[c] = len(groups)
			groups = append(groups, byGroup{value: v, first: len(groups)})
		}
		g := &groups[at[c]]
		g.rows = append(g.rows, row)
	}
	return groups, blank
}

// runBy draws a chart's small multiples: the --by column splits the rows,
// the chart plans one panel per group and render lays them out.
func runBy(cmd command, ch chart, path string, stdin io.Reader, stdout, stderr io.Writer, given func(string) bool) int {
	sh := ch.base()
	names := sh.c.Names
	if sh.by == "" {
		return exitCode(usagef("--by-order and --own-scales arrange small multiples; give --by COLUMN too"), stderr)
	}
	pc, ok := ch.(panelChart)
	if !ok {
		why := "it cannot be split into panels"
		if g, ok := ch.(interface{ grid() string }); ok {
			why = g.grid()
		}
		return exitCode(usagef("--by %s: plumb %s draws no small multiples: %s", sh.by, cmd.name, why), stderr)
	}
	opt, panels, notes, err := byFigure(pc, path, stdin, given)
	if err != nil {
		return exitCode(flagWords(err, names), stderr)
	}
	return emit(cmd.name, sh, stdout, stderr, notes, func(w io.Writer) ([]render.Note, error) {
		drawn, err := render.Figure(w, opt, panels...)
		if err != nil {
			err = &byError{by: sh.by, panels: len(panels), err: err}
		}
		return drawn, flagWords(err, names)
	})
}

// byError is a figure of small multiples that could not be drawn: it says
// how many panels --by made and, when they do not fit the canvas at the
// medium's text size, that fewer panels would.
type byError struct {
	by     string
	panels int
	err    error
}

func (e *byError) Error() string {
	msg := fmt.Sprintf("--by %s made %d %s: %v", e.by, e.panels, plural(e.panels, "panel", "panels"), e.err)
	// The messages of a panel or a grid that lacks room say "fit" or "too
	// narrow"; the room is what more panels take away.
	if cause := e.err.Error(); strings.Contains(cause, " fit") || strings.Contains(cause, "too narrow") {
		msg += "; text is never set below the medium's minimum, so draw fewer panels: filter the rows, or choose a --by column with fewer values"
	}
	return msg
}

func (e *byError) Unwrap() error { return e.err }

// byFigure reads the data once, plans one panel per value of the --by
// column and returns the figure's options, its panels in --by-order and
// the notes of reading and planning.
func byFigure(pc panelChart, path string, stdin io.Reader, given func(string) bool) (render.FigureOptions, []render.Panel, []render.Note, error) {
	sh := pc.base()
	var opt render.FigureOptions
	t, notes, err := pc.readTable(path, stdin, []string{sh.by})
	if err != nil {
		return opt, nil, nil, err
	}
	if !t.Has(sh.by) {
		return opt, nil, nil, fmt.Errorf("--by: %w", t.MissingColumn(sh.by))
	}
	groups, blank := splitRows(t, sh.by)
	if len(groups) == 0 {
		return opt, nil, nil, &DataError{File: t.File, Column: sh.by, Err: ErrEmpty, Hint: "--by needs a column with values to split the rows by; every cell is empty"}
	}
	if len(groups) > maxByPanels {
		return opt, nil, nil, fmt.Errorf("%s: --by %s: the column has %d values, too many panels to compare (at most %d); choose a column with fewer values or filter the rows",
			table.DisplayName(t.File), sh.by, len(groups), maxByPanels)
	}
	if len(blank) > 0 {
		notes = append(notes, skippedNote(t, blank, sh.by))
	}
	parts := make([]panelPart, len(groups))
	for i, g := range groups {
		c := render.Common{Title: g.value, Annotations: sh.c.Annotations}
		p, err := pc.panel(t, g.rows, c, given)
		if err != nil {
			return opt, nil, nil, fmt.Errorf("--by %s, panel %q: %w", sh.by, g.value, err)
		}
		parts[i] = p
	}
	order := orderGroups(groups, parts, sh.byOrder)
	panels := make([]render.Panel, len(order))
	perPanel := make([][]render.Note, len(order))
	for i, k := range order {
		panels[i] = parts[k].panel
		perPanel[i] = parts[k].notes
	}
	titles := make([]string, len(order))
	for i, k := range order {
		titles[i] = groups[k].value
	}
	notes = append(notes, mergeNotes(titles, perPanel)...)
	notes = append(notes, render.Note{Code: "panels", Text: fmt.Sprintf("one panel per value of %q: %d %s, %s", sh.by, len(panels), plural(len(panels), "panel", "panels"), byOrderWords(sh.byOrder, parts))})
	x, y := pc.shares()
	if sh.ownScales {
		x, y = false, false
		notes = append(notes, render.Note{Code: "own-scales", Changed: true,
			Text: "each panel has its own value scale (--own-scales): equal lengths in two panels need not be equal amounts; compare panels by their tick labels"})
	}
	opt = render.FigureOptions{Common: *sh.c, ShareX: x, ShareY: y}
	opt.Notes = notes
	// The annotations are every panel's layers (given above), not the
	// figure's as well.
	opt.Annotations = render.Annotations{}
	return opt, panels, notes, nil
}

// orderGroups returns the positions of groups in --by-order: value (the
// largest panel first, ties in file order), label, or data.
func orderGroups(groups []byGroup, parts []panelPart, how string) []int {
	order := make([]int, len(groups))
	for i := range order {
		order[i] = i
	}
	switch render.Order(how) {
	case render.ByValue:
		slices.SortStableFunc(order, func(a, b int) int { return cmpSize(parts[b].size, parts[a].size) })
	case render.ByLabel:
		numeric := true
		nums := make([]float64, len(groups))
		for i, g := range groups {
			v, err := strconv.ParseFloat(strings.TrimSpace(g.value), 64)
			if err != nil || math.IsNaN(v) {
				numeric = false
				break
			}
			nums[i] = v
		}
		slices.SortStableFunc(order, func(a, b int) int {
			if numeric {
				return cmp.Compare(nums[a], nums[b])
			}
			if c := cmp.Compare(strings.ToLower(groups[a].value), strings.ToLower(groups[b].value)); c != 0 {
				return c
			}
			return cmp.Compare(groups[a].value, groups[b].value)
		})
	}
	return order
}

// cmpSize compares panel sizes with NaN (a panel without values) last.
func cmpSize(a, b float64) int {
	switch {
	case math.IsNaN(a) && math.IsNaN(b):
		return 0
	case math.IsNaN(a):
		return -1
	case math.IsNaN(b):
		return 1
	}
	return cmp.Compare(a, b)
}

// byOrderWords says how the panels are ordered, for the panels note.
func byOrderWords(how string, parts []panelPart) string {
	switch render.Order(how) {
	case render.ByLabel:
		return "ordered by value of the column (--by-order label)"
	case render.ByData:
		return "in the order of the file (--by-order data)"
	}
	what := "mean"
	if len(parts) > 0 && parts[0].total {
		what = "total"
	}
	return "largest " + what + " first (--by-order value)"
}

// sizeOf is the total or the mean of the finite values, NaN for none.
func sizeOf(values []float64, total bool) float64 {
	sum, n := 0.0, 0
	for _, v := range values {
		if !math.IsNaN(v) && !math.IsInf(v, 0) {
			sum += v
			n++
		}
	}
	switch {
	case n == 0:
		return math.NaN()
	case total:
		return sum
	}
	return sum / float64(n)
}

// mergeNotes joins the notes of the panels: a note every panel gave alike
// is said once; any other is said with the panel it belongs to.
func mergeNotes(titles []string, per [][]render.Note) []render.Note {
	count := map[render.Note]int{}
	for _, ns := range per {
		for _, n := range slices.Compact(slices.Clone(ns)) {
			count[n]++
		}
	}
	var out []render.Note
	for i, ns := range per {
		for _, n := range ns {
			if count[n] == len(per) {
				if !slices.Contains(out, n) {
					out = append(out, n)
				}
				continue
			}
			n.Text = fmt.Sprintf("panel %q: %s", titles[i], n.Text)
			out = append(out, n)
		}
	}
	return out
}

// plural is one or many.
func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}
