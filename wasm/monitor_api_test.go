//go:build js && wasm

package main

import (
	"encoding/json"
	"os"
	"strings"
	"syscall/js"
	"testing"

	"porelight/solver"
	"porelight/solver/monitor"
)

// porelight.asaoka and porelight.backfit, called as a script would,
// return exactly the native answers (monitor.PlateAsaokaWindow and
// monitor.BackFit on the same project, encoded as JSON: byte for byte),
// and arguments they cannot use come back as problems with paths.
func TestMonitorAPI(t *testing.T) {
	a := &api{demo: demoBytes(t)}
	obj := js.Global().Get("Object").New()
	a.register(obj)
	pl := obj.Get("porelight")
	p, err := solver.Decode(a.demo)
	if err != nil {
		t.Fatal(err)
	}

	// Asaoka, every plate, the project passed as an object.
	var got struct {
		Plates []json.RawMessage `json:"plates"`
	}
	out := pl.Call("asaoka", js.Global().Get("JSON").Call("parse", string(a.demo))).String()
	if err := json.Unmarshal([]byte(out), &got); err != nil || len(got.Plates) != len(p.Monitoring.Plates) {
		t.Fatalf("asaoka: %v, %d plates: %.300s", err, len(got.Plates), out)
	}
	for i := range p.Monitoring.Plates {
		r, err := monitor.PlateAsaokaWindow(p, i, 0, 0, 0)
		if err != nil {
			t.Fatal(err)
		}
		want, _ := json.Marshal(AsaokaPlate{Plate: i, Name: p.Monitoring.Plates[i].Name, Result: r})
		if string(got.Plates[i]) != string(want) {
			t.Errorf("plate %d: API %.200s…, native %.200s…", i, got.Plates[i], want)
		}
	}
	// One plate with a window, options as JSON text.
	out = pl.Call("asaoka", string(a.demo), `{"plate": 1, "from": 600}`).String()
	r, err := monitor.PlateAsaokaWindow(p, 1, 0, 600, 0)
	if err != nil {
		t.Fatal(err)
	}
	want, _ := json.Marshal(struct {
		Plates []AsaokaPlate `json:"plates"`
	}{[]AsaokaPlate{{Plate: 1, Name: p.Monitoring.Plates[1].Name, Result: r}}})
	if out != string(want) {
		t.Errorf("asaoka plate 1 from day 600: %.200s…, native %.200s…", out, want)
	}

	// Back-fit of the upper clay's k.
	out = pl.Call("backfit", string(a.demo), map[string]any{"layers": []any{1}}).String()
	fr, err := monitor.BackFit(p, monitor.FitSpec{Layers: []int{1}}, nil)
	if err != nil {
		t.Fatal(err)
	}
	if want, _ := json.Marshal(fr); out != string(want) {
		t.Errorf("backfit: %.200s…, native %.200s…", out, want)
	}

	// Problems, never exceptions.
	cases := []struct {
		name string
		args []any
		path string
	}{
		{"asaoka: unknown option", []any{string(a.demo), `{"window": 3}`}, "options"},
		{"asaoka: no such plate", []any{string(a.demo), `{"plate": 9}`}, "options.plate"},
		{"asaoka: no project", []any{}, ""},
		{"asaoka: bad project", []any{`{"format": "porelight/1", "layers": []}`}, "layers"},
		{"backfit: unknown spec field", []any{string(a.demo), `{"layer": [1]}`}, monitor.FitSpecPath},
		{"backfit: nothing to fit", []any{string(a.demo), `{}`}, monitor.FitSpecPath},
		{"backfit: layer out of range", []any{string(a.demo), `{"layers": [9]}`}, "fit.layers[0]"},
		{"backfit: second argument a number", []any{string(a.demo), 5}, ""},
	}
	for _, c := range cases {
		fn := "asaoka"
		if c.name[:7] == "backfit" {
			fn = "backfit"
		}
		ps := errorOf(t, pl.Call(fn, c.args...).String())
		if len(ps) == 0 || ps[0].Path != c.path || ps[0].Message == "" {
			t.Errorf("%s: problems %+v, want the first at %q", c.name, ps, c.path)
		}
	}
}

// The README's JavaScript API example runs as written against the demo
// (no exception; it logs the plate's forecast).
func TestReadmeExample(t *testing.T) {
	data, err := os.ReadFile("../README.md")
	if err != nil {
		t.Fatal(err)
	}
	s := string(data)
	i := strings.Index(s, "## JavaScript API")
	j := strings.Index(s[i:], "```js\n")
	if i < 0 || j < 0 {
		t.Fatal("README has no JavaScript API example")
	}
	code := s[i+j+len("```js\n"):]
	code = code[:strings.Index(code, "```")]
	a := &api{demo: demoBytes(t)}
	a.register(js.Global())
	defer js.Global().Delete("porelight")
	if err := catch(func() { js.Global().Call("eval", "(function(){"+code+"})()") }); err != nil {
		t.Errorf("the README example fails: %v", err)
	}
}
