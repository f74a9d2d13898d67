package ui

import (
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"reflect"
	"runtime/debug"
	"sync"
	"sync/atomic"
	"time"

	"porelight/solver"
	"porelight/solver/uncertain"
)

// Batcher is a Host that runs Monte Carlo batches away from the page's
// own thread; wasm/ spreads them over one Web Worker per core. Batch
// takes the JSON of an uncertain.Batch and returns the JSON of an
// uncertain.Answer, or {"error": {"problems": [...]}}; it blocks until
// then (call it from a goroutine), sends fractions of the batch to
// progress, and returns ctx's error when ctx is cancelled (the worker is
// stopped). ErrNoWorker means nothing ran: run in-process instead.
type Batcher interface {
	Batch(ctx context.Context, batch []byte, progress func(float64)) ([]byte, error)
}

// rangeState is one Monte Carlo run of the page and its results.
type rangeState struct {
	busy     bool
	err      string
	note     string // how it ended: "", "stopped", the elapsed time
	done     int    // realisations answered
	partial  []float64
	total    int
	plan     uncertain.Plan
	samples  []uncertain.Sample
	bands    *uncertain.Bands
	base     *uncertain.Sample
	swings   []uncertain.Swing
	result   *solver.Result  // the solve with the inputs as given
	model    *solver.Project // the project the run belongs to
	workers  bool            // ran in workers
	started  time.Time
	elapsed  time.Duration
	gen      atomic.Int64
	stop     context.CancelFunc
	lastDraw time.Time
}

func (c *Root) rangeState() *rangeState {
	if c.rng == nil {
		c.rng = &rangeState{}
	}
	return c.rng
}

// rangeChunk is the number of realisations in one batch: small enough
// that the bands grow visibly and the workers share the work evenly, large
// enough that a message's overhead stays small against its solves.
func rangeChunk(runs int) int { return min(max(runs/24, 5), 40) }

// runRange starts the Monte Carlo of the current inputs.
func (c *Root) runRange() {
	s := c.rangeState()
	if s.busy {
		return
	}
	if !c.form.Valid() {
		s.err = fixInputsFirst
		return
	}
	model := c.form.Model()
	if !uncertain.HasSpread(model) {
		s.err = "Give at least one layer a coefficient of variation."
		return
	}
	base := c.result
	if c.resultFor == nil || !reflect.DeepEqual(c.resultFor, model) {
		var err error
		if base, err = c.solveFn()(model, nil); err != nil {
			s.err = describeProblems(solver.AsProblems(err), 3)
			return
		}
	}
	plan, err := uncertain.NewPlan(model, base)
	if err != nil {
		s.err = "Nothing to vary: the project has no consolidation."
		return
	}
	g := s.gen.Add(1)
	ctx, stop := context.WithCancel(context.Background())
	*s = rangeState{busy: true, total: plan.Runs, plan: plan, result: base, model: model, started: time.Now(), stop: stop}
	s.gen.Store(g)
	chunks := splitRuns(plan.Runs, rangeChunk(plan.Runs))
	s.partial = make([]float64, len(chunks))
	b, ok := c.host().(Batcher)
	if ok && c.Env != nil {
		s.workers = true
		go c.rangeInWorkers(ctx, g, b, model, plan, chunks)
		return
	}
	c.rangeHere(ctx, g, model, plan)
}

// solveFn is the solve the page uses in-process.
func (c *Root) solveFn() func(*solver.Project, *solver.Options) (*solver.Result, error) {
	if c.Solve != nil {
		return c.Solve
	}
	return solver.Solve
}

// splitRuns cuts 0..n into pieces of at most size.
func splitRuns(n, size int) [][2]int {
	var out [][2]int
	for a := 0; a < n; a += size {
		out = append(out, [2]int{a, min(a+size, n)})
	}
	return out
}

// stopRange cancels the run; what has come in stays.
func (c *Root) stopRange() {
	s := c.rangeState()
	if !s.busy {
		return
	}
	s.gen.Add(1)
	if s.stop != nil {
		s.stop()
	}
	s.busy = false
	s.elapsed = time.Since(s.started)
	s.combine()
	s.note = fmt.Sprintf("Stopped after %d of %d runs.", s.done, s.total)
}

// rangeInWorkers sends the sensitivity and every chunk to the workers at
// once (the pool queues them) and gathers the answers as they come.
func (c *Root) rangeInWorkers(ctx context.Context, g int64, b Batcher, model *solver.Project, plan uncertain.Plan, chunks [][2]int) {
	s := c.rng
	var wg sync.WaitGroup
	var noWorker atomic.Bool
	send := func(k int, batch uncertain.Batch) {
		defer wg.Done()
		defer func() {
			if r := recover(); r != nil {
				c.Env.Lock()
				if s.gen.Load() == g {
					s.err = fmt.Sprintf("internal error in the Monte Carlo: %v\n%s", r, debug.Stack())
				}
				c.Env.UnlockRender()
			}
		}()
		data, err := json.Marshal(batch)
		if err != nil {
			return
		}
		out, err := b.Batch(ctx, data, func(f float64) {
			if k < 0 {
				return
			}
			c.Env.Lock()
			if s.gen.Load() == g {
				s.partial[k] = f * float64(chunks[k][1]-chunks[k][0])
			}
			if time.Since(s.lastDraw) > redrawEvery {
				s.lastDraw = time.Now()
				c.Env.UnlockRender()
			} else {
				c.Env.UnlockOnly()
			}
		})
		if errors.Is(err, ErrNoWorker) {
			noWorker.Store(true)
			return
		}
		c.Env.Lock()
		if s.gen.Load() != g || errors.Is(err, context.Canceled) {
			c.Env.UnlockOnly()
			return
		}
		if err == nil {
			err = c.takeAnswer(s, k, out)
		}
		if err != nil && s.err == "" {
			s.err = err.Error()
		}
		// Every render rebuilds the whole page on the page's own thread,
		// which shares the cores with the workers: draw the growing
		// bands at most every redrawEvery (finishRange draws the last).
		if err != nil || k < 0 || time.Since(s.lastDraw) > redrawEvery {
			s.lastDraw = time.Now()
			s.combine()
			c.Env.UnlockRender()
			return
		}
		c.Env.UnlockOnly()
	}
	wg.Add(1)
	go send(-1, uncertain.Batch{Project: model, Plan: plan, Sensitivity: true})
	for k, ch := range chunks {
		wg.Add(1)
		go send(k, uncertain.Batch{Project: model, Plan: plan, From: ch[0], To: ch[1], Binary: true})
	}
	wg.Wait()
	if noWorker.Load() {
		c.Env.Lock()
		alive := s.gen.Load() == g
		if alive {
			s.workers = false
			s.samples, s.done, s.bands = nil, 0, nil
		}
		c.Env.UnlockRender()
		if alive {
			c.rangeHere(ctx, g, model, plan)
		}
		return
	}
	c.Env.Lock()
	if s.gen.Load() == g {
		c.finishRange(s)
	}
	c.Env.UnlockRender()
}

// takeAnswer adds one batch's answer to s (under the render lock).
func (c *Root) takeAnswer(s *rangeState, k int, out []byte) error {
	if uncertain.IsBinarySamples(out) {
		got, err := uncertain.DecodeSamples(out)
		if err != nil {
			return errors.New("a worker's answer could not be read: " + err.Error())
		}
		s.partial[k] = 0
		s.samples = append(s.samples, got...)
		s.done = len(s.samples)
		return nil
	}
	var a struct {
		uncertain.Answer
		Error *struct {
			Problems solver.Problems `json:"problems"`
		} `json:"error"`
	}
	if err := json.Unmarshal(out, &a); err != nil {
		return errors.New("a worker's answer could not be read: " + err.Error())
	}
	if a.Error != nil {
		return errors.New(describeProblems(a.Error.Problems, 3))
	}
	if k < 0 {
		s.base, s.swings = a.Base, a.Swings
		return nil
	}
	s.partial[k] = 0
	s.samples = append(s.samples, a.Samples...)
	s.done = len(s.samples)
	return nil
}

// combine makes the bands of the samples so far.
func (s *rangeState) combine() {
	if len(s.samples) == 0 {
		return
	}
	bands := uncertain.Combine(s.plan, s.samples)
	s.bands = &bands
}

// redrawEvery is the least time between two redraws of a running Monte
// Carlo.
const redrawEvery = time.Second

func (c *Root) finishRange(s *rangeState) {
	s.combine()
	s.busy = false
	s.elapsed = time.Since(s.started)
	if s.stop != nil {
		s.stop()
	}
}

// rangeHere runs the Monte Carlo in the page's own program (no workers,
// or native tests), yielding to the browser after every realisation.
func (c *Root) rangeHere(ctx context.Context, g int64, model *solver.Project, plan uncertain.Plan) {
	s := c.rng
	work := func() {
		base, swings := uncertain.Sensitivity(model, plan, func(int, int) bool { c.host().Yield(); return ctx.Err() == nil })
		lock := func() bool {
			if c.Env != nil {
				c.Env.Lock()
			}
			return s.gen.Load() == g
		}
		unlock := func() {
			if c.Env != nil {
				c.Env.UnlockRender()
			}
		}
		if lock() {
			s.base, s.swings = &base, swings
		}
		unlock()
		for _, ch := range splitRuns(plan.Runs, rangeChunk(plan.Runs)) {
			if ctx.Err() != nil {
				return
			}
			got := uncertain.Range(model, plan, ch[0], ch[1], func(int) bool { c.host().Yield(); return ctx.Err() == nil })
			if lock() {
				s.samples = append(s.samples, got...)
				s.done = len(s.samples)
				s.combine()
			}
			unlock()
		}
		if lock() {
			c.finishRange(s)
		}
		unlock()
	}
	if c.Env == nil {
		work()
		return
	}
	go work()
}
