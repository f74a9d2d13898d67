//go:build js && wasm

package main

import (
	"encoding/json"
	"fmt"
	"runtime/debug"
	"syscall/js"

	"porelight/solver"
)

// api is the JavaScript API, globalThis.porelight:
//
//	porelight.version               // e.g. "0.1.0"
//	porelight.solve(projectJSON)    // → result JSON, or {"error": {"problems": [{"path", "message"}…]}}
//	porelight.validate(projectJSON) // → JSON list of problems, [] when the project is valid
//	porelight.demo()                // → the demo project JSON
//	porelight.asaoka(project, opts) // → Asaoka's method per plate (monitor_api.go)
//	porelight.backfit(project, spec)// → the back-fit result (monitor_api.go)
//
// A project may also be passed as an object; it is stringified first. No
// call throws: every failure, a panic included, comes back as problems.
// Calls run to completion before returning, so a long solve holds up the
// page. The page's boot script adds porelight.solveAsync(project), a
// Promise of the same answer computed in a Web Worker (worker.go); the
// page itself solves there too.
type api struct {
	demo  []byte
	solve func(*solver.Project, *solver.Options) (*solver.Result, error)
}

// errorJSON is the answer of solve to a project it cannot solve.
type errorJSON struct {
	Error struct {
		Problems solver.Problems `json:"problems"`
	} `json:"error"`
}

func problemsJSON(ps solver.Problems) string {
	var e errorJSON
	e.Error.Problems = ps
	if e.Error.Problems == nil {
		e.Error.Problems = solver.Problems{}
	}
	data, err := json.Marshal(e)
	if err != nil { // a Problem is two strings; this cannot happen
		return `{"error":{"problems":[{"path":"","message":"the problems could not be encoded"}]}}`
	}
	return string(data)
}

// Solve decodes, validates and solves one project.
func (a *api) Solve(project string) string {
	return string(a.solveJSON([]byte(project), nil))
}

// solveJSON is Solve on bytes; progress, when not nil, receives the
// solver's progress (fractions of the simulated time).
func (a *api) solveJSON(project []byte, progress func(float64)) []byte {
	return a.solveTo(project, progress, json.Marshal)
}

// solveTo is solveJSON with the result encoded by encode (problems are
// always JSON): json.Marshal for the API, or the binary form
// (solver.Result.MarshalBinary) for the page's own worker calls.
func (a *api) solveTo(project []byte, progress func(float64), encode func(any) ([]byte, error)) (out []byte) {
	defer func() {
		if r := recover(); r != nil {
			out = []byte(problemsJSON(solver.Problems{{Path: "", Message: fmt.Sprintf("internal error: %v", r)}}))
			println("porelight: solve failed:", fmt.Sprint(r), string(debug.Stack()))
		}
	}()
	p, err := decodeProject(project)
	if err != nil {
		return []byte(problemsJSON(solver.AsProblems(err)))
	}
	solve := a.solve
	if solve == nil {
		solve = solver.Solve
	}
	var opt *solver.Options
	if progress != nil {
		opt = &solver.Options{Progress: func(f float64) bool { progress(f); return true }}
	}
	res, err := solve(p, opt)
	if err != nil {
		return []byte(problemsJSON(solver.AsProblems(err)))
	}
	data, err := encode(res)
	if err != nil {
		// Solve returns only finite numbers, so this is a solve function
		// that broke the promise: name the number as Solve would.
		if ferr := solver.CheckFinite(res); ferr != nil {
			return []byte(problemsJSON(solver.AsProblems(ferr)))
		}
		return []byte(problemsJSON(solver.Problems{{Path: solver.ResultPath, Message: "internal error: " + err.Error(), Err: solver.ErrNumerical}}))
	}
	return data
}

// decodeProject reads a project in the binary form (the page's own
// worker calls) or as JSON (everything else).
func decodeProject(data []byte) (*solver.Project, error) {
	if solver.IsBinaryProject(data) {
		var p solver.Project
		if err := p.UnmarshalBinary(data); err != nil {
			return nil, solver.Problems{{Path: "", Message: "the page's project could not be read: " + err.Error()}}
		}
		return &p, nil
	}
	return solver.Decode(data)
}

// Validate returns the problems of a project as a JSON list.
func (a *api) Validate(project string) (out string) {
	defer func() {
		if r := recover(); r != nil {
			out = fmt.Sprintf(`[{"path":"","message":%q}]`, fmt.Sprintf("internal error: %v", r))
		}
	}()
	ps := solver.Problems{}
	p, err := solver.Decode([]byte(project))
	if err != nil {
		ps = solver.AsProblems(err)
	} else if err := solver.Validate(p); err != nil {
		ps = solver.AsProblems(err)
	}
	data, _ := json.Marshal(ps)
	return string(data)
}

// register puts the API on obj (globalThis in the page). The functions
// live as long as the program.
func (a *api) register(obj js.Value) {
	o := js.Global().Get("Object").New()
	o.Set("version", version)
	o.Set("solve", js.FuncOf(func(_ js.Value, args []js.Value) any {
		s, bad := argJSON(args)
		if bad != "" {
			return problemsJSON(solver.Problems{{Path: "", Message: bad}})
		}
		return a.Solve(s)
	}))
	o.Set("validate", js.FuncOf(func(_ js.Value, args []js.Value) any {
		s, bad := argJSON(args)
		if bad != "" {
			data, _ := json.Marshal(solver.Problems{{Path: "", Message: bad}})
			return string(data)
		}
		return a.Validate(s)
	}))
	o.Set("demo", js.FuncOf(func(js.Value, []js.Value) any { return string(a.demo) }))
	a.registerMonitor(o)
	obj.Set("porelight", o)
}

// argJSON takes the project argument: a JSON string, or an object to
// stringify.
func argJSON(args []js.Value) (s, problem string) {
	if len(args) == 0 {
		return "", "pass the project as a JSON string"
	}
	switch v := args[0]; v.Type() {
	case js.TypeString:
		return v.String(), ""
	case js.TypeObject:
		var out string
		err := catch(func() { out = js.Global().Get("JSON").Call("stringify", v).String() })
		if err != nil {
			return "", "the project object could not be turned into JSON: " + err.Error()
		}
		return out, ""
	}
	return "", "pass the project as a JSON string (got " + args[0].Type().String() + ")"
}

// catch runs f and turns a panic (a JavaScript exception from js.Value.Call
// comes as one) into an error.
func catch(f func()) (err error) {
	defer func() {
		if r := recover(); r != nil {
			if e, ok := r.(error); ok {
				err = e
			} else {
				err = fmt.Errorf("%v", r)
			}
		}
	}()
	f()
	return nil
}
