package form

import (
	"math"
	"testing"

	"porelight/ui/units"
)

// Conversion factors below are NIST Special Publication 811 (2008),
// appendix B (foot 0.3048 m, inch 25.4 mm exact; lbf/ft³ 157.0875 N/m³);
// k = cv·mv·γw is Terzaghi's definition of cv (common practice).

// TestUnitsInputs: in US customary units an input shows and takes its
// value in feet, inches, pcf, ft²/yr; the draft keeps SI.
func TestUnitsInputs(t *testing.T) {
	tests := []struct {
		path  string
		typed string
		si    func(f *Form) float64 // the draft's value, in the file's unit
		want  float64               // by hand
		unit  string
	}{
		{"layers[0].thickness", "10", func(f *Form) float64 { return f.Draft().Layers[0].Thickness }, 3.048, "ft"},
		{"layers[1].gammaSat", "110", func(f *Form) float64 { return f.Draft().Layers[1].GammaSat }, 110 * 0.157087463846, "pcf"},
		{"loads[0].q", "2000", func(f *Form) float64 { return f.Draft().Loads[0].Q }, 2000 * 0.0478802589803, "psf"},
		{"monitoring.plates[0].readings[1].value", "1", func(f *Form) float64 { return f.Draft().Monitoring.Plates[0].Readings[1].Value }, 0.0254, "in"},
		{"layers[0].ch", "100", func(f *Form) float64 { return f.Draft().Layers[0].Ch }, 100 * 0.09290304 / 365.25, "ft²/yr"}, // file: m²/day
		{"layers[2].k", "0.001", func(f *Form) float64 { return f.Draft().Layers[2].K }, 0.001 * 0.3048 / 86400, "ft/day"},
		{"times", "10, 100", func(f *Form) float64 { return f.Draft().Times[1] }, 100, "day"}, // times do not convert
	}
	for _, tt := range tests {
		f := New(column())
		f.SetUnits(units.US)
		f.Edit(tt.path, tt.typed)
		if p := f.Problem(tt.path); p != "" {
			t.Fatalf("%s = %q: problem %q", tt.path, tt.typed, p)
		}
		if got := tt.si(f); math.Abs(got/tt.want-1) > 1e-11 {
			t.Errorf("%s = %q %s: stored %.15g, want %.15g (±1e-11 relative)", tt.path, tt.typed, tt.unit, got, tt.want)
		}
		if got := f.UnitOf(tt.path, "day"); got != tt.unit {
			t.Errorf("%s: unit %q, want %q", tt.path, got, tt.unit)
		}
		// Shown again in SI, and back in US as typed.
		f.SetUnits(units.SI)
		f.SetUnits(units.US)
		if got := f.Text(tt.path); got != tt.typed {
			t.Errorf("%s: shows %q after a switch to SI and back, want %q", tt.path, got, tt.typed)
		}
	}
}

func TestUnitsSwitchKeepsBadText(t *testing.T) {
	f := New(column())
	f.SetUnits(units.US)
	f.Edit("layers[0].thickness", "12,5")
	f.Edit("layers[1].thickness", "12 ft")
	f.SetUnits(units.SI)
	if got := f.Text("layers[0].thickness"); got != FormatNumber(12.5*0.3048) {
		t.Errorf("a value typed in ft shows %q in SI, want %q", got, FormatNumber(12.5*0.3048))
	}
	if got := f.Text("layers[1].thickness"); got != "12 ft" || f.Problem("layers[1].thickness") == "" {
		t.Errorf("text that is not a number shows %q (problem %q): it must stay as typed, with its problem", got, f.Problem("layers[1].thickness"))
	}
}

// TestUnitsState: text typed in US units and kept in the autosave or the
// undo history reads back in the units it was typed in, whatever the
// page shows when it is restored.
func TestUnitsState(t *testing.T) {
	f := New(column())
	f.SetUnits(units.US)
	f.Edit("layers[0].thickness", "10.0") // kept as typed: "10.0" is not how 10 formats
	f.Edit("layers[1].thickness", "x")
	data, err := f.EncodeState()
	if err != nil {
		t.Fatal(err)
	}
	st, ps := ReadDraft(data)
	if len(ps) > 0 {
		t.Fatal(ps)
	}
	g := New(column()) // shows SI
	g.Restore(st)
	if got := g.Draft().Layers[0].Thickness; got != 3.048 {
		t.Errorf("restored in SI: thickness %.17g m, want 3.048 (10.0 ft)", got)
	}
	if got := g.Text("layers[0].thickness"); got != "3.048" {
		t.Errorf("restored in SI: shows %q, want 3.048", got)
	}
	if got := g.Text("layers[1].thickness"); got != "x" {
		t.Errorf("restored: bad text %q, want x", got)
	}
}

// TestCvTyped: a cv typed sets k = cv·mv·γw and k follows mv while the cv
// is held; a k typed lets go of it.
func TestCvTyped(t *testing.T) {
	f := New(column())
	gw := 9.81 // solver.DefaultGammaW
	kOf := func(cvYr, mv float64) float64 { return cvYr / 365.25 / 86400 * mv * gw }
	// Layer 1 has mv 8e-4 1/kPa: cv 2 m²/yr.
	if msg := f.Problem(CvPath(0)); msg != "" {
		t.Fatal(msg)
	}
	f.Edit(CvPath(0), "2")
	if got, want := f.Draft().Layers[0].K, kOf(2, 8e-4); math.Abs(got/want-1) > 1e-5 {
		t.Errorf("cv 2 m²/yr: k %.6g m/s, want %.6g (±1e-5 relative: k is kept to 6 figures)", got, want)
	}
	f.Edit("layers[0].mv", "4e-4")
	if got, want := f.Draft().Layers[0].K, kOf(2, 4e-4); math.Abs(got/want-1) > 1e-5 {
		t.Errorf("mv halved with cv held: k %.6g m/s, want %.6g", got, want)
	}
	if got := f.Text(CvPath(0)); got != "2" {
		t.Errorf("the cv input shows %q, want the 2 typed", got)
	}
	f.Edit("layers[0].k", "1e-9")
	if got, want := f.Text(CvPath(0)), FormatSig(1e-9*86400*365.25/(4e-4*gw), 3); got != want {
		t.Errorf("after a k typed, the cv input shows %q, want the derived %q", got, want)
	}
	// In US units: 20 ft²/yr = 1.8580608 m²/yr.
	f.SetUnits(units.US)
	f.Edit(CvPath(2), "20")
	if got, want := f.Draft().Layers[2].K, kOf(20*0.09290304, 3e-4); math.Abs(got/want-1) > 1e-5 {
		t.Errorf("cv 20 ft²/yr: k %.6g m/s, want %.6g", got, want)
	}
	// Without mv, cv cannot give k: said beside the cv, k untouched.
	f.Edit("layers[1].mv", "")
	k := f.Draft().Layers[1].K
	f.Edit(CvPath(1), "1")
	if f.Problem(CvPath(1)) == "" || f.Draft().Layers[1].K != k {
		t.Errorf("cv without mv: problem %q, k %g (was %g)", f.Problem(CvPath(1)), f.Draft().Layers[1].K, k)
	}
	f.Edit("layers[1].mv", "0.0001")
	if f.Problem(CvPath(1)) != "" || f.Draft().Layers[1].K == k {
		t.Errorf("mv given after the cv: problem %q, k %g: the held cv must now give k", f.Problem(CvPath(1)), f.Draft().Layers[1].K)
	}
}

func TestPlaceholderUnits(t *testing.T) {
	f := New(column())
	f.SetUnits(units.US)
	// γw 9.81 kN/m³ = 62.45 pcf (NIST SP 811: 1 lbf/ft³ = 157.0875 N/m³).
	if got, _ := f.Placeholder("gammaW"); got != "62.45" {
		t.Errorf("γw placeholder %q, want 62.45", got)
	}
}
