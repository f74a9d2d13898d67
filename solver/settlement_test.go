package solver

import (
	"math"
	"testing"
)

// elogColumn is a thin clay layer at 4 m under sand with γ' = 10 kN/m³, so
// that the clay's in-situ effective stress is 40 kPa at its centre.
func elogColumn(loads []Load) *Project {
	sand := &ECurve{E0: 0.5, Cc: 1e-6, Cr: 1e-7}
	return &Project{
		Format:     Format,
		GammaW:     9.81,
		WaterTable: 0,
		Layers: []Layer{
			{Name: "sand", Thickness: 3.95, GammaSat: 19.81, K: 1e-4, Mv: 1e-8, ECurve: sand},
			{Name: "clay", Thickness: 0.1, GammaSat: 19.81, K: 1e-9, Mv: 1e-3,
				ECurve: &ECurve{E0: 1.2, Cc: 0.45, Cr: 0.05, SigmaP: 60}},
		},
		Top:      Boundary{Drained: true},
		Bottom:   Boundary{Drained: true},
		Loads:    loads,
		Mesh:     MeshSettings{MaxSize: 0.01},
		Stepping: Stepping{EndTime: 2000},
	}
}

// TestElogSettlement checks the final e–log settlement of a clay layer
// crossing σ'p, and that unloading returns along Cr (e–log) and along mv
// (linear), against hand calculations (Terzaghi & Peck 1967).
func TestElogSettlement(t *testing.T) {
	t.Parallel()
	const h, e0 = 0.1, 1.2
	tests := []struct {
		name       string
		loads      []Load
		elog, lin  float64 // m
		hand       string
		settledBy  float64 // a time by which the clay has consolidated, days
		seriesElog bool    // the series' last value equals the final value
	}{
		{
			name:  "load crossing σ'p",
			loads: []Load{{Start: 0, Q: 60}},
			elog:  0.1086366 * h / (1 + e0), // Δe from TestCompress "crossing σ'p"
			lin:   1e-3 * h * 60,
			hand:  "0.1·[0.05·log10(60/40) + 0.45·log10(100/60)]/2.2",
		},
		{
			name:  "load then unload",
			loads: []Load{{Start: 0, Q: 60}, {Start: 1000, Q: -30}},
			elog:  (0.1086366 - 0.0077451) * h / (1 + e0),
			lin:   1e-3 * h * 30,
			hand:  "0.1·[0.1086366 − 0.05·log10(100/70)]/2.2; linear mv·H·(60 − 30)",
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			r, err := Solve(elogColumn(tt.loads), nil)
			if err != nil {
				t.Fatal(err)
			}
			clay := r.Summary.Layers[1]
			// Tolerance 2e-4 relative: σ'0 varies by ±0.5 kPa across the
			// 0.1 m layer, which the hand value at its centre ignores.
			if got := *clay.SettlementElog; math.Abs(got-tt.elog) > 2e-4*tt.elog {
				t.Errorf("e–log settlement %.7f m, want %.7f m (%s; Terzaghi & Peck 1967, ±0.02 %%)", got, tt.elog, tt.hand)
			}
			if got := clay.SettlementLinear; math.Abs(got-tt.lin) > 1e-9 {
				t.Errorf("linear settlement %.7f m, want %.7f m (mv·H·Δσ', Terzaghi 1943, ±1e-9 m)", got, tt.lin)
			}
			// The time series follows the same path when each stage has
			// consolidated: cv = 0.0088 m²/day, H = 0.05 m, t90 ≈ 0.24 day.
			s := r.Consolidation.Series.SettlementElog
			last := s[len(s)-1] - (*r.Summary.Layers[0].SettlementElog)
			if math.Abs(last-tt.elog) > 2e-4*tt.elog {
				t.Errorf("e–log series ends at %.7f m, want %.7f m (±0.02 %%)", last, tt.elog)
			}
		})
	}
}
