package solver

import (
	"fmt"
	"math"
)

// consolidate runs the transient analysis of c from the steady state st
// and fills r.Consolidation, the settlement summary and warnings.
func (c *column) consolidate(st *Steady, r *Result, opt *Options, warn func(path, msg string)) error {
	p, m := c.p, c.m
	n, ne := m.nodes(), m.elements()
	tr := newTransient(c, opt)
	sigInf, uInf, err := tr.final()
	if err != nil {
		return err
	}
	bps := breakpoints(p, endTime(p))
	if len(tr.held) == 0 && hasConsolidation(p) {
		warn("", "both ends are undrained: the excess pore pressure cannot drain, so no consolidation settlement develops")
	}

	// e–log σ' sublayers, one per element, and the final settlement along
	// the fully drained stress path through every breakpoint.
	allCurves, anyCurve := true, false
	for _, l := range p.Layers {
		allCurves = allCurves && l.ECurve != nil
		anyCurve = anyCurve || l.ECurve != nil
	}
	// Every element is a sublayer; those with an e–log curve follow it.
	subs := make([]sublayer, ne)
	elogLayer := make([]float64, len(p.Layers))
	drainedDelta := make([]float64, len(p.Layers)) // ∫ Δσ'∞ dz per layer
	warned := map[int]bool{}
	for e := range ne {
		_, z0, z1 := m.span(e)
		zc := (z0 + z1) / 2
		s0 := math.Max(m.centre(st.Effective, e), minEffective)
		subs[e] = sublayer{z: zc, h: z1 - z0, s0: s0, sig: s0}
		l := &p.Layers[m.layer[e]]
		if l.ECurve == nil {
			continue
		}
		if l.ECurve.SigmaP > 0 && l.ECurve.SigmaP < s0 && !warned[m.layer[e]] {
			warned[m.layer[e]] = true
			warn(fmt.Sprintf("layers[%d].ecurve.sigmaP", m.layer[e]), fmt.Sprintf("σ'p = %g kPa is below the in-situ effective stress (%.3g kPa at %.3g m); taken as normally consolidated there", l.ECurve.SigmaP, s0, zc))
		}
		subs[e].curve = l.ECurve
		subs[e].peak = preconsolidation(l.ECurve, s0)
	}
	if anyCurve {
		// The fully drained path through every breakpoint: the secant mv
		// of layers that give none comes from it.
		final := append([]sublayer(nil), subs...)
		stress := make([]float64, n)
		for _, b := range bps {
			tr.stressAt(stress, b.t, false)
			for e := range final {
				if final[e].curve != nil {
					final[e].moveTo(final[e].s0 + m.centre(stress, e) - m.centre(uInf, e))
				}
			}
		}
		for e := range final {
			if final[e].curve != nil {
				d := m.centre(sigInf, e) - m.centre(uInf, e)
				final[e].moveTo(final[e].s0 + d)
				elogLayer[m.layer[e]] += final[e].settlement()
				drainedDelta[m.layer[e]] += d * final[e].h
			}
		}
	}

	// mv per layer: as given, or the secant of the e–log curve over the
	// final stress change (the tangent at σ'0 when there is none).
	mv := make([]float64, len(p.Layers))
	for i, l := range p.Layers {
		mv[i] = l.Mv
		if mv[i] > 0 {
			continue
		}
		cv := l.ECurve
		if drainedDelta[i] > 1e-9*l.Thickness && elogLayer[i] > 0 {
			mv[i] = elogLayer[i] / drainedDelta[i]
		} else {
			zc := c.tops[i] + l.Thickness/2
			s0 := math.Max(m.interpolate(st.Effective, zc), minEffective)
			idx := cv.Cc
			if preconsolidation(cv, s0) > s0*1.0001 && cv.Cr > 0 {
				idx = cv.Cr
			}
			mv[i] = idx / (math.Ln10 * (1 + cv.E0) * s0)
		}
		warn(fmt.Sprintf("layers[%d].mv", i), fmt.Sprintf("mv derived from the e–log curve: %.3g 1/kPa", mv[i]))
	}
	tr.setMv(mv)

	// Summary per layer.
	sumLin := 0.0
	r.Summary.Layers = make([]LayerSummary, len(p.Layers))
	for i, l := range p.Layers {
		ls := LayerSummary{Name: l.Name, Mv: mv[i], Cv: cvPerDay(l.K, mv[i], c.gw)}
		r.Summary.Layers[i] = ls
		r.Steady.Layers[i].Cv = ptr(ls.Cv)
	}
	layerLin := tr.layerSettlement(sigInf, uInf)
	for i := range p.Layers {
		r.Summary.Layers[i].SettlementLinear = layerLin[i]
		sumLin += layerLin[i]
	}
	r.Summary.SettlementLinear = ptr(sumLin)

	// Time loop.
	res := &Consolidation{Depth: append([]float64(nil), m.z...), Start: tr.startText()}
	r.Consolidation = res
	ser := &res.Series
	piezo := make([]struct {
		e      int
		n      [3]float64
		steady float64
	}, len(p.Piezometers))
	for i, z := range p.Piezometers {
		e, xi := m.at(z)
		var dn [3]float64
		lagrange(m.order, xi, piezo[i].n[:], dn[:])
		piezo[i].e = e
		piezo[i].steady = m.interpolate(st.Pore, z)
		ser.Piezometers = append(ser.Piezometers, Piezometer{Depth: z})
	}
	denS := dot(tr.wMass, sigInf) - dot(tr.wMass, uInf)
	denP := dot(tr.wLength, sigInf) - dot(tr.wLength, uInf)
	defined := math.Abs(denS) > 1e-12*math.Max(1, math.Abs(sumLin)) && len(tr.held) > 0
	negWarned := false
	capacity := estimateSteps(p) + len(bps) + 2
	ser.Time = make([]float64, 0, capacity)
	ser.Load = make([]float64, 0, capacity)
	ser.Settlement = make([]float64, 0, capacity)
	if defined {
		ser.Us = make([]float64, 0, capacity)
		ser.Up = make([]float64, 0, capacity)
	}
	if allCurves {
		ser.SettlementElog = make([]float64, 0, capacity)
	}
	for i := range ser.Piezometers {
		ser.Piezometers[i].Pore = make([]float64, 0, capacity)
		ser.Piezometers[i].Excess = make([]float64, 0, capacity)
	}
	// The effective stress is followed element by element where an e–log
	// curve needs it, and where it may fall: under a load removal or a
	// rising pressure at a drained end. Under loading alone σ' = σ'0 + σ − u
	// cannot drop below σ'0, since u ≤ σ.
	followStress := anyCurve
	for _, l := range p.Loads {
		followStress = followStress || l.Q < 0
	}
	for _, b := range []Boundary{p.Top, p.Bottom} {
		for _, tv := range b.Excess {
			followStress = followStress || tv.Value > 0
		}
	}
	record := func(t float64) {
		ser.Time = append(ser.Time, t)
		ser.Load = append(ser.Load, surcharge(p.Loads, t))
		var sNow, pNow float64
		for i, w := range tr.wMass {
			d := tr.sigma[i] - tr.u[i]
			sNow += w * d
			pNow += tr.wLength[i] * d
		}
		ser.Settlement = append(ser.Settlement, sNow)
		if defined {
			ser.Us = append(ser.Us, sNow/denS)
			ser.Up = append(ser.Up, pNow/denP)
		}
		total := 0.0
		for e := range subs {
			if !followStress {
				break
			}
			s := &subs[e]
			to := s.s0 + m.centre(tr.sigma, e) - m.centre(tr.u, e)
			if to < 0 && !negWarned {
				negWarned = true
				warn("loads", fmt.Sprintf("the effective stress falls below zero at %.3g m near %.4g days: the soil would lose contact (heave); results there are not physical", s.z, t))
			}
			if s.curve != nil {
				s.moveTo(to)
				total += s.settlement()
			}
		}
		if allCurves {
			ser.SettlementElog = append(ser.SettlementElog, total)
		}
		for i := range piezo {
			pz := &piezo[i]
			n0 := m.order * pz.e
			ex := 0.0
			for a := 0; a <= m.order; a++ {
				ex += pz.n[a] * tr.u[n0+a]
			}
			ser.Piezometers[i].Excess = append(ser.Piezometers[i].Excess, ex)
			ser.Piezometers[i].Pore = append(ser.Piezometers[i].Pore, pz.steady+ex)
		}
	}
	iso := func(t float64) {
		res.Isochrones = append(res.Isochrones, Isochrone{Time: t, Excess: append([]float64(nil), tr.u...)})
	}

	t, dt, damp := 0.0, tr.first, 0
	tr.stressAt(tr.sigma, 0, true)
	bi := 0
	if bps[0].t == 0 {
		if bps[0].kind&bpJump != 0 {
			tr.jump(0)
			damp = tr.damped
		}
		bi = 1
	}
	record(0)
	end := bps[len(bps)-1].t
	steps := 0
	lastReport := 0
	for bi < len(bps) {
		target := bps[bi].t
		h := math.Min(dt, target-t)
		grown := h == dt
		if rest := target - t - h; rest > 0 && rest < 0.25*dt {
			h, grown = target-t, false
		}
		theta := tr.theta
		if damp > 0 {
			theta = 1
			damp--
		}
		if err := tr.step(theta, t, h); err != nil {
			return err
		}
		steps++
		if steps > MaxSteps {
			return fmt.Errorf("solver: more than %d time steps; use a larger stepping.firstStep or growth", MaxSteps)
		}
		if grown {
			dt *= tr.growth
		}
		t += h
		if t >= target-1e-12*math.Max(1, target) {
			t = target
			b := bps[bi]
			bi++
			if b.kind&bpJump != 0 {
				tr.jump(t)
				damp = tr.damped
			}
			if b.kind&(bpRestart|bpJump) != 0 {
				dt = tr.first
			}
			if b.kind&bpOutput != 0 {
				iso(t)
			}
		}
		record(t)
		if tr.progress != nil && steps-lastReport >= 20 {
			lastReport = steps
			if !tr.progress(math.Log1p(t) / math.Log1p(end)) {
				return ErrCanceled
			}
		}
	}
	// The e–log settlement follows the effective stress the consolidation
	// gave at every step, so a surcharge removed early counts only for
	// the compression it caused.
	clear(elogLayer)
	for e := range subs {
		if subs[e].curve != nil {
			elogLayer[m.layer[e]] += subs[e].settlement()
		}
	}
	sumElog := 0.0
	for i, l := range p.Layers {
		if l.ECurve != nil {
			r.Summary.Layers[i].SettlementElog = ptr(elogLayer[i])
			sumElog += elogLayer[i]
		}
	}
	if allCurves {
		r.Summary.SettlementElog = ptr(sumElog)
	}
	r.Stats.Steps = steps
	r.Stats.Factorizations = tr.factors
	r.Stats.Scheme = res.Start

	// Times to degrees of consolidation and secondary compression.
	target := p.TargetDegree
	if target == 0 {
		target = 0.95
	}
	r.Summary.TargetDegree = target
	life := p.DesignLife
	if life == 0 {
		life = 18262.5
	}
	r.Summary.DesignLife = life
	if defined {
		r.Summary.T50 = crossing(ser.Time, ser.Us, 0.5)
		r.Summary.T90 = crossing(ser.Time, ser.Us, 0.9)
		r.Summary.TTarget = crossing(ser.Time, ser.Us, target)
		if u := ser.Us[len(ser.Us)-1]; math.Abs(u-1) > 0.01 {
			warn("stepping.endTime", fmt.Sprintf("consolidation is %.1f %% complete at the end of the simulation (%.4g days)", 100*u, end))
		}
		tp := crossing(ser.Time, ser.Us, 0.95)
		sec, any := 0.0, false
		for i, l := range p.Layers {
			if l.Calpha <= 0 || l.ECurve == nil {
				continue
			}
			any = true
			if tp == nil {
				continue
			}
			strain := r.Summary.Layers[i].SettlementLinear / l.Thickness
			if s := r.Summary.Layers[i].SettlementElog; s != nil {
				strain = *s / l.Thickness
			}
			ep := l.ECurve.E0 - strain*(1+l.ECurve.E0)
			s := secondary(l.Calpha, l.Thickness, ep, life, *tp)
			r.Summary.Layers[i].Secondary = ptr(s)
			sec += s
		}
		if any {
			if tp == nil {
				warn("designLife", "primary consolidation does not reach 95 % in the simulated time: no secondary compression estimate")
			} else {
				r.Summary.Secondary = ptr(sec)
			}
		}
	}
	c.meshWarnings(mv, warn)
	first := math.Inf(1)
	for _, b := range bps {
		if b.kind&(bpJump|bpRestart) != 0 {
			first = b.t
			break
		}
	}
	for i, t := range p.Times {
		if t < first {
			warn(fmt.Sprintf("times[%d]", i), fmt.Sprintf("%g days is before the first load or boundary change (%g days): its isochrone is zero", t, first))
		}
	}
	return nil
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
		h := l.Thickness / float64(m.first[i+1]-m.first[i])
		tres := h * h / cvPerDay(l.K, mv[i], c.gw)
		if tres > t1 {
			warn(fmt.Sprintf("layers[%d]", i), fmt.Sprintf("the mesh (elements of %.3g m) cannot resolve the pressure in %q before about %.3g days; the isochrone at %g days is coarse there; use a smaller mesh.maxSize", h, l.Name, tres, t1))
		}
	}
}
