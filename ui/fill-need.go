package ui

import (
	"errors"
	"fmt"
	"slices"
	"strconv"
	"sync/atomic"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/ui/form"
	"porelight/ui/units"
)

// fillNeed is the state of the "fill needed" helper: which fill stage,
// the finished level wanted and the day it is wanted by, as typed, and
// the thickness found (solver.FillThickness).
type fillNeed struct {
	stage      int    // index into Project.Loads
	level, day string // as typed
	busy       bool
	progress   float64
	gen        atomic.Int64
	err        string
	thickness  *float64
	forStage   int
	levelNum   float64
	dayNum     float64
	model      *solver.Project // the inputs the thickness was found for
}

// FillNeed finds the thickness of a fill stage that leaves the finished
// surface at a chosen level on a chosen day, after the predicted
// settlement; Apply copies it into the stage.
type FillNeed struct {
	S      *fillNeed
	F      *form.Form
	Run    func()
	Cancel func()
	Apply  func()
}

// fillStages are the stages that can be sized: fills of positive thickness.
func fillStages(p *solver.Project) []int {
	var out []int
	for i, l := range p.Loads {
		if l.Fill != nil && l.Fill.Thickness > 0 {
			out = append(out, i)
		}
	}
	return out
}

func (c *FillNeed) stages() []int { return fillStages(c.F.Draft()) }

func (c *FillNeed) stageLabel(i int) string {
	l := c.F.Draft().Loads[i]
	return fmt.Sprintf("stage %d (%s now, from day %s)", i+1, qty(units.Length, l.Fill.Thickness, 4), sig(l.Start, 4))
}

func (c *FillNeed) setStage(e vugu.DOMEvent) {
	if i, err := strconv.Atoi(e.PropString("target", "value")); err == nil {
		c.S.stage = i
	}
}

func (c *FillNeed) setLevel(e vugu.DOMEvent) { c.S.level = e.PropString("target", "value") }
func (c *FillNeed) setDay(e vugu.DOMEvent)   { c.S.day = e.PropString("target", "value") }

// levelProblem and dayProblem say what is wrong with the typed text.
func (c *FillNeed) levelProblem() string {
	_, m := form.ParseNumber(c.S.level, false)
	return emptyOr(c.S.level, m)
}
func (c *FillNeed) dayProblem() string {
	_, m := form.ParseNumber(c.S.day, false)
	return emptyOr(c.S.day, m)
}

func emptyOr(text, problem string) string {
	if text == "" {
		return ""
	}
	return problem
}

func (c *FillNeed) ready() bool {
	return !c.S.busy && c.S.level != "" && c.S.day != "" && c.levelProblem() == "" && c.dayProblem() == ""
}

func (c *FillNeed) resultText() string {
	s := c.S
	if s.thickness == nil {
		return ""
	}
	return fmt.Sprintf("Stage %d needs %s of fill for the surface to stand %s above the original ground on day %s, after the settlement predicted by then (the other stages as they are).",
		s.forStage+1, qty(units.Length, *s.thickness, 4), qty(units.Length, s.levelNum, 4), sig(s.dayNum, 5))
}

func (c *FillNeed) progressText() string { return fmt.Sprintf("%.0f %%", 100*c.S.progress) }

// needState is the helper's state, made on first use with the last fill
// stage chosen.
func (c *Root) needState() *fillNeed {
	if c.need == nil {
		c.need = &fillNeed{stage: -1}
	}
	if st := fillStages(c.form.Draft()); len(st) > 0 && !slices.Contains(st, c.need.stage) {
		c.need.stage = st[len(st)-1]
	}
	return c.need
}

// hasFillStage reports whether the draft has a fill stage to size.
func (c *Root) hasFillStage() bool { return len(fillStages(c.form.Draft())) > 0 }

// runNeed starts solver.FillThickness on the current inputs. Like the
// back-analysis it solves in a goroutine that yields to the browser about
// every 40 ms, and stops when cancelled or when it is started again.
func (c *Root) runNeed() {
	s := c.needState()
	if s.busy {
		return
	}
	level, m1 := form.ParseNumber(s.level, false)
	level = shown.Take(units.Length, level) // typed in the units shown
	day, m2 := form.ParseNumber(s.day, false)
	switch {
	case !c.form.Valid():
		s.err, s.thickness = fixInputsFirst, nil
		return
	case m1 != "" || m2 != "":
		s.err, s.thickness = "Type the finished level and the day as numbers.", nil
		return
	}
	model := c.form.Model()
	g := s.gen.Add(1)
	stage := s.stage
	s.busy, s.progress, s.err, s.thickness = true, 0, "", nil
	var h float64
	c.inBackground("the fill calculation", func() bool { return s.gen.Load() == g }, func(f float64) { s.progress = f },
		func(opt *solver.Options) (err error) {
			h, err = solver.FillThickness(solveInput(model), stage, day, level, opt)
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
				s.thickness, s.forStage, s.levelNum, s.dayNum, s.model = &h, stage, level, day, model
			}
		})
}

func (c *Root) cancelNeed() {
	s := c.needState()
	s.gen.Add(1)
	s.busy = false
}

// applyNeed types the thickness found into its stage.
func (c *Root) applyNeed() {
	s := c.needState()
	if s.thickness == nil || s.forStage >= len(c.form.Draft().Loads) {
		return
	}
	c.form.Put(solver.JoinPath(solver.IndexPath("loads", s.forStage), "fill.thickness"), *s.thickness, 0)
	s.thickness = nil
	c.edited()
}
