package ui

import (
	"errors"
	"sync/atomic"

	"porelight/solver"
)

// designState is the drain design helper's run: the search for the
// spacing (solver.DrainSpacing), in a goroutine that yields to the
// browser like a solve.
type designState struct {
	busy     bool
	progress float64
	err      string
	res      *solver.SpacingAnswer
	gen      atomic.Int64
}

func (c *Root) designState() *designState {
	if c.design == nil {
		c.design = &designState{}
	}
	return c.design
}

// runDesign starts the search on the current inputs.
func (c *Root) runDesign() {
	s := c.designState()
	if s.busy {
		return
	}
	if !c.form.Valid() {
		s.err, s.res = fixInputsFirst, nil
		return
	}
	model := c.form.Model()
	g := s.gen.Add(1)
	s.busy, s.progress, s.err, s.res = true, 0, "", nil
	var res *solver.SpacingAnswer
	c.inBackground("the design helper", func() bool { return s.gen.Load() == g }, func(f float64) { s.progress = f },
		func(opt *solver.Options) (err error) {
			res, err = solver.DrainSpacing(model, opt)
			return err
		},
		func(err error) {
			if s.gen.Load() != g {
				return
			}
			s.busy = false
			var ps solver.Problems
			switch {
			case errors.As(err, &ps):
				s.err = describeProblems(ps, 3)
			case err != nil:
				s.err = err.Error()
			default:
				s.res = res
			}
		})
}

// useSpacing puts the spacing found into the project.
func (c *Root) useSpacing(s float64) {
	c.form.Put("drains.spacing", float64(int(s*1000))/1000, 0)
	c.edited()
}
