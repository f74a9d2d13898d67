package solver

import (
	"fmt"
	"math"
)

// PoreRatio is the construction control of one piezometer: the ratio of
// its excess pore pressure to the added total stress, Δu/Δσ (the
// pore pressure ratio of common practice), and the degree of dissipation
// of each stage, predicted and, where a record stands at its depth,
// measured.
type PoreRatio struct {
	Depth float64 `json:"depth"` // m
	// Time, Ratio and Dissipation are the predicted figures at the
	// solve's times where the added stress is at least RatioFloor of its
	// largest magnitude at this depth (a ratio over a vanishing Δσ says
	// nothing). Dissipation is 1 − Δu/Δu_peak, with Δu_peak the largest
	// excess since the start of the stage under way (Project.Loads), 0
	// until an excess has built up.
	Time        []float64 `json:"time"`
	Ratio       []float64 `json:"ratio"`
	Dissipation []float64 `json:"dissipation"`
	// Record names the piezometer record at this depth (empty without
	// one); MeasuredTime, MeasuredRatio and MeasuredDissipation are its
	// readings as the same figures, the excess being the reading less the
	// steady pore pressure there, over the predicted Δσ at the reading's
	// time, and over the largest measured excess since the start of the
	// stage (so a stage's first reading counts as its peak).
	Record              string    `json:"record,omitempty"`
	MeasuredTime        []float64 `json:"measuredTime,omitempty"`
	MeasuredRatio       []float64 `json:"measuredRatio,omitempty"`
	MeasuredDissipation []float64 `json:"measuredDissipation,omitempty"`
}

// RatioFloor is the fraction of the largest added stress at a piezometer
// below which PoreRatios gives no ratio.
const RatioFloor = 0.01

// PoreRatios gives the pore pressure ratio and the degree of dissipation
// at every piezometer of a solve r of p (nil without consolidation).
func PoreRatios(p *Project, r *Result) ([]PoreRatio, error) {
	if r == nil || r.Consolidation == nil {
		return nil, nil
	}
	ser := &r.Consolidation.Series
	starts := []float64{0}
	for _, l := range p.Loads {
		starts = append(starts, l.Start)
	}
	stageOf := func(t float64) float64 { // the start of the stage under way at t
		s := 0.0
		for _, v := range starts {
			if v <= t && v > s {
				s = v
			}
		}
		return s
	}
	var out []PoreRatio
	for _, pz := range ser.Piezometers {
		pr := PoreRatio{Depth: pz.Depth}
		big := 0.0
		for _, a := range pz.Added {
			big = math.Max(big, math.Abs(a))
		}
		// The running peak of the excess within the stage under way.
		peak := make([]float64, len(ser.Time))
		cur, stage := 0.0, math.Inf(-1)
		for j, t := range ser.Time {
			if s := stageOf(t); s != stage {
				stage, cur = s, 0
			}
			cur = math.Max(cur, pz.Excess[j])
			peak[j] = cur
		}
		dissipation := func(excess, pk float64) float64 {
			if pk <= 0 {
				return 0
			}
			return 1 - excess/pk
		}
		for j, t := range ser.Time {
			if big == 0 || math.Abs(pz.Added[j]) < RatioFloor*big {
				continue
			}
			pr.Time = append(pr.Time, t)
			pr.Ratio = append(pr.Ratio, pz.Excess[j]/pz.Added[j])
			pr.Dissipation = append(pr.Dissipation, dissipation(pz.Excess[j], peak[j]))
		}
		if p.Monitoring != nil {
			steady := 0.0
			if len(pz.Pore) > 0 {
				steady = pz.Pore[0] - pz.Excess[0]
			}
			for i, rec := range p.Monitoring.Piezometers {
				if !SameDepth(rec.Depth, pz.Depth) {
					continue
				}
				ts, err := ReadingTimesAt(p.Monitoring, rec.Readings, fmt.Sprintf("monitoring.piezometers[%d].readings", i))
				if err != nil {
					return nil, err
				}
				pr.Record = rec.Name
				if pr.Record == "" {
					pr.Record = fmt.Sprintf("piezometer %d", i+1)
				}
				cur, stage := 0.0, math.Inf(-1)
				for k, t := range ts {
					ex := rec.Readings[k].Value - steady
					if s := stageOf(t); s != stage {
						stage, cur = s, 0
					}
					cur = math.Max(cur, ex)
					added := SeriesAt(ser.Time, pz.Added, t)
					if big == 0 || math.Abs(added) < RatioFloor*big {
						continue
					}
					pr.MeasuredTime = append(pr.MeasuredTime, t)
					pr.MeasuredRatio = append(pr.MeasuredRatio, ex/added)
					pr.MeasuredDissipation = append(pr.MeasuredDissipation, dissipation(ex, cur))
				}
				break
			}
		}
		out = append(out, pr)
	}
	return out, nil
}
