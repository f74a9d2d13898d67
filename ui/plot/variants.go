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
// of the model plus secondary, m, growing downward) or degree of
// consolidation Us (degree true, %) against log time, one style each.
func VariantsFigure(curves []Curve, degree bool, w, h int) *Figure {
	id, title, label := "plot-options-settlement", "Settlement of each option", "Settlement, m"
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
				ys[i] = uncertain.TotalAt(s, t)
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
		// 0–100 %, higher only as far as a surcharge later removed takes Us.
		lo, hi = 0, math.Max(100, math.Ceil(hi))
	} else {
		lo, hi = padRange(math.Min(0, lo), math.Max(0, hi))
	}
	pn, clip := f.timeFigure(timeTop, tlo, thi, lo, hi, label, true)
	name, unit := "s", " m"
	if degree {
		name, unit = "Us", " %"
	}
	for i, l := range lines {
		f.addSeries(pn, clip, l.name, styleAt(i), l.ts, l.ys, readTime(name+" ("+l.name+")", unit, 3))
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}
