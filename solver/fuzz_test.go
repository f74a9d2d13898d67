package solver

import (
	"encoding/json"
	"errors"
	"os"
	"path/filepath"
	"testing"
)

// FuzzDecodeSolve feeds arbitrary bytes through Decode → Validate → Solve.
// It asserts that nothing panics, that every refusal is a list of problems
// each with a message, and that a solved project has finite outputs. The
// seeds are every project under ../testdata (the demo and the reference
// cases); crashers found by `go test -fuzz` land in testdata/fuzz here.
func FuzzDecodeSolve(f *testing.F) {
	seeds, _ := filepath.Glob("../testdata/*.json")
	more, _ := filepath.Glob("../testdata/*/*.json")
	for _, name := range append(seeds, more...) {
		data, err := os.ReadFile(name)
		if err != nil {
			f.Fatal(err)
		}
		var wrapped struct {
			Project json.RawMessage `json:"project"`
		}
		if json.Unmarshal(data, &wrapped) == nil && len(wrapped.Project) > 0 {
			data = wrapped.Project
		}
		f.Add(data)
	}
	f.Add([]byte(`{"format":"porelight/1","layers":[{"thickness":1e-300,"gammaSat":20,"k":1e300,"mv":1e-300}],"top":{"drained":true},"loads":[{"start":0,"q":1e300}]}`))
	f.Fuzz(func(t *testing.T, data []byte) {
		p, err := Decode(data)
		if err != nil {
			assertProblemList(t, err)
			return
		}
		if err := Validate(p); err != nil {
			assertProblemList(t, err)
			return
		}
		// Keep each run quick: large but valid projects are the
		// benchmarks' business.
		if elementCount(p) > 1000 || (HasConsolidation(p) && estimateSteps(p) > 2000) {
			return
		}
		r, err := Solve(p, nil)
		if err != nil {
			return // a numerical refusal is an answer, not a crash
		}
		if s := finiteAll(r); s != "" {
			// Extreme but finite inputs may overflow; that must be
			// reported, never silent. Accept it only with a warning.
			if len(r.Warnings) == 0 {
				t.Errorf("non-finite output %s with no warning", s)
			}
		}
	})
}

func assertProblemList(t *testing.T, err error) {
	var ps Problems
	if !errors.As(err, &ps) || len(ps) == 0 {
		t.Fatalf("error %v (%T) is not a non-empty Problems list", err, err)
	}
	for _, p := range ps {
		if p.Message == "" {
			t.Fatalf("problem at %q has no message", p.Path)
		}
	}
}
