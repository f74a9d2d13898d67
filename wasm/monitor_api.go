//go:build js && wasm

package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"runtime/debug"
	"syscall/js"

	"porelight/solver"
	"porelight/solver/monitor"
)

// The monitoring analyses of the JavaScript API:
//
//	porelight.asaoka(project, options) // → {"plates": [{"plate", "name", "result" | "error"}…]}
//	porelight.backfit(project, spec)   // → the back-fit result JSON
//
// Both take the project as JSON (or an object) and never throw; a
// project or argument they cannot use comes back as
// {"error": {"problems": [{"path", "message"}…]}}, as from solve. The
// answers are those the page shows: monitor.PlateAsaokaWindow with the
// project's saved choices (monitoring.asaoka) and monitor.BackFit.

// AsaokaRequest is the options argument of porelight.asaoka; every field
// may be left out.
type AsaokaRequest struct {
	// Plate is the index of one plate; absent: every plate.
	Plate *int `json:"plate,omitempty"`
	// Interval is the resampling step, days (0: automatic); From and To
	// bound the window, days (0: the saved window, or the default).
	Interval float64 `json:"interval,omitempty"`
	From     float64 `json:"from,omitempty"`
	To       float64 `json:"to,omitempty"`
}

// AsaokaPlate is one plate's answer of porelight.asaoka.
type AsaokaPlate struct {
	Plate  int                   `json:"plate"`
	Name   string                `json:"name,omitempty"`
	Result *monitor.AsaokaResult `json:"result,omitempty"`
	Error  *struct {
		Problems solver.Problems `json:"problems"`
	} `json:"error,omitempty"`
}

// decodeStrict reads JSON into v, refusing unknown fields; problems are
// at path.
func decodeStrict(data string, v any, path string) error {
	if data == "" {
		return nil
	}
	d := json.NewDecoder(bytes.NewReader([]byte(data)))
	d.DisallowUnknownFields()
	if err := d.Decode(v); err != nil {
		return solver.Problems{{Path: path, Err: solver.ErrSyntax, Message: "could not be read: " + err.Error()}}
	}
	return nil
}

// guard turns a panic into an internal-error answer.
func guard(out *string, what string) {
	if r := recover(); r != nil {
		*out = problemsJSON(solver.Problems{{Path: "", Message: fmt.Sprintf("internal error: %v", r)}})
		println("porelight:", what, "failed:", fmt.Sprint(r), string(debug.Stack()))
	}
}

// Asaoka applies Asaoka's method to the plates of a project.
func (a *api) Asaoka(project, options string) (out string) {
	defer guard(&out, "asaoka")
	var req AsaokaRequest
	if err := decodeStrict(options, &req, "options"); err != nil {
		return problemsJSON(solver.AsProblems(err))
	}
	p, err := solver.Decode([]byte(project))
	if err == nil {
		err = solver.Validate(p)
	}
	if err != nil {
		return problemsJSON(solver.AsProblems(err))
	}
	var n int
	if p.Monitoring != nil {
		n = len(p.Monitoring.Plates)
	}
	lo, hi := 0, n
	if req.Plate != nil {
		if *req.Plate < 0 || *req.Plate >= n {
			return problemsJSON(solver.Problems{{Path: "options.plate", Err: solver.ErrOutOfRange, Message: fmt.Sprintf("has no plate %d (the project has %d)", *req.Plate, n)}})
		}
		lo, hi = *req.Plate, *req.Plate+1
	}
	ans := struct {
		Plates []AsaokaPlate `json:"plates"`
	}{Plates: []AsaokaPlate{}}
	for i := lo; i < hi; i++ {
		pl := AsaokaPlate{Plate: i, Name: p.Monitoring.Plates[i].Name}
		r, err := monitor.PlateAsaokaWindow(p, i, req.Interval, req.From, req.To)
		if err != nil {
			pl.Error = &struct {
				Problems solver.Problems `json:"problems"`
			}{solver.AsProblems(err)}
		} else {
			pl.Result = r
		}
		ans.Plates = append(ans.Plates, pl)
	}
	data, err := json.Marshal(ans)
	if err != nil {
		return problemsJSON(solver.Problems{{Path: solver.ResultPath, Err: solver.ErrNumerical, Message: "internal error: " + err.Error()}})
	}
	return string(data)
}

// Backfit back-fits the project's parameters to its records.
func (a *api) Backfit(project, spec string) (out string) {
	defer guard(&out, "backfit")
	var fs monitor.FitSpec
	if err := decodeStrict(spec, &fs, monitor.FitSpecPath); err != nil {
		return problemsJSON(solver.AsProblems(err))
	}
	p, err := solver.Decode([]byte(project))
	if err != nil {
		return problemsJSON(solver.AsProblems(err))
	}
	r, err := monitor.BackFit(p, fs, nil)
	if err != nil {
		return problemsJSON(solver.AsProblems(err))
	}
	data, err := json.Marshal(r)
	if err != nil {
		return problemsJSON(solver.Problems{{Path: solver.ResultPath, Err: solver.ErrNumerical, Message: "internal error: " + err.Error()}})
	}
	return string(data)
}

// registerMonitor puts asaoka and backfit on the API object o.
func (a *api) registerMonitor(o js.Value) {
	for name, f := range map[string]func(string, string) string{"asaoka": a.Asaoka, "backfit": a.Backfit} {
		o.Set(name, js.FuncOf(func(_ js.Value, args []js.Value) any {
			project, bad := argJSON(args)
			if bad != "" {
				return problemsJSON(solver.Problems{{Path: "", Message: bad}})
			}
			second := ""
			if len(args) > 1 && args[1].Type() != js.TypeUndefined && args[1].Type() != js.TypeNull {
				if second, bad = argJSON(args[1:]); bad != "" {
					return problemsJSON(solver.Problems{{Path: "", Message: "second argument: " + bad}})
				}
			}
			return f(project, second)
		}))
	}
}
