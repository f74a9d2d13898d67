package ui

import (
	"strings"

	"github.com/vugu/vugu"

	"porelight/solver"
)

// Ground edits the water table and the condition at each end.
type Ground struct {
	F       *Form
	Changed func()
}

func (c *Ground) b(end string) *solver.Boundary { return boundary(c.F.Draft(), end) }

func endTitle(end string) string {
	if end == "bottom" {
		return "Base of the column"
	}
	return "Top of the column"
}

func (c *Ground) setDrained(end string, e vugu.DOMEvent) {
	c.F.SetBool(end+".drained", e.PropString("target", "value") == "drained")
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
			out = append(out, p.Path+": "+p.Message)
		}
	}
	return out
}

func (c *Ground) drainage(end string) string {
	if c.b(end).Drained {
		return "drained"
	}
	return "undrained"
}
