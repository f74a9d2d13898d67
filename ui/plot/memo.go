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

// figMemo is a component's last figure and the props it was built for.
type figMemo struct {
	key figKey
	fig *Figure
}

// get returns the figure for k, built by build unless the last figure
// was built for the same props, or for a copy of the same project that
// differs only in text no figure shows.
func (m *figMemo) get(k figKey, build func() *Figure) *Figure {
	k.u = shown
	if m.fig != nil {
		same := m.key == k
		if !same && m.key.p != nil && k.p != nil {
			old := m.key
			old.p = k.p
			same = old == k && sameDrawn(m.key.p, k.p)
		}
		if same {
			m.key = k
			return m.fig
		}
	}
	m.key, m.fig = k, build()
	return m.fig
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
