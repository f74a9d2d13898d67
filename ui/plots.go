package ui

import (
	"fmt"

	"porelight/solver"
	"porelight/ui/plot"
)

// Plots mounts the plots of package plot, each with its SVG and CSV
// export.
type Plots struct {
	P      *solver.Project // the project R belongs to
	R      *solver.Result
	Fit    *solver.Result // a back-fitted result to draw beside R, or nil
	Export func(name, format string)
}

type plotKind struct {
	Name, Title, Lower string
	svg                func(p *solver.Project, r, fit *solver.Result) string
	csv                func(*solver.Result) string
}

// noFit adapts the SVG writer of a plot that draws no back-fit.
func noFit(svg func(*solver.Project, *solver.Result, int, int) string) func(*solver.Project, *solver.Result, *solver.Result) string {
	return func(p *solver.Project, r, _ *solver.Result) string { return svg(p, r, 0, 0) }
}

// plotKinds are the plots in page order.
var plotKinds = []plotKind{
	{"isochrones", "Isochrones of excess pore pressure", "isochrone", noFit(plot.IsochronesSVG), plot.IsochronesCSV},
	{"settlement", "Settlement against time", "settlement", func(p *solver.Project, r, fit *solver.Result) string {
		return plot.SettlementFitFigure(p, r, fit, 0, 0).SVG()
	}, plot.SettlementCSV},
	{"degree", "Average degree of consolidation", "degree of consolidation", noFit(plot.DegreeSVG), plot.DegreeCSV},
	{"piezometers", "Piezometers", "piezometer", func(p *solver.Project, r, fit *solver.Result) string {
		return plot.PiezometersFitFigure(p, r, fit, 0, 0).SVG()
	}, plot.PiezometersCSV},
	{"steady", "Steady state: head, pore pressure and stresses", "steady state", noFit(plot.SteadySVG), plot.SteadyCSV},
	{"stress", "Added vertical stress with depth", "added stress", noFit(plot.StressSVG), plot.StressCSV},
}

// plotFile returns the download of one plot: its SVG drawing or the
// numbers behind it as CSV. fit is the back-fitted result the plot shows,
// or nil.
func plotFile(name, format string, p *solver.Project, r, fit *solver.Result) (data []byte, mime string, err error) {
	for _, k := range plotKinds {
		if k.Name != name {
			continue
		}
		switch format {
		case "svg":
			return []byte(k.svg(p, r, fit)), "image/svg+xml", nil
		case "csv":
			return []byte(k.csv(r)), "text/csv", nil
		}
	}
	return nil, "", fmt.Errorf("no %s export of a %q plot", format, name)
}
