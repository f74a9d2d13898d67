package monitor

import (
	"porelight/solver"

	"encoding/json"
	"flag"
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
)

// updateMonitoring rewrites testdata/monitoring/two-clays-record.json from
// the solver (go test -run TestMonitoringRecordFile -update-monitoring).
var updateMonitoring = flag.Bool("update-monitoring", false, "rewrite testdata/monitoring from the solver")

const monitoringRecordFile = "../../testdata/monitoring/two-clays-record.json"

// recordProject is the invented column of the monitoring record file: the
// test column of backfit_test.go with dated plate readings.
func recordProject() *solver.Project {
	p := fitProject()
	p.Title = "Monitoring record: preload over two soft clays"
	p.Notes = "Invented scenario for tests and for trying the monitoring tools. " +
		"The readings were made by this solver with the permeability of the lower clay doubled " +
		"(cv 0.0352 instead of 0.0176 m²/day), plus seeded Gaussian noise of 2 mm on the settlements " +
		"and 1 kPa on the pore pressures. Fitting the lower clay's k should give a multiplier near 2. " +
		"None of these values describes a real site."
	p.Times = []float64{30, 100, 300, 1000}
	p.Piezometers = []float64{5}
	return p
}

// writeMonitoringRecord makes the record file: a plate read weekly by
// date (zero on day 0) and a piezometer read every 10 days by elapsed
// days.
func writeMonitoringRecord(t *testing.T) {
	p := recordProject()
	q := *p
	q.Layers = slices.Clone(p.Layers)
	q.Layers[1].K *= 2
	r, err := solver.Solve(&q, nil)
	if err != nil {
		t.Fatal(err)
	}
	ser := r.Consolidation.Series
	rng := rand.New(rand.NewPCG(2025, 4))
	day0, _ := parseDate("2025-04-07")
	var plate, piezo []string
	for d := 0; d <= 600; d += 7 {
		v := 0.0 // the plate's zero reading
		if d > 0 {
			v = solver.SeriesAt(ser.Time, ser.Settlement, float64(d)) + 0.002*rng.NormFloat64()
		}
		plate = append(plate, fmt.Sprintf(`{"date": %q, "value": %.4f}`, day0.AddDate(0, 0, d).Format(solver.DateLayout), v))
	}
	for d := 2; d <= 600; d += 10 {
		v := solver.SeriesAt(ser.Time, ser.Piezometers[0].Pore, float64(d)) + 1*rng.NormFloat64()
		piezo = append(piezo, fmt.Sprintf(`{"t": %d, "value": %.2f}`, d, v))
	}
	body, err := json.MarshalIndent(p, "", "  ")
	if err != nil {
		t.Fatal(err)
	}
	mon := fmt.Sprintf(`,
  "monitoring": {
    "start": "2025-04-07",
    "plates": [{"name": "Plate P1 (centre line)", "readings": [
      %s]}],
    "piezometers": [{"name": "Piezometer U1", "depth": 5, "readings": [
      %s]}]
  }
}
`, strings.Join(plate, ",\n      "), strings.Join(piezo, ",\n      "))
	out := strings.TrimSuffix(string(body), "\n}") + mon
	if err := os.MkdirAll(filepath.Dir(monitoringRecordFile), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(monitoringRecordFile, []byte(out), 0o644); err != nil {
		t.Fatal(err)
	}
}

// The record file decodes strictly and validates, and back-analysis finds
// the multiplier it was made with: 2 within 3 standard errors (its notes
// give the source: manufactured by the solver).
func TestMonitoringRecordFile(t *testing.T) {
	if *updateMonitoring {
		writeMonitoringRecord(t)
	}
	t.Parallel()
	data, err := os.ReadFile(monitoringRecordFile)
	if err != nil {
		t.Fatal(err)
	}
	p, err := solver.Decode(data)
	if err != nil {
		t.Fatal(err)
	}
	if err := solver.Validate(p); err != nil {
		t.Fatal(err)
	}
	fr, err := BackFit(p, FitSpec{Layers: []int{1}, SettlementSigma: 0.002, PressureSigma: 1}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if m := fr.Params[0]; math.Abs(math.Log(m.Multiplier/2)) > 3*m.LogSE || !fr.Converged {
		t.Errorf("lower clay k × %.4g ± %.2g, want 2 within 3 standard errors (%s)", m.Multiplier, m.SE, fr.Status)
	}
	if _, err := PlateAsaoka(p, 0, 0); err != nil {
		t.Errorf("Asaoka on the plate: %v", err)
	}
}
