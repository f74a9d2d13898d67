package ui

import "testing"

// screenHost is a fakeHost that shows some figures and notes the calls
// for after the next paint (Screen).
type screenHost struct {
	*fakeHost
	in    map[string]bool // the ids in view
	after []func()
}

func (h *screenHost) InView(id string) bool { return h.in[id] }
func (h *screenHost) AfterPaint(f func())   { h.after = append(h.after, f) }

// TestFiguresInViewFirst: the render that shows new results draws the
// figures in view and the summary from them, leaves a figure out of view
// as it was and asks for one more render after the paint, which draws it
// (ui/inview.go). Renders without new results, and printing, draw all.
func TestFiguresInViewFirst(t *testing.T) {
	t.Parallel()
	p := newPage(t, Sources{})
	sh := &screenHost{fakeHost: p.host, in: map[string]bool{"plot-isochrones": true}}
	p.root.Host = sh
	iso, deg, flux := p.text("plot-isochrones"), p.text("plot-degree"), p.attr("sum-flux", "data-value")
	res := p.text("plot-residuals") // the records against the prediction: its own memo (plot.Residuals)
	if res == "" {
		t.Fatal("the demo draws no residuals figure")
	}

	p.typeInto("layers-1-k", "4e-9") // solves at once without Env, then builds
	if p.text("plot-isochrones") == iso {
		t.Error("the figure in view kept its old curves after a new result")
	}
	if p.attr("sum-flux", "data-value") == flux {
		t.Error("the summary kept its old flux after a new result")
	}
	if p.text("plot-degree") != deg {
		t.Error("a figure out of view was drawn in the render of the new results")
	}
	if p.text("plot-residuals") != res {
		t.Error("the residuals, out of view, were drawn in the render of the new results")
	}
	if len(sh.after) != 1 {
		t.Fatalf("%d renders asked for after the paint, want 1", len(sh.after))
	}
	if b := p.attr("results", "aria-busy"); b != "true" {
		t.Errorf("the results say aria-busy %q while a figure waits, want true", b)
	}
	sh.after[0]() // the browser painted: drawRest, a no-op without Env
	p.build()     // the render it asks for
	if p.text("plot-degree") == deg {
		t.Error("the figure out of view was not drawn in the next render")
	}
	if p.text("plot-residuals") == res {
		t.Error("the residuals were not drawn in the next render")
	}
	if b := p.attr("results", "aria-busy"); b != "false" {
		t.Errorf("the results say aria-busy %q once all is drawn, want false", b)
	}
	deg = p.text("plot-degree")
	p.build()
	if p.text("plot-degree") != deg || len(sh.after) != 1 {
		t.Error("a render without new results changed the figure or asked for another render")
	}

	p.root.printing = true
	p.typeInto("layers-1-k", "5e-9")
	if p.text("plot-degree") == deg {
		t.Error("while printing, a figure out of view was left as it was")
	}
	if len(sh.after) != 1 {
		t.Error("while printing, a render was asked for after the paint")
	}
}
