package load

import (
	"errors"
	"math"
)

// Shape names the plan shape of a loaded area, as in the project file.
type Shape string

// The shapes of a loaded area.
const (
	Uniform    Shape = ""           // infinite in plan: factor 1 at every depth
	Strip      Shape = "strip"      // infinitely long, Width across
	Rectangle  Shape = "rectangle"  // Width × Length
	Circle     Shape = "circle"     // Radius
	Embankment Shape = "embankment" // symmetric trapezoid: Width at the crest, Run of each side slope
)

// Method names how the stress spreads with depth.
type Method string

// The methods of stress spread.
const (
	Elastic  Method = ""    // Boussinesq-based closed forms (the default)
	Spread21 Method = "2:1" // the 2:1 spread of common practice
)

// Area is one loaded area and where the column stands under it. Only the
// sizes its Shape uses are read.
type Area struct {
	Shape  Shape
	Method Method
	// Width is the width B of a strip or a rectangle, or the crest width
	// of an embankment (≥ 0 for an embankment, > 0 otherwise), m.
	Width float64
	// Length is the length L of a rectangle, m.
	Length float64
	// Radius is the radius R of a circle, m.
	Radius float64
	// Run is the horizontal length of each side slope of an embankment,
	// from the crest edge to the toe (slope × height), m.
	Run float64
	// X and Y place the column: its horizontal distance from the centre
	// of the area across the width and along the length, m.
	X, Y float64
}

// Reasons Check refuses an area.
var (
	ErrShape   = errors.New("load: unknown shape")
	ErrMethod  = errors.New("load: unknown method")
	ErrSize    = errors.New("load: a size must be positive and finite")
	ErrOffAxis = errors.New("load: the circle's closed form is on its axis only")
)

// Check reports whether a describes an area Factor can evaluate.
func (a Area) Check() error {
	pos := func(v float64) bool { return v > 0 && !math.IsInf(v, 0) }
	if a.Method != Elastic && a.Method != Spread21 {
		return ErrMethod
	}
	if math.IsNaN(a.X) || math.IsInf(a.X, 0) || math.IsNaN(a.Y) || math.IsInf(a.Y, 0) {
		return ErrSize
	}
	switch a.Shape {
	case Uniform:
	case Strip:
		if !pos(a.Width) {
			return ErrSize
		}
	case Rectangle:
		if !pos(a.Width) || !pos(a.Length) {
			return ErrSize
		}
	case Circle:
		if !pos(a.Radius) {
			return ErrSize
		}
		if a.X != 0 || a.Y != 0 {
			return ErrOffAxis
		}
	case Embankment:
		if !(a.Width >= 0) || math.IsInf(a.Width, 0) || !pos(a.Run) {
			return ErrSize
		}
	default:
		return ErrShape
	}
	return nil
}

// Factor is Δσz/q at depth z under the column (the limit from below at
// z ≤ 0), in [0, 1]: far outside a loaded area the closed forms are
// differences of nearly equal terms, and their rounding (about 1e-9) is
// clamped away. a must pass Check, otherwise the result is meaningless
// (NaN or a wrong number); Factor does not panic.
func (a Area) Factor(z float64) float64 {
	if a.Shape == Uniform {
		return 1
	}
	if a.Method == Spread21 {
		return a.spread(math.Max(z, 0))
	}
	z = math.Max(z, a.tiny())
	f := math.NaN()
	switch a.Shape {
	case Strip:
		f = StripAt(a.Width, a.X, z)
	case Rectangle:
		f = RectangleAt(a.Width, a.Length, a.X, a.Y, z)
	case Circle:
		f = CircleAxis(a.Radius, z)
	case Embankment:
		f = EmbankmentAt(a.Width, a.Run, a.X, z)
	}
	if f < 0 {
		return 0
	}
	if f > 1 {
		return 1
	}
	return f
}

// Narrowest is the least plan dimension of the area (the width of a strip
// or rectangle, the diameter of a circle, the base width of an
// embankment), m; +Inf for Uniform.
func (a Area) Narrowest() float64 {
	switch a.Shape {
	case Strip:
		return a.Width
	case Rectangle:
		return math.Min(a.Width, a.Length)
	case Circle:
		return 2 * a.Radius
	case Embankment:
		return a.Width + 2*a.Run
	}
	return math.Inf(1)
}

// tiny is the depth taken for the surface, far below every size of the
// area, so that the closed forms give their limits from below.
func (a Area) tiny() float64 {
	return 1e-12 * (a.Width + a.Length + a.Radius + a.Run + math.Abs(a.X) + math.Abs(a.Y))
}

// spread is the 2:1 factor at depth z ≥ 0.
func (a Area) spread(z float64) float64 {
	within := func(off, w float64) bool { return math.Abs(off) <= w/2 }
	switch a.Shape {
	case Strip:
		if !within(a.X, a.Width+z) {
			return 0
		}
		return a.Width / (a.Width + z)
	case Rectangle:
		if !within(a.X, a.Width+z) || !within(a.Y, a.Length+z) {
			return 0
		}
		return a.Width * a.Length / ((a.Width + z) * (a.Length + z))
	case Circle:
		r := a.Radius + z/2
		return a.Radius * a.Radius / (r * r)
	case Embankment:
		bm := a.Width + a.Run
		if !within(a.X, bm+z) {
			return 0
		}
		return bm / (bm + z)
	}
	return math.NaN()
}

// lineG is (1/π)(β + sin β cos β) for tan β = s/z: the integral of the
// line-load kernel 2z³/(π((x−ξ)² + z²)²) over ξ, as a function of s = x − ξ.
func lineG(s, z float64) float64 {
	return (math.Atan2(s, z) + s*z/(s*s+z*z)) / math.Pi
}

// StripAt is Δσz/q at depth z > 0 and horizontal distance x from the
// centre line of a uniformly loaded strip of width b:
// (1/π)[α + sin α cos(α + 2δ)], written as the difference of lineG at the
// two edges.
func StripAt(b, x, z float64) float64 {
	return lineG(x+b/2, z) - lineG(x-b/2, z)
}

// StripCentre is (1/π)(α + sin α) under the centre of a strip of width b,
// with α = 2 atan(b/(2z)) the angle the strip subtends.
func StripCentre(b, z float64) float64 {
	alpha := 2 * math.Atan(b/(2*z))
	return (alpha + math.Sin(alpha)) / math.Pi
}

// RampAt is Δσz/p at depth z > 0 and horizontal position x under a strip
// load that rises linearly from 0 at x0 to p at x1 (x0 ≠ x1, either order),
// the integral of the line-load solution against the linear pressure.
func RampAt(x0, x1, x, z float64) float64 {
	c := 1 / (x1 - x0)
	lo, hi := math.Min(x0, x1), math.Max(x0, x1)
	sq := func(s float64) float64 { return s * s / (s*s + z*z) }
	j := lineG(x-lo, z) - lineG(x-hi, z)
	return (x-x0)*c*j - c*z/math.Pi*(sq(x-lo)-sq(x-hi))
}

// EmbankmentAt is Δσz/q at depth z > 0 and distance x from the centre line
// of a symmetric embankment of crest width crest and side slopes of
// horizontal run run, q the pressure under the crest: a uniform strip under
// the crest and a ramp under each slope.
//
// The three parts share their edges, so the line-load integrals are
// taken once at each of the four edges (four arctangents, not six):
// with gᵢ = lineG and sᵢ = s²/(s² + z²) at s = x + c + a, x + c, x − c,
// x − c − a (c the half crest, a the run),
//
//	I = (x+c+a)/a (g₁ − g₂) − z/(πa) (s₁ − s₂) + (g₂ − g₃)
//	  − (x−c−a)/a (g₃ − g₄) + z/(πa) (s₃ − s₄).
func EmbankmentAt(crest, run, x, z float64) float64 {
	c, a := crest/2, run
	e := [4]float64{x + c + a, x + c, x - c, x - c - a}
	var g, q [4]float64
	for i, s := range e {
		g[i] = lineG(s, z)
		q[i] = s * s / (s*s + z*z)
	}
	k := z / (math.Pi * a)
	return e[0]/a*(g[0]-g[1]) - k*(q[0]-q[1]) + (g[1] - g[2]) - e[3]/a*(g[2]-g[3]) + k*(q[2]-q[3])
}

// Osterberg is Osterberg's (1957) influence factor of a half-embankment at
// depth z > 0 under its inner end: pressure q over a width b from the
// centre line, then falling linearly to zero over the run a (> 0):
// (1/π)[((a+b)/a)(α1 + α2) − (b/a) α2], α2 = atan(b/z),
// α1 = atan((a+b)/z) − α2. A symmetric embankment gives twice this under
// its centre.
func Osterberg(a, b, z float64) float64 {
	a2 := math.Atan(b / z)
	a1 := math.Atan((a+b)/z) - a2
	return ((a+b)/a*(a1+a2) - b/a*a2) / math.Pi
}

// Corner is Newmark's (1935) influence factor under a corner of a
// uniformly loaded rectangle of sides m·z and n·z (m, n ≥ 0):
// (1/2π)[mn/√V (1/(1+m²) + 1/(1+n²)) + atan(mn/√V)], V = m² + n² + 1,
// a form without the branch of the arctangent the four-term form needs.
func Corner(m, n float64) float64 {
	if m == 0 || n == 0 {
		return 0
	}
	if math.IsInf(m, 1) || math.IsInf(n, 1) {
		// One side infinite: the limit is the quarter-strip.
		f := math.Min(m, n)
		if math.IsInf(f, 1) {
			return 0.25
		}
		return (math.Atan(f) + f/(1+f*f)) / (2 * math.Pi)
	}
	v := math.Sqrt(m*m + n*n + 1)
	r := m * n / v
	return (r*(1/(1+m*m)+1/(1+n*n)) + math.Atan(r)) / (2 * math.Pi)
}

// corner is Corner with signed sides: the influence of the rectangle
// between the point and (x, y), negative when one of them is negative.
func corner(x, y, z float64) float64 {
	f := Corner(math.Abs(x)/z, math.Abs(y)/z)
	if (x < 0) != (y < 0) {
		return -f
	}
	return f
}

// RectangleAt is Δσz/q at depth z > 0 under a point at (x, y) from the
// centre of a uniformly loaded rectangle of width b (along x) and length l
// (along y), by superposing the four corner rectangles (Newmark 1935);
// points outside the rectangle subtract the parts beyond it.
func RectangleAt(b, l, x, y, z float64) float64 {
	x1, x2 := -b/2-x, b/2-x
	y1, y2 := -l/2-y, l/2-y
	return corner(x2, y2, z) - corner(x1, y2, z) - corner(x2, y1, z) + corner(x1, y1, z)
}

// CircleAxis is Δσz/q at depth z > 0 on the axis of a uniformly loaded
// circle of radius r: 1 − [1 + (r/z)²]^(−3/2).
func CircleAxis(r, z float64) float64 {
	t := r / z
	return 1 - math.Pow(1+t*t, -1.5)
}
