package main

import (
	"fmt"
	"time"

	"porelight/solver"
)

// nonlinearCost is section 6: the non-linear model against the linear one
// on the same column.
type nonlinearCost struct {
	nodes, steps   int
	iterations     int
	linear, nonlin timing
}

// nlColumn is a 10 m normally consolidated clay under a 100 kPa preload,
// drained at both ends, with 2,000 linear elements (quick: 200) over the
// default steps, on the given model (k from the void ratio with
// Ck = 0.5 e0 on the non-linear model; mv derived from the curve on the
// linear one).
func nlColumn(model string, elements int) *solver.Project {
	return &solver.Project{
		Format: solver.Format, Model: model,
		Layers: []solver.Layer{{Thickness: 10, GammaSat: 16, K: 1e-9,
			ECurve: &solver.ECurve{E0: 1.8, Cc: 0.6, Cr: 0.06, Ck: 0.9}}},
		Top: solver.Boundary{Drained: true}, Bottom: solver.Boundary{Drained: true},
		Loads: []solver.Load{{Start: 0, Q: 100}},
		Mesh:  solver.MeshSettings{MaxSize: 10 / float64(elements), MinPerLayer: 1},
	}
}

// measureNonlinear times both models on nlColumn, best of several runs.
func measureNonlinear(elements int, logf func(string, ...any)) nonlinearCost {
	var c nonlinearCost
	for _, model := range []string{solver.ModelLinear, solver.ModelNonlinear} {
		p := nlColumn(model, elements)
		var r *solver.Result
		t := measure(func() {
			var err error
			if r, err = solver.Solve(p, nil); err != nil {
				panic(err)
			}
		}, 5, 50, 3*time.Second)
		if model == solver.ModelLinear {
			c.linear = t
		} else {
			c.nonlin, c.iterations = t, r.Stats.Iterations
		}
		c.nodes, c.steps = r.Stats.Nodes, r.Stats.Steps
	}
	work := c.nodes * c.steps
	logf("non-linear: %s per node-step (%s/solve) against the linear %s (%s/solve): %.2f× the linear cost, %.2f iterations per step",
		dur(per(c.nonlin.best, work)), dur(float64(c.nonlin.best)), dur(per(c.linear.best, work)), dur(float64(c.linear.best)), c.ratio(), c.perStep())
	return c
}

func (c nonlinearCost) ratio() float64   { return float64(c.nonlin.best) / float64(c.linear.best) }
func (c nonlinearCost) perStep() float64 { return float64(c.iterations) / float64(c.steps) }

// rows adds section 6 to the summary.
func (c nonlinearCost) rows(t *table) {
	work := c.nodes * c.steps
	t.add("6 non-linear", fmt.Sprintf("soft clay, %s nodes × %s steps: time per node-step, non-linear vs linear model", count(int64(c.nodes)), count(int64(c.steps))),
		fmt.Sprintf("%s (%s/solve)", dur(per(c.nonlin.best, work)), dur(float64(c.nonlin.best))),
		fmt.Sprintf("linear %s (%s/solve)", dur(per(c.linear.best, work)), dur(float64(c.linear.best))),
		fmt.Sprintf("%.2f×", c.ratio()), "≤ 3× the linear model", holds(c.ratio() <= 3))
	t.add("6 non-linear", fmt.Sprintf("iterations per step (tolerance %g of the load)", solver.NonlinearTolerance),
		fix(c.perStep(), 2), "", "", "report only", "—")
}
