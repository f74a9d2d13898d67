package main

import (
	"fmt"
	"math"
	"runtime"
	"testing"
	"time"

	"gonum.org/v1/gonum/blas"

	"porelight/solver"
)

// scaleSteps is the number of uniform time steps of the scaling runs.
const scaleSteps = 1000

// scaleRow is one solver size of section 1.
type scaleRow struct {
	order, elements, nodes, steps, facts int
	note                                 string // why the size differs from the one asked, if it does
	solve                                timing // one whole Solve
	floor                                timing // scaleSteps Dpttrs solves of the same size
	band                                 timing // scaleSteps Dpbtrs (kd = 2) solves, quadratic only
}

// nsPerNodeStep is the solve time per node and time step.
func (r scaleRow) nsPerNodeStep() float64 {
	return per(r.solve.best, r.nodes*r.steps)
}

// floorNs is the floor's time per node and solve.
func (r scaleRow) floorNs() float64 { return per(r.floor.best, r.nodes*scaleSteps) }

// ratio is the solve time over the floor's (both over scaleSteps steps).
func (r scaleRow) ratio() float64 { return float64(r.solve.best) / float64(r.floor.best) }

// scaling holds section 1.
type scaling struct {
	rows []scaleRow
	// Exponents of the solve time in the number of elements (1,000 to
	// 100,000) for each order and in the number of steps (1,000 to 4,000
	// at 1,000 linear elements).
	expLinear, expQuad, expSteps float64
	stepsA, stepsB               timing // the two runs of expSteps
	// Allocations and bytes per extra time step (1,000 linear elements,
	// 1,000 against 4,000 steps).
	allocsPerStep, bytesPerStep float64
	allocsA, allocsB            float64
	// drains is the cost of the drains' sink on the same kind of column.
	drains drainCost
}

// scaleProject is the column of the scaling runs: 100 m of one clay
// drained at both ends, the given number of elements of the given order,
// steps uniform time steps of 10 days after an instantaneous load, no
// output times.
func scaleProject(elements, order, steps int) *solver.Project {
	const h = 100.0
	return &solver.Project{
		Format: solver.Format,
		Layers: []solver.Layer{{Thickness: h, GammaSat: 18, K: 1e-9, Mv: 1e-3}},
		Top:    solver.Boundary{Drained: true}, Bottom: solver.Boundary{Drained: true},
		Loads:    []solver.Load{{Start: 0, Q: 100}},
		Mesh:     solver.MeshSettings{Order: order, MaxSize: h / float64(elements), MinPerLayer: 1},
		Stepping: solver.Stepping{FirstStep: 10, Growth: 1, EndTime: 10 * float64(steps), DampedSteps: -1},
	}
}

// solveOnce solves p and checks the mesh and step count.
func solveOnce(p *solver.Project, elements, steps int) *solver.Result {
	r, err := solver.Solve(p, nil)
	if err != nil {
		panic(err)
	}
	if r.Stats.Elements != elements || r.Stats.Steps != steps {
		panic(fmt.Sprintf("benchtab: %d elements and %d steps, want %d and %d", r.Stats.Elements, r.Stats.Steps, elements, steps))
	}
	return r
}

// measureScaling runs section 1. profile, when not nil, is started around
// the timed solves of the largest size and stopped after them.
func measureScaling(sizes []int, profile func(order int, start bool), logf func(string, ...any)) scaling {
	var s scaling
	for _, order := range []int{1, 2} {
		for _, ne := range sizes {
			row := scaleRow{order: order, elements: ne, steps: scaleSteps}
			// The per-solve limit of nodes × steps may refuse the
			// largest quadratic size; take the largest it accepts.
			if w := (order*ne + 1) * scaleSteps; w > solver.MaxWork {
				row.elements = (solver.MaxWork/scaleSteps - 1) / order
				row.note = fmt.Sprintf("%s quadratic elements (%s nodes) × %s steps exceed the per-solve limit solver.MaxWork = %s node-steps, "+
					"so Validate refuses them; measured at %s elements",
					count(int64(ne)), count(int64(order*ne+1)), count(scaleSteps), count(solver.MaxWork), count(int64(row.elements)))
			}
			p := scaleProject(row.elements, order, scaleSteps)
			r := solveOnce(p, row.elements, scaleSteps)
			row.nodes, row.facts = r.Stats.Nodes, r.Stats.Factorizations
			work := row.nodes * scaleSteps
			big := ne == sizes[len(sizes)-1]
			if big && profile != nil {
				profile(order, true)
			}
			f := func() { solveOnce(p, row.elements, scaleSteps) }
			switch {
			case work >= 50_000_000: // seconds each: measure twice
				row.solve = measureCold(f, 2, 2, 0)
			case work >= 5_000_000:
				row.solve = measure(f, 3, 10, time.Second)
			default:
				row.solve = measure(f, 5, 200, time.Second)
			}
			if big && profile != nil {
				profile(order, false)
			}
			row.floor = measure(floorSweep(row.nodes-2), 3, 20, 500*time.Millisecond)
			if order == 2 {
				row.band = measure(bandSweep(row.nodes-2), 3, 20, 500*time.Millisecond)
			}
			logf("scaling order %d, %d elements: %v per solve (median %v, %d runs), floor %v",
				order, row.elements, row.solve.best, row.solve.median, row.solve.runs, row.floor.best)
			s.rows = append(s.rows, row)
		}
	}
	exp := func(order int) float64 {
		var a, b scaleRow
		for _, r := range s.rows {
			if r.order != order {
				continue
			}
			if r.elements == 1000 {
				a = r
			}
			if r.elements >= 99_999 {
				b = r
			}
		}
		if a.nodes == 0 || b.nodes == 0 {
			return math.NaN()
		}
		return math.Log(float64(b.solve.best)/float64(a.solve.best)) / math.Log(float64(b.nodes-1)/float64(a.nodes-1))
	}
	s.expLinear, s.expQuad = exp(1), exp(2)

	// Steps: 1,000 linear elements, 1,000 and 4,000 steps.
	pa, pb := scaleProject(1000, 1, 1000), scaleProject(1000, 1, 4000)
	s.stepsA = measure(func() { solveOnce(pa, 1000, 1000) }, 5, 40, 1500*time.Millisecond)
	s.stepsB = measure(func() { solveOnce(pb, 1000, 4000) }, 5, 40, 1500*time.Millisecond)
	s.expSteps = math.Log(float64(s.stepsB.best)/float64(s.stepsA.best)) / math.Log(4)

	// Allocations: the difference between 4,000 and 1,000 steps on the
	// same mesh is what the time loop allocates.
	qa, qb := scaleProject(1000, 1, 1000), scaleProject(1000, 1, 4000)
	s.allocsA = testing.AllocsPerRun(3, func() { solveOnce(qa, 1000, 1000) })
	s.allocsB = testing.AllocsPerRun(3, func() { solveOnce(qb, 1000, 4000) })
	s.allocsPerStep = (s.allocsB - s.allocsA) / 3000
	s.bytesPerStep = (allocBytes(func() { solveOnce(qb, 1000, 4000) }) - allocBytes(func() { solveOnce(qa, 1000, 1000) })) / 3000
	s.drains = measureDrains(logf)
	logf("scaling exponents: elements %.3f (linear) %.3f (quadratic), steps %.3f; %.4f allocs/step",
		s.expLinear, s.expQuad, s.expSteps, s.allocsPerStep)
	return s
}

// allocBytes returns the bytes f allocates (the least of three runs).
func allocBytes(f func()) float64 {
	best := math.Inf(1)
	var a, b runtime.MemStats
	for range 3 {
		runtime.ReadMemStats(&a)
		f()
		runtime.ReadMemStats(&b)
		best = math.Min(best, float64(b.TotalAlloc-a.TotalAlloc))
	}
	return best
}

// floorSweep returns scaleSteps Dpttrs solves on a pre-factorised
// symmetric positive definite tridiagonal matrix of order n, the shape of
// M + θΔt·K scaled by M⁻¹ (diagonal 1 + 2s, off-diagonal −s): the least
// work one implicit step of linear elements can do. The right-hand side
// is solved in place again and again; the matrix's inverse has norm below
// one, so the values stay normal numbers.
func floorSweep(n int) func() {
	const s = 0.5
	d, e := make([]float64, n), make([]float64, n-1)
	for i := range d {
		d[i] = 1 + 2*s
	}
	for i := range e {
		e[i] = -s
	}
	if !lapack.Dpttrf(n, d, e) {
		panic("benchtab: floor matrix not positive definite")
	}
	b := make([]float64, n)
	for i := range b {
		b[i] = 1
	}
	return func() {
		for range scaleSteps {
			lapack.Dpttrs(n, 1, d, e, b, 1)
		}
	}
}

// bandSweep is floorSweep for a band of two super-diagonals (the shape of
// quadratic elements' M + θΔt·K), with Dpbtrf/Dpbtrs.
func bandSweep(n int) func() {
	const kd, ld = 2, 3
	ab := make([]float64, n*ld)
	for i := range n {
		ab[i*ld] = 1 + 2*(0.5+0.25) // eigenvalues ≥ 1 (Gershgorin)
		if i+1 < n {
			ab[i*ld+1] = -0.5
		}
		if i+2 < n {
			ab[i*ld+2] = -0.25
		}
	}
	if !lapack.Dpbtrf(blas.Upper, n, kd, ab, ld) {
		panic("benchtab: band floor matrix not positive definite")
	}
	b := make([]float64, n)
	for i := range b {
		b[i] = 1
	}
	return func() {
		for range scaleSteps {
			lapack.Dpbtrs(blas.Upper, n, kd, 1, ab, ld, b, 1)
		}
	}
}
