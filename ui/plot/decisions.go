package plot

import (
	"math"

	"porelight/solver"
)

// The plots of the site decisions: the curves each answer comes from.

// SurchargeFigure draws the settlement (m or in, growing downward) against log
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
	perm, sur, fwd := uSettle.all(c.Permanent.Settlement), uSettle.all(c.Surcharged.Settlement), uSettle.all(c.Forward.Settlement)
	target := uSettle.of(plan.Target)
	tlo, thi, ok := positiveTimeRange(c.Surcharged.Time)
	lo, hi, ok2 := finiteRange(perm, sur, fwd, []float64{target})
	if !ok || !ok2 {
		return f.message("No settlement to draw.")
	}
	lo, hi = padRange(math.Min(0, lo), math.Max(0, hi))
	su := uSettle.tail()
	pn, clip := f.timeFigure(timeTop, tlo, thi, lo, hi, "Settlement, "+uSettle.sym(), true)
	f.addSeries(pn, clip, "Permanent load alone", styleAt(0), c.Permanent.Time, perm, readTime("s", su, 3))
	f.addSeries(pn, clip, "Surcharge left on", styleAt(1), c.Surcharged.Time, sur, readTime("s", su, 3))
	if len(c.Forward.Time) > 0 {
		f.addSeries(pn, clip, "Surcharge off on the day found", styleAt(3), c.Forward.Time, fwd, readTime("s", su, 3))
	}
	y := pn.Y.Map(target)
	f.path("M"+coord(pn.Box.X)+" "+coord(y)+" H"+coord(pn.Box.Right()), inkMuted, "6 3", 1)
	f.markTime(pn, plan.Average, target, "settlement reached")
	if plan.RemoveOn != nil && plan.After != nil {
		f.markTime(pn, plan.RemoveOn, uSettle.of(plan.After.AtRemoval), "remove")
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}

// StrengthFigure draws, for every stage that adds load, the mean
// undrained strength of the layers with a law against log time under the
// stages before it alone (the curve its check reads), the su it needs
// (FS·q/Nc) as a dashed level in the same colour, and its earliest day.
func StrengthFigure(res *solver.StrengthResult, w, h int) *Figure {
	f := newFigure("plot-strength", "Strength gain: mean su before each lift", w, h)
	if res == nil {
		return f.message("Not worked out yet.")
	}
	var ts []float64
	all := [][]float64{}
	needs := make([]float64, len(res.Lifts))
	means := make([][]float64, len(res.Lifts))
	for i, l := range res.Lifts {
		needs[i] = uStress.of(l.Pressure * res.FS / res.Nc)
		means[i] = uStress.all(l.Mean)
		ts = append(ts, l.Time...)
		all = append(all, means[i])
	}
	all = append(all, needs)
	tlo, thi, ok := positiveTimeRange(ts)
	_, hi, ok2 := finiteRange(all...)
	if !ok {
		// Only lifts on unloaded ground: su stays as it is.
		tlo, thi, ok = 1, 1e4, true
	}
	if !ok2 {
		return f.message("No strength to draw.")
	}
	_, hi = padRange(0, hi)
	pn, clip := f.timeFigure(timeTop, tlo, thi, 0, hi, "Mean su, "+uStress.sym(), false)
	for i, l := range res.Lifts {
		st := styleAt(i)
		name := "before stage " + itoa(l.Stage+1)
		xs, ys := l.Time, means[i]
		if len(xs) == 1 { // unloaded ground: a level
			xs, ys = []float64{tlo, thi}, []float64{ys[0], ys[0]}
		}
		f.addSeries(pn, clip, name, st, xs, ys, readTime("su", uStress.tail(), 3))
		y := pn.Y.Map(needs[i])
		f.path("M"+coord(pn.Box.X)+" "+coord(y)+" H"+coord(pn.Box.Right()), st.Stroke, "6 3", 1)
		t := f.text(pn.Box.Right()-6, y-4, "stage "+itoa(l.Stage+1)+" needs", "end", 10.5, st.Stroke)
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
	f.markTime(pn, &res.Time, uSettle.of(res.Reached), "handover")
	if pn.X.Contains(res.Life) {
		st := Style{Stroke: inkText, Shape: "square", Open: true, Width: 1.5}
		f.addPoints(pn, clip, "At the design life", st, []float64{res.Life}, []float64{uSettle.of(res.AtLife)}, readTime("s", uSettle.tail(), 3))
	}
}

// PoreRatioFigure draws the pore pressure ratio Δu/Δσ of every piezometer
// against log time: predicted as a line, the readings of a record at its
// depth as marks in the same colour.
func PoreRatioFigure(prs []solver.PoreRatio, w, h int) *Figure {
	f := newFigure("plot-pore-ratio", "Pore pressure ratio Δu/Δσ at the piezometers", w, h)
	var all [][]float64
	var ts []float64
	for _, pr := range prs {
		all = append(all, pr.Ratio, pr.MeasuredRatio)
		ts = append(ts, pr.Time...)
		ts = append(ts, pr.MeasuredTime...)
	}
	tlo, thi, ok := positiveTimeRange(ts)
	lo, hi, ok2 := finiteRange(all...)
	if !ok || !ok2 {
		return f.message("No piezometer under an added stress.")
	}
	lo, hi = padRange(math.Min(0, lo), math.Max(1, hi))
	pn, clip := f.timeFigure(timeTop, tlo, thi, lo, hi, "Δu/Δσ", false)
	for i, pr := range prs {
		st := styleAt(i)
		f.addSeries(pn, clip, "z = "+fixed(uLength.of(pr.Depth), 2)+uLength.tail()+", predicted", st, pr.Time, pr.Ratio, readTime("Δu/Δσ", "", 3))
		if len(pr.MeasuredTime) > 0 {
			m := markAt(i)
			m.Stroke = st.Stroke
			f.addPoints(pn, clip, pr.Record+", measured", m, pr.MeasuredTime, pr.MeasuredRatio, readTime("measured Δu/Δσ", "", 3))
		}
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}
