package ui

import (
	"fmt"

	"porelight/solver"
)

// Tables shows the results layer by layer.
type Tables struct {
	R      *solver.Result
	Export func(what string) // asks the root to download a table
}

func flowWord(l solver.SteadyLayer) string {
	switch {
	case l.Gradient == 0:
		return "none"
	case l.Upward:
		return "upward"
	}
	return "downward"
}

func optSig(v *float64, n int) string {
	if v == nil {
		return "–"
	}
	return sig(*v, n)
}

func optMM(v *float64) string {
	if v == nil {
		return "–"
	}
	return sig(*v*1000, 3)
}

func (c *Tables) layerName(i int) string {
	if i >= 0 && i < len(c.R.Steady.Layers) {
		return c.R.Steady.Layers[i].Name
	}
	return fmt.Sprint(i + 1)
}

func (c *Tables) hasSettlement() bool {
	for _, l := range c.R.Summary.Layers {
		if l.SettlementLinear != 0 || l.SettlementElog != nil {
			return true
		}
	}
	return false
}

func (c *Tables) stats() string {
	s := c.R.Stats
	t := fmt.Sprintf("Mesh: %d nodes, %d elements of order %d.", s.Nodes, s.Elements, s.Order)
	if s.Steps > 0 {
		t += fmt.Sprintf(" %d time steps, %d factorisations.", s.Steps, s.Factorizations)
	}
	return t
}
