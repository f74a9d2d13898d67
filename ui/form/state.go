package form

import (
	"encoding/json"
	"errors"
	"fmt"
	"maps"
	"slices"
	"sort"

	"porelight/solver"
	"porelight/ui/units"
)

// State is everything the inputs show: the draft, problems and all, and
// the text typed where it differs from the draft's formatting (text that
// does not read as a value included). It is what the page's undo history,
// its autosave and a draft file keep, so that nothing typed is lost.
type State struct {
	Project *solver.Project   `json:"project"`
	Typed   map[string]string `json:"typed,omitempty"`
	// Units is the system the typed text was typed in ("" for SI).
	Units string `json:"units,omitempty"`
}

// typedUnits is the key of the system the typed text is in, "" for SI.
func (f *Form) typedUnits() string {
	if f.sys == units.SI {
		return ""
	}
	return f.sys.String()
}

// State returns a deep copy of what the inputs show.
func (f *Form) State() State {
	return State{Project: cloneProject(&f.draft), Typed: maps.Clone(f.raw), Units: f.typedUnits()}
}

// Restore makes s what the inputs show, as State returned it: the draft
// becomes a copy of s.Project, then each text typed is taken again as if
// typed (so an input shows its text, and text that does not read as a
// value has its problem). When s.Project without the typed text is valid,
// it is the last valid draft that tells causes from echoes (echo.go).
func (f *Form) Restore(s State) {
	if s.Project == nil {
		s.Project = &solver.Project{Format: solver.Format}
	}
	f.draft = *cloneProject(s.Project)
	f.good = nil
	f.raw = map[string]string{}
	f.bad = map[string]string{}
	f.check()
	shown := f.sys
	f.sys, _ = units.Parse(s.Units) // the typed text reads in the units it was typed in
	defer f.SetUnits(shown)
	paths := slices.Sorted(maps.Keys(s.Typed))
	for _, path := range paths {
		text := s.Typed[path]
		f.raw[path] = text
		if _, msg := f.apply(path, text); msg != "" {
			f.bad[path] = msg
		}
	}
	f.check()
	f.typed, f.changes = "", 0
}

// saved is the project a state is stored with: the draft, but each input
// whose value has a problem holds the last valid value (its text, kept in
// Typed, is taken again by Restore), so that a restored draft still tells
// causes from echoes.
func (f *Form) saved() *solver.Project {
	p := cloneProject(&f.draft)
	if f.good == nil {
		return p
	}
	for path := range f.probs {
		if _, typed := f.raw[path]; !typed {
			continue
		}
		if was, ok := getNumber(f.good, path); ok {
			_ = setNumber(p, path, was)
		}
	}
	return p
}

// TakeTyped reports the input typed into since the last call, when the
// only change since then was text typed into that one input (so that an
// undo history can make one step of a run of keystrokes), and else "".
func (f *Form) TakeTyped() string {
	p := f.typed
	if f.changes != 1 {
		p = ""
	}
	f.typed, f.changes = "", 0
	return p
}

// Problems lists every problem once, by its cause: the inputs with a
// problem (the text typed, or what Validate says of the value), in path
// order, then the problems no input shows. Its length is Count.
func (f *Form) Problems() []FieldProblem {
	var out []FieldProblem
	for _, p := range f.ProblemsUnder("") {
		if _, typed := f.bad[p.Path]; typed || !f.echo[p.Path] {
			out = append(out, p)
		}
	}
	for _, p := range f.other {
		out = append(out, FieldProblem{p.Path, p.Message})
	}
	return out
}

// DraftFormat marks a file that holds a draft: a project saved with its
// problems and the text as typed. solver.Decode refuses it by its format;
// ReadDraft reads it.
const DraftFormat = "porelight-draft/1"

// draftFile is the layout of a draft file.
type draftFile struct {
	Format   string            `json:"format"`
	Note     string            `json:"note,omitempty"`
	Problems []FieldProblem    `json:"problems,omitempty"`
	Typed    map[string]string `json:"typed,omitempty"`
	Units    string            `json:"units,omitempty"` // the system Typed is in; "" for SI
	Project  json.RawMessage   `json:"project"`
}

// MarshalJSON writes a problem as {"path", "message"}, as the solver's
// problems are written.
func (p FieldProblem) MarshalJSON() ([]byte, error) {
	return json.Marshal(struct {
		Path    string `json:"path,omitempty"`
		Message string `json:"message"`
	}{p.Path, p.Message})
}

// UnmarshalJSON reads what MarshalJSON writes.
func (p *FieldProblem) UnmarshalJSON(b []byte) error {
	var v struct {
		Path    string `json:"path"`
		Message string `json:"message"`
	}
	err := json.Unmarshal(b, &v)
	p.Path, p.Message = v.Path, v.Message
	return err
}

// EncodeDraft writes what the inputs show as a draft file: the draft
// project (an input whose value has a problem with its last valid value),
// the text typed and the problems, with a note saying that the
// file is a draft and how many problems it has. Use it when the form is
// not Valid (and for the autosave); a valid form saves as a plain project
// (solver.Encode of Model).
func (f *Form) EncodeDraft() ([]byte, error) {
	proj, err := json.Marshal(f.saved())
	if err != nil {
		return nil, err
	}
	ps := f.Problems()
	note := "A draft saved from Porelight with the text as typed; it has no problems."
	switch n := len(ps); {
	case n == 1:
		note = "A draft saved from Porelight with 1 problem (listed below) and the text as typed; Porelight reopens it with the problem shown. Fix it to make this a project the solver accepts."
	case n > 1:
		note = fmt.Sprintf("A draft saved from Porelight with %d problems (listed below) and the text as typed; Porelight reopens it with the problems shown. Fix them to make this a project the solver accepts.", n)
	}
	d := draftFile{Format: DraftFormat, Note: note, Problems: ps, Typed: f.raw, Units: f.typedUnits(), Project: proj}
	return json.MarshalIndent(d, "", "  ")
}

// EncodeState writes what the inputs show compactly, as a draft file
// without its note and problems: the form of the page's autosave and undo
// history, which ReadDraft reads back.
func (f *Form) EncodeState() ([]byte, error) {
	proj, err := json.Marshal(f.saved())
	if err != nil {
		return nil, err
	}
	return json.Marshal(draftFile{Format: DraftFormat, Typed: f.raw, Units: f.typedUnits(), Project: proj})
}

// ErrNotDraft says data is not a draft file (it may be a plain project).
var ErrNotDraft = errors.New("not a draft file")

// IsDraft reports whether data is a draft file, by its format.
func IsDraft(data []byte) bool {
	var head struct {
		Format string `json:"format"`
	}
	return json.Unmarshal(data, &head) == nil && head.Format == DraftFormat
}

// ReadDraft reads a draft file written by EncodeDraft. The project inside
// is decoded by solver.Decode, so it has the shape of a project (unknown
// fields and wrong types are refused with their paths), but it is not
// validated: the form shows its problems once restored. ErrNotDraft means
// data is not a draft file.
func ReadDraft(data []byte) (State, solver.Problems) {
	if !IsDraft(data) {
		return State{}, solver.Problems{{Path: "format", Err: ErrNotDraft, Message: "not a draft file"}}
	}
	var d draftFile
	if err := json.Unmarshal(data, &d); err != nil {
		return State{}, solver.AsProblems(err)
	}
	p, err := solver.Decode(d.Project)
	if err != nil {
		ps := solver.AsProblems(err)
		for i := range ps {
			ps[i].Path = solver.JoinPath("project", ps[i].Path)
		}
		return State{}, ps
	}
	// Typed text only for inputs that exist: a damaged or edited file must
	// not make the form edit a field no input shows.
	typed := map[string]string{}
	keys := make([]string, 0, len(d.Typed))
	for k := range d.Typed {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		if onPage(k) {
			typed[k] = d.Typed[k]
		}
	}
	if _, ok := units.Parse(d.Units); !ok && d.Units != "" {
		return State{}, solver.Problems{{Path: "units", Message: fmt.Sprintf("%q is not a unit system (si or us)", d.Units)}}
	}
	return State{Project: p, Typed: typed, Units: d.Units}, nil
}
