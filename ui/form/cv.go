package form

import (
	"strconv"
	"strings"

	"porelight/solver"
	"porelight/solver/soil"
	"porelight/ui/units"
)

// A layer's cv, typed instead of its k. A lab test gives cv and mv; the
// solver takes k and mv. The input layers[i].cv shows the cv the layer's
// k, mv and γw give; a cv typed into it is held: the layer's k becomes
// cv·mv·γw and follows mv and γw while the text stays (the input keeps
// the text as typed, the k input shows the k derived). Typing a k, or
// clearing the cv, lets k stand on its own again. The file holds k only.

// cvLeaf is the last step of the path of a layer's cv input.
const cvLeaf = "cv"

// cvLayer is the layer whose cv input path is, or -1.
func cvLayer(path string) int {
	if i, leaf, ok := layerLeaf(path); ok && leaf == cvLeaf {
		return i
	}
	return -1
}

// CvPath is the path of the cv input of layer i.
func CvPath(i int) string { return "layers[" + strconv.Itoa(i) + "]." + cvLeaf }

// cvText is what the cv input of layer i shows when no cv is held: the
// cv of the draft's k, mv and γw in m²/yr (or the units shown), to three
// significant figures, or "" where mv comes from the e–log parameters.
func (f *Form) cvText(i int) string {
	if i >= len(f.draft.Layers) {
		return ""
	}
	// Only from valid inputs: while k, mv or γw has a problem the draft
	// may still hold an older value.
	at := "layers[" + strconv.Itoa(i) + "]."
	if f.Problem(at+"k") != "" || f.Problem(at+"mv") != "" || f.Problem("gammaW") != "" {
		return ""
	}
	l := f.draft.Layers[i]
	gw := solver.ResolveGammaW(&f.draft)
	if l.K <= 0 || l.Mv <= 0 || gw <= 0 {
		return ""
	}
	cv := soil.Cv(l.K, l.Mv, gw) * solver.DaysPerYear // m²/day → m²/yr
	return FormatSig(f.sys.Show(units.Consolidation, cv), 3)
}

// applyCv takes the text typed into the cv input of layer i.
func (f *Form) applyCv(i int, s string) (problem string) {
	if i >= len(f.draft.Layers) {
		return "no such layer"
	}
	if s == "" {
		delete(f.raw, CvPath(i)) // k stands on its own again
		return ""
	}
	x, msg := ParseNumber(s, false)
	if msg != "" {
		return msg
	}
	if x <= 0 {
		return "must be positive"
	}
	return f.kFromCv(i, x)
}

// kFromCv sets the k of layer i from a cv in the units shown.
func (f *Form) kFromCv(i int, shown float64) (problem string) {
	l := &f.draft.Layers[i]
	gw := solver.ResolveGammaW(&f.draft)
	if l.Mv <= 0 {
		return "needs the layer's mv: k = cv·mv·γw"
	}
	if gw <= 0 {
		return "needs γw: k = cv·mv·γw"
	}
	cv := f.sys.Take(units.Consolidation, shown) / solver.DaysPerYear // m²/day
	l.K = RoundSig(cv*l.Mv*gw/soil.SecondsPerDay, 6)
	k := "layers[" + strconv.Itoa(i) + "].k"
	delete(f.raw, k)
	delete(f.bad, k)
	return ""
}

// followCv makes each layer with a cv held take its k from it again,
// after mv or γw changed.
func (f *Form) followCv() {
	for i := range f.draft.Layers {
		p := CvPath(i)
		s, held := f.raw[p]
		if !held {
			continue
		}
		x, msg := ParseNumber(s, false)
		if msg != "" || x <= 0 {
			continue // its own problem stays
		}
		if msg := f.kFromCv(i, x); msg != "" {
			f.bad[p] = msg
		} else {
			delete(f.bad, p)
		}
	}
}

// layerK reports the layer whose k input path is.
func layerK(path string) (int, bool) {
	i, leaf, ok := layerLeaf(path)
	return i, ok && leaf == "k"
}

// layerLeaf splits "layers[2].k" into 2 and "k".
func layerLeaf(path string) (i int, leaf string, ok bool) {
	rest, ok := strings.CutPrefix(path, "layers[")
	if !ok {
		return 0, "", false
	}
	n, leaf, ok := strings.Cut(rest, "].")
	if !ok {
		return 0, "", false
	}
	i, err := strconv.Atoi(n)
	return i, leaf, err == nil && i >= 0
}
