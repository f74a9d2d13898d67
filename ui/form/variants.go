package form

import (
	"fmt"
	"reflect"

	"porelight/solver"
)

// AddVariant appends an option that changes nothing yet, named "Option
// n", with one (empty) change per load stage and per layer.
func (f *Form) AddVariant() {
	if len(f.draft.Variants) >= solver.MaxVariants {
		return
	}
	f.draft.Variants = append(f.draft.Variants, solver.Variant{
		Name:   fmt.Sprintf("Option %d", len(f.draft.Variants)+1),
		Loads:  make([]solver.LoadChange, len(f.draft.Loads)),
		Layers: make([]solver.LayerChange, len(f.draft.Layers)),
	})
	f.check()
}

// RemoveVariant deletes option i; the typed text of those after it moves
// with them.
func (f *Form) RemoveVariant(i int) {
	if i < 0 || i >= len(f.draft.Variants) {
		return
	}
	f.dropRaw(solver.IndexPath("variants", i))
	f.draft.Variants = append(f.draft.Variants[:i:i], f.draft.Variants[i+1:]...)
	f.remap("variants", Removed(i))
	f.check()
}

// SetVariantNoDrains makes option i remove the drains (on) or keep them.
func (f *Form) SetVariantNoDrains(i int, on bool) {
	if i < 0 || i >= len(f.draft.Variants) {
		return
	}
	v := &f.draft.Variants[i]
	v.NoDrains = on
	if on {
		v.DrainSpacing = nil
		f.dropRaw(solver.JoinPath(solver.IndexPath("variants", i), "drainSpacing"))
	}
	f.check()
}

// remapVariantLayers moves each option's layer changes (and their typed
// text) with their layers after a structural edit of the layers.
func (f *Form) remapVariantLayers(to func(old int) int) {
	for i := range f.draft.Variants {
		v := &f.draft.Variants[i]
		v.Layers = moved(v.Layers, len(f.draft.Layers), to)
		f.remap(solver.JoinPath(solver.IndexPath("variants", i), "layers"), to)
	}
}

// remapVariantLoads does the same for the load stages.
func (f *Form) remapVariantLoads(to func(old int) int) {
	for i := range f.draft.Variants {
		v := &f.draft.Variants[i]
		v.Loads = moved(v.Loads, len(f.draft.Loads), to)
		f.remap(solver.JoinPath(solver.IndexPath("variants", i), "loads"), to)
	}
}

// moved is xs with each entry at its new index to(old) in a slice of n
// (entries that leave it are dropped, the others zero).
func moved[T any](xs []T, n int, to func(old int) int) []T {
	out := make([]T, n)
	for old, x := range xs {
		if j := to(old); j >= 0 && j < n {
			out[j] = x
		}
	}
	return out
}

// fitVariants gives every option one change per stage and layer, so that
// each has an input (a stage added after the option, say).
func (f *Form) fitVariants() {
	for i := range f.draft.Variants {
		v := &f.draft.Variants[i]
		for len(v.Loads) < len(f.draft.Loads) {
			v.Loads = append(v.Loads, solver.LoadChange{})
		}
		for len(v.Layers) < len(f.draft.Layers) {
			v.Layers = append(v.Layers, solver.LayerChange{})
		}
	}
}

// FitVariants is fitVariants followed by a check.
func (f *Form) FitVariants() {
	f.fitVariants()
	f.check()
}

// clearVariantLeaf makes an option's number at path absent (its pointer
// nil): the option then keeps the project's value.
func clearVariantLeaf(p *solver.Project, path string) error {
	steps, err := solver.ParsePath(path)
	if err != nil {
		return err
	}
	v := reflect.ValueOf(p).Elem()
	for k, st := range steps {
		for v.Kind() == reflect.Pointer {
			if v.IsNil() {
				return nil
			}
			v = v.Elem()
		}
		fd, ok := fieldByJSON(v.Type(), st.Name)
		if !ok {
			return fmt.Errorf("no field %q in %q", st.Name, path)
		}
		v = v.FieldByIndex(fd.Index)
		if st.Index >= 0 {
			if st.Index >= v.Len() {
				return nil
			}
			v = v.Index(st.Index)
		}
		if k == len(steps)-1 {
			v.Set(reflect.Zero(v.Type()))
		}
	}
	return nil
}

// AddSection appends a section of the project as given, 20 m after the
// last one, creating the alignment if need be.
func (f *Form) AddSection() {
	a := f.draft.Alignment
	if a == nil {
		a = &solver.Alignment{}
		f.draft.Alignment = a
	}
	if len(a.Sections) >= solver.MaxSections {
		return
	}
	c := 0.0
	if n := len(a.Sections); n > 0 {
		c = a.Sections[n-1].Chainage + 20
	}
	a.Sections = append(a.Sections, solver.Section{Name: fmt.Sprintf("S%d", len(a.Sections)+1), Chainage: c})
	f.check()
}

// RemoveSection deletes section i; without sections the alignment goes.
func (f *Form) RemoveSection(i int) {
	a := f.draft.Alignment
	if a == nil || i < 0 || i >= len(a.Sections) {
		return
	}
	f.dropRaw(solver.IndexPath("alignment.sections", i))
	a.Sections = append(a.Sections[:i:i], a.Sections[i+1:]...)
	f.remap("alignment.sections", Removed(i))
	if len(a.Sections) == 0 {
		f.draft.Alignment = nil
		f.dropRaw("alignment")
	}
	f.check()
}

// SetSectionOption makes section i the option of that name ("" for the
// project as given).
func (f *Form) SetSectionOption(i int, name string) {
	a := f.draft.Alignment
	if a == nil || i < 0 || i >= len(a.Sections) {
		return
	}
	a.Sections[i].Option = name
	f.check()
}
