package solver

import (
	"fmt"
	"math"

	"porelight/solver/fem"
	"porelight/solver/soil"
)

// transient is the consolidation of a column seen by the time loop: the
// θ-stepper of package fem on M u̇ + K u = M σ̇, the nodal total stress
// change of every load stage, and the workspace, so that a step allocates
// nothing.
type transient struct {
	c       *column
	mv      []float64 // per layer, 1/kPa
	k, mass *fem.Band // conductivity (k/γw, m²/(kPa·day)) and mv-mass
	sink    *fem.Band // the drains' radial sink (nil without drains)
	kSink   *fem.Band // k + sink, what the stepper steps with drains
	stepper *fem.Stepper
	held    []int
	lo, hi  int // free unknowns
	// leakTop and leakBottom are the leaky ends' 1/(γw R), m/(kPa·day)
	// (0: not leaky), already in k; pinned lists the nodes draining
	// layers hold at zero excess (see outlets.go).
	leakTop, leakBottom float64
	pinned              []int
	// zoneTarget is the excess held at the nodes from the top to
	// c.zoneNode once the stage that holds them is complete, kPa.
	zoneTarget []float64
	u          []float64
	tmp        []float64
	next       []float64    // held values at the end of a step
	sigma      []float64    // total stress change at the nodes, kPa
	shapes     [][]float64  // per load stage: Q·factor at the nodes
	wMass      []float64    // ∫ mv Nᵢ dz
	wLength    []float64    // ∫ Nᵢ dz
	set        Stepping     // resolved
	sub        *submergence // nil without fill stages
	settled    float64      // settlement of the top at the last record, m
	sigmaHs    float64      // the submerged fill thickness sigma holds, m
	progress   func(float64) bool
}

// newTransient assembles the conductivity matrix of c and sizes the
// workspace; setMv must be called before stepping.
func newTransient(c *column, opt *Options) *transient {
	m, p := c.m, c.p
	n := m.Nodes()
	tr := &transient{c: c, set: ResolveStepping(p)}
	if opt != nil {
		tr.progress = opt.Progress
	}
	tr.k = fem.NewBand(n, m.Order)
	tr.mass = fem.NewBand(n, m.Order)
	gw := c.gw
	if !c.radialOnly {
		m.Assemble(tr.k, func(e int, _ float64) float64 { return p.Layers[m.Layer[e]].K * soil.SecondsPerDay / gw }, false)
	}
	tr.wLength = make([]float64, n)
	m.Load(tr.wLength, func(float64) float64 { return 1 })

	if !c.radialOnly {
		// An excavation holds every node from the top to its floor.
		for j := range c.zoneNode + 1 {
			if j > 0 || p.Top.holds() || c.zoneStage >= 0 {
				tr.held = append(tr.held, j)
			}
		}
		if p.Bottom.holds() {
			tr.held = append(tr.held, n-1)
		}
	}
	tr.lo, tr.hi = fem.HeldRuns(n, tr.held)
	tr.setLeaks()
	tr.u = make([]float64, n)
	tr.tmp = make([]float64, n)
	tr.next = make([]float64, len(tr.held))
	tr.sigma = make([]float64, n)
	tr.shapes = make([][]float64, len(p.Loads))
	factors := c.stageFactors()
	for i := range p.Loads {
		f := make([]float64, n)
		q := StagePressure(p, i)
		for j, v := range factors[i] {
			f[j] = q * v
		}
		tr.shapes[i] = f
	}
	tr.sub = newSubmergence(p, gw, factors)
	return tr
}

// setMv assembles the capacity matrix ∫ mv Nᵢ Nⱼ dz for mv per layer and
// makes the stepper.
//
// Linear elements lump the capacity matrix by rows. The consistent matrix
// lets the pressure next to a drained end dip below its final value just
// after an instantaneous load when the step is small against h²/cv (the
// discrete maximum principle fails); the dip raises σ' past its final
// value and, on the e–log σ' curve, leaves irreversible virgin
// compression. With a diagonal capacity matrix, M + θΔt·K is an M-matrix
// for linear elements and the pressure stays between its bounds under
// backward Euler steps; the accuracy stays O(h²). Quadratic elements keep
// the consistent matrix, which their O(h³) accuracy needs.
func (tr *transient) setMv(mv []float64) {
	m := tr.c.m
	tr.mv = mv
	clear(tr.mass.AB)
	m.Assemble(tr.mass, func(e int, _ float64) float64 {
		if tr.c.isDug(e) {
			return 0 // taken out by the excavation
		}
		return mv[m.Layer[e]]
	}, true)
	ones := make([]float64, m.Nodes())
	for i := range ones {
		ones[i] = 1
	}
	tr.wMass = make([]float64, m.Nodes())
	tr.mass.MulVec(tr.wMass, ones)
	lumped := m.Order == 1
	if lumped {
		tr.mass.Lump()
	}
	k := tr.k
	if tr.c.drains != nil {
		// The unit cell's sink mv·8ch/(De²μ)·ū joins the conductivity: the
		// same band, so a step costs what it did.
		tr.sink = tr.c.assembleSink(mv, lumped)
		tr.kSink = fem.NewBand(tr.k.N, tr.k.KD)
		for i := range tr.kSink.AB {
			tr.kSink.AB[i] = tr.k.AB[i] + tr.sink.AB[i]
		}
		k = tr.kSink
	}
	tr.isolatePins(tr.mass, k)
	tr.stepper = fem.NewStepper(tr.mass, k, tr.held, lumped)
}

// layerSettlement returns each layer's settlement ∫ mv (σ − u) dz, m, for
// nodal total stress and pore pressure changes sigma and u.
func (tr *transient) layerSettlement(sigma, u []float64) []float64 {
	m := tr.c.m
	d := make([]float64, len(u))
	for i := range d {
		d[i] = sigma[i] - u[i]
	}
	out := make([]float64, len(tr.mv))
	for e := range m.Elements() {
		if tr.c.isDug(e) {
			continue
		}
		l := m.Layer[e]
		out[l] += tr.mv[l] * m.Integrate(d, e)
	}
	return out
}

// boundary returns the prescribed pore pressure change at a drained end.
// With left set it is the limit from the left at a step of the history.
func (tr *transient) boundary(top bool, t float64, left bool) float64 {
	if top {
		return historyAt(tr.c.p.Top.Excess, t, left)
	}
	return historyAt(tr.c.p.Bottom.Excess, t, left)
}

// heldValues writes the prescribed values at time t of the held nodes, in
// the order of tr.held, to dst (limits from the left with left set).
func (tr *transient) heldValues(dst []float64, t float64, left bool) {
	c := tr.c
	for i, j := range tr.held {
		if c.zoneStage >= 0 && j <= c.zoneNode {
			dst[i] = tr.zoneTarget[j] * c.p.Loads[c.zoneStage].fraction(t, left)
			continue
		}
		dst[i] = tr.boundary(j == 0, t, left)
	}
}

// setHeld writes the prescribed values at time t into the held nodes of u.
func (tr *transient) setHeld(u []float64, t float64, left bool) {
	tr.heldValues(tr.next, t, left)
	for i, j := range tr.held {
		u[j] = tr.next[i]
	}
}

// stressAt writes the total stress change at time t to dst: every ramp at
// its fraction, instantaneous stages once started (once past, with left
// set), less the fill submerged at the settlement of the last record, and
// the initial excess.
func (tr *transient) stressAt(dst []float64, t float64, left bool) {
	tr.stressWith(dst, t, left, tr.settled)
}

// stressWith is stressAt with the top settled by s.
func (tr *transient) stressWith(dst []float64, t float64, left bool, s float64) {
	p := tr.c.p
	clear(dst)
	for i, l := range p.Loads {
		if f := l.fraction(t, left); f != 0 {
			for j, v := range tr.shapes[i] {
				dst[j] += f * v
			}
		}
	}
	if tr.sub != nil {
		tr.sub.apply(dst, p.Loads, t, left, s)
		if len(dst) > 0 && &dst[0] == &tr.sigma[0] {
			tr.sigmaHs = tr.sub.submerged(p.Loads, t, left, s)
		}
	}
	if len(p.InitialExcess) > 0 {
		for j, z := range tr.c.m.Z {
			dst[j] += profileAt(p.InitialExcess, z, 0)
		}
	}
}

// step advances u from t0 to t0+dt with the θ-method (fem.Stepper.Step).
// sigma holds σ⁰ on entry and σ¹ on return. No allocation once the factor
// for (θ, Δt) is cached.
func (tr *transient) step(theta, t0, dt float64) error {
	ds := tr.stressStep(t0, dt)
	tr.heldValues(tr.next, t0+dt, true)
	if out := tr.outlet(); out != nil {
		ds = tr.shiftToOutlet(out, ds, t0, t0+dt)
	}
	tr.zeroPins(ds)
	if err := tr.stepper.Step(tr.u, ds, tr.next, theta, dt); err != nil {
		return tr.c.numerical(err, fmt.Sprintf("the consolidation step from %.4g to %.4g days", t0, t0+dt))
	}
	if out := tr.outlet(); out != nil {
		ud1 := historyAt(out, t0+dt, true)
		for i := range tr.u {
			tr.u[i] += ud1
		}
	}
	return nil
}

// stressStep moves sigma from σ⁰ to σ¹ over the step from t0 to t0+dt and
// returns the change σ¹ − σ⁰ at the nodes (in tr.tmp), or nil when no ramp
// acts. Changes at t0+dt that are instantaneous belong to jump, not to the
// step.
func (tr *transient) stressStep(t0, dt float64) []float64 {
	if !tr.ramping(t0, t0+dt) {
		return nil
	}
	copy(tr.tmp, tr.sigma)
	tr.stressAt(tr.sigma, t0+dt, true)
	for i := range tr.tmp {
		tr.tmp[i] = tr.sigma[i] - tr.tmp[i]
	}
	return tr.tmp
}

// jump applies the instantaneous changes at time t: the undrained response
// to every instantaneous load stage starting at t (the excess pressure rises
// by the stress change at every free node), the initial excess at t = 0,
// and the boundary values from t on.
func (tr *transient) jump(t float64) {
	p := tr.c.p
	for i, l := range p.Loads {
		if l.Ramp == 0 && l.Start == t {
			for j := tr.lo; j < tr.hi; j++ {
				tr.u[j] += tr.shapes[i][j]
			}
		}
	}
	if t == 0 && len(p.InitialExcess) > 0 {
		for j := tr.lo; j < tr.hi; j++ {
			tr.u[j] += profileAt(p.InitialExcess, tr.c.m.Z[j], 0)
		}
	}
	tr.zeroPins(tr.u)
	tr.stressAt(tr.sigma, t, false)
	tr.setHeld(tr.u, t, false)
}

// final returns the pore pressure change when everything has drained: the
// steady solution of K u = 0 with the final boundary values, or, with both
// ends undrained, the undrained response (nothing drains).
func (tr *transient) final() (sigma, u []float64, err error) {
	n := len(tr.u)
	sigma = make([]float64, n)
	tr.stressAt(sigma, math.Inf(1), false)
	u = make([]float64, n)
	if len(tr.held) == 0 && len(tr.pinned) == 0 && tr.leakTop == 0 && tr.leakBottom == 0 {
		if tr.c.drains == nil {
			copy(u, sigma)
		}
		// With drains everything drains to the drains' final outlet
		// pressure (Validate allows a history only where that is the
		// pressure held at every drained end too).
		ud := historyAt(tr.outlet(), math.Inf(1), false)
		for i := range u {
			u[i] += ud
		}
		return sigma, u, nil
	}
	tr.setHeld(u, math.Inf(1), false)
	if err := tr.drainedWith(u, "the final drained state"); err != nil {
		return nil, nil, err
	}
	return sigma, u, nil
}

// zoneDrained is the drained pore pressure change the top zone's held
// values alone give (every other held value zero), nil without a zone:
// the drained state at time t is uInf + (f(t) − 1)·zoneDrained with f the
// zone stage's fraction, since the zone's values follow its stage while
// the ends hold their final values along the drained path.
func (tr *transient) zoneDrained() ([]float64, error) {
	c := tr.c
	if c.zoneStage < 0 {
		return nil, nil
	}
	u := make([]float64, len(tr.u))
	copy(u, tr.zoneTarget)
	return u, tr.drainedWith(u, "the drained state of the excavation or lowering")
}

// drainedWith solves K u = 0 for the free nodes of u, whose held nodes
// hold their values on entry.
func (tr *transient) drainedWith(u []float64, what string) error {
	n := len(u)
	rhs := make([]float64, n)
	copy(rhs, u)
	clear(rhs[tr.lo:tr.hi])
	k := tr.k
	if len(tr.pinned) > 0 {
		// The draining layers' nodes stay at zero excess: identity rows.
		k = &fem.Band{N: tr.k.N, KD: tr.k.KD, AB: append([]float64(nil), tr.k.AB...)}
		for _, j := range tr.pinned {
			k.Isolate(j, 1)
		}
	}
	fem.MoveHeld(rhs, k, u, tr.held)
	var f fem.Factor
	if err := fem.Factorize(&f, k, tr.lo, tr.hi); err != nil {
		return tr.c.numerical(err, what)
	}
	f.Solve(rhs)
	copy(u[tr.lo:tr.hi], rhs[tr.lo:tr.hi])
	return nil
}

// startText describes the damped start for the result.
func (tr *transient) startText() string {
	theta, damped := tr.set.Theta, tr.set.DampedSteps
	scheme := fmt.Sprintf("θ-method with θ = %g", theta)
	if theta == 0.5 {
		scheme = "Crank–Nicolson (θ = 0.5)"
	} else if theta == 1 {
		scheme = "backward Euler (θ = 1)"
	}
	if damped == 0 || theta == 1 {
		return scheme + " throughout"
	}
	return fmt.Sprintf("%d backward Euler steps after each instantaneous change, then %s", damped, scheme)
}

// ramping reports whether a ramped load stage changes during (t0, t1),
// or the submerged thickness of fill has changed since sigma was set.
func (tr *transient) ramping(t0, t1 float64) bool {
	if tr.sub != nil && tr.sub.submerged(tr.c.p.Loads, t1, true, tr.settled) != tr.sigmaHs {
		return true
	}
	for _, l := range tr.c.p.Loads {
		if l.Ramp > 0 && l.Start < t1 && l.Start+l.Ramp > t0 {
			return true
		}
	}
	return false
}

func dot(a, b []float64) float64 {
	s := 0.0
	for i := range a {
		s += a[i] * b[i]
	}
	return s
}

// estimateSteps is the number of time steps a solve of p takes, to within
// a few: between restarts the steps grow geometrically from the first one,
// and every output time may cut one more.
func estimateSteps(p *Project) int {
	s := ResolveStepping(p)
	first, growth := s.FirstStep, s.Growth
	bps := breakpoints(p, s.EndTime)
	n, last := 0.0, 0.0
	for _, b := range bps {
		if b.kind&(bpRestart|bpJump) == 0 && b.t != bps[len(bps)-1].t {
			n++
			continue
		}
		span := b.t - last
		if span > 0 {
			if growth > 1 {
				n += math.Ceil(math.Log1p(span*(growth-1)/first) / math.Log(growth))
			} else {
				n += math.Ceil(span / first)
			}
		}
		last = b.t
		if n > math.MaxInt32 {
			return math.MaxInt32
		}
	}
	return int(n)
}
