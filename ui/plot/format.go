package plot

import (
	"math"
	"strconv"
	"strings"

	"porelight/solver"
)

// minus is the typographic minus sign used in drawn labels (CSV keeps '-').
const minus = "\u2212"

// coord formats a pixel coordinate with at most one decimal and no trailing
// ".0", e.g. 12.5, 40, -3.2.
func coord(v float64) string {
	var b [24]byte
	return string(appendCoord(b[:0], v))
}

// appendCoord appends coord(v). Tenths below 10¹⁵ are written as an
// integer with the point put in: the same text, some five times quicker
// in the page, where a figure's markup has thousands of coordinates.
func appendCoord(b []byte, v float64) []byte {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return append(b, '0')
	}
	if t := math.Round(v * 10); math.Abs(t) < 1e15 {
		return appendTenths(b, int64(t))
	}
	s := strconv.FormatFloat(math.Round(v*10)/10, 'f', 1, 64)
	return append(b, strings.TrimSuffix(s, ".0")...)
}

// appendTenths appends n/10 with one decimal, without a trailing ".0"
// and without the sign of zero.
func appendTenths(b []byte, n int64) []byte {
	if n < 0 {
		b, n = append(b, '-'), -n
	}
	b = strconv.AppendInt(b, n/10, 10)
	if d := n % 10; d != 0 {
		b = append(b, '.', byte('0'+d))
	}
	return b
}

// fixed formats v with the given number of decimals and a typographic
// minus sign; -0 prints as 0.
func fixed(v float64, decimals int) string {
	if decimals < 0 {
		decimals = 0
	}
	s := strconv.FormatFloat(v, 'f', decimals, 64)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	return strings.Replace(s, "-", minus, 1)
}

// sig formats v to about n significant figures for read-outs and labels:
// fixed notation between 1e-4 and 1e6, trailing zeros after the point
// trimmed, typographic minus. NaN and ±Inf print as "–".
//
// Special cases are:
//
//	sig(0, n) = "0"
//	sig(NaN, n) = sig(±Inf, n) = "–"
func sig(v float64, n int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "–"
	}
	if v == 0 {
		return "0"
	}
	if n < 1 {
		n = 1
	}
	a := math.Abs(v)
	if a >= 1e6 || a < 1e-4 {
		s := strconv.FormatFloat(v, 'e', n-1, 64)
		mant, exp, _ := strings.Cut(s, "e")
		if strings.Contains(mant, ".") {
			mant = strings.TrimRight(strings.TrimRight(mant, "0"), ".")
		}
		e, _ := strconv.Atoi(exp)
		return strings.Replace(mant, "-", minus, 1) + "×10" + superscript(e)
	}
	d := n - 1 - int(math.Floor(math.Log10(a)))
	if d < 0 {
		d = 0
	}
	s := fixed(v, d)
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	return s
}

// superscript writes an integer with Unicode superscript digits, e.g. 10⁻³.
func superscript(e int) string {
	const digits = "⁰¹²³⁴⁵⁶⁷⁸⁹"
	sup := []rune(digits)
	var b strings.Builder
	if e < 0 {
		b.WriteString("⁻")
		e = -e
	}
	for _, r := range strconv.Itoa(e) {
		b.WriteRune(sup[r-'0'])
	}
	return b.String()
}

// timeLabel formats a time given in days: days below one year ("30 d",
// "0.5 d"), years from one year on ("1 yr", "2.74 yr").
func timeLabel(days float64) string {
	if !isFinite(days) {
		return "–"
	}
	if math.Abs(days) >= solver.DaysPerYear {
		return sig(days/solver.DaysPerYear, 3) + " yr"
	}
	return sig(days, 3) + " d"
}

// dayLabel formats an output time the way it was typed: in days (the
// unit of Project.Times), as the shortest decimal that reads back the
// same, "3650 d" rather than "9.99 yr".
func dayLabel(days float64) string {
	if !isFinite(days) {
		return "–"
	}
	return strconv.FormatFloat(days, 'f', -1, 64) + " d"
}

// csvNum formats a value for CSV: up to 10 significant figures, ASCII,
// shortest form; NaN and ±Inf give an empty cell.
func csvNum(v float64) string {
	if !isFinite(v) {
		return ""
	}
	return strconv.FormatFloat(v, 'g', 10, 64)
}

func isFinite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
