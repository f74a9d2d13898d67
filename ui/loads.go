package ui

import (
	"fmt"
	"strings"

	"porelight/solver"
	"porelight/ui/form"
)

// Loads edits the surcharge stages.
type Loads struct {
	F       *form.Form
	Changed func()
}

// loadPath is the path of a value of stage i: loadPath(0, "q") is
// "loads[0].q".
func loadPath(i int, leaf string) string { return solver.JoinPath(solver.IndexPath("loads", i), leaf) }

func (c *Loads) add()         { c.F.AddLoad(); c.Changed() }
func (c *Loads) remove(i int) { c.F.RemoveLoad(i); c.Changed() }

// total is the surcharge once stages 1…i+1 are fully applied.
func (c *Loads) total(i int) string {
	q := 0.0
	for _, l := range c.F.Draft().Loads[:i+1] {
		q += l.Q
	}
	return sig(q, 4)
}

// profiled names the stages whose pressure varies with depth (set in a
// project file; the table edits only q).
func (c *Loads) profiled() string {
	var ns []string
	for i, l := range c.F.Draft().Loads {
		if len(l.Profile) > 0 {
			ns = append(ns, fmt.Sprint(i+1))
		}
	}
	if len(ns) == 0 {
		return ""
	}
	return "Stage " + strings.Join(ns, ", ") + ": q varies with depth (a profile from the project file, kept as is)."
}
