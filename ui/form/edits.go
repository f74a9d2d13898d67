package ui

import (
	"fmt"
	"slices"

	"porelight/solver"
)

// Structural edits of the draft: rows of the layer, load and pressure
// history tables. Each keeps the typed text with its row.

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
	f.remap("layers", func(old int) int {
		if old >= at {
			return old + 1
		}
		return old
	})
	f.check()
}

// RemoveLayer deletes row i; the last layer stays.
func (f *Form) RemoveLayer(i int) {
	if i < 0 || i >= len(f.draft.Layers) || len(f.draft.Layers) == 1 {
		return
	}
	f.draft.Layers = slices.Delete(f.draft.Layers, i, i+1)
	f.remap("layers", shiftOut(i))
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
	f.remap("layers", func(old int) int {
		switch old {
		case i:
			return j
		case j:
			return i
		}
		return old
	})
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
	f.remap("loads", shiftOut(i))
	f.check()
}

// AddExcess appends a point to the pressure history of a drained end.
func (f *Form) AddExcess(end string) {
	b := boundary(&f.draft, end)
	tv := solver.TimeValue{}
	if n := len(b.Excess); n > 0 {
		tv = solver.TimeValue{T: b.Excess[n-1].T + 30, Value: b.Excess[n-1].Value}
	}
	b.Excess = append(b.Excess, tv)
	f.check()
}

// RemoveExcess deletes point i of the pressure history of an end.
func (f *Form) RemoveExcess(end string, i int) {
	b := boundary(&f.draft, end)
	if i < 0 || i >= len(b.Excess) {
		return
	}
	b.Excess = slices.Delete(b.Excess, i, i+1)
	if len(b.Excess) == 0 {
		b.Excess = nil
	}
	f.remap(end+".excess", shiftOut(i))
	f.check()
}

// shiftOut renumbers the rows after removing row i.
func shiftOut(i int) func(int) int {
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
