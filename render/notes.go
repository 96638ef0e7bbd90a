package render

// A NoteCode documents one kind of decision a note records: its stable
// code (Note.Code), what decided it, and whether such a note says the
// drawing differs from the data given (Note.Changed), which the CLI prints
// by default. The codes are part of plumb's interface: a Go caller or a
// CI job matches them (the SVG's metadata carries them as the code
// attribute of each plumb:note), so a code is never renamed or reused for
// another decision.
type NoteCode struct {
	Code    string
	Changed bool   // notes of this code report a change to the data as drawn
	Where   string // which charts or which step take the decision
	Meaning string // the decision, as the table in DEVELOPERS.md says it
}

// NoteCodes lists every note code plumb writes, in alphabetical order.
// The "Notes" table of DEVELOPERS.md is generated from it
// (NoteCodesMarkdown) and a test holds the two together, and holds every
// code a builder, a test scene or a golden figure produces to this list.
// A code whose notes are sometimes changes and sometimes not is listed
// with Changed true.
var NoteCodes = []NoteCode{
	{"accounting", false, "reading", "numbers in parentheses read as negative"},
	{"agg", true, "lines (Agg)", "repeated values per x summarised by their mean or median, with n per x and the spread the band shows"},
	{"annotation-domain", false, "every chart", "an axis widened beyond the data to show a reference line, event or period"},
	{"annotation-hidden", true, "every chart", "an annotation's label found no free place and became its mark's tooltip"},
	{"aspect", false, "lines, diff", "the plot's aspect ratio: banked to 45° (method, height/width) or as asked, with the resulting median angle"},
	{"band-overlap", false, "lines (Agg)", "the spread bands of several series overlap much: suggests one panel per series"},
	{"binned", true, "scatter, matrix", "too many points to draw one by one: hexagonal bins, with the threshold and bin size"},
	{"bins", false, "hist", "the bin width and its rule (Freedman–Diaconis, Sturges or as given), the edges and which edge a bin holds"},
	{"box-method", false, "box", "boxes at the type 7 quartiles, whiskers within 1.5 IQR, and how many values lie beyond"},
	{"box-small", true, "box", "groups with fewer than 5 values drawn as their points instead of a box"},
	{"calendar-abbreviated", false, "bars, dots", "month or weekday names written in their short forms to fit"},
	{"colors-contrast", true, "every chart (Colors)", "a colour given has less than 3:1 contrast on the page, with the measured ratio"},
	{"colors-cvd", true, "every chart (Colors)", "two colours given collide under a colour vision deficiency, with the CIEDE2000 distance per vision"},
	{"colors-ignored", true, "heat, map, binned scatter (Colors)", "colours given are not used: the chart colours by a lightness ramp"},
	{"colors-short", true, "bars, dots, lines, scatter (Colors)", "fewer colours given than series or groups: plumb's palette used instead"},
	{"columns", false, "CLI", "which columns were read for what, when the command line did not say"},
	{"combined", true, "CLI (bars, dots)", "rows with the same label combined into one (sum, mean, ...), with the counts"},
	{"context", false, "diff", "the levels panel left out inside a figure"},
	{"count", false, "CLI (bars, dots)", "no value column: the rows of each label counted"},
	{"cvd-method", false, "palette", "how colour vision deficiency was simulated"},
	{"dates", false, "reading", "a column read as dates, and in which form"},
	{"decimal-comma", false, "reading", "a column read with a decimal comma"},
	{"dots-domain", false, "dots", "the value axis of a dot plot does not include zero, with its range"},
	{"fit", false, "scatter", "the trend fitted: least-squares line with r and R², or LOESS with its span"},
	{"format", false, "reading", "the format standard input was read as"},
	{"grouping", false, "reading", "a column read with digits grouped in threes"},
	{"groups-binned", true, "scatter", "groups drawn together as one set of bins: too many points to keep them apart"},
	{"heat-cluster", false, "heat", "rows or columns in cluster order, with the linkage"},
	{"heat-cluster-missing", true, "heat", "missing cells counted as their column's mean for clustering"},
	{"heat-columns-left-out", true, "CLI (heat)", "non-numeric columns of a wide table left out"},
	{"heat-dense", false, "heat", "more rows than pixels: a viewer shows only some of them"},
	{"heat-image", false, "heat", "many cells drawn as one image, a pixel per cell"},
	{"heat-missing", true, "heat", "cells without a value, drawn in the key's no-data grey"},
	{"heat-order", false, "heat", "rows or columns ordered by their mean"},
	{"heat-scale", false, "heat", "the colour scale chosen: sequential, or diverging about zero or the given middle, with the range"},
	{"heat-thin-cols", false, "heat", "columns too narrow to label each: every k-th labelled"},
	{"heat-thin-rows", false, "heat", "rows too thin to label each: every k-th labelled"},
	{"index", true, "lines", "every series rebased to 100 at a point"},
	{"label-shortened", false, "bars, dots, lines, diff", "a label shortened to fit; the full text in its tooltip"},
	{"labels-shortened", true, "CLI (bars, dots)", "labels trimmed or cleaned when read"},
	{"left-out", true, "bars, dots", "the smallest categories left out (values that do not add up are never combined), with the names"},
	{"legend", false, "lines, diff, scatter", "names in a legend or panel title: direct labels did not fit"},
	{"magnitude", false, "lines", "series whose sizes differ by more than 10×: suggests an index or panels"},
	{"map-area", true, "map", "a region with no area to divide by, drawn as no data"},
	{"map-classes", false, "map", "the classes (method, breaks and counts) or an unclassed scale"},
	{"map-counts", false, "map", "the values look like counts, which mostly show size: suggests dividing"},
	{"map-geometry", false, "CLI (map)", "features that are not polygons, not drawn"},
	{"map-join", false, "CLI (map)", "the shape property rows were joined on, with the match count"},
	{"map-labels", false, "map", "region names that do not fit their shapes, left out"},
	{"map-no-data", true, "CLI (map)", "shapes with no row, drawn as no data"},
	{"map-no-shape", true, "CLI (map)", "rows with no shape, not drawn"},
	{"map-projection", false, "map", "the projection and its parameters"},
	{"map-simplified", false, "map", "outlines simplified for the size, with the vertices kept"},
	{"milliseconds", false, "lines, diff", "times that look like milliseconds read as seconds"},
	{"missing", true, "reading, lines, diff, scatter, matrix", "missing values: counted, bridged or left out"},
	{"multiples", false, "lines", "too many series for one panel: small multiples"},
	{"order", false, "box, span", "the order of the groups or categories, and how to ask for another"},
	{"other", true, "bars", "the smallest categories combined into Other (summed or averaged), with the names"},
	{"own-scales", true, "CLI (--by)", "each panel given its own value scale"},
	{"panels", false, "CLI (--by)", "one panel per value of a column, and their order"},
	{"percent", true, "bars", "values shown as percentages of the total (or of each row's total)"},
	{"reduced", false, "lines, diff", "points reduced per pixel column (M4), with the counts before and after"},
	{"rows-skipped", true, "CLI", "rows with no value skipped, with their line numbers"},
	{"separator", false, "reading", "the field separator the file was read with"},
	{"series-dropped", true, "lines, diff", "a series with no values left out"},
	{"sorted", false, "lines, diff", "rows or series sorted by x, since a line joins its points in x order"},
	{"span-few", true, "CLI (span)", "categories with too few values for the statistic asked"},
	{"span-marks", false, "span", "the overlaid values: which rows the dots mark"},
	{"span-stat", false, "span", "what the ranges show: minimum to maximum, quartiles or the 10th to 90th percentile, and the middle marked"},
	{"span-where", false, "CLI (span)", "whether the rows the dots mark are part of the ranges"},
	{"together", false, "lines", "many series kept on one panel"},
	{"translucent", false, "scatter, matrix", "points drawn translucent, with the opacity"},
	{"unit", false, "reading", "a unit found in the cells (%, a currency)"},
	{"unlabelled", false, "scatter", "groups could not be named beside their points"},
	{"unmatched-x", true, "diff", "x values only one series has, left out"},
	{"unnamed", false, "lines", "more series than colours or names: drawn alike"},
	{"value-labels-dropped", false, "bars, dots", "value labels that do not fit, left out; the axis carries the values"},
	{"years", false, "lines, diff", "whole numbers read as years"},
}

// noteCode finds a code in NoteCodes.
func noteCode(code string) (NoteCode, bool) {
	for _, c := range NoteCodes {
		if c.Code == code {
			return c, true
		}
	}
	return NoteCode{}, false
}

// NoteCodesMarkdown writes NoteCodes as the Markdown table of
// DEVELOPERS.md's "Note codes" section.
func NoteCodesMarkdown() string {
	s := "| code | changed | where | decision |\n|---|---|---|---|\n"
	for _, c := range NoteCodes {
		ch := ""
		if c.Changed {
			ch = "yes"
		}
		s += "| `" + c.Code + "` | " + ch + " | " + c.Where + " | " + c.Meaning + " |\n"
	}
	return s
}
