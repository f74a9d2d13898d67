package plot

import (
	"math"
	"slices"
	"strings"
	"testing"

	"porelight/solver"
	"porelight/solver/monitor"
)

// A long legend name breaks after a comma when the rest fits, else at a
// space; a short one stays on one line.
func TestLegendLines(t *testing.T) {
	cases := []struct {
		name string
		want []string
	}{
		{"From mv", []string{"From mv"}},
		{"plate P2 centre, 8 m east, measured", []string{"plate P2 centre,", "8 m east, measured"}},
		{"piezometer U1 upper clay measured", []string{"piezometer U1 upper", "clay measured"}},
	}
	for _, c := range cases {
		if got := legendLines(c.name, 124, 11); !slices.Equal(got, c.want) {
			t.Errorf("%q: got %q, want %q", c.name, got, c.want)
		}
	}
}

// Measured points are marks, not a line: one path of as many closed
// shapes as points, and the legend draws the mark alone.
func TestMeasuredMarks(t *testing.T) {
	r := &solver.Result{Consolidation: &solver.Consolidation{Series: solver.Series{
		Time: []float64{0, 10, 100}, Settlement: []float64{0, 0.05, 0.1}}}}
	p := &solver.Project{Monitoring: &solver.Monitoring{Plates: []solver.Plate{
		{Name: "A", Readings: []solver.Reading{{T: 0}, {T: 5, Value: 0.02}, {T: 20, Value: 0.06}, {T: 50, Value: 0.08}}},
		{Name: "B", Readings: []solver.Reading{{T: 30, Value: 0.07}}},
	}}}
	f := SettlementFigure(p, r, 0, 0)
	var names []string
	for _, s := range f.Panels[0].Series {
		names = append(names, s.Name)
	}
	if !slices.Equal(names, []string{"From mv", "plate A, measured", "plate B, measured"}) {
		t.Fatalf("series %q", names)
	}
	a := f.Panels[0].Series[1]
	if a.D != "" || len(a.Pts) != 3 { // day 0 has no place on a log axis
		t.Errorf("plate A: d %q, %d points", a.D, len(a.Pts))
	}
	open, square := 0, 0
	for _, pe := range f.Paths {
		if pe.Stroke == markAt(0).Stroke && pe.Fill == inkBack {
			open = max(open, strings.Count(pe.D, "Z"))
		}
		if pe.Stroke == markAt(1).Stroke && pe.Fill == markAt(1).Stroke {
			square = max(square, strings.Count(pe.D, "Z"))
		}
	}
	if open != 3 || square != 1 {
		t.Errorf("marks drawn: %d open circles (want 3), %d filled squares (want 1)", open, square)
	}
}

// The forecast point of the Asaoka plot lies on the 45° line (both axes
// share one scale) and on the fitted line: s∞ = β0/(1 − β1).
func TestAsaokaFigureGeometry(t *testing.T) {
	a := &monitor.AsaokaResult{Interval: 10, Times: []float64{0, 10, 20, 30},
		Settlements: []float64{0.1, 0.15, 0.175, 0.1875}, Beta0: 0.1, Beta1: 0.5, Final: 0.2, FinalSE: 0.001}
	for j := 1; j < 4; j++ {
		a.Fitted = append(a.Fitted, a.Beta0+a.Beta1*a.Settlements[j-1])
	}
	f := AsaokaFigure("plot-asaoka-0", "Asaoka", a, 0, 0)
	pn := f.Panels[0]
	if pn.Box.W != pn.Box.H || pn.X.Lo != pn.Y.Lo || pn.X.Hi != pn.Y.Hi {
		t.Fatalf("panel %+v, scales %+v %+v: not square", pn.Box, pn.X, pn.Y)
	}
	var fc *Series
	for _, s := range pn.Series {
		if strings.HasPrefix(s.Name, "forecast") {
			fc = s
		}
	}
	if fc == nil || len(fc.Pts) != 1 || fc.Pts[0].DX != 200 || fc.Pts[0].DY != 200 {
		t.Fatalf("forecast series %+v", fc)
	}
	q := fc.Pts[0]
	// On the 45° line: equal distances from the panel's lower left corner.
	if math.Abs((q.X-pn.Box.X)-(pn.Box.Bottom()-q.Y)) > 1e-9 {
		t.Errorf("forecast at (%g, %g) px is off the 45° line", q.X, q.Y)
	}
	if got := AsaokaCSV(a); !strings.Contains(got, "10,150,100,150\n") {
		t.Errorf("CSV:\n%s", got)
	}
}
