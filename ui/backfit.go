package ui

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"porelight/solver/monitor"
	"porelight/ui/form"
	"porelight/ui/units"

	"github.com/vugu/vugu"
)

// Backfit is the back-analysis panel: which layers' k (and whether the
// settlement scale) to fit, against which records; the run with its
// progress and Cancel; the fitted values with their standard errors; and
// Apply / Revert. The run itself belongs to Root (monitor_root.go).
type Backfit struct {
	S *fitState
	F *form.Form
	// Run starts a fit, Cancel stops it, Apply copies the fitted values
	// into the project and Revert puts the previous ones back.
	Run, Cancel, Apply, Revert func()
}

func (c *Backfit) layerNames() []string {
	var out []string
	for i, l := range c.F.Draft().Layers {
		out = append(out, recordName(l.Name, "Layer", i))
	}
	return out
}

func (c *Backfit) checked(i int) bool { return c.S.layers[i] }

func (c *Backfit) setLayer(i int, e vugu.DOMEvent) { c.S.layers[i] = e.PropBool("target", "checked") }

func (c *Backfit) drains() bool { return c.F.Draft().Drains != nil }

func (c *Backfit) checkedCh(i int) bool { return c.S.ch[i] }

func (c *Backfit) setCh(i int, e vugu.DOMEvent) { c.S.ch[i] = e.PropBool("target", "checked") }

func (c *Backfit) setScale(e vugu.DOMEvent) { c.S.scale = e.PropBool("target", "checked") }

// dataValue and setData map the record choice to the select's values.
func (c *Backfit) dataValue() string {
	switch c.S.data {
	case monitor.FitSettlements:
		return "plates"
	case monitor.FitPressures:
		return "piezometers"
	}
	return "all"
}

func (c *Backfit) setData(e vugu.DOMEvent) {
	switch e.PropString("target", "value") {
	case "plates":
		c.S.data = monitor.FitSettlements
	case "piezometers":
		c.S.data = monitor.FitPressures
	default:
		c.S.data = monitor.FitAll
	}
}

func (c *Backfit) chosen() bool {
	if c.S.scale {
		return true
	}
	for i := range c.F.Draft().Layers {
		if c.S.layers[i] || (c.drains() && c.S.ch[i]) {
			return true
		}
	}
	return false
}

func (c *Backfit) progress() string { return exact(c.S.progress) }

func (c *Backfit) progressText() string {
	return fmt.Sprintf("Fitting… %.0f %%", 100*c.S.progress)
}

// stale says when the inputs changed after the fit shown.
func (c *Backfit) stale() bool {
	return c.S.res != nil && !c.S.applied && !sameSolve(c.S.model, c.F.Draft())
}

// fitRow is one fitted parameter as shown.
type fitRow struct {
	ID, Name, Mult, Range, CvBefore, CvAfter string
}

func (c *Backfit) rows() []fitRow {
	res := c.S.res
	var out []fitRow
	for k, p := range res.Params {
		r := fitRow{ID: fmt.Sprintf("fit-param-%d", k), Name: "Settlement scale (mv, k and e–log indices of every layer)", CvBefore: "–", CvAfter: "unchanged"}
		if p.Layer >= 0 {
			name := fmt.Sprintf("layer %d", p.Layer+1)
			if p.Layer < len(c.S.model.Layers) {
				name = recordName(c.S.model.Layers[p.Layer].Name, "Layer", p.Layer)
			}
			r.Name = "k of " + name
			r.CvBefore = sig(p.InitialCv, 3)
			r.CvAfter = sig(p.Cv, 3)
			if strings.HasSuffix(p.Name, ".ch") {
				r.Name = "ch of " + name
				r.CvBefore = "ch " + sig(p.InitialCh, 3)
				r.CvAfter = "ch " + sig(p.Ch, 3)
			}
		}
		if p.Determined {
			r.Mult = pm(p.Multiplier, p.SE)
			d := decimals(p.SE)
			r.Range = strconv.FormatFloat(p.Low, 'f', d, 64) + " – " + strconv.FormatFloat(p.High, 'f', d, 64)
			if p.Layer >= 0 && strings.HasSuffix(p.Name, ".ch") {
				r.CvAfter = "ch " + pm(p.Ch, p.InitialCh*p.SE)
			} else if p.Layer >= 0 {
				r.CvAfter = pm(p.Cv, p.InitialCv*p.SE)
			}
		} else {
			r.Mult = "not determined"
			r.Range = "the readings do not fix it"
			if p.Layer >= 0 {
				r.CvAfter = "not determined"
			}
		}
		out = append(out, r)
	}
	return out
}

// rms lists the root mean square differences before and after the fit.
func (c *Backfit) rms() []string {
	res := c.S.res
	var out []string
	if res.RMSSettlement != nil && res.InitialRMSSettlement != nil {
		out = append(out, fmt.Sprintf("Settlement: %s %s before the fit, %s %[2]s after.", mm1(*res.InitialRMSSettlement), sym(units.Settlement), mm1(*res.RMSSettlement)))
	}
	if res.RMSPressure != nil && res.InitialRMSPressure != nil {
		out = append(out, fmt.Sprintf("Pore pressure: %s before the fit, %s after.", qty(units.Stress, *res.InitialRMSPressure, 3), qty(units.Stress, *res.RMSPressure, 3)))
	}
	return out
}

func (c *Backfit) runs() string {
	res := c.S.res
	s := fmt.Sprintf("%d readings compared; %d solver runs", res.Readings, res.Runs)
	if res.Converged {
		return s + "; the search converged."
	}
	return s + "; the search stopped before converging (" + res.Status + "): treat the values with care."
}

// correlated warns of pairs of parameters the readings hardly tell apart.
func (c *Backfit) correlated() []string {
	res := c.S.res
	rows := c.rows()
	var out []string
	for i := range res.Correlation {
		for j := i + 1; j < len(res.Correlation[i]); j++ {
			if r := res.Correlation[i][j]; math.Abs(r) > 0.9 {
				out = append(out, fmt.Sprintf("%s and %s are strongly correlated (r = %s): the readings hardly tell them apart.",
					rows[i].Name, rows[j].Name, sig(r, 2)))
			}
		}
	}
	return out
}

// decimals is the number of decimals that shows an uncertainty se with
// two significant digits (at most 8).
func decimals(se float64) int {
	if !(se > 0) || math.IsInf(se, 0) {
		return 3
	}
	return min(max(1-int(math.Floor(math.Log10(se))), 0), 8)
}

// pm writes x ± se with the decimals of se: 1.5226 ± 0.0044.
func pm(x, se float64) string {
	if !(se > 0) || math.IsInf(se, 0) || math.IsNaN(x) {
		return sig(x, 3)
	}
	d := decimals(se)
	return strconv.FormatFloat(x, 'f', d, 64) + " ± " + strconv.FormatFloat(se, 'f', d, 64)
}
