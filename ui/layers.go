package ui

import (
	"fmt"
	"strconv"

	"porelight/solver"
)

// Layers edits the layer table and the e–log σ′ and creep parameters.
type Layers struct {
	F       *Form
	R       *solver.Result // the last results, for cv derived from an e–log curve
	Changed func()
}

func lp(i int, leaf string) string { return fmt.Sprintf("layers[%d].%s", i, leaf) }

func itoa(i int) string { return strconv.Itoa(i) }

func (c *Layers) add(i int)     { c.F.AddLayer(i); c.Changed() }
func (c *Layers) remove(i int)  { c.F.RemoveLayer(i); c.Changed() }
func (c *Layers) move(i, d int) { c.F.MoveLayer(i, d); c.Changed() }

// cv is the coefficient of consolidation k/(mv γw) of layer i in m²/day,
// from the draft when mv is given, else from the last results.
func (c *Layers) cv(i int) string {
	p := c.F.Draft()
	l := p.Layers[i]
	gw := p.GammaW
	if gw == 0 {
		gw = solver.DefaultGammaW
	}
	if l.Mv > 0 && l.K > 0 && gw > 0 {
		return sig(l.K/(l.Mv*gw)*86400, 3)
	}
	if c.R != nil && i < len(c.R.Summary.Layers) && c.R.Summary.Layers[i].Cv > 0 {
		return sig(c.R.Summary.Layers[i].Cv, 3) + " (e–log)"
	}
	return "from e–log"
}

func (c *Layers) height() string {
	h := 0.0
	for _, l := range c.F.Draft().Layers {
		h += l.Thickness
	}
	return "Column height " + sig(h, 4) + " m"
}
