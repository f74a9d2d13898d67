package ui

import (
	"strings"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/ui/form"
)

// Loads edits the load stages (a pressure or a fill, over the whole top,
// a finite area or a typed profile) and the initial excess profile, and
// sketches the loaded areas of the last solve. (The added stress with
// depth is a plot of Plots: each figure costs every render.)
type Loads struct {
	F       *form.Form
	P       *solver.Project // the project R belongs to
	R       *solver.Result  // the last result, or nil
	Changed func()
}

// loadPath is the path of a value of stage i: loadPath(0, "q") is
// "loads[0].q".
func loadPath(i int, leaf string) string { return solver.JoinPath(solver.IndexPath("loads", i), leaf) }

// profilePath is the path of stage i's profile.
func profilePath(i int) string { return loadPath(i, "profile") }

// pointPath is the path of a value of point k of the depth profile at
// list: pointPath("initialExcess", 2, "z") is "initialExcess[2].z".
func pointPath(list string, k int, leaf string) string {
	return solver.JoinPath(solver.IndexPath(list, k), leaf)
}

func (c *Loads) add()         { c.F.AddLoad(); c.Changed() }
func (c *Loads) remove(i int) { c.F.RemoveLoad(i); c.Changed() }

func (c *Loads) load(i int) solver.Load { return c.F.Draft().Loads[i] }
func (c *Loads) isFill(i int) bool      { return c.load(i).Fill != nil }
func (c *Loads) hasArea(i int) bool     { return c.load(i).Area != nil }
func (c *Loads) areaKind(i int) string  { return form.AreaKind(c.load(i)) }
func (c *Loads) hasDetail(i int) bool   { return c.isFill(i) || c.areaKind(i) != form.AreaWhole }

func (c *Loads) method(i int) string {
	if a := c.load(i).Area; a != nil {
		return a.Method
	}
	return ""
}

func (c *Loads) setKind(i int, e vugu.DOMEvent) {
	c.F.SetStageKind(i, e.PropString("target", "value"))
	c.Changed()
}

// kind is what stage i is (form.StageKind).
func (c *Loads) kind(i int) string { return form.StageKind(c.load(i)) }

// zone reports whether stage i digs or lowers the water table: it acts
// on the whole column and has no area.
func (c *Loads) zone(i int) bool {
	k := c.kind(i)
	return k == form.KindDig || k == form.KindLower
}

// hasDig reports whether a stage is an excavation.
func (c *Loads) hasDig() bool {
	for i := range c.F.Draft().Loads {
		if c.kind(i) == form.KindDig {
			return true
		}
	}
	return false
}

func (c *Loads) setArea(i int, e vugu.DOMEvent) {
	c.F.SetArea(i, e.PropString("target", "value"))
	c.Changed()
}

func (c *Loads) setMethod(i int, e vugu.DOMEvent) {
	c.F.Edit(loadPath(i, "area.method"), e.PropString("target", "value"))
	c.Changed()
}

// areaKind is one choice of a stage's loaded area.
type areaKind struct{ Value, Label string }

var areaKinds = []areaKind{
	{form.AreaWhole, "whole top"},
	{"strip", "strip"},
	{"rectangle", "rectangle"},
	{"circle", "circle"},
	{"embankment", "embankment"},
	{form.AreaProfile, "Δσ/q table"},
}

// areaSize is one size input of a loaded area.
type areaSize struct{ Name, Label, Unit, Hint string }

// sizes are the inputs under stage i, in order: a fill's unit weights,
// then the sizes its area takes and the column's offset. Name is the path
// inside the stage.
func (c *Loads) sizes(i int) []areaSize {
	var out []areaSize
	if c.isFill(i) {
		out = append(out, areaSize{"fill.gamma", "Fill γ", "kN/m³", "Unit weight above the water table"},
			areaSize{"fill.gammaSat", "γsat below water", "kN/m³", "Empty: the same as γ. Fill that settles below the water table weighs γsat − γw"})
	}
	x := areaSize{"area.x", "Column offset x", "m", "Horizontal distance of the column from the centre line of the area, across its width"}
	switch a := c.load(i).Area; {
	case a == nil:
	case a.Shape == "strip":
		out = append(out, areaSize{"area.width", "Width B", "m", ""}, x)
	case a.Shape == "rectangle":
		out = append(out, areaSize{"area.width", "Width B", "m", ""}, areaSize{"area.length", "Length L", "m", ""}, x,
			areaSize{"area.y", "Column offset y", "m", "Horizontal distance of the column from the centre of the area, along its length"})
	case a.Shape == "circle":
		out = append(out, areaSize{"area.radius", "Radius R", "m", "The column stands on the axis of the circle"})
	case a.Shape == "embankment":
		out = append(out, areaSize{"area.width", "Crest width", "m", "Width of the top of the embankment; 0 for a triangular section"},
			areaSize{"area.slope", "Side slope", "H per V", "Horizontal run per unit height of each side slope, e.g. 2 for 2H:1V"}, x)
	}
	return out
}

// areaProblems are the problems of stage i's area that no input of the
// row shows (a shape the page does not offer, read from a file).
func (c *Loads) areaProblems(i int) []string {
	var out []string
	at := loadPath(i, "area")
	for _, p := range c.F.Other() {
		if p.Path == at || strings.HasPrefix(p.Path, at+".") {
			out = append(out, capital(form.Label(p.Path))+": "+p.Message)
		}
	}
	return out
}

// total is the surface pressure once stages 1…i+1 are fully applied
// (a fill's γ × thickness, before submergence).
func (c *Loads) total(i int) string {
	q := 0.0
	for j := range c.F.Draft().Loads[:i+1] {
		q += solver.StagePressure(c.F.Draft(), j)
	}
	return sig(q, 4)
}

// sectionShown reports whether the last solved project has a stage with a
// loaded area to sketch.
func (c *Loads) sectionShown() bool {
	if c.P == nil {
		return false
	}
	for _, l := range c.P.Loads {
		if l.Area != nil {
			return true
		}
	}
	return false
}
