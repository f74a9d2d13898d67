package solver

import (
	"errors"
	"fmt"
	"math"
	"reflect"
	"strings"
)

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
	// NoDrainReference skips the two extra solves, vertical flow alone
	// and radial flow alone, that give Result.Drains its Uv and Uh (they
	// stay empty); the rest of Result.Drains is filled. The design
	// helper needs only Us.
	NoDrainReference bool

	// watch, when set, follows the nodal stresses of the main
	// consolidation (the surcharge design's check point by point).
	watch *watcher
}

// watcher sees the final nodal total stress and pore pressure change of a
// consolidation once (with the initial effective stress s0), then their
// values after every recorded step.
type watcher struct {
	final func(sigInf, uInf, s0 []float64)
	step  func(t float64, sigma, u []float64)
}

// Solve validates p and computes the steady seepage state and, when the
// project has loads, the consolidation and settlement results. Solve does
// not change p.
//
// Every error but ErrCanceled is a Problems list: the validation problems
// of p, or a problem with reason ErrNumerical when the equations cannot be
// factorised (at the layer's k, naming the layer and depth; no result is
// returned) or an output is not finite (at the output's path, see
// CheckFinite). A Result that is returned holds only finite numbers.
func Solve(p *Project, opt *Options) (*Result, error) {
	if err := Validate(p); err != nil {
		return nil, err
	}
	return solveValid(p, opt)
}

// solveValid is Solve after validation: the tests give it projects
// Validate refuses, to reach the numerical refusals.
func solveValid(p *Project, opt *Options) (*Result, error) {
	c := newColumn(p)
	r := &Result{Warnings: []Warning{}}
	warn := func(path, msg string) { r.Warnings = append(r.Warnings, Warning{Path: path, Message: msg}) }
	oddValues(p, warn)
	drainWarnings(p, warn)
	loadWarnings(p, c.height, warn)
	digWarnings(p, warn)
	groundwaterWarnings(p, c.height, warn)
	st, err := c.steady(warn)
	if err != nil {
		return nil, err
	}
	r.Steady = st
	r.Stats = Stats{Nodes: c.m.Nodes(), Elements: c.m.Elements(), Order: c.m.Order}
	r.Summary.Flux = r.Steady.Flux
	if HasConsolidation(p) {
		main, ref := opt, opt
		if opt != nil && opt.watch != nil {
			ref = &Options{Progress: opt.Progress} // the watch is the main solve's
		}
		if c.drains != nil && opt != nil && opt.Progress != nil && !opt.NoDrainReference {
			// Two thirds of the work are the solves with vertical flow
			// alone and with radial flow alone.
			main = &Options{Progress: func(f float64) bool { return opt.Progress(f / 3) }, watch: opt.watch}
			ref = &Options{Progress: func(f float64) bool { return opt.Progress(1.0/3 + 2*f/3) }}
		}
		if err := c.consolidate(&r.Steady, r, main, warn); err != nil {
			return nil, err
		}
		if c.drains != nil {
			if err := c.drainReference(&r.Steady, r, ref, opt == nil || !opt.NoDrainReference); err != nil {
				return nil, err
			}
		}
		r.Consolidation.Stages = c.stageStresses()
	}
	if r.Consolidation == nil {
		// The checks of the steady state: initial and long term alike.
		newChecks(c, &r.Steady).summarise(r)
	}
	if path, v, ok := firstNonFinite(reflect.ValueOf(r).Elem(), ""); ok {
		var ps Problems
		ps.Add(c.blame(path), ErrNumerical, fmt.Sprintf("the result %s came out as %g; the inputs are legal but too extreme for floating point — look for unit weights, permeabilities or loads far outside the range of soils", JoinPath(ResultPath, path), v))
		return nil, ps
	}
	return r, nil
}

// ResultPath is the root of the paths of result fields in problems:
// "result.consolidation.series.up[3]". No project field has this name.
const ResultPath = "result"

// CheckFinite returns nil when every number in r is finite, and otherwise
// a Problems list of one ErrNumerical problem at the JSON path of the
// first NaN or ±Inf under ResultPath ("result.steady.head[12]"). Solve
// makes the same check before returning, but puts its problem at the
// input most likely at fault (a layer or a piezometer) and names the
// result path in the message; a program that builds or changes a Result
// itself may call CheckFinite before encoding (JSON has no NaN or Inf).
// O(size of r).
func CheckFinite(r *Result) error {
	if r == nil {
		return nil
	}
	path, v, ok := firstNonFinite(reflect.ValueOf(r).Elem(), ResultPath)
	if !ok {
		return nil
	}
	var ps Problems
	ps.Add(path, ErrNumerical, fmt.Sprintf("came out as %g; the inputs are legal but too extreme for floating point — look for unit weights, permeabilities or loads far outside the range of soils", v))
	return ps
}

// blame is the project field most likely at fault for a non-finite output
// at result path out: the layer of a per-layer figure, the layer holding
// the node of a per-node figure (a profile or an isochrone), the
// piezometer of a piezometer series, and the layers as a whole otherwise.
// It never returns "", so the problem always has a path.
func (c *column) blame(out string) string {
	steps, err := ParsePath(out)
	if err != nil || len(steps) < 2 {
		return "layers"
	}
	last := steps[len(steps)-1]
	switch {
	case steps[1].Name == "layers" && steps[1].Index >= 0 && steps[1].Index < len(c.p.Layers):
		return IndexPath("layers", steps[1].Index)
	case steps[0].Name == "steady" && len(steps) == 2 && last.Index >= 0 && last.Index < c.m.Nodes(),
		steps[0].Name == "consolidation" && steps[1].Name == "isochrones" && last.Index >= 0 && last.Index < c.m.Nodes():
		return IndexPath("layers", c.layerOfNode(last.Index))
	case len(steps) > 2 && steps[2].Name == "piezometers" && steps[2].Index >= 0 && steps[2].Index < len(c.p.Piezometers):
		return IndexPath("piezometers", steps[2].Index)
	}
	return "layers"
}

// firstNonFinite walks v (a Result or a part of it) and returns the JSON
// path of its first NaN or ±Inf float, with the value: path, then the
// fields and indices below it. O(size of v); Solve asks it of every
// result, so the path is made only once a value is found.
func firstNonFinite(v reflect.Value, path string) (string, float64, bool) {
	steps, f, ok := nonFinite(v)
	if !ok {
		return "", 0, false
	}
	for i := len(steps) - 1; i >= 0; i-- { // outermost last
		if s := steps[i]; s.name != "" {
			path = JoinPath(path, s.name)
		} else {
			path = IndexPath(path, s.index)
		}
	}
	return path, f, true
}

// pathStep is a field (name) or an index of firstNonFinite's path.
type pathStep struct {
	name  string
	index int
}

// nonFinite is firstNonFinite's walk: the steps of the path below v come
// back innermost first, and are made only on the way out from a find.
func nonFinite(v reflect.Value) ([]pathStep, float64, bool) {
	switch v.Kind() {
	case reflect.Float64:
		if f := v.Float(); math.IsNaN(f) || math.IsInf(f, 0) {
			return nil, f, true
		}
	case reflect.Pointer:
		if !v.IsNil() {
			return nonFinite(v.Elem())
		}
	case reflect.Struct:
		t := v.Type()
		for i := range t.NumField() {
			name, _, _ := strings.Cut(t.Field(i).Tag.Get("json"), ",")
			if name == "" || name == "-" {
				continue
			}
			if steps, f, ok := nonFinite(v.Field(i)); ok {
				return append(steps, pathStep{name: name}), f, true
			}
		}
	case reflect.Slice:
		if xs, ok := v.Interface().([]float64); ok {
			for i, f := range xs {
				if math.IsNaN(f) || math.IsInf(f, 0) {
					return []pathStep{{index: i}}, f, true
				}
			}
			return nil, 0, false
		}
		for i := range v.Len() {
			if steps, f, ok := nonFinite(v.Index(i)); ok {
				return append(steps, pathStep{index: i}), f, true
			}
		}
	}
	return nil, 0, false
}
