package form

import (
	"fmt"
	"slices"
	"strings"

	"porelight/solver"
)

// Structural edits of the draft: rows of the layer, load and pressure
// history tables (the field records' are in records.go). Each keeps the
// typed text with its row: the text typed into layers[3].k follows the
// layer when a row above it is removed and becomes layers[2].k.

// AddLayer inserts a layer below row i (at the top when i < 0), a copy of
// row i so that the new row starts from plausible values.
func (f *Form) AddLayer(i int) {
	l := solver.Layer{Name: "", Thickness: 2, GammaSat: 18, K: 1e-9, Mv: 5e-4}
	if i >= 0 && i < len(f.draft.Layers) {
		l = f.draft.Layers[i]
		if l.ECurve != nil {
			c := *l.ECurve
			l.ECurve = &c
		}
	}
	l.Name = fmt.Sprintf("Layer %d", len(f.draft.Layers)+1)
	at := min(max(i+1, 0), len(f.draft.Layers))
	f.draft.Layers = slices.Insert(f.draft.Layers, at, l)
	inserted := func(old int) int {
		if old >= at {
			return old + 1
		}
		return old
	}
	f.remap("layers", inserted)
	f.renumberTip(inserted)
	f.renumberStrength(inserted)
	f.remapAsaokaLayers(inserted)
	f.remapUncertainty(inserted)
	f.remapVariantLayers(inserted)
	f.check()
}

// RemoveLayer deletes row i; the last layer stays.
func (f *Form) RemoveLayer(i int) {
	if i < 0 || i >= len(f.draft.Layers) || len(f.draft.Layers) == 1 {
		return
	}
	f.draft.Layers = slices.Delete(f.draft.Layers, i, i+1)
	f.remap("layers", Removed(i))
	f.renumberTip(Removed(i))
	f.renumberStrength(Removed(i))
	f.remapAsaokaLayers(Removed(i))
	f.remapUncertainty(Removed(i))
	f.remapVariantLayers(Removed(i))
	f.check()
}

// MoveLayer swaps row i with its neighbour above (d = -1) or below (d = 1).
func (f *Form) MoveLayer(i, d int) {
	j := i + d
	n := len(f.draft.Layers)
	if i < 0 || i >= n || j < 0 || j >= n {
		return
	}
	f.draft.Layers[i], f.draft.Layers[j] = f.draft.Layers[j], f.draft.Layers[i]
	swapped := func(old int) int {
		switch old {
		case i:
			return j
		case j:
			return i
		}
		return old
	}
	f.remap("layers", swapped)
	f.renumberTip(swapped)
	f.renumberStrength(swapped)
	f.remapAsaokaLayers(swapped)
	f.remapUncertainty(swapped)
	f.remapVariantLayers(swapped)
	f.check()
}

// AddLoad appends a stage that starts after the last one ends.
func (f *Form) AddLoad() {
	ld := solver.Load{Start: 0, Ramp: 10, Q: 10}
	if n := len(f.draft.Loads); n > 0 {
		last := f.draft.Loads[n-1]
		ld.Start = last.Start + last.Ramp + 30
	}
	f.draft.Loads = append(f.draft.Loads, ld)
	f.check()
}

// RemoveLoad deletes stage i.
func (f *Form) RemoveLoad(i int) {
	if i < 0 || i >= len(f.draft.Loads) {
		return
	}
	f.draft.Loads = slices.Delete(f.draft.Loads, i, i+1)
	f.remap("loads", Removed(i))
	f.renumberRemoval(Removed(i))
	f.remapVariantLoads(Removed(i))
	f.check()
}

// AddExcess appends a point to the pressure history of a drained end.
func (f *Form) AddExcess(end string) {
	b := Boundary(&f.draft, end)
	tv := solver.TimeValue{}
	if n := len(b.Excess); n > 0 {
		tv = solver.TimeValue{T: b.Excess[n-1].T + 30, Value: b.Excess[n-1].Value}
	}
	b.Excess = append(b.Excess, tv)
	f.check()
}

// RemoveExcess deletes point i of the pressure history of an end.
func (f *Form) RemoveExcess(end string, i int) {
	b := Boundary(&f.draft, end)
	if i < 0 || i >= len(b.Excess) {
		return
	}
	b.Excess = slices.Delete(b.Excess, i, i+1)
	if len(b.Excess) == 0 {
		b.Excess = nil
	}
	f.remap(solver.JoinPath(end, "excess"), Removed(i))
	f.check()
}

// AddSigmaPPoint appends a point to the σ′p table of layer i (giving the
// layer an empty e–log curve when it has none): 1 m below the last point
// with its σ′p, or at the middle of the layer with σ′p left at 0 for the
// user to type (Validate asks for it).
func (f *Form) AddSigmaPPoint(i int) {
	if i < 0 || i >= len(f.draft.Layers) {
		return
	}
	l := &f.draft.Layers[i]
	if l.ECurve == nil {
		l.ECurve = &solver.ECurve{}
	}
	pts := l.ECurve.SigmaPProfile
	top := solver.ColumnHeight(&solver.Project{Layers: f.draft.Layers[:i]})
	dv := solver.DepthValue{Z: top + l.Thickness/2}
	if n := len(pts); n > 0 {
		dv = solver.DepthValue{Z: pts[n-1].Z + 1, Value: pts[n-1].Value}
	}
	l.ECurve.SigmaPProfile = append(pts, dv)
	f.check()
}

// RemoveSigmaPPoint deletes point j of the σ′p table of layer i.
func (f *Form) RemoveSigmaPPoint(i, j int) {
	if i < 0 || i >= len(f.draft.Layers) || f.draft.Layers[i].ECurve == nil {
		return
	}
	c := f.draft.Layers[i].ECurve
	if j < 0 || j >= len(c.SigmaPProfile) {
		return
	}
	c.SigmaPProfile = slices.Delete(c.SigmaPProfile, j, j+1)
	if len(c.SigmaPProfile) == 0 {
		c.SigmaPProfile = nil
	}
	at := solver.JoinPath(solver.IndexPath("layers", i), "ecurve.sigmaPProfile")
	f.remap(at, Removed(j))
	tidyECurve(&f.draft, at)
	f.check()
}

// Removed is the renumbering of RemapKeys after row i of a list was
// removed: row i goes (−1), the rows after it move up by one.
func Removed(i int) func(old int) int {
	return func(old int) int {
		switch {
		case old == i:
			return -1
		case old > i:
			return old - 1
		}
		return old
	}
}

// dropRaw forgets typed text at path and below it.
func (f *Form) dropRaw(prefix string) {
	for _, m := range []map[string]string{f.raw, f.bad} {
		for k := range m {
			if Under(k, prefix) {
				delete(m, k)
			}
		}
	}
}

// Under reports whether path is prefix or a value inside it:
// Under("layers[2].k", "layers") and Under("fit.layers[0]", "fit") are true.
func Under(path, prefix string) bool {
	return path == prefix || strings.HasPrefix(path, prefix+".") || strings.HasPrefix(path, prefix+"[")
}

// remap renumbers the typed text of the items of list (e.g. "layers")
// after a structural edit.
func (f *Form) remap(list string, to func(old int) int) {
	RemapKeys(f.raw, list, to)
	RemapKeys(f.bad, list, to)
}

// RemapKeys renumbers the keys of m that are field paths into items of
// list after a structural edit of that list: the key of item old moves to
// item to(old), or is deleted when to(old) < 0. With list
// "monitoring.plates", the key "monitoring.plates[2].readings[0].t" moves
// to "monitoring.plates[1].readings[0].t" under Removed(0). Other keys stay.
// Components keep their own per-row state in such maps, keyed like the
// form's typed text.
func RemapKeys[V any](m map[string]V, list string, to func(old int) int) {
	moved := map[string]V{}
	for k, v := range m {
		old, rest, ok := itemOf(k, list)
		if !ok {
			continue
		}
		delete(m, k)
		if n := to(old); n >= 0 {
			moved[solver.IndexPath(list, n)+rest] = v
		}
	}
	for k, v := range moved {
		m[k] = v
	}
}

// itemOf splits a field path into the index of its item of list and the
// rest of the path after that item: itemOf("layers[2].ecurve.cc",
// "layers") is 2, ".ecurve.cc". ok is false when path is not inside an
// item of list.
func itemOf(path, list string) (i int, rest string, ok bool) {
	steps, err := solver.ParsePath(path)
	if err != nil {
		return 0, "", false
	}
	at := ""
	for _, st := range steps {
		at = solver.JoinPath(at, st.Name)
		if at == list {
			if st.Index < 0 {
				return 0, "", false
			}
			// ParsePath's paths rebuild exactly, so the item is a prefix.
			return st.Index, path[len(solver.IndexPath(at, st.Index)):], true
		}
		if st.Index >= 0 {
			at = solver.IndexPath(at, st.Index)
		}
		if len(at) >= len(list) {
			return 0, "", false
		}
	}
	return 0, "", false
}
