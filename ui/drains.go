package ui

import (
	"fmt"
	"strconv"
	"strings"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/ui/form"
	"porelight/ui/plot"
	"porelight/ui/units"
)

// Drains edits the vertical drains: the pattern, the drain, the smear zone
// and well resistance, the depth range, each layer's horizontal flow, and
// the design question; it draws the pattern in plan and runs the design
// helper through Root (drains_root.go).
type Drains struct {
	F       *form.Form
	Changed func()
	// D is the design helper's state; Run starts it, Use takes a spacing.
	D   *designState
	Run func()
	Use func(spacing float64)
}

// drainPath is the path of a field of the drains.
func drainPath(name string) string { return solver.JoinPath("drains", name) }

// layerField is the path of a field of layer i.
func layerField(i int, name string) string {
	return solver.JoinPath(solver.IndexPath("layers", i), name)
}

func (c *Drains) d() *solver.Drains { return c.F.Draft().Drains }
func (c *Drains) on() bool          { return c.d() != nil }
func (c *Drains) band() bool        { return c.on() && c.d().Diameter == 0 }

func (c *Drains) toggle(e vugu.DOMEvent) {
	c.F.SetDrains(e.PropBool("target", "checked"))
	c.Changed()
}

// pick sets a text field of the drains from a select.
func (c *Drains) pick(name string, e vugu.DOMEvent) {
	c.F.Edit(drainPath(name), e.PropString("target", "value"))
	c.Changed()
}

func (c *Drains) setSize(e vugu.DOMEvent) {
	c.F.SetDrainSize(e.PropString("target", "value") == "band")
	c.Changed()
}

// tip is the select's value: "depth" or the layer index.
func (c *Drains) tip() string {
	if t := c.d().ToLayer; t != nil {
		return strconv.Itoa(*t)
	}
	return "depth"
}

func (c *Drains) setTip(e vugu.DOMEvent) {
	v := e.PropString("target", "value")
	i, err := strconv.Atoi(v)
	if err != nil {
		i = -1
	}
	c.F.SetDrainTip(i)
	c.Changed()
}

func (c *Drains) layerName(i int) string {
	l := c.F.Draft().Layers[i]
	if strings.TrimSpace(l.Name) != "" {
		return fmt.Sprintf("%d. %s", i+1, l.Name)
	}
	return fmt.Sprintf("Layer %d", i+1)
}

func (c *Drains) toggleDesign(e vugu.DOMEvent) {
	c.F.SetDrainDesign(e.PropBool("target", "checked"))
	c.Changed()
}

// dwText writes a drain diameter in m: mm in SI, in in US units.
func dwText(m float64) string { return qty(units.Settlement, 1000*m, 3) }

// cell describes the unit cell of a valid draft.
func (c *Drains) cell() string {
	if !c.on() || !c.F.Valid() {
		return "The unit cell shows once the inputs are valid."
	}
	dc := solver.ResolveDrains(c.F.Draft())
	s := fmt.Sprintf("Unit cell De = %s, drain dw = %s", qty(units.Length, dc.De, 4), dwText(dc.Dw))
	if dc.Equivalent != "" {
		s += " (" + equivalentText(dc.Equivalent) + ")"
	}
	s += fmt.Sprintf(", n = De/dw = %s; μ without well resistance %s", sig(dc.N, 3), sig(dc.Mu0, 4))
	if dc.SmearRatio == 1 || dc.SmearK == 1 {
		s += " (Barron's F(n): no smear)"
	}
	return s + fmt.Sprintf("; drains from %s m to %s m.", sig(dc.Top, 4), sig(dc.Tip, 4))
}

func equivalentText(e string) string {
	if e == "mean" {
		return "(a+b)/2, Rixner et al. 1986"
	}
	return "2(a+b)/π, Hansbo 1979"
}

// plan is the to-scale plan of the pattern.
func (c *Drains) plan() *plot.Figure { return plot.DrainPlanFigure(c.F.Draft(), 380, 300) }

// problems are the drain problems no single input shows.
func (c *Drains) problems() []string {
	var out []string
	for _, p := range c.F.Other() {
		if strings.HasPrefix(p.Path, "drains") {
			out = append(out, capital(form.Label(p.Path))+": "+p.Message)
		}
	}
	return out
}

func (c *Drains) designOn() bool { return c.on() && c.d().Design != nil }

func (c *Drains) designStatus() string {
	if c.D == nil {
		return ""
	}
	switch {
	case c.D.busy:
		return fmt.Sprintf("Searching… %.0f %%", 100*c.D.progress)
	case c.D.err != "":
		return c.D.err
	case c.D.res != nil:
		a := c.D.res
		return fmt.Sprintf("Spacing %s (De = %s) reaches U = %s %% by %s, from %d solves.",
			qty(units.Length, a.Spacing, 3), qty(units.Length, a.De, 3), sig(100*a.U, 3), duration(a.Time), a.Solves)
	}
	return ""
}

func (c *Drains) rows() []solver.SpacingRow {
	if c.D == nil || c.D.res == nil || c.D.busy {
		return nil
	}
	return c.D.res.Table
}

func (c *Drains) rowTime(r solver.SpacingRow) string {
	if r.TimeToDegree == nil {
		return "not reached"
	}
	return duration(*r.TimeToDegree)
}

func (c *Drains) useFound() {
	if c.D != nil && c.D.res != nil && c.Use != nil {
		c.Use(c.D.res.Spacing)
	}
}

// drainField is one numeric input of the drains editor.
type drainField struct{ Path, Span, Label, Unit, Hint string }

// fields are the drains' numeric inputs, those of the drain's kind and
// of the tip's choice only.
func (c *Drains) fields() []drainField {
	fs := []drainField{{Path: "drains.spacing", Span: "Spacing s", Label: "Drain spacing", Unit: "m"}}
	if c.band() {
		fs = append(fs, drainField{Path: "drains.width", Span: "Width a", Label: "Band drain width", Unit: "m"},
			drainField{Path: "drains.thickness", Span: "Thickness b", Label: "Band drain thickness", Unit: "m"})
	} else {
		fs = append(fs, drainField{Path: "drains.diameter", Span: "Diameter dw", Label: "Drain diameter", Unit: "m"})
	}
	fs = append(fs,
		drainField{Path: "drains.smearRatio", Span: "Smear ds/dw", Label: "Smear zone diameter over drain diameter", Unit: "–",
			Hint: "Diameter of the zone disturbed by the mandrel over the drain diameter; 1: no smear"},
		drainField{Path: "drains.smearK", Span: "kh/ks", Label: "Undisturbed over smeared horizontal permeability", Unit: "–"},
		drainField{Path: "drains.qw", Span: "Discharge capacity qw", Label: "Drain discharge capacity", Unit: "m³/yr",
			Hint: "Flow the drain carries under unit gradient; empty: no well resistance"},
		drainField{Path: "drains.top", Span: "From depth", Label: "Depth where the drains start", Unit: "m"})
	if c.tip() == "depth" {
		fs = append(fs, drainField{Path: "drains.depth", Span: "Tip depth", Label: "Depth of the drains tip", Unit: "m"})
	}
	return fs
}

// designFields are the inputs of the design question.
func (c *Drains) designFields() []drainField {
	return []drainField{
		{Path: "drains.design.degree", Span: "Degree U", Label: "Target degree of consolidation", Unit: "%"},
		{Path: "drains.design.time", Span: "by day", Label: "Time by which the degree is reached", Unit: "day"},
	}
}

// drainSelect is one choice of the drains editor, and drainOption one of
// its options.
type drainSelect struct {
	ID, Span string
	Options  []drainOption
}

type drainOption struct {
	Value, Text string
	Selected    bool
}

// selects are the drains' choices: pattern, kind of drain, a band's
// equivalent diameter, the discharge and the tip.
func (c *Drains) selects() []drainSelect {
	d := c.d()
	opt := func(v, text string, on bool) drainOption { return drainOption{v, text, on} }
	out := []drainSelect{
		{"drains-pattern", "Pattern", []drainOption{
			opt("triangular", "triangular (De = 1.05 s)", d.Pattern == "triangular"),
			opt("square", "square (De = 1.128 s)", d.Pattern == "square")}},
		{"drains-size", "Drain", []drainOption{
			opt("band", "band a × b", c.band()), opt("round", "round, diameter", !c.band())}},
	}
	if c.band() {
		out = append(out, drainSelect{"drains-equivalent", "Equivalent dw", []drainOption{
			opt("perimeter", "2(a+b)/π (Hansbo 1979)", d.Equivalent != "mean"),
			opt("mean", "(a+b)/2 (Rixner et al. 1986)", d.Equivalent == "mean")}})
	}
	out = append(out, drainSelect{"drains-discharge", "Discharge at", []drainOption{
		opt("top", "top", d.Discharge == "" || d.Discharge == "top"),
		opt("base", "base", d.Discharge == "base"), opt("both", "top and base", d.Discharge == "both")}})
	tip := drainSelect{ID: "drains-tip", Span: "Down to", Options: []drainOption{opt("depth", "a depth", c.tip() == "depth")}}
	for i := range c.F.Draft().Layers {
		v := strconv.Itoa(i)
		tip.Options = append(tip.Options, opt(v, "base of "+c.layerName(i), c.tip() == v))
	}
	return append(out, tip)
}

// choose takes the choice made in select id.
func (c *Drains) choose(id string, e vugu.DOMEvent) {
	switch id {
	case "drains-size":
		c.setSize(e)
	case "drains-tip":
		c.setTip(e)
	default:
		c.pick(strings.TrimPrefix(id, "drains-"), e)
	}
}
