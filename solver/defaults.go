package solver

import (
	"math"

	"porelight/solver/fem"
)

// Defaults: the value a project gets where it leaves a field out (or at
// zero). They are the one source of these facts: the solver uses them,
// and the page shows them as the placeholders of empty inputs.
const (
	// DefaultGammaW is the unit weight of water, kN/m³ (common practice).
	DefaultGammaW = 9.81
	// DefaultTargetDegree is the degree of consolidation whose time is
	// reported, a fraction.
	DefaultTargetDegree = 0.95
	// DefaultDesignLife is the time at which secondary compression is
	// evaluated: 50 years, in days.
	DefaultDesignLife = 50 * DaysPerYear
	// DefaultOrder is the element order (linear).
	DefaultOrder = 1
	// DefaultDivisions is the number of elements over the column height
	// when mesh.maxSize is left out: maxSize = height/DefaultDivisions.
	DefaultDivisions = 200
	// DefaultMinPerLayer is the least number of elements in any layer.
	DefaultMinPerLayer = 4
	// DefaultTheta is the θ of the θ-method after the damped start
	// (Crank–Nicolson).
	DefaultTheta = 0.5
	// DefaultDampedSteps is the number of backward Euler steps after
	// every instantaneous change (Rannacher 1984).
	DefaultDampedSteps = 4
	// DefaultFirstStep is the first time step after every breakpoint:
	// one minute, in days.
	DefaultFirstStep = 1.0 / 1440
	// DefaultGrowth is the ratio between consecutive time steps.
	DefaultGrowth = 1.1
	// DefaultSettleTime is how long the simulation runs after the last
	// load or boundary change when stepping.endTime is left out: 100
	// years, in days.
	DefaultSettleTime = 100 * DaysPerYear
	// DaysPerYear is the length of the (Julian) year the page's years
	// convert by, days.
	DaysPerYear = 365.25
)

// ResolveGammaW is the unit weight of water p uses, kN/m³.
func ResolveGammaW(p *Project) float64 {
	if p.GammaW == 0 {
		return DefaultGammaW
	}
	return p.GammaW
}

// ResolveTargetDegree is the degree of consolidation, a fraction, whose
// time p reports.
func ResolveTargetDegree(p *Project) float64 {
	if p.TargetDegree == 0 {
		return DefaultTargetDegree
	}
	return p.TargetDegree
}

// ResolveDesignLife is the time, days, at which p evaluates secondary
// compression.
func ResolveDesignLife(p *Project) float64 {
	if p.DesignLife == 0 {
		return DefaultDesignLife
	}
	return p.DesignLife
}

// ResolveMesh returns p's mesh settings with every default filled in:
// Order 1 or 2, MaxSize > 0 (height/DefaultDivisions when left out) and
// MinPerLayer ≥ 1.
func ResolveMesh(p *Project) MeshSettings {
	m := p.Mesh
	if m.Order == 0 {
		m.Order = DefaultOrder
	}
	if m.MinPerLayer == 0 {
		m.MinPerLayer = DefaultMinPerLayer
	}
	if m.MaxSize == 0 {
		m.MaxSize = ColumnHeight(p) / DefaultDivisions
	}
	return m
}

// ColumnHeight is the sum of the layer thicknesses, m.
func ColumnHeight(p *Project) float64 {
	h := 0.0
	for _, l := range p.Layers {
		h += l.Thickness
	}
	return h
}

// ResolveStepping returns p's time stepping settings with every default
// filled in. Its DampedSteps is the actual count (0 for none, where the
// file says a negative number), and EndTime is the last time simulated
// (see Stepping.EndTime). The result is for reading, not for saving back:
// a resolved DampedSteps of 0 would read as the default.
func ResolveStepping(p *Project) Stepping {
	s := p.Stepping
	if s.Theta == 0 {
		s.Theta = DefaultTheta
	}
	switch {
	case s.DampedSteps == 0:
		s.DampedSteps = DefaultDampedSteps
	case s.DampedSteps < 0:
		s.DampedSteps = 0
	}
	if s.FirstStep == 0 {
		s.FirstStep = DefaultFirstStep
	}
	if s.Growth == 0 {
		s.Growth = DefaultGrowth
	}
	s.EndTime = EndTime(p)
	return s
}

// EndTime is the last time p simulates, days: Stepping.EndTime when set,
// else DefaultSettleTime after LastLoadChange(p), or the last output time if
// that is later.
func EndTime(p *Project) float64 {
	if p.Stepping.EndTime > 0 {
		return p.Stepping.EndTime
	}
	end := LastLoadChange(p) + DefaultSettleTime
	if n := len(p.Times); n > 0 {
		end = math.Max(end, p.Times[n-1])
	}
	return end
}

// LastLoadChange returns the time, days, after which the loading of p no
// longer changes: the end of the last load stage (start + ramp; the start
// of an instantaneous one) or the last point of a pressure history at a
// drained end, whichever is later. It is 0 for a project with neither.
// Settlement readings after it follow consolidation under constant load,
// which is what Asaoka's method assumes.
func LastLoadChange(p *Project) float64 {
	last := 0.0
	for _, l := range p.Loads {
		last = math.Max(last, l.Start+l.Ramp)
	}
	for _, b := range []Boundary{p.Top, p.Bottom} {
		if !b.Drained {
			continue
		}
		for _, tv := range b.Excess {
			last = math.Max(last, tv.T)
		}
	}
	return last
}

// HasConsolidation reports whether p changes anything in time: a load, an
// initial excess pore pressure or a pressure history at a drained end.
func HasConsolidation(p *Project) bool {
	return len(p.Loads) > 0 || len(p.InitialExcess) > 0 ||
		(p.Top.Drained && len(p.Top.Excess) > 0) || (p.Bottom.Drained && len(p.Bottom.Excess) > 0)
}

// elementCount is the number of elements the mesh of p would have,
// computed without making them (saturating at MaxElements+1).
func elementCount(p *Project) int {
	ms := ResolveMesh(p)
	n := 0
	breaks, top := meshBreaks(p), 0.0
	for _, l := range p.Layers {
		if l.Thickness/ms.MaxSize > MaxElements {
			return MaxElements + 1
		}
		n += fem.DivisionsBreaks(top, l.Thickness, breaks, ms.MaxSize, ms.MinPerLayer)
		top += l.Thickness
		if n > MaxElements {
			return MaxElements + 1
		}
	}
	return n
}
