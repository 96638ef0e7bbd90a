// Package layout measures text with real font metrics and turns the
// measurements into geometry: line wrapping with an ellipsis, text boxes,
// overlap tests and one-dimensional label spreading.
//
// Widths come from the font's own tables: the advance widths of the
// horizontal metrics table (hmtx) and pair kerning (the kern table or the
// GPOS "kern" feature), summed in font units and scaled to pixels once, so a
// label measured here is the label a browser sets with the same font. The Go
// fonts (gofont/goregular and gofont/gobold) are built in, so the zero value
// of every type measures something sensible.
//
// Spread places labels by isotonic regression solved with the
// pool-adjacent-violators algorithm (Ayer, Brunk, Ewing, Reid & Silverman
// 1955; Barlow, Bartholomew, Bremner & Brunk 1972): the least-squares
// placement that keeps neighbours a fixed gap apart.
//
// Like text/tabwriter, layout only measures and decides; it never writes.
package layout
