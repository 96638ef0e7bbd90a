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
// length is its value. NiceTicks adds what an axis of a given length needs:
// TickTarget and MinTicks turn the axis length and text size into a tick
// count and its floor (three beyond 150 px), TickOptions ask for whole-number
// steps (counts, years) and a labelled zero, and IncludeZero puts zero into
// ticks already chosen.
//
// Format, TickFormat and ValueFormat print the numbers of one axis or one
// set of value labels alike: the same decimals, the same abbreviation and a
// real minus sign (U+2212). Value labels keep values that differ at three
// significant digits apart and are abbreviated only when three digits
// survive; ShortValueFormat prints each value in three significant digits
// with its own abbreviation, for labels that must be narrow.
package scale
