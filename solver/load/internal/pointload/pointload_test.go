package pointload

import (
	"math"
	"testing"
)

// TestWholePlane checks the quadrature on the one integral known in
// closed form without package load: Boussinesq's kernel carries the whole
// point load, ∫∫ σz dA = P over the plane at every depth (equilibrium),
// and a disc of radius a on its axis carries 1 − z³/(a² + z²)^(3/2)
// (the kernel integrated over r by hand). Tolerances 1e-7 and 1e-9.
func TestWholePlane(t *testing.T) {
	t.Parallel()
	inf := math.Inf(1)
	one := func(_, _ float64) float64 { return 1 }
	for _, z := range []float64{0.3, 1, 7} {
		// |x| ≤ 50 z, y mapped to infinity: the two tails beyond carry
		// (4/3π)(z/x)³ of the load to first order (series of the
		// line-load integral, by hand).
		got := Area(one, -50*z, 50*z, -inf, inf, z)
		if want := 1 - 4/(3*math.Pi)*math.Pow(1.0/50, 3); math.Abs(got-want) > 1e-7 {
			t.Errorf("z = %g: plane integral %.9f, want %.9f", z, got, want)
		}
		disc := Disc(2, 0, z)
		want := 1 - z*z*z/math.Pow(4+z*z, 1.5)
		if math.Abs(disc-want) > 1e-9 {
			t.Errorf("z = %g: disc %g, want %g", z, disc, want)
		}
	}
}
