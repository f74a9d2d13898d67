package plot

import (
	"os"
	"testing"

	"porelight/solver"
)

// TestStripZone checks the layer strip of the excavation example: the
// soil above the floor is marked as excavated, and a top head that
// differs from the water table gets its own open marker ("head"); with
// the head at the water table's level there is no second marker.
func TestStripZone(t *testing.T) {
	raw, err := os.ReadFile("../../testdata/excavation.json")
	if err != nil {
		t.Fatal(err)
	}
	p, err := solver.Decode(raw)
	if err != nil {
		t.Fatal(err)
	}
	r, err := solver.Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	has := func(f *Figure, s string) bool {
		for _, tx := range f.Texts {
			if tx.Text == s {
				return true
			}
		}
		return false
	}
	f := IsochronesFigure(p, r, 640, 420)
	if !has(f, "excavated") {
		t.Error("no excavated band on the strip")
	}
	if has(f, "head") {
		t.Error("a head marker although the top head is the water table's")
	}
	p.Top.Head = ptrTo(0)
	if f := IsochronesFigure(p, r, 640, 420); !has(f, "head") {
		t.Error("no head marker for a top head 1 m above the water table")
	}
}

func ptrTo(v float64) *float64 { return &v }
