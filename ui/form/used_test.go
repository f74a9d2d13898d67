package form

import (
	"testing"

	"porelight/solver"
)

// TestUsed: an empty input prints what it stands for. The values are
// those of the project below, by the solver's own rules for defaults
// (solver.ResolveMesh: H/DefaultDivisions; a drained end's head −waterTable).
func TestUsed(t *testing.T) {
	p := &solver.Project{Format: solver.Format, WaterTable: 1.5,
		Layers: []solver.Layer{{Name: "a", Thickness: 4, GammaSat: 18.5, K: 1e-9, Mv: 2e-4}, {Name: "b", Thickness: 6, GammaSat: 17, K: 1e-9, Mv: 1e-4, Calpha: 0.01}}}
	f := New(p)
	for _, c := range []struct{ path, want string }{
		{"layers[0].gamma", "18.5"},
		{"layers[1].gamma", "17"},
		{"layers[0].mvUnload", "0.0002"},
		{"layers[1].calphaReduced", "0.01"},
		{"layers[0].calphaReduced", "= Cα"},
		{"layers[0].calpha", "none"},
		{"mesh.maxSize", FormatNumber(10.0 / solver.DefaultDivisions)},
		{"top.head", "-1.5"},
		{"gammaW", FormatNumber(solver.DefaultGammaW)},
		{"layers[0].thickness", ""}, // holds a value
		{"title", ""},               // no placeholder
	} {
		if got := f.Used(c.path); got != c.want {
			t.Errorf("Used(%q) = %q, want %q", c.path, got, c.want)
		}
	}
	f.Edit("layers[0].gamma", "17.5")
	if got := f.Used("layers[0].gamma"); got != "" {
		t.Errorf("a typed γ prints as the default %q", got)
	}
}
