package plot

import (
	"slices"
	"testing"

	"porelight/solver"
)

// The residuals plot: plates (mm) above piezometers (kPa) on one time
// axis, each panel's value axis symmetric about a drawn zero line and
// holding every difference, the panels apart (the upper one's tick
// labels and title, 36 px below its frame, clear of the lower frame),
// every reading a mark; on dates the axis is ticked by DateTicks.
func TestResidualsFigure(t *testing.T) {
	t.Parallel()
	recs := []ResidualRecord{
		{Name: "plate P1", Times: []float64{10, 40, 90}, Diffs: []float64{2, -7, 3}},
		{Name: "piezometer U1", Pressure: true, Times: []float64{5, 60}, Diffs: []float64{-1.5, 4}},
		{Name: "plate P2", Times: []float64{20}, Diffs: []float64{1}},
	}
	p := &solver.Project{Monitoring: &solver.Monitoring{Start: "2026-03-02"}}
	for _, dates := range []bool{false, true} {
		f := ResidualsFigure(p, recs, dates, 0, 0)
		if len(f.Panels) != 2 {
			t.Fatalf("dates %v: %d panels, want 2", dates, len(f.Panels))
		}
		up, down := f.Panels[0], f.Panels[1]
		if up.X.Lo != down.X.Lo || up.X.Hi != down.X.Hi || up.Box.X != down.Box.X || up.Box.W != down.Box.W {
			t.Errorf("dates %v: the panels' time axes differ: %+v, %+v", dates, up.X, down.X)
		}
		if up.Box.Bottom()+36+12 > down.Box.Y {
			t.Errorf("dates %v: the upper panel's axis title (at %g) runs into the lower frame (at %g)", dates, up.Box.Bottom()+36, down.Box.Y)
		}
		for k, pn := range []*Panel{up, down} {
			if pn.Y.Lo != -pn.Y.Hi {
				t.Errorf("dates %v panel %d: value axis %g … %g is not symmetric", dates, k, pn.Y.Lo, pn.Y.Hi)
			}
		}
		if !(up.Y.Hi >= 7) || !(down.Y.Hi >= 4) {
			t.Errorf("dates %v: axes ±%g mm, ±%g kPa do not hold 7 mm and 4 kPa", dates, up.Y.Hi, down.Y.Hi)
		}
		var names []string
		for _, pn := range f.Panels {
			for _, s := range pn.Series {
				names = append(names, s.Name)
				if want := map[string]int{"plate P1": 3, "plate P2": 1, "piezometer U1": 2}[s.Name]; len(s.Pts) != want {
					t.Errorf("dates %v: %s has %d marks, want %d", dates, s.Name, len(s.Pts), want)
				}
			}
		}
		if !slices.Equal(names, []string{"plate P1", "plate P2", "piezometer U1"}) {
			t.Errorf("dates %v: series %q", dates, names)
		}
		if dates != hasText(f, "Date (day 0 = 2026-03-02)") {
			t.Errorf("dates %v: the date axis title is there: %v", dates, !dates)
		}
	}
	if f := ResidualsFigure(p, nil, false, 0, 0); len(f.Panels) != 0 {
		t.Error("a plot without differences")
	}
	if f := ResidualsFigure(p, recs[:1], false, 0, 0); len(f.Panels) != 1 {
		t.Errorf("plates only: %d panels, want 1", len(f.Panels))
	}
}
