package series

import "math"

// OlsonU returns the average degree of consolidation of one drainage path
// under a load that rises linearly from 0 to q over the time factor Tc and
// then stays at q (Olson 1977): the settlement at Tv as a fraction of the
// final one. Olson's series are
//
//	U = (Tv/Tc) [1 − (2/Tv) Σ (1 − exp(−M² Tv))/M⁴]          for Tv ≤ Tc,
//	U = 1 − (2/Tc) Σ (exp(M² Tc) − 1) exp(−M² Tv)/M⁴          for Tv ≥ Tc,
//
// which by superposition of the ramp (Duhamel) are the running mean of
// Terzaghi's U over the last Tc of time factor,
//
//	U = (1/Tc) ∫ TerzaghiU(τ) dτ  over  max(0, Tv−Tc) ≤ τ ≤ Tv.
//
// The integral of TerzaghiU is summed in closed form (its Fourier or image
// series), so the result is exact to rounding for Tv − Tc ≥ 0.1 (where the
// second series is summed term by term with expm1) and carries an absolute
// rounding error of about 1e-16/Tc otherwise.
//
// Special cases are:
//
//	OlsonU(Tv, 0) = TerzaghiU(Tv) (instantaneous load)
//	OlsonU(0, Tc) = 0
//	OlsonU(+Inf, Tc) = 1
//	OlsonU(Tv, Tc) = NaN for Tv < 0, Tc < 0 or either NaN
func OlsonU(Tv, Tc float64) float64 {
	switch {
	case math.IsNaN(Tv) || math.IsNaN(Tc) || Tv < 0 || Tc < 0:
		return math.NaN()
	case Tc == 0:
		return TerzaghiU(Tv)
	case math.IsInf(Tv, 1):
		return 1
	case Tv == 0:
		return 0
	case Tv <= Tc:
		return avgU(Tv) / Tc
	case Tv-Tc >= imageSwitch:
		// 1 − Σ (2/M²) exp(−M² (Tv−Tc)) (1 − exp(−M² Tc))/(M² Tc).
		var sum float64
		for m := 0; m < maxFourier; m++ {
			M := eigen(m)
			M2 := M * M
			t := 2 / M2 * math.Exp(-M2*(Tv-Tc)) * -math.Expm1(-M2*Tc) / (M2 * Tc)
			sum += t
			if t < negligible {
				break
			}
		}
		return 1 - sum
	}
	return (avgU(Tv) - avgU(Tv-Tc)) / Tc
}

// OlsonExcess returns u/q at Z = z/H (drained at Z = 0, impermeable at
// Z = 1) and time factor Tv for the load of OlsonU, rising linearly to q
// over Tc. It is Terzaghi's isochrone superposed over the ramp (Duhamel),
//
//	u/q = (1/Tc) ∫ TerzaghiExcess(Z, τ) dτ  over  max(0, Tv−Tc) ≤ τ ≤ Tv,
//
// that is, with g(Z) = Z − Z²/2,
//
//	u/q = (1/Tc) [g(Z) − Σ (2/M³) sin(M Z) exp(−M² Tv)]                          for Tv ≤ Tc,
//	u/q = (1/Tc) Σ (2/M³) sin(M Z) (exp(M² Tc) − 1) exp(−M² Tv)                  for Tv ≥ Tc,
//
// with ∫₀ˢ TerzaghiExcess dτ summed in closed form (Fourier or image
// series). Accuracy as for OlsonU.
//
// Special cases are:
//
//	OlsonExcess(Z, Tv, 0) = TerzaghiExcess(Z, Tv)
//	OlsonExcess(0, Tv, Tc) = 0 and OlsonExcess(Z, 0, Tc) = 0
//	OlsonExcess(Z, Tv, Tc) = NaN for Z outside [0, 1], Tv < 0, Tc < 0 or any NaN
func OlsonExcess(Z, Tv, Tc float64) float64 {
	switch {
	case math.IsNaN(Z) || math.IsNaN(Tv) || math.IsNaN(Tc) || Z < 0 || Z > 1 || Tv < 0 || Tc < 0:
		return math.NaN()
	case Tc == 0:
		return TerzaghiExcess(Z, Tv)
	case math.IsInf(Tv, 1) || Tv == 0 || Z == 0:
		return 0
	case Tv <= Tc:
		return ramp(Z, Tv) / Tc
	case Tv-Tc >= imageSwitch:
		var sum float64
		for m := 0; m < maxFourier; m++ {
			M := eigen(m)
			M2 := M * M
			b := 2 / M * math.Exp(-M2*(Tv-Tc)) * -math.Expm1(-M2*Tc) / (M2 * Tc)
			sum += b * math.Sin(M*Z)
			if b < negligible {
				break
			}
		}
		return sum
	}
	return (ramp(Z, Tv) - ramp(Z, Tv-Tc)) / Tc
}
