package plot

import (
	"math"
	"strconv"

	"porelight/solver"
)

// record is one field record as the plots draw it: times in days, values
// in the file's unit (m or kPa).
type record struct {
	name   string
	depth  float64 // piezometers, m
	ts, vs []float64
}

// plateRecords returns the settlement plates of p with their reading
// times; a record whose times cannot be resolved is left out (Validate
// reports it).
func plateRecords(p *solver.Project) []record {
	if p == nil || p.Monitoring == nil {
		return nil
	}
	var out []record
	for i, pl := range p.Monitoring.Plates {
		if r, ok := newRecord(p.Monitoring, pl.Name, i, pl.Readings); ok {
			out = append(out, r)
		}
	}
	return out
}

// piezometerRecords returns the piezometer records of p, as plateRecords.
func piezometerRecords(p *solver.Project) []record {
	if p == nil || p.Monitoring == nil {
		return nil
	}
	var out []record
	for i, pz := range p.Monitoring.Piezometers {
		if r, ok := newRecord(p.Monitoring, pz.Name, i, pz.Readings); ok {
			r.depth = pz.Depth
			out = append(out, r)
		}
	}
	return out
}

func newRecord(m *solver.Monitoring, name string, i int, rs []solver.Reading) (record, bool) {
	if len(rs) == 0 {
		return record{}, false
	}
	ts, err := solver.ReadingTimes(m, rs)
	if err != nil {
		return record{}, false
	}
	if name == "" {
		name = strconv.Itoa(i + 1)
	}
	r := record{name: name, ts: ts, vs: make([]float64, len(rs))}
	for j, x := range rs {
		r.vs[j] = x.Value
	}
	return r, true
}

// readingSpan widens a log time axis [tlo, thi] to the readings after
// day 0.
func readingSpan(tlo, thi float64, recs []record) (float64, float64) {
	for _, r := range recs {
		for _, t := range r.ts {
			if t > 0 && isFinite(t) {
				tlo, thi = math.Min(tlo, t), math.Max(thi, t)
			}
		}
	}
	return tlo, thi
}

// depthIndex is the index of the piezometer of s at depth z, or -1.
func depthIndex(s *solver.Series, z float64) int {
	if s == nil {
		return -1
	}
	for i, pz := range s.Piezometers {
		if solver.SameDepth(z, pz.Depth) {
			return i
		}
	}
	return -1
}
