package monitor

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/gonum/mat"
)

// The search of BackFit is a modified Newton method with a backtracking
// (Armijo) line search, the method of gonum's optimize.Minimize with
// optimize.Newton{Linesearcher: &optimize.Backtracking{}} and the
// settings BackFit gives it, written out here step for step (gonum
// v0.17.0): the package optimize, with every method it can pick, weighs
// about 40 kB of the gzipped page for this one search. The tests check
// that both take the same steps to the same bits (newton_test.go).
//
// The status and error texts are optimize's, as FitResult.Status shows.

// Statuses of a search (optimize.Status.String()).
const (
	statusGradient        = "GradientThreshold"
	statusStep            = "StepConvergence"
	statusNegInf          = "FunctionNegativeInfinity"
	statusFailure         = "Failure"
	statusIterations      = "IterationLimit"
	statusEvaluationLimit = "FunctionEvaluationLimit"
)

// Errors of a search (optimize.ErrLinesearcherFailure and so on).
var (
	errLinesearchFailure = errors.New("linesearch: failed to converge")
	errNonDescent        = errors.New("linesearch: non-descent search direction")
	errNoProgress        = errors.New("linesearch: no change in location after Linesearcher step")
)

// newtonProblem is the function to minimise with its gradient and
// Hessian (optimize.Problem), and the checks of the search.
type newtonProblem struct {
	fn   func(x []float64) float64
	grad func(grad, x []float64)
	hess func(h *mat.SymDense, x []float64)
	// status, checked after every evaluation, ends the search when it
	// returns a status or an error (optimize.Problem.Status; "" goes on).
	status func() (string, error)
	// converged, asked at every major iteration, ends the search with
	// statusStep (the optimize.Converger).
	converged func(x []float64) bool
	// majors is the most major iterations (optimize.Settings.MajorIterations).
	majors int
}

// newtonResult is the end of a search: the last major iteration's x
// (zeros before the first) and the status.
type newtonResult struct {
	X      []float64
	Status string
}

// Evaluations a step asks for (optimize.Operation).
const (
	evalFunc = 1 << iota
	evalGrad
	evalHess
	majorIteration
)

// Constants of optimize: Backtracking's defaults, Newton's.
const (
	backtrackContraction = 0.5
	backtrackDecrease    = 1e-4
	backtrackMinStep     = 1e-20
	newtonIncrease       = 5
	newtonModifications  = 20
	gradientTolerance    = 1e-12
)

// newtonMinimize minimises p.fn from x0. The result is nil, with the
// error, only when p.status fails before the search starts.
func newtonMinimize(p newtonProblem, x0 []float64) (*newtonResult, error) {
	if _, err := p.status(); err != nil {
		return nil, err
	}
	s := &newtonSearch{p: p, dim: len(x0), optX: make([]float64, len(x0))}
	s.x = append([]float64(nil), x0...)
	status, err := s.run()
	return &newtonResult{X: s.optX, Status: status}, err
}

// newtonSearch is the state of a search: the location (x, f, g, h), the
// last major iteration's x, Newton's Hessian modification and the line
// search along dir from lsX.
type newtonSearch struct {
	p      newtonProblem
	dim    int
	x      []float64
	f      float64
	g      []float64
	h      *mat.SymDense
	work   []float64 // the evaluations' copy of x
	optX   []float64
	majors int

	hess *mat.SymDense // H + τI
	chol mat.Cholesky
	tau  float64

	lsX, dir  []float64
	first     bool
	nextMajor bool
	eval      int     // the fields of the location that belong to x
	lastStep  float64 // the step from lsX to x
	lastOp    int
	step      float64 // the backtracking step, and its start
	initF     float64
	initG     float64
}

// run is optimize's localOptimizer.run with Minimize's checks between
// the steps.
func (s *newtonSearch) run() (string, error) {
	if done, status, err := s.evaluate(evalFunc | evalGrad | evalHess); done {
		return status, err
	}
	if math.IsInf(s.f, 1) || math.IsNaN(s.f) {
		return statusFailure, initialFuncError(s.f)
	}
	for i, v := range s.g {
		if math.IsInf(v, 0) || math.IsNaN(v) {
			return statusFailure, initialGradError(v, i)
		}
	}
	if done, status := s.major(); done {
		return status, nil
	}
	op, err := s.initLinesearch()
	for {
		if err != nil {
			return statusFailure, err
		}
		if op == majorIteration {
			if done, status := s.major(); done {
				return status, nil
			}
			if floats.Norm(s.g, math.Inf(1)) < gradientTolerance {
				return statusGradient, nil
			}
		} else if done, status, err := s.evaluate(op); done {
			return status, err
		}
		op, err = s.iterate()
	}
}

// evaluate computes what op asks for at x, then p.status.
func (s *newtonSearch) evaluate(op int) (done bool, status string, err error) {
	if s.work == nil {
		s.work = make([]float64, s.dim)
	}
	copy(s.work, s.x)
	if op&evalFunc != 0 {
		s.f = s.p.fn(s.work)
	}
	if op&evalGrad != 0 {
		if s.g == nil {
			s.g = make([]float64, s.dim)
		}
		s.p.grad(s.g, s.work)
	}
	if op&evalHess != 0 {
		if s.h == nil {
			s.h = mat.NewSymDense(s.dim, nil)
		}
		s.p.hess(s.h, s.work)
	}
	status, err = s.p.status()
	return err != nil || status != "", status, err
}

// major records a major iteration at x and checks the convergence and
// the iteration limit.
func (s *newtonSearch) major() (bool, string) {
	copy(s.optX, s.x)
	s.majors++
	switch {
	case math.IsInf(s.f, -1):
		return true, statusNegInf
	case s.p.converged(s.optX):
		return true, statusStep
	case s.p.majors > 0 && s.majors >= s.p.majors:
		return true, statusIterations
	}
	return false, ""
}

// initLinesearch starts the first line search (LinesearchMethod.Init).
func (s *newtonSearch) initLinesearch() (int, error) {
	s.lsX = make([]float64, s.dim)
	s.dir = make([]float64, s.dim)
	s.first = true
	s.nextMajor = false
	s.eval = evalFunc | evalGrad | evalHess
	s.lastStep = math.NaN()
	s.lastOp = 0
	return s.nextLinesearch()
}

// nextLinesearch takes the Newton direction at x and the first trial step
// (LinesearchMethod.initNextLinesearch, Backtracking.Init).
func (s *newtonSearch) nextLinesearch() (int, error) {
	copy(s.lsX, s.x)
	if s.first {
		s.first = false
		s.hess = mat.NewSymDense(s.dim, nil)
		s.tau = 0
	}
	step := s.direction()
	projGrad := floats.Dot(s.g, s.dir)
	if projGrad >= 0 {
		return s.fail(errNonDescent)
	}
	s.step, s.initF, s.initG = step, s.f, projGrad
	floats.AddScaledTo(s.x, s.lsX, step, s.dir)
	if floats.Equal(s.lsX, s.x) {
		return s.fail(errNoProgress)
	}
	s.lastStep = step
	s.eval = 0
	s.lastOp = evalFunc
	return s.lastOp, nil
}

// iterate is one step of the line search (LinesearchMethod.Iterate,
// Backtracking.Iterate).
func (s *newtonSearch) iterate() (int, error) {
	switch s.lastOp {
	case 0:
	case majorIteration:
		return s.nextLinesearch()
	default:
		s.eval |= s.lastOp
		if s.nextMajor {
			s.nextMajor = false
			s.lastOp = majorIteration
			return s.lastOp, nil
		}
	}
	f := math.NaN()
	if s.eval&evalFunc != 0 {
		f = s.f
	}
	if f <= s.initF+backtrackDecrease*s.step*s.initG { // Armijo
		s.lastOp = 0
		if s.eval&evalFunc == 0 {
			s.lastOp |= evalFunc
		}
		if s.g != nil && s.eval&evalGrad == 0 {
			s.lastOp |= evalGrad
		}
		if s.h != nil && s.eval&evalHess == 0 {
			s.lastOp |= evalHess
		}
		if s.lastOp == 0 {
			s.lastOp = majorIteration
		} else {
			s.nextMajor = true
		}
		return s.lastOp, nil
	}
	s.step *= backtrackContraction
	if s.step < backtrackMinStep {
		return s.fail(errLinesearchFailure)
	}
	if s.step != s.lastStep {
		floats.AddScaledTo(s.x, s.lsX, s.step, s.dir)
		if floats.Equal(s.lsX, s.x) {
			return s.fail(errNoProgress)
		}
		s.lastStep = s.step
		s.eval = 0
	}
	s.lastOp = evalFunc
	return s.lastOp, nil
}

func (s *newtonSearch) fail(err error) (int, error) {
	s.lastOp = 0
	return 0, err
}

// direction solves (H + τI) d = −g into dir, τ ≥ 0 the smallest of 0,
// 0.001·5^k (or the last τ) that makes the matrix positive definite
// (Nocedal & Wright 2006, Algorithm 3.3; Newton.NextDirection); −g after
// 20 tries. The first step is 1.
func (s *newtonSearch) direction() float64 {
	d := mat.NewVecDense(s.dim, s.dir)
	grad := mat.NewVecDense(s.dim, s.g)
	s.hess.CopySym(s.h)
	minA := s.hess.At(0, 0)
	for i := 1; i < s.dim; i++ {
		if a := s.hess.At(i, i); a < minA {
			minA = a
		}
	}
	if minA > 0 {
		s.tau = 0
	} else if s.tau == 0 {
		s.tau = -minA + 0.001
	}
	for range newtonModifications {
		if s.tau != 0 {
			for i := range s.dim {
				s.hess.SetSym(i, i, s.h.At(i, i)+s.tau)
			}
		}
		if s.chol.Factorize(s.hess) {
			if err := s.chol.SolveVecTo(d, grad); err == nil {
				d.ScaleVec(-1, d)
				return 1
			}
		}
		s.tau = math.Max(newtonIncrease*s.tau, 0.001)
	}
	d.ScaleVec(-1, grad)
	return 1
}

// initialFuncError is optimize.ErrFunc's text.
func initialFuncError(f float64) error {
	if math.IsNaN(f) {
		return errors.New("optimize: initial function value is NaN")
	}
	return errors.New("optimize: initial function value is infinite")
}

// initialGradError is optimize.ErrGrad's text.
func initialGradError(g float64, i int) error {
	if math.IsNaN(g) {
		return fmt.Errorf("optimize: initial gradient is NaN at position %d", i)
	}
	return fmt.Errorf("optimize: initial gradient is infinite at position %d", i)
}
