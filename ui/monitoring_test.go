package ui

import (
	"encoding/json"
	"fmt"
	"math"
	"slices"
	"strings"
	"testing"

	"porelight/solver"
	"porelight/solver/monitor"
	"porelight/ui/plot"
)

// monColumn is a small invented column: two clays drained at both ends
// under 60 kPa placed over 30 days, with one settlement plate and one
// piezometer (at 5 m, not among the output depths).
func monColumn() *solver.Project {
	return &solver.Project{
		Format: solver.Format,
		Title:  "Monitoring test column",
		Layers: []solver.Layer{
			{Name: "upper clay", Thickness: 3, GammaSat: 17, K: 2e-9, Mv: 8e-4},
			{Name: "lower clay", Thickness: 4, GammaSat: 17.5, K: 1e-9, Mv: 5e-4},
		},
		WaterTable: 0.5,
		Top:        solver.Boundary{Drained: true},
		Bottom:     solver.Boundary{Drained: true},
		Loads:      []solver.Load{{Start: 0, Ramp: 30, Q: 60}},
		Mesh:       solver.MeshSettings{MaxSize: 0.25},
		Monitoring: &solver.Monitoring{
			Plates:      []solver.Plate{{Name: "P1", Readings: []solver.Reading{{T: 0, Value: 0}}}},
			Piezometers: []solver.PiezometerRecord{{Name: "U1", Depth: 5, Readings: []solver.Reading{{T: 10, Value: 50}}}},
		},
	}
}

// monPage opens a page on project p.
func monPage(t *testing.T, p *solver.Project) *page {
	t.Helper()
	data, err := json.Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	pg := newPage(t, Sources{Demo: data})
	if pg.root.Result() == nil {
		t.Fatalf("no result: %s", pg.text("status"))
	}
	return pg
}

// Pasting two spreadsheet columns (tabs, decimal commas, a header, a
// date) fills the record once confirmed; the table shows mm, the model
// holds m; Undo brings the old readings back.
func TestMonitoringPasteFillsRecord(t *testing.T) {
	pr := monColumn()
	pr.Monitoring.Start = "2024-01-01"
	p := monPage(t, pr)
	p.fire("records-toggle", "click", nil) // the records editor is folded
	p.fire("monitoring-plates-0-toggle", "click", nil)
	paste := "Day\tSettlement (mm)\n0\t0\n7\t12,5\n2024-01-15\t20\n"
	p.fire("monitoring-plates-0-paste", "input", map[string]any{"value": paste})
	if got := p.text("monitoring-plates-0-paste-note"); got != "Reads 3 readings, day 0 to 2024-01-15." {
		t.Errorf("paste note %q", got)
	}
	if n := len(p.root.Form().Draft().Monitoring.Plates[0].Readings); n != 1 {
		t.Fatalf("the paste changed the record before it was used: %d readings", n)
	}
	p.fire("monitoring-plates-0-paste-use", "click", nil)
	got := p.root.Form().Draft().Monitoring.Plates[0].Readings
	want := []solver.Reading{{T: 0, Value: 0}, {T: 7, Value: 0.0125}, {Date: "2024-01-15", Value: 0.020}}
	if len(got) != len(want) {
		t.Fatalf("readings %+v, want %+v", got, want)
	}
	for j := range want {
		if got[j].T != want[j].T || got[j].Date != want[j].Date || math.Abs(got[j].Value-want[j].Value) > 1e-15 {
			t.Errorf("reading %d = %+v, want %+v", j, got[j], want[j])
		}
	}
	if v := p.value("monitoring-plates-0-readings-1-value"); v != "12.5" {
		t.Errorf("the table shows %q mm, want 12.5", v)
	}
	if v := p.value("monitoring-plates-0-readings-2-t"); v != "2024-01-15" {
		t.Errorf("the time of reading 3 shows %q", v)
	}
	if m := p.root.resultFor.Monitoring; m == nil || len(m.Plates[0].Readings) != 3 {
		t.Error("the results' project does not hold the pasted readings")
	}
	p.fire("monitoring-plates-0-paste-undo", "click", nil)
	if rs := p.root.Form().Draft().Monitoring.Plates[0].Readings; len(rs) != 1 || rs[0] != (solver.Reading{}) {
		t.Errorf("after Undo: %+v, want the one zero reading", rs)
	}
}

// A paste with mistakes says where they are (line and column) beside the
// box, keeps the text, and leaves the record alone.
func TestMonitoringBadPaste(t *testing.T) {
	p := monPage(t, monColumn())
	p.fire("records-toggle", "click", nil) // the records editor is folded
	p.fire("monitoring-piezometers-0-toggle", "click", nil)
	paste := "0;40\n7;4x\n5;41\n"
	p.fire("monitoring-piezometers-0-paste", "input", map[string]any{"value": paste})
	msg := p.text("monitoring-piezometers-0-paste-err")
	for _, want := range []string{`line 2, column 2: "4x" is not a number`, "line 3, column 1", "day 5 follows day 7 on line 2"} {
		if !strings.Contains(msg, want) {
			t.Errorf("paste errors %q lack %q", msg, want)
		}
	}
	if v := p.value("monitoring-piezometers-0-paste"); v != paste {
		t.Errorf("the box holds %q, want the text pasted", v)
	}
	if p.attr("monitoring-piezometers-0-paste-use", "disabled") == "" {
		t.Error("the paste can be used despite its errors")
	}
	p.fire("monitoring-piezometers-0-paste-use", "click", nil)
	if rs := p.root.Form().Draft().Monitoring.Piezometers[0].Readings; len(rs) != 1 || rs[0].Value != 50 {
		t.Errorf("the record changed: %+v", rs)
	}
}

// Typed times and values are checked like any input: a bad time is named
// beside it and kept; an out-of-order time gets Validate's problem on the
// time input; a date without day 0 flags the start date. Editing only the
// records does not solve again.
func TestMonitoringFieldProblems(t *testing.T) {
	p := monPage(t, monColumn())
	solves := 0
	p.root.Solve = func(q *solver.Project, o *solver.Options) (*solver.Result, error) {
		solves++
		return solver.Solve(q, o)
	}
	p.fire("records-toggle", "click", nil) // the records editor is folded
	p.fire("monitoring-plates-0-toggle", "click", nil)
	p.fire("monitoring-plates-0-add", "click", nil)
	p.typeInto("monitoring-plates-0-readings-1-value", "15")
	if got := p.root.resultFor.Monitoring.Plates[0].Readings; len(got) != 2 || got[1] != (solver.Reading{T: 7, Value: 0.015}) {
		t.Errorf("results' records %+v, want day 7 at 0.015 m", got)
	}
	p.typeInto("monitoring-plates-0-readings-1-t", "3 days")
	if got := p.text("monitoring-plates-0-readings-1-t-err"); !strings.Contains(got, "not a number of days or a date") {
		t.Errorf("error %q", got)
	}
	if got := p.value("monitoring-plates-0-readings-1-t"); got != "3 days" {
		t.Errorf("input shows %q, want the text as typed", got)
	}
	p.typeInto("monitoring-plates-0-readings-1-t", "0")
	if got := p.text("monitoring-plates-0-readings-1-t-err"); !strings.Contains(got, "again") {
		t.Errorf("a repeated time: error %q", got)
	}
	p.typeInto("monitoring-plates-0-readings-1-t", "2024-03-01")
	if got := p.text("monitoring-start-err"); !strings.Contains(got, "required") {
		t.Errorf("a date without day 0: start error %q", got)
	}
	p.typeInto("monitoring-start", "15/02/2024")
	if s := p.root.Form().Draft().Monitoring.Start; s != "2024-02-15" {
		t.Errorf("start stored as %q", s)
	}
	if !p.root.Form().Valid() {
		t.Errorf("still invalid: %v", p.root.Form().Other())
	}
	if solves != 0 {
		t.Errorf("editing only the records solved %d times", solves)
	}
	p.typeInto("monitoring-piezometers-0-depth", "6")
	if solves != 1 {
		t.Errorf("a new piezometer depth solved %d times, want 1 (the prediction there is new)", solves)
	}
}

// The residuals of a record: the prediction interpolated linearly at each
// reading time. Hand calculation on a three-step series: at day 5 the
// settlement is 0.005 m, at day 15 0.02 m; the pore pressure at 2 m is
// 20 kPa at day 10.
func TestResidualsByHand(t *testing.T) {
	p := &solver.Project{Monitoring: &solver.Monitoring{
		Plates: []solver.Plate{{Name: "P", Readings: []solver.Reading{{T: 5, Value: 0.006}, {T: 15, Value: 0.018}, {T: 25, Value: 0.03}}}},
		Piezometers: []solver.PiezometerRecord{
			{Name: "U", Depth: 2, Readings: []solver.Reading{{T: 10, Value: 21}}},
			{Depth: 3, Readings: []solver.Reading{{T: 10, Value: 21}}},
		},
	}}
	r := &solver.Result{Consolidation: &solver.Consolidation{Series: solver.Series{
		Time:        []float64{0, 10, 20},
		Settlement:  []float64{0, 0.01, 0.03},
		Piezometers: []solver.Piezometer{{Depth: 2, Pore: []float64{10, 20, 15}}},
	}}}
	recs := residuals(p, r)
	if len(recs) != 3 {
		t.Fatalf("%d records", len(recs))
	}
	pl := recs[0]
	wantDiff := []float64{1, -2} // mm: 6 − 5, 18 − 20
	for j, d := range wantDiff {
		if !pl.Rows[j].OK || math.Abs(pl.Rows[j].Diff-d) > 1e-9 {
			t.Errorf("plate reading %d: %+v, want difference %g mm", j, pl.Rows[j], d)
		}
	}
	if pl.Rows[2].OK || pl.Rows[2].Note != "after the simulated time" {
		t.Errorf("the reading after the series: %+v", pl.Rows[2])
	}
	if pl.N != 2 || math.Abs(pl.RMS-math.Sqrt(2.5)) > 1e-9 || math.Abs(pl.Mean+0.5) > 1e-9 {
		t.Errorf("plate N %d, RMS %g, mean %g; want 2, √2.5, −0.5", pl.N, pl.RMS, pl.Mean)
	}
	if u := recs[1]; u.N != 1 || math.Abs(u.Rows[0].Predicted-20) > 1e-9 || math.Abs(u.RMS-1) > 1e-9 || u.Unit != "kPa" {
		t.Errorf("piezometer: %+v", u)
	}
	if u := recs[2]; u.N != 0 || !strings.Contains(u.Problem, "no prediction at 3 m") || u.Name != "Piezometer 2" {
		t.Errorf("piezometer without a prediction: %+v", u)
	}
	// With secondary compression the plate is compared with primary plus
	// secondary, the curve the back-fit uses: 6 − (5 + 1), 18 − (20 + 3).
	r.Consolidation.Series.Secondary = []float64{0, 0.002, 0.004}
	if d := residuals(p, r)[0].Rows; math.Abs(d[0].Diff-0) > 1e-9 || math.Abs(d[1].Diff+5) > 1e-9 {
		t.Errorf("with secondary compression: differences %g and %g mm, want 0 and −5", d[0].Diff, d[1].Diff)
	}
}

// The page adds a record's depth to the solve (not to the project), so
// the comparison has a prediction there; the settlement plot marks the
// readings.
func TestMonitoringComparisonOnPage(t *testing.T) {
	pr := monColumn()
	pr.Monitoring.Plates[0].Readings = append(pr.Monitoring.Plates[0].Readings, solver.Reading{T: 20, Value: 0.01})
	p := monPage(t, pr)
	if got := p.root.Form().Draft().Piezometers; len(got) != 0 {
		t.Errorf("the project's output depths became %v", got)
	}
	if got := p.text("res-monitoring-piezometers-0-n"); got != "1" {
		t.Errorf("piezometer readings compared: %q (%s)", got, p.text("residuals"))
	}
	if p.find("mon-caution") == nil {
		t.Error("the comparison has no caution")
	}
	if got := p.text("res-prediction"); !strings.Contains(got, "the primary settlement from mv (linear model)") {
		t.Errorf("the comparison does not name the settlement it compares with: %q", got)
	}
	var names []string
	for _, f := range []*plot.Figure{
		plot.SettlementFigure(p.root.resultFor, p.root.Result(), 0, 0),
		plot.PiezometersFigure(p.root.resultFor, p.root.Result(), 0, 0),
	} {
		for _, pn := range f.Panels {
			for _, s := range pn.Series {
				names = append(names, s.Name)
			}
		}
	}
	for _, want := range []string{"plate P1, measured", "piezometer U1, measured", "z = 5 m, u"} {
		if !slices.Contains(names, want) {
			t.Errorf("no %q among the plotted series %q", want, names)
		}
	}
}

// Asaoka's method on a record too short after the last load change says
// why there is no forecast, in the solver's words.
func TestAsaokaRefusalShown(t *testing.T) {
	pr := monColumn()
	pr.Monitoring.Plates[0].Readings = []solver.Reading{{T: 0}, {T: 40, Value: 0.05}, {T: 60, Value: 0.07}, {T: 80, Value: 0.08}}
	p := monPage(t, pr)
	got := p.text("asaoka-0-refused")
	// The card is the plate's: the message alone, no path in front.
	if !strings.HasPrefix(got, "No forecast: too few points: 3 readings between day 30 and day 80") {
		t.Errorf("refusal %q", got)
	}
	if p.find("asaoka-0-final") != nil {
		t.Error("a forecast shows beside the refusal")
	}
	// A window that is not a number is named, and no forecast is tried.
	p.typeInto("asaoka-from", "x")
	if got := p.text("asaoka-from-err"); got != "not a number" {
		t.Errorf("window error %q", got)
	}
}

// synthRecords fills the records of p from a solve with layer 0's k
// multiplied by kf: the plate every 10 days to day 600, the piezometer
// every 20 (manufactured data, no noise).
func synthRecords(t *testing.T, p *solver.Project, kf float64) {
	t.Helper()
	q := *solveInput(p)
	q.Layers = slices.Clone(p.Layers)
	q.Layers[0].K *= kf
	r, err := solver.Solve(&q, nil)
	if err != nil {
		t.Fatal(err)
	}
	s := &r.Consolidation.Series
	pl, pz := &p.Monitoring.Plates[0], &p.Monitoring.Piezometers[0]
	pl.Readings, pz.Readings = nil, nil
	for d := 10.0; d <= 600; d += 10 {
		pl.Readings = append(pl.Readings, solver.Reading{T: d, Value: solver.SeriesAt(s.Time, s.Settlement, d)})
		if int(d)%20 == 0 {
			pz.Readings = append(pz.Readings, solver.Reading{T: d, Value: solver.SeriesAt(s.Time, s.Piezometers[0].Pore, d)})
		}
	}
}

// The fit panel runs BackFit on the chosen layer and shows what it
// found: manufactured readings (upper clay k × 2, no noise) give back a
// multiplier of 2 (to 1e-3: the search stops within 1 % of a standard
// error, which is tiny without noise). Apply puts the fitted k in the
// project as an edit; Revert puts the old one back.
func TestFitApplyRevert(t *testing.T) {
	pr := monColumn()
	synthRecords(t, pr, 2)
	p := monPage(t, pr)
	if p.attr("fit-run", "disabled") == "" {
		t.Error("Fit is enabled with nothing chosen")
	}
	p.fire("fit-layer-0", "change", map[string]any{"checked": true})
	p.fire("fit-run", "click", nil)
	if e := p.find("fit-error"); e != nil {
		t.Fatalf("fit refused: %s", p.text("fit-error"))
	}
	res := p.root.fit.res
	if res == nil || len(res.Params) != 1 || math.Abs(res.Params[0].Multiplier-2) > 1e-3 {
		t.Fatalf("fit result %+v", res)
	}
	if got := p.text("fit-param-0-mult"); !strings.HasPrefix(got, "2.0") {
		t.Errorf("multiplier shows %q", got)
	}
	if got := p.text("fit-curve"); !strings.Contains(got, "primary settlement from mv (linear model)") {
		t.Errorf("the fit does not say which settlement it compared with: %q", got)
	}
	if got := p.text("fit-assumption"); !strings.Contains(got, "independent readings") || !strings.Contains(got, "Student's t") {
		t.Errorf("the fit does not state its assumption: %q", got)
	}
	if got := p.text("fit-rms"); !strings.Contains(got, "Settlement:") || !strings.Contains(got, "Pore pressure:") {
		t.Errorf("RMS lines %q", got)
	}
	if !strings.Contains(p.html(), "From mv, back-fitted") {
		t.Error("the settlement plot does not show the back-fitted prediction")
	}
	k0 := p.root.Form().Draft().Layers[0].K
	p.fire("fit-apply", "click", nil)
	k1 := p.root.Form().Draft().Layers[0].K
	// Applied to 3 significant figures: within half a unit of the third
	// (5e-3 relative), and typed so.
	if math.Abs(k1/(k0*res.Params[0].Multiplier)-1) > 5e-3 {
		t.Errorf("applied k %g, want %g × %g", k1, k0, res.Params[0].Multiplier)
	}
	if s := p.root.Form().Text(lp(0, "k")); len(strings.TrimLeft(strings.Split(strings.ReplaceAll(s, ".", ""), "e")[0], "0")) > 3 {
		t.Errorf("the applied k reads %q: more than 3 significant figures", s)
	}
	if p.root.resultFor.Layers[0].K != k1 {
		t.Error("the project was not solved again with the fitted k")
	}
	if strings.Contains(p.html(), "From mv, back-fitted") {
		t.Error("the back-fitted curve still shows beside the applied prediction")
	}
	p.fire("fit-revert", "click", nil)
	if k := p.root.Form().Draft().Layers[0].K; k != k0 {
		t.Errorf("k after Revert %g, want %g", k, k0)
	}
	if p.find("fit-apply") == nil {
		t.Error("Apply is not offered again after Revert")
	}
}

// Cancel stops a fit through its Progress callback; the panel says so and
// keeps nothing.
func TestFitCancel(t *testing.T) {
	p := monPage(t, monColumn())
	var stopped bool
	p.root.BackFit = func(q *solver.Project, spec monitor.FitSpec, o *solver.Options) (*monitor.FitResult, error) {
		if !o.Progress(0.1) {
			t.Error("Progress stopped a fit that was not cancelled")
		}
		p.root.cancelFit() // the user clicks Cancel meanwhile
		stopped = !o.Progress(0.2)
		return nil, solver.ErrCanceled
	}
	p.fire("fit-scale", "change", map[string]any{"checked": true})
	p.fire("fit-run", "click", nil)
	if !stopped {
		t.Error("Progress did not stop the fit after Cancel")
	}
	if p.find("fit-canceled") == nil || p.find("fit-result") != nil {
		t.Errorf("after Cancel: %s", p.text("backfit"))
	}
}

// fitError shows the solver's problems as they are: the message alone
// for the fit panel's own choices, the field path in front of a problem
// of the project, and nothing is read out of the error text.
func TestFitError(t *testing.T) {
	cases := []struct {
		name string
		err  error
		want string
	}{
		{"the panel's choice", solver.Problems{{Path: monitor.FitLayers + "[0]", Message: "layer 5 is out of range", Err: solver.ErrOutOfRange}},
			"layer 5 is out of range"},
		{"the request", solver.Problems{{Path: monitor.FitSpecPath, Message: "nothing to fit", Err: monitor.ErrNothingToFit}}, "nothing to fit"},
		{"a field of the project", solver.Problems{{Path: "stepping.endTime", Message: "a reading on day 600 is after the end", Err: solver.ErrConflict}},
			"stepping end time: a reading on day 600 is after the end"},
		{"a field that only starts like the panel's", solver.Problems{{Path: "fitted", Message: "m", Err: solver.ErrUnknown}}, "fitted: m"},
		{"several", solver.Problems{{Path: "layers[0].k", Message: "must be > 0", Err: solver.ErrNotPositive}, {Path: monitor.FitFrom, Message: "too few points", Err: monitor.ErrTooFewPoints}},
			"layer 1, k: must be > 0; too few points"},
	}
	for _, c := range cases {
		if got := fitError(c.err); got != c.want {
			t.Errorf("%s: %q, want %q", c.name, got, c.want)
		}
	}
}

// On the demo, each plate's Asaoka card shows how the window was chosen,
// the forecasts for other window starts (whose spread the ± includes),
// the hyperbolic cross-check and the layers of the drainage path, with the
// figures the solver gives (monitor.PlateAsaoka).
func TestAsaokaCardExplains(t *testing.T) {
	p := newPage(t, Sources{})
	a, err := monitor.PlateAsaoka(p.root.resultFor, 0, 0)
	if err != nil {
		t.Fatal(err)
	}
	checks := map[string]string{
		"asaoka-0-window":     "first Terzaghi mode",
		"asaoka-0-starts":     fmt.Sprintf("spread of %.0f mm", a.FinalSpread*1000),
		"asaoka-0-hyperbolic": fmt.Sprintf("%.0f mm", a.Hyperbolic.Corrected*1000),
		"asaoka-0-final":      fmt.Sprintf("%.0f", a.Final*1000),
	}
	for id, want := range checks {
		if got := p.text(id); !strings.Contains(got, want) {
			t.Errorf("%s: %q does not say %q", id, got, want)
		}
	}
	if got := p.text("asaoka-0"); !strings.Contains(got, "drainage path") || !strings.Contains(got, "slope correction of Sridharan") {
		t.Errorf("the card names no drainage path or hyperbolic correction: %q", got)
	}
}

// The drainage path and the window of Asaoka's method are chosen on the
// page and saved in the project (monitoring.asaoka): taking the crust out
// of the demo's path shortens it by the crust's half (two drained ends),
// and a typed window start is saved; the card follows once the edit is
// committed. Figures from monitor.PlateAsaoka on the saved project.
func TestAsaokaChoicesSaved(t *testing.T) {
	p := newPage(t, Sources{})
	before := p.root.resultFor
	if p.find("asaoka-layer-0") == nil || !slices.Contains(monitor.AsaokaOptionsFor(before).Layers, 0) {
		t.Fatal("no drainage path choice for the crust, or the crust is not in the default path")
	}
	p.fire("asaoka-layer-0", "change", map[string]any{"checked": false})
	p.typeInto("asaoka-from", "600")
	a := p.root.Form().Draft().Monitoring.Asaoka
	if a == nil || a.From != 600 || slices.Contains(a.Layers, 0) || len(a.Layers) == 0 {
		t.Fatalf("saved choices %+v", a)
	}
	model := p.root.Form().Model()
	want, err := monitor.PlateAsaoka(model, 0, 0)
	if err != nil {
		t.Fatal(err)
	}
	d := 0.0
	for _, i := range a.Layers {
		d += model.Layers[i].Thickness
	}
	if want.DrainagePath != d/2 || want.Times[0] < 600 {
		t.Errorf("path %g m (want %g), window from day %g", want.DrainagePath, d/2, want.Times[0])
	}
}

// With monitoring.start the plots offer calendar dates: ticking the box
// redraws the settlement and piezometer plots and the differences against
// time on a date axis from day 0, and the SVG export follows; without a
// start there is no box. The differences plot shows under the residuals.
func TestPlotsOnDates(t *testing.T) {
	pr := monColumn()
	p := monPage(t, pr)
	if p.find("plot-dates") != nil {
		t.Error("the calendar date choice shows without monitoring.start")
	}
	pr.Monitoring.Start = "2026-03-02"
	p = monPage(t, pr)
	if p.find("plot-dates") == nil {
		t.Fatal("no calendar date choice with monitoring.start set")
	}
	const title = "Date (day 0 = 2026-03-02)"
	if strings.Contains(p.html(), title) {
		t.Error("the plots start on calendar dates")
	}
	if p.find("plot-residuals") == nil {
		t.Error("no plot of the differences against time")
	}
	p.fire("plot-dates", "change", map[string]any{"checked": true})
	// The settlement and piezometer plots, and both panels (plates,
	// piezometers) of the differences against time.
	if n := strings.Count(p.html(), title); n != 4 {
		t.Errorf("%d time axes on calendar dates, want 4 (settlement, piezometers, the two panels of differences)", n)
	}
	svg, _, err := plotFile("settlement", "svg", p.root.resultFor, p.root.Result(), nil, plot.RecordAxes{Dates: p.root.dates})
	if err != nil || !strings.Contains(string(svg), title) {
		t.Errorf("the SVG export is not on calendar dates (%v)", err)
	}
	const level = "Water level (total head), m above the top"
	if strings.Contains(p.html(), level) {
		t.Error("the piezometers start as water levels")
	}
	p.fire("plot-level", "change", map[string]any{"checked": true})
	if !strings.Contains(p.html(), level) {
		t.Error("the piezometer plot does not show water levels once chosen")
	}
}
