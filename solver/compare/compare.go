// Package compare solves a project's options (solver.Variant) beside
// the project as given, each as a project of its own through
// solver.Solve, and reduces each to the figures tabulated side by side.
package compare

import (
	"porelight/solver"
	"porelight/solver/uncertain"
)

// BaseName names the project as given among its options.
const BaseName = solver.BaseOptionName

// Outcome is one option's solve.
type Outcome struct {
	Name    string         `json:"name"`
	Result  *solver.Result `json:"-"`
	Problem string         `json:"problem,omitempty"`
	Figures Figures        `json:"figures"`
}

// Figures are the numbers compared side by side (nil: none or never
// reached in the simulated time).
type Figures struct {
	// Final is the final primary settlement plus the secondary
	// compression at the design life, m; Remaining is what of it is
	// still to come after Date, days (solver.ResolveUncertaintyDate:
	// the end of the last load change unless uncertainty.date is given).
	Final     float64  `json:"final"`
	Remaining float64  `json:"remaining"`
	Date      float64  `json:"date"`
	T50       *float64 `json:"t50,omitempty"`
	T90       *float64 `json:"t90,omitempty"`
	TTarget   *float64 `json:"tTarget,omitempty"`
}

// Projects returns the project as given (first, named BaseName) and each
// of its options applied, in order.
func Projects(p *solver.Project) (names []string, ps []*solver.Project) {
	base := *p
	base.Variants, base.Uncertainty, base.Alignment = nil, nil, nil
	names, ps = []string{BaseName}, []*solver.Project{&base}
	for i := range p.Variants {
		names = append(names, p.Variants[i].Name)
		ps = append(ps, p.Variants[i].Apply(p))
	}
	return names, ps
}

// Solve solves the project as given and every option. The date of the
// remaining settlement is the project's for all. A solve that fails
// leaves its Problem and no Result. progress, when not nil, receives the
// number of solves done and the total.
func Solve(p *solver.Project, progress func(done, total int)) []Outcome {
	names, ps := Projects(p)
	date := solver.ResolveUncertaintyDate(p)
	out := make([]Outcome, len(ps))
	for i, q := range ps {
		out[i] = One(names[i], q, date)
		if progress != nil {
			progress(i+1, len(ps))
		}
	}
	return out
}

// One solves q and takes its figures.
func One(name string, q *solver.Project, date float64) Outcome {
	o := Outcome{Name: name}
	r, err := solver.Solve(q, nil)
	if err != nil {
		o.Problem = err.Error()
		if ps := solver.AsProblems(err); len(ps) > 0 {
			o.Problem = ps[0].Path + ": " + ps[0].Message
		}
		return o
	}
	o.Result = r
	o.Figures = Take(r, date)
	return o
}

// Take reads the compared figures off a result.
func Take(r *solver.Result, date float64) Figures {
	f := Figures{Date: date, T50: r.Summary.T50, T90: r.Summary.T90, TTarget: r.Summary.TTarget}
	f.Final = uncertain.FinalTotal(r)
	if r.Consolidation != nil {
		f.Remaining = f.Final - uncertain.TotalAt(&r.Consolidation.Series, date)
	}
	return f
}

// Point is one section of the profile: the settlement at the date, m
// (primary of the model plus secondary), of the option it is.
type Point struct {
	Name       string  `json:"name"`
	Chainage   float64 `json:"chainage"` // m
	Option     string  `json:"option"`
	Settlement float64 `json:"settlement"`
	Problem    string  `json:"problem,omitempty"`
}

// Span is the stretch between two neighbouring sections: the
// differential settlement (next less previous, m) and the angular
// distortion |differential| / distance, with Over set when it exceeds
// the alignment's limit (never without one).
type Span struct {
	From, To     int
	Differential float64 `json:"differential"`
	Distortion   float64 `json:"distortion"`
	Over         bool    `json:"over"`
}

// Profile reads the alignment of p off outcomes (Solve(p)): each
// section's settlement at solver.ResolveAlignmentDate(p), and the spans
// between neighbours (none across a section without a result).
func Profile(p *solver.Project, outcomes []Outcome) (points []Point, spans []Span) {
	if p.Alignment == nil {
		return nil, nil
	}
	date := solver.ResolveAlignmentDate(p)
	byName := map[string]*Outcome{}
	for i := range outcomes {
		byName[outcomes[i].Name] = &outcomes[i]
	}
	for _, s := range p.Alignment.Sections {
		opt := s.Option
		if opt == "" {
			opt = BaseName
		}
		pt := Point{Name: s.Name, Chainage: s.Chainage, Option: opt}
		switch o := byName[opt]; {
		case o == nil:
			pt.Problem = "no option called " + opt
		case o.Result == nil || o.Result.Consolidation == nil:
			pt.Problem = "no settlement: " + o.Problem
		default:
			pt.Settlement = uncertain.TotalAt(&o.Result.Consolidation.Series, date)
		}
		points = append(points, pt)
	}
	for i := 1; i < len(points); i++ {
		a, b := points[i-1], points[i]
		if a.Problem != "" || b.Problem != "" {
			continue
		}
		d := b.Settlement - a.Settlement
		sp := Span{From: i - 1, To: i, Differential: d, Distortion: abs(d) / (b.Chainage - a.Chainage)}
		sp.Over = p.Alignment.Limit > 0 && sp.Distortion > p.Alignment.Limit
		spans = append(spans, sp)
	}
	return points, spans
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}
