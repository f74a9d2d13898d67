package soil

import "math"

// Follow is MoveTo(to[i]) for every point pts[i] with move[i] set, and
// writes the settlement of each such point to dst[i]; the other entries
// of dst are left alone. dst, to and move must be at least as long as
// pts.
//
// It is the time loop's pass over the elements of a column, one move per
// element and step. MoveTo is too large to be inlined, and a call leaves
// no value in a register, so a loop of MoveTo pays about as much again
// for the calls as for the moves: Follow takes MoveTo's steps (start, the
// series for the logarithm near the present stress, along, the new
// state) inside one loop. TestFollowIsMoveTo holds the two equal to the
// bit; a change to MoveTo's arithmetic must be made here too.
func Follow(dst []float64, pts []Point, to []float64, move []bool) {
	dst, to, move = dst[:len(pts)], to[:len(pts)], move[:len(pts)]
	for i := range pts {
		if !move[i] {
			continue
		}
		s := &pts[i]
		s.start()
		t := to[i]
		if t < MinEffective { // max(t, MinEffective), which js/wasm calls out of line
			t = MinEffective
		}
		if t != s.sig {
			var lto float64 // s.log10Of(t)
			if d := t - s.sig; d > -1e-2*s.sig && d < 1e-2*s.sig && s.sig >= MinEffective {
				x := d / (t + s.sig)
				x2 := x * x
				lto = s.lsig + 2*x*(1+x2*(1.0/3+x2*(1.0/5+x2*(1.0/7))))/math.Ln10
			} else {
				lto = math.Log10(t)
			}
			s.de += s.along(lto)
			if lto > s.lpeak {
				s.lpeak, s.peak = lto, t
			}
			s.sig, s.lsig = t, lto
		}
		dst[i] = s.Settlement()
	}
}
