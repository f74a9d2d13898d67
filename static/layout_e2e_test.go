//go:build !(js && wasm)

package static_test

// Layouts that fit: at the widths of a phone, a wiki frame and the usual
// laptop and desktop screens nothing covers anything else, the page never
// scrolls sideways (tables scroll inside their box), and on a laptop the
// results stay in view beside the inputs being edited.

import (
	"context"
	"fmt"
	"strconv"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"
)

// viewport sets the page's viewport, CSS pixels.
func viewport(t *testing.T, ctx context.Context, w, h int64) {
	t.Helper()
	within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		_, err := cdp.Call(ctx, tg, emulation.SetDeviceMetricsOverride, emulation.SetDeviceMetricsOverrideParams{Width: w, Height: h, DeviceScaleFactor: 1})
		return err
	}))
	time.Sleep(300 * time.Millisecond)
}

// coveredControls scrolls every visible control (input, button, select,
// textarea) to the middle of its scroll boxes and the window, and lists
// those the browser does not find at their own centre: something else is
// drawn over them. Controls hidden on purpose (pl-vh, a file input behind
// its label) are skipped.
const coveredControls = `(() => {
	const out = [];
	for (const el of document.querySelectorAll("#app input, #app button, #app select, #app textarea")) {
		if (el.closest(".pl-vh") || el.classList.contains("pl-vh") || !el.getClientRects().length) continue;
		const shut = el.closest("details:not([open])");
		if (shut && !el.closest("summary")) continue;
		if (getComputedStyle(el).visibility === "hidden") continue;
		el.scrollIntoView({block: "center", inline: "center"});
		const r = el.getBoundingClientRect();
		const x = r.left + r.width / 2, y = r.top + r.height / 2;
		if (x < 0 || y < 0 || x >= innerWidth || y >= innerHeight) { out.push((el.id || el.outerHTML.slice(0, 60)) + " off screen"); continue; }
		const hit = document.elementFromPoint(x, y);
		if (!hit || !(el === hit || el.contains(hit) || (hit.control === el))) {
			out.push((el.id || el.outerHTML.slice(0, 60)) + " under " + (hit ? (hit.id || hit.className || hit.tagName) : "nothing"));
		}
	}
	scrollTo(0, 0);
	for (const e of document.querySelectorAll(".pl-inputs, .pl-results, .pl-sec")) { e.scrollTop = 0; e.scrollLeft = 0; }
	return out;
})()`

// TestE2ELayout checks the page at widths from 360 px up.
func TestE2ELayout(t *testing.T) {
	pageURL, _ := builtPage(t)
	ctx := browser(t, &recorder{})
	within(t, ctx, 60*time.Second, chromedp.Navigate(pageURL))
	poll[bool](t, ctx, upToDate, 60*time.Second)
	shots := t.TempDir()
	for _, vp := range []struct {
		w, h     int64
		together bool // inputs and results side by side, results in view
	}{
		{360, 740, false}, {400, 800, false}, {900, 700, false},
		{1024, 700, true}, {1280, 800, true}, {1366, 768, true}, {1920, 1080, true},
	} {
		t.Run(fmt.Sprintf("%dx%d", vp.w, vp.h), func(t *testing.T) {
			viewport(t, ctx, vp.w, vp.h)
			if sw := eval[int](t, ctx, `document.documentElement.scrollWidth - innerWidth`); sw > 0 {
				wide := eval[[]string](t, ctx, `[...document.querySelectorAll("body *")].filter(e => {
					if (e.getBoundingClientRect().right <= innerWidth + 1) return false;
					for (let a = e.parentElement; a; a = a.parentElement) {
						if (getComputedStyle(a).overflowX !== "visible" && a.getBoundingClientRect().right <= innerWidth + 1) return false;
						if (a.getBoundingClientRect().right > innerWidth + 1 && a !== document.body && a !== document.documentElement) return false; // report the outermost only
					}
					return true;
				}).slice(0, 8).map(e => (e.id || e.className || e.tagName) + " " + Math.round(e.getBoundingClientRect().right))`)
				t.Errorf("the page scrolls sideways by %d px; reaching past the window, outside the scrolling sections: %v", sw, wide)
			}
			for _, c := range eval[[]string](t, ctx, coveredControls) {
				t.Errorf("covered: %s", c)
			}
			if vp.together {
				// Beside each other, and while the layer table (the
				// first editor) is in view, so is the summary.
				side := eval[bool](t, ctx, `document.querySelector(".pl-results").getBoundingClientRect().left >= document.querySelector(".pl-inputs").getBoundingClientRect().right - 1`)
				if !side {
					t.Error("the results are not beside the inputs")
				}
				for _, id := range []string{"sec-layers", "sec-loads", "sec-outputs"} {
					// The summary's t50 (near its top, changed by every
					// one of these editors) stands for the results: the
					// summary grows below it with the analyses a project
					// asks for (residual settlement, heave and uplift).
					// As the wheel does: the inputs column scrolls to the
					// section, the window stays where the columns fill it.
					js := fmt.Sprintf(`(() => { scrollTo(0, document.querySelector(".pl-main").getBoundingClientRect().top + scrollY);
						const col = document.querySelector(".pl-inputs");
						col.scrollTop += document.getElementById(%q).getBoundingClientRect().top - col.getBoundingClientRect().top;
						const s = document.getElementById("sum-t50").getBoundingClientRect();
						const ok = s.top >= 0 && s.bottom <= innerHeight; scrollTo(0, 0); col.scrollTop = 0; return ok; })()`, id)
					if !eval[bool](t, ctx, js) {
						t.Errorf("with #%s in view the summary's t50 is out of view: %s", id, eval[string](t, ctx, fmt.Sprintf(`(() => { document.getElementById(%q).scrollIntoView({block: "start"});
						const s = document.getElementById("sum-t50").getBoundingClientRect(), r = document.querySelector(".pl-results").getBoundingClientRect();
						const o = JSON.stringify({s: [s.top, s.bottom], r: [r.top, r.bottom], st: getComputedStyle(document.querySelector(".pl-results")).position, h: innerHeight}); scrollTo(0, 0); return o; })()`, id)))
					}
				}
			} else if n := eval[float64](t, ctx, `document.getElementById("sum-flux").getBoundingClientRect().width`); n <= 0 {
				t.Error("the summary's flux is not shown")
			}
			screenshot(t, ctx, shots, "layout-"+strconv.FormatInt(vp.w, 10)+".png")
		})
	}
	// A phone edits a value: layer 1's thickness, typed, changes the
	// results.
	viewport(t, ctx, 400, 800)
	before := eval[string](t, ctx, `document.getElementById("sum-flux").dataset.value`)
	typeInto(t, ctx, "layers-0-thickness", "3.5")
	poll[bool](t, ctx, fmt.Sprintf(`document.getElementById("sum-flux").dataset.value !== %q && `+upToDate, before), 30*time.Second)
}
