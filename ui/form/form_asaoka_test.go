package form

import (
	"slices"
	"testing"

	"porelight/solver"
)

// The saved choices of Asaoka's method follow the layers they name when
// layers are added, moved or removed, so they never silently point at
// another layer; clearing them restores the defaults.
func TestAsaokaLayersFollowEdits(t *testing.T) {
	var f Form
	f.Reset(&solver.Project{Format: solver.Format, Layers: []solver.Layer{
		{Name: "a", Thickness: 1, GammaSat: 18, K: 1e-9, Mv: 5e-4},
		{Name: "b", Thickness: 1, GammaSat: 18, K: 1e-9, Mv: 5e-4},
		{Name: "c", Thickness: 1, GammaSat: 18, K: 1e-9, Mv: 5e-4},
	}, Top: solver.Boundary{Drained: true}})
	f.SetAsaoka(&solver.AsaokaSettings{From: 10, Layers: []int{1, 2}})
	names := func() []string {
		var out []string
		for _, l := range f.Asaoka().Layers {
			out = append(out, f.Draft().Layers[l].Name)
		}
		return out
	}
	f.AddLayer(0) // a copy of "a" after it
	f.MoveLayer(3, -1)
	if got := names(); !slices.Equal(got, []string{"c", "b"}) { // in column order
		t.Errorf("after add and move: %v", got)
	}
	f.RemoveLayer(slices.IndexFunc(f.Draft().Layers, func(l solver.Layer) bool { return l.Name == "b" }))
	if got := names(); !slices.Equal(got, []string{"c"}) || f.Asaoka().From != 10 {
		t.Errorf("after removing b: %v, %+v", got, f.Asaoka())
	}
	if m := f.Model(); m.Monitoring.Asaoka == f.Draft().Monitoring.Asaoka {
		t.Error("the model shares the saved choices with the draft")
	}
	f.SetAsaoka(&solver.AsaokaSettings{})
	if f.Asaoka() != nil {
		t.Errorf("cleared choices kept: %+v", f.Asaoka())
	}
}
