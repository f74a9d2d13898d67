package plot

import "github.com/vugu/vugu"

// Chart draws a Figure as inline SVG and reads out the data point nearest
// the pointer. The plot components wrap it; it can also draw any Figure.
//
// The pointer handler sits on the root svg (everything inside ignores the
// pointer), because only then does the event carry the svg's rendered size
// next to the pointer offset, which turns CSS pixels back into figure
// pixels when a style sheet scales the plot.
type Chart struct {
	// Fig is the figure to draw; nil draws nothing useful, so the plot
	// components always set it.
	Fig *Figure

	px, py float64 // pointer, figure pixels
	on     bool    // pointer over the svg
	hover  *Hover  // read-out for this build

	markup    vugu.HTML // Body of markupFor
	markupFor *Figure
}

// body is the figure's markup, made once per figure: the page receives
// it as one string, which the renderer sets only when it changed
// (static.PatchHelper), instead of some three thousand attributes each
// render. The read-out stays apart, as elements of its own.
func (c *Chart) body() vugu.HTML {
	if c.markupFor != c.Fig {
		c.markup, c.markupFor = vugu.HTML(c.Fig.Body()), c.Fig
	}
	return c.markup
}

// Compute prepares the read-out for the coming build.
func (c *Chart) Compute() {
	if c.Fig == nil {
		c.Fig = newFigure("plot", "", 0, 0).message(msgNoResult)
	}
	c.hover = nil
	if c.on {
		c.hover = c.Fig.HoverAt(c.px, c.py)
	}
}

// Move follows the pointer (pointermove on the svg).
func (c *Chart) Move(e vugu.DOMEvent) {
	if c.Fig == nil {
		return
	}
	x, y, ok := figurePoint(
		e.PropFloat64("offsetX"), e.PropFloat64("offsetY"),
		e.PropFloat64("target", "clientWidth"), e.PropFloat64("target", "clientHeight"),
		c.Fig.W, c.Fig.H)
	c.px, c.py, c.on = x, y, ok
}

// Leave hides the read-out (pointerleave on the svg).
func (c *Chart) Leave() { c.on = false }

// figurePoint converts a pointer offset (ox, oy), in CSS pixels from the
// svg's top-left corner, to figure pixels, for an svg rendered cw × ch CSS
// pixels showing a w × h viewBox with the default aspect handling (scaled
// uniformly to fit, centred). A zero rendered size means unscaled. ok is
// false for non-finite input.
func figurePoint(ox, oy, cw, ch, w, h float64) (x, y float64, ok bool) {
	if !isFinite(ox) || !isFinite(oy) {
		return 0, 0, false
	}
	if !(cw > 0) || !(ch > 0) || !isFinite(cw) || !isFinite(ch) || !(w > 0) || !(h > 0) {
		return ox, oy, true
	}
	s := min(cw/w, ch/h)
	dx, dy := (cw-w*s)/2, (ch-h*s)/2
	return (ox - dx) / s, (oy - dy) / s, true
}
