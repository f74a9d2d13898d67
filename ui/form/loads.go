package form

import (
	"reflect"
	"slices"

	"porelight/solver"
)

// Load stages: what a stage is (a pressure or a fill), over what area,
// and the depth profiles typed as tables.

// Area kinds offered for a stage besides solver's shapes: the whole top
// (no area, one-dimensional) and a typed profile of Δσ/q.
const (
	AreaWhole   = ""        // infinite in plan: Δσ = q at every depth
	AreaProfile = "profile" // a typed table of Δσ/q against depth
)

// defaultFillGamma is the unit weight a stage gets when it is turned into
// a fill, kN/m³ (a common compacted fill; the user types the real one).
const defaultFillGamma = 20

// SetFill turns stage i into a fill (on) of the same pressure, or a fill
// into a pressure stage of its pressure. An embankment needs a fill, so
// a pressure stage over an embankment becomes a strip of its mean width
// (crest + slope × height), which carries the same load.
func (f *Form) SetFill(i int, on bool) {
	if i < 0 || i >= len(f.draft.Loads) {
		return
	}
	l := &f.draft.Loads[i]
	at := solver.IndexPath("loads", i)
	if on == (l.Fill != nil) {
		return
	}
	if on {
		l.Fill = &solver.Fill{Thickness: l.Q / defaultFillGamma, Gamma: defaultFillGamma}
		if l.Q == 0 {
			l.Fill.Thickness = 1
		}
		l.Q = 0
		f.dropRaw(solver.JoinPath(at, "q"))
	} else {
		if a := l.Area; a != nil && a.Shape == "embankment" {
			a.Shape, a.Width, a.Slope = "strip", a.Width+a.Slope*l.Fill.Thickness, 0
			f.dropRaw(solver.JoinPath(at, "area"))
		}
		l.Q = l.Pressure()
		l.Fill = nil
		f.dropRaw(solver.JoinPath(at, "fill"))
	}
	f.check()
}

// SetArea sets the loaded area of stage i: AreaWhole, AreaProfile, or one
// of solver's shapes ("strip", "rectangle", "circle", "embankment") with
// sizes to start from (what was typed for another shape is kept where the
// size means the same). An embankment turns the stage into a fill.
func (f *Form) SetArea(i int, kind string) {
	if i < 0 || i >= len(f.draft.Loads) {
		return
	}
	l := &f.draft.Loads[i]
	at := solver.IndexPath("loads", i)
	if kind != AreaProfile {
		if l.Profile != nil {
			l.Profile = nil
			f.dropRaw(solver.JoinPath(at, "profile"))
		}
	}
	switch kind {
	case AreaWhole:
		l.Area = nil
		f.dropRaw(solver.JoinPath(at, "area"))
	case AreaProfile:
		l.Area = nil
		f.dropRaw(solver.JoinPath(at, "area"))
		if len(l.Profile) == 0 {
			h := height(&f.draft)
			l.Profile = []solver.DepthValue{{Z: 0, Value: 1}, {Z: h, Value: 1}}
		}
	default:
		old := solver.Area{Width: 20, Length: 40, Radius: 10, Slope: 2}
		if l.Area != nil {
			old = *l.Area
		}
		a := &solver.Area{Shape: kind, Method: old.Method, X: old.X}
		width := old.Width
		if width == 0 {
			width = 20
		}
		switch kind {
		case "strip":
			a.Width = width
		case "rectangle":
			a.Width, a.Length, a.Y = width, old.Length, old.Y
			if a.Length == 0 {
				a.Length = 2 * width
			}
		case "circle":
			a.Radius, a.X = old.Radius, 0
			if a.Radius == 0 {
				a.Radius = width / 2
			}
		case "embankment":
			a.Width, a.Slope = width, old.Slope
			if a.Slope == 0 {
				a.Slope = 2
			}
		}
		l.Area = a
		f.dropRaw(solver.JoinPath(at, "area"))
		if kind == "embankment" && l.Fill == nil {
			f.SetFill(i, true)
		}
	}
	f.check()
}

// AreaKind is what SetArea last set for stage i: AreaWhole, AreaProfile
// or the area's shape.
func AreaKind(l solver.Load) string {
	switch {
	case l.Area != nil:
		return l.Area.Shape
	case len(l.Profile) > 0:
		return AreaProfile
	}
	return AreaWhole
}

// height is the column height of p from its valid thicknesses, m, or 10.
func height(p *solver.Project) float64 {
	h := 0.0
	for _, l := range p.Layers {
		if l.Thickness > 0 {
			h += l.Thickness
		}
	}
	if !(h > 0) {
		return 10
	}
	return h
}

// profileAt finds the depth profile at path ("loads[1].profile" or
// "initialExcess"), or nil when there is none.
func profileAt(p *solver.Project, path string) *[]solver.DepthValue {
	v, ok, err := locate(p, path, false)
	if err != nil || !ok || v.Type() != reflect.TypeFor[[]solver.DepthValue]() {
		return nil
	}
	return v.Addr().Interface().(*[]solver.DepthValue)
}

// AddPoint appends a point to the depth profile at path (a stage's
// profile or "initialExcess"): halfway between the last point and the
// base of the column, with the last point's value.
func (f *Form) AddPoint(path string) {
	pts := profileAt(&f.draft, path)
	if pts == nil {
		return
	}
	dv := solver.DepthValue{}
	if n := len(*pts); n > 0 {
		last := (*pts)[n-1]
		dv = solver.DepthValue{Z: last.Z + (height(&f.draft)-last.Z)/2, Value: last.Value}
		if !(dv.Z > last.Z) {
			dv.Z = last.Z + 1
		}
	}
	*pts = append(*pts, dv)
	f.check()
}

// RemovePoint deletes point k of the depth profile at path.
func (f *Form) RemovePoint(path string, k int) {
	pts := profileAt(&f.draft, path)
	if pts == nil || k < 0 || k >= len(*pts) {
		return
	}
	*pts = slices.Delete(*pts, k, k+1)
	if len(*pts) == 0 {
		*pts = nil
	}
	f.remap(path, Removed(k))
	f.check()
}
