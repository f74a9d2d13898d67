package ui

import (
	"github.com/vugu/vugu"

	"porelight/ui/form"
)

// Field is one input of the project: it shows the text typed (or the
// value), its unit, and the problem with it, if any. Its element id is
// form.IDOf(Path); the problem's is that plus "-err".
type Field struct {
	F    *form.Form // the form the value lives in
	Path string     // field path, e.g. "layers[2].k"
	// Label names the value for screen readers and tooltips; Unit is
	// shown beside the input unless Bare (a table states it in the
	// column head instead). Hint is an optional tooltip.
	Label string
	Unit  string
	Hint  string
	Bare  bool
	Wide  bool
	// Changed is called after every edit, valid or not.
	Changed func()
}

func (c *Field) id() string      { return form.IDOf(c.Path) }
func (c *Field) errID() string   { return form.IDOf(c.Path) + "-err" }
func (c *Field) problem() string { return c.F.Problem(c.Path) }
func (c *Field) showUnit() bool  { return c.Unit != "" && !c.Bare }

// unit is the unit the input shows its value in: Unit, or its US
// customary counterpart when the page shows those (form.Form.UnitOf).
func (c *Field) unit() string { return c.F.UnitOf(c.Path, c.Unit) }

func (c *Field) class() string {
	s := "pl-field"
	if c.Wide {
		s += " pl-wide"
	}
	if form.IsText(c.Path) {
		s += " pl-textfield"
	}
	if c.problem() != "" {
		s += " pl-bad"
	}
	return s
}

func (c *Field) inputMode() string {
	if form.IsText(c.Path) {
		return "text"
	}
	return "decimal"
}

func (c *Field) placeholder() any {
	if h, ok := c.F.Placeholder(c.Path); ok {
		return h
	}
	return nil
}

// used is what an empty input stands for, printed in its place (the
// data-used attribute, shown by the print style sheet); nil when the
// input holds a value.
func (c *Field) used() any {
	if s := c.F.Used(c.Path); s != "" {
		return s
	}
	return nil
}

func (c *Field) ariaLabel() string {
	if u := c.unit(); u != "" && u != "–" {
		return c.Label + " (" + u + ")"
	}
	return c.Label
}

func (c *Field) invalid() any {
	if c.problem() != "" {
		return "true"
	}
	return nil
}

func (c *Field) describedBy() any {
	if c.problem() != "" {
		return c.errID()
	}
	return nil
}

func (c *Field) onInput(e vugu.DOMEvent) {
	c.F.Edit(c.Path, e.PropString("target", "value"))
	if c.Changed != nil {
		c.Changed()
	}
}
