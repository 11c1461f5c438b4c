package geom

import "math"

// MetersPerFoot is the international foot (exact, by the 1959 agreement of
// the English-speaking national standards laboratories). The local frame
// is in international feet; the US survey foot (1200/3937 m) differs by
// 2 ppm, 0.01 ft in a mile.
const MetersPerFoot = 0.3048

// WGS 84 defining parameters a and 1/f (NIMA TR8350.2, 3rd ed., defining
// parameters table; table number from memory).
const (
	wgs84A = 6378137.0         // semi-major axis, m
	wgs84F = 1 / 298.257223563 // flattening
)

// Series coefficients of the transverse Mercator projection to fourth order
// in the third flattening n = f/(2−f): Krüger (1912), as given by Karney,
// "Transverse Mercator with an accuracy of a few nanometers", J. Geodesy
// 85 (2011) 475–485, eqs. (7), (9), (35), (36). Truncated at n⁴ they are
// good to well under a millimetre within a few thousand km of the central
// meridian.
var tm = func() (c struct {
	a, e        float64
	alpha, beta [4]float64
	delta       [4]float64
}) {
	n := wgs84F / (2 - wgs84F)
	n2, n3, n4 := n*n, n*n*n, n*n*n*n
	c.a = wgs84A / (1 + n) * (1 + n2/4 + n4/64) // rectifying radius
	c.e = math.Sqrt(wgs84F * (2 - wgs84F))      // first eccentricity, 2√n/(1+n)
	c.alpha = [4]float64{
		n/2 - 2*n2/3 + 5*n3/16 + 41*n4/180,
		13*n2/48 - 3*n3/5 + 557*n4/1440,
		61*n3/240 - 103*n4/140,
		49561 * n4 / 161280,
	}
	c.beta = [4]float64{
		n/2 - 2*n2/3 + 37*n3/96 - n4/360,
		n2/48 + n3/15 - 437*n4/1440,
		17*n3/480 - 37*n4/840,
		4397 * n4 / 161280,
	}
	c.delta = [4]float64{
		2*n - 2*n2/3 - 2*n3 + 116*n4/45,
		7*n2/3 - 8*n3/5 - 227*n4/45,
		56*n3/15 - 136*n4/35,
		4279 * n4 / 630,
	}
	return c
}()

// tmForward returns the transverse Mercator easting and northing in metres,
// scale 1 on the central meridian, of latitude phi and longitude offset dl
// from the central meridian (radians).
func tmForward(phi, dl float64) (e, n float64) {
	s := math.Sin(phi)
	t := math.Sinh(math.Atanh(s) - tm.e*math.Atanh(tm.e*s))
	xi1 := math.Atan2(t, math.Cos(dl))
	eta1 := math.Atanh(math.Sin(dl) / math.Sqrt(1+t*t))
	xi, eta := xi1, eta1
	for j, a := range tm.alpha {
		k := 2 * float64(j+1)
		xi += a * math.Sin(k*xi1) * math.Cosh(k*eta1)
		eta += a * math.Cos(k*xi1) * math.Sinh(k*eta1)
	}
	return tm.a * eta, tm.a * xi
}

// tmInverse undoes tmForward.
func tmInverse(e, n float64) (phi, dl float64) {
	xi, eta := n/tm.a, e/tm.a
	xi1, eta1 := xi, eta
	for j, b := range tm.beta {
		k := 2 * float64(j+1)
		xi1 -= b * math.Sin(k*xi) * math.Cosh(k*eta)
		eta1 -= b * math.Cos(k*xi) * math.Sinh(k*eta)
	}
	chi := math.Asin(math.Sin(xi1) / math.Cosh(eta1))
	phi = chi
	for j, d := range tm.delta {
		phi += d * math.Sin(2*float64(j+1)*chi)
	}
	return phi, math.Atan2(math.Sinh(eta1), math.Cos(xi1))
}

// LocalFrame maps WGS 84 longitude and latitude (degrees, the coordinates
// of GeoJSON, RFC 7946 §4) to a site's local frame in international feet
// and back. The frame is a transverse Mercator projection of the WGS 84
// ellipsoid whose central meridian passes through the origin, with scale 1
// on that meridian, shifted so the origin is (0, 0): X is east, Y is grid
// north (true north along the origin's meridian).
//
// Accuracy: the projection is conformal and its scale is 1 + x²/(2R²) at a
// distance x from the central meridian (R ≈ 20.9 million ft), so distances
// measured in the frame are long by 0.3 ppm at 3 miles east or west and
// 0.8 ppm at 5 miles — under 0.03 ft across a 5-mile site, far below
// stakeout precision. The series themselves are good to better than a
// millimetre (Karney 2011). The inverse is polished by fixed-point steps so that the round trip
// ToLocal(ToLonLat(p)) returns p to about a micro-foot.
// Unlike a plain equirectangular mapping (error ~ tan φ · Δφ, about 0.1%
// at 5 miles north of a 45° origin) it keeps distances right in every
// direction.
type LocalFrame struct {
	OriginLon, OriginLat float64 // degrees
}

const deg = math.Pi / 180

// ToLocal returns the local-frame point of a longitude and latitude in
// degrees.
func (f LocalFrame) ToLocal(lon, lat float64) Point {
	_, n0 := tmForward(f.OriginLat*deg, 0)
	e, n := tmForward(lat*deg, wrapLon(lon-f.OriginLon)*deg)
	return Point{e / MetersPerFoot, (n - n0) / MetersPerFoot}
}

// ToLonLat returns the longitude and latitude in degrees of a local-frame
// point.
func (f LocalFrame) ToLonLat(p Point) (lon, lat float64) {
	_, n0 := tmForward(f.OriginLat*deg, 0)
	e, n := p.X*MetersPerFoot, p.Y*MetersPerFoot+n0
	phi, dl := tmInverse(e, n)
	// The truncated inverse series leave a few micrometres; polish with
	// fixed-point steps on the forward map, whose Jacobian is close to
	// diag(ν cos φ, ρ) (scale ≈ 1 and a small grid convergence, so each
	// step shrinks the error a thousandfold within miles of the origin).
	for range 3 {
		e1, n1 := tmForward(phi, dl)
		s2 := math.Sin(phi)
		w := 1 - tm.e*tm.e*s2*s2
		nu := wgs84A / math.Sqrt(w)
		rho := wgs84A * (1 - tm.e*tm.e) / (w * math.Sqrt(w))
		phi += (n - n1) / rho
		dl += (e - e1) / (nu * math.Cos(phi))
	}
	return wrapLon(f.OriginLon + dl/deg), phi / deg
}

// wrapLon brings a longitude difference or longitude into (−180°, 180°].
func wrapLon(d float64) float64 {
	d = math.Mod(d, 360)
	switch {
	case d > 180:
		d -= 360
	case d <= -180:
		d += 360
	}
	return d
}
