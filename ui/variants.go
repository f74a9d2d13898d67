package ui

import (
	"fmt"
	"strings"

	"github.com/vugu/vugu"

	"porelight/solver"
	optcmp "porelight/solver/compare"
	"porelight/ui/form"
	"porelight/ui/plot"
	"porelight/ui/units"
)

// Variants is the options section: named sets of changes to the project
// (Project.Variants: drains off or at another spacing, a stage's start,
// ramp, q or fill, a layer's k, mv, ch), solved side by side with the
// project as given (Root.runCompare), tabulated and overlaid.
type Variants struct {
	F       *form.Form
	Changed func()
	S       *compareState
	Run     func()
}

func (c *Variants) list() []int {
	out := make([]int, len(c.F.Draft().Variants))
	for i := range out {
		out[i] = i
	}
	return out
}

func variantField(i int, name string) string {
	return solver.JoinPath(solver.IndexPath("variants", i), name)
}

func variantItem(i int, list string, j int, name string) string {
	return solver.JoinPath(solver.IndexPath(variantField(i, list), j), name)
}

func (c *Variants) add() {
	c.F.AddVariant()
	c.Changed()
}

func (c *Variants) remove(i int) {
	c.F.RemoveVariant(i)
	c.Changed()
}

func (c *Variants) drains() bool { return c.F.Draft().Drains != nil }

func (c *Variants) noDrains(i int) bool { return c.F.Draft().Variants[i].NoDrains }

func (c *Variants) setNoDrains(i int, e vugu.DOMEvent) {
	c.F.SetVariantNoDrains(i, e.PropBool("target", "checked"))
	c.Changed()
}

// stages are the load stages an option can change (every one has an
// input row once the option has an entry for it).
func (c *Variants) stages(i int) []int {
	n := min(len(c.F.Draft().Variants[i].Loads), len(c.F.Draft().Loads))
	out := make([]int, n)
	for j := range out {
		out[j] = j
	}
	return out
}

func (c *Variants) layers(i int) []int {
	n := min(len(c.F.Draft().Variants[i].Layers), len(c.F.Draft().Layers))
	out := make([]int, n)
	for j := range out {
		out[j] = j
	}
	return out
}

func (c *Variants) fill(j int) bool { return c.F.Draft().Loads[j].Fill != nil }

func (c *Variants) stageLabel(j int) string {
	l := c.F.Draft().Loads[j]
	what := "q " + qty(units.Stress, l.Q, 4)
	if l.Fill != nil {
		what = "fill " + qty(units.Length, l.Fill.Thickness, 4)
	}
	return fmt.Sprintf("%d. day %s, %s", j+1, sig(l.Start, 4), what)
}

func (c *Variants) layerName(j int) string { return layerLabel(c.F.Draft(), j) }

// fitNeeded reports whether an option lacks rows for stages or layers
// added after it.
func (c *Variants) fitNeeded() bool {
	p := c.F.Draft()
	for _, v := range p.Variants {
		if len(v.Loads) < len(p.Loads) || len(v.Layers) < len(p.Layers) {
			return true
		}
	}
	return false
}

func (c *Variants) fit() {
	c.F.FitVariants()
	c.Changed()
}

func (c *Variants) problems() []string {
	var out []string
	for _, p := range c.F.Other() {
		if strings.HasPrefix(p.Path, "variants") {
			out = append(out, p.Path+": "+p.Message)
		}
	}
	return out
}

func (c *Variants) ready() bool { return !c.S.busy && c.F.Valid() }

func (c *Variants) status() string {
	s := c.S
	switch {
	case s.busy:
		return fmt.Sprintf("Solving: %d of %d…", s.done, len(s.outcomes))
	case len(s.outcomes) == 0:
		if len(c.F.Draft().Variants) == 0 {
			return "Add an option, give it a change, then compare."
		}
		return "Not compared yet."
	case s.model != nil && !sameSpread(s.model, c.F.Draft()):
		return "The inputs have changed since: compare again to update."
	}
	return fmt.Sprintf("%d solves, each a project of its own.", len(s.outcomes))
}

func (c *Variants) rows() []optcmp.Outcome { return c.S.outcomes }

func (c *Variants) date() string {
	if len(c.S.outcomes) == 0 {
		return ""
	}
	return sig(c.S.outcomes[0].Figures.Date, 4)
}

func optTime(t *float64) string {
	if t == nil {
		return "not reached"
	}
	return timeText(*t)
}

func (c *Variants) curves() []plot.Curve {
	var out []plot.Curve
	for _, o := range c.S.outcomes {
		out = append(out, plot.Curve{Name: o.Name, Result: o.Result})
	}
	return out
}

func (c *Variants) settlementFig() *plot.Figure {
	return plot.VariantsFigure(c.curves(), false, 640, 360)
}
func (c *Variants) degreeFig() *plot.Figure { return plot.VariantsFigure(c.curves(), true, 640, 320) }

// sections are the alignment's rows.
func (c *Variants) sections() []int {
	a := c.F.Draft().Alignment
	if a == nil {
		return nil
	}
	out := make([]int, len(a.Sections))
	for i := range out {
		out[i] = i
	}
	return out
}

func sectionField(i int, name string) string {
	return solver.JoinPath(solver.IndexPath("alignment.sections", i), name)
}

func (c *Variants) addSection() {
	c.F.AddSection()
	c.Changed()
}

func (c *Variants) removeSection(i int) {
	c.F.RemoveSection(i)
	c.Changed()
}

// optionChoice is one entry of a section's option select.
type optionChoice struct {
	Value, Text string
	Selected    bool
}

func (c *Variants) choices(i int) []optionChoice {
	cur := c.F.Draft().Alignment.Sections[i].Option
	out := []optionChoice{{Value: "", Text: optcmp.BaseName, Selected: cur == "" || cur == optcmp.BaseName}}
	known := out[0].Selected
	for _, v := range c.F.Draft().Variants {
		out = append(out, optionChoice{Value: v.Name, Text: v.Name, Selected: v.Name == cur})
		known = known || v.Name == cur
	}
	if !known { // renamed or removed since: keep it visible, Validate names it
		out = append(out, optionChoice{Value: cur, Text: cur + " (missing)", Selected: true})
	}
	return out
}

func (c *Variants) setOption(i int, e vugu.DOMEvent) {
	c.F.SetSectionOption(i, e.PropString("target", "value"))
	c.Changed()
}

// profile is the alignment read off the last comparison.
func (c *Variants) profile() ([]optcmp.Point, []optcmp.Span) {
	if c.S.model == nil || c.S.busy {
		return nil, nil
	}
	return optcmp.Profile(c.S.model, c.S.outcomes)
}

func (c *Variants) hasProfile() bool {
	pts, _ := c.profile()
	return len(pts) > 1
}

func (c *Variants) profileFig() *plot.Figure {
	pts, spans := c.profile()
	pp := make([]plot.ProfilePoint, len(pts))
	for i, p := range pts {
		pp[i] = plot.ProfilePoint{Name: p.Name, Chainage: p.Chainage, Settlement: p.Settlement, OK: p.Problem == ""}
	}
	var over []bool
	if c.S.model.Alignment.Limit > 0 {
		over = make([]bool, len(pts))
		for _, s := range spans {
			over[s.From] = s.Over
		}
	}
	return plot.ProfileFigure(pp, over, solver.ResolveAlignmentDate(c.S.model), 640, 320)
}

// spanRow is one row of the spans table.
type spanRow struct {
	ID, From, To, Diff, Ratio, Check string
	Over                             bool
}

func (c *Variants) spanRows() []spanRow {
	pts, spans := c.profile()
	limit := c.S.model.Alignment.Limit
	var out []spanRow
	for k, s := range spans {
		r := spanRow{ID: fmt.Sprintf("span-%d", k), From: pts[s.From].Name, To: pts[s.To].Name, Diff: setl(s.Differential), Over: s.Over}
		r.Ratio = "0"
		if s.Distortion > 0 {
			r.Ratio = "1/" + sig(1/s.Distortion, 3)
		}
		switch {
		case limit == 0:
			r.Check = "no limit given"
		case s.Over:
			r.Check = "over 1/" + sig(1/limit, 3)
		default:
			r.Check = "within 1/" + sig(1/limit, 3)
		}
		out = append(out, r)
	}
	return out
}

func (c *Variants) profileProblems() []string {
	pts, _ := c.profile()
	var out []string
	for _, p := range pts {
		if p.Problem != "" {
			out = append(out, p.Name+": "+p.Problem)
		}
	}
	return out
}
