package ui

import "porelight/ui/plot"

// Figures in view first. A new result changes every figure, and building
// and sending the demo's dozen figures is most of a redraw after a solve.
// The render that shows a new result builds only the figures in view
// (Screen.InView) and the summary and tables, and lets the others keep
// their last figure (plot.KeepOutside); once the browser has painted it,
// one more render builds those. A figure out of view is thus a frame or
// two late, never wrong on screen; meanwhile the results column says
// aria-busy="true". Without a Screen (tests, static renders), while
// printing and in every other render, all are built.

// Compute runs before each build of the page.
func (c *Root) Compute() {
	plot.KeepOutside(nil)
	c.drawing = false
	fresh := c.fresh
	c.fresh = false
	s, ok := c.host().(Screen)
	if !fresh || !ok || c.printing {
		return
	}
	c.drawing = true
	s.AfterPaint(c.drawRest)
	plot.KeepOutside(func(id string) bool { return !s.InView(id) })
}

// drawRest renders the page again, from a browser callback after the
// render that left figures out of view as they were.
func (c *Root) drawRest() {
	if c.Env == nil {
		return // tests build again themselves
	}
	go func() {
		c.Env.Lock()
		c.Env.UnlockRender()
	}()
}
