//go:build !(js && wasm)

package static_test

import (
	"context"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"

	"porelight/solver"
)

// TestE2EDecisions works out the demo's site decisions in the built page:
// the settlement after handover per layer matches the native solve (to the
// 0.1 mm shown), the removal day and each lift's earliest day read as
// the native answers, the demo's piezometer record is compared with its
// predicted pore pressure ratio, a handover after the design life shows its problem
// at its input, the section fits 1024, 1366, 1920 and 400 px wide windows
// (its tables scroll sideways within it),
// and nothing goes to the network or the console.
func TestE2EDecisions(t *testing.T) {
	pageURL, demo := builtPage(t)
	ctx, rec, shots := openAt(t, pageURL, "porelight-e2e-decisions-", `!!document.getElementById("decisions-residual-0")`)

	p := mustDecode(t, demo)
	native, err := solver.Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	for i, l := range native.Residual.Layers {
		cells := eval[[]string](t, ctx, fmt.Sprintf(`[...document.querySelectorAll("#decisions-residual-%d td")].map(td => td.textContent)`, i))
		got, err := strconv.ParseFloat(cells[3], 64)
		if err != nil || math.Abs(got-1000*l.Total) > 0.051 {
			t.Errorf("layer %d after handover: page %q mm, native %.4g mm (shown to 0.1 mm)", i+1, cells[3], 1000*l.Total)
		}
	}

	start := time.Now()
	eval[chromedp.Void](t, ctx, `document.getElementById("decisions-run").click()`)
	poll[bool](t, ctx, `!!document.getElementById("decisions-removal") && !!document.getElementById("decisions-lift-1")`, 120*time.Second)
	t.Logf("decisions worked out in the page: %v", time.Since(start).Round(10*time.Millisecond))
	plan, err := solver.SurchargeRemoval(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	removal := eval[string](t, ctx, `document.getElementById("decisions-removal").textContent`)
	if want := fmt.Sprintf("(day %.0f)", math.Ceil(*plan.RemoveOn)); !strings.Contains(removal, want) {
		t.Errorf("removal text %q does not name %s", removal, want)
	}
	sg, err := solver.StrengthGain(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	for i, l := range sg.Lifts {
		cells := eval[[]string](t, ctx, fmt.Sprintf(`[...document.querySelectorAll("#decisions-lift-%d td")].map(td => td.textContent)`, i))
		if l.Earliest != nil && !strings.Contains(cells[6], fmt.Sprintf("(day %.0f)", math.Ceil(*l.Earliest))) && !(*l.Earliest < 10 && strings.Contains(cells[6], "day ")) {
			t.Errorf("lift %d earliest %q, native day %.4g", i+1, cells[6], *l.Earliest)
		}
	}
	if n := eval[int](t, ctx, `document.querySelectorAll("#plot-surcharge path").length`); n < 4 {
		t.Errorf("the surcharge plot has %d paths", n)
	}
	// The piezometer record of the demo is compared with its prediction.
	if cells := eval[[]string](t, ctx, `[...document.querySelectorAll("#decisions-ratio-0 td")].map(td => td.textContent)`); len(cells) != 6 || cells[2] == "–" {
		t.Errorf("first row of the pore pressure ratios: %q", cells)
	}

	typeInto(t, ctx, "decisions-handover", "99999")
	poll[bool](t, ctx, `!!document.getElementById("decisions-handover-err")`, 10*time.Second)
	typeInto(t, ctx, "decisions-handover", "1500")
	poll[bool](t, ctx, `!document.getElementById("decisions-handover-err")`, 10*time.Second)

	for _, w := range []int64{1024, 1366, 1920, 400} {
		within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := cdp.Call(ctx, tg, emulation.SetDeviceMetricsOverride, emulation.SetDeviceMetricsOverrideParams{Width: w, Height: 900, DeviceScaleFactor: 1})
			return err
		}))
		time.Sleep(300 * time.Millisecond)
		js := `(() => { const s = document.getElementById("decisions").getBoundingClientRect();
			let m = 0; for (const e of document.querySelectorAll("#decisions *")) { if (!e.closest(".pl-scrollx")) m = Math.max(m, e.getBoundingClientRect().right - s.right); }
			return Math.round(m); })()`
		if over := eval[int](t, ctx, js); over > 1 {
			who := eval[string](t, ctx, `(() => { const s = document.getElementById("decisions").getBoundingClientRect(); let w = "";
				for (const e of document.querySelectorAll("#decisions *")) { if (!e.closest(".pl-scrollx") && e.getBoundingClientRect().right - s.right > 1) w += e.tagName + "#" + e.id + "." + e.className + " "; } return w; })()`)
			t.Errorf("at %d px an element of the decisions section sticks out %d px: %s", w, over, who)
		}
		eval[chromedp.Void](t, ctx, `document.getElementById("decisions").scrollIntoView()`)
		screenshot(t, ctx, shots, "decisions-"+strconv.FormatInt(w, 10)+".png")
		// The section alone, to read it at a glance.
		c, cancel := context.WithTimeout(ctx, 30*time.Second)
		png, err := chromedp.Run(c, chromedp.Screenshot("#decisions"))
		cancel()
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(shots, "decisions-section-"+strconv.FormatInt(w, 10)+".png"), png, 0o644); err != nil {
			t.Fatal(err)
		}
	}

	rec.requireLocal(t)
}
