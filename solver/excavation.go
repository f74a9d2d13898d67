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
	if i := zoneStage(p); i >= 0 {
		b = append(b, zoneDepth(p.Loads[i]))
	}
	return b
}

// zoneStage is the index of the stage of p that holds the top of the
// column (an excavation or a lowered water table), or −1.
func zoneStage(p *Project) int {
	for i, l := range p.Loads {
		if l.Dig != nil || l.Lower != nil {
			return i
		}
	}
	return -1
}

// zoneDepth is the depth down to which stage l holds the column: the
// excavation's floor or the new water table.
func zoneDepth(l Load) float64 {
	if l.Dig != nil {
		return l.Dig.Depth
	}
	return l.Lower.WaterTable
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
	if w := l.Lower; w != nil {
		return -drained(p, w.WaterTable, w.WaterTable)
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
	if j := zoneStage(p); j != i {
		ps.Add(at+"dig", ErrConflict, fmt.Sprintf("one excavation or lowering of the water table per project (stage %d already is one); give the final floor in one stage", j+1))
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
	i := zoneStage(p)
	if i < 0 || p.Loads[i].Dig == nil {
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

// setDig finds the deepest node the top zone holds and, under an
// excavation, the elements above its floor.
func (c *column) setDig() {
	c.zoneStage = zoneStage(c.p)
	if c.zoneStage < 0 {
		return
	}
	l := c.p.Loads[c.zoneStage]
	m := c.m
	c.zoneNode = nodeAtDepth(m.Z, zoneDepth(l))
	if l.Dig == nil {
		return
	}
	c.dug = make([]bool, m.Elements())
	for e := range c.dug {
		c.dug[e] = e*m.Order+m.Order <= c.zoneNode
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

// zoneTargets is the excess pore pressure held at the nodes from the top
// down to c.zoneNode once the stage is complete, kPa: under an excavation
// the water inside it at the floor against the steady pore pressure there
// (everywhere above too); under a lowered water table the steady pore
// pressure removed (the soil above the new water table drains to zero
// pore pressure).
func (c *column) zoneTargets(st *Steady) []float64 {
	l := c.p.Loads[c.zoneStage]
	out := make([]float64, c.zoneNode+1)
	for j := range out {
		if d := l.Dig; d != nil {
			out[j] = pitWater(c.p, d, c.m.Z[c.zoneNode]) - st.Pore[c.zoneNode]
		} else {
			out[j] = -math.Max(st.Pore[j], 0)
		}
	}
	return out
}

// drained is the weight the soil between the water table and depth
// min(z, to) loses when the water table falls to depth to, kPa: Σ (γsat −
// γ) over that band, layer by layer (zero for a layer without a moist
// unit weight: a clay held saturated by capillarity).
func drained(p *Project, z, to float64) float64 {
	from, bot := math.Max(p.WaterTable, 0), math.Min(z, to)
	s, top := 0.0, 0.0
	for _, l := range p.Layers {
		a, b := math.Max(top, from), math.Min(top+l.Thickness, bot)
		if b > a && l.Gamma != 0 {
			s += (l.GammaSat - l.Gamma) * (b - a)
		}
		top += l.Thickness
	}
	return s
}

// lowerFactor is Δσ/q at depth z of a stage that lowers the water table
// to depth to: the weight lost above z over that lost above the new water
// table (0 when no layer in the band has a moist unit weight).
func lowerFactor(p *Project, to, z float64) float64 {
	q := drained(p, to, to)
	if q == 0 {
		return 0
	}
	return drained(p, z, to) / q
}

// validLower checks the lowering of the water table of stage i (at is
// "loads[i].").
func validLower(ps *Problems, at string, p *Project, i int, height float64) {
	l := p.Loads[i]
	w := l.Lower.WaterTable
	if within(ps, at+"lower.waterTable", w, MaxHead, "m") {
		switch {
		case w <= math.Max(p.WaterTable, 0):
			ps.Add(at+"lower.waterTable", ErrOutOfRange, fmt.Sprintf("the new water table (%g m) must lie below the present one (%g m) and below the top", w, p.WaterTable))
		case height > 0 && w >= height:
			ps.Add(at+"lower.waterTable", ErrOutOfRange, fmt.Sprintf("the new water table (%g m) lies at or below the base of the column (%g m): model a drawdown below the column by a pressure history at the base (bottom.excess)", w, height))
		}
	}
	switch {
	case l.Q != 0:
		ps.Add(at+"q", ErrConflict, "a lowered water table takes its stress change from the unit weights; leave q empty")
	case l.Fill != nil, l.Dig != nil:
		ps.Add(at+"lower", ErrConflict, "a stage lowers the water table, digs or places fill, one of them")
	case l.Area != nil:
		ps.Add(at+"area", ErrConflict, "a lowered water table covers the whole column; a loaded area is not modelled with it")
	case len(l.Profile) > 0:
		ps.Add(at+"profile", ErrConflict, "a lowered water table takes its stress with depth from the unit weights; a profile is not modelled with it")
	}
	if j := zoneStage(p); j != i {
		ps.Add(at+"lower", ErrConflict, fmt.Sprintf("one excavation or lowering of the water table per project (stage %d already is one)", j+1))
	}
	if p.Drains != nil {
		ps.Add(at+"lower", ErrConflict, "a lowered water table is not modelled together with vertical drains; give a pressure history at the drains' outlet instead")
	}
	if len(p.Top.Excess) > 0 {
		ps.Add("top.excess", ErrConflict, "with a lowered water table the pore pressure above it follows the lowering; a pressure history at the top is not modelled with it")
	}
}

// drainedAt writes to dst the drained pore pressure change at breakpoint
// time t: uInf, with the top zone's part at its stage's fraction.
func (k *consolidation) drainedAt(dst []float64, t float64) []float64 {
	copy(dst, k.uInf)
	if k.uZone != nil {
		f := k.c.p.Loads[k.c.zoneStage].fraction(t, false) - 1
		for i, v := range k.uZone {
			dst[i] += f * v
		}
	}
	return dst
}
