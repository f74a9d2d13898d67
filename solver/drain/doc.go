// Package drain holds the unit cell of a pattern of vertical drains: the
// cell's equivalent diameter from the spacing, a band drain's equivalent
// diameter, and the factor μ of the equal-strain radial consolidation
// theory with smear and well resistance.
//
// # The unit cell
//
// Each drain drains the soil cylinder of equal plan area around it, of
// diameter De (Barron 1948): De = √(2√3/π)·s ≈ 1.050 s for a triangular
// pattern and De = √(4/π)·s ≈ 1.128 s for a square one (s the spacing;
// common practice). With equal vertical strain over the cell (Barron's
// "equal strain" case) the average excess pore pressure ū of the cell
// obeys
//
//	∂ū/∂t = −(8 ch / (De² μ)) ū
//
// under radial flow alone, so that Uh = 1 − exp(−8 Th/μ), Th = ch t/De².
//
// # The factor μ
//
// Cell.Mu derives μ as Hansbo (1981) does — Darcy flow toward the drain,
// a smear zone of diameter ds = s·dw whose permeability is ks = kh/(kh/ks),
// and, through WellTerm, a drain of finite discharge capacity qw — but
// keeps every term of the derivation in n = De/dw instead of dropping the
// small ones. Without smear it is exactly Barron's (1948)
//
//	F(n) = n²/(n²−1) ln n − (3n²−1)/(4n²),
//
// and for n ≫ s it becomes Hansbo's
//
//	μ = ln(n/s) + (kh/ks) ln s − 0.75 + π z(2l − z) kh/qw,
//
// z being the distance from the drain's discharging end and l the length
// it drains (the drain's length for one-way discharge, half of it for
// discharge at both ends).
//
// Lengths are m, permeabilities m/s, qw m³/s (so that kh/qw is in 1/m²).
package drain
