package fem

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/blas"
)

// TestSolveBand2 checks the two-super-diagonal solve against gonum's
// Dpbtrs on random symmetric positive definite band matrices of sizes at
// the edges: the answers agree to 1e-12 relative and the normalised
// residual |A x − b| / (n |A| |x|) is at rounding level (LAPACK's own
// test criterion, as in gonum's testlapack).
func TestSolveBand2(t *testing.T) {
	t.Parallel()
	rnd := rand.New(rand.NewPCG(1, 1))
	for _, n := range []int{1, 2, 3, 4, 5, 10, 51, 100, 1001} {
		a := NewBand(n, 2)
		for i := range n {
			a.Add(i, i, 5+rnd.Float64())
			for j := i + 1; j <= min(i+2, n-1); j++ {
				a.Add(i, j, rnd.Float64()-0.5)
			}
		}
		b := make([]float64, n)
		for i := range b {
			b[i] = rnd.NormFloat64()
		}
		var f Factor
		if err := Factorize(&f, a, 0, n); err != nil {
			t.Fatal(err)
		}
		x := append([]float64(nil), b...)
		f.Solve(x)
		want := append([]float64(nil), b...)
		lapack.Dpbtrs(blas.Upper, n, 2, 1, f.ab, 3, want, 1)
		ax := make([]float64, n)
		a.MulVec(ax, x)
		var res, norm, xn float64
		for i := range n {
			if math.Abs(x[i]-want[i]) > 1e-12*math.Max(1, math.Abs(want[i])) {
				t.Fatalf("n=%d: x[%d] = %g, Dpbtrs %g", n, i, x[i], want[i])
			}
			res = math.Max(res, math.Abs(ax[i]-b[i]))
			xn = math.Max(xn, math.Abs(x[i]))
			norm = math.Max(norm, 7)
		}
		if r := res / (float64(n) * norm * xn); r > 1e-15 {
			t.Errorf("n=%d: normalised residual %g", n, r)
		}
	}
}

// TestSolveTridiagonal checks the kd = 1 solve against gonum's Dpttrs on
// random symmetric positive definite tridiagonal matrices of sizes at the
// edges: it does Dpttrs's arithmetic in Dpttrs's order, so the answers
// must agree to the bit, and the normalised residual |A x − b| /
// (n |A| |x|) is at rounding level (LAPACK's test criterion, as in
// gonum's testlapack).
func TestSolveTridiagonal(t *testing.T) {
	t.Parallel()
	rnd := rand.New(rand.NewPCG(1, 1))
	for _, n := range []int{1, 2, 3, 4, 5, 10, 51, 100, 1001} {
		a := NewBand(n, 1)
		for i := range n {
			a.Add(i, i, 3+rnd.Float64())
			if i+1 < n {
				a.Add(i, i+1, rnd.Float64()-0.5)
			}
		}
		b := make([]float64, n)
		for i := range b {
			b[i] = rnd.NormFloat64()
		}
		var f Factor
		if err := Factorize(&f, a, 0, n); err != nil {
			t.Fatal(err)
		}
		x := append([]float64(nil), b...)
		f.Solve(x)
		want := append([]float64(nil), b...)
		lapack.Dpttrs(n, 1, f.d, f.e, want, 1)
		ax := make([]float64, n)
		a.MulVec(ax, x)
		var res, xn float64
		for i := range n {
			if x[i] != want[i] {
				t.Fatalf("n=%d: x[%d] = %v, Dpttrs %v", n, i, x[i], want[i])
			}
			res = math.Max(res, math.Abs(ax[i]-b[i]))
			xn = math.Max(xn, math.Abs(x[i]))
		}
		if r := res / (float64(n) * 5 * xn); r > 1e-15 {
			t.Errorf("n=%d: normalised residual %g", n, r)
		}
	}
}
