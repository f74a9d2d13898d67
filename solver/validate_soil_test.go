package solver

import "testing"

// Validate refuses bad soil-model fields (model, mvUnload, ecurve.ck,
// ecurve.pop, ecurve.sigmaPProfile, more than one way of giving σ'p) with
// the field path and an Err* reason (the input contract in doc.go).
func TestValidateSoilModel(t *testing.T) {
	t.Parallel()
	curve := func(p *Project) *ECurve {
		p.Layers[1].ECurve = &ECurve{E0: 1, Cc: 0.3, Cr: 0.03}
		return p.Layers[1].ECurve
	}
	cases := []struct {
		name   string
		change func(p *Project)
		want   []decProblem
	}{
		{"unknown model", func(p *Project) { p.Model = "elastic" },
			[]decProblem{{"model", ErrOutOfRange}}},
		{"negative mvUnload", func(p *Project) { p.Layers[0].MvUnload = -1e-5 },
			[]decProblem{{"layers[0].mvUnload", ErrNotPositive}}},
		{"zero ck is allowed, negative is not", func(p *Project) { curve(p).Ck = -0.5 },
			[]decProblem{{"layers[1].ecurve.ck", ErrNotPositive}}},
		{"negative pop", func(p *Project) { curve(p).POP = -10 },
			[]decProblem{{"layers[1].ecurve.pop", ErrNegative}}},
		{"pop and ocr", func(p *Project) { c := curve(p); c.OCR = 2; c.POP = 10 },
			[]decProblem{{"layers[1].ecurve.pop", ErrConflict}}},
		{"profile and sigmaP", func(p *Project) {
			c := curve(p)
			c.SigmaP = 50
			c.SigmaPProfile = []DepthValue{{Z: 1, Value: 40}}
		}, []decProblem{{"layers[1].ecurve.sigmaPProfile", ErrConflict}}},
		{"profile out of order, value zero", func(p *Project) {
			curve(p).SigmaPProfile = []DepthValue{{Z: 3, Value: 40}, {Z: 2, Value: 0}}
		}, []decProblem{{"layers[1].ecurve.sigmaPProfile[1].z", ErrNotSorted}, {"layers[1].ecurve.sigmaPProfile[1].value", ErrNotPositive}}},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := valProject()
			tc.change(p)
			decCheckProblems(t, Validate(p), tc.want)
		})
	}
}

// The soil-model fields are held within their physical bounds (bounds.go):
// ErrOutOfRange with the allowed range.
func TestSoilModelBounds(t *testing.T) {
	t.Parallel()
	curve := func(p *Project) *ECurve {
		p.Layers[1].ECurve = &ECurve{E0: 1, Cc: 0.3, Cr: 0.03}
		return p.Layers[1].ECurve
	}
	cases := []struct {
		name   string
		change func(p *Project)
		want   []decProblem
	}{
		{"mvUnload above MaxMv", func(p *Project) { p.Layers[0].MvUnload = 2 }, []decProblem{{"layers[0].mvUnload", ErrOutOfRange}}},
		{"ck below MinCk", func(p *Project) { curve(p).Ck = 0.01 }, []decProblem{{"layers[1].ecurve.ck", ErrOutOfRange}}},
		{"pop above MaxStress", func(p *Project) { curve(p).POP = 2e5 }, []decProblem{{"layers[1].ecurve.pop", ErrOutOfRange}}},
		{"profile value above MaxStress", func(p *Project) { curve(p).SigmaPProfile = []DepthValue{{Z: 1, Value: 2e5}} },
			[]decProblem{{"layers[1].ecurve.sigmaPProfile[0].value", ErrOutOfRange}}},
		{"calphaCc above MaxCalphaCc", func(p *Project) { curve(p); p.Layers[1].CalphaCc = 2 }, []decProblem{{"layers[1].calphaCc", ErrOutOfRange}}},
		{"calphaReduced above MaxCalpha", func(p *Project) { curve(p); p.Layers[1].CalphaReduced = 2 }, []decProblem{{"layers[1].calphaReduced", ErrOutOfRange}}},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := valProject()
			tc.change(p)
			decCheckProblems(t, Validate(p), tc.want)
		})
	}
}
