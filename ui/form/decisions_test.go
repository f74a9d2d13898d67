package form

import (
	"testing"

	"porelight/solver"
)

// The decisions' questions are switched on and off, copied deeply and
// follow the layers they name.
func TestDecisionsEdits(t *testing.T) {
	p := &solver.Project{Format: solver.Format, Top: solver.Boundary{Drained: true}, Loads: []solver.Load{{Q: 50}, {Start: 100, Q: -10}},
		Layers: []solver.Layer{{Thickness: 1, GammaSat: 18, K: 1e-9, Mv: 1e-4}, {Thickness: 2, GammaSat: 17, K: 1e-9, Mv: 1e-3}, {Thickness: 2, GammaSat: 17, K: 1e-9, Mv: 1e-3}}}
	f := New(p)
	f.Edit("decisions.handover", "700")
	f.SetSurcharge(true)
	f.Edit("decisions.surcharge.removeBy", "90")
	f.SetWithSecondary(true)
	f.SetStrengthLaw(1, solver.StrengthSHANSEP)
	f.SetStrengthLaw(2, solver.StrengthRatio)
	f.Edit("decisions.strength.laws[1].ratio", "0,25")
	if got := f.Problem("decisions.strength.fs"); got == "" {
		t.Errorf("no problem shown for the missing factor of safety: %v / %v", f.Other(), solver.Validate(f.Draft()))
	}
	f.Edit("decisions.strength.fs", "1.3")
	if !f.Valid() {
		t.Fatalf("not valid: %v", f.Other())
	}
	d := f.Draft().Decisions
	if d.Handover != 700 || d.Surcharge.RemoveBy != 90 || !d.Surcharge.WithSecondary || len(d.Strength.Laws) != 2 || d.Strength.Laws[1].Ratio != 0.25 {
		t.Fatalf("draft decisions %+v %+v %+v", d, d.Surcharge, d.Strength)
	}
	m := f.Model()
	if m.Decisions == d || m.Decisions.Surcharge == d.Surcharge || m.Decisions.Strength == d.Strength || &m.Decisions.Strength.Laws[0] == &d.Strength.Laws[0] {
		t.Errorf("Model shares the decisions with the draft")
	}
	// Removing layer 1 takes its law; layer 2's law (typed text too) moves up.
	f.RemoveLayer(1)
	s := f.Draft().Decisions.Strength
	if len(s.Laws) != 1 || s.Laws[0].Layer != 1 || s.Laws[0].Law != solver.StrengthRatio || f.Text("decisions.strength.laws[0].ratio") != "0,25" {
		t.Errorf("after removing layer 2: %+v, text %q", s.Laws, f.Text("decisions.strength.laws[0].ratio"))
	}
	// The removal named stays with its stage.
	f.SetSurchargeRemoval(1)
	f.AddLoad()
	f.RemoveLoad(0)
	if r := f.Draft().Decisions.Surcharge.Removal; r == nil || *r != 0 {
		t.Errorf("after removing stage 1 the removal is %v, want stage 2 now at 0", r)
	}
	f.RemoveLoad(0)
	if r := f.Draft().Decisions.Surcharge.Removal; r != nil {
		t.Errorf("after removing its stage the removal is %v, want the solver's choice", *r)
	}
	f.SetStrengthLaw(1, "")
	f.SetSurcharge(false)
	if d := f.Draft().Decisions; d.Strength != nil || d.Surcharge != nil || d.Handover != 700 {
		t.Errorf("after switching off: %+v", d)
	}
}
