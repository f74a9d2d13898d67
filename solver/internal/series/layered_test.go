package series

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"testing"
)

const gammaW = 9.81 // kN/m³, common practice

// columns are the layered test cases, chosen for strong contrasts in cv
// (100× and 0.01× between neighbours, up to 2e6× in "four mixed") and thin
// layers (0.1 m in 10 m), each with every drainage.
var columns = []struct {
	name   string
	layers []Layer
}{
	{"uniform", []Layer{{10, 1e-9, 1e-3}}},
	{"cv 100x below", []Layer{{4, 1e-9, 1e-3}, {6, 1e-7, 1e-3}}},
	{"cv 0.01x below", []Layer{{4, 1e-9, 1e-3}, {6, 1e-11, 1e-3}}},
	{"thin slow seam", []Layer{{5, 1e-9, 1e-3}, {0.1, 1e-11, 1e-3}, {5, 1e-9, 1e-3}}},
	{"thin sand seam", []Layer{{5, 1e-9, 1e-3}, {0.1, 1e-7, 1e-4}, {5, 1e-9, 1e-3}}},
	{"thin crust on top", []Layer{{0.1, 1e-11, 1e-3}, {10, 1e-9, 1e-3}}},
	{"four mixed", []Layer{{1, 1e-8, 2e-4}, {3, 1e-10, 2e-3}, {0.2, 1e-6, 1e-5}, {2, 1e-9, 5e-4}}},
}

var drainages = []struct {
	name        string
	top, bottom bool
}{
	{"top drained", true, false},
	{"bottom drained", false, true},
	{"both drained", true, true},
}

// forEachColumn runs f in parallel for every column and drainage.
func forEachColumn(t *testing.T, terms int, f func(t *testing.T, layers []Layer, top, bottom bool, s *Layered)) {
	for _, c := range columns {
		for _, d := range drainages {
			t.Run(c.name+"/"+d.name, func(t *testing.T) {
				t.Parallel()
				s, err := NewLayered(c.layers, gammaW, d.top, d.bottom, terms)
				if err != nil {
					t.Fatal(err)
				}
				f(t, c.layers, d.top, d.bottom, s)
			})
		}
	}
}

// timeAt returns the time in days at which s has the time factor tv.
func timeAt(s *Layered, tv float64) float64 { return tv / s.TimeFactor(1) }

// TestLayeredErrors checks that NewLayered reports every refused argument
// at once, each naming its field.
func TestLayeredErrors(t *testing.T) {
	t.Parallel()
	ok := []Layer{{1, 1e-9, 1e-3}}
	tests := []struct {
		name        string
		layers      []Layer
		gw          float64
		top, bottom bool
		terms       int
		want        []error
		fields      []string
	}{
		{"no layers", nil, gammaW, true, false, 0, []error{ErrNoLayers}, nil},
		{"undrained", ok, gammaW, false, false, 0, []error{ErrUndrained}, nil},
		{"bad layer", []Layer{{1, 1e-9, 1e-3}, {0, -1e-9, math.NaN()}}, gammaW, true, true, 0,
			[]error{ErrNotPositive}, []string{"layers[1].Thickness", "layers[1].K", "layers[1].Mv"}},
		{"bad gammaW", ok, math.Inf(1), true, false, 0, []error{ErrNotPositive}, []string{"gammaW"}},
		{"terms", ok, gammaW, true, false, -1, []error{ErrTerms}, []string{"terms"}},
		{"too many", ok, gammaW, true, false, maxLayeredTerms + 1, []error{ErrTooMany}, nil},
		{"all at once", []Layer{{1, 0, 1e-3}}, 0, false, false, -3,
			[]error{ErrNotPositive, ErrUndrained, ErrTerms}, []string{"layers[0].K", "gammaW", "terms"}},
	}
	for _, tt := range tests {
		s, err := NewLayered(tt.layers, tt.gw, tt.top, tt.bottom, tt.terms)
		if err == nil || s != nil {
			t.Errorf("%s: got no error", tt.name)
			continue
		}
		for _, w := range tt.want {
			if !errors.Is(err, w) {
				t.Errorf("%s: error %q is not %q", tt.name, err, w)
			}
		}
		var fields []string
		for _, e := range err.(interface{ Unwrap() []error }).Unwrap() {
			var ie *InputError
			if errors.As(e, &ie) {
				fields = append(fields, ie.Field)
			}
		}
		if fmt.Sprint(fields) != fmt.Sprint(tt.fields) && !(len(fields) == 0 && len(tt.fields) == 0) {
			t.Errorf("%s: fields %v, want %v", tt.name, fields, tt.fields)
		}
	}
}

// terzaghiColumn returns Terzaghi's (1943) u/u0 for a uniform column of
// height H with coefficient cv (m²/day) and the given drainage.
func terzaghiColumn(z, t, H, cv float64, top, bottom bool) float64 {
	switch {
	case top && bottom:
		h := H / 2
		return TerzaghiExcess(math.Min(z, H-z)/h, cv*t/(h*h))
	case top:
		return TerzaghiExcess(z/H, cv*t/(H*H))
	}
	return TerzaghiExcess((H-z)/H, cv*t/(H*H))
}

// TestLayeredTerzaghi checks that a uniform column, whole or split into
// identical layers of unequal thickness, is Terzaghi's (1943) solution:
// βₙ = M² cv/H_dr² to 1e-13 (relative); from TimeFactor 0.01 on, u/u0
// to 1e-12 and Us = Up = TerzaghiU to 1e-13; at MinTime, where only the
// truncation is left (the first omitted term is down to exp(−12), see
// TestLayeredTruncation), u/u0 to 2e-6 and Us, Up to 1e-8.
func TestLayeredTerzaghi(t *testing.T) {
	t.Parallel()
	soil := Layer{K: 2e-9, Mv: 5e-4}
	cv := soil.K * 86400 / (soil.Mv * gammaW)
	splits := [][]float64{{7}, {3.5, 3.5}, {1, 4.5, 0.25, 1.25}}
	for _, split := range splits {
		var layers []Layer
		var H float64
		for _, h := range split {
			l := soil
			l.Thickness = h
			layers = append(layers, l)
			H += h
		}
		for _, d := range drainages {
			t.Run(fmt.Sprint(split, "/", d.name), func(t *testing.T) {
				t.Parallel()
				s, err := NewLayered(layers, gammaW, d.top, d.bottom, 0)
				if err != nil {
					t.Fatal(err)
				}
				hdr := H
				if d.top && d.bottom {
					hdr = H / 2
				}
				for n, b := range s.Eigenvalues() {
					// One drained end: β = M² cv/H². Two: the eigenfunctions
					// of the whole column, β = ((n+1)π/H)² cv; the symmetric
					// ones (n even) are Terzaghi's M² cv/(H/2)², the
					// antisymmetric ones have aₙ = 0.
					M := eigen(n)
					if d.top && d.bottom {
						M = math.Pi * float64(n+1)
					}
					if want := M * M * cv / (H * H); math.Abs(b-want) > 1e-13*want {
						t.Fatalf("β_%d = %.16g, want %.16g", n, b, want)
					}
					if d.top && d.bottom && n%2 == 1 && math.Abs(s.coef[n]) > 1e-13 {
						t.Errorf("a_%d = %v, want 0 (antisymmetric)", n, s.coef[n])
					}
				}
				for _, tv := range []float64{0, 0.01, 0.05, 0.2, 1, 3} {
					tol, tolU, tt := 1e-12, 1e-13, timeAt(s, tv)
					if tv == 0 {
						tol, tolU, tt = 2e-6, 1e-8, s.MinTime()
					}
					Tv := cv * tt / (hdr * hdr)
					if math.Abs(s.TimeFactor(tt)-Tv) > 1e-13*Tv {
						t.Errorf("TimeFactor = %v, want Tv = %v", s.TimeFactor(tt), Tv)
					}
					for k := 0; k <= 140; k++ {
						z := H * float64(k) / 140
						got, want := s.Excess(z, tt), terzaghiColumn(z, tt, H, cv, d.top, d.bottom)
						if math.Abs(got-want) > tol {
							t.Errorf("Tv=%.4g z=%v: Excess = %.15g, Terzaghi %.15g", Tv, z, got, want)
						}
					}
					want := TerzaghiU(Tv)
					if got := s.Us(tt); math.Abs(got-want) > tolU {
						t.Errorf("Tv=%.4g: Us = %.15g, TerzaghiU %.15g", Tv, got, want)
					}
					if got := s.Up(tt); math.Abs(got-want) > tolU {
						t.Errorf("Tv=%.4g: Up = %.15g, TerzaghiU %.15g", Tv, got, want)
					}
				}
			})
		}
	}
}

// TestLayeredInterfaces checks the interface conditions of Schiffman &
// Stein (1970) numerically on every column: u continuous (the values just
// above and at the interface agree to 1e-12) and k ∂u/∂z continuous, with
// ∂u/∂z from second-order one-sided differences on each side. The step on
// each side is h = 1e-3 of the length over which u varies there, the layer
// thickness or the diffusion length √(cv t) if shorter, so that the
// truncation error (h²·u”') stays near 1e-7 of the gradient. The series
// sums ~100 terms of order one, so its values carry a rounding noise of
// about 1e-14, which a difference amplifies to ~1e-14/h: that matters
// only where the gradient is tiny (in a permeable seam). Tolerance per
// side: 1e-5 relative + 1e-13/h. The term-by-term Gradient must agree
// with the differences on each side to that tolerance, and give a
// continuous flux to 1e-10.
func TestLayeredInterfaces(t *testing.T) {
	forEachColumn(t, 0, func(t *testing.T, layers []Layer, top, bottom bool, s *Layered) {
		for _, tv := range []float64{0.05, 0.3} {
			tt := timeAt(s, tv)
			u := func(z float64) float64 { return s.Excess(z, tt) }
			step := func(i int) float64 { return 1e-3 * min(layers[i].Thickness, math.Sqrt(s.cv[i]*tt)) }
			for i := 1; i < len(layers); i++ {
				zi := s.tops[i]
				if a, b := u(math.Nextafter(zi, 0)), u(zi); math.Abs(a-b) > 1e-12 {
					t.Errorf("Tv=%v interface %d: u jumps %v → %v", tv, i, a, b)
				}
				ha, hb := step(i-1), step(i)
				above := (3*u(zi) - 4*u(zi-ha) + u(zi-2*ha)) / (2 * ha)
				below := (-3*u(zi) + 4*u(zi+hb) - u(zi+2*hb)) / (2 * hb)
				ka, kb := layers[i-1].K, layers[i].K
				fa, fb := ka*above, kb*below
				if tol := ka*(1e-5*math.Abs(above)+1e-13/ha) + kb*(1e-5*math.Abs(below)+1e-13/hb); math.Abs(fa-fb) > tol {
					t.Errorf("Tv=%v interface %d: k∂u/∂z = %.10g above, %.10g below (differences)", tv, i, fa, fb)
				}
				ga, gb := s.Gradient(math.Nextafter(zi, 0), tt), s.Gradient(zi, tt)
				if math.Abs(ga-above) > 1e-5*math.Abs(ga)+1e-13/ha || math.Abs(gb-below) > 1e-5*math.Abs(gb)+1e-13/hb {
					t.Errorf("Tv=%v interface %d: Gradient %v, %v; differences %v, %v", tv, i, ga, gb, above, below)
				}
				if fa, fb := ka*ga, kb*gb; math.Abs(fa-fb) > 1e-10*max(math.Abs(fa), math.Abs(fb)) {
					t.Errorf("Tv=%v interface %d: k·Gradient = %.15g above, %.15g below", tv, i, fa, fb)
				}
			}
		}
	})
}

// TestLayeredAverages checks that Us and Up rise monotonically from 0 to 1
// (Schiffman & Stein 1970 define both), and that the settlement rate is
// the flux out of the drained ends (conservation, written from the PDE):
//
//	dUs/dt = (κ(0) ∂u/∂z(0) − κ(H) ∂u/∂z(H)) / ∫ mv dz,  κ = k·86400/γw,
//
// with dUs/dt from central differences (relative step 1e-4) and ∂u/∂z
// from Gradient, tolerance 1e-6 relative.
func TestLayeredAverages(t *testing.T) {
	forEachColumn(t, 0, func(t *testing.T, layers []Layer, top, bottom bool, s *Layered) {
		if s.Us(0) != 0 || s.Up(0) != 0 {
			t.Errorf("Us(0), Up(0) = %v, %v", s.Us(0), s.Up(0))
		}
		prevS, prevP := 0.0, 0.0
		for tt := s.MinTime(); s.TimeFactor(tt) < 20; tt *= 1.1 {
			us, up := s.Us(tt), s.Up(tt)
			// Strictly increasing until within rounding of 1.
			inc := func(v, prev float64) bool { return v > prev || v >= prev && prev > 1-1e-14 }
			if !inc(us, prevS) || !inc(up, prevP) || us > 1 || up > 1 {
				t.Fatalf("t=%v: Us %v after %v, Up %v after %v", tt, us, prevS, up, prevP)
			}
			prevS, prevP = us, up
		}
		if prevS < 1-1e-8 || prevP < 1-1e-8 {
			t.Errorf("at TimeFactor 20: Us, Up = %v, %v, want → 1", prevS, prevP)
		}
		var mvTot float64
		for _, l := range layers {
			mvTot += l.Mv * l.Thickness
		}
		kt := layers[0].K * 86400 / gammaW
		kb := layers[len(layers)-1].K * 86400 / gammaW
		for _, tv := range []float64{0.05, 0.2, 1} {
			tt := timeAt(s, tv)
			dt := 1e-4 * tt
			rate := (s.Us(tt+dt) - s.Us(tt-dt)) / (2 * dt)
			var flux float64
			if top {
				flux += kt * s.Gradient(0, tt)
			}
			if bottom {
				flux -= kb * s.Gradient(s.Height(), tt)
			}
			if want := flux / mvTot; math.Abs(rate-want) > 1e-6*math.Abs(want) {
				t.Errorf("Tv=%v: dUs/dt = %.10g, flux/∫mv = %.10g", tv, rate, want)
			}
		}
	})
}

// TestLayeredSymmetry checks that a column symmetric in its layers and
// drained at both ends has symmetric isochrones, u(z) = u(H − z), to 1e-12.
func TestLayeredSymmetry(t *testing.T) {
	t.Parallel()
	a, b := Layer{2, 1e-9, 1e-3}, Layer{1, 5e-11, 4e-3}
	for _, layers := range [][]Layer{{a, b, a}, {b, a, a, b}, {a, b, Layer{0.3, 1e-7, 1e-4}, b, a}} {
		s, err := NewLayered(layers, gammaW, true, true, 0)
		if err != nil {
			t.Fatal(err)
		}
		H := s.Height()
		for _, tt := range []float64{s.MinTime(), timeAt(s, 0.02), timeAt(s, 0.3)} {
			for k := 0; k <= 100; k++ {
				z := H * float64(k) / 200
				if u1, u2 := s.Excess(z, tt), s.Excess(H-z, tt); math.Abs(u1-u2) > 1e-12 {
					t.Errorf("%d layers, t=%v: u(%v) = %v, u(H−z) = %v", len(layers), tt, z, u1, u2)
				}
			}
		}
	}
}

// phi returns the n-th eigenfunction of s at z, as stored.
func phi(s *Layered, n int, z float64) float64 {
	i, L := s.layer(z), len(s.cv)
	return s.amp[n*L+i] * math.Sin(s.theta[n*L+i]+s.omega[n]/math.Sqrt(s.cv[i])*(z-s.tops[i]))
}

// characteristic is an independent form of the eigenvalue condition: the
// transfer matrix of (φ, k φ') through the layers (k relative to the
// first layer), started from the top condition; it returns φ(H) for a
// drained bottom and k φ'(H) for an impermeable one, zero exactly at the
// eigenvalues β = ω².
func characteristic(layers []Layer, top, bottom bool, omega float64) float64 {
	p, q := 0.0, 1.0 // drained top: φ = 0
	if !top {
		p, q = 1, 0
	}
	for _, l := range layers {
		cv := l.K * 86400 / (l.Mv * gammaW)
		mu := omega / math.Sqrt(cv)
		k := l.K / layers[0].K
		sn, cs := math.Sincos(mu * l.Thickness)
		p, q = p*cs+q*sn/(k*mu), -p*k*mu*sn+q*cs
		if r := math.Hypot(p, q); r > 1e100 || r < 1e-100 {
			p, q = p/r, q/r // rescale; the sign is all that matters
		}
	}
	if bottom {
		return p
	}
	return q
}

// TestLayeredEigenvalues checks that no eigenvalue is missed and none is
// spurious, independently of the Prüfer sweep that finds them:
//
//   - scanning the transfer-matrix characteristic function on a grid of
//     400 points per eigenvalue up to ω_N finds exactly the N kept
//     eigenvalues, each within 1e-9 (relative) of a sign change refined
//     by bisection;
//   - the n-th eigenfunction has exactly n zeros inside the column (Sturm
//     oscillation theorem), counted on a grid 20× finer than its
//     shortest half-wavelength;
//   - the eigenfunctions are orthogonal with weight mv (Schiffman & Stein
//     1970), by Gauss–Legendre quadrature per layer, to 1e-10;
//   - Bessel's equality for u0 = 1: Σ aₙ² ∫mv φₙ² → ∫mv, the missing part
//     being the tail of the series, between 0 and 2/N (for one layer it is
//     Σ_{m≥N} 2/M² ≈ 0.2/N); a missed low mode would remove ~1/n².
func TestLayeredEigenvalues(t *testing.T) {
	forEachColumn(t, 60, func(t *testing.T, layers []Layer, top, bottom bool, s *Layered) {
		w := s.omega
		N := len(w)
		for n := 1; n < N; n++ {
			if !(w[n] > w[n-1]) {
				t.Fatalf("ω not increasing at %d: %v, %v", n, w[n-1], w[n])
			}
		}
		// Scan.
		end := (w[N-1] + s.next) / 2
		steps := 400 * N
		var roots []float64
		prev := characteristic(layers, top, bottom, 1e-300)
		for k := 1; k <= steps; k++ {
			x := end * float64(k) / float64(steps)
			f := characteristic(layers, top, bottom, x)
			if f*prev < 0 || f == 0 {
				lo, hi := end*float64(k-1)/float64(steps), x
				for range 100 {
					mid := (lo + hi) / 2
					if characteristic(layers, top, bottom, mid)*prev > 0 {
						lo = mid
					} else {
						hi = mid
					}
				}
				roots = append(roots, (lo+hi)/2)
			}
			prev = f
		}
		if len(roots) != N {
			t.Fatalf("scan found %d roots below ω = %v, Prüfer sweep %d", len(roots), end, N)
		}
		for n := range N {
			if math.Abs(roots[n]-w[n]) > 1e-9*w[n] {
				t.Errorf("ω_%d = %.15g, scan %.15g", n, w[n], roots[n])
			}
		}
		// Zeros.
		H := s.Height()
		for n := range N {
			var minHalf = math.Inf(1)
			for i := range layers {
				minHalf = min(minHalf, math.Pi*math.Sqrt(s.cv[i])/w[n])
			}
			pts := max(2000, int(20*H/minHalf))
			zeros := 0
			prev := phi(s, n, H*1e-12)
			for k := 1; k < pts; k++ {
				v := phi(s, n, H*float64(k)/float64(pts))
				if v*prev < 0 {
					zeros++
				}
				prev = v
			}
			if v := phi(s, n, H*(1-1e-12)); v*prev < 0 {
				zeros++
			}
			if zeros != n {
				t.Errorf("φ_%d has %d zeros inside, want %d", n, zeros, n)
			}
		}
		// Orthogonality and Bessel.
		inner := func(f func(z float64) float64) float64 {
			var sum float64
			for i, l := range layers {
				sum += l.Mv * gaussPanels(f, s.tops[i], s.tops[i+1], 200)
			}
			return sum
		}
		norm := make([]float64, N)
		var mvTot, sum float64
		for _, l := range layers {
			mvTot += l.Mv * l.Thickness
		}
		for n := range N {
			norm[n] = inner(func(z float64) float64 { return phi(s, n, z) * phi(s, n, z) })
			sum += s.coef[n] * s.coef[n] * norm[n]
		}
		for _, pair := range [][2]int{{0, 1}, {0, N - 1}, {3, 17}, {N - 2, N - 1}} {
			a, b := pair[0], pair[1]
			dot := inner(func(z float64) float64 { return phi(s, a, z) * phi(s, b, z) })
			if c := dot / math.Sqrt(norm[a]*norm[b]); math.Abs(c) > 1e-10 {
				t.Errorf("∫mv φ_%d φ_%d / norms = %v", a, b, c)
			}
		}
		if miss := 1 - sum/mvTot; miss < -1e-12 || miss > 2.0/float64(N) {
			t.Errorf("Bessel: 1 − Σ aₙ²‖φₙ‖²/∫mv = %v, want in [0, 2/N = %v]", miss, 2.0/float64(N))
		}
	})
}

// gaussPanels integrates f over [a, b] by 20-point Gauss–Legendre on n
// equal panels.
func gaussPanels(f func(float64) float64, a, b float64, n int) float64 {
	var sum float64
	for p := range n {
		lo := a + (b-a)*float64(p)/float64(n)
		hi := a + (b-a)*float64(p+1)/float64(n)
		sum += fixed20(f, lo, hi)
	}
	return sum
}

// TestLayeredTruncation checks the accuracy promised for the automatic
// number of terms: at MinTime (TimeFactor ≤ 1e-3), Excess on a 2001-point
// grid, Us and Up differ from a series with 4N+50 terms (whose own
// truncation error is below exp(−192)) by less than 1e-5, ten times inside
// the 1e-4 promised. (The largest difference seen over these columns is
// 1.1e-6, in "thin crust on top" with the top drained.)
func TestLayeredTruncation(t *testing.T) {
	forEachColumn(t, 0, func(t *testing.T, layers []Layer, top, bottom bool, s *Layered) {
		ref, err := NewLayered(layers, gammaW, top, bottom, 4*s.Terms()+50)
		if err != nil {
			t.Fatal(err)
		}
		tm := s.MinTime()
		if tv := s.TimeFactor(tm); tv > autoTv {
			t.Errorf("TimeFactor(MinTime) = %v > %v", tv, autoTv)
		}
		var worst float64
		for k := 0; k <= 2000; k++ {
			z := s.Height() * float64(k) / 2000
			worst = max(worst, math.Abs(s.Excess(z, tm)-ref.Excess(z, tm)))
		}
		worst = max(worst, math.Abs(s.Us(tm)-ref.Us(tm)), math.Abs(s.Up(tm)-ref.Up(tm)))
		if worst > 1e-5 {
			t.Errorf("%d terms: largest truncation error at MinTime = %v", s.Terms(), worst)
		}
	})
}

// TestLayeredFiniteDifference compares the series with an independent
// finite difference solution (fdColumn) on every column at TimeFactor 0.02
// and 0.3, on two meshes, the second twice as fine. The scheme is second
// order in space (Strang & Fix 1973), so if the series is the exact
// solution the nodal error must fall by 4 (observed order 2 ± 0.25) and be
// small on the fine mesh (below 3e-4 of u0; the time error, with 3000 CN
// steps, is far smaller). A series converging to anything else would show
// an order near 0.
func TestLayeredFiniteDifference(t *testing.T) {
	if testing.Short() {
		t.Skip("finite difference reference is slow")
	}
	forEachColumn(t, 0, func(t *testing.T, layers []Layer, top, bottom bool, s *Layered) {
		for _, tv := range []float64{0.02, 0.3} {
			tt := timeAt(s, tv)
			var errs [2]float64
			for r, ref := range []int{2, 4} {
				fd := fdColumn(layers, gammaW, top, bottom, fdElems(layers, ref), 3000, tt, 1, nil)
				for i, z := range fd.z {
					errs[r] = max(errs[r], math.Abs(fd.u[i]-s.Excess(z, tt)))
				}
				errs[r] = max(errs[r], math.Abs(1-fd.mvMean-s.Us(tt)), math.Abs(1-fd.mean-s.Up(tt)))
			}
			order := math.Log2(errs[0] / errs[1])
			if math.Abs(order-2) > 0.25 || errs[1] > 3e-4 {
				t.Errorf("Tv=%v: error %.3g then %.3g, observed order %.2f", tv, errs[0], errs[1], order)
			}
		}
	})
}

// TestLayeredSpecialCases checks the documented special cases.
func TestLayeredSpecialCases(t *testing.T) {
	t.Parallel()
	s, err := NewLayered([]Layer{{2, 1e-9, 1e-3}, {3, 1e-8, 1e-3}}, gammaW, true, false, 25)
	if err != nil {
		t.Fatal(err)
	}
	if s.Terms() != 25 || len(s.Eigenvalues()) != 25 || s.Height() != 5 {
		t.Errorf("Terms %d, Eigenvalues %d, Height %v", s.Terms(), len(s.Eigenvalues()), s.Height())
	}
	if !sort.Float64sAreSorted(s.Eigenvalues()) {
		t.Errorf("eigenvalues not sorted")
	}
	nan, inf := math.NaN(), math.Inf(1)
	tests := []struct {
		name      string
		got, want float64
	}{
		{"Excess(0,t) drained", s.Excess(0, 10), 0},
		{"Excess(0,0) drained", s.Excess(0, 0), 0},
		{"Excess(z,0)", s.Excess(1, 0), 1},
		{"Excess(H,0) undrained", s.Excess(5, 0), 1},
		{"Excess(z,Inf)", s.Excess(1, inf), 0},
		{"Excess(-1e-12,t)", s.Excess(-1e-12, 10), 0},
		{"Excess(H+1e-12,t)", s.Excess(5+1e-12, 10), s.Excess(5, 10)},
		{"Excess(-0.1,t)", s.Excess(-0.1, 10), nan},
		{"Excess(z,-1)", s.Excess(1, -1), nan},
		{"Excess(NaN,t)", s.Excess(nan, 1), nan},
		{"Gradient(z,0)", s.Gradient(1, 0), nan},
		{"Us(0)", s.Us(0), 0},
		{"Up(Inf)", s.Up(inf), 1},
		{"Us(-1)", s.Us(-1), nan},
		{"Up(NaN)", s.Up(nan), nan},
	}
	for _, tt := range tests {
		if !alike(tt.got, tt.want) {
			t.Errorf("%s = %v, want %v", tt.name, tt.got, tt.want)
		}
	}
}
