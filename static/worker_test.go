//go:build !(js && wasm)

package static_test

// Browser tests of the solve workers: the page solves in Web Workers that
// run the same program, and survives a worker that runs out of memory,
// panics or never ends. The faults come from the pool's test hook
// (porelightWorkers.fault, see static/shell/boot.js): the worker then
// really runs out of its 1 GiB, panics or spins, and the page sees only
// what it would see of a real failure.

import (
	"context"
	"encoding/json"
	"fmt"
	"os"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"porelight/solver"
)

// poolStats mirrors porelightWorkers.stats().
type poolStats struct {
	Workers       int     `json:"workers"`
	Ready         int     `json:"ready"`
	Busy          int     `json:"busy"`
	Queued        int     `json:"queued"`
	Calls         int     `json:"calls"`
	Restarts      int     `json:"restarts"`
	LastRestartMs float64 `json:"lastRestartMs"`
	Disabled      string  `json:"disabled"`
}

// answer is a solve answer: a result or an error.
type answer struct {
	Error *struct {
		Problems []solver.Problem `json:"problems"`
	} `json:"error"`
	Summary *struct {
		Flux float64 `json:"flux"`
	} `json:"summary"`
}

func decodeAnswer(t *testing.T, s string) answer {
	t.Helper()
	var a answer
	if err := json.Unmarshal([]byte(s), &a); err != nil {
		t.Fatalf("the answer is not JSON: %v: %.200q", err, s)
	}
	return a
}

// message is the first problem's message of an error answer, or "".
func (a answer) message() string {
	if a.Error == nil || len(a.Error.Problems) == 0 {
		return ""
	}
	return a.Error.Problems[0].Message
}

func stats(t *testing.T, ctx context.Context) poolStats {
	t.Helper()
	var s poolStats
	if err := json.Unmarshal([]byte(eval[string](t, ctx, `JSON.stringify(porelightWorkers.stats())`)), &s); err != nil {
		t.Fatal(err)
	}
	return s
}

// solveAsync runs porelight.solveAsync(arg) (arg is JavaScript) and
// returns what the promise resolved with; a rejection fails the test.
func solveAsync(t *testing.T, ctx context.Context, arg string, d time.Duration) string {
	t.Helper()
	c, cancel := context.WithTimeout(ctx, d)
	defer cancel()
	v, err := chromedp.Run(c, chromedp.Evaluate[string](`porelight.solveAsync(`+arg+`).then(
		r => typeof r === "string" ? r : "not a string: " + typeof r,
		e => "rejected: " + e)`, chromedp.EvalAwaitPromise))
	if err != nil {
		t.Fatalf("solveAsync(%.60s): %v", arg, err)
	}
	if strings.HasPrefix(v, "rejected: ") || strings.HasPrefix(v, "not a string: ") {
		t.Fatalf("solveAsync(%.60s): %s", arg, v)
	}
	return v
}

// TestE2EWorker works one page from file:// through solves in the
// workers and their failures, then the same page in a sandboxed frame.
func TestE2EWorker(t *testing.T) {
	pageURL, demo := builtPage(t)
	shots, err := os.MkdirTemp("", "porelight-worker-")
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("screenshots go to %s", shots)
	rec := &recorder{}
	ctx := browser(t, rec)
	intercept(t, ctx)
	open(t, ctx, pageURL)
	poll[bool](t, ctx, upToDate, 45*time.Second)

	t.Run("the page solves in a worker", func(t *testing.T) {
		s := stats(t, ctx)
		if s.Disabled != "" || s.Workers < 1 || s.Ready < 1 {
			t.Fatalf("pool %+v", s)
		}
		if s.Calls < 1 {
			t.Errorf("the page's first solve did not go through the pool (%+v)", s)
		}
		before := s.Calls
		typeInto(t, ctx, "layers-1-k", "6e-9")
		poll[bool](t, ctx, upToDate+` && porelightWorkers.stats().calls > `+strconv.Itoa(before), 20*time.Second)
		p := mustDecode(t, demo)
		p.Layers[1].K = 6e-9
		want, err := solver.Solve(p, nil)
		if err != nil {
			t.Fatal(err)
		}
		// The result comes back as JSON, which holds every float64
		// exactly (shortest round-trip form): only rounding in the
		// js/wasm build can differ, hence 1e-9.
		if got := dataValue(t, ctx, "sum-flux"); !near(got, want.Summary.Flux, 1e-9) {
			t.Errorf("flux %g in the page, %g natively (relative tolerance 1e-9)", got, want.Summary.Flux)
		}
	})

	t.Run("solveAsync", func(t *testing.T) {
		eval[chromedp.Void](t, ctx, `window.__demo = porelight.demo()`)
		sync := eval[string](t, ctx, `porelight.solve(window.__demo)`)
		cases := []struct {
			name, arg string
			path      string // of the first problem; "-" for a result
		}{
			{"JSON text", `window.__demo`, "-"},
			{"an object", `JSON.parse(window.__demo)`, "-"},
			{"bad project", `'{"format": "porelight/1", "layers": 3}'`, "layers"},
			{"not JSON", `'{"format": '`, ""},
			{"a number", `42`, ""},
			{"nothing", ``, ""},
			{"a cycle", `(() => { const o = {}; o.o = o; return o; })()`, ""},
		}
		for _, c := range cases {
			t.Run(c.name, func(t *testing.T) {
				got := solveAsync(t, ctx, c.arg, 30*time.Second)
				a := decodeAnswer(t, got)
				if c.path == "-" {
					if a.Error != nil || a.Summary == nil {
						t.Fatalf("answer %.200q", got)
					}
					if got != sync {
						t.Error("solveAsync and solve answer differently for the demo")
					}
					return
				}
				if a.Error == nil || len(a.Error.Problems) == 0 || a.Error.Problems[0].Path != c.path || a.message() == "" {
					t.Errorf("answer %.300q, want a problem at %q", got, c.path)
				}
			})
		}
	})

	t.Run("a worker out of memory is replaced", func(t *testing.T) {
		before := stats(t, ctx)
		eval[chromedp.Void](t, ctx, `porelightWorkers.fault = "oom"`)
		start := time.Now()
		a := decodeAnswer(t, solveAsync(t, ctx, `window.__demo`, 60*time.Second))
		crashed := time.Since(start)
		if msg := a.message(); msg != "this solve ran out of memory — reduce the number of elements (mesh.maxSize) or of output times" {
			t.Errorf("answer %q", msg)
		}
		start = time.Now()
		if a := decodeAnswer(t, solveAsync(t, ctx, `window.__demo`, 30*time.Second)); a.Error != nil {
			t.Errorf("the next solve: %q", a.message())
		}
		after := stats(t, ctx)
		t.Logf("out of memory answered after %v; next solve %v; fresh worker ready %.0f ms after the crash",
			crashed.Round(time.Millisecond), time.Since(start).Round(time.Millisecond), after.LastRestartMs)
		if after.Restarts != before.Restarts+1 {
			t.Errorf("restarts %d → %d, want one more", before.Restarts, after.Restarts)
		}
		// The page's own program is untouched.
		if a := decodeAnswer(t, eval[string](t, ctx, `porelight.solve(window.__demo)`)); a.Error != nil {
			t.Errorf("porelight.solve after the crash: %q", a.message())
		}
	})

	t.Run("a panicking worker is replaced", func(t *testing.T) {
		eval[chromedp.Void](t, ctx, `porelightWorkers.fault = "panic"`)
		msg := decodeAnswer(t, solveAsync(t, ctx, `window.__demo`, 30*time.Second)).message()
		if !strings.Contains(msg, "internal error") || !strings.Contains(msg, "panic: porelight: the fault-panic test hook") {
			t.Errorf("answer %q", msg)
		}
		if a := decodeAnswer(t, solveAsync(t, ctx, `window.__demo`, 30*time.Second)); a.Error != nil {
			t.Errorf("the next solve: %q", a.message())
		}
	})

	t.Run("an endless solve times out", func(t *testing.T) {
		eval[chromedp.Void](t, ctx, `porelightWorkers.timeout = 1500; porelightWorkers.fault = "hang"`)
		start := time.Now()
		msg := decodeAnswer(t, solveAsync(t, ctx, `window.__demo`, 30*time.Second)).message()
		took := time.Since(start)
		eval[chromedp.Void](t, ctx, `porelightWorkers.timeout = 300000`)
		if !strings.HasPrefix(msg, "this solve took longer than 2 s and was stopped — reduce") {
			t.Errorf("answer %q", msg)
		}
		if took < 1500*time.Millisecond {
			t.Errorf("answered after %v, before the 1.5 s timeout", took)
		}
		if a := decodeAnswer(t, solveAsync(t, ctx, `window.__demo`, 30*time.Second)); a.Error != nil {
			t.Errorf("the next solve: %q", a.message())
		}
	})

	const k = "4.4e-9" // the edit that must survive the crash
	t.Run("a crash in the page's solve keeps the edit", func(t *testing.T) {
		dismissNotices(t, ctx)
		before := stats(t, ctx)
		eval[chromedp.Void](t, ctx, `porelightWorkers.fault = "oom"`)
		// One input event, so that one solve takes the fault (typed
		// keystrokes could each start and cancel one).
		paste(t, ctx, "layers-1-k", k)
		status := poll[string](t, ctx, `(s => s.includes("ran out of memory") && s)(document.getElementById("status").textContent)`, 60*time.Second)
		if !strings.Contains(status, "this solve ran out of memory — reduce the number of elements (mesh.maxSize) or of output times") {
			t.Errorf("status %q", status)
		}
		if got := value(t, ctx, "layers-1-k"); got != k {
			t.Errorf("k shows %q after the crash, want %q", got, k)
		}
		if !eval[bool](t, ctx, `(localStorage.getItem("porelight.autosave") || "").includes('"k":4.4e-9')`) {
			t.Error("the edit is not autosaved")
		}
		poll[bool](t, ctx, fmt.Sprintf(`porelightWorkers.stats().restarts > %d && porelightWorkers.stats().ready > 0`, before.Restarts), 20*time.Second)
		screenshot(t, ctx, shots, "1-after-oom.png")

		// The next edit solves in the fresh worker.
		typeInto(t, ctx, "layers-1-k", "5e-9")
		poll[bool](t, ctx, upToDate, 30*time.Second)
		p := mustDecode(t, demo)
		p.Layers[1].K = 5e-9
		want, err := solver.Solve(p, nil)
		if err != nil {
			t.Fatal(err)
		}
		if got := dataValue(t, ctx, "sum-flux"); !near(got, want.Summary.Flux, 1e-9) {
			t.Errorf("flux %g after the recovery, %g natively (relative tolerance 1e-9)", got, want.Summary.Flux)
		}
		screenshot(t, ctx, shots, "2-recovered.png")
	})

	requests := rec.requireLocal(t)
	t.Logf("%d requests, all local", len(requests))
}

// TestE2EWorkerFrame opens the page inside <iframe sandbox="allow-scripts">:
// an opaque origin (blob:null workers, no storage). A script put into
// every new document has the framed page report to its parent. Site
// isolation is off in this browser, so that the frame runs in the page's
// process and that script reaches it (an out-of-process frame is a target
// of its own, which did not answer chromedp reliably).
func TestE2EWorkerFrame(t *testing.T) {
	pageURL, demo := builtPage(t)
	shots := t.TempDir()
	rec := &recorder{}
	ctx := browser(t, rec, chromedp.Flag("disable-site-isolation-trials", true),
		chromedp.Flag("disable-features", "IsolateOrigins,site-per-process"))
	intercept(t, ctx)
	onNewDocument(t, ctx, `if (window !== window.top) {
		document.addEventListener("porelight:ready", () => {
			const report = async () => {
				const st = document.getElementById("status")?.textContent ?? "";
				if (!st.includes("up to date")) { setTimeout(report, 100); return; }
				const r = JSON.parse(await porelight.solveAsync(porelight.demo()));
				parent.postMessage({porelightFrame: true, status: st, flux: r.summary ? r.summary.flux : null,
					error: r.error ? JSON.stringify(r.error) : "", stats: porelightWorkers.stats(), origin: self.origin}, "*");
			};
			report();
		});
	}`)
	wrap := shots + "/frame.html"
	html := `<!doctype html><meta charset="utf-8"><title>frame</title><body style="margin:0">` +
		`<script>window.__frame = null; addEventListener("message", e => { if (e.data && e.data.porelightFrame) window.__frame = JSON.stringify(e.data); });</script>` +
		`<iframe id="f" sandbox="allow-scripts" style="width:1480px;height:980px;border:0" src="` + pageURL + `"></iframe>`
	if err := os.WriteFile(wrap, []byte(html), 0o644); err != nil {
		t.Fatal(err)
	}
	within(t, ctx, 60*time.Second, chromedp.Navigate("file://"+wrap))
	got := poll[string](t, ctx, `window.__frame`, 45*time.Second)
	var f struct {
		Status, Error, Origin string
		Flux                  *float64
		Stats                 poolStats
	}
	if err := json.Unmarshal([]byte(got), &f); err != nil {
		t.Fatal(err)
	}
	want, err := solver.Solve(mustDecode(t, demo), nil)
	if err != nil {
		t.Fatal(err)
	}
	if f.Error != "" || f.Flux == nil || !near(*f.Flux, want.Summary.Flux, 1e-9) {
		t.Errorf("solveAsync in the frame: flux %v, error %q; natively %g (relative tolerance 1e-9)", f.Flux, f.Error, want.Summary.Flux)
	}
	if f.Origin != "null" || f.Stats.Disabled != "" || f.Stats.Calls < 2 || f.Stats.Restarts != 0 {
		t.Errorf("in the frame: origin %q, pool %+v; want an opaque origin, and the page's solve and solveAsync in workers", f.Origin, f.Stats)
	}
	screenshot(t, ctx, shots, "frame.png")
	rec.requireLocal(t)
}
