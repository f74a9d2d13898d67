package solver

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"
)

// Mesh defaults.
const (
	defaultMinPerLayer = 4
	defaultDivisions   = 200 // elements over the column height when maxSize is zero
)

// mesh is a one-dimensional finite element mesh of Lagrange elements of
// one order. Element e spans nodes order·e … order·e+order; the nodes of
// an element are equally spaced, so a quadratic element has its middle
// node at its centre. Layer boundaries are always element ends.
type mesh struct {
	order int
	z     []float64 // node depths, increasing, m
	layer []int     // layer of each element
	// first[l] is the first element of layer l; first[len(layers)] is the
	// number of elements.
	first []int
	// Gauss–Legendre points and weights on [-1, 1].
	gx, gw []float64
	// Shape functions and their ξ-derivatives at the Gauss points:
	// shape[q*(order+1)+a] is N_a(ξ_q).
	shape, dshape []float64
}

// divisions returns how many elements a layer of thickness h gets.
func divisions(h, maxSize float64, minPer int) int {
	n := int(math.Ceil(h/maxSize - 1e-9))
	return max(n, minPer, 1)
}

// meshSize resolves the mesh settings of p to (order, maxSize, minPerLayer).
func meshSize(p *Project) (order int, maxSize float64, minPer int) {
	order, maxSize, minPer = p.Mesh.Order, p.Mesh.MaxSize, p.Mesh.MinPerLayer
	if order == 0 {
		order = 1
	}
	if minPer == 0 {
		minPer = defaultMinPerLayer
	}
	if maxSize == 0 {
		h := 0.0
		for _, l := range p.Layers {
			h += l.Thickness
		}
		maxSize = h / defaultDivisions
	}
	return order, maxSize, minPer
}

// elementCount is the number of elements newMesh would make for p,
// computed without making them (saturating at MaxElements+1).
func elementCount(p *Project) int {
	_, maxSize, minPer := meshSize(p)
	n := 0
	for _, l := range p.Layers {
		d := l.Thickness / maxSize
		if d > MaxElements {
			return MaxElements + 1
		}
		n += divisions(l.Thickness, maxSize, minPer)
		if n > MaxElements {
			return MaxElements + 1
		}
	}
	return n
}

// newMesh meshes layers of the given thicknesses with elements of the given
// order, no longer than maxSize and at least minPer to a layer.
func newMesh(thickness []float64, order int, maxSize float64, minPer int) *mesh {
	if order != 1 && order != 2 {
		panic("solver: element order must be 1 or 2")
	}
	m := &mesh{order: order, first: make([]int, len(thickness)+1)}
	ne := 0
	for i, h := range thickness {
		m.first[i] = ne
		ne += divisions(h, maxSize, minPer)
	}
	m.first[len(thickness)] = ne
	m.z = make([]float64, order*ne+1)
	m.layer = make([]int, ne)
	top := 0.0
	for i, h := range thickness {
		n := m.first[i+1] - m.first[i]
		for j := range n {
			e := m.first[i] + j
			m.layer[e] = i
			for a := range order {
				m.z[order*e+a] = top + h*float64(order*j+a)/float64(order*n)
			}
		}
		top += h
		m.z[order*m.first[i+1]] = top // exact layer boundary
	}
	// order+1 Gauss points integrate the mass matrix exactly and leave
	// room for a coefficient varying within an element.
	nq := order + 1
	m.gx, m.gw = make([]float64, nq), make([]float64, nq)
	quad.Legendre{}.FixedLocations(m.gx, m.gw, -1, 1)
	np := order + 1
	m.shape, m.dshape = make([]float64, nq*np), make([]float64, nq*np)
	for q, x := range m.gx {
		lagrange(order, x, m.shape[q*np:(q+1)*np], m.dshape[q*np:(q+1)*np])
	}
	return m
}

// lagrange writes the shape functions of a Lagrange element of the given
// order at ξ ∈ [-1, 1] to n and their derivatives dN/dξ to dn.
func lagrange(order int, x float64, n, dn []float64) {
	switch order {
	case 1:
		n[0], n[1] = (1-x)/2, (1+x)/2
		dn[0], dn[1] = -0.5, 0.5
	case 2:
		n[0], n[1], n[2] = x*(x-1)/2, 1-x*x, x*(x+1)/2
		dn[0], dn[1], dn[2] = x-0.5, -2*x, x+0.5
	}
}

func (m *mesh) nodes() int    { return len(m.z) }
func (m *mesh) elements() int { return len(m.layer) }

// span returns the first node and the depths of the ends of element e.
func (m *mesh) span(e int) (n0 int, z0, z1 float64) {
	n0 = m.order * e
	return n0, m.z[n0], m.z[n0+m.order]
}

// at returns the element containing depth z and the local coordinate
// ξ ∈ [-1, 1] of z in it. Depths outside the column are clamped to its ends.
func (m *mesh) at(z float64) (e int, xi float64) {
	ne := m.elements()
	if z <= m.z[0] {
		return 0, -1
	}
	if z >= m.z[len(m.z)-1] {
		return ne - 1, 1
	}
	lo, hi := 0, ne-1
	for lo < hi {
		mid := (lo + hi) / 2
		if m.z[m.order*(mid+1)] < z {
			lo = mid + 1
		} else {
			hi = mid
		}
	}
	_, z0, z1 := m.span(lo)
	return lo, 2*(z-z0)/(z1-z0) - 1
}

// centre evaluates the finite element field u at the centre of element e
// in O(1): the mean of the end nodes of a linear element, the middle node
// of a quadratic one.
func (m *mesh) centre(u []float64, e int) float64 {
	n0 := m.order * e
	if m.order == 2 {
		return u[n0+1]
	}
	return (u[n0] + u[n0+1]) / 2
}

// interpolate evaluates the finite element field u at depth z.
func (m *mesh) interpolate(u []float64, z float64) float64 {
	e, xi := m.at(z)
	var n, dn [3]float64
	lagrange(m.order, xi, n[:], dn[:])
	n0 := m.order * e
	s := 0.0
	for a := 0; a <= m.order; a++ {
		s += n[a] * u[n0+a]
	}
	return s
}
