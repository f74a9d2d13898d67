package solver

import (
	"fmt"
	"math"
	"testing"

	"porelight/solver/internal/series"
	"porelight/solver/soil"
)

// solveUniform runs Solve's steps on p with the initial effective stress
// replaced by s0 at every node: the weightless column of the classical
// consolidation theories (Davis & Raymond 1965 take σ'0 uniform with
// depth). Only tests use it; the column, its steady state and the
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
