package soil

import "math"

// Permeability is the permeability at void ratio e of a soil whose
// permeability is k0 at void ratio e0, by the log-linear law of Tavenas
// et al. (1983):
//
//	log10 k = log10 k0 + (e − e0)/ck.
//
// ck is the permeability change index (ck ≈ 0.5 e0 is common practice as
// a first guess only). Special cases are: ck ≤ 0 gives k0 (a constant
// permeability).
func Permeability(k0, e0, e, ck float64) float64 {
	if ck <= 0 {
		return k0
	}
	return PermeabilityAfter(k0, e0-e, ck)
}

// PermeabilityAfter is the permeability of a soil of permeability k once
// its void ratio has dropped by de (negative: swelling), by the same law:
// k·10^(−de/ck). Special cases are: ck ≤ 0 gives k.
func PermeabilityAfter(k, de, ck float64) float64 {
	if ck <= 0 {
		return k
	}
	return k * Exp(-math.Ln10*de/ck)
}

// Exp is math.Exp, by its Taylor series where |y| < 1e-2 (error below
// y⁶/720 < 2e-15 relative): the time loop evaluates it for every element
// and iteration, mostly at small arguments.
func Exp(y float64) float64 {
	if v, ok := ExpSmall(y); ok {
		return v
	}
	return math.Exp(y)
}

// ExpSmall is Exp where |y| < 1e-2, with ok true there; elsewhere ok is
// false and v meaningless. Free of calls, it is inlined where Exp is not:
// a loop that calls math.Exp itself when ok is false keeps the small
// arguments in line.
func ExpSmall(y float64) (v float64, ok bool) {
	if y > -1e-4 && y < 1e-4 {
		return 1 + y*(1+y*(0.5+y*(1.0/6))), true // remainder below y⁴/24 < 5e-18
	}
	return 1 + y*(1+y*(0.5+y*(1.0/6+y*(1.0/24+y*(1.0/120))))), y > -1e-2 && y < 1e-2
}

// LinearCompress is Compress for a soil with a constant coefficient of
// volume compressibility: it returns the volumetric strain (positive in
// compression) when the effective stress moves from σ′a to σ′b, given the
// largest past effective stress, and that stress afterwards. Loading
// beyond the peak follows mv; unloading, and reloading below the peak,
// follow mvUnload (the swelling modulus; zero means mv, one slope for
// both). This is the oedometer idealisation of common practice.
func LinearCompress(mv, mvUnload, from, to, peak float64) (strain, newPeak float64) {
	if mvUnload <= 0 {
		mvUnload = mv
	}
	peak = math.Max(peak, from)
	if to <= peak {
		return mvUnload * (to - from), peak
	}
	return mvUnload*(peak-from) + mv*(to-peak), to
}

// VoidRatio is the void ratio of the point now: e0 less the compression
// so far.
func (s *Point) VoidRatio() float64 { return s.Curve.E0 - s.de }
