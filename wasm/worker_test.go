//go:build js && wasm

package main

import (
	"encoding/json"
	"reflect"
	"strings"
	"syscall/js"
	"testing"
	"time"

	"porelight/solver"
)

// goCallJS calls globalThis.goCall as the worker script does and returns
// the answer's text and the progress fractions reported. project is JSON
// text, or bytes passed as a Uint8Array (as the page passes a binary
// project).
func goCallJS(t *testing.T, op string, project any) (string, []float64) {
	t.Helper()
	var fractions []float64
	progress := js.FuncOf(func(_ js.Value, args []js.Value) any {
		fractions = append(fractions, args[0].Float())
		return nil
	})
	defer progress.Release()
	if b, ok := project.([]byte); ok {
		project = toJS(b)
	}
	r := js.Global().Call("goCall", op, project, progress)
	if !r.InstanceOf(js.Global().Get("Uint8Array")) {
		t.Fatalf("goCall(%q) returned %s, not a Uint8Array", op, r.Type())
	}
	b := make([]byte, r.Get("length").Int())
	js.CopyBytesToGo(b, r)
	return string(b), fractions
}

// TestWorkerCall registers goCall as a worker does and calls it.
func TestWorkerCall(t *testing.T) {
	demo := string(demoBytes(t))
	ready := false
	f := js.FuncOf(func(js.Value, []js.Value) any { ready = true; return nil })
	defer f.Release()
	js.Global().Set("goReady", f)
	defer js.Global().Delete("goReady")
	serveWorker(&api{demo: demoBytes(t)})
	defer js.Global().Delete("goCall")
	if !ready {
		t.Error("serveWorker did not call goReady")
	}
	defer func(d time.Duration) { progressEvery = d }(progressEvery)
	progressEvery = 0 // report every fraction

	t.Run("solve", func(t *testing.T) {
		out, fractions := goCallJS(t, "solve", demo)
		if ps := errorOf(t, out); ps != nil {
			t.Fatalf("problems %v", ps)
		}
		a := &api{}
		if want := a.Solve(demo); out != want {
			t.Error("goCall's result differs from porelight.solve's")
		}
		if len(fractions) == 0 {
			t.Fatal("no progress reported")
		}
		for i, f := range fractions {
			if f < 0 || f > 1 || i > 0 && f < fractions[i-1] {
				t.Fatalf("progress %v: not rising within [0, 1]", fractions)
			}
		}
	})
	t.Run("solve-binary", func(t *testing.T) {
		// The page's own call: the same result as porelight.solve's JSON,
		// in the binary form, and problems still as JSON.
		out, _ := goCallJS(t, "solve-binary", demo)
		var got, want solver.Result
		if err := got.UnmarshalBinary([]byte(out)); err != nil {
			t.Fatalf("answer %.80q: %v", out, err)
		}
		if err := json.Unmarshal([]byte((&api{}).Solve(demo)), &want); err != nil {
			t.Fatal(err)
		}
		if !reflect.DeepEqual(got, want) {
			t.Error("solve-binary's result differs from porelight.solve's")
		}
		bad, _ := goCallJS(t, "solve-binary", `{"format": "porelight/1", "layers": 3}`)
		if ps := errorOf(t, bad); len(ps) == 0 || ps[0].Path != "layers" {
			t.Errorf("answer %s, want a problem at layers", bad)
		}
		// The project in the binary form, as the page sends it.
		p, err := solver.Decode([]byte(demo))
		if err != nil {
			t.Fatal(err)
		}
		bin, err := p.MarshalBinary()
		if err != nil {
			t.Fatal(err)
		}
		out, _ = goCallJS(t, "solve-binary", bin)
		var fromBinary solver.Result
		if err := fromBinary.UnmarshalBinary([]byte(out)); err != nil {
			t.Fatalf("answer %.80q: %v", out, err)
		}
		if !reflect.DeepEqual(fromBinary, want) {
			t.Error("the binary project solved differently from its JSON")
		}
		cut, _ := goCallJS(t, "solve-binary", bin[:len(bin)-3])
		if ps := errorOf(t, cut); len(ps) != 1 || !strings.Contains(ps[0].Message, "the page's project could not be read") {
			t.Errorf("a damaged binary project: answer %s", cut)
		}
	})
	t.Run("bad project", func(t *testing.T) {
		out, _ := goCallJS(t, "solve", `{"format": "porelight/1", "layers": 3}`)
		if ps := errorOf(t, out); len(ps) == 0 || ps[0].Path != "layers" {
			t.Errorf("answer %s, want a problem at layers", out)
		}
	})
	t.Run("validate", func(t *testing.T) {
		out, _ := goCallJS(t, "validate", strings.Replace(demo, `"gammaW": 9.81`, `"gammaW": -1`, 1))
		var ps []solver.Problem
		if err := json.Unmarshal([]byte(out), &ps); err != nil || len(ps) != 1 || ps[0].Path != "gammaW" {
			t.Errorf("validate answered %s (%v)", out, err)
		}
	})
	t.Run("unknown call", func(t *testing.T) {
		out, _ := goCallJS(t, "launch", demo)
		if ps := errorOf(t, out); len(ps) != 1 || !strings.Contains(ps[0].Message, `unknown worker call "launch"`) {
			t.Errorf("answer %s", out)
		}
	})
}
