package ui

import (
	"porelight/solver"
	"porelight/ui/form"
)

// DepthTable edits a depth profile of the project (a stage's Δσ/q
// profile, the initial excess) as a table of depth and value.
type DepthTable struct {
	F    *form.Form
	List string // the profile's path: "loads[1].profile", "initialExcess"
	What string // the profile in words, for labels: "the initial excess"
	Head string // the value column's heading, e.g. "Δu"
	Unit string // the value's unit, e.g. "kPa"
	Note string // a line above the table, or ""
	// Changed is called after every edit.
	Changed func()
}

// points are the profile's points as the draft has them.
func (c *DepthTable) points() []solver.DepthValue {
	d := c.F.Draft()
	if c.List == "initialExcess" {
		return d.InitialExcess
	}
	st, err := solver.ParsePath(c.List)
	if err != nil || len(st) != 2 || st[0].Name != "loads" || st[1].Name != "profile" || st[0].Index >= len(d.Loads) {
		return nil
	}
	return d.Loads[st[0].Index].Profile
}

func (c *DepthTable) add()         { c.F.AddPoint(c.List); c.Changed() }
func (c *DepthTable) remove(k int) { c.F.RemovePoint(c.List, k); c.Changed() }
