//go:build !(js && wasm)

package static_test

// After a solve the page draws the figures in view first and the others
// in one more render once the browser has painted (ui/inview.go): every
// figure ends up drawn from the new results, the ones out of view a
// frame or so later, and porelightInView tells them apart.

import (
	"encoding/json"
	"fmt"
	"os"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"
)

func TestE2EInViewFirst(t *testing.T) {
	// A project with no solves of its own after the main one: the demo's
	// site decisions solve again, and render, after every result, which
	// would draw the figures left out of view even without the render
	// asked for after the paint.
	pageURL, _ := builtPage(t)
	raw, err := os.ReadFile("../testdata/consolidation/olson-ramp.json")
	if err != nil {
		t.Fatal(err)
	}
	var tc struct {
		Project json.RawMessage `json:"project"`
	}
	if err := json.Unmarshal(raw, &tc); err != nil {
		t.Fatal(err)
	}
	ctx, rec, _ := openAt(t, pageURL+fragment(t, tc.Project), "inview", upToDate)
	if title := eval[string](t, ctx, `document.getElementById("title").value`); !strings.HasPrefix(title, "Reference") {
		t.Fatalf("the page opened %q, not the reference project", title)
	}
	// The first results came with the results column at its top, every
	// figure out of view: all are drawn, by the render after the paint.
	poll[bool](t, ctx, `[...document.querySelectorAll("svg.porelight-chart")].every(s => !s.textContent.includes("No results yet"))`, 10*time.Second)

	// A user watching the isochrones while editing the layer: the results
	// column scrolled to them, the degree of consolidation below the
	// window.
	eval[chromedp.Void](t, ctx, `document.getElementById("plot-isochrones").scrollIntoView({block: "center"})`)
	last := "plot-degree"
	inView := func(id string) bool { return eval[bool](t, ctx, fmt.Sprintf(`porelightInView(%q)`, id)) }
	if !inView("plot-isochrones") {
		t.Error("porelightInView: the isochrones scrolled into view are not")
	}
	if inView(last) {
		t.Fatalf("porelightInView: %s, below the window, is in view", last)
	}
	// Each batch of changes to a figure's drawing, in order: the batches
	// of one render come together, those of the next after the paint.
	eval[chromedp.Void](t, ctx, `window.__drawn = []; new MutationObserver(ms => {
		const ids = new Set(ms.filter(m => m.type === "childList" && m.target.nodeName === "g").map(m => m.target.closest("svg")?.id));
		if (ids.size) window.__drawn.push([...ids]);
	}).observe(document.querySelector(".pl-results"), {subtree: true, childList: true})`)
	body := func(id string) string {
		return eval[string](t, ctx, fmt.Sprintf(`document.getElementById(%q).innerHTML`, id))
	}
	seen, far := body("plot-isochrones"), body(last)
	paste(t, ctx, "layers-0-k", "4.4e-9")
	poll[bool](t, ctx, fmt.Sprintf(`document.getElementById("plot-isochrones").innerHTML !== %q && `+upToDate, seen), 20*time.Second)
	// Drawn by the render after the paint, with nothing else happening.
	poll[bool](t, ctx, fmt.Sprintf(`document.getElementById(%q).innerHTML !== %q`, last, far), 10*time.Second)
	drawn := eval[[][]string](t, ctx, `window.__drawn`)
	first := -1
	for i, b := range drawn {
		for _, id := range b {
			if id == "plot-isochrones" && first < 0 {
				first = i
			}
		}
	}
	if first < 0 {
		t.Fatalf("no change to the isochrones was seen: %v", drawn)
	}
	for _, id := range drawn[first] {
		if id == last {
			t.Errorf("%s, out of view, was drawn in the same render as the isochrones in view: %v", last, drawn)
		}
	}

	eval[chromedp.Void](t, ctx, fmt.Sprintf(`document.getElementById(%q).scrollIntoView()`, last))
	if !inView(last) {
		t.Errorf("porelightInView: %s is not in view once scrolled into view", last)
	}
	rec.requireLocal(t)
}
