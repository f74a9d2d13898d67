package fem

import (
	"math"
	"slices"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// relErr is |got − want|/|want| (|got| when want is 0).
func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got-want) / math.Abs(want)
}

// The factorisation loses the resistance of a tight layer to rounding when
// a much more permeable layer lies beside it; Refine recovers it. This
// solves the same column with the internal core with and without the
// refinement and checks that the layer fluxes improve by at least 100
// times and then meet the tolerance of TestSeepageFluxContinuity (1e-6 for
// a contrast of 1e8, closed form as there; Darcy 1856).
func TestRefineHelps(t *testing.T) {
	t.Parallel()
	th := []float64{2, 3, 1.5, 0.7}
	k := []float64{1e-9, 1e-1, 1e-9, 1e-1} // contrast 1e8
	m := NewMesh(th, 1, 0.01, 4)
	n := m.Nodes()
	a := NewBand(n, 1)
	m.Assemble(a, func(e int, _ float64) float64 { return k[m.Layer[e]] }, false)
	ht, hb := -1.3, 5.7
	r := 0.0
	for i := range th {
		r += th[i] / k[i]
	}
	q := (ht - hb) / r
	worst := func(h []float64) float64 {
		w := 0.0
		for l := range th {
			top, bot := h[m.First[l]], h[m.First[l+1]]
			w = max(w, relErr(-k[l]*(bot-top)/th[l], q))
		}
		return w
	}
	h := make([]float64, n)
	h[0], h[n-1] = ht, hb
	rhs := slices.Clone(h)
	MoveHeld(h, a, h, []int{0, n - 1})
	var f Factor
	if err := Factorize(&f, a, 1, n-1); err != nil {
		t.Fatal(err)
	}
	f.Solve(h)
	plain := worst(h)
	Refine(h, rhs, a, &f, 1, n-1)
	refined := worst(h)
	t.Logf("largest relative layer flux error: %.2g without refinement, %.2g with", plain, refined)
	if refined > 1e-6 || refined*100 > plain {
		t.Errorf("refinement took the flux error from %.2g to %.2g; want ≤ 1e-6 and 100 times smaller", plain, refined)
	}
	if h[0] != ht || h[n-1] != hb {
		t.Errorf("refinement moved the held heads to %g, %g; want %g, %g", h[0], h[n-1], ht, hb)
	}
}

// Manufactured solution with variable k, for the observed order of
// convergence of the finite element core (Strang & Fix 1973; Hughes 2000):
// on [0, 2], split into layers of 0.8 and 1.2 m,
//
//	k(z) = 1 + z²,  h(z) = sin z,
//	f = −(k h')' = −(2z cos z − (1 + z²) sin z) = (1 + z²) sin z − 2z cos z.
//
// The L2 error ‖h − h_FE‖ is integrated with 8 Gauss points per element
// (more than the elements' own 2 or 3) and its order fitted by least
// squares in log–log over four nested meshes, h = 0.2, 0.1, 0.05, 0.025 m
// in both layers (meshes that do not halve every element mix two error
// constants and blur the order). Linear elements must show
// 2 ± 0.15 and quadratic 3 ± 0.15. The boundary conditions are a fixed
// head at both ends, or a fixed head at one end and the flux k h' at the
// other (natural condition, weak form in doc.go).
func TestFEConvergence(t *testing.T) {
	t.Parallel()
	const length = 2.0
	kf := func(z float64) float64 { return 1 + z*z }
	exact := func(z float64) float64 { return math.Sin(z) }
	dexact := func(z float64) float64 { return math.Cos(z) }
	src := func(z float64) float64 { return (1+z*z)*math.Sin(z) - 2*z*math.Cos(z) }
	cases := []struct {
		name             string
		order            int
		heldTop, heldBot bool
	}{
		{"linear, heads at both ends", 1, true, true},
		{"linear, head at top, flux at base", 1, true, false},
		{"linear, flux at top, head at base", 1, false, true},
		{"quadratic, heads at both ends", 2, true, true},
		{"quadratic, head at top, flux at base", 2, true, false},
		{"quadratic, flux at top, head at base", 2, false, true},
	}
	gx, gw := make([]float64, 8), make([]float64, 8)
	quad.Legendre{}.FixedLocations(gx, gw, -1, 1)
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			var lh, le []float64
			for _, size := range []float64{0.2, 0.1, 0.05, 0.025} {
				m := NewMesh([]float64{0.8, 1.2}, tc.order, size, 1)
				n := m.Nodes()
				a := NewBand(n, tc.order)
				m.Assemble(a, func(_ int, z float64) float64 { return kf(z) }, false)
				x := make([]float64, n)
				m.Load(x, src)
				var held []int
				lo, hi := 0, n
				if tc.heldTop {
					x[0], held, lo = exact(0), append(held, 0), 1
				} else {
					x[0] += -kf(0) * dexact(0) // inflow at the top: −k h'(0)
				}
				if tc.heldBot {
					x[n-1], held, hi = exact(length), append(held, n-1), n-1
				} else {
					x[n-1] += kf(length) * dexact(length) // inflow at the base: k h'(H)
				}
				MoveHeld(x, a, x, held)
				var f Factor
				if err := Factorize(&f, a, lo, hi); err != nil {
					t.Fatal(err)
				}
				f.Solve(x)
				// L2 error by 8-point Gauss quadrature on every element.
				sum, hmax := 0.0, 0.0
				var nn, dn [3]float64
				for e := range m.Elements() {
					n0, z0, z1 := m.Span(e)
					jac := (z1 - z0) / 2
					hmax = max(hmax, z1-z0)
					for q, xi := range gx {
						Lagrange(tc.order, xi, nn[:], dn[:])
						fe := 0.0
						for b := 0; b <= tc.order; b++ {
							fe += nn[b] * x[n0+b]
						}
						d := fe - exact(z0+(xi+1)*jac)
						sum += gw[q] * jac * d * d
					}
				}
				lh, le = append(lh, math.Log(hmax)), append(le, math.Log(math.Sqrt(sum)))
			}
			// Least-squares slope of log e against log h.
			mh, me := mean(lh), mean(le)
			num, den := 0.0, 0.0
			for i := range lh {
				num += (lh[i] - mh) * (le[i] - me)
				den += (lh[i] - mh) * (lh[i] - mh)
			}
			rate := num / den
			want := float64(tc.order + 1)
			t.Logf("observed L2 order %.3f (errors %.3g … %.3g)", rate, math.Exp(le[0]), math.Exp(le[len(le)-1]))
			if math.Abs(rate-want) > 0.15 {
				t.Errorf("observed L2 order %.3f, want %g ± 0.15 (Strang & Fix 1973)", rate, want)
			}
		})
	}
}

func mean(x []float64) float64 {
	s := 0.0
	for _, v := range x {
		s += v
	}
	return s / float64(len(x))
}

// Breaks inside a layer become element ends; breaks outside the column or
// on a layer boundary add nothing, and each element keeps its layer; the
// element count equals DivisionsBreaks (exact, integers and depths to
// 1e-12 m).
func TestMeshBreaks(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		name   string
		th     []float64
		breaks []float64
		order  int
	}{
		{"none", []float64{2, 3}, nil, 1},
		{"inside", []float64{2, 3}, []float64{3.3}, 1},
		{"two in one layer", []float64{5}, []float64{1.234, 4.5}, 2},
		{"on a boundary and outside", []float64{2, 3}, []float64{-1, 2, 7}, 1},
	} {
		m := NewMeshBreaks(c.th, c.order, 0.4, 4, c.breaks)
		top, want := 0.0, 0
		for i, h := range c.th {
			want += DivisionsBreaks(top, h, c.breaks, 0.4, 4)
			top += h
			if n := m.First[i+1] - m.First[i]; n < 4 {
				t.Errorf("%s: layer %d has %d elements, want ≥ 4", c.name, i, n)
			}
		}
		if m.Elements() != want {
			t.Errorf("%s: %d elements, DivisionsBreaks says %d", c.name, m.Elements(), want)
		}
		for _, b := range c.breaks {
			if b <= 0 || b >= top {
				continue
			}
			found := false
			for e := range m.Elements() {
				if _, z0, _ := m.Span(e); math.Abs(z0-b) < 1e-12 {
					found = true
				}
			}
			if !found {
				t.Errorf("%s: no element starts at the break %g", c.name, b)
			}
		}
		for e := range m.Elements() {
			_, z0, z1 := m.Span(e)
			if z1-z0 > 0.4+1e-12 || z1 <= z0 {
				t.Errorf("%s: element %d spans %g … %g", c.name, e, z0, z1)
			}
			l := m.Layer[e]
			lt := 0.0
			for _, h := range c.th[:l] {
				lt += h
			}
			if z0 < lt-1e-12 || z1 > lt+c.th[l]+1e-12 {
				t.Errorf("%s: element %d (%g … %g) is not in its layer %d", c.name, e, z0, z1, l)
			}
		}
	}
}
