package solver

import (
	"encoding/json"
	"errors"
	"os"
	"path/filepath"
	"reflect"
	"testing"
)

// FuzzDecodeSolve feeds arbitrary bytes through Decode → Validate → Solve.
// It asserts that nothing panics; that every refusal is a non-empty list
// of problems, each with a reason and a message and each with a field
// path, except a problem of the whole file from Decode (not JSON, not an
// object, too large); and that a solved project has only finite outputs,
// warnings or not (Solve refuses anything else with a path). The seeds
// are every project under ../testdata (the demo and the reference cases)
// and a few hostile ones; crashers found by `go test -fuzz` land in
// testdata/fuzz here.
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
	// At the edges of the bounds: the thinnest, most permeable and
	// stiffest layer beside the least permeable and softest, a sealed
	// base, the largest load, head and inflow.
	f.Add([]byte(`{"format":"porelight/1","waterTable":-10000,"layers":[{"thickness":0.0001,"gammaSat":50,"k":10,"mv":1e-9},{"thickness":9999,"gammaSat":9.82,"gamma":0.001,"k":1e-15,"mv":1}],"top":{"drained":true,"head":10000},"loads":[{"start":0,"q":100000},{"start":1e9,"q":-100000}],"times":[1e-9,1e9]}`))
	f.Add([]byte(`{"format":"porelight/1","layers":[{"thickness":10000,"gammaSat":50,"k":1e-15,"mv":1e-9}],"bottom":{"drained":true,"head":-10000},"top":{"inflow":1},"loads":[{"q":-100000,"profile":[{"z":-10000,"value":-1000},{"z":10000,"value":1000}]}]}`))
	f.Add([]byte(`{"":0}`))
	f.Fuzz(func(t *testing.T, data []byte) {
		p, err := Decode(data)
		if err != nil {
			assertProblemList(t, err, true)
			return
		}
		if err := Validate(p); err != nil {
			assertProblemList(t, err, false)
			return
		}
		// Keep each run quick: large but valid projects are the
		// benchmarks' business.
		if elementCount(p) > 1000 || (HasConsolidation(p) && estimateSteps(p) > 2000) {
			return
		}
		r, err := Solve(p, nil)
		if err != nil {
			// A numerical refusal is an answer, not a crash, but it
			// must name a field.
			assertProblemList(t, err, false)
			return
		}
		if path, v, ok := firstNonFinite(reflect.ValueOf(r).Elem(), ""); ok {
			t.Errorf("Solve accepted the project but %s = %g", path, v)
		}
	})
}

// assertProblemList fails t unless err is a non-empty Problems list whose
// every entry has a reason, a message and a path. With wholeFile set (an
// error from Decode), a problem of the whole file may have no path: a
// syntax error, or a file that is too large.
func assertProblemList(t *testing.T, err error, wholeFile bool) {
	t.Helper()
	var ps Problems
	if !errors.As(err, &ps) || len(ps) == 0 {
		t.Fatalf("error %v (%T) is not a non-empty Problems list", err, err)
	}
	for _, p := range ps {
		if p.Message == "" || p.Err == nil {
			t.Fatalf("problem at %q has message %q and reason %v", p.Path, p.Message, p.Err)
		}
		if p.Path == "" && !(wholeFile && (p.Err == ErrSyntax || p.Err == ErrTooLarge)) {
			t.Fatalf("problem %q (%v) has no field path", p.Message, p.Err)
		}
	}
}

// TestUnknownKeyPaths: an unknown key gets a path of its own even when it
// is empty or holds the characters of the path grammar (the fuzzer found
// {"":0} refused at the empty path, as if the file itself were wrong).
func TestUnknownKeyPaths(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct{ in, path string }{
		{`{"format":"porelight/1","":0}`, `""`},
		{`{"format":"porelight/1","top":{"":0}}`, `top.""`},
		{`{"format":"porelight/1","a.b":0}`, `"a.b"`},
		{`{"format":"porelight/1","layers":[{"k[0]":1}]}`, `layers[0]."k[0]"`},
		{`{"format":"porelight/1","colour":1}`, `colour`},
	} {
		_, err := Decode([]byte(tc.in))
		ps := AsProblems(err)
		if len(ps) != 1 || ps[0].Path != tc.path || !errors.Is(ps[0], ErrUnknown) {
			t.Errorf("Decode(%s) = %v, want one ErrUnknown at %s", tc.in, ps, tc.path)
		}
	}
}
