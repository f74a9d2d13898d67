package solver

import (
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	"porelight/solver/fem"
)

// Tests of steady seepage: the equivalent permeability and the single flux
// of flow normal to the layers (Darcy 1856), the exactness of the finite
// element heads, the heave and uplift checks (Terzaghi 1943; common
// practice), hydrostatic stresses, the warnings, the mesh, and the observed
// order of convergence of the finite element core (Strang & Fix 1973).

// spEps is the unit roundoff of float64.
const spEps = 0x1p-52

func spHead(v float64) *float64 { return &v }

// spLayer is a layer with the given thickness (m) and permeability (m/s);
// the unit weights and mv matter only where a test says so.
func spLayer(h, k float64) Layer {
	return Layer{Thickness: h, GammaSat: 19, Gamma: 18, K: k, Mv: 1e-4}
}

// spColumn builds a project from layers and the two ends.
func spColumn(layers []Layer, wt float64, top, bottom Boundary, mesh MeshSettings) *Project {
	return &Project{Format: Format, Layers: layers, WaterTable: wt, Top: top, Bottom: bottom, Mesh: mesh}
}

func spDrained(h float64) Boundary { return Boundary{Drained: true, Head: spHead(h)} }

// spSolve solves p and fails the test on error.
func spSolve(t *testing.T, p *Project) *Result {
	t.Helper()
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatalf("Solve: %v", err)
	}
	return r
}

// spExact is the closed-form steady head of a layered column with no
// source: by Darcy's law the flux q is the same in every layer and the
// head falls linearly within each layer by q·H/k, so h(z) = h(0) − q·r(z)
// with the resistance r(z) = ∫₀ᶻ dz/k (Darcy 1856).
type spExact struct {
	tops, k []float64
	h0, q   float64 // head at the top, m; Darcy velocity, m/s down
	r       float64 // total resistance ΣH/k, s
}

func spExactFor(p *Project) spExact {
	e := spExact{tops: []float64{0}}
	for _, l := range p.Layers {
		e.tops = append(e.tops, e.tops[len(e.tops)-1]+l.Thickness)
		e.k = append(e.k, l.K)
		e.r += l.Thickness / l.K
	}
	hydro := -p.WaterTable
	switch {
	case p.Top.Drained && p.Bottom.Drained:
		ht, hb := headOr(p.Top.Head, hydro), headOr(p.Bottom.Head, hydro)
		e.q, e.h0 = (ht-hb)/e.r, ht
	case p.Bottom.Drained: // inflow through the top
		e.q = p.Top.Inflow
		e.h0 = headOr(p.Bottom.Head, hydro) + e.q*e.r
	default: // inflow through the bottom, i.e. upward
		e.q, e.h0 = -p.Bottom.Inflow, headOr(p.Top.Head, hydro)
	}
	return e
}

// resist is ∫₀ᶻ dz/k.
func (e spExact) resist(z float64) float64 {
	acc := 0.0
	for i, k := range e.k {
		if z <= e.tops[i+1] || i == len(e.k)-1 {
			return acc + (z-e.tops[i])/k
		}
		acc += (e.tops[i+1] - e.tops[i]) / k
	}
	return acc
}

func (e spExact) head(z float64) float64 { return e.h0 - e.q*e.resist(z) }

// drop is the head lost across the whole column, m.
func (e spExact) drop() float64 { return math.Abs(e.q) * e.r }

func spRelErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got-want) / math.Abs(want)
}

// The equivalent permeability for flow normal to the layers is the
// thickness-weighted harmonic mean k = ΣH/Σ(H/k) (Darcy 1856; e.g. Craig's
// Soil Mechanics). It must also be the permeability that, with the whole
// head drop over the whole height, gives the flux the finite element
// solution carries.
func TestSeepageHarmonicMean(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name   string
		layers []Layer
		want   float64 // m/s, hand calculation
	}{
		// One layer: k itself.
		{"one layer", []Layer{spLayer(4, 3e-7)}, 3e-7},
		// 3/(1/1e-5 + 2/1e-8) = 3/(1e5 + 2e8) = 3/200100000 = 1.49925037481e-8.
		{"sand over clay", []Layer{spLayer(1, 1e-5), spLayer(2, 1e-8)}, 1.49925037481e-8},
		// 3/(1e6 + 1e7 + 1e8) = 3/1.11e8 = 2.70270270270e-8.
		{"three equal thicknesses", []Layer{spLayer(1, 1e-6), spLayer(1, 1e-7), spLayer(1, 1e-8)}, 2.70270270270e-8},
		// 13/(1.5/5e-9 + 4/1.5e-9 + 0.5/2e-5 + 5/1e-9 + 2/1e-4)
		// = 13/(3e8 + 2.666666667e9 + 2.5e4 + 5e9 + 2e4) = 13/7.966711667e9 = 1.63178994596e-9.
		{"five layers", []Layer{spLayer(1.5, 5e-9), spLayer(4, 1.5e-9), spLayer(0.5, 2e-5), spLayer(5, 1e-9), spLayer(2, 1e-4)}, 1.63178994596e-9},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := spColumn(tc.layers, 0, spDrained(0), spDrained(-2.5), MeshSettings{MaxSize: 0.05})
			r := spSolve(t, p)
			s := r.Steady
			// Hand value, rounded to 12 digits above: 1e-10 relative.
			if e := spRelErr(s.KEquivalent, tc.want); e > 1e-10 {
				t.Errorf("kEquivalent = %.12g, hand value %.12g (rel. error %.2g > 1e-10)", s.KEquivalent, tc.want, e)
			}
			// Darcy: q = k·Δh/H with the harmonic mean k, against the
			// finite element flux; rounding only, 1e-10 relative.
			height := 0.0
			for _, l := range tc.layers {
				height += l.Thickness
			}
			q := s.KEquivalent * 2.5 / height
			if e := spRelErr(s.Flux, q); e > 1e-10 {
				t.Errorf("flux = %.12g, kEquivalent·i = %.12g (rel. error %.2g > 1e-10)", s.Flux, q, e)
			}
		})
	}
}

// With k constant in each element and no source, the exact head is linear
// in each layer, so it lies in the finite element space: the Galerkin
// solution reproduces it (Strang & Fix 1973), for linear and quadratic
// elements alike, down to rounding. Tolerance: 1e-12 of the head lost
// across the column (1e-12 m where no head is lost).
func TestSeepageNodalExactness(t *testing.T) {
	t.Parallel()
	three := []Layer{spLayer(2, 2e-6), spLayer(3, 5e-9), spLayer(4, 1e-5)}
	cases := []struct {
		name        string
		layers      []Layer
		wt          float64
		top, bottom Boundary
		mesh        MeshSettings
	}{
		{"downward, linear", three, 1, Boundary{Drained: true}, spDrained(-3), MeshSettings{MaxSize: 0.1}},
		{"downward, quadratic", three, 1, Boundary{Drained: true}, spDrained(-3), MeshSettings{Order: 2, MaxSize: 0.1}},
		{"upward, linear", three, 0, spDrained(0), spDrained(2.5), MeshSettings{MaxSize: 0.37}},
		{"one element per layer, linear", three, 0, spDrained(0.7), spDrained(-1.2), MeshSettings{MaxSize: 10, MinPerLayer: 1}},
		{"one element per layer, quadratic", three, 0, spDrained(0.7), spDrained(-1.2), MeshSettings{Order: 2, MaxSize: 10, MinPerLayer: 1}},
		{"one element, linear", []Layer{spLayer(2, 1)}, 0, spDrained(3), spDrained(1), MeshSettings{MaxSize: 5, MinPerLayer: 1}},
		{"one element, quadratic", []Layer{spLayer(2, 1)}, 0, spDrained(3), spDrained(1), MeshSettings{Order: 2, MaxSize: 5, MinPerLayer: 1}},
		{"two elements", []Layer{spLayer(2, 1e-6)}, 0, spDrained(3), spDrained(1), MeshSettings{MaxSize: 5, MinPerLayer: 2}},
		{"inflow at the top", []Layer{spLayer(2, 5e-8), spLayer(3, 1e-6)}, 2, Boundary{Inflow: 1e-8}, Boundary{Drained: true}, MeshSettings{}},
		{"inflow at the top, quadratic", []Layer{spLayer(2, 5e-8), spLayer(3, 1e-6)}, 2, Boundary{Inflow: 1e-8}, Boundary{Drained: true}, MeshSettings{Order: 2, MaxSize: 0.3}},
		{"inflow at the bottom", three, 0.5, Boundary{Drained: true}, Boundary{Inflow: 2e-9}, MeshSettings{MaxSize: 0.2}},
		{"outflow at the bottom", three, 0.5, Boundary{Drained: true}, Boundary{Inflow: -2e-9}, MeshSettings{MaxSize: 0.2}},
		{"sealed bottom", three, 0.5, Boundary{Drained: true}, Boundary{}, MeshSettings{MaxSize: 0.2}},
		{"neither end drained", three, 0.5, Boundary{}, Boundary{}, MeshSettings{MaxSize: 0.2}},
		{"large mesh", three, 0, spDrained(0), spDrained(-4), MeshSettings{MaxSize: 1e-4}},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := spColumn(tc.layers, tc.wt, tc.top, tc.bottom, tc.mesh)
			s := spSolve(t, p).Steady
			ex := spExactFor(p)
			tol := 1e-12 * ex.drop()
			if tol == 0 {
				tol = 1e-12
			}
			worst, at := 0.0, 0.0
			for i, z := range s.Depth {
				if e := math.Abs(s.Head[i] - ex.head(z)); e > worst {
					worst, at = e, z
				}
			}
			if worst > tol {
				t.Errorf("largest head error %.3g m at z = %g m exceeds %.3g m (1e-12 of the %.4g m drop)", worst, at, tol, ex.drop())
			}
		})
	}
}

// The same flux crosses every layer (Darcy 1856). Each layer's flux comes
// from its end heads, −k·Δh/H. With moderate contrasts it matches the
// closed form to 1e-10 relative. For a permeable layer between tight ones
// the head lost in it is tiny and the heads are stored to about ε·|h|, so
// its flux cannot be better than about ε·max|h|/|Δh| relative: for the
// 1e5 and 1e8 contrasts below that floor is ~2e-11 and ~5e-8, and the
// tolerances 1e-9 and 1e-6 leave room for a few roundings of the heads.
func TestSeepageFluxContinuity(t *testing.T) {
	t.Parallel()
	sandwich := func(c float64) []Layer {
		return []Layer{spLayer(2, 1e-9), spLayer(3, 1e-9*c), spLayer(1.5, 1e-9), spLayer(0.7, 1e-9*c)}
	}
	cases := []struct {
		name   string
		layers []Layer
		order  int
		tol    float64
	}{
		{"uniform", []Layer{spLayer(5, 1e-7)}, 1, 1e-10},
		{"contrast 10", sandwich(10), 1, 1e-10},
		{"contrast 1e3", sandwich(1e3), 1, 1e-10},
		{"contrast 1e3, quadratic", sandwich(1e3), 2, 1e-10},
		{"crust, clay, sand", []Layer{spLayer(1.5, 5e-9), spLayer(4, 1.5e-9), spLayer(0.5, 2e-7)}, 1, 1e-10},
		{"contrast 1e5", sandwich(1e5), 1, 1e-9},
		{"contrast 1e5, quadratic", sandwich(1e5), 2, 1e-9},
		{"contrast 1e8", sandwich(1e8), 1, 1e-6},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := spColumn(tc.layers, 1.3, Boundary{Drained: true}, spDrained(5.7), MeshSettings{Order: tc.order, MaxSize: 0.01})
			s := spSolve(t, p).Steady
			q := spExactFor(p).q
			for i, l := range s.Layers {
				if e := spRelErr(l.Flux, q); e > tc.tol {
					t.Errorf("layer %d flux %.15g, Darcy %.15g: rel. error %.2g > %g", i, l.Flux, q, e, tc.tol)
				}
			}
			if e := spRelErr(s.Flux, q); e > tc.tol {
				t.Errorf("column flux %.15g, Darcy %.15g: rel. error %.2g > %g", s.Flux, q, e, tc.tol)
			}
		})
	}
}

// Property check on random columns (fixed seed, testlapack style): the
// residual of the finite element equations, K h − f at the free nodes,
// normalised componentwise by Σⱼ|Kᵢⱼ||hⱼ| + |fᵢ|, is at rounding level
// (≤ 64ε), and every layer carries the Darcy flux to the floor
// ε·max|h|/|Δh| of TestSeepageFluxContinuity times 1000, or 1e-10.
func TestSeepageRandomColumns(t *testing.T) {
	t.Parallel()
	rnd := rand.New(rand.NewPCG(1, 1))
	for trial := range 40 {
		nl := 1 + rnd.IntN(8)
		var layers []Layer
		for range nl {
			layers = append(layers, spLayer(0.2+5*rnd.Float64(), math.Pow(10, -10+7*rnd.Float64())))
		}
		order := 1 + rnd.IntN(2)
		p := spColumn(layers, 0, spDrained(4*rnd.Float64()-2), spDrained(4*rnd.Float64()-2),
			MeshSettings{Order: order, MaxSize: 0.02 + 0.5*rnd.Float64(), MinPerLayer: 1 + rnd.IntN(4)})
		if rnd.IntN(3) == 0 {
			p.Bottom = Boundary{Inflow: 1e-9 * (rnd.Float64() - 0.5)}
		}
		s := spSolve(t, p).Steady
		c := newColumn(p)
		kb := fem.NewBand(c.m.Nodes(), order)
		c.m.Assemble(kb, func(e int, _ float64) float64 { return p.Layers[c.m.Layer[e]].K }, false)
		n := c.m.Nodes()
		lo, hi := 1, n-1
		if !p.Bottom.Drained {
			hi = n
		}
		kh := make([]float64, n)
		kb.MulVec(kh, s.Head)
		for i := lo; i < hi; i++ {
			f, scale := 0.0, 0.0
			if i == n-1 {
				f = p.Bottom.Inflow
			}
			for j := max(i-order, 0); j <= min(i+order, n-1); j++ {
				scale += math.Abs(kb.At(i, j) * s.Head[j])
			}
			scale += math.Abs(f)
			if res := math.Abs(kh[i]-f) / scale; res > 64*spEps {
				t.Errorf("trial %d: normalised residual %.2g at node %d of %d > 64ε", trial, res, i, n)
				break
			}
		}
		ex := spExactFor(p)
		hmax := 0.0
		for _, h := range s.Head {
			hmax = max(hmax, math.Abs(h))
		}
		for l, sl := range s.Layers {
			dh := math.Abs(ex.q) * p.Layers[l].Thickness / p.Layers[l].K
			tol := max(1e-10, 1000*spEps*hmax/dh)
			if ex.q == 0 {
				if math.Abs(sl.Flux) > 1e-10*p.Layers[l].K {
					t.Errorf("trial %d layer %d: flux %.3g in a column with no flow", trial, l, sl.Flux)
				}
				continue
			}
			if e := spRelErr(sl.Flux, ex.q); e > tol {
				t.Errorf("trial %d layer %d: flux %.15g, Darcy %.15g, rel. error %.2g > %.2g", trial, l, sl.Flux, ex.q, e, tol)
			}
		}
	}
}

// Critical gradient and safety against heave in upward flow (Terzaghi
// 1943): ic = γ'/γw with γ' = γsat − γw, and F = ic/i.
//
// Hand calculation (invented excavation base, γw = 9.81 kN/m³): the floor
// of an excavation is the top of the column, with water kept at the floor
// (head 0); the gravel below the column holds a head of +2.0 m.
//
//	fine sand   1.5 m  k = 5e-6 m/s  γsat = 19.0  H/k = 3.0e5 s
//	medium sand 3.0 m  k = 2e-5 m/s  γsat = 20.0  H/k = 1.5e5 s
//	q = 2.0 / 4.5e5 = 4.4444e-6 m/s upward
//	fine sand:   i = q/k = 0.88889   ic = 9.19/9.81 = 0.93680   F = 1.0539
//	medium sand: i = 0.22222         ic = 10.19/9.81 = 1.03874  F = 4.6743
//	head at 1.5 m: 0 + q·3.0e5 = 1.33333 m
//
// The hand values are rounded to 5 significant digits: tolerance 1e-4
// relative.
func TestSeepageHeaveFactor(t *testing.T) {
	t.Parallel()
	p := spColumn([]Layer{
		{Name: "fine sand", Thickness: 1.5, GammaSat: 19, K: 5e-6, Mv: 1e-4},
		{Name: "medium sand", Thickness: 3, GammaSat: 20, K: 2e-5, Mv: 5e-5},
	}, 0, spDrained(0), spDrained(2), MeshSettings{MaxSize: 0.1})
	r := spSolve(t, p)
	s := r.Steady
	checks := []struct {
		what      string
		got, want float64
	}{
		{"fine sand gradient", s.Layers[0].Gradient, 0.88889},
		{"fine sand critical gradient", s.Layers[0].CriticalGradient, 0.93680},
		{"fine sand heave factor", spDeref(s.Layers[0].HeaveFactor), 1.0539},
		{"medium sand gradient", s.Layers[1].Gradient, 0.22222},
		{"medium sand critical gradient", s.Layers[1].CriticalGradient, 1.03874},
		{"medium sand heave factor", spDeref(s.Layers[1].HeaveFactor), 4.6743},
		{"smallest heave factor", spDeref(r.Summary.MinHeaveFactor), 1.0539},
		{"flux (down positive)", s.Flux, -4.4444e-6},
		{"head at 1.5 m", s.Head[slices.Index(s.Depth, 1.5)], 1.33333},
	}
	for _, c := range checks {
		if e := spRelErr(c.got, c.want); e > 1e-4 {
			t.Errorf("%s = %.6g, hand value %.6g (rel. error %.2g > 1e-4)", c.what, c.got, c.want, e)
		}
	}
	for i, l := range s.Layers {
		if !l.Upward {
			t.Errorf("layer %d: upward = false for upward flow", i)
		}
	}

	// Downward flow: no heave factor, and the smallest is absent.
	p = spColumn(p.Layers, 0, spDrained(0), spDrained(-2), MeshSettings{MaxSize: 0.1})
	r = spSolve(t, p)
	for i, l := range r.Steady.Layers {
		if l.Upward || l.HeaveFactor != nil {
			t.Errorf("downward flow, layer %d: upward = %v, heave factor %v; want false, nil", i, l.Upward, l.HeaveFactor)
		}
	}
	if r.Summary.MinHeaveFactor != nil {
		t.Errorf("downward flow: smallest heave factor %g, want none", *r.Summary.MinHeaveFactor)
	}
}

func spDeref(p *float64) float64 {
	if p == nil {
		return math.NaN()
	}
	return *p
}

// Uplift of a low-permeability layer (common practice): the total stress
// on the base of the layer against the water pressure there.
//
// Hand calculation (invented clay cap over an artesian sand, γw = 9.81):
//
//	water table 1.0 m; top drained at the hydrostatic head −1.0 m
//	stiff clay    3 m  k = 1e-9  γ = 17 above the water table, γsat = 18
//	gravelly sand 5 m  k = 1e-4  γsat = 20; its base holds a head of +2.0 m
//	ΣH/k = 3e9 + 5e4 s; q = 3.0/3.00005e9 = 9.99983e-10 m/s upward
//	head at 3 m: 2.0 − q·5e4 = 1.99995 m
//	u = 9.81 × (1.99995 + 3) = 49.0495 kPa
//	σ = 17 × 1 + 18 × 2 = 53.0 kPa
//	F = 53.0/49.0495 = 1.08054
//
// Hand values rounded to 6 digits: tolerance 1e-5 relative.
func TestSeepageUplift(t *testing.T) {
	t.Parallel()
	layers := []Layer{
		{Name: "stiff clay", Thickness: 3, GammaSat: 18, Gamma: 17, K: 1e-9, Mv: 3e-4},
		{Name: "gravelly sand", Thickness: 5, GammaSat: 20, K: 1e-4, Mv: 2e-5},
	}
	p := spColumn(layers, 1, Boundary{Drained: true}, spDrained(2), MeshSettings{MaxSize: 0.1})
	s := spSolve(t, p).Steady
	if len(s.Uplift) != 1 {
		t.Fatalf("got %d uplift checks, want 1 (under the clay): %+v", len(s.Uplift), s.Uplift)
	}
	u := s.Uplift[0]
	if u.Layer != 0 || u.Depth != 3 {
		t.Errorf("uplift check on layer %d at %g m, want layer 0 at 3 m", u.Layer, u.Depth)
	}
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"total stress", u.Total, 53.0},
		{"water pressure", u.Pore, 49.0495},
		{"factor", spDeref(u.Factor), 1.08054},
	} {
		if e := spRelErr(c.got, c.want); e > 1e-5 {
			t.Errorf("uplift %s = %.7g, hand value %.7g (rel. error %.2g > 1e-5)", c.what, c.got, c.want, e)
		}
	}

	// Porelight checks only layers at least 100 times less permeable than
	// the layer below (result.go); a contrast of 10 gets no check.
	layers[1].K = 1e-8
	if s := spSolve(t, spColumn(layers, 1, Boundary{Drained: true}, spDrained(2), MeshSettings{})).Steady; len(s.Uplift) != 0 {
		t.Errorf("contrast 10: got uplift checks %+v, want none", s.Uplift)
	}
}

// Pore pressure, total and effective stress of a hydrostatic column by
// hand (Terzaghi 1943: σ' = σ − u; moist unit weight above the water
// table, saturated below, common practice; suction above the water table
// not counted in σ'). Every node is also checked against the closed form.
// Hand values are exact to the digits shown: tolerance 1e-9 kPa.
func TestSeepageHydrostaticStresses(t *testing.T) {
	t.Parallel()
	const gw = 9.81
	cases := []struct {
		name   string
		layers []Layer
		wt     float64
		hand   []struct{ z, u, total, eff float64 }
	}{
		{
			// Water table at 1.5 m in a 2 m crust (γ = 17, γsat = 19) over
			// 3 m of clay (γsat = 18):
			//  z = 1.0: u = 9.81 × −0.5 = −4.905, σ = 17, σ' = 17 (suction ignored)
			//  z = 1.5: u = 0, σ = 25.5, σ' = 25.5
			//  z = 2.0: u = 4.905, σ = 25.5 + 19 × 0.5 = 35.0, σ' = 30.095
			//  z = 5.0: u = 34.335, σ = 35 + 18 × 3 = 89.0, σ' = 54.665
			name: "water table in the column",
			layers: []Layer{
				{Thickness: 2, Gamma: 17, GammaSat: 19, K: 1e-6, Mv: 1e-4},
				{Thickness: 3, GammaSat: 18, K: 1e-9, Mv: 5e-4},
			},
			wt: 1.5,
			hand: []struct{ z, u, total, eff float64 }{
				{1, -4.905, 17, 17}, {1.5, 0, 25.5, 25.5}, {2, 4.905, 35, 30.095}, {5, 34.335, 89, 54.665},
			},
		},
		{
			// 2 m of water over 4 m of clay (γsat = 18):
			//  z = 0: u = σ = 19.62, σ' = 0
			//  z = 4: u = 9.81 × 6 = 58.86, σ = 19.62 + 72 = 91.62, σ' = 32.76
			name:   "water above the top",
			layers: []Layer{{Thickness: 4, Gamma: 16, GammaSat: 18, K: 1e-9, Mv: 5e-4}},
			wt:     -2,
			hand: []struct{ z, u, total, eff float64 }{
				{0, 19.62, 19.62, 0}, {4, 58.86, 91.62, 32.76},
			},
		},
		{
			// Water table 10 m down, below the 5 m column (γ = 17):
			//  z = 5: u = 9.81 × −5 = −49.05, σ = σ' = 85
			name:   "water table below the base",
			layers: []Layer{{Thickness: 5, Gamma: 17, GammaSat: 19, K: 1e-6, Mv: 1e-4}},
			wt:     10,
			hand: []struct{ z, u, total, eff float64 }{
				{5, -49.05, 85, 85},
			},
		},
		{
			// γ left out: γsat is used above the water table too.
			//  z = 1: σ = 19 × 1 = 19, u = −9.81 × 1, σ' = 19
			name:   "moist weight defaults to saturated",
			layers: []Layer{{Thickness: 3, GammaSat: 19, K: 1e-6, Mv: 1e-4}},
			wt:     2,
			hand: []struct{ z, u, total, eff float64 }{
				{1, -9.81, 19, 19}, {3, 9.81, 57, 47.19},
			},
		},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := spColumn(tc.layers, tc.wt, Boundary{Drained: true}, Boundary{Drained: true}, MeshSettings{MaxSize: 0.25})
			r := spSolve(t, p)
			s := r.Steady
			for _, h := range tc.hand {
				i := slices.Index(s.Depth, h.z)
				if i < 0 {
					t.Fatalf("no node at z = %g", h.z)
				}
				for _, c := range []struct {
					what      string
					got, want float64
				}{{"u", s.Pore[i], h.u}, {"σ", s.Total[i], h.total}, {"σ'", s.Effective[i], h.eff}} {
					if math.Abs(c.got-c.want) > 1e-9 {
						t.Errorf("z = %g: %s = %.10g kPa, hand value %.10g", h.z, c.what, c.got, c.want)
					}
				}
			}
			// Closed form at every node: u = γw (z − wt); σ integrates
			// the unit weights (plus water standing above the top).
			for i, z := range s.Depth {
				u := gw * (z - tc.wt)
				sigma := gw * max(0, -tc.wt)
				top := 0.0
				for _, l := range tc.layers {
					g := l.Gamma
					if g == 0 {
						g = l.GammaSat
					}
					bot := min(top+l.Thickness, z) // the part of this layer above z
					if bot > top {
						moist := max(0, min(bot, tc.wt)-top)
						sigma += g*moist + l.GammaSat*(bot-top-moist)
					}
					top += l.Thickness
				}
				eff := sigma - max(u, 0)
				if math.Abs(s.Pore[i]-u) > 1e-9 || math.Abs(s.Total[i]-sigma) > 1e-9 || math.Abs(s.Effective[i]-eff) > 1e-9 {
					t.Errorf("z = %g: u, σ, σ' = %.10g, %.10g, %.10g; closed form %.10g, %.10g, %.10g",
						z, s.Pore[i], s.Total[i], s.Effective[i], u, sigma, eff)
					break
				}
			}
			for _, w := range r.Warnings {
				if strings.Contains(w.Message, "below zero") || strings.Contains(w.Message, "effective stress is negative") {
					t.Errorf("hydrostatic column warns: %q", w.Message)
				}
			}
		})
	}
}

// Warnings about states the model does not cover: a pore pressure below
// zero under the water table (flow drawn down hard from below) and a
// negative effective stress (upward flow stronger than the soil's weight,
// σ' < 0 means heave; Terzaghi 1943). Each is present exactly when the
// hand calculation says so.
//
//	suction: 5 m, water table 0, head 0 at the top, −8 m at the base:
//	  u(5) = 9.81 × (−8 + 5) = −29.4 kPa < 0 below the water table.
//	negative σ': 3 m of γsat = 19, head 0 at the top, +10 m at the base:
//	  σ'(3) = 19 × 3 − 9.81 × (10 + 3) = 57 − 127.5 = −70.5 kPa.
//	neither: heads 0 and −2 m (u(5) = 29.4 kPa), or 0 and +1 m
//	  (σ'(3) = 57 − 39.2 = 17.8 kPa).
func TestSeepageWarnings(t *testing.T) {
	t.Parallel()
	const suction, negative = "pore pressure falls below zero", "effective stress is negative"
	cases := []struct {
		name       string
		h, hb      float64
		thick      float64
		want, veto []string
	}{
		{"suction below the water table", 5, -8, 5, []string{suction}, []string{negative}},
		{"negative effective stress", 3, 10, 3, []string{negative}, []string{suction}},
		{"moderate downward flow", 5, -2, 5, nil, []string{suction, negative}},
		{"moderate upward flow", 3, 1, 3, nil, []string{suction, negative}},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := spColumn([]Layer{{Thickness: tc.thick, GammaSat: 19, K: 1e-7, Mv: 1e-4}}, 0, spDrained(0), spDrained(tc.hb), MeshSettings{})
			r := spSolve(t, p)
			has := func(s string) bool {
				return slices.ContainsFunc(r.Warnings, func(w Warning) bool { return strings.Contains(w.Message, s) })
			}
			for _, s := range tc.want {
				if !has(s) {
					t.Errorf("no warning containing %q; got %+v", s, r.Warnings)
				}
			}
			for _, s := range tc.veto {
				if has(s) {
					t.Errorf("unexpected warning containing %q: %+v", s, r.Warnings)
				}
			}
		})
	}
}

// Mesh properties: layer boundaries are nodes, no element is longer than
// maxSize (to 1e-9 relative), every layer has at least minPerLayer
// elements and no more than needed, spacing is uniform in a layer, and a
// quadratic element has its middle node at its centre (definitions, see
// MeshSettings). Sizes 1, 2 and large.
func TestMesh(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name    string
		th      []float64
		order   int
		maxSize float64
		minPer  int
		want    int // elements, -1 to skip
	}{
		{"one element", []float64{2}, 1, 5, 1, 1},
		{"one quadratic element", []float64{2}, 2, 5, 1, 1},
		{"two elements", []float64{2}, 1, 1, 1, 2},
		{"two layers, one element each", []float64{0.3, 4}, 2, 10, 1, 2},
		{"minPerLayer binds", []float64{0.3, 4}, 1, 1, 3, 3 + 4},
		{"maxSize binds", []float64{1.5, 4, 0.5, 5, 2}, 1, 0.1, 4, 15 + 40 + 5 + 50 + 20},
		{"awkward sizes", []float64{0.7, 1.3, 2.9}, 2, 0.3, 2, 3 + 5 + 10},
		{"large", []float64{3, 7, 10}, 1, 2e-4, 4, 100_000},
		{"large quadratic", []float64{3, 7, 10}, 2, 1e-3, 4, 20_000},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			m := fem.NewMesh(tc.th, tc.order, tc.maxSize, tc.minPer)
			if tc.want >= 0 && m.Elements() != tc.want {
				t.Errorf("%d elements, want %d", m.Elements(), tc.want)
			}
			if m.Nodes() != tc.order*m.Elements()+1 {
				t.Errorf("%d nodes for %d elements of order %d", m.Nodes(), m.Elements(), tc.order)
			}
			layers := make([]Layer, len(tc.th))
			for i, h := range tc.th {
				layers[i] = spLayer(h, 1e-6)
			}
			p := &Project{Layers: layers, Mesh: MeshSettings{Order: tc.order, MaxSize: tc.maxSize, MinPerLayer: tc.minPer}}
			if n := elementCount(p); n != m.Elements() {
				t.Errorf("elementCount = %d, the mesh has %d", n, m.Elements())
			}
			top := 0.0
			for l, h := range tc.th {
				first, last := m.First[l], m.First[l+1]
				if got := m.Z[tc.order*first]; got != top {
					t.Errorf("layer %d top node at %.17g, want %.17g", l, got, top)
				}
				ne := last - first
				if ne < tc.minPer {
					t.Errorf("layer %d has %d elements < minPerLayer %d", l, ne, tc.minPer)
				}
				if ne > max(tc.minPer, 1) && h/float64(ne-1) <= tc.maxSize {
					t.Errorf("layer %d has %d elements; %d would do", l, ne, ne-1)
				}
				for e := first; e < last; e++ {
					if m.Layer[e] != l {
						t.Fatalf("element %d in layer %d, want %d", e, m.Layer[e], l)
					}
					n0, z0, z1 := m.Span(e)
					if z1-z0 > tc.maxSize*(1+1e-9) {
						t.Fatalf("element %d is %g m long > maxSize %g", e, z1-z0, tc.maxSize)
					}
					if math.Abs((z1-z0)-h/float64(ne)) > 1e-12*h {
						t.Fatalf("element %d is %.17g m long, the layer's spacing is %.17g", e, z1-z0, h/float64(ne))
					}
					if tc.order == 2 && math.Abs(m.Z[n0+1]-(z0+z1)/2) > 1e-12*h {
						t.Fatalf("element %d middle node at %.17g, centre %.17g", e, m.Z[n0+1], (z0+z1)/2)
					}
					if !(z1 > z0) {
						t.Fatalf("element %d has ends %g, %g", e, z0, z1)
					}
				}
				top += h
			}
			if got := m.Z[len(m.Z)-1]; got != top {
				t.Errorf("base node at %.17g, want %.17g", got, top)
			}
			// interpolate reproduces a linear field exactly (rounding),
			// including at nodes, ends and outside the column (clamped).
			u := make([]float64, m.Nodes())
			for i, z := range m.Z {
				u[i] = 2 - 3*z
			}
			for _, z := range []float64{-1, 0, top / 3, top / 2, 0.999 * top, top, top + 1} {
				zc := min(max(z, 0), top)
				if got := m.Interpolate(u, z); math.Abs(got-(2-3*zc)) > 1e-12*(2+3*top) {
					t.Errorf("interpolate at %g = %.15g, want %.15g", z, got, 2-3*zc)
				}
			}
		})
	}
}

// The default mesh: 1/200 of the height and 4 elements to a layer at least
// (MeshSettings documentation).
func TestMeshDefaults(t *testing.T) {
	t.Parallel()
	p := &Project{Layers: []Layer{spLayer(0.1, 1e-6), spLayer(9.9, 1e-6)}}
	ms := ResolveMesh(p)
	if order, maxSize, minPer := ms.Order, ms.MaxSize, ms.MinPerLayer; order != 1 || maxSize != 10.0/200 || minPer != 4 {
		t.Errorf("defaults (%d, %g, %d), want (1, 0.05, 4)", order, maxSize, minPer)
	}
	if n := elementCount(p); n != 4+198 {
		t.Errorf("default mesh has %d elements, want 4 + 198", n)
	}
}
