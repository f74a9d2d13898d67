package solver

import (
	"errors"
	"math"
	"slices"
	"strings"
	"testing"
)

// monProblem is one expected problem: its path and reason.
type monProblem struct {
	path string
	err  error
}

// monCheck asserts that err holds exactly the problems want (in any order),
// each with its reason, and that every message says something beyond the
// bare reason.
func monCheck(t *testing.T, err error, want []monProblem) {
	t.Helper()
	ps := AsProblems(err)
	if len(want) == 0 {
		if err != nil {
			t.Fatalf("unexpected problems:\n%v", err)
		}
		return
	}
	var got []monProblem
	for _, p := range ps {
		got = append(got, monProblem{p.Path, p.Err})
	}
	for _, w := range want {
		i := slices.IndexFunc(got, func(g monProblem) bool { return g.path == w.path && errors.Is(g.err, w.err) })
		if i < 0 {
			t.Errorf("missing %s: %v\ngot:\n%v", w.path, w.err, err)
			continue
		}
		got = slices.Delete(got, i, i+1)
	}
	for _, g := range got {
		t.Errorf("unexpected %s: %v", g.path, g.err)
	}
	for _, p := range ps {
		if p.Message == p.Err.Error() {
			t.Errorf("%s: message %q gives no detail", p.Path, p.Message)
		}
	}
}

// monProject is valProject (validate_test.go) loaded and carrying a plate
// and a piezometer record.
func monProject() *Project {
	p := valProject()
	p.Loads = []Load{{Start: 0, Ramp: 20, Q: 40}}
	p.Monitoring = &Monitoring{
		Start: "2024-02-20",
		Plates: []Plate{{Name: "P1", Readings: []Reading{
			{T: 0, Value: 0}, {T: 7, Value: 0.004}, {Date: "2024-03-05", Value: 0.009}, {T: 30, Value: 0.015},
		}}},
		Piezometers: []PiezometerRecord{{Name: "U1", Depth: 3.5, Readings: []Reading{
			{T: 1, Value: 30}, {T: 10, Value: 45}, {T: 30, Value: 40},
		}}},
	}
	return p
}

// Validate checks the monitoring records against the file format contract
// of model.go (Monitoring, Plate, PiezometerRecord, Reading): every problem
// at once, each with its path and reason.
func TestValidateMonitoring(t *testing.T) {
	t.Parallel()
	nan := math.NaN()
	plate := "monitoring.plates[0].readings"
	piezo := "monitoring.piezometers[0]"
	cases := []struct {
		name   string
		change func(m *Monitoring)
		want   []monProblem
	}{
		{"valid", func(*Monitoring) {}, nil},
		{"empty record is allowed", func(m *Monitoring) { m.Plates = append(m.Plates, Plate{Name: "P2"}) }, nil},
		{"no start and no dates", func(m *Monitoring) { m.Start = ""; m.Plates[0].Readings[2] = Reading{T: 14, Value: 0.009} }, nil},
		{"unsorted t", func(m *Monitoring) { m.Plates[0].Readings[1].T = 40 },
			[]monProblem{{plate + "[2].date", ErrNotSorted}}},
		{"duplicate t", func(m *Monitoring) { m.Piezometers[0].Readings[1].T = 1 },
			[]monProblem{{piezo + ".readings[1].t", ErrDuplicate}}},
		{"date repeats a t", func(m *Monitoring) { m.Plates[0].Readings[1].T = 14 }, // 2024-03-05 is day 14
			[]monProblem{{plate + "[2].date", ErrDuplicate}}},
		{"negative t", func(m *Monitoring) { m.Plates[0].Readings[0].T = -1 },
			[]monProblem{{plate + "[0].t", ErrNegative}}},
		{"NaN value", func(m *Monitoring) { m.Plates[0].Readings[3].Value = nan },
			[]monProblem{{plate + "[3].value", ErrNotFinite}}},
		{"infinite t", func(m *Monitoring) { m.Piezometers[0].Readings[2].T = math.Inf(1) },
			[]monProblem{{piezo + ".readings[2].t", ErrNotFinite}}},
		{"date without start", func(m *Monitoring) { m.Start = "" },
			[]monProblem{{"monitoring.start", ErrRequired}}},
		{"malformed start", func(m *Monitoring) { m.Start = "20/02/2024" },
			[]monProblem{{"monitoring.start", ErrDate}}},
		{"malformed date", func(m *Monitoring) { m.Plates[0].Readings[2].Date = "2024-02-30" },
			[]monProblem{{plate + "[2].date", ErrDate}}},
		{"t and date", func(m *Monitoring) { m.Plates[0].Readings[2].T = 14 },
			[]monProblem{{plate + "[2].t", ErrConflict}}},
		{"date before start", func(m *Monitoring) { m.Plates[0].Readings[2].Date = "2024-02-19" },
			[]monProblem{{plate + "[2].date", ErrOutOfRange}}},
		{"piezometer below the base", func(m *Monitoring) { m.Piezometers[0].Depth = 5.5 },
			[]monProblem{{piezo + ".depth", ErrOutOfRange}}},
		{"piezometer above the top", func(m *Monitoring) { m.Piezometers[0].Depth = -0.5 },
			[]monProblem{{piezo + ".depth", ErrNegative}}},
		{"Asaoka choices saved", func(m *Monitoring) { m.Asaoka = &AsaokaSettings{From: 30, To: 300, Layers: []int{0}} }, nil},
		{"Asaoka window ends before it starts", func(m *Monitoring) { m.Asaoka = &AsaokaSettings{From: 30, To: 20} },
			[]monProblem{{"monitoring.asaoka.to", ErrOutOfRange}}},
		{"Asaoka window start negative, end beyond the bound", func(m *Monitoring) { m.Asaoka = &AsaokaSettings{From: -1, To: 2 * MaxTime} },
			[]monProblem{{"monitoring.asaoka.from", ErrNegative}, {"monitoring.asaoka.to", ErrOutOfRange}}},
		{"Asaoka window start not finite", func(m *Monitoring) { m.Asaoka = &AsaokaSettings{From: nan} },
			[]monProblem{{"monitoring.asaoka.from", ErrNotFinite}}},
		{"Asaoka layers out of range and repeated", func(m *Monitoring) { m.Asaoka = &AsaokaSettings{Layers: []int{0, 9, 0, -1}} },
			[]monProblem{{"monitoring.asaoka.layers[1]", ErrOutOfRange}, {"monitoring.asaoka.layers[2]", ErrConflict}, {"monitoring.asaoka.layers[3]", ErrOutOfRange}}},
		{"every problem at once", func(m *Monitoring) {
			m.Plates[0].Readings[1].T = 7
			m.Plates[0].Readings[3].T = 3
			m.Plates[0].Readings[0].Value = nan
			m.Piezometers[0].Depth = nan
			m.Piezometers[0].Readings[2].T = 10
		}, []monProblem{
			{plate + "[3].t", ErrNotSorted},
			{plate + "[0].value", ErrNotFinite},
			{piezo + ".depth", ErrNotFinite},
			{piezo + ".readings[2].t", ErrDuplicate},
		}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			p := monProject()
			c.change(p.Monitoring)
			monCheck(t, Validate(p), c.want)
		})
	}
}

// The messages name both times, so a person can find the slip.
func TestValidateMonitoringMessages(t *testing.T) {
	t.Parallel()
	p := monProject()
	p.Monitoring.Plates[0].Readings[3].T = 10
	p.Monitoring.Plates[0].Readings = append(p.Monitoring.Plates[0].Readings, Reading{T: 10, Value: 0.02})
	ps := AsProblems(Validate(p))
	want := []string{
		"monitoring.plates[0].readings[3].t: must be in increasing order (day 10 follows 2024-03-05)",
		"monitoring.plates[0].readings[4].t: repeats the time of the reading before (day 10 again; give each time once)",
	}
	if len(ps) != len(want) {
		t.Fatalf("got %d problems, want %d:\n%v", len(ps), len(want), ps)
	}
	for i, w := range want {
		if ps[i].Error() != w {
			t.Errorf("problem %d:\n got %s\nwant %s", i, ps[i].Error(), w)
		}
	}
}

// ReadingTimes counts days on the Gregorian calendar (common practice:
// 2024 is a leap year, so 1 January to 1 March is 31 + 29 = 60 days).
func TestReadingTimes(t *testing.T) {
	t.Parallel()
	m := &Monitoring{Start: "2024-01-01"}
	cases := []struct {
		name string
		m    *Monitoring
		rs   []Reading
		want []float64
		err  []monProblem
	}{
		{"days", nil, []Reading{{T: 0}, {T: 2.5}}, []float64{0, 2.5}, nil},
		{"dates", m, []Reading{{Date: "2024-01-01"}, {Date: "2024-03-01"}, {Date: "2025-01-01"}, {T: 400}},
			[]float64{0, 60, 366, 400}, nil},
		{"date without start", nil, []Reading{{T: 1}, {Date: "2024-03-01"}}, nil,
			[]monProblem{{"readings[1].date", ErrConflict}}},
		{"bad date and negative t", m, []Reading{{Date: "1.3.2024"}, {T: -2}}, nil,
			[]monProblem{{"readings[0].date", ErrDate}, {"readings[1].t", ErrNegative}}},
		{"before start", m, []Reading{{Date: "2023-12-31"}}, nil,
			[]monProblem{{"readings[0].date", ErrOutOfRange}}},
		{"bad start", &Monitoring{Start: "2024-1-1"}, []Reading{{Date: "2024-03-01"}}, nil,
			[]monProblem{{"monitoring.start", ErrDate}}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			got, err := ReadingTimes(c.m, c.rs)
			monCheck(t, err, c.err)
			if c.err == nil && !slices.Equal(got, c.want) {
				t.Errorf("got %v, want %v", got, c.want)
			}
		})
	}
}

// LastLoadChange is the end of the last ramp, an instantaneous stage's
// start, or the last point of a drained end's pressure history.
func TestLastLoadChange(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name string
		p    Project
		want float64
	}{
		{"no load", Project{}, 0},
		{"ramps and an instant stage", Project{Loads: []Load{{Start: 0, Ramp: 30, Q: 50}, {Start: 100, Q: -10}, {Start: 40, Ramp: 20, Q: 5}}}, 100},
		{"a later ramp", Project{Loads: []Load{{Start: 100, Q: -10}, {Start: 90, Ramp: 25, Q: 5}}}, 115},
		{"drawdown at a drained end", Project{Loads: []Load{{Ramp: 10, Q: 20}}, Bottom: Boundary{Drained: true, Excess: []TimeValue{{0, 0}, {50, -20}}}}, 50},
		{"history at an undrained end is ignored", Project{Loads: []Load{{Ramp: 10, Q: 20}}, Bottom: Boundary{Excess: []TimeValue{{0, 0}, {50, -20}}}}, 10},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			if got := LastLoadChange(&c.p); got != c.want {
				t.Errorf("got %g, want %g", got, c.want)
			}
		})
	}
}

// A reading that gives only a date decodes with t = 0 (omitted), so the
// date alone counts; a t with a date is a conflict.
func TestMonitoringDecode(t *testing.T) {
	t.Parallel()
	p, err := Decode([]byte(`{"format": "porelight/1",
	  "layers": [{"thickness": 4, "gammaSat": 18, "k": 1e-9, "mv": 5e-4}],
	  "top": {"drained": true}, "bottom": {"drained": false},
	  "loads": [{"start": 0, "q": 30}],
	  "monitoring": {"start": "2024-05-01",
	    "plates": [{"name": "P1", "readings": [{"t": 0, "value": 0}, {"date": "2024-05-11", "value": 0.01}, {"t": 12, "date": "2024-05-13", "value": 0.012}]}],
	    "piezometers": [{"name": "U1", "depth": 3, "readings": [{"t": 1, "value": 40}]}]}}`))
	if err != nil {
		t.Fatal(err)
	}
	err = Validate(p)
	monCheck(t, err, []monProblem{{"monitoring.plates[0].readings[2].t", ErrConflict}})
	if !strings.Contains(err.Error(), "give t or date, not both") {
		t.Errorf("message: %v", err)
	}
}
