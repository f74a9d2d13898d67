package ui

import (
	"errors"
	"fmt"
	"runtime/debug"
	"sync/atomic"
	"time"

	"porelight/solver"
	"porelight/ui/form"
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
		s.err, s.res = "Some inputs need attention: fix them first.", nil
		return
	}
	model := c.form.Model()
	g := s.gen.Add(1)
	s.busy, s.progress, s.err, s.res = true, 0, "", nil
	work := func() (res *solver.SpacingAnswer, err error) {
		defer func() {
			if r := recover(); r != nil {
				err = fmt.Errorf("internal error in the design helper: %v\n%s", r, debug.Stack())
			}
		}()
		last := time.Now()
		opt := &solver.Options{Progress: func(f float64) bool {
			if c.Env != nil && time.Since(last) > 40*time.Millisecond {
				c.Env.Lock()
				s.progress = f
				c.Env.UnlockRender()
				c.host().Yield()
				last = time.Now()
			}
			return s.gen.Load() == g
		}}
		return solver.DrainSpacing(model, opt)
	}
	finish := func(res *solver.SpacingAnswer, err error) {
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
	}
	if c.Env == nil {
		finish(work())
		return
	}
	go func() {
		res, err := work()
		c.Env.Lock()
		finish(res, err)
		c.Env.UnlockRender()
	}()
}

// useSpacing puts the spacing found into the project.
func (c *Root) useSpacing(s float64) {
	c.form.Edit("drains.spacing", form.FormatNumber(float64(int(s*1000))/1000))
	c.edited()
}
