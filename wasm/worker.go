//go:build js && wasm

package main

// Worker mode. The page runs solves in Web Workers that run this same
// program (static/shell/worker.js is the worker's script; boot.js keeps
// the pool). Where there is no document, main registers goCall and tells
// the worker script it is ready; every call runs to completion inside
// goCall, which holds up only its own worker.

import (
	"fmt"
	"syscall/js"
	"time"

	"porelight/solver"
	"porelight/solver/uncertain"
)

// progressEvery is the least time between two progress messages (a
// variable for the tests).
var progressEvery = 50 * time.Millisecond

// serveWorker registers globalThis.goCall(op, project, progress):
//
//	op "solve"     → the result JSON, as porelight.solve returns it
//	op "solve-binary" → the same with the result in the binary form
//	               (solver.Result.MarshalBinary), for a project given as
//	               JSON or, as the page sends it, in the binary form
//	               (a Uint8Array of solver.Project.MarshalBinary): both
//	               ends skip JSON, which costs about as much as a small
//	               solve in wasm
//	op "vary-solve" → "solve-binary" for the page's comparison of
//	               options: the pool lets these use one worker per core
//	op "validate"  → the problems JSON, as porelight.validate returns it
//	op "vary-batch" → the JSON of an uncertain.Answer for the JSON of an
//	               uncertain.Batch (realisations of a Monte Carlo, or
//	               its sensitivity), or the problems JSON
//	op "fault-oom", "fault-hang", "fault-panic" → run out of memory,
//	               loop for ever, panic outside any recover: the browser
//	               tests' way to check that the page survives its workers
//
// The answer is a Uint8Array of UTF-8 JSON (the worker script transfers
// its buffer to the page). progress, a function or undefined, receives
// fractions of the solve at most every progressEvery. Then it calls
// globalThis.goReady, if defined.
func serveWorker(a *api) {
	js.Global().Set("goCall", js.FuncOf(func(_ js.Value, args []js.Value) any {
		op, progress := "", js.Undefined()
		if len(args) > 0 && args[0].Type() == js.TypeString {
			op = args[0].String()
		}
		var project []byte
		switch {
		case len(args) < 2:
		case args[1].Type() == js.TypeString:
			project = []byte(args[1].String())
		case args[1].InstanceOf(js.Global().Get("Uint8Array")):
			project = make([]byte, args[1].Get("length").Int())
			js.CopyBytesToGo(project, args[1])
		}
		if len(args) > 2 {
			progress = args[2]
		}
		return toJS(a.call(op, project, progress))
	}))
	if ready := js.Global().Get("goReady"); ready.Type() == js.TypeFunction {
		ready.Invoke()
	}
}

// call answers one goCall.
func (a *api) call(op string, project []byte, progress js.Value) []byte {
	switch op {
	case "solve", "solve-binary", "vary-solve":
		var report func(float64)
		if progress.Type() == js.TypeFunction {
			last := time.Now()
			report = func(f float64) {
				if now := time.Now(); now.Sub(last) >= progressEvery {
					last = now
					_ = catch(func() { progress.Invoke(f) })
				}
			}
		}
		if op != "solve" {
			return a.solveTo(project, report, marshalBinary)
		}
		return a.solveJSON(project, report)
	case "validate":
		return []byte(a.Validate(string(project)))
	case "vary-batch":
		return varyBatch(project, throttle(progress))
	case "fault-oom":
		exhaustMemory()
	case "fault-hang":
		for {
			spins++
		}
	case "fault-panic":
		// A panic escaping goCall ends the program, as a bug would.
		panic("porelight: the fault-panic test hook")
	}
	return []byte(problemsJSON(solver.Problems{{Path: "", Message: fmt.Sprintf("unknown worker call %q", op)}}))
}

// throttle turns a JavaScript progress callback (or undefined) into a
// Go one that calls it at most every progressEvery.
func throttle(progress js.Value) func(float64) {
	if progress.Type() != js.TypeFunction {
		return nil
	}
	last := time.Now()
	return func(f float64) {
		if now := time.Now(); now.Sub(last) >= progressEvery {
			last = now
			_ = catch(func() { progress.Invoke(f) })
		}
	}
}

// varyBatch runs an uncertain.Batch; a panic in it comes back as a
// problem, as a solve's does.
func varyBatch(data []byte, progress func(float64)) (out []byte) {
	defer func() {
		if r := recover(); r != nil {
			out = []byte(problemsJSON(solver.Problems{{Path: "", Message: fmt.Sprintf("internal error: %v", r)}}))
		}
	}()
	out, err := uncertain.RunBatch(data, func(f float64) bool {
		if progress != nil {
			progress(f)
		}
		return true
	})
	if err != nil {
		return []byte(problemsJSON(solver.AsProblems(err)))
	}
	return out
}

// marshalBinary encodes a *solver.Result in the binary form.
func marshalBinary(v any) ([]byte, error) {
	r, ok := v.(*solver.Result)
	if !ok {
		return nil, fmt.Errorf("not a result: %T", v)
	}
	return r.MarshalBinary()
}

var (
	hoard [][]byte // what exhaustMemory holds on to
	spins int
)

// exhaustMemory allocates 32 MiB blocks, writing to each, until the Go
// runtime runs out of memory and ends the program.
func exhaustMemory() {
	for {
		b := make([]byte, 32<<20)
		for i := 0; i < len(b); i += 4096 {
			b[i] = 1
		}
		hoard = append(hoard, b)
	}
}

// toJS copies b into a new Uint8Array.
func toJS(b []byte) js.Value {
	arr := js.Global().Get("Uint8Array").New(len(b))
	js.CopyBytesToJS(arr, b)
	return arr
}
