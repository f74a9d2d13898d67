package form

import (
	"fmt"
	"slices"
	"sort"
	"strings"
	"time"

	"porelight/solver"
	"porelight/solver/monitor"
)

// The monitoring records in the form: paths such as
// "monitoring.plates[0].readings[3].t". One input shows the time of a
// reading, as days after day 0 or as a date; settlement readings are typed
// in mm (the file holds m), pore pressures in kPa.

// Record kinds, as named in the paths.
const (
	Plates      = "plates"
	Piezometers = "piezometers"
)

// RecordPath is the path of record i of a kind: "monitoring.plates[0]".
func RecordPath(kind string, i int) string {
	return solver.IndexPath(solver.JoinPath("monitoring", kind), i)
}

// ReadingPath is the path of a leaf ("t" or "value") of reading j of
// record i of a kind: "monitoring.plates[0].readings[3].t".
func ReadingPath(kind string, i, j int, leaf string) string {
	return solver.JoinPath(solver.IndexPath(solver.JoinPath(RecordPath(kind, i), "readings"), j), leaf)
}

// parseDate reads a date in any form monitor.ParseDate takes and returns
// it in the file's form.
func parseDate(s string) (string, bool) {
	d, ok := monitor.ParseDate(s)
	if !ok {
		return "", false
	}
	return d.Format(solver.DateLayout), true
}

// readingAt returns the reading a path of the form
// monitoring.KIND[i].readings[j].LEAF points into.
func readingAt(p *solver.Project, path string) (*solver.Reading, bool) {
	if !strings.HasPrefix(path, "monitoring.") || p.Monitoring == nil {
		return nil, false
	}
	steps, err := solver.ParsePath(path)
	if err != nil || len(steps) != 4 || steps[2].Name != "readings" || steps[1].Index < 0 || steps[2].Index < 0 {
		return nil, false
	}
	i, j := steps[1].Index, steps[2].Index
	var rs []solver.Reading
	switch steps[1].Name {
	case Plates:
		if i >= len(p.Monitoring.Plates) {
			return nil, false
		}
		rs = p.Monitoring.Plates[i].Readings
	case Piezometers:
		if i >= len(p.Monitoring.Piezometers) {
			return nil, false
		}
		rs = p.Monitoring.Piezometers[i].Readings
	default:
		return nil, false
	}
	if j >= len(rs) {
		return nil, false
	}
	return &rs[j], true
}

// readingTimeText is what the time input of a reading shows.
func readingTimeText(r solver.Reading) string {
	if r.Date != "" {
		return r.Date
	}
	return FormatNumber(r.T)
}

// applyRecord takes the text typed into a monitoring input whose reading
// needs more than the generic rules: the time (days or a date), the start
// date (any date form, stored as YYYY-MM-DD) and the values that must not
// be left empty. handled is false for the inputs the generic rules take.
func (f *Form) applyRecord(path, s string) (problem string, handled bool) {
	if !strings.HasPrefix(path, "monitoring.") {
		return "", false
	}
	if path == "monitoring.start" {
		if f.draft.Monitoring == nil {
			f.draft.Monitoring = &solver.Monitoring{}
		}
		if d, ok := parseDate(s); ok {
			s = d
		}
		f.draft.Monitoring.Start = s // Validate says what is wrong with it
		return "", true
	}
	if s == "" && (strings.HasSuffix(path, ".t") || strings.HasSuffix(path, ".value") || strings.HasSuffix(path, ".depth")) {
		return "required", true
	}
	if !strings.HasSuffix(path, ".t") {
		return "", false
	}
	r, ok := readingAt(&f.draft, path)
	if !ok {
		return "no such reading", true
	}
	if x, msg := ParseNumber(s, false); msg == "" {
		r.T, r.Date = x, ""
		return "", true
	}
	if d, ok := parseDate(s); ok {
		r.T, r.Date = 0, d
		return "", true
	}
	return "not a number of days or a date (YYYY-MM-DD, DD/MM/YYYY or DD.MM.YYYY)", true
}

// mon returns the draft's monitoring records, creating them if need be.
func (f *Form) mon() *solver.Monitoring {
	if f.draft.Monitoring == nil {
		f.draft.Monitoring = &solver.Monitoring{}
	}
	return f.draft.Monitoring
}

// Readings returns the readings of record i of a kind (nil when absent).
func (f *Form) Readings(kind string, i int) []solver.Reading {
	m := f.draft.Monitoring
	switch {
	case m == nil || i < 0:
	case kind == Plates && i < len(m.Plates):
		return m.Plates[i].Readings
	case kind == Piezometers && i < len(m.Piezometers):
		return m.Piezometers[i].Readings
	}
	return nil
}

func (f *Form) setReadings(kind string, i int, rs []solver.Reading) {
	m := f.mon()
	if kind == Plates {
		m.Plates[i].Readings = rs
	} else {
		m.Piezometers[i].Readings = rs
	}
}

// Records is the number of records of a kind.
func (f *Form) Records(kind string) int {
	m := f.draft.Monitoring
	switch {
	case m == nil:
		return 0
	case kind == Plates:
		return len(m.Plates)
	}
	return len(m.Piezometers)
}

// AddPlate appends an empty settlement plate.
func (f *Form) AddPlate() {
	m := f.mon()
	m.Plates = append(m.Plates, solver.Plate{Name: fmt.Sprintf("P%d", len(m.Plates)+1), Readings: []solver.Reading{}})
	f.check()
}

// AddPiezometerRecord appends an empty piezometer record, at the first
// output depth no record uses yet, else at mid-height of the column.
func (f *Form) AddPiezometerRecord() {
	m := f.mon()
	depth := solver.ColumnHeight(&f.draft) / 2
	for _, z := range f.draft.Piezometers {
		if !slices.ContainsFunc(m.Piezometers, func(r solver.PiezometerRecord) bool { return solver.SameDepth(r.Depth, z) }) {
			depth = z
			break
		}
	}
	m.Piezometers = append(m.Piezometers, solver.PiezometerRecord{
		Name: fmt.Sprintf("U%d", len(m.Piezometers)+1), Depth: depth, Readings: []solver.Reading{}})
	f.check()
}

// RemoveRecord deletes record i of a kind with its readings.
func (f *Form) RemoveRecord(kind string, i int) {
	if i < 0 || i >= f.Records(kind) {
		return
	}
	m := f.mon()
	if kind == Plates {
		m.Plates = slices.Delete(m.Plates, i, i+1)
	} else {
		m.Piezometers = slices.Delete(m.Piezometers, i, i+1)
	}
	f.remap(solver.JoinPath("monitoring", kind), Removed(i))
	f.tidyMonitoring()
	f.check()
}

// AddReading appends a reading a week after the last one of record i,
// with the same value, so that the row starts from something plausible.
func (f *Form) AddReading(kind string, i int) {
	if i < 0 || i >= f.Records(kind) {
		return
	}
	rs := f.Readings(kind, i)
	r := solver.Reading{}
	if n := len(rs); n > 0 {
		r = rs[n-1]
		if d, err := time.Parse(solver.DateLayout, r.Date); err == nil {
			r.Date = d.AddDate(0, 0, 7).Format(solver.DateLayout)
		} else {
			r.T += 7
		}
	}
	f.setReadings(kind, i, append(rs, r))
	f.check()
}

// RemoveReading deletes reading j of record i.
func (f *Form) RemoveReading(kind string, i, j int) {
	rs := f.Readings(kind, i)
	if j < 0 || j >= len(rs) {
		return
	}
	f.setReadings(kind, i, slices.Delete(rs, j, j+1))
	f.remap(solver.JoinPath(RecordPath(kind, i), "readings"), Removed(j))
	f.check()
}

// ReplaceReadings makes rs the readings of record i and returns the ones
// it replaced.
func (f *Form) ReplaceReadings(kind string, i int, rs []solver.Reading) []solver.Reading {
	if i < 0 || i >= f.Records(kind) {
		return nil
	}
	old := f.Readings(kind, i)
	f.setReadings(kind, i, rs)
	f.dropRaw(solver.JoinPath(RecordPath(kind, i), "readings"))
	f.check()
	return old
}

// tidyMonitoring drops records that hold nothing at all, so that a project
// without monitoring saves without it.
func (f *Form) tidyMonitoring() {
	if m := f.draft.Monitoring; m != nil && m.Start == "" && len(m.Plates) == 0 && len(m.Piezometers) == 0 {
		f.draft.Monitoring = nil
	}
}

// FieldProblem is a problem with one input: its path and the message
// shown beside it.
type FieldProblem struct{ Path, Message string }

// ProblemsUnder lists the problems of the inputs at prefix and below
// (every input for ""), in path order. Problems no input shows are in
// Other.
func (f *Form) ProblemsUnder(prefix string) []FieldProblem {
	var out []FieldProblem
	seen := map[string]bool{}
	add := func(path string) {
		if !seen[path] && (prefix == "" || Under(path, prefix)) {
			seen[path] = true
			out = append(out, FieldProblem{path, f.Problem(path)})
		}
	}
	for p := range f.bad {
		add(p)
	}
	for p := range f.probs {
		add(p)
	}
	sort.Slice(out, func(a, b int) bool { return out[a].Path < out[b].Path })
	return out
}
