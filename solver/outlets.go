package solver

import (
	"fmt"
	"slices"

	"porelight/solver/fem"
	"porelight/solver/soil"
)

// Drains inside the column and ends that drain through a resistance.
//
// A layer with an Outlet holds its pore pressure at the outlet's head at
// every node: in the steady state those nodes are held (their rows
// isolated in the band, fem.Band.Isolate, after MoveHeld has moved their
// values into the neighbours' equations); during consolidation the excess
// there is zero, so the rows and columns of those nodes are isolated in
// the capacity and conductivity matrices and their source is dropped,
// which holds them at exactly zero without moving anything.
//
// A leaky end (Boundary.Resistance R > 0 at a drained end) passes the
// flow (h − h_b)/R, a Robin condition: in the weak form the boundary
// term w(end)·q becomes w(end)·(h_b − h(end))/R, which adds 1/R to the
// end's diagonal and h_b/R to its right-hand side (steady, R in seconds),
// and 1/(γw R) to the conductivity's diagonal for the excess (R in days),
// whose outer value is zero.

// pin is a node held by a draining layer, with the head held there.
type pin struct {
	node int
	head float64
}

// hasOutlet reports whether a layer of p drains to an outlet.
func hasOutlet(p *Project) bool {
	for _, l := range p.Layers {
		if l.Outlet != nil {
			return true
		}
	}
	return false
}

// validOutlets checks the draining layers and the leaky ends against the
// rest of the project.
func validOutlets(ps *Problems, p *Project) {
	for i, l := range p.Layers {
		if l.Outlet == nil {
			continue
		}
		at := fmt.Sprintf("layers[%d].outlet", i)
		if h := l.Outlet.Head; h != nil {
			within(ps, at+".head", *h, MaxHead, "m")
		}
		if p.Drains != nil {
			ps.Add(at, ErrConflict, "a layer draining to an outlet is not modelled together with vertical drains; give one or the other")
		}
		if i > 0 && p.Layers[i-1].Outlet != nil && outletHead(p, i-1) != outletHead(p, i) {
			ps.Add(at+".head", ErrConflict, fmt.Sprintf("layers %d and %d touch and drain to outlets at different heads; give them one head or put a layer between", i, i+1))
		}
	}
	for _, e := range []struct {
		at string
		b  Boundary
	}{{"top", p.Top}, {"bottom", p.Bottom}} {
		if e.b.Resistance > 0 && p.Drains != nil {
			ps.Add(e.at+".resistance", ErrConflict, "an end draining through a resistance is not modelled together with vertical drains; give one or the other")
		}
	}
}

// outletHead is the head held in layer i, m above the top.
func outletHead(p *Project, i int) float64 {
	return headOr(p.Layers[i].Outlet.Head, -p.WaterTable)
}

// pins lists the nodes held by draining layers, top down, each once.
func (c *column) pins() []pin {
	p, m := c.p, c.m
	var out []pin
	for i, l := range p.Layers {
		if l.Outlet == nil {
			continue
		}
		h := outletHead(p, i)
		for j := m.Order * m.First[i]; j <= m.Order*m.First[i+1]; j++ {
			if n := len(out); n > 0 && out[n-1].node == j {
				continue
			}
			out = append(out, pin{j, h})
		}
	}
	return out
}

// endLeak is the steady leakage coefficient 1/R of an end, 1/s (0 for an
// end that is not leaky).
func endLeak(b Boundary) float64 {
	if !b.leaky() {
		return 0
	}
	return 1 / (b.Resistance * soil.SecondsPerDay)
}

// canDrain reports whether the excess pore pressure of the column has a
// way out: a freely drained end, a leaky end, a draining layer or drains.
func (tr *transient) canDrain() bool {
	return len(tr.held) > 0 || len(tr.pinned) > 0 || tr.leakTop > 0 || tr.leakBottom > 0 || tr.c.drains != nil
}

// setLeaks fills the consolidation's leakage at the ends, 1/(γw R),
// m/(kPa·day), adds it to the conductivity, and lists the nodes the
// draining layers hold (those not already held as ends).
func (tr *transient) setLeaks() {
	c, p := tr.c, tr.c.p
	if c.radialOnly {
		return
	}
	n := c.m.Nodes()
	if p.Top.leaky() {
		tr.leakTop = 1 / (c.gw * p.Top.Resistance)
		tr.k.Add(0, 0, tr.leakTop)
	}
	if p.Bottom.leaky() {
		tr.leakBottom = 1 / (c.gw * p.Bottom.Resistance)
		tr.k.Add(n-1, n-1, tr.leakBottom)
	}
	for _, pn := range c.pins() {
		if !slices.Contains(tr.held, pn.node) && pn.node > c.zoneNode {
			tr.pinned = append(tr.pinned, pn.node)
		}
	}
}

// addLeaks adds the ends' leakage to a conductivity band (the iterated
// loop's, reassembled every iteration).
func (tr *transient) addLeaks(k *fem.Band) {
	if tr.leakTop > 0 {
		k.Add(0, 0, tr.leakTop)
	}
	if tr.leakBottom > 0 {
		k.Add(k.N-1, k.N-1, tr.leakBottom)
	}
}

// isolatePins holds the draining layers' nodes at zero excess in a
// capacity and conductivity pair: their rows become the identity in the
// capacity and zero in the conductivity, so that M + θΔt K keeps them
// apart whatever θΔt.
func (tr *transient) isolatePins(mass, k *fem.Band) {
	for _, j := range tr.pinned {
		mass.Isolate(j, 1)
		k.Isolate(j, 0)
	}
}

// zeroPins sets the excess (or its source) at the draining layers'
// nodes to zero; v may be nil.
func (tr *transient) zeroPins(v []float64) {
	if v == nil {
		return
	}
	for _, j := range tr.pinned {
		v[j] = 0
	}
}
