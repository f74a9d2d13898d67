package solver_test

import (
	"fmt"

	"porelight/solver"
)

// A clay layer over a sand whose water stands 1 m above ground (artesian):
// steady upward seepage, its flux, the heave factor of each layer and the
// uplift check under the clay. Invented column. By hand (Darcy 1856;
// Terzaghi 1943): ΣH/k = 2/1e-8 + 4/2e-6 = 2.02e8 s, q = 1/2.02e8 =
// 4.950e-9 m/s up, k = 6/2.02e8 = 2.970e-8 m/s; clay i = 0.4950, ic =
// 8.19/9.81 = 0.8349, F = 1.686; sand i = 0.002475, F = 1.0387/0.002475 =
// 419.6; at 2 m u = 9.81 × (0.9901 + 2) = 29.33 kPa, σ = 36 kPa.
func ExampleSolve() {
	p, err := solver.Decode([]byte(`{
	  "format": "porelight/1",
	  "layers": [
	    {"name": "Clay", "thickness": 2, "gammaSat": 18, "k": 1e-8, "mv": 5e-4},
	    {"name": "Sand", "thickness": 4, "gammaSat": 20, "k": 2e-6, "mv": 5e-5}
	  ],
	  "waterTable": 0,
	  "top": {"drained": true},
	  "bottom": {"drained": true, "head": 1.0}
	}`))
	if err != nil {
		fmt.Println(err)
		return
	}
	r, err := solver.Solve(p, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	s := r.Steady
	fmt.Printf("flux %.4g m/s (negative: upward)\n", s.Flux)
	fmt.Printf("equivalent k %.4g m/s\n", s.KEquivalent)
	for _, l := range s.Layers {
		fmt.Printf("%s %g–%g m: gradient %.4g, heave factor %.4g\n", l.Name, l.Top, l.Bottom, l.Gradient, *l.HeaveFactor)
	}
	for _, u := range s.Uplift {
		fmt.Printf("uplift at %g m: total stress %.2f kPa, water pressure %.2f kPa, factor %.3f\n", u.Depth, u.Total, u.Pore, *u.Factor)
	}
	// Output:
	// flux -4.95e-09 m/s (negative: upward)
	// equivalent k 2.97e-08 m/s
	// Clay 0–2 m: gradient 0.495, heave factor 1.686
	// Sand 2–6 m: gradient 0.002475, heave factor 419.6
	// uplift at 2 m: total stress 36.00 kPa, water pressure 29.33 kPa, factor 1.227
}
