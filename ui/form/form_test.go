package form

import (
	"math"
	"reflect"
	"strconv"
	"strings"
	"testing"

	"porelight/solver"
)

// column is a small valid invented project: two clays drained at both
// ends under one load, with an e–log curve, a pressure history, one
// settlement plate and one piezometer record.
func column() *solver.Project {
	head := 1.5
	return &solver.Project{
		Format: solver.Format,
		Title:  "Form test column",
		Layers: []solver.Layer{
			{Name: "upper clay", Thickness: 3, GammaSat: 17, K: 2e-9, Mv: 8e-4},
			{Name: "lower clay", Thickness: 4, GammaSat: 17.5, K: 1e-9, Mv: 5e-4,
				ECurve: &solver.ECurve{E0: 1.1, Cc: 0.4, Cr: 0.05}},
			{Name: "base clay", Thickness: 2, GammaSat: 18, K: 5e-10, Mv: 3e-4},
		},
		WaterTable: 0.5,
		Top:        solver.Boundary{Drained: true, Head: &head, Excess: []solver.TimeValue{{T: 0, Value: 0}, {T: 50, Value: 5}}},
		Bottom:     solver.Boundary{Drained: true},
		Loads:      []solver.Load{{Start: 0, Ramp: 30, Q: 60}, {Start: 100, Ramp: 10, Q: 20}},
		Times:      []float64{10, 100},
		Monitoring: &solver.Monitoring{
			Start: "2024-01-01",
			Plates: []solver.Plate{
				{Name: "P1", Readings: []solver.Reading{{T: 0, Value: 0}, {T: 7, Value: 0.01}, {Date: "2024-01-15", Value: 0.02}}},
				{Name: "P2", Readings: []solver.Reading{{T: 0, Value: 0}, {T: 9, Value: 0.02}}},
			},
			Piezometers: []solver.PiezometerRecord{{Name: "U1", Depth: 5, Readings: []solver.Reading{{T: 10, Value: 50}}}},
		},
	}
}

func newValid(t *testing.T) *Form {
	t.Helper()
	f := New(column())
	if !f.Valid() {
		t.Fatalf("the test column has problems: %v %v", f.ProblemsUnder(""), f.Other())
	}
	return f
}

// Every placeholder that names a number is the solver's default, read
// through the solver's resolvers on a project that leaves the field out
// and written in the unit the input shows. A path the form treats as
// defaulted without a case here fails the test, so a new default cannot
// slip past it.
func TestPlaceholdersAreSolverDefaults(t *testing.T) {
	t.Parallel()
	p := column() // leaves every default out
	p.Drains = &solver.Drains{Pattern: "square", Spacing: 2, Diameter: 0.05, Design: &solver.DrainDesign{Time: 100}}
	st, ms := solver.ResolveStepping(p), solver.ResolveMesh(p)
	dc := solver.ResolveDrains(p)
	ch, kh := solver.LayerCh(&p.Layers[0], p.Layers[0].Mv, solver.ResolveGammaW(p))
	cases := map[string]struct {
		resolved float64 // what the solver uses, file unit
		unit     float64 // one unit of the input's placeholder, in the file's unit
		suffix   string  // text after the number in the placeholder
	}{
		"gammaW":               {solver.ResolveGammaW(p), 1, ""},                      // kN/m³
		"targetDegree":         {solver.ResolveTargetDegree(p), 0.01, ""},             // % of a fraction
		"designLife":           {solver.ResolveDesignLife(p), solver.DaysPerYear, ""}, // years of days
		"mesh.order":           {float64(ms.Order), 1, ""},
		"mesh.minPerLayer":     {float64(ms.MinPerLayer), 1, ""},
		"stepping.theta":       {st.Theta, 1, ""},
		"stepping.dampedSteps": {float64(st.DampedSteps), 1, ""},
		"stepping.growth":      {st.Growth, 1, ""},
		"stepping.firstStep":   {st.FirstStep, 1.0 / (24 * 60), " min"}, // minutes of days
		"top.inflow":           {p.Top.Inflow, 1, " (sealed)"},          // zero: no inflow
		"bottom.inflow":        {p.Bottom.Inflow, 1, " (sealed)"},
		"drains.smearRatio":    {dc.SmearRatio, 1, ""},
		"drains.smearK":        {dc.SmearK, 1, ""},
		"drains.top":           {dc.Top, 1, ""},
		"drains.design.degree": {solver.ResolveDesignDegree(p.Drains.Design), 0.01, ""}, // % of a fraction
		"layers[0].khKv":       {kh / p.Layers[0].K, 1, ""},
		// Monte Carlo: a COV left empty is no spread (Draw's factor is 1).
		"uncertainty.runs":          {float64(solver.ResolveRuns(p.Uncertainty)), 1, ""},
		"uncertainty.layers[0].k":   {0, 0.01, " (fixed)"},
		"uncertainty.layers[0].mv":  {0, 0.01, " (fixed)"},
		"uncertainty.layers[0].ch":  {0, 0.01, " (fixed)"},
		"uncertainty.layers[0].kMv": {0, 1, ""},
	}
	// Placeholders that are words; what the solver does instead is
	// checked where it can be.
	words := map[string]func(t *testing.T, text string){
		"mesh.maxSize": func(t *testing.T, text string) {
			n, err := strconv.Atoi(strings.TrimPrefix(text, "H/"))
			// Exact: the same division as ResolveMesh's.
			if err != nil || solver.ColumnHeight(p)/float64(n) != ms.MaxSize {
				t.Errorf("%q: the solver's element size is %g m for H = %g m", text, ms.MaxSize, solver.ColumnHeight(p))
			}
		},
		"stepping.endTime": func(t *testing.T, text string) {
			if text != "auto" || st.EndTime != solver.EndTime(p) || !(st.EndTime > solver.LastLoadChange(p)) {
				t.Errorf("%q: the solver's end time is %g days, after the last load change on day %g", text, st.EndTime, solver.LastLoadChange(p))
			}
		},
		"drains.qw": func(t *testing.T, text string) {
			if dc.Mu(dc.Tip, kh) != dc.Mu0 {
				t.Errorf("%q: the solver adds well resistance without qw", text)
			}
		},
		"drains.depth": func(t *testing.T, text string) {
			if text != "base" || dc.Tip != solver.ColumnHeight(p) {
				t.Errorf("%q: the solver's tip is at %g m, the base at %g m", text, dc.Tip, solver.ColumnHeight(p))
			}
		},
		"layers[0].ch": func(t *testing.T, text string) {
			cv := solver.ResolveGammaW(p) // placeholder: kh/kv·cv
			cv = p.Layers[0].K * 86400 / (p.Layers[0].Mv * cv)
			if math.Abs(ch-kh/p.Layers[0].K*cv) > 1e-12*ch {
				t.Errorf("%q: the solver's ch is %g m²/day, kh/kv × cv = %g", text, ch, kh/p.Layers[0].K*cv)
			}
		},
		"alignment.date": func(t *testing.T, text string) {
			if text != "design life" || solver.ResolveAlignmentDate(p) != solver.ResolveDesignLife(p) {
				t.Errorf("%q: the profile's day is %g, the design life %g", text, solver.ResolveAlignmentDate(p), solver.ResolveDesignLife(p))
			}
		},
		"alignment.limit": nil, // zero: compare.Profile flags nothing (solver/compare tests)
		"uncertainty.date": func(t *testing.T, text string) {
			if text != "end of loading" || solver.ResolveUncertaintyDate(p) != solver.LastLoadChange(p) {
				t.Errorf("%q: the date is day %g, the last load change day %g", text, solver.ResolveUncertaintyDate(p), solver.LastLoadChange(p))
			}
		},
		"layers[0].gamma": nil, "layers[0].mv": nil, "layers[0].calpha": nil,
		"layers[0].ecurve.sigmaP": nil, "layers[0].ecurve.ocr": nil,
		"layers[0].mvUnload": nil, "layers[0].calphaCc": nil, "layers[0].calphaReduced": nil,
		"layers[0].ecurve.pop": nil, "layers[0].ecurve.ck": nil,
	}
	seen := 0
	for field := range pageFields {
		path := strings.ReplaceAll(field, "[#]", "[0]")
		text, ok := defaultHint(path)
		if !ok {
			continue
		}
		seen++
		if check, ok := words[path]; ok {
			if check != nil {
				check(t, text)
			}
			continue
		}
		tc, ok := cases[path]
		if !ok {
			t.Errorf("%s: placeholder %q has no case in this test", path, text)
			continue
		}
		num, found := strings.CutSuffix(text, tc.suffix)
		x, err := strconv.ParseFloat(num, 64)
		if !found || err != nil {
			t.Errorf("%s: placeholder %q is not a number followed by %q", path, text, tc.suffix)
			continue
		}
		// Tolerance 1e-12 relative: FormatNumber writes 12 significant digits.
		if got := x * tc.unit; math.Abs(got-tc.resolved) > 1e-12*math.Abs(tc.resolved) {
			t.Errorf("%s: placeholder %q means %.15g in the file's unit, the solver uses %.15g", path, text, got, tc.resolved)
		}
		// The input converts typed text with the same unit.
		if s := scaleOf(path); tc.suffix == "" && math.Abs(s*tc.unit-1) > 1e-15 {
			t.Errorf("%s: the input's scale is %g, the placeholder's unit %g of the file's", path, s, tc.unit)
		}
	}
	if want := len(cases) + len(words); seen != want {
		t.Errorf("%d defaulted inputs on the page, %d cases here", seen, want)
	}
}

// What was typed is kept as typed; the draft takes the value when the
// text reads, and keeps its old one otherwise.
func TestEditKeepsTypedText(t *testing.T) {
	t.Parallel()
	cases := []struct {
		path, text string
		problem    string  // "" for none, "*" for any (Validate words it)
		value      float64 // in the draft, file's unit
	}{
		{"layers[1].k", "2,5e-9", "", 2.5e-9},
		{"layers[1].k", "−3e-9", "*", -3e-9},
		{"layers[1].k", "abc", "not a number", 1e-9},
		{"targetDegree", "90", "", 0.9},
		{"designLife", "10", "", 10 * solver.DaysPerYear},
		{"mesh.minPerLayer", "2.5", "must be a whole number", 0},
		{"monitoring.plates[0].readings[1].value", "12", "", 0.012}, // mm → m
		{"monitoring.plates[0].readings[1].t", "3.2.2024", "", 0},   // a date: t goes to 0
	}
	for _, tc := range cases {
		t.Run(tc.path+"="+tc.text, func(t *testing.T) {
			t.Parallel()
			f := newValid(t)
			f.Edit(tc.path, tc.text)
			if got := f.Text(tc.path); got != tc.text {
				t.Errorf("Text = %q, want the text as typed", got)
			}
			if got := f.Problem(tc.path); (tc.problem == "") != (got == "") || tc.problem != "*" && !strings.Contains(got, tc.problem) {
				t.Errorf("Problem = %q, want %q", got, tc.problem)
			}
			v, _ := getNumber(f.Draft(), tc.path)
			if math.Abs(v-tc.value) > 1e-12*math.Abs(tc.value) { // decimal text → binary: 1e-12 relative
				t.Errorf("draft value %g, want %g", v, tc.value)
			}
		})
	}
	f := newValid(t)
	f.Edit("monitoring.plates[0].readings[1].t", "3.2.2024")
	if d := f.Draft().Monitoring.Plates[0].Readings[1].Date; d != "2024-02-03" {
		t.Errorf("date typed as 3.2.2024 stored as %q, want 2024-02-03", d)
	}
}

// Problems from Validate land on the input showing their path.
func TestProblemsMappedToFields(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name   string
		change func(p *solver.Project)
		input  string // "" when no input shows it (Other)
		prefix string // start of the message
	}{
		{"layer value", func(p *solver.Project) { p.Layers[2].Mv = -1 }, "layers[2].mv", ""},
		{"e–log value", func(p *solver.Project) { p.Layers[1].ECurve.Cr = 1 }, "layers[1].ecurve.cr", ""},
		{"list item", func(p *solver.Project) { p.Times = []float64{10, 5} }, "times", "value 2: "},
		{"reading date", func(p *solver.Project) { p.Monitoring.Plates[0].Readings[2].Date = "2023-12-01" },
			"monitoring.plates[0].readings[2].t", ""},
		{"profile point", func(p *solver.Project) { p.InitialExcess = []solver.DepthValue{{Z: 2}, {Z: 1}} }, "initialExcess[1].z", ""},
		{"stage area", func(p *solver.Project) { p.Loads[0].Area = &solver.Area{Shape: "strip"} }, "loads[0].area.width", ""},
		{"no input", func(p *solver.Project) { p.Units = &solver.Units{Length: "ft"} }, "", ""},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := column()
			tc.change(p)
			f := New(p)
			if tc.input == "" {
				if len(f.Other()) == 0 || len(f.ProblemsUnder("")) != 0 {
					t.Errorf("want the problem in Other only: inputs %v, other %v", f.ProblemsUnder(""), f.Other())
				}
				return
			}
			if got := f.ProblemsUnder(""); len(got) != 1 || got[0].Path != tc.input || !strings.HasPrefix(got[0].Message, tc.prefix) {
				t.Errorf("problems %v (other %v), want one at %s starting %q", got, f.Other(), tc.input, tc.prefix)
			}
			if f.Valid() || f.Count() != 1 {
				t.Errorf("Valid %v, Count %d; want false, 1", f.Valid(), f.Count())
			}
		})
	}
}

// Structural edits move typed text and its problem with the row.
func TestStructuralEditsRenumber(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name     string
		typed    string // path the bad text is typed into
		edit     func(f *Form)
		want     string // path it is found at afterwards ("" when gone)
		lostPath string // path that must no longer hold it
	}{
		{"remove a layer above", "layers[2].k", func(f *Form) { f.RemoveLayer(0) }, "layers[1].k", "layers[2].k"},
		{"remove its layer", "layers[1].k", func(f *Form) { f.RemoveLayer(1) }, "", "layers[1].k"},
		{"insert a layer above", "layers[1].ecurve.cc", func(f *Form) { f.AddLayer(0) }, "layers[2].ecurve.cc", "layers[1].ecurve.cc"},
		{"move the layer up", "layers[2].k", func(f *Form) { f.MoveLayer(2, -1) }, "layers[1].k", "layers[2].k"},
		{"remove a load above", "loads[1].q", func(f *Form) { f.RemoveLoad(0) }, "loads[0].q", "loads[1].q"},
		{"remove a history point", "top.excess[1].value", func(f *Form) { f.RemoveExcess("top", 0) }, "top.excess[0].value", "top.excess[1].value"},
		{"remove a plate above", "monitoring.plates[1].readings[1].value", func(f *Form) { f.RemoveRecord(Plates, 0) },
			"monitoring.plates[0].readings[1].value", "monitoring.plates[1].readings[1].value"},
		{"remove a reading above", "monitoring.plates[0].readings[2].value", func(f *Form) { f.RemoveReading(Plates, 0, 1) },
			"monitoring.plates[0].readings[1].value", "monitoring.plates[0].readings[2].value"},
		{"another plate's reading stays", "monitoring.plates[1].readings[1].value", func(f *Form) { f.RemoveReading(Plates, 0, 0) },
			"monitoring.plates[1].readings[1].value", ""},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			f := newValid(t)
			f.Edit(tc.typed, "x1")
			tc.edit(f)
			if tc.want != "" && (f.Text(tc.want) != "x1" || f.Problem(tc.want) != "not a number") {
				t.Errorf("at %s: text %q, problem %q; want the typed text and its problem", tc.want, f.Text(tc.want), f.Problem(tc.want))
			}
			if tc.lostPath != "" && f.Text(tc.lostPath) == "x1" {
				t.Errorf("%s still shows the typed text", tc.lostPath)
			}
			if tc.want == "" && !f.Valid() {
				t.Errorf("the removed row's problem stayed: %v", f.ProblemsUnder(""))
			}
		})
	}
}

func TestRemapKeys(t *testing.T) {
	t.Parallel()
	m := map[string]int{
		"layers[0].k": 0, "layers[1]": 1, "layers[2].ecurve.cc": 2, "layers": 9,
		"loads[1].q": 3, "monitoring.plates[1].readings[0].t": 4, "not a path[": 5,
	}
	RemapKeys(m, "layers", Removed(1))
	RemapKeys(m, "monitoring.plates", Removed(0))
	want := map[string]int{
		"layers[0].k": 0, "layers[1].ecurve.cc": 2, "layers": 9,
		"loads[1].q": 3, "monitoring.plates[0].readings[0].t": 4, "not a path[": 5,
	}
	if !reflect.DeepEqual(m, want) {
		t.Errorf("got %v, want %v", m, want)
	}
}

func TestIndexlessAndInputFor(t *testing.T) {
	t.Parallel()
	cases := []struct{ path, indexless, input, prefix string }{
		{"layers[12].ecurve.cc", "layers[#].ecurve.cc", "layers[12].ecurve.cc", ""},
		{"times[3]", "times[#]", "times", "value 4: "},
		{"piezometers[0]", "piezometers[#]", "piezometers", "value 1: "},
		{"monitoring.plates[0].readings[2].date", "monitoring.plates[#].readings[#].date", "monitoring.plates[0].readings[2].t", ""},
		{"layers[x].k", "layers[x].k", "layers[x].k", ""}, // not a path: left alone
	}
	for _, tc := range cases {
		if got := indexless(tc.path); got != tc.indexless {
			t.Errorf("indexless(%q) = %q, want %q", tc.path, got, tc.indexless)
		}
		if in, pre := inputFor(tc.path); in != tc.input || pre != tc.prefix {
			t.Errorf("inputFor(%q) = %q, %q; want %q, %q", tc.path, in, pre, tc.input, tc.prefix)
		}
	}
}

// New and Model copy deeply: no pointer, slice or map of the copy is
// shared with the original, whatever fields Project grows.
func TestCopiesAreDeep(t *testing.T) {
	t.Parallel()
	p := column()
	p.Units = &solver.Units{Length: "m", K: "m/s"}
	p.Piezometers = []float64{2}
	p.InitialExcess = []solver.DepthValue{{Z: 0, Value: 1}}
	p.Loads[0].Profile = []solver.DepthValue{{Z: 0, Value: 1}}
	tip := 0
	p.Drains = &solver.Drains{Pattern: "square", Spacing: 2, Diameter: 0.05, ToLayer: &tip, Design: &solver.DrainDesign{Time: 9}}
	f := New(p)
	for name, q := range map[string]*solver.Project{"New": f.Draft(), "Model": f.Model()} {
		if shared := sharedStorage(reflect.ValueOf(p).Elem(), reflect.ValueOf(q).Elem(), "project"); shared != "" {
			t.Errorf("%s shares %s with the original", name, shared)
		}
	}
	if d, m := f.Draft(), f.Model(); sharedStorage(reflect.ValueOf(d).Elem(), reflect.ValueOf(m).Elem(), "project") != "" {
		t.Errorf("Model shares storage with the draft")
	}
	// The check itself must be able to fail.
	q := *p
	if sharedStorage(reflect.ValueOf(p).Elem(), reflect.ValueOf(&q).Elem(), "project") == "" {
		t.Errorf("a shallow copy passed the check")
	}
}

// sharedStorage names the first non-empty slice or non-nil pointer that
// a and b (values of one type) share, or returns "".
func sharedStorage(a, b reflect.Value, at string) string {
	switch a.Kind() {
	case reflect.Pointer:
		if a.IsNil() || b.IsNil() {
			return ""
		}
		if a.Pointer() == b.Pointer() {
			return at
		}
		return sharedStorage(a.Elem(), b.Elem(), at)
	case reflect.Slice:
		if a.Len() == 0 || b.Len() == 0 {
			return ""
		}
		if a.Pointer() == b.Pointer() {
			return at
		}
		for i := range min(a.Len(), b.Len()) {
			if s := sharedStorage(a.Index(i), b.Index(i), solver.IndexPath(at, i)); s != "" {
				return s
			}
		}
	case reflect.Struct:
		for i := range a.NumField() {
			if s := sharedStorage(a.Field(i), b.Field(i), solver.JoinPath(at, a.Type().Field(i).Name)); s != "" {
				return s
			}
		}
	}
	return ""
}
