package geom

import (
	"math"
	"sort"
)

// maxGridCells bounds the cells of a Grid; a finer grid is coarsened, which
// costs speed, never correctness.
const maxGridCells = 1 << 22

// Grid is a uniform bucket grid over a fixed set of points for fixed-radius
// neighbour queries (Bentley, Stanat & Williams, "The complexity of finding
// fixed-radius near neighbors", Inf. Proc. Letters 6(6), 1977). Built once
// in O(n + cells); a query visits the cells its disc's box touches. With a
// cell size near the query radius and evenly spread points a query costs
// O(1 + k) for k points found.
type Grid struct {
	pts    []Point
	min    Point
	size   float64
	nx, ny int
	start  []int // cell c holds idx[start[c]:start[c+1]]
	idx    []int // point indices, ascending within a cell
}

// NewGrid indexes pts (kept by reference; do not change them) in square
// cells of side cellSizeFt. A cell size that is not positive and finite, or
// one that would need more than about four million cells, is replaced by a
// coarser one.
func NewGrid(pts []Point, cellSizeFt float64) *Grid {
	g := &Grid{pts: pts}
	if len(pts) == 0 {
		return g
	}
	r := Polygon(pts).Bounds()
	ext := math.Max(r.Width(), r.Height())
	if !finite(r.Min) || !finite(r.Max) {
		// Points that are not finite all go to one cell; a query still
		// checks true distances.
		r, ext, cellSizeFt = Rect{}, 0, 1
	}
	if !(cellSizeFt > 0) || math.IsInf(cellSizeFt, 0) {
		cellSizeFt = math.Max(ext, 1)
	}
	if ext/cellSizeFt > math.Sqrt(maxGridCells)-1 {
		cellSizeFt = ext / (math.Sqrt(maxGridCells) - 1)
	}
	g.min, g.size = r.Min, cellSizeFt
	g.nx = int(r.Width()/cellSizeFt) + 1
	g.ny = int(r.Height()/cellSizeFt) + 1
	g.start = make([]int, g.nx*g.ny+1)
	cell := make([]int, len(pts))
	for i, p := range pts {
		c := g.cellOf(p)
		cell[i] = c
		g.start[c+1]++
	}
	for c := 0; c < g.nx*g.ny; c++ {
		g.start[c+1] += g.start[c]
	}
	g.idx = make([]int, len(pts))
	fill := append([]int(nil), g.start[:g.nx*g.ny]...)
	for i, c := range cell {
		g.idx[fill[c]] = i
		fill[c]++
	}
	return g
}

func (g *Grid) clampX(f float64) int {
	return max(0, min(g.nx-1, int(math.Floor(f))))
}

func (g *Grid) clampY(f float64) int {
	return max(0, min(g.ny-1, int(math.Floor(f))))
}

func (g *Grid) cellOf(p Point) int {
	return g.clampY((p.Y-g.min.Y)/g.size)*g.nx + g.clampX((p.X-g.min.X)/g.size)
}

// Within calls fn with the index of every point at distance ≤ rFt from q.
// Cells are visited south to north, west to east, and points in a cell in
// ascending index, so the order is deterministic though not sorted.
func (g *Grid) Within(q Point, rFt float64, fn func(i int)) {
	if len(g.pts) == 0 || !(rFt >= 0) {
		return
	}
	x0, x1 := (q.X-rFt-g.min.X)/g.size, (q.X+rFt-g.min.X)/g.size
	y0, y1 := (q.Y-rFt-g.min.Y)/g.size, (q.Y+rFt-g.min.Y)/g.size
	if x1 < 0 || y1 < 0 || x0 >= float64(g.nx) || y0 >= float64(g.ny) {
		return
	}
	r2 := rFt * rFt
	cx0, cx1, cy0, cy1 := g.clampX(x0), g.clampX(x1), g.clampY(y0), g.clampY(y1)
	for cy := cy0; cy <= cy1; cy++ {
		for cx := cx0; cx <= cx1; cx++ {
			c := cy*g.nx + cx
			for _, i := range g.idx[g.start[c]:g.start[c+1]] {
				dx, dy := g.pts[i].X-q.X, g.pts[i].Y-q.Y
				if dx*dx+dy*dy <= r2 {
					fn(i)
				}
			}
		}
	}
}

// WithinSorted appends to dst, in ascending order, the index of every point
// at distance ≤ rFt from q.
func (g *Grid) WithinSorted(q Point, rFt float64, dst []int) []int {
	start := len(dst)
	g.Within(q, rFt, func(i int) { dst = append(dst, i) })
	sort.Ints(dst[start:])
	return dst
}
