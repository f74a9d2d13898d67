package plot

import (
	"math"
	"strings"

	"porelight/solver"
	"porelight/solver/uncertain"
)

// Band fills: a light tint of the curve colour, so that the median and
// the single solve stay readable over it.
const (
	bandFill   = "#c9d5e2"
	bandStroke = "#7f9bb4"
)

// BandsFigure draws the P10–P90 band and the P50 curve of the Monte
// Carlo's settlement (degree false; m or in, growing downward) or degree of
// consolidation Us (degree true; %, 0 at the top) against log time, with
// the single solve of the project as given (r, may be nil) for
// comparison. runs is the number of realisations combined so far, of
// total.
func BandsFigure(b *uncertain.Bands, r *solver.Result, degree bool, runs, total int, w, h int) *Figure {
	id, title := "plot-range-settlement", "Settlement: P10–P90 of the realisations"
	if degree {
		id, title = "plot-range-degree", "Degree of consolidation Us: P10–P90"
	}
	f := newFigure(id, title, w, h)
	if b == nil || len(b.Time) < 2 || b.Runs-b.Failed == 0 {
		return f.message("Run the Monte Carlo to see the range.")
	}
	q := b.Settlement
	scale, unit, label := uSettle.of(1), uSettle.tail(), "Settlement, "+uSettle.sym()
	if degree {
		q = b.Degree
		scale, unit, label = 100, " %", "Degree of consolidation Us, %"
		if len(q[0]) != len(b.Time) {
			return f.message("No degree of consolidation: the load history makes no net change.")
		}
	}
	lo, hi, ok := finiteRange(q[0], q[2])
	if !ok {
		return f.message("No finite results to draw.")
	}
	lo, hi = lo*scale, hi*scale
	if degree {
		lo, hi = 0, 100
	} else {
		lo, hi = padRange(math.Min(0, lo), math.Max(0, hi))
	}
	pn, clip := f.timeFigure(timeTop, b.Time[0], b.Time[len(b.Time)-1], lo, hi, label, true)
	// The band: P10 forward, P90 back.
	p10, p90 := points(b.Time, scaled(q[0], scale), pn.X, pn.Y), points(b.Time, scaled(q[2], scale), pn.X, pn.Y)
	if len(p10) > 1 && len(p90) > 1 {
		var d strings.Builder
		d.WriteString(strings.TrimSpace(pathD(p10)))
		for i := len(p90) - 1; i >= 0; i-- {
			d.WriteString(" L" + coord(p90[i].X) + " " + coord(p90[i].Y))
		}
		d.WriteString(" Z")
		el := f.path(d.String(), "none", "none", 0)
		el.Fill, el.Clip = bandFill, clip
	}
	st := Style{Stroke: bandStroke, Dash: "none", Width: 1}
	name := "Us"
	if !degree {
		name = "s"
	}
	f.addSeries(pn, clip, "P10", st, b.Time, scaled(q[0], scale), readTime(name+" (P10)", unit, 3))
	f.addSeries(pn, clip, "P90", withDash(st, "3 2"), b.Time, scaled(q[2], scale), readTime(name+" (P90)", unit, 3))
	f.addSeries(pn, clip, "P50 (median)", styleAt(0), b.Time, scaled(q[1], scale), readTime(name+" (P50)", unit, 3))
	if r != nil && r.Consolidation != nil {
		s := &r.Consolidation.Series
		ys := make([]float64, len(b.Time))
		for i, t := range b.Time {
			if degree {
				if len(s.Us) != len(s.Time) {
					ys = nil
					break
				}
				ys[i] = 100 * solver.SeriesAt(s.Time, s.Us, t)
			} else {
				ys[i] = uncertain.TotalAt(s, t) * scale
			}
		}
		if ys != nil {
			f.addSeries(pn, clip, "Inputs as given", styleAt(1), b.Time, ys, readTime(name+" (as given)", unit, 3))
		}
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, 6, f.allSeries())
	f.text(f.W-legendW+8, timeTop+8+6*16+4, itoa(runs)+" of "+itoa(total)+" runs", "start", 11, inkMuted)
	return f
}

// T90Figure is the histogram of t90 over the realisations, in bins even
// in log time, with P10, P50 and P90 marked.
func T90Figure(b *uncertain.Bands, w, h int) *Figure {
	f := newFigure("plot-range-t90", "Time to 90 % consolidation: histogram", w, h)
	if b == nil || len(b.T90Values) < 2 {
		return f.message("t90 appears once some realisations reach 90 %.")
	}
	vs := b.T90Values
	tlo, thi := vs[0], vs[len(vs)-1]
	if !(thi > tlo) {
		thi = tlo * 1.01
	}
	nb := int(math.Min(30, math.Max(5, math.Sqrt(float64(len(vs))))))
	counts := make([]int, nb)
	llo, lhi := math.Log(tlo), math.Log(thi)
	for _, v := range vs {
		k := int(float64(nb) * (math.Log(v) - llo) / (lhi - llo))
		counts[min(max(k, 0), nb-1)]++
	}
	most := 0
	for _, c := range counts {
		most = max(most, c)
	}
	box := Box{timeLeft, timeTop, f.W - 24 - timeLeft, f.H - timeBottom - timeTop}
	xlo, xhi := LogRange(tlo, thi)
	ylo, yhi, step := NiceRange(0, float64(most), int(math.Max(2, box.H/45)))
	pn := &Panel{Box: box, X: Scale{Lo: xlo, Hi: xhi, A: box.X, B: box.Right(), Log: true}, Y: Scale{Lo: ylo, Hi: yhi, A: box.Bottom(), B: box.Y}}
	xt, yt := LogTicks(xlo, xhi), LinearTicks(ylo, yhi, step)
	f.grid(pn, xt, true)
	f.grid(pn, yt, false)
	for k, c := range counts {
		if c == 0 {
			continue
		}
		a := pn.X.Map(math.Exp(llo + (lhi-llo)*float64(k)/float64(nb)))
		z := pn.X.Map(math.Exp(llo + (lhi-llo)*float64(k+1)/float64(nb)))
		y := pn.Y.Map(float64(c))
		f.Rects = append(f.Rects, RectEl{Box: Box{a, y, math.Max(1, z-a-1), pn.Box.Bottom() - y}, Fill: bandFill, Stroke: bandStroke, StrokeWidth: 1})
	}
	f.frame(box)
	f.axis(box, pn.X, xt, sideBottom, "t90, days (log scale)")
	f.axis(box, pn.Y, yt, sideLeft, "Realisations")
	f.Panels = append(f.Panels, pn)
	for _, m := range []struct {
		name string
		v    float64
	}{{"P10", b.T90.P10}, {"P50", b.T90.P50}, {"P90", b.T90.P90}} {
		x := pn.X.Map(m.v)
		if !isFinite(x) {
			continue
		}
		f.path("M"+coord(x)+" "+coord(box.Y)+" V"+coord(box.Bottom()), inkText, "4 3", 1.2)
		t := f.text(x+3, box.Y+12, m.name+" "+timeLabel(m.v), "start", 10.5, inkText)
		t.Halo = true
	}
	return f
}

// SensitivityFigure draws the swings of t90 when each input alone goes
// from its P10 to its P90 (uncertain.Sensitivity), ranked, as bars
// around t90 with every input at its median. names labels layer i.
func SensitivityFigure(base *uncertain.Sample, swings []uncertain.Swing, names func(i int) string, w, h int) *Figure {
	f := newFigure("plot-range-sensitivity", "One at a time: t90 with each input at its P10 and P90", w, h)
	if base == nil || base.T90 == nil || len(swings) == 0 {
		return f.message("The sensitivity shows once it has run (it needs t90 with the inputs as given).")
	}
	lo, hi := *base.T90, *base.T90
	for _, s := range swings {
		for _, o := range []uncertain.Sample{s.Low, s.High} {
			if o.T90 != nil {
				lo, hi = math.Min(lo, *o.T90), math.Max(hi, *o.T90)
			}
		}
	}
	const left = 170
	rows := min(len(swings), 12)
	box := Box{left, timeTop, f.W - 24 - left, f.H - timeBottom - timeTop}
	row := box.H / float64(rows)
	xlo, xhi := LogRange(lo, hi)
	pn := &Panel{Box: box, X: Scale{Lo: xlo, Hi: xhi, A: box.X, B: box.Right(), Log: true}, Y: Scale{Lo: 0, Hi: float64(rows), A: box.Y, B: box.Bottom()}}
	xt := LogTicks(xlo, xhi)
	f.grid(pn, xt, true)
	x0 := pn.X.Map(*base.T90)
	for i, s := range swings[:rows] {
		y := box.Y + float64(i)*row + row*0.2
		for k, o := range []uncertain.Sample{s.Low, s.High} {
			end := box.Right()
			if o.T90 != nil {
				end = pn.X.Map(*o.T90)
			}
			a, z := math.Min(x0, end), math.Max(x0, end)
			fill := bandFill
			if k == 1 {
				fill = "#e3b49a" // the P90 end, rust tint
			}
			f.Rects = append(f.Rects, RectEl{Box: Box{a, y, math.Max(1, z-a), row * 0.6}, Fill: fill, Stroke: inkRule, StrokeWidth: 1})
		}
		label := paramLabel(s.Param) + " · " + names(s.Layer) // the parameter first: a long name is cut at its end
		f.text(box.X-6, y+row*0.3+4, fit(label, left-12, 11), "end", 11, inkText)
	}
	f.path("M"+coord(x0)+" "+coord(box.Y)+" V"+coord(box.Bottom()), inkText, "none", 1.5)
	f.frame(box)
	f.axis(box, pn.X, xt, sideBottom, "t90, days (log scale); pale: input at P10, rust: at P90")
	f.Panels = append(f.Panels, pn)
	return f
}

func paramLabel(p string) string {
	switch p {
	case uncertain.ParamK:
		return "k"
	case uncertain.ParamMv:
		return "mv, Cc"
	case uncertain.ParamCh:
		return "ch"
	}
	return p
}
