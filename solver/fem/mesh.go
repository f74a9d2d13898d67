package fem

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"
)

// Mesh is a one-dimensional finite element mesh of Lagrange elements of
// one order over a stack of layers. Element e spans nodes Order·e …
// Order·e+Order; the nodes of an element are equally spaced, so a
// quadratic element has its middle node at its centre. Layer boundaries
// are always element ends. A Mesh is not changed after NewMesh.
type Mesh struct {
	// Order is the element order, 1 (linear) or 2 (quadratic).
	Order int
	// Z holds the node depths, increasing.
	Z []float64
	// Layer is the layer of each element.
	Layer []int
	// First[l] is the first element of layer l; First[len(layers)] is the
	// number of elements.
	First []int
	// Gauss–Legendre points and weights on [-1, 1].
	gx, gw []float64
	// Shape functions and their ξ-derivatives at the Gauss points:
	// shape[q*(order+1)+a] is N_a(ξ_q).
	shape, dshape []float64
}

// Divisions returns how many elements a layer of thickness h gets: enough
// that none is longer than maxSize, and at least minPer (and one).
func Divisions(h, maxSize float64, minPer int) int {
	n := int(math.Ceil(h/maxSize - 1e-9))
	return max(n, minPer, 1)
}

// NewMesh meshes layers of the given thicknesses with elements of the
// given order, no longer than maxSize and at least minPer to a layer. It
// panics unless order is 1 or 2. Cost O(elements).
func NewMesh(thickness []float64, order int, maxSize float64, minPer int) *Mesh {
	return NewMeshBreaks(thickness, order, maxSize, minPer, nil)
}

// parts splits the layer [top, top+h] at the depths of breaks that lie
// inside it (further than 1e-9·h from its ends and from each other) and
// returns the depths of the part ends, top first, and each part's element
// count: none longer than maxSize, and at least minPer over the layer
// shared in proportion to the parts' lengths (each at least 1).
func parts(top, h float64, breaks []float64, maxSize float64, minPer int) (ends []float64, counts []int) {
	ends = append(ends, top)
	tol := 1e-9 * h
	for _, b := range breaks {
		if b > top+tol && b < top+h-tol && b > ends[len(ends)-1]+tol {
			ends = append(ends, b)
		}
	}
	ends = append(ends, top+h)
	if len(ends) == 2 {
		return ends, []int{Divisions(h, maxSize, minPer)}
	}
	for i := 1; i < len(ends); i++ {
		l := ends[i] - ends[i-1]
		n := int(math.Ceil(l/maxSize - 1e-9))
		counts = append(counts, max(n, int(math.Ceil(float64(minPer)*l/h-1e-9)), 1))
	}
	return ends, counts
}

// DivisionsBreaks is the number of elements NewMeshBreaks gives the layer
// [top, top+h] for the given breaks, without meshing it.
func DivisionsBreaks(top, h float64, breaks []float64, maxSize float64, minPer int) int {
	_, counts := parts(top, h, breaks, maxSize, minPer)
	n := 0
	for _, c := range counts {
		n += c
	}
	return n
}

// NewMeshBreaks is NewMesh with element ends also at the given depths
// (increasing; those outside the column or on a layer boundary add
// nothing), for a change of coefficient inside a layer such as the tip of
// a drain. Layer still gives each element's layer.
func NewMeshBreaks(thickness []float64, order int, maxSize float64, minPer int, breaks []float64) *Mesh {
	if order != 1 && order != 2 {
		panic("fem: element order must be 1 or 2")
	}
	m := &Mesh{Order: order, First: make([]int, len(thickness)+1)}
	ne := 0
	top := 0.0
	type layerParts struct {
		ends   []float64
		counts []int
	}
	lp := make([]layerParts, len(thickness))
	for i, h := range thickness {
		m.First[i] = ne
		ends, counts := parts(top, h, breaks, maxSize, minPer)
		lp[i] = layerParts{ends, counts}
		for _, c := range counts {
			ne += c
		}
		top += h
	}
	m.First[len(thickness)] = ne
	m.Z = make([]float64, order*ne+1)
	m.Layer = make([]int, ne)
	e := 0
	for i, h := range thickness {
		ends, counts := lp[i].ends, lp[i].counts
		for p, n := range counts {
			z0, z1 := ends[p], ends[p+1]
			l := z1 - z0
			if len(counts) == 1 {
				l = h
			}
			for j := range n {
				m.Layer[e] = i
				for a := range order {
					m.Z[order*e+a] = z0 + l*float64(order*j+a)/float64(order*n)
				}
				e++
			}
			m.Z[order*e] = z1 // exact part end
		}
	}
	// order+1 Gauss points integrate the mass matrix exactly and leave
	// room for a coefficient varying within an element.
	nq := order + 1
	m.gx, m.gw = make([]float64, nq), make([]float64, nq)
	quad.Legendre{}.FixedLocations(m.gx, m.gw, -1, 1)
	np := order + 1
	m.shape, m.dshape = make([]float64, nq*np), make([]float64, nq*np)
	for q, x := range m.gx {
		Lagrange(order, x, m.shape[q*np:(q+1)*np], m.dshape[q*np:(q+1)*np])
	}
	return m
}

// Lagrange writes the shape functions of a Lagrange element of the given
// order (1 or 2) at ξ ∈ [-1, 1] to n and their derivatives dN/dξ to dn.
func Lagrange(order int, x float64, n, dn []float64) {
	switch order {
	case 1:
		n[0], n[1] = (1-x)/2, (1+x)/2
		dn[0], dn[1] = -0.5, 0.5
	case 2:
		n[0], n[1], n[2] = x*(x-1)/2, 1-x*x, x*(x+1)/2
		dn[0], dn[1], dn[2] = x-0.5, -2*x, x+0.5
	}
}

// Nodes is the number of nodes.
func (m *Mesh) Nodes() int { return len(m.Z) }

// Elements is the number of elements.
func (m *Mesh) Elements() int { return len(m.Layer) }

// Span returns the first node and the depths of the ends of element e.
func (m *Mesh) Span(e int) (n0 int, z0, z1 float64) {
	n0 = m.Order * e
	return n0, m.Z[n0], m.Z[n0+m.Order]
}

// At returns the element containing depth z and the local coordinate
// ξ ∈ [-1, 1] of z in it. Depths outside the column are clamped to its
// ends. O(log n).
func (m *Mesh) At(z float64) (e int, xi float64) {
	ne := m.Elements()
	if z <= m.Z[0] {
		return 0, -1
	}
	if z >= m.Z[len(m.Z)-1] {
		return ne - 1, 1
	}
	lo, hi := 0, ne-1
	for lo < hi {
		mid := (lo + hi) / 2
		if m.Z[m.Order*(mid+1)] < z {
			lo = mid + 1
		} else {
			hi = mid
		}
	}
	_, z0, z1 := m.Span(lo)
	return lo, 2*(z-z0)/(z1-z0) - 1
}

// Probe is a fixed point of the mesh at which a field is read repeatedly
// (a piezometer): the first node of its element and the shape function
// values there, so that reading costs order+1 multiplications.
type Probe struct {
	n0, np int
	w      [3]float64
}

// ProbeAt returns the probe at depth z (clamped to the column).
func (m *Mesh) ProbeAt(z float64) Probe {
	e, xi := m.At(z)
	var pr Probe
	var dn [3]float64
	Lagrange(m.Order, xi, pr.w[:], dn[:])
	pr.n0, pr.np = m.Order*e, m.Order+1
	return pr
}

// Read evaluates the field u at the probe.
func (pr *Probe) Read(u []float64) float64 {
	s := 0.0
	for a := range pr.np {
		s += pr.w[a] * u[pr.n0+a]
	}
	return s
}

// Centre evaluates the finite element field u at the centre of element e
// in O(1): the mean of the end nodes of a linear element, the middle node
// of a quadratic one.
func (m *Mesh) Centre(u []float64, e int) float64 {
	n0 := m.Order * e
	if m.Order == 2 {
		return u[n0+1]
	}
	return (u[n0] + u[n0+1]) / 2
}

// Interpolate evaluates the finite element field u at depth z (clamped
// to the column). O(log n).
func (m *Mesh) Interpolate(u []float64, z float64) float64 {
	pr := m.ProbeAt(z)
	return pr.Read(u)
}

// Integrate returns ∫ u dz over element e of the finite element field u,
// by the mesh's Gauss quadrature (exact for the element's own shape
// functions).
func (m *Mesh) Integrate(u []float64, e int) float64 {
	np := m.Order + 1
	n0, z0, z1 := m.Span(e)
	jac := (z1 - z0) / 2
	s := 0.0
	for q := range m.gx {
		v := 0.0
		for a := range np {
			v += m.shape[q*np+a] * u[n0+a]
		}
		s += v * m.gw[q] * jac
	}
	return s
}

// Assemble adds to dst the matrix of the bilinear form
//
//	∫ c(e, z) · (w·u)  dz  (mass == true), or
//	∫ c(e, z) · (w'·u') dz (mass == false)
//
// over every element e, by Gauss quadrature. dst must have m.Nodes() rows
// and m.Order super-diagonals.
func (m *Mesh) Assemble(dst *Band, c func(e int, z float64) float64, mass bool) {
	if dst.N != m.Nodes() || dst.KD != m.Order {
		panic("fem: band shape does not match the mesh")
	}
	np := m.Order + 1
	var ke [9]float64
	for e := range m.Elements() {
		n0, z0, z1 := m.Span(e)
		jac := (z1 - z0) / 2 // dz/dξ
		clear(ke[:])
		for q, xq := range m.gx {
			z := z0 + (xq+1)*jac
			cw := c(e, z) * m.gw[q] * jac
			if mass {
				n := m.shape[q*np : (q+1)*np]
				for a := range np {
					for b := a; b < np; b++ {
						ke[a*np+b] += cw * n[a] * n[b]
					}
				}
			} else {
				dn := m.dshape[q*np : (q+1)*np]
				for a := range np {
					for b := a; b < np; b++ {
						ke[a*np+b] += cw * dn[a] * dn[b] / (jac * jac)
					}
				}
			}
		}
		for a := range np {
			for b := a; b < np; b++ {
				dst.Add(n0+a, n0+b, ke[a*np+b])
			}
		}
	}
}

// Load adds to dst the vector ∫ f(z) · w dz for every shape function w.
func (m *Mesh) Load(dst []float64, f func(z float64) float64) {
	np := m.Order + 1
	for e := range m.Elements() {
		n0, z0, z1 := m.Span(e)
		jac := (z1 - z0) / 2
		for q, xq := range m.gx {
			fw := f(z0+(xq+1)*jac) * m.gw[q] * jac
			for a := range np {
				dst[n0+a] += fw * m.shape[q*np+a]
			}
		}
	}
}
