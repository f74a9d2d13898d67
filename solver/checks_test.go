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

// TestUpliftDigByHand is the case with a real excavation: 10 m of
// clay cap (γsat 18 kN/m³, 1e-9 m/s) over 4 m of gravel (1e-3 m/s) held
// at a head of 3 m above the top, the water table at the top; 4 m (72
// kPa of soil) dug away at once on day 10 and pumped dry. By hand (the
// prism above the aquifer, Terzaghi 1943, common practice): the head at
// the clay's base is 3·(10/1e-9)/(10/1e-9 + 4/1e-3) m, u = γw (h + 10) =
// 127.5 kPa; σ = 180 kPa before, 180 − 72 = 108 kPa after (the pit is dry,
// no water left in it): F = 1.412 before, 0.847 after and in the long
// term (where the floor's head of −4 m moves the gravel's by a few
// micrometres, through the resistances in series). Tolerance 1e-9 relative for the steady and long-term figures,
// 1e-4 for the least (the gravel's last excess at the interface).
func TestUpliftDigByHand(t *testing.T) {
	t.Parallel()
	p := &Project{Format: Format,
		Layers: []Layer{
			{Name: "clay cap", Thickness: 10, GammaSat: 18, K: 1e-9, Mv: 2e-4, MvUnload: 5e-5},
			{Name: "gravel", Thickness: 4, GammaSat: 20, K: 1e-3, Mv: 1e-6},
		},
		Top: Boundary{Drained: true}, Bottom: Boundary{Drained: true, Head: ptr(3)},
		Loads: []Load{{Start: 10, Dig: &Dig{Depth: 4, WaterLevel: ptr(4)}}},
	}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	gw := DefaultGammaW
	h := 3 * (10 / 1e-9) / (10/1e-9 + 4/1e-3)
	u := gw * (h + 10)
	// Once drained, the floor (head −4 m) and the gravel's base (3 m)
	// drive the flow through the 6 m of clay left and the gravel.
	hL := 3 - 7*(4/1e-3)/(6/1e-9+4/1e-3)
	uL := gw * (hL + 10)
	var prism *Check
	for i := range r.Checks {
		if c := &r.Checks[i]; c.Kind == CheckPrism && c.Layer == 0 {
			prism = c
		}
	}
	if prism == nil {
		t.Fatal("no prism check at the clay's base")
	}
	for _, c := range []struct {
		what      string
		got, want float64
		tol       float64
	}{
		{"before digging", prism.Initial, 180 / u, 1e-9},
		{"after digging", prism.Stages[0], 108 / u, 1e-4},
		{"long term", prism.LongTerm, 108 / uL, 1e-9},
		{"summary", r.Summary.Prism.Factor, 108 / uL, 1e-4},
	} {
		if math.Abs(c.got-c.want) > c.tol*c.want {
			t.Errorf("prism factor %s = %.6g, by hand %.6g (tolerance %g relative)", c.what, c.got, c.want, c.tol)
		}
	}
}

// TestUpliftDigOverTime digs the cap of TestUpliftDigByHand over 20 days
// (from day 10): halfway, on day 20, half the soil is gone, so the prism
// factor is (180 − 36)/127.5 = 1.129 by hand (the gravel holds the
// interface at its head within micrometres; tolerance 1e-4), and it falls
// to 0.847 at the end of the dig.
func TestUpliftDigOverTime(t *testing.T) {
	t.Parallel()
	p := &Project{Format: Format,
		Layers: []Layer{
			{Name: "clay cap", Thickness: 10, GammaSat: 18, K: 1e-9, Mv: 2e-4, MvUnload: 5e-5},
			{Name: "gravel", Thickness: 4, GammaSat: 20, K: 1e-3, Mv: 1e-6},
		},
		Top: Boundary{Drained: true}, Bottom: Boundary{Drained: true, Head: ptr(3)},
		Loads: []Load{{Start: 10, Ramp: 20, Dig: &Dig{Depth: 4, WaterLevel: ptr(4)}}},
		Times: []float64{20, 30},
	}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	u := DefaultGammaW * (3*(10/1e-9)/(10/1e-9+4/1e-3) + 10)
	var prism *Check
	for i := range r.Checks {
		if c := &r.Checks[i]; c.Kind == CheckPrism && c.Layer == 0 {
			prism = c
		}
	}
	if prism == nil || len(prism.Series) == 0 {
		t.Fatal("no prism series at the clay's base")
	}
	ts := r.Consolidation.Series.Time
	for _, c := range []struct{ t, want float64 }{{20, 144 / u}, {30, 108 / u}} {
		got := math.NaN()
		for i, tt := range ts {
			if tt == c.t {
				got = prism.Series[i]
			}
		}
		if !(math.Abs(got-c.want) <= 1e-4*c.want) {
			t.Errorf("prism factor on day %g = %.6g, by hand %.6g (tolerance 1e-4 relative)", c.t, got, c.want)
		}
	}
}

// TestChecksUnderFill: a fill on the artesian clay cap (40 kPa on day
// 10) cannot lift or heave it, though the water it presses out flows up
// through the clay's top. The weight the fill adds at the clay's top
// counts as the weighted filter of common practice (Terzaghi & Peck
// 1967): by hand, with h the head at the clay's base from resistances in
// series (as TestUpliftArtesianByHand), the long-term heave factor is
// (γ'·6 + 40)/(γw h) and the layer's uplift factor (108 + 40)/(γw (h + 6));
// the least of each is then the initial one, ic/i = (γ'/γw)/(h/6) and
// 108/(γw (h + 6)), as no state after the fill is worse. Tolerance 1e-6
// relative (nodally exact steady heads; the least taken over steps).
func TestChecksUnderFill(t *testing.T) {
	t.Parallel()
	p := artesian()
	p.Loads = []Load{{Start: 10, Q: 40}}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	gw := DefaultGammaW
	h := 3 * (6 / 1e-9) / (6/1e-9 + 4/1e-3)
	uB := gw * (h + 6)
	var heave, uplift *Check
	for i := range r.Checks {
		switch c := &r.Checks[i]; {
		case c.Kind == CheckHeave && c.Layer == 0:
			heave = c
		case c.Kind == CheckUplift && c.Layer == 0:
			uplift = c
		}
	}
	if heave == nil || uplift == nil {
		t.Fatalf("no heave or uplift check of the clay: %+v", r.Checks)
	}
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"heave factor before the fill (ic/i)", heave.Initial, ((18 - gw) / gw) / (h / 6)},
		{"heave factor in the long term", heave.LongTerm, ((18-gw)*6 + 40) / (gw * h)},
		{"least heave factor", heave.Least, ((18 - gw) / gw) / (h / 6)},
		{"uplift factor before the fill", uplift.Initial, 108 / uB},
		{"uplift factor in the long term", uplift.LongTerm, (108 + 40) / uB},
		{"least uplift factor", uplift.Least, 108 / uB},
	} {
		if math.Abs(c.got-c.want) > 1e-6*c.want {
			t.Errorf("%s = %.6g, by hand %.6g (±1e-6 relative)", c.what, c.got, c.want)
		}
	}
}
