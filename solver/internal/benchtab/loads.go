package main

import (
	"os"
	"path/filepath"
	"time"

	"porelight/solver"
)

// loadCost holds section 7: what loads with geometry add to a solve. The
// embankment example (testdata/embankment.json: two embankment lifts off
// the centre line, fill that settles below the water table) is solved as
// it is (submerged), with the water table far below (dry: the same
// stress spread, no fill ever submerged) and with each lift as the same
// pressure over the whole top (uniform). The consolidation is linear
// (mv), so the water table changes nothing else.
type loadCost struct {
	submerged, dry, uniform timing
}

// measureLoads times both solves of the example under root.
func measureLoads(root string) (*loadCost, error) {
	data, err := os.ReadFile(filepath.Join(root, "testdata", "embankment.json"))
	if err != nil {
		return nil, err
	}
	p, err := solver.Decode(data)
	if err != nil {
		return nil, err
	}
	dry := *p
	dry.WaterTable = 100
	flat := *p
	flat.Loads = make([]solver.Load, len(p.Loads))
	for i, l := range p.Loads {
		flat.Loads[i] = solver.Load{Start: l.Start, Ramp: l.Ramp, Q: l.Pressure()}
	}
	solve := func(q *solver.Project) func() {
		return func() {
			if _, err := solver.Solve(q, nil); err != nil {
				panic(err) // the example is valid: a failure is a bug
			}
		}
	}
	var c loadCost
	// Interleaved, so that a busy spell on a shared machine hits both.
	for range 3 {
		c.submerged = c.submerged.merge(measure(batch(10, solve(p)), 3, 20, 300*time.Millisecond).each(10))
		c.dry = c.dry.merge(measure(batch(10, solve(&dry)), 3, 20, 300*time.Millisecond).each(10))
		c.uniform = c.uniform.merge(measure(batch(10, solve(&flat)), 3, 20, 300*time.Millisecond).each(10))
	}
	return &c, nil
}

// spread is the dry solve over the uniform one: the share of the stress
// spread. submergence is the submerged solve over the dry one.
func (c *loadCost) spread() float64      { return float64(c.dry.best) / float64(c.uniform.best) }
func (c *loadCost) submergence() float64 { return float64(c.submerged.best) / float64(c.dry.best) }
