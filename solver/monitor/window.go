package monitor

import "math"

// FirstModeShare is the largest share of the higher Terzaghi modes in the
// settlement rate that the default window of Asaoka's method admits at its
// start.
//
// # The criterion
//
// Under constant load from day t_L on, the settlement of a uniform layer
// with drainage path d approaches s∞ as (Terzaghi 1943)
//
//	s∞ − s(t) = s∞ Σ (2/M²) exp(−M² cv τ/d²),  M = π/2, 3π/2, …,  τ = t − t_L,
//
// so its rate is ṡ = (2 s∞ cv/d²) Σ exp(−M² cv τ/d²): every mode carries
// the same weight in the rate, and the second decays 9 times faster than
// the first. Asaoka's (1978) relation s_j = β0 + β1 s_(j−1) is exact
// when one exponential is left; its β1 = exp(−λΔt) gives the first
// mode's rate λ = π²cv/(4d²). The share of the second mode in the rate,
// relative to the first, is therefore
//
//	r(τ) = exp(−8λτ),
//
// and it is known from the fit itself, not from the model's cv (which
// the readings are meant to check). The default window starts at the
// first reading with r ≤ FirstModeShare, that is
//
//	τ ≥ ln(1/FirstModeShare)/(8λ)   (Tv ≥ 4 ln 50/(8π²) = 0.198 for 2 %).
//
// Because an early window overestimates λ, the start is found by fixed
// point: fit from t_L, move the start to t_L + ln(1/share)/(8λ), refit,
// and repeat until the window keeps its first reading (the start only
// moves later, so this ends). If the record is too short, the window
// starts at the latest reading that leaves 6 readings and the result's
// HigherModes, above the share, says so. Assumptions: the load is
// constant after t_L (a ramp that ends at t_L has already damped the
// higher modes, so the start is then conservative), and the column acts
// as one uniform layer; for layers of contrasting cv the ratio of the
// first two rates differs from 9, which the spread over window starts
// (AsaokaResult.Starts) shows.
const FirstModeShare = 0.02

// maxStartRows is the largest number of rows in AsaokaResult.Starts.
const maxStartRows = 12

// rate is the first mode's decay rate −ln β1/Δt, per day.
func (a *AsaokaResult) rate() float64 { return -math.Log(a.Beta1) / a.Interval }

// higherModeShare is exp(−8λ(t_0 − after)) for the fit a.
func higherModeShare(a *AsaokaResult, after float64) float64 {
	return math.Exp(-8 * a.rate() * math.Max(0, a.Times[0]-after))
}

// latestStart is the index of the latest reading that leaves asaokaAutoMin
// readings up to end in the window, or the first one at or after from
// when fewer are left; -1 when no reading lies in [from, end].
func latestStart(times []float64, from, end float64) (first, last int) {
	first, last = -1, -1
	for j, t := range times {
		if t >= from && t <= end {
			if first < 0 {
				first = j
			}
			last = j
		}
	}
	if first < 0 {
		return -1, -1
	}
	return first, max(first, last-asaokaAutoMin+1)
}

// windowEnd is the last day a window reads.
func windowEnd(opt AsaokaOptions) float64 {
	if opt.To > 0 {
		return opt.To
	}
	return math.Inf(1)
}

// firstModeStart finds the default window start of FirstModeShare.
func firstModeStart(times, settlements []float64, interval float64, opt AsaokaOptions, at recordPaths) (float64, error) {
	first, latest := latestStart(times, opt.AfterTime, windowEnd(opt))
	if first < 0 {
		return opt.AfterTime, nil // asaokaWindow refuses the record
	}
	start := times[first]
	a, err := asaokaWindow(times, settlements, interval, start, opt, at)
	if err != nil {
		return opt.AfterTime, nil // the same refusal follows
	}
	for range len(times) {
		want := opt.AfterTime + math.Log(1/FirstModeShare)/(8*a.rate())
		if want <= start {
			return start, nil
		}
		j := first
		for j < latest && times[j] < want {
			j++
		}
		if times[j] <= start {
			return start, nil // the record is too short to go later
		}
		next, err := asaokaWindow(times, settlements, interval, times[j], opt, at)
		if err != nil {
			return start, nil // keep the last window that gives a forecast
		}
		start, a = times[j], next
	}
	return start, nil
}

// spread fills a.Starts and the spreads and uncertainties of a.
func (a *AsaokaResult) spread(times, settlements []float64, interval float64, opt AsaokaOptions, at recordPaths) {
	defer func() {
		a.FinalUncertainty = math.Hypot(a.FinalSE, a.FinalSpread)
		a.CvUncertainty = math.Hypot(a.CvSE, a.CvSpread)
	}()
	first, latest := latestStart(times, opt.AfterTime, windowEnd(opt))
	if first < 0 {
		return
	}
	rows := min(latest-first+1, maxStartRows)
	prev := -1
	for i := range rows {
		j := first
		if rows > 1 {
			j = first + int(math.Round(float64(i)*float64(latest-first)/float64(rows-1)))
		}
		if j == prev {
			continue
		}
		prev = j
		b, err := asaokaWindow(times, settlements, interval, times[j], opt, at)
		if err != nil {
			continue
		}
		a.Starts = append(a.Starts, AsaokaStart{From: times[j], Final: b.Final, FinalSE: b.FinalSE, Cv: b.Cv, HigherModes: higherModeShare(b, opt.AfterTime)})
		if times[j] >= a.Times[0] && 2*b.readings >= a.readings {
			a.FinalSpread = math.Max(a.FinalSpread, math.Abs(b.Final-a.Final))
			a.CvSpread = math.Max(a.CvSpread, math.Abs(b.Cv-a.Cv))
		}
	}
}
