package solver

import (
	"math"
	"testing"
)

// artesian is the invented case of the issue: 6 m of clay (γsat 18
// kN/m³, k 1e-9 m/s) over 4 m of gravel (20 kN/m³, 1e-3 m/s), the water
// table at the top (head 0 there) and the gravel artesian, its base held
// at a head of 3 m above the top.
func artesian() *Project {
	return &Project{Format: Format,
		Layers: []Layer{
			{Name: "clay cap", Thickness: 6, GammaSat: 18, K: 1e-9, Mv: 2e-4},
			{Name: "gravel", Thickness: 4, GammaSat: 20, K: 1e-3, Mv: 1e-6},
		},
		Top: Boundary{Drained: true}, Bottom: Boundary{Drained: true, Head: ptr(3)},
	}
}

// TestUpliftArtesianByHand checks the uplift of a clay cap over artesian
// gravel before and after 72 kPa are taken off its top, by hand (the
// prism of soil above the aquifer against the water pressure under it:
// Terzaghi 1943, common practice). The head at the clay's base follows
// resistances in series: h = 3·(6/1e-9)/(6/1e-9 + 4/1e-3) m, so u = γw (h
// + 6) = 88.29 kPa and σ = 18·6 = 108 kPa: F = 108/88.29 = 1.223 before,
// (108 − 72)/88.29 = 0.408 after, immediately (the gravel drains in
// minutes) and in the long term; the heave factor of the clay is
// ic/i = ((18 − 9.81)/9.81)/(3/6) = 1.670 throughout, its end heads being
// held. Tolerance 1e-9 relative for the steady figures (nodally exact),
// 1e-4 for the least after digging (the gravel's last excess).
func TestUpliftArtesianByHand(t *testing.T) {
	t.Parallel()
	p := artesian()
	p.Loads = []Load{{Start: 10, Q: -72}}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	gw := DefaultGammaW
	h := 3 * (6 / 1e-9) / (6/1e-9 + 4/1e-3)
	u := gw * (h + 6)
	before, after := 108/u, 36/u
	heave := ((18 - gw) / gw) / ((h - 0) / 6)
	var prism *Check
	for i := range r.Checks {
		if c := &r.Checks[i]; c.Kind == CheckPrism && c.Layer == 0 {
			prism = c
		}
	}
	if prism == nil {
		t.Fatalf("no prism check at the clay's base: %+v", r.Checks)
	}
	for _, c := range []struct {
		what      string
		got, want float64
		tol       float64
	}{
		{"prism factor before digging", prism.Initial, before, 1e-9},
		{"prism factor after the stage", prism.Stages[0], after, 1e-4},
		{"prism factor in the long term", prism.LongTerm, after, 1e-9},
		{"least prism factor", prism.Least, after, 1e-4},
		{"summary's prism factor", r.Summary.Prism.Factor, after, 1e-4},
		{"summary's depth", r.Summary.Prism.Depth, 6, 1e-12},
		{"least heave factor", *r.Summary.MinHeaveFactor, heave, 1e-6},
	} {
		if math.Abs(c.got-c.want) > c.tol*math.Abs(c.want) {
			t.Errorf("%s = %.6g, by hand %.6g (tolerance %g relative)", c.what, c.got, c.want, c.tol)
		}
	}
	// The summary headlines the worst, not the initial, and says when:
	// after the dig on day 10 (at its first steps or in the long term).
	if g := r.Summary.Prism; g.Time != nil && *g.Time < 10 {
		t.Errorf("the least prism factor is put at %g days, before the dig", *g.Time)
	}
	if len(prism.Series) != len(r.Consolidation.Series.Time) {
		t.Errorf("the prism series has %d values for %d times", len(prism.Series), len(r.Consolidation.Series.Time))
	}
}
