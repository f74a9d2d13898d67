package fem

// AssembleConstant sets dst to the matrix of the bilinear form
//
//	∫ c[e] · (w·u)  dz  (mass == true, lumped by rows when lump is set), or
//	∫ c[e] · (w'·u') dz (mass == false)
//
// for a coefficient c[e] constant over each element e, overwriting what
// dst held. It gives what Assemble gives for that coefficient (and Lump
// after it), from the exact element matrices instead of quadrature, with
// no callback and no allocation: O(elements) for a time loop that
// re-assembles every iteration. dst must have m.Nodes() rows and m.Order
// super-diagonals and c one value per element.
func (m *Mesh) AssembleConstant(dst *Band, c []float64, mass, lump bool) {
	if dst.N != m.Nodes() || dst.KD != m.Order || len(c) != m.Elements() {
		panic("fem: band or coefficients do not match the mesh")
	}
	ab := dst.AB
	clear(ab)
	if m.Order == 1 {
		// ld = 2: AB[2i] = A[i][i], AB[2i+1] = A[i][i+1].
		for e, ce := range c {
			h := m.Z[e+1] - m.Z[e]
			switch {
			case mass && lump:
				v := ce * h / 2
				ab[2*e] += v
				ab[2*e+2] += v
			case mass:
				v := ce * h / 6
				ab[2*e] += 2 * v
				ab[2*e+1] += v
				ab[2*e+2] += 2 * v
			default:
				v := ce / h
				ab[2*e] += v
				ab[2*e+1] -= v
				ab[2*e+2] += v
			}
		}
		return
	}
	// Quadratic elements, nodes 2e, 2e+1, 2e+2 (ld = 3): the exact
	// matrices h/30·[4 2 −1; 2 16 2; −1 2 4] and 1/(3h)·[7 −8 1; −8 16 −8;
	// 1 −8 7] (Strang & Fix 1973), row sums h/6·[1 4 1] when lumped.
	for e, ce := range c {
		n0 := 2 * e
		h := m.Z[n0+2] - m.Z[n0]
		r0, r1, r2 := 3*n0, 3*(n0+1), 3*(n0+2)
		switch {
		case mass && lump:
			v := ce * h / 6
			ab[r0] += v
			ab[r1] += 4 * v
			ab[r2] += v
		case mass:
			v := ce * h / 30
			ab[r0] += 4 * v
			ab[r0+1] += 2 * v
			ab[r0+2] -= v
			ab[r1] += 16 * v
			ab[r1+1] += 2 * v
			ab[r2] += 4 * v
		default:
			v := ce / (3 * h)
			ab[r0] += 7 * v
			ab[r0+1] -= 8 * v
			ab[r0+2] += v
			ab[r1] += 16 * v
			ab[r1+1] -= 8 * v
			ab[r2] += 7 * v
		}
	}
}
