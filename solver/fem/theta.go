package fem

import "slices"

// stepKey identifies one factorisation of M + θΔt·K.
type stepKey struct{ theta, dt float64 }

// factorCacheFloats bounds the floats a Stepper's factor cache holds;
// past it the cache is emptied and refilled.
const factorCacheFloats = 4 << 20

// Stepper advances M u̇ + K u = M ṡ in time by the θ-method,
//
//	(M + θΔt K) u¹ = (M − (1−θ)Δt K) u⁰ + M (s¹ − s⁰),
//
// with u¹ given at the held nodes. M and K are symmetric band matrices of
// one shape; the free unknowns are Lo … Hi-1 and Held lists the held
// nodes (runs from either end, see HeldRuns). A diagonal M (Lumped) with a tridiagonal K
// takes a fused one-pass right-hand side. Each distinct (θ, Δt) is
// factorised once and reused (after Uncached, only while it lasts).
type Stepper struct {
	M, K   *Band
	Lo, Hi int
	Held   []int
	// Lumped says M is diagonal (its off-diagonal band entries are
	// zero), which lets a tridiagonal K take the fused right-hand side
	// that reads only M's diagonal. Setting it for a non-diagonal M gives
	// inconsistent equations.
	Lumped bool

	cache   map[stepKey]*Factor
	cached  int
	factors int
	rhs     []float64
	// After Uncached, the factors not in the cache are made in scratch,
	// which holds the one for scratchKey while scratchOK.
	uncached  bool
	scratch   Factor
	scratchOK bool
	scratchOf stepKey
}

// NewStepper returns a stepper for capacity m and conductivity k with the
// given held nodes, which must be runs of nodes from either end (0, 1, …
// and N-1, N-2, …: an end, or a part of the column taken out from an end).
// It panics when m and k differ in shape or a held node is not in such a
// run.
func NewStepper(m, k *Band, held []int, lumped bool) *Stepper {
	if m.N != k.N || m.KD != k.KD {
		panic("fem: capacity and conductivity differ in shape")
	}
	s := &Stepper{M: m, K: k, Lo: 0, Hi: m.N, Held: held, Lumped: lumped,
		cache: map[stepKey]*Factor{}, rhs: make([]float64, m.N)}
	s.Lo, s.Hi = HeldRuns(m.N, held)
	for _, j := range held {
		if j >= s.Lo && j < s.Hi {
			panic("fem: only runs of nodes from the ends may be held")
		}
	}
	return s
}

// HeldRuns returns the free block lo … hi-1 left by held nodes that run
// from the ends of a column of n nodes: lo is the first node from the top
// not held, hi one past the last from the base not held.
func HeldRuns(n int, held []int) (lo, hi int) {
	lo, hi = 0, n
	for lo < n && slices.Contains(held, lo) {
		lo++
	}
	for hi > lo && slices.Contains(held, hi-1) {
		hi--
	}
	return lo, hi
}

// Factorizations is the number of factorisations made so far.
func (s *Stepper) Factorizations() int { return s.factors }

// Reset forgets the cached factors, after M or K changed.
func (s *Stepper) Reset() {
	clear(s.cache)
	s.cached = 0
	s.scratchOK = false
}

// Uncached makes the factors of the later steps whose (θ, Δt) is not
// cached in one scratch factor instead of adding them to the cache; the
// scratch factor serves the steps after it as long as (θ, Δt) stays the
// same. A time loop calls it for its last stretch, where the steps grow
// and no length comes back: each would be cached for nothing (in the
// demo's solve about 160 factors of 2 KB, half of what a solve
// allocates). The answers are the same to the bit; only a length that
// did come back, not in a row, would be factorised again.
func (s *Stepper) Uncached() { s.uncached = true }

// factorFor returns the factorisation of M + θΔt·K on the free block,
// computing it once per distinct (θ, Δt), or once per run of steps with
// it after Uncached.
func (s *Stepper) factorFor(theta, dt float64) (*Factor, error) {
	key := stepKey{theta, dt}
	if f, ok := s.cache[key]; ok {
		return f, nil
	}
	if s.uncached {
		if s.scratchOK && s.scratchOf == key {
			return &s.scratch, nil
		}
		s.scratchOK = false
		if err := FactorizeSum(&s.scratch, s.M, s.K, theta*dt, s.Lo, s.Hi); err != nil {
			return nil, err
		}
		s.factors++
		s.scratchOK, s.scratchOf = true, key
		return &s.scratch, nil
	}
	f := new(Factor)
	if err := FactorizeSum(f, s.M, s.K, theta*dt, s.Lo, s.Hi); err != nil {
		return nil, err
	}
	s.factors++
	if size := f.Floats(); s.cached+size > factorCacheFloats {
		s.Reset()
	}
	s.cache[key] = f
	s.cached += f.Floats()
	return f, nil
}

// Step advances u by one step of length dt.
//
// On entry u holds u⁰ at every node, ds the change of the source s over
// the step at every node (nil: none) and next the values u¹ of the held
// nodes, in the order of Held. On return u holds u¹. No allocation once
// the factor for (θ, Δt) is cached; O(n·kd).
func (s *Stepper) Step(u, ds, next []float64, theta, dt float64) error {
	f, err := s.factorFor(theta, dt)
	if err != nil {
		return err
	}
	rhs := s.rhs
	c := (1 - theta) * dt
	if s.Lumped && s.M.KD == 1 {
		ThetaRHS(rhs, u, ds, s.M.AB, s.K.AB, c)
	} else {
		BandThetaRHS(rhs, u, ds, s.M, s.K, c)
	}
	for i, j := range s.Held {
		u[j] = next[i]
	}
	MoveHeldSum(rhs, s.M, s.K, theta*dt, u, s.Held)
	f.Solve(rhs)
	copy(u[s.Lo:s.Hi], rhs[s.Lo:s.Hi])
	return nil
}

// ThetaRHS sets dst = D (u + ds) − c·K u for a diagonal D (the first
// column of the band storage d) and a tridiagonal K (band storage k, kd =
// 1), in one pass. ds may be nil (no source change).
func ThetaRHS(dst, u, ds, d, k []float64, c float64) {
	n := len(u)
	if n == 0 {
		return
	}
	// Row i of K·u is k[2(i-1)+1]·u[i-1] + k[2i]·u[i] + k[2i+1]·u[i+1].
	// The rows above the last, with and without ds, are loops of their
	// own without a test per row; the arithmetic is the same either way.
	dst, d, k = dst[:n], d[:2*n], k[:2*n]
	prev := 0.0 // k[i-1][i]·u[i-1]
	last := n - 1
	if ds == nil {
		for i := range last {
			ui, ki := u[i], k[2*i+1]
			ku := prev + k[2*i]*ui + ki*u[i+1]
			prev = ki * ui
			dst[i] = d[2*i]*ui - c*ku
		}
	} else {
		ds = ds[:n]
		for i := range last {
			ui, ki := u[i], k[2*i+1]
			ku := prev + k[2*i]*ui + ki*u[i+1]
			prev = ki * ui
			dst[i] = d[2*i]*(ui+ds[i]) - c*ku
		}
	}
	v := u[last]
	if ds != nil {
		v += ds[last]
	}
	dst[last] = d[2*last]*v - c*(prev+k[2*last]*u[last])
}

// BandThetaRHS sets dst = M (u + ds) − c·K u for symmetric band matrices M
// and K of the same shape, in one pass over their storage. ds may be nil.
func BandThetaRHS(dst, u, ds []float64, m, k *Band, c float64) {
	n, ld := m.N, m.KD+1
	clear(dst[:n])
	for i := range n {
		mi, ki := m.AB[i*ld:i*ld+ld], k.AB[i*ld:i*ld+ld]
		vi := u[i]
		if ds != nil {
			vi += ds[i]
		}
		acc := mi[0]*vi - c*ki[0]*u[i]
		for j := 1; j < ld && i+j < n; j++ {
			vj := u[i+j]
			if ds != nil {
				vj += ds[i+j]
			}
			acc += mi[j]*vj - c*ki[j]*u[i+j]
			dst[i+j] += mi[j]*vi - c*ki[j]*u[i]
		}
		dst[i] += acc
	}
}
