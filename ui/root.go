package ui

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"runtime/debug"
	"strings"
	"sync/atomic"
	"time"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/solver/monitor"
	"porelight/ui/form"
	"porelight/ui/plot"
)

// AutosaveKey is the browser storage key of the autosaved project.
const AutosaveKey = "porelight.autosave"

// Sources are the places a session can start from, in order of priority:
// a project in the URL fragment, the autosave, the demo.
type Sources struct {
	Fragment    string // the URL fragment, with or without "#"
	Autosave    string // the autosaved project JSON ("" when none)
	AutosaveErr error  // storage could not be read
	Demo        []byte // the demo project JSON
	History     string // the undo history stored with the autosave (HistoryKey)
	// View asks for the read-only view (the link's "?view" or "#view"):
	// the project in the link, its summary and plots, nothing stored.
	View bool
}

// Root is the page: editors on one side, results on the other. wasm/ sets
// the exported fields before the first render and calls Start.
type Root struct {
	// Host provides storage, downloads and files; nil means none.
	Host Host
	// Env synchronises the solve goroutine with rendering. Nil runs each
	// solve at once, inside the edit (tests).
	Env vugu.EventEnv
	// Solve computes results; nil means solver.Solve.
	Solve func(*solver.Project, *solver.Options) (*solver.Result, error)
	// Debounce is the pause after an edit before solving; zero is 200 ms.
	Debounce time.Duration
	// Version is shown in the footer.
	Version string
	// BackFit fits the project to its field records; nil means
	// monitor.BackFit (monitor_root.go).
	BackFit func(*solver.Project, monitor.FitSpec, *solver.Options) (*monitor.FitResult, error)
	// Now is the clock of the undo history's typing runs; nil is time.Now.
	Now func() time.Time

	form      *form.Form
	demo      []byte
	result    *solver.Result  // the last good results
	resultFor *solver.Project // the model they belong to
	solveErr  string
	busy      bool
	canceled  bool // the last solve was cancelled (cancel.go)
	progress  float64
	gen       atomic.Int64 // bumped by every committed edit; a solve of an older one is dropped
	notices   []notice
	shareURL  string
	fit       *fitState     // back-analysis of the field records (monitor_root.go)
	design    *designState  // the drain design helper (drains_root.go)
	need      *fillNeed     // the fill needed for a finished level (fill-need.go)
	dec       *decisionsRun // the site decisions' own solves (decisions_root.go)
	rng       *rangeState   // the Monte Carlo of the uncertainty section (uncertain_root.go)
	cmp       *compareState // the comparison of the options (variants_root.go)
	fold      folds         // which secondary sections are unfolded (folds.go)
	printing  bool          // Print report is under way: every fold is open
	fresh     bool          // the results are new: draw the figures in view first (inview.go)
	drawing   bool          // figures out of view wait for the render after the paint
	dates     bool          // the record plots run on calendar dates
	level     bool          // the piezometer plot shows water levels
	rev       printRev      // the revision printed in the header (print.go)

	hist           history     // the undo history (history.go, keep.go)
	saved          string      // the state last opened or saved (unsaved)
	ask            *replaceAsk // a replacement waiting for a yes
	box            *saveBox    // the project shown for copying
	view           bool        // the read-only view
	storedAutosave string      // in the view: the reader's autosave, kept for leaveView
	storedHistory  string
	shelf          []ShelfEntry // recent projects kept in the browser (shelf.go)
	shelfOpen      bool
}

type notice struct {
	Kind string // "info" or "error"
	Text string
}

func (c *Root) host() Host {
	if c.Host == nil {
		return nopHost{}
	}
	return c.Host
}

// Form is the form the editors work on (nil before Start).
func (c *Root) Form() *form.Form { return c.form }

// Result is the last good result (nil before the first solve).
func (c *Root) Result() *solver.Result { return c.result }

// Start opens the first project from src and solves it: the project in
// the link, else the autosave, else the demo. What could not be read is
// said in a notice, and the next source is tried.
func (c *Root) Start(src Sources) {
	c.demo = src.Demo
	c.form = form.New(&solver.Project{Format: solver.Format})
	c.loadUnits()
	c.view = src.View
	opened, fromLink := false, false
	if data, err := DecodeFragment(viewless(src.Fragment)); err == nil {
		if st, ps := readAny(data); ps == nil {
			c.openState(st)
			if !c.view {
				c.note("info", "Opened the project from the link.")
			}
			opened, fromLink = true, true
		} else {
			c.note("error", "The project in the link could not be read: "+describeProblems(ps, 3))
		}
		if !c.view {
			c.host().SetFragment("") // from now on, a reload restores the autosave
		}
	} else if !errors.Is(err, ErrNoProject) {
		c.note("error", err.Error())
		c.host().SetFragment("")
	}
	if c.view {
		if opened {
			// The reader's own work stays as it was, to come back to
			// when leaving the view.
			c.storedAutosave, c.storedHistory = src.Autosave, src.History
		} else {
			c.view = false // nothing to view: the full page
		}
	}
	if !opened && src.AutosaveErr != nil {
		c.note("info", "This browser does not allow storage here, so nothing is autosaved: save the project to a file to keep it.")
	}
	if !opened && src.Autosave != "" {
		if st, ps := readAny([]byte(src.Autosave)); ps == nil {
			c.openState(st)
			c.hist.decode(src.History, c.hist.cur)
			c.store(true)
			c.note("info", "Restored the project autosaved in this browser, as it was typed.")
			opened = true
		} else {
			c.note("error", "The autosaved project could not be read ("+describeProblems(ps, 3)+"); opened the demo project instead.")
		}
	}
	if !opened {
		if p, ps := ReadProject(src.Demo); ps == nil {
			c.open(p)
			c.markSaved()
		} else {
			c.note("error", "The demo project could not be read: "+describeProblems(ps, 3))
		}
	}
	if fromLink {
		c.markSaved()
	}
	c.loadShelf()
}

// viewless is a URL fragment without the view mark: "#view&p=…" → "p=…".
func viewless(frag string) string {
	frag = strings.TrimPrefix(frag, "#")
	if rest, ok := strings.CutPrefix(frag, "view"); ok {
		return strings.TrimLeft(rest, "&;/")
	}
	return frag
}

// IsView reports whether a page address asks for the read-only view: a
// query "?view" (or "?view=…", "&view") or a fragment "#view…".
func IsView(search, frag string) bool {
	if strings.HasPrefix(strings.TrimPrefix(frag, "#"), "view") {
		return true
	}
	for part := range strings.SplitSeq(strings.TrimPrefix(search, "?"), "&") {
		if k, _, _ := strings.Cut(part, "="); k == "view" {
			return true
		}
	}
	return false
}

// readAny reads a project file or a draft file (form.ReadDraft) as a
// state to show; a plain project is validated, a draft is not (it shows
// its problems).
func readAny(data []byte) (form.State, solver.Problems) {
	if form.IsDraft(data) {
		return form.ReadDraft(data)
	}
	p, ps := ReadProject(data)
	if ps != nil {
		return form.State{}, ps
	}
	return form.State{Project: p}, nil
}

// openState shows st (a project, or a draft with its typed text) as one
// step of the history, and solves it when it is valid.
func (c *Root) openState(st form.State) {
	c.form.Restore(st)
	c.shareURL = ""
	c.ask = nil
	if !c.form.Valid() {
		// The results shown belong to another project: none, rather than
		// figures that do not match the inputs beside them.
		c.result, c.resultFor, c.solveErr = nil, nil, ""
	}
	c.track()
	c.afterChange()
}

// open makes p the project and solves it now.
func (c *Root) open(p *solver.Project) {
	c.form.Reset(p)
	c.shareURL = ""
	c.ask = nil
	c.track()
	c.commit(0)
}

// edited runs after every edit: a valid draft becomes the model and is
// solved after a pause; an invalid one only shows its problems.
func (c *Root) edited() {
	c.track()
	c.afterChange()
}

func (c *Root) debounce() time.Duration {
	if c.Debounce > 0 {
		return c.Debounce
	}
	return 200 * time.Millisecond
}

// commit solves the current draft after wait, unless another edit comes
// first. It runs with the render lock held (from a handler or Start).
func (c *Root) commit(wait time.Duration) {
	if !c.form.Valid() {
		return
	}
	g := c.gen.Add(1)
	model := c.form.Model()
	c.canceled = false
	// The draft was autosaved by the edit (track), before any solve: an
	// edit followed at once by a reload, or a cancelled solve, is not lost.
	if c.reuse(model) {
		return // only the field records changed: the results stand
	}
	if c.Env == nil {
		res, err := c.run(g, model)
		c.finish(g, model, res, err)
		return
	}
	c.busy, c.progress = true, 0
	go func() {
		if wait > 0 {
			time.Sleep(wait)
			if c.gen.Load() != g {
				return
			}
		}
		res, err := c.run(g, model)
		c.Env.Lock()
		c.finish(g, model, res, err)
		c.Env.UnlockRender()
	}()
}

// run solves model in the host's worker, or else in-process, yielding
// to the browser every 40 ms or so; either way it gives up as soon as a
// newer edit arrives. A panic becomes an error: one
// escaping would stop the whole page.
func (c *Root) run(g int64, model *solver.Project) (res *solver.Result, err error) {
	defer func() {
		if r := recover(); r != nil {
			err = fmt.Errorf("internal error in the solver: %v\n%s", r, debug.Stack())
		}
	}()
	if s, ok := c.host().(Solver); ok && c.Solve == nil && c.Env != nil {
		res, err := c.solveElsewhere(g, s, model)
		if !errors.Is(err, ErrNoWorker) {
			return res, err
		}
	}
	solve := c.Solve
	if solve == nil {
		solve = solver.Solve
	}
	opt := c.yielding(&c.progress, func() bool { return c.gen.Load() == g })
	return solve(solveInput(model), opt)
}

// yielding is the Options of an in-process solve (or of work made of
// solves): while alive reports true, it stores the progress in *progress
// and yields to the browser about every 40 ms; once alive reports false
// the solve stops with ErrCanceled. Without Env it only checks alive.
func (c *Root) yielding(progress *float64, alive func() bool) *solver.Options {
	return c.reporting(func(f float64) { *progress = f }, alive)
}

// reporting is yielding with the progress handed to setProgress (under
// the render lock).
func (c *Root) reporting(setProgress func(float64), alive func() bool) *solver.Options {
	last := time.Now()
	return &solver.Options{Progress: func(f float64) bool {
		if !alive() {
			return false
		}
		if c.Env != nil && time.Since(last) > 40*time.Millisecond {
			c.Env.Lock()
			setProgress(f)
			c.Env.UnlockRender()
			c.host().Yield()
			last = time.Now()
		}
		return alive()
	}}
}

// finish takes the results of solve g, if it is still the latest.
func (c *Root) finish(g int64, model *solver.Project, res *solver.Result, err error) {
	if c.gen.Load() != g {
		return
	}
	c.busy = false
	switch {
	case errors.Is(err, solver.ErrCanceled):
		return
	case err != nil:
		c.solveErr = describeProblems(solver.AsProblems(err), 5)
		return
	}
	c.result, c.resultFor, c.solveErr = res, model, ""
	c.fresh = true
}

func (c *Root) status() Status {
	switch {
	case c.form == nil:
		return Status{"busy", "Starting…"}
	case !c.form.Valid():
		n := len(c.form.Problems())
		s := fmt.Sprintf("%d inputs need attention (listed above the editors)", n)
		if n == 1 {
			s = "1 input needs attention (shown above the editors)"
		}
		if c.result != nil {
			s += "; the results shown are for the last valid inputs."
		}
		return Status{"stale", s}
	case c.solveErr != "":
		return Status{"error", "The solve failed: " + c.solveErr}
	case c.canceled:
		return c.canceledStatus()
	case c.busy:
		return Status{"busy", fmt.Sprintf("Solving… %.0f %%", 100*c.progress)}
	case c.result == nil:
		return Status{"busy", "Solving…"}
	}
	return Status{"ok", "Results are up to date with the inputs."}
}

func (c *Root) note(kind, text string) {
	c.notices = append(c.notices, notice{Kind: kind, Text: text})
	if len(c.notices) > 4 {
		c.notices = c.notices[len(c.notices)-4:]
	}
}

func (c *Root) dismiss(i int) {
	if i >= 0 && i < len(c.notices) {
		c.notices = append(c.notices[:i], c.notices[i+1:]...)
	}
}

// generalProblems are the problems no input and no section shows.
func (c *Root) generalProblems() []string {
	var out []string
	for _, p := range c.form.Other() {
		if strings.HasPrefix(p.Path, "top.") || strings.HasPrefix(p.Path, "bottom.") {
			continue // the drainage section lists these
		}
		s := p.Message
		if p.Path != "" {
			s = capital(form.Label(p.Path)) + ": " + s
		}
		out = append(out, s)
	}
	return out
}

func (c *Root) editNotes(e vugu.DOMEvent) {
	c.form.Edit("notes", e.PropString("target", "value"))
	c.edited()
}

// openPicked reads the file chosen in the open dialogue.
func (c *Root) openPicked() {
	c.host().ReadFile("open-file", func(name string, data []byte, err error) {
		if c.Env == nil {
			c.openFile(name, data, err)
			return
		}
		go func() {
			c.Env.Lock()
			c.openFile(name, data, err)
			c.Env.UnlockRender()
		}()
	})
}

// openFile replaces the project with the file's, or says why not and
// leaves the project as it was.
func (c *Root) openFile(name string, data []byte, err error) {
	if err != nil {
		c.note("error", fmt.Sprintf("Could not read %s: %v. The project is unchanged.", orFile(name), err))
		return
	}
	st, ps := readAny(data)
	if ps != nil {
		c.note("error", fmt.Sprintf("%s is not a project this page can open: %s The project is unchanged.",
			orFile(name), strings.TrimSuffix(describeProblems(ps, 4), ".")+"."))
		return
	}
	c.shelve()
	c.openState(st)
	c.markSaved()
	if form.IsDraft(data) && !c.form.Valid() {
		c.note("info", "Opened "+orFile(name)+", a draft saved with problems: they are listed above, to fix.")
		return
	}
	c.note("info", "Opened "+orFile(name)+". Undo (Ctrl+Z) brings back the project it replaced.")
}

func orFile(name string) string {
	if name == "" {
		return "The file"
	}
	return "“" + name + "”"
}

// saveable is the project to save or share: the model when the inputs
// are valid, else nothing (with a notice).
func (c *Root) saveable() *solver.Project {
	if !c.form.Valid() {
		c.note("error", "Some inputs need attention (listed above): a link carries only a project the solver accepts. Save keeps the draft, problems and all.")
		return nil
	}
	return c.form.Model()
}

func (c *Root) share() {
	p := c.saveable()
	if p == nil {
		return
	}
	frag, err := EncodeFragment(p)
	if err != nil {
		c.note("error", "Could not make the link: "+err.Error())
		return
	}
	c.shareURL = c.host().PageURL() + "#" + frag
}

func (c *Root) copyShare() {
	if err := c.host().CopyText("share-url"); err != nil {
		c.note("info", "The link is selected: copy it with Ctrl+C (⌘C).")
	}
}

func (c *Root) closeShare() { c.shareURL = "" }

// export downloads results: "results.json", "series.csv" or "layers.csv".
func (c *Root) export(what string) {
	if c.result == nil || c.resultFor == nil {
		c.note("error", "There are no results to export yet.")
		return
	}
	var data []byte
	var err error
	mime := "text/csv"
	switch what {
	case "results.json":
		mime = "application/json"
		data, err = json.MarshalIndent(c.result, "", " ")
	case "series.csv":
		data, err = seriesCSV(c.result)
	case "layers.csv":
		data, err = layersCSV(c.result)
	default:
		err = fmt.Errorf("unknown export %q", what)
	}
	if err == nil {
		err = c.host().Download(baseName(c.resultFor)+"-"+what, mime, data)
	}
	if err != nil {
		c.note("error", "Could not export: "+err.Error())
	}
}

// exportPlot downloads plot name ("isochrones", …) as "svg" or "csv".
func (c *Root) exportPlot(name, format string) {
	if c.result == nil || c.resultFor == nil {
		c.note("error", "There are no results to export yet.")
		return
	}
	data, mime, err := plotFile(name, format, c.resultFor, c.result, c.fitOverlay(), plot.RecordAxes{Dates: c.dates, Level: c.level})
	if err == nil {
		err = c.host().Download(baseName(c.resultFor)+"-"+name+"."+format, mime, data)
	}
	if err != nil {
		c.note("error", "Could not export: "+err.Error())
	}
}

// baseName makes a file name from the project title.
func baseName(p *solver.Project) string {
	var b bytes.Buffer
	dash := false
	for _, r := range strings.ToLower(p.Title) {
		switch {
		case r >= 'a' && r <= 'z' || r >= '0' && r <= '9':
			b.WriteRune(r)
			dash = false
		case !dash && b.Len() > 0:
			b.WriteByte('-')
			dash = true
		}
		if b.Len() >= 48 {
			break
		}
	}
	s := strings.Trim(b.String(), "-")
	if s == "" {
		return "porelight-project"
	}
	return s
}

func (c *Root) printTitle() string {
	if t := strings.TrimSpace(c.form.Draft().Title); t != "" {
		return t
	}
	return "Untitled project"
}

// setPlotDates puts the settlement and piezometer plots on calendar dates
// (on) or log time.
func (c *Root) setPlotDates(on bool) { c.dates = on }

// setPlotLevel shows the piezometers as water levels, m (on), or as pore
// pressure.
func (c *Root) setPlotLevel(on bool) { c.level = on }
