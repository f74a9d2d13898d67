//go:build !(js && wasm)

package static_test

// Browser end-to-end tests of the built page (make page) in headless
// Chromium. They skip in -short mode, and when no browser or no built page
// is found, unless CI or E2E is set: then they fail instead.

import (
	"context"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/cdproto/fetch"
	cdplog "github.com/chromedp/cdproto/log"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/cdproto/runtime"
	"github.com/chromedp/chromedp"

	"porelight/solver"
	"porelight/solver/monitor"
)

const pagePath = "build/porelight.html"

// figuresDrawn holds in the page once every figure is drawn from the last
// results: figures out of view follow those in view by a render, and
// the results column says aria-busy meanwhile (ui/inview.go). upToDate
// holds once the status says so and every figure is drawn.
const (
	figuresDrawn = `!document.querySelector("#results[aria-busy=true]")`
	upToDate     = `(document.getElementById("status")?.textContent.includes("up to date") && ` + figuresDrawn + `)`
)

func required() bool { return os.Getenv("CI") != "" || os.Getenv("E2E") != "" }

func findBrowser() string {
	if p := os.Getenv("CHROME_PATH"); p != "" {
		return p
	}
	for _, name := range []string{"chromium", "chromium-browser", "google-chrome", "google-chrome-stable"} {
		if p, err := exec.LookPath(name); err == nil {
			return p
		}
	}
	return ""
}

// recorder collects what the page says and asks for while it runs.
type recorder struct {
	mu       sync.Mutex
	requests []string
	problems []string // console errors and warnings, exceptions, error log entries
	// With interception on (intercept), every request pauses: local ones
	// go on, all others fail and are listed in blocked.
	fetchCtx context.Context
	blocked  []string
	dialogs  []string // messages of alert, confirm and prompt dialogues (dismissed)
}

func (r *recorder) listen(ev any) {
	r.mu.Lock()
	defer r.mu.Unlock()
	switch e := ev.(type) {
	case *fetch.EventRequestPaused:
		if !local(e.Request.URL) {
			r.blocked = append(r.blocked, e.Request.URL)
		}
		go r.answer(r.fetchCtx, e) // no commands from a listener
	case *page.EventJavascriptDialogOpening:
		r.dialogs = append(r.dialogs, e.Message)
		go func(ctx context.Context) {
			c, cancel := context.WithTimeout(ctx, 10*time.Second)
			defer cancel()
			_, _ = chromedp.Call(c, page.HandleJavaScriptDialog, page.HandleJavaScriptDialogParams{Accept: false})
		}(r.fetchCtx)
	case *network.EventRequestWillBeSent:
		r.requests = append(r.requests, e.Request.URL)
	case *runtime.EventConsoleAPICalled:
		var parts []string
		for _, a := range e.Args {
			parts = append(parts, strings.Trim(string(a.Value), `"`)+a.Description)
		}
		msg := strings.Join(parts, " ")
		if e.Type == runtime.ConsoleAPICalledTypeError || e.Type == runtime.ConsoleAPICalledTypeWarning ||
			strings.Contains(msg, "panic") {
			r.problems = append(r.problems, fmt.Sprintf("console.%s: %s", e.Type, msg))
		}
	case *runtime.EventExceptionThrown:
		d := e.ExceptionDetails
		msg := d.Text
		if d.Exception != nil {
			msg += " " + d.Exception.Description
		}
		r.problems = append(r.problems, "exception: "+msg)
	case *cdplog.EventEntryAdded:
		if e.Entry.Level == cdplog.EntryLevelError || e.Entry.Level == cdplog.EntryLevelWarning {
			r.problems = append(r.problems, fmt.Sprintf("log %s: %s %s", e.Entry.Source, e.Entry.Text, e.Entry.URL))
		}
	}
}

// forget drops the problems that mention s.
func (r *recorder) forget(s string) {
	r.mu.Lock()
	defer r.mu.Unlock()
	r.problems = slices.DeleteFunc(r.problems, func(p string) bool { return strings.Contains(p, s) })
}

// local reports whether a request stays on this machine.
func local(url string) bool {
	for _, p := range []string{"file:", "data:", "blob:", "about:"} {
		if strings.HasPrefix(url, p) {
			return true
		}
	}
	return false
}

// openAt opens url in a fresh browser and waits until the JavaScript
// ready is true; it returns the browser, its recorder and a new
// directory for screenshots whose name starts with name.
func openAt(t *testing.T, url, name, ready string) (context.Context, *recorder, string) {
	t.Helper()
	shots, err := os.MkdirTemp("", name)
	if err != nil {
		t.Fatal(err)
	}
	rec := &recorder{}
	ctx := browser(t, rec)
	within(t, ctx, 60*time.Second, chromedp.Navigate(url))
	poll[bool](t, ctx, ready, 45*time.Second)
	return ctx, rec, shots
}

// requireLocal fails t for every request heard that left the machine
// (those the interception blocked included) and every console problem,
// and returns the requests heard.
func (r *recorder) requireLocal(t *testing.T) []string {
	t.Helper()
	requests, problems := r.snapshot()
	for _, u := range append(requests, r.blockedRequests()...) {
		if !local(u) {
			t.Errorf("network request to %s", u)
		}
	}
	for _, p := range problems {
		t.Errorf("%s", p)
	}
	return requests
}

// answer lets a paused local request go on and fails any other.
func (r *recorder) answer(ctx context.Context, e *fetch.EventRequestPaused) {
	c, cancel := context.WithTimeout(ctx, 10*time.Second)
	defer cancel()
	if local(e.Request.URL) {
		_, _ = chromedp.Call(c, fetch.ContinueRequest, fetch.ContinueRequestParams{RequestID: e.RequestID})
		return
	}
	_, _ = chromedp.Call(c, fetch.FailRequest, fetch.FailRequestParams{RequestID: e.RequestID, ErrorReason: network.ErrorReasonBlockedByClient})
}

// intercept pauses every request of the page from now on; see recorder.
func intercept(t *testing.T, ctx context.Context) {
	t.Helper()
	within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		_, err := cdp.Call(ctx, tg, fetch.Enable, fetch.EnableParams{Patterns: []*fetch.RequestPattern{{URLPattern: "*"}}})
		return err
	}))
}

func (r *recorder) blockedRequests() []string {
	r.mu.Lock()
	defer r.mu.Unlock()
	return append([]string(nil), r.blocked...)
}

func (r *recorder) dialogMessages() []string {
	r.mu.Lock()
	defer r.mu.Unlock()
	return append([]string(nil), r.dialogs...)
}

// forgetRequests drops the requests and blocked requests to url.
func (r *recorder) forgetRequests(url string) {
	r.mu.Lock()
	defer r.mu.Unlock()
	same := func(u string) bool { return u == url }
	r.requests = slices.DeleteFunc(r.requests, same)
	r.blocked = slices.DeleteFunc(r.blocked, same)
}

func (r *recorder) snapshot() (requests, problems []string) {
	r.mu.Lock()
	defer r.mu.Unlock()
	return append([]string(nil), r.requests...), append([]string(nil), r.problems...)
}

// browser starts headless Chromium with a fresh profile and listens to
// the page. The first action starts the browser and carries no timeout.
func browser(t *testing.T, rec *recorder, extra ...chromedp.ExecAllocatorOption) context.Context {
	t.Helper()
	exe := findBrowser()
	if exe == "" {
		if required() {
			t.Fatal("no Chromium found (set CHROME_PATH); CI/E2E require the browser tests")
		}
		t.Skip("no Chromium found; set CHROME_PATH, or CI=1 to require these tests")
	}
	profile, err := os.MkdirTemp("", "porelight-chromium-")
	if err != nil {
		t.Fatal(err)
	}
	opts := append([]chromedp.ExecAllocatorOption{
		chromedp.ExecPath(exe), chromedp.Headless, chromedp.NoSandbox, chromedp.DisableGPU,
		chromedp.NoFirstRun, chromedp.NoDefaultBrowserCheck,
		chromedp.Flag("disable-quic", true),
		chromedp.Flag("disable-background-networking", true),
		chromedp.Flag("disable-component-update", true),
		chromedp.Flag("disable-sync", true),
		chromedp.WindowSize(1500, 1000),
		chromedp.UserDataDir(profile)}, extra...)
	alloc, cancelAlloc := chromedp.NewExecAllocator(context.Background(), opts...)
	ctx, cancel := chromedp.NewContext(alloc, chromedp.WithListener(rec.listen))
	rec.mu.Lock()
	rec.fetchCtx = ctx
	rec.mu.Unlock()
	t.Cleanup(func() {
		done := make(chan struct{})
		go func() {
			defer close(done)
			cctx, ccancel := context.WithTimeout(ctx, 10*time.Second)
			defer ccancel()
			_ = chromedp.Cancel(cctx)
		}()
		select {
		case <-done:
		case <-time.After(15 * time.Second):
			t.Log("the browser did not stop in time")
		}
		cancel()
		cancelAlloc()
		_ = os.RemoveAll(profile)
	})
	err = chromedp.Do(ctx, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		if _, err := cdp.Call(ctx, tg, network.Enable, network.EnableParams{}); err != nil {
			return err
		}
		_, err := cdp.Call(ctx, tg, cdplog.Enable, cdp.Empty{})
		return err
	}))
	if err != nil {
		t.Fatal(err)
	}
	return ctx
}

// within runs actions with a time limit.
func within(t *testing.T, ctx context.Context, d time.Duration, actions ...chromedp.Action[chromedp.Void]) {
	t.Helper()
	c, cancel := context.WithTimeout(ctx, d)
	defer cancel()
	if err := chromedp.Do(c, actions...); err != nil {
		t.Fatal(err)
	}
}

func eval[T any](t *testing.T, ctx context.Context, js string) T {
	t.Helper()
	c, cancel := context.WithTimeout(ctx, 20*time.Second)
	defer cancel()
	v, err := chromedp.Run(c, chromedp.Evaluate[T](js))
	if err != nil {
		t.Fatalf("%s: %v", js, err)
	}
	return v
}

// poll waits until the JavaScript expression is truthy and returns it.
func poll[T any](t *testing.T, ctx context.Context, js string, d time.Duration) T {
	t.Helper()
	deadline := time.Now().Add(d)
	for {
		c, cancel := context.WithTimeout(ctx, time.Until(deadline)+5*time.Second)
		v, err := chromedp.Run(c, chromedp.Poll[T](js, chromedp.WithPollingTimeout(time.Until(deadline))))
		cancel()
		if err == nil {
			return v
		}
		// A navigation (a share link, a reload) destroys the context
		// the poll runs in; poll again in the new page.
		if navigating(err) && time.Now().Before(deadline) {
			time.Sleep(100 * time.Millisecond)
			continue
		}
		t.Fatalf("waiting for %s: %v", js, err)
	}
}

// navigating reports whether err comes from a page that was navigating
// away while a script ran in it.
func navigating(err error) bool {
	s := err.Error()
	return strings.Contains(s, "Cannot find context") || strings.Contains(s, "Execution context was destroyed")
}

// dataValue is the full-precision number behind a summary figure.
func dataValue(t *testing.T, ctx context.Context, id string) float64 {
	t.Helper()
	s := eval[string](t, ctx, fmt.Sprintf(`document.getElementById(%q)?.dataset.value ?? ""`, id))
	x, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("#%s data-value %q: %v", id, s, err)
	}
	return x
}

// typeInto replaces the text of an input as a user would: select it all,
// then type.
func typeInto(t *testing.T, ctx context.Context, id, text string) {
	t.Helper()
	within(t, ctx, 20*time.Second,
		chromedp.Evaluate[chromedp.Void](fmt.Sprintf(`document.getElementById(%q).select()`, id)),
		chromedp.SendKeys(chromedp.ID(id), text))
}

func screenshot(t *testing.T, ctx context.Context, dir, name string) {
	t.Helper()
	c, cancel := context.WithTimeout(ctx, 30*time.Second)
	defer cancel()
	png, err := chromedp.Run(c, chromedp.FullScreenshot(100))
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(dir, name)
	if err := os.WriteFile(path, png, 0o644); err != nil {
		t.Fatal(err)
	}
	t.Logf("screenshot: %s", path)
}

func near(a, b, rel float64) bool {
	return math.Abs(a-b) <= rel*math.Max(math.Abs(a), math.Abs(b))
}

// TestE2EPage opens the built page from disk and works it as a user would.
func TestE2EPage(t *testing.T) {
	if testing.Short() {
		t.Skip("browser tests are skipped in -short mode")
	}
	pageBytes, err := os.ReadFile(pagePath) // also keys go test's cache on the page
	if err != nil {
		if required() {
			t.Fatalf("%v: run `make page` first", err)
		}
		t.Skipf("%v: run `make page` first", err)
	}
	if !strings.Contains(string(pageBytes), `http-equiv="Content-Security-Policy"`) {
		t.Fatal("the page has no Content-Security-Policy")
	}
	abs, err := filepath.Abs(pagePath)
	if err != nil {
		t.Fatal(err)
	}
	pageURL := "file://" + abs
	demo, err := os.ReadFile("../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	shots, err := os.MkdirTemp("", "porelight-e2e-")
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("screenshots go to %s", shots)

	rec := &recorder{}
	ctx := browser(t, rec)
	within(t, ctx, 60*time.Second, chromedp.Navigate(pageURL))
	// The listener must hear the console, or "no console errors" below
	// would pass on deaf ears: send a marked warning and wait for it.
	eval[chromedp.Void](t, ctx, `console.warn("e2e-probe")`)
	for deadline := time.Now().Add(5 * time.Second); ; {
		if _, ps := rec.snapshot(); slices.ContainsFunc(ps, func(p string) bool { return strings.Contains(p, "e2e-probe") }) {
			rec.forget("e2e-probe")
			break
		}
		if time.Now().After(deadline) {
			t.Fatal("the console listener did not hear a console.warn")
		}
		time.Sleep(50 * time.Millisecond)
	}

	// The demo renders: results, then a plot with drawn curves.
	poll[bool](t, ctx, `!!document.getElementById("sum-flux")?.dataset.value && `+figuresDrawn, 45*time.Second)
	decodeMs := eval[float64](t, ctx, `performance.getEntriesByName("porelight: decode program text")[0]?.duration ?? -1`)
	if decodeMs < 0 {
		t.Error("the boot script measured no decoding of the program text")
	}
	t.Logf("the boot script decoded the program text in %.1f ms", decodeMs)
	native, err := solver.Solve(mustDecode(t, demo), nil)
	if err != nil {
		t.Fatal(err)
	}
	plotID := "plot-steady"
	if native.Consolidation != nil {
		plotID = "plot-isochrones"
	}
	if n := poll[int](t, ctx, fmt.Sprintf(`document.querySelectorAll("#%s path[d^='M']").length`, plotID), 20*time.Second); n < 3 {
		t.Errorf("#%s has %d drawn paths", plotID, n)
	}
	if got := eval[string](t, ctx, `document.getElementById("layers-1-name").value`); got != mustDecode(t, demo).Layers[1].Name {
		t.Errorf("layer 2 name input shows %q", got)
	}

	t.Run("matches the native solver", func(t *testing.T) {
		checks := []struct {
			id   string
			want *float64
		}{
			{"sum-flux", &native.Summary.Flux},
			{"sum-settlement-linear", native.Summary.SettlementLinear},
			{"sum-t90", native.Summary.T90},
		}
		for _, c := range checks {
			if c.want == nil {
				continue
			}
			if got := dataValue(t, ctx, c.id); !near(got, *c.want, 1e-9) {
				t.Errorf("#%s = %g in the page, %g natively", c.id, got, *c.want)
			}
		}
	})
	screenshot(t, ctx, shots, "1-demo.png")

	flux0 := dataValue(t, ctx, "sum-flux")
	t.Run("an edit re-solves", func(t *testing.T) {
		typeInto(t, ctx, "layers-1-k", "6e-9")
		poll[bool](t, ctx, fmt.Sprintf(`document.getElementById("sum-flux").dataset.value !== %q`, strconv.FormatFloat(flux0, 'g', -1, 64)), 20*time.Second)
		p := mustDecode(t, demo)
		p.Layers[1].K = 6e-9
		want, err := solver.Solve(p, nil)
		if err != nil {
			t.Fatal(err)
		}
		poll[bool](t, ctx, upToDate, 20*time.Second)
		if got := dataValue(t, ctx, "sum-flux"); !near(got, want.Summary.Flux, 1e-9) {
			t.Errorf("flux after the edit %g, natively %g", got, want.Summary.Flux)
		}
	})

	t.Run("a wrong value keeps the results", func(t *testing.T) {
		// No solve may be under way when the figure to keep is read (on a
		// loaded machine the last edit's solve can still be running).
		poll[bool](t, ctx, upToDate, 20*time.Second)
		before := dataValue(t, ctx, "sum-flux")
		typeInto(t, ctx, "layers-1-thickness", "4,5m")
		msg := poll[string](t, ctx, `document.getElementById("layers-1-thickness-err")?.textContent`, 10*time.Second)
		if msg != "not a number" {
			t.Errorf("field error %q", msg)
		}
		if got := eval[string](t, ctx, `document.getElementById("layers-1-thickness").value`); got != "4,5m" {
			t.Errorf("the input shows %q, not what was typed", got)
		}
		time.Sleep(600 * time.Millisecond) // longer than the pause before a solve
		if got := dataValue(t, ctx, "sum-flux"); got != before {
			t.Errorf("flux changed to %g while an input is wrong (was %g)", got, before)
		}
		if s := eval[string](t, ctx, `document.getElementById("status").textContent`); !strings.Contains(s, "last valid inputs") {
			t.Errorf("status %q", s)
		}
		screenshot(t, ctx, shots, "2-field-error.png")
		typeInto(t, ctx, "layers-1-thickness", "4")
		poll[bool](t, ctx, `!document.getElementById("layers-1-thickness-err")`, 10*time.Second)
	})

	t.Run("folds open and close", func(t *testing.T) {
		// The secondary sections are folded: a line says what they hold,
		// and nothing else of them is in the DOM.
		for _, id := range []string{"steady-table", "settlement-table", "records-body", "plot-asaoka-0"} {
			if eval[bool](t, ctx, fmt.Sprintf(`!!document.getElementById(%q)`, id)) {
				t.Errorf("#%s is in the page before its fold is opened", id)
			}
		}
		if got := eval[string](t, ctx, `document.getElementById("tables-hint").textContent`); !strings.Contains(got, "steady seepage") {
			t.Errorf("tables hint %q", got)
		}
		p := mustDecode(t, demo)
		if got := eval[string](t, ctx, `document.getElementById("records-summary").textContent`); !strings.HasPrefix(got, fmt.Sprintf("%d settlement plates", len(p.Monitoring.Plates))) {
			t.Errorf("records summary %q", got)
		}
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID("tables-toggle")))
		if n := poll[int](t, ctx, `document.querySelectorAll("#steady-table tbody tr").length`, 10*time.Second); n != len(native.Steady.Layers) {
			t.Errorf("the steady table has %d rows, want %d", n, len(native.Steady.Layers))
		}
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID("records-toggle")))
		name := poll[string](t, ctx, `document.getElementById("monitoring-plates-0-name")?.value`, 10*time.Second)
		if name != p.Monitoring.Plates[0].Name {
			t.Errorf("the first plate's name shows %q, want %q", name, p.Monitoring.Plates[0].Name)
		}
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID("asaoka-plots-toggle")))
		poll[bool](t, ctx, `document.querySelectorAll("#plot-asaoka-0 path").length > 0`, 10*time.Second)
		screenshot(t, ctx, shots, "2b-folds-open.png")
		for _, id := range []string{"tables-toggle", "records-toggle", "asaoka-plots-toggle"} {
			within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID(id)))
		}
		poll[bool](t, ctx, `!document.getElementById("steady-table") && !document.getElementById("records-body") && !document.getElementById("plot-asaoka-0")`, 10*time.Second)
	})

	t.Run("print report opens every fold", func(t *testing.T) {
		// window.print, stood in for, notes what is missing when called.
		eval[chromedp.Void](t, ctx, `window.__printed = null; window.print = () => {
			window.__printed = ["steady-table", "settlement-table", "records-body", "monitoring-plates-0-name",
				"plot-asaoka-0", "res-monitoring-plates-0-table", "caution", "mon-caution"].filter(id => !document.getElementById(id));
		}`)
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID("print-report")))
		if missing := poll[[]string](t, ctx, `window.__printed`, 10*time.Second); len(missing) > 0 {
			t.Errorf("missing when print was called: %v", missing)
		}
		// Then the folds close again.
		poll[bool](t, ctx, `!document.getElementById("steady-table") && !document.getElementById("records-body") && !!document.getElementById("tables-foldnote")`, 10*time.Second)
	})

	t.Run("a malformed file is refused", func(t *testing.T) {
		bad := filepath.Join(t.TempDir(), "broken.json")
		if err := os.WriteFile(bad, []byte(`{"format": "porelight/1", "layers": [`), 0o644); err != nil {
			t.Fatal(err)
		}
		title := eval[string](t, ctx, `document.getElementById("title").value`)
		within(t, ctx, 20*time.Second, chromedp.SetUploadFiles(chromedp.ID("open-file"), []string{bad}))
		msg := poll[string](t, ctx, `[...document.querySelectorAll(".pl-notice-error")].map(e => e.textContent).join(" ")`, 10*time.Second)
		if !strings.Contains(msg, "broken.json") || !strings.Contains(msg, "not valid JSON") {
			t.Errorf("error notice %q", msg)
		}
		if got := eval[string](t, ctx, `document.getElementById("title").value`); got != title {
			t.Errorf("title became %q", got)
		}
	})

	t.Run("script API", func(t *testing.T) {
		got := eval[string](t, ctx, `(() => {
			const r = JSON.parse(porelight.solve(porelight.demo()));
			const bad = JSON.parse(porelight.solve('{"format": "porelight/1", "layers": 3}'));
			return porelight.version + "|" + (typeof r.summary.flux) + "|" + bad.error.problems[0].path;
		})()`)
		if parts := strings.Split(got, "|"); len(parts) != 3 || parts[0] == "" || parts[1] != "number" || parts[2] != "layers" {
			t.Errorf("porelight API answered %q", got)
		}
	})

	t.Run("share link", func(t *testing.T) {
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID("share-link")))
		link := poll[string](t, ctx, `document.getElementById("share-url")?.value`, 10*time.Second)
		if !strings.HasPrefix(link, pageURL+"#p=") {
			t.Fatalf("share link %.80q…", link)
		}
		k := eval[string](t, ctx, `document.getElementById("layers-1-k").value`)
		within(t, ctx, 60*time.Second, chromedp.Navigate("about:blank"), chromedp.Navigate(link))
		poll[bool](t, ctx, `!!document.getElementById("sum-flux")?.dataset.value && `+figuresDrawn, 45*time.Second)
		if got := eval[string](t, ctx, `document.getElementById("notices").textContent`); !strings.Contains(got, "from the link") {
			t.Errorf("notices %q", got)
		}
		if got := eval[string](t, ctx, `document.getElementById("layers-1-k").value`); got != k {
			t.Errorf("k from the link %q, want %q", got, k)
		}
		if got := eval[string](t, ctx, `location.hash`); got != "" {
			t.Errorf("the fragment stayed after opening the link: %.40q", got)
		}
	})

	t.Run("a stage over a strip", func(t *testing.T) {
		// Choose a strip for stage 1 and type its width as a user would:
		// the page solves it as the native solver does, and draws the
		// section sketch and the added stress beside the layers.
		poll[bool](t, ctx, upToDate, 20*time.Second)
		eval[chromedp.Void](t, ctx, `(() => { const s = document.getElementById("loads-0-areakind"); s.value = "strip"; s.dispatchEvent(new Event("change", {bubbles: true})); })()`)
		poll[bool](t, ctx, `!!document.getElementById("loads-0-area-width")`, 10*time.Second)
		typeInto(t, ctx, "loads-0-area-width", "8")
		poll[bool](t, ctx, upToDate+` && document.getElementById("loads-0-area-width").value === "8"`, 20*time.Second)
		p := mustDecode(t, []byte(eval[string](t, ctx, `porelight.demo()`)))
		p.Loads[0].Area = &solver.Area{Shape: "strip", Width: 8}
		want, err := solver.Solve(p, nil)
		if err != nil {
			t.Fatal(err)
		}
		poll[bool](t, ctx, fmt.Sprintf(`document.getElementById("sum-settlement-linear").dataset.value === %q`, strconv.FormatFloat(*want.Summary.SettlementLinear, 'g', -1, 64)), 20*time.Second)
		for _, sel := range []string{"#loads-figures #plot-section", "#fig-stress #plot-stress"} {
			if n := eval[int](t, ctx, fmt.Sprintf(`document.querySelectorAll("%s path[d^='M']").length`, sel)); n < 2 {
				t.Errorf("%s has %d drawn paths", sel, n)
			}
		}
		screenshot(t, ctx, shots, "2c-strip.png")
	})

	t.Run("print view", func(t *testing.T) {
		within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := cdp.Call(ctx, tg, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: "print"})
			return err
		}))
		if got := eval[string](t, ctx, `getComputedStyle(document.querySelector(".pl-tools")).display`); got != "none" {
			t.Errorf("the toolbar prints (display %s)", got)
		}
		// A printout made with the browser's own Print says where a
		// section was folded.
		for _, id := range []string{"tables-foldnote", "records-foldnote", "monitoring-foldnote"} {
			if got := eval[string](t, ctx, fmt.Sprintf(`getComputedStyle(document.getElementById(%q)).display`, id)); got == "none" {
				t.Errorf("#%s does not print", id)
			}
		}
		screenshot(t, ctx, shots, "3-print.png")
		// What Print report prints: every fold open.
		for _, id := range []string{"tables-toggle", "records-toggle", "asaoka-plots-toggle"} {
			eval[chromedp.Void](t, ctx, fmt.Sprintf(`document.getElementById(%q).click()`, id))
		}
		poll[bool](t, ctx, `!!document.getElementById("steady-table") && !!document.getElementById("records-body") && !!document.getElementById("plot-asaoka-0")`, 10*time.Second)
		screenshot(t, ctx, shots, "3b-print-open.png")
		within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := cdp.Call(ctx, tg, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: ""})
			return err
		}))
		if n := eval[int](t, ctx, `[...document.querySelectorAll(".pl-foldnote")].filter(e => getComputedStyle(e).display !== "none").length`); n != 0 {
			t.Errorf("%d fold notes show on screen", n)
		}
	})

	t.Run("sandboxed frame", func(t *testing.T) {
		// The page inside <iframe sandbox="allow-scripts">: an opaque
		// origin without storage. It must still start and solve.
		wrap := filepath.Join(shots, "frame.html")
		html := `<!doctype html><meta charset="utf-8"><title>frame</title><body style="margin:0">` +
			`<iframe id="f" sandbox="allow-scripts" style="width:1480px;height:980px;border:0" src="` + pageURL + `"></iframe>`
		if err := os.WriteFile(wrap, []byte(html), 0o644); err != nil {
			t.Fatal(err)
		}
		within(t, ctx, 60*time.Second, chromedp.Navigate("file://"+wrap))
		time.Sleep(4 * time.Second) // the frame is cross-origin: its DOM cannot be polled from here
		screenshot(t, ctx, shots, "4-frame.png")
	})

	requests := rec.requireLocal(t)
	t.Logf("%d requests, all local: %v", len(requests), requests)
}

func mustDecode(t *testing.T, data []byte) *solver.Project {
	t.Helper()
	p, err := solver.Decode(data)
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// TestE2EMonitoring opens the demo, whose project carries field records:
// the settlement plot marks the readings of both plates, and Asaoka's
// method gives the forecast the native solver gives.
func TestE2EMonitoring(t *testing.T) {
	if testing.Short() {
		t.Skip("browser tests are skipped in -short mode")
	}
	if _, err := os.ReadFile(pagePath); err != nil {
		if required() {
			t.Fatalf("%v: run `make page` first", err)
		}
		t.Skipf("%v: run `make page` first", err)
	}
	abs, err := filepath.Abs(pagePath)
	if err != nil {
		t.Fatal(err)
	}
	demo, err := os.ReadFile("../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	p := mustDecode(t, demo)
	if p.Monitoring == nil || len(p.Monitoring.Plates) < 2 {
		t.Fatal("the demo has no settlement plates")
	}
	want, err := monitor.PlateAsaoka(p, 0, 0)
	if err != nil {
		t.Fatalf("Asaoka natively: %v", err)
	}

	rec := &recorder{}
	ctx := browser(t, rec)
	within(t, ctx, 60*time.Second, chromedp.Navigate("file://"+abs))
	poll[bool](t, ctx, `!!document.getElementById("sum-flux")?.dataset.value && `+figuresDrawn, 45*time.Second)

	// Each plate is a legend entry and a path of marks, one per reading
	// after day 0 (a log time axis has no day 0).
	legend := poll[string](t, ctx, `document.getElementById("plot-settlement")?.textContent`, 10*time.Second)
	squeeze := func(s string) string { return strings.Join(strings.Fields(s), "") } // a long name breaks onto two lines
	for _, pl := range p.Monitoring.Plates {
		if !strings.Contains(squeeze(legend), squeeze("plate "+pl.Name)) {
			t.Errorf("the settlement plot's legend lacks plate %q: %.300q", pl.Name, legend)
		}
	}
	marks := eval[[]int](t, ctx, `[...document.querySelectorAll("#plot-settlement path")].map(e => (e.getAttribute("d").match(/M/g) || []).length).filter(n => n > 20)`)
	for i, pl := range p.Monitoring.Plates {
		n := len(pl.Readings) - 1
		if !slices.Contains(marks, n) {
			t.Errorf("no path of %d marks for plate %d; paths with many subpaths: %v", n, i+1, marks)
		}
	}

	got := poll[string](t, ctx, `document.getElementById("asaoka-0-final")?.dataset.value`, 10*time.Second)
	final, err := strconv.ParseFloat(got, 64)
	if err != nil || !near(final, want.Final, 1e-9) {
		t.Errorf("Asaoka forecast in the page %q, natively %g", got, want.Final)
	}
	if s := eval[string](t, ctx, `document.getElementById("asaoka-0-final").textContent`); !strings.HasSuffix(s, " mm") {
		t.Errorf("forecast shows %q", s)
	}
	// The Asaoka plots are folded: open them.
	if eval[bool](t, ctx, `!!document.getElementById("plot-asaoka-0")`) {
		t.Error("the Asaoka plot is built before its fold is opened")
	}
	within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID("asaoka-plots-toggle")))
	if n := poll[int](t, ctx, `document.querySelectorAll("#plot-asaoka-0 path").length`, 10*time.Second); n < 5 {
		t.Errorf("the Asaoka plot has %d paths", n)
	}
	_, problems := rec.snapshot()
	for _, pr := range problems {
		t.Errorf("%s", pr)
	}
}
