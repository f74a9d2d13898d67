package fem

import (
	"math/rand/v2"
	"slices"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// TestHeldRuns checks the free block left by runs of held nodes from the
// ends, and that NewStepper refuses a held node inside the block.
func TestHeldRuns(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		held   []int
		lo, hi int
	}{
		{nil, 0, 6}, {[]int{0}, 1, 6}, {[]int{5}, 0, 5}, {[]int{0, 5}, 1, 5},
		{[]int{2, 0, 1, 5}, 3, 5}, {[]int{1}, 0, 6}, {[]int{0, 1, 2, 3, 4, 5}, 6, 6},
	} {
		if lo, hi := HeldRuns(6, c.held); lo != c.lo || hi != c.hi {
			t.Errorf("HeldRuns(6, %v) = %d, %d; want %d, %d", c.held, lo, hi, c.lo, c.hi)
		}
	}
	defer func() {
		if recover() == nil {
			t.Error("NewStepper took a held node inside the column")
		}
	}()
	NewStepper(NewBand(6, 1), NewBand(6, 1), []int{1}, true)
}

// TestIsolateRefineWith solves K h = f on a random conduction band (linear
// and quadratic rows) with a leakage diagonal at both ends, a held end
// and a held node inside the column (Band.Isolate), refined by
// RefineWith, against a dense solve of the reduced system by gonum's
// LU (mat.Dense.Solve, an independent solver). Tolerance 1e-10 relative
// to the largest value: rounding of well-conditioned systems.
func TestIsolateRefineWith(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(15, 2))
	for _, order := range []int{1, 2} {
		th := []float64{1.3, 0.7, 2.1}
		m := NewMesh(th, order, 0.25, 2)
		n := m.Nodes()
		ks := []float64{1 + rng.Float64(), 5 + rng.Float64(), 0.5 + rng.Float64()}
		k := NewBand(n, order)
		m.Assemble(k, func(e int, _ float64) float64 { return ks[m.Layer[e]] }, false)
		extra := make([]float64, n)
		extra[0], extra[n-1] = 0.8, 2.5
		rhs := make([]float64, n)
		rhs[0], rhs[n-1] = 0.8*1.5, 2.5*-0.5 // leakage toward heads 1.5 and −0.5
		inner := n / 2
		held := []int{n - 1, inner}
		extra[n-1] = 0 // the base is held instead
		h := make([]float64, n)
		h[n-1], h[inner] = 0.25, -2
		// Dense reference: the free nodes only.
		var free []int
		for i := range n {
			if !slices.Contains(held, i) {
				free = append(free, i)
			}
		}
		A := mat.NewDense(len(free), len(free), nil)
		b := mat.NewVecDense(len(free), nil)
		for r, i := range free {
			v := rhs[i]
			for _, j := range held {
				v -= k.At(i, j) * h[j]
			}
			b.SetVec(r, v)
			for c, j := range free {
				a := k.At(i, j)
				if i == j {
					a += extra[i]
				}
				A.Set(r, c, a)
			}
		}
		var x mat.VecDense
		if err := x.SolveVec(A, b); err != nil {
			t.Fatal(err)
		}
		// The band path: MoveHeld, Isolate the inner node, factorise,
		// refine.
		kf := &Band{N: k.N, KD: k.KD, AB: slices.Clone(k.AB)}
		for i, a := range extra {
			if a != 0 {
				kf.Add(i, i, a)
			}
		}
		sol := slices.Clone(rhs)
		MoveHeld(sol, kf, h, held)
		kf.Isolate(inner, 1)
		sol[inner] = h[inner]
		lo, hi := HeldRuns(n, held)
		var f Factor
		if err := Factorize(&f, kf, lo, hi); err != nil {
			t.Fatal(err)
		}
		f.Solve(sol)
		copy(h[lo:hi], sol[lo:hi])
		h[inner] = -2
		RefineWith(h, rhs, k, extra, []int{inner}, &f, lo, hi)
		scale := 0.0
		for r := range free {
			scale = max(scale, abs(x.AtVec(r)))
		}
		for r, i := range free {
			if d := abs(h[i] - x.AtVec(r)); d > 1e-10*scale {
				t.Errorf("order %d, node %d: %.15g, dense %.15g", order, i, h[i], x.AtVec(r))
			}
		}
		if h[inner] != -2 {
			t.Errorf("order %d: the held inner node moved to %g", order, h[inner])
		}
	}
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}
