package plot

import (
	"bytes"
	"strings"
	"testing"

	"github.com/vugu/vugu"
	"github.com/vugu/vugu/staticrender"

	"porelight/solver"
)

// renderer builds and renders components with staticrender, keeping the
// build environment so that a second build reuses the component instances
// (as in the browser).
type renderer struct {
	r   *staticrender.StaticRenderer
	env *vugu.BuildEnv
	buf bytes.Buffer
}

func newRenderer(t *testing.T) *renderer {
	t.Helper()
	rr := &renderer{}
	rr.r = staticrender.New(&rr.buf)
	env, err := vugu.NewBuildEnv(rr.r.EventEnv())
	if err != nil {
		t.Fatal(err)
	}
	rr.env = env
	return rr
}

func (rr *renderer) render(t *testing.T, root vugu.Builder) (string, *vugu.BuildResults) {
	t.Helper()
	rr.buf.Reset()
	br := rr.env.RunBuild(root)
	if err := rr.r.Render(br); err != nil {
		t.Fatal(err)
	}
	return rr.buf.String(), br
}

// chartOf returns the Chart built under root.
func chartOf(br *vugu.BuildResults) *Chart {
	var found *Chart
	var walk func(n *vugu.VGNode)
	walk = func(n *vugu.VGNode) {
		if c, ok := n.Component.(*Chart); ok && found == nil {
			found = c
		}
		for ch := n.FirstChild; ch != nil; ch = ch.NextSibling {
			walk(ch)
		}
	}
	for _, n := range br.Out.Out {
		walk(n)
	}
	return found
}

// handler returns the handler for event type on the root node of c.
func handler(t *testing.T, br *vugu.BuildResults, c *Chart, event string) func(vugu.DOMEvent) {
	t.Helper()
	out := br.ResultFor(c)
	if out == nil || len(out.Out) != 1 {
		t.Fatal("no build output for the chart")
	}
	for _, h := range out.Out[0].DOMEventHandlerSpecList {
		if h.EventType == event {
			return h.Func
		}
	}
	t.Fatalf("no %s handler on the chart's svg", event)
	return nil
}

func TestComponentsRender(t *testing.T) {
	t.Parallel()
	p, full := synthProject(), synthResult()
	noCons := synthResult()
	noCons.Consolidation = nil
	comps := func(r *solver.Result) []struct {
		name, id string
		c        vugu.Builder
	} {
		return []struct {
			name, id string
			c        vugu.Builder
		}{
			{"isochrones", "plot-isochrones", &Isochrones{Project: p, Result: r, Width: 700, Height: 450}},
			{"degree", "plot-degree", &Degree{Project: p, Result: r, Width: 700, Height: 450}},
			{"settlement", "plot-settlement", &Settlement{Project: p, Result: r, Width: 700, Height: 450}},
			{"piezometers", "plot-piezometers", &Piezometers{Project: p, Result: r, Width: 700, Height: 450}},
			{"steady", "plot-steady", &SteadyProfiles{Project: p, Result: r, Width: 700, Height: 450}},
			{"stress", "plot-stress", &StageStress{Project: p, Result: r, Width: 700, Height: 450}},
			{"section", "plot-section", &Section{Project: p, Width: 700, Height: 450}},
		}
	}
	for _, rc := range []struct {
		name string
		r    *solver.Result
	}{{"complete", full}, {"no consolidation", noCons}, {"nil", nil}} {
		for _, cc := range comps(rc.r) {
			t.Run(rc.name+"/"+cc.name, func(t *testing.T) {
				t.Parallel()
				html, _ := newRenderer(t).render(t, cc.c)
				i := strings.Index(html, "<svg")
				j := strings.LastIndex(html, "</svg>")
				if i < 0 || j < 0 {
					t.Fatalf("no svg in\n%s", html)
				}
				checkSVG(t, html[i:j+len("</svg>")], cc.id, false)
				fig := cc.c.(interface{ Figure() *Figure }).Figure()
				if got := strings.Count(html, "<path "); got != len(fig.Paths) {
					t.Errorf("%d paths rendered; the figure has %d", got, len(fig.Paths))
				}
				if got := strings.Count(html, "<text "); got != len(fig.Texts) {
					t.Errorf("%d texts rendered; the figure has %d", got, len(fig.Texts))
				}
				wantMsg := fig.Message != ""
				if gotMsg := strings.Contains(html, "No "); gotMsg != wantMsg {
					t.Errorf("message shown %v; want %v", gotMsg, wantMsg)
				}
			})
		}
	}
}

// TestChartHover moves the pointer over the rendered isochrones, as the
// browser would, and checks that the read-out appears, follows CSS scaling
// and goes away when the pointer leaves.
func TestChartHover(t *testing.T) {
	t.Parallel()
	p, r := synthProject(), synthResult()
	comp := &Isochrones{Project: p, Result: r, Width: 800, Height: 500}
	rr := newRenderer(t)
	html, br := rr.render(t, comp)
	if strings.Contains(html, "porelight-chart-hover") {
		t.Fatal("read-out before any pointer move")
	}
	chart := chartOf(br)
	if chart == nil {
		t.Fatal("no Chart under Isochrones")
	}
	fig := comp.Figure()
	pn := fig.Panels[0]
	k := 40
	x, y := pn.X.Map(r.Consolidation.Isochrones[3].Excess[k]), pn.Y.Map(r.Consolidation.Depth[k])

	// The page shows the svg at half size: the pointer offset and the
	// rendered size are in CSS pixels.
	ee := rr.r.EventEnv()
	move := handler(t, br, chart, "pointermove")
	move(vugu.NewDOMEvent(ee, map[string]any{
		"offsetX": x / 2, "offsetY": y / 2,
		"target": map[string]any{"tagName": "svg", "clientWidth": 400.0, "clientHeight": 250.0},
	}))
	html, br = rr.render(t, comp)
	want := "z = 4 m, u = " + sig(r.Consolidation.Isochrones[3].Excess[k], 3) + " kPa"
	if !strings.Contains(html, "porelight-chart-hover") || !strings.Contains(html, want) {
		t.Fatalf("no read-out %q after a pointer move", want)
	}
	if !strings.Contains(html, `cx="`+coord(x)+`"`) {
		t.Errorf("marker not at x = %s", coord(x))
	}

	handler(t, br, chartOf(br), "pointerleave")(vugu.NewDOMEvent(ee, map[string]any{}))
	html, _ = rr.render(t, comp)
	if strings.Contains(html, "porelight-chart-hover") {
		t.Error("read-out still shown after the pointer left")
	}
}
