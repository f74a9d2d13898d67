package series

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// TestTerzaghiUTable checks the U–Tv table of Terzaghi, K. (1943),
// Theoretical Soil Mechanics, Wiley, as reproduced in most soil mechanics
// texts, whose digits are checked here rather than trusted. The series is
// the reference: TvForU(U) must round to the printed three decimals, that
// is lie within 0.0005 of them. For U = 60 % the series gives 0.28640, so
// 0.286 is the correctly rounded value; the 0.287 of some texts is 0.0006
// high (TerzaghiU(0.287) = 0.6006), accepted only within 0.001.
func TestTerzaghiUTable(t *testing.T) {
	t.Parallel()
	tests := []struct {
		U, Tv, tol float64
	}{
		{0.1, 0.008, 0.0005}, // Terzaghi (1943) table, 3 decimals
		{0.2, 0.031, 0.0005},
		{0.3, 0.071, 0.0005},
		{0.4, 0.126, 0.0005},
		{0.5, 0.197, 0.0005},
		{0.6, 0.286, 0.0005},
		{0.6, 0.287, 0.001}, // the variant printed in some texts
		{0.7, 0.403, 0.0005},
		{0.8, 0.567, 0.0005},
		{0.9, 0.848, 0.0005},
	}
	for _, tt := range tests {
		got := TvForU(tt.U)
		if math.Abs(got-tt.Tv) > tt.tol {
			t.Errorf("TvForU(%v) = %.5f, table %v ± %v", tt.U, got, tt.Tv, tt.tol)
		}
		// The inverse is exact: TerzaghiU undoes TvForU to rounding.
		if back := TerzaghiU(got); math.Abs(back-tt.U) > 1e-14 {
			t.Errorf("TerzaghiU(TvForU(%v)) = %.17g", tt.U, back)
		}
	}
}

// TestTerzaghiUClosedForms checks U against closed forms of the series.
// Early: U = 2√(Tv/π) + 4√Tv Σ (−1)ⁿ ierfc(n/√Tv), whose first correction
// 4√Tv ierfc(1/√Tv) is below 1e-40 at Tv = 0.01, so U = 2√(Tv/π) there to
// rounding. Late: the first Fourier term, U = 1 − (8/π²) exp(−π² Tv/4),
// with the next term (8/(9π²)) exp(−9π² Tv/4) below 1e-17 at Tv = 2.
// Both representations (Fourier and image) are checked, not only the one
// TerzaghiU picks.
func TestTerzaghiUClosedForms(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name string
		Tv   float64
		want float64
	}{
		{"early 1e-6", 1e-6, 2 * math.Sqrt(1e-6/math.Pi)},
		{"early 1e-3", 1e-3, 2 * math.Sqrt(1e-3/math.Pi)},
		{"early 0.01", 0.01, 2 * math.Sqrt(0.01/math.Pi)},
		{"late 2", 2, 1 - 8/(math.Pi*math.Pi)*math.Exp(-math.Pi*math.Pi*2/4)},
		{"late 3", 3, 1 - 8/(math.Pi*math.Pi)*math.Exp(-math.Pi*math.Pi*3/4)},
	}
	for _, tt := range tests {
		if got := TerzaghiU(tt.Tv); math.Abs(got-tt.want) > 1e-15 {
			t.Errorf("%s: TerzaghiU = %.17g, want %.17g", tt.name, got, tt.want)
		}
		if tt.Tv >= 1e-3 { // the Fourier series needs ~ 2/√Tv terms
			if got := uFourier(tt.Tv); math.Abs(got-tt.want) > 1e-15 {
				t.Errorf("%s: Fourier U = %.17g, want %.17g", tt.name, got, tt.want)
			}
		}
		if got := uImage(tt.Tv); math.Abs(got-tt.want) > 1e-15 {
			t.Errorf("%s: image U = %.17g, want %.17g", tt.name, got, tt.want)
		}
	}
}

// TestTerzaghiApproximations checks the approximations to Terzaghi's (1943)
// series quoted in soil mechanics texts, which have no single original
// source, against the series. Tv = (π/4)U² is the
// first image term alone, so it is exact to 1e-6 (relative) up to U = 0.3;
// it errs by 0.2 % at U = 0.5 and 1.3 % at U = 0.6 (values from the
// series, printed on failure). Tv = 1.781 − 0.933 log10(100 − U%) is the
// first Fourier term with its constants (4/π²)(ln 100 − ln(π²/8)) = 1.78129
// and (4/π²) ln 10 = 0.93319 rounded to three decimals: within 0.0005 of
// the series for 0.6 < U < 1, the accuracy of a three-decimal table.
func TestTerzaghiApproximations(t *testing.T) {
	t.Parallel()
	for U := 0.001; U <= 0.6+1e-9; U += 0.001 {
		tv := TvForU(U)
		rel := math.Abs(math.Pi/4*U*U-tv) / tv
		var tol float64
		switch {
		case U <= 0.3:
			tol = 1e-6
		case U <= 0.5:
			tol = 0.002
		default:
			tol = 0.013
		}
		if rel > tol {
			t.Errorf("U = %.3f: (π/4)U² = %.6f, series %.6f, relative error %.2g > %g", U, math.Pi/4*U*U, tv, rel, tol)
		}
	}
	for U := 0.601; U < 0.9995; U += 0.001 {
		tv := TvForU(U)
		a := 1.781 - 0.933*math.Log10(100-100*U)
		if math.Abs(a-tv) > 0.0005 {
			t.Errorf("U = %.3f: 1.781 − 0.933 log10(100 − U%%) = %.5f, series %.5f", U, a, tv)
		}
	}
	// The rounded constants, from the exact ones.
	c0 := 4 / (math.Pi * math.Pi) * (math.Log(100) - math.Log(math.Pi*math.Pi/8))
	c1 := 4 / (math.Pi * math.Pi) * math.Ln10
	if math.Abs(c0-1.781) > 0.0005 || math.Abs(c1-0.933) > 0.0005 {
		t.Errorf("constants %.5f, %.5f do not round to 1.781, 0.933", c0, c1)
	}
}

// TestTerzaghiExcess checks properties of Terzaghi's (1943) isochrones: the
// drained face, the initial state, zero slope at the impermeable face, the
// diffusion equation, ∫u dZ = 1 − U and the two representations agreeing.
func TestTerzaghiExcess(t *testing.T) {
	t.Parallel()
	times := []float64{1e-5, 1e-4, 1e-3, 0.01, 0.05, 0.0999, 0.1, 0.2, 0.5, 1, 2}

	t.Run("drained face", func(t *testing.T) {
		for _, tv := range times {
			if got := TerzaghiExcess(0, tv); got != 0 {
				t.Errorf("TerzaghiExcess(0, %v) = %v, want 0", tv, got)
			}
			// Near the face u ≈ u_Z(0)·Z: small, of order Z/√Tv.
			if got := TerzaghiExcess(1e-12, tv); math.Abs(got) > 1e-12/math.Sqrt(tv) {
				t.Errorf("TerzaghiExcess(1e-12, %v) = %v", tv, got)
			}
		}
	})

	t.Run("early interior", func(t *testing.T) {
		// The first image term erfc(Z/(2√Tv)) is below 1e-17 for
		// Z/(2√Tv) ≥ 6: u/u0 = 1 to rounding.
		for _, tt := range []struct{ Z, Tv float64 }{{0.5, 1e-4}, {0.12, 1e-4}, {0.9, 1e-3}, {1, 0.005}} {
			if got := TerzaghiExcess(tt.Z, tt.Tv); math.Abs(got-1) > 1e-15 {
				t.Errorf("TerzaghiExcess(%v, %v) = %.17g, want 1", tt.Z, tt.Tv, got)
			}
		}
	})

	t.Run("zero slope at Z=1", func(t *testing.T) {
		// Second-order one-sided difference, error O(h²·u_ZZZ); with
		// h = 1e-4 and u_ZZZ ~ Tv^(-3/2) this is below 1e-6 for Tv ≥ 0.01.
		const h = 1e-4
		for _, tv := range times {
			if tv < 0.01 {
				continue
			}
			d := (3*TerzaghiExcess(1, tv) - 4*TerzaghiExcess(1-h, tv) + TerzaghiExcess(1-2*h, tv)) / (2 * h)
			if math.Abs(d) > 1e-6 {
				t.Errorf("∂u/∂Z(1, %v) ≈ %v, want 0", tv, d)
			}
		}
	})

	t.Run("diffusion equation", func(t *testing.T) {
		// u_T = u_ZZ by central differences, error O(h²) ≈ 1e-7 with
		// h = 1e-3 in Z and a relative step 1e-4 in Tv.
		for _, tv := range []float64{0.01, 0.05, 0.2, 1} {
			for _, Z := range []float64{0.1, 0.4, 0.9} {
				const h = 1e-3
				dt := 1e-4 * tv
				ut := (TerzaghiExcess(Z, tv+dt) - TerzaghiExcess(Z, tv-dt)) / (2 * dt)
				uzz := (TerzaghiExcess(Z+h, tv) - 2*TerzaghiExcess(Z, tv) + TerzaghiExcess(Z-h, tv)) / (h * h)
				if math.Abs(ut-uzz) > 1e-4*(1+math.Abs(ut)) {
					t.Errorf("Z=%v Tv=%v: u_T = %v, u_ZZ = %v", Z, tv, ut, uzz)
				}
			}
		}
	})

	t.Run("integral is 1-U", func(t *testing.T) {
		// Gauss–Legendre with 64 panels of 20 points resolves the
		// boundary layer of width √Tv ≥ 0.01 to rounding.
		for _, tv := range times {
			if tv < 1e-4 {
				continue
			}
			var got float64
			for p := range 64 {
				lo, hi := float64(p)/64, float64(p+1)/64
				got += quad.Fixed(func(Z float64) float64 { return TerzaghiExcess(Z, tv) }, lo, hi, 20, nil, 0)
			}
			if want := 1 - TerzaghiU(tv); math.Abs(got-want) > 1e-13 {
				t.Errorf("Tv = %v: ∫u dZ = %.15g, 1−U = %.15g", tv, got, want)
			}
		}
	})

	t.Run("Fourier equals image", func(t *testing.T) {
		// Two representations of one function (Carslaw & Jaeger 1959):
		// they agree to rounding wherever both converge (the Fourier
		// sum of ~2/√Tv terms gathers a few ulps: tolerance 5e-15).
		for _, tv := range []float64{1e-4, 1e-3, 0.01, 0.1, 0.3, 1} {
			for Z := 0.0; Z <= 1; Z += 0.05 {
				if d := excessFourier(Z, tv) - excessImage(Z, tv); math.Abs(d) > 5e-15 {
					t.Errorf("u: Z=%v Tv=%v: Fourier − image = %v", Z, tv, d)
				}
				if d := rampFourier(Z, tv) - rampImage(Z, tv); math.Abs(d) > 5e-15 {
					t.Errorf("∫u dT: Z=%v Tv=%v: Fourier − image = %v", Z, tv, d)
				}
			}
			if d := uFourier(tv) - uImage(tv); math.Abs(d) > 5e-15 {
				t.Errorf("U: Tv=%v: Fourier − image = %v", tv, d)
			}
			if d := bFourier(tv) - bImage(tv); math.Abs(d) > 5e-15 {
				t.Errorf("∫U dT: Tv=%v: Fourier − image = %v", tv, d)
			}
		}
	})
}

// TestTerzaghiSpecialCases checks the special cases listed in the docs.
func TestTerzaghiSpecialCases(t *testing.T) {
	t.Parallel()
	nan, inf := math.NaN(), math.Inf(1)
	tests := []struct {
		name      string
		got, want float64
	}{
		{"U(0)", TerzaghiU(0), 0},
		{"U(+Inf)", TerzaghiU(inf), 1},
		{"U(-1)", TerzaghiU(-1), nan},
		{"U(NaN)", TerzaghiU(nan), nan},
		{"u(0,Tv)", TerzaghiExcess(0, 0.3), 0},
		{"u(0,0)", TerzaghiExcess(0, 0), 0},
		{"u(Z,0)", TerzaghiExcess(0.5, 0), 1},
		{"u(Z,+Inf)", TerzaghiExcess(0.5, inf), 0},
		{"u(-0.1,Tv)", TerzaghiExcess(-0.1, 0.3), nan},
		{"u(1.1,Tv)", TerzaghiExcess(1.1, 0.3), nan},
		{"u(Z,-1)", TerzaghiExcess(0.5, -1), nan},
		{"Tv(0)", TvForU(0), 0},
		{"Tv(1)", TvForU(1), inf},
		{"Tv(1.5)", TvForU(1.5), nan},
		{"Tv(-0.1)", TvForU(-0.1), nan},
		{"Tv(NaN)", TvForU(nan), nan},
	}
	for _, tt := range tests {
		if !alike(tt.got, tt.want) {
			t.Errorf("%s = %v, want %v", tt.name, tt.got, tt.want)
		}
	}
}

// alike reports whether a and b are equal, counting NaN equal to NaN (as
// in the standard library's math tests).
func alike(a, b float64) bool {
	if math.IsNaN(a) && math.IsNaN(b) {
		return true
	}
	return a == b
}
