// Package pointload integrates Boussinesq's (1885) point-load solution
// σz = 3P z³/(2π R⁵) numerically over a loaded area, as an independent
// reference for the closed forms of package load in its tests. It is
// slow by design (composite Gauss–Legendre quadrature in two dimensions,
// hundreds of thousands of evaluations per value) and never used by the
// solver.
package pointload

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"
)

// Kernel is σz per unit point load at depth z and horizontal distance r.
func Kernel(r, z float64) float64 {
	R2 := r*r + z*z
	return 3 * z * z * z / (2 * math.Pi * R2 * R2 * math.Sqrt(R2))
}

// Panels and Points set the composite rule: each interval between two
// breaks is cut into Panels pieces integrated with Points Gauss–Legendre
// points.
const (
	Panels = 20
	Points = 12
)

// integrate is ∫ f over [a, b], cut at every break inside it.
func integrate(f func(float64) float64, a, b float64, breaks ...float64) float64 {
	cuts := []float64{a}
	for _, c := range breaks {
		if c > a && c < b {
			cuts = append(cuts, c)
		}
	}
	cuts = append(cuts, b)
	// sort the few cuts (insertion)
	for i := 1; i < len(cuts); i++ {
		for j := i; j > 0 && cuts[j] < cuts[j-1]; j-- {
			cuts[j], cuts[j-1] = cuts[j-1], cuts[j]
		}
	}
	s := 0.0
	for i := 1; i < len(cuts); i++ {
		lo, hi := cuts[i-1], cuts[i]
		h := (hi - lo) / Panels
		for k := range Panels {
			s += quad.Fixed(f, lo+float64(k)*h, lo+float64(k+1)*h, Points, quad.Legendre{}, 0)
		}
	}
	return s
}

// Area is ∫∫ p(ξ, η) Kernel dξ dη over ξ in [x0, x1], η in [y0, y1] for a
// point at the origin of the plan and depth z; infinite η bounds are
// mapped by η = z tan t. xbreaks are the ξ where p has a kink.
func Area(p func(xi, eta float64) float64, x0, x1, y0, y1, z float64, xbreaks ...float64) float64 {
	inner := func(xi float64) float64 {
		if math.IsInf(y0, -1) && math.IsInf(y1, 1) {
			g := func(t float64) float64 {
				eta := z * math.Tan(t)
				c := math.Cos(t)
				return p(xi, eta) * Kernel(math.Hypot(xi, eta), z) * z / (c * c)
			}
			return integrate(g, -math.Pi/2, math.Pi/2, 0)
		}
		g := func(eta float64) float64 { return p(xi, eta) * Kernel(math.Hypot(xi, eta), z) }
		return integrate(g, y0, y1, 0)
	}
	return integrate(inner, x0, x1, append(xbreaks, 0)...)
}

// Disc is ∫∫ Kernel over a disc of radius a centred at distance d from
// the point, at depth z, in polar coordinates about the disc's centre.
func Disc(a, d, z float64) float64 {
	inner := func(rho float64) float64 {
		g := func(th float64) float64 {
			x := d + rho*math.Cos(th)
			y := rho * math.Sin(th)
			return Kernel(math.Hypot(x, y), z) * rho
		}
		return integrate(g, 0, 2*math.Pi)
	}
	return integrate(inner, 0, a)
}
