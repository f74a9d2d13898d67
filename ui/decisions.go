package ui

import (
	"fmt"
	"math"
	"reflect"
	"strconv"
	"strings"
	"sync/atomic"
	"time"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/ui/form"
	"porelight/ui/plot"
	"porelight/ui/units"
)

// decisionsRun is the state of the site decisions that need solves of
// their own (solver.SurchargeRemoval, solver.StrengthGain): the answers
// and the inputs they were worked out for.
type decisionsRun struct {
	busy     bool
	progress float64
	gen      atomic.Int64
	err      string
	plan     *solver.SurchargePlan
	strength *solver.StrengthResult
	model    *solver.Project
}

// Decisions is the "Site decisions" section: the questions of
// Project.Decisions, their answers in plain words with the reasoning, and
// the curves they come from.
type Decisions struct {
	F       *form.Form
	P       *solver.Project // the project R belongs to
	R       *solver.Result
	S       *decisionsRun
	Run     func()
	Cancel  func()
	Changed func()

	// The pore pressure ratios and figures of the last solve and answers,
	// worked out once for them rather than on every render (keystroke).
	ratios               plot.Memo[[]solver.PoreRatio]
	ratioFig             plot.Memo[*plot.Figure]
	surchargeFig, strFig figFor
}

// figFor is a figure and the answer it was drawn for.
type figFor struct {
	of  any
	fig *plot.Figure
}

// get returns the figure for of, drawn by draw unless it was drawn for it.
func (f *figFor) get(of any, draw func() *plot.Figure) *plot.Figure {
	if f.fig == nil || f.of != of {
		f.of, f.fig = of, draw()
	}
	return f.fig
}

func (c *Decisions) draft() *solver.Project { return c.F.Draft() }

func (c *Decisions) surchargeOn() bool {
	d := c.draft().Decisions
	return d != nil && d.Surcharge != nil
}

func (c *Decisions) withSecondary() bool {
	return c.surchargeOn() && c.draft().Decisions.Surcharge.WithSecondary
}

func (c *Decisions) strengthOn() bool {
	d := c.draft().Decisions
	return d != nil && d.Strength != nil
}

func (c *Decisions) toggleSurcharge(e vugu.DOMEvent) {
	c.F.SetSurcharge(e.PropBool("target", "checked"))
	c.Changed()
}

func (c *Decisions) toggleSecondary(e vugu.DOMEvent) {
	c.F.SetWithSecondary(e.PropBool("target", "checked"))
	c.Changed()
}

// lawOptions are the choices of a layer's strength law.
var lawOptions = []struct{ Value, Text string }{
	{"", "none (not checked)"},
	{solver.StrengthSHANSEP, "su = S σ′v OCRᵐ"},
	{solver.StrengthRatio, "su = ratio × σ′p"},
	{solver.StrengthMeasured, "measured su + gain"},
}

func (c *Decisions) lawOf(layer int) string {
	if i := form.StrengthLaw(c.draft(), layer); i >= 0 {
		return c.draft().Decisions.Strength.Laws[i].Law
	}
	return ""
}

// lawPath is the path of a field of layer's law ("" without a law).
func (c *Decisions) lawPath(layer int, leaf string) string {
	i := form.StrengthLaw(c.draft(), layer)
	if i < 0 {
		return ""
	}
	return solver.JoinPath(solver.IndexPath("decisions.strength.laws", i), leaf)
}

func (c *Decisions) setLaw(layer int, e vugu.DOMEvent) {
	// A measured profile (su0) is typed in the project file; the page
	// keeps its gain editable.
	c.F.SetStrengthLaw(layer, e.PropString("target", "value"))
	c.Changed()
}

func (c *Decisions) su0Text(layer int) string {
	i := form.StrengthLaw(c.draft(), layer)
	if i < 0 {
		return ""
	}
	pts := c.draft().Decisions.Strength.Laws[i].Su0
	if len(pts) == 0 {
		return "give su0 (z, value) in the project file"
	}
	s := ""
	for k, p := range pts {
		if k > 0 {
			s += "; "
		}
		s += qty(units.Stress, p.Value, 3) + " at " + qty(units.Length, p.Z, 3)
	}
	return "su0: " + s
}

func (c *Decisions) layerName(i int) string {
	l := c.draft().Layers[i]
	if l.Name == "" {
		return fmt.Sprintf("Layer %d", i+1)
	}
	return fmt.Sprintf("%d. %s", i+1, l.Name)
}

// problems are the problems of the decisions no input here shows.
func (c *Decisions) problems() []string {
	var out []string
	for _, p := range c.F.Other() {
		if form.Under(p.Path, solver.DecisionsPath) {
			out = append(out, p.Path+": "+p.Message)
		}
	}
	return out
}

// when is a day in plain words: "14 Mar 2027 (day 410)" when the project
// has a start date, "day 410" otherwise.
func when(p *solver.Project, day float64) string {
	// Whole days, rounded up: "on or after", "not before".
	d := "day " + sig(day, 3)
	if day >= 10 {
		d = fmt.Sprintf("day %.0f", math.Ceil(day))
	}
	if p == nil || p.Monitoring == nil || p.Monitoring.Start == "" {
		return d
	}
	start, err := time.Parse(solver.DateLayout, p.Monitoring.Start)
	if err != nil {
		return d
	}
	return start.Add(time.Duration(math.Ceil(day)*24*float64(time.Hour))).Format("2 Jan 2006") + " (" + d + ")"
}

// mm1 is a settlement, m, in mm to 0.1 mm (no powers of ten for the
// near-zero figures of stiff layers).
// mm1 writes a settlement in m as a table figure: mm to one decimal, or
// in to two in US units.
func mm1(m float64) string {
	s := fmt.Sprintf("%.1f", 1000*m)
	if shown == units.US {
		s = fmt.Sprintf("%.2f", conv(units.Settlement, 1000*m))
	}
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	return s
}

func years(days float64) string { return sig(days/solver.DaysPerYear, 3) + " yr" }

// residual is the answer about the settlement after handover, or nil.
func (c *Decisions) residual() *solver.Residual {
	if c.R == nil {
		return nil
	}
	return c.R.Residual
}

func (c *Decisions) residualText() string {
	r := c.residual()
	if r == nil {
		if h := c.draft().Decisions; h != nil && h.Handover > 0 {
			return "Not computed yet: it comes with the next solve."
		}
		return "Type the day of paving or handover to see the settlement still to come after it."
	}
	p := c.P
	primary := fmt.Sprintf("%s of primary consolidation still to come", mm(r.Primary))
	if r.Primary < 0 {
		primary = fmt.Sprintf("a net rebound of %s as the column swells after the load removed", mm(-r.Primary))
	}
	return fmt.Sprintf("After %s the surface will settle a further %s by the end of the %s design life (%s): %s and %s of secondary compression. By %s it has settled %s; at the end of the design life %s altogether.",
		when(p, r.Time), mm(r.Total), years(r.Life), when(p, r.Life), primary, mm(r.Secondary), when(p, r.Time), mm(r.Reached), mm(r.AtLife))
}

func (c *Decisions) modelName() string {
	if c.R != nil && c.R.Summary.Model == solver.ModelNonlinear {
		return "the non-linear model"
	}
	return "the settlement from mv (the linear model)"
}

// fresh reports whether the answers were worked out for the inputs now
// in the form.
func (c *Decisions) fresh() bool {
	return c.S.model != nil && reflect.DeepEqual(c.S.model, c.F.Model())
}

func (c *Decisions) canRun() bool {
	return !c.S.busy && (c.surchargeOn() || c.strengthOn())
}

func (c *Decisions) progressText() string { return fmt.Sprintf("%.0f %%", 100*c.S.progress) }

// removalText is the surcharge answer in plain words.
func (c *Decisions) removalText() string {
	pl := c.S.plan
	p := c.S.model
	head := fmt.Sprintf("The surcharge (%s, taken off by stage %d) ", qty(units.Stress, pl.Surcharge, 3), pl.Removal+1)
	if pl.RemoveOn == nil {
		return head + "does not reach the permanent load's settlement everywhere in the simulated time: no removal day found."
	}
	s := head + "may come off on or after " + when(p, *pl.RemoveOn) + "."
	planned := p.Loads[pl.Removal].Start
	switch {
	case planned < *pl.RemoveOn*(1-1e-3):
		s += " The project takes it off on " + when(p, planned) + ": too early by this criterion; part of the column would go on settling under the permanent load."
	default:
		s += " The project takes it off on " + when(p, planned) + ", not before it."
	}
	return s
}

// removalReasons are the steps behind the removal day.
func (c *Decisions) removalReasons() []string {
	pl := c.S.plan
	p := c.S.model
	var out []string
	t := fmt.Sprintf("Target: under the permanent load alone (%s at the surface) the final primary settlement is %s", qty(units.Stress, pl.Permanent, 3), mm(pl.TargetPrimary))
	if pl.TargetSecondary > 0 {
		t += fmt.Sprintf(", plus %s of secondary compression by the end of the design life", mm(pl.TargetSecondary))
	}
	out = append(out, t+".")
	if pl.Average != nil {
		out = append(out, fmt.Sprintf("With the surcharge left on, the settlement reaches the target on %s: an average degree of %s %% of its final %s (Aldrich 1965; Johnson 1970).",
			when(p, *pl.Average), sig(100*pl.Degree, 3), mm(pl.FinalWithSurcharge)))
	}
	if pl.Everywhere != nil {
		out = append(out, fmt.Sprintf("Point by point: every depth has reached the effective stress the permanent load alone would give it on %s; the last is at %s m (the average hides the least consolidated part, Johnson 1970). The removal day is the later of the two.",
			when(p, *pl.Everywhere), sig(pl.LagDepth, 3)))
	}
	if a := pl.After; a != nil {
		after := fmt.Sprintf("the surface settles %s more (%s primary, %s secondary)", mm(a.Residual.Total), signedMM(a.Residual.Primary), mm(a.Residual.Secondary))
		if a.Residual.Total < 0 {
			after = fmt.Sprintf("the surface ends %s higher than at removal (%s primary, %s secondary)", mm(-a.Residual.Total), signedMM(a.Residual.Primary), mm(a.Residual.Secondary))
		}
		out = append(out, fmt.Sprintf("Run forward with the surcharge off on that day: %s settled at removal, a rebound of %s, a final primary settlement of %s; from removal to the end of the design life %s.",
			mm(a.AtRemoval), mm(a.Rebound), mm(a.FinalPrimary), after))
	}
	if n := pl.Needed; n != nil {
		s := fmt.Sprintf("To take it off by %s the surcharge would have to be %s", when(p, n.By), qty(units.Stress, n.Surcharge, 3))
		if n.Thickness > 0 {
			s += fmt.Sprintf(" (%s m of fill)", sig(n.Thickness, 3))
		}
		out = append(out, s+fmt.Sprintf(", which may come off on %s.", when(p, n.RemoveOn)))
	}
	var stiff []string
	for _, w := range pl.Warnings {
		if strings.HasSuffix(w.Path, ".mvUnload") {
			stiff = append(stiff, w.Path[:strings.Index(w.Path, ".")])
			continue
		}
		out = append(out, "Note: "+w.Message)
	}
	if len(stiff) > 0 {
		out = append(out, fmt.Sprintf("Note: %d of the layers rebound along their loading mv after the removal (no swelling mv, mvUnload, given): the rebound is overestimated; give mvUnload, or use the non-linear model (Cr).", len(stiff)))
	}
	return out
}

// signedMM is a settlement with its sign: "+12 mm" down, "−78 mm" up.
func signedMM(m float64) string {
	if m < 0 {
		return "−" + mm(-m)
	}
	return "+" + mm(m)
}

// liftRow is one row of the strength check of the lifts.
type liftRow struct {
	Stage, Start, Pressure, Su, Carries, Verdict, Earliest, Class string
}

func (c *Decisions) liftRows() []liftRow {
	var out []liftRow
	p := c.S.model
	for _, l := range c.S.strength.Lifts {
		r := liftRow{Stage: fmt.Sprint(l.Stage + 1), Start: when(p, l.Start), Pressure: sig(conv(units.Stress, l.Pressure), 3), Su: sig(conv(units.Stress, l.Su), 3), Carries: sig(conv(units.Stress, l.Carries), 3), Verdict: "passes", Earliest: "not in the simulated time"}
		if !l.Safe {
			r.Verdict, r.Class = "too early", "pl-alarm"
		}
		if l.Earliest != nil {
			r.Earliest = when(p, *l.Earliest)
		}
		out = append(out, r)
	}
	return out
}

// liftText says in plain words when each lift may go on.
func (c *Decisions) liftTexts() []string {
	var out []string
	p := c.S.model
	for _, l := range c.S.strength.Lifts {
		s := fmt.Sprintf("Stage %d (%s at the surface once placed), planned for %s: the ground then carries about %s by this check", l.Stage+1, qty(units.Stress, l.Pressure, 3), when(p, l.Start), qty(units.Stress, l.Carries, 3))
		switch {
		case l.Safe:
			s += ", enough."
		case l.Earliest != nil:
			s += ", too little: not before " + when(p, *l.Earliest) + "."
		default:
			s += ", too little, and not enough within the simulated time: place it in thinner lifts or improve the ground."
		}
		out = append(out, s)
	}
	return out
}

func (c *Decisions) strengthNote() string {
	s := c.S.strength
	return fmt.Sprintf("Bearing check Nc·su/FS with Nc = %s (Prandtl, strip) and FS = %s; su is the thickness-weighted mean over the layers with a law, from the solved effective stress (its σ′p grows with the largest σ′v reached).", sig(s.Nc, 3), sig(s.FS, 3))
}

func (c *Decisions) surchargeFigure() *plot.Figure {
	return c.surchargeFig.get(c.S.plan, func() *plot.Figure { return plot.SurchargeFigure(c.S.plan, 0, 0) })
}

func (c *Decisions) strengthFigure() *plot.Figure {
	return c.strFig.get(c.S.strength, func() *plot.Figure { return plot.StrengthFigure(c.S.strength, 0, 0) })
}

// residualRow is the summary's line for the settlement after handover
// (the site decisions give the detail).
func residualRow(p *solver.Project, r *solver.Residual) sumRow {
	return sumRow{ID: "sum-residual", Label: "Settlement after handover, " + when(p, r.Time), Value: mm(r.Total), Exact: exact(r.Total),
		Note: fmt.Sprintf("to the end of the design life: %s primary, %s secondary (site decisions)", signedMM(r.Primary), mm(r.Secondary))}
}

// poreRatios are the piezometers' pore pressure ratios of the last solve.
func (c *Decisions) poreRatios() []solver.PoreRatio {
	if c.P == nil || c.R == nil {
		return nil
	}
	return c.ratios.Get(c.P, c.R, func() []solver.PoreRatio {
		prs, err := solver.PoreRatios(c.P, c.R)
		if err != nil {
			return nil
		}
		return prs
	})
}

// ratioRow compares, at one piezometer, the last reading with the
// prediction on its day, or gives the prediction at the last output time.
type ratioRow struct {
	Name, Day, Measured, Predicted, MeasuredD, PredictedD string
}

func (c *Decisions) ratioRows() []ratioRow {
	var out []ratioRow
	for _, pr := range c.poreRatios() {
		if len(pr.Time) == 0 {
			continue
		}
		r := ratioRow{Name: "z = " + qty(units.Length, pr.Depth, 3), Measured: "–", MeasuredD: "–"}
		day := pr.Time[len(pr.Time)-1]
		if n := len(pr.MeasuredTime); n > 0 {
			r.Name += " (" + pr.Record + ")"
			day = pr.MeasuredTime[n-1]
			r.Measured, r.MeasuredD = sig(pr.MeasuredRatio[n-1], 2), sig(100*pr.MeasuredDissipation[n-1], 3)
		} else if ts := c.P.Times; len(ts) > 0 {
			day = ts[len(ts)-1]
		}
		r.Day = when(c.P, day)
		r.Predicted = sig(solver.SeriesAt(pr.Time, pr.Ratio, day), 2)
		r.PredictedD = sig(100*solver.SeriesAt(pr.Time, pr.Dissipation, day), 3)
		out = append(out, r)
	}
	return out
}

func (c *Decisions) ratioFigure() *plot.Figure {
	return c.ratioFig.Get(c.P, c.R, func() *plot.Figure { return plot.PoreRatioFigure(c.poreRatios(), 0, 0) })
}

// removalOption is one choice of the stage that takes the surcharge off.
type removalOption struct {
	Value, Text string
	Selected    bool
}

// removalOptions are the stages that take load off, after the solver's
// own choice (the last of them).
func (c *Decisions) removalOptions() []removalOption {
	var chosen *int
	if c.surchargeOn() {
		chosen = c.draft().Decisions.Surcharge.Removal
	}
	out := []removalOption{{Value: "-1", Text: "the last stage that takes load off", Selected: chosen == nil}}
	for i, l := range c.draft().Loads {
		if l.Pressure() < 0 {
			out = append(out, removalOption{Value: fmt.Sprint(i), Text: fmt.Sprintf("stage %d (day %s, %s)", i+1, sig(l.Start, 4), qty(units.Stress, l.Pressure(), 3)), Selected: chosen != nil && *chosen == i})
		}
	}
	return out
}

func (c *Decisions) setRemoval(e vugu.DOMEvent) {
	i, err := strconv.Atoi(e.PropString("target", "value"))
	if err != nil {
		return
	}
	c.F.SetSurchargeRemoval(i)
	c.Changed()
}
