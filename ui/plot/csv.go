package plot

import (
	"encoding/csv"
	"strings"

	"porelight/solver"
)

// CSV exports: comma-separated, one header row naming every column with
// its unit, numbers with up to 10 significant figures, an empty cell where
// a value is missing or not finite. A result without the data gives just
// the header row.

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
	header := []string{"depth (m)"}
	if r == nil || r.Consolidation == nil {
		return writeCSV(header, nil)
	}
	c := r.Consolidation
	for _, iso := range c.Isochrones {
		header = append(header, "excess pore pressure at t = "+csvNum(iso.Time)+" day (kPa)")
	}
	rows := make([][]string, len(c.Depth))
	for i, z := range c.Depth {
		row := []string{csvNum(z)}
		for _, iso := range c.Isochrones {
			row = append(row, at(iso.Excess, i))
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
	names := []string{"settlement from mv (m)"}
	nonlinear := r != nil && r.Summary.Model == solver.ModelNonlinear
	elog := !nonlinear && r != nil && r.Consolidation != nil && len(r.Consolidation.Series.SettlementElog) > 0
	secondary := r != nil && r.Consolidation != nil && len(r.Consolidation.Series.Secondary) > 0
	if nonlinear {
		names[0] = "settlement, non-linear model (m)"
	}
	if elog {
		names = append(names, "settlement from e-log curves (m)")
	}
	if secondary {
		names = append(names, "secondary settlement (m)")
	}
	return seriesCSV(r, names, func(s *solver.Series) [][]float64 {
		cols := [][]float64{s.Settlement}
		if elog {
			cols = append(cols, s.SettlementElog)
		}
		if secondary {
			cols = append(cols, s.Secondary)
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
	for _, p := range pz {
		z := csvNum(p.Depth)
		names = append(names, "pore pressure at z = "+z+" m (kPa)", "excess pore pressure at z = "+z+" m (kPa)")
	}
	return seriesCSV(r, names, func(s *solver.Series) [][]float64 {
		var cs [][]float64
		for _, p := range s.Piezometers {
			cs = append(cs, p.Pore, p.Excess)
		}
		return cs
	})
}

// SteadyCSV returns the steady state profiles as CSV, one row per node.
func SteadyCSV(r *solver.Result) string {
	header := []string{"depth (m)", "total head (m)", "pore pressure (kPa)", "total vertical stress (kPa)", "effective vertical stress (kPa)"}
	if r == nil {
		return writeCSV(header, nil)
	}
	s := &r.Steady
	rows := make([][]string, len(s.Depth))
	for i, z := range s.Depth {
		rows[i] = []string{csvNum(z), at(s.Head, i), at(s.Pore, i), at(s.Total, i), at(s.Effective, i)}
	}
	return writeCSV(header, rows)
}
