package plot

import (
	"fmt"
	"math"
	"slices"
	"strings"
	"testing"
	"time"

	"porelight/solver"
)

// DateTicks over many spans and widths: the labels never come closer
// than 8 px at the estimated text width, every label names the date its
// value is (days after start, counted here with the time package's
// calendar, leap years included), month and year ticks fall on the 1st
// and on 1 January, week ticks on Mondays (ISO 8601), and there is a
// tick, two where the width holds two full dates.
func TestDateTicks(t *testing.T) {
	t.Parallel()
	starts := []string{"2026-01-15", "2024-02-29", "2025-12-31", "1999-06-01"}
	spans := []float64{2, 9, 40, 120, 400, 1500, 8000, 40000}
	widths := []float64{180, 420, 900}
	for _, s := range starts {
		start, _ := time.Parse(solver.DateLayout, s)
		for _, span := range spans {
			for _, px := range widths {
				for _, lo := range []float64{0, -10.5} {
					t.Run(fmt.Sprintf("%s/%g days/%g px/from %g", s, span, px, lo), func(t *testing.T) {
						hi := lo + span
						ts := DateTicks(start, lo, hi, px)
						// Two full dates need about 140 px.
						if need := min(2, int(px/140)); len(ts) < need || len(ts) == 0 {
							t.Fatalf("%d ticks, want at least %d: %v", len(ts), max(need, 1), ts)
						}
						scale := px / span
						for i, tk := range ts {
							if tk.Value < lo-1e-9 || tk.Value > hi+1e-9 {
								t.Errorf("tick %q at %g outside [%g, %g]", tk.Label, tk.Value, lo, hi)
							}
							d := start.Add(time.Duration(tk.Value*24) * time.Hour)
							want := d.Format(solver.DateLayout)
							if !strings.HasPrefix(want, tk.Label) {
								t.Errorf("tick at day %g is %s, labelled %q", tk.Value, want, tk.Label)
							}
							switch len(tk.Label) {
							case 4:
								if d.Month() != time.January || d.Day() != 1 {
									t.Errorf("year tick on %s", want)
								}
							case 7:
								if d.Day() != 1 {
									t.Errorf("month tick on %s", want)
								}
							}
							if i == 0 {
								continue
							}
							gap := (tk.Value-ts[i-1].Value)*scale - (textWidth(tk.Label, 11)+textWidth(ts[i-1].Label, 11))/2
							if gap < 8 {
								t.Errorf("labels %q and %q are %.1f px apart, want ≥ 8", ts[i-1].Label, tk.Label, gap)
							}
						}
						if len(ts[0].Label) == 10 && len(ts) > 2 {
							step := ts[1].Value - ts[0].Value
							if step >= 7 && time.Weekday(start.Add(time.Duration(ts[0].Value*24)*time.Hour).Weekday()) != time.Monday {
								t.Errorf("week ticks start on %s, not a Monday", ts[0].Label)
							}
						}
					})
				}
			}
		}
	}
}

// Known calendar facts (common practice): 15 January to 1 February is 17
// days; 1 February to 1 March 2024 is 29 days (a leap year), 2025 28.
func TestDateTicksKnown(t *testing.T) {
	t.Parallel()
	cases := []struct {
		start     string
		hi, px    float64
		label     string
		wantValue float64
	}{
		{"2026-01-15", 365, 900, "2026-02", 17},
		{"2024-02-01", 365, 900, "2024-03", 29},
		{"2025-02-01", 365, 900, "2025-03", 28},
		{"2026-01-01", 20 * 365.25, 600, "2030", 1461},
	}
	for _, c := range cases {
		start, _ := time.Parse(solver.DateLayout, c.start)
		found := false
		for _, tk := range DateTicks(start, 0, c.hi, c.px) {
			if tk.Label == c.label {
				found = true
				if tk.Value != c.wantValue {
					t.Errorf("from %s: %s at day %g, want %g", c.start, c.label, tk.Value, c.wantValue)
				}
			}
		}
		if !found {
			t.Errorf("from %s over %g days: no tick %s", c.start, c.hi, c.label)
		}
	}
	if ts := DateTicks(time.Time{}, 5, 5, 600); ts != nil {
		t.Errorf("empty range: %v", ts)
	}
}

// With monitoring.start and dates chosen the settlement and piezometer
// plots run on a linear date axis from day 0 (so a reading on day 0 is
// drawn); without a start they keep the log axis.
func TestRecordFiguresOnDates(t *testing.T) {
	t.Parallel()
	r := &solver.Result{Consolidation: &solver.Consolidation{Series: solver.Series{
		Time: []float64{0, 10, 100, 1000}, Settlement: []float64{0, 0.05, 0.1, 0.12},
		Piezometers: []solver.Piezometer{{Depth: 3, Pore: []float64{20, 60, 40, 21}, Excess: []float64{0, 40, 20, 1}}}}}}
	p := &solver.Project{Monitoring: &solver.Monitoring{Start: "2026-03-02",
		Plates:      []solver.Plate{{Name: "A", Readings: []solver.Reading{{T: 0}, {T: 5, Value: 0.02}, {T: 60, Value: 0.08}}}},
		Piezometers: []solver.PiezometerRecord{{Name: "U", Depth: 3, Readings: []solver.Reading{{T: 0, Value: 20}, {T: 60, Value: 45}}}},
	}}
	for _, f := range []*Figure{SettlementTimeFigure(p, r, nil, true, 0, 0), PiezometersTimeFigure(p, r, nil, RecordAxes{Dates: true}, 0, 0)} {
		pn := f.Panels[0]
		if pn.X.Log || pn.X.Lo != 0 || pn.X.Hi != 90 {
			t.Errorf("%s: x axis %+v, want linear over 0 … 90 days (1.5 × the last reading)", f.ID, pn.X)
		}
		if !hasText(f, "Date (day 0 = 2026-03-02)") || !hasText(f, "2026-04") {
			t.Errorf("%s: no date axis title or no tick 2026-04", f.ID)
		}
		last := pn.Series[len(pn.Series)-1]
		if n := len(last.Pts); n != len(p.Monitoring.Piezometers[0].Readings) && n != len(p.Monitoring.Plates[0].Readings) {
			t.Errorf("%s: %s has %d points, want every reading, day 0 included", f.ID, last.Name, n)
		}
	}
	q := *p
	q.Monitoring = &solver.Monitoring{Plates: p.Monitoring.Plates}
	if f := SettlementTimeFigure(&q, r, nil, true, 0, 0); !f.Panels[0].X.Log {
		t.Error("without monitoring.start the settlement plot left the log axis")
	}
}

// As water levels, a piezometer at depth z reading u shows u/γw − z m
// above the top (total head, as Steady.Head; common practice), and the
// excess Δu/γw: for u = 58.86 kPa at 3 m with γw = 9.81, 6 − 3 = 3 m.
func TestPiezometersAsLevel(t *testing.T) {
	t.Parallel()
	r := &solver.Result{Consolidation: &solver.Consolidation{Series: solver.Series{
		Time:        []float64{0, 10, 100},
		Piezometers: []solver.Piezometer{{Depth: 3, Pore: []float64{29.43, 58.86, 29.43}, Excess: []float64{0, 29.43, 0}}}}}}
	p := &solver.Project{Monitoring: &solver.Monitoring{
		Piezometers: []solver.PiezometerRecord{{Name: "U", Depth: 3, Readings: []solver.Reading{{T: 10, Value: 58.86}}}}}}
	f := PiezometersTimeFigure(p, r, nil, RecordAxes{Level: true}, 0, 0)
	if !hasText(f, "Water level (total head), m above the top") {
		t.Error("no water level axis title")
	}
	want := map[string]float64{"z = 3 m, h": 3, "z = 3 m, Δu/γw excess": 3, "piezometer U, measured": 3}
	for _, s := range f.Panels[0].Series {
		w, ok := want[s.Name]
		if !ok {
			t.Errorf("unexpected series %q", s.Name)
			continue
		}
		delete(want, s.Name)
		for _, pt := range s.Pts {
			if pt.DX == 10 && math.Abs(pt.DY-w) > 1e-9 {
				t.Errorf("%s at day 10: %g m, want %g ± 1e-9", s.Name, pt.DY, w)
			}
		}
	}
	if len(want) > 0 {
		t.Errorf("series missing: %v", want)
	}
}

// The load is drawn in a strip above the settlement plot on the same
// time axis (log or dates): the same x scale, the strip ends above the
// plot, its value axis holds the largest load and its tick labels stay
// at least one font height (11 px) apart; with no load change there is
// no strip.
func TestSettlementLoadStrip(t *testing.T) {
	t.Parallel()
	r := &solver.Result{Consolidation: &solver.Consolidation{Series: solver.Series{
		Time: []float64{0, 10, 30, 100, 1000}, Settlement: []float64{0, 0.02, 0.05, 0.1, 0.12},
		Load: []float64{0, 20, 60, 60, 40}}}}
	p := &solver.Project{Monitoring: &solver.Monitoring{Start: "2026-03-02",
		Plates: []solver.Plate{{Name: "A", Readings: []solver.Reading{{T: 5, Value: 0.01}, {T: 60, Value: 0.08}}}}}}
	for _, dates := range []bool{false, true} {
		f := SettlementTimeFigure(p, r, nil, dates, 0, 0)
		if len(f.Panels) != 2 {
			t.Fatalf("dates %v: %d panels, want the settlement and the load", dates, len(f.Panels))
		}
		main, load := f.Panels[0], f.Panels[1]
		if load.X != main.X || load.Box.X != main.Box.X || load.Box.W != main.Box.W {
			t.Errorf("dates %v: the load strip's time axis %+v differs from the plot's %+v", dates, load.X, main.X)
		}
		if !(load.Box.Bottom() < main.Box.Y) || load.Box.Y < 0 {
			t.Errorf("dates %v: strip %+v overlaps the plot %+v or leaves the figure", dates, load.Box, main.Box)
		}
		if !(load.Y.Hi >= 60) || load.Y.Lo > 0 {
			t.Errorf("dates %v: load axis %g … %g does not hold 0 … 60 kPa", dates, load.Y.Lo, load.Y.Hi)
		}
		if len(load.Series) != 1 || load.Series[0].Name != "Load at the surface" {
			t.Errorf("dates %v: strip series %v", dates, load.Series)
		}
		if !hasText(f, "Load, kPa") {
			t.Errorf("dates %v: no load axis title", dates)
		}
		// The value labels of both panels, left of the frames, top to
		// bottom.
		var ys []float64
		inLoad := 0
		for _, tx := range f.Texts {
			if tx.Anchor == "end" && tx.X < main.Box.X {
				ys = append(ys, tx.Y)
				if tx.Y >= load.Box.Y && tx.Y <= load.Box.Bottom()+4 {
					inLoad++
				}
			}
		}
		if inLoad < 2 {
			t.Errorf("dates %v: %d load tick labels", dates, inLoad)
		}
		slices.Sort(ys)
		for i := 1; i < len(ys); i++ {
			if ys[i]-ys[i-1] < 14 {
				t.Errorf("dates %v: value labels at y %.1f and %.1f, want ≥ 14 px apart (11 px text)", dates, ys[i-1], ys[i])
			}
		}
	}
	flat := *r.Consolidation
	flat.Series.Load = []float64{50, 50, 50, 50, 50}
	if f := SettlementTimeFigure(p, &solver.Result{Consolidation: &flat}, nil, false, 0, 0); len(f.Panels) != 1 {
		t.Errorf("a constant load still gets a strip: %d panels", len(f.Panels))
	}
}
