package form

import "testing"

// TestFormatSig: rounding to n significant figures (arithmetic; the
// expected texts are worked by hand), and what cannot be rounded is
// written as FormatNumber writes it.
func TestFormatSig(t *testing.T) {
	for _, c := range []struct {
		x    float64
		n    int
		want string
	}{
		{1.54762679591e-9, 3, "1.55e-9"}, // the applied fit
		{0.000123456, 3, "0.000123"},
		{12345.678, 3, "12300"},
		{-2.71828, 2, "-2.7"},
		{0.3000000004, 3, "0.3"},
		{9.996, 3, "10"},
		{0, 3, "0"},
		{1.5e-9, 0, "1.5e-9"},
	} {
		if got := FormatSig(c.x, c.n); got != c.want {
			t.Errorf("FormatSig(%g, %d) = %q, want %q", c.x, c.n, got, c.want)
		}
	}
}
