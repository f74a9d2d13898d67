package solver

import (
	"math"
	"testing"

	"porelight/solver/internal/series"
)

// TestPoreRatiosTerzaghi checks the pore pressure ratio on one uniform
// layer drained at the top under one instantaneous load q: Δσ = q at
// every depth, so Δu/Δσ is Terzaghi's u/u0 (series.TerzaghiExcess,
// Terzaghi 1943) and the degree of dissipation 1 − u/u0 (the peak is q at
// the load). Tolerance 0.002 (measured 0.0004 with the default mesh and
// stepping). Readings made from the same closed form plus the steady
// pore pressure give back their ratio to 1e-9, and their dissipation
// relative to the first reading, the stage's largest measured excess.
func TestPoreRatiosTerzaghi(t *testing.T) {
	t.Parallel()
	const h, q, z = 5.0, 50.0, 3.5
	p := &Project{
		Format: Format,
		Layers: []Layer{{Name: "clay", Thickness: h, GammaSat: 18, K: 1e-9, Mv: 1e-3}},
		Top:    Boundary{Drained: true}, Bottom: Boundary{Drained: false},
		Loads: []Load{{Start: 0, Q: q}}, Piezometers: []float64{z},
	}
	cv := 1e-9 * 86400 / (1e-3 * DefaultGammaW)
	w := func(day float64) float64 { return series.TerzaghiExcess(z/h, cv*day/(h*h)) }
	steady := DefaultGammaW * z // hydrostatic from the top
	days := []float64{30, 300, 3000}
	var rs []Reading
	for _, d := range days {
		rs = append(rs, Reading{T: d, Value: steady + q*w(d)})
	}
	p.Monitoring = &Monitoring{Piezometers: []PiezometerRecord{{Name: "PZ", Depth: z, Readings: rs}}}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	prs, err := PoreRatios(p, r)
	if err != nil || len(prs) != 1 {
		t.Fatalf("%v, %d piezometers", err, len(prs))
	}
	pr := prs[0]
	worst := 0.0
	for j, day := range pr.Time {
		if day <= 0 {
			continue
		}
		worst = math.Max(worst, math.Abs(pr.Ratio[j]-w(day)))
		if math.Abs(pr.Ratio[j]-w(day)) > 0.002 || math.Abs(pr.Dissipation[j]-(1-pr.Ratio[j])) > 1e-12 {
			t.Fatalf("day %g: ratio %.5f, Terzaghi %.5f (tolerance 0.002); dissipation %.5f", day, pr.Ratio[j], w(day), pr.Dissipation[j])
		}
	}
	t.Logf("predicted ratio: largest difference from Terzaghi %.2g", worst)
	if pr.Record != "PZ" || len(pr.MeasuredTime) != len(days) {
		t.Fatalf("measured: %+v", pr)
	}
	for k, d := range days {
		if math.Abs(pr.MeasuredRatio[k]-w(d)) > 1e-9 || math.Abs(pr.MeasuredDissipation[k]-(1-w(d)/w(days[0]))) > 1e-9 {
			t.Errorf("reading on day %g: ratio %.6f (hand %.6f), dissipation %.6f (hand %.6f)", d, pr.MeasuredRatio[k], w(d), pr.MeasuredDissipation[k], 1-w(d)/w(days[0]))
		}
	}
}
