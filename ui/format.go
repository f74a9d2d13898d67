package ui

import (
	"math"
	"strconv"
	"strings"

	"porelight/solver"
	"porelight/ui/units"
)

// Number formats for the page. Values in the solver's units come in; the
// functions say what unit goes out. Non-finite values print as "–".

// sig writes x with n significant digits, in plain notation between 1e-4
// and 1e6 and with an exponent outside.
func sig(x float64, n int) string {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return "–"
	}
	if x == 0 {
		return "0"
	}
	if a := math.Abs(x); a >= 1e-4 && a < 1e6 {
		// Round to n significant digits, then print without trailing zeros.
		d := n - 1 - int(math.Floor(math.Log10(a)))
		s := strconv.FormatFloat(x, 'f', max(d, 0), 64)
		if strings.Contains(s, ".") {
			s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
		}
		return s
	}
	return sci(x, n)
}

var superscript = strings.NewReplacer("-", "⁻", "0", "⁰", "1", "¹", "2", "²", "3", "³", "4", "⁴", "5", "⁵", "6", "⁶", "7", "⁷", "8", "⁸", "9", "⁹")

// sci writes x as "2.1 × 10⁻⁹" with n significant digits.
func sci(x float64, n int) string {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return "–"
	}
	if x == 0 {
		return "0"
	}
	s := strconv.FormatFloat(x, 'e', n-1, 64)
	mant, exp, _ := strings.Cut(s, "e")
	e, _ := strconv.Atoi(exp)
	if e == 0 {
		return mant
	}
	return mant + " × 10" + superscript.Replace(strconv.Itoa(e))
}

// mm writes a settlement in metres as millimetres (whole mm from 10 mm
// up, one decimal below), or as inches in US units (one decimal from
// 1 in up, two below).
func mm(m float64) string {
	v := m * 1000
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "–"
	}
	if shown == units.US {
		v = shown.Show(units.Settlement, v)
		if math.Abs(v) >= 1 {
			return strconv.FormatFloat(v, 'f', 1, 64) + " in"
		}
		return strconv.FormatFloat(v, 'f', 2, 64) + " in"
	}
	if math.Abs(v) >= 10 {
		return strconv.FormatFloat(math.Round(v), 'f', 0, 64) + " mm"
	}
	return strconv.FormatFloat(v, 'f', 1, 64) + " mm"
}

// duration writes a time in days, with years beside it from a year up.
func duration(d float64) string {
	if math.IsNaN(d) || math.IsInf(d, 0) {
		return "–"
	}
	s := sig(d, 3) + " days"
	if d >= solver.DaysPerYear {
		s += " (" + sig(d/solver.DaysPerYear, 3) + " yr)"
	}
	return s
}

// exact writes x with full precision for a data attribute, so tests and
// scripts can read the value behind a rounded figure.
func exact(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// shown is the unit system the page shows (Root.setUnits sets it, with
// the form's and the plots'). Every result below is written in it; the
// solver's values come in SI.
var shown units.System

// sym is the symbol of the unit q is shown in.
func sym(q units.Quantity) string { return shown.Symbol(q) }

// conv converts x from q's SI display unit (m, mm, kPa…) to the unit
// shown.
func conv(q units.Quantity, x float64) float64 { return shown.Show(q, x) }

// qty writes x (in q's SI display unit) in the unit shown, to n
// significant figures, with its symbol: qty(units.Length, 3.048, 3) is
// "3.05 m" in SI and "10 ft" in US units.
func qty(q units.Quantity, x float64, n int) string {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return "–"
	}
	return sig(shown.Show(q, x), n) + " " + shown.Symbol(q)
}
