package solver

import "errors"

// ErrCanceled is returned by Solve when Options.Progress asks it to stop.
var ErrCanceled = errors.New("solve canceled")

// Options are the run-time choices of one solve; they are not part of the
// project file. A nil *Options means the defaults.
type Options struct {
	// Progress, when not nil, is called from time to time with the
	// fraction of the work done, in [0, 1]. Returning false cancels the
	// solve, which then returns ErrCanceled. A browser caller uses it to
	// let the page breathe.
	Progress func(fraction float64) (carryOn bool)
}

// Solve validates p and computes the steady seepage state and, when the
// project has loads, the consolidation and settlement results. A project
// that fails validation returns its Problems; Solve does not change p.
func Solve(p *Project, opt *Options) (*Result, error) {
	if err := Validate(p); err != nil {
		return nil, err
	}
	c := newColumn(p)
	r := &Result{Warnings: []Warning{}}
	warn := func(path, msg string) { r.Warnings = append(r.Warnings, Warning{Path: path, Message: msg}) }
	oddValues(p, warn)
	r.Steady = c.steady(warn)
	r.Stats = Stats{Nodes: c.m.nodes(), Elements: c.m.elements(), Order: c.m.order}
	r.Summary.Flux = r.Steady.Flux
	if hasConsolidation(p) {
		if err := c.consolidate(&r.Steady, r, opt, warn); err != nil {
			return nil, err
		}
	}
	for _, l := range r.Steady.Layers {
		if l.HeaveFactor != nil && (r.Summary.MinHeaveFactor == nil || *l.HeaveFactor < *r.Summary.MinHeaveFactor) {
			r.Summary.MinHeaveFactor = ptr(*l.HeaveFactor)
		}
	}
	return r, nil
}
