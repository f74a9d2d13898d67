package monitor

import (
	"math"

	"porelight/solver"

	"gonum.org/v1/gonum/stat"
)

// HyperbolicSlope is the slope of the straight part of T/U against T for
// Terzaghi's (1943) degree of consolidation U(T), between about 60 % and
// 90 % consolidation: 0.818 as quoted by Sridharan, Murthy and Prakash
// (1987) (recalled from memory, rounded to 0.82 here); the package tests
// compute it from the series as 0.821 over 60–90 % (0.83 over 50–90 %).
const HyperbolicSlope = 0.82

// HyperbolicResult is the hyperbolic method on one settlement record.
type HyperbolicResult struct {
	// T0 is the time origin, days (see Hyperbolic); Times and
	// Settlements are the readings fitted.
	T0          float64   `json:"t0"`
	Times       []float64 `json:"times"`
	Settlements []float64 `json:"settlements"`
	// Alpha (day/m) and Beta (1/m) are the least squares line
	// τ/s = α + β τ, τ = t − T0.
	Alpha float64 `json:"alpha"`
	Beta  float64 `json:"beta"`
	// Final is the plain hyperbola's asymptote 1/β (Tan 1971), which on
	// a Terzaghi record lies about 20 % above the truth; Corrected is
	// HyperbolicSlope/β (Sridharan et al. 1987), the forecast to set
	// beside Asaoka's.
	Final     float64 `json:"final"`
	Corrected float64 `json:"corrected"`
}

// Hyperbolic applies the hyperbolic method to the readings from day
// from to day to (zero: the last reading), with the time origin t0 and
// zero settlement there: a settlement–time curve s = τ/(α + βτ), τ = t −
// t0, has τ/s = α + βτ, a straight line whose slope β gives the final
// settlement 1/β (Tan 1971, from memory). Terzaghi's U(T) is not a
// hyperbola: T/U is straight only between about 60 % and 90 % and there
// has slope 0.82, not 1, so the plain asymptote overestimates the final
// settlement (Sridharan et al. 1987: by about 1/0.82, 22 %); Corrected
// applies their slope. The origin must be where consolidation starts
// (LoadOrigin: the middle of the loading, the usual correction for
// construction time); an origin later in the consolidation makes the
// correction wrong. It returns nil when fewer than 3 readings are fitted
// or the line does not rise (β ≤ 0).
func Hyperbolic(times, settlements []float64, t0, from, to float64) *HyperbolicResult {
	h := &HyperbolicResult{T0: t0}
	end := math.Inf(1)
	if to > 0 {
		end = to
	}
	var xs, ys []float64
	for j, t := range times {
		if t < from || t > end || t <= t0 || !(settlements[j] > 0) {
			continue
		}
		h.Times = append(h.Times, t)
		h.Settlements = append(h.Settlements, settlements[j])
		xs = append(xs, t-t0)
		ys = append(ys, (t-t0)/settlements[j])
	}
	if len(xs) < 3 {
		return nil
	}
	h.Alpha, h.Beta = stat.LinearRegression(xs, ys, nil, false)
	if !(h.Beta > 0) || math.IsInf(1/h.Beta, 0) {
		return nil
	}
	h.Final = 1 / h.Beta
	h.Corrected = HyperbolicSlope / h.Beta
	return h
}

// LoadOrigin is the time origin of the hyperbolic method for p: the
// middle of the loading stages that add load, weighted by the load each
// adds (for one ramp, its midpoint: the usual correction for
// construction time; common practice). Stages that remove load are left
// out. Zero when no stage adds load.
func LoadOrigin(p *solver.Project) float64 {
	sum, w := 0.0, 0.0
	for _, l := range p.Loads {
		if l.Q > 0 {
			sum += l.Q * (l.Start + l.Ramp/2)
			w += l.Q
		}
	}
	if w == 0 {
		return 0
	}
	return sum / w
}
