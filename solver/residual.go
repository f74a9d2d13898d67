package solver

import "fmt"

// Residual is the settlement still to come after a handover date
// (Decisions.Handover) up to the design life, from the model the summary
// names (Summary.Model): the primary settlement left and the secondary
// compression yet to happen, per layer and in total. Settlements in m,
// positive down; times in days after day 0.
type Residual struct {
	// Time is the handover day, Life the design life.
	Time float64 `json:"time"`
	Life float64 `json:"life"`
	// Reached is the settlement reached by Time, primary plus secondary.
	Reached float64 `json:"reached"`
	// Primary is the primary settlement from Time to Life (negative: a
	// net rebound), Secondary the secondary compression from Time to
	// Life, Total their sum: what the pavement or structure will see.
	Primary   float64 `json:"primary"`
	Secondary float64 `json:"secondary"`
	Total     float64 `json:"total"`
	// AtLife is the whole settlement at Life, primary plus secondary.
	AtLife float64 `json:"atLife"`
	// Layers holds the same figures per layer, top to bottom.
	Layers []LayerResidual `json:"layers"`
}

// LayerResidual is one layer's share of a Residual, m.
type LayerResidual struct {
	Name      string  `json:"name"`
	Reached   float64 `json:"reached"`
	Primary   float64 `json:"primary"`
	Secondary float64 `json:"secondary"`
	Total     float64 `json:"total"`
	AtLife    float64 `json:"atLife"`
}

// residual fills Result.Residual when a handover day is asked: each
// layer's primary settlement at a time is its series (Series.Layers)
// there, or its final settlement (LayerSummary.Settlement) past the end
// of the simulation; its secondary compression is its Mesri (1973)
// estimate at that time (the one Series.Secondary sums).
func (k *consolidation) residual() {
	p, r := k.c.p, k.r
	if layerSeries(p) == 0 {
		return
	}
	ser := &r.Consolidation.Series
	t, life := p.Decisions.Handover, r.Summary.DesignLife
	end := ser.Time[len(ser.Time)-1]
	res := &Residual{Time: t, Life: life, Layers: make([]LayerResidual, len(p.Layers))}
	primary := func(i int, at float64) float64 {
		if at >= end {
			return r.Summary.Layers[i].Settlement
		}
		return SeriesAt(ser.Time, ser.Layers[i], at)
	}
	for i, l := range p.Layers {
		lr := &res.Layers[i]
		lr.Name = l.Name
		s0, s1 := primary(i, t), primary(i, life)
		var c0, c1 float64
		for _, pt := range k.secParts {
			if pt.layer == i {
				c0, c1 = pt.at(t), pt.at(life)
			}
		}
		lr.Reached = s0 + c0
		lr.Primary = s1 - s0
		lr.Secondary = c1 - c0
		lr.Total = lr.Primary + lr.Secondary
		lr.AtLife = s1 + c1
		res.Reached += lr.Reached
		res.Primary += lr.Primary
		res.Secondary += lr.Secondary
		res.Total += lr.Total
		res.AtLife += lr.AtLife
	}
	if life > end {
		k.warn(JoinPath(DecisionsPath, "handover"), fmt.Sprintf("the design life (%.4g days) is past the end of the simulation (%.4g days): the primary settlement at it is taken as the final one", life, end))
	}
	r.Residual = res
}
