package solver

import (
	"bytes"
	"encoding/json"
	"errors"
	"os"
	"reflect"
	"slices"
	"strings"
	"testing"
)

// Decode refuses, with the field path of each, every unknown field, every
// value of the wrong JSON type, a number that is not finite, a missing or
// different format and anything that is not one JSON object (the file
// format contract in doc.go; paths as in encoding/json's
// UnmarshalTypeError.Field, list indices in brackets).

// decLayer is a valid layer as JSON.
const decLayer = `{"name": "clay", "thickness": 2, "gammaSat": 18, "k": 1e-9, "mv": 5e-4}`

// decValid is a small valid project.
const decValid = `{"format": "porelight/1", "layers": [` + decLayer + `, ` + decLayer + `],
  "waterTable": 1, "top": {"drained": true}, "bottom": {"drained": false}}`

// decProblem is one expected problem: its path and reason.
type decProblem struct {
	path string
	err  error
}

// decCheckProblems asserts that err is a Problems list holding exactly the
// wanted (path, reason) pairs, in any order, that errors.Is finds every
// reason, and that the error text names every path.
func decCheckProblems(t *testing.T, err error, want []decProblem) {
	t.Helper()
	if err == nil {
		t.Fatalf("no error, want %v", want)
	}
	var ps Problems
	if !errors.As(err, &ps) {
		t.Fatalf("error %T (%v) is not a Problems list", err, err)
	}
	var got []decProblem
	for _, p := range ps {
		got = append(got, decProblem{p.Path, p.Err})
		if p.Message == "" || p.Err == nil {
			t.Errorf("problem at %q has message %q and reason %v", p.Path, p.Message, p.Err)
		}
	}
	key := func(a, b decProblem) int { return strings.Compare(a.path+a.err.Error(), b.path+b.err.Error()) }
	slices.SortFunc(got, key)
	want = slices.Clone(want)
	slices.SortFunc(want, key)
	if !reflect.DeepEqual(got, want) {
		t.Errorf("problems\n%v\nwant\n%v", ps, want)
	}
	for _, w := range want {
		if !errors.Is(err, w.err) {
			t.Errorf("errors.Is(err, %q) = false", w.err)
		}
		if w.path != "" && !strings.Contains(err.Error(), w.path+": ") {
			t.Errorf("error text %q does not name %q", err.Error(), w.path)
		}
	}
}

func TestDecodeRefuses(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name string
		json string
		want []decProblem
	}{
		{"unknown nested field", `{"format": "porelight/1", "layers": [` + decLayer + `, {"thickness": 1, "gammaSat": 18, "kk": 1e-9}]}`,
			[]decProblem{{"layers[1].kk", ErrUnknown}}},
		{"unknown field in an object", `{"format": "porelight/1", "top": {"drained": true, "hed": 2}}`,
			[]decProblem{{"top.hed", ErrUnknown}}},
		{"names are case-sensitive", `{"format": "porelight/1", "Layers": []}`,
			[]decProblem{{"Layers", ErrUnknown}}},
		{"wrong format", `{"format": "porelight/2", "layers": [` + decLayer + `]}`,
			[]decProblem{{"format", ErrFormat}}},
		{"no format", `{"layers": [` + decLayer + `]}`,
			[]decProblem{{"format", ErrRequired}}},
		{"null format", `{"format": null}`,
			[]decProblem{{"format", ErrRequired}}},
		{"format not text", `{"format": 1}`,
			[]decProblem{{"format", ErrSyntax}}},
		{"text for a number", `{"format": "porelight/1", "layers": [{"thickness": "2"}]}`,
			[]decProblem{{"layers[0].thickness", ErrSyntax}}},
		{"object for a list", `{"format": "porelight/1", "layers": {}}`,
			[]decProblem{{"layers", ErrSyntax}}},
		{"list for an object", `{"format": "porelight/1", "top": []}`,
			[]decProblem{{"top", ErrSyntax}}},
		{"text for true/false", `{"format": "porelight/1", "top": {"drained": "yes"}}`,
			[]decProblem{{"top.drained", ErrSyntax}}},
		{"fraction for a whole number", `{"format": "porelight/1", "mesh": {"order": 1.5}}`,
			[]decProblem{{"mesh.order", ErrSyntax}}},
		{"list item of the wrong type", `{"format": "porelight/1", "times": [1, "ten"]}`,
			[]decProblem{{"times[1]", ErrSyntax}}},
		{"number too large (no NaN or Inf in JSON)", `{"format": "porelight/1", "layers": [{"thickness": 2, "k": 1e999}]}`,
			[]decProblem{{"layers[0].k", ErrNotFinite}}},
		{"negative overflow", `{"format": "porelight/1", "waterTable": -1e400}`,
			[]decProblem{{"waterTable", ErrNotFinite}}},
		{"text after the object", decValid + ` {"format": "porelight/1"}`,
			[]decProblem{{"", ErrSyntax}}},
		{"brace after the object", decValid + `}`,
			[]decProblem{{"", ErrSyntax}}},
		{"not an object", `[` + decValid + `]`,
			[]decProblem{{"", ErrSyntax}}},
		{"null", `null`,
			[]decProblem{{"", ErrSyntax}}},
		{"empty", ``,
			[]decProblem{{"", ErrSyntax}}},
		{"cut short", decValid[:40],
			[]decProblem{{"", ErrSyntax}}},
		{"too large", `{"format": "porelight/1", "notes": "` + strings.Repeat("x", MaxFileBytes) + `"}`,
			[]decProblem{{"", ErrTooLarge}}},
		// Every problem at once, each with its own path.
		{"several problems", `{"format": "porelight/2", "titel": "x", "gammaW": "9.81",
			"layers": [{"thickness": 2, "gammaSat": 19, "k": 1e999, "mv": 1e-4}, {"thickness": 1, "gammaSat": 19, "kk": 1e-6}],
			"top": {"drained": "yes"}, "mesh": {"order": 1.5}}`,
			[]decProblem{
				{"format", ErrFormat}, {"titel", ErrUnknown}, {"gammaW", ErrSyntax},
				{"layers[0].k", ErrNotFinite}, {"layers[1].kk", ErrUnknown},
				{"top.drained", ErrSyntax}, {"mesh.order", ErrSyntax},
			}},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p, err := Decode([]byte(tc.json))
			if p != nil {
				t.Errorf("Decode returned a project with the error")
			}
			decCheckProblems(t, err, tc.want)
		})
	}
}

// Problems come out in the same order on every run (the keys of a JSON
// object are visited in sorted order, not Go's random map order).
func TestDecodeProblemOrderIsStable(t *testing.T) {
	t.Parallel()
	in := []byte(`{"format": "porelight/1", "a": 1, "b": 2, "c": 3, "d": 4, "e": 5, "f": 6, "g": 7, "h": 8, "i": 9}`)
	_, err := Decode(in)
	first := err.Error()
	for range 20 {
		if _, err := Decode(in); err.Error() != first {
			t.Fatalf("problem order changed:\n%v\nthen\n%v", first, err)
		}
	}
}

// Decode reads values, it does not judge them: a negative thickness, a
// zero k and an empty layer list decode, and Validate (which Solve runs)
// refuses them with their paths.
func TestDecodeThenValidate(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name string
		json string
		want []decProblem
	}{
		{"negative thickness", `{"format": "porelight/1", "layers": [{"thickness": -2, "gammaSat": 18, "k": 1e-9, "mv": 5e-4}]}`,
			[]decProblem{{"layers[0].thickness", ErrNotPositive}}},
		{"zero k", `{"format": "porelight/1", "layers": [` + decLayer + `, {"thickness": 2, "gammaSat": 18, "k": 0, "mv": 5e-4}]}`,
			[]decProblem{{"layers[1].k", ErrNotPositive}}},
		{"empty layers", `{"format": "porelight/1", "layers": []}`,
			[]decProblem{{"layers", ErrRequired}}},
		{"no layers", `{"format": "porelight/1"}`,
			[]decProblem{{"layers", ErrRequired}}},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p, err := Decode([]byte(tc.json))
			if err != nil {
				t.Fatalf("Decode: %v", err)
			}
			decCheckProblems(t, Validate(p), tc.want)
			r, err := Solve(p, nil)
			if r != nil {
				t.Errorf("Solve returned a result for an invalid project")
			}
			decCheckProblems(t, err, tc.want)
		})
	}
}

func TestDecodeValid(t *testing.T) {
	t.Parallel()
	p, err := Decode([]byte(decValid))
	if err != nil {
		t.Fatalf("Decode: %v", err)
	}
	if len(p.Layers) != 2 || p.Layers[1].K != 1e-9 || p.WaterTable != 1 || !p.Top.Drained || p.Bottom.Drained {
		t.Errorf("decoded %+v", p)
	}
	if err := Validate(p); err != nil {
		t.Errorf("Validate: %v", err)
	}
	// A byte order mark, which some editors write, is not an error.
	if _, err := Decode([]byte("\xef\xbb\xbf" + decValid)); err != nil {
		t.Errorf("with a byte order mark: %v", err)
	}
	// null leaves the zero value, as encoding/json does.
	p, err = Decode([]byte(`{"format": "porelight/1", "gammaW": null, "layers": [` + decLayer + `], "loads": null}`))
	if err != nil || p.GammaW != 0 || p.Loads != nil {
		t.Errorf("nulls: %+v, %v", p, err)
	}
}

// A project written by Encode decodes to the same value, every field set.
func TestEncodeDecodeRoundTrip(t *testing.T) {
	t.Parallel()
	head, removal := -0.5, 1
	full := &Project{
		Format: Format, Title: "Round trip", Notes: "Invented.",
		Units:  &Units{Length: "m", Stress: "kPa", Time: "day", K: "m/s"},
		GammaW: 9.807,
		Layers: []Layer{
			{Name: "crust", Thickness: 1.5, GammaSat: 18.5, Gamma: 17.5, K: 5e-9, Mv: 2e-4,
				ECurve: &ECurve{E0: 0.9, Cc: 0.25, Cr: 0.03, OCR: 3}},
			{Name: "clay", Thickness: 4, GammaSat: 16, K: 1.5e-9,
				ECurve: &ECurve{E0: 1.8, Cc: 0.9, Cr: 0.09, SigmaP: 60}, Calpha: 0.012},
		},
		WaterTable:    1.0 / 3,
		Top:           Boundary{Drained: true, Head: &head, Excess: []TimeValue{{0, 0}, {30, -10}}},
		Bottom:        Boundary{Inflow: 1e-9},
		Loads:         []Load{{Start: 0, Ramp: 20, Q: 40, Profile: []DepthValue{{0, 1}, {5.5, 0.7}}}, {Start: 400, Q: -20}},
		InitialExcess: []DepthValue{{0, 10}, {5.5, 0}},
		Times:         []float64{1, 10, 100},
		Piezometers:   []float64{2.5},
		TargetDegree:  0.9,
		DesignLife:    10000,
		Decisions: &Decisions{Handover: 500, Surcharge: &SurchargeDesign{Removal: &removal, WithSecondary: true, RemoveBy: 600},
			Strength: &StrengthCheck{FS: 1.4, Times: []float64{100, 200}, Laws: []StrengthLaw{
				{Layer: 0, Law: StrengthSHANSEP, S: 0.25, M: 0.8}, {Layer: 1, Law: StrengthMeasured, Su0: []DepthValue{{2, 10}, {5, 20}}, Gain: 0.2}}}},
		Mesh:     MeshSettings{Order: 2, MaxSize: 0.05, MinPerLayer: 6},
		Stepping: Stepping{Theta: 0.6, DampedSteps: -1, FirstStep: 0.01, Growth: 1.1, EndTime: 20000},
	}
	demo, err := os.ReadFile("../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	fromDemo, err := Decode(demo)
	if err != nil {
		t.Fatalf("demo: %v", err)
	}
	for name, p := range map[string]*Project{"every field": full, "demo": fromDemo} {
		data, err := Encode(p)
		if err != nil {
			t.Fatalf("%s: Encode: %v", name, err)
		}
		back, err := Decode(data)
		if err != nil {
			t.Fatalf("%s: Decode of Encode: %v", name, err)
		}
		if !reflect.DeepEqual(back, p) {
			t.Errorf("%s: round trip changed the project:\n%+v\nwant\n%+v", name, back, p)
		}
	}
}

// FuzzDecode: Decode never panics; a refusal is a non-empty Problems list
// whose every entry has one of the Err* reasons and a message; an
// accepted project survives Validate and re-encodes to the same bytes.
func FuzzDecode(f *testing.F) {
	demo, err := os.ReadFile("../testdata/demo.json")
	if err != nil {
		f.Fatal(err)
	}
	for _, s := range []string{decValid, string(demo), `{}`, `{"format": "porelight/1", "layers": [{"k": 1e999}]}`, `[`, `{"format": "porelight/1"} x`} {
		f.Add([]byte(s))
	}
	reasons := []error{ErrRequired, ErrNotFinite, ErrNotPositive, ErrNegative, ErrOutOfRange, ErrNotSorted,
		ErrUnknown, ErrFormat, ErrSyntax, ErrNotProject, ErrConflict, ErrTooLarge}
	f.Fuzz(func(t *testing.T, data []byte) {
		p, err := Decode(data)
		if err != nil {
			ps := AsProblems(err)
			if len(ps) == 0 {
				t.Fatalf("error with no problems: %v", err)
			}
			for _, q := range ps {
				if q.Message == "" || !slices.Contains(reasons, q.Err) {
					t.Fatalf("problem %+v has no message or an unlisted reason", q)
				}
			}
			return
		}
		_ = Validate(p)
		once, err := Encode(p)
		if err != nil {
			t.Fatal(err)
		}
		p2, err := Decode(once)
		if err != nil {
			t.Fatalf("Decode of Encode: %v\n%s", err, once)
		}
		twice, _ := Encode(p2)
		if !bytes.Equal(once, twice) {
			t.Fatalf("re-encoding changed the bytes:\n%s\n%s", once, twice)
		}
	})
}

// A file that is not valid JSON is refused with the line and column of
// the mistake (1-based, counted in characters, as a text editor shows
// them), and a file of another kind is named for what it is. The
// positions are counted by hand in the literals below.
func TestDecodeSaysWhere(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name   string
		json   string
		path   string
		reason error
		says   string
	}{
		{"bad character on line 3", "{\n  \"format\": \"porelight/1\",\n  \"title\": x\n}", "", ErrSyntax,
			"line 3, column 12: invalid character 'x' looking for beginning of value"},
		{"missing comma", "{\"format\": \"porelight/1\"\n \"title\": \"a\"}", "", ErrSyntax,
			"line 2, column 2: invalid character '\"' after object key:value pair"},
		// "é" is two bytes but one column.
		{"columns count characters", "{\"title\": \"é\", x}", "", ErrSyntax, "line 1, column 16: invalid character 'x'"},
		{"cut short", "{\n \"format\": \"porelight/1\",\n \"layers\": [", "", ErrSyntax,
			"line 3, column 12: the file ends in the middle of the project"},
		{"empty", " \n", "", ErrSyntax, "the file is empty"},
		{"text after the object", decValid + "\n\n  {}", "", ErrSyntax, "line 4, column 3: text after the end of the project"},
		{"a brace too many", "{\"format\": \"porelight/1\"}\n}", "", ErrSyntax, "line 2, column 1: invalid character '}' after top-level value"},
		{"results file", `{"steady": {"depth": [0, 1]}, "summary": {}, "warnings": [], "stats": {}}`, "", ErrNotProject,
			"this is a results file, not a project — open a project file"},
		{"draft", `{"format": "porelight-draft/1", "note": "…", "project": {"format": "porelight/1"}}`, "", ErrNotProject,
			"this is a draft saved with problems"},
		{"refusal answer", `{"error": {"problems": [{"path": "", "message": "x"}]}}`, "", ErrNotProject, "not a project — open a project file"},
		{"CSV", "time,settlement\n0,0\n10,0.012\n", "", ErrNotProject, "this is not a project file (it looks like CSV"},
		{"CSV with semicolons", "0;0\n10;0,012\n", "", ErrNotProject, "(it looks like CSV"},
		{"plain text", "notes from the site visit\n", "", ErrNotProject, "this is not a project file (it looks like text)"},
		{"HTML", "<!doctype html><html></html>", "", ErrNotProject, "(it looks like HTML or XML)"},
		{"binary", "\x1f\x8b\x08\x00\x00\x00", "", ErrNotProject, "(it looks like a binary file"},
		// A type error keeps its field path (checkShape; no position) and
		// does not call valid JSON invalid.
		{"type error names the field", `{"format": "porelight/1", "top": {"drained": "yes"}}`, "top.drained", ErrSyntax,
			"must be true or false in JSON, not text"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			p, err := Decode([]byte(c.json))
			if p != nil {
				t.Fatal("Decode returned a project")
			}
			ps := AsProblems(err)
			if len(ps) != 1 {
				t.Fatalf("%d problems, want 1: %v", len(ps), err)
			}
			if ps[0].Path != c.path || !errors.Is(ps[0], c.reason) {
				t.Errorf("path %q, reason %v; want %q, %v", ps[0].Path, ps[0].Err, c.path, c.reason)
			}
			if !strings.Contains(ps[0].Message, c.says) {
				t.Errorf("message %q does not say %q", ps[0].Message, c.says)
			}
		})
	}
}

// syntaxProblem reads encoding/json's own errors: a type error found by
// json.Unmarshal (a case the shape check normally catches first) keeps
// the field path and gets the position of the value.
func TestSyntaxProblemTypeError(t *testing.T) {
	t.Parallel()
	data := []byte("{\n \"gammaW\": \"heavy\"}")
	var p Project
	err := json.Unmarshal(data, &p)
	pr := syntaxProblem(data, err)
	if pr.Path != "gammaW" || !errors.Is(pr, ErrSyntax) || !strings.HasPrefix(pr.Message, "line 2, column ") {
		t.Errorf("got %+v", pr)
	}
}
