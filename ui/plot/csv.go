package plot

import (
	"encoding/csv"
	"strings"

	"porelight/solver"
)

// CSV exports: comma-separated, one header row naming every column with
// its unit, numbers with up to 10 significant figures, an empty cell where
// a value is missing or not finite. A result without the data gives just
// the header row. Values and units are those shown (SetUnits): the
// results file itself stays SI.

func writeCSV(header []string, rows [][]string) string {
	var b strings.Builder
	w := csv.NewWriter(&b)
	_ = w.Write(header) // a strings.Builder never fails
	_ = w.WriteAll(rows)
	return b.String()
}

// at returns csvNum(vs[i]), or "" when i is out of range.
func at(vs []float64, i int) string {
	if i < 0 || i >= len(vs) {
		return ""
	}
	return csvNum(vs[i])
}

// IsochronesCSV returns the isochrones as CSV: one row per node, depth
// first, then the excess pore pressure at each output time.
func IsochronesCSV(r *solver.Result) string {
	header := []string{"depth (" + uLength.sym() + ")"}
	if r == nil || r.Consolidation == nil {
		return writeCSV(header, nil)
	}
	c := r.Consolidation
	excess := make([][]float64, len(c.Isochrones))
	for k, iso := range c.Isochrones {
		header = append(header, "excess pore pressure at t = "+csvNum(iso.Time)+" day ("+uStress.sym()+")")
		excess[k] = uStress.all(iso.Excess)
	}
	rows := make([][]string, len(c.Depth))
	for i, z := range c.Depth {
		row := []string{csvNum(uLength.of(z))}
		for _, e := range excess {
			row = append(row, at(e, i))
		}
		rows[i] = row
	}
	return writeCSV(header, rows)
}

// seriesCSV writes the time column of s and the given columns.
func seriesCSV(r *solver.Result, names []string, cols func(s *solver.Series) [][]float64) string {
	header := append([]string{"time (day)"}, names...)
	if r == nil || r.Consolidation == nil {
		return writeCSV(header, nil)
	}
	s := &r.Consolidation.Series
	cs := cols(s)
	rows := make([][]string, len(s.Time))
	for i, t := range s.Time {
		row := []string{csvNum(t)}
		for _, c := range cs {
			row = append(row, at(c, i))
		}
		rows[i] = row
	}
	return writeCSV(header, rows)
}

// DegreeCSV returns the average degrees of consolidation as CSV, in %,
// with Uv and Uh when the result has drains.
func DegreeCSV(r *solver.Result) string {
	if r != nil && r.Drains != nil && r.Consolidation != nil && len(r.Drains.Uv) == len(r.Consolidation.Series.Time) {
		d := r.Drains
		return seriesCSV(r, []string{"Us by settlement (%)", "Up by pore pressure (%)", "Uv vertical flow only (%)", "Uh radial flow only (%)"},
			func(s *solver.Series) [][]float64 {
				return [][]float64{scaled(s.Us, 100), scaled(s.Up, 100), scaled(d.Uv, 100), scaled(d.Uh, 100)}
			})
	}
	return seriesCSV(r, []string{"Us by settlement (%)", "Up by pore pressure (%)"},
		func(s *solver.Series) [][]float64 { return [][]float64{scaled(s.Us, 100), scaled(s.Up, 100)} })
}

// SettlementCSV returns the settlement histories as CSV: from mv and, when
// the result has it, from the e–log σ′ curves.
func SettlementCSV(r *solver.Result) string {
	u := " (" + uSettle.sym() + ")"
	names := []string{"settlement from mv" + u}
	nonlinear := r != nil && r.Summary.Model == solver.ModelNonlinear
	elog := !nonlinear && r != nil && r.Consolidation != nil && len(r.Consolidation.Series.SettlementElog) > 0
	secondary := r != nil && r.Consolidation != nil && len(r.Consolidation.Series.Secondary) > 0
	if nonlinear {
		names[0] = "settlement, non-linear model" + u
	}
	if elog {
		names = append(names, "settlement from e-log curves"+u)
	}
	if secondary {
		names = append(names, "secondary settlement"+u)
	}
	return seriesCSV(r, names, func(s *solver.Series) [][]float64 {
		cols := [][]float64{uSettle.all(s.Settlement)}
		if elog {
			cols = append(cols, uSettle.all(s.SettlementElog))
		}
		if secondary {
			cols = append(cols, uSettle.all(s.Secondary))
		}
		return cols
	})
}

// PiezometersCSV returns the piezometer histories as CSV: for each
// piezometer the pore pressure it reads and the excess over the initial
// steady state.
func PiezometersCSV(r *solver.Result) string {
	var names []string
	var pz []solver.Piezometer
	if r != nil && r.Consolidation != nil {
		pz = r.Consolidation.Series.Piezometers
	}
	zu, su := uLength.tail(), " ("+uStress.sym()+")"
	for _, p := range pz {
		z := csvNum(uLength.of(p.Depth))
		names = append(names, "pore pressure at z = "+z+zu+su, "excess pore pressure at z = "+z+zu+su)
	}
	return seriesCSV(r, names, func(s *solver.Series) [][]float64 {
		var cs [][]float64
		for _, p := range s.Piezometers {
			cs = append(cs, uStress.all(p.Pore), uStress.all(p.Excess))
		}
		return cs
	})
}

// SteadyCSV returns the steady state profiles as CSV, one row per node.
func SteadyCSV(r *solver.Result) string {
	m, kPa := " ("+uLength.sym()+")", " ("+uStress.sym()+")"
	header := []string{"depth" + m, "total head" + m, "pore pressure" + kPa, "total vertical stress" + kPa, "effective vertical stress" + kPa}
	if r == nil {
		return writeCSV(header, nil)
	}
	s := &r.Steady
	head, pore, total, eff := uLength.all(s.Head), uStress.all(s.Pore), uStress.all(s.Total), uStress.all(s.Effective)
	rows := make([][]string, len(s.Depth))
	for i, z := range s.Depth {
		rows[i] = []string{csvNum(uLength.of(z)), at(head, i), at(pore, i), at(total, i), at(eff, i)}
	}
	return writeCSV(header, rows)
}
