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

// primaryEnds finds, during the time loop, when each layer's own degree
// of consolidation (its settlement now over its final settlement under
// the model that drives the loop) first reaches endOfPrimary.
type primaryEnds struct {
	final []float64 // per layer; 0 where the layer has no Cα or no settlement
	now   []float64 // per layer settlement now (filled by the caller)
	prev  []float64 // per layer degree at the last record
	tp    []float64 // per layer end of primary, days (NaN: not yet)
	prevT float64
	d     []float64 // nodal σ − u, for the linear stepper
}

// prepareEnds sizes the per-layer tracking when some layer has a Cα.
func (k *consolidation) prepareEnds() {
	p := k.c.p
	nl := len(p.Layers)
	pe := &primaryEnds{final: make([]float64, nl), now: make([]float64, nl), prev: make([]float64, nl), tp: make([]float64, nl), d: make([]float64, k.c.m.Nodes())}
	any := false
	for i := range p.Layers {
		pe.tp[i] = math.NaN()
		if calphaOf(&p.Layers[i]) <= 0 || p.Layers[i].ECurve == nil {
			continue
		}
		any = true
		pe.final[i] = k.r.Summary.Layers[i].SettlementLinear
		if k.nl != nil {
			pe.final[i] = k.nlDrained[i]
		}
	}
	if any {
		k.ends = pe
	}
}

// layerNow writes each layer's settlement now to dst, from the model
// that drives the loop. No allocation.
func (k *consolidation) layerNow(dst []float64) {
	clear(dst)
	if k.nl != nil {
		k.nl.layerSettlements(dst)
		return
	}
	m, tr, d := k.c.m, k.tr, k.ends.d
	for i := range d {
		d[i] = tr.sigma[i] - tr.u[i]
	}
	for e := range m.Elements() {
		l := m.Layer[e]
		if k.ends.final[l] != 0 {
			dst[l] += tr.mv[l] * m.Integrate(d, e)
		}
	}
}

// observe records the degrees at time t and the crossings of
// endOfPrimary since the last record (interpolated linearly in log time,
// as crossing does).
func (pe *primaryEnds) observe(t float64) {
	for i, f := range pe.final {
		if f <= 0 || !math.IsNaN(pe.tp[i]) {
			continue
		}
		u := pe.now[i] / f
		if u >= endOfPrimary {
			if tp := crossing([]float64{pe.prevT, t}, []float64{pe.prev[i], u}, endOfPrimary); tp != nil {
				pe.tp[i] = *tp
			} else {
				pe.tp[i] = t
			}
		}
		pe.prev[i] = u
	}
	pe.prevT = t
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
	type part struct{ t0, tp, ca, cr, ep, h float64 }
	var parts []part
	for i := range p.Layers {
		l := &p.Layers[i]
		ca := calphaOf(l)
		if k.ends.final[i] <= 0 {
			continue
		}
		tp := k.ends.tp[i]
		at := IndexPath("layers", i)
		if math.IsNaN(tp) {
			missing = true
			k.warn(at, fmt.Sprintf("layer %d%s does not reach %g %% of its primary settlement in the simulated time: no secondary compression estimate for it", i+1, quoted(l.Name), 100*endOfPrimary))
			continue
		}
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
		pt := part{t0, tp, ca, cr, ep, l.Thickness}
		parts = append(parts, pt)
		s := secondaryAt(pt.t0, pt.tp, removal, pt.ca, pt.cr, pt.ep, pt.h, life)
		r.Summary.Layers[i].Secondary = ptr(s)
		r.Summary.Layers[i].SecondaryStart = ptr(tp)
		sum += s
	}
	if len(parts) == 0 && missing {
		return
	}
	r.Summary.Secondary = ptr(sum)
	ser := &r.Consolidation.Series
	ser.Secondary = make([]float64, len(ser.Time))
	for j, t := range ser.Time {
		for _, pt := range parts {
			ser.Secondary[j] += secondaryAt(pt.t0, pt.tp, removal, pt.ca, pt.cr, pt.ep, pt.h, t)
		}
	}
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
