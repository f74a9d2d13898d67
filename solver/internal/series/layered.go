package series

import (
	"errors"
	"fmt"
	"math"
	"sort"
)

// secondsPerDay converts k in m/s to the time unit of Layered, the day.
const secondsPerDay = 86400

// Reasons NewLayered refuses its input. An *InputError wraps one of these,
// so callers may test with errors.Is.
var (
	ErrNoLayers    = errors.New("series: no layers")
	ErrNotPositive = errors.New("must be finite and > 0")
	ErrUndrained   = errors.New("series: at least one end must be drained")
	ErrTerms       = errors.New("must be ≥ 0 (0 chooses the number of terms)")
	ErrTooMany     = errors.New("series: too many terms")
)

// InputError is one argument of NewLayered that is refused: which one
// (Field, e.g. "layers[2].K" or "gammaW"), the value given and why (Err).
type InputError struct {
	Field string
	Value float64
	Err   error
}

func (e *InputError) Error() string {
	return fmt.Sprintf("series: %s %v (got %g)", e.Field, e.Err, e.Value)
}

// Unwrap returns the reason, so errors.Is(err, ErrNotPositive) works.
func (e *InputError) Unwrap() error { return e.Err }

// Layer is one horizontal soil layer of a Layered column.
type Layer struct {
	Thickness float64 // m
	K         float64 // coefficient of permeability, m/s
	Mv        float64 // coefficient of volume compressibility, 1/kPa
}

// Layered is the eigenfunction solution of Schiffman & Stein (1970) for
// one-dimensional consolidation of a layered column under a uniform initial
// excess pore pressure u0 = 1: in each layer
//
//	mv ∂u/∂t = (k/γw) ∂²u/∂z²,
//
// with u and the flux k ∂u/∂z continuous at each interface, u = 0 at a
// drained end and ∂u/∂z = 0 at an impermeable one. It is
//
//	u(z, t) = Σ aₙ φₙ(z) exp(−βₙ t),   aₙ = ∫ mv φₙ dz / ∫ mv φₙ² dz,
//
// where (k φₙ')'/γw = −βₙ mv φₙ with the same interface and end conditions,
// so that the φₙ are orthogonal with weight mv. The package documentation
// explains how the eigenvalues βₙ are found and how accurate the sums are.
//
// A Layered is immutable once built and safe for concurrent use.
type Layered struct {
	tops    []float64 // depth of the top of each layer, and H last; len L+1
	cv      []float64 // m²/day
	mvRel   []float64 // mv / max mv
	top     bool      // top drained
	bottom  bool      // bottom drained
	height  float64   // H, m
	mvTotal float64   // Σ mvRel h

	omega []float64 // √βₙ, 1/√day
	next  float64   // √β of the first omitted term
	theta []float64 // Prüfer angle at the top of layer i for term n, at [n*L+i]
	amp   []float64 // amplitude of φₙ in layer i, at [n*L+i]
	coef  []float64 // aₙ
	intMv []float64 // ∫ mvRel φₙ dz
	intU  []float64 // ∫ φₙ dz

	// shooting data
	span  []float64 // hᵢ/√cvᵢ
	ratio []float64 // ζᵢ/ζᵢ₋₁ with ζ = √(k mv); ratio[0] unused
}

// Terms chosen by NewLayered when asked to (terms == 0): enough that the
// first omitted term has βt ≥ autoCut at TimeFactor autoTv, and never
// more than maxLayeredTerms.
const (
	autoTv          = 1e-3
	autoCut         = 12
	maxLayeredTerms = 100000
)

// NewLayered solves the eigenvalue problem of a layered column once, for
// later evaluation at any depth and time. layers run from the top down;
// gammaW is the unit weight of water in kN/m³ (9.81 is common practice);
// at least one of topDrained and bottomDrained must hold. The coefficient
// of consolidation of a layer is cv = K·86400/(Mv·γw) in m²/day.
//
// terms is the number of eigenfunctions kept, at most 100000. With
// terms == 0, NewLayered keeps enough for Excess to be accurate to 1e-4 of
// u0 at every t with TimeFactor(t) ≥ 1e-3 (the first omitted term then has
// β·t ≥ 12 at that time). Either way MinTime reports the earliest time the
// series is good for. Each eigenvalue is found by about 60 bisection
// steps, each a sweep through the L layers, so building costs
// O(60·terms·L) time and O(terms·L) storage; the default is typically
// 20–80 terms.
//
// Every refused argument is reported at once, the reasons joined with
// errors.Join: *InputError values (ErrNotPositive, ErrTerms), ErrNoLayers,
// ErrUndrained and ErrTooMany.
func NewLayered(layers []Layer, gammaW float64, topDrained, bottomDrained bool, terms int) (*Layered, error) {
	var errs []error
	if len(layers) == 0 {
		errs = append(errs, ErrNoLayers)
	}
	bad := func(field string, v float64) {
		if !(v > 0) || math.IsInf(v, 1) {
			errs = append(errs, &InputError{Field: field, Value: v, Err: ErrNotPositive})
		}
	}
	for i, l := range layers {
		bad(fmt.Sprintf("layers[%d].Thickness", i), l.Thickness)
		bad(fmt.Sprintf("layers[%d].K", i), l.K)
		bad(fmt.Sprintf("layers[%d].Mv", i), l.Mv)
	}
	bad("gammaW", gammaW)
	if !topDrained && !bottomDrained {
		errs = append(errs, ErrUndrained)
	}
	if terms < 0 {
		errs = append(errs, &InputError{Field: "terms", Value: float64(terms), Err: ErrTerms})
	}
	if terms > maxLayeredTerms {
		errs = append(errs, fmt.Errorf("%w: %d > %d", ErrTooMany, terms, maxLayeredTerms))
	}
	if err := errors.Join(errs...); err != nil {
		return nil, err
	}

	L := len(layers)
	s := &Layered{
		tops:   make([]float64, L+1),
		cv:     make([]float64, L),
		mvRel:  make([]float64, L),
		top:    topDrained,
		bottom: bottomDrained,
		span:   make([]float64, L),
		ratio:  make([]float64, L),
	}
	var mvMax, zetaMax float64
	for _, l := range layers {
		mvMax = max(mvMax, l.Mv)
		zetaMax = max(zetaMax, math.Sqrt(l.K*l.Mv))
	}
	for i, l := range layers {
		s.tops[i+1] = s.tops[i] + l.Thickness
		s.cv[i] = l.K * secondsPerDay / (l.Mv * gammaW)
		s.mvRel[i] = l.Mv / mvMax
		s.mvTotal += s.mvRel[i] * l.Thickness
		s.span[i] = l.Thickness / math.Sqrt(s.cv[i])
		if i > 0 {
			// ζ = √(k mv) ∝ k μ/ω: the flux scale of each layer.
			s.ratio[i] = math.Sqrt(l.K*l.Mv) / math.Sqrt(layers[i-1].K*layers[i-1].Mv)
		}
	}
	s.height = s.tops[L]

	if terms > 0 {
		for n := 0; n < terms; n++ {
			s.omega = append(s.omega, s.eigen(n))
		}
		s.next = s.eigen(terms)
	} else {
		w1 := s.eigen(0)
		tMin := autoTv * math.Pi * math.Pi / (4 * w1 * w1)
		s.omega = append(s.omega, w1)
		for n := 1; ; n++ {
			w := s.eigen(n)
			if w*w*tMin >= autoCut {
				s.next = w
				break
			}
			if n == maxLayeredTerms {
				return nil, fmt.Errorf("%w: more than %d needed for TimeFactor %g", ErrTooMany, maxLayeredTerms, autoTv)
			}
			s.omega = append(s.omega, w)
		}
	}
	s.modes()
	return s, nil
}

// theta0 is the Prüfer angle at z = 0: φ = 0 at a drained top, φ' = 0 at
// an impermeable one.
func (s *Layered) theta0() float64 {
	if s.top {
		return 0
	}
	return math.Pi / 2
}

// target is the Prüfer angle at z = H of the n-th eigenfunction (n from
// 0): it has n zeros inside the column (Sturm oscillation theorem) and
// φ = 0 at a drained bottom, φ' = 0 at an impermeable one.
func (s *Layered) target(n int) float64 {
	if s.bottom {
		return math.Pi * float64(n+1)
	}
	return math.Pi * (float64(n) + 0.5)
}

// shoot sweeps the Prüfer angle θ from the top to the bottom for the
// wavenumber scale ω = √β and returns θ(H). In layer i, φ = A sin θ and
// θ grows by μ h with μ = ω/√cv; at an interface tan θ' = (ζᵢ/ζᵢ₋₁) tan θ
// (continuity of u and of k ∂u/∂z, with kμ ∝ ω ζ), taking θ' on the same
// branch, so θ(H) is continuous and increasing in ω. If theta and amp are
// not nil they receive θ and A at the top of each layer (A = 1 in the
// first).
func (s *Layered) shoot(omega float64, theta, amp []float64) float64 {
	th, a := s.theta0(), 1.0
	for i := range s.span {
		if i > 0 {
			m := math.Floor(th/math.Pi + 0.5)
			d := th - m*math.Pi // in [−π/2, π/2)
			sd, cd := math.Sincos(d)
			c := s.ratio[i]
			a *= math.Hypot(sd, cd/c)
			th = m*math.Pi + math.Atan2(c*sd, cd)
		}
		if theta != nil {
			theta[i], amp[i] = th, a
		}
		th += omega * s.span[i]
	}
	return th
}

// eigen returns ω = √βₙ of the n-th eigenvalue (n from 0) by bisection
// on θ(H; ω) = target(n). Each interface moves θ by less than π/2, so
// ω·Σ hᵢ/√cvᵢ lies within (L−1)π/2 of target − θ₀: that brackets the root.
func (s *Layered) eigen(n int) float64 {
	var S float64
	for _, v := range s.span {
		S += v
	}
	want := s.target(n)
	slack := float64(len(s.span)-1) * math.Pi / 2
	lo := max(0, (want-s.theta0()-slack)/S)
	hi := (want - s.theta0() + slack) / S
	for s.shoot(hi, nil, nil) < want { // rounding guard
		hi *= 1 + 1e-12
	}
	for lo > 0 && s.shoot(lo, nil, nil) > want {
		lo *= 1 - 1e-12
	}
	for range 200 {
		mid := lo + (hi-lo)/2
		if mid <= lo || mid >= hi {
			break
		}
		if s.shoot(mid, nil, nil) < want {
			lo = mid
		} else {
			hi = mid
		}
	}
	return lo + (hi-lo)/2
}

// modes fills the per-layer angles and amplitudes of every kept term and
// the coefficients aₙ from the closed-form integrals, over a layer of
// thickness h with θ₁ = θ₀ + μh,
//
//	∫ sin θ dz  = 2 sin(θ₀ + μh/2) sin(μh/2) / μ,
//	∫ sin² θ dz = h/2 − cos(2θ₀ + μh) sin(μh) / (2μ),
//
// written so that they stay accurate when μh is small.
func (s *Layered) modes() {
	L, N := len(s.cv), len(s.omega)
	s.theta = make([]float64, N*L)
	s.amp = make([]float64, N*L)
	s.coef = make([]float64, N)
	s.intMv = make([]float64, N)
	s.intU = make([]float64, N)
	for n, w := range s.omega {
		th, a := s.theta[n*L:(n+1)*L], s.amp[n*L:(n+1)*L]
		s.shoot(w, th, a)
		var norm, pmv, pu float64
		for i := range L {
			h := s.tops[i+1] - s.tops[i]
			mu := w / math.Sqrt(s.cv[i])
			i1 := 2 * math.Sin(th[i]+mu*h/2) * math.Sin(mu*h/2) / mu
			i2 := h/2 - math.Cos(2*th[i]+mu*h)*math.Sin(mu*h)/(2*mu)
			pu += a[i] * i1
			pmv += s.mvRel[i] * a[i] * i1
			norm += s.mvRel[i] * a[i] * a[i] * i2
		}
		s.coef[n] = pmv / norm
		s.intMv[n] = pmv
		s.intU[n] = pu
	}
}

// clamp moves a depth within 1e-9·H of [0, H] onto it and returns NaN for
// one further out (or NaN).
func (s *Layered) clamp(z float64) float64 {
	tol := 1e-9 * s.height
	switch {
	case z >= 0 && z <= s.height:
		return z
	case z < 0 && z >= -tol:
		return 0
	case z > s.height && z <= s.height+tol:
		return s.height
	}
	return math.NaN()
}

// layer returns the index of the layer holding depth z: the one with
// top ≤ z < bottom, the last one for z = H.
func (s *Layered) layer(z float64) int {
	L := len(s.cv)
	i := sort.Search(L, func(i int) bool { return s.tops[i+1] > z })
	return min(i, L-1)
}

// Excess returns u/u0 at depth z (m, from the top) and time tDays (days).
// It is accurate to 1e-4 for t ≥ MinTime (see the package documentation);
// below MinTime the truncated series is returned all the same. Cost
// O(Terms()) for t near MinTime, fewer terms at later times.
//
// A depth within 1e-9·H outside [0, H] is taken as the nearest end, so
// depths summed from thicknesses in another order are accepted.
//
// Special cases are:
//
//	Excess(z, t) = 0 at a drained end (z = 0 or z = H)
//	Excess(z, 0) = 1 elsewhere (the initial state)
//	Excess(z, t) = NaN for z outside [0, H], t < 0 or either NaN
func (s *Layered) Excess(z, tDays float64) float64 {
	z = s.clamp(z)
	switch {
	case math.IsNaN(z) || math.IsNaN(tDays) || tDays < 0:
		return math.NaN()
	case z == 0 && s.top || z == s.height && s.bottom || math.IsInf(tDays, 1):
		return 0
	case tDays == 0:
		return 1
	}
	i := s.layer(z)
	L := len(s.cv)
	x := z - s.tops[i]
	rc := 1 / math.Sqrt(s.cv[i])
	var sum float64
	for n, w := range s.omega {
		e := math.Exp(-w * w * tDays)
		if e < negligible {
			break
		}
		sum += s.coef[n] * s.amp[n*L+i] * math.Sin(s.theta[n*L+i]+w*rc*x) * e
	}
	return sum
}

// Gradient returns ∂(u/u0)/∂z in 1/m at depth z and time tDays > 0, the
// series differentiated term by term (it converges more slowly than
// Excess: use it well above MinTime). At an interface it returns the
// gradient in the layer below (the last layer at z = H); the flux
// k·Gradient is continuous there. Depths are taken as by Excess. Gradient
// returns NaN for z outside [0, H], t ≤ 0 or NaN arguments.
func (s *Layered) Gradient(z, tDays float64) float64 {
	z = s.clamp(z)
	if math.IsNaN(z) || math.IsNaN(tDays) || !(tDays > 0) {
		return math.NaN()
	}
	i := s.layer(z)
	L := len(s.cv)
	x := z - s.tops[i]
	rc := 1 / math.Sqrt(s.cv[i])
	var sum float64
	for n, w := range s.omega {
		e := math.Exp(-w * w * tDays)
		if e < negligible {
			break
		}
		sum += s.coef[n] * s.amp[n*L+i] * w * rc * math.Cos(s.theta[n*L+i]+w*rc*x) * e
	}
	return sum
}

// Us returns the average degree of consolidation by settlement at tDays,
// 1 − ∫ mv u dz / ∫ mv u0 dz. It converges faster than Excess.
//
// Special cases are:
//
//	Us(0) = 0, Us(+Inf) = 1
//	Us(t) = NaN for t < 0 or NaN
func (s *Layered) Us(tDays float64) float64 {
	return s.average(tDays, s.intMv, s.mvTotal)
}

// Up returns the average degree of consolidation by pore pressure at
// tDays, 1 − ∫ u dz / ∫ u0 dz. Special cases as for Us.
func (s *Layered) Up(tDays float64) float64 {
	return s.average(tDays, s.intU, s.height)
}

func (s *Layered) average(tDays float64, integral []float64, total float64) float64 {
	switch {
	case math.IsNaN(tDays) || tDays < 0:
		return math.NaN()
	case tDays == 0:
		return 0
	case math.IsInf(tDays, 1):
		return 1
	}
	var sum float64
	for n, w := range s.omega {
		e := math.Exp(-w * w * tDays)
		if e < negligible {
			break
		}
		sum += s.coef[n] * integral[n] * e
	}
	return 1 - sum/total
}

// Terms returns the number of eigenfunctions kept.
func (s *Layered) Terms() int { return len(s.omega) }

// Height returns the thickness H of the column, m.
func (s *Layered) Height() float64 { return s.height }

// Eigenvalues returns βₙ, the decay rates of the kept terms in 1/day, in
// increasing order, in a new slice.
func (s *Layered) Eigenvalues() []float64 {
	b := make([]float64, len(s.omega))
	for n, w := range s.omega {
		b[n] = w * w
	}
	return b
}

// TimeFactor returns 4 β₁ t / π², the time factor of the uniform column
// whose slowest term decays as fast as this one's. For one layer it is
// Terzaghi's Tv = cv t / H_dr² (H_dr = H with one drained end, H/2 with
// two).
func (s *Layered) TimeFactor(tDays float64) float64 {
	return 4 * s.omega[0] * s.omega[0] * tDays / (math.Pi * math.Pi)
}

// MinTime returns the smallest time, in days, at which the first omitted
// term has decayed to exp(−12): from then on Excess is accurate to 1e-4
// (verified in the tests; see the package documentation).
func (s *Layered) MinTime() float64 {
	return autoCut / (s.next * s.next)
}
