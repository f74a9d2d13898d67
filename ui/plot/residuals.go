package plot

import (
	"math"
	"reflect"

	"porelight/solver"
)

// ResidualRecord is one record's differences between reading and
// prediction, for ResidualsFigure.
type ResidualRecord struct {
	Name string
	// Pressure is true for a piezometer (kPa), false for a plate (mm);
	// the figure shows them in the units shown (psf, in).
	Pressure bool
	// Times (days after day 0) and Diffs (measured − predicted, mm or
	// kPa) of the readings that have a prediction.
	Times, Diffs []float64
}

// ResidualsFigure builds the plot of measured minus predicted against
// time: plates in mm in the upper panel, piezometers in kPa in the lower
// one (a panel only where there are such records), each record in its
// own marks, with the zero line. The time axis is
// linear in days, or calendar dates from p's monitoring.start when dates
// is set, over the readings and day 0; both panels share it.
func ResidualsFigure(p *solver.Project, recs []ResidualRecord, dates bool, w, h int) *Figure {
	f := newFigure("plot-residuals", "Measured minus predicted against time", w, h)
	var groups [2][]int
	tlo, thi := 0.0, math.Inf(-1)
	for i, r := range recs {
		if len(r.Times) == 0 || len(r.Times) != len(r.Diffs) {
			continue
		}
		k := 0
		if r.Pressure {
			k = 1
		}
		groups[k] = append(groups[k], i)
		for _, t := range r.Times {
			if isFinite(t) {
				tlo, thi = math.Min(tlo, t), math.Max(thi, t)
			}
		}
	}
	if len(groups[0])+len(groups[1]) == 0 || !(thi > tlo) {
		return f.message("No differences to plot: no reading has a prediction at its time.")
	}
	thi += 0.03 * (thi - tlo)
	start, onDates := MonitoringStart(p)
	onDates = onDates && dates
	n := 0
	for _, g := range groups {
		if len(g) > 0 {
			n++
		}
	}
	const gap = 52.0 // between panels: the upper one's tick labels and title
	width := f.W - legendW - 8 - timeLeft
	height := (f.H - timeTop - timeBottom - gap*float64(n-1)) / float64(n)
	y := float64(timeTop)
	kinds := [2]dim{uMM, uStress}
	labels := [2]string{"Settlement difference, " + uMM.sym(), "Pressure difference, " + uStress.sym()}
	for k, g := range groups {
		if len(g) == 0 {
			continue
		}
		var all [][]float64
		for _, i := range g {
			all = append(all, kinds[k].all(recs[i].Diffs))
		}
		lo, hi, _ := finiteRange(all...)
		m := math.Max(math.Max(math.Abs(lo), math.Abs(hi)), 1e-6)
		ylo, yhi, step := NiceRange(-m, m, int(math.Max(2, height/40)))
		box := Box{timeLeft, y, width, height}
		pn := &Panel{Box: box, X: Scale{Lo: tlo, Hi: thi, A: box.X, B: box.Right()}, Y: Scale{Lo: ylo, Hi: yhi, A: box.Bottom(), B: box.Y}}
		var xt []Tick
		title := "Time, days"
		if onDates {
			xt = DateTicks(start, tlo, thi, width)
			title = "Date (day 0 = " + start.Format(solver.DateLayout) + ")"
		} else {
			lo, hi, st := NiceRange(tlo, thi, int(math.Max(2, width/80)))
			xt = LinearTicks(lo, hi, st)
			pn.X.Lo, pn.X.Hi = lo, hi
		}
		pn.XTicks = xt
		yt := LinearTicks(ylo, yhi, step)
		f.grid(pn, xt, true)
		f.grid(pn, yt, false)
		f.frame(box)
		f.axis(box, pn.X, xt, sideBottom, title)
		f.axis(box, pn.Y, yt, sideLeft, labels[k])
		zero := pn.Y.Map(0)
		f.path("M"+coord(box.X)+" "+coord(zero)+" H"+coord(box.Right()), inkAxis, "none", 1)
		f.Panels = append(f.Panels, pn)
		clip := f.clip(box)
		for j, i := range g {
			r := recs[i]
			mk := markAt(j)
			mk.Stroke = styleAt(j).Stroke
			f.addPoints(pn, clip, r.Name, mk, r.Times, all[j], readTime("difference", kinds[k].tail(), 3))
		}
		y += height + gap
	}
	f.legend(f.W-legendW+8, timeTop+8, legendW-12, int((f.H-timeTop-20)/16), f.allSeries())
	return f
}

// Residuals draws ResidualsFigure.
type Residuals struct {
	Project       *solver.Project
	Records       []ResidualRecord
	Dates         bool
	Width, Height int

	memo    figMemo
	records []ResidualRecord // the records memo's figure shows
}

// Figure builds the figure drawn for the current props, once per change
// of them (the records are made anew on every render, so they are
// compared by value: new ones outdate the memo, which then treats them
// as it treats new props, out of view too).
func (c *Residuals) Figure() *Figure {
	if !reflect.DeepEqual(c.records, c.Records) {
		c.memo.outdate()
		c.records = c.Records
	}
	return c.memo.get(figKey{p: c.Project, a: c.Dates, w: c.Width, h: c.Height}, func() *Figure {
		return ResidualsFigure(c.Project, c.Records, c.Dates, c.Width, c.Height)
	})
}
