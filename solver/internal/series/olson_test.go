package series

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// olsonPrinted sums the series for U as printed by Olson, R.E. (1977),
// Consolidation under time-dependent loading, J. Geotech. Eng. Div., ASCE,
// 103(GT1), 55–60, term by term with 200000 terms: the terms fall as 1/M⁴,
// so the tail is below 1e-17. (exp(M²Tc) − 1) exp(−M²Tv) is evaluated as
// exp(−M²(Tv−Tc)) − exp(−M²Tv) to avoid overflow.
func olsonPrinted(Tv, Tc float64) float64 {
	var sum float64
	for m := 199999; m >= 0; m-- { // small terms first
		M := eigen(m)
		M2 := M * M
		if Tv <= Tc {
			sum += (1 - math.Exp(-M2*Tv)) / (M2 * M2)
		} else {
			sum += (math.Exp(-M2*(Tv-Tc)) - math.Exp(-M2*Tv)) / (M2 * M2)
		}
	}
	if Tv <= Tc {
		return Tv / Tc * (1 - 2/Tv*sum)
	}
	return 1 - 2/Tc*sum
}

// TestOlsonPrinted checks OlsonU against Olson's (1977) printed series,
// summed directly; tolerance 1e-13 (Olson's form for Tv ≤ Tc subtracts
// two numbers of order one divided by Tv).
func TestOlsonPrinted(t *testing.T) {
	t.Parallel()
	for _, tc := range []float64{0.01, 0.1, 0.5, 1, 3} {
		for _, f := range []float64{0.1, 0.5, 0.99, 1, 1.01, 1.5, 2, 5} {
			tv := f * tc
			got, want := OlsonU(tv, tc), olsonPrinted(tv, tc)
			if math.Abs(got-want) > 1e-13*max(1, 1/tv) {
				t.Errorf("Tv=%v Tc=%v: OlsonU = %.16g, Olson (1977) series = %.16g", tv, tc, got, want)
			}
		}
	}
}

// TestOlsonDuhamel checks OlsonU and OlsonExcess against a direct numerical
// time integration of Terzaghi's solution under the ramp (Duhamel):
//
//	u(Z, Tv)/q = ∫ (1/Tc) TerzaghiExcess(Z, Tv−τ) dτ,  0 ≤ τ ≤ min(Tv, Tc),
//
// and likewise U with TerzaghiU. The substitution Tv−τ = v² removes the
// √ behaviour of the integrand at τ = Tv; then 40 panels of 20-point
// Gauss–Legendre give about 1e-12.
func TestOlsonDuhamel(t *testing.T) {
	t.Parallel()
	duhamel := func(f func(s float64) float64, Tv, Tc float64) float64 {
		va, vb := math.Sqrt(max(0, Tv-Tc)), math.Sqrt(Tv) // v from Tv−min(Tv,Tc) to Tv
		g := func(v float64) float64 { return f(v*v) * 2 * v / Tc }
		var sum float64
		const panels = 40
		for p := range panels {
			lo := va + (vb-va)*float64(p)/panels
			hi := va + (vb-va)*float64(p+1)/panels
			sum += quad.Fixed(g, lo, hi, 20, nil, 0)
		}
		return sum
	}
	for _, tc := range []float64{0.005, 0.1, 1} {
		for _, f := range []float64{0.2, 1, 1.3, 3} {
			tv := f * tc
			want := duhamel(TerzaghiU, tv, tc)
			if got := OlsonU(tv, tc); math.Abs(got-want) > 1e-12 {
				t.Errorf("Tv=%v Tc=%v: OlsonU = %.15g, Duhamel %.15g", tv, tc, got, want)
			}
			for _, Z := range []float64{0.05, 0.5, 1} {
				want := duhamel(func(s float64) float64 { return TerzaghiExcess(Z, s) }, tv, tc)
				if got := OlsonExcess(Z, tv, tc); math.Abs(got-want) > 1e-12 {
					t.Errorf("Z=%v Tv=%v Tc=%v: OlsonExcess = %.15g, Duhamel %.15g", Z, tv, tc, got, want)
				}
			}
		}
	}
}

// TestOlsonLimits checks the limits of Olson's (1977) solution: Tc → 0
// is Terzaghi's instantaneous load (error O(Tc) plus rounding 1e-16/Tc),
// continuity at the end of the ramp Tv = Tc and where the sums change
// representation (Tv − Tc = 0.1), and the isochrone at the end of a slow
// ramp: for Tc ≫ 1 the pore pressure is the steady state of the loading
// rate, u/q = g(Z)/Tc with g = Z − Z²/2 (plus O(exp(−π²Tc/4)/Tc)).
func TestOlsonLimits(t *testing.T) {
	t.Parallel()
	t.Run("Tc to 0", func(t *testing.T) {
		for _, tv := range []float64{0.01, 0.2, 1} {
			for _, tc := range []float64{1e-4, 1e-6} {
				// |OlsonU − TerzaghiU| ≈ (Tc/2)|dU/dTv| and dU/dTv ≤ 1/√(πTv)
				// (early form): bound Tc/√(πTv), a factor 2 of margin.
				tol := tc/math.Sqrt(math.Pi*tv) + 1e-15/tc
				if d := OlsonU(tv, tc) - TerzaghiU(tv); math.Abs(d) > tol {
					t.Errorf("Tv=%v Tc=%v: OlsonU − TerzaghiU = %v > %v", tv, tc, d, tol)
				}
				// At the midpoint of the window the O(Tc) term cancels.
				if d := OlsonU(tv, tc) - TerzaghiU(tv-tc/2); math.Abs(d) > tc*tc/tv+1e-15/tc {
					t.Errorf("Tv=%v Tc=%v: OlsonU − TerzaghiU(Tv−Tc/2) = %v", tv, tc, d)
				}
				for _, Z := range []float64{0.3, 1} {
					d := OlsonExcess(Z, tv, tc) - TerzaghiExcess(Z, tv-tc/2)
					if math.Abs(d) > tc*tc/(tv*tv)+1e-15/tc {
						t.Errorf("Z=%v Tv=%v Tc=%v: OlsonExcess − TerzaghiExcess(Tv−Tc/2) = %v", Z, tv, tc, d)
					}
				}
			}
			if OlsonU(tv, 0) != TerzaghiU(tv) || OlsonExcess(0.4, tv, 0) != TerzaghiExcess(0.4, tv) {
				t.Errorf("Tc = 0 is not Terzaghi")
			}
		}
	})
	t.Run("continuity", func(t *testing.T) {
		const e = 1e-10
		for _, tc := range []float64{0.01, 0.3, 2} {
			for _, at := range []float64{tc, tc + imageSwitch} {
				a, b := OlsonU(at*(1-e), tc), OlsonU(at*(1+e), tc)
				if math.Abs(a-b) > 1e-9 {
					t.Errorf("Tc=%v: OlsonU jumps at Tv=%v: %v → %v", tc, at, a, b)
				}
				for _, Z := range []float64{0.2, 1} {
					a, b := OlsonExcess(Z, at*(1-e), tc), OlsonExcess(Z, at*(1+e), tc)
					if math.Abs(a-b) > 1e-9 {
						t.Errorf("Tc=%v Z=%v: OlsonExcess jumps at Tv=%v: %v → %v", tc, Z, at, a, b)
					}
				}
			}
		}
	})
	t.Run("slow ramp", func(t *testing.T) {
		const tc = 20.0 // exp(−π²·20/4) ≈ 1e-21
		for _, Z := range []float64{0.1, 0.6, 1} {
			if got, want := OlsonExcess(Z, tc, tc), (Z-Z*Z/2)/tc; math.Abs(got-want) > 1e-15 {
				t.Errorf("Z=%v: u/q = %.16g, steady g(Z)/Tc = %.16g", Z, got, want)
			}
		}
		// U at the end of the ramp: 1 − (1/3)/Tc (∫g dZ = 1/3).
		if got, want := OlsonU(tc, tc), 1-1.0/(3*tc); math.Abs(got-want) > 1e-15 {
			t.Errorf("U(Tc) = %.16g, want %.16g", got, want)
		}
	})
	t.Run("special cases", func(t *testing.T) {
		nan := math.NaN()
		tests := []struct {
			name      string
			got, want float64
		}{
			{"U(0,Tc)", OlsonU(0, 1), 0},
			{"U(Inf,Tc)", OlsonU(math.Inf(1), 1), 1},
			{"U(-1,Tc)", OlsonU(-1, 1), nan},
			{"U(Tv,-1)", OlsonU(1, -1), nan},
			{"u(0,Tv,Tc)", OlsonExcess(0, 1, 1), 0},
			{"u(Z,0,Tc)", OlsonExcess(0.5, 0, 1), 0},
			{"u(2,Tv,Tc)", OlsonExcess(2, 1, 1), nan},
			{"u(Z,Tv,NaN)", OlsonExcess(0.5, 1, nan), nan},
		}
		for _, tt := range tests {
			if !alike(tt.got, tt.want) {
				t.Errorf("%s = %v, want %v", tt.name, tt.got, tt.want)
			}
		}
	})
}

// TestOlsonFiniteDifference compares Olson's (1977) solution with the
// independent finite difference solution of mv ∂u/∂t = (k/γw) ∂²u/∂z² +
// mv dσ/dt (fdColumn) for a 5 m layer drained at the top, on two meshes:
// the nodal error of u/q and of U must fall by 4 (observed order
// 2 ± 0.25, Strang & Fix 1973) and be below 2e-4 on the fine mesh (80
// elements; the error is largest at the end of a fast ramp). The end
// of the ramp falls on a time step, so the kink in the load costs no
// accuracy in time.
func TestOlsonFiniteDifference(t *testing.T) {
	t.Parallel()
	layers := []Layer{{5, 1e-9, 1e-3}}
	const H, q = 5.0, 1.0
	cv := layers[0].K * 86400 / (layers[0].Mv * gammaW)
	for _, Tc := range []float64{0.05, 0.4} {
		tc := Tc * H * H / cv // days
		rate := func(t float64) float64 {
			if t < tc {
				return q / tc
			}
			return 0
		}
		for _, f := range []float64{0.5, 1, 2} {
			tEnd, Tv := f*tc, f*Tc
			var errs [2]float64
			for r, n := range []int{40, 80} {
				fd := fdColumn(layers, gammaW, true, false, []int{n}, 3000, tEnd, 0, rate)
				for i, z := range fd.z {
					errs[r] = max(errs[r], math.Abs(fd.u[i]/q-OlsonExcess(z/H, Tv, Tc)))
				}
				U := (min(tEnd, tc)/tc*q - fd.mvMean) / q // settlement / final settlement
				errs[r] = max(errs[r], math.Abs(U-OlsonU(Tv, Tc)))
			}
			order := math.Log2(errs[0] / errs[1])
			if math.Abs(order-2) > 0.25 || errs[1] > 2e-4 {
				t.Errorf("Tc=%v Tv=%v: error %.3g then %.3g, observed order %.2f", Tc, Tv, errs[0], errs[1], order)
			}
		}
	}
}
