package soil

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestFollowIsMoveTo: Follow, Move and Toward move (or, Toward, only
// try) each marked point as MoveTo does, to the bit, along random paths
// that load, unload, reload past the peak, fall below MinEffective and
// stay put, in small steps (the series for the logarithm) and large ones
// (math.Log10); Follow writes the settlement, Move the compression MoveTo
// returns, Toward what Point.Toward returns; unmarked points and their
// dst entries are left alone; Point.Beyond agrees with a comparison
// against Peak along the way (at the target, at the peak itself, just
// past it and for NaN). The reference is MoveTo, itself checked
// against Compress (Terzaghi & Peck 1967) in TestPointFollowsCompress.
func TestFollowIsMoveTo(t *testing.T) {
	t.Parallel()
	rnd := rand.New(rand.NewPCG(1, 1))
	curves := []Curve{{E0: 1.2, Cc: 0.45, Cr: 0.05}, {E0: 0.9, Cc: 0.25, Cr: 0.03}, {E0: 0.6, Cc: 0.02, Cr: 0}}
	const n = 40
	var got, moved, tried, want [n]Point
	move := make([]bool, n)
	to, dst, dm, dt := make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n)
	for i := range n {
		s0 := 5 + 100*rnd.Float64()
		got[i] = NewPoint(curves[i%len(curves)], 0.1+rnd.Float64(), s0, s0*(1+rnd.Float64()))
		want[i] = got[i]
		move[i] = i%7 != 3
		to[i] = s0
	}
	moved = got
	for step := range 400 {
		for i := range n {
			switch r := rnd.Float64(); {
			case r < 0.1: // stays
			case r < 0.2:
				to[i] *= 0.5 + rnd.Float64() // a large move
			case r < 0.22:
				to[i] = -rnd.Float64() // below MinEffective
			default:
				to[i] = max(to[i], 1) * (1 + 0.018*(rnd.Float64()-0.4)) // within 1 %
			}
			dst[i], dm[i], dt[i] = -1, -1, -1
		}
		tried = want
		Toward(dt, tried[:], to, move)
		Follow(dst, got[:], to, move)
		Move(dm, moved[:], to, move)
		for i := range n {
			if !move[i] {
				if got[i] != want[i] || moved[i] != want[i] || tried[i] != want[i] || dst[i] != -1 || dm[i] != -1 || dt[i] != -1 {
					t.Fatalf("step %d: point %d is not marked but changed", step, i)
				}
				continue
			}
			if w := want[i].Toward(to[i]); dt[i] != w || tried[i] != want[i] {
				t.Fatalf("step %d: point %d: Toward wrote %v and left %v, Point.Toward gives %v and leaves %v", step, i, dt[i], tried[i], w, want[i])
			}
			for _, v := range []float64{to[i], want[i].Peak(), math.Nextafter(want[i].Peak(), math.Inf(1)), math.NaN()} {
				if got, w := want[i].Beyond(v), v > want[i].Peak(); got != w {
					t.Fatalf("step %d: point %d: Beyond(%v) = %v, %v > Peak() %v is %v", step, i, v, got, v, want[i].Peak(), w)
				}
			}
			de := want[i].MoveTo(to[i])
			if got[i] != want[i] || moved[i] != want[i] {
				t.Fatalf("step %d: point %d followed to %v, moved to %v, MoveTo to %v", step, i, got[i], moved[i], want[i])
			}
			if s := want[i].Settlement(); dst[i] != s {
				t.Fatalf("step %d: point %d: Follow wrote %v, its settlement is %v", step, i, dst[i], s)
			}
			if dm[i] != de {
				t.Fatalf("step %d: point %d: Move wrote %v, MoveTo returned %v", step, i, dm[i], de)
			}
		}
	}
}
