//go:build !(js && wasm)

package static_test

import (
	"context"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"
)

// rangeProbe records, while the Monte Carlo runs, every count of runs
// answered together with whether the settlement band was drawn then.
const rangeProbe = `(() => {
	const R = window.__range = {seen: []};
	new MutationObserver(() => {
		const s = document.getElementById("range-status");
		if (!s || s.dataset.busy !== "true") return;
		const band = !!document.querySelector("#plot-range-settlement path[fill='#c9d5e2']");
		const last = R.seen[R.seen.length - 1];
		const d = Number(s.dataset.done);
		if (!last || last.done !== d || last.band !== band) R.seen.push({done: d, band});
	}).observe(document.body, {subtree: true, attributes: true, childList: true, characterData: true});
})()`

// TestE2ERange runs the demo's Monte Carlo in the built page: the runs
// are spread over the workers (one per core, so two on this machine),
// partial bands are drawn before the end, the same seed gives the same
// quantiles again, Stop ends a run and leaves the page working, a bad
// COV shows its problem at its input, the section fits 1366 and 400 px
// (its wide tables scroll inside their boxes),
// and nothing goes to the network or the console.
func TestE2ERange(t *testing.T) {
	pageURL, _ := builtPage(t)
	ctx, rec, shots := openAt(t, pageURL, "porelight-e2e-range-", `!!document.getElementById("sum-flux")?.dataset.value && `+figuresDrawn)
	eval[chromedp.Void](t, ctx, `document.getElementById("range-on").click()`)
	poll[bool](t, ctx, `!!document.getElementById("uncertainty-runs")`, 10*time.Second)
	typeInto(t, ctx, "uncertainty-layers-1-k", "-3")
	// The message of the whole text typed, "-3", not of the "-" before it.
	poll[bool](t, ctx, `(document.getElementById("uncertainty-layers-1-k-err")?.textContent || "").includes("≥ 0")`, 10*time.Second)
	typeInto(t, ctx, "uncertainty-layers-1-k", "70")
	typeInto(t, ctx, "uncertainty-runs", "200")
	poll[bool](t, ctx, `!document.getElementById("range-run").disabled`, 10*time.Second)
	eval[chromedp.Void](t, ctx, rangeProbe)

	run := func() (p50 string) {
		t.Helper()
		eval[chromedp.Void](t, ctx, `document.getElementById("range-run").click()`)
		poll[bool](t, ctx, `(() => { const s = document.getElementById("range-status").dataset; return s.busy === "false" && s.done === "200"; })()`, 120*time.Second)
		return eval[string](t, ctx, `document.querySelector("#range-t90 td[data-value]").dataset.value`)
	}
	first := run()
	if x, err := strconv.ParseFloat(first, 64); err != nil || !(x > 0) {
		t.Fatalf("P50 of t90 %q", first)
	}
	seen := eval[[]struct {
		Done int  `json:"done"`
		Band bool `json:"band"`
	}](t, ctx, `window.__range.seen`)
	partial := false
	for _, s := range seen {
		partial = partial || (s.Band && s.Done > 0 && s.Done < 200)
	}
	if !partial {
		t.Errorf("no band was drawn before the end: %+v", seen)
	}
	stats := eval[map[string]any](t, ctx, `porelightWorkers.stats()`)
	cores := eval[float64](t, ctx, `navigator.hardwareConcurrency || 2`)
	if w, _ := stats["workers"].(float64); w != min(cores, 8) {
		t.Errorf("%v workers for %v cores", stats["workers"], cores)
	}
	if status := eval[string](t, ctx, `document.getElementById("range-status").textContent`); !strings.Contains(status, "background workers") {
		t.Errorf("status %q", status)
	}
	for _, id := range []string{"plot-range-settlement", "plot-range-degree", "plot-range-t90", "plot-range-sensitivity"} {
		if n := eval[int](t, ctx, `document.querySelectorAll("#`+id+` path").length`); n < 3 {
			t.Errorf("#%s has %d paths", id, n)
		}
	}
	if again := run(); again != first {
		t.Errorf("the same seed gave P50 t90 %s, then %s", first, again)
	}

	// Stop: a long run, stopped once some runs are in.
	typeInto(t, ctx, "uncertainty-runs", "5000")
	poll[bool](t, ctx, `!document.getElementById("range-run").disabled`, 10*time.Second)
	eval[chromedp.Void](t, ctx, `document.getElementById("range-run").click()`)
	poll[bool](t, ctx, `Number(document.getElementById("range-status").dataset.done) > 0`, 60*time.Second)
	eval[chromedp.Void](t, ctx, `document.getElementById("range-stop").click()`)
	poll[bool](t, ctx, `document.getElementById("range-status").dataset.busy === "false"`, 10*time.Second)
	if s := eval[string](t, ctx, `document.getElementById("range-status").textContent`); !strings.HasPrefix(s, "Stopped after") {
		t.Errorf("after Stop: %q", s)
	}
	// The page still solves: an edit updates the summary.
	before := eval[string](t, ctx, `document.getElementById("sum-flux").dataset.value`)
	typeInto(t, ctx, "layers-1-k", "3e-9")
	poll[bool](t, ctx, `document.getElementById("sum-flux").dataset.value !== `+strconv.Quote(before), 30*time.Second)

	for _, w := range []int64{1366, 400} {
		within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := cdp.Call(ctx, tg, emulation.SetDeviceMetricsOverride, emulation.SetDeviceMetricsOverrideParams{Width: w, Height: 900, DeviceScaleFactor: 1})
			return err
		}))
		time.Sleep(300 * time.Millisecond)
		js := `(() => { const s = document.getElementById("sec-range").getBoundingClientRect();
			let m = 0, what = ""; for (const e of document.querySelectorAll("#sec-range *")) {
				if (e.parentElement.closest(".pl-scrollx")) continue; // scrolls inside its box
				const d = e.getBoundingClientRect().right - s.right;
				if (d > m) { m = d; what = e.tagName + (e.id ? "#" + e.id : "") + "." + e.className; } }
			return Math.round(m) + " " + what; })()`
		over, what, _ := strings.Cut(eval[string](t, ctx, js), " ")
		if n, _ := strconv.Atoi(over); n > 1 {
			t.Errorf("at %d px an element of the range section sticks out %d px: %s", w, n, what)
		}
		eval[chromedp.Void](t, ctx, `document.getElementById("sec-range").scrollIntoView()`)
		screenshot(t, ctx, shots, "range-"+strconv.FormatInt(w, 10)+".png")
	}
	t.Logf("screenshots in %s", shots)

	rec.requireLocal(t)
}
