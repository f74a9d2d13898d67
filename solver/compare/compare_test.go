package compare

import (
	"errors"
	"math"
	"os"
	"reflect"
	"testing"

	"porelight/solver"
)

func demo(t *testing.T) *solver.Project {
	t.Helper()
	data, err := os.ReadFile("../../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	p, err := solver.Decode(data)
	if err != nil {
		t.Fatal(err)
	}
	p.Drains = &solver.Drains{Pattern: "triangular", Spacing: 2, Width: 0.1, Thickness: 0.004}
	return p
}

func f(v float64) *float64 { return &v }

// Each option's result equals the solve of the project edited by hand
// (fields set directly on a fresh decode, not through Variant.Apply), and
// the project as given equals its own solve; the project is unchanged.
func TestOptionsEqualHandEdits(t *testing.T) {
	p := demo(t)
	p.Variants = []solver.Variant{
		{Name: "no drains", NoDrains: true},
		{Name: "drains at 1.5 m", DrainSpacing: f(1.5)},
		{Name: "higher surcharge, later lift", Loads: []solver.LoadChange{{}, {Q: f(45), Start: f(150)}}},
		{Name: "stiffer upper clay", Layers: []solver.LayerChange{{}, {Mv: f(0.001), K: f(2.5e-9), Ch: f(0.02)}}},
	}
	before, _ := p.MarshalBinary()
	hand := []func(q *solver.Project){
		func(q *solver.Project) {},
		func(q *solver.Project) { q.Drains = nil },
		func(q *solver.Project) { q.Drains.Spacing = 1.5 },
		func(q *solver.Project) { q.Loads[1].Q, q.Loads[1].Start = 45, 150 },
		func(q *solver.Project) { q.Layers[1].Mv, q.Layers[1].K, q.Layers[1].Ch = 0.001, 2.5e-9, 0.02 },
	}
	if err := solver.Validate(p); err != nil {
		t.Fatal(err)
	}
	out := Solve(p, nil)
	if len(out) != len(hand) {
		t.Fatalf("%d outcomes", len(out))
	}
	for i, o := range out {
		q := demo(t)
		hand[i](q)
		want, err := solver.Solve(q, nil)
		if err != nil {
			t.Fatal(err)
		}
		if o.Problem != "" || !reflect.DeepEqual(o.Result, want) {
			t.Errorf("%s: the option's result differs from the hand-edited solve (%s)", o.Name, o.Problem)
		}
		if wf := Take(want, solver.LastLoadChange(q)); !reflect.DeepEqual(o.Figures, wf) {
			t.Errorf("%s: figures %+v, want %+v", o.Name, o.Figures, wf)
		}
	}
	if after, _ := p.MarshalBinary(); string(after) != string(before) {
		t.Error("solving the options changed the project")
	}
	// Sanity of direction (common practice): closer drains consolidate
	// faster, no drains slower.
	t90 := func(i int) float64 { return *out[i].Figures.T90 }
	if !(t90(2) < t90(0) && t90(0) < t90(1)) {
		t.Errorf("t90: 1.5 m %g, 2 m %g, none %g days", t90(2), t90(0), t90(1))
	}
}

// A bad option is refused at its own field, or at the option naming the
// project's field, with the reason.
func TestOptionProblems(t *testing.T) {
	for _, c := range []struct {
		name string
		v    solver.Variant
		path string
		err  error
	}{
		{"no name", solver.Variant{DrainSpacing: f(1)}, "variants[0].name", solver.ErrRequired},
		{"spacing too small", solver.Variant{Name: "a", DrainSpacing: f(0.001)}, "variants[0].drainSpacing", solver.ErrOutOfRange},
		{"negative k", solver.Variant{Name: "a", Layers: []solver.LayerChange{{}, {K: f(-1)}}}, "variants[0].layers[1].k", solver.ErrNotPositive},
		{"load start unsorted", solver.Variant{Name: "a", Loads: []solver.LoadChange{{}, {}, {Start: f(-5)}}}, "variants[0].loads[2].start", solver.ErrNegative},
		{"fill on a pressure", solver.Variant{Name: "a", Loads: []solver.LoadChange{{FillThickness: f(2)}}}, "variants[0].loads[0].fillThickness", solver.ErrConflict},
		{"too many layers", solver.Variant{Name: "a", Layers: make([]solver.LayerChange, 9)}, "variants[0].layers", solver.ErrOutOfRange},
	} {
		t.Run(c.name, func(t *testing.T) {
			p := demo(t)
			p.Variants = []solver.Variant{c.v}
			ps := solver.AsProblems(solver.Validate(p))
			found := false
			for _, pr := range ps {
				found = found || (pr.Path == c.path && errors.Is(pr.Err, c.err))
			}
			if !found {
				t.Errorf("problems %v, want one at %s: %v", ps, c.path, c.err)
			}
		})
	}
	p := demo(t)
	p.Variants = []solver.Variant{{Name: "a"}, {Name: "a"}}
	if ps := solver.AsProblems(solver.Validate(p)); len(ps) != 1 || ps[0].Path != "variants[1].name" || !errors.Is(ps[0].Err, solver.ErrConflict) {
		t.Errorf("two options of one name: %v", ps)
	}
}

// Five sections of the demo from three columns (the project, a thicker
// upper clay, a higher second lift): each section's settlement at the
// date equals the hand-edited project's solve read at that date
// (primary + secondary, solver.SeriesAt), each span's angular distortion
// is |Δs|/ΔL by hand, and a span over the limit is flagged.
func TestAlignmentProfile(t *testing.T) {
	p := demo(t)
	p.Drains = nil
	p.Variants = []solver.Variant{
		{Name: "thick clay", Layers: []solver.LayerChange{{}, {Thickness: f(6)}}},
		{Name: "high lift", Loads: []solver.LoadChange{{}, {Q: f(50)}}},
	}
	p.Alignment = &solver.Alignment{Date: 1000, Limit: 1.0 / 500, Sections: []solver.Section{
		{Name: "A", Chainage: 0}, {Name: "B", Chainage: 25, Option: "thick clay"}, {Name: "C", Chainage: 50, Option: "thick clay"},
		{Name: "D", Chainage: 80, Option: "high lift"}, {Name: "E", Chainage: 120, Option: solver.BaseOptionName},
	}}
	if err := solver.Validate(p); err != nil {
		t.Fatal(err)
	}
	hand := map[string]func(q *solver.Project){
		"":           func(q *solver.Project) { q.Drains = nil },
		"thick clay": func(q *solver.Project) { q.Drains = nil; q.Layers[1].Thickness = 6 },
		"high lift":  func(q *solver.Project) { q.Drains = nil; q.Loads[1].Q = 50 },
	}
	at := func(opt string) float64 {
		q := demo(t)
		hand[opt](q)
		r, err := solver.Solve(q, nil)
		if err != nil {
			t.Fatal(err)
		}
		s := &r.Consolidation.Series
		return solver.SeriesAt(s.Time, s.Settlement, 1000) + solver.SeriesAt(s.Time, s.Secondary, 1000)
	}
	want := []float64{at(""), at("thick clay"), at("thick clay"), at("high lift"), at("")}
	pts, spans := Profile(p, Solve(p, nil))
	if len(pts) != 5 || len(spans) != 4 {
		t.Fatalf("%d points, %d spans", len(pts), len(spans))
	}
	for i, pt := range pts {
		// Exact: the same solve, read at the same time.
		if pt.Problem != "" || pt.Settlement != want[i] {
			t.Errorf("section %s: %g m, hand-edited solve %g m (%s)", pt.Name, pt.Settlement, want[i], pt.Problem)
		}
	}
	for _, sp := range spans {
		a, b := p.Alignment.Sections[sp.From], p.Alignment.Sections[sp.To]
		d := want[sp.To] - want[sp.From]
		dist := math.Abs(d) / (b.Chainage - a.Chainage)
		if math.Abs(sp.Differential-d) > 1e-15 || math.Abs(sp.Distortion-dist) > 1e-15 || sp.Over != (dist > 1.0/500) {
			t.Errorf("%s–%s: Δs %g, distortion %g, over %v; by hand %g, %g", a.Name, b.Name, sp.Differential, sp.Distortion, sp.Over, d, dist)
		}
	}
	if spans[1].Distortion != 0 {
		t.Errorf("two sections of one column differ: %g", spans[1].Distortion)
	}
	// Bad sections are refused at their fields.
	p.Alignment.Sections[2].Chainage = 10
	p.Alignment.Sections[3].Option = "nowhere"
	ps := solver.AsProblems(solver.Validate(p))
	for _, w := range []struct {
		path string
		err  error
	}{{"alignment.sections[2].chainage", solver.ErrNotSorted}, {"alignment.sections[3].option", solver.ErrOutOfRange}} {
		found := false
		for _, pr := range ps {
			found = found || (pr.Path == w.path && errors.Is(pr.Err, w.err))
		}
		if !found {
			t.Errorf("problems %v, want one at %s", ps, w.path)
		}
	}
}
