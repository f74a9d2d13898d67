package monitor

import (
	"math"
	"testing"

	"porelight/solver"
	"porelight/solver/internal/series"
)

// Asaoka on a drained site gives ch from the slope: on synthetic records
// from the closed forms (not the solver) — pure radial flow,
// s/s∞ = 1 − exp(−8 ch t/(De² μ)) (Barron 1948, Hansbo 1981), and
// combined flow, 1 − (1 − Uv)(1 − Uh) (Carrillo 1942) with Uv from
// Terzaghi's (1943) series for one drainage path of 3 m — Ch is the ch
// the record was made with, within 1e-6 relative for the exact
// exponential and 1 % for the combined record read late (Tv > 0.25),
// where the higher vertical modes have died out.
func TestAsaokaDrains(t *testing.T) {
	t.Parallel()
	const (
		ch, cv = 0.005, 0.008 // m²/day
		de, mu = 1.6, 2.6
		d      = 3.0 // drainage path, m
		final  = 0.9 // m
	)
	uh := func(tm float64) float64 { return 1 - math.Exp(-8*ch*tm/(de*de*mu)) }
	for _, c := range []struct {
		name     string
		u        func(float64) float64
		from, to float64
		vertical float64
		tol      float64
	}{
		{"radial only", uh, 50, 600, 0, 1e-6},
		{"radial and vertical", func(tm float64) float64 {
			return 1 - (1-series.TerzaghiU(cv*tm/(d*d)))*(1-uh(tm))
		}, 300, 900, cv, 0.01},
	} {
		var ts, ss []float64
		for tm := c.from; tm <= c.to; tm += 30 {
			ts = append(ts, tm)
			ss = append(ss, final*c.u(tm))
		}
		a, err := Asaoka(ts, ss, 60, AsaokaOptions{Thickness: d, DrainedEnds: 1, De: de, Mu: mu, VerticalCv: c.vertical})
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if math.Abs(a.Ch-ch) > c.tol*ch {
			t.Errorf("%s: Ch = %.6g m²/day, want %g ± %g %%", c.name, a.Ch, ch, 100*c.tol)
		}
		if math.Abs(a.Final-final) > 0.01*final {
			t.Errorf("%s: final %.4g m, want %g", c.name, a.Final, final)
		}
	}
	// Without De and μ there is no Ch.
	if a, err := Asaoka([]float64{1, 2, 3, 4, 5}, []float64{0.1, 0.15, 0.18, 0.2, 0.21}, 0, AsaokaOptions{}); err != nil || a.Ch != 0 {
		t.Errorf("Ch %v without drains (err %v)", a, err)
	}
}

// DrainCh takes the vertical decay from a prediction's Uv: with a
// prediction built by hand from Terzaghi's (1943) series (not the solver)
// and a record from Carrillo's (1942) product as in TestAsaokaDrains, it
// gives back the ch of the record within 1 %; without drain results it
// says so.
func TestDrainCh(t *testing.T) {
	t.Parallel()
	const (
		ch, cv = 0.005, 0.008
		de, mu = 1.6, 2.6
		d      = 3.0
	)
	var ts, ss []float64
	for tm := 300.0; tm <= 900; tm += 30 {
		uv := series.TerzaghiU(cv * tm / (d * d))
		ts = append(ts, tm)
		ss = append(ss, 0.9*(1-(1-uv)*math.Exp(-8*ch*tm/(de*de*mu))))
	}
	a, err := Asaoka(ts, ss, 60, AsaokaOptions{})
	if err != nil {
		t.Fatal(err)
	}
	r := &solver.Result{Consolidation: &solver.Consolidation{}, Drains: &solver.DrainResult{
		Cell: solver.DrainCell{De: de, Mu0: mu}, Depth: []float64{0, d}, Mu: []float64{mu, mu}}}
	for tm := 0.0; tm <= 2000; tm += 1 {
		r.Consolidation.Series.Time = append(r.Consolidation.Series.Time, tm)
		r.Drains.Uv = append(r.Drains.Uv, series.TerzaghiU(cv*tm/(d*d)))
	}
	got, ok := DrainCh(a, r)
	if !ok || math.Abs(got-ch) > 0.01*ch {
		t.Errorf("DrainCh = %.6g (ok %v), want %g ± 1 %%", got, ok, ch)
	}
	if _, ok := DrainCh(a, &solver.Result{}); ok {
		t.Error("DrainCh without drain results")
	}
}
