package ui

import (
	"math"
	"slices"
	"strconv"
	"strings"
	"testing"

	"porelight/solver"
)

// Drains on the demo: switching them on solves with them, the summary
// gives U, Uv and Uh at the output times with U ≥ Uv (drains only add
// drainage), the plan is drawn, a bad spacing is shown at its input and
// keeps the last good results, and the design helper finds a spacing
// that the page can take.
func TestPageDrains(t *testing.T) {
	p := newPage(t, Sources{})
	if p.find("drains-spacing") != nil {
		t.Fatal("drain inputs before the drains are switched on")
	}
	p.fire("drains-on", "change", map[string]any{"checked": true})
	if p.root.form.Draft().Drains == nil {
		t.Fatal("the drains did not switch on")
	}
	r := p.root.result
	if r == nil || r.Drains == nil || len(r.Drains.AtTimes) == 0 {
		t.Fatalf("no drain results after switching them on: %+v", p.root.solveErr)
	}
	for _, a := range r.Drains.AtTimes {
		if a.U < a.Uv-1e-9 {
			t.Errorf("t = %g: U %.4f below Uv %.4f", a.Time, a.U, a.Uv)
		}
	}
	if p.find("sum-drains-0") == nil || p.find("fig-drain-plan") == nil {
		t.Error("no drain summary table or plan")
	}
	if !strings.Contains(p.text("drains-cell"), "De = ") {
		t.Errorf("cell text %q", p.text("drains-cell"))
	}
	p.typeInto("drains-spacing", "0.01")
	if !strings.Contains(p.html(), "drains-spacing-err") {
		t.Error("a spacing narrower than the drain shows no problem at its input")
	}
	if p.root.result != r {
		t.Error("a bad input replaced the last good results")
	}
	p.typeInto("drains-spacing", "1.5")
	p.fire("drains-design-on", "change", map[string]any{"checked": true})
	p.typeInto("drains-design-degree", "50")
	p.typeInto("drains-design-time", "100")
	p.fire("drains-design-run", "click", nil)
	st := p.text("drains-design-status")
	if p.root.design.res == nil {
		t.Fatalf("the design helper found nothing: %q", st)
	}
	p.fire("drains-design-use", "click", nil)
	got := p.root.form.Draft().Drains.Spacing
	if want := p.root.design.res.Spacing; !(got <= want && got > want-0.0011) {
		t.Errorf("spacing taken %g, found %g", got, want)
	}
	if !strings.Contains(st, strconv.Itoa(p.root.design.res.Solves)+" solves") {
		t.Errorf("status %q", st)
	}
	p.fire("drains-on", "change", map[string]any{"checked": false})
	if p.root.form.Draft().Drains != nil || p.root.result.Drains != nil {
		t.Error("drains stay after switching them off")
	}
}

// With drains the fit panel offers ch per layer: readings made with the
// upper clay's ch 1.5 times the project's give back about 1.5 (a check of
// the panel's wiring; monitor's tests check the fit against closed forms),
// Apply types the fitted ch (in m²/year) into the layer, Revert clears it.
func TestFitCh(t *testing.T) {
	pr := monColumn()
	pr.Drains = &solver.Drains{Pattern: "square", Spacing: 2.5, Diameter: 0.05}
	made := *pr
	made.Layers = slices.Clone(pr.Layers)
	made.Layers[0].KhKv = 1.5
	synthRecords(t, &made, 1)
	pr.Monitoring = made.Monitoring
	p := monPage(t, pr)
	if h := p.html(); !strings.Contains(h, "Implied ch (drains)") || !strings.Contains(h, "m²/year)") {
		t.Error("the Asaoka panel gives no ch on a drained site")
	}
	p.fire("fit-ch-0", "change", map[string]any{"checked": true})
	p.fire("fit-run", "click", nil)
	if e := p.find("fit-error"); e != nil {
		t.Fatalf("fit refused: %s", p.text("fit-error"))
	}
	res := p.root.fit.res
	if res == nil || len(res.Params) != 1 || res.Params[0].Name != "layers[0].ch" || math.Abs(res.Params[0].Multiplier-1.5) > 0.01 {
		t.Fatalf("fit result %+v", res)
	}
	if got := p.text("fit-param-0"); !strings.Contains(got, "ch of") {
		t.Errorf("row %q", got)
	}
	p.fire("fit-apply", "click", nil)
	if ch := p.root.Form().Draft().Layers[0].Ch; math.Abs(ch-res.Params[0].Ch) > 5e-3*ch { // applied to 3 significant figures
		t.Errorf("applied ch %g, fitted %g", ch, res.Params[0].Ch)
	}
	p.fire("fit-revert", "click", nil)
	if ch := p.root.Form().Draft().Layers[0].Ch; ch != 0 {
		t.Errorf("ch after Revert %g, want 0 (from kh/kv)", ch)
	}
}
