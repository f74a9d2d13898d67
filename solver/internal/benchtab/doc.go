// Command benchtab measures Porelight's solver against baselines in one
// run on one machine and prints one Markdown table of every speed, size
// and accuracy goal, with the machine noted:
//
//	go run ./solver/internal/benchtab -out DIR [-browser FILE] [-cpuprofile FILE]
//
// writes DIR/bench.md (the summary table, notes and detail tables) and
// DIR/bench.csv (the summary table). Speed goals live here, never in
// timed tests; every figure is reported beside a baseline measured in the
// same run, and every row states its goal and whether it holds.
//
// # Sections
//
//  1. Cost: one solve of 100 to 100,000 linear and quadratic elements over
//     1,000 uniform steps through solver.Solve, per node and step, beside
//     a floor of 1,000 bare tridiagonal solves (gonum Dpttrs) of the same
//     order; the exponents of time in elements and in steps; allocations
//     per time step.
//  2. Baselines at equal accuracy on a 500-node column: (a) explicit
//     forward-time centred-space differences at the stability limit
//     Δt = h²/(2cv); (b) the same θ-method and matrices as the solver's
//     linear elements with a dense Cholesky solve (gonum mat), factorised
//     once per distinct step; (c) Terzaghi's series itself. Each is run at
//     the cheapest settings found that keep U within 0.001 of Terzaghi's
//     (1943) series over 0.005 ≤ Tv ≤ 2 and the isochrones within 0.5 % of
//     u0, the accuracy is checked, and the whole history is timed.
//  3. Accuracy per cost: the error against the series versus elements and
//     versus time steps, with observed orders, and where the solver's
//     default settings sit.
//  4. Size of the built page (static/build), when it exists.
//  5. The page's own browser measurements, read from -browser.
//  6. The non-linear consolidation model against the linear one on the
//     same soft clay column (2,000 linear elements, default steps): time
//     per node-step, their ratio (goal ≤ 3×) and the iterations per step.
//  7. What loads with geometry add: the embankment example with the stress
//     spread and with its fill submerging, against the same lifts over the
//     whole top (report only).
//  8. The Monte Carlo in the page, read from -browser: 1,000 realisations
//     of the demo (goal ≤ 10 s), one worker per core against one (goal
//     ≥ 1.7×), the page's and workers' memory over repeated runs (flat),
//     and the longest pause of the page's thread meanwhile (report only).
//
// # Timing
//
// Each time is the best of several runs after a warm-up run (the solves
// that take seconds are run twice without one), with a garbage collection
// before each; the detail tables also give the median and the number of
// runs. The machine may be shared: the load average is printed at the
// start and the end, and only ratios between runs of the same program are
// compared with goals.
package main
