package drain

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// Barron's (1948) F(n) = n²/(n²−1) ln n − (3n²−1)/(4n²), computed here by
// hand at several n; n = 20 gives ≈ 2.254 (the value quoted with the
// formula, itself computed from it).
func TestBarron(t *testing.T) {
	t.Parallel()
	for _, c := range []struct{ n, want, tol float64 }{
		{20, 2.254, 5e-4}, // Barron (1948), F(20) ≈ 2.254, computed from the formula
		{5, 25.0/24*math.Log(5) - 74.0/100, 1e-12},
		{10, 100.0/99*math.Log(10) - 299.0/400, 1e-12},
		{50, 2500.0/2499*math.Log(50) - 7499.0/10000, 1e-12},
	} {
		if got := Barron(c.n); math.Abs(got-c.want) > c.tol {
			t.Errorf("F(%g) = %.6f, want %.6f ± %g", c.n, got, c.want, c.tol)
		}
	}
}

// Without smear the cell's μ is Barron's (1948) F(n) (closed form above),
// to rounding (1e-12): the equal-strain derivation is the same.
func TestMuIdealIsBarron(t *testing.T) {
	t.Parallel()
	for _, n := range []float64{2, 5, 10, 20, 40, 100} {
		for _, c := range []Cell{{N: n, S: 1, KRatio: 1}, {N: n, S: 1, KRatio: 7}, {N: n, S: math.Min(3, n/2), KRatio: 1}} {
			if got, want := c.Mu(), Barron(n); math.Abs(got-want) > 1e-12*want {
				t.Errorf("%+v: μ = %.15g, F(n) = %.15g", c, got, want)
			}
		}
	}
}

// muByQuadrature is an independent evaluation of μ: the pressure profile
// of the equal-strain cell, ∂u/∂r = (re²/r − r)/k (in units of γw ε̇/2,
// re = 1), integrated numerically from the drain, then averaged over the
// soil annulus numerically (Hansbo 1981, the assumptions of Cell.Mu).
func muByQuadrature(c Cell) float64 {
	rw := 1 / c.N
	rs := c.S * rw
	grad := func(r float64) float64 {
		k := 1.0
		if r < rs {
			k = 1 / c.KRatio
		}
		return (1/r - r) / k
	}
	u := func(r float64) float64 {
		if r <= rs {
			return quad.Fixed(grad, rw, r, 40, nil, 0)
		}
		return quad.Fixed(grad, rw, rs, 40, nil, 0) + quad.Fixed(grad, rs, r, 40, nil, 0)
	}
	area := func(r float64) float64 { return u(r) * 2 * r }
	sum := quad.Fixed(area, rw, rs, 40, nil, 0) + quad.Fixed(area, rs, 1, 60, nil, 0)
	return sum / (1 - rw*rw) // kh ū/(A re²) with re = 1
}

// μ with smear against the numerical integration of the same cell,
// within 1e-7 relative (Gauss–Legendre of 40–60 points on smooth
// integrands).
func TestMuSmearByQuadrature(t *testing.T) {
	t.Parallel()
	for _, c := range []Cell{
		{N: 20, S: 2, KRatio: 2}, {N: 20, S: 3, KRatio: 5}, {N: 8, S: 4, KRatio: 10}, {N: 60, S: 2.5, KRatio: 3},
	} {
		got, want := c.Mu(), muByQuadrature(c)
		if math.Abs(got-want) > 1e-7*want {
			t.Errorf("%+v: μ = %.10g, by quadrature %.10g", c, got, want)
		}
	}
}

// For n ≫ s, μ tends to Hansbo's (1981) μ = ln(n/s) + (kh/ks) ln s − 0.75;
// the terms it drops are O(((kh/ks) s² + ln n)/n²) (n²/(n²−1) times the
// logarithms, and the areas of drain and smear zone against the cell's),
// so the difference must stay within 2((kh/ks) s² + ln n + 1)/n².
func TestMuTendsToHansbo(t *testing.T) {
	t.Parallel()
	hansbo := func(n, s, kr float64) float64 { return math.Log(n/s) + kr*math.Log(s) - 0.75 }
	for _, c := range []struct{ s, kr float64 }{{1, 1}, {2, 3}, {3, 5}, {5, 2}} {
		for _, n := range []float64{100, 200, 400} {
			d := math.Abs(Cell{N: n, S: c.s, KRatio: c.kr}.Mu() - hansbo(n, c.s, c.kr))
			if bound := 2 * (c.kr*c.s*c.s + math.Log(n) + 1) / (n * n); d > bound {
				t.Errorf("s=%g kh/ks=%g n=%g: |μ − Hansbo| = %.3g, bound %.3g", c.s, c.kr, n, d, bound)
			}
		}
	}
}

// De = 1.05 s (triangular) and 1.128 s (square): common practice, to the
// three or four digits they are quoted with.
func TestCellFactor(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		p         Pattern
		want, tol float64
	}{{Triangular, 1.05, 5e-4}, {Square, 1.128, 5e-4}, {"hexagonal", 0, 0}} {
		if got := CellFactor(c.p); math.Abs(got-c.want) > c.tol {
			t.Errorf("%s: De/s = %.5f, want %g ± %g", c.p, got, c.want, c.tol)
		}
	}
	// Equal plan areas, by the area of each pattern's cell: π De²/4 = s²√3/2
	// (triangular) and s² (square), within 1e-14.
	if a := math.Pi * math.Pow(CellFactor(Triangular), 2) / 4; math.Abs(a-math.Sqrt(3)/2) > 1e-14 {
		t.Errorf("triangular cell area %.15g, want √3/2", a)
	}
	if a := math.Pi * math.Pow(CellFactor(Square), 2) / 4; math.Abs(a-1) > 1e-14 {
		t.Errorf("square cell area %.15g, want 1", a)
	}
}

// A 100 × 4 mm band: 2(a+b)/π = 0.208/π = 0.066208 m (Hansbo 1979) and
// (a+b)/2 = 0.052 m (Rixner et al. 1986), by hand to 1e-6 m.
func TestEquivalentDiameter(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		e    Equivalent
		want float64
	}{{Perimeter, 0.066208}, {Mean, 0.052}, {"area", 0}} {
		if got := EquivalentDiameter(0.1, 0.004, c.e); math.Abs(got-c.want) > 1e-6 {
			t.Errorf("%s: dw = %.6f m, want %.6f", c.e, got, c.want)
		}
	}
}

// Hansbo's (1981) well-resistance term π z(2l − z) kh/qw, with the
// (1 − 1/n²) of the annulus: zero at the outlet, largest at the closed
// end, symmetric for discharge at both ends (by hand, 1e-12).
func TestWellTerm(t *testing.T) {
	t.Parallel()
	kh, qw, n := 2e-9, 3e-6, 20.0
	a := 1 - 1/(n*n)
	for _, c := range []struct {
		z, top, tip float64
		d           Discharge
		want        float64
	}{
		{0, 0, 10, Top, 0},
		{10, 0, 10, Top, math.Pi * 100 * kh / qw * a},
		{2, 0, 10, Top, math.Pi * 2 * 18 * kh / qw * a},
		{2, 0, 10, Base, math.Pi * 8 * 12 * kh / qw * a},
		{5, 0, 10, Both, math.Pi * 25 * kh / qw * a},
		{8, 0, 10, Both, math.Pi * 2 * 8 * kh / qw * a},
		{6, 4, 10, Top, math.Pi * 2 * 10 * kh / qw * a},
	} {
		dist, l := FromOutlet(c.z, c.top, c.tip, c.d)
		if got := WellTerm(dist, l, kh, qw, n); math.Abs(got-c.want) > 1e-12*math.Max(1, c.want) {
			t.Errorf("z=%g %s: %.12g, want %.12g", c.z, c.d, got, c.want)
		}
	}
	if WellTerm(5, 10, kh, 0, n) != 0 || WellTerm(5, 10, kh, math.Inf(1), n) != 0 {
		t.Error("no well resistance must add 0")
	}
}
