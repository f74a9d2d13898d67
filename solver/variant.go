package solver

import (
	"fmt"
	"strings"
)

// Variant is a named option: a set of changes to the project it belongs
// to. Each field left out (nil, false) keeps the project's value. Loads
// and Layers are aligned with Project.Loads and Project.Layers (item i
// changes stage or layer i) and may be shorter.
type Variant struct {
	// Name labels the option in tables and plots; required, unique.
	Name string `json:"name"`
	// NoDrains removes the project's drains.
	NoDrains bool `json:"noDrains,omitempty"`
	// DrainSpacing replaces drains.spacing, m (the project must have
	// drains).
	DrainSpacing *float64      `json:"drainSpacing,omitempty"`
	Loads        []LoadChange  `json:"loads,omitempty"`
	Layers       []LayerChange `json:"layers,omitempty"`
}

// LoadChange changes one load stage: its start and ramp, days, its
// pressure q, kPa, or its fill's thickness, m.
type LoadChange struct {
	Start         *float64 `json:"start,omitempty"`
	Ramp          *float64 `json:"ramp,omitempty"`
	Q             *float64 `json:"q,omitempty"`
	FillThickness *float64 `json:"fillThickness,omitempty"`
}

// LayerChange changes one layer's thickness, m, k, m/s, mv, 1/kPa, or
// ch, m²/day.
type LayerChange struct {
	Thickness *float64 `json:"thickness,omitempty"`
	K         *float64 `json:"k,omitempty"`
	Mv        *float64 `json:"mv,omitempty"`
	Ch        *float64 `json:"ch,omitempty"`
}

// MaxVariants is the most variants one project holds.
const MaxVariants = 12

// BaseOptionName names the project as given beside its options (a
// section's Option left empty means it).
const BaseOptionName = "As given"

// Apply returns a copy of p with v's changes, without p's Variants, Alignment and
// Uncertainty (an option is solved as a project of its own). p is
// unchanged; the copy shares nothing that Apply changes. Changes to
// stages or layers p does not have are ignored (Validate refuses them).
func (v *Variant) Apply(p *Project) *Project {
	q := *p
	q.Variants, q.Uncertainty, q.Alignment = nil, nil, nil
	if v.NoDrains {
		q.Drains = nil
	} else if v.DrainSpacing != nil && p.Drains != nil {
		d := *p.Drains
		d.Spacing = *v.DrainSpacing
		q.Drains = &d
	}
	if len(v.Loads) > 0 {
		q.Loads = append([]Load(nil), p.Loads...)
		for i, c := range v.Loads {
			if i >= len(q.Loads) {
				break
			}
			l := &q.Loads[i]
			set(&l.Start, c.Start)
			set(&l.Ramp, c.Ramp)
			set(&l.Q, c.Q)
			if c.FillThickness != nil && l.Fill != nil {
				f := *l.Fill
				f.Thickness = *c.FillThickness
				l.Fill = &f
			}
		}
	}
	if len(v.Layers) > 0 {
		q.Layers = append([]Layer(nil), p.Layers...)
		for i, c := range v.Layers {
			if i >= len(q.Layers) {
				break
			}
			l := &q.Layers[i]
			set(&l.Thickness, c.Thickness)
			set(&l.K, c.K)
			set(&l.Mv, c.Mv)
			set(&l.Ch, c.Ch)
			if c.Ch != nil {
				l.KhKv = 0 // ch given: kh/kv no longer applies
			}
		}
	}
	return &q
}

func set(dst *float64, v *float64) {
	if v != nil {
		*dst = *v
	}
}

// variantPath maps a path of the applied project to the variant's
// field that set it, if any.
func variantPath(at string, v *Variant, path string) (string, bool) {
	steps, err := ParsePath(path)
	if err != nil || len(steps) == 0 {
		return "", false
	}
	switch {
	case path == "drains.spacing" && v.DrainSpacing != nil:
		return JoinPath(at, "drainSpacing"), true
	case steps[0].Name == "loads" && steps[0].Index >= 0 && steps[0].Index < len(v.Loads) && len(steps) > 1:
		c, leaf := v.Loads[steps[0].Index], strings.TrimPrefix(path, IndexPath("loads", steps[0].Index)+".")
		ok := (leaf == "start" && c.Start != nil) || (leaf == "ramp" && c.Ramp != nil) || (leaf == "q" && c.Q != nil)
		if leaf == "fill.thickness" && c.FillThickness != nil {
			return JoinPath(IndexPath(JoinPath(at, "loads"), steps[0].Index), "fillThickness"), true
		}
		if ok {
			return JoinPath(IndexPath(JoinPath(at, "loads"), steps[0].Index), leaf), true
		}
	case steps[0].Name == "layers" && steps[0].Index >= 0 && steps[0].Index < len(v.Layers) && len(steps) > 1:
		c, leaf := v.Layers[steps[0].Index], strings.TrimPrefix(path, IndexPath("layers", steps[0].Index)+".")
		if (leaf == "k" && c.K != nil) || (leaf == "mv" && c.Mv != nil) || (leaf == "ch" && c.Ch != nil) || (leaf == "thickness" && c.Thickness != nil) {
			return JoinPath(IndexPath(JoinPath(at, "layers"), steps[0].Index), leaf), true
		}
	}
	return "", false
}

// validVariants checks every variant by validating the project it makes:
// a problem in a value the variant set is filed at the variant's field,
// any other at the variant, naming the project's field.
func validVariants(ps *Problems, p *Project) {
	if len(p.Variants) > MaxVariants {
		ps.Add("variants", ErrTooLarge, fmt.Sprintf("%d options, the limit is %d", len(p.Variants), MaxVariants))
		return
	}
	names := map[string]bool{}
	for i := range p.Variants {
		v := &p.Variants[i]
		at := IndexPath("variants", i)
		name := strings.TrimSpace(v.Name)
		switch {
		case name == "":
			ps.Add(JoinPath(at, "name"), ErrRequired, "name the option")
		case names[name]:
			ps.Add(JoinPath(at, "name"), ErrConflict, fmt.Sprintf("another option is called %q", name))
		case name == BaseOptionName:
			ps.Add(JoinPath(at, "name"), ErrConflict, fmt.Sprintf("%q names the project itself", name))
		}
		names[name] = true
		if v.DrainSpacing != nil && (p.Drains == nil || v.NoDrains) {
			ps.Add(JoinPath(at, "drainSpacing"), ErrConflict, "the project has no drains to space")
		}
		if len(v.Loads) > len(p.Loads) {
			ps.Add(JoinPath(at, "loads"), ErrOutOfRange, fmt.Sprintf("%d changes for %d load stages", len(v.Loads), len(p.Loads)))
		}
		if len(v.Layers) > len(p.Layers) {
			ps.Add(JoinPath(at, "layers"), ErrOutOfRange, fmt.Sprintf("%d changes for %d layers", len(v.Layers), len(p.Layers)))
		}
		for j, c := range v.Loads {
			if c.FillThickness != nil && j < len(p.Loads) && p.Loads[j].Fill == nil {
				ps.Add(JoinPath(IndexPath(JoinPath(at, "loads"), j), "fillThickness"), ErrConflict, "this stage is a pressure, not a fill")
			}
		}
		for _, pr := range AsProblems(Validate(v.Apply(p))) {
			if path, ok := variantPath(at, v, pr.Path); ok {
				*ps = append(*ps, Problem{Path: path, Message: pr.Message, Err: pr.Err})
				continue
			}
			*ps = append(*ps, Problem{Path: at, Message: "with this option, " + pr.Path + " " + pr.Message, Err: pr.Err})
		}
	}
}

// Alignment places columns (the project as given, or one of its options)
// at chainages along a line, for the settlement profile at a date and
// the differential settlement and angular distortion between
// neighbouring sections (package solver/compare).
type Alignment struct {
	Sections []Section `json:"sections"`
	// Date is the day of the profile; zero means the design life.
	Date float64 `json:"date,omitempty"`
	// Limit is the angular distortion (differential settlement over
	// distance) the engineer accepts, e.g. 0.002 for 1/500; zero: none
	// given, nothing checked. 0 … 1.
	Limit float64 `json:"limit,omitempty"`
}

// Section is one column of an alignment.
type Section struct {
	Name string `json:"name,omitempty"`
	// Chainage is the distance along the alignment, m; increasing from
	// one section to the next.
	Chainage float64 `json:"chainage"`
	// Option names the variant the column is ("" or BaseOptionName: the
	// project as given).
	Option string `json:"option,omitempty"`
}

// Bounds of an alignment.
const (
	MaxSections = 50
	MaxChainage = 1e7 // m
)

// ResolveAlignmentDate is the day of the profile: Alignment.Date, or the
// design life.
func ResolveAlignmentDate(p *Project) float64 {
	if p.Alignment != nil && p.Alignment.Date > 0 {
		return p.Alignment.Date
	}
	return ResolveDesignLife(p)
}

func validAlignment(ps *Problems, p *Project) {
	a := p.Alignment
	if a == nil {
		return
	}
	if len(a.Sections) > MaxSections {
		ps.Add("alignment.sections", ErrTooLarge, fmt.Sprintf("%d sections, the limit is %d", len(a.Sections), MaxSections))
		return
	}
	if a.Date != 0 {
		upTo(ps, "alignment.date", a.Date, MaxTime, "days")
	}
	if a.Limit != 0 {
		upTo(ps, "alignment.limit", a.Limit, 1, "")
	}
	names := map[string]bool{"": true, BaseOptionName: true}
	for _, v := range p.Variants {
		names[strings.TrimSpace(v.Name)] = true
	}
	for i, s := range a.Sections {
		at := IndexPath("alignment.sections", i)
		if within(ps, JoinPath(at, "chainage"), s.Chainage, MaxChainage, "m") && i > 0 {
			if prev := a.Sections[i-1].Chainage; !(s.Chainage > prev) {
				ps.Add(JoinPath(at, "chainage"), ErrNotSorted, fmt.Sprintf("%s m after %s m", num(s.Chainage), num(prev)))
			}
		}
		if !names[strings.TrimSpace(s.Option)] {
			ps.Add(JoinPath(at, "option"), ErrOutOfRange, fmt.Sprintf("no option is called %q", s.Option))
		}
	}
}
