package plot

import (
	"math"
	"slices"
	"strconv"
	"strings"
	"testing"

	"porelight/solver"
	"porelight/solver/monitor"
	"porelight/ui/units"
)

// Conversion factors from NIST Special Publication 811 (2008), appendix
// B.8 and B.9, written here rather than taken from package units so that
// the tests check its arithmetic: the foot and the inch are exact; the
// pound-force per square foot is tabulated to seven figures,
// 4.788026 E+01 Pa, so checks against it allow 1e-7 relative.
const (
	nistFoot = 0.3048   // m, exact
	nistInch = 0.0254   // m, exact
	nistPsf  = 47.88026 // Pa, to 7 figures
)

// Units shown in US customary per unit the plot holds.
const (
	ftPerM    = 1 / nistFoot
	inPerM    = 1 / nistInch
	inPerMM   = 1 / (1000 * nistInch)
	psfPerKPa = 1000 / nistPsf
)

// Tolerances, relative: exact definitions leave only rounding; the psf
// factor is good to the 7 figures of the table.
const (
	tolExact = 1e-12
	tolPsf   = 1e-7
)

// inUnits runs build with the figures showing s, and puts SI back when
// the test ends. The unit system is a package setting, so the tests that
// change it never call t.Parallel: a top-level test that does not is
// never run beside the parallel ones.
func inUnits[T any](t *testing.T, s units.System, build func() T) T {
	t.Helper()
	t.Cleanup(func() { SetUnits(units.SI) })
	SetUnits(s)
	defer SetUnits(units.SI)
	return build()
}

// asaokaFixture is the record of TestAsaokaFigureGeometry: settlements in
// m, s∞ = β0/(1 − β1) = 0.2 m.
func asaokaFixture() *monitor.AsaokaResult {
	a := &monitor.AsaokaResult{Interval: 10, Times: []float64{0, 10, 20, 30},
		Settlements: []float64{0.1, 0.15, 0.175, 0.1875}, Beta0: 0.1, Beta1: 0.5, Final: 0.2, FinalSE: 0.001}
	for j := 1; j < 4; j++ {
		a.Fitted = append(a.Fitted, a.Beta0+a.Beta1*a.Settlements[j-1])
	}
	return a
}

func profileFixture() []ProfilePoint {
	return []ProfilePoint{{"A", 0, 0.2, true}, {"B", 120, 0.35, true}, {"C", 250, 0.3, true}}
}

// seriesNamed is the series called name in panel k of f, or nil.
func seriesNamed(f *Figure, k int, name string) *Series {
	if k >= len(f.Panels) {
		return nil
	}
	for _, s := range f.Panels[k].Series {
		if s.Name == name {
			return s
		}
	}
	return nil
}

// tickGroups collects the tick labels of f's linear axes, size 11, by
// axis: labels anchored at the end (a left axis) by their x, centred ones
// (a top or bottom axis) by their y and the panel over them. Texts that
// do not read as a plain number are left out.
func tickGroups(f *Figure, anchors ...string) map[string][]float64 {
	g := map[string][]float64{}
	for _, t := range f.Texts {
		if t.Size != 11 || !slices.Contains(anchors, t.Anchor) {
			continue
		}
		v, err := strconv.ParseFloat(strings.Replace(t.Text, minus, "-", 1), 64)
		if err != nil {
			continue
		}
		key := "end " + coord(t.X)
		if t.Anchor == "middle" {
			pn := -1
			for i, p := range f.Panels {
				if t.X >= p.Box.X-1 && t.X <= p.Box.Right()+1 {
					pn = i
				}
			}
			key = "middle " + coord(t.Y) + " panel " + itoa(pn)
		}
		g[key] = append(g[key], v)
	}
	return g
}

// roundTicks reports why the labels vs of one axis are not round: they
// must be evenly spaced by a step of one significant figure (1-2-5 steps,
// or a multiple of one where labels were dropped for room) and be whole
// multiples of it. Ticks picked in m and shown in ft (0, 6.56, 13.1, …)
// fail.
func roundTicks(vs []float64) string {
	slices.Sort(vs)
	vs = slices.Compact(vs)
	if len(vs) < 2 {
		return "fewer than two labels"
	}
	d := vs[1] - vs[0]
	for i := 2; i < len(vs); i++ {
		if !closeTo(vs[i]-vs[i-1], d, 1e-9) {
			return "uneven spacing " + strconv.FormatFloat(vs[i]-vs[i-1], 'g', -1, 64) + " against " + strconv.FormatFloat(d, 'g', -1, 64)
		}
	}
	m := d / math.Pow(10, math.Floor(math.Log10(d)))
	if math.Abs(m-math.Round(m)) > 1e-9 {
		return "step " + strconv.FormatFloat(d, 'g', -1, 64) + " has more than one significant figure"
	}
	if q := vs[0] / d; math.Abs(q-math.Round(q)) > 1e-9 {
		return "first label " + strconv.FormatFloat(vs[0], 'g', -1, 64) + " is not a multiple of the step"
	}
	return ""
}

// The figures in US customary units: their axis titles, legends,
// read-outs and captions name ft, in and psf and no SI unit; a plotted
// point is the SI point converted by the NIST SP 811 factors; the linear
// axes are ticked at round values of the unit shown; and once SI is
// shown again the figure is byte for byte what it was before the switch.
func TestFiguresInUSUnits(t *testing.T) {
	p, r := synthProject(), synthResult()
	dp := drainedProject()
	cases := []struct {
		name    string
		build   func() *Figure
		texts   []string // drawn in US units, whole texts
		notSI   []string // substrings no US text may hold
		read    string   // a read-out that must hold these units
		panel   int
		series  string
		fx, fy  float64 // US value per SI value of the point, x and y
		tol     float64
		anchors []string // the tick labels checked for round values
	}{
		{
			name: "steady head", build: func() *Figure { return SteadyFigure(p, r, 0, 0) },
			texts: []string{"Total head, ft", "Pressure and stress, psf", "Depth, ft"},
			notSI: []string{"kPa", ", m"}, read: " ft, h = ",
			panel: 0, series: "Total head h", fx: ftPerM, fy: ftPerM, tol: tolExact,
			anchors: []string{"end", "middle"},
		},
		{
			name: "steady stress", build: func() *Figure { return SteadyFigure(p, r, 0, 0) },
			read:  " psf",
			panel: 1, series: "Effective stress σ′v", fx: psfPerKPa, fy: ftPerM, tol: tolPsf,
		},
		{
			name: "isochrones", build: func() *Figure { return IsochronesFigure(p, r, 0, 0) },
			texts: []string{"Excess pore pressure, psf", "Depth, ft"},
			notSI: []string{"kPa", ", m"}, read: " psf",
			panel: 0, series: "t = 100 d", fx: psfPerKPa, fy: ftPerM, tol: tolPsf,
			anchors: []string{"end", "middle"},
		},
		{
			name: "settlement", build: func() *Figure { return SettlementFigure(p, r, 0, 0) },
			texts: []string{"Settlement, in"},
			notSI: []string{", m", " m "}, read: "s = ",
			panel: 0, series: "From mv", fx: 1, fy: inPerM, tol: tolExact,
			anchors: []string{"end"}, // the time axis is logarithmic
		},
		{
			name: "piezometers", build: func() *Figure { return PiezometersFigure(p, r, 0, 0) },
			texts: []string{"Pore pressure, psf"},
			notSI: []string{"kPa", " m,"}, read: " psf",
			panel: 0, series: "z = 8.2 ft, u", fx: 1, fy: psfPerKPa, tol: tolPsf,
			anchors: []string{"end"},
		},
		{
			name: "Asaoka", build: func() *Figure { return AsaokaFigure("plot-asaoka-0", "Asaoka", asaokaFixture(), 0, 0) },
			texts: []string{"s(j), settlement, in", "s(j−1), settlement one step before, in"},
			notSI: []string{"mm"}, read: " in, s(j) = ",
			panel: 0, series: "resampled readings", fx: inPerMM, fy: inPerMM, tol: tolExact,
			anchors: []string{"end", "middle"},
		},
		{
			name: "alignment profile", build: func() *Figure { return ProfileFigure(profileFixture(), nil, 400, 640, 320) },
			texts: []string{"Chainage, ft", "Settlement, in"},
			notSI: []string{", m", " m,"}, read: " ft, s = ",
			panel: 0, series: "Settlement", fx: ftPerM, fy: inPerM, tol: tolExact,
			anchors: []string{"end", "middle"},
		},
		{
			name: "drain plan", build: func() *Figure { return DrainPlanFigure(dp, 380, 300) },
			notSI: []string{" m", "mm"},
		},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			si := c.build()
			before := si.SVG()
			us := inUnits(t, units.US, c.build)
			after := c.build().SVG()
			if after != before {
				t.Error("SI after showing US differs from SI before")
			}
			if us.SVG() == before {
				t.Fatal("the US figure is the SI figure")
			}
			for _, want := range c.texts {
				if !hasText(us, want) {
					t.Errorf("no text %q in US units", want)
				}
			}
			for _, tx := range us.Texts {
				for _, bad := range c.notSI {
					if strings.Contains(tx.Text+" ", bad) {
						t.Errorf("US text %q holds %q", tx.Text, bad)
					}
				}
			}
			if c.series != "" {
				su, ss := seriesNamed(us, c.panel, c.series), seriesNamed(si, c.panel, siName(c.series))
				if su == nil || ss == nil || len(su.Pts) == 0 {
					t.Fatalf("series %q: US %v, SI %v", c.series, su != nil, ss != nil)
				}
				q := su.Pts[len(su.Pts)/2]
				found := false
				for _, o := range ss.Pts {
					if closeTo(q.DX, o.DX*c.fx, c.tol) && closeTo(q.DY, o.DY*c.fy, c.tol) {
						found = true
						break
					}
				}
				if !found {
					t.Errorf("US point (%g, %g) is no SI point converted by (%g, %g) within %g", q.DX, q.DY, c.fx, c.fy, c.tol)
				}
				if su.Read == nil || !strings.Contains(su.Read(q), c.read) {
					t.Errorf("read-out %q holds no %q", su.Read(q), c.read)
				}
			}
			groups := tickGroups(us, c.anchors...)
			if len(c.anchors) > 0 && len(groups) == 0 {
				t.Error("no tick labels found")
			}
			for k, vs := range groups {
				if why := roundTicks(vs); why != "" {
					t.Errorf("ticks %s %v: %s", k, vs, why)
				}
			}
		})
	}
}

// siName is a legend name as SI shows it, for the names that carry a
// depth (the piezometer at 2.5 m is at 8.2 ft).
func siName(us string) string {
	return strings.Replace(us, "z = 8.2 ft", "z = 2.5 m", 1)
}

// The drain plan's scale bar is a round length in ft and its caption
// gives s and De in ft and dw in in: each the SI figure converted, to
// the three or four figures the caption prints (relative 5e-3 for three).
func TestDrainPlanInUSUnits(t *testing.T) {
	dp := drainedProject()
	si := DrainPlanFigure(dp, 380, 300)
	us := inUnits(t, units.US, func() *Figure { return DrainPlanFigure(dp, 380, 300) })
	caption := func(f *Figure) string {
		for _, tx := range f.Texts {
			if strings.HasPrefix(tx.Text, "s = ") {
				return tx.Text
			}
		}
		return ""
	}
	num := func(s, after, unit string) float64 {
		_, rest, ok := strings.Cut(s, after)
		v, _, ok2 := strings.Cut(rest, unit)
		x, err := strconv.ParseFloat(v, 64)
		if !ok || !ok2 || err != nil {
			return math.NaN()
		}
		return x
	}
	cs, cu := caption(si), caption(us)
	for _, c := range []struct {
		name, after, siUnit, usUnit string
		k                           float64
	}{
		{"s", "s = ", " m", " ft", ftPerM},
		{"De", "De = ", " m", " ft", ftPerM},
		{"dw", "dw = ", " mm", " in", inPerMM},
	} {
		a, b := num(cs, c.after, c.siUnit), num(cu, c.after, c.usUnit)
		if !closeTo(b, a*c.k, 5e-3) {
			t.Errorf("%s: %g%s in US, %g%s in SI (captions %q, %q)", c.name, b, c.usUnit, a, c.siUnit, cu, cs)
		}
	}
	// The scale bar: a label "N ft" with N one significant figure
	// (niceLength: 1, 2 or 5 × 10^k), drawn N × 0.3048 m long.
	bar := ""
	for _, tx := range us.Texts {
		if strings.HasSuffix(tx.Text, " ft") && !strings.Contains(tx.Text, "=") {
			bar = tx.Text
		}
	}
	n, err := strconv.ParseFloat(strings.TrimSuffix(bar, " ft"), 64)
	if err != nil || roundTicks([]float64{0, n}) != "" {
		t.Errorf("scale bar %q is not a round length in ft", bar)
	}
}

// The CSV exports write the header units and the values of the system
// shown: the steady profiles in ft and psf, the settlements in in, each
// value the SI one converted by the NIST factors (within the 10 figures
// a CSV cell keeps, and the 7 of the psf factor).
func TestCSVInUSUnits(t *testing.T) {
	r := synthResult()
	cases := []struct {
		name   string
		csv    func() string
		header []string
		k      []float64 // US per SI, per column
		tol    float64
	}{
		{"steady", func() string { return SteadyCSV(r) },
			[]string{"depth (ft)", "total head (ft)", "pore pressure (psf)", "total vertical stress (psf)", "effective vertical stress (psf)"},
			[]float64{ftPerM, ftPerM, psfPerKPa, psfPerKPa, psfPerKPa}, 2e-7},
		{"settlement", func() string { return SettlementCSV(r) },
			[]string{"time (day)", "settlement from mv (in)", "settlement from e-log curves (in)"},
			[]float64{1, inPerM, inPerM}, 1e-9},
		{"Asaoka", func() string { return AsaokaCSV(asaokaFixture()) },
			[]string{"time t(j) (day)", "settlement s(j) (in)", "previous settlement s(j-1) (in)", "fitted s(j) (in)"},
			[]float64{1, inPerMM, inPerMM, inPerMM}, 1e-9},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			before := c.csv()
			us := inUnits(t, units.US, c.csv)
			if after := c.csv(); after != before {
				t.Error("SI after showing US differs from SI before")
			}
			a, b := readCSV(t, before), readCSV(t, us)
			if !slices.Equal(b[0], c.header) {
				t.Errorf("US header %q, want %q", b[0], c.header)
			}
			if len(a) != len(b) || len(a) < 3 {
				t.Fatalf("%d SI rows, %d US rows", len(a), len(b))
			}
			checked := 0
			for i := 1; i < len(a); i++ {
				for j, k := range c.k {
					if a[i][j] == "" && b[i][j] == "" {
						continue
					}
					x, err1 := strconv.ParseFloat(a[i][j], 64)
					y, err2 := strconv.ParseFloat(b[i][j], 64)
					if err1 != nil || err2 != nil || !closeTo(y, x*k, c.tol) {
						t.Fatalf("row %d column %q: %s in US, %s in SI (× %g)", i, c.header[j], b[i][j], a[i][j], k)
					}
					checked++
				}
			}
			if checked == 0 {
				t.Error("no value checked")
			}
		})
	}
}

// A switch of units rebuilds the plot components' figures (the memo
// keys hold the units), and switching back builds the SI figure again.
func TestUnitsRebuildFigures(t *testing.T) {
	p, r := synthProject(), synthResult()
	c := &SteadyProfiles{Project: p, Result: r}
	a := &Asaoka{ID: "plot-asaoka-0", Title: "Asaoka", Result: asaokaFixture()}
	f1, a1 := c.Figure(), a.Figure()
	us := inUnits(t, units.US, func() [2]*Figure { return [2]*Figure{c.Figure(), a.Figure()} })
	f2, aus := us[0], us[1]
	if f2 == f1 || !hasText(f2, "Depth, ft") {
		t.Error("the steady component kept its SI figure in US units")
	}
	if aus == a1 || !hasText(aus, "s(j), settlement, in") {
		t.Error("the Asaoka component kept its SI figure in US units")
	}
	f3, a3 := c.Figure(), a.Figure()
	if f3 == f2 || !hasText(f3, "Depth, m") || f3.SVG() != f1.SVG() {
		t.Error("back in SI, the steady component did not draw its SI figure again")
	}
	if a3 == aus || a3.SVG() != a1.SVG() {
		t.Error("back in SI, the Asaoka component did not draw its SI figure again")
	}
}

// In US units the labels run longer (psf in thousands where kPa ran in
// tens): the figures of TestTickLabelsNeverCollide, in US units, from a
// phone's width to a desktop's, keep at least four tick labels and no
// two overlap; and drawn without a project (as TestFiguresWithoutData
// draws them) they still draw, the layer strip without a water table.
func TestTickLabelsInUSUnits(t *testing.T) {
	dp, dr := demoCase(t)
	cases := []struct {
		name string
		p    *solver.Project
		r    *solver.Result
	}{{"synthetic", synthProject(), synthResult()}, {"demo", dp, dr}, {"no project", nil, synthResult()}}
	t.Cleanup(func() { SetUnits(units.SI) })
	SetUnits(units.US)
	for _, c := range cases {
		for _, fg := range figures {
			for _, w := range []int{300, 360, 420, 520, 640, 760} {
				f := fg.build(c.p, c.r, w, 420)
				if f.Message != "" {
					t.Errorf("%s %s at %d px: %q", c.name, fg.name, w, f.Message)
					continue
				}
				var ticks []TextEl
				for _, tx := range f.Texts {
					if tx.Size == 11 && tx.Rotate == 0 && !tx.Bold && !tx.Halo {
						ticks = append(ticks, tx)
					}
				}
				if len(ticks) < 4 {
					t.Errorf("%s %s at %d px: only %d tick labels left", c.name, fg.name, w, len(ticks))
				}
				for i := range ticks {
					for j := range i {
						a, b := labelBox(ticks[i]), labelBox(ticks[j])
						if a.X < b.Right()+1 && b.X < a.Right()+1 && a.Y < b.Bottom() && b.Y < a.Bottom() {
							t.Errorf("%s %s at %d px: labels %q and %q collide", c.name, fg.name, w, ticks[j].Text, ticks[i].Text)
						}
					}
				}
			}
		}
	}
}
