package monitor

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/optimize"
)

// newtonCase is a problem for both searches: f, its gradient and
// Hessian, and when to stop.
type newtonCase struct {
	name   string
	x0     []float64
	f      func(x []float64) float64
	g      func(g, x []float64)
	h      func(h *mat.SymDense, x []float64)
	majors int
	// stop after so many evaluations: with a status (limit) or an error
	// (fail); 0: never.
	limit, fail int
	failFirst   bool // the status fails before the search
	// converged at a major iteration (nil: never).
	converged func(x []float64) bool
	// status is the end the case is for (gonum's status too).
	status string
}

// rosenbrock is Rosenbrock's function with its exact Hessian, which is
// indefinite away from the valley (so Newton adds τI).
func rosenbrock() (func([]float64) float64, func(g, x []float64), func(*mat.SymDense, []float64)) {
	f := func(x []float64) float64 { return 100*fitSq(x[1]-x[0]*x[0]) + fitSq(1-x[0]) }
	g := func(g, x []float64) {
		g[0] = -400*x[0]*(x[1]-x[0]*x[0]) - 2*(1-x[0])
		g[1] = 200 * (x[1] - x[0]*x[0])
	}
	h := func(h *mat.SymDense, x []float64) {
		h.SetSym(0, 0, 1200*x[0]*x[0]-400*x[1]+2)
		h.SetSym(0, 1, -400*x[0])
		h.SetSym(1, 1, 200)
	}
	return f, g, h
}

// expFit is a least squares fit of y = a·exp(−b·t) + c to fixed data with
// the Gauss–Newton Hessian JᵀJ, as BackFit gives it.
func expFit() (func([]float64) float64, func(g, x []float64), func(*mat.SymDense, []float64)) {
	ts := []float64{0, 1, 2, 3, 5, 8, 13, 21}
	ys := []float64{3.1, 2.2, 1.7, 1.3, 1.05, 0.93, 0.9, 0.88}
	res := func(x []float64) ([]float64, *mat.Dense) {
		r := make([]float64, len(ts))
		j := mat.NewDense(len(ts), 3, nil)
		for i, t := range ts {
			e := math.Exp(-x[1] * t)
			r[i] = x[0]*e + x[2] - ys[i]
			j.Set(i, 0, e)
			j.Set(i, 1, -x[0]*t*e)
			j.Set(i, 2, 1)
		}
		return r, j
	}
	f := func(x []float64) float64 {
		r, _ := res(x)
		s := 0.0
		for _, v := range r {
			s += v * v
		}
		return s / 2
	}
	g := func(g, x []float64) {
		r, j := res(x)
		mat.NewVecDense(3, g).MulVec(j.T(), mat.NewVecDense(len(r), r))
	}
	h := func(h *mat.SymDense, x []float64) {
		_, j := res(x)
		h.SymOuterK(1, j.T())
	}
	return f, g, h
}

func newtonCases() []newtonCase {
	rf, rg, rh := rosenbrock()
	ef, eg, eh := expFit()
	quad := func(x []float64) float64 { return fitSq(x[0]-1) + 3*fitSq(x[1]+2) }
	quadG := func(g, x []float64) { g[0], g[1] = 2*(x[0]-1), 6*(x[1]+2) }
	quadH := func(h *mat.SymDense, x []float64) { h.SetSym(0, 0, 2); h.SetSym(1, 1, 6); h.SetSym(0, 1, 0) }
	small := func(x []float64) bool { return math.Abs(x[0]-1) < 1e-3 }
	return []newtonCase{
		{name: "Rosenbrock, τI modifications", status: statusGradient, x0: []float64{-1.2, 1}, f: rf, g: rg, h: rh, majors: 100},
		{name: "Rosenbrock, iteration limit", status: statusIterations, x0: []float64{-1.2, 1}, f: rf, g: rg, h: rh, majors: 5},
		{name: "Rosenbrock, evaluation limit", status: statusEvaluationLimit, x0: []float64{-1.2, 1}, f: rf, g: rg, h: rh, majors: 100, limit: 9},
		{name: "Rosenbrock, a failing run", status: statusFailure, x0: []float64{-1.2, 1}, f: rf, g: rg, h: rh, majors: 100, fail: 7},
		{name: "Rosenbrock, a status failing at once", status: "", x0: []float64{-1.2, 1}, f: rf, g: rg, h: rh, failFirst: true},
		{name: "Gauss–Newton fit", status: statusStep, x0: []float64{1, 1, 0}, f: ef, g: eg, h: eh, majors: 100,
			converged: func(x []float64) bool { return math.Abs(x[1]-0.5255) < 1e-3 }},
		{name: "Gauss–Newton fit to the end: x stops moving", status: statusFailure, x0: []float64{1, 1, 0}, f: ef, g: eg, h: eh, majors: 100},
		{name: "quadratic, converged", status: statusStep, x0: []float64{0, 0}, f: quad, g: quadG, h: quadH, majors: 100, converged: small},
		{name: "quadratic from its minimum", status: statusFailure, x0: []float64{1, -2}, f: quad, g: quadG, h: quadH, majors: 100},
		{name: "infinite start", status: statusFailure, x0: []float64{0, 0}, f: func([]float64) float64 { return math.Inf(1) }, g: quadG, h: quadH, majors: 100},
		{name: "NaN start", status: statusFailure, x0: []float64{0, 0}, f: func([]float64) float64 { return math.NaN() }, g: quadG, h: quadH, majors: 100},
		{name: "NaN gradient", status: statusFailure, x0: []float64{0, 0}, f: quad, g: func(g, x []float64) { g[0], g[1] = 1, math.NaN() }, h: quadH, majors: 100},
		{name: "infinite gradient", status: statusFailure, x0: []float64{0, 0}, f: quad, g: func(g, x []float64) { g[0], g[1] = math.Inf(-1), 1 }, h: quadH, majors: 100},
		// A gradient of the wrong sign: no step decreases f, the line
		// search halves the step until x stops moving.
		{name: "a lying gradient", status: statusFailure, x0: []float64{0, 0}, f: quad, g: func(g, x []float64) { quadG(g, x); g[0], g[1] = -g[0], -g[1] }, h: quadH, majors: 100},
		{name: "unbounded below", status: statusNegInf, x0: []float64{0, 0}, f: func(x []float64) float64 {
			if x[0] != 0 {
				return math.Inf(-1)
			}
			return 0
		}, g: func(g, x []float64) { g[0], g[1] = -1, 0 }, h: quadH, majors: 100},
		{name: "a negative definite Hessian", status: statusIterations, x0: []float64{0.5, 0}, f: quad, g: quadG,
			h: func(h *mat.SymDense, x []float64) { h.SetSym(0, 0, -2); h.SetSym(1, 1, -6); h.SetSym(0, 1, 0) }, majors: 100},
	}
}

// trace records the calls of a search: which function, at which x.
type trace []string

func (tr *trace) add(kind string, x []float64) {
	s := kind
	for _, v := range x {
		s += fmt.Sprintf(" %x", math.Float64bits(v))
	}
	*tr = append(*tr, s)
}

// TestNewtonAsGonum runs newtonMinimize and gonum's optimize.Minimize
// with optimize.Newton{Linesearcher: &optimize.Backtracking{}} (v0.17.0,
// the reference) on the same problems: the same calls at the same x to
// the bit, the same result, status and error text.
func TestNewtonAsGonum(t *testing.T) {
	errRun := errors.New("the run failed")
	for _, tc := range newtonCases() {
		t.Run(tc.name, func(t *testing.T) {
			// Each search gets its own counters and trace.
			setup := func(tr *trace) (f func([]float64) float64, g func(g, x []float64), h func(*mat.SymDense, []float64), status func() (int, error)) {
				n := 0
				f = func(x []float64) float64 { n++; tr.add("f", x); return tc.f(x) }
				g = func(grad, x []float64) { n++; tr.add("g", x); tc.g(grad, x) }
				h = func(m *mat.SymDense, x []float64) { n++; tr.add("h", x); tc.h(m, x) }
				status = func() (int, error) {
					switch {
					case tc.failFirst || tc.fail > 0 && n >= tc.fail:
						return 2, errRun
					case tc.limit > 0 && n >= tc.limit:
						return 1, nil
					}
					return 0, nil
				}
				return
			}
			var want trace
			wf, wg, wh, ws := setup(&want)
			prob := optimize.Problem{Func: wf, Grad: wg, Hess: wh, Status: func() (optimize.Status, error) {
				switch s, err := ws(); s {
				case 1:
					return optimize.FunctionEvaluationLimit, err
				case 2:
					return optimize.Failure, err
				}
				return optimize.NotTerminated, nil
			}}
			settings := &optimize.Settings{MajorIterations: tc.majors, Converger: testConverger{tc.converged, &want}}
			wres, werr := optimize.Minimize(prob, append([]float64(nil), tc.x0...), settings, &optimize.Newton{Linesearcher: &optimize.Backtracking{}})

			var got trace
			gf, gg, gh, gs := setup(&got)
			conv := func(x []float64) bool {
				got.add("converged?", x)
				return tc.converged != nil && tc.converged(x)
			}
			gres, gerr := newtonMinimize(newtonProblem{fn: gf, grad: gg, hess: gh, majors: tc.majors, converged: conv,
				status: func() (string, error) {
					switch s, err := gs(); s {
					case 1:
						return statusEvaluationLimit, err
					case 2:
						return statusFailure, err
					}
					return "", nil
				}}, tc.x0)

			if fmt.Sprint(gerr) != fmt.Sprint(werr) {
				t.Errorf("error %v, gonum's %v", gerr, werr)
			}
			if (gres == nil) != (wres == nil) {
				t.Fatalf("result %v, gonum's %v", gres, wres)
			}
			if gres != nil {
				if gres.Status != wres.Status.String() {
					t.Errorf("status %s, gonum's %s", gres.Status, wres.Status)
				}
				var gx, wx trace
				gx.add("x", gres.X)
				wx.add("x", wres.X)
				if gx[0] != wx[0] {
					t.Errorf("result %v, gonum's %v", gres.X, wres.X)
				}
			}
			if len(got) != len(want) {
				t.Errorf("%d calls, gonum %d", len(got), len(want))
			}
			for i := range min(len(got), len(want)) {
				if got[i] != want[i] {
					t.Errorf("call %d: %s, gonum %s", i, got[i], want[i])
					break
				}
			}
			if gres != nil && gres.Status != tc.status {
				t.Errorf("status %s, want %s: the case does not reach the end it is for", gres.Status, tc.status)
			}
		})
	}
}

// testConverger is optimize's side of newtonCase.converged, traced.
type testConverger struct {
	converged func([]float64) bool
	tr        *trace
}

func (testConverger) Init(int) {}

func (c testConverger) Converged(loc *optimize.Location) optimize.Status {
	c.tr.add("converged?", loc.X)
	if c.converged != nil && c.converged(loc.X) {
		return optimize.StepConvergence
	}
	return optimize.NotTerminated
}
