package plot

import (
	"math"

	"porelight/solver/monitor"
	"porelight/ui/units"
)

// AsaokaFigure builds the plot of Asaoka's method for one settlement
// record, in mm (in in US units): each resampled settlement s(j) against the one before,
// s(j−1); the fitted line s(j) = β0 + β1 s(j−1); the 45° line
// s(j) = s(j−1); and the forecast final settlement where the two meet.
// Both axes share one scale, so the 45° line is drawn at 45°. id is the
// id of the root svg (one per record on a page).
func AsaokaFigure(id, title string, a *monitor.AsaokaResult, w, h int) *Figure {
	f := newFigure(id, title, w, h)
	if a == nil || len(a.Settlements) < 2 || len(a.Fitted) != len(a.Settlements)-1 {
		return f.message("No forecast: Asaoka's method did not give one for this record.")
	}
	const mm = 1000
	mmOf := func(m float64) float64 { return uMM.of(m * mm) } // a settlement in m, as shown
	n := len(a.Settlements)
	prev, next, fitted := make([]float64, n-1), make([]float64, n-1), make([]float64, n-1)
	for j := 1; j < n; j++ {
		prev[j-1], next[j-1], fitted[j-1] = mmOf(a.Settlements[j-1]), mmOf(a.Settlements[j]), mmOf(a.Fitted[j-1])
	}
	final := mmOf(a.Final)
	unit := uMM.tail()
	lo, hi, ok := finiteRange(prev, next, []float64{final})
	if !ok {
		return f.message("No forecast: the record holds no finite settlement.")
	}
	span := math.Max(hi-lo, 1e-9*math.Max(1, math.Abs(hi)))
	lo, hi = lo-0.06*span, hi+0.06*span

	// One square panel: the same settlement per pixel on both axes.
	side := math.Min(f.W-legendW-8-timeLeft, f.H-timeBottom-timeTop)
	box := Box{timeLeft, timeTop, side, side}
	lo, hi, step := NiceRange(lo, hi, int(math.Max(2, side/50)))
	pn := &Panel{Box: box,
		X: Scale{Lo: lo, Hi: hi, A: box.X, B: box.Right()},
		Y: Scale{Lo: lo, Hi: hi, A: box.Bottom(), B: box.Y}}
	ticks := LinearTicks(lo, hi, step)
	f.grid(pn, ticks, true)
	f.grid(pn, ticks, false)
	f.frame(box)
	f.axis(box, pn.X, ticks, sideBottom, "s(j−1), settlement one step before, "+uMM.sym())
	f.axis(box, pn.Y, ticks, sideLeft, "s(j), settlement, "+uMM.sym())
	f.Panels = append(f.Panels, pn)
	clip := f.clip(box)

	equal := Style{Stroke: inkMuted, Dash: "5 3", Width: 1.25}
	f.addSeries(pn, clip, "45° line", equal, []float64{lo, hi}, []float64{lo, hi}, nil)
	line := func(x float64) float64 { return mmOf(a.Beta0) + a.Beta1*x }
	read := func(q Pt) string { return "s(j−1) = " + sig(q.DX, 4) + unit + ", s(j) = " + sig(q.DY, 4) + unit }
	f.addSeries(pn, clip, "fitted line", styleAt(0), []float64{lo, hi}, []float64{line(lo), line(hi)}, read)
	f.addPoints(pn, clip, "resampled readings", markAt(1), prev, next, read)
	fc := Style{Stroke: "#8f1d14", Width: 1.5, Shape: "diamond", Open: true}
	label := "forecast s∞ = " + sig(final, 3) + unit
	if s := f.addPoints(pn, clip, label, fc, []float64{final}, []float64{final}, func(Pt) string {
		return "s∞ = " + sig(final, 4) + " ± " + sig(mmOf(a.FinalSE), 2) + unit
	}); s != nil && len(s.Pts) == 1 {
		q := s.Pts[0]
		f.path("M"+coord(q.X)+" "+coord(q.Y)+" V"+coord(box.Bottom()), fc.Stroke, "2 3", 1).Clip = clip
		t := f.text(q.X-8, q.Y-8, "s∞ = "+sig(final, 3)+unit, "end", 11, fc.Stroke)
		t.Halo = true
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}

// AsaokaSVG returns the Asaoka plot of a record as a standalone SVG.
func AsaokaSVG(id, title string, a *monitor.AsaokaResult) string {
	return AsaokaFigure(id, title, a, 0, 0).SVG()
}

// AsaokaCSV returns the resampled record of Asaoka's method as CSV: time,
// s(j), s(j−1) and the fitted s(j), in days and mm (in in US units; the
// first row has no previous step).
func AsaokaCSV(a *monitor.AsaokaResult) string {
	u := " (" + uMM.sym() + ")"
	header := []string{"time t(j) (day)", "settlement s(j)" + u, "previous settlement s(j-1)" + u, "fitted s(j)" + u}
	if a == nil {
		return writeCSV(header, nil)
	}
	rows := make([][]string, len(a.Times))
	for j, t := range a.Times {
		row := []string{csvNum(t), "", "", ""}
		if j < len(a.Settlements) {
			row[1] = csvNum(uMM.of(a.Settlements[j] * 1000))
		}
		if j > 0 && j < len(a.Settlements) {
			row[2] = csvNum(uMM.of(a.Settlements[j-1] * 1000))
		}
		if j > 0 && j-1 < len(a.Fitted) {
			row[3] = csvNum(uMM.of(a.Fitted[j-1] * 1000))
		}
		rows[j] = row
	}
	return writeCSV(header, rows)
}

// Asaoka draws AsaokaFigure for one record; ID is the svg's id.
type Asaoka struct {
	ID, Title     string
	Result        *monitor.AsaokaResult
	Width, Height int

	fig  *Figure   // built for the props in made
	made asaokaKey // the props fig was built for
}

type asaokaKey struct {
	id, title string
	a         *monitor.AsaokaResult
	w, h      int
	u         units.System
}

// Figure builds the figure drawn for the current props, once per change
// of them.
func (c *Asaoka) Figure() *Figure {
	k := asaokaKey{c.ID, c.Title, c.Result, c.Width, c.Height, shown}
	if c.fig == nil || k != c.made {
		c.fig, c.made = AsaokaFigure(c.ID, c.Title, c.Result, c.Width, c.Height), k
	}
	return c.fig
}
