// Package fem is the one-dimensional finite element core of Porelight: a
// mesh of Lagrange elements on [0, H], the assembly of the bilinear forms
// of the weak form, symmetric band storage and its factorisation, the
// handling of held (Dirichlet) ends, and the θ-method in time. It speaks of
// coefficients c(z) and m(z), sources and boundary values, not of soil:
// package solver turns a soil column into those.
//
// # Overview
//
// The equations it discretises are
//
//	−(c u')' = f                     (steady), and
//	m u̇ − (c u')' = m ṡ             (transient),
//
// on a column of layers, with u held at either end (a Dirichlet end) or a
// given flux c u' there (a natural end). The weak form, for every test
// function w that vanishes at held ends,
//
//	∫ c u' w' dz = ∫ f w dz + w(0) q₀ + w(H) q_H,
//
// becomes, with u = Σ uⱼ Nⱼ,
//
//	K u = f,   Kᵢⱼ = ∫ c Nᵢ' Nⱼ' dz,   and   M u̇ + K u = M ṡ,   Mᵢⱼ = ∫ m Nᵢ Nⱼ dz.
//
// A Mesh places elements so that every layer boundary is a node
// (NewMesh); Mesh.Assemble adds either form to a Band by Gauss–Legendre
// quadrature with order+1 points; Mesh.Load forms ∫ f w dz. The rows of
// held nodes are removed: MoveHeld moves their known values to the
// right-hand side and Factorize factorises the remaining block lo … hi-1
// (Dpttrf for tridiagonal matrices, Dpbtrf otherwise, both from gonum's
// LAPACK; never a dense solve). Stepper advances M u̇ + K u = M ṡ by the
// θ-method, caching one factorisation per distinct (θ, Δt).
//
// # Conventions
//
// Depth z increases downward from 0. Element e of a mesh of order p spans
// nodes p·e … p·e+p; its nodes are equally spaced. Functions leave their
// arguments unchanged unless the documentation says a slice named dst (or
// an argument "on return") is written. Caller bugs (shape mismatches, an
// order other than 1 or 2) panic; a matrix that is not positive definite
// is reported as a *NotDefiniteError naming the node, never hidden.
//
// # Cost
//
// Assembly and load forming are O(n) in the number of elements;
// Factorize is O(n·kd²) and Factor.Solve O(n·kd) with no allocation;
// Stepper.Step allocates nothing once its factor for (θ, Δt) is cached.
package fem
