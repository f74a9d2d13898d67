package series

import "math"

// imageSwitch is the time factor below which the one-path functions sum the
// image (erfc) series instead of the Fourier series. Both converge fast
// there: at Tv = 0.1 the Fourier series needs about 7 terms and the image
// series 3 for full double precision (the tests compare the two on
// 1e-4 ≤ Tv ≤ 1).
const imageSwitch = 0.1

// negligible is the size below which a series term is dropped: every series
// here is then converged to rounding error on results of order one.
const negligible = 1e-18

// maxFourier caps the number of Fourier terms of the one-path series, which
// is only reached for Tv below about 1e-12 (see the doc of ProfileExcess).
const maxFourier = 1 << 22

// eigen returns M = π(2m+1)/2, the m-th eigenvalue of one drainage path of
// unit length, drained at Z = 0 and impermeable at Z = 1 (Terzaghi 1943).
func eigen(m int) float64 { return math.Pi * (float64(m) + 0.5) }

// TerzaghiU returns Terzaghi's (1943) average degree of consolidation U of
// one drainage path under a uniform initial excess pore pressure,
//
//	U(Tv) = 1 − Σ (2/M²) exp(−M² Tv),  M = π(2m+1)/2,  m = 0, 1, …
//
// with Tv = cv t / H² and H the length of the drainage path (the full
// thickness with one drained face, half of it with two). For Tv < 0.1 the
// equivalent image series U = 2√(Tv/π) + 4√Tv Σ (−1)ⁿ ierfc(n/√Tv), n ≥ 1,
// is summed instead; either way the result is exact to rounding.
//
// Special cases are:
//
//	TerzaghiU(0) = 0
//	TerzaghiU(+Inf) = 1
//	TerzaghiU(Tv < 0) = NaN
//	TerzaghiU(NaN) = NaN
func TerzaghiU(Tv float64) float64 {
	switch {
	case math.IsNaN(Tv) || Tv < 0:
		return math.NaN()
	case Tv == 0:
		return 0
	case math.IsInf(Tv, 1):
		return 1
	case Tv < imageSwitch:
		return uImage(Tv)
	}
	return uFourier(Tv)
}

// TerzaghiExcess returns u/u0 at Z = z/H and Tv = cv t/H² for one drainage
// path drained at Z = 0 and impermeable at Z = 1, under a uniform initial
// excess pore pressure u0 (Terzaghi 1943):
//
//	u/u0 = Σ (2/M) sin(M Z) exp(−M² Tv),  M = π(2m+1)/2.
//
// For Tv < 0.1 the equivalent image series (Carslaw & Jaeger 1959, ch. 3)
//
//	u/u0 = 1 − Σ (−1)ⁿ [erfc((2n+Z)/(2√Tv)) + erfc((2n+2−Z)/(2√Tv))],  n ≥ 0,
//
// is summed instead; either way the result is exact to rounding for every
// Tv > 0. For two drained faces use Z = z/(H/2) on each half.
//
// Special cases are:
//
//	TerzaghiExcess(0, Tv ≥ 0) = 0 (the drained face)
//	TerzaghiExcess(Z > 0, 0) = 1 (the initial state)
//	TerzaghiExcess(Z, +Inf) = 0
//	TerzaghiExcess(Z, Tv) = NaN for Z outside [0, 1], Tv < 0 or either NaN
func TerzaghiExcess(Z, Tv float64) float64 {
	switch {
	case math.IsNaN(Z) || math.IsNaN(Tv) || Z < 0 || Z > 1 || Tv < 0:
		return math.NaN()
	case Z == 0 || math.IsInf(Tv, 1):
		return 0
	case Tv == 0:
		return 1
	case Tv < imageSwitch:
		return excessImage(Z, Tv)
	}
	return excessFourier(Z, Tv)
}

// TvForU returns the time factor at which TerzaghiU reaches U, the inverse
// of TerzaghiU, found by bisection on the monotone function TerzaghiU to a
// relative accuracy of a few ulps in Tv. It takes about 60 evaluations.
//
// Special cases are:
//
//	TvForU(0) = 0
//	TvForU(1) = +Inf
//	TvForU(U) = NaN for U < 0, U > 1 or NaN
func TvForU(U float64) float64 {
	switch {
	case math.IsNaN(U) || U < 0 || U > 1:
		return math.NaN()
	case U == 0:
		return 0
	case U == 1:
		return math.Inf(1)
	}
	lo, hi := 0.0, 1.0
	for TerzaghiU(hi) < U {
		lo, hi = hi, 2*hi
		if hi > 1e3 { // U(1e3) rounds to 1: U is within rounding of 1.
			return math.Inf(1)
		}
	}
	for i := 0; i < 200 && hi-lo > 2e-16*hi; i++ {
		mid := lo + (hi-lo)/2
		if TerzaghiU(mid) < U {
			lo = mid
		} else {
			hi = mid
		}
	}
	return lo + (hi-lo)/2
}

// The functions below are the two representations of the one-path
// solutions for s = Tv > 0. Names ending in Fourier sum the eigenfunction
// series, those ending in Image the image (erfc) series. The exported
// functions pick one; the tests compare both.

// excessFourier is Σ (2/M) sin(M Z) exp(−M² s).
func excessFourier(Z, s float64) float64 {
	var sum float64
	for m := 0; m < maxFourier; m++ {
		M := eigen(m)
		e := math.Exp(-M * M * s)
		sum += 2 / M * math.Sin(M*Z) * e
		if 2/M*e < negligible {
			break
		}
	}
	return sum
}

// excessImage is 1 − Σ (−1)ⁿ [erfc((2n+Z)/c) + erfc((2n+2−Z)/c)], c = 2√s.
func excessImage(Z, s float64) float64 {
	c := 2 * math.Sqrt(s)
	return 1 - alternating(0, func(n float64) float64 {
		return math.Erfc((2*n+Z)/c) + math.Erfc((2*n+2-Z)/c)
	})
}

// rampFourier is G(Z, s) = ∫₀ˢ u/u0 dτ = g(Z) − Σ (2/M³) sin(M Z) exp(−M² s)
// with g(Z) = Z − Z²/2 = Σ (2/M³) sin(M Z), the solution of −g” = 1,
// g(0) = 0, g'(1) = 0.
func rampFourier(Z, s float64) float64 {
	var sum float64
	for m := 0; m < maxFourier; m++ {
		M := eigen(m)
		e := math.Exp(-M * M * s)
		sum += 2 / (M * M * M) * math.Sin(M*Z) * e
		if 2/(M*M*M)*e < negligible {
			break
		}
	}
	return Z - Z*Z/2 - sum
}

// rampImage is G(Z, s) = s − 4s Σ (−1)ⁿ [i²erfc((2n+Z)/c) + i²erfc((2n+2−Z)/c)],
// c = 2√s, the image series integrated term by term with
// ∫₀ˢ erfc(a/(2√τ)) dτ = 4s i²erfc(a/(2√s)).
func rampImage(Z, s float64) float64 {
	c := 2 * math.Sqrt(s)
	return s - 4*s*alternating(0, func(n float64) float64 {
		return i2erfc((2*n+Z)/c) + i2erfc((2*n+2-Z)/c)
	})
}

// ramp is G(Z, s) = ∫₀ˢ TerzaghiExcess(Z, τ) dτ for s ≥ 0.
func ramp(Z, s float64) float64 {
	switch {
	case s <= 0 || Z == 0:
		return 0
	case s < imageSwitch:
		return rampImage(Z, s)
	}
	return rampFourier(Z, s)
}

// uFourier is 1 − Σ (2/M²) exp(−M² s).
func uFourier(s float64) float64 {
	var sum float64
	for m := 0; m < maxFourier; m++ {
		M := eigen(m)
		t := 2 / (M * M) * math.Exp(-M*M*s)
		sum += t
		if t < negligible {
			break
		}
	}
	return 1 - sum
}

// uImage is 2√(s/π) + 4√s Σ (−1)ⁿ ierfc(n/√s), n ≥ 1: the image series
// integrated over Z with ∫ erfc(x/c) dx = −c ierfc(x/c).
func uImage(s float64) float64 {
	r := math.Sqrt(s)
	return 2*r/math.SqrtPi + 4*r*alternating(1, func(n float64) float64 { return ierfc(n / r) })
}

// bFourier is B(s) = ∫₀ˢ U dτ = s − 1/3 + Σ (2/M⁴) exp(−M² s), using
// Σ 2/M⁴ = ∫₀¹ g dZ = 1/3.
func bFourier(s float64) float64 {
	var sum float64
	for m := 0; m < maxFourier; m++ {
		M := eigen(m)
		M2 := M * M
		t := 2 / (M2 * M2) * math.Exp(-M2*s)
		sum += t
		if t < negligible {
			break
		}
	}
	return s - 1.0/3 + sum
}

// bImage is B(s) = 8 s^(3/2) [1/(6√π) + 2 Σ (−1)ⁿ i³erfc(n/√s)], n ≥ 1:
// rampImage integrated over Z.
func bImage(s float64) float64 {
	r := math.Sqrt(s)
	return 8 * s * r * (1/(6*math.SqrtPi) + 2*alternating(1, func(n float64) float64 { return i3erfc(n / r) }))
}

// avgU is B(s) = ∫₀ˢ TerzaghiU(τ) dτ for s ≥ 0.
func avgU(s float64) float64 {
	switch {
	case s <= 0:
		return 0
	case s < imageSwitch:
		return bImage(s)
	}
	return bFourier(s)
}

// Repeated integrals of erfc, iⁿerfc(x) = ∫ₓ^∞ iⁿ⁻¹erfc(t) dt, by the
// recurrence 2n iⁿerfc(x) = iⁿ⁻²erfc(x) − 2x iⁿ⁻¹erfc(x) with
// i⁻¹erfc(x) = (2/√π) exp(−x²) (Abramowitz & Stegun 1964, §7.2). For
// x ≥ 0 the recurrence cancels in relative terms as x grows, but its
// absolute error stays near 1e-16·exp(−x²), far below what the series
// here need. Used for x ≥ 0 only.

func ierfc(x float64) float64 {
	return math.Exp(-x*x)/math.SqrtPi - x*math.Erfc(x)
}

func i2erfc(x float64) float64 {
	return (math.Erfc(x) - 2*x*ierfc(x)) / 4
}

func i3erfc(x float64) float64 {
	return (ierfc(x) - 2*x*i2erfc(x)) / 6
}

// alternating sums Σ (−1)ⁿ term(n) over n = from, from+1, … up to and
// including the first term below negligible: the image series here have
// positive terms that fall faster than geometrically.
func alternating(from int, term func(n float64) float64) float64 {
	var sum float64
	for n := from; ; n++ {
		t := term(float64(n))
		if n%2 == 0 {
			sum += t
		} else {
			sum -= t
		}
		if t < negligible {
			return sum
		}
	}
}
