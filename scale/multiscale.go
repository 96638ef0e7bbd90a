package scale

import (
	"math"
	"math/cmplx"
)

// Multi-scale banking (Heer & Agrawala 2006, "Multi-Scale Banking to 45
// Degrees", IEEE TVCG 12(5)) combines spectral analysis with banking: a
// series holds trends at several frequency scales, and each scale banks to
// its own aspect ratio. A long noisy series banked at its finest scale asks
// for a flat strip in which the trend cannot be read; banked at the scale
// of its dominant trend it asks for a plot in which the trend's rises and
// falls are told apart. The paper smooths each salient scale with LOESS;
// plumb's own, simpler choices (methods.md §4 leaves them to the project)
// are below: resampling to a uniform grid, removing the least-squares line,
// taking the strongest bin of the power spectrum as the dominant
// frequency, and keeping the Fourier components up to twice that
// frequency (the dominant cycle and its first harmonic, so that an uneven
// cycle keeps its shape) as the trend curve, to which the line is added
// back.

// spectralGrid is the largest uniform grid the analysis resamples to: a
// trend drawn across a plot at most a few thousand pixels wide needs no
// finer sampling, and the FFT of 4,096 points costs well under a
// millisecond.
const spectralGrid = 4096

// DominantCycles returns the frequency, in whole cycles over the series'
// x range, of the strongest peak in the power spectrum of the series
// (x sorted; non-finite values are missing and bridged by linear
// interpolation for the analysis only). ok is false for fewer than 16
// values or a series without variation about its straight-line trend.
func DominantCycles(xs, ys []float64) (cycles int, ok bool) {
	grid, _, ok := detrended(xs, ys)
	if !ok {
		return 0, false
	}
	spec := fft(grid)
	n := len(grid)
	power := make([]float64, n/2+1)
	for k := 1; k <= n/2; k++ {
		power[k] = real(spec[k])*real(spec[k]) + imag(spec[k])*imag(spec[k])
	}
	best, bestP := 0, 0.0
	for k := 1; k <= n/2; k++ {
		if power[k] > bestP {
			best, bestP = k, power[k]
		}
	}
	return best, best > 0
}

// LowPassTrend returns the series' trend at the scale of cycles: the
// straight-line trend plus the Fourier components of the rest up to
// cycles over the x range, sampled on a uniform grid of up to 4,096
// points across the data's x range, for banking. ok is false when the
// series is too short to analyse (see DominantCycles).
func LowPassTrend(xs, ys []float64, cycles int) (Polyline, bool) {
	grid, line, ok := detrended(xs, ys)
	if !ok {
		return Polyline{}, false
	}
	n := len(grid)
	spec := fft(grid)
	for k := cycles + 1; k <= n-cycles-1; k++ {
		spec[k] = 0
	}
	// Inverse FFT by conjugation: ifft(X) = conj(fft(conj(X)))/n.
	for i := range spec {
		spec[i] = cmplx.Conj(spec[i])
	}
	back := fftComplex(spec)
	p := Polyline{X: make([]float64, n), Y: make([]float64, n)}
	for i := range p.X {
		x := line.x0 + (line.x1-line.x0)*float64(i)/float64(n-1)
		p.X[i] = x
		p.Y[i] = real(cmplx.Conj(back[i]))/float64(n) + line.a + line.b*x
	}
	return p, true
}

// trendLine is the least-squares line y = a + b·x over [x0, x1].
type trendLine struct{ a, b, x0, x1 float64 }

// detrended resamples the finite points of (xs, ys) linearly onto a
// uniform grid of a power of two points (at most spectralGrid, at least
// the next power of two above the count of values up to that bound) and
// subtracts the least-squares line.
func detrended(xs, ys []float64) ([]float64, trendLine, bool) {
	n := min(len(xs), len(ys))
	var fx, fy []float64
	for i := 0; i < n; i++ {
		if isFinite(xs[i]) && isFinite(ys[i]) {
			fx, fy = append(fx, xs[i]), append(fy, ys[i])
		}
	}
	if len(fx) < 16 || !(fx[len(fx)-1] > fx[0]) {
		return nil, trendLine{}, false
	}
	size := 16
	for size < len(fx) && size < spectralGrid {
		size *= 2
	}
	l := trendLine{x0: fx[0], x1: fx[len(fx)-1]}
	grid := make([]float64, size)
	j := 0
	for i := range grid {
		x := l.x0 + (l.x1-l.x0)*float64(i)/float64(size-1)
		for j < len(fx)-2 && fx[j+1] < x {
			j++
		}
		t := (x - fx[j]) / (fx[j+1] - fx[j])
		grid[i] = fy[j] + (fy[j+1]-fy[j])*math.Max(0, math.Min(1, t))
	}
	var sx, sy, sxx, sxy float64
	for i, y := range grid {
		x := l.x0 + (l.x1-l.x0)*float64(i)/float64(size-1)
		sx, sy, sxx, sxy = sx+x, sy+y, sxx+x*x, sxy+x*y
	}
	m := float64(size)
	if d := m*sxx - sx*sx; d != 0 {
		l.b = (m*sxy - sx*sy) / d
	}
	l.a = (sy - l.b*sx) / m
	varies := false
	for i := range grid {
		x := l.x0 + (l.x1-l.x0)*float64(i)/float64(size-1)
		grid[i] -= l.a + l.b*x
		varies = varies || math.Abs(grid[i]) > 1e-12*(math.Abs(l.a)+1)
	}
	return grid, l, varies
}

// fft is the discrete Fourier transform of a real sequence whose length is
// a power of two.
func fft(v []float64) []complex128 {
	c := make([]complex128, len(v))
	for i, x := range v {
		c[i] = complex(x, 0)
	}
	return fftComplex(c)
}

// fftComplex transforms c in place (iterative radix-2 Cooley-Tukey; the
// length must be a power of two) and returns it.
func fftComplex(c []complex128) []complex128 {
	n := len(c)
	for i, j := 1, 0; i < n; i++ {
		bit := n >> 1
		for ; j&bit != 0; bit >>= 1 {
			j ^= bit
		}
		j ^= bit
		if i < j {
			c[i], c[j] = c[j], c[i]
		}
	}
	for size := 2; size <= n; size <<= 1 {
		w := cmplx.Exp(complex(0, -2*math.Pi/float64(size)))
		for start := 0; start < n; start += size {
			t := complex(1, 0)
			for k := 0; k < size/2; k++ {
				u, v := c[start+k], c[start+k+size/2]*t
				c[start+k], c[start+k+size/2] = u+v, u-v
				t *= w
			}
		}
	}
	return c
}
