// Package geom holds the plane geometry of a site: points and polygons in a
// local Cartesian frame whose unit is the foot, plus lattices, a spatial
// index and the conversion between the local frame and WGS 84 longitude and
// latitude used by GeoJSON (RFC 7946).
package geom

// Point is a location in the site's local frame. X grows east, Y grows
// north; both are in feet.
type Point struct {
	X, Y float64
}

// Polygon is a simple polygon given by its ring of vertices in order, with
// the closing vertex not repeated. Either orientation is accepted.
type Polygon []Point
