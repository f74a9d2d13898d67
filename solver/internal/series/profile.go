package series

import (
	"math"
	"sort"

	"gonum.org/v1/gonum/integrate/quad"
)

// Profile is the solution of one drainage path (drained at Z = 0,
// impermeable at Z = 1) for an arbitrary initial excess pore pressure
// u0(Z), as the Fourier series of Terzaghi (1943)
//
//	u(Z, Tv) = Σ Aₘ sin(M Z) exp(−M² Tv),   Aₘ = 2 ∫₀¹ u0(Z) sin(M Z) dZ,
//
// with M = π(2m+1)/2, truncated after a fixed number of terms. Build it once
// with NewProfile and evaluate it as often as needed; ProfileExcess and
// ProfileU are one-off conveniences.
type Profile struct {
	u0   func(Z float64) float64
	coef []float64 // Aₘ
	area float64   // ∫₀¹ u0 dZ
}

// profileCut is M²Tv at the first omitted term when a Profile is sized for a
// time factor: exp(−40) ≈ 4e-18, so the truncation error is below 1e-16 of
// max |u0|.
const profileCut = 40

// glPoints is the number of Gauss–Legendre points per quadrature panel.
const glPoints = 10

// ProfileTerms returns the number of terms a Profile needs to be exact to
// rounding (truncation error below 1e-16·max|u0|) for every time factor
// ≥ Tv: the smallest N with M_N² Tv ≥ 40. It is about 2/√Tv.
func ProfileTerms(Tv float64) int {
	if !(Tv > 0) {
		panic("series: ProfileTerms needs Tv > 0")
	}
	n := int(math.Ceil(math.Sqrt(profileCut/Tv)/math.Pi - 0.5))
	return max(n, 1)
}

// NewProfile computes the first terms Fourier coefficients of u0 on one
// drainage path by composite Gauss–Legendre quadrature: 10 points per
// panel and panels no wider than 2/M of the highest term (at least 16), so
// that sin(M Z) is integrated to rounding. Optional breaks (in (0, 1)) are
// added as panel edges: put every kink or jump of u0 there, otherwise the
// coefficients of a kinked u0 are accurate only to about the square of the
// panel width, and of a discontinuous one to about the panel width.
// u0 is called about 16·terms times and each call costs O(terms), so
// the whole costs O(terms²).
//
// NewProfile panics if terms < 1, u0 is nil or a break lies outside
// (0, 1).
func NewProfile(u0 func(Z float64) float64, terms int, breaks ...float64) *Profile {
	if terms < 1 {
		panic("series: NewProfile needs terms ≥ 1")
	}
	if u0 == nil {
		panic("series: NewProfile needs a profile u0")
	}
	edges := append([]float64{0, 1}, breaks...)
	for _, b := range breaks {
		if !(b > 0 && b < 1) {
			panic("series: NewProfile break outside (0, 1)")
		}
	}
	sort.Float64s(edges)

	// Quadrature nodes and weights over [0, 1].
	panels := max(16, int(math.Ceil(eigen(terms-1)/2)))
	var xs, ws []float64
	x := make([]float64, glPoints)
	w := make([]float64, glPoints)
	for i := 0; i+1 < len(edges); i++ {
		a, b := edges[i], edges[i+1]
		if b == a {
			continue
		}
		np := max(1, int(math.Ceil((b-a)*float64(panels))))
		for j := 0; j < np; j++ {
			lo := a + (b-a)*float64(j)/float64(np)
			hi := a + (b-a)*float64(j+1)/float64(np)
			quad.Legendre{}.FixedLocations(x, w, lo, hi)
			xs = append(xs, x...)
			ws = append(ws, w...)
		}
	}

	p := &Profile{u0: u0, coef: make([]float64, terms)}
	for j, z := range xs {
		f := u0(z) * ws[j]
		p.area += f
		// sin(M Z) for successive M by rotation through πZ, reseeded
		// every 32 terms to keep the rounding error near 1e-15.
		sr, cr := math.Sincos(math.Pi * z)
		var s, c float64
		for m := range terms {
			if m%32 == 0 {
				s, c = math.Sincos(eigen(m) * z)
			} else {
				s, c = s*cr+c*sr, c*cr-s*sr
			}
			p.coef[m] += 2 * f * s
		}
	}
	return p
}

// Terms returns the number of Fourier terms kept.
func (p *Profile) Terms() int { return len(p.coef) }

// MinTv returns the smallest time factor for which the truncation error
// of Excess and U is below 1e-16·max|u0|: 40/M_N², with M_N the first
// omitted eigenvalue. Below it the truncated series is still returned.
func (p *Profile) MinTv() float64 {
	M := eigen(len(p.coef))
	return profileCut / (M * M)
}

// Excess returns u(Z, Tv) in the units of u0.
//
// Special cases are:
//
//	Excess(0, Tv ≥ 0) = 0 (the drained face)
//	Excess(Z > 0, 0) = u0(Z)
//	Excess(Z, Tv) = NaN for Z outside [0, 1], Tv < 0 or either NaN
func (p *Profile) Excess(Z, Tv float64) float64 {
	switch {
	case math.IsNaN(Z) || math.IsNaN(Tv) || Z < 0 || Z > 1 || Tv < 0:
		return math.NaN()
	case Z == 0 || math.IsInf(Tv, 1):
		return 0
	case Tv == 0:
		return p.u0(Z)
	}
	var sum float64
	for m, a := range p.coef {
		M := eigen(m)
		e := math.Exp(-M * M * Tv)
		sum += a * math.Sin(M*Z) * e
		if e < negligible {
			break
		}
	}
	return sum
}

// U returns the average degree of consolidation 1 − ∫u dZ / ∫u0 dZ,
// with ∫₀¹ sin(M Z) dZ = 1/M.
//
// Special cases are:
//
//	U(0) = 0
//	U(Tv) = NaN for Tv < 0, NaN, or ∫u0 = 0
func (p *Profile) U(Tv float64) float64 {
	switch {
	case math.IsNaN(Tv) || Tv < 0 || p.area == 0:
		return math.NaN()
	case Tv == 0:
		return 0
	case math.IsInf(Tv, 1):
		return 1
	}
	var sum float64
	for m, a := range p.coef {
		M := eigen(m)
		e := math.Exp(-M * M * Tv)
		sum += a / M * e
		if e < negligible {
			break
		}
	}
	return 1 - sum/p.area
}

// ProfileExcess returns u at Z and Tv (in the units of u0) for the initial
// excess pore pressure u0(Z) on one drainage path drained at Z = 0 and
// impermeable at Z = 1: NewProfile(u0, ProfileTerms(Tv)).Excess(Z, Tv),
// exact to about 1e-13 of max|u0| for a u0 smooth on [0, 1] (3e-13 at
// Tv = 1e-6). It costs O(1/Tv), about 0.3 ms at Tv = 1e-3 and 0.4 s at
// 1e-6; to evaluate many points build a Profile once. Special cases as for
// Profile.Excess.
func ProfileExcess(u0 func(Z float64) float64, Z, Tv float64) float64 {
	if !(Tv > 0) || math.IsInf(Tv, 1) || !(Z > 0 && Z <= 1) {
		return NewProfile(u0, 1).Excess(Z, Tv)
	}
	return NewProfile(u0, ProfileTerms(Tv)).Excess(Z, Tv)
}

// ProfileU returns 1 − ∫u dZ / ∫u0 dZ at Tv for the initial excess u0(Z)
// on one drainage path: NewProfile(u0, ProfileTerms(Tv)).U(Tv). Cost and
// special cases as for ProfileExcess and Profile.U.
func ProfileU(u0 func(Z float64) float64, Tv float64) float64 {
	if !(Tv > 0) || math.IsInf(Tv, 1) {
		return NewProfile(u0, 1).U(Tv)
	}
	return NewProfile(u0, ProfileTerms(Tv)).U(Tv)
}
