package form

import (
	"math"

	"porelight/solver"
)

// Stage kinds (StageKind): a pressure, a fill, an excavation, a lowered
// water table.
const (
	KindPressure = "q"
	KindFill     = "fill"
	KindDig      = "dig"
	KindLower    = "lower"
)

// StageKind says what a stage is.
func StageKind(l solver.Load) string {
	switch {
	case l.Dig != nil:
		return KindDig
	case l.Lower != nil:
		return KindLower
	case l.Fill != nil:
		return KindFill
	}
	return KindPressure
}

// SetStageKind turns stage i into kind. An excavation starts 1 m deep
// (flooded to the water table), a lowering 1 m below the water table (or
// the top); they drop the stage's pressure, fill, area and profile, which
// they cannot go with. Turning one back into a pressure or fill starts
// from zero.
func (f *Form) SetStageKind(i int, kind string) {
	if i < 0 || i >= len(f.draft.Loads) || StageKind(f.draft.Loads[i]) == kind {
		return
	}
	l := &f.draft.Loads[i]
	at := solver.IndexPath("loads", i)
	if l.Dig != nil || l.Lower != nil {
		l.Dig, l.Lower = nil, nil
		f.dropRaw(solver.JoinPath(at, "dig"))
		f.dropRaw(solver.JoinPath(at, "lower"))
	}
	switch kind {
	case KindDig, KindLower:
		l.Q, l.Fill, l.Area, l.Profile = 0, nil, nil, nil
		for _, leaf := range []string{"q", "fill", "area", "profile"} {
			f.dropRaw(solver.JoinPath(at, leaf))
		}
		if kind == KindDig {
			l.Dig = &solver.Dig{Depth: 1}
		} else {
			l.Lower = &solver.Lowering{WaterTable: math.Max(f.draft.WaterTable, 0) + 1}
		}
		f.check()
	case KindFill:
		f.SetFill(i, true)
	default:
		f.SetFill(i, false)
		f.check()
	}
}

// SetOutlet marks layer i as draining to an outlet (on; its head
// hydrostatic until one is typed) or not.
func (f *Form) SetOutlet(i int, on bool) {
	if i < 0 || i >= len(f.draft.Layers) {
		return
	}
	l := &f.draft.Layers[i]
	if on == (l.Outlet != nil) {
		return
	}
	if on {
		l.Outlet = &solver.Outlet{}
	} else {
		l.Outlet = nil
		f.dropRaw(solver.JoinPath(solver.IndexPath("layers", i), "outlet"))
	}
	f.check()
}

// DefaultResistance is the resistance an end gets when it is made leaky,
// days (about a metre of clay of 1e-9 m/s is 1.2·10⁴ days; the user types
// the real one).
const DefaultResistance = 100

// SetDrainage sets how an end drains: "drained", "leaky" (drained
// through a resistance) or "undrained". A leaky end keeps its head and
// drops its pressure history, which needs a free end.
func (f *Form) SetDrainage(end, how string) {
	b := Boundary(&f.draft, end)
	switch how {
	case "undrained":
		b.Resistance = 0
		f.dropRaw(end + ".resistance")
		f.SetBool(end+".drained", false)
		return
	case "leaky":
		f.SetBool(end+".drained", true)
		if b.Resistance == 0 {
			b.Resistance = DefaultResistance
		}
		b.Excess = nil
		f.dropRaw(end + ".excess")
	default:
		f.SetBool(end+".drained", true)
		b.Resistance = 0
		f.dropRaw(end + ".resistance")
	}
	f.check()
}

// Drainage says how an end drains (see SetDrainage).
func Drainage(b *solver.Boundary) string {
	switch {
	case !b.Drained:
		return "undrained"
	case b.Resistance > 0:
		return "leaky"
	}
	return "drained"
}
