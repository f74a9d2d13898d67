package solver

import (
	"fmt"
	"math"

	"porelight/solver/fem"
	"porelight/solver/soil"
)

// consolidation is one transient analysis of a column, from the steady
// state to the end of the simulation. Its phases, in order:
//
//  1. finalState: the stress and pore pressure change once all has
//     drained, and the breakpoints of the time loop;
//  2. sublayers: the e–log σ' state of every element, and the fully
//     drained e–log settlement along every breakpoint;
//  3. deriveMv: mv per layer, as given or the secant of the curve;
//  4. linearSummary: cv and the linear final settlement per layer;
//  5. march: the time loop, recording the series and the isochrones;
//  6. elogSummary, degreeTimes, secondary and the warnings.
//
// Everything the time loop writes to is sized before it starts.
type consolidation struct {
	c    *column
	st   *Steady
	r    *Result
	warn func(path, msg string)
	tr   *transient

	sigInf, uInf []float64 // final total stress and pore pressure change
	uZone        []float64 // the top zone's part of uInf (nil: no zone; see drainedAt)
	bps          []breakpoint

	points         []soil.Point // e–log state per element
	curved         []bool       // the element's layer has an e–log curve
	allCurves      bool
	anyCurve       bool
	elogDrained    []float64 // per layer: e–log settlement along the drained path
	drainedDelta   []float64 // per layer: ∫ Δσ'∞ dz
	mv             []float64 // per layer
	followStress   bool      // the time loop follows σ' element by element
	defined        bool      // Us has a non-zero denominator
	definedUp      bool      // so has Up
	denS, denP     float64
	negativeWarned bool
	probes         []probe
	steps          int

	// The iterated time loop (nil: the linear stepper): the non-linear
	// model, or the linear model with a swelling mv, and each layer's
	// final settlement along the drained path under its laws.
	nl        *nonlinear
	nlDrained []float64
	nlFinal   []float64 // per layer: the final settlement from the end state

	ends     *primaryEnds    // per layer end of primary (nil: no layer has a Cα)
	secParts []secondaryPart // the layers with a secondary compression estimate

	// layerW are the element weights of layerNow when the series keeps
	// every layer's settlement (Series.Layers), layerBuf its scratch
	// (ends.ew and ends.now when ends is kept too: one sum serves both).
	layerW, layerBuf []float64
	// watch, when set (Options.watch), sees the nodal total stress and
	// pore pressure change after every recorded step.
	watch func(t float64, sigma, u []float64)

	// elogTo and elogEach are follow's scratch: per element the
	// effective stress now and the e–log settlement.
	elogTo, elogEach []float64

	checks *checks // the heave and uplift checks through time
	jumped bool    // the state to record follows an instantaneous change
}

// probe is a piezometer: where to read the excess, and the steady pore
// pressure there.
type probe struct {
	at     fem.Probe
	steady float64
}

// consolidate runs the transient analysis of c from the steady state st
// and fills r.Consolidation, the settlement summary and warnings.
func (c *column) consolidate(st *Steady, r *Result, opt *Options, warn func(path, msg string)) error {
	k := &consolidation{c: c, st: st, r: r, warn: warn, tr: newTransient(c, opt)}
	if c.zoneStage >= 0 {
		k.tr.zoneTarget = c.zoneTargets(st)
	}
	if err := k.finalState(); err != nil {
		return err
	}
	if opt != nil && opt.watch != nil {
		k.watch = opt.watch.step
		opt.watch.final(k.sigInf, k.uInf, k.st.Effective)
	}
	k.sublayers()
	k.deriveMv()
	k.submerge()
	k.iterated()
	k.linearSummary()
	if err := k.march(); err != nil {
		return err
	}
	if k.nl != nil {
		// The linear model's record loop has warned of a negative σ'
		// itself; the non-linear model's commit is the only one that sees it.
		k.nl.warnings(warn, k.nonlinearModel())
		r.Stats.Iterations = k.nl.iterations
	}
	k.finalNonlinear()
	k.headline()
	k.elogSummary()
	k.degreeTimes()
	k.secondary()
	k.residual()
	c.meshWarnings(k.mv, warn)
	k.earlyTimes()
	return nil
}

// finalState computes the fully drained final state and the breakpoints.
func (k *consolidation) finalState() error {
	var err error
	k.sigInf, k.uInf, err = k.tr.final()
	if err != nil {
		return err
	}
	if k.uZone, err = k.tr.zoneDrained(); err != nil {
		return err
	}
	k.bps = breakpoints(k.c.p, k.tr.set.EndTime)
	if !k.tr.canDrain() {
		k.warn("", "both ends are undrained: the excess pore pressure cannot drain, so no consolidation settlement develops")
	}
	return nil
}

// sublayers sets up the e–log σ' state of every element (a sublayer, at
// its centre) from the steady effective stress, and follows the fully
// drained path through every breakpoint to the final state: the secant mv
// of layers that give none comes from it.
func (k *consolidation) sublayers() {
	p, m := k.c.p, k.c.m
	ne := m.Elements()
	k.allCurves = true
	for _, l := range p.Layers {
		k.allCurves = k.allCurves && l.ECurve != nil
		k.anyCurve = k.anyCurve || l.ECurve != nil
	}
	k.points = make([]soil.Point, ne)
	k.curved = make([]bool, ne)
	k.elogDrained = make([]float64, len(p.Layers))
	k.drainedDelta = make([]float64, len(p.Layers))
	pw := preconsolidationWarner{warn: k.warn}
	for e := range ne {
		_, z0, z1 := m.Span(e)
		zc := (z0 + z1) / 2
		s0 := math.Max(m.Centre(k.st.Effective, e), soil.MinEffective)
		li := m.Layer[e]
		l := &p.Layers[li]
		k.points[e] = soil.NewPoint(soil.Curve{}, z1-z0, s0, s0)
		if l.ECurve == nil || k.c.isDug(e) {
			continue
		}
		ec := l.ECurve
		pw.check(li, ec, zc, s0)
		k.points[e] = soil.NewPoint(curveOf(ec), z1-z0, s0, PreconsolidationAt(ec, zc, s0))
		k.curved[e] = true
	}
	if !k.anyCurve {
		return
	}
	final := append([]soil.Point(nil), k.points...)
	stress, ub := make([]float64, m.Nodes()), make([]float64, m.Nodes())
	for _, b := range k.bps {
		k.tr.stressAt(stress, b.t, false)
		k.drainedAt(ub, b.t)
		for e := range final {
			if k.curved[e] {
				final[e].MoveTo(final[e].S0 + m.Centre(stress, e) - m.Centre(ub, e))
			}
		}
	}
	for e := range final {
		if k.curved[e] {
			d := m.Centre(k.sigInf, e) - m.Centre(k.uInf, e)
			final[e].MoveTo(final[e].S0 + d)
			k.elogDrained[m.Layer[e]] += final[e].Settlement()
			k.drainedDelta[m.Layer[e]] += d * final[e].H
		}
	}
}

// curveOf is the soil package's view of a layer's e–log parameters.
func curveOf(c *ECurve) soil.Curve { return soil.Curve{E0: c.E0, Cc: c.Cc, Cr: c.Cr} }

// deriveMv sets mv per layer: as given, or the secant of the e–log curve
// over the final stress change (the tangent at σ'0 when there is none),
// and assembles the capacity matrix from it.
func (k *consolidation) deriveMv() {
	p, m := k.c.p, k.c.m
	k.mv = make([]float64, len(p.Layers))
	for i, l := range p.Layers {
		k.mv[i] = l.Mv
		if k.mv[i] > 0 {
			continue
		}
		if k.drainedDelta[i] > 1e-9*l.Thickness && k.elogDrained[i] > 0 {
			k.mv[i] = k.elogDrained[i] / k.drainedDelta[i]
		} else {
			zc := k.c.tops[i] + l.Thickness/2
			s0 := math.Max(m.Interpolate(k.st.Effective, zc), soil.MinEffective)
			ec := l.ECurve
			k.mv[i] = soil.TangentMv(curveOf(ec), s0, PreconsolidationAt(ec, zc, s0))
		}
		k.warn(fmt.Sprintf("layers[%d].mv", i), fmt.Sprintf("mv derived from the e–log curve: %.3g 1/kPa", k.mv[i]))
	}
	k.tr.setMv(k.mv)
}

// linearSummary fills cv and the linear final settlement of every layer.
func (k *consolidation) linearSummary() {
	p, r := k.c.p, k.r
	r.Summary.Layers = make([]LayerSummary, len(p.Layers))
	for i, l := range p.Layers {
		ls := LayerSummary{Name: l.Name, Mv: k.mv[i], Cv: soil.Cv(l.K, k.mv[i], k.c.gw)}
		r.Summary.Layers[i] = ls
		r.Steady.Layers[i].Cv = ptr(ls.Cv)
	}
	sum := 0.0
	final := k.tr.layerSettlement(k.sigInf, k.uInf)
	if k.nl != nil && !k.nonlinearModel() {
		final = k.nlDrained // the linear laws, with their swelling mv
	}
	for i, s := range final {
		r.Summary.Layers[i].SettlementLinear = s
		sum += s
	}
	r.Summary.SettlementLinear = ptr(sum)
}

// prepareSeries sizes every series for the steps the loop will take and
// places the piezometers.
func (k *consolidation) prepareSeries() *Consolidation {
	p, m, tr := k.c.p, k.c.m, k.tr
	res := &Consolidation{Depth: append([]float64(nil), m.Z...), Start: tr.startText()}
	k.r.Consolidation = res
	ser := &res.Series
	k.probes = make([]probe, len(p.Piezometers))
	for i, z := range p.Piezometers {
		k.probes[i] = probe{at: m.ProbeAt(z), steady: m.Interpolate(k.st.Pore, z)}
		ser.Piezometers = append(ser.Piezometers, Piezometer{Depth: z})
	}
	k.denS = dot(tr.wMass, k.sigInf) - dot(tr.wMass, k.uInf)
	if k.nl != nil {
		k.denS = 0
		for _, s := range k.nlDrained {
			k.denS += s
		}
	}
	k.denP = dot(tr.wLength, k.sigInf) - dot(tr.wLength, k.uInf)
	k.defined = math.Abs(k.denS) > 1e-12*math.Max(1, math.Abs(*k.r.Summary.SettlementLinear)) && tr.canDrain()
	// Up's denominator ∫Δσ'∞ dz vanishes when the final change of
	// effective stress is zero everywhere (a load applied, then removed)
	// or rises in one part of the column as much as it falls in another,
	// even where Us is defined: Up is then 0/0 and left out. 1e-9 of
	// ∫|Δσ'∞| dz is far above the rounding of the sum and far below any
	// change worth a degree of consolidation.
	absP := 0.0
	for i, w := range tr.wLength {
		absP += w * math.Abs(k.sigInf[i]-k.uInf[i])
	}
	k.definedUp = tr.canDrain() && math.Abs(k.denP) > 1e-9*absP
	if k.defined && !k.definedUp {
		k.warn("loads", "the degree of dissipation Up is not shown: the final change of effective stress sums to zero over the column (it rises in one part as much as it falls in another, or returns to where it started), so Up would be 0/0; Us and the settlement are unaffected")
	}
	capacity := estimateSteps(p) + len(k.bps) + 2
	ser.Time = make([]float64, 0, capacity)
	ser.Load = make([]float64, 0, capacity)
	ser.Settlement = make([]float64, 0, capacity)
	if k.defined {
		ser.Us = make([]float64, 0, capacity)
	}
	if k.definedUp {
		ser.Up = make([]float64, 0, capacity)
	}
	if k.anyCurve {
		ser.SettlementElog = make([]float64, 0, capacity)
	}
	k.prepareEnds(capacity)
	if n := layerSeries(p); n > 0 {
		if k.ends != nil { // the same sums feed both
			k.layerW, k.layerBuf = k.ends.ew, k.ends.now
		} else {
			k.layerW, k.layerBuf = k.elementWeights(), make([]float64, n)
		}
		ser.Layers = make([][]float64, n)
		for i := range ser.Layers {
			ser.Layers[i] = make([]float64, 0, capacity)
		}
	}
	k.checks = newChecks(k.c, k.st)
	k.checks.prepare(capacity, p.Loads)
	for i := range ser.Piezometers {
		ser.Piezometers[i].Pore = make([]float64, 0, capacity)
		ser.Piezometers[i].Excess = make([]float64, 0, capacity)
		ser.Piezometers[i].Added = make([]float64, 0, capacity)
	}
	// The effective stress is followed element by element where an e–log
	// curve needs it, and where it may fall: under a load removal or a
	// rising pressure at a drained end, or fill losing weight as it is
	// submerged. Under loading alone σ' = σ'0 + σ − u cannot drop below
	// σ'0, since u ≤ σ.
	k.followStress = k.anyCurve || tr.sub != nil
	for i := range p.Loads {
		k.followStress = k.followStress || StagePressure(p, i) < 0
	}
	for _, b := range []Boundary{p.Top, p.Bottom} {
		for _, tv := range b.Excess {
			k.followStress = k.followStress || tv.Value > 0
		}
	}
	if k.followStress {
		k.elogTo, k.elogEach = make([]float64, len(k.points)), make([]float64, len(k.points))
	}
	return res
}

// record appends the state at time t to the series. It allocates nothing
// beyond the capacity prepareSeries gave.
func (k *consolidation) record(ser *Series, t float64) {
	p, tr := k.c.p, k.tr
	ser.Time = append(ser.Time, t)
	ser.Load = append(ser.Load, surcharge(p, t))
	if tr.sub != nil {
		ser.Load[len(ser.Load)-1] -= tr.sub.lost(p.Loads, t, false, tr.settled)
	}
	var sNow, pNow float64
	sigma, u, wl := tr.sigma, tr.u, tr.wLength // read once, not per node
	if k.nl != nil {
		// The iterated laws give the settlement (and each layer's, for
		// layerNow); the mv's sum is not needed.
		sNow = k.nl.settlement()
		for i, w := range wl {
			pNow += w * (sigma[i] - u[i])
		}
	} else {
		for i, w := range tr.wMass {
			d := sigma[i] - u[i]
			sNow += w * d
			pNow += wl[i] * d
		}
	}
	ser.Settlement = append(ser.Settlement, sNow)
	tr.settled = sNow // the submergence of the next step follows it
	if k.defined {
		ser.Us = append(ser.Us, sNow/k.denS)
	}
	if k.definedUp {
		ser.Up = append(ser.Up, pNow/k.denP)
	}
	if k.nonlinearModel() {
		// The iteration moved the points; the series is the one solution.
		if k.anyCurve {
			ser.SettlementElog = append(ser.SettlementElog, sNow)
		}
	} else if k.followStress {
		total := k.follow(t)
		if k.anyCurve {
			ser.SettlementElog = append(ser.SettlementElog, total)
		}
	}
	if k.ends != nil {
		k.layerNow(k.ends.now, k.ends.ew)
		k.ends.observe(t, k.ends.now)
	}
	if k.layerW != nil {
		if k.ends == nil { // else layerBuf is ends.now, summed above
			k.layerNow(k.layerBuf, k.layerW)
		}
		for i, v := range k.layerBuf {
			ser.Layers[i] = append(ser.Layers[i], v)
		}
	}
	if k.watch != nil {
		k.watch(t, tr.sigma, tr.u)
	}
	k.checks.observe(t, tr.sigma, tr.u, k.jumped)
	k.jumped = false
	for i := range k.probes {
		pz := &k.probes[i]
		ex := pz.at.Read(tr.u)
		ser.Piezometers[i].Excess = append(ser.Piezometers[i].Excess, ex)
		ser.Piezometers[i].Pore = append(ser.Piezometers[i].Pore, pz.steady+ex)
		ser.Piezometers[i].Added = append(ser.Piezometers[i].Added, pz.at.Read(tr.sigma))
	}
}

// follow moves every element's e–log point to the effective stress at its
// centre now, σ'0 + σ − u (soil.Follow: one pass, the moves inlined),
// warns the first time that falls below zero, and returns the e–log
// settlement of the column (elements without a curve add their mv
// settlement).
func (k *consolidation) follow(t float64) float64 {
	m, tr := k.c.m, k.tr
	pts, curved, dug, sigma, u := k.points, k.curved, k.c.dug, tr.sigma, tr.u
	to, each := k.elogTo, k.elogEach
	if negative := centreStress(to, m, pts, sigma, u, dug); negative >= 0 && !k.negativeWarned {
		k.negativeWarned = true
		_, z0, z1 := m.Span(negative)
		k.warn("loads", fmt.Sprintf("the effective stress falls below zero at %.3g m near %.4g days: the soil would lose contact (heave); results there are not physical", (z0+z1)/2, t))
	}
	soil.Follow(each, pts, to, curved)
	total := 0.0
	if k.allCurves && dug == nil { // every element moved
		for _, v := range each {
			total += v
		}
		return total
	}
	for e := range pts {
		if dug != nil && dug[e] {
			continue
		}
		switch {
		case curved[e]:
			total += each[e]
		case !k.anyCurve:
		case k.nl != nil:
			total += k.nl.strain[e] // its mv, with its swelling mv
		default:
			total += k.mv[m.Layer[e]] * (m.Integrate(sigma, e) - m.Integrate(u, e))
		}
	}
	return total
}

// centreStress writes σ'0 + σ − u at the centre of every element e not
// dug (dug nil: none) to to[e], σ'0 being pts[e].S0, and returns the first
// element where that is negative, or -1. A function of its own, with
// nothing else live, so that the loop keeps its slices in registers.
func centreStress(to []float64, m *fem.Mesh, pts []soil.Point, sigma, u []float64, dug []bool) (negative int) {
	negative = -1
	to = to[:len(pts)]
	linear := m.Order == 1
	for e := range pts {
		if dug != nil && dug[e] {
			continue
		}
		var v float64
		if linear { // m.Centre, its order tested once
			v = pts[e].S0 + (sigma[e]+sigma[e+1])/2 - (u[e]+u[e+1])/2
		} else {
			v = pts[e].S0 + m.Centre(sigma, e) - m.Centre(u, e)
		}
		to[e] = v
		if v < 0 && negative < 0 {
			negative = e
		}
	}
	return negative
}

// march runs the time loop from 0 through every breakpoint: steps grow
// geometrically from Stepping.FirstStep after each restart and land on
// every breakpoint, instantaneous changes are applied between steps and
// followed by the damped steps, and every step is recorded.
func (k *consolidation) march() error {
	tr := k.tr
	res := k.prepareSeries()
	ser := &res.Series
	bps := k.bps
	t, dt, damp := 0.0, tr.set.FirstStep, 0
	tr.stressAt(tr.sigma, 0, true)
	bi := 0
	if bps[0].t == 0 {
		if bps[0].kind&bpJump != 0 {
			tr.jump(0)
			damp = tr.set.DampedSteps
			k.jumped = true
		}
		bi = 1
	}
	k.record(ser, 0)
	end := bps[len(bps)-1].t
	lastReport := 0
	// Past the last restart the steps only grow: their factors are made
	// without caching them (fem.Stepper.Uncached).
	lastRestart := -1
	for i, b := range bps {
		if b.kind&(bpRestart|bpJump) != 0 {
			lastRestart = i
		}
	}
	for bi < len(bps) {
		if bi > lastRestart {
			tr.stepper.Uncached()
		}
		target := bps[bi].t
		h := math.Min(dt, target-t)
		grown := h == dt
		if rest := target - t - h; rest > 0 && rest < 0.25*dt {
			h, grown = target-t, false
		}
		theta := tr.set.Theta
		if damp > 0 {
			theta = 1
			damp--
		}
		step := tr.step
		if k.nl != nil {
			step = k.nl.step
		}
		if err := step(theta, t, h); err != nil {
			return err
		}
		k.steps++
		if k.steps > MaxSteps {
			var ps Problems
			ps.Add("stepping.firstStep", ErrTooLarge, fmt.Sprintf("more than %d time steps; use a larger stepping.firstStep or stepping.growth", MaxSteps))
			return ps
		}
		if grown {
			dt *= tr.set.Growth
		}
		t += h
		if t >= target-1e-12*math.Max(1, target) {
			t = target
			b := bps[bi]
			bi++
			if b.kind&bpJump != 0 {
				tr.jump(t)
				damp = tr.set.DampedSteps
				k.jumped = true
			}
			if b.kind&(bpRestart|bpJump) != 0 {
				dt = tr.set.FirstStep
			}
			if b.kind&bpOutput != 0 {
				res.Isochrones = append(res.Isochrones, Isochrone{Time: t, Excess: append([]float64(nil), tr.u...)})
			}
		}
		k.record(ser, t)
		if tr.progress != nil && k.steps-lastReport >= 20 {
			lastReport = k.steps
			if !tr.progress(math.Log1p(t) / math.Log1p(end)) {
				return ErrCanceled
			}
		}
	}
	k.checks.longTerm(k.sigInf, k.uInf)
	k.checks.summarise(k.r)
	k.r.Stats.Steps = k.steps
	k.r.Stats.Factorizations = tr.stepper.Factorizations()
	k.r.Stats.Scheme = res.Start
	return nil
}

// elogSummary takes the final e–log settlement from the effective stress
// the consolidation gave at every step, so that a surcharge removed early
// counts only for the compression it caused.
func (k *consolidation) elogSummary() {
	p, m, r := k.c.p, k.c.m, k.r
	layer := make([]float64, len(p.Layers))
	for e := range k.points {
		if k.curved[e] {
			layer[m.Layer[e]] += k.points[e].Settlement()
		}
	}
	sum := 0.0
	for i, l := range p.Layers {
		if l.ECurve != nil {
			r.Summary.Layers[i].SettlementElog = ptr(layer[i])
			sum += layer[i]
			continue
		}
		// A layer without a curve adds its mv settlement, named.
		sum += r.Summary.Layers[i].SettlementLinear
		r.Summary.ElogFromMv = append(r.Summary.ElogFromMv, i)
	}
	if k.anyCurve {
		r.Summary.SettlementElog = ptr(sum)
	}
}

// degreeTimes finds t50, t90 and the time to the target degree, and warns
// when consolidation is not complete at the end of the simulation.
func (k *consolidation) degreeTimes() {
	p, r := k.c.p, k.r
	r.Summary.TargetDegree = ResolveTargetDegree(p)
	r.Summary.DesignLife = ResolveDesignLife(p)
	if !k.defined {
		return
	}
	ser := &r.Consolidation.Series
	r.Summary.T50 = crossing(ser.Time, ser.Us, 0.5)
	r.Summary.T90 = crossing(ser.Time, ser.Us, 0.9)
	r.Summary.TTarget = crossing(ser.Time, ser.Us, r.Summary.TargetDegree)
	if u := ser.Us[len(ser.Us)-1]; math.Abs(u-1) > 0.01 {
		k.warn("stepping.endTime", fmt.Sprintf("consolidation is %.1f %% complete at the end of the simulation (%.4g days)", 100*u, k.bps[len(k.bps)-1].t))
	}
}

// earlyTimes warns about output times before anything changes.
func (k *consolidation) earlyTimes() {
	first := math.Inf(1)
	for _, b := range k.bps {
		if b.kind&(bpJump|bpRestart) != 0 {
			first = b.t
			break
		}
	}
	for i, t := range k.c.p.Times {
		if t < first {
			k.warn(fmt.Sprintf("times[%d]", i), fmt.Sprintf("%g days is before the first load or boundary change (%g days): its isochrone is zero", t, first))
		}
	}
}

// crossing returns the first time at which ys reaches y, interpolating
// linearly in log time between samples (linearly from t = 0), or nil.
func crossing(ts, ys []float64, y float64) *float64 {
	for i := 1; i < len(ys); i++ {
		if ys[i] >= y && ys[i-1] < y {
			t0, t1 := ts[i-1], ts[i]
			f := (y - ys[i-1]) / (ys[i] - ys[i-1])
			if t0 <= 0 {
				return ptr(t0 + f*(t1-t0))
			}
			return ptr(t0 * math.Pow(t1/t0, f))
		}
	}
	return nil
}

// meshWarnings flags layers whose elements are too coarse to resolve the
// isochrones at the first output time: the time for pressure to diffuse
// across one element, h²/cv, exceeds it.
func (c *column) meshWarnings(mv []float64, warn func(path, msg string)) {
	p, m := c.p, c.m
	if len(p.Times) == 0 {
		return
	}
	t1 := p.Times[0]
	for i, l := range p.Layers {
		h := l.Thickness / float64(m.First[i+1]-m.First[i])
		tres := h * h / soil.Cv(l.K, mv[i], c.gw)
		if tres > t1 {
			warn(fmt.Sprintf("layers[%d]", i), fmt.Sprintf("the mesh (elements of %.3g m) cannot resolve the pressure in %q before about %.3g days; the isochrone at %g days is coarse there; use a smaller mesh.maxSize", h, l.Name, tres, t1))
		}
	}
}

// nonlinearModel reports whether the project asks for the non-linear
// model.
func (k *consolidation) nonlinearModel() bool { return k.c.p.Model == ModelNonlinear }

// iterated sets up the iterated time loop when the project needs one: the
// non-linear model (elements with an e–log curve follow it, the others
// their mv), or the linear model with a swelling mv on some layer.
func (k *consolidation) iterated() {
	p := k.c.p
	need := k.nonlinearModel()
	for _, l := range p.Layers {
		need = need || l.MvUnload > 0
	}
	if !need {
		return
	}
	law := make([]bool, len(k.points))
	pts := k.points
	if k.nonlinearModel() {
		copy(law, k.curved)
		for i, l := range p.Layers {
			if l.ECurve == nil {
				k.warn(fmt.Sprintf("layers[%d].ecurve", i), "no e–log curve: this layer follows its mv (constant k) in the non-linear model, and its mv settlement is part of the total")
			}
		}
	} else {
		pts = append([]soil.Point(nil), k.points...) // the e–log estimate keeps its own
	}
	k.nl = newNonlinear(k.tr, pts, law, k.mv, k.tr.stressScale())
	k.nlDrained = k.nl.drained(k.bps, k.sigInf, k.uInf, k.drainedAt)
}

// finalNonlinear takes the iterated model's final settlement from its end
// state (nl.projected): a load removed before the soil has drained only
// counts for the compression it caused, which the drained path of the
// stages (used while stepping) overstates. Us is rescaled to it.
func (k *consolidation) finalNonlinear() {
	if k.nl == nil {
		return
	}
	if k.tr.sub != nil {
		// The final state so far submerged the fill by the mv settlement;
		// the iterated laws settle by their own amount, so the fill below
		// the water table, the final stress and the settlement are solved
		// again together with them.
		cp, out := new(nonlinear), make([]float64, len(k.c.p.Layers))
		_, hs := k.tr.settleFinal(k.sigInf, k.uInf, func() float64 {
			k.nl.project(cp, k.sigInf, k.uInf, out)
			sum := 0.0
			for _, v := range out {
				sum += v
			}
			return sum
		})
		k.r.Summary.Submerged = ptr(hs)
	}
	k.nlFinal = k.nl.projected(k.sigInf, k.uInf)
	den := 0.0
	for _, s := range k.nlFinal {
		den += s
	}
	ser := &k.r.Consolidation.Series
	if !k.defined || math.Abs(den) <= 1e-12*math.Max(1, math.Abs(k.denS)) {
		return
	}
	f := k.denS / den
	for i := range ser.Us {
		ser.Us[i] *= f
	}
	k.denS = den
}

// headline names the model the summary's headline figures come from and
// gives its final primary settlement: the iterated laws' drained path, or
// ∫ mv Δσ' dz.
func (k *consolidation) headline() {
	r := k.r
	r.Summary.Model = ModelLinear
	if k.nonlinearModel() {
		r.Summary.Model = ModelNonlinear
	}
	s := *r.Summary.SettlementLinear
	if k.nl != nil {
		s = 0
		for i, v := range k.nlFinal {
			r.Summary.Layers[i].Settlement = v
			s += v
		}
	} else {
		for i := range r.Summary.Layers {
			r.Summary.Layers[i].Settlement = r.Summary.Layers[i].SettlementLinear
		}
	}
	r.Summary.Settlement = ptr(s)
}
