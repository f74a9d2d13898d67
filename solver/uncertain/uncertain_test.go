package uncertain

import (
	"math"
	"reflect"
	"testing"

	"porelight/solver"
)

// Tv90 = 0.848: Terzaghi's time factor for U = 90 % (Terzaghi 1943;
// docs/PUBLISHED: the U–Tv table, 0.848 to three figures).
const tv90 = 0.848

// terzaghi is one clay layer, drained at the top only, under an
// instantaneous uniform load: Terzaghi's case, t90 = Tv90 H²/cv.
func terzaghi(covK float64, runs, seed int) *solver.Project {
	const (
		h  = 5.0    // m
		mv = 1e-3   // 1/kPa
		cv = 2.0e-2 // m²/day
	)
	k := cv / 86400 * mv * solver.DefaultGammaW // m/s
	return &solver.Project{
		Format: solver.Format,
		Layers: []solver.Layer{{Name: "clay", Thickness: h, GammaSat: 18, K: k, Mv: mv}},
		Top:    solver.Boundary{Drained: true},
		Bottom: solver.Boundary{Drained: false},
		Loads:  []solver.Load{{Start: 0, Q: 100}},
		Times:  []float64{1, 10, 100, 1000},
		Mesh:   solver.MeshSettings{MaxSize: 0.1},
		Uncertainty: &solver.Uncertainty{
			Runs: runs, Seed: seed,
			Layers: []solver.LayerSpread{{K: covK}},
		},
	}
}

func plan(t *testing.T, p *solver.Project) Plan {
	t.Helper()
	base, err := solver.Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	pl, err := NewPlan(p, base)
	if err != nil {
		t.Fatal(err)
	}
	return pl
}

// stdNormalPDF is φ(z) = exp(−z²/2)/√(2π).
func stdNormalPDF(z float64) float64 { return math.Exp(-z*z/2) / math.Sqrt(2*math.Pi) }

// A Monte Carlo of one Terzaghi layer with lognormal k (mv fixed, so cv
// lognormal with the same COV) gives t90 = Tv90 H²/cv lognormal with that
// COV: ln t90 normal with median ln(Tv90 H²/cv50) and σ_ln = √(ln(1+COV²)).
// The sample quantiles of ln t90 must lie within 4 standard errors of the
// analytic ones: the p-quantile of N draws has the standard error
// σ √(p(1−p)/N) / φ(z_p) (the asymptotic variance of a sample quantile,
// e.g. Stuart & Ord, Kendall's Advanced Theory of Statistics, vol. 1),
// plus 1 % for the solver's own t90 on this mesh and stepping (checked on
// the median solve first). The sample standard deviation of ln t90 must
// match σ_ln within 4 σ_ln/√(2N) (its standard error for a normal) + 1 %.
func TestTerzaghiT90Lognormal(t *testing.T) {
	runs := 1000
	if testing.Short() {
		runs = 400
	}
	for _, cov := range []float64{0.3, 0.7} {
		p := terzaghi(cov, runs, 7)
		pl := plan(t, p)
		cv := p.Layers[0].K * 86400 / (p.Layers[0].Mv * solver.DefaultGammaW)
		want50 := tv90 * 25 / cv
		// The solver's t90 at the median against Terzaghi (1 %).
		med := Outcome(p, pl.Grid, pl.Date)
		if med.T90 == nil || math.Abs(*med.T90/want50-1) > 0.01 {
			t.Fatalf("COV %.1f: median t90 %v, Terzaghi %.1f days (1 %%)", cov, med.T90, want50)
		}
		b := Combine(pl, Range(p, pl, 0, runs, nil))
		if b.Failed > 0 || b.NotReached > 0 {
			t.Fatalf("COV %.1f: %d failed (%s), %d did not reach 90 %%", cov, b.Failed, b.FirstProblem, b.NotReached)
		}
		sg := SigmaLn(cov)
		for _, c := range []struct {
			p   float64
			got float64
		}{{0.1, b.T90.P10}, {0.5, b.T90.P50}, {0.9, b.T90.P90}} {
			z := math.Sqrt2 * math.Erfinv(2*c.p-1)
			want := math.Log(want50) + z*sg
			se := sg * math.Sqrt(c.p*(1-c.p)/float64(runs)) / stdNormalPDF(z)
			tol := 4*se + 0.01
			if d := math.Log(c.got) - want; math.Abs(d) > tol {
				t.Errorf("COV %.1f, P%.0f of t90: %.1f days, analytic %.1f (ln off by %.4f > %.4f)", cov, 100*c.p, c.got, math.Exp(want), d, tol)
			}
		}
		var m, v float64
		for _, x := range b.T90Values {
			m += math.Log(x)
		}
		m /= float64(len(b.T90Values))
		for _, x := range b.T90Values {
			v += (math.Log(x) - m) * (math.Log(x) - m)
		}
		sd := math.Sqrt(v / float64(len(b.T90Values)-1))
		if tol := 4*sg/math.Sqrt(2*float64(runs)) + 0.01; math.Abs(sd-sg) > tol {
			t.Errorf("COV %.1f: σ of ln t90 %.4f, analytic %.4f (±%.4f)", cov, sd, sg, tol)
		}
		// The final settlement does not depend on k: mv H q = 0.5 m
		// (one-dimensional compression, common practice), to 10⁻⁶.
		if math.Abs(b.Final.P10-0.5) > 1e-6 || math.Abs(b.Final.P90-0.5) > 1e-6 {
			t.Errorf("COV %.1f: final settlement P10 %.6f, P90 %.6f m, want mv·H·q = 0.5", cov, b.Final.P10, b.Final.P90)
		}
	}
}

// The same seed gives the same bands, whatever the split of the runs;
// another seed gives other bands.
func TestSeedReproducible(t *testing.T) {
	p := terzaghi(0.5, 40, 11)
	p.Uncertainty.Layers[0].Mv = 0.3
	p.Uncertainty.Layers[0].KMv = 0.5
	pl := plan(t, p)
	whole := Combine(pl, Range(p, pl, 0, 40, nil))
	split := append(Range(p, pl, 25, 40, nil), Range(p, pl, 0, 25, nil)...)
	if got := Combine(pl, split); !reflect.DeepEqual(got, whole) {
		t.Errorf("split runs give other bands: P50 t90 %g against %g", got.T90.P50, whole.T90.P50)
	}
	again := Combine(pl, Range(p, pl, 0, 40, nil))
	if !reflect.DeepEqual(again, whole) {
		t.Error("the same seed gave other bands")
	}
	p.Uncertainty.Seed = 12
	pl.Seed = 12
	other := Combine(pl, Range(p, pl, 0, 40, nil))
	if reflect.DeepEqual(other.Settlement, whole.Settlement) || other.T90.P50 == whole.T90.P50 {
		t.Error("another seed gave the same bands")
	}
}

// The correlation of ln k and ln mv: the sample correlation of the drawn
// normals is ρ within 4(1 − ρ² + 0.05)/√N: the standard error of a
// sample correlation coefficient is about (1 − ρ²)/√N for large N
// (Fisher 1915; from memory), widened by 0.05 so that ρ = 0 keeps a margin.
func TestDrawCorrelation(t *testing.T) {
	const n = 4000
	for _, rho := range []float64{-0.8, 0, 0.6} {
		p := terzaghi(0.5, n, 3)
		p.Uncertainty.Layers[0].Mv = 0.4
		p.Uncertainty.Layers[0].KMv = rho
		sk, sm := SigmaLn(0.5), SigmaLn(0.4)
		var xy, xx, yy, mx, my float64
		for i := range n {
			f := Draw(p, 3, i)
			x, y := math.Log(f.K[0])/sk, math.Log(f.Mv[0])/sm
			mx += x
			my += y
			xy += x * y
			xx += x * x
			yy += y * y
		}
		mx /= n
		my /= n
		r := (xy/n - mx*my) / math.Sqrt((xx/n-mx*mx)*(yy/n-my*my))
		if tol := 4 * (1 - rho*rho + 0.05) / math.Sqrt(n); math.Abs(r-rho) > tol {
			t.Errorf("ρ %.1f: sample correlation %.3f (±%.3f)", rho, r, tol)
		}
		// σ of ln factor: √(ln(1+COV²)) within 4σ/√(2N).
		sd := math.Sqrt(xx/n-mx*mx) * sk
		if tol := 4 * sk / math.Sqrt(2*n); math.Abs(sd-sk) > tol {
			t.Errorf("ρ %.1f: σ of ln k factor %.4f, want %.4f (±%.4f)", rho, sd, sk, tol)
		}
	}
}

// Apply scales what it says and leaves the project alone.
func TestApply(t *testing.T) {
	p := terzaghi(0.5, 10, 1)
	p.Layers[0].ECurve = &solver.ECurve{E0: 1, Cc: 0.4, Cr: 0.05, OCR: 1}
	before := *p.Layers[0].ECurve
	q := Apply(p, Factors{K: []float64{2}, Mv: []float64{3}, Ch: []float64{5}})
	l := q.Layers[0]
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"k", l.K, 2 * p.Layers[0].K}, {"mv", l.Mv, 3 * p.Layers[0].Mv},
		{"cc", l.ECurve.Cc, 1.2}, {"cr", l.ECurve.Cr, 0.15},
		{"khKv without drains", l.KhKv, 0},
	} {
		if math.Abs(c.got-c.want) > 1e-12*math.Abs(c.want) {
			t.Errorf("%s: %g, want %g", c.name, c.got, c.want)
		}
	}
	if !reflect.DeepEqual(*p.Layers[0].ECurve, before) || p.Layers[0].K == l.K {
		t.Error("Apply changed its argument")
	}
}

// Sensitivity of one Terzaghi layer: k and mv move t90 by the same
// factors in opposite directions (t90 ∝ mv/k), and only mv moves the
// final settlement (∝ mv); closed forms, to 1 %.
func TestSensitivityTerzaghi(t *testing.T) {
	p := terzaghi(0.5, 10, 1)
	p.Uncertainty.Layers[0].Mv = 0.2
	pl := plan(t, p)
	base, sw := Sensitivity(p, pl, nil)
	if len(sw) != 2 || sw[0].Param != ParamK || sw[1].Param != ParamMv {
		t.Fatalf("swings %+v, want k first (COV 0.5) then mv (0.2)", sw)
	}
	for _, s := range sw {
		lo, hi := *s.Low.T90 / *base.T90, *s.High.T90 / *base.T90
		wantLo, wantHi := s.LowFactor, s.HighFactor
		if s.Param == ParamK {
			wantLo, wantHi = 1/s.LowFactor, 1/s.HighFactor
		}
		if math.Abs(lo/wantLo-1) > 0.01 || math.Abs(hi/wantHi-1) > 0.01 {
			t.Errorf("%s: t90 ratios %.4f, %.4f; want %.4f, %.4f", s.Param, lo, hi, wantLo, wantHi)
		}
	}
	if r := sw[1].High.Final / base.Final; math.Abs(r/sw[1].HighFactor-1) > 0.01 {
		t.Errorf("mv high: final settlement ratio %.4f, want %.4f", r, sw[1].HighFactor)
	}
	if sw[0].RemainingRange() > 1e-3 && sw[0].High.Final != base.Final {
		t.Errorf("k changed the final settlement: %g against %g", sw[0].High.Final, base.Final)
	}
}

// Quantile follows Hyndman & Fan's definition 7: for 1…5 the 0.1-quantile
// is 1.4 and the 0.9-quantile 4.6 (R's quantile(1:5, c(.1,.9)), from
// memory, verified here by h = (n−1)p by hand).
func TestQuantile(t *testing.T) {
	s := []float64{1, 2, 3, 4, 5}
	for _, c := range []struct{ p, want float64 }{{0, 1}, {0.1, 1.4}, {0.5, 3}, {0.9, 4.6}, {1, 5}} {
		if got := Quantile(s, c.p); math.Abs(got-c.want) > 1e-12 {
			t.Errorf("Quantile(%g) = %g, want %g", c.p, got, c.want)
		}
	}
}

// The binary form of samples gives back what went in, nil t90 and
// problems included, and refuses a damaged copy.
func TestSamplesWire(t *testing.T) {
	t90 := 123.5
	in := []Sample{
		{Run: 3, Settlement: []float64{0, 0.1, math.Inf(1)}, Degree: []float64{0, 0.5, 1}, T90: &t90, Final: 0.7, Remaining: 0.2},
		{Run: 4, Problem: "layers[1].k: is out of range"},
		{Run: 900, Settlement: []float64{1}},
	}
	data := EncodeSamples(in)
	out, err := DecodeSamples(data)
	if err != nil || !reflect.DeepEqual(out, in) {
		t.Fatalf("round trip: %+v, %v", out, err)
	}
	for _, cut := range []int{len(data) - 1, len(data) / 2, len(samplesMagic) + 1} {
		if _, err := DecodeSamples(data[:cut]); err == nil {
			t.Errorf("a copy cut at %d of %d bytes was read", cut, len(data))
		}
	}
}
