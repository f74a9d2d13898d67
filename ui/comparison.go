package ui

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/solver/monitor"
	"porelight/ui/form"
	"porelight/ui/plot"
	"porelight/ui/units"
)

// Comparison sets the field records against the prediction: the
// differences reading by reading, and Asaoka's forecast for each
// settlement plate.
//
// The bulky parts are folded (folds.go): the reading-by-reading tables,
// each on its own, and the Asaoka plots, all together. The figures stay
// in view.
type Comparison struct {
	P *solver.Project // the project R belongs to, records included
	R *solver.Result
	// Dates draws the differences against calendar dates (the plots'
	// choice, when monitoring.start is set).
	Dates    bool
	Download func(name, mime string, data []byte)
	// PlotsOpen says whether the Asaoka plots show; TogglePlots asks the
	// Root to open or close them.
	PlotsOpen   bool
	TogglePlots func()
	// Printing opens every fold, for Print report.
	Printing bool
	// SetAsaoka saves the choices for Asaoka's method (window, layers of
	// the drainage path) in the project; nil: they are not saved.
	SetAsaoka func(*solver.AsaokaSettings)

	from, to       string          // Asaoka window as typed, days ("" = default)
	fromSet, toSet bool            // the user typed in the field
	shown          map[string]bool // record path → its reading table unfolded

	res  []resRecord // for the inputs in made
	asa  []asaoka
	made compKey
}

// compKey is what the comparisons depend on.
type compKey struct {
	p        *solver.Project
	r        *solver.Result
	from, to string
}

// Init prepares the private state.
func (c *Comparison) Init(vugu.InitCtx) { c.shown = map[string]bool{} }

// Compute works out the comparisons for the coming build, when their
// inputs changed: most renders follow edits that solve again first.
func (c *Comparison) Compute() {
	k := compKey{c.P, c.R, c.from, c.to}
	if k == c.made && c.res != nil {
		return
	}
	c.res, c.asa, c.made = residuals(c.P, c.R), c.asaokas(), k
}

func (c *Comparison) recs() []resRecord { return c.res }

// figure formats a value of a record (in mm or kPa, its unit) in the
// unit shown.
func figure(v float64, unit string) string {
	if math.IsNaN(v) {
		return "–"
	}
	v = conv(recQty(unit), v)
	if unit == "mm" {
		if shown == units.US {
			return fmt.Sprintf("%.2f", v)
		}
		return fmt.Sprintf("%.1f", v)
	}
	return sig(v, 3)
}

// recQty is what a record's values measure, by their unit: "mm" for
// settlement, "kPa" for pore pressure.
func recQty(unit string) units.Quantity {
	if unit == "mm" {
		return units.Settlement
	}
	return units.Stress
}

// recSym is the symbol a record's values are shown in.
func recSym(unit string) string { return sym(recQty(unit)) }

func (c *Comparison) kind(r resRecord) string {
	if r.Kind == form.Piezometers {
		return "pore pressure at " + qty(units.Length, r.Depth, 4)
	}
	return "settlement"
}

func (c *Comparison) compared(r resRecord) string {
	if r.Problem != "" {
		return r.Problem
	}
	s := fmt.Sprintf("%d of %d", r.N, len(r.Rows))
	if r.N == len(r.Rows) {
		s = fmt.Sprint(r.N)
	}
	return s
}

func (c *Comparison) rms(r resRecord) string  { return figure(r.RMS, r.Unit) }
func (c *Comparison) mean(r resRecord) string { return signed(r.Mean, r.Unit) }

// signed writes a difference with its sign.
func signed(v float64, unit string) string {
	s := figure(v, unit)
	if v > 0 && s != "–" {
		return "+" + s
	}
	return s
}

func (c *Comparison) isShown(r resRecord) bool { return c.shown[r.Path] || c.Printing }

func (c *Comparison) toggleRows(r resRecord) { c.shown[r.Path] = !c.shown[r.Path] }

// rowsLabel names the reading-by-reading table of r, on its fold.
func (c *Comparison) rowsLabel(r resRecord) string {
	n := len(r.Rows)
	if n == 1 {
		return "Reading by reading: " + r.Name + " (1 reading)"
	}
	return fmt.Sprintf("Reading by reading: %s (%d readings)", r.Name, n)
}

// folded says whether anything of the panel is folded, for the note a
// printout made with the browser's own Print shows.
func (c *Comparison) folded() bool {
	if !c.PlotsOpen && len(c.asa) > 0 {
		return true
	}
	for _, r := range c.res {
		if !c.isShown(r) {
			return true
		}
	}
	return false
}

func (c *Comparison) plotsLabel() string {
	if c.PlotsOpen {
		return "hide"
	}
	return "show"
}

// plotsHint says what the folded Asaoka plots hold.
func (c *Comparison) plotsHint() string {
	n := 0
	for _, a := range c.asa {
		if a.Res != nil {
			n++
		}
	}
	switch n {
	case 0:
		return "No Asaoka plot: no plate gives a forecast."
	case 1:
		return "The Asaoka plot of the plate: each resampled settlement against the one before, with the fitted line and the 45° line"
	}
	return fmt.Sprintf("The Asaoka plots of the %d plates with a forecast: each resampled settlement against the one before, with the fitted line and the 45° line", n)
}

func (c *Comparison) anyPlot() bool {
	for _, a := range c.asa {
		if a.Res != nil {
			return true
		}
	}
	return false
}

func (c *Comparison) when(row resRow) string {
	s := form.FormatNumber(math.Round(row.T*100) / 100)
	if row.Date != "" {
		s += " (" + row.Date + ")"
	}
	return s
}

func (c *Comparison) exportResiduals() {
	data, err := residualsCSV(residuals(c.P, c.R))
	if err == nil && c.Download != nil {
		c.Download("residuals.csv", "text/csv", data)
	}
}

// predictedFinal is the prediction's final primary settlement under the
// model the summary uses, for comparison with the forecasts.
func (c *Comparison) predictedFinal() string {
	if c.R == nil || c.R.Summary.Settlement == nil {
		return "–"
	}
	return mm(*c.R.Summary.Settlement)
}

// predictedLabel names the figure predictedFinal shows.
func (c *Comparison) predictedLabel() string {
	if c.R != nil && c.R.Summary.Model == solver.ModelNonlinear {
		return "Predicted final primary settlement of the non-linear model"
	}
	return "Predicted final primary settlement from mv"
}

// predictionNote says which settlement the readings are compared with:
// the one the back-fit uses (monitor.FittedSettlement).
func (c *Comparison) predictionNote() string {
	if _, curve := monitor.FittedSettlement(c.R); curve != "" {
		return "Prediction: the " + curve
	}
	return "Prediction: settlement from mv"
}

// Asaoka's method.

// window reads the typed window; msg says what is wrong with it.
func (c *Comparison) window() (from, to float64, fromMsg, toMsg string) {
	read := func(s string) (float64, string) {
		if strings.TrimSpace(s) == "" {
			return 0, ""
		}
		x, msg := form.ParseNumber(s, false)
		if msg == "" && x < 0 {
			msg = "must not be negative"
		}
		return x, msg
	}
	from, fromMsg = read(c.fromText())
	to, toMsg = read(c.toText())
	if fromMsg == "" && toMsg == "" && to > 0 && to <= from {
		toMsg = "must be after the start of the window"
	}
	return from, to, fromMsg, toMsg
}

func (c *Comparison) fromProblem() string { _, _, m, _ := c.window(); return m }
func (c *Comparison) toProblem() string   { _, _, _, m := c.window(); return m }

func (c *Comparison) setFrom(e vugu.DOMEvent) {
	c.from, c.fromSet = e.PropString("target", "value"), true
	c.saveAsaoka(nil)
}

func (c *Comparison) setTo(e vugu.DOMEvent) {
	c.to, c.toSet = e.PropString("target", "value"), true
	c.saveAsaoka(nil)
}

// saved is the project's saved choices for Asaoka's method (never nil).
func (c *Comparison) saved() solver.AsaokaSettings {
	if c.P == nil || c.P.Monitoring == nil || c.P.Monitoring.Asaoka == nil {
		return solver.AsaokaSettings{}
	}
	return *c.P.Monitoring.Asaoka
}

// fromText and toText are the window as typed, or as saved in the file.
func (c *Comparison) fromText() string {
	if c.fromSet {
		return c.from
	}
	if v := c.saved().From; v > 0 {
		return sig(v, 6)
	}
	return ""
}

func (c *Comparison) toText() string {
	if c.toSet {
		return c.to
	}
	if v := c.saved().To; v > 0 {
		return sig(v, 6)
	}
	return ""
}

// saveAsaoka saves the window typed (when it reads) and layers (nil:
// those saved) in the project.
func (c *Comparison) saveAsaoka(layers []int) {
	if c.SetAsaoka == nil {
		return
	}
	from, to, fm, tm := c.window()
	if fm != "" || tm != "" {
		return
	}
	a := c.saved()
	a.From, a.To = from, to
	if layers != nil {
		a.Layers = layers
	}
	c.SetAsaoka(&a)
}

// pathLayer is one layer's choice in the drainage path.
type pathLayer struct {
	I    int
	ID   string
	Name string
	On   bool
}

// pathLayers lists the layers with whether the drainage path of the
// implied cv runs through them (saved, or the compressible ones).
func (c *Comparison) pathLayers() []pathLayer {
	if c.P == nil {
		return nil
	}
	on := monitor.AsaokaOptionsFor(c.P).Layers
	var out []pathLayer
	for i, l := range c.P.Layers {
		out = append(out, pathLayer{I: i, ID: fmt.Sprintf("asaoka-layer-%d", i), Name: recordName(l.Name, "Layer", i), On: slices.Contains(on, i)})
	}
	return out
}

// togglePath adds layer i to the drainage path or takes it out (the
// last one stays); the default set is saved as no choice.
func (c *Comparison) togglePath(i int) {
	on := monitor.AsaokaOptionsFor(c.P).Layers
	if j := slices.Index(on, i); j >= 0 {
		if len(on) == 1 {
			return
		}
		on = slices.Delete(slices.Clone(on), j, j+1)
	} else {
		on = append(slices.Clone(on), i)
		slices.Sort(on)
	}
	if slices.Equal(on, monitor.ConsolidatingLayers(c.P)) {
		on = []int{}
	}
	c.saveAsaoka(on)
}

// lastChange is the day the load last changes in the project.
func (c *Comparison) lastChange() float64 {
	if c.P == nil {
		return 0
	}
	return solver.LastLoadChange(c.P)
}

func (c *Comparison) fromHint() string {
	return sig(c.lastChange(), 4) + " (load)"
}

// asaoka is the outcome of Asaoka's method for one plate.
type asaoka struct {
	I        int
	ID, Name string
	Res      *monitor.AsaokaResult
	Refusal  string
}

// asaokas applies Asaoka's method to every plate of P, with the options
// monitor.AsaokaOptionsFor gives and the window typed.
func (c *Comparison) asaokas() []asaoka {
	if c.P == nil || c.P.Monitoring == nil {
		return nil
	}
	from, to, fm, tm := c.window()
	var out []asaoka
	for i, pl := range c.P.Monitoring.Plates {
		a := asaoka{I: i, ID: fmt.Sprintf("asaoka-%d", i), Name: recordName(pl.Name, "Plate", i)}
		switch {
		case fm != "" || tm != "":
			a.Refusal = "the window of readings above needs attention"
		default:
			a.Res, a.Refusal = plateAsaoka(c.P, i, from, to)
		}
		out = append(out, a)
	}
	return out
}

// plateAsaoka applies Asaoka's method to plate i of p over the readings
// from day from to day to (zero: the defaults), or says why not.
//
// The refusal is the message alone when it concerns the plate's record as
// a whole or the window (what the plate's card shows), and names the
// field otherwise (one reading, monitoring.start).
func plateAsaoka(p *solver.Project, i int, from, to float64) (*monitor.AsaokaResult, string) {
	a, err := monitor.PlateAsaokaWindow(p, i, 0, from, to)
	if err != nil {
		record := solver.JoinPath(form.RecordPath(form.Plates, i), "readings")
		here := func(path string) bool {
			return path == record || path == monitor.AsaokaFrom || path == monitor.AsaokaInterval
		}
		return nil, describeProblemsAt(solver.AsProblems(err), 3, here)
	}
	return a, ""
}

func (c *Comparison) final(a asaoka) string {
	return pm(conv(units.Settlement, a.Res.Final*1000), conv(units.Settlement, a.Res.FinalUncertainty*1000)) + " " + sym(units.Settlement)
}

func (c *Comparison) cv(a asaoka) string {
	if a.Res.DrainagePath == 0 {
		return "– (the column has no drained end)"
	}
	if shown == units.US {
		return pm(conv(units.Consolidation, a.Res.Cv*solver.DaysPerYear), conv(units.Consolidation, a.Res.CvUncertainty*solver.DaysPerYear)) + " " + cvSym()
	}
	return pm(a.Res.Cv, a.Res.CvUncertainty) + " m²/day"
}

// ch is the horizontal coefficient the slope implies on a drained site
// (monitor.DrainCh), or "" without drains.
func (c *Comparison) ch(a asaoka) string {
	if a.Res == nil || c.R == nil || c.R.Drains == nil {
		return ""
	}
	ch, ok := monitor.DrainCh(a.Res, c.R)
	if !ok {
		return "– (the readings' window is outside the prediction)"
	}
	if shown == units.US {
		return cvShown(ch) + " " + cvSym()
	}
	return sig(ch, 3) + " m²/day (" + sig(ch*solver.DaysPerYear, 3) + " m²/year)"
}

func (c *Comparison) cvNote(a asaoka) string {
	if a.Res.DrainagePath == 0 {
		return ""
	}
	var names []string
	for _, i := range a.Res.Layers {
		if c.P != nil && i >= 0 && i < len(c.P.Layers) {
			names = append(names, recordName(c.P.Layers[i].Name, "layer", i))
		}
	}
	through := "the consolidating layers"
	if len(names) > 0 {
		through = strings.Join(names, ", ")
	}
	return fmt.Sprintf("for %s (drainage path %s: their thickness over the drained ends of the column; choose the layers above); the parabolic-isochrone form gives %s",
		through, qty(units.Length, a.Res.DrainagePath, 3), cvShown(a.Res.CvParabolic))
}

func (c *Comparison) betas(a asaoka) string {
	return fmt.Sprintf("β0 = %s %s, β1 = %s", pm(conv(units.Settlement, a.Res.Beta0*1000), conv(units.Settlement, a.Res.Beta0SE*1000)), sym(units.Settlement), pm(a.Res.Beta1, a.Res.Beta1SE))
}

func (c *Comparison) windowText(a asaoka) string {
	r := a.Res
	n := len(r.Times)
	s := fmt.Sprintf("day %s to %s, %d points every %s days", sig(r.Times[0], 4), sig(r.Times[n-1], 4), n, sig(r.Interval, 3))
	switch {
	case r.AutoStart && r.HigherModes > monitor.FirstModeShare:
		s += fmt.Sprintf("; the record is too short for the first Terzaghi mode to dominate (higher modes %.0f %% of the rate at the start), so the forecast is likely low", 100*r.HigherModes)
	case r.AutoStart:
		s += fmt.Sprintf("; starts where the first Terzaghi mode dominates (higher modes below %.0f %% of the rate)", 100*monitor.FirstModeShare)
	}
	return s
}

// hyperbolic is the hyperbolic method's forecast on the same readings.
func (c *Comparison) hyperbolic(a asaoka) string {
	return mm(a.Res.Hyperbolic.Corrected)
}

func (c *Comparison) hyperbolicNote(a asaoka) string {
	return fmt.Sprintf("with the slope correction of Sridharan et al. (1987); the plain hyperbola gives %s, which for Terzaghi-type consolidation is about 20 %% too high", mm(a.Res.Hyperbolic.Final))
}

// startsText lists the forecast for other window starts; the ± of the
// forecast includes the spread of those at or after the chosen start.
func (c *Comparison) startsText(a asaoka) string {
	var parts []string
	for _, r := range a.Res.Starts {
		parts = append(parts, fmt.Sprintf("day %s: %s", sig(r.From, 4), mm(r.Final)))
	}
	return strings.Join(parts, ", ") + fmt.Sprintf(" (the ± above includes a spread of %s over the later starts)", mm(a.Res.FinalSpread))
}

func (c *Comparison) exportAsaoka(a asaoka, format string) {
	if c.Download == nil || a.Res == nil {
		return
	}
	name := fmt.Sprintf("asaoka-plate-%d.%s", a.I+1, format)
	if format == "svg" {
		c.Download(name, "image/svg+xml", []byte(plot.AsaokaSVG("plot-"+a.ID, "Asaoka: "+a.Name, a.Res)))
		return
	}
	c.Download(name, "text/csv", []byte(plot.AsaokaCSV(a.Res)))
}

// badClass is the class suffix of an input with a problem.
func badClass(problem string) string {
	if problem != "" {
		return " pl-bad"
	}
	return ""
}

// noprintIf is the class suffix that keeps an element out of print.
func noprintIf(b bool) string {
	if b {
		return " pl-noprint"
	}
	return ""
}

// residualRecords are the differences of the records for the plot of
// differences against time.
func (c *Comparison) residualRecords() []plot.ResidualRecord {
	var out []plot.ResidualRecord
	for _, r := range c.recs() {
		rr := plot.ResidualRecord{Name: r.Name, Pressure: r.Kind == form.Piezometers}
		for _, row := range r.Rows {
			if row.OK {
				rr.Times = append(rr.Times, row.T)
				rr.Diffs = append(rr.Diffs, row.Diff)
			}
		}
		out = append(out, rr)
	}
	return out
}
