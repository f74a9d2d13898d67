package solver

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"

	"porelight/solver/fem"
	"porelight/solver/soil"
)

// TestSolveLumpedNewton checks the fused update with the permeability
// term (gk set, A' unsymmetric) against a dense LU solve (gonum's
// mat.Dense.Solve) of A' assembled here entry by entry from its
// definition in solveLumped's comment, on an uneven mesh with held ends,
// and with leaky ends and a draining node inside (its row the identity):
// per element e (nodes a, b), with g = cc/h, s = ½ (w_a − w_b) gk/h held
// within ±θΔt g, A'_aa += ct h/2 + θΔt g − s, A'_bb += ct h/2 + θΔt g + s,
// A'_ab += −θΔt g − s, A'_ba += −θΔt g + s; the residual as in
// TestSolveLumped, through package fem's band routines. gk is large on one
// element so that its term is held there. Tolerance 1e-10 of the largest
// update (rounding of two elimination orders).
func TestSolveLumpedNewton(t *testing.T) {
	m := fem.NewMesh([]float64{0.7, 2.3, 1.1}, 1, 0.13, 1)
	n, ne := m.Nodes(), m.Elements()
	cases := []struct {
		name         string
		tr           *transient
		leakT, leakB float64
	}{
		{"held ends", &transient{lo: 1, hi: n - 1, held: []int{0, n - 1}}, 0, 0},
		{"leaky ends, a draining node", &transient{lo: 0, hi: n, pinned: []int{n / 3}, leakTop: 2e-4, leakBottom: 5e-5}, 2e-4, 5e-5},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			tc.tr.leakTop, tc.tr.leakBottom = tc.leakT, tc.leakB
			checkSolveLumpedNewton(t, m, n, ne, tc.tr)
		})
	}
}

func checkSolveLumpedNewton(t *testing.T, m *fem.Mesh, n, ne int, tr *transient) {
	nl := &nonlinear{tr: tr, m: m, lumped: true}
	ds := lumpedCase(nl)
	nl.gk = filled(ne, func(e int) float64 { return -nl.cc[e] * 0.02 * (1 + math.Sin(0.7*float64(e))) })
	nl.gk[ne/2] = -1e3 * nl.cc[ne/2] // held to ±θΔt g
	const theta, dt = 0.5, 30.0
	if err := nl.solveLumped(theta, dt, ds); err != nil {
		t.Fatal(err)
	}
	// The residual b − A u the long way, as in TestSolveLumped, with the
	// leaks' flux of w = (1−θ)Δt u⁰ + θΔt u.
	mass, cond := fem.NewBand(n, 1), fem.NewBand(n, 1)
	m.AssembleConstant(mass, nl.cm, true, true)
	m.AssembleConstant(cond, nl.cc, false, false)
	b, au := make([]float64, n), make([]float64, n)
	fem.ThetaRHS(b, nl.u0, ds, mass.AB, cond.AB, (1-theta)*dt)
	fem.ThetaRHS(au, nl.u1, nil, mass.AB, cond.AB, -theta*dt)
	c0, c1 := (1-theta)*dt, theta*dt
	for i := range b {
		b[i] -= au[i]
	}
	b[0] -= tr.leakTop * (c0*nl.u0[0] + c1*nl.u1[0])
	b[n-1] -= tr.leakBottom * (c0*nl.u0[n-1] + c1*nl.u1[n-1])
	// A' dense; a draining node's row the identity, its update zero.
	a := mat.NewDense(n, n, nil)
	held := 0
	for e := range ne {
		h := m.Z[e+1] - m.Z[e]
		g := nl.cc[e] / h
		wa, wb := c0*nl.u0[e]+c1*nl.u1[e], c0*nl.u0[e+1]+c1*nl.u1[e+1]
		s := 0.5 * (wa - wb) * nl.gk[e] / h
		if math.Abs(s) > c1*g {
			s = math.Copysign(c1*g, s)
			held++
		}
		a.Set(e, e, a.At(e, e)+nl.ct[e]*h/2+c1*g-s)
		a.Set(e+1, e+1, a.At(e+1, e+1)+nl.ct[e]*h/2+c1*g+s)
		a.Set(e, e+1, a.At(e, e+1)-c1*g-s)
		a.Set(e+1, e, a.At(e+1, e)-c1*g+s)
	}
	if held != 1 {
		t.Fatalf("%d elements with the permeability term held, want 1 (the test's set-up)", held)
	}
	a.Set(0, 0, a.At(0, 0)+c1*tr.leakTop)
	a.Set(n-1, n-1, a.At(n-1, n-1)+c1*tr.leakBottom)
	for _, j := range tr.pinned {
		for i := range n {
			a.Set(j, i, 0)
		}
		a.Set(j, j, 1)
		b[j] = 0
	}
	lo, hi := tr.lo, tr.hi
	free := a.Slice(lo, hi, lo, hi)
	rv := mat.NewVecDense(hi-lo, nil)
	for i := lo; i < hi; i++ {
		rv.SetVec(i-lo, b[i])
	}
	var x mat.VecDense
	if err := x.SolveVec(free, rv); err != nil {
		t.Fatal(err)
	}
	worst, scale := 0.0, 0.0
	for i := lo; i < hi; i++ {
		worst = math.Max(worst, math.Abs(nl.rhs[i]-x.AtVec(i-lo)))
		scale = math.Max(scale, math.Abs(x.AtVec(i-lo)))
	}
	if worst > 1e-10*scale || scale == 0 {
		t.Errorf("fused unsymmetric update differs from the dense LU solve by %.3g (largest update %.3g), want ≤ 1e-10 of it", worst, scale)
	}
	for _, j := range tr.pinned {
		if nl.rhs[j] != 0 {
			t.Errorf("draining node %d: update %g, want 0", j, nl.rhs[j])
		}
	}
}

// TestPermeabilityDerivative checks gk, the derivative of k/γw at the
// θ-point by the iterate's effective stress that Newton's matrix takes,
// against central differences of cc (step 1e-4 σ', truncation O(1e-8)):
// within 1e-6 relative, on the virgin line and below the largest past
// stress, for the law k = k0 10^(−θΔe/Ck) (Tavenas et al. 1983) on the
// e–log σ' curve. Where Ck = 0 (constant k) it is zero.
func TestPermeabilityDerivative(t *testing.T) {
	ec := &ECurve{E0: 1.5, Cc: 0.5, Cr: 0.05, Ck: 0.4}
	p := &Project{
		Format: Format, Model: ModelNonlinear,
		Layers: []Layer{{Thickness: 2, GammaSat: 18, K: 1e-9, ECurve: ec},
			{Thickness: 1, GammaSat: 18, K: 1e-9, ECurve: &ECurve{E0: 1.2, Cc: 0.3, Cr: 0.03}}},
		Top: Boundary{Drained: true}, Bottom: Boundary{Drained: false},
		Loads: []Load{{Start: 0, Q: 50}},
		Mesh:  MeshSettings{MaxSize: 0.25},
	}
	if err := Validate(p); err != nil {
		t.Fatal(err)
	}
	c := newColumn(p)
	tr := newTransient(c, nil)
	ne, n := c.m.Elements(), c.m.Nodes()
	pts, law := make([]soil.Point, ne), make([]bool, ne)
	for e := range ne {
		l := p.Layers[c.m.Layer[e]].ECurve
		_, z0, z1 := c.m.Span(e)
		// σ'0 = 40 kPa, σ'p = 60 kPa: the iterate below reaches 40 + 30 =
		// 70 on the upper elements (virgin line) and 40 + 10 = 50 on the
		// lower (recompression).
		pts[e], law[e] = soil.NewPoint(curveOf(l), z1-z0, 40, 60), true
	}
	nl := newNonlinear(tr, pts, law, make([]float64, len(p.Layers)), 100)
	if nl.gk == nil {
		t.Fatal("no gk on a lumped column with Ck > 0")
	}
	sigma, u := make([]float64, n), make([]float64, n)
	for i := range n {
		sigma[i] = 50
		u[i] = 20 + 20*c.m.Z[i]/3 // to = 40 + 50 − u: 70 at the top, 50 at the base
	}
	const theta = 0.5
	nl.loadStress(sigma)
	nl.coefficients(theta, u)
	gk := append([]float64(nil), nl.gk...)
	at := func(shift float64) []float64 {
		v := make([]float64, n)
		for i := range v {
			v[i] = u[i] - shift // σ' rises by shift
		}
		nl.coefficients(theta, v)
		return append([]float64(nil), nl.cc...)
	}
	for e := range ne {
		to := pts[e].S0 + nl.mean(sigma, e) - nl.mean(u, e)
		d := 1e-4 * to
		up, down := at(d), at(-d)
		want := (up[e] - down[e]) / (2 * d)
		if c.m.Layer[e] == 1 { // Ck = 0
			if gk[e] != 0 || want != 0 {
				t.Errorf("element %d (constant k): gk %g, differences %g, want 0", e, gk[e], want)
			}
			continue
		}
		if math.Abs(gk[e]-want) > 1e-6*math.Abs(want) || want >= 0 {
			t.Errorf("element %d at σ' %.4g kPa: gk %.8g, central differences %.8g (want negative, within 1e-6)", e, to, gk[e], want)
		}
	}
}
