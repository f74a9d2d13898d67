package ui

import (
	"errors"
	"reflect"
	"slices"
	"sync/atomic"

	"porelight/solver"
	"porelight/solver/monitor"
	"porelight/ui/form"
)

// Field monitoring in the page: what the solve needs from the records,
// and the back-analysis run from the results column.
//
// A piezometer record whose depth is not among the project's output
// depths (Project.Piezometers) is added to the depths of the solve, not
// to the project: the prediction at the instrument is then always there
// to compare with, the project file keeps the depths the user chose, and
// the piezometer plot shows the extra depth like the others. Editing the
// records alone does not solve again: only the comparison changes.

// solveInput is the project solved for model: model itself, or a copy
// with the depths of its piezometer records added to the output depths.
func solveInput(model *solver.Project) *solver.Project {
	m := model.Monitoring
	if m == nil || len(m.Piezometers) == 0 {
		return model
	}
	var extra []float64
	for _, r := range m.Piezometers {
		if !slices.ContainsFunc(model.Piezometers, func(z float64) bool { return solver.SameDepth(z, r.Depth) }) &&
			!slices.ContainsFunc(extra, func(z float64) bool { return solver.SameDepth(z, r.Depth) }) {
			extra = append(extra, r.Depth)
		}
	}
	if len(extra) == 0 {
		return model
	}
	q := *model
	q.Piezometers = append(slices.Clone(model.Piezometers), extra...)
	return &q
}

// sameSolve reports whether a and b solve to the same results: they
// differ at most in their field records (beyond the depths those add).
func sameSolve(a, b *solver.Project) bool {
	if a == nil || b == nil {
		return false
	}
	x, y := *solveInput(a), *solveInput(b)
	x.Monitoring, y.Monitoring = nil, nil
	return reflect.DeepEqual(&x, &y)
}

// reuse takes model as the project of the results shown when only its
// field records changed, and reports whether it did. It runs in commit,
// with the render lock held.
func (c *Root) reuse(model *solver.Project) bool {
	if c.busy || c.result == nil || c.solveErr != "" || !sameSolve(model, c.resultFor) {
		return false
	}
	c.resultFor = model
	return true
}

// hasRecords reports whether the project of the results has field
// records to compare with.
func (c *Root) hasRecords() bool {
	if c.resultFor == nil || c.resultFor.Monitoring == nil {
		return false
	}
	m := c.resultFor.Monitoring
	return len(m.Plates)+len(m.Piezometers) > 0
}

// download offers a file made by a monitoring panel.
func (c *Root) download(name, mime string, data []byte) {
	base := "porelight-project"
	if c.resultFor != nil {
		base = baseName(c.resultFor)
	}
	if err := c.host().Download(base+"-"+name, mime, data); err != nil {
		c.note("error", "Could not export: "+err.Error())
	}
}

// fitState is the back-analysis: what to fit, the run under way and its
// outcome. Root owns it, so that it outlives renders and the plots can
// draw the fitted prediction.
type fitState struct {
	layers map[int]bool // layers whose k is fitted
	ch     map[int]bool // layers whose ch (toward the drains) is fitted
	scale  bool         // also fit the settlement scale
	data   monitor.FitData

	gen      atomic.Int64 // bumped by every run and cancel; an older run stops
	busy     bool
	progress float64
	canceled bool
	err      string
	model    *solver.Project // the model of the last run
	res      *monitor.FitResult
	// applied is set once the fitted values are in the project; before
	// holds the layers as they were, for Revert.
	applied bool
	before  []solver.Layer
}

func (c *Root) fitState() *fitState {
	if c.fit == nil {
		c.fit = &fitState{layers: map[int]bool{}, ch: map[int]bool{}}
	}
	return c.fit
}

// spec is the FitSpec of the choices made.
func (s *fitState) spec(nLayers int) monitor.FitSpec {
	spec := monitor.FitSpec{Scale: s.scale, Data: s.data}
	for i := range nLayers {
		if s.layers[i] {
			spec.Layers = append(spec.Layers, i)
		}
	}
	for i := range nLayers {
		if s.ch[i] {
			spec.ChLayers = append(spec.ChLayers, i)
		}
	}
	return spec
}

// runFit starts the back-analysis of the current inputs. Like a solve, it
// runs in a goroutine that yields to the browser every 40 ms or so, and
// stops when cancelled.
func (c *Root) runFit() {
	s := c.fitState()
	if s.busy {
		return
	}
	if !c.form.Valid() {
		s.err, s.res = "Some inputs need attention: fix them first, so that the fit works on what you see.", nil
		return
	}
	model := c.form.Model()
	spec := s.spec(len(model.Layers))
	if model.Drains == nil {
		spec.ChLayers = nil // the choices stay for when drains come back
	}
	if len(spec.Layers) == 0 && len(spec.ChLayers) == 0 && !spec.Scale {
		s.err, s.res = "Choose at least one layer, or the settlement scale, to fit.", nil
		return
	}
	g := s.gen.Add(1)
	s.busy, s.progress, s.canceled, s.err = true, 0, false, ""
	s.res, s.model, s.applied, s.before = nil, model, false, nil
	fit := c.BackFit
	if fit == nil {
		fit = monitor.BackFit
	}
	var res *monitor.FitResult
	c.inBackground("the back-analysis", func() bool { return s.gen.Load() == g }, func(f float64) { s.progress = f },
		func(opt *solver.Options) (err error) {
			res, err = fit(solveInput(model), spec, opt)
			return err
		},
		func(err error) { s.finish(g, res, err) })
}

// finish takes the outcome of run g, if it is still the latest.
func (s *fitState) finish(g int64, res *monitor.FitResult, err error) {
	if s.gen.Load() != g {
		return
	}
	s.busy = false
	switch {
	case errors.Is(err, solver.ErrCanceled):
		s.canceled = true
	case err != nil:
		s.err = fitError(err)
	case res == nil:
		s.err = "the back-analysis returned nothing"
	default:
		s.res = res
	}
}

// fitError says why a fit was refused, in the solver's words: the
// message alone for the choices of the fit panel (monitor.FitSpecPath
// and below), "path: message" for a field of the project.
func fitError(err error) string {
	return describeProblemsAt(solver.AsProblems(err), 5, func(path string) bool { return form.Under(path, monitor.FitSpecPath) })
}

func (c *Root) cancelFit() {
	s := c.fitState()
	if !s.busy {
		return
	}
	s.gen.Add(1)
	s.busy, s.progress, s.canceled = false, 0, true
}

// fitOverlay is the fitted result to draw beside the prediction: while
// the fit is not applied and was made for the inputs of the results shown.
func (c *Root) fitOverlay() *solver.Result {
	s := c.fit
	if s == nil || s.res == nil || s.applied || !sameSolve(s.model, c.resultFor) {
		return nil
	}
	return s.res.Result
}

// applyFit copies the fitted k (and, with the settlement scale, mv) into
// the project: an edit like any other, which solves again. The layers as
// they were are kept for revertFit.
func (c *Root) applyFit() {
	s := c.fitState()
	if s.res == nil || s.res.Project == nil || s.applied {
		return
	}
	d := c.form.Draft()
	if !reflect.DeepEqual(d.Layers, s.model.Layers) || len(s.res.Project.Layers) != len(d.Layers) {
		c.note("error", "The layers were edited after the fit; run the fit again before applying it.")
		return
	}
	s.before = slices.Clone(d.Layers)
	// The fitted values go in to fitFigures significant figures (in the
	// units shown): their ranges are far wider than the last of them.
	for i, l := range s.res.Project.Layers {
		if l.K != d.Layers[i].K {
			c.form.Put(lp(i, "k"), l.K, fitFigures)
		}
		if l.Mv != d.Layers[i].Mv {
			c.form.Put(lp(i, "mv"), l.Mv, fitFigures)
		}
		if l.Ch != d.Layers[i].Ch || l.KhKv != d.Layers[i].KhKv {
			c.form.Put(lp(i, "khKv"), l.KhKv, fitFigures)
			c.form.Put(lp(i, "ch"), l.Ch, fitFigures)
		}
	}
	s.applied = true
	c.note("info", "Applied the fitted values to the layers; “Revert” puts the previous k and mv back.")
	c.edited()
}

// revertFit puts back the k and mv the layers had before applyFit.
func (c *Root) revertFit() {
	s := c.fitState()
	if !s.applied || s.before == nil {
		return
	}
	d := c.form.Draft()
	if len(d.Layers) != len(s.before) {
		c.note("error", "Layers were added or removed since the fit was applied, so it cannot be reverted; set k and mv by hand.")
		return
	}
	for i, l := range s.before {
		if l.K != d.Layers[i].K {
			_ = c.form.SetValue(lp(i, "k"), l.K)
		}
		if l.Mv != d.Layers[i].Mv {
			_ = c.form.SetValue(lp(i, "mv"), l.Mv)
		}
		if l.Ch != d.Layers[i].Ch || l.KhKv != d.Layers[i].KhKv {
			_ = c.form.SetValue(lp(i, "khKv"), l.KhKv)
			_ = c.form.SetValue(lp(i, "ch"), l.Ch)
		}
	}
	s.applied, s.before = false, nil
	c.note("info", "Reverted: the layers have the k and mv they had before the fit was applied.")
	c.edited()
}

// fitFigures is the number of significant figures of a fitted value
// applied to the project.
const fitFigures = 3

// setAsaoka saves the choices for Asaoka's method in the project; the
// results are reused, as for any edit of the field records.
func (c *Root) setAsaoka(a *solver.AsaokaSettings) {
	c.form.SetAsaoka(a)
	c.edited()
}
