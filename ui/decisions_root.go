package ui

import (
	"errors"

	"porelight/solver"
)

// decisionsState is the state of the site decisions' own solves.
func (c *Root) decisionsState() *decisionsRun {
	if c.dec == nil {
		c.dec = &decisionsRun{}
	}
	return c.dec
}

// runDecisions works out the surcharge removal and the strength gain of
// the inputs now in the form, in the background (each is several solves).
func (c *Root) runDecisions() {
	s := c.decisionsState()
	if s.busy {
		return
	}
	if !c.form.Valid() {
		s.err = fixInputsFirst
		return
	}
	model := c.form.Model()
	d := model.Decisions
	if d == nil || (d.Surcharge == nil && d.Strength == nil) {
		return
	}
	g := s.gen.Add(1)
	s.busy, s.progress, s.err = true, 0, ""
	var plan *solver.SurchargePlan
	var strength *solver.StrengthResult
	parts := 0.0
	if d.Surcharge != nil {
		parts++
	}
	if d.Strength != nil {
		parts++
	}
	c.inBackground("the site decisions", func() bool { return s.gen.Load() == g }, func(f float64) { s.progress = f },
		func(opt *solver.Options) (err error) {
			in := solveInput(model)
			done := 0.0
			part := func() *solver.Options {
				o := *opt
				from := done / parts
				if opt.Progress != nil {
					o.Progress = func(f float64) bool { return opt.Progress(from + f/parts) }
				}
				done++
				return &o
			}
			if d.Surcharge != nil {
				if plan, err = solver.SurchargeRemoval(in, part()); err != nil {
					return err
				}
			}
			if d.Strength != nil {
				strength, err = solver.StrengthGain(in, part())
			}
			return err
		},
		func(err error) {
			if s.gen.Load() != g {
				return
			}
			s.busy = false
			switch {
			case errors.Is(err, solver.ErrCanceled):
			case err != nil:
				s.err = describeProblems(solver.AsProblems(err), 3)
			default:
				s.plan, s.strength, s.model = plan, strength, model
			}
		})
}

func (c *Root) cancelDecisions() {
	s := c.decisionsState()
	s.gen.Add(1)
	s.busy = false
}
