package solver

import (
	"fmt"
	"math"
)

// Time stepping defaults.
const (
	defaultTheta       = 0.5
	defaultDampedSteps = 4
	defaultFirstStep   = 1.0 / 1440 // one minute, in days
	defaultGrowth      = 1.1
	defaultSettleTime  = 36525 // days simulated after the last breakpoint: 100 years
	factorCacheFloats  = 4 << 20
)

// stepping resolves the time stepping settings of p.
func stepping(p *Project) (theta float64, damped int, first, growth float64) {
	s := p.Stepping
	theta, damped, first, growth = s.Theta, s.DampedSteps, s.FirstStep, s.Growth
	if theta == 0 {
		theta = defaultTheta
	}
	switch {
	case damped == 0:
		damped = defaultDampedSteps
	case damped < 0:
		damped = 0
	}
	if first == 0 {
		first = defaultFirstStep
	}
	if growth == 0 {
		growth = defaultGrowth
	}
	return
}

// endTime is the last time simulated: Stepping.EndTime when set, else 100
// years after the last breakpoint or the last output time if later.
func endTime(p *Project) float64 {
	if p.Stepping.EndTime > 0 {
		return p.Stepping.EndTime
	}
	last := 0.0
	for _, l := range p.Loads {
		last = math.Max(last, l.Start+l.Ramp)
	}
	for _, b := range []Boundary{p.Top, p.Bottom} {
		for _, tv := range b.Excess {
			last = math.Max(last, tv.T)
		}
	}
	end := last + defaultSettleTime
	if n := len(p.Times); n > 0 {
		end = math.Max(end, p.Times[n-1])
	}
	return end
}

// hasConsolidation reports whether p changes anything in time.
func hasConsolidation(p *Project) bool {
	return len(p.Loads) > 0 || len(p.InitialExcess) > 0 ||
		(p.Top.Drained && len(p.Top.Excess) > 0) || (p.Bottom.Drained && len(p.Bottom.Excess) > 0)
}

type stepKey struct{ theta, dt float64 }

// transient holds the matrices and the workspace of one consolidation
// run, so that the time loop allocates nothing.
type transient struct {
	c        *column
	mv       []float64 // per layer, 1/kPa
	k, mass  *band     // conductivity (k/γw, m²/(kPa·day)) and mv-mass
	lo, hi   int       // free unknowns
	held     []int
	cache    map[stepKey]*factor
	cached   int // floats held by the cache
	factors  int
	u, rhs   []float64
	tmp      []float64
	sigma    []float64   // total stress change at the nodes, kPa
	shapes   [][]float64 // per load stage: Q·factor at the nodes
	wMass    []float64   // ∫ mv Nᵢ dz
	wLength  []float64   // ∫ Nᵢ dz
	lumped   bool        // mass is diagonal
	theta    float64
	damped   int
	first    float64
	growth   float64
	progress func(float64) bool
}

// newTransient assembles the conductivity matrix of c and sizes the
// workspace; setMv must be called before stepping.
func newTransient(c *column, opt *Options) *transient {
	m, p := c.m, c.p
	n := m.nodes()
	tr := &transient{c: c, cache: map[stepKey]*factor{}}
	tr.theta, tr.damped, tr.first, tr.growth = stepping(p)
	if opt != nil {
		tr.progress = opt.Progress
	}
	tr.k = newBand(n, m.order)
	tr.mass = newBand(n, m.order)
	gw := c.gw
	m.assemble(tr.k, func(e int, _ float64) float64 { return p.Layers[m.layer[e]].K * secondsPerDay / gw }, false)
	tr.wLength = make([]float64, n)
	m.load(tr.wLength, func(float64) float64 { return 1 })

	tr.lo, tr.hi = 0, n
	if p.Top.Drained {
		tr.lo = 1
		tr.held = append(tr.held, 0)
	}
	if p.Bottom.Drained {
		tr.hi = n - 1
		tr.held = append(tr.held, n-1)
	}
	tr.u = make([]float64, n)
	tr.rhs = make([]float64, n)
	tr.tmp = make([]float64, n)
	tr.sigma = make([]float64, n)
	tr.shapes = make([][]float64, len(p.Loads))
	for i, l := range p.Loads {
		f := make([]float64, n)
		for j, z := range m.z {
			f[j] = l.Q * profileAt(l.Profile, z, 1)
		}
		tr.shapes[i] = f
	}
	return tr
}

// setMv assembles the mass matrix ∫ mv Nᵢ Nⱼ dz for mv per layer.
func (tr *transient) setMv(mv []float64) {
	m := tr.c.m
	tr.mv = mv
	clear(tr.mass.ab)
	m.assemble(tr.mass, func(e int, _ float64) float64 { return mv[m.layer[e]] }, true)
	ones := make([]float64, m.nodes())
	for i := range ones {
		ones[i] = 1
	}
	tr.wMass = make([]float64, m.nodes())
	tr.mass.mulVec(tr.wMass, ones)
	// Linear elements lump the capacity matrix by rows. The consistent
	// matrix lets the
	// pressure next to a drained end dip below its final value just after
	// an instantaneous load when the step is small against h²/cv (the
	// discrete maximum principle fails); the dip raises σ' past its final
	// value and, on the e–log σ' curve, leaves irreversible virgin
	// compression. With a diagonal capacity matrix, M + θΔt·K is an
	// M-matrix for linear elements and the pressure stays between its
	// bounds under backward Euler steps; the accuracy stays O(h²).
	// Quadratic elements keep the consistent matrix, which their O(h³)
	// accuracy needs.
	tr.lumped = m.order == 1
	if tr.lumped {
		clear(tr.mass.ab)
		for i, w := range tr.wMass {
			tr.mass.ab[i*(tr.mass.kd+1)] = w
		}
	}
	clear(tr.cache)
	tr.cached = 0
}

// layerSettlement returns each layer's settlement ∫ mv (σ − u) dz, m, for
// nodal total stress and pore pressure changes sigma and u.
func (tr *transient) layerSettlement(sigma, u []float64) []float64 {
	m := tr.c.m
	out := make([]float64, len(tr.mv))
	np := m.order + 1
	for e := range m.elements() {
		n0, z0, z1 := m.span(e)
		jac := (z1 - z0) / 2
		mv := tr.mv[m.layer[e]]
		for q := range m.gx {
			v := 0.0
			for a := range np {
				v += m.shape[q*np+a] * (sigma[n0+a] - u[n0+a])
			}
			out[m.layer[e]] += mv * v * m.gw[q] * jac
		}
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

// setHeld writes the prescribed values at time t into the held nodes of u
// (limits from the left with left set).
func (tr *transient) setHeld(u []float64, t float64, left bool) {
	n := len(u)
	if tr.c.p.Top.Drained {
		u[0] = tr.boundary(true, t, left)
	}
	if tr.c.p.Bottom.Drained {
		u[n-1] = tr.boundary(false, t, left)
	}
}

// stressAt writes the total stress change at time t to dst: every ramp at
// its fraction, instantaneous stages once started (once past, with left
// set), and the initial excess.
func (tr *transient) stressAt(dst []float64, t float64, left bool) {
	p := tr.c.p
	clear(dst)
	for i, l := range p.Loads {
		if f := l.fraction(t, left); f != 0 {
			for j, v := range tr.shapes[i] {
				dst[j] += f * v
			}
		}
	}
	if len(p.InitialExcess) > 0 {
		for j, z := range tr.c.m.z {
			dst[j] += profileAt(p.InitialExcess, z, 0)
		}
	}
}

// factorFor returns the factorisation of mass + θΔt·k on the free block,
// computing it once per distinct (θ, Δt).
func (tr *transient) factorFor(theta, dt float64) (*factor, error) {
	key := stepKey{theta, dt}
	if f, ok := tr.cache[key]; ok {
		return f, nil
	}
	f := new(factor)
	if err := factorizeSum(f, tr.mass, tr.k, theta*dt, tr.lo, tr.hi); err != nil {
		return nil, err
	}
	tr.factors++
	size := len(f.d) + len(f.e) + len(f.ab) + len(f.s)
	if tr.cached+size > factorCacheFloats {
		clear(tr.cache)
		tr.cached = 0
	}
	tr.cache[key] = f
	tr.cached += size
	return f, nil
}

// step advances u from t0 to t1 = t0+dt with the θ-method:
//
//	(M + θΔt K) u¹ = (M − (1−θ)Δt K) u⁰ + M (σ¹ − σ⁰)
//
// with u¹ held at the drained ends. sigma holds σ⁰ on entry and σ¹ on
// return. No allocation once the factor for (θ, Δt) is cached.
func (tr *transient) step(theta, t0, dt float64) error {
	f, err := tr.factorFor(theta, dt)
	if err != nil {
		return err
	}
	u, rhs, tmp, sig := tr.u, tr.rhs, tr.tmp, tr.sigma
	// tmp = σ¹ − σ⁰, keeping σ¹ in sigma. Changes at t1 that are
	// instantaneous belong to jump, not to the step.
	ds := []float64(nil)
	if tr.ramping(t0, t0+dt) {
		copy(tmp, sig)
		tr.stressAt(sig, t0+dt, true)
		for i := range tmp {
			tmp[i] = sig[i] - tmp[i]
		}
		ds = tmp
	}
	c := (1 - theta) * dt
	if tr.mass.kd == 1 && tr.lumped {
		thetaRHS(rhs, u, ds, tr.mass.ab, tr.k.ab, c)
	} else {
		bandThetaRHS(rhs, u, ds, tr.mass, tr.k, c)
	}
	tr.setHeld(u, t0+dt, true)
	moveHeld(rhs, u, tr.held, tr.k.kd, func(i, j int) float64 {
		return tr.mass.at(i, j) + theta*dt*tr.k.at(i, j)
	})
	f.solve(rhs)
	copy(u[tr.lo:tr.hi], rhs[tr.lo:tr.hi])
	return nil
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
			tr.u[j] += profileAt(p.InitialExcess, tr.c.m.z[j], 0)
		}
	}
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
	if len(tr.held) == 0 {
		copy(u, sigma)
		return sigma, u, nil
	}
	tr.setHeld(u, math.Inf(1), false)
	rhs := make([]float64, n)
	copy(rhs, u)
	clear(rhs[tr.lo:tr.hi])
	dirichletRHS(rhs, tr.k, u, tr.held)
	var f factor
	if err := factorize(&f, tr.k, tr.lo, tr.hi); err != nil {
		return nil, nil, err
	}
	f.solve(rhs)
	copy(u[tr.lo:tr.hi], rhs[tr.lo:tr.hi])
	return sigma, u, nil
}

func dot(a, b []float64) float64 {
	s := 0.0
	for i := range a {
		s += a[i] * b[i]
	}
	return s
}

// startText describes the damped start for the result.
func (tr *transient) startText() string {
	scheme := fmt.Sprintf("θ-method with θ = %g", tr.theta)
	if tr.theta == 0.5 {
		scheme = "Crank–Nicolson (θ = 0.5)"
	} else if tr.theta == 1 {
		scheme = "backward Euler (θ = 1)"
	}
	if tr.damped == 0 || tr.theta == 1 {
		return scheme + " throughout"
	}
	return fmt.Sprintf("%d backward Euler steps after each instantaneous change, then %s", tr.damped, scheme)
}

// ramping reports whether a ramped load stage changes during (t0, t1).
func (tr *transient) ramping(t0, t1 float64) bool {
	for _, l := range tr.c.p.Loads {
		if l.Ramp > 0 && l.Start < t1 && l.Start+l.Ramp > t0 {
			return true
		}
	}
	return false
}

// thetaRHS sets dst = D (u + ds) − c·K u for a diagonal D (the first
// column of the band storage d) and a tridiagonal K (band storage k, kd =
// 1), in one pass. ds may be nil (no stress change).
func thetaRHS(dst, u, ds, d, k []float64, c float64) {
	n := len(u)
	if n == 0 {
		return
	}
	// Row i of K·u is k[2(i-1)+1]·u[i-1] + k[2i]·u[i] + k[2i+1]·u[i+1].
	prev := 0.0 // k[i-1][i]·u[i-1]
	for i := range n {
		ku := prev + k[2*i]*u[i]
		if i+1 < n {
			ku += k[2*i+1] * u[i+1]
			prev = k[2*i+1] * u[i]
		}
		v := u[i]
		if ds != nil {
			v += ds[i]
		}
		dst[i] = d[2*i]*v - c*ku
	}
}

// estimateSteps is the number of time steps a solve of p takes, to within
// a few: between restarts the steps grow geometrically from the first one,
// and every output time may cut one more.
func estimateSteps(p *Project) int {
	_, _, first, growth := stepping(p)
	bps := breakpoints(p, endTime(p))
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

// bandThetaRHS sets dst = M (u + ds) − c·K u for symmetric band matrices M
// and K of the same shape, in one pass over their storage. ds may be nil.
func bandThetaRHS(dst, u, ds []float64, m, k *band, c float64) {
	n, ld := m.n, m.kd+1
	clear(dst[:n])
	for i := range n {
		mi, ki := m.ab[i*ld:i*ld+ld], k.ab[i*ld:i*ld+ld]
		vi := u[i]
		if ds != nil {
			vi += ds[i]
		}
		acc := mi[0]*vi - c*ki[0]*u[i]
		for j := 1; j < ld && i+j < n; j++ {
			vj := u[i+j]
			if ds != nil {
				vj += ds[i+j]
			}
			acc += mi[j]*vj - c*ki[j]*u[i+j]
			dst[i+j] += mi[j]*vi - c*ki[j]*u[i]
		}
		dst[i] += acc
	}
}
