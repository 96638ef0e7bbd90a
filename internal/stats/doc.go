// Package stats computes the summaries plumb's distribution and range
// charts draw: sample quantiles, Tukey's box-plot fences, histogram bins
// and the five numbers of a range (minimum, p10, mean, p90, maximum).
//
// The methods are the published ones under their usual names:
//
//   - Quantiles are Hyndman & Fan (1996) type 7, the linear interpolation
//     between order statistics at h = (n−1)p + 1 ("Sample quantiles in
//     statistical packages", American Statistician 50:361–365). It is the
//     definition most statistics software uses by default, so a reader who
//     checks a box against their own tools gets the same quartiles.
//   - Box plots follow Tukey (1977, Exploratory Data Analysis) with type 7
//     quartiles in place of his hinges: inner fences at 1.5·IQR beyond the
//     quartiles, whiskers to the most extreme values inside them, every
//     value beyond them an outlier (beyond 3·IQR, far out).
//   - Histogram bin widths are Freedman & Diaconis (1981), h = 2·IQR·n^(−1/3),
//     and Sturges (1926), k = ⌈log₂ n⌉ + 1 bins, when the IQR is zero. The
//     width is then rounded to the nearest nice number (1, 2, 2.5 or 5 times
//     a power of ten, the mantissas of Heckbert 1990 and Talbot et al. 2010
//     that give round edges) and the edges are whole multiples of it.
//   - Rows of a matrix are clustered by Ward's (1963) criterion with the
//     nearest-neighbour chain, and their leaves ordered so that neighbours
//     are similar, for heat maps (cluster.go, cluster_order.go).
//   - Class limits of a map are Fisher's (1958) exact optimal partition
//     ("natural breaks"), type 7 quantiles, equal widths or nice numbers
//     (breaks.go); scatter plots fit least squares and LOESS (Cleveland
//     1979) and bin points into hexagons (fit.go, loess.go, bin2d.go).
//
// Every function takes plain float64 slices. Inputs must be finite: callers
// read and validate their data first, and the functions report NaN or an
// error (never a panic) when they are not.
package stats
