package solver

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestRandomStagesWithinBounds solves 300 random single-stage projects
// with areas and fills anywhere inside the physical bounds (bounds.go),
// sizes log-uniform, fixed seed: each solves, and every stage's factor is
// in [0, 1] (a property of a positive load on an elastic half-space and
// of the 2:1 spread; common practice).
func TestRandomStagesWithinBounds(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(1, 2))
	pick := func(lo, hi float64) float64 { // log-uniform
		return math.Exp(math.Log(lo) + rng.Float64()*(math.Log(hi)-math.Log(lo)))
	}
	shapes := []string{"strip", "rectangle", "circle", "embankment"}
	for n := range 300 {
		p := stageClay(pick(0.01, 1000), pick(0.01, 100)-1, Load{})
		p.Mesh.MaxSize = 0
		sh := shapes[rng.IntN(4)]
		a := &Area{Shape: sh}
		if rng.IntN(3) == 0 {
			a.Method = "2:1"
		}
		switch sh {
		case "strip":
			a.Width = pick(MinAreaSize, MaxAreaSize)
		case "rectangle":
			a.Width, a.Length = pick(MinAreaSize, MaxAreaSize), pick(MinAreaSize, MaxAreaSize)
			a.Y = (rng.Float64()*2 - 1) * pick(MinAreaSize, MaxAreaSize)
		case "circle":
			a.Radius = pick(MinAreaSize, MaxAreaSize)
		case "embankment":
			a.Width, a.Slope = pick(MinAreaSize, MaxAreaSize)*float64(rng.IntN(2)), pick(MinSlope, MaxSlope)
		}
		if sh != "circle" {
			a.X = (rng.Float64()*2 - 1) * pick(MinAreaSize, MaxAreaSize)
		}
		l := Load{Start: 0, Ramp: pick(0.01, 100), Area: a}
		if sh == "embankment" || rng.IntN(2) == 0 {
			l.Fill = &Fill{Thickness: pick(0.01, MaxFillThickness), Gamma: pick(1, 50)}
		} else {
			l.Q = pick(1, MaxStress)
		}
		p.Loads = []Load{l}
		r, err := Solve(p, nil)
		if err != nil {
			t.Errorf("%d %+v %+v: %v", n, l, *a, err)
			continue
		}
		for _, st := range r.Consolidation.Stages {
			for _, f := range st.Factor {
				if !(f >= 0 && f <= 1) {
					t.Errorf("%d %+v: factor %g", n, *a, f)
					break
				}
			}
		}
	}
}
