package solver

import (
	"fmt"
	"math"
	"slices"

	"porelight/solver/load"
)

// Pressure is the stage's pressure change at the surface, kPa: Q, or the
// fill's Gamma × Thickness (before any submergence).
func (l Load) Pressure() float64 {
	if l.Fill != nil {
		return l.Fill.Gamma * l.Fill.Thickness
	}
	return l.Q
}

// Geometry is the stage's loaded area as package load sees it: load.Uniform
// without an Area; an embankment's side run is its slope times the fill's
// thickness. The project must be valid (Validate).
func (l Load) Geometry() load.Area {
	a := l.Area
	if a == nil {
		return load.Area{}
	}
	g := load.Area{Shape: load.Shape(a.Shape), Width: a.Width, Length: a.Length, Radius: a.Radius, X: a.X, Y: a.Y}
	if a.Method == MethodSpread21 {
		g.Method = load.Spread21
	}
	if g.Shape == load.Embankment && l.Fill != nil {
		g.Run = a.Slope * math.Abs(l.Fill.Thickness)
	}
	return g
}

// Factor is Δσ/q of the stage at depth z below the top: the influence
// factor of its Area, or its Profile (linear between points, constant
// beyond them), or 1. The project must be valid (Validate).
func (l Load) Factor(z float64) float64 {
	if l.Area != nil {
		return l.Geometry().Factor(z)
	}
	return profileAt(l.Profile, z, 1)
}

// The methods of Area.Method.
const (
	MethodElastic  = "elastic" // Boussinesq-based closed forms (also "")
	MethodSpread21 = "2:1"     // the 2:1 spread of common practice
)

// validArea checks the area of stage l at path at ("loads[i].area").
func validArea(ps *Problems, at string, l Load) {
	a := l.Area
	if len(l.Profile) > 0 {
		ps.Add(JoinPath(at, "shape"), ErrConflict, "give an area or a profile, not both")
	}
	if a.Method != "" && a.Method != MethodElastic && a.Method != MethodSpread21 {
		ps.Add(JoinPath(at, "method"), ErrOutOfRange, fmt.Sprintf("must be %q or %q, got %q", MethodElastic, MethodSpread21, a.Method))
	}
	within(ps, JoinPath(at, "x"), a.X, MaxAreaSize, "m")
	within(ps, JoinPath(at, "y"), a.Y, MaxAreaSize, "m")
	type size struct {
		name string
		v    float64
	}
	var need, none []size
	all := []size{{"width", a.Width}, {"length", a.Length}, {"radius", a.Radius}, {"slope", a.Slope}}
	pick := func(names ...string) {
		for _, s := range all {
			if slices.Contains(names, s.name) {
				need = append(need, s)
			} else {
				none = append(none, s)
			}
		}
	}
	switch load.Shape(a.Shape) {
	case load.Strip:
		pick("width")
	case load.Rectangle:
		pick("width", "length")
	case load.Circle:
		pick("radius")
		if a.X != 0 || a.Y != 0 {
			ps.Add(JoinPath(at, "x"), ErrConflict, "a circle takes the column on its axis only (x = y = 0)")
		}
	case load.Embankment:
		pick("slope")
		upTo(ps, JoinPath(at, "width"), a.Width, MaxAreaSize, "m")
		none = slices.DeleteFunc(none, func(s size) bool { return s.name == "width" })
		if l.Fill == nil {
			ps.Add(JoinPath(at, "shape"), ErrRequired, "an embankment needs a fill: its thickness is the embankment's height")
		}
	case "":
		ps.Add(JoinPath(at, "shape"), ErrRequired, `"strip", "rectangle", "circle" or "embankment"`)
		return
	default:
		ps.Add(JoinPath(at, "shape"), ErrOutOfRange, fmt.Sprintf(`must be "strip", "rectangle", "circle" or "embankment", got %q`, a.Shape))
		return
	}
	for _, s := range need {
		if s.name == "slope" {
			bounded(ps, JoinPath(at, s.name), s.v, MinSlope, MaxSlope, "")
		} else {
			bounded(ps, JoinPath(at, s.name), s.v, MinAreaSize, MaxAreaSize, "m")
		}
	}
	for _, s := range none {
		if s.v != 0 {
			ps.Add(JoinPath(at, s.name), ErrConflict, fmt.Sprintf("a %s has no %s", a.Shape, s.name))
		}
	}
	if a.Shape != string(load.Rectangle) && a.Y != 0 {
		ps.Add(JoinPath(at, "y"), ErrConflict, fmt.Sprintf("a %s has no length to place the column along", a.Shape))
	}
}

// validFill checks the fill of stage l at path at ("loads[i].fill").
func validFill(ps *Problems, at string, l Load, gw float64) {
	f := l.Fill
	if l.Q != 0 {
		ps.Add(JoinPath(at, "thickness"), ErrConflict, "give q or a fill, not both")
	}
	if within(ps, JoinPath(at, "thickness"), f.Thickness, MaxFillThickness, "m") && f.Thickness == 0 {
		ps.Add(JoinPath(at, "thickness"), ErrNotPositive, "a fill needs a thickness (negative removes fill)")
	}
	bounded(ps, JoinPath(at, "gamma"), f.Gamma, 0, MaxUnitWeight, "kN/m³")
	if f.GammaSat != 0 && bounded(ps, JoinPath(at, "gammaSat"), f.GammaSat, 0, MaxUnitWeight, "kN/m³") && f.GammaSat < gw {
		ps.Add(JoinPath(at, "gammaSat"), ErrOutOfRange, fmt.Sprintf("must be at least gammaW = %g (got %g)", gw, f.GammaSat))
	}
}

// submergence follows the fill that comes to lie below the water table as
// the ground settles. The water table stays at its initial depth zw below
// the original top of the column; the fill's base settles with the top,
// by s. The fill present at time t is the sum of the fill stages at their
// fractions, Hf(t) (removals subtract); its submerged thickness is
//
//	hs = clamp(s − zw, 0, Hf(t)),
//
// and each submerged metre weighs less by γ − γsat + γw (γw when the
// fill's γsat is its γ). The submerged thickness is taken from the fill
// stages in the order they were placed (by start), the first placed at
// the bottom, each spread with depth by its own influence factor. So the
// stress change of the column is
//
//	σ(z, t) = Σⱼ fⱼ(t) qⱼ Iⱼ(z) − Σⱼ (γⱼ − γsatⱼ + γw) hⱼ(s, t) Iⱼ(z).
//
// Soil above the water table that settles into it (zw > 0) is buoyed as
// well, by up to γw − (γsat − γ) per metre of that settlement; this
// treatment counts the fill only, and so slightly overestimates the
// settlement then. Under a finite area the weight lost spreads with the
// stage's factor, like the fill's weight.
//
// In the time loop s is the linear settlement ∫ mv (σ − u) dz at the end
// of the previous step (one step behind, cheap: one pass over the nodes
// per step); the final state solves s∞ = ∫ mv (σ∞(s∞) − u∞) dz exactly
// (bisection on a monotone function). For one layer with the water table
// at the top and a fill that is submerged as it settles, this is
// s = mv H (q − γw s), so s = mv H q / (1 + mv H γw).
type submergence struct {
	zw     float64
	order  []int       // fill stages with positive thickness, first placed first
	loss   []float64   // per entry of order: kPa lost per metre submerged
	factor [][]float64 // per entry of order: Iⱼ at the nodes
	fills  []int       // every fill stage (for Hf)
}

// newSubmergence prepares the submergence of the fill stages of p, with
// factor[i] the factor Iᵢ of stage i at the nodes (kept, not copied); nil
// when p has no fill.
func newSubmergence(p *Project, gw float64, factor [][]float64) *submergence {
	var sb submergence
	sb.zw = p.WaterTable
	for i, l := range p.Loads {
		if l.Fill == nil {
			continue
		}
		sb.fills = append(sb.fills, i)
		if l.Fill.Thickness > 0 {
			sb.order = append(sb.order, i)
		}
	}
	if len(sb.fills) == 0 {
		return nil
	}
	slices.SortStableFunc(sb.order, func(a, b int) int {
		switch sa, sb := p.Loads[a].Start, p.Loads[b].Start; {
		case sa < sb:
			return -1
		case sa > sb:
			return 1
		}
		return 0
	})
	for _, i := range sb.order {
		f := p.Loads[i].Fill
		gs := f.GammaSat
		if gs == 0 {
			gs = f.Gamma
		}
		sb.loss = append(sb.loss, f.Gamma-gs+gw)
		sb.factor = append(sb.factor, factor[i])
	}
	return &sb
}

// submerged is the submerged thickness hs of fill at time t after the
// top has settled by s, m.
func (sb *submergence) submerged(loads []Load, t float64, left bool, s float64) float64 {
	hf := 0.0
	for _, i := range sb.fills {
		hf += loads[i].fraction(t, left) * loads[i].Fill.Thickness
	}
	return math.Max(0, math.Min(s-sb.zw, hf))
}

// each calls fn with every stage's submerged part: its index in order and
// the weight it has lost, kPa (at the surface, before spreading).
func (sb *submergence) each(loads []Load, t float64, left bool, s float64, fn func(k int, lost float64)) {
	rest := sb.submerged(loads, t, left, s)
	for k, i := range sb.order {
		if rest <= 0 {
			return
		}
		take := math.Min(rest, loads[i].fraction(t, left)*loads[i].Fill.Thickness)
		if take > 0 {
			fn(k, sb.loss[k]*take)
		}
		rest -= take
	}
}

// apply subtracts the weight lost by submergence at time t, with the top
// settled by s, from the nodal stress change dst.
func (sb *submergence) apply(dst []float64, loads []Load, t float64, left bool, s float64) {
	sb.each(loads, t, left, s, func(k int, lost float64) {
		for j, f := range sb.factor[k] {
			dst[j] -= lost * f
		}
	})
}

// lost is the weight lost by submergence at the surface, kPa.
func (sb *submergence) lost(loads []Load, t float64, left bool, s float64) float64 {
	sum := 0.0
	sb.each(loads, t, left, s, func(_ int, lost float64) { sum += lost })
	return sum
}

// settleFinal solves the final state with submergence: the settlement s∞
// for which the final stress change, reduced by the fill submerged at s∞,
// gives back s∞ = settle(), the settlement of the soil model in use under
// sigInf (∫ mv (σ∞ − u∞) dz for the linear model, mvSettlement). It
// rewrites sigInf and returns s∞ and the submerged thickness. Without
// fill it returns zeros and leaves sigInf alone.
func (tr *transient) settleFinal(sigInf, uInf []float64, settle func() float64) (s, hs float64) {
	sb := tr.sub
	if sb == nil {
		return 0, 0
	}
	inf := math.Inf(1)
	g := func(s float64) float64 {
		tr.stressWith(sigInf, inf, false, s)
		return settle()
	}
	// g does not increase with s (more fill submerged, less load) and is
	// constant for s ≤ zw, so s − g(s) increases: bisect between zw and
	// g(zw).
	g0 := g(math.Min(sb.zw, 0))
	if g0 <= sb.zw {
		s = g0
	} else {
		lo, hi := sb.zw, g0
		for range 200 {
			mid := (lo + hi) / 2
			if mid-g(mid) < 0 {
				lo = mid
			} else {
				hi = mid
			}
			if hi-lo <= 1e-13*math.Max(1, math.Abs(hi)) {
				break
			}
		}
		s = (lo + hi) / 2
	}
	tr.stressWith(sigInf, inf, false, s)
	return s, sb.submerged(tr.c.p.Loads, inf, false, s)
}

// mvSettlement is ∫ mv (σ∞ − u∞) dz, m: the linear model's final
// settlement under sigInf. mv must be set (setMv).
func (tr *transient) mvSettlement(sigInf, uInf []float64) float64 {
	m := tr.c.m
	for i := range tr.tmp {
		tr.tmp[i] = sigInf[i] - uInf[i]
	}
	sum := 0.0
	for e := range m.Elements() {
		sum += tr.mv[m.Layer[e]] * m.Integrate(tr.tmp, e)
	}
	return sum
}

// stageFactors is Δσ/q of every load stage at the nodes, computed once
// per column (the closed forms cost a few atan each).
func (c *column) stageFactors() [][]float64 {
	if c.factors == nil {
		c.factors = make([][]float64, len(c.p.Loads))
		for i, l := range c.p.Loads {
			f := make([]float64, c.m.Nodes())
			for j, z := range c.m.Z {
				if w := l.Lower; w != nil {
					f[j] = lowerFactor(c.p, w.WaterTable, z)
					continue
				}
				f[j] = l.Factor(z)
			}
			c.factors[i] = f
		}
	}
	return c.factors
}

// stageStresses lists the stress change with depth of every stage at
// about stageDepths nodes (every k-th node and the base): the factors the
// solve used, not a second evaluation.
func (c *column) stageStresses() []StageStress {
	p := c.p
	if len(p.Loads) == 0 {
		return nil
	}
	n := c.m.Nodes()
	step := max(1, (n-1+stageDepths-2)/(stageDepths-1))
	var idx []int
	for j := 0; j < n-1; j += step {
		idx = append(idx, j)
	}
	idx = append(idx, n-1)
	depth := make([]float64, len(idx))
	for k, j := range idx {
		depth[k] = c.m.Z[j]
	}
	factors := c.stageFactors()
	out := make([]StageStress, len(p.Loads))
	for i := range p.Loads {
		f := make([]float64, len(idx))
		for k, j := range idx {
			f[k] = factors[i][j]
		}
		out[i] = StageStress{Q: StagePressure(p, i), Depth: depth, Factor: f}
	}
	return out
}

// stageDepths is about the number of depths at which
// Result.Consolidation.Stages gives each stage's factor: enough for a
// plot, few enough for any number of stages.
const stageDepths = 101

// loadWarnings warns about load stages whose loaded area is narrow against
// the column: the one-dimensional analysis then misplaces settlement.
func loadWarnings(p *Project, height float64, warn func(path, msg string)) {
	for i, l := range p.Loads {
		if l.Area == nil {
			continue
		}
		b := l.Geometry().Narrowest()
		if b < height {
			f := l.Factor(height)
			warn(JoinPath(IndexPath("loads", i), "area"), fmt.Sprintf("the loaded area (%.3g m across) is narrower than the column is deep (%.3g m): at the base the added stress is %.0f %% of q. Under a narrow load the ground also strains sideways, which this one-dimensional analysis ignores: settlement may be over- or underestimated and misplaced; check with a two- or three-dimensional analysis", b, height, 100*f))
		}
	}
}

// submerge makes the final state self-consistent with the fill that
// settles below the water table (see submergence).
func (k *consolidation) submerge() {
	if k.tr.sub == nil {
		return
	}
	_, hs := k.tr.settleFinal(k.sigInf, k.uInf, func() float64 { return k.tr.mvSettlement(k.sigInf, k.uInf) })
	k.r.Summary.Submerged = ptr(hs)
}

// ProfileAt evaluates a depth profile (Load.Profile, Project.InitialExcess)
// at depth z, m: linear between points, constant beyond the ends, and def
// everywhere when the profile is empty. The points must increase in z
// (Validate).
func ProfileAt(pts []DepthValue, z, def float64) float64 { return profileAt(pts, z, def) }
