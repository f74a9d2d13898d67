package fem

// Direct tests of the kernels against dense references, in the manner of
// gonum's lapack/testlapack: random symmetric positive definite band
// matrices from a fixed seed, sizes at the edges and around Dpttrf's
// four-way unrolled loop, and normalised residuals rather than stored
// outputs. The thresholds follow LAPACK's test criteria (Anderson et al.
// 1999, LAPACK Users' Guide, 3rd ed., and the test driver dchkpb with its
// input threshold THRESH = 30): a ratio such as
// ‖UᵀU − A‖₁ / (n·‖A‖₁·ε) is O(1) for a backward stable algorithm, and
// 30 leaves room for the constants in the error bounds without letting a
// wrong term (a ratio of 1/ε) through.

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"gonum.org/v1/gonum/mat"
)

const (
	eps = 0x1p-52 // float64 machine epsilon (unit roundoff is ε/2)
	// thresh is LAPACK's pass/fail threshold for normalised residuals
	// (dchkpb, THRESH = 30 in the distributed dtest.in).
	thresh = 30
)

// kernelSizes are the matrix orders of the kernel tests: the edges, the
// sizes around Dpttrf's four-way unrolled loop (51–54 cover every
// remainder n−1 mod 4), and two larger ones.
var kernelSizes = []int{0, 1, 2, 3, 4, 5, 10, 51, 52, 53, 54, 100, 1001}

// randBand returns a random symmetric positive definite n×n band matrix
// with kd super-diagonals: off-diagonals uniform in [−1, 1], the diagonal
// larger than the row's absolute off-diagonal sum (so positive definite
// by Gershgorin), then scaled symmetrically, S·A·S with Sᵢᵢ = 2^U(−4, 4),
// so that rows differ in size by up to 2⁸·2⁸.
func randBand(rnd *rand.Rand, n, kd int) *Band {
	a := NewBand(n, kd)
	off := make([]float64, n)
	for i := range n {
		for j := i + 1; j <= min(i+kd, n-1); j++ {
			v := 2*rnd.Float64() - 1
			a.Add(i, j, v)
			off[i] += math.Abs(v)
			off[j] += math.Abs(v)
		}
	}
	s := make([]float64, n)
	for i := range n {
		a.Add(i, i, off[i]+0.5+rnd.Float64())
		s[i] = math.Exp2(8*rnd.Float64() - 4)
	}
	for i := range n {
		for j := i; j <= min(i+kd, n-1); j++ {
			a.AB[i*(kd+1)+j-i] *= s[i] * s[j]
		}
	}
	return a
}

// diagBand returns a band of shape n, kd with a random positive diagonal
// and zero off-diagonals (a lumped capacity matrix).
func diagBand(rnd *rand.Rand, n, kd int) *Band {
	a := NewBand(n, kd)
	for i := range n {
		a.Add(i, i, 0.5+rnd.Float64())
	}
	return a
}

// dense returns A as a plain n×n matrix, read through At.
func dense(a *Band) [][]float64 {
	d := make([][]float64, a.N)
	for i := range d {
		d[i] = make([]float64, a.N)
		for j := range d[i] {
			d[i][j] = a.At(i, j)
		}
	}
	return d
}

func randVec(rnd *rand.Rand, n int) []float64 {
	v := make([]float64, n)
	for i := range v {
		v[i] = rnd.NormFloat64()
	}
	return v
}

// norm1 is the 1-norm (largest absolute column sum) of the block lo … hi-1
// of a dense symmetric matrix.
func norm1(a [][]float64, lo, hi int) float64 {
	w := 0.0
	for j := lo; j < hi; j++ {
		s := 0.0
		for i := lo; i < hi; i++ {
			s += math.Abs(a[i][j])
		}
		w = max(w, s)
	}
	return w
}

// TestThetaRHS checks ThetaRHS and BandThetaRHS against the dense product
// dst = M (u + ds) − c·K u, componentwise: |dst_i − ref_i| / scale_i with
// scale_i = Σⱼ |Mᵢⱼ||uⱼ + dsⱼ| + |c| Σⱼ |Kᵢⱼ||uⱼ|. Both sides sum the same
// m = 2(2kd+1) products in different orders, so each is within γ_m·scale_i
// of the exact value (Higham 2002, Accuracy and Stability of Numerical
// Algorithms, 2nd ed., eq. 3.5; γ_m = mε/2/(1 − mε/2)); the bound checked is
// their sum, (m+1)·ε. A dropped or misplaced term errs by O(1) in this
// ratio.
func TestThetaRHS(t *testing.T) {
	t.Parallel()
	type kernel struct {
		name   string
		kd     int
		lumped bool // M diagonal
		band   bool // BandThetaRHS (else ThetaRHS, which needs lumped, kd = 1)
	}
	kernels := []kernel{
		{"ThetaRHS, lumped M", 1, true, false},
		{"BandThetaRHS kd=1, lumped M", 1, true, true},
		{"BandThetaRHS kd=1, band M", 1, false, true},
		{"BandThetaRHS kd=2, lumped M", 2, true, true},
		{"BandThetaRHS kd=2, band M", 2, false, true},
		{"BandThetaRHS kd=3, band M", 3, false, true},
	}
	for _, kc := range kernels {
		for _, withDS := range []bool{false, true} {
			t.Run(fmt.Sprintf("%s, ds=%v", kc.name, withDS), func(t *testing.T) {
				t.Parallel()
				rnd := rand.New(rand.NewPCG(1, 1))
				worst := 0.0
				for _, n := range kernelSizes {
					var m *Band
					if kc.lumped {
						m = diagBand(rnd, n, kc.kd)
						if !kc.band {
							// ThetaRHS must read only the first band
							// column of d: garbage elsewhere.
							for i := range n {
								m.AB[i*(kc.kd+1)+1] = math.NaN()
							}
						}
					} else {
						m = randBand(rnd, n, kc.kd)
					}
					k := randBand(rnd, n, kc.kd)
					u := randVec(rnd, n)
					var ds []float64
					if withDS {
						ds = randVec(rnd, n)
					}
					c := 0.1 + rnd.Float64()
					dst := make([]float64, n)
					for i := range dst {
						dst[i] = math.NaN() // dst is written, not added to
					}
					if kc.band {
						BandThetaRHS(dst, u, ds, m, k, c)
					} else {
						ThetaRHS(dst, u, ds, m.AB, k.AB, c)
					}
					md, kdn := dense(m), dense(k)
					if !kc.band {
						md = dense(diagOnly(m))
					}
					for i := range n {
						ref, scale := 0.0, 0.0
						for j := range n {
							v := u[j]
							if ds != nil {
								v += ds[j]
							}
							ref += md[i][j]*v - c*kdn[i][j]*u[j]
							scale += math.Abs(md[i][j]*v) + math.Abs(c*kdn[i][j]*u[j])
						}
						r := math.Abs(dst[i]-ref) / scale
						if !(r <= float64(2*(2*kc.kd+1)+1)*eps) {
							t.Fatalf("n=%d: dst[%d] = %g, dense %g: error %.3g·scale, over %d ε",
								n, i, dst[i], ref, r, 2*(2*kc.kd+1)+1)
						}
						worst = max(worst, r/eps)
					}
				}
				t.Logf("worst componentwise error %.2f ε", worst)
			})
		}
	}
}

// diagOnly returns a copy of a with its off-diagonals cleared.
func diagOnly(a *Band) *Band {
	d := NewBand(a.N, a.KD)
	for i := range a.N {
		d.AB[i*(a.KD+1)] = a.AB[i*(a.KD+1)]
	}
	return d
}

// blockSum returns the dense matrix a + c·b (b nil: a).
func blockSum(a, b *Band, c float64) [][]float64 {
	d := dense(a)
	if b != nil {
		db := dense(b)
		for i := range d {
			for j := range d[i] {
				d[i][j] += c * db[i][j]
			}
		}
	}
	return d
}

// reconstruct returns the product of the factor f of the block lo … hi-1
// as a dense matrix in whole-matrix numbering (zero outside the block):
// L·D·Lᵀ for kd = 1 (L unit lower bidiagonal with subdiagonal e, as
// Dpttrf leaves it) and UᵀU otherwise (U upper with kd super-diagonals,
// Dpbtrf's storage).
func reconstruct(f *Factor, nn int) [][]float64 {
	r := make([][]float64, nn)
	for i := range r {
		r[i] = make([]float64, nn)
	}
	n, lo := f.n, f.lo
	if f.kd == 1 {
		for i := range n {
			v := f.d[i]
			if i > 0 {
				v += f.e[i-1] * f.e[i-1] * f.d[i-1]
			}
			r[lo+i][lo+i] = v
			if i+1 < n {
				r[lo+i][lo+i+1] = f.e[i] * f.d[i]
				r[lo+i+1][lo+i] = f.e[i] * f.d[i]
			}
		}
		return r
	}
	ld := f.kd + 1
	u := func(i, j int) float64 { // U[i][j], zero outside the band
		if j < i || j-i > f.kd {
			return 0
		}
		return f.ab[i*ld+j-i]
	}
	for i := range n {
		for j := i; j <= min(i+f.kd, n-1); j++ {
			s := 0.0
			for k := max(0, j-f.kd); k <= i; k++ {
				s += u(k, i) * u(k, j)
			}
			r[lo+i][lo+j], r[lo+j][lo+i] = s, s
		}
	}
	return r
}

// TestFactorizeSum factorises the block lo … hi-1 of a + c·b for every
// lo ∈ {0, 1}, hi ∈ {n−1, n}, with b nil (Factorize) and not, for kd = 1
// (Dpttrf), 2 (Dpbtrf and solveBand2) and 3 (Dpbtrf and Dpbtrs), and
// checks LAPACK's two criteria (dpbt01 and dpbt02 in the LAPACK test
// suite): the factorisation residual ‖F − A‖₁/(n·‖A‖₁·ε), F the product
// rebuilt from the factor, and for three right-hand sides the solve
// residual ‖b − A x‖₁/(n·‖A‖₁·‖x‖₁·ε), each ≤ THRESH = 30. A is the block
// of a + c·b formed in floating point; that rounding, ε/2·|A| entrywise,
// is within the criterion.
func TestFactorizeSum(t *testing.T) {
	t.Parallel()
	for _, kd := range []int{1, 2, 3} {
		for _, sum := range []bool{false, true} {
			t.Run(fmt.Sprintf("kd=%d, sum=%v", kd, sum), func(t *testing.T) {
				t.Parallel()
				rnd := rand.New(rand.NewPCG(1, 1))
				var worstF, worstS float64
				var f Factor // reused: storage from a larger n must not leak
				for _, n := range kernelSizes {
					a := randBand(rnd, n, kd)
					var b *Band
					c := 0.0
					if sum {
						b, c = randBand(rnd, n, kd), 0.1+2*rnd.Float64()
					}
					want := blockSum(a, b, c)
					for _, lo := range []int{0, 1} {
						for _, hi := range []int{n - 1, n} {
							if hi < lo {
								continue
							}
							bs := hi - lo
							if err := FactorizeSum(&f, a, b, c, lo, hi); err != nil {
								t.Fatalf("n=%d lo=%d hi=%d: %v", n, lo, hi, err)
							}
							if bs == 0 {
								x := []float64{7, 7}
								f.Solve(x[:min(n, 2)])
								if x[0] != 7 || x[1] != 7 {
									t.Fatalf("n=%d lo=%d hi=%d: empty block's Solve wrote %v", n, lo, hi, x)
								}
								continue
							}
							got := reconstruct(&f, n)
							diff := make([][]float64, n)
							for i := range diff {
								diff[i] = make([]float64, n)
								if i < lo || i >= hi {
									continue
								}
								for j := lo; j < hi; j++ {
									diff[i][j] = got[i][j] - want[i][j]
								}
							}
							an := norm1(want, lo, hi)
							rf := norm1(diff, lo, hi) / (float64(bs) * an * eps)
							if !(rf <= thresh) {
								t.Fatalf("n=%d lo=%d hi=%d: ‖F − A‖₁/(n‖A‖₁ε) = %.3g", n, lo, hi, rf)
							}
							worstF = max(worstF, rf)
							for range 3 {
								rhs := randVec(rnd, n)
								x := slices.Clone(rhs)
								f.Solve(x)
								var rn, xn float64
								for i := range n {
									if i < lo || i >= hi {
										if x[i] != rhs[i] {
											t.Fatalf("n=%d lo=%d hi=%d: Solve wrote x[%d] outside the block", n, lo, hi, i)
										}
										continue
									}
									r := rhs[i]
									for j := lo; j < hi; j++ {
										r -= want[i][j] * x[j]
									}
									rn += math.Abs(r)
									xn += math.Abs(x[i])
								}
								rs := rn / (float64(bs) * an * xn * eps)
								if !(rs <= thresh) {
									t.Fatalf("n=%d lo=%d hi=%d: ‖b − Ax‖₁/(n‖A‖₁‖x‖₁ε) = %.3g", n, lo, hi, rs)
								}
								worstS = max(worstS, rs)
							}
						}
					}
				}
				t.Logf("worst normalised residuals: factor %.3f, solve %.3f (threshold %d)", worstF, worstS, thresh)
			})
		}
	}
}

// TestFactorizeSumRefuses checks that a block that is not positive
// definite, or whose entries overflow, is reported as a *NotDefiniteError
// naming the node in whole-matrix numbering, and that the pivot it
// carries is the bad one (≤ 0, or not finite). Row p is spoilt in four
// ways: a negative diagonal in a; a negative diagonal in b that c·b
// carries into the sum; a diagonal of 1e308 in both a and b, which
// overflows to +Inf in a + b; and every entry ~1e308, so that the first
// pivot of the block overflows. The rows before p are untouched and
// positive definite, so the first bad pivot is p (lo in the last case).
func TestFactorizeSumRefuses(t *testing.T) {
	t.Parallel()
	spoil := []struct {
		name  string
		first bool // the whole block overflows: the first row fails
		alone bool // factorise a alone (Factorize)
		make  func(a, b *Band, p int) float64
	}{
		{"negative diagonal in a", false, true, func(a, b *Band, p int) float64 {
			a.AB[p*(a.KD+1)] = -1
			return 1
		}},
		{"negative diagonal from c·b", false, false, func(a, b *Band, p int) float64 {
			b.AB[p*(b.KD+1)] = -(a.AB[p*(a.KD+1)] + 1) / 0.5
			return 0.5
		}},
		{"overflowing sum at p", false, false, func(a, b *Band, p int) float64 {
			a.AB[p*(a.KD+1)], b.AB[p*(b.KD+1)] = 1e308, 1e308
			return 1
		}},
		{"every entry ~1e308", true, false, func(a, b *Band, p int) float64 {
			for _, x := range []*Band{a, b} {
				for i := range x.AB {
					if x.AB[i] != 0 {
						x.AB[i] = 1e307 * (0.5 + 0.5*math.Abs(x.AB[i])/(1+math.Abs(x.AB[i])))
					}
				}
				for i := range x.N {
					x.AB[i*(x.KD+1)] = 0.95e308
				}
			}
			return 1
		}},
	}
	for _, sp := range spoil {
		for _, kd := range []int{1, 2, 3} {
			t.Run(fmt.Sprintf("%s, kd=%d", sp.name, kd), func(t *testing.T) {
				t.Parallel()
				rnd := rand.New(rand.NewPCG(1, 1))
				for _, n := range []int{2, 3, 4, 5, 10, 53, 100} {
					for _, lo := range []int{0, 1} {
						for _, hi := range []int{n - 1, n} {
							if hi-lo < 1 {
								continue
							}
							for _, p := range []int{lo, (lo + hi) / 2, hi - 1} {
								a, b := randBand(rnd, n, kd), randBand(rnd, n, kd)
								c := sp.make(a, b, p)
								want := p
								if sp.first {
									want = lo
								}
								var f Factor
								var err error
								if sp.alone {
									err = Factorize(&f, a, lo, hi)
								} else {
									err = FactorizeSum(&f, a, b, c, lo, hi)
								}
								var nd *NotDefiniteError
								if !errors.As(err, &nd) {
									t.Fatalf("n=%d lo=%d hi=%d p=%d: err = %v, want *NotDefiniteError", n, lo, hi, p, err)
								}
								if nd.Node != want {
									t.Fatalf("n=%d lo=%d hi=%d p=%d: error names node %d, want %d", n, lo, hi, p, nd.Node, want)
								}
								if nd.Pivot > 0 && !math.IsInf(nd.Pivot, 0) {
									t.Fatalf("n=%d lo=%d hi=%d p=%d: error carries pivot %g, a good one", n, lo, hi, p, nd.Pivot)
								}
							}
						}
					}
				}
			})
		}
	}
}

// TestMoveHeld checks MoveHeld and MoveHeldSum against the dense
// rhs − A[:, held]·u[held] on the free rows, with the held rows left as
// they are, for no, one and both ends held, including n = 1 and 2 and
// quadratic bands with n = 3 (both ends within one element's band, where
// a held row must not receive the other end's value). Each free row
// subtracts at most two products, so the two evaluations agree within
// 2·γ₄·Σ|terms| < 5ε·Σ|terms| (Higham 2002, eq. 3.5).
func TestMoveHeld(t *testing.T) {
	t.Parallel()
	for _, kd := range []int{1, 2, 3} {
		for _, sum := range []bool{false, true} {
			t.Run(fmt.Sprintf("kd=%d, sum=%v", kd, sum), func(t *testing.T) {
				t.Parallel()
				rnd := rand.New(rand.NewPCG(1, 1))
				worst := 0.0
				for _, n := range []int{1, 2, 3, 4, 5, 10, 53, 100} {
					helds := [][]int{nil, {0}, {n - 1}, {0, n - 1}, {n - 1, 0}}
					if n == 1 {
						helds = [][]int{nil, {0}}
					}
					for _, held := range helds {
						a := randBand(rnd, n, kd)
						var b *Band
						c := 0.0
						if sum {
							b, c = randBand(rnd, n, kd), 0.1+rnd.Float64()
						}
						want := blockSum(a, b, c)
						u := randVec(rnd, n)
						rhs := randVec(rnd, n)
						got := slices.Clone(rhs)
						if sum {
							MoveHeldSum(got, a, b, c, u, held)
						} else {
							MoveHeld(got, a, u, held)
						}
						for i := range n {
							if slices.Contains(held, i) {
								if got[i] != rhs[i] {
									t.Fatalf("n=%d held=%v: held row %d changed from %g to %g", n, held, i, rhs[i], got[i])
								}
								continue
							}
							ref, scale := rhs[i], math.Abs(rhs[i])
							for _, j := range held {
								ref -= want[i][j] * u[j]
								scale += math.Abs(want[i][j] * u[j])
							}
							r := math.Abs(got[i]-ref) / scale
							if !(r <= 5*eps) {
								t.Fatalf("n=%d held=%v: rhs[%d] = %g, dense %g (error %.3g ε·Σ|terms|)", n, held, i, got[i], ref, r/eps)
							}
							worst = max(worst, r/eps)
						}
					}
				}
				t.Logf("worst componentwise error %.2f ε", worst)
			})
		}
	}
}

// stepCase is one θ-step problem: the capacity and conductivity from a
// mesh of layers with random coefficients, and the held ends.
type stepCase struct {
	order    int
	lumped   bool
	top, bot bool
	elems    int
}

func (sc stepCase) String() string {
	ends := map[[2]bool]string{{false, false}: "none", {true, false}: "top", {false, true}: "bottom", {true, true}: "both"}
	return fmt.Sprintf("order=%d lumped=%v held=%s elements=%d", sc.order, sc.lumped, ends[[2]bool{sc.top, sc.bot}], sc.elems)
}

// build returns M, K and the held nodes of the case.
func (sc stepCase) build(rnd *rand.Rand) (m, k *Band, held []int) {
	th := []float64{0.4 * float64(sc.elems), 0.6 * float64(sc.elems)}
	mesh := NewMesh(th, sc.order, 1, 1)
	if sc.elems == 1 {
		mesh = NewMesh([]float64{1}, sc.order, 1, 1)
	}
	n := mesh.Nodes()
	cm := []float64{1e-4 * (1 + rnd.Float64()), 1e-3 * (1 + rnd.Float64())}
	ck := []float64{1e-2 * (1 + rnd.Float64()), 1e-4 * (1 + rnd.Float64())}
	m, k = NewBand(n, sc.order), NewBand(n, sc.order)
	mesh.Assemble(m, func(e int, _ float64) float64 { return cm[mesh.Layer[e]] }, true)
	mesh.Assemble(k, func(e int, _ float64) float64 { return ck[mesh.Layer[e]] }, false)
	if sc.lumped {
		m.Lump()
	}
	if sc.top {
		held = append(held, 0)
	}
	if sc.bot {
		held = append(held, n-1)
	}
	return m, k, held
}

func stepCases() []stepCase {
	var cs []stepCase
	for _, order := range []int{1, 2} {
		for _, lumped := range []bool{false, true} {
			for _, ends := range [][2]bool{{false, false}, {true, false}, {false, true}, {true, true}} {
				for _, ne := range []int{1, 2, 3, 5, 26, 27, 100} {
					cs = append(cs, stepCase{order, lumped, ends[0], ends[1], ne})
				}
			}
		}
	}
	return cs
}

// TestStepperStep checks one θ step against the dense system
//
//	(M + θΔt K) u¹ = (M − (1−θ)Δt K) u⁰ + M ds,  u¹ given at held nodes,
//
// for θ ∈ {0.5, 1}, lumped and consistent M, linear and quadratic
// elements and held ends none, top, bottom and both: the held values are
// set exactly, and the residual of the free rows,
// ‖r‖∞/(n·ε·(‖A‖∞‖u¹‖∞ + ‖R‖∞)), with R the row sums of the absolute
// terms of the right-hand side, is ≤ THRESH (LAPACK's dpbt02 criterion,
// with the rounding of the right-hand side, O(ε‖R‖), admitted). The
// answer is also compared with a dense Cholesky solve (gonum mat): the
// difference is within the forward error bound of both, ≤ THRESH·n·κ·ε
// relative to ‖u¹‖∞, κ the dense factor's condition estimate.
func TestStepperStep(t *testing.T) {
	t.Parallel()
	for _, theta := range []float64{0.5, 1} {
		for _, sc := range stepCases() {
			t.Run(fmt.Sprintf("θ=%g %v", theta, sc), func(t *testing.T) {
				t.Parallel()
				rnd := rand.New(rand.NewPCG(1, 1))
				m, k, held := sc.build(rnd)
				n := m.N
				s := NewStepper(m, k, held, sc.lumped)
				dt := 0.05 + rnd.Float64()/10
				u0 := randVec(rnd, n)
				worst := 0.0
				for _, withDS := range []bool{false, true} {
					var ds []float64
					if withDS {
						ds = randVec(rnd, n)
					}
					next := randVec(rnd, len(held))
					u := slices.Clone(u0)
					if err := s.Step(u, ds, next, theta, dt); err != nil {
						t.Fatal(err)
					}
					worst = max(worst, checkStep(t, m, k, held, u0, ds, next, u, theta, dt))
				}
				t.Logf("worst normalised residual %.3f (threshold %d)", worst, thresh)
			})
		}
	}
}

// checkStep compares the stepped u with the dense θ step and returns the
// normalised residual (TestStepperStep).
func checkStep(t *testing.T, m, k *Band, held []int, u0, ds, next, u []float64, theta, dt float64) float64 {
	t.Helper()
	n := m.N
	md, kdn := dense(m), dense(k)
	a := blockSum(m, k, theta*dt)
	c := (1 - theta) * dt
	for i, j := range held {
		if u[j] != next[i] {
			t.Fatalf("held node %d = %g, want %g", j, u[j], next[i])
		}
	}
	var free []int
	for i := range n {
		if !slices.Contains(held, i) {
			free = append(free, i)
		}
	}
	nf := len(free)
	if nf == 0 {
		return 0
	}
	// The right-hand side of the free rows, the largest absolute row sum
	// of its terms, and the residual of the stepped u.
	rhs := make([]float64, nf)
	var rmax, rscale, amax, umax float64
	for fi, i := range free {
		r, scale := 0.0, 0.0
		for j := range n {
			r += md[i][j]*u0[j] - c*kdn[i][j]*u0[j]
			scale += math.Abs(md[i][j]*u0[j]) + math.Abs(c*kdn[i][j]*u0[j])
			if ds != nil {
				r += md[i][j] * ds[j]
				scale += math.Abs(md[i][j] * ds[j])
			}
		}
		for h, j := range held {
			r -= a[i][j] * next[h]
			scale += math.Abs(a[i][j] * next[h])
		}
		rhs[fi] = r
		res, row := r, 0.0
		for _, j := range free {
			res -= a[i][j] * u[j]
			row += math.Abs(a[i][j])
		}
		rmax, rscale = max(rmax, math.Abs(res)), max(rscale, scale)
		amax, umax = max(amax, row), max(umax, math.Abs(u[i]))
	}
	ratio := rmax / (float64(nf) * eps * (amax*umax + rscale))
	if !(ratio <= thresh) {
		t.Fatalf("normalised residual of the free rows %.3g > %d", ratio, thresh)
	}
	// Dense Cholesky solve of the free block.
	af := mat.NewSymDense(nf, nil)
	for fi, i := range free {
		for fj := fi; fj < nf; fj++ {
			af.SetSym(fi, fj, a[i][free[fj]])
		}
	}
	var ch mat.Cholesky
	if !ch.Factorize(af) {
		t.Fatal("dense block not positive definite")
	}
	var x mat.VecDense
	if err := ch.SolveVecTo(&x, mat.NewVecDense(nf, rhs)); err != nil {
		t.Fatal(err)
	}
	diff := 0.0
	for fi, i := range free {
		diff = max(diff, math.Abs(u[i]-x.AtVec(fi)))
	}
	if bound := thresh * float64(nf) * ch.Cond() * eps * umax; !(diff <= bound) {
		t.Fatalf("stepped and dense solutions differ by %.3g, bound %.3g (κ = %.3g)", diff, bound, ch.Cond())
	}
	return ratio
}

// cachedCases are the columns of the factor-cache checks: both orders,
// lumped and consistent, each kind of held end.
var cachedCases = []stepCase{
	{1, true, true, true, 20}, {1, false, true, false, 20},
	{2, true, false, true, 20}, {2, false, false, false, 20},
}

// stepData returns the case's M, K and held nodes with a start u0, a
// stress change ds and the held values next, all random from a fixed
// seed.
func (sc stepCase) stepData() (m, k *Band, held []int, u0, ds, next []float64) {
	rnd := rand.New(rand.NewPCG(1, 1))
	m, k, held = sc.build(rnd)
	return m, k, held, randVec(rnd, m.N), randVec(rnd, m.N), randVec(rnd, len(held))
}

// TestStepperReuse checks that a second Step with the same (θ, Δt) reuses
// the cached factor (Factorizations unchanged, and bit for bit the answer
// of a fresh Stepper), that a new Δt adds one factorisation and a return
// to the first adds none, and that a cached Step allocates nothing. It is
// not parallel: testing.AllocsPerRun counts the mallocs of the whole
// process, and top-level tests that call t.Parallel wait until the
// sequential ones have finished.
func TestStepperReuse(t *testing.T) {
	for _, sc := range cachedCases {
		t.Run(sc.String(), func(t *testing.T) {
			m, k, held, u0, ds, next := sc.stepData()
			const theta, dt = 0.5, 0.1
			s := NewStepper(m, k, held, sc.lumped)
			u := slices.Clone(u0)
			if err := s.Step(u, ds, next, theta, dt); err != nil {
				t.Fatal(err)
			}
			if got := s.Factorizations(); got != 1 {
				t.Fatalf("first step: %d factorisations, want 1", got)
			}
			u = slices.Clone(u0)
			if err := s.Step(u, ds, next, theta, dt); err != nil {
				t.Fatal(err)
			}
			fresh := slices.Clone(u0)
			if err := NewStepper(m, k, held, sc.lumped).Step(fresh, ds, next, theta, dt); err != nil {
				t.Fatal(err)
			}
			if !slices.Equal(u, fresh) {
				t.Errorf("a step from the cached factor differs from a fresh Stepper's")
			}
			if got := s.Factorizations(); got != 1 {
				t.Errorf("second step with the same (θ, Δt): %d factorisations, want 1", got)
			}
			allocs := testing.AllocsPerRun(20, func() {
				if err := s.Step(u, ds, next, theta, dt); err != nil {
					t.Fatal(err)
				}
			})
			if allocs != 0 {
				t.Errorf("a cached Step allocates %v times, want 0", allocs)
			}
			if err := s.Step(u, ds, next, theta, 2*dt); err != nil {
				t.Fatal(err)
			}
			if err := s.Step(u, ds, next, theta, dt); err != nil {
				t.Fatal(err)
			}
			if got := s.Factorizations(); got != 2 {
				t.Errorf("after a new Δt and back: %d factorisations, want 2", got)
			}
		})
	}
}

// TestStepperUncached checks the steps after Uncached: a (θ, Δt) not
// cached is factorised into the scratch factor and serves the steps in a
// row with it (Factorizations counts one, no allocation, and the answer
// is a caching Stepper's bit for bit); a new Δt and a return to the first
// each factorise again; a (θ, Δt) cached before Uncached is still taken
// from the cache; Reset forgets the scratch factor. Not parallel, as
// TestStepperReuse.
func TestStepperUncached(t *testing.T) {
	for _, sc := range cachedCases {
		t.Run(sc.String(), func(t *testing.T) {
			m, k, held, u0, ds, next := sc.stepData()
			const theta, dt = 0.5, 0.1
			step := func(s *Stepper, dt float64) []float64 {
				u := slices.Clone(u0)
				if err := s.Step(u, ds, next, theta, dt); err != nil {
					t.Fatal(err)
				}
				return u
			}
			want := func(s *Stepper, what string, n int) {
				t.Helper()
				if got := s.Factorizations(); got != n {
					t.Errorf("%s: %d factorisations, want %d", what, got, n)
				}
			}
			s := NewStepper(m, k, held, sc.lumped)
			s.Uncached()
			first := step(s, dt)
			if again := step(s, dt); !slices.Equal(first, again) || !slices.Equal(first, step(NewStepper(m, k, held, sc.lumped), dt)) {
				t.Errorf("the scratch factor's steps differ from a caching Stepper's")
			}
			want(s, "two steps with one (θ, Δt)", 1)
			u := slices.Clone(u0)
			if allocs := testing.AllocsPerRun(20, func() {
				if err := s.Step(u, ds, next, theta, dt); err != nil {
					t.Fatal(err)
				}
			}); allocs != 0 {
				t.Errorf("a step from the scratch factor allocates %v times, want 0", allocs)
			}
			step(s, 2*dt)
			step(s, dt)
			want(s, "a new Δt and back", 3)
			if len(s.cache) != 0 {
				t.Errorf("%d factors cached after Uncached, want 0", len(s.cache))
			}
			s.Reset()
			step(s, dt)
			want(s, "the same Δt after Reset", 4)

			c := NewStepper(m, k, held, sc.lumped)
			step(c, dt)
			c.Uncached()
			step(c, 2*dt)
			step(c, dt)
			want(c, "a Δt cached before Uncached, then a new one and back", 2)
		})
	}
}

// field is the polynomial α + βz + γz² and its integral over [z0, z1],
// written as (z1−z0)·(mean of the field) so that thin elements far down
// the column do not cancel.
type field struct{ a, b, c float64 }

func (f field) at(z float64) float64 { return f.a + f.b*z + f.c*z*z }

func (f field) integral(z0, z1 float64) float64 {
	return (z1 - z0) * (f.a + f.b*(z0+z1)/2 + f.c*(z0*z0+z0*z1+z1*z1)/3)
}

// scale bounds the absolute terms of the field on [0, zmax].
func (f field) scale(zmax float64) float64 {
	return math.Abs(f.a) + math.Abs(f.b)*zmax + math.Abs(f.c)*zmax*zmax
}

// TestMeshFields checks Mesh.Integrate, ProbeAt/Read, Interpolate and
// Centre against closed forms for fields the elements represent exactly:
// linear fields on linear and quadratic meshes, quadratic fields on
// quadratic ones, the nodal values being the field at the node depths.
// The results are exact up to rounding: Integrate's order+1 Gauss points
// integrate polynomials of degree 2·order+1 exactly (Abramowitz & Stegun
// 1964, 25.4.29), and the Lagrange interpolant of a polynomial of degree
// ≤ order is the polynomial. The rounding allowed is 16ε relative to the
// field's scale S = |α| + |β|H + |γ|H² (times the element length for
// integrals): the quadrature and the closed form each take under ten
// operations on terms bounded by S, and the local coordinate
// ξ = 2(z − z0)/(z1 − z0) − 1 and the middle node's depth are each off by a
// few ε·H, which moves the point at which the field is read by that much.
// A wrong weight, shape function or Jacobian errs by O(1) in this ratio.
func TestMeshFields(t *testing.T) {
	t.Parallel()
	layers := [][]float64{{1}, {0.7, 2.3}, {0.7, 2.3, 1.1}, {3.7, 0.013, 5.1}}
	for _, order := range []int{1, 2} {
		for _, deg := range []int{1, 2} {
			if deg > order {
				continue
			}
			t.Run(fmt.Sprintf("order=%d, degree=%d", order, deg), func(t *testing.T) {
				t.Parallel()
				rnd := rand.New(rand.NewPCG(1, 1))
				worst := 0.0
				for _, th := range layers {
					for _, size := range []float64{10, 1, 0.3, 0.05} {
						m := NewMesh(th, order, size, 1)
						f := field{rnd.NormFloat64(), rnd.NormFloat64(), 0}
						if deg == 2 {
							f.c = rnd.NormFloat64()
						}
						u := make([]float64, m.Nodes())
						for i, z := range m.Z {
							u[i] = f.at(z)
						}
						H := m.Z[len(m.Z)-1]
						S := f.scale(H)
						check := func(what string, got, want, scale float64) {
							t.Helper()
							r := math.Abs(got-want) / scale
							if !(r <= 16*eps) {
								t.Fatalf("layers %v, size %g: %s = %.17g, closed form %.17g (%.3g ε·S)", th, size, what, got, want, r/eps)
							}
							worst = max(worst, r/eps)
						}
						for e := range m.Elements() {
							_, z0, z1 := m.Span(e)
							check(fmt.Sprintf("Integrate(u, %d)", e), m.Integrate(u, e), f.integral(z0, z1), (z1-z0)*S)
							check(fmt.Sprintf("Centre(u, %d)", e), m.Centre(u, e), f.at((z0+z1)/2), S)
						}
						zs := []float64{-1, 0, H, H + 1}
						zs = append(zs, m.Z...)
						for range 50 {
							zs = append(zs, H*rnd.Float64())
						}
						for _, z := range zs {
							want := f.at(min(max(z, 0), H)) // clamped to the column
							pr := m.ProbeAt(z)
							check(fmt.Sprintf("ProbeAt(%g).Read", z), pr.Read(u), want, S)
							check(fmt.Sprintf("Interpolate(u, %g)", z), m.Interpolate(u, z), want, S)
						}
					}
				}
				t.Logf("worst error %.2f ε·S", worst)
			})
		}
	}
}

// TestAssembleForms checks Mesh.Assemble against the energies of the same
// polynomial fields, uᵀ M u = ∫ u² dz and uᵀ K u = ∫ u'² dz over the
// column (c = 1), in closed form: M's integrand has degree 2·order, which
// order+1 Gauss points integrate exactly (Abramowitz & Stegun 1964,
// 25.4.29), and K's degree 2·order − 2. The rounding allowed is that of
// the assembly and the double sum, γ_m·Σ|uᵢ Aᵢⱼ uⱼ| with m = n(2kd+1) + 16
// terms (Higham 2002, eq. 3.5), which is loose for large n but still far
// below the O(1) error of a wrong weight or a Gauss point too few.
func TestAssembleForms(t *testing.T) {
	t.Parallel()
	rnd := rand.New(rand.NewPCG(1, 1))
	for _, order := range []int{1, 2} {
		for _, th := range [][]float64{{1}, {0.7, 2.3, 1.1}, {3.7, 0.013, 5.1}} {
			for _, size := range []float64{10, 0.3, 0.05} {
				m := NewMesh(th, order, size, 1)
				n := m.Nodes()
				f := field{rnd.NormFloat64(), rnd.NormFloat64(), 0}
				if order == 2 {
					f.c = rnd.NormFloat64()
				}
				u := make([]float64, n)
				for i, z := range m.Z {
					u[i] = f.at(z)
				}
				H := m.Z[n-1]
				// ∫₀ᴴ (α + βz + γz²)² dz and ∫₀ᴴ (β + 2γz)² dz.
				a, b, c := f.a, f.b, f.c
				mass := a*a*H + a*b*H*H + (b*b+2*a*c)*H*H*H/3 + b*c*H*H*H*H/2 + c*c*H*H*H*H*H/5
				stiff := b*b*H + 2*b*c*H*H + 4*c*c*H*H*H/3
				for _, form := range []struct {
					name string
					mass bool
					want float64
				}{{"uᵀMu", true, mass}, {"uᵀKu", false, stiff}} {
					A := NewBand(n, order)
					m.Assemble(A, func(int, float64) float64 { return 1 }, form.mass)
					got, scale := 0.0, 0.0
					for i := range n {
						for j := max(0, i-order); j <= min(n-1, i+order); j++ {
							got += u[i] * A.At(i, j) * u[j]
							scale += math.Abs(u[i] * A.At(i, j) * u[j])
						}
					}
					tol := float64(n*(2*order+1)+16) * eps * scale
					if !(math.Abs(got-form.want) <= tol) {
						t.Errorf("order %d, layers %v, size %g: %s = %.17g, closed form %.17g (error %.3g, tolerance %.3g)",
							order, th, size, form.name, got, form.want, math.Abs(got-form.want), tol)
					}
				}
			}
		}
	}
}
