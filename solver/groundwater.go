package solver

import (
	"fmt"
	"math"
)

// groundwaterWarnings says plainly where the water table and the heads at
// the ends disagree, and which wins: the pore pressures of the steady
// state follow the heads held at drained ends (and at draining layers),
// the total stress follows the water table (moist soil above it,
// saturated below, water standing above the top). A head at a drained
// base that differs from the water table's is flow through the column
// (artesian or under-drained) and no contradiction while the top holds
// the water table's head.
func groundwaterWarnings(p *Project, height float64, warn func(path, msg string)) {
	wt := p.WaterTable
	hydro := -wt
	differs := func(h float64) bool { return math.Abs(h-hydro) > 1e-9*math.Max(1, math.Abs(hydro)) }
	if h := p.Top.Head; p.Top.Drained && h != nil && differs(*h) {
		warn("top.head", fmt.Sprintf("the head at the top is %s but the water table is %s, which means a head of %s: pore pressures follow the head (water would stand %s in a standpipe at the top), the total stress follows the water table (moist unit weight above it); make them agree unless the top is meant to be held at another level, e.g. by pumping",
			headText(*h), depthText(wt), headText(hydro), levelText(*h)))
	}
	if h := p.Bottom.Head; !p.Top.Drained && p.Bottom.Drained && h != nil && differs(*h) && !hasOutlet(p) {
		warn("bottom.head", fmt.Sprintf("the top is undrained, so the head at the base (%s) holds throughout the column, while the water table is %s (a head of %s): pore pressures follow the head, the total stress the water table",
			headText(*h), depthText(wt), headText(hydro)))
	}
	if height > 0 && wt > height {
		warn("waterTable", fmt.Sprintf("the water table (%g m) is below the base of the column (%g m): the whole column takes its moist unit weight, and a drained end without a head holds %s, so the pore pressure in the column is negative (suction, taken as zero in the effective stress); give the heads at the ends, or a water table inside the column", wt, height, headText(hydro)))
	}
}

func headText(h float64) string { return fmt.Sprintf("%g m", h) }

// depthText says where a water table at depth wt lies.
func depthText(wt float64) string {
	switch {
	case wt > 0:
		return fmt.Sprintf("%g m down", wt)
	case wt < 0:
		return fmt.Sprintf("%g m above the top", -wt)
	}
	return "at the top"
}

// levelText says where water stands for a head h at the top.
func levelText(h float64) string {
	switch {
	case h > 0:
		return fmt.Sprintf("%g m above the top", h)
	case h < 0:
		return fmt.Sprintf("%g m below the top", -h)
	}
	return "at the top"
}
