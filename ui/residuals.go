package ui

import (
	"fmt"
	"math"

	"porelight/solver"
	"porelight/solver/monitor"
	"porelight/ui/form"
)

// Residuals: each reading against the prediction at its time. The
// prediction is the settlement the back-analysis compares with
// (monitor.FittedSettlement: the settlement of the model the summary
// uses, plus the secondary compression when there is one) for a plate
// and the pore pressure at the record's depth (Piezometer.Pore) for a
// piezometer, interpolated linearly in time between the solver's steps
// with solver.SeriesAt, as the back-analysis does. Settlements are shown in mm, pressures in kPa.

// resRow is one reading compared.
type resRow struct {
	T         float64 // days after day 0
	Date      string  // as given, or ""
	Measured  float64 // mm or kPa
	Predicted float64
	Diff      float64 // measured − predicted
	OK        bool    // false: no prediction at this time (Note says why)
	Note      string
}

// resRecord is one record compared.
type resRecord struct {
	Path, ID, Name string
	Kind           string // form.Plates or form.Piezometers
	Unit           string // "mm" or "kPa"
	Depth          float64
	Rows           []resRow
	N              int     // readings compared
	RMS, Mean      float64 // of the differences (NaN when N = 0)
	Problem        string  // why the record cannot be compared at all
}

// residuals compares every record of p with the result r of p.
func residuals(p *solver.Project, r *solver.Result) []resRecord {
	if p == nil || p.Monitoring == nil {
		return nil
	}
	m := p.Monitoring
	var ser *solver.Series
	if r != nil && r.Consolidation != nil {
		ser = &r.Consolidation.Series
	}
	var out []resRecord
	for i, pl := range m.Plates {
		rec := resRecord{Path: form.RecordPath(form.Plates, i), Name: recordName(pl.Name, "Plate", i), Kind: form.Plates, Unit: "mm"}
		var ys []float64
		if ser != nil {
			ys, _ = monitor.FittedSettlement(r)
		}
		compare(&rec, m, pl.Readings, ser, ys, 1000)
		out = append(out, rec)
	}
	for i, pz := range m.Piezometers {
		rec := resRecord{Path: form.RecordPath(form.Piezometers, i), Name: recordName(pz.Name, "Piezometer", i), Kind: form.Piezometers, Unit: "kPa", Depth: pz.Depth}
		var ys []float64
		if ser != nil {
			for _, s := range ser.Piezometers {
				if solver.SameDepth(s.Depth, pz.Depth) {
					ys = s.Pore
				}
			}
			if ys == nil {
				rec.Problem = fmt.Sprintf("no prediction at %s m in these results", sig(pz.Depth, 4))
			}
		}
		compare(&rec, m, pz.Readings, ser, ys, 1)
		out = append(out, rec)
	}
	for i := range out {
		out[i].ID = form.IDOf(out[i].Path)
	}
	return out
}

func recordName(name, what string, i int) string {
	if name != "" {
		return name
	}
	return fmt.Sprintf("%s %d", what, i+1)
}

// compare fills rec's rows from the readings rs and the prediction ys at
// the times of ser; scale turns the file's unit into the one shown.
func compare(rec *resRecord, m *solver.Monitoring, rs []solver.Reading, ser *solver.Series, ys []float64, scale float64) {
	rec.RMS, rec.Mean = math.NaN(), math.NaN()
	ts, err := solver.ReadingTimes(m, rs)
	if err != nil {
		rec.Problem = describeProblems(solver.AsProblems(err), 3)
		return
	}
	if ser == nil {
		if rec.Problem == "" {
			rec.Problem = "no consolidation results to compare with"
		}
	}
	var ss, sum float64
	for j, rd := range rs {
		row := resRow{T: ts[j], Date: rd.Date, Measured: rd.Value * scale}
		switch {
		case ser == nil || len(ys) != len(ser.Time) || len(ys) == 0:
			row.Note = "no prediction"
		case ts[j] > ser.Time[len(ser.Time)-1]:
			row.Note = "after the simulated time"
		default:
			row.Predicted = solver.SeriesAt(ser.Time, ys, ts[j]) * scale
			row.Diff = row.Measured - row.Predicted
			row.OK = true
			ss += row.Diff * row.Diff
			sum += row.Diff
			rec.N++
		}
		rec.Rows = append(rec.Rows, row)
	}
	if rec.N > 0 {
		rec.RMS = math.Sqrt(ss / float64(rec.N))
		rec.Mean = sum / float64(rec.N)
	}
}

// residualsCSV writes every comparison: one row per reading.
func residualsCSV(recs []resRecord) ([]byte, error) {
	rows := [][]string{{"record", "kind", "depth (m)", "time (day)", "date", "measured", "predicted", "measured - predicted", "unit"}}
	for _, rec := range recs {
		kind, depth := "settlement plate", ""
		if rec.Kind == form.Piezometers {
			kind, depth = "piezometer", exact(rec.Depth)
		}
		for _, r := range rec.Rows {
			pred, diff := "", ""
			if r.OK {
				pred, diff = exact(r.Predicted), exact(r.Diff)
			}
			rows = append(rows, []string{rec.Name, kind, depth, exact(r.T), r.Date, exact(r.Measured), pred, diff, rec.Unit})
		}
	}
	return writeCSV(rows)
}
