package soil

import (
	"math/rand/v2"
	"testing"
)

// TestFollowIsMoveTo: Follow moves each marked point as MoveTo does, to
// the bit, along random paths that load, unload, reload past the peak,
// fall below MinEffective and stay put, in small steps (the series for
// the logarithm) and large ones (math.Log10); unmarked points and their
// dst entries are left alone. The reference is MoveTo, itself checked
// against Compress (Terzaghi & Peck 1967) in TestPointFollowsCompress.
func TestFollowIsMoveTo(t *testing.T) {
	t.Parallel()
	rnd := rand.New(rand.NewPCG(1, 1))
	curves := []Curve{{E0: 1.2, Cc: 0.45, Cr: 0.05}, {E0: 0.9, Cc: 0.25, Cr: 0.03}, {E0: 0.6, Cc: 0.02, Cr: 0}}
	const n = 40
	var got, want [n]Point
	move := make([]bool, n)
	to, dst := make([]float64, n), make([]float64, n)
	for i := range n {
		s0 := 5 + 100*rnd.Float64()
		got[i] = NewPoint(curves[i%len(curves)], 0.1+rnd.Float64(), s0, s0*(1+rnd.Float64()))
		want[i] = got[i]
		move[i] = i%7 != 3
		to[i] = s0
	}
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
			dst[i] = -1
		}
		Follow(dst, got[:], to, move)
		for i := range n {
			if !move[i] {
				if got[i] != want[i] || dst[i] != -1 {
					t.Fatalf("step %d: point %d is not marked but changed", step, i)
				}
				continue
			}
			want[i].MoveTo(to[i])
			if got[i] != want[i] {
				t.Fatalf("step %d: point %d followed to %v, MoveTo to %v", step, i, got[i], want[i])
			}
			if s := want[i].Settlement(); dst[i] != s {
				t.Fatalf("step %d: point %d: Follow wrote %v, its settlement is %v", step, i, dst[i], s)
			}
		}
	}
}
