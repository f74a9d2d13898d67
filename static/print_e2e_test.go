//go:build !(js && wasm)

package static_test

// The printout on A4 and Letter, portrait: the page's print style sheet
// laid out at the width inside each paper's margins (print media
// emulated), with every fold open as Print report opens them.

import (
	"context"
	"fmt"
	"math"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"
)

func printMedia(t *testing.T, ctx context.Context, media string) {
	t.Helper()
	within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		_, err := cdp.Call(ctx, tg, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: media})
		return err
	}))
}

// TestE2EPrintWidths checks that at the printable width of A4 (210 mm)
// and Letter (8.5 in), less the style sheet's 11 mm side margins, nothing
// reaches past the paper, the cautions print, empty inputs print the
// values used, the running header names the project and counts pages,
// and each plot has a caption.
func TestE2EPrintWidths(t *testing.T) {
	pageURL, _ := builtPage(t)
	ctx := browser(t, &recorder{})
	within(t, ctx, 60*time.Second, chromedp.Navigate(pageURL))
	poll[bool](t, ctx, upToDate, 60*time.Second)
	for _, id := range []string{"tables-toggle", "records-toggle", "asaoka-plots-toggle"} {
		eval[chromedp.Void](t, ctx, fmt.Sprintf(`document.getElementById(%q).click()`, id))
	}
	poll[bool](t, ctx, `!!document.getElementById("steady-table") && !!document.getElementById("records-body") && !!document.getElementById("plot-asaoka-0")`, 10*time.Second)
	const pxPerMM = 96 / 25.4 // CSS pixels (CSS Values and Units: 1in = 96px = 25.4mm)
	for _, paper := range []struct {
		name  string
		width float64 // mm
	}{{"A4", 210}, {"Letter", 215.9}} {
		t.Run(paper.name, func(t *testing.T) {
			w := int64(math.Floor((paper.width - 2*11) * pxPerMM))
			viewport(t, ctx, w, 1000)
			printMedia(t, ctx, "print")
			defer printMedia(t, ctx, "")
			over := eval[[]string](t, ctx, `(() => {
				const W = innerWidth + 1, out = [];
				for (const e of document.querySelectorAll("#app *")) {
					const r = e.getBoundingClientRect();
					if (!r.width || r.right <= W) continue;
					if (e.parentElement && e.parentElement.getBoundingClientRect().right > W) continue; // the outermost only
					out.push((e.id || e.className || e.tagName) + " to " + Math.round(r.right) + " px");
				}
				return out.slice(0, 12);
			})()`)
			for _, o := range over {
				t.Errorf("past the paper's %d px: %s", w, o)
			}
			for _, id := range []string{"caution", "mon-caution"} {
				if eval[string](t, ctx, fmt.Sprintf(`getComputedStyle(document.getElementById(%q)).display`, id)) == "none" {
					t.Errorf("#%s does not print", id)
				}
			}
			// Layer 2 of the demo leaves γ moist empty: it prints its γsat.
			gsat := eval[string](t, ctx, `document.getElementById("layers-1-gammaSat").value`)
			used := eval[string](t, ctx, `getComputedStyle(document.getElementById("layers-1-gamma").parentElement, "::after").content`)
			if gsat == "" || used != `"`+gsat+`"` {
				t.Errorf("the empty γ moist of layer 2 prints %s, want its γsat %q", used, gsat)
			}
			if n := eval[[]string](t, ctx, `[...document.querySelectorAll(".pl-field input")].filter(e => e.value === "" && e.placeholder && getComputedStyle(e).display === "none" && !e.parentElement.dataset.used).map(e => e.id + " (" + e.placeholder + ")")`); len(n) > 0 {
				t.Errorf("empty inputs print nothing for the value they stand for: %v", n)
			}
			header := eval[string](t, ctx, `document.getElementById("print-margins").textContent`)
			title := eval[string](t, ctx, `document.getElementById("title").value`)
			for _, want := range []string{title, "printed ", "counter(page)", "counter(pages)", "rev. "} {
				if !strings.Contains(header, want) {
					t.Errorf("the running header %q lacks %q", header, want)
				}
			}
			caps := eval[[]string](t, ctx, `[...document.querySelectorAll("#plots figure")].map(f => { const c = f.querySelector(".pl-caption"); return c && getComputedStyle(c).display !== "none" ? c.textContent : ""; })`)
			for i, c := range caps {
				if !strings.HasPrefix(c, fmt.Sprintf("Figure %d. ", i+1)) {
					t.Errorf("plot %d prints the caption %q", i+1, c)
				}
			}
		})
	}
}
