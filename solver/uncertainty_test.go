package solver

import (
	"errors"
	"testing"
)

// Every bad field of Uncertainty is refused at its own path with its
// reason, all at once; a good one passes.
func TestValidUncertainty(t *testing.T) {
	good := func() *Project {
		p := demoProject(t)
		p.Uncertainty = &Uncertainty{Runs: 100, Seed: 5, Date: 400, Layers: []LayerSpread{{K: 0.8, Mv: 0.3, KMv: 0.5}, {Ch: 0.4}}}
		return p
	}
	if err := Validate(good()); err != nil {
		t.Fatalf("a good spread is refused: %v", err)
	}
	for _, c := range []struct {
		name string
		edit func(u *Uncertainty)
		path string
		err  error
	}{
		{"one run", func(u *Uncertainty) { u.Runs = 1 }, "uncertainty.runs", ErrOutOfRange},
		{"too many runs", func(u *Uncertainty) { u.Runs = MaxRuns + 1 }, "uncertainty.runs", ErrOutOfRange},
		{"negative seed", func(u *Uncertainty) { u.Seed = -1 }, "uncertainty.seed", ErrOutOfRange},
		{"negative date", func(u *Uncertainty) { u.Date = -3 }, "uncertainty.date", ErrNegative},
		{"negative COV", func(u *Uncertainty) { u.Layers[1].Mv = -0.1 }, "uncertainty.layers[1].mv", ErrNegative},
		{"huge COV", func(u *Uncertainty) { u.Layers[0].K = 4 }, "uncertainty.layers[0].k", ErrOutOfRange},
		{"correlation", func(u *Uncertainty) { u.Layers[0].KMv = 1.5 }, "uncertainty.layers[0].kMv", ErrOutOfRange},
		{"too many layers", func(u *Uncertainty) { u.Layers = make([]LayerSpread, 9) }, "uncertainty.layers", ErrOutOfRange},
	} {
		t.Run(c.name, func(t *testing.T) {
			p := good()
			c.edit(p.Uncertainty)
			ps := AsProblems(Validate(p))
			if len(ps) != 1 || ps[0].Path != c.path || !errors.Is(ps[0].Err, c.err) {
				t.Errorf("problems %v, want one at %s: %v", ps, c.path, c.err)
			}
		})
	}
}
