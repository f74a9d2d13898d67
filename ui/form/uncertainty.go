package form

import "porelight/solver"

// Starting coefficients of variation when the uncertainty section is
// switched on: inside the ranges Duncan (2000, Table 1) lists for
// saturated clay, recalled from memory and offered as hints only — k
// about 68–90 %, cv 33–68 %, Cc 10–37 %. The engineer replaces them with
// values for the site.
const (
	StartCOVK  = 0.7
	StartCOVMv = 0.25
	StartCOVCh = 0.5
	StartSeed  = 1
)

// SetUncertainty switches the project's Uncertainty on (one entry per
// layer, the starting COVs, seed StartSeed) or off (its typed text is
// dropped).
func (f *Form) SetUncertainty(on bool) {
	switch {
	case on && f.draft.Uncertainty == nil:
		u := &solver.Uncertainty{Seed: StartSeed}
		for range f.draft.Layers {
			u.Layers = append(u.Layers, solver.LayerSpread{K: StartCOVK, Mv: StartCOVMv, Ch: StartCOVCh})
		}
		f.draft.Uncertainty = u
	case !on && f.draft.Uncertainty != nil:
		f.draft.Uncertainty = nil
		f.dropRaw("uncertainty")
	}
	f.check()
}

// remapUncertainty moves each layer's spread (and its typed text) with
// its layer after a structural edit of the layers; a new layer gets
// none.
func (f *Form) remapUncertainty(to func(old int) int) {
	u := f.draft.Uncertainty
	if u == nil {
		return
	}
	u.Layers = moved(u.Layers, len(f.draft.Layers), to)
	f.remap("uncertainty.layers", to)
}
