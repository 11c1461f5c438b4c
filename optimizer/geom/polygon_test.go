package geom

import (
	"errors"
	"math"
	"strings"
	"testing"
)

var (
	rect30x20 = Polygon{{0, 0}, {30, 0}, {30, 20}, {0, 20}}
	// lShape: a 20 × 10 foot bar along the bottom with a 10 × 20 foot bar
	// standing on its west end.
	lShape   = Polygon{{0, 0}, {20, 0}, {20, 10}, {10, 10}, {10, 30}, {0, 30}}
	tri345   = Polygon{{0, 0}, {4, 0}, {0, 3}}
	bowTie   = Polygon{{0, 0}, {2, 2}, {2, 0}, {0, 2}}
	clockL   = Polygon{{0, 30}, {10, 30}, {10, 10}, {20, 10}, {20, 0}, {0, 0}}
	unitDiag = Polygon{{0, 0}, {1, 0}, {1, 1}, {0, 1}}
)

func near(a, b, tol float64) bool { return math.Abs(a-b) <= tol }

func TestAreaPerimeterCentroid(t *testing.T) {
	// Shoelace formula, hand computation: each row's area, perimeter and
	// centroid were worked by hand from the vertex list (the L's centroid
	// as the area-weighted mean of its two 200 ft² bars, centred at
	// (10, 5) and (5, 20)).
	tests := []struct {
		name      string
		p         Polygon
		signed    float64
		perimeter float64
		centroid  Point
	}{
		{"rectangle 30×20 ccw", rect30x20, 600, 100, Point{15, 10}},
		{"L-shape ccw", lShape, 400, 100, Point{7.5, 12.5}},
		{"L-shape cw", clockL, -400, 100, Point{7.5, 12.5}},
		{"3-4-5 triangle", tri345, 6, 12, Point{4.0 / 3, 1}},
		{"far from origin", Polygon{{1e6, 1e6}, {1e6 + 30, 1e6}, {1e6 + 30, 1e6 + 20}, {1e6, 1e6 + 20}}, 600, 100, Point{1e6 + 15, 1e6 + 10}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			if got := tc.p.SignedArea(); !near(got, tc.signed, 1e-9) {
				t.Errorf("SignedArea = %v, want %v", got, tc.signed)
			}
			if got := tc.p.Area(); !near(got, math.Abs(tc.signed), 1e-9) {
				t.Errorf("Area = %v, want %v", got, math.Abs(tc.signed))
			}
			if got := tc.p.Perimeter(); !near(got, tc.perimeter, 1e-9) {
				t.Errorf("Perimeter = %v, want %v", got, tc.perimeter)
			}
			if got := tc.p.Centroid(); !near(got.X, tc.centroid.X, 1e-9) || !near(got.Y, tc.centroid.Y, 1e-9) {
				t.Errorf("Centroid = %v, want %v", got, tc.centroid)
			}
		})
	}
	if b := lShape.Bounds(); b != (Rect{Point{0, 0}, Point{20, 30}}) {
		t.Errorf("Bounds = %v", b)
	}
}

func TestContains(t *testing.T) {
	tests := []struct {
		name string
		p    Polygon
		q    Point
		want bool
	}{
		{"interior", rect30x20, Point{5, 5}, true},
		{"vertex", rect30x20, Point{30, 20}, true},
		{"on bottom edge", rect30x20, Point{12, 0}, true},
		{"on top edge", rect30x20, Point{12, 20}, true},
		{"on west edge", rect30x20, Point{0, 7}, true},
		{"within tolerance outside", rect30x20, Point{30 + BoundaryTolFt/2, 5}, true},
		{"just outside", rect30x20, Point{30.001, 5}, false},
		{"far outside", rect30x20, Point{-5, -5}, false},
		{"L notch is outside", lShape, Point{15, 20}, false},
		{"L inner corner", lShape, Point{10, 10}, true},
		{"L level with reflex vertex, inside", lShape, Point{5, 10}, true},
		{"L level with reflex vertex, outside", lShape, Point{25, 10}, false},
		{"ray through two vertices", lShape, Point{-1, 30}, false},
		{"triangle hypotenuse midpoint", tri345, Point{2, 1.5}, true},
		{"triangle beyond hypotenuse", tri345, Point{2.1, 1.6}, false},
		{"empty polygon", Polygon{}, Point{}, false},
	}
	for _, tc := range tests {
		if got := tc.p.Contains(tc.q); got != tc.want {
			t.Errorf("%s: Contains(%v) = %v, want %v", tc.name, tc.q, got, tc.want)
		}
	}
}

func TestIsSimple(t *testing.T) {
	tests := []struct {
		name    string
		p       Polygon
		wantErr string // substring; "" for simple
	}{
		{"rectangle", rect30x20, ""},
		{"L-shape", lShape, ""},
		{"clockwise L", clockL, ""},
		{"triangle", tri345, ""},
		{"collinear vertex on an edge", Polygon{{0, 0}, {5, 0}, {10, 0}, {10, 10}, {0, 10}}, ""},
		{"bow-tie", bowTie, "edge 0 (0, 0)–(2, 2) and edge 2 (2, 0)–(0, 2) intersect"},
		{"two points", Polygon{{0, 0}, {1, 1}}, "need at least 3"},
		{"collinear", Polygon{{0, 0}, {1, 1}, {2, 2}}, "fold back"},
		{"repeated vertex", Polygon{{0, 0}, {1, 0}, {1, 0}, {0, 1}}, "zero-length edge"},
		{"spike folding back", Polygon{{0, 0}, {10, 0}, {10, 10}, {10, 5}, {0, 10}}, "edge 1 (10, 0)–(10, 10) and edge 3 (10, 5)–(0, 10) intersect"},
		{"touching vertex (figure eight)", Polygon{{0, 0}, {2, 0}, {1, 1}, {2, 2}, {0, 2}, {1, 1}}, "intersect"},
		{"NaN vertex", Polygon{{0, 0}, {math.NaN(), 0}, {0, 1}}, "not a finite point"},
		{"double bow-tie", Polygon{{0, 0}, {4, 4}, {4, 0}, {0, 4}, {-1, 2}}, "intersect"},
	}
	for _, tc := range tests {
		err := tc.p.IsSimple()
		switch {
		case tc.wantErr == "" && err != nil:
			t.Errorf("%s: unexpected error %v", tc.name, err)
		case tc.wantErr != "" && err == nil:
			t.Errorf("%s: no error, want %q", tc.name, tc.wantErr)
		case tc.wantErr != "" && (!strings.Contains(err.Error(), tc.wantErr) || !errors.Is(err, ErrNotSimple)):
			t.Errorf("%s: error %q, want it to contain %q and wrap ErrNotSimple", tc.name, err, tc.wantErr)
		}
	}
}

func TestInsideOverlaps(t *testing.T) {
	// A U open to the north: its notch is the square (10,10)–(20,30).
	u := Polygon{{0, 0}, {30, 0}, {30, 30}, {20, 30}, {20, 10}, {10, 10}, {10, 30}, {0, 30}}
	sq := func(x0, y0, x1, y1 float64) Polygon { return Polygon{{x0, y0}, {x1, y0}, {x1, y1}, {x0, y1}} }
	tests := []struct {
		name            string
		p, other        Polygon
		inside, overlap bool
	}{
		{"small in big", sq(1, 1, 2, 2), rect30x20, true, true},
		{"big in small", rect30x20, sq(1, 1, 2, 2), false, true},
		{"same", rect30x20, rect30x20, true, true},
		{"shares an edge from inside", sq(0, 0, 10, 20), rect30x20, true, true},
		{"edge neighbour", sq(30, 0, 40, 20), rect30x20, false, false},
		{"corner neighbour", sq(30, 20, 40, 30), rect30x20, false, false},
		{"far apart", sq(100, 100, 110, 110), rect30x20, false, false},
		{"crossing", sq(25, 5, 35, 15), rect30x20, false, true},
		{"bar across the U's notch, ends on the arms", sq(5, 20, 25, 25), u, false, true},
		{"notch filler touches only", sq(10, 10, 20, 30), u, false, false},
		{"inside the U's base", sq(1, 1, 29, 9), u, true, true},
		{"cross shape through square", Polygon{{-5, 8}, {35, 8}, {35, 12}, {-5, 12}}, rect30x20, false, true},
	}
	for _, tc := range tests {
		if got := tc.p.Inside(tc.other); got != tc.inside {
			t.Errorf("%s: Inside = %v, want %v", tc.name, got, tc.inside)
		}
		if got := tc.p.Overlaps(tc.other); got != tc.overlap {
			t.Errorf("%s: Overlaps = %v, want %v", tc.name, got, tc.overlap)
		}
		if got := tc.other.Overlaps(tc.p); got != tc.overlap {
			t.Errorf("%s: Overlaps (swapped) = %v, want %v", tc.name, got, tc.overlap)
		}
	}
	// A triangle whose long edge runs from the U's base through its reflex
	// vertex (10,10), across the open notch and onto the right arm's inner
	// edge at (20,20): every vertex is in the U and no edges cross
	// properly, yet it is not inside — only the edge-piece test catches it.
	tri := Polygon{{5, 5}, {25, 5}, {25, 25}}
	for _, v := range tri {
		if !u.Contains(v) {
			t.Fatalf("test set-up: vertex %v should be in the U", v)
		}
	}
	if tri.Inside(u) {
		t.Error("triangle through the U's notch reported inside")
	}
	if !tri.Overlaps(u) {
		t.Error("triangle through the U's notch reported not overlapping")
	}
}

func TestDistanceCornersBoundary(t *testing.T) {
	if d := rect30x20.DistanceToBoundary(Point{5, 8}); !near(d, 5, 1e-12) {
		t.Errorf("DistanceToBoundary inside = %v, want 5", d)
	}
	if d := rect30x20.DistanceToBoundary(Point{33, 24}); !near(d, 5, 1e-12) { // 3-4-5
		t.Errorf("DistanceToBoundary outside corner = %v, want 5", d)
	}
	if c := lShape.Corners(); len(c) != 6 {
		t.Errorf("L corners = %v, want all 6 vertices", c)
	}
	straight := Polygon{{0, 0}, {5, 0}, {10, 0.5}, {10, 10}, {0, 10}} // 5.7° bend at (5,0)
	if c := straight.Corners(); len(c) != 4 || c[0] != (Point{0, 0}) || c[1] != (Point{10, 0.5}) {
		t.Errorf("Corners with a slight bend = %v, want 4 without (5,0)", c)
	}
	if c := straight.CornersAbove(5); len(c) != 5 {
		t.Errorf("CornersAbove(5) = %v, want all 5", c)
	}
	pts := rect30x20.PointsAlongBoundary(7)
	// 30-ft edges in 5 pieces of 6 ft, 20-ft edges in 3 pieces of 6.67 ft.
	if len(pts) != 16 {
		t.Fatalf("PointsAlongBoundary(7) gave %d points, want 16", len(pts))
	}
	for i, q := range pts {
		if rect30x20.DistanceToBoundary(q) > 1e-12 {
			t.Errorf("point %d %v off the boundary", i, q)
		}
		if d := q.Dist(pts[(i+1)%len(pts)]); d > 7+1e-12 {
			t.Errorf("points %d and %d are %v ft apart, more than the step", i, i+1, d)
		}
	}
	if e := unitDiag.Edges(); len(e) != 4 || e[3] != (Segment{Point{0, 1}, Point{0, 0}}) {
		t.Errorf("Edges = %v", e)
	}
	if got := (Polygon{{0, 0}, {1, 0}, {1, 0}, {0, 1}, {0, 0}}).Clean(); len(got) != 3 {
		t.Errorf("Clean = %v, want 3 vertices", got)
	}
}

func TestRect(t *testing.T) {
	r := Rect{Point{0, 0}, Point{10, 5}}
	if !r.Contains(Point{10, 5}) || r.Contains(Point{10.1, 5}) {
		t.Error("Rect.Contains boundary handling wrong")
	}
	if e := r.Expand(2); e != (Rect{Point{-2, -2}, Point{12, 7}}) {
		t.Errorf("Expand = %v", e)
	}
	if e := r.Expand(-3); e.Min.Y != 2.5 || e.Max.Y != 2.5 || e.Min.X != 3 || e.Max.X != 7 {
		t.Errorf("Expand(-3) = %v", e)
	}
	if !r.Intersects(Rect{Point{10, 5}, Point{20, 20}}) || r.Intersects(Rect{Point{10.5, 0}, Point{20, 20}}) {
		t.Error("Rect.Intersects wrong")
	}
	if r.Area() != 50 {
		t.Errorf("Area = %v", r.Area())
	}
}
