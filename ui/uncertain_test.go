package ui

import (
	"context"
	"reflect"
	"strings"
	"sync/atomic"
	"testing"
	"time"

	"github.com/vugu/vugu/staticrender"

	"porelight/solver"
	"porelight/solver/uncertain"
)

// batchHost runs the page's batches as a worker would (uncertain.RunBatch
// on the JSON), counting them.
type batchHost struct {
	nopHost
	calls atomic.Int32
}

func (h *batchHost) Batch(ctx context.Context, batch []byte, progress func(float64)) ([]byte, error) {
	h.calls.Add(1)
	progress(0.5)
	out, err := uncertain.RunBatch(batch, nil)
	if err != nil {
		return []byte(`{"error":{"problems":[{"path":"","message":"` + err.Error() + `"}]}}`), nil
	}
	return out, nil
}

// The page's bands, gathered from batches answered in any order or run
// in-process, equal the bands of the realisations run directly with the
// package (the same seed, the same plan).
func TestRangeOnPage(t *testing.T) {
	const runs = 48
	for _, workers := range []bool{true, false} {
		root := &Root{Version: "test"}
		h := &batchHost{}
		if workers {
			root.Host, root.Env = h, staticrender.New(nil).EventEnv()
			root.Env.Lock()
		}
		root.Start(Sources{Demo: demoJSON(t)})
		root.form.SetUncertainty(true)
		root.form.Edit("uncertainty.runs", "48")
		root.form.Edit("uncertainty.seed", "9")
		root.edited()
		if workers {
			root.Env.UnlockOnly()
			settle(t, root)
			root.Env.Lock()
		}
		root.runRange()
		s := root.rangeState()
		if workers {
			root.Env.UnlockOnly()
			waitIdle(t, root, "the Monte Carlo", 30*time.Second, func() bool { return s.busy })
		}
		if s.err != "" || s.bands == nil || s.done != runs {
			t.Fatalf("workers %v: error %q, %d of %d runs", workers, s.err, s.done, runs)
		}
		model := root.form.Model()
		plan := s.plan
		want := uncertain.Combine(plan, uncertain.Range(model, plan, 0, runs, nil))
		if !reflect.DeepEqual(*s.bands, want) {
			t.Errorf("workers %v: the page's bands differ from the package's: P50 t90 %g against %g", workers, s.bands.T90.P50, want.T90.P50)
		}
		if workers {
			// The sensitivity and ceil(48/5) chunks of 5.
			if got, wantCalls := h.calls.Load(), int32(1+(runs+4)/5); got != wantCalls {
				t.Errorf("%d batches, want %d", got, wantCalls)
			}
		}
		if len(s.swings) == 0 || s.base == nil {
			t.Errorf("workers %v: no sensitivity", workers)
		}
		// The demo's P50 t90 lies between P10 and P90 and near the single
		// solve's t90 (the median of a monotone figure of one lognormal
		// input would equal it; several inputs move it a little): within
		// a factor of 1.5, a loose sanity bound.
		b := s.bands
		if !(b.T90.P10 <= b.T90.P50 && b.T90.P50 <= b.T90.P90) || s.result.Summary.T90 == nil ||
			b.T90.P50/(*s.result.Summary.T90) > 1.5 || b.T90.P50/(*s.result.Summary.T90) < 1/1.5 {
			t.Errorf("workers %v: t90 P10 %g, P50 %g, P90 %g; the single solve %v", workers, b.T90.P10, b.T90.P50, b.T90.P90, s.result.Summary.T90)
		}
	}
}

// Bad spread inputs are refused at their fields, with the reason, and the
// typed text stays.
func TestRangeInputs(t *testing.T) {
	root := &Root{Version: "test"}
	root.Start(Sources{Demo: demoJSON(t)})
	root.form.SetUncertainty(true)
	root.form.Edit("uncertainty.layers[1].k", "-5")
	root.form.Edit("uncertainty.runs", "1")
	root.edited()
	for path, want := range map[string]string{
		"uncertainty.layers[1].k": solver.ErrNegative.Error(),
		"uncertainty.runs":        solver.ErrOutOfRange.Error(),
	} {
		if got := root.form.Problem(path); got == "" || !strings.Contains(got, want) {
			t.Errorf("%s: problem %q, want %q", path, got, want)
		}
	}
	if root.form.Text("uncertainty.layers[1].k") != "-5" {
		t.Error("the typed COV was lost")
	}
	root.runRange()
	if s := root.rangeState(); s.err == "" || s.busy {
		t.Errorf("ran with bad inputs: %+v", s.err)
	}
}
