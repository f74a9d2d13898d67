package solver

import (
	"fmt"
	"math"

	"porelight/solver/fem"
	"porelight/solver/soil"
)

// BearingNc is Prandtl's bearing capacity factor of a strip on undrained
// clay, π + 2 ≈ 5.14, used by the screening check Nc·su/FS.
const BearingNc = math.Pi + 2

// StrengthResult is the answer of StrengthGain. Stresses in kPa, depths in
// m, times in days after day 0.
//
// It is a screening check, not a stability analysis: the stability of an
// embankment needs a slope-stability analysis (with the strength along the
// slip surface, the fill's own strength and the geometry) and the rules
// that apply locally.
type StrengthResult struct {
	// Nc is BearingNc and FS the factor of safety of the check.
	Nc float64 `json:"nc"`
	FS float64 `json:"fs"`
	// Profiles are the su profiles at StrengthCheck.Times, under the
	// project's whole load history.
	Profiles []SuProfile `json:"profiles"`
	// Lifts holds the check of every stage that adds load, in order.
	Lifts []LiftCheck `json:"lifts"`
	// Time and Mean are the mean su of the layers with a law against
	// time under the project's whole load history, days and kPa.
	Time []float64 `json:"time"`
	Mean []float64 `json:"mean"`
}

// SuProfile is the undrained strength at the centre of every element of
// the layers with a law at one time, with the effective vertical stress
// and the preconsolidation stress it comes from.
type SuProfile struct {
	Time   float64   `json:"time"`
	Depth  []float64 `json:"depth"`
	SigmaV []float64 `json:"sigmaV"`
	SigmaP []float64 `json:"sigmaP"`
	Su     []float64 `json:"su"`
	// Mean is the thickness-weighted mean su over those layers, the su
	// of the bearing check; Least the smallest, at LeastDepth.
	Mean       float64 `json:"mean"`
	Least      float64 `json:"least"`
	LeastDepth float64 `json:"leastDepth"`
}

// LiftCheck is the bearing check of one stage that adds load.
type LiftCheck struct {
	// Stage is the index in Project.Loads; Start its planned start.
	Stage int     `json:"stage"`
	Start float64 `json:"start"`
	// Pressure is the pressure at the surface once this stage is
	// complete, with every stage that starts before it (before
	// submergence); Ready the day those stages are complete.
	Pressure float64 `json:"pressure"`
	Ready    float64 `json:"ready"`
	// Su is the mean su at the planned start (under the stages before
	// it alone) and Carries = Nc·Su/FS the pressure the ground carries
	// then; Safe reports Carries ≥ Pressure.
	Su      float64 `json:"su"`
	Carries float64 `json:"carries"`
	Safe    bool    `json:"safe"`
	// Earliest is the first day, not before Ready, on which Nc·su/FS
	// reaches Pressure (nil: not in the simulated time).
	Earliest *float64 `json:"earliest,omitempty"`
	// Time and Mean are the mean su against time under the stages before
	// this one alone, the curve Su and Earliest are read from (days, kPa).
	Time []float64 `json:"time"`
	Mean []float64 `json:"mean"`
}

// StrengthGain answers Decisions.Strength (which must be set) for a valid
// project p. Each element of a layer with a law has σ'v = σ'0 + σ − u
// from the solve and σ'p, the largest of its initial σ'p
// (PreconsolidationAt; σ'0 without an e–log curve) and every σ'v it has
// reached; its su follows the law: S σ'v (σ'p/σ'v)^m (SHANSEP, Ladd &
// Foott 1974; Ladd 1991), Ratio σ'p, or Su0(z) + Gain·max(0, σ'v − σ'0).
// The profiles come from one solve of p; each lift's check from a solve
// of the stages that start before it. It does not change p. Errors are
// Problems, as from Solve, or ErrCanceled.
func StrengthGain(p *Project, opt *Options) (*StrengthResult, error) {
	return strengthGain(p, opt, Solve)
}

func strengthGain(p *Project, opt *Options, solve solveFunc) (*StrengthResult, error) {
	var ps Problems
	if p.Decisions == nil || p.Decisions.Strength == nil {
		ps.Add(JoinPath(DecisionsPath, "strength"), ErrRequired, "no strength question")
		return nil, ps
	}
	if err := Validate(p); err != nil {
		return nil, err
	}
	sc := p.Decisions.Strength
	base := designOptions(opt)
	res := &StrengthResult{Nc: BearingNc, FS: sc.FS, Profiles: []SuProfile{}, Lifts: []LiftCheck{}}
	tr, err := trackStrength(p, sc.Times, base, solve)
	if err != nil {
		return nil, err
	}
	res.Profiles, res.Time, res.Mean = tr.profiles, tr.times, tr.mean
	if res.Profiles == nil {
		res.Profiles = []SuProfile{}
	}
	for j, l := range p.Loads {
		if l.Pressure() <= 0 {
			continue
		}
		before := copyLoads(p)
		before.Loads = before.Loads[:0]
		before.Decisions = &Decisions{Strength: sc}
		lc := LiftCheck{Stage: j, Start: l.Start, Pressure: l.Pressure()}
		for i, o := range p.Loads {
			if i != j && o.Start < l.Start {
				before.Loads = append(before.Loads, o)
				lc.Pressure += o.Pressure()
				lc.Ready = math.Max(lc.Ready, o.Start+o.Ramp)
			}
		}
		t, err := trackStrength(before, nil, base, solve)
		if err != nil {
			return nil, err
		}
		lc.Time, lc.Mean = t.times, t.mean
		lc.Su = SeriesAt(t.times, t.mean, l.Start)
		lc.Carries = BearingNc * lc.Su / sc.FS
		lc.Safe = lc.Carries >= lc.Pressure
		need := lc.Pressure * sc.FS / BearingNc
		for i, ti := range t.times {
			if ti < lc.Ready || t.mean[i] < need {
				continue
			}
			if i > 0 && t.times[i-1] >= lc.Ready {
				lc.Earliest = crossing(t.times[i-1:i+1], t.mean[i-1:i+1], need)
			} else {
				lc.Earliest = ptr(lc.Ready)
				if SeriesAt(t.times, t.mean, lc.Ready) < need {
					lc.Earliest = ptr(ti)
				}
			}
			break
		}
		res.Lifts = append(res.Lifts, lc)
	}
	return res, nil
}

// suTracker follows the undrained strength of the elements with a law
// along one solve.
type suTracker struct {
	p        *Project
	m        *fem.Mesh
	law      []*StrengthLaw // per element, nil: no law
	zc, h    []float64      // element centre and length
	s0, sp   []float64      // per element: initial σ'v, σ'p so far
	sv, su   []float64      // now
	pSv, pSu []float64      // at the step before
	tPrev    float64
	want     []float64 // profile days
	next     int

	profiles    []SuProfile
	times, mean []float64 // the mean su at every step
}

// trackStrength solves p and follows the strength of its elements; p's
// own Decisions.Strength gives the laws.
func trackStrength(p *Project, want []float64, base *Options, solve solveFunc) (*suTracker, error) {
	c := newColumn(p)
	m := c.m
	k := &suTracker{p: p, m: m, want: want, law: make([]*StrengthLaw, m.Elements())}
	laws := p.Decisions.Strength.Laws
	for e := range m.Elements() {
		for i := range laws {
			if laws[i].Layer == m.Layer[e] {
				k.law[e] = &laws[i]
			}
		}
	}
	n := m.Elements()
	k.zc, k.h = make([]float64, n), make([]float64, n)
	for e := range n {
		_, z0, z1 := m.Span(e)
		k.zc[e], k.h[e] = (z0+z1)/2, z1-z0
	}
	started := false
	o := *base
	o.watch = &watcher{
		final: func(_, _, s0 []float64) { k.start(s0); started = true },
		step:  k.step,
	}
	r, err := solve(p, &o)
	if err != nil {
		return nil, err
	}
	if !started { // no consolidation: the initial state holds
		k.start(r.Steady.Effective)
		k.step(0, make([]float64, m.Nodes()), make([]float64, m.Nodes()))
	}
	for k.next < len(k.want) { // past the end of the simulation
		k.profile(k.want[k.next], 1)
		k.next++
	}
	return k, nil
}

// start takes the initial state from the nodal effective stress s0.
func (k *suTracker) start(s0 []float64) {
	n := k.m.Elements()
	k.s0, k.sp = make([]float64, n), make([]float64, n)
	k.sv, k.su, k.pSv, k.pSu = make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n)
	for e := range n {
		k.s0[e] = math.Max(k.m.Centre(s0, e), soil.MinEffective)
		k.sp[e] = k.s0[e]
		if ec := k.p.Layers[k.m.Layer[e]].ECurve; ec != nil {
			k.sp[e] = PreconsolidationAt(ec, k.zc[e], k.s0[e])
		}
	}
}

// step takes the state after a recorded step: σ'v and σ'p per element,
// their su, the mean su, and the profiles whose day has come.
func (k *suTracker) step(t float64, sigma, u []float64) {
	k.pSv, k.sv = k.sv, k.pSv
	k.pSu, k.su = k.su, k.pSu
	sum, hs := 0.0, 0.0
	for e, l := range k.law {
		if l == nil {
			continue
		}
		sv := math.Max(k.s0[e]+k.m.Centre(sigma, e)-k.m.Centre(u, e), soil.MinEffective)
		k.sp[e] = math.Max(k.sp[e], sv)
		k.sv[e], k.su[e] = sv, undrained(l, k.zc[e], sv, k.sp[e], k.s0[e])
		sum += k.su[e] * k.h[e]
		hs += k.h[e]
	}
	if len(k.times) == 0 {
		copy(k.pSv, k.sv)
		copy(k.pSu, k.su)
		k.tPrev = t
	}
	for k.next < len(k.want) && k.want[k.next] <= t {
		f := 1.0
		if t > k.tPrev {
			f = math.Max(0, (k.want[k.next]-k.tPrev)/(t-k.tPrev))
		}
		k.profile(k.want[k.next], f)
		k.next++
	}
	k.times = append(k.times, t)
	k.mean = append(k.mean, sum/hs)
	k.tPrev = t
}

// profile keeps the su profile at day t, a fraction f of the way from the
// step before to the last.
func (k *suTracker) profile(t, f float64) {
	sp := SuProfile{Time: t, Least: math.Inf(1)}
	sum, hs := 0.0, 0.0
	for e, l := range k.law {
		if l == nil {
			continue
		}
		sv := k.pSv[e] + f*(k.sv[e]-k.pSv[e])
		su := k.pSu[e] + f*(k.su[e]-k.pSu[e])
		sp.Depth = append(sp.Depth, k.zc[e])
		sp.SigmaV = append(sp.SigmaV, sv)
		sp.SigmaP = append(sp.SigmaP, k.sp[e])
		sp.Su = append(sp.Su, su)
		sum += su * k.h[e]
		hs += k.h[e]
		if su < sp.Least {
			sp.Least, sp.LeastDepth = su, k.zc[e]
		}
	}
	sp.Mean = sum / hs
	k.profiles = append(k.profiles, sp)
}

// undrained is the su of law l at depth z for σ'v = sv, σ'p = sp and the
// initial σ'v s0, kPa.
func undrained(l *StrengthLaw, z, sv, sp, s0 float64) float64 {
	switch l.Law {
	case StrengthSHANSEP:
		return l.S * sv * math.Pow(sp/sv, l.M)
	case StrengthRatio:
		return l.Ratio * sp
	case StrengthMeasured:
		return profileAt(l.Su0, z, 0) + l.Gain*math.Max(0, sv-s0)
	}
	panic(fmt.Sprintf("solver: unknown strength law %q", l.Law))
}
