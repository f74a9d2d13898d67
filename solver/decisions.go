package solver

import "fmt"

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

// layerSeries is the number of per-layer series a solve of p keeps at
// every step: one per layer when a residual settlement is asked.
func layerSeries(p *Project) int {
	if p.Decisions != nil && p.Decisions.Handover > 0 {
		return len(p.Layers)
	}
	return 0
}
