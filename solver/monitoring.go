package solver

import (
	"fmt"
	"time"
)

// Limits on field records, so that one project stays within what a
// browser tab can check and fit.
const (
	MaxRecords  = 100     // plates and piezometers together
	MaxReadings = 100_000 // readings in one record
)

// DateLayout is the calendar date of the file format, YYYY-MM-DD, as a
// time layout.
const DateLayout = "2006-01-02"

// parseDate reads a file-format date (YYYY-MM-DD, UTC midnight).
func parseDate(s string) (time.Time, bool) {
	t, err := time.Parse(DateLayout, s)
	return t, err == nil
}

// daysBetween is the number of days from a to b (both UTC midnights).
func daysBetween(a, b time.Time) float64 {
	return b.Sub(a).Hours() / 24
}

// validMonitoring checks the field readings of a project: every problem
// is added to ps with its path (monitoring.plates[0].readings[3].t …).
// height is the column height, m (0 when unknown), and layers the number
// of layers.
//
// A reading gives either t (days after day 0, ≥ 0) or date (YYYY-MM-DD,
// which needs monitoring.start), not both; because t = 0 is the JSON zero
// value, a reading with a date and t = 0 counts as giving the date only.
// The times of one record must increase strictly: a time earlier than the
// one before is ErrNotSorted, the same time again ErrDuplicate. Values
// must be finite; a piezometer must lie within the column. A record may be
// empty (a plate set up but not read yet).
func validMonitoring(ps *Problems, m *Monitoring, height float64, layers int) {
	if m.Asaoka != nil {
		validAsaoka(ps, m.Asaoka, layers)
	}
	v := monitorCheck{ps: ps, hasStart: m.Start != ""}
	if v.hasStart {
		if t, ok := parseDate(m.Start); ok {
			v.start, v.startOK = t, true
		} else {
			ps.Add("monitoring.start", ErrDate, fmt.Sprintf("got %q", m.Start))
		}
	}
	if n := len(m.Plates) + len(m.Piezometers); n > MaxRecords {
		ps.Add("monitoring", ErrTooLarge, fmt.Sprintf("%d records, the limit is %d", n, MaxRecords))
	}
	for i, pl := range m.Plates {
		v.readings(fmt.Sprintf("monitoring.plates[%d]", i), pl.Readings, MaxPlateReading, "m")
	}
	for i, pz := range m.Piezometers {
		at := fmt.Sprintf("monitoring.piezometers[%d]", i)
		if upTo(ps, at+".depth", pz.Depth, MaxDepth, "m") && height > 0 && pz.Depth > height*(1+1e-12) {
			ps.Add(at+".depth", ErrOutOfRange, fmt.Sprintf("depth %g m is below the base of the column at %g m", pz.Depth, height))
		}
		v.readings(at, pz.Readings, MaxPressureReading, "kPa")
	}
	if v.dated != "" && !v.hasStart {
		ps.Add("monitoring.start", ErrRequired, fmt.Sprintf("%s gives a date; dates count from the calendar date of day 0", v.dated))
	}
}

// monitorCheck carries what the checks of every record share.
type monitorCheck struct {
	ps       *Problems
	hasStart bool      // Start is given (valid or not)
	start    time.Time // Start, when startOK
	startOK  bool
	dated    string // path of the first reading that gives a date
}

// readings checks one record's readings; at is the record's path, and
// values are bounded by ±limit (in unit).
func (v *monitorCheck) readings(at string, rs []Reading, limit float64, unit string) {
	ps := v.ps
	if len(rs) > MaxReadings {
		ps.Add(at+".readings", ErrTooLarge, fmt.Sprintf("%d readings, the limit is %d", len(rs), MaxReadings))
		return
	}
	// The paths and the texts of the messages are made only for a reading
	// with a problem: Validate runs before every solve, and a record may
	// hold thousands of readings.
	prev, prevOK, prevAt := 0.0, false, 0 // prevAt: the reading of prev
	for j, r := range rs {
		rp := func(field string) string { return fmt.Sprintf("%s.readings[%d].%s", at, j, field) }
		t, ok, field := 0.0, false, "t"
		if r.Date != "" {
			field = "date"
			if r.T != 0 {
				ps.Add(rp("t"), ErrConflict, "give t or date, not both")
			}
			d, good := parseDate(r.Date)
			switch {
			case !good:
				ps.Add(rp(field), ErrDate, fmt.Sprintf("got %q", r.Date))
			case !v.hasStart:
				if v.dated == "" {
					v.dated = rp(field)
				}
			case v.startOK:
				t = daysBetween(v.start, d)
				if t < 0 {
					ps.Add(rp(field), ErrOutOfRange, fmt.Sprintf("%s is before day 0, monitoring.start = %s", r.Date, v.start.Format(DateLayout)))
				} else {
					ok = true
				}
			}
		} else if r.T >= 0 && r.T <= MaxTime || upTo(ps, rp(field), r.T, MaxTime, "days") {
			t, ok = r.T, true // upTo's test first, its path only for a problem
		}
		if !(r.Value >= -limit && r.Value <= limit) { // within's test
			within(ps, rp("value"), r.Value, limit, unit)
		}
		if ok && prevOK {
			switch {
			case t < prev:
				ps.Add(rp(field), ErrNotSorted, fmt.Sprintf("%s follows %s", readingText(r), readingText(rs[prevAt])))
			case t == prev:
				ps.Add(rp(field), ErrDuplicate, fmt.Sprintf("%s again; give each time once", readingText(r)))
			}
		}
		if ok {
			prev, prevOK, prevAt = t, true, j
		}
	}
}

// readingText names the time of a reading in a message: its date, or
// "day t".
func readingText(r Reading) string {
	if r.Date != "" {
		return r.Date
	}
	return fmt.Sprintf("day %g", r.T)
}

// ReadingTimes returns the time of each reading in days after day 0,
// resolving dates against m.Start (m may be nil when no reading gives a
// date). It reports, all at once as Problems with paths such as
// "readings[3].date", every time that cannot be resolved: a malformed date
// or Start, a date without Start, a date before Start, a t that is
// negative or not finite. It does not check the order of the readings
// (Validate does).
func ReadingTimes(m *Monitoring, rs []Reading) ([]float64, error) {
	return ReadingTimesAt(m, rs, "readings")
}

// ReadingTimesAt is ReadingTimes for the readings at field path list,
// e.g. "monitoring.plates[2].readings": its problems name
// "monitoring.plates[2].readings[3].date".
func ReadingTimesAt(m *Monitoring, rs []Reading, list string) ([]float64, error) {
	var ps Problems
	var start time.Time
	startOK := false
	if m != nil && m.Start != "" {
		start, startOK = parseDate(m.Start)
		if !startOK {
			ps.Add("monitoring.start", ErrDate, fmt.Sprintf("got %q", m.Start))
		}
	}
	ts := make([]float64, len(rs))
	for j, r := range rs {
		at := IndexPath(list, j)
		if r.Date == "" {
			nonNegative(&ps, at+".t", r.T)
			ts[j] = r.T
			continue
		}
		d, ok := parseDate(r.Date)
		switch {
		case !ok:
			ps.Add(at+".date", ErrDate, fmt.Sprintf("got %q", r.Date))
		case m == nil || m.Start == "":
			ps.Add(at+".date", ErrConflict, "a date needs monitoring.start, the calendar date of day 0")
		case startOK:
			ts[j] = daysBetween(start, d)
			if ts[j] < 0 {
				ps.Add(at+".date", ErrOutOfRange, fmt.Sprintf("%s is before day 0, monitoring.start = %s", r.Date, m.Start))
			}
		}
	}
	if err := ps.Err(); err != nil {
		return nil, err
	}
	return ts, nil
}

// AsaokaSettings are the choices for Asaoka's method saved with the
// records (package monitor applies the method).
type AsaokaSettings struct {
	// From and To bound the readings the method reads, days after day 0.
	// Zero From: the start the first-mode criterion chooses (never before
	// the last change of load); zero To: the last reading.
	From float64 `json:"from,omitempty"`
	To   float64 `json:"to,omitempty"`
	// Layers are the indices of the layers that consolidate: their total
	// thickness, over the number of drained ends of the column, is the
	// drainage path of the implied cv. Empty: the compressible layers
	// (package monitor, ConsolidatingLayers).
	Layers []int `json:"layers,omitempty"`
}

// validAsaoka checks the saved choices for Asaoka's method.
func validAsaoka(ps *Problems, a *AsaokaSettings, layers int) {
	const at = "monitoring.asaoka"
	from := upTo(ps, at+".from", a.From, MaxTime, "days")
	if upTo(ps, at+".to", a.To, MaxTime, "days") && from && a.To > 0 && a.To <= a.From {
		ps.Add(at+".to", ErrOutOfRange, fmt.Sprintf("day %g is not after the start of the window, day %g", a.To, a.From))
	}
	seen := map[int]bool{}
	for i, l := range a.Layers {
		lp := IndexPath(at+".layers", i)
		switch {
		case l < 0 || l >= layers:
			ps.Add(lp, ErrOutOfRange, fmt.Sprintf("layer %d does not exist (the column has %d layers, numbered from 0)", l, layers))
		case seen[l]:
			ps.Add(lp, ErrConflict, fmt.Sprintf("layer %d again; give each layer once", l))
		}
		seen[l] = true
	}
}
