// Package monitor reads field monitoring against a Porelight column: it
// parses readings pasted from a spreadsheet, applies observational methods
// to settlement records, and back-fits the column's parameters to the
// records by least squares on the real solver.
//
// # Overview
//
// Records live in the project file (solver.Monitoring: settlement plates
// and piezometers, each a list of readings by day or by date counted from
// Monitoring.Start) and are validated with the rest of the project by
// solver.Validate. This package works on them:
//
//	rs, err := monitor.ParseReadings(text)            // pasted two-column text
//	a, err := monitor.PlateAsaoka(p, 0, 0)             // Asaoka on plate 0
//	fr, err := monitor.BackFit(p, monitor.FitSpec{Layers: []int{1}}, nil)
//
// ParseReadings reads tab-, comma-, semicolon- or space-separated columns
// with a decimal point or comma and days or dates, and names the line and
// column of every problem (*PasteError).
//
// Asaoka applies Asaoka's (1978) observational method to one settlement
// record: resampled at equal intervals after the last load change, s_j =
// β0 + β1 s_(j−1) is fitted by least squares, s∞ = β0/(1 − β1), and cv
// follows from the first Terzaghi mode, cv = −4d² ln β1/(π² Δt), with d
// the drainage path (the parabolic isochrone form 5d²/12 is reported
// beside it). By default (AsaokaOptionsFor) the window starts where the
// first mode dominates the rate, a criterion from the fit itself
// (FirstModeShare, window.go), and the result lists the forecast for
// other window starts (AsaokaResult.Starts) and folds their spread into
// the ± it states (FinalUncertainty, CvUncertainty).
//
// The implied cv is for the consolidating layers: those named in the
// file (monitoring.asaoka.layers) or else the compressible ones
// (ConsolidatingLayers), not the whole column. Hyperbolic applies the
// hyperbolic method (Tan 1971; with the slope correction of Sridharan et
// al. 1987) to the same readings as a cross-check; Asaoka's result
// carries it.
//
// BackFit fits multipliers on k (so on cv) of chosen layers, and
// optionally one scale on settlement, to the records by Gauss–Newton (the
// modified Newton search of gonum/optimize, newton.go), solving the whole
// column for each trial, with standard
// errors from the Jacobian (Bates & Watts 1988). These assume independent
// readings; they are widened by the effective sample size from the
// residuals' lag-1 autocorrelation, and the 95 % ranges use Student's t
// (FitResult.Assumption says so in words). The plates are compared with
// the settlement of the model the summary uses (FittedSettlement: the
// linear or the non-linear solution, with the drains where there are
// any, plus the secondary compression when a layer has a Cα), which
// FitResult.Model and FitResult.Curve name; the settlement scale
// multiplies the e–log indices as well as mv, so it scales the
// non-linear settlement too.
//
// The package uses only solver's exported API, so it sees the column as
// the page and the JavaScript API do. Units: m, kPa, day, m²/day.
// Functions leave their arguments unchanged.
//
// # Errors
//
// Asaoka, PlateAsaoka and BackFit refuse with solver.Problems, the same
// type Validate and Solve return (solver does not import this package,
// so there is no cycle and no second problem type): each problem has a
// field path, a reason to test with errors.Is (this package's Err*
// values or solver's) and a message that says what was found, with no
// package prefix. Paths name the project's fields where the cause lies
// there ("monitoring.plates[2].readings[5].date", "stepping.endTime");
// arguments that are not project fields have paths with a prefix no
// project field has, given as constants: AsaokaInterval, AsaokaFrom,
// FitLayers ("fit.layers[1]"), FitFrom, FitScale, FitMaxRuns and
// FitSpecPath. A caller shows Message beside the field Path names, and
// never needs to read the error text. ParseReadings, which reads pasted
// text rather than a project, reports *PasteError with line and column.
// Only BackFit's solver.ErrCanceled is a bare sentinel.
package monitor
