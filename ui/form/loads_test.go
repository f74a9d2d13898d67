package form

import (
	"testing"

	"porelight/solver"
)

// A stage turns into a fill of the same pressure and back; the typed text
// of the side that goes is forgotten, the project is never left invalid
// by the switch itself.
func TestSetFill(t *testing.T) {
	t.Parallel()
	f := New(column())
	f.Edit("loads[0].q", "60")
	f.SetFill(0, true)
	l := f.Draft().Loads[0]
	if l.Fill == nil || l.Q != 0 || l.Pressure() != 60 {
		t.Fatalf("fill of 60 kPa: got %+v (fill %+v)", l, l.Fill)
	}
	if f.Text("loads[0].q") != "0" || !f.Valid() {
		t.Errorf("q text %q kept, or invalid: %v", f.Text("loads[0].q"), f.ProblemsUnder(""))
	}
	f.Edit("loads[0].fill.thickness", "2,5")
	f.SetFill(0, false)
	if l := f.Draft().Loads[0]; l.Fill != nil || l.Q != 50 {
		t.Errorf("back to a pressure: %+v, want q = 2.5 × 20 = 50 kPa", l)
	}
	if f.Text("loads[0].fill.thickness") != "" {
		t.Errorf("fill text kept after the fill went")
	}
}

// SetArea gives each shape sizes to start from, keeps the offset, makes an
// embankment a fill, and a profile a table from the top to the base.
func TestSetArea(t *testing.T) {
	t.Parallel()
	f := New(column())
	for _, kind := range []string{"strip", "rectangle", "circle", "embankment", AreaProfile, AreaWhole} {
		f.SetArea(1, kind)
		if !f.Valid() {
			t.Errorf("%s: %v %v", kind, f.ProblemsUnder(""), f.Other())
		}
		if got := AreaKind(f.Draft().Loads[1]); got != kind {
			t.Errorf("AreaKind after SetArea(%q) = %q", kind, got)
		}
	}
	f.SetArea(0, "strip")
	f.Edit("loads[0].area.x", "4")
	f.SetArea(0, "rectangle")
	if a := f.Draft().Loads[0].Area; a.X != 4 || a.Width != 20 || a.Length != 40 {
		t.Errorf("rectangle from a strip: %+v, want x = 4 kept, 20 × 40", a)
	}
	f.SetArea(0, "embankment")
	if f.Draft().Loads[0].Fill == nil {
		t.Errorf("an embankment stage is not a fill")
	}
	f.SetFill(0, false)
	if a := f.Draft().Loads[0].Area; a.Shape != "strip" || a.Width != 20+2*3 {
		t.Errorf("embankment back to a pressure: %+v, want a strip of the mean width 26 m", a)
	}
	f.SetArea(0, AreaProfile)
	if pr := f.Draft().Loads[0].Profile; len(pr) != 2 || pr[1].Z != height(f.Draft()) {
		t.Errorf("new profile %v, want top and base", pr)
	}
}

// Profile points are added and removed, with typed text renumbered.
func TestProfilePoints(t *testing.T) {
	t.Parallel()
	f := New(column())
	f.AddPoint("initialExcess")
	f.AddPoint("initialExcess")
	f.AddPoint("initialExcess")
	if n := len(f.Draft().InitialExcess); n != 3 {
		t.Fatalf("%d points, want 3", n)
	}
	f.Edit("initialExcess[2].value", "12x")
	f.RemovePoint("initialExcess", 0)
	if got := f.Text("initialExcess[1].value"); got != "12x" {
		t.Errorf("typed text of the third point: %q at the second, want 12x", got)
	}
	if f.Problem("initialExcess[1].value") == "" {
		t.Errorf("bad text lost its problem")
	}
	f.RemovePoint("initialExcess", 1)
	f.RemovePoint("initialExcess", 0)
	if f.Draft().InitialExcess != nil || !f.Valid() {
		t.Errorf("empty profile %v, valid %v", f.Draft().InitialExcess, f.Valid())
	}
	f.AddPoint("loads[9].profile") // no such stage: nothing happens
}

// Model copies fills and areas deeply.
func TestCloneStages(t *testing.T) {
	t.Parallel()
	p := column()
	p.Loads[0].Fill = &solver.Fill{Thickness: 2, Gamma: 19}
	p.Loads[0].Q = 0
	p.Loads[0].Area = &solver.Area{Shape: "circle", Radius: 5}
	f := New(p)
	m := f.Model()
	m.Loads[0].Fill.Thickness = 9
	m.Loads[0].Area.Radius = 9
	if d := f.Draft().Loads[0]; d.Fill.Thickness != 2 || d.Area.Radius != 5 || p.Loads[0].Fill.Thickness != 2 {
		t.Errorf("a copy shares fill or area: %+v %+v", d.Fill, d.Area)
	}
}
