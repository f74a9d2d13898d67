package form

import (
	"strconv"
	"strings"

	"porelight/solver"
)

// Defaults. An input whose empty value (zero in the file) means "the
// solver's default" shows empty, with that default as its placeholder.
// Every number here comes from package solver's exported defaults, so
// the page cannot say one value while the solver uses another.

// minutesPerDay converts the first time step, which the file and the
// input hold in days, to the minutes its placeholder names.
const minutesPerDay = 24 * 60

// numberDefaults are the defaults that read as one number of the input's
// unit, in the file's unit (scaleOf converts).
var numberDefaults = map[string]float64{
	"gammaW":               solver.DefaultGammaW,
	"targetDegree":         solver.DefaultTargetDegree,
	"designLife":           solver.DefaultDesignLife,
	"mesh.order":           solver.DefaultOrder,
	"mesh.minPerLayer":     solver.DefaultMinPerLayer,
	"stepping.theta":       solver.DefaultTheta,
	"stepping.dampedSteps": solver.DefaultDampedSteps,
	"stepping.growth":      solver.DefaultGrowth,
	"drains.smearRatio":    solver.DefaultSmearRatio,
	"drains.smearK":        solver.DefaultSmearK,
	"drains.design.degree": solver.DefaultDesignDegree,
	"uncertainty.runs":     solver.DefaultRuns,
}

// Placeholder is the text an empty input at path shows: the default its
// empty value means, or "hydrostatic" for a boundary head left out. ok is
// false for an input with no placeholder.
func Placeholder(path string) (text string, ok bool) {
	if strings.HasPrefix(path, "variants[") && !IsText(path) {
		return "as given", true // an option's change left empty keeps the project's value
	}
	if h, ok := defaultHint(path); ok {
		return h, true
	}
	if isPointerLeaf(path) {
		return "hydrostatic", true
	}
	return "", false
}

// zeroIsDefault reports whether a zero at path means "use the default",
// so the input shows empty (with the default as its placeholder).
func zeroIsDefault(path string) bool {
	_, ok := defaultHint(path)
	return ok
}

// defaultHint is the placeholder of an input whose empty value means a
// default, and whether there is one.
func defaultHint(path string) (string, bool) {
	if v, ok := numberDefaults[path]; ok {
		return FormatNumber(v * scaleOf(path)), true
	}
	switch path {
	case "mesh.maxSize":
		return "H/" + strconv.Itoa(solver.DefaultDivisions), true
	case "stepping.firstStep":
		return FormatNumber(solver.DefaultFirstStep*minutesPerDay) + " min", true
	case "stepping.endTime":
		return "auto", true // solver.EndTime: the last load change plus solver.DefaultSettleTime
	case "drains.qw":
		return "∞ (none)", true
	case "drains.top":
		return "0", true
	case "drains.depth":
		return "base", true
	case "uncertainty.date":
		return "end of loading", true // solver.ResolveUncertaintyDate
	case "alignment.date":
		return "design life", true // solver.ResolveAlignmentDate
	case "alignment.limit":
		return "not checked", true
	}
	leaf := path[strings.LastIndexByte(path, '.')+1:]
	switch {
	case strings.HasPrefix(path, "layers["):
		switch leaf {
		case "gamma":
			return "= γsat", true
		case "mv":
			return "from e–log", true
		case "calpha", "calphaCc":
			return "none", true
		case "sigmaP", "ocr", "pop":
			return "–", true
		case "mvUnload":
			return "= mv", true
		case "calphaReduced":
			return "= Cα", true
		case "ck":
			return "k fixed", true
		case "ch":
			return "kh/kv·cv", true
		case "khKv":
			return FormatNumber(solver.DefaultKhKv), true
		}
	case leaf == "inflow":
		return "0 (sealed)", true
	case strings.HasPrefix(path, "uncertainty.layers["):
		if leaf == "kMv" {
			return "0", true
		}
		return "0 (fixed)", true
	}
	return "", false
}

// scaleOf is the factor from the file's unit to the unit an input shows.
func scaleOf(path string) float64 {
	switch path {
	case "targetDegree":
		return 100 // fraction → %
	case "designLife":
		return 1 / solver.DaysPerYear // day → year
	case "drains.design.degree":
		return 100 // fraction → %
	case "drains.qw":
		return solver.DaysPerYear * 86400 // m³/s → m³/year
	}
	if strings.HasPrefix(path, "variants[") && strings.HasSuffix(path, ".ch") {
		return solver.DaysPerYear // m²/day → m²/year, as the drains table
	}
	if strings.HasPrefix(path, "layers[") && strings.HasSuffix(path, ".ch") {
		return solver.DaysPerYear // m²/day → m²/year
	}
	if strings.HasPrefix(path, "uncertainty.layers[") && !strings.HasSuffix(path, ".kMv") {
		return 100 // coefficient of variation: fraction → %
	}
	if strings.HasPrefix(path, "monitoring.plates[") && strings.HasSuffix(path, ".value") {
		return 1000 // settlement readings: m → mm
	}
	return 1
}
