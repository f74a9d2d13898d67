package solver

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// crustColumn is 1 m of sand (mv only) over a 2 m clay crust whose σ'p is
// set by ec, water table at the top, drained at both ends, under q.
func crustColumn(ec *ECurve, q float64, model string) *Project {
	return &Project{
		Format: Format, Model: model,
		Layers: []Layer{
			{Name: "sand", Thickness: 1, GammaSat: 20, K: 1e-5, Mv: 5e-5},
			{Name: "crust", Thickness: 2, GammaSat: 18, K: 1e-9, ECurve: ec},
		},
		Top: Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads: []Load{{Start: 0, Q: q}},
	}
}

// TestPreconsolidationProfiles checks the final settlement of a crust with
// σ'p given by POP and by a table against the e–log σ' formula of
// Terzaghi & Peck (1967), s = ∫ [Cr log10(σ'p/σ'0) + Cc log10(σ'f/σ'p)]
// /(1+e0) dz (Cr alone while σ'f ≤ σ'p), integrated by Gauss–Legendre
// quadrature (gonum quad.Fixed, 200 points) of the stresses worked out
// here: σ'0(z) = (20−9.81)·1 + (18−9.81)(z−1).
// The sand adds its mv settlement mv·q·1 m (labelled in the summary as
// the layer's own). Tolerance 0.2 % of the clay's settlement: the solver
// evaluates each element at its centre (a midpoint rule, 400 elements).
// Both models give the same final state under one load (the drained
// path).
func TestPreconsolidationProfiles(t *testing.T) {
	t.Parallel()
	const e0, cc, cr = 0.9, 0.3, 0.03
	gw := DefaultGammaW
	s0 := func(z float64) float64 { return (20 - gw) + (18-gw)*(z-1) }
	table := func(z float64) float64 { // 60 kPa at 1.5 m to 40 kPa at 2.5 m, constant beyond
		return 60 + (40-60)*math.Min(math.Max((z-1.5)/1.0, 0), 1)
	}
	tests := []struct {
		name string
		ec   ECurve
		sp   func(z float64) float64
		q    float64
	}{
		{"POP 40, load below it (Cr only)", ECurve{E0: e0, Cc: cc, Cr: cr, POP: 40}, func(z float64) float64 { return s0(z) + 40 }, 30},
		{"POP 40, load past it", ECurve{E0: e0, Cc: cc, Cr: cr, POP: 40}, func(z float64) float64 { return s0(z) + 40 }, 80},
		{"table", ECurve{E0: e0, Cc: cc, Cr: cr, SigmaPProfile: []DepthValue{{Z: 1.5, Value: 60}, {Z: 2.5, Value: 40}}}, table, 40},
	}
	for _, tt := range tests {
		for _, model := range []string{ModelLinear, ModelNonlinear} {
			t.Run(tt.name+", "+model, func(t *testing.T) {
				t.Parallel()
				ec := tt.ec
				p := crustColumn(&ec, tt.q, model)
				p.Mesh.MaxSize = 3.0 / 600
				r, err := Solve(p, nil)
				if err != nil {
					t.Fatal(err)
				}
				want := quad.Fixed(func(z float64) float64 {
					a, pk, f := s0(z), math.Max(tt.sp(z), s0(z)), s0(z)+tt.q
					if f <= pk {
						return cr * math.Log10(f/a) / (1 + e0)
					}
					return (cr*math.Log10(pk/a) + cc*math.Log10(f/pk)) / (1 + e0)
				}, 1, 3, 200, quad.Legendre{}, 0)
				got := *r.Summary.Layers[1].SettlementElog
				if model == ModelNonlinear {
					got = r.Summary.Layers[1].Settlement
				}
				if math.Abs(got-want) > 2e-3*want {
					t.Errorf("crust settles %.6f m, want %.6f m (Terzaghi & Peck 1967, ±0.2 %%)", got, want)
				}
				if model == ModelNonlinear {
					sand := 5e-5 * tt.q * 1
					if s := r.Summary.Layers[0].Settlement; math.Abs(s-sand) > 1e-3*sand {
						t.Errorf("sand settles %.6g m in the non-linear model, want mv·q·H = %.6g m (±0.1 %%)", s, sand)
					}
					if s := *r.Summary.Settlement; math.Abs(s-sand-want) > 2e-3*want {
						t.Errorf("total %.6f m, want sand + crust = %.6f m", s, sand+want)
					}
					if !hasWarning(r, "follows its mv") {
						t.Error("no warning that the sand follows its mv in the non-linear model")
					}
				}
			})
		}
	}
}

// TestShallowOCRWarns: an OCR on a layer reaching the surface leaves σ'p
// near zero there (σ'p = OCR·σ'0 → 0), which issue 11 asks to flag.
func TestShallowOCRWarns(t *testing.T) {
	t.Parallel()
	p := crustColumn(&ECurve{E0: 0.9, Cc: 0.3, Cr: 0.03, OCR: 3}, 30, "")
	p.Layers = p.Layers[1:]
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	found := false
	for _, w := range r.Warnings {
		found = found || w.Path == "layers[0].ecurve.ocr"
	}
	if !found {
		t.Errorf("no warning on layers[0].ecurve.ocr; warnings %v", r.Warnings)
	}
	// With POP instead, no such warning.
	p.Layers[0].ECurve = &ECurve{E0: 0.9, Cc: 0.3, Cr: 0.03, POP: 30}
	if r, err = Solve(p, nil); err != nil {
		t.Fatal(err)
	}
	for _, w := range r.Warnings {
		if w.Path == "layers[0].ecurve.ocr" {
			t.Errorf("POP warned: %v", w)
		}
	}
}
