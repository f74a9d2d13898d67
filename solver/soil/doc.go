// Package soil holds the behaviour of soil that the column's analyses read:
// the e–log σ′ compression curve with recompression and swelling along Cr
// and virgin loading along Cc (Terzaghi & Peck 1967), the preconsolidation
// stress from σ′p or OCR, the state of one sublayer following the curve
// through a stress history, the secondary compression of Mesri (1973) and
// the coefficient of consolidation cv = k/(mv γw), the permeability that
// follows the void ratio (Tavenas et al. 1983) and the constant-mv path
// with a swelling modulus.
//
// It knows nothing of meshes, files or the time loop: package solver
// builds one Point per element and moves it along the stresses the
// consolidation gives (the non-linear model moves them itself, trying each
// stress with Point.Toward first; Follow, Move and Toward do the same for
// a whole column in one loop). New behaviour belongs here: creep laws
// per layer, undrained strength from σ′.
//
// Units: stress kPa, length m, permeability m/s, mv 1/kPa, γw kN/m³,
// time day. Functions leave their arguments unchanged.
package soil

// SecondsPerDay converts a permeability in m/s to the m/day of the time
// integration.
const SecondsPerDay = 86400

// Cv is the coefficient of consolidation k/(mv γw) in m²/day, for k in m/s,
// mv in 1/kPa and γw in kN/m³.
func Cv(k, mv, gammaW float64) float64 { return k * SecondsPerDay / (mv * gammaW) }
