package candidates

import (
	"errors"
	"math"
	"reflect"
	"strings"
	"testing"

	"github.com/rigmix/rigmix/optimizer/geom"
)

func square(x0, y0, x1, y1 float64) geom.Polygon {
	return geom.Polygon{{X: x0, Y: y0}, {X: x1, Y: y0}, {X: x1, Y: y1}, {X: x0, Y: y1}}
}

// checkCoverage verifies every cell's CoveredBy against a brute-force scan
// of all candidates with the covering radius written out independently,
// and that uncoverable cells have no candidate of their zone in reach.
func checkCoverage(t *testing.T, l *Layout, radius []float64) {
	t.Helper()
	within := func(c Cell) []int {
		var ids []int
		for j, cd := range l.Candidates {
			if cd.Zone == c.Zone && cd.P.Dist(c.P) <= radius[c.Zone]*(1+1e-9) {
				ids = append(ids, j)
			}
		}
		return ids
	}
	for k, c := range l.Cells {
		if want := within(c); !reflect.DeepEqual(c.CoveredBy, want) {
			t.Fatalf("cell %d at %v: CoveredBy %v, brute force %v", k, c.P, c.CoveredBy, want)
		}
	}
	for k, c := range l.Uncoverable {
		if want := within(c); len(want) != 0 || len(c.CoveredBy) != 0 {
			t.Fatalf("uncoverable cell %d at %v has candidates %v in reach", k, c.P, want)
		}
	}
	for i, r := range radius {
		if !near(l.RadiusFt[i], r) {
			t.Errorf("zone %d radius %v, want %v", i, l.RadiusFt[i], r)
		}
	}
}

func near(a, b float64) bool { return math.Abs(a-b) <= 1e-9*math.Max(1, math.Abs(b)) }

func zoneAreas(l *Layout, n int) []float64 {
	a := make([]float64, n)
	for _, c := range l.Cells {
		a[c.Zone] += c.AreaFt2
	}
	for _, c := range l.Uncoverable {
		a[c.Zone] += c.AreaFt2
	}
	return a
}

func TestSquareZone(t *testing.T) {
	// 200 × 200 ft zone, 100-ft square spacing rule, cells at a quarter
	// of the spacing (the default is an eighth). Hand
	// computation: candidate spacing 50 ft centred in the box gives
	// 4 × 4 lattice points at 25, 75, 125, 175; each 200-ft edge is cut
	// into four 50-ft pieces, 16 boundary points; 32 candidates. Cells at
	// 25 ft: 8 × 8 = 64, each 40,000/64 = 625 ft² (shoelace formula, hand
	// computation: 200 × 200 = 40,000 ft²). Radius 100/√2 (plane geometry).
	l, err := Generate([]ZoneInput{{ID: "pad", Polygon: square(0, 0, 200, 200), SpacingFt: 100, Lattice: geom.Square}}, nil, Options{CellFraction: 0.25})
	if err != nil {
		t.Fatal(err)
	}
	if len(l.Candidates) != 32 {
		t.Errorf("%d candidates, want 32", len(l.Candidates))
	}
	if len(l.Cells) != 64 || len(l.Uncoverable) != 0 {
		t.Errorf("%d cells, %d uncoverable; want 64 and 0 (every cell covered)", len(l.Cells), len(l.Uncoverable))
	}
	for _, c := range l.Cells {
		if !near(c.AreaFt2, 625) || c.Weight != 1 {
			t.Errorf("cell %v area %v weight %v, want 625 and 1", c.P, c.AreaFt2, c.Weight)
		}
	}
	checkCoverage(t, l, []float64{100 / math.Sqrt2})
	checkRows(t, l)
}

func TestTriangularRadius(t *testing.T) {
	// Same zone on a triangular rule: radius 100/√3 ≈ 57.7 ft instead of
	// 70.7 (plane geometry; SOURCES.md, covering radius of a lattice).
	zs := []ZoneInput{
		{ID: "tri", Polygon: square(0, 0, 300, 200), SpacingFt: 100, Lattice: geom.Triangular},
		{ID: "sq", Polygon: square(0, 0, 300, 200), SpacingFt: 100, Lattice: geom.Square},
	}
	l, err := Generate(zs, nil, Options{})
	if err != nil {
		t.Fatal(err)
	}
	checkCoverage(t, l, []float64{100 / math.Sqrt(3), 100 / math.Sqrt2})
	// A triangular lattice's candidates come in rows 50·√3/2 = 43.3 ft
	// apart (candidate spacing 50 ft).
	ys := map[float64]bool{}
	for _, c := range l.Candidates {
		if c.Zone == 0 && c.P.X > 0 && c.P.X < 300 && c.P.Y > 0 && c.P.Y < 200 {
			ys[math.Round(c.P.Y*1e6)/1e6] = true
		}
	}
	// ceil(200/43.30) = 5 rows spanning 173.2 ft, centred: y = 13.4 … 186.6.
	if len(ys) != 5 {
		t.Errorf("triangular zone has %d interior candidate rows, want 5: %v", len(ys), ys)
	}
	var nTri, nSq int
	for _, c := range l.Cells {
		if c.Zone == 0 {
			nTri += len(c.CoveredBy)
		} else {
			nSq += len(c.CoveredBy)
		}
	}
	if nTri >= nSq {
		t.Errorf("triangular rule covers %d cell–candidate pairs, square %d; the smaller radius should give fewer", nTri, nSq)
	}
}

func TestAreaSharesSumToPolygon(t *testing.T) {
	// Shoelace formula, hand computation: L of two 200 × 100 ft bars
	// (40,000 ft²), right triangle with legs 300 and 400 ft (60,000 ft²),
	// a 10 × 1000 ft strip (10,000 ft²).
	zs := []ZoneInput{
		{ID: "L", Polygon: geom.Polygon{{X: 0, Y: 0}, {X: 200, Y: 0}, {X: 200, Y: 100}, {X: 100, Y: 100}, {X: 100, Y: 300}, {X: 0, Y: 300}}, SpacingFt: 100},
		{ID: "tri", Polygon: geom.Polygon{{X: 1000, Y: 0}, {X: 1400, Y: 0}, {X: 1000, Y: 300}}, SpacingFt: 60, Lattice: geom.Triangular, Weight: 3},
		{ID: "strip", Polygon: square(0, 1000, 1000, 1010), SpacingFt: 100},
	}
	l, err := Generate(zs, []geom.Polygon{square(1050, 50, 1150, 150)}, Options{CellFraction: 0.25})
	if err != nil {
		t.Fatal(err)
	}
	for i, want := range []float64{40000, 60000, 10000} {
		if got := zoneAreas(l, len(zs))[i]; !near(got, want) {
			t.Errorf("zone %s: cell areas sum to %v, want %v", zs[i].ID, got, want)
		}
	}
	for _, c := range l.Cells {
		if want := []float64{1, 3, 1}[c.Zone]; c.Weight != want {
			t.Errorf("cell in zone %d has weight %v, want %v", c.Zone, c.Weight, want)
		}
	}
	// The strip is narrower than the 25-ft cell spacing and the 50-ft
	// candidate spacing, yet gets a centred row of both and is covered.
	var stripCells, stripCands int
	for _, c := range l.Cells {
		if c.Zone == 2 {
			stripCells++
		}
	}
	for _, c := range l.Candidates {
		if c.Zone == 2 {
			stripCands++
		}
	}
	if stripCells != 40 || stripCands == 0 {
		t.Errorf("strip: %d cells (want 40 along the centre line), %d candidates", stripCells, stripCands)
	}
	for _, c := range l.Uncoverable {
		if c.Zone == 2 || c.Zone == 0 {
			t.Errorf("uncoverable cell %v in zone %d with no no-go area", c.P, c.Zone)
		}
	}
	checkCoverage(t, l, []float64{100 / math.Sqrt2, 60 / math.Sqrt(3), 100 / math.Sqrt2})
	checkRows(t, l)
}

func TestNoGo(t *testing.T) {
	zone := []ZoneInput{{ID: "yard", Polygon: square(0, 0, 400, 400), SpacingFt: 100}}
	pond := square(100, 100, 300, 300)
	free, err := Generate(zone, nil, Options{})
	if err != nil {
		t.Fatal(err)
	}
	l, err := Generate(zone, []geom.Polygon{pond}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if len(l.Candidates) >= len(free.Candidates) {
		t.Errorf("no-go area left %d candidates of %d", len(l.Candidates), len(free.Candidates))
	}
	for _, c := range l.Candidates {
		if pond.Contains(c.P) {
			t.Errorf("candidate %v inside the no-go area", c.P)
		}
	}
	// Ground in the middle of the pond is more than 70.7 ft from its
	// edge, so some cells cannot be covered; they still carry area.
	if len(l.Uncoverable) == 0 {
		t.Error("no uncoverable cells in the middle of a 200-ft no-go square")
	}
	for _, c := range l.Uncoverable {
		if !pond.Contains(c.P) {
			t.Errorf("uncoverable cell %v outside the no-go area", c.P)
		}
	}
	if got := zoneAreas(l, 1)[0]; !near(got, 160000) {
		t.Errorf("areas sum to %v, want 160,000 ft²", got)
	}
	checkCoverage(t, l, []float64{100 / math.Sqrt2})
	checkRows(t, l)
}

func TestInputErrors(t *testing.T) {
	ok := square(0, 0, 100, 100)
	tests := []struct {
		name  string
		zones []ZoneInput
		noGo  []geom.Polygon
		opt   Options
		want  string
	}{
		{"required in no-go", []ZoneInput{{ID: "pad", Polygon: ok, SpacingFt: 50, Required: []geom.Point{{X: 10, Y: 10}, {X: 50, Y: 50}}}},
			[]geom.Polygon{square(40, 40, 60, 60)}, Options{}, `zone "pad" (zones[0]): Required[1] (50, 50) lies in no-go area noGo[0]`},
		{"required outside zone", []ZoneInput{{ID: "pad", Polygon: ok, Required: []geom.Point{{X: 150, Y: 50}}}},
			nil, Options{}, `zone "pad" (zones[0]): Required[0] (150, 50) lies outside the zone polygon`},
		{"bow-tie zone", []ZoneInput{{ID: "bt", Polygon: geom.Polygon{{X: 0, Y: 0}, {X: 2, Y: 2}, {X: 2, Y: 0}, {X: 0, Y: 2}}}},
			nil, Options{}, `zone "bt" (zones[0]): polygon: geom: polygon is not simple: edge 0`},
		{"bad lattice", []ZoneInput{{Polygon: ok, SpacingFt: 50, Lattice: "hex"}}, nil, Options{}, `zones[0]: Lattice is "hex"`},
		{"negative spacing", []ZoneInput{{ID: "a", Polygon: ok, SpacingFt: -5}}, nil, Options{}, "SpacingFt is -5"},
		{"NaN weight", []ZoneInput{{ID: "a", Polygon: ok, Weight: math.NaN()}}, nil, Options{}, "Weight is NaN"},
		{"spacing in inches", []ZoneInput{{ID: "a", Polygon: square(0, 0, 5000, 5000), SpacingFt: 0.5}}, nil, Options{}, "check SpacingFt (feet)"},
		{"bad option", []ZoneInput{{ID: "a", Polygon: ok}}, nil, Options{CellFraction: -1}, "Options.CellFraction is -1"},
		{"bad no-go", []ZoneInput{{ID: "a", Polygon: ok}}, []geom.Polygon{{{X: 0, Y: 0}, {X: 1, Y: 1}}}, Options{}, "noGo[0]: polygon"},
	}
	for _, tc := range tests {
		_, err := Generate(tc.zones, tc.noGo, tc.opt)
		if err == nil || !strings.Contains(err.Error(), tc.want) || !errors.Is(err, ErrInput) {
			t.Errorf("%s: error %v, want one containing %q wrapping ErrInput", tc.name, err, tc.want)
		}
	}
}

func TestFlagsAndNoRule(t *testing.T) {
	// A required point on a lattice position merges with it (kept first,
	// flagged); corners are flagged; a zone without a spacing rule has no
	// cells but about 16 lattice candidates.
	zs := []ZoneInput{
		{ID: "bldg", Polygon: square(0, 0, 200, 100), SpacingFt: 100, Corners: true, Required: []geom.Point{{X: 25, Y: 25}, {X: 26, Y: 26}}},
		{ID: "lot", Polygon: square(500, 0, 900, 400)},
	}
	l, err := Generate(zs, nil, Options{})
	if err != nil {
		t.Fatal(err)
	}
	var req, corner, lot int
	for _, c := range l.Candidates {
		if c.Required {
			req++
			if c.P != (geom.Point{X: 25, Y: 25}) {
				t.Errorf("required candidate at %v", c.P)
			}
		}
		if c.Corner {
			corner++
		}
		if c.Zone == 1 {
			lot++
		}
	}
	if req != 1 || corner != 4 {
		t.Errorf("%d required (want 1: (26,26) merges into (25,25)), %d corners (want 4)", req, corner)
	}
	if l.Candidates[0].P != (geom.Point{X: 25, Y: 25}) || !l.Candidates[0].Required {
		t.Errorf("first candidate %+v, want the required point", l.Candidates[0])
	}
	// Lot: 400 × 400 ft, no rule: spacing √(160000/16) = 100 ft, 4 × 4
	// lattice points, plus boundary points every 100 ft (16).
	if lot != 32 {
		t.Errorf("lot has %d candidates, want 32", lot)
	}
	for _, c := range l.Cells {
		if c.Zone == 1 {
			t.Fatalf("zone without spacing rule has cell %v", c.P)
		}
	}
	if l.RadiusFt[1] != 0 {
		t.Errorf("zone without spacing rule has radius %v", l.RadiusFt[1])
	}
}

func TestDeterminism(t *testing.T) {
	zs := []ZoneInput{
		{ID: "a", Polygon: geom.Polygon{{X: 0, Y: 0}, {X: 730, Y: 40}, {X: 610, Y: 520}, {X: 300, Y: 380}, {X: 20, Y: 600}}, SpacingFt: 75, Lattice: geom.Triangular, Corners: true},
		{ID: "b", Polygon: square(800, 0, 1200, 300), SpacingFt: 120},
	}
	noGo := []geom.Polygon{square(200, 100, 320, 260)}
	l1, err := Generate(zs, noGo, Options{})
	if err != nil {
		t.Fatal(err)
	}
	l2, _ := Generate(zs, noGo, Options{})
	if !reflect.DeepEqual(l1, l2) {
		t.Fatal("two runs on the same input differ")
	}
	checkCoverage(t, l1, []float64{75 / math.Sqrt(3), 120 / math.Sqrt2})
	checkRows(t, l1)
}

func TestCellAreasClipped(t *testing.T) {
	// Hand computation: a 210 × 100 ft zone, 100-ft rule, cells every
	// 25 ft. Columns: ceil(210/25) = 9 centred at 5, 30, …, 205, so the
	// end squares reach 17.5 ft into the zone; rows: 4 centred at 12.5 …
	// 87.5, tiling the height. End-column cells 17.5 × 25 = 437.5 ft²,
	// others 625 ft²; per row 2·437.5 + 7·625 = 5,250, ×4 = 21,000 =
	// 210 × 100 (shoelace formula), so no scaling.
	l, err := Generate([]ZoneInput{{ID: "strip", Polygon: square(0, 0, 210, 100), SpacingFt: 100}}, nil, Options{CellFraction: 0.25})
	if err != nil {
		t.Fatal(err)
	}
	if len(l.Cells) != 36 {
		t.Fatalf("%d cells, want 36", len(l.Cells))
	}
	for _, c := range l.Cells {
		want := 625.0
		if c.P.X < 10 || c.P.X > 200 {
			want = 437.5
		}
		if !near(c.AreaFt2, want) {
			t.Errorf("cell at %v: %v ft², want %v", c.P, c.AreaFt2, want)
		}
	}
}

func TestCellAreasMatchFullClipping(t *testing.T) {
	// The band marking only decides which cells to clip; clipping every
	// cell must give the same areas.
	star := geom.Polygon{}
	for k := 0; k < 14; k++ {
		r := 400.0
		if k%2 == 1 {
			r = 150
		}
		a := float64(k)*math.Pi/7 + 0.1
		star = append(star, geom.Point{X: 500 + r*math.Cos(a), Y: 500 + r*math.Sin(a)})
	}
	for _, p := range []geom.Polygon{star, {{X: 0, Y: 0}, {X: 300, Y: 0}, {X: 300, Y: 300}, {X: 200, Y: 300}, {X: 200, Y: 100}, {X: 100, Y: 100}, {X: 100, Y: 300}, {X: 0, Y: 300}}} {
		for _, c := range []float64{13, 25, 61} {
			o := geom.CentredOrigin(geom.Square, p.Bounds(), c)
			centres := p.Lattice(geom.Square, c, o)
			got := cellAreas(p, centres, c, o)
			for k, q := range centres {
				want := p.ClipToRect(geom.Rect{Min: geom.Point{X: q.X - c/2, Y: q.Y - c/2}, Max: geom.Point{X: q.X + c/2, Y: q.Y + c/2}}).Area()
				if math.Abs(got[k]-want) > 1e-9*c*c {
					t.Fatalf("cell %v spacing %v: area %v, full clipping %v", q, c, got[k], want)
				}
			}
		}
	}
}
