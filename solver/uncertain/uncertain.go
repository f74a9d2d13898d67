// Package uncertain runs a Monte Carlo of a column over solver.Solve:
// each realisation scales every layer's k, compressibility and ch by
// lognormal factors drawn from Project.Uncertainty, is solved as an
// ordinary project, and is reduced to a Sample (settlement and degree of
// consolidation on a common time grid, t90, the settlement still to
// come after a date). Combine turns samples into P10/P50/P90 bands and
// quantiles; Sensitivity moves one input at a time to its P10 and P90.
//
// The spread is of the parameters only. The model (one-dimensional flow
// and compression, the layer boundaries, the loads) is taken as exact, so
// the bands do not cover model error, and k, mv and ch are perfectly
// correlated within a layer's depth (one factor per layer, no spatial
// variation inside it), which widens the bands against a model with
// many independent sub-layers.
//
// Reproducibility: realisation i draws its normals from
// rand.NewPCG(seed, i) (math/rand/v2), three per layer in the order k,
// mv, ch whether or not their COV is zero. So the same seed gives the
// same realisations however the runs are split among workers, and
// changing one COV leaves the other factors as they were.
package uncertain

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"sort"

	"porelight/solver"
)

// GridPoints is the number of times of the common grid of a Plan.
const GridPoints = 80

// z90 is the standard normal quantile at 0.9 (Φ⁻¹(0.9) = 1.2815516,
// tables of the normal distribution): an input's P10 and P90 are its
// median times exp(∓z90·σ_ln).
const z90 = 1.2815515655446004

// Plan is what every worker needs besides the project: the common time
// grid and the date of the remaining settlement. NewPlan makes it from a
// solve of the project as given, so that all workers use the same grid.
type Plan struct {
	Runs int       `json:"runs"`
	Seed int       `json:"seed"`
	Date float64   `json:"date"` // day
	Grid []float64 `json:"grid"` // day, increasing, log-spaced
}

// ErrNoSpread is returned when the project has no Uncertainty or no
// layer with a spread.
var ErrNoSpread = errors.New("uncertain: no layer has a coefficient of variation")

// ErrNoConsolidation is returned for a project without consolidation.
var ErrNoConsolidation = errors.New("uncertain: the project has no consolidation to vary")

// NewPlan makes the plan of p from base, the result of solver.Solve(p):
// GridPoints times evenly spaced in log time from the first output time
// (or 10⁻⁴ of the end, whichever is later) to the end of the solve.
func NewPlan(p *solver.Project, base *solver.Result) (Plan, error) {
	if !HasSpread(p) {
		return Plan{}, ErrNoSpread
	}
	if base == nil || base.Consolidation == nil || len(base.Consolidation.Series.Time) < 2 {
		return Plan{}, ErrNoConsolidation
	}
	ts := base.Consolidation.Series.Time
	end := ts[len(ts)-1]
	lo := end * 1e-4
	if len(p.Times) > 0 && p.Times[0] > lo {
		lo = p.Times[0]
	}
	if lo >= end {
		lo = end / 10
	}
	grid := make([]float64, GridPoints)
	for i := range grid {
		grid[i] = lo * math.Pow(end/lo, float64(i)/float64(GridPoints-1))
	}
	grid[GridPoints-1] = end
	return Plan{Runs: solver.ResolveRuns(p.Uncertainty), Seed: p.Uncertainty.Seed, Date: solver.ResolveUncertaintyDate(p), Grid: grid}, nil
}

// HasSpread reports whether p has an Uncertainty with at least one
// non-zero coefficient of variation.
func HasSpread(p *solver.Project) bool {
	if p == nil || p.Uncertainty == nil {
		return false
	}
	for _, l := range p.Uncertainty.Layers {
		if l.K > 0 || l.Mv > 0 || l.Ch > 0 {
			return true
		}
	}
	return false
}

// Factors are the multipliers of one realisation, per layer (len =
// number of layers; 1 where a layer has no spread).
type Factors struct {
	K, Mv, Ch []float64
}

// SigmaLn is the standard deviation of ln X for a lognormal X with
// coefficient of variation cov: √(ln(1 + cov²)) (any text on the
// lognormal distribution, e.g. Benjamin & Cornell 1970).
func SigmaLn(cov float64) float64 { return math.Sqrt(math.Log1p(cov * cov)) }

// Draw returns the factors of realisation i of p (see the package
// documentation for the stream). Each factor has median 1; k and mv of a
// layer are correlated through LayerSpread.KMv: z_mv = ρ z_k + √(1−ρ²) z.
func Draw(p *solver.Project, seed, i int) Factors {
	n := len(p.Layers)
	f := Factors{K: ones(n), Mv: ones(n), Ch: ones(n)}
	if p.Uncertainty == nil {
		return f
	}
	r := rand.New(rand.NewPCG(uint64(seed), uint64(i)))
	for j, s := range p.Uncertainty.Layers {
		if j >= n {
			break
		}
		zk, z2, zch := r.NormFloat64(), r.NormFloat64(), r.NormFloat64()
		rho := s.KMv
		zmv := rho*zk + math.Sqrt(math.Max(0, 1-rho*rho))*z2
		f.K[j] = math.Exp(SigmaLn(s.K) * zk)
		f.Mv[j] = math.Exp(SigmaLn(s.Mv) * zmv)
		f.Ch[j] = math.Exp(SigmaLn(s.Ch) * zch)
	}
	return f
}

func ones(n int) []float64 {
	v := make([]float64, n)
	for i := range v {
		v[i] = 1
	}
	return v
}

// Apply returns a copy of p with each layer's parameters scaled by f: k
// by K; mv, mvUnload and the e–log curve's cc and cr by Mv; ch (or khKv
// when ch is not given) by Ch. p is unchanged; the copy shares nothing
// that Apply changes.
func Apply(p *solver.Project, f Factors) *solver.Project {
	q := *p
	q.Layers = append([]solver.Layer(nil), p.Layers...)
	for j := range q.Layers {
		l := &q.Layers[j]
		l.K *= f.K[j]
		if m := f.Mv[j]; m != 1 {
			l.Mv *= m
			l.MvUnload *= m
			if l.ECurve != nil {
				e := *l.ECurve
				e.Cc *= m
				e.Cr *= m
				l.ECurve = &e
			}
		}
		if c := f.Ch[j]; c != 1 && p.Drains != nil {
			if l.Ch > 0 {
				l.Ch *= c
			} else {
				kh := l.KhKv
				if kh == 0 {
					kh = 1
				}
				l.KhKv = kh * c
			}
		}
	}
	return &q
}

// Sample is what one realisation gives.
type Sample struct {
	Run int `json:"run"`
	// Settlement is the settlement (primary of the project's model plus
	// secondary compression), m, at the plan's Grid; Degree is Us there
	// (empty when the solve gives none).
	Settlement []float64 `json:"settlement,omitempty"`
	Degree     []float64 `json:"degree,omitempty"`
	// T90 is the time to Us = 90 %, days (nil: not reached).
	T90 *float64 `json:"t90,omitempty"`
	// Final is the final primary settlement plus the secondary
	// compression at the design life, m; Remaining is Final less the
	// settlement at Plan.Date.
	Final     float64 `json:"final"`
	Remaining float64 `json:"remaining"`
	// Problem, when not empty, says why this realisation has no result
	// (its factors took a parameter out of bounds, say).
	Problem string `json:"problem,omitempty"`
}

// Realise solves realisation i of p under plan.
func Realise(p *solver.Project, plan Plan, i int) Sample {
	q := Apply(p, Draw(p, plan.Seed, i))
	s := Outcome(q, plan.Grid, plan.Date)
	s.Run = i
	return s
}

// Outcome solves q (no drain reference solves) and reduces its result
// to a Sample on grid, with the settlement remaining after date.
func Outcome(q *solver.Project, grid []float64, date float64) Sample {
	r, err := solver.Solve(q, &solver.Options{NoDrainReference: true})
	if err != nil {
		msg := err.Error()
		if ps := solver.AsProblems(err); len(ps) > 0 {
			msg = ps[0].Path + ": " + ps[0].Message
		}
		return Sample{Problem: msg}
	}
	return Reduce(r, grid, date)
}

// Reduce turns a result into a Sample on grid.
func Reduce(r *solver.Result, grid []float64, date float64) Sample {
	var s Sample
	if r.Consolidation == nil {
		s.Problem = "no consolidation"
		return s
	}
	ser := &r.Consolidation.Series
	s.Settlement = make([]float64, len(grid))
	for k, t := range grid {
		s.Settlement[k] = TotalAt(ser, t)
	}
	if len(ser.Us) == len(ser.Time) {
		s.Degree = make([]float64, len(grid))
		for k, t := range grid {
			s.Degree[k] = solver.SeriesAt(ser.Time, ser.Us, t)
		}
	}
	if r.Summary.T90 != nil {
		t := *r.Summary.T90
		s.T90 = &t
	}
	s.Final = FinalTotal(r)
	s.Remaining = s.Final - TotalAt(ser, date)
	return s
}

// TotalAt is the settlement at time t of a series: the model's primary
// settlement plus the secondary compression when there is any.
func TotalAt(s *solver.Series, t float64) float64 {
	v := solver.SeriesAt(s.Time, s.Settlement, t)
	if len(s.Secondary) == len(s.Time) {
		v += solver.SeriesAt(s.Time, s.Secondary, t)
	}
	return v
}

// FinalTotal is the final primary settlement of the result's model plus
// the secondary compression at the design life, m (0 without them).
func FinalTotal(r *solver.Result) float64 {
	v := 0.0
	if r.Summary.Settlement != nil {
		v = *r.Summary.Settlement
	}
	if r.Summary.Secondary != nil {
		v += *r.Summary.Secondary
	}
	return v
}

// Range solves the realisations from ≤ i < to in order. progress, when
// not nil, is called after each with the number done; returning false
// stops the loop, and the samples so far are returned.
func Range(p *solver.Project, plan Plan, from, to int, progress func(done int) bool) []Sample {
	out := make([]Sample, 0, max(0, to-from))
	for i := from; i < to; i++ {
		out = append(out, Realise(p, plan, i))
		if progress != nil && !progress(len(out)) {
			break
		}
	}
	return out
}

// Quantiles are the P10, P50 and P90 of a figure over the realisations
// that have it, with the mean; N is how many had it.
type Quantiles struct {
	P10  float64 `json:"p10"`
	P50  float64 `json:"p50"`
	P90  float64 `json:"p90"`
	Mean float64 `json:"mean"`
	N    int     `json:"n"`
}

// Bands are the combined samples.
type Bands struct {
	Time []float64 `json:"time"` // the plan's grid, day
	// Settlement and Degree hold P10, P50 and P90 at each grid time.
	Settlement [3][]float64 `json:"settlement"`
	Degree     [3][]float64 `json:"degree"`
	T90        Quantiles    `json:"t90"`
	Final      Quantiles    `json:"final"`
	Remaining  Quantiles    `json:"remaining"`
	// T90Values are the t90 of every realisation that reached it, sorted.
	T90Values []float64 `json:"t90Values"`
	// Runs counts the samples combined; Failed those with a Problem
	// (FirstProblem is the first of them); NotReached those whose Us
	// never reached 90 % in the simulated time.
	Runs         int    `json:"runs"`
	Failed       int    `json:"failed"`
	NotReached   int    `json:"notReached"`
	FirstProblem string `json:"firstProblem,omitempty"`
}

// Combine reduces samples (any order) to bands on plan's grid.
func Combine(plan Plan, samples []Sample) Bands {
	b := Bands{Time: plan.Grid, Runs: len(samples)}
	var ok []Sample
	for _, s := range samples {
		if s.Problem != "" {
			if b.Failed == 0 {
				b.FirstProblem = fmt.Sprintf("run %d: %s", s.Run+1, s.Problem)
			}
			b.Failed++
			continue
		}
		ok = append(ok, s)
	}
	n := len(plan.Grid)
	col := make([]float64, 0, len(ok))
	for q := range 3 {
		b.Settlement[q] = make([]float64, n)
	}
	degree := len(ok) > 0
	for _, s := range ok {
		degree = degree && len(s.Degree) == n
	}
	if degree {
		for q := range 3 {
			b.Degree[q] = make([]float64, n)
		}
	}
	for k := range n {
		col = col[:0]
		for _, s := range ok {
			col = append(col, s.Settlement[k])
		}
		qs := Summarise(col)
		b.Settlement[0][k], b.Settlement[1][k], b.Settlement[2][k] = qs.P10, qs.P50, qs.P90
		if degree {
			col = col[:0]
			for _, s := range ok {
				col = append(col, s.Degree[k])
			}
			qs := Summarise(col)
			b.Degree[0][k], b.Degree[1][k], b.Degree[2][k] = qs.P10, qs.P50, qs.P90
		}
	}
	var t90, fin, rem []float64
	for _, s := range ok {
		if s.T90 != nil {
			t90 = append(t90, *s.T90)
		} else {
			b.NotReached++
		}
		fin = append(fin, s.Final)
		rem = append(rem, s.Remaining)
	}
	b.T90, b.Final, b.Remaining = Summarise(t90), Summarise(fin), Summarise(rem)
	sort.Float64s(t90)
	b.T90Values = t90
	return b
}

// Summarise gives the quantiles of xs (unchanged); zero Quantiles for
// none.
func Summarise(xs []float64) Quantiles {
	if len(xs) == 0 {
		return Quantiles{}
	}
	s := append([]float64(nil), xs...)
	sort.Float64s(s)
	sum := 0.0
	for _, x := range s {
		sum += x
	}
	return Quantiles{P10: Quantile(s, 0.1), P50: Quantile(s, 0.5), P90: Quantile(s, 0.9), Mean: sum / float64(len(s)), N: len(s)}
}

// Quantile is the p-quantile of the sorted values s by linear
// interpolation between order statistics at h = (n−1)p (Hyndman & Fan
// 1996, definition 7; the default of R and NumPy). s must be sorted and
// not empty.
func Quantile(s []float64, p float64) float64 {
	h := float64(len(s)-1) * p
	i := int(math.Floor(h))
	if i >= len(s)-1 {
		return s[len(s)-1]
	}
	return s[i] + (h-float64(i))*(s[i+1]-s[i])
}
