package nlradial

import (
	"fmt"
	"math"
	"testing"

	"porelight/solver/internal/series"
)

// The limits the equation has closed forms for, within 0.001 for
// 0.01 ≤ T ≤ 1: without drains (β = 0) Davis & Raymond's (1965) Us is
// Terzaghi's U (series.TerzaghiU); near R = 1 the equation is linear and
// Carrillo's (1942) 1 − U = (1 − Uv) exp(−β T) holds for Us and Up; with
// β large against the diffusion, far from the drained face each depth
// follows the pure radial s = R − (R − 1) exp(−β T), so that Up tends to
// 1 − exp(−β T) (checked at β = 400 within the boundary layer's share,
// about 1/√β of the column).
func TestLimits(t *testing.T) {
	t.Parallel()
	ts := []float64{0.01, 0.05, 0.1, 0.3, 1}
	for _, c := range []struct {
		beta, ratio, tol float64
		want             func(T float64) (us, up float64)
	}{
		{0, 5, 1e-3, func(T float64) (float64, float64) { return series.TerzaghiU(T), math.NaN() }},
		{3, 1.0001, 1e-3, func(T float64) (float64, float64) {
			u := 1 - (1-series.TerzaghiU(T))*math.Exp(-3*T)
			return u, u
		}},
		{400, 5, 1.0 / 20, func(T float64) (float64, float64) { return math.NaN(), 1 - math.Exp(-400*T) }},
	} {
		t.Run(fmt.Sprintf("β = %g, R = %g", c.beta, c.ratio), func(t *testing.T) {
			t.Parallel()
			us, up := Degrees(c.beta, c.ratio, ts, 100)
			for i, T := range ts {
				wu, wp := c.want(T)
				if !math.IsNaN(wu) && math.Abs(us[i]-wu) > c.tol {
					t.Errorf("T = %g: Us = %.5f, want %.5f (± %g)", T, us[i], wu, c.tol)
				}
				if !math.IsNaN(wp) && math.Abs(up[i]-wp) > c.tol {
					t.Errorf("T = %g: Up = %.5f, want %.5f (± %g)", T, up[i], wp, c.tol)
				}
			}
		})
	}
}

// Halving the grid changes the degrees by less than 2e-4 at T ≥ 0.01
// (second order in ΔZ, first in ΔT within the stability limit): the
// reference is converged well inside the solver checks' 0.002.
func TestConverged(t *testing.T) {
	t.Parallel()
	ts := []float64{0.01, 0.1, 0.5}
	a, b := Degrees(8, 5, ts, 100)
	c, d := Degrees(8, 5, ts, 200)
	for i := range ts {
		if math.Abs(a[i]-c[i]) > 2e-4 || math.Abs(b[i]-d[i]) > 2e-4 {
			t.Errorf("T = %g: Us %.6f/%.6f, Up %.6f/%.6f on 100/200 intervals", ts[i], a[i], c[i], b[i], d[i])
		}
	}
}
