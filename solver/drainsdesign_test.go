package solver

import (
	"errors"
	"math"
	"testing"

	"porelight/solver/internal/series"
)

// The design helper's spacing, solved forward with Solve, reaches the
// target degree at the design time (within 0.002, the bisection stops at
// 0.1 % of the spacing); for fully penetrating ideal drains it matches
// the spacing that Carrillo's (1942) relation with Terzaghi's (1943)
// series and Barron's (1948) F(n) gives, found here by bisection on the
// closed form, within 1 %; the table's degree falls as the spacing grows.
func TestDrainSpacing(t *testing.T) {
	t.Parallel()
	p := drainedClay(true, false) // 10 m, single drainage, band 100 × 4 mm
	p.Layers[0].KhKv = 2
	p.Drains.Design = &DrainDesign{Degree: 0.9, Time: 200}
	a, err := DrainSpacing(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	// Forward.
	q := *p
	d := *p.Drains
	d.Spacing = a.Spacing
	q.Drains = &d
	q.Times = []float64{200}
	r, err := Solve(&q, nil)
	if err != nil {
		t.Fatal(err)
	}
	ser := r.Consolidation.Series
	if u := seriesAt(t, ser.Time, ser.Us, 200); math.Abs(u-0.9) > 0.002 {
		t.Errorf("spacing %.4g m gives U = %.5f at 200 days, want 0.9 ± 0.002", a.Spacing, u)
	}
	// Closed form.
	dw := 2 * (0.1 + 0.004) / math.Pi
	ch := 2 * clayCv
	uv := series.TerzaghiU(clayCv * 200 / 100)
	closed := func(s float64) float64 {
		de := s * math.Sqrt(2*math.Sqrt(3)/math.Pi)
		n := de / dw
		f := n*n/(n*n-1)*math.Log(n) - (3*n*n-1)/(4*n*n)
		return 1 - (1-uv)*math.Exp(-8*ch*200/(de*de*f))
	}
	lo, hi := 0.3, 10.0
	for hi-lo > 1e-6 {
		if mid := (lo + hi) / 2; closed(mid) >= 0.9 {
			lo = mid
		} else {
			hi = mid
		}
	}
	if math.Abs(a.Spacing-lo) > 0.01*lo {
		t.Errorf("spacing %.4g m, Carrillo/Barron closed form %.4g m (± 1 %%)", a.Spacing, lo)
	}
	if len(a.Table) != 7 {
		t.Fatalf("table has %d rows", len(a.Table))
	}
	for i := 1; i < len(a.Table); i++ {
		if a.Table[i].U >= a.Table[i-1].U {
			t.Errorf("U does not fall with spacing: %+v then %+v", a.Table[i-1], a.Table[i])
		}
	}
	for _, row := range a.Table {
		if want := closed(row.Spacing); math.Abs(row.U-want) > 0.002 {
			t.Errorf("spacing %g m: U = %.5f, closed form %.5f (± 0.002)", row.Spacing, row.U, want)
		}
	}
}

// Questions that cannot be met are refused at drains.design.time.
func TestDrainSpacingRefuses(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		name string
		des  *DrainDesign
		path string
	}{
		{"no question", nil, "drains.design"},
		{"too soon", &DrainDesign{Degree: 0.9, Time: 0.01}, "drains.design.time"},
		{"no drains needed", &DrainDesign{Degree: 0.1, Time: 1000}, "drains.design.time"},
		{"bad degree", &DrainDesign{Degree: 1.5, Time: 100}, "drains.design.degree"},
		{"no time", &DrainDesign{Degree: 0.5}, "drains.design.time"},
	} {
		p := drainedClay(true, false)
		p.Drains.Design = c.des
		_, err := DrainSpacing(p, nil)
		var ps Problems
		if !errors.As(err, &ps) || len(ps) == 0 || ps[0].Path != c.path {
			t.Errorf("%s: got %v, want a problem at %s", c.name, err, c.path)
		}
	}
}

// The search stays within the spacing's bounds: a project whose spacing
// is at MaxSpacing still gets an answer (or a refusal at its path), never
// a problem from a spacing the search made up.
func TestDrainSpacingBounds(t *testing.T) {
	t.Parallel()
	p := drainedClay(true, false)
	p.Drains.Spacing = MaxSpacing
	p.Drains.Design = &DrainDesign{Degree: 0.9, Time: 200}
	_, err := DrainSpacing(p, nil)
	if err != nil {
		var ps Problems
		if !errors.As(err, &ps) || ps[0].Path != "drains.design.time" {
			t.Errorf("got %v", err)
		}
	}
}
