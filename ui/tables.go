package ui

import (
	"fmt"

	"porelight/solver"
	"porelight/ui/units"
)

// Tables shows the results layer by layer, folded: the tables are built
// only while Open (folds.go).
type Tables struct {
	R      *solver.Result
	Export func(what string) // asks the root to download a table
	Open   bool
	Toggle func()
}

// hint says in one line what the folded tables hold.
func (c *Tables) hint() string {
	parts := []string{"steady seepage (gradients, heave factors, cv)"}
	if len(c.R.Steady.Uplift) > 0 {
		parts = append(parts, "uplift")
	}
	if len(c.R.Checks) > 0 {
		parts = append(parts, "heave and uplift through time")
	}
	if c.hasSettlement() {
		parts = append(parts, "settlement")
	}
	n := len(c.R.Steady.Layers)
	layers := fmt.Sprintf("%d layers", n)
	if n == 1 {
		layers = "the layer"
	}
	s := "Tables for " + layers + ": " + parts[0]
	for i, part := range parts[1:] {
		if i == len(parts)-2 {
			s += " and " + part
		} else {
			s += ", " + part
		}
	}
	return s
}

func (c *Tables) toggleLabel() string {
	if c.Open {
		return "hide"
	}
	return "show"
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
	return setl(*v)
}

// setl writes a settlement in m as the figure of a table column in mm
// (or in in US units), to three significant figures.
func setl(m float64) string { return sig(conv(units.Settlement, m*1000), 3) }

// len4 writes a depth or length in m in the unit shown, to four
// significant figures.
func len4(m float64) string { return sig(conv(units.Length, m), 4) }

// kpa4 writes a stress in kPa in the unit shown, to four significant
// figures.
func kpa4(x float64) string { return sig(conv(units.Stress, x), 4) }

// cvShown writes a cv in m²/day in its unit shown: m²/day in SI (as the
// solver reports it), ft²/yr in US units; cvSym names it.
func cvShown(v float64) string {
	if shown == units.SI {
		return sig(v, 3)
	}
	return sig(conv(units.Consolidation, v*solver.DaysPerYear), 3)
}

func cvSym() string {
	if shown == units.SI {
		return "m²/day"
	}
	return sym(units.Consolidation)
}

func optCv(v *float64) string {
	if v == nil {
		return "–"
	}
	return cvShown(*v)
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

// modelHead heads the column of each layer's settlement under the model
// the summary names.
func (c *Tables) modelHead() string {
	if c.R.Summary.Model == solver.ModelNonlinear {
		return "Non-linear model (" + sym(units.Settlement) + ")"
	}
	return "Linear model (" + sym(units.Settlement) + ")"
}

// stageCount is the number of per-stage columns of the checks table.
func (c *Tables) stageCount() int {
	if len(c.R.Checks) == 0 {
		return 0
	}
	return len(c.R.Checks[0].Stages)
}

func checkName(kind string) string {
	switch kind {
	case solver.CheckHeave:
		return "heave, ic/i"
	case solver.CheckPrism:
		return "uplift, whole overburden"
	}
	return "uplift, layer alone"
}

// checkDepth is where a check acts: the layer's top for heave (the
// excavation's floor in a layer it cuts), its base for uplift.
func checkDepth(k solver.Check) float64 {
	if k.Kind == solver.CheckHeave {
		return k.Top
	}
	return k.Base
}

func factorText(f float64) string {
	if f >= solver.FactorCap {
		return "≥ 100"
	}
	return sig(f, 3)
}

func leastWhen(k solver.Check) string {
	switch {
	case k.Least >= solver.FactorCap:
		return "–"
	case k.LeastTime == nil:
		return "long term"
	case *k.LeastTime == 0:
		return "initially"
	}
	return duration(*k.LeastTime)
}
