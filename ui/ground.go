package ui

import (
	"strings"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/ui/form"
)

// Ground edits the water table and the condition at each end.
type Ground struct {
	F       *form.Form
	Changed func()
}

func (c *Ground) b(end string) *solver.Boundary { return form.Boundary(c.F.Draft(), end) }

// excessPath is the path of a value of point i of the pressure history
// at an end: excessPath("top", 1, "t") is "top.excess[1].t".
func excessPath(end string, i int, leaf string) string {
	return solver.JoinPath(solver.IndexPath(solver.JoinPath(end, "excess"), i), leaf)
}

func endTitle(end string) string {
	if end == "bottom" {
		return "Base of the column"
	}
	return "Top of the column"
}

func (c *Ground) setDrained(end string, e vugu.DOMEvent) {
	c.F.SetDrainage(end, e.PropString("target", "value"))
	c.Changed()
}

func (c *Ground) addExcess(end string)           { c.F.AddExcess(end); c.Changed() }
func (c *Ground) removeExcess(end string, i int) { c.F.RemoveExcess(end, i); c.Changed() }

// endProblems are the problems of the ends that no single input shows,
// such as an inflow with both ends undrained.
func (c *Ground) endProblems() []string {
	var out []string
	for _, p := range c.F.Other() {
		if strings.HasPrefix(p.Path, "top.") || strings.HasPrefix(p.Path, "bottom.") {
			out = append(out, capital(form.Label(p.Path))+": "+p.Message)
		}
	}
	return out
}

func (c *Ground) drainage(end string) string { return form.Drainage(c.b(end)) }
