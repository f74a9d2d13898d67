package plot

import (
	"math"

	"porelight/solver"
)

// SectionFigure sketches, to one scale across and down, the cross-section
// of the loaded areas through the column: the layers under the original
// ground, the water table, every stage with a loaded area (fills at their
// thickness, stacked in order; a pressure stage as a thin band of its
// width), and the column at its offset. It reads only the project.
func SectionFigure(p *solver.Project, w, h int) *Figure {
	f := newFigure("plot-section", "Cross-section of the loads and the column (to scale)", w, h)
	if p == nil || len(p.Layers) == 0 {
		return f.message(msgNoResult)
	}
	bs := layerBands(p, nil)
	depth := columnDepth(bs)
	type piece struct {
		half, crest, top, bottom, x float64 // m; x: the column's offset under it
		stage                       int
		fill                        bool
		label                       string
	}
	var ps []piece
	reach, stack := 0.0, 0.0
	for i, l := range p.Loads {
		a := l.Area
		if a == nil {
			continue
		}
		pc := piece{stage: i, x: a.X, fill: l.Fill != nil, label: itoa(i + 1)}
		switch a.Shape {
		case "circle":
			pc.half = a.Radius
		case "embankment":
			run := 0.0
			if l.Fill != nil {
				run = a.Slope * math.Abs(l.Fill.Thickness)
			}
			pc.half, pc.crest = a.Width/2+run, a.Width/2
		default:
			pc.half = a.Width / 2
		}
		if a.Shape != "embankment" {
			pc.crest = pc.half
		}
		pc.bottom = stack
		if l.Fill != nil && l.Fill.Thickness > 0 {
			stack += l.Fill.Thickness
			pc.top = stack
		} else {
			pc.top = pc.bottom
		}
		if !isFinite(pc.half) || !(pc.half > 0) || !isFinite(pc.x) {
			continue
		}
		reach = math.Max(reach, pc.half+math.Abs(pc.x))
		ps = append(ps, pc)
	}
	if len(ps) == 0 || !(depth > 0) {
		return f.message("No loaded area: choose a strip, rectangle, circle or embankment for a stage.")
	}
	// One scale for both directions, centred on the loaded areas' axis.
	band := 0.04 * (depth + stack) // drawn thickness of a pressure stage
	if band == 0 {
		band = 1
	}
	top := stack + band
	left, right, up, down := 40.0, 20.0, 40.0, 16.0
	spanX := 2 * reach * 1.15
	s := math.Min((f.W-left-right)/spanX, (f.H-up-down)/(depth+top))
	if need := up + (depth+top)*s + down + 14; need < f.H {
		// Drop the height the scale leaves unused.
		f.H = need
		f.Rects[0].H = need
	}
	cx := left + (f.W-left-right)/2
	y0 := up + top*s // the original ground surface
	X := func(x float64) float64 { return cx + x*s }
	Y := func(z float64) float64 { return y0 + z*s } // z down; heights are negative z
	// Layers under the ground.
	xl, xr := X(-spanX/2), X(spanX/2)
	for i, b := range bs {
		f.Rects = append(f.Rects, RectEl{Box: Box{xl, Y(b.Top), xr - xl, (b.Bottom - b.Top) * s},
			Fill: layerFills[i%len(layerFills)], Stroke: "#8a7f6c", StrokeWidth: 0.5})
	}
	if wt := p.WaterTable; isFinite(wt) && wt >= -top && wt <= depth {
		y := Y(wt)
		f.path("M"+coord(xl)+" "+coord(y)+" H"+coord(xr), "#2f6db3", "6 3", 1.2)
		f.text(xr-4, y-4, "water table", "end", 10, "#2f6db3")
	}
	// The loads.
	for _, pc := range ps {
		st := styleAt(pc.stage)
		b := pc.bottom
		t := pc.top
		if !pc.fill || t <= b {
			t = b + band
		}
		d := "M" + coord(X(-pc.half)) + " " + coord(Y(-b)) + " L" + coord(X(-pc.crest)) + " " + coord(Y(-t)) +
			" H" + coord(X(pc.crest)) + " L" + coord(X(pc.half)) + " " + coord(Y(-b)) + " Z"
		el := f.path(d, st.Stroke, "none", 1.2)
		el.Fill = "#f3efe6"
		if !pc.fill {
			el.Dash = "4 2"
		}
		f.text(X(0), Y(-(b+t)/2)+4, "stage "+pc.label, "middle", 10, inkText).Halo = true
	}
	// The column, at the offset of the first area.
	x := X(ps[0].x)
	cw := math.Max(6, 0.02*(xr-xl))
	f.Rects = append(f.Rects, RectEl{Box: Box{x - cw/2, Y(0), cw, depth * s}, Fill: "none", Stroke: inkAxis, StrokeWidth: 1.5})
	f.text(x, Y(depth)+12, "column", "middle", 10, inkText)
	// A scale bar, a round length in the unit shown.
	shownBar := niceLength(uLength.of(spanX / 5))
	bar := uLength.back(shownBar)
	f.path("M"+coord(xl)+" "+coord(f.H-6)+" h"+coord(bar*s), inkAxis, "none", 2)
	f.text(xl+bar*s+4, f.H-3, sig(shownBar, 3)+uLength.tail(), "start", 10, inkMuted)
	return f
}

// Section draws SectionFigure.
type Section struct {
	Project       *solver.Project
	Width, Height int

	memo figMemo
}

// Figure builds the figure drawn for the current props.
func (c *Section) Figure() *Figure {
	return c.memo.get(figKey{p: c.Project, w: c.Width, h: c.Height}, func() *Figure {
		return SectionFigure(c.Project, c.Width, c.Height)
	})
}
