package solver

import (
	"math"
	"testing"

	"porelight/solver/internal/series"
	"porelight/solver/soil"
)

// twoClays is a slow 4 m clay over a fast 2 m clay (k 10⁴ times higher,
// the same mv), drained at both ends, under 50 kPa. To the fast clay the
// slow one is nearly impermeable, so it drains down alone (drainage path
// 2 m); to the slow clay the fast one is nearly a drain, so it drains to
// both faces (path 2 m). Each then follows Terzaghi's theory.
func twoClays() *Project {
	ec := func() *ECurve { return &ECurve{E0: 1.2, Cc: 0.4, Cr: 0.04} }
	return &Project{
		Format: Format,
		Layers: []Layer{
			{Name: "slow", Thickness: 4, GammaSat: 17, K: 1e-11, Mv: 1e-3, ECurve: ec(), CalphaCc: 0.04},
			{Name: "fast", Thickness: 2, GammaSat: 17, K: 1e-7, Mv: 1e-3, ECurve: ec(), Calpha: 0.012},
		},
		Top: Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads:      []Load{{Start: 0, Q: 50}},
		DesignLife: 1e6,
		Stepping:   Stepping{EndTime: 3e5},
	}
}

// TestSecondaryPerLayer checks that each layer starts secondary
// compression at its own end of primary: tp = Tv(95 %)·H²/cv from
// Terzaghi's U (series.TvForU, independent of the solver) with the drainage
// path of each layer, within 3 % (the other layer is only nearly a drain
// or a seal), and
// the secondary settlement at the design life by hand with Mesri's (1973)
// Cα H/(1+ep) log10(t/tp), ep = e0 − mv·Δσ·(1+e0), Cα = 0.012 given and
// 0.04·Cc for the slow clay (Mesri & Godlewski 1977 ratio), within 1 %.
func TestSecondaryPerLayer(t *testing.T) {
	t.Parallel()
	p := twoClays()
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	t95 := series.TvForU(0.95)
	for _, c := range []struct {
		layer  int
		hdr    float64
		calpha float64
	}{{1, 2, 0.012}, {0, 2, 0.04 * 0.4}} {
		l := p.Layers[c.layer]
		cv := soil.Cv(l.K, l.Mv, DefaultGammaW)
		tp := t95 * c.hdr * c.hdr / cv
		ls := r.Summary.Layers[c.layer]
		if ls.SecondaryStart == nil || math.Abs(*ls.SecondaryStart/tp-1) > 0.03 {
			t.Errorf("layer %d: end of primary %v days, want %.4g days (Terzaghi 1943, ±3 %%)", c.layer, deref(ls.SecondaryStart), tp)
			continue
		}
		t.Logf("layer %d: end of primary %.5g days, Terzaghi %.5g days", c.layer, *ls.SecondaryStart, tp)
		ep := 1.2 - 1e-3*50*(1+1.2)
		want := c.calpha * l.Thickness / (1 + ep) * math.Log10(p.DesignLife/tp)
		if ls.Secondary == nil || math.Abs(*ls.Secondary/want-1) > 0.01 {
			t.Errorf("layer %d: secondary %v m, want %.5f m (Mesri 1973, ±1 %%)", c.layer, deref(ls.Secondary), want)
		}
	}
	// The fast layer's end is three orders before the slow one's.
	if a, b := *r.Summary.Layers[1].SecondaryStart, *r.Summary.Layers[0].SecondaryStart; !(a < b/100) {
		t.Errorf("ends of primary %.4g and %.4g days: the fast layer should end far earlier", a, b)
	}
	ser := r.Consolidation.Series
	if last := ser.Secondary[len(ser.Secondary)-1]; last <= 0 || len(ser.Secondary) != len(ser.Time) {
		t.Errorf("secondary series ends at %g m over %d of %d times", last, len(ser.Secondary), len(ser.Time))
	}
}

// TestSecondaryAfterRemoval: removing part of the load warns on
// layers[i].calphaReduced unless a reduced Cα is given; with it the
// secondary after the removal runs at the reduced rate (hand-worked by
// Mesri's formula in two pieces at the removal time).
func TestSecondaryAfterRemoval(t *testing.T) {
	t.Parallel()
	p := twoClays()
	p.Layers = p.Layers[1:]
	p.Stepping.EndTime = 0
	p.Loads = append(p.Loads, Load{Start: 400, Q: -20})
	p.DesignLife = 50 * 365.25
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	if !hasWarningAt(r, "layers[0].calphaReduced") {
		t.Errorf("no warning at layers[0].calphaReduced; warnings %v", r.Warnings)
	}
	full := *r.Summary.Layers[0].Secondary
	p.Layers[0].CalphaReduced = 0.003
	if r, err = Solve(p, nil); err != nil {
		t.Fatal(err)
	}
	if hasWarningAt(r, "layers[0].calphaReduced") {
		t.Error("warned although calphaReduced is given")
	}
	tp := *r.Summary.Layers[0].SecondaryStart
	ep := 1.2 - r.Summary.Layers[0].Settlement/2*(1+1.2)
	f := 2 / (1 + ep)
	want := 0.012*f*math.Log10(400/tp) + 0.003*f*math.Log10(p.DesignLife/400)
	if got := *r.Summary.Layers[0].Secondary; math.Abs(got/want-1) > 1e-9 || !(got < full) {
		t.Errorf("reduced secondary %.6f m, want %.6f m (Mesri 1973 by hand, ±1e-9 rel.) and below the full %.6f m", got, want, full)
	}
}

func hasWarningAt(r *Result, path string) bool {
	for _, w := range r.Warnings {
		if w.Path == path {
			return true
		}
	}
	return false
}

func deref(p *float64) any {
	if p == nil {
		return nil
	}
	return *p
}
