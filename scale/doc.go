// Package scale maps data values to positions and chooses the numbers an
// axis shows.
//
// A Linear scale maps a domain interval onto a range interval. Tick values
// come from the extended Wilkinson algorithm of Talbot, Lin & Hanrahan
// (2010), "An Extension of Wilkinson's Algorithm for Positioning Tick Labels
// on Axes", IEEE TVCG 16(6):1036-1043, transcribed from the reference R
// implementation (labeling::extended) so that it gives the same labellings
// bit for bit. The algorithm searches labellings that are every j-th
// multiple of a nice number q·10^z and maximises a weighted sum of
// simplicity, coverage, density and legibility.
//
// NiceDomain and BarDomain wrap the search with the care a renderer needs:
// any finite input gives at least two strictly increasing ticks that cover
// the data, and bar domains always contain zero as a tick, because a bar's
// length is its value.
//
// Format, TickFormat and ValueFormat print the numbers of one axis or one
// set of value labels alike: the same decimals, the same abbreviation and a
// real minus sign (U+2212).
package scale
