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
	Export func(name, format string)
}

type plotKind struct {
	Name, Title, Lower string
	svg                func(*solver.Project, *solver.Result, int, int) string
	csv                func(*solver.Result) string
}

// plotKinds are the plots in page order.
var plotKinds = []plotKind{
	{"isochrones", "Isochrones of excess pore pressure", "isochrone", plot.IsochronesSVG, plot.IsochronesCSV},
	{"settlement", "Settlement against time", "settlement", plot.SettlementSVG, plot.SettlementCSV},
	{"degree", "Average degree of consolidation", "degree of consolidation", plot.DegreeSVG, plot.DegreeCSV},
	{"piezometers", "Piezometers", "piezometer", plot.PiezometersSVG, plot.PiezometersCSV},
	{"steady", "Steady state: head, pore pressure and stresses", "steady state", plot.SteadySVG, plot.SteadyCSV},
}

// plotFile returns the download of one plot: its SVG drawing or the
// numbers behind it as CSV.
func plotFile(name, format string, p *solver.Project, r *solver.Result) (data []byte, mime string, err error) {
	for _, k := range plotKinds {
		if k.Name != name {
			continue
		}
		switch format {
		case "svg":
			return []byte(k.svg(p, r, 0, 0)), "image/svg+xml", nil
		case "csv":
			return []byte(k.csv(r)), "text/csv", nil
		}
	}
	return nil, "", fmt.Errorf("no %s export of a %q plot", format, name)
}
