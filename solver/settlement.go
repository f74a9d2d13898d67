package solver

import "math"

// minEffective is the floor on effective stress in the e–log σ' model,
// kPa: the logarithm needs σ' > 0.
const minEffective = 0.1

// compress returns the compression (decrease of void ratio, negative for
// swelling) when the effective stress moves from σ'a to σ'b on the e–log σ'
// curve c, given the largest effective stress the soil has carried, and
// that stress afterwards (Terzaghi & Peck 1967):
//
//   - loading below the largest past stress follows Cr;
//   - loading beyond it follows Cc (the virgin line);
//   - unloading follows Cr.
//
// Special cases are: σ'a = σ'b gives 0; stresses below minEffective are
// raised to it.
func compress(c *ECurve, from, to, peak float64) (de, newPeak float64) {
	from, to = math.Max(from, minEffective), math.Max(to, minEffective)
	peak = math.Max(peak, from)
	if to <= from {
		return -c.Cr * math.Log10(from/to), peak
	}
	if to <= peak {
		return c.Cr * math.Log10(to/from), peak
	}
	return c.Cr*math.Log10(peak/from) + c.Cc*math.Log10(to/peak), to
}

// preconsolidation returns the largest past effective stress of a point of
// a layer with curve c at in-situ effective stress s0: σ'p when given, else
// OCR·σ'0, else σ'0 (normally consolidated). A σ'p below σ'0 is raised to
// σ'0 (reported by the caller).
func preconsolidation(c *ECurve, s0 float64) float64 {
	switch {
	case c.SigmaP > 0:
		return math.Max(c.SigmaP, s0)
	case c.OCR > 0:
		return c.OCR * s0
	}
	return s0
}

// sublayer is the e–log σ' state of one element, evaluated at its centre.
// Its current and largest stresses are also kept as base-10 logarithms,
// so that following the curve costs one logarithm per step.
type sublayer struct {
	curve     *ECurve
	z, h      float64 // centre depth and thickness, m
	s0        float64 // in-situ effective stress, kPa
	sig, peak float64 // current effective stress and largest so far
	de        float64 // compression so far (Δe, positive down)
	lsig      float64 // log10(max(sig, minEffective))
	lpeak     float64 // log10(max(peak, sig, minEffective))
	started   bool    // lsig and lpeak are set
}

// settlement is this sublayer's settlement so far, m.
func (s *sublayer) settlement() float64 { return s.de / (1 + s.curve.E0) * s.h }

// moveTo follows the curve to effective stress to; it matches compress
// (tested) with the logarithms of the stresses carried along.
func (s *sublayer) moveTo(to float64) {
	if !s.started {
		s.lsig = math.Log10(max(s.sig, minEffective))
		s.lpeak = max(math.Log10(max(s.peak, minEffective)), s.lsig)
		s.started = true
	}
	to = max(to, minEffective)
	if to == s.sig {
		return
	}
	var lto float64
	if d := (to - s.sig) / s.sig; d > -1e-4 && d < 1e-4 {
		// Small steps (most of them, late in consolidation): the series
		// log10(1+d) = (d − d²/2 + d³/3)/ln 10 is exact to 1e-17 here.
		lto = s.lsig + d*(1-d*(0.5-d/3))/math.Ln10
	} else {
		lto = math.Log10(to)
	}
	c := s.curve
	switch {
	case lto <= s.lsig:
		s.de -= c.Cr * (s.lsig - lto)
	case lto <= s.lpeak:
		s.de += c.Cr * (lto - s.lsig)
	default:
		s.de += c.Cr*(s.lpeak-s.lsig) + c.Cc*(lto-s.lpeak)
		s.lpeak = lto
		s.peak = to
	}
	s.sig, s.lsig = to, lto
}

// secondary is the secondary compression of a layer (Mesri 1973):
// Cα H/(1+ep) log10(t/tp) for t > tp, 0 otherwise.
func secondary(calpha, h, ep, t, tp float64) float64 {
	if t <= tp || tp <= 0 {
		return 0
	}
	return calpha * h / (1 + ep) * math.Log10(t/tp)
}
