package solver

import (
	"fmt"
	"math"
)

// DecisionsPath is the path of Project.Decisions in problems.
const DecisionsPath = "decisions"

// validDecisions checks Project.Decisions: the handover day before the
// design life, and a surcharge question that names a stage which removes
// load after one that adds it.
func validDecisions(ps *Problems, p *Project) {
	d := p.Decisions
	if d == nil {
		return
	}
	if d.Handover != 0 {
		at := JoinPath(DecisionsPath, "handover")
		if bounded(ps, at, d.Handover, 0, MaxTime, "days") {
			if life := ResolveDesignLife(p); d.Handover >= life {
				ps.Add(at, ErrConflict, fmt.Sprintf("day %g is not before the design life (designLife, %g days)", d.Handover, life))
			}
		}
	}
	if s := d.Surcharge; s != nil {
		at := JoinPath(DecisionsPath, "surcharge")
		if s.RemoveBy != 0 {
			bounded(ps, JoinPath(at, "removeBy"), s.RemoveBy, 0, MaxTime, "days")
		}
		if _, _, err := surchargeStages(p); err != nil {
			ps.Add(err.Path, err.Err, err.Message)
		}
	}
	if s := d.Strength; s != nil {
		validStrength(ps, s, len(p.Layers))
	}
}

// validStrength checks the strength laws, the factor of safety and the
// profile days.
func validStrength(ps *Problems, s *StrengthCheck, layers int) {
	at := JoinPath(DecisionsPath, "strength")
	if s.FS == 0 {
		ps.Add(JoinPath(at, "fs"), ErrRequired, "give the factor of safety of the bearing check (local rules set it)")
	} else {
		bounded(ps, JoinPath(at, "fs"), s.FS, 1, MaxStrengthFS, "")
	}
	if len(s.Laws) == 0 {
		ps.Add(JoinPath(at, "laws"), ErrRequired, "give the undrained strength of at least one layer")
	}
	seen := map[int]bool{}
	for i, l := range s.Laws {
		li := IndexPath(JoinPath(at, "laws"), i)
		switch {
		case l.Layer < 0 || l.Layer >= layers:
			ps.Add(JoinPath(li, "layer"), ErrOutOfRange, fmt.Sprintf("no layer %d: the column has %d", l.Layer+1, layers))
		case seen[l.Layer]:
			ps.Add(JoinPath(li, "layer"), ErrConflict, fmt.Sprintf("layer %d has a law already", l.Layer+1))
		}
		seen[l.Layer] = true
		switch l.Law {
		case StrengthSHANSEP:
			bounded(ps, JoinPath(li, "s"), l.S, 0, MaxStrengthRatio, "")
			if finite(ps, JoinPath(li, "m"), l.M) {
				inRange(ps, JoinPath(li, "m"), l.M, 0, MaxStrengthExponent, "")
			}
		case StrengthRatio:
			bounded(ps, JoinPath(li, "ratio"), l.Ratio, 0, MaxStrengthRatio, "")
		case StrengthMeasured:
			if len(l.Su0) == 0 {
				ps.Add(JoinPath(li, "su0"), ErrRequired, "give the measured su at one depth at least")
			}
			validProfile(ps, JoinPath(li, "su0"), l.Su0, MaxSu, "kPa")
			for j, dv := range l.Su0 {
				if !(dv.Value > 0) {
					ps.Add(JoinPath(IndexPath(JoinPath(li, "su0"), j), "value"), ErrNotPositive, fmt.Sprintf("got %g", dv.Value))
				}
			}
			upTo(ps, JoinPath(li, "gain"), l.Gain, MaxStrengthRatio, "")
		default:
			ps.Add(JoinPath(li, "law"), ErrOutOfRange, fmt.Sprintf("got %q, the laws are %q, %q and %q", l.Law, StrengthSHANSEP, StrengthRatio, StrengthMeasured))
		}
	}
	if len(s.Times) > MaxStrengthTimes {
		ps.Add(JoinPath(at, "times"), ErrTooLarge, fmt.Sprintf("%d days, the limit is %d", len(s.Times), MaxStrengthTimes))
	}
	for i, t := range s.Times {
		ti := IndexPath(JoinPath(at, "times"), i)
		if upTo(ps, ti, t, MaxTime, "days") && i > 0 && t <= s.Times[i-1] {
			ps.Add(ti, ErrNotSorted, fmt.Sprintf("%g follows %g", t, s.Times[i-1]))
		}
	}
}

// surchargeStages returns the stage that takes the surcharge off
// (Decisions.Surcharge.Removal, or the last stage that removes load) and
// the lift that placed it: the last stage before it that adds load. The
// project's loads must be valid otherwise; the problem names the field.
func surchargeStages(p *Project) (removal, lift int, err *Problem) {
	at := JoinPath(DecisionsPath, "surcharge.removal")
	s := p.Decisions.Surcharge
	removal = -1
	if s.Removal != nil {
		removal = *s.Removal
		if removal < 0 || removal >= len(p.Loads) {
			return 0, 0, &Problem{Path: at, Err: ErrOutOfRange, Message: fmt.Sprintf("no stage %d: the project has %d load stages", removal+1, len(p.Loads))}
		}
		if !(p.Loads[removal].Pressure() < 0) {
			return 0, 0, &Problem{Path: at, Err: ErrConflict, Message: fmt.Sprintf("stage %d does not remove load (its q or fill thickness must be negative)", removal+1)}
		}
	} else {
		for i, l := range p.Loads {
			if l.Pressure() < 0 {
				removal = i
			}
		}
		if removal < 0 {
			return 0, 0, &Problem{Path: JoinPath(DecisionsPath, "surcharge"), Err: ErrRequired, Message: "no load stage takes a surcharge off: add a stage with a negative q or fill thickness after the lift that places it"}
		}
	}
	lift = -1
	r := p.Loads[removal]
	for i, l := range p.Loads {
		if i != removal && l.Pressure() > 0 && l.Start+l.Ramp <= r.Start && (lift < 0 || l.Start >= p.Loads[lift].Start) {
			lift = i
		}
	}
	if lift < 0 {
		return 0, 0, &Problem{Path: at, Err: ErrConflict, Message: fmt.Sprintf("no stage that adds load is complete before stage %d starts to take it off", removal+1)}
	}
	if (r.Fill == nil) != (p.Loads[lift].Fill == nil) {
		return 0, 0, &Problem{Path: at, Err: ErrConflict, Message: fmt.Sprintf("stage %d and the lift it takes off (stage %d) must both be fills or both pressures", removal+1, lift+1)}
	}
	if -r.Pressure() > p.Loads[lift].Pressure() {
		return 0, 0, &Problem{Path: at, Err: ErrConflict, Message: fmt.Sprintf("stage %d takes off %.4g kPa, more than the lift before it (stage %d) placed, %.4g kPa", removal+1, -r.Pressure(), lift+1, p.Loads[lift].Pressure())}
	}
	return removal, lift, nil
}

// designOptions are the options of the solves of a design helper (the
// surcharge, the strength gain): no reference solves for the drains, and
// opt's Progress (if any) over a run of solves whose number is not known
// ahead: the k-th solve (from 0) covers [1 − 2⁻ᵏ, 1 − 2⁻ᵏ⁻¹] of the
// fraction reported, so it only grows. A solve's fraction falling back
// marks the next solve.
func designOptions(opt *Options) *Options {
	o := &Options{NoDrainReference: true}
	if opt == nil || opt.Progress == nil {
		return o
	}
	k, last := 0, 0.0
	o.Progress = func(f float64) bool {
		if f < last {
			k++
		}
		last = f
		w := math.Ldexp(1, -k)
		return opt.Progress(1 - w + w*f/2)
	}
	return o
}

// layerSeries is the number of per-layer series a solve of p keeps at
// every step: one per layer when a residual settlement is asked.
func layerSeries(p *Project) int {
	if p.Decisions != nil && p.Decisions.Handover > 0 {
		return len(p.Layers)
	}
	return 0
}
