package ui

import (
	"strconv"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/solver/soil"
	"porelight/ui/form"
	"porelight/ui/units"
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
// from the draft when mv is given, else from the last results. It is
// shown only from valid inputs: while k, mv, γw or the layer's e–log
// parameters need attention, the draft may still hold an older value, and
// a figure beside the faulty input would be stale.
func (c *Layers) cv(i int) string {
	if c.F.Problem(lp(i, "k")) != "" || c.F.Problem(lp(i, "mv")) != "" || c.F.Problem("gammaW") != "" ||
		len(c.F.ProblemsUnder(lp(i, "ecurve"))) > 0 {
		return "–"
	}
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
	return "Column height " + qty(units.Length, solver.ColumnHeight(c.F.Draft()), 4)
}

// model is the consolidation model of the draft ("linear" when none is
// named).
func (c *Layers) model() string {
	if m := c.F.Draft().Model; m != "" {
		return m
	}
	return solver.ModelLinear
}

// setModel applies the model chosen in the select.
func (c *Layers) setModel(e vugu.DOMEvent) {
	v := e.PropString("target", "value")
	if v == solver.ModelLinear {
		v = "" // the default, as files without the field read
	}
	c.F.Edit("model", v)
	c.Changed()
}

// modelNote says what the chosen model does with the table below.
func (c *Layers) modelNote() string {
	if c.model() == solver.ModelNonlinear {
		return "mv, k and cv change with each element’s effective stress and void ratio; layers without e–log parameters keep their mv and k."
	}
	return "The e–log σ′ settlement is read off this solution; its times may differ from the curve’s on soft clay."
}

// sigmaPTable is layer i's σ′p against depth (nil: none).
func (c *Layers) sigmaPTable(i int) []solver.DepthValue {
	if ec := c.F.Draft().Layers[i].ECurve; ec != nil {
		return ec.SigmaPProfile
	}
	return nil
}

// sigmaPPath is the path of a value of point j of layer i's σ′p table.
func sigmaPPath(i, j int, leaf string) string {
	return solver.JoinPath(solver.IndexPath(lp(i, "ecurve.sigmaPProfile"), j), leaf)
}

func (c *Layers) addSigmaP(i int)       { c.F.AddSigmaPPoint(i); c.Changed() }
func (c *Layers) removeSigmaP(i, j int) { c.F.RemoveSigmaPPoint(i, j); c.Changed() }

func (c *Layers) setOutlet(i int, e vugu.DOMEvent) {
	c.F.SetOutlet(i, e.PropBool("target", "checked"))
	c.Changed()
}
