package plot

import (
	"reflect"

	"porelight/solver"
	"porelight/ui/units"
)

// Figures are built once per change of what they show. vugu builds every
// component on every render (each keystroke), and a figure of the demo
// costs milliseconds to build and far more to send to the page; a plot
// component keeps its last figure with the props it was built for, and
// Chart keeps the markup of that figure (chart.go).

// figKey is what a plot component's figure depends on. The plot
// components hold the project and results of the last solve, which
// change only when a solve ends, or when an edit that needs no solve
// (the title, the notes) makes a new copy of the same project.
type figKey struct {
	p      *solver.Project
	r, fit *solver.Result
	a, b   bool
	w, h   int
	u      units.System // the units shown (get sets it)
}

// Out of view. After a solve the page draws the figures in view at once
// and the others in a render of their own after that has been painted
// (ui.Root.Compute): while outside is set, a figure whose props changed
// keeps its last build when outside(its id) reports it out of view.
var outside func(id string) bool

// KeepOutside makes the figures built from now on that are out of view,
// as out reports by their id, keep their last figure when their props
// changed; the caller builds them again soon. nil builds every figure
// from its props, as always.
func KeepOutside(out func(id string) bool) { outside = out }

// figMemo is a component's last figure and the props it was built for.
type figMemo = Memo[*Figure]

// Memo is a value worked out from the props of a component (a figure,
// the piezometers' ratios of a solve) kept with the props it was made
// for.
type Memo[T any] struct {
	key   figKey
	v     T
	set   bool
	stale bool // made for inputs outside the key that have changed since (outdate)
}

// outdate says that the value is not that of the props any more, for an
// input the key does not hold: the next get makes it anew, or, for a
// figure out of view, keeps it until the build after.
func (m *Memo[T]) outdate() { m.stale = true }

// Get returns the value for the project and result of a solve, made by
// make unless the last one was made for the same, as get.
func (m *Memo[T]) Get(p *solver.Project, r *solver.Result, make func() T) T {
	return m.get(figKey{p: p, r: r}, make)
}

// get returns the value for k, made by build unless the last value was
// made for the same props, or for a copy of the same project that
// differs only in text no figure shows, and not outdated since.
func (m *Memo[T]) get(k figKey, build func() T) T {
	k.u = shown
	if m.set {
		same := m.key == k
		if !same && m.key.p != nil && k.p != nil {
			old := m.key
			old.p = k.p
			same = old == k && sameDrawn(m.key.p, k.p)
		}
		if same && !m.stale {
			m.key = k
			return m.v
		}
		// Out of view: keep the last figure, and the props it was built
		// for, so that the next build makes the new one.
		if f, ok := any(m.v).(*Figure); ok && f != nil && outside != nil && outside(f.ID) {
			return m.v
		}
	}
	m.key, m.v, m.set, m.stale = k, build(), true, false
	return m.v
}

// sameDrawn reports whether two projects are equal but for their title
// and notes, which no figure draws.
func sameDrawn(a, b *solver.Project) bool {
	if a == b {
		return true
	}
	x, y := *a, *b
	x.Title, x.Notes, y.Title, y.Notes = "", "", "", ""
	return reflect.DeepEqual(&x, &y)
}
