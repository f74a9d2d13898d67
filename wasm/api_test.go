//go:build js && wasm

package main

import (
	"encoding/json"
	"math"
	"os"
	"strings"
	"syscall/js"
	"testing"

	"porelight/solver"
)

func demoBytes(t *testing.T) []byte {
	t.Helper()
	data, err := os.ReadFile("../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	return data
}

// errorOf decodes a solve answer that should be an error.
func errorOf(t *testing.T, out string) solver.Problems {
	t.Helper()
	var e struct {
		Error *struct {
			Problems []solver.Problem `json:"problems"`
		} `json:"error"`
	}
	if err := json.Unmarshal([]byte(out), &e); err != nil {
		t.Fatalf("answer is not JSON: %v\n%s", err, out)
	}
	if e.Error == nil {
		return nil
	}
	return e.Error.Problems
}

func TestSolve(t *testing.T) {
	demo := demoBytes(t)
	tests := []struct {
		name     string
		project  string
		wantPath string // of the first problem; "-" for a result
	}{
		{"demo", string(demo), "-"},
		{"not JSON", `{"format": "porelight/1",`, ""},
		{"empty", ``, ""},
		{"bad value", strings.Replace(string(demo), `"waterTable": 1.0`, `"waterTable": "deep"`, 1), "waterTable"},
		{"no layers", `{"format": "porelight/1", "layers": [], "top": {"drained": true}, "bottom": {"drained": true}}`, "layers"},
	}
	a := &api{demo: demo}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			out := a.Solve(tt.project)
			ps := errorOf(t, out)
			if tt.wantPath == "-" {
				if ps != nil {
					t.Fatalf("problems %v", ps)
				}
				var r solver.Result
				if err := json.Unmarshal([]byte(out), &r); err != nil {
					t.Fatal(err)
				}
				if len(r.Steady.Depth) == 0 || len(r.Steady.Head) != len(r.Steady.Depth) {
					t.Errorf("steady result has %d depths, %d heads", len(r.Steady.Depth), len(r.Steady.Head))
				}
				return
			}
			if len(ps) == 0 {
				t.Fatalf("no problems in %s", out)
			}
			if ps[0].Path != tt.wantPath || ps[0].Message == "" {
				t.Errorf("first problem %+v, want path %q", ps[0], tt.wantPath)
			}
		})
	}
}

func TestSolveRecoversPanics(t *testing.T) {
	a := &api{demo: demoBytes(t), solve: func(*solver.Project, *solver.Options) (*solver.Result, error) {
		var m map[string]int
		m["boom"]++ // a bug in the solver
		return nil, nil
	}}
	ps := errorOf(t, a.Solve(string(a.demo)))
	if len(ps) != 1 || !strings.Contains(ps[0].Message, "internal error") {
		t.Errorf("problems %+v, want one internal error", ps)
	}
}

// A result holding NaN (which JSON cannot carry) comes back as the
// solver's problem naming the number, never as an encoding failure.
func TestSolveNonFiniteResult(t *testing.T) {
	a := &api{demo: demoBytes(t), solve: func(*solver.Project, *solver.Options) (*solver.Result, error) {
		return &solver.Result{Steady: solver.Steady{Head: []float64{0, math.NaN()}}}, nil
	}}
	ps := errorOf(t, a.Solve(string(a.demo)))
	if len(ps) != 1 || ps[0].Path != "result.steady.head[1]" || !strings.Contains(ps[0].Message, "could not be computed") ||
		strings.Contains(ps[0].Message, "encoded") {
		t.Errorf("problems %+v, want one at result.steady.head[1]", ps)
	}
}

func TestValidate(t *testing.T) {
	demo := string(demoBytes(t))
	a := &api{}
	tests := []struct {
		name    string
		project string
		paths   []string
	}{
		{"valid", demo, nil},
		{"unknown field first", strings.Replace(strings.Replace(demo, `"gammaW": 9.81`, `"gammaW": -1`, 1), `"waterTable": 1.0`, `"waterTable": 1.0, "colour": 1`, 1), []string{"colour"}},
		{"values", strings.Replace(demo, `"gammaW": 9.81`, `"gammaW": -1`, 1), []string{"gammaW"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			var ps []solver.Problem
			if err := json.Unmarshal([]byte(a.Validate(tt.project)), &ps); err != nil {
				t.Fatal(err)
			}
			if ps == nil {
				t.Fatal("validate answered null, want a list")
			}
			var got []string
			for _, p := range ps {
				got = append(got, p.Path)
			}
			if len(tt.paths) == 0 && len(got) > 0 || len(tt.paths) > 0 && (len(got) == 0 || got[0] != tt.paths[0]) {
				t.Errorf("problem paths %v, want %v first", got, tt.paths)
			}
		})
	}
}

// TestJSAPI calls the API as a script would, through JavaScript values.
func TestJSAPI(t *testing.T) {
	a := &api{demo: demoBytes(t)}
	obj := js.Global().Get("Object").New()
	a.register(obj)
	pl := obj.Get("porelight")
	if got := pl.Get("version").String(); got != version {
		t.Errorf("version %q", got)
	}
	if got := pl.Call("demo").String(); got != string(a.demo) {
		t.Error("demo() does not return the demo project")
	}
	// A project object is accepted as well as its JSON text.
	proj := js.Global().Get("JSON").Call("parse", string(a.demo))
	if ps := errorOf(t, pl.Call("solve", proj).String()); ps != nil {
		t.Errorf("solve(object) gave problems %v", ps)
	}
	// Wrong arguments give problems, not exceptions.
	for _, args := range [][]any{{}, {42}, {nil}} {
		if ps := errorOf(t, pl.Call("solve", args...).String()); len(ps) != 1 {
			t.Errorf("solve%v: problems %v, want one", args, ps)
		}
	}
	var ps []solver.Problem
	if err := json.Unmarshal([]byte(pl.Call("validate", "{").String()), &ps); err != nil || len(ps) != 1 {
		t.Errorf("validate(\"{\") = %v, %v", ps, err)
	}
}

// TestHostWithoutBrowser checks that the host degrades, rather than
// stopping the program, where the browser parts are missing (node has
// no localStorage and no document).
func TestHostWithoutBrowser(t *testing.T) {
	h := host{}
	h.Yield() // returns once setTimeout calls back
	if _, _, err := h.Recall("k"); err == nil {
		t.Error("Recall without localStorage reported no error")
	}
	if err := h.Store("k", "v"); err == nil {
		t.Error("Store without localStorage reported no error")
	}
	if err := h.Download("a.txt", "text/plain", []byte("x")); err == nil {
		t.Error("Download without a document reported no error")
	}
	called := false
	h.ReadFile("open-file", func(_ string, _ []byte, err error) { called = err != nil })
	if !called {
		t.Error("ReadFile without a document did not report an error")
	}
}
