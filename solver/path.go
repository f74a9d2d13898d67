package solver

import (
	"errors"
	"fmt"
	"strconv"
	"strings"
)

// Field paths. A field path names one value of a Project by the JSON
// names of the fields on the way to it, joined by ".", with "[i]" after
// the name of a list for its item i (0-based):
//
//	layers[2].ecurve.cc     top.excess[0].t     times[3]
//
// Problem.Path and Warning.Path are field paths ("" for the project as a
// whole). JoinPath and IndexPath build them, and ParsePath takes them
// apart, so that the decoder, Validate and the page's editors share one
// grammar.

// JoinPath is the path of field name inside the value at parent:
// JoinPath("layers[2]", "k") is "layers[2].k" and JoinPath("", "title")
// is "title".
func JoinPath(parent, name string) string {
	if parent == "" {
		return name
	}
	return parent + "." + name
}

// IndexPath is the path of item i of the list at parent:
// IndexPath("layers", 2) is "layers[2]".
func IndexPath(parent string, i int) string {
	return parent + "[" + strconv.Itoa(i) + "]"
}

// PathStep is one step of a field path: a JSON field name, then the index
// of an item when the field is a list and the path goes into it.
type PathStep struct {
	Name  string
	Index int // −1 when the step stops at the field itself
}

// ErrPath is the reason ParsePath refuses a path.
var ErrPath = errors.New("not a field path")

// ParsePath splits a field path into its steps:
// "layers[2].ecurve.cc" gives {layers 2} {ecurve −1} {cc −1}. It is the
// inverse of JoinPath and IndexPath: rebuilding the steps gives the path
// back.
//
// Special cases are: "" (the whole project), an empty name ("a..b",
// "[1]"), a bracket not closed at the end of its step ("a[1", "a[1]b"),
// an index that is not a decimal number ≥ 0 written as IndexPath writes
// it ("a[-1]", "a[x]", "a[]", "a[01]") and
// two indices in one step ("a[1][2]") are refused with an error wrapping
// ErrPath.
func ParsePath(path string) ([]PathStep, error) {
	if path == "" {
		return nil, pathError(path, "empty")
	}
	steps := make([]PathStep, 0, strings.Count(path, ".")+1)
	for part := range strings.SplitSeq(path, ".") {
		st := PathStep{Name: part, Index: -1}
		if i := strings.IndexByte(part, '['); i >= 0 {
			digits, ok := strings.CutSuffix(part[i+1:], "]")
			if !ok {
				return nil, pathError(path, "unclosed [")
			}
			n, ok := index(digits)
			if !ok {
				return nil, pathError(path, "bad index ["+digits+"]")
			}
			st.Name, st.Index = part[:i], n
		}
		if st.Name == "" {
			return nil, pathError(path, "empty name")
		}
		steps = append(steps, st)
	}
	return steps, nil
}

// index reads a list index: decimal digits only, without a sign, a space
// or a leading zero, so that IndexPath writes it back the same.
func index(s string) (int, bool) {
	if s == "" || len(s) > 1 && s[0] == '0' {
		return 0, false
	}
	for _, r := range s {
		if r < '0' || r > '9' {
			return 0, false
		}
	}
	n, err := strconv.Atoi(s)
	return n, err == nil
}

func pathError(path, why string) error {
	return fmt.Errorf("path %q: %w: %s", path, ErrPath, why)
}
