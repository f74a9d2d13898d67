// Package solver computes steady seepage and one-dimensional consolidation
// of a layered, saturated soil column by the finite element method.
//
// # Overview
//
// A Project (the JSON file format, see below) describes the layers, the
// groundwater, the drainage at each end, the loading and the outputs
// wanted. Decode reads it strictly, Validate reports every problem at once
// with its field path, and Solve returns a Result:
//
//	p, err := solver.Decode(data) // unknown fields and a wrong format are refused
//	if err != nil { … }           // err is a Problems list: path + message each
//	r, err := solver.Solve(p, nil)
//
// Depth z is positive downward from the top of the column. Heads are
// piezometric levels in metres above the top (negative below it). Units are
// SI: m, kPa, kN/m³, day, m/s, 1/kPa. Every function leaves its arguments
// unchanged unless its documentation says otherwise.
//
// # Equations
//
// Steady seepage solves d/dz (k dh/dz) = 0 for the total head h, with a
// fixed head at a drained end and a fixed inflow at an undrained one. Pore
// pressure is u = γw (h + z); the total vertical stress comes from the unit
// weights (moist above the water table, saturated below) and the effective
// stress is σ' = σ − u.
//
// Consolidation solves
//
//	mv ∂u/∂t − ∂/∂z ((k/γw) ∂u/∂z) = mv ∂σ/∂t
//
// for the pore pressure change u from the initial steady state, with k and
// mv constant in each layer, u held at drained ends and zero flux at
// undrained ones.
//
// # Weak form
//
// Both equations share one form. Multiply the strong form
// −(c u')' = f by a test function w that vanishes where u is prescribed
// and integrate by parts over the column [0, H]:
//
//	∫ c u' w' dz − [c u' w]₀ᴴ = ∫ f w dz.
//
// At a drained (Dirichlet) end w = 0 and the boundary term drops out; at a
// flux end, c u' is the given flux and moves to the right-hand side. So:
// find u, equal to the prescribed values at Dirichlet ends, such that for
// every such w
//
//	∫ c u' w' dz = ∫ f w dz + w(0) q₀ + w(H) q_H
//
// with q the flux into the column at a flux end. Only first derivatives
// appear, so u may have kinks: at a layer boundary the coefficient c jumps
// and u' jumps with it while the flux c u' stays continuous, which the weak
// form enforces naturally. For consolidation the time derivative adds
// ∫ mv u̇ w dz on the left and ∫ mv σ̇ w dz on the right.
//
// Writing u = Σ uⱼ Nⱼ with Lagrange shape functions Nⱼ (linear or quadratic
// elements, every layer boundary a node) and taking w = Nᵢ gives
//
//	K u = f,  Kᵢⱼ = ∫ c Nᵢ' Nⱼ' dz,   and   M u̇ + K u = M σ̇,  Mᵢⱼ = ∫ mv Nᵢ Nⱼ dz.
//
// Element integrals use Gauss–Legendre quadrature with order+1 points,
// exact for the mass matrix and for a coefficient constant in an element.
// K and M are symmetric and banded (tridiagonal for linear elements); the
// rows of Dirichlet nodes are removed, their known values moved to the
// right-hand side, and the remaining symmetric positive definite band is
// factorised with LAPACK's Dpttrf (tridiagonal) or Dpbtrf (band) from
// gonum, never by a dense solve.
//
// With linear elements and a coefficient constant in each element, the
// finite element solution of the steady problem equals the exact solution
// at the nodes; between nodes the error is O(h²) in the L2 norm for linear
// and O(h³) for quadratic elements (Strang & Fix 1973).
//
// # File format
//
// One project is one JSON object; the field names of Project and its parts
// are the contract. The "format" field must read "porelight/1". Unknown
// fields are refused with their path rather than ignored.
//
//	{
//	  "format": "porelight/1",
//	  "title": "…", "notes": "…",
//	  "units": {"length": "m", "stress": "kPa", "time": "day", "k": "m/s"},
//	  "gammaW": 9.81,
//	  "layers": [{"name": "Soft clay", "thickness": 3.0, "gammaSat": 18.5, "gamma": 17.0,
//	              "k": 1e-9, "mv": 5e-4,
//	              "ecurve": {"e0": 1.2, "cc": 0.45, "cr": 0.05, "sigmaP": 60},
//	              "calpha": 0.01}],
//	  "waterTable": 0.5,
//	  "top":    {"drained": true, "head": -0.5},
//	  "bottom": {"drained": false},
//	  "loads":  [{"start": 0, "ramp": 30, "q": 60}, {"start": 200, "q": -20}],
//	  "times":  [1, 10, 30, 100, 365, 1000],
//	  "piezometers": [2.5, 6.0],
//	  "mesh": {"order": 1, "maxSize": 0.1, "minPerLayer": 4}
//	}
//
// # Scope
//
// The column is saturated, one-dimensional and small strain; flow follows
// Darcy's law; k and mv are constant in each layer and in time. Results are
// not valid for unsaturated soil, large strains, creep-dominated soils,
// two- or three-dimensional flow or stress spread, or loads that fail the
// ground. They are estimates for qualified engineers; local codes and
// licensed engineering practice govern any design.
package solver
