package drain

import "math"

// Pattern is the plan layout of the drains.
type Pattern string

// The patterns.
const (
	Triangular Pattern = "triangular"
	Square     Pattern = "square"
)

// CellFactor is De/s for a pattern: the diameter of the circle with the
// plan area one drain drains, over the spacing. It is √(2√3/π) ≈ 1.0501
// for a triangular pattern (area s²·√3/2) and √(4/π) ≈ 1.1284 for a
// square one (area s²); 0 for an unknown pattern.
func CellFactor(p Pattern) float64 {
	switch p {
	case Triangular:
		return math.Sqrt(2 * math.Sqrt(3) / math.Pi)
	case Square:
		return math.Sqrt(4 / math.Pi)
	}
	return 0
}

// Equivalent names a definition of the equivalent diameter of a band drain.
type Equivalent string

// The definitions of a band drain's equivalent diameter dw from its width
// a and thickness b. Both attributions are from memory:
//
//   - Perimeter: the circle of the band's perimeter, dw = 2(a+b)/π —
//     Hansbo, S. (1979). Consolidation of clay by band-shaped prefabricated
//     drains. Ground Engineering 12(5), 16–25.
//   - Mean: dw = (a+b)/2 — Rixner, J.J., Kraemer, S.R. & Smith, A.D.
//     (1986). Prefabricated vertical drains, Vol. I. Report FHWA/RD-86/168,
//     Federal Highway Administration.
const (
	Perimeter Equivalent = "perimeter"
	Mean      Equivalent = "mean"
)

// EquivalentDiameter is a band drain's equivalent diameter, m, for width
// a and thickness b by the definition e; 0 for an unknown definition.
func EquivalentDiameter(a, b float64, e Equivalent) float64 {
	switch e {
	case Perimeter:
		return 2 * (a + b) / math.Pi
	case Mean:
		return (a + b) / 2
	}
	return 0
}

// Barron is Barron's (1948) factor of an ideal drain (no smear, no well
// resistance) for n = De/dw > 1:
//
//	F(n) = n²/(n²−1) ln n − (3n²−1)/(4n²).
func Barron(n float64) float64 {
	n2 := n * n
	return n2/(n2-1)*math.Log(n) - (3*n2-1)/(4*n2)
}

// Cell is the unit cell of one drain.
type Cell struct {
	// N is De/dw, > 1.
	N float64
	// S is ds/dw, the smear zone's diameter over the drain's, in [1, N).
	// 1 means no smear.
	S float64
	// KRatio is kh/ks, the undisturbed over the smeared horizontal
	// permeability, ≥ 1 (1: no smear).
	KRatio float64
}

// Mu is the cell's μ without well resistance: 8 kh ū/(γw De² ∂ε/∂t) of
// the equal-strain cell, ū averaged over the soil (De² − dw²). With S = 1
// or KRatio = 1 it equals Barron(N). Special cases: S ≤ 1 is taken as 1.
//
// Derivation (Hansbo 1981, kept exact in n): with rw, rs, re the radii of
// the drain, the smear zone and the cell, the flow toward the drain across
// radius r carries the volume change outside it, so
// ∂u/∂r = (γw ε̇ / 2k)(re²/r − r) with k = ks inside rs and kh outside;
// integrating from the drain and averaging gives the expression below.
func (c Cell) Mu() float64 {
	s := math.Max(c.S, 1)
	re, rw := 1.0, 1/c.N
	rs := s * rw
	// f(r; a) = re² ln(r/a) − (r² − a²)/2, the pressure rise from radius a
	// to r in units of γw ε̇/(2k); I(a, b; c) = ∫_a^b f(r; c) 2r dr.
	f := func(r, a float64) float64 { return re*re*math.Log(r/a) - (r*r-a*a)/2 }
	F := func(r, c float64) float64 { // antiderivative of f(r; c)·2r
		return re*re*(r*r*math.Log(r/c)-r*r/2) - (r*r*r*r/4 - c*c*r*r/2)
	}
	I := func(a, b, c float64) float64 { return F(b, c) - F(a, c) }
	kr := c.KRatio
	if kr <= 0 {
		kr = 1
	}
	// ū (re² − rw²) in units of γw ε̇/(2 kh).
	sum := kr*(I(rw, rs, rw)+f(rs, rw)*(re*re-rs*rs)) + I(rs, re, rs)
	// μ = 8 kh ū / (γw De² ε̇) = kh ū / (A re²), A = γw ε̇/2.
	return sum / ((re*re - rw*rw) * re * re)
}

// WellTerm is the part of μ that well resistance adds at distance z, m,
// from the drain's discharging end, for a drained length l, m (z ≤ l),
// horizontal permeability kh, m/s, and discharge capacity qw, m³/s:
//
//	π z(2l − z) (kh/qw) (1 − 1/n²),
//
// Hansbo's (1981) term with the factor (1 − 1/n²) his derivation drops
// (the drain takes the flow of the soil annulus, not of the whole cell).
// qw ≤ 0 or +Inf means no well resistance (0).
func WellTerm(z, l, kh, qw, n float64) float64 {
	if qw <= 0 || math.IsInf(qw, 1) {
		return 0
	}
	return math.Pi * z * (2*l - z) * kh / qw * (1 - 1/(n*n))
}

// Discharge says where the drains let their water out.
type Discharge string

// The discharge ends.
const (
	Top  Discharge = "top"
	Base Discharge = "base"
	Both Discharge = "both"
)

// FromOutlet returns, for a drain from depth top to depth tip discharging
// at d, the distance of depth z (top ≤ z ≤ tip) from the end its water
// leaves by, and the drained length l that WellTerm takes.
func FromOutlet(z, top, tip float64, d Discharge) (dist, l float64) {
	switch d {
	case Base:
		return tip - z, tip - top
	case Both:
		l = (tip - top) / 2
		return math.Min(z-top, tip-z), l
	}
	return z - top, tip - top
}
