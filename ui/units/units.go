// Package units converts between the units the page shows and the SI
// units the project file and the solver use.
//
// The file always stays SI. The page shows one system at a time, chosen
// by the user: SI (m, mm, kPa, kN/m³, m/s, 1/kPa, m²/yr) or US customary
// (ft, in, psf, pcf, ft/day, ft²/kip, ft²/yr). A Quantity names what a
// number measures; its SI unit here is the one the page shows in SI (a
// settlement in mm, a cv in m²/yr), not always the file's (the form and
// the plots convert between the file's unit and that one first).
//
// Every US factor below follows from two exact definitions: the
// international foot, 0.3048 m, and the pound-force, 0.45359237 kg ×
// 9.80665 m/s² = 4.4482216152605 N (NIST Special Publication 811,
// 2008, appendix B). The tests check the derived factors against the
// figures tabulated there.
package units

import (
	"math"
	"strconv"
)

// System is a set of display units.
type System uint8

const (
	SI System = iota // metres, kilopascals, days
	US               // US customary: feet, pounds-force, days
)

// String is the system's key in links and the browser's storage: "si"
// or "us".
func (s System) String() string {
	if s == US {
		return "us"
	}
	return "si"
}

// Name is the system as the page's choice names it.
func (s System) Name() string {
	if s == US {
		return "US customary (ft, psf, pcf)"
	}
	return "SI (m, kPa, kN/m³)"
}

// Parse reads a system's key; ok is false for anything else.
func Parse(key string) (s System, ok bool) {
	switch key {
	case "si":
		return SI, true
	case "us":
		return US, true
	}
	return SI, false
}

// Quantity is what a number measures.
type Quantity uint8

const (
	None            Quantity = iota // a ratio, an index, a count, a time
	Length                          // depth, thickness, head: m | ft
	Settlement                      // a settlement or heave: mm | in
	Stress                          // pressure, stress, strength: kPa | psf
	UnitWeight                      // kN/m³ | pcf
	Permeability                    // permeability, a Darcy velocity: m/s | ft/day
	Compressibility                 // mv: 1/kPa | ft²/kip
	Consolidation                   // cv, ch: m²/yr | ft²/yr
	Discharge                       // a drain's discharge capacity: m³/yr | ft³/yr
	StressGradient                  // strength gain with depth: kPa/m | psf/ft
	quantities
)

// Exact definitions (NIST SP 811, appendix B).
const (
	foot        = 0.3048          // m
	poundForce  = 4.4482216152605 // N
	inch        = 25.4            // mm
	secondsADay = 86400
)

// Unit is a display unit: its symbol, and the SI display unit's value of
// one of it (ft: 0.3048, in m).
type Unit struct {
	Symbol string
	ToSI   float64
}

var table = [quantities][2]Unit{
	None:            {{"", 1}, {"", 1}},
	Length:          {{"m", 1}, {"ft", foot}},
	Settlement:      {{"mm", 1}, {"in", inch}},
	Stress:          {{"kPa", 1}, {"psf", poundForce / (foot * foot) / 1000}},
	UnitWeight:      {{"kN/m³", 1}, {"pcf", poundForce / (foot * foot * foot) / 1000}},
	Permeability:    {{"m/s", 1}, {"ft/day", foot / secondsADay}},
	Compressibility: {{"1/kPa", 1}, {"ft²/kip", (foot * foot) / poundForce}},
	Consolidation:   {{"m²/yr", 1}, {"ft²/yr", foot * foot}},
	Discharge:       {{"m³/yr", 1}, {"ft³/yr", foot * foot * foot}},
	StressGradient:  {{"kPa/m", 1}, {"psf/ft", poundForce / (foot * foot * foot) / 1000}},
}

// Of is the unit s shows q in.
func (s System) Of(q Quantity) Unit {
	if q >= quantities || s > US {
		return table[None][0]
	}
	return table[q][s]
}

// Symbol is the symbol of the unit s shows q in ("" for None).
func (s System) Symbol(q Quantity) string { return s.Of(q).Symbol }

// Show converts x from q's SI display unit to the unit s shows.
func (s System) Show(q Quantity, x float64) float64 {
	u := s.Of(q)
	if u.ToSI == 1 {
		return x
	}
	return x / u.ToSI
}

// Take converts x from the unit s shows q in back to q's SI display unit.
// A converted value is rounded to 12 significant figures, so that 10 ft
// is stored as 3.048 m, not 3.0480000000000005: the digits beyond carry
// no meaning and would only clutter the file.
func (s System) Take(q Quantity, x float64) float64 {
	u := s.Of(q)
	if u.ToSI == 1 {
		return x
	}
	return RoundSig(x*u.ToSI, 12)
}

// RoundSig is x rounded to n significant figures (x itself when n < 1 or
// x is 0, NaN or infinite).
func RoundSig(x float64, n int) float64 {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) || n < 1 {
		return x
	}
	r, err := strconv.ParseFloat(strconv.FormatFloat(x, 'e', n-1, 64), 64)
	if err != nil {
		return x
	}
	return r
}
