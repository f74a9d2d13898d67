package ui

import (
	"encoding/json"
	"fmt"
	"hash/fnv"
	"strings"
	"time"

	"github.com/vugu/vugu"

	"porelight/solver"
	"porelight/ui/units"
)

// The printout's running header: every page carries the title, the date
// printed, the program's version with a revision of the inputs the
// results belong to, and its page number. CSS gives these only through
// the @page margin boxes, whose text must be in the style sheet, so the
// page carries a small style element of its own (root.vugu).

// printStyle is the style sheet of the printed page's margins.
func (c *Root) printStyle() vugu.HTML {
	left := c.printTitle() + " · printed " + time.Now().Format("2006-01-02") + " · Porelight " + c.Version
	if rev := c.revision(); rev != "" {
		left += " · inputs rev. " + rev
	}
	if shown != units.SI {
		left += " · US customary units"
	}
	return vugu.HTML("@media print { @page { @top-left { content: " + cssString(left) +
		`; font: 8pt system-ui, sans-serif; } @top-right { content: "Page " counter(page) " of " counter(pages); font: 8pt system-ui, sans-serif; } } }`)
}

// revision names the inputs of the results shown: the first 8 hex digits
// of the FNV-1a hash of their JSON, so that two printouts of the same
// inputs carry the same revision. It is worked out once per solve.
func (c *Root) revision() string {
	if c.resultFor == nil {
		return ""
	}
	if c.rev.of != c.resultFor {
		data, err := json.Marshal(c.resultFor)
		if err != nil {
			return ""
		}
		h := fnv.New32a()
		h.Write(data)
		c.rev.of, c.rev.text = c.resultFor, fmt.Sprintf("%08x", h.Sum32())
	}
	return c.rev.text
}

// printRev is the revision of a model.
type printRev struct {
	of   *solver.Project
	text string
}

// cssString quotes s as a CSS string that cannot end the style element.
func cssString(s string) string {
	var b strings.Builder
	b.WriteByte('"')
	for _, r := range s {
		switch {
		case r == '"' || r == '\\':
			b.WriteByte('\\')
			b.WriteRune(r)
		case r == '<' || r == '>' || r == '&' || r < 0x20 || r == 0x7f:
			fmt.Fprintf(&b, "\\%x ", r)
		default:
			b.WriteRune(r)
		}
	}
	b.WriteByte('"')
	return b.String()
}

// usedIf is the data-used attribute of an input that is not a Field:
// what it stands for while empty, printed in its place; nil otherwise.
func usedIf(empty bool, what string) any {
	if empty && what != "" {
		return what
	}
	return nil
}
