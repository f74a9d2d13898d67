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

	"porelight/solver"
)

// TestE2EDrains switches drains on in the demo in the built page: the
// summary table of U, Uv and Uh matches the native solve (to the three
// digits shown), a spacing narrower than the drain shows its problem at
// its input, the design helper fills its table, the plan is drawn, the
// page fits 1366 and 400 px wide windows without sideways scrolling, and
// nothing goes to the network or the console.
func TestE2EDrains(t *testing.T) {
	pageURL, demo := builtPage(t)
	ctx, rec, shots := openAt(t, pageURL, "porelight-e2e-drains-", `!!document.getElementById("sum-flux")?.dataset.value && `+figuresDrawn)
	eval[chromedp.Void](t, ctx, `document.getElementById("drains-on").click()`)
	poll[bool](t, ctx, `!!document.getElementById("sum-drains-0")`, 45*time.Second)

	p := mustDecode(t, demo)
	p.Drains = &solver.Drains{Pattern: "triangular", Spacing: 1.5, Width: 0.1, Thickness: 0.004}
	native, err := solver.Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	cells := eval[[]string](t, ctx, `[...document.querySelectorAll("#sum-drains-0 td")].map(td => td.textContent)`)
	if len(cells) != 4 {
		t.Fatalf("first row of the drains table: %q", cells)
	}
	a := native.Drains.AtTimes[0]
	for i, want := range []float64{a.U, a.Uv, a.Uh} {
		got, err := strconv.ParseFloat(cells[i+1], 64)
		if err != nil || !near(got, 100*want, 0.006) {
			t.Errorf("column %d: page %q %%, native %.4g %% (± 0.6 %%, three digits)", i+1, cells[i+1], 100*want)
		}
	}
	if n := eval[int](t, ctx, `document.querySelectorAll("#plot-drain-plan path").length`); n < 3 {
		t.Errorf("the plan has %d paths", n)
	}

	typeInto(t, ctx, "drains-spacing", "0.01")
	poll[bool](t, ctx, `!!document.getElementById("drains-spacing-err")`, 10*time.Second)
	typeInto(t, ctx, "drains-spacing", "1.5")
	poll[bool](t, ctx, `!document.getElementById("drains-spacing-err")`, 10*time.Second)

	eval[chromedp.Void](t, ctx, `document.getElementById("drains-design-on").click()`)
	poll[bool](t, ctx, `!!document.getElementById("drains-design-time")`, 10*time.Second)
	typeInto(t, ctx, "drains-design-degree", "50")
	typeInto(t, ctx, "drains-design-time", "100")
	time.Sleep(500 * time.Millisecond)
	start := time.Now()
	eval[chromedp.Void](t, ctx, `document.getElementById("drains-design-run").click()`)
	poll[bool](t, ctx, `!!document.getElementById("drains-design-table")`, 60*time.Second)
	t.Logf("design helper in the page: %v", time.Since(start).Round(10*time.Millisecond))
	if s := eval[string](t, ctx, `document.getElementById("drains-design-status").textContent`); !strings.Contains(s, "Spacing") {
		t.Errorf("design status %q", s)
	}

	for _, w := range []int64{1366, 400} {
		within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := cdp.Call(ctx, tg, emulation.SetDeviceMetricsOverride, emulation.SetDeviceMetricsOverrideParams{Width: w, Height: 900, DeviceScaleFactor: 1})
			return err
		}))
		time.Sleep(300 * time.Millisecond)
		// The drains section keeps within its box (other sections' wide
		// tables are theirs to fit).
		js := `(() => { const s = document.getElementById("sec-drains").getBoundingClientRect();
			let m = 0; for (const e of document.querySelectorAll("#sec-drains *")) { m = Math.max(m, e.getBoundingClientRect().right - s.right); }
			return Math.round(m); })()`
		if over := eval[int](t, ctx, js); over > 1 {
			t.Errorf("at %d px an element of the drains section sticks out %d px", w, over)
		}
		eval[chromedp.Void](t, ctx, `document.getElementById("sec-drains").scrollIntoView()`)
		screenshot(t, ctx, shots, "drains-"+strconv.FormatInt(w, 10)+".png")
	}

	rec.requireLocal(t)
}
