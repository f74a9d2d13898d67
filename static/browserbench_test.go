//go:build !(js && wasm)

package static_test

// The page's browser benchmark: figures, never pass/fail on time. It runs
// only when PORELIGHT_BENCH_OUT names the JSON file to write (make bench):
//
//	PORELIGHT_BENCH_OUT=build/browser.json go test -count=1 -run BrowserBench -v ./static
//
// PORELIGHT_BENCH_RUNS sets the number of cold opens (default 7). The
// machine is described in the file, load average included: on a shared
// machine the cold open varies by a factor of two or more.

import (
	"bufio"
	"context"
	"encoding/json"
	"fmt"
	"os"
	"runtime"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"

	cdpbrowser "github.com/chromedp/cdproto/browser"
	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/heapprofiler"
	"github.com/chromedp/chromedp"
)

// browserBench is the file the benchmark writes; solver/internal/benchtab
// reads it (-browser).
type browserBench struct {
	FirstPlotMs                     float64 `json:"firstPlotMs"`                     // navigation start → first isochrone path in the DOM, median of cold opens
	EditToPlotMs                    float64 `json:"editToPlotMs"`                    // input event → summary and isochrones (scrolled into view) updated, median, including the 200 ms pause before a solve
	EditToPlotNoDebounceMs          float64 `json:"editToPlotNoDebounceMs"`          // the same from the end of that pause: solve plus re-render
	EditToPlotNonlinearNoDebounceMs float64 `json:"editToPlotNonlinearNoDebounceMs"` // the same on the non-linear model
	EditToRestMs                    float64 `json:"editToRestMs"`                    // end of that pause → a figure out of view drawn (after the paint)
	EditToRestNonlinearMs           float64 `json:"editToRestNonlinearMs"`           // the same on the non-linear model
	HeapBeforeBytes                 float64 `json:"heapBeforeBytes"`                 // wasm memory before the solves
	HeapAfterBytes                  float64 `json:"heapAfterBytes"`                  // and after
	Solves                          int     `json:"solves"`
	JSHeapBeforeBytes               float64 `json:"jsHeapBeforeBytes"` // performance.memory.usedJSHeapSize after a collection; 0 when unavailable
	JSHeapAfterBytes                float64 `json:"jsHeapAfterBytes"`
	KeystrokeMs                     float64 `json:"keystrokeMs"`    // keystroke's input event → next frame painted, median over the keystrokes typed into a layer's k and the title
	KeystrokeMaxMs                  float64 `json:"keystrokeMaxMs"` // and the slowest of them
	Paste500Ms                      float64 `json:"paste500Ms"`     // 500 readings pasted into a plate's box (one input event, as from the clipboard) → painted, plus "Use" → painted, median
	Insert500Ms                     float64 `json:"insert500Ms"`    // the same text inserted by the DevTools protocol (one input event per line and line break), median
	// The Monte Carlo of the demo in the page (the range section):
	// RangeRuns realisations from the click on Run to the last bands,
	// median over the runs with one worker per core (RangeWorkers), and
	// once with a single worker; the largest gap of a 10 ms timer on the
	// page's thread during those runs; the page's and the workers' wasm
	// memory after each of the repeated runs.
	RangeRuns        int       `json:"rangeRuns,omitempty"`
	RangeWorkers     int       `json:"rangeWorkers,omitempty"`
	RangeMs          float64   `json:"rangeMs,omitempty"`
	RangeOneWorkerMs float64   `json:"rangeOneWorkerMs,omitempty"`
	RangeMaxGapMs    float64   `json:"rangeMaxGapMs,omitempty"`
	RangeMemoryBytes []float64 `json:"rangeMemoryBytes,omitempty"`
	Machine          string    `json:"machine"`
}

// firstPlotProbe runs before the page's own scripts and notes, against
// navigation start, when the page is up and when the first isochrone
// curve (a clipped path) is in the DOM and then painted.
const firstPlotProbe = `(() => {
	const mark = k => { if (!(k in window.__bench)) window.__bench[k] = performance.now(); };
	window.__bench = {};
	document.addEventListener("porelight:ready", () => mark("ready"));
	const curve = "#plot-isochrones path[clip-path^='url(']";
	const obs = new MutationObserver(() => {
		if (document.querySelector(curve)) {
			obs.disconnect();
			mark("plot");
			requestAnimationFrame(() => mark("frame"));
		}
	});
	obs.observe(document, {subtree: true, childList: true, attributes: true, attributeFilter: ["d", "clip-path"]});
})()`

// editProbe notes input events, every timeout the page sets with the
// time it fired (Go wakes from its timers, the pause before a solve among
// them, through these), and each change of the summary's flux with the
// isochrones drawn and the next frame.
const editProbe = `(() => {
	const E = window.__edits = {inputs: [], timers: [], changes: []};
	document.addEventListener("input", () => E.inputs.push(performance.now()), true);
	const setTimeout0 = window.setTimeout;
	window.setTimeout = function (fn, delay, ...args) {
		if (typeof fn === "function") {
			const rec = {set: performance.now(), delay, fired: 0};
			E.timers.push(rec);
			const f = fn;
			fn = function (...a) { rec.fired = performance.now(); return f.apply(this, a); };
		}
		return setTimeout0.call(this, fn, delay, ...args);
	};
	const curve = E.curve = () => [...document.querySelectorAll("#plot-isochrones path[clip-path^='url(']")].map(p => p.getAttribute("d")).join("|");
	let flux = document.getElementById("sum-flux").dataset.value;
	E.rest = [];
	new MutationObserver(ms => {
		if (ms.some(m => m.type === "childList" && m.target.nodeName === "g" && m.target.closest("svg")?.id === "plot-degree")) E.rest.push(performance.now());
		const v = document.getElementById("sum-flux")?.dataset.value;
		if (v === flux) return;
		flux = v;
		const c = {at: performance.now(), frame: 0, curve: curve()};
		E.changes.push(c);
		requestAnimationFrame(() => { c.frame = performance.now(); });
	}).observe(document.querySelector(".pl-results"), {subtree: true, attributes: true, childList: true, characterData: true});
})()`

// debounceMs is the page's pause after an edit before it solves
// (ui.Root.Debounce, default).
const debounceMs = 200

func TestBrowserBench(t *testing.T) {
	out := os.Getenv("PORELIGHT_BENCH_OUT")
	if out == "" {
		t.Skip("set PORELIGHT_BENCH_OUT=file.json to run the browser benchmark")
	}
	pageURL, _ := builtPage(t)
	runs := 7
	if s := os.Getenv("PORELIGHT_BENCH_RUNS"); s != "" {
		n, err := strconv.Atoi(s)
		if err != nil || n < 1 {
			t.Fatalf("PORELIGHT_BENCH_RUNS=%q", s)
		}
		runs = n
	}
	var b browserBench
	var product string

	// 1. Cold open, each in a fresh browser with a fresh profile.
	var plots []float64
	for i := range runs {
		t.Run(fmt.Sprintf("cold open %d", i+1), func(t *testing.T) {
			ctx := browser(t, &recorder{})
			onNewDocument(t, ctx, firstPlotProbe)
			within(t, ctx, 60*time.Second, chromedp.Navigate(pageURL))
			type marks struct {
				Ready float64 `json:"ready"`
				Plot  float64 `json:"plot"`
				Frame float64 `json:"frame"`
			}
			m := poll[marks](t, ctx, `window.__bench.frame && window.__bench`, 60*time.Second)
			t.Logf("navigation start → page up %.0f ms, first isochrone in the DOM %.0f ms, painted %.0f ms", m.Ready, m.Plot, m.Frame)
			plots = append(plots, m.Plot)
		})
	}
	if len(plots) != runs {
		t.Fatal("a cold open failed")
	}
	b.FirstPlotMs = median(plots)
	t.Logf("first plot over %d cold opens: median %.0f ms (min %.0f, max %.0f)", runs, b.FirstPlotMs, slices.Min(plots), slices.Max(plots))

	// 2 and 3 in one more browser, which reports its JS heap precisely.
	ctx := browser(t, &recorder{}, chromedp.Flag("enable-precise-memory-info", true))
	if v, err := chromedp.CallBrowser(ctx, cdpbrowser.GetVersion, cdp.Empty{}); err == nil {
		product = v.Product
	}
	onNewDocument(t, ctx, firstPlotProbe)
	within(t, ctx, 60*time.Second, chromedp.Navigate(pageURL))
	poll[bool](t, ctx, `!!window.__bench.frame && `+upToDate, 60*time.Second)

	t.Run("edit to plot", func(t *testing.T) {
		eval[chromedp.Void](t, ctx, editProbe)
		time.Sleep(500 * time.Millisecond) // let the page settle after its first solve
		with, without, rest := editsToPlot(t, ctx, "linear")
		b.EditToPlotMs, b.EditToPlotNoDebounceMs, b.EditToRestMs = median(with), median(without), median(rest)
	})

	t.Run("edit to plot, non-linear model", func(t *testing.T) {
		// The same edits with the consolidation model switched to the
		// iterated e–log laws (every demo layer has a curve).
		setSelect(t, ctx, "model", "nonlinear")
		poll[bool](t, ctx, upToDate+` && document.getElementById("sum-t50").closest("tr").textContent.includes("non-linear")`, 60*time.Second)
		time.Sleep(500 * time.Millisecond)
		_, without, rest := editsToPlot(t, ctx, "non-linear")
		b.EditToPlotNonlinearNoDebounceMs, b.EditToRestNonlinearMs = median(without), median(rest)
		setSelect(t, ctx, "model", "linear")
		poll[bool](t, ctx, upToDate, 60*time.Second)
	})

	t.Run("typing", func(t *testing.T) {
		b.KeystrokeMs, b.KeystrokeMaxMs = benchTyping(t, ctx)
	})

	t.Run("1000 solves", func(t *testing.T) {
		type heap struct {
			Wasm float64 `json:"wasm"`
			JS   float64 `json:"js"`
		}
		read := func() heap {
			within(t, ctx, 30*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
				_, err := cdp.Call(ctx, tg, heapprofiler.CollectGarbage, cdp.Empty{})
				return err
			}))
			return eval[heap](t, ctx, `({wasm: porelightMemory.buffer.byteLength, js: performance.memory ? performance.memory.usedJSHeapSize : 0})`)
		}
		before := read()
		b.Solves = 1000
		var times []float64
		for done := 0; done < b.Solves; done += 50 {
			ms := eval[[]float64](t, ctx, `(() => {
				const demo = porelight.demo(), times = [];
				for (let i = 0; i < 50; i++) {
					const t0 = performance.now();
					const r = porelight.solve(demo);
					times.push(performance.now() - t0);
					if (r.startsWith('{"error"')) throw new Error(r);
				}
				return times;
			})()`)
			times = append(times, ms...)
		}
		after := read()
		b.HeapBeforeBytes, b.HeapAfterBytes = before.Wasm, after.Wasm
		b.JSHeapBeforeBytes, b.JSHeapAfterBytes = before.JS, after.JS
		t.Logf("porelight.solve(demo) ×%d: median %.1f ms; wasm memory %.2f → %.2f MB; JS heap %.2f → %.2f MB",
			len(times), median(times), before.Wasm/1e6, after.Wasm/1e6, before.JS/1e6, after.JS/1e6)
	})

	t.Run("paste 500 readings", func(t *testing.T) {
		b.Paste500Ms, b.Insert500Ms = benchPaste(t, ctx)
	})
	t.Run("Monte Carlo", func(t *testing.T) { benchRange(t, ctx, &b) })

	b.Machine = machine(product)
	data, err := json.MarshalIndent(b, "", "  ")
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(out, append(data, '\n'), 0o644); err != nil {
		t.Fatal(err)
	}
	t.Logf("wrote %s:\n%s", out, data)
}

// setSelect chooses value in the select element id as a user would.
func setSelect(t *testing.T, ctx context.Context, id, value string) {
	t.Helper()
	eval[chromedp.Void](t, ctx, fmt.Sprintf(`(() => { const s = document.getElementById(%q); s.value = %q; s.dispatchEvent(new Event("change", {bubbles: true})); })()`, id, value))
}

// editsToPlot types a new k into the demo's second layer 23 times (3 to
// warm up), with the results column scrolled to the isochrones (a user
// watching them while editing the layer), and returns, per counted edit,
// input event → summary and isochrones in the DOM, end of the pause
// before a solve → the same (solve and redraw), and end of the pause →
// the degree of consolidation, out of view, drawn by the render after the
// paint (ui/inview.go), ms. editProbe must be installed.
func editsToPlot(t *testing.T, ctx context.Context, model string) (with, without, rest []float64) {
	t.Helper()
	const warm, edits = 3, 20
	eval[chromedp.Void](t, ctx, `document.getElementById("plot-isochrones").scrollIntoView({block: "center"})`)
	if !eval[bool](t, ctx, `porelightInView("plot-isochrones") && !porelightInView("plot-degree")`) {
		t.Fatal("with the isochrones scrolled into view, the isochrones are not in view or the degree of consolidation is")
	}
	var frames []float64
	missed := 0
	for i := range warm + edits {
		k := fmt.Sprintf("%.3ge-9", 1.8*(1+0.1*float64(i+1))) // a new value, and plot, every time
		eval[chromedp.Void](t, ctx, `window.__edits.before = window.__edits.curve()`)
		paste(t, ctx, "layers-1-k", k)
		type edit struct {
			Input   float64 `json:"input"`
			Fired   float64 `json:"fired"`
			At      float64 `json:"at"`
			Frame   float64 `json:"frame"`
			Changed bool    `json:"changed"`
			Rest    float64 `json:"rest"`
		}
		// The results of this edit are the first change of the flux at
		// least debounceMs after its input event, and the pause ended
		// at the first wake of Go from then on (its timer was due).
		e := poll[edit](t, ctx, fmt.Sprintf(`(() => {
			const E = window.__edits, input = E.inputs[E.inputs.length - 1];
			const j = E.changes.findIndex(c => c.at >= input + %[1]d - 2);
			const c = E.changes[j];
			const rest = c && E.rest.find(r => r >= c.at);
			if (!c || !c.frame || !rest) return null;
			const wakes = E.timers.filter(r => r.fired >= input + %[1]d - 2 && r.fired <= c.at).map(r => r.fired);
			return {input, fired: wakes.length ? Math.min(...wakes) : 0, at: c.at, frame: c.frame, rest,
				changed: c.curve !== E.before};
		})()`, debounceMs), 20*time.Second)
		if e.Fired == 0 {
			// On a loaded machine Go may wake late for the input event and
			// set its timer after the pause's nominal end; such an edit
			// cannot be split into pause and solve, and is not counted.
			t.Logf("edit %d: no timeout fired between the end of the pause and the new results (input at %.1f ms, results at %.1f ms; timeouts %s): not counted",
				i+1, e.Input, e.At, eval[string](t, ctx, `JSON.stringify(window.__edits.timers.slice(-8))`))
			if missed++; missed > edits/2 {
				t.Fatalf("%d edits could not be timed", missed)
			}
			time.Sleep(100 * time.Millisecond)
			continue
		}
		if !e.Changed {
			t.Errorf("edit %d: the flux changed but not the isochrones", i+1)
		}
		if i >= warm {
			with = append(with, e.At-e.Input)
			without = append(without, e.At-e.Fired)
			rest = append(rest, e.Rest-e.Fired)
			frames = append(frames, e.Frame-e.Input)
		}
		time.Sleep(100 * time.Millisecond)
	}
	t.Logf("%s model, over %d edits: input → results in the DOM median %.1f ms (min %.1f, max %.1f), → next frame %.1f ms; "+
		"from the end of the %d ms pause %.1f ms (min %.1f, max %.1f; the median less the nominal pause: %.1f ms); the figure out of view %.1f ms",
		model, len(with), median(with), slices.Min(with), slices.Max(with), median(frames),
		debounceMs, median(without), slices.Min(without), slices.Max(without), median(with)-debounceMs, median(rest))
	return with, without, rest
}

func median(xs []float64) float64 {
	s := slices.Sorted(slices.Values(xs))
	n := len(s)
	if n == 0 {
		return 0
	}
	if n%2 == 1 {
		return s[n/2]
	}
	return (s[n/2-1] + s[n/2]) / 2
}

// machine describes where the figures were measured.
func machine(product string) string {
	cpu := "unknown CPU"
	if f, err := os.Open("/proc/cpuinfo"); err == nil {
		sc := bufio.NewScanner(f)
		for sc.Scan() {
			if k, v, ok := strings.Cut(sc.Text(), ":"); ok && strings.TrimSpace(k) == "model name" {
				cpu = strings.TrimSpace(v)
				break
			}
		}
		f.Close()
	}
	if product == "" {
		product = "unknown browser"
	}
	load := "load average unknown"
	if b, err := os.ReadFile("/proc/loadavg"); err == nil {
		if f := strings.Fields(string(b)); len(f) >= 3 {
			load = "load average " + strings.Join(f[:3], " ")
		}
	}
	return fmt.Sprintf("%s, %d cores, %s/%s, %s headless, %s, %s, %s", cpu, runtime.NumCPU(), runtime.GOOS, runtime.GOARCH,
		strings.Replace(product, "/", " ", 1), runtime.Version(), load, time.Now().UTC().Format("2006-01-02 15:04 UTC"))
}

// paintProbe notes, for every input event and click, the time from the
// event (its timeStamp) to the next frame painted after the page's
// render. vugu's renderer writes into the DOM through window.vuguRender
// only; the first call after the event, noted in the capture phase
// before the page's own handler, asks for an animation frame. Its
// callback runs just before the first frame that can show the render
// (the whole render runs in one task), and a message posted from it
// arrives once that frame's style, layout and paint are done. The page
// renders in the event's own task when it was idle, and in a task of its
// own when events come in a burst (wasm/coalesce.go): either way the
// frame is the first one after the render, not one after a timeout of the
// probe's own, which would miss a frame the browser paints between the
// render's task and the timeout.
const paintProbe = `(() => {
	if (window.__paint) return;
	const P = window.__paint = [];
	const ch = new MessageChannel();
	let waiting = [], framing = [];
	ch.port1.onmessage = () => { const now = performance.now(); for (const r of framing) r.painted = now - r.at; framing = []; };
	const note = e => { const r = {kind: e.type, at: e.timeStamp, painted: 0}; P.push(r); waiting.push(r); };
	document.addEventListener("input", note, true);
	document.addEventListener("click", note, true);
	const render = window.vuguRender;
	window.vuguRender = function () {
		if (waiting.length) {
			const rs = waiting;
			waiting = [];
			requestAnimationFrame(() => { framing.push(...rs); ch.port2.postMessage(0); });
		}
		return render.apply(this, arguments);
	};
})()`

// painted waits for the paint after the last of n events noted by
// paintProbe and returns the times of the last n.
func painted(t *testing.T, ctx context.Context, n int) []float64 {
	t.Helper()
	return poll[[]float64](t, ctx, fmt.Sprintf(`(() => {
		const P = window.__paint.slice(-%d);
		return P.length === %[1]d && P.every(r => r.painted > 0) && P.map(r => r.painted);
	})()`, n), 30*time.Second)
}

// benchTyping types into a number field (layer 2's k) and a text field
// (the title) key by key, about eight keys a second, as a person types,
// and returns the median and the largest time from a keystroke's input
// event to the next frame painted.
func benchTyping(t *testing.T, ctx context.Context) (medianMs, maxMs float64) {
	eval[chromedp.Void](t, ctx, paintProbe)
	var all []float64
	for round := range 3 {
		for _, f := range []struct{ id, text string }{
			{"layers-1-k", fmt.Sprintf("2.%de-9", round+1)},
			{"title", fmt.Sprintf(" rev %c", 'A'+round)},
		} {
			within(t, ctx, 10*time.Second, chromedp.Focus(chromedp.ID(f.id)))
			if f.id != "title" {
				eval[chromedp.Void](t, ctx, fmt.Sprintf(`document.getElementById(%q).select()`, f.id))
			}
			for _, r := range f.text {
				within(t, ctx, 10*time.Second, chromedp.KeyEvent(string(r)))
				time.Sleep(125 * time.Millisecond)
			}
			ms := painted(t, ctx, len(f.text))
			if round > 0 { // the first round warms up
				all = append(all, ms...)
			}
		}
		// let the solve of the last value finish before the next round
		poll[bool](t, ctx, upToDate, 30*time.Second)
	}
	t.Logf("%d keystrokes: input event → next frame painted median %.1f ms (min %.1f, max %.1f)",
		len(all), median(all), slices.Min(all), slices.Max(all))
	return median(all), slices.Max(all)
}

// benchPaste pastes 500 readings into the first settlement plate's
// paste box and uses them, four times (the first warms up), and returns
// the medians of (paste → painted) + ("Use" → painted), for a paste as
// the browser makes it from the clipboard (the whole text in one input
// event) and for the same text inserted by the DevTools protocol, which
// the browser delivers as one input event per line and per line break.
func benchPaste(t *testing.T, ctx context.Context) (pasteMs, insertMs float64) {
	eval[chromedp.Void](t, ctx, paintProbe)
	const id = "monitoring-plates-0"
	if !eval[bool](t, ctx, `!!document.getElementById("records-body")`) {
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID("records-toggle")))
	}
	if !eval[bool](t, ctx, `!!document.getElementById("`+id+`-paste")`) {
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID(id+"-toggle")))
	}
	poll[bool](t, ctx, `!!document.getElementById("`+id+`-paste")`, 10*time.Second)
	var pastes, inserts []float64
	for round := range 8 {
		var sb strings.Builder
		for i := range 500 {
			fmt.Fprintf(&sb, "%d\t%.1f\n", 2*i, 300*(1-1/(1+float64(i)/(60+float64(round)))))
		}
		insert := round%2 == 1
		n0 := eval[int](t, ctx, `window.__paint.length`)
		if insert {
			paste(t, ctx, id+"-paste", sb.String())
		} else {
			eval[chromedp.Void](t, ctx, fmt.Sprintf(`(() => {
				const e = document.getElementById(%q);
				e.focus();
				e.value = %q;
				e.dispatchEvent(new InputEvent("input", {bubbles: true, inputType: "insertFromPaste"}));
			})()`, id+"-paste", sb.String()))
		}
		painted(t, ctx, 1)
		// from the first input event to the paint after the last
		p := eval[float64](t, ctx, fmt.Sprintf(`(() => { const P = window.__paint, l = P[P.length-1]; return l.at + l.painted - P[%d].at; })()`, n0))
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID(id+"-paste-use")))
		u := painted(t, ctx, 1)[0]
		if n := eval[string](t, ctx, `document.getElementById("`+id+`-span").textContent`); !strings.HasPrefix(n, "500 readings") {
			t.Fatalf("after Use the plate says %q, not 500 readings", n)
		}
		how := "pasted"
		if insert {
			how = "inserted"
		}
		t.Logf("round %d, %s: → painted %.0f ms, Use → painted %.0f ms", round+1, how, p, u)
		switch {
		case round < 2: // warm-up
		case insert:
			inserts = append(inserts, p+u)
		default:
			pastes = append(pastes, p+u)
		}
		poll[bool](t, ctx, upToDate, 30*time.Second)
	}
	t.Logf("500 readings pasted and used: median %.0f ms (min %.0f, max %.0f); inserted as text and used: median %.0f ms (min %.0f, max %.0f)",
		median(pastes), slices.Min(pastes), slices.Max(pastes), median(inserts), slices.Min(inserts), slices.Max(inserts))
	return median(pastes), median(inserts)
}

// benchRange times RangeRuns realisations of the demo in the page's range
// section: once with one worker, then three times with one per core.
func benchRange(t *testing.T, ctx context.Context, b *browserBench) {
	const runs = 1000
	b.RangeRuns = runs
	eval[chromedp.Void](t, ctx, `document.getElementById("range-on").click()`)
	poll[bool](t, ctx, `!!document.getElementById("uncertainty-runs")`, 10*time.Second)
	paste(t, ctx, "uncertainty-runs", strconv.Itoa(runs))
	poll[bool](t, ctx, `!document.getElementById("range-run").disabled`, 20*time.Second)
	b.RangeWorkers = int(eval[float64](t, ctx, `porelightWorkers.wideSize`))
	// A 10 ms timer on the page's thread: its largest gap says how long
	// the page was unresponsive.
	eval[chromedp.Void](t, ctx, `(() => { const G = window.__gap = {last: performance.now(), max: 0, on: false};
		setInterval(() => { const n = performance.now(); if (G.on) G.max = Math.max(G.max, n - G.last); G.last = n; }, 10); })()`)
	one := func(workers int) float64 {
		eval[chromedp.Void](t, ctx, fmt.Sprintf(`porelightWorkers.wideSize = %d; window.__gap.on = true; window.__gap.last = performance.now()`, workers))
		eval[chromedp.Void](t, ctx, `document.getElementById("range-run").click()`)
		poll[bool](t, ctx, fmt.Sprintf(`(() => { const s = document.getElementById("range-status").dataset; return s.busy === "false" && s.done === "%d"; })()`, runs), 300*time.Second)
		eval[chromedp.Void](t, ctx, `window.__gap.on = false`)
		ms, err := strconv.ParseFloat(eval[string](t, ctx, `document.getElementById("range-status").dataset.ms`), 64)
		if err != nil {
			t.Fatal(err)
		}
		within(t, ctx, 30*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := cdp.Call(ctx, tg, heapprofiler.CollectGarbage, cdp.Empty{})
			return err
		}))
		mem := eval[float64](t, ctx, `porelightMemory.buffer.byteLength + porelightWorkers.stats().memory.reduce((a, b) => a + b, 0)`)
		t.Logf("%d realisations, %d worker(s): %.0f ms; page + workers' wasm memory %.1f MB", runs, workers, ms, mem/1e6)
		if workers == b.RangeWorkers {
			b.RangeMemoryBytes = append(b.RangeMemoryBytes, mem)
		}
		return ms
	}
	b.RangeOneWorkerMs = one(1)
	var many []float64
	for range 3 {
		many = append(many, one(b.RangeWorkers))
	}
	b.RangeMs = median(many)
	b.RangeMaxGapMs = eval[float64](t, ctx, `window.__gap.max`)
	t.Logf("one worker %.0f ms, %d workers median %.0f ms: %.2f×; largest gap of a 10 ms timer %.0f ms",
		b.RangeOneWorkerMs, b.RangeWorkers, b.RangeMs, b.RangeOneWorkerMs/b.RangeMs, b.RangeMaxGapMs)
}
