package series

import (
	"math"
	"testing"
)

// TestProfileUniform checks that the quadrature solution for u0 ≡ 1 equals
// Terzaghi's (1943) closed-form coefficients 2/M: TerzaghiExcess and
// TerzaghiU (exact to rounding), within 1e-13.
func TestProfileUniform(t *testing.T) {
	t.Parallel()
	one := func(float64) float64 { return 1 }
	for _, tv := range []float64{1e-4, 1e-3, 0.01, 0.1, 0.5, 2} {
		for _, Z := range []float64{0, 0.01, 0.1, 0.5, 0.77, 1} {
			got, want := ProfileExcess(one, Z, tv), TerzaghiExcess(Z, tv)
			if math.Abs(got-want) > 1e-13 {
				t.Errorf("Z=%v Tv=%v: ProfileExcess = %.16g, TerzaghiExcess = %.16g", Z, tv, got, want)
			}
		}
		if got, want := ProfileU(one, tv), TerzaghiU(tv); math.Abs(got-want) > 1e-13 {
			t.Errorf("Tv=%v: ProfileU = %.16g, TerzaghiU = %.16g", tv, got, want)
		}
	}
	// The quadrature coefficients themselves: Aₘ = 2/M.
	p := NewProfile(one, 500)
	for m, a := range p.coef {
		if want := 2 / eigen(m); math.Abs(a-want) > 1e-14 {
			t.Fatalf("A_%d = %.16g, want 2/M = %.16g", m, a, want)
		}
	}
}

// TestProfileClosedForms checks profiles whose solutions are known in
// closed form (derived here, Terzaghi 1943 series):
//
//   - u0 = sin(πZ/2) is the first eigenfunction: u = sin(πZ/2) exp(−π²Tv/4),
//     U = 1 − exp(−π²Tv/4).
//   - Triangle u0 = Z (zero at the drained face): Aₘ = 2∫Z sin(MZ) dZ =
//     2(−1)ᵐ/M². At early times the drained face sees the linear profile,
//     itself a steady solution, and the impermeable face sees the even
//     extension 1 − |Z−1|, whose apex loses T of area per side: U = 2Tv.
//   - Triangle u0 = 1 − Z: Aₘ = 2/M − 2(−1)ᵐ/M². The drained face loses
//     ∫erfc(Z/(2√T)) dZ = 2√(T/π), the impermeable face gains T:
//     U = 4√(Tv/π) − 2Tv.
//
// The early forms neglect images at distance 2, of relative size
// exp(−1/(4Tv)) < 1e-21 for Tv ≤ 0.005: tolerance 1e-13 (rounding of
// the ~2/√Tv-term sums and of the quadrature).
func TestProfileClosedForms(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name string
		u0   func(float64) float64
		coef func(M float64, m int) float64 // nil: not checked
		u    func(Z, Tv float64) float64    // nil: not checked
		U    func(Tv float64) float64
		tvs  []float64
	}{
		{
			name: "first eigenfunction",
			u0:   func(Z float64) float64 { return math.Sin(math.Pi * Z / 2) },
			u:    func(Z, Tv float64) float64 { return math.Sin(math.Pi*Z/2) * math.Exp(-math.Pi*math.Pi*Tv/4) },
			U:    func(Tv float64) float64 { return 1 - math.Exp(-math.Pi*math.Pi*Tv/4) },
			tvs:  []float64{1e-3, 0.05, 0.3, 1},
		},
		{
			name: "triangle Z",
			u0:   func(Z float64) float64 { return Z },
			coef: func(M float64, m int) float64 { return 2 * sign(m) / (M * M) },
			U:    func(Tv float64) float64 { return 2 * Tv },
			tvs:  []float64{1e-4, 1e-3, 0.005},
		},
		{
			name: "triangle 1-Z",
			u0:   func(Z float64) float64 { return 1 - Z },
			coef: func(M float64, m int) float64 { return 2/M - 2*sign(m)/(M*M) },
			U:    func(Tv float64) float64 { return 4*math.Sqrt(Tv/math.Pi) - 2*Tv },
			tvs:  []float64{1e-4, 1e-3, 0.005},
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			p := NewProfile(tt.u0, ProfileTerms(tt.tvs[0]))
			if tt.coef != nil {
				for m, a := range p.coef {
					if want := tt.coef(eigen(m), m); math.Abs(a-want) > 1e-14 {
						t.Fatalf("A_%d = %.16g, want %.16g", m, a, want)
					}
				}
			}
			for _, tv := range tt.tvs {
				if got, want := p.U(tv), tt.U(tv); math.Abs(got-want) > 1e-13 {
					t.Errorf("Tv=%v: U = %.16g, want %.16g", tv, got, want)
				}
				if got, want := ProfileU(tt.u0, tv), tt.U(tv); math.Abs(got-want) > 1e-13 {
					t.Errorf("Tv=%v: ProfileU = %.16g, want %.16g", tv, got, want)
				}
				if tt.u == nil {
					continue
				}
				for _, Z := range []float64{0.1, 0.5, 1} {
					if got, want := p.Excess(Z, tv), tt.u(Z, tv); math.Abs(got-want) > 1e-13 {
						t.Errorf("Z=%v Tv=%v: u = %.16g, want %.16g", Z, tv, got, want)
					}
				}
			}
		})
	}
}

// TestProfileKink checks a profile with a kink, the tent min(Z, 1−Z), with
// the kink given as a break: Aₘ = (2/M²)(2 sin(M/2) − sin M), by parts.
// Without the break an odd number of panels would put the kink inside one,
// which costs accuracy (the doc of NewProfile says how much).
func TestProfileKink(t *testing.T) {
	t.Parallel()
	tent := func(Z float64) float64 { return min(Z, 1-Z) }
	p := NewProfile(tent, 201, 0.5)
	for m, a := range p.coef {
		M := eigen(m)
		if want := 2 / (M * M) * (2*math.Sin(M/2) - math.Sin(M)); math.Abs(a-want) > 1e-14 {
			t.Fatalf("A_%d = %.16g, want %.16g", m, a, want)
		}
	}
	if got := p.Excess(0.3, 0); got != 0.3 {
		t.Errorf("Excess(0.3, 0) = %v, want u0 = 0.3", got)
	}
}

// TestProfileSpecialCases checks the documented special cases.
func TestProfileSpecialCases(t *testing.T) {
	t.Parallel()
	lin := func(Z float64) float64 { return 2 * Z }
	zero := func(float64) float64 { return 0 }
	nan := math.NaN()
	p := NewProfile(lin, 10)
	tests := []struct {
		name      string
		got, want float64
	}{
		{"Excess(0,Tv)", p.Excess(0, 0.1), 0},
		{"Excess(Z,0)", p.Excess(0.25, 0), 0.5},
		{"Excess(Z,-1)", p.Excess(0.25, -1), nan},
		{"Excess(2,Tv)", p.Excess(2, 0.1), nan},
		{"U(0)", p.U(0), 0},
		{"U(-1)", p.U(-1), nan},
		{"U(Inf)", p.U(math.Inf(1)), 1},
		{"U of zero profile", ProfileU(zero, 0.1), nan},
		{"ProfileExcess(Z,0)", ProfileExcess(lin, 0.25, 0), 0.5},
		{"ProfileExcess(0,Tv)", ProfileExcess(lin, 0, 0.1), 0},
	}
	for _, tt := range tests {
		if !alike(tt.got, tt.want) {
			t.Errorf("%s = %v, want %v", tt.name, tt.got, tt.want)
		}
	}
	if got := ProfileTerms(1e-3); got != 64 {
		t.Errorf("ProfileTerms(1e-3) = %d, want 64 (M_64² · 1e-3 ≥ 40)", got)
	}
	if p := NewProfile(lin, ProfileTerms(1e-3)); p.MinTv() > 1e-3 {
		t.Errorf("MinTv = %v > 1e-3", p.MinTv())
	}
}

// sign returns (−1)ᵐ.
func sign(m int) float64 {
	if m%2 == 1 {
		return -1
	}
	return 1
}
