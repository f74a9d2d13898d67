package solver

import (
	"math"
	"slices"
)

// profileAt evaluates a depth profile at z: linear between points and
// constant beyond the ends. An empty profile is def everywhere.
func profileAt(pts []DepthValue, z, def float64) float64 {
	n := len(pts)
	switch {
	case n == 0:
		return def
	case z <= pts[0].Z:
		return pts[0].Value
	case z >= pts[n-1].Z:
		return pts[n-1].Value
	}
	i, _ := slices.BinarySearchFunc(pts, z, func(p DepthValue, z float64) int {
		if p.Z < z {
			return -1
		}
		if p.Z > z {
			return 1
		}
		return 0
	})
	if pts[i].Z == z {
		return pts[i].Value
	}
	a, b := pts[i-1], pts[i]
	return a.Value + (b.Value-a.Value)*(z-a.Z)/(b.Z-a.Z)
}

// historyAt evaluates a time history at t: linear between points and
// constant beyond the ends. An empty history is 0 everywhere. Where two
// points share a time (a step), the later point holds from that time on,
// or, with left set, only after it (the limit from the left).
func historyAt(pts []TimeValue, t float64, left bool) float64 {
	n := len(pts)
	after := func(tp float64) bool { return tp < t || (!left && tp == t) }
	switch {
	case n == 0:
		return 0
	case !after(pts[0].T):
		return pts[0].Value
	case after(pts[n-1].T):
		return pts[n-1].Value
	}
	i := 0
	for i+1 < n && after(pts[i+1].T) {
		i++
	}
	a, b := pts[i], pts[i+1]
	return a.Value + (b.Value-a.Value)*(t-a.T)/(b.T-a.T)
}

// fraction returns how much of load stage l has been applied at time t.
// An instantaneous stage counts from its start on, or, with left set, only
// after it (the limit from the left, before its jump is applied).
func (l Load) fraction(t float64, left bool) float64 {
	if l.Ramp == 0 {
		if t > l.Start || (!left && t == l.Start) {
			return 1
		}
		return 0
	}
	return math.Min(1, math.Max(0, (t-l.Start)/l.Ramp))
}

// surcharge is the pressure of the stages at the surface at time t, kPa,
// before any submergence.
func surcharge(p *Project, t float64) float64 {
	s := 0.0
	for i, l := range p.Loads {
		s += StagePressure(p, i) * l.fraction(t, false)
	}
	return s
}

// breakpoint kinds, combined as bits.
const (
	bpOutput  = 1 << iota // an isochrone is wanted here
	bpRestart             // a rate changes: restart the step size
	bpJump                // an instantaneous change: apply it, then damp
)

type breakpoint struct {
	t    float64
	kind int
}

// breakpoints lists, in time order and merged, every time the stepping
// must land on: output times, load starts and ends, points of the boundary
// pressure histories, and the end time.
func breakpoints(p *Project, end float64) []breakpoint {
	var bs []breakpoint
	add := func(t float64, kind int) { bs = append(bs, breakpoint{t, kind}) }
	for _, t := range p.Times {
		add(t, bpOutput)
	}
	for _, l := range p.Loads {
		if l.Ramp == 0 {
			add(l.Start, bpRestart|bpJump)
		} else {
			add(l.Start, bpRestart)
			add(l.Start+l.Ramp, bpRestart)
		}
	}
	for _, b := range []Boundary{p.Top, p.Bottom} {
		if !b.Drained {
			continue
		}
		for i, tv := range b.Excess {
			kind := bpRestart
			if i > 0 && tv.T == b.Excess[i-1].T && tv.Value != b.Excess[i-1].Value {
				kind |= bpJump
			}
			add(tv.T, kind)
		}
		if len(b.Excess) > 0 && b.Excess[0].Value != 0 {
			add(0, bpJump) // the history starts away from the steady state
		}
	}
	if len(p.InitialExcess) > 0 {
		add(0, bpJump)
	}
	add(end, 0)
	slices.SortFunc(bs, func(a, b breakpoint) int {
		switch {
		case a.t < b.t:
			return -1
		case a.t > b.t:
			return 1
		}
		return 0
	})
	out := bs[:0]
	for _, b := range bs {
		if b.t > end {
			continue
		}
		if n := len(out); n > 0 && b.t-out[n-1].t <= 1e-12*math.Max(1, b.t) {
			out[n-1].kind |= b.kind
			continue
		}
		out = append(out, b)
	}
	return out
}
