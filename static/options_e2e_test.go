//go:build !(js && wasm)

package static_test

import (
	"fmt"
	"strconv"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"porelight/solver"
	optcmp "porelight/solver/compare"
)

// TestE2EOptions adds two options to the demo in the built page and
// compares them, then places five sections along an alignment: the table's final settlements equal package compare's
// native solves of the same options (the full-precision data-value, to
// 10⁻⁹ relative: JSON and the binary form carry floats exactly; the wasm
// build may differ from the native one in the last bits), both overlay
// plots, the profile and its four spans are drawn, and nothing goes to
// the console.
func TestE2EOptions(t *testing.T) {
	pageURL, demo := builtPage(t)
	rec := &recorder{}
	ctx := browser(t, rec)
	within(t, ctx, 60*time.Second, chromedp.Navigate(pageURL))
	poll[bool](t, ctx, `!!document.getElementById("sum-flux")?.dataset.value && `+figuresDrawn, 45*time.Second)
	eval[chromedp.Void](t, ctx, `document.getElementById("options-add").click()`)
	poll[bool](t, ctx, `!!document.getElementById("variants-0-loads-1-q")`, 10*time.Second)
	typeInto(t, ctx, "variants-0-loads-1-q", "45")
	eval[chromedp.Void](t, ctx, `document.getElementById("options-add").click()`)
	poll[bool](t, ctx, `!!document.getElementById("variants-1-layers-3-mv")`, 10*time.Second)
	typeInto(t, ctx, "variants-1-name", "softer lower clay")
	typeInto(t, ctx, "variants-1-layers-3-mv", "-1")
	poll[bool](t, ctx, `!!document.getElementById("variants-1-layers-3-mv-err")`, 10*time.Second)
	typeInto(t, ctx, "variants-1-layers-3-mv", "0.0015")
	poll[bool](t, ctx, `!document.getElementById("variants-1-layers-3-mv-err") && !document.getElementById("options-run").disabled`, 10*time.Second)
	eval[chromedp.Void](t, ctx, `document.getElementById("options-run").click()`)
	poll[bool](t, ctx, `document.getElementById("options-status").dataset.busy === "false" && !!document.getElementById("options-row-2")`, 60*time.Second)

	p := mustDecode(t, demo)
	q := 45.0
	mv := 0.0015
	p.Variants = []solver.Variant{
		{Name: "Option 1", Loads: []solver.LoadChange{{}, {Q: &q}, {}}},
		{Name: "softer lower clay", Layers: []solver.LayerChange{{}, {}, {}, {Mv: &mv}, {}}},
	}
	want := optcmp.Solve(p, nil)
	for i, o := range want {
		got := eval[string](t, ctx, fmt.Sprintf(`document.querySelector("#options-row-%d td[data-value]")?.dataset.value ?? ""`, i))
		x, err := strconv.ParseFloat(got, 64)
		if err != nil || !near(x, o.Figures.Final, 1e-9) {
			t.Errorf("%s: final settlement on the page %q m, native %.9g m", o.Name, got, o.Figures.Final)
		}
	}
	for _, id := range []string{"plot-options-settlement", "plot-options-degree"} {
		if n := eval[int](t, ctx, `document.querySelectorAll("#`+id+` path[clip-path]").length`); n < 3 {
			t.Errorf("#%s has %d curves", id, n)
		}
	}
	// Five sections from the three columns: the profile and its four
	// spans are drawn.
	for range 5 {
		eval[chromedp.Void](t, ctx, `document.getElementById("alignment-add").click()`)
	}
	poll[bool](t, ctx, `!!document.getElementById("alignment-sections-4-option")`, 10*time.Second)
	for i, opt := range []string{"", "Option 1", "Option 1", "softer lower clay", ""} {
		eval[chromedp.Void](t, ctx, fmt.Sprintf(`(() => { const s = document.getElementById("alignment-sections-%d-option"); s.value = %q; s.dispatchEvent(new Event("change", {bubbles: true})); })()`, i, opt))
	}
	typeInto(t, ctx, "alignment-limit", "0.002")
	poll[bool](t, ctx, `!document.getElementById("options-run").disabled`, 10*time.Second)
	time.Sleep(300 * time.Millisecond)
	eval[chromedp.Void](t, ctx, `document.getElementById("options-run").click()`)
	if n := poll[int](t, ctx, `document.getElementById("options-status").dataset.busy === "false" && document.querySelectorAll("#alignment-spans tbody tr").length`, 60*time.Second); n != 4 {
		t.Errorf("%d spans, want 4", n)
	}
	if n := eval[int](t, ctx, `document.querySelectorAll("#plot-alignment path[clip-path]").length`); n < 1 {
		t.Error("no profile drawn")
	}

	rec.requireLocal(t)
}
