package solver

import (
	"math"
	"sort"
)

// Result is everything one solve computes. It is plain data and encodes to
// the JSON that the page and the JavaScript API hand out. Units as in
// Project: m, kPa, day, m/s.
type Result struct {
	// Steady is the initial steady groundwater state of the column.
	Steady Steady `json:"steady"`
	// Consolidation is nil when the project has no load, no initial excess
	// pore pressure and no pressure history at a drained end.
	Consolidation *Consolidation `json:"consolidation,omitempty"`
	// Summary collects the headline figures.
	Summary Summary `json:"summary"`
	// Checks are the heave and uplift checks through time (see Check).
	Checks []Check `json:"checks,omitempty"`
	// Drains is nil without drains or without consolidation.
	Drains *DrainResult `json:"drains,omitempty"`
	// Residual is the settlement still to come after
	// Decisions.Handover (nil when not asked or without consolidation).
	Residual *Residual `json:"residual,omitempty"`
	// Warnings are conditions the results do not cover well; they never
	// stop a solve.
	Warnings []Warning `json:"warnings"`
	// Stats describe the numerical work done.
	Stats Stats `json:"stats"`
}

// Warning is a condition worth the engineer's attention. Path, when not
// empty, is the field of the project it concerns.
type Warning struct {
	Path    string `json:"path,omitempty"`
	Message string `json:"message"`
}

// Steady is the steady seepage solution on the mesh nodes.
type Steady struct {
	// Depth of each node below the top, m. Layer boundaries are nodes.
	Depth []float64 `json:"depth"`
	// Head is the total head, m above the top of the column.
	Head []float64 `json:"head"`
	// Pore is the pore water pressure, kPa.
	Pore []float64 `json:"pore"`
	// Total and Effective are the vertical total and effective stresses
	// before any load, kPa.
	Total     []float64 `json:"total"`
	Effective []float64 `json:"effective"`
	// Flux is the Darcy velocity, m/s, positive downward: the same in
	// every layer, unless a layer drains to an outlet (then the
	// thickness-weighted mean of the layers' fluxes, which Layers give).
	Flux float64 `json:"flux"`
	// KEquivalent is the equivalent vertical permeability of the column,
	// m/s (thickness-weighted harmonic mean).
	KEquivalent float64 `json:"kEquivalent"`
	// Layers holds the per-layer figures, top to bottom.
	Layers []SteadyLayer `json:"layers"`
	// Uplift holds the uplift check at the base of every layer that is at
	// least 100 times less permeable than the layer below it.
	Uplift []UpliftCheck `json:"uplift,omitempty"`
}

// SteadyLayer holds one layer's steady seepage figures.
type SteadyLayer struct {
	Name   string  `json:"name"`
	Top    float64 `json:"top"`    // m
	Bottom float64 `json:"bottom"` // m
	// Gradient is the hydraulic gradient in the layer: the head lost per
	// metre of flow path, in the direction of flow (≥ 0).
	Gradient float64 `json:"gradient"`
	// Flux is the Darcy velocity through the layer, m/s, positive down.
	Flux float64 `json:"flux"`
	// Upward is true when water flows up through the layer.
	Upward bool `json:"upward"`
	// CriticalGradient is γ'/γw with γ' = γsat − γw.
	CriticalGradient float64 `json:"criticalGradient"`
	// HeaveFactor is ic/i for upward flow, nil otherwise (or when i = 0).
	HeaveFactor *float64 `json:"heaveFactor,omitempty"`
	// Cv is the coefficient of consolidation k/(mv γw), m²/day, when mv
	// is known (nil when mv is to be derived and there is no load).
	Cv *float64 `json:"cv,omitempty"`
}

// UpliftCheck compares the total stress on the base of a low-permeability
// layer with the water pressure acting there (common practice).
type UpliftCheck struct {
	Layer int     `json:"layer"` // index of the layer whose base is checked
	Depth float64 `json:"depth"` // m
	// Total is the total vertical stress at the base from everything
	// above, kPa; Pore the water pressure there, kPa.
	Total float64 `json:"total"`
	Pore  float64 `json:"pore"`
	// Factor is Total/Pore (nil when Pore ≤ 0).
	Factor *float64 `json:"factor,omitempty"`
}

// Consolidation is the transient solution.
type Consolidation struct {
	// Depth of each node, m (the same nodes as Steady.Depth).
	Depth []float64 `json:"depth"`
	// Isochrones of excess pore pressure at the requested times.
	Isochrones []Isochrone `json:"isochrones"`
	// Series at every time step.
	Series Series `json:"series"`
	// Stages is the added vertical stress with depth of every load
	// stage, in the order of Project.Loads (nil without loads).
	Stages []StageStress `json:"stages,omitempty"`
	// Start says how each instantaneous change was started, e.g.
	// "4 backward Euler steps, then Crank–Nicolson (θ = 0.5)".
	Start string `json:"start"`
}

// StageStress is the total stress change with depth of one load stage
// once fully applied: Q × Factor(z), before submergence.
type StageStress struct {
	// Q is the stage's pressure at the surface, kPa (a fill's γ × thickness).
	Q float64 `json:"q"`
	// Depth holds evenly spaced depths from the top to the base, m, and
	// Factor the ratio Δσ/q at each (1 for a load infinite in plan).
	Depth  []float64 `json:"depth"`
	Factor []float64 `json:"factor"`
}

// Isochrone is the excess pore pressure (change from the initial steady
// state) at every node at one time, kPa.
type Isochrone struct {
	Time   float64   `json:"time"` // day
	Excess []float64 `json:"excess"`
}

// Series holds histories at the time steps (Time[0] = 0).
type Series struct {
	Time []float64 `json:"time"` // day
	// Load is the pressure of the load stages at the surface, kPa, less
	// the weight fill loses as it settles below the water table.
	Load []float64 `json:"load"`
	// Us and Up are the average degrees of consolidation by settlement
	// and by pore pressure, as fractions (1 = complete), relative to the
	// final state under the whole load history (above 1 while a
	// surcharge later removed acts). Each is absent when its denominator
	// is zero, so that the ratio would be 0/0: both when there is no net
	// change (a load applied, then fully removed); Up alone when the net
	// change of effective stress integrates to zero over the column
	// (positive in one part, negative in another) while the settlement,
	// weighted by mv, does not.
	Us []float64 `json:"us,omitempty"`
	Up []float64 `json:"up,omitempty"`
	// Settlement is the primary settlement from mv, m (positive down);
	// SettlementElog from the e–log σ' curves (empty when no layer has
	// one; the layers of Summary.ElogFromMv add their mv settlement).
	Settlement     []float64 `json:"settlement"`
	SettlementElog []float64 `json:"settlementElog,omitempty"`
	// Secondary is the secondary compression at each time, m, the sum of
	// every layer's from its own end of primary (empty when no layer has
	// a Cα); it adds to Settlement.
	Secondary []float64 `json:"secondary,omitempty"`
	// Piezometers holds the pore pressure histories at the requested
	// depths, in the order given.
	Piezometers []Piezometer `json:"piezometers,omitempty"`
	// Layers holds, per layer, its primary settlement at each time under
	// Summary.Model, m; they sum to Settlement. Kept only when a residual
	// settlement is asked (Decisions.Handover), empty otherwise.
	Layers [][]float64 `json:"layers,omitempty"`
}

// SeriesAt is the value at time t of a history ys recorded at the times
// ts (a Series' Time with one of its columns), interpolated linearly
// between the recorded times and held at the first and last values
// beyond them. Where a time appears twice (a jump), SeriesAt gives the
// first of its two values. ts must increase and have the length of ys,
// at least 1; otherwise SeriesAt panics or returns nonsense. O(log n).
func SeriesAt(ts, ys []float64, t float64) float64 {
	i := sort.SearchFloat64s(ts, t)
	switch {
	case i == 0:
		return ys[0]
	case i == len(ts):
		return ys[len(ys)-1]
	}
	t0, t1 := ts[i-1], ts[i]
	return ys[i-1] + (ys[i]-ys[i-1])*(t-t0)/(t1-t0)
}

// SameDepth reports whether two depths, m, name the same point of the
// column, such as a piezometer record's depth and one of Project.Piezometers
// (so one of Series.Piezometers): |a − b| ≤ 1e-9·max(1 m, |a|), far below
// what a depth is typed to and above the rounding it picks up on the way
// through a file.
func SameDepth(a, b float64) bool {
	return math.Abs(a-b) <= 1e-9*math.Max(1, math.Abs(a))
}

// Piezometer is a pore pressure history at one depth.
type Piezometer struct {
	Depth float64 `json:"depth"` // m
	// Pore is the pore pressure a piezometer reads, kPa (steady plus
	// excess); Excess the change from the initial steady state.
	Pore   []float64 `json:"pore"`
	Excess []float64 `json:"excess"`
	// Added is the change of total vertical stress there, kPa (the
	// stages' Δσ, less the weight fill loses below the water table): the
	// denominator of the pore pressure ratio (PoreRatios).
	Added []float64 `json:"added"`
}

// Summary collects the headline figures. Pointer fields are nil where the
// figure does not exist (no load, never reached in the simulated time).
type Summary struct {
	// Model is the consolidation model the series and the headline
	// figures (Settlement, T50, T90, TTarget, Secondary) come from:
	// ModelLinear or ModelNonlinear.
	Model string `json:"model,omitempty"`
	// Settlement is the final primary settlement of that model, m: along
	// the fully drained path of the load history, the state Us refers to.
	Settlement *float64 `json:"settlement,omitempty"`
	// SettlementLinear is the final primary settlement from mv, m.
	SettlementLinear *float64 `json:"settlementLinear,omitempty"`
	// SettlementElog is the final primary settlement from the e–log σ'
	// curves, m (nil when no layer has one); the layers listed in
	// ElogFromMv have none and add their mv settlement to it.
	SettlementElog *float64 `json:"settlementElog,omitempty"`
	ElogFromMv     []int    `json:"elogFromMv,omitempty"`
	// T50, T90 and TTarget are the times to Us = 50 %, 90 % and
	// TargetDegree, days.
	T50     *float64 `json:"t50,omitempty"`
	T90     *float64 `json:"t90,omitempty"`
	TTarget *float64 `json:"tTarget,omitempty"`
	// TargetDegree is the fraction TTarget refers to.
	TargetDegree float64 `json:"targetDegree"`
	// Secondary is the secondary compression settlement at DesignLife, m.
	Secondary  *float64 `json:"secondary,omitempty"`
	DesignLife float64  `json:"designLife"` // day
	// Layers holds per-layer settlement figures.
	Layers []LayerSummary `json:"layers"`
	// MinHeaveFactor is the smallest heave factor ic/i of any layer at
	// any time: the steady state, every time step and the long-term state
	// (nil when no layer ever has upward flow); Heave names where and when.
	MinHeaveFactor *float64 `json:"minHeaveFactor,omitempty"`
	// Heave, Uplift and Prism are the governing checks of each kind over
	// time (nil when nothing ever pushes): ic/i, a low-permeability
	// layer's own weight against the water pressure across it, and the
	// whole overburden against the water pressure at its base (Terzaghi's
	// prism). The figures are for comparison with the factors local codes
	// require; they do not choose them.
	Heave  *Governing `json:"heave,omitempty"`
	Uplift *Governing `json:"uplift,omitempty"`
	Prism  *Governing `json:"prism,omitempty"`
	// Flux is the steady Darcy velocity, m/s, positive downward.
	Flux float64 `json:"flux"`
	// Submerged is the thickness of fill below the water table once all
	// has settled, m (nil without fill stages).
	Submerged *float64 `json:"submerged,omitempty"`
}

// LayerSummary holds one layer's settlement figures.
type LayerSummary struct {
	Name string  `json:"name"`
	Mv   float64 `json:"mv"` // 1/kPa, as given or derived from the e–log curve
	Cv   float64 `json:"cv"` // m²/day
	// SettlementLinear and SettlementElog are this layer's final primary
	// settlements, m (SettlementElog nil without an e–log curve).
	SettlementLinear float64  `json:"settlementLinear"`
	SettlementElog   *float64 `json:"settlementElog,omitempty"`
	// Settlement is this layer's final primary settlement under
	// Summary.Model, m: its mv settlement in the linear model (with the
	// swelling mv where given), its e–log settlement in the non-linear
	// model, or its mv settlement there when it has no e–log curve.
	Settlement float64  `json:"settlement"`
	Secondary  *float64 `json:"secondary,omitempty"`
	// SecondaryStart is when this layer's own degree of consolidation
	// reaches 95 %, days: its end of primary, where its secondary
	// compression starts.
	SecondaryStart *float64 `json:"secondaryStart,omitempty"`
}

// Stats describe the numerical work of a solve.
type Stats struct {
	Nodes          int `json:"nodes"`
	Elements       int `json:"elements"`
	Order          int `json:"order"`
	Steps          int `json:"steps"`
	Factorizations int `json:"factorizations"`
	// Iterations counts the solves of the iterated time loop (non-linear
	// model or swelling mv); zero for the linear stepper.
	Iterations int    `json:"iterations,omitempty"`
	Scheme     string `json:"scheme,omitempty"`
}
