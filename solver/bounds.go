package solver

import "fmt"

// Physical bounds of the numbers in a project file. Validate refuses a
// value outside its bound with ErrOutOfRange, the field path and the
// allowed range with its unit, before any work is done (Solve validates
// first). The bounds are generous for any real soil, groundwater and
// loading (the typical values given beside each bound are common practice,
// quoted from memory, and lie well inside it), and narrow enough that
// nothing inside them can overflow or underflow in the numerics. The worst products are:
//
//   - stress: MaxColumnHeight × MaxUnitWeight plus water standing MaxHead
//     above the top, ≈ 6.3·10⁵ kPa; pore pressure from the heads,
//     MaxGammaW × (MaxHead + MaxColumnHeight) ≈ 2.6·10⁵ kPa;
//   - pore pressure behind a fixed inflow: MaxGammaW × MaxInflow ×
//     MaxColumnHeight / MinK ≈ 1.3·10²⁰ kPa (an absurd column, but finite);
//   - the θ-method matrix: elements are at least MinThickness /
//     MaxElements = 5·10⁻¹⁰ m long, so θΔt·k/(γw Δz) ≤ MaxTime × 86400 ×
//     MaxK / (MinGammaW × 5·10⁻¹⁰) ≈ 2·10²³ beside capacities mv·Δz ≥
//     5·10⁻¹⁹;
//   - stress change: MaxLoads × MaxStress × MaxProfileFactor = 2·10¹⁰ kPa,
//     settlement MaxMv × that × MaxColumnHeight ≈ 2·10¹⁴ m; the e–log σ'
//     and secondary compression terms are logarithms of such ratios;
//
// all far inside float64's 10³⁰⁸ and above its 10⁻³⁰⁸. A column at the
// edges of several bounds at once can still be ill-conditioned (a sealed
// end next to a layer 10¹⁶ times more permeable than its neighbour): then
// the factorisation fails and Solve returns ErrNumerical naming the layer,
// never a non-finite result.
const (
	// MinThickness and MaxThickness bound layers[i].thickness, m: a
	// 0.1 mm seam to a 10 km layer.
	MinThickness = 1e-4
	MaxThickness = 1e4
	// MaxColumnHeight bounds the sum of the thicknesses, m (deep basins
	// are a few km of sediment).
	MaxColumnHeight = 1e4

	// MinK and MaxK bound layers[i].k, m/s: intact clays and shales reach
	// 1e-13 m/s, open gravel about 1 m/s.
	MinK = 1e-15
	MaxK = 10.0

	// MaxUnitWeight bounds gammaSat and gamma, kN/m³ (soils weigh 12–23,
	// rock and dense tailings up to about 35).
	MaxUnitWeight = 50.0
	// MinGammaW and MaxGammaW bound gammaW, kN/m³: fresh water 9.78–9.81,
	// sea water about 10.05, the densest brines about 12.
	MinGammaW = 9.0
	MaxGammaW = 13.0

	// MinMv and MaxMv bound layers[i].mv, 1/kPa: dense sand and stiff
	// clay about 1e-5, peat about 1e-2.
	MinMv = 1e-9
	MaxMv = 1.0

	// MaxE0 bounds ecurve.e0 (sands 0.4–1, soft clays 1–3, peats to about
	// 15); MaxCc bounds ecurve.cc and ecurve.cr (peats reach about 10);
	// MaxOCR bounds ecurve.ocr; MaxCalpha bounds calpha (peats to about
	// 0.1–0.5).
	MaxE0     = 30.0
	MaxCc     = 20.0
	MaxOCR    = 1000.0
	MaxCalpha = 1.0

	// MinCk and MaxCk bound ecurve.ck, the permeability change index of
	// the non-linear model (soft clays 0.3–1.5, about 0.5 e0). At the
	// lower bound with the largest Cc a compression can still make k
	// underflow: the factorisation then fails with ErrNumerical.
	// MaxCalphaCc bounds calphaCc (Cα/Cc is 0.02–0.1 for clays and peats).
	MinCk       = 0.05
	MaxCk       = 50.0
	MaxCalphaCc = 1.0

	// MaxStress bounds every stress and pressure the file gives, kPa, in
	// absolute value: loads[j].q, ecurve.sigmaP, boundary excess values,
	// initialExcess values (100 MPa; a 50 m fill is about 1 MPa).
	MaxStress = 1e5
	// MaxProfileFactor bounds loads[j].profile[k].value in absolute value
	// (an influence factor is at most 1; the margin allows a profile
	// written in other units of q).
	MaxProfileFactor = 1000.0

	// MaxFillThickness bounds loads[j].fill.thickness in absolute value,
	// m (embankments and preloads are a few metres to a few tens, the
	// highest spoil heaps a few hundred): MaxUnitWeight × 10³ m = 5·10⁴
	// kPa stays inside MaxStress.
	MaxFillThickness = 1e3
	// MinAreaSize and MaxAreaSize bound the sizes of a loaded area
	// (loads[j].area width, length, radius; the column's offsets x and y
	// in absolute value), m: a 1 mm plate to a 100 km fill. MaxSlope
	// bounds an embankment's side slope, horizontal per vertical (fills
	// stand at 1.5–3, berms to about 10), MinSlope its least value. The
	// closed forms of package load stay finite for every ratio of these
	// sizes to a depth in 0 … MaxColumnHeight.
	MinAreaSize = 1e-3
	MaxAreaSize = 1e5
	MinSlope    = 1e-3
	MaxSlope    = 100.0

	// MaxHead bounds waterTable and top|bottom.head in absolute value, m,
	// and MaxDepth the depths of profiles, m (the deepest ocean is 11 km).
	MaxHead  = 1e4
	MaxDepth = 1e4
	// MaxInflow bounds top|bottom.inflow in absolute value, m/s (a Darcy
	// velocity; 1 m/s is beyond any open gravel under a metre of gradient).
	MaxInflow = 1.0

	// MaxTime bounds every time and duration, days: times, load starts and
	// ramps, boundary history times, designLife, stepping.endTime and
	// stepping.firstStep, readings' t (about 2.7 million years, for
	// running a near-impermeable layer to its end). MinFirstStep is the
	// least stepping.firstStep, days (about 0.1 ms).
	MaxTime      = 1e9
	MinFirstStep = 1e-9

	// MinMaxSize is the least mesh.maxSize, m. MaxDampedSteps bounds
	// stepping.dampedSteps (negative means none).
	MinMaxSize     = 1e-6
	MaxDampedSteps = MaxSteps

	// Drains. MinCh and MaxCh bound layers[i].ch, m²/day (soft clays
	// 0.5–30 m²/year, about 0.001–0.1 m²/day; a sand layer the drains
	// cross may reach 10⁶); MinKhKv and MaxKhKv bound layers[i].khKv
	// (1–2 for most clays, 3–15 for varved ones). MinDrainSize and
	// MaxDrainSize bound drains.diameter, .width and .thickness, m (band
	// drains 100 × 3–6 mm, sand drains 0.2–0.6 m); MinSpacing and
	// MaxSpacing bound drains.spacing, m (usually 0.8–4 m). MaxSmearRatio
	// bounds drains.smearRatio and MaxSmearK drains.smearK (2–5 and 1–10
	// are usual). MinQw and MaxQw bound drains.qw, m³/s (band drains
	// 100–800 m³/year, about 3·10⁻⁶–2.5·10⁻⁵ m³/s). With them the sink
	// rate 8ch/(De²μ) stays below 10¹¹ per day and μ, at most about
	// 10²³ with the well term, stays finite.
	MinCh         = 1e-9
	MaxCh         = 1e7
	MinKhKv       = 0.01
	MaxKhKv       = 1000.0
	MinDrainSize  = 1e-4
	MaxDrainSize  = 10.0
	MinSpacing    = 1e-2
	MaxSpacing    = 100.0
	MaxSmearRatio = 100.0
	MaxSmearK     = 1000.0
	MinQw         = 1e-12
	MaxQw         = 1.0

	// Strength gain (decisions.strength). MaxStrengthFS bounds fs (1.3–1.5
	// are usual for staged embankments, common practice); MaxStrengthRatio
	// bounds a law's s, ratio and gain (su/σ'v of clays lies near
	// 0.2–0.35); MaxStrengthExponent its m (0.8 usual); MaxSu a measured
	// su, kPa (soft clays 5–50); MaxStrengthTimes the su profiles asked.
	MaxStrengthFS       = 10.0
	MaxStrengthRatio    = 5.0
	MaxStrengthExponent = 2.0
	MaxSu               = 1e4
	MaxStrengthTimes    = 50

	// MaxPlateReading bounds a settlement plate's readings, m, and
	// MaxPressureReading a piezometer's, kPa, in absolute value.
	MaxPlateReading    = 1e3
	MaxPressureReading = 1e6

	// MinResistance and MaxResistance bound top|bottom.resistance, days
	// (d/k of what lies beyond a leaky end: a 1 m clay seam of 1e-9 m/s is
	// about 1.2·10⁴ days, a geotextile filter well under a day). The
	// leakage coefficient 1/(γw·R) then stays between 10⁻¹³ and 10⁸
	// m/(kPa·day), inside the range of the conductivities k/(γw Δz).
	MinResistance = 1e-6
	MaxResistance = 1e12
)

// inRange adds an ErrOutOfRange problem at path unless lo ≤ v ≤ hi (v
// must already be finite), and reports whether v is in range.
func inRange(ps *Problems, at string, v, lo, hi float64, unit string) bool {
	if v >= lo && v <= hi {
		return true
	}
	ps.Add(at, ErrOutOfRange, fmt.Sprintf("allowed %s, got %g%s", rangeText(lo, hi, unit), v, unitSuffix(unit)))
	return false
}

// within adds a problem at path unless v is finite and |v| ≤ limit.
func within(ps *Problems, at string, v, limit float64, unit string) bool {
	return finite(ps, at, v) && inRange(ps, at, v, -limit, limit, unit)
}

// bounded adds a problem at path unless v is finite, > 0 and in [lo, hi].
func bounded(ps *Problems, at string, v, lo, hi float64, unit string) bool {
	return positive(ps, at, v) && inRange(ps, at, v, lo, hi, unit)
}

// upTo adds a problem at path unless v is finite, ≥ 0 and ≤ hi.
func upTo(ps *Problems, at string, v, hi float64, unit string) bool {
	return nonNegative(ps, at, v) && inRange(ps, at, v, 0, hi, unit)
}

func rangeText(lo, hi float64, unit string) string {
	return fmt.Sprintf("%g to %g%s", lo, hi, unitSuffix(unit))
}

func unitSuffix(unit string) string {
	if unit == "" {
		return ""
	}
	return " " + unit
}
