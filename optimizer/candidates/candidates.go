// Package candidates turns a site's zones into the sets a covering model
// needs: candidate exploration points, coverage cells (demand points
// weighted by the ground they stand for) and, for each cell, the candidates
// close enough to cover it under the zone's spacing rule.
//
// A maximum-spacing rule "points no more than s apart on a square
// (triangular) pattern" is read as: every point of the zone lies within the
// pattern's covering radius, s/√2 (s/√3), of an exploration point (plane
// geometry; see geom.CoveringRadius). The zone's ground is sampled by a
// finer square lattice of cells, and a cell is covered by a candidate of
// the same zone within that radius. This is the location set covering
// model of Toregas, Swain, ReVelle and Bergman, "The location of emergency
// service facilities", Operations Research 19(6), 1971, with the covering
// rows reduced by the classical row-domination rule (a row whose candidate
// set contains another row's set is implied by it; a standard set-covering
// reduction, e.g. Garfinkel and Nemhauser, Integer Programming, 1972 —
// from memory).
//
// Cells see the ground at sample spots only; optimizer/plan checks every
// plan against the exact farthest ground (geom.FarthestBySite) and adds
// rows where the cells missed. Demand points along each zone's outline
// (Layout.EdgePoints) spare it most of those rounds.
//
// The package takes plain data and gives plain data: no files, no
// scenario types. Output is deterministic, in zone order and lattice order.
package candidates

import (
	"cmp"
	"errors"
	"fmt"
	"math"
	"slices"

	"github.com/rigmix/rigmix/optimizer/geom"
)

// Defaults for Options fields left at zero.
const (
	DefaultCandidateFraction = 0.5   // candidates at half the rule spacing (PRODUCT.md: "a fraction of the rule's spacing")
	DefaultCellFraction      = 0.125 // cells eight to a spacing: a cell centre is within s/8·√2/2 of all its ground, so few spots escape the cells (see optimizer/plan/exact.go)
	DefaultBoundaryStep      = 0.5   // boundary candidates at half the spacing, as dense as the interior
)

// defaultZoneCandidates is the number of candidates a zone with neither a
// spacing rule nor a candidate spacing gets, so that it still offers the
// model a choice of places (our own choice).
const defaultZoneCandidates = 16

// mergeFraction: candidates closer than this fraction of the zone's
// candidate spacing are one point; the earlier (required, corner, lattice,
// boundary in that order) is kept and the flags are merged. A tenth of the
// spacing is a few feet at usual spacings: closer points would be staked as
// one.
const mergeFraction = 0.1

// maxPointsPerZone bounds the candidates and the cells of one zone, so that
// a spacing typed in the wrong unit is reported, not run out of memory.
const maxPointsPerZone = 4_000_000

// ErrInput is wrapped by every error Generate returns for bad input.
var ErrInput = errors.New("candidates: bad input")

// ZoneInput is one zone of the site as the candidate stage sees it.
type ZoneInput struct {
	ID      string
	Polygon geom.Polygon
	// SpacingFt is the zone's maximum-spacing rule. Zero: no spacing
	// rule, so no coverage cells, but candidates are still generated.
	SpacingFt float64
	// Lattice is the pattern the spacing rule refers to, geom.Square or
	// geom.Triangular ("" means square). It fixes the covering radius
	// s/√2 or s/√3 and the pattern of the candidate lattice.
	Lattice string
	// CandidateSpacingFt is the candidate lattice spacing. Zero:
	// SpacingFt × Options.CandidateFraction; if that is zero too, the
	// spacing that gives the zone about 16 lattice candidates.
	CandidateSpacingFt float64
	Corners            bool         // add a candidate at each polygon corner (geom.DefaultCornerTurnDeg)
	Required           []geom.Point // candidates that must be explored (marked Required)
	Weight             float64      // priority weight of the zone's area; 0 means 1
	// Extra are optional candidates at given places (a hand-laid grid the
	// plan is compared with); those in no-go areas are dropped.
	Extra []geom.Point
}

// Options tune the lattices. Zero fields take the defaults above.
type Options struct {
	CandidateFraction float64 // candidate spacing as a fraction of SpacingFt
	CellFraction      float64 // coverage cell spacing as a fraction of SpacingFt
	BoundaryStep      float64 // spacing of boundary candidates as a fraction of SpacingFt
}

// Candidate is a place where an exploration point may go.
type Candidate struct {
	Zone     int        // index into the zones given to Generate
	P        geom.Point // local frame, feet
	Required bool       // a rule requires this point explored
	Corner   bool       // at a corner of the zone polygon
}

// Cell is a demand point: a piece of a zone's ground that must lie within
// the covering radius of an explored point.
type Cell struct {
	Zone      int
	P         geom.Point
	AreaFt2   float64 // the cell's share of the zone's area; a zone's cells sum to its area
	Weight    float64 // the zone's priority weight
	CoveredBy []int   // indices into Layout.Candidates, ascending
}

// Layout is what Generate produces.
type Layout struct {
	Candidates []Candidate
	// Cells are the coverage cells some candidate covers, in zone and
	// lattice order.
	Cells []Cell
	// Uncoverable are cells no candidate can cover (ground inside or
	// behind a no-go area, farther than the covering radius from any
	// allowed point). They are reported, not constrained.
	Uncoverable []Cell
	// RadiusFt is each zone's covering radius (0 without a spacing rule).
	RadiusFt []float64
	// RowCells is the reduced set of covering rows: each is the
	// candidate set (ascending) of a kept cell. Duplicate rows and rows
	// that contain another row's set are removed, which leaves the set of
	// feasible covers unchanged. Rows are in the order of their cells.
	RowCells [][]int
	// EdgePoints are demand points of no area on the zones' outlines
	// (every vertex, and every cell spacing along each edge): a spacing
	// rule holds on the outline too, where a strip's farthest ground
	// usually lies. Each has a covering row; none counts toward areas.
	EdgePoints []Cell
	// RowCell[k] is the index into Cells, or len(Cells)+j for EdgePoints[j],
	// of the demand point whose set RowCells[k]
	// is (the first cell with that set).
	RowCell []int
}

func (o Options) withDefaults() (Options, error) {
	for _, f := range []struct {
		name string
		v    *float64
		def  float64
	}{
		{"CandidateFraction", &o.CandidateFraction, DefaultCandidateFraction},
		{"CellFraction", &o.CellFraction, DefaultCellFraction},
		{"BoundaryStep", &o.BoundaryStep, DefaultBoundaryStep},
	} {
		switch {
		case *f.v == 0:
			*f.v = f.def
		case !(*f.v > 0) || math.IsInf(*f.v, 0):
			return o, fmt.Errorf("%w: Options.%s is %v; want a positive fraction of the zone spacing such as %v (0 takes that default)",
				ErrInput, f.name, *f.v, f.def)
		}
	}
	return o, nil
}

func zoneName(i int, z ZoneInput) string {
	if z.ID == "" {
		return fmt.Sprintf("zones[%d]", i)
	}
	return fmt.Sprintf("zone %q (zones[%d])", z.ID, i)
}

// zonePlan is a zone's validated numbers.
type zonePlan struct {
	kind      string
	candSpace float64
	boundStep float64
	cellSpace float64 // 0: no cells
	radius    float64
	area      float64
	weight    float64
}

func planZone(i int, z ZoneInput, opt Options) (zonePlan, error) {
	name := zoneName(i, z)
	var zp zonePlan
	if err := z.Polygon.IsSimple(); err != nil {
		return zp, fmt.Errorf("%w: %s: polygon: %v", ErrInput, name, err)
	}
	zp.area = z.Polygon.Area()
	zp.kind = z.Lattice
	if zp.kind == "" {
		zp.kind = geom.Square
	}
	if !geom.ValidLattice(zp.kind) {
		return zp, fmt.Errorf("%w: %s: Lattice is %q; want %q or %q", ErrInput, name, z.Lattice, geom.Square, geom.Triangular)
	}
	for _, f := range []struct {
		field string
		v     float64
	}{{"SpacingFt", z.SpacingFt}, {"CandidateSpacingFt", z.CandidateSpacingFt}, {"Weight", z.Weight}} {
		if !(f.v >= 0) || math.IsInf(f.v, 0) {
			return zp, fmt.Errorf("%w: %s: %s is %v; want a finite number ≥ 0", ErrInput, name, f.field, f.v)
		}
	}
	zp.weight = z.Weight
	if zp.weight == 0 {
		zp.weight = 1
	}
	zp.candSpace = z.CandidateSpacingFt
	if zp.candSpace == 0 {
		zp.candSpace = z.SpacingFt * opt.CandidateFraction
	}
	if zp.candSpace == 0 {
		// Lattice cell area: s² (square), s²·√3/2 (triangular).
		cellArea := 1.0
		if zp.kind == geom.Triangular {
			cellArea = math.Sqrt(3) / 2
		}
		zp.candSpace = math.Sqrt(zp.area / (defaultZoneCandidates * cellArea))
	}
	zp.boundStep = zp.candSpace
	if z.SpacingFt > 0 {
		zp.boundStep = opt.BoundaryStep * z.SpacingFt
		zp.cellSpace = opt.CellFraction * z.SpacingFt
		zp.radius = geom.CoveringRadius(zp.kind, z.SpacingFt)
	}
	b := z.Polygon.Bounds()
	candField := "CandidateSpacingFt"
	if z.CandidateSpacingFt == 0 {
		candField = "SpacingFt"
	}
	for _, f := range []struct {
		what, field string
		s           float64
	}{{"candidates", candField, zp.candSpace}, {"coverage cells", "SpacingFt", zp.cellSpace}} {
		if f.s == 0 {
			continue
		}
		if n := (b.Width()/f.s + 2) * (b.Height()/f.s + 2); n > maxPointsPerZone {
			return zp, fmt.Errorf("%w: %s: a spacing of %g ft over a %.0f × %.0f ft zone gives about %.3g %s, more than %d; check %s (feet)",
				ErrInput, name, f.s, b.Width(), b.Height(), n, f.what, maxPointsPerZone, f.field)
		}
	}
	if n := z.Polygon.Perimeter() / zp.boundStep; n > maxPointsPerZone {
		return zp, fmt.Errorf("%w: %s: boundary step of %g ft gives about %.3g boundary candidates, more than %d",
			ErrInput, name, zp.boundStep, n, maxPointsPerZone)
	}
	return zp, nil
}

// noGoSet answers whether a point lies in a no-go area.
type noGoSet struct {
	polys  []geom.Polygon
	bounds []geom.Rect
}

func (n noGoSet) index(p geom.Point) int {
	for k, b := range n.bounds {
		if b.Contains(p) && n.polys[k].Contains(p) {
			return k
		}
	}
	return -1
}

// Generate builds the candidates, coverage cells and reduced covering rows
// of the zones, with candidates in the no-go polygons removed.
//
// Per zone, candidates are, in this order: the required points, the
// polygon corners (if asked), the lattice points inside the polygon at the
// candidate spacing (centred in the zone's bounding box), and points along
// the boundary every BoundaryStep × SpacingFt, so thin zones and edges are
// coverable. Points in a no-go area (boundary included) are dropped — a
// required one is an error — and points closer than a tenth of the
// candidate spacing are merged into the first.
//
// Cells are a square lattice of spacing CellFraction × SpacingFt centred
// in the zone's box; a cell stands for the part of the zone in the square
// of side CellFraction × SpacingFt around it, scaled so that a zone's
// cells (covered and uncoverable) sum to its shoelace area exactly. A zone
// too thin for any lattice cell gets cells along its boundary instead,
// sharing its area equally.
//
// Cost: O(N log N) in the number of candidates and cells N, plus
// O(rows × vertices) for the scan-line lattice clipping; the covering
// search uses geom.Grid and the row reduction is near-linear for the
// local rows a spatial covering produces.
func Generate(zones []ZoneInput, noGo []geom.Polygon, opt Options) (*Layout, error) {
	opt, err := opt.withDefaults()
	if err != nil {
		return nil, err
	}
	ng := noGoSet{polys: noGo}
	for k, p := range noGo {
		if err := p.IsSimple(); err != nil {
			return nil, fmt.Errorf("%w: noGo[%d]: polygon: %v", ErrInput, k, err)
		}
		ng.bounds = append(ng.bounds, p.Bounds())
	}
	plans := make([]zonePlan, len(zones))
	for i, z := range zones {
		if plans[i], err = planZone(i, z, opt); err != nil {
			return nil, err
		}
	}
	out := &Layout{RadiusFt: make([]float64, len(zones))}
	// The cells' CoveredBy sets are carved from a shared arena; when it
	// grows, earlier sets keep the old backing array, which stays valid.
	var arena []int
	for i, z := range zones {
		zp := plans[i]
		out.RadiusFt[i] = zp.radius
		first := len(out.Candidates)
		cands, err := zoneCandidates(i, z, zp, ng)
		if err != nil {
			return nil, err
		}
		out.Candidates = append(out.Candidates, cands...)
		if zp.cellSpace == 0 {
			continue
		}
		pts := make([]geom.Point, len(cands))
		for k, c := range cands {
			pts[k] = c.P
		}
		grid := geom.NewGrid(pts, zp.radius)
		origin := geom.CentredOrigin(geom.Square, z.Polygon.Bounds(), zp.cellSpace)
		cellPts := z.Polygon.Lattice(geom.Square, zp.cellSpace, origin)
		var areas []float64
		if len(cellPts) > 0 {
			areas = cellAreas(z.Polygon, cellPts, zp.cellSpace, origin)
		} else {
			cellPts = z.Polygon.PointsAlongBoundary(zp.cellSpace)
			areas = make([]float64, len(cellPts))
			for k := range areas {
				areas[k] = 1
			}
		}
		// Scale the raw areas so the zone's cells sum to its area: the
		// ground of squares whose centre falls outside the polygon is
		// spread over the rest in proportion.
		var raw float64
		for _, a := range areas {
			raw += a
		}
		scale := zp.area / raw
		out.Cells = slices.Grow(out.Cells, len(cellPts))
		// Within the covering radius, widened by a billionth so a cell
		// exactly at the radius by construction is not lost to rounding.
		r := zp.radius * (1 + 1e-9)
		var sum float64
		for k, q := range cellPts {
			a := areas[k] * scale
			if k == len(cellPts)-1 {
				a = zp.area - sum // the last cell absorbs the rounding
			}
			sum += a
			c := Cell{Zone: i, P: q, AreaFt2: a, Weight: zp.weight}
			at := len(arena)
			arena = grid.WithinSorted(q, r, arena)
			if len(arena) == at {
				out.Uncoverable = append(out.Uncoverable, c)
				continue
			}
			local := arena[at:len(arena):len(arena)]
			for j := range local {
				local[j] += first
			}
			c.CoveredBy = local
			out.Cells = append(out.Cells, c)
		}
		// The zone's outline, where a strip's farthest ground usually
		// lies, is sampled as finely as its interior: demand points of no
		// area at every vertex and every cell spacing along each edge.
		// Those no allowed point can reach are left to the exact check.
		edgePts := append(slices.Clone(z.Polygon), z.Polygon.PointsAlongBoundary(zp.cellSpace)...)
		for _, q := range edgePts {
			at := len(arena)
			arena = grid.WithinSorted(q, r, arena)
			if len(arena) == at {
				continue
			}
			local := arena[at:len(arena):len(arena)]
			for j := range local {
				local[j] += first
			}
			out.EdgePoints = append(out.EdgePoints, Cell{Zone: i, P: q, Weight: zp.weight, CoveredBy: local})
		}
	}
	out.RowCells, out.RowCell = reduceRows(append(slices.Clip(out.Cells), out.EdgePoints...), len(out.Candidates))
	return out, nil
}

// cellAreas returns, for each cell centre of a square lattice of spacing c
// through origin, the area of the polygon inside the cell's c × c square.
// Squares no edge reaches are whole (c²); the others are clipped exactly
// (geom.Polygon.ClipToRect). The squares an edge reaches are found row band
// by row band from the edge's x-extent within the band, a conservative
// superset, so the cost is O(vertices × bands crossed + boundary cells ×
// vertices) rather than a clip per cell.
func cellAreas(p geom.Polygon, centres []geom.Point, c float64, origin geom.Point) []float64 {
	h := c / 2
	type key struct{ i, j int64 }
	idx := func(v, o float64) float64 { return (v - o) / c }
	touched := make(map[key]bool)
	const eps = 1e-9
	for _, e := range p.Edges() {
		ylo, yhi := math.Min(e.A.Y, e.B.Y), math.Max(e.A.Y, e.B.Y)
		j0 := math.Ceil(idx(ylo-h, origin.Y) - eps)
		j1 := math.Floor(idx(yhi+h, origin.Y) + eps)
		for j := j0; j <= j1; j++ {
			b0, b1 := origin.Y+j*c-h, origin.Y+j*c+h
			// The edge's x-extent within the band [b0, b1].
			var xlo, xhi float64
			if e.A.Y == e.B.Y {
				xlo, xhi = math.Min(e.A.X, e.B.X), math.Max(e.A.X, e.B.X)
			} else {
				t0 := (b0 - e.A.Y) / (e.B.Y - e.A.Y)
				t1 := (b1 - e.A.Y) / (e.B.Y - e.A.Y)
				if t0 > t1 {
					t0, t1 = t1, t0
				}
				t0, t1 = math.Max(0, t0), math.Min(1, t1)
				if t0 > t1 {
					continue
				}
				x0 := e.A.X + t0*(e.B.X-e.A.X)
				x1 := e.A.X + t1*(e.B.X-e.A.X)
				xlo, xhi = math.Min(x0, x1), math.Max(x0, x1)
			}
			i0 := math.Ceil(idx(xlo-h, origin.X) - eps)
			i1 := math.Floor(idx(xhi+h, origin.X) + eps)
			for i := i0; i <= i1; i++ {
				touched[key{int64(i), int64(j)}] = true
			}
		}
	}
	areas := make([]float64, len(centres))
	for k, q := range centres {
		ki := key{int64(math.Round(idx(q.X, origin.X))), int64(math.Round(idx(q.Y, origin.Y)))}
		if touched[ki] {
			areas[k] = p.ClipToRect(geom.Rect{Min: geom.Point{X: q.X - h, Y: q.Y - h}, Max: geom.Point{X: q.X + h, Y: q.Y + h}}).Area()
		} else {
			areas[k] = c * c
		}
	}
	return areas
}

// zoneCandidates returns one zone's candidates in order.
func zoneCandidates(i int, z ZoneInput, zp zonePlan, ng noGoSet) ([]Candidate, error) {
	var raw []Candidate
	for k, p := range z.Required {
		if !z.Polygon.Contains(p) {
			return nil, fmt.Errorf("%w: %s: Required[%d] (%g, %g) lies outside the zone polygon; move it into the zone or give it to the zone that holds it",
				ErrInput, zoneName(i, z), k, p.X, p.Y)
		}
		if n := ng.index(p); n >= 0 {
			return nil, fmt.Errorf("%w: %s: Required[%d] (%g, %g) lies in no-go area noGo[%d]; move the point or the no-go boundary",
				ErrInput, zoneName(i, z), k, p.X, p.Y, n)
		}
		raw = append(raw, Candidate{Zone: i, P: p, Required: true})
	}
	if z.Corners {
		for _, p := range z.Polygon.Corners() {
			raw = append(raw, Candidate{Zone: i, P: p, Corner: true})
		}
	}
	for _, p := range z.Extra {
		if z.Polygon.Contains(p) {
			raw = append(raw, Candidate{Zone: i, P: p})
		}
	}
	b := z.Polygon.Bounds()
	for _, p := range z.Polygon.Lattice(zp.kind, zp.candSpace, geom.CentredOrigin(zp.kind, b, zp.candSpace)) {
		raw = append(raw, Candidate{Zone: i, P: p})
	}
	for _, p := range z.Polygon.PointsAlongBoundary(zp.boundStep) {
		raw = append(raw, Candidate{Zone: i, P: p})
	}
	return mergeClose(raw, ng, mergeFraction*zp.candSpace), nil
}

// mergeClose drops candidates in no-go areas and merges each candidate
// into an earlier one within tol, keeping the earlier position and OR-ing
// the flags. A hash of tol-sized cells finds neighbours in O(1) each.
func mergeClose(raw []Candidate, ng noGoSet, tol float64) []Candidate {
	type key struct{ x, y int64 }
	cellOf := func(p geom.Point) key {
		return key{int64(math.Floor(p.X / tol)), int64(math.Floor(p.Y / tol))}
	}
	buckets := make(map[key][]int, len(raw))
	var out []Candidate
	for _, c := range raw {
		if !c.Required && ng.index(c.P) >= 0 {
			continue
		}
		k := cellOf(c.P)
		merged := false
	search:
		for dx := int64(-1); dx <= 1; dx++ {
			for dy := int64(-1); dy <= 1; dy++ {
				for _, j := range buckets[key{k.x + dx, k.y + dy}] {
					if out[j].P.Dist(c.P) < tol {
						out[j].Required = out[j].Required || c.Required
						out[j].Corner = out[j].Corner || c.Corner
						merged = true
						break search
					}
				}
			}
		}
		if !merged {
			buckets[k] = append(buckets[k], len(out))
			out = append(out, c)
		}
	}
	return out
}

// reduceRows returns the distinct, undominated covering rows and the cell
// each stands for.
//
// Rows are first made distinct (a hash on the sorted set, first cell
// kept), then taken in order of size. A row is dropped if a kept row is a
// subset of it: each kept row is listed under its candidates, and a row's
// candidates count hits against the kept rows; a kept row whose count
// reaches its size is contained. Smaller rows come first, so every possible
// subset is already kept when a row is examined; equal sizes cannot
// contain each other once distinct. Removing a row that contains another
// loses no information: any set of chosen candidates meeting the smaller
// row meets the larger.
func reduceRows(cells []Cell, nCand int) ([][]int, []int) {
	// Distinct rows: a hash map to the latest cell with that hash, and
	// a chain through earlier cells with the same hash.
	seen := make(map[uint64]int, len(cells))
	chain := make([]int, len(cells))
	var rows []int // cell index of each distinct row
	occurs := make([]int, nCand+1)
	for ci, c := range cells {
		h := hashInts(c.CoveredBy)
		dup := false
		prev, ok := seen[h]
		for r := prev; ok && r >= 0; r = chain[r] {
			if slices.Equal(cells[r].CoveredBy, c.CoveredBy) {
				dup = true
				break
			}
		}
		if dup {
			continue
		}
		chain[ci] = -1
		if ok {
			chain[ci] = prev
		}
		seen[h] = ci
		rows = append(rows, ci)
		for _, j := range c.CoveredBy {
			occurs[j+1]++
		}
	}
	// Incidence lists carved from one array, each sized for every
	// distinct row the candidate is in, so appends never reallocate.
	for j := 0; j < nCand; j++ {
		occurs[j+1] += occurs[j]
	}
	incStore := make([]int, occurs[nCand])
	inc := make([][]int, nCand) // candidate → kept rows (as positions in kept)
	for j := range inc {
		inc[j] = incStore[occurs[j]:occurs[j]:occurs[j+1]]
	}
	order := slices.Clone(rows)
	// Distinct rows differ in size or content, so this is a total order
	// and the unstable sort is deterministic.
	slices.SortFunc(order, func(a, b int) int {
		if c := cmp.Compare(len(cells[a].CoveredBy), len(cells[b].CoveredBy)); c != 0 {
			return c
		}
		return slices.Compare(cells[a].CoveredBy, cells[b].CoveredBy)
	})
	var kept []int // cell indices
	count := make([]int, 0, len(rows))
	var touched []int
	for _, ci := range order {
		set := cells[ci].CoveredBy
		dominated := false
	scan:
		for _, c := range set {
			for _, k := range inc[c] {
				if count[k] == 0 {
					touched = append(touched, k)
				}
				count[k]++
				if count[k] == len(cells[kept[k]].CoveredBy) {
					dominated = true
					break scan
				}
			}
		}
		for _, k := range touched {
			count[k] = 0
		}
		touched = touched[:0]
		if dominated {
			continue
		}
		k := len(kept)
		kept = append(kept, ci)
		count = append(count, 0)
		for _, c := range set {
			inc[c] = append(inc[c], k)
		}
	}
	slices.Sort(kept)
	rowSets := make([][]int, len(kept))
	for k, ci := range kept {
		rowSets[k] = slices.Clone(cells[ci].CoveredBy)
	}
	return rowSets, kept
}

// hashInts is FNV-1a over the integers' bytes.
func hashInts(xs []int) uint64 {
	h := uint64(14695981039346656037)
	for _, x := range xs {
		v := uint64(x)
		for range 8 {
			h ^= v & 0xff
			h *= 1099511628211
			v >>= 8
		}
	}
	return h
}
