//go:build !(js && wasm)

package static_test

// A keystroke re-sends only what changed (wasm/same.go): an element the
// render did not change is left as it is, attributes the page did not
// set included, while a changed element is synced as before (attributes
// it did not set removed), and the buttons inside the parts left alone
// still do what they do.

import (
	"testing"
	"time"

	"github.com/chromedp/chromedp"
)

func TestE2ESame(t *testing.T) {
	pageURL, _ := builtPage(t)
	ctx, rec, _ := openAt(t, pageURL, "same", upToDate)
	// Attributes the page never sets, on a figure the keystroke leaves
	// alone and on the input it changes.
	eval[chromedp.Void](t, ctx, `document.getElementById("fig-isochrones").setAttribute("data-probe", "1");
		document.getElementById("title").setAttribute("data-probe", "1")`)
	within(t, ctx, 10*time.Second, chromedp.Focus(chromedp.ID("title")))
	within(t, ctx, 10*time.Second, chromedp.KeyEvent("x"))
	poll[bool](t, ctx, `document.getElementById("title").value.endsWith("x") && !document.getElementById("title").hasAttribute("data-probe")`, 10*time.Second)
	if !eval[bool](t, ctx, `document.getElementById("fig-isochrones").getAttribute("data-probe") === "1"`) {
		t.Error("the isochrone figure, unchanged by the keystroke, was sent again (its extra attribute is gone)")
	}
	// A click in a part left alone reaches the handler of this build:
	// Undo, unchanged by the keystroke, takes the keystroke back.
	within(t, ctx, 10*time.Second, chromedp.Click(chromedp.ID("undo")))
	poll[bool](t, ctx, `!document.getElementById("title").value.endsWith("x")`, 10*time.Second)
	rec.requireLocal(t)
}
