package form

import "porelight/solver"

// Used is what an empty input at path stands for, as a printout states
// it: the number the solver uses when it can be worked out from the
// draft (= γsat → the layer's γsat; H/40 → the element size; hydrostatic
// → the head), else the placeholder's words ("none", "k fixed"). It is ""
// when the input holds text or has no placeholder.
func (f *Form) Used(path string) string {
	hint, ok := f.Placeholder(path)
	if !ok || f.Text(path) != "" {
		return ""
	}
	p := &f.draft
	num := func(v float64, unit string) string {
		if v <= 0 {
			return hint
		}
		return f.shownText(path, v) + unit
	}
	switch path {
	case "mesh.maxSize":
		return num(solver.ResolveMesh(p).MaxSize, "")
	case "stepping.endTime":
		return num(solver.EndTime(p), "")
	case "top.head", "bottom.head":
		return f.shownText(path, -p.WaterTable)
	}
	if steps, err := solver.ParsePath(path); err == nil && len(steps) == 2 && steps[0].Name == "layers" &&
		steps[0].Index >= 0 && steps[0].Index < len(p.Layers) {
		l := p.Layers[steps[0].Index]
		switch steps[1].Name {
		case "gamma":
			return num(l.GammaSat, "")
		case "mvUnload":
			return num(l.Mv, "")
		case "calphaReduced":
			if l.Calpha > 0 {
				return FormatNumber(l.Calpha) // a ratio: the same in every system
			}
		}
	}
	return hint
}
