package monitor

import (
	"porelight/solver"

	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/stat"
)

// Reasons Asaoka refuses a record. The error it returns is a
// solver.Problems list of one problem whose reason is one of these (or
// solver.ErrNotFinite, ErrNotSorted, ErrDuplicate, ErrNegative for bad
// input), so callers may test with errors.Is; its path names the readings
// or the option at fault and its message says what was found.
var (
	ErrTooFewPoints  = errors.New("too few points")
	ErrDuringLoading = errors.New("the record lies within a loading stage")
	ErrNoFinal       = errors.New("the record does not settle towards a final value")
)

// Defaults and limits of the resampling.
const (
	asaokaMinPoints = 4  // fewest resampled points (3 pairs, 1 degree of freedom)
	asaokaAutoMin   = 6  // an automatic interval gives at least this many points
	asaokaAutoMax   = 12 // and at most this many
)

// AsaokaOptions say which part of a settlement record Asaoka reads and
// how to turn its rate into a coefficient of consolidation. The zero
// value reads the whole record and reports no cv.
type AsaokaOptions struct {
	// AfterTime is the end of the last change of load, days (see
	// LastLoadChange): the method assumes constant load, so readings
	// before it are not used and a window starting before it is refused.
	AfterTime float64
	// From and To bound the readings used, days. Zero From means
	// AfterTime; zero To means the last reading.
	From, To float64
	// Thickness is the thickness of the consolidating layer, m, and
	// DrainedEnds the number of its drained faces (1 or 2). The drainage
	// path is Thickness/DrainedEnds. Either zero: no cv is reported.
	Thickness   float64
	DrainedEnds int
	// De and Mu, when both > 0, are the unit cell's diameter, m, and μ
	// of a site with vertical drains: Asaoka then also reports Ch, the
	// horizontal coefficient the slope implies (see Asaoka). VerticalCv,
	// m²/day, is the cv of the vertical flow that goes on meanwhile; zero
	// reads the whole slope as radial flow.
	De, Mu     float64
	VerticalCv float64
	// Layers are the indices of the consolidating layers that Thickness
	// sums (AsaokaOptionsFor; informative only, copied to the result).
	Layers []int
	// LoadOrigin is the time origin of the hyperbolic method, days
	// (LoadOrigin(p) in AsaokaOptionsFor; zero: day 0).
	LoadOrigin float64
	// AutoStart, when From is zero, starts the window where the first
	// mode dominates the record (see FirstModeShare) instead of at
	// AfterTime. AsaokaOptionsFor sets it.
	AutoStart bool
}

// AsaokaOptionsFor returns the options that read a settlement record of
// p: AfterTime = LastLoadChange(p), the window start of the first-mode
// criterion (AutoStart) unless p.Monitoring.Asaoka saves one, and as the
// consolidating layer the layers p.Monitoring.Asaoka names, or else
// ConsolidatingLayers(p), with the drained ends of the column. When
// several layers consolidate, the cv so found is an equivalent value for
// them together.
func AsaokaOptionsFor(p *solver.Project) AsaokaOptions {
	o := AsaokaOptions{AfterTime: solver.LastLoadChange(p), AutoStart: true, LoadOrigin: LoadOrigin(p)}
	var saved *solver.AsaokaSettings
	if p.Monitoring != nil {
		saved = p.Monitoring.Asaoka
	}
	if saved != nil {
		o.From, o.To = saved.From, saved.To
		o.Layers = append([]int(nil), saved.Layers...)
	}
	if len(o.Layers) == 0 {
		o.Layers = ConsolidatingLayers(p)
	}
	for _, i := range o.Layers {
		if i >= 0 && i < len(p.Layers) {
			o.Thickness += p.Layers[i].Thickness
		}
	}
	for _, b := range []solver.Boundary{p.Top, p.Bottom} {
		if b.Drained {
			o.DrainedEnds++
		}
	}
	return o
}

// CompressibleShare is the smallest mv, as a share of the largest mv in
// the column, of a layer that ConsolidatingLayers counts as compressible.
const CompressibleShare = 0.1

// ConsolidatingLayers returns the indices of the compressible layers of
// p: those with mv at least CompressibleShare times the largest mv of the
// column, and those whose mv follows from an e–log σ' curve (mv = 0). A
// crust or sand layer, far stiffer, is left out, so the drainage path
// runs through the clay the settlement comes from rather than the whole
// column. It assumes the stiff layers drain freely (a stiff layer of low
// k between the clay and a drained end lengthens the true path; then
// choose the layers in the file, monitoring.asaoka.layers).
func ConsolidatingLayers(p *solver.Project) []int {
	largest := 0.0
	for _, l := range p.Layers {
		largest = math.Max(largest, l.Mv)
	}
	var out []int
	for i, l := range p.Layers {
		if l.Mv == 0 || l.Mv >= CompressibleShare*largest {
			out = append(out, i)
		}
	}
	return out
}

// AsaokaResult is the outcome of Asaoka's method on one settlement
// record. Settlements are in the record's unit (m in the file format),
// times in days, cv in m²/day.
type AsaokaResult struct {
	// Interval is the equal time step Δt of the resampled record, days.
	Interval float64 `json:"interval"`
	// Times and Settlements are the resampled record: s_j at t_j = t_0 + jΔt,
	// linearly interpolated between readings.
	Times       []float64 `json:"times"`
	Settlements []float64 `json:"settlements"`
	// Fitted holds β0 + β1 s_(j−1) for j = 1 … n−1: plotted against
	// Settlements[:n−1] it is the fitted line, and the measured pairs are
	// (Settlements[j−1], Settlements[j]). The line meets s_j = s_(j−1) at
	// Final.
	Fitted []float64 `json:"fitted"`
	// Beta0 (settlement unit) and Beta1 (dimensionless) are the least
	// squares estimates of s_j = β0 + β1 s_(j−1), with their standard
	// errors and the coefficient of determination of the fit.
	Beta0    float64 `json:"beta0"`
	Beta1    float64 `json:"beta1"`
	Beta0SE  float64 `json:"beta0SE"`
	Beta1SE  float64 `json:"beta1SE"`
	RSquared float64 `json:"rSquared"`
	// Final is the forecast final settlement β0/(1 − β1) and FinalSE its
	// standard error (first-order propagation of the covariance of β0
	// and β1).
	Final   float64 `json:"final"`
	FinalSE float64 `json:"finalSE"`
	// DrainagePath is the length d of the drainage path, m (0 when the
	// options give no thickness), through the layers Layers (indices into
	// the project's layers; empty when the options name none).
	DrainagePath float64 `json:"drainagePath"`
	Layers       []int   `json:"layers,omitempty"`
	// Cv is the coefficient of consolidation from the slowest Terzaghi
	// mode, −4d² ln β1/(π² Δt), and CvSE its standard error; CvParabolic
	// is Asaoka's parabolic-isochrone form −5d² ln β1/(12 Δt), about
	// 2.8 % higher. All are 0 when DrainagePath is 0. See Asaoka.
	Cv          float64 `json:"cv"`
	CvSE        float64 `json:"cvSE"`
	CvParabolic float64 `json:"cvParabolic"`
	// Ch is the horizontal coefficient of consolidation, m²/day, of a
	// drained site (AsaokaOptions.De and Mu given), and ChSE its standard
	// error: Ch = (De² μ/8)(−ln β1/Δt − π² cv/(4d²)); 0 otherwise.
	Ch   float64 `json:"ch,omitempty"`
	ChSE float64 `json:"chSE,omitempty"`

	// AutoStart says the window start was chosen by the first-mode
	// criterion (AsaokaOptions.AutoStart); HigherModes is the estimated
	// share of the higher modes in the settlement rate at the window
	// start, exp(−8λ(t_0 − AfterTime)) with λ = −ln β1/Δt (see
	// FirstModeShare). A share above FirstModeShare means the record is
	// too short for the criterion and the forecast is biased low.
	AutoStart   bool    `json:"autoStart"`
	HigherModes float64 `json:"higherModes"`
	// Starts is the forecast for a range of window starts, from AfterTime
	// to the latest start that leaves 6 readings (at most 12 rows): how
	// the answer depends on the choice of the window.
	Starts []AsaokaStart `json:"starts,omitempty"`
	// FinalSpread and CvSpread are the largest departures of Final and Cv
	// over the rows of Starts that start at or after this window's start
	// (so also meet the criterion) and keep at least half of its readings
	// (later windows read only the flat tail, where noise rules);
	// FinalUncertainty and
	// CvUncertainty combine them with the standard errors,
	// √(SE² + spread²), and are the ± to quote.
	FinalSpread      float64 `json:"finalSpread"`
	CvSpread         float64 `json:"cvSpread"`
	FinalUncertainty float64 `json:"finalUncertainty"`
	CvUncertainty    float64 `json:"cvUncertainty"`

	// Hyperbolic is the hyperbolic method on the same readings, a
	// cross-check (nil when it gives no forecast; see Hyperbolic).
	Hyperbolic *HyperbolicResult `json:"hyperbolic,omitempty"`

	readings int // readings in the window
}

// AsaokaStart is Asaoka's forecast for a window that starts on day From.
type AsaokaStart struct {
	From        float64 `json:"from"`
	Final       float64 `json:"final"`
	FinalSE     float64 `json:"finalSE"`
	Cv          float64 `json:"cv"`
	HigherModes float64 `json:"higherModes"`
}

// Forecast returns the settlement the fitted relation predicts at t days:
// s∞ − (s∞ − s_0) β1^((t − t_0)/Δt), with s_0 the first resampled point.
func (a *AsaokaResult) Forecast(t float64) float64 {
	return a.Final - (a.Final-a.Settlements[0])*math.Pow(a.Beta1, (t-a.Times[0])/a.Interval)
}

// Asaoka applies Asaoka's (1978) observational method to a settlement
// record: times in days, strictly increasing, and the settlement at each.
//
// The readings from the first one at or after the start of the window
// (From, or AfterTime) to the last one at or before To are resampled at
// equal intervals Δt by linear interpolation: s_0 at the first of those
// readings, s_j = s(t_0 + jΔt). An interval of 0 chooses Δt so that the
// window holds as many points as readings, but at least 6 and at most 12.
// The pairs (s_(j−1), s_j) are fitted by least squares with
//
//	s_j = β0 + β1 s_(j−1),
//
// and the final settlement is where this line meets s_j = s_(j−1):
// s∞ = β0/(1 − β1). The standard errors are those of ordinary least
// squares (residual variance with n − 3 degrees of freedom for n points);
// they treat s_(j−1) as exact, which noise in the readings is not, so
// they are indicative only.
//
// # Coefficient of consolidation
//
// Late in primary consolidation under constant load, the excess pore
// pressure of a layer with one drainage path of length d (drained at
// z = 0, closed at z = d) is dominated by its slowest mode (Terzaghi
// 1943): u ∝ sin(πz/2d) exp(−λt) with λ = π²cv/(4d²). The settlement
// then approaches s∞ as s∞ − s(t) ∝ exp(−λt), so at equal steps
//
//	s_j − s∞ = β1 (s_(j−1) − s∞),  β1 = exp(−λΔt),
//
// which is Asaoka's relation with β0 = s∞(1 − β1). Hence
//
//	cv = −4 d² ln β1 / (π² Δt)   (first mode).
//
// Asaoka instead describes the isochrone by a parabola,
// u = A(t)(2ζ − ζ²) with ζ = z/d (zero at the drained face, zero gradient
// at the closed one), and satisfies ∂u/∂t = cv ∂²u/∂z² in the weak sense
// for the linear test function w = ζ, which vanishes at the drained face:
//
//	∫₀ᵈ ζ ∂u/∂t dz = −cv ∫₀ᵈ (1/d) ∂u/∂z dz = −cv A/d   (integrating by parts),
//	∫₀ᵈ ζ (2ζ − ζ²) dz = d (2/3 − 1/4) = 5d/12,
//
// so dA/dt = −(12/5)(cv/d²) A, λ = 12cv/(5d²) and
//
//	cv = −5 d² ln β1 / (12 Δt)   (parabolic isochrone).
//
// Written with H the half-thickness of the layer, this is the form
// usually quoted for double drainage (d = H), cv = −(5H²/12Δt) ln β1; for
// single drainage d is the full thickness 2H. Whatever the notation, d is
// the drainage path: with d the full thickness of a doubly drained layer
// the cv would come out four times too large. The same parabola with the test function
// w = 1 (the volume balance) would give λ = 3cv/d², and with w equal to
// the parabola (Galerkin) λ = 5cv/(2d²): the value depends on the
// approximation, while the exact slowest mode has λ = π²cv/(4d²) =
// 2.467 cv/d². Cv therefore reports the first-mode form, which is exact
// for the late-time exponential the method relies on; CvParabolic
// (12/5 = 2.4 instead of π²/4, so 2.8 % higher for the same β1) is given
// for comparison with values computed the parabolic way. Both need the
// record to be late enough for the higher modes to have died out (time
// factor above about 0.2, degree of consolidation above about 50 %);
// earlier readings make β1, and so cv and s∞, depend on Δt.
//
// # Horizontal coefficient with vertical drains
//
// With drains the cell-averaged excess pressure obeys
// ∂ū/∂t = cv ∂²ū/∂z² − (8 ch/(De² μ)) ū (the unit cell, Barron 1948,
// Hansbo 1981). For drains through the layer with one μ its solution is
// the vertical one times exp(−λh t), λh = 8 ch/(De² μ) (the product of
// Carrillo 1942), so the slowest mode decays at λ = λh + π²cv/(4d²) and
// β1 = exp(−λΔt) as above. Hence
//
//	ch = (De² μ / 8) (−ln β1/Δt − π² cv/(4d²)),
//
// with cv the vertical coefficient (AsaokaOptions.VerticalCv; without it
// the whole slope is read as radial flow, which overstates ch) and d the
// drainage path (without Thickness and DrainedEnds the vertical term is
// left out). Ch is that value; a negative one means the record settles no
// faster than vertical flow alone would. With well resistance μ varies
// with depth: give its average, and read Ch as an equivalent value.
//
// With AutoStart and no From, the window starts where the first mode
// dominates, by the criterion of FirstModeShare; the result then also
// lists the forecast for a range of window starts (Starts) and states an
// uncertainty that includes their spread (FinalUncertainty).
//
// Readings before AfterTime are left out, not refused: a record that
// starts with the construction is read from the end of the loading on.
// Refusals (errors wrapping the reason) are:
//
//	fewer than 4 readings in the window, or fewer
//	than 4 resampled points for the given interval   ErrTooFewPoints
//	From before AfterTime, or no reading after it    ErrDuringLoading
//	β1 outside (0, 1), or a flat record              ErrNoFinal
//	a time or settlement not finite                  ErrNotFinite
//	times not strictly increasing                    ErrNotSorted, ErrDuplicate
//
// The paths of the problems are those of the record passed as a list
// "readings" ("readings", "readings[2].t", "readings[2].value") and of
// the arguments (AsaokaInterval, AsaokaFrom); PlateAsaoka names the
// plate's own fields instead.
//
// Asaoka panics if times and settlements differ in length (a caller bug).
func Asaoka(times, settlements []float64, interval float64, opt AsaokaOptions) (*AsaokaResult, error) {
	return asaoka(times, settlements, interval, opt, recordPaths{list: "readings"})
}

// Paths of Asaoka's arguments in its problems: they are not fields of a
// project, so they have a prefix no project field has.
const (
	AsaokaInterval = "asaoka.interval" // the interval argument
	AsaokaFrom     = "asaoka.from"     // AsaokaOptions.From
)

// recordPaths name the parts of one settlement record in problems.
type recordPaths struct {
	list  string         // the list of readings
	dated func(int) bool // reading j gives a date rather than a day (nil: none)
}

func (r recordPaths) time(j int) string {
	if r.dated != nil && r.dated(j) {
		return solver.JoinPath(solver.IndexPath(r.list, j), "date")
	}
	return solver.JoinPath(solver.IndexPath(r.list, j), "t")
}

func (r recordPaths) value(j int) string {
	return solver.JoinPath(solver.IndexPath(r.list, j), "value")
}

// refuse is the error of one problem at path for reason; the message
// follows format.
func refuse(path string, reason error, format string, args ...any) error {
	return solver.Problems{{Path: path, Err: reason, Message: fmt.Sprintf(format, args...)}}
}

func asaoka(times, settlements []float64, interval float64, opt AsaokaOptions, at recordPaths) (*AsaokaResult, error) {
	if len(times) != len(settlements) {
		panic("solver: Asaoka: times and settlements differ in length")
	}
	for j := range times {
		if !finiteNum(times[j]) {
			return nil, refuse(at.time(j), solver.ErrNotFinite, "%v (day %g)", solver.ErrNotFinite, times[j])
		}
		if !finiteNum(settlements[j]) {
			return nil, refuse(at.value(j), solver.ErrNotFinite, "%v (settlement %g on day %g)", solver.ErrNotFinite, settlements[j], times[j])
		}
		if j > 0 && times[j] < times[j-1] {
			return nil, refuse(at.time(j), solver.ErrNotSorted, "times %v (day %g follows day %g)", solver.ErrNotSorted, times[j], times[j-1])
		}
		if j > 0 && times[j] == times[j-1] {
			return nil, refuse(at.time(j), solver.ErrDuplicate, "%v (day %g)", solver.ErrDuplicate, times[j])
		}
	}
	if !finiteNum(interval) || interval < 0 {
		return nil, refuse(AsaokaInterval, solver.ErrNegative, "%v (got %g days)", solver.ErrNegative, interval)
	}
	if opt.From != 0 && opt.From < opt.AfterTime {
		return nil, refuse(AsaokaFrom, ErrDuringLoading, "%v: the window starts on day %g, before the load stops changing on day %g", ErrDuringLoading, opt.From, opt.AfterTime)
	}
	start := math.Max(opt.From, opt.AfterTime)
	auto := opt.AutoStart && opt.From == 0
	if auto {
		var err error
		if start, err = firstModeStart(times, settlements, interval, opt, at); err != nil {
			return nil, err
		}
	}
	a, err := asaokaWindow(times, settlements, interval, start, opt, at)
	if err != nil {
		return nil, err
	}
	a.AutoStart = auto
	a.Layers = append([]int(nil), opt.Layers...)
	a.HigherModes = higherModeShare(a, opt.AfterTime)
	a.spread(times, settlements, interval, opt, at)
	a.Hyperbolic = Hyperbolic(times, settlements, opt.LoadOrigin, a.Times[0], a.Times[len(a.Times)-1])
	return a, nil
}

// asaokaWindow fits Asaoka's relation to the readings from day start
// (and up to opt.To).
func asaokaWindow(times, settlements []float64, interval, start float64, opt AsaokaOptions, at recordPaths) (*AsaokaResult, error) {
	end := math.Inf(1)
	if opt.To > 0 {
		end = opt.To
	}
	first, last := -1, -1
	for j, t := range times {
		if t >= start && t <= end {
			if first < 0 {
				first = j
			}
			last = j
		}
	}
	if first < 0 && (len(times) == 0 || times[len(times)-1] < start) {
		what := "the record is empty"
		if len(times) > 0 {
			what = fmt.Sprintf("the last reading is on day %g", times[len(times)-1])
		}
		return nil, refuse(at.list, ErrDuringLoading, "%v: %s, and the load changes until day %g", ErrDuringLoading, what, start)
	}
	inWindow := last - first + 1
	if first < 0 {
		inWindow = 0
	}
	if inWindow < asaokaMinPoints {
		return nil, refuse(at.list, ErrTooFewPoints, "%v: %d readings between day %g and day %g; the method needs at least %d", ErrTooFewPoints, inWindow, start, math.Min(end, times[len(times)-1]), asaokaMinPoints)
	}
	t0, t1 := times[first], times[last]
	span := t1 - t0
	if interval == 0 {
		n := min(max(inWindow, asaokaAutoMin), asaokaAutoMax)
		interval = span / float64(n-1)
	}
	n := int(math.Floor(span/interval*(1+1e-12))) + 1
	if n < asaokaMinPoints {
		return nil, refuse(AsaokaInterval, ErrTooFewPoints, "%v: an interval of %g days gives %d points between day %g and day %g; use at most %.4g days", ErrTooFewPoints, interval, n, t0, t1, span/float64(asaokaMinPoints-1))
	}

	a := &AsaokaResult{Interval: interval, Times: make([]float64, n), Settlements: make([]float64, n), readings: inWindow}
	k := first
	for j := range n {
		t := t0 + float64(j)*interval
		if j == n-1 && t > t1 {
			t = t1 // rounding
		}
		for k+1 < last && times[k+1] <= t {
			k++
		}
		a.Times[j] = t
		a.Settlements[j] = interpAt(times[k], settlements[k], times[k+1], settlements[k+1], t)
	}

	x, y := a.Settlements[:n-1], a.Settlements[1:]
	m := float64(n - 1)
	xm := stat.Mean(x, nil)
	sxx := 0.0
	for _, v := range x {
		sxx += (v - xm) * (v - xm)
	}
	if !(sxx > 0) {
		return nil, refuse(at.list, ErrNoFinal, "%v: the resampled settlements do not change (%g)", ErrNoFinal, x[0])
	}
	b0, b1 := stat.LinearRegression(x, y, nil, false)
	a.Beta0, a.Beta1 = b0, b1
	if !(b1 > 0 && b1 < 1) {
		return nil, refuse(at.list, ErrNoFinal, "%v: β1 = %.4g is not between 0 and 1 (still loading, creep, heave or readings too noisy for Δt = %g days)", ErrNoFinal, b1, interval)
	}
	a.RSquared = stat.RSquared(x, y, nil, b0, b1)
	a.Fitted = make([]float64, n-1)
	sse := 0.0
	for j := range x {
		a.Fitted[j] = b0 + b1*x[j]
		sse += (y[j] - a.Fitted[j]) * (y[j] - a.Fitted[j])
	}
	s2 := math.NaN()
	if n-1 > 2 {
		s2 = sse / (m - 2)
	}
	v1 := s2 / sxx
	v0 := s2 * (1/m + xm*xm/sxx)
	c01 := -xm * s2 / sxx
	a.Beta0SE, a.Beta1SE = math.Sqrt(v0), math.Sqrt(v1)
	a.Final = b0 / (1 - b1)
	g0, g1 := 1/(1-b1), b0/((1-b1)*(1-b1))
	a.FinalSE = math.Sqrt(math.Max(0, g0*g0*v0+g1*g1*v1+2*g0*g1*c01))

	if opt.Thickness > 0 && (opt.DrainedEnds == 1 || opt.DrainedEnds == 2) {
		d := opt.Thickness / float64(opt.DrainedEnds)
		a.DrainagePath = d
		a.Cv = -4 * d * d * math.Log(b1) / (math.Pi * math.Pi * interval)
		a.CvSE = 4 * d * d / (math.Pi * math.Pi * interval) * a.Beta1SE / b1
		a.CvParabolic = -5 * d * d * math.Log(b1) / (12 * interval)
	}
	if opt.De > 0 && opt.Mu > 0 {
		rate := -math.Log(b1) / interval
		if d := a.DrainagePath; d > 0 && opt.VerticalCv > 0 {
			rate -= math.Pi * math.Pi * opt.VerticalCv / (4 * d * d)
		}
		k := opt.De * opt.De * opt.Mu / 8
		a.Ch = k * rate
		a.ChSE = k / interval * a.Beta1SE / b1
	}
	return a, nil
}

// PlateAsaoka applies Asaoka to settlement plate i of p.Monitoring with
// the options AsaokaOptionsFor(p), resolving dates against
// Monitoring.Start.
func PlateAsaoka(p *solver.Project, i int, interval float64) (*AsaokaResult, error) {
	return PlateAsaokaWindow(p, i, interval, 0, 0)
}

// PlateAsaokaWindow is PlateAsaoka reading only the readings from day
// from to day to (AsaokaOptions.From and To; zero keeps the window saved
// in p.Monitoring.Asaoka, or the defaults).
// A reading time that cannot be resolved is reported as the
// solver.Problems of solver.ReadingTimesAt. Problems name the plate's
// fields: "monitoring.plates[2].readings" for the record as a whole,
// "monitoring.plates[2].readings[5].date" (or ".t", ".value") for one
// reading, and AsaokaInterval or AsaokaFrom for the arguments.
func PlateAsaokaWindow(p *solver.Project, i int, interval, from, to float64) (*AsaokaResult, error) {
	if p.Monitoring == nil || i < 0 || i >= len(p.Monitoring.Plates) {
		n := 0
		if p.Monitoring != nil {
			n = len(p.Monitoring.Plates)
		}
		return nil, refuse("monitoring.plates", solver.ErrOutOfRange, "has no plate %d (the project has %d)", i, n)
	}
	pl := p.Monitoring.Plates[i]
	at := recordPaths{
		list:  solver.JoinPath(solver.IndexPath("monitoring.plates", i), "readings"),
		dated: func(j int) bool { return pl.Readings[j].Date != "" },
	}
	ts, err := solver.ReadingTimesAt(p.Monitoring, pl.Readings, at.list)
	if err != nil {
		return nil, err
	}
	vs := make([]float64, len(pl.Readings))
	for j, r := range pl.Readings {
		vs[j] = r.Value
	}
	opt := AsaokaOptionsFor(p)
	if from != 0 {
		opt.From = from
	}
	if to != 0 {
		opt.To = to
	}
	return asaoka(ts, vs, interval, opt, at)
}

func finiteNum(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// interpAt interpolates linearly between (t0, v0) and (t1, v1) at t.
func interpAt(t0, v0, t1, v1, t float64) float64 {
	if t1 == t0 {
		return v0
	}
	return v0 + (v1-v0)*(t-t0)/(t1-t0)
}

// DrainCh is the horizontal coefficient of consolidation, m²/day, that
// the slope of a on a site with vertical drains implies, with the
// vertical part of the decay taken from the prediction r:
//
//	ch = (De² μ̄ / 8) (−ln β1/Δt − λv),
//
// where λv = ln((1 − Uv(t0))/(1 − Uv(t1)))/(t1 − t0) is the decay rate
// of the same column without drains (r.Drains.Uv) over the readings'
// window t0 … t1 and μ̄ the mean of μ along the drains (r.Drains.Mu);
// see Asaoka for the derivation. ok is false when r has no drain results
// or the window leaves the simulated times. The value is an equivalent
// ch for the drained depth; with partly penetrating drains or several
// layers it mixes them.
func DrainCh(a *AsaokaResult, r *solver.Result) (ch float64, ok bool) {
	if a == nil || len(a.Times) < 2 || r == nil || r.Drains == nil || r.Consolidation == nil {
		return 0, false
	}
	d := r.Drains
	ts := r.Consolidation.Series.Time
	if len(d.Uv) != len(ts) || len(d.Mu) == 0 || len(ts) == 0 {
		return 0, false
	}
	t0, t1 := a.Times[0], a.Times[len(a.Times)-1]
	if t1 <= t0 || t1 > ts[len(ts)-1] {
		return 0, false
	}
	u0, u1 := 1-solver.SeriesAt(ts, d.Uv, t0), 1-solver.SeriesAt(ts, d.Uv, t1)
	if !(u0 > 0 && u1 > 0) {
		return 0, false
	}
	lv := math.Log(u0/u1) / (t1 - t0)
	mu := 0.0
	for i := 1; i < len(d.Depth); i++ {
		mu += (d.Mu[i] + d.Mu[i-1]) / 2 * (d.Depth[i] - d.Depth[i-1])
	}
	if l := d.Depth[len(d.Depth)-1] - d.Depth[0]; l > 0 {
		mu /= l
	} else {
		mu = d.Cell.Mu0
	}
	de := d.Cell.De
	return de * de * mu / 8 * (-math.Log(a.Beta1)/a.Interval - lv), true
}
