package series_test

import (
	"fmt"
	"log"

	"porelight/solver/internal/series"
)

func ExampleTvForU() {
	for _, U := range []float64{0.5, 0.9} {
		fmt.Printf("U = %.0f %%: Tv = %.4f\n", 100*U, series.TvForU(U))
	}
	// Output:
	// U = 50 %: Tv = 0.1967
	// U = 90 %: Tv = 0.8481
}

func ExampleTerzaghiExcess() {
	// Mid-depth of a 4 m layer drained at both faces: Z = 1 (the centre is
	// the impermeable face of each 2 m drainage path).
	fmt.Printf("%.4f\n", series.TerzaghiExcess(1, 0.2))
	// Output:
	// 0.7723
}

func ExampleNewLayered() {
	// Soft clay over a stiffer, more permeable silt, drained at the top.
	layers := []series.Layer{
		{Thickness: 4, K: 1e-9, Mv: 1e-3},
		{Thickness: 6, K: 1e-7, Mv: 1e-4},
	}
	s, err := series.NewLayered(layers, 9.81, true, false, 0) // 0: choose the terms
	if err != nil {
		log.Fatal(err)
	}
	t := 100.0 // days
	fmt.Printf("u/u0 at 2 m: %.4f\n", s.Excess(2, t))
	fmt.Printf("Us = %.4f, Up = %.4f\n", s.Us(t), s.Up(t))
	fmt.Printf("accurate to 1e-4 from t = %.2g days\n", s.MinTime())
	// Output:
	// u/u0 at 2 m: 0.8682
	// Us = 0.2302, Up = 0.1069
	// accurate to 1e-4 from t = 2.3 days
}
