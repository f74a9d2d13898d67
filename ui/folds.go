package ui

import "strings"

// Folds. vugu rebuilds every component and re-sends every attribute on
// every render, so the bulky secondary sections (the tables by layer, the
// field records editor, the Asaoka plots) are built only while the user
// has them open. Their state lives here, in the Root, so that it outlives
// the components and Print report can open them all.
//
// A fold never hides a problem: the records editor opens by itself, and
// stays open, as soon as one of its inputs needs attention.

// folds says which folds the user opened.
type folds struct {
	tables  bool // results by layer
	records bool // field records editor
	asaoka  bool // Asaoka plots
}

func (c *Root) tablesOpen() bool { return c.fold.tables || c.printing }
func (c *Root) toggleTables()    { c.fold.tables = !c.fold.tables }

func (c *Root) asaokaOpen() bool { return c.fold.asaoka || c.printing }
func (c *Root) toggleAsaoka()    { c.fold.asaoka = !c.fold.asaoka }

// recordsOpen says whether the records editor shows: when unfolded, while
// printing, and while one of its inputs has a problem.
func (c *Root) recordsOpen() bool {
	return c.fold.records || c.printing || c.recordProblems()
}

// setRecordsOpen opens or closes the records editor; it stays open while
// a record needs attention.
func (c *Root) setRecordsOpen(open bool) { c.fold.records = open }

// recordProblems reports whether a problem concerns the field records.
func (c *Root) recordProblems() bool {
	if c.form == nil {
		return false
	}
	if len(c.form.ProblemsUnder("monitoring")) > 0 {
		return true
	}
	for _, p := range c.form.Other() {
		if p.Path == "monitoring" || strings.HasPrefix(p.Path, "monitoring.") {
			return true
		}
	}
	return false
}

// revealProblems unfolds the records editor for good once one of its
// inputs has a problem, so that it does not close under the user's hands
// when the problem is fixed.
func (c *Root) revealProblems() {
	if c.recordProblems() {
		c.fold.records = true
	}
}

// print prints the full report: it opens every fold, lets the page
// render, opens the browser's print dialogue and then folds the sections
// back as the user had them. It runs in a click handler, with the render
// lock held: the render that follows the handler draws the open folds,
// and the goroutine yields to the browser until it has.
func (c *Root) print() {
	if c.printing {
		return
	}
	c.printing = true
	if c.Env == nil { // tests: no render loop, the Host renders itself
		c.host().Yield()
		c.host().Print()
		c.printing = false
		return
	}
	go func() {
		// The page renders the click at once, in the click's own task,
		// or, soon after another render, in a task of its own
		// (wasm/coalesce.go) queued in the same turn as this goroutine's
		// first yield, perhaps after it: either way the second yield
		// returns after that render.
		c.host().Yield()
		c.host().Yield()
		c.host().Print() // returns when the dialogue closes
		c.Env.Lock()
		c.printing = false
		c.Env.UnlockRender()
	}()
}
