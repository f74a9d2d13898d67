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
	mv, mvu []float64  // constant-mv law: loading and swelling mv
	sig     []float64  // constant-mv law: effective stress now
	peak    []float64  // constant-mv law: largest past effective stress
	strain  []float64  // constant-mv law: settlement so far, m
	layers  []float64  // per layer: its settlement at the last settlement()
	k0      []float64  // conductivity k/γw now, m²/(kPa·day)
	cm, cc  []float64  // the coefficients of the iterate: secant mv, k/γw
	to, de  []float64  // scratch: effective stress of the iterate, compression of the move
	base    []float64  // σ'0 + the mean of the total stress change (loadStress)
	law     []curveLaw // curved elements: the constants of the curve
	ct      []float64  // lumped capacity: the tangent mv at the iterate (nil otherwise)

	mass, cond *fem.Band
	sink       *iteratedSink // the drains' radial sink on cond (nil: no drains)
	f          fem.Factor
	u0, u1     []float64
	rhs        []float64
	au         []float64   // A(u) u of the iterate (the band path)
	rows       []lumpedRow // lumped: A' and the residual, then their factors
	gk         []float64   // lumped: d(k/γw)/dσ' at the iterate (nil: k constant, or drains)
	spans      []span      // lumped: per element h/2 and 1/h
	du, du2    []float64   // the change of u over the last step and the one before
	du3        []float64   // and the one before that
	r0         []float64   // the last iteration's update
	lastDt     float64     // the last step's length (0: no step to extrapolate from)
	lastDt2    float64     // the one before (0: none)
	lastDt3    float64     // and the one before that (0: none)

	// Statistics.
	iterations, steps int
	unconverged       int
	firstBad, badStep float64 // time and step of the first unconverged step
	worst             float64 // largest final change of an unconverged step, kPa
	negativeAt        float64 // depth where σ' first fell below zero (NaN: never)
	negativeT         float64
}

// curveLaw holds the constants of an element's e–log curve that
// coefficients reads at every iteration, side by side: one slice where
// six would each hold a register of the loop (or, short of registers,
// be reloaded from the stack every element).
type curveLaw struct {
	inv   float64 // 1/(1+e0)
	floor float64 // the least mv·σ', 1e-6 Cc/(ln 10 (1+e0))
	tanR  float64 // the tangent mv·σ' below σ'p, floored (Cr)
	tanC  float64 // and on the virgin line (Cc)
	kExp  float64 // −ln 10/Ck where Ck > 0, else 0 (k constant)
	kq    float64 // kExp (1+e0), for gk
}

// span is an element's h/2 and 1/h, and lumpedRow a row of the
// tridiagonal A' of solveLumped with its residual: the diagonal, then the
// inverse pivot; the lower off-diagonal (the entry below the diagonal,
// in the next row), then L's multiplier; the upper, then D⁻¹U's; the
// residual, then y of L y = r. Side by side for the reason curveLaw
// gives.
type (
	span      struct{ half, inv float64 }
	lumpedRow struct{ d, l, u, r float64 }
)

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
	nl.k0, nl.cm, nl.cc = f(), f(), f()
	nl.to, nl.de, nl.base = f(), f(), f()
	nl.layers = make([]float64, len(c.p.Layers))
	nl.law = make([]curveLaw, ne)
	kVaries := false // some element's k follows its void ratio (Ck > 0)
	for e := range ne {
		l := &c.p.Layers[m.Layer[e]]
		nl.mv[e] = mvs[m.Layer[e]]
		nl.mvu[e] = l.MvUnload
		if c.isDug(e) { // taken out by the excavation: no storage
			nl.mv[e], nl.mvu[e] = 0, 0
		}
		nl.sig[e] = pts[e].S0
		nl.peak[e] = pts[e].S0
		nl.k0[e] = l.K * soil.SecondsPerDay / c.gw
		if curvedLaw[e] {
			cu := pts[e].Curve
			w := &nl.law[e]
			w.inv = 1 / (1 + cu.E0)
			w.floor = 1e-6 * cu.Cc / (math.Ln10 * (1 + cu.E0))
			w.tanR = max(cu.Cr/(math.Ln10*(1+cu.E0)), w.floor)
			w.tanC = max(cu.Cc/(math.Ln10*(1+cu.E0)), w.floor)
			if ck := l.ECurve.Ck; ck > 0 {
				w.kExp = -math.Ln10 / ck
				w.kq = w.kExp * (1 + cu.E0)
				kVaries = true
			}
		}
	}
	nl.mass = fem.NewBand(n, m.Order)
	if nl.lumped {
		nl.ct = f()
	}
	nl.cond = fem.NewBand(n, m.Order)
	nl.u0, nl.u1, nl.rhs, nl.du, nl.r0 = make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n)
	nl.du2, nl.du3, nl.au = make([]float64, n), make([]float64, n), make([]float64, n)
	if nl.lumped {
		nl.rows, nl.spans = make([]lumpedRow, n), make([]span, ne)
		nl.gk = f()
		for e := range ne {
			h := m.Z[e+1] - m.Z[e]
			nl.spans[e] = span{half: h / 2, inv: 1 / h}
		}
	}
	nl.sink = newIteratedSink(tr, mvs, nl.lumped)
	if nl.sink != nil || !kVaries {
		nl.gk = nil // the band path (drains), or k constant: A' symmetric
	}
	return nl
}

// clampK holds a conductivity (k/γw, m²/(kPa·day)) from the permeability
// law within what the bounds allow k itself (MinK … MaxK): far outside
// them the law has left the soil it describes, and k would under- or
// overflow.
func (nl *nonlinear) clampK(c float64) float64 {
	// Comparisons rather than min and max, which also order NaN and the
	// signed zeros: this runs for every element at every iteration.
	if c < nl.kLo {
		return nl.kLo
	}
	if c > nl.kHi {
		return nl.kHi
	}
	return c
}

// mean is the mean over element e of the finite element field u: the
// average of the end nodes (linear) or Simpson's rule (quadratic), both
// exact, so that ∫ M u matches the element's storage.
func (nl *nonlinear) mean(u []float64, e int) float64 {
	if nl.m.Order == 2 {
		return (u[2*e] + 4*u[2*e+1] + u[2*e+2]) / 6
	}
	return (u[e] + u[e+1]) / 2
}

// loadStress sets base for the nodal total stress change sigma: every
// element's σ'0 + the mean of sigma over it (nl.mean), which meanStress
// then reads at every iteration of the step (sigma is that of the step's
// end throughout).
func (nl *nonlinear) loadStress(sigma []float64) {
	pts := nl.pts
	base := nl.base[:len(pts)]
	if nl.m.Order != 1 {
		for e := range pts {
			base[e] = pts[e].S0 + nl.mean(sigma, e)
		}
		return
	}
	sigma = sigma[:len(pts)+1]
	for e := range pts { // nl.mean, inlined
		base[e] = pts[e].S0 + (sigma[e]+sigma[e+1])/2
	}
}

// meanStress writes the effective stress of every element e at the
// iterate, base[e] (loadStress) − the mean of u over it (nl.mean), to
// to[e]: σ'0 + the mean of sigma − u, added in that order.
func (nl *nonlinear) meanStress(to, u []float64) {
	base := nl.base
	to = to[:len(base)]
	if nl.m.Order != 1 {
		for e := range base {
			to[e] = base[e] - nl.mean(u, e)
		}
		return
	}
	u = u[:len(base)+1]
	for e := range base { // nl.mean, inlined
		to[e] = base[e] - (u[e]+u[e+1])/2
	}
}

// coefficients sets cm and cc for the iterate u (nodal excess) under the
// nodal total stress change loadStress was given: the secant mv from the committed state
// to the iterate's effective stress, and k/γw at the θ-point. It runs for
// every element at every iteration, so the constants of each element's
// curve are taken from newNonlinear (law), a division is spent only where
// a value needs it, and the compressions come from one soil.Toward over
// the column (a call per element would cost as much again); the slices
// are taken once, at their length, and are few, so that the loop reads
// them from registers without checking. (Measured on
// BenchmarkSoftClayNonlinear, the curve's constants in one slice of
// curveLaw rather than six took some 15 % off the solve.)
func (nl *nonlinear) coefficients(theta float64, u []float64) {
	ne := len(nl.cm)
	nl.meanStress(nl.to, u)
	soil.Toward(nl.de, nl.pts, nl.to, nl.curved)
	pts, curved, tos, des := nl.pts[:ne], nl.curved[:ne], nl.to[:ne], nl.de[:ne]
	cm, cc, k0, law := nl.cm[:ne], nl.cc[:ne], nl.k0[:ne], nl.law[:ne]
	ct, gk := nl.ct, nl.gk
	if ct != nil {
		ct = ct[:ne]
	}
	if gk != nil {
		gk = gk[:ne]
	}
	for e := range pts {
		p := &pts[e]
		to := tos[e]
		if !curved[e] {
			nl.mvCoefficients(e, to)
			continue
		}
		w := &law[e]
		from := p.Stress()
		ref := from // max(from, MinEffective) (see clampK)
		if ref < soil.MinEffective {
			ref = soil.MinEffective
		}
		// The secant Δe/((1+e0)Δσ'); for a move too small to measure,
		// the tangent index in the direction of the move (Cr below
		// the largest past stress, Cc on the virgin line). Both are
		// floored at 1e-6 of the virgin slope, which keeps the
		// capacity positive when Cr = 0.
		var mvT, de float64
		if d := to - from; math.Abs(d) > 1e-9*ref {
			de = des[e]
			mvT = de * w.inv / d
		} else {
			idx := p.Curve.Cr
			if d > 0 && from >= p.Peak()*(1-1e-9) {
				idx = p.Curve.Cc
			}
			mvT = idx * w.inv / (math.Ln10 * ref)
		}
		if f := w.floor; mvT*ref < f {
			mvT = f / ref
		}
		cm[e] = mvT
		tangent := 0.0
		if ct != nil {
			// The tangent at the iterate, with the same floor.
			t := w.tanR
			if p.Beyond(to) {
				t = w.tanC
			}
			s := to
			if s < soil.MinEffective {
				s = soil.MinEffective
			}
			tangent = t / s
			ct[e] = tangent
		}
		k := k0[e]
		if w.kExp < 0 { // Ck > 0
			// soil.PermeabilityAfter(k0, θΔe, Ck) = k0·10^(−θΔe/Ck).
			y := w.kExp * theta * de
			x, ok := soil.ExpSmall(y) // soil.Exp, in line
			if !ok {
				x = math.Exp(y)
			}
			kt := k * x
			k = nl.clampK(kt)
			if gk != nil {
				// d(k/γw)/dσ' = k/γw kExp θ dΔe/dσ', with
				// dΔe/dσ' = (1+e0) ct; zero where k is held.
				g := 0.0
				if k == kt {
					g = k * theta * w.kq * tangent
				}
				gk[e] = g
			}
		}
		cc[e] = k
	}
}

// mvCoefficients is coefficients for element e on the constant-mv law
// (with its swelling mv) at the iterate's effective stress to.
func (nl *nonlinear) mvCoefficients(e int, to float64) {
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
	if nl.ct != nil {
		nl.ct[e] = nl.mv[e]
		if to <= max(nl.peak[e], nl.sig[e]) && nl.mvu[e] > 0 {
			nl.ct[e] = nl.mvu[e]
		}
	}
	nl.cc[e] = nl.k0[e]
}

// step advances the column from t0 by dt, iterating the coefficients to
// the tolerance, and commits the element states. No allocation.
func (nl *nonlinear) step(theta, t0, dt float64) error {
	tr := nl.tr
	ds := tr.stressStep(t0, dt)
	tr.zeroPins(ds)
	tr.heldValues(tr.next, t0+dt, true)
	nl.loadStress(tr.sigma)
	// The first iterate extrapolates the last step's change, unless
	// something jumped since (then u is no longer where that step ended).
	// With two steps behind, the extrapolation is quadratic in time.
	if nl.lastDt > 0 && !slices.Equal(tr.u, nl.u1) {
		nl.lastDt, nl.lastDt2, nl.lastDt3 = 0, 0, 0
	}
	copy(nl.u0, tr.u)
	copy(nl.u1, tr.u)
	switch {
	case nl.lastDt > 0 && nl.lastDt2 > 0 && nl.lastDt3 > 0:
		// Cubic: Lagrange's polynomial through u at the last four step
		// ends (τ = 0, −h1, −h1−h2, −h1−h2−h3, u relative to now 0, −du,
		// −du−du2, −du−du2−du3), at τ = dt.
		t1 := -nl.lastDt
		t2 := t1 - nl.lastDt2
		t3 := t2 - nl.lastDt3
		l1 := (dt - 0) * (dt - t2) * (dt - t3) / ((t1 - 0) * (t1 - t2) * (t1 - t3))
		l2 := (dt - 0) * (dt - t1) * (dt - t3) / ((t2 - 0) * (t2 - t1) * (t2 - t3))
		l3 := (dt - 0) * (dt - t1) * (dt - t2) / ((t3 - 0) * (t3 - t1) * (t3 - t2))
		w1, w2, w3 := -(l1 + l2 + l3), -(l2 + l3), -l3
		u1, n := nl.u1[tr.lo:tr.hi], tr.hi-tr.lo
		du, du2, du3 := nl.du[tr.lo:][:n], nl.du2[tr.lo:][:n], nl.du3[tr.lo:][:n]
		for i := range u1 {
			u1[i] += w1*du[i] + w2*du2[i] + w3*du3[i]
		}
	case nl.lastDt > 0 && nl.lastDt2 > 0:
		// With rates v1 = du/h1, v2 = du2/h2 and a = (v1 − v2)/((h1+h2)/2),
		// u += v1 dt + a dt (dt+h1)/2 = α du − β du2.
		h1, h2 := nl.lastDt, nl.lastDt2
		q := dt * (dt + h1) / (h1 + h2)
		alpha, beta := (dt+q)/h1, q/h2
		for i := tr.lo; i < tr.hi; i++ {
			nl.u1[i] += alpha*nl.du[i] - beta*nl.du2[i]
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
		nl.coefficients(theta, nl.u1)
		// The update solves A' r = b(u) − A(u) u, with A(u) = M(u) + θΔt
		// K(u) and b(u) = (M(u) − (1−θ)Δt K(u)) u⁰ + M(u) Δσ (held nodes
		// at their values), so that its fixed point is the step's
		// equation whatever A' is. With a lumped capacity A' takes the
		// tangent mv at the iterate (M_T, the derivative of the storage
		// term row by row) in place of the secant, Newton's method in the
		// storage term (measured on the soft clay of
		// BenchmarkSoftClayNonlinear: 2.93 iterations a step against 3.02
		// with the secant), and the derivative of the flux by k's change
		// with the iterate (gk; see solveLumped), Newton's in k too: 2.04
		// iterations a step against 2.72 with k's change left out
		// (Picard's in k; the same cubic predictor), the second update of
		// a step mostly below 1e-5 kPa instead of 1e-3. The quadratic
		// elements' consistent capacity keeps the secant, which makes this
		// Picard iteration. (Reusing the factor of the step's first
		// iterate, a chord iteration, was measured with Picard's k: 10 %
		// more iterations, which cost more than the factorisations
		// saved; with Newton's, keeping the first factor for the second
		// update left it near 1e-3 kPa instead of 1e-6: 581 iterations
		// against 332.)
		// The fused pass knows no drains: with a sink, linear elements
		// take the band path too, with their lumped capacity (Picard in
		// the storage term; the same fixed point).
		if nl.lumped && nl.sink == nil {
			if err := nl.solveLumped(theta, dt, ds); err != nil {
				return tr.c.numerical(err, fmt.Sprintf("the non-linear consolidation step from %.4g to %.4g days", t0, t0+dt))
			}
		} else {
			nl.m.AssembleConstant(nl.mass, nl.cm, true, nl.lumped)
			nl.m.AssembleConstant(nl.cond, nl.cc, false, false)
			if nl.sink != nil {
				nl.sink.add(nl.cond, nl.cc)
			}
			tr.addLeaks(nl.cond)
			tr.isolatePins(nl.mass, nl.cond)
			if err := fem.FactorizeSum(&nl.f, nl.mass, nl.cond, theta*dt, tr.lo, tr.hi); err != nil {
				return tr.c.numerical(err, fmt.Sprintf("the non-linear consolidation step from %.4g to %.4g days", t0, t0+dt))
			}
			fem.BandThetaRHS(nl.rhs, nl.u0, ds, nl.mass, nl.cond, (1-theta)*dt)
			fem.BandThetaRHS(nl.au, nl.u1, nil, nl.mass, nl.cond, -theta*dt)
			for i := tr.lo; i < tr.hi; i++ {
				nl.rhs[i] -= nl.au[i]
			}
			if nl.sink != nil {
				nl.sink.source(nl.rhs, theta, t0, dt)
			}
			nl.f.Solve(nl.rhs)
		}
		// r = G(u) − u, the update of the iteration, relaxed by
		// Aitken's factor (Irons & Tuck 1969; Küttler & Wall 2008):
		// ω ← −ω (r₀·(r − r₀))/|r − r₀|², which halves the update where
		// the iterates alternate (a stress crossing σ'p, where the slope
		// jumps from Cr to Cc) and lengthens it where they creep.
		last := change
		change = 0
		if it == 0 {
			// ω = 1: the update goes with the same pass.
			u1, n := nl.u1[tr.lo:tr.hi], tr.hi-tr.lo
			rhs, r0 := nl.rhs[tr.lo:][:n], nl.r0[tr.lo:][:n]
			for i, r := range rhs {
				if a := math.Abs(r); !(a <= change) { // NaN too
					change = a
				}
				r0[i] = r
				u1[i] += r
			}
		} else {
			num, den := 0.0, 0.0
			u1, n := nl.u1[tr.lo:tr.hi], tr.hi-tr.lo
			rhs, r0 := nl.rhs[tr.lo:][:n], nl.r0[tr.lo:][:n]
			for i, r := range rhs {
				if a := math.Abs(r); !(a <= change) {
					change = a
				}
				d := r - r0[i]
				num += r0[i] * d
				den += d * d
				r0[i] = r
			}
			if den > 0 {
				// min(max(·, 0.05), 2) by comparisons (js/wasm calls
				// min and max out of line); NaN is kept as they keep it.
				if omega = -omega * num / den; omega < 0.05 {
					omega = 0.05
				} else if omega > 2 {
					omega = 2
				}
			}
			for i, r := range r0 {
				u1[i] += omega * r
			}
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
	nl.du, nl.du2, nl.du3 = nl.du3, nl.du, nl.du2
	du, u0, u1 := nl.du, nl.u0[:len(nl.du)], nl.u1[:len(nl.du)]
	for i := range du {
		du[i] = u1[i] - u0[i]
	}
	nl.lastDt, nl.lastDt2, nl.lastDt3 = dt, nl.lastDt, nl.lastDt2
	copy(tr.u, nl.u1)
	nl.commit(t0+dt, tr.u)
	return nil
}

// solveLumped is the update of one iteration for linear elements with
// the lumped capacity: it writes r to rhs[lo:hi] from the coefficients of
// the iterate (cm, ct, cc and, where k follows the void ratio, gk),
// solving A' r = b(u) − A(u) u with one pass that assembles the
// tridiagonal A' and the residual, one for the pivots of A' = L U, one
// for the multipliers and the forward substitution and one back; r is
// zero at the held nodes, so their columns drop out. It
// computes what AssembleConstant, FactorizeSum, ThetaRHS and Factor.Solve
// compute on the bands (for gk nil, when A' is symmetric), without their
// passes over the band storage. No allocation.
//
// A' is the derivative of the residual, Newton's matrix, but for the
// secant's own change: the tangent capacity ct h/2 per node, θΔt g on the
// flux, and with gk the change of the flux g (w_a − w_b) with k, whose
// derivative by each node's u is −½ (w_a − w_b) gk/h. That term makes A'
// unsymmetric; it is held within ±θΔt g, so that the off-diagonal stays
// ≤ 0 and every column sums to its capacity (> 0): A' stays an M-matrix,
// its pivots positive, and only the speed of convergence where it is held
// differs from Newton's.
func (nl *nonlinear) solveLumped(theta, dt float64, ds []float64) error {
	tr := nl.tr
	c0, c1 := (1-theta)*dt, theta*dt
	ne := len(nl.spans)
	spans := nl.spans[:ne]
	cm, ct, cc := nl.cm[:ne], nl.ct[:ne], nl.cc[:ne]
	u0, u1 := nl.u0[:ne+1], nl.u1[:ne+1]
	// A' and the residual row by row (lumpedRow), and then their factors
	// and the forward substitution in place; r goes to rhs.
	rows, gk := nl.rows[:ne+1], nl.gk
	if gk != nil {
		gk = gk[:ne]
	}
	// Element e, nodes a = e and b = e+1: its secant capacity cm h/2 times
	// each node's change u⁰ + Δσ − u, and its flux f = g (w_a − w_b) with
	// g = cc/h and w = (1−θ)Δt u⁰ + θΔt u, which leaves a and enters b.
	// The entries of node b carry over to the next element in registers.
	va := u0[0] - u1[0]
	if ds != nil {
		ds = ds[:ne+1]
		va += ds[0]
	}
	wa := c0*u0[0] + c1*u1[0]
	dn, rn := 0.0, 0.0
	for e := range spans {
		sp, row := &spans[e], &rows[e]
		vb := u0[e+1] - u1[e+1]
		if ds != nil {
			vb += ds[e+1]
		}
		wb := c0*u0[e+1] + c1*u1[e+1]
		g := cc[e] * sp.inv
		f := g * (wa - wb)
		ms := cm[e] * sp.half
		row.r = rn + ms*va - f
		rn = ms*vb + f
		a := ct[e]*sp.half + c1*g
		off, sk := c1*g, 0.0
		if gk != nil {
			// Comparisons rather than min and max (see clampK).
			if sk = 0.5 * (wa - wb) * gk[e] * sp.inv; sk > off {
				sk = off
			} else if sk < -off {
				sk = -off
			}
		}
		row.d = dn + a - sk
		dn = a + sk
		row.l = sk - off
		row.u = -sk - off
		va, wa = vb, wb
	}
	rows[ne].d, rows[ne].r = dn, rn
	// A leaky end passes (u − 0)/(γw R) out: θΔt of it on A', the flux of
	// w on the residual. A draining layer's node keeps u = 0: its row is
	// the identity and its update zero.
	if a := tr.leakTop; a > 0 {
		rows[0].d += c1 * a
		rows[0].r -= a * (c0*u0[0] + c1*u1[0])
	}
	if a := tr.leakBottom; a > 0 {
		rows[ne].d += c1 * a
		rows[ne].r -= a * (c0*u0[ne] + c1*u1[ne])
	}
	for _, j := range tr.pinned {
		rows[j].d, rows[j].r = 1, 0
		if j > 0 {
			rows[j-1].l, rows[j-1].u = 0, 0
		}
		if j < ne {
			rows[j].l, rows[j].u = 0, 0
		}
	}
	// A' = L U on the free rows, L y = r, then U x = y. The pivots come
	// first, alone: each waits on the last, so they are taken as ratios of
	// the leading principal minors, P_i = d_i P_{i−1} − l_{i−1} u_{i−1}
	// P_{i−2}, pivot_i = P_i/P_{i−1} (a recurrence of products, its
	// division off the chain), with P rescaled by 2^±500 (exactly) when it
	// leaves [2^−500, 2^500]. The multipliers and the forward substitution,
	// which do not feed the pivots, follow in a second pass; each
	// substitution carries its last value in a register.
	lo, hi := tr.lo, tr.hi
	if lo >= hi {
		return nil
	}
	n := hi - lo // the free rows, from 0
	rr, x := rows[lo:hi], nl.rhs[lo:hi][:n]
	pm2, pm1 := 1.0, rr[0].d
	for i := 1; i < n; i++ {
		p := rr[i].d*pm1 - rr[i-1].l*rr[i-1].u*pm2
		rr[i].d = p / pm1
		pm2, pm1 = pm1, p
		if a := math.Abs(p); a > 0x1p500 {
			pm2, pm1 = pm2*0x1p-500, pm1*0x1p-500
		} else if a < 0x1p-500 {
			pm2, pm1 = pm2*0x1p500, pm1*0x1p500
		}
	}
	inv, y := 0.0, 0.0 // 1/pivot and y of the row before
	for i := range rr {
		row := &rr[i]
		if piv := row.d; !(piv > 0 && piv <= math.MaxFloat64) { // positive and finite
			return &fem.NotDefiniteError{Node: lo + i, Pivot: piv}
		}
		if i > 0 {
			above := &rr[i-1]
			m := above.l * inv
			above.l, above.u = m, above.u*inv
			y = row.r - m*y
		} else {
			y = row.r
		}
		row.r = y
		inv = 1 / row.d
		row.d = inv
	}
	v := rr[n-1].r * rr[n-1].d
	x[n-1] = v
	for i := n - 2; i >= 0; i-- {
		v = rr[i].r*rr[i].d - rr[i].u*v
		x[i] = v
	}
	return nil
}

// commit moves every element to the effective stress of the nodal
// excess u under the total stress loadStress was given (one soil.Move
// over the column, as in coefficients), its slices taken once as in
// coefficients.
func (nl *nonlinear) commit(t float64, u []float64) {
	ne := len(nl.pts)
	nl.meanStress(nl.to, u)
	soil.Move(nl.de, nl.pts, nl.to, nl.curved)
	pts, curved, tos, des := nl.pts, nl.curved[:ne], nl.to[:ne], nl.de[:ne]
	k0, law := nl.k0[:ne], nl.law[:ne]
	for e := range pts {
		to := tos[e]
		if to < 0 && math.IsNaN(nl.negativeAt) && !nl.tr.c.isDug(e) {
			_, z0, z1 := nl.m.Span(e)
			nl.negativeAt, nl.negativeT = (z0+z1)/2, t
		}
		if curved[e] {
			if kExp := law[e].kExp; kExp < 0 { // Ck > 0
				y := kExp * des[e]
				x, ok := soil.ExpSmall(y) // soil.Exp, in line
				if !ok {
					x = math.Exp(y)
				}
				k0[e] = nl.clampK(k0[e] * x) // soil.PermeabilityAfter
			}
			continue
		}
		s, pk := soil.LinearCompress(nl.mv[e], nl.mvu[e], nl.sig[e], to, nl.peak[e])
		nl.strain[e] += s * pts[e].H
		nl.sig[e], nl.peak[e] = to, pk
	}
}

// settlement is the settlement of the column now, m: the sum over the
// elements of what their laws give for the path they followed. The same
// pass leaves each layer's share in nl.layers, which layerNow reads after
// it: one Settlement per element a step.
func (nl *nonlinear) settlement() float64 {
	clear(nl.layers)
	return nl.layerSettlements(nl.layers)
}

// layerSettlements adds each element's settlement so far to its layer's
// entry of dst, and returns their sum, m (added element by element).
func (nl *nonlinear) layerSettlements(dst []float64) float64 {
	ne := len(nl.pts)
	pts, curved, strain, layer := nl.pts, nl.curved[:ne], nl.strain[:ne], nl.m.Layer[:ne]
	s := 0.0
	for e := range pts {
		v := strain[e]
		if curved[e] {
			v = pts[e].Settlement()
		}
		s += v
		dst[layer[e]] += v
	}
	return s
}

// drained follows a copy of every element's state along the fully drained
// path (each breakpoint's total stress against the final pore pressure,
// then the final state) and returns each layer's final settlement, m: the
// denominator of Us.
func (nl *nonlinear) drained(bps []breakpoint, sigInf, uInf []float64, uAt func(dst []float64, t float64) []float64) []float64 {
	cp := &nonlinear{tr: nl.tr, m: nl.m, curved: nl.curved, mv: nl.mv, mvu: nl.mvu, law: nl.law, kLo: nl.kLo, kHi: nl.kHi,
		to: nl.to, de: nl.de, base: nl.base, // scratch, written before it is read
		k0:     append([]float64(nil), nl.k0...),
		pts:    append([]soil.Point(nil), nl.pts...),
		sig:    append([]float64(nil), nl.sig...),
		peak:   append([]float64(nil), nl.peak...),
		strain: make([]float64, len(nl.strain)), negativeAt: math.NaN()}
	stress, ub := make([]float64, nl.m.Nodes()), make([]float64, nl.m.Nodes())
	for _, b := range bps {
		nl.tr.stressAt(stress, b.t, false)
		cp.loadStress(stress)
		cp.commit(b.t, uAt(ub, b.t))
	}
	cp.loadStress(sigInf)
	cp.commit(math.Inf(1), uInf)
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
	out := make([]float64, len(nl.tr.c.p.Layers))
	nl.project(new(nonlinear), sigInf, uInf, out)
	return out
}

// project writes projected's settlements into out, with cp as the copy
// of the elements moved (its slices are reused from one call to the
// next).
func (nl *nonlinear) project(cp *nonlinear, sigInf, uInf, out []float64) {
	*cp = nonlinear{tr: nl.tr, m: nl.m, curved: nl.curved, mv: nl.mv, mvu: nl.mvu, law: nl.law, kLo: nl.kLo, kHi: nl.kHi,
		to: nl.to, de: nl.de, base: nl.base, // scratch, written before it is read
		k0:     append(cp.k0[:0], nl.k0...),
		pts:    append(cp.pts[:0], nl.pts...),
		sig:    append(cp.sig[:0], nl.sig...),
		peak:   append(cp.peak[:0], nl.peak...),
		strain: append(cp.strain[:0], nl.strain...), negativeAt: math.NaN()}
	cp.loadStress(sigInf)
	cp.commit(math.Inf(1), uInf)
	clear(out)
	cp.layerSettlements(out)
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

// warnings reports an iteration that did not converge and, with
// negative set, an effective stress that fell below zero.
func (nl *nonlinear) warnings(warn func(path, msg string), negative bool) {
	if nl.unconverged > 0 {
		warn("stepping.firstStep", fmt.Sprintf("the non-linear iteration did not converge within %d iterations in %d of %d steps (first at %.4g days, a step of %.3g days; largest remaining change %.3g kPa against the tolerance %.3g kPa): results there are approximate; use a smaller stepping.firstStep (e.g. %.3g days) or a stepping.growth nearer 1",
			NonlinearMaxIterations, nl.unconverged, nl.steps, nl.firstBad, nl.badStep, nl.worst, nl.tol, nl.badStep/4))
	}
	if negative && !math.IsNaN(nl.negativeAt) {
		warn("loads", fmt.Sprintf("the effective stress falls below zero at %.3g m near %.4g days: the soil would lose contact (heave); results there are not physical", nl.negativeAt, nl.negativeT))
	}
}
