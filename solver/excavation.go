package solver

import (
	"fmt"
	"math"
)

// Excavation stages (Load.Dig).
//
// The steady state, σ'0 and σ'p are those of the whole column before
// digging: the overburden removed has preloaded the soil below, so it
// swells along Cr (or its swelling mv) with the faster cv that goes with
// it. For the consolidation the soil above the final floor is taken out
// of the column from the start: its nodes are held at the excess of the
// floor (the water in the excavation against the steady pore pressure
// there), its elements carry no storage, and the soil below drains to the
// floor whatever Top says. The stage unloads every depth below the floor
// by the overburden removed less the water left standing in the
// excavation (StagePressure), at once or linearly over the ramp, and
// lowers the floor's pore pressure to the water inside the excavation in
// the same way (pumping). Depths stay measured from the original top.

// meshBreaks are the depths the mesh must have nodes at inside layers:
// the drains' ends and an excavation's floor.
func meshBreaks(p *Project) []float64 {
	b := drainBreaks(p)
	if i := digStage(p); i >= 0 {
		b = append(b, p.Loads[i].Dig.Depth)
	}
	return b
}

// digStage is the index of the excavation stage of p, or −1.
func digStage(p *Project) int {
	for i, l := range p.Loads {
		if l.Dig != nil {
			return i
		}
	}
	return -1
}

// overburden is the vertical total stress at depth z before loading,
// kPa: the weight of soil above (moist above the water table, saturated
// below) plus any water standing above the top.
func overburden(p *Project, z float64) float64 {
	wt, gw := p.WaterTable, ResolveGammaW(p)
	s := 0.0
	if wt < 0 {
		s = gw * -wt
	}
	top := 0.0
	for _, l := range p.Layers {
		bot := math.Min(top+l.Thickness, z)
		if bot <= top {
			break
		}
		g := l.Gamma
		if g == 0 {
			g = l.GammaSat
		}
		dry := math.Max(0, math.Min(bot, wt)-top)
		s += g*dry + l.GammaSat*(bot-top-dry)
		top += l.Thickness
	}
	return s
}

// pitWater is the water pressure at depth z inside the excavation d once
// it is complete, kPa.
func pitWater(p *Project, d *Dig, z float64) float64 {
	level := p.WaterTable
	if d.WaterLevel != nil {
		level = *d.WaterLevel
	}
	return ResolveGammaW(p) * math.Max(0, z-level)
}

// StagePressure is the pressure of stage i of p at the surface, kPa:
// Load.Pressure, or for an excavation the change of total stress it
// makes below its floor, the water left inside it less the overburden
// removed (negative). p must be valid.
func StagePressure(p *Project, i int) float64 {
	l := p.Loads[i]
	if d := l.Dig; d != nil {
		return pitWater(p, d, d.Depth) - overburden(p, d.Depth)
	}
	return l.Pressure()
}

// validDig checks the excavation of stage i (at is "loads[i].").
func validDig(ps *Problems, at string, p *Project, i int, height float64) {
	l := p.Loads[i]
	d := l.Dig
	if bounded(ps, at+"dig.depth", d.Depth, 0, MaxDepth, "m") && height > 0 && d.Depth >= height {
		ps.Add(at+"dig.depth", ErrOutOfRange, fmt.Sprintf("the floor (%g m) must lie above the base of the column at %g m", d.Depth, height))
	}
	if d.WaterLevel != nil {
		within(ps, at+"dig.waterLevel", *d.WaterLevel, MaxHead, "m")
	}
	switch {
	case l.Q != 0:
		ps.Add(at+"q", ErrConflict, "an excavation takes its pressure from the soil removed; leave q empty")
	case l.Fill != nil:
		ps.Add(at+"fill", ErrConflict, "a stage is an excavation or a fill, not both")
	case l.Area != nil:
		ps.Add(at+"area", ErrConflict, "an excavation covers the whole column here; a loaded area is not modelled with it")
	case len(l.Profile) > 0:
		ps.Add(at+"profile", ErrConflict, "an excavation unloads every depth below its floor alike; a profile is not modelled with it")
	}
	if j := digStage(p); j != i {
		ps.Add(at+"dig", ErrConflict, fmt.Sprintf("one excavation per project (stage %d already digs); give the final floor in one stage", j+1))
	}
	if p.Drains != nil {
		ps.Add(at+"dig", ErrConflict, "an excavation is not modelled together with vertical drains")
	}
	if len(p.Top.Excess) > 0 {
		ps.Add("top.excess", ErrConflict, "with an excavation the floor's pore pressure follows the water inside it (dig.waterLevel); a pressure history at the top is not modelled with it")
	}
}

// digWarnings says what an excavation project assumes.
func digWarnings(p *Project, warn func(path, msg string)) {
	i := digStage(p)
	if i < 0 {
		return
	}
	d := p.Loads[i]
	for j, l := range p.Loads {
		if j != i && l.Start < d.Start+d.Ramp {
			warn(IndexPath("loads", j), fmt.Sprintf("starts before the excavation (stage %d) is complete: the consolidation takes the soil above its floor as removed from the start, draining at the floor, so this stage's response before then is approximate", i+1))
		}
	}
	if !p.Top.Drained {
		warn(IndexPath("loads", i)+".dig", "the top is undrained, but the floor of the excavation drains to the water inside it: the consolidation drains at the floor")
	}
}

// setDig finds the excavation's floor node and the elements above it.
func (c *column) setDig() {
	c.digStage = digStage(c.p)
	if c.digStage < 0 {
		return
	}
	D := c.p.Loads[c.digStage].Dig.Depth
	m := c.m
	c.digNode = nodeAtDepth(m.Z, D)
	c.dug = make([]bool, m.Elements())
	for e := range c.dug {
		c.dug[e] = e*m.Order+m.Order <= c.digNode
	}
}

// isDug reports whether element e lies above the excavation's floor.
func (c *column) isDug(e int) bool { return c.dug != nil && c.dug[e] }

// nodeAtDepth is the node nearest depth z.
func nodeAtDepth(zs []float64, z float64) int {
	best := 0
	for i, v := range zs {
		if math.Abs(v-z) < math.Abs(zs[best]-z) {
			best = i
		}
	}
	return best
}

// digHeldExcess is the excess pore pressure at the floor once the
// excavation is complete: the water inside it against the steady pore
// pressure there, kPa.
func (c *column) digHeldExcess(st *Steady) float64 {
	d := c.p.Loads[c.digStage].Dig
	return pitWater(c.p, d, c.m.Z[c.digNode]) - st.Pore[c.digNode]
}
