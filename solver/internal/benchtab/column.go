package main

import (
	"math"

	"porelight/solver"
	"porelight/solver/internal/series"
)

// The reference column of the comparisons: one clay layer drained at the
// top and sealed at the base (one drainage path of H = 10 m), under an
// instantaneous uniform load q at t = 0. Terzaghi's (1943) series is exact
// for it.
const (
	colH      = 10.0  // m, thickness and drainage path
	colK      = 1e-9  // m/s
	colMv     = 1e-3  // 1/kPa
	colGammaW = 9.81  // kN/m³
	colQ      = 100.0 // kPa
)

// colCv is the coefficient of consolidation k/(mv γw), m²/day.
var colCv = colK * 86400 / (colMv * colGammaW)

// Accuracy targets (the tolerances, checked against Terzaghi's
// 1943 series): U within tolU over tvLo ≤ Tv ≤ tvHi and every isochrone
// at isoTv within tolIso of u0.
const (
	tolU   = 0.001
	tolIso = 0.005
	tvLo   = 0.005
	tvHi   = 2.0
)

// isoTv are the time factors of the isochrones checked.
var isoTv = []float64{0.005, 0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1, 2}

// days converts a time factor to days on the reference column.
func days(tv float64) float64 { return tv * colH * colH / colCv }

// timeFactor converts days to a time factor on the reference column.
func timeFactor(t float64) float64 { return colCv * t / (colH * colH) }

// errs is the accuracy of one run against Terzaghi's series.
type errs struct {
	U, Iso  float64 // max |U − U_series|, max |u − u_series|/u0
	checked int     // number of U values compared
	isos    int     // number of isochrones compared
}

func (e errs) ok() bool {
	return e.U <= tolU && e.Iso <= tolIso && e.checked > 0 && e.isos == len(isoTv)
}

// addU compares U at time factor tv (ignored outside [tvLo, tvHi]).
func (e *errs) addU(tv, u float64) {
	if tv < tvLo*(1-1e-9) || tv > tvHi*(1+1e-9) {
		return
	}
	e.checked++
	e.U = math.Max(e.U, math.Abs(u-series.TerzaghiU(tv)))
}

// addIso compares an isochrone u/u0 at node depths z (m) at time factor tv.
func (e *errs) addIso(tv float64, z, u []float64) {
	e.isos++
	for i := range z {
		want := series.TerzaghiExcess(math.Min(z[i]/colH, 1), tv)
		e.Iso = math.Max(e.Iso, math.Abs(u[i]-want))
	}
}

// project returns the reference column for Porelight with the given mesh
// and stepping, isochrones at isoTv and the history ending at tvHi unless
// the stepping says otherwise.
func project(m solver.MeshSettings, s solver.Stepping) *solver.Project {
	p := &solver.Project{
		Format: solver.Format,
		Layers: []solver.Layer{{Name: "clay", Thickness: colH, GammaSat: 18, K: colK, Mv: colMv}},
		Top:    solver.Boundary{Drained: true},
		Loads:  []solver.Load{{Start: 0, Q: colQ}},
		Mesh:   m, Stepping: s,
	}
	for _, tv := range isoTv {
		p.Times = append(p.Times, days(tv))
	}
	return p
}

// porelightErrs compares a Porelight result on the reference column with
// the series.
func porelightErrs(r *solver.Result) errs {
	var e errs
	c := r.Consolidation
	for i, t := range c.Series.Time {
		e.addU(timeFactor(t), c.Series.Us[i])
	}
	u := make([]float64, len(c.Depth))
	for _, iso := range c.Isochrones {
		for i, v := range iso.Excess {
			u[i] = v / colQ
		}
		e.addIso(timeFactor(iso.Time), c.Depth, u)
	}
	return e
}
