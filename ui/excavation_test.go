package ui

import (
	"fmt"
	"strconv"
	"strings"
	"testing"
)

// TestPageExcavationAndDrains edits an excavation stage, a layer that
// drains to an outlet and a leaky end through the page, and reads the
// governing uplift factor in the summary.
func TestPageExcavationAndDrains(t *testing.T) {
	p := newPage(t, Sources{})
	p.fire("loads-2-kind", "change", map[string]any{"value": "dig"})
	p.typeInto("loads-2-dig-depth", "1")
	d := p.root.form.Draft()
	if l := d.Loads[2]; l.Dig == nil || l.Dig.Depth != 1 || l.Q != 0 {
		t.Fatalf("stage 3 after choosing an excavation of 1 m: %+v", l)
	}
	if p.find("loads-2-dig-waterLevel") == nil {
		t.Error("no water level input for the excavation")
	}
	if p.find("loads-dig-note") == nil {
		t.Error("no note that depths stay measured from the original top")
	}
	// Stage 3 took the demo's surcharge off; as a dig it no longer does,
	// so the surcharge question has nothing to answer and says so.
	if got := fmt.Sprint(p.root.form.Other()); !strings.Contains(got, "decisions.surcharge") || !strings.Contains(got, "no load stage takes a surcharge off") {
		t.Errorf("problems after the removal became a dig: %s, want decisions.surcharge naming the missing removal", got)
	}
	p.fire("decisions-surcharge-on", "change", map[string]any{"checked": false})
	p.fire("layers-2-outlet", "change", map[string]any{"checked": true})
	if p.root.form.Draft().Layers[2].Outlet == nil || p.find("layers-2-outlet-head") == nil {
		t.Error("the sand seam is not marked as draining to an outlet, or shows no head input")
	}
	p.fire("top-drained", "change", map[string]any{"value": "leaky"})
	if got := p.root.form.Draft().Top; !got.Drained || got.Resistance <= 0 || p.find("top-resistance") == nil {
		t.Errorf("top after choosing a leaky end: %+v", got)
	}
	if !p.root.form.Valid() {
		t.Fatalf("problems: %v %v", p.root.form.ProblemsUnder(""), p.root.form.Other())
	}
	r := p.root.Result()
	if r == nil || r.Summary.Heave == nil {
		t.Fatal("no governing heave check after the edits")
	}
	if got := p.text("sum-heave"); got == "–" {
		t.Errorf("the heave row shows %q", got)
	}
	if note := p.html(); !strings.Contains(note, "below the original top") {
		t.Error("the summary does not say where the governing check acts")
	}
	// The table of the checks through time, folded until opened, gives
	// the summary's least factor in its row.
	p.fire("tables-toggle", "click", nil)
	g := r.Summary.Heave
	row := p.text("checks-" + strconv.Itoa(g.Check))
	if !strings.Contains(row, sig(g.Factor, 3)) {
		t.Errorf("the checks table row %q lacks the summary's %s", row, sig(g.Factor, 3))
	}
}
