package plot

import (
	"math"
	"strings"
)

// Measured points: marks without a line, drawn as one path per series.

// markR is the half-size of a mark, pixels.
const markR = 3.5

// addPoints maps xs, ys through the panel's scales and draws each point
// as a mark of style st (st.Shape set), clipped to the panel. The series
// joins the panel for the legend and the hover read-out. It returns nil,
// and draws nothing, when no point is finite.
func (f *Figure) addPoints(p *Panel, clip, name string, st Style, xs, ys []float64, read func(Pt) string) *Series {
	pts := points(xs, ys, p.X, p.Y)
	if len(pts) == 0 {
		return nil
	}
	s := &Series{Name: name, Style: st, Read: read}
	for _, q := range pts {
		if p.Box.Inside(q.X, q.Y) {
			s.Pts = append(s.Pts, q)
		}
	}
	p.Series = append(p.Series, s)
	f.marks(pts, st, clip)
	return s
}

// marks draws a mark of style st at every point.
func (f *Figure) marks(pts []Pt, st Style, clip string) {
	var b strings.Builder
	for _, q := range pts {
		markPath(&b, st.Shape, q.X, q.Y, markR)
	}
	fill := st.Stroke
	if st.Open {
		fill = inkBack
	}
	w := st.Width
	if w == 0 {
		w = 1.3
	}
	p := f.path(strings.TrimSpace(b.String()), st.Stroke, "none", w)
	p.Fill, p.Clip = fill, clip
	if st.Shape == "cross" {
		p.Fill = "none"
	}
}

// markPath writes the outline of one mark centred on (x, y).
func markPath(b *strings.Builder, shape string, x, y, r float64) {
	m := func(px, py float64) { b.WriteString("M" + coord(px) + " " + coord(py)) }
	l := func(px, py float64) { b.WriteString(" L" + coord(px) + " " + coord(py)) }
	switch shape {
	case "square":
		s := r * 0.88
		m(x-s, y-s)
		l(x+s, y-s)
		l(x+s, y+s)
		l(x-s, y+s)
		b.WriteString(" Z ")
	case "triangle", "down":
		k := 1.0
		if shape == "down" {
			k = -1
		}
		h := r * 1.15
		m(x, y-k*h)
		l(x+h*math.Sqrt(3)/2, y+k*h/2)
		l(x-h*math.Sqrt(3)/2, y+k*h/2)
		b.WriteString(" Z ")
	case "diamond":
		h := r * 1.25
		m(x, y-h)
		l(x+h, y)
		l(x, y+h)
		l(x-h, y)
		b.WriteString(" Z ")
	case "cross":
		m(x-r, y-r)
		l(x+r, y+r)
		m(x-r, y+r)
		l(x+r, y-r)
		b.WriteString(" ")
	default: // circle: two arcs
		m(x-r, y)
		b.WriteString(" a" + coord(r) + " " + coord(r) + " 0 1 0 " + coord(2*r) + " 0 a" + coord(r) + " " + coord(r) + " 0 1 0 " + coord(-2*r) + " 0 Z ")
	}
}
