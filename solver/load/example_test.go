package load_test

import (
	"fmt"

	"porelight/solver/load"
)

// A 20 m wide embankment crest with 2:1 side slopes 3 m high (run 6 m):
// the added stress under its centre falls off with depth.
func ExampleArea_Factor() {
	a := load.Area{Shape: load.Embankment, Width: 20, Run: 6}
	for _, z := range []float64{0, 5, 15, 30} {
		fmt.Printf("z = %2.0f m: Δσ/q = %.3f\n", z, a.Factor(z))
	}
	// Output:
	// z =  0 m: Δσ/q = 1.000
	// z =  5 m: Δσ/q = 0.978
	// z = 15 m: Δσ/q = 0.764
	// z = 30 m: Δσ/q = 0.490
}
