//go:build !(js && wasm)

package static_test

import (
	"bytes"
	"compress/flate"
	"context"
	"encoding/base64"
	"os"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"

	"porelight/solver"
)

// linkTo is the share link of a project file: the page's URL fragment
// format ("#p=" + base64url(raw deflate(JSON)), as ui.EncodeFragment
// writes it).
func linkTo(t *testing.T, pageURL string, project []byte) string {
	t.Helper()
	var buf bytes.Buffer
	w, err := flate.NewWriter(&buf, flate.BestCompression)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := w.Write(project); err != nil {
		t.Fatal(err)
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	return pageURL + "#p=" + base64.RawURLEncoding.EncodeToString(buf.Bytes())
}

// TestE2EExcavation opens the excavation example in the built page: the
// summary's least uplift and heave factors equal the native solve's, the
// plot of the factors against time is drawn, the new inputs are there
// (excavation stage, outlet mark, leaky end), the summary and the load
// table fit 1024, 1366, 1920 and 400 px wide windows, and nothing goes
// to the network or the console.
func TestE2EExcavation(t *testing.T) {
	pageURL, _ := builtPage(t)
	raw, err := os.ReadFile("../testdata/excavation.json")
	if err != nil {
		t.Fatal(err)
	}
	ctx, rec, shots := openAt(t, linkTo(t, pageURL, raw), "porelight-e2e-excavation-", `!!document.getElementById("sum-prism")?.dataset.value`)
	native, err := solver.Solve(mustDecode(t, raw), nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		id   string
		want float64
	}{{"sum-prism", native.Summary.Prism.Factor}, {"sum-heave", native.Summary.Heave.Factor}, {"sum-uplift", native.Summary.Uplift.Factor}} {
		if got := dataValue(t, ctx, c.id); !near(got, c.want, 1e-12) {
			t.Errorf("#%s = %.10g in the page, %.10g natively", c.id, got, c.want)
		}
	}
	if n := poll[int](t, ctx, `document.querySelectorAll("#plot-checks path[d^='M']").length`, 20*time.Second); n < 3 {
		t.Errorf("#plot-checks has %d drawn paths", n)
	}
	for _, id := range []string{"loads-0-dig-depth", "loads-0-dig-waterLevel", "layers-2-outlet", "loads-dig-note"} {
		if !eval[bool](t, ctx, `!!document.getElementById("`+id+`")`) {
			t.Errorf("no #%s", id)
		}
	}
	if !eval[bool](t, ctx, `!!document.querySelector("#top-drained option[value=leaky]")`) {
		t.Error("the drainage editor offers no leaky end")
	}
	if s := eval[string](t, ctx, `document.getElementById("summary").textContent`); !strings.Contains(s, "below the original top") {
		t.Error("the summary does not say where the governing check acts")
	}
	for _, w := range []int64{1024, 1366, 1920, 400} {
		within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := cdp.Call(ctx, tg, emulation.SetDeviceMetricsOverride, emulation.SetDeviceMetricsOverrideParams{Width: w, Height: 900, DeviceScaleFactor: 1})
			return err
		}))
		time.Sleep(300 * time.Millisecond)
		for _, sec := range []string{"summary", "sec-loads"} {
			js := `(() => { const s = document.getElementById("` + sec + `").getBoundingClientRect();
				let m = 0; for (const e of document.querySelectorAll("#` + sec + ` *")) { if (e.closest(".pl-scrollx")) continue; m = Math.max(m, e.getBoundingClientRect().right - s.right); }
				return Math.round(m); })()`
			if over := eval[int](t, ctx, js); over > 1 {
				t.Errorf("at %d px an element of #%s sticks out %d px", w, sec, over)
			}
		}
		eval[chromedp.Void](t, ctx, `document.getElementById("sec-loads").scrollIntoView()`)
		screenshot(t, ctx, shots, "excavation-loads-"+strconv.FormatInt(w, 10)+".png")
		eval[chromedp.Void](t, ctx, `document.getElementById("summary").scrollIntoView()`)
		screenshot(t, ctx, shots, "excavation-summary-"+strconv.FormatInt(w, 10)+".png")
	}
	rec.requireLocal(t)
}
