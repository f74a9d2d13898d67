package solver

import (
	"os"
	"testing"
)

// BenchmarkDemo solves the demo project (testdata/demo.json) with its own
// settings: steady state, consolidation, e–log path and summary.
func BenchmarkDemo(b *testing.B) { benchSolve(b, demoProject(b)) }

// BenchmarkDemoNonlinear is BenchmarkDemo on the non-linear model, the
// page's other choice of model for the same project.
func BenchmarkDemoNonlinear(b *testing.B) {
	p := demoProject(b)
	p.Model = ModelNonlinear
	benchSolve(b, p)
}

// benchSolve times Solve of p.
func benchSolve(b *testing.B, p *Project) {
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Solve(p, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkLargeColumn is the cost of 100,000 linear elements over 1,000
// uniform time steps (one factorisation, 1,000 solves), with no e–log
// curves and no output times.
func BenchmarkLargeColumn(b *testing.B) {
	p := &Project{
		Format: Format,
		Layers: []Layer{{Thickness: 100, GammaSat: 18, K: 1e-9, Mv: 1e-3}},
		Top:    Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads:    []Load{{Start: 0, Q: 100}},
		Mesh:     MeshSettings{MaxSize: 100.0 / 100_000},
		Stepping: Stepping{FirstStep: 10, Growth: 1, EndTime: 10_000, DampedSteps: -1},
	}
	b.ReportAllocs()
	for b.Loop() {
		r, err := Solve(p, nil)
		if err != nil {
			b.Fatal(err)
		}
		if r.Stats.Steps != 1000 {
			b.Fatalf("%d steps, want 1000", r.Stats.Steps)
		}
	}
}

// BenchmarkLargeColumnQuadratic is BenchmarkLargeColumn with 100,000
// quadratic elements (200,001 nodes).
func BenchmarkLargeColumnQuadratic(b *testing.B) {
	p := &Project{
		Format: Format,
		Layers: []Layer{{Thickness: 100, GammaSat: 18, K: 1e-9, Mv: 1e-3}},
		Top:    Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads:    []Load{{Start: 0, Q: 100}},
		Mesh:     MeshSettings{Order: 2, MaxSize: 100.0 / 100_000},
		Stepping: Stepping{FirstStep: 10, Growth: 1, EndTime: 10_000, DampedSteps: -1},
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Solve(p, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// softClayColumn is a 10 m normally consolidated clay under a 100 kPa
// preload, drained at both ends, with 2,000 linear elements over the
// default steps: on the linear model (mv derived from the curve) or on the
// non-linear one (Ck = 0.5 e0).
func softClayColumn(model string) *Project {
	return &Project{
		Format: Format, Model: model,
		Layers: []Layer{{Thickness: 10, GammaSat: 16, K: 1e-9,
			ECurve: &ECurve{E0: 1.8, Cc: 0.6, Cr: 0.06, Ck: 0.9}}},
		WaterTable: 0,
		Top:        Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads: []Load{{Start: 0, Q: 100}},
		Mesh:  MeshSettings{MaxSize: 10.0 / 2000},
	}
}

// BenchmarkSoftClayLinear and BenchmarkSoftClayNonlinear compare the cost
// of the two models on one column (issue 11's goal: non-linear ≤ 3× the
// linear cost per node-step). Both report ns per node-step.
func BenchmarkSoftClayLinear(b *testing.B)    { benchSoftClay(b, ModelLinear) }
func BenchmarkSoftClayNonlinear(b *testing.B) { benchSoftClay(b, ModelNonlinear) }

func benchSoftClay(b *testing.B, model string) {
	p := softClayColumn(model)
	b.ReportAllocs()
	var r *Result
	for b.Loop() {
		var err error
		if r, err = Solve(p, nil); err != nil {
			b.Fatal(err)
		}
	}
	work := float64(r.Stats.Nodes * r.Stats.Steps)
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/work, "ns/node-step")
	b.ReportMetric(float64(r.Stats.Iterations)/float64(r.Stats.Steps), "iter/step")
}

// BenchmarkDrains is BenchmarkLargeColumn at 10,000 elements with band
// drains (smear and well resistance) through the whole column, without
// the reference solve; BenchmarkNoDrains is the same column without them.
func BenchmarkDrains(b *testing.B) {
	benchDrains(b, &Drains{Pattern: "triangular", Spacing: 1.5, Width: 0.1, Thickness: 0.004, SmearRatio: 3, SmearK: 3, Qw: 3e-6})
}

// BenchmarkNoDrains is BenchmarkDrains without the drains.
func BenchmarkNoDrains(b *testing.B) { benchDrains(b, nil) }

func benchDrains(b *testing.B, d *Drains) {
	p := &Project{
		Format: Format,
		Layers: []Layer{{Thickness: 100, GammaSat: 18, K: 1e-9, Mv: 1e-3, KhKv: 2}},
		Top:    Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads:    []Load{{Start: 0, Q: 100}},
		Mesh:     MeshSettings{MaxSize: 100.0 / 10_000},
		Stepping: Stepping{FirstStep: 10, Growth: 1, EndTime: 10_000, DampedSteps: -1},
		Drains:   d,
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Solve(p, &Options{NoDrainReference: true}); err != nil {
			b.Fatal(err)
		}
	}
}

// demoProject decodes testdata/demo.json.
func demoProject(tb testing.TB) *Project {
	tb.Helper()
	return projectFile(tb, "../testdata/demo.json")
}

// projectFile decodes the project file at path.
func projectFile(tb testing.TB, path string) *Project {
	tb.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		tb.Fatal(err)
	}
	p, err := Decode(data)
	if err != nil {
		tb.Fatal(err)
	}
	return p
}

// embankmentProject reads the example testdata/embankment.json: two
// embankment lifts off the centre line, with submergence.
func embankmentProject(tb testing.TB) *Project {
	tb.Helper()
	return projectFile(tb, "../testdata/embankment.json")
}

// BenchmarkEmbankment solves the embankment example: the whole solve, of
// which BenchmarkEmbankmentStress is the stress-spread set-up.
func BenchmarkEmbankment(b *testing.B) { benchSolve(b, embankmentProject(b)) }

// BenchmarkEmbankmentStress is the stress-spread set-up of the embankment
// example as a solve does it: every stage's I(z) at every node
// (stageFactors, which the time loop, the submergence and the result's
// stage profiles share). Compare with
// BenchmarkEmbankment for its share of a solve.
func BenchmarkEmbankmentStress(b *testing.B) {
	p := embankmentProject(b)
	c := newColumn(p)
	b.ReportAllocs()
	for b.Loop() {
		c.factors = nil
		_ = newSubmergence(p, ResolveGammaW(p), c.stageFactors())
		_ = c.stageStresses()
	}
}

// BenchmarkEmbankment1D solves the embankment example with each lift as
// the same pressure over the whole top (no area, no submergence): the
// difference from BenchmarkEmbankment is everything loads with geometry
// cost, the set-up and the submergence followed at every step.
func BenchmarkEmbankment1D(b *testing.B) {
	p := embankmentProject(b)
	for i, l := range p.Loads {
		p.Loads[i] = Load{Start: l.Start, Ramp: l.Ramp, Q: l.Pressure()}
	}
	benchSolve(b, p)
}
