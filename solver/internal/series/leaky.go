package series

import "math"

// LeakyU returns the average degree of consolidation at time factor Tv =
// cv t/H² of a uniform layer of thickness H under a uniform initial
// excess, sealed at its base and draining at its top through a resistance
// (a Robin condition ∂u/∂z = u/(k R) there, R the resistance in time and
// k the permeability in length per time). With Bi = H/(k R),
//
//	U = 1 − Σ 2 sin²λₙ / (λₙ (λₙ + sin λₙ cos λₙ)) · exp(−λₙ² Tv),
//
// λₙ the positive roots of λ tan λ = Bi, one in each ((n−1)π, (n−1)π +
// π/2). This is the slab with a radiation boundary of heat conduction
// (Carslaw & Jaeger 1959, Conduction of Heat in Solids, §3.11, from
// memory); the tests check it against Terzaghi's U as Bi → ∞ and against
// the lumped 1 − exp(−Bi·Tv) as Bi → 0. Bi ≤ 0, Tv < 0 or NaN give NaN;
// Tv = 0 gives 0.
func LeakyU(Tv, Bi float64) float64 {
	switch {
	case math.IsNaN(Tv) || math.IsNaN(Bi) || Tv < 0 || Bi <= 0:
		return math.NaN()
	case Tv == 0:
		return 0
	}
	sum := 0.0
	for n := 0; n < 100000; n++ {
		l := leakyRoot(n, Bi)
		s, c := math.Sincos(l)
		term := 2 * s * s / (l * (l + s*c)) * math.Exp(-l*l*Tv)
		sum += term
		if l*l*Tv > 40 || (n > 10 && term < 1e-16) {
			break
		}
	}
	return 1 - sum
}

// leakyRoot is the root of λ tan λ = Bi in (nπ, nπ + π/2), by bisection.
func leakyRoot(n int, Bi float64) float64 {
	lo, hi := float64(n)*math.Pi, float64(n)*math.Pi+math.Pi/2
	for range 200 {
		mid := (lo + hi) / 2
		if mid*math.Tan(mid) < Bi {
			lo = mid
		} else {
			hi = mid
		}
		if hi-lo < 1e-15*hi {
			break
		}
	}
	return (lo + hi) / 2
}

// LeakyTv returns the time factor at which LeakyU reaches U (0 < U < 1),
// by bisection in log Tv.
func LeakyTv(U, Bi float64) float64 {
	lo, hi := 1e-12, 1e12
	for range 300 {
		mid := math.Sqrt(lo * hi)
		if LeakyU(mid, Bi) < U {
			lo = mid
		} else {
			hi = mid
		}
	}
	return math.Sqrt(lo * hi)
}
