package ui

import (
	"strconv"

	"porelight/solver"
	"porelight/solver/soil"
	"porelight/ui/form"
)

// Layers edits the layer table and the e–log σ′ and creep parameters.
type Layers struct {
	F       *form.Form
	R       *solver.Result // the last results, for cv derived from an e–log curve
	Changed func()
}

// lp is the path of a value of layer i: lp(2, "ecurve.cc") is
// "layers[2].ecurve.cc".
func lp(i int, leaf string) string { return solver.JoinPath(solver.IndexPath("layers", i), leaf) }

func itoa(i int) string { return strconv.Itoa(i) }

func (c *Layers) add(i int)     { c.F.AddLayer(i); c.Changed() }
func (c *Layers) remove(i int)  { c.F.RemoveLayer(i); c.Changed() }
func (c *Layers) move(i, d int) { c.F.MoveLayer(i, d); c.Changed() }

// cv is the coefficient of consolidation (soil.Cv) of layer i in m²/day,
// from the draft when mv is given, else from the last results.
func (c *Layers) cv(i int) string {
	p := c.F.Draft()
	l := p.Layers[i]
	gw := solver.ResolveGammaW(p)
	if l.Mv > 0 && l.K > 0 && gw > 0 {
		return sig(soil.Cv(l.K, l.Mv, gw), 3)
	}
	if c.R != nil && i < len(c.R.Summary.Layers) && c.R.Summary.Layers[i].Cv > 0 {
		return sig(c.R.Summary.Layers[i].Cv, 3) + " (e–log)"
	}
	return "from e–log"
}

func (c *Layers) height() string {
	return "Column height " + sig(solver.ColumnHeight(c.F.Draft()), 4) + " m"
}
