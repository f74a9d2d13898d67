package plot

import (
	"math"
	"time"

	"porelight/solver"
)

// dateStep is one rung of the ladder DateTicks climbs: a number of days
// (aligned on whole multiples since 1970-01-05, a Monday, so weeks start
// on Mondays as in ISO 8601) or of months (aligned on January).
type dateStep struct {
	days, months int
}

// dateSteps from the finest to the coarsest.
var dateSteps = []dateStep{
	{days: 1}, {days: 2}, {days: 7}, {days: 14},
	{months: 1}, {months: 2}, {months: 3}, {months: 6},
	{months: 12}, {months: 24}, {months: 60}, {months: 120}, {months: 240}, {months: 600}, {months: 1200},
}

// Date tick labels: font size and the least gap between two labels, px.
const (
	dateLabelSize = 11
	dateLabelGap  = 8
)

// mondayEpoch is a Monday, the origin of the day steps.
var mondayEpoch = time.Date(1970, 1, 5, 0, 0, 0, 0, time.UTC)

// DateTicks returns labelled ticks of calendar dates for a linear time
// axis over [lo, hi] days after start (a UTC midnight, as
// monitoring.start is read) drawn px pixels wide: the finest step of the
// ladder 1, 2, 7, 14 days, 1, 2, 3, 6 months, 1, 2, 5, 10 … years whose
// labels, ISO 8601 dates (YYYY-MM-DD for day steps, YYYY-MM for months,
// YYYY for years), keep at least 8 px apart at the estimated text width;
// where no step gives two such labels, the finest that gives one.
// A tick's Value is its date in days after start. Nil for an empty or
// non-finite range or px ≤ 0.
func DateTicks(start time.Time, lo, hi, px float64) []Tick {
	if !isFinite(lo) || !isFinite(hi) || !(hi > lo) || !(px > 0) || hi-lo > 1000*solver.DaysPerYear {
		return nil
	}
	scale := px / (hi - lo)
	var single []Tick // the finest step that fits with one tick only
	for _, st := range dateSteps {
		ts := dateTicksAt(start, lo, hi, st)
		if len(ts) > 200 || !dateLabelsFit(ts, scale) {
			continue
		}
		if len(ts) >= 2 {
			return ts
		}
		if single == nil && len(ts) == 1 {
			single = ts
		}
	}
	return single
}

// dateTicksAt lists the dates of step st within [lo, hi] days after start.
func dateTicksAt(start time.Time, lo, hi float64, st dateStep) []Tick {
	first := start.Add(time.Duration(math.Floor(lo)) * 24 * time.Hour)
	var d time.Time
	if st.days > 0 {
		n := int(math.Floor(first.Sub(mondayEpoch).Hours() / 24))
		n -= ((n % st.days) + st.days) % st.days
		d = mondayEpoch.AddDate(0, 0, n)
	} else {
		m := first.Year()*12 + int(first.Month()) - 1
		m -= ((m % st.months) + st.months) % st.months
		d = time.Date(m/12, time.Month(m%12+1), 1, 0, 0, 0, 0, time.UTC)
	}
	layout := "2006"
	switch {
	case st.days > 0:
		layout = solver.DateLayout
	case st.months < 12:
		layout = "2006-01"
	}
	var ts []Tick
	for k := 0; k < 10000 && len(ts) <= 200; k++ {
		v := d.Sub(start).Hours() / 24
		if v > hi+1e-9 {
			break
		}
		if v >= lo-1e-9 {
			ts = append(ts, Tick{Value: v, Label: d.Format(layout)})
		}
		if st.days > 0 {
			d = d.AddDate(0, 0, st.days)
		} else {
			d = d.AddDate(0, st.months, 0)
		}
	}
	return ts
}

// dateLabelsFit reports whether centred labels of the ticks, at scale
// px/day, keep dateLabelGap apart.
func dateLabelsFit(ts []Tick, scale float64) bool {
	for i := 1; i < len(ts); i++ {
		need := (textWidth(ts[i-1].Label, dateLabelSize)+textWidth(ts[i].Label, dateLabelSize))/2 + dateLabelGap
		if (ts[i].Value-ts[i-1].Value)*scale < need {
			return false
		}
	}
	return true
}

// MonitoringStart is the date of day 0 of p's monitoring records, and
// false when p has none or it is not a valid date.
func MonitoringStart(p *solver.Project) (time.Time, bool) {
	if p == nil || p.Monitoring == nil || p.Monitoring.Start == "" {
		return time.Time{}, false
	}
	t, err := time.Parse(solver.DateLayout, p.Monitoring.Start)
	return t, err == nil
}
