package ui

import (
	"fmt"
	"strconv"
	"strings"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/ui/form"
	"porelight/ui/plot"
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

func (c *Drains) value(name, def string) string {
	if s := c.F.Text(drainPath(name)); s != "" {
		return s
	}
	return def
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

// cell describes the unit cell of a valid draft.
func (c *Drains) cell() string {
	if !c.on() || !c.F.Valid() {
		return "The unit cell shows once the inputs are valid."
	}
	dc := solver.ResolveDrains(c.F.Draft())
	s := fmt.Sprintf("Unit cell De = %s m, drain dw = %s mm", sig(dc.De, 4), sig(dc.Dw*1000, 3))
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
			out = append(out, p.Path+": "+p.Message)
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
		return fmt.Sprintf("Spacing %s m (De = %s m) reaches U = %s %% by %s, from %d solves.",
			sig(a.Spacing, 3), sig(a.De, 3), sig(100*a.U, 3), duration(a.Time), a.Solves)
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
