package plot

import "math"

// Tick is one axis tick: its data value, label (empty for a minor tick) and
// whether it is minor.
type Tick struct {
	Value float64
	Label string
	Minor bool
}

// niceStep returns a step of the form {1, 2, 5}·10ᵏ close to span/target
// (the smallest such step giving at most about target intervals). span and
// target must be positive.
func niceStep(span float64, target int) float64 {
	if target < 1 {
		target = 1
	}
	raw := span / float64(target)
	mag := math.Pow(10, math.Floor(math.Log10(raw)))
	for _, m := range []float64{1, 2, 5, 10} {
		if m*mag >= raw*(1-1e-9) {
			return m * mag
		}
	}
	return 10 * mag
}

// NiceRange widens [lo, hi] outward to whole multiples of a 1-2-5 step
// giving about target intervals, and returns the widened bounds and the
// step. It is safe for any input:
//
// Special cases are:
//
//	NaN or ±Inf bound: the other bound is used for both; both bad gives [0, 1]
//	lo > hi: the bounds are swapped
//	lo == hi: widened to lo ± 1 for lo = 0, else lo ± 10 % of |lo|
func NiceRange(lo, hi float64, target int) (nlo, nhi, step float64) {
	switch {
	case !isFinite(lo) && !isFinite(hi):
		lo, hi = 0, 1
	case !isFinite(lo):
		lo = hi
	case !isFinite(hi):
		hi = lo
	}
	if lo > hi {
		lo, hi = hi, lo
	}
	if hi == lo {
		d := 0.1 * math.Abs(lo)
		if d == 0 {
			d = 1
		}
		lo, hi = lo-d, hi+d
	}
	step = niceStep(hi-lo, target)
	nlo = math.Floor(lo/step+1e-9) * step
	nhi = math.Ceil(hi/step-1e-9) * step
	return nlo, nhi, step
}

// LinearTicks returns the multiples of step within [lo, hi], labelled with
// just enough decimals for the step. step must be positive.
func LinearTicks(lo, hi, step float64) []Tick {
	if !(step > 0) || !isFinite(lo) || !isFinite(hi) || hi < lo {
		return nil
	}
	dec := 0
	if step < 1 {
		dec = int(math.Ceil(-math.Log10(step) - 1e-9))
	}
	first := math.Ceil(lo/step - 1e-9)
	var ts []Tick
	for k := first; k*step <= hi+1e-9*step && len(ts) < 1000; k++ {
		v := k * step
		if math.Abs(v) < 1e-12*step {
			v = 0
		}
		ts = append(ts, Tick{Value: v, Label: fixed(v, dec)})
	}
	return ts
}

// LogRange widens [lo, hi] (both > 0) to whole decades. Non-positive or
// non-finite input gives [1, 10]; lo == hi gives the decade around it.
func LogRange(lo, hi float64) (nlo, nhi float64) {
	if !(lo > 0) || !isFinite(lo) {
		lo = hi
	}
	if !(hi > 0) || !isFinite(hi) {
		hi = lo
	}
	if !(lo > 0) || !isFinite(lo) {
		return 1, 10
	}
	if lo > hi {
		lo, hi = hi, lo
	}
	a := math.Floor(math.Log10(lo) + 1e-9)
	b := math.Ceil(math.Log10(hi) - 1e-9)
	if b <= a {
		b = a + 1
	}
	return math.Pow(10, a), math.Pow(10, b)
}

// LogTicks returns a major tick at every decade 10ᵏ within [lo, hi] and
// minor ticks at 2·10ᵏ and 5·10ᵏ. Majors are labelled, except that over
// more than eight decades only every second one is. lo must be positive.
func LogTicks(lo, hi float64) []Tick {
	if !(lo > 0) || !(hi >= lo) || !isFinite(hi) {
		return nil
	}
	a := int(math.Floor(math.Log10(lo) + 1e-9))
	b := int(math.Ceil(math.Log10(hi) - 1e-9))
	every := 1
	if b-a > 8 {
		every = 2
	}
	var ts []Tick
	for k := a; k <= b; k++ {
		for _, m := range []float64{1, 2, 5} {
			v := m * math.Pow(10, float64(k))
			if v < lo*(1-1e-9) || v > hi*(1+1e-9) {
				continue
			}
			t := Tick{Value: v, Minor: m != 1}
			if m == 1 && k%every == 0 {
				t.Label = decadeLabel(k)
			}
			ts = append(ts, t)
		}
	}
	return ts
}

// decadeLabel labels 10ᵏ: plain digits from 0.001 to 1000, else 10ᵏ with a
// superscript exponent.
func decadeLabel(k int) string {
	if k >= -3 && k <= 3 {
		if k < 0 {
			return fixed(math.Pow(10, float64(k)), -k)
		}
		return fixed(math.Pow(10, float64(k)), 0)
	}
	return "10" + superscript(k)
}
