package ui

import (
	"fmt"
	"math"

	"porelight/solver"
	"porelight/ui/form"
	"porelight/ui/units"
)

// Status is the one-line state of the results: what is shown and why.
type Status struct {
	Kind string // "ok", "busy", "stale" or "error"; a CSS class suffix
	Text string
}

// Summary shows the headline figures of the last good results, and the
// caution that goes with them.
type Summary struct {
	R      *solver.Result  // nil before the first solve
	P      *solver.Project // the project R belongs to
	Status Status
	// Cancel stops the solve under way; nil hides the control.
	Cancel func()
}

type sumRow struct {
	ID, Label, Value, Exact, Note, Class string
}

func (c *Summary) class() string {
	if c.Status.Kind == "stale" || c.Status.Kind == "error" {
		return "pl-sec pl-summary pl-stale"
	}
	return "pl-sec pl-summary"
}

// rows lists the figures; missing ones say why they are missing.
func (c *Summary) rows() []sumRow {
	if c.R == nil {
		return []sumRow{{ID: "sum-none", Label: "Results", Value: "not yet computed"}}
	}
	s := c.R.Summary
	noLoad := c.P != nil && !solver.HasConsolidation(c.P)
	why := "not computed"
	switch {
	case noLoad:
		why = "no load"
	case c.R.Consolidation != nil:
		why = "not reached in the simulated time"
	}
	length := func(id, label string, v *float64, note string) sumRow {
		r := sumRow{ID: id, Label: label, Value: "–", Note: why}
		if v != nil {
			r.Value, r.Exact, r.Note = mm(*v), exact(*v), note
		}
		return r
	}
	time := func(id, label string, v *float64) sumRow {
		r := sumRow{ID: id, Label: label, Value: "–", Note: why}
		if v != nil {
			r.Value, r.Exact, r.Note = duration(*v), exact(*v), "after the start"
		}
		return r
	}
	// Without consolidation the result does not carry them: the project's.
	target, life := s.TargetDegree, s.DesignLife
	if target == 0 {
		target = solver.DefaultTargetDegree
		if c.P != nil {
			target = solver.ResolveTargetDegree(c.P)
		}
	}
	if life == 0 {
		life = solver.DefaultDesignLife
		if c.P != nil {
			life = solver.ResolveDesignLife(c.P)
		}
	}
	rows := []sumRow{
		length("sum-settlement-linear", "Final settlement, from mv", s.SettlementLinear, "primary, all stages"),
		length("sum-settlement-elog", "Final settlement, e–log σ′", s.SettlementElog, "primary, all stages"),
		time("sum-t50", "t50 (U = 50 %)", s.T50),
		time("sum-t90", "t90 (U = 90 %)", s.T90),
		time("sum-ttarget", fmt.Sprintf("Time to U = %s %%", sig(target*100, 3)), s.TTarget),
		length("sum-secondary", "Secondary settlement", s.Secondary, "at "+sig(life/solver.DaysPerYear, 3)+" yr design life"),
	}
	if s.SettlementElog == nil && !noLoad && c.R.Consolidation != nil {
		rows[1].Note = "needs e–log parameters for a layer"
	}
	if s.SettlementElog != nil && len(s.ElogFromMv) > 0 {
		rows[1].Note = "primary, all stages; with the mv settlement of " + layerNames(c.P, s.ElogFromMv) + " (no e–log parameters)"
	}
	if s.Model == solver.ModelNonlinear {
		// The headline figures come from the non-linear solution: the
		// e–log settlement, and the times on its curve.
		rows[0].Note = "for comparison only: the non-linear model is solved"
		rows[1].Label = "Final settlement, non-linear model"
		if s.Settlement != nil {
			rows[1].Value, rows[1].Exact = mm(*s.Settlement), exact(*s.Settlement)
		}
		for i := 2; i <= 4; i++ {
			rows[i].Label += ", non-linear model"
		}
	}
	if s.Secondary == nil && !noLoad && c.R.Consolidation != nil {
		rows[5].Note = "needs Cα (and e0) for a layer"
	}
	if res := c.R.Residual; res != nil {
		rows = append(rows, residualRow(c.P, res))
	}
	if s.Submerged != nil {
		rows = append(rows, length("sum-submerged", "Fill below the water table", s.Submerged, "at the end: it weighs γsat − γw there, and the settlement allows for it"))
	}
	heave := c.governing("sum-heave", "Least factor, heave (ic/i)", s.Heave, "no upward flow at any time")
	if s.Heave != nil && s.Heave.Factor < 1 {
		heave.Note = "below 1: the upward gradient exceeds the critical gradient; " + heave.Note
	}
	rows = append(rows,
		c.governing("sum-prism", "Least factor, uplift (σ/u, all above)", s.Prism, "no low-permeability layer over a more permeable one"),
		c.governing("sum-uplift", "Least factor, uplift (layer alone)", s.Uplift, "no low-permeability layer over a more permeable one"))
	dir := "downward"
	if s.Flux < 0 {
		dir = "upward"
	} else if s.Flux == 0 {
		dir = "no flow"
	}
	flux := sumRow{ID: "sum-flux", Label: "Steady flow (Darcy velocity)", Value: sci(conv(units.Permeability, math.Abs(s.Flux)), 3) + " " + sym(units.Permeability),
		Exact: exact(s.Flux), Note: dir}
	rows = append(rows, heave, flux)
	if d := c.R.Drains; d != nil {
		r := time("sum-t90-vertical", "t90 without drains", d.T90Vertical)
		if d.T90Vertical != nil {
			r.Note = "vertical flow only"
		}
		h := time("sum-t90-radial", "t90 by the drains alone", d.T90Radial)
		if d.T90Radial != nil {
			h.Note = "radial flow only, no vertical drainage"
		}
		rows = append(rows, r, h)
	}
	return rows
}

// governing is the row of the least factor of one check over time, with
// where and when it occurs; none says why there is no figure.
func (c *Summary) governing(id, label string, g *solver.Governing, none string) sumRow {
	r := sumRow{ID: id, Label: label, Value: "–", Note: none}
	if g == nil {
		return r
	}
	r.Value, r.Exact = sig(g.Factor, 3), exact(g.Factor)
	when := "in the long term (all drained)"
	switch {
	case g.Time != nil && *g.Time == 0:
		when = "initially"
	case g.Time != nil:
		when = "at " + duration(*g.Time)
	}
	where := fmt.Sprintf("layer %d", g.Layer+1)
	if c.P != nil && g.Layer < len(c.P.Layers) && c.P.Layers[g.Layer].Name != "" {
		where += " “" + c.P.Layers[g.Layer].Name + "”"
	}
	below := "down"
	if c.P != nil && hasDig(c.P) {
		below = "below the original top"
	}
	r.Note = fmt.Sprintf("least over time: %s, %s %s, %s", where, qty(units.Length, g.Depth, 3), below, when)
	if g.Factor < 1 {
		r.Class = "pl-alarm"
	}
	return r
}

// hasDig reports whether a stage of p is an excavation,
// so that depths are said to be from the original top.
func hasDig(p *solver.Project) bool {
	for _, l := range p.Loads {
		if l.Dig != nil {
			return true
		}
	}
	return false
}

// drainRows are U, Uv and Uh at the output times, with drains.
func (c *Summary) drainRows() []solver.DrainDegree {
	if c.R == nil || c.R.Drains == nil {
		return nil
	}
	return c.R.Drains.AtTimes
}

// warningText is a warning as the page lists it: the input it concerns
// named as the tables number it ("Layer 1, OCR"), as the problems are.
func warningText(w solver.Warning) string {
	if w.Path == "" {
		return w.Message
	}
	return capital(form.Label(w.Path)) + ": " + w.Message
}

// layerNames names the layers at the indices is ("layer 2 “sand”, …").
func layerNames(p *solver.Project, is []int) string {
	out := ""
	for k, i := range is {
		if k > 0 {
			out += ", "
		}
		out += fmt.Sprintf("layer %d", i+1)
		if p != nil && i < len(p.Layers) && p.Layers[i].Name != "" {
			out += " “" + p.Layers[i].Name + "”"
		}
	}
	return out
}
