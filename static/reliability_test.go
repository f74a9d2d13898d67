//go:build !(js && wasm)

package static_test

// Browser tests of what must never go wrong: memory held by many solves,
// projects lost or misread, requests leaving the machine, typed text
// turning into markup, and tabs frozen by projects that are too large.

import (
	"bytes"
	"compress/flate"
	"context"
	"encoding/base64"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/cdproto/input"
	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/chromedp"
	"github.com/chromedp/chromedp/kb"

	"porelight/solver"
)

// builtPage returns the file:// URL of the built page and the demo
// project, or skips (fails under CI/E2E) when the page is not built.
func builtPage(t *testing.T) (pageURL string, demo []byte) {
	t.Helper()
	if testing.Short() {
		t.Skip("browser tests are skipped in -short mode")
	}
	if _, err := os.ReadFile(pagePath); err != nil { // also keys go test's cache on the page
		if required() {
			t.Fatalf("%v: run `make page` first", err)
		}
		t.Skipf("%v: run `make page` first", err)
	}
	abs, err := filepath.Abs(pagePath)
	if err != nil {
		t.Fatal(err)
	}
	demo, err = os.ReadFile("../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	return "file://" + abs, demo
}

// open loads url as a new document and waits until the page has solved
// (or at least shows its status).
func open(t *testing.T, ctx context.Context, url string) {
	t.Helper()
	within(t, ctx, 60*time.Second, chromedp.Navigate("about:blank"), chromedp.Navigate(url))
	poll[bool](t, ctx, `!!document.getElementById("status") && !document.getElementById("status").textContent.startsWith("Solving")`, 45*time.Second)
}

// onNewDocument runs src first in every document loaded until the
// returned function is called.
func onNewDocument(t *testing.T, ctx context.Context, src string) (remove func()) {
	t.Helper()
	c, cancel := context.WithTimeout(ctx, 10*time.Second)
	defer cancel()
	res, err := chromedp.Call(c, page.AddScriptToEvaluateOnNewDocument, page.AddScriptToEvaluateOnNewDocumentParams{Source: src})
	if err != nil {
		t.Fatal(err)
	}
	return func() {
		c, cancel := context.WithTimeout(ctx, 10*time.Second)
		defer cancel()
		if _, err := chromedp.Call(c, page.RemoveScriptToEvaluateOnNewDocument, page.RemoveScriptToEvaluateOnNewDocumentParams{Identifier: res.Identifier}); err != nil {
			t.Fatal(err)
		}
	}
}

// lastNotice is the text of the newest notice of kind ("error", "info").
func lastNotice(t *testing.T, ctx context.Context, kind string) string {
	t.Helper()
	return eval[string](t, ctx, fmt.Sprintf(`[...document.querySelectorAll(".pl-notice-%s .pl-notice-text")].map(e => e.textContent).pop() ?? ""`, kind))
}

// evalAwait evaluates js and waits for the promise it returns.
func evalAwait[T any](t *testing.T, ctx context.Context, js string) T {
	t.Helper()
	c, cancel := context.WithTimeout(ctx, 20*time.Second)
	defer cancel()
	v, err := chromedp.Run(c, chromedp.Evaluate[T](js, chromedp.EvalAwaitPromise))
	if err != nil {
		t.Fatalf("%s: %v", js, err)
	}
	return v
}

// paste replaces the text of an input or textarea in one input event, as
// pasting over a selection does.
func paste(t *testing.T, ctx context.Context, id, text string) {
	t.Helper()
	within(t, ctx, 20*time.Second,
		chromedp.Focus(chromedp.ID(id)),
		chromedp.Evaluate[chromedp.Void](fmt.Sprintf(`document.getElementById(%q).select()`, id)),
		chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := cdp.Call(ctx, tg, input.InsertText, input.InsertTextParams{Text: text})
			return err
		}))
}

// clearInput deletes the text of an input as a user would.
func clearInput(t *testing.T, ctx context.Context, id string) {
	t.Helper()
	within(t, ctx, 20*time.Second,
		chromedp.Evaluate[chromedp.Void](fmt.Sprintf(`document.getElementById(%q).select()`, id)),
		chromedp.SendKeys(chromedp.ID(id), kb.Delete))
}

// dismissNotices closes every notice, one at a time as a user would.
func dismissNotices(t *testing.T, ctx context.Context) {
	t.Helper()
	for range 8 {
		n := eval[int](t, ctx, `document.querySelectorAll(".pl-notice").length`)
		if n == 0 {
			return
		}
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.CSS(".pl-notice .pl-icon")))
		poll[bool](t, ctx, fmt.Sprintf(`document.querySelectorAll(".pl-notice").length < %d`, n), 5*time.Second)
	}
	t.Fatal("the notices would not close")
}

func value(t *testing.T, ctx context.Context, id string) string {
	t.Helper()
	return eval[string](t, ctx, fmt.Sprintf(`document.getElementById(%q)?.value ?? "(no #%s)"`, id, id))
}

// fragment packs data as a share link's fragment: raw deflate, base64url.
func fragment(t *testing.T, data []byte) string {
	t.Helper()
	var b bytes.Buffer
	w, err := flate.NewWriter(&b, flate.BestCompression)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := w.Write(data); err != nil {
		t.Fatal(err)
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	return "#p=" + base64.RawURLEncoding.EncodeToString(b.Bytes())
}

// withFormat is the demo project with its format line replaced.
func withFormat(t *testing.T, demo []byte, format string) []byte {
	t.Helper()
	out := bytes.Replace(demo, []byte(`"format": "porelight/1"`), []byte(`"format": `+strconv.Quote(format)), 1)
	if bytes.Equal(out, demo) && format != solver.Format {
		t.Fatal("the demo project has no format line to replace")
	}
	return out
}

// TestE2EReliability works one browser through the failure cases in
// turn; each subtest leaves the page open on a solved project.
func TestE2EReliability(t *testing.T) {
	pageURL, demo := builtPage(t)
	shots, err := os.MkdirTemp("", "porelight-reliability-")
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("screenshots go to %s", shots)
	demoProject := mustDecode(t, demo)

	rec := &recorder{}
	ctx := browser(t, rec)
	intercept(t, ctx)

	// The interceptor must see and stop a request, or "no request left
	// the machine" below would pass unheard. about:blank has no CSP.
	t.Run("interception hears a request", func(t *testing.T) {
		const probe = "http://porelight-probe.invalid/net"
		within(t, ctx, 20*time.Second, chromedp.Navigate("about:blank"))
		got := evalAwait[string](t, ctx, `fetch("`+probe+`").then(() => "answered", () => "failed")`)
		if got != "failed" {
			t.Errorf("the probe request was %s; the interceptor should fail it", got)
		}
		if b := rec.blockedRequests(); !slices.Contains(b, probe) {
			t.Fatalf("the interceptor did not see the probe request (blocked: %v)", b)
		}
		if r, _ := rec.snapshot(); !slices.Contains(r, probe) {
			t.Fatalf("the network listener did not see the probe request (requests: %v)", r)
		}
		rec.forgetRequests(probe)
		rec.forget(probe)
		rec.forget("net::ERR_BLOCKED_BY_CLIENT")
	})

	open(t, ctx, pageURL)
	title := value(t, ctx, "title")
	if title != demoProject.Title {
		t.Fatalf("the page opened on %q, not the demo", title)
	}

	t.Run("corrupt autosave", func(t *testing.T) {
		cases := []struct {
			name, stored string
			want         []string // in the error notice
		}{
			{"not JSON", `{"format": "porelight/1", "layers": [`, []string{"not valid JSON"}},
			{"not a project", `[1, 2, 3]`, nil},
			{"newer format", string(withFormat(t, demo, "porelight/2")), []string{"format", "porelight/2"}},
			{"invalid value", strings.Replace(string(demo), `"thickness": 4.0`, `"thickness": -4.0`, 1), []string{"layer 2, thickness"}},
		}
		for i, c := range cases {
			t.Run(c.name, func(t *testing.T) {
				// The script corrupts the autosave of one document only:
				// removing it can race a later navigation, and a script
				// that lingered would corrupt the next subtest's reload.
				remove := onNewDocument(t, ctx, fmt.Sprintf(`if (location.protocol === "file:" && !sessionStorage.getItem(%q)) {
					try { sessionStorage.setItem(%q, "1"); localStorage.setItem(%q, %s); } catch (e) {}
				}`, fmt.Sprintf("corrupted-%d", i), fmt.Sprintf("corrupted-%d", i), "porelight.autosave", strconv.Quote(c.stored)))
				open(t, ctx, pageURL)
				remove()
				msg := lastNotice(t, ctx, "error")
				for _, w := range append([]string{"autosaved project could not be read", "opened the demo project instead"}, c.want...) {
					if !strings.Contains(msg, w) {
						t.Errorf("notice %q lacks %q", msg, w)
					}
				}
				if got := value(t, ctx, "title"); got != demoProject.Title {
					t.Errorf("the page opened on %q, not the demo", got)
				}
				if !strings.Contains(eval[string](t, ctx, `document.getElementById("status").textContent`), "up to date") {
					t.Error("the demo was not solved")
				}
				if i == 0 {
					screenshot(t, ctx, shots, "1-corrupt-autosave.png")
				}
			})
		}
	})

	const k = "7.7e-9" // the edit that must survive
	t.Run("autosave survives a reload", func(t *testing.T) {
		typeInto(t, ctx, "layers-1-k", k)
		// Reload as soon as the page has taken the last keystroke (the
		// autosave is written when a valid edit is committed), before the
		// pause and the solve are over. Without this wait the reload can
		// overtake the keystroke itself, which no page can keep.
		poll[bool](t, ctx, `(localStorage.getItem("porelight.autosave") || "").includes('"k":7.7e-9')`, 10*time.Second)
		within(t, ctx, 60*time.Second, chromedp.Reload())
		poll[bool](t, ctx, `!!document.getElementById("layers-1-k")`, 45*time.Second)
		if got := value(t, ctx, "layers-1-k"); got != k {
			t.Errorf("after a reload k = %q, want %q", got, k)
		}
		if msg := lastNotice(t, ctx, "info"); !strings.Contains(msg, "Restored the project autosaved") {
			t.Errorf("notice %q", msg)
		}
	})

	t.Run("damaged share links", func(t *testing.T) {
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID("share-link")))
		link := poll[string](t, ctx, `document.getElementById("share-url")?.value`, 10*time.Second)
		_, good, ok := strings.Cut(link, "#")
		if !ok {
			t.Fatalf("share link %q has no fragment", link)
		}
		cases := []struct {
			name, frag string
			want       string // in the error notice
		}{
			{"truncated", "#" + good[:len(good)*2/3], "damaged"},
			{"bad base64", "#p=AB*CD!%25%25EF", "damaged"},
			{"base64 of garbage", "#p=" + base64.RawURLEncoding.EncodeToString([]byte("\xff\xfe garbage, not deflated")), "damaged"},
			{"deflated text", fragment(t, []byte("hello, not JSON")), "could not be read"},
			{"JSON with an error", fragment(t, []byte(`{"format": "porelight/1", "layers": 3}`)), "layers"},
			{"other format", fragment(t, withFormat(t, demo, "porelight/0")), "porelight/0"},
		}
		for i, c := range cases {
			t.Run(c.name, func(t *testing.T) {
				open(t, ctx, pageURL+c.frag)
				msg := lastNotice(t, ctx, "error")
				if !strings.Contains(msg, "link") || !strings.Contains(msg, c.want) {
					t.Errorf("notice %q, want one about the link saying %q", msg, c.want)
				}
				if got := value(t, ctx, "layers-1-k"); got != k {
					t.Errorf("k = %q after the link, want %q (the project as it was)", got, k)
				}
				if got := eval[string](t, ctx, `location.hash`); got != "" {
					t.Errorf("the damaged fragment stayed: %.40q", got)
				}
				if i == 0 {
					screenshot(t, ctx, shots, "2-damaged-link.png")
				}
			})
		}
	})

	t.Run("other format versions are refused", func(t *testing.T) {
		for _, format := range []string{"porelight/0", "porelight/2", "porelight/1.1", ""} {
			t.Run(format, func(t *testing.T) {
				file := filepath.Join(t.TempDir(), "other.json")
				if err := os.WriteFile(file, withFormat(t, demo, format), 0o644); err != nil {
					t.Fatal(err)
				}
				within(t, ctx, 20*time.Second, chromedp.SetUploadFiles(chromedp.ID("open-file"), []string{file}))
				msg := poll[string](t, ctx, `[...document.querySelectorAll(".pl-notice-error .pl-notice-text")].map(e => e.textContent).filter(s => s.includes("other.json")).pop()`, 10*time.Second)
				for _, w := range []string{"not a project this page can open", "format", solver.Format, "unchanged"} {
					if !strings.Contains(msg, w) {
						t.Errorf("notice %q lacks %q", msg, w)
					}
				}
				if got := value(t, ctx, "layers-1-k"); got != k {
					t.Errorf("k = %q after refusing the file, want %q", got, k)
				}
				dismissNotices(t, ctx)
			})
		}
	})

	t.Run("offline under its CSP", func(t *testing.T) {
		csp := eval[string](t, ctx, `document.querySelector('meta[http-equiv="Content-Security-Policy"]')?.content ?? ""`)
		for _, w := range []string{"default-src 'none'", "connect-src 'none'"} {
			if !strings.Contains(csp, w) {
				t.Errorf("CSP %q lacks %s", csp, w)
			}
		}
		// A request from the page is refused by the CSP before it is
		// made: the page reports a violation and the interceptor sees
		// nothing.
		const probe = "http://porelight-probe.invalid/csp"
		got := evalAwait[string](t, ctx, `new Promise(done => {
			document.addEventListener("securitypolicyviolation", e => done("violation " + e.blockedURI), {once: true});
			fetch("`+probe+`").then(() => done("answered"), () => {});
			setTimeout(() => done("no violation"), 3000);
		})`)
		if got != "violation "+probe {
			t.Errorf("a fetch from the page: %s", got)
		}
		time.Sleep(200 * time.Millisecond)
		if b := rec.blockedRequests(); slices.Contains(b, probe) {
			t.Errorf("the page's fetch reached the network layer: %v", b)
		}
		rec.forget(probe)
	})

	const evil = `<img src=x onerror=alert(1)><b>bold</b>`
	t.Run("typed text stays text", func(t *testing.T) {
		// Open the folds, so that the check covers the tables by layer,
		// the records editor and the Asaoka plots too.
		for _, id := range []string{"tables-toggle", "records-toggle", "asaoka-plots-toggle"} {
			within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID(id)))
		}
		poll[bool](t, ctx, `!!document.getElementById("steady-table") && !!document.getElementById("monitoring-plates-0-name") && !!document.getElementById("plot-asaoka-0")`, 10*time.Second)
		markup := `document.querySelectorAll("img, b, [onerror], script:not([id])").length`
		if n := eval[int](t, ctx, markup); n != 0 {
			t.Fatalf("the page has %d img/b/script elements before typing", n)
		}
		// The check must see markup where it would appear: in a plot's
		// layer strip.
		eval[chromedp.Void](t, ctx, `document.querySelector("#plot-isochrones").insertAdjacentHTML("beforeend", "<b id=probe>x</b>")`)
		n := eval[int](t, ctx, markup)
		eval[chromedp.Void](t, ctx, `document.getElementById("probe").remove()`)
		if n != 1 {
			t.Fatalf("the markup check counted %d elements for one probe", n)
		}

		typed := []string{"title", "layers-0-name", "notes", "monitoring-plates-0-name"}
		for _, id := range typed {
			paste(t, ctx, id, evil)
		}
		poll[bool](t, ctx, upToDate, 20*time.Second)
		time.Sleep(300 * time.Millisecond)

		if n := eval[int](t, ctx, markup); n != 0 {
			t.Errorf("typing markup created %d elements", n)
		}
		for _, id := range typed {
			if got := value(t, ctx, id); got != evil {
				t.Errorf("#%s shows %q", id, got)
			}
		}
		checks := []struct{ what, js string }{
			{"print title", `document.querySelector(".pl-print-title").textContent`},
			{"print notes", `document.querySelector(".pl-print-notes").textContent`},
			{"isochrone strip", `document.getElementById("plot-isochrones").textContent`},
			{"steady table", `document.getElementById("steady-table").textContent`},
			{"comparison", `document.getElementById("residuals").textContent`},
			{"Asaoka heading", `document.querySelector("#asaoka-0 h4").textContent`},
			{"Asaoka plot", `document.getElementById("plot-asaoka-0").textContent`},
		}
		for _, c := range checks {
			if got := eval[string](t, ctx, c.js); !strings.Contains(got, "<img") && !strings.Contains(got, "<b>") {
				t.Errorf("the %s does not show the typed text literally: %.120q", c.what, got)
			}
		}
		screenshot(t, ctx, shots, "3-typed-markup.png")
		if d := rec.dialogMessages(); len(d) > 0 {
			t.Errorf("dialogues opened: %v", d)
		}
		// Fold them again, as the page was.
		for _, id := range []string{"tables-toggle", "records-toggle", "asaoka-plots-toggle"} {
			within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID(id)))
		}
		poll[bool](t, ctx, `!document.getElementById("steady-table") && !document.getElementById("records-body") && !document.getElementById("plot-asaoka-0")`, 10*time.Second)
	})

	t.Run("too large a project", func(t *testing.T) {
		if !eval[bool](t, ctx, `document.getElementById("advanced").open`) {
			within(t, ctx, 10*time.Second, chromedp.Click(chromedp.CSS("#advanced > summary")))
		}
		cases := []struct {
			path, text string
			set        func(*solver.Project)
		}{
			{"mesh.maxSize", "0.00001", func(p *solver.Project) { p.Mesh.MaxSize = 0.00001 }},
			{"stepping.firstStep", "1e-9", func(p *solver.Project) { p.Stepping.FirstStep = 1e-9; p.Stepping.Growth = 1 }},
		}
		for i, c := range cases {
			t.Run(c.path, func(t *testing.T) {
				p := mustDecode(t, demo)
				c.set(p)
				want := ""
				for _, pr := range solver.AsProblems(solver.Validate(p)) {
					if pr.Path == c.path {
						want = pr.Message
					}
				}
				if !strings.Contains(want, "limit") {
					t.Fatalf("natively, %s = %s gives %q, not a limit", c.path, c.text, want)
				}
				id := strings.ReplaceAll(c.path, ".", "-")
				if c.path == "stepping.firstStep" {
					typeInto(t, ctx, "stepping-growth", "1")
				}
				// One input event: typed key by key, "0.0001" on the way
				// to "0.00001" is a legal 130,000-element column whose
				// solve and redraw could hold a loaded machine past the
				// wait. A poll costs nothing when the page is quick.
				paste(t, ctx, id, c.text)
				got := poll[string](t, ctx, fmt.Sprintf(`document.getElementById(%q)?.textContent`, id+"-err"), 20*time.Second)
				if got != want {
					t.Errorf("beside #%s: %q, natively %q", id, got, want)
				}
				status := eval[string](t, ctx, `document.getElementById("status").textContent`)
				if !strings.Contains(status, "needs attention") || !strings.Contains(status, "last valid inputs") {
					t.Errorf("status %q", status)
				}
				if i == 0 {
					screenshot(t, ctx, shots, "4-limit.png")
				}
				// The tab still answers: put the field back.
				clearInput(t, ctx, id)
				if c.path == "stepping.firstStep" {
					clearInput(t, ctx, "stepping-growth")
				}
				if c.path == "mesh.maxSize" {
					typeInto(t, ctx, id, "0.1") // the demo's
				}
				poll[bool](t, ctx, fmt.Sprintf(`!document.getElementById(%q)`, id+"-err"), 5*time.Second)
			})
		}
		poll[bool](t, ctx, upToDate, 20*time.Second)
	})

	t.Run("a long solve shows progress and can be cancelled", func(t *testing.T) {
		flux := eval[string](t, ctx, `document.getElementById("sum-flux").dataset.value`)
		// Slow the page down, as on a weaker machine: on a fast one the
		// solve below can finish between the first progress and the click.
		throttle := func(rate float64) {
			within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
				_, err := cdp.Call(ctx, tg, emulation.SetCPUThrottlingRate, emulation.SetCPUThrottlingRateParams{Rate: rate})
				return err
			}))
		}
		throttle(6)
		defer throttle(1)
		// About 15 s natively (65,000 elements), far longer in the page's worker (which the
		// throttling does not slow down).
		paste(t, ctx, "mesh-maxSize", "0.0002")
		restarts := eval[int](t, ctx, `porelightWorkers.stats().restarts`)
		status := poll[string](t, ctx, `document.getElementById("solve-cancel") && /Solving… [1-9]/.test(document.getElementById("status").textContent) && document.getElementById("status").textContent`, 20*time.Second)
		t.Logf("status while solving: %q", status)
		// (No screenshot here: a full-page capture under throttling held
		// the page's main thread until the solve was over.)
		// Click through the DOM until the status says so: a re-render
		// between finding the button and a synthetic mouse click could
		// otherwise swallow the click on a loaded machine.
		// Evaluate in a loop rather than poll: chromedp's Poll runs in
		// animation frames, which a throttled page busy rendering progress
		// may not give it.
		for deadline := time.Now().Add(10 * time.Second); !eval[bool](t, ctx, `(() => {
			const b = document.getElementById("solve-cancel");
			if (b) b.click();
			return document.getElementById("status").textContent.includes("cancelled");
		})()`); time.Sleep(100 * time.Millisecond) {
			if time.Now().After(deadline) {
				t.Fatalf("no cancel; status %q", eval[string](t, ctx, `document.getElementById("status").textContent`))
			}
		}
		// Cancel stops the worker that was solving; a fresh one takes over.
		poll[bool](t, ctx, fmt.Sprintf(`porelightWorkers.stats().restarts > %d && porelightWorkers.stats().ready > 0`, restarts), 10*time.Second)
		time.Sleep(1500 * time.Millisecond) // the cancelled solve must not come back
		if s := eval[string](t, ctx, `document.getElementById("status").textContent`); !strings.Contains(s, "cancelled") {
			t.Errorf("status %q after the cancel", s)
		}
		if got := eval[string](t, ctx, `document.getElementById("sum-flux").dataset.value`); got != flux {
			t.Errorf("flux %s after the cancel, was %s", got, flux)
		}
		if eval[bool](t, ctx, `!!document.getElementById("solve-cancel")`) {
			t.Error("the Cancel button stayed")
		}
		throttle(1)
		screenshot(t, ctx, shots, "6-cancelled.png")
		typeInto(t, ctx, "mesh-maxSize", "0.1")
		poll[bool](t, ctx, upToDate, 20*time.Second)
	})

	t.Run("1000 solves keep the heap bounded", func(t *testing.T) {
		// A coarse mesh and no field records keep the test short; the
		// benchmark solves the demo itself.
		p := mustDecode(t, demo)
		p.Mesh.MaxSize = 1
		p.Times = p.Times[:3]
		p.Monitoring = nil
		small, err := solver.Encode(p)
		if err != nil {
			t.Fatal(err)
		}
		eval[chromedp.Void](t, ctx, `window.__small = `+strconv.Quote(string(small)))
		const limit = 64 << 20
		before := eval[float64](t, ctx, `globalThis.porelightMemory?.buffer.byteLength ?? 0`)
		if before <= 0 {
			t.Fatalf("wasm memory read as %v bytes", before)
		}
		start := time.Now()
		solves := 0
		for range 10 {
			n := eval[int](t, ctx, `(() => {
				let n = 0;
				for (let i = 0; i < 100; i++) {
					const r = JSON.parse(porelight.solve(window.__small));
					if (r.error) throw new Error(JSON.stringify(r.error));
					if (r.summary && typeof r.summary.flux === "number") n++;
				}
				return n;
			})()`)
			solves += n
		}
		after := eval[float64](t, ctx, `porelightMemory.buffer.byteLength`)
		if solves != 1000 {
			t.Fatalf("%d solves of 1000 gave results", solves)
		}
		t.Logf("wasm memory %.1f MiB before, %.1f MiB after 1000 solves (%.1f s)", before/(1<<20), after/(1<<20), time.Since(start).Seconds())
		if after-before > limit {
			t.Errorf("wasm memory grew by %.1f MiB over 1000 solves (bound %d MiB)", (after-before)/(1<<20), limit>>20)
		}
	})

	requests := rec.requireLocal(t)
	t.Logf("%d requests, all local", len(requests))
}
