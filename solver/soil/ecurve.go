package soil

import "math"

// MinEffective is the floor on effective stress in the e–log σ′ model,
// kPa: the logarithm needs σ′ > 0.
const MinEffective = 0.1

// Curve holds the parameters of the e–log σ′ compression model.
type Curve struct {
	E0 float64 // initial void ratio, > 0
	Cc float64 // compression index (virgin line), > 0
	Cr float64 // recompression and swelling index, 0 ≤ Cr ≤ Cc
}

// Compress returns the compression (decrease of void ratio, negative for
// swelling) when the effective stress moves from σ′a to σ′b on the curve
// c, given the largest effective stress the soil has carried, and that
// stress afterwards (Terzaghi & Peck 1967):
//
//   - loading below the largest past stress follows Cr;
//   - loading beyond it follows Cc (the virgin line);
//   - unloading follows Cr.
//
// Special cases are: σ′a = σ′b gives 0; stresses below MinEffective are
// raised to it.
func Compress(c Curve, from, to, peak float64) (de, newPeak float64) {
	from, to = math.Max(from, MinEffective), math.Max(to, MinEffective)
	peak = math.Max(peak, from)
	if to <= from {
		return -c.Cr * math.Log10(from/to), peak
	}
	if to <= peak {
		return c.Cr * math.Log10(to/from), peak
	}
	return c.Cr*math.Log10(peak/from) + c.Cc*math.Log10(to/peak), to
}

// Preconsolidation returns the largest past effective stress of a point at
// in-situ effective stress s0: sigmaP when given (> 0), else ocr·s0 when
// ocr > 0, else s0 (normally consolidated). A sigmaP below s0 is raised to
// s0 (the caller reports it).
func Preconsolidation(sigmaP, ocr, s0 float64) float64 {
	switch {
	case sigmaP > 0:
		return math.Max(sigmaP, s0)
	case ocr > 0:
		return ocr * s0
	}
	return s0
}

// TangentMv is the coefficient of volume compressibility of the curve at
// effective stress s, 1/kPa: the virgin slope Cc/(ln10 (1+e0) s) for a
// normally consolidated point (peak ≤ s), the recompression slope with Cr
// below the peak (when Cr > 0).
func TangentMv(c Curve, s, peak float64) float64 {
	idx := c.Cc
	if peak > s*1.0001 && c.Cr > 0 {
		idx = c.Cr
	}
	return idx / (math.Ln10 * (1 + c.E0) * s)
}

// Point is the e–log σ′ state of one sublayer (an element of the mesh),
// evaluated at its centre. Its current and largest stresses are kept as
// base-10 logarithms too, so that following the curve costs one logarithm
// per move.
type Point struct {
	Curve Curve
	H     float64 // thickness, m
	S0    float64 // in-situ effective stress, kPa

	sig, peak float64 // current effective stress and largest so far
	de        float64 // compression so far (Δe, positive down)
	lsig      float64 // log10(max(sig, MinEffective))
	lpeak     float64 // log10(max(peak, sig, MinEffective))
	started   bool    // lsig and lpeak are set
}

// NewPoint returns a sublayer of thickness h on curve c at in-situ
// effective stress s0 whose largest past stress is peak.
func NewPoint(c Curve, h, s0, peak float64) Point {
	return Point{Curve: c, H: h, S0: s0, sig: s0, peak: peak}
}

// Stress is the current effective stress, kPa; Peak the largest so far.
func (s *Point) Stress() float64 { return s.sig }

// Peak is the largest effective stress the point has carried, kPa.
func (s *Point) Peak() float64 { return max(s.peak, s.sig) }

// Beyond reports whether to lies beyond the largest effective stress the
// point has carried, to > Peak(), by comparisons: js/wasm calls max out of
// line, and the non-linear model asks this of every element at every
// iteration.
func (s *Point) Beyond(to float64) bool { return to > s.peak && to > s.sig }

// Settlement is this sublayer's settlement so far, m.
func (s *Point) Settlement() float64 { return s.de / (1 + s.Curve.E0) * s.H }

// start sets the logarithms of the stresses on first use. It is the
// test alone, small enough to be inlined; begin does the work.
func (s *Point) start() {
	if !s.started {
		s.begin()
	}
}

func (s *Point) begin() {
	s.lsig = math.Log10(max(s.sig, MinEffective))
	s.lpeak = max(math.Log10(max(s.peak, MinEffective)), s.lsig)
	s.started = true
}

// log10Of is log10(to) for to ≥ MinEffective, from the logarithm of the
// present stress when to is within 1 % of it.
func (s *Point) log10Of(to float64) float64 {
	if d := to - s.sig; d > -1e-2*s.sig && d < 1e-2*s.sig && s.sig >= MinEffective {
		// Most moves of the time loop: ln(to/σ) = 2 atanh(x) with
		// x = (to − σ)/(to + σ), |x| < 0.005, by its series
		// 2(x + x³/3 + x⁵/5 + x⁷/7), whose remainder is below x⁸/9 < 5e-20
		// of the sum: exact to rounding, at one division.
		x := d / (to + s.sig)
		x2 := x * x
		return s.lsig + 2*x*(1+x2*(1.0/3+x2*(1.0/5+x2*(1.0/7))))/math.Ln10
	}
	return math.Log10(to)
}

// Toward returns the compression (Δe, negative for swelling) that moving
// to effective stress to would add, without moving: what MoveTo would add
// to the settlement's Δe. One logarithm at most.
func (s *Point) Toward(to float64) float64 {
	s.start()
	to = max(to, MinEffective)
	if to == s.sig {
		return 0
	}
	return s.along(s.log10Of(to))
}

// along is the compression from the present state to the stress whose
// base-10 logarithm is lto: Cr up to the largest past stress, Cc beyond.
func (s *Point) along(lto float64) float64 {
	c := s.Curve
	switch {
	case lto <= s.lsig:
		return -c.Cr * (s.lsig - lto)
	case lto <= s.lpeak:
		return c.Cr * (lto - s.lsig)
	}
	return c.Cr*(s.lpeak-s.lsig) + c.Cc*(lto-s.lpeak)
}

// MoveTo follows the curve to effective stress to; it matches Compress
// (tested) with the logarithms of the stresses carried along. It returns
// the compression the move added, what Toward would have returned, so
// that a caller needing both pays one logarithm.
func (s *Point) MoveTo(to float64) float64 {
	s.start()
	to = max(to, MinEffective)
	if to == s.sig {
		return 0
	}
	lto := s.log10Of(to)
	de := s.along(lto)
	s.de += de
	if lto > s.lpeak {
		s.lpeak, s.peak = lto, to
	}
	s.sig, s.lsig = to, lto
	return de
}

// Secondary is the secondary compression of a layer of thickness h (Mesri
// 1973): Cα h/(1+ep) log10(t/tp) for t > tp, 0 otherwise; ep is the void
// ratio at the end of primary consolidation and tp its time.
func Secondary(calpha, h, ep, t, tp float64) float64 {
	if t <= tp || tp <= 0 {
		return 0
	}
	return calpha * h / (1 + ep) * math.Log10(t/tp)
}
