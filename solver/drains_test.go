package solver

import (
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"porelight/solver/drain"
	"porelight/solver/internal/series"
	"porelight/solver/soil"
)

// drainedClay is a 10 m clay (cv = clayCv) under 100 kPa at t = 0 with
// band drains 100 × 4 mm on a 1.5 m triangular grid through its full
// depth.
func drainedClay(top, bottom bool) *Project {
	p := uniformClay(10, bottom)
	p.Top.Drained = top
	p.Drains = &Drains{Pattern: "triangular", Spacing: 1.5, Width: 0.1, Thickness: 0.004}
	return p
}

// timesFor returns the output times at which the time factor ch t/De²
// takes each of ths.
func timesFor(ch, de float64, ths ...float64) []float64 {
	var ts []float64
	for _, th := range ths {
		ts = append(ts, th*de*de/ch)
	}
	return ts
}

// seriesAt reads the series value ys at time t (an output time, where the
// loop lands exactly).
func seriesAt(t *testing.T, ts, ys []float64, at float64) float64 {
	t.Helper()
	for i, v := range ts {
		if math.Abs(v-at) <= 1e-9*at {
			return ys[i]
		}
	}
	t.Fatalf("no step at t = %g", at)
	return 0
}

// Pure radial flow (both ends sealed, vertical permeability negligible):
// the average degree follows Hansbo's (1981) U = 1 − exp(−8 Th/μ(z)) at
// every depth, averaged over the drained length, within 0.002; μ is the
// unit cell's (checked in package drain against Barron 1948 and Hansbo's
// large-n form), and the well resistance term π z(2l − z)(kh/qw)(1 − 1/n²)
// is written out here again for one-way and two-way discharge.
func TestDrainsPureRadial(t *testing.T) {
	t.Parallel()
	const ch = 0.02 // m²/day
	for _, c := range []struct {
		name      string
		s, kr, qw float64
		discharge string
		bottom    bool
	}{
		{"ideal", 0, 0, 0, "", false},
		{"smear", 3, 4, 0, "", false},
		{"smear and well resistance, top", 3, 4, 5e-7, "top", false},
		{"smear and well resistance, both ends", 2, 3, 3e-7, "both", false},
	} {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			p := drainedClay(false, c.bottom)
			p.Layers[0].K = 1e-14 // vertical flow negligible: cv ~ 1e-5 × ch
			p.Layers[0].Ch = ch
			d := p.Drains
			d.SmearRatio, d.SmearK, d.Qw, d.Discharge = c.s, c.kr, c.qw, c.discharge
			de := 1.5 * math.Sqrt(2*math.Sqrt(3)/math.Pi)
			dw := 2 * (0.1 + 0.004) / math.Pi
			n := de / dw
			cell := drain.Cell{N: n, S: math.Max(c.s, 1), KRatio: math.Max(c.kr, 1)}
			mu0 := cell.Mu()
			kh := ch * 1e-3 * 9.81 / 86400 // m/s, from ch = kh/(mv γw)
			mu := func(z float64) float64 {
				if c.qw == 0 {
					return mu0
				}
				l, x := 10.0, z
				if c.discharge == "both" {
					l, x = 5, math.Min(z, 10-z)
				}
				return mu0 + math.Pi*x*(2*l-x)*kh/c.qw*(1-1/(n*n))
			}
			ths := []float64{0.05, 0.1, 0.2, 0.4, 0.8}
			p.Times = timesFor(ch, de, ths...)
			p.Piezometers = []float64{2, 5, 9.5}
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			ser := r.Consolidation.Series
			for i, th := range ths {
				want := 1 - quad.Fixed(func(z float64) float64 { return math.Exp(-8 * th / mu(z)) }, 0, 10, 30, nil, 0)/10
				got := seriesAt(t, ser.Time, ser.Us, p.Times[i])
				if math.Abs(got-want) > 0.002 {
					t.Errorf("Th = %g: U = %.5f, Hansbo (1981) %.5f", th, got, want)
				}
				for j, z := range p.Piezometers {
					w := 100 * math.Exp(-8*th/mu(z))
					if g := seriesAt(t, ser.Time, ser.Piezometers[j].Excess, p.Times[i]); math.Abs(g-w) > 0.2 {
						t.Errorf("Th = %g, z = %g m: u = %.3f kPa, Hansbo (1981) %.3f (± 0.2 kPa)", th, z, g, w)
					}
				}
			}
		})
	}
}

// Combined vertical and radial flow with a uniform μ: Carrillo's (1942)
// 1 − U = (1 − Uv)(1 − Uh), Uv from Terzaghi's (1943) series
// (series.TerzaghiU) and Uh = 1 − exp(−8 Th/F(n)) with Barron's (1948)
// F(n) written out here, within 0.002, for one and two drained ends.
func TestDrainsCarrillo(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		name   string
		bottom bool
		hdr    float64
		khkv   float64
		s, kr  float64
	}{
		{"single drainage, ideal drains", false, 10, 2, 0, 0},
		{"double drainage, ideal drains", true, 5, 1, 0, 0},
		{"single drainage, smear", false, 10, 3, 2, 3},
		{"double drainage, smear, quadratic elements", true, 5, 2, 3, 2},
	} {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			p := drainedClay(true, c.bottom)
			if strings.Contains(c.name, "quadratic") {
				p.Mesh.Order = 2 // the consistent sink matrix
			}
			p.Drains.Spacing = 2.5
			p.Drains.SmearRatio, p.Drains.SmearK = c.s, c.kr
			p.Layers[0].KhKv = c.khkv
			de := 2.5 * math.Sqrt(2*math.Sqrt(3)/math.Pi)
			dw := 2 * (0.1 + 0.004) / math.Pi
			n := de / dw
			mu := n*n/(n*n-1)*math.Log(n) - (3*n*n-1)/(4*n*n) // Barron (1948)
			if c.s > 0 {
				mu = drain.Cell{N: n, S: c.s, KRatio: c.kr}.Mu()
			}
			ch := c.khkv * clayCv
			days := []float64{30, 100, 300, 1000, 3000}
			p.Times = days
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			ser := r.Consolidation.Series
			for _, d := range days {
				uv := series.TerzaghiU(clayCv * d / (c.hdr * c.hdr))
				uh := 1 - math.Exp(-8*ch*d/(de*de*mu))
				want := 1 - (1-uv)*(1-uh)
				got := seriesAt(t, ser.Time, ser.Us, d)
				if math.Abs(got-want) > 0.002 {
					t.Errorf("t = %g days: U = %.5f, Carrillo (1942) %.5f (Uv %.4f, Uh %.4f)", d, got, want, uv, uh)
				}
			}
			if r.Drains == nil {
				t.Fatal("no drain results")
			}
			for _, a := range r.Drains.AtTimes {
				uv := series.TerzaghiU(clayCv * a.Time / (c.hdr * c.hdr))
				uh := 1 - math.Exp(-8*ch*a.Time/(de*de*mu))
				if math.Abs(a.Uv-uv) > 0.002 || math.Abs(a.Uh-uh) > 0.002 {
					t.Errorf("t = %g days: Uv %.4f Uh %.4f, want Terzaghi %.4f and Barron/Hansbo %.4f (± 0.002)", a.Time, a.Uv, a.Uh, uv, uh)
				}
			}
		})
	}
}

// Partly penetrating drains: close drains in the top 5 m of a 15 m clay
// drained only at the top. The drained zone soon holds u ≈ 0 but for a
// boundary layer of about δ = √(cv/λ) below the tip (λ = 8 ch/(De² μ)), so
// the 10 m below the tip consolidate as one layer drained at the tip:
// Terzaghi's (1943) series with a drainage path between 10 m and 10 m +
// 2δ brackets the excess at the base (± 0.5 kPa of 100), while the
// column without drains (path 15 m) stays well above it.
func TestDrainsPartial(t *testing.T) {
	t.Parallel()
	p := uniformClay(15, false)
	p.Layers[0].KhKv = 10
	p.Drains = &Drains{Pattern: "square", Spacing: 1, Diameter: 0.05, Depth: 5}
	de := math.Sqrt(4 / math.Pi)
	n := de / 0.05
	mu := n*n/(n*n-1)*math.Log(n) - (3*n*n-1)/(4*n*n)
	lambda := 8 * 10 * clayCv / (de * de * mu)
	delta := math.Sqrt(clayCv / lambda)
	days := []float64{2000, 4000, 8000}
	p.Times = days
	p.Piezometers = []float64{15}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	ser := r.Consolidation.Series
	for _, d := range days {
		got := seriesAt(t, ser.Time, ser.Piezometers[0].Excess, d)
		hi := 100 * series.TerzaghiExcess(1, clayCv*d/math.Pow(10+2*delta, 2))
		lo := 100 * series.TerzaghiExcess(1, clayCv*d/100)
		none := 100 * series.TerzaghiExcess(1, clayCv*d/225)
		if got < lo-0.5 || got > hi+0.5 {
			t.Errorf("t = %g days: u(base) = %.3f kPa, want within [%.3f, %.3f] (Terzaghi, path 10 m … 10 m + 2δ)", d, got, lo, hi)
		}
		if none-got < 5 {
			t.Errorf("t = %g days: u(base) = %.3f kPa, hardly below the undrained-column %.3f", d, got, none)
		}
	}
	// Radial flow alone consolidates only the drained third (one mv):
	// Uh → 5/15 by hand, within 0.005.
	if a := r.Drains.AtTimes[len(r.Drains.AtTimes)-1]; math.Abs(a.Uh-1.0/3) > 0.005 {
		t.Errorf("Uh at %g days = %.4f, want 1/3 (the drained part)", a.Time, a.Uh)
	}
	// Above the tip the mesh has a node exactly at 5 m.
	found := false
	for _, z := range r.Consolidation.Depth {
		found = found || z == 5
	}
	if !found {
		t.Error("no node at the drains' tip")
	}
}

// Every refused drain field names its path.
func TestDrainsValidate(t *testing.T) {
	t.Parallel()
	three := 3
	for _, c := range []struct {
		name string
		edit func(p *Project)
		path string
	}{
		{"no pattern", func(p *Project) { p.Drains.Pattern = "" }, "drains.pattern"},
		{"bad pattern", func(p *Project) { p.Drains.Pattern = "hex" }, "drains.pattern"},
		{"no spacing", func(p *Project) { p.Drains.Spacing = 0 }, "drains.spacing"},
		{"no size", func(p *Project) { p.Drains.Width, p.Drains.Thickness = 0, 0 }, "drains.diameter"},
		{"both sizes", func(p *Project) { p.Drains.Diameter = 0.05 }, "drains.diameter"},
		{"thick band", func(p *Project) { p.Drains.Thickness = 0.2 }, "drains.thickness"},
		{"bad equivalent", func(p *Project) { p.Drains.Equivalent = "area" }, "drains.equivalent"},
		{"drain wider than cell", func(p *Project) { p.Drains.Spacing = 0.05 }, "drains.spacing"},
		{"smear below 1", func(p *Project) { p.Drains.SmearRatio = 0.5 }, "drains.smearRatio"},
		{"smear outside cell", func(p *Project) { p.Drains.SmearRatio = 30 }, "drains.smearRatio"},
		{"smearK below 1", func(p *Project) { p.Drains.SmearK = 0.5 }, "drains.smearK"},
		{"negative qw", func(p *Project) { p.Drains.Qw = -1 }, "drains.qw"},
		{"bad discharge", func(p *Project) { p.Drains.Discharge = "side" }, "drains.discharge"},
		{"base discharge, partial", func(p *Project) { p.Drains.Discharge, p.Drains.Depth = "base", 5 }, "drains.discharge"},
		{"tip below base", func(p *Project) { p.Drains.Depth = 11 }, "drains.depth"},
		{"tip and layer", func(p *Project) { p.Drains.Depth, p.Drains.ToLayer = 5, new(int) }, "drains.toLayer"},
		{"no such layer", func(p *Project) { p.Drains.ToLayer = &three }, "drains.toLayer"},
		{"top below tip", func(p *Project) { p.Drains.Top, p.Drains.Depth = 6, 5 }, "drains.top"},
		{"history at the far end", func(p *Project) { p.Bottom.Drained, p.Bottom.Excess = true, []TimeValue{{T: 1, Value: -5}} }, "bottom.excess"},
		{"history at one of two drained ends", func(p *Project) { p.Bottom.Drained, p.Top.Excess = true, []TimeValue{{T: 1, Value: -5}} }, "top.excess"},
		{"negative ch", func(p *Project) { p.Layers[0].Ch = -1 }, "layers[0].ch"},
		{"ch and khKv", func(p *Project) { p.Layers[0].Ch, p.Layers[0].KhKv = 0.01, 2 }, "layers[0].khKv"},
		{"NaN khKv", func(p *Project) { p.Layers[0].KhKv = math.NaN() }, "layers[0].khKv"},
	} {
		p := drainedClay(true, false)
		c.edit(p)
		err := Validate(p)
		ps, ok := err.(Problems)
		if !ok {
			t.Errorf("%s: got %v, want problems", c.name, err)
			continue
		}
		found := false
		for _, pr := range ps {
			found = found || pr.Path == c.path
		}
		if !found {
			t.Errorf("%s: problems %v name no %s", c.name, ps, c.path)
		}
	}
	if err := Validate(drainedClay(true, false)); err != nil {
		t.Errorf("a valid project is refused: %v", err)
	}
}

// LayerCh: ch = kh/(mv γw) both ways (definition, to rounding).
func TestLayerCh(t *testing.T) {
	t.Parallel()
	l := Layer{K: 2e-9, KhKv: 3}
	ch, kh := LayerCh(&l, 1e-3, 9.81)
	if math.Abs(kh-6e-9) > 1e-22 || math.Abs(ch-soil.Cv(6e-9, 1e-3, 9.81)) > 1e-15 {
		t.Errorf("khKv: ch %g kh %g", ch, kh)
	}
	l = Layer{K: 2e-9, Ch: 0.05}
	ch, kh = LayerCh(&l, 1e-3, 9.81)
	if ch != 0.05 || math.Abs(soil.Cv(kh, 1e-3, 9.81)-0.05) > 1e-15 {
		t.Errorf("ch: ch %g kh %g", ch, kh)
	}
}

// Layers and a ramped load: two layers of different ch and mv, vertical
// flow negligible, ideal drains, a load rising over 60 days. Each layer
// follows the unit cell's ū' = −λū + σ̇ (Barron 1948, equal strain), whose
// solution under a ramp is ū = (q/Tc)(1 − e^(−λt))/λ while the load rises
// and decays as e^(−λ(t − Tc)) after; Us weights the layers by mv·H. The
// solver agrees within 0.002.
func TestDrainsLayersRamp(t *testing.T) {
	t.Parallel()
	p := &Project{
		Format: Format,
		Layers: []Layer{
			{Name: "upper", Thickness: 4, GammaSat: 17, K: 1e-14, Mv: 2e-3, Ch: 0.01},
			{Name: "lower", Thickness: 6, GammaSat: 18, K: 1e-14, Mv: 1e-3, Ch: 0.03},
		},
		// Both ends sealed: a drained end would consolidate its half
		// element at once, which the unit-cell ODE leaves out.
		Top: Boundary{Drained: false}, Bottom: Boundary{Drained: false},
		Loads:  []Load{{Start: 0, Ramp: 60, Q: 80}},
		Drains: &Drains{Pattern: "square", Spacing: 1.6, Diameter: 0.06},
		Times:  []float64{20, 60, 120, 300, 600},
	}
	de := 1.6 * math.Sqrt(4/math.Pi)
	n := de / 0.06
	f := n*n/(n*n-1)*math.Log(n) - (3*n*n-1)/(4*n*n)
	ubar := func(ch, t float64) float64 {
		lam := 8 * ch / (de * de * f)
		if t <= 60 {
			return 80.0 / 60 * (1 - math.Exp(-lam*t)) / lam
		}
		return 80.0 / 60 * (1 - math.Exp(-lam*60)) / lam * math.Exp(-lam*(t-60))
	}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	ser := r.Consolidation.Series
	for _, tm := range p.Times {
		sigma := 80 * math.Min(tm/60, 1)
		want := (2e-3*4*(sigma-ubar(0.01, tm)) + 1e-3*6*(sigma-ubar(0.03, tm))) / ((2e-3*4 + 1e-3*6) * 80)
		if got := seriesAt(t, ser.Time, ser.Us, tm); math.Abs(got-want) > 0.002 {
			t.Errorf("t = %g days: Us = %.5f, unit-cell ODE %.5f", tm, got, want)
		}
	}
}

// A drawdown at the drains' outlet: the drains carry the outlet's
// pressure ud(t), so with vertical flow negligible the cell-averaged
// excess follows ū' = −λ(ū − ud(t)) (the unit cell, Barron 1948, with the
// drain at ud instead of 0). For ud falling linearly to −20 kPa over 10
// days, ū = −2[t − (1 − e^(−λt))/λ] while it falls and relaxes to −20 as
// e^(−λ(t − 10)) after; the piezometers at 3 and 7 m agree within
// 0.05 kPa, and the column ends at −20 kPa everywhere (± 0.01).
func TestDrainsOutletDrawdown(t *testing.T) {
	t.Parallel()
	p := &Project{
		Format:      Format,
		Layers:      []Layer{{Name: "clay", Thickness: 10, GammaSat: 18, K: 1e-14, Mv: 1e-3, Ch: 0.02}},
		Top:         Boundary{Drained: true, Excess: []TimeValue{{T: 0, Value: 0}, {T: 10, Value: -20}}},
		Drains:      &Drains{Pattern: "square", Spacing: 1.6, Diameter: 0.05},
		Times:       []float64{2, 5, 10, 20, 50, 100, 300},
		Piezometers: []float64{3, 7},
	}
	de := 1.6 * math.Sqrt(4/math.Pi)
	n := de / 0.05
	f := n*n/(n*n-1)*math.Log(n) - (3*n*n-1)/(4*n*n)
	lam := 8 * 0.02 / (de * de * f)
	ubar := func(tm float64) float64 {
		if tm <= 10 {
			return -2 * (tm - (1-math.Exp(-lam*tm))/lam)
		}
		u10 := -2 * (10 - (1-math.Exp(-lam*10))/lam)
		e := math.Exp(-lam * (tm - 10))
		return u10*e - 20*(1-e)
	}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	ser := r.Consolidation.Series
	for _, tm := range p.Times {
		for j := range p.Piezometers {
			if got, want := seriesAt(t, ser.Time, ser.Piezometers[j].Excess, tm), ubar(tm); math.Abs(got-want) > 0.05 {
				t.Errorf("t = %g days, z = %g m: u = %.4f kPa, unit cell %.4f", tm, p.Piezometers[j], got, want)
			}
		}
	}
	last := r.Consolidation.Series.Piezometers[0].Excess
	if u := last[len(last)-1]; math.Abs(u+20) > 0.01 {
		t.Errorf("final excess %.4f kPa, want −20", u)
	}
}

// Drains from 4 m to the base of a 10 m clay, vertical flow negligible:
// the top 4 m do not consolidate, the rest follows Hansbo's (1981)
// 1 − exp(−8Th/μ), so Us = 0.6 (1 − exp(−8Th/μ)) (one mv, by hand)
// within 0.002 (both ends sealed; the mesh has a node at 4 m).
func TestDrainsFromDepth(t *testing.T) {
	t.Parallel()
	p := drainedClay(false, false)
	p.Layers[0].K, p.Layers[0].Ch = 1e-14, 0.02
	p.Drains.Top = 4
	de := 1.5 * math.Sqrt(2*math.Sqrt(3)/math.Pi)
	n := de / (2 * (0.1 + 0.004) / math.Pi)
	mu := n*n/(n*n-1)*math.Log(n) - (3*n*n-1)/(4*n*n)
	ths := []float64{0.1, 0.3, 1}
	p.Times = timesFor(0.02, de, ths...)
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	ser := r.Consolidation.Series
	for i, th := range ths {
		want := 0.6 * (1 - math.Exp(-8*th/mu))
		if got := seriesAt(t, ser.Time, ser.Us, p.Times[i]); math.Abs(got-want) > 0.002 {
			t.Errorf("Th = %g: Us = %.5f, want %.5f", th, got, want)
		}
	}
}
