package ui

import (
	"fmt"
	"strings"
	"time"

	"porelight/solver"
	"porelight/ui/form"
)

// Nothing lost: the undo history, the draft autosave, replacing the
// project only after asking, saving a draft with its problems, and the
// list of problems with links to their inputs. The history logic is in
// history.go; the panel these show in is keep.vugu.

// Framer is a Host that can tell whether the page runs inside a frame
// (a wiki page), where browsers often block downloads and popups.
type Framer interface {
	// Frame reports whether the page is inside a frame, and whether that
	// frame is sandboxed with an opaque origin (downloads and storage are
	// then refused).
	Frame() (framed, sandboxed bool)
}

// Focuser is a Host that can move the keyboard focus to an element once
// the page has rendered.
type Focuser interface {
	Focus(id string)
}

// Filler is a Host that can put text into a text box once the page has
// rendered. The project to copy is put there this way, not bound: vugu's
// renderer takes at most 16 KiB in one instruction, and a bound value
// longer than that would stop the page.
type Filler interface {
	Fill(id, text string)
}

// replaceAsk is a replacement of the project waiting for the user's yes.
type replaceAsk struct {
	What string // "demo" or "new"
	Text string
}

// saveBox is the project shown for copying where a download may have
// been blocked.
type saveBox struct {
	Name string // the file name it would have had
	Text string // the JSON
	Why  string // why it is shown
}

func (c *Root) clock() time.Time {
	if c.Now != nil {
		return c.Now()
	}
	return time.Now()
}

// encodeState is the JSON of what the inputs show (form.EncodeState).
func (c *Root) encodeState() string {
	data, err := c.form.EncodeState()
	if err != nil {
		return ""
	}
	return string(data)
}

// track records the edit just made in the history and autosaves the
// draft as it is, problems and all.
func (c *Root) track() {
	typed := c.form.TakeTyped()
	s := c.encodeState()
	if s == "" {
		return
	}
	added := c.hist.record(s, typed, c.clock())
	c.store(added)
}

// store writes the draft, and with history the undo history, to the
// browser's storage; nothing in view mode, which must not replace the
// reader's own work.
func (c *Root) store(history bool) {
	if c.view || c.hist.cur == "" {
		return
	}
	if err := c.host().Store(AutosaveKey, c.hist.cur); err != nil {
		// Storage full: the draft matters more than the steps before it.
		_ = c.host().Store(HistoryKey, "")
		if c.host().Store(AutosaveKey, c.hist.cur) != nil {
			return // said once at start when storage is off
		}
		history = true
	}
	if history {
		_ = c.host().Store(HistoryKey, c.hist.encode())
	}
}

func (c *Root) canUndo() bool { return c.form != nil && !c.view && c.hist.canUndo() }
func (c *Root) canRedo() bool { return c.form != nil && !c.view && c.hist.canRedo() }

// undo goes back one step.
func (c *Root) undo() {
	if c.view {
		return
	}
	if s, ok := c.hist.back(); ok {
		c.restore(s)
	}
}

// redo goes forward one undone step.
func (c *Root) redo() {
	if c.view {
		return
	}
	if s, ok := c.hist.forward(); ok {
		c.restore(s)
	}
}

// restore shows the state s of the history and solves it.
func (c *Root) restore(s string) {
	st, ps := form.ReadDraft([]byte(s))
	if ps != nil {
		c.note("error", "This step of the history could not be read: "+describeProblems(ps, 3))
		return
	}
	c.form.Restore(st)
	c.ask = nil
	c.shareURL = ""
	c.store(true)
	c.afterChange()
}

// afterChange solves a valid draft after a pause, or shows the problems
// of an invalid one.
func (c *Root) afterChange() {
	c.revealProblems()
	if c.form.Valid() {
		c.commit(c.debounce())
	} else {
		c.gen.Add(1) // a solve under way is for an outdated model
		c.busy = false
	}
}

// unsaved reports whether the project shown differs from the one last
// opened or saved.
func (c *Root) unsaved() bool { return c.hist.cur != c.saved }

// markSaved says the project shown is kept elsewhere (a file, the demo).
func (c *Root) markSaved() { c.saved = c.hist.cur }

// openDemo replaces the project with the demo, after asking when the
// project has unsaved changes.
func (c *Root) openDemo() {
	if c.unsaved() {
		c.ask = &replaceAsk{"demo", "Replace this project with the demo project? Its changes are not saved to a file. (Undo brings it back.)"}
		return
	}
	c.replaceWithDemo()
}

// newProject starts an empty project, after asking when the project has
// unsaved changes.
func (c *Root) newProject() {
	if c.unsaved() {
		c.ask = &replaceAsk{"new", "Start a new project in place of this one? Its changes are not saved to a file. (Undo brings it back.)"}
		return
	}
	c.replaceWithNew()
}

// confirmReplace does the replacement asked about.
func (c *Root) confirmReplace() {
	a := c.ask
	c.ask = nil
	switch {
	case a == nil:
	case a.What == "demo":
		c.replaceWithDemo()
	case a.What == "new":
		c.replaceWithNew()
	}
}

func (c *Root) keepEditing() { c.ask = nil }

func (c *Root) replaceWithDemo() {
	p, ps := ReadProject(c.demo)
	if ps != nil {
		c.note("error", "The demo project could not be read: "+describeProblems(ps, 3))
		return
	}
	c.shelve()
	c.open(p)
	c.markSaved()
	c.note("info", "Opened the demo project. Undo (Ctrl+Z) brings back the project it replaced.")
}

func (c *Root) replaceWithNew() {
	c.shelve()
	c.open(NewProject())
	c.markSaved()
	c.note("info", "Started a new project: one layer, one load stage. Undo (Ctrl+Z) brings back the project it replaced.")
}

// NewProject is the project "New project" starts from: one clay layer
// under a drained top, one load stage, the solver's defaults elsewhere,
// so that it solves at once and every table has a row to edit. The
// values are placeholders of our own, not advice.
func NewProject() *solver.Project {
	return &solver.Project{
		Format: solver.Format,
		Layers: []solver.Layer{{Name: "Layer 1", Thickness: 5, GammaSat: 18, K: 1e-9, Mv: 5e-4}},
		Top:    solver.Boundary{Drained: true},
		Loads:  []solver.Load{{Start: 0, Ramp: 0, Q: 50}},
		Times:  []float64{10, 100, 1000},
	}
}

// save downloads the project: a plain project file when the inputs are
// valid, else a draft file that says it has problems and reopens with
// them shown. Inside a frame, where the download may be blocked, the
// JSON is also shown for copying.
func (c *Root) save() {
	var data []byte
	var err error
	name := baseName(c.form.Draft())
	draft := !c.form.Valid()
	if draft {
		name += "-draft"
		data, err = c.form.EncodeDraft()
	} else {
		data, err = solver.Encode(c.form.Model())
	}
	if err != nil {
		c.note("error", "Could not save: "+err.Error())
		return
	}
	data = append(data, '\n')
	name += ".json"
	framed, sandboxed := false, false
	if f, ok := c.host().(Framer); ok {
		framed, sandboxed = f.Frame()
	}
	if sandboxed {
		c.showBox(name, data, "This page runs in a sandboxed frame (a wiki page, say) that blocks downloads, so Save cannot write a file here. Copy the project below into a file named "+name+", or open the page on its own.")
		return
	}
	if err := c.host().Download(name, "application/json", data); err != nil {
		c.showBox(name, data, "The browser refused the download ("+err.Error()+"). Copy the project below into a file named "+name+".")
		return
	}
	if framed {
		c.showBox(name, data, "This page runs inside a frame, where browsers often block downloads without a word. If no file "+name+" arrived, copy the project below into one.")
	}
	c.markSaved()
	c.shelve()
	if draft {
		n := c.form.Count()
		c.note("info", fmt.Sprintf("Saved a draft with %s: the file says so, and opening it brings the problems back to fix.", plural(n, "problem", "problems")))
	}
}

// showBox shows the project to copy, and why.
func (c *Root) showBox(name string, data []byte, why string) {
	c.box = &saveBox{name, string(data), why}
	if f, ok := c.host().(Filler); ok {
		f.Fill("save-json", c.box.Text)
	}
}

func plural(n int, one, many string) string {
	if n == 1 {
		return "1 " + one
	}
	return fmt.Sprintf("%d %s", n, many)
}

// copyBox copies the shown project to the clipboard.
func (c *Root) copyBox() {
	if err := c.host().CopyText("save-json"); err != nil {
		c.note("info", "The project is selected: copy it with Ctrl+C (⌘C).")
		return
	}
	c.note("info", "Copied the project to the clipboard; paste it into a file named "+c.box.Name+".")
}

func (c *Root) closeBox() { c.box = nil }

// problemItem is one line of the problem list: a cause, with the id of
// the input to focus ("" when no input shows it).
type problemItem struct {
	Path, ID, Text string
}

// problemList lists each problem once, by its cause, with a link to its
// input.
func (c *Root) problemList() []problemItem {
	if c.form == nil || c.form.Valid() {
		return nil
	}
	var out []problemItem
	for _, p := range c.form.Problems() {
		it := problemItem{Path: p.Path, Text: capital(form.Label(p.Path)) + ": " + p.Message}
		if p.Path != "" && form.IDOf(p.Path) != "" && c.inputShown(p.Path) {
			it.ID = form.IDOf(p.Path)
		}
		out = append(out, it)
	}
	return out
}

// inputShown reports whether an input for path is on the page (the
// form files a problem under an input only when one shows it).
func (c *Root) inputShown(path string) bool {
	return c.form.Problem(path) != ""
}

// focusProblem moves the focus to the input of a problem, unfolding its
// section first.
func (c *Root) focusProblem(path string) {
	if form.Under(path, "monitoring") {
		c.fold.records = true
	}
	if f, ok := c.host().(Focuser); ok {
		f.Focus(form.IDOf(path))
	}
}

func capital(s string) string {
	if s == "" {
		return s
	}
	r := []rune(s)
	return strings.ToUpper(string(r[:1])) + string(r[1:])
}

// leaveView leaves the read-only view for the full page, with the
// project shown; the reader's own autosaved work stays one Undo away.
func (c *Root) leaveView() {
	if !c.view {
		return
	}
	c.view = false
	cur := c.encodeState()
	c.hist = history{}
	if !c.hist.decode(c.storedHistory, c.storedAutosave) {
		c.hist.reset(c.storedAutosave)
	}
	c.hist.record(cur, "", c.clock())
	c.markSaved()
	c.store(true)
	c.host().SetFragment("")
}

// viewURL is the address of the full page with this project (to open it
// in a tab of its own).
func (c *Root) viewURL() string {
	frag, err := EncodeFragment(c.form.Draft())
	if err != nil {
		return c.host().PageURL()
	}
	return c.host().PageURL() + "#" + frag
}

// viewClass marks the page's main part in the read-only view.
func (c *Root) viewClass() string {
	if c.view {
		return " pl-view"
	}
	return ""
}
