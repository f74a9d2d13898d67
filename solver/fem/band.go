package fem

// Band is a symmetric N×N band matrix with KD super-diagonals, upper part
// stored row by row (LAPACK's Dpbtrf layout, ldab = KD+1):
//
//	AB[i*(KD+1)+j] = A[i][i+j],  0 ≤ j ≤ KD.
//
// For N = 5 and KD = 2 the storage holds
//
//	a00 a01 a02
//	a11 a12 a13
//	a22 a23 a24
//	a33 a34  *
//	a44  *   *
//
// The entries marked * are outside the matrix and stay zero.
type Band struct {
	N, KD int
	AB    []float64
}

// NewBand returns a zero n×n band matrix with kd super-diagonals.
func NewBand(n, kd int) *Band { return &Band{N: n, KD: kd, AB: make([]float64, n*(kd+1))} }

// Add adds v to A[i][j] (and so to A[j][i]); it requires i ≤ j ≤ i+KD.
func (b *Band) Add(i, j int, v float64) { b.AB[i*(b.KD+1)+j-i] += v }

// At returns A[i][j] for any i, j.
func (b *Band) At(i, j int) float64 {
	if i > j {
		i, j = j, i
	}
	if j-i > b.KD {
		return 0
	}
	return b.AB[i*(b.KD+1)+j-i]
}

// MulVec sets dst = A·x. dst and x must not overlap. O(N·KD).
func (b *Band) MulVec(dst, x []float64) {
	ld := b.KD + 1
	clear(dst[:b.N])
	for i := range b.N {
		row := b.AB[i*ld : i*ld+ld]
		dst[i] += row[0] * x[i]
		for j := 1; j < ld && i+j < b.N; j++ {
			dst[i] += row[j] * x[i+j]
			dst[i+j] += row[j] * x[i]
		}
	}
}

// Lump replaces the matrix by the diagonal of its row sums (the row-sum
// lumped capacity matrix). Row i keeps Σⱼ A[i][j] on its diagonal.
func (b *Band) Lump() {
	ones := make([]float64, b.N)
	for i := range ones {
		ones[i] = 1
	}
	sums := make([]float64, b.N)
	b.MulVec(sums, ones)
	clear(b.AB)
	for i, s := range sums {
		b.AB[i*(b.KD+1)] = s
	}
}

// Isolate makes row and column j those of the identity scaled by diag:
// A[j][j] = diag and A[i][j] = A[j][i] = 0 for i ≠ j. A node held at
// zero inside the column (where MoveHeld has nothing to move) keeps its
// row in the factorised block this way, and the matrix stays symmetric
// positive definite when diag > 0 (with diag = 0 the row drops out of a
// sum a + c·b whose other term holds it). O(KD).
func (b *Band) Isolate(j int, diag float64) {
	ld := b.KD + 1
	for d := 1; d < ld; d++ {
		if j+d < b.N {
			b.AB[j*ld+d] = 0
		}
		if i := j - d; i >= 0 {
			b.AB[i*ld+d] = 0
		}
	}
	b.AB[j*ld] = diag
}
