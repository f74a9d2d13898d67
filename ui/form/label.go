package form

import (
	"strconv"
	"strings"

	"porelight/solver"
)

// Label names the input at a field path for people, with rows numbered
// from 1 as the page's tables number them: "layers[1].mv" → "layer 2, mv",
// "monitoring.plates[0].readings[3].t" → "plate 1, reading 4, time",
// "loads[2].fill.thickness" → "stage 3, fill thickness", "times[2]" →
// "output time 3". A text that is not
// a field path comes back as it is; "" is "the project".
func Label(path string) string {
	if path == "" {
		return "the project"
	}
	steps, err := solver.ParsePath(path)
	if err != nil {
		return path
	}
	var parts []string
	var words []string // the names since the last numbered row
	flush := func() {
		if len(words) > 0 {
			parts = append(parts, strings.Join(words, " "))
			words = nil
		}
	}
	for k, st := range steps {
		if st.Index >= 0 {
			flush()
			noun, ok := rowNouns[st.Name]
			if !ok {
				noun = fieldWord(st.Name, false)
			}
			if k == 0 && isList(st.Name) {
				noun = strings.TrimSuffix(fieldWord(st.Name, false), "s")
			}
			parts = append(parts, noun+" "+strconv.Itoa(st.Index+1))
			continue
		}
		if st.Name == "monitoring" && k < len(steps)-1 {
			continue // "plate 1" says enough
		}
		if w := fieldWord(st.Name, k == len(steps)-1); w != "" {
			words = append(words, w)
		}
	}
	flush()
	if len(parts) == 0 {
		return path
	}
	return strings.Join(parts, ", ")
}

// rowNouns name the rows of the lists the page shows as tables.
var rowNouns = map[string]string{
	"layers":        "layer",
	"loads":         "stage",
	"plates":        "plate",
	"piezometers":   "piezometer",
	"readings":      "reading",
	"excess":        "pressure row",
	"profile":       "profile row",
	"sigmaPProfile": "σ′p row",
	"initialExcess": "initial excess row",
}

// fieldWords are the names the page's column heads and labels give
// fields whose JSON name is not already the usual symbol.
var fieldWords = map[string]string{
	"gammaSat": "γsat", "gamma": "γ moist", "gammaW": "γw", "sigmaP": "σ′p",
	"ecurve": "", "e0": "e0", "cc": "Cc", "cr": "Cr", "ocr": "OCR", "pop": "POP", "ck": "Ck",
	"calpha": "Cα", "calphaCc": "Cα/Cc", "calphaReduced": "Cα after unloading", "mvUnload": "mv unloading",
	"waterTable": "water table", "targetDegree": "target degree", "designLife": "design life",
	"top": "top", "bottom": "base", "t": "time", "z": "depth", "q": "q", "khKv": "kh/kv",
	"maxSize": "largest element", "minPerLayer": "elements per layer", "firstStep": "first step",
	"dampedSteps": "damped steps", "endTime": "end time", "smearRatio": "smear ratio", "smearK": "smear k",
	"piezometers": "piezometer depths", "times": "output times",
}

func fieldWord(name string, leaf bool) string {
	if w, ok := fieldWords[name]; ok {
		if w == "" && leaf {
			return name
		}
		return w
	}
	return name
}
