package geom

import (
	"math"
	"sort"
)

// Ground is a piece of a site that a spacing rule covers: a zone's outline
// minus the no-go areas (holes) inside it. A hole may reach past the
// outline; only its part inside the outline is taken out.
type Ground struct {
	Outline Polygon
	Holes   []Polygon
}

// Contains reports whether q belongs to the closed ground: in the closed
// outline and not in the open interior of any hole (the boundary of a
// no-go area is ground that must still be covered).
func (g Ground) Contains(q Point) bool {
	if !g.Outline.Contains(q) {
		return false
	}
	for _, h := range g.Holes {
		if h.containsStrict(q) {
			return false
		}
	}
	return true
}

// edges lists the outline's and the holes' edges.
func (g Ground) edges() []Segment {
	out := g.Outline.Edges()
	for _, h := range g.Holes {
		out = append(out, h.Edges()...)
	}
	return out
}

// Spot is a place on the ground and its distance to the nearest site.
type Spot struct {
	At   Point
	Dist float64
	// Site is the index of the nearest site, or -1 when there is none
	// (no sites, or the site's Voronoi region does not meet the ground).
	Site int
}

// Farthest returns the spot of the ground farthest from its nearest site:
// the largest empty circle centred on the ground. With no sites it returns
// Dist +Inf. With an empty ground (an outline of fewer than three vertices)
// it returns Dist 0 and Site -1.
//
// It is exact plane geometry, up to floating-point rounding: the distance
// to the nearest site is, within the Voronoi region of site i, the distance
// to site i, a convex function, so its maximum over the polygon
// region ∩ ground is reached at a vertex of that region; and every such
// vertex is a Voronoi vertex inside the ground, a ground vertex, or a point
// where a Voronoi edge or a ground edge crosses another ground edge. This
// is the largest-empty-circle problem of Shamos and Hoey ("Closest-point
// problems", 16th IEEE FOCS, 1975; de Berg, Cheong, van Kreveld and
// Overmars, Computational Geometry, 3rd ed., 2008, ch. 7 — from memory).
// See FarthestBySite for the method and its cost.
func Farthest(g Ground, sites []Point) Spot {
	best := Spot{Site: -1}
	if len(g.Outline) < 3 {
		return best
	}
	if len(sites) == 0 {
		return Spot{At: g.Outline[0], Dist: math.Inf(1), Site: -1}
	}
	for _, s := range FarthestBySite(g, sites) {
		if s.Site >= 0 && (best.Site < 0 || s.Dist > best.Dist) {
			best = s
		}
	}
	return best
}

// FarthestBySite returns, for each site i, the spot of the ground within
// site i's Voronoi region farthest from site i, i.e. the farthest ground
// whose nearest site is i. A site whose region misses the ground gets
// Site -1 and Dist -1. Ties between coincident sites go to the lower index.
//
// Method: each site's Voronoi region, clipped to the ground's bounding box,
// is the intersection of half-planes (Okabe, Boots, Sugihara and Chiu,
// Spatial Tessellations, 2nd ed., 2000, §2.1 — from memory), built by
// clipping the box with the bisectors of the other sites in order of
// distance, stopping once the next site is farther than twice the region's
// radius (its bisector can no longer reach the region). Then the
// candidates for the region's maximum — region vertices on the ground,
// crossings of region edges with ground edges, ground vertices and
// crossings of outline with hole edges — are measured. Cost: about
// O(n·k·log n + n·e) for n sites with k Voronoi neighbours each and e
// ground edges near each region.
func FarthestBySite(g Ground, sites []Point) []Spot {
	out, _ := farthestBySite(g, sites, math.Inf(1))
	return out
}

// SpotsBeyond returns every vertex of the Voronoi regions' pieces of ground
// (the candidates FarthestBySite measures) that lies farther than r from
// its nearest site, in site order. Where a region's farthest ground lies
// beyond r, the region's other far corners usually do too; a covering
// model told of all of them at once needs fewer rounds.
func SpotsBeyond(g Ground, sites []Point, r float64) []Spot {
	_, beyond := farthestBySite(g, sites, r)
	return beyond
}

func farthestBySite(g Ground, sites []Point, r float64) ([]Spot, []Spot) {
	out := make([]Spot, len(sites))
	for i := range out {
		out[i] = Spot{Site: -1, Dist: -1}
	}
	var beyond []Spot
	if len(g.Outline) < 3 || len(sites) == 0 {
		return out, nil
	}
	box := g.Outline.Bounds().Expand(1)
	edges := g.edges()
	nb := neighbourOrder(sites)
	consider := func(i int, q Point) {
		d := q.Dist(sites[i])
		if out[i].Site < 0 || d > out[i].Dist {
			out[i] = Spot{At: q, Dist: d, Site: i}
		}
		if d > r {
			beyond = append(beyond, Spot{At: q, Dist: d, Site: i})
		}
	}
	for i := range sites {
		cell := voronoiCell(i, sites, nb, box)
		if len(cell.v) == 0 {
			continue
		}
		cb := Polygon(cell.v).Bounds().Expand(BoundaryTolFt)
		for _, v := range cell.v {
			if g.Contains(v) {
				consider(i, v)
			}
		}
		for k := range cell.v {
			a, b := cell.v[k], cell.v[(k+1)%len(cell.v)]
			for _, e := range edges {
				if !segBox(e).Intersects(cb) {
					continue
				}
				if q, ok := segmentCrossing(a, b, e.A, e.B); ok && g.Contains(q) {
					consider(i, q)
				}
			}
		}
	}
	// Ground vertices and outline–hole crossings belong to the region of
	// their nearest site.
	var fixed []Point
	fixed = append(fixed, g.Outline...)
	for _, h := range g.Holes {
		fixed = append(fixed, h...)
		for _, e := range h.Edges() {
			for _, f := range g.Outline.Edges() {
				if q, ok := segmentCrossing(e.A, e.B, f.A, f.B); ok {
					fixed = append(fixed, q)
				}
			}
		}
	}
	for _, q := range fixed {
		if !g.Contains(q) {
			continue
		}
		consider(nearestSite(q, sites), q)
	}
	return out, beyond
}

// NeighbourPairs returns the pairs of sites (i < j, ascending) whose
// Voronoi regions share an edge that meets the ground: the Delaunay
// neighbours that face each other across the ground (Delaunay
// triangulation as the dual of the Voronoi diagram; de Berg et al., ch. 9
// — from memory). Coincident sites are not paired.
func NeighbourPairs(g Ground, sites []Point) [][2]int {
	if len(g.Outline) < 3 || len(sites) < 2 {
		return nil
	}
	box := g.Outline.Bounds().Expand(1)
	edges := g.edges()
	nb := neighbourOrder(sites)
	seen := map[[2]int]bool{}
	var out [][2]int
	for i := range sites {
		cell := voronoiCell(i, sites, nb, box)
		for k, j := range cell.by {
			if j < 0 {
				continue
			}
			a, b := cell.v[k], cell.v[(k+1)%len(cell.v)]
			if a.Dist(b) <= 1e-9*(1+sites[i].Dist(sites[j])) {
				continue // regions that touch at a corner only
			}
			if !segmentMeetsGround(a, b, g, edges) {
				continue
			}
			key := [2]int{min(i, j), max(i, j)}
			if !seen[key] {
				seen[key] = true
				out = append(out, key)
			}
		}
	}
	sort.Slice(out, func(a, b int) bool {
		if out[a][0] != out[b][0] {
			return out[a][0] < out[b][0]
		}
		return out[a][1] < out[b][1]
	})
	return out
}

// segmentMeetsGround reports whether the segment a–b has a point on the
// ground: an end on it, or a crossing with one of its edges.
func segmentMeetsGround(a, b Point, g Ground, edges []Segment) bool {
	if g.Contains(a) || g.Contains(b) || g.Contains(a.Add(b).Scale(0.5)) {
		return true
	}
	sb := segBox(Segment{a, b})
	for _, e := range edges {
		if segBox(e).Intersects(sb) {
			if q, ok := segmentCrossing(a, b, e.A, e.B); ok && g.Contains(q) {
				return true
			}
		}
	}
	return false
}

// cell is a convex Voronoi region: its vertices counter-clockwise, and for
// each edge v[k]→v[k+1] the site whose bisector made it (-1: the box).
type cell struct {
	v  []Point
	by []int
}

// neighbourOrder returns, for each site, the other sites in order of
// distance; it is built lazily by nearest-first search on a grid.
type neighbours struct {
	sites []Point
	grid  *Grid
	step  float64
}

func neighbourOrder(sites []Point) *neighbours {
	r := Polygon(sites).Bounds()
	area := math.Max(r.Width()*r.Height(), 1)
	step := math.Max(math.Sqrt(area/float64(len(sites))), 1)
	return &neighbours{sites: sites, grid: NewGrid(sites, step), step: step}
}

// within returns the sites other than i at distance in (lo, hi], nearest
// first (ties by index).
func (n *neighbours) within(i int, lo, hi float64, dst []int) []int {
	p := n.sites[i]
	start := len(dst)
	n.grid.Within(p, hi, func(j int) {
		if j != i && p.Dist(n.sites[j]) > lo {
			dst = append(dst, j)
		}
	})
	s := dst[start:]
	sort.Slice(s, func(a, b int) bool {
		da, db := p.Dist(n.sites[s[a]]), p.Dist(n.sites[s[b]])
		if da != db {
			return da < db
		}
		return s[a] < s[b]
	})
	return dst
}

// voronoiCell clips the box to site i's Voronoi region. Coincident sites
// share one region, given to the lower index; the others get an empty cell.
func voronoiCell(i int, sites []Point, nb *neighbours, box Rect) cell {
	p := sites[i]
	c := cell{
		v:  []Point{box.Min, {box.Max.X, box.Min.Y}, box.Max, {box.Min.X, box.Max.Y}},
		by: []int{-1, -1, -1, -1},
	}
	// Coincident sites: the lower index keeps the region.
	var dup []int
	dup = nb.within(i, -1, 0, dup)
	for _, j := range dup {
		if j < i {
			return cell{}
		}
	}
	lo, hi := 0.0, 2*nb.step
	var js []int
	for {
		js = nb.within(i, lo, hi, js[:0])
		for _, j := range js {
			if 0.5*p.Dist(sites[j]) > c.radius(p) {
				break
			}
			c = c.clip(p, sites[j], j)
			if len(c.v) == 0 {
				return c
			}
		}
		rad := c.radius(p)
		if 2*rad <= hi {
			return c
		}
		lo, hi = hi, math.Max(2*hi, 2*rad)
	}
}

// radius is the largest distance from p to a vertex of the cell.
func (c cell) radius(p Point) float64 {
	r := 0.0
	for _, v := range c.v {
		r = math.Max(r, v.Dist(p))
	}
	return r
}

// clip keeps the part of the cell nearer to p than to q (Sutherland and
// Hodgman, "Reentrant polygon clipping", Comm. ACM 17(1), 1974, against
// the bisector half-plane (q−p)·(x−p) ≤ |q−p|²/2), recording j as the
// site of the new edge.
func (c cell) clip(p, q Point, j int) cell {
	d := q.Sub(p)
	h := 0.5 * (d.X*d.X + d.Y*d.Y)
	side := func(v Point) float64 { return d.X*(v.X-p.X) + d.Y*(v.Y-p.Y) - h }
	var out cell
	n := len(c.v)
	for k := 0; k < n; k++ {
		a, b := c.v[k], c.v[(k+1)%n]
		sa, sb := side(a), side(b)
		ain, bin := sa <= 0, sb <= 0
		switch {
		case ain && bin:
			out.v = append(out.v, a)
			out.by = append(out.by, c.by[k])
		case ain && !bin:
			out.v = append(out.v, a)
			out.by = append(out.by, c.by[k])
			t := sa / (sa - sb)
			out.v = append(out.v, Point{a.X + t*(b.X-a.X), a.Y + t*(b.Y-a.Y)})
			out.by = append(out.by, j)
		case !ain && bin:
			t := sa / (sa - sb)
			out.v = append(out.v, Point{a.X + t*(b.X-a.X), a.Y + t*(b.Y-a.Y)})
			out.by = append(out.by, c.by[k])
		}
	}
	if len(out.v) < 3 {
		return cell{}
	}
	return out
}

// nearestSite returns the index of the site nearest q (lowest index on ties).
func nearestSite(q Point, sites []Point) int {
	best, bd := -1, math.Inf(1)
	for i, s := range sites {
		if d := q.Dist(s); d < bd {
			best, bd = i, d
		}
	}
	return best
}

// segBox is the bounding box of a segment.
func segBox(s Segment) Rect {
	return Rect{
		Min: Point{math.Min(s.A.X, s.B.X), math.Min(s.A.Y, s.B.Y)},
		Max: Point{math.Max(s.A.X, s.B.X), math.Max(s.A.Y, s.B.Y)},
	}
}

// segmentCrossing returns the point where segments a–b and c–d cross,
// ends included; parallel segments (overlapping or not) report none, as
// their shared ends are found as vertices of one or the other.
func segmentCrossing(a, b, c, d Point) (Point, bool) {
	r, s := b.Sub(a), d.Sub(c)
	den := r.X*s.Y - r.Y*s.X
	scale := math.Hypot(r.X, r.Y) * math.Hypot(s.X, s.Y)
	if scale == 0 || math.Abs(den) <= 1e-12*scale {
		return Point{}, false
	}
	w := c.Sub(a)
	t := (w.X*s.Y - w.Y*s.X) / den
	u := (w.X*r.Y - w.Y*r.X) / den
	const eps = 1e-9
	if t < -eps || t > 1+eps || u < -eps || u > 1+eps {
		return Point{}, false
	}
	t = math.Max(0, math.Min(1, t))
	return Point{a.X + t*r.X, a.Y + t*r.Y}, true
}
