package soil

import (
	"math"
	"testing"
)

// TestCompress checks the e–log σ' path against the compression index
// formulas of Terzaghi & Peck (1967): s = C·H/(1+e0)·log10(σ'b/σ'a) with
// Cr below the preconsolidation stress and Cc beyond it, Cr on unloading.
func TestCompress(t *testing.T) {
	t.Parallel()
	c := Curve{E0: 1.2, Cc: 0.45, Cr: 0.05}
	tests := []struct {
		name           string
		from, to, peak float64
		want, wantPeak float64 // Δe and the largest stress afterwards
	}{
		// Hand-worked: 0.05·log10(60/40) + 0.45·log10(100/60)
		// = 0.05·0.176091 + 0.45·0.221849 = 0.0088046 + 0.0998320.
		{"crossing σ'p", 40, 100, 60, 0.1086366, 100},
		// Normally consolidated: 0.45·log10(2) = 0.1354634.
		{"virgin", 50, 100, 50, 0.1354634, 100},
		// Recompression only: 0.05·log10(55/40) = 0.0069152.
		{"below σ'p", 40, 55, 60, 0.0069152, 60},
		// Unloading swells along Cr: −0.05·log10(100/70) = −0.0077451.
		{"unloading", 100, 70, 100, -0.0077451, 100},
		{"no change", 40, 40, 60, 0, 60},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			de, peak := Compress(c, tt.from, tt.to, tt.peak)
			// Tolerance 1e-7: the hand values are rounded to 7 decimals.
			if math.Abs(de-tt.want) > 1e-7 || peak != tt.wantPeak {
				t.Errorf("Compress(%g→%g, peak %g) = %.7f, %g; want %.7f, %g (Terzaghi & Peck 1967, hand-worked, ±1e-7)",
					tt.from, tt.to, tt.peak, de, peak, tt.want, tt.wantPeak)
			}
		})
	}
}

// TestPointFollowsCompress: the log-space path of a Point equals the
// Compress formula (Terzaghi & Peck 1967) step by step, and Toward the
// move before it is made, through loading
// across σ'p, unloading, reloading and past the old peak (±1e-12).
func TestPointFollowsCompress(t *testing.T) {
	t.Parallel()
	c := Curve{E0: 1.2, Cc: 0.45, Cr: 0.05}
	s := NewPoint(c, 1, 40, 60)
	sig, peak, want := 40.0, 60.0, 0.0
	for _, to := range []float64{45, 55, 60, 80, 100, 100, 70, 50, 90, 120, 0.01, 30} {
		de, p := Compress(c, sig, to, peak)
		if got := s.Toward(to); math.Abs(got-de) > 1e-12 {
			t.Fatalf("Toward(%g kPa) = %.15f, Compress gives %.15f", to, got, de)
		}
		want += de
		sig, peak = max(to, MinEffective), p
		s.MoveTo(to)
		if math.Abs(s.de-want) > 1e-12 {
			t.Fatalf("after moving to %g kPa: Δe = %.15f, Compress gives %.15f", to, s.de, want)
		}
		if got := s.Settlement(); math.Abs(got-want/(1+c.E0)) > 1e-12 {
			t.Fatalf("after moving to %g kPa: settlement %.15f m, want Δe/(1+e0) = %.15f m", to, got, want/(1+c.E0))
		}
	}
}

// TestSecondary: Mesri's (1973) Cα H/(1+ep) log10(t/tp), hand-worked:
// 0.01 · 4 / 2 · log10(10) = 0.02 m; nothing before tp (±1e-15).
func TestSecondary(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct{ t, tp, want float64 }{
		{1000, 100, 0.02}, {100, 100, 0}, {50, 100, 0}, {1000, 0, 0},
	} {
		if got := Secondary(0.01, 4, 1, tc.t, tc.tp); math.Abs(got-tc.want) > 1e-15 {
			t.Errorf("Secondary(t=%g, tp=%g) = %g, want %g", tc.t, tc.tp, got, tc.want)
		}
	}
}
