package monitor

import (
	"math"

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
	// T0 and S0 are the origin: the day the load stops changing and the
	// settlement then (interpolated in the record, or its first reading
	// at or after T0). Times and Settlements are the readings fitted.
	T0          float64   `json:"t0"`
	S0          float64   `json:"s0"`
	Times       []float64 `json:"times"`
	Settlements []float64 `json:"settlements"`
	// Alpha (day/m) and Beta (1/m) are the least squares line
	// τ/Δs = α + β τ, τ = t − T0, Δs = s − S0.
	Alpha float64 `json:"alpha"`
	Beta  float64 `json:"beta"`
	// Final is the plain hyperbola's asymptote S0 + 1/β (Tan 1971), which
	// on a Terzaghi record lies about 20 % above the truth; Corrected is
	// S0 + HyperbolicSlope/β (Sridharan et al. 1987), the forecast to set
	// beside Asaoka's.
	Final     float64 `json:"final"`
	Corrected float64 `json:"corrected"`
}

// Hyperbolic applies the hyperbolic method to the readings of a from
// the start of its window to its end, with the origin at afterTime (the
// last change of load): a settlement–time curve s = S0 + τ/(α + βτ) has
// τ/(s − S0) = α + βτ, a straight line whose slope β gives the final
// settlement S0 + 1/β (Tan 1971, from memory). Terzaghi's U(T) is not a
// hyperbola: T/U is straight only between about 60 % and 90 % and there
// has slope 0.82, not 1, so the plain asymptote overestimates the final
// settlement (Sridharan et al. 1987: by about 1/0.82, 22 %); Corrected
// applies their slope. It returns nil when the window holds fewer than 3
// readings after the origin or the line does not rise (β ≤ 0).
func Hyperbolic(times, settlements []float64, afterTime, from, to float64) *HyperbolicResult {
	if len(times) == 0 {
		return nil
	}
	h := &HyperbolicResult{T0: afterTime}
	k := 0
	for k < len(times) && times[k] < afterTime {
		k++
	}
	switch {
	case k == len(times):
		return nil
	case k == 0 || times[k] == afterTime:
		h.T0, h.S0 = times[k], settlements[k]
	default:
		h.S0 = interpAt(times[k-1], settlements[k-1], times[k], settlements[k], afterTime)
	}
	end := math.Inf(1)
	if to > 0 {
		end = to
	}
	var xs, ys []float64
	for j, t := range times {
		if t < from || t > end || t <= h.T0 || settlements[j] <= h.S0 {
			continue
		}
		h.Times = append(h.Times, t)
		h.Settlements = append(h.Settlements, settlements[j])
		xs = append(xs, t-h.T0)
		ys = append(ys, (t-h.T0)/(settlements[j]-h.S0))
	}
	if len(xs) < 3 {
		return nil
	}
	h.Alpha, h.Beta = stat.LinearRegression(xs, ys, nil, false)
	if !(h.Beta > 0) || math.IsInf(1/h.Beta, 0) {
		return nil
	}
	h.Final = h.S0 + 1/h.Beta
	h.Corrected = h.S0 + HyperbolicSlope/h.Beta
	return h
}
