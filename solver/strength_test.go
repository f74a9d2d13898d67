package solver

import (
	"math"
	"testing"

	"porelight/solver/internal/series"
)

// TestStrengthHandCase checks the strength gain on Davis & Raymond's
// (1965) clay (normally consolidated, uniform σ'0 = 50 kPa, Ck = Cc so cv
// stays constant), where σ' = σ'0 (σ'f/σ'0)^(1−w) with w Terzaghi's u/u0
// (series.TerzaghiExcess, Terzaghi 1943) at every depth and time, and the
// SHANSEP law su = S σ'v OCR^m (Ladd & Foott 1974) reduces to S σ'v under
// a load that only grows (OCR = 1). The su at every element centre at two
// days is checked against that closed form (tolerance 0.05 %, measured
// 0.007 %), and the earliest day of a second lift against the day the hand
// mean su over the element centres reaches FS·q/Nc with Nc = π + 2
// (Prandtl; tolerance 0.3 %, measured 0.09 %).
func TestStrengthHandCase(t *testing.T) {
	t.Parallel()
	const h, s0, q1, q2, S, fs = 5.0, 50.0, 50.0, 30.0, 0.22, 1.0
	p, cv := drClay(h, s0, q1)
	p.Loads = append(p.Loads, Load{Start: 3000, Q: q2})
	days := []float64{100, 1000}
	p.Decisions = &Decisions{Strength: &StrengthCheck{FS: fs, Times: days,
		Laws: []StrengthLaw{{Layer: 0, Law: StrengthSHANSEP, S: S, M: 0.8}}}}
	res, err := strengthGain(p, nil, uniformSolve(s0))
	if err != nil {
		t.Fatal(err)
	}
	hand := func(z, day, qf float64) float64 {
		w := series.TerzaghiExcess(z/h, cv*day/(h*h))
		return S * s0 * math.Pow((s0+qf)/s0, 1-w)
	}
	worst := 0.0
	for i, pr := range res.Profiles {
		if pr.Time != days[i] || len(pr.Depth) == 0 {
			t.Fatalf("profile %d at day %g with %d points", i, pr.Time, len(pr.Depth))
		}
		for j, z := range pr.Depth {
			want := hand(z, pr.Time, q1)
			worst = math.Max(worst, math.Abs(pr.Su[j]/want-1))
			if math.Abs(pr.Su[j]/want-1) > 5e-4 {
				t.Errorf("day %g, z = %.3f m: su %.4f kPa, hand %.4f kPa (tolerance 0.05 %%)", pr.Time, z, pr.Su[j], want)
			}
		}
	}
	t.Logf("su profiles: largest relative difference %.2g", worst)
	if len(res.Lifts) != 2 {
		t.Fatalf("%d lifts checked, want 2", len(res.Lifts))
	}
	first, second := res.Lifts[0], res.Lifts[1]
	if !first.Safe || first.Earliest == nil || *first.Earliest != 0 || math.Abs(first.Carries-BearingNc*S*s0/fs) > 1e-9 {
		t.Errorf("first lift: %+v, want safe from day 0 carrying Nc·S·σ'0/FS = %.3f kPa", first, BearingNc*S*s0/fs)
	}
	depths := res.Profiles[0].Depth
	mean := func(day float64) float64 {
		sum := 0.0
		for _, z := range depths {
			sum += hand(z, day, q1)
		}
		return sum / float64(len(depths))
	}
	need := (q1 + q2) * fs / BearingNc
	lo, hi := 1.0, 3000.0
	for range 100 {
		if mid := (lo + hi) / 2; mean(mid) < need {
			lo = mid
		} else {
			hi = mid
		}
	}
	if second.Earliest == nil || math.Abs(*second.Earliest/lo-1) > 0.003 {
		t.Fatalf("second lift earliest %v, hand day %.1f (tolerance 0.3 %%)", second.Earliest, lo)
	}
	t.Logf("second lift: earliest day %.1f, hand %.1f; carries %.2f kPa at day 3000 for %.0f kPa", *second.Earliest, lo, second.Carries, second.Pressure)
	if second.Pressure != q1+q2 || !second.Safe {
		t.Errorf("second lift: %+v", second)
	}
}

// TestStrengthRefused checks the refusals of the strength question.
func TestStrengthRefused(t *testing.T) {
	t.Parallel()
	law := StrengthLaw{Layer: 0, Law: StrengthSHANSEP, S: 0.22, M: 0.8}
	cases := []struct {
		name string
		s    StrengthCheck
		path string
	}{
		{"no fs", StrengthCheck{Laws: []StrengthLaw{law}}, "decisions.strength.fs"},
		{"fs below 1", StrengthCheck{FS: 0.9, Laws: []StrengthLaw{law}}, "decisions.strength.fs"},
		{"no laws", StrengthCheck{FS: 1.3}, "decisions.strength.laws"},
		{"no such layer", StrengthCheck{FS: 1.3, Laws: []StrengthLaw{{Layer: 3, Law: StrengthRatio, Ratio: 0.2}}}, "decisions.strength.laws[0].layer"},
		{"twice", StrengthCheck{FS: 1.3, Laws: []StrengthLaw{law, law}}, "decisions.strength.laws[1].layer"},
		{"unknown law", StrengthCheck{FS: 1.3, Laws: []StrengthLaw{{Law: "cone"}}}, "decisions.strength.laws[0].law"},
		{"no S", StrengthCheck{FS: 1.3, Laws: []StrengthLaw{{Law: StrengthSHANSEP, M: 0.8}}}, "decisions.strength.laws[0].s"},
		{"no su0", StrengthCheck{FS: 1.3, Laws: []StrengthLaw{{Law: StrengthMeasured, Gain: 0.2}}}, "decisions.strength.laws[0].su0"},
		{"su0 zero", StrengthCheck{FS: 1.3, Laws: []StrengthLaw{{Law: StrengthMeasured, Su0: []DepthValue{{1, 0}}}}}, "decisions.strength.laws[0].su0[0].value"},
		{"times unsorted", StrengthCheck{FS: 1.3, Laws: []StrengthLaw{law}, Times: []float64{10, 5}}, "decisions.strength.times[1]"},
	}
	for _, c := range cases {
		p, _ := drClay(5, 50, 20)
		p.Decisions = &Decisions{Strength: &c.s}
		if err := Validate(p); !hasProblem(err, c.path) {
			t.Errorf("%s: got %v, want a problem at %s", c.name, err, c.path)
		}
	}
}
