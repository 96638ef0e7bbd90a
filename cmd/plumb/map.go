package main

import (
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"slices"
	"strconv"
	"strings"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/geojson"

	"plumb/internal/stats"
	"plumb/render"
)

// mapRun is one run of plumb map: the options the builder receives and the
// columns and shapes to join.
type mapRun struct {
	shared
	opt                        render.MapOptions
	region, value, shapes, key string
	per, breaks                string
	feats                      []*geojson.Feature // the shapes, read once for every panel
}

func newMap() *mapRun {
	r := &mapRun{}
	r.shared = newShared(&r.opt.Common)
	return r
}

func (r *mapRun) base() *shared { return &r.shared }

// projections are the values of --projection.
var projections = []string{"albers", "equal-earth", "lambert", "equirectangular"}

func (r *mapRun) flags() []flagDef {
	o := &r.opt
	defs := []flagDef{
		{name: "region", arg: "COLUMN", usage: "column naming each row's region (default: the first column)", value: stringValue{&r.region}},
		{name: "value", arg: "COLUMN", usage: "column with the values (default: the first numeric column after the regions)", value: stringValue{&r.value}},
		{name: "shapes", arg: "FILE", usage: "GeoJSON file of the regions' outlines (Polygon and MultiPolygon features)", value: stringValue{&r.shapes}},
		{name: "key", arg: "PROPERTY", usage: "feature property that holds the region names (default: the property that matches the region column best)", value: stringValue{&r.key}},
		{name: "per", sets: []string{"Per", "PerArea"}, arg: "COLUMN|area", usage: "divide each value by COLUMN (such as population) or by the region's area in km²: a rate, not a count", value: stringValue{&r.per}},
		{name: "classes", sets: []string{"Classes"}, arg: "N", def: "5", usage: "number of colour classes", value: intValue{&o.Classes}},
		{name: "breaks", sets: []string{"Breaks", "BreakList"}, arg: "natural|quantile|equal|nice|none|LIST", def: "natural", usage: "how to set the class limits: natural breaks (Fisher), quantiles, equal widths, nice numbers, none (a continuous scale), or inner limits as comma-separated numbers", value: stringValue{&r.breaks}},
		{name: "mid", sets: []string{"Mid"}, arg: "NUMBER", usage: "centre of a diverging scale (default 0 when values take both signs)", value: numberValue{&o.Mid}},
		{name: "projection", sets: []string{"Projection"}, values: projections, usage: "map projection (default: equal-area, chosen for the extent)", value: choiceValue[string]{p: &o.Projection, values: projections}},
		{name: "labels", sets: []string{"Labels"}, usage: "name the regions where the name fits inside", value: boolValue{&o.Labels}},
		{name: "unit", sets: []string{"Unit"}, arg: "UNIT", usage: "unit of the values, such as % (default: the sign the cells carry)", value: stringValue{&o.Unit}},
		{name: "value-name", sets: []string{"ValueName"}, arg: "TEXT", usage: "what the values measure, for the key (default: the value column's name)", value: stringValue{&o.ValueName}},
	}
	return append(defs, r.shared.flags()...)
}

func (r *mapRun) load(path string, stdin io.Reader, _ func(string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error) {
	t, notes, err := r.readTable(path, stdin, nil)
	if err != nil {
		return nil, nil, err
	}
	names, values, more, err := r.valuesOf(t, nil)
	if err != nil {
		return nil, nil, err
	}
	regions, jn, err := joinShapes(r.shapes, r.feats, r.key, names, r.region)
	if err != nil {
		return nil, nil, err
	}
	notes = append(append(notes, more...), jn...)
	return notes, func(w io.Writer) ([]render.Note, error) { return render.Map(w, regions, names, values, r.opt) }, nil
}

// parseBreaks reads --breaks: a method name or a list of inner limits.
func (r *mapRun) parseBreaks() error {
	switch r.breaks {
	case "", "natural", "quantile", "equal", "nice", "none":
		r.opt.Breaks = r.breaks
		return nil
	}
	for _, f := range strings.Split(r.breaks, ",") {
		v, err := strconv.ParseFloat(strings.TrimSpace(f), 64)
		if err != nil {
			return usagef("--breaks %q: give natural, quantile, equal, nice, none, or inner class limits such as 10,20,50", r.breaks)
		}
		r.opt.BreakList = append(r.opt.BreakList, v)
	}
	return nil
}

// perColumn is the column --per divides by, "" for none or area.
func (r *mapRun) perColumn() string {
	if r.per != "" && r.per != "area" {
		return r.per
	}
	return ""
}

// readValuesTable reads the data file and settles the region and value
// columns; keep are further columns to read (the --by column).
func (r *mapRun) readValuesTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error) {
	perCol := r.perColumn()
	r.opt.PerArea = r.per == "area"
	var want []string
	if r.region != "" && r.value != "" {
		want = []string{r.region, r.value}
		if perCol != "" {
			want = append(want, perCol)
		}
		want = append(want, keep...)
	}
	t, notes, err := readData(path, r.readOptions(), want, stdin)
	if err != nil {
		return nil, nil, err
	}
	if r.region == "" && len(t.Header) > 0 {
		r.region = t.Header[0]
	}
	if !t.Has(r.region) {
		return nil, nil, t.missingColumn(r.region, 1)
	}
	if r.value == "" {
		cols, err := t.NumericColumns(r.region, nil, 1, false)
		if err != nil {
			return nil, nil, err
		}
		if len(cols) == 0 {
			return nil, nil, tooFewColumns(t, "a map needs a region column and a value column")
		}
		r.value = cols[0]
		notes = append(notes, render.Note{Code: "columns", Text: fmt.Sprintf("using column %q for regions and %q for values (choose with --region and --value)", r.region, r.value)})
	}
	return t, notes, nil
}

// valuesOf reads the names and values of the given rows of t (nil: every
// row), each divided by --per COLUMN when given; rows without a value are
// left out with a note.
func (r *mapRun) valuesOf(t *Table, only []int) ([]string, []float64, []render.Note, error) {
	perCol := r.perColumn()
	n, err := t.ReadNumbers(r.value)
	if err != nil {
		return nil, nil, nil, err
	}
	if r.opt.Unit == "" {
		r.opt.Unit = n.Unit
	}
	if r.opt.ValueName == "" {
		r.opt.ValueName = r.value
	}
	notes := renderNotes(n.Notes)
	var den []float64
	if perCol != "" {
		d, err := t.ReadNumbers(perCol)
		if err != nil {
			return nil, nil, nil, err
		}
		den = d.Values
		r.opt.Per = "per " + perCol
	}
	rows := only
	if rows == nil {
		rows = make([]int, len(n.Values))
		for i := range rows {
			rows[i] = i
		}
	}
	all := t.Strings(r.region)
	var names []string
	var values []float64
	var skipped []int
	for _, i := range rows {
		v := n.Values[i]
		if v != v {
			skipped = append(skipped, i)
			continue
		}
		if den != nil {
			d := den[i]
			if d != d {
				skipped = append(skipped, i)
				continue
			}
			if d == 0 {
				return nil, nil, nil, &DataError{File: t.File, Line: t.Line(i), Column: perCol, Text: "0", Err: errors.New("cannot divide by zero"), Hint: "give the row a non-zero " + perCol + " or leave it out"}
			}
			v /= d
		}
		names, values = append(names, all[i]), append(values, v)
	}
	if len(skipped) > 0 {
		notes = append(notes, skippedNote(t, skipped, r.value))
	}
	if len(values) == 0 {
		return nil, nil, nil, &DataError{File: t.File, Column: r.value, Err: ErrEmpty, Hint: "every row lacks a value; check the column name and the file"}
	}
	return names, values, notes, nil
}

// The panel side of maps (panelChart): one map per value of --by, all in
// one set of classes, and maps in figure files.

func (r *mapRun) readTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error) {
	t, notes, err := r.readValuesTable(path, stdin, keep)
	if err != nil {
		return nil, nil, err
	}
	if r.shapes == "" {
		return nil, nil, usagef("give the regions' outlines with --shapes FILE.geojson")
	}
	if err := r.parseBreaks(); err != nil {
		return nil, nil, err
	}
	feats, err := readShapes(r.shapes)
	if err != nil {
		return nil, nil, err
	}
	r.feats = feats
	if keep == nil || len(r.opt.BreakList) > 0 {
		return t, notes, nil
	}
	// Small multiples of maps share one set of classes, chosen from every
	// row, so that a colour means one range of values in every panel.
	if r.opt.Breaks == "none" || r.opt.PerArea {
		return nil, nil, usagef("--by draws every map in one set of classes chosen from all rows: give --breaks natural, quantile, equal, nice or a list (not none), and --per COLUMN rather than area")
	}
	_, values, _, err := r.valuesOf(t, nil)
	if err != nil {
		return nil, nil, err
	}
	k := r.opt.Classes
	if k == 0 {
		k = 5
	}
	var edges []float64
	switch r.opt.Breaks {
	case "quantile":
		edges = stats.QuantileBreaks(values, k)
	case "equal":
		edges = stats.EqualBreaks(values, k)
	case "nice":
		edges = stats.NiceBreaks(values, k)
	default:
		edges = stats.NaturalBreaks(values, k)
	}
	if len(edges) > 2 {
		r.opt.BreakList = edges[1 : len(edges)-1]
	}
	return t, notes, nil
}

func (r *mapRun) panel(t *Table, rows []int, c render.Common, _ func(string) bool) (panelPart, error) {
	names, values, notes, err := r.valuesOf(t, rows)
	if err != nil {
		return panelPart{}, err
	}
	regions, jn, err := joinShapes(r.shapes, r.feats, r.key, names, r.region)
	if err != nil {
		return panelPart{}, err
	}
	opt := r.opt // a copy: every panel starts from the flags
	opt.Common = c
	return panelPart{panel: render.MapPanel(regions, names, values, opt), notes: append(notes, jn...), size: sizeOf(values, false)}, nil
}

// shares: maps share their classes (readTable), not an axis.
func (r *mapRun) shares() (x, y bool) { return false, false }

// readShapes reads the features of a GeoJSON file (RFC 7946).
func readShapes(path string) ([]*geojson.Feature, error) {
	b, err := os.ReadFile(path)
	if err != nil {
		return nil, fmt.Errorf("--shapes: %w", err)
	}
	fc, err := geojson.UnmarshalFeatureCollection(b)
	if err != nil {
		return nil, fmt.Errorf("%s: not a GeoJSON FeatureCollection: %v", path, err)
	}
	return fc.Features, nil
}

// propText is a feature property as text: strings as they are, numbers as
// a reader writes them.
func propText(v any) (string, bool) {
	switch x := v.(type) {
	case string:
		return x, true
	case float64:
		return strconv.FormatFloat(x, 'f', -1, 64), true
	case bool:
		return strconv.FormatBool(x), true
	}
	return "", false
}

// joinShapes matches rows to features by a property: key when given, else
// the property whose values match the most region names. It reports rows
// without a shape and shapes without a row in notes; no match at all is an
// error naming a few values from each side.
func joinShapes(file string, feats []*geojson.Feature, key string, names []string, regionCol string) ([]render.Region, []render.Note, error) {
	var props []string
	for _, f := range feats {
		for k := range f.Properties {
			if !slices.Contains(props, k) {
				props = append(props, k)
			}
		}
	}
	slices.Sort(props)
	want := map[string]bool{}
	for _, n := range names {
		want[n] = true
	}
	matches := func(p string) int {
		n := 0
		seen := map[string]bool{}
		for _, f := range feats {
			if s, ok := propText(f.Properties[p]); ok && want[s] && !seen[s] {
				seen[s] = true
				n++
			}
		}
		return n
	}
	var notes []render.Note
	if key != "" {
		if !slices.Contains(props, key) {
			return nil, nil, fmt.Errorf("--key %q: no feature of %s has that property; properties are %s", key, file, strings.Join(props, ", "))
		}
	} else {
		best := -1
		for _, p := range props {
			if m := matches(p); m > best {
				key, best = p, m
			}
		}
		if key == "" {
			return nil, nil, fmt.Errorf("%s: the features have no properties to join %q on", file, regionCol)
		}
		notes = append(notes, render.Note{Code: "map-join", Text: fmt.Sprintf("joined rows to shapes on the property %q, which matches %d of %d region names (choose with --key)", key, best, len(want))})
	}
	var regions []render.Region
	have := map[string]bool{}
	var unmatched []string
	skippedGeom := 0
	for _, f := range feats {
		s, _ := propText(f.Properties[key])
		var mp orb.MultiPolygon
		switch g := f.Geometry.(type) {
		case orb.Polygon:
			mp = orb.MultiPolygon{g}
		case orb.MultiPolygon:
			mp = g
		default:
			skippedGeom++
			continue
		}
		if err := inDegrees(file, len(regions)+skippedGeom, s, mp); err != nil {
			return nil, nil, err
		}
		regions = append(regions, render.Region{Name: s, Shape: mp})
		have[s] = true
		if !want[s] {
			unmatched = append(unmatched, s)
		}
	}
	if skippedGeom > 0 {
		notes = append(notes, render.Note{Code: "map-geometry", Text: fmt.Sprintf("%d %s of %s not polygons and not drawn", skippedGeom, pluralS2(skippedGeom, "feature is", "features are"), file)})
	}
	var noShape []string
	for _, n := range names {
		if !have[n] && !slices.Contains(noShape, n) {
			noShape = append(noShape, n)
		}
	}
	if len(noShape) == len(want) {
		// Name a few values from each side: the rows' names and, for each
		// property the features carry, what its values look like.
		var sides []string
		for _, p := range props[:min(3, len(props))] {
			var sample []string
			for _, f := range feats[:min(3, len(feats))] {
				s, _ := propText(f.Properties[p])
				sample = append(sample, strconv.Quote(s))
			}
			sides = append(sides, fmt.Sprintf("%q: %s", p, strings.Join(sample, ", ")))
		}
		return nil, nil, fmt.Errorf("no region name matches a shape: rows have %s; the shapes' properties have %s; choose the property with --key or fix the names", quoteFew(names, 4), strings.Join(sides, "; "))
	}
	if len(noShape) > 0 {
		notes = append(notes, render.Note{Code: "map-no-shape", Changed: true, Text: fmt.Sprintf("%d %s no shape and %s not drawn: %s", len(noShape), pluralS(len(noShape), "row has"), pluralS2(len(noShape), "is", "are"), quoteFew(noShape, 6))})
	}
	if len(unmatched) > 0 {
		notes = append(notes, render.Note{Code: "map-no-data", Changed: true, Text: fmt.Sprintf("%d %s no row and %s drawn as no data: %s", len(unmatched), pluralS2(len(unmatched), "shape has", "shapes have"), pluralS2(len(unmatched), "is", "are"), quoteFew(unmatched, 6))})
	}
	return regions, notes, nil
}

func quoteFew(s []string, n int) string {
	q := make([]string, 0, n+1)
	for i, v := range s {
		if i == n {
			q = append(q, fmt.Sprintf("and %d more", len(s)-n))
			break
		}
		q = append(q, strconv.Quote(v))
	}
	return strings.Join(q, ", ")
}

func pluralS2(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

// inDegrees checks that feature i (from 0) of file is in longitude and
// latitude degrees, as RFC 7946 requires: a boundary file still in a
// projected system's metres is the usual mistake, named with its fix.
func inDegrees(file string, i int, name string, mp orb.MultiPolygon) error {
	for _, poly := range mp {
		for _, ring := range poly {
			for _, v := range ring {
				if math.Abs(v[0]) > 540 || math.Abs(v[1]) > 90 {
					return fmt.Errorf("%s: feature %d (%q) has a vertex at (%g, %g), outside longitude −180..180 and latitude −90..90: the file is probably in a projected system's metres; convert it to longitude and latitude in degrees (WGS 84, as GeoJSON requires)", file, i+1, name, v[0], v[1])
				}
			}
		}
	}
	return nil
}
