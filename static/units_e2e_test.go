//go:build !(js && wasm)

package static_test

// Browser test of the display units: a project entered from nothing in
// US customary units saves the same SI numbers as the one typed in SI,
// and the choice survives a reload.

import (
	"math"
	"testing"
	"time"
)

// The SI values by hand from the exact definitions (NIST Special
// Publication 811, 2008, appendix B): 1 ft = 0.3048 m, 1 lbf =
// 4.4482216152605 N, so 1 psf = 47.880259 Pa, 1 pcf = 157.087464 N/m³,
// 1 ft²/kip = 0.0208854 1/kPa, 1 ft/day = 0.3048/86 400 m/s.
const (
	ft  = 0.3048
	lbf = 4.4482216152605e-3 // kN
	day = 86400.0
)

func TestE2EUnits(t *testing.T) {
	pageURL, _ := builtPage(t)
	rec := &recorder{}
	ctx := browser(t, rec)
	downloads := allowDownloads(t, ctx)
	open(t, ctx, pageURL)
	click(t, ctx, "new-project")
	if eval[bool](t, ctx, `!!document.getElementById("confirm-replace")`) {
		click(t, ctx, "confirm-replace")
	}
	poll[bool](t, ctx, `document.getElementById("layers-0-name")?.value === "Layer 1"`, 10*time.Second)
	setSelect(t, ctx, "units", "us")
	poll[bool](t, ctx, `document.querySelector("#layers thead").textContent.includes("ft")`, 10*time.Second)

	typed := []struct {
		id, text string
		si       float64 // the value the file must hold
		path     string  // JavaScript path in the project
	}{
		{"layers-0-thickness", "32.8", 32.8 * ft, "layers[0].thickness"},
		{"layers-0-gammaSat", "110", 110 * lbf / (ft * ft * ft), "layers[0].gammaSat"},
		{"layers-0-k", "0.0002", 0.0002 * ft / day, "layers[0].k"},
		{"layers-0-mv", "0.03", 0.03 * ft * ft / (1000 * lbf), "layers[0].mv"},
		{"loads-0-q", "1500", 1500 * lbf / (ft * ft), "loads[0].q"},
		{"waterTable", "3", 3 * ft, "waterTable"},
	}
	for _, c := range typed {
		typeInto(t, ctx, c.id, c.text)
	}
	poll[bool](t, ctx, draftJS+`.loads[0].q > 70 && `+draftJS+`.waterTable > 0.9`, 10*time.Second)
	poll[bool](t, ctx, `!document.getElementById("status").textContent.startsWith("Solving")`, 30*time.Second)
	if s := eval[string](t, ctx, `document.getElementById("sum-settlement-linear").textContent`); len(s) < 4 || s[len(s)-3:] != " in" {
		t.Errorf("the settlement in US units reads %q, want inches", s)
	}

	click(t, ctx, "save-project")
	data := downloaded(t, downloads, "*.json")
	p := mustDecode(t, data)
	got := map[string]float64{
		"layers[0].thickness": p.Layers[0].Thickness, "layers[0].gammaSat": p.Layers[0].GammaSat,
		"layers[0].k": p.Layers[0].K, "layers[0].mv": p.Layers[0].Mv, "loads[0].q": p.Loads[0].Q, "waterTable": p.WaterTable,
	}
	for _, c := range typed {
		// 12 significant figures are kept (the rest of a converted
		// value carries no meaning): 1e-11 relative.
		if g := got[c.path]; math.Abs(g/c.si-1) > 1e-11 {
			t.Errorf("%s typed %s: the file holds %.15g, want %.15g (SI, ±1e-11)", c.path, c.text, g, c.si)
		}
	}

	// Reloaded, the page shows US units again, as typed; in SI the same
	// project reads in metres.
	open(t, ctx, pageURL)
	if got := value(t, ctx, "layers-0-thickness"); got != "32.8" {
		t.Errorf("after a reload the thickness shows %q, want 32.8 (ft)", got)
	}
	setSelect(t, ctx, "units", "si")
	poll[bool](t, ctx, `document.querySelector("#layers thead").textContent.includes("kN/m³")`, 10*time.Second)
	if got := value(t, ctx, "layers-0-thickness"); got != "9.99744" {
		t.Errorf("in SI the thickness shows %q, want 9.99744 (m)", got)
	}
	rec.requireLocal(t)
}
