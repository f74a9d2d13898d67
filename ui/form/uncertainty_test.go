package form

import (
	"testing"

	"porelight/solver"
)

// The spread of a layer moves with it when rows are added, removed and
// moved, typed text included; the COV inputs show per cent.
func TestUncertaintyFollowsLayers(t *testing.T) {
	p := &solver.Project{Format: solver.Format, Top: solver.Boundary{Drained: true}, Layers: []solver.Layer{
		{Name: "a", Thickness: 1, GammaSat: 18, K: 1e-9, Mv: 1e-3},
		{Name: "b", Thickness: 1, GammaSat: 18, K: 1e-9, Mv: 1e-3},
		{Name: "c", Thickness: 1, GammaSat: 18, K: 1e-9, Mv: 1e-3},
	}}
	f := New(p)
	f.SetUncertainty(true)
	if u := f.Draft().Uncertainty; u == nil || len(u.Layers) != 3 || u.Layers[0].K != StartCOVK {
		t.Fatalf("switched on: %+v", u)
	}
	f.Edit("uncertainty.layers[2].k", "40")
	if got := f.Draft().Uncertainty.Layers[2].K; got != 0.4 {
		t.Fatalf("40 %% reads as %g, want 0.4", got)
	}
	f.Edit("uncertainty.layers[1].mv", "x")
	f.RemoveLayer(0)
	u := f.Draft().Uncertainty
	if len(u.Layers) != 2 || u.Layers[1].K != 0.4 || f.Text("uncertainty.layers[1].k") != "40" || f.Text("uncertainty.layers[0].mv") != "x" {
		t.Errorf("after removing layer 1: %+v, texts %q %q", u.Layers, f.Text("uncertainty.layers[1].k"), f.Text("uncertainty.layers[0].mv"))
	}
	f.AddLayer(1)
	if u := f.Draft().Uncertainty; len(u.Layers) != 3 || u.Layers[2] != (solver.LayerSpread{}) {
		t.Errorf("after adding a layer: %+v", u.Layers)
	}
	f.Edit("uncertainty.layers[0].kMv", "2")
	if f.Problem("uncertainty.layers[0].kMv") == "" {
		t.Error("a correlation of 2 shows no problem")
	}
	f.SetUncertainty(false)
	if f.Draft().Uncertainty != nil || f.Text("uncertainty.layers[0].mv") == "x" {
		t.Error("switched off, the spread or its text stays")
	}
}
