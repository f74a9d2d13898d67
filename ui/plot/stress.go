package plot

import (
	"math"

	"porelight/solver"
)

const msgNoStages = "No load stages: add one to see the added stress with depth."

// StageName describes load stage i of p for legends, in the units shown:
// "Stage 2: fill 2.5 m, embankment".
func StageName(p *solver.Project, i int) string {
	s := "Stage " + itoa(i+1)
	if p == nil || i >= len(p.Loads) {
		return s
	}
	l := p.Loads[i]
	if l.Fill != nil {
		s += ": fill " + sig(uLength.of(l.Fill.Thickness), 3) + uLength.tail()
	} else {
		s += ": q " + sig(uStress.of(l.Q), 3) + uStress.tail()
	}
	switch {
	case l.Area != nil:
		s += ", " + l.Area.Shape
		if l.Area.Method == solver.MethodSpread21 {
			s += " (2:1)"
		}
	case len(l.Profile) > 0:
		s += ", typed profile"
	default:
		s += ", whole top"
	}
	return s
}

// StressFigure builds the added stress plot: for every load stage the
// ratio Δσ/q against depth, and the stress change Δσ = q·I it adds once
// fully applied with the sum of all stages (before any submergence),
// beside the layer strip, and the project's initial excess profile (an
// undrained stress increase at day 0). The stages come from the result
// (solver.Consolidation.Stages), the initial excess from p.
func StressFigure(p *solver.Project, r *solver.Result, w, h int) *Figure {
	f := newFigure("plot-stress", "Added vertical stress with depth", w, h)
	switch {
	case r == nil:
		return f.message(msgNoResult)
	case r.Consolidation == nil || (len(r.Consolidation.Stages) == 0 && (p == nil || len(p.InitialExcess) == 0)):
		return f.message(msgNoStages)
	}
	st := r.Consolidation.Stages
	bs := layerBands(p, r)
	zmax := columnDepth(bs)
	if !(zmax > 0) {
		return f.message(msgNoStages)
	}
	depth := make([]float64, 101)
	for i := range depth {
		depth[i] = zmax * float64(i) / 100
	}
	if len(st) > 0 {
		depth = st[0].Depth
	}
	var initial []float64
	if p != nil && len(p.InitialExcess) > 0 {
		initial = make([]float64, len(depth))
		for i, z := range depth {
			initial[i] = solver.ProfileAt(p.InitialExcess, z, 0)
		}
	}
	sum := make([]float64, len(depth))
	added := make([][]float64, len(st))
	for i, s := range st {
		added[i] = make([]float64, len(s.Factor))
		for j, v := range s.Factor {
			added[i][j] = s.Q * v
			if j < len(sum) {
				sum[j] += s.Q * v
			}
		}
		added[i] = uStress.all(added[i])
	}
	sum, initial, depth = uStress.all(sum), uStress.all(initial), uLength.all(depth)
	flo, fhi, _ := finiteRange(factorsOf(st)...)
	if len(st) == 0 {
		flo, fhi = 0, 1
	}
	slo, shi, _ := finiteRange(append(added, sum, initial)...)
	panels, clips := f.depthFigure(p, bs, zmax, []panelSpec{
		// Hi 1/1.03 so that the 3 % padding of depthFigure ends the axis at 1.
		{Weight: 1, Lo: math.Min(0, flo), Hi: math.Max(1, fhi) / 1.03, Label: "Δσ/q of each stage"},
		{Weight: 1.2, Lo: math.Min(0, slo), Hi: math.Max(0, shi), Label: "Added stress Δσ, " + uStress.sym()},
	})
	zu, su := uLength.tail(), uStress.tail()
	for i, s := range st {
		name := StageName(p, i)
		readF := func(q Pt) string { return "z = " + sig(q.DY, 3) + zu + ", Δσ/q = " + sig(q.DX, 3) }
		readS := func(q Pt) string { return "z = " + sig(q.DY, 3) + zu + ", Δσ = " + sig(q.DX, 3) + su }
		zs := uLength.all(s.Depth)
		f.addSeries(panels[0], clips[0], name, styleAt(i), s.Factor, zs, readF)
		f.addSeries(panels[1], clips[1], name+" ("+uStress.sym()+")", styleAt(i), added[i], zs, readS)
	}
	if len(st) > 1 {
		read := func(q Pt) string { return "z = " + sig(q.DY, 3) + zu + ", ΣΔσ = " + sig(q.DX, 4) + su }
		tot := styleAt(len(st))
		tot.Width = 2.5
		f.addSeries(panels[1], clips[1], "All stages", tot, sum, depth, read)
	}
	var ini *Series
	if initial != nil {
		read := func(q Pt) string { return "z = " + sig(q.DY, 3) + zu + ", Δu0 = " + sig(q.DX, 4) + su }
		ini = f.addSeries(panels[1], clips[1], "Initial excess (day 0)", withDash(styleAt(len(st)+1), "2 3"), initial, depth, read)
	}
	legend := append([]*Series(nil), panels[0].Series...)
	for _, s := range panels[1].Series {
		if s.Name == "All stages" || s == ini {
			legend = append(legend, s)
		}
	}
	f.legend(f.W-legendW+8, depthTop+8, legendW-12, int((f.H-depthTop-20)/16), legend)
	return f
}

func factorsOf(st []solver.StageStress) [][]float64 {
	out := make([][]float64, len(st))
	for i, s := range st {
		out[i] = s.Factor
	}
	return out
}

// StressSVG returns the added stress plot as a standalone SVG.
func StressSVG(p *solver.Project, r *solver.Result, w, h int) string {
	return StressFigure(p, r, w, h).SVG()
}

// StressCSV returns the added stress of every stage as CSV: one row per
// depth, Δσ/q and Δσ (kPa or psf) of each stage.
func StressCSV(r *solver.Result) string {
	header := []string{"depth (" + uLength.sym() + ")"}
	if r == nil || r.Consolidation == nil || len(r.Consolidation.Stages) == 0 {
		return writeCSV(header, nil)
	}
	st := r.Consolidation.Stages
	for i := range st {
		n := itoa(i + 1)
		header = append(header, "stage "+n+" Δσ/q (–)", "stage "+n+" Δσ ("+uStress.sym()+")")
	}
	rows := make([][]string, len(st[0].Depth))
	for j, z := range st[0].Depth {
		row := []string{csvNum(uLength.of(z))}
		for _, s := range st {
			q := math.NaN()
			if j < len(s.Factor) {
				q = s.Q * s.Factor[j]
			}
			row = append(row, at(s.Factor, j), csvNum(uStress.of(q)))
		}
		rows[j] = row
	}
	return writeCSV(header, rows)
}

// StageStress draws StressFigure.
type StageStress struct {
	Project       *solver.Project
	Result        *solver.Result
	Width, Height int

	memo figMemo
}

// Figure builds the figure drawn for the current props.
func (c *StageStress) Figure() *Figure {
	return c.memo.get(figKey{p: c.Project, r: c.Result, w: c.Width, h: c.Height}, func() *Figure {
		return StressFigure(c.Project, c.Result, c.Width, c.Height)
	})
}
