package plot

import (
	"os"
	"path/filepath"
	"testing"

	"github.com/vugu/vugu"

	"porelight/solver"
)

// TestWriteLookFiles writes every standalone SVG to $PLOT_LOOK_DIR when it
// is set, for viewing in a browser; otherwise it is skipped.
func TestWriteLookFiles(t *testing.T) {
	dir := os.Getenv("PLOT_LOOK_DIR")
	if dir == "" {
		t.Skip("PLOT_LOOK_DIR not set")
	}
	p, r := synthProject(), synthResult()
	files := map[string]string{
		"isochrones.svg":  IsochronesSVG(p, r, 900, 600),
		"degree.svg":      DegreeSVG(p, r, 900, 600),
		"settlement.svg":  SettlementSVG(p, r, 900, 600),
		"piezometers.svg": PiezometersSVG(p, r, 900, 600),
		"steady.svg":      SteadySVG(p, r, 900, 600),
		"empty.svg":       DegreeSVG(p, &solver.Result{}, 900, 600),
	}
	rr := newRenderer(t)
	comp := &Isochrones{Project: p, Result: r, Width: 800, Height: 500}
	html, br := rr.render(t, comp)
	files["component.html"] = html
	pn := comp.Figure().Panels[0]
	x, y := pn.X.Map(r.Consolidation.Isochrones[3].Excess[50]), pn.Y.Map(r.Consolidation.Depth[50])
	handler(t, br, chartOf(br), "pointermove")(vugu.NewDOMEvent(rr.r.EventEnv(), map[string]any{"offsetX": x, "offsetY": y}))
	files["component-hover.html"], _ = rr.render(t, comp)
	sp := &Degree{Project: p, Result: r, Width: 800, Height: 500}
	_, br = rr.render(t, sp)
	handler(t, br, chartOf(br), "pointermove")(vugu.NewDOMEvent(rr.r.EventEnv(), map[string]any{"offsetX": 600.0, "offsetY": 100.0}))
	files["degree-hover.html"], _ = rr.render(t, sp)
	for name, s := range files {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(s), 0o644); err != nil {
			t.Fatal(err)
		}
	}
}
