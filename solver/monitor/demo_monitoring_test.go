package monitor

import (
	"porelight/solver"

	"flag"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"slices"
	"strings"
	"testing"
)

// updateDemo rewrites the monitoring record of testdata/demo.json from
// the solver (go test -run TestDemoMonitoring -update-demo ./solver).
var updateDemo = flag.Bool("update-demo", false, "rewrite the monitoring record of testdata/demo.json from the solver")

const demoFile = "../../testdata/demo.json"

// Demo record: invented, made by this solver with the permeability of
// the upper soft clay (layer 1) multiplied by demoKFactor, plus seeded
// Gaussian noise: demoNoiseS on settlements, demoNoiseU on pore pressures.
const (
	demoKFactor = 1.5
	demoNoiseS  = 0.002 // m
	demoNoiseU  = 1.0   // kPa
	demoStart   = "2024-04-15"
	demoEnd     = 1500 // day of the last reading
	demoPiezo   = 3.5  // m, mid-depth of the upper soft clay
)

// demoSchedule is a reading schedule: every `first` days to day 140, then
// every `mid` days to day 420, then every `late` days to demoEnd.
func demoSchedule(offset, first, mid, late int) []int {
	var ds []int
	for d := offset; d <= demoEnd; {
		ds = append(ds, d)
		switch {
		case d < 140:
			d += first
		case d < 420:
			d += mid
		default:
			d += late
		}
	}
	return ds
}

// writeDemoMonitoring replaces the "monitoring" block at the end of the
// demo file (or adds one) with a record made by the solver; the rest of
// the file is kept as written.
func writeDemoMonitoring(t *testing.T) {
	data, err := os.ReadFile(demoFile)
	if err != nil {
		t.Fatal(err)
	}
	text := string(data)
	if i := strings.Index(text, ",\n  \"monitoring\":"); i >= 0 {
		text = text[:i] + "\n}\n"
	}
	p, err := solver.Decode([]byte(text))
	if err != nil {
		t.Fatal(err)
	}
	q := *p
	q.Layers = slices.Clone(p.Layers)
	q.Layers[1].K *= demoKFactor
	q.Piezometers = []float64{demoPiezo}
	q.Stepping.EndTime = demoEnd + 10
	r, err := solver.Solve(&q, nil)
	if err != nil {
		t.Fatal(err)
	}
	ser := r.Consolidation.Series
	rng := rand.New(rand.NewPCG(2024, 415))
	day0, _ := parseDate(demoStart)
	settle := func(d int) float64 {
		if d == 0 {
			return 0 // the plate's zero reading
		}
		return math.Round((solver.SeriesAt(ser.Time, ser.Settlement, float64(d))+demoNoiseS*rng.NormFloat64())*1000) / 1000
	}
	var p1, p2, u1 []string
	for _, d := range demoSchedule(0, 7, 14, 28) { // read by date
		p1 = append(p1, fmt.Sprintf(`{"date": %q, "value": %.3f}`, day0.AddDate(0, 0, d).Format(solver.DateLayout), settle(d)))
	}
	for _, d := range demoSchedule(0, 14, 21, 35) { // read by days
		p2 = append(p2, fmt.Sprintf(`{"t": %d, "value": %.3f}`, d, settle(d)))
	}
	for _, d := range demoSchedule(1, 7, 14, 28) {
		u := solver.SeriesAt(ser.Time, ser.Piezometers[0].Pore, float64(d)) + demoNoiseU*rng.NormFloat64()
		u1 = append(u1, fmt.Sprintf(`{"t": %d, "value": %.1f}`, d, u))
	}
	join := func(xs []string) string { return strings.Join(xs, ",\n      ") }
	mon := fmt.Sprintf(`,
  "monitoring": {
    "start": %q,
    "plates": [
     {"name": "P1 centre", "readings": [
      %s]},
     {"name": "P2 centre, 8 m east", "readings": [
      %s]}],
    "piezometers": [
     {"name": "U1 upper clay", "depth": %g, "readings": [
      %s]}]
  }
}
`, demoStart, join(p1), join(p2), demoPiezo, join(u1))
	text = strings.TrimSuffix(strings.TrimRight(text, "\n"), "}")
	text = strings.TrimRight(text, "\n") + mon
	if err := os.WriteFile(demoFile, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
}

// The demo's monitoring record validates; Asaoka's method gives a
// forecast for each plate near the final settlement of the project's
// made-up truth (the same column under the same loads, which ends where
// the prediction ends: k changes only the pace); and back-analysis of the
// upper clay's k finds the factor the record was made with, within 3
// standard errors (99.7 % for a normal estimate; common practice).
func TestDemoMonitoring(t *testing.T) {
	if *updateDemo {
		writeDemoMonitoring(t)
	}
	p := readDemo(t)
	if err := solver.Validate(p); err != nil {
		t.Fatal(err)
	}
	m := p.Monitoring
	if m == nil || len(m.Plates) != 2 || len(m.Piezometers) != 1 {
		t.Fatal("the demo should hold two plates and one piezometer record")
	}
	if m.Start != demoStart {
		t.Errorf("start %q, want %q", m.Start, demoStart)
	}
	r, err := solver.Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	final := *r.Summary.SettlementLinear
	for i := range m.Plates {
		a, err := PlateAsaoka(p, i, 0)
		if err != nil {
			t.Errorf("plate %d: Asaoka refused: %v", i, err)
			continue
		}
		// The default window starts at the last load change (day 400),
		// where the rebound after the trim still bends the record, so
		// the forecast is rough: within 15 % of the final settlement and
		// within 3 of its standard errors.
		if math.Abs(a.Final-final) > 0.15*final || math.Abs(a.Final-final) > 3*a.FinalSE {
			t.Errorf("plate %d: Asaoka forecast %.3f ± %.3f m, the record's final settlement is %.3f m", i, a.Final, a.FinalSE, final)
		}
	}
	fr, err := BackFit(p, FitSpec{Layers: []int{1}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if k := fr.Params[0]; !k.Determined || math.Abs(math.Log(k.Multiplier/demoKFactor)) > 3*k.LogSE || !fr.Converged {
		t.Errorf("upper clay k × %.4g ± %.2g, want %g within 3 standard errors (%s)", k.Multiplier, k.SE, demoKFactor, fr.Status)
	}
}

// readDemo decodes the demo project file.
func readDemo(t *testing.T) *solver.Project {
	t.Helper()
	data, err := os.ReadFile(demoFile)
	if err != nil {
		t.Fatal(err)
	}
	p, err := solver.Decode(data)
	if err != nil {
		t.Fatal(err)
	}
	return p
}
