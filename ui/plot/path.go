package plot

import (
	"math"
	"strings"
)

// Pt is a data point with its pixel position.
type Pt struct {
	X, Y   float64 // pixels
	DX, DY float64 // data
	I      int     // index into the source slices
}

// points maps the pairs (xs[i], ys[i]) through sx and sy. Pairs with a
// non-finite value, or a non-positive value on a log scale, are dropped;
// Pt.I keeps the original index so that gaps can be found. The shorter
// slice sets the length.
func points(xs, ys []float64, sx, sy Scale) []Pt {
	n := min(len(xs), len(ys))
	pts := make([]Pt, 0, n)
	for i := range n {
		x, y := sx.Map(xs[i]), sy.Map(ys[i])
		if !isFinite(x) || !isFinite(y) {
			continue
		}
		pts = append(pts, Pt{X: x, Y: y, DX: xs[i], DY: ys[i], I: i})
	}
	return pts
}

// pathD returns SVG path data through the points: "M" at the start and
// after every gap in the source indices (a dropped point breaks the line),
// "L" otherwise. Coordinates carry at most one decimal. Points that round
// to the same pixel as the previous one are skipped.
func pathD(pts []Pt) string {
	var b strings.Builder
	b.Grow(len(pts) * 12)
	prevI := -2
	var px, py float64
	for _, p := range pts {
		x, y := math.Round(p.X*10)/10, math.Round(p.Y*10)/10
		switch {
		case p.I != prevI+1:
			if b.Len() > 0 {
				b.WriteByte(' ')
			}
			b.WriteByte('M')
		case x == px && y == py:
			prevI = p.I
			continue
		default:
			b.WriteString(" L")
		}
		b.WriteString(coord(x))
		b.WriteByte(' ')
		b.WriteString(coord(y))
		px, py, prevI = x, y, p.I
	}
	return b.String()
}

// nearest returns the index in pts of the point closest to (x, y) in
// pixels and its squared distance; -1 when pts is empty.
func nearest(pts []Pt, x, y float64) (int, float64) {
	best, bd := -1, math.Inf(1)
	for i, p := range pts {
		d := (p.X-x)*(p.X-x) + (p.Y-y)*(p.Y-y)
		if d < bd {
			best, bd = i, d
		}
	}
	return best, bd
}
