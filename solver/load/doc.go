// Package load gives the vertical stress added with depth under a load of
// finite extent at the ground surface: the influence factor I(z) = Δσz/q
// under a uniform pressure q on a strip, a rectangle, a circle or a
// symmetric embankment (trapezoidal strip), at the column's position, by
// the elastic solutions of a homogeneous, isotropic, weightless half-space
// that integrate Boussinesq's (1885) point-load formula, or by the 2:1
// spread of common practice.
//
// # Overview
//
//	a := load.Area{Shape: load.Rectangle, Width: 20, Length: 40, X: 5}
//	if err := a.Check(); err != nil { … } // a caller's bug: solver validates the file first
//	f := a.Factor(12)                      // Δσz/q at 12 m depth, 5 m off the centre line
//
// Depth z is positive downward from the loaded surface, m; X is the
// horizontal distance of the column from the centre of the area across its
// width, Y along its length. The factor is dimensionless: multiply by the
// surface pressure q (kPa). Functions leave their arguments unchanged and
// allocate nothing.
//
// # Elastic solutions (Boussinesq 1885)
//
// A point load P at the surface of an elastic half-space adds
// σz = 3P z³ / (2π R⁵) at depth z and distance R from it, whatever the
// elastic constants. Integrated over a loaded area it gives:
//
//	strip of width B (StripAt)          I = (1/π)[α + sin α cos(α + 2δ)],
//	                                    α the angle the strip subtends at the point,
//	                                    δ the angle from the vertical to its nearer edge;
//	rectangle, under a corner (Corner)  Newmark (1935): with m = B/z, n = L/z, V = m² + n² + 1,
//	                                    I = (1/2π)[mn/√V (1/(1+m²) + 1/(1+n²)) + atan(mn/√V)],
//	                                    anywhere else by superposing four corners (RectangleAt);
//	circle of radius R, on its axis     I = 1 − [1 + (R/z)²]^(−3/2) (CircleAxis);
//	linearly varying strip (RampAt)     the integral of the line-load solution
//	                                    2p z³/(π (x² + z²)²) against a linear p;
//	symmetric embankment (EmbankmentAt) a uniform strip under the crest and two ramps
//	                                    under the slopes; on the centre line it is
//	                                    twice Osterberg's (1957) half-embankment
//	                                    I = (1/π)[((a+b)/a)(α1 + α2) − (b/a) α2] (Osterberg).
//
// q of an embankment is the pressure under its crest (γ H of a fill of
// height H); it falls linearly to zero at the toes.
//
// # The 2:1 spread (common practice)
//
// With Method Spread21 the load spreads at one horizontal to two vertical
// from each edge and is uniform over the widened area: B/(B+z) under a
// strip, BL/((B+z)(L+z)) under a rectangle, R²/(R+z/2)² under a circle,
// and Bm/(Bm+z) under an embankment taken as a strip of its mean width
// Bm = crest + run. Outside the widened area the factor is zero. It keeps
// the total load at every depth; it is a hand method, coarser than the
// elastic solutions, and does not depend on the position within the area.
//
// # Special cases
//
// The factor is the limit from below at z ≤ 0: 1 under the loaded area,
// ½ at the edge of a strip or rectangle (¼ at a corner), 0 outside. An
// infinite area (Shape Uniform, the zero value) gives 1 at every depth.
// Sizes must be positive and finite (Check); the off-axis circle has no
// closed form here, so a circle takes X = Y = 0 only.
//
// # Scope
//
// The elastic solutions assume a homogeneous, isotropic, linear elastic
// half-space with a flexible (uniform pressure) load; layering, a rigid
// base or a stiff crust change the real distribution, and the 2:1 spread
// is rougher still. Package solver uses the factor as the total stress
// change σ(z) of one-dimensional consolidation, which assumes no lateral
// strain: under a load narrow compared with the compressible depth the
// settlement is then only indicative.
package load
