package plot

import "porelight/ui/units"

// Display units. The file, the solver and its Result stay SI; the
// figures and the CSV exports made here show the unit system the user
// chose. The page shows one system at a time, so it is a package
// setting rather than a prop of every component: a figure reads it when
// it is built, and the plot components' memo keys hold it (figKey.u,
// asaokaKey.u), so that a switch rebuilds every figure.
var shown = units.SI

// SetUnits makes the figures and exports built from now on show s.
func SetUnits(s units.System) { shown = s }

// Units is the unit system the figures and exports show.
func Units() units.System { return shown }

// dim is what a plotted number measures, as the plot holds it: in the
// file's unit (m, kPa), a settlement in m or in mm. A plot converts its
// data with of or all before it picks ranges and ticks, so that the axes
// read round numbers in the unit shown.
type dim uint8

const (
	uLength dim = iota // depth, head, thickness, chainage, spacing: m | ft
	uSettle            // a settlement held in m: m | in
	uMM                // a settlement or a drain's diameter held in mm: mm | in
	uStress            // pressure, stress, strength: kPa | psf
)

var dims = [...]struct {
	q  units.Quantity
	k  float64 // the held value × k is in q's SI display unit
	si string  // the symbol shown in SI
}{
	uLength: {units.Length, 1, "m"},
	uSettle: {units.Settlement, 1000, "m"},
	uMM:     {units.Settlement, 1, "mm"},
	uStress: {units.Stress, 1, "kPa"},
}

// sym is the symbol of the unit d is shown in: "m", "ft".
func (d dim) sym() string {
	if shown == units.SI {
		return dims[d].si
	}
	return shown.Symbol(dims[d].q)
}

// tail is sym after a space, as read-outs append it: " m", " ft".
func (d dim) tail() string { return " " + d.sym() }

// of converts x from the unit d is held in to the unit shown; in SI it
// returns x itself, so that SI figures stay as they were.
func (d dim) of(x float64) float64 {
	if shown == units.SI {
		return x
	}
	return shown.Show(dims[d].q, x*dims[d].k)
}

// back converts x from the unit shown to the unit d is held in.
func (d dim) back(x float64) float64 {
	if shown == units.SI {
		return x
	}
	return x * shown.Of(dims[d].q).ToSI / dims[d].k
}

// all converts xs as of does: xs itself in SI, else a new slice.
func (d dim) all(xs []float64) []float64 {
	if shown == units.SI || xs == nil {
		return xs
	}
	out := make([]float64, len(xs))
	for i, x := range xs {
		out[i] = d.of(x)
	}
	return out
}
