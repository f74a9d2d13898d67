package monitor

import (
	"porelight/solver"

	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/stat/distuv"
)

// FitData selects the records BackFit compares the prediction with.
type FitData int

const (
	FitAll         FitData = iota // every plate and piezometer record
	FitSettlements                // the plates only
	FitPressures                  // the piezometers only
)

// Back-analysis constants.
const (
	defaultFitRuns = 200
	fitStep        = 1e-4         // forward difference step in ln(multiplier)
	maxLogMult     = 13.815510558 // ln 1e6: multipliers stay within 1e-6 … 1e6
	fitTolerance   = 0.01         // stop when a Gauss–Newton step is below 1 % of the standard error
)

// Reasons BackFit refuses a request, beside ErrTooFewPoints and the
// solver's own Err* values.
var (
	ErrNoChange     = errors.New("has no load or pressure change")
	ErrNothingToFit = errors.New("names nothing to fit")
	ErrTwice        = errors.New("names a layer twice")
)

// Paths of the FitSpec fields in BackFit's problems: not fields of a
// project, so they have a prefix no project field has. A layer index is
// FitLayers with its position, "fit.layers[1]".
const (
	FitSpecPath = "fit"          // the request as a whole
	FitLayers   = "fit.layers"   // FitSpec.Layers
	FitChLayers = "fit.chLayers" // FitSpec.ChLayers
	FitScale    = "fit.scale"    // FitSpec.Scale
	FitFrom     = "fit.from"     // FitSpec.From
	FitMaxRuns  = "fit.maxRuns"  // FitSpec.MaxRuns
)

// FitSpec says what BackFit adjusts and against which readings. The zero
// value fits nothing and is refused: name at least one layer or Scale.
type FitSpec struct {
	// Layers are the indices of the layers whose permeability k is
	// multiplied by a fitted factor; mv stays, so cv = k/(mv γw) takes
	// the same factor. Each index at most once.
	Layers []int `json:"layers,omitempty"`
	// ChLayers are the indices of the layers whose horizontal
	// coefficient of consolidation ch (toward the drains) is multiplied
	// by a fitted factor: the layer's ch as the project resolves it
	// (solver.LayerCh) becomes an explicit ch. Needs drains. Each index
	// at most once.
	ChLayers []int `json:"chLayers,omitempty"`
	// Scale, when true, also fits one factor S on the settlement: mv and
	// k of every layer are both multiplied by S, so every cv and every
	// excess pore pressure stays and the linear settlement curve scales
	// by S (its final value too); it is the same as scaling the predicted
	// curve, but done in the project so that the fitted project shows it.
	// Where a layer has an e–log curve, its Cc, Cr and Ck are multiplied
	// by S as well, so its e–log settlement scales by S and, in the
	// non-linear model, every strain does while k(e) and cv stay; its Cα
	// stays (one given as CalphaCc becomes the explicit Calpha), so the
	// secondary compression is not scaled. The steady flux through the
	// column scales with S too, and under a fixed inflow at an undrained
	// end so does the steady head loss (by 1/S); the fit sees this, as
	// every prediction comes from Solve.
	Scale bool `json:"scale,omitempty"`
	// Data selects the records; the zero value uses all of them.
	Data FitData `json:"data,omitempty"`
	// From leaves out readings taken before this time, days (e.g. while
	// the plates settled in). Zero uses every reading.
	From float64 `json:"from,omitempty"`
	// SettlementSigma (m) and PressureSigma (kPa) are the standard
	// deviation of one reading. Zero means each record's own range of
	// values (largest minus smallest reading; 0.01 m or 1 kPa if the
	// record is flat): every record then counts in proportion to its
	// number of readings whatever its unit.
	SettlementSigma float64 `json:"settlementSigma,omitempty"`
	PressureSigma   float64 `json:"pressureSigma,omitempty"`
	// MaxRuns caps the number of solver runs. Zero means 200.
	MaxRuns int `json:"maxRuns,omitempty"`
}

// FitResult is the outcome of BackFit.
type FitResult struct {
	// Model is the consolidation model of the summary
	// (solver.Summary.Model) and Curve names the settlement the plate
	// readings are compared with, in words: that model's settlement
	// (solver.Series.Settlement: from mv in the linear model, the one
	// non-linear solution in the non-linear model, with the drains
	// wherever the project has them), plus the secondary compression
	// (Series.Secondary) when a layer has a Cα, as a plate measures both.
	// The linear model's headline settlement is the one from mv; its
	// e–log σ′ estimate (Series.SettlementElog) is not a solution of the
	// time loop and is not fitted.
	Model string `json:"model"`
	Curve string `json:"curve"`
	// Params holds one entry per fitted layer, in the order of
	// FitSpec.Layers, then the settlement scale when fitted.
	Params []FitParam `json:"params"`
	// Correlation is the correlation matrix of the fitted log
	// multipliers, in the order of Params. Values near ±1 mean the
	// records can hardly tell the two parameters apart; the row and
	// column of a parameter that is not Determined are zero.
	Correlation [][]float64 `json:"correlation"`
	// Readings is the number of readings compared.
	Readings int `json:"readings"`
	// The standard errors assume independent readings; field readings
	// are usually serially correlated (a plate settles with its
	// neighbourhood, an instrument drifts), which makes that assumption
	// optimistic. Lag1 is the lag-1 autocorrelation ρ of the weighted
	// residuals, pooled over the records (each in time order);
	// EffectiveReadings is n(1 − ρ)/(1 + ρ) when ρ > 0, else n (the
	// effective sample size of an AR(1) series; common practice, e.g.
	// Wilks, Statistical Methods in the Atmospheric Sciences, from
	// memory). The SE and LogSE of Params are those of independent
	// readings times √(n/EffectiveReadings), and Low and High use
	// TQuantile, the two-sided 95 % point of Student's t with
	// EffectiveReadings − p degrees of freedom (at least 1), instead of
	// the normal 1.96. Assumption says this in words.
	Lag1              float64 `json:"lag1"`
	EffectiveReadings float64 `json:"effectiveReadings"`
	TQuantile         float64 `json:"tQuantile"`
	Assumption        string  `json:"assumption"`
	// ResidualVariance is Σr²/(n − p) of the weighted residuals r
	// (reading minus prediction, over its sigma) for n readings and p
	// parameters: about 1 when the sigmas are right.
	ResidualVariance float64 `json:"residualVariance"`
	// RMSSettlement (m) and RMSPressure (kPa) are the root mean square
	// differences between reading and prediction after the fit, and the
	// Initial ones before it (nil when no such reading is compared).
	RMSSettlement        *float64 `json:"rmsSettlement,omitempty"`
	RMSPressure          *float64 `json:"rmsPressure,omitempty"`
	InitialRMSSettlement *float64 `json:"initialRmsSettlement,omitempty"`
	InitialRMSPressure   *float64 `json:"initialRmsPressure,omitempty"`
	// Runs is the number of solver runs, the final one included.
	Runs int `json:"runs"`
	// Converged is true when the last Gauss–Newton step was smaller than
	// 1 % of every determined parameter's standard error; Status says how
	// the search ended.
	Converged bool   `json:"converged"`
	Status    string `json:"status"`
	// Records holds, per record compared, the readings with the
	// prediction before and after the fit at the reading times.
	Records []FitRecord `json:"records"`
	// Project is a copy of the project with the fitted values, and
	// Result its solution (with the project's own outputs and stepping).
	Project *solver.Project `json:"-"`
	Result  *solver.Result  `json:"-"`
}

// FitParam is one fitted multiplier.
type FitParam struct {
	// Name is "layers[i].k" for a layer, "settlement scale" for S.
	Name  string `json:"name"`
	Layer int    `json:"layer"` // −1 for the settlement scale
	// Multiplier is the fitted factor; SE its standard error (first-order,
	// Multiplier × LogSE); LogSE the standard error of ln Multiplier; Low
	// and High the approximate 95 % range m·exp(∓1.96 LogSE).
	Multiplier float64 `json:"multiplier"`
	// Determined is false when the readings cannot fix the parameter (its
	// effect on them is nil, or it trades off exactly with another):
	// Multiplier is then wherever the search left it and SE, LogSE, Low
	// and High are 0.
	Determined bool    `json:"determined"`
	SE         float64 `json:"se"`
	LogSE      float64 `json:"logSE"`
	Low        float64 `json:"low"`
	High       float64 `json:"high"`
	// InitialCv and Cv are the layer's cv before and after the fit,
	// m²/day (0 for the settlement scale); for a ch parameter
	// ("layers[i].ch") InitialCh and Ch are its ch instead.
	InitialCv float64 `json:"initialCv,omitempty"`
	Cv        float64 `json:"cv,omitempty"`
	InitialCh float64 `json:"initialCh,omitempty"`
	Ch        float64 `json:"ch,omitempty"`
}

// FitRecord compares one record with the prediction.
type FitRecord struct {
	Path string `json:"path"` // "monitoring.plates[0]", "monitoring.piezometers[1]"
	Name string `json:"name,omitempty"`
	// Kind is "settlement" (m) or "pressure" (kPa, what the piezometer
	// reads).
	Kind  string  `json:"kind"`
	Sigma float64 `json:"sigma"` // the weight's scale, m or kPa
	// Times (days), the readings, and the prediction at those times
	// before and after the fit.
	Times    []float64 `json:"times"`
	Measured []float64 `json:"measured"`
	Initial  []float64 `json:"initial"`
	Fitted   []float64 `json:"fitted"`
	// RMS and InitialRMS are the root mean square differences, m or kPa.
	RMS        float64 `json:"rms"`
	InitialRMS float64 `json:"initialRms"`
}

// BackFit adjusts the permeability of chosen layers (and optionally a
// settlement scale) so that the prediction of p best matches the field
// readings in p.Monitoring, by weighted least squares.
//
// # Method
//
// The parameters are the natural logarithms of the multipliers, so the
// multipliers stay positive; they start at 0 (the project as given). For
// each trial the project is solved in full (Solve), the settlement of the
// model the summary uses (FittedSettlement: the linear or non-linear
// solution, with the drains, plus the secondary compression when there
// is one; FitResult.Curve names it) and the pore pressure at each
// piezometer's depth are
// interpolated linearly in time at the reading times, and the weighted
// residuals r = (prediction − reading)/σ are formed, σ being the record's
// sigma (see FitSpec). The sum ½Σr² is minimised by Gauss–Newton: the
// Jacobian J of r is taken by forward differences (step 1e-4 in ln m, one
// solver run per parameter), and a Newton search (gonum's optimize.Newton
// written out in newton.go) is given the gradient Jᵀr and the
// Gauss–Newton Hessian JᵀJ, with a backtracking (Armijo) line search. The search stops when the next Gauss–Newton step
// would move every log multiplier by less than 1 % of its standard
// error, or after FitSpec.MaxRuns runs. At the optimum the covariance of
// the log multipliers is s²(JᵀJ)⁻¹ with s² = Σr²/(n − p) (Bates & Watts
// 1988, Nonlinear Regression Analysis, ch. 2); the standard error of a
// multiplier follows to first order.
//
// The runs of the search use the project's own mesh and stepping: no
// coarsening. They end a little after the last reading (far enough that,
// for a step growth up to about 1.5, the steps up to the last reading
// are those of the full run, so the fitted curve is the one the final
// run shows) and skip validating the monitoring records again. A fit of
// one to three multipliers typically takes 7–25 runs.
//
// Progress (opt.Progress) is reported between and during runs as the
// fraction of an expected number of runs; returning false stops the fit
// with ErrCanceled.
//
// Every error but solver.ErrCanceled is a solver.Problems list, each
// problem with a path and a reason: a project that fails Validate (its
// Problems); no load or pressure change ("loads", ErrNoChange); a layer
// index out of range or repeated ("fit.layers[i]", solver.ErrOutOfRange
// or ErrTwice); nothing to fit ("fit", ErrNothingToFit); no records or
// fewer readings than parameters + 1 ("monitoring" or "fit.from",
// ErrTooFewPoints); readings after the end of the simulation
// ("stepping.endTime", solver.ErrConflict); a run that failed at the
// fitted values (the solver's problem); the run limit ("fit.maxRuns",
// solver.ErrTooLarge).
func BackFit(p *solver.Project, spec FitSpec, opt *solver.Options) (*FitResult, error) {
	if err := solver.Validate(p); err != nil {
		return nil, err
	}
	if !solver.HasConsolidation(p) {
		return nil, refuse("loads", ErrNoChange, "the project %v, so there is nothing to compare with the readings", ErrNoChange)
	}
	f := &fitter{spec: spec, opt: opt, cache: map[string]*fitEval{}}
	seen := map[int]bool{}
	for i, li := range spec.Layers {
		if li < 0 || li >= len(p.Layers) {
			return nil, refuse(solver.IndexPath(FitLayers, i), solver.ErrOutOfRange, "layer %d %v (the project has %d layers)", li, solver.ErrOutOfRange, len(p.Layers))
		}
		if seen[li] {
			return nil, refuse(solver.IndexPath(FitLayers, i), ErrTwice, "layer %d is named twice", li)
		}
		seen[li] = true
	}
	seenCh := map[int]bool{}
	for i, li := range spec.ChLayers {
		at := solver.IndexPath(FitChLayers, i)
		switch {
		case p.Drains == nil:
			return nil, refuse(at, solver.ErrConflict, "fitting ch needs drains in the project (%v)", solver.ErrConflict)
		case li < 0 || li >= len(p.Layers):
			return nil, refuse(at, solver.ErrOutOfRange, "layer %d %v (the project has %d layers)", li, solver.ErrOutOfRange, len(p.Layers))
		case seenCh[li]:
			return nil, refuse(at, ErrTwice, "layer %d is named twice", li)
		}
		seenCh[li] = true
	}
	np := len(spec.Layers) + len(spec.ChLayers)
	if spec.Scale {
		np++
	}
	if np == 0 {
		return nil, refuse(FitSpecPath, ErrNothingToFit, "nothing to fit: name at least one layer, or the settlement scale")
	}
	f.np = np
	f.budget = spec.MaxRuns
	if f.budget <= 0 {
		f.budget = defaultFitRuns
	}
	f.expected = min(f.budget, 2+8*(np+1))
	if err := f.collect(p); err != nil {
		return nil, err
	}
	if f.n < np+1 {
		return nil, refuse("monitoring", ErrTooFewPoints, "%v: %d readings for %d parameters; at least %d are needed", ErrTooFewPoints, f.n, np, np+1)
	}

	// The project every run starts from.
	last := 0.0
	for _, r := range f.recs {
		last = math.Max(last, r.times[len(r.times)-1])
	}
	full := solver.EndTime(p)
	if last > full {
		return nil, refuse("stepping.endTime", solver.ErrConflict, "a reading on day %g is after the end of the simulation on day %g; set stepping.endTime later", last, full)
	}
	base := *p
	base.Monitoring = nil
	base.Piezometers = nil
	for _, r := range f.recs {
		if r.kind == kindPressure {
			r.pz = len(base.Piezometers)
			base.Piezometers = append(base.Piezometers, r.depth)
		}
	}
	if p.Stepping.EndTime == 0 {
		g := solver.ResolveStepping(p).Growth
		if den := 1 - 1.25*(1-1/g); den > 0.2 {
			base.Stepping.EndTime = math.Min(full, 1.05*last/den+1)
		}
	}
	f.base = &base

	// The project as given: predictions before the fit, cv and mv.
	x0 := make([]float64, np)
	r0, err := f.solve(&base)
	if err != nil {
		return nil, err
	}
	f.mv0 = make([]float64, len(p.Layers))
	f.ch0 = make([]float64, len(p.Layers))
	for i := range p.Layers {
		f.mv0[i] = r0.Summary.Layers[i].Mv
		if r0.Drains != nil {
			f.ch0[i], _ = solver.LayerCh(&p.Layers[i], f.mv0[i], solver.ResolveGammaW(p))
		}
	}
	f.store(x0, f.extract(r0))

	prob := newtonProblem{
		fn:   f.objective,
		grad: f.gradient,
		hess: f.hessian,
		status: func() (string, error) {
			switch {
			case f.err != nil:
				return statusFailure, f.err
			case f.runs >= f.budget:
				return statusEvaluationLimit, nil
			}
			return "", nil
		},
		converged: f.converged,
		majors:    100,
	}
	f.search = true
	res, merr := newtonMinimize(prob, x0)
	f.search = false
	if f.err != nil {
		return nil, f.err
	}
	xs := x0
	status := "not started"
	if res != nil {
		xs = res.X
		status = res.Status
	}
	if merr != nil {
		status += ": " + merr.Error()
	}

	// Statistics at the optimum.
	ev, err := f.eval(xs, true)
	if err != nil {
		if f.err != nil {
			return nil, f.err
		}
		return nil, atFitted(err)
	}
	st := f.stats(ev)
	out := &FitResult{Readings: f.n, ResidualVariance: st.s2, Converged: st.small, Status: status, Model: r0.Summary.Model}
	_, out.Curve = FittedSettlement(r0)
	out.Lag1 = f.lag1(f.residuals(ev.pred))
	out.EffectiveReadings = float64(f.n)
	if out.Lag1 > 0 {
		out.EffectiveReadings *= (1 - out.Lag1) / (1 + out.Lag1)
	}
	widen := math.Sqrt(float64(f.n) / out.EffectiveReadings)
	out.TQuantile = distuv.StudentsT{Mu: 0, Sigma: 1, Nu: math.Max(1, out.EffectiveReadings-float64(np))}.Quantile(0.975)
	out.Assumption = fmt.Sprintf("standard errors for independent readings, widened ×%.2g for the serial correlation of the residuals (lag-1 %.2f: %.0f effective of %d readings); 95 %% ranges with Student's t (%.3g)",
		widen, out.Lag1, out.EffectiveReadings, f.n, out.TQuantile)
	for i := range np {
		m := math.Exp(xs[i])
		fp := FitParam{Name: "settlement scale", Layer: -1, Multiplier: m, Determined: st.determined[i]}
		if fp.Determined {
			lse := widen * math.Sqrt(st.cov.At(i, i))
			fp.LogSE, fp.SE = lse, m*lse
			fp.Low, fp.High = m*math.Exp(-out.TQuantile*lse), m*math.Exp(out.TQuantile*lse)
		}
		if i < len(spec.Layers) {
			li := spec.Layers[i]
			fp.Name, fp.Layer = fmt.Sprintf("layers[%d].k", li), li
			fp.InitialCv = r0.Summary.Layers[li].Cv
			fp.Cv = fp.InitialCv * m
		} else if j := i - len(spec.Layers); j < len(spec.ChLayers) {
			li := spec.ChLayers[j]
			fp.Name, fp.Layer = fmt.Sprintf("layers[%d].ch", li), li
			fp.InitialCh = f.ch0[li]
			fp.Ch = fp.InitialCh * m
		}
		out.Params = append(out.Params, fp)
	}
	out.Correlation = make([][]float64, np)
	for i := range np {
		out.Correlation[i] = make([]float64, np)
		for j := range np {
			if st.determined[i] && st.determined[j] {
				out.Correlation[i][j] = st.cov.At(i, j) / math.Sqrt(st.cov.At(i, i)*st.cov.At(j, j))
			}
		}
	}

	// Records and RMS, before and after.
	pred0 := f.cache[fitKey(x0)].pred
	var sum [2][2]float64 // [kind][before, after]
	var cnt [2]int
	k := 0
	for _, r := range f.recs {
		fr := FitRecord{Path: r.path, Name: r.name, Kind: []string{"settlement", "pressure"}[r.kind], Sigma: r.sigma,
			Times: r.times, Measured: r.values}
		m := len(r.times)
		fr.Initial = slices.Clone(pred0[k : k+m])
		fr.Fitted = slices.Clone(ev.pred[k : k+m])
		var s0, s1 float64
		for j := range m {
			s0 += fitSq(fr.Initial[j] - r.values[j])
			s1 += fitSq(fr.Fitted[j] - r.values[j])
		}
		fr.InitialRMS, fr.RMS = math.Sqrt(s0/float64(m)), math.Sqrt(s1/float64(m))
		sum[r.kind][0] += s0
		sum[r.kind][1] += s1
		cnt[r.kind] += m
		out.Records = append(out.Records, fr)
		k += m
	}
	if c := cnt[kindSettlement]; c > 0 {
		out.InitialRMSSettlement = ptr(math.Sqrt(sum[kindSettlement][0] / float64(c)))
		out.RMSSettlement = ptr(math.Sqrt(sum[kindSettlement][1] / float64(c)))
	}
	if c := cnt[kindPressure]; c > 0 {
		out.InitialRMSPressure = ptr(math.Sqrt(sum[kindPressure][0] / float64(c)))
		out.RMSPressure = ptr(math.Sqrt(sum[kindPressure][1] / float64(c)))
	}

	// The fitted project, solved as the user set it up.
	fitted := *p
	fitted.Layers = slices.Clone(p.Layers)
	f.apply(fitted.Layers, xs)
	out.Project = &fitted
	f.reference = true
	out.Result, err = f.solve(&fitted)
	if err != nil {
		return nil, err
	}
	out.Runs = f.runs
	if opt != nil && opt.Progress != nil && !opt.Progress(1) {
		return nil, solver.ErrCanceled
	}
	return out, nil
}

// Record kinds.
const (
	kindSettlement = iota
	kindPressure
)

// fitRec is one record as compared: its readings from FitSpec.From on.
type fitRec struct {
	kind       int
	path, name string
	depth      float64 // piezometers
	pz         int     // index in the run project's piezometers
	sigma      float64
	times      []float64
	values     []float64
}

// fitEval is one point of the search: the predictions at the readings
// and, once asked for, the Jacobian of the weighted residuals.
type fitEval struct {
	pred []float64
	jac  *mat.Dense // n × np
}

// fitter holds the state of one back-analysis.
type fitter struct {
	spec      FitSpec
	opt       *solver.Options
	base      *solver.Project
	recs      []*fitRec
	n, np     int
	mv0       []float64
	ch0       []float64 // each layer's ch as the project resolves it (drains only)
	cache     map[string]*fitEval
	runs      int
	budget    int
	expected  int
	search    bool  // the search is running: MaxRuns applies
	reference bool  // the final run: with the drains' Uv and Uh
	err       error // sticky: canceled or a failed run
}

// collect gathers the records of p.Monitoring chosen by the spec.
func (f *fitter) collect(p *solver.Project) error {
	m := p.Monitoring
	if m == nil {
		return refuse("monitoring", ErrTooFewPoints, "%v: the project has no monitoring records", ErrTooFewPoints)
	}
	add := func(kind int, path, name string, depth float64, rs []solver.Reading) error {
		ts, err := solver.ReadingTimesAt(m, rs, solver.JoinPath(path, "readings"))
		if err != nil {
			return err
		}
		r := &fitRec{kind: kind, path: path, name: name, depth: depth}
		for j, t := range ts {
			if t >= f.spec.From {
				r.times = append(r.times, t)
				r.values = append(r.values, rs[j].Value)
			}
		}
		if len(r.times) == 0 {
			return nil
		}
		lo, hi := slices.Min(r.values), slices.Max(r.values)
		r.sigma = hi - lo
		user, flat := f.spec.SettlementSigma, 0.01
		if kind == kindPressure {
			user, flat = f.spec.PressureSigma, 1
		}
		switch {
		case user > 0:
			r.sigma = user
		case !(r.sigma > 0):
			r.sigma = flat
		}
		f.recs = append(f.recs, r)
		f.n += len(r.times)
		return nil
	}
	if f.spec.Data != FitPressures {
		for i, pl := range m.Plates {
			if err := add(kindSettlement, fmt.Sprintf("monitoring.plates[%d]", i), pl.Name, 0, pl.Readings); err != nil {
				return err
			}
		}
	}
	if f.spec.Data != FitSettlements {
		for i, pz := range m.Piezometers {
			if err := add(kindPressure, fmt.Sprintf("monitoring.piezometers[%d]", i), pz.Name, pz.Depth, pz.Readings); err != nil {
				return err
			}
		}
	}
	if f.n == 0 {
		return refuse(FitFrom, ErrTooFewPoints, "%v: no reading to compare with on or after day %g", ErrTooFewPoints, f.spec.From)
	}
	return nil
}

// apply multiplies the layers' k (and, with the scale, mv and the e–log
// indices Cc, Cr, Ck) by the multipliers exp(x).
func (f *fitter) apply(ls []solver.Layer, x []float64) {
	for i, li := range f.spec.Layers {
		ls[li].K *= math.Exp(x[i])
	}
	for j, li := range f.spec.ChLayers {
		ls[li].Ch = f.ch0[li] * math.Exp(x[len(f.spec.Layers)+j])
		ls[li].KhKv = 0
	}
	if f.spec.Scale {
		s := math.Exp(x[f.np-1])
		for i := range ls {
			l := &ls[i]
			l.K *= s
			l.Mv = f.mv0[i] * s
			if ec := l.ECurve; ec != nil {
				if l.CalphaCc > 0 {
					l.Calpha, l.CalphaCc = l.CalphaCc*ec.Cc, 0
				}
				c := *ec
				c.Cc, c.Cr, c.Ck = s*ec.Cc, s*ec.Cr, s*ec.Ck
				l.ECurve = &c
			}
		}
	}
}

// solve runs the solver once, counting the run and reporting progress.
func (f *fitter) solve(p *solver.Project) (*solver.Result, error) {
	// Only the fitted project's own run needs the drains' Uv and Uh.
	o := &solver.Options{NoDrainReference: !f.reference}
	if f.opt != nil && f.opt.Progress != nil {
		outer := f.opt.Progress
		done := float64(f.runs)
		frac := func(part float64) float64 { return math.Min(0.99, (done+part)/float64(f.expected+1)) }
		if !outer(frac(0)) {
			return nil, solver.ErrCanceled
		}
		o.Progress = func(part float64) bool { return outer(frac(part)) }
	}
	f.runs++
	r, err := solver.Solve(p, o)
	if err == nil && r.Consolidation == nil {
		err = refuse("loads", ErrNoChange, "the project %v, so the solve gave no consolidation result", ErrNoChange)
	}
	return r, err
}

// eval returns the predictions at x (and, when jac is set, the Jacobian),
// running the solver for what the cache lacks. An error that ends the fit
// is also kept in f.err.
func (f *fitter) eval(x []float64, jac bool) (*fitEval, error) {
	ev := f.cache[fitKey(x)]
	if ev == nil {
		pred, err := f.predict(x)
		if err != nil {
			return nil, err
		}
		ev = f.store(x, pred)
	}
	if jac && ev.jac == nil {
		j := mat.NewDense(f.n, f.np, nil)
		xp := slices.Clone(x)
		for i := range f.np {
			h := fitStep
			if x[i]+h > maxLogMult {
				h = -h // at the upper end of the range: a backward difference
			}
			xp[i] = x[i] + h
			pred, err := f.predict(xp)
			xp[i] = x[i]
			if err != nil {
				return nil, err
			}
			k := 0
			for _, r := range f.recs {
				for range r.times {
					j.Set(k, i, (pred[k]-ev.pred[k])/(r.sigma*h))
					k++
				}
			}
		}
		ev.jac = j
	}
	return ev, nil
}

func (f *fitter) store(x, pred []float64) *fitEval {
	ev := &fitEval{pred: pred}
	f.cache[fitKey(x)] = ev
	return ev
}

// predict solves the project with the multipliers exp(x) and returns the
// predictions at the readings.
func (f *fitter) predict(x []float64) ([]float64, error) {
	if f.err != nil {
		return nil, f.err
	}
	for i, v := range x {
		if !(math.Abs(v) <= maxLogMult) {
			return nil, refuse(f.paramPath(i), solver.ErrOutOfRange, "the multiplier %v (%.3g is outside 1e-6 … 1e6)", solver.ErrOutOfRange, math.Exp(v))
		}
	}
	if f.search && f.runs >= f.budget {
		return nil, refuse(FitMaxRuns, solver.ErrTooLarge, "the search reached its limit of %d solver runs", f.budget)
	}
	q := *f.base
	q.Layers = slices.Clone(f.base.Layers)
	f.apply(q.Layers, x)
	r, err := f.solve(&q)
	if err != nil {
		var ps solver.Problems
		if !errors.As(err, &ps) {
			f.err = err // canceled, or the solver failed
		}
		return nil, err
	}
	return f.extract(r), nil
}

// paramPath is the path of parameter i in problems: the FitSpec.Layers
// entry, or FitScale.
func (f *fitter) paramPath(i int) string {
	if i < len(f.spec.Layers) {
		return solver.IndexPath(FitLayers, i)
	}
	if j := i - len(f.spec.Layers); j < len(f.spec.ChLayers) {
		return solver.IndexPath(FitChLayers, j)
	}
	return FitScale
}

// atFitted says of the problems of the run at the fitted values that
// they arose there.
func atFitted(err error) error {
	ps := slices.Clone(solver.AsProblems(err))
	for i := range ps {
		ps[i].Message += " (in the run at the fitted values)"
	}
	return ps
}

// extract interpolates the series of r at the reading times: the
// settlement of FittedSettlement, and the pore pressure.
func (f *fitter) extract(r *solver.Result) []float64 {
	ser := &r.Consolidation.Series
	out := make([]float64, 0, f.n)
	total, _ := FittedSettlement(r)
	for _, rec := range f.recs {
		ys := total
		if rec.kind == kindPressure {
			ys = ser.Piezometers[rec.pz].Pore
		}
		for _, t := range rec.times {
			out = append(out, solver.SeriesAt(ser.Time, ys, t))
		}
	}
	return out
}

// FittedSettlement is the settlement history of r that BackFit compares
// the plate readings with, at the times of r's series, and its name in
// words (see FitResult.Curve): the series of the model the summary uses
// (Series.Settlement, which is already the non-linear solution in the
// non-linear model and includes the drains where there are drains) plus
// the secondary compression when r has one. Nil without consolidation.
func FittedSettlement(r *solver.Result) ([]float64, string) {
	if r == nil || r.Consolidation == nil {
		return nil, ""
	}
	ser := &r.Consolidation.Series
	curve := "primary settlement from mv (linear model)"
	if r.Summary.Model == solver.ModelNonlinear {
		curve = "primary settlement of the non-linear model (e–log σ′ curves)"
	}
	if r.Drains != nil {
		curve += ", with the drains"
	}
	if len(ser.Secondary) != len(ser.Settlement) {
		return ser.Settlement, curve
	}
	total := make([]float64, len(ser.Settlement))
	for i, s := range ser.Settlement {
		total[i] = s + ser.Secondary[i]
	}
	return total, curve + ", plus secondary compression (Cα)"
}

// residuals returns (prediction − reading)/σ for every reading.
func (f *fitter) residuals(pred []float64) []float64 {
	r := make([]float64, 0, f.n)
	k := 0
	for _, rec := range f.recs {
		for j := range rec.times {
			r = append(r, (pred[k]-rec.values[j])/rec.sigma)
			k++
		}
	}
	return r
}

// lag1 is the lag-1 autocorrelation of the residuals r, pooled over the
// records: Σ r_j r_(j+1) within each record over Σ r_j² (0 when all
// residuals vanish).
func (f *fitter) lag1(r []float64) float64 {
	num, den, k := 0.0, 0.0, 0
	for _, rec := range f.recs {
		n := len(rec.times)
		for j := range n {
			den += r[k+j] * r[k+j]
			if j+1 < n {
				num += r[k+j] * r[k+j+1]
			}
		}
		k += n
	}
	if !(den > 0) {
		return 0
	}
	return math.Min(num/den, 0.99)
}

func (f *fitter) objective(x []float64) float64 {
	ev, err := f.eval(x, false)
	if err != nil {
		return math.Inf(1)
	}
	s := 0.0
	for _, v := range f.residuals(ev.pred) {
		s += v * v
	}
	return s / 2
}

func (f *fitter) gradient(grad, x []float64) {
	ev, err := f.eval(x, true)
	if err != nil {
		for i := range grad {
			grad[i] = math.NaN()
		}
		return
	}
	g := mat.NewVecDense(len(grad), grad)
	g.MulVec(ev.jac.T(), mat.NewVecDense(f.n, f.residuals(ev.pred)))
}

func (f *fitter) hessian(h *mat.SymDense, x []float64) {
	ev, err := f.eval(x, true)
	if err != nil {
		for i := range f.np {
			for j := i; j < f.np; j++ {
				h.SetSym(i, j, math.NaN())
			}
		}
		return
	}
	h.SymOuterK(1, ev.jac.T())
}

// fitStats are the least squares statistics at one point.
type fitStats struct {
	s2         float64       // residual variance Σr²/(n − p)
	cov        *mat.SymDense // s²(JᵀJ)⁻¹ of the log multipliers (determined ones)
	determined []bool        // the readings fix the parameter
	small      bool          // the next Gauss–Newton step is within tolerance
}

// stats computes the statistics at an evaluated point with its Jacobian.
// A parameter whose column of J is negligible (below 1e-6 of the largest:
// the readings do not see it) is not determined and left out of the
// covariance; if the rest still trade off (JᵀJ singular or its condition
// number above 1e14) none is determined.
func (f *fitter) stats(ev *fitEval) fitStats {
	r := f.residuals(ev.pred)
	ss := 0.0
	for _, v := range r {
		ss += v * v
	}
	st := fitStats{s2: ss / float64(f.n-f.np), cov: mat.NewSymDense(f.np, nil), determined: make([]bool, f.np)}
	norms := make([]float64, f.np)
	for i := range f.np {
		norms[i] = mat.Norm(ev.jac.ColView(i), 2)
	}
	big := slices.Max(norms)
	var keep []int
	for i, v := range norms {
		if v > 1e-6*big {
			keep = append(keep, i)
		}
	}
	if len(keep) == 0 {
		return st
	}
	jk := mat.NewDense(f.n, len(keep), nil)
	for a, i := range keep {
		jk.SetCol(a, mat.Col(nil, i, ev.jac))
	}
	var h mat.SymDense
	h.SymOuterK(1, jk.T())
	var ch mat.Cholesky
	if ok := ch.Factorize(&h); !ok || ch.Cond() > 1e14 {
		return st
	}
	var inv mat.SymDense
	if err := ch.InverseTo(&inv); err != nil {
		return st
	}
	var g, d mat.VecDense
	g.MulVec(jk.T(), mat.NewVecDense(f.n, r))
	if err := ch.SolveVecTo(&d, &g); err != nil {
		return st
	}
	st.small = true
	for a, i := range keep {
		st.determined[i] = true
		for b, j := range keep {
			st.cov.SetSym(i, j, st.s2*inv.At(a, b))
		}
		if math.Abs(d.AtVec(a)) > fitTolerance*math.Sqrt(st.cov.At(i, i))+1e-9 {
			st.small = false
		}
	}
	return st
}

// converged stops the search when the next Gauss–Newton step is within
// tolerance (see fitStats.small).
func (f *fitter) converged(x []float64) bool {
	ev := f.cache[fitKey(x)]
	return ev != nil && ev.jac != nil && f.stats(ev).small
}

// fitKey identifies a point of the search exactly.
func fitKey(x []float64) string {
	var b strings.Builder
	for _, v := range x {
		b.WriteString(strconv.FormatUint(math.Float64bits(v), 16))
		b.WriteByte(' ')
	}
	return b.String()
}

func fitSq(v float64) float64 { return v * v }

func ptr(v float64) *float64 { return &v }
