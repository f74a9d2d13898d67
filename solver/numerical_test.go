package solver

import (
	"errors"
	"math"
	"reflect"
	"strings"
	"testing"
)

// A column whose equations cannot be factorised stops the solve with one
// ErrNumerical problem at the layer's k, naming the depth and the layer,
// and no result: never a warning beside results from a bad factor. The
// columns carry values Validate refuses (k ≤ 0, k or mv not finite), the only way to
// make a matrix that is not positive definite from inputs inside the
// limits; solveValid is Solve without the validation.
func TestSolveRefusesUnfactorisable(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name   string
		change func(p *Project)
		path   string
		says   []string
	}{
		{"steady: negative k in the clay", func(p *Project) { p.Layers[1].K = -1e-9 },
			"layers[1].k", []string{"the steady seepage equations", "in layer 2, \"clay\"", "m depth"}},
		{"steady: zero k in the sand", func(p *Project) { p.Layers[0].K = 0 },
			"layers[0].k", []string{"the steady seepage equations", "in layer 1, \"sand\""}},
		{"steady: NaN k in the clay, the lower layer", func(p *Project) { p.Layers[1].K = math.NaN() },
			"layers[1].k", []string{"the steady seepage equations", "in layer 2, \"clay\""}},
		{"consolidation: infinite mv in the clay", func(p *Project) { p.Layers[1].Mv = math.Inf(1); p.Loads = []Load{{Q: 40}} },
			"layers[1].k", []string{"the consolidation step from 0 to", "in layer 2, \"clay\""}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			p := valProject() // sand over clay, both ends drained
			c.change(p)
			if Validate(p) == nil {
				t.Fatal("Validate accepts the column; the test needs one it refuses")
			}
			r, err := solveValid(p, nil)
			if r != nil {
				t.Errorf("a result came back with the error %v", err)
			}
			ps := AsProblems(err)
			if len(ps) != 1 || !errors.Is(err, ErrNumerical) {
				t.Fatalf("got %v, want one ErrNumerical problem", err)
			}
			if ps[0].Path != c.path {
				t.Errorf("path %q, want %q", ps[0].Path, c.path)
			}
			for _, w := range c.says {
				if !strings.Contains(ps[0].Message, w) {
					t.Errorf("message %q does not say %q", ps[0].Message, w)
				}
			}
		})
	}
}

// firstNonFinite finds the first NaN or ±Inf anywhere in a Result — in a
// plain float, behind a pointer, in a []float64, in a list of structs —
// and names it by its JSON path; fields without a JSON name are skipped.
func TestFirstNonFinite(t *testing.T) {
	t.Parallel()
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		name string
		r    Result
		path string // "" when every number is finite
	}{
		{"all finite", Result{Steady: Steady{Head: []float64{1, 2}}, Summary: Summary{T50: ptr(3)}}, ""},
		{"nil pointer and empty lists", Result{}, ""},
		{"slice of floats", Result{Steady: Steady{Head: []float64{1, nan, inf}}}, "result.steady.head[1]"},
		{"plain float", Result{Summary: Summary{Flux: -inf}}, "result.summary.flux"},
		{"behind a pointer", Result{Summary: Summary{T90: ptr(nan)}}, "result.summary.t90"},
		{"list of structs", Result{Steady: Steady{Layers: []SteadyLayer{{}, {HeaveFactor: ptr(inf)}}}}, "result.steady.layers[1].heaveFactor"},
		{"deep in the consolidation", Result{Consolidation: &Consolidation{Series: Series{
			Time:        []float64{0, 1},
			Piezometers: []Piezometer{{Depth: 2, Pore: []float64{0, 1}}, {Depth: 3, Pore: []float64{0, nan}}},
		}}}, "result.consolidation.series.piezometers[1].pore[1]"},
		{"first of two in field order", Result{Steady: Steady{Head: []float64{nan}}, Summary: Summary{Flux: nan}}, "result.steady.head[0]"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			path, _, found := firstNonFinite(reflect.ValueOf(&c.r).Elem(), ResultPath)
			if found != (c.path != "") || path != c.path {
				t.Errorf("firstNonFinite = %q, %v; want %q", path, found, c.path)
			}
			err := CheckFinite(&c.r)
			if c.path == "" {
				if err != nil {
					t.Errorf("CheckFinite = %v on finite numbers", err)
				}
				return
			}
			ps := AsProblems(err)
			if len(ps) != 1 || ps[0].Path != c.path || !errors.Is(err, ErrNumerical) {
				t.Errorf("CheckFinite = %v, want one ErrNumerical problem at %q", err, c.path)
			}
		})
	}
}
