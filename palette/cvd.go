package palette

import (
	"fmt"
	"math"
)

// Vision is a kind of colour vision.
type Vision int

// The visions plumb designs for. Protan, Deutan and Tritan are the losses of
// the long-, middle- and short-wavelength cones; at severity 1 they are
// protanopia, deuteranopia and tritanopia, below 1 the anomalous
// trichromacies.
const (
	Normal Vision = iota
	Protan
	Deutan
	Tritan
)

// Visions lists every Vision in a fixed order, for loops and reports.
var Visions = [4]Vision{Normal, Protan, Deutan, Tritan}

// String returns the lowercase name used in reports and JSON.
func (v Vision) String() string {
	switch v {
	case Normal:
		return "normal"
	case Protan:
		return "protan"
	case Deutan:
		return "deutan"
	case Tritan:
		return "tritan"
	}
	return fmt.Sprintf("Vision(%d)", int(v))
}

// Simulate returns how c appears to a reader with vision v at the given
// severity (0 = normal, 1 = dichromat), by the model of Machado, Oliveira &
// Fernandes (2009): a 3x3 matrix on linear RGB, the result clipped to the
// gamut. Between the published severities (steps of 0.1) the matrices are
// interpolated linearly, as the authors suggest. Severity is clamped to
// 0..1 (NaN counts as 0); Normal and unknown visions return c unchanged.
func Simulate(c SRGB, v Vision, severity float64) SRGB {
	m, ok := machadoMatrix(v, severity)
	if !ok {
		return c
	}
	l := SRGBToLinear(c)
	r, g, b := m.apply(l.R, l.G, l.B)
	return LinearToSRGB(LinearRGB{clamp01(r), clamp01(g), clamp01(b)})
}

// machadoMatrix interpolates the published matrices for severity s.
func machadoMatrix(v Vision, s float64) (mat3, bool) {
	var table *[11]mat3
	switch v {
	case Protan:
		table = &protanMatrices
	case Deutan:
		table = &deutanMatrices
	case Tritan:
		table = &tritanMatrices
	default:
		return mat3{}, false
	}
	if !(s > 0) {
		return table[0], true
	}
	if s >= 1 {
		return table[10], true
	}
	x := s * 10
	i := int(math.Floor(x))
	f := x - float64(i)
	if f == 0 {
		return table[i], true
	}
	var m mat3
	for r := 0; r < 3; r++ {
		for c := 0; c < 3; c++ {
			m[r][c] = table[i][r][c] + f*(table[i+1][r][c]-table[i][r][c])
		}
	}
	return m, true
}

var identity = mat3{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}

// The simulation matrices of Machado, Oliveira & Fernandes (2009), linear
// RGB, at severities 0.0, 0.1, ..., 1.0 (rows as published).
//
// Provenance: severity 0 is the identity by definition; severities 0.5 and
// 1.0 are checked in the tests against the values transcribed in the
// project's reference set (testdata/colour/cvd-machado.json); the other
// severities are from memory of the authors' supplementary table and are
// checked only for the property the published table has, that every row
// sums to 1 within 1e-5 (so greys stay grey).
var (
	protanMatrices = [11]mat3{
		identity,
		{{0.856167, 0.182038, -0.038205}, {0.029342, 0.955115, 0.015544}, {-0.002880, -0.001563, 1.004443}}, // from memory
		{{0.734766, 0.334872, -0.069637}, {0.051840, 0.919198, 0.028963}, {-0.004928, -0.004209, 1.009137}}, // from memory
		{{0.630323, 0.465641, -0.095964}, {0.069181, 0.890046, 0.040773}, {-0.006308, -0.007724, 1.014032}}, // from memory
		{{0.539009, 0.579343, -0.118352}, {0.082546, 0.866121, 0.051332}, {-0.007136, -0.011959, 1.019095}}, // from memory
		{{0.458064, 0.679578, -0.137642}, {0.092785, 0.846313, 0.060902}, {-0.007494, -0.016807, 1.024301}},
		{{0.385450, 0.769005, -0.154455}, {0.100526, 0.829802, 0.069673}, {-0.007442, -0.022190, 1.029632}}, // from memory
		{{0.319627, 0.849633, -0.169261}, {0.106241, 0.815969, 0.077790}, {-0.007025, -0.028051, 1.035076}}, // from memory
		{{0.259411, 0.923008, -0.182420}, {0.110296, 0.804340, 0.085364}, {-0.006276, -0.034346, 1.040622}}, // from memory
		{{0.203876, 0.990338, -0.194214}, {0.112975, 0.794542, 0.092483}, {-0.005222, -0.041043, 1.046265}}, // from memory
		{{0.152286, 1.052583, -0.204868}, {0.114503, 0.786281, 0.099216}, {-0.003882, -0.048116, 1.051998}},
	}
	deutanMatrices = [11]mat3{
		identity,
		{{0.866435, 0.177704, -0.044139}, {0.049567, 0.939063, 0.011370}, {-0.003453, 0.007233, 0.996220}}, // from memory
		{{0.760729, 0.319078, -0.079807}, {0.090568, 0.889315, 0.020117}, {-0.006027, 0.013325, 0.992702}}, // from memory
		{{0.675425, 0.433850, -0.109275}, {0.125303, 0.847755, 0.026942}, {-0.007950, 0.018572, 0.989378}}, // from memory
		{{0.605511, 0.528560, -0.134071}, {0.155318, 0.812366, 0.032316}, {-0.009376, 0.023176, 0.986200}}, // from memory
		{{0.547494, 0.607765, -0.155259}, {0.181692, 0.781742, 0.036566}, {-0.010410, 0.027275, 0.983136}},
		{{0.498864, 0.674741, -0.173604}, {0.205199, 0.754872, 0.039929}, {-0.011131, 0.030969, 0.980162}}, // from memory
		{{0.457771, 0.731899, -0.189670}, {0.226409, 0.731012, 0.042579}, {-0.011595, 0.034333, 0.977261}}, // from memory
		{{0.422823, 0.781057, -0.203881}, {0.245752, 0.709602, 0.044646}, {-0.011843, 0.037423, 0.974421}}, // from memory
		{{0.392952, 0.823610, -0.216562}, {0.263559, 0.690210, 0.046232}, {-0.011910, 0.040281, 0.971630}}, // from memory
		{{0.367322, 0.860646, -0.227968}, {0.280085, 0.672501, 0.047413}, {-0.011820, 0.042940, 0.968881}},
	}
	tritanMatrices = [11]mat3{
		identity,
		{{0.926670, 0.092514, -0.019184}, {0.021191, 0.964503, 0.014306}, {0.008437, 0.054813, 0.936750}}, // from memory
		{{0.895720, 0.133330, -0.029050}, {0.029997, 0.945400, 0.024603}, {0.013027, 0.104707, 0.882266}}, // from memory
		{{0.905871, 0.127791, -0.033662}, {0.026856, 0.941251, 0.031893}, {0.013410, 0.148296, 0.838294}}, // from memory
		{{0.948035, 0.089490, -0.037526}, {0.014364, 0.946792, 0.038844}, {0.010853, 0.193991, 0.795156}}, // from memory
		{{1.017277, 0.027029, -0.044306}, {-0.006113, 0.958479, 0.047634}, {0.006379, 0.248708, 0.744913}},
		{{1.104996, -0.046633, -0.058363}, {-0.032137, 0.971635, 0.060503}, {0.001336, 0.317922, 0.680742}},  // from memory
		{{1.193214, -0.109812, -0.083402}, {-0.058496, 0.979410, 0.079086}, {-0.002346, 0.403492, 0.598854}}, // from memory
		{{1.257728, -0.139648, -0.118081}, {-0.078003, 0.975409, 0.102594}, {-0.003316, 0.501214, 0.502102}}, // from memory
		{{1.278864, -0.125333, -0.153531}, {-0.084748, 0.957674, 0.127074}, {-0.000989, 0.601151, 0.399838}}, // from memory
		{{1.255528, -0.076749, -0.178779}, {-0.078411, 0.930809, 0.147602}, {0.004733, 0.691367, 0.303900}},
	}
)
