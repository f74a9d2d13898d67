package solver

import (
	"fmt"
	"math"
)

// secondsPerDay converts permeabilities in m/s to the m/day used in time
// integration.
const secondsPerDay = 86400

// column is a validated project with its defaults filled in and its mesh.
type column struct {
	p      *Project
	gw     float64
	m      *mesh
	height float64
	tops   []float64 // depth of the top of each layer, plus the base
}

// newColumn fills in the defaults of a validated project and meshes it.
func newColumn(p *Project) *column {
	c := &column{p: p, gw: p.GammaW}
	if c.gw == 0 {
		c.gw = DefaultGammaW
	}
	th := make([]float64, len(p.Layers))
	c.tops = make([]float64, len(p.Layers)+1)
	for i, l := range p.Layers {
		th[i] = l.Thickness
		c.tops[i+1] = c.tops[i] + l.Thickness
	}
	c.height = c.tops[len(p.Layers)]
	order, maxSize, minPer := meshSize(p)
	c.m = newMesh(th, order, maxSize, minPer)
	return c
}

// steady solves d/dz(k dh/dz) = 0 on the column with a fixed head at each
// drained end and a fixed inflow at each undrained end, then derives pore
// pressure, stresses, gradients and the heave and uplift checks.
//
// The weak form is: find h, equal to the fixed heads at drained ends, with
//
//	∫ k w' h' dz = w(0)·q_top + w(H)·q_bottom
//
// for every w that vanishes at drained ends, q being the inflow (Darcy
// velocity into the column) at an undrained end.
func (c *column) steady(warn func(path, msg string)) Steady {
	p, m := c.p, c.m
	n := m.nodes()
	h := make([]float64, n)
	hydro := -p.WaterTable
	switch {
	case !p.Top.Drained && !p.Bottom.Drained:
		// No end holds a head: with no inflow (Validate refuses an inflow
		// here) the water stands at the water table.
		for i := range h {
			h[i] = hydro
		}
		warn("", "neither end is drained: the steady state is taken as hydrostatic with the given water table")
	default:
		k := newBand(n, m.order)
		m.assemble(k, func(e int, _ float64) float64 { return p.Layers[m.layer[e]].K }, false)
		lo, hi := 0, n
		var held []int
		if p.Top.Drained {
			h[0] = headOr(p.Top.Head, hydro)
			held, lo = append(held, 0), 1
		} else {
			h[0] = p.Top.Inflow
		}
		if p.Bottom.Drained {
			h[n-1] = headOr(p.Bottom.Head, hydro)
			held, hi = append(held, n-1), n-1
		} else {
			h[n-1] += p.Bottom.Inflow
		}
		inflow := append([]float64(nil), h...) // right-hand side before the held ends move into it
		dirichletRHS(h, k, h, held)
		var f factor
		err := factorize(&f, k, lo, hi)
		if err != nil {
			warn("layers", err.Error())
		}
		f.solve(h)
		if err == nil {
			refineHeads(h, inflow, k, &f, lo, hi)
		}
	}

	s := Steady{Depth: append([]float64(nil), m.z...), Head: h}
	s.Pore = make([]float64, n)
	s.Total = make([]float64, n)
	s.Effective = make([]float64, n)
	suction, negative := -1.0, -1.0
	for i, z := range m.z {
		u := c.gw * (h[i] + z)
		s.Pore[i] = u
		s.Total[i] = c.totalStress(z)
		uEff := u
		if u < 0 {
			uEff = 0
			if z > p.WaterTable+1e-9 && suction < 0 {
				suction = z
			}
		}
		s.Effective[i] = s.Total[i] - uEff
		if s.Effective[i] < -1e-9 && negative < 0 {
			negative = z
		}
	}
	if suction >= 0 {
		warn("", fmt.Sprintf("the pore pressure falls below zero under the water table (from %.3g m): unsaturated flow is not modelled and effective stresses take the pore pressure as zero there", suction))
	}
	if negative >= 0 {
		warn("", fmt.Sprintf("the effective stress is negative from %.3g m: the water pressure exceeds the weight of the soil (heave or boiling); results below are not physical", negative))
	}

	sumHk := 0.0
	for i, l := range p.Layers {
		top, bot := c.tops[i], c.tops[i+1]
		ht, hb := h[m.order*m.first[i]], h[m.order*m.first[i+1]]
		sumHk += l.Thickness / l.K
		flux := -l.K * (hb - ht) / l.Thickness // Darcy velocity, down positive
		sl := SteadyLayer{
			Name: l.Name, Top: top, Bottom: bot,
			Flux:             flux,
			Gradient:         math.Abs(hb-ht) / l.Thickness,
			Upward:           hb > ht,
			CriticalGradient: (l.GammaSat - c.gw) / c.gw,
		}
		if sl.Upward && sl.Gradient > 0 {
			sl.HeaveFactor = ptr(sl.CriticalGradient / sl.Gradient)
		}
		if l.Mv > 0 {
			sl.Cv = ptr(cvPerDay(l.K, l.Mv, c.gw))
		}
		s.Layers = append(s.Layers, sl)
		s.Flux += flux * l.Thickness / c.height

		if i+1 < len(p.Layers) && l.K*100 <= p.Layers[i+1].K {
			j := m.order * m.first[i+1]
			uc := UpliftCheck{Layer: i, Depth: bot, Total: s.Total[j], Pore: s.Pore[j]}
			if uc.Pore > 0 {
				uc.Factor = ptr(uc.Total / uc.Pore)
			}
			s.Uplift = append(s.Uplift, uc)
		}
	}
	s.KEquivalent = c.height / sumHk
	return s
}

// maxRefine is the most steps of iterative refinement refineHeads takes.
const maxRefine = 3

// refineHeads improves the heads h of K h = rhs by iterative refinement
// (Wilkinson 1963), reusing the factor f of the free rows lo … hi-1. The
// held rows of rhs are ignored and those of h stay as they are.
//
// The factorisation computes its pivots as differences of conductances
// k/Δz, and where a permeable layer lies beside a much less permeable one
// the difference that carries the resistance of the tight layer is lost
// to rounding: with a contrast of 1e5 the heads, and so the layer fluxes,
// come out with relative errors near 1e-7. The residual is therefore
// computed in flux form, rᵢ = rhsᵢ − Σⱼ Kᵢⱼ (hⱼ − hᵢ) over j ≠ i, which
// equals rhs − K h because every row of a stiffness matrix sums to zero;
// the head differences are exact where heads are close, so the residual
// is accurate element by element and each step shrinks the error by the
// factor's relative accuracy. O(n·kd) per step.
func refineHeads(h, rhs []float64, a *band, f *factor, lo, hi int) {
	r := make([]float64, len(h))
	for range maxRefine {
		for i := lo; i < hi; i++ {
			s := rhs[i]
			for j := max(i-a.kd, 0); j <= min(i+a.kd, a.n-1); j++ {
				if j != i {
					s -= a.at(i, j) * (h[j] - h[i])
				}
			}
			r[i] = s
		}
		f.solve(r)
		done := true
		for i := lo; i < hi; i++ {
			h[i] += r[i]
			if math.Abs(r[i]) > 1e-15*math.Abs(h[i]) {
				done = false
			}
		}
		if done {
			return
		}
	}
}

// totalStress is the vertical total stress at depth z before loading, kPa:
// the weight of soil above (moist above the water table, saturated below)
// plus any water standing above the top.
func (c *column) totalStress(z float64) float64 {
	wt := c.p.WaterTable
	s := 0.0
	if wt < 0 {
		s = c.gw * -wt
	}
	for i, l := range c.p.Layers {
		top, bot := c.tops[i], math.Min(c.tops[i+1], z)
		if bot <= top {
			break
		}
		g := l.Gamma
		if g == 0 {
			g = l.GammaSat
		}
		dry := math.Max(0, math.Min(bot, wt)-top)
		s += g*dry + l.GammaSat*(bot-top-dry)
	}
	return s
}

// cvPerDay is the coefficient of consolidation k/(mv γw) in m²/day.
func cvPerDay(k, mv, gw float64) float64 { return k * secondsPerDay / (mv * gw) }

func headOr(h *float64, def float64) float64 {
	if h != nil {
		return *h
	}
	return def
}

func ptr(v float64) *float64 { return &v }
