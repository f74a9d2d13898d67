package ui

import (
	"testing"

	"porelight/solver"
	"porelight/solver/soil"
)

// TestDerivedCvOnlyFromValidInputs: the derived cv beside layer 2 is
// k/(mv γw) of what is typed (soil.Cv, Terzaghi's definition; common
// practice), and while k or mv is invalid it shows no figure rather than
// the last valid one.
func TestDerivedCvOnlyFromValidInputs(t *testing.T) {
	p := newPage(t, Sources{})
	d := p.root.Form().Draft()
	want := sig(soil.Cv(d.Layers[1].K, d.Layers[1].Mv, solver.ResolveGammaW(d)), 3)
	if got := p.text("layers-1-cv"); got != want {
		t.Fatalf("cv of layer 2 shows %q, want %q", got, want)
	}
	for _, c := range []struct{ id, bad, good string }{
		{"layers-1-k", "1.8e-", "1.8e-9"},
		{"layers-1-mv", "-1", p.value("layers-1-mv")},
	} {
		p.typeInto(c.id, c.bad)
		if got := p.text("layers-1-cv"); got != "–" {
			t.Errorf("with %s = %q the cv shows %q, want –", c.id, c.bad, got)
		}
		p.typeInto(c.id, c.good)
		if got := p.text("layers-1-cv"); got != want {
			t.Errorf("with %s back to %q the cv shows %q, want %q", c.id, c.good, got, want)
		}
	}
	p.typeInto("layers-1-k", "3.6e-9")
	if got, want := p.text("layers-1-cv"), sig(soil.Cv(3.6e-9, d.Layers[1].Mv, solver.ResolveGammaW(d)), 3); got != want {
		t.Errorf("with k doubled the cv shows %q, want %q", got, want)
	}
}
