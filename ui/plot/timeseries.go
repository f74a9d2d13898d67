package plot

import (
	"math"
	"time"

	"porelight/solver"
	"porelight/solver/monitor"
)

// Time figure layout, pixels.
const (
	timeTop    = 34
	timeBottom = 50 // tick labels and axis title below the plot
	timeLeft   = 68
)

// timeFigure lays out one panel with a log time axis (days) at the bottom
// and a linear y axis on the left over [ylo, yhi] widened to nice ticks;
// down puts ylo at the top (values grow downward). top is the y of the
// panel's top edge (timeTop, or lower below a companion panel). It
// returns the panel and its clip id.
func (f *Figure) timeFigure(top, tlo, thi, ylo, yhi float64, ylabel string, down bool) (*Panel, string) {
	box := Box{timeLeft, top, f.W - legendW - 8 - timeLeft, f.H - timeBottom - top}
	// The first steps after a load are minutes long; more than six decades
	// before the end only flatten the interesting part.
	tlo = math.Max(tlo, thi*1e-6)
	tlo, thi = LogRange(tlo, thi)
	lo, hi, step := NiceRange(ylo, yhi, int(math.Max(2, box.H/45)))
	y := Scale{Lo: lo, Hi: hi, A: box.Bottom(), B: box.Y}
	if down {
		y.A, y.B = box.Y, box.Bottom()
	}
	pn := &Panel{Box: box, X: Scale{Lo: tlo, Hi: thi, A: box.X, B: box.Right(), Log: true}, Y: y}
	xt, yt := LogTicks(tlo, thi), LinearTicks(lo, hi, step)
	pn.XTicks = xt
	f.grid(pn, xt, true)
	f.grid(pn, yt, false)
	f.frame(box)
	f.axis(box, pn.X, xt, sideBottom, "Time, days (log scale)")
	f.axis(box, pn.Y, yt, sideLeft, ylabel)
	f.Panels = append(f.Panels, pn)
	return pn, f.clip(box)
}

// dateFigure is timeFigure with a linear time axis of calendar dates:
// day 0 is start, the axis runs over [tlo, thi] days, ticked by
// DateTicks.
func (f *Figure) dateFigure(start time.Time, top, tlo, thi, ylo, yhi float64, ylabel string, down bool) (*Panel, string) {
	box := Box{timeLeft, top, f.W - legendW - 8 - timeLeft, f.H - timeBottom - top}
	lo, hi, step := NiceRange(ylo, yhi, int(math.Max(2, box.H/45)))
	y := Scale{Lo: lo, Hi: hi, A: box.Bottom(), B: box.Y}
	if down {
		y.A, y.B = box.Y, box.Bottom()
	}
	pn := &Panel{Box: box, X: Scale{Lo: tlo, Hi: thi, A: box.X, B: box.Right()}, Y: y}
	xt, yt := DateTicks(start, tlo, thi, box.W), LinearTicks(lo, hi, step)
	pn.XTicks = xt
	f.grid(pn, xt, true)
	f.grid(pn, yt, false)
	f.frame(box)
	f.axis(box, pn.X, xt, sideBottom, "Date (day 0 = "+start.Format(solver.DateLayout)+")")
	f.axis(box, pn.Y, yt, sideLeft, ylabel)
	f.Panels = append(f.Panels, pn)
	return pn, f.clip(box)
}

// recordFigure lays out the panel of a plot of records against time: on
// calendar dates when dates is set and p's monitoring has a valid start
// (over day 0, or the first reading if earlier, to 1.5 times the last
// reading or 30 days, within the simulated time), else on log time over
// the series and the readings.
func (f *Figure) recordFigure(p *solver.Project, s *solver.Series, recs []record, dates bool, top, ylo, yhi float64, ylabel string, down bool) (*Panel, string) {
	tlo, thi, _ := positiveTimeRange(s.Time)
	if start, ok := MonitoringStart(p); dates && ok {
		lo, last := 0.0, 0.0
		for _, r := range recs {
			for _, t := range r.ts {
				if isFinite(t) {
					lo, last = math.Min(lo, t), math.Max(last, t)
				}
			}
		}
		return f.dateFigure(start, top, lo, math.Min(thi, math.Max(1.5*last, 30)), ylo, yhi, ylabel, down)
	}
	tlo, thi, _ = fittedTimeRange(s)
	tlo, thi = readingSpan(tlo, thi, recs)
	return f.timeFigure(top, tlo, thi, ylo, yhi, ylabel, down)
}

// The load panel above the settlement plot, pixels: its height and the
// gap below it.
const (
	loadPanelH   = 64
	loadPanelGap = 16
)

// loadPanel draws the surface load of s (kPa, or psf; lo and hi in the
// unit shown) over [lo, hi] in a strip
// above the panel main, on main's time axis (the same scale, so a time
// is at the same x in both): its grid, frame, value axis and curve. It
// is the figure's last panel.
func (f *Figure) loadPanel(main *Panel, s *solver.Series, lo, hi float64) {
	box := Box{main.Box.X, main.Box.Y - loadPanelGap - loadPanelH, main.Box.W, loadPanelH}
	nlo, nhi, step := NiceRange(lo, hi, 2)
	pn := &Panel{Box: box, X: main.X, Y: Scale{Lo: nlo, Hi: nhi, A: box.Bottom(), B: box.Y}}
	f.grid(pn, main.XTicks, true)
	f.grid(pn, LinearTicks(nlo, nhi, step), false)
	f.frame(box)
	f.axis(box, pn.Y, LinearTicks(nlo, nhi, step), sideLeft, "Load, "+uStress.sym())
	f.Panels = append(f.Panels, pn)
	f.addSeries(pn, f.clip(box), "Load at the surface", Style{Stroke: inkMuted, Width: 1.5}, s.Time, uStress.all(s.Load), readTime("q", uStress.tail(), 3))
}

// positiveTimeRange returns the smallest positive and the largest finite
// time, and false when no time is positive.
func positiveTimeRange(ts []float64) (lo, hi float64, ok bool) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, t := range ts {
		if t > 0 && isFinite(t) {
			lo, hi = math.Min(lo, t), math.Max(hi, t)
		}
	}
	return lo, hi, lo <= hi
}

// fittedTimeRange is the span of log time a plot of s shows: from a
// third of the time the column starts to change to three times the time
// it stops, over the degrees of consolidation, the settlement and the
// secondary compression (a change is 0.5 % of a series' whole change).
// The solver's run starts minutes after a load and goes on long after the
// last change; drawn whole, it squeezed the curves into a few decades of
// an axis that always ran from 0.01 to 10⁵ days. ok is false when s has
// no positive time.
func fittedTimeRange(s *solver.Series) (lo, hi float64, ok bool) {
	tmin, tmax, ok := positiveTimeRange(s.Time)
	if !ok {
		return 0, 0, false
	}
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, y := range [][]float64{s.Us, s.Up, s.Settlement, s.Secondary} {
		if len(y) != len(s.Time) {
			continue
		}
		first, last := -1, -1
		for i, v := range y {
			if s.Time[i] > 0 && isFinite(v) {
				if first < 0 {
					first = i
				}
				last = i
			}
		}
		if first < 0 {
			continue
		}
		y0, yn, span := y[first], y[last], 0.0
		for i := first; i <= last; i++ {
			if isFinite(y[i]) {
				span = math.Max(span, math.Abs(y[i]-y0))
			}
		}
		if !(span > 0) {
			continue
		}
		for i := first; i <= last; i++ {
			if isFinite(y[i]) && math.Abs(y[i]-y0) >= 0.005*span {
				lo = math.Min(lo, s.Time[i])
				break
			}
		}
		for i := last; i >= first; i-- {
			if isFinite(y[i]) && math.Abs(y[i]-yn) >= 0.005*span {
				hi = math.Max(hi, s.Time[min(i+1, last)])
				break
			}
		}
	}
	if !(lo <= hi) {
		return tmin, tmax, true
	}
	return math.Max(tmin, lo/3), math.Min(tmax, hi*3), true
}

// consolidationSeries returns the series of r, or a message saying why
// there is none.
func consolidationSeries(r *solver.Result) (*solver.Series, string) {
	switch {
	case r == nil:
		return nil, msgNoResult
	case r.Consolidation == nil:
		return nil, msgNoConsolidation
	}
	s := &r.Consolidation.Series
	if _, _, ok := positiveTimeRange(s.Time); !ok {
		return nil, msgNoConsolidation
	}
	return s, ""
}

func scaled(vs []float64, k float64) []float64 {
	out := make([]float64, len(vs))
	for i, v := range vs {
		out[i] = v * k
	}
	return out
}

func readTime(name, unit string, digits int) func(Pt) string {
	return func(q Pt) string {
		return "t = " + timeLabel(q.DX) + ", " + name + " = " + sig(q.DY, digits) + unit
	}
}

// DegreeFigure builds the plot of the average degree of consolidation by
// settlement (Us) and by pore pressure (Up), in %, against log time, 0 % at
// the top. Us and Up are read as fractions (1 = complete). The times to
// 50 % and 90 % from the summary are marked when known.
func DegreeFigure(p *solver.Project, r *solver.Result, w, h int) *Figure {
	f := newFigure("plot-degree", "Average degree of consolidation", w, h)
	s, msg := consolidationSeries(r)
	if s == nil {
		return f.message(msg)
	}
	if _, _, ok := finiteRange(s.Us, s.Up); !ok {
		return f.message("No degree of consolidation: the load history makes no net change.")
	}
	tlo, thi, _ := fittedTimeRange(s)
	pn, clip := f.timeFigure(timeTop, tlo, thi, 0, 100, "Degree of consolidation, %", true)
	f.addSeries(pn, clip, "Us, settlement", styleAt(0), s.Time, scaled(s.Us, 100), readTime("Us", " %", 3))
	f.addSeries(pn, clip, "Up, pore pressure", styleAt(1), s.Time, scaled(s.Up, 100), readTime("Up", " %", 3))
	f.addDrainDegrees(pn, clip, s, r)
	sm := r.Summary
	f.markTime(pn, sm.T50, 50, "t50")
	f.markTime(pn, sm.T90, 90, "t90")
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}

// markTime draws a dashed guide from the level y on the value axis to the
// time t and down to the time axis, labelled "name = t".
func (f *Figure) markTime(pn *Panel, t *float64, y float64, name string) {
	if t == nil || !(*t > 0) || !pn.X.Contains(*t) {
		return
	}
	x, yy := pn.X.Map(*t), pn.Y.Map(y)
	f.path("M"+coord(pn.Box.X)+" "+coord(yy)+" H"+coord(x)+" V"+coord(pn.Box.Bottom()), inkMuted, "2 3", 1)
	label := name + " = " + timeLabel(*t)
	tx := f.text(pn.Box.X+6, yy-4, label, "start", 10.5, inkMuted)
	tx.Halo = true
}

// SettlementFigure builds the plot of primary settlement (m or in, growing
// downward) against log time, from mv and, when present, from the e–log σ′
// curves, with the readings of the settlement plates in p.Monitoring as
// marks.
func SettlementFigure(p *solver.Project, r *solver.Result, w, h int) *Figure {
	return SettlementFitFigure(p, r, nil, w, h)
}

// SettlementFitFigure is SettlementFigure plus, when fit is not nil, the
// settlement from mv of a back-fitted project.
func SettlementFitFigure(p *solver.Project, r, fit *solver.Result, w, h int) *Figure {
	return SettlementTimeFigure(p, r, fit, false, w, h)
}

// SettlementTimeFigure is SettlementFitFigure on a linear axis of
// calendar dates when dates is set and monitoring.start is a valid date
// (see recordFigure), else on log time.
func SettlementTimeFigure(p *solver.Project, r, fit *solver.Result, dates bool, w, h int) *Figure {
	f := newFigure("plot-settlement", "Settlement", w, h)
	s, msg := consolidationSeries(r)
	if s == nil {
		return f.message(msg)
	}
	recs := plateRecords(p)
	for i := range recs {
		recs[i].vs = uSettle.all(recs[i].vs)
	}
	// With secondary compression, its own curve and the total.
	var total []float64
	if len(s.Secondary) == len(s.Time) {
		total = make([]float64, len(s.Time))
		for i := range total {
			total[i] = s.Settlement[i] + s.Secondary[i]
		}
	}
	settlement, elog, secondary, total := uSettle.all(s.Settlement), uSettle.all(s.SettlementElog), uSettle.all(s.Secondary), uSettle.all(total)
	all := [][]float64{settlement, elog, secondary, total}
	var fs *solver.Series
	var fitted []float64 // what the back-fit compared with the readings
	if fit != nil && fit.Consolidation != nil {
		fs = &fit.Consolidation.Series
		fitted, _ = monitor.FittedSettlement(fit)
		fitted = uSettle.all(fitted)
		all = append(all, fitted)
	}
	for _, m := range recs {
		all = append(all, m.vs)
	}
	lo, hi, ok := finiteRange(all...)
	if !ok {
		return f.message("No settlement results in this solve.")
	}
	lo, hi = padRange(math.Min(0, lo), math.Max(0, hi))
	// The load above, on the same time axis, when it changes.
	top := float64(timeTop)
	loadLo, loadHi, hasLoad := finiteRange(uStress.all(s.Load))
	hasLoad = hasLoad && loadHi-loadLo > 0
	if hasLoad {
		top += loadPanelH + loadPanelGap
	}
	pn, clip := f.recordFigure(p, s, recs, dates, top, lo, hi, "Settlement, "+uSettle.sym(), true)
	if hasLoad {
		f.loadPanel(pn, s, math.Min(0, loadLo), math.Max(0, loadHi))
	}
	su := uSettle.tail()
	if r.Summary.Model == solver.ModelNonlinear {
		// One solution: the series is the non-linear model's settlement.
		f.addSeries(pn, clip, "Non-linear model", styleAt(1), s.Time, settlement, readTime("s", su, 3))
	} else {
		f.addSeries(pn, clip, "From mv", styleAt(0), s.Time, settlement, readTime("s", su, 3))
		f.addSeries(pn, clip, "From e–log σ′", styleAt(1), s.Time, elog, readTime("s", su, 3))
	}
	if total != nil {
		f.addSeries(pn, clip, "Secondary (Cα)", styleAt(2), s.Time, secondary, readTime("s", su, 3))
		f.addSeries(pn, clip, "Primary + secondary", styleAt(3), s.Time, total, readTime("s", su, 3))
	}
	if fs != nil {
		name := "From mv"
		if fit.Summary.Model == solver.ModelNonlinear {
			name = "Non-linear model"
		}
		if len(fs.Secondary) == len(fs.Time) {
			name += " + secondary"
		}
		f.addSeries(pn, clip, name+", back-fitted", styleAt(4), fs.Time, fitted, readTime("s", su, 3))
	}
	for i, m := range recs {
		f.addPoints(pn, clip, "plate "+m.name+", measured", markAt(i), m.ts, m.vs, readTime("measured s", su, 3))
	}
	f.residualMarks(pn, clip, r)
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}

// excessDash marks the excess pore pressure companion of a piezometer's
// pore pressure curve.
const excessDash = "1.5 3"

// PiezometersFigure builds the plot of pore pressure (kPa or psf) against log time
// at every piezometer: the reading (steady plus excess) in the piezometer's
// own style and the excess alone dotted, thinner, in the same colour. The
// readings of the piezometer records in p.Monitoring are drawn as marks in
// the colour of the curve at their depth.
func PiezometersFigure(p *solver.Project, r *solver.Result, w, h int) *Figure {
	return PiezometersFitFigure(p, r, nil, w, h)
}

// PiezometersFitFigure is PiezometersFigure plus, when fit is not nil, the
// pore pressure of a back-fitted project at the depths of the records.
func PiezometersFitFigure(p *solver.Project, r, fit *solver.Result, w, h int) *Figure {
	return PiezometersTimeFigure(p, r, fit, RecordAxes{}, w, h)
}

// RecordAxes chooses how the plots of records against time show them.
type RecordAxes struct {
	// Dates puts the time axis on calendar dates when monitoring.start is
	// a valid date (see recordFigure).
	Dates bool
	// Level shows the piezometers as the water level a standpipe there
	// would show, m (ft) above the top of the column (negative below it): the
	// total head u/γw − z, as Steady.Head, and the excess as Δu/γw.
	Level bool
}

// PiezometersTimeFigure is PiezometersFitFigure with the axes ax.
func PiezometersTimeFigure(p *solver.Project, r, fit *solver.Result, ax RecordAxes, w, h int) *Figure {
	title := "Piezometers: pore pressure against time"
	if ax.Level {
		title = "Piezometers: water level against time"
	}
	f := newFigure("plot-piezometers", title, w, h)
	s, msg := consolidationSeries(r)
	if s == nil {
		return f.message(msg)
	}
	// The pressure u at depth z as drawn: u itself, kPa, or the level
	// u/γw − z, m; an excess as Δu or Δu/γw; in the units shown.
	gw := solver.DefaultGammaW
	if p != nil {
		gw = solver.ResolveGammaW(p)
	}
	at := func(z float64, vs []float64) []float64 {
		if !ax.Level {
			return uStress.all(vs)
		}
		out := make([]float64, len(vs))
		for i, v := range vs {
			out[i] = uLength.of(v/gw - z)
		}
		return out
	}
	excess := func(vs []float64) []float64 {
		if !ax.Level {
			return uStress.all(vs)
		}
		return uLength.all(scaled(vs, 1/gw))
	}
	name, dname, unit, ylabel := "u", "Δu", uStress.tail(), "Pore pressure, "+uStress.sym()
	if ax.Level {
		name, dname, unit, ylabel = "h", "Δu/γw", uLength.tail(), "Water level (total head), "+uLength.sym()+" above the top"
	}
	zu := uLength.tail()
	recs := piezometerRecords(p)
	var all [][]float64
	for _, pz := range s.Piezometers {
		all = append(all, at(pz.Depth, pz.Pore), excess(pz.Excess))
	}
	var fs *solver.Series
	if fit != nil && fit.Consolidation != nil {
		fs = &fit.Consolidation.Series
	}
	for _, m := range recs {
		all = append(all, at(m.depth, m.vs))
		if fz := depthIndex(fs, m.depth); fz >= 0 {
			all = append(all, at(m.depth, fs.Piezometers[fz].Pore))
		}
	}
	lo, hi, ok := finiteRange(all...)
	if !ok {
		return f.message(msgNoPiezometers)
	}
	lo, hi = padRange(math.Min(0, lo), math.Max(0, hi))
	pn, clip := f.recordFigure(p, s, recs, ax.Dates, timeTop, lo, hi, ylabel, false)
	if lo < 0 {
		y := pn.Y.Map(0)
		f.path("M"+coord(pn.Box.X)+" "+coord(y)+" H"+coord(pn.Box.Right()), inkRule, "none", 1)
	}
	for i, pz := range s.Piezometers {
		z := "z = " + sig(uLength.of(pz.Depth), 3) + zu
		st := styleAt(i)
		f.addSeries(pn, clip, z+", "+name, st, s.Time, at(pz.Depth, pz.Pore), readTime(name, unit, 3))
		ex := withDash(st, excessDash)
		ex.Width = math.Max(1.25, st.Width-0.5)
		f.addSeries(pn, clip, z+", "+dname+" excess", ex, s.Time, excess(pz.Excess), readTime(dname, unit, 3))
	}
	for j, m := range recs {
		k := depthIndex(s, m.depth)
		if fz := depthIndex(fs, m.depth); fz >= 0 {
			st := withDash(styleAt(max(k, 0)), fitDash)
			st.Width = 1.5
			f.addSeries(pn, clip, "z = "+sig(uLength.of(m.depth), 3)+zu+", "+name+" back-fitted", st, fs.Time, at(m.depth, fs.Piezometers[fz].Pore), readTime(name, unit, 3))
		}
		mk := markAt(j)
		if k >= 0 {
			mk.Stroke = styleAt(k).Stroke
		}
		f.addPoints(pn, clip, "piezometer "+m.name+", measured", mk, m.ts, at(m.depth, m.vs), readTime("measured "+name, unit, 3))
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}

// preconsolidation is σ'p against depth in every layer with an e–log
// curve (solver.PreconsolidationAt at the steady effective stress), at
// the nodes of the steady state, with a gap (NaN) between layers so that
// each layer's line stands alone.
func preconsolidation(p *solver.Project, st *solver.Steady) (xs, ys []float64) {
	if p == nil || len(st.Layers) != len(p.Layers) {
		return nil, nil
	}
	for i, l := range p.Layers {
		if l.ECurve == nil {
			continue
		}
		top, bottom := st.Layers[i].Top, st.Layers[i].Bottom
		for j, z := range st.Depth {
			if z < top || z > bottom || j >= len(st.Effective) {
				continue
			}
			xs = append(xs, solver.PreconsolidationAt(l.ECurve, z, st.Effective[j]))
			ys = append(ys, z)
		}
		xs, ys = append(xs, math.NaN()), append(ys, math.NaN())
	}
	return xs, ys
}

// fitDash marks a back-fitted companion of a predicted curve.
const fitDash = "7 2 1.5 2"

// SteadyFigure builds the steady state profiles against depth beside the
// layer strip: total head (m or ft) in the left panel; pore pressure,
// total and effective vertical stress (kPa or psf) in the right one.
func SteadyFigure(p *solver.Project, r *solver.Result, w, h int) *Figure {
	f := newFigure("plot-steady", "Steady state: head, pore pressure and stresses", w, h)
	if r == nil {
		return f.message(msgNoResult)
	}
	zsi := r.Steady.Depth
	st := &solver.Steady{ // as shown
		Depth: uLength.all(zsi), Head: uLength.all(r.Steady.Head),
		Pore: uStress.all(r.Steady.Pore), Total: uStress.all(r.Steady.Total), Effective: uStress.all(r.Steady.Effective),
	}
	hlo, hhi, okH := finiteRange(st.Head)
	slo, shi, okS := finiteRange(st.Pore, st.Total, st.Effective)
	if len(st.Depth) == 0 || (!okH && !okS) {
		return f.message(msgNoSteady)
	}
	bs := layerBands(p, r)
	zmax := columnDepth(bs, zsi)
	if !(zmax > 0) {
		return f.message(msgNoSteady)
	}
	if !okH {
		hlo, hhi = 0, 1
	}
	if !okS {
		slo, shi = 0, 1
	}
	panels, clips := f.depthFigure(p, bs, zmax, []panelSpec{
		{Weight: 0.8, Lo: hlo, Hi: hhi, Label: "Total head, " + uLength.sym()},
		{Weight: 1.4, Lo: math.Min(0, slo), Hi: math.Max(0, shi), Label: "Pressure and stress, " + uStress.sym()},
	})
	zu, su := uLength.tail(), uStress.tail()
	readZ := func(name, unit string) func(Pt) string {
		return func(q Pt) string { return "z = " + sig(q.DY, 3) + zu + ", " + name + " = " + sig(q.DX, 4) + unit }
	}
	f.addSeries(panels[0], clips[0], "Total head h", styleAt(0), st.Head, st.Depth, readZ("h", zu))
	f.addSeries(panels[1], clips[1], "Pore pressure u", styleAt(1), st.Pore, st.Depth, readZ("u", su))
	f.addSeries(panels[1], clips[1], "Total stress σv", styleAt(2), st.Total, st.Depth, readZ("σv", su))
	f.addSeries(panels[1], clips[1], "Effective stress σ′v", styleAt(3), st.Effective, st.Depth, readZ("σ′v", su))
	if xs, ys := preconsolidation(p, &r.Steady); len(xs) > 0 {
		f.addSeries(panels[1], clips[1], "Preconsolidation σ′p", Style{Stroke: styleAt(3).Stroke, Dash: "5 3", Width: styleAt(3).Width}, uStress.all(xs), uLength.all(ys), readZ("σ′p", su))
	}
	f.legend(f.W-legendW+8, depthTop+8, legendW-12, int((f.H-depthTop-20)/16), f.allSeries())
	return f
}
