package fem

import (
	"math"
	"slices"
)

// MoveHeld moves the known values u[j] of the held nodes into the
// right-hand side: rhs[i] -= A[i][j]·u[j] for every held node j and free
// node i within the band. held lists the held node indices; a held row of
// rhs is left as it is. O(len(held)·kd).
func MoveHeld(rhs []float64, a *Band, u []float64, held []int) {
	MoveHeldSum(rhs, a, nil, 0, u, held)
}

// MoveHeldSum is MoveHeld for the matrix a + c·b (b nil: a alone), read
// entry by entry, so that the combination need not be formed.
func MoveHeldSum(rhs []float64, a, b *Band, c float64, u []float64, held []int) {
	n := len(u)
	for _, j := range held {
		for i := max(j-a.KD, 0); i <= min(j+a.KD, n-1); i++ {
			// A held row keeps its value: with one element both ends are
			// held and lie within the band of each other.
			if i == j || slices.Contains(held, i) {
				continue
			}
			v := a.At(i, j)
			if b != nil {
				v += c * b.At(i, j)
			}
			rhs[i] -= v * u[j]
		}
	}
}

// maxRefine is the most steps of iterative refinement Refine takes.
const maxRefine = 3

// Refine improves the solution h of K h = rhs by iterative refinement
// (Wilkinson 1963), reusing the factor f of the free rows lo … hi-1, for a
// stiffness matrix K whose every row sums to zero (a pure conduction
// operator). The held rows of rhs are ignored and those of h stay as they
// are. It allocates one vector.
//
// The factorisation computes its pivots as differences of conductances
// c/Δz, and where a highly conductive layer lies beside a much less
// conductive one the difference that carries the resistance of the tight
// layer is lost to rounding: with a contrast of 1e5 the solution, and so
// the layer fluxes, come out with relative errors near 1e-7. The residual
// is therefore computed in flux form, rᵢ = rhsᵢ − Σⱼ Kᵢⱼ (hⱼ − hᵢ) over
// j ≠ i, which equals rhs − K h because the rows sum to zero; the
// differences are exact where values are close, so the residual is
// accurate element by element and each step shrinks the error by the
// factor's relative accuracy. O(n·kd) per step.
func Refine(h, rhs []float64, a *Band, f *Factor, lo, hi int) {
	RefineWith(h, rhs, a, nil, nil, f, lo, hi)
}

// RefineWith is Refine for the matrix K + diag(extra), K a pure
// conduction operator (rows summing to zero) and extra a non-negative
// diagonal (a leakage at some nodes; nil: none), with the nodes listed
// in held (inside lo … hi-1, isolated in the factor by Band.Isolate)
// kept at their values. The residual is rᵢ = rhsᵢ − Σⱼ Kᵢⱼ (hⱼ − hᵢ) −
// extraᵢ hᵢ over j ≠ i, zero at the held rows. It allocates one vector.
func RefineWith(h, rhs []float64, a *Band, extra []float64, held []int, f *Factor, lo, hi int) {
	r := make([]float64, len(h))
	for range maxRefine {
		for i := lo; i < hi; i++ {
			s := rhs[i]
			for j := max(i-a.KD, 0); j <= min(i+a.KD, a.N-1); j++ {
				if j != i {
					s -= a.At(i, j) * (h[j] - h[i])
				}
			}
			if extra != nil {
				s -= extra[i] * h[i]
			}
			r[i] = s
		}
		for _, j := range held {
			if j >= lo && j < hi {
				r[j] = 0
			}
		}
		f.Solve(r)
		done := true
		for i := lo; i < hi; i++ {
			h[i] += r[i]
			if math.Abs(r[i]) > 1e-15*math.Abs(h[i]) {
				done = false
			}
		}
		if done {
			return
		}
	}
}
