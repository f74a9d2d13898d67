package solver

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"porelight/solver/internal/series"
)

// TestResidualUniformLayer checks the residual settlement after a
// handover day on one uniform layer drained at the top under one
// instantaneous load, against a hand working independent of the solver:
// primary left s∞ (U(life) − U(t)) with Terzaghi's U (series.TerzaghiU,
// Terzaghi 1943), secondary Cα H/(1+ep) log10(t/tp) (Mesri 1973) from the
// end of primary tp at U = 95 % (series.TvForU), ep = e0 − (s∞/H)(1 + e0).
// The linear model's s∞ = mv H q (Terzaghi 1943); the non-linear model on
// Davis & Raymond's (1965) clay (Ck = Cc, so cv stays constant and the
// degree of settlement is Terzaghi's U) has s∞ = Cc H/(1+e0) log10(σ'f/σ'0)
// (Terzaghi & Peck 1967). Tolerance 0.05 % of s∞ on each figure (measured
// at most 2·10⁻⁵ m, 0.007 % of s∞, with the default mesh and stepping).
func TestResidualUniformLayer(t *testing.T) {
	t.Parallel()
	const h, q, s0, ca, life = 5.0, 50.0, 50.0, 0.02, 18262.5
	type hand struct{ sInf, cv, e0 float64 }
	type residualCase struct {
		name     string
		handover float64
		make     func() (*Project, hand)
		uniform  bool
	}
	var cases []residualCase
	linear := func() (*Project, hand) {
		ec := &ECurve{E0: 1.2, Cc: 0.4, Cr: 0.04}
		p := &Project{
			Format: Format,
			Layers: []Layer{{Name: "clay", Thickness: h, GammaSat: 18, K: 1e-9, Mv: 1e-3, ECurve: ec, Calpha: ca}},
			Top:    Boundary{Drained: true}, Bottom: Boundary{Drained: false},
			Loads: []Load{{Start: 0, Q: q}},
		}
		return p, hand{sInf: 1e-3 * h * q, cv: 1e-9 * 86400 / (1e-3 * DefaultGammaW), e0: 1.2}
	}
	davisRaymond := func() (*Project, hand) {
		p, cv := drClay(h, s0, q)
		p.Layers[0].Calpha = ca
		ec := p.Layers[0].ECurve
		return p, hand{sInf: ec.Cc * h / (1 + ec.E0) * math.Log10((s0+q)/s0), cv: cv, e0: ec.E0}
	}
	for _, tv := range []float64{365, 8000} {
		cases = append(cases, residualCase{"linear", tv, linear, false}, residualCase{"davis-raymond", tv, davisRaymond, true})
	}
	for _, c := range cases {
		t.Run(fmt.Sprintf("%s/handover %g", c.name, c.handover), func(t *testing.T) {
			t.Parallel()
			p, hd := c.make()
			p.DesignLife = life
			p.Decisions = &Decisions{Handover: c.handover}
			var r *Result
			if c.uniform {
				r = solveUniform(t, p, s0)
			} else {
				var err error
				if r, err = Solve(p, nil); err != nil {
					t.Fatal(err)
				}
			}
			res := r.Residual
			if res == nil {
				t.Fatal("no residual")
			}
			U := func(day float64) float64 { return series.TerzaghiU(hd.cv * day / (h * h)) }
			tp := series.TvForU(endOfPrimary) * h * h / hd.cv
			ep := hd.e0 - hd.sInf/h*(1+hd.e0)
			sec := func(day float64) float64 {
				if day <= tp {
					return 0
				}
				return ca * h / (1 + ep) * math.Log10(day/tp)
			}
			want := map[string][2]float64{
				"primary":   {res.Primary, hd.sInf * (U(life) - U(c.handover))},
				"secondary": {res.Secondary, sec(life) - sec(c.handover)},
				"reached":   {res.Reached, hd.sInf*U(c.handover) + sec(c.handover)},
				"atLife":    {res.AtLife, hd.sInf*U(life) + sec(life)},
				"total":     {res.Total, hd.sInf*(U(life)-U(c.handover)) + sec(life) - sec(c.handover)},
				"layer":     {res.Layers[0].Total, res.Total},
			}
			t.Logf("primary %.5f secondary %.5f reached %.5f atLife %.5f (s∞ %.4f, tp %.0f d)", res.Primary, res.Secondary, res.Reached, res.AtLife, hd.sInf, tp)
			for k, v := range want {
				if math.Abs(v[0]-v[1]) > 5e-4*hd.sInf {
					t.Errorf("handover %g days: %s = %.5f m, hand %.5f m (tolerance %.5f m)", c.handover, k, v[0], v[1], 5e-4*hd.sInf)
				}
			}
			// The per-layer series sums to the plotted settlement.
			ser := r.Consolidation.Series
			for j := range ser.Time {
				if d := math.Abs(ser.Layers[0][j] - ser.Settlement[j]); d > 1e-12 {
					t.Fatalf("step %d: layer series %g, settlement %g", j, ser.Layers[0][j], ser.Settlement[j])
				}
			}
		})
	}
}

// TestResidualRefused checks that a handover day at or after the design
// life is refused at its path.
func TestResidualRefused(t *testing.T) {
	t.Parallel()
	p, _ := drClay(5, 50, 50)
	p.DesignLife = 1000
	for _, d := range []float64{1000, 2000, -1} {
		p.Decisions = &Decisions{Handover: d}
		err := Validate(p)
		if !hasProblem(err, "decisions.handover") {
			t.Errorf("handover %g: got %v, want a problem at decisions.handover", d, err)
		}
	}
}

// hasProblem reports whether err is a Problems list with a problem at path.
func hasProblem(err error, path string) bool {
	var ps Problems
	if !errors.As(err, &ps) {
		return false
	}
	for _, p := range ps {
		if p.Path == path {
			return true
		}
	}
	return false
}
