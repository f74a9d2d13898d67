// Package plot draws Porelight's results as SVG: isochrones of excess pore
// pressure, the average degree of consolidation, settlement and piezometer
// histories against log time, the steady head and stress profiles, the
// added vertical stress of every load stage against depth (StressFigure),
// and a to-scale cross-section of the loaded areas and the column
// (SectionFigure, from the project alone).
//
// The geometry (scales, ticks, path data, the layer strip, legends and the
// hover read-out) is built by plain Go in this package and is tested
// natively; the vugu components only bind it. The same geometry writes the
// standalone SVG files offered for download (see IsochronesSVG and its
// siblings), and every plot also exports its numbers as CSV.
//
// Conventions: depth increases downward on every depth axis and the layer
// strip is drawn to the same scale; settlement and the degree of
// consolidation also grow downward; time axes are logarithmic (days),
// except that the record plots can run on calendar dates from
// monitoring.start (DateTicks, RecordAxes) and the differences of the
// records against time (ResidualsFigure) are on a linear axis. The
// settlement plot draws the surface load in a strip above it, on its own
// time axis.
// Figures and CSV exports show the unit system set by SetUnits (SI by
// default; US customary: ft, in, psf), converting the data before the
// ticks are chosen; times stay in days, years or dates.
// Colours, lightness and dash patterns are varied together so that curves
// stay apart when printed in grey.
//
// 0_components_gen.go is generated from the .vugu files and committed:
// run `rm -f *_gen.go && go generate .` in this folder after editing one
// (the second generate step gofmts it, as the vet check expects).
package plot

//go:generate go tool vugugen -skip-go-mod -skip-main -s .
//go:generate gofmt -w 0_components_gen.go
