package ui

import (
	"fmt"

	"github.com/vugu/vugu"

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
	// Dates draws the settlement and piezometer plots on calendar dates
	// (when monitoring.start is set); SetDates changes it, in the Root.
	Dates    bool
	SetDates func(on bool)
	// Level shows the piezometers as water levels (m) instead of pore
	// pressure; SetLevel changes it, in the Root.
	Level    bool
	SetLevel func(on bool)
}

func (c *Plots) setLevel(e vugu.DOMEvent) {
	if c.SetLevel != nil {
		c.SetLevel(e.PropBool("target", "checked"))
	}
}

// hasStart says whether the records have a day 0 date, so that the
// calendar date axis can be offered.
func (c *Plots) hasStart() bool {
	_, ok := plot.MonitoringStart(c.P)
	return ok
}

func (c *Plots) setDates(e vugu.DOMEvent) {
	if c.SetDates != nil {
		c.SetDates(e.PropBool("target", "checked"))
	}
}

type plotKind struct {
	Name, Title, Lower string
	svg                func(p *solver.Project, r, fit *solver.Result, ax plot.RecordAxes) string
	csv                func(*solver.Result) string
}

// noFit adapts the SVG writer of a plot that draws no back-fit.
func noFit(svg func(*solver.Project, *solver.Result, int, int) string) func(*solver.Project, *solver.Result, *solver.Result, plot.RecordAxes) string {
	return func(p *solver.Project, r, _ *solver.Result, _ plot.RecordAxes) string { return svg(p, r, 0, 0) }
}

// plotKinds are the plots in page order.
var plotKinds = []plotKind{
	{"isochrones", "Isochrones of excess pore pressure", "isochrone", noFit(plot.IsochronesSVG), plot.IsochronesCSV},
	{"settlement", "Settlement against time", "settlement", func(p *solver.Project, r, fit *solver.Result, ax plot.RecordAxes) string {
		return plot.SettlementTimeFigure(p, r, fit, ax.Dates, 0, 0).SVG()
	}, plot.SettlementCSV},
	{"degree", "Average degree of consolidation", "degree of consolidation", noFit(plot.DegreeSVG), plot.DegreeCSV},
	{"piezometers", "Piezometers", "piezometer", func(p *solver.Project, r, fit *solver.Result, ax plot.RecordAxes) string {
		return plot.PiezometersTimeFigure(p, r, fit, ax, 0, 0).SVG()
	}, plot.PiezometersCSV},
	{"steady", "Steady state: head, pore pressure and stresses", "steady state", noFit(plot.SteadySVG), plot.SteadyCSV},
	{"stress", "Added vertical stress with depth", "added stress", noFit(plot.StressSVG), plot.StressCSV},
	{"checks", "Heave and uplift factors against time", "heave and uplift", noFit(plot.ChecksSVG), plot.ChecksCSV},
}

// plotFile returns the download of one plot: its SVG drawing or the
// numbers behind it as CSV. fit is the back-fitted result the plot shows,
// or nil; ax the axes of the record plots, as on the page.
func plotFile(name, format string, p *solver.Project, r, fit *solver.Result, ax plot.RecordAxes) (data []byte, mime string, err error) {
	for _, k := range plotKinds {
		if k.Name != name {
			continue
		}
		switch format {
		case "svg":
			return []byte(k.svg(p, r, fit, ax)), "image/svg+xml", nil
		case "csv":
			return []byte(k.csv(r)), "text/csv", nil
		}
	}
	return nil, "", fmt.Errorf("no %s export of a %q plot", format, name)
}
