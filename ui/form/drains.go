package form

import (
	"porelight/solver"
)

// Drains: the draft's drain layout is switched on and off as a whole,
// its strings (pattern, equivalent, discharge) are edited like any text
// field, and the tip's layer (a pointer in the file) has its own setter.

// SetDrains adds a drain layout to the draft (on; a starting point of our
// own: band drains 100 × 4 mm on a 1.5 m triangular grid through the
// whole column, no smear and no well resistance until given) or removes
// it with its typed text (off).
func (f *Form) SetDrains(on bool) {
	switch {
	case on && f.draft.Drains == nil:
		f.draft.Drains = &solver.Drains{Pattern: "triangular", Spacing: 1.5, Width: 0.1, Thickness: 0.004}
	case !on && f.draft.Drains != nil:
		f.draft.Drains = nil
		f.dropRaw("drains")
	}
	f.check()
}

// SetDrainSize makes the drains band drains (band) or round ones,
// keeping the typed text of the other kind out of the way.
func (f *Form) SetDrainSize(band bool) {
	d := f.draft.Drains
	if d == nil {
		return
	}
	if band && d.Width == 0 && d.Thickness == 0 {
		d.Diameter, d.Width, d.Thickness = 0, 0.1, 0.004
		f.dropRaw("drains.diameter")
	} else if !band && d.Diameter == 0 {
		d.Width, d.Thickness, d.Equivalent, d.Diameter = 0, 0, "", 0.05
		f.dropRaw("drains.width")
		f.dropRaw("drains.thickness")
	}
	f.check()
}

// SetDrainTip puts the drains' tip at the base of layer i, or (i < 0)
// at the depth typed into drains.depth (the base of the column when
// empty).
func (f *Form) SetDrainTip(i int) {
	d := f.draft.Drains
	if d == nil {
		return
	}
	if i < 0 {
		d.ToLayer = nil
	} else {
		d.ToLayer = &i
		d.Depth = 0
		f.dropRaw("drains.depth")
	}
	f.check()
}

// SetDrainDesign adds (on) or removes the design question of the drains.
func (f *Form) SetDrainDesign(on bool) {
	d := f.draft.Drains
	if d == nil {
		return
	}
	switch {
	case on && d.Design == nil:
		d.Design = &solver.DrainDesign{Time: 180}
	case !on && d.Design != nil:
		d.Design = nil
		f.dropRaw("drains.design")
	}
	f.check()
}

// renumberTip follows a structural edit of the layers: the tip stays at
// the base of the same layer, or of the one above a removed one.
func (f *Form) renumberTip(to func(old int) int) {
	d := f.draft.Drains
	if d == nil || d.ToLayer == nil {
		return
	}
	i := to(*d.ToLayer)
	if i < 0 {
		i = max(*d.ToLayer-1, 0)
	}
	d.ToLayer = &i
}

// cloneDrains copies a drain layout deeply (nil stays nil).
func cloneDrains(d *solver.Drains) *solver.Drains {
	if d == nil {
		return nil
	}
	c := *d
	if d.ToLayer != nil {
		i := *d.ToLayer
		c.ToLayer = &i
	}
	if d.Design != nil {
		g := *d.Design
		c.Design = &g
	}
	return &c
}
