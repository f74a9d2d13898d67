package series

import (
	"math"
	"testing"
)

// TestLeakyLimits checks LeakyU against its limits: Terzaghi's U (this
// package's TerzaghiU, itself checked against the printed table) for a
// resistance that vanishes (Bi = 1e8: within 1e-6), and the lumped layer
// 1 − exp(−Bi Tv) for a large resistance (Bi = 1e-4: the profile stays
// nearly uniform; within 1e-4 of U), and that it lies between them.
func TestLeakyLimits(t *testing.T) {
	for _, Tv := range []float64{0.01, 0.05, 0.2, 0.5, 1, 2} {
		if got, want := LeakyU(Tv, 1e8), TerzaghiU(Tv); math.Abs(got-want) > 1e-6 {
			t.Errorf("Tv %g, Bi 1e8: U %.8f, Terzaghi %.8f", Tv, got, want)
		}
		for _, Bi := range []float64{0.3, 3, 30} {
			if u := LeakyU(Tv, Bi); !(u < TerzaghiU(Tv)) || !(u > 0) {
				t.Errorf("Tv %g, Bi %g: U %.6f is not between 0 and Terzaghi's %.6f", Tv, Bi, u, TerzaghiU(Tv))
			}
		}
	}
	for _, Tv := range []float64{100, 1000, 5000} {
		want := 1 - math.Exp(-1e-4*Tv)
		if got := LeakyU(Tv, 1e-4); math.Abs(got-want) > 1e-4*want {
			t.Errorf("Tv %g, Bi 1e-4: U %.8f, lumped %.8f", Tv, got, want)
		}
	}
	if tv := LeakyTv(0.5, 1e8); math.Abs(tv-TvForU(0.5)) > 1e-5 {
		t.Errorf("LeakyTv(0.5, ∞) = %.6f, TvForU %.6f", tv, TvForU(0.5))
	}
}
