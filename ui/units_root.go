package ui

import (
	"github.com/vugu/vugu"

	"porelight/ui/plot"
	"porelight/ui/units"
)

// UnitsKey is the browser storage key of the unit system chosen. It is a
// choice of the person at the page, not of the project: the file stays
// SI, and a project opened from a colleague shows in the reader's units.
const UnitsKey = "porelight.units"

// loadUnits shows the units chosen last in this browser, SI when none.
func (c *Root) loadUnits() {
	s := units.SI
	if key, ok, err := c.host().Recall(UnitsKey); err == nil && ok {
		if got, ok := units.Parse(key); ok {
			s = got
		}
	}
	c.useUnits(s)
}

// useUnits makes the inputs, the results, the plots, the exports and the
// printout show s. Nothing in the project changes; text typed that is
// not a number stays as typed.
func (c *Root) useUnits(s units.System) {
	shown = s
	plot.SetUnits(s)
	if c.form != nil {
		c.form.SetUnits(s)
	}
}

func (c *Root) unitsKey() string { return shown.String() }

func (c *Root) setUnits(e vugu.DOMEvent) {
	s, ok := units.Parse(e.PropString("target", "value"))
	if !ok {
		return
	}
	c.useUnits(s)
	_ = c.host().Store(UnitsKey, s.String()) // where storage is refused, the choice lasts until the page closes
}
