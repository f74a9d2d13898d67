package plot

import (
	"math"
	"strings"
	"testing"

	"porelight/solver"
)

func drainedProject() *solver.Project {
	return &solver.Project{
		Format: solver.Format,
		Layers: []solver.Layer{{Name: "clay", Thickness: 12, GammaSat: 18, K: 1e-9, Mv: 1e-3}, {Name: "sand", Thickness: 3, GammaSat: 20, K: 1e-5, Mv: 1e-5}},
		Top:    solver.Boundary{Drained: true}, Bottom: solver.Boundary{Drained: true},
		Loads:  []solver.Load{{Q: 50}},
		Times:  []float64{10, 100},
		Drains: &solver.Drains{Pattern: "triangular", Spacing: 1.5, Width: 0.1, Thickness: 0.004, Depth: 9},
	}
}

// The layer strip draws the drains from the top to their tip: a path in
// the drains' colour ending at the tip's depth on the strip's scale
// (exact pixels).
func TestStripDrawsDrains(t *testing.T) {
	t.Parallel()
	p := drainedProject()
	r, err := solver.Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	f := IsochronesFigure(p, r, 640, 420)
	var found bool
	top, bottom := float64(depthTop), f.H-depthBottomM
	tipY := top + (bottom-top)*9/15
	for _, pe := range f.Paths {
		if pe.Stroke == inkDrain && strings.Contains(pe.D, "V"+coord(tipY)) {
			found = true
		}
	}
	if !found {
		t.Errorf("no drain line ends at the tip (y = %s)", coord(tipY))
	}
	q := drainedProject()
	q.Drains = nil
	for _, pe := range IsochronesFigure(q, r, 640, 420).Paths {
		if pe.Stroke == inkDrain {
			t.Error("a column without drains shows drains")
		}
	}
}

// The degree plot adds Uv and Uh when the result has them.
func TestDegreeShowsDrains(t *testing.T) {
	t.Parallel()
	p := drainedProject()
	r, err := solver.Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	f := DegreeFigure(p, r, 640, 420)
	if n := len(f.allSeries()); n != 4 {
		t.Errorf("%d series, want Us, Up, Uv, Uh", n)
	}
	if csv := DegreeCSV(r); !strings.Contains(csv, "Uv vertical flow only") {
		t.Error("the degree CSV has no Uv column")
	}
}

// The plan is to scale: the dashed circle of the unit cell has the
// radius De/2 in the plan's pixels per metre (1e-9 px), and a
// triangular pattern of 1.5 m shows about (3.2)² × 2/√3 ≈ 12 drains per
// 3.2 spacings squared (at least 9); a bad pattern gives a message.
func TestDrainPlan(t *testing.T) {
	t.Parallel()
	p := drainedProject()
	f := DrainPlanFigure(p, 400, 300)
	if f.Message != "" {
		t.Fatal(f.Message)
	}
	box := Box{12, 30, f.W - 24, f.H - 76}
	scale := math.Min(box.W, box.H) / (3.2 * 1.5)
	de := 1.5 * math.Sqrt(2*math.Sqrt(3)/math.Pi)
	want := circlePath(box.X+box.W/2, box.Y+box.H/2, de/2*scale)
	var circle, marks bool
	for _, pe := range f.Paths {
		circle = circle || (pe.D == want && pe.Dash != "none")
		if pe.Fill == inkDrain {
			marks = strings.Count(pe.D, "Z") >= 9
		}
	}
	if !circle || !marks {
		t.Errorf("unit cell circle %v, drains %v", circle, marks)
	}
	if !hasText(f, "drains enlarged to 2 px") {
		t.Error("a 4 mm band at this scale is enlarged without saying so")
	}
	p.Drains.Pattern = "hex"
	if DrainPlanFigure(p, 400, 300).Message == "" {
		t.Error("a bad pattern drew a plan")
	}
}
