package solver

import (
	"errors"
	"math"
	"reflect"
	"strings"
	"testing"
)

// valProject is a small valid project; each case changes one copy.
func valProject() *Project {
	return &Project{
		Format: Format,
		Layers: []Layer{
			{Name: "sand", Thickness: 2, GammaSat: 19, K: 1e-5, Mv: 1e-4},
			{Name: "clay", Thickness: 3, GammaSat: 17, K: 1e-9, Mv: 5e-4},
		},
		WaterTable: 1,
		Top:        Boundary{Drained: true},
		Bottom:     Boundary{Drained: true},
	}
}

// Validate refuses bad values with the field path and an Err* reason, every
// problem at once (the file format contract in doc.go and model.go).
func TestValidateRefuses(t *testing.T) {
	t.Parallel()
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		name   string
		change func(p *Project)
		want   []decProblem
	}{
		{"negative thickness", func(p *Project) { p.Layers[0].Thickness = -2 },
			[]decProblem{{"layers[0].thickness", ErrNotPositive}}},
		{"zero k", func(p *Project) { p.Layers[1].K = 0 },
			[]decProblem{{"layers[1].k", ErrNotPositive}}},
		{"negative k", func(p *Project) { p.Layers[1].K = -1e-9 },
			[]decProblem{{"layers[1].k", ErrNotPositive}}},
		{"NaN k", func(p *Project) { p.Layers[1].K = nan },
			[]decProblem{{"layers[1].k", ErrNotFinite}}},
		{"infinite k", func(p *Project) { p.Layers[0].K = inf },
			[]decProblem{{"layers[0].k", ErrNotFinite}}},
		{"NaN thickness", func(p *Project) { p.Layers[0].Thickness = nan },
			[]decProblem{{"layers[0].thickness", ErrNotFinite}}},
		{"NaN water table", func(p *Project) { p.WaterTable = nan },
			[]decProblem{{"waterTable", ErrNotFinite}}},
		{"empty layers", func(p *Project) { p.Layers = []Layer{} },
			[]decProblem{{"layers", ErrRequired}}},
		{"no layers", func(p *Project) { p.Layers = nil },
			[]decProblem{{"layers", ErrRequired}}},
		{"wrong format", func(p *Project) { p.Format = "porelight/0" },
			[]decProblem{{"format", ErrFormat}}},
		{"other units", func(p *Project) { p.Units = &Units{Length: "ft", K: "m/s"} },
			[]decProblem{{"units.length", ErrOutOfRange}}},
		{"gammaSat not above gammaW", func(p *Project) { p.Layers[1].GammaSat = 9.81 },
			[]decProblem{{"layers[1].gammaSat", ErrOutOfRange}}},
		{"gammaSat not above a given gammaW", func(p *Project) { p.GammaW = 10; p.Layers[1].GammaSat = 9.9 },
			[]decProblem{{"layers[1].gammaSat", ErrOutOfRange}}},
		{"negative gammaW", func(p *Project) { p.GammaW = -9.81 },
			[]decProblem{{"gammaW", ErrNotPositive}}},
		{"no mv and no e-log curve", func(p *Project) { p.Layers[0].Mv = 0 },
			[]decProblem{{"layers[0].mv", ErrRequired}}},
		{"cr above cc", func(p *Project) { p.Layers[1].ECurve = &ECurve{E0: 1, Cc: 0.1, Cr: 0.2} },
			[]decProblem{{"layers[1].ecurve.cr", ErrOutOfRange}}},
		{"sigmaP and ocr both", func(p *Project) { p.Layers[1].ECurve = &ECurve{E0: 1, Cc: 0.5, Cr: 0.05, SigmaP: 50, OCR: 2} },
			[]decProblem{{"layers[1].ecurve.ocr", ErrConflict}}},
		{"head at an undrained end", func(p *Project) { p.Bottom = Boundary{Head: spHead(2)} },
			[]decProblem{{"bottom.head", ErrConflict}}},
		{"inflow at a drained end", func(p *Project) { p.Top.Inflow = 1e-8 },
			[]decProblem{{"top.inflow", ErrConflict}}},
		{"inflow with no drained end", func(p *Project) { p.Top = Boundary{}; p.Bottom = Boundary{Inflow: 1e-8} },
			[]decProblem{{"bottom.inflow", ErrConflict}}},
		{"NaN head", func(p *Project) { p.Top.Head = spHead(nan) },
			[]decProblem{{"top.head", ErrNotFinite}}},
		{"times out of order", func(p *Project) { p.Times = []float64{10, 5} },
			[]decProblem{{"times[1]", ErrNotSorted}}},
		{"piezometer below the base", func(p *Project) { p.Piezometers = []float64{5.5} },
			[]decProblem{{"piezometers[0]", ErrOutOfRange}}},
		{"element order 3", func(p *Project) { p.Mesh.Order = 3 },
			[]decProblem{{"mesh.order", ErrOutOfRange}}},
		{"NaN maxSize", func(p *Project) { p.Mesh.MaxSize = nan },
			[]decProblem{{"mesh.maxSize", ErrNotFinite}}},
		{"mesh too fine", func(p *Project) { p.Mesh.MaxSize = 1e-6 },
			[]decProblem{{"mesh.maxSize", ErrTooLarge}}},
		// 20,000 linear elements (5 m / 0.00025 m) × 200 output times
		// hold about 4.1·10⁶ numbers, just over MaxStored; each alone is
		// well inside MaxElements and MaxTimes.
		{"result too large", func(p *Project) {
			p.Mesh.MaxSize = 0.00025
			p.Loads = []Load{{Q: 10}}
			p.Times = nil
			for i := range 200 {
				p.Times = append(p.Times, float64(i+1))
			}
		}, []decProblem{{"times", ErrTooLarge}}},
		{"negative minPerLayer", func(p *Project) { p.Mesh.MinPerLayer = -1 },
			[]decProblem{{"mesh.minPerLayer", ErrNegative}}},
		{"theta below 0.5", func(p *Project) { p.Stepping.Theta = 0.4 },
			[]decProblem{{"stepping.theta", ErrOutOfRange}}},
		{"target degree 1", func(p *Project) { p.TargetDegree = 1 },
			[]decProblem{{"targetDegree", ErrOutOfRange}}},
		// Every problem at once, each with its own path.
		{"several problems", func(p *Project) {
			p.Layers[0].Thickness = -1
			p.Layers[1].K = nan
			p.Layers[1].GammaSat = 0
			p.Times = []float64{10, 5}
			p.Mesh.Order = 3
		}, []decProblem{
			{"layers[0].thickness", ErrNotPositive}, {"layers[1].k", ErrNotFinite},
			{"layers[1].gammaSat", ErrNotPositive}, {"times[1]", ErrNotSorted}, {"mesh.order", ErrOutOfRange},
		}},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := valProject()
			tc.change(p)
			decCheckProblems(t, Validate(p), tc.want)
		})
	}
}

// A valid project gives a nil error interface (not a typed nil), and
// Validate leaves the project as it was.
func TestValidateAccepts(t *testing.T) {
	t.Parallel()
	p := valProject()
	p.Top.Head = spHead(-1)
	p.Bottom = Boundary{Inflow: 1e-9}
	p.GammaW = 10
	p.WaterTable = -2 // water standing above the top
	before := valProject()
	before.Top.Head, before.Bottom, before.GammaW, before.WaterTable = spHead(-1), p.Bottom, 10, -2
	if err := Validate(p); err != nil {
		t.Fatalf("Validate: %v", err)
	}
	if !reflect.DeepEqual(p, before) {
		t.Errorf("Validate changed the project")
	}
	if err := Validate(nil); !errors.Is(err, ErrRequired) {
		t.Errorf("Validate(nil) = %v, want ErrRequired", err)
	}
}

// Problems behaves like go/scanner's ErrorList: the zero value is ready,
// Err is nil when empty, the text holds one line per problem, and
// errors.Is/As reach every problem and its reason.
func TestProblems(t *testing.T) {
	t.Parallel()
	var ps Problems
	if ps.Err() != nil {
		t.Errorf("nil Problems: Err() = %v, want nil", ps.Err())
	}
	if (Problems{}).Err() != nil {
		t.Errorf("empty Problems: Err() not nil")
	}
	ps.Add("layers[1].k", ErrNotPositive, num(-1e-9))
	ps.Add("format", ErrFormat, "")
	err := ps.Err()
	if err == nil {
		t.Fatal("Err() = nil with two problems")
	}
	if want := "layers[1].k: must be > 0 (got -1e-09)\nformat: is not a supported format"; err.Error() != want {
		t.Errorf("Error() = %q, want %q", err.Error(), want)
	}
	if !errors.Is(err, ErrNotPositive) || !errors.Is(err, ErrFormat) || errors.Is(err, ErrSyntax) {
		t.Errorf("errors.Is does not see exactly the two reasons")
	}
	var p Problem
	if !errors.As(err, &p) || p.Path != "layers[1].k" {
		t.Errorf("errors.As(Problem) = %+v", p)
	}
	ps.Sort()
	if ps[0].Path != "format" {
		t.Errorf("Sort: first path %q, want format", ps[0].Path)
	}
	if got := AsProblems(err); len(got) != 2 {
		t.Errorf("AsProblems(Problems) has %d entries, want 2", len(got))
	}
	if got := AsProblems(errors.New("boom")); len(got) != 1 || got[0].Path != "" || !strings.Contains(got[0].Message, "boom") {
		t.Errorf("AsProblems(plain error) = %+v", got)
	}
	if AsProblems(nil) != nil {
		t.Errorf("AsProblems(nil) not nil")
	}
}
