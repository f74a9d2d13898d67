package solver

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"porelight/solver/load"
)

// stageClay is one clay layer h thick, drained at both ends, with the water
// table at zw, and the given load stages; mv = 1e-3 1/kPa.
func stageClay(h, zw float64, loads ...Load) *Project {
	return &Project{
		Format:     Format,
		GammaW:     9.81,
		WaterTable: zw,
		Layers:     []Layer{{Name: "clay", Thickness: h, GammaSat: 18, K: 1e-8, Mv: 1e-3}},
		Top:        Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads: loads,
		Mesh:  MeshSettings{MaxSize: h / 400},
	}
}

// TestSubmergence checks the final settlement of a fill that settles
// below the water table against closed forms for linear mv, derived by
// hand: with L the weight a submerged metre loses (γ − γsat + γw), q the
// fill's pressure, zw the water table depth and s > zw,
// s = mv H (q − L (s − zw)), so s = mv H (q + L zw)/(1 + mv H L);
// with zw = 0 and γsat = γ this is the s = mv H q/(1 + mv H γw).
// The final figure is the exact fixed point (tolerance 1e-9 relative:
// bisection and rounding); the time series, whose submergence lags one
// step, must end within 1e-4 relative of it.
func TestSubmergence(t *testing.T) {
	t.Parallel()
	const h, mv, gw = 10.0, 1e-3, 9.81
	for _, c := range []struct {
		name string
		zw   float64
		fill Fill
	}{
		{"water table at the top, issue's closed form", 0, Fill{Thickness: 5, Gamma: 20}},
		{"water table 0.1 m down, saturated fill heavier", 0.1, Fill{Thickness: 5, Gamma: 18, GammaSat: 21}},
		{"water table above the top (fill placed in water)", -0.5, Fill{Thickness: 4, Gamma: 19, GammaSat: 20}},
	} {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			p := stageClay(h, c.zw, Load{Start: 0, Fill: &c.fill})
			p.Stepping.EndTime = 20000
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			gs := c.fill.GammaSat
			if gs == 0 {
				gs = c.fill.Gamma
			}
			L := c.fill.Gamma - gs + gw
			q := c.fill.Gamma * c.fill.Thickness
			want := mv * h * (q + L*c.zw) / (1 + mv*h*L)
			if got := *r.Summary.SettlementLinear; math.Abs(got-want) > 1e-9*want {
				t.Errorf("final settlement %.9f m, want %.9f m (closed form above, ±1e-9 rel.)", got, want)
			}
			if got, wantHs := *r.Summary.Submerged, want-c.zw; math.Abs(got-wantHs) > 1e-9 {
				t.Errorf("submerged thickness %.9f m, want s − zw = %.9f m", got, wantHs)
			}
			ser := r.Consolidation.Series
			if got := ser.Settlement[len(ser.Settlement)-1]; math.Abs(got-want) > 1e-4*want {
				t.Errorf("series ends at %.6f m, want %.6f m (±1e-4 rel.)", got, want)
			}
			if got := ser.Load[len(ser.Load)-1]; math.Abs(got-(q-L*(want-c.zw))) > 1e-3 {
				t.Errorf("load series ends at %.4f kPa, want q − L (s − zw) = %.4f kPa (±1e-3)", got, q-L*(want-c.zw))
			}
		})
	}
}

// TestSubmergenceNonlinear: on the non-linear model the fill that settles
// below the water table is counted with the e–log settlement, not the mv
// one. The reference is computed here by hand from the published e–log
// law (Terzaghi & Peck; s = Σ h Cc/(1+e0) log10(σ'f/σ'0) for a normally
// consolidated clay) and the submergence rule s = g(q − γw s): a sand
// layer (mv) over the clay keeps σ'0 away from zero, the clay is summed
// over 20,000 slices, and the fixed point found by bisection. Within 0.3 %
// (the solver's element-wise curve on 5 cm elements against the fine sum);
// the series must end at the summary's final figure within 0.2 %, and
// the submerged thickness must be that settlement.
func TestSubmergenceNonlinear(t *testing.T) {
	t.Parallel()
	const (
		gw              = 9.81
		hs, gsSand, mvS = 1.0, 20.0, 1e-4
		hc, gsClay      = 8.0, 17.0
		e0, cc          = 1.6, 0.6
		hf, gf          = 4.0, 20.0 // fill γ = γsat: a submerged metre loses γw
	)
	p := &Project{
		Format: Format, Model: ModelNonlinear, GammaW: gw,
		Layers: []Layer{
			{Name: "sand", Thickness: hs, GammaSat: gsSand, K: 1e-5, Mv: mvS},
			{Name: "clay", Thickness: hc, GammaSat: gsClay, K: 1e-9, ECurve: &ECurve{E0: e0, Cc: cc, Cr: 0.06}},
		},
		Top: Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads:    []Load{{Start: 0, Ramp: 10, Fill: &Fill{Thickness: hf, Gamma: gf}}},
		Mesh:     MeshSettings{MaxSize: 0.05},
		Stepping: Stepping{EndTime: 200000},
	}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	g := func(s float64) float64 {
		dq := gf*hf - gw*s // the whole settlement lies below the water table at the top
		sum := mvS * hs * dq
		const n = 20000
		for i := range n {
			z := (float64(i) + 0.5) * hc / n
			s0 := (gsSand-gw)*hs + (gsClay-gw)*z
			sum += hc / n * cc / (1 + e0) * math.Log10((s0+dq)/s0)
		}
		return sum
	}
	lo, hi := 0.0, g(0)
	for hi-lo > 1e-10 {
		if mid := (lo + hi) / 2; mid-g(mid) < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	want := (lo + hi) / 2
	if r.Summary.Model != ModelNonlinear {
		t.Fatalf("summary model %q, want %q", r.Summary.Model, ModelNonlinear)
	}
	got := *r.Summary.Settlement
	if math.Abs(got-want) > 3e-3*want {
		t.Errorf("final settlement %.5f m, want %.5f m (hand fixed point above, ±0.3 %%)", got, want)
	}
	if hsub := *r.Summary.Submerged; math.Abs(hsub-got) > 1e-6 {
		t.Errorf("submerged thickness %.6f m, want the final settlement %.6f m (water table at the top)", hsub, got)
	}
	ser := r.Consolidation.Series
	if end := ser.Settlement[len(ser.Settlement)-1]; math.Abs(end-got) > 2e-3*got {
		t.Errorf("series ends at %.5f m, summary says %.5f m (±0.2 %%)", end, got)
	}
}

// TestFillIsItsPressure: a fill above the water table acts as the
// pressure γ Hf (Load.Pressure): the same settlement mv H γ Hf as a q
// stage, within 1e-12 relative (Terzaghi 1943, linear settlement).
func TestFillIsItsPressure(t *testing.T) {
	t.Parallel()
	const want = 1e-3 * 4 * 38 // mv H γ Hf, m
	for _, l := range []Load{
		{Start: 0, Ramp: 10, Q: 38},
		{Start: 0, Ramp: 10, Fill: &Fill{Thickness: 2, Gamma: 19}},
	} {
		// The water table 1 m below the top: the fill settles 0.15 m and
		// stays above it. (The column above the water table is taken
		// as saturated by this consolidation.)
		r, err := Solve(stageClay(4, 1, l), nil)
		if err != nil {
			t.Fatal(err)
		}
		if got := *r.Summary.SettlementLinear; math.Abs(got-want) > 1e-12*want {
			t.Errorf("%+v: settlement %.12f m, want mv H q = %.12f m", l, got, want)
		}
		if r.Summary.Submerged != nil && *r.Summary.Submerged != 0 {
			t.Errorf("%+v: %g m submerged, want none", l, *r.Summary.Submerged)
		}
	}
}

// TestStageGeometrySettlement checks the final linear settlement under
// finite areas, s = mv q ∫ I(z) dz, against the depth integral of the
// influence factor: for the 2:1 spread under a rectangle by hand,
// ∫₀ᴴ BL/((B+z)(L+z)) dz = BL/(L−B) ln((B+H)L/((L+H)B)); for the elastic
// forms by Gauss–Legendre quadrature of package load's separate closed
// forms (StripCentre, Corner, CircleAxis, Osterberg). Tolerance 1e-5
// relative: the mesh (400 linear elements) interpolates I(z) between
// nodes, an O(h²) error.
func TestStageGeometrySettlement(t *testing.T) {
	t.Parallel()
	const h, mv, q = 20.0, 1e-3, 50.0
	integral := func(f func(z float64) float64) float64 {
		s := 0.0
		for k := range 40 {
			s += quad.Fixed(f, h*float64(k)/40, h*float64(k+1)/40, 20, quad.Legendre{}, 0)
		}
		return s
	}
	for _, c := range []struct {
		name string
		area Area
		ref  float64 // ∫ I dz, m
	}{
		{"2:1 rectangle (by hand)", Area{Shape: "rectangle", Method: "2:1", Width: 10, Length: 30},
			300.0 / 20 * math.Log((10+h)*30/((30+h)*10))},
		{"strip centre", Area{Shape: "strip", Width: 12},
			integral(func(z float64) float64 { return load.StripCentre(12, z) })},
		{"rectangle centre", Area{Shape: "rectangle", Width: 12, Length: 20},
			integral(func(z float64) float64 { return 4 * load.Corner(6/z, 10/z) })},
		{"rectangle corner", Area{Shape: "rectangle", Width: 12, Length: 20, X: 6, Y: 10},
			integral(func(z float64) float64 { return load.Corner(12/z, 20/z) })},
		{"circle axis", Area{Shape: "circle", Radius: 8},
			integral(func(z float64) float64 { return load.CircleAxis(8, z) })},
	} {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			r, err := Solve(stageClay(h, -1, Load{Start: 0, Q: q, Area: &c.area}), nil)
			if err != nil {
				t.Fatal(err)
			}
			want := mv * q * c.ref
			if got := *r.Summary.SettlementLinear; math.Abs(got-want) > 1e-5*want {
				t.Errorf("settlement %.7f m, want mv q ∫I dz = %.7f m (±1e-5 rel.)", got, want)
			}
		})
	}
	// The embankment: a fill 3 m high with 2:1 slopes and a 10 m crest,
	// so q = γ H = 60 kPa at the crest, and twice Osterberg's (1957)
	// half-embankment under the centre. The water table is deep enough
	// that no fill submerges.
	emb := Load{Start: 0, Fill: &Fill{Thickness: 3, Gamma: 20}, Area: &Area{Shape: "embankment", Width: 10, Slope: 2}}
	p := stageClay(h, 2, emb)
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	want := mv * 60 * integral(func(z float64) float64 { return 2 * load.Osterberg(6, 5, z) })
	if got := *r.Summary.SettlementLinear; math.Abs(got-want) > 1e-5*want {
		t.Errorf("embankment settlement %.7f m, want mv q ∫ 2·Osterberg dz = %.7f m (±1e-5 rel.)", got, want)
	}
	if st := r.Consolidation.Stages; len(st) != 1 || st[0].Q != 60 || st[0].Factor[0] != 1 {
		t.Errorf("stage stress: %+v, want q = 60 kPa and factor 1 at the top", st)
	}
	if hasWarning(r, "narrower") {
		t.Errorf("an embankment 22 m wide over 20 m of clay should not warn; got %v", r.Warnings)
	}
}

// TestValidateStages refuses bad fills and areas with the field path and
// reason, every problem at once (the input contract in doc.go).
func TestValidateStages(t *testing.T) {
	t.Parallel()
	nan := math.NaN()
	fill := func() *Fill { return &Fill{Thickness: 2, Gamma: 19} }
	cases := []struct {
		name string
		load Load
		want []decProblem
	}{
		{"q and fill", Load{Q: 10, Fill: fill()}, []decProblem{{"loads[0].fill.thickness", ErrConflict}}},
		{"zero fill thickness", Load{Fill: &Fill{Gamma: 19}}, []decProblem{{"loads[0].fill.thickness", ErrNotPositive}}},
		{"fill without weight", Load{Fill: &Fill{Thickness: 1}}, []decProblem{{"loads[0].fill.gamma", ErrNotPositive}}},
		{"fill gammaSat below water", Load{Fill: &Fill{Thickness: 1, Gamma: 18, GammaSat: 5}}, []decProblem{{"loads[0].fill.gammaSat", ErrOutOfRange}}},
		{"fill NaN thickness", Load{Fill: &Fill{Thickness: nan, Gamma: 18}}, []decProblem{{"loads[0].fill.thickness", ErrNotFinite}}},
		{"no shape", Load{Q: 10, Area: &Area{Width: 3}}, []decProblem{{"loads[0].area.shape", ErrRequired}}},
		{"unknown shape", Load{Q: 10, Area: &Area{Shape: "hexagon"}}, []decProblem{{"loads[0].area.shape", ErrOutOfRange}}},
		{"strip without width", Load{Q: 10, Area: &Area{Shape: "strip"}}, []decProblem{{"loads[0].area.width", ErrNotPositive}}},
		{"strip with a radius and y", Load{Q: 10, Area: &Area{Shape: "strip", Width: 4, Radius: 2, Y: 1}},
			[]decProblem{{"loads[0].area.radius", ErrConflict}, {"loads[0].area.y", ErrConflict}}},
		{"rectangle negative length", Load{Q: 10, Area: &Area{Shape: "rectangle", Width: 4, Length: -1}}, []decProblem{{"loads[0].area.length", ErrNotPositive}}},
		{"circle off its axis", Load{Q: 10, Area: &Area{Shape: "circle", Radius: 4, X: 1}}, []decProblem{{"loads[0].area.x", ErrConflict}}},
		{"embankment without fill", Load{Q: 10, Area: &Area{Shape: "embankment", Width: 4, Slope: 2}}, []decProblem{{"loads[0].area.shape", ErrRequired}}},
		{"embankment without slope, negative crest", Load{Fill: fill(), Area: &Area{Shape: "embankment", Width: -4}},
			[]decProblem{{"loads[0].area.slope", ErrNotPositive}, {"loads[0].area.width", ErrNegative}}},
		{"unknown method", Load{Q: 10, Area: &Area{Shape: "strip", Width: 4, Method: "3:1"}}, []decProblem{{"loads[0].area.method", ErrOutOfRange}}},
		{"area and profile", Load{Q: 10, Area: &Area{Shape: "strip", Width: 4}, Profile: []DepthValue{{0, 1}}}, []decProblem{{"loads[0].area.shape", ErrConflict}}},
		{"NaN offset", Load{Q: 10, Area: &Area{Shape: "strip", Width: 4, X: nan}}, []decProblem{{"loads[0].area.x", ErrNotFinite}}},
		// Physical bounds (bounds.go).
		{"fill too thick", Load{Fill: &Fill{Thickness: -2 * MaxFillThickness, Gamma: 19}}, []decProblem{{"loads[0].fill.thickness", ErrOutOfRange}}},
		{"fill too heavy", Load{Fill: &Fill{Thickness: 2, Gamma: 19, GammaSat: 2 * MaxUnitWeight}}, []decProblem{{"loads[0].fill.gammaSat", ErrOutOfRange}}},
		{"strip too wide, offset too far", Load{Q: 10, Area: &Area{Shape: "strip", Width: 2 * MaxAreaSize, X: -2 * MaxAreaSize}},
			[]decProblem{{"loads[0].area.width", ErrOutOfRange}, {"loads[0].area.x", ErrOutOfRange}}},
		{"circle too small", Load{Q: 10, Area: &Area{Shape: "circle", Radius: MinAreaSize / 2}}, []decProblem{{"loads[0].area.radius", ErrOutOfRange}}},
		{"slope too flat", Load{Fill: fill(), Area: &Area{Shape: "embankment", Width: 4, Slope: 2 * MaxSlope}}, []decProblem{{"loads[0].area.slope", ErrOutOfRange}}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			p := valProject()
			p.Loads = []Load{c.load}
			decCheckProblems(t, Validate(p), c.want)
		})
	}
	// Every legal shape passes.
	for _, a := range []Area{
		{Shape: "strip", Width: 4, X: 9}, {Shape: "rectangle", Width: 4, Length: 8, X: 1, Y: -3, Method: "2:1"},
		{Shape: "circle", Radius: 3, Method: "elastic"}, {Shape: "embankment", Width: 0, Slope: 1.5, X: -2},
	} {
		p := valProject()
		p.Loads = []Load{{Fill: fill(), Area: &a}}
		if err := Validate(p); err != nil {
			t.Errorf("%+v: %v", a, err)
		}
	}
}

// TestNarrowLoadWarns: a strip narrower than the column is deep warns at
// its area's path; a wide one does not.
func TestNarrowLoadWarns(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		width float64
		warn  bool
	}{{5, true}, {50, false}} {
		r, err := Solve(stageClay(20, 0, Load{Q: 20, Area: &Area{Shape: "strip", Width: c.width}}), nil)
		if err != nil {
			t.Fatal(err)
		}
		got := false
		for _, w := range r.Warnings {
			got = got || w.Path == "loads[0].area"
		}
		if got != c.warn {
			t.Errorf("strip %g m wide over 20 m: warned %v, want %v (%v)", c.width, got, c.warn, r.Warnings)
		}
	}
}

// TestFillThickness checks the fill needed for a finished level against
// the closed form for one layer with the water table at the top, linear
// mv and consolidation complete: level = Hf − s with
// s = mv H γ Hf/(1 + mv H γw), so Hf = level (1 + mv H γw)/(1 + mv H γw − mv H γ).
// Tolerance 1 mm (the method's).
func TestFillThickness(t *testing.T) {
	t.Parallel()
	const h, mv, gw, gamma, level = 10.0, 1e-3, 9.81, 20.0, 3.0
	p := stageClay(h, 0, Load{Start: 0, Ramp: 30, Fill: &Fill{Thickness: 3, Gamma: gamma}})
	p.Stepping.EndTime = 40000
	got, err := FillThickness(p, 0, 30000, level, nil)
	if err != nil {
		t.Fatal(err)
	}
	a := mv * h
	want := level * (1 + a*gw) / (1 + a*gw - a*gamma)
	if math.Abs(got-want) > 1e-3 {
		t.Errorf("fill thickness %.4f m, want %.4f m (closed form, ±1 mm)", got, want)
	}
	if p.Loads[0].Fill.Thickness != 3 {
		t.Errorf("FillThickness changed the project")
	}
	if _, err := FillThickness(p, 0, 10, level, nil); err == nil {
		t.Errorf("a time before the fill is complete: no error")
	}
}

// TestFillRemoval: removing fill (a negative thickness) acts as the
// pressure taken off, γ × thickness: the same final settlement and series
// as q stages (linear mv, Terzaghi 1943), within 1e-12 m.
func TestFillRemoval(t *testing.T) {
	t.Parallel()
	fill := func(h float64) *Fill { return &Fill{Thickness: h, Gamma: 19} }
	a, err := Solve(stageClay(4, 1, Load{Start: 0, Q: 38}, Load{Start: 500, Ramp: 5, Q: -19}), nil)
	if err != nil {
		t.Fatal(err)
	}
	b, err := Solve(stageClay(4, 1, Load{Start: 0, Fill: fill(2)}, Load{Start: 500, Ramp: 5, Fill: fill(-1)}), nil)
	if err != nil {
		t.Fatal(err)
	}
	if d := math.Abs(*a.Summary.SettlementLinear - *b.Summary.SettlementLinear); d > 1e-12 {
		t.Errorf("final settlements differ by %g m", d)
	}
	sa, sb := a.Consolidation.Series.Settlement, b.Consolidation.Series.Settlement
	if len(sa) != len(sb) {
		t.Fatalf("%d and %d steps", len(sa), len(sb))
	}
	for i := range sa {
		if math.Abs(sa[i]-sb[i]) > 1e-12 {
			t.Fatalf("step %d: %g and %g m", i, sa[i], sb[i])
		}
	}
}
