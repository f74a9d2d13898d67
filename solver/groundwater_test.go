package solver

import (
	"strings"
	"testing"
)

// TestGroundwaterTruth checks that contradicting groundwater inputs are
// named, with which of them wins, and that consistent ones are not.
func TestGroundwaterTruth(t *testing.T) {
	t.Parallel()
	layers := []Layer{{Thickness: 4, GammaSat: 18, Gamma: 16, K: 1e-9, Mv: 1e-3}}
	for _, c := range []struct {
		name  string
		p     *Project
		path  string
		words []string
	}{
		{"top head against the water table", &Project{WaterTable: 1, Top: Boundary{Drained: true, Head: ptr(0)}}, "top.head",
			[]string{"the head at the top is 0 m but the water table is 1 m down", "pore pressures follow the head", "the total stress follows the water table"}},
		{"sealed top, base head against the water table", &Project{WaterTable: 0, Bottom: Boundary{Drained: true, Head: ptr(2)}}, "bottom.head",
			[]string{"holds throughout the column", "pore pressures follow the head"}},
		{"water table below the column", &Project{WaterTable: 6, Top: Boundary{Drained: true}}, "waterTable",
			[]string{"below the base of the column", "suction"}},
		{"consistent", &Project{WaterTable: 1, Top: Boundary{Drained: true, Head: ptr(-1)}, Bottom: Boundary{Drained: true, Head: ptr(3)}}, "", nil},
	} {
		t.Run(c.name, func(t *testing.T) {
			p := c.p
			p.Format, p.Layers = Format, layers
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			var got []Warning
			for _, w := range r.Warnings {
				if w.Path == "top.head" || w.Path == "bottom.head" || w.Path == "waterTable" {
					got = append(got, w)
				}
			}
			if c.path == "" {
				if len(got) > 0 {
					t.Errorf("warned %v for consistent inputs", got)
				}
				return
			}
			if len(got) != 1 || got[0].Path != c.path {
				t.Fatalf("want one warning at %s, got %v", c.path, got)
			}
			for _, w := range c.words {
				if !strings.Contains(got[0].Message, w) {
					t.Errorf("the warning %q does not say %q", got[0].Message, w)
				}
			}
		})
	}
}
