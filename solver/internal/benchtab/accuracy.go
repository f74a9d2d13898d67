package main

import (
	"math"

	"porelight/solver"
)

// accRow is one run of the accuracy study.
type accRow struct {
	order, elements, steps int
	first, growth          float64 // first step (time factor) and growth; 0 means default
	err                    errs
	orderU, orderIso       float64 // observed order against the previous row (NaN for the first)
	isDefault              bool    // the row uses the solver's default for the varied setting
}

// accuracy holds section 3.
type accuracy struct {
	// byElements varies the mesh at fine time steps (first step Tv 1e-8,
	// growth fineGrowth), for linear and quadratic elements; bySteps
	// varies the growth of the steps (default first step) at a fine mesh
	// of fineElements linear elements.
	byElements, bySteps []accRow
	// defaults is the project with zero Mesh and Stepping (200 linear
	// elements, first step 1 minute, growth 1.1, 100 years simulated).
	defaults accRow
	// Fitted orders: U error against h for linear and quadratic
	// elements, and against the number of steps.
	spaceLinear, spaceQuad, timeOrder float64
}

const (
	fineGrowth   = 1.002
	fineElements = 2000
)

// The sizes of the accuracy study.
var (
	accElementsLinear = []int{25, 50, 100, 200, 400, 800}
	accElementsQuad   = []int{5, 10, 20, 40}
	accGrowths        = []float64{1.8, 1.4, 1.2, 1.1, 1.05, 1.025, 1.0125}
)

// measureAccuracy runs section 3 on the reference column.
func measureAccuracy() accuracy {
	var a accuracy
	run := func(m solver.MeshSettings, s solver.Stepping) (errs, *solver.Result) {
		r, err := solver.Solve(project(m, s), nil)
		if err != nil {
			panic(err)
		}
		return porelightErrs(r), r
	}
	for _, order := range []int{1, 2} {
		sizes := accElementsLinear
		if order == 2 {
			sizes = accElementsQuad
		}
		var rows []accRow
		for _, ne := range sizes {
			e, r := run(solver.MeshSettings{Order: order, MaxSize: colH / float64(ne), MinPerLayer: 1},
				solver.Stepping{FirstStep: days(1e-8), Growth: fineGrowth, EndTime: days(tvHi)})
			rows = append(rows, accRow{order: order, elements: ne, steps: r.Stats.Steps, first: 1e-8, growth: fineGrowth,
				err: e, isDefault: order == 1 && ne == 200})
		}
		observedOrders(rows, func(r accRow) float64 { return float64(r.elements) })
		fit := fitOrder(rows, func(r accRow) float64 { return float64(r.elements) })
		if order == 1 {
			a.spaceLinear = fit
		} else {
			a.spaceQuad = fit
		}
		a.byElements = append(a.byElements, rows...)
	}
	for _, g := range accGrowths {
		e, r := run(solver.MeshSettings{MaxSize: colH / fineElements, MinPerLayer: 1},
			solver.Stepping{Growth: g, EndTime: days(tvHi)})
		a.bySteps = append(a.bySteps, accRow{order: 1, elements: fineElements, steps: r.Stats.Steps, growth: g,
			err: e, isDefault: g == 1.1})
	}
	observedOrders(a.bySteps, func(r accRow) float64 { return float64(r.steps) })
	a.timeOrder = fitOrder(a.bySteps, func(r accRow) float64 { return float64(r.steps) })
	e, r := run(solver.MeshSettings{}, solver.Stepping{})
	a.defaults = accRow{order: r.Stats.Order, elements: r.Stats.Elements, steps: r.Stats.Steps, err: e, isDefault: true}
	return a
}

// observedOrders sets each row's observed orders from the previous row:
// log(e₀/e₁)/log(n₁/n₀) with n the elements or steps.
func observedOrders(rows []accRow, size func(accRow) float64) {
	for i := range rows {
		rows[i].orderU, rows[i].orderIso = math.NaN(), math.NaN()
		if i == 0 {
			continue
		}
		l := math.Log(size(rows[i]) / size(rows[i-1]))
		rows[i].orderU = math.Log(rows[i-1].err.U/rows[i].err.U) / l
		rows[i].orderIso = math.Log(rows[i-1].err.Iso/rows[i].err.Iso) / l
	}
}

// fitOrder is the least-squares slope of −log(U error) against log(size)
// over the rows, the observed order of convergence of U.
func fitOrder(rows []accRow, size func(accRow) float64) float64 {
	var sx, sy, sxx, sxy float64
	n := float64(len(rows))
	for _, r := range rows {
		x, y := math.Log(size(r)), -math.Log(r.err.U)
		sx, sy, sxx, sxy = sx+x, sy+y, sxx+x*x, sxy+x*y
	}
	return (n*sxy - sx*sy) / (n*sxx - sx*sx)
}
