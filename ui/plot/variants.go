package plot

import (
	"math"

	"porelight/solver"
	"porelight/solver/uncertain"
)

// Curve is one option's result for VariantsFigure.
type Curve struct {
	Name   string
	Result *solver.Result
}

// VariantsFigure overlays the options' settlement (degree false: primary
// of the model plus secondary, m or in, growing downward) or degree of
// consolidation Us (degree true, %) against log time, one style each.
func VariantsFigure(curves []Curve, degree bool, w, h int) *Figure {
	id, title, label := "plot-options-settlement", "Settlement of each option", "Settlement, "+uSettle.sym()
	if degree {
		id, title, label = "plot-options-degree", "Degree of consolidation Us of each option", "Degree of consolidation Us, %"
	}
	f := newFigure(id, title, w, h)
	type line struct {
		name   string
		ts, ys []float64
	}
	var lines []line
	tlo, thi := math.Inf(1), math.Inf(-1)
	for _, c := range curves {
		if c.Result == nil || c.Result.Consolidation == nil {
			continue
		}
		s := &c.Result.Consolidation.Series
		ys := make([]float64, len(s.Time))
		for i, t := range s.Time {
			switch {
			case degree && len(s.Us) == len(s.Time):
				ys[i] = 100 * s.Us[i]
			case degree:
				ys = nil
			default:
				ys[i] = uSettle.of(uncertain.TotalAt(s, t))
			}
			if ys == nil {
				break
			}
		}
		if ys == nil {
			continue
		}
		if lo, hi, ok := positiveTimeRange(s.Time); ok {
			tlo, thi = math.Min(tlo, lo), math.Max(thi, hi)
		}
		lines = append(lines, line{c.Name, s.Time, ys})
	}
	if len(lines) == 0 {
		return f.message("Compare the options to see their curves.")
	}
	all := make([][]float64, len(lines))
	for i, l := range lines {
		all[i] = l.ys
	}
	lo, hi, _ := finiteRange(all...)
	if degree {
		lo, hi = 0, 100 // as DegreeFigure: a surcharge later removed takes Us past 100 % only briefly
	} else {
		lo, hi = padRange(math.Min(0, lo), math.Max(0, hi))
	}
	pn, clip := f.timeFigure(timeTop, tlo, thi, lo, hi, label, true)
	name, unit := "s", uSettle.tail()
	if degree {
		name, unit = "Us", " %"
	}
	for i, l := range lines {
		f.addSeries(pn, clip, l.name, styleAt(i), l.ts, l.ys, readTime(name+" ("+l.name+")", unit, 3))
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}

// ProfilePoint is one section of ProfileFigure.
type ProfilePoint struct {
	Name       string
	Chainage   float64 // m
	Settlement float64 // m
	OK         bool    // false: no result for this section
}

// ProfileFigure draws the settlement along the alignment at a date
// (m or in, growing downward, against chainage in m or ft), the sections marked and named;
// over, when not nil, marks the spans whose angular distortion exceeds
// the limit (over[i] for the span from section i to i+1).
func ProfileFigure(pts []ProfilePoint, over []bool, day float64, w, h int) *Figure {
	f := newFigure("plot-alignment", "Settlement along the alignment on day "+sig(day, 4), w, h)
	var xs, ys []float64
	for _, p := range pts {
		if p.OK {
			xs, ys = append(xs, uLength.of(p.Chainage)), append(ys, uSettle.of(p.Settlement))
		}
	}
	if len(xs) < 2 {
		return f.message("Give two sections or more and compare to see the profile.")
	}
	box := Box{timeLeft, timeTop + 14, f.W - 24 - timeLeft, f.H - timeBottom - timeTop - 14}
	xlo, xhi, xstep := NiceRange(xs[0], xs[len(xs)-1], int(math.Max(2, box.W/90)))
	lo, hi, _ := finiteRange(ys)
	lo, hi = padRange(math.Min(0, lo), math.Max(0, hi))
	ylo, yhi, ystep := NiceRange(lo, hi, int(math.Max(2, box.H/45)))
	pn := &Panel{Box: box, X: Scale{Lo: xlo, Hi: xhi, A: box.X, B: box.Right()}, Y: Scale{Lo: ylo, Hi: yhi, A: box.Y, B: box.Bottom()}}
	xt, yt := LinearTicks(xlo, xhi, xstep), LinearTicks(ylo, yhi, ystep)
	f.grid(pn, xt, true)
	f.grid(pn, yt, false)
	f.frame(box)
	f.axis(box, pn.X, xt, sideBottom, "Chainage, "+uLength.sym())
	f.axis(box, pn.Y, yt, sideLeft, "Settlement, "+uSettle.sym())
	f.Panels = append(f.Panels, pn)
	clip := f.clip(box)
	st := styleAt(0)
	st.Marker = true
	zu, su := uLength.tail(), uSettle.tail()
	f.addSeries(pn, clip, "Settlement", st, xs, ys, func(q Pt) string {
		return "chainage " + sig(q.DX, 4) + zu + ", s = " + sig(q.DY, 3) + su
	})
	for i, p := range pts {
		if i+1 < len(pts) && i < len(over) && over[i] && p.OK && pts[i+1].OK {
			a, b := pts[i+1], p
			el := f.path("M"+coord(pn.X.Map(uLength.of(b.Chainage)))+" "+coord(pn.Y.Map(uSettle.of(b.Settlement)))+" L"+coord(pn.X.Map(uLength.of(a.Chainage)))+" "+coord(pn.Y.Map(uSettle.of(a.Settlement))), "#b3261e", "none", 4)
			el.Clip = clip
		}
		if p.OK {
			t := f.text(pn.X.Map(uLength.of(p.Chainage)), box.Y-4, p.Name, "middle", 10.5, inkText)
			t.Halo = true
		}
	}
	if len(over) > 0 {
		f.text(12, f.H-6, "thick red: angular distortion over the limit", "start", 10.5, "#b3261e")
	}
	return f
}
