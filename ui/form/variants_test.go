package form

import (
	"testing"

	"porelight/solver"
)

// An option's change is absent until typed, holds a typed zero as zero,
// goes back to absent when emptied, and moves with its layer.
func TestVariantEdits(t *testing.T) {
	p := &solver.Project{Format: solver.Format, Top: solver.Boundary{Drained: true},
		Layers: []solver.Layer{{Thickness: 1, GammaSat: 18, K: 1e-9, Mv: 1e-3}, {Thickness: 2, GammaSat: 18, K: 2e-9, Mv: 1e-3}},
		Loads:  []solver.Load{{Q: 10}, {Start: 50, Q: 20}}}
	f := New(p)
	f.AddVariant()
	v := func() *solver.Variant { return &f.Draft().Variants[0] }
	if v().Name != "Option 1" || len(v().Loads) != 2 || len(v().Layers) != 2 {
		t.Fatalf("new option %+v", *v())
	}
	if ph, ok := Placeholder("variants[0].loads[1].q"); !ok || ph != "as given" {
		t.Errorf("placeholder %q", ph)
	}
	f.Edit("variants[0].loads[1].q", "0")
	if c := v().Loads[1].Q; c == nil || *c != 0 {
		t.Fatalf("typed 0: %v", c)
	}
	f.Edit("variants[0].loads[1].q", "")
	if v().Loads[1].Q != nil {
		t.Error("emptied: still set")
	}
	f.Edit("variants[0].layers[1].k", "5e-9")
	f.Edit("variants[0].layers[1].ch", "1")
	if c := v().Layers[1].Ch; c == nil || *c != 1/solver.DaysPerYear {
		t.Errorf("ch typed as 1 m²/yr: %v m²/day", c)
	}
	f.RemoveLayer(0)
	if c := v().Layers; len(c) != 1 || c[0].K == nil || *c[0].K != 5e-9 || f.Text("variants[0].layers[0].k") != "5e-9" {
		t.Errorf("after removing layer 1: %+v, text %q", c, f.Text("variants[0].layers[0].k"))
	}
	f.Edit("variants[0].name", "")
	if f.Problem("variants[0].name") == "" {
		t.Error("an unnamed option shows no problem")
	}
	f.RemoveVariant(0)
	if len(f.Draft().Variants) != 0 || f.Text("variants[0].name") != "" {
		t.Error("the removed option or its text stays")
	}
}
