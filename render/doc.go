// Package render draws honest charts: it turns plain Go slices into a Scene
// (a flat, ordered display list of rectangles, circles, paths, text and
// images with plumb- class names and data- attributes) and serialises the
// Scene as SVG or PNG.
//
// Each chart kind has an options struct whose zero value draws the honest
// default, a builder that returns the Scene, and a writer that builds and
// serialises in one call:
//
//	Bars, BarsScene        compare amounts: horizontal bars from zero, largest first
//	Dots, DotsScene        compare values far from zero: a dot plot, domain fitted
//	SeriesBars, SeriesDots several values per category: dots, stacks, side by side
//	Lines, LinesScene      change over time or order: banked to 45°, direct labels
//	Diff, DiffScene        the difference of two series against a zero line
//	Span, Box, Hist        ranges per category, Tukey box plots, histograms
//	Scatter, Matrix        relationships: points or bins, scatterplot matrices
//	Heat                   a matrix of values as colours, rows clustered
//	Map                    values by place on an equal-area projection
//
// Every chart kind is also a Panel (BarsPanel, LinesPanel, ScatterPanel,
// ...): Figure draws panels in one grid under one title, with shared
// scales when asked, which is how small multiples and slide figures are
// made. Common.Annotations adds reference lines, events, periods and
// callouts to any chart.
//
// Bars and dots share RowOptions, so a caller whose bars are refused passes
// the same options on to a dot plot. Lines and Diff take Series; a series
// over time is made from time.Time values with TimeSeries.
//
// Builders measure every piece of text with real font metrics (package
// layout) before placing it, so labels never overlap or leave the canvas.
// Every decision taken for the caller (categories combined, rows left out,
// the aspect ratio chosen) is a Note in Scene.Notes, also written into the
// SVG's <metadata>; a Note's Changed field says whether what is drawn differs
// from the data given. A chart that would mislead (bars that do not start at
// zero) is refused with a *RefusalError that wraps ErrRefused and carries the
// reason and the honest alternative. An option whose value cannot be drawn
// (a NaN bound, a negative width) is an *OptionError naming the option's
// field.
//
// A Scene decides everything a backend needs: positions, typed colours
// (Colour), stroke joins, caps and dashes, and the faces its text was
// measured with (Font.Faces), so that a raster backend draws exactly what
// was measured.
//
// WriteSVG writes a standalone document; an SVGEncoder writes fragments for
// inline HTML, with an id prefix and a font declared once per page.
// WritePNG and PNGEncoder draw the same Scene as pixels, with the same
// fonts. Identical scenes always give identical bytes.
package render
