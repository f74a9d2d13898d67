package uncertain

import (
	"math"
	"sort"

	"porelight/solver"
)

// Parameter names of a Swing.
const (
	ParamK  = "k"
	ParamMv = "mv"
	ParamCh = "ch"
)

// Swing is the effect of one input moved alone from its P10 to its P90
// (median × exp(∓1.2816 σ_ln)), every other input at its median.
type Swing struct {
	Layer int    `json:"layer"` // index in Project.Layers
	Param string `json:"param"` // ParamK, ParamMv or ParamCh
	// LowFactor and HighFactor are the multipliers of the input.
	LowFactor  float64 `json:"lowFactor"`
	HighFactor float64 `json:"highFactor"`
	// Low and High are the outcomes with the input at each end.
	Low  Sample `json:"low"`
	High Sample `json:"high"`
}

// T90Range is |t90(high) − t90(low)|, days; +Inf when only one end
// reaches 90 %, 0 when neither does.
func (s Swing) T90Range() float64 {
	switch {
	case s.Low.T90 != nil && s.High.T90 != nil:
		return math.Abs(*s.High.T90 - *s.Low.T90)
	case s.Low.T90 == nil && s.High.T90 == nil:
		return 0
	}
	return math.Inf(1)
}

// RemainingRange is |remaining(high) − remaining(low)|, m.
func (s Swing) RemainingRange() float64 { return math.Abs(s.High.Remaining - s.Low.Remaining) }

// Sensitivity solves p with each uncertain input (a non-zero COV) at its
// P10 and at its P90, one at a time, and returns the swings ranked by
// their effect on t90, then on the remaining settlement, largest first.
// base is the outcome with every input at its median. progress, when not
// nil, receives the number of solves done and the number planned;
// returning false stops, with the swings so far.
func Sensitivity(p *solver.Project, plan Plan, progress func(done, total int) bool) (base Sample, swings []Swing) {
	n := len(p.Layers)
	type in struct {
		layer int
		param string
		cov   float64
	}
	var ins []in
	if p.Uncertainty != nil {
		for j, s := range p.Uncertainty.Layers {
			if j >= n {
				break
			}
			if s.K > 0 {
				ins = append(ins, in{j, ParamK, s.K})
			}
			if s.Mv > 0 {
				ins = append(ins, in{j, ParamMv, s.Mv})
			}
			if s.Ch > 0 && p.Drains != nil {
				ins = append(ins, in{j, ParamCh, s.Ch})
			}
		}
	}
	total := 1 + 2*len(ins)
	base = Outcome(p, plan.Grid, plan.Date)
	done := 1
	if progress != nil && !progress(done, total) {
		return base, nil
	}
	for _, x := range ins {
		sg := SigmaLn(x.cov)
		sw := Swing{Layer: x.layer, Param: x.param, LowFactor: math.Exp(-z90 * sg), HighFactor: math.Exp(z90 * sg)}
		for end, fac := range []float64{sw.LowFactor, sw.HighFactor} {
			f := Factors{K: ones(n), Mv: ones(n), Ch: ones(n)}
			switch x.param {
			case ParamK:
				f.K[x.layer] = fac
			case ParamMv:
				f.Mv[x.layer] = fac
			case ParamCh:
				f.Ch[x.layer] = fac
			}
			o := Outcome(Apply(p, f), plan.Grid, plan.Date)
			if end == 0 {
				sw.Low = o
			} else {
				sw.High = o
			}
			done++
			if progress != nil && !progress(done, total) {
				return base, swings
			}
		}
		swings = append(swings, sw)
	}
	sort.SliceStable(swings, func(a, b int) bool {
		ra, rb := swings[a].T90Range(), swings[b].T90Range()
		if ra != rb {
			return ra > rb
		}
		return swings[a].RemainingRange() > swings[b].RemainingRange()
	})
	return base, swings
}
