package solver

import (
	"math"
	"testing"
)

// TestLinearSwellingMv loads a clay with mv = 1e-3 1/kPa by 100 kPa,
// removes 60 kPa once it has drained and checks the settlement by hand
// (the oedometer idealisation of common practice: s = mv·Δσ'·H loading,
// mvUnload·Δσ'·H unloading): 4 m · (1e-3·100 − 2e-4·60) = 0.352 m, within
// 0.2 % of the loading settlement (each stage lasts Tv = 4 of the loading
// cv, 0.1 % from complete). While loading, the iterated loop gives what
// the linear stepper gives (checked against Terzaghi by
// TestTerzaghiUniform) within 1e-6 of the loading settlement, from the
// first step on (at t = 0 the stepper counts the half element beside the
// drained end at once).
func TestLinearSwellingMv(t *testing.T) {
	t.Parallel()
	const h = 4.0
	plain := uniformClay(h, false)
	cvLoad := clayCv
	stage := 4 * h * h / cvLoad
	plain.Loads = []Load{{Start: 0, Q: 100}, {Start: stage, Q: -60}}
	plain.Stepping.EndTime = 2 * stage
	swell := *plain
	swell.Layers = []Layer{plain.Layers[0]}
	swell.Layers[0].MvUnload = 2e-4
	rp, err := Solve(plain, nil)
	if err != nil {
		t.Fatal(err)
	}
	rs, err := Solve(&swell, nil)
	if err != nil {
		t.Fatal(err)
	}
	sp, ss := rp.Consolidation.Series, rs.Consolidation.Series
	load := 1e-3 * 100 * h
	for _, c := range []struct {
		name      string
		s         Series
		want      float64
		tolerance float64
	}{
		{"rebound along mvUnload", ss, h * (1e-3*100 - 2e-4*60), 2e-3 * load},
		{"rebound along mv without it", sp, h * (1e-3*100 - 1e-3*60), 2e-3 * load},
	} {
		got := c.s.Settlement[len(c.s.Settlement)-1]
		if math.Abs(got-c.want) > c.tolerance {
			t.Errorf("%s: %.5f m, want %.5f m (hand-worked, ±%.2g m)", c.name, got, c.want, c.tolerance)
		}
	}
	if got := rs.Summary.Layers[0].SettlementLinear; math.Abs(got-h*(0.1-0.012)) > 1e-9 {
		t.Errorf("final linear settlement %.6f m, want %.6f m along the drained path", got, h*(0.1-0.012))
	}
	for i := 1; i < len(ss.Time) && ss.Time[i] < stage; i++ {
		if d := math.Abs(ss.Settlement[i] - sp.Settlement[i]); d > 1e-6*load {
			t.Fatalf("loading stage at %.4g days: %.7f m with the swelling mv, %.7f m without", ss.Time[i], ss.Settlement[i], sp.Settlement[i])
		}
	}
}
