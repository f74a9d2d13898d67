package solver

import (
	"math"
)

// The kinds of heave and uplift check (Check.Kind).
const (
	// CheckHeave is ic/i in a layer with upward flow: the critical
	// gradient γ'/γw over the upward hydraulic gradient across the layer
	// (Terzaghi 1943; common practice). Once the stages have added
	// effective stress Δσ'top at the layer's top (a fill, as a weighted
	// filter: Terzaghi & Peck 1967) it is (γ'd + Δσ'top)/(γw i d), d the
	// layer's thickness.
	CheckHeave = "heave"
	// CheckPrism is the whole overburden at the base of a low-permeability
	// layer against the water pressure there, σ/u: the prism of soil (and
	// water, fill) above the aquifer (Terzaghi's prism; common practice).
	CheckPrism = "prism"
	// CheckUplift is the layer's own weight against the rise of water
	// pressure across it, (σ_base − σ_top)/(u_base − u_top): the layer
	// lifted alone, as when the soil above it is dug away or carries none
	// of it; the effective stress the stages have added at its top
	// (Δσ'top, a fill's weight once the water under it has drained) is
	// added to the weight.
	CheckUplift = "uplift"
)

// FactorCap is the largest factor a check reports: a factor at FactorCap
// means nothing pushes (no upward flow, no water pressure) or a margin
// beyond any code's requirement. It keeps the results finite.
const FactorCap = 100.0

// MaxCheckSeries is the most checks whose factor is recorded at every
// time step (Check.Series): the prism and uplift checks first, then the
// heave checks of the layers with upward flow in the steady state. Every
// check has its initial, per-stage, long-term and least values.
const MaxCheckSeries = 8

// Check is one heave or uplift check followed through time: evaluated in
// the initial steady state, immediately after each load stage (after the
// undrained response to an instantaneous one, at the end of a ramped one),
// at every time step, and in the long-term state (all loads applied, all
// excess drained). Pore pressure is the steady pressure plus the excess,
// total stress the steady stress plus the stages' change.
type Check struct {
	Kind  string `json:"kind"`
	Layer int    `json:"layer"` // 0-based index of the layer
	// Top and Base are the depths of the layer's top and base, m below
	// the original top of the column; uplift and prism checks act at the
	// base.
	Top  float64 `json:"top"`
	Base float64 `json:"base"`
	// Initial is the factor in the steady state before anything changes,
	// LongTerm the one once all has drained.
	Initial  float64 `json:"initial"`
	LongTerm float64 `json:"longTerm"`
	// Stages holds, for each load stage in the order of Project.Loads,
	// the least factor from the moment the stage is complete (after the
	// undrained response to an instantaneous one, at the end of a ramped
	// one) until the next stage starts or the simulation ends: the state
	// the stage leaves, immediately and while it lasts (FactorCap for a
	// stage complete after the end; empty without consolidation).
	Stages []float64 `json:"stages,omitempty"`
	// Least is the smallest factor at any time, LeastTime when it occurs
	// (days, 0 for the initial state; nil: the long-term state).
	Least     float64  `json:"least"`
	LeastTime *float64 `json:"leastTime,omitempty"`
	// Series is the factor at every time of Series.Time for the first
	// MaxCheckSeries checks (empty for the others).
	Series []float64 `json:"series,omitempty"`
}

// Governing names the check with the least factor of one kind.
type Governing struct {
	Check  int     `json:"check"` // index into Result.Checks
	Factor float64 `json:"factor"`
	Layer  int     `json:"layer"`
	Depth  float64 `json:"depth"` // m below the original top: the base (uplift, prism) or the top (heave) of the layer
	// Time is when it occurs, days (nil: the long-term state).
	Time *float64 `json:"time,omitempty"`
}

// checkSeries is the number of check series per time step a solve of p
// records (see MaxCheckSeries), computed without a mesh.
func checkSeries(p *Project) int {
	n := len(p.Layers)
	for i, l := range p.Layers {
		if (i+1 < len(p.Layers) && l.K*100 <= p.Layers[i+1].K) || (i+1 == len(p.Layers) && p.Bottom.Drained && l.K < 1e-7) {
			n += 2
		}
	}
	return min(n, MaxCheckSeries)
}

// checkSite is where a check acts: layer i between nodes top and base.
type checkSite struct {
	kind      string
	layer     int
	top, base int     // nodes
	zTop, zB  float64 // m
	ic        float64 // critical gradient (heave)
}

// checks evaluates the heave and uplift checks of a column.
type checks struct {
	c      *column
	st     *Steady
	sites  []checkSite
	out    []Check
	leastT []float64 // per check: when Least occurs, days (+Inf: long term)
	// from and to bound each load stage's window: from its completion
	// (less 1e-12 of it, and of a day at least, for the rounding of the
	// steps' times) to the next start after it (+Inf: none).
	from, to []float64
	open     []int // scratch of observe: the stages whose window holds t
}

// upliftSites lists the bases of the layers at least 100 times less
// permeable than the layer below, and the base of the column when a
// fine-grained layer (k < 1e-7 m/s) sits on a drained or leaky base (the
// aquifer is then the column's boundary).
func (c *column) upliftSites() []int {
	p := c.p
	var out []int
	for i, l := range p.Layers {
		if i+1 < len(p.Layers) && l.K*100 <= p.Layers[i+1].K {
			out = append(out, i)
		}
		if i+1 == len(p.Layers) && p.Bottom.Drained && l.K < 1e-7 {
			out = append(out, i)
		}
	}
	return out
}

func newChecks(c *column, st *Steady) *checks {
	p, m := c.p, c.m
	ch := &checks{c: c, st: st}
	node := func(i int) int { return m.Order * m.First[i] }
	// A layer an excavation cuts is checked below its floor; one it
	// removes is not checked.
	site := func(kind string, i int) (checkSite, bool) {
		s := checkSite{kind: kind, layer: i, top: node(i), base: node(i + 1), zTop: c.tops[i], zB: c.tops[i+1]}
		if c.dug != nil {
			if s.base <= c.zoneNode {
				return s, false
			}
			if s.top < c.zoneNode {
				s.top, s.zTop = c.zoneNode, m.Z[c.zoneNode]
			}
		}
		return s, true
	}
	for _, i := range c.upliftSites() {
		for _, kind := range []string{CheckPrism, CheckUplift} {
			if s, ok := site(kind, i); ok {
				ch.sites = append(ch.sites, s)
			}
		}
	}
	// Heave: the layers with upward steady flow first, so that they get
	// the recorded series before the others.
	for _, up := range []bool{true, false} {
		for i, l := range p.Layers {
			if st.Layers[i].Upward != up {
				continue
			}
			if s, ok := site(CheckHeave, i); ok {
				s.ic = (l.GammaSat - c.gw) / c.gw
				ch.sites = append(ch.sites, s)
			}
		}
	}
	ch.out = make([]Check, len(ch.sites))
	ch.leastT = make([]float64, len(ch.sites))
	for j := range ch.sites {
		s := &ch.sites[j]
		f := ch.factor(s, nil, nil)
		ch.out[j] = Check{Kind: s.kind, Layer: s.layer, Top: s.zTop, Base: s.zB, Initial: f, LongTerm: f, Least: f}
		ch.leastT[j] = 0
	}
	return ch
}

// factor is the factor of site s with the nodal total stress and pore
// pressure changes dsigma and du from the steady state (nil: none).
func (ch *checks) factor(s *checkSite, dsigma, du []float64) float64 {
	st := ch.st
	at := func(v []float64, d []float64, j int) float64 {
		if d != nil {
			return v[j] + d[j]
		}
		return v[j]
	}
	uT, uB := at(st.Pore, du, s.top), at(st.Pore, du, s.base)
	sT, sB := at(st.Total, dsigma, s.top), at(st.Total, dsigma, s.base)
	// The effective stress the stages add at the layer's top holds the
	// layer down like the weighted filter of common practice (Terzaghi &
	// Peck 1967): a fill on a clay whose excess drains upward adds more
	// weight than the water it presses out can lift. Only an addition
	// counts; with none (the steady state, a layer laid bare by a dig)
	// the factors are the bare ic/i and weight/water ones.
	filter := 0.0
	if dsigma != nil {
		// math.Max(0, ·) by a comparison (NaN kept, −0 to 0): js/wasm
		// calls math.Max out of line, and this runs every step.
		if filter = dsigma[s.top] - du[s.top]; filter <= 0 {
			filter = 0
		}
	}
	var f float64
	switch s.kind {
	case CheckPrism:
		f = ratio(sB, uB)
	case CheckUplift:
		f = ratio(sB-sT+filter, uB-uT)
	default:
		gw := ch.c.gw
		// Head h = u/γw − z; upward flow when the base's head is higher.
		d := s.zB - s.zTop
		i := ((uB/gw - s.zB) - (uT/gw - s.zTop)) / d
		// ic/i, or with a filter (γ'd + Δσ'top)/(γw i d).
		f = ratio(s.ic+filter/(gw*d), i)
	}
	return f
}

// ratio is resist/push, FactorCap when nothing pushes, at most FactorCap
// and at least 0.
func ratio(resist, push float64) float64 {
	if push <= 0 || resist >= FactorCap*push {
		return FactorCap
	}
	// math.Max(·, 0) as in factor.
	f := resist / push
	if f <= 0 {
		f = 0
	}
	return f
}

// prepare sizes the series of the first MaxCheckSeries checks for n
// steps and the per-stage values for the stages.
func (ch *checks) prepare(n int, loads []Load) {
	stages := len(loads)
	ch.from, ch.to = make([]float64, stages), make([]float64, stages)
	ch.open = make([]int, 0, stages)
	for i, l := range loads {
		done := l.Start + l.Ramp
		ch.from[i], ch.to[i] = done-1e-12*math.Max(1, done), math.Inf(1)
		for _, o := range loads {
			if o.Start > done && o.Start < ch.to[i] {
				ch.to[i] = o.Start
			}
		}
	}
	for j := range ch.out {
		ch.out[j].Stages = make([]float64, stages)
		for s := range stages {
			ch.out[j].Stages[s] = FactorCap
		}
		if j < MaxCheckSeries {
			ch.out[j].Series = make([]float64, 0, n)
		}
	}
}

// observe evaluates every check at time t from the nodal changes of the
// time loop; the stages whose window holds t keep the least. At the
// instant of an instantaneous change (jumped) the checks are not
// evaluated: the undrained response raises the excess at every free node,
// also at the edges of permeable layers that drain within the first step,
// whose gradients would then be artefacts; the series repeats its last
// value there, and the first step after it (Stepping.FirstStep) is the
// first state checked.
func (ch *checks) observe(t float64, dsigma, du []float64, jumped bool) {
	if jumped {
		for j := range min(len(ch.out), MaxCheckSeries) {
			o := &ch.out[j]
			last := o.Initial
			if n := len(o.Series); n > 0 {
				last = o.Series[n-1]
			}
			o.Series = append(o.Series, last)
		}
		return
	}
	// The windows depend on t alone: found once for every check.
	open := ch.open[:0]
	for i, from := range ch.from {
		if t >= from && t < ch.to[i] {
			open = append(open, i)
		}
	}
	for j := range ch.sites {
		o := &ch.out[j]
		f := ch.factor(&ch.sites[j], dsigma, du)
		if j < MaxCheckSeries {
			o.Series = append(o.Series, f)
		}
		if f < o.Least {
			o.Least, ch.leastT[j] = f, t
		}
		for _, i := range open {
			if f < o.Stages[i] {
				o.Stages[i] = f
			}
		}
	}
}

// longTerm evaluates every check in the final drained state.
func (ch *checks) longTerm(sigInf, uInf []float64) {
	for j := range ch.sites {
		f := ch.factor(&ch.sites[j], sigInf, uInf)
		o := &ch.out[j]
		o.LongTerm = f
		if f < o.Least {
			o.Least, ch.leastT[j] = f, math.Inf(1)
		}
	}
}

// summarise puts the checks into r and the least of each kind into its
// summary; the least heave factor is Summary.MinHeaveFactor as well.
func (ch *checks) summarise(r *Result) {
	for j := range ch.out {
		ch.out[j].LeastTime = nil
		if t := ch.leastT[j]; !math.IsInf(t, 1) {
			ch.out[j].LeastTime = ptr(t)
		}
	}
	r.Checks = ch.out
	r.Summary.Heave, r.Summary.Uplift, r.Summary.Prism = nil, nil, nil
	for j, o := range ch.out {
		g := &r.Summary.Heave
		depth := o.Top
		switch o.Kind {
		case CheckUplift:
			g, depth = &r.Summary.Uplift, o.Base
		case CheckPrism:
			g, depth = &r.Summary.Prism, o.Base
		}
		if o.Least >= FactorCap {
			continue
		}
		if *g == nil || o.Least < (*g).Factor {
			var tm *float64
			if o.LeastTime != nil {
				tm = ptr(*o.LeastTime)
			}
			*g = &Governing{Check: j, Factor: o.Least, Layer: o.Layer, Depth: depth, Time: tm}
		}
	}
	r.Summary.MinHeaveFactor = nil
	if g := r.Summary.Heave; g != nil {
		r.Summary.MinHeaveFactor = ptr(g.Factor)
	}
}
