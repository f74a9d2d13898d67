package main

import (
	"bytes"
	"encoding/csv"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
)

// TestBaselinesMeetTarget checks that the baselines reach, on small
// columns, the accuracy the table credits them with: U within 0.001 of
// Terzaghi's (1943) series over 0.005 ≤ Tv ≤ 2 and isochrones within
// 0.005 u0 (series.TerzaghiU and series.TerzaghiExcess, exact to
// rounding), and that the check refuses a mesh too coarse for it.
func TestBaselinesMeetTarget(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name string
		run  func() *history
		ok   bool
	}{
		{"FTCS, 101 nodes", func() *history { return ftcs(101, true) }, true},
		{"FTCS, 21 nodes", func() *history { return ftcs(21, true) }, false},
		{"dense θ-method, 41 nodes", func() *history {
			return implicit(41, plan{first: 1e-4, growth: 3, run: 6, damped: 2}.steps(), newDense)
		}, true},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			h := tt.run()
			e := h.check()
			if e.ok() != tt.ok {
				t.Errorf("meets target = %v, want %v: max U error %.3g (tolerance %g), max isochrone error %.3g u0 (tolerance %g), %d U values, %d isochrones",
					e.ok(), tt.ok, e.U, tolU, e.Iso, tolIso, e.checked, e.isos)
			}
			if e.isos != len(isoTv) || e.checked == 0 {
				t.Errorf("%d isochrones and %d U values compared, want %d and some", e.isos, e.checked, len(isoTv))
			}
		})
	}
}

// TestDenseMatchesTridiagonal checks that the dense baseline computes the
// same numbers as the tridiagonal solve the step search relies on, to
// 1e-12 of u0 (rounding in two factorisations of the same SPD matrix).
func TestDenseMatchesTridiagonal(t *testing.T) {
	t.Parallel()
	s := plan{first: 1e-3, growth: 2, run: 4, damped: 2}.steps()
	a, b := implicit(31, s, newDense), implicit(31, s, newTri)
	if a.steps != b.steps || a.facts != b.facts || a.facts != distinct(s) {
		t.Fatalf("steps %d/%d, factorisations %d/%d, distinct steps %d", a.steps, b.steps, a.facts, b.facts, distinct(s))
	}
	for k := range a.iso {
		for i := range a.iso[k] {
			if d := math.Abs(a.iso[k][i] - b.iso[k][i]); d > 1e-12 {
				t.Fatalf("isochrone %d node %d: dense %v, tridiagonal %v", k, i, a.iso[k][i], b.iso[k][i])
			}
		}
	}
}

// TestPlanLandsOnMarks checks that a uniform plan whose step divides the
// isochrone times needs one factorisation per θ and ends at Tv = 2.
func TestPlanLandsOnMarks(t *testing.T) {
	t.Parallel()
	s := plan{first: 0.005 / 4, growth: 1, run: 1, damped: 2}.steps()
	if got := distinct(s); got != 2 {
		t.Errorf("%d distinct (θ, Δt), want 2 (backward Euler and Crank–Nicolson)", got)
	}
	if n := len(s); n != 4*400 {
		t.Errorf("%d steps, want 1,600 (Tv 2 in steps of 0.00125)", n)
	}
}

// TestSummaryColumns checks that every summary row has the header's
// columns in Markdown and in CSV, and that absent inputs say so.
func TestSummaryColumns(t *testing.T) {
	t.Parallel()
	r := &report{
		m:     machine{cpu: "test", cores: 2, goVersion: "go", osArch: "os/arch", date: "today"},
		scale: &scaling{rows: []scaleRow{{order: 1, elements: 100_000, nodes: 100_001, steps: 1000, solve: timing{best: 3e9}, floor: timing{best: 1e9}}}},
		size:  &sizes{},
	}
	s := r.summary()
	for _, row := range s.rows {
		if len(row) != len(mainHeader) {
			t.Fatalf("row %q has %d cells, header %d", row, len(row), len(mainHeader))
		}
	}
	var md bytes.Buffer
	if err := r.writeMarkdown(&md); err != nil {
		t.Fatal(err)
	}
	text := md.String()
	for _, want := range []string{"| Section | Measure | Porelight | Baseline | Ratio | Goal | Holds |", "not built", "not measured", "3.00× floor"} {
		if !strings.Contains(text, want) {
			t.Errorf("Markdown lacks %q:\n%s", want, text)
		}
	}
	var c bytes.Buffer
	if err := s.csv(&c); err != nil {
		t.Fatal(err)
	}
	recs, err := csv.NewReader(&c).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(recs) != len(s.rows)+1 || recs[0][0] != "Section" {
		t.Errorf("CSV has %d records (want %d) starting %q", len(recs), len(s.rows)+1, recs[0])
	}
}

// TestReadBrowser checks the browser file: the five keys required, other
// keys shown when known and ignored when not.
func TestReadBrowser(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	write := func(name, body string) string {
		p := filepath.Join(dir, name)
		if err := os.WriteFile(p, []byte(body), 0o644); err != nil {
			t.Fatal(err)
		}
		return p
	}
	good := write("good.json", `{"firstPlotMs": 900, "editToPlotMs": 212.5, "editToPlotNoDebounceMs": 12.5,
		"editToPlotNonlinearNoDebounceMs": 61, "heapBeforeBytes": 4e6, "heapAfterBytes": 6e6, "solves": 1000, "machine": "test", "later": true}`)
	b, err := readBrowser(good)
	if err != nil || *b.Solves != 1000 || *b.EditToPlotNoDebounceMs != 12.5 {
		t.Fatalf("readBrowser(good) = %+v, %v", b, err)
	}
	s := (&report{browser: b}).summary()
	var verdicts []string
	for _, row := range s.rows {
		verdicts = append(verdicts, row[len(row)-1])
	}
	// 900 ms ≤ 1.5 s; 212.5 ms includes the typing pause (report only);
	// 12.5 ms ≤ 50 ms; 61 ms on the non-linear model > 50 ms; 2 MB < 5 MB.
	if want := []string{"yes", "—", "yes", "no", "yes"}; !slices.Equal(verdicts, want) {
		t.Errorf("verdicts %q, want %q", verdicts, want)
	}
	// The typing rows (edit to plot 212.5 ms > 50 ms without the pause
	// figure): 25 ms ≤ 30 ms, 1.2 s > 1 s, the inserted paste
	// reported only.
	typing := write("typing.json", `{"firstPlotMs": 900, "editToPlotMs": 212.5, "heapBeforeBytes": 4e6, "heapAfterBytes": 6e6, "solves": 1000,
		"keystrokeMs": 25, "keystrokeMaxMs": 40, "paste500Ms": 1200, "insert500Ms": 1500}`)
	if b, err = readBrowser(typing); err != nil {
		t.Fatal(err)
	}
	verdicts = nil
	for _, row := range (&report{browser: b}).summary().rows {
		verdicts = append(verdicts, row[len(row)-1])
	}
	if want := []string{"yes", "no", "yes", "no", "—", "yes"}; !slices.Equal(verdicts, want) {
		t.Errorf("verdicts with the typing rows %q, want %q", verdicts, want)
	}
	missing := write("missing.json", `{"firstPlotMs": 900, "editToPlotMs": 12, "heapBeforeBytes": 1, "heapAfterBytes": 2}`)
	if _, err := readBrowser(missing); err == nil {
		t.Errorf("readBrowser accepted a file without \"solves\"")
	}
}

// TestMeasureLoads runs section 6 once: both solves of the embankment
// example succeed and are timed (no speed goal here: that is the table's).
func TestMeasureLoads(t *testing.T) {
	if testing.Short() {
		t.Skip("times solves")
	}
	c, err := measureLoads("../../..")
	if err != nil {
		t.Fatal(err)
	}
	if c.submerged.best <= 0 || c.dry.best <= 0 || c.uniform.best <= 0 || c.dry.runs < 3 {
		t.Errorf("timings %+v %+v %+v", c.submerged, c.dry, c.uniform)
	}
	t.Logf("submerged %v, dry %v, whole top %v: spread %.2f×, submergence %.2f×", c.submerged.best, c.dry.best, c.uniform.best, c.spread(), c.submergence())
}
