package solver

import (
	"fmt"
	"math"
	"testing"

	"porelight/solver/drain"
	"porelight/solver/internal/nlradial"
	"porelight/solver/internal/series"
)

// nlDrained is drClay (a normally consolidated clay with Ck = Cc on the
// non-linear model, σ'0 = s0, loaded by q at t = 0) with round drains
// 0.05 m on a 1.5 m triangular grid through its full depth, kh/kv = 2.
func nlDrained(h, s0, q float64) (*Project, float64) {
	p, cv := drClay(h, s0, q)
	p.Layers[0].KhKv = 2
	p.Drains = &Drains{Pattern: "triangular", Spacing: 1.5, Diameter: 0.05}
	return p, cv
}

// In its linear limit (a load step of 0.2 % of σ'0) the non-linear model
// with drains gives what the linear model with drains gives (checked
// against Hansbo 1981 and Carrillo 1942 by TestDrainsPureRadial and
// TestDrainsCarrillo) for the same column, whose mv the linear model
// takes as the secant of the same curve: Us within 0.001 (0.1 %) at every
// step after t = 0 (where the linear stepper counts the half element
// beside a drained end at once, the iterated loop not) and the final
// settlement within 0.1 %, with kh/kv or ch given,
// smear, well resistance, quadratic elements, partly penetrating drains,
// and a drawdown at the drains' outlet. The differences left are of the
// order of the load step (Δσ/σ'0 = 0.002: the secant against the
// tangent, k moving with e).
func TestNonlinearDrainsLinearLimit(t *testing.T) {
	t.Parallel()
	const h, s0, q = 8.0, 50.0, 0.1
	for _, c := range []struct {
		name   string
		change func(p *Project)
	}{
		{"khKv, single drainage", func(p *Project) {}},
		{"ch given, double drainage", func(p *Project) {
			p.Layers[0].KhKv, p.Layers[0].Ch = 0, 0.05
			p.Bottom.Drained = true
			p.Drains.Discharge = "both"
		}},
		{"smear and well resistance", func(p *Project) {
			d := p.Drains
			d.SmearRatio, d.SmearK, d.Qw = 3, 3, 2e-7
		}},
		{"quadratic elements, partly penetrating", func(p *Project) {
			p.Mesh.Order = 2
			p.Drains.Depth = 5
		}},
		{"drawdown at the outlet", func(p *Project) {
			p.Top.Excess = []TimeValue{{T: 0, Value: 0}, {T: 20, Value: -0.05}}
		}},
	} {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			nl, cv := nlDrained(h, s0, q)
			c.change(nl)
			nl.Times = []float64{0.02 * h * h / cv, 0.1 * h * h / cv, 0.5 * h * h / cv}
			lin := *nl
			lin.Model = ModelLinear
			rn, rl := solveUniform(t, nl, s0), solveUniform(t, &lin, s0)
			sn, sl := rn.Consolidation.Series, rl.Consolidation.Series
			if len(sn.Time) != len(sl.Time) {
				t.Fatalf("%d steps non-linear, %d linear", len(sn.Time), len(sl.Time))
			}
			worst := 0.0
			for i := 1; i < len(sn.Time); i++ {
				worst = math.Max(worst, math.Abs(sn.Us[i]-sl.Us[i]))
			}
			if worst > 1e-3 {
				t.Errorf("largest |Us(non-linear) − Us(linear)| = %.2g, want ≤ 0.001", worst)
			}
			fn, fl := *rn.Summary.Settlement, *rl.Summary.Settlement
			if math.Abs(fn-fl) > 1e-3*fl {
				t.Errorf("final settlement %.6g m non-linear, %.6g m linear: want within 0.1 %%", fn, fl)
			}
			if rn.Drains == nil || len(rn.Drains.AtTimes) != len(nl.Times) {
				t.Fatal("no drain figures")
			}
			for i, a := range rn.Drains.AtTimes {
				b := rl.Drains.AtTimes[i]
				if math.Abs(a.Uv-b.Uv) > 1e-3 || math.Abs(a.Uh-b.Uh) > 1e-3 {
					t.Errorf("t = %.4g days: Uv %.5f, Uh %.5f non-linear; %.5f, %.5f linear (± 0.001)", a.Time, a.Uv, a.Uh, b.Uv, b.Uh)
				}
			}
			// The drains matter here: without them Us at the first output
			// time is far below.
			if a := rn.Drains.AtTimes[0]; a.U-a.Uv < 0.05 {
				t.Errorf("U = %.4f against Uv = %.4f: the drains hardly act, the check cannot fail on them", a.U, a.Uv)
			}
			t.Logf("|ΔUs| ≤ %.2g, final %.3g relative", worst, math.Abs(fn-fl)/fl)
		})
	}
}

// Pure radial flow in the non-linear model under Davis & Raymond's (1965)
// assumption (Cc constant, Ck = Cc so that k ∝ 1/σ' ∝ mv and ch =
// kh/(mv γw) stays at its initial value ch0; σ'0 uniform, one load Δσ at
// t = 0). Both ends sealed, so u is the same at every depth and nothing
// flows vertically. The unit cell in equal strain (Hansbo 1981) gives,
// with kh taken at the cell's average state as the solver does,
//
//	∂ε/∂t = 8 kh ū/(γw De² μ),  ε = Cc/(1+e0) log10(σ'/σ'0),  ū = σ'f − σ'.
//
// With mv = Cc/(ln 10 (1+e0) σ') and kh = kh0 σ'0/σ' the factor 1/σ'
// cancels, as in Davis & Raymond's vertical argument:
//
//	dσ'/dt = (8 ch0/(De² μ)) (σ'f − σ'),  so  ū/Δσ = exp(−8 Th/μ),
//
// Th = ch0 t/De². The average excess, and so the degree of dissipation
// Up, follows Hansbo's linear solution exactly. Unlike the vertical case,
// the variable that obeys the linear equation is σ' itself, not log σ':
// the degree of settlement is Us = log10(1 + (R − 1) Up)/log10 R with R =
// σ'f/σ'0, ahead of Up (it equals Hansbo's 1 − exp(−8 Th/μ) only as
// R → 1). Checked within 0.002, for R = 2 and 5, ideal drains and smear
// (μ from package drain, itself checked against Barron 1948 and Hansbo
// 1981); the two degrees differ by more than 10 tolerances at R = 5.
func TestNonlinearDrainsRadialDavisRaymond(t *testing.T) {
	t.Parallel()
	const h, s0 = 6.0, 50.0
	for _, c := range []struct {
		ratio float64
		s, kr float64
	}{{2, 0, 0}, {5, 0, 0}, {5, 3, 3}} {
		t.Run(fmt.Sprintf("R = %g, smear %g/%g", c.ratio, c.s, c.kr), func(t *testing.T) {
			t.Parallel()
			p, cv := nlDrained(h, s0, s0*(c.ratio-1))
			p.Top.Drained = false
			p.Drains.SmearRatio, p.Drains.SmearK = c.s, c.kr
			ch := 2 * cv
			de := 1.5 * math.Sqrt(2*math.Sqrt(3)/math.Pi)
			mu := drain.Cell{N: de / 0.05, S: math.Max(c.s, 1), KRatio: math.Max(c.kr, 1)}.Mu()
			ths := []float64{0.02, 0.05, 0.1, 0.2, 0.4, 0.8}
			p.Times = timesFor(ch, de, ths...)
			r := solveUniform(t, p, s0)
			ser := r.Consolidation.Series
			worstP, worstS, apart := 0.0, 0.0, 0.0
			for i, tm := range p.Times {
				up := 1 - math.Exp(-8*ths[i]/mu)
				us := math.Log10(1+(c.ratio-1)*up) / math.Log10(c.ratio)
				worstP = math.Max(worstP, math.Abs(seriesAt(t, ser.Time, ser.Up, tm)-up))
				worstS = math.Max(worstS, math.Abs(seriesAt(t, ser.Time, ser.Us, tm)-us))
				apart = math.Max(apart, us-up)
			}
			if worstP > 0.002 {
				t.Errorf("largest |Up − (1 − exp(−8Th/μ))| = %.4f, want ≤ 0.002 (Hansbo 1981 under Davis & Raymond 1965)", worstP)
			}
			if worstS > 0.002 {
				t.Errorf("largest |Us − log(1 + (R−1)Up)/log R| = %.4f, want ≤ 0.002", worstS)
			}
			if c.ratio == 5 && apart < 0.02 {
				t.Errorf("Us and Up differ by only %.4f: the check cannot tell them apart", apart)
			}
			t.Logf("|Up − Hansbo| ≤ %.2g, |Us − DR| ≤ %.2g, Us − Up up to %.3f; %d steps, %d iterations", worstP, worstS, apart, r.Stats.Steps, r.Stats.Iterations)
		})
	}
}

// A swelling mv with drains: 100 kPa on a 6 m clay drained at the top
// (mv = 1e-3 1/kPa, mvUnload = 2e-4 1/kPa, kh/kv = 2) with round drains
// 0.05 m on a 1.2 m square grid, 60 kPa removed once it has drained
// (Th = 3: 1e-4 of the excess left). The oedometer idealisation of common
// practice (s = mv Δσ' H loading, mvUnload Δσ' H unloading) gives by hand
// 6 m × (1e-3 × 100 − 2e-4 × 60) = 0.528 m, within 0.2 % of the loading
// settlement; a mv without its swelling modulus rebounds to 6 × (0.1 −
// 0.06) = 0.24 m. The rebound is a linear problem of its own (σ' stays
// below its peak, on the swelling mv, whose cv and ch are 5 times the
// loading ones), so its fraction done at Δt = 0.1 De²/ch after the removal
// is Carrillo's (1942) 1 − (1 − Uv)(1 − Uh), with Terzaghi's series for
// Uv (series.TerzaghiU) and Uh = 1 − exp(−8 ch Δt/(De² F(n))), Barron's
// (1948) F(n) written out here: within 0.003.
func TestSwellingMvDrains(t *testing.T) {
	t.Parallel()
	const h = 6.0
	for _, c := range []struct {
		name  string
		mvu   float64
		want  float64
		ratio float64 // mv/mv of the rebound
	}{
		{"rebound along mvUnload", 2e-4, h * (1e-3*100 - 2e-4*60), 5},
		{"rebound along mv without it", 0, h * (1e-3*100 - 1e-3*60), 1},
	} {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			p := uniformClay(h, false)
			p.Layers[0].MvUnload = c.mvu
			p.Layers[0].KhKv = 2
			p.Drains = &Drains{Pattern: "square", Spacing: 1.2, Diameter: 0.05}
			de := 1.2 * math.Sqrt(4/math.Pi)
			n := de / 0.05
			mu := n*n/(n*n-1)*math.Log(n) - (3*n*n-1)/(4*n*n) // Barron (1948)
			ch := 2 * clayCv
			stage := 3 * de * de / ch
			dt := 0.1 * de * de / ch
			p.Loads = []Load{{Start: 0, Q: 100}, {Start: stage, Q: -60}}
			p.Times = []float64{stage, stage + dt}
			p.Stepping.EndTime = 2 * stage
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			s := r.Consolidation.Series
			got := s.Settlement[len(s.Settlement)-1]
			if tol := 2e-3 * 1e-3 * 100 * h; math.Abs(got-c.want) > tol {
				t.Errorf("final settlement %.5f m, want %.5f m (hand-worked, ±%.2g m)", got, c.want, tol)
			}
			at := seriesAt(t, s.Time, s.Settlement, p.Times[0])
			mid := seriesAt(t, s.Time, s.Settlement, p.Times[1])
			done := (at - mid) / (at - c.want)
			uv := series.TerzaghiU(c.ratio * clayCv * dt / (h * h))
			uh := 1 - math.Exp(-8*c.ratio*ch*dt/(de*de*mu))
			if want := 1 - (1-uv)*(1-uh); math.Abs(done-want) > 0.003 {
				t.Errorf("rebound %.4f done %.4g days after the removal, Carrillo (1942) %.4f (Uv %.4f, Uh %.4f; ± 0.003)", done, dt, want, uv, uh)
			}
			t.Logf("final %.6f m (hand %.6f), rebound %.4f done against Carrillo %.4f", got, c.want, done, 1-(1-uv)*(1-uh))
		})
	}
}

// Combined vertical and radial flow in the non-linear model under Davis
// & Raymond's (1965) assumption (drClay: Cc constant, Ck = Cc, σ'0
// uniform; kh/kv = 2, so ch0 = 2 cv0), drained at the top, with drains
// through the depth. In w = ln σ' the vertical flow is linear (Davis &
// Raymond) but the sink is not (see TestNonlinearDrainsRadialDavisRaymond:
// it is linear in σ'), so Carrillo's (1942) product holds only as
// σ'f/σ'0 → 1; the reference is the independent finite-difference
// solution of the combined equation in package nlradial (checked there
// against Terzaghi, Carrillo and the pure radial solution): Us and Up
// within 0.002 at the output times (0.01 ≤ Tv ≤ 1). Near R = 1 it also
// follows Carrillo with Terzaghi's series (series.TerzaghiU) and Hansbo's
// exp(−8 Th/μ) within 0.002; at R = 5 the logged distance from that
// product shows what the product would miss.
func TestNonlinearDrainsCombinedDavisRaymond(t *testing.T) {
	t.Parallel()
	const h, s0 = 4.0, 50.0
	for _, ratio := range []float64{1.01, 2, 5} {
		t.Run(fmt.Sprintf("R = %g", ratio), func(t *testing.T) {
			t.Parallel()
			p, cv := nlDrained(h, s0, s0*(ratio-1))
			p.Drains.Spacing = 3
			de := 3 * math.Sqrt(2*math.Sqrt(3)/math.Pi)
			n := de / 0.05
			mu := n*n/(n*n-1)*math.Log(n) - (3*n*n-1)/(4*n*n) // Barron (1948)
			ch := 2 * cv
			beta := 8 * ch * h * h / (cv * de * de * mu)
			tvs := []float64{0.01, 0.03, 0.1, 0.3, 1}
			for _, T := range tvs {
				p.Times = append(p.Times, T*h*h/cv)
			}
			r := solveUniform(t, p, s0)
			ser := r.Consolidation.Series
			wantS, wantP := nlradial.Degrees(beta, ratio, tvs, 100)
			worstS, worstP, carrillo := 0.0, 0.0, 0.0
			for i, tm := range p.Times {
				us, up := seriesAt(t, ser.Time, ser.Us, tm), seriesAt(t, ser.Time, ser.Up, tm)
				worstS = math.Max(worstS, math.Abs(us-wantS[i]))
				worstP = math.Max(worstP, math.Abs(up-wantP[i]))
				c := 1 - (1-series.TerzaghiU(tvs[i]))*math.Exp(-8*ch*tm/(de*de*mu))
				carrillo = math.Max(carrillo, math.Abs(us-c))
			}
			if worstS > 0.002 || worstP > 0.002 {
				t.Errorf("largest |Us − ref| = %.4f, |Up − ref| = %.4f: want ≤ 0.002 (nlradial)", worstS, worstP)
			}
			if ratio < 1.05 && carrillo > 0.002 {
				t.Errorf("largest |Us − Carrillo| = %.4f near the linear limit, want ≤ 0.002", carrillo)
			}
			t.Logf("β = %.3g: |Us − ref| ≤ %.2g, |Up − ref| ≤ %.2g, |Us − Carrillo| ≤ %.3f", beta, worstS, worstP, carrillo)
		})
	}
}

// The iterated loop with drains allocates nothing per step either (the
// sink is sized once), with and without well resistance: a solve with
// four times as many steps makes as many allocations.
func TestNonlinearDrainsStepAllocates(t *testing.T) {
	for _, qw := range []float64{0, 3e-7} {
		t.Run(fmt.Sprintf("qw = %g", qw), func(t *testing.T) {
			p, cv := nlDrained(2, 50, 50)
			p.Drains.Qw = qw
			count := func(steps float64) float64 {
				p.Stepping = Stepping{FirstStep: 4 / cv / steps, Growth: 1, EndTime: 4 / cv}
				return testing.AllocsPerRun(2, func() {
					if _, err := Solve(p, &Options{NoDrainReference: true}); err != nil {
						t.Fatal(err)
					}
				})
			}
			// One allocation a step would add 300; the few the series
			// may take growing past their estimated capacity (amortised,
			// O(log steps)) are allowed, as they vary with the run.
			if a, b := count(100), count(400); b > a+8 {
				t.Errorf("%g allocations for 100 steps, %g for 400: the loop allocates", a, b)
			}
		})
	}
}

// Drains are accepted with the non-linear model and with a swelling mv
// (the refusals of the first soil-model version are gone).
func TestValidateIteratedDrains(t *testing.T) {
	t.Parallel()
	p, _ := nlDrained(5, 50, 50)
	p.Layers = append(p.Layers, Layer{Name: "silt", Thickness: 3, GammaSat: 19, K: 1e-8, Mv: 2e-4, MvUnload: 5e-5})
	if err := Validate(p); err != nil {
		t.Errorf("non-linear model with drains and a swelling mv: %v", err)
	}
}
