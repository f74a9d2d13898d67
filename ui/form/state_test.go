package form

import (
	"errors"
	"strings"
	"testing"

	"porelight/solver"
)

// TestStateRoundTrip checks that what the inputs show survives
// EncodeState/ReadDraft/Restore and EncodeDraft/ReadDraft/Restore: the
// text as typed, its problems, and the same count of causes.
func TestStateRoundTrip(t *testing.T) {
	tests := []struct {
		name  string
		edits [][2]string // path, text
		count int
	}{
		{"valid, text kept as typed", [][2]string{{"layers[0].k", "2,5e-9"}}, 0},
		{"unreadable text", [][2]string{{"layers[1].mv", "5e-4x"}}, 1},
		{"a wrong value and its echo", [][2]string{{"layers[2].thickness", "-9"}}, 1},
		{"two causes", [][2]string{{"layers[1].mv", "?"}, {"layers[0].thickness", ""}}, 2},
		{"a reading's date", [][2]string{{"monitoring.plates[0].readings[1].t", "2024-01-09"}}, 0},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			f := New(column())
			for _, e := range tt.edits {
				f.Edit(e[0], e[1])
			}
			if got := f.Count(); got != tt.count {
				t.Fatalf("count %d before saving, want %d: %v", got, tt.count, f.Problems())
			}
			for _, enc := range []struct {
				name string
				do   func() ([]byte, error)
			}{{"state", f.EncodeState}, {"draft", f.EncodeDraft}} {
				data, err := enc.do()
				if err != nil {
					t.Fatal(err)
				}
				st, ps := ReadDraft(data)
				if ps != nil {
					t.Fatalf("%s: %v", enc.name, ps)
				}
				g := New(column())
				g.Restore(st)
				for _, e := range tt.edits {
					if got := g.Text(e[0]); got != e[1] {
						t.Errorf("%s: %s shows %q, want %q", enc.name, e[0], got, e[1])
					}
					if a, b := f.Problem(e[0]), g.Problem(e[0]); a != b {
						t.Errorf("%s: %s problem %q, was %q", enc.name, e[0], b, a)
					}
				}
				if got := g.Count(); got != tt.count {
					t.Errorf("%s: count %d after restoring, want %d: %v", enc.name, got, tt.count, g.Problems())
				}
				if got := g.TakeTyped(); got != "" {
					t.Errorf("%s: restored form reports typing into %q", enc.name, got)
				}
			}
		})
	}
}

func TestTakeTyped(t *testing.T) {
	f := New(column())
	f.Edit("layers[0].k", "3e-9")
	if got := f.TakeTyped(); got != "layers[0].k" {
		t.Errorf("after one edit TakeTyped = %q", got)
	}
	if got := f.TakeTyped(); got != "" {
		t.Errorf("a second TakeTyped = %q", got)
	}
	f.Edit("layers[0].k", "4e-9")
	f.RemoveLayer(2)
	if got := f.TakeTyped(); got != "" {
		t.Errorf("after an edit and a removal TakeTyped = %q, want \"\"", got)
	}
	f.Edit("layers[0].k", "4e-9")
	f.Edit("layers[1].k", "4e-9")
	if got := f.TakeTyped(); got != "" {
		t.Errorf("after edits of two inputs TakeTyped = %q, want \"\"", got)
	}
}

func TestReadDraftRefuses(t *testing.T) {
	tests := []struct{ name, data, want string }{
		{"a plain project", `{"format": "porelight/1"}`, "not a draft"},
		{"an unknown field in the project", `{"format": "porelight-draft/1", "project": {"format": "porelight/1", "layerz": []}}`, "project.layerz"},
	}
	for _, tt := range tests {
		_, ps := ReadDraft([]byte(tt.data))
		if ps == nil || !strings.Contains(ps.Error(), tt.want) {
			t.Errorf("%s: %v, want %q", tt.name, ps, tt.want)
		}
	}
	// Typed text for a field no input shows is dropped.
	st, ps := ReadDraft([]byte(`{"format": "porelight-draft/1", "typed": {"layers[0].k": "1", "gammaZ": "2"}, "project": {"format": "porelight/1"}}`))
	if ps != nil || len(st.Typed) != 1 || st.Typed["layers[0].k"] != "1" {
		t.Errorf("typed %v, %v", st.Typed, ps)
	}
}

// TestSolverNamesDrafts checks that the solver's decoder names a draft
// for what it is, by the format the form writes.
func TestSolverNamesDrafts(t *testing.T) {
	data, err := New(column()).EncodeDraft()
	if err != nil {
		t.Fatal(err)
	}
	_, err = solver.Decode(data)
	if !errors.Is(err, solver.ErrNotProject) || !strings.Contains(err.Error(), "draft saved with problems") {
		t.Errorf("solver.Decode of a draft: %v", err)
	}
}
