package form

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"porelight/ui/units"
)

// Numbers as typed and as shown.

// ParseNumber reads one number as typed: a decimal comma is accepted, as
// is an exponent ("1.5e-9") and a typographic minus. With whole, the
// number must be an integer. problem is "" when x was read, else what to
// show beside the input.
func ParseNumber(s string, whole bool) (x float64, problem string) {
	s = strings.ReplaceAll(strings.TrimSpace(s), ",", ".")
	s = strings.ReplaceAll(s, "−", "-") // a typographic minus
	x, err := strconv.ParseFloat(s, 64)
	if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
		return 0, "not a number"
	}
	if whole && x != math.Trunc(x) {
		return 0, "must be a whole number"
	}
	return x, ""
}

// parseList reads numbers separated by commas, semicolons or spaces. With
// a comma as separator, decimals take a point.
func parseList(s string) ([]float64, string) {
	fields := strings.FieldsFunc(s, func(r rune) bool { return r == ',' || r == ';' || r == ' ' || r == '\t' || r == '\n' })
	xs := make([]float64, 0, len(fields))
	for i, w := range fields {
		w = strings.ReplaceAll(w, "−", "-")
		x, err := strconv.ParseFloat(w, 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return nil, fmt.Sprintf("value %d (%q) is not a number", i+1, w)
		}
		xs = append(xs, x)
	}
	if len(xs) == 0 {
		return nil, ""
	}
	return xs, ""
}

// FormatSig writes x rounded to n significant figures, as FormatNumber
// writes: for values the page computes and types into a field (a
// back-fitted k), whose further digits only look precise.
// FormatSig(1.54762679591e-9, 3) is "1.55e-9".
func FormatSig(x float64, n int) string { return FormatNumber(RoundSig(x, n)) }

// RoundSig is x rounded to n significant figures (units.RoundSig).
func RoundSig(x float64, n int) float64 { return units.RoundSig(x, n) }

// FormatNumber writes x briefly and exactly enough to read back the same:
// 1.5e-09 → "1.5e-9", 0.30000000000000004 → "0.3".
func FormatNumber(x float64) string {
	s := strconv.FormatFloat(x, 'g', 12, 64)
	if mant, exp, ok := strings.Cut(s, "e"); ok {
		sign := ""
		if exp[0] == '-' || exp[0] == '+' {
			if exp[0] == '-' {
				sign = "-"
			}
			exp = exp[1:]
		}
		exp = strings.TrimLeft(exp, "0")
		return mant + "e" + sign + exp
	}
	return s
}

func formatList(xs []float64) string {
	parts := make([]string, len(xs))
	for i, x := range xs {
		parts[i] = FormatNumber(x)
	}
	return strings.Join(parts, ", ")
}
