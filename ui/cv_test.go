package ui

import (
	"testing"

	"porelight/solver"
	"porelight/solver/soil"
	"porelight/ui/form"
)

// TestDerivedCvOnlyFromValidInputs: the cv input of layer 2 shows
// k/(mv γw) of what is typed (soil.Cv, Terzaghi's definition; common
// practice) in m²/yr, and while k or mv is invalid it shows no figure
// rather than the last valid one.
func TestDerivedCvOnlyFromValidInputs(t *testing.T) {
	p := newPage(t, Sources{})
	d := p.root.Form().Draft()
	cvOf := func(k float64) string {
		return form.FormatSig(soil.Cv(k, d.Layers[1].Mv, solver.ResolveGammaW(d))*solver.DaysPerYear, 3)
	}
	want := cvOf(d.Layers[1].K)
	if got := p.value("layers-1-cv"); got != want {
		t.Fatalf("cv of layer 2 shows %q, want %q", got, want)
	}
	for _, c := range []struct{ id, bad, good string }{
		{"layers-1-k", "1.8e-", "1.8e-9"},
		{"layers-1-mv", "-1", p.value("layers-1-mv")},
	} {
		p.typeInto(c.id, c.bad)
		if got := p.value("layers-1-cv"); got != "" {
			t.Errorf("with %s = %q the cv shows %q, want nothing", c.id, c.bad, got)
		}
		p.typeInto(c.id, c.good)
		if got := p.value("layers-1-cv"); got != want {
			t.Errorf("with %s back to %q the cv shows %q, want %q", c.id, c.good, got, want)
		}
	}
	p.typeInto("layers-1-k", "3.6e-9")
	if got, want := p.value("layers-1-cv"), cvOf(3.6e-9); got != want {
		t.Errorf("with k doubled the cv shows %q, want %q", got, want)
	}
	// A cv typed gives k = cv·mv·γw (to 6 figures).
	p.typeInto("layers-1-cv", "2.5")
	wantK := form.FormatSig(2.5/solver.DaysPerYear/soil.SecondsPerDay*d.Layers[1].Mv*solver.ResolveGammaW(d), 6)
	if got := p.value("layers-1-k"); got != wantK {
		t.Errorf("cv 2.5 m²/yr typed: k shows %q, want %q", got, wantK)
	}
}
