package geom

import (
	"math"
	"testing"
)

// meridianArcM integrates the WGS 84 meridional radius of curvature
//
//	M(φ) = a(1−e²) / (1 − e² sin²φ)^{3/2}
//
// (the standard ellipsoid formula, written here from memory) from lat0 to lat1 degrees by
// Simpson's rule, independently of the projection code.
func meridianArcM(lat0, lat1 float64) float64 {
	const a, f = 6378137.0, 1 / 298.257223563
	e2 := f * (2 - f)
	m := func(phi float64) float64 {
		s := math.Sin(phi)
		return a * (1 - e2) / math.Pow(1-e2*s*s, 1.5)
	}
	const n = 1000
	h := (lat1 - lat0) * deg / n
	sum := m(lat0*deg) + m(lat1*deg)
	for i := 1; i < n; i++ {
		w := 2.0
		if i%2 == 1 {
			w = 4
		}
		sum += w * m(lat0*deg+float64(i)*h)
	}
	return sum * h / 3
}

// vincentyM returns the WGS 84 ellipsoidal distance in metres between two
// points by Vincenty's inverse formula (T. Vincenty, "Direct and inverse
// solutions of geodesics on the ellipsoid with application of nested
// equations", Survey Review 23(176), 1975, 88–93), written here
// independently of the projection code.
func vincentyM(lon1, lat1, lon2, lat2 float64) float64 {
	const a, f = 6378137.0, 1 / 298.257223563
	b := a * (1 - f)
	L := (lon2 - lon1) * deg
	u1 := math.Atan((1 - f) * math.Tan(lat1*deg))
	u2 := math.Atan((1 - f) * math.Tan(lat2*deg))
	su1, cu1 := math.Sincos(u1)
	su2, cu2 := math.Sincos(u2)
	lambda := L
	var sinS, cosS, sigma, cos2A, cos2Sm float64
	for iter := 0; iter < 200; iter++ {
		sl, cl := math.Sincos(lambda)
		sinS = math.Hypot(cu2*sl, cu1*su2-su1*cu2*cl)
		if sinS == 0 {
			return 0
		}
		cosS = su1*su2 + cu1*cu2*cl
		sigma = math.Atan2(sinS, cosS)
		sinA := cu1 * cu2 * sl / sinS
		cos2A = 1 - sinA*sinA
		cos2Sm = 0
		if cos2A != 0 {
			cos2Sm = cosS - 2*su1*su2/cos2A
		}
		c := f / 16 * cos2A * (4 + f*(4-3*cos2A))
		prev := lambda
		lambda = L + (1-c)*f*sinA*(sigma+c*sinS*(cos2Sm+c*cosS*(-1+2*cos2Sm*cos2Sm)))
		if math.Abs(lambda-prev) < 1e-13 {
			break
		}
	}
	u2sq := cos2A * (a*a - b*b) / (b * b)
	A := 1 + u2sq/16384*(4096+u2sq*(-768+u2sq*(320-175*u2sq)))
	B := u2sq / 1024 * (256 + u2sq*(-128+u2sq*(74-47*u2sq)))
	dSigma := B * sinS * (cos2Sm + B/4*(cosS*(-1+2*cos2Sm*cos2Sm)-
		B/6*cos2Sm*(-3+4*sinS*sinS)*(-3+4*cos2Sm*cos2Sm)))
	return b * A * (sigma - dSigma)
}

func TestMeridianDegree(t *testing.T) {
	// One degree of latitude centred on 45°N along the origin's meridian:
	// the frame's Y difference is the meridian arc, which must match the
	// integral of the WGS 84 meridional radius of curvature. About
	// 111,133 m ≈ 364,609 ft (from memory: tables of the length of a
	// degree of latitude give 111.13 km at 45°).
	f := LocalFrame{OriginLon: -71.3, OriginLat: 45}
	dy := f.ToLocal(-71.3, 45.5).Y - f.ToLocal(-71.3, 44.5).Y
	want := meridianArcM(44.5, 45.5) / MetersPerFoot
	if !near(dy, want, 0.003) {
		t.Errorf("1° of latitude at 45°: frame %.4f ft, integral %.4f ft", dy, want)
	}
	if !near(dy, 364609, 5) {
		t.Errorf("1° of latitude at 45°: %.1f ft, expected about 364,609 ft", dy)
	}
	if o := f.ToLocal(-71.3, 45); o.X != 0 || math.Abs(o.Y) > 1e-9 {
		t.Errorf("origin maps to %v, want (0,0)", o)
	}
}

func TestLocalFrameDistances(t *testing.T) {
	// Distances in the frame against Vincenty's ellipsoidal distance, for
	// points up to about 5 miles from the origin in every direction. The
	// projection's scale 1 + x²/(2R²) lets them run long by at most
	// ~1 ppm; allow 2 ppm plus 0.01 ft.
	for _, org := range []LocalFrame{{-71.3, 45}, {12.5, -33.9}, {151.2, 60.2}, {179.99, 10}} {
		var pts [][2]float64
		for _, d := range [][2]float64{{0, 0}, {0.07, 0}, {-0.05, 0.06}, {0.1, -0.04}, {-0.09, -0.07}, {0.003, 0.001}} {
			pts = append(pts, [2]float64{org.OriginLon + d[0], org.OriginLat + d[1]})
		}
		for i := range pts {
			for j := i + 1; j < len(pts); j++ {
				p := org.ToLocal(pts[i][0], pts[i][1])
				q := org.ToLocal(pts[j][0], pts[j][1])
				got := p.Dist(q)
				want := vincentyM(pts[i][0], pts[i][1], pts[j][0], pts[j][1]) / MetersPerFoot
				if math.Abs(got-want) > 2e-6*want+0.01 {
					t.Errorf("origin %v: %v–%v frame %.4f ft, Vincenty %.4f ft (%.2g ppm)",
						org, pts[i], pts[j], got, want, (got-want)/want*1e6)
				}
			}
		}
	}
}

func TestLocalFrameRoundTrip(t *testing.T) {
	for _, org := range []LocalFrame{{-71.3, 45}, {12.5, -33.9}, {179.99, 10}, {0, 0}, {-120, 71}} {
		for _, p := range []Point{{0, 0}, {1000, 2000}, {-26400, 15000}, {20000, -26400}, {0.5, -0.25}} {
			lon, lat := org.ToLonLat(p)
			back := org.ToLocal(lon, lat)
			if back.Dist(p) > 1e-7 { // northings of ~10⁷ m carry ~1e-9 m of rounding
				t.Errorf("origin %v: %v → (%.9f, %.9f) → %v", org, p, lon, lat, back)
			}
		}
	}
	// East of the origin along the parallel, X is nearly the parallel's
	// arc and Y rises poleward by about x² tan φ / (2ν): transverse
	// Mercator draws parallels concave toward the pole (Snyder, Map
	// Projections — A Working Manual, USGS PP 1395, transverse Mercator
	// series for y, leading term with A = Δλ cos φ; from memory).
	f := LocalFrame{-71.3, 45}
	p := f.ToLocal(-71.2, 45)
	nuFt := 6378137.0 / math.Sqrt(1-0.00669437999014*0.5) / MetersPerFoot // ν at 45°, e² of WGS 84
	if want := p.X * p.X * math.Tan(45*deg) / (2 * nuFt); !near(p.Y, want, 0.01*want) {
		t.Errorf("0.1° east along the parallel maps to %v; Y want about %.3f", p, want)
	}
	if arc := nuFt * math.Cos(45*deg) * 0.1 * deg; !near(p.X, arc, 1e-5*arc) {
		t.Errorf("0.1° east along the parallel: X %v, parallel arc ν cos φ Δλ = %v", p.X, arc)
	}
}
