package plot

import (
	"math"

	"porelight/solver"
)

// The plots of the site decisions: the curves each answer comes from.

// SurchargeFigure draws the settlement (m, growing downward) against log
// time under the permanent load alone, with the surcharge left on, and
// with it taken off on the removal day; the target (the permanent load's
// final settlement) as a dashed level, and the days of the two removal
// criteria.
func SurchargeFigure(plan *solver.SurchargePlan, w, h int) *Figure {
	f := newFigure("plot-surcharge", "Surcharge removal: settlement against time", w, h)
	if plan == nil {
		return f.message("Not worked out yet.")
	}
	c := plan.Curves
	tlo, thi, ok := positiveTimeRange(c.Surcharged.Time)
	lo, hi, ok2 := finiteRange(c.Permanent.Settlement, c.Surcharged.Settlement, c.Forward.Settlement, []float64{plan.Target})
	if !ok || !ok2 {
		return f.message("No settlement to draw.")
	}
	lo, hi = padRange(math.Min(0, lo), math.Max(0, hi))
	pn, clip := f.timeFigure(timeTop, tlo, thi, lo, hi, "Settlement, m", true)
	f.addSeries(pn, clip, "Permanent load alone", styleAt(0), c.Permanent.Time, c.Permanent.Settlement, readTime("s", " m", 3))
	f.addSeries(pn, clip, "Surcharge left on", styleAt(1), c.Surcharged.Time, c.Surcharged.Settlement, readTime("s", " m", 3))
	if len(c.Forward.Time) > 0 {
		f.addSeries(pn, clip, "Surcharge off on the day found", styleAt(3), c.Forward.Time, c.Forward.Settlement, readTime("s", " m", 3))
	}
	y := pn.Y.Map(plan.Target)
	f.path("M"+coord(pn.Box.X)+" "+coord(y)+" H"+coord(pn.Box.Right()), inkMuted, "6 3", 1)
	f.markTime(pn, plan.Average, plan.Target, "settlement reached")
	if plan.RemoveOn != nil && plan.After != nil {
		f.markTime(pn, plan.RemoveOn, plan.After.AtRemoval, "remove")
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}

// StrengthFigure draws the mean undrained strength of the layers with a
// law against log time under the project's load history, with the su
// each lift needs (FS·q/Nc) as dashed levels and the earliest day of each.
func StrengthFigure(res *solver.StrengthResult, w, h int) *Figure {
	f := newFigure("plot-strength", "Strength gain: mean su against time", w, h)
	if res == nil {
		return f.message("Not worked out yet.")
	}
	tlo, thi, ok := positiveTimeRange(res.Time)
	needs := make([]float64, len(res.Lifts))
	for i, l := range res.Lifts {
		needs[i] = l.Pressure * res.FS / res.Nc
	}
	_, hi, ok2 := finiteRange(res.Mean, needs)
	if !ok || !ok2 {
		return f.message("No strength to draw (no consolidation).")
	}
	_, hi = padRange(0, hi)
	pn, clip := f.timeFigure(timeTop, tlo, thi, 0, hi, "Mean su, kPa", false)
	f.addSeries(pn, clip, "Mean su", styleAt(0), res.Time, res.Mean, readTime("su", " kPa", 3))
	for i, l := range res.Lifts {
		y := pn.Y.Map(needs[i])
		f.path("M"+coord(pn.Box.X)+" "+coord(y)+" H"+coord(pn.Box.Right()), inkMuted, "6 3", 1)
		t := f.text(pn.Box.Right()-6, y-4, "stage "+itoa(l.Stage+1)+" needs", "end", 10.5, inkMuted)
		t.Halo = true
		if l.Earliest != nil && *l.Earliest > 0 {
			f.markTime(pn, l.Earliest, needs[i], "stage "+itoa(l.Stage+1))
		}
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}

// residualMarks marks the handover day of Result.Residual on the
// settlement panel, at the settlement reached by then, and the settlement
// at the design life.
func (f *Figure) residualMarks(pn *Panel, clip string, r *solver.Result) {
	res := r.Residual
	if res == nil {
		return
	}
	f.markTime(pn, &res.Time, res.Reached, "handover")
	if pn.X.Contains(res.Life) {
		st := Style{Stroke: inkText, Shape: "square", Open: true, Width: 1.5}
		f.addPoints(pn, clip, "At the design life", st, []float64{res.Life}, []float64{res.AtLife}, readTime("s", " m", 3))
	}
}
