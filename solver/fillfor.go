package solver

import (
	"fmt"
	"math"
)

// FillThicknessPath is the path prefix of FillThickness's own arguments in
// its Problems: "fillThickness.stage", "fillThickness.t",
// "fillThickness.level" (project fields keep their own paths).
const FillThicknessPath = "fillThickness"

// FillThickness returns the thickness of the fill of stage p.Loads[stage]
// for which the finished surface reaches level (m above the original top
// of the column) at time t (days): the fill present at t, less the
// settlement predicted at t, equals level. The settlement is the e–log
// one when every layer has a curve, the linear one otherwise.
//
// It solves the project again for each trial thickness (the secant
// method, from the thickness given; usually 3 to 5 solves) to within
// 1 mm, and does not change p. The stage must be a fill with a positive
// thickness placed by t; p must be valid. Errors are Problems, as from
// Solve (arguments under FillThicknessPath), or ErrCanceled.
func FillThickness(p *Project, stage int, t, level float64, opt *Options) (float64, error) {
	var ps Problems
	at := IndexPath("loads", stage)
	switch {
	case stage < 0 || stage >= len(p.Loads):
		ps.Add(JoinPath(FillThicknessPath, "stage"), ErrOutOfRange, fmt.Sprintf("no stage %d", stage+1))
	case p.Loads[stage].Fill == nil || p.Loads[stage].Fill.Thickness <= 0:
		ps.Add(JoinPath(at, "fill"), ErrRequired, "the stage must be a fill with a positive thickness")
	case p.Loads[stage].fraction(t, false) < 1:
		ps.Add(JoinPath(at, "start"), ErrConflict, fmt.Sprintf("the fill is not complete by %g days", t))
	}
	if !(t > 0) || t > MaxTime {
		ps.Add(JoinPath(FillThicknessPath, "t"), ErrOutOfRange, fmt.Sprintf("allowed 0 to %g days, got %g", float64(MaxTime), t))
	}
	if math.IsNaN(level) || math.Abs(level) > MaxFillThickness {
		ps.Add(JoinPath(FillThicknessPath, "level"), ErrOutOfRange, fmt.Sprintf("allowed −%g to %g m, got %g", float64(MaxFillThickness), float64(MaxFillThickness), level))
	}
	if err := ps.Err(); err != nil {
		return 0, err
	}
	q := *p
	q.Loads = append([]Load(nil), p.Loads...)
	fill := *p.Loads[stage].Fill
	q.Loads[stage].Fill = &fill
	surface := func(h float64) (float64, error) {
		fill.Thickness = h
		r, err := Solve(&q, opt)
		if err != nil {
			return 0, err
		}
		ser := r.Consolidation.Series
		s := ser.Settlement
		if len(ser.SettlementElog) > 0 {
			s = ser.SettlementElog
		}
		placed := 0.0
		for _, l := range q.Loads {
			if l.Fill != nil {
				placed += l.fraction(t, false) * l.Fill.Thickness
			}
		}
		return placed - SeriesAt(ser.Time, s, t) - level, nil
	}
	h0 := p.Loads[stage].Fill.Thickness
	f0, err := surface(h0)
	if err != nil {
		return 0, err
	}
	h1 := math.Max(h0-f0, 1e-3)
	for range 30 {
		if math.Abs(h1-h0) <= 1e-3 {
			return h1, nil
		}
		f1, err := surface(h1)
		if err != nil {
			return 0, err
		}
		if f1 == f0 {
			break
		}
		h0, h1, f0 = h1, math.Max(h1-f1*(h1-h0)/(f1-f0), 1e-3), f1
	}
	ps.Add(JoinPath(at, "fill.thickness"), ErrNumerical, "no thickness found that reaches the target level")
	return 0, ps
}
