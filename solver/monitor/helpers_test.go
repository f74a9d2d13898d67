package monitor

import (
	"time"

	"porelight/solver"
)

// parseDate reads a file-format date, as package solver does.
func parseDate(s string) (time.Time, bool) {
	t, err := time.Parse(solver.DateLayout, s)
	return t, err == nil
}
