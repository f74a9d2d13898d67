package ui

import (
	"encoding/json"
	"fmt"
	"strings"
	"testing"
	"time"

	"porelight/ui/form"
)

// TestHistory checks the undo history on its own: steps, runs of
// keystrokes, the bound, undo and redo.
func TestHistory(t *testing.T) {
	t0 := time.Date(2026, 1, 1, 0, 0, 0, 0, time.UTC)
	at := func(s float64) time.Time { return t0.Add(time.Duration(s * float64(time.Second))) }
	type op struct {
		kind  string // "rec", "undo", "redo"
		state string
		typed string
		t     float64 // seconds
	}
	tests := []struct {
		name       string
		ops        []op
		undo, redo []string // the stacks after the ops
		cur        string
	}{
		{"first state is no step", []op{{"rec", `"a"`, "", 0}}, nil, nil, `"a"`},
		{"same state is no step", []op{{"rec", `"a"`, "", 0}, {"rec", `"a"`, "", 1}}, nil, nil, `"a"`},
		{"two edits, two steps", []op{{"rec", `"a"`, "", 0}, {"rec", `"b"`, "", 1}, {"rec", `"c"`, "x", 2}},
			[]string{`"a"`, `"b"`}, nil, `"c"`},
		{"a run of keystrokes is one step", []op{{"rec", `"a"`, "", 0}, {"rec", `"b"`, "x", 1}, {"rec", `"c"`, "x", 1.5}, {"rec", `"d"`, "x", 3}},
			[]string{`"a"`}, nil, `"d"`},
		{"a pause ends the run", []op{{"rec", `"a"`, "", 0}, {"rec", `"b"`, "x", 1}, {"rec", `"c"`, "x", 1 + typingPause.Seconds()}},
			[]string{`"a"`, `"b"`}, nil, `"c"`},
		{"another input ends the run", []op{{"rec", `"a"`, "", 0}, {"rec", `"b"`, "x", 1}, {"rec", `"c"`, "y", 1.1}},
			[]string{`"a"`, `"b"`}, nil, `"c"`},
		{"undo then redo", []op{{"rec", `"a"`, "", 0}, {"rec", `"b"`, "", 1}, {"rec", `"c"`, "", 2}, {"undo", "", "", 3}, {"undo", "", "", 3}, {"redo", "", "", 4}},
			[]string{`"a"`}, []string{`"c"`}, `"b"`},
		{"an edit after undo drops the redo", []op{{"rec", `"a"`, "", 0}, {"rec", `"b"`, "", 1}, {"undo", "", "", 2}, {"rec", `"z"`, "", 3}},
			[]string{`"a"`}, nil, `"z"`},
		{"typing after undo starts a step", []op{{"rec", `"a"`, "", 0}, {"rec", `"b"`, "x", 1}, {"undo", "", "", 1.2}, {"rec", `"c"`, "x", 1.3}},
			[]string{`"a"`}, nil, `"c"`},
		{"undo with nothing to undo", []op{{"rec", `"a"`, "", 0}, {"undo", "", "", 1}, {"redo", "", "", 2}}, nil, nil, `"a"`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			var h history
			for _, o := range tt.ops {
				switch o.kind {
				case "rec":
					h.record(o.state, o.typed, at(o.t))
				case "undo":
					h.back()
				case "redo":
					h.forward()
				}
			}
			if fmt.Sprint(h.undo) != fmt.Sprint(tt.undo) || fmt.Sprint(h.redo) != fmt.Sprint(tt.redo) || h.cur != tt.cur {
				t.Errorf("undo %v redo %v cur %s, want %v %v %s", h.undo, h.redo, h.cur, tt.undo, tt.redo, tt.cur)
			}
		})
	}
}

// TestHistoryBound checks that only the last HistorySteps steps stay.
func TestHistoryBound(t *testing.T) {
	var h history
	for i := range HistorySteps + 25 {
		h.record(fmt.Sprintf("%d", i), "", time.Time{})
	}
	if len(h.undo) != HistorySteps || h.undo[0] != "24" {
		t.Fatalf("%d steps kept, oldest %s; want %d, oldest 24", len(h.undo), h.undo[0], HistorySteps)
	}
	n := 0
	for h.canUndo() {
		h.back()
		n++
	}
	if n != HistorySteps || h.cur != "24" {
		t.Errorf("undid %d steps to %s, want %d to 24", n, h.cur, HistorySteps)
	}
}

// TestHistoryStored checks the stored history: written as JSON, read back
// with an autosave that moved on by a run of keystrokes.
func TestHistoryStored(t *testing.T) {
	var h history
	for _, s := range []string{`{"a":1}`, `{"a":2}`, `{"a":3}`} {
		h.record(s, "", time.Time{})
	}
	h.back() // redo holds {"a":3}
	data := h.encode()
	if !json.Valid([]byte(data)) {
		t.Fatalf("stored history is not JSON: %s", data)
	}
	tests := []struct {
		name, autosave string
		undo, redo     string
	}{
		{"same autosave", `{"a":2}`, `[{"a":1}]`, `[{"a":3}]`},
		{"autosave typed on", `{"a":2.5}`, `[{"a":1} {"a":2}]`, `[]`},
	}
	for _, tt := range tests {
		var g history
		if !g.decode(data, tt.autosave) {
			t.Fatalf("%s: not read", tt.name)
		}
		if fmt.Sprint(g.undo) != tt.undo || fmt.Sprint(g.redo) != tt.redo || g.cur != tt.autosave {
			t.Errorf("%s: undo %v redo %v cur %s", tt.name, g.undo, g.redo, g.cur)
		}
	}
	var g history
	if g.decode("{broken", `{"a":2}`) || g.canUndo() {
		t.Error("a broken stored history was read")
	}
}

// TestUndoDestructive checks that each removal and replacement of the
// project comes back with Undo, and goes again with Redo.
func TestUndoDestructive(t *testing.T) {
	tests := []struct {
		name string
		do   func(p *page)
		same func(p *page) string // what the action changes
	}{
		{"remove a layer", func(p *page) { p.fire("layers-1-remove", "click", nil) },
			func(p *page) string {
				return fmt.Sprint(len(p.root.form.Draft().Layers), p.root.form.Draft().Layers[1].Name)
			}},
		{"remove a stage", func(p *page) { p.fire("loads-0-remove", "click", nil) },
			func(p *page) string { return fmt.Sprint(p.root.form.Draft().Loads) }},
		{"remove a plate with its readings", func(p *page) {
			p.root.fold.records = true
			p.build()
			p.fire("monitoring-plates-0-remove", "click", nil)
		}, func(p *page) string {
			m := p.root.form.Draft().Monitoring
			return fmt.Sprint(len(m.Plates), len(m.Plates[0].Readings), m.Plates[0].Name)
		}},
		{"demo over edits", func(p *page) {
			p.fire("open-demo", "click", nil)
			p.fire("confirm-replace", "click", nil)
		}, func(p *page) string { return p.root.form.Text("layers[0].k") }},
		{"new project over edits", func(p *page) {
			p.fire("new-project", "click", nil)
			p.fire("confirm-replace", "click", nil)
		}, func(p *page) string {
			return fmt.Sprint(len(p.root.form.Draft().Layers), p.root.form.Text("layers[0].k"))
		}},
		{"open a file", func(p *page) {
			p.host.file, p.host.fileName = mustEncode(p.t, NewProject()), "other.json"
			p.fire("open-file", "change", nil)
		}, func(p *page) string {
			return fmt.Sprint(len(p.root.form.Draft().Layers), p.root.form.Text("layers[0].k"))
		}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			p := newPage(t, Sources{})
			p.typeInto("layers-0-k", "6e-9x") // unsaved work, invalid on purpose
			before := tt.same(p)
			tt.do(p)
			p.build()
			after := tt.same(p)
			if after == before {
				t.Fatalf("the action changed nothing: %s", after)
			}
			p.fire("undo", "click", nil)
			if got := tt.same(p); got != before {
				t.Errorf("after Undo %s, want %s", got, before)
			}
			if got := p.value("layers-0-k"); got != "6e-9x" {
				t.Errorf("after Undo layer 1 k shows %q, want the text typed", got)
			}
			p.fire("redo", "click", nil)
			if got := tt.same(p); got != after {
				t.Errorf("after Redo %s, want %s", got, after)
			}
		})
	}
}

func mustEncode(t testing.TB, p any) []byte {
	t.Helper()
	data, err := json.Marshal(p)
	if err != nil {
		t.Fatal(err)
	}
	return data
}

// TestReplaceAsks checks that Demo and New project ask before replacing
// unsaved work, and not when nothing is unsaved.
func TestReplaceAsks(t *testing.T) {
	p := newPage(t, Sources{})
	p.fire("new-project", "click", nil) // the demo, unchanged: no question
	if p.find("confirm") != nil || len(p.root.form.Draft().Layers) != 1 {
		t.Fatalf("New project over the unchanged demo asked, or did nothing (%d layers)", len(p.root.form.Draft().Layers))
	}
	p.typeInto("layers-0-thickness", "7")
	p.fire("open-demo", "click", nil)
	if p.find("confirm") == nil || p.root.form.Text("layers[0].thickness") != "7" {
		t.Fatal("Demo replaced unsaved work without asking")
	}
	p.fire("confirm-keep", "click", nil)
	if p.find("confirm") != nil || p.root.form.Text("layers[0].thickness") != "7" {
		t.Fatal("Keep editing did not keep the work")
	}
	p.fire("save-project", "click", nil) // saved: no question now
	p.fire("open-demo", "click", nil)
	if p.find("confirm") != nil || len(p.root.form.Draft().Layers) != 5 {
		t.Errorf("Demo after Save asked, or did not open the demo")
	}
}

// TestTypingIsOneStep checks that a run of keystrokes in one input is
// undone at once, and that Undo is off with nothing to undo.
func TestTypingIsOneStep(t *testing.T) {
	p := newPage(t, Sources{})
	if p.attr("undo", "disabled") == "" {
		t.Error("Undo is on with nothing to undo")
	}
	k0 := p.value("layers-1-k")
	for _, s := range []string{"2", "2e", "2e-", "2e-9"} {
		p.typeInto("layers-1-k", s)
	}
	p.typeInto("layers-1-mv", "1e-3")
	p.fire("undo", "click", nil)
	if got := p.value("layers-1-k"); got != "2e-9" {
		t.Errorf("first Undo left k %q, want 2e-9", got)
	}
	p.fire("undo", "click", nil)
	if got := p.value("layers-1-k"); got != k0 {
		t.Errorf("second Undo left k %q, want %q", got, k0)
	}
	if p.attr("undo", "disabled") == "" || p.attr("redo", "disabled") != "" {
		t.Error("after undoing everything Undo should be off and Redo on")
	}
}

// TestDraftKept checks that the autosave keeps text that is not a value,
// and that a reload restores it with the problem and the history.
func TestDraftKept(t *testing.T) {
	p := newPage(t, Sources{})
	p.typeInto("layers-2-mv", "5e-5x")
	p.typeInto("waterTable", "1.25")
	q := newPage(t, Sources{Autosave: p.host.store[AutosaveKey], History: p.host.store[HistoryKey]})
	if got := q.value("layers-2-mv"); got != "5e-5x" {
		t.Errorf("after reload layer 3 mv shows %q, want the text typed", got)
	}
	if got := q.value("waterTable"); got != "1.25" {
		t.Errorf("after reload the water table shows %q", got)
	}
	if got := q.text("layers-2-mv-err"); got != "not a number" {
		t.Errorf("after reload the problem reads %q", got)
	}
	q.fire("undo", "click", nil)
	if got := q.value("waterTable"); got == "1.25" {
		t.Error("Undo after reload did not reach the step before the reload")
	}
	// An autosave from before drafts (a plain project) still opens.
	r := newPage(t, Sources{Autosave: string(mustEncode(t, NewProject()))})
	if len(r.root.form.Draft().Layers) != 1 {
		t.Error("a plain autosaved project did not open")
	}
}

// TestSaveDraftReopens checks that Save with problems writes a draft that
// says so, and that opening it shows the problems and the text typed.
func TestSaveDraftReopens(t *testing.T) {
	p := newPage(t, Sources{})
	p.typeInto("layers-0-k", "fast")
	p.typeInto("layers-3-thickness", "-2")
	p.fire("save-project", "click", nil)
	if len(p.host.downloads) != 1 {
		t.Fatalf("%d downloads", len(p.host.downloads))
	}
	data := p.host.downloads[0].data
	var head struct {
		Format, Note string
		Problems     []form.FieldProblem
	}
	if err := json.Unmarshal(data, &head); err != nil {
		t.Fatal(err)
	}
	if head.Format != form.DraftFormat || !strings.Contains(head.Note, "2 problems") || len(head.Problems) != 2 {
		t.Errorf("draft head %+v", head)
	}
	q := newPage(t, Sources{})
	q.host.file, q.host.fileName = data, "x-draft.json"
	q.fire("open-file", "change", nil)
	if got := q.value("layers-0-k"); got != "fast" {
		t.Errorf("reopened draft shows k %q", got)
	}
	if q.text("layers-3-thickness-err") == "" || q.text("layers-0-k-err") == "" {
		t.Error("reopened draft does not show its problems")
	}
	if !strings.Contains(q.text("status"), "2 inputs need attention") {
		t.Errorf("status %q", q.text("status"))
	}
	// The demo's results would sit beside another project's inputs.
	if q.root.Result() != nil || strings.Contains(q.text("status"), "last valid") {
		t.Error("the results of the project the draft replaced are still shown")
	}
}

// TestProblemList checks the list of problems: one line per cause, the
// count the status gives, numbers as the tables show them, and buttons
// that name the input they focus.
func TestProblemList(t *testing.T) {
	p := newPage(t, Sources{})
	p.typeInto("layers-1-mv", "abc")
	p.typeInto("layers-0-thickness", "")
	p.typeInto("loads-1-q", "x")
	p.typeInto("times", "10, y")
	items := p.root.problemList()
	var texts []string
	for _, it := range items {
		texts = append(texts, it.Text)
		if it.ID == "" {
			t.Errorf("%q has no link", it.Text)
		}
	}
	want := []string{"Layer 1, thickness: required", "Layer 2, mv: not a number", "Stage 2, q: not a number"}
	for _, w := range want {
		if !strings.Contains(strings.Join(texts, "\n"), w) {
			t.Errorf("problem list %q lacks %q", texts, w)
		}
	}
	if len(items) != 4 {
		t.Errorf("%d problems listed, want 4: %q", len(items), texts)
	}
	if !strings.Contains(p.text("problem-head"), "4 inputs need attention") || !strings.Contains(p.text("status"), "4 inputs need attention") {
		t.Errorf("head %q, status %q", p.text("problem-head"), p.text("status"))
	}
}

func TestIsView(t *testing.T) {
	tests := []struct {
		search, frag string
		want         bool
	}{
		{"", "", false},
		{"?view", "", true},
		{"?a=1&view=1", "", true},
		{"?preview", "", false},
		{"", "#view", true},
		{"", "#view&p=abc", true},
		{"", "#p=abc", false},
	}
	for _, tt := range tests {
		if got := IsView(tt.search, tt.frag); got != tt.want {
			t.Errorf("IsView(%q, %q) = %v", tt.search, tt.frag, got)
		}
	}
	if got := viewless("#view&p=abc"); got != "p=abc" {
		t.Errorf("viewless = %q", got)
	}
}

// TestViewMode checks the read-only view: the project of the link, no
// editors, nothing stored, and Open it fully keeps the reader's autosave
// one Undo away.
func TestViewMode(t *testing.T) {
	frag, err := EncodeFragment(NewProject())
	if err != nil {
		t.Fatal(err)
	}
	own := newPage(t, Sources{})
	own.typeInto("layers-0-k", "own")
	saved := own.host.store[AutosaveKey]
	p := newPage(t, Sources{Fragment: "#view&" + frag, View: true, Autosave: saved})
	if p.find("layers-0-k") != nil || p.find("undo") != nil || p.find("summary") == nil || p.find("view-edit") == nil {
		t.Fatal("the view shows editors, or lacks the summary or the way out")
	}
	if len(p.host.store) != 0 {
		t.Errorf("the view stored %v", p.host.store)
	}
	p.fire("view-edit", "click", nil)
	if p.find("layers-0-k") == nil || len(p.root.form.Draft().Layers) != 1 {
		t.Fatal("Open it fully did not show the editors with the project")
	}
	p.fire("undo", "click", nil)
	if got := p.value("layers-0-k"); got != "own" {
		t.Errorf("Undo after leaving the view shows k %q, want the reader's own work", got)
	}
}

func TestLabel(t *testing.T) {
	tests := []struct{ path, want string }{
		{"layers[1].mv", "layer 2, mv"},
		{"layers[0].ecurve.sigmaP", "layer 1, σ′p"},
		{"loads[2].fill.thickness", "stage 3, fill thickness"},
		{"monitoring.plates[0].readings[3].t", "plate 1, reading 4, time"},
		{"monitoring.piezometers[1].depth", "piezometer 2, depth"},
		{"times[2]", "output time 3"},
		{"waterTable", "water table"},
		{"", "the project"},
		{"not a path[", "not a path["},
	}
	for _, tt := range tests {
		if got := form.Label(tt.path); got != tt.want {
			t.Errorf("Label(%q) = %q, want %q", tt.path, got, tt.want)
		}
	}
}

// TestOpenWrongKind opens the page's own exports and other files by
// mistake: each is named for what it is, and the project stays.
func TestOpenWrongKind(t *testing.T) {
	p := newPage(t, Sources{})
	for _, id := range []string{"export-results", "export-series", "export-layers-csv"} {
		p.fire(id, "click", nil)
	}
	tests := []struct {
		name string
		data []byte
		want string
	}{
		{"results.json", p.host.downloads[0].data, "this is a results file"},
		{"series.csv", p.host.downloads[1].data, "looks like CSV"},
		{"layers.csv", p.host.downloads[2].data, "looks like CSV"},
		{"readings.csv", []byte("t,settlement\n10,12\n"), "looks like CSV"},
		{"readings.txt", []byte("time settlement\n10 12\n"), "looks like text"},
	}
	title := p.root.form.Draft().Title
	for _, tt := range tests {
		p.host.file, p.host.fileName = tt.data, tt.name
		p.fire("open-file", "change", nil)
		n := p.root.notices[len(p.root.notices)-1].Text
		if !strings.Contains(n, tt.want) || !strings.Contains(n, "open a") || !strings.Contains(n, "unchanged") {
			t.Errorf("%s: notice %q, want %q", tt.name, n, tt.want)
		}
		if p.root.form.Draft().Title != title {
			t.Fatalf("%s replaced the project", tt.name)
		}
	}
}

// fullHost is a Host whose storage holds at most limit bytes in all.
type fullHost struct {
	*fakeHost
	limit int
}

func (h *fullHost) Store(k, v string) error {
	n := len(v)
	for key, old := range h.store {
		if key != k {
			n += len(old)
		}
	}
	if n > h.limit {
		return fmt.Errorf("quota exceeded")
	}
	h.store[k] = v
	return nil
}

// TestStorageFull checks that a full storage gives up the stored history
// before the draft.
func TestStorageFull(t *testing.T) {
	p := newPage(t, Sources{})
	draft := len(p.host.store[AutosaveKey])
	h := &fullHost{fakeHost: p.host, limit: 3*draft + draft/2}
	p.root.Host = h
	// Notes that grow with each step: the history fills the storage, then
	// a longer draft no longer fits beside it.
	for i := range 8 {
		p.typeInto("layers-0-name", fmt.Sprintf("name %d", i))
		p.typeInto("notes", strings.Repeat("n", 400*(i+1)))
		if got := h.store[AutosaveKey]; !strings.Contains(got, fmt.Sprintf(`"name %d"`, i)) || !strings.Contains(got, strings.Repeat("n", 400*(i+1))) {
			t.Fatalf("step %d: the draft was not stored (%d bytes kept)", i, len(got))
		}
	}
}

// shelfHost keeps a shelf in memory.
type shelfHost struct {
	*fakeHost
	shelf map[string]ShelfEntry
}

func (h *shelfHost) ShelfPut(e ShelfEntry)  { h.shelf[e.Key] = e }
func (h *shelfHost) ShelfDelete(key string) { delete(h.shelf, key) }
func (h *shelfHost) ShelfList(done func([]ShelfEntry)) {
	var es []ShelfEntry
	for _, e := range h.shelf {
		es = append(es, e)
	}
	done(es)
}

// TestShelf checks the shelf: a saved project and a replaced one are
// kept, listed on the next start, and open again (Undo takes it back).
func TestShelf(t *testing.T) {
	p := newPage(t, Sources{})
	h := &shelfHost{fakeHost: p.host, shelf: map[string]ShelfEntry{}}
	p.root.Host = h
	p.typeInto("title", "Embankment, north section")
	p.typeInto("layers-0-name", "Crust, north section")
	p.fire("new-project", "click", nil)
	p.fire("confirm-replace", "click", nil)
	if len(h.shelf) != 1 {
		t.Fatalf("%d projects shelved after replacing one", len(h.shelf))
	}
	// A new start lists it. Projects are kept by title: the sections of
	// a job have their own.
	q := newPage(t, Sources{})
	q.root.Host = h
	q.root.loadShelf()
	q.fire("new-project", "click", nil) // the demo goes on the shelf too
	q.build()
	q.fire("shelf-toggle", "click", nil)
	var key string
	for k, e := range h.shelf {
		if strings.Contains(e.State, "north section") {
			key = k
		}
	}
	if key == "" || q.find("shelf-list") == nil {
		t.Fatalf("the shelf lacks the edited demo or is not listed: %v", q.root.shelfItems())
	}
	q.root.openShelved(key)
	q.build()
	if got := q.value("layers-0-name"); got != "Crust, north section" {
		t.Errorf("the shelved project opened with layer 1 %q", got)
	}
	q.fire("undo", "click", nil)
	if got := len(q.root.form.Draft().Layers); got != 1 {
		t.Errorf("Undo after opening from the shelf: %d layers, want the new project's 1", got)
	}
	for range ShelfSize + 3 {
		q.typeInto("title", fmt.Sprintf("section %d", len(h.shelf)))
		q.fire("save-project", "click", nil)
	}
	if len(h.shelf) > ShelfSize {
		t.Errorf("%d projects on the shelf, at most %d kept", len(h.shelf), ShelfSize)
	}
}
