package ui

import (
	"fmt"
	"strings"
	"time"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/solver/uncertain"
	"porelight/ui/form"
	"porelight/ui/plot"
	"porelight/ui/units"
)

// Uncertain is the "range of outcomes" section: the spread of each
// layer's k, mv and ch (Project.Uncertainty, edited through the form),
// the Monte Carlo run in the workers (Root.runRange), its P10/P50/P90
// bands, the t90 histogram and the one-at-a-time sensitivity.
type Uncertain struct {
	F       *form.Form
	Changed func()
	S       *rangeState
	Run     func()
	Stop    func()
}

func uncertainPath(name string) string { return solver.JoinPath("uncertainty", name) }

func spreadField(i int, name string) string {
	return solver.JoinPath(solver.IndexPath("uncertainty.layers", i), name)
}

func (c *Uncertain) on() bool     { return c.F.Draft().Uncertainty != nil }
func (c *Uncertain) drains() bool { return c.F.Draft().Drains != nil }

func (c *Uncertain) toggle(e vugu.DOMEvent) {
	c.F.SetUncertainty(e.PropBool("target", "checked"))
	c.Changed()
}

// rows are the layers that have a spread entry (one per layer once on).
func (c *Uncertain) rows() []int {
	u := c.F.Draft().Uncertainty
	if u == nil {
		return nil
	}
	out := make([]int, min(len(u.Layers), len(c.F.Draft().Layers)))
	for i := range out {
		out[i] = i
	}
	return out
}

func (c *Uncertain) layerName(i int) string { return layerLabel(c.F.Draft(), i) }

// layerLabel is "2. Upper soft clay" or "Layer 2".
func layerLabel(p *solver.Project, i int) string {
	if i < 0 || i >= len(p.Layers) {
		return fmt.Sprintf("Layer %d", i+1)
	}
	if n := strings.TrimSpace(p.Layers[i].Name); n != "" {
		return fmt.Sprintf("%d. %s", i+1, n)
	}
	return fmt.Sprintf("Layer %d", i+1)
}

func (c *Uncertain) fields() []drainField {
	return []drainField{
		{Path: uncertainPath("runs"), Span: "Realisations", Label: "Number of Monte Carlo realisations", Unit: "–"},
		{Path: uncertainPath("seed"), Span: "Seed", Label: "Seed of the random generator (the same seed gives the same bands)", Unit: "–"},
		{Path: uncertainPath("date"), Span: "Remaining after day", Label: "Day after which the remaining settlement is reported", Unit: "day"},
	}
}

// problems are the uncertainty problems no single input shows.
func (c *Uncertain) problems() []string {
	var out []string
	for _, p := range c.F.Other() {
		if strings.HasPrefix(p.Path, "uncertainty") {
			out = append(out, p.Path+": "+p.Message)
		}
	}
	return out
}

func (c *Uncertain) ready() bool { return c.on() && !c.S.busy && c.F.Valid() }

// status says where the run is.
func (c *Uncertain) status() string {
	s := c.S
	switch {
	case s.busy:
		return fmt.Sprintf("Running: %d of %d realisations%s…", c.doneNow(), s.total, c.where())
	case s.err != "":
		return ""
	case s.note != "":
		return s.note
	case s.bands != nil:
		msg := fmt.Sprintf("%d realisations in %s%s.", s.done, durationText(s.elapsed), c.where())
		if s.bands.Failed > 0 {
			msg += fmt.Sprintf(" %d could not be solved (%s); the bands leave them out.", s.bands.Failed, s.bands.FirstProblem)
		}
		if s.bands.NotReached > 0 {
			msg += fmt.Sprintf(" %d never reached 90 %% in the simulated time; the t90 figures leave them out, so they understate the slow end.", s.bands.NotReached)
		}
		if s.model != nil && !sameSpread(s.model, c.F.Draft()) {
			msg += " The inputs have changed since: run again to update."
		}
		return msg
	}
	return "Not run yet."
}

// sameSpread reports whether the run's project is the draft (an edit
// since makes the bands stale).
func sameSpread(a, b *solver.Project) bool {
	x, err1 := a.MarshalBinary()
	y, err2 := b.MarshalBinary()
	return err1 == nil && err2 == nil && string(x) == string(y)
}

func (c *Uncertain) where() string {
	if c.S.workers {
		return ", in the background workers"
	}
	return ", in the page"
}

// doneNow counts the realisations answered plus those under way.
func (c *Uncertain) doneNow() int {
	n := float64(c.S.done)
	for _, f := range c.S.partial {
		n += f
	}
	return min(int(n), c.S.total)
}

func (c *Uncertain) fraction() float64 {
	if c.S.total == 0 {
		return 0
	}
	return float64(c.doneNow()) / float64(c.S.total)
}

func (c *Uncertain) elapsedMs() string {
	return fmt.Sprintf("%.0f", float64(c.S.elapsed)/float64(time.Millisecond))
}

func durationText(d time.Duration) string {
	if d < 10*time.Second {
		return fmt.Sprintf("%.1f s", d.Seconds())
	}
	return fmt.Sprintf("%.0f s", d.Seconds())
}

// quantRow is one row of the quantile table.
type quantRow struct {
	ID, Name, Unit string
	Q              uncertain.Quantiles
	Time           bool // else a settlement in m
}

func (c *Uncertain) quantRows() []quantRow {
	b := c.S.bands
	if b == nil {
		return nil
	}
	date := c.S.plan.Date
	return []quantRow{
		{ID: "range-t90", Name: "Time to 90 % consolidation, t90", Q: b.T90, Time: true},
		{ID: "range-final", Name: "Final settlement (primary + secondary at the design life)", Unit: sym(units.Settlement), Q: b.Final},
		{ID: "range-remaining", Name: fmt.Sprintf("Settlement still to come after day %s", sig(date, 4)), Unit: sym(units.Settlement), Q: b.Remaining},
	}
}

func (r quantRow) cell(v float64) string {
	if r.Q.N == 0 {
		return "–"
	}
	if r.Time {
		return timeText(v)
	}
	return setl(v)
}

// timeText writes days, with years beyond a year.
func timeText(d float64) string {
	if d >= solver.DaysPerYear {
		return fmt.Sprintf("%s days (%s yr)", sig(d, 3), sig(d/solver.DaysPerYear, 3))
	}
	return sig(d, 3) + " days"
}

func (c *Uncertain) settlementFig() *plot.Figure {
	return plot.BandsFigure(c.S.bands, c.S.result, false, c.S.done, c.S.total, 640, 360)
}

func (c *Uncertain) degreeFig() *plot.Figure {
	return plot.BandsFigure(c.S.bands, c.S.result, true, c.S.done, c.S.total, 640, 320)
}

func (c *Uncertain) t90Fig() *plot.Figure { return plot.T90Figure(c.S.bands, 640, 280) }

func (c *Uncertain) sensitivityFig() *plot.Figure {
	p := c.S.model
	if p == nil {
		p = c.F.Draft()
	}
	return plot.SensitivityFigure(c.S.base, c.S.swings, func(i int) string { return layerLabel(p, i) }, 640, 60+44*min(max(len(c.S.swings), 1), 12)+50)
}

// swingRows are the sensitivity as a table, ranked.
func (c *Uncertain) swingRows() []uncertain.Swing { return c.S.swings }

func (c *Uncertain) swingName(s uncertain.Swing) string {
	p := c.S.model
	if p == nil {
		p = c.F.Draft()
	}
	name := map[string]string{uncertain.ParamK: "k", uncertain.ParamMv: "mv (and Cc, Cr)", uncertain.ParamCh: "ch"}[s.Param]
	return layerLabel(p, s.Layer) + ": " + name
}

func optT90(s uncertain.Sample) string {
	if s.T90 == nil {
		return "not reached"
	}
	return timeText(*s.T90)
}
