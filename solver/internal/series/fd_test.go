package series

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"
)

// fdElems returns the number of elements per layer for a refinement level:
// about 10 per metre, at least 2 per layer, times ref.
func fdElems(layers []Layer, ref int) []int {
	n := make([]int, len(layers))
	for i, l := range layers {
		n[i] = ref * max(2, int(math.Round(10*l.Thickness)))
	}
	return n
}

// fdResult is a finite difference solution at one time.
type fdResult struct {
	z, u   []float64 // nodes and u at them
	mvMean float64   // ∫ mv u dz / ∫ mv dz
	mean   float64   // ∫ u dz / H
}

// fdColumn is an independent reference for the series, written from the
// equations rather than from the series: it solves
//
//	mv ∂u/∂t = ∂/∂z (κ ∂u/∂z) + mv r(t),   κ = k·86400/γw (t in days),
//
// from u = u0 (u = 0 at drained ends) with linear elements and a lumped
// (diagonal) mass, which is the classical three-point finite volume scheme
// with nodes on every interface: second order in space for nodal values.
// Time steps are Crank–Nicolson after four backward Euler half steps to
// damp the start-up ringing (Rannacher 1984). elems[i] is the number of
// equal elements in layer i; the means are trapezoidal
// integrals, exact for the piecewise-linear field. r may be nil (no load).
func fdColumn(layers []Layer, gammaW float64, top, bottom bool, elems []int, steps int, tEnd, u0 float64, r func(t float64) float64) fdResult {
	var z, mv, kap []float64 // nodes; mv, κ and length of each element
	var hs []float64
	z = append(z, 0)
	for i, l := range layers {
		n := elems[i]
		for range n {
			h := l.Thickness / float64(n)
			z = append(z, z[len(z)-1]+h)
			hs = append(hs, h)
			mv = append(mv, l.Mv)
			kap = append(kap, l.K*86400/gammaW)
		}
	}
	N := len(z)
	// Lumped mass M and tridiagonal stiffness K (lower l, diagonal d, upper = l).
	M := make([]float64, N)
	d := make([]float64, N)
	off := make([]float64, N-1) // K[i][i+1]
	for e, h := range hs {
		M[e] += mv[e] * h / 2
		M[e+1] += mv[e] * h / 2
		c := kap[e] / h
		d[e] += c
		d[e+1] += c
		off[e] -= c
	}
	fixed := func(i int) bool { return i == 0 && top || i == N-1 && bottom }
	u := make([]float64, N)
	for i := range u {
		if !fixed(i) {
			u[i] = u0
		}
	}
	if r == nil {
		r = func(float64) float64 { return 0 }
	}
	// step advances u by dt with weight theta: (M + θΔt K) u' = (M − (1−θ)Δt K) u + M Δσ.
	a, b, c, rhs := make([]float64, N), make([]float64, N), make([]float64, N), make([]float64, N)
	step := func(t, dt, theta float64) {
		rm := r(t + dt/2) // the load increment ∫r dt, exact for a rate constant over the step
		for i := range N {
			ku := d[i] * u[i]
			if i > 0 {
				ku += off[i-1] * u[i-1]
			}
			if i < N-1 {
				ku += off[i] * u[i+1]
			}
			rhs[i] = M[i]*u[i] - (1-theta)*dt*ku + dt*M[i]*rm
			b[i] = M[i] + theta*dt*d[i]
			a[i], c[i] = 0, 0
			if i > 0 {
				a[i] = theta * dt * off[i-1]
			}
			if i < N-1 {
				c[i] = theta * dt * off[i]
			}
			if fixed(i) {
				a[i], b[i], c[i], rhs[i] = 0, 1, 0, 0
			}
		}
		thomas(a, b, c, rhs, u)
	}
	dt := tEnd / float64(steps)
	t := 0.0
	for range 4 {
		step(t, dt/2, 1)
		t += dt / 2
	}
	for k := 2; k < steps; k++ {
		step(t, dt, 0.5)
		t += dt
	}
	var imv, iu, mvTot, H float64
	for e, h := range hs {
		imv += mv[e] * h * (u[e] + u[e+1]) / 2
		iu += h * (u[e] + u[e+1]) / 2
		mvTot += mv[e] * h
		H += h
	}
	return fdResult{z: z, u: u, mvMean: imv / mvTot, mean: iu / H}
}

// thomas solves the tridiagonal system a[i]x[i−1] + b[i]x[i] + c[i]x[i+1] = r[i]
// into x; b and r are overwritten.
func thomas(a, b, c, r, x []float64) {
	n := len(b)
	for i := 1; i < n; i++ {
		w := a[i] / b[i-1]
		b[i] -= w * c[i-1]
		r[i] -= w * r[i-1]
	}
	x[n-1] = r[n-1] / b[n-1]
	for i := n - 2; i >= 0; i-- {
		x[i] = (r[i] - c[i]*x[i+1]) / b[i]
	}
}

// fixed20 integrates f over [a, b] by 20-point Gauss–Legendre (gonum).
func fixed20(f func(float64) float64, a, b float64) float64 {
	return quad.Fixed(f, a, b, 20, nil, 0)
}
