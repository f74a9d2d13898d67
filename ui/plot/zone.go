package plot

import (
	"math"

	"porelight/solver"
)

// stripZone draws on the layer strip what the groundwater inputs and an
// excavation add to it: the piezometric level a drained top holds when it
// differs from the water table (an open marker, so that the two levels are
// told apart: pore pressures follow the head, stresses the water table),
// and the soil an excavation removes (a pale band down to its floor,
// labelled, depths staying measured from the original top). depth is in
// the length unit shown.
func (f *Figure) stripZone(box Box, depth Scale, p *solver.Project) {
	if p == nil {
		return
	}
	if h := p.Top.Head; p.Top.Drained && h != nil && math.Abs(*h+p.WaterTable) > 1e-9 {
		if z := uLength.of(-*h); isFinite(z) && z >= depth.Lo && z <= depth.Hi {
			y, x := depth.Map(z), box.Right()-30
			f.path("M"+coord(x-5)+" "+coord(y-7)+" h10 l-5 7 Z", "#2f6db3", "2 1", 1).Fill = "none"
			tx := f.text(x-8, y-2, "head", "end", 9, "#2f6db3")
			tx.Halo = true
		}
	}
	for _, l := range p.Loads {
		d := l.Dig
		if d == nil || !isFinite(d.Depth) {
			continue
		}
		y0, y1 := depth.Map(math.Max(depth.Lo, 0)), depth.Map(math.Min(uLength.of(d.Depth), depth.Hi))
		if !(y1 > y0) {
			continue
		}
		f.Rects = append(f.Rects, RectEl{Box: Box{box.X, y0, box.W, y1 - y0}, Fill: "#ffffff", Stroke: "#8a7f6c", StrokeWidth: 0.75})
		f.path("M"+coord(box.X)+" "+coord(y1)+" H"+coord(box.Right()), inkAxis, "none", 1.5)
		tx := f.text(box.X+5, math.Min(y0+12, y1-2), "excavated", "start", 10, inkMuted)
		tx.Halo = true
	}
}
