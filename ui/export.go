package ui

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"strings"

	"porelight/solver"
	"porelight/ui/units"
)

// CSV exports of the results. Numbers are written in full precision with
// a point as decimal separator; the first row names each column and its
// unit.

func writeCSV(rows [][]string) ([]byte, error) {
	var b bytes.Buffer
	w := csv.NewWriter(&b)
	if err := w.WriteAll(rows); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

func cell(x float64) string { return exact(x) }

func optCell(v *float64) string {
	if v == nil {
		return ""
	}
	return exact(*v)
}

// Exports write the units shown: in SI the solver's own (m, kPa,
// m2/day), in US units ft, psf, in for settlements and ft2/yr for cv.
// Symbols are plain text for spreadsheets (m2, not m²).
var plainSymbols = strings.NewReplacer("²", "2", "³", "3")

// csvUnit is the header unit of a column of q; si is the column's SI unit,
// which may differ from q's SI display unit (a settlement in m).
func csvUnit(q units.Quantity, si string) string {
	if shown == units.SI {
		return si
	}
	return plainSymbols.Replace(sym(q))
}

// csvQ writes x, in q's SI display unit, in the unit shown.
func csvQ(q units.Quantity, x float64) string { return exact(conv(q, x)) }

// csvSettle writes a settlement in m: m in SI, in in US units.
func csvSettle(m float64) string {
	if shown == units.SI {
		return exact(m)
	}
	return exact(conv(units.Settlement, 1000*m))
}

func optSettle(v *float64) string {
	if v == nil {
		return ""
	}
	return csvSettle(*v)
}

// csvCv writes a cv in m2/day: as it is in SI, in ft2/yr in US units.
func csvCv(v float64) string {
	if shown == units.SI {
		return exact(v)
	}
	return exact(conv(units.Consolidation, v*solver.DaysPerYear))
}

// layersCSV is the per-layer table: steady figures and settlement.
func layersCSV(r *solver.Result) ([]byte, error) {
	m, s := csvUnit(units.Length, "m"), csvUnit(units.Settlement, "m")
	rows := [][]string{{"layer", "top (" + m + ")", "base (" + m + ")", "gradient (-)", "upward", "critical gradient (-)", "heave factor (-)",
		"mv (" + csvUnit(units.Compressibility, "1/kPa") + ")", "cv (" + csvUnit(units.Consolidation, "m2/day") + ")",
		"settlement from mv (" + s + ")", "settlement e-log (" + s + ")", "settlement of the model solved (" + s + ")", "end of primary (day)", "secondary (" + s + ")"}}
	for i, l := range r.Steady.Layers {
		row := []string{l.Name, csvQ(units.Length, l.Top), csvQ(units.Length, l.Bottom), cell(l.Gradient), fmt.Sprint(l.Upward), cell(l.CriticalGradient), optCell(l.HeaveFactor)}
		if i < len(r.Summary.Layers) {
			s := r.Summary.Layers[i]
			row = append(row, csvQ(units.Compressibility, s.Mv), csvCv(s.Cv), csvSettle(s.SettlementLinear), optSettle(s.SettlementElog), csvSettle(s.Settlement), optCell(s.SecondaryStart), optSettle(s.Secondary))
		} else {
			cv := ""
			if l.Cv != nil {
				cv = csvCv(*l.Cv)
			}
			row = append(row, "", cv, "", "", "", "", "")
		}
		rows = append(rows, row)
	}
	return writeCSV(rows)
}

// seriesCSV is the history at every time step.
func seriesCSV(r *solver.Result) ([]byte, error) {
	if r.Consolidation == nil {
		return nil, fmt.Errorf("there is no consolidation: the project has no load")
	}
	s := r.Consolidation.Series
	kpa, set := csvUnit(units.Stress, "kPa"), csvUnit(units.Settlement, "m")
	head := []string{"time (day)", "load (" + kpa + ")", "Us (-)", "Up (-)", "settlement from mv (" + set + ")", "settlement e-log (" + set + ")"}
	for _, p := range s.Piezometers {
		head = append(head, fmt.Sprintf("pore pressure at %s %s (%s)", csvQ(units.Length, p.Depth), csvUnit(units.Length, "m"), kpa))
	}
	rows := [][]string{head}
	stress := func(xs []float64, i int) string {
		if i < len(xs) {
			return csvQ(units.Stress, xs[i])
		}
		return ""
	}
	settle := func(xs []float64, i int) string {
		if i < len(xs) {
			return csvSettle(xs[i])
		}
		return ""
	}
	for i, t := range s.Time {
		row := []string{cell(t), stress(s.Load, i), cellAt(s.Us, i), cellAt(s.Up, i), settle(s.Settlement, i), settle(s.SettlementElog, i)}
		for _, p := range s.Piezometers {
			row = append(row, stress(p.Pore, i))
		}
		rows = append(rows, row)
	}
	return writeCSV(rows)
}

func at(xs []float64, i int) float64 {
	if i < len(xs) {
		return xs[i]
	}
	return 0
}

func cellAt(xs []float64, i int) string {
	if i < len(xs) {
		return exact(xs[i])
	}
	return ""
}
