package render

import (
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/geo"

	"plumb/internal/stats"
	"plumb/layout"
	"plumb/palette"
	"plumb/scale"
)

// A Region is one place of a map: its name and its outline in longitude
// and latitude degrees (outer rings and holes, either winding order).
type Region struct {
	Name  string
	Shape orb.MultiPolygon
}

// MapOptions configures a choropleth map. The zero value draws the honest
// default: an equal-area projection chosen for the extent, five classes by
// Fisher's natural breaks, a sequential scale (darker = more), or a
// diverging one around zero when values take both signs.
type MapOptions struct {
	Common
	Projection string    // "albers", "equal-earth", "lambert", "equirectangular" (areas distorted, with a note); "" chooses
	Classes    int       // number of classes; 0 means 5
	Breaks     string    // "natural" (default), "quantile", "equal", "nice", or "none" for an unclassed scale
	BreakList  []float64 // explicit inner class limits, ascending; overrides Breaks
	Mid        *float64  // centre of a diverging scale; nil: 0 when values take both signs
	PerArea    bool      // divide each value by its region's area in km² (on the sphere)
	Per        string    // what the values were divided by, for the key and the description ("per 1,000 people")
	Labels     bool      // name the regions where the name fits inside
	Unit       string    // "%", "$": how the values are written
	ValueName  string    // what the values measure
}

// MapPanel plans a map of values by region for a cell of a figure. names
// and values pair up; a name with no region, or a region with no value,
// is the caller's join to report; regions without a value are drawn as
// "no data".
func MapPanel(regions []Region, names []string, values []float64, opt MapOptions) Panel {
	return newPanel(opt.Common, func(f *frame) (panelPlan, error) {
		f.rampColors("maps colour values")
		return newMapPlan(f, regions, names, values, opt)
	})
}

// MapScene builds the map's scene without writing it.
func MapScene(regions []Region, names []string, values []float64, opt MapOptions) (*Scene, error) {
	return chartScene(opt.Common, MapPanel(regions, names, values, opt))
}

// Map draws a choropleth map and writes it as SVG to w.
func Map(w io.Writer, regions []Region, names []string, values []float64, opt MapOptions) ([]Note, error) {
	s, err := MapScene(regions, names, values, opt)
	return writeScene(w, s, err)
}

type mapPlan struct {
	opt     MapOptions
	regions []Region
	value   []float64 // per region; NaN for no data
	has     []bool
	proj    scale.Projection
	shapes  []projected
	edges   []float64 // class edges; nil for an unclassed scale
	counts  []int
	lo, hi  float64
	mid     float64
	diverge bool
	vfmt    scale.Format
}

func newMapPlan(f *frame, regions []Region, names []string, values []float64, opt MapOptions) (*mapPlan, error) {
	if len(names) != len(values) {
		return nil, fmt.Errorf("%d names but %d values: give one value per name", len(names), len(values))
	}
	if len(regions) == 0 {
		return nil, fmt.Errorf("no regions to draw: the shapes file has no polygons")
	}
	if err := checkFinite("Mid", opt.Mid); err != nil {
		return nil, err
	}
	if opt.Classes < 0 || opt.Classes > palette.MaxRamp {
		return nil, &OptionError{Option: "Classes", Value: strconv.Itoa(opt.Classes), Err: fmt.Errorf("use 2 to %d classes", palette.MaxRamp)}
	}
	if opt.Classes == 0 {
		opt.Classes = 5
	}
	for i, b := range opt.BreakList {
		if math.IsNaN(b) || math.IsInf(b, 0) || (i > 0 && b <= opt.BreakList[i-1]) {
			return nil, &OptionError{Option: "BreakList", Value: fmt.Sprint(opt.BreakList), Err: fmt.Errorf("class limits must be finite numbers in ascending order")}
		}
	}
	if err := checkDegrees(regions); err != nil {
		return nil, err
	}
	p := &mapPlan{opt: opt, regions: regions, value: make([]float64, len(regions)), has: make([]bool, len(regions))}
	at := make(map[string]int, len(regions))
	for i, r := range regions {
		if _, dup := at[r.Name]; !dup {
			at[r.Name] = i
		}
	}
	for i, n := range names {
		if math.IsNaN(values[i]) || math.IsInf(values[i], 0) {
			return nil, fmt.Errorf("%s has the value %g: give a finite number or leave the row out", n, values[i])
		}
		if j, ok := at[n]; ok {
			p.value[j], p.has[j] = values[i], true
		}
	}
	if opt.PerArea {
		for i, r := range regions {
			km2 := geo.Area(r.Shape) / 1e6
			if p.has[i] && km2 > 0 {
				p.value[i] /= km2
			} else if p.has[i] {
				p.has[i] = false
				f.scene.Note("map-area", true, fmt.Sprintf("%s has no area to divide by; drawn as no data", r.Name))
			}
		}
		if p.opt.Per == "" {
			p.opt.Per = "per km²"
		}
	}
	var shown []float64
	for i := range regions {
		if p.has[i] {
			shown = append(shown, p.value[i])
		}
	}
	if len(shown) == 0 {
		return nil, fmt.Errorf("no region has a value: the names match no shape")
	}
	p.lo, p.hi = slices.Min(shown), slices.Max(shown)
	p.vfmt = scale.ValueFormat(shown, opt.Unit)
	if opt.Mid != nil {
		p.mid, p.diverge = *opt.Mid, true
	} else if p.lo < 0 && p.hi > 0 {
		p.diverge = true
	}
	if err := p.classify(f, shown); err != nil {
		return nil, err
	}
	if err := p.projectShapes(f); err != nil {
		return nil, err
	}
	p.noteCounts(f, shown)
	return p, nil
}

// classify chooses the class edges and counts the regions in each.
func (p *mapPlan) classify(f *frame, shown []float64) error {
	k := p.opt.Classes
	switch {
	case len(p.opt.BreakList) > 0:
		p.edges = append([]float64{math.Min(p.lo, p.opt.BreakList[0])}, p.opt.BreakList...)
		p.edges = append(p.edges, math.Max(p.hi, p.opt.BreakList[len(p.opt.BreakList)-1]))
	case p.opt.Breaks == "" || p.opt.Breaks == "natural":
		p.edges = stats.NaturalBreaks(shown, k)
	case p.opt.Breaks == "quantile":
		p.edges = stats.QuantileBreaks(shown, k)
	case p.opt.Breaks == "equal":
		p.edges = stats.EqualBreaks(shown, k)
	case p.opt.Breaks == "nice":
		p.edges = stats.NiceBreaks(shown, k)
	case p.opt.Breaks == "none":
		f.scene.Note("map-classes", false, "unclassed: colour in proportion to value, with a continuous key")
		return nil
	default:
		return &OptionError{Option: "Breaks", Value: p.opt.Breaks, Err: fmt.Errorf("use natural, quantile, equal, nice, none or a list of numbers")}
	}
	if len(p.edges) > palette.MaxRamp+1 {
		return &OptionError{Option: "BreakList", Value: fmt.Sprint(p.opt.BreakList), Err: fmt.Errorf("at most %d classes", palette.MaxRamp)}
	}
	p.counts = make([]int, len(p.edges)-1)
	for _, v := range shown {
		p.counts[stats.ClassOf(p.edges, v)]++
	}
	method := map[string]string{"": "natural breaks (Fisher's optimal grouping)", "natural": "natural breaks (Fisher's optimal grouping)", "quantile": "quantiles (equal counts)", "equal": "equal widths", "nice": "nice round limits"}[p.opt.Breaks]
	if len(p.opt.BreakList) > 0 {
		method = "the limits given"
	}
	f.scene.Note("map-classes", false, fmt.Sprintf("%d classes by %s: %s", len(p.counts), method, p.classText()))
	return nil
}

// classText lists the classes with their counts, for notes and the
// description.
func (p *mapPlan) classText() string {
	parts := make([]string, len(p.counts))
	for i, n := range p.counts {
		parts[i] = fmt.Sprintf("%s to %s (%d)", p.vfmt.Format(p.edges[i]), p.vfmt.Format(p.edges[i+1]), n)
	}
	return strings.Join(parts, ", ")
}

// projectShapes chooses the projection and projects every outline.
func (p *mapPlan) projectShapes(f *frame) error {
	ext, ok := mapExtent(p.regions)
	if !ok {
		return fmt.Errorf("the shapes have no finite coordinates")
	}
	proj, err := scale.ProjectionByName(p.opt.Projection, ext)
	if err != nil {
		return &OptionError{Option: "Projection", Value: p.opt.Projection, Err: err}
	}
	p.proj = proj
	lon0 := ext.CentreLon()
	switch q := proj.(type) {
	case scale.AlbersEqualArea:
		lon0 = q.Lon0
		f.scene.Note("map-projection", false, fmt.Sprintf("projection: %s, standard parallels %.1f° and %.1f°, centred on %.1f°", proj.Name(), q.Lat1, q.Lat2, q.Lon0))
	case scale.EqualEarth:
		lon0 = q.Lon0
		f.scene.Note("map-projection", false, fmt.Sprintf("projection: %s, centred on %.1f°, for an extent %.0f° wide", proj.Name(), q.Lon0, ext.Width()))
	case scale.LambertAzimuthal:
		lon0 = q.Lon0
		f.scene.Note("map-projection", false, fmt.Sprintf("projection: %s, centred on %.1f°, %.1f°", proj.Name(), q.Lat0, q.Lon0))
	default:
		f.scene.Note("map-projection", false, fmt.Sprintf("projection: %s, which is not equal-area: regions far from %.0f° latitude look larger than they are; leave %s out for an equal-area projection", proj.Name(), (ext.South+ext.North)/2, p.opt.name("Projection")))
	}
	p.shapes = project(p.regions, proj, lon0)
	return nil
}

// noteCounts warns when the values look like counts, which on a map mostly
// show where the regions are large: whole numbers that grow with area
// (Spearman's rank correlation above 0.5).
func (p *mapPlan) noteCounts(f *frame, shown []float64) {
	if p.opt.PerArea || p.opt.Per != "" || !scale.IsInteger(shown) || len(shown) < 5 {
		return
	}
	var vs, as []float64
	for i, r := range p.regions {
		if p.has[i] {
			vs, as = append(vs, p.value[i]), append(as, geo.Area(r.Shape))
		}
	}
	if rho := spearman(vs, as); rho > 0.5 {
		f.scene.Note("map-counts", false, fmt.Sprintf("the values look like counts (whole numbers that grow with area, rank correlation %.2f): a map of counts mostly shows size; divide by a population column (%s COLUMN) or by area (%s area)", rho, p.opt.name("Per"), p.opt.name("Per")))
	}
}

// spearman is the rank correlation of x and y (ties given their mean rank).
func spearman(x, y []float64) float64 {
	rx, ry := ranks(x), ranks(y)
	n := float64(len(x))
	var mx, my float64
	for i := range rx {
		mx, my = mx+rx[i]/n, my+ry[i]/n
	}
	var sxy, sxx, syy float64
	for i := range rx {
		dx, dy := rx[i]-mx, ry[i]-my
		sxy, sxx, syy = sxy+dx*dy, sxx+dx*dx, syy+dy*dy
	}
	if sxx == 0 || syy == 0 {
		return 0
	}
	return sxy / math.Sqrt(sxx*syy)
}

func ranks(v []float64) []float64 {
	idx := make([]int, len(v))
	for i := range idx {
		idx[i] = i
	}
	slices.SortStableFunc(idx, func(a, b int) int { return cmpFloat(v[a], v[b]) })
	r := make([]float64, len(v))
	for i := 0; i < len(idx); {
		j := i
		for j+1 < len(idx) && v[idx[j+1]] == v[idx[i]] {
			j++
		}
		for k := i; k <= j; k++ {
			r[idx[k]] = float64(i+j)/2 + 1
		}
		i = j + 1
	}
	return r
}

func cmpFloat(a, b float64) int {
	switch {
	case a < b:
		return -1
	case a > b:
		return 1
	}
	return 0
}

// fill is the colour of a value: its class's step of the ramp, or for an
// unclassed scale the ramp interpolated in OKLab.
func (p *mapPlan) fill(v float64) Colour {
	t := 0.0
	if p.edges != nil {
		n := len(p.edges) - 1
		c := stats.ClassOf(p.edges, v)
		if p.diverge {
			t = (p.edges[c] + p.edges[c+1]) / 2
			return p.divergeAt(t)
		}
		ramp, _ := palette.Sequential(palette.SequentialHues()[0], max(n, palette.MinRamp))
		if n < palette.MinRamp {
			// Fewer classes than the shortest ramp: its light and dark ends.
			c = c * (palette.MinRamp - 1) / max(1, n-1)
		}
		return RGB(ramp[c])
	}
	if p.diverge {
		return p.divergeAt(v)
	}
	if p.hi > p.lo {
		t = (v - p.lo) / (p.hi - p.lo)
	}
	ramp, _ := palette.Sequential(palette.SequentialHues()[0], palette.MaxRamp)
	return RGB(rampAt(ramp, t))
}

// divergeAt is the diverging colour of v: the distance from the middle,
// relative to the farthest value, read along the arm of its sign.
func (p *mapPlan) divergeAt(v float64) Colour {
	span := math.Max(math.Abs(p.hi-p.mid), math.Abs(p.lo-p.mid))
	t := 0.5
	if span > 0 {
		t = 0.5 + (v-p.mid)/span/2
	}
	ramp, _ := palette.Diverging(palette.MaxRamp)
	return RGB(rampAt(ramp, t))
}

// rampAt interpolates a ramp at t in [0, 1] in OKLab, where equal steps look
// equal.
func rampAt(ramp palette.Palette, t float64) palette.SRGB {
	t = math.Max(0, math.Min(1, t)) * float64(len(ramp)-1)
	i := min(int(t), len(ramp)-2)
	f := t - float64(i)
	a, b := palette.SRGBToOKLab(ramp[i]), palette.SRGBToOKLab(ramp[i+1])
	return palette.OKLabToSRGB(palette.OKLab{L: a.L + (b.L-a.L)*f, A: a.A + (b.A-a.A)*f, B: a.B + (b.B-a.B)*f})
}

func (p *mapPlan) domains() (x, y axisDomain) { return }
func (p *mapPlan) share(x, y axisDomain)      {}

// measure reserves the key's room under the map.
func (p *mapPlan) measure(f *frame, cellW float64, e edges) insets {
	return insets{bottom: p.keyHeight(f)}
}

// height keeps the projected shapes' own proportions: a map squeezed to
// fit a box would no longer be equal-area.
func (p *mapPlan) height(f *frame, plotW, room float64) (float64, error) {
	if room > 0 {
		return room, nil
	}
	return math.Round(plotW * math.Max(0.3, math.Min(1.4, shapesAspect(p.shapes)))), nil
}

func (p *mapPlan) draw(f *frame, plot layout.Box, e edges) (placed, error) {
	fitShapes(p.shapes, Point{plot.X, plot.Y}, plot.W, plot.H)
	// Drop detail under one square pixel: it cannot be seen, and a
	// 5 MB boundary file would otherwise be a 5 MB figure.
	before, after := simplifyShared(p.shapes, 1)
	if after < before {
		f.scene.Note("map-simplified", false, fmt.Sprintf("outlines simplified for this size: %d of %d vertices kept, shared borders simplified once so neighbours still meet", after, before))
	}
	var pl placed
	noData := 0
	for i, r := range p.regions {
		var lines [][]Point
		for _, poly := range p.shapes[i] {
			lines = append(lines, poly...)
		}
		if len(lines) == 0 {
			continue
		}
		m := Mark{Kind: Path, Class: "plumb-mark", Lines: lines, Closed: true, Stroke: RGB(palette.SRGB{R: 1, G: 1, B: 1}), StrokeWidth: 0.5, Join: JoinRound, Cap: CapRound, Attrs: []Attr{{"label", r.Name}}}
		if p.has[i] {
			m.Fill = p.fill(p.value[i])
			m.Attrs = append(m.Attrs, Attr{"value", dataNumber(p.value[i])})
			m.Tooltip = r.Name + ": " + p.vfmt.Format(p.value[i])
		} else {
			m.Fill, m.Class = f.th.grid, "plumb-mark plumb-nodata"
			m.Tooltip = r.Name + ": no data"
			noData++
		}
		f.scene.Add(m)
	}
	if p.opt.Labels {
		pl.text = append(pl.text, p.drawLabels(f)...)
	}
	p.drawKey(f, plot, noData > 0)
	return pl, nil
}

func (p *mapPlan) describe() (string, string) {
	what := p.opt.ValueName
	if what == "" {
		what = "values"
	}
	if p.opt.Per != "" {
		what += " " + p.opt.Per
	}
	hiI, loI := -1, -1
	n := 0
	for i := range p.regions {
		if !p.has[i] {
			continue
		}
		n++
		if hiI < 0 || p.value[i] > p.value[hiI] {
			hiI = i
		}
		if loI < 0 || p.value[i] < p.value[loI] {
			loI = i
		}
	}
	var b strings.Builder
	fmt.Fprintf(&b, "Map of %s for %d of %d regions (%s projection).", what, n, len(p.regions), p.proj.Name())
	fmt.Fprintf(&b, " Highest: %s, %s. Lowest: %s, %s.", p.regions[hiI].Name, p.vfmt.Format(p.value[hiI]), p.regions[loI].Name, p.vfmt.Format(p.value[loI]))
	if p.edges != nil {
		fmt.Fprintf(&b, " Classes: %s.", p.classText())
	}
	if n < len(p.regions) {
		fmt.Fprintf(&b, " %d %s no data.", len(p.regions)-n, plural(len(p.regions)-n, "region has", "regions have"))
	}
	return b.String(), "Map of " + what
}

// checkDegrees refuses outlines that are not longitude and latitude in
// degrees (RFC 7946): most often a boundary file still in a projected
// system's metres, which would draw as nonsense.
func checkDegrees(regions []Region) error {
	for _, r := range regions {
		for _, poly := range r.Shape {
			for _, ring := range poly {
				for _, v := range ring {
					lon, lat := v[0], v[1]
					if math.IsNaN(lon) || math.IsNaN(lat) || math.Abs(lon) > 540 || math.Abs(lat) > 90 {
						return fmt.Errorf("region %q has a vertex at (%g, %g), outside longitude −180..180 and latitude −90..90: the boundary file is probably in a projected system's metres; convert it to longitude and latitude in degrees (WGS 84, as GeoJSON requires) first", r.Name, lon, lat)
					}
				}
			}
		}
	}
	return nil
}
