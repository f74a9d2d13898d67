package ui

import (
	"reflect"
	"testing"
	"time"

	"github.com/vugu/vugu/staticrender"

	optcmp "porelight/solver/compare"
)

// The page's comparison, through the solve workers or in-process, gives
// each option the result of package compare's own solve of it.
func TestCompareOnPage(t *testing.T) {
	for _, workers := range []bool{true, false} {
		root := &Root{Version: "test"}
		if workers {
			root.Host, root.Env = &workerHost{}, staticrender.New(nil).EventEnv()
			root.Env.Lock()
		}
		root.Start(Sources{Demo: demoJSON(t)})
		root.form.AddVariant()
		root.form.Edit("variants[0].loads[1].q", "45")
		root.form.AddVariant()
		root.form.Edit("variants[1].name", "softer lower clay")
		root.form.Edit("variants[1].layers[3].mv", "0.0015")
		root.edited()
		root.runCompare()
		s := root.compareState()
		if workers {
			root.Env.UnlockOnly()
			for deadline := time.Now().Add(30 * time.Second); ; time.Sleep(5 * time.Millisecond) {
				root.Env.Lock()
				busy := s.busy
				root.Env.UnlockOnly()
				if !busy {
					break
				}
				if time.Now().After(deadline) {
					t.Fatal("the comparison did not finish")
				}
			}
		}
		want := optcmp.Solve(root.form.Model(), nil)
		if len(s.outcomes) != 3 || s.err != "" {
			t.Fatalf("workers %v: %d outcomes, error %q", workers, len(s.outcomes), s.err)
		}
		for i, o := range s.outcomes {
			if o.Name != want[i].Name || o.Problem != "" || !reflect.DeepEqual(o.Figures, want[i].Figures) {
				t.Errorf("workers %v, %s: %+v, want %+v (%s)", workers, o.Name, o.Figures, want[i].Figures, o.Problem)
			}
		}
		if !(s.outcomes[1].Figures.Final > s.outcomes[0].Figures.Final && s.outcomes[2].Figures.Final > s.outcomes[0].Figures.Final) {
			t.Errorf("workers %v: a higher load and a softer clay should settle more: %g, %g against %g", workers,
				s.outcomes[1].Figures.Final, s.outcomes[2].Figures.Final, s.outcomes[0].Figures.Final)
		}
	}
}
