package solver

import (
	"errors"
	"math"
	"testing"
)

// TestLowerByHand checks a lowering of the water table with the change
// of unit weight, by hand: 3 m of sand (γsat 20, γ 17 kN/m³, mv 1e-5
// 1/kPa) over 5 m of clay (γsat 18, mv 1e-3), the water table at the
// top, lowered to 3 m at once, the base sealed. The sand above the new
// water table drains (u → 0) and weighs 3 kN/m³ less: at depth z ≤ 3 m
// the total stress falls by 3z and the pore pressure by γw z, so σ' rises
// by (9.81 − 3) z; in the clay the total stress falls by 3·3 = 9 kPa and,
// once drained to the new water table (the base being sealed), the pore
// pressure by 9.81·3 = 29.43 kPa everywhere, so σ' rises by 20.43 kPa.
// Final settlement: 1e-5·6.81·3²/2 + 1e-3·5·20.43 = 0.10246 m (linear
// elements integrate these linear profiles exactly: tolerance 1e-9
// relative). The stage's pressure is the weight lost above the new water
// table, −9 kPa.
func TestLowerByHand(t *testing.T) {
	t.Parallel()
	p := &Project{Format: Format,
		Layers: []Layer{{Name: "sand", Thickness: 3, GammaSat: 20, Gamma: 17, K: 1e-5, Mv: 1e-5}, {Name: "clay", Thickness: 5, GammaSat: 18, K: 1e-9, Mv: 1e-3}},
		Top:    Boundary{Drained: true},
		Loads:  []Load{{Lower: &Lowering{WaterTable: 3}}}}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	gw := DefaultGammaW
	want := 1e-5*(gw-3)*9/2 + 1e-3*5*(3*gw-9)
	if got := *r.Summary.SettlementLinear; math.Abs(got-want) > 1e-9*want {
		t.Errorf("final settlement %.10g m, by hand %.10g m (tolerance 1e-9 relative)", got, want)
	}
	if q := StagePressure(p, 0); math.Abs(q+9) > 1e-12 {
		t.Errorf("stage pressure %g kPa, by hand −9", q)
	}
	// A clay held saturated by capillarity (no moist unit weight given)
	// keeps its weight: only the pore pressure changes.
	p.Layers[0].Gamma = 0
	r, err = Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	want = 1e-5*gw*9/2 + 1e-3*5*3*gw
	if got := *r.Summary.SettlementLinear; math.Abs(got-want) > 1e-9*want {
		t.Errorf("saturated above the water table: settlement %.10g m, by hand %.10g m", got, want)
	}
}

// TestLowerValidation checks the refusals of a lowering stage.
func TestLowerValidation(t *testing.T) {
	t.Parallel()
	base := func() *Project {
		return &Project{Format: Format, WaterTable: 1,
			Layers: []Layer{{Thickness: 4, GammaSat: 18, K: 1e-9, Mv: 1e-3}},
			Top:    Boundary{Drained: true}, Loads: []Load{{Lower: &Lowering{WaterTable: 2}}}}
	}
	for _, c := range []struct {
		name string
		edit func(p *Project)
		path string
		err  error
	}{
		{"above the present water table", func(p *Project) { p.Loads[0].Lower.WaterTable = 0.5 }, "loads[0].lower.waterTable", ErrOutOfRange},
		{"below the column", func(p *Project) { p.Loads[0].Lower.WaterTable = 5 }, "loads[0].lower.waterTable", ErrOutOfRange},
		{"with an excavation", func(p *Project) { p.Loads = append(p.Loads, Load{Start: 3, Dig: &Dig{Depth: 1}}) }, "loads[1].dig", ErrConflict},
		{"with q", func(p *Project) { p.Loads[0].Q = 5 }, "loads[0].q", ErrConflict},
	} {
		t.Run(c.name, func(t *testing.T) {
			p := base()
			c.edit(p)
			ps := AsProblems(Validate(p))
			for _, pr := range ps {
				if pr.Path == c.path && errors.Is(pr.Err, c.err) {
					return
				}
			}
			t.Errorf("want %v at %s, got %v", c.err, c.path, ps)
		})
	}
}

// TestLowerKeepsChecks checks that a lowered water table, unlike an
// excavation, leaves every layer's checks in place (nothing is removed).
func TestLowerKeepsChecks(t *testing.T) {
	t.Parallel()
	p := &Project{Format: Format,
		Layers: []Layer{{Name: "sand", Thickness: 3, GammaSat: 20, Gamma: 17, K: 1e-5, Mv: 1e-5}, {Name: "clay", Thickness: 5, GammaSat: 18, K: 1e-9, Mv: 1e-3}},
		Top:    Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads: []Load{{Lower: &Lowering{WaterTable: 3}}}}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	seen := map[int]bool{}
	for _, c := range r.Checks {
		if c.Kind == CheckHeave {
			seen[c.Layer] = true
			if c.Layer == 0 && c.Top != 0 {
				t.Errorf("the sand's heave check starts at %g m, want its top", c.Top)
			}
		}
	}
	if !seen[0] || !seen[1] {
		t.Errorf("heave checks of layers %v, want both", seen)
	}
}
