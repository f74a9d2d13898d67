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
// Every refusal is a Problem: a field path (Path, "" for the file as a
// whole), a reason to test with errors.Is (Err, one of the Err* values)
// and a Message to show beside the field; callers never parse the error
// text. Broken JSON says where ("line 3, column 12: …"); a file of
// another kind (results, CSV) is named as such (ErrNotProject). A
// column whose equations cannot be factorised stops the solve with an
// ErrNumerical problem at the k of the layer where it failed, naming the
// depth; an output that is not finite is refused at its own path under
// ResultPath ("result.steady.head[12]"), so a Result holds only finite
// numbers and always encodes to JSON.
//
// Depth z is positive downward from the top of the column. Heads are
// piezometric levels in metres above the top (negative below it). Units are
// SI: m, kPa, kN/m³, day, m/s, 1/kPa. Every function leaves its arguments
// unchanged unless its documentation says otherwise.
//
// # Packages
//
// The solver is a small family of packages, one concept each:
//
//	solver          the column model, file format, Decode, Validate, defaults, Solve, Result
//	solver/fem      mesh, elements, assembly, band factorisation, held ends, θ-stepping;
//	                speaks of c(z), m(z), sources and boundary values, not of soil
//	solver/soil     soil behaviour: the e–log σ' curve, preconsolidation, secondary
//	                compression, cv (new soil laws go here)
//	solver/monitor  pasted readings, Asaoka's method, the back-fit
//
// Package solver turns a column into the coefficients of package fem
// (seepage.go: steady state; transient.go and consolidate.go: the
// consolidation, one method per phase) and follows every element's soil
// state (package soil) along the stresses the consolidation gives.
//
// # Defaults
//
// Every field whose zero value means a default has an exported Default*
// constant and, where it depends on the project, a Resolve* function
// (ResolveGammaW, ResolveMesh, ResolveStepping, ResolveTargetDegree,
// ResolveDesignLife, EndTime). The page's placeholders read the same
// constants.
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
// # Time stepping
//
// Consolidation uses the θ-method on M u̇ + K u = M σ̇:
//
//	(M + θΔt K) u¹ = (M − (1−θ)Δt K) u⁰ + M (σ¹ − σ⁰),
//
// with u¹ held at drained ends. θ = 0.5 (Crank–Nicolson, second order) by
// default. An instantaneous change — a load stage with no ramp, an initial
// excess profile, a step in a boundary pressure history — is applied
// between steps as the undrained response (the excess pressure rises by
// the stress change at every node that is not held), and the next
// Stepping.DampedSteps steps (4 by default) use backward Euler, which damps
// the oscillation Crank–Nicolson shows after a discontinuous start
// (Rannacher 1984). Steps start at Stepping.FirstStep (1 minute) after
// every load or boundary breakpoint and grow by Stepping.Growth (1.1)
// between breakpoints and output times, on which they land exactly, so one
// minute to 100 years takes about 160 steps per breakpoint. Each distinct
// (θ, Δt) is factorised once and reused: after every restart the step
// sizes repeat.
//
// Linear elements use the row-sum lumped capacity matrix: it keeps
// M + θΔt K an M-matrix, so the pressure next to a drained end does not
// dip below its final value after an instantaneous load, which on the
// history-dependent e–log σ' curve would leave spurious virgin compression.
// Quadratic elements keep the consistent capacity matrix.
//
// # Settlement and degrees of consolidation
//
// With σ(z, t) the total stress change and u(z, t) the pore pressure
// change, the linear settlement is s(t) = ∫ mv (σ − u) dz; unloading
// returns along the same mv. The final state has every load applied and
// u∞ the steady pore pressure change under the final boundary values. The
// average degrees of consolidation are, relative to that final state,
//
//	Us(t) = ∫ mv (σ − u) dz / ∫ mv (σ∞ − u∞) dz   (by settlement),
//	Up(t) = ∫ (σ − u) dz / ∫ (σ∞ − u∞) dz         (by pore pressure),
//
// which reduce to Terzaghi's U for one layer under one instantaneous load
// and differ in layered soil. Under a surcharge later removed, Us exceeds 1
// while the surcharge acts. t50, t90 and the time to Project.TargetDegree
// are the first times Us reaches those values.
//
// The e–log σ' settlement (Terzaghi & Peck 1967) is evaluated per element
// (a sublayer) at its centre, from the initial effective stress of the
// steady state and σ'p (given, or OCR·σ'0, or σ'0): recompression and
// swelling follow Cr, loading beyond the largest past stress follows Cc.
// Both the series and the final figure follow the effective stress the
// consolidation gives at every step, so a surcharge removed before it has
// consolidated counts only for the compression it caused; the final figure
// is the value at the end of the simulation (a warning says when
// consolidation is not complete by then). Where a layer gives no mv, it is
// the secant of its e–log curve over the final stress change along the
// fully drained path through every load breakpoint. Secondary compression
// (Mesri 1973) is Cα H/(1+ep) log10(t/tp) per layer at Project.DesignLife,
// with tp the time at which Us reaches 95 %.
//
// # Field monitoring
//
// Project.Monitoring holds settlement plates and piezometer records, each a
// list of readings at days after day 0 or at dates counted from
// Monitoring.Start (DateLayout); Validate checks them with the rest of the
// project and ReadingTimes resolves their dates. Pasting readings,
// Asaoka's method and the back-fit live in package solver/monitor.
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
// # Input contract
//
// Validate checks every field below and reports each violation with its
// path and reason (the Err* values); Decode first refuses unknown fields
// (ErrUnknown), values of the wrong JSON type and a different "format"
// (ErrFormat). Limits protect a browser tab: at most MaxLayers layers,
// MaxElements elements, MaxTimes output times, MaxPiezometers piezometers,
// MaxLoads load stages, MaxSteps time steps, MaxWork nodes × steps and
// MaxStored numbers in one result (ErrTooLarge, reported at mesh.maxSize,
// stepping.firstStep or times).
//
// Every number also has a physical bound (the constants in bounds.go),
// generous for any real soil yet narrow enough that nothing inside them
// overflows in the numerics; a value outside it is refused with
// ErrOutOfRange and a message giving the allowed range and unit, e.g.
// "layers[0].k: is out of range (allowed 1e-15 to 10 m/s, got 1e+308
// m/s)". A value at or below zero where zero is not allowed keeps its own
// reason (ErrNotPositive, ErrNegative); NaN and ±Inf (possible only
// through the Go API) are ErrNotFinite.
//
//	field                     unit    allowed                         error when not
//	format                    –       "porelight/1"                   ErrFormat
//	units.*                   –       "m", "kPa", "day", "m/s"        ErrOutOfRange
//	gammaW                    kN/m³   9 … 13 (0 or absent: 9.81)      ErrNotPositive, ErrOutOfRange
//	waterTable                m       −10⁴ … 10⁴ (negative: above)    ErrOutOfRange
//	layers                    –       1 … MaxLayers                   ErrRequired, ErrTooLarge
//	layers[i].thickness       m       10⁻⁴ … 10⁴, column ≤ 10⁴ in all ErrNotPositive, ErrOutOfRange
//	layers[i].gammaSat        kN/m³   > gammaW, ≤ 50                  ErrNotPositive, ErrOutOfRange
//	layers[i].gamma           kN/m³   > 0, ≤ 50 (absent: gammaSat)    ErrNotPositive, ErrOutOfRange
//	layers[i].k               m/s     10⁻¹⁵ … 10                      ErrNotPositive, ErrOutOfRange
//	layers[i].mv              1/kPa   10⁻⁹ … 1, or absent with an     ErrNotPositive, ErrOutOfRange,
//	                                  ecurve                          ErrRequired
//	layers[i].calpha          –       0 … 1, needs an ecurve          ErrNegative, ErrOutOfRange, ErrConflict
//	layers[i].ecurve.e0       –       > 0, ≤ 30                       ErrNotPositive, ErrOutOfRange
//	layers[i].ecurve.cc       –       > 0, ≤ 20                       ErrNotPositive, ErrOutOfRange
//	layers[i].ecurve.cr       –       0 ≤ cr ≤ cc                     ErrNegative, ErrOutOfRange
//	layers[i].ecurve.sigmaP   kPa     > 0, ≤ 10⁵; not with ocr        ErrNotPositive, ErrOutOfRange, ErrConflict
//	layers[i].ecurve.ocr      –       1 … 1000; not with sigmaP       ErrOutOfRange, ErrConflict
//	top|bottom.head           m       −10⁴ … 10⁴; drained end only    ErrOutOfRange, ErrConflict
//	top|bottom.inflow         m/s     −1 … 1; undrained end, and the  ErrOutOfRange, ErrConflict
//	                                  other end drained
//	top|bottom.excess[j].t    day     0 … 10⁹, not decreasing         ErrNegative, ErrOutOfRange, ErrNotSorted
//	top|bottom.excess[j].value kPa    −10⁵ … 10⁵; drained end only    ErrOutOfRange, ErrConflict
//	loads                     –       at most MaxLoads                ErrTooLarge
//	loads[j].start, .ramp     day     0 … 10⁹                         ErrNegative, ErrOutOfRange
//	loads[j].q                kPa     −10⁵ … 10⁵ (negative removes)   ErrOutOfRange
//	loads[j].profile[k].z     m       −10⁴ … 10⁴, increasing          ErrOutOfRange, ErrNotSorted
//	loads[j].profile[k].value –       −1000 … 1000 (a factor on q)    ErrOutOfRange
//	initialExcess[k].z        m       −10⁴ … 10⁴, increasing          ErrOutOfRange, ErrNotSorted
//	initialExcess[k].value    kPa     −10⁵ … 10⁵                      ErrOutOfRange
//	times[j]                  day     > 0, ≤ 10⁹, increasing          ErrNotPositive, ErrOutOfRange, ErrNotSorted
//	times                     –       nodes × (count + 7) + steps ×   ErrTooLarge
//	                                  (6 + 2 piezometers) ≤ MaxStored
//	piezometers[j]            m       0 … column height               ErrNegative, ErrOutOfRange
//	targetDegree              –       0 < value < 1 (absent: 0.95)    ErrOutOfRange
//	designLife                day     > 0, ≤ 10⁹ (absent: 50 years)   ErrNotPositive, ErrOutOfRange
//	mesh.order                –       1 or 2 (absent: 1)              ErrOutOfRange
//	mesh.maxSize              m       10⁻⁶ … 10⁴ (absent: height/200) ErrNotPositive, ErrOutOfRange, ErrTooLarge
//	mesh.minPerLayer          –       0 … MaxElements (absent: 4)     ErrNegative, ErrTooLarge
//	stepping.theta            –       0.5 … 1 (absent: 0.5)           ErrOutOfRange
//	stepping.dampedSteps      –       −MaxSteps … MaxSteps (absent:   ErrOutOfRange
//	                                  4; negative: none)
//	stepping.firstStep        day     10⁻⁹ … 10⁹ (absent: 1 minute)   ErrNotPositive, ErrOutOfRange, ErrTooLarge
//	stepping.growth           –       1 … 10 (absent: 1.1)            ErrOutOfRange
//	stepping.endTime          day     > 0, ≤ 10⁹ (absent: see         ErrNotPositive, ErrOutOfRange
//	                                  Stepping)
//	monitoring.…readings[j].t day     0 … 10⁹, increasing             ErrNegative, ErrOutOfRange, ErrNotSorted
//	monitoring.plates[i]…value m      −1000 … 1000                    ErrOutOfRange
//	monitoring.piezometers[i].depth m 0 … column height               ErrNegative, ErrOutOfRange
//	monitoring.piezometers[i]…value kPa −10⁶ … 10⁶                    ErrOutOfRange
//	monitoring.asaoka.from    day     0 … 10⁹ (absent: first-mode     ErrNegative, ErrOutOfRange
//	                                  criterion, package monitor)
//	monitoring.asaoka.to      day     0 … 10⁹, after from (absent:    ErrNegative, ErrOutOfRange
//	                                  the last reading)
//	monitoring.asaoka.layers[i] –     0 … len(layers)−1, each once    ErrOutOfRange, ErrConflict
//	                                  (absent: the compressible layers)
//	monitoring.*              see Monitoring and its validation
//
// Inside the bounds every output of Solve is finite: Solve checks it and
// would refuse a non-finite one with ErrNumerical at the field most
// likely at fault. A column at the edges of several bounds at once (a
// sealed end beside layers whose k differ by 10¹⁶) can make the equations
// impossible to factorise in floating point; that too is ErrNumerical,
// naming the layer and depth.
//
// Legal but unusual values give warnings in the Result, never errors: a
// permeability outside 1e-13 … 1 m/s, a fine-grained layer (k < 1e-7 m/s)
// with cv outside 0.01 … 1000 m²/year, a layer thinner than the element
// size, σ'p below the in-situ effective stress, suction or negative
// effective stress in the steady state, and a column that cannot drain.
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
