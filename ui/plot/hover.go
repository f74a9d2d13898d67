package plot

import "math"

// Hover is the read-out of the data point nearest the pointer: a marker at
// (X, Y) in the curve's colour and a boxed text.
type Hover struct {
	X, Y   float64
	Stroke string
	Box    Box
	Lines  []TextEl
	// Series and Point identify the point read (for tests and callers).
	Series *Series
	Point  Pt
}

// hoverReach is how far outside a panel, in pixels, the pointer still
// reads that panel.
const hoverReach = 8

// HoverAt returns the read-out for the pointer at (x, y) in figure pixels:
// the nearest point, by pixel distance, of any curve in the panel under the
// pointer. It returns nil when the pointer is over no panel, the panel has
// no points, or the figure is a message.
func (f *Figure) HoverAt(x, y float64) *Hover {
	if f == nil || f.Message != "" || !isFinite(x) || !isFinite(y) {
		return nil
	}
	for _, p := range f.Panels {
		b := p.Box
		if x < b.X-hoverReach || x > b.Right()+hoverReach || y < b.Y-hoverReach || y > b.Bottom()+hoverReach {
			continue
		}
		var best *Series
		var bp Pt
		bd := math.Inf(1)
		for _, s := range p.Series {
			i, d := nearest(s.Pts, x, y)
			if i >= 0 && d < bd {
				best, bp, bd = s, s.Pts[i], d
			}
		}
		if best == nil {
			return nil
		}
		return readout(b, best, bp)
	}
	return nil
}

// readout lays out the marker and text box for point q of series s,
// keeping the box inside the panel box b where it fits.
func readout(b Box, s *Series, q Pt) *Hover {
	h := &Hover{X: q.X, Y: q.Y, Stroke: s.Style.Stroke, Series: s, Point: q}
	lines := []string{s.Name}
	if s.Read != nil {
		lines = append(lines, s.Read(q))
	}
	const size, row, pad = 11.0, 15.0, 6.0
	w := 0.0
	for _, l := range lines {
		w = math.Max(w, textWidth(l, size))
	}
	w += 2 * pad
	hh := float64(len(lines))*row + pad
	bx, by := q.X+10, q.Y-10-hh
	if bx+w > b.Right() {
		bx = q.X - 10 - w
	}
	if bx < b.X {
		bx = math.Max(b.X, math.Min(q.X+10, b.Right()-w))
	}
	if by < b.Y {
		by = q.Y + 10
	}
	if by+hh > b.Bottom() {
		by = math.Max(b.Y, b.Bottom()-hh)
	}
	h.Box = Box{bx, by, w, hh}
	for i, l := range lines {
		h.Lines = append(h.Lines, TextEl{
			X: bx + pad, Y: by + pad/2 + float64(i+1)*row - 3, Text: l,
			Anchor: "start", Size: size, Fill: inkText, Bold: i == 0,
		})
	}
	return h
}
