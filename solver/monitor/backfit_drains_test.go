package monitor

import (
	"errors"
	"math"
	"testing"

	"porelight/solver"
	"porelight/solver/internal/series"
	"porelight/solver/soil"
)

// The back-fit finds ch: a settlement record made from the closed forms
// (not the solver) for a 10 m clay drained at the top with ideal drains
// on a 2 m triangular grid — s = mv H q (1 − (1 − Uv)(1 − Uh)), Uv from
// Terzaghi's (1943) series and Uh = 1 − exp(−8Th/F(n)) with Barron's
// (1948) F(n), Carrillo (1942) — at twice the project's ch; the fitted
// multiplier is 2 within 1 % (the solver meets the closed form within
// 0.002 in U), and a request without drains is refused at its path.
func TestBackFitCh(t *testing.T) {
	t.Parallel()
	cv := soil.Cv(1e-9, 1e-3, 9.81)
	p := &solver.Project{
		Format: solver.Format,
		Layers: []solver.Layer{{Name: "clay", Thickness: 10, GammaSat: 18, K: 1e-9, Mv: 1e-3}},
		Top:    solver.Boundary{Drained: true},
		Loads:  []solver.Load{{Q: 100}},
		Drains: &solver.Drains{Pattern: "triangular", Spacing: 2, Diameter: 0.05},
	}
	de := 2 * math.Sqrt(2*math.Sqrt(3)/math.Pi)
	n := de / 0.05
	f := n*n/(n*n-1)*math.Log(n) - (3*n*n-1)/(4*n*n)
	var rs []solver.Reading
	for tm := 10.0; tm <= 400; tm += 10 {
		uv := series.TerzaghiU(cv * tm / 100)
		uh := 1 - math.Exp(-8*2*cv*tm/(de*de*f))
		rs = append(rs, solver.Reading{T: tm, Value: 1.0 * (1 - (1-uv)*(1-uh))})
	}
	p.Monitoring = &solver.Monitoring{Plates: []solver.Plate{{Name: "synthetic", Readings: rs}}}
	res, err := BackFit(p, FitSpec{ChLayers: []int{0}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if want := "primary settlement from mv (linear model), with the drains"; res.Model != solver.ModelLinear || res.Curve != want {
		t.Errorf("compared with %q (model %q), want %q", res.Curve, res.Model, want)
	}
	fp := res.Params[0]
	if fp.Name != "layers[0].ch" || math.Abs(fp.Multiplier-2) > 0.02 {
		t.Errorf("fitted %s × %.4f, want × 2 ± 1 %%", fp.Name, fp.Multiplier)
	}
	if math.Abs(fp.Ch-2*cv) > 0.02*2*cv || res.Project.Layers[0].Ch != fp.Ch {
		t.Errorf("ch %.5g m²/day (project %.5g), want %.5g", fp.Ch, res.Project.Layers[0].Ch, 2*cv)
	}
	q := *p
	q.Drains = nil
	_, err = BackFit(&q, FitSpec{ChLayers: []int{0}}, nil)
	var ps solver.Problems
	if !errors.As(err, &ps) || ps[0].Path != "fit.chLayers[0]" {
		t.Errorf("without drains: %v, want a problem at fit.chLayers[0]", err)
	}
}
