// Package render draws honest charts: it turns plain Go slices into a Scene
// (a flat, ordered display list of rectangles, circles, paths and text with
// plumb- class names and data- attributes) and serialises the Scene as SVG.
//
// Each chart kind has an options struct whose zero value draws the honest
// default, a builder that returns the Scene, and a writer that builds and
// serialises in one call:
//
//	Bars, BarsScene    compare amounts: horizontal bars from zero, largest first
//	Dots, DotsScene    compare values far from zero: a dot plot, domain fitted
//	Lines, LinesScene  change over time or order: banked to 45°, direct labels
//	Diff, DiffScene    the difference of two series against a zero line
//
// Builders measure every piece of text with real font metrics (package
// layout) before placing it, so labels never overlap or leave the canvas.
// Every decision taken for the caller (categories combined, rows left out,
// the aspect ratio chosen) is a Note in Scene.Notes, also written into the
// SVG's <metadata>; a Note's Changed field says whether what is drawn differs
// from the data given. A chart that would mislead (bars that do not start at
// zero) is refused with an error that wraps ErrRefused and names the honest
// alternative.
//
// WriteSVG writes a standalone document; an SVGEncoder writes fragments for
// inline HTML, with an id prefix and a font declared once per page.
// Identical scenes always give identical bytes.
package render
