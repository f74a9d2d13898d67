package plot

import (
	"math"
	"slices"
	"strings"
	"testing"

	"porelight/solver"
)

type figFunc func(*solver.Project, *solver.Result, int, int) *Figure

var figures = []struct {
	name, id string
	build    figFunc
	export   func(*solver.Project, *solver.Result, int, int) string
}{
	{"isochrones", "plot-isochrones", IsochronesFigure, IsochronesSVG},
	{"degree", "plot-degree", DegreeFigure, DegreeSVG},
	{"settlement", "plot-settlement", SettlementFigure, SettlementSVG},
	{"piezometers", "plot-piezometers", PiezometersFigure, PiezometersSVG},
	{"steady", "plot-steady", SteadyFigure, SteadySVG},
}

// broken results: each must give a message, never a panic or a broken plot.
func brokenResults() map[string]*solver.Result {
	noCons := synthResult()
	noCons.Consolidation = nil
	allNaN := synthResult()
	nan := math.NaN()
	for i := range allNaN.Consolidation.Isochrones {
		for k := range allNaN.Consolidation.Isochrones[i].Excess {
			allNaN.Consolidation.Isochrones[i].Excess[k] = nan
		}
	}
	s := &allNaN.Consolidation.Series
	for i := range s.Time {
		s.Us[i], s.Up[i], s.Settlement[i], s.SettlementElog[i] = nan, nan, nan, nan
		for k := range s.Piezometers {
			s.Piezometers[k].Pore[i], s.Piezometers[k].Excess[i] = nan, nan
		}
	}
	for i := range allNaN.Steady.Depth {
		allNaN.Steady.Head[i], allNaN.Steady.Pore[i] = nan, nan
		allNaN.Steady.Total[i], allNaN.Steady.Effective[i] = nan, nan
	}
	return map[string]*solver.Result{
		"nil result":       nil,
		"no consolidation": noCons,
		"empty result":     {},
		"all NaN":          allNaN,
	}
}

func TestFiguresWithData(t *testing.T) {
	t.Parallel()
	p, r := synthProject(), synthResult()
	wantSeries := map[string]int{"isochrones": 6, "degree": 2, "settlement": 2, "piezometers": 4, "steady": 4}
	for _, fc := range figures {
		t.Run(fc.name, func(t *testing.T) {
			t.Parallel()
			f := fc.build(p, r, 0, 0)
			if f.Message != "" {
				t.Fatalf("message %q with complete data", f.Message)
			}
			if f.ID != fc.id || f.W != defaultW || f.H != defaultH {
				t.Errorf("id %q size %v×%v; want %q %v×%v", f.ID, f.W, f.H, fc.id, defaultW, defaultH)
			}
			if n := len(f.allSeries()); n != wantSeries[fc.name] {
				t.Errorf("%d series; want %d", n, wantSeries[fc.name])
			}
			for _, s := range f.allSeries() {
				if s.D == "" || !strings.HasPrefix(s.D, "M") {
					t.Errorf("series %q has path %q", s.Name, s.D)
				}
				if !hasText(f, s.Name) {
					t.Errorf("series %q is not in the legend", s.Name)
				}
			}
			for _, pn := range f.Panels {
				for _, s := range pn.Series {
					for _, q := range s.Pts {
						if q.X < pn.Box.X-0.5 || q.X > pn.Box.Right()+0.5 || q.Y < pn.Box.Y-0.5 || q.Y > pn.Box.Bottom()+0.5 {
							t.Fatalf("series %q point %+v outside its panel %+v", s.Name, q, pn.Box)
						}
					}
				}
			}
		})
	}
}

func hasText(f *Figure, s string) bool {
	for _, t := range f.Texts {
		if t.Text == s {
			return true
		}
	}
	return false
}

func TestFiguresWithoutData(t *testing.T) {
	t.Parallel()
	wantMsg := map[string]map[string]string{
		"nil result":       {"isochrones": msgNoResult, "degree": msgNoResult, "settlement": msgNoResult, "piezometers": msgNoResult, "steady": msgNoResult},
		"no consolidation": {"isochrones": msgNoConsolidation, "degree": msgNoConsolidation, "settlement": msgNoConsolidation, "piezometers": msgNoConsolidation},
		"empty result":     {"isochrones": msgNoConsolidation, "degree": msgNoConsolidation, "steady": msgNoSteady},
		"all NaN":          {"isochrones": msgNoIsochrones, "piezometers": msgNoPiezometers, "steady": msgNoSteady},
	}
	for rname, r := range brokenResults() {
		for _, fc := range figures {
			t.Run(rname+"/"+fc.name, func(t *testing.T) {
				f := fc.build(nil, r, 500, 300)
				want, pinned := wantMsg[rname][fc.name]
				if rname == "no consolidation" && fc.name == "steady" {
					if f.Message != "" {
						t.Errorf("steady profiles need no consolidation, got %q", f.Message)
					}
					return
				}
				if f.Message == "" {
					t.Fatalf("no message")
				}
				if pinned && f.Message != want {
					t.Errorf("message %q; want %q", f.Message, want)
				}
				if !hasText(f, f.Message) || len(f.allSeries()) != 0 {
					t.Errorf("message not drawn, or %d series drawn", len(f.allSeries()))
				}
				if f.HoverAt(f.W/2, f.H/2) != nil {
					t.Errorf("a message figure reads out a point")
				}
			})
		}
	}
}

func TestHoverAt(t *testing.T) {
	t.Parallel()
	p, r := synthProject(), synthResult()
	f := IsochronesFigure(p, r, 900, 600)
	pn := f.Panels[0]
	// Aim at the 100-day isochrone at mid-depth.
	iso := r.Consolidation.Isochrones[3]
	k := 40 // z = 4 m
	x, y := pn.X.Map(iso.Excess[k]), pn.Y.Map(r.Consolidation.Depth[k])
	h := f.HoverAt(x+1, y+1)
	if h == nil {
		t.Fatal("no read-out over the plot")
	}
	if h.Series.Name != "t = 100 d" || h.Point.I != k {
		t.Errorf("read %q point %d; want t = 100 d point %d", h.Series.Name, h.Point.I, k)
	}
	if got := h.Lines[1].Text; got != "z = 4 m, u = "+sig(iso.Excess[k], 3)+" kPa" {
		t.Errorf("read-out %q", got)
	}
	if h.Box.X < pn.Box.X || h.Box.Right() > pn.Box.Right() || h.Box.Y < pn.Box.Y || h.Box.Bottom() > pn.Box.Bottom() {
		t.Errorf("read-out box %+v leaves the panel %+v", h.Box, pn.Box)
	}
	if f.HoverAt(5, 5) != nil {
		t.Error("read-out outside every panel")
	}
	if f.HoverAt(math.NaN(), 100) != nil {
		t.Error("read-out for a NaN pointer")
	}
	// A read-out at the right edge flips to the left of the marker.
	g := SteadyFigure(p, r, 900, 600)
	right := g.Panels[1]
	h = g.HoverAt(right.Box.Right(), right.Box.Bottom())
	if h == nil || h.Box.Right() > right.Box.Right() {
		t.Errorf("read-out at the corner: %+v", h)
	}
}

func TestFigurePoint(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name                 string
		ox, oy, cw, ch, w, h float64
		wx, wy               float64
		ok                   bool
	}{
		{"unscaled", 120, 80, 640, 420, 640, 420, 120, 80, true},
		{"size unknown", 120, 80, 0, 0, 640, 420, 120, 80, true},
		{"half size", 60, 40, 320, 210, 640, 420, 120, 80, true},
		{"wider box, centred", 160 + 60, 40, 640, 210, 640, 420, 120, 80, true},
		{"taller box, centred", 60, 100 + 40, 320, 410, 640, 420, 120, 80, true},
		{"NaN", math.NaN(), 1, 640, 420, 640, 420, 0, 0, false},
	}
	for _, c := range cases {
		x, y, ok := figurePoint(c.ox, c.oy, c.cw, c.ch, c.w, c.h)
		if ok != c.ok || (ok && (!close(x, c.wx) || !close(y, c.wy))) {
			t.Errorf("%s: figurePoint = %v, %v, %v; want %v, %v, %v", c.name, x, y, ok, c.wx, c.wy, c.ok)
		}
	}
}

func TestIsochroneLabelsDoNotOverlap(t *testing.T) {
	t.Parallel()
	f := IsochronesFigure(synthProject(), synthResult(), 640, 420)
	var labels []TextEl
	for _, tx := range f.Texts {
		if tx.Halo && tx.Bold {
			labels = append(labels, tx)
		}
	}
	if len(labels) != 6 {
		t.Fatalf("%d curve labels; want 6", len(labels))
	}
	box := func(t TextEl) Box {
		w := textWidth(t.Text, t.Size)
		x := t.X
		if t.Anchor == "end" {
			x -= w
		}
		return Box{x, t.Y - t.Size, w, t.Size}
	}
	for i := range labels {
		for j := range i {
			a, b := box(labels[i]), box(labels[j])
			if a.X < b.Right() && b.X < a.Right() && a.Y < b.Bottom()-1 && b.Y < a.Bottom()-1 {
				t.Errorf("labels %q and %q overlap", labels[i].Text, labels[j].Text)
			}
		}
	}
}

func TestLayerBands(t *testing.T) {
	t.Parallel()
	p := synthProject()
	p.Layers[2].Name = ""
	fromProject := layerBands(p, nil)
	if len(fromProject) != 3 || fromProject[2].Name != "Layer 3" || !close(fromProject[2].Top, 6.5) || !close(fromProject[2].Bottom, 8) {
		t.Errorf("bands from the project: %+v", fromProject)
	}
	r := synthResult()
	r.Steady.Layers[0].Name = ""
	fromResult := layerBands(p, r)
	if fromResult[0].Name != "Made ground" {
		t.Errorf("an unnamed steady layer takes the project name, got %q", fromResult[0].Name)
	}
	if got := layerBands(nil, nil); got != nil {
		t.Errorf("no project and no result: %+v", got)
	}
}

// TestPaletteGreyscale checks the curve scheme survives a grey print: every
// style has its own dash pattern, and neighbouring styles differ in
// relative luminance by at least 0.1 (the wrap from last to first is
// covered by the dash difference alone).
func TestPaletteGreyscale(t *testing.T) {
	t.Parallel()
	seen := map[string]bool{}
	lum := func(hex string) float64 {
		var c [3]float64
		for i := range 3 {
			var v int
			for _, r := range hex[1+2*i : 3+2*i] {
				v = v*16 + strings.IndexRune("0123456789abcdef", r)
			}
			s := float64(v) / 255
			if s <= 0.04045 {
				c[i] = s / 12.92
			} else {
				c[i] = math.Pow((s+0.055)/1.055, 2.4)
			}
		}
		return 0.2126*c[0] + 0.7152*c[1] + 0.0722*c[2]
	}
	for i, s := range palette {
		key := s.Dash + "/" + coord(s.Width)
		if seen[key] {
			t.Errorf("style %d repeats dash and width %q", i, key)
		}
		seen[key] = true
		if i > 0 {
			if d := math.Abs(lum(s.Stroke) - lum(palette[i-1].Stroke)); d < 0.1 {
				t.Errorf("styles %d and %d differ in luminance by only %.3f", i-1, i, d)
			}
		}
	}
	if a, b := styleAt(0), styleAt(len(palette)); a.Width == b.Width {
		t.Error("the second cycle of styles is not thinner")
	}
}

func BenchmarkIsochronesFigure(b *testing.B) {
	p, r := synthProject(), synthResult()
	for b.Loop() {
		IsochronesFigure(p, r, 900, 600)
	}
}

func BenchmarkPiezometersFigure(b *testing.B) {
	p, r := synthProject(), synthResult()
	for b.Loop() {
		PiezometersFigure(p, r, 900, 600)
	}
}

// TestSteadyPreconsolidation: with e–log curves the steady figure draws
// σ'p against depth, one line per layer with a curve (the path restarts
// at each layer), and none for a layer without one.
func TestSteadyPreconsolidation(t *testing.T) {
	t.Parallel()
	ec := &solver.ECurve{E0: 1, Cc: 0.3, Cr: 0.03, POP: 20}
	p := &solver.Project{Format: solver.Format,
		Layers: []solver.Layer{
			{Name: "crust", Thickness: 2, GammaSat: 18, K: 1e-8, ECurve: ec},
			{Name: "sand", Thickness: 1, GammaSat: 20, K: 1e-4, Mv: 1e-5},
			{Name: "clay", Thickness: 3, GammaSat: 17, K: 1e-9, ECurve: &solver.ECurve{E0: 1.5, Cc: 0.5, Cr: 0.05, OCR: 1.5}},
		},
		Top: solver.Boundary{Drained: true}, Bottom: solver.Boundary{Drained: true}}
	r, err := solver.Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	f := SteadyFigure(p, r, 600, 400)
	var sp *Series
	for _, s := range f.allSeries() {
		if strings.HasPrefix(s.Name, "Preconsolidation") {
			sp = s
		}
	}
	if sp == nil {
		t.Fatal("no σ'p series in the steady figure")
	}
	if n := strings.Count(sp.D, "M"); n != 2 {
		t.Errorf("σ'p path has %d pieces, want 2 (crust and clay): %.80s…", n, sp.D)
	}
	// At the top of the crust σ'0 = 0 (raised to 0.1 kPa), so σ'p = POP + 0.1.
	if got := sp.Pts[0].DX; math.Abs(got-20.1) > 1e-9 {
		t.Errorf("σ'p at the surface %g kPa, want 20.1 (σ'0 + POP)", got)
	}
}

// TestIsochroneLabelsInDays: the curves are named in days, as the times
// are typed (Project.Times is in days): 3,650 days is "3650 d", never the
// "9.99 yr" a conversion at 365.25 days a year rounds it to.
func TestIsochroneLabelsInDays(t *testing.T) {
	t.Parallel()
	r := synthResult()
	want := map[float64]string{1: "1 d", 10: "10 d", 30: "30 d", 100: "100 d", 365: "365 d", 1000: "1000 d"}
	r.Consolidation.Isochrones[4].Time = 3650
	want[3650] = "3650 d"
	delete(want, 365)
	f := IsochronesFigure(synthProject(), r, 640, 420)
	var got []string
	for _, tx := range f.Texts {
		got = append(got, tx.Text)
	}
	all := strings.Join(got, "|")
	for _, w := range want {
		if !strings.Contains(all, "t = "+w) || !slices.Contains(got, w) {
			t.Errorf("no legend entry %q and curve label %q in %q", "t = "+w, w, all)
		}
	}
	if strings.Contains(all, " yr") {
		t.Errorf("an isochrone is labelled in years: %q", all)
	}
}
