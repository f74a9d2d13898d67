package solver

import (
	"errors"
	"math"
	"reflect"
	"testing"
)

// rebuild writes steps back as a path with JoinPath and IndexPath.
func rebuild(steps []PathStep) string {
	path := ""
	for _, st := range steps {
		path = JoinPath(path, st.Name)
		if st.Index >= 0 {
			path = IndexPath(path, st.Index)
		}
	}
	return path
}

// The grammar of field paths (path.go): names joined by ".", "[i]" after
// a list's name.
func TestParsePath(t *testing.T) {
	t.Parallel()
	cases := []struct {
		path string
		want []PathStep // nil: refused with ErrPath
	}{
		{"title", []PathStep{{"title", -1}}},
		{"times[3]", []PathStep{{"times", 3}}},
		{"layers[2].ecurve.cc", []PathStep{{"layers", 2}, {"ecurve", -1}, {"cc", -1}}},
		{"monitoring.plates[0].readings[12].t", []PathStep{{"monitoring", -1}, {"plates", 0}, {"readings", 12}, {"t", -1}}},
		{"loads[10].profile[0].z", []PathStep{{"loads", 10}, {"profile", 0}, {"z", -1}}},
		{"", nil},
		{"a..b", nil},
		{".a", nil},
		{"a.", nil},
		{"[1]", nil},
		{"a[1", nil},
		{"a[1]b", nil},
		{"a[]", nil},
		{"a[-1]", nil},
		{"a[+1]", nil},
		{"a[01]", nil}, // would rebuild as "a[1]"
		{"a[0]", []PathStep{{"a", 0}}},
		{"a[ 1]", nil},
		{"a[x]", nil},
		{"a[1][2]", nil},
		{"a[99999999999999999999]", nil}, // does not fit an int
	}
	for _, tc := range cases {
		t.Run(tc.path, func(t *testing.T) {
			t.Parallel()
			got, err := ParsePath(tc.path)
			if tc.want == nil {
				if !errors.Is(err, ErrPath) {
					t.Fatalf("ParsePath(%q) = %v, %v; want an error wrapping ErrPath", tc.path, got, err)
				}
				return
			}
			if err != nil || !reflect.DeepEqual(got, tc.want) {
				t.Fatalf("ParsePath(%q) = %v, %v; want %v", tc.path, got, err, tc.want)
			}
			if back := rebuild(got); back != tc.path {
				t.Errorf("rebuilt %q, want %q", back, tc.path)
			}
		})
	}
}

func TestJoinIndexPath(t *testing.T) {
	t.Parallel()
	cases := []struct{ got, want string }{
		{JoinPath("", "title"), "title"},
		{JoinPath("layers[2]", "k"), "layers[2].k"},
		{JoinPath(JoinPath("layers[2]", "ecurve"), "cc"), "layers[2].ecurve.cc"},
		{IndexPath("layers", 0), "layers[0]"},
		{IndexPath("top.excess", 11), "top.excess[11]"},
	}
	for _, tc := range cases {
		if tc.got != tc.want {
			t.Errorf("got %q, want %q", tc.got, tc.want)
		}
	}
}

// Every path the decoder and Validate report is in the grammar: it
// parses, and rebuilds to itself. The inputs reach every kind of step
// (top-level field, list item, field of an item, item of a nested list).
func TestReportedPathsParse(t *testing.T) {
	t.Parallel()
	var paths []string
	for _, data := range []string{
		`{"format":"porelight/1","layers":[{"thickness":1,"gammaSat":18,"k":1e-9,"mv":1e-4,"ecurve":{"e0":1,"cx":1}}],"top":{"drained":true,"excess":[{"t":"x"}]}}`,
		`{"format":"porelight/1","layers":[{"thickness":1},{"thickness":"1"}],"loads":[{"q":1,"profile":[{"z":0,"value":1,"w":2}]}]}`,
	} {
		_, err := Decode([]byte(data))
		if err == nil {
			t.Fatalf("Decode(%s) accepted a bad file", data)
		}
		for _, pr := range AsProblems(err) {
			paths = append(paths, pr.Path)
		}
	}
	head := 1.0
	p := &Project{
		Format: Format,
		Layers: []Layer{
			{Thickness: -1, GammaSat: 18, K: 1e-9, Mv: 1e-4},
			{Thickness: 1, GammaSat: 18, K: math.NaN(), ECurve: &ECurve{E0: -1, Cc: 0.3, Cr: 0.5}},
		},
		Top:           Boundary{Drained: true, Head: &head, Excess: []TimeValue{{T: 5}, {T: 1}}},
		Loads:         []Load{{Start: -1, Q: 10, Profile: []DepthValue{{Z: 1}, {Z: 0}}}},
		Times:         []float64{10, 1},
		Piezometers:   []float64{-1},
		InitialExcess: []DepthValue{{Z: 2}, {Z: 1}},
		Monitoring: &Monitoring{
			Plates:      []Plate{{Readings: []Reading{{T: 3}, {T: 1}}}},
			Piezometers: []PiezometerRecord{{Depth: -1, Readings: []Reading{{Date: "2024-01-01"}}}},
		},
	}
	for _, pr := range AsProblems(Validate(p)) {
		paths = append(paths, pr.Path)
	}
	// A test that cannot fail is a defect: make sure the inputs above
	// reach nested items, not only top-level fields.
	nested := 0
	for _, path := range paths {
		if path == "" {
			continue // the project as a whole
		}
		steps, err := ParsePath(path)
		if err != nil {
			t.Errorf("reported path %q does not parse: %v", path, err)
			continue
		}
		if back := rebuild(steps); back != path {
			t.Errorf("reported path %q rebuilds as %q", path, back)
		}
		if len(steps) > 2 {
			nested++
		}
	}
	if len(paths) < 10 || nested < 3 {
		t.Errorf("only %d paths, %d of them nested, from the bad inputs: %q", len(paths), nested, paths)
	}
}
