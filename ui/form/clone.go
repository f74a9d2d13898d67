package form

import (
	"slices"

	"porelight/solver"
)

// cloneProject makes a deep copy, so nothing is shared between the draft,
// the model and a solve in progress.
func cloneProject(p *solver.Project) *solver.Project {
	q := *p
	if p.Units != nil {
		u := *p.Units
		q.Units = &u
	}
	q.Layers = slices.Clone(p.Layers)
	for i, l := range q.Layers {
		if l.ECurve != nil {
			c := *l.ECurve
			q.Layers[i].ECurve = &c
		}
		if o := l.Outlet; o != nil {
			c := solver.Outlet{Head: clonePtr(o.Head)}
			q.Layers[i].Outlet = &c
		}
	}
	q.Top = cloneBoundary(p.Top)
	q.Bottom = cloneBoundary(p.Bottom)
	q.Loads = slices.Clone(p.Loads)
	for i, l := range q.Loads {
		q.Loads[i].Profile = slices.Clone(l.Profile)
		if l.Fill != nil {
			f := *l.Fill
			q.Loads[i].Fill = &f
		}
		if l.Area != nil {
			a := *l.Area
			q.Loads[i].Area = &a
		}
		if d := l.Dig; d != nil {
			c := solver.Dig{Depth: d.Depth, WaterLevel: clonePtr(d.WaterLevel)}
			q.Loads[i].Dig = &c
		}
		if w := l.Lower; w != nil {
			c := *w
			q.Loads[i].Lower = &c
		}
	}
	q.InitialExcess = slices.Clone(p.InitialExcess)
	q.Times = slices.Clone(p.Times)
	q.Piezometers = slices.Clone(p.Piezometers)
	q.Monitoring = cloneMonitoring(p.Monitoring)
	q.Drains = cloneDrains(p.Drains)
	q.Decisions = cloneDecisions(p.Decisions)
	return &q
}

func clonePtr(v *float64) *float64 {
	if v == nil {
		return nil
	}
	c := *v
	return &c
}

func cloneBoundary(b solver.Boundary) solver.Boundary {
	if b.Head != nil {
		h := *b.Head
		b.Head = &h
	}
	b.Excess = slices.Clone(b.Excess)
	return b
}

// cloneMonitoring copies the records deeply (nil stays nil).
func cloneMonitoring(m *solver.Monitoring) *solver.Monitoring {
	if m == nil {
		return nil
	}
	c := *m
	c.Plates = slices.Clone(m.Plates)
	for i := range c.Plates {
		c.Plates[i].Readings = slices.Clone(c.Plates[i].Readings)
	}
	c.Piezometers = slices.Clone(m.Piezometers)
	for i := range c.Piezometers {
		c.Piezometers[i].Readings = slices.Clone(c.Piezometers[i].Readings)
	}
	c.Asaoka = cloneAsaoka(m.Asaoka)
	return &c
}
