package solver

import (
	"fmt"
	"math"

	"porelight/solver/soil"
)

// Limits that keep one solve within what a browser tab can do.
const (
	MaxLayers      = 500
	MaxElements    = 200_000
	MaxTimes       = 1_000
	MaxPiezometers = 100
	MaxLoads       = 200
	MaxSteps       = 20_000
	// MaxWork caps nodes × time steps of one solve: 100,000 quadratic
	// elements over 1,000 steps, a few seconds natively.
	MaxWork = 250_000_000
	// MaxStored caps the numbers one result holds: nodes × (output times
	// + 7) for the profiles and isochrones, plus time steps × (7 + 2 ×
	// piezometers) for the series. 4,000,000 numbers are 32 MB as float64
	// and about 90 MB as JSON, well inside the page's 1 GiB of wasm memory.
	MaxStored = 4_000_000
)

// Validate checks every value of p and returns all problems at once (as
// Problems, each with its field path), or nil. It does not change p.
func Validate(p *Project) error {
	var ps Problems
	if p == nil {
		ps.Add("", ErrRequired, "no project")
		return ps
	}
	if p.Format != Format {
		ps.Add("format", ErrFormat, fmt.Sprintf("got %q, this version reads %q", p.Format, Format))
	}
	if u := p.Units; u != nil {
		for _, c := range []struct{ path, got, want string }{
			{"units.length", u.Length, "m"}, {"units.stress", u.Stress, "kPa"},
			{"units.time", u.Time, "day"}, {"units.k", u.K, "m/s"},
		} {
			if c.got != "" && c.got != c.want {
				ps.Add(c.path, ErrOutOfRange, fmt.Sprintf("got %q, files use %q", c.got, c.want))
			}
		}
	}
	gw, gwOK := ResolveGammaW(p), true
	if p.GammaW != 0 {
		gwOK = bounded(&ps, "gammaW", p.GammaW, MinGammaW, MaxGammaW, "kN/m³")
	}
	within(&ps, "waterTable", p.WaterTable, MaxHead, "m")
	switch p.Model {
	case "", ModelLinear, ModelNonlinear:
	default:
		ps.Add("model", ErrOutOfRange, fmt.Sprintf("got %q, the models are %q and %q", p.Model, ModelLinear, ModelNonlinear))
	}

	switch n := len(p.Layers); {
	case n == 0:
		ps.Add("layers", ErrRequired, "at least one layer")
	case n > MaxLayers:
		ps.Add("layers", ErrTooLarge, fmt.Sprintf("%d layers, the limit is %d", n, MaxLayers))
	}
	height := 0.0
	for i, l := range p.Layers {
		at := fmt.Sprintf("layers[%d].", i)
		if bounded(&ps, at+"thickness", l.Thickness, MinThickness, MaxThickness, "m") {
			height += l.Thickness
			if height > MaxColumnHeight && height-l.Thickness <= MaxColumnHeight {
				ps.Add(at+"thickness", ErrOutOfRange, fmt.Sprintf("the column would be %g m high down to this layer; allowed up to %g m in total", height, float64(MaxColumnHeight)))
			}
		}
		if bounded(&ps, at+"gammaSat", l.GammaSat, 0, MaxUnitWeight, "kN/m³") && gwOK && l.GammaSat <= gw {
			ps.Add(at+"gammaSat", ErrOutOfRange, fmt.Sprintf("must exceed gammaW = %g (got %g)", gw, l.GammaSat))
		}
		if l.Gamma != 0 {
			bounded(&ps, at+"gamma", l.Gamma, 0, MaxUnitWeight, "kN/m³")
		}
		bounded(&ps, at+"k", l.K, MinK, MaxK, "m/s")
		if l.Mv != 0 {
			bounded(&ps, at+"mv", l.Mv, MinMv, MaxMv, "1/kPa")
		} else if l.ECurve == nil {
			ps.Add(at+"mv", ErrRequired, "give mv, or an ecurve to derive it from")
		}
		validSoilModel(&ps, i, l)
		if l.Calpha != 0 {
			upTo(&ps, at+"calpha", l.Calpha, MaxCalpha, "")
			if l.ECurve == nil {
				ps.Add(at+"calpha", ErrConflict, "secondary compression needs ecurve.e0")
			}
		}
		if c := l.ECurve; c != nil {
			bounded(&ps, at+"ecurve.e0", c.E0, 0, MaxE0, "")
			bounded(&ps, at+"ecurve.cc", c.Cc, 0, MaxCc, "")
			if upTo(&ps, at+"ecurve.cr", c.Cr, MaxCc, "") && c.Cr > c.Cc {
				ps.Add(at+"ecurve.cr", ErrOutOfRange, fmt.Sprintf("must not exceed cc = %g (got %g)", c.Cc, c.Cr))
			}
			if c.SigmaP != 0 {
				bounded(&ps, at+"ecurve.sigmaP", c.SigmaP, 0, MaxStress, "kPa")
			}
			if c.OCR != 0 && finite(&ps, at+"ecurve.ocr", c.OCR) {
				if c.OCR < 1 {
					ps.Add(at+"ecurve.ocr", ErrOutOfRange, "must be ≥ 1 "+paren(num(c.OCR)))
				} else {
					inRange(&ps, at+"ecurve.ocr", c.OCR, 1, MaxOCR, "")
				}
			}
			if c.SigmaP != 0 && c.OCR != 0 {
				ps.Add(at+"ecurve.ocr", ErrConflict, "give sigmaP or ocr, not both")
			}
		}
	}

	validBoundary(&ps, "top", p.Top)
	validBoundary(&ps, "bottom", p.Bottom)
	validOutlets(&ps, p)
	if !p.Top.Drained && !p.Bottom.Drained && !hasOutlet(p) {
		for _, c := range []struct {
			at string
			q  float64
		}{{"top.inflow", p.Top.Inflow}, {"bottom.inflow", p.Bottom.Inflow}} {
			if c.q != 0 {
				ps.Add(c.at, ErrConflict, "steady flow needs a drained end to leave by; drain the other end")
			}
		}
	}

	if len(p.Loads) > MaxLoads {
		ps.Add("loads", ErrTooLarge, fmt.Sprintf("%d stages, the limit is %d", len(p.Loads), MaxLoads))
	}
	for i, l := range p.Loads {
		at := fmt.Sprintf("loads[%d].", i)
		upTo(&ps, at+"start", l.Start, MaxTime, "days")
		upTo(&ps, at+"ramp", l.Ramp, MaxTime, "days")
		within(&ps, at+"q", l.Q, MaxStress, "kPa")
		validProfile(&ps, at+"profile", l.Profile, MaxProfileFactor, "")
		if l.Fill != nil {
			validFill(&ps, at+"fill", l, gw)
		}
		if l.Area != nil && l.Dig == nil {
			validArea(&ps, at+"area", l)
		}
		if l.Dig != nil {
			validDig(&ps, at, p, i, height)
		}
		if l.Lower != nil {
			validLower(&ps, at, p, i, height)
		}
	}
	validProfile(&ps, "initialExcess", p.InitialExcess, MaxStress, "kPa")

	if len(p.Times) > MaxTimes {
		ps.Add("times", ErrTooLarge, fmt.Sprintf("%d times, the limit is %d", len(p.Times), MaxTimes))
	}
	for i, t := range p.Times {
		at := fmt.Sprintf("times[%d]", i)
		if bounded(&ps, at, t, 0, MaxTime, "days") && i > 0 && t <= p.Times[i-1] {
			ps.Add(at, ErrNotSorted, fmt.Sprintf("%g follows %g", t, p.Times[i-1]))
		}
	}
	if len(p.Piezometers) > MaxPiezometers {
		ps.Add("piezometers", ErrTooLarge, fmt.Sprintf("%d piezometers, the limit is %d", len(p.Piezometers), MaxPiezometers))
	}
	for i, z := range p.Piezometers {
		at := fmt.Sprintf("piezometers[%d]", i)
		if upTo(&ps, at, z, MaxDepth, "m") && height > 0 && z > height*(1+1e-12) {
			ps.Add(at, ErrOutOfRange, fmt.Sprintf("depth %g m is below the base of the column at %g m", z, height))
		}
	}
	if p.TargetDegree != 0 && (!(p.TargetDegree > 0 && p.TargetDegree < 1)) {
		ps.Add("targetDegree", ErrOutOfRange, "must be a fraction between 0 and 1 "+paren(num(p.TargetDegree)))
	}
	if p.DesignLife != 0 {
		bounded(&ps, "designLife", p.DesignLife, 0, MaxTime, "days")
	}

	if p.Monitoring != nil {
		validMonitoring(&ps, p.Monitoring, height, len(p.Layers))
	}
	validDrains(&ps, p, height)
	validDecisions(&ps, p)
	validUncertainty(&ps, p)
	if len(ps) == 0 {
		validVariants(&ps, p)
	}
	validAlignment(&ps, p)

	m := p.Mesh
	if m.Order != 0 && m.Order != 1 && m.Order != 2 {
		ps.Add("mesh.order", ErrOutOfRange, fmt.Sprintf("must be 1 (linear) or 2 (quadratic), got %d", m.Order))
	}
	if m.MaxSize != 0 {
		bounded(&ps, "mesh.maxSize", m.MaxSize, MinMaxSize, MaxColumnHeight, "m")
	}
	switch {
	case m.MinPerLayer < 0:
		ps.Add("mesh.minPerLayer", ErrNegative, fmt.Sprintf("got %d", m.MinPerLayer))
	case m.MinPerLayer > MaxElements:
		ps.Add("mesh.minPerLayer", ErrTooLarge, fmt.Sprintf("%d elements per layer, the limit is %d", m.MinPerLayer, MaxElements))
	}
	if len(ps) == 0 {
		if n := elementCount(p); n > MaxElements {
			ps.Add("mesh.maxSize", ErrTooLarge, fmt.Sprintf("the mesh would have %d elements, the limit is %d; use a larger maxSize", n, MaxElements))
		}
	}

	s := p.Stepping
	if s.Theta != 0 && (!(s.Theta >= 0.5 && s.Theta <= 1)) {
		ps.Add("stepping.theta", ErrOutOfRange, "must be between 0.5 and 1 "+paren(num(s.Theta)))
	}
	if s.FirstStep != 0 {
		bounded(&ps, "stepping.firstStep", s.FirstStep, MinFirstStep, MaxTime, "days")
	}
	if s.DampedSteps > MaxDampedSteps || s.DampedSteps < -MaxDampedSteps {
		ps.Add("stepping.dampedSteps", ErrOutOfRange, fmt.Sprintf("allowed %d to %d (negative: none), got %d", -MaxDampedSteps, MaxDampedSteps, s.DampedSteps))
	}
	if s.Growth != 0 && (!(s.Growth >= 1 && s.Growth <= 10)) {
		ps.Add("stepping.growth", ErrOutOfRange, "must be between 1 and 10 "+paren(num(s.Growth)))
	}
	if s.EndTime != 0 {
		bounded(&ps, "stepping.endTime", s.EndTime, 0, MaxTime, "days")
	}
	if len(ps) == 0 && HasConsolidation(p) {
		steps := estimateSteps(p)
		nodes := elementCount(p)*max(p.Mesh.Order, 1) + 1
		switch {
		case steps > MaxSteps:
			ps.Add("stepping.firstStep", ErrTooLarge, fmt.Sprintf("about %d time steps, the limit is %d; use a larger stepping.firstStep or stepping.growth", steps, MaxSteps))
		case float64(steps)*float64(nodes) > MaxWork:
			ps.Add("stepping.firstStep", ErrTooLarge, fmt.Sprintf("about %d time steps × %d nodes, the limit is %d; use a larger stepping.firstStep or stepping.growth, or a larger mesh.maxSize", steps, nodes, MaxWork))
		case float64(nodes)*float64(len(p.Times)+7)+float64(steps)*float64(7+3*len(p.Piezometers)+drainSeries(p)+layerSeries(p)+checkSeries(p)) > MaxStored:
			ps.Add("times", ErrTooLarge, fmt.Sprintf("the results would hold %d output times × %d nodes and %d time steps, more than the limit of %d numbers; use fewer output times or a larger mesh.maxSize", len(p.Times), nodes, steps, MaxStored))
		}
	}
	return ps.Err()
}

func validBoundary(ps *Problems, at string, b Boundary) {
	if b.Head != nil {
		within(ps, at+".head", *b.Head, MaxHead, "m")
		if !b.Drained {
			ps.Add(at+".head", ErrConflict, "a fixed head needs a drained end")
		}
	}
	within(ps, at+".inflow", b.Inflow, MaxInflow, "m/s")
	if b.Inflow != 0 && b.Drained {
		ps.Add(at+".inflow", ErrConflict, "an inflow needs an undrained end; a drained end has a fixed head")
	}
	if len(b.Excess) > 0 && !b.Drained {
		ps.Add(at+".excess", ErrConflict, "a pressure history needs a drained end")
	}
	if b.Resistance != 0 && bounded(ps, at+".resistance", b.Resistance, MinResistance, MaxResistance, "days") {
		switch {
		case !b.Drained:
			ps.Add(at+".resistance", ErrConflict, "a resistance needs a drained end (it drains through the resistance); an undrained end is sealed")
		case len(b.Excess) > 0:
			ps.Add(at+".excess", ErrConflict, "a pressure history needs a freely drained end; this end drains through a resistance")
		}
	}
	for i, tv := range b.Excess {
		p := fmt.Sprintf("%s.excess[%d]", at, i)
		if upTo(ps, p+".t", tv.T, MaxTime, "days") && i > 0 && tv.T < b.Excess[i-1].T {
			ps.Add(p+".t", ErrNotSorted, fmt.Sprintf("%g follows %g", tv.T, b.Excess[i-1].T))
		}
		within(ps, p+".value", tv.Value, MaxStress, "kPa")
	}
}

// validProfile checks a profile against depth whose values are bounded by
// ±limit (in unit).
func validProfile(ps *Problems, at string, pts []DepthValue, limit float64, unit string) {
	for i, dv := range pts {
		p := IndexPath(at, i)
		if within(ps, p+".z", dv.Z, MaxDepth, "m") && i > 0 && dv.Z <= pts[i-1].Z {
			ps.Add(p+".z", ErrNotSorted, fmt.Sprintf("%g follows %g", dv.Z, pts[i-1].Z))
		}
		within(ps, p+".value", dv.Value, limit, unit)
	}
}

func finite(ps *Problems, at string, v float64) bool {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		ps.Add(at, ErrNotFinite, num(v))
		return false
	}
	return true
}

func positive(ps *Problems, at string, v float64) bool {
	if !finite(ps, at, v) {
		return false
	}
	if v <= 0 {
		ps.Add(at, ErrNotPositive, num(v))
		return false
	}
	return true
}

func nonNegative(ps *Problems, at string, v float64) bool {
	if !finite(ps, at, v) {
		return false
	}
	if v < 0 {
		ps.Add(at, ErrNegative, num(v))
		return false
	}
	return true
}

func paren(s string) string { return "(" + s + ")" }

// Typical ranges (common practice; see the package documentation): values
// outside them are legal but worth a second look.
const (
	typicalKMin  = 1e-13  // m/s
	typicalKMax  = 1.0    // m/s
	typicalCvMin = 0.01   // m²/year, for layers with k < 1e-7 m/s
	typicalCvMax = 1000.0 // m²/year, for layers with k < 1e-7 m/s
)

// oddValues warns about legal values that are physically unusual: a
// permeability outside 1e-13 … 1 m/s, a fine-grained layer's cv outside
// 0.01 … 1000 m²/year, and a layer thinner than the mesh's element size.
func oddValues(p *Project, warn func(path, msg string)) {
	gw := ResolveGammaW(p)
	maxSize := ResolveMesh(p).MaxSize
	for i, l := range p.Layers {
		at := fmt.Sprintf("layers[%d]", i)
		if l.K < typicalKMin || l.K > typicalKMax {
			warn(at+".k", fmt.Sprintf("k = %g m/s is outside the usual range of soils (%g to %g m/s)", l.K, typicalKMin, typicalKMax))
		}
		if l.Mv > 0 && l.K < 1e-7 {
			cv := soil.Cv(l.K, l.Mv, gw) * DaysPerYear
			if cv < typicalCvMin || cv > typicalCvMax {
				warn(at+".mv", fmt.Sprintf("cv = k/(mv γw) = %.3g m²/year is outside the usual range of fine-grained soils (%g to %g m²/year); check k and mv", cv, typicalCvMin, typicalCvMax))
			}
		}
		if l.Thickness < maxSize {
			warn(at+".thickness", fmt.Sprintf("the layer (%.3g m) is thinner than the element size (%.3g m): it gets its own finer elements", l.Thickness, maxSize))
		}
	}
}
