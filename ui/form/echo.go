package form

import (
	"porelight/solver"
)

// Echoes. A value out of bounds can make other inputs wrong too: a layer
// thickness of −2 m puts a piezometer below the base of the column. The
// piezometer's problem is an echo of the thickness, the cause; it goes
// when the cause is fixed. The form still shows an echo beside its input
// (it is true of the draft), but Problems and Count list causes only, so
// that "2 inputs need attention" means two things to fix.
//
// A problem is an echo when it goes away once every input whose value is
// wrong and differs from the last valid draft takes that valid value back.

// findEchoes sets f.echo from f.probs, against f.good.
func (f *Form) findEchoes() {
	f.echo = nil
	if f.good == nil || len(f.probs) < 2 {
		return
	}
	trial := cloneProject(&f.draft)
	reverted := map[string]bool{}
	for path := range f.probs {
		now, ok1 := getNumber(&f.draft, path)
		was, ok2 := getNumber(f.good, path)
		if !ok1 || !ok2 || now == was {
			continue
		}
		if setNumber(trial, path, was) == nil {
			reverted[path] = true
		}
	}
	if len(reverted) == 0 {
		return
	}
	still := map[string]bool{}
	for _, pr := range solver.AsProblems(solver.Validate(trial)) {
		at, _ := inputFor(pr.Path)
		still[at] = true
	}
	for path := range f.probs {
		if !reverted[path] && !still[path] {
			if f.echo == nil {
				f.echo = map[string]bool{}
			}
			f.echo[path] = true
		}
	}
}
