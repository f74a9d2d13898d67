package solver

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"porelight/solver/fem"
	"porelight/solver/soil"
)

// column is a validated project with its defaults filled in and its mesh.
type column struct {
	p      *Project
	gw     float64
	m      *fem.Mesh
	height float64
	tops   []float64  // depth of the top of each layer, plus the base
	drains *DrainCell // nil without drains
	// radialOnly solves the consolidation with the drains alone: no
	// vertical flow and no drained end (drainReference's Uh).
	radialOnly bool
	// factors is Δσ/q of every load stage at the nodes (stageFactors).
	factors [][]float64
	// The stage that holds the top of the column (an excavation or a
	// lowered water table, see excavation.go): its index (−1: none), the
	// deepest node it holds, and for an excavation the elements above
	// its floor (nil: none).
	zoneStage int
	zoneNode  int
	dug       []bool
}

// newColumn fills in the defaults of a validated project and meshes it.
func newColumn(p *Project) *column {
	c := &column{p: p, gw: ResolveGammaW(p)}
	th := make([]float64, len(p.Layers))
	c.tops = make([]float64, len(p.Layers)+1)
	for i, l := range p.Layers {
		th[i] = l.Thickness
		c.tops[i+1] = c.tops[i] + l.Thickness
	}
	c.height = c.tops[len(p.Layers)]
	ms := ResolveMesh(p)
	c.m = fem.NewMeshBreaks(th, ms.Order, ms.MaxSize, ms.MinPerLayer, meshBreaks(p))
	c.drains = ResolveDrains(p)
	c.setDig()
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
// velocity into the column) at an undrained end. A system that cannot be
// factorised is returned as a Problem naming the depth (see
// column.numerical); nothing is computed from a bad factor.
func (c *column) steady(warn func(path, msg string)) (Steady, error) {
	p, m := c.p, c.m
	n := m.Nodes()
	h := make([]float64, n)
	hydro := -p.WaterTable
	pins := c.pins()
	switch {
	case !p.Top.Drained && !p.Bottom.Drained && len(pins) == 0:
		// No end holds a head: with no inflow (Validate refuses an inflow
		// here) the water stands at the water table.
		for i := range h {
			h[i] = hydro
		}
		warn("", "neither end is drained: the steady state is taken as hydrostatic with the given water table")
	default:
		k := fem.NewBand(n, m.Order)
		m.Assemble(k, func(e int, _ float64) float64 { return p.Layers[m.Layer[e]].K }, false)
		// rhs is the inflow through each end (a leaky end's h_b/R), extra
		// a leaky end's 1/R on the diagonal.
		rhs, extra := make([]float64, n), make([]float64, n)
		lo, hi := 0, n
		var held []int
		ends := []struct {
			b    Boundary
			node int
		}{{p.Top, 0}, {p.Bottom, n - 1}}
		for _, e := range ends {
			switch {
			case e.b.holds():
				h[e.node] = headOr(e.b.Head, hydro)
				held = append(held, e.node)
			case e.b.leaky():
				a := endLeak(e.b)
				extra[e.node] += a
				rhs[e.node] += a * headOr(e.b.Head, hydro)
			default:
				rhs[e.node] += e.b.Inflow
			}
		}
		var inner []int // draining layers' nodes inside the factorised block
		for _, pn := range pins {
			if slices.Contains(held, pn.node) {
				continue // a held end keeps its own head
			}
			h[pn.node] = pn.head
			held = append(held, pn.node)
			inner = append(inner, pn.node)
		}
		if slices.Contains(held, 0) {
			lo = 1
		}
		if slices.Contains(held, n-1) {
			hi = n - 1
		}
		kf := &fem.Band{N: k.N, KD: k.KD, AB: append([]float64(nil), k.AB...)}
		for i, a := range extra {
			if a != 0 {
				kf.Add(i, i, a)
			}
		}
		b := append([]float64(nil), rhs...)
		fem.MoveHeld(b, kf, h, held)
		for _, j := range inner {
			kf.Isolate(j, 1)
			b[j] = h[j]
		}
		var f fem.Factor
		if err := fem.Factorize(&f, kf, lo, hi); err != nil {
			return Steady{}, c.numerical(err, "the steady seepage equations")
		}
		f.Solve(b)
		copy(h[lo:hi], b[lo:hi])
		fem.RefineWith(h, rhs, k, extra, inner, &f, lo, hi)
	}

	s := Steady{Depth: append([]float64(nil), m.Z...), Head: h}
	s.Pore = make([]float64, n)
	s.Total = make([]float64, n)
	s.Effective = make([]float64, n)
	suction, negative := -1.0, -1.0
	for i, z := range m.Z {
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
		ht, hb := h[m.Order*m.First[i]], h[m.Order*m.First[i+1]]
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
			sl.Cv = ptr(soil.Cv(l.K, l.Mv, c.gw))
		}
		s.Layers = append(s.Layers, sl)
		s.Flux += flux * l.Thickness / c.height

		if i+1 < len(p.Layers) && l.K*100 <= p.Layers[i+1].K {
			j := m.Order * m.First[i+1]
			uc := UpliftCheck{Layer: i, Depth: bot, Total: s.Total[j], Pore: s.Pore[j]}
			if uc.Pore > 0 {
				uc.Factor = ptr(uc.Total / uc.Pore)
			}
			s.Uplift = append(s.Uplift, uc)
		}
	}
	s.KEquivalent = c.height / sumHk
	return s, nil
}

// totalStress is the vertical total stress at depth z before loading, kPa:
// the weight of soil above (moist above the water table, saturated below)
// plus any water standing above the top.
func (c *column) totalStress(z float64) float64 { return overburden(c.p, z) }

func headOr(h *float64, def float64) float64 {
	if h != nil {
		return *h
	}
	return def
}

func ptr(v float64) *float64 { return &v }

// numerical turns a failure of the finite element core into a Problem
// naming the layer and depth where it happened; what says which equations
// failed. Any other error is returned as it is.
func (c *column) numerical(err error, what string) error {
	var nd *fem.NotDefiniteError
	if !errors.As(err, &nd) {
		return err
	}
	// The first bad pivot is at the first node whose row holds the bad
	// element, so the layer of the element starting there is named.
	node := min(max(nd.Node, 0), c.m.Nodes()-1)
	z := c.m.Z[node]
	layer := c.layerOfNode(node)
	var ps Problems
	ps.Add(fmt.Sprintf("layers[%d].k", layer), ErrNumerical,
		fmt.Sprintf("%s cannot be solved at %.4g m depth (in layer %d%s): the matrix is not positive definite there; check k and mv of the layers near that depth for values that are extreme for soil", what, z, layer+1, quoted(c.p.Layers[layer].Name)))
	return ps
}

// layerOfNode is the layer of the element that starts at node (the last
// element's for the last node): the lower layer at a layer boundary.
func (c *column) layerOfNode(node int) int {
	return c.m.Layer[min(node/c.m.Order, c.m.Elements()-1)]
}

func quoted(name string) string {
	if name == "" {
		return ""
	}
	return fmt.Sprintf(", %q", name)
}
