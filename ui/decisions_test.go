package ui

import (
	"strings"
	"testing"

	"porelight/solver"
)

// A day reads as a calendar date when the project has a start date, whole
// days rounded up ("on or after"): 15 Apr 2024 + 410 days is 30 May 2025
// (365 days to 15 Apr 2025, then 15 + 30 to 30 May).
func TestWhen(t *testing.T) {
	withStart := &solver.Project{Monitoring: &solver.Monitoring{Start: "2024-04-15"}}
	for _, c := range []struct {
		p    *solver.Project
		day  float64
		want string
	}{
		{withStart, 410, "30 May 2025 (day 410)"},
		{withStart, 409.2, "30 May 2025 (day 410)"},
		{nil, 5.5, "day 5.5"},
		{&solver.Project{}, 1341.8, "day 1342"},
	} {
		if got := when(c.p, c.day); got != c.want {
			t.Errorf("when(%g) = %q, want %q", c.day, got, c.want)
		}
	}
	if got := mm1(-1e-9); got != "0.0" {
		t.Errorf("mm1 of a rounding-sized rebound: %q", got)
	}
}

// The summary names the settlement after handover when the solve has it.
func TestSummaryResidualRow(t *testing.T) {
	r := &solver.Result{Residual: &solver.Residual{Time: 700, Life: 18262.5, Total: 0.1234, Primary: 0.1, Secondary: 0.0234}}
	s := &Summary{R: r, P: &solver.Project{}}
	for _, row := range s.rows() {
		if row.ID == "sum-residual" {
			if !strings.Contains(row.Label, "day 700") || row.Exact != "0.1234" {
				t.Errorf("row %+v", row)
			}
			return
		}
	}
	t.Error("no row for the settlement after handover")
}
