package palette

import "math"

// Lab is a CIELAB colour (CIE 1976 L*a*b*) relative to the D65 white of
// sRGB: L from 0 (black) to 100 (white), A green(-) to red(+), B blue(-) to
// yellow(+).
type Lab struct{ L, A, B float64 }

// The D65 white point of sRGB as XYZ, from its chromaticity (0.3127, 0.3290)
// (IEC 61966-2-1; W3C CSS Color 4). Untyped constants keep full precision.
const (
	whiteX = 0.3127 / 0.3290
	whiteY = 1.0
	whiteZ = (1 - 0.3127 - 0.3290) / 0.3290
)

// CIELAB constants as exact fractions (CIE 15; W3C CSS Color 4), rather than
// the rounded 0.008856 and 903.3, so that the two branches of f meet.
const (
	labEpsilon = 216.0 / 24389.0
	labKappa   = 24389.0 / 27.0
)

func labF(t float64) float64 {
	if t > labEpsilon {
		return math.Cbrt(t)
	}
	return (labKappa*t + 16) / 116
}

func labFInv(f float64) float64 {
	if t := f * f * f; t > labEpsilon {
		return t
	}
	return (116*f - 16) / labKappa
}

// XYZToLab converts CIE XYZ to CIELAB with the sRGB D65 white.
func XYZToLab(c XYZ) Lab {
	fx, fy, fz := labF(c.X/whiteX), labF(c.Y/whiteY), labF(c.Z/whiteZ)
	return Lab{L: 116*fy - 16, A: 500 * (fx - fy), B: 200 * (fy - fz)}
}

// LabToXYZ converts CIELAB (D65 white) to CIE XYZ.
func LabToXYZ(c Lab) XYZ {
	fy := (c.L + 16) / 116
	fx := fy + c.A/500
	fz := fy - c.B/200
	var y float64
	// For L* below κε the inverse is linear in L*, not in f(y).
	if c.L > labKappa*labEpsilon {
		y = fy * fy * fy
	} else {
		y = c.L / labKappa
	}
	return XYZ{X: whiteX * labFInv(fx), Y: whiteY * y, Z: whiteZ * labFInv(fz)}
}

// SRGBToLab converts sRGB to CIELAB (D65).
func SRGBToLab(c SRGB) Lab { return XYZToLab(SRGBToXYZ(c)) }

// LabToSRGB converts CIELAB (D65) to sRGB, without clipping.
func LabToSRGB(c Lab) SRGB { return XYZToSRGB(LabToXYZ(c)) }

// DeltaE2000 is the CIEDE2000 colour difference between x and y with the
// parametric factors kL = kC = kH = 1, following the implementation notes of
// Sharma, Wu & Dalal (2005), including their rules for the mean hue and the
// hue difference when a chroma is zero or the hues straddle 0°. It is
// symmetric. A difference of about 1 is just noticeable side by side.
func DeltaE2000(x, y Lab) float64 {
	const deg = math.Pi / 180
	c1 := math.Hypot(x.A, x.B)
	c2 := math.Hypot(y.A, y.B)
	cm := (c1 + c2) / 2
	cm7 := math.Pow(cm, 7)
	g := 0.5 * (1 - math.Sqrt(cm7/(cm7+6103515625))) // 25^7
	a1 := (1 + g) * x.A
	a2 := (1 + g) * y.A
	cp1 := math.Hypot(a1, x.B)
	cp2 := math.Hypot(a2, y.B)
	hp1 := hueDeg(a1, x.B)
	hp2 := hueDeg(a2, y.B)

	dL := y.L - x.L
	dC := cp2 - cp1
	var dh float64
	if cp1*cp2 != 0 {
		dh = hp2 - hp1
		if dh > 180 {
			dh -= 360
		} else if dh < -180 {
			dh += 360
		}
	}
	dH := 2 * math.Sqrt(cp1*cp2) * math.Sin(dh/2*deg)

	lm := (x.L + y.L) / 2
	cpm := (cp1 + cp2) / 2
	hm := hp1 + hp2
	if cp1*cp2 != 0 {
		switch {
		case math.Abs(hp1-hp2) <= 180:
			hm /= 2
		case hm < 360:
			hm = (hm + 360) / 2
		default:
			hm = (hm - 360) / 2
		}
	}
	t := 1 - 0.17*math.Cos((hm-30)*deg) + 0.24*math.Cos(2*hm*deg) +
		0.32*math.Cos((3*hm+6)*deg) - 0.20*math.Cos((4*hm-63)*deg)
	dTheta := 30 * math.Exp(-((hm-275)/25)*((hm-275)/25))
	cpm7 := math.Pow(cpm, 7)
	rc := 2 * math.Sqrt(cpm7/(cpm7+6103515625))
	l50 := (lm - 50) * (lm - 50)
	sl := 1 + 0.015*l50/math.Sqrt(20+l50)
	sc := 1 + 0.045*cpm
	sh := 1 + 0.015*cpm*t
	rt := -math.Sin(2*dTheta*deg) * rc

	tl, tc, th := dL/sl, dC/sc, dH/sh
	return math.Sqrt(tl*tl + tc*tc + th*th + rt*tc*th)
}

// hueDeg is the hue angle in degrees in [0, 360), 0 for a neutral.
func hueDeg(a, b float64) float64 {
	if a == 0 && b == 0 {
		return 0
	}
	h := math.Atan2(b, a) * 180 / math.Pi
	if h < 0 {
		h += 360
	}
	return h
}
