package form

import (
	"porelight/ui/units"
)

// Display units. The draft and the file stay SI; an input shows its
// value in the unit system the user chose, and what is typed into it is
// read in that system (units.System.Take rounds a converted value to 12
// significant figures).

// quantities maps each input that measures something to what it
// measures (paths as pageFields writes them); an input not listed is a
// ratio, an index, a count or a time, and shows the same in every system.
var quantities = map[string]units.Quantity{
	"gammaW":                                      units.UnitWeight,
	"waterTable":                                  units.Length,
	"piezometers":                                 units.Length,
	"layers[#].thickness":                         units.Length,
	"layers[#].gammaSat":                          units.UnitWeight,
	"layers[#].gamma":                             units.UnitWeight,
	"layers[#].k":                                 units.Permeability,
	"layers[#].cv":                                units.Consolidation,
	"layers[#].mv":                                units.Compressibility,
	"layers[#].mvUnload":                          units.Compressibility,
	"layers[#].ecurve.sigmaP":                     units.Stress,
	"layers[#].ecurve.pop":                        units.Stress,
	"layers[#].ecurve.sigmaPProfile[#].z":         units.Length,
	"layers[#].ecurve.sigmaPProfile[#].value":     units.Stress,
	"layers[#].outlet.head":                       units.Length,
	"layers[#].ch":                                units.Consolidation,
	"top.head":                                    units.Length,
	"bottom.head":                                 units.Length,
	"top.inflow":                                  units.Permeability,
	"bottom.inflow":                               units.Permeability,
	"top.excess[#].value":                         units.Stress,
	"bottom.excess[#].value":                      units.Stress,
	"loads[#].q":                                  units.Stress,
	"loads[#].fill.thickness":                     units.Length,
	"loads[#].fill.gamma":                         units.UnitWeight,
	"loads[#].fill.gammaSat":                      units.UnitWeight,
	"loads[#].area.width":                         units.Length,
	"loads[#].area.length":                        units.Length,
	"loads[#].area.radius":                        units.Length,
	"loads[#].area.x":                             units.Length,
	"loads[#].area.y":                             units.Length,
	"loads[#].profile[#].z":                       units.Length,
	"loads[#].dig.depth":                          units.Length,
	"loads[#].dig.waterLevel":                     units.Length,
	"loads[#].lower.waterTable":                   units.Length,
	"initialExcess[#].z":                          units.Length,
	"initialExcess[#].value":                      units.Stress,
	"mesh.maxSize":                                units.Length,
	"drains.spacing":                              units.Length,
	"drains.diameter":                             units.Length,
	"drains.width":                                units.Length,
	"drains.thickness":                            units.Length,
	"drains.qw":                                   units.Discharge,
	"drains.top":                                  units.Length,
	"drains.depth":                                units.Length,
	"variants[#].drainSpacing":                    units.Length,
	"variants[#].loads[#].q":                      units.Stress,
	"variants[#].loads[#].fillThickness":          units.Length,
	"variants[#].layers[#].k":                     units.Permeability,
	"variants[#].layers[#].mv":                    units.Compressibility,
	"variants[#].layers[#].ch":                    units.Consolidation,
	"variants[#].layers[#].thickness":             units.Length,
	"alignment.sections[#].chainage":              units.Length,
	"monitoring.plates[#].readings[#].value":      units.Settlement,
	"monitoring.piezometers[#].depth":             units.Length,
	"monitoring.piezometers[#].readings[#].value": units.Stress,
}

// QuantityOf is what the input at path measures (units.None for a
// ratio, a count, a time, text, or a path no input shows).
func QuantityOf(path string) units.Quantity { return quantities[indexless(path)] }

// Units is the unit system the inputs show.
func (f *Form) Units() units.System { return f.sys }

// SetUnits makes the inputs show s. The draft is unchanged. Text typed
// that reads as a value is shown again in the new units; text that does
// not read as one is kept as typed, with its problem.
func (f *Form) SetUnits(s units.System) {
	if s == f.sys {
		return
	}
	f.sys = s
	for path := range f.raw {
		if _, bad := f.bad[path]; bad {
			continue
		}
		if QuantityOf(path) != units.None {
			delete(f.raw, path)
		}
	}
}

// UnitOf is the symbol of the unit the input at path shows: given is the
// SI symbol the page writes beside it, returned as it is where the input
// measures nothing the systems differ in.
func (f *Form) UnitOf(path, given string) string {
	if q := QuantityOf(path); q != units.None && f.sys != units.SI {
		return f.sys.Symbol(q)
	}
	return given
}

// shownDigits is how many significant figures an input shows of a value
// converted to US units: 1.5 m shows as 4.92126 ft, not 4.92125984252.
// The draft keeps the SI value itself until the input is typed into.
const shownDigits = 6

// shownText is the text of the input at path for v, in the file's unit.
func (f *Form) shownText(path string, v float64) string {
	x := f.toShown(path, v)
	if f.sys.Of(QuantityOf(path)).ToSI != 1 {
		return FormatSig(x, shownDigits)
	}
	return FormatNumber(x)
}

// toShown converts a value in the file's unit to what the input at path
// shows; fromShown converts back.
func (f *Form) toShown(path string, v float64) float64 {
	return f.sys.Show(QuantityOf(path), v*scaleOf(path))
}

func (f *Form) fromShown(path string, x float64) float64 {
	return f.sys.Take(QuantityOf(path), x) / scaleOf(path)
}

// Placeholder is what the empty input at path shows (see the function
// Placeholder), with a default that has a unit in the units shown.
func (f *Form) Placeholder(path string) (text string, ok bool) {
	if v, ok := numberDefaults[path]; ok && QuantityOf(path) != units.None {
		return FormatSig(f.toShown(path, v), 4), true
	}
	return Placeholder(path)
}

// Put types v (in the file's unit) into the input at path, as the text
// the input would show: in the units shown, rounded to n significant
// figures there (for n = 0: all of them in SI, 6 where the value was
// converted, as conversion leaves digits that mean nothing). It is how the page fills in a
// value it worked out (a fitted k, a fill thickness found), so that the
// number reads as the user would type it. Zero clears an input whose
// empty value means a default.
func (f *Form) Put(path string, v float64, n int) bool {
	if v == 0 && zeroIsDefault(path) {
		return f.Edit(path, "")
	}
	x := f.toShown(path, v)
	if n == 0 && f.sys.Of(QuantityOf(path)).ToSI != 1 {
		n = shownDigits
	}
	if n > 0 {
		return f.Edit(path, FormatSig(x, n))
	}
	return f.Edit(path, FormatNumber(x))
}

// SetValue makes v (in the file's unit) the value at path exactly, with
// no text typed: how the page puts back a value it kept (Revert), which
// text in other units could not carry to the last digit.
func (f *Form) SetValue(path string, v float64) error {
	var err error
	if v == 0 && zeroIsDefault(path) {
		err = clearNumber(&f.draft, path)
	} else {
		err = setNumber(&f.draft, path, v)
	}
	if err != nil {
		return err
	}
	delete(f.raw, path)
	delete(f.bad, path)
	if i, ok := layerK(path); ok {
		delete(f.raw, CvPath(i))
		delete(f.bad, CvPath(i))
	}
	f.check()
	f.typed = path
	return nil
}
