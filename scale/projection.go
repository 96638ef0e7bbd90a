package scale

import (
	"fmt"
	"math"
	"slices"
)

// A Projection maps longitude and latitude in degrees to positions on the
// plane: the scale of a map. Every projection here works on the unit
// sphere, x east and y north; multiply by a radius for lengths (the
// authalic radius of WGS 84, AuthalicRadius, keeps areas true to the
// ellipsoid's).
type Projection interface {
	Project(lonDeg, latDeg float64) (x, y float64)
	// Name is the projection's usual name, for notes and descriptions.
	Name() string
	// EqualArea reports whether the projection keeps areas in proportion.
	EqualArea() bool
}

// AuthalicRadius is the radius in metres of the sphere with the surface
// area of the WGS 84 ellipsoid (Snyder 1987, p. 16: R_q; a = 6378137 m,
// f = 1/298.257223563).
const AuthalicRadius = 6371007.181

const rad = math.Pi / 180

// AlbersEqualArea is the Albers equal-area conic projection on the sphere
// (Snyder 1987, Map Projections: A Working Manual, USGS PP 1395, pp.
// 98-103): parallels are concentric arcs, areas are true everywhere and
// shapes are true along the standard parallels Lat1 and Lat2. Lat0 and Lon0
// are the origin. Lat1 and Lat2 must not be opposite (Lat1 = -Lat2).
type AlbersEqualArea struct {
	Lat0, Lon0, Lat1, Lat2 float64
}

// Project implements Projection (Snyder 1987, equations 14-1 to 14-6).
func (p AlbersEqualArea) Project(lonDeg, latDeg float64) (x, y float64) {
	s1 := math.Sin(p.Lat1 * rad)
	n := (s1 + math.Sin(p.Lat2*rad)) / 2
	c := math.Cos(p.Lat1*rad)*math.Cos(p.Lat1*rad) + 2*n*s1
	rho0 := math.Sqrt(c-2*n*math.Sin(p.Lat0*rad)) / n
	rho := math.Sqrt(math.Max(0, c-2*n*math.Sin(latDeg*rad))) / n
	theta := n * wrapLon(lonDeg-p.Lon0) * rad
	return rho * math.Sin(theta), rho0 - rho*math.Cos(theta)
}

// Name implements Projection.
func (AlbersEqualArea) Name() string { return "Albers equal-area conic" }

// EqualArea implements Projection.
func (AlbersEqualArea) EqualArea() bool { return true }

// EqualEarth is the Equal Earth projection (Šavrič, Patterson & Jenny 2018,
// "The Equal Earth map projection", IJGIS 33(3)): an equal-area
// pseudocylindrical projection for maps of the whole world, centred on
// Lon0.
type EqualEarth struct {
	Lon0 float64
}

// The polynomial coefficients of Equal Earth (Šavrič, Patterson & Jenny
// 2018, equation 2).
const (
	eeA1 = 1.340264
	eeA2 = -0.081106
	eeA3 = 0.000893
	eeA4 = 0.003796
)

// Project implements Projection (Šavrič, Patterson & Jenny 2018, equations
// 1 and 2).
func (p EqualEarth) Project(lonDeg, latDeg float64) (x, y float64) {
	m := math.Sqrt(3) / 2
	th := math.Asin(m * math.Sin(latDeg*rad))
	t2 := th * th
	t6 := t2 * t2 * t2
	lam := wrapLon(lonDeg-p.Lon0) * rad
	x = 2 * math.Sqrt(3) * lam * math.Cos(th) / (3 * (9*eeA4*t6*t2 + 7*eeA3*t6 + 3*eeA2*t2 + eeA1))
	y = th * (eeA1 + eeA2*t2 + t6*(eeA3+eeA4*t2))
	return x, y
}

// Name implements Projection.
func (EqualEarth) Name() string { return "Equal Earth" }

// EqualArea implements Projection.
func (EqualEarth) EqualArea() bool { return true }

// LambertAzimuthal is the Lambert azimuthal equal-area projection on the
// sphere centred on (Lon0, Lat0) (Snyder 1987, pp. 182-190): areas true,
// distortion growing with the distance from the centre, suited to regions
// about as tall as they are wide, and to the poles.
type LambertAzimuthal struct {
	Lat0, Lon0 float64
}

// Project implements Projection (Snyder 1987, equations 24-2 to 24-4). The
// point opposite the centre has no image; it is sent to the rim at the
// centre's longitude.
func (p LambertAzimuthal) Project(lonDeg, latDeg float64) (x, y float64) {
	phi, phi0 := latDeg*rad, p.Lat0*rad
	lam := wrapLon(lonDeg-p.Lon0) * rad
	cosc := math.Sin(phi0)*math.Sin(phi) + math.Cos(phi0)*math.Cos(phi)*math.Cos(lam)
	if cosc <= -1+1e-12 {
		return 0, -2
	}
	k := math.Sqrt(2 / (1 + cosc))
	x = k * math.Cos(phi) * math.Sin(lam)
	y = k * (math.Cos(phi0)*math.Sin(phi) - math.Sin(phi0)*math.Cos(phi)*math.Cos(lam))
	return x, y
}

// Name implements Projection.
func (LambertAzimuthal) Name() string { return "Lambert azimuthal equal-area" }

// EqualArea implements Projection.
func (LambertAzimuthal) EqualArea() bool { return true }

// Equirectangular maps longitude and latitude straight to x and y, with
// the parallel Lat0 true to scale. It is not equal-area: a map that uses
// it inflates regions away from Lat0, and says so.
type Equirectangular struct {
	Lat0, Lon0 float64
}

// Project implements Projection.
func (p Equirectangular) Project(lonDeg, latDeg float64) (x, y float64) {
	return wrapLon(lonDeg-p.Lon0) * rad * math.Cos(p.Lat0*rad), latDeg * rad
}

// Name implements Projection.
func (Equirectangular) Name() string { return "equirectangular" }

// EqualArea implements Projection.
func (Equirectangular) EqualArea() bool { return false }

// wrapLon brings a longitude difference into [-180, 180), so that a
// projection centred anywhere sees the shortest way round.
func wrapLon(d float64) float64 {
	d = math.Mod(d+180, 360)
	if d < 0 {
		d += 360
	}
	return d - 180
}

// Extent is a range of longitudes and latitudes in degrees. A range that
// crosses the antimeridian has West > East.
type Extent struct {
	West, South, East, North float64
}

// Width is the extent's span of longitude in degrees.
func (e Extent) Width() float64 {
	w := e.East - e.West
	if w < 0 {
		w += 360
	}
	return w
}

// CentreLon is the longitude halfway across the extent.
func (e Extent) CentreLon() float64 { return wrapLon(e.West + e.Width()/2) }

// LongitudeExtent is the narrowest range of longitudes that holds every
// longitude given: the complement of the widest gap between them around
// the globe, so that islands either side of the antimeridian make a narrow
// range across it rather than one round the world.
func LongitudeExtent(lons []float64) (west, east float64, ok bool) {
	if len(lons) == 0 {
		return 0, 0, false
	}
	s := make([]float64, 0, len(lons))
	for _, l := range lons {
		if !math.IsNaN(l) && !math.IsInf(l, 0) {
			s = append(s, wrapLon(l))
		}
	}
	if len(s) == 0 {
		return 0, 0, false
	}
	slices.Sort(s)
	gap, at := s[0]+360-s[len(s)-1], len(s)-1 // the gap across the antimeridian
	for i := 1; i < len(s); i++ {
		if g := s[i] - s[i-1]; g > gap {
			gap, at = g, i-1
		}
	}
	return s[(at+1)%len(s)], s[at], true
}

// ChooseProjection picks the equal-area projection that suits an extent:
// Equal Earth for maps wider than 120° of longitude (a world or a
// hemisphere), Lambert azimuthal for polar regions, and otherwise an
// Albers conic with standard parallels one sixth of the latitude range in
// from each end (Snyder 1987, p. 99, following Deetz and Adams), centred
// on the extent.
func ChooseProjection(e Extent) Projection {
	lon0 := e.CentreLon()
	switch {
	case e.Width() > 120:
		return EqualEarth{Lon0: lon0}
	case e.North > 80 || e.South < -80:
		lat0 := 90.0
		if e.South < -80 {
			lat0 = -90
		}
		return LambertAzimuthal{Lat0: lat0, Lon0: lon0}
	}
	return albersFor(e)
}

// albersFor is the Albers conic for an extent: standard parallels one
// sixth in from each end, origin at its centre.
func albersFor(e Extent) AlbersEqualArea {
	h := e.North - e.South
	lat1, lat2 := e.South+h/6, e.North-h/6
	if math.Abs(lat1+lat2) < 1e-9 {
		// Standard parallels symmetric about the equator make the cone a
		// cylinder the conic formulas cannot draw; nudge one.
		lat2 += 1e-6
	}
	return AlbersEqualArea{Lat0: (e.South + e.North) / 2, Lon0: e.CentreLon(), Lat1: lat1, Lat2: lat2}
}

// ProjectionByName returns the projection called name for an extent:
// "albers", "equal-earth", "lambert", "equirectangular", or "" for
// ChooseProjection's choice.
func ProjectionByName(name string, e Extent) (Projection, error) {
	auto := ChooseProjection(e)
	lat0 := (e.South + e.North) / 2
	switch name {
	case "":
		return auto, nil
	case "albers":
		return albersFor(e), nil
	case "equal-earth":
		return EqualEarth{Lon0: e.CentreLon()}, nil
	case "lambert":
		return LambertAzimuthal{Lat0: lat0, Lon0: e.CentreLon()}, nil
	case "equirectangular":
		return Equirectangular{Lat0: lat0, Lon0: e.CentreLon()}, nil
	}
	return nil, fmt.Errorf("unknown projection %q: use albers, equal-earth, lambert or equirectangular", name)
}
