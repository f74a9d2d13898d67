package ui

import (
	"context"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/vugu/vugu/staticrender"

	"porelight/solver"
)

// workerHost is a Host with a Solver, standing in for the page's worker
// pool: it answers every solve with answer (nil: the result of solving
// in-process, in the binary form), or with err.
type workerHost struct {
	nopHost
	mu       sync.Mutex
	answer   []byte
	err      error
	projects [][]byte // what each Solve was given
	progress []float64
}

func (h *workerHost) Solve(ctx context.Context, project []byte, progress func(float64)) ([]byte, error) {
	h.mu.Lock()
	h.projects = append(h.projects, project)
	answer, err := h.answer, h.err
	h.mu.Unlock()
	if err != nil {
		return nil, err
	}
	progress(0.5)
	if answer != nil {
		return answer, nil
	}
	var p solver.Project // the page sends the binary form
	if derr := p.UnmarshalBinary(project); derr != nil {
		return nil, derr
	}
	res, serr := solver.Solve(&p, nil)
	if serr != nil {
		return nil, serr
	}
	return res.MarshalBinary() // as the page's worker answers
}

func (h *workerHost) calls() int {
	h.mu.Lock()
	defer h.mu.Unlock()
	return len(h.projects)
}

// settle waits until the root has no solve under way.
func settle(t *testing.T, root *Root) {
	t.Helper()
	waitIdle(t, root, "the solve", 20*time.Second, func() bool { return root.busy })
}

// waitIdle waits, with the render lock released, until busy (read under
// the lock) is false, and fails t when what has not finished within d.
func waitIdle(t *testing.T, root *Root, what string, d time.Duration, busy func() bool) {
	t.Helper()
	for deadline := time.Now().Add(d); ; time.Sleep(5 * time.Millisecond) {
		root.Env.Lock()
		b := busy()
		root.Env.UnlockOnly()
		if !b {
			return
		}
		if time.Now().After(deadline) {
			t.Fatal(what + " did not finish")
		}
	}
}

// The page's solves go through a Solver host; its answers, a result or
// the problems of a crashed worker, reach the status, and ErrNoWorker
// makes the page solve in-process.
func TestSolveThroughHost(t *testing.T) {
	demo := demoJSON(t)
	oom := []byte(`{"error":{"problems":[{"path":"","message":"this solve ran out of memory — reduce the number of elements (mesh.maxSize) or of output times"}]}}`)
	cases := []struct {
		name      string
		answer    []byte
		err       error
		wantKind  string
		wantText  string
		wantCalls int
	}{
		{"result", nil, nil, "ok", "up to date", 1},
		{"worker out of memory", oom, nil, "error", "The solve failed: this solve ran out of memory — reduce", 1},
		{"unreadable answer", []byte(`{"steady": [`), nil, "error", "could not be read", 1},
		{"no worker: in-process", nil, ErrNoWorker, "ok", "up to date", 1},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			h := &workerHost{answer: tc.answer, err: tc.err}
			root := &Root{Host: h, Env: staticrender.New(nil).EventEnv(), Version: "test"}
			root.Env.Lock()
			root.Start(Sources{Demo: demo})
			root.Env.UnlockOnly()
			settle(t, root)
			root.Env.Lock()
			st, res := root.status(), root.result
			root.Env.UnlockOnly()
			if st.Kind != tc.wantKind || !strings.Contains(st.Text, tc.wantText) {
				t.Errorf("status %+v, want %s saying %q", st, tc.wantKind, tc.wantText)
			}
			if got := h.calls(); got != tc.wantCalls {
				t.Errorf("%d calls of Solve, want %d", got, tc.wantCalls)
			}
			if tc.wantKind == "ok" {
				want, err := solver.Solve(solveInput(mustReadProject(t, demo)), nil)
				if err != nil {
					t.Fatal(err)
				}
				// JSON holds every float64 exactly (shortest round trip),
				// so the worker's result equals the in-process one.
				if res == nil || res.Summary.Flux != want.Summary.Flux {
					t.Errorf("result %v, want flux %g exactly", res, want.Summary.Flux)
				}
			}
		})
	}
}

func mustReadProject(t *testing.T, data []byte) *solver.Project {
	t.Helper()
	p, ps := ReadProject(data)
	if ps != nil {
		t.Fatal(ps)
	}
	return p
}

// blockingHost's Solve never answers; it returns when its context is
// cancelled, as the page's pool stops the worker.
type blockingHost struct {
	nopHost
	started, stopped chan struct{}
}

func (h *blockingHost) Solve(ctx context.Context, _ []byte, progress func(float64)) ([]byte, error) {
	progress(0.25)
	close(h.started)
	<-ctx.Done()
	close(h.stopped)
	return nil, ctx.Err()
}

// Cancel stops the solve in the host: its context is cancelled, and the
// page says the solve was cancelled.
func TestCancelStopsHostSolve(t *testing.T) {
	h := &blockingHost{started: make(chan struct{}), stopped: make(chan struct{})}
	root := &Root{Host: h, Env: staticrender.New(nil).EventEnv(), Version: "test"}
	root.Env.Lock()
	root.Start(Sources{Demo: demoJSON(t)})
	root.Env.UnlockOnly()
	<-h.started
	for deadline := time.Now().Add(5 * time.Second); ; time.Sleep(5 * time.Millisecond) {
		root.Env.Lock()
		ready := root.cancelable() != nil // shown once progress is reported
		if ready {
			root.cancelable()()
		}
		root.Env.UnlockOnly()
		if ready {
			break
		}
		if time.Now().After(deadline) {
			t.Fatal("no Cancel offered while the host solves")
		}
	}
	select {
	case <-h.stopped:
	case <-time.After(5 * time.Second):
		t.Fatal("cancelling did not stop the host's solve")
	}
	root.Env.Lock()
	st := root.status()
	root.Env.UnlockOnly()
	if !strings.Contains(st.Text, "cancelled") {
		t.Errorf("status %+v", st)
	}
}
