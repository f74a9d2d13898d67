package solver

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"testing"
)

// consolidationCase is one file of testdata/consolidation: a project, the
// published source of its expected values and the working from it.
type consolidationCase struct {
	Source  string          `json:"source"`
	Working string          `json:"working"`
	Project json.RawMessage `json:"project"`
	Expect  []struct {
		Quantity string  `json:"quantity"` // t50, t90, tTarget, settlement (the headline model's), settlementLinear, settlementElog, us, up, uv, uh (drains), layers[i].settlementLinear|settlementElog
		T        float64 `json:"t"`        // for series quantities, days
		Value    float64 `json:"value"`
		Tol      float64 `json:"tol"`
		Relative bool    `json:"relative"`
	} `json:"expect"`
}

// TestConsolidationCases solves every reference case in
// testdata/consolidation and checks each expected value within the
// tolerance the file states, naming the file's source on failure.
func TestConsolidationCases(t *testing.T) {
	t.Parallel()
	files, err := filepath.Glob("../testdata/consolidation/*.json")
	if err != nil || len(files) < 3 {
		t.Fatalf("want at least 3 consolidation cases, found %d (%v)", len(files), err)
	}
	for _, f := range files {
		t.Run(filepath.Base(f), func(t *testing.T) {
			t.Parallel()
			data, err := os.ReadFile(f)
			if err != nil {
				t.Fatal(err)
			}
			var c consolidationCase
			if err := json.Unmarshal(data, &c); err != nil {
				t.Fatal(err)
			}
			if c.Source == "" || len(c.Expect) == 0 {
				t.Fatal("a case needs a source and expected values")
			}
			p, err := Decode(c.Project)
			if err != nil {
				t.Fatal(err)
			}
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			for _, e := range c.Expect {
				got, err := quantity(r, e.Quantity, e.T)
				if err != nil {
					t.Error(err)
					continue
				}
				tol := e.Tol
				if e.Relative {
					tol *= math.Abs(e.Value)
				}
				if !(math.Abs(got-e.Value) <= tol) {
					t.Errorf("%s(t=%g) = %.7g, want %.7g ± %.3g (%s)", e.Quantity, e.T, got, e.Value, tol, c.Source)
				}
			}
		})
	}
}

// quantity reads a named figure off a result.
func quantity(r *Result, name string, t float64) (float64, error) {
	deref := func(v *float64) (float64, error) {
		if v == nil {
			return 0, fmt.Errorf("%s is missing from the result", name)
		}
		return *v, nil
	}
	sm := r.Summary
	switch name {
	case "t50":
		return deref(sm.T50)
	case "t90":
		return deref(sm.T90)
	case "tTarget":
		return deref(sm.TTarget)
	case "settlementLinear":
		return deref(sm.SettlementLinear)
	case "settlementElog":
		return deref(sm.SettlementElog)
	case "settlement":
		return deref(sm.Settlement)
	case "us", "up":
		if r.Consolidation == nil {
			return 0, fmt.Errorf("no consolidation results")
		}
		s := r.Consolidation.Series
		ys := s.Us
		if name == "up" {
			ys = s.Up
		}
		for i, ti := range s.Time {
			if math.Abs(ti-t) <= 1e-9*math.Max(1, t) {
				return ys[i], nil
			}
		}
		return 0, fmt.Errorf("no series point at t = %g (list it in times)", t)
	case "uv", "uh":
		if r.Drains == nil {
			return 0, fmt.Errorf("no drain results")
		}
		for _, a := range r.Drains.AtTimes {
			if math.Abs(a.Time-t) <= 1e-9*math.Max(1, t) {
				if name == "uv" {
					return a.Uv, nil
				}
				return a.Uh, nil
			}
		}
		return 0, fmt.Errorf("no output time t = %g (list it in times)", t)
	}
	var i int
	var field string
	if _, err := fmt.Sscanf(name, "layers[%d].%s", &i, &field); err == nil && i >= 0 && i < len(sm.Layers) {
		switch field {
		case "settlementLinear":
			return sm.Layers[i].SettlementLinear, nil
		case "settlementElog":
			return deref(sm.Layers[i].SettlementElog)
		}
	}
	return 0, fmt.Errorf("unknown quantity %q", name)
}
