package main

import (
	"bytes"
	"errors"
	"flag"
	"fmt"
	"os"
	"path/filepath"
	"runtime/pprof"
	"strings"
	"time"
)

func main() {
	out := flag.String("out", "", "directory to write bench.md and bench.csv to (created if missing); empty writes only to stdout")
	browser := flag.String("browser", "", "JSON file of the page's browser benchmark (firstPlotMs, editToPlotMs, heapBeforeBytes, heapAfterBytes, solves)")
	cpuprofile := flag.String("cpuprofile", "", "write CPU profiles of the timed solves of the largest size to FILE-linear.ext and FILE-quadratic.ext")
	root := flag.String("root", "", "repository root (default: the nearest directory above the working directory holding go.mod)")
	quick := flag.Bool("quick", false, "smaller sizes for a smoke run; the figures are not the benchmark")
	nonlinear := flag.Bool("nonlinear", false, "time only section 6 (the non-linear model against the linear one) and log its figures; no table")
	flag.Parse()
	if *nonlinear {
		onlyNonlinear(*quick)
		return
	}
	if err := run(*out, *browser, *cpuprofile, *root, *quick); err != nil {
		fmt.Fprintln(os.Stderr, "benchtab:", err)
		os.Exit(1)
	}
}

func run(out, browserFile, cpuprofile, root string, quick bool) error {
	if root == "" {
		var err error
		if root, err = findRoot(); err != nil {
			return err
		}
	}
	start := time.Now()
	logf := func(format string, args ...any) {
		fmt.Fprintf(os.Stderr, "%6.1fs  "+format+"\n", append([]any{time.Since(start).Seconds()}, args...)...)
	}
	r := &report{m: describeMachine(root)}
	logf("%s, %d cores, %s, load %s", r.m.cpu, r.m.cores, r.m.goVersion, r.m.loadStart)

	// Read the inputs first, so that a bad file fails before the long run.
	if browserFile != "" {
		b, err := readBrowser(browserFile)
		if err != nil {
			return err
		}
		r.browser = b
	}
	sz, err := measureSizes(root)
	if err != nil {
		return err
	}
	r.size = &sz

	sizes, colNodes := []int{100, 1_000, 10_000, 100_000}, 500
	if quick {
		sizes, colNodes = []int{100, 1_000, 10_000}, 101
		r.notes = append(r.notes, "**Quick run** (-quick): smaller sizes; these figures are not the benchmark.")
	}
	var profile func(order int, start bool)
	if cpuprofile != "" {
		// One file per element order: FILE-linear.ext and FILE-quadratic.ext.
		ext := filepath.Ext(cpuprofile)
		base := strings.TrimSuffix(cpuprofile, ext)
		var f *os.File
		profile = func(order int, start bool) {
			if !start {
				pprof.StopCPUProfile()
				if err := f.Close(); err != nil {
					logf("cpu profile: %v", err)
				}
				return
			}
			name := base + "-linear" + ext
			if order == 2 {
				name = base + "-quadratic" + ext
			}
			var err error
			if f, err = os.Create(name); err == nil {
				err = pprof.StartCPUProfile(f)
			}
			if err != nil {
				logf("cpu profile: %v", err)
			}
		}
	}
	sc := measureScaling(sizes, profile, logf)
	r.scale = &sc
	cmp := compare(colNodes, logf)
	r.cmp = &cmp
	nlElements := 2000
	if quick {
		nlElements = 200
	}
	nl := measureNonlinear(nlElements, logf)
	r.nl = &nl
	acc := measureAccuracy()
	r.acc = &acc
	if r.loads, err = measureLoads(root); err != nil {
		return err
	}
	logf("loads: submerged %s, dry %s, whole top %s", dur(float64(r.loads.submerged.best)), dur(float64(r.loads.dry.best)), dur(float64(r.loads.uniform.best)))
	logf("accuracy: defaults U %.2e, iso %.2e", acc.defaults.err.U, acc.defaults.err.Iso)
	r.m.loadEnd = loadAvg()
	r.notes = append(r.notes, notes(r)...)

	var md, csv bytes.Buffer
	if err := r.writeMarkdown(&md); err != nil {
		return err
	}
	if err := r.summary().csv(&csv); err != nil {
		return err
	}
	if _, err := os.Stdout.Write(md.Bytes()); err != nil {
		return err
	}
	if out != "" {
		if err := os.MkdirAll(out, 0o755); err != nil {
			return err
		}
		if err := os.WriteFile(filepath.Join(out, "bench.md"), md.Bytes(), 0o644); err != nil {
			return err
		}
		if err := os.WriteFile(filepath.Join(out, "bench.csv"), csv.Bytes(), 0o644); err != nil {
			return err
		}
	}
	logf("done")
	return nil
}

// onlyNonlinear is the -nonlinear run: section 6 alone, some ten seconds
// where the table takes minutes, for work on the non-linear model.
func onlyNonlinear(quick bool) {
	start := time.Now()
	logf := func(format string, args ...any) {
		fmt.Fprintf(os.Stderr, "%6.1fs  "+format+"\n", append([]any{time.Since(start).Seconds()}, args...)...)
	}
	elements := 2000
	if quick {
		elements = 200
	}
	logf("load %s", loadAvg())
	measureNonlinear(elements, logf)
	logf("load %s", loadAvg())
}

// findRoot returns the nearest directory at or above the working
// directory that holds go.mod.
func findRoot() (string, error) {
	dir, err := os.Getwd()
	if err != nil {
		return "", err
	}
	for {
		if _, err := os.Stat(filepath.Join(dir, "go.mod")); err == nil {
			return dir, nil
		}
		parent := filepath.Dir(dir)
		if parent == dir {
			return "", errors.New("no go.mod above the working directory; pass -root")
		}
		dir = parent
	}
}

// notes explains how the figures were taken.
func notes(r *report) []string {
	var ns []string
	if s := r.scale; s != nil {
		for _, row := range s.rows {
			if row.note != "" {
				ns = append(ns, "† "+row.note+".")
			}
		}
		ns = append(ns, fmt.Sprintf("Section 1 solves 100 m of one layer drained at both ends through `solver.Solve` "+
			"(validation, mesh, steady state, consolidation, results) with %s uniform steps and no output times. "+
			"The floor is %s `Dpttrs` solves (gonum `lapack/gonum`) of a pre-factorised SPD tridiagonal of the same order "+
			"(nodes − 2), per node; the ratio is the whole solve over the floor. Allocations: `testing.AllocsPerRun` of "+
			"4,000 steps minus 1,000 steps on the same 1,000-element mesh, divided by 3,000.", count(scaleSteps), count(scaleSteps)))
	}
	if c := r.cmp; c != nil {
		ns = append(ns, fmt.Sprintf("Sections 2 and 3 solve one %g m clay layer drained at the top and sealed at the base "+
			"(cv = %.4g m²/day, load %g kPa at t = 0). U is compared with Terzaghi's (1943) series at every step with "+
			"0.005 ≤ Tv ≤ 2 and the isochrones at Tv = %s at every node (series: `solver/internal/series`).",
			colH, colCv, colQ, strings.Trim(strings.Join(strings.Fields(fmt.Sprint(isoTv)), ", "), "[]")))
		ns = append(ns, "Every approach lands on the isochrone times and on Tv = 2; its settings are the cheapest that meet the target "+
			"among those searched. Porelight: linear elements, default θ and damped start, first step and growth searched, "+
			"fewest steps kept. (a) FTCS: r = cvΔt/h² = 1/2, shortened only to land; the timed run records U at 200 "+
			"log-spaced times, the check run after every step. (b) the same lumped linear-element matrices and the same "+
			"θ-method (Crank–Nicolson after backward Euler steps), right-hand side formed in O(n), `mat.Cholesky` "+
			"factorised once per distinct (θ, Δt) (the last three kept) and `SolveVecTo` per step; plans searched: uniform "+
			"steps dividing the isochrone times, steps growing every step, and steps held for a run and then multiplied; "+
			"each plan's accuracy found with a tridiagonal solve of the same scheme and confirmed on the dense run, the "+
			"three cheapest by measured factorisation and step costs timed. (c) U at each of Porelight's step times and "+
			"the isochrones at its depths. \"Own mesh\" rows search the mesh too (11 to 101 nodes).")
	}
	if r.nl != nil {
		ns = append(ns, "Section 6 solves a 10 m normally consolidated clay (e0 1.8, Cc 0.6, Cr 0.06) drained at both ends under "+
			"100 kPa, default steps, on both models: the linear one with mv derived from the curve, the non-linear one "+
			"with the e–log state per element and k from the void ratio (Ck 0.9); both times include the whole solve.")
	}
	if r.loads != nil {
		ns = append(ns, "Section 7 solves testdata/embankment.json as it is, with the water table 100 m down (no fill ever "+
			"submerged; the consolidation is linear, so nothing else changes) and with each lift as its pressure γH over the "+
			"whole top (no area), best of interleaved runs of 10 solves. Dry over whole-top is the cost of the stress spread "+
			"(Δσ/q of every stage once per node); as-given over dry is the submerged fill followed at every step.")
	}
	if r.acc != nil {
		ns = append(ns, "Observed orders: between neighbouring rows, and fitted (least squares of log error against log size) "+
			"in the summary. Quadratic elements reach the time-step floor of table 3a at about 40 elements.")
	}
	return ns
}
