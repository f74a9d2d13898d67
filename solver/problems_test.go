package solver

import (
	"errors"
	"testing"
)

// A problem of the whole project (empty path) prints its message alone,
// with no ": " in front; one with a path prints "path: message".
func TestProblemError(t *testing.T) {
	t.Parallel()
	cases := []struct {
		p    Problem
		want string
	}{
		{Problem{Path: "", Message: "line 1, column 2: invalid character", Err: ErrSyntax}, "line 1, column 2: invalid character"},
		{Problem{Path: "layers[0].k", Message: "must be > 0 (got 0)", Err: ErrNotPositive}, "layers[0].k: must be > 0 (got 0)"},
	}
	for _, c := range cases {
		if got := c.p.Error(); got != c.want {
			t.Errorf("Error() = %q, want %q", got, c.want)
		}
		if !errors.Is(c.p, c.p.Err) {
			t.Errorf("errors.Is(%v, its own reason) = false", c.p)
		}
	}
	var ps Problems
	ps.Add("", ErrTooLarge, "the file has 9 bytes")
	if got, want := ps.Error(), "exceeds a limit (the file has 9 bytes)"; got != want {
		t.Errorf("Problems.Error() = %q, want %q", got, want)
	}
}
