package solver

import (
	"math"
	"os"
	"testing"

	"porelight/solver/internal/series"
)

// uniformSolve is Solve on a weightless column (uniform σ'0 = s0, as the
// classical theories assume), with options; see solveUniform.
func uniformSolve(s0 float64) solveFunc {
	return func(p *Project, opt *Options) (*Result, error) {
		if err := Validate(p); err != nil {
			return nil, err
		}
		c := newColumn(p)
		r := &Result{Warnings: []Warning{}}
		warn := func(path, msg string) { r.Warnings = append(r.Warnings, Warning{Path: path, Message: msg}) }
		st, err := c.steady(warn)
		if err != nil {
			return nil, err
		}
		for i := range st.Effective {
			st.Effective[i] = s0
		}
		r.Steady = st
		if err := c.consolidate(&r.Steady, r, opt, warn); err != nil {
			return nil, err
		}
		return r, nil
	}
}

// tvForExcessAtBase is the time factor at which Terzaghi's excess at the
// undrained face, u/u0 at Z = 1 (series.TerzaghiExcess, Terzaghi 1943),
// falls to w, by bisection in log Tv.
func tvForExcessAtBase(w float64) float64 {
	lo, hi := 1e-4, 10.0
	for range 200 {
		mid := math.Sqrt(lo * hi)
		if series.TerzaghiExcess(1, mid) > w {
			lo = mid
		} else {
			hi = mid
		}
	}
	return math.Sqrt(lo * hi)
}

// TestSurchargeHandCase checks the surcharge design on the hand case of
// Johnson (1970) and Aldrich (1965): a normally consolidated layer at
// σ'0 = 50 kPa, a permanent load of 50 kPa and a surcharge of 25 kPa. On
// the e–log curve the removal needs the degree log10(100/50)/log10(125/50)
// = 0.7565 under permanent plus surcharge (computed here, not typed). With
// Davis & Raymond's (1965) clay (Ck = Cc, cv constant) the degree of
// settlement is Terzaghi's U, so the average criterion falls at
// Tv = TvForU(0.7565) (series.TvForU); the point-by-point criterion
// falls when the least consolidated point, the undrained base, reaches
// σ' = 100 kPa: σ' = σ'0 (σ'f/σ'0)^(1−w) with w Terzaghi's u/u0 there
// (Davis & Raymond 1965), so w = 1 − 0.7565. Tolerances: the degree 0.001
// (measured below 1e-5); the two times 0.2 % (measured 0.02 % with the
// default mesh and stepping). Then the
// removal time is confirmed forward: with the surcharge off at RemoveOn
// the settlement at removal has reached the permanent load's final one and
// never grows after it (within 0.2 mm: Cr rebound only). The surcharge
// needed to remove by half that day is checked against the same closed
// form: q_s = σ'0·2^(1/(1−w)) − 100 kPa with w at the base at that day
// (tolerance 1 %: the bisection stops within 0.2 % of the day, and the
// surcharge is some 4 times as sensitive).
func TestSurchargeHandCase(t *testing.T) {
	t.Parallel()
	const h, s0, perm, sur = 5.0, 50.0, 50.0, 25.0
	p, cv := drClay(h, s0, perm+sur)
	p.Loads = append(p.Loads, Load{Start: 5000, Q: -sur})
	p.DesignLife = 20000
	p.Decisions = &Decisions{Surcharge: &SurchargeDesign{}}
	solve := uniformSolve(s0)
	plan, err := surchargeRemoval(p, nil, solve)
	if err != nil {
		t.Fatal(err)
	}
	degree := math.Log10((s0+perm)/s0) / math.Log10((s0+perm+sur)/s0)
	if math.Abs(degree-0.756) > 5e-4 {
		t.Fatalf("hand degree %.4f, the issue quotes ≈ 0.756", degree)
	}
	if math.Abs(plan.Degree-degree) > 1e-3 {
		t.Errorf("degree needed %.5f, hand %.5f (tolerance 0.001)", plan.Degree, degree)
	}
	tAvg := series.TvForU(degree) * h * h / cv
	tAll := tvForExcessAtBase(1-degree) * h * h / cv
	t.Logf("degree %.5f (hand %.5f); average %.1f d (hand %.1f); everywhere %.1f d (hand %.1f) at %.3g m", plan.Degree, degree, *plan.Average, tAvg, *plan.Everywhere, tAll, plan.LagDepth)
	for _, c := range []struct {
		name      string
		got, want float64
	}{{"average", *plan.Average, tAvg}, {"everywhere", *plan.Everywhere, tAll}, {"removeOn", *plan.RemoveOn, tAll}} {
		if math.Abs(c.got/c.want-1) > 0.002 {
			t.Errorf("%s: day %.1f, hand %.1f (tolerance 0.2 %%)", c.name, c.got, c.want)
		}
	}
	if math.Abs(plan.LagDepth-h) > 1e-9 {
		t.Errorf("the last point to reach its stress is at %g m, want the undrained base at %g m", plan.LagDepth, h)
	}

	// Forward: the removal at RemoveOn leaves no primary settlement.
	q := copyLoads(p)
	q.Loads[1].Start = *plan.RemoveOn
	q.Decisions = nil
	r, err := solve(q, nil)
	if err != nil {
		t.Fatal(err)
	}
	ser := r.Consolidation.Series
	at := SeriesAt(ser.Time, ser.Settlement, *plan.RemoveOn)
	if at < plan.TargetPrimary*(1-1e-3) {
		t.Errorf("settlement at removal %.5f m, below the permanent load's final %.5f m", at, plan.TargetPrimary)
	}
	most := at
	for j, s := range ser.Settlement {
		if ser.Time[j] > *plan.RemoveOn {
			most = math.Max(most, s)
		}
	}
	if most > at+2e-4 {
		t.Errorf("after removal on day %.1f the settlement grows from %.5f to %.5f m", *plan.RemoveOn, at, most)
	}
	if plan.After == nil || math.Abs(plan.After.AtRemoval-at) > 1e-9 || plan.After.Rebound <= 0 {
		t.Errorf("after removal: %+v, want the forward solve's %.5f m and a rebound", plan.After, at)
	}
	t.Logf("forward: at removal %.5f m, final %.5f m, rebound %.5f m, target %.5f m", at, plan.After.FinalPrimary, plan.After.Rebound, plan.TargetPrimary)

	// The surcharge needed to remove by half that day.
	by := 0.5 * tAll
	p.Decisions.Surcharge.RemoveBy = by
	plan, err = surchargeRemoval(p, nil, solve)
	if err != nil {
		t.Fatal(err)
	}
	w := series.TerzaghiExcess(1, cv*by/(h*h))
	want := s0*math.Pow(2, 1/(1-w)) - (s0 + perm)
	n := plan.Needed
	t.Logf("needed by day %.0f: %.2f kPa (hand %.2f), removal day %.1f", by, n.Surcharge, want, n.RemoveOn)
	if math.Abs(n.Surcharge/want-1) > 0.01 || n.RemoveOn > by {
		t.Errorf("surcharge needed by day %.0f: %.3f kPa removable on day %.1f, hand %.3f kPa (tolerance 1 %%)", by, n.Surcharge, n.RemoveOn, want)
	}
}

// TestSurchargeRefused checks the refusals of the surcharge question.
func TestSurchargeRefused(t *testing.T) {
	t.Parallel()
	one := 0
	cases := []struct {
		name  string
		loads []Load
		d     SurchargeDesign
		path  string
	}{
		{"no removal", []Load{{Start: 0, Q: 50}}, SurchargeDesign{}, "decisions.surcharge"},
		{"removal adds", []Load{{Start: 0, Q: 50}, {Start: 9, Q: -5}}, SurchargeDesign{Removal: &one}, "decisions.surcharge.removal"},
		{"removes more than placed", []Load{{Start: 0, Q: 50}, {Start: 9, Q: -60}}, SurchargeDesign{}, "decisions.surcharge.removal"},
		{"removeBy negative", []Load{{Start: 0, Q: 50}, {Start: 9, Q: -5}}, SurchargeDesign{RemoveBy: -3}, "decisions.surcharge.removeBy"},
	}
	for _, c := range cases {
		p, _ := drClay(5, 50, 0)
		p.Loads = c.loads
		p.Decisions = &Decisions{Surcharge: &c.d}
		if err := Validate(p); !hasProblem(err, c.path) {
			t.Errorf("%s: got %v, want a problem at %s", c.name, err, c.path)
		}
	}
	p, _ := drClay(5, 50, 0)
	p.Loads = []Load{{Start: 0, Ramp: 30, Q: 60}, {Start: 100, Q: -10}}
	p.Decisions = &Decisions{Surcharge: &SurchargeDesign{RemoveBy: 10}}
	if _, err := SurchargeRemoval(p, nil); !hasProblem(err, "decisions.surcharge.removeBy") {
		t.Errorf("removeBy before the lift ends: got %v", err)
	}
}

// TestSurchargeDemo runs the demo's surcharge question (invented data, a
// smoke test of the layered case): the removal day is the later of the two
// criteria, the forward solve starts from it, and the surcharge needed
// lets the surcharge come off by the day asked.
func TestSurchargeDemo(t *testing.T) {
	t.Parallel()
	data, err := os.ReadFile("../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	p, err := Decode(data)
	if err != nil {
		t.Fatal(err)
	}
	plan, err := SurchargeRemoval(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	if plan.RemoveOn == nil || plan.After == nil || plan.Needed == nil {
		t.Fatalf("demo plan incomplete: %+v", plan)
	}
	if *plan.RemoveOn < math.Max(*plan.Average, *plan.Everywhere) || plan.After.Time != *plan.RemoveOn {
		t.Errorf("remove on %g, average %g, everywhere %g, forward from %g", *plan.RemoveOn, *plan.Average, *plan.Everywhere, plan.After.Time)
	}
	if plan.Needed.RemoveOn > plan.Needed.By {
		t.Errorf("needed %g kPa comes off on day %g, after day %g", plan.Needed.Surcharge, plan.Needed.RemoveOn, plan.Needed.By)
	}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	if r.Residual == nil || r.Residual.Time != p.Decisions.Handover {
		t.Errorf("demo residual %+v", r.Residual)
	}
	sg, err := StrengthGain(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	if len(sg.Profiles) != len(p.Decisions.Strength.Times) || len(sg.Lifts) != 2 {
		t.Errorf("demo strength: %d profiles, %d lifts", len(sg.Profiles), len(sg.Lifts))
	}
}

// The progress of a design helper only grows over its run of solves, and
// a cancel still stops it.
func TestDesignOptionsProgress(t *testing.T) {
	t.Parallel()
	var got []float64
	o := designOptions(&Options{Progress: func(f float64) bool { got = append(got, f); return f < 0.8 }})
	for _, f := range []float64{0.2, 0.9, 1, 0.1, 0.5, 1, 0.3, 1} {
		o.Progress(f)
	}
	for i := 1; i < len(got); i++ {
		if !(got[i] >= got[i-1]) || got[i] >= 1 {
			t.Fatalf("progress %v does not grow within [0, 1)", got)
		}
	}
	if o.Progress(1) {
		t.Errorf("a cancel past 0.8 was not passed on: %v", got)
	}
}
