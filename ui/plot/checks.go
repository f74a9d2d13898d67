package plot

import (
	"fmt"
	"math"

	"porelight/solver"
)

// checkCurves are the checks ChecksFigure draws: the governing one of each
// kind (Summary.Heave, Uplift, Prism) that has a recorded series, with its
// legend name.
func checkCurves(r *solver.Result) (names []string, cs []*solver.Check) {
	if r == nil || r.Consolidation == nil {
		return nil, nil
	}
	n := len(r.Consolidation.Series.Time)
	for _, g := range []struct {
		g    *solver.Governing
		what string
	}{{r.Summary.Heave, "heave ic/i"}, {r.Summary.Prism, "uplift, whole overburden"}, {r.Summary.Uplift, "uplift, layer alone"}} {
		if g.g == nil || g.g.Check < 0 || g.g.Check >= len(r.Checks) {
			continue
		}
		c := &r.Checks[g.g.Check]
		if len(c.Series) != n {
			continue
		}
		at := c.Base
		if c.Kind == solver.CheckHeave {
			at = c.Top
		}
		names = append(names, fmt.Sprintf("%s, layer %d (%s%s)", g.what, c.Layer+1, sig(uLength.of(at), 3), uLength.tail()))
		cs = append(cs, c)
	}
	return names, cs
}

// ChecksFigure builds the plot of the governing heave and uplift factors
// against log time, with the line of factor 1 (where the push equals the
// resistance). Factors above 4 leave the top of the panel.
func ChecksFigure(p *solver.Project, r *solver.Result, w, h int) *Figure {
	f := newFigure("plot-checks", "Heave and uplift factors against time", w, h)
	s, msg := consolidationSeries(r)
	if s == nil {
		return f.message(msg)
	}
	names, cs := checkCurves(r)
	if len(cs) == 0 {
		return f.message("No heave or uplift check to plot: nothing pushes the soil up at any time.")
	}
	hi := 1.5
	for _, c := range cs {
		for _, v := range c.Series {
			hi = math.Max(hi, math.Min(v, 4))
		}
	}
	tlo, thi, _ := positiveTimeRange(s.Time)
	pn, clip := f.timeFigure(timeTop, tlo, thi, 0, hi, "Factor of safety", false)
	y1 := pn.Y.Map(1)
	f.path("M"+coord(pn.Box.X)+" "+coord(y1)+" H"+coord(pn.Box.Right()), inkMuted, "4 3", 1)
	f.text(pn.Box.X+6, y1-4, "1: push equals resistance", "start", 10.5, inkMuted).Halo = true
	for i, c := range cs {
		f.addSeries(pn, clip, names[i], styleAt(i), s.Time, c.Series, readTime("F", "", 3))
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}

// ChecksSVG returns the heave and uplift plot as a standalone SVG.
func ChecksSVG(p *solver.Project, r *solver.Result, w, h int) string {
	return ChecksFigure(p, r, w, h).SVG()
}

// ChecksCSV returns the governing factors' histories as CSV.
func ChecksCSV(r *solver.Result) string {
	names, cs := checkCurves(r)
	return seriesCSV(r, names, func(*solver.Series) [][]float64 {
		out := make([][]float64, len(cs))
		for i, c := range cs {
			out[i] = c.Series
		}
		return out
	})
}

// Checks draws ChecksFigure.
type Checks struct {
	Project       *solver.Project
	Result        *solver.Result
	Width, Height int

	memo figMemo
}

// Figure builds the figure drawn for the current props.
func (c *Checks) Figure() *Figure {
	return c.memo.get(figKey{p: c.Project, r: c.Result, w: c.Width, h: c.Height}, func() *Figure {
		return ChecksFigure(c.Project, c.Result, c.Width, c.Height)
	})
}
