package units

import (
	"math"
	"testing"
)

// TestFactors checks each US factor against the conversion factors
// tabulated in NIST Special Publication 811 (2008), appendix B.8, to the
// seven significant figures printed there. The tabulated figures are
// quoted from memory; each one is also what the two exact definitions
// (foot 0.3048 m, pound-force 4.4482216152605 N) give by hand, which the
// second column of the table works out.
func TestFactors(t *testing.T) {
	tests := []struct {
		q    Quantity
		sym  string
		nist float64 // NIST SP 811, in the SI display unit
		hand float64 // from the definitions
	}{
		{Length, "ft", 0.3048, 0.3048},                                                              // foot → m, exact
		{Settlement, "in", 25.4, 25.4},                                                              // inch → mm, exact
		{Stress, "psf", 4.788026e1 / 1000, 4.4482216152605 / 0.09290304 / 1e3},                      // lbf/ft² → Pa 4.788 026 E+01
		{UnitWeight, "pcf", 1.570875e2 / 1000, 4.4482216152605 / 0.028316846592 / 1e3},              // lbf/ft³ → N/m³ 1.570 875 E+02
		{Permeability, "ft/day", 3.048e-1 / 86400, 0.3048 / 86400},                                  // ft/s → m/s 3.048 E-01, day 86 400 s
		{Compressibility, "ft²/kip", 1000 * 9.290304e-2 / 4.448222e3, 0.09290304 / 4.4482216152605}, // ft² → m² exact, kip → N 4.448 222 E+03
		{Consolidation, "ft²/yr", 9.290304e-2, 0.09290304},                                          // ft² → m², exact
		{Discharge, "ft³/yr", 2.831685e-2, 0.028316846592},                                          // ft³ → m³ 2.831 685 E-02
		{StressGradient, "psf/ft", 4.788026e1 / 0.3048 / 1000, 4.4482216152605 / 0.028316846592 / 1e3},
	}
	for _, tt := range tests {
		u := US.Of(tt.q)
		if u.Symbol != tt.sym {
			t.Errorf("quantity %d: symbol %q, want %q", tt.q, u.Symbol, tt.sym)
		}
		if rel := math.Abs(u.ToSI/tt.nist - 1); rel > 1e-6 {
			t.Errorf("%s: factor %.10g, NIST %.7g (off by %.2g, tolerance 1e-6)", tt.sym, u.ToSI, tt.nist, rel)
		}
		if rel := math.Abs(u.ToSI/tt.hand - 1); rel > 1e-14 {
			t.Errorf("%s: factor %.16g, by hand %.16g", tt.sym, u.ToSI, tt.hand)
		}
		if s := SI.Of(tt.q); s.ToSI != 1 {
			t.Errorf("%s: the SI unit %q has factor %g, want 1", tt.sym, s.Symbol, s.ToSI)
		}
	}
}

// TestRoundTrip: a value typed in US units is stored as its SI value to
// 12 significant figures, and shows again as typed.
func TestRoundTrip(t *testing.T) {
	tests := []struct {
		q     Quantity
		typed float64
		si    float64 // by hand from the exact definitions
	}{
		{Length, 10, 3.048},
		{Length, 32.8, 9.99744},
		{Settlement, 1, 25.4},
		{Stress, 1000, 47.8802589803},
		{UnitWeight, 120, 18.8504956615},
		{Consolidation, 10, 0.9290304},
		{Permeability, 0.01, 3.52777777778e-8},
	}
	for _, tt := range tests {
		got := US.Take(tt.q, tt.typed)
		if got != tt.si {
			t.Errorf("%g %s: stored %.17g, want %.17g", tt.typed, US.Symbol(tt.q), got, tt.si)
		}
		if back := US.Show(tt.q, got); math.Abs(back/tt.typed-1) > 1e-11 {
			t.Errorf("%g %s: shows back as %.17g", tt.typed, US.Symbol(tt.q), back)
		}
		if SI.Take(tt.q, tt.si) != tt.si || SI.Show(tt.q, tt.si) != tt.si {
			t.Errorf("%s: SI must not convert", SI.Symbol(tt.q))
		}
	}
}

func TestParse(t *testing.T) {
	for _, s := range []System{SI, US} {
		if got, ok := Parse(s.String()); !ok || got != s {
			t.Errorf("Parse(%q) = %v, %v", s.String(), got, ok)
		}
	}
	if _, ok := Parse("imperial"); ok {
		t.Error(`Parse("imperial") accepted`)
	}
	if US.Of(quantities) != SI.Of(None) {
		t.Error("an unknown quantity must have no unit")
	}
}
