package ui

import (
	"strings"
	"testing"

	"porelight/solver"
)

// A solve far enough along shows Cancel; clicking it keeps the results
// and says so, and the next edit solves again.
func TestCancelKeepsResults(t *testing.T) {
	p := newPage(t, Sources{})
	flux := p.attr("sum-flux", "data-value")
	if p.find("solve-cancel") != nil {
		t.Fatal("Cancel shows with no solve under way")
	}
	p.root.busy, p.root.progress = true, 0 // a solve that has not reported yet
	p.build()
	if p.find("solve-cancel") != nil {
		t.Fatal("Cancel shows before the solve reports progress")
	}
	p.root.progress = 0.4
	p.build()
	g := p.root.gen.Load()
	p.fire("solve-cancel", "click", nil)
	if p.root.gen.Load() == g {
		t.Error("cancel did not outdate the solve under way")
	}
	if s := p.text("status"); !strings.Contains(s, "cancelled") || !strings.Contains(s, "earlier inputs") {
		t.Errorf("status after cancel %q", s)
	}
	if p.find("solve-cancel") != nil {
		t.Error("Cancel still shows after cancelling")
	}
	if got := p.attr("sum-flux", "data-value"); got != flux {
		t.Errorf("flux %s after cancel, was %s", got, flux)
	}
	p.typeInto("layers-1-k", "6e-9")
	if s := p.text("status"); !strings.Contains(s, "up to date") {
		t.Errorf("status after the next edit %q", s)
	}
}

// The autosave holds every valid edit at once, solved or not.
func TestAutosaveBeforeSolve(t *testing.T) {
	p := newPage(t, Sources{})
	p.root.Solve = func(*solver.Project, *solver.Options) (*solver.Result, error) {
		return nil, solver.ErrCanceled // a solve that never finishes
	}
	p.typeInto("layers-1-k", "6.5e-9")
	if got := p.host.store[AutosaveKey]; !strings.Contains(got, `"k":6.5e-9`) {
		t.Errorf("autosave holds %.200q…, want k = 6.5e-9", got)
	}
	p.typeInto("layers-1-k", "6.5e-")
	if got := p.host.store[AutosaveKey]; !strings.Contains(got, `"k":6.5e-9`) {
		t.Errorf("an invalid edit changed the autosave: %.200q…", got)
	}
}
