package plot

import (
	"encoding/csv"
	"math"
	"strconv"
	"strings"
	"testing"

	"porelight/solver"
)

// stressProject is a 12 m column under a fill embankment off its centre
// line and a later pressure stage over the whole top.
func stressProject() *solver.Project {
	return &solver.Project{
		Format: solver.Format,
		Layers: []solver.Layer{
			{Name: "clay", Thickness: 8, GammaSat: 17, K: 1e-9, Mv: 1e-3},
			{Name: "sand", Thickness: 4, GammaSat: 20, K: 1e-5, Mv: 1e-4},
		},
		WaterTable: 1,
		Top:        solver.Boundary{Drained: true},
		Bottom:     solver.Boundary{Drained: true},
		Loads: []solver.Load{
			{Start: 0, Ramp: 10, Fill: &solver.Fill{Thickness: 2, Gamma: 19},
				Area: &solver.Area{Shape: "embankment", Width: 10, Slope: 2, X: 3}},
			{Start: 100, Q: 10},
		},
		Times: []float64{10, 100},
	}
}

// The added stress plot draws every stage's Δσ/q and Δσ = q·I from the
// result, and the sum of the stages; the CSV gives the same numbers.
func TestStressFigure(t *testing.T) {
	t.Parallel()
	p := stressProject()
	r, err := solver.Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	f := StressFigure(p, r, 800, 500)
	if f.Message != "" || len(f.Panels) != 2 {
		t.Fatalf("message %q, %d panels", f.Message, len(f.Panels))
	}
	if n := len(f.Panels[0].Series); n != 2 {
		t.Errorf("%d Δσ/q curves, want one per stage (2)", n)
	}
	if n := len(f.Panels[1].Series); n != 3 {
		t.Errorf("%d Δσ curves, want 2 stages + their sum", n)
	}
	if name := f.Panels[0].Series[0].Name; !strings.Contains(name, "fill 2 m") || !strings.Contains(name, "embankment") {
		t.Errorf("legend %q", name)
	}
	rows, err := csv.NewReader(strings.NewReader(StressCSV(r))).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	st := r.Consolidation.Stages
	if len(rows) != 1+len(st[0].Depth) || len(rows[0]) != 1+2*len(st) {
		t.Fatalf("CSV %d rows × %d columns", len(rows), len(rows[0]))
	}
	// The last row, at the base: stage 1's factor and q·factor (q = 38 kPa).
	last := rows[len(rows)-1]
	fct, _ := strconv.ParseFloat(last[1], 64)
	ds, _ := strconv.ParseFloat(last[2], 64)
	want := p.Loads[0].Factor(12)
	if math.Abs(fct-want) > 1e-9 || math.Abs(ds-38*want) > 1e-8 {
		t.Errorf("base row %v, want factor %g and Δσ %g kPa", last, want, 38*want)
	}
	if got := StressCSV(nil); got != "depth (m)\n" {
		t.Errorf("CSV without a result: %q", got)
	}
}

// The section sketch draws the embankment and the column to one scale:
// the column's drawn depth over its offset drawn equals 12 m over 3 m.
func TestSectionFigure(t *testing.T) {
	t.Parallel()
	p := stressProject()
	f := SectionFigure(p, 700, 450)
	if f.Message != "" {
		t.Fatalf("message %q", f.Message)
	}
	if f.H > 450 {
		t.Errorf("height %g, want at most the 450 asked", f.H)
	}
	var col *RectEl
	for i := range f.Rects {
		if f.Rects[i].Stroke == inkAxis {
			col = &f.Rects[i]
		}
	}
	if col == nil {
		t.Fatal("no column drawn")
	}
	// The ground spans the layers' rectangles; the first layer starts at
	// the ground line, and its left edge is the sketch's left.
	ground := f.Rects[1]
	cx := ground.X + ground.W/2
	offset := col.X + col.W/2 - cx
	if got := col.H / offset; math.Abs(got-12.0/3) > 1e-9 {
		t.Errorf("depth/offset drawn %g, want 12/3 (one scale)", got)
	}
	p.Loads[0].Area = nil
	if f := SectionFigure(p, 0, 0); f.Message == "" {
		t.Errorf("no loaded area: want a message")
	}
}

// The initial excess profile is drawn beside the stages' added stress,
// and alone when there is no stage.
func TestStressFigureInitialExcess(t *testing.T) {
	t.Parallel()
	p := stressProject()
	p.InitialExcess = []solver.DepthValue{{Z: 0, Value: 30}, {Z: 12, Value: 0}}
	for _, loads := range [][]solver.Load{p.Loads, nil} {
		p.Loads = loads
		r, err := solver.Solve(p, nil)
		if err != nil {
			t.Fatal(err)
		}
		f := StressFigure(p, r, 800, 500)
		if f.Message != "" {
			t.Fatalf("%d stages: message %q", len(loads), f.Message)
		}
		var ini *Series
		for _, s := range f.Panels[1].Series {
			if s.Name == "Initial excess (day 0)" {
				ini = s
			}
		}
		if ini == nil || len(ini.Pts) == 0 {
			t.Fatalf("%d stages: no initial excess curve", len(loads))
		}
		if got := ini.Pts[0]; math.Abs(got.DX-30) > 1e-9 || got.DY != 0 {
			t.Errorf("%d stages: first point %+v, want 30 kPa at the top", len(loads), got)
		}
	}
}
