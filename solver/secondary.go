package solver

import (
	"fmt"
	"math"

	"porelight/solver/soil"
)

// endOfPrimary is the degree of consolidation of a layer taken as its end
// of primary consolidation, where its secondary compression starts.
const endOfPrimary = 0.95

// calphaOf is the layer's coefficient of secondary compression: Calpha,
// or CalphaCc·Cc (Mesri & Godlewski 1977).
func calphaOf(l *Layer) float64 {
	if l.CalphaCc > 0 && l.ECurve != nil {
		return l.CalphaCc * l.ECurve.Cc
	}
	return l.Calpha
}

// primaryEnds keeps, during the time loop, the settlement history of
// every layer with a Cα, so that each layer's own end of primary (its
// degree of consolidation reaching endOfPrimary, its settlement over its
// final settlement under the model that drives the loop) can be found
// once the final is known.
type primaryEnds struct {
	layers []int       // the layers with a Cα
	hist   [][]float64 // per such layer, its settlement at the kept times, m
	times  []float64   // the kept times, days
	stride int         // keep every stride-th record (memory bound)
	count  int
	now    []float64 // per layer settlement now (scratch)
	// ew holds ∫ N_a dz of every element's local nodes (Order+1 per
	// element), for the linear stepper: a layer's settlement is then one
	// dot product per element instead of a quadrature.
	ew []float64
}

// maxEndHistory bounds the numbers primaryEnds keeps; past it, it keeps
// every second (third, …) record.
const maxEndHistory = 1_000_000

// prepareEnds sizes the histories when some layer has a Cα; capacity is
// the number of records the loop will make.
func (k *consolidation) prepareEnds(capacity int) {
	p := k.c.p
	pe := &primaryEnds{now: make([]float64, len(p.Layers))}
	for i := range p.Layers {
		if calphaOf(&p.Layers[i]) > 0 && p.Layers[i].ECurve != nil {
			pe.layers = append(pe.layers, i)
		}
	}
	if len(pe.layers) == 0 {
		return
	}
	pe.ew = k.elementWeights()
	pe.stride = max(1, (len(pe.layers)*capacity+maxEndHistory-1)/maxEndHistory)
	keep := capacity/pe.stride + 2
	pe.times = make([]float64, 0, keep)
	pe.hist = make([][]float64, len(pe.layers))
	for j := range pe.hist {
		pe.hist[j] = make([]float64, 0, keep)
	}
	k.ends = pe
}

// elementWeights returns ∫ N_a dz of every element's local nodes
// (Order+1 per element), the weights of layerNow.
func (k *consolidation) elementWeights() []float64 {
	m := k.c.m
	np := m.Order + 1
	unit := make([]float64, m.Nodes())
	ew := make([]float64, m.Elements()*np)
	for e := range m.Elements() {
		for a := range np {
			unit[e*m.Order+a] = 1
			ew[e*np+a] = m.Integrate(unit, e)
			unit[e*m.Order+a] = 0
		}
	}
	return ew
}

// layerNow writes each layer's settlement now to dst, from the model
// that drives the loop, with the element weights ew. No allocation.
func (k *consolidation) layerNow(dst, ew []float64) {
	if k.nl != nil { // summed with the column's settlement (record)
		copy(dst, k.nl.layers)
		return
	}
	clear(dst)
	m, tr, dug := k.c.m, k.tr, k.c.dug
	sigma, u, linear := tr.sigma, tr.u, m.Order == 1
	// Layer by layer (its elements are m.First[l] … m.First[l+1]-1), the
	// sum in a register: the same additions in the same order as adding
	// into dst element by element.
	for l := range len(m.First) - 1 {
		mv, sum := tr.mv[l], 0.0
		e0, e1 := m.First[l], m.First[l+1]
		for e := e0; e < e1; e++ {
			if dug != nil && dug[e] {
				continue
			}
			var v float64
			if linear {
				v = ew[2*e]*(sigma[e]-u[e]) + ew[2*e+1]*(sigma[e+1]-u[e+1])
			} else {
				np, n0 := m.Order+1, e*m.Order
				for a := range np {
					v += ew[e*np+a] * (sigma[n0+a] - u[n0+a])
				}
			}
			sum += mv * v
		}
		dst[l] = sum
	}
}

// observe keeps the layers' settlements at time t (every stride-th call,
// and always while there is room; the capacity is not exceeded).
func (pe *primaryEnds) observe(t float64, now []float64) {
	pe.count++
	if (pe.count-1)%pe.stride != 0 && len(pe.times) < cap(pe.times)-1 {
		return
	}
	if len(pe.times) == cap(pe.times) {
		return
	}
	pe.times = append(pe.times, t)
	for j, l := range pe.layers {
		pe.hist[j] = append(pe.hist[j], now[l])
	}
}

// end returns when the j-th kept layer first reaches endOfPrimary of
// final (interpolated in log time as crossing does), or nil.
func (pe *primaryEnds) end(j int, final float64) *float64 {
	if final <= 0 {
		return nil
	}
	h := pe.hist[j]
	for i := range h {
		if h[i]/final >= endOfPrimary {
			if i == 0 {
				return ptr(pe.times[0])
			}
			return crossing(pe.times[i-1:i+1], []float64{h[i-1] / final, h[i] / final}, endOfPrimary)
		}
	}
	return nil
}

// secondary estimates the secondary compression of every layer with a Cα
// (Mesri 1973), each from its own end of primary consolidation, with time
// counted from the start of the load stage that end follows, to the design
// life; after a surcharge is removed the layer's CalphaReduced applies
// when given. It also fills the series of secondary settlement.
func (k *consolidation) secondary() {
	p, r := k.c.p, k.r
	if k.ends == nil {
		return
	}
	life := r.Summary.DesignLife
	removal := math.NaN() // the last removal of load
	for _, l := range p.Loads {
		if l.Q < 0 {
			removal = l.Start + l.Ramp
		}
	}
	sum, missing := 0.0, false
	var parts []secondaryPart
	for j, i := range k.ends.layers {
		l := &p.Layers[i]
		ca := calphaOf(l)
		final := r.Summary.Layers[i].Settlement
		if final <= 0 {
			continue
		}
		at := IndexPath("layers", i)
		end := k.ends.end(j, final)
		if end == nil {
			missing = true
			k.warn(at, fmt.Sprintf("layer %d%s does not reach %g %% of its primary settlement in the simulated time: no secondary compression estimate for it", i+1, quoted(l.Name), 100*endOfPrimary))
			continue
		}
		tp := *end
		t0 := 0.0
		for _, ld := range p.Loads {
			if ld.Q != 0 && ld.Start <= tp {
				t0 = math.Max(t0, ld.Start)
			}
		}
		strain := r.Summary.Layers[i].Settlement / l.Thickness
		ep := l.ECurve.E0 - strain*(1+l.ECurve.E0)
		cr := ca
		if !math.IsNaN(removal) {
			if l.CalphaReduced > 0 {
				cr = l.CalphaReduced
			} else {
				k.warn(JoinPath(at, "calphaReduced"), fmt.Sprintf("load is removed at %.4g days: with the full Cα the secondary rate after it is overestimated; give calphaReduced for the reduced rate", removal))
			}
		}
		pt := secondaryPart{i, t0, tp, removal, ca, cr, ep, l.Thickness}
		parts = append(parts, pt)
		s := pt.at(life)
		r.Summary.Layers[i].Secondary = ptr(s)
		r.Summary.Layers[i].SecondaryStart = ptr(tp)
		sum += s
	}
	if len(parts) == 0 && missing {
		return
	}
	r.Summary.Secondary = ptr(sum)
	k.secParts = parts
	ser := &r.Consolidation.Series
	ser.Secondary = make([]float64, len(ser.Time))
	for j, t := range ser.Time {
		for _, pt := range parts {
			ser.Secondary[j] += pt.at(t)
		}
	}
}

// secondaryPart is what one layer's secondary compression needs: its
// index, the start t0 of the stage its end of primary tp follows, the
// last removal of load tr (NaN: none), Cα before and after it, the void
// ratio at the end of primary and the thickness.
type secondaryPart struct {
	layer                     int
	t0, tp, tr, ca, cr, ep, h float64
}

// at is the layer's secondary compression at time t, m.
func (pt secondaryPart) at(t float64) float64 {
	return secondaryAt(pt.t0, pt.tp, pt.tr, pt.ca, pt.cr, pt.ep, pt.h, t)
}

// secondaryAt is one layer's secondary compression at time t, m: Mesri's
// (1973) Cα h/(1+ep) log10((t − t0)/(tp − t0)) from its end of primary
// tp, time counted from t0, with Cα after a removal of load at tr (NaN:
// none) replaced by cr.
func secondaryAt(t0, tp, tr, ca, cr, ep, h, t float64) float64 {
	if math.IsNaN(tr) || tr >= t {
		return soil.Secondary(ca, h, ep, t-t0, tp-t0)
	}
	if tr <= tp {
		return soil.Secondary(cr, h, ep, t-t0, tp-t0)
	}
	return soil.Secondary(ca, h, ep, tr-t0, tp-t0) + soil.Secondary(cr, h, ep, t-t0, tr-t0)
}
