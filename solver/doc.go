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
//	solver/load     stress with depth under a strip, rectangle, circle or
//	                embankment (Boussinesq-based closed forms, the 2:1 spread)
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
// fixed head at a drained end, a fixed inflow at an undrained one, a
// leakage (h − h_b)/R at an end draining through a resistance, and the
// outlet's head held throughout a layer that drains to an outlet. Pore
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
// returns along the same mv unless the layer gives a swelling mv
// (Layer.MvUnload, used below the largest past effective stress; then
// the loop iterates as for the non-linear model below). The final state has every load applied and
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
// steady state and σ'p (given; OCR·σ'0; σ'0 + POP; a table of σ'p against
// depth; or σ'0, normally consolidated): recompression and
// swelling follow Cr, loading beyond the largest past stress follows Cc.
// Both the series and the final figure follow the effective stress the
// consolidation gives at every step, so a surcharge removed before it has
// consolidated counts only for the compression it caused; the final figure
// is the value at the end of the simulation (a warning says when
// consolidation is not complete by then). Where a layer gives no mv, it is
// the secant of its e–log curve over the final stress change along the
// fully drained path through every load breakpoint. A layer without an
// e–log curve adds its mv settlement to the e–log total
// (Summary.ElogFromMv names it).
//
// Secondary compression (Mesri 1973) is Cα H/(1+ep) log10((t − t0)/(tp −
// t0)) per layer at Project.DesignLife, from the layer's own end of
// primary tp (its own settlement reaching 95 % of its final settlement)
// with time counted from the start t0 of the load stage tp follows; Cα is
// Layer.Calpha or Layer.CalphaCc·Cc (Mesri & Godlewski 1977). After a
// removal of load, Layer.CalphaReduced replaces Cα when given (without it
// a warning says the rate is overestimated). Series.Secondary is the sum
// at every step.
//
// # The non-linear model
//
// With Project.Model = "nonlinear" every element carries its state: the
// effective stress σ', the largest past effective stress and the void
// ratio e, at the element's mean stress. Its compressibility follows the
// e–log σ' curve (Cc beyond the largest past stress, Cr below it, so that
// an unload swells along Cr with its own, faster cv) and its permeability
// follows log10 k = log10 k0 + (e − e0)/Ck (Tavenas et al. 1983; k0 is
// the layer's k, Ck the curve's ck; without ck, k stays constant). A layer
// without a curve keeps its mv (and swelling mv) and its k. Every step
// solves the θ-method with the secant mv of each element over the step,
// Δε/Δσ', and k at the void ratio of the step's θ-point,
//
//	(M(u¹) + θΔt K(u¹)) u¹ = (M(u¹) − (1−θ)Δt K(u¹)) u⁰ + M(u¹) (σ¹ − σ⁰),
//
// (k held within MinK … MaxK, the bounds of layers[i].k), by iteration on
// the residual of that equation (with linear elements the matrix takes
// the tangent mv at the iterate and the change of the flux with k,
// Newton's method but for the secant's own change; quadratic elements
// keep the secant and k of the iterate, Picard's), each update relaxed
// by Aitken's factor (Irons & Tuck 1969), from a first iterate
// extrapolated from the last three steps, until the largest change of
// excess pressure between iterates is at most NonlinearTolerance (1e-6)
// of the project's largest stress change; a step that has not converged
// in NonlinearMaxIterations (30) keeps its last iterate and the result
// warns, naming the step and a smaller stepping.firstStep. With the secant
// the storage term is the change of strain, so the settlement read off the
// elements is the water expelled. The settlement series, Us, t50, t90 and
// the isochrones all come from this one solution; its final settlement is
// the end state moved once to the fully drained final stress (so a
// surcharge removed before the soil drained counts only for what it did),
// and Us is relative to it. Checks: Davis & Raymond (1965) for constant
// Cc and cv, the linear limit, unloading along Cr, observed orders 2 in h
// and Δt. The model is small strain (1 + e0 throughout); large-strain
// consolidation (Gibson et al. 1967) and creep beyond Cα after primary
// are not covered. Vertical drains work with it (see Vertical drains).
//
// # Drains inside the column and leaky ends
//
// A layer with an Outlet drains to it (a sand layer cut by a ditch or
// tapped by relief wells): its pore pressure is held at the outlet's head
// (Outlet.Head, or hydrostatic) at every node of the layer. In the steady
// state those nodes are held like a drained end: MoveHeld moves their
// heads into the neighbours' equations and their rows become the identity
// (fem.Band.Isolate) inside the factorised block. During consolidation the
// excess there stays zero: their rows and columns are isolated in the
// capacity (identity) and conductivity (zero) matrices and their source is
// dropped, on the linear stepper and in the iterated loop alike, so the
// layers on either side drain to it as to a drained end.
//
// An end with a Resistance R (days) drains through it (a leaky end): the
// flow out is (h − h_b)/R, a Robin condition. In the weak form the end's
// boundary term w·q becomes w·(h_b − h)/R, adding 1/R to the end's
// diagonal and h_b/R to its right-hand side in the steady state (R in
// seconds, k in m/s), and 1/(γw R) to the conductivity for the excess,
// whose value beyond the end stays zero (a pressure history needs a free
// end). R → 0 gives the drained end, R → ∞ the sealed one. Drains and
// these two are not combined (Validate refuses it).
//
// # Vertical drains
//
// Project.Drains puts a pattern of vertical drains (triangular or square,
// spacing s) from Drains.Top down to the tip (a depth, the base of a
// layer, or the base of the column). Each drain drains its unit cell
// (Barron 1948), of diameter De = 1.050 s (triangular) or 1.128 s
// (square), equal plan area; a band drain a × b counts as a round drain
// of diameter 2(a+b)/π (Hansbo 1979) or (a+b)/2 (Rixner et al. 1986).
// Under equal strain the cell-averaged excess pore pressure ū obeys
//
//	mv ∂ū/∂t = ∂/∂z((k/γw) ∂ū/∂z) − mv (8 ch / (De² μ(z))) ū + mv ∂σ/∂t
//
// where the drains reach, and the vertical equation alone below the tip.
// μ is the unit cell's factor with a smear zone (ds/dw, kh/ks) and well
// resistance (qw, discharge at the top, the base or both), derived as in
// Hansbo (1981) and kept exact in n = De/dw (package solver/drain): with
// no smear and no well resistance it is Barron's F(n); with well
// resistance it grows along the drain away from its outlet. In weak form
// the sink adds ∫ w mv (8 ch/(De² μ)) u dz to the conductivity matrix
// (lumped by rows for linear elements, like the capacity): the band and
// the cost of a step do not change, and the mesh has nodes at the drains'
// ends. ch is a layer's Ch, or KhKv·cv (kh = KhKv·k); the well term uses
// kh = ch mv γw. Since mv·ch = kh/γw the sink's coefficient is
// 8 kh/(γw De² μ), whatever mv is.
//
// Both soil models take drains. In the iterated loop (the non-linear
// model, or a swelling mv) each layer keeps its kh/kv: KhKv, or the ratio
// a given Ch implies at the layer's mv (as given, or the secant of its
// curve), kh = Ch mv γw. Each element's kh is then kh/kv times its k at
// the iterate's void ratio, and the sink (with μ, whose well term depends
// on kh) is reassembled from it with the conductivity at every iteration:
// ch = kh/(mv γw) thus scales with k(e)/k0, and like cv inversely with the
// element's mv. Under Davis & Raymond's (1965) assumption (Ck = Cc, so
// k ∝ mv) ch stays constant, and pure radial flow gives exactly Hansbo's
// ū = Δσ exp(−8 Th/μ): the degree of dissipation follows Hansbo, while
// the degree of settlement, log(σ'/σ'0)/log(σ'f/σ'0), runs ahead of it;
// with vertical flow as well Carrillo's product holds only in the linear
// limit (checked against an independent finite-difference solution,
// package solver/internal/nlradial).
//
// The drains discharge freely at their outlet and carry its pressure
// change ud(t) (zero unless the outlet end has a pressure history): the
// sink is mv (8 ch/(De² μ)) (ū − ud). Since the conductivity matrix
// annihilates a uniform shift, each step is taken on ū − ud with the
// source σ − ud. The final state is then ud(∞) everywhere, so a history
// is allowed only at the outlet, with the other end undrained or holding
// the same history. Result.Drains gives the cell, μ along the drains, and the
// degrees Uv (vertical flow alone, no drains) and Uh (radial flow to the
// drains alone, no vertical flow), two more solves on the same mesh and
// steps, relative to the same final state as Us; under one instantaneous
// load with fully penetrating drains and one μ they obey Carrillo's
// (1942) 1 − U = (1 − Uv)(1 − Uh) on the linear model (on the non-linear
// one only in its linear limit). Not modelled: drain
// clogging, folding or crimping, installation effects beyond the smear
// zone, and drains that lose contact with the blanket.
//
// DrainSpacing answers Drains.Design: the largest spacing whose Us reaches
// Design.Degree by Design.Time, by bisection in log spacing on the real
// solve (Us against the final state of the whole load history, as the
// summary's), with a table of the degree and the time to it for spacings
// from half to twice the answer (SpacingTable, DegreeAt).
//
// # Load stages
//
// Each stage of Project.Loads adds σⱼ(z, t) = fⱼ(t) qⱼ Iⱼ(z): fⱼ rises from
// 0 to 1 over the ramp, qⱼ is the pressure at the surface (Q, or a fill's
// γ × thickness: Load.Pressure) and Iⱼ(z) = Δσ/q with depth (Load.Factor):
// 1 for a load infinite in plan, the typed Profile, or the influence
// factor of the stage's Area from package solver/load (strip, rectangle,
// circle, embankment; elastic closed forms or the 2:1 spread). Stages
// superpose. The consolidation stays one-dimensional: Iⱼ(z) changes the
// vertical total stress the column feels, but the column has no lateral
// strain, so under a narrow load (an area narrower than the column is
// deep) the settlement is indicative only and a warning says so.
//
// Fill that comes to lie below the water table as the ground settles
// loses weight (submergence): a submerged metre weighs γsat − γw instead
// of γ. The time loop takes the submerged thickness from the settlement
// of the previous step (of the model in use); the final state solves
// s∞ = ∫ mv (σ∞(s∞) − u∞) dz exactly, so the linear final settlement and
// Us are self-consistent (for one layer, fully submerged as it settles,
// s = mv H q/(1 + mv H γw)); on the non-linear model it solves s∞ = the
// iterated laws' settlement under σ∞(s∞) in the same way, so the
// headline, the series' end and Summary.Submerged agree. The water table stays at its initial level;
// only fill below it is counted, not soil above it that settles into it.
// Result.Consolidation.Stages gives every stage's q and I(z);
// Summary.Submerged the final submerged thickness. Every stage's area
// acts at the original ground surface, also a lift placed on earlier
// fill. FillThickness finds the thickness of a fill stage that leaves the
// finished surface at a chosen level on a chosen day, after the
// predicted settlement (the secant method on whole solves).
//
// # Site decisions
//
// Project.Decisions asks the questions the engineer is paid to answer once
// the model is right (files decisions.go, residual.go, surcharge.go,
// strength.go); they
// read the solved series, never a second model.
//
// Residual settlement: with Decisions.Handover set (the day of paving or
// handover, before the design life) Solve gives Result.Residual, the
// settlement still to come between that day and Project.DesignLife: the
// primary settlement left and the secondary compression yet to happen, per
// layer and in total, and the whole settlement at the design life. Both
// come from the model the summary names (Summary.Model): each layer's
// primary settlement is its series (Series.Layers, kept for this, summing
// to Series.Settlement) at the day, or its final settlement past the end
// of the simulation; its secondary is its Mesri (1973) estimate there.
//
// Surcharge design: SurchargeRemoval answers Decisions.Surcharge after
// Aldrich (1965) and Johnson (1970). The surcharge is what the removal
// stage (Removal, or the last stage that takes load off) takes off; the
// lift is the last stage before it that adds load. The permanent load
// alone is the project with the removal acting over the lift's own ramp
// (the surcharge never placed); its final primary settlement (plus, with
// WithSecondary, its secondary at the design life) is the target. Solved
// with the surcharge left on, the removal may come when (a) the settlement
// reaches the target (Average; the degree it needs, for a normally
// consolidated layer log(σ'p/σ'0)/log(σ'ps/σ'0), Degree) and (b) every
// node has reached the change of effective stress the permanent load alone
// gives it at the end (Everywhere, at LagDepth the last to get there):
// Johnson's point that the average hides the least consolidated part,
// which would go on settling. RemoveOn is the later, not before the lift
// is complete; After is the solve run forward with the removal moved
// there (settlement at removal, rebound, final, and the residual to the
// design life). With RemoveBy, the surcharge needed for a removal by that
// day (the lift and the removal grow together, so the permanent load
// stays) by bisection in log surcharge on whole solves. In the linear model
// the rebound follows mvUnload where given and mv otherwise (a warning says
// it is then overestimated).
//
// Strength gain: StrengthGain answers Decisions.Strength. Each element of
// a layer with a law has σ'v = σ'0 + σ − u from the solve and σ'p, the
// largest of its initial σ'p and every σ'v it has reached; its su is
// S σ'v (σ'p/σ'v)^m (SHANSEP: Ladd & Foott 1974; Ladd 1991; S ≈ 0.22,
// m ≈ 0.8 are common practice, hints only), Ratio σ'p, or a measured
// Su0(z) plus Gain·max(0, σ'v − σ'0). It gives su profiles at
// StrengthCheck.Times, and for every stage that adds load the screening
// bearing check Nc·su/FS against the surface pressure once the stage is
// complete (Nc = π + 2, Prandtl's strip; su the thickness-weighted mean of
// the layers with a law; FS the user's), at the planned start and as the
// earliest day, from a solve of the stages that start before it alone.
// This is a screening check: the stability of an embankment needs a
// slope-stability analysis and the rules that apply locally.
//
// Construction control: Series.Piezometers carries the added total stress
// at each piezometer (Added, after submergence), and PoreRatios (file
// poreratio.go) gives its pore pressure ratio Δu/Δσ and the degree of
// dissipation of the stage under way, 1 − Δu/Δu_peak, predicted and, for
// a piezometer record at the same depth, measured.
//
// # Excavations and the water table lowered
//
// A stage with a Dig removes the soil from the top down to Dig.Depth, at
// once or linearly over its ramp. σ'0 and σ'p (and so the OCR) are those
// of the whole column before digging: the overburden removed has preloaded
// what lies below, which then swells along Cr (non-linear model, e–log
// estimate) or its swelling mv (Layer.MvUnload) with the cv that goes with
// it. Below the floor the total stress falls by the overburden removed
// less the water left standing in the excavation (StagePressure); the
// nodes from the top down to the floor are held at the water inside the
// excavation against the steady pore pressure at the floor (pumping:
// Dig.WaterLevel at or below the floor holds the floor at zero pore
// pressure), changing with the stage, and the elements above the floor
// carry no storage and settle nothing. For the consolidation the soil
// above the floor counts as removed from the start, draining at the
// floor (a warning says so when another stage starts before the dig is
// complete). Depths stay measured from the original top, so the floor is
// at Dig.Depth in every result; the settlement series is that of the
// floor (negative: heave).
//
// A stage with a Lower lowers the water table to Lowering.WaterTable: over
// the stage the pore pressure above the new water table falls to zero (the
// nodes there are held at minus their steady pore pressure) and the soil
// in the band between the old and the new water table weighs its moist
// unit weight instead of γsat, so the total stress at and below a depth z
// falls by Σ (γsat − γ) over the band above z. This holds for sand, gravel
// and fill, which drain as the water leaves. A clay held saturated by
// capillarity keeps γsat above the new water table: give it no gamma (the
// default), and only its pore pressure changes; the suction it then
// carries is taken as zero, so the effective stress rise above the water
// table is underestimated there (on the safe side for settlement of the
// layers below, not for the clay's own). A water table lowered below the
// column is a pressure history at the base (bottom.excess).
//
// # Heave and uplift through time
//
// Result.Checks follows three checks (common practice; the factors
// required are set by local codes): ic/i in every layer with upward flow
// (CheckHeave, i from the heads at the layer's ends); at the base of every
// layer at least 100 times less permeable than the layer below, and of a
// fine-grained bottom layer (k < 1e-7 m/s) on a drained or leaky base, the
// whole overburden against the water pressure there (CheckPrism:
// Terzaghi's prism above an aquifer) and the layer's own weight against
// the rise of water pressure across it (CheckUplift). Pore pressure is the
// steady pressure plus the excess, total stress the steady stress plus the
// stages' change, so digging, pumping, drawdown and loads all count. The
// effective stress the stages add at a layer's top (a fill, once the water
// under it drains) holds the layer down as a weighted filter does
// (Terzaghi & Peck 1967): the heave factor is then (γ'd + Δσ'top)/(γw i d)
// and the layer-alone factor counts it with the layer's weight, so the
// water a fill presses up out of a clay does not read as heave. Each
// is evaluated in the initial steady state, at every time step, for every
// stage from its completion until the next stage starts (Check.Stages),
// and in the long-term state; the instant of an undrained jump itself is
// skipped (its pressures at the edges of permeable layers are artefacts of
// the instantaneous change) and the first step after it is checked.
// Summary.Heave, Uplift and Prism name the least factor of each kind over
// all of these, with its layer, depth and time (nil time: long term), and
// Summary.MinHeaveFactor is the least ic/i. Factors are capped at
// FactorCap (100: nothing pushes). A layer an excavation cuts is checked
// from its floor down; one it removes is not checked.
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
//	              "mvUnload": 1e-4,
//	              "ecurve": {"e0": 1.2, "cc": 0.45, "cr": 0.05, "sigmaP": 60, "ck": 0.6},
//	              "calpha": 0.01, "calphaReduced": 0.003}],
//	  "model": "nonlinear",
//	  "waterTable": 0.5,
//	  "top":    {"drained": true, "head": -0.5},
//	  "bottom": {"drained": false},
//	  "loads":  [{"start": 0, "ramp": 30, "q": 60}, {"start": 200, "q": -20},
//	             {"start": 400, "ramp": 20, "fill": {"thickness": 2.5, "gamma": 19, "gammaSat": 20},
//	              "area": {"shape": "embankment", "width": 12, "slope": 2, "x": 3}}],
//	  "times":  [1, 10, 30, 100, 365, 1000],
//	  "piezometers": [2.5, 6.0],
//	  "mesh": {"order": 1, "maxSize": 0.1, "minPerLayer": 4},
//	  "drains": {"pattern": "triangular", "spacing": 1.5, "width": 0.1, "thickness": 0.004,
//	             "equivalent": "perimeter", "smearRatio": 3, "smearK": 3, "qw": 3e-6,
//	             "discharge": "top", "depth": 12},
//	  "designLife": 18262.5,
//	  "decisions": {"handover": 700,
//	                "surcharge": {"removal": 1, "withSecondary": false, "removeBy": 300},
//	                "strength": {"fs": 1.3, "times": [100, 400],
//	                             "laws": [{"layer": 0, "law": "shansep", "s": 0.22, "m": 0.8},
//	                                      {"layer": 1, "law": "ratio", "ratio": 0.22},
//	                                      {"layer": 2, "law": "measured", "su0": [{"z": 3, "value": 12}], "gain": 0.2}]}}
//	}
//
// A layer may also give "ch" (m²/day) or "khKv" for the drains.
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
//	layers[i].calphaCc        –       0 … 1, needs an ecurve; not     ErrNegative, ErrOutOfRange, ErrConflict
//	                                  with calpha
//	layers[i].calphaReduced   –       0 … 1, needs an ecurve          ErrNegative, ErrOutOfRange, ErrConflict
//	layers[i].mvUnload        1/kPa   10⁻⁹ … 1 (absent: mv)           ErrNotPositive, ErrOutOfRange
//	layers[i].ecurve.e0       –       > 0, ≤ 30                       ErrNotPositive, ErrOutOfRange
//	layers[i].ecurve.cc       –       > 0, ≤ 20                       ErrNotPositive, ErrOutOfRange
//	layers[i].ecurve.cr       –       0 ≤ cr ≤ cc                     ErrNegative, ErrOutOfRange
//	layers[i].ecurve.sigmaP   kPa     > 0, ≤ 10⁵; not with ocr        ErrNotPositive, ErrOutOfRange, ErrConflict
//	layers[i].ecurve.ocr      –       1 … 1000; not with sigmaP       ErrOutOfRange, ErrConflict
//	layers[i].ecurve.pop      kPa     0 … 10⁵; one way of σ'p only    ErrNegative, ErrOutOfRange, ErrConflict
//	layers[i].ecurve.sigmaPProfile[k].z  m: −10⁴ … 10⁴, increasing    ErrOutOfRange, ErrNotSorted
//	layers[i].ecurve.sigmaPProfile[k].value kPa: > 0, ≤ 10⁵; one way  ErrNotPositive, ErrOutOfRange,
//	                                  of σ'p only                     ErrConflict
//	layers[i].ecurve.ck       –       0.05 … 50 (absent: k constant)  ErrNotPositive, ErrOutOfRange
//	model                     –       "linear" (absent) or            ErrOutOfRange
//	                                  "nonlinear"
//	top|bottom.head           m       −10⁴ … 10⁴; drained end only    ErrOutOfRange, ErrConflict
//	top|bottom.inflow         m/s     −1 … 1; undrained end, and the  ErrOutOfRange, ErrConflict
//	                                  other end drained
//	top|bottom.excess[j].t    day     0 … 10⁹, not decreasing         ErrNegative, ErrOutOfRange, ErrNotSorted
//	top|bottom.excess[j].value kPa    −10⁵ … 10⁵; drained end only    ErrOutOfRange, ErrConflict
//	                                  (not with a resistance)
//	top|bottom.resistance     day     10⁻⁶ … 10¹²; drained end only;  ErrNotPositive, ErrOutOfRange,
//	                                  not with drains                 ErrConflict
//	layers[i].outlet.head     m       −10⁴ … 10⁴ (absent: −waterTable); ErrOutOfRange, ErrConflict
//	                                  not with drains; touching
//	                                  outlets share one head
//	loads                     –       at most MaxLoads                ErrTooLarge
//	loads[j].start, .ramp     day     0 … 10⁹                         ErrNegative, ErrOutOfRange
//	loads[j].q                kPa     −10⁵ … 10⁵ (negative removes)   ErrOutOfRange
//	loads[j].profile[k].z     m       −10⁴ … 10⁴, increasing          ErrOutOfRange, ErrNotSorted
//	loads[j].profile[k].value –       −1000 … 1000 (a factor on q)    ErrOutOfRange
//	loads[j].fill.thickness   m       −10³ … 10³, ≠ 0 (< 0 removes);  ErrNotPositive, ErrOutOfRange,
//	                                  not with q                      ErrConflict
//	loads[j].fill.gamma       kN/m³   > 0, ≤ 50                       ErrNotPositive, ErrOutOfRange
//	loads[j].fill.gammaSat    kN/m³   gammaW … 50 (absent: gamma)     ErrNotPositive, ErrOutOfRange
//	loads[j].area.shape       –       "strip", "rectangle", "circle", ErrRequired, ErrOutOfRange,
//	                                  "embankment" (needs a fill);    ErrConflict
//	                                  not with a profile
//	loads[j].area.method      –       "", "elastic" or "2:1"          ErrOutOfRange
//	loads[j].area.width       m       10⁻³ … 10⁵ (strip, rectangle);  ErrNotPositive, ErrNegative,
//	                                  0 … 10⁵ (embankment crest)      ErrOutOfRange, ErrConflict
//	loads[j].area.length      m       10⁻³ … 10⁵, rectangle only      ErrNotPositive, ErrOutOfRange, ErrConflict
//	loads[j].area.radius      m       10⁻³ … 10⁵, circle only         ErrNotPositive, ErrOutOfRange, ErrConflict
//	loads[j].area.slope       –       10⁻³ … 100 (horizontal per      ErrNotPositive, ErrOutOfRange, ErrConflict
//	                                  vertical), embankment only
//	loads[j].area.x, .y       m       −10⁵ … 10⁵; y for a rectangle   ErrOutOfRange, ErrConflict
//	                                  only; a circle takes x = y = 0
//	loads[j].dig.depth        m       > 0, above the base; one dig or ErrNotPositive, ErrOutOfRange,
//	                                  lowering per project; not with  ErrConflict
//	                                  q, fill, area, profile, drains,
//	                                  top.excess
//	loads[j].dig.waterLevel   m       −10⁴ … 10⁴ (absent: waterTable) ErrOutOfRange
//	loads[j].lower.waterTable m       below waterTable and the top,   ErrOutOfRange, ErrConflict
//	                                  above the base; as dig.depth
//	initialExcess[k].z        m       −10⁴ … 10⁴, increasing          ErrOutOfRange, ErrNotSorted
//	initialExcess[k].value    kPa     −10⁵ … 10⁵                      ErrOutOfRange
//	times[j]                  day     > 0, ≤ 10⁹, increasing          ErrNotPositive, ErrOutOfRange, ErrNotSorted
//	times                     –       nodes × (count + 7) + steps ×   ErrTooLarge
//	                                  (7 + 3 piezometers, + layers
//	                                  with a handover) ≤ MaxStored
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
//	layers[i].ch              m²/day  10⁻⁹ … 10⁷ (absent: khKv·cv)    ErrNotPositive, ErrOutOfRange
//	layers[i].khKv            –       0.01 … 1000 (absent: 1); not    ErrNotPositive, ErrOutOfRange,
//	                                  with ch                         ErrConflict
//	drains.pattern            –       "triangular" or "square"        ErrRequired, ErrOutOfRange
//	drains.spacing            m       0.01 … 100, cell wider than the ErrNotPositive, ErrOutOfRange
//	                                  drain
//	drains.diameter           m       10⁻⁴ … 10; or width, thickness  ErrNotPositive, ErrRequired, ErrConflict
//	drains.width, .thickness  m       10⁻⁴ … 10, thickness ≤ width    ErrNotPositive, ErrOutOfRange
//	drains.equivalent         –       "perimeter" or "mean" (band)    ErrOutOfRange, ErrConflict
//	drains.smearRatio         –       1 … 100, smear zone inside the  ErrOutOfRange
//	                                  cell (absent: 1)
//	drains.smearK             –       1 … 1000 (absent: 1)            ErrOutOfRange
//	drains.qw                 m³/s    10⁻¹² … 1 (absent: none)        ErrNotPositive, ErrOutOfRange
//	drains.discharge          –       "top", "base", "both"; base     ErrOutOfRange, ErrConflict
//	                                  needs drains to the base
//	drains.top                m       ≥ 0, above the tip              ErrNegative, ErrOutOfRange
//	drains.depth              m       0 … column height               ErrNotPositive, ErrOutOfRange
//	drains.toLayer            –       a layer index; not with depth   ErrOutOfRange, ErrConflict
//	drains.design.degree      –       0 < value < 1 (absent: 0.9)     ErrOutOfRange
//	drains.design.time        day     > 0 … MaxTime                   ErrNotPositive, ErrOutOfRange
//	decisions.handover        day     > 0, < designLife (absent: not  ErrNotPositive, ErrOutOfRange,
//	                                  asked)                          ErrConflict
//	decisions.surcharge       –       some stage removes load         ErrRequired
//	decisions.surcharge.removal –     a stage index whose q (fill     ErrOutOfRange, ErrConflict
//	                                  thickness) is negative, after a
//	                                  lift of the same kind that placed
//	                                  at least as much
//	decisions.surcharge.removeBy day  > 0 … MaxTime, after the lift   ErrNotPositive, ErrOutOfRange,
//	                                  (SurchargeRemoval)              ErrConflict
//	decisions.strength.fs     –       1 … 10, required                ErrRequired, ErrOutOfRange
//	decisions.strength.laws   –       at least one                    ErrRequired
//	  [i].layer               –       a layer index, once each        ErrOutOfRange, ErrConflict
//	  [i].law                 –       "shansep", "ratio", "measured"  ErrOutOfRange
//	  [i].s, [i].ratio        –       > 0 … 5                         ErrNotPositive, ErrOutOfRange
//	  [i].m                   –       0 … 2                           ErrOutOfRange
//	  [i].su0                 kPa     measured: ≥ 1 point, z sorted,  ErrRequired, ErrNotSorted,
//	                                  value > 0 … 10⁴                 ErrNotPositive
//	  [i].gain                –       0 … 5                           ErrNegative, ErrOutOfRange
//	decisions.strength.times  day     0 … MaxTime, increasing, ≤ 50   ErrNotSorted, ErrTooLarge
//	uncertainty.runs          –       2 … 20000 (absent: 500)         ErrOutOfRange
//	uncertainty.seed          –       0 … 2⁵³−1                       ErrOutOfRange
//	uncertainty.date          day     0 … MaxTime (absent: the end of ErrNegative, ErrOutOfRange
//	                                  the last load change)
//	uncertainty.layers        –       at most one per layer           ErrOutOfRange
//	uncertainty.layers[i].k, .mv, .ch –  COV 0 … 3 (absent: fixed)    ErrNegative, ErrOutOfRange
//	uncertainty.layers[i].kMv –       −1 … 1 (absent: 0)              ErrOutOfRange
//	variants                  –       at most 12                      ErrTooLarge
//	variants[i].name          –       required, unique                ErrRequired, ErrConflict
//	variants[i].drainSpacing  m       as drains.spacing; needs drains ErrConflict, as drains.spacing
//	variants[i].loads, .layers –      at most one per stage, layer    ErrOutOfRange
//	variants[i].loads[j].*    –       as loads[j]; fillThickness only ErrConflict, as loads[j]
//	                                  on a fill stage
//	variants[i].layers[j].*   –       as layers[j].thickness, .k,     as layers[j]
//	                                  .mv, .ch
//	variants[i]               –       any other problem of the        as that field
//	                                  project with the option applied
//	variants[i].name          –       not "As given" (the project)    ErrConflict
//	alignment.sections        –       at most 50                      ErrTooLarge
//	alignment.sections[i].chainage m  −10⁷ … 10⁷, increasing          ErrOutOfRange, ErrNotSorted
//	alignment.sections[i].option –    a variant's name, or empty      ErrOutOfRange
//	alignment.date            day     0 … MaxTime (absent: design life) ErrNegative, ErrOutOfRange
//	alignment.limit           –       0 … 1 (absent: not checked)     ErrNegative, ErrOutOfRange
//	top|bottom.excess         –       with drains: at the outlet only ErrConflict
//	                                  (or the same at both ends)
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
// size, a loaded area narrower than the column is deep, σ'p below the
// in-situ effective stress, an OCR that leaves less than 5 kPa of σ'p near
// the surface, a layer without an e–log curve in the non-linear model, a
// load removal without a reduced Cα, a non-linear step that did not
// converge, suction or negative effective stress in the steady state, a
// column that cannot drain, a head at the top that differs from the water
// table's (and a sealed top under a base head), a water table below the
// column, and a load stage that starts before an excavation is complete.
//
// # Scope
//
// The column is saturated, one-dimensional and small strain; flow follows
// Darcy's law (toward drains: the unit cell under equal strain); in the
// linear model k and mv are constant in each layer and in time (with an
// optional swelling mv), in the non-linear model they follow each
// element's state on the e–log σ' curve. The stress under a finite load
// spreads as in a homogeneous elastic half-space (or by the 2:1 rule),
// whatever the layering. Results are not valid for unsaturated soil,
// large strains, creep-dominated soils (creep beyond secondary
// compression with Cα after primary), two- or three-dimensional flow or
// deformation, or loads that fail the ground. They are estimates for
// qualified engineers; local codes and
// licensed engineering practice govern any design.
package solver
