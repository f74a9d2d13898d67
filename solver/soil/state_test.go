package soil

import (
	"math"
	"testing"
)

// TestPermeability checks the law of Tavenas et al. (1983),
// log10 k = log10 k0 + (e − e0)/Ck, at hand-worked points: a drop of the
// void ratio by Ck divides k by 10 (by definition of the index).
func TestPermeability(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name          string
		k0, e0, e, ck float64
		want          float64
	}{
		{"at e0", 1e-9, 1.5, 1.5, 0.75, 1e-9},
		{"one Ck lower", 1e-9, 1.5, 0.75, 0.75, 1e-10},
		{"half a Ck higher", 2e-9, 1.0, 1.25, 0.5, 2e-9 * math.Sqrt(10)},
		{"no index: constant", 3e-9, 1.0, 0.2, 0, 3e-9},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			got := Permeability(tt.k0, tt.e0, tt.e, tt.ck)
			// Tolerance 1e-12 relative: closed form, rounding only.
			if math.Abs(got-tt.want) > 1e-12*tt.want {
				t.Errorf("Permeability = %g, want %g (Tavenas et al. 1983, ±1e-12 rel.)", got, tt.want)
			}
		})
	}
}

// TestLinearCompress checks the constant-mv oedometer path by hand:
// ε = mv·Δσ′ beyond the peak, mvUnload·Δσ′ below it (common practice).
func TestLinearCompress(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name           string
		mv, mvu        float64
		from, to, peak float64
		want, wantPeak float64
	}{
		// 1e-3·(80 − 50) = 0.03.
		{"virgin", 1e-3, 2e-4, 50, 80, 50, 0.03, 80},
		// 2e-4·(60 − 50) + 1e-3·(80 − 60) = 0.002 + 0.02.
		{"crossing the peak", 1e-3, 2e-4, 50, 80, 60, 0.022, 80},
		// 2e-4·(60 − 80) = −0.004.
		{"unloading", 1e-3, 2e-4, 80, 60, 80, -0.004, 80},
		// No unloading modulus: rebound along mv, 1e-3·(−20).
		{"unloading along mv", 1e-3, 0, 80, 60, 80, -0.02, 80},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			got, peak := LinearCompress(tt.mv, tt.mvu, tt.from, tt.to, tt.peak)
			// Tolerance 1e-15: hand arithmetic, rounding only.
			if math.Abs(got-tt.want) > 1e-15 || peak != tt.wantPeak {
				t.Errorf("LinearCompress = %g, %g; want %g, %g (hand-worked, ±1e-15)", got, peak, tt.want, tt.wantPeak)
			}
		})
	}
}

// TestSeriesAgainstMath checks the series the time loop uses instead of
// the library: Exp against math.Exp and Point's logarithm of a nearby
// stress against math.Log10 (Go's math package as the reference library),
// on both sides of every branch: Exp within 2e-15 relative (the bound its
// doc states, y⁶/720 at |y| = 1e-2), the logarithm within 4e-16 (a few
// roundings).
func TestSeriesAgainstMath(t *testing.T) {
	for _, y := range []float64{0, 1e-9, -3e-5, 9.9e-5, -1e-4, 2e-4, -5e-3, 9.99e-3, -1e-2, 0.02, -0.7, 3} {
		if got, want := Exp(y), math.Exp(y); math.Abs(got-want) > 2e-15*want {
			t.Errorf("Exp(%g) = %.17g, math.Exp %.17g", y, got, want)
		}
		// ExpSmall, the series in line, claims exactly |y| < 1e-2 and
		// there agrees with Exp to the bit.
		v, ok := ExpSmall(y)
		if ok != (math.Abs(y) < 1e-2) || ok && v != Exp(y) {
			t.Errorf("ExpSmall(%g) = %.17g, %v; Exp %.17g", y, v, ok, Exp(y))
		}
	}
	for _, rel := range []float64{1e-12, -1e-9, 5e-5, -2e-4, 3e-3, -9.99e-3, 9.99e-3, 1.01e-2, -0.05, 0.5} {
		p := NewPoint(Curve{E0: 1, Cc: 0.5, Cr: 0.05}, 1, 37.3, 37.3)
		p.start()
		to := 37.3 * (1 + rel)
		if got, want := p.log10Of(to), math.Log10(to); math.Abs(got-want) > 4e-16*math.Abs(want) {
			t.Errorf("log10 of %.17g near 37.3: %.17g, math.Log10 %.17g", to, got, want)
		}
	}
}
