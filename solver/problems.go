package solver

import (
	"errors"
	"fmt"
	"sort"
	"strings"
)

// Reasons a value is refused. A Problem wraps one of these, so callers may
// test with errors.Is.
var (
	ErrRequired    = errors.New("is required")
	ErrNotFinite   = errors.New("must be a finite number")
	ErrNotPositive = errors.New("must be > 0")
	ErrNegative    = errors.New("must be ≥ 0")
	ErrOutOfRange  = errors.New("is out of range")
	ErrNotSorted   = errors.New("must be in increasing order")
	ErrUnknown     = errors.New("is not a known field")
	ErrFormat      = errors.New("is not a supported format")
	ErrSyntax      = errors.New("is not valid JSON")
	// ErrNotProject marks a file that is not a project at all: a results
	// file, a table (CSV) or other text.
	ErrNotProject = errors.New("is not a project file")
	ErrConflict   = errors.New("conflicts with another field")
	ErrTooLarge   = errors.New("exceeds a limit")
	ErrDate       = errors.New("is not a date (YYYY-MM-DD)")
	ErrDuplicate  = errors.New("repeats the time of the reading before")
	// ErrNumerical marks a project that passed validation but whose
	// equations or results could not be computed in floating point (a
	// matrix that is not positive definite, an output that is not
	// finite). The path names the field most likely at fault: a layer's
	// k for a factorisation, or the output itself under ResultPath
	// ("result.steady.head[12]").
	ErrNumerical = errors.New("could not be computed")
)

// Problem is one thing wrong with a project: where (a field path such as
// "layers[2].k"), why (Err, one of the Err* reasons) and a message that
// says it in full, e.g. "must be > 0 (got -1e-09)".
type Problem struct {
	Path    string `json:"path"`
	Message string `json:"message"`
	Err     error  `json:"-"`
}

// Error is "path: message", or the message alone for a problem of the
// whole project (an empty path).
func (p Problem) Error() string {
	if p.Path == "" {
		return p.Message
	}
	return p.Path + ": " + p.Message
}

// Unwrap returns the reason, so errors.Is(p, ErrNotPositive) works.
func (p Problem) Unwrap() error { return p.Err }

// Problems is every problem found in a project. The zero value is an
// empty list ready to use.
type Problems []Problem

// Add records a problem at path with reason err; detail, when not empty,
// follows the reason in the message.
func (ps *Problems) Add(path string, err error, detail string) {
	msg := err.Error()
	if detail != "" {
		msg += " (" + detail + ")"
	}
	*ps = append(*ps, Problem{Path: path, Message: msg, Err: err})
}

// Error joins all problems, one per line.
func (ps Problems) Error() string {
	var b strings.Builder
	for i, p := range ps {
		if i > 0 {
			b.WriteByte('\n')
		}
		b.WriteString(p.Error())
	}
	return b.String()
}

// Err returns nil when there are no problems and the list otherwise, so
// that a caller never holds a non-nil error with nothing in it.
func (ps Problems) Err() error {
	if len(ps) == 0 {
		return nil
	}
	return ps
}

// Sort orders problems by path, keeping the order of equal paths.
func (ps Problems) Sort() {
	sort.SliceStable(ps, func(i, j int) bool { return ps[i].Path < ps[j].Path })
}

// Unwrap lets errors.Is and errors.As look at every problem.
func (ps Problems) Unwrap() []error {
	errs := make([]error, len(ps))
	for i := range ps {
		errs[i] = ps[i]
	}
	return errs
}

// AsProblems turns any error from Decode, Validate or Solve into a list of
// problems: a Problems value is returned as is, anything else becomes a
// single problem at path "" (the whole project).
func AsProblems(err error) Problems {
	if err == nil {
		return nil
	}
	var ps Problems
	if errors.As(err, &ps) {
		return ps
	}
	var p Problem
	if errors.As(err, &p) {
		return Problems{p}
	}
	return Problems{{Path: "", Message: err.Error(), Err: err}}
}

func num(v float64) string { return fmt.Sprintf("got %g", v) }
