package solver

import (
	"math"
	"testing"
)

// SeriesAt against hand interpolation of a three-point history; the
// expected values are exact in binary (tolerance 0) except the one at
// t = 1/3, checked to 1e-15 relative (rounding of one division).
func TestSeriesAt(t *testing.T) {
	t.Parallel()
	ts := []float64{0, 1, 3, 3, 5}
	ys := []float64{10, 20, 40, 30, 50}
	cases := []struct {
		name string
		t    float64
		want float64
		tol  float64
	}{
		{"before the first time: held", -2, 10, 0},
		{"at the first time", 0, 10, 0},
		{"inside the first interval", 0.25, 12.5, 0},
		{"a third into it", 1.0 / 3, 10 + 10.0/3, 1e-15},
		{"at an inner time", 1, 20, 0},
		{"inside a wider interval", 2, 30, 0},
		{"at a jump: the first value", 3, 40, 0},
		{"after the jump", 4, 40, 0},
		{"at the last time", 5, 50, 0},
		{"after the last time: held", 9, 50, 0},
	}
	for _, tc := range cases {
		if got := SeriesAt(ts, ys, tc.t); math.Abs(got-tc.want) > tc.tol*math.Abs(tc.want) {
			t.Errorf("%s: SeriesAt(%g) = %.17g, want %.17g", tc.name, tc.t, got, tc.want)
		}
	}
	if got := SeriesAt([]float64{7}, []float64{2}, 100); got != 2 {
		t.Errorf("one point: got %g, want 2", got)
	}
}

// SameDepth's tolerance is 1e-9 of the depth, at least 1e-9 m (its doc).
func TestSameDepth(t *testing.T) {
	t.Parallel()
	cases := []struct {
		a, b float64
		want bool
	}{
		{3, 3, true},
		{3, 3 + 2e-9, true},    // within 3e-9 m
		{3, 3 + 4e-9, false},   // beyond it
		{0, 9e-10, true},       // near the top: 1e-9 m
		{0, 2e-9, false},       //
		{0.1 + 0.2, 0.3, true}, // rounding of a typed sum
		{2, 2.001, false},      // a millimetre apart
	}
	for _, tc := range cases {
		if got := SameDepth(tc.a, tc.b); got != tc.want {
			t.Errorf("SameDepth(%.17g, %.17g) = %v, want %v", tc.a, tc.b, got, tc.want)
		}
	}
}
