package ui

import (
	"bytes"
	"encoding/csv"
	"fmt"

	"porelight/solver"
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

// layersCSV is the per-layer table: steady figures and settlement.
func layersCSV(r *solver.Result) ([]byte, error) {
	rows := [][]string{{"layer", "top (m)", "base (m)", "gradient (-)", "upward", "critical gradient (-)", "heave factor (-)",
		"mv (1/kPa)", "cv (m2/day)", "settlement from mv (m)", "settlement e-log (m)", "settlement of the model solved (m)", "end of primary (day)", "secondary (m)"}}
	for i, l := range r.Steady.Layers {
		row := []string{l.Name, cell(l.Top), cell(l.Bottom), cell(l.Gradient), fmt.Sprint(l.Upward), cell(l.CriticalGradient), optCell(l.HeaveFactor)}
		if i < len(r.Summary.Layers) {
			s := r.Summary.Layers[i]
			row = append(row, cell(s.Mv), cell(s.Cv), cell(s.SettlementLinear), optCell(s.SettlementElog), cell(s.Settlement), optCell(s.SecondaryStart), optCell(s.Secondary))
		} else {
			row = append(row, "", optCell(l.Cv), "", "", "", "", "")
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
	head := []string{"time (day)", "load (kPa)", "Us (-)", "Up (-)", "settlement from mv (m)", "settlement e-log (m)"}
	for _, p := range s.Piezometers {
		head = append(head, fmt.Sprintf("pore pressure at %s m (kPa)", exact(p.Depth)))
	}
	rows := [][]string{head}
	for i, t := range s.Time {
		row := []string{cell(t), cellAt(s.Load, i), cellAt(s.Us, i), cellAt(s.Up, i), cellAt(s.Settlement, i), cellAt(s.SettlementElog, i)}
		for _, p := range s.Piezometers {
			row = append(row, cellAt(p.Pore, i))
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
