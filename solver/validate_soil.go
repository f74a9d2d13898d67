package solver

import (
	"fmt"
	"math"
)

// validSoilModel checks the fields of layer i that the soil models read
// beyond mv and the e–log curve itself: the swelling mv, the permeability
// change index and the preconsolidation profile (one way of giving σ'p).
func validSoilModel(ps *Problems, i int, l Layer) {
	at := IndexPath("layers", i)
	if l.MvUnload != 0 {
		bounded(ps, JoinPath(at, "mvUnload"), l.MvUnload, MinMv, MaxMv, "1/kPa")
	}
	if l.CalphaCc != 0 {
		p := JoinPath(at, "calphaCc")
		upTo(ps, p, l.CalphaCc, MaxCalphaCc, "")
		if l.Calpha != 0 {
			ps.Add(p, ErrConflict, "give calpha or calphaCc, not both")
		}
		if l.ECurve == nil {
			ps.Add(p, ErrConflict, "calphaCc needs an ecurve (its cc and e0)")
		}
	}
	if l.CalphaReduced != 0 {
		p := JoinPath(at, "calphaReduced")
		upTo(ps, p, l.CalphaReduced, MaxCalpha, "")
		if l.ECurve == nil {
			ps.Add(p, ErrConflict, "secondary compression needs ecurve.e0")
		}
	}
	c := l.ECurve
	if c == nil {
		return
	}
	ec := JoinPath(at, "ecurve")
	if c.Ck != 0 {
		bounded(ps, JoinPath(ec, "ck"), c.Ck, MinCk, MaxCk, "")
	}
	if c.POP != 0 {
		upTo(ps, JoinPath(ec, "pop"), c.POP, MaxStress, "kPa")
	}
	prof := JoinPath(ec, "sigmaPProfile")
	validProfile(ps, prof, c.SigmaPProfile, MaxStress, "kPa")
	for j, dv := range c.SigmaPProfile {
		if dv.Value <= 0 && !math.IsNaN(dv.Value) {
			positive(ps, JoinPath(IndexPath(prof, j), "value"), dv.Value)
		}
	}
	// The ways of giving σ'p exclude each other; the first given wins the
	// message, the later ones are named.
	given := []struct {
		name string
		set  bool
	}{{"sigmaP", c.SigmaP != 0}, {"ocr", c.OCR != 0}, {"pop", c.POP != 0}, {"sigmaPProfile", len(c.SigmaPProfile) > 0}}
	first := ""
	for _, g := range given {
		if !g.set {
			continue
		}
		if first == "" {
			first = g.name
			continue
		}
		if first == "sigmaP" && g.name == "ocr" {
			continue // reported by Validate since the first format
		}
		ps.Add(JoinPath(ec, g.name), ErrConflict, fmt.Sprintf("give one of sigmaP, ocr, pop and sigmaPProfile (%s is given too)", first))
	}
}
