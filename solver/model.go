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
	// Mesh and Stepping control the numerics; zero values are defaults.
	Mesh     MeshSettings `json:"mesh,omitzero"`
	Stepping Stepping     `json:"stepping,omitzero"`
}

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
	// ECurve gives the e–log σ' parameters for the settlement estimate.
	ECurve *ECurve `json:"ecurve,omitempty"`
	// Calpha is the coefficient of secondary compression (Δe per log10
	// cycle of time), ≥ 0. Zero means no secondary compression.
	Calpha float64 `json:"calpha,omitempty"`
}

// ECurve holds the parameters of the e–log σ' compression model.
type ECurve struct {
	// E0 is the initial void ratio, > 0.
	E0 float64 `json:"e0"`
	// Cc is the compression index (virgin line), > 0.
	Cc float64 `json:"cc"`
	// Cr is the recompression (and swelling) index, ≥ 0 and ≤ Cc.
	Cr float64 `json:"cr"`
	// SigmaP is the preconsolidation stress, kPa. Give SigmaP or OCR, not
	// both; with neither the layer is normally consolidated.
	SigmaP float64 `json:"sigmaP,omitempty"`
	// OCR is the overconsolidation ratio σ'p/σ'0 at each depth, ≥ 1.
	OCR float64 `json:"ocr,omitempty"`
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
}

// Load is one surcharge stage: a uniform pressure change q at the top,
// applied linearly from Start over Ramp.
type Load struct {
	// Start is when the stage begins, days ≥ 0.
	Start float64 `json:"start"`
	// Ramp is how long the change takes, days ≥ 0; 0 is instantaneous.
	Ramp float64 `json:"ramp,omitempty"`
	// Q is the change of vertical total stress, kPa; negative removes load.
	Q float64 `json:"q"`
	// Profile, when given, scales Q with depth: the stress change at z is
	// Q·factor(z), with factor linear between points and constant beyond
	// them (e.g. an influence factor from an elastic stress solution).
	// Empty means factor 1 at every depth.
	Profile []DepthValue `json:"profile,omitempty"`
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
