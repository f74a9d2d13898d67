package solver

import (
	"porelight/solver/soil"

	"fmt"
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"porelight/solver/internal/series"
)

// uniformClay is a single clay layer of thickness h with cv = k/(mv γw)
// = 1e-9·86400/(1e-3·9.81) m²/day under an instantaneous load q at t = 0.
func uniformClay(h float64, bottomDrained bool) *Project {
	return &Project{
		Format: Format,
		Layers: []Layer{{Name: "clay", Thickness: h, GammaSat: 18, K: 1e-9, Mv: 1e-3}},
		Top:    Boundary{Drained: true}, Bottom: Boundary{Drained: bottomDrained},
		Loads: []Load{{Start: 0, Q: 100}},
	}
}

var clayCv = soil.Cv(1e-9, 1e-3, 9.81) // m²/day

// TestTerzaghiUniform compares the solver with default numerical settings
// against Terzaghi's (1943) series for a uniform initial excess pressure
// (series.TerzaghiU, series.TerzaghiExcess), with one and two drained
// ends: U within 0.001 for 0.005 ≤ Tv ≤ 2 and isochrones within 0.5 % of
// u0 for Tv ≥ 0.01 (the tolerances).
func TestTerzaghiUniform(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name    string
		drained bool    // bottom drained
		hdr     float64 // drainage path, m
		order   int
	}{
		{"double drainage, linear", true, 5, 1},
		{"single drainage, linear", false, 10, 1},
		{"double drainage, quadratic", true, 5, 2},
		{"single drainage, quadratic", false, 10, 2},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			p := uniformClay(10, tt.drained)
			p.Mesh.Order = tt.order
			tv := func(days float64) float64 { return clayCv * days / (tt.hdr * tt.hdr) }
			for _, T := range []float64{0.01, 0.05, 0.1, 0.2, 0.5, 1} {
				p.Times = append(p.Times, T*tt.hdr*tt.hdr/clayCv)
			}
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			s := r.Consolidation.Series
			checked := 0
			for i, tm := range s.Time {
				T := tv(tm)
				if T < 0.005 || T > 2 {
					continue
				}
				checked++
				if want := series.TerzaghiU(T); math.Abs(s.Us[i]-want) > 0.001 {
					t.Errorf("Us(Tv=%.4g) = %.5f, Terzaghi (1943) series %.5f (tolerance 0.001)", T, s.Us[i], want)
				}
				// One layer: the degrees by settlement and by pore
				// pressure coincide (uniform mv).
				if math.Abs(s.Up[i]-s.Us[i]) > 1e-9 {
					t.Errorf("Up(Tv=%.4g) = %.9f differs from Us = %.9f in a uniform layer (tolerance 1e-9)", T, s.Up[i], s.Us[i])
				}
			}
			if checked < 50 {
				t.Fatalf("only %d series points in 0.005 ≤ Tv ≤ 2", checked)
			}
			for _, iso := range r.Consolidation.Isochrones {
				T := tv(iso.Time)
				for j, z := range r.Consolidation.Depth {
					d := z // distance from the drained face
					if tt.drained && z > 5 {
						d = 10 - z
					}
					want := 100 * series.TerzaghiExcess(d/tt.hdr, T)
					if math.Abs(iso.Excess[j]-want) > 0.5 {
						t.Errorf("u(z=%.3g, Tv=%.3g) = %.3f kPa, Terzaghi (1943) series %.3f kPa (tolerance 0.5 %% of u0 = 0.5 kPa)", z, T, iso.Excess[j], want)
						break
					}
				}
			}
		})
	}
}

// TestUTvTable checks the times to 50 % and 90 % consolidation and to a
// target degree against the U–Tv table reproduced in most soil mechanics
// texts (values from memory, confirmed by series.TvForU in the series
// package's own tests): Tv50 = 0.197, Tv90 = 0.848, Tv60 = 0.286.
func TestUTvTable(t *testing.T) {
	t.Parallel()
	p := uniformClay(10, false) // drainage path 10 m
	p.TargetDegree = 0.6
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	sm := r.Summary
	for _, c := range []struct {
		name string
		got  *float64
		tv   float64
	}{{"t50", sm.T50, 0.197}, {"t90", sm.T90, 0.848}, {"tTarget (60 %)", sm.TTarget, 0.286}} {
		if c.got == nil {
			t.Errorf("%s missing", c.name)
			continue
		}
		tv := *c.got * clayCv / 100
		// Tolerance 0.5 % of Tv: the table's three decimals and the
		// solver's U error of < 0.001.
		if math.Abs(tv-c.tv) > 0.005*c.tv {
			t.Errorf("%s gives Tv = %.4f, U–Tv table %.3f (tolerance 0.5 %%)", c.name, tv, c.tv)
		}
	}
	if sm.SettlementLinear == nil || math.Abs(*sm.SettlementLinear-1e-3*10*100) > 1e-9 {
		t.Errorf("final settlement %v, want mv·H·q = 1 m (Terzaghi 1943, ±1e-9 m)", sm.SettlementLinear)
	}
}

// TestTriangularInitialExcess checks linearly varying initial excess
// pressure on one drainage path against the Fourier series of that profile
// (Terzaghi 1943; series.ProfileExcess, series.ProfileU).
func TestTriangularInitialExcess(t *testing.T) {
	t.Parallel()
	const h = 8.0
	tests := []struct {
		name string
		top  float64 // u0 at the drained top, kPa
		base float64 // u0 at the undrained base, kPa
	}{
		{"zero at the drained face", 0, 80},
		{"zero at the undrained face", 80, 0},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			p := uniformClay(h, false)
			p.Loads = nil
			p.InitialExcess = []DepthValue{{Z: 0, Value: tt.top}, {Z: h, Value: tt.base}}
			u0 := func(Z float64) float64 { return tt.top + (tt.base-tt.top)*Z }
			for _, T := range []float64{0.02, 0.1, 0.3, 0.8} {
				p.Times = append(p.Times, T*h*h/clayCv)
			}
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			for _, iso := range r.Consolidation.Isochrones {
				T := clayCv * iso.Time / (h * h)
				for j, z := range r.Consolidation.Depth {
					want := series.ProfileExcess(u0, z/h, T)
					if math.Abs(iso.Excess[j]-want) > 0.4 {
						t.Errorf("u(z=%.3g, Tv=%.3g) = %.3f kPa, series %.3f kPa (tolerance 0.5 %% of 80 kPa)", z, T, iso.Excess[j], want)
						break
					}
				}
			}
			s := r.Consolidation.Series
			for i, tm := range s.Time {
				T := clayCv * tm / (h * h)
				if T < 0.005 || T > 2 {
					continue
				}
				if want := series.ProfileU(u0, T); math.Abs(s.Up[i]-want) > 0.002 {
					t.Errorf("Up(Tv=%.4g) = %.5f, series %.5f (tolerance 0.002)", T, s.Up[i], want)
					break
				}
			}
		})
	}
}

// TestOlsonRamp checks a load rising linearly over a construction time
// against Olson (1977), J. Geotech. Eng. Div. ASCE 103(GT1) (series.OlsonU):
// U within 0.002 for 0.005 ≤ Tv ≤ 2.
func TestOlsonRamp(t *testing.T) {
	t.Parallel()
	for _, tc := range []float64{0.1, 0.5, 2} {
		t.Run(fmt.Sprintf("Tc=%g", tc), func(t *testing.T) {
			t.Parallel()
			p := uniformClay(10, false)
			p.Loads = []Load{{Start: 0, Ramp: tc * 100 / clayCv, Q: 100}}
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			s := r.Consolidation.Series
			for i, tm := range s.Time {
				T := clayCv * tm / 100
				if T < 0.005 || T > 2 {
					continue
				}
				if want := series.OlsonU(T, tc); math.Abs(s.Us[i]-want) > 0.002 {
					t.Errorf("Us(Tv=%.4g) = %.5f, Olson (1977) %.5f (tolerance 0.002)", T, s.Us[i], want)
					break
				}
			}
		})
	}
}

// TestConvergenceOrder measures the observed order of the isochrone error
// against Terzaghi's series: in space with small uniform steps (O(h²) for
// linear and O(h³) for quadratic elements; Strang & Fix 1973), and in time
// on a fine mesh with uniform steps after the damped start (O(Δt²) for
// Crank–Nicolson with backward Euler start-up steps; Rannacher 1984).
func TestConvergenceOrder(t *testing.T) {
	t.Parallel()
	const h = 1.0         // single drainage, drainage path 1 m
	tEval := 0.2 / clayCv // Tv = 0.2
	l2 := func(p *Project) float64 {
		p.Times = []float64{tEval}
		p.Stepping.EndTime = tEval
		r, err := Solve(p, nil)
		if err != nil {
			t.Fatal(err)
		}
		c := newColumn(p)
		u := r.Consolidation.Isochrones[0].Excess
		// L2 norm of the error by 5-point Gauss quadrature per element.
		var x, w [5]float64
		quad.Legendre{}.FixedLocations(x[:], w[:], -1, 1)
		sum := 0.0
		for e := range c.m.Elements() {
			_, z0, z1 := c.m.Span(e)
			for q := range x {
				z := z0 + (x[q]+1)*(z1-z0)/2
				d := c.m.Interpolate(u, z) - 100*series.TerzaghiExcess(z/h, 0.2)
				sum += d * d * w[q] * (z1 - z0) / 2
			}
		}
		return math.Sqrt(sum)
	}
	order := func(errs []float64) float64 {
		n := len(errs)
		return math.Log2(errs[n-2] / errs[n-1])
	}
	tests := []struct {
		name  string
		vary  func(p *Project, level int)
		want  float64
		slack float64
	}{
		{"space, linear", func(p *Project, l int) {
			p.Mesh = MeshSettings{Order: 1, MaxSize: h / float64(int(8)<<l), MinPerLayer: 1}
			p.Stepping = Stepping{FirstStep: tEval / 4000, Growth: 1}
		}, 2, 0.15},
		{"space, quadratic", func(p *Project, l int) {
			p.Mesh = MeshSettings{Order: 2, MaxSize: h / float64(int(4)<<l), MinPerLayer: 1}
			p.Stepping = Stepping{FirstStep: tEval / 4000, Growth: 1}
		}, 3, 0.2},
		{"time, Crank–Nicolson after 4 backward Euler steps", func(p *Project, l int) {
			p.Mesh = MeshSettings{Order: 2, MaxSize: h / 64, MinPerLayer: 1}
			p.Stepping = Stepping{FirstStep: tEval / float64(int(16)<<l), Growth: 1}
		}, 2, 0.15},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			var errs []float64
			for level := range 4 {
				p := uniformClay(h, false)
				tt.vary(p, level)
				errs = append(errs, l2(p))
			}
			got := order(errs)
			t.Logf("observed order %.3f, L2 errors %.3g", got, errs)
			if math.Abs(got-tt.want) > tt.slack {
				t.Errorf("observed order %.3f (L2 errors %.3g), want %g ± %g", got, errs, tt.want, tt.slack)
			}
		})
	}
}

// TestLayeredSchiffmanStein compares two- and three-layer columns with the
// eigenfunction solution of Schiffman & Stein (1970), J. Soil Mech. Found.
// Div. ASCE 96(SM4) (series.Layered, an independent implementation):
// isochrones within 0.5 % of the load and Us, Up within 0.005, at times
// from TimeFactor 0.01 to 1 of the whole column.
func TestLayeredSchiffmanStein(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name        string
		layers      []Layer
		top, bottom bool
	}{
		{"two layers, stiff over soft, both ends drained", []Layer{
			{Name: "a", Thickness: 3, GammaSat: 18, K: 4e-9, Mv: 5e-4},
			{Name: "b", Thickness: 5, GammaSat: 17, K: 1e-9, Mv: 1.5e-3}}, true, true},
		{"two layers, drained top only", []Layer{
			{Name: "a", Thickness: 2, GammaSat: 18, K: 1e-10, Mv: 2e-3},
			{Name: "b", Thickness: 6, GammaSat: 17, K: 2e-9, Mv: 4e-4}}, true, false},
		{"three layers with a permeable middle, drained base only", []Layer{
			{Name: "a", Thickness: 4, GammaSat: 17, K: 1e-9, Mv: 1e-3},
			{Name: "b", Thickness: 1, GammaSat: 19, K: 1e-7, Mv: 1e-4},
			{Name: "c", Thickness: 3, GammaSat: 17, K: 5e-10, Mv: 8e-4}}, false, true},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			ref := make([]series.Layer, len(tt.layers))
			for i, l := range tt.layers {
				ref[i] = series.Layer{Thickness: l.Thickness, K: l.K, Mv: l.Mv}
			}
			s, err := series.NewLayered(ref, 9.81, tt.top, tt.bottom, 0)
			if err != nil {
				t.Fatal(err)
			}
			p := &Project{Format: Format, Layers: tt.layers,
				Top: Boundary{Drained: tt.top}, Bottom: Boundary{Drained: tt.bottom},
				Loads: []Load{{Start: 0, Q: 100}}}
			// Times at whole-column time factors 0.01 … 1.
			scale := 0.01 / s.TimeFactor(1)
			for _, T := range []float64{0.01, 0.03, 0.1, 0.3, 1} {
				p.Times = append(p.Times, T/0.01*scale)
			}
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			c := r.Consolidation
			for _, iso := range c.Isochrones {
				for j, z := range c.Depth {
					want := 100 * s.Excess(z, iso.Time)
					if math.Abs(iso.Excess[j]-want) > 0.5 {
						t.Errorf("u(z=%.3g, t=%.4g d) = %.3f kPa, Schiffman & Stein (1970) %.3f kPa (tolerance 0.5 %% of 100 kPa)", z, iso.Time, iso.Excess[j], want)
						break
					}
				}
				i := indexOf(c.Series.Time, iso.Time)
				if got, want := c.Series.Us[i], s.Us(iso.Time); math.Abs(got-want) > 0.005 {
					t.Errorf("Us(t=%.4g d) = %.4f, Schiffman & Stein (1970) %.4f (tolerance 0.005)", iso.Time, got, want)
				}
				if got, want := c.Series.Up[i], s.Up(iso.Time); math.Abs(got-want) > 0.005 {
					t.Errorf("Up(t=%.4g d) = %.4f, Schiffman & Stein (1970) %.4f (tolerance 0.005)", iso.Time, got, want)
				}
			}
		})
	}
}

func indexOf(xs []float64, x float64) int {
	for i, v := range xs {
		if v == x {
			return i
		}
	}
	return -1
}

// TestDrainedEndPressureHistory lowers the pore pressure held at the
// drained top of a clay layer sealed at its base (a drawdown), in one step
// and as a ramp. Since the held change g(t) is uniform in depth, u − g
// solves the loading problem with σ̇ = −ġ, so by superposition (Terzaghi
// 1943; Olson 1977):
//
//	step of −p:               u = −p·(1 − TerzaghiExcess(Z, Tv))
//	ramp to −p over Tc:       u = −p·min(Tv/Tc, 1) + p·OlsonExcess(Z, Tv, Tc)
//
// Isochrones within 0.5 % of p; the final settlement is mv·H·p.
func TestDrainedEndPressureHistory(t *testing.T) {
	t.Parallel()
	const h, p = 6.0, 30.0
	day := func(T float64) float64 { return T * h * h / clayCv }
	tc := 0.4
	tests := []struct {
		name    string
		history []TimeValue
		want    func(Z, T float64) float64
	}{
		{"step drawdown", []TimeValue{{T: 0, Value: -p}}, func(Z, T float64) float64 {
			return -p * (1 - series.TerzaghiExcess(Z, T))
		}},
		{"ramped drawdown", []TimeValue{{T: 0, Value: 0}, {T: day(tc), Value: -p}}, func(Z, T float64) float64 {
			return -p*math.Min(T/tc, 1) + p*series.OlsonExcess(Z, T, tc)
		}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			pr := uniformClay(h, false)
			pr.Loads = nil
			pr.Top.Excess = tt.history
			for _, T := range []float64{0.02, 0.1, 0.3, 0.6, 1.2} {
				pr.Times = append(pr.Times, day(T))
			}
			r, err := Solve(pr, nil)
			if err != nil {
				t.Fatal(err)
			}
			for _, iso := range r.Consolidation.Isochrones {
				T := clayCv * iso.Time / (h * h)
				for j, z := range r.Consolidation.Depth {
					if want := tt.want(z/h, T); math.Abs(iso.Excess[j]-want) > 0.005*p {
						t.Errorf("u(z=%.3g, Tv=%.3g) = %.3f kPa, superposition %.3f kPa (tolerance 0.5 %% of %g kPa)", z, T, iso.Excess[j], want, p)
						break
					}
				}
			}
			// Tolerance 1e-9 m: the final state is exact on any mesh.
			if got, want := *r.Summary.SettlementLinear, 1e-3*h*p; math.Abs(got-want) > 1e-9 {
				t.Errorf("final settlement %.9g m, want mv·H·p = %.9g m", got, want)
			}
		})
	}
}

// TestLinearStepAllocates checks that the linear model's time loop
// allocates nothing once its factors are made: a solve with four times as
// many steps makes as many allocations. The column follows its e–log
// points (soil.Follow), the layer series of a handover, a layer's end of
// primary (Cα) and a piezometer at every step; with Growth 1 and steps of
// an exact binary fraction the step lengths, and so the factors, are the
// same two (damped and Crank–Nicolson) at either count.
func TestLinearStepAllocates(t *testing.T) {
	p, _ := drClay(2, 50, 50)
	p.Model = ModelLinear
	p.Layers[0].Calpha = 0.01
	p.Piezometers = []float64{1}
	p.Decisions = &Decisions{Handover: 2}
	count := func(steps float64) float64 {
		p.Stepping = Stepping{FirstStep: 4 / steps, Growth: 1, EndTime: 4}
		return testing.AllocsPerRun(2, func() {
			if _, err := Solve(p, nil); err != nil {
				t.Fatal(err)
			}
		})
	}
	if a, b := count(128), count(512); b > a+2 {
		t.Errorf("%g allocations for 128 steps, %g for 512: the loop allocates", a, b)
	}
}
