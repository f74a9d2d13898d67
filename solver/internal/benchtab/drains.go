package main

import (
	"time"

	"porelight/solver"
)

// drainElements is the size of the drains row: linear elements over
// scaleSteps uniform steps.
const drainElements = 10_000

// drainCost holds the drains row of section 1: the same column solved
// without drains, with drains (the sink, no reference solve), and with
// drains as the page solves it (with the solves with vertical and with
// radial flow alone that give Uv and Uh).
type drainCost struct {
	nodes, steps          int
	without, with, onPage timing
}

// drainProject is scaleProject with band drains 100 × 4 mm on a 1.5 m
// triangular grid through the whole column, smear ds/dw = 3, kh/ks = 3,
// qw = 3·10⁻⁶ m³/s (well resistance) and kh/kv = 2.
func drainProject(elements, steps int) *solver.Project {
	p := scaleProject(elements, 1, steps)
	p.Layers[0].KhKv = 2
	p.Drains = &solver.Drains{Pattern: "triangular", Spacing: 1.5, Width: 0.1, Thickness: 0.004,
		SmearRatio: 3, SmearK: 3, Qw: 3e-6}
	return p
}

// measureDrains runs the drains row.
func measureDrains(logf func(string, ...any)) drainCost {
	d := drainCost{steps: scaleSteps}
	plain := scaleProject(drainElements, 1, scaleSteps)
	drained := drainProject(drainElements, scaleSteps)
	skip := &solver.Options{NoDrainReference: true}
	r := solveOnce(drained, drainElements, scaleSteps)
	d.nodes = r.Stats.Nodes
	run := func(p *solver.Project, opt *solver.Options) func() {
		return func() {
			if _, err := solver.Solve(p, opt); err != nil {
				panic(err)
			}
		}
	}
	d.without = measure(run(plain, nil), 5, 40, 1500*time.Millisecond)
	d.with = measure(run(drained, skip), 5, 40, 1500*time.Millisecond)
	d.onPage = measure(run(drained, nil), 5, 40, 1500*time.Millisecond)
	logf("drains, %d linear elements × %d steps: %v without, %v with the sink, %v with the reference solve",
		drainElements, scaleSteps, d.without.best, d.with.best, d.onPage.best)
	return d
}

// ratio is the cost per node-step with drains over without.
func (d drainCost) ratio() float64 { return float64(d.with.best) / float64(d.without.best) }
