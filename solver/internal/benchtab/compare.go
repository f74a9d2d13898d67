package main

import (
	"fmt"
	"math"
	"slices"
	"time"

	"porelight/solver"
	"porelight/solver/internal/series"
)

// approach is one way of computing the reference column's history, found
// at its cheapest settings that meet the accuracy target and timed.
type approach struct {
	name     string
	settings string // the settings found by the search
	nodes    int
	steps    int
	facts    int // factorisations (0 where none)
	acc      errs
	time     timing
	// again times a few more runs, to spread the timing of the headline
	// rows over the run (a shared machine's load comes and goes).
	again func() timing
}

// comparison holds section 2 of the table.
type comparison struct {
	colNodes                    int // the nodes of the fixed column
	porelight, ftcs, dense, ser approach
	// On the coarsest mesh each approach needs (mesh searched too).
	freeP, freeF, freeD approach
	searched            int // settings tried in all the searches
}

// compare runs section 2: each approach on the colNodes-node column at
// its cheapest passing settings, then each on the mesh of its own choice.
func compare(colNodes int, logf func(string, ...any)) comparison {
	var c comparison
	c.colNodes = colNodes

	// Porelight: search the first step and the growth of the steps.
	pp, n := searchPorelight(colNodes - 1)
	c.searched += n
	if pp == nil {
		panic(fmt.Sprintf("benchtab: no stepping searched meets the target on %d nodes", colNodes))
	}
	c.porelight = timePorelight(pp, 2*time.Second)
	logf("porelight %d nodes: %s, %v", colNodes, c.porelight.settings, c.porelight.time.best)

	// (a) FTCS at its stability limit: nothing to search on a given mesh.
	c.ftcs = timeFTCS(colNodes)
	logf("ftcs %d nodes: %d steps, %v", colNodes, c.ftcs.steps, c.ftcs.time.best)

	// (b) dense θ-method: search the step plan.
	c.dense, n = searchDense(colNodes)
	c.searched += n
	logf("dense %d nodes: %s, %v", colNodes, c.dense.settings, c.dense.time.best)

	// (c) the series, for the same outputs as Porelight's run.
	c.ser = timeSeries(colNodes, pp)
	logf("series: %v", c.ser.time.best)

	// Time the headline rows again in rounds, so that a busy spell of a
	// shared machine does not fall on one approach only.
	for range 3 {
		for _, a := range []*approach{&c.porelight, &c.ftcs, &c.dense, &c.ser} {
			if a.again != nil {
				a.time = a.time.merge(a.again())
			}
		}
	}
	logf("after rounds: porelight %v, ftcs %v, dense %v, series %v", c.porelight.time.best, c.ftcs.time.best, c.dense.time.best, c.ser.time.best)

	// The same with the mesh free: the cheapest passing mesh of each.
	meshes := []int{11, 16, 21, 26, 31, 41, 51, 61, 81, 101, 151, 201, 301, 401}
	if colNodes > meshes[len(meshes)-1] {
		meshes = append(meshes, colNodes)
	}
	best := approach{}
	for _, nodes := range meshes {
		if nodes > 101 {
			// The fewest steps no longer fall with the mesh here, so a
			// finer mesh only costs more.
			break
		}
		p, k := searchPorelight(nodes - 1)
		c.searched += k
		if p == nil {
			continue
		}
		a := timePorelight(p, 300*time.Millisecond)
		if best.name == "" || a.time.best < best.time.best {
			best = a
		}
	}
	c.freeP = best
	logf("porelight free: %s, %v", c.freeP.settings, c.freeP.time.best)
	for _, nodes := range meshes {
		c.searched++
		if ftcs(nodes, true).check().ok() {
			c.freeF = timeFTCS(nodes)
			break
		}
	}
	logf("ftcs free: %d nodes, %v", c.freeF.nodes, c.freeF.time.best)
	best = approach{}
	for _, nodes := range meshes {
		if nodes > 101 {
			break
		}
		a, k := searchDense(nodes)
		c.searched += k
		if a.name != "" && (best.name == "" || a.time.best < best.time.best) {
			best = a
		}
	}
	c.freeD = best
	logf("dense free: %s, %v", c.freeD.settings, c.freeD.time.best)
	return c
}

// porelightSteppings are the settings searched for Porelight: the first
// step (as a time factor) and the growth of the steps; θ and the damped
// start keep their defaults.
func porelightSteppings() (firsts, growths []float64) {
	firsts = []float64{1e-7, 1e-6, 1e-5, 1e-4, 1e-3}
	for g := 1.05; g < 1.61; g += 0.025 {
		growths = append(growths, math.Round(g*1000)/1000)
	}
	return firsts, growths
}

// searchPorelight finds the stepping with the fewest steps that meets the
// target with the given number of linear elements, or nil; it also
// returns the number of settings tried.
func searchPorelight(elements int) (*solver.Project, int) {
	firsts, growths := porelightSteppings()
	var best *solver.Project
	bestSteps, tried := math.MaxInt, 0
	for _, f := range firsts {
		for _, g := range growths {
			p := project(solver.MeshSettings{MaxSize: colH / float64(elements), MinPerLayer: 1},
				solver.Stepping{FirstStep: days(f), Growth: g, EndTime: days(tvHi)})
			tried++
			r, err := solver.Solve(p, nil)
			if err != nil {
				panic(err)
			}
			if porelightErrs(r).ok() && r.Stats.Steps < bestSteps {
				best, bestSteps = p, r.Stats.Steps
			}
		}
	}
	return best, tried
}

// timePorelight checks and times one Porelight solve of p, spending
// about budget on the timing.
func timePorelight(p *solver.Project, budget time.Duration) approach {
	r, err := solver.Solve(p, nil)
	if err != nil {
		panic(err)
	}
	a := approach{
		name:  "Porelight",
		nodes: r.Stats.Nodes, steps: r.Stats.Steps, facts: r.Stats.Factorizations,
		acc: porelightErrs(r),
		settings: fmt.Sprintf("%d linear el., first step Tv %.0e, growth %g, %d steps",
			r.Stats.Elements, timeFactor(p.Stepping.FirstStep), p.Stepping.Growth, r.Stats.Steps),
	}
	k := 1 + int(2e7/float64(a.nodes*a.steps+20000)) // batches of ~10 ms
	f := batch(k, func() {
		if _, err := solver.Solve(p, nil); err != nil {
			panic(err)
		}
	})
	a.time = measure(f, 5, 40, budget).each(k)
	a.again = func() timing { return measureCold(f, 3, 20, budget/4).each(k) }
	return a
}

// timeFTCS checks (with U compared after every step) and times the
// explicit scheme on n nodes.
func timeFTCS(n int) approach {
	h := ftcs(n, true)
	a := approach{name: "FTCS", nodes: n, steps: h.steps, acc: h.check(),
		settings: fmt.Sprintf("%d nodes, Δt = h²/(2cv), %s steps", n, count(h.steps))}
	k := 1 + int(2e7/float64(n*h.steps+20000))
	f := batch(k, func() { ftcs(n, false) })
	a.time = measure(f, 3, 20, 3*time.Second).each(k)
	a.again = func() timing { return measureCold(f, 1, 5, 500*time.Millisecond).each(k) }
	return a
}

// densePlans are the step plans searched for the dense baseline: uniform
// steps that divide the isochrone times, steps growing at every step, and
// steps held for a run of steps and then multiplied (few distinct steps,
// so few factorisations), each with a backward Euler start.
func densePlans() []plan {
	var ps []plan
	for _, k := range []int{1, 2, 4, 5, 8, 10, 20, 25, 40, 50, 100} {
		for _, d := range []int{0, 2, 4} {
			ps = append(ps, plan{first: 0.005 / float64(k), growth: 1, run: 1, damped: d})
		}
	}
	for _, f := range []float64{1e-6, 1e-5, 1e-4} {
		for _, g := range []float64{1.1, 1.15, 1.2, 1.25, 1.3} {
			ps = append(ps, plan{first: f, growth: g, run: 1, damped: 4})
		}
	}
	for _, f := range []float64{1e-6, 1e-5, 1e-4, 1e-3} {
		for _, r := range []int{2, 3, 4, 6, 8, 12, 16, 24, 32} {
			for _, g := range []float64{1.5, 2, 3, 4} {
				for _, d := range []int{2, 4} {
					ps = append(ps, plan{first: f, growth: g, run: r, damped: d})
				}
			}
		}
	}
	return ps
}

// searchDense finds the cheapest plan for the dense baseline on n nodes.
// The accuracy of every plan is found with the same scheme solved by a
// tridiagonal factorisation (same arithmetic, O(n) per step); the cost of
// the dense solve is estimated from its measured factorisation and step
// times; the three cheapest passing plans are then run densely, checked
// and timed, and the fastest is kept.
func searchDense(n int) (approach, int) {
	tf, ts := calibrateDense(n)
	type cand struct {
		p     plan
		steps []stepSpec
		est   float64
	}
	var cs []cand
	ps := densePlans()
	for _, p := range ps {
		s := p.steps()
		if len(s) > 200_000 {
			continue
		}
		if !implicit(n, s, newTri).check().ok() {
			continue
		}
		cs = append(cs, cand{p, s, float64(distinct(s))*tf + float64(len(s))*ts})
	}
	if len(cs) == 0 {
		return approach{}, len(ps)
	}
	slices.SortFunc(cs, func(a, b cand) int {
		switch {
		case a.est < b.est:
			return -1
		case a.est > b.est:
			return 1
		}
		return 0
	})
	var best approach
	for _, c := range cs[:min(3, len(cs))] {
		h := implicit(n, c.steps, newDense)
		a := approach{name: "dense θ-method", nodes: n, steps: h.steps, facts: h.facts, acc: h.check(),
			settings: fmt.Sprintf("%d nodes, %s, %d steps, %d Cholesky factorisations", n, c.p, h.steps, h.facts)}
		if !a.acc.ok() {
			continue
		}
		steps := c.steps
		f := func() { implicit(n, steps, newDense) }
		a.time = measure(f, 3, 15, 1500*time.Millisecond)
		a.again = func() timing { return measureCold(f, 3, 15, 400*time.Millisecond) }
		if best.name == "" || a.time.best < best.time.best {
			best = a
		}
	}
	return best, len(ps)
}

func (p plan) String() string {
	switch {
	case p.growth == 1:
		return fmt.Sprintf("uniform Δt = Tv %.3g, %d backward Euler steps first", p.first, p.damped)
	case p.run == 1:
		return fmt.Sprintf("first Δt = Tv %.0e growing ×%g per step, %d backward Euler first", p.first, p.growth, p.damped)
	}
	return fmt.Sprintf("first Δt = Tv %.0e, ×%g every %d steps, %d backward Euler first", p.first, p.growth, p.run, p.damped)
}

// calibrateDense measures one dense factorisation and one dense step
// (right-hand side and solve) on n nodes, in ns.
func calibrateDense(n int) (fact, step float64) {
	s := []stepSpec{{0.5, 1e-3}}
	k := 1 + int(1e7/float64(n*n*n/3+1000))
	t := measure(batch(k, func() { implicit(n, s, newDense) }), 3, 10, 300*time.Millisecond)
	fact = per(t.best, k)
	s = slices.Repeat(s, 200)
	k = 1 + int(1e7/float64(200*n*n+1000))
	t = measure(batch(k, func() { implicit(n, s, newDense) }), 3, 10, 300*time.Millisecond)
	step = (per(t.best, k) - fact) / 200
	return fact, math.Max(step, 0)
}

// timeSeries times evaluating Terzaghi's series for the outputs of the
// Porelight run p: U at each of its step times and the isochrones at isoTv
// on the nodes of an n-node column.
func timeSeries(n int, p *solver.Project) approach {
	r, err := solver.Solve(p, nil)
	if err != nil {
		panic(err)
	}
	ts := slices.Clone(r.Consolidation.Series.Time)
	u := make([]float64, n)
	run := func() {
		for _, t := range ts {
			u[0] = series.TerzaghiU(timeFactor(t))
		}
		for _, tv := range isoTv {
			for i := range u {
				u[i] = series.TerzaghiExcess(float64(i)/float64(n-1), tv)
			}
		}
	}
	k := 20
	f := batch(k, run)
	return approach{
		name: "Terzaghi series", nodes: n, steps: len(ts),
		settings: fmt.Sprintf("U at %d times, %d isochrones × %d depths", len(ts), len(isoTv), n),
		acc:      errs{checked: 1, isos: len(isoTv)},
		time:     measure(f, 5, 40, time.Second).each(k),
		again:    func() timing { return measureCold(f, 3, 40, 250*time.Millisecond).each(k) },
	}
}
