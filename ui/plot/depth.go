package plot

import (
	"math"
	"strings"

	"porelight/solver"
	"porelight/ui/units"
)

// band is one layer of the strip: name and depth range, m.
type band struct {
	Name        string
	Top, Bottom float64
}

// layerBands returns the layers top to bottom: from the steady result when
// it has them (its Top/Bottom are authoritative), else stacked from the
// project's thicknesses. Names fall back to "Layer n".
func layerBands(p *solver.Project, r *solver.Result) []band {
	var bs []band
	if r != nil && len(r.Steady.Layers) > 0 {
		for _, l := range r.Steady.Layers {
			bs = append(bs, band{Name: l.Name, Top: l.Top, Bottom: l.Bottom})
		}
	} else if p != nil {
		z := 0.0
		for _, l := range p.Layers {
			if !(l.Thickness > 0) || !isFinite(l.Thickness) {
				continue
			}
			bs = append(bs, band{Name: l.Name, Top: z, Bottom: z + l.Thickness})
			z += l.Thickness
		}
	}
	for i := range bs {
		if p != nil && i < len(p.Layers) && bs[i].Name == "" {
			bs[i].Name = p.Layers[i].Name
		}
		if strings.TrimSpace(bs[i].Name) == "" {
			bs[i].Name = "Layer " + itoa(i+1)
		}
	}
	return bs
}

// columnDepth is the depth of the base of the column: the deepest layer
// bottom or node, whichever is larger; 0 when there is neither.
func columnDepth(bs []band, depths ...[]float64) float64 {
	z := 0.0
	for _, b := range bs {
		if isFinite(b.Bottom) {
			z = math.Max(z, b.Bottom)
		}
	}
	for _, ds := range depths {
		for _, d := range ds {
			if isFinite(d) {
				z = math.Max(z, d)
			}
		}
	}
	return z
}

// panelSpec describes one panel of a depth figure: its share of the width
// and its x axis.
type panelSpec struct {
	Weight float64
	Lo, Hi float64 // data range to show (widened to nice ticks)
	Label  string  // x axis title with units
}

// Depth figure layout, pixels.
const (
	depthTop     = 72  // title, x axis title and tick labels above the plot
	depthLeft    = 58  // depth title and tick labels left of the strip
	stripW       = 74  // layer strip
	legendW      = 168 // legend column
	panelGap     = 24
	depthBottomM = 14
)

// depthFigure lays out the layer strip and the panels of a depth figure on
// f, drawing the strip, the depth axis, grids, frames, x axes and the layer
// boundary rules. bs and zmax are in m; the depth axis is in the length
// unit shown, and so are the depths of the curves added afterwards with
// addSeries on the returned panels (uLength.all), clipped to the returned
// clip ids. The specs' ranges are in the units the panels show.
func (f *Figure) depthFigure(p *solver.Project, bs []band, zmax float64, specs []panelSpec) ([]*Panel, []string) {
	zmax = uLength.of(zmax)
	bs = shownBands(bs)
	top, bottom := float64(depthTop), f.H-depthBottomM
	strip := Box{depthLeft, top, stripW, bottom - top}
	depth := Scale{Lo: 0, Hi: zmax, A: top, B: bottom}

	x0 := strip.Right()
	avail := f.W - legendW - x0 - panelGap*float64(len(specs)-1) - 8
	wsum := 0.0
	for _, s := range specs {
		wsum += s.Weight
	}
	_, _, zstep := NiceRange(0, zmax, int(math.Max(2, strip.H/55)))
	zticks := LinearTicks(0, zmax, zstep)

	var panels []*Panel
	var clips []string
	for _, s := range specs {
		w := avail * s.Weight / wsum
		box := Box{x0, top, w, bottom - top}
		x0 += w + panelGap
		plo, phi := padRange(s.Lo, s.Hi)
		lo, hi, step := NiceRange(plo, phi, int(math.Max(2, w/70)))
		pn := &Panel{Box: box, X: Scale{Lo: lo, Hi: hi, A: box.X, B: box.Right()}, Y: depth}
		xt := LinearTicks(lo, hi, step)
		f.grid(pn, zticks, false)
		f.grid(pn, xt, true)
		if lo < 0 && hi > 0 { // the zero line
			x := pn.X.Map(0)
			f.path("M"+coord(x)+" "+coord(box.Y)+" V"+coord(box.Bottom()), inkRule, "none", 1)
		}
		f.rules(pn, bs)
		f.frame(box)
		f.axis(box, pn.X, xt, sideTop, s.Label)
		panels = append(panels, pn)
		clips = append(clips, f.clip(box))
	}
	f.Panels = panels
	f.strip(strip, depth, bs, p)
	f.axis(strip, depth, zticks, sideLeft, "Depth, "+uLength.sym())
	return panels, clips
}

// shownBands is bs with its depths in the length unit shown (bs itself
// in SI).
func shownBands(bs []band) []band {
	if shown == units.SI {
		return bs
	}
	out := make([]band, len(bs))
	for i, b := range bs {
		out[i] = band{Name: b.Name, Top: uLength.of(b.Top), Bottom: uLength.of(b.Bottom)}
	}
	return out
}

// rules draws the layer boundaries (not the top and base of the column)
// as faint dashed lines across a panel.
func (f *Figure) rules(pn *Panel, bs []band) {
	var d strings.Builder
	for i, b := range bs {
		if i == len(bs)-1 {
			break
		}
		y := pn.Y.Map(b.Bottom)
		if !isFinite(y) {
			continue
		}
		d.WriteString("M" + coord(pn.Box.X) + " " + coord(y) + " H" + coord(pn.Box.Right()) + " ")
	}
	if d.Len() > 0 {
		f.path(strings.TrimSpace(d.String()), inkRule, "5 3", 0.8)
	}
}

// strip draws the layers to the depth scale with their names, and the
// water table mark when the project places it within the column. depth
// and bs are in the length unit shown; p's depths in m.
func (f *Figure) strip(box Box, depth Scale, bs []band, p *solver.Project) {
	for i, b := range bs {
		y0, y1 := depth.Map(b.Top), depth.Map(b.Bottom)
		if !isFinite(y0) || !isFinite(y1) || y1 <= y0 {
			continue
		}
		f.Rects = append(f.Rects, RectEl{
			Box:  Box{box.X, y0, box.W, y1 - y0},
			Fill: layerFills[i%len(layerFills)], Stroke: "#8a7f6c", StrokeWidth: 0.75,
		})
		const lh = 12.0
		lines := wrapWords(b.Name, box.W-8, 10, int((y1-y0-2)/lh))
		y := (y0+y1)/2 + 3.5 - lh*float64(len(lines)-1)/2
		for k, l := range lines {
			f.text(box.X+5, y+lh*float64(k), l, "start", 10, inkText)
		}
	}
	wt := math.NaN()
	if p != nil {
		wt = uLength.of(p.WaterTable)
	}
	if wt >= 0 && wt <= depth.Hi && isFinite(wt) {
		y := depth.Map(wt)
		x := box.Right() - 14
		// An inverted triangle on the level with two short dashes below it.
		f.path("M"+coord(x-5)+" "+coord(y-7)+" h10 l-5 7 Z", inkAxis, "none", 1).Fill = "#ffffff"
		f.path("M"+coord(x-4)+" "+coord(y+3)+" h8 M"+coord(x-2.5)+" "+coord(y+6)+" h5", inkAxis, "none", 1)
	}
	f.stripDrains(box, depth, p)
	f.stripZone(box, depth, p)
	f.frame(box)
}

// padRange widens [lo, hi] by 3 % of its span on each side, so that a
// curve does not run along the frame; a bound at exactly zero stays (axes
// of pressure and settlement start at zero).
func padRange(lo, hi float64) (float64, float64) {
	d := 0.03 * (hi - lo)
	if !isFinite(d) {
		return lo, hi
	}
	if lo != 0 {
		lo -= d
	}
	if hi != 0 {
		hi += d
	}
	return lo, hi
}

// wrapWords breaks s into at most maxLines lines of at most width pixels
// at the given font size, shortening the last line with an ellipsis when
// the words do not fit.
func wrapWords(s string, width, size float64, maxLines int) []string {
	words := strings.Fields(s)
	if len(words) == 0 || maxLines < 1 {
		return nil
	}
	var lines []string
	cur := ""
	for i, w := range words {
		next := w
		if cur != "" {
			next = cur + " " + w
		}
		if cur == "" || textWidth(next, size) <= width {
			cur = next
			continue
		}
		if len(lines) == maxLines-1 {
			cur = cur + " " + strings.Join(words[i:], " ")
			break
		}
		lines = append(lines, cur)
		cur = w
	}
	lines = append(lines, cur)
	for i := range lines {
		lines[i] = fit(lines[i], width, size)
	}
	return lines
}

// finiteRange returns the smallest and largest finite values of the
// slices, and false when there is none.
func finiteRange(vs ...[]float64) (lo, hi float64, ok bool) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, v := range vs {
		for _, x := range v {
			if isFinite(x) {
				lo, hi = math.Min(lo, x), math.Max(hi, x)
			}
		}
	}
	return lo, hi, lo <= hi
}
