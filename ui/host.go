package ui

import (
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"time"

	"porelight/solver"
)

// Host is what the page around the components provides: the browser's
// storage, downloads, files and the time slices of a long solve. wasm/
// implements it with syscall/js; tests pass a fake. The UI never calls a
// Host method while holding up the browser for a reply: methods return
// at once, and ReadFile answers later through its callback.
type Host interface {
	// Yield lets the browser paint and handle input for a moment. It is
	// called from the solve goroutine, never from an event handler.
	Yield()
	// Download offers data to the user as a file.
	Download(name, mime string, data []byte) error
	// Store keeps text under key in the browser's storage; Recall reads
	// it back (ok false when there is none). Both fail where storage is
	// not allowed, e.g. in a sandboxed frame.
	Store(key, value string) error
	Recall(key string) (value string, ok bool, err error)
	// PageURL is the address of the page without its fragment.
	PageURL() string
	// SetFragment replaces the URL fragment without reloading ("" clears it).
	SetFragment(frag string)
	// ReadFile reads the file chosen in the file input with this id and
	// then calls done, from a browser callback: done must not block.
	ReadFile(inputID string, done func(name string, data []byte, err error))
	// CopyText selects the text of the input with this id and copies it
	// to the clipboard where the browser allows.
	CopyText(inputID string) error
	// Print opens the browser's print dialogue.
	Print()
}

// nopHost stands in when no Host is set (native tests, static renders).
type nopHost struct{}

func (nopHost) Yield()                                {}
func (nopHost) Download(string, string, []byte) error { return errNoHost }
func (nopHost) Store(string, string) error            { return errNoHost }
func (nopHost) Recall(string) (string, bool, error)   { return "", false, nil }
func (nopHost) PageURL() string                       { return "porelight.html" }
func (nopHost) SetFragment(string)                    {}
func (nopHost) CopyText(string) error                 { return errNoHost }
func (nopHost) Print()                                {}
func (nopHost) ReadFile(_ string, done func(string, []byte, error)) {
	done("", nil, errNoHost)
}

var errNoHost = errors.New("not available outside the browser")

// Solver is a Host that can solve away from the page's own thread; wasm/
// runs each solve in a Web Worker running the same program, so that a
// solve that runs out of memory or never ends takes only its worker with
// it. Root uses it when its Host has it and Root.Solve is nil, and solves
// in-process otherwise (native tests, or where the browser gives no
// worker).
type Solver interface {
	// Solve solves the project (in the binary form,
	// solver.Project.MarshalBinary) and returns the result in the binary
	// form (solver.Result.MarshalBinary) or as JSON, or {"error":
	// {"problems": [...]}} (as the JavaScript API's solve answers) for a
	// project that cannot be solved, a crashed worker or a
	// solve that ran too long. It blocks until then, so it is called from
	// the solve goroutine only; progress receives fractions of the solve
	// on that goroutine. Cancelling ctx abandons the solve (the worker is
	// stopped) and returns ctx's error. ErrNoWorker means nothing was
	// solved: solve in-process instead.
	Solve(ctx context.Context, project []byte, progress func(float64)) (result []byte, err error)
}

// Screen is a Host that knows what the window shows. After a solve,
// Root draws the figures in view first and the others in a render of
// their own once the browser has painted (inview.go).
type Screen interface {
	// InView reports whether the element with this id is at least partly
	// in view: in the window and not scrolled out of a box that clips it.
	InView(id string) bool
	// AfterPaint calls f, from a browser callback, once the browser has
	// painted the next frame: f must not block.
	AfterPaint(f func())
}

// ErrNoWorker is the error of Solver.Solve when the browser cannot run
// workers here.
var ErrNoWorker = errors.New("no solve worker")

// solveElsewhere solves model through s. A newer edit or Cancel (a new
// generation) stops it. The error is ErrNoWorker, solver.ErrCanceled or
// the problems of the answer.
func (c *Root) solveElsewhere(g int64, s Solver, model *solver.Project) (*solver.Result, error) {
	// The binary form, not JSON: the worker would spend about as long
	// decoding JSON as solving a small project.
	data, err := solveInput(model).MarshalBinary()
	if err != nil {
		return nil, err
	}
	ctx, stop := context.WithCancel(context.Background())
	defer stop()
	go func() {
		tick := time.NewTicker(50 * time.Millisecond)
		defer tick.Stop()
		for {
			select {
			case <-ctx.Done():
				return
			case <-tick.C:
				if c.gen.Load() != g {
					stop()
					return
				}
			}
		}
	}()
	// Re-render for progress only when the shown percentage changes, and
	// at most every 150 ms: each render rebuilds the whole page, and on a
	// slow machine back-to-back renders would starve the page's frames.
	var last time.Time
	shown := -1
	out, err := s.Solve(ctx, data, func(f float64) {
		if pc := int(100*f + 0.5); pc != shown && time.Since(last) >= 150*time.Millisecond {
			shown, last = pc, time.Now()
			c.Env.Lock()
			c.progress = f
			c.Env.UnlockRender()
		}
	})
	switch {
	case ctx.Err() != nil:
		return nil, solver.ErrCanceled
	case err != nil:
		return nil, err
	}
	return decodeAnswer(out)
}

// decodeAnswer reads a solve answer: a result, or the problems of
// {"error": {"problems": [...]}}.
func decodeAnswer(out []byte) (*solver.Result, error) {
	if bytes.HasPrefix(bytes.TrimSpace(out), []byte(`{"error"`)) {
		var e struct {
			Error struct {
				Problems solver.Problems `json:"problems"`
			} `json:"error"`
		}
		if err := json.Unmarshal(out, &e); err != nil {
			return nil, errors.New("the solver's answer could not be read: " + err.Error())
		}
		if len(e.Error.Problems) == 0 {
			return nil, errors.New("the solver failed without saying why")
		}
		return nil, e.Error.Problems
	}
	var r solver.Result
	if solver.IsBinaryResult(out) {
		if err := r.UnmarshalBinary(out); err != nil {
			return nil, errors.New("the solver's answer could not be read: " + err.Error())
		}
		return &r, nil
	}
	if err := json.Unmarshal(out, &r); err != nil {
		return nil, errors.New("the solver's answer could not be read: " + err.Error())
	}
	return &r, nil
}
