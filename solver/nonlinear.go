package solver

import (
	"fmt"
	"math"
	"slices"

	"porelight/solver/fem"
	"porelight/solver/soil"
)

// Tolerances of the non-linear iteration (Project.Model = ModelNonlinear,
// or a layer with an unloading mv).
const (
	// NonlinearTolerance bounds the largest change of excess pore
	// pressure between the last two iterates of a step, as a fraction of
	// the largest stress change of the project (loads, initial excess,
	// pressure changes at drained ends).
	NonlinearTolerance = 1e-6
	// NonlinearMaxIterations is the most iterations one step takes; a
	// step that has not converged by then keeps its last iterate and the
	// solve warns.
	NonlinearMaxIterations = 30
)

// nonlinear advances a column whose elements carry their own state: the
// effective stress, the largest past effective stress and, on an e–log
// σ' curve, the void ratio. Each element follows its law,
//
//   - on an e–log σ' curve (non-linear model): Cc beyond the largest past
//     stress, Cr below it, k from the void ratio by soil.Permeability;
//   - otherwise a constant mv with its swelling modulus (soil.LinearCompress)
//     and a constant k,
//
// and every step solves, by Picard iteration on the banded system of the
// θ-method,
//
//	(M(u¹) + θΔt K) u¹ = (M(u¹) − (1−θ)Δt K) u⁰ + M(u¹) (σ¹ − σ⁰),
//
// with M the capacity of the secant mv of each element over the step,
// Δε/Δσ', and K the conductivity at the void ratio of the θ-point of the
// step. With the secant the storage term is exactly the change of strain,
// so that at convergence the settlement read off the elements equals the
// water expelled. The state of an element is that of its mean stress.
// Everything is sized by newNonlinear: a step allocates nothing.
type nonlinear struct {
	tr     *transient
	m      *fem.Mesh
	lumped bool
	tol    float64
	kLo    float64 // MinK and MaxK as conductivities k/γw, m²/(kPa·day)
	kHi    float64

	// Per element.
	pts     []soil.Point // the e–log state (curved elements)
	curved  []bool
	mv, mvu []float64 // constant-mv law: loading and swelling mv
	sig     []float64 // constant-mv law: effective stress now
	peak    []float64 // constant-mv law: largest past effective stress
	strain  []float64 // constant-mv law: settlement so far, m
	k0, ck  []float64 // conductivity k/γw now, m²/(kPa·day), and Ck (0: constant)
	cm, cc  []float64 // the coefficients of the iterate: secant mv, k/γw

	mass, cond *fem.Band
	sink       *iteratedSink // the drains' radial sink on cond (nil: no drains)
	f          fem.Factor
	u0, u1     []float64
	rhs        []float64
	du, du2    []float64 // the change of u over the last step and the one before
	r0         []float64 // the last iteration's update
	lastDt     float64   // the last step's length (0: no step to extrapolate from)
	lastDt2    float64   // the one before (0: none)

	// Statistics.
	iterations, steps int
	unconverged       int
	firstBad, badStep float64 // time and step of the first unconverged step
	worst             float64 // largest final change of an unconverged step, kPa
	negativeAt        float64 // depth where σ' first fell below zero (NaN: never)
	negativeT         float64
}

// newNonlinear sets up the element laws: an e–log curve where curvedLaw
// says so (sharing the points, which the iteration then moves), else the
// layer's mv (as given or derived, mvs per layer) with its swelling
// modulus.
func newNonlinear(tr *transient, pts []soil.Point, curvedLaw []bool, mvs []float64, scale float64) *nonlinear {
	c, m := tr.c, tr.c.m
	ne, n := m.Elements(), m.Nodes()
	nl := &nonlinear{tr: tr, m: m, lumped: m.Order == 1, pts: pts, curved: curvedLaw,
		tol: NonlinearTolerance * math.Max(scale, 1e-3), negativeAt: math.NaN()}
	nl.kLo, nl.kHi = MinK*soil.SecondsPerDay/c.gw, MaxK*soil.SecondsPerDay/c.gw
	f := func() []float64 { return make([]float64, ne) }
	nl.mv, nl.mvu, nl.sig, nl.peak, nl.strain = f(), f(), f(), f(), f()
	nl.k0, nl.ck, nl.cm, nl.cc = f(), f(), f(), f()
	for e := range ne {
		l := &c.p.Layers[m.Layer[e]]
		nl.mv[e] = mvs[m.Layer[e]]
		nl.mvu[e] = l.MvUnload
		nl.sig[e] = pts[e].S0
		nl.peak[e] = pts[e].S0
		nl.k0[e] = l.K * soil.SecondsPerDay / c.gw
		if curvedLaw[e] {
			nl.ck[e] = l.ECurve.Ck
		}
	}
	nl.mass = fem.NewBand(n, m.Order)
	nl.cond = fem.NewBand(n, m.Order)
	nl.u0, nl.u1, nl.rhs, nl.du, nl.r0 = make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n)
	nl.du2 = make([]float64, n)
	nl.sink = newIteratedSink(tr, mvs, nl.lumped)
	return nl
}

// clampK holds a conductivity (k/γw, m²/(kPa·day)) from the permeability
// law within what the bounds allow k itself (MinK … MaxK): far outside
// them the law has left the soil it describes, and k would under- or
// overflow.
func (nl *nonlinear) clampK(c float64) float64 { return min(max(c, nl.kLo), nl.kHi) }

// mean is the mean over element e of the finite element field u: the
// average of the end nodes (linear) or Simpson's rule (quadratic), both
// exact, so that ∫ M u matches the element's storage.
func (nl *nonlinear) mean(u []float64, e int) float64 {
	if nl.m.Order == 2 {
		return (u[2*e] + 4*u[2*e+1] + u[2*e+2]) / 6
	}
	return (u[e] + u[e+1]) / 2
}

// coefficients sets cm and cc for the iterate u (nodal excess) under the
// nodal total stress change sigma: the secant mv from the committed state
// to the iterate's effective stress, and k/γw at the θ-point.
func (nl *nonlinear) coefficients(theta float64, sigma, u []float64) {
	for e := range nl.cm {
		p := &nl.pts[e]
		to := p.S0 + nl.mean(sigma, e) - nl.mean(u, e)
		if nl.curved[e] {
			from, pk := p.Stress(), p.Peak()
			cu := &p.Curve
			ref := max(from, soil.MinEffective)
			// The tangent index in the direction of the move; also the
			// floor that keeps the capacity positive when Cr = 0.
			idx := cu.Cr
			if to > from && from >= pk*(1-1e-9) {
				idx = cu.Cc
			}
			mvT := idx / (math.Ln10 * (1 + cu.E0) * ref)
			mvMin := 1e-6 * cu.Cc / (math.Ln10 * (1 + cu.E0) * ref)
			de := 0.0
			if d := to - from; math.Abs(d) > 1e-9*ref {
				de = p.Toward(to)
				mvT = de / ((1 + cu.E0) * d)
			}
			nl.cm[e] = max(mvT, mvMin)
			nl.cc[e] = nl.k0[e]
			if nl.ck[e] > 0 {
				nl.cc[e] = nl.clampK(soil.PermeabilityAfter(nl.k0[e], theta*de, nl.ck[e]))
			}
			continue
		}
		mvT := nl.mv[e]
		if to < nl.peak[e] || nl.sig[e] < nl.peak[e]*(1-1e-9) {
			if nl.mvu[e] > 0 {
				mvT = nl.mvu[e]
			}
		}
		if d := to - nl.sig[e]; math.Abs(d) > 1e-9*max(math.Abs(nl.sig[e]), soil.MinEffective) {
			s, _ := soil.LinearCompress(nl.mv[e], nl.mvu[e], nl.sig[e], to, nl.peak[e])
			mvT = s / d
		}
		nl.cm[e] = mvT
		nl.cc[e] = nl.k0[e]
	}
}

// step advances the column from t0 by dt, iterating the coefficients to
// the tolerance, and commits the element states. No allocation.
func (nl *nonlinear) step(theta, t0, dt float64) error {
	tr := nl.tr
	ds := tr.stressStep(t0, dt)
	tr.heldValues(tr.next, t0+dt, true)
	// The first iterate extrapolates the last step's change, unless
	// something jumped since (then u is no longer where that step ended).
	// With two steps behind, the extrapolation is quadratic in time.
	if nl.lastDt > 0 && !slices.Equal(tr.u, nl.u1) {
		nl.lastDt, nl.lastDt2 = 0, 0
	}
	copy(nl.u0, tr.u)
	copy(nl.u1, tr.u)
	switch {
	case nl.lastDt > 0 && nl.lastDt2 > 0:
		h1, h2 := nl.lastDt, nl.lastDt2
		for i := tr.lo; i < tr.hi; i++ {
			v1, v2 := nl.du[i]/h1, nl.du2[i]/h2
			a := (v1 - v2) / ((h1 + h2) / 2)
			nl.u1[i] += v1*dt + a*dt*(dt+h1)/2
		}
	case nl.lastDt > 0:
		r := dt / nl.lastDt
		for i := tr.lo; i < tr.hi; i++ {
			nl.u1[i] += r * nl.du[i]
		}
	}
	for i, j := range tr.held {
		nl.u1[j] = tr.next[i]
	}
	change, omega := math.Inf(1), 1.0
	for it := range NonlinearMaxIterations {
		nl.coefficients(theta, tr.sigma, nl.u1)
		nl.m.AssembleConstant(nl.mass, nl.cm, true, nl.lumped)
		nl.m.AssembleConstant(nl.cond, nl.cc, false, false)
		if nl.sink != nil {
			nl.sink.add(nl.cond, nl.cc)
		}
		if err := fem.FactorizeSum(&nl.f, nl.mass, nl.cond, theta*dt, tr.lo, tr.hi); err != nil {
			return tr.c.numerical(err, fmt.Sprintf("the non-linear consolidation step from %.4g to %.4g days", t0, t0+dt))
		}
		c := (1 - theta) * dt
		if nl.lumped {
			fem.ThetaRHS(nl.rhs, nl.u0, ds, nl.mass.AB, nl.cond.AB, c)
		} else {
			fem.BandThetaRHS(nl.rhs, nl.u0, ds, nl.mass, nl.cond, c)
		}
		if nl.sink != nil {
			nl.sink.source(nl.rhs, theta, t0, dt)
		}
		fem.MoveHeldSum(nl.rhs, nl.mass, nl.cond, theta*dt, nl.u1, tr.held)
		nl.f.Solve(nl.rhs)
		// r = G(u) − u, the update of plain Picard iteration, relaxed by
		// Aitken's factor (Irons & Tuck 1969; Küttler & Wall 2008):
		// ω ← −ω (r₀·(r − r₀))/|r − r₀|², which halves the update where
		// the iterates alternate (a stress crossing σ'p, where the slope
		// jumps from Cr to Cc) and lengthens it where they creep.
		last := change
		change = 0
		num, den := 0.0, 0.0
		for i := tr.lo; i < tr.hi; i++ {
			r := nl.rhs[i] - nl.u1[i]
			change = max(change, math.Abs(r))
			if it > 0 {
				d := r - nl.r0[i]
				num += nl.r0[i] * d
				den += d * d
			}
			nl.r0[i] = r
		}
		if it > 0 && den > 0 {
			omega = min(max(-omega*num/den, 0.05), 2)
		}
		for i := tr.lo; i < tr.hi; i++ {
			nl.u1[i] += omega * nl.r0[i]
		}
		nl.iterations++
		// Converged when the change, or the error it implies, is within
		// the tolerance: iterates contracting by ρ (the ratio of the last
		// two changes) are within ρ/(1−ρ) of this change from the limit.
		if change <= nl.tol {
			break
		}
		if rho := change / last; it > 0 && rho < 0.5 && change*rho/(1-rho) <= nl.tol {
			change = change * rho / (1 - rho)
			break
		}
	}
	nl.steps++
	if change > nl.tol {
		if nl.unconverged == 0 {
			nl.firstBad, nl.badStep = t0+dt, dt
		}
		nl.unconverged++
		nl.worst = math.Max(nl.worst, change)
	}
	nl.du, nl.du2 = nl.du2, nl.du
	for i := range nl.du {
		nl.du[i] = nl.u1[i] - nl.u0[i]
	}
	nl.lastDt, nl.lastDt2 = dt, nl.lastDt
	copy(tr.u, nl.u1)
	nl.commit(t0+dt, tr.sigma, tr.u)
	return nil
}

// commit moves every element to the effective stress of the nodal fields.
func (nl *nonlinear) commit(t float64, sigma, u []float64) {
	for e := range nl.pts {
		p := &nl.pts[e]
		to := p.S0 + nl.mean(sigma, e) - nl.mean(u, e)
		if to < 0 && math.IsNaN(nl.negativeAt) {
			_, z0, z1 := nl.m.Span(e)
			nl.negativeAt, nl.negativeT = (z0+z1)/2, t
		}
		if nl.curved[e] {
			if nl.ck[e] > 0 {
				nl.k0[e] = nl.clampK(soil.PermeabilityAfter(nl.k0[e], p.Toward(to), nl.ck[e]))
			}
			p.MoveTo(to)
			continue
		}
		s, pk := soil.LinearCompress(nl.mv[e], nl.mvu[e], nl.sig[e], to, nl.peak[e])
		nl.strain[e] += s * p.H
		nl.sig[e], nl.peak[e] = to, pk
	}
}

// settlement is the settlement of the column now, m: the sum over the
// elements of what their laws give for the path they followed.
func (nl *nonlinear) settlement() float64 {
	s := 0.0
	for e := range nl.pts {
		if nl.curved[e] {
			s += nl.pts[e].Settlement()
		} else {
			s += nl.strain[e]
		}
	}
	return s
}

// layerSettlements adds each element's settlement so far to its layer's
// entry of dst.
func (nl *nonlinear) layerSettlements(dst []float64) {
	for e := range nl.pts {
		s := nl.strain[e]
		if nl.curved[e] {
			s = nl.pts[e].Settlement()
		}
		dst[nl.m.Layer[e]] += s
	}
}

// drained follows a copy of every element's state along the fully drained
// path (each breakpoint's total stress against the final pore pressure,
// then the final state) and returns each layer's final settlement, m: the
// denominator of Us.
func (nl *nonlinear) drained(bps []breakpoint, sigInf, uInf []float64) []float64 {
	cp := &nonlinear{tr: nl.tr, m: nl.m, curved: nl.curved, mv: nl.mv, mvu: nl.mvu, ck: nl.ck, kLo: nl.kLo, kHi: nl.kHi,
		k0:     append([]float64(nil), nl.k0...),
		pts:    append([]soil.Point(nil), nl.pts...),
		sig:    append([]float64(nil), nl.sig...),
		peak:   append([]float64(nil), nl.peak...),
		strain: make([]float64, len(nl.strain)), negativeAt: math.NaN()}
	stress := make([]float64, nl.m.Nodes())
	for _, b := range bps {
		nl.tr.stressAt(stress, b.t, false)
		cp.commit(b.t, stress, uInf)
	}
	cp.commit(math.Inf(1), sigInf, uInf)
	out := make([]float64, len(nl.tr.c.p.Layers))
	cp.layerSettlements(out)
	return out
}

// projected returns each layer's final settlement, m, from the present
// state of every element moved once to the fully drained final effective
// stress (σ'0 + σ∞ − u∞): at the end of the simulation, what the
// remaining excess pressure still adds as it drains. The elements are
// left as they are.
func (nl *nonlinear) projected(sigInf, uInf []float64) []float64 {
	cp := &nonlinear{tr: nl.tr, m: nl.m, curved: nl.curved, mv: nl.mv, mvu: nl.mvu, ck: nl.ck, kLo: nl.kLo, kHi: nl.kHi,
		k0:     append([]float64(nil), nl.k0...),
		pts:    append([]soil.Point(nil), nl.pts...),
		sig:    append([]float64(nil), nl.sig...),
		peak:   append([]float64(nil), nl.peak...),
		strain: append([]float64(nil), nl.strain...), negativeAt: math.NaN()}
	cp.commit(math.Inf(1), sigInf, uInf)
	out := make([]float64, len(nl.tr.c.p.Layers))
	cp.layerSettlements(out)
	return out
}

// stressScale is the largest stress change a project applies, kPa: the
// scale of the iteration's tolerance.
func (tr *transient) stressScale() float64 {
	p := tr.c.p
	s := 0.0
	for _, f := range tr.shapes {
		for _, v := range f {
			s = math.Max(s, math.Abs(v))
		}
	}
	for _, dv := range p.InitialExcess {
		s = math.Max(s, math.Abs(dv.Value))
	}
	for _, b := range []Boundary{p.Top, p.Bottom} {
		for _, tv := range b.Excess {
			s = math.Max(s, math.Abs(tv.Value))
		}
	}
	return s
}

// warnings reports an iteration that did not converge and an effective
// stress that fell below zero.
func (nl *nonlinear) warnings(warn func(path, msg string)) {
	if nl.unconverged > 0 {
		warn("stepping.firstStep", fmt.Sprintf("the non-linear iteration did not converge within %d iterations in %d of %d steps (first at %.4g days, a step of %.3g days; largest remaining change %.3g kPa against the tolerance %.3g kPa): results there are approximate; use a smaller stepping.firstStep (e.g. %.3g days) or a stepping.growth nearer 1",
			NonlinearMaxIterations, nl.unconverged, nl.steps, nl.firstBad, nl.badStep, nl.worst, nl.tol, nl.badStep/4))
	}
	if !math.IsNaN(nl.negativeAt) {
		warn("loads", fmt.Sprintf("the effective stress falls below zero at %.3g m near %.4g days: the soil would lose contact (heave); results there are not physical", nl.negativeAt, nl.negativeT))
	}
}
