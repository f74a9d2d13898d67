package solver

import (
	"fmt"
	"math"
	"strings"
)

// SurchargePlan is the answer of SurchargeRemoval: when a temporary
// surcharge may come off, and what follows. Settlements in m (positive
// down), pressures in kPa, times in days after day 0.
//
// The approach is that of Aldrich (1965) and Johnson (1970): the
// surcharge may come off once the settlement reached under the permanent
// load plus the surcharge equals the final settlement under the permanent
// load alone (Average), and — Johnson's caution, since the average hides
// the least consolidated part of a layer — once every point of the column
// has reached the effective stress it would reach under the permanent load
// alone (Everywhere): then no point is left to settle further under the
// permanent load. RemoveOn is the later of the two and of the end of the
// lift. Both come from the same model as the summary (Summary.Model).
type SurchargePlan struct {
	// Removal and Lift are the indices in Project.Loads of the stage that
	// takes the surcharge off and of the lift that placed it.
	Removal int `json:"removal"`
	Lift    int `json:"lift"`
	// Surcharge is the pressure the removal takes off; Permanent the
	// pressure left at the surface once every stage has acted (before
	// submergence).
	Surcharge float64 `json:"surcharge"`
	Permanent float64 `json:"permanent"`
	// TargetPrimary is the final primary settlement under the permanent
	// load alone (the project with the surcharge never placed: the removal
	// acting over the lift's own ramp); TargetSecondary its secondary
	// compression at the design life when WithSecondary (else 0); Target
	// their sum.
	TargetPrimary   float64 `json:"targetPrimary"`
	TargetSecondary float64 `json:"targetSecondary"`
	Target          float64 `json:"target"`
	// FinalWithSurcharge is the final primary settlement were the
	// surcharge left on; Degree is Target over it, the average degree of
	// consolidation under permanent plus surcharge the removal needs
	// (for a normally consolidated layer log(σ'p/σ'0)/log(σ'ps/σ'0)).
	FinalWithSurcharge float64 `json:"finalWithSurcharge"`
	Degree             float64 `json:"degree"`
	// Average is the first day the settlement (primary, plus secondary
	// when WithSecondary) under permanent plus surcharge reaches Target;
	// Everywhere the first day every node has reached the change of
	// effective stress it has under the permanent load alone, and
	// LagDepth the depth of the last node to reach it, m. Nil when not
	// reached in the simulated time.
	Average    *float64 `json:"average,omitempty"`
	Everywhere *float64 `json:"everywhere,omitempty"`
	LagDepth   float64  `json:"lagDepth"`
	// RemoveOn is the earliest day the surcharge may come off: the
	// latest of Average, Everywhere and the end of the lift (nil when
	// either is not reached).
	RemoveOn *float64 `json:"removeOn,omitempty"`
	// After is the solve run forward with the removal moved to RemoveOn
	// (nil without RemoveOn).
	After *AfterRemoval `json:"after,omitempty"`
	// Needed answers Decisions.Surcharge.RemoveBy (nil when not asked).
	Needed *SurchargeNeed `json:"needed,omitempty"`
	// Curves are the settlement histories the answer comes from.
	Curves SurchargeCurves `json:"curves"`
	// Warnings are the forward solve's, and what the plan does not cover.
	Warnings []Warning `json:"warnings"`
}

// SurchargeCurves are settlement histories, m against days: under the
// permanent load alone, with the surcharge left on, and with the
// surcharge taken off at RemoveOn (empty without it). Each is primary plus
// secondary compression where a layer has a Cα.
type SurchargeCurves struct {
	Permanent  Curve `json:"permanent"`
	Surcharged Curve `json:"surcharged"`
	Forward    Curve `json:"forward"`
}

// Curve is one settlement history.
type Curve struct {
	Time       []float64 `json:"time"`
	Settlement []float64 `json:"settlement"`
}

// totalCurve is the primary plus secondary settlement of a solve.
func totalCurve(r *Result) Curve {
	if r.Consolidation == nil {
		return Curve{}
	}
	s := r.Consolidation.Series
	c := Curve{Time: s.Time, Settlement: append([]float64(nil), s.Settlement...)}
	for j := range s.Secondary {
		c.Settlement[j] += s.Secondary[j]
	}
	return c
}

// AfterRemoval is what the forward solve with the surcharge removed at
// Time gives.
type AfterRemoval struct {
	Time float64 `json:"time"`
	// AtRemoval is the primary settlement reached at Time; Rebound the
	// largest rise of the surface after it (≥ 0); FinalPrimary the final
	// primary settlement of that solve.
	AtRemoval    float64 `json:"atRemoval"`
	Rebound      float64 `json:"rebound"`
	FinalPrimary float64 `json:"finalPrimary"`
	// Residual is the settlement still to come after Time to the design
	// life, primary and secondary (as Result.Residual).
	Residual Residual `json:"residual"`
}

// SurchargeNeed is the surcharge for which RemoveOn falls on By.
type SurchargeNeed struct {
	By float64 `json:"by"`
	// Surcharge is the pressure needed, kPa; for a fill, Thickness is
	// the fill thickness it means, m (0 otherwise). RemoveOn is the
	// removal day it gives, at most By (the bisection stops within 0.2 %
	// of the surcharge or 0.2 % of By).
	Surcharge float64 `json:"surcharge"`
	Thickness float64 `json:"thickness,omitempty"`
	RemoveOn  float64 `json:"removeOn"`
}

// SurchargeRemoval answers Decisions.Surcharge (which must be set) for a
// valid project p: the plan for the surcharge as given, and, when
// RemoveBy is set, the surcharge needed to remove it by then (bisection
// in log surcharge on whole solves, to 0.2 %; some 10 to 20 solves). It does
// not change p. Errors are Problems, as from Solve, or ErrCanceled.
func SurchargeRemoval(p *Project, opt *Options) (*SurchargePlan, error) {
	return surchargeRemoval(p, opt, Solve)
}

// solveFunc is Solve, or a test's stand-in.
type solveFunc func(*Project, *Options) (*Result, error)

func surchargeRemoval(p *Project, opt *Options, solve solveFunc) (*SurchargePlan, error) {
	var ps Problems
	if p.Decisions == nil || p.Decisions.Surcharge == nil {
		ps.Add(JoinPath(DecisionsPath, "surcharge"), ErrRequired, "no surcharge question")
		return nil, ps
	}
	if err := Validate(p); err != nil {
		return nil, err
	}
	removal, lift, _ := surchargeStages(p)
	d := p.Decisions.Surcharge
	liftEnd := p.Loads[lift].Start + p.Loads[lift].Ramp
	if d.RemoveBy != 0 && d.RemoveBy < liftEnd {
		ps.Add(JoinPath(DecisionsPath, "surcharge.removeBy"), ErrConflict, fmt.Sprintf("day %g is before the lift that places the surcharge is complete (stage %d, day %g)", d.RemoveBy, lift+1, liftEnd))
		return nil, ps
	}
	base := designOptions(opt)
	// The permanent load alone: the removal acts with the lift.
	perm := copyLoads(p)
	perm.Decisions = nil
	perm.Loads[removal].Start, perm.Loads[removal].Ramp = p.Loads[lift].Start, p.Loads[lift].Ramp
	var target []float64
	o := *base
	o.watch = &watcher{final: func(s, u, _ []float64) {
		target = make([]float64, len(s))
		for i := range s {
			target[i] = s[i] - u[i]
		}
	}, step: func(float64, []float64, []float64) {}}
	rp, err := solve(perm, &o)
	if err != nil {
		return nil, err
	}
	plan := &SurchargePlan{Removal: removal, Lift: lift, Surcharge: -p.Loads[removal].Pressure(), Permanent: surcharge(p, math.Inf(1))}
	if rp.Summary.Settlement == nil {
		ps.Add("loads", ErrRequired, "the permanent load gives no settlement")
		return nil, ps
	}
	plan.TargetPrimary = *rp.Summary.Settlement
	plan.Curves.Permanent = totalCurve(rp)
	if d.WithSecondary && rp.Summary.Secondary != nil {
		plan.TargetSecondary = *rp.Summary.Secondary
	}
	plan.Target = plan.TargetPrimary + plan.TargetSecondary
	withSur := func(q *Project) (*surchargeTimes, error) {
		return removalTimes(q, removal, lift, target, plan.Target, base, solve)
	}
	st, err := withSur(p)
	if err != nil {
		return nil, err
	}
	plan.Curves.Surcharged = st.curve
	plan.FinalWithSurcharge, plan.Average, plan.Everywhere, plan.LagDepth = st.final, st.average, st.everywhere, st.lag
	if st.final > 0 {
		plan.Degree = plan.Target / st.final
	}
	plan.RemoveOn = st.removeOn(liftEnd)
	plan.Warnings = []Warning{}
	if plan.RemoveOn == nil {
		plan.Warnings = append(plan.Warnings, Warning{Path: "stepping.endTime", Message: "the settlement under permanent load plus surcharge does not reach the permanent load's final settlement everywhere in the simulated time: no removal day"})
	} else {
		var ws []Warning
		if plan.After, ws, plan.Curves.Forward, err = afterRemoval(p, removal, *plan.RemoveOn, base, solve); err != nil {
			return nil, err
		}
		plan.Warnings = append(plan.Warnings, ws...)
	}
	if p.Model != ModelNonlinear {
		for i, l := range p.Layers {
			if l.MvUnload == 0 {
				plan.Warnings = append(plan.Warnings, Warning{Path: JoinPath(IndexPath("layers", i), "mvUnload"), Message: fmt.Sprintf("layer %d%s rebounds along its loading mv after the removal (no swelling mv given): the rebound is overestimated; give mvUnload, or use the non-linear model (Cr)", i+1, quoted(l.Name))})
			}
		}
	}
	if d.RemoveBy > 0 {
		if plan.Needed, err = surchargeNeeded(p, removal, lift, d.RemoveBy, liftEnd, withSur); err != nil {
			return nil, err
		}
	}
	return plan, nil
}

// copyLoads copies p with its own Loads (and fills) to change.
func copyLoads(p *Project) *Project {
	q := *p
	q.Loads = append([]Load(nil), p.Loads...)
	for i := range q.Loads {
		if f := q.Loads[i].Fill; f != nil {
			g := *f
			q.Loads[i].Fill = &g
		}
	}
	return &q
}

// surchargeTimes are the two removal criteria on one solve with the
// surcharge never removed.
type surchargeTimes struct {
	final               float64
	average, everywhere *float64
	lag                 float64
	curve               Curve // primary plus secondary, surcharge left on
}

// removeOn is the later of the two criteria and the end of the lift, or
// nil when one is not reached.
func (s *surchargeTimes) removeOn(liftEnd float64) *float64 {
	if s.average == nil || s.everywhere == nil {
		return nil
	}
	return ptr(math.Max(liftEnd, math.Max(*s.average, *s.everywhere)))
}

// removalTimes solves q with the removal stage left out (the surcharge
// stays) and finds when its settlement reaches goal and when every node's
// change of effective stress reaches target (the permanent load's final,
// per node; nodes where that is not positive are not checked).
func removalTimes(q *Project, removal, lift int, target []float64, goal float64, base *Options, solve solveFunc) (*surchargeTimes, error) {
	sur := copyLoads(q)
	sur.Decisions = nil
	sur.Loads = append(sur.Loads[:removal:removal], sur.Loads[removal+1:]...)
	scale := 0.0
	for _, v := range target {
		scale = math.Max(scale, math.Abs(v))
	}
	var times, worst []float64
	var lagNode []int
	o := *base
	o.watch = &watcher{final: func(_, _, _ []float64) {}, step: func(t float64, s, u []float64) {
		w, at := math.Inf(1), -1
		for i, v := range target {
			if v > 1e-9*scale {
				if r := (s[i] - u[i]) / v; r < w {
					w, at = r, i
				}
			}
		}
		times, worst, lagNode = append(times, t), append(worst, w), append(lagNode, at)
	}}
	r, err := solve(sur, &o)
	if err != nil {
		return nil, err
	}
	st := &surchargeTimes{}
	if r.Summary.Settlement != nil {
		st.final = *r.Summary.Settlement
	}
	ser := r.Consolidation.Series
	st.curve = totalCurve(r)
	total := st.curve.Settlement
	st.average = crossing(ser.Time, total, goal)
	if len(total) > 0 && total[0] >= goal {
		st.average = ptr(0.0)
	}
	if len(times) > 0 && !math.IsInf(worst[0], 1) {
		st.everywhere = crossing(times, worst, 1)
		for j := range worst {
			if worst[j] >= 1 {
				if lagNode[max(j-1, 0)] >= 0 {
					st.lag = r.Consolidation.Depth[lagNode[max(j-1, 0)]]
				}
				break
			}
		}
	}
	return st, nil
}

// afterRemoval solves p with the removal stage moved to day t; it also
// returns that solve's warnings.
func afterRemoval(p *Project, removal int, t float64, base *Options, solve solveFunc) (*AfterRemoval, []Warning, Curve, error) {
	q := copyLoads(p)
	q.Loads[removal].Start = t
	dec := Decisions{Handover: t}
	if t >= ResolveDesignLife(p) {
		dec.Handover = 0
	}
	q.Decisions = &dec
	r, err := solve(q, base)
	if err != nil {
		return nil, nil, Curve{}, err
	}
	ser := r.Consolidation.Series
	a := &AfterRemoval{Time: t, AtRemoval: SeriesAt(ser.Time, ser.Settlement, t)}
	if r.Summary.Settlement != nil {
		a.FinalPrimary = *r.Summary.Settlement
	}
	for j, s := range ser.Settlement {
		if ser.Time[j] >= t {
			a.Rebound = math.Max(a.Rebound, a.AtRemoval-s)
		}
	}
	if r.Residual != nil {
		a.Residual = *r.Residual
	}
	// Of the forward solve's warnings only those about the removal
	// (heave, the secondary rate after it); the rest are the project's.
	var ws []Warning
	for _, w := range r.Warnings {
		if w.Path == "loads" || strings.HasSuffix(w.Path, ".calphaReduced") {
			ws = append(ws, w)
		}
	}
	return a, ws, totalCurve(r), nil
}

// surchargeNeeded finds the surcharge whose removal day is by: the lift
// and the removal change by the same amount, so the permanent load stays.
func surchargeNeeded(p *Project, removal, lift int, by, liftEnd float64, withSur func(*Project) (*surchargeTimes, error)) (*SurchargeNeed, error) {
	q0 := -p.Loads[removal].Pressure()
	at := func(qs float64) (*Project, float64, error) {
		q := copyLoads(p)
		dq := qs - q0
		if f := q.Loads[lift].Fill; f != nil {
			dh := dq / f.Gamma
			f.Thickness += dh
			q.Loads[removal].Fill.Thickness -= dh
		} else {
			q.Loads[lift].Q += dq
			q.Loads[removal].Q -= dq
		}
		st, err := withSur(q)
		if err != nil {
			return nil, 0, err
		}
		if r := st.removeOn(liftEnd); r != nil {
			return q, *r, nil
		}
		return q, math.Inf(1), nil
	}
	// Bracket: lo removes too late, hi early enough.
	lo, hi := q0, q0
	_, tLo, err := at(lo)
	if err != nil {
		return nil, err
	}
	tHi := tLo
	var ps Problems
	path := JoinPath(DecisionsPath, "surcharge.removeBy")
	limit := MaxFillThickness * MaxUnitWeight
	for tHi > by {
		lo, tLo = hi, tHi
		hi *= 2
		if hi > limit || hi > 64*math.Max(q0, surcharge(p, math.Inf(1))) {
			ps.Add(path, ErrOutOfRange, fmt.Sprintf("no surcharge up to %.4g kPa lets it come off by day %g", hi/2, by))
			return nil, ps
		}
		if _, tHi, err = at(hi); err != nil {
			return nil, err
		}
	}
	for tLo <= by {
		hi, tHi = lo, tLo
		lo /= 2
		if lo < 1e-3*q0 {
			break // even a sliver is enough
		}
		if _, tLo, err = at(lo); err != nil {
			return nil, err
		}
	}
	for range 40 {
		if hi/lo <= 1.002 || math.Abs(tHi-by) <= 0.002*by {
			break
		}
		mid := math.Sqrt(lo * hi)
		_, tm, err := at(mid)
		if err != nil {
			return nil, err
		}
		if tm > by {
			lo, tLo = mid, tm
		} else {
			hi, tHi = mid, tm
		}
	}
	n := &SurchargeNeed{By: by, Surcharge: hi, RemoveOn: tHi}
	if f := p.Loads[removal].Fill; f != nil {
		n.Thickness = hi / f.Gamma
	}
	return n, nil
}
