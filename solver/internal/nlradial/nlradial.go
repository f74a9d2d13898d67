// Package nlradial solves, by its own finite differences, the
// consolidation of a drained column under Davis & Raymond's (1965)
// assumption (Cc constant, k ∝ mv, so cv and ch keep their initial
// values) with vertical flow and the radial flow of vertical drains in
// Hansbo's (1981) equal-strain unit cell. It is the independent reference
// for the solver's non-linear model with drains and shares no code with
// it: only the equation.
//
// With s = σ'/σ'0 and w = ln s, the column equation
// ∂ε/∂t = −∂/∂z((k/γw) ∂u/∂z) + 8 kh ū/(γw De² μ) with mv, k, kh ∝ 1/σ'
// and σ' + u = σ'f (one load at t = 0, σ'0 uniform) becomes
//
//	∂w/∂T = ∂²w/∂Z² + β (R e^(−w) − 1),
//
// T = cv0 t/H², Z = z/H, β = 8 ch0 H²/(cv0 De² μ), R = σ'f/σ'0; w = ln R
// at the drained face Z = 0, ∂w/∂Z = 0 at Z = 1, w = 0 at T = 0. The
// diffusion is linear in w (Davis & Raymond), the sink linear in s
// (pure radial flow gives s = R − (R − 1) exp(−β T)), so the sum is
// neither: Carrillo's (1942) product of the two does not hold exactly.
package nlradial

import "math"

// Degrees returns the degree of settlement Us = ∫w dZ / ln R and the
// degree of dissipation Up = ∫(s − 1) dZ / (R − 1) at each time factor of
// ts (ascending, T ≥ 0), for β ≥ 0 and R > 1, on n intervals in Z
// (n ≥ 10) by explicit Euler steps within their stability limit
// (ΔT ≤ ΔZ²/4 and ΔT β R ≤ 0.25).
func Degrees(beta, ratio float64, ts []float64, n int) (us, up []float64) {
	dz := 1 / float64(n)
	dt := math.Min(dz*dz/4, 0.25/math.Max(beta*ratio, 1e-300))
	w := make([]float64, n+1)
	next := make([]float64, n+1)
	lnR := math.Log(ratio)
	w[0] = lnR
	avg := func(f func(float64) float64) float64 {
		s := (f(w[0]) + f(w[n])) / 2
		for i := 1; i < n; i++ {
			s += f(w[i])
		}
		return s * dz
	}
	t := 0.0
	for _, target := range ts {
		for t < target {
			h := math.Min(dt, target-t)
			next[0] = lnR
			for i := 1; i <= n; i++ {
				right := w[i-1] // the mirror image at the sealed face
				if i < n {
					right = w[i+1]
				}
				next[i] = w[i] + h*((w[i-1]-2*w[i]+right)/(dz*dz)+beta*(ratio*math.Exp(-w[i])-1))
			}
			w, next = next, w
			t += h
		}
		us = append(us, avg(func(v float64) float64 { return v })/lnR)
		up = append(up, avg(func(v float64) float64 { return math.Exp(v) - 1 })/(ratio-1))
	}
	return us, up
}
