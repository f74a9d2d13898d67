package solver

import (
	"fmt"
	"math"
	"strings"
	"testing"
)

// finiteAll reports the first non-finite number in a result, or "".
func finiteAll(r *Result) string {
	check := func(name string, xs []float64) string {
		for i, x := range xs {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				return fmt.Sprintf("%s[%d] = %g", name, i, x)
			}
		}
		return ""
	}
	st := r.Steady
	for _, c := range []struct {
		n  string
		xs []float64
	}{{"head", st.Head}, {"pore", st.Pore}, {"total", st.Total}, {"effective", st.Effective}, {"flux", []float64{st.Flux, st.KEquivalent}}} {
		if s := check(c.n, c.xs); s != "" {
			return s
		}
	}
	if c := r.Consolidation; c != nil {
		for _, iso := range c.Isochrones {
			if s := check(fmt.Sprintf("isochrone t=%g", iso.Time), iso.Excess); s != "" {
				return s
			}
		}
		for _, xs := range [][]float64{c.Series.Us, c.Series.Up, c.Series.Settlement, c.Series.SettlementElog} {
			if s := check("series", xs); s != "" {
				return s
			}
		}
	}
	return ""
}

func clayLayer(h, k float64) Layer {
	return Layer{Name: "clay", Thickness: h, GammaSat: 17, K: k, Mv: 1e-3}
}

// TestHardColumns solves numerically hard but valid columns and checks
// that every output is finite and that the physics that must hold does:
// the same flux through every layer, the final settlement mv·H·q, and the
// degree of consolidation reaching 1.
func TestHardColumns(t *testing.T) {
	t.Parallel()
	many := make([]Layer, 200)
	for i := range many {
		many[i] = clayLayer(0.05+0.01*float64(i%7), math.Pow(10, -10+float64(i%5)))
	}
	tests := []struct {
		name    string
		layers  []Layer
		mesh    MeshSettings
		times   []float64
		end     float64
		wantEnd float64 // least Us at the end
	}{
		{"contrast 1e-12 beside 1e-2", []Layer{clayLayer(2, 1e-2), clayLayer(2, 1e-12), clayLayer(2, 1e-2)}, MeshSettings{}, nil, 1e9, 0.99},
		{"2 mm sand seam in 20 m of clay", []Layer{clayLayer(10, 1e-9), {Name: "seam", Thickness: 0.002, GammaSat: 20, K: 1e-4, Mv: 1e-5}, clayLayer(10, 1e-9)}, MeshSettings{}, nil, 0, 0.99},
		{"200 layers", many, MeshSettings{}, nil, 0, 0.99},
		{"1 cm column", []Layer{clayLayer(0.01, 1e-9)}, MeshSettings{}, nil, 0, 0.99},
		{"500 m column", []Layer{clayLayer(500, 1e-6)}, MeshSettings{}, nil, 0, 0.9},
		{"1 minute to 1000 years", []Layer{clayLayer(10, 1e-9)}, MeshSettings{}, []float64{1.0 / 1440, 1, 365.25e3}, 365.25e3, 0.99},
		{"quadratic elements, contrast", []Layer{clayLayer(2, 1e-2), clayLayer(2, 1e-12), clayLayer(2, 1e-2)}, MeshSettings{Order: 2}, nil, 1e9, 0.99},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			p := &Project{Format: Format, Layers: tt.layers, WaterTable: 0,
				Top: Boundary{Drained: true}, Bottom: Boundary{Drained: true},
				Loads: []Load{{Start: 0, Q: 50}}, Times: tt.times, Mesh: tt.mesh,
				Stepping: Stepping{EndTime: tt.end}}
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			if s := finiteAll(r); s != "" {
				t.Fatalf("non-finite output: %s", s)
			}
			want := 0.0
			for _, l := range tt.layers {
				want += l.Mv * l.Thickness * 50
			}
			// Tolerance 1e-9 relative: ∫ mv Δσ' dz is exact for a
			// uniform load on any mesh (Terzaghi 1943).
			if got := *r.Summary.SettlementLinear; math.Abs(got-want) > 1e-9*want {
				t.Errorf("final settlement %.9g m, want Σ mv·H·q = %.9g m", got, want)
			}
			us := r.Consolidation.Series.Us
			if end := us[len(us)-1]; end < tt.wantEnd || end > 1+1e-5 {
				t.Errorf("Us at the end = %.6f, want in [%g, 1]", end, tt.wantEnd)
			}
			// Tolerance 1e-5: Crank–Nicolson may overshoot U = 1 by
			// rounding-sized amounts once the layer has drained.
			for i, u := range us {
				if u < -1e-9 || u > 1+1e-5 {
					t.Errorf("Us[%d] = %g outside [0, 1] under a single load", i, u)
					break
				}
			}
		})
	}
}

// TestUndrainedColumn: with both ends sealed the excess pressure stays at
// the load, nothing settles, and the result says so.
func TestUndrainedColumn(t *testing.T) {
	t.Parallel()
	p := &Project{Format: Format, Layers: []Layer{clayLayer(5, 1e-9)},
		Loads: []Load{{Start: 0, Q: 40}}, Times: []float64{100, 10000}}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, iso := range r.Consolidation.Isochrones {
		for j, u := range iso.Excess {
			// Tolerance 1e-9 kPa: nothing can drain.
			if math.Abs(u-40) > 1e-9 {
				t.Fatalf("u(z=%g, t=%g) = %g, want 40 kPa (sealed column)", r.Consolidation.Depth[j], iso.Time, u)
			}
		}
	}
	// Tolerance 1e-9 m: rounding of σ − u summed over the nodes.
	if s := r.Consolidation.Series.Settlement; math.Abs(s[len(s)-1]) > 1e-9 {
		t.Errorf("settlement %g m of a sealed column, want 0", s[len(s)-1])
	}
	if !hasWarning(r, "undrained") {
		t.Errorf("no warning that the column cannot drain: %v", r.Warnings)
	}
}

// TestUnloadBelowZero removes more load than was placed: the column swells
// (negative settlement along mv), results stay finite, and the negative
// net load is reported when σ' would drop below zero.
func TestUnloadBelowZero(t *testing.T) {
	t.Parallel()
	p := &Project{Format: Format, Layers: []Layer{{Name: "clay", Thickness: 4, GammaSat: 17, K: 1e-9, Mv: 1e-3,
		ECurve: &ECurve{E0: 1, Cc: 0.3, Cr: 0.05}}},
		Top: Boundary{Drained: true}, Bottom: Boundary{Drained: true},
		Loads: []Load{{Start: 0, Q: 20}, {Start: 100, Q: -80}}}
	r, err := Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	if s := finiteAll(r); s != "" {
		t.Fatalf("non-finite output: %s", s)
	}
	// mv·H·(20 − 80) = −0.24 m: the unloading returns along mv.
	if got := *r.Summary.SettlementLinear; math.Abs(got+0.24) > 1e-9 {
		t.Errorf("final settlement %.9g m, want −0.24 m (mv·H·Δσ, ±1e-9)", got)
	}
	if !hasWarning(r, "below zero") {
		t.Errorf("no warning about negative effective stress: %v", r.Warnings)
	}
}

func hasWarning(r *Result, word string) bool {
	for _, w := range r.Warnings {
		if strings.Contains(w.Message, word) {
			return true
		}
	}
	return false
}

// TestWorkLimit: a project that would take too long is refused with a
// message naming the setting to change, before any work is done.
func TestWorkLimit(t *testing.T) {
	t.Parallel()
	p := &Project{Format: Format, Layers: []Layer{clayLayer(100, 1e-9)},
		Top: Boundary{Drained: true}, Loads: []Load{{Start: 0, Q: 10}},
		Mesh: MeshSettings{MaxSize: 100.0 / 150_000}, Stepping: Stepping{FirstStep: 1e-4, Growth: 1, EndTime: 1000}}
	_, err := Solve(p, nil)
	if err == nil || !strings.Contains(err.Error(), "stepping") {
		t.Fatalf("Solve = %v, want a refusal naming the stepping settings", err)
	}
}

// TestCancel: Options.Progress returning false stops the solve.
func TestCancel(t *testing.T) {
	t.Parallel()
	p := uniformClay(10, true)
	calls := 0
	_, err := Solve(p, &Options{Progress: func(f float64) bool {
		calls++
		if f < 0 || f > 1 {
			t.Errorf("progress %g outside [0, 1]", f)
		}
		return false
	}})
	if err != ErrCanceled || calls != 1 {
		t.Fatalf("Solve = %v after %d progress calls, want ErrCanceled after 1", err, calls)
	}
}

// TestOddValuesWarn: legal but unusual values give warnings at their
// field, never errors. The typical ranges are common practice, with no
// single published source (clay k 1e-11–1e-9 m/s, clean sand 1e-5–1e-3
// m/s, soft clay cv 0.5–10 m²/year).
func TestOddValuesWarn(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name  string
		layer Layer
		path  string // "" means no warning about the layer
	}{
		{"ordinary clay", clayLayer(5, 1e-9), ""},
		{"k below 1e-13", clayLayer(5, 1e-14), "layers[0].k"},
		{"k above 1 m/s", Layer{Thickness: 5, GammaSat: 19, K: 3, Mv: 1e-5}, "layers[0].k"},
		{"cv far too high for a clay", Layer{Thickness: 5, GammaSat: 17, K: 5e-8, Mv: 1e-6}, "layers[0].mv"},
		{"layer thinner than the elements", clayLayer(0.001, 1e-9), "layers[0].thickness"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			p := &Project{Format: Format, Layers: []Layer{tt.layer, clayLayer(5, 1e-9)}, Top: Boundary{Drained: true}, Mesh: MeshSettings{MaxSize: 0.1}}
			r, err := Solve(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			found := ""
			for _, w := range r.Warnings {
				if strings.HasPrefix(w.Path, "layers[0]") && found == "" {
					found = w.Path
				}
			}
			if found != tt.path {
				t.Errorf("warning at %q, want %q (all: %v)", found, tt.path, r.Warnings)
			}
		})
	}
}
