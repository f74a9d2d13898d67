package ui

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"porelight/ui/plot"
	"porelight/ui/units"
)

// Conversion factors: NIST Special Publication 811 (2008), appendix B:
// 1 ft = 0.3048 m and 1 in = 25.4 mm exactly, 1 lbf/ft² = 47.88026 Pa.

// usPage opens the demo and switches the page to US customary units, as
// the choice in the header does.
func usPage(t *testing.T) *page {
	t.Helper()
	p := newPage(t, Sources{})
	t.Cleanup(func() { shown = units.SI; plot.SetUnits(units.SI) })
	p.fire("units", "change", map[string]any{"value": "us"})
	return p
}

func TestUnitsSwitch(t *testing.T) {
	si := newPage(t, Sources{})
	thSI, _ := strconv.ParseFloat(si.value("layers-1-thickness"), 64)
	settleSI, _ := strconv.ParseFloat(si.attr("sum-settlement-elog", "data-value"), 64)
	qSI, _ := strconv.ParseFloat(si.value("loads-0-q"), 64)

	p := usPage(t)
	if got := p.host.store[UnitsKey]; got != "us" {
		t.Errorf("the choice is stored as %q, want us", got)
	}
	th, err := strconv.ParseFloat(p.value("layers-1-thickness"), 64)
	// A converted value shows to 6 significant figures: ±5e-6.
	if err != nil || math.Abs(th*0.3048/thSI-1) > 5e-6 {
		t.Errorf("layer 2 thickness shows %q ft, want %g m / 0.3048 (±5e-6)", p.value("layers-1-thickness"), thSI)
	}
	if q, _ := strconv.ParseFloat(p.value("loads-0-q"), 64); math.Abs(q*0.04788026/qSI-1) > 1e-6 {
		t.Errorf("stage 1 q shows %g psf, want %g kPa / 0.04788026 (±1e-6)", q, qSI)
	}
	// The summary: the settlement in inches, the exact value still SI.
	text := p.text("sum-settlement-elog")
	in, err := strconv.ParseFloat(strings.TrimSuffix(text, " in"), 64)
	if !strings.HasSuffix(text, " in") || err != nil || math.Abs(in-settleSI*1000/25.4) > 0.05 {
		t.Errorf("final settlement shows %q, want %.1f in (%g m; ±0.05 in, one decimal)", text, settleSI*1000/25.4, settleSI)
	}
	if got, _ := strconv.ParseFloat(p.attr("sum-settlement-elog", "data-value"), 64); got != settleSI {
		t.Errorf("the exact value behind the figure is %g, want the SI %g", got, settleSI)
	}
	// Column heads and the layers CSV.
	html := p.html()
	for _, want := range []string{">ft<", ">pcf<", ">ft/day<", ">ft²/kip<", ">ft²/yr<", ">psf<", "Depth, ft", "Excess pore pressure, psf"} {
		if !strings.Contains(html, want) {
			t.Errorf("the page in US units lacks a unit %s", want)
		}
	}
	data, err := layersCSV(p.root.Result())
	if err != nil {
		t.Fatal(err)
	}
	if head, _, _ := strings.Cut(string(data), "\n"); !strings.Contains(head, "top (ft)") || !strings.Contains(head, "settlement from mv (in)") {
		t.Errorf("layers CSV header in US units: %s", head)
	}

	// Typing in US units stores SI: 12.5 ft is 3.81 m.
	p.typeInto("layers-1-thickness", "12.5")
	if got := p.root.Form().Draft().Layers[1].Thickness; got != 3.81 {
		t.Errorf("12.5 ft typed: the project holds %.17g m, want 3.81", got)
	}
	// Back to SI: the same project, shown in metres.
	p.fire("units", "change", map[string]any{"value": "si"})
	if got := p.value("layers-1-thickness"); got != "3.81" {
		t.Errorf("back in SI the thickness shows %q, want 3.81", got)
	}
	if !strings.HasSuffix(p.text("sum-settlement-elog"), " mm") {
		t.Errorf("back in SI the settlement shows %q", p.text("sum-settlement-elog"))
	}
}

// TestUnitsRemembered: the choice is the reader's, kept in the browser
// and used when the page opens again; the project file stays SI.
func TestUnitsRemembered(t *testing.T) {
	p := usPage(t)
	p.typeInto("layers-0-thickness", "10")
	q := newPageOn(t, p.host)
	if got := q.value("layers-0-thickness"); got != "10" {
		t.Errorf("reopened in US units: thickness shows %q, want 10", got)
	}
	q.fire("save-project", "click", nil)
	d := q.host.downloads[len(q.host.downloads)-1]
	if !strings.Contains(string(d.data), `"thickness": 3.048`) {
		t.Errorf("the saved file does not hold 3.048 m for 10 ft: %.300s", d.data)
	}
}

// newPageOn opens the page again in the browser of host: its storage
// (the autosave, the history, the units chosen) as it was left.
func newPageOn(t *testing.T, h *fakeHost) *page {
	t.Helper()
	return openPage(t, h, Sources{Autosave: h.store[AutosaveKey], History: h.store[HistoryKey]})
}
