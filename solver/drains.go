package solver

import (
	"fmt"
	"math"
	"slices"

	"porelight/solver/drain"
	"porelight/solver/fem"
	"porelight/solver/soil"
)

// Defaults of a drain layout (see Drains).
const (
	// DefaultEquivalent is how a band drain's equivalent diameter is
	// taken: the circle of equal perimeter, 2(a+b)/π (Hansbo 1979).
	DefaultEquivalent = string(drain.Perimeter)
	// DefaultDischarge is where the drains let their water out.
	DefaultDischarge = string(drain.Top)
	// DefaultKhKv is the ratio kh/kv of a layer that gives neither ch nor
	// khKv.
	DefaultKhKv = 1.0
	// DefaultSmearRatio and DefaultSmearK mean no smear.
	DefaultSmearRatio = 1.0
	DefaultSmearK     = 1.0
)

// DrainCell is a drain layout resolved for a project: the unit cell and
// the drained depth range.
type DrainCell struct {
	// De is the diameter of the unit cell, m: CellFactor × spacing.
	De float64 `json:"de"`
	// Dw is the drain's (equivalent) diameter, m.
	Dw float64 `json:"dw"`
	// N is De/Dw.
	N float64 `json:"n"`
	// Top and Tip are the depths of the drains' ends, m.
	Top float64 `json:"top"`
	Tip float64 `json:"tip"`
	// Mu0 is μ without well resistance: Barron's F(n) with no smear.
	Mu0 float64 `json:"mu0"`
	// Equivalent and Discharge are the resolved choices.
	Equivalent string `json:"equivalent,omitempty"`
	Discharge  string `json:"discharge"`
	// SmearRatio (ds/dw) and SmearK (kh/ks) are resolved (1: no smear).
	SmearRatio float64 `json:"smearRatio"`
	SmearK     float64 `json:"smearK"`
	// Qw is the discharge capacity, m³/s (0: no well resistance).
	Qw float64 `json:"qw,omitempty"`
}

// ResolveDrains returns the resolved drain layout of p, or nil when p has
// no drains. p must be valid.
func ResolveDrains(p *Project) *DrainCell {
	d := p.Drains
	if d == nil {
		return nil
	}
	dc := &DrainCell{De: drain.CellFactor(drain.Pattern(d.Pattern)) * d.Spacing, Top: d.Top, Discharge: d.Discharge}
	if dc.Discharge == "" {
		dc.Discharge = DefaultDischarge
	}
	dc.Dw = d.Diameter
	if d.Diameter == 0 {
		dc.Equivalent = d.Equivalent
		if dc.Equivalent == "" {
			dc.Equivalent = DefaultEquivalent
		}
		dc.Dw = drain.EquivalentDiameter(d.Width, d.Thickness, drain.Equivalent(dc.Equivalent))
	}
	dc.N = dc.De / dc.Dw
	dc.Tip = drainTip(p)
	s, kr := d.SmearRatio, d.SmearK
	if s == 0 {
		s = DefaultSmearRatio
	}
	if kr == 0 {
		kr = DefaultSmearK
	}
	dc.SmearRatio, dc.SmearK = s, kr
	dc.Mu0 = drain.Cell{N: dc.N, S: s, KRatio: kr}.Mu()
	dc.Qw = d.Qw
	return dc
}

// drainTip is the depth of the drains' tip: Depth, the base of layer
// ToLayer, or the base of the column.
func drainTip(p *Project) float64 {
	d := p.Drains
	switch {
	case d.Depth > 0:
		return d.Depth
	case d.ToLayer != nil:
		z := 0.0
		for _, l := range p.Layers[:*d.ToLayer+1] {
			z += l.Thickness
		}
		return z
	}
	return ColumnHeight(p)
}

// drainBreaks are the depths the mesh must have nodes at for p's drains.
func drainBreaks(p *Project) []float64 {
	if p.Drains == nil {
		return nil
	}
	return []float64{p.Drains.Top, drainTip(p)}
}

// Mu is μ at depth z (in the drained range) for horizontal permeability
// kh, m/s: Mu0 plus the well resistance (Hansbo 1981).
func (dc *DrainCell) Mu(z, kh float64) float64 {
	dist, l := drain.FromOutlet(z, dc.Top, dc.Tip, drain.Discharge(dc.Discharge))
	return dc.Mu0 + drain.WellTerm(dist, l, kh, dc.Qw, dc.N)
}

// Reaches reports whether the drains run through depth z.
func (dc *DrainCell) Reaches(z float64) bool { return z >= dc.Top && z <= dc.Tip }

// LayerCh is the horizontal coefficient of consolidation of layer l for
// volume compressibility mv, m²/day, and its horizontal permeability,
// m/s: Ch as given (kh = ch·mv·γw), or KhKv (default 1) times cv and k.
func LayerCh(l *Layer, mv, gw float64) (ch, kh float64) {
	if l.Ch > 0 {
		return l.Ch, l.Ch * mv * gw / soil.SecondsPerDay
	}
	r := l.KhKv
	if r == 0 {
		r = DefaultKhKv
	}
	return r * soil.Cv(l.K, mv, gw), r * l.K
}

// elementKh is each element's horizontal permeability kh, m/s, for mv
// per layer (LayerCh), and 0 outside the drained range.
func (c *column) elementKh(mv []float64) []float64 {
	m := c.m
	kh := make([]float64, m.Elements())
	for e := range kh {
		_, z0, z1 := m.Span(e)
		if c.drains.Reaches((z0 + z1) / 2) {
			l := m.Layer[e]
			_, kh[e] = LayerCh(&c.p.Layers[l], mv[l], c.gw)
		}
	}
	return kh
}

// assembleSink returns the matrix of the radial sink of the unit cell,
// ∫ w mv (8 ch/(De² μ(z))) u dz, for mv per layer (assembleSinkKh).
func (c *column) assembleSink(mv []float64, lumped bool) *fem.Band {
	return c.assembleSinkKh(c.elementKh(mv), lumped)
}

// iteratedSink is the drains' sink in the iterated time loop
// (nonlinear.go), where k changes element by element: kh follows k with
// each layer's kh/kv held (khKv, or the ratio a given ch implies at the
// layer's mv, kh = ch·mv·γw, so that ch scales with k(e)/k0 and, as cv
// does, inversely with the element's mv), and the sink is reassembled
// from kh = (kh/kv)·k(e) at every iterate. Sized once: add and source
// allocate nothing.
type iteratedSink struct {
	tr     *transient
	lumped bool
	ratio  []float64 // per element: kh/k of its layer (0 where the drains do not reach)
	coef   []float64 // per element: 8 kh/(γw De² μ), per day (μ uniform)
	band   *fem.Band
	ones   []float64
	rows   []float64
}

// newIteratedSink returns the sink for the column of tr with mv per layer
// (what fixes kh/kv where a layer gives ch), or nil without drains.
func newIteratedSink(tr *transient, mv []float64, lumped bool) *iteratedSink {
	c := tr.c
	if c.drains == nil {
		return nil
	}
	m := c.m
	s := &iteratedSink{tr: tr, lumped: lumped, band: fem.NewBand(m.Nodes(), m.Order)}
	kh := c.elementKh(mv)
	s.ratio = make([]float64, m.Elements())
	s.coef = make([]float64, m.Elements())
	for e := range kh {
		if k := c.p.Layers[m.Layer[e]].K; kh[e] > 0 && k > 0 {
			s.ratio[e] = kh[e] / k
		}
	}
	s.ones = make([]float64, m.Nodes())
	for i := range s.ones {
		s.ones[i] = 1
	}
	s.rows = make([]float64, m.Nodes())
	return s
}

// add assembles the sink for the conductivities cc (k/γw per element,
// m²/(kPa·day)) and adds it to cond; in the radial-only solve of the Uh
// figure cond holds the sink alone. With well resistance μ varies with
// depth and with kh (Hansbo 1981), so the sink is integrated at the
// Gauss points, as assembleSinkKh does; without it, from the exact
// element matrices.
func (s *iteratedSink) add(cond *fem.Band, cc []float64) {
	c := s.tr.c
	m, dc := c.m, c.drains
	if c.radialOnly {
		clear(cond.AB)
	}
	if dc.Qw == 0 {
		for e, r := range s.ratio {
			s.coef[e] = 8 * r * cc[e] / (dc.De * dc.De * dc.Mu0)
		}
		m.AssembleConstant(s.band, s.coef, true, s.lumped)
	} else {
		clear(s.band.AB)
		m.Assemble(s.band, func(e int, z float64) float64 {
			if s.ratio[e] == 0 {
				return 0
			}
			kh := s.ratio[e] * cc[e] * c.gw / soil.SecondsPerDay
			return 8 * s.ratio[e] * cc[e] / (dc.De * dc.De * dc.Mu(z, kh))
		}, true)
		if s.lumped {
			s.band.MulVec(s.rows, s.ones)
			clear(s.band.AB)
			for i, v := range s.rows {
				s.band.AB[i*(s.band.KD+1)] = v
			}
		}
	}
	for i, v := range s.band.AB {
		cond.AB[i] += v
	}
}

// source adds to the right-hand side rhs of the step from t0 by dt what
// the sink draws toward the drains' outlet pressure ud(t) (the pressure
// history where they discharge, if any): Δt (θ ud(t0+dt) + (1−θ) ud(t0))
// S·1, the term transient.step obtains by stepping on u − ud.
func (s *iteratedSink) source(rhs []float64, theta, t0, dt float64) {
	out := s.tr.outlet()
	if out == nil {
		return
	}
	ud := theta*historyAt(out, t0+dt, true) + (1-theta)*historyAt(out, t0, false)
	if ud == 0 {
		return
	}
	s.band.MulVec(s.rows, s.ones)
	for i, v := range s.rows {
		rhs[i] += dt * ud * v
	}
}

// assembleSinkKh returns the sink's matrix for the horizontal
// permeability of each element, kh (m/s; 0 where the drains do not
// reach): since mv·ch = kh/γw, the coefficient is 8 kh/(γw De² μ(z)),
// per day, whatever mv is, so a soil model whose k (and so kh = khKv·k)
// changes element by element reassembles the sink from its own kh. μ is
// taken at the Gauss points (it varies with depth under well
// resistance); linear elements lump the matrix by rows, as the capacity
// matrix is (transient.setMv).
func (c *column) assembleSinkKh(kh []float64, lumped bool) *fem.Band {
	m, dc := c.m, c.drains
	r := fem.NewBand(m.Nodes(), m.Order)
	m.Assemble(r, func(e int, z float64) float64 {
		if kh[e] == 0 {
			return 0
		}
		return 8 * kh[e] * soil.SecondsPerDay / (c.gw * dc.De * dc.De * dc.Mu(z, kh[e]))
	}, true)
	if lumped {
		r.Lump()
	}
	return r
}

// validDrains checks p.Drains and the layers' ch and khKv.
func validDrains(ps *Problems, p *Project, height float64) {
	for i, l := range p.Layers {
		at := IndexPath("layers", i)
		if l.Ch != 0 {
			bounded(ps, JoinPath(at, "ch"), l.Ch, MinCh, MaxCh, "m²/day")
		}
		if l.KhKv != 0 {
			bounded(ps, JoinPath(at, "khKv"), l.KhKv, MinKhKv, MaxKhKv, "")
		}
		if l.Ch != 0 && l.KhKv != 0 {
			ps.Add(JoinPath(at, "khKv"), ErrConflict, "give ch or khKv, not both")
		}
	}
	d := p.Drains
	if d == nil {
		return
	}
	at := func(name string) string { return JoinPath("drains", name) }
	factor := drain.CellFactor(drain.Pattern(d.Pattern))
	if d.Pattern == "" {
		ps.Add(at("pattern"), ErrRequired, `"triangular" or "square"`)
	} else if factor == 0 {
		ps.Add(at("pattern"), ErrOutOfRange, fmt.Sprintf(`must be "triangular" or "square" (got %q)`, d.Pattern))
	}
	spacingOK := bounded(ps, at("spacing"), d.Spacing, MinSpacing, MaxSpacing, "m")
	dw := 0.0
	band := d.Width != 0 || d.Thickness != 0
	switch {
	case d.Diameter != 0 && band:
		ps.Add(at("diameter"), ErrConflict, "give a diameter, or a band's width and thickness, not both")
	case d.Diameter != 0:
		if bounded(ps, at("diameter"), d.Diameter, MinDrainSize, MaxDrainSize, "m") {
			dw = d.Diameter
		}
		if d.Equivalent != "" {
			ps.Add(at("equivalent"), ErrConflict, "the equivalent diameter is for a band drain; a round drain has its diameter")
		}
	case band:
		a := bounded(ps, at("width"), d.Width, MinDrainSize, MaxDrainSize, "m")
		b := bounded(ps, at("thickness"), d.Thickness, MinDrainSize, MaxDrainSize, "m")
		if a && b && d.Thickness > d.Width {
			ps.Add(at("thickness"), ErrOutOfRange, fmt.Sprintf("must not exceed the width %g m (got %g)", d.Width, d.Thickness))
		}
		e := d.Equivalent
		if e == "" {
			e = DefaultEquivalent
		}
		if dw = drain.EquivalentDiameter(d.Width, d.Thickness, drain.Equivalent(e)); dw == 0 {
			ps.Add(at("equivalent"), ErrOutOfRange, fmt.Sprintf(`must be "perimeter" or "mean" (got %q)`, d.Equivalent))
		}
		if !a || !b {
			dw = 0
		}
	default:
		ps.Add(at("diameter"), ErrRequired, "give the drain's diameter, or a band's width and thickness")
	}
	de := factor * d.Spacing
	if spacingOK && factor > 0 && dw > 0 && dw >= de {
		ps.Add(at("spacing"), ErrOutOfRange, fmt.Sprintf("the unit cell (De = %.3g m) must be wider than the drain (%.3g m)", de, dw))
		dw = 0
	}
	if d.SmearRatio != 0 && finite(ps, at("smearRatio"), d.SmearRatio) {
		switch {
		case d.SmearRatio < 1:
			ps.Add(at("smearRatio"), ErrOutOfRange, "ds/dw must be ≥ 1 "+paren(num(d.SmearRatio)))
		case d.SmearRatio > MaxSmearRatio:
			inRange(ps, at("smearRatio"), d.SmearRatio, 1, MaxSmearRatio, "")
		case dw > 0 && d.SmearRatio*dw >= de:
			ps.Add(at("smearRatio"), ErrOutOfRange, fmt.Sprintf("the smear zone (%.3g m) must lie inside the unit cell (De = %.3g m)", d.SmearRatio*dw, de))
		}
	}
	if d.SmearK != 0 && finite(ps, at("smearK"), d.SmearK) {
		if d.SmearK < 1 {
			ps.Add(at("smearK"), ErrOutOfRange, "kh/ks must be ≥ 1: smear lowers the permeability "+paren(num(d.SmearK)))
		} else {
			inRange(ps, at("smearK"), d.SmearK, 1, MaxSmearK, "")
		}
	}
	if d.Qw != 0 {
		bounded(ps, at("qw"), d.Qw, MinQw, MaxQw, "m³/s")
	}
	switch drain.Discharge(d.Discharge) {
	case "", drain.Top, drain.Base, drain.Both:
	default:
		ps.Add(at("discharge"), ErrOutOfRange, fmt.Sprintf(`must be "top", "base" or "both" (got %q)`, d.Discharge))
	}
	topOK := upTo(ps, at("top"), d.Top, MaxDepth, "m")
	tip := height
	switch {
	case d.Depth != 0 && d.ToLayer != nil:
		ps.Add(at("toLayer"), ErrConflict, "give the tip's depth or its layer, not both")
		tip = math.NaN()
	case d.Depth != 0:
		tip = math.NaN()
		if bounded(ps, at("depth"), d.Depth, 0, MaxDepth, "m") {
			if height > 0 && d.Depth > height*(1+1e-12) {
				ps.Add(at("depth"), ErrOutOfRange, fmt.Sprintf("depth %g m is below the base of the column at %g m", d.Depth, height))
			} else {
				tip = d.Depth
			}
		}
	case d.ToLayer != nil:
		tip = math.NaN()
		if i := *d.ToLayer; i < 0 || i >= len(p.Layers) {
			ps.Add(at("toLayer"), ErrOutOfRange, fmt.Sprintf("no layer %d (the column has %d, numbered from 0)", i, len(p.Layers)))
		} else {
			tip = 0
			for _, l := range p.Layers[:i+1] {
				tip += l.Thickness
			}
		}
	}
	if topOK && !math.IsNaN(tip) && d.Top >= tip {
		ps.Add(at("top"), ErrOutOfRange, fmt.Sprintf("the drains must start above their tip at %g m (got %g)", tip, d.Top))
	}
	if (drain.Discharge(d.Discharge) == drain.Base || drain.Discharge(d.Discharge) == drain.Both) && !math.IsNaN(tip) && height > 0 && tip < height*(1-1e-12) {
		ps.Add(at("discharge"), ErrConflict, fmt.Sprintf("drains ending at %g m, above the base at %g m, cannot discharge at the base", tip, height))
	}
	if des := d.Design; des != nil {
		if des.Degree != 0 && !(des.Degree > 0 && des.Degree < 1) {
			ps.Add(at("design.degree"), ErrOutOfRange, "must be a fraction between 0 and 1 "+paren(num(des.Degree)))
		}
		bounded(ps, at("design.time"), des.Time, 0, MaxTime, "days")
	}
	// A pressure history with drains: the drains carry the pressure of
	// their outlet, so the final state is that pressure everywhere; the
	// other end must then be undrained or hold the same history.
	disc := drain.Discharge(d.Discharge)
	top, bot := len(p.Top.Excess) > 0, len(p.Bottom.Excess) > 0
	same := slices.Equal(p.Top.Excess, p.Bottom.Excess)
	switch {
	case (disc == "" || disc == drain.Top) && bot && !same:
		ps.Add("bottom.excess", ErrConflict, "with drains discharging at the top, a pressure history is modelled only at the top (the drains' outlet), or the same one at both ends")
	case disc == drain.Base && top && !same:
		ps.Add("top.excess", ErrConflict, "with drains discharging at the base, a pressure history is modelled only at the base (the drains' outlet), or the same one at both ends")
	case disc == drain.Both && (top || bot) && !same:
		ps.Add("drains.discharge", ErrConflict, "drains discharging at both ends need the same pressure history at both ends")
	case top != bot && p.Top.Drained && p.Bottom.Drained:
		at := "top.excess"
		if bot {
			at = "bottom.excess"
		}
		ps.Add(at, ErrConflict, "with drains and both ends drained, give the same pressure history at both ends (or make the other end undrained): the drains carry their outlet's pressure through the column")
	}
}

// drainWarnings flags a discharge end that the column leaves undrained:
// the drains are then taken to discharge freely there (into a blanket
// outside the column).
func drainWarnings(p *Project, warn func(path, msg string)) {
	d := p.Drains
	if d == nil {
		return
	}
	disc := d.Discharge
	if disc == "" {
		disc = DefaultDischarge
	}
	if (disc == "top" || disc == "both") && !p.Top.Drained {
		warn("drains.discharge", "the drains discharge at the top, which is undrained for vertical flow: they are taken to let their water out freely there (a blanket or sump outside the column)")
	}
	if (disc == "base" || disc == "both") && !p.Bottom.Drained {
		warn("drains.discharge", "the drains discharge at the base, which is undrained for vertical flow: they are taken to let their water out freely there")
	}
	if d.Top > 0 && (disc == "top" || disc == "both") {
		warn("drains.top", fmt.Sprintf("the drains start at %g m: the soil above is taken to pass their water to the top freely", d.Top))
	}
}

// DrainResult holds what the drains do.
type DrainResult struct {
	// Cell is the resolved unit cell and drained range.
	Cell DrainCell `json:"cell"`
	// Layers gives each layer's ch, m²/day, and kh, m/s, where the drains
	// reach it (0 elsewhere), at the layer's mv and k (on the non-linear
	// model, the start: kh then follows k element by element).
	Layers []DrainLayer `json:"layers"`
	// Depth and Mu give μ along the drains (with well resistance it grows
	// away from the discharging end), m and dimensionless.
	Depth []float64 `json:"depth"`
	Mu    []float64 `json:"mu"`
	// Uv and Uh are the average degrees of consolidation (by settlement,
	// relative to the same final state as Us) of the same column and
	// loads with vertical flow alone (no drains) and with radial flow to
	// the drains alone (no vertical flow, no drained end), at the times
	// of Consolidation.Series: two more solves on the same mesh and
	// steps. Below a partly penetrating drain's tip nothing consolidates
	// radially, so Uh stays below 1 there. Under one instantaneous load
	// with fully penetrating drains and one μ, 1 − Us = (1 − Uv)(1 − Uh)
	// (Carrillo 1942).
	Uv []float64 `json:"uv"`
	Uh []float64 `json:"uh"`
	// AtTimes gives U (= Us), Uv and Uh at the output times.
	AtTimes []DrainDegree `json:"atTimes"`
	// T90Vertical and TTargetVertical are the times to 90 % and to the
	// target degree without drains, days (nil when not reached).
	T90Vertical     *float64 `json:"t90Vertical,omitempty"`
	TTargetVertical *float64 `json:"tTargetVertical,omitempty"`
	// T90Radial is the time to 90 % by radial flow alone, days.
	T90Radial *float64 `json:"t90Radial,omitempty"`
}

// DrainLayer is one layer's horizontal flow figures.
type DrainLayer struct {
	Ch float64 `json:"ch"` // m²/day
	Kh float64 `json:"kh"` // m/s
}

// DrainDegree is the degree of consolidation at one output time.
type DrainDegree struct {
	Time float64 `json:"time"` // day
	U    float64 `json:"u"`
	Uv   float64 `json:"uv"`
	Uh   float64 `json:"uh"`
}

// drainReference fills r.Drains and, with both set, solves the same
// column with vertical flow alone and with radial flow alone (on the
// same mesh and time steps) for Uv and Uh. The progress of the two
// solves is reported through opt.
func (c *column) drainReference(st *Steady, r *Result, opt *Options, both bool) error {
	dc := c.drains
	dr := &DrainResult{Cell: *dc}
	r.Drains = dr
	mv := make([]float64, len(r.Summary.Layers))
	for i, l := range r.Summary.Layers {
		mv[i] = l.Mv
	}
	for i := range c.p.Layers {
		z0, z1 := c.tops[i], c.tops[i+1]
		var dl DrainLayer
		if z1 > dc.Top && z0 < dc.Tip {
			dl.Ch, dl.Kh = LayerCh(&c.p.Layers[i], mv[i], c.gw)
		}
		dr.Layers = append(dr.Layers, dl)
	}
	m := c.m
	for e := range m.Elements() {
		_, z0, z1 := m.Span(e)
		if !dc.Reaches((z0 + z1) / 2) {
			continue
		}
		kh := dr.Layers[m.Layer[e]].Kh
		if len(dr.Depth) == 0 {
			dr.Depth, dr.Mu = append(dr.Depth, z0), append(dr.Mu, dc.Mu(z0, kh))
		}
		dr.Depth, dr.Mu = append(dr.Depth, z1), append(dr.Mu, dc.Mu(z1, kh))
	}
	ser := &r.Consolidation.Series
	if !both || len(ser.Us) == 0 {
		return nil
	}
	solveAs := func(drains *DrainCell, radial bool, o *Options) (*Result, error) {
		ref := *c
		ref.drains, ref.radialOnly = drains, radial
		rr := &Result{Steady: *st}
		rr.Steady.Layers = append([]SteadyLayer(nil), st.Layers...)
		if err := ref.consolidate(&rr.Steady, rr, o, func(string, string) {}); err != nil {
			return nil, err
		}
		return rr, nil
	}
	half := func(from float64) *Options {
		if opt == nil || opt.Progress == nil {
			return opt
		}
		return &Options{Progress: func(f float64) bool { return opt.Progress(from + f/2) }}
	}
	rv, err := solveAs(nil, false, half(0))
	if err != nil {
		return err
	}
	rh, err := solveAs(dc, true, half(0.5))
	if err != nil {
		return err
	}
	sv, sh := &rv.Consolidation.Series, &rh.Consolidation.Series
	if len(sv.Us) == 0 || len(sh.Us) == 0 {
		return nil
	}
	dr.Uv = make([]float64, len(ser.Time))
	dr.Uh = make([]float64, len(ser.Time))
	for i, t := range ser.Time {
		dr.Uv[i] = SeriesAt(sv.Time, sv.Us, t)
		dr.Uh[i] = SeriesAt(sh.Time, sh.Us, t)
	}
	for _, t := range c.p.Times {
		dr.AtTimes = append(dr.AtTimes, DrainDegree{Time: t,
			U: SeriesAt(ser.Time, ser.Us, t), Uv: SeriesAt(sv.Time, sv.Us, t), Uh: SeriesAt(sh.Time, sh.Us, t)})
	}
	dr.T90Vertical = rv.Summary.T90
	dr.TTargetVertical = rv.Summary.TTarget
	dr.T90Radial = rh.Summary.T90
	return nil
}

// drainSeries is the number of series per time step the drains add to a
// result (Uv and Uh).
func drainSeries(p *Project) int {
	if p.Drains == nil {
		return 0
	}
	return 2
}

// outlet is the pressure history at the drains' outlet, the end they
// discharge at (the top's for "both", which Validate requires to equal
// the base's), or nil without drains or without a history there.
func (tr *transient) outlet() []TimeValue {
	dc := tr.c.drains
	if dc == nil {
		return nil
	}
	h := tr.c.p.Top.Excess
	if dc.Discharge == string(drain.Base) {
		h = tr.c.p.Bottom.Excess
	}
	if len(h) == 0 {
		return nil
	}
	return h
}

// shiftToOutlet prepares a step from t0 to t1 when the drains' outlet
// pressure ud(t) changes: the sink draws ū toward ud, so the step is
// taken on v = u − ud (the conductivity matrix annihilates a uniform
// shift), with the source σ − ud and the held values less ud(t1). On
// return tr.u holds v⁰ and tr.next the held v¹; step adds ud(t1) back
// after the step. ds is the load's change over the step (nil: none); the
// returned source change includes −(ud(t1) − ud(t0)).
func (tr *transient) shiftToOutlet(out []TimeValue, ds []float64, t0, t1 float64) []float64 {
	ud0, ud1 := historyAt(out, t0, false), historyAt(out, t1, true)
	for i := range tr.u {
		tr.u[i] -= ud0
	}
	for i := range tr.next {
		tr.next[i] -= ud1
	}
	if ds == nil {
		ds = tr.tmp
		clear(ds)
	}
	for i := range ds {
		ds[i] -= ud1 - ud0
	}
	return ds
}
