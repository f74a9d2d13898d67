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
	walk(dst, pts, to, move, settlement)
}

// Move is Follow writing to dst[i] the compression each move added (what
// MoveTo returns) in place of the settlement: the non-linear model's
// commit of a step, which updates each element's permeability by it.
func Move(dst []float64, pts []Point, to []float64, move []bool) {
	walk(dst, pts, to, move, compression)
}

// Toward is Point.Toward(to[i]) for every point pts[i] with move[i] set,
// written to dst[i], the points left where they are (but for the
// logarithms Toward sets on first use): the non-linear model's pass over
// the elements at every iteration, in one loop for the reason Follow
// gives.
func Toward(dst []float64, pts []Point, to []float64, move []bool) {
	walk(dst, pts, to, move, trial)
}

// What walk writes to dst, and whether it moves the points.
const (
	settlement  = iota // move, write the settlement (Follow)
	compression        // move, write the compression added (Move)
	trial              // do not move, write the compression (Toward)
)

// walk is Follow, Move and Toward: one loop, the mode tested per point
// (the same branch every time, which costs next to nothing beside a
// call per point).
func walk(dst []float64, pts []Point, to []float64, move []bool, mode int) {
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
		de := 0.0
		if t != s.sig {
			var lto float64 // s.log10Of(t)
			if d := t - s.sig; d > -1e-2*s.sig && d < 1e-2*s.sig && s.sig >= MinEffective {
				x := d / (t + s.sig)
				x2 := x * x
				lto = s.lsig + 2*x*(1+x2*(1.0/3+x2*(1.0/5+x2*(1.0/7))))/math.Ln10
			} else {
				lto = math.Log10(t)
			}
			de = s.along(lto)
			if mode != trial {
				s.de += de
				if lto > s.lpeak {
					s.lpeak, s.peak = lto, t
				}
				s.sig, s.lsig = t, lto
			}
		}
		if mode == settlement {
			dst[i] = s.Settlement()
		} else {
			dst[i] = de
		}
	}
}
