package monitor

import (
	"errors"
	"strings"
	"testing"
	"time"

	"porelight/solver"
)

// parseDate reads a file-format date, as package solver does.
func parseDate(s string) (time.Time, bool) {
	t, err := time.Parse(solver.DateLayout, s)
	return t, err == nil
}

// checkProblem asserts that err is a solver.Problems list of exactly one
// problem at path with reason (errors.Is), whose message holds says and
// does not repeat the path or a package prefix.
func checkProblem(t *testing.T, err error, path string, reason error, says string) {
	t.Helper()
	var ps solver.Problems
	if !errors.As(err, &ps) || len(ps) != 1 {
		t.Fatalf("error %T %v is not one solver.Problem", err, err)
	}
	p := ps[0]
	if p.Path != path {
		t.Errorf("path %q, want %q (%v)", p.Path, path, err)
	}
	if !errors.Is(err, reason) {
		t.Errorf("reason %v, want %v", p.Err, reason)
	}
	if !strings.Contains(p.Message, says) {
		t.Errorf("message %q does not say %q", p.Message, says)
	}
	for _, prefix := range []string{"asaoka:", "backfit:", path + ":"} {
		if strings.HasPrefix(p.Message, prefix) {
			t.Errorf("message %q starts with %q", p.Message, prefix)
		}
	}
}
