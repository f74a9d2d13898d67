package plot

import (
	"math"

	"porelight/solver"
)

// Synthetic results for the tests, built from closed forms rather than the
// solver: Terzaghi's one-dimensional solution for a uniform initial excess
// u0 in a homogeneous column drained at both ends (drainage path H/2),
//
//	u/u0 = Σ (2/M) sin(M Z) exp(−M² Tv),  M = π(2m+1)/2,
//	U    = 1 − Σ (2/M²) exp(−M² Tv),
//
// with Z = z/Hdr measured from the top and Tv = cv t / Hdr².

const (
	synthU0 = 60.0 // kPa
	synthCv = 0.05 // m²/day
	synthWT = 1.0  // m, water table depth
	gammaW  = 9.81 // kN/m³
)

func terzaghiExcess(z, hdr, tv float64) float64 {
	if tv <= 0 {
		return synthU0
	}
	zz := z / hdr
	sum := 0.0
	for m := range 200 {
		M := math.Pi * float64(2*m+1) / 2
		sum += 2 / M * math.Sin(M*zz) * math.Exp(-M*M*tv)
	}
	return synthU0 * sum
}

func terzaghiDegree(tv float64) float64 {
	if tv <= 0 {
		return 0
	}
	sum := 0.0
	for m := range 200 {
		M := math.Pi * float64(2*m+1) / 2
		sum += 2 / (M * M) * math.Exp(-M*M*tv)
	}
	return 1 - sum
}

// synthProject is a three-layer, 8 m column.
func synthProject() *solver.Project {
	return &solver.Project{
		Format:     solver.Format,
		WaterTable: synthWT,
		Layers: []solver.Layer{
			{Name: "Made ground", Thickness: 1.5, GammaSat: 19, Gamma: 17, K: 1e-6, Mv: 1e-4},
			{Name: "Soft grey clay with organics", Thickness: 5, GammaSat: 16.5, K: 1e-9, Mv: 8e-4},
			{Name: "Silty clay", Thickness: 1.5, GammaSat: 18, K: 5e-9, Mv: 4e-4},
		},
		Times:       []float64{1, 10, 30, 100, 365, 1000},
		Piezometers: []float64{2.5, 6},
	}
}

// synthResult builds a complete result for synthProject.
func synthResult() *solver.Result {
	const height = 8.0
	hdr := height / 2
	var r solver.Result
	// Steady: nodes every 0.1 m, heads falling linearly from −1 m at the top
	// to −2.5 m at the base (downward flow).
	n := 81
	st := &r.Steady
	total := 0.0
	for i := range n {
		z := float64(i) * 0.1
		h := -1 - 1.5*z/height
		u := math.Max(0, gammaW*(h+z))
		if i > 0 {
			g := 17.0
			if z > synthWT {
				g = 18
			}
			total += g * 0.1
		}
		st.Depth = append(st.Depth, z)
		st.Head = append(st.Head, h)
		st.Pore = append(st.Pore, u)
		st.Total = append(st.Total, total)
		st.Effective = append(st.Effective, total-u)
	}
	st.Layers = []solver.SteadyLayer{
		{Name: "Made ground", Top: 0, Bottom: 1.5},
		{Name: "Soft grey clay with organics", Top: 1.5, Bottom: 6.5},
		{Name: "Silty clay", Top: 6.5, Bottom: 8},
	}
	c := &solver.Consolidation{Depth: st.Depth}
	for _, t := range []float64{1, 10, 30, 100, 365, 1000} {
		iso := solver.Isochrone{Time: t}
		for _, z := range c.Depth {
			iso.Excess = append(iso.Excess, terzaghiExcess(z, hdr, synthCv*t/(hdr*hdr)))
		}
		c.Isochrones = append(c.Isochrones, iso)
	}
	s := &c.Series
	s.Time = append(s.Time, 0)
	for t := 1.0 / 1440; t < 40000; t *= 1.15 {
		s.Time = append(s.Time, t)
	}
	s.Piezometers = []solver.Piezometer{{Depth: 2.5}, {Depth: 6}}
	for _, t := range s.Time {
		tv := synthCv * t / (hdr * hdr)
		us := terzaghiDegree(tv)
		s.Load = append(s.Load, synthU0)
		s.Us = append(s.Us, us)
		s.Up = append(s.Up, terzaghiDegree(0.8*tv))
		s.Settlement = append(s.Settlement, 0.42*us)
		s.SettlementElog = append(s.SettlementElog, 0.5*us)
		for k := range s.Piezometers {
			z := s.Piezometers[k].Depth
			ex := terzaghiExcess(z, hdr, tv)
			s.Piezometers[k].Excess = append(s.Piezometers[k].Excess, ex)
			s.Piezometers[k].Pore = append(s.Piezometers[k].Pore, gammaW*(z-synthWT)+ex)
		}
	}
	r.Consolidation = c
	t50, t90 := 0.197*hdr*hdr/synthCv, 0.848*hdr*hdr/synthCv // Tv at U = 50 %, 90 %
	r.Summary.T50, r.Summary.T90 = &t50, &t90
	return &r
}
