package plot

import (
	"math"

	"porelight/solver"
	"porelight/solver/drain"
)

// Drains in the plots: the layer strip of every depth figure draws the
// drains' depth range, the degree plot adds Uv and Uh, and
// DrainPlanFigure draws the pattern to scale with its unit cell.

// inkDrain is the colour of drains in the strip and the plan.
const inkDrain = "#2f5d8a"

// drainRange is the depth range of p's drains, read defensively (the
// figure may be drawn for a project with a bad field): the tip at
// drains.depth, the base of drains.toLayer, or the base of the column.
func drainRange(p *solver.Project) (top, tip float64, ok bool) {
	if p == nil || p.Drains == nil {
		return 0, 0, false
	}
	d := p.Drains
	h := solver.ColumnHeight(p)
	tip = h
	switch {
	case d.Depth > 0:
		tip = math.Min(d.Depth, h)
	case d.ToLayer != nil && *d.ToLayer >= 0 && *d.ToLayer < len(p.Layers):
		tip = 0
		for _, l := range p.Layers[:*d.ToLayer+1] {
			tip += l.Thickness
		}
	}
	top = math.Max(d.Top, 0)
	return top, tip, isFinite(top) && isFinite(tip) && tip > top
}

// stripDrains draws the drains as three vertical lines at the right of
// the layer strip from their top to their tip, with a tick at the tip
// (depth in the length unit shown).
func (f *Figure) stripDrains(box Box, depth Scale, p *solver.Project) {
	top, tip, ok := drainRange(p)
	if !ok {
		return
	}
	y0, y1 := depth.Map(uLength.of(top)), depth.Map(uLength.of(tip))
	if !isFinite(y0) || !isFinite(y1) {
		return
	}
	d := ""
	for _, dx := range []float64{3, 6.5, 10} {
		x := box.Right() - dx
		d += "M" + coord(x) + " " + coord(y0) + " V" + coord(y1) + " "
	}
	f.path(d, inkDrain, "none", 1.4)
	f.path("M"+coord(box.Right()-12)+" "+coord(y1)+" h11", inkDrain, "none", 1.4)
}

// addDrainDegrees adds Uv (vertical flow alone, no drains) and Uh
// (radial flow to the drains alone) to the degree plot.
func (f *Figure) addDrainDegrees(pn *Panel, clip string, s *solver.Series, r *solver.Result) {
	d := r.Drains
	if d == nil || len(d.Uv) != len(s.Time) || len(d.Uh) != len(s.Time) {
		return
	}
	f.addSeries(pn, clip, "Uv, vertical only", styleAt(2), s.Time, scaled(d.Uv, 100), readTime("Uv", " %", 3))
	f.addSeries(pn, clip, "Uh, radial only", styleAt(3), s.Time, scaled(d.Uh, 100), readTime("Uh", " %", 3))
}

// circlePath is the SVG path of a circle.
func circlePath(cx, cy, r float64) string {
	return "M" + coord(cx-r) + " " + coord(cy) + " a" + coord(r) + " " + coord(r) + " 0 1 0 " + coord(2*r) + " 0 a" +
		coord(r) + " " + coord(r) + " 0 1 0 " + coord(-2*r) + " 0 Z"
}

// DrainPlanFigure draws p's drain pattern in plan, to scale: the drains
// around one of them, the unit cell of that drain (its hexagon or square
// and the circle of equal area, De), its smear zone, and a scale bar.
// Drains smaller than 2 px are drawn at 2 px, which the caption says.
func DrainPlanFigure(p *solver.Project, w, h int) *Figure {
	f := newFigure("plot-drain-plan", "Drain pattern in plan", w, h)
	if p == nil || p.Drains == nil {
		return f.message("No drains.")
	}
	d := p.Drains
	factor := drain.CellFactor(drain.Pattern(d.Pattern))
	s := d.Spacing
	dw := d.Diameter
	band := dw == 0
	if band {
		eq := d.Equivalent
		if eq == "" {
			eq = solver.DefaultEquivalent
		}
		dw = drain.EquivalentDiameter(d.Width, d.Thickness, drain.Equivalent(eq))
	}
	if factor == 0 || !(s > 0) || !isFinite(s) || !(dw > 0) || !isFinite(dw) || dw >= factor*s {
		return f.message("Give the pattern, spacing and drain size to see the plan.")
	}
	de := factor * s
	box := Box{12, 30, f.W - 24, f.H - 76}
	// 3.2 spacings across the shorter side.
	scale := math.Min(box.W, box.H) / (3.2 * s) // px per m
	cx, cy := box.X+box.W/2, box.Y+box.H/2
	f.Rects = append(f.Rects, RectEl{Box: box, Fill: "#f7f5ef", Stroke: inkGrid, StrokeWidth: 1})
	clip := f.clip(box)
	// The cell of the central drain.
	var cell string
	if drain.Pattern(d.Pattern) == drain.Triangular {
		r := s / math.Sqrt(3) * scale // hexagon circumradius
		for k := range 6 {
			a := math.Pi/6 + float64(k)*math.Pi/3
			cmd := "L"
			if k == 0 {
				cmd = "M"
			}
			cell += cmd + coord(cx+r*math.Cos(a)) + " " + coord(cy+r*math.Sin(a)) + " "
		}
		cell += "Z"
	} else {
		hs := s / 2 * scale
		cell = "M" + coord(cx-hs) + " " + coord(cy-hs) + " h" + coord(2*hs) + " v" + coord(2*hs) + " h" + coord(-2*hs) + " Z"
	}
	pc := f.path(cell, inkMuted, "none", 1)
	pc.Fill, pc.Clip = "#e4ecf4", clip
	f.path(circlePath(cx, cy, de/2*scale), inkDrain, "5 3", 1.2).Clip = clip
	if sr := d.SmearRatio; sr > 1 && isFinite(sr) {
		f.path(circlePath(cx, cy, sr*dw/2*scale), "#9a5b2e", "2 2", 1).Clip = clip
	}
	// The drains.
	n := int(math.Ceil(2.5*math.Max(box.W, box.H)/(s*scale))) + 1
	var pts [][2]float64
	for i := -n; i <= n; i++ {
		for j := -n; j <= n; j++ {
			x, y := float64(i)*s, float64(j)*s
			if drain.Pattern(d.Pattern) == drain.Triangular {
				x, y = (float64(i)+float64(j%2)/2)*s, float64(j)*s*math.Sqrt(3)/2
			}
			px, py := cx+x*scale, cy+y*scale
			if box.Inside(px, py) {
				pts = append(pts, [2]float64{px, py})
			}
		}
	}
	enlarged := false
	var marks string
	for _, pt := range pts {
		if band {
			a, b := math.Max(d.Width*scale, 2), math.Max(d.Thickness*scale, 2)
			enlarged = enlarged || d.Width*scale < 2 || d.Thickness*scale < 2
			marks += "M" + coord(pt[0]-a/2) + " " + coord(pt[1]-b/2) + " h" + coord(a) + " v" + coord(b) + " h" + coord(-a) + " Z "
		} else {
			r := math.Max(dw/2*scale, 1)
			enlarged = enlarged || dw*scale < 2
			marks += circlePath(pt[0], pt[1], r) + " "
		}
	}
	pm := f.path(marks, inkDrain, "none", 0.5)
	pm.Fill, pm.Clip = inkDrain, clip
	// Scale bar: a round length, in the unit shown, near a third of the
	// width.
	shownBar := niceLength(uLength.of(box.W / 3 / scale))
	bar := uLength.back(shownBar)
	by := box.Bottom() + 14
	f.path("M"+coord(box.X)+" "+coord(by)+" h"+coord(bar*scale)+" M"+coord(box.X)+" "+coord(by-4)+" v8 M"+coord(box.X+bar*scale)+" "+coord(by-4)+" v8", inkAxis, "none", 1.2)
	f.text(box.X+bar*scale+6, by+4, sig(shownBar, 3)+uLength.tail(), "start", 10.5, inkText)
	m := uLength.tail()
	caption := "s = " + sig(uLength.of(s), 3) + m + ", De = " + sig(uLength.of(de), 4) + m + " (dashed), dw = " +
		sig(uMM.of(dw*1000), 3) + uMM.tail() + ", n = " + sig(de/dw, 3)
	f.text(box.X, f.H-8, fit(caption, f.W-24, 10.5), "start", 10.5, inkText)
	if enlarged {
		f.text(box.Right(), by+4, "drains enlarged to 2 px", "end", 10, inkMuted)
	}
	return f
}

// niceLength rounds x down to 1, 2 or 5 times a power of ten.
func niceLength(x float64) float64 {
	if !(x > 0) || !isFinite(x) {
		return 1
	}
	p := math.Pow(10, math.Floor(math.Log10(x)))
	for _, m := range []float64{5, 2, 1} {
		if m*p <= x {
			return m * p
		}
	}
	return p
}
