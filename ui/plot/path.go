package plot

import "math"

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
	mx, my := sx.mapper(), sy.mapper()
	for i := range n {
		x, y := mx(xs[i]), my(ys[i])
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
	pts = thin(pts, maxPathPoints)
	b := make([]byte, 0, len(pts)*12)
	prevI := -2
	var px, py float64
	for _, p := range pts {
		x, y := math.Round(p.X*10)/10, math.Round(p.Y*10)/10
		switch {
		case p.I != prevI+1:
			if len(b) > 0 {
				b = append(b, ' ')
			}
			b = append(b, 'M')
		case x == px && y == py:
			prevI = p.I
			continue
		default:
			b = append(b, " L"...)
		}
		b = appendCoord(b, x)
		b = append(b, ' ')
		b = appendCoord(b, y)
		px, py, prevI = x, y, p.I
	}
	return string(b)
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

// maxPathPoints bounds the points one path writes. vugu's renderer passes
// every attribute through a 16 KB buffer and a longer one ends the Go
// program, so a curve on a fine mesh (200,000 nodes) must be thinned; 900
// points at about 13 bytes each stay well inside, and far more than a
// plot's width in pixels can show.
const maxPathPoints = 900

// thinTolerance is the farthest, in pixels, a dropped point may lie from
// the drawn line. A quarter pixel cannot be seen, and it cuts a smooth
// time series of hundreds of steps to a few dozen points: every render
// sends every path to the browser again, so short paths keep the page
// quick to answer an edit.
const thinTolerance = 0.25

// thin returns at most max points of pts that draw the same curve to
// within a fraction of a pixel: each unbroken run (consecutive source
// indices) is simplified by the Douglas–Peucker algorithm with a tolerance
// of thinTolerance, doubled until the count fits. The kept points are
// renumbered so that runs stay unbroken and gaps stay gaps.
func thin(pts []Pt, max int) []Pt {
	if len(pts) <= 2 {
		return pts
	}
	keep := make([]bool, len(pts))
	for tol := thinTolerance; ; tol *= 2 {
		clear(keep)
		n := 0
		for lo := 0; lo < len(pts); {
			hi := lo + 1
			for hi < len(pts) && pts[hi].I == pts[hi-1].I+1 {
				hi++
			}
			n += douglasPeucker(pts[lo:hi], keep[lo:hi], tol)
			lo = hi
		}
		if n <= max || tol > 1e4 {
			break
		}
	}
	out := make([]Pt, 0, max)
	next := 0
	for i, p := range pts {
		if i > 0 && p.I != pts[i-1].I+1 {
			next++ // a new run: leave a gap
		}
		if !keep[i] {
			continue
		}
		p.I = next
		next++
		out = append(out, p)
	}
	return out
}

// douglasPeucker marks in keep the points of one unbroken run that stay
// when every dropped point lies within tol pixels of the segment between
// its kept neighbours; it returns how many it kept.
func douglasPeucker(run []Pt, keep []bool, tol float64) int {
	n := len(run)
	keep[0], keep[n-1] = true, true
	if n <= 2 {
		return n
	}
	count := 2
	stack := [][2]int{{0, n - 1}}
	for len(stack) > 0 {
		a, b := stack[len(stack)-1][0], stack[len(stack)-1][1]
		stack = stack[:len(stack)-1]
		ax, ay := run[a].X, run[a].Y
		dx, dy := run[b].X-ax, run[b].Y-ay
		l2 := dx*dx + dy*dy
		worst, far := -1, tol*tol
		for i := a + 1; i < b; i++ {
			px, py := run[i].X-ax, run[i].Y-ay
			var d2 float64
			if l2 == 0 {
				d2 = px*px + py*py
			} else {
				c := px*dy - py*dx
				d2 = c * c / l2
			}
			if d2 > far {
				worst, far = i, d2
			}
		}
		if worst >= 0 {
			keep[worst] = true
			count++
			stack = append(stack, [2]int{a, worst}, [2]int{worst, b})
		}
	}
	return count
}
