package main

import (
	"math"

	"gonum.org/v1/gonum/lapack/gonum"
	"gonum.org/v1/gonum/mat"
)

// The two baselines solve the reference column in dimensionless form: depth
// Z = z/H ∈ [0, 1] with Z = 0 drained and Z = 1 sealed, time Tv = cv t/H²,
// u/u0 = 1 at t = 0⁺. They use n equally spaced nodes (h = 1/(n−1)); node 0
// is held at 0 and the others are unknown.

// history is what a run hands back: U at the time factors it recorded and
// the isochrones at isoTv (u/u0 at every node, node 0 first).
type history struct {
	tv, u []float64
	iso   [][]float64
	steps int // time steps taken
	facts int // factorisations (implicit runs)
}

// check compares a baseline history with Terzaghi's (1943) series.
func (h *history) check() errs {
	var e errs
	for i, t := range h.tv {
		e.addU(t, h.u[i])
	}
	if len(h.iso) == 0 {
		return e
	}
	n := len(h.iso[0])
	z := make([]float64, n)
	for i := range z {
		z[i] = colH * float64(i) / float64(n-1)
	}
	for k, u := range h.iso {
		e.addIso(isoTv[k], z, u)
	}
	return e
}

// marks are the times every run lands on exactly: the isochrone times and
// the end of the history (isoTv ends with tvHi).
func marks() []float64 { return isoTv }

// degree returns U = 1 − ∫u dZ for u0 = 1 by the trapezoidal rule (the
// lumped weights of linear elements).
func degree(u []float64, h float64) float64 {
	s := 0.5 * (u[0] + u[len(u)-1])
	for _, v := range u[1 : len(u)-1] {
		s += v
	}
	return 1 - s*h
}

// uSamples are the time factors at which the explicit run records U:
// 200 log-spaced values over [tvLo, tvHi], about as many as an implicit
// run has steps (a practitioner plots U against log t).
var uSamples = func() []float64 {
	const k = 200
	s := make([]float64, k)
	for i := range s {
		s[i] = tvLo * math.Pow(tvHi/tvLo, float64(i)/(k-1))
	}
	return s
}()

// ftcs solves the column by forward-time centred-space finite differences
// on n nodes with the step at its stability limit Δt = h²/(2cv) (r = 1/2),
// shortened only to land on the marks. The sealed end mirrors its
// neighbour. With all set it records U after every step in [tvLo, tvHi],
// otherwise at the first step at or after each of uSamples. Cost O(n) per
// step and 4(n−1)² steps to tvHi = 2.
func ftcs(n int, all bool) *history {
	h := 1 / float64(n-1)
	dt := h * h / 2
	u := make([]float64, n)
	v := make([]float64, n)
	for i := 1; i < n; i++ {
		u[i] = 1
	}
	out := &history{}
	t, next := 0.0, 0
	for _, m := range marks() {
		for t < m {
			step := dt
			land := t+dt >= m*(1-1e-12)
			if land {
				step = m - t
			}
			r := step / (h * h)
			ftcsStep(v, u, r)
			u, v = v, u
			out.steps++
			if land {
				t = m
			} else {
				t += step
			}
			if all {
				if t >= tvLo*(1-1e-9) {
					out.tv = append(out.tv, t)
					out.u = append(out.u, degree(u, h))
				}
				continue
			}
			for next < len(uSamples) && uSamples[next] <= t*(1+1e-12) {
				out.tv = append(out.tv, t)
				out.u = append(out.u, degree(u, h))
				for next < len(uSamples) && uSamples[next] <= t*(1+1e-12) {
					next++
				}
			}
		}
		out.iso = append(out.iso, append([]float64(nil), u...))
	}
	return out
}

// ftcsStep sets dst to one explicit step of u with r = cvΔt/h²: node 0 is
// held, the last node mirrors its neighbour.
func ftcsStep(dst, u []float64, r float64) {
	n := len(u)
	dst = dst[:n]
	dst[0] = 0
	for i := 1; i < n-1; i++ {
		dst[i] = u[i] + r*(u[i-1]-2*u[i]+u[i+1])
	}
	dst[n-1] = u[n-1] + 2*r*(u[n-2]-u[n-1])
}

// plan is a time step sequence for the implicit baseline: steps of first,
// multiplied by growth after every run steps; the first damped steps are
// backward Euler (θ = 1), the rest Crank–Nicolson (θ = 1/2). A step that
// would pass a mark is shortened to land on it, and the next one resumes
// the unshortened size.
type plan struct {
	first, growth float64
	run, damped   int
}

// stepSpec is one step of a plan.
type stepSpec struct{ theta, dt float64 }

// steps expands p into its step sequence up to tvHi.
func (p plan) steps() []stepSpec {
	var out []stepSpec
	t, dt, k := 0.0, p.first, 0
	for _, m := range marks() {
		for t < m*(1-1e-12) {
			h := dt
			land := t+dt >= m*(1-1e-9)
			if land && math.Abs(m-t-dt) > 1e-9*m {
				h = m - t // a shortened step; otherwise dt lands to rounding
			}
			theta := 0.5
			if k < p.damped {
				theta = 1
			}
			out = append(out, stepSpec{theta, h})
			k++
			if land {
				t = m
			} else {
				t += h
			}
			if !land && k%p.run == 0 {
				dt *= p.growth
			}
			if len(out) > 1_000_000 {
				return out
			}
		}
	}
	return out
}

// distinct is the number of distinct (θ, Δt) in s: the factorisations an
// implicit run needs.
func distinct(s []stepSpec) int {
	seen := map[stepSpec]bool{}
	for _, x := range s {
		seen[x] = true
	}
	return len(seen)
}

// linSolver factorises and solves M + θΔt·K on the unknowns 1 … n−1.
type linSolver interface {
	// factor prepares the solve of (M + θΔt·K) x = b; m is the lumped
	// mass (diagonal) and kd, ke the diagonal and sub-diagonal of K.
	factor(m, kd, ke []float64, theta, dt float64)
	// solve overwrites b with the solution.
	solve(b []float64)
}

// implicit runs the θ-method with linear elements (lumped mass, the
// matrices of Porelight's linear elements) on n nodes along the steps of
// s, solving each step with ls, factorising once per distinct (θ, Δt)
// with the last few factorisations kept for reuse. It records U after
// every step. The right-hand side (M − (1−θ)Δt·K) u is formed in O(n)
// from the tridiagonal matrices, so the baseline pays only for its solve.
func implicit(n int, s []stepSpec, newSolver func(m int) linSolver) *history {
	h := 1 / float64(n-1)
	m := n - 1 // unknowns: nodes 1 … n−1
	// Lumped mass and stiffness of linear elements on the free block.
	mass := make([]float64, m)
	kd := make([]float64, m)
	ke := make([]float64, m-1)
	for i := range m {
		mass[i], kd[i] = h, 2/h
		if i < m-1 {
			ke[i] = -1 / h
		}
	}
	mass[m-1], kd[m-1] = h/2, 1/h
	u := make([]float64, m)
	for i := range u {
		u[i] = 1
	}
	rhs := make([]float64, m)
	out := &history{tv: make([]float64, 0, len(s)), u: make([]float64, 0, len(s))}
	type cached struct {
		key stepSpec
		ls  linSolver
	}
	var cache []cached // most recent first
	const keep = 3
	full := make([]float64, n)
	t, mi := 0.0, 0
	mk := marks()
	for _, st := range s {
		var ls linSolver
		for i, c := range cache {
			if c.key == st {
				ls = c.ls
				copy(cache[1:i+1], cache[:i])
				cache[0] = c
				break
			}
		}
		if ls == nil {
			if len(cache) == keep {
				ls = cache[keep-1].ls // reuse its storage
				cache = cache[:keep-1]
			} else {
				ls = newSolver(m)
			}
			ls.factor(mass, kd, ke, st.theta, st.dt)
			out.facts++
			cache = append([]cached{{st, ls}}, cache...)
		}
		c := (1 - st.theta) * st.dt
		for i := range m {
			ku := kd[i] * u[i]
			if i > 0 {
				ku += ke[i-1] * u[i-1]
			}
			if i < m-1 {
				ku += ke[i] * u[i+1]
			}
			rhs[i] = mass[i]*u[i] - c*ku
		}
		ls.solve(rhs)
		copy(u, rhs)
		out.steps++
		t += st.dt
		copy(full[1:], u)
		if mi < len(mk) && t >= mk[mi]*(1-1e-9) {
			t = mk[mi]
			mi++
			out.iso = append(out.iso, append([]float64(nil), full...))
		}
		if t >= tvLo*(1-1e-9) {
			out.tv = append(out.tv, t)
			out.u = append(out.u, degree(full, h))
		}
	}
	return out
}

// denseSolver is baseline (b): a dense symmetric matrix factorised by
// gonum's mat.Cholesky and solved with SolveVecTo, O(m³/3) per
// factorisation and O(m²) per solve.
type denseSolver struct {
	a    *mat.SymDense
	chol mat.Cholesky
	x, b *mat.VecDense
}

func newDense(m int) linSolver {
	return &denseSolver{a: mat.NewSymDense(m, nil), x: mat.NewVecDense(m, nil), b: mat.NewVecDense(m, nil)}
}

func (d *denseSolver) factor(m, kd, ke []float64, theta, dt float64) {
	n := len(m)
	raw := d.a.RawSymmetric()
	clear(raw.Data)
	for i := range n {
		raw.Data[i*raw.Stride+i] = m[i] + theta*dt*kd[i]
		if i < n-1 {
			raw.Data[i*raw.Stride+i+1] = theta * dt * ke[i]
		}
	}
	if !d.chol.Factorize(d.a) {
		panic("benchtab: dense matrix not positive definite")
	}
}

func (d *denseSolver) solve(b []float64) {
	copy(d.b.RawVector().Data, b)
	if err := d.chol.SolveVecTo(d.x, d.b); err != nil {
		panic(err)
	}
	copy(b, d.x.RawVector().Data)
}

// triSolver solves the same systems with gonum's Dpttrf/Dpttrs in O(m);
// the step search uses it to find the accuracy of a plan quickly (the
// arithmetic is the same as the dense solve's up to rounding).
type triSolver struct{ d, e []float64 }

func newTri(m int) linSolver {
	return &triSolver{d: make([]float64, m), e: make([]float64, max(m-1, 0))}
}

var lapack gonum.Implementation

func (s *triSolver) factor(m, kd, ke []float64, theta, dt float64) {
	for i := range m {
		s.d[i] = m[i] + theta*dt*kd[i]
	}
	for i := range ke {
		s.e[i] = theta * dt * ke[i]
	}
	if !lapack.Dpttrf(len(s.d), s.d, s.e) {
		panic("benchtab: tridiagonal matrix not positive definite")
	}
}

func (s *triSolver) solve(b []float64) { lapack.Dpttrs(len(s.d), 1, s.d, s.e, b, 1) }
