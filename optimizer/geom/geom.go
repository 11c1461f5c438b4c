// Package geom holds the plane geometry of a site: points and polygons in a
// local Cartesian frame whose unit is the foot, plus lattices, a spatial
// index and the conversion between the local frame and WGS 84 longitude and
// latitude used by GeoJSON (RFC 7946).
//
// Contents:
//   - Polygon measures (shoelace area, perimeter, centroid, bounds), point
//     location with the boundary counted as inside, simplicity checking,
//     containment and overlap of polygons, corners and points along the
//     boundary.
//   - Rect, an axis-aligned box.
//   - Square and triangular lattices in a box or a polygon, and their
//     covering radii s/√2 and s/√3.
//   - Grid, a uniform bucket grid for fixed-radius neighbour queries.
//   - LocalFrame, a transverse Mercator projection of the WGS 84 ellipsoid
//     about the site's origin, in international feet.
//
// Everything is deterministic: the same input gives the same output in the
// same order.
package geom

// Point is a location in the site's local frame. X grows east, Y grows
// north; both are in feet.
type Point struct {
	X, Y float64
}

// Polygon is a simple polygon given by its ring of vertices in order, with
// the closing vertex not repeated. Either orientation is accepted.
type Polygon []Point
