package form

import (
	"slices"

	"porelight/solver"
)

// Site decisions: the questions of Project.Decisions. Numbers are typed
// by path ("decisions.handover", "decisions.surcharge.removeBy",
// "decisions.strength.fs", "decisions.strength.laws[0].s"); the methods
// below make the parts that are switched on and off or chosen.

// cloneDecisions copies the questions deeply (nil stays nil).
func cloneDecisions(d *solver.Decisions) *solver.Decisions {
	if d == nil {
		return nil
	}
	c := *d
	if d.Surcharge != nil {
		s := *d.Surcharge
		if s.Removal != nil {
			r := *s.Removal
			s.Removal = &r
		}
		c.Surcharge = &s
	}
	if d.Strength != nil {
		s := *d.Strength
		s.Times = slices.Clone(s.Times)
		s.Laws = slices.Clone(s.Laws)
		for i := range s.Laws {
			s.Laws[i].Su0 = slices.Clone(s.Laws[i].Su0)
		}
		c.Strength = &s
	}
	return &c
}

func (f *Form) decisions() *solver.Decisions {
	if f.draft.Decisions == nil {
		f.draft.Decisions = &solver.Decisions{}
	}
	return f.draft.Decisions
}

// SetSurcharge asks the surcharge question (on) or drops it with what was
// typed for it.
func (f *Form) SetSurcharge(on bool) {
	d := f.decisions()
	switch {
	case on && d.Surcharge == nil:
		d.Surcharge = &solver.SurchargeDesign{}
	case !on:
		d.Surcharge = nil
		f.dropRaw("decisions.surcharge")
	}
	f.check()
}

// SetWithSecondary makes the surcharge's target include the permanent
// load's secondary compression to the design life, or not.
func (f *Form) SetWithSecondary(on bool) {
	d := f.decisions()
	if d.Surcharge == nil {
		d.Surcharge = &solver.SurchargeDesign{}
	}
	d.Surcharge.WithSecondary = on
	f.check()
}

// StrengthLaw returns the index in decisions.strength.laws of layer's
// law, or −1.
func StrengthLaw(p *solver.Project, layer int) int {
	if p.Decisions == nil || p.Decisions.Strength == nil {
		return -1
	}
	for i, l := range p.Decisions.Strength.Laws {
		if l.Layer == layer {
			return i
		}
	}
	return -1
}

// SetStrengthLaw gives layer the law named (solver.StrengthSHANSEP,
// StrengthRatio or StrengthMeasured, with starting values of common
// practice: S = 0.22, m = 0.8, su/σ'p = 0.22, a gain of 0.22), or takes its
// law away with "". The laws after a removed one are renumbered with
// their typed text.
func (f *Form) SetStrengthLaw(layer int, law string) {
	d := f.decisions()
	i := StrengthLaw(&f.draft, layer)
	if law == "" {
		if i < 0 {
			return
		}
		s := d.Strength
		s.Laws = slices.Delete(s.Laws, i, i+1)
		f.remap("decisions.strength.laws", Removed(i))
		if len(s.Laws) == 0 {
			d.Strength = nil
			f.dropRaw("decisions.strength")
		}
		f.check()
		return
	}
	if d.Strength == nil {
		d.Strength = &solver.StrengthCheck{}
	}
	l := solver.StrengthLaw{Layer: layer, Law: law}
	switch law {
	case solver.StrengthSHANSEP:
		l.S, l.M = 0.22, 0.8
	case solver.StrengthRatio:
		l.Ratio = 0.22
	case solver.StrengthMeasured:
		l.Gain = 0.22
	}
	if i < 0 {
		d.Strength.Laws = append(d.Strength.Laws, l)
	} else {
		if d.Strength.Laws[i].Law == law {
			return
		}
		l.Su0 = d.Strength.Laws[i].Su0
		d.Strength.Laws[i] = l
		f.dropRaw(solver.IndexPath("decisions.strength.laws", i))
	}
	f.check()
}

// renumberStrength follows a structural edit of the layers: each law
// stays with its layer; the law of a removed layer goes with it.
func (f *Form) renumberStrength(to func(old int) int) {
	d := f.draft.Decisions
	if d == nil || d.Strength == nil {
		return
	}
	s := d.Strength
	for i := len(s.Laws) - 1; i >= 0; i-- {
		if j := to(s.Laws[i].Layer); j >= 0 {
			s.Laws[i].Layer = j
			continue
		}
		s.Laws = slices.Delete(s.Laws, i, i+1)
		f.remap("decisions.strength.laws", Removed(i))
	}
}

// SetSurchargeRemoval names the stage that takes the surcharge off (its
// index in loads), or leaves the choice to the solver (the last stage
// that takes load off) with i < 0.
func (f *Form) SetSurchargeRemoval(i int) {
	d := f.decisions()
	if d.Surcharge == nil {
		d.Surcharge = &solver.SurchargeDesign{}
	}
	d.Surcharge.Removal = nil
	if i >= 0 {
		d.Surcharge.Removal = &i
	}
	f.check()
}

// renumberRemoval follows the removal of a load stage: the surcharge's
// removal stays with its stage, and goes back to the solver's choice
// when its stage is removed.
func (f *Form) renumberRemoval(to func(old int) int) {
	d := f.draft.Decisions
	if d == nil || d.Surcharge == nil || d.Surcharge.Removal == nil {
		return
	}
	if j := to(*d.Surcharge.Removal); j >= 0 {
		d.Surcharge.Removal = &j
		return
	}
	d.Surcharge.Removal = nil
}
