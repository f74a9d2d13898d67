package form

import "testing"

// Drains are switched on with a valid starting layout and off with their
// typed text; the tip's layer follows structural edits of the layers.
func TestDrainsEditing(t *testing.T) {
	t.Parallel()
	p := column()
	p.Top.Excess = nil // not modelled with drains (solver.Validate refuses it)
	f := New(p)
	f.SetDrains(true)
	if f.Draft().Drains == nil || !f.Valid() {
		t.Fatalf("drains on: %+v, problems %v", f.Draft().Drains, f.Other())
	}
	f.Edit("drains.spacing", "0,01")
	if f.Problem("drains.spacing") == "" {
		t.Error("a spacing narrower than the drain shows no problem at drains.spacing")
	}
	f.Edit("drains.spacing", "2")
	f.Edit("drains.qw", "100") // m³/year
	if q := f.Draft().Drains.Qw; q < 3.16e-6 || q > 3.17e-6 {
		t.Errorf("100 m³/year reads as %g m³/s, want 3.169e-6", q)
	}
	f.SetDrainSize(false)
	if d := f.Draft().Drains; d.Width != 0 || d.Diameter == 0 || !f.Valid() {
		t.Errorf("round drain: %+v", d)
	}
	f.SetDrainTip(1)
	f.RemoveLayer(0)
	if d := f.Draft().Drains; d.ToLayer == nil || *d.ToLayer != 0 {
		t.Errorf("after removing the layer above, the tip is at layer %v, want 0", d.ToLayer)
	}
	f.SetDrains(false)
	if f.Draft().Drains != nil || f.Text("drains.spacing") != "" {
		t.Errorf("drains off leaves %+v and text %q", f.Draft().Drains, f.Text("drains.spacing"))
	}
}
