package main

import (
	"fmt"
	"io"
	"math"
	"strings"
)

// report is everything one run measured.
type report struct {
	m       machine
	scale   *scaling
	cmp     *comparison
	acc     *accuracy
	size    *sizes
	browser *browserFigures
	loads   *loadCost
	nl      *nonlinearCost
	notes   []string
}

// mainHeader is the header of the summary table (and of bench.csv).
var mainHeader = []string{"Section", "Measure", "Porelight", "Baseline", "Ratio", "Goal", "Holds"}

// summary builds the one table of every goal.
func (r *report) summary() *table {
	t := &table{header: mainHeader}
	if s := r.scale; s != nil {
		for _, row := range s.rows {
			name := "linear"
			if row.order == 2 {
				name = "quadratic"
			}
			measure := fmt.Sprintf("%s el. %s × %s steps: time per node-step", name, count(int64(row.elements)), count(int64(row.steps)))
			if row.note != "" {
				measure += " †"
			}
			goal, ok := "≤ 3× floor at 100,000 el.", "— (goal at 100,000 el.)"
			if row.elements >= 99_999 {
				ok = holds(row.ratio() <= 3)
			}
			t.add("1 cost", measure,
				fmt.Sprintf("%s (%s/solve)", dur(row.nsPerNodeStep()), dur(float64(row.solve.best))),
				fmt.Sprintf("Dpttrs floor %s", dur(row.floorNs())),
				fmt.Sprintf("%.2f× floor", row.ratio()), goal, ok)
		}
		t.add("1 cost", "time ∝ elementsᵖ, linear el., 1,000 → 100,000", fmt.Sprintf("p = %s", fix(s.expLinear, 3)), "", "", "p ≤ 1.1 (linear)", holds(s.expLinear <= 1.1))
		t.add("1 cost", "time ∝ elementsᵖ, quadratic el., 1,000 → 100,000", fmt.Sprintf("p = %s", fix(s.expQuad, 3)), "", "", "p ≤ 1.1 (linear)", holds(s.expQuad <= 1.1))
		t.add("1 cost", "time ∝ stepsᵖ, 1,000 linear el., 1,000 → 4,000 steps", fmt.Sprintf("p = %s", fix(s.expSteps, 3)), "", "", "p ≤ 1.1 (linear)", holds(s.expSteps <= 1.1))
		d := s.drains
		t.add("1 cost", fmt.Sprintf("drains (unit-cell sink, smear, well resistance), %s linear el. × %s steps: time per node-step", count(int64(drainElements)), count(int64(d.steps))),
			fmt.Sprintf("%s (%s/solve)", dur(per(d.with.best, d.nodes*d.steps)), dur(float64(d.with.best))),
			fmt.Sprintf("no drains %s", dur(per(d.without.best, d.nodes*d.steps))),
			fmt.Sprintf("%.3f×", d.ratio()), "≤ 1.10× without drains", holds(d.ratio() <= 1.10))
		t.add("1 cost", "drains as the page solves them (plus the solves with vertical and with radial flow alone for Uv, Uh)",
			dur(float64(d.onPage.best)), fmt.Sprintf("no drains %s", dur(float64(d.without.best))),
			fmt.Sprintf("%.2f×", float64(d.onPage.best)/float64(d.without.best)), "report only (three solves)", "—")
		t.add("1 cost", "allocations per time step (1,000 el., 4,000 − 1,000 steps)",
			fmt.Sprintf("%.4f allocs, %.1f B", s.allocsPerStep, s.bytesPerStep), "", "", "none in the time-step loop", holds(s.allocsPerStep == 0))
	}
	if c := r.cmp; c != nil {
		p := c.porelight
		for i, o := range []approach{c.ftcs, c.dense} {
			label := "(a) explicit FTCS, Δt = h²/(2cv)"
			if i == 1 {
				label = "(b) θ-method, dense Cholesky"
			}
			if o.name == "" {
				t.add("2 vs baselines", label, dur(float64(p.time.best)), "no searched setting met the target", "", "Porelight ≥ 50× faster", "—")
				continue
			}
			ratio := float64(p.time.best) / float64(o.time.best)
			t.add("2 vs baselines", fmt.Sprintf("%s, %d-node column, whole 0.005 ≤ Tv ≤ 2 history at equal accuracy", label, c.colNodes),
				fmt.Sprintf("%s (%d steps)", dur(float64(p.time.best)), p.steps),
				fmt.Sprintf("%s (%s steps)", dur(float64(o.time.best)), count(int64(o.steps))),
				fmt.Sprintf("%.2g (%.0f× faster)", ratio, 1/ratio), "Porelight ≥ 50× faster", holds(1/ratio >= 50))
		}
		ratio := float64(p.time.best) / float64(c.ser.time.best)
		t.add("2 vs baselines", fmt.Sprintf("(c) Terzaghi's series, same outputs (%d U values, %d isochrones × %d depths)", c.ser.steps, len(isoTv), c.colNodes),
			dur(float64(p.time.best)), dur(float64(c.ser.time.best)), fmt.Sprintf("%.2g", ratio), "report only (exact, one uniform layer only)", "—")
		all := p.acc.ok() && c.ftcs.acc.ok() && c.dense.acc.ok()
		t.add("2 vs baselines", "accuracy of the timed runs: max |U − U_series|, max |u − u_series|/u0",
			fmt.Sprintf("%s, %s", sci(p.acc.U), sci(p.acc.Iso)),
			fmt.Sprintf("(a) %s, %s; (b) %s, %s", sci(c.ftcs.acc.U), sci(c.ftcs.acc.Iso), sci(c.dense.acc.U), sci(c.dense.acc.Iso)),
			"", "U ≤ 0.001, u ≤ 0.005 u0 (Terzaghi 1943 series)", holds(all))
		for _, o := range []approach{c.freeF, c.freeD} {
			if o.name == "" {
				continue
			}
			ratio := float64(c.freeP.time.best) / float64(o.time.best)
			t.add("2 vs baselines", fmt.Sprintf("%s, each on its own cheapest mesh: Porelight %d nodes, baseline %d nodes", o.name, c.freeP.nodes, o.nodes),
				fmt.Sprintf("%s (%d steps)", dur(float64(c.freeP.time.best)), c.freeP.steps),
				fmt.Sprintf("%s (%s steps)", dur(float64(o.time.best)), count(int64(o.steps))),
				fmt.Sprintf("%.2g (%.1f× faster)", ratio, 1/ratio), "report only (the 50× goal is on the fixed column)", "—")
		}
	}
	if a := r.acc; a != nil {
		d := a.defaults
		t.add("3 accuracy", fmt.Sprintf("default settings (%d linear el., %d steps): max |U − U_series|, max |u − u_series|/u0", d.elements, d.steps),
			fmt.Sprintf("%s, %s", sci(d.err.U), sci(d.err.Iso)), "", "", "U ≤ 0.001, u ≤ 0.005 u0 (Terzaghi 1943 series)", holds(d.err.ok()))
		t.add("3 accuracy", "observed order of U in h, linear el.", fix(a.spaceLinear, 2), "", "", "2 ± 0.3 (Strang & Fix 1973)", holds(math.Abs(a.spaceLinear-2) <= 0.3))
		t.add("3 accuracy", "observed order of U in h, quadratic el.", fix(a.spaceQuad, 2), "", "", "≥ 3 (Strang & Fix 1973)", holds(a.spaceQuad >= 2.7))
		t.add("3 accuracy", "observed order of U in the number of steps (Crank–Nicolson)", fix(a.timeOrder, 2), "", "", "2 ± 0.3 (Crank & Nicolson 1947)", holds(math.Abs(a.timeOrder-2) <= 0.3))
	}
	if s := r.size; s != nil {
		if s.built.IsZero() {
			t.add("4 size", "static/build/porelight.wasm and .html", "not built", "", "", "page ≤ 2.5 MB", "—")
		} else {
			t.add("4 size", "wasm, raw", count(s.wasm)+" B", "", "", "report only", "—")
			t.add("4 size", "wasm, gzip -9", count(s.wasmGzip)+" B", "", fmt.Sprintf("%.2f of raw", float64(s.wasmGzip)/float64(s.wasm)), "report only", "—")
			t.add("4 size", fmt.Sprintf("page (porelight.html, final, built %s)", s.built.UTC().Format("2006-01-02 15:04 UTC")), count(s.page)+" B", "", fmt.Sprintf("%.2f of goal", float64(s.page)/pageLimit), "≤ 2.5 MB (2,500,000 B)", holds(s.page <= pageLimit))
		}
	}
	if r.nl != nil {
		r.nl.rows(t)
	}
	if b := r.browser; b == nil {
		t.add("5 browser", "first plot, edit to plot, heap over 1,000 solves", "not measured", "", "", "≤ 1.5 s; ≤ 50 ms; growth < 5 MB", "—")
	} else {
		where := ""
		if b.Machine != "" {
			where = " (" + b.Machine + ")"
		}
		t.add("5 browser", "first plot after opening the page"+where, fmt.Sprintf("%.0f ms", *b.FirstPlotMs), "", "", "≤ 1.5 s", holds(*b.FirstPlotMs <= firstPlotGoalMs))
		if b.EditToPlotNoDebounceMs == nil {
			t.add("5 browser", "edit to plot, from the input event", fmt.Sprintf("%.1f ms", *b.EditToPlotMs), "", "", "≤ 50 ms", holds(*b.EditToPlotMs <= editToPlotGoalMs))
		} else {
			// The page waits 200 ms after a keystroke so that a solve does
			// not start in the middle of typing a number; the goal is on
			// the solve and redraw that follow.
			t.add("5 browser", "edit to plot, from the input event (includes the page's 200 ms pause for typing)", fmt.Sprintf("%.1f ms", *b.EditToPlotMs), "", "", "report only", "—")
		}
		if v := b.EditToPlotNoDebounceMs; v != nil {
			t.add("5 browser", "edit to plot, from the end of the page's pause before a solve (solve and redraw of the summary and the plot in view)", fmt.Sprintf("%.1f ms", *v), "", "", "≤ 50 ms", holds(*v <= editToPlotGoalMs))
		}
		if v := b.EditToPlotNonlinearNoDebounceMs; v != nil {
			t.add("5 browser", "the same on the non-linear model (solve and redraw)", fmt.Sprintf("%.1f ms", *v), "", "", "≤ 50 ms", holds(*v <= editToPlotGoalMs))
		}
		// The figures out of view are drawn by one more render once the
		// first has been painted (ui/inview.go).
		if v := b.EditToRestMs; v != nil {
			t.add("5 browser", "the same to a figure out of view drawn (the render after the paint)", fmt.Sprintf("%.1f ms", *v), "", "", "report only", "—")
		}
		if v := b.EditToRestNonlinearMs; v != nil {
			t.add("5 browser", "the same on the non-linear model", fmt.Sprintf("%.1f ms", *v), "", "", "report only", "—")
		}
		if v := b.KeystrokeMs; v != nil {
			worst := ""
			if m := b.KeystrokeMaxMs; m != nil {
				worst = fmt.Sprintf("slowest %.1f ms", *m)
			}
			t.add("5 browser", "keystroke in a field, demo loaded: input event to the next frame painted (median)", fmt.Sprintf("%.1f ms", *v), worst,
				fmt.Sprintf("%.2f of goal", *v/keystrokeGoalMs), "≤ 30 ms", holds(*v <= keystrokeGoalMs))
		}
		if v := b.Paste500Ms; v != nil {
			t.add("5 browser", "paste 500 readings into a plate and use them, to the frames painted", fmt.Sprintf("%.0f ms", *v), "",
				fmt.Sprintf("%.2f of goal", *v/pasteGoalMs), "≤ 1 s", holds(*v <= pasteGoalMs))
		}
		if v := b.Insert500Ms; v != nil {
			t.add("5 browser", "the same 500 lines inserted as text (one input event per line and line break)", fmt.Sprintf("%.0f ms", *v), "", "", "report only", "—")
		}
		heapRow := func(what string, before, after float64) {
			ok := holds(after-before < heapGrowthGoal)
			if *b.Solves < heapSolves {
				ok = fmt.Sprintf("— (%d solves < 1,000)", *b.Solves)
			}
			t.add("5 browser", fmt.Sprintf("%s growth over %s solves", what, count(*b.Solves)),
				fmt.Sprintf("%s B", count(int64(after-before))), fmt.Sprintf("%s B before", count(int64(before))), "",
				"< 5 MB over 1,000 solves", ok)
		}
		heapRow("wasm memory", *b.HeapBeforeBytes, *b.HeapAfterBytes)
		if b.JSHeapBeforeBytes != nil && b.JSHeapAfterBytes != nil && *b.JSHeapBeforeBytes > 0 {
			heapRow("JavaScript heap", *b.JSHeapBeforeBytes, *b.JSHeapAfterBytes)
		}
		if b.RangeRuns > 0 && b.RangeMs > 0 {
			t.add("8 range", fmt.Sprintf("%s realisations of the demo in the page, %d workers (one per core), click to last bands", count(int64(b.RangeRuns)), b.RangeWorkers),
				fmt.Sprintf("%.1f s", b.RangeMs/1000), "", "", "≤ 10 s", holds(b.RangeMs <= rangeGoalMs))
			t.add("8 range", fmt.Sprintf("the same, %d workers against one", b.RangeWorkers),
				fmt.Sprintf("%.1f s", b.RangeMs/1000), fmt.Sprintf("one worker %.1f s", b.RangeOneWorkerMs/1000),
				fmt.Sprintf("%.2f×", b.RangeOneWorkerMs/b.RangeMs), "≥ 1.7×", holds(b.RangeOneWorkerMs/b.RangeMs >= rangeSpeedupGoal))
			if m := b.RangeMemoryBytes; len(m) > 1 {
				t.add("8 range", fmt.Sprintf("page and workers' wasm memory over %d repeated runs", len(m)),
					fmt.Sprintf("%s B growth", count(int64(m[len(m)-1]-m[0]))), fmt.Sprintf("%s B after the first", count(int64(m[0]))), "",
					"flat (growth < 5 MB)", holds(m[len(m)-1]-m[0] < heapGrowthGoal))
			}
			t.add("8 range", "largest gap of a 10 ms timer on the page's thread during the runs", fmt.Sprintf("%.0f ms", b.RangeMaxGapMs), "", "", "report only", "—")
		}
	}
	if l := r.loads; l != nil {
		t.add("7 loads", "embankment example, no fill submerged: solve with the stress spread",
			dur(float64(l.dry.best)), "same loads over the whole top "+dur(float64(l.uniform.best)),
			fmt.Sprintf("%.2f×", l.spread()), "report only", "—")
		t.add("7 loads", "embankment example as given: fill submerging as it settles",
			dur(float64(l.submerged.best)), "no fill submerged "+dur(float64(l.dry.best)),
			fmt.Sprintf("%.2f×", l.submergence()), "report only", "—")
	}
	return t
}

// details builds the tables behind the summary.
func (r *report) details() []*table {
	var ts []*table
	if s := r.scale; s != nil {
		t := &table{title: "1. Solver cost (uniform steps, one factorisation, both ends drained)",
			header: []string{"order", "elements", "nodes", "steps", "factorisations", "best / solve", "median", "runs", "ns / node-step", "Dpttrs floor ns / node", "ratio", "Dpbtrs (kd 2) floor ns / node", "ratio to band floor"}}
		for _, row := range s.rows {
			band, bandRatio := "", ""
			if row.order == 2 {
				band = fix(per(row.band.best, row.nodes*scaleSteps), 2)
				bandRatio = fix(float64(row.solve.best)/float64(row.band.best), 2)
			}
			t.add(fmt.Sprint(row.order), count(int64(row.elements)), count(int64(row.nodes)), count(int64(row.steps)), fmt.Sprint(row.facts),
				dur(float64(row.solve.best)), dur(float64(row.solve.median)), row.solve.runsText(),
				fix(row.nsPerNodeStep(), 2), fix(row.floorNs(), 2), fix(row.ratio(), 2), band, bandRatio)
		}
		ts = append(ts, t)
	}
	if c := r.cmp; c != nil {
		t := &table{title: fmt.Sprintf("2. Cheapest settings meeting the target (searched %s settings)", count(int64(c.searched))),
			header: []string{"approach", "column", "settings found", "max U error", "max isochrone error", "meets target", "best time", "median", "timed runs (× items each)"}}
		row := func(col string, a approach) {
			if a.name == "" {
				return
			}
			t.add(a.name, col, a.settings, sci(a.acc.U), sci(a.acc.Iso), holds(a.acc.ok()),
				dur(float64(a.time.best)), dur(float64(a.time.median)), a.time.runsText())
		}
		fixed := fmt.Sprintf("%d nodes", c.colNodes)
		row(fixed, c.porelight)
		row(fixed, c.ftcs)
		row(fixed, c.dense)
		row(fixed, c.ser)
		row("own mesh", c.freeP)
		row("own mesh", c.freeF)
		row("own mesh", c.freeD)
		ts = append(ts, t)
	}
	if a := r.acc; a != nil {
		t := &table{title: fmt.Sprintf("3a. Error against Terzaghi's (1943) series vs elements (first step Tv 1e-8, growth %g)", fineGrowth),
			header: []string{"order", "elements", "steps", "max abs(U − U_series)", "order", "max isochrone error / u0", "order", ""}}
		for _, row := range a.byElements {
			mark := ""
			if row.isDefault {
				mark = "← default mesh"
			}
			t.add(fmt.Sprint(row.order), count(int64(row.elements)), count(int64(row.steps)), sci(row.err.U), fix(row.orderU, 2), sci(row.err.Iso), fix(row.orderIso, 2), mark)
		}
		ts = append(ts, t)
		t = &table{title: fmt.Sprintf("3b. Error vs time steps (%s linear elements, first step 1 minute)", count(fineElements)),
			header: []string{"growth", "steps", "max abs(U − U_series)", "order", "max isochrone error / u0", "order", ""}}
		for _, row := range a.bySteps {
			mark := ""
			if row.isDefault {
				mark = "← default growth"
			}
			t.add(fmt.Sprint(row.growth), count(int64(row.steps)), sci(row.err.U), fix(row.orderU, 2), sci(row.err.Iso), fix(row.orderIso, 2), mark)
		}
		d := a.defaults
		t.add("default (all settings)", count(int64(d.steps)), sci(d.err.U), "", sci(d.err.Iso), "", fmt.Sprintf("← %d linear el., growth 1.1, 100 years", d.elements))
		ts = append(ts, t)
	}
	return ts
}

// writeMarkdown writes the whole report: the machine, the summary table,
// the notes and the detail tables.
func (r *report) writeMarkdown(w io.Writer) error {
	var b strings.Builder
	m := r.m
	fmt.Fprintf(&b, "## Porelight benchmark table\n\n")
	fmt.Fprintf(&b, "Measured in one run of `go run ./solver/internal/benchtab` on %s, %d cores, %s %s, %s", m.cpu, m.cores, m.goVersion, m.osArch, m.date)
	if m.commit != "" {
		fmt.Fprintf(&b, ", solver at %s", m.commit)
	}
	fmt.Fprintf(&b, ". Load average (1, 5, 15 min) %s at the start, %s at the end: ", m.loadStart, m.loadEnd)
	fmt.Fprintf(&b, "the machine may be shared, so every time is the best of several runs (medians in the detail tables) and ratios are taken between runs of the same program.\n\n")
	if _, err := io.WriteString(w, b.String()); err != nil {
		return err
	}
	if err := r.summary().markdown(w); err != nil {
		return err
	}
	if len(r.notes) > 0 {
		var nb strings.Builder
		for _, n := range r.notes {
			nb.WriteString("- " + n + "\n")
		}
		nb.WriteString("\n")
		if _, err := io.WriteString(w, nb.String()); err != nil {
			return err
		}
	}
	for _, t := range r.details() {
		if err := t.markdown(w); err != nil {
			return err
		}
	}
	return nil
}
