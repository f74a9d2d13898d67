package ui

import (
	"strings"

	"github.com/vugu/vugu"

	"porelight/ui/form"
)

// Outputs edits what is reported, and (folded) the mesh and time stepping.
type Outputs struct {
	F       *form.Form
	Changed func()

	expanded bool
}

func (c *Outputs) order() string {
	if c.F.Draft().Mesh.Order == 2 {
		return "2"
	}
	return "1"
}

func (c *Outputs) setOrder(e vugu.DOMEvent) {
	c.F.Edit("mesh.order", e.PropString("target", "value"))
	c.Changed()
}

// open keeps the advanced settings unfolded while one of them is wrong,
// so the problem is seen.
func (c *Outputs) open() bool {
	for _, p := range []string{"mesh.", "stepping."} {
		for _, leaf := range []string{"order", "maxSize", "minPerLayer", "theta", "dampedSteps", "firstStep", "growth", "endTime"} {
			if c.F.Problem(p+leaf) != "" {
				return true
			}
		}
	}
	for _, pr := range c.F.Other() {
		if strings.HasPrefix(pr.Path, "mesh.") || strings.HasPrefix(pr.Path, "stepping.") {
			return true
		}
	}
	return false
}

// toggled follows the fold as the user opens and closes it; every render
// sets the open attribute from this.
func (c *Outputs) toggled(e vugu.DOMEvent) {
	c.expanded = e.PropBool("target", "open")
}
