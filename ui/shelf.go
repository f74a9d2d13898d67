package ui

import (
	"sort"
	"strings"
	"time"

	"porelight/ui/form"
)

// The shelf: recent projects kept in the browser (IndexedDB, through the
// Host), so that the sections of one job can be switched between offline.
// A project goes on the shelf, under its title, when it is saved and when
// another replaces it (a file, the demo, a new project, a shelved one);
// the newest ShelfSize stay. Opening one from the shelf is a step Undo
// takes back.

// ShelfSize is the number of projects the shelf keeps.
const ShelfSize = 12

// ShelfEntry is one project on the shelf.
type ShelfEntry struct {
	Key   string `json:"key"`   // the title's file name (baseName)
	Title string `json:"title"` // as typed
	Saved string `json:"saved"` // when it was shelved, RFC 3339
	State string `json:"state"` // the draft, as the autosave writes it
}

// Shelf is a Host that keeps ShelfEntries in the browser. Each method
// returns at once; List answers later through done, from a browser
// callback, with the entries newest first (nil where the browser keeps
// none).
type Shelf interface {
	ShelfPut(e ShelfEntry)
	ShelfDelete(key string)
	ShelfList(done func([]ShelfEntry))
}

// shelve puts what the inputs show on the shelf.
func (c *Root) shelve() {
	s, ok := c.host().(Shelf)
	if !ok || c.view || c.hist.cur == "" {
		return
	}
	e := ShelfEntry{Key: baseName(c.form.Draft()), Title: c.printTitle(), Saved: c.clock().UTC().Format(time.RFC3339), State: c.hist.cur}
	s.ShelfPut(e)
	c.shelf = append([]ShelfEntry{e}, dropKey(c.shelf, e.Key)...)
	if len(c.shelf) > ShelfSize {
		for _, old := range c.shelf[ShelfSize:] {
			s.ShelfDelete(old.Key)
		}
		c.shelf = c.shelf[:ShelfSize]
	}
}

func dropKey(es []ShelfEntry, key string) []ShelfEntry {
	var out []ShelfEntry
	for _, e := range es {
		if e.Key != key {
			out = append(out, e)
		}
	}
	return out
}

// loadShelf asks the host for the shelf (at start).
func (c *Root) loadShelf() {
	s, ok := c.host().(Shelf)
	if !ok || c.view {
		return
	}
	s.ShelfList(func(es []ShelfEntry) {
		set := func() {
			sort.SliceStable(es, func(i, j int) bool { return es[i].Saved > es[j].Saved })
			c.shelf = es
		}
		if c.Env == nil {
			set()
			return
		}
		go func() {
			c.Env.Lock()
			set()
			c.Env.UnlockRender()
		}()
	})
}

// shelfItems are the shelved projects other than the one shown.
func (c *Root) shelfItems() []ShelfEntry {
	var out []ShelfEntry
	for _, e := range c.shelf {
		if e.State != c.hist.cur {
			out = append(out, e)
		}
	}
	return out
}

func (c *Root) toggleShelf() { c.shelfOpen = !c.shelfOpen }

// openShelved opens the shelved project with this key, shelving the one
// shown first.
func (c *Root) openShelved(key string) {
	for _, e := range c.shelf {
		if e.Key != key {
			continue
		}
		st, ps := form.ReadDraft([]byte(e.State))
		if ps != nil {
			c.note("error", "The shelved project “"+e.Title+"” could not be read: "+describeProblems(ps, 3))
			return
		}
		c.shelve()
		c.openState(st)
		c.markSaved()
		c.note("info", "Opened “"+e.Title+"” from the shelf; the project it replaced is on the shelf too, and Undo (Ctrl+Z) brings it back.")
		return
	}
}

// shelfLabel is an entry's line: its title and when it was shelved.
func shelfLabel(e ShelfEntry) string {
	t := strings.TrimSpace(e.Title)
	if at, err := time.Parse(time.RFC3339, e.Saved); err == nil {
		t += " · " + at.Local().Format("2 Jan 15:04")
	}
	return t
}
