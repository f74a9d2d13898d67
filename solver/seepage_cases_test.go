package solver

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"testing"
)

// Reference cases for steady seepage live in testdata/seepage, one JSON
// file each:
//
//	{"source": "published method(s)", "working": ["hand calculation", …],
//	 "project": {a porelight/1 project},
//	 "expect": {"relTol": …, "absTol": …, "flux": …, "kEquivalent": …,
//	            "nodes": [{"z", "head", "pore", "total", "effective"}],
//	            "layers": [{"gradient", "upward", "criticalGradient", "heaveFactor"}],
//	            "minHeaveFactor": …, "uplift": [{"layer", "depth", "total", "pore", "factor"}]}}
//
// Heads are compared to absTol (m); every other value to relTol relative.
// A key left out is not checked; "heaveFactor": null and
// "minHeaveFactor": null demand that there is none, "uplift": [] that no
// uplift check is reported. Unknown keys are refused, so a misspelt
// expectation cannot pass unchecked.

type seepCase struct {
	Source  string          `json:"source"`
	Working []string        `json:"working"`
	Project json.RawMessage `json:"project"`
	Expect  seepExpect      `json:"expect"`
}

type seepExpect struct {
	RelTol         float64           `json:"relTol"`
	AbsTol         float64           `json:"absTol"`
	Flux           *float64          `json:"flux"`
	KEquivalent    *float64          `json:"kEquivalent"`
	Nodes          []seepExpectNode  `json:"nodes"`
	Layers         []seepExpectLayer `json:"layers"`
	MinHeaveFactor json.RawMessage   `json:"minHeaveFactor"`
	Uplift         *[]UpliftCheck    `json:"uplift"`
}

type seepExpectNode struct {
	Z         float64  `json:"z"`
	Head      *float64 `json:"head"`
	Pore      *float64 `json:"pore"`
	Total     *float64 `json:"total"`
	Effective *float64 `json:"effective"`
}

type seepExpectLayer struct {
	Gradient         *float64        `json:"gradient"`
	Upward           *bool           `json:"upward"`
	CriticalGradient *float64        `json:"criticalGradient"`
	HeaveFactor      json.RawMessage `json:"heaveFactor"`
}

func TestSeepageReferenceCases(t *testing.T) {
	t.Parallel()
	files, err := filepath.Glob("../testdata/seepage/*.json")
	if err != nil {
		t.Fatal(err)
	}
	if len(files) < 3 {
		t.Fatalf("found %d reference cases in testdata/seepage, want at least 3", len(files))
	}
	for _, file := range files {
		t.Run(filepath.Base(file), func(t *testing.T) {
			t.Parallel()
			data, err := os.ReadFile(file)
			if err != nil {
				t.Fatal(err)
			}
			var c seepCase
			dec := json.NewDecoder(bytes.NewReader(data))
			dec.DisallowUnknownFields()
			if err := dec.Decode(&c); err != nil {
				t.Fatalf("case file: %v", err)
			}
			e := c.Expect
			if c.Source == "" || len(c.Working) == 0 || !(e.RelTol > 0) || !(e.AbsTol > 0) {
				t.Fatalf("case file needs a source, the working and positive relTol and absTol")
			}
			p, err := Decode(c.Project)
			if err != nil {
				t.Fatalf("project: %v", err)
			}
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatalf("Solve: %v", err)
			}
			s := r.Steady
			rel := func(what string, got, want float64) {
				t.Helper()
				if math.Abs(got-want) > e.RelTol*math.Abs(want) && !(want == 0 && math.Abs(got) <= e.AbsTol) {
					t.Errorf("%s = %.12g, expected %.12g (relTol %g)", what, got, want, e.RelTol)
				}
			}
			if e.Flux != nil {
				rel("flux", s.Flux, *e.Flux)
				for _, l := range s.Layers {
					rel("layer flux "+l.Name, l.Flux, *e.Flux)
				}
			}
			if e.KEquivalent != nil {
				rel("kEquivalent", s.KEquivalent, *e.KEquivalent)
			}
			for _, n := range e.Nodes {
				i := slices.Index(s.Depth, n.Z)
				if i < 0 {
					t.Errorf("no node at z = %g", n.Z)
					continue
				}
				if n.Head != nil && math.Abs(s.Head[i]-*n.Head) > e.AbsTol {
					t.Errorf("head at z = %g: %.12g m, expected %.12g (absTol %g)", n.Z, s.Head[i], *n.Head, e.AbsTol)
				}
				for _, v := range []struct {
					what string
					got  float64
					want *float64
				}{{"pore", s.Pore[i], n.Pore}, {"total", s.Total[i], n.Total}, {"effective", s.Effective[i], n.Effective}} {
					if v.want != nil {
						rel(v.what+" at z = "+strconv.FormatFloat(n.Z, 'g', -1, 64), v.got, *v.want)
					}
				}
			}
			if len(e.Layers) > 0 && len(e.Layers) != len(s.Layers) {
				t.Fatalf("%d layers in the result, %d expected", len(s.Layers), len(e.Layers))
			}
			for i, want := range e.Layers {
				got := s.Layers[i]
				name := "layer " + got.Name
				if want.Gradient != nil {
					rel(name+" gradient", got.Gradient, *want.Gradient)
				}
				if want.CriticalGradient != nil {
					rel(name+" critical gradient", got.CriticalGradient, *want.CriticalGradient)
				}
				if want.Upward != nil && got.Upward != *want.Upward {
					t.Errorf("%s upward = %v, expected %v", name, got.Upward, *want.Upward)
				}
				seepCheckOptional(t, name+" heave factor", got.HeaveFactor, want.HeaveFactor, rel)
			}
			seepCheckOptional(t, "smallest heave factor", r.Summary.MinHeaveFactor, e.MinHeaveFactor, rel)
			if e.Uplift != nil {
				if len(s.Uplift) != len(*e.Uplift) {
					t.Fatalf("%d uplift checks, expected %d: %+v", len(s.Uplift), len(*e.Uplift), s.Uplift)
				}
				for i, want := range *e.Uplift {
					got := s.Uplift[i]
					if got.Layer != want.Layer || got.Depth != want.Depth {
						t.Errorf("uplift check %d on layer %d at %g m, expected layer %d at %g m", i, got.Layer, got.Depth, want.Layer, want.Depth)
					}
					rel("uplift total stress", got.Total, want.Total)
					rel("uplift water pressure", got.Pore, want.Pore)
					if want.Factor != nil {
						rel("uplift factor", spDeref(got.Factor), *want.Factor)
					}
				}
			}
		})
	}
}

// seepCheckOptional compares an optional result figure with an expectation
// that is absent (not checked), null (must be absent) or a number.
func seepCheckOptional(t *testing.T, what string, got *float64, want json.RawMessage, rel func(string, float64, float64)) {
	t.Helper()
	switch {
	case want == nil:
	case string(want) == "null":
		if got != nil {
			t.Errorf("%s = %g, expected none", what, *got)
		}
	default:
		var w float64
		if err := json.Unmarshal(want, &w); err != nil {
			t.Fatalf("%s: expectation %s: %v", what, want, err)
		}
		if got == nil {
			t.Errorf("%s missing, expected %.12g", what, w)
			return
		}
		rel(what, *got, w)
	}
}
