package ui

import (
	"fmt"
	"slices"
	"strings"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/solver/monitor"
	"porelight/ui/form"
	"porelight/ui/units"
)

// Monitoring edits the field records: the calendar date of day 0, the
// settlement plates and the piezometers, each with its readings table and
// a box to paste two columns from a spreadsheet.
//
// The editor is folded (folds.go): while Open is false only a one-line
// account of the records and the buttons that add one are built.
type Monitoring struct {
	F       *form.Form
	Changed func()
	// Open says whether the editor shows; SetOpen asks the Root to open
	// or close it. Root keeps it open while a record has a problem.
	Open    bool
	SetOpen func(bool)
	// Held says that Open is forced by a problem in the records.
	Held bool

	open  map[string]bool   // record path → readings table shown
	all   map[string]bool   // record path → every row shown, however many
	paste map[string]string // record path → the text in its paste box
	// undo holds, per record path, the readings a paste replaced.
	undo map[string][]solver.Reading
	// parsedAs caches the reading of each paste box, as a render asks
	// for it several times.
	parsedAs map[string]pasteParse
}

type pasteParse struct {
	text string
	sys  units.System // the units the text was read in
	rs   []solver.Reading
	errs []string
}

// shownRows is how many readings a table shows before "Show all": every
// render rebuilds every row.
const shownRows = 150

// monRec is one record as the editor lists it.
type monRec struct {
	Kind  string // form.Plates or form.Piezometers
	I     int
	Path  string
	ID    string // element id prefix
	Name  string
	Unit  string // of the values as shown: mm or in, kPa or psf
	Noun  string // "settlement" or "pore pressure"
	Count int
}

// Init prepares the private state.
func (c *Monitoring) Init(vugu.InitCtx) {
	c.open, c.all = map[string]bool{}, map[string]bool{}
	c.paste, c.undo = map[string]string{}, map[string][]solver.Reading{}
	c.parsedAs = map[string]pasteParse{}
}

func (c *Monitoring) recs() []monRec {
	var out []monRec
	m := c.F.Draft().Monitoring
	if m == nil {
		return nil
	}
	for i, pl := range m.Plates {
		p := form.RecordPath(form.Plates, i)
		out = append(out, monRec{form.Plates, i, p, form.IDOf(p), pl.Name, sym(units.Settlement), "settlement", len(pl.Readings)})
	}
	for i, pz := range m.Piezometers {
		p := form.RecordPath(form.Piezometers, i)
		out = append(out, monRec{form.Piezometers, i, p, form.IDOf(p), pz.Name, sym(units.Stress), "pore pressure", len(pz.Readings)})
	}
	return out
}

func (c *Monitoring) title(r monRec) string {
	what := "Settlement plate"
	if r.Kind == form.Piezometers {
		what = "Piezometer"
	}
	return fmt.Sprintf("%s %d", what, r.I+1)
}

// span summarises a record's readings: how many, from when to when.
func (c *Monitoring) span(r monRec) string {
	rs := c.F.Readings(r.Kind, r.I)
	switch len(rs) {
	case 0:
		return "no readings yet"
	case 1:
		return "1 reading, " + readingWhen(rs[0])
	}
	return fmt.Sprintf("%d readings, %s to %s", len(rs), readingWhen(rs[0]), readingWhen(rs[len(rs)-1]))
}

func readingWhen(r solver.Reading) string {
	if r.Date != "" {
		return r.Date
	}
	return "day " + form.FormatNumber(r.T)
}

// problems lists what is wrong inside record r, so that a folded table
// still says so.
func (c *Monitoring) problems(r monRec) []form.FieldProblem {
	return c.F.ProblemsUnder(r.Path)
}

// isOpen says whether r's readings table shows: when unfolded, or while
// one of its readings has a problem.
func (c *Monitoring) isOpen(r monRec) bool {
	if c.open[r.Path] {
		return true
	}
	for _, p := range c.problems(r) {
		if strings.Contains(p.Path, ".readings[") {
			return true
		}
	}
	return false
}

func (c *Monitoring) toggle(r monRec) { c.open[r.Path] = !c.isOpen(r) }

func (c *Monitoring) toggleLabel(r monRec) string {
	if c.isOpen(r) {
		return "Hide readings"
	}
	return "Show readings"
}

// rows are the indices of the readings the table shows.
func (c *Monitoring) rows(r monRec) []int {
	n := r.Count
	if !c.all[r.Path] {
		n = min(n, shownRows)
	}
	out := make([]int, n)
	for j := range out {
		out[j] = j
	}
	return out
}

func (c *Monitoring) hidden(r monRec) int {
	if c.all[r.Path] {
		return 0
	}
	return max(0, r.Count-shownRows)
}

// hiddenProblems lists the problems of readings the table does not show.
func (c *Monitoring) hiddenProblems(r monRec) []string {
	if c.hidden(r) == 0 {
		return nil
	}
	var out []string
	for _, p := range c.problems(r) {
		// monitoring.KIND[i].readings[j]…
		steps, err := solver.ParsePath(p.Path)
		if err == nil && len(steps) > 2 && steps[2].Name == "readings" && steps[2].Index >= shownRows {
			out = append(out, fmt.Sprintf("reading %d: %s", steps[2].Index+1, p.Message))
		}
	}
	return out
}

func (c *Monitoring) showAll(r monRec) { c.all[r.Path] = true }

func (c *Monitoring) readingPath(r monRec, j int, leaf string) string {
	return form.ReadingPath(r.Kind, r.I, j, leaf)
}

func (c *Monitoring) addPlate() {
	c.F.AddPlate()
	c.openLast(form.Plates)
	c.SetOpen(true)
	c.Changed()
}

func (c *Monitoring) addPiezometer() {
	c.F.AddPiezometerRecord()
	c.openLast(form.Piezometers)
	c.SetOpen(true)
	c.Changed()
}

func (c *Monitoring) toggleAll() { c.SetOpen(!c.Open) }

func (c *Monitoring) toggleAllLabel() string {
	if c.Open {
		return "hide"
	}
	return "edit"
}

// held says in one line what the records hold, for the folded editor:
// "2 settlement plates (134 readings), 1 piezometer (79 readings)".
func (c *Monitoring) held() string {
	m := c.F.Draft().Monitoring
	if m == nil || len(m.Plates)+len(m.Piezometers) == 0 {
		return "No field records yet."
	}
	count := func(n int, one, many string, readings int) string {
		s := fmt.Sprintf("%d %s", n, many)
		if n == 1 {
			s = "1 " + one
		}
		if readings == 1 {
			return s + " (1 reading)"
		}
		return s + fmt.Sprintf(" (%d readings)", readings)
	}
	var parts []string
	if n := len(m.Plates); n > 0 {
		r := 0
		for _, pl := range m.Plates {
			r += len(pl.Readings)
		}
		parts = append(parts, count(n, "settlement plate", "settlement plates", r))
	}
	if n := len(m.Piezometers); n > 0 {
		r := 0
		for _, pz := range m.Piezometers {
			r += len(pz.Readings)
		}
		parts = append(parts, count(n, "piezometer", "piezometers", r))
	}
	s := strings.Join(parts, ", ")
	if m.Start != "" {
		s += "; day 0 is " + m.Start
	}
	for _, text := range c.paste {
		if strings.TrimSpace(text) != "" {
			return s + "; a paste box holds text not yet used."
		}
	}
	return s + "."
}

func (c *Monitoring) openLast(kind string) {
	if n := c.F.Records(kind); n > 0 {
		c.open[form.RecordPath(kind, n-1)] = true
	}
}

// remove deletes a record; what the editor keeps per record moves with
// the records after it.
func (c *Monitoring) remove(r monRec) {
	c.F.RemoveRecord(r.Kind, r.I)
	list := solver.JoinPath("monitoring", r.Kind)
	form.RemapKeys(c.open, list, form.Removed(r.I))
	form.RemapKeys(c.all, list, form.Removed(r.I))
	form.RemapKeys(c.paste, list, form.Removed(r.I))
	form.RemapKeys(c.undo, list, form.Removed(r.I))
	form.RemapKeys(c.parsedAs, list, form.Removed(r.I))
	c.Changed()
}

func (c *Monitoring) addReading(r monRec) {
	c.F.AddReading(r.Kind, r.I)
	c.open[r.Path] = true
	c.Changed()
}

func (c *Monitoring) removeReading(r monRec, j int) {
	c.F.RemoveReading(r.Kind, r.I, j)
	c.Changed()
}

// Paste box.

func (c *Monitoring) pasteText(r monRec) string { return c.paste[r.Path] }

func (c *Monitoring) editPaste(r monRec, e vugu.DOMEvent) {
	c.paste[r.Path] = e.PropString("target", "value")
}

// parsed reads the paste box of r: the readings in the file's units, or
// the problems, one per line and column.
func (c *Monitoring) parsed(r monRec) ([]solver.Reading, []string) {
	text := c.paste[r.Path]
	if strings.TrimSpace(text) == "" {
		return nil, nil
	}
	if got, ok := c.parsedAs[r.Path]; ok && got.text == text && got.sys == shown {
		return got.rs, got.errs
	}
	rs, err := monitor.ParseReadings(text)
	var errs []string
	if err != nil {
		rs, errs = nil, pasteMessages(err)
	}
	for j := range rs { // typed in the unit shown: mm or in, kPa or psf
		if r.Kind == form.Plates {
			rs[j].Value = shown.Take(units.Settlement, rs[j].Value) / 1000
		} else {
			rs[j].Value = shown.Take(units.Stress, rs[j].Value)
		}
	}
	c.parsedAs[r.Path] = pasteParse{text, shown, rs, errs}
	return rs, errs
}

// pasteMessages splits the joined errors of ParseReadings; when there are
// as many as it reports at most, it says there may be more.
func pasteMessages(err error) []string {
	var out []string
	if j, ok := err.(interface{ Unwrap() []error }); ok {
		for _, e := range j.Unwrap() {
			out = append(out, e.Error())
		}
	} else {
		out = append(out, err.Error())
	}
	if len(out) == monitor.MaxPasteErrors {
		out = append(out, "… and perhaps more: fix these first.")
	}
	return out
}

func (c *Monitoring) pasteErrors(r monRec) []string {
	_, errs := c.parsed(r)
	return errs
}

// pasteSummary says what the paste box holds and what using it will do.
func (c *Monitoring) pasteSummary(r monRec) string {
	rs, errs := c.parsed(r)
	switch {
	case len(errs) > 0 || len(rs) == 0:
		return ""
	case len(rs) == 1:
		return "Reads 1 reading, " + readingWhen(rs[0]) + "."
	}
	return fmt.Sprintf("Reads %d readings, %s to %s.", len(rs), readingWhen(rs[0]), readingWhen(rs[len(rs)-1]))
}

func (c *Monitoring) canUse(r monRec) bool {
	rs, errs := c.parsed(r)
	return len(errs) == 0 && len(rs) > 0
}

func (c *Monitoring) useLabel(r monRec) string {
	if r.Count == 0 {
		return "Use these readings"
	}
	return fmt.Sprintf("Replace the %d readings with these", r.Count)
}

// usePaste replaces r's readings with the pasted ones; the old ones can
// be restored.
func (c *Monitoring) usePaste(r monRec) {
	rs, errs := c.parsed(r)
	if len(errs) > 0 || len(rs) == 0 {
		return
	}
	old := c.F.ReplaceReadings(r.Kind, r.I, slices.Clone(rs))
	c.undo[r.Path] = old
	c.open[r.Path] = true
	c.paste[r.Path] = ""
	c.Changed()
}

func (c *Monitoring) canUndo(r monRec) bool {
	_, ok := c.undo[r.Path]
	return ok
}

func (c *Monitoring) undoLabel(r monRec) string {
	n := len(c.undo[r.Path])
	switch n {
	case 0:
		return "Undo the paste (the record was empty)"
	case 1:
		return "Undo the paste: restore the 1 reading it replaced"
	}
	return fmt.Sprintf("Undo the paste: restore the %d readings it replaced", n)
}

func (c *Monitoring) undoPaste(r monRec) {
	old, ok := c.undo[r.Path]
	if !ok {
		return
	}
	c.F.ReplaceReadings(r.Kind, r.I, old)
	delete(c.undo, r.Path)
	c.Changed()
}

func (c *Monitoring) pasteHint(r monRec) string {
	return "Two columns copied from a spreadsheet: time (days after day 0, or a date) and " + r.Noun + " in " + r.Unit +
		". Tabs, semicolons or commas between columns; a header line is skipped."
}
