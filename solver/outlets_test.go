package solver

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"porelight/solver/internal/series"
	"porelight/solver/soil"
)

// sandwich is 5 m of clay, 0.1 m of sand and 5 m of clay, drained at both
// ends, under an instantaneous load q; outlet marks the sand as draining to
// an outlet. nonlinear puts the clay on the e–log model with Ck = Cc (Davis
// & Raymond's constant cv); it returns the project and the clay's cv at
// σ'0 = s0 (m²/day).
func sandwich(outlet, nonlinear bool, s0, q float64) (*Project, float64) {
	clay := Layer{Name: "clay", Thickness: 5, GammaSat: 18, K: 1e-9, Mv: 1e-3}
	cv := soil.Cv(clay.K, clay.Mv, DefaultGammaW)
	p := &Project{Format: Format,
		Layers: []Layer{clay, {Name: "sand", Thickness: 0.1, GammaSat: 20, K: 1e-4, Mv: 1e-7}, clay},
		Top:    Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads: []Load{{Start: 0, Q: q}},
		Times: []float64{1, 10, 100, 1000},
		Mesh:  MeshSettings{MaxSize: 0.05},
	}
	if nonlinear {
		ec := &ECurve{E0: 1.5, Cc: 0.5, Cr: 0.05, Ck: 0.5}
		p.Model = ModelNonlinear
		for _, i := range []int{0, 2} {
			p.Layers[i].Mv = 0
			p.Layers[i].ECurve = ec
		}
		cv = soil.Cv(1e-9, soil.TangentMv(curveOf(ec), s0, s0), DefaultGammaW)
	}
	if outlet {
		p.Layers[1].Outlet = &Outlet{}
	}
	return p, cv
}

// TestOutletHalvesPath checks a draining layer at mid-depth of a
// symmetric column drained at both ends: it halves the drainage path of
// each clay layer (5 m to 2.5 m), so t50 falls by 4 (Tv = cv t/d²,
// Terzaghi 1925). Reference: Terzaghi's series, series.TvForU(0.5) =
// 0.1967 (package series, independent of the solver), with d = 2.5 m and
// d = 5 m; on the non-linear model with Ck = Cc the degree of settlement
// follows Terzaghi's U too (Davis & Raymond 1965). The sand's own storage
// (1e-7 of the clay's mv per metre, 0.1 m) and its tiny resistance shift
// t50 by far less than the tolerance: 1.5 % on t50 (mesh of 0.05 m,
// t50 read between log-spaced steps), 3 % on the ratio; linear and
// quadratic elements (the consistent capacity on the band path).
func TestOutletHalvesPath(t *testing.T) {
	t.Parallel()
	const s0, q = 50.0, 50.0
	tv50 := series.TvForU(0.5)
	for _, c := range []struct {
		nonlinear bool
		order     int
	}{{false, 1}, {true, 1}, {false, 2}, {true, 2}} {
		nonlinear := c.nonlinear
		t.Run(fmt.Sprintf("nonlinear=%v,order=%d", nonlinear, c.order), func(t *testing.T) {
			t.Parallel()
			t50 := map[bool]float64{}
			for _, outlet := range []bool{false, true} {
				p, cv := sandwich(outlet, nonlinear, s0, q)
				p.Mesh.Order = c.order
				r := solveUniform(t, p, s0)
				if r.Summary.T50 == nil {
					t.Fatalf("outlet=%v: no t50", outlet)
				}
				d := 5.0
				if outlet {
					d = 2.5
				}
				want := tv50 * d * d / cv
				got := *r.Summary.T50
				t50[outlet] = got
				t.Logf("outlet=%v: t50 = %.5g days, series %.5g", outlet, got, want)
				if math.Abs(got-want) > 0.015*want {
					t.Errorf("outlet=%v: t50 = %.4g days, Terzaghi's series gives %.4g (tolerance 1.5 %%)", outlet, got, want)
				}
				if outlet {
					// The sand's nodes hold zero excess at every step.
					for _, z := range []float64{5, 5.05, 5.1} {
						j := nodeAt(r.Steady.Depth, z)
						for _, is := range r.Consolidation.Isochrones {
							if is.Excess[j] != 0 {
								t.Errorf("excess %g kPa at %g m in the draining layer at %g days, want 0", is.Excess[j], z, is.Time)
							}
						}
					}
				}
			}
			if ratio := t50[false] / t50[true]; math.Abs(ratio-4) > 0.12 {
				t.Errorf("t50 falls by %.4g with the draining layer, want 4 (tolerance 3 %%)", ratio)
			}
		})
	}
}

func nodeAt(zs []float64, z float64) int {
	best := 0
	for i, v := range zs {
		if math.Abs(v-z) < math.Abs(zs[best]-z) {
			best = i
		}
	}
	return best
}

// TestLeakyEndLimits checks the end that drains through a resistance R:
// t50 grows with R and lies between the freely drained end (R → 0,
// within 0.5 % of it at R = 1e-6 days) and the sealed one (R → ∞: at
// R = 1e12 days the degree at the end of the simulation stays below
// 1e-4, where a sealed end gives none). The drained limit is Terzaghi's
// t50 = 0.1967 H²/cv for one drained end (series.TvForU), tolerance 1.5 %;
// the ordering is a fact of the Robin condition (more resistance, slower
// drainage), checked on both models. On the linear model t50 also
// matches the series of the leaky layer (series.LeakyTv: λ tan λ = Bi,
// Carslaw & Jaeger 1959) within 1.5 %.
func TestLeakyEndLimits(t *testing.T) {
	t.Parallel()
	for _, model := range []string{ModelLinear, ModelNonlinear} {
		t.Run(model, func(t *testing.T) {
			t.Parallel()
			clay := Layer{Name: "clay", Thickness: 5, GammaSat: 18, K: 1e-9, Mv: 1e-3}
			if model == ModelNonlinear {
				clay.ECurve = &ECurve{E0: 1.5, Cc: 0.5, Cr: 0.05, Ck: 0.5}
				clay.Mv = 0
			}
			const s0 = 50.0
			cv := soil.Cv(clay.K, 1e-3, DefaultGammaW)
			if model == ModelNonlinear {
				cv = soil.Cv(clay.K, soil.TangentMv(curveOf(clay.ECurve), s0, s0), DefaultGammaW)
			}
			terz := series.TvForU(0.5) * 25 / cv
			last := 0.0
			for _, R := range []float64{1e-6, 10, 1000, 1e5, 1e12} {
				p := &Project{Format: Format, Model: model, Layers: []Layer{clay},
					Top: Boundary{Drained: true, Resistance: R}, Loads: []Load{{Q: 50}},
					Mesh: MeshSettings{MaxSize: 0.05}}
				r := solveUniform(t, p, s0)
				us := r.Consolidation.Series.Us
				switch {
				case R == 1e12:
					if u := us[len(us)-1]; u > 1e-4 {
						t.Errorf("R = %g days: Us = %.3g at the end, want < 1e-4 (the sealed limit)", R, u)
					}
					continue
				case r.Summary.T50 == nil:
					t.Fatalf("R = %g days: no t50", R)
				}
				got := *r.Summary.T50
				if R == 1e-6 && math.Abs(got-terz) > 0.015*terz {
					t.Errorf("R = %g days: t50 = %.4g days, the drained end gives %.4g (Terzaghi, tolerance 1.5 %%)", R, got, terz)
				}
				t.Logf("R = %g days: t50 = %.5g days (drained: %.5g)", R, got, terz)
				if model == ModelLinear && R > 1e-6 {
					// The Robin end's own series (series.LeakyU, the slab
					// with a radiation boundary), Bi = H/(k R) with k in
					// m/day: tolerance 1.5 %.
					bi := 5 / (clay.K * soil.SecondsPerDay * R)
					want := series.LeakyTv(0.5, bi) * 25 / cv
					if math.Abs(got-want) > 0.015*want {
						t.Errorf("R = %g days (Bi %.3g): t50 = %.5g days, the leaky series gives %.5g (tolerance 1.5 %%)", R, bi, got, want)
					}
				}
				if got <= last {
					t.Errorf("R = %g days: t50 = %.4g days is not above %.4g at the smaller resistance", R, got, last)
				}
				last = got
			}
		})
	}
}

// TestLeakySteadyByHand checks the Robin end on steady seepage against
// resistances in series (Darcy's law, by hand): two layers (2 m of k =
// 1e-8 m/s over 3 m of 1e-7 m/s), the top drained at head 0, the base
// drained at head 4 m through R = 50 days. The upward Darcy velocity is
//
//	q = (4 − 0)/(d1/k1 + d2/k2 + R·86400 s/day)
//	  = 4/(2e8 + 3e7 + 4.32e6) s = 1.7065e-8 m/s,
//
// and the head at the base 4 − q·R·86400 = 3.9263 m. Linear elements are
// nodally exact for this problem: tolerance 1e-9 relative.
func TestLeakySteadyByHand(t *testing.T) {
	t.Parallel()
	p := &Project{Format: Format,
		Layers: []Layer{{Thickness: 2, GammaSat: 18, K: 1e-8, Mv: 1e-4}, {Thickness: 3, GammaSat: 19, K: 1e-7, Mv: 1e-4}},
		Top:    Boundary{Drained: true, Head: ptr(0)}, Bottom: Boundary{Drained: true, Head: ptr(4), Resistance: 50}}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	R := 50 * float64(soil.SecondsPerDay)
	q := 4 / (2/1e-8 + 3/1e-7 + R)
	hb := 4 - q*R
	st := r.Steady
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"upward velocity in layer 1", -st.Layers[0].Flux, q},
		{"upward velocity in layer 2", -st.Layers[1].Flux, q},
		{"head at the base", st.Head[len(st.Head)-1], hb},
		{"head at the layer boundary", st.Head[nodeAt(st.Depth, 2)], q * 2 / 1e-8},
	} {
		if math.Abs(c.got-c.want) > 1e-9*math.Abs(c.want) {
			t.Errorf("%s = %.10g, by hand %.10g (tolerance 1e-9 relative)", c.what, c.got, c.want)
		}
	}
}

// TestOutletSteadyByHand checks a draining layer in the steady state:
// clay (2 m, 1e-9 m/s) over sand (1 m, an outlet at head −3 m) over clay
// (2 m), both ends at head 0. The sand holds −3 m at every node, and each
// clay layer carries k·3/2 = 1.5e-9 m/s toward it (Darcy's law, by hand),
// downward in the upper layer and upward in the lower; tolerance 1e-9
// relative.
func TestOutletSteadyByHand(t *testing.T) {
	t.Parallel()
	clay := Layer{Thickness: 2, GammaSat: 18, K: 1e-9, Mv: 1e-4}
	p := &Project{Format: Format,
		Layers: []Layer{clay, {Thickness: 1, GammaSat: 20, K: 1e-4, Mv: 1e-6, Outlet: &Outlet{Head: ptr(-3)}}, clay},
		Top:    Boundary{Drained: true, Head: ptr(0)}, Bottom: Boundary{Drained: true, Head: ptr(0)}}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	st := r.Steady
	for i, z := range st.Depth {
		if z >= 2-1e-12 && z <= 3+1e-12 && st.Head[i] != -3 {
			t.Errorf("head %g m at %g m in the draining layer, want −3", st.Head[i], z)
		}
	}
	for _, c := range []struct {
		layer int
		want  float64
	}{{0, 1.5e-9}, {2, -1.5e-9}} {
		if got := st.Layers[c.layer].Flux; math.Abs(got-c.want) > 1e-9*math.Abs(c.want) {
			t.Errorf("layer %d: flux %.10g m/s, by hand %.10g", c.layer+1, got, c.want)
		}
	}
}

// TestOutletValidation checks the refusals of the new fields: each names
// its field and reason.
func TestOutletValidation(t *testing.T) {
	t.Parallel()
	base := func() *Project {
		return &Project{Format: Format,
			Layers: []Layer{{Thickness: 2, GammaSat: 18, K: 1e-9, Mv: 1e-4}, {Thickness: 1, GammaSat: 18, K: 1e-9, Mv: 1e-4}},
			Top:    Boundary{Drained: true}}
	}
	for _, c := range []struct {
		name string
		edit func(p *Project)
		path string
		err  error
	}{
		{"resistance on a sealed end", func(p *Project) { p.Bottom.Resistance = 10 }, "bottom.resistance", ErrConflict},
		{"negative resistance", func(p *Project) { p.Top.Resistance = -1 }, "top.resistance", ErrNotPositive},
		{"huge resistance", func(p *Project) { p.Top.Resistance = 1e20 }, "top.resistance", ErrOutOfRange},
		{"history on a leaky end", func(p *Project) {
			p.Top.Resistance = 10
			p.Top.Excess = []TimeValue{{T: 1, Value: -5}}
		}, "top.excess", ErrConflict},
		{"outlet head out of range", func(p *Project) { p.Layers[1].Outlet = &Outlet{Head: ptr(1e9)} }, "layers[1].outlet.head", ErrOutOfRange},
		{"outlet with drains", func(p *Project) {
			p.Layers[1].Outlet = &Outlet{}
			p.Drains = &Drains{Pattern: "triangular", Spacing: 1.5, Diameter: 0.05}
		}, "layers[1].outlet", ErrConflict},
		{"touching outlets at two heads", func(p *Project) {
			p.Layers[0].Outlet = &Outlet{Head: ptr(-1)}
			p.Layers[1].Outlet = &Outlet{Head: ptr(-2)}
		}, "layers[1].outlet.head", ErrConflict},
	} {
		t.Run(c.name, func(t *testing.T) {
			p := base()
			c.edit(p)
			ps := AsProblems(Validate(p))
			found := false
			for _, pr := range ps {
				if pr.Path == c.path && errors.Is(pr.Err, c.err) {
					found = true
				}
			}
			if !found {
				t.Errorf("want %v at %s, got %v", c.err, c.path, ps)
			}
		})
	}
}
