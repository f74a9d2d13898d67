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

// Validate and Solve refuse bad values with the field path and an Err*
// reason, every problem at once (the file format contract in doc.go and
// model.go, the bounds in bounds.go).
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
		// Extreme but finite values: each is refused at its own path
		// before any work, with the allowed range (bounds.go).
		{"thickness 5e-324", func(p *Project) { p.Layers[0].Thickness = 5e-324 },
			[]decProblem{{"layers[0].thickness", ErrOutOfRange}}},
		{"thickness 1e300", func(p *Project) { p.Layers[1].Thickness = 1e300 },
			[]decProblem{{"layers[1].thickness", ErrOutOfRange}}},
		{"column higher than MaxColumnHeight", func(p *Project) { p.Layers[0].Thickness = 6e3; p.Layers[1].Thickness = 6e3 },
			[]decProblem{{"layers[1].thickness", ErrOutOfRange}}},
		{"k 1e308", func(p *Project) { p.Layers[0].K = 1e308 },
			[]decProblem{{"layers[0].k", ErrOutOfRange}}},
		{"k 5e-324", func(p *Project) { p.Layers[1].K = 5e-324 },
			[]decProblem{{"layers[1].k", ErrOutOfRange}}},
		{"gammaSat 1e308", func(p *Project) { p.Layers[0].GammaSat = 1e308 },
			[]decProblem{{"layers[0].gammaSat", ErrOutOfRange}}},
		{"gammaSat -1e308", func(p *Project) { p.Layers[0].GammaSat = -1e308 },
			[]decProblem{{"layers[0].gammaSat", ErrNotPositive}}},
		{"gamma 1e308", func(p *Project) { p.Layers[1].Gamma = 1e308 },
			[]decProblem{{"layers[1].gamma", ErrOutOfRange}}},
		{"gamma -1e308", func(p *Project) { p.Layers[1].Gamma = -1e308 },
			[]decProblem{{"layers[1].gamma", ErrNotPositive}}},
		{"gammaW 1e308", func(p *Project) { p.GammaW = 1e308 },
			[]decProblem{{"gammaW", ErrOutOfRange}}},
		{"gammaW 5e-324", func(p *Project) { p.GammaW = 5e-324 },
			[]decProblem{{"gammaW", ErrOutOfRange}}},
		{"water table 1e308", func(p *Project) { p.WaterTable = 1e308 },
			[]decProblem{{"waterTable", ErrOutOfRange}}},
		{"water table -1e308", func(p *Project) { p.WaterTable = -1e308 },
			[]decProblem{{"waterTable", ErrOutOfRange}}},
		{"top head 1e308", func(p *Project) { p.Top.Head = spHead(1e308) },
			[]decProblem{{"top.head", ErrOutOfRange}}},
		{"bottom head -1e308", func(p *Project) { p.Bottom.Head = spHead(-1e308) },
			[]decProblem{{"bottom.head", ErrOutOfRange}}},
		{"inflow 1e308", func(p *Project) { p.Bottom = Boundary{Inflow: 1e308} },
			[]decProblem{{"bottom.inflow", ErrOutOfRange}}},
		{"load 1e308", func(p *Project) { p.Loads = []Load{{Q: 1e308}} },
			[]decProblem{{"loads[0].q", ErrOutOfRange}}},
		{"load -1e308", func(p *Project) { p.Loads = []Load{{Q: -1e308}} },
			[]decProblem{{"loads[0].q", ErrOutOfRange}}},
		{"load start 1e308", func(p *Project) { p.Loads = []Load{{Start: 1e308, Q: 10}} },
			[]decProblem{{"loads[0].start", ErrOutOfRange}}},
		{"profile factor 1e308", func(p *Project) { p.Loads = []Load{{Q: 10, Profile: []DepthValue{{Z: 0, Value: 1e308}}}} },
			[]decProblem{{"loads[0].profile[0].value", ErrOutOfRange}}},
		{"profile depth -1e308", func(p *Project) { p.Loads = []Load{{Q: 10, Profile: []DepthValue{{Z: -1e308, Value: 1}}}} },
			[]decProblem{{"loads[0].profile[0].z", ErrOutOfRange}}},
		{"initial excess 1e308", func(p *Project) { p.InitialExcess = []DepthValue{{Z: 0, Value: 1e308}} },
			[]decProblem{{"initialExcess[0].value", ErrOutOfRange}}},
		{"boundary excess -1e308", func(p *Project) { p.Top.Excess = []TimeValue{{T: 0, Value: -1e308}} },
			[]decProblem{{"top.excess[0].value", ErrOutOfRange}}},
		{"boundary excess time 1e308", func(p *Project) { p.Top.Excess = []TimeValue{{T: 1e308, Value: -1}} },
			[]decProblem{{"top.excess[0].t", ErrOutOfRange}}},
		{"mv 1e308", func(p *Project) { p.Layers[0].Mv = 1e308 },
			[]decProblem{{"layers[0].mv", ErrOutOfRange}}},
		{"mv 5e-324", func(p *Project) { p.Layers[0].Mv = 5e-324 },
			[]decProblem{{"layers[0].mv", ErrOutOfRange}}},
		{"e-log curve 1e308", func(p *Project) {
			p.Layers[1].ECurve = &ECurve{E0: 1e308, Cc: 1e308, Cr: 0.05, SigmaP: 1e308}
			p.Layers[1].Calpha = 1e308
		}, []decProblem{{"layers[1].ecurve.e0", ErrOutOfRange}, {"layers[1].ecurve.cc", ErrOutOfRange},
			{"layers[1].ecurve.sigmaP", ErrOutOfRange}, {"layers[1].calpha", ErrOutOfRange}}},
		{"ocr 1e308", func(p *Project) { p.Layers[1].ECurve = &ECurve{E0: 1, Cc: 0.3, Cr: 0.05, OCR: 1e308} },
			[]decProblem{{"layers[1].ecurve.ocr", ErrOutOfRange}}},
		{"times 1e308", func(p *Project) { p.Times = []float64{1, 1e308} },
			[]decProblem{{"times[1]", ErrOutOfRange}}},
		{"piezometer 1e308", func(p *Project) { p.Layers[0].Thickness = -1; p.Piezometers = []float64{1e308} },
			[]decProblem{{"layers[0].thickness", ErrNotPositive}, {"piezometers[0]", ErrOutOfRange}}},
		{"design life 1e308", func(p *Project) { p.DesignLife = 1e308 },
			[]decProblem{{"designLife", ErrOutOfRange}}},
		{"maxSize 5e-324", func(p *Project) { p.Mesh.MaxSize = 5e-324 },
			[]decProblem{{"mesh.maxSize", ErrOutOfRange}}},
		{"maxSize 1e308", func(p *Project) { p.Mesh.MaxSize = 1e308 },
			[]decProblem{{"mesh.maxSize", ErrOutOfRange}}},
		{"minPerLayer beyond the element limit", func(p *Project) { p.Mesh.MinPerLayer = 1 << 40 },
			[]decProblem{{"mesh.minPerLayer", ErrTooLarge}}},
		{"first step 5e-324", func(p *Project) { p.Stepping.FirstStep = 5e-324 },
			[]decProblem{{"stepping.firstStep", ErrOutOfRange}}},
		{"end time 1e308", func(p *Project) { p.Stepping.EndTime = 1e308 },
			[]decProblem{{"stepping.endTime", ErrOutOfRange}}},
		{"damped steps 1<<40", func(p *Project) { p.Stepping.DampedSteps = 1 << 40 },
			[]decProblem{{"stepping.dampedSteps", ErrOutOfRange}}},
		{"plate reading 1e308", func(p *Project) {
			p.Monitoring = &Monitoring{Plates: []Plate{{Readings: []Reading{{T: 1, Value: 1e308}, {T: 1e308, Value: 0.1}}}}}
		}, []decProblem{{"monitoring.plates[0].readings[0].value", ErrOutOfRange}, {"monitoring.plates[0].readings[1].t", ErrOutOfRange}}},
		{"piezometer reading -1e308", func(p *Project) {
			p.Monitoring = &Monitoring{Piezometers: []PiezometerRecord{{Depth: 1e308, Readings: []Reading{{T: 1, Value: -1e308}}}}}
		}, []decProblem{{"monitoring.piezometers[0].depth", ErrOutOfRange}, {"monitoring.piezometers[0].readings[0].value", ErrOutOfRange}}},
		{"NaN and Inf through the Go API", func(p *Project) {
			p.GammaW = nan
			p.Layers[0].GammaSat = inf
			p.Layers[1].Mv = -inf
			p.Loads = []Load{{Start: nan, Q: inf}}
			p.Stepping.FirstStep = inf
		}, []decProblem{{"gammaW", ErrNotFinite}, {"layers[0].gammaSat", ErrNotFinite}, {"layers[1].mv", ErrNotFinite},
			{"loads[0].start", ErrNotFinite}, {"loads[0].q", ErrNotFinite}, {"stepping.firstStep", ErrNotFinite}}},
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
			// Solve refuses the same, before any work.
			r, err := Solve(p, nil)
			if r != nil {
				t.Fatalf("Solve returned a result for a refused project")
			}
			decCheckProblems(t, err, tc.want)
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
