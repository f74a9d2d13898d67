package fem

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"
)

// TestAssembleConstant checks the exact element matrices against Assemble
// (Gauss quadrature, exact for these polynomials; the two share only the
// mesh) and Lump, for both orders and every form, on a mesh of unequal
// elements with random element coefficients. Tolerance 1e-13 relative to
// the largest entry: rounding only.
func TestAssembleConstant(t *testing.T) {
	t.Parallel()
	rnd := rand.New(rand.NewPCG(1, 1))
	for _, order := range []int{1, 2} {
		for _, form := range []struct {
			name       string
			mass, lump bool
		}{{"stiffness", false, false}, {"mass", true, false}, {"lumped mass", true, true}} {
			t.Run(fmt.Sprintf("order %d %s", order, form.name), func(t *testing.T) {
				t.Parallel()
				m := NewMesh([]float64{0.7, 2.3, 1.1}, order, 0.3, 3)
				c := make([]float64, m.Elements())
				for e := range c {
					c[e] = math.Pow(10, 4*rnd.Float64()-2)
				}
				want := NewBand(m.Nodes(), order)
				m.Assemble(want, func(e int, _ float64) float64 { return c[e] }, form.mass)
				if form.lump {
					want.Lump()
				}
				got := NewBand(m.Nodes(), order)
				for i := range got.AB {
					got.AB[i] = 99 // overwritten, not added to
				}
				m.AssembleConstant(got, c, form.mass, form.lump)
				scale := 0.0
				for _, v := range want.AB {
					scale = math.Max(scale, math.Abs(v))
				}
				for i := range want.AB {
					if math.Abs(got.AB[i]-want.AB[i]) > 1e-13*scale {
						t.Fatalf("AB[%d] = %g, want %g (Assemble, ±1e-13 of the largest entry)", i, got.AB[i], want.AB[i])
					}
				}
			})
		}
	}
}
