// Package series sums published closed-form and eigenfunction solutions of
// one-dimensional consolidation. It is the independent reference against
// which the finite element solver of package solver is tested, so it
// shares no code with it: only the equations.
//
// # Overview
//
// One drainage path, uniform soil (dimensionless):
//
//	U := series.TerzaghiU(Tv)              // Terzaghi (1943)
//	u := series.TerzaghiExcess(Z, Tv)      // u/u0
//	Tv := series.TvForU(0.9)               // 0.848
//	u := series.ProfileExcess(u0, Z, Tv)   // any initial profile u0(Z)
//	U := series.OlsonU(Tv, Tc)             // load ramped over Tc (Olson 1977)
//
// A layered column (dimensional):
//
//	s, err := series.NewLayered(layers, 9.81, true, false, 0) // Schiffman & Stein (1970)
//	u := s.Excess(z, tDays)                                    // u/u0
//	Us, Up := s.Us(tDays), s.Up(tDays)
//
// # Conventions
//
// The one-path functions (Terzaghi*, TvForU, Profile*, Olson*) describe a
// single drainage path of length H, drained at Z = 0 and impermeable at
// Z = 1, with Z = z/H measured from the drained face and the time factor
// Tv = cv t/H². With one drained face H is the thickness; with two, H is
// half of it and each half is one path (Z runs from each face to the
// centre). Results are ratios: u/u0, u/q, or degrees of consolidation U.
//
// Layered works in the units of package solver: depth z in m, positive
// downward from the top of the column; time in days; k in m/s; mv in 1/kPa;
// γw in kN/m³; so cv = k·86400/(mv·γw) in m²/day. The initial excess pore
// pressure is uniform, u0 = 1, and Excess returns u/u0.
//
// Functions of float arguments follow package math: an argument out of its
// domain (a negative time, a depth outside the column, NaN) gives NaN, and
// each function lists its special cases. Constructors panic on caller bugs
// (NewProfile with terms < 1) and return errors for refused data
// (NewLayered: *InputError values naming the field, joined).
//
// # Terzaghi (1943)
//
// For a uniform initial excess pore pressure u0,
//
//	u/u0 = Σ (2/M) sin(M Z) exp(−M² Tv),   U = 1 − Σ (2/M²) exp(−M² Tv),
//
// with M = π(2m+1)/2, m = 0, 1, …. For Tv < 0.1 the functions sum instead
// the equivalent image series of the same problem (Carslaw & Jaeger 1959,
// Conduction of Heat in Solids, ch. 3),
//
//	u/u0 = 1 − Σ (−1)ⁿ [erfc((2n+Z)/(2√Tv)) + erfc((2n+2−Z)/(2√Tv))],
//	U    = 2√(Tv/π) + 4√Tv Σ (−1)ⁿ ierfc(n/√Tv)   (n ≥ 1),
//
// which converges in a few terms where the Fourier series needs many. The
// tests check that the two agree to 5e-15 for 1e-4 ≤ Tv ≤ 1, so every
// result is exact to rounding for every Tv > 0. TvForU inverts TerzaghiU by
// bisection.
//
// # Arbitrary initial profile
//
// For an initial excess u0(Z) the same eigenfunctions give (Terzaghi 1943)
//
//	u = Σ Aₘ sin(M Z) exp(−M² Tv),   Aₘ = 2 ∫₀¹ u0(Z) sin(M Z) dZ,
//	U = 1 − Σ (Aₘ/M) exp(−M² Tv) / ∫₀¹ u0 dZ,
//
// with Aₘ by composite Gauss–Legendre quadrature (NewProfile; kinks of u0
// should be given as breaks). For example a triangle u0 = Z (zero at the
// drained face) has Aₘ = 2(−1)ᵐ/M² and, while Tv ≤ 0.005, U = 2Tv.
//
// # Olson (1977)
//
// A load rising linearly to q over the time factor Tc and then constant is
// the superposition (Duhamel) of Terzaghi's solution over the ramp, so
// U and u/q are running means of Terzaghi's over the last Tc:
//
//	U(Tv)   = (1/Tc) ∫ TerzaghiU(τ) dτ,         max(0, Tv−Tc) ≤ τ ≤ Tv,
//	u/q     = (1/Tc) ∫ TerzaghiExcess(Z, τ) dτ,
//
// whose Fourier forms are Olson's printed series (see OlsonU). The
// integrals of the series are summed in closed form. Olson's U is the
// settlement as a fraction of the final one.
//
// # Schiffman & Stein (1970): layered columns
//
// In each layer mv ∂u/∂t = (k/γw) ∂²u/∂z²; u and the flux k ∂u/∂z are
// continuous at interfaces; u = 0 at a drained end, ∂u/∂z = 0 at an
// impermeable one (at least one end must be drained). Separating variables,
//
//	u(z, t) = Σ aₙ φₙ(z) exp(−βₙ t),   aₙ = ∫ mv φₙ dz / ∫ mv φₙ² dz,
//
// where (k/γw) φₙ” = −βₙ mv φₙ in each layer, with the same interface and
// end conditions. This is a regular Sturm–Liouville problem with weight
// mv, so the φₙ are orthogonal with weight mv and the coefficients follow
// from that orthogonality; the integrals of sin and sin² are closed forms
// per layer. In layer i, φₙ = Aᵢ sin(θᵢ + μᵢ (z − zᵢ)) with μᵢ = √(βₙ/cvᵢ).
//
// Us = 1 − ∫ mv u dz / ∫ mv u0 dz is the degree of consolidation by
// settlement, Up = 1 − ∫ u dz / ∫ u0 dz by pore pressure; they differ when
// mv varies between layers.
//
// # Finding every eigenvalue
//
// A scan of a characteristic function on a grid can miss two roots that
// fall between grid points, which happens with strong contrasts in cv or
// thin layers. Layered instead counts: with the Prüfer angle θ, defined by
// φ = A sin θ and k φ' ∝ ζ A cos θ where ζ = √(k mv), θ grows by μᵢhᵢ
// across layer i and at an interface maps by tan θ' = (ζᵢ/ζᵢ₋₁) tan θ on
// the same branch (Prüfer 1926; Pryce 1993, Numerical Solution of
// Sturm–Liouville Problems). The map fixes the multiples of π/2, so θ(H) is
// a continuous, strictly increasing function of ω = √β, and by the Sturm
// oscillation theorem the n-th eigenfunction (n from 0, with n zeros
// inside the column) is the unique root of
//
//	θ(H; ω) = target(n),  θ(0) = 0 (drained top) or π/2 (impermeable top),
//	target(n) = (n+1)π (drained bottom) or (n+½)π (impermeable bottom).
//
// Each interface moves θ by less than π/2, which brackets every root; about
// 60 bisection steps find it to a few ulps. No eigenvalue can be missed or
// found twice, whatever the contrasts. The tests confirm this
// independently: a fine scan of the transfer-matrix characteristic
// function finds exactly the same eigenvalues (to 1e-9) on seven columns
// with cv contrasts of 100×, 0.01× and up to 2e6× and layers 0.1 m thick in
// 10 m, under all three drainages; each φₙ has n zeros; the φₙ are
// mv-orthogonal to 1e-10; and Bessel's equality for u0 = 1 leaves only the
// expected tail.
//
// For a symmetric column drained at both ends, the antisymmetric
// eigenfunctions have aₙ = 0: they are kept, and cost nothing but time.
//
// # Accuracy
//
// Verified in the tests of this package:
//
//	TerzaghiU, TerzaghiExcess   exact to rounding (≤ 5e-15) for every Tv > 0
//	TvForU                      TerzaghiU(TvForU(U)) = U to 1e-14
//	Profile*, u0 smooth         1e-13 of max|u0| for Tv ≥ 1e-4 (3e-13 at 1e-6)
//	OlsonU, OlsonExcess         1e-12 against numerical Duhamel integration,
//	                            1e-13 against Olson's printed series
//	Layered, one soil           Terzaghi to 1e-12 (u) and 1e-13 (Us, Up)
//	                            for TimeFactor ≥ 0.01
//	Layered, terms = 0          truncation error ≤ 1.1e-6 of u0 at MinTime
//	                            on the seven test columns (promised: 1e-4)
//
// and a finite difference solution converges to Layered, and to Olson's
// solution, at the observed order 2 of its scheme.
//
// The series of Layered is truncated. Its smallest good time is MinTime,
// at which the first omitted term has decayed to exp(−12); from then on
// Excess is accurate to 1e-4 of u0 (1e-6 seen in the tests) and Us, Up far
// better. With terms = 0, NewLayered keeps enough terms that MinTime is at
// most the time of TimeFactor 1e-3, where TimeFactor(t) = 4β₁t/π² is
// Terzaghi's Tv for a uniform column (β₁ the slowest decay rate). Below
// MinTime the truncated series is returned all the same and oscillates
// near the drained ends; pass a larger terms for earlier times (MinTime
// falls as 1/terms²).
package series
