package plot

import (
	"math"
	"sort"

	"porelight/solver"
)

// Messages shown in place of a plot.
const (
	msgNoResult        = "No results yet: solve the project to draw this plot."
	msgNoConsolidation = "No consolidation results: add a load stage."
	msgNoIsochrones    = "No isochrones: add output times to the project."
	msgNoPiezometers   = "No piezometers: add piezometer depths to the project."
	msgNoSteady        = "No steady state profile in the results."
)

// IsochronesFigure builds the isochrone plot: excess pore pressure (kPa
// or psf) against depth (m or ft, down) at every output time, beside the layer strip,
// each curve labelled with its time. p may be nil (layer names then come
// from the result alone); w and h are pixels, zero for the default size.
func IsochronesFigure(p *solver.Project, r *solver.Result, w, h int) *Figure {
	f := newFigure("plot-isochrones", "Isochrones of excess pore pressure", w, h)
	switch {
	case r == nil:
		return f.message(msgNoResult)
	case r.Consolidation == nil:
		return f.message(msgNoConsolidation)
	}
	c := r.Consolidation
	var isos []solver.Isochrone
	for _, iso := range c.Isochrones {
		if _, _, ok := finiteRange(iso.Excess); ok && isFinite(iso.Time) {
			isos = append(isos, iso)
		}
	}
	if len(isos) == 0 || len(c.Depth) == 0 {
		return f.message(msgNoIsochrones)
	}
	for i := range isos {
		isos[i].Excess = uStress.all(isos[i].Excess)
	}
	lo, hi, _ := finiteRange(excessOf(isos)...)
	bs := layerBands(p, r)
	zmax := columnDepth(bs, c.Depth)
	if !(zmax > 0) {
		return f.message(msgNoIsochrones)
	}
	panels, clips := f.depthFigure(p, bs, zmax, []panelSpec{{
		Weight: 1, Lo: math.Min(0, lo), Hi: math.Max(0, hi), Label: "Excess pore pressure, " + uStress.sym(),
	}})
	pn := panels[0]
	zs, zu, su := uLength.all(c.Depth), uLength.tail(), uStress.tail()
	read := func(q Pt) string {
		return "z = " + sig(q.DY, 3) + zu + ", u = " + sig(q.DX, 3) + su
	}
	var labels []TextEl
	for i, iso := range isos {
		name := "t = " + dayLabel(iso.Time) // in the unit of the times typed
		s := f.addSeries(pn, clips[0], name, styleAt(i), iso.Excess, zs, read)
		if s == nil {
			continue
		}
		if l, ok := curveLabel(pn.Box, s, dayLabel(iso.Time)); ok {
			labels = append(labels, l)
		}
	}
	f.Texts = append(f.Texts, spreadLabels(labels, pn.Box)...)
	f.legend(f.W-legendW+8, depthTop+8, legendW-12, int((f.H-depthTop-20)/16), f.allSeries())
	return f
}

func excessOf(isos []solver.Isochrone) [][]float64 {
	out := make([][]float64, len(isos))
	for i, iso := range isos {
		out[i] = iso.Excess
	}
	return out
}

// curveLabel places a time label beside the point of largest |excess| of
// a curve (where isochrones are furthest apart), on the side with room.
func curveLabel(b Box, s *Series, text string) (TextEl, bool) {
	if len(s.Pts) == 0 {
		return TextEl{}, false
	}
	peak := 0.0
	for _, q := range s.Pts {
		peak = math.Max(peak, math.Abs(q.DX))
	}
	// The middle of the points within 0.5 % of the peak: a flat early
	// isochrone is labelled halfway along its flat part.
	var near []int
	for i, q := range s.Pts {
		if math.Abs(q.DX) >= 0.995*peak {
			near = append(near, i)
		}
	}
	q := s.Pts[near[len(near)/2]]
	t := TextEl{X: q.X + 5, Y: q.Y - 4, Text: text, Anchor: "start", Size: 10.5, Fill: s.Style.Stroke, Bold: true, Halo: true}
	if q.X+5+textWidth(text, 10.5) > b.Right()-2 {
		t.X, t.Anchor = q.X-5, "end"
	}
	if t.Y-10 < b.Y {
		t.Y = b.Y + 12
	}
	if t.Y > b.Bottom()-3 {
		t.Y = b.Bottom() - 3
	}
	return t, true
}

// spreadLabels moves labels apart vertically where their boxes would
// overlap, keeping them inside b as far as possible.
func spreadLabels(ls []TextEl, b Box) []TextEl {
	const h = 12.0
	span := func(t TextEl) (float64, float64) {
		w := textWidth(t.Text, t.Size)
		switch t.Anchor {
		case "end":
			return t.X - w, t.X
		case "middle":
			return t.X - w/2, t.X + w/2
		}
		return t.X, t.X + w
	}
	sort.SliceStable(ls, func(i, j int) bool { return ls[i].Y < ls[j].Y })
	for i := range ls {
		for j := 0; j < i; j++ {
			a0, a1 := span(ls[i])
			b0, b1 := span(ls[j])
			if a0 < b1 && b0 < a1 && math.Abs(ls[i].Y-ls[j].Y) < h {
				ls[i].Y = ls[j].Y + h
			}
		}
	}
	// Labels pushed past the bottom move back up, pushing those above.
	limit := b.Bottom() - 3
	for i := len(ls) - 1; i >= 0; i-- {
		if ls[i].Y > limit {
			ls[i].Y = limit
		}
		limit = ls[i].Y - h
	}
	return ls
}
