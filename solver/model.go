package solver

// Format is the version tag every project file carries in its "format" field.
// A file with another tag is refused by Decode rather than misread.
const Format = "porelight/1"

// Project is one soil column with its groundwater, drainage, loading and
// requested outputs. It is plain data: the JSON field names are the file
// format (see the package documentation) and the zero value of every
// optional field means "use the default" as documented on the field.
//
// Units are SI throughout: length m, stress kPa, unit weight kN/m³, time
// day, permeability m/s, mv 1/kPa (= m²/kN).
type Project struct {
	// Format must equal Format ("porelight/1").
	Format string `json:"format"`
	// Title and Notes are free text, shown and printed as typed.
	Title string `json:"title,omitempty"`
	Notes string `json:"notes,omitempty"`
	// Units, when present, must state the SI units above; the file format
	// has no other units and refuses rather than converts.
	Units *Units `json:"units,omitempty"`
	// GammaW is the unit weight of water, kN/m³. Zero means DefaultGammaW.
	GammaW float64 `json:"gammaW,omitempty"`
	// Layers are stacked from the top of the column downwards.
	Layers []Layer `json:"layers"`
	// WaterTable is the depth of the initial (hydrostatic) water table
	// below the top of the column, m. It may be negative (water standing
	// above the top, e.g. a lake bed) and it sets the default head at a
	// drained end: −WaterTable.
	WaterTable float64 `json:"waterTable"`
	// Top and Bottom set the drainage and the groundwater at each end.
	Top    Boundary `json:"top"`
	Bottom Boundary `json:"bottom"`
	// Loads is the history of surcharge stages on the column.
	Loads []Load `json:"loads,omitempty"`
	// InitialExcess, when given, is an excess pore pressure profile at
	// t = 0 created by an undrained total stress increase of the same
	// profile (kPa, linear between points, constant beyond the ends).
	InitialExcess []DepthValue `json:"initialExcess,omitempty"`
	// Times are the output times for isochrones, days after the start.
	Times []float64 `json:"times,omitempty"`
	// Piezometers are depths below the top at which pore pressure is
	// reported against time, m.
	Piezometers []float64 `json:"piezometers,omitempty"`
	// TargetDegree is the average degree of consolidation (by settlement)
	// whose time is reported, a fraction in (0, 1). Zero means 0.95.
	TargetDegree float64 `json:"targetDegree,omitempty"`
	// DesignLife is the time at which secondary compression is evaluated,
	// days. Zero means 50 years (18262.5 days).
	DesignLife float64 `json:"designLife,omitempty"`
	// Monitoring holds field readings to compare with the prediction.
	Monitoring *Monitoring `json:"monitoring,omitempty"`
	// Model is the consolidation model: ModelLinear ("linear", also the
	// meaning of "") keeps k and mv of every layer fixed for the whole
	// solve; ModelNonlinear ("nonlinear") gives every element its own state
	// (effective stress, largest past effective stress, void ratio) and
	// follows the layer's e–log σ' curve and permeability law step by step.
	Model string `json:"model,omitempty"`
	// Drains, when given, is a pattern of vertical drains over a depth
	// range of the column; nil means none.
	Drains *Drains `json:"drains,omitempty"`
	// Decisions holds the questions of the site decisions: the residual
	// settlement after a handover date, and the surcharge design. Nil
	// means none asked.
	Decisions *Decisions `json:"decisions,omitempty"`
	// Uncertainty, when given, describes how uncertain the layers' k, mv
	// and ch are, for the Monte Carlo of package solver/uncertain; Solve
	// itself ignores it (beyond validating it).
	Uncertainty *Uncertainty `json:"uncertainty,omitempty"`
	// Variants are named options of the same ground, each a set of
	// changes to this project (Variant.Apply), solved beside it by
	// package solver/compare; Solve itself ignores them (beyond
	// validating them).
	Variants []Variant `json:"variants,omitempty"`
	// Alignment places the project and its options at chainages along
	// a line (nil: none).
	Alignment *Alignment `json:"alignment,omitempty"`
	// Mesh and Stepping control the numerics; zero values are defaults.
	Mesh     MeshSettings `json:"mesh,omitzero"`
	Stepping Stepping     `json:"stepping,omitzero"`
}

// The consolidation models (Project.Model).
const (
	ModelLinear    = "linear"
	ModelNonlinear = "nonlinear"
)

// Units names the units of a project file. Only the SI set is accepted.
type Units struct {
	Length string `json:"length,omitempty"` // "m"
	Stress string `json:"stress,omitempty"` // "kPa"
	Time   string `json:"time,omitempty"`   // "day"
	K      string `json:"k,omitempty"`      // "m/s"
}

// Layer is one horizontal soil layer.
type Layer struct {
	// Name labels the layer in plots and tables; free text.
	Name string `json:"name,omitempty"`
	// Thickness, m, > 0.
	Thickness float64 `json:"thickness"`
	// GammaSat is the saturated unit weight, kN/m³, used below the water
	// table. Must exceed gammaW for the effective stress to grow with depth.
	GammaSat float64 `json:"gammaSat"`
	// Gamma is the moist unit weight above the water table, kN/m³. Zero
	// means GammaSat.
	Gamma float64 `json:"gamma,omitempty"`
	// K is the vertical permeability (hydraulic conductivity), m/s, > 0.
	K float64 `json:"k"`
	// Mv is the coefficient of volume compressibility, 1/kPa. Zero means
	// "derive it from ECurve" over the layer's stress range; then ECurve is
	// required.
	Mv float64 `json:"mv,omitempty"`
	// MvUnload is the coefficient of volume compressibility on unloading
	// and on reloading below the largest past effective stress (the
	// swelling modulus), 1/kPa, for the layers that follow mv. Zero means
	// Mv: unloading rebounds along the loading slope.
	MvUnload float64 `json:"mvUnload,omitempty"`
	// ECurve gives the e–log σ' parameters for the settlement estimate.
	ECurve *ECurve `json:"ecurve,omitempty"`
	// Calpha is the coefficient of secondary compression (Δe per log10
	// cycle of time), ≥ 0. Zero means no secondary compression.
	Calpha float64 `json:"calpha,omitempty"`
	// CalphaCc gives Cα as a fraction of ecurve.cc instead (Mesri &
	// Godlewski 1977: about 0.04 for inorganic clays, 0.05–0.07 for
	// organic ones, common practice as a hint only), ≥ 0; give Calpha or
	// CalphaCc, not both.
	CalphaCc float64 `json:"calphaCc,omitempty"`
	// CalphaReduced, when given, is the Cα that applies once a surcharge
	// has been removed (unloading slows secondary compression for a
	// while); without it the full Cα is used and the solve warns that the
	// rate is then overestimated. ≥ 0.
	CalphaReduced float64 `json:"calphaReduced,omitempty"`
	// Ch is the coefficient of consolidation for horizontal flow,
	// m²/day, read only where drains reach. Zero means KhKv × cv.
	Ch float64 `json:"ch,omitempty"`
	// KhKv is the ratio of horizontal to vertical permeability, > 0, used
	// when Ch is not given (ch = KhKv·cv, kh = KhKv·k). Zero means 1.
	// Give Ch or KhKv, not both.
	KhKv float64 `json:"khKv,omitempty"`
	// Outlet, when given, marks the layer as draining to an outlet (a
	// sand layer cut by a ditch or tapped by relief wells): its pore
	// pressure is held at the outlet's head throughout the layer, in the
	// steady state and during consolidation (where the excess there stays
	// zero). Nil means the layer drains only through its neighbours.
	Outlet *Outlet `json:"outlet,omitempty"`
}

// Outlet is where a draining layer lets its water go.
type Outlet struct {
	// Head is the total head held in the layer, m above the top of the
	// column. Nil means hydrostatic: −WaterTable.
	Head *float64 `json:"head,omitempty"`
}

// ECurve holds the parameters of the e–log σ' compression model.
type ECurve struct {
	// E0 is the initial void ratio, > 0.
	E0 float64 `json:"e0"`
	// Cc is the compression index (virgin line), > 0.
	Cc float64 `json:"cc"`
	// Cr is the recompression (and swelling) index, ≥ 0 and ≤ Cc.
	Cr float64 `json:"cr"`
	// SigmaP is the preconsolidation stress, kPa, the same at every depth
	// of the layer. With none of SigmaP, OCR, POP and SigmaPProfile the
	// layer is normally consolidated.
	SigmaP float64 `json:"sigmaP,omitempty"`
	// OCR is the overconsolidation ratio σ'p/σ'0 at each depth, ≥ 1.
	OCR float64 `json:"ocr,omitempty"`
	// POP is the pre-overburden pressure, kPa ≥ 0: σ'p = σ'0 + POP at
	// every depth (the usual description of a crust). Give at most one of
	// SigmaP, OCR, POP and SigmaPProfile.
	POP float64 `json:"pop,omitempty"`
	// SigmaPProfile gives σ'p against depth below the top of the column
	// (z in m, value in kPa > 0; linear between points, constant beyond
	// them), e.g. from oedometer tests at several depths.
	SigmaPProfile []DepthValue `json:"sigmaPProfile,omitempty"`
	// Ck is the permeability change index of the non-linear model:
	// log10 k = log10 k0 + (e − e0)/Ck (Tavenas et al. 1983), with k0 the
	// layer's k at the in-situ void ratio e0. Zero means k stays constant.
	// The linear model ignores it.
	Ck float64 `json:"ck,omitempty"`
}

// Boundary is the condition at one end of the column.
type Boundary struct {
	// Drained ends hold the pore pressure: for steady seepage the total
	// head is fixed, during consolidation the excess pore pressure follows
	// Excess. Undrained ends pass no water during consolidation; in steady
	// seepage they take Inflow.
	Drained bool `json:"drained"`
	// Head is the fixed total head at a drained end for steady seepage, m
	// above the top of the column. Nil means hydrostatic: −WaterTable.
	Head *float64 `json:"head,omitempty"`
	// Inflow is the steady flow into the column through an undrained end,
	// m/s (Darcy velocity, positive into the column). Zero means sealed.
	Inflow float64 `json:"inflow,omitempty"`
	// Excess is the change of pore pressure held at a drained end during
	// consolidation (a drawdown is negative, a rising river positive), kPa,
	// linear in time between points and constant beyond them. Empty means
	// zero throughout.
	Excess []TimeValue `json:"excess,omitempty"`
	// Resistance, when > 0 at a drained end, makes the end drain through
	// a resistance (a leaky end: a thin tight layer or a clogged filter
	// between the column and the water beyond), days: the thickness over
	// the permeability, d/k, of what lies between. The flow out of the
	// column is then (h − Head)/Resistance in the steady state (a Darcy
	// velocity) and (u − u_b)/(γw·Resistance) for the excess, with u_b =
	// 0 (a pressure history needs a free end). Zero means a freely
	// drained end; a very large value approaches a sealed one.
	Resistance float64 `json:"resistance,omitempty"`
}

// holds reports whether the end holds its pore pressure (drained freely).
func (b Boundary) holds() bool { return b.Drained && b.Resistance == 0 }

// leaky reports whether the end drains through a resistance.
func (b Boundary) leaky() bool { return b.Drained && b.Resistance > 0 }

// Load is one load stage: a pressure change q at the top, or a fill of
// given thickness and unit weight, applied linearly from Start over Ramp,
// over the whole top (one-dimensional) or over a finite Area.
type Load struct {
	// Start is when the stage begins, days ≥ 0.
	Start float64 `json:"start"`
	// Ramp is how long the change takes, days ≥ 0; 0 is instantaneous.
	Ramp float64 `json:"ramp,omitempty"`
	// Q is the change of vertical total stress, kPa; negative removes load.
	// It must be 0 (or absent) when Fill is given.
	Q float64 `json:"q"`
	// Fill, when given, makes the stage a fill: its pressure is
	// Fill.Gamma × Fill.Thickness, and the part that comes to lie below
	// the water table as the ground settles loses weight (submergence).
	Fill *Fill `json:"fill,omitempty"`
	// Area, when given, is the plan shape of the loaded area and the
	// column's place under it: the stress change with depth is the
	// pressure times the elastic (or 2:1) influence factor of package
	// solver/load. Nil means an area infinite in plan (factor 1).
	Area *Area `json:"area,omitempty"`
	// Profile, when given, scales Q with depth: the stress change at z is
	// Q·factor(z), with factor linear between points and constant beyond
	// them (e.g. an influence factor from an elastic stress solution).
	// Empty means factor 1 at every depth.
	Profile []DepthValue `json:"profile,omitempty"`
	// Dig, when given, makes the stage an excavation: soil removed from
	// the top of the column down to Dig.Depth over the stage's ramp (or
	// at once), unloading the soil below by the weight removed, with the
	// water inside the excavation at Dig.WaterLevel. Q must be 0 and the
	// stage has no Fill, Area or Profile.
	Dig *Dig `json:"dig,omitempty"`
	// Lower, when given, makes the stage a lowering of the water table
	// (a drawdown from the top): over the stage's ramp (or at once) the
	// pore pressure above the new water table falls to zero and the soil
	// there weighs its moist unit weight (gamma) instead of gammaSat.
	// Q must be 0 and the stage has no Fill, Area, Profile or Dig.
	Lower *Lowering `json:"lower,omitempty"`
}

// Lowering is a drawdown of the water table from its initial depth.
type Lowering struct {
	// WaterTable is the new depth of the water table, m below the top:
	// below the initial one, inside the column.
	WaterTable float64 `json:"waterTable"`
}

// Dig is an excavation from the top of the column. Depths stay measured
// from the original top: results below the floor are at their depth
// below the ground as it was before digging.
type Dig struct {
	// Depth is the floor of the excavation once complete, m below the
	// original top, inside the column.
	Depth float64 `json:"depth"`
	// WaterLevel is the depth of the water standing inside the
	// excavation, m below the original top: at or below Depth means
	// pumped dry (the floor at zero pore pressure). Nil means the water
	// table (the excavation floods to it; no pumping).
	WaterLevel *float64 `json:"waterLevel,omitempty"`
}

// Fill is a layer of earth placed on the top of the column.
type Fill struct {
	// Thickness is the thickness placed, m; negative removes that much
	// from the top of the fill placed before (a surcharge taken off).
	Thickness float64 `json:"thickness"`
	// Gamma is the unit weight of the fill above the water table, kN/m³.
	Gamma float64 `json:"gamma"`
	// GammaSat is its saturated unit weight below the water table,
	// kN/m³. Zero means Gamma. A metre of fill below the water table
	// weighs GammaSat − γw on the ground instead of Gamma.
	GammaSat float64 `json:"gammaSat,omitempty"`
}

// Area is the plan shape of a loaded area and where the column stands
// under it. Only the sizes the shape uses may be given.
type Area struct {
	// Shape is "strip" (Width, infinitely long), "rectangle" (Width ×
	// Length), "circle" (Radius) or "embankment" (a symmetric fill: crest
	// Width, side Slope; its height is the fill's thickness).
	Shape string `json:"shape"`
	// Method is how the stress spreads: "" or "elastic" for the
	// Boussinesq-based closed forms, "2:1" for the 2:1 spread.
	Method string `json:"method,omitempty"`
	// Width is the width of a strip or rectangle, or the crest width of
	// an embankment (0 for a triangular section), m.
	Width float64 `json:"width,omitempty"`
	// Length is the length of a rectangle, m.
	Length float64 `json:"length,omitempty"`
	// Radius is the radius of a circle, m.
	Radius float64 `json:"radius,omitempty"`
	// Slope is the side slope of an embankment, horizontal per vertical
	// (2 for 2H:1V).
	Slope float64 `json:"slope,omitempty"`
	// X is the horizontal distance of the column from the centre line of
	// the area across its width, m; Y along the length of a rectangle.
	// A circle takes the column on its axis only.
	X float64 `json:"x,omitempty"`
	Y float64 `json:"y,omitempty"`
}

// DepthValue is one point of a profile against depth (z in m below the top).
type DepthValue struct {
	Z     float64 `json:"z"`
	Value float64 `json:"value"`
}

// TimeValue is one point of a history (t in days).
type TimeValue struct {
	T     float64 `json:"t"`
	Value float64 `json:"value"`
}

// MeshSettings controls the finite element mesh.
type MeshSettings struct {
	// Order is the element order: 1 (linear) or 2 (quadratic). Zero means 1.
	Order int `json:"order,omitempty"`
	// MaxSize is the largest element length, m. Zero means 1/200 of the
	// column height.
	MaxSize float64 `json:"maxSize,omitempty"`
	// MinPerLayer is the least number of elements in any layer. Zero
	// means 4.
	MinPerLayer int `json:"minPerLayer,omitempty"`
}

// Stepping controls the implicit time integration of consolidation.
type Stepping struct {
	// Theta is the θ of the θ-method, in [0.5, 1]. Zero means 0.5
	// (Crank–Nicolson) after the damped start.
	Theta float64 `json:"theta,omitempty"`
	// DampedSteps is the number of backward Euler steps taken after every
	// instantaneous change of load or boundary pressure. Zero means 4;
	// negative means none.
	DampedSteps int `json:"dampedSteps,omitempty"`
	// FirstStep is the first step after every breakpoint, days. Zero
	// means 1 minute (1/1440 day).
	FirstStep float64 `json:"firstStep,omitempty"`
	// Growth is the ratio between consecutive steps, ≥ 1. Zero means 1.1.
	Growth float64 `json:"growth,omitempty"`
	// EndTime is the last time simulated, days. Zero means 100 years
	// after the last load or boundary change, or the last output time if
	// that is later.
	EndTime float64 `json:"endTime,omitempty"`
}

// Monitoring holds field readings taken after loading starts.
type Monitoring struct {
	// Start is the calendar date of day 0 of the project (the start of
	// construction), "YYYY-MM-DD". Readings may give a date instead of t
	// only when Start is set.
	Start string `json:"start,omitempty"`
	// Plates are settlement records, one per settlement plate or marker.
	Plates []Plate `json:"plates,omitempty"`
	// Piezometers are pore pressure records at given depths.
	Piezometers []PiezometerRecord `json:"piezometers,omitempty"`
	// Asaoka holds the choices for Asaoka's method (nil: the defaults).
	Asaoka *AsaokaSettings `json:"asaoka,omitempty"`
}

// Plate is the settlement record of one plate; Readings are settlements, m,
// positive downward, relative to the plate's level at day 0.
type Plate struct {
	Name     string    `json:"name,omitempty"`
	Readings []Reading `json:"readings"`
}

// PiezometerRecord is the record of one piezometer; Readings are pore
// pressures, kPa (what the instrument reads, not the excess).
type PiezometerRecord struct {
	Name     string    `json:"name,omitempty"`
	Depth    float64   `json:"depth"` // m below the top of the column
	Readings []Reading `json:"readings"`
}

// Reading is one measurement: at T days after day 0, or on Date
// ("YYYY-MM-DD") when Monitoring.Start is set; one of the two.
type Reading struct {
	T     float64 `json:"t,omitempty"`
	Date  string  `json:"date,omitempty"`
	Value float64 `json:"value"`
}

// Drains is a pattern of vertical drains (prefabricated band drains or
// sand drains) installed from depth Top to the tip. Each drain drains the
// unit cell around it (see the package documentation).
type Drains struct {
	// Pattern is "triangular" or "square".
	Pattern string `json:"pattern"`
	// Spacing is the distance between neighbouring drains, m, > 0.
	Spacing float64 `json:"spacing"`
	// Diameter is the diameter of a round drain, m. Give Diameter, or
	// Width and Thickness of a band drain.
	Diameter float64 `json:"diameter,omitempty"`
	// Width and Thickness are the band drain's cross-section a × b, m.
	Width     float64 `json:"width,omitempty"`
	Thickness float64 `json:"thickness,omitempty"`
	// Equivalent is how a band drain's equivalent diameter is taken:
	// "perimeter", 2(a+b)/π (Hansbo 1979), or "mean", (a+b)/2 (Rixner et
	// al. 1986). Empty means "perimeter".
	Equivalent string `json:"equivalent,omitempty"`
	// SmearRatio is ds/dw, the smear zone's diameter over the drain's,
	// ≥ 1. Zero means 1 (no smear).
	SmearRatio float64 `json:"smearRatio,omitempty"`
	// SmearK is kh/ks, the undisturbed over the smeared horizontal
	// permeability, ≥ 1. Zero means 1 (no smear).
	SmearK float64 `json:"smearK,omitempty"`
	// Qw is the drain's discharge capacity, m³/s, > 0. Zero means no well
	// resistance (an infinitely permeable drain).
	Qw float64 `json:"qw,omitempty"`
	// Discharge is where the drains let their water out: "top", "base"
	// or "both". Empty means "top".
	Discharge string `json:"discharge,omitempty"`
	// Top is the depth where the drains start, m ≥ 0. Zero means the top
	// of the column.
	Top float64 `json:"top,omitempty"`
	// Depth is the depth of the drains' tip, m. Give Depth or ToLayer, or
	// neither: the drains then reach the base of the column.
	Depth float64 `json:"depth,omitempty"`
	// ToLayer, when given, puts the tip at the base of layer ToLayer
	// (0-based).
	ToLayer *int `json:"toLayer,omitempty"`
	// Design, when given, is the question of the design helper
	// (DrainSpacing): which spacing reaches a degree by a time. Solve
	// ignores it.
	Design *DrainDesign `json:"design,omitempty"`
}

// DrainDesign asks for the spacing that reaches a degree of
// consolidation by a time.
type DrainDesign struct {
	// Degree is the target average degree of consolidation (by
	// settlement), a fraction in (0, 1). Zero means 0.9.
	Degree float64 `json:"degree,omitempty"`
	// Time is when it must be reached, days after day 0, > 0.
	Time float64 `json:"time"`
}

// Decisions are the site questions answered from the solved column (see
// the package documentation, Site decisions).
type Decisions struct {
	// Handover is the day after which settlement matters (paving,
	// handover), days after day 0, > 0 and before the design life. Solve
	// then gives Result.Residual: the settlement still to come after it,
	// to Project.DesignLife. Zero means not asked.
	Handover float64 `json:"handover,omitempty"`
	// Surcharge, when given, asks when the surcharge may come off and
	// what follows (SurchargeRemoval). Solve ignores it.
	Surcharge *SurchargeDesign `json:"surcharge,omitempty"`
	// Strength, when given, asks how the undrained strength grows with
	// consolidation and when each lift may be placed (StrengthGain).
	// Solve ignores it.
	Strength *StrengthCheck `json:"strength,omitempty"`
}

// StrengthCheck is the question of the strength gain screening check
// (StrengthGain): undrained strength laws for some layers, the factor of
// safety of the bearing check, and the days of the su profiles wanted.
type StrengthCheck struct {
	// Laws give the undrained strength of the layers they name; layers
	// without one are left out of the check (sand, fill).
	Laws []StrengthLaw `json:"laws"`
	// FS is the factor of safety the bearing check Nc·su/FS applies,
	// ≥ 1; required (local rules set it).
	FS float64 `json:"fs"`
	// Times are the days of the su profiles wanted, increasing.
	Times []float64 `json:"times,omitempty"`
}

// StrengthLaw is the undrained strength of one layer as a function of
// its effective vertical stress σ'v and preconsolidation stress σ'p (the
// largest of the given σ'p and every σ'v reached since).
type StrengthLaw struct {
	// Layer is the index (0-based) of the layer in Project.Layers.
	Layer int `json:"layer"`
	// Law is StrengthSHANSEP (su = S σ'v OCR^m, Ladd & Foott 1974),
	// StrengthRatio (su = Ratio σ'p) or StrengthMeasured (su = the
	// measured Su0 profile plus Gain times the rise of σ'v).
	Law string `json:"law"`
	// S and M are the SHANSEP parameters (S about 0.22 and m about 0.8
	// are common practice, as hints only).
	S float64 `json:"s,omitempty"`
	M float64 `json:"m,omitempty"`
	// Ratio is su/σ'p (about 0.22 is common practice, as a hint only).
	Ratio float64 `json:"ratio,omitempty"`
	// Su0 is the measured initial su against depth (z in m below the
	// top, value in kPa > 0; linear between points, constant beyond).
	Su0 []DepthValue `json:"su0,omitempty"`
	// Gain is Δsu/Δσ'v, the strength gained per kPa of effective stress
	// gained, ≥ 0.
	Gain float64 `json:"gain,omitempty"`
}

// The undrained strength laws (StrengthLaw.Law).
const (
	StrengthSHANSEP  = "shansep"
	StrengthRatio    = "ratio"
	StrengthMeasured = "measured"
)

// SurchargeDesign is the question of the surcharge design helper
// (SurchargeRemoval): a temporary surcharge is placed with a lift and
// taken off by a later stage; when may it come off so that no primary
// settlement under the permanent load is left?
type SurchargeDesign struct {
	// Removal is the index (0-based) in Project.Loads of the stage that
	// takes the surcharge off (a negative q or fill thickness). Nil means
	// the last such stage.
	Removal *int `json:"removal,omitempty"`
	// WithSecondary adds to the target the secondary compression the
	// permanent load alone would give by Project.DesignLife: the
	// surcharge then also pays for the creep ahead.
	WithSecondary bool `json:"withSecondary,omitempty"`
	// RemoveBy, when > 0, is the day by which the surcharge must come
	// off: the helper then also finds the surcharge needed for it.
	RemoveBy float64 `json:"removeBy,omitempty"`
}
