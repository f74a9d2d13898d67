package plot

import "porelight/solver"

// The plot components. Each takes the project and the result of a solve
// and draws one Figure through Chart; Width and Height are pixels, zero for
// the default size (640 × 420). The figure is rebuilt on every render from
// the current props, so a new Result or an edited Project shows at once.
// Each root svg has a stable id: plot-isochrones, plot-degree,
// plot-settlement, plot-piezometers, plot-steady.

// Isochrones draws IsochronesFigure.
type Isochrones struct {
	Project       *solver.Project
	Result        *solver.Result
	Width, Height int

	memo figMemo
}

// Figure builds the figure drawn for the current props.
func (c *Isochrones) Figure() *Figure {
	return c.memo.get(figKey{p: c.Project, r: c.Result, w: c.Width, h: c.Height}, func() *Figure {
		return IsochronesFigure(c.Project, c.Result, c.Width, c.Height)
	})
}

// Degree draws DegreeFigure.
type Degree struct {
	Project       *solver.Project
	Result        *solver.Result
	Width, Height int

	memo figMemo
}

// Figure builds the figure drawn for the current props.
func (c *Degree) Figure() *Figure {
	return c.memo.get(figKey{p: c.Project, r: c.Result, w: c.Width, h: c.Height}, func() *Figure {
		return DegreeFigure(c.Project, c.Result, c.Width, c.Height)
	})
}

// Settlement draws SettlementFitFigure: Fit, when set, is the result of a
// back-fitted project drawn beside the prediction.
type Settlement struct {
	Project       *solver.Project
	Result        *solver.Result
	Fit           *solver.Result
	Dates         bool // on calendar dates when monitoring.start is set
	Width, Height int

	memo figMemo
}

// Figure builds the figure drawn for the current props.
func (c *Settlement) Figure() *Figure {
	return c.memo.get(figKey{p: c.Project, r: c.Result, fit: c.Fit, a: c.Dates, w: c.Width, h: c.Height}, func() *Figure {
		return SettlementTimeFigure(c.Project, c.Result, c.Fit, c.Dates, c.Width, c.Height)
	})
}

// Piezometers draws PiezometersFitFigure; Fit as for Settlement.
type Piezometers struct {
	Project       *solver.Project
	Result        *solver.Result
	Fit           *solver.Result
	Dates         bool // as for Settlement
	Level         bool // as water levels (RecordAxes.Level)
	Width, Height int

	memo figMemo
}

// Figure builds the figure drawn for the current props.
func (c *Piezometers) Figure() *Figure {
	return c.memo.get(figKey{p: c.Project, r: c.Result, fit: c.Fit, a: c.Dates, b: c.Level, w: c.Width, h: c.Height}, func() *Figure {
		return PiezometersTimeFigure(c.Project, c.Result, c.Fit, RecordAxes{Dates: c.Dates, Level: c.Level}, c.Width, c.Height)
	})
}

// SteadyProfiles draws SteadyFigure.
type SteadyProfiles struct {
	Project       *solver.Project
	Result        *solver.Result
	Width, Height int

	memo figMemo
}

// Figure builds the figure drawn for the current props.
func (c *SteadyProfiles) Figure() *Figure {
	return c.memo.get(figKey{p: c.Project, r: c.Result, w: c.Width, h: c.Height}, func() *Figure {
		return SteadyFigure(c.Project, c.Result, c.Width, c.Height)
	})
}
