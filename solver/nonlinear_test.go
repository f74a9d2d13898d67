package solver

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"porelight/solver/fem"
	"porelight/solver/internal/series"
	"porelight/solver/soil"
)

// solveUniform runs Solve's steps on p with the initial effective stress
// replaced by s0 at every node: the weightless column of the classical
// consolidation theories (Davis & Raymond 1965 take σ'0 uniform with
// depth), with the drains' Uv and Uh as Solve gives them. Only tests use it; the column, its steady state and the
// consolidation are the solver's own.
func solveUniform(t *testing.T, p *Project, s0 float64) *Result {
	t.Helper()
	if err := Validate(p); err != nil {
		t.Fatal(err)
	}
	c := newColumn(p)
	r := &Result{Warnings: []Warning{}}
	warn := func(path, msg string) { r.Warnings = append(r.Warnings, Warning{Path: path, Message: msg}) }
	st, err := c.steady(warn)
	if err != nil {
		t.Fatal(err)
	}
	for i := range st.Effective {
		st.Effective[i] = s0
	}
	r.Steady = st
	if err := c.consolidate(&r.Steady, r, nil, warn); err != nil {
		t.Fatal(err)
	}
	if c.drains != nil { // as Solve does
		if err := c.drainReference(&r.Steady, r, nil, true); err != nil {
			t.Fatal(err)
		}
	}
	return r
}

// drClay is a normally consolidated clay of thickness h, drained at the
// top, on the non-linear model with Ck = Cc: then k ∝ 1/σ' as mv is, so
// cv = k/(mv γw) stays at its initial value (the case of Davis & Raymond
// 1965). It returns the project and that cv, m²/day, for σ'0 = s0.
func drClay(h, s0, q float64) (*Project, float64) {
	ec := &ECurve{E0: 1.5, Cc: 0.5, Cr: 0.05, Ck: 0.5}
	p := &Project{
		Format: Format, Model: ModelNonlinear,
		Layers: []Layer{{Name: "clay", Thickness: h, GammaSat: 18, K: 1e-9, ECurve: ec}},
		Top:    Boundary{Drained: true}, Bottom: Boundary{Drained: false},
		Loads: []Load{{Start: 0, Q: q}},
	}
	mv0 := soil.TangentMv(curveOf(ec), s0, s0)
	return p, soil.Cv(1e-9, mv0, DefaultGammaW)
}

// TestDavisRaymond checks the non-linear model against the closed form of
// Davis & Raymond (1965), Géotechnique 15(2): for a constant Cc, a
// constant cv and a uniform σ'0, w = log(σ'/σ'f)/log(σ'0/σ'f) obeys
// Terzaghi's equation with w = 1 at t = 0 and w = 0 at the drained face,
// so the degree of settlement equals Terzaghi's U while the excess
// pressure u = σ'f (1 − (σ'0/σ'f)^w) lags behind. Terzaghi's series is
// series.TerzaghiU and series.TerzaghiExcess (independent of the solver).
// Tolerances from issue 11: Us within 0.002 of U at every step with
// 0.005 ≤ Tv ≤ 2, u within 0.5 % of Δσ at the output times (Tv ≥ 0.01).
func TestDavisRaymond(t *testing.T) {
	t.Parallel()
	const h, s0 = 10.0, 50.0
	for _, ratio := range []float64{2, 5} {
		t.Run(fmt.Sprintf("σ'f/σ'0 = %g", ratio), func(t *testing.T) {
			t.Parallel()
			q := s0 * (ratio - 1)
			p, cv := drClay(h, s0, q)
			tvs := []float64{0.01, 0.05, 0.1, 0.2, 0.5, 1}
			for _, T := range tvs {
				p.Times = append(p.Times, T*h*h/cv)
			}
			r := solveUniform(t, p, s0)
			s := r.Consolidation.Series
			worstU := 0.0
			for i, tm := range s.Time {
				T := cv * tm / (h * h)
				if T < 0.005 || T > 2 {
					continue
				}
				worstU = math.Max(worstU, math.Abs(s.Us[i]-series.TerzaghiU(T)))
			}
			if worstU > 0.002 {
				t.Errorf("largest |Us − U| = %.4f, want ≤ 0.002 (Davis & Raymond 1965)", worstU)
			}
			sf := s0 + q
			worstP, apart := 0.0, 0.0
			for _, iso := range r.Consolidation.Isochrones {
				T := cv * iso.Time / (h * h)
				for j, z := range r.Consolidation.Depth {
					w := series.TerzaghiExcess(z/h, T)
					want := sf * (1 - math.Pow(s0/sf, w))
					worstP = math.Max(worstP, math.Abs(iso.Excess[j]-want)/q)
					apart = math.Max(apart, math.Abs(q*w-want)/q)
				}
			}
			if worstP > 0.005 {
				t.Errorf("largest |u − u(Davis & Raymond)| = %.4f Δσ, want ≤ 0.005", worstP)
			}
			// The check tells the two theories apart: Terzaghi's u = Δσ·w
			// is further than 10 tolerances from Davis & Raymond's.
			if apart < 0.05 {
				t.Errorf("Terzaghi's and Davis & Raymond's pressures differ by only %.4f Δσ: the check cannot tell them apart", apart)
			}
			// The pressure lags the settlement (Davis & Raymond 1965): at
			// Tv = 0.2, Up < Us.
			i := indexOf(s.Time, tvs[3]*h*h/cv)
			if !(s.Up[i] < s.Us[i]-0.01) {
				t.Errorf("at Tv = 0.2 Up = %.4f, Us = %.4f: want Up below Us (Davis & Raymond 1965)", s.Up[i], s.Us[i])
			}
			t.Logf("|Us − U| ≤ %.2g, |u − u_DR| ≤ %.2g Δσ, %d steps, %d iterations", worstU, worstP, r.Stats.Steps, r.Stats.Iterations)
			if got, want := *r.Summary.Settlement, 0.5*h/2.5*math.Log10(ratio); math.Abs(got-want) > 1e-6*want {
				t.Errorf("final settlement %.6g m, want Cc H/(1+e0) log10(σ'f/σ'0) = %.6g m (Terzaghi & Peck 1967, ±1e-6 rel.)", got, want)
			}
		})
	}
}

// TestNonlinearLinearLimit checks that a small load step on the
// non-linear model reproduces the linear model with the tangent mv and k
// at σ'0 (the derivative of the e–log σ' curve, Terzaghi & Peck 1967: mv
// = Cc/(ln 10 (1+e0) σ'0)): Δσ/σ'0 = 1e-3, so the secant differs from the
// tangent by about 5e-4. Tolerance from issue 11: 0.1 % of the final
// settlement, and 0.001 in Us, at every step.
func TestNonlinearLinearLimit(t *testing.T) {
	t.Parallel()
	const h, s0, q = 4.0, 100.0, 0.1
	nl, _ := drClay(h, s0, q)
	lin, _ := drClay(h, s0, q)
	lin.Model = ModelLinear
	lin.Layers[0].Mv = soil.TangentMv(curveOf(lin.Layers[0].ECurve), s0, s0)
	rn, rl := solveUniform(t, nl, s0), solveUniform(t, lin, s0)
	sn, sl := rn.Consolidation.Series, rl.Consolidation.Series
	if len(sn.Time) != len(sl.Time) {
		t.Fatalf("%d and %d steps", len(sn.Time), len(sl.Time))
	}
	final := *rl.Summary.Settlement
	worst := 0.0
	// From the first step on: at t = 0 the linear series already counts
	// the half element beside the drained end that drains with the load,
	// which the elements' states take up in the first step.
	for i := 1; i < len(sn.Time); i++ {
		worst = math.Max(worst, math.Abs(sn.Settlement[i]-sl.Settlement[i])/final)
		worst = math.Max(worst, math.Abs(sn.Us[i]-sl.Us[i]))
	}
	if worst > 1e-3 {
		t.Errorf("settlement series differ by up to %.3g of the final settlement, want ≤ 1e-3 (tangent mv, Terzaghi & Peck 1967)", worst)
	}
	if d := math.Abs(*rn.Summary.T50 / *rl.Summary.T50 - 1); d > 1e-3 {
		t.Errorf("t50 %.6g against %.6g days: %.2g apart, want ≤ 1e-3", *rn.Summary.T50, *rl.Summary.T50, d)
	}
	t.Logf("largest difference %.2g of the final settlement", worst)
}

// TestNonlinearUnloadReload loads a normally consolidated clay from σ'0 =
// 50 to 100 kPa, unloads to 70 kPa and reloads to 100 kPa, each stage
// given time to drain, and checks the settlement at the end of each stage
// by hand (Terzaghi & Peck 1967: Cc on the virgin line, Cr on unloading
// and reloading below the peak), tolerance 0.5 % of the first stage's
// settlement (the stages are not fully drained at their ends), and that
// the swelling runs along Cr with its faster cv: the rebound reaches half
// its value in less than a third of the loading's t50 (Cc/Cr = 10).
func TestNonlinearUnloadReload(t *testing.T) {
	t.Parallel()
	const h, s0 = 2.0, 50.0
	p, cv := drClay(h, s0, 50)
	p.Layers[0].ECurve.Ck = 0 // constant k
	stage := 3 * h * h / cv   // Tv = 3 of the loading cv
	p.Loads = []Load{{Start: 0, Q: 50}, {Start: stage, Q: -30}, {Start: 2 * stage, Q: 30}}
	p.Stepping.EndTime = 3 * stage
	r := solveUniform(t, p, s0)
	s := r.Consolidation.Series
	f := h / 2.5 // H/(1+e0)
	load := 0.5 * f * math.Log10(100.0/50)
	rebound := 0.05 * f * math.Log10(100.0/70)
	for _, c := range []struct {
		name string
		t    float64
		want float64
	}{
		{"after loading (Cc)", stage, load},
		{"after unloading (Cr)", 2 * stage, load - rebound},
		{"after reloading (Cr)", 3 * stage, load},
	} {
		got := SeriesAt(s.Time, s.Settlement, c.t)
		if math.Abs(got-c.want) > 0.005*load {
			t.Errorf("%s: %.5f m, want %.5f m (hand-worked, ±0.5 %% of %.4f m)", c.name, got, c.want, load)
		}
	}
	if got := *r.Summary.Settlement; math.Abs(got-load) > 0.005*load {
		t.Errorf("final settlement %.5f m, want %.5f m (hand-worked, ±0.5 %%)", got, load)
	}
	// Time to half the rebound, counted from the unloading.
	start := SeriesAt(s.Time, s.Settlement, stage)
	half := start - rebound/2
	var tHalf float64
	for i, tm := range s.Time {
		if tm > stage && s.Settlement[i] <= half {
			tHalf = tm - stage
			break
		}
	}
	if tHalf == 0 || tHalf > *r.Summary.T50/3 {
		t.Errorf("half the rebound after %.4g days, loading t50 %.4g days: want under a third (swelling along Cr)", tHalf, *r.Summary.T50)
	}
}

// TestNonlinearConvergenceOrder refines the mesh and the time step on the
// Davis & Raymond (1965) case σ'f/σ'0 = 5 and checks the observed orders
// of the largest pressure error at Tv = 0.2 against the closed form:
// second order in element size (linear elements, an O(h²) method,
// Strang & Fix 1973) and in the step (Crank–Nicolson, Crank & Nicolson
// 1947), within 0.3.
func TestNonlinearConvergenceOrder(t *testing.T) {
	t.Parallel()
	if testing.Short() {
		t.Skip("refinement study: run without -short")
	}
	const h, s0, q = 1.0, 50.0, 200.0
	errAt := func(p *Project, cv float64) float64 {
		tEval := 0.2 * h * h / cv
		p.Times = []float64{tEval}
		p.Stepping.EndTime = tEval
		r := solveUniform(t, p, s0)
		worst := 0.0
		for j, z := range r.Consolidation.Depth {
			w := series.TerzaghiExcess(z/h, 0.2)
			want := (s0 + q) * (1 - math.Pow(s0/(s0+q), w))
			worst = math.Max(worst, math.Abs(r.Consolidation.Isochrones[0].Excess[j]-want))
		}
		return worst
	}
	tests := []struct {
		name string
		vary func(p *Project, tEval float64, level int)
	}{
		{"space", func(p *Project, tEval float64, l int) {
			p.Mesh = MeshSettings{MaxSize: h / float64(int(8)<<l), MinPerLayer: 1}
			p.Stepping = Stepping{FirstStep: tEval / 2000, Growth: 1}
		}},
		{"time", func(p *Project, tEval float64, l int) {
			p.Mesh = MeshSettings{MaxSize: h / 256, MinPerLayer: 1}
			p.Stepping = Stepping{FirstStep: tEval / float64(int(16)<<l), Growth: 1}
		}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			var errs []float64
			for level := range 3 {
				p, cv := drClay(h, s0, q)
				tt.vary(p, 0.2*h*h/cv, level)
				errs = append(errs, errAt(p, cv))
			}
			got := math.Log2(errs[1] / errs[2])
			t.Logf("observed order %.3f, largest errors %.3g kPa", got, errs)
			if math.Abs(got-2) > 0.3 {
				t.Errorf("observed order %.3f (errors %.3g kPa), want 2 ± 0.3", got, errs)
			}
		})
	}
}

// TestNonlinearStepAllocates checks that the time loop allocates nothing:
// a solve with four times as many steps makes as many allocations (the
// series are sized before the loop).
func TestNonlinearStepAllocates(t *testing.T) {
	p, cv := drClay(2, 50, 50)
	count := func(steps float64) float64 {
		p.Stepping = Stepping{FirstStep: 4 / cv / steps, Growth: 1, EndTime: 4 / cv}
		return testing.AllocsPerRun(2, func() {
			if _, err := Solve(p, nil); err != nil {
				t.Fatal(err)
			}
		})
	}
	if a, b := count(100), count(400); b > a+2 {
		t.Errorf("%g allocations for 100 steps, %g for 400: the loop allocates", a, b)
	}
}

// TestNonlinearEarlyRemoval removes a surcharge before the clay has
// drained: the final settlement is then what the elements reached plus
// what the remaining excess adds, not the drained path of the stages.
// Hand bound (Terzaghi & Peck 1967): below the settlement of the full
// surcharge drained, Cc H/(1+e0) log10(100/50), and above that of the
// load that stays, Cc H/(1+e0) log10(75/50); and Us ends at 1 ± 0.01
// once everything has drained.
func TestNonlinearEarlyRemoval(t *testing.T) {
	t.Parallel()
	const h, s0 = 2.0, 50.0
	p, cv := drClay(h, s0, 50)
	p.Layers[0].ECurve.Ck = 0
	p.Loads = []Load{{Start: 0, Q: 50}, {Start: 0.2 * h * h / cv, Q: -25}}
	r := solveUniform(t, p, s0)
	f := 0.5 * h / 2.5
	hi, lo := f*math.Log10(100.0/50), f*math.Log10(75.0/50)
	got := *r.Summary.Settlement
	if !(got > lo && got < hi) {
		t.Errorf("final settlement %.5f m, want between %.5f and %.5f m (hand-worked bounds)", got, lo, hi)
	}
	us := r.Consolidation.Series.Us
	if u := us[len(us)-1]; math.Abs(u-1) > 0.01 {
		t.Errorf("Us ends at %.4f, want 1 ± 0.01", u)
	}
}

// lumpedCase gives nl (its mesh set) the arbitrary coefficients, pore
// pressures and work slices of the solveLumped checks, and returns the
// stress change per node.
func lumpedCase(nl *nonlinear) (ds []float64) {
	m := nl.m
	n, ne := m.Nodes(), m.Elements()
	nl.cm = filled(ne, func(e int) float64 { return 1e-3 * (1 + 0.5*math.Sin(float64(e))) })
	nl.ct = filled(ne, func(e int) float64 { return 0.7e-3 * (1 + 0.4*math.Cos(float64(e))) })
	nl.cc = filled(ne, func(e int) float64 { return 1e-4 * math.Exp(2*math.Sin(0.3*float64(e))) })
	nl.u0 = filled(n, func(i int) float64 { return 80 * math.Sin(math.Pi*m.Z[i]/4.1) })
	nl.u1 = filled(n, func(i int) float64 { return nl.u0[i] * (0.9 + 0.01*math.Cos(float64(i))) })
	nl.u1[0], nl.u1[n-1] = 0.5, -0.25
	nl.rows, nl.rhs = make([]lumpedRow, n), make([]float64, n)
	nl.spans = make([]span, ne)
	for e := range ne {
		h := m.Z[e+1] - m.Z[e]
		nl.spans[e] = span{half: h / 2, inv: 1 / h}
	}
	return filled(n, func(i int) float64 { return 3 + m.Z[i] })
}

// filled returns g(0), …, g(k−1).
func filled(k int, g func(i int) float64) []float64 {
	v := make([]float64, k)
	for i := range v {
		v[i] = g(i)
	}
	return v
}

// TestSolveLumped checks the fused update of linear elements against the
// same update taken the long way through package fem's band routines
// (AssembleConstant, FactorizeSum, ThetaRHS, MoveHeldSum, Factor.Solve,
// tested there against dense LAPACK): A' r = b(u) − A(u) u with A' the
// tangent capacity plus θΔt K, on an uneven mesh with held ends and a
// stress change, for arbitrary coefficients. Tolerance 1e-10 of the
// largest update (rounding of two elimination orders). A matrix that is
// not positive definite must be refused, naming its node.
func TestSolveLumped(t *testing.T) {
	m := fem.NewMesh([]float64{0.7, 2.3, 1.1}, 1, 0.13, 1)
	n := m.Nodes()
	nl := &nonlinear{tr: &transient{lo: 1, hi: n - 1, held: []int{0, n - 1}}, m: m, lumped: true}
	ds := lumpedCase(nl)
	const theta, dt = 0.5, 30.0
	if err := nl.solveLumped(theta, dt, ds); err != nil {
		t.Fatal(err)
	}
	// The long way: r = A'⁻¹ (b − A u) with b − A u = M(u⁰+Δσ) −
	// (1−θ)Δt K u⁰ − (M + θΔt K) u.
	mass, massT, cond := fem.NewBand(n, 1), fem.NewBand(n, 1), fem.NewBand(n, 1)
	m.AssembleConstant(mass, nl.cm, true, true)
	m.AssembleConstant(massT, nl.ct, true, true)
	m.AssembleConstant(cond, nl.cc, false, false)
	b, au := make([]float64, n), make([]float64, n)
	fem.ThetaRHS(b, nl.u0, ds, mass.AB, cond.AB, (1-theta)*dt)
	fem.ThetaRHS(au, nl.u1, nil, mass.AB, cond.AB, -theta*dt)
	for i := range b {
		b[i] -= au[i]
	}
	var fac fem.Factor
	if err := fem.FactorizeSum(&fac, massT, cond, theta*dt, 1, n-1); err != nil {
		t.Fatal(err)
	}
	fac.Solve(b)
	worst, scale := 0.0, 0.0
	for i := 1; i < n-1; i++ {
		worst = math.Max(worst, math.Abs(nl.rhs[i]-b[i]))
		scale = math.Max(scale, math.Abs(b[i]))
	}
	if worst > 1e-10*scale || scale == 0 {
		t.Errorf("fused update differs from the band routines' by %.3g (largest update %.3g), want ≤ 1e-10 of it", worst, scale)
	}
	// A negative capacity makes A' indefinite: refused at a node.
	for e := range nl.ct {
		nl.ct[e] = -1
	}
	var nd *fem.NotDefiniteError
	if err := nl.solveLumped(theta, dt, ds); !errors.As(err, &nd) || nd.Node < 1 || nd.Node >= n-1 {
		t.Errorf("indefinite A': got %v, want a NotDefiniteError at a free node", err)
	}
}
