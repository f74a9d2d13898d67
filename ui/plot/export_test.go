package plot

import (
	"encoding/csv"
	"encoding/xml"
	"errors"
	"io"
	"slices"
	"strconv"
	"strings"
	"testing"

	"porelight/solver"
)

func readCSV(t *testing.T, s string) [][]string {
	t.Helper()
	r := csv.NewReader(strings.NewReader(s))
	r.FieldsPerRecord = 0 // every row as long as the header
	recs, err := r.ReadAll()
	if err != nil {
		t.Fatalf("CSV does not parse: %v\n%s", err, s)
	}
	return recs
}

func TestCSV(t *testing.T) {
	t.Parallel()
	r := synthResult()
	c := r.Consolidation
	cases := []struct {
		name     string
		csv      string
		header   []string
		rows     int
		row, col int     // a cell to check
		want     float64 // its value
	}{
		{"isochrones", IsochronesCSV(r), []string{"depth (m)",
			"excess pore pressure at t = 1 day (kPa)", "excess pore pressure at t = 10 day (kPa)",
			"excess pore pressure at t = 30 day (kPa)", "excess pore pressure at t = 100 day (kPa)",
			"excess pore pressure at t = 365 day (kPa)", "excess pore pressure at t = 1000 day (kPa)"},
			len(c.Depth), 40, 4, c.Isochrones[3].Excess[40]},
		{"degree", DegreeCSV(r), []string{"time (day)", "Us by settlement (%)", "Up by pore pressure (%)"},
			len(c.Series.Time), 50, 1, 100 * c.Series.Us[50]},
		{"settlement", SettlementCSV(r), []string{"time (day)", "settlement from mv (m)", "settlement from e-log curves (m)"},
			len(c.Series.Time), 60, 2, c.Series.SettlementElog[60]},
		{"piezometers", PiezometersCSV(r), []string{"time (day)",
			"pore pressure at z = 2.5 m (kPa)", "excess pore pressure at z = 2.5 m (kPa)",
			"pore pressure at z = 6 m (kPa)", "excess pore pressure at z = 6 m (kPa)"},
			len(c.Series.Time), 70, 3, c.Series.Piezometers[1].Pore[70]},
		{"steady", SteadyCSV(r), []string{"depth (m)", "total head (m)", "pore pressure (kPa)",
			"total vertical stress (kPa)", "effective vertical stress (kPa)"},
			len(r.Steady.Depth), 80, 4, r.Steady.Effective[80]},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			recs := readCSV(t, tc.csv)
			if !slices.Equal(recs[0], tc.header) {
				t.Errorf("header %q;\nwant %q", recs[0], tc.header)
			}
			if len(recs)-1 != tc.rows {
				t.Errorf("%d rows; want %d", len(recs)-1, tc.rows)
			}
			got, err := strconv.ParseFloat(recs[1+tc.row][tc.col], 64)
			if err != nil || !closeTo(got, tc.want, 1e-9) {
				t.Errorf("cell [%d][%d] = %q; want %v", tc.row, tc.col, recs[1+tc.row][tc.col], tc.want)
			}
		})
	}
}

func closeTo(a, b, rel float64) bool {
	d := a - b
	if d < 0 {
		d = -d
	}
	m := max(abs(a), abs(b), 1e-300)
	return d <= rel*m
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}

func TestCSVWithoutData(t *testing.T) {
	t.Parallel()
	r := synthResult()
	r.Consolidation.Series.SettlementElog = nil
	r.Consolidation.Series.Us[3] = 0 / zero()
	if got := readCSV(t, SettlementCSV(r))[0]; len(got) != 2 {
		t.Errorf("settlement CSV without e–log has columns %q", got)
	}
	if got := readCSV(t, DegreeCSV(r))[4][1]; got != "" {
		t.Errorf("a NaN cell reads %q; want empty", got)
	}
	for name, csvOf := range map[string]func(*solver.Result) string{
		"isochrones": IsochronesCSV, "degree": DegreeCSV, "settlement": SettlementCSV,
		"piezometers": PiezometersCSV, "steady": SteadyCSV,
	} {
		for _, r := range []*solver.Result{nil, {}} {
			recs := readCSV(t, csvOf(r))
			if len(recs) != 1 || !strings.Contains(recs[0][0], "(") {
				t.Errorf("%s without data: %q; want just a header with units", name, recs)
			}
		}
	}
}

func zero() float64 { return 0 }

// checkSVG parses s as XML and checks the root svg, its id and title, and
// that no number was printed with six decimals.
func checkSVG(t *testing.T, s, id string, standalone bool) {
	t.Helper()
	d := xml.NewDecoder(strings.NewReader(s))
	var root *xml.StartElement
	titled := false
	depth := 0
	for {
		tok, err := d.Token()
		if errors.Is(err, io.EOF) {
			break
		}
		if err != nil {
			t.Fatalf("not well-formed XML: %v", err)
		}
		switch e := tok.(type) {
		case xml.StartElement:
			if root == nil {
				c := e.Copy()
				root = &c
			}
			if depth == 1 && e.Name.Local == "title" {
				titled = true
			}
			depth++
		case xml.EndElement:
			depth--
		}
	}
	if root == nil || root.Name.Local != "svg" {
		t.Fatalf("root is not svg: %v", root)
	}
	if standalone && root.Name.Space != "http://www.w3.org/2000/svg" {
		t.Errorf("root namespace %q", root.Name.Space)
	}
	attrs := map[string]string{}
	for _, a := range root.Attr {
		attrs[a.Name.Local] = a.Value
	}
	if attrs["id"] != id || attrs["viewBox"] == "" || attrs["role"] != "img" {
		t.Errorf("root attributes %v", attrs)
	}
	if !titled {
		t.Error("no <title> child")
	}
	if strings.Contains(s, ".000000") || strings.Contains(s, "NaN") || strings.Contains(s, "Inf") {
		t.Error("unformatted number in the output")
	}
}

func TestStandaloneSVG(t *testing.T) {
	t.Parallel()
	results := brokenResults()
	results["complete"] = synthResult()
	for rname, r := range results {
		for _, fc := range figures {
			t.Run(rname+"/"+fc.name, func(t *testing.T) {
				s := fc.export(synthProject(), r, 700, 450)
				checkSVG(t, s, fc.id, true)
				if !strings.Contains(s, `width="700" height="450" viewBox="0 0 700 450"`) {
					t.Error("size not as requested")
				}
				if strings.Contains(s, "<style") || strings.Contains(s, "href") || strings.Contains(s, "class=") {
					t.Error("the file depends on something outside itself")
				}
			})
		}
	}
}

// TestEscapeText: user text lands in SVG as text, never markup, and the
// characters XML cannot hold are replaced (XML 1.0 §2.2).
func TestEscapeText(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct{ in, want string }{
		{`<b>"x" & 'y'</b>`, "&lt;b&gt;&#34;x&#34; &amp; &#39;y&#39;&lt;/b&gt;"},
		{"a\tb\nc\rd", "a&#x9;b&#xA;c&#xD;d"},
		{"bell\x07", "bell\uFFFD"},
		{"σ'p γ ²", "σ&#39;p γ ²"},
	} {
		var b strings.Builder
		esc(&b, tc.in)
		if b.String() != tc.want {
			t.Errorf("esc(%q) = %q, want %q", tc.in, b.String(), tc.want)
		}
	}
}
