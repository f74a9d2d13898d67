package plot

import "math"

// Scale maps data values in [Lo, Hi] to pixels in [A, B], linearly or on
// log10. A may exceed B: a depth axis maps Lo (the top of the column) to the
// top of the plot, an upward axis maps Lo to its bottom.
//
// A log scale needs 0 < Lo < Hi; values ≤ 0 map to NaN. Lo == Hi maps every
// value to the middle of [A, B].
type Scale struct {
	Lo, Hi float64
	A, B   float64
	Log    bool
}

// Map returns the pixel position of the data value v (NaN for NaN input or
// a non-positive value on a log scale). Values outside [Lo, Hi] map outside
// [A, B].
func (s Scale) Map(v float64) float64 {
	t := s.frac(v)
	return s.A + t*(s.B-s.A)
}

// mapper returns Map with the logarithms of the domain's ends taken
// once, for the points of a curve.
func (s Scale) mapper() func(float64) float64 {
	if !s.Log || s.Lo <= 0 || s.Hi <= 0 {
		return s.Map
	}
	lo, hi := math.Log10(s.Lo), math.Log10(s.Hi)
	if hi == lo {
		return s.Map
	}
	return func(v float64) float64 {
		if v <= 0 {
			return math.NaN()
		}
		return s.A + (math.Log10(v)-lo)/(hi-lo)*(s.B-s.A)
	}
}

// frac is the position of v along the domain, 0 at Lo and 1 at Hi.
func (s Scale) frac(v float64) float64 {
	lo, hi := s.Lo, s.Hi
	if s.Log {
		if v <= 0 || lo <= 0 || hi <= 0 {
			return math.NaN()
		}
		v, lo, hi = math.Log10(v), math.Log10(lo), math.Log10(hi)
	}
	if hi == lo {
		return 0.5
	}
	return (v - lo) / (hi - lo)
}

// Invert returns the data value at pixel position px; it is the inverse of
// Map when Lo ≠ Hi and A ≠ B.
func (s Scale) Invert(px float64) float64 {
	if s.B == s.A {
		return s.Lo
	}
	t := (px - s.A) / (s.B - s.A)
	if s.Log {
		lo, hi := math.Log10(s.Lo), math.Log10(s.Hi)
		return math.Pow(10, lo+t*(hi-lo))
	}
	return s.Lo + t*(s.Hi-s.Lo)
}

// Contains reports whether v lies in the domain (bounds included, with a
// relative tolerance of 1e-9 of the span).
func (s Scale) Contains(v float64) bool {
	t := s.frac(v)
	return t >= -1e-9 && t <= 1+1e-9
}
