package solver

import (
	"fmt"
	"math"
)

// DefaultDesignDegree is the degree of consolidation the drain design
// helper aims at when DrainDesign.Degree is left out.
const DefaultDesignDegree = 0.9

// ResolveDesignDegree is the degree the design question d asks for.
func ResolveDesignDegree(d *DrainDesign) float64 {
	if d == nil || d.Degree == 0 {
		return DefaultDesignDegree
	}
	return d.Degree
}

// SpacingAnswer is what DrainSpacing finds.
type SpacingAnswer struct {
	// Degree and Time are the question, resolved.
	Degree float64 `json:"degree"`
	Time   float64 `json:"time"` // day
	// Spacing is the largest spacing, m, at which the column reaches
	// Degree by Time (to 0.1 % of the spacing), and U the degree it
	// reaches then with that spacing.
	Spacing float64 `json:"spacing"`
	U       float64 `json:"u"`
	// De is the unit cell's diameter at Spacing, m.
	De float64 `json:"de"`
	// Table is the degree at Time and the time to Degree for spacings
	// around Spacing.
	Table []SpacingRow `json:"table"`
	// Solves is the number of full solves made.
	Solves int `json:"solves"`
}

// SpacingRow is one spacing's figures.
type SpacingRow struct {
	Spacing float64 `json:"spacing"` // m
	// U is the degree of consolidation (by settlement) at the design
	// time.
	U float64 `json:"u"`
	// TimeToDegree is when the degree is reached, days (nil: not within
	// the simulated time).
	TimeToDegree *float64 `json:"timeToDegree,omitempty"`
}

// DegreeAt solves p with its drains at the given spacing and returns the
// degree of consolidation by settlement at time t, days, and the time to
// degree (nil when not reached). p is not changed.
func DegreeAt(p *Project, spacing, t, degree float64, opt *Options) (u float64, tDegree *float64, err error) {
	q := designCopy(p, spacing, t, degree)
	o := &Options{NoDrainReference: true}
	if opt != nil {
		o.Progress = opt.Progress
	}
	r, err := Solve(q, o)
	if err != nil {
		return 0, nil, err
	}
	if r.Consolidation == nil || len(r.Consolidation.Series.Us) == 0 {
		var ps Problems
		ps.Add("loads", ErrRequired, "the design helper needs a load that consolidates the column")
		return 0, nil, ps
	}
	s := r.Consolidation.Series
	return SeriesAt(s.Time, s.Us, t), r.Summary.TTarget, nil
}

// designCopy is p with the drains at spacing, t among the output times
// and degree as the target degree.
func designCopy(p *Project, spacing, t, degree float64) *Project {
	q := *p
	d := *p.Drains
	d.Spacing = spacing
	d.Design = nil
	q.Drains = &d
	q.TargetDegree = degree
	q.Times = nil
	added := false
	for _, x := range p.Times {
		if !added && x >= t {
			if x != t {
				q.Times = append(q.Times, t)
			}
			added = true
		}
		q.Times = append(q.Times, x)
	}
	if !added {
		q.Times = append(q.Times, t)
	}
	return &q
}

// DrainSpacing answers p.Drains.Design: the largest spacing of p's drain
// pattern at which the average degree of consolidation by settlement
// reaches Design.Degree by Design.Time, found by bisection in log spacing
// on the real solve (the degree falls as the spacing grows), and a table
// of the degree and the time to the degree for spacings from half to
// twice the answer. Errors are Problems: p's own, drains.design.* when
// the question is missing or cannot be met (even the closest spacing the
// drain allows is too slow, or the column gets there without drains).
func DrainSpacing(p *Project, opt *Options) (*SpacingAnswer, error) {
	if err := Validate(p); err != nil {
		return nil, err
	}
	var ps Problems
	if p.Drains == nil || p.Drains.Design == nil {
		ps.Add("drains.design", ErrRequired, "give the degree and the time the drains must reach")
		return nil, ps
	}
	des := p.Drains.Design
	a := &SpacingAnswer{Degree: ResolveDesignDegree(des), Time: des.Time}
	dc := ResolveDrains(p)
	factor := dc.De / p.Drains.Spacing
	// The closest spacing: a cell twice the smear zone (or the drain).
	lo := math.Max(2*math.Max(dc.SmearRatio, 1)*dc.Dw/factor, MinSpacing)
	hi := math.Min(math.Max(10*p.Drains.Spacing, 100*lo), MaxSpacing)
	deg := func(s float64) (float64, error) {
		a.Solves++
		u, _, err := DegreeAt(p, s, a.Time, a.Degree, opt)
		return u, err
	}
	uLo, err := deg(lo)
	if err != nil {
		return nil, err
	}
	if uLo < a.Degree {
		ps.Add("drains.design.time", ErrOutOfRange, fmt.Sprintf("even drains %.3g m apart reach only %.1f %% by %g days; allow more time, or a larger drain or less smear", lo, 100*uLo, a.Time))
		return nil, ps
	}
	uHi, err := deg(hi)
	if err != nil {
		return nil, err
	}
	if uHi >= a.Degree {
		ps.Add("drains.design.time", ErrOutOfRange, fmt.Sprintf("drains %.3g m apart still reach %.1f %% by %g days: the column hardly needs drains for this target", hi, 100*uHi, a.Time))
		return nil, ps
	}
	// Bisection in log spacing: 0.1 % of the spacing.
	for hi/lo > 1.001 {
		mid := math.Sqrt(lo * hi)
		u, err := deg(mid)
		if err != nil {
			return nil, err
		}
		if u >= a.Degree {
			lo, uLo = mid, u
		} else {
			hi = mid
		}
	}
	a.Spacing, a.U, a.De = lo, uLo, factor*lo
	a.Table, err = SpacingTable(p, a.Time, a.Degree, tableSpacings(lo), opt)
	a.Solves += len(a.Table)
	return a, err
}

// tableSpacings are seven spacings from half to twice s, rounded to the
// centimetre.
func tableSpacings(s float64) []float64 {
	var out []float64
	for i := -3; i <= 3; i++ {
		out = append(out, math.Round(100*s*math.Pow(2, float64(i)/3))/100)
	}
	return out
}

// SpacingTable returns, for each spacing, the degree of consolidation at
// time t, days, and the time to degree, solving p with its drains at that
// spacing. p must have drains.
func SpacingTable(p *Project, t, degree float64, spacings []float64, opt *Options) ([]SpacingRow, error) {
	rows := make([]SpacingRow, 0, len(spacings))
	for _, s := range spacings {
		u, td, err := DegreeAt(p, s, t, degree, opt)
		if err != nil {
			return nil, err
		}
		rows = append(rows, SpacingRow{Spacing: s, U: u, TimeToDegree: td})
	}
	return rows, nil
}
