package solver

import (
	"fmt"

	"porelight/solver/soil"
)

// PreconsolidationAt is the preconsolidation stress σ'p of the curve c
// at depth z (m below the top), where the in-situ effective stress is s0,
// kPa: from c.SigmaPProfile (linear between points, constant beyond), or
// s0 + c.POP, or c.SigmaP, or c.OCR·s0, or s0 (normally consolidated), in
// that order of precedence (Validate allows only one of them); never
// below s0, which is raised to soil.MinEffective first. The solver uses
// it for every element; the page draws it.
func PreconsolidationAt(c *ECurve, z, s0 float64) float64 {
	s0 = max(s0, soil.MinEffective)
	switch {
	case len(c.SigmaPProfile) > 0:
		return soil.Preconsolidation(profileAt(c.SigmaPProfile, z, 0), 0, s0)
	case c.POP > 0:
		return soil.Preconsolidation(s0+c.POP, 0, s0)
	}
	return soil.Preconsolidation(c.SigmaP, c.OCR, s0)
}

// lowSigmaP is the preconsolidation stress, kPa, below which an OCR near
// the surface is taken for a sign that POP describes the crust better: a
// few kPa of σ'p cannot carry what a desiccated or loaded crust carries.
const lowSigmaP = 5

// preconsolidationWarner reports, once per layer, a σ'p that lies below
// the in-situ effective stress (taken as normally consolidated there) and
// an OCR that leaves less than lowSigmaP of σ'p near the surface.
type preconsolidationWarner struct {
	warn    func(path, msg string)
	below   map[int]bool
	shallow map[int]bool
}

func (w *preconsolidationWarner) check(li int, ec *ECurve, z, s0 float64) {
	at := JoinPath(IndexPath("layers", li), "ecurve")
	if w.below == nil {
		w.below, w.shallow = map[int]bool{}, map[int]bool{}
	}
	given := ec.SigmaP
	field := "sigmaP"
	if len(ec.SigmaPProfile) > 0 {
		given, field = profileAt(ec.SigmaPProfile, z, 0), "sigmaPProfile"
	}
	if given > 0 && given < s0 && !w.below[li] {
		w.below[li] = true
		w.warn(JoinPath(at, field), fmt.Sprintf("σ'p = %.3g kPa is below the in-situ effective stress (%.3g kPa at %.3g m); taken as normally consolidated there", given, s0, z))
	}
	if ec.OCR > 1 && ec.OCR*s0 < lowSigmaP && !w.shallow[li] {
		w.shallow[li] = true
		w.warn(JoinPath(at, "ocr"), fmt.Sprintf("OCR %g gives σ'p = %.2g kPa at %.3g m, where σ'0 = %.2g kPa: a crust is usually described better by a pre-overburden pressure (pop), σ'p = σ'0 + POP", ec.OCR, ec.OCR*s0, z, s0))
	}
}
