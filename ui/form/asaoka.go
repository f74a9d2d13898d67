package form

import (
	"slices"

	"porelight/solver"
)

// Asaoka returns a copy of the draft's saved choices for Asaoka's method
// (monitoring.asaoka), nil when none are saved.
func (f *Form) Asaoka() *solver.AsaokaSettings {
	if f.draft.Monitoring == nil {
		return nil
	}
	return cloneAsaoka(f.draft.Monitoring.Asaoka)
}

// SetAsaoka saves the choices for Asaoka's method in the draft (a copy of
// a); nil or the zero value removes them, so the defaults apply.
func (f *Form) SetAsaoka(a *solver.AsaokaSettings) {
	if a == nil || (a.From == 0 && a.To == 0 && len(a.Layers) == 0) {
		if f.draft.Monitoring != nil {
			f.draft.Monitoring.Asaoka = nil
		}
	} else {
		f.mon().Asaoka = cloneAsaoka(a)
	}
	f.check()
}

// remapAsaokaLayers renumbers the saved consolidating layers after a
// layer edit (to as for remap: −1 drops the layer); a list left empty
// falls back to the default.
func (f *Form) remapAsaokaLayers(to func(old int) int) {
	if f.draft.Monitoring == nil || f.draft.Monitoring.Asaoka == nil {
		return
	}
	a := f.draft.Monitoring.Asaoka
	var ls []int
	for _, l := range a.Layers {
		if n := to(l); n >= 0 {
			ls = append(ls, n)
		}
	}
	slices.Sort(ls)
	a.Layers = ls
}

func cloneAsaoka(a *solver.AsaokaSettings) *solver.AsaokaSettings {
	if a == nil {
		return nil
	}
	c := *a
	c.Layers = slices.Clone(a.Layers)
	return &c
}
