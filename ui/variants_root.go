package ui

import (
	"context"
	"errors"
	"sync"
	"sync/atomic"

	"porelight/solver"
	optcmp "porelight/solver/compare"
)

// WideSolver is a Solver whose solves may use one worker per core (the
// page's own solves keep to the pool's usual size, leaving a core to the
// page): wasm/ queues them like the Monte Carlo's batches.
type WideSolver interface {
	SolveWide(ctx context.Context, project []byte, progress func(float64)) ([]byte, error)
}

type wideSolver struct{ w WideSolver }

func (s wideSolver) Solve(ctx context.Context, project []byte, progress func(float64)) ([]byte, error) {
	return s.w.SolveWide(ctx, project, progress)
}

// compareState is the last comparison of the options.
type compareState struct {
	busy     bool
	err      string
	outcomes []optcmp.Outcome
	model    *solver.Project
	done     int
	gen      atomic.Int64
}

func (c *Root) compareState() *compareState {
	if c.cmp == nil {
		c.cmp = &compareState{}
	}
	return c.cmp
}

// runCompare solves the project as given and every option, each as a
// project of its own, in the solve workers when there are (all queued at
// once, so that several workers share them), in the page otherwise.
func (c *Root) runCompare() {
	s := c.compareState()
	if s.busy {
		return
	}
	if !c.form.Valid() {
		s.err = fixInputsFirst
		return
	}
	model := c.form.Model()
	names, projects := optcmp.Projects(model)
	date := solver.ResolveUncertaintyDate(model)
	g := s.gen.Add(1)
	s.busy, s.err, s.outcomes, s.model, s.done = true, "", make([]optcmp.Outcome, len(projects)), model, 0
	sv, workers := c.host().(Solver)
	if w, ok := c.host().(WideSolver); ok {
		sv, workers = wideSolver{w}, true
	}
	solveOne := func(i int) optcmp.Outcome {
		if workers && c.Env != nil {
			data, err := solveInput(projects[i]).MarshalBinary()
			if err == nil {
				out, err := sv.Solve(context.Background(), data, func(float64) {})
				if err == nil {
					r, err := decodeAnswer(out)
					if err != nil {
						return optcmp.Outcome{Name: names[i], Problem: describeProblems(solver.AsProblems(err), 2)}
					}
					return optcmp.Outcome{Name: names[i], Result: r, Figures: optcmp.Take(r, date)}
				}
				if !errors.Is(err, ErrNoWorker) {
					return optcmp.Outcome{Name: names[i], Problem: err.Error()}
				}
			}
		}
		return optcmp.One(names[i], solveInput(projects[i]), date)
	}
	if c.Env == nil {
		for i := range projects {
			s.outcomes[i] = solveOne(i)
		}
		s.busy, s.done = false, len(projects)
		return
	}
	go func() {
		var wg sync.WaitGroup
		for i := range projects {
			wg.Add(1)
			go func() {
				defer wg.Done()
				o := solveOne(i)
				c.Env.Lock()
				if s.gen.Load() == g {
					s.outcomes[i] = o
					s.done++
				}
				c.Env.UnlockRender()
			}()
		}
		wg.Wait()
		c.Env.Lock()
		if s.gen.Load() == g {
			s.busy = false
		}
		c.Env.UnlockRender()
	}()
}
