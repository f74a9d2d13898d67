package monitor

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"porelight/solver"
	"porelight/solver/internal/series"

	"gonum.org/v1/gonum/stat"
)

// noisyTerzaghi is a settlement record s∞·U(cv t/d²) (Terzaghi 1943,
// summed by internal/series, independent of the solver) read every step
// days from day 0 to Tv = tvEnd, each reading plus Gaussian noise of
// standard deviation sigma, m, from the seeded source.
func noisyTerzaghi(sInf, cv, d, step, tvEnd, sigma float64, seed uint64) (ts, ss []float64) {
	rng := rand.New(rand.NewPCG(seed, 16))
	for t := 0.0; t <= tvEnd*d*d/cv*(1+1e-12); t += step {
		ts = append(ts, t)
		ss = append(ss, sInf*series.TerzaghiU(cv*t/(d*d))+sigma*rng.NormFloat64())
	}
	return ts, ss
}

// The default window (AutoStart, window.go) on clean Terzaghi records
// recovers the final settlement within 1 % and cv within 5 % (the
// acceptance limits of issue 16), where the whole record after the load
// forecasts more than 3 % low (4–9 % here): the check that the criterion matters. The
// chosen start meets the criterion (HigherModes ≤ FirstModeShare) at
// Tv0 ≈ 0.2, as derived (4 ln 50/(8π²) = 0.198, to within one reading).
func TestAsaokaDefaultWindowClean(t *testing.T) {
	t.Parallel()
	const sInf, cv = 0.5, 0.02 // m, m²/day
	cases := []struct {
		name        string
		d           float64 // drainage path, m
		ends        int
		step, tvEnd float64
	}{
		{"single drainage, to Tv = 1", 4, 1, 10, 1},
		{"double drainage, to Tv = 1", 3, 2, 7, 1},
		{"single drainage, short record to Tv = 0.6", 4, 1, 10, 0.6},
		{"sparse readings to Tv = 1.5", 4, 1, 40, 1.5},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			ts, ss := noisyTerzaghi(sInf, cv, c.d, c.step, c.tvEnd, 0, 0)
			opt := AsaokaOptions{AutoStart: true, Thickness: c.d * float64(c.ends), DrainedEnds: c.ends}
			a, err := Asaoka(ts, ss, 0, opt)
			if err != nil {
				t.Fatal(err)
			}
			if math.Abs(a.Final/sInf-1) > 0.01 || math.Abs(a.Cv/cv-1) > 0.05 {
				t.Errorf("default window from day %g: final %.4g m (true %.4g, 1 %%), cv %.4g (true %.4g, 5 %%)", a.Times[0], a.Final, sInf, a.Cv, cv)
			}
			tv0 := a.Times[0] * cv / (c.d * c.d)
			if !a.AutoStart || a.HigherModes > FirstModeShare || tv0 < 0.19 || tv0 > 0.198+c.step*cv/(c.d*c.d)+0.01 {
				t.Errorf("window starts at Tv = %.3g with higher-mode share %.3g (auto %v)", tv0, a.HigherModes, a.AutoStart)
			}
			opt.AutoStart = false
			w, err := Asaoka(ts, ss, 0, opt)
			if err != nil {
				t.Fatal(err)
			}
			if !(w.Final < 0.97*sInf) {
				t.Errorf("whole record: final %.4g m, expected more than 3 %% below %.4g", w.Final, sInf)
			}
			// The spread table starts at the load and holds the chosen start's
			// neighbours; the quoted ± is at least the standard error.
			if len(a.Starts) < 3 || a.Starts[0].From != 0 || a.FinalUncertainty < a.FinalSE || a.CvUncertainty < a.CvSE {
				t.Errorf("starts %+v, ± %g (SE %g)", a.Starts, a.FinalUncertainty, a.FinalSE)
			}
		})
	}
}

// On records with seeded noise (1 mm, a common precision of levelling
// settlement plates; common practice), the default window is unbiased:
// over 40 seeds the mean forecast is within 1 % of the true final
// settlement and the mean cv within 5 % (issue 16's limits), and the
// stated ± (standard error and window spread, FinalUncertainty) at
// 2 standard deviations covers the truth in at least 90 % of seeds.
// Source of the truth: Terzaghi's series (internal/series).
func TestAsaokaDefaultWindowNoisy(t *testing.T) {
	t.Parallel()
	const sInf, cv, seeds = 0.5, 0.02, 40
	cases := []struct {
		name        string
		d           float64
		ends        int
		step, tvEnd float64
		sigma       float64
	}{
		{"single drainage, weekly-ish readings", 4, 1, 10, 1, 0.001},
		{"double drainage", 3, 2, 7, 1, 0.001},
		{"sparse, noisier", 4, 1, 20, 1.5, 0.002},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			var sumF, sumC float64
			covF, covC := 0, 0
			for seed := range uint64(seeds) {
				ts, ss := noisyTerzaghi(sInf, cv, c.d, c.step, c.tvEnd, c.sigma, seed)
				a, err := Asaoka(ts, ss, 0, AsaokaOptions{AutoStart: true, Thickness: c.d * float64(c.ends), DrainedEnds: c.ends})
				if err != nil {
					t.Fatalf("seed %d: %v", seed, err)
				}
				sumF += a.Final
				sumC += a.Cv
				if math.Abs(a.Final-sInf) <= 2*a.FinalUncertainty {
					covF++
				}
				if math.Abs(a.Cv-cv) <= 2*a.CvUncertainty {
					covC++
				}
			}
			mF, mC := sumF/seeds, sumC/seeds
			if math.Abs(mF/sInf-1) > 0.01 || math.Abs(mC/cv-1) > 0.05 {
				t.Errorf("mean final %.4g m (true %.4g, 1 %%), mean cv %.4g (true %.4g, 5 %%)", mF, sInf, mC, cv)
			}
			if covF < seeds*9/10 || covC < seeds*9/10 {
				t.Errorf("±2 uncertainties cover the final in %d and cv in %d of %d seeds; want at least 90 %%", covF, covC, seeds)
			}
			t.Logf("mean final %.4f m, mean cv %.5f m²/day; coverage %d, %d of %d", mF, mC, covF, covC, seeds)
		})
	}
}

// The forecast against the window start on the clean single-drainage
// record (logged with -v: the data behind the table in the report and
// the page's spread line). Each later start is less biased: the final
// settlement rises towards the truth until the higher modes are gone
// (Terzaghi 1943: they only ever make the early rate look faster).
func TestAsaokaStartsTable(t *testing.T) {
	t.Parallel()
	ts, ss := noisyTerzaghi(0.5, 0.02, 4, 10, 1, 0, 0)
	a, err := Asaoka(ts, ss, 0, AsaokaOptions{AutoStart: true, Thickness: 4, DrainedEnds: 1})
	if err != nil {
		t.Fatal(err)
	}
	for i, r := range a.Starts {
		t.Logf("from day %4g (Tv %.3g): final %.4f m, cv %.5f m²/day, higher modes %.2g", r.From, r.From*0.02/16, r.Final, r.Cv, r.HigherModes)
		if i > 0 && r.HigherModes > FirstModeShare && !(r.Final > a.Starts[i-1].Final) {
			t.Errorf("from day %g the forecast %.5g does not rise from %.5g", r.From, r.Final, a.Starts[i-1].Final)
		}
	}
}

// The drainage path of the implied cv runs through the compressible
// layers only: for a crust over clay over sand, drained at both ends, a
// Terzaghi record of the clay alone (d = half the clay, internal/series)
// gives back the clay's cv within 5 % by default, while the whole column
// as the path would make it (9/6)² = 2.25 times too large. The saved
// choices (monitoring.asaoka) replace the defaults: another layer list
// changes the path, and a saved window start is the one read.
func TestAsaokaDrainagePath(t *testing.T) {
	t.Parallel()
	const sInf, cv, clay = 0.3, 0.02, 6.0
	ts, ss := noisyTerzaghi(sInf, cv, clay/2, 5, 1, 0, 0)
	p := &solver.Project{
		Format: solver.Format,
		Layers: []solver.Layer{
			{Name: "crust", Thickness: 1, GammaSat: 19, K: 1e-6, Mv: 2e-5},
			{Name: "clay", Thickness: clay, GammaSat: 17, K: 1e-9, Mv: 5e-4},
			{Name: "sand", Thickness: 2, GammaSat: 20, K: 1e-4, Mv: 1e-5},
		},
		Top:        solver.Boundary{Drained: true},
		Bottom:     solver.Boundary{Drained: true},
		Loads:      []solver.Load{{Q: 50}},
		Monitoring: &solver.Monitoring{Plates: []solver.Plate{{}}},
	}
	for j := range ts {
		p.Monitoring.Plates[0].Readings = append(p.Monitoring.Plates[0].Readings, solver.Reading{T: ts[j], Value: ss[j]})
	}
	if err := solver.Validate(p); err != nil {
		t.Fatal(err)
	}
	if got := ConsolidatingLayers(p); !slices.Equal(got, []int{1}) {
		t.Fatalf("consolidating layers %v, want [1]", got)
	}
	a, err := PlateAsaoka(p, 0, 0)
	if err != nil {
		t.Fatal(err)
	}
	if a.DrainagePath != clay/2 || !slices.Equal(a.Layers, []int{1}) || math.Abs(a.Cv/cv-1) > 0.05 || math.Abs(a.Final/sInf-1) > 0.01 {
		t.Errorf("path %g m through %v, cv %.4g (true %.4g, 5 %%), final %.4g (true %.4g, 1 %%)", a.DrainagePath, a.Layers, a.Cv, cv, a.Final, sInf)
	}
	p.Monitoring.Asaoka = &solver.AsaokaSettings{From: 300, Layers: []int{0, 1, 2}}
	if err := solver.Validate(p); err != nil {
		t.Fatal(err)
	}
	b, err := PlateAsaoka(p, 0, 0)
	if err != nil {
		t.Fatal(err)
	}
	// cv scales with d² for the same β1 rate; Δt differs, so compare λd².
	if b.DrainagePath != 4.5 || b.Times[0] != 300 || b.AutoStart || math.Abs(b.Cv/cv/2.25-1) > 0.05 {
		t.Errorf("saved choices: path %g m (want 4.5), start %g (want 300), auto %v, cv %.4g (want %.4g within 5 %%)", b.DrainagePath, b.Times[0], b.AutoStart, b.Cv, 2.25*cv)
	}
}

// The slope of T/U against T over 60–90 % consolidation, from Terzaghi's
// series (internal/series), is the 0.818 Sridharan et al. (1987) quote
// (from memory); HyperbolicSlope rounds it. Tolerance 0.01 absolute.
func TestHyperbolicSlope(t *testing.T) {
	t.Parallel()
	var xs, ys []float64
	for T := 0.001; T < 3; T += 0.001 {
		if u := series.TerzaghiU(T); u >= 0.6 && u <= 0.9 {
			xs = append(xs, T)
			ys = append(ys, T/u)
		}
	}
	_, slope := stat.LinearRegression(xs, ys, nil, false)
	if math.Abs(slope-0.818) > 0.01 || math.Abs(slope-HyperbolicSlope) > 0.01 {
		t.Errorf("slope %.4f, want 0.818 (Sridharan et al. 1987) within 0.01", slope)
	}
}

// The hyperbolic method on an exact hyperbola s = τ/(α + βτ) recovers
// 1/β to rounding (1e-9 relative; the formula, from memory, checked by
// computation), and on Terzaghi records in Asaoka's default window shows
// its known tendency (Sridharan et al. 1987): the plain asymptote lies
// 10–25 % above the truth, while the corrected forecast is within 3 % of
// it and of Asaoka's (the band the slope's range dependence allows: 0.821
// over 60–90 %, 0.83 over 50–90 %).
func TestHyperbolic(t *testing.T) {
	t.Parallel()
	var ts, ss []float64
	for j := range 20 {
		tau := 10 * float64(j)
		ts = append(ts, 5+tau)
		ss = append(ss, tau/(40+2.5*tau))
	}
	h := Hyperbolic(ts, ss, 5, 0, 0)
	if h == nil || math.Abs(h.Final*2.5-1) > 1e-9 || math.Abs(h.Alpha/40-1) > 1e-9 || math.Abs(h.Corrected/h.Final-HyperbolicSlope) > 1e-12 {
		t.Fatalf("exact hyperbola: %+v", h)
	}
	const sInf, cv = 0.5, 0.02
	for _, c := range []struct {
		d     float64
		ends  int
		step  float64
		sigma float64
	}{{4, 1, 10, 0}, {3, 2, 7, 0}, {4, 1, 10, 0.001}} {
		ts, ss := noisyTerzaghi(sInf, cv, c.d, c.step, 1, c.sigma, 3)
		a, err := Asaoka(ts, ss, 0, AsaokaOptions{AutoStart: true, Thickness: c.d * float64(c.ends), DrainedEnds: c.ends})
		if err != nil {
			t.Fatal(err)
		}
		h := a.Hyperbolic
		if h == nil {
			t.Fatalf("d %g: no hyperbolic forecast", c.d)
		}
		over := h.Final/sInf - 1
		if over < 0.10 || over > 0.25 || math.Abs(h.Corrected/sInf-1) > 0.03 || math.Abs(h.Corrected/a.Final-1) > 0.03 {
			t.Errorf("d %g, noise %g: plain %.4g (%.1f %% over), corrected %.4g, Asaoka %.4g, truth %.4g", c.d, c.sigma, h.Final, 100*over, h.Corrected, a.Final, sInf)
		}
		t.Logf("d %g noise %g: plain %.4f corrected %.4f asaoka %.4f", c.d, c.sigma, h.Final, h.Corrected, a.Final)
	}
}

// The origin of the hyperbolic method is the load-weighted middle of the
// stages that add load (the construction-time correction; common
// practice): one ramp 0–30 days gives 15; stages of 40 kPa over 0–20 and
// 30 kPa over 120–135 give (40·10 + 30·127.5)/70; a removal is ignored.
// Exact arithmetic, tolerance 1e-12.
func TestLoadOrigin(t *testing.T) {
	t.Parallel()
	cases := []struct {
		loads []solver.Load
		want  float64
	}{
		{nil, 0},
		{[]solver.Load{{Q: 50}}, 0},
		{[]solver.Load{{Start: 0, Ramp: 30, Q: 60}}, 15},
		{[]solver.Load{{Ramp: 20, Q: 40}, {Start: 120, Ramp: 15, Q: 30}, {Start: 400, Q: -20}}, (40*10 + 30*127.5) / 70},
	}
	for _, c := range cases {
		if got := LoadOrigin(&solver.Project{Loads: c.loads}); math.Abs(got-c.want) > 1e-12 {
			t.Errorf("loads %+v: origin %g, want %g", c.loads, got, c.want)
		}
	}
}

// On the demo (staged loading, a partial removal, two clays), the
// hyperbolic cross-check agrees with Asaoka's forecast within the ±
// Asaoka states (FinalUncertainty): a consistency check of the two
// methods on the same readings, not against an independent truth.
func TestDemoHyperbolicAgrees(t *testing.T) {
	t.Parallel()
	p := readDemo(t)
	for i := range p.Monitoring.Plates {
		a, err := PlateAsaoka(p, i, 0)
		if err != nil {
			t.Fatal(err)
		}
		if a.Hyperbolic == nil || math.Abs(a.Hyperbolic.Corrected-a.Final) > a.FinalUncertainty {
			t.Errorf("plate %d: Asaoka %.4g ± %.2g m, hyperbolic %+v", i, a.Final, a.FinalUncertainty, a.Hyperbolic)
			continue
		}
		t.Logf("plate %d: Asaoka %.4f ± %.4f m (SE %.4f, spread %.4f), hyperbolic %.4f (plain %.4f), cv %.4g ± %.2g", i, a.Final, a.FinalUncertainty, a.FinalSE, a.FinalSpread, a.Hyperbolic.Corrected, a.Hyperbolic.Final, a.Cv, a.CvUncertainty)
	}
}
