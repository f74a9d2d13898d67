package ui

import "fmt"

// Keep is the panel above the editors that keeps work from being lost:
// the read-only view's bar, the question before replacing the project,
// the project to copy where a download may be blocked, and the list of
// problems with links to their inputs (keep.go).
type Keep struct {
	R *Root
}

func (c *Keep) items() []problemItem { return c.R.problemList() }

func (c *Keep) head() string {
	n := len(c.items())
	if n == 1 {
		return "1 input needs attention:"
	}
	return fmt.Sprintf("%d inputs need attention:", n)
}

func (c *Keep) shelfHead() string {
	n := len(c.R.shelfItems())
	if c.R.shelfOpen {
		return fmt.Sprintf("Recent projects in this browser (%d) ▾", n)
	}
	return fmt.Sprintf("Recent projects in this browser (%d) ▸", n)
}
