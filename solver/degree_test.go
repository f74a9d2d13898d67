package solver

import (
	"encoding/json"
	"math"
	"slices"
	"strings"
	"testing"
)

// The degree of consolidation by pore pressure, Up = ∫Δσ'(t) dz / ∫Δσ'∞ dz,
// is 0/0 when its denominator vanishes; it is then left out of the result
// (absent from the JSON), never NaN or a huge number from rounding.
func TestDegreeUndefined(t *testing.T) {
	t.Parallel()
	const q, h = 20.0, 4.0 // kPa, m
	mv1, mv2 := 1e-3, 1e-4 // 1/kPa
	column := func() *Project {
		return &Project{
			Format: Format,
			Layers: []Layer{
				{Name: "soft", Thickness: h / 2, GammaSat: 17, K: 1e-9, Mv: mv1},
				{Name: "stiff", Thickness: h / 2, GammaSat: 19, K: 1e-9, Mv: mv2},
			},
			Top:    Boundary{Drained: true},
			Bottom: Boundary{Drained: true},
			Times:  []float64{10, 100},
		}
	}
	cases := []struct {
		name   string
		change func(p *Project)
		us     bool    // Us present
		final  float64 // final linear settlement, m
	}{
		// No net change: the load comes off again. Both ratios are 0/0.
		{"load applied, then fully removed", func(p *Project) {
			p.Loads = []Load{{Start: 0, Q: q}, {Start: 50, Q: -q}}
		}, false, 0},
		// Equal k, both ends drained: the final pore pressure change is
		// linear, Δu∞ = E z/H (steady Darcy flow; common practice), so
		// with E = 2q, Δσ'∞ = q(1 − 2z/H) integrates to zero over the
		// column and Up is 0/0. The settlement, weighted by mv, is not:
		// ∫ mv Δσ'∞ dz = q H (mv1 − mv2)/4 (the integral in closed form).
		{"effective stress up in one half, down in the other", func(p *Project) {
			p.Loads = []Load{{Q: q}}
			p.Bottom.Excess = []TimeValue{{T: 0, Value: 2 * q}}
		}, true, q * h * (mv1 - mv2) / 4},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			p := column()
			c.change(p)
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			s := r.Consolidation.Series
			if len(s.Up) != 0 {
				t.Errorf("Up present: %v", s.Up[:min(3, len(s.Up))])
			}
			if got := len(s.Us) > 0; got != c.us {
				t.Errorf("Us present = %v, want %v", got, c.us)
			}
			// Where Us is shown without Up, a warning says why.
			said := slices.ContainsFunc(r.Warnings, func(w Warning) bool { return strings.Contains(w.Message, "Up is not shown") })
			if said != c.us {
				t.Errorf("a warning on the missing Up = %v, want %v (warnings %v)", said, c.us, r.Warnings)
			}
			// Linear elements reproduce a piecewise-linear profile to
			// rounding: tolerance 1e-9 m.
			if got := *r.Summary.SettlementLinear; math.Abs(got-c.final) > 1e-9 {
				t.Errorf("final settlement %.12g m, want %.12g (closed form, tolerance 1e-9)", got, c.final)
			}
			data, err := json.Marshal(r)
			if err != nil {
				t.Fatal(err)
			}
			if strings.Contains(string(data), `"up"`) {
				t.Errorf("the JSON names up")
			}
		})
	}
}
