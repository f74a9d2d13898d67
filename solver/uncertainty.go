package solver

import "fmt"

// Uncertainty describes the spread of the soil parameters for a Monte
// Carlo of the column (package solver/uncertain). Each uncertain
// parameter is lognormal: the value in the layer is its median, and the
// coefficient of variation (COV, standard deviation over mean) sets the
// spread, σ_ln = √(ln(1 + COV²)). The spread is of the parameters only:
// the model itself (one-dimensional, Terzaghi's assumptions, the layer
// boundaries) is taken as exact.
type Uncertainty struct {
	// Runs is the number of realisations, 2 … MaxRuns. Zero means
	// DefaultRuns.
	Runs int `json:"runs,omitempty"`
	// Seed starts the pseudo-random generator (PCG, math/rand/v2);
	// realisation i always draws from the stream (Seed, i), so a run is
	// reproducible and may be split among workers in any way.
	// 0 … MaxSeed.
	Seed int `json:"seed,omitempty"`
	// Date is the time after which the remaining settlement is reported,
	// days. Zero means the end of the last load change (LastLoadChange).
	Date float64 `json:"date,omitempty"`
	// Layers holds the spread of each layer, in the order of
	// Project.Layers; it may be shorter (the rest are fixed).
	Layers []LayerSpread `json:"layers,omitempty"`
}

// LayerSpread is the uncertainty of one layer's parameters, each a
// coefficient of variation (0 … MaxCOV; zero: the parameter is fixed).
type LayerSpread struct {
	// K is the COV of the vertical permeability k (and of kh with it).
	K float64 `json:"k,omitempty"`
	// Mv is the COV of the compressibility: mv, mvUnload and the e–log
	// curve's Cc and Cr are scaled by the same factor.
	Mv float64 `json:"mv,omitempty"`
	// Ch is the COV of the horizontal coefficient of consolidation (of
	// ch when given, of khKv otherwise), read only with drains.
	Ch float64 `json:"ch,omitempty"`
	// KMv is the correlation coefficient of ln k and ln mv in the layer,
	// −1 … 1 (0: independent).
	KMv float64 `json:"kMv,omitempty"`
}

// Bounds and default of Uncertainty.
const (
	DefaultRuns = 500
	MaxRuns     = 20000
	MaxSeed     = 1<<53 - 1 // exact in a JSON number
	// MaxCOV is the largest coefficient of variation accepted (300 %):
	// beyond it a lognormal's median and mean differ by more than a
	// factor of 3 and the figure says little.
	MaxCOV = 3.0
)

// ResolveRuns is the number of realisations of u (DefaultRuns when zero).
func ResolveRuns(u *Uncertainty) int {
	if u == nil || u.Runs == 0 {
		return DefaultRuns
	}
	return u.Runs
}

// ResolveUncertaintyDate is the date after which the remaining
// settlement is reported: Uncertainty.Date, or LastLoadChange(p).
func ResolveUncertaintyDate(p *Project) float64 {
	if p.Uncertainty != nil && p.Uncertainty.Date > 0 {
		return p.Uncertainty.Date
	}
	return LastLoadChange(p)
}

func validUncertainty(ps *Problems, p *Project) {
	u := p.Uncertainty
	if u == nil {
		return
	}
	if u.Runs != 0 && (u.Runs < 2 || u.Runs > MaxRuns) {
		ps.Add("uncertainty.runs", ErrOutOfRange, fmt.Sprintf("allowed 2 to %d, got %d", MaxRuns, u.Runs))
	}
	if u.Seed < 0 || u.Seed > MaxSeed {
		ps.Add("uncertainty.seed", ErrOutOfRange, fmt.Sprintf("allowed 0 to %d, got %d", int64(MaxSeed), u.Seed))
	}
	if u.Date != 0 {
		upTo(ps, "uncertainty.date", u.Date, MaxTime, "days")
	}
	if len(u.Layers) > len(p.Layers) {
		ps.Add("uncertainty.layers", ErrOutOfRange, fmt.Sprintf("%d entries for a column of %d layers", len(u.Layers), len(p.Layers)))
	}
	for i, l := range u.Layers {
		at := fmt.Sprintf("uncertainty.layers[%d].", i)
		for _, c := range []struct {
			name string
			v    float64
		}{{"k", l.K}, {"mv", l.Mv}, {"ch", l.Ch}} {
			if l := c.v; l != 0 {
				upTo(ps, at+c.name, l, MaxCOV, "")
			}
		}
		if l.KMv != 0 && finite(ps, at+"kMv", l.KMv) && (l.KMv < -1 || l.KMv > 1) {
			ps.Add(at+"kMv", ErrOutOfRange, "a correlation lies between −1 and 1 "+paren(num(l.KMv)))
		}
	}
}
